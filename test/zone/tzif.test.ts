/**
 * The TZif reader (RFC 8536; RFC 9636 for version 4) and POSIX TZ strings (RFC 8536 section 3.3), against the
 * vendored IANA tz 2025b files, hand-made files, and fuzzed bytes.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CorruptTzifError, listTransitions, offsetSecondsFromEpochMs, zoneFromId, zoneFromTzif } from '../../src/zone/index.js';
import { parseTzif } from '../../src/zone/tzif.js';
import { parsePosixTz, posixTransitions } from '../../src/zone/posix.js';
import { KalendsSyntaxError } from '../../src/errors.js';
import { FIXTURE_ZONES, SEED, buildTzif, fixtureBytes, fixtureZone } from './helpers.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

describe('TZif reader: the vendored IANA files (tz 2025b)', () => {
  it('reads every fixture; versions as the files state (RFC 8536 section 3.1 header)', () => {
    for (const id of FIXTURE_ZONES) {
      const c = parseTzif(fixtureBytes(id));
      const versionByte = fixtureBytes(id)[4]!;
      expect(c.version, id).toBe(versionByte - 0x30);
      expect(c.types.length, id).toBeGreaterThan(0);
    }
    // America/Nuuk needs version 3: its footer has a negative transition time (RFC 8536 section 3.3.1).
    expect(parseTzif(fixtureBytes('America/Nuuk')).version).toBe(3);
  });

  it('parses the America/New_York footer as the Energy Policy Act of 2005 rule (sec. 110: 2nd Sunday of March to 1st Sunday of November, 2:00)', () => {
    const c = parseTzif(fixtureBytes('America/New_York'));
    expect(c.footer).toBe('EST5EDT,M3.2.0,M11.1.0');
    const d = c.footerRule!.daylight!;
    expect(c.footerRule!.standardOffsetSeconds).toBe(-5 * 3600);
    expect(d.offsetSeconds).toBe(-4 * 3600);
    expect(d.start).toEqual({ kind: 'month-week-day', month: 3, week: 2, weekday: 0 });
    expect(d.end).toEqual({ kind: 'month-week-day', month: 11, week: 1, weekday: 0 });
    expect(d.startTimeSeconds).toBe(7200);
    expect(d.endTimeSeconds).toBe(7200);
  });

  it('reads a version 1 file (32-bit data only, no footer) made from the New York fixture', () => {
    const v2 = fixtureBytes('America/New_York');
    const view = new DataView(v2.buffer, v2.byteOffset);
    const counts = [0, 1, 2, 3, 4, 5].map((i) => view.getUint32(20 + 4 * i));
    const [isut, isstd, leap, time, type, char] = counts as [number, number, number, number, number, number];
    const size = 44 + time * 5 + type * 6 + char + leap * 8 + isstd + isut;
    const v1 = v2.slice(0, size);
    v1[4] = 0;
    const c = parseTzif(v1);
    expect(c.version).toBe(1);
    expect(c.footer).toBe('');
    const z1 = zoneFromTzif(v1, 'v1');
    const z2 = fixtureZone('America/New_York');
    // The 32-bit table covers 1901-12-13 to 2038-01-19; inside it the two agree at every transition ±1 s.
    for (const t of listTransitions(z2, Date.UTC(1902, 0, 1), Date.UTC(2037, 0, 1))) {
      for (const dt of [-1000, 0, 1000]) expect(offsetSecondsFromEpochMs(z1, t.epochMs + dt)).toBe(offsetSecondsFromEpochMs(z2, t.epochMs + dt));
    }
  });

  it('converts leap-second files to POSIX time (right/America/New_York equals America/New_York at every transition ±1 s)', () => {
    const c = parseTzif(fixtureBytes('right/America/New_York'));
    // 27 leap seconds were inserted from 1972 to 2016 (IERS Bulletin C; the tz file "leapseconds").
    const real = c.leapSeconds.filter((l, i) => i === 0 || l.correction !== c.leapSeconds[i - 1]!.correction);
    expect(real.length).toBe(27);
    expect(real[real.length - 1]!.correction).toBe(27);
    const right = zoneFromTzif(fixtureBytes('right/America/New_York'), 'right');
    const plain = fixtureZone('America/New_York');
    // The right/ file has an empty footer and its table ends in 2026, so compare up to then.
    expect(c.footer).toBe('');
    const ts = listTransitions(plain, Date.UTC(1970, 0, 1), Date.UTC(2026, 0, 1));
    expect(ts.length).toBe(112);
    for (const t of ts) {
      for (const dt of [-1000, 0, 1000]) expect(offsetSecondsFromEpochMs(right, t.epochMs + dt)).toBe(offsetSecondsFromEpochMs(plain, t.epochMs + dt));
    }
  });

  const base = {
    times: [0, 15552000],
    typeIndexes: [1, 0],
    types: [
      { utoff: 3600, isdst: 0 as const, desig: 0 },
      { utoff: 7200, isdst: 1 as const, desig: 4 },
    ],
    chars: 'AAA\0BBB\0',
  };

  it('version 4: a leap-second table may start truncated and end with an expiry record (RFC 9636 section 3.2)', () => {
    const leaps = [
      { occurrence: 1000000000, correction: 25 },
      { occurrence: 1100000000, correction: 26 },
      { occurrence: 1200000000, correction: 26 },
    ];
    const v4 = buildTzif({ ...base, version: 4, leaps, footer: '<AAA>-1' });
    const c = parseTzif(v4);
    expect(c.version).toBe(4);
    expect(c.leapSeconds.length).toBe(3);
    // The same table in a version 3 file breaks the older rules: the first correction must be +1 or -1.
    expect(() => parseTzif(buildTzif({ ...base, version: 3, leaps, footer: '<AAA>-1' }))).toThrow(CorruptTzifError);
  });

  it('a hand-made version 2 file: table, then footer rule (RFC 8536 section 3.3)', () => {
    const z = zoneFromTzif(buildTzif({ ...base, version: 2, footer: 'AAA-1BBB,M3.5.0/1,M10.5.0' }), 'Hand/Made');
    // Before the first transition, local time type 0 applies (RFC 8536 section 3.2).
    expect(offsetSecondsFromEpochMs(z, -1)).toBe(3600);
    expect(offsetSecondsFromEpochMs(z, 0)).toBe(7200);
    expect(offsetSecondsFromEpochMs(z, 15552000 * 1000)).toBe(3600);
    // After the last transition the footer governs: daylight time from the last Sunday of March 1971 at 01:00
    // local standard time (00:00Z) to the last Sunday of October at 02:00 local daylight time (00:00Z).
    expect(offsetSecondsFromEpochMs(z, Date.UTC(1971, 2, 27, 23, 59, 59))).toBe(3600);
    expect(offsetSecondsFromEpochMs(z, Date.UTC(1971, 2, 28, 0))).toBe(7200);
    expect(offsetSecondsFromEpochMs(z, Date.UTC(1971, 9, 30, 23, 59, 59))).toBe(7200);
    expect(offsetSecondsFromEpochMs(z, Date.UTC(1971, 9, 31, 0))).toBe(3600);
  });
});

describe('TZif reader: corrupt bytes give CorruptTzifError (code corrupt-tzif), never a crash or hang', () => {
  const ny = fixtureBytes('America/New_York');
  const cases: [string, () => Uint8Array][] = [
    ['empty', () => new Uint8Array(0)],
    ['bad magic', () => Uint8Array.from([...ny.slice(0, 3), 0x58, ...ny.slice(4)])],
    ['truncated header', () => ny.slice(0, 30)],
    ['truncated data', () => ny.slice(0, 600)],
    ['no footer newline', () => ny.slice(0, ny.length - 1)],
    ['unknown version', () => Uint8Array.from([...ny.slice(0, 4), 0x39, ...ny.slice(5)])],
    ['typecnt zero', () => buildTzif({ version: 2, times: [], typeIndexes: [], types: [], chars: 'A\0' })],
    ['unsorted times', () => buildTzif({ version: 2, times: [100, 50], typeIndexes: [0, 0], types: [{ utoff: 0, isdst: 0, desig: 0 }], chars: 'AAA\0' })],
    ['type index out of range', () => buildTzif({ version: 2, times: [100], typeIndexes: [3], types: [{ utoff: 0, isdst: 0, desig: 0 }], chars: 'AAA\0' })],
    ['bad footer', () => buildTzif({ version: 2, times: [], typeIndexes: [], types: [{ utoff: 0, isdst: 0, desig: 0 }], chars: 'AAA\0', footer: 'EST5EDT' })],
    ['offset of 30 hours', () => buildTzif({ version: 2, times: [], typeIndexes: [], types: [{ utoff: 108000, isdst: 0, desig: 0 }], chars: 'AAA\0' })],
  ];
  for (const [name, make] of cases) {
    it(name, () => {
      let err: unknown;
      try {
        zoneFromTzif(make());
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(CorruptTzifError);
      expect(err).toBeInstanceOf(SyntaxError);
      expect((err as CorruptTzifError).code).toBe('corrupt-tzif');
      expect((err as CorruptTzifError).message).toMatch(/^bytes: corrupt TZif data at byte \d+/);
    });
  }

  it('fuzz: mutated and truncated fixtures either load (and answer) or throw CorruptTzifError', () => {
    const sources = ['America/New_York', 'America/Nuuk', 'Australia/Lord_Howe', 'Asia/Kolkata', 'right/America/New_York'].map(fixtureBytes);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: sources.length - 1 }),
        fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), { maxLength: 6 }),
        fc.option(fc.nat(), { nil: undefined }),
        (which, edits, cut) => {
          const src = sources[which]!;
          const bytes = src.slice(0, cut === undefined ? src.length : cut % (src.length + 1));
          for (const [at, v] of edits) if (bytes.length > 0) bytes[at % bytes.length] = v;
          try {
            const z = zoneFromTzif(bytes);
            for (const t of [Date.UTC(1900, 0, 1), 0, Date.UTC(2025, 6, 1), Date.UTC(2400, 0, 1)]) {
              expect(Number.isInteger(offsetSecondsFromEpochMs(z, t))).toBe(true);
            }
            listTransitions(z, Date.UTC(2020, 0, 1), Date.UTC(2030, 0, 1));
          } catch (e) {
            if (!(e instanceof CorruptTzifError)) throw e;
            expect(e.code).toBe('corrupt-tzif');
          }
        },
      ),
      { seed: SEED, numRuns: 1500 },
    );
  });

  it('fuzz: random bytes behind a valid magic', () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 0, maxLength: 200 }), fc.constantFrom(0, 0x32, 0x33, 0x34), (tail, v) => {
        const bytes = Uint8Array.from([0x54, 0x5a, 0x69, 0x66, v, ...tail]);
        try {
          zoneFromTzif(bytes);
        } catch (e) {
          if (!(e instanceof CorruptTzifError)) throw e;
        }
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });
});

describe('POSIX TZ strings (RFC 8536 section 3.3 and 3.3.1)', () => {
  it('RFC 8536 section 3.3.1 example "EST5EDT,0/0,J365/25": daylight time all year, no transitions', () => {
    const tz = parsePosixTz('EST5EDT,0/0,J365/25');
    const at: number[] = [];
    const after: number[] = [];
    const before = posixTransitions(tz, Date.UTC(2020, 0, 1), Date.UTC(2030, 0, 1), at, after);
    expect(before).toBe(-4 * 3600);
    expect(at).toEqual([]);
  });

  it('RFC 8536 section 3.3.1 example "IST-2IDT,M3.4.4/26,M10.5.0": 02:00 on the Friday after the 4th Thursday of March (from memory)', () => {
    const tz = parsePosixTz('IST-2IDT,M3.4.4/26,M10.5.0');
    const at: number[] = [];
    const after: number[] = [];
    posixTransitions(tz, Date.UTC(2012, 0, 1), Date.UTC(2013, 0, 1), at, after);
    // 2012: the 4th Thursday of March is the 22nd; 26:00 that day is Friday 23rd 02:00 local (+02:00) = 00:00Z.
    expect(at[0]).toBe(Date.UTC(2012, 2, 23, 0));
    expect(after[0]).toBe(3 * 3600);
  });

  it('Jn never counts February 29, n counts it (POSIX TZ rule forms)', () => {
    const j = parsePosixTz('AAA0BBB,J60/0,J300/0');
    const n = parsePosixTz('AAA0BBB,59/0,300/0');
    const aj: number[] = [];
    const an: number[] = [];
    posixTransitions(j, Date.UTC(2024, 0, 1), Date.UTC(2024, 6, 1), aj, []);
    posixTransitions(n, Date.UTC(2024, 0, 1), Date.UTC(2024, 6, 1), an, []);
    expect(aj[0]).toBe(Date.UTC(2024, 2, 1)); // J60 is March 1 in every year
    expect(an[0]).toBe(Date.UTC(2024, 1, 29)); // day 59 (zero-based) is February 29 in a leap year
  });

  it('quoted names and offsets with minutes and seconds', () => {
    expect(parsePosixTz('<+0530>-5:30').standardOffsetSeconds).toBe(19800);
    expect(parsePosixTz('<-03>3<-02>,M3.5.0/-2,M10.5.0/-1').daylight!.startTimeSeconds).toBe(-7200);
    expect(parsePosixTz('LMT-0:53:28').standardOffsetSeconds).toBe(3208);
  });

  for (const bad of ['', 'E5', 'EST', 'EST5EDT', 'EST5EDT,M3.2.0', 'EST5EDT,M13.1.0,M11.1.0', 'EST5EDT,M3.6.0,M11.1.0', 'EST5EDT,M3.2.7,M11.1.0', '<+05', 'EST25', 'EST5EDT,J0,J365', 'EST5EDT,M3.2.0/168,M11.1.0', 'EST5 ']) {
    it(`rejects ${JSON.stringify(bad)} with a position`, () => {
      expect(() => parsePosixTz(bad)).toThrow(KalendsSyntaxError);
    });
  }
});

describe('far future: Intl against the TZif footers (RFC 8536 section 3.3) in 2400 and 9999', () => {
  for (const id of FIXTURE_ZONES) {
    it(id, () => {
      const f = fixtureZone(id);
      const z = zoneFromId(id);
      for (const year of [2400, 9999]) {
        const a = listTransitions(f, Date.UTC(year, 0, 1), Date.UTC(year + 1, 0, 1));
        const b = listTransitions(z, Date.UTC(year, 0, 1), Date.UTC(year + 1, 0, 1));
        expect(b, `${id} ${year}`).toEqual(a);
        for (const m of [0, 3, 6, 9]) {
          const t = Date.UTC(year, m, 15, 12);
          expect(offsetSecondsFromEpochMs(z, t), `${id} ${year}-${m + 1}`).toBe(offsetSecondsFromEpochMs(f, t));
        }
      }
    });
  }

  it('a year past 2200 without changes means none later (Asia/Kolkata: no transition after 1945)', () => {
    expect(listTransitions('Asia/Kolkata', Date.UTC(1946, 0, 1), 8.64e15)).toEqual([]);
    expect(dayNumberFromYmd(9999, 1, 1)).toBeGreaterThan(0);
  });
});

/**
 * Input rules of the zone layer (docs/design.md, "Input rules"): bulk inputs read once, whatever their length;
 * options objects and enum values checked; fractional instants with one meaning; the zoned day range of
 * bounds.ts; the offset sign; and the one vocabulary of gaps and overlaps. Reference values come from
 * temporal-polyfill and @js-temporal/polyfill (which read the runtime's Intl, as the zone layer does), from the
 * IANA tz database (the zone and rule lines named beside each check), and from ECMA-262 Date.UTC.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { Temporal as JsTemporal } from '@js-temporal/polyfill';
import {
  UnknownZoneError,
  dayNumberFromEpochMs,
  dayNumberFromEpochMsBulk,
  epochMsFromWallMs,
  firstEpochMsOfDayNumber,
  lengthMsOfDayNumber,
  listTransitions,
  nextTransition,
  offsetSecondsFromEpochMs,
  previousTransition,
  resolveWallMs,
  toZone,
  wallFieldsFromEpochMs,
  wallMsFromEpochMs,
  wallMsFromEpochMsBulk,
  zoneFromId,
  zoneFromOffset,
  zoneFromRules,
  zoneFromTzif,
} from '../../src/zone/index.js';
import { ordinalFromEpochMsBulk } from '../../src/period/index.js';
import { dayNumberFromYmd, weekdayOfDayNumber } from '../../src/civil/index.js';
import { suggestZoneIds } from '../../src/zone/intl.js';
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MAX_ZONED_DAY_NUMBER, MIN_DAY_NUMBER, MIN_EPOCH_MS, MIN_ZONED_DAY_NUMBER } from '../../src/bounds.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';
import { fixtureBytes, SEED } from './helpers.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

function thrown(f: () => unknown): Error & { code?: string; path?: string; position?: number } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

describe('bulk inputs: non-numbers in plain arrays, whatever the length', () => {
  const t = Date.UTC(2025, 0, 15, 12);
  const bulk: readonly [string, (xs: unknown[]) => unknown][] = [
    ['dayNumberFromEpochMsBulk', (xs) => dayNumberFromEpochMsBulk('America/New_York', xs as number[])],
    ['wallMsFromEpochMsBulk', (xs) => wallMsFromEpochMsBulk('America/New_York', xs as number[])],
    ['ordinalFromEpochMsBulk', (xs) => ordinalFromEpochMsBulk('month', 'America/New_York', xs as number[])],
    ['dayNumberFromEpochMsBulk (fixed offset)', (xs) => dayNumberFromEpochMsBulk('+05:30', xs as number[])],
  ];

  it('the issue 12 reproduction: 2,047 and 2,048 numeric strings are both refused at index 0', () => {
    for (const n of [2047, 2048]) {
      const e = thrown(() => ordinalFromEpochMsBulk('month', 'America/New_York', Array(n).fill(String(t))));
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e.message).toMatch(/^epochMs\[0\]: expected a number, got "1736942400000"/);
    }
  });

  for (const [name, f] of bulk) {
    for (const [what, bad] of [['a numeric string', String(t)], ['a Date', new Date(t)], ['null', null], ['true', true]] as const) {
      it(`${name} refuses ${what} at the last index of 5, 2,047, 2,048 and 5,000 elements`, () => {
        for (const n of [5, 2047, 2048, 5000]) {
          const xs: unknown[] = new Array(n).fill(t);
          xs[n - 1] = bad;
          const e = thrown(() => f(xs));
          expect(e).toBeInstanceOf(KalendsTypeError);
          expect(e.code).toBe('invalid-type');
          expect(e.message.startsWith(`epochMs[${n - 1}]: expected a number`)).toBe(true);
        }
      });
    }
  }

  it('a hole is named; typed arrays are read as they are', () => {
    // eslint-disable-next-line no-sparse-arrays
    expect(thrown(() => dayNumberFromEpochMsBulk('UTC', [0, , 1] as number[])).message).toContain('epochMs[1]: expected a number, got a hole');
    expect([...dayNumberFromEpochMsBulk('UTC', Float32Array.of(-1))]).toEqual([-1]);
    expect([...dayNumberFromEpochMsBulk('UTC', Int32Array.of(DAY))]).toEqual([1]);
  });

  it('options: null, unknown keys and foreign policies are refused', () => {
    expect(thrown(() => dayNumberFromEpochMsBulk('UTC', [0], undefined, null as never))).toBeInstanceOf(KalendsTypeError);
    const e = thrown(() => dayNumberFromEpochMsBulk('UTC', [0], undefined, { invalid: 'sentinal' } as never));
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect(e.code).toBe('unknown-name');
    expect(e.message).toContain('did you mean "sentinel"?');
    expect(thrown(() => wallMsFromEpochMsBulk('UTC', [0], undefined, { invalidd: 'throw' } as never)).message).toMatch(/^options\.invalidd: unknown option; did you mean "invalid"\?/);
    expect(thrown(() => ordinalFromEpochMsBulk('month', 'UTC', [0], undefined, { invalid: true } as never))).toBeInstanceOf(KalendsTypeError);
  });
});

describe('options objects of the zone functions', () => {
  it('null options are a KalendsTypeError (listTransitions, zoneFromId, zoneFromTzif)', () => {
    for (const f of [
      () => listTransitions('UTC', 0, 1, null as never),
      () => zoneFromId('UTC', null as never),
      () => zoneFromTzif(fixtureBytes('Europe/London'), 'Europe/London', null as never),
    ]) {
      const e = thrown(f);
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e.message).toMatch(/^options: expected an options object or undefined, got null/);
    }
  });

  it('unknown keys are named with the nearest valid one', () => {
    const e = thrown(() => listTransitions('UTC', 0, 1, { limt: 5 } as never));
    expect(e.code).toBe('unknown-name');
    expect(e.message).toMatch(/^options\.limt: unknown option; did you mean "limit"\?/);
    expect(thrown(() => zoneFromId('UTC', { sources: 1 } as never)).message).toContain('did you mean "source"?');
  });

  it('option values are checked', () => {
    expect(thrown(() => listTransitions('UTC', 0, 1, { limit: '5' } as never)).message).toContain('pass the number 5');
    expect(thrown(() => listTransitions('UTC', 0, 1, { limit: 0 })).code).toBe('out-of-range');
    expect(thrown(() => zoneFromId('Europe/Paris', { source: {} } as never)).message).toMatch(/^options\.source: expected a zone rules source/);
  });

  it('a rules source brings its compiler (zoneFromRules), and what that returns is checked', () => {
    // The rules are this test's own data (one fixed offset, no transitions): the check is the contract of
    // ZoneRulesSource (src/zone/zone.ts), not a fact about a real zone.
    const rulesOf = (id: string) => (id === 'Example/Fixed' ? { id, initialOffsetSeconds: 3600, transitionsSeconds: [], offsetsSeconds: [] } : undefined);
    const source = { tzRelease: 'example', ids: ['Example/Fixed'], rulesOf, zoneFromRules };
    const z = zoneFromId('example/fixed', { source });
    expect([z.id, z.source, z.tzRelease, offsetSecondsFromEpochMs(z, 0)]).toEqual(['Example/Fixed', 'tzif', 'example', 3600]);
    const without = thrown(() => zoneFromId('Example/Fixed', { source: { tzRelease: 'example', ids: ['Example/Fixed'], rulesOf } } as never));
    expect(without.message).toMatch(/^options\.source: expected a zone rules source \{ tzRelease, ids, rulesOf, zoneFromRules \}/);
    expect(without.code).toBe('invalid-type');
    const wrong = thrown(() => zoneFromId('Example/Fixed', { source: { ...source, zoneFromRules: () => ({ id: 'Example/Fixed' }) } } as never));
    expect(wrong.message).toMatch(/^options\.source\.zoneFromRules: expected a function that returns a Zone .*, got an object/);
    expect(wrong).toBeInstanceOf(KalendsTypeError);
  });

  it('an instant given as text names the parser', () => {
    expect(thrown(() => offsetSecondsFromEpochMs('UTC', '2025-01-01T00:00Z' as never)).message).toContain('parseInstant(text).epochMs');
    expect(thrown(() => resolveWallMs('UTC', '2025-01-01T00:00' as never)).message).toContain('parsePlainDateTime(text)');
    expect(thrown(() => firstEpochMsOfDayNumber('UTC', '2025-01-01' as never)).message).toContain('parsePlainDate(text)');
  });
});

describe('fractional instants: the instant lies within millisecond Math.floor(t) (docs/design.md, "Input rules")', () => {
  /** temporal-polyfill's view of a fractional instant, exactly, from nanoseconds. */
  const temporalAt = (t: number, zone: string) => {
    const ns = BigInt(Math.floor(t)) * 1_000_000n + BigInt(Math.round((t - Math.floor(t)) * 1e6));
    return Temporal.Instant.fromEpochNanoseconds(ns).toZonedDateTimeISO(zone);
  };
  const dayOf = (z: Temporal.ZonedDateTime) => dayNumberFromYmd(z.year, z.month, z.day);

  it('-0.5 is on 1969-12-31 in UTC, and its fields are those of millisecond -1', () => {
    expect(dayNumberFromEpochMs('UTC', -0.5)).toBe(-1);
    expect(dayOf(temporalAt(-0.5, 'UTC'))).toBe(-1);
    expect(wallMsFromEpochMs('UTC', -0.5)).toBe(-0.5);
    const f = wallFieldsFromEpochMs('UTC', -0.5);
    expect([f.year, f.month, f.day, f.hour, f.minute, f.second, f.millisecond]).toEqual([1969, 12, 31, 23, 59, 59, 999]);
    expect([...dayNumberFromEpochMsBulk('UTC', Float64Array.of(-0.5, 0.5))]).toEqual([-1, 0]);
    expect([...dayNumberFromEpochMsBulk('America/New_York', Float64Array.of(-0.5))]).toEqual([-1]);
  });

  it('next to a transition: the offset of the millisecond that holds the instant (America/New_York, 2025-03-09 07:00Z)', () => {
    const tr = Date.UTC(2025, 2, 9, 7); // Energy Policy Act of 2005 sec. 110: second Sunday of March, 02:00 local
    expect(offsetSecondsFromEpochMs('America/New_York', tr - 0.5)).toBe(-5 * 3600);
    expect(offsetSecondsFromEpochMs('America/New_York', tr + 0.5)).toBe(-4 * 3600);
    expect(temporalAt(tr - 0.5, 'America/New_York').offsetNanoseconds / 1e9).toBe(-5 * 3600);
    expect(wallMsFromEpochMs('America/New_York', tr - 0.5)).toBe(Date.UTC(2025, 2, 9, 2) - 0.5);
    expect(nextTransition('America/New_York', tr - 0.5)?.epochMs).toBe(tr);
    expect(nextTransition('America/New_York', tr + 0.5)?.epochMs).not.toBe(tr);
    expect(previousTransition('America/New_York', tr + 0.5)?.epochMs).not.toBe(tr); // millisecond tr holds it: not strictly before
    expect(previousTransition('America/New_York', tr + 1)?.epochMs).toBe(tr);
    expect(listTransitions('America/New_York', tr + 0.5, tr + 1).map((x) => x.epochMs)).toEqual([tr]);
    expect(listTransitions('America/New_York', tr - 0.5, tr).map((x) => x.epochMs)).toEqual([]);
    // In bulk, with a table (more than 2,048 elements) and without.
    for (const n of [3, 3000]) {
      const xs = new Float64Array(n).fill(tr - 0.5);
      xs[1] = tr + 0.5;
      const wall = wallMsFromEpochMsBulk('America/New_York', xs);
      expect([wall[0], wall[1]]).toEqual([tr - 0.5 - 5 * HOUR, tr + 0.5 - 4 * HOUR]);
    }
  });

  it('next to local midnight: the day of the millisecond that holds the instant', () => {
    const midnight = Date.UTC(2025, 6, 1, 4); // 2025-07-01T00:00-04:00
    for (const t of [midnight - 0.25, midnight + 0.25]) {
      const expected = dayOf(temporalAt(t, 'America/New_York'));
      expect(dayNumberFromEpochMs('America/New_York', t)).toBe(expected);
      expect(dayNumberFromEpochMsBulk('America/New_York', new Float64Array(3000).fill(t))[2999]).toBe(expected);
    }
  });

  it('agrees with temporal-polyfill on random fractional instants (property)', () => {
    const zones = ['America/New_York', 'Europe/Dublin', 'Australia/Lord_Howe', 'Asia/Kathmandu'];
    fc.assert(
      fc.property(fc.integer({ min: -4e12, max: 4e12 }), fc.constantFrom(0.25, 0.5, 0.75), fc.constantFrom(...zones), (ms, frac, zone) => {
        const t = ms + frac;
        const z = temporalAt(t, zone);
        expect(offsetSecondsFromEpochMs(zone, t)).toBe(z.offsetNanoseconds / 1e9);
        expect(dayNumberFromEpochMs(zone, t)).toBe(dayOf(z));
        expect(wallMsFromEpochMs(zone, t)).toBe(t + z.offsetNanoseconds / 1e6);
        expect(wallFieldsFromEpochMs(zone, t).millisecond).toBe(z.millisecond);
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  it('a fractional wall time keeps its fraction in the instant (checked against @js-temporal/polyfill disambiguation)', () => {
    const wall = Date.UTC(2025, 10, 2, 1, 30) + 0.5; // 01:30 on 2025-11-02 happened twice in New York
    const pdt = JsTemporal.PlainDateTime.from('2025-11-02T01:30');
    for (const d of ['earlier', 'later'] as const) {
      const ref = pdt.toZonedDateTime('America/New_York', { disambiguation: d }).epochMilliseconds;
      expect(epochMsFromWallMs('America/New_York', wall, d)).toBe(ref + 0.5);
    }
  });
});

describe('one vocabulary for gaps and overlaps (checked against @js-temporal/polyfill)', () => {
  it('a gap and an overlap name the transition, the offsets before and after it, and the wall range', () => {
    const gap = resolveWallMs('America/New_York', Date.UTC(2025, 2, 9, 2, 30));
    const overlap = resolveWallMs('America/New_York', Date.UTC(2025, 10, 2, 1, 30));
    if (gap.kind !== 'gap' || overlap.kind !== 'overlap') throw new Error('expected a gap and an overlap');
    const shared = ['endWallMs', 'kind', 'offsetAfterSeconds', 'offsetBeforeSeconds', 'startWallMs', 'transitionEpochMs'];
    expect(Object.keys(gap).sort()).toEqual(shared);
    expect(Object.keys(overlap).sort()).toEqual([...shared, 'epochMsAfterTransition', 'epochMsBeforeTransition'].sort());
    // The transitions: 2025-03-09 07:00Z and 2025-11-02 06:00Z (tz Rule US 2007 max Mar Sun>=8 2:00 / Nov Sun>=1 2:00).
    expect([gap.transitionEpochMs, gap.offsetBeforeSeconds, gap.offsetAfterSeconds]).toEqual([Date.UTC(2025, 2, 9, 7), -18000, -14400]);
    expect([gap.startWallMs, gap.endWallMs]).toEqual([Date.UTC(2025, 2, 9, 2), Date.UTC(2025, 2, 9, 3)]);
    expect([overlap.transitionEpochMs, overlap.offsetBeforeSeconds, overlap.offsetAfterSeconds]).toEqual([Date.UTC(2025, 10, 2, 6), -14400, -18000]);
    expect([overlap.startWallMs, overlap.endWallMs]).toEqual([Date.UTC(2025, 10, 2, 1), Date.UTC(2025, 10, 2, 2)]);
    const pdt = JsTemporal.PlainDateTime.from('2025-11-02T01:30');
    expect(overlap.epochMsBeforeTransition).toBe(pdt.toZonedDateTime('America/New_York', { disambiguation: 'earlier' }).epochMilliseconds);
    expect(overlap.epochMsAfterTransition).toBe(pdt.toZonedDateTime('America/New_York', { disambiguation: 'later' }).epochMilliseconds);
    // The transition is the one listTransitions reports, with the same offsets.
    const [t] = listTransitions('America/New_York', Date.UTC(2025, 10, 1), Date.UTC(2025, 10, 3));
    expect(t).toEqual({ epochMs: overlap.transitionEpochMs, offsetBeforeSeconds: overlap.offsetBeforeSeconds, offsetAfterSeconds: overlap.offsetAfterSeconds });
  });
});

describe('the zoned day range (bounds.ts): every civil day and the partial periods at the ends', () => {
  it('accepts MIN_ZONED_DAY_NUMBER..MAX_ZONED_DAY_NUMBER, a range wider than the civil one', () => {
    expect(MIN_ZONED_DAY_NUMBER).toBeLessThan(MIN_DAY_NUMBER);
    expect(MAX_ZONED_DAY_NUMBER).toBeGreaterThan(MAX_DAY_NUMBER);
    for (const d of [MIN_ZONED_DAY_NUMBER, MIN_DAY_NUMBER, -100_000_000, 99_999_999, MAX_DAY_NUMBER, MAX_DAY_NUMBER + 1, MAX_ZONED_DAY_NUMBER]) {
      expect(firstEpochMsOfDayNumber('UTC', d)).toBe(d * DAY);
      expect(firstEpochMsOfDayNumber('+05:30', d)).toBe(d * DAY - 5.5 * HOUR);
    }
    expect(thrown(() => firstEpochMsOfDayNumber('UTC', MIN_ZONED_DAY_NUMBER - 1)).code).toBe('out-of-range');
    expect(thrown(() => firstEpochMsOfDayNumber('UTC', MAX_ZONED_DAY_NUMBER + 1)).code).toBe('out-of-range');
    expect(lengthMsOfDayNumber('UTC', MAX_ZONED_DAY_NUMBER - 1)).toBe(DAY);
  });

  it('before the instant range: the zone offset at its start (New York local mean time, -4:56:02 in the tz Zone line)', () => {
    expect(offsetSecondsFromEpochMs('America/New_York', MIN_EPOCH_MS)).toBe(-(4 * 3600 + 56 * 60 + 2));
    expect(firstEpochMsOfDayNumber('America/New_York', MIN_DAY_NUMBER)).toBe(MIN_DAY_NUMBER * DAY + (4 * 3600 + 56 * 60 + 2) * 1000);
    expect(lengthMsOfDayNumber('America/New_York', MIN_DAY_NUMBER)).toBe(DAY);
  });

  it('after the instant range: the yearly rules go on (Australia/Sydney, tz Rule AN 2008 max Oct Sun>=1 2:00s)', () => {
    // The first Sunday of October 275760 falls after +275760-09-13, the end of the instant range.
    const oct1 = dayNumberFromYmd(275760, 10, 1);
    const sunday = oct1 + ((7 - weekdayOfDayNumber(oct1)) % 7);
    expect(sunday * DAY).toBeGreaterThan(MAX_EPOCH_MS);
    expect(lengthMsOfDayNumber('Australia/Sydney', sunday)).toBe(23 * HOUR);
    expect(lengthMsOfDayNumber('Australia/Sydney', sunday + 7)).toBe(DAY);
    expect(firstEpochMsOfDayNumber('Australia/Sydney', sunday + 1)).toBe((sunday + 1) * DAY - 11 * HOUR);
    // The same through pinned-style rules data (a TZif file with its POSIX footer).
    const sydney = zoneFromTzif(fixtureBytes('Australia/Lord_Howe'), 'Australia/Lord_Howe');
    expect(lengthMsOfDayNumber(sydney, sunday)).toBe(23.5 * HOUR); // Lord Howe: half-hour DST, same Sunday (Rule LH)
  });
});

describe('offset ids and the minus sign', () => {
  it('U+2212 is refused with the fix, as RFC 3339 section 5.6 and both Temporal polyfills refuse it', () => {
    expect(() => Temporal.Now.zonedDateTimeISO('\u221205:00')).toThrow(RangeError);
    for (const f of [() => zoneFromOffset('\u221205:00'), () => zoneFromId('\u221205:00'), () => toZone('\u221205:00')]) {
      const e = thrown(f);
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      expect(e.message).toContain('write the ASCII hyphen-minus');
    }
    expect(zoneFromOffset('-05:00').fixedOffsetSeconds).toBe(-18000);
  });
});

describe('zone id suggestions through the kit', () => {
  it('ignore case, rank by city, and stay bounded for long input', () => {
    expect(suggestZoneIds('europe/londn', ['Europe/London', 'Europe/Lisbon'])).toEqual(['Europe/London']);
    expect((thrown(() => zoneFromId('Europe/Pariss')) as UnknownZoneError).suggestions).toContain('Europe/Paris');
    expect(suggestZoneIds('x'.repeat(10_000), ['Europe/London'])).toEqual([]);
  });
});

/**
 * Ids, fixed offsets, the cache, and bad input: each bad value gets a typed error (docs/design.md, "Errors") that
 * names the parameter and quotes the value.
 */
import { describe, expect, it } from 'vitest';
import {
  UTC_ZONE,
  UnknownZoneError,
  WallTimeRejectedError,
  clearZoneCache,
  lengthMsOfDayNumber,
  dayNumberFromEpochMs,
  epochMsFromWallFields,
  epochMsFromWallMs,
  listTransitions,
  listZoneIds,
  offsetSecondsFromEpochMs,
  toZone,
  wallMsFromEpochMs,
  zoneFromId,
  zoneFromOffset,
  zoneFromRules,
} from '../../src/zone/index.js';
import { zoneCacheSize } from '../../src/zone/zone.js';
import { MAX_ZONED_DAY_NUMBER, ZONE_CACHE_LIMIT } from '../../src/bounds.js';
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';

function thrown(f: () => unknown): Error & { code?: string } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

describe('zone ids (ECMA-402 resolvedOptions().timeZone and supportedValuesOf)', () => {
  it('validates, case-normalizes and canonicalizes as the runtime does', () => {
    expect(zoneFromId('europe/dublin').id).toBe('Europe/Dublin');
    expect(zoneFromId('America/New_York').canonicalId).toBe('America/New_York');
    // A link resolves to the runtime's canonical id (Node 20 / ICU: US/Eastern -> America/New_York).
    expect(zoneFromId('US/Eastern').canonicalId).toBe(new Intl.DateTimeFormat('en', { timeZone: 'US/Eastern' }).resolvedOptions().timeZone);
    expect(zoneFromId('US/Eastern').id).toBe('US/Eastern');
    expect(zoneFromId('Etc/UTC').fixedOffsetSeconds).toBe(0);
    expect(zoneFromId('utc')).toBe(UTC_ZONE);
    expect(listZoneIds()).toContain('UTC');
    expect(listZoneIds().length).toBeGreaterThan(300);
  });

  it('an unknown id is an UnknownZoneError quoting it, with the closest valid ids', () => {
    const e = thrown(() => zoneFromId('Europe/Londn')) as UnknownZoneError;
    expect(e).toBeInstanceOf(UnknownZoneError);
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect(e.code).toBe('unknown-zone');
    expect(e.message).toContain('"Europe/Londn"');
    expect(e.suggestions[0]).toBe('Europe/London');
    expect((thrown(() => zoneFromId('America/Sao Paulo')) as UnknownZoneError).suggestions).toContain('America/Sao_Paulo');
    expect((thrown(() => offsetSecondsFromEpochMs('Mars/Olympus_Mons', 0)) as UnknownZoneError).message).toMatch(/^zone: unknown time zone "Mars\/Olympus_Mons"/);
    for (const notAPlace of ['Factory', 'localtime', 'posixrules', '', 'Europe/']) expect(thrown(() => zoneFromId(notAPlace)).code).toBe('unknown-zone');
    expect(thrown(() => zoneFromId(42 as unknown as string))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => toZone({} as unknown as string))).toBeInstanceOf(KalendsTypeError);
  });

  it('the cache is bounded (ZONE_CACHE_LIMIT entries, least recently used dropped first) and shares compiled rules', () => {
    clearZoneCache();
    const ids = listZoneIds().slice(0, ZONE_CACHE_LIMIT + 20);
    for (const id of ids) toZone(id);
    expect(zoneCacheSize()).toBeLessThanOrEqual(ZONE_CACHE_LIMIT);
    expect(toZone('Asia/Tokyo')).toBe(toZone('Asia/Tokyo'));
    expect(offsetSecondsFromEpochMs(zoneFromId('US/Pacific'), Date.UTC(2025, 0, 1))).toBe(offsetSecondsFromEpochMs('America/Los_Angeles', Date.UTC(2025, 0, 1)));
  });
});

describe('fixed offsets (RFC 9557 / ISO 8601 UTC offsets)', () => {
  it('accepts ±HH, ±HH:MM, ±HHMM, ±HH:MM:SS and seconds east of UTC', () => {
    expect(zoneFromOffset('+05:30').fixedOffsetSeconds).toBe(19800);
    expect(zoneFromOffset('-08').id).toBe('-08:00');
    expect(zoneFromOffset('+0545').id).toBe('+05:45');
    expect(zoneFromOffset('+05:21:10').id).toBe('+05:21:10');
    expect(zoneFromOffset('-00:00').id).toBe('+00:00');
    expect(Object.is(zoneFromOffset('-00:00').fixedOffsetSeconds, 0)).toBe(true);
    expect(zoneFromOffset(-18000).id).toBe('-05:00');
    expect(zoneFromId('+01:00').fixedOffsetSeconds).toBe(3600);
    expect(wallMsFromEpochMs('-03:30', 0)).toBe(-3.5 * 3_600_000);
  });
  for (const bad of ['05:30', '+5:30', '+05:3', '+05:30:', '+24:00', '+05:60', 'UTC+1', '+05:30Z', '']) {
    it(`rejects ${JSON.stringify(bad)}`, () => {
      const e = thrown(() => zoneFromOffset(bad));
      expect(e instanceof KalendsSyntaxError || e instanceof KalendsRangeError).toBe(true);
      expect(e.message).toContain(JSON.stringify(bad));
    });
  }
  it('rejects offsets of 24 hours or more and fractions of a second', () => {
    expect(thrown(() => zoneFromOffset(86_400)).code).toBe('out-of-range');
    expect(thrown(() => zoneFromOffset(1.5)).code).toBe('out-of-range');
  });
});

describe('bad instants, wall times and fields', () => {
  for (const bad of [NaN, Infinity, -Infinity, 8.64e15 + 1]) {
    it(`scalar calls reject ${bad}`, () => {
      for (const f of [() => offsetSecondsFromEpochMs('Europe/Dublin', bad), () => dayNumberFromEpochMs('UTC', bad), () => wallMsFromEpochMs('Asia/Kolkata', bad)]) {
        const e = thrown(f);
        expect(e).toBeInstanceOf(KalendsRangeError);
        expect(e.message).toMatch(/^epochMs: expected epoch milliseconds from -8640000000000000 to 8640000000000000, got /);
      }
      expect(thrown(() => epochMsFromWallMs('UTC', bad))).toBeInstanceOf(KalendsRangeError);
    });
  }

  it('a string where a number belongs is a KalendsTypeError', () => {
    expect(thrown(() => offsetSecondsFromEpochMs('UTC', '0' as unknown as number))).toBeInstanceOf(KalendsTypeError);
  });

  it('local fields out of range name the field', () => {
    expect(thrown(() => epochMsFromWallFields('UTC', { year: 2025, month: 13, day: 1 })).message).toMatch(/^fields\.month: expected an integer from 1 to 12, got 13/);
    expect(thrown(() => epochMsFromWallFields('UTC', { year: 2025, month: 2, day: 29 })).message).toMatch(/^fields\.day: expected an integer from 1 to 28, got 29/);
    expect(thrown(() => epochMsFromWallFields('UTC', { year: 2025, month: 1, day: 1, hour: 24 })).message).toMatch(/^fields\.hour/);
    expect(thrown(() => epochMsFromWallFields('UTC', { year: 2025, month: 1, day: 1, millisecond: 1000 })).message).toMatch(/^fields\.millisecond/);
    expect(epochMsFromWallFields('Europe/London', { year: 2025, month: 7, day: 1, hour: 9 })).toBe(Date.UTC(2025, 6, 1, 8));
  });

  it("disambiguation 'reject' names the gap or the overlap (codes skipped-time, repeated-time)", () => {
    const gap = thrown(() => epochMsFromWallMs('America/New_York', Date.UTC(2025, 2, 9, 2, 30), 'reject')) as WallTimeRejectedError;
    expect(gap).toBeInstanceOf(WallTimeRejectedError);
    expect([gap.code, gap.kind]).toEqual(['skipped-time', 'gap']);
    expect(gap.message).toContain('2025-03-09T02:30:00 does not exist in America/New_York');
    const overlap = thrown(() => epochMsFromWallMs('America/New_York', Date.UTC(2025, 10, 2, 1, 30), 'reject')) as WallTimeRejectedError;
    expect([overlap.code, overlap.kind]).toEqual(['repeated-time', 'overlap']);
    expect(overlap.message).toContain('happened twice');
    const latest = thrown(() => epochMsFromWallMs('UTC', 0, 'latest' as 'later'));
    expect(latest.message).toMatch(/^disambiguation: expected one of "compatible", "earlier", "later", "reject", got "latest"; did you mean "later"\?/);
    expect(latest.code).toBe('unknown-name');
  });

  it('day numbers outside the zoned day range (bounds.ts) are rejected', () => {
    expect(thrown(() => lengthMsOfDayNumber('UTC', MAX_ZONED_DAY_NUMBER)).code).toBe('out-of-range');
    expect(thrown(() => lengthMsOfDayNumber('UTC', 1.5)).code).toBe('out-of-range');
  });

  it('listTransitions over an unbounded span of a periodic Intl zone stops with limit-exceeded', () => {
    expect(thrown(() => listTransitions('America/New_York', Date.UTC(2000, 0, 1), 8.64e15)).code).toBe('limit-exceeded');
    expect(thrown(() => listTransitions('America/New_York', 0, Date.UTC(2100, 0, 1), { limit: 10 })).code).toBe('limit-exceeded');
    expect(listTransitions('Asia/Kolkata', Date.UTC(1946, 0, 1), 8.64e15)).toEqual([]);
  });
});

describe('rules data (zoneFromRules): every fault with its path', () => {
  it('collects the faults into one DefinitionError', () => {
    const e = thrown(() =>
      zoneFromRules({ id: '', initialOffsetSeconds: 90000, transitionsSeconds: [10, 5], offsetsSeconds: [0], tailRule: 'EST5EDT' }),
    ) as DefinitionError;
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e.issues.map((i) => i.path)).toEqual(['id', 'initialOffsetSeconds', 'offsetsSeconds', 'transitionsSeconds[1]', 'tailRule']);
  });
  it('valid data works, with a POSIX tail', () => {
    const z = zoneFromRules({ id: 'Example/Rules', initialOffsetSeconds: 3600, transitionsSeconds: [0], offsetsSeconds: [7200], tailRule: 'AAA-2' });
    expect(offsetSecondsFromEpochMs(z, -1)).toBe(3600);
    expect(offsetSecondsFromEpochMs(z, Date.UTC(3000, 0, 1))).toBe(7200);
  });
});

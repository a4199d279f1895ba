/**
 * Properties of shared/DESIGN.md ("zone: for every instant, converting to local time and back with the matching
 * offset gives the same instant; offsets change only at listed transitions") and bulk == scalar, with
 * fast-check (fixed seed).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  INVALID_DAY_NUMBER,
  dayNumberFromEpochMs,
  dayNumberFromEpochMsBulk,
  firstEpochMsOfDayNumber,
  epochMsFromWallMs,
  listTransitions,
  offsetSecondsFromEpochMs,
  resolveWallMs,
  wallMsFromEpochMs,
  wallMsFromEpochMsBulk,
  zoneFromId,
  zoneFromOffset,
} from '../../src/zone/index.js';
import { KalendsRangeError as KalendsRangeErrorForTest } from '../../src/errors.js';
import { FIXTURE_ZONES, SEED, fixtureZone } from './helpers.js';

const intlZones = [...FIXTURE_ZONES, 'UTC', '+05:30'].map((id) => zoneFromId(id));
const tzifZones = FIXTURE_ZONES.map(fixtureZone);
const zones = [...intlZones, ...tzifZones];
const anyZone = fc.integer({ min: 0, max: zones.length - 1 }).map((i) => zones[i]!);
const instant = fc.integer({ min: Date.UTC(1850, 0, 1), max: Date.UTC(2150, 0, 1) });

describe('round trip: instant -> local -> instant', () => {
  it('the instant is among the instants of its wall time, and the matching offset gives it back', () => {
    fc.assert(
      fc.property(anyZone, instant, (z, t) => {
        const wall = wallMsFromEpochMs(z, t);
        expect(wall - offsetSecondsFromEpochMs(z, t) * 1000).toBe(t);
        const r = resolveWallMs(z, wall);
        if (r.kind === 'unique') expect(r.epochMs).toBe(t);
        else if (r.kind === 'overlap') expect([r.epochMsBeforeTransition, r.epochMsAfterTransition]).toContain(t);
        else throw new Error(`a wall time that happened cannot fall in a gap (${z.id} ${t})`);
        const back = [epochMsFromWallMs(z, wall, 'earlier'), epochMsFromWallMs(z, wall, 'later')];
        expect(back).toContain(t);
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('the day of an instant starts at or before it, and the next day starts after it', () => {
    fc.assert(
      fc.property(anyZone, instant, (z, t) => {
        const dn = dayNumberFromEpochMs(z, t);
        expect(firstEpochMsOfDayNumber(z, dn)).toBeLessThanOrEqual(t);
        expect(firstEpochMsOfDayNumber(z, dn + 1)).toBeGreaterThan(t);
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });
});

describe('offsets change only at listed transitions', () => {
  it('between two consecutive transitions the offset is constant and equals the earlier one\'s offset after', () => {
    fc.assert(
      fc.property(anyZone, fc.integer({ min: 1850, max: 2140 }), fc.double({ min: 0, max: 1, noNaN: true }), (z, year, frac) => {
        const start = Date.UTC(year, 0, 1);
        const end = Date.UTC(year + 2, 0, 1);
        const ts = listTransitions(z, start, end);
        const bounds = [start, ...ts.map((t) => t.epochMs), end];
        let expected = offsetSecondsFromEpochMs(z, start);
        for (let i = 0; i + 1 < bounds.length; i++) {
          if (i > 0) {
            expect(ts[i - 1]!.offsetBeforeSeconds).toBe(expected);
            expected = ts[i - 1]!.offsetAfterSeconds;
            expect(ts[i - 1]!.offsetAfterSeconds).not.toBe(ts[i - 1]!.offsetBeforeSeconds);
          }
          const a = bounds[i]!;
          const b = bounds[i + 1]!;
          const inside = Math.floor(a + frac * (b - a - 1));
          expect(offsetSecondsFromEpochMs(z, a)).toBe(expected);
          expect(offsetSecondsFromEpochMs(z, inside)).toBe(expected);
          expect(offsetSecondsFromEpochMs(z, b - 1)).toBe(expected);
        }
      }),
      { seed: SEED, numRuns: 400 },
    );
  });
});

describe('bulk equals scalar', () => {
  it('dayNumberFromEpochMsBulk and wallMsFromEpochMsBulk, narrow ranges (day table) and wide ranges (search)', () => {
    fc.assert(
      fc.property(
        anyZone,
        fc.integer({ min: Date.UTC(1800, 0, 1), max: Date.UTC(2200, 0, 1) }),
        fc.constantFrom(86_400_000, 400 * 86_400_000, 50 * 365 * 86_400_000, 300 * 365 * 86_400_000),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 0, maxLength: 300 }),
        fc.boolean(),
        (z, base, span, fracs, asArray) => {
          const values = fracs.map((f) => Math.floor(base + f * span));
          const input = asArray ? values : Float64Array.from(values);
          const days = dayNumberFromEpochMsBulk(z, input);
          const walls = wallMsFromEpochMsBulk(z, input);
          for (let i = 0; i < values.length; i++) {
            expect(days[i]).toBe(dayNumberFromEpochMs(z, values[i]!));
            expect(walls[i]).toBe(wallMsFromEpochMs(z, values[i]!));
          }
        },
      ),
      { seed: SEED, numRuns: 600 },
    );
  });

  it('every instant around every transition of the fixtures, in one call', () => {
    for (const z of tzifZones.slice(0, 8)) {
      const values: number[] = [];
      for (const t of listTransitions(z, Date.UTC(1900, 0, 1), Date.UTC(2040, 0, 1))) values.push(t.epochMs - 1, t.epochMs, t.epochMs + 3_599_999);
      const days = dayNumberFromEpochMsBulk(z, values);
      values.forEach((t, i) => expect(days[i]).toBe(dayNumberFromEpochMs(z, t)));
    }
  });

  it('writes into a given output array and returns it; a short one is a length-mismatch error', () => {
    const out = new Int32Array(3);
    expect(dayNumberFromEpochMsBulk('UTC', [0, 86_400_000, -1], out)).toBe(out);
    expect([...out]).toEqual([0, 1, -1]);
    expect(() => dayNumberFromEpochMsBulk('UTC', [0, 1, 2, 3], out)).toThrow(/^out: expected an? Int32Array of at least 4 elements, got 3/);
    expect(() => wallMsFromEpochMsBulk('Europe/Dublin', [0, 1], new Float64Array(1))).toThrow(KalendsRangeErrorForTest);
  });

  it('NaN: throws naming the first index by default; writes -2**31 or NaN with invalid: sentinel', () => {
    const input = Float64Array.of(0, NaN, Infinity, 9e15, Date.UTC(2025, 6, 1));
    for (const z of ['America/New_York', zoneFromOffset('+02:00')]) {
      expect(() => dayNumberFromEpochMsBulk(z, input)).toThrow(/epochMs\[1\]: expected epoch milliseconds .* got NaN/);
      expect(() => wallMsFromEpochMsBulk(z, input)).toThrow(KalendsRangeErrorForTest);
      const d = dayNumberFromEpochMsBulk(z, input, undefined, { invalid: 'sentinel' });
      expect([d[1], d[2], d[3]]).toEqual([INVALID_DAY_NUMBER, INVALID_DAY_NUMBER, INVALID_DAY_NUMBER]);
      expect(d[4]).toBe(dayNumberFromEpochMs(z, Date.UTC(2025, 6, 1)));
      const w = wallMsFromEpochMsBulk(z, input, undefined, { invalid: 'sentinel' });
      expect([Number.isNaN(w[1]), Number.isNaN(w[2]), Number.isNaN(w[3])]).toEqual([true, true, true]);
      expect(w[0]).toBe(wallMsFromEpochMs(z, 0));
    }
    expect(INVALID_DAY_NUMBER).toBe(-(2 ** 31));
  });
});

describe('bulk conversions reuse and extend their day table across calls', () => {
  // The bulk loop keeps the last day table of each zone and rebuilds it when an instant falls outside; every
  // sequence of calls must still equal the scalar conversions (which ask the compiled zone directly).
  const zones = ['America/New_York', 'Europe/Dublin', 'Australia/Lord_Howe', 'Africa/Casablanca'];
  const ranges: Array<[number, number]> = [
    [Date.UTC(2000, 0, 1), Date.UTC(2001, 0, 1)],
    [Date.UTC(1950, 0, 1), Date.UTC(1952, 0, 1)],
    [Date.UTC(1800, 0, 1), Date.UTC(2200, 0, 1)],
    [Date.UTC(2020, 2, 1), Date.UTC(2020, 3, 1)],
  ];
  it('matches scalar results for sequences of calls over shifting ranges, with NaN under the sentinel policy', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...zones),
        fc.array(fc.tuple(fc.integer({ min: 0, max: ranges.length - 1 }), fc.integer({ min: 1, max: 300 }), fc.integer({ min: 0, max: 1 << 30 })), { minLength: 1, maxLength: 5 }),
        (id, calls) => {
          for (const [r, n, seed] of calls) {
            const [lo, hi] = ranges[r]!;
            const xs = new Float64Array(n);
            let s = seed;
            for (let i = 0; i < n; i++) {
              s = (s * 1103515245 + 12345) >>> 0;
              xs[i] = lo + Math.floor((s / 4294967296) * (hi - lo));
            }
            if (n > 3) xs[n >> 1] = Number.NaN;
            const days = dayNumberFromEpochMsBulk(id, xs, undefined, { invalid: 'sentinel' });
            const walls = wallMsFromEpochMsBulk(id, xs, undefined, { invalid: 'sentinel' });
            for (let i = 0; i < n; i++) {
              const t = xs[i]!;
              if (Number.isNaN(t)) {
                expect(days[i]).toBe(INVALID_DAY_NUMBER);
                expect(walls[i]).toBeNaN();
              } else {
                expect(days[i]).toBe(dayNumberFromEpochMs(id, t));
                expect(walls[i]).toBe(wallMsFromEpochMs(id, t));
              }
            }
          }
        },
      ),
      { seed: 31, numRuns: 120 },
    );
  });

  it('throws naming the first invalid index under the default policy', () => {
    const xs = Float64Array.of(0, 86_400_000, Number.NaN, Number.POSITIVE_INFINITY);
    expect(() => dayNumberFromEpochMsBulk('Europe/Dublin', xs)).toThrow(/epochMs\[2\]: .* got NaN/);
    expect(() => wallMsFromEpochMsBulk('Europe/Dublin', [0, 9e15])).toThrow(/epochMs\[1\]: .* got 9000000000000000/);
  });
});

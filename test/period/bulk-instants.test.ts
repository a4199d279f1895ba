/**
 * The bulk path of ordinalFromEpochMsBulk (the zone's day table, then the unit's dense day-to-ordinal table)
 * against the scalar functions: dayNumberFromEpochMs then unit.ordinalFromDayNumber, element by element. The zone
 * answers themselves are checked against IANA TZif data and @js-temporal/polyfill in test/zone; here the reference
 * is the library's own scalar path (bulk results must be identical to scalar results, issue 3 and 4).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dayNumberFromEpochMs } from '../../src/zone/index.js';
import { INVALID_ORDINAL, defineUnit, ordinalFromEpochMsBulk, type PeriodUnit } from '../../src/period/index.js';

const ZONES = ['America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'Pacific/Apia', 'Asia/Kathmandu', 'Africa/Casablanca', 'UTC', '+05:45'];
const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;
const UNITS: PeriodUnit[] = [
  defineUnit('month'),
  defineUnit('quarter'),
  defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }),
  defineUnit({ kind: 'fiscal-week', ...RETAIL }),
  defineUnit({ kind: 'fiscal-period', ...RETAIL }),
  defineUnit('day'),
];
const DAY = 86_400_000;

function scalar(unit: PeriodUnit, zone: string, ms: number): number {
  return Number.isFinite(ms) && Math.abs(ms) <= 8.64e15 ? unit.ordinalFromDayNumber(dayNumberFromEpochMs(zone, ms)) : INVALID_ORDINAL;
}

describe('ordinalFromEpochMsBulk equals the scalar functions (issues 3 and 4: bulk = scalar)', () => {
  it('random zones, units, centres and spreads, with NaN/Infinity under the sentinel option', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...ZONES),
        fc.nat(UNITS.length - 1),
        fc.integer({ min: -40_000, max: 60_000 }), // centre day (1860..2134)
        fc.constantFrom(2, 400, 5_000, 40_000, 2_000_000), // spread in days: the widest forces the per-element path
        fc.integer({ min: 2_100, max: 6_000 }), // above the dense-table threshold
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.integer(),
        (zone, u, centre, spread, n, badShare, seed) => {
          const unit = UNITS[u]!;
          let a = seed >>> 0;
          const rnd = () => {
            a = (a + 0x6d2b79f5) >>> 0;
            let t = Math.imul(a ^ (a >>> 15), a | 1);
            t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
            return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
          };
          const data = new Float64Array(n);
          for (let i = 0; i < n; i++) {
            const r = rnd();
            data[i] = r < badShare ? [NaN, Infinity, -Infinity, 9e15][i & 3]! : Math.floor((centre + (rnd() - 0.5) * spread) * DAY + rnd() * DAY);
          }
          const got = ordinalFromEpochMsBulk(unit, zone, data, undefined, { invalid: 'sentinel' });
          for (let i = 0; i < n; i++) {
            if (got[i] !== scalar(unit, zone, data[i]!)) expect([i, data[i], got[i]]).toEqual([i, data[i], scalar(unit, zone, data[i]!)]);
          }
        },
      ),
      { seed: 20260412, numRuns: 60 },
    );
  });

  it('successive calls that move the range force table rebuilds and still agree', () => {
    const unit = UNITS[3]!;
    for (const zone of ['America/New_York', 'Pacific/Apia']) {
      for (const centre of [10_000, -20_000, 30_000, 10_500, 200_000]) {
        const data = new Float64Array(3000);
        for (let i = 0; i < data.length; i++) data[i] = (centre + ((i * 7919) % 1500)) * DAY + ((i * 104729) % DAY);
        const got = ordinalFromEpochMsBulk(unit, zone, data);
        for (let i = 0; i < data.length; i++) if (got[i] !== scalar(unit, zone, data[i]!)) expect(got[i]).toBe(scalar(unit, zone, data[i]!));
      }
    }
  });

  it('throws naming the index of a NaN without the sentinel option', () => {
    const data = new Float64Array(3000).fill(Date.UTC(2025, 0, 1));
    data[2500] = NaN;
    expect(() => ordinalFromEpochMsBulk(UNITS[0]!, 'America/New_York', data)).toThrow(/epochMs\[2500\]/);
  });
});

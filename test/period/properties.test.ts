/**
 * Property tests over randomly generated unit definitions of every kind (fast-check, fixed seed): the
 * properties of shared/DESIGN.md, "Properties that must hold", for the period layer.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dayCountOfMonth, dayNumberFromYmd } from '../../src/civil/index.js';
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../../src/bounds.js';
import {
  type UnitDefinition,
  defineUnit,
  firstDayNumberFromOrdinalBulk,
  formatOrdinalBulk,
  listSubPeriods,
  ordinalFromDayNumberBulk,
  parsePeriod,
  periodFromOrdinal,
  lengthDaysOfPeriod,
  shiftPeriodYears,
} from '../../src/period/index.js';

const SEED = 424242;
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
const naming = fc.constantFrom('end-year' as const, 'start-year' as const);

const calendarDef: fc.Arbitrary<UnitDefinition> = fc.oneof(
  fc.constantFrom('day', 'iso-week', 'month', 'quarter', 'half-year', 'year').map((kind) => ({ kind }) as UnitDefinition),
  fc.constantFrom(...WEEKDAYS).map((firstWeekday) => ({ kind: 'week', firstWeekday }) as UnitDefinition),
  fc
    .record({ lengthDays: fc.integer({ min: 1, max: 400 }), y: fc.integer({ min: 1900, max: 2100 }), m: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) })
    .map(({ lengthDays, y, m, day }) => ({
      kind: 'cycle',
      lengthDays,
      anchor: `${y}-${String(m).padStart(2, '0')}-${String(day).padStart(2, '0')}`,
    }) as UnitDefinition),
);

const monthFiscalDef: fc.Arbitrary<UnitDefinition> = fc
  .record({
    kind: fc.constantFrom('fiscal-year', 'fiscal-half', 'fiscal-quarter', 'fiscal-period'),
    month: fc.integer({ min: 1, max: 12 }),
    day: fc.integer({ min: 1, max: 31 }),
    naming,
  })
  .map(({ kind, month, day, naming: n }) => ({
    kind,
    start: { month, day: Math.min(day, month === 2 ? 28 : dayCountOfMonth(2001, month)) },
    naming: n,
  }) as UnitDefinition);

const weekFiscalShape = fc.record({
  yearEnd: fc.record({
    weekday: fc.constantFrom(...WEEKDAYS),
    month: fc.integer({ min: 1, max: 12 }),
    rule: fc.constantFrom('last' as const, 'nearest' as const),
  }),
  layout: fc.constantFrom('4-4-5' as const, '4-5-4' as const, '5-4-4' as const, '13x4' as const),
  extraWeek: fc.constantFrom('last-period' as const, 'first-period' as const),
  naming,
});
const weekFiscalDef: fc.Arbitrary<UnitDefinition> = fc
  .tuple(fc.constantFrom('fiscal-year', 'fiscal-half', 'fiscal-quarter', 'fiscal-period', 'fiscal-week'), weekFiscalShape)
  .map(([kind, shape]) => ({ kind, ...shape }) as UnitDefinition);

const anyDef = fc.oneof(calendarDef, monthFiscalDef, weekFiscalDef);
/** Mostly recent days, sometimes anywhere in the supported range, sometimes at its edges. */
const anyDay = fc.oneof(
  { weight: 6, arbitrary: fc.integer({ min: dayNumberFromYmd(1850, 1, 1), max: dayNumberFromYmd(2250, 1, 1) }) },
  { weight: 3, arbitrary: fc.integer({ min: MIN_DAY_NUMBER, max: MAX_DAY_NUMBER }) },
  { weight: 1, arbitrary: fc.constantFrom(MIN_DAY_NUMBER, MIN_DAY_NUMBER + 1, MAX_DAY_NUMBER - 1, MAX_DAY_NUMBER) },
);

describe('period: properties', () => {
  it('the period of a period\'s first day is that period; end(p) = start(p + 1); every day is in exactly one period', () => {
    fc.assert(
      fc.property(anyDef, anyDay, (def, dn) => {
        const u = defineUnit(def);
        const o = u.ordinalFromDayNumber(dn);
        const first = u.firstDayNumberFromOrdinal(o);
        expect(first).toBeLessThanOrEqual(dn);
        if (first >= MIN_DAY_NUMBER) expect(u.ordinalFromDayNumber(first)).toBe(o);
        if (o < u.maxOrdinal) {
          const next = u.firstDayNumberFromOrdinal(o + 1);
          expect(next).toBeGreaterThan(dn); // dn lies in [first, next): one period only
          expect(u.ordinalFromDayNumber(next)).toBe(o + 1);
          expect(u.ordinalFromDayNumber(next - 1)).toBe(o);
        }
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('ordinals never decrease as time moves forward, and step by at most one per day', () => {
    fc.assert(
      fc.property(anyDef, anyDay, fc.integer({ min: 1, max: 800 }), (def, dn, len) => {
        const u = defineUnit(def);
        const end = Math.min(dn + len, MAX_DAY_NUMBER);
        let prev = u.ordinalFromDayNumber(dn);
        for (let x = dn + 1; x <= end; x++) {
          const o = u.ordinalFromDayNumber(x);
          const step = o - prev;
          if (step !== 0 && step !== 1) expect.fail(`${u.id}: day ${x} steps by ${step}`);
          prev = o;
        }
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('labels round-trip for every unit and period', () => {
    fc.assert(
      fc.property(anyDef, anyDay, (def, dn) => {
        const u = defineUnit(def);
        const o = u.ordinalFromDayNumber(dn);
        const label = u.formatOrdinal(o);
        expect(u.parseOrdinal(label)).toBe(o);
        expect(parsePeriod(def, label).ordinal).toBe(o);
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('week-based years have 364 or 371 days, their sub-periods tile the year, and week 53 appears only in 371-day years', () => {
    fc.assert(
      fc.property(weekFiscalShape, fc.integer({ min: -3000, max: 5000 }), (shape, y) => {
        const year = defineUnit({ kind: 'fiscal-year', ...shape });
        const fy = parsePeriod(year, `FY${y < 0 ? '-' + String(-y).padStart(6, '0') : String(y).padStart(4, '0')}`);
        const days = lengthDaysOfPeriod(fy);
        expect([364, 371]).toContain(days);
        for (const kind of ['fiscal-half', 'fiscal-quarter', 'fiscal-period', 'fiscal-week'] as const) {
          const sub = listSubPeriods(fy, { kind, ...shape });
          expect(sub.reduce((acc, p) => acc + lengthDaysOfPeriod(p), 0)).toBe(days);
          const perYear = { 'fiscal-half': 2, 'fiscal-quarter': 4, 'fiscal-period': shape.layout === '13x4' ? 13 : 12, 'fiscal-week': days / 7 }[kind];
          expect(sub).toHaveLength(perYear);
          if (kind === 'fiscal-quarter' || kind === 'fiscal-half') {
            const weeks = sub.map((p) => lengthDaysOfPeriod(p) / 7);
            const base = kind === 'fiscal-quarter' ? 13 : 26;
            expect(weeks.filter((w) => w === base + 1)).toHaveLength(days === 371 ? 1 : 0);
          }
        }
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  it('bulk results equal scalar results (day numbers to ordinals, ordinals to labels and first days)', () => {
    fc.assert(
      fc.property(anyDef, fc.array(anyDay, { minLength: 1, maxLength: 60 }), (def, days) => {
        const u = defineUnit(def);
        const ords = ordinalFromDayNumberBulk(u, Int32Array.from(days));
        expect([...ords]).toEqual(days.map((x) => u.ordinalFromDayNumber(x)));
        expect(formatOrdinalBulk(u, ords)).toEqual([...ords].map((o) => u.formatOrdinal(o)));
        expect([...firstDayNumberFromOrdinalBulk(u, ords)]).toEqual([...ords].map((o) => u.firstDayNumberFromOrdinal(o)));
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });

  it('bulk equals scalar over long runs of consecutive days (exercises the cached week tables and their edges)', () => {
    fc.assert(
      fc.property(fc.oneof(monthFiscalDef, weekFiscalDef), fc.integer({ min: dayNumberFromYmd(1790, 1, 1), max: dayNumberFromYmd(2400, 1, 1) }), (def, start) => {
        const u = defineUnit(def);
        const days = new Int32Array(4000);
        for (let i = 0; i < days.length; i++) days[i] = start + i;
        const ords = ordinalFromDayNumberBulk(u, days);
        for (let i = 0; i < days.length; i++) {
          if (ords[i] !== u.ordinalFromDayNumber(days[i]!)) expect.fail(`${u.id}: day ${days[i]}`);
        }
      }),
      { seed: SEED, numRuns: 120 },
    );
  });

  it('bulk equals scalar across calls whose days move around (dense day tables are reused, widened, or skipped when too wide)', () => {
    const spans: Array<[number, number]> = [
      [dayNumberFromYmd(2000, 1, 1), dayNumberFromYmd(2040, 1, 1)],
      [dayNumberFromYmd(1950, 1, 1), dayNumberFromYmd(1955, 1, 1)],
      [dayNumberFromYmd(-5000, 1, 1), dayNumberFromYmd(9000, 1, 1)],
      [dayNumberFromYmd(2024, 2, 1), dayNumberFromYmd(2024, 3, 1)],
    ];
    fc.assert(
      fc.property(
        fc.oneof(monthFiscalDef, weekFiscalDef),
        fc.array(fc.tuple(fc.integer({ min: 0, max: spans.length - 1 }), fc.integer({ min: 0, max: 1 << 30 })), { minLength: 1, maxLength: 4 }),
        (def, calls) => {
          const u = defineUnit(def);
          for (const [k, seed] of calls) {
            const [lo, hi] = spans[k]!;
            const days = new Int32Array(2500);
            let x = seed;
            for (let i = 0; i < days.length; i++) {
              x = (x * 1103515245 + 12345) >>> 0;
              days[i] = lo + Math.floor((x / 4294967296) * (hi - lo));
            }
            const ords = ordinalFromDayNumberBulk(u, days);
            for (let i = 0; i < days.length; i++) {
              if (ords[i] !== u.ordinalFromDayNumber(days[i]!)) expect.fail(`${u.id}: day ${days[i]} gave ${ords[i]}`);
            }
          }
        },
      ),
      { seed: SEED, numRuns: 60 },
    );
  });

  it('year earlier moves back one year (365..371 days for whole-year steps) and stays in range', () => {
    fc.assert(
      fc.property(anyDef, fc.integer({ min: dayNumberFromYmd(1850, 1, 1), max: dayNumberFromYmd(2250, 1, 1) }), (def, dn) => {
        const u = defineUnit(def);
        const p = periodFromOrdinal(u, u.ordinalFromDayNumber(dn));
        const back = shiftPeriodYears(p, -1);
        const gap = u.firstDayNumberFromOrdinal(p.ordinal) - u.firstDayNumberFromOrdinal(back.ordinal);
        const kind = u.kind;
        if (kind === 'week' || kind === 'cycle') {
          expect(gap).toBeGreaterThanOrEqual(364);
          expect(gap).toBeLessThan(364 + (def as { lengthDays?: number }).lengthDays! || 364 + 7);
        } else {
          // Same index one (fiscal or ISO week-) year earlier: between 357 (53 -> 52 clamp) and 378 days.
          expect(gap).toBeGreaterThanOrEqual(357);
          expect(gap).toBeLessThanOrEqual(378);
        }
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });
});

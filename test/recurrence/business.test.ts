/**
 * Rules on business calendars, fiscal periods and finance schedules.
 *
 * Sources: the US federal holidays of 5 U.S.C. 6103 (2025 dates as listed by the US Office of Personnel
 * Management's 2025 holiday table); the business-day conventions of the ISDA 2006 Definitions, section 4.12;
 * @js-temporal/polyfill for calendar arithmetic; the business layer's own nthBusinessDayOfRange and
 * nthBusinessDayOfPeriod as an independent computation of the same days (our rules scan with isBusinessDay).
 * Stub placement (front stubs rolled back from the end date, back stubs forward from the start) is common
 * practice, not an ISDA rule.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  type BusinessDayConvention,
  type CalendarDefinition,
  type RuleDefinition,
  DefinitionError,
  adjustDayNumber,
  KalendsRangeError,
  defineSchedule,
  countBusinessDays,
  defineCalendar,
  defineRule,
  defineUnit,
  describeRule,
  formatPlainDate,
  isBusinessDay,
  listOccurrenceDayNumbers,
  isOccurrenceDayNumber,
  nextOccurrenceDayNumber,
  nthBusinessDayOfRange,
  nthBusinessDayOfPeriod,
  parsePlainDate,
  firstDayNumberAfterPeriod,
  periodFromDayNumber,
} from '../../src/index.js';

const SEED = 20261207;
const iso = (dn: number) => formatPlainDate(dn);
const pd = (s: string) => Temporal.PlainDate.from(s);

/** US federal holidays observed in 2025 (5 U.S.C. 6103; OPM 2025 table). */
const US_2025 = ['2025-01-01', '2025-01-20', '2025-02-17', '2025-05-26', '2025-06-19', '2025-07-04', '2025-09-01', '2025-10-13', '2025-11-11', '2025-11-27', '2025-12-25'];

describe('business-day rules on the US federal calendar', () => {
  it('every business day of 2025: the weekdays of 2025 less the 11 federal holidays (Temporal scan)', () => {
    const rule = defineRule({ kind: 'business-days', calendar: 'us-federal' });
    const got = listOccurrenceDayNumbers(rule, '2025-01-01', '2026-01-01').map(iso);
    const expected: string[] = [];
    for (let d = pd('2025-01-01'); d.year === 2025; d = d.add({ days: 1 })) {
      if (d.dayOfWeek <= 5 && !US_2025.includes(d.toString())) expected.push(d.toString());
    }
    expect(got).toEqual(expected);
    expect(got).toHaveLength(250);
  });

  it('long ranges are split into whole-day chunks: 2000-2050 equals the sum of its years (countBusinessDays)', () => {
    const rule = defineRule({ kind: 'business-days', calendar: 'us-federal' });
    const all = listOccurrenceDayNumbers(rule, '2000-01-01', '2051-01-01');
    expect(all.length).toBe(countBusinessDays('us-federal', parsePlainDate('2000-01-01'), parsePlainDate('2051-01-01')));
    expect(all.every((d) => Number.isInteger(d))).toBe(true);
    expect(iso(nextOccurrenceDayNumber(rule, '2025-07-03')!)).toBe('2025-07-07'); // July 4 (5 U.S.C. 6103) is a Friday
  });

  it('business month ends and month starts of 2025', () => {
    const ends = defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar: 'us-federal' });
    expect(listOccurrenceDayNumbers(ends, '2025-01-01', '2026-01-01').map(iso)).toEqual([
      '2025-01-31', '2025-02-28', '2025-03-31', '2025-04-30', '2025-05-30', '2025-06-30',
      '2025-07-31', '2025-08-29', '2025-09-30', '2025-10-31', '2025-11-28', '2025-12-31',
    ]);
    const starts = defineRule({ kind: 'monthly', on: { businessDay: 1 }, calendar: 'us-federal' });
    // January 1 is New Year's Day and September 1 is Labor Day (5 U.S.C. 6103).
    expect(listOccurrenceDayNumbers(starts, '2025-01-01', '2025-10-01').map(iso)).toEqual([
      '2025-01-02', '2025-02-03', '2025-03-03', '2025-04-01', '2025-05-01', '2025-06-02', '2025-07-01', '2025-08-01', '2025-09-02',
    ]);
  });

  it('every 5th business day from an anchor is the anchor shifted by 5k business days', () => {
    const rule = defineRule({ kind: 'business-days', every: 5, anchor: '2025-06-16', calendar: 'us-federal' });
    const got = listOccurrenceDayNumbers(rule, '2025-06-01', '2025-08-01');
    for (let i = 1; i < got.length; i++) expect(countBusinessDays('us-federal', got[i - 1]!, got[i]!)).toBe(5);
    expect(got.map(iso)).toContain('2025-06-16');
    expect(got.map(iso)).toContain('2025-06-24'); // June 19 (Juneteenth) is skipped
  });

  it('modified following keeps a month-end payment in its month (ISDA 2006 section 4.12)', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 31, whenShort: 'last-day' }, calendar: 'us-federal', convention: 'modified-following' });
    // 2025-05-31 is a Saturday: following would be June 2, another month, so it goes back to Friday May 30.
    expect(listOccurrenceDayNumbers(rule, '2025-05-01', '2025-09-01').map(iso)).toEqual(['2025-05-30', '2025-06-30', '2025-07-31', '2025-08-29']);
    const following = defineRule({ kind: 'monthly', on: { day: 31, whenShort: 'last-day' }, calendar: 'us-federal', convention: 'following' });
    expect(listOccurrenceDayNumbers(following, '2025-05-01', '2025-06-10').map(iso)).toEqual(['2025-06-02']);
  });

  it('two dates that adjust to the same day appear once (weekends moved to Monday)', () => {
    const rule = defineRule({ kind: 'weekly', weekdays: ['saturday', 'sunday'], calendar: 'us-federal', convention: 'following' });
    const got = listOccurrenceDayNumbers(rule, '2025-06-01', '2025-07-01').map(iso);
    // Each weekend lands on the next Monday, once; Monday June 2 comes from Saturday May 31 and Sunday June 1.
    expect(got).toEqual(['2025-06-02', '2025-06-09', '2025-06-16', '2025-06-23', '2025-06-30']);
    expect(isOccurrenceDayNumber(rule, parsePlainDate('2025-06-09'))).toBe(true);
    expect(isOccurrenceDayNumber(rule, parsePlainDate('2025-06-07'))).toBe(false);
  });

  it('a convention needs a calendar; a business selector needs a calendar', () => {
    expect(() => defineRule({ kind: 'days', convention: 'following' })).toThrow(DefinitionError);
    expect(() => defineRule({ kind: 'monthly', on: { businessDay: -1 } })).toThrow(/calendar/);
  });

  it('describes an adjusted rule', () => {
    const rule = defineRule({ kind: 'monthly', on: [{ day: 15 }, { businessDay: 'last' }], calendar: 'us-federal', convention: 'modified-following' });
    expect(describeRule(rule)).toContain('the 15th and the last business day of every month; moved to a business day of calendar "us-federal" by the modified-following convention');
  });
});

/** Random calendars: a weekend of one to three days and a few fixed and nth-weekday holidays. */
const weekdayNames = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
const randomCalendar: fc.Arbitrary<CalendarDefinition> = fc
  .record({
    weekend: fc.uniqueArray(fc.constantFrom(...weekdayNames), { minLength: 1, maxLength: 3 }),
    fixed: fc.array(fc.record({ month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) }), { maxLength: 6 }),
    nth: fc.array(fc.record({ month: fc.integer({ min: 1, max: 12 }), weekday: fc.constantFrom(...weekdayNames), nth: fc.constantFrom(1 as const, 2 as const, 3 as const, 'last' as const) }), { maxLength: 4 }),
  })
  .map(({ weekend, fixed, nth }) => ({
    id: 'random',
    weekend,
    years: { from: 1990, until: 2060 },
    holidays: [
      ...fixed.map((f, i) => ({ id: `f${i}`, name: `Fixed ${i}`, kind: 'fixed' as const, ...f })),
      ...nth.map((n, i) => ({ id: `n${i}`, name: `Nth ${i}`, kind: 'nth-weekday' as const, ...n })),
    ],
  }));

describe('business rules on random calendars (seeded fast-check)', () => {
  it('business month end equals the business layer\'s last business day of each month; adjusted dates are business days', () => {
    fc.assert(
      fc.property(
        randomCalendar,
        fc.integer({ min: 1995, max: 2050 }),
        fc.constantFrom('following', 'modified-following', 'preceding', 'modified-preceding') as fc.Arbitrary<'following'>,
        (def, year, convention) => {
          const cal = defineCalendar(def);
          const ends = defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar: cal });
          const start = parsePlainDate(`${year}-01-01`);
          const end = parsePlainDate(`${year + 1}-01-01`);
          const got = listOccurrenceDayNumbers(ends, start, end);
          const expected: number[] = [];
          for (let m = 1; m <= 12; m++) {
            const a = parsePlainDate(`${year}-${String(m).padStart(2, '0')}-01`);
            const b = m === 12 ? end : parsePlainDate(`${year}-${String(m + 1).padStart(2, '0')}-01`);
            expected.push(nthBusinessDayOfRange(cal, a, b, -1));
          }
          expect(got).toEqual(expected);
          const adjusted = defineRule({ kind: 'semi-monthly', days: [15, 'last'], calendar: cal, convention });
          const dates = listOccurrenceDayNumbers(adjusted, start, end);
          for (const d of dates) expect(isBusinessDay(cal, d)).toBe(true);
          for (let i = 1; i < dates.length; i++) expect(dates[i]!).toBeGreaterThan(dates[i - 1]!);
        },
      ),
      { seed: SEED, numRuns: 60 },
    );
  });
});

/** Raw dates of a few rule shapes, by a day-by-day stepper over ECMA-262 Date.UTC: the brute force. */
type Shape = { kind: 'monthly'; day: number } | { kind: 'weekly'; weekdays: number[] } | { kind: 'days'; every: number } | { kind: 'semi-monthly' };
const DAY_MS = 86_400_000;
function bruteRaw(shape: Shape, start: number, count: number): number[] {
  const out: number[] = [];
  for (let d = start; out.length < count; d++) {
    const date = new Date(d * DAY_MS);
    const dom = date.getUTCDate();
    const last = new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth() + 1, 0)).getUTCDate();
    const wd = ((date.getUTCDay() + 6) % 7) + 1;
    const hit =
      shape.kind === 'monthly' ? dom === shape.day
      : shape.kind === 'weekly' ? shape.weekdays.includes(wd)
      : shape.kind === 'days' ? (d - start) % shape.every === 0
      : dom === 15 || dom === last;
    if (hit) out.push(d);
  }
  return out;
}
function definitionOf(shape: Shape): RuleDefinition {
  switch (shape.kind) {
    case 'monthly':
      return { kind: 'monthly', on: { day: shape.day } };
    case 'weekly':
      return { kind: 'weekly', weekdays: shape.weekdays };
    case 'days':
      return { kind: 'days', every: shape.every };
    default:
      return { kind: 'semi-monthly', days: [15, 'last'] };
  }
}
const shapeArb: fc.Arbitrary<Shape> = fc.oneof(
  fc.record({ kind: fc.constant('monthly' as const), day: fc.integer({ min: 1, max: 28 }) }),
  fc.record({ kind: fc.constant('weekly' as const), weekdays: fc.uniqueArray(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 3 }) }),
  fc.record({ kind: fc.constant('days' as const), every: fc.integer({ min: 1, max: 12 }) }),
  fc.constant({ kind: 'semi-monthly' as const }),
);

describe('count with a business-day convention, against a brute-force stepper (seeded fast-check)', () => {
  it('the issue 12 reproduction: 12 payments on the 15th, moved by following on the US federal calendar', () => {
    // 0.1 rejected every rule with count and a convention other than none, with a bogus limit-exceeded error.
    const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following', start: '2025-01-01', count: 12 });
    // Weekends by ECMA-262 Date; Washington's Birthday is Monday 2025-02-17 (5 U.S.C. 6103; OPM 2025 table).
    expect(listOccurrenceDayNumbers(rule, '2020-01-01', '2030-01-01').map(iso)).toEqual([
      '2025-01-15', '2025-02-18', '2025-03-17', '2025-04-15', '2025-05-15', '2025-06-16',
      '2025-07-15', '2025-08-15', '2025-09-15', '2025-10-15', '2025-11-17', '2025-12-15',
    ]);
  });

  it('a search from long before the start of an adjusted rule finds its first date (0.1 gave up after 524 days)', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following', start: '2025-01-01' });
    expect(iso(nextOccurrenceDayNumber(rule, '2005-01-01')!)).toBe('2025-01-15');
  });

  it('the first `count` raw dates from start, each adjusted (ISDA 2006 section 4.12 by adjustDayNumber), equal the occurrences', () => {
    fc.assert(
      fc.property(
        randomCalendar,
        shapeArb,
        fc.constantFrom<BusinessDayConvention>('following', 'modified-following', 'preceding', 'modified-preceding', 'none'),
        fc.integer({ min: parsePlainDate('1995-01-01'), max: parsePlainDate('2040-01-01') }),
        fc.integer({ min: 1, max: 60 }),
        (def, shape, convention, start, count) => {
          const cal = defineCalendar(def);
          const rule = defineRule({ ...definitionOf(shape), calendar: cal, convention, start, count, ...(shape.kind === 'days' ? { anchor: start } : {}) } as RuleDefinition);
          const want: number[] = [];
          for (const d of bruteRaw(shape, start, count)) {
            const a = adjustDayNumber(cal, d, convention);
            if (want[want.length - 1] !== a) want.push(a);
          }
          expect(listOccurrenceDayNumbers(rule, start - 400, start + 10 * 366)).toEqual(want);
        },
      ),
      { seed: SEED, numRuns: 200 },
    );
  });
});

describe('fiscal anchors from the period layer', () => {
  // A 4-5-4 retail calendar: 52/53-week years ending on the Saturday nearest the end of January (common
  // practice in US retail).
  const periods454 = defineUnit({ kind: 'fiscal-period', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' });

  it('the Friday before each 4-5-4 period ends is the last Friday of the period', () => {
    const rule = defineRule({ kind: 'periods', unit: periods454, on: { weekday: 'friday', nth: 'last' } });
    const got = listOccurrenceDayNumbers(rule, '2024-02-01', '2026-02-01');
    expect(got.length).toBeGreaterThanOrEqual(23);
    for (const d of got) {
      const p = periodFromDayNumber(periods454, d);
      const lastDay = firstDayNumberAfterPeriod(p) - 1;
      expect(pd(iso(d)).dayOfWeek).toBe(5);
      // Periods end on a Saturday, so the Friday is the day before the period's last day.
      expect(pd(iso(lastDay)).dayOfWeek).toBe(6);
      expect(lastDay - d).toBe(1);
    }
  });

  it('the last business day of each fiscal quarter equals the business layer\'s nthBusinessDayOfPeriod', () => {
    const quarters = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    const rule = defineRule({ kind: 'periods', unit: quarters, on: { businessDay: 'last' }, calendar: 'us-federal' });
    const got = listOccurrenceDayNumbers(rule, '2020-01-01', '2030-01-01');
    expect(got).toHaveLength(40);
    for (const d of got) expect(d).toBe(nthBusinessDayOfPeriod('us-federal', periodFromDayNumber(quarters, d), -1));
    // US federal fiscal year: October 1 to September 30 (31 U.S.C. 1102); 2025-09-30 is a Tuesday.
    expect(got.map(iso)).toContain('2025-09-30');
  });
});

describe('finance schedules', () => {
  const months = (from: string, k: number) => pd(from).add({ months: k }).toString();

  it('short front stub: roll back from the end date in whole steps (common practice)', () => {
    const s = defineSchedule({ start: '2025-02-10', end: '2026-06-15', step: { months: 6 }, stub: 'short-front' });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), iso(p.unadjustedEnd), p.stub ?? ''])).toEqual([
      ['2025-02-10', months('2026-06-15', -12), 'front'],
      [months('2026-06-15', -12), months('2026-06-15', -6), ''],
      [months('2026-06-15', -6), '2026-06-15', ''],
    ]);
  });

  it('long front stub joins the short stub to the first regular period', () => {
    const s = defineSchedule({ start: '2025-02-10', end: '2026-06-15', step: { months: 6 }, stub: 'long-front' });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), iso(p.unadjustedEnd), p.stub ?? ''])).toEqual([
      ['2025-02-10', '2025-12-15', 'front'],
      ['2025-12-15', '2026-06-15', ''],
    ]);
  });

  it('short and long back stubs roll forward from the start date', () => {
    const short = defineSchedule({ start: '2025-01-31', end: '2025-12-15', step: { months: 3 }, stub: 'short-back', keepMonthEnd: true });
    expect(short.periods.map((p) => iso(p.unadjustedStart))).toEqual(['2025-01-31', '2025-04-30', '2025-07-31', '2025-10-31']);
    expect(short.periods[3]!.stub).toBe('back');
    const long = defineSchedule({ start: '2025-01-31', end: '2025-12-15', step: { months: 3 }, stub: 'long-back', keepMonthEnd: true });
    expect(long.periods.map((p) => [iso(p.unadjustedStart), iso(p.unadjustedEnd)])).toEqual([
      ['2025-01-31', '2025-04-30'],
      ['2025-04-30', '2025-07-31'],
      ['2025-07-31', '2025-12-15'],
    ]);
    // Without the end-of-month rule the day of the start date is kept where the month has it (Temporal add).
    const plain = defineSchedule({ start: '2025-01-31', end: '2025-12-15', step: { months: 3 }, stub: 'short-back' });
    expect(plain.periods.map((p) => iso(p.unadjustedStart))).toEqual([0, 3, 6, 9].map((k) => months('2025-01-31', k)));
  });

  it('no stub when the step divides the span; adjusted dates by modified following on the US federal calendar', () => {
    const s = defineSchedule({ start: '2025-03-31', end: '2026-03-31', step: { months: 3 }, keepMonthEnd: true, calendar: 'us-federal', convention: 'modified-following' });
    expect(s.periods.every((p) => p.stub === undefined)).toBe(true);
    expect(s.periods.map((p) => iso(p.unadjustedEnd))).toEqual(['2025-06-30', '2025-09-30', '2025-12-31', '2026-03-31']);
    // 2025-05-31 style check: every adjusted date is a business day, and stays in its month.
    for (const p of s.periods) {
      expect(isBusinessDay('us-federal', p.adjustedEnd)).toBe(true);
      expect(iso(p.adjustedEnd).slice(0, 7)).toBe(iso(p.unadjustedEnd).slice(0, 7));
    }
  });

  it('a rule as the step: the payroll Fridays between two dates', () => {
    const fridays = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-10' });
    const s = defineSchedule({ start: '2025-01-01', end: '2025-02-20', step: fridays, stub: 'short-front' });
    expect(s.periods.map((p) => iso(p.unadjustedStart))).toEqual(['2025-01-01', '2025-01-10', '2025-01-24', '2025-02-07']);
    expect(s.periods[0]!.stub).toBe('front');
  });

  it('bad schedules give typed errors', () => {
    expect(() => defineSchedule({ start: '2025-01-01', end: '2024-01-01', step: { months: 1 } })).toThrow(KalendsRangeError);
    expect(() => defineSchedule({ start: '2025-01-01', end: '2026-01-01', step: { months: 0 } })).toThrow(/step.months/);
    expect(() => defineSchedule({ start: '2025-01-01', end: '2026-01-01', step: { months: 1 }, convention: 'following' })).toThrow(/calendar/);
  });
});

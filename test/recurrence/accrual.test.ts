/**
 * Accrual schedules: each period's payment date, fixing date and day-count fraction (defineSchedule's `payment`,
 * `fixing` and `dayCount` options).
 *
 * Sources:
 * - [ISDA 1999] ISDA, "The Actual/Actual Day Count Fraction" (1999): its worked examples of Actual/Actual (ISDA)
 *   and (ICMA, then ISMA) on a regular period, a short and a long first period, and a short and a long final
 *   period; ICMA Rule 251 measures a stub against its notional regular period. The paper was not at hand: the
 *   examples are from memory (they are the ones test/daycount/reference.test.ts checks one period at a time).
 * - [ISDA 2006] 2006 ISDA Definitions, section 4.16 (h) (30E/360 (ISDA): the last day of February keeps its day
 *   only on the Termination Date) and section 4.12 (business-day conventions).
 * - [5 U.S.C. 6103] Washington's Birthday is the third Monday in February (16 February 2026).
 * - A brute-force reference written here: the schedule's dates rolled with @js-temporal/polyfill, business days
 *   walked one by one with isBusinessDay, and each fraction summed day by day as an exact rational (BigInt).
 * - Payment dates as a lag after the adjusted period end, fixing dates as a lag before the adjusted start:
 *   common practice (a confirmation states its own).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  type BusinessDayConvention,
  type DayCountConvention,
  type ScheduleOptions,
  KalendsRangeError,
  KalendsTypeError,
  adjustDayNumber,
  countBusinessDays,
  defineSchedule,
  formatPlainDate,
  isBusinessDay,
  yearFractionOfDays,
} from '../../src/index.js';

const SEED = 20261204;
/** Day number of an ISO date, by ECMA-262 Date.UTC (not our civil layer). */
const day = (iso: string): number => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10))) / 86_400_000;
const iso = (dn: number): string => formatPlainDate(dn);
const exact = (f: { numerator: number; denominator: number } | undefined) => (f ? [f.numerator, f.denominator] : undefined);

describe('Actual/Actual (ICMA) and (ISDA) over schedules: the worked examples of [ISDA 1999] (from memory)', () => {
  const icma = (couponsPerYear: number) => ({ convention: 'actual-actual-icma' as const, accrueOn: 'unadjusted' as const, couponsPerYear });

  it('a regular semi-annual period, 1 November 2003 to 1 May 2004: ICMA 1/2, ISDA 61/365 + 121/366', () => {
    const s = defineSchedule({ start: '2003-11-01', end: '2004-05-01', step: { months: 6 }, dayCount: icma(2) });
    expect(s.periods.map((p) => exact(p.yearFraction))).toEqual([[1, 2]]);
    const isda = defineSchedule({ start: '2003-11-01', end: '2004-05-01', step: { months: 6 }, dayCount: { convention: 'actual-actual-isda', accrueOn: 'unadjusted' } });
    expect(exact(isda.periods[0]!.yearFraction)).toEqual([66491, 133590]); // (61 * 366 + 121 * 365) / (365 * 366), reduced
  });

  it('a short first period, 1 February 1999 to 1 July 1999, annual: 150 / 365 against the notional 1 July 1998 - 1 July 1999', () => {
    const s = defineSchedule({ start: '1999-02-01', end: '2000-07-01', step: { months: 12 }, stub: 'short-front', dayCount: icma(1) });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), p.stub, exact(p.yearFraction)])).toEqual([
      ['1999-02-01', 'front', [30, 73]], // 150/365
      ['1999-07-01', undefined, [1, 1]],
    ]);
  });

  it('a long first period, 15 August 2002 to 15 July 2003, semi-annual: 153 / (2 x 184) + 181 / (2 x 181) = 337/368', () => {
    const s = defineSchedule({ start: '2002-08-15', end: '2004-01-15', step: { months: 6 }, stub: 'long-front', dayCount: icma(2) });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), iso(p.unadjustedEnd), p.stub, exact(p.yearFraction)])).toEqual([
      ['2002-08-15', '2003-07-15', 'front', [337, 368]],
      ['2003-07-15', '2004-01-15', undefined, [1, 2]],
    ]);
    expect(s.periods[0]!.yearFraction!.value).toBeCloseTo(0.91576087, 8);
  });

  it('a short final period, 30 January 2000 to 30 June 2000, semi-annual: 152 / (2 x 182)', () => {
    const s = defineSchedule({ start: '1999-07-30', end: '2000-06-30', step: { months: 6 }, stub: 'short-back', dayCount: icma(2) });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), p.stub, exact(p.yearFraction)])).toEqual([
      ['1999-07-30', undefined, [1, 2]],
      ['2000-01-30', 'back', [38, 91]], // 152/364
    ]);
    expect(s.periods[1]!.yearFraction!.value).toBeCloseTo(0.41758242, 8);
  });

  it('a long final period, 30 November 1999 to 30 April 2000, quarterly on month ends: 91 / (4 x 91) + 61 / (4 x 92)', () => {
    const s = defineSchedule({ start: '1999-05-31', end: '2000-04-30', step: { months: 3 }, stub: 'long-back', keepMonthEnd: true, dayCount: icma(4) });
    const last = s.periods[s.periods.length - 1]!;
    expect([iso(last.unadjustedStart), iso(last.unadjustedEnd), last.stub, exact(last.yearFraction)]).toEqual(['1999-11-30', '2000-04-30', 'back', [153, 368]]);
    expect(last.yearFraction!.value).toBeCloseTo(0.41576087, 8);
  });
});

describe('30E/360 (ISDA) over a schedule [ISDA 2006, 4.16 (h)]', () => {
  it('the last period ends on 29 February 2012, the Termination Date, and keeps its day: 179 days; otherwise 180', () => {
    const dayCount = (terminationDayNumber: number) => ({ convention: 'thirty-e-360-isda' as const, accrueOn: 'unadjusted' as const, terminationDayNumber });
    const s = defineSchedule({ start: '2011-02-28', end: '2012-02-29', step: { months: 6 }, keepMonthEnd: true, dayCount: dayCount(day('2012-02-29')) });
    expect(s.periods.map((p) => [iso(p.unadjustedStart), iso(p.unadjustedEnd), exact(p.yearFraction)])).toEqual([
      ['2011-02-28', '2011-08-31', [1, 2]], // 180 days: both ends count as 30
      ['2011-08-31', '2012-02-29', [179, 360]],
    ]);
    const later = defineSchedule({ start: '2011-02-28', end: '2012-02-29', step: { months: 6 }, keepMonthEnd: true, dayCount: dayCount(day('2016-08-31')) });
    expect(exact(later.periods[1]!.yearFraction)).toEqual([1, 2]);
  });
});

describe('payment and fixing dates', () => {
  it("count business days of the payment and fixing calendars from the adjusted dates (Washington's Birthday, 16 February 2026 [5 U.S.C. 6103])", () => {
    const s = defineSchedule({
      start: '2025-11-16',
      end: '2026-05-16',
      step: { months: 3 },
      calendar: 'us-federal',
      convention: 'modified-following',
      payment: { businessDaysAfter: 2, from: 'end' },
      fixing: { businessDaysBefore: 2 },
      dayCount: { convention: 'actual-360', accrueOn: 'adjusted' },
    });
    expect(s.periods.map((p) => [iso(p.adjustedStart), iso(p.adjustedEnd), iso(p.fixingDayNumber!), iso(p.paymentDayNumber!), exact(p.yearFraction)])).toEqual([
      // 2025-11-16 is a Sunday: modified following gives Monday 17th; fixing two business days before: Thursday 13th.
      // 2026-02-16 (Monday, Washington's Birthday) moves to Tuesday 17th; paid two business days later, Thursday 19th.
      ['2025-11-17', '2026-02-17', '2025-11-13', '2026-02-19', [23, 90]], // 92 days / 360
      // 2026-05-16 is a Saturday: Monday 18th; the fixing counts back past Monday 16 February (the holiday): Thursday 12th.
      ['2026-02-17', '2026-05-18', '2026-02-12', '2026-05-20', [1, 4]], // 90 days / 360
    ]);
  });

  it('a lag of 0 is the date itself on a business day of the other calendar; otherwise the next (payment) or the previous (fixing) one', () => {
    const s = defineSchedule({
      start: '2026-01-19',
      end: '2026-03-19',
      step: { months: 1 },
      payment: { businessDaysAfter: 0, from: 'start', calendar: 'us-federal' },
      fixing: { businessDaysBefore: 0, calendar: 'us-federal' },
    });
    // 2026-01-19 is Birthday of Martin Luther King, Jr. (third Monday in January, 5 U.S.C. 6103); 2026-02-19 a Thursday.
    expect(s.periods.map((p) => [iso(p.fixingDayNumber!), iso(p.paymentDayNumber!)])).toEqual([
      ['2026-01-16', '2026-01-20'],
      ['2026-02-19', '2026-02-19'],
    ]);
    expect(s.periods[0]!.yearFraction).toBeUndefined();
  });
});

describe('bad input: typed errors that name the value', () => {
  const base: ScheduleOptions = { start: '2025-01-15', end: '2027-01-15', step: { months: 6 } };
  const fails = (options: Partial<ScheduleOptions> | Record<string, unknown>, Ctor: typeof KalendsTypeError | typeof KalendsRangeError, message: RegExp, code?: string) => {
    let caught: unknown;
    try {
      defineSchedule({ ...base, ...options } as ScheduleOptions);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(Ctor);
    expect((caught as Error).message).toMatch(message);
    if (code) expect((caught as { code: string }).code).toBe(code);
  };

  it('an end date before the start', () => {
    fails({ end: '2024-12-31' }, KalendsRangeError, /^options\.end: expected a date after start \("2025-01-15"\), got "2024-12-31"/, 'out-of-range');
  });

  it('Actual/Actual (ICMA) without a frequency, or with one that does not match the step', () => {
    fails({ dayCount: { convention: 'actual-actual-icma', accrueOn: 'unadjusted' } }, KalendsTypeError, /^options\.dayCount\.couponsPerYear: Actual\/Actual \(ICMA\) needs the coupon frequency.*got undefined/, 'invalid-type');
    fails({ dayCount: { convention: 'actual-actual-icma', accrueOn: 'unadjusted', couponsPerYear: 4 } }, KalendsRangeError, /^options\.dayCount\.couponsPerYear: expected 2 for a schedule that steps 6 months.*got 4/, 'out-of-range');
    fails({ step: { weeks: 2 }, dayCount: { convention: 'actual-actual-icma', accrueOn: 'unadjusted', couponsPerYear: 2 } }, KalendsRangeError, /^options\.dayCount\.convention: .*got "actual-actual-icma"/, 'unsupported');
  });

  it('30E/360 (ISDA) without a termination date, or a period ending after it', () => {
    fails({ dayCount: { convention: 'thirty-e-360-isda', accrueOn: 'unadjusted' } }, KalendsTypeError, /^options\.dayCount\.terminationDayNumber: 30E\/360 \(ISDA\) needs the Termination Date.*got undefined/, 'invalid-type');
    fails({ dayCount: { convention: 'thirty-e-360-isda', accrueOn: 'unadjusted', terminationDayNumber: day('2026-01-15') } }, KalendsRangeError, /on or before options\.dayCount\.terminationDayNumber .*2026-01-15.*got .*2026-07-15/, 'out-of-range');
  });

  it('options a convention does not use, unknown conventions and keys, missing choices', () => {
    fails({ dayCount: { convention: 'actual-360', accrueOn: 'adjusted', couponsPerYear: 2 } }, KalendsRangeError, /^options\.dayCount\.couponsPerYear: convention "actual-360" .* does not use this option, got 2/, 'unsupported');
    fails({ dayCount: { convention: 'act/360', accrueOn: 'adjusted' } }, KalendsRangeError, /^options\.dayCount\.convention: .*got "act\/360".*"actual-360"/, 'unknown-name');
    fails({ dayCount: { convention: 'actual-360' } }, KalendsTypeError, /^options\.dayCount\.accrueOn: expected "adjusted" or "unadjusted".*got undefined/);
    fails({ dayCount: { convention: 'actual-360', accrueOn: 'adjusted', calendr: 'us-federal' } }, KalendsTypeError, /^options\.dayCount\.calendr: unknown option; did you mean "calendar"/, 'unknown-name');
    fails({ dayCount: 'actual-360' }, KalendsTypeError, /^options\.dayCount: expected \{ convention, accrueOn.*got "actual-360"/);
    fails({ dayCount: { convention: 'business-252', accrueOn: 'adjusted' } }, KalendsTypeError, /^options\.dayCount\.calendar: Business\/252 needs .*got undefined/);
  });

  it('payment and fixing lags: the number, the end it counts from and a calendar are required', () => {
    fails({ payment: { businessDaysAfter: 2, from: 'end' } }, KalendsTypeError, /^options\.payment\.calendar: a payment lag counts business days, so it needs a calendar, got undefined/);
    fails({ payment: { from: 'end', calendar: 'us-federal' } }, KalendsTypeError, /^options\.payment\.businessDaysAfter: .*got undefined/);
    fails({ payment: { businessDaysAfter: 2, calendar: 'us-federal' } }, KalendsTypeError, /^options\.payment\.from: expected "end" .*got undefined/);
    fails({ payment: { businessDaysAfter: -1, from: 'end', calendar: 'us-federal' } }, KalendsRangeError, /^options\.payment\.businessDaysAfter: expected an integer from 0 to 1000, got -1/);
    fails({ payment: { businessDaysAfter: 1, from: 'middle', calendar: 'us-federal' } }, KalendsRangeError, /^options\.payment\.from: .*got "middle"/);
    fails({ fixing: { businessDaysBefore: 2.5, calendar: 'us-federal' } }, KalendsRangeError, /^options\.fixing\.businessDaysBefore: expected an integer from 0 to 1000, got 2\.5/);
    fails({ fixing: { businessDaysBefore: 2, calendar: 'us-fedral' } }, KalendsRangeError, /^options\.fixing\.calendar: unknown calendar "us-fedral"; did you mean "us-federal"/);
  });
});

// ---------------------------------------------------------------------------------------------------------------
// The brute-force reference.

const toIso = (pd: Temporal.PlainDate): string => pd.toString();

/** The schedule's unadjusted dates, rolled with Temporal (months added to the roll date, the day constrained). */
function rolledDates(start: string, end: string, months: number, stub: string): { dates: number[]; beyond: number } {
  const front = stub.endsWith('front');
  const roll = Temporal.PlainDate.from(front ? end : start);
  const interior: number[] = [];
  let beyond = 0;
  for (let k = 1; ; k++) {
    const d = day(toIso(roll.add({ months: (front ? -k : k) * months })));
    if (front ? d <= day(start) : d >= day(end)) {
      beyond = d;
      break;
    }
    interior.push(d);
  }
  if (front) interior.reverse();
  const irregular = beyond !== day(front ? start : end);
  const dates = [day(start), ...interior, day(end)];
  if (irregular && stub.startsWith('long') && dates.length > 2) dates.splice(front ? 1 : dates.length - 2, 1);
  return { dates, beyond };
}

/** n business days after `d` (0: d, or the next business day), walking one day at a time. */
function walkAfter(cal: string, d: number, n: number): number {
  if (n === 0) {
    while (!isBusinessDay(cal, d)) d++;
    return d;
  }
  for (let seen = 0; seen < n; ) if (isBusinessDay(cal, ++d)) seen++;
  return d;
}

/** n business days before `d` (0: d, or the previous business day). */
function walkBefore(cal: string, d: number, n: number): number {
  if (n === 0) {
    while (!isBusinessDay(cal, d)) d--;
    return d;
  }
  for (let seen = 0; seen < n; ) if (isBusinessDay(cal, --d)) seen++;
  return d;
}

/** An exact rational, reduced. */
function addRational(a: [bigint, bigint], n: bigint, d: bigint): [bigint, bigint] {
  let num = a[0] * d + n * a[1];
  let den = a[1] * d;
  const gcd = (x: bigint, y: bigint): bigint => (y === 0n ? x : gcd(y, x % y));
  const g = gcd(num < 0n ? -num : num, den);
  if (g > 1n) {
    num /= g;
    den /= g;
  }
  return num === 0n ? [0n, 1n] : [num, den];
}

const isLeap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

/** The fraction of [a, b), one day at a time; `grid` holds the notional coupon dates (Actual/Actual (ICMA)). */
function bruteFraction(convention: DayCountConvention, a: number, b: number, f: number, grid: number[]): [number, number] {
  let sum: [bigint, bigint] = [0n, 1n];
  for (let t = a; t < b; t++) {
    if (convention === 'actual-actual-isda') sum = addRational(sum, 1n, isLeap(new Date(t * 86_400_000).getUTCFullYear()) ? 366n : 365n);
    else if (convention === 'actual-365-fixed') sum = addRational(sum, 1n, 365n);
    else if (convention === 'actual-360') sum = addRational(sum, 1n, 360n);
    else if (convention === 'business-252') {
      if (isBusinessDay('us-federal', t)) sum = addRational(sum, 1n, 252n);
    } else {
      const j = grid.findIndex((g, i) => g <= t && t < grid[i + 1]!);
      sum = addRational(sum, 1n, BigInt(f * (grid[j + 1]! - grid[j]!)));
    }
  }
  return [Number(sum[0]), Number(sum[1])];
}

describe('every period against the brute-force reference (fast-check)', () => {
  const conventions: DayCountConvention[] = ['actual-actual-isda', 'actual-actual-icma', 'actual-365-fixed', 'actual-360', 'business-252', 'thirty-360'];
  const adjustments: BusinessDayConvention[] = ['none', 'following', 'modified-following', 'preceding'];

  it('dates, adjusted dates, payment and fixing dates and fractions', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: day('1990-01-01'), max: day('2058-12-31') }),
        fc.integer({ min: 1, max: 900 }),
        fc.constantFrom(1, 3, 6, 12),
        fc.constantFrom('short-front', 'long-front', 'short-back', 'long-back'),
        fc.constantFrom(...conventions),
        fc.constantFrom(...adjustments),
        fc.boolean(),
        fc.integer({ min: 0, max: 5 }),
        fc.boolean(),
        fc.integer({ min: 0, max: 5 }),
        (startDay, length, months, stub, convention, adjustment, adjustedAccrual, payLag, payFromEnd, fixLag) => {
          const start = iso(startDay);
          const end = iso(startDay + length);
          const accrueOn = adjustedAccrual ? 'adjusted' : 'unadjusted';
          const dayCount =
            convention === 'actual-actual-icma' ? { convention, accrueOn, couponsPerYear: 12 / months } : ({ convention, accrueOn } as const);
          const s = defineSchedule({
            start,
            end,
            step: { months },
            stub: stub as ScheduleOptions['stub'],
            calendar: 'us-federal',
            convention: adjustment,
            payment: { businessDaysAfter: payLag, from: payFromEnd ? 'end' : 'start' },
            fixing: { businessDaysBefore: fixLag },
            dayCount: dayCount as ScheduleOptions['dayCount'],
          });
          const { dates, beyond } = rolledDates(start, end, months, stub);
          const adjust = (d: number) => (adjustment === 'none' ? d : adjustDayNumber('us-federal', d, adjustment));
          const front = stub.endsWith('front');
          // The notional coupon dates: every roll date, the one past the stub included, before any long stub is joined.
          const all = rolledDates(start, end, months, stub.replace('long', 'short')).dates;
          const grid = [...all];
          grid[front ? 0 : grid.length - 1] = beyond;
          const accrualGrid = adjustedAccrual ? grid.map(adjust) : grid;
          expect(s.periods.length).toBe(dates.length - 1);
          s.periods.forEach((p, i) => {
            expect([p.unadjustedStart, p.unadjustedEnd]).toEqual([dates[i], dates[i + 1]]);
            expect([p.adjustedStart, p.adjustedEnd]).toEqual([adjust(dates[i]!), adjust(dates[i + 1]!)]);
            expect(p.paymentDayNumber).toBe(walkAfter('us-federal', payFromEnd ? p.adjustedEnd : p.adjustedStart, payLag));
            expect(p.fixingDayNumber).toBe(walkBefore('us-federal', p.adjustedStart, fixLag));
            const [a, b] = adjustedAccrual ? [p.adjustedStart, p.adjustedEnd] : [p.unadjustedStart, p.unadjustedEnd];
            const expected =
              convention === 'thirty-360'
                ? exact(yearFractionOfDays('thirty-360', a, b))!
                : bruteFraction(convention, a, b, 12 / months, accrualGrid);
            const got = p.yearFraction!;
            expect([got.numerator, got.denominator], `${convention} ${iso(a)}..${iso(b)}`).toEqual(expected[0] === 0 ? [0, 1] : expected);
            expect(got.value).toBe(got.numerator / got.denominator);
          });
          if (convention === 'business-252') {
            const first = s.periods[0]!;
            const a = adjustedAccrual ? first.adjustedStart : first.unadjustedStart;
            const b = adjustedAccrual ? first.adjustedEnd : first.unadjustedEnd;
            expect(first.yearFraction!.value * 252).toBeCloseTo(countBusinessDays('us-federal', a, b), 9);
          }
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });
});

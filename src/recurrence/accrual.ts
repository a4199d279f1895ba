/**
 * @internal The accrual parts of a finance schedule: each period's payment date (a lag of business days on a
 * payment calendar, from the period's start or end), fixing date (business days before the start, on a fixing
 * calendar) and day-count fraction (a convention of src/daycount, computed exactly). `defineSchedule` reads the
 * options once, here, and then fills every period without checking again.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError } from '../errors.js';
import { MAX_LAG_BUSINESS_DAYS } from '../bounds.js';
import { optionOf, readOptions, requireEnum, requireWhole } from '../diagnostics/index.js';
import type { BusinessOps } from './engine.js';
import {
  type DayCountConvention,
  type YearFraction,
  ISDA_DENOMINATOR,
  actual365LeapDenominator,
  actualActualIsdaNumerator,
  businessOps,
  formatPlainDate,
  greatestCommonDivisor,
  missingDayCountOption,
  readCouponsPerYear,
  readTermination,
  refuseUnusedOptions,
  requireConvention,
  requireNotAfterTermination,
  showDay,
  thirtyDays,
  thirtyE360IsdaDays,
  yearFractionFromParts,
} from './deps.js';
import type { RuleCalendarInput } from './types.js';

/** Where a schedule's payment dates fall: a lag of business days after one end of each accrual period. */
export interface SchedulePaymentOptions {
  /** Business days after the adjusted accrual date (0 or more; 0 is that date, or the next business day). */
  readonly businessDaysAfter: number;
  /** Which end of the accrual period the lag counts from: `'end'` (paid in arrears) or `'start'` (in advance). */
  readonly from: 'start' | 'end';
  /** The payment calendar (default: the schedule's `calendar`). */
  readonly calendar?: RuleCalendarInput;
}

/** Where a schedule's fixing (reset) dates fall: business days before each accrual period's adjusted start. */
export interface ScheduleFixingOptions {
  /** Business days before the adjusted start (0 or more; 0 is the start, or the business day before it). */
  readonly businessDaysBefore: number;
  /** The fixing calendar (default: the schedule's `calendar`). */
  readonly calendar?: RuleCalendarInput;
}

/** The day-count fraction of each period: a convention of docs/day-counts.md, on the dates the contract names. */
export interface ScheduleDayCountOptions {
  /** The day-count convention of each period's fraction (one of `DAY_COUNT_CONVENTIONS`, docs/day-counts.md). */
  readonly convention: DayCountConvention;
  /** Which dates accrue: the `'adjusted'` period ends (common for swaps) or the `'unadjusted'` ones (common for bonds). */
  readonly accrueOn: 'adjusted' | 'unadjusted';
  /** `actual-actual-icma` and `actual-365-leap`: coupon periods per year (1, 2, 3, 4, 6 or 12). */
  readonly couponsPerYear?: number;
  /** `thirty-e-360-isda`: the Termination Date as a day number. */
  readonly terminationDayNumber?: number;
  /** `business-252`: the calendar whose business days count (default: the schedule's `calendar`). */
  readonly calendar?: RuleCalendarInput;
}

/** @internal The payment or fixing plan, read once. */
export interface LagPlan {
  readonly n: number;
  readonly fromEnd: boolean;
  readonly cal: BusinessOps;
  readonly path: string;
}

/** @internal The day-count plan, read once. */
export interface DayCountPlan {
  readonly convention: DayCountConvention;
  readonly adjusted: boolean;
  readonly couponsPerYear: number;
  readonly termination: number;
  readonly business: BusinessOps | undefined;
}

const ACCRUE_ON: readonly ('adjusted' | 'unadjusted')[] = ['adjusted', 'unadjusted'];

function calendarFor(value: unknown, fallback: BusinessOps | undefined, path: string, what: string): BusinessOps {
  if (value !== undefined) return businessOps(value, path);
  if (fallback) return fallback;
  throw new KalendsTypeError(`${path}: ${what} counts business days, so it needs a calendar, got undefined; add calendar: 'us-federal' (or your own) here or to the schedule`, {
    code: 'invalid-type',
    received: undefined,
    path,
  });
}

function requirePlainObject(name: string, value: unknown, shape: string): void {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new KalendsTypeError(`${name}: expected ${shape}, got ${value === null ? 'null' : Array.isArray(value) ? 'an array' : typeof value === 'string' ? JSON.stringify(value) : String(value)}`, {
      code: 'invalid-type',
      received: value,
      path: name,
    });
  }
}

/** @internal Reads `options.payment`. */
export function readPayment(value: unknown, scheduleCalendar: BusinessOps | undefined): LagPlan | undefined {
  if (value === undefined) return undefined;
  const path = 'options.payment';
  requirePlainObject(path, value, "{ businessDaysAfter, from: 'start' | 'end', calendar? }");
  const o = readOptions(path, value, ['businessDaysAfter', 'from', 'calendar']);
  if (optionOf(o, 'businessDaysAfter') === undefined) {
    throw new KalendsTypeError(`${path}.businessDaysAfter: expected the payment lag in business days (0 to ${MAX_LAG_BUSINESS_DAYS}), got undefined; pass { businessDaysAfter: 2 } for a payment two business days after the period`, {
      code: 'invalid-type',
      received: undefined,
      path: `${path}.businessDaysAfter`,
    });
  }
  const n = requireWhole(`${path}.businessDaysAfter`, o['businessDaysAfter'], 0, MAX_LAG_BUSINESS_DAYS);
  if (optionOf(o, 'from') === undefined) {
    throw new KalendsTypeError(`${path}.from: expected "end" (paid in arrears, after each period) or "start" (in advance), got undefined; state which end of the period the lag counts from`, {
      code: 'invalid-type',
      received: undefined,
      path: `${path}.from`,
    });
  }
  const from = requireEnum(`${path}.from`, o['from'], ['start', 'end'] as const);
  const cal = calendarFor(optionOf(o, 'calendar'), scheduleCalendar, `${path}.calendar`, 'a payment lag');
  return { n, fromEnd: from === 'end', cal, path: `${path}.calendar` };
}

/** @internal Reads `options.fixing`. */
export function readFixing(value: unknown, scheduleCalendar: BusinessOps | undefined): LagPlan | undefined {
  if (value === undefined) return undefined;
  const path = 'options.fixing';
  requirePlainObject(path, value, '{ businessDaysBefore, calendar? }');
  const o = readOptions(path, value, ['businessDaysBefore', 'calendar']);
  if (optionOf(o, 'businessDaysBefore') === undefined) {
    throw new KalendsTypeError(`${path}.businessDaysBefore: expected the fixing lag in business days before the period's start (0 to ${MAX_LAG_BUSINESS_DAYS}), got undefined; pass { businessDaysBefore: 2 } for a fixing two business days before`, {
      code: 'invalid-type',
      received: undefined,
      path: `${path}.businessDaysBefore`,
    });
  }
  const n = requireWhole(`${path}.businessDaysBefore`, o['businessDaysBefore'], 0, MAX_LAG_BUSINESS_DAYS);
  const cal = calendarFor(optionOf(o, 'calendar'), scheduleCalendar, `${path}.calendar`, 'a fixing lag');
  return { n, fromEnd: false, cal, path: `${path}.calendar` };
}

/**
 * @internal Reads `options.dayCount`. `monthsPerStep` is the schedule's step in months (undefined for steps of
 * days, weeks or a rule): Actual/Actual (ICMA) needs its notional periods, so it needs a step of whole months that
 * matches `couponsPerYear`.
 */
export function readDayCount(value: unknown, scheduleCalendar: BusinessOps | undefined, monthsPerStep: number | undefined): DayCountPlan | undefined {
  if (value === undefined) return undefined;
  const path = 'options.dayCount';
  requirePlainObject(path, value, "{ convention, accrueOn: 'adjusted' | 'unadjusted', ... }");
  const o = readOptions(path, value, ['convention', 'accrueOn', 'couponsPerYear', 'terminationDayNumber', 'calendar']);
  if (optionOf(o, 'convention') === undefined) {
    throw new KalendsTypeError(`${path}.convention: expected a day-count convention such as "actual-360" (see DAY_COUNT_CONVENTIONS), got undefined`, {
      code: 'invalid-type',
      received: undefined,
      path: `${path}.convention`,
    });
  }
  const convention = requireConvention(`${path}.convention`, o['convention']);
  if (optionOf(o, 'accrueOn') === undefined) {
    throw new KalendsTypeError(`${path}.accrueOn: expected "adjusted" or "unadjusted" (which period ends accrue: the contract says), got undefined`, {
      code: 'invalid-type',
      received: undefined,
      path: `${path}.accrueOn`,
    });
  }
  const adjusted = requireEnum(`${path}.accrueOn`, o['accrueOn'], ACCRUE_ON) === 'adjusted';
  const rest: Record<string, unknown> = {};
  for (const k of ['couponsPerYear', 'terminationDayNumber', 'calendar']) if (optionOf(o, k) !== undefined) rest[k] = o[k];
  // The schedule computes Actual/Actual (ICMA)'s regular periods itself; the calendar of Business/252 may come from the schedule.
  refuseUnusedOptions(convention, rest, {}, path);
  let couponsPerYear = 0;
  let termination = 0;
  let business: BusinessOps | undefined;
  if (convention === 'actual-actual-icma' || convention === 'actual-365-leap') couponsPerYear = readCouponsPerYear(convention, rest, path);
  if (convention === 'thirty-e-360-isda') termination = readTermination(rest, path);
  if (convention === 'business-252') {
    const given = optionOf(rest, 'calendar');
    if (given === undefined && !scheduleCalendar) {
      throw missingDayCountOption('business-252', 'calendar', 'the business calendar whose business days it counts', "{ calendar: 'euro-t2' } here or on the schedule", path);
    }
    business = given !== undefined ? businessOps(given, `${path}.calendar`) : scheduleCalendar;
  }
  if (convention === 'actual-actual-icma') {
    if (monthsPerStep === undefined) {
      throw new KalendsRangeError(
        `${path}.convention: Actual/Actual (ICMA) measures each period against its regular coupon period, which a schedule finds by rolling whole months; a step of days, weeks or a rule has none, got ${JSON.stringify(convention)} with such a step; use a { months } step, or compute the fractions with yearFractionOfDays`,
        { code: 'unsupported', received: convention, path: `${path}.convention` },
      );
    }
    if (monthsPerStep * couponsPerYear !== 12) {
      throw new KalendsRangeError(
        `${path}.couponsPerYear: expected ${Number.isInteger(12 / monthsPerStep) ? 12 / monthsPerStep : 'a frequency'} for a schedule that steps ${monthsPerStep} month${monthsPerStep === 1 ? '' : 's'} (coupon periods per year times months per step is 12), got ${couponsPerYear}`,
        { code: 'out-of-range', received: couponsPerYear, path: `${path}.couponsPerYear` },
      );
    }
  }
  return { convention, adjusted, couponsPerYear, termination, business };
}

/** @internal Whether `d` is a business day of `cal` that lies within its years (false outside them). */
export function isOpenDay(cal: BusinessOps, d: number): boolean {
  return d >= cal.firstDay && d < cal.endDay && cal.nthInRangeUnchecked(d, d + 1, 1) === d;
}

/**
 * @internal The payment or fixing date of a period whose adjusted ends are `start` and `end`. The fast path looks
 * in a window of days around the date (read a word of the calendar's bitsets at a time); a date the window does
 * not hold (a long run of closed days, the calendar's edge) takes the checked path.
 */
export function lagDate(plan: LagPlan, start: number, end: number, fixing: boolean, index: number): number {
  const base = plan.fromEnd ? end : start;
  const cal = plan.cal;
  const n = plan.n;
  const width = 2 * n + 16;
  // Payment: the nth business day after base (n = 0: base or the next); fixing: the nth before (n = 0: base or the previous).
  const lo = fixing ? base + (n === 0 ? 1 : 0) - width : n === 0 ? base : base + 1;
  const hi = fixing ? base + (n === 0 ? 1 : 0) : lo + width;
  if (lo >= cal.firstDay && hi <= cal.endDay) {
    const d = cal.nthInRangeUnchecked(lo, hi, fixing ? -Math.max(n, 1) : Math.max(n, 1));
    if (d === d) return d;
  }
  let d: number;
  if (!fixing) d = cal.shiftOrNaN(base, n);
  else if (n === 0) d = base < cal.firstDay || base >= cal.endDay ? Number.NaN : cal.isBusinessDay(base) ? base : cal.shiftOrNaN(base, -1);
  else d = cal.shiftOrNaN(base, -n);
  if (d !== d) {
    throw new KalendsRangeError(
      `${plan.path}: the ${fixing ? 'fixing' : 'payment'} date of period ${index}, ${n} business day${n === 1 ? '' : 's'} ${fixing ? 'before' : 'after'} ${formatPlainDate(base)}, lies outside the years calendar ${JSON.stringify(cal.id)} covers, got ${showDay(base)}; use a calendar that covers the schedule`,
      { code: 'out-of-range', received: base, path: plan.path },
    );
  }
  return d;
}

/**
 * @internal The day-count fraction of `[a, b)` (the dates the plan accrues on). `grid` is, for Actual/Actual
 * (ICMA), the regular coupon dates on the same dates (the schedule's dates with the stub's notional date in
 * place of its irregular end), and `at` the index in it of the last grid date on or before `a`.
 */
export function fractionOf(plan: DayCountPlan, a: number, b: number, grid: ArrayLike<number> | undefined, at: number, index: number): YearFraction {
  switch (plan.convention) {
    case 'one-one':
      return yearFractionFromParts(a === b ? 0 : 1, 1);
    case 'actual-actual-isda':
      return yearFractionFromParts(actualActualIsdaNumerator(a, b), ISDA_DENOMINATOR);
    case 'actual-365-fixed':
      return yearFractionFromParts(b - a, 365);
    case 'actual-360':
      return yearFractionFromParts(b - a, 360);
    case 'thirty-360':
      return yearFractionFromParts(thirtyDays(a, b, false), 360);
    case 'thirty-e-360':
      return yearFractionFromParts(thirtyDays(a, b, true), 360);
    case 'thirty-e-360-isda':
      requireNotAfterTermination(`periods[${index}] end`, b, plan.termination, 'options.dayCount.terminationDayNumber');
      return yearFractionFromParts(thirtyE360IsdaDays(a, b, plan.termination), 360);
    case 'actual-365-leap':
      return yearFractionFromParts(b - a, actual365LeapDenominator(a, b, plan.couponsPerYear === 1));
    case 'business-252':
      return yearFractionFromParts(plan.business!.countBusinessDays(a, b), 252);
    case 'actual-actual-icma':
      return icmaFraction(plan.couponsPerYear, a, b, grid!, at);
  }
}

/**
 * Actual/Actual (ICMA), ICMA Rule 251: the days of `[a, b)` in each regular (or notional) coupon period it
 * overlaps, each over `couponsPerYear` times that period's days, added exactly. A regular period is 1 /
 * couponsPerYear; a short stub is its days over its notional period's; a long stub adds its two parts.
 */
function icmaFraction(f: number, a: number, b: number, grid: ArrayLike<number>, at: number): YearFraction {
  let num = 0;
  let den = 1;
  let i = at;
  let s = a;
  while (s < b) {
    const g0 = grid[i]!;
    const g1 = grid[i + 1]!;
    const part = Math.min(b, g1) - s;
    const d = f * (g1 - g0);
    num = num * d + part * den;
    den *= d;
    const g = greatestCommonDivisor(num, den);
    num /= g;
    den /= g;
    s = g1;
    i++;
  }
  return yearFractionFromParts(num, den);
}

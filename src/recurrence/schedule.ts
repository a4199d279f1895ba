/**
 * Finance schedules: the periods between a start (effective) date and an end (termination) date at a regular
 * step, with a stub where the step does not divide the span. Every period carries its unadjusted dates and its
 * dates adjusted by a business-day convention of the business layer (ISDA 2006 Definitions, section 4.12).
 *
 * Where the stub goes follows common practice: a front stub is found by rolling back from the end date, a back
 * stub by rolling forward from the start date; a long stub joins the short stub to its neighbouring regular
 * period. Dates are rolled as anchor + n x step from the roll date, never by adding a step repeatedly, so a
 * schedule rolling from the 31st comes back to the 31st after a short month. Each period can also carry its
 * payment date, fixing date and day-count fraction (./accrual.ts).
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { packedYmdUnchecked } from '../civil/gregorian.js';
import { dayCountOfMonthIndex, dayOfPacked, firstDayNumberOfMonthIndex, monthIndexOfPacked } from '../civil/names.js';
import { MAX_RULE_EVERY, MAX_SCHEDULE_PERIODS } from '../bounds.js';
import { isRecord, ownField, readOptions, requireBoolean, requireEnum, requireWhole } from '../diagnostics/index.js';
import { BUSINESS_DAY_CONVENTIONS } from '../business/index.js';
import { businessOps, toDayNumber } from './deps.js';
import { compiledOf, fillOccurrences } from './generate.js';
import { Sink } from './engine.js';
import type { RuleCalendarInput, Convention, DateInput, Rule } from './types.js';
import type { YearFraction } from './deps.js';
import {
  type DayCountPlan,
  isOpenDay,
  type LagPlan,
  type ScheduleDayCountOptions,
  type ScheduleFixingOptions,
  type SchedulePaymentOptions,
  fractionOf,
  lagDate,
  readDayCount,
  readFixing,
  readPayment,
} from './accrual.js';

export type { ScheduleDayCountOptions, ScheduleFixingOptions, SchedulePaymentOptions };

/** Where an irregular period goes, and whether it stays short or joins its neighbour. */
export type StubPlacement = 'short-front' | 'long-front' | 'short-back' | 'long-back';

/** The regular step of a schedule: months, weeks or days, or the dates of a rule. */
export type ScheduleStep = {
  /** Months per regular period. */
  readonly months: number;
} | {
  /** Weeks per regular period. */
  readonly weeks: number;
} | {
  /** Days per regular period. */
  readonly days: number;
} | Rule;

/** What {@link defineSchedule} needs. */
export interface ScheduleOptions {
  /** The start (effective) date: the first period starts here. */
  readonly start: DateInput;
  /** The end (termination) date: the last period ends here. */
  readonly end: DateInput;
  /** The regular step: months, weeks, days, or the dates of a rule. */
  readonly step: ScheduleStep;
  /** Where the stub goes when the step does not divide the span (default `'short-front'`). */
  readonly stub?: StubPlacement;
  /**
   * When the roll date (the end date for front stubs, the start date for back stubs) is the last day of its
   * month, put every rolled date on a month end (month steps only; default false).
   */
  readonly keepMonthEnd?: boolean;
  /** Business calendar for the adjusted dates. */
  readonly calendar?: RuleCalendarInput;
  /** Business-day convention for the adjusted dates (default `'none'`; needs `calendar` otherwise). */
  readonly convention?: Convention;
  /** Each period's payment date: business days after its adjusted end (or start), on a payment calendar. */
  readonly payment?: SchedulePaymentOptions;
  /** Each period's fixing (reset) date: business days before its adjusted start, on a fixing calendar. */
  readonly fixing?: ScheduleFixingOptions;
  /** Each period's day-count fraction, exactly, under a convention of docs/day-counts.md. */
  readonly dayCount?: ScheduleDayCountOptions;
}

/** One period of a schedule. Periods are `[start, end)`: each ends where the next starts. */
export interface SchedulePeriod {
  /** The period's start as the step gives it (a day number). */
  readonly unadjustedStart: number;
  /** The period's end as the step gives it (a day number, exclusive). */
  readonly unadjustedEnd: number;
  /** The start after the business-day convention (the unadjusted start when there is none). */
  readonly adjustedStart: number;
  /** The end after the business-day convention (the unadjusted end when there is none). */
  readonly adjustedEnd: number;
  /** `'front'` or `'back'` for the irregular (stub) period, otherwise undefined. */
  readonly stub: 'front' | 'back' | undefined;
  /** The payment date (with the `payment` option), otherwise undefined. */
  readonly paymentDayNumber: number | undefined;
  /** The fixing date (with the `fixing` option), otherwise undefined. */
  readonly fixingDayNumber: number | undefined;
  /** The day-count fraction of the accrual period (with the `dayCount` option), otherwise undefined. */
  readonly yearFraction: YearFraction | undefined;
}

/** A schedule: its periods in order. */
export interface Schedule {
  /** The periods, first to last. */
  readonly periods: readonly SchedulePeriod[];
}

const PLACEMENTS: readonly StubPlacement[] = ['short-front', 'long-front', 'short-back', 'long-back'];

/**
 * Rolls a date by whole months: `roll(months)` is the date `months` months from `rollDate`, its day kept where
 * the month has it (the month end, under `keepMonthEnd`, when the roll date is one). The roll date is decoded once.
 */
function monthRoller(rollDate: number, keepMonthEnd: boolean): (months: number) => number {
  const p = packedYmdUnchecked(rollDate);
  const d = dayOfPacked(p);
  const from = monthIndexOfPacked(p);
  const eom = keepMonthEnd && d === dayCountOfMonthIndex(from);
  return (months) => {
    const target = from + months;
    const len = dayCountOfMonthIndex(target);
    return firstDayNumberOfMonthIndex(target) + (eom ? len : Math.min(d, len)) - 1;
  };
}

function stepOf(step: unknown): { unit: 'months' | 'days'; n: number } | Rule {
  if (isRecord(step)) {
    if (ownField(step, 'kind') !== undefined && 'definition' in step) {
      compiledOf(step, 'options.step');
      return step as unknown as Rule;
    }
    const s = readOptions('options.step', step, ['months', 'weeks', 'days']);
    const keys = ['months', 'weeks', 'days'].filter((k) => s[k] !== undefined);
    if (keys.length === 1) {
      const k = keys[0]!;
      const n = requireWhole(`options.step.${k}`, s[k], 1, MAX_RULE_EVERY);
      return k === 'months' ? { unit: 'months', n } : { unit: 'days', n: k === 'weeks' ? 7 * n : n };
    }
  }
  throw new KalendsTypeError(`options.step: expected one of { months: n }, { weeks: n }, { days: n }, or a date rule from defineRule, got ${describeValue(step)}`, {
    code: 'invalid-type',
    received: step,
  });
}

/** A date option: anything `toDayNumber` reads, with the option named in the message. */
function dateOption(name: string, v: unknown): number {
  if (v === undefined) throw new KalendsTypeError(`${name}: expected a date (an ISO 8601 date such as "2025-01-31" or a day number), got undefined`, { code: 'invalid-type', received: v });
  try {
    return toDayNumber(v);
  } catch (e) {
    const Ctor = e instanceof TypeError ? KalendsTypeError : KalendsRangeError;
    throw new Ctor(`${name}: expected a date (an ISO 8601 date such as "2025-01-31" or a day number); ${(e as Error).message.replace(/^[A-Za-z]+: /, '')}`, {
      code: e instanceof TypeError ? 'invalid-type' : 'out-of-range',
      received: v,
    });
  }
}

function tooManyPeriods(step: unknown): KalendsRangeError {
  return new KalendsRangeError(`step: the schedule would have more than ${MAX_SCHEDULE_PERIODS} periods; use a longer step or a shorter span`, {
    code: 'limit-exceeded',
    received: step,
  });
}

/**
 * Builds the periods between `start` and `end` at a regular step, with a stub placed as `stub` says, and the
 * unadjusted and adjusted dates of every period.
 *
 * - `'short-front'`: roll back from `end` by whole steps; what is left at the front is a short first period.
 * - `'long-front'`: as short-front, then the short first period joins the next one.
 * - `'short-back'` and `'long-back'`: the same rolling forward from `start`, with the stub at the back.
 *
 * With a rule as the step, the rule's occurrences strictly between `start` and `end` are the interior dates;
 * a long stub joins an irregular first (front) or last (back) period to its neighbour.
 *
 * Accrual parts, each on request: `payment` gives every period a `paymentDayNumber` (business days after its
 * adjusted end or start, on a payment calendar), `fixing` a `fixingDayNumber` (business days before its adjusted
 * start, on a fixing calendar), and `dayCount` its exact `yearFraction` under a day-count convention, on the
 * adjusted or unadjusted dates; Actual/Actual (ICMA) measures a stub against its notional regular period (ICMA
 * Rule 251). Contracts define their own conventions: a confirmation or an agreement overrides any default.
 *
 * @example
 * ```ts
 * const s = defineSchedule({ start: '2025-01-15', end: '2026-01-31', step: { months: 3 }, stub: 'short-front', keepMonthEnd: true });
 * s.periods.map((p) => formatPlainDate(p.unadjustedStart));
 * // ['2025-01-15', '2025-01-31', '2025-04-30', '2025-07-31', '2025-10-31']
 * const leg = defineSchedule({
 *   start: '2025-11-16', end: '2026-05-16', step: { months: 3 }, calendar: 'us-federal', convention: 'modified-following',
 *   payment: { businessDaysAfter: 2, from: 'end' }, fixing: { businessDaysBefore: 2 },
 *   dayCount: { convention: 'actual-360', accrueOn: 'adjusted' },
 * });
 * formatPlainDate(leg.periods[0].paymentDayNumber); // '2026-02-19'
 * leg.periods[0].yearFraction; // { numerator: 23, denominator: 90, value: 0.2555... }
 * ```
 */
export function defineSchedule(options: ScheduleOptions): Schedule {
  if (options === undefined) throw new KalendsTypeError('options: expected { start, end, step, ... }, got undefined', { code: 'invalid-type', received: options });
  const o = readOptions('options', options, ['start', 'end', 'step', 'stub', 'keepMonthEnd', 'calendar', 'convention', 'payment', 'fixing', 'dayCount']);
  const start = dateOption('options.start', o['start']);
  const end = dateOption('options.end', o['end']);
  if (end <= start) {
    throw new KalendsRangeError(`options.end: expected a date after start (${describeValue(o['start'])}), got ${describeValue(o['end'])}; a schedule runs forward`, {
      code: 'out-of-range',
      received: o['end'],
    });
  }
  const stub = requireEnum('options.stub', o['stub'], PLACEMENTS, 'short-front');
  const convention = requireEnum('options.convention', o['convention'], BUSINESS_DAY_CONVENTIONS, 'none');
  const keepMonthEnd = requireBoolean('options.keepMonthEnd', o['keepMonthEnd'], false);
  const cal = o['calendar'] !== undefined ? businessOps(o['calendar'], 'options.calendar') : undefined;
  if (convention !== 'none' && !cal) {
    throw new KalendsTypeError(`options.calendar: convention ${JSON.stringify(convention)} adjusts to business days, so a calendar is required; add calendar: 'us-federal' (or your own)`, {
      code: 'invalid-type',
      received: undefined,
    });
  }
  const step = stepOf(o['step']);
  const payment = readPayment(o['payment'], cal);
  const fixing = readFixing(o['fixing'], cal);
  const dayCount = readDayCount(o['dayCount'], cal, 'unit' in step && step.unit === 'months' ? step.n : undefined);
  const front = stub === 'short-front' || stub === 'long-front';
  const long = stub === 'long-front' || stub === 'long-back';
  const dates: number[] = [];
  let irregular: boolean;
  // The roll date that passed the start (front) or the end (back): the stub's notional regular date.
  let beyond = Number.NaN;
  if ('unit' in step) {
    // Fails at once when the span holds more whole steps than a schedule may have periods.
    const steps = step.unit === 'months' ? (monthIndexOfPacked(packedYmdUnchecked(end)) - monthIndexOfPacked(packedYmdUnchecked(start))) / step.n : (end - start) / step.n;
    if (steps > MAX_SCHEDULE_PERIODS + 1) throw tooManyPeriods(o['step']);
    const months = step.unit === 'months' ? monthRoller(front ? end : start, keepMonthEnd) : undefined;
    const roll = (k: number): number => (months ? months((front ? -k : k) * step.n) : front ? end - k * step.n : start + k * step.n);
    const interior: number[] = [];
    let k = 1;
    for (;;) {
      const d = roll(k);
      if (front ? d <= start : d >= end) {
        irregular = d !== (front ? start : end);
        beyond = d;
        break;
      }
      interior.push(d);
      if (interior.length > MAX_SCHEDULE_PERIODS) throw tooManyPeriods(o['step']);
      k++;
    }
    if (front) interior.reverse();
    // No spread: a schedule may have a million dates, more than a call's arguments may hold.
    dates.push(start);
    for (const d of interior) dates.push(d);
    dates.push(end);
  } else {
    const c = compiledOf(step, 'options.step');
    if (c.values !== 'dates') throw new KalendsTypeError(`options.step: expected a rule of dates, got a rule of instants (kind ${JSON.stringify(step.kind)}); a schedule steps by dates`, { code: 'invalid-type', received: step });
    if (Number.isFinite(c.engine.maxGap) && c.convention === 'none' && (Math.min(end, c.rawEnd) - Math.max(start, c.rawStart)) / c.engine.maxGap > MAX_SCHEDULE_PERIODS + 1) {
      throw tooManyPeriods(step);
    }
    const out = new Sink(64);
    fillOccurrences(c, start + 1, end, out, ['options.start', 'options.end']);
    if (out.length > MAX_SCHEDULE_PERIODS) throw tooManyPeriods(step);
    dates.push(start);
    for (let i = 0; i < out.length; i++) dates.push(out.data[i]!);
    dates.push(end);
    const edge = new Sink(4);
    fillOccurrences(c, front ? start : end, (front ? start : end) + 1, edge, ['options.start', 'options.end']);
    irregular = edge.length === 0;
  }
  let stubSide: 'front' | 'back' | undefined = irregular ? (front ? 'front' : 'back') : undefined;
  // Actual/Actual (ICMA): the regular coupon dates, with the stub's notional date in place of its irregular end.
  let grid: number[] | undefined;
  if (dayCount?.convention === 'actual-actual-icma') {
    grid = dates.slice();
    grid[front ? 0 : grid.length - 1] = beyond;
  }
  if (irregular && long && dates.length > 2) {
    dates.splice(front ? 1 : dates.length - 2, 1);
  }
  if (dates.length === 2 && !irregular) stubSide = undefined;
  // A business day stays where it is: only the others go through the convention (and its checks).
  const adjust = (d: number): number => (cal && convention !== 'none' && !isOpenDay(cal, d) ? cal.adjust(d, convention) : d);
  const adjusted = dates.map(adjust);
  if (grid && dayCount!.adjusted) grid = grid.map(adjust);
  return Object.freeze({ periods: Object.freeze(periodsOf(dates, adjusted, stubSide, payment, fixing, dayCount, grid)) });
}

/** The periods of a schedule from its dates, with the accrual parts the options asked for. */
function periodsOf(
  dates: readonly number[],
  adjusted: readonly number[],
  stubSide: 'front' | 'back' | undefined,
  payment: LagPlan | undefined,
  fixing: LagPlan | undefined,
  dayCount: DayCountPlan | undefined,
  grid: readonly number[] | undefined,
): SchedulePeriod[] {
  const periods: SchedulePeriod[] = [];
  const accrual = dayCount?.adjusted ? adjusted : dates;
  // The grid date on or before each period's start (Actual/Actual (ICMA)): periods and grid both increase.
  let at = 0;
  for (let i = 0; i + 1 < dates.length; i++) {
    const isStub = stubSide === 'front' ? i === 0 : stubSide === 'back' ? i === dates.length - 2 : false;
    const a = accrual[i]!;
    const b = accrual[i + 1]!;
    if (grid) while (at + 2 < grid.length && grid[at + 1]! <= a) at++;
    periods.push(
      Object.freeze({
        unadjustedStart: dates[i]!,
        unadjustedEnd: dates[i + 1]!,
        adjustedStart: adjusted[i]!,
        adjustedEnd: adjusted[i + 1]!,
        stub: isStub ? stubSide : undefined,
        paymentDayNumber: payment ? lagDate(payment, adjusted[i]!, adjusted[i + 1]!, false, i) : undefined,
        fixingDayNumber: fixing ? lagDate(fixing, adjusted[i]!, adjusted[i + 1]!, true, i) : undefined,
        yearFraction: dayCount ? fractionOf(dayCount, a, b, grid, at, i) : undefined,
      }),
    );
  }
  return periods;
}

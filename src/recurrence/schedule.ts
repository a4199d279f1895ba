/**
 * Finance schedules: the periods between a start (effective) date and an end (termination) date at a regular
 * step, with a stub where the step does not divide the span. Every period carries its unadjusted dates and its
 * dates adjusted by a business-day convention of the business layer (ISDA 2006 Definitions, section 4.12).
 *
 * Where the stub goes follows common practice: a front stub is found by rolling back from the end date, a back
 * stub by rolling forward from the start date; a long stub joins the short stub to its neighbouring regular
 * period. Dates are rolled as anchor + n x step from the roll date, never by adding a step repeatedly, so a
 * schedule rolling from the 31st comes back to the 31st after a short month.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { dayCountOfMonthUnchecked, packedYmdUnchecked, dayNumberFromYmdUnchecked } from '../civil/gregorian.js';
import { MIN_YEAR } from '../bounds.js';
import { businessOps, toDayNumber } from './deps.js';
import { compiledOf, fillOccurrences } from './generate.js';
import { Sink } from './engine.js';
import type { RuleCalendarInput, Convention, DateInput, Rule } from './types.js';

/** Where an irregular period goes, and whether it stays short or joins its neighbour. */
export type StubPlacement = 'short-front' | 'long-front' | 'short-back' | 'long-back';

/** The regular step of a schedule: months, weeks or days, or the dates of a rule. */
export type ScheduleStep = { readonly months: number } | { readonly weeks: number } | { readonly days: number } | Rule;

/** What {@link defineSchedule} needs. */
export interface ScheduleOptions {
  /** The start (effective) date: the first period starts here. */
  readonly start: DateInput;
  /** The end (termination) date: the last period ends here. */
  readonly end: DateInput;
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
}

/** One period of a schedule. Periods are `[start, end)`: each ends where the next starts. */
export interface SchedulePeriod {
  readonly unadjustedStart: number;
  readonly unadjustedEnd: number;
  readonly adjustedStart: number;
  readonly adjustedEnd: number;
  /** `'front'` or `'back'` for the irregular (stub) period, otherwise undefined. */
  readonly stub: 'front' | 'back' | undefined;
}

/** A schedule: its periods in order. */
export interface Schedule {
  readonly periods: readonly SchedulePeriod[];
}

const MAX_PERIODS = 1_000_000;
const PLACEMENTS: readonly StubPlacement[] = ['short-front', 'long-front', 'short-back', 'long-back'];

function rollMonths(rollDate: number, months: number, keepMonthEnd: boolean): number {
  const p = packedYmdUnchecked(rollDate);
  const y = Math.floor(p / 512) + MIN_YEAR;
  const m = (p >> 5) & 15;
  const d = p & 31;
  const eom = keepMonthEnd && d === dayCountOfMonthUnchecked(y, m);
  const mi = y * 12 + m - 1 + months;
  const ty = Math.floor(mi / 12);
  const tm = mi - ty * 12 + 1;
  const len = dayCountOfMonthUnchecked(ty, tm);
  return dayNumberFromYmdUnchecked(ty, tm, eom ? len : Math.min(d, len));
}

function stepOf(step: unknown): { unit: 'months' | 'days'; n: number } | Rule {
  if (typeof step === 'object' && step !== null) {
    const s = step as Record<string, unknown>;
    const keys = ['months', 'weeks', 'days'].filter((k) => s[k] !== undefined);
    if (keys.length === 1) {
      const k = keys[0]!;
      const n = s[k];
      if (typeof n !== 'number' || !Number.isInteger(n) || n < 1 || n > 100_000) {
        throw new KalendsRangeError(`step.${k}: expected an integer from 1 to 100000, got ${describeValue(n)}`, { code: 'out-of-range', received: n });
      }
      return k === 'months' ? { unit: 'months', n } : { unit: 'days', n: k === 'weeks' ? 7 * n : n };
    }
    if (keys.length === 0 && 'kind' in s && 'definition' in s) {
      compiledOf(step, 'step');
      return step as Rule;
    }
  }
  throw new KalendsTypeError(`step: expected { months: n }, { weeks: n }, { days: n } or a date rule, got ${describeValue(step)}`, {
    code: 'invalid-type',
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
 * @example
 * ```ts
 * const s = defineSchedule({ start: '2025-01-15', end: '2026-01-31', step: { months: 3 }, stub: 'short-front', keepMonthEnd: true });
 * s.periods.map((p) => formatPlainDate(p.unadjustedStart));
 * // ['2025-01-15', '2025-01-31', '2025-04-30', '2025-07-31', '2025-10-31']
 * ```
 */
export function defineSchedule(options: ScheduleOptions): Schedule {
  if (typeof options !== 'object' || options === null) {
    throw new KalendsTypeError(`options: expected { start, end, step, ... }, got ${describeValue(options)}`, { code: 'invalid-type', received: options });
  }
  const start = toDayNumber(options.start);
  const end = toDayNumber(options.end);
  if (end <= start) {
    throw new KalendsRangeError(`end: expected a date after start (${describeValue(options.start)}), got ${describeValue(options.end)}`, {
      code: 'out-of-range',
      received: options.end,
    });
  }
  const stub = options.stub ?? 'short-front';
  if (!PLACEMENTS.includes(stub)) {
    throw new KalendsRangeError(`stub: expected one of ${PLACEMENTS.map((p) => JSON.stringify(p)).join(', ')}, got ${describeValue(stub)}`, {
      code: 'out-of-range',
      received: stub,
    });
  }
  const convention = options.convention ?? 'none';
  const cal = options.calendar !== undefined ? businessOps(options.calendar, 'calendar') : undefined;
  if (convention !== 'none' && !cal) {
    throw new KalendsTypeError(`calendar: convention ${JSON.stringify(convention)} adjusts to business days, so a calendar is required`, {
      code: 'invalid-type',
      received: undefined,
    });
  }
  const step = stepOf(options.step);
  const front = stub === 'short-front' || stub === 'long-front';
  const long = stub === 'long-front' || stub === 'long-back';
  const dates: number[] = [];
  let irregular: boolean;
  if ('unit' in step) {
    const roll = (k: number): number =>
      step.unit === 'months' ? rollMonths(front ? end : start, (front ? -k : k) * step.n, options.keepMonthEnd === true) : (front ? end - k * step.n : start + k * step.n);
    const interior: number[] = [];
    let k = 1;
    for (;;) {
      const d = roll(k);
      if (front ? d <= start : d >= end) {
        irregular = d !== (front ? start : end);
        break;
      }
      interior.push(d);
      if (interior.length > MAX_PERIODS) {
        throw new KalendsRangeError(`the schedule would have more than ${MAX_PERIODS} periods; use a longer step`, { code: 'limit-exceeded', received: options.step });
      }
      k++;
    }
    if (front) interior.reverse();
    dates.push(start, ...interior, end);
  } else {
    const c = compiledOf(step, 'step');
    if (c.values !== 'dates') throw new KalendsTypeError('step: expected a rule of dates, got a rule of instants', { code: 'invalid-type', received: step });
    const out = new Sink(64);
    fillOccurrences(c, start + 1, end, out);
    if (out.length > MAX_PERIODS) throw new KalendsRangeError(`the schedule would have more than ${MAX_PERIODS} periods`, { code: 'limit-exceeded', received: step });
    dates.push(start, ...Array.from(out.data.subarray(0, out.length)), end);
    const edge = new Sink(4);
    fillOccurrences(c, front ? start : end, (front ? start : end) + 1, edge);
    irregular = edge.length === 0;
  }
  let stubSide: 'front' | 'back' | undefined = irregular ? (front ? 'front' : 'back') : undefined;
  if (irregular && long && dates.length > 2) {
    dates.splice(front ? 1 : dates.length - 2, 1);
  }
  if (dates.length === 2 && !irregular) stubSide = undefined;
  const adjust = (d: number): number => (cal && convention !== 'none' ? cal.adjust(d, convention) : d);
  const adjusted = dates.map(adjust);
  const periods: SchedulePeriod[] = [];
  for (let i = 0; i + 1 < dates.length; i++) {
    const isStub = stubSide === 'front' ? i === 0 : stubSide === 'back' ? i === dates.length - 2 : false;
    periods.push(
      Object.freeze({
        unadjustedStart: dates[i]!,
        unadjustedEnd: dates[i + 1]!,
        adjustedStart: adjusted[i]!,
        adjustedEnd: adjusted[i + 1]!,
        stub: isStub ? stubSide : undefined,
      }),
    );
  }
  return Object.freeze({ periods: Object.freeze(periods) });
}

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
import { packedYmdUnchecked } from '../civil/gregorian.js';
import { dayCountOfMonthIndex, dayOfPacked, firstDayNumberOfMonthIndex, monthIndexOfPacked } from '../civil/names.js';
import { MAX_RULE_EVERY, MAX_SCHEDULE_PERIODS } from '../bounds.js';
import { isRecord, ownField, readOptions, requireBoolean, requireEnum, requireWhole } from '../diagnostics/index.js';
import { BUSINESS_DAY_CONVENTIONS } from '../business/index.js';
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

const PLACEMENTS: readonly StubPlacement[] = ['short-front', 'long-front', 'short-back', 'long-back'];

function rollMonths(rollDate: number, months: number, keepMonthEnd: boolean): number {
  const p = packedYmdUnchecked(rollDate);
  const d = dayOfPacked(p);
  const from = monthIndexOfPacked(p);
  const eom = keepMonthEnd && d === dayCountOfMonthIndex(from);
  const target = from + months;
  const len = dayCountOfMonthIndex(target);
  return firstDayNumberOfMonthIndex(target) + (eom ? len : Math.min(d, len)) - 1;
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
 * @example
 * ```ts
 * const s = defineSchedule({ start: '2025-01-15', end: '2026-01-31', step: { months: 3 }, stub: 'short-front', keepMonthEnd: true });
 * s.periods.map((p) => formatPlainDate(p.unadjustedStart));
 * // ['2025-01-15', '2025-01-31', '2025-04-30', '2025-07-31', '2025-10-31']
 * ```
 */
export function defineSchedule(options: ScheduleOptions): Schedule {
  if (options === undefined) throw new KalendsTypeError('options: expected { start, end, step, ... }, got undefined', { code: 'invalid-type', received: options });
  const o = readOptions('options', options, ['start', 'end', 'step', 'stub', 'keepMonthEnd', 'calendar', 'convention']);
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
  const front = stub === 'short-front' || stub === 'long-front';
  const long = stub === 'long-front' || stub === 'long-back';
  const dates: number[] = [];
  let irregular: boolean;
  if ('unit' in step) {
    // Fails at once when the span holds more whole steps than a schedule may have periods.
    const steps = step.unit === 'months' ? (monthIndexOfPacked(packedYmdUnchecked(end)) - monthIndexOfPacked(packedYmdUnchecked(start))) / step.n : (end - start) / step.n;
    if (steps > MAX_SCHEDULE_PERIODS + 1) throw tooManyPeriods(o['step']);
    const roll = (k: number): number =>
      step.unit === 'months' ? rollMonths(front ? end : start, (front ? -k : k) * step.n, keepMonthEnd) : (front ? end - k * step.n : start + k * step.n);
    const interior: number[] = [];
    let k = 1;
    for (;;) {
      const d = roll(k);
      if (front ? d <= start : d >= end) {
        irregular = d !== (front ? start : end);
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

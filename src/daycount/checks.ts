/**
 * @internal The argument checks of the day-count functions, built on the diagnostics kit: the convention's name,
 * the order of a period's ends, and the options each convention needs (and those it does not take).
 *
 * @module
 */
import type { CalendarInput } from '../business/index.js';
import { optionOf, requireDayNumberArgument, requireEnum, requireWhole } from '../diagnostics/index.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { formatPlainDate } from '../instant/index.js';
import {
  COUPONS_PER_YEAR_VALUES,
  DAY_COUNT_CONVENTIONS,
  DAY_COUNT_SYNONYMS,
  DAY_COUNT_TRADE_NAMES,
  type DayCountConvention,
  NEEDED_OPTIONS,
} from './conventions.js';

/** The convention's identifier; an unknown one is a KalendsRangeError with code `unknown-name` and a suggestion. */
export function requireConvention(name: string, value: unknown): DayCountConvention {
  return requireEnum(name, value, DAY_COUNT_CONVENTIONS, undefined, { synonyms: DAY_COUNT_SYNONYMS });
}

/** A day number with its ISO 8601 date, for messages: `20000 (2024-10-04)`. */
export function showDay(dayNumber: number): string {
  return `${dayNumber} (${formatPlainDate(dayNumber)})`;
}

/** Throws unless `end >= start`: a day-count fraction of a reversed period is refused, never negated silently. */
export function requireOrder(startName: string, start: number, endName: string, end: number): void {
  if (end < start) {
    throw new KalendsRangeError(
      `${endName}: expected a day number on or after ${startName} ${showDay(start)}, got ${showDay(end)}; a day-count fraction of a reversed period is not defined (swap the two and negate the result if that is what you mean)`,
      { code: 'out-of-range', received: end },
    );
  }
}

/**
 * Refuses every option the convention does not use (code `unsupported`), so that an option meant for another
 * convention never passes unnoticed. `rename` maps a scalar option's name to the one the caller used (bulk).
 */
export function refuseUnusedOptions(
  convention: DayCountConvention,
  options: Readonly<Record<string, unknown>>,
  rename: Readonly<Record<string, string>> = {},
  prefix = 'options',
): void {
  const needed = NEEDED_OPTIONS[convention].map((k) => (Object.prototype.hasOwnProperty.call(rename, k) ? rename[k]! : k));
  for (const key of Object.keys(options)) {
    if (options[key] === undefined || needed.includes(key)) continue;
    const users = DAY_COUNT_CONVENTIONS.filter((c) => NEEDED_OPTIONS[c].some((k) => k === key || rename[k] === key));
    throw new KalendsRangeError(
      `${prefix}.${key}: convention ${JSON.stringify(convention)} (${DAY_COUNT_TRADE_NAMES[convention]}) does not use this option, got ${describeValue(options[key])}; only ${users.map((c) => JSON.stringify(c)).join(' and ')} ${users.length > 1 ? 'use' : 'uses'} it: remove it, or check the convention`,
      { code: 'unsupported', received: options[key], path: `${prefix}.${key}` },
    );
  }
}

/** The error for a needed option that is missing; `prefix` is the path of the options object. */
export function missingDayCountOption(convention: DayCountConvention, key: string, what: string, fix: string, prefix = 'options'): KalendsTypeError {
  return new KalendsTypeError(
    `${prefix}.${key}: ${DAY_COUNT_TRADE_NAMES[convention]} needs ${what}, got undefined; pass ${fix}`,
    { code: 'invalid-type', received: undefined, path: `${prefix}.${key}` },
  );
}

/** The coupon frequency of Actual/Actual (ICMA) and Actual/365L: required, one of 1, 2, 3, 4, 6, 12. */
export function readCouponsPerYear(convention: DayCountConvention, options: Readonly<Record<string, unknown>>, prefix = 'options'): number {
  const value = optionOf(options, 'couponsPerYear');
  if (value === undefined) {
    throw missingDayCountOption(convention, 'couponsPerYear', 'the coupon frequency (coupon periods per year: 1, 2, 3, 4, 6 or 12)', '{ couponsPerYear: 2 } for semi-annual coupons', prefix);
  }
  const n = requireWhole(`${prefix}.couponsPerYear`, value, 1, 12);
  if (!COUPONS_PER_YEAR_VALUES.includes(n)) {
    throw new KalendsRangeError(`${prefix}.couponsPerYear: expected one of ${COUPONS_PER_YEAR_VALUES.join(', ')} (coupon periods per year, each a whole number of months), got ${n}`, {
      code: 'out-of-range',
      received: n,
      path: `${prefix}.couponsPerYear`,
    });
  }
  return n;
}

/** The Termination Date of 30E/360 (ISDA): required, a day number. */
export function readTermination(options: Readonly<Record<string, unknown>>, prefix = 'options'): number {
  const value = optionOf(options, 'terminationDayNumber');
  if (value === undefined) {
    throw missingDayCountOption(
      'thirty-e-360-isda',
      'terminationDayNumber',
      'the Termination Date (a period that ends on the last day of February keeps its day only on that date)',
      '{ terminationDayNumber } with the day number of the last date of the transaction',
      prefix,
    );
  }
  return requireDayNumberArgument(`${prefix}.terminationDayNumber`, value);
}

/** Throws unless a period's end is on or before the Termination Date (no period ends after it). */
export function requireNotAfterTermination(endName: string, end: number, termination: number, terminationName = 'options.terminationDayNumber'): void {
  if (end > termination) {
    throw new KalendsRangeError(
      `${endName}: expected a day number on or before ${terminationName} ${showDay(termination)} (no period ends after the Termination Date), got ${showDay(end)}`,
      { code: 'out-of-range', received: end },
    );
  }
}

/** The business calendar of Business/252: required; the business layer validates it when it counts. */
export function readCalendar(options: Readonly<Record<string, unknown>>): CalendarInput {
  const value = optionOf(options, 'calendar');
  if (value === undefined) {
    throw missingDayCountOption('business-252', 'calendar', 'the business calendar whose business days it counts', "{ calendar: 'euro-t2' } or a calendar from defineCalendar");
  }
  return value as CalendarInput;
}

/**
 * The shortest and longest span, in days, of a regular coupon period for a frequency: 12 / couponsPerYear calendar
 * months (the shortest and longest run of that many months, from 28 days for one month to 366 for twelve), widened
 * by a week at each end for business-day adjustment. A regular period outside these bounds means the frequency or
 * the period is wrong.
 */
export function regularSpanBounds(couponsPerYear: number): { readonly shortest: number; readonly longest: number } {
  const months = 12 / couponsPerYear;
  const table: Readonly<Record<number, readonly [number, number]>> = { 1: [28, 31], 2: [59, 62], 3: [89, 92], 4: [120, 123], 6: [181, 184], 12: [365, 366] };
  const [shortest, longest] = table[months]!;
  return { shortest: shortest - 7, longest: longest + 7 };
}

/** Checks one regular period against the period it holds and the frequency; `names` are the parameters' names. */
export function checkRegularPeriod(
  start: number,
  end: number,
  regularStart: number,
  regularEnd: number,
  couponsPerYear: number,
  names: { readonly start: string; readonly end: string; readonly regularStart: string; readonly regularEnd: string },
): void {
  const { shortest, longest } = regularSpanBounds(couponsPerYear);
  const span = regularEnd - regularStart;
  if (!(span >= shortest && span <= longest)) {
    throw new KalendsRangeError(
      `${names.regularEnd}: a regular period of ${12 / couponsPerYear} month${couponsPerYear === 12 ? '' : 's'} (couponsPerYear ${couponsPerYear}) spans ${shortest} to ${longest} days (a week of business-day adjustment allowed at each end), got ${showDay(regularEnd)}, ${span} days after ${names.regularStart} ${showDay(regularStart)}; check couponsPerYear and the regular period`,
      { code: 'out-of-range', received: regularEnd, path: names.regularEnd },
    );
  }
  if (start < regularStart || end > regularEnd) {
    const [name, value] = start < regularStart ? [names.start, start] : [names.end, end];
    throw new KalendsRangeError(
      `${name}: expected the period ${formatPlainDate(start)}..${formatPlainDate(end)} to lie within its regular period ${formatPlainDate(regularStart)}..${formatPlainDate(regularEnd)}, got ${showDay(value)}; a long period spans several regular periods: split it at its notional coupon dates, compute each part within its own regular period, and add the parts with sumOfYearFractions (ICMA Rule 251)`,
      { code: 'out-of-range', received: value },
    );
  }
}

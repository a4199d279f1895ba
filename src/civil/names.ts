/**
 * Weekday names and numbers, and month-index arithmetic: the one home of this knowledge for every layer.
 *
 * A month index counts months from year 0: `year * 12 + month - 1` (so 2025-01 is 24300). It is how period
 * ordinals of months, quarters and fiscal units, monthly rules and duration arithmetic step by months.
 *
 * @module
 */
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked } from './gregorian.js';

/** A weekday by its lower-case English name, as definitions spell it. */
export type WeekdayName = 'monday' | 'tuesday' | 'wednesday' | 'thursday' | 'friday' | 'saturday' | 'sunday';

/**
 * Weekday names in ISO 8601 order: `WEEKDAY_NAMES[w - 1]` is the name of ISO weekday w (1 = Monday .. 7 = Sunday).
 *
 * @example
 * ```ts
 * WEEKDAY_NAMES[weekdayOfDayNumber(0) - 1]; // 'thursday' (1970-01-01)
 * ```
 */
export const WEEKDAY_NAMES: readonly WeekdayName[] = /* @__PURE__ */ Object.freeze([
  'monday',
  'tuesday',
  'wednesday',
  'thursday',
  'friday',
  'saturday',
  'sunday',
] as const);

/**
 * @internal The ISO weekday number (1..7) of a lower-case weekday name, or 0 when `name` is no weekday name.
 */
export function weekdayFromName(name: unknown): number {
  if (typeof name !== 'string') return 0;
  const i = (WEEKDAY_NAMES as readonly string[]).indexOf(name);
  return i + 1;
}

/** @internal The weekday name with a capital first letter ("Monday"), for text meant for people. */
export function titleOfWeekday(weekday: number): string {
  const name = WEEKDAY_NAMES[weekday - 1]!;
  return name[0]!.toUpperCase() + name.slice(1);
}

export {
  yearOfPacked,
  monthOfPacked,
  dayOfPacked,
  monthIndexOfPacked,
  monthIndexOfDayNumberUnchecked,
} from './gregorian.js';

/** @internal Month index of a year and month. */
export function monthIndexFromYearMonth(year: number, month: number): number {
  return year * 12 + month - 1;
}

/** @internal Year of a month index. */
export function yearOfMonthIndex(monthIndex: number): number {
  return Math.floor(monthIndex / 12);
}

/** @internal Month 1..12 of a month index. */
export function monthOfMonthIndex(monthIndex: number): number {
  return monthIndex - Math.floor(monthIndex / 12) * 12 + 1;
}

/** @internal Day number of the first day of a month index (unchecked). */
export function firstDayNumberOfMonthIndex(monthIndex: number): number {
  const y = Math.floor(monthIndex / 12);
  return dayNumberFromYmdUnchecked(y, monthIndex - y * 12 + 1, 1);
}

/** @internal Number of days in the month of a month index. */
export function dayCountOfMonthIndex(monthIndex: number): number {
  const y = Math.floor(monthIndex / 12);
  return dayCountOfMonthUnchecked(y, monthIndex - y * 12 + 1);
}

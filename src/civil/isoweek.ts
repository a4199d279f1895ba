/**
 * ISO 8601 week dates (ISO 8601-1:2019, 3.2.2 and 5.2.3): weeks start on Monday, and week 1 of a week-year is
 * the week that contains the year's first Thursday (equivalently, 4 January).
 *
 * @module
 */
import { requireInteger } from '../errors.js';
import {
  dayNumberFromYmdUnchecked,
  isLeapYearUnchecked,
  requireDayNumber,
  requireYear,
  weekdayOfDayNumberUnchecked,
  yearOfDayNumberUnchecked,
} from './gregorian.js';
import { MIN_YEAR, MAX_YEAR, MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../bounds.js';
import { KalendsRangeError } from '../errors.js';

/** An ISO 8601 week date: week-year, week 1..53, weekday 1 (Monday)..7 (Sunday). */
export interface IsoWeekDate {
  /** The ISO week-year: the year of the week's Thursday. */
  readonly weekYear: number;
  /** The week of the week-year, 1..53. */
  readonly week: number;
  /** The ISO weekday, 1 (Monday) .. 7 (Sunday). */
  readonly weekday: number;
}

/** @internal Day number of the Monday of week 1 of ISO week-year `y`. */
export function isoWeekOneMonday(y: number): number {
  const jan4 = dayNumberFromYmdUnchecked(y, 1, 4);
  return jan4 - (weekdayOfDayNumberUnchecked(jan4) - 1);
}

/**
 * Number of ISO weeks (52 or 53) in ISO week-year `weekYear`. A year has 53 weeks when it starts on a Thursday,
 * or is a leap year that starts on a Wednesday (ISO 8601-1:2019, 3.2.2 note; equivalently, when 28 December
 * falls in week 53).
 *
 * @example
 * ```ts
 * isoWeekCountOfYear(2020); // 53
 * isoWeekCountOfYear(2021); // 52
 * ```
 */
export function isoWeekCountOfYear(weekYear: number): number {
  requireYear(weekYear, 'weekYear');
  return isoWeeksInYearUnchecked(weekYear);
}

/** @internal */
export function isoWeeksInYearUnchecked(y: number): number {
  const jan1 = weekdayOfDayNumberUnchecked(dayNumberFromYmdUnchecked(y, 1, 1));
  return jan1 === 4 || (jan1 === 3 && isLeapYearUnchecked(y)) ? 53 : 52;
}

/**
 * ISO week date of a day number.
 *
 * @example
 * ```ts
 * isoWeekDateFromDayNumber(dayNumberFromYmd(2008, 12, 29)); // { weekYear: 2009, week: 1, weekday: 1 }
 * ```
 */
export function isoWeekDateFromDayNumber(dayNumber: number): IsoWeekDate {
  requireDayNumber(dayNumber);
  const weekday = weekdayOfDayNumberUnchecked(dayNumber);
  // The Thursday of the same ISO week decides the week-year.
  const thursday = dayNumber - weekday + 4;
  const weekYear = yearOfDayNumberUnchecked(thursday);
  const week = Math.floor((thursday - dayNumberFromYmdUnchecked(weekYear, 1, 1)) / 7) + 1;
  return { weekYear, week, weekday };
}

/**
 * Day number of an ISO week date. Throws a RangeError when `week` exceeds the weeks in `weekYear`.
 *
 * @example
 * ```ts
 * dayNumberFromIsoWeekDate(2009, 1, 1); // day number of 2008-12-29
 * ```
 */
export function dayNumberFromIsoWeekDate(weekYear: number, week: number, weekday: number): number {
  // The week-years one beyond each end hold supported days too (-271821-01-01 is in week 53 of -271822), so that
  // every day's ISO week date (isoWeekDateFromDayNumber) converts back.
  requireInteger('weekYear', weekYear, MIN_YEAR - 1, MAX_YEAR + 1);
  requireInteger('week', week, 1, isoWeeksInYearUnchecked(weekYear));
  requireInteger('weekday', weekday, 1, 7);
  const dn = isoWeekOneMonday(weekYear) + (week - 1) * 7 + weekday - 1;
  if (dn < MIN_DAY_NUMBER || dn > MAX_DAY_NUMBER) {
    throw new KalendsRangeError(
      `weekYear: the ISO week date ${weekYear}-W${week}-${weekday} falls outside the supported days ${MIN_YEAR}-01-01..${MAX_YEAR}-12-31`,
      { code: 'out-of-range', received: { weekYear, week, weekday } },
    );
  }
  return dn;
}

/**
 * @internal Small ISO 8601 calendar-date helpers for definitions and messages (`YYYY-MM-DD`, with the expanded
 * `±YYYYYY-MM-DD` form of ISO 8601-1:2019 4.3.2 / RFC 9557 for years outside 0000..9999).
 *
 * @module
 */
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked, packedYmdUnchecked } from '../civil/gregorian.js';

const DATE_RE = /^([+-]\d{6}|\d{4})-(\d{2})-(\d{2})$/;

/** @internal Day number of an ISO calendar date, or a string saying what is wrong with it. */
export function dayNumberFromIsoDate(text: string): number | string {
  const m = DATE_RE.exec(text);
  if (!m) return `expected an ISO 8601 date YYYY-MM-DD, got ${JSON.stringify(text)}`;
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  if (m[1] === '-000000') return `expected an ISO 8601 date (year -000000 is not allowed), got ${JSON.stringify(text)}`;
  if (year < MIN_YEAR || year > MAX_YEAR) return `expected a year from ${MIN_YEAR} to ${MAX_YEAR}, got ${JSON.stringify(text)}`;
  if (month < 1 || month > 12) return `expected a month from 01 to 12, got ${JSON.stringify(text)}`;
  const dim = dayCountOfMonthUnchecked(year, month);
  if (day < 1 || day > dim) return `expected a day from 01 to ${dim} for ${m[1]}-${m[2]}, got ${JSON.stringify(text)}`;
  return dayNumberFromYmdUnchecked(year, month, day);
}

/** @internal `YYYY-MM-DD` of a day number (expanded years outside 0000..9999). */
export function isoDateFromDayNumber(dayNumber: number): string {
  const p = packedYmdUnchecked(dayNumber);
  const year = Math.floor(p / 512) + MIN_YEAR;
  const month = (p >> 5) & 15;
  const day = p & 31;
  const y =
    year >= 0 && year <= 9999
      ? String(year).padStart(4, '0')
      : `${year < 0 ? '-' : '+'}${String(Math.abs(year)).padStart(6, '0')}`;
  return `${y}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/**
 * Easter Sunday by the Gregorian and the Julian computus.
 *
 * Gregorian: the "Anonymous Gregorian algorithm" (Meeus/Jones/Butcher), as printed in Jean Meeus,
 * "Astronomical Algorithms", 2nd ed. (1998), chapter 8, valid for every Gregorian year.
 * Julian: Meeus's Julian algorithm from the same chapter; the result is a Julian-calendar date, converted here to
 * the proleptic Gregorian day number (so Orthodox Easter comes back as the civil date people observe today).
 *
 * @module
 */
import { KalendsRangeError, requireInteger } from '../errors.js';
import { dayNumberFromYmdUnchecked } from './gregorian.js';
import { MAX_DAY_NUMBER, MAX_YEAR } from '../bounds.js';

/** First year for which the Gregorian computus is offered (the reform was promulgated in 1582). */
export const EASTER_MIN_YEAR = 1583;
/** First year for which the Julian computus is offered (Meeus gives it from AD 326 onwards). */
export const JULIAN_EASTER_MIN_YEAR = 326;

/**
 * Day number of Easter Sunday (Gregorian computus, Western churches) in `year` (1583..275760).
 *
 * @example
 * ```ts
 * ymdFromDayNumber(easterDayNumberOfYear(2025)); // { year: 2025, month: 4, day: 20 }
 * ```
 */
export function easterDayNumberOfYear(year: number): number {
  requireInteger('year', year, EASTER_MIN_YEAR, MAX_YEAR);
  const a = year % 19;
  const b = Math.floor(year / 100);
  const c = year % 100;
  const d = Math.floor(b / 4);
  const e = b % 4;
  const f = Math.floor((b + 8) / 25);
  const g = Math.floor((b - f + 1) / 3);
  const h = (19 * a + b - d - g + 15) % 30;
  const i = Math.floor(c / 4);
  const k = c % 4;
  const l = (32 + 2 * e + 2 * i - h - k) % 7;
  const m = Math.floor((a + 11 * h + 22 * l) / 451);
  const month = Math.floor((h + l - 7 * m + 114) / 31);
  const day = ((h + l - 7 * m + 114) % 31) + 1;
  return dayNumberFromYmdUnchecked(year, month, day);
}

/**
 * Day number of Easter Sunday by the Julian computus (Eastern Orthodox churches), expressed as a proleptic
 * Gregorian day number, for `year` 326..275760.
 *
 * @example
 * ```ts
 * ymdFromDayNumber(julianEasterDayNumberOfYear(2025)); // { year: 2025, month: 4, day: 20 }
 * ymdFromDayNumber(julianEasterDayNumberOfYear(2024)); // { year: 2024, month: 5, day: 5 }
 * ```
 */
export function julianEasterDayNumberOfYear(year: number): number {
  requireInteger('year', year, JULIAN_EASTER_MIN_YEAR, MAX_YEAR);
  const a = year % 4;
  const b = year % 7;
  const c = year % 19;
  const d = (19 * c + 15) % 30;
  const e = (2 * a + 4 * b - d + 34) % 7;
  const month = Math.floor((d + e + 114) / 31);
  const day = ((d + e + 114) % 31) + 1;
  const dn = julianCalendarToDayNumber(year, month, day);
  // The Julian calendar runs days behind the Gregorian one (about 2,000 days by the last supported year), so the
  // last years' Julian Easters fall after the last supported day.
  if (dn > MAX_DAY_NUMBER) {
    throw new KalendsRangeError(`year: the Julian Easter of ${year} falls after the last supported day (${MAX_YEAR}-12-31); expected a year whose Julian Easter is within the supported range`, {
      code: 'out-of-range',
      received: year,
    });
  }
  return dn;
}

/**
 * @internal Day number of a Julian-calendar date (years >= 1). Julian day number algorithm from
 * Meeus, "Astronomical Algorithms", chapter 7 (with B = 0 for the Julian calendar); JD 2440587.5 is 1970-01-01.
 */
function julianCalendarToDayNumber(year: number, month: number, day: number): number {
  let y = year;
  let m = month;
  if (m <= 2) {
    y -= 1;
    m += 12;
  }
  // Chronological Julian Day Number (integer, noon-free): floor(365.25(y+4716)) + floor(30.6001(m+1)) + day - 1524
  const jdn = Math.floor(365.25 * (y + 4716)) + Math.floor(30.6001 * (m + 1)) + day - 1524;
  return jdn - 2440588;
}

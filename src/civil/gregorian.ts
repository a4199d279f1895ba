/**
 * Proleptic Gregorian arithmetic on day numbers (integer days since 1970-01-01). No objects, no `Date`.
 *
 * The conversions are the days-from-civil and civil-from-days algorithms published by Howard Hinnant,
 * "chrono-Compatible Low-Level Date Algorithms" (2013): a 400-year era of 146,097 days, with the year
 * starting on 1 March so that the leap day is the last day of the computational year.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_YEAR, MIN_DAY_NUMBER, MIN_YEAR } from '../bounds.js';
import { KalendsRangeError, requireInteger } from '../errors.js';
import { readOptions, requireDayNumberArgument, requireNumberArray, requireOutArray } from '../diagnostics/index.js';

/** A calendar date as three integers. `month` is 1..12, `day` is 1..31. */
export interface Ymd {
  /** The proleptic Gregorian year, numbered as in ISO 8601 (0 is 1 BC). */
  readonly year: number;
  /** The month, 1..12. */
  readonly month: number;
  /** The day of the month, 1..31. */
  readonly day: number;
}

const CUMULATIVE_DAYS = [0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334];

/**
 * Whether `year` is a leap year in the proleptic Gregorian calendar (divisible by 4, except centuries not
 * divisible by 400).
 *
 * @example
 * ```ts
 * isLeapYear(2024); // true
 * isLeapYear(1900); // false
 * ```
 */
export function isLeapYear(year: number): boolean {
  requireYear(year);
  return isLeapYearUnchecked(year);
}

/** @internal Leap-year test without validation, for hot paths. */
export function isLeapYearUnchecked(year: number): boolean {
  return (year & 3) === 0 && (year % 100 !== 0 || year % 400 === 0);
}

/**
 * Number of days in `month` of `year` (28..31).
 *
 * @example
 * ```ts
 * dayCountOfMonth(2024, 2); // 29
 * ```
 */
export function dayCountOfMonth(year: number, month: number): number {
  requireYear(year);
  requireInteger('month', month, 1, 12);
  return dayCountOfMonthUnchecked(year, month);
}

/** @internal */
export function dayCountOfMonthUnchecked(year: number, month: number): number {
  if (month === 2) return isLeapYearUnchecked(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/**
 * Number of days in `year` (365 or 366).
 *
 * @example
 * ```ts
 * dayCountOfYear(2000); // 366
 * ```
 */
export function dayCountOfYear(year: number): number {
  requireYear(year);
  return isLeapYearUnchecked(year) ? 366 : 365;
}

/**
 * Day number (days since 1970-01-01) of a calendar date. Throws a RangeError naming the field for a month
 * outside 1..12, a day past the month's length, or a year outside the supported range.
 *
 * @example
 * ```ts
 * dayNumberFromYmd(1970, 1, 1); // 0
 * dayNumberFromYmd(2000, 3, 1); // 11017
 * ```
 */
export function dayNumberFromYmd(year: number, month: number, day: number): number {
  requireYear(year);
  requireInteger('month', month, 1, 12);
  requireInteger('day', day, 1, dayCountOfMonthUnchecked(year, month));
  return dayNumberFromYmdUnchecked(year, month, day);
}

/** @internal Days-from-civil without validation; arguments must be valid integers. */
export function dayNumberFromYmdUnchecked(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400; // 0..399
  const mp = month > 2 ? month - 3 : month + 9; // March = 0
  const doy = ((153 * mp + 2) / 5 | 0) + day - 1; // 0..365
  const doe = yoe * 365 + (yoe >> 2) - ((yoe / 100) | 0) + doy; // 0..146096
  return era * 146097 + doe - 719468;
}

/**
 * Calendar date of a day number. This allocates one small object; in loops use
 * {@link yearOfDayNumber}, {@link monthOfDayNumber}, {@link dayOfMonthOfDayNumber} or the bulk
 * {@link ymdFromDayNumberBulk}.
 *
 * @example
 * ```ts
 * ymdFromDayNumber(11017); // { year: 2000, month: 3, day: 1 }
 * ```
 */
export function ymdFromDayNumber(dayNumber: number): Ymd {
  requireDayNumber(dayNumber);
  const packed = packedYmdUnchecked(dayNumber);
  return unpackYmd(packed);
}

/**
 * Year of a day number.
 *
 * @example
 * ```ts
 * yearOfDayNumber(-1); // 1969
 * ```
 */
export function yearOfDayNumber(dayNumber: number): number {
  requireDayNumber(dayNumber);
  return yearOfDayNumberUnchecked(dayNumber);
}

/**
 * Month (1..12) of a day number.
 *
 * @example
 * ```ts
 * monthOfDayNumber(31); // 2 (1970-02-01)
 * ```
 */
export function monthOfDayNumber(dayNumber: number): number {
  requireDayNumber(dayNumber);
  return monthOfDayNumberUnchecked(dayNumber);
}

/**
 * Day of the month (1..31) of a day number.
 *
 * @example
 * ```ts
 * dayOfMonthOfDayNumber(31); // 1 (1970-02-01)
 * ```
 */
export function dayOfMonthOfDayNumber(dayNumber: number): number {
  requireDayNumber(dayNumber);
  return dayOfMonthOfDayNumberUnchecked(dayNumber);
}

/**
 * @internal Civil-from-days packed into one number without allocation:
 * `(year - MIN_YEAR) * 512 + month * 32 + day`. Decode with the helpers below.
 */
export function packedYmdUnchecked(dayNumber: number): number {
  // Neri & Schneider, "Euclidean affine functions and their application to calendar algorithms",
  // Software: Practice and Experience 53(4), 2023: civil-from-days with multiplications and shifts only.
  // The shift K = 719468 + 146097 * 700 makes every supported day number non-negative; all intermediate
  // values stay below 2^32 (or, for P2, below 2^53), so plain doubles are exact.
  const n1 = 4 * (dayNumber + 102_987_368) + 3;
  const century = (n1 / 146097) >>> 0;
  const n2 = (((n1 % 146097) >>> 2) << 2) + 3;
  const p2 = 2939745 * n2;
  const z = Math.floor(p2 / 4294967296);
  const ny = ((p2 - z * 4294967296) / 11758980) >>> 0; // day of the March-based year, 0..365
  const n3 = 2141 * ny + 197913;
  const m = n3 >>> 16;
  const day = (((n3 & 65535) / 2141) | 0) + 1;
  const jan = ny >= 306 ? 1 : 0;
  const year = 100 * century + z - 280_000 + jan;
  return (year - MIN_YEAR) * 512 + (jan ? m - 12 : m) * 32 + day;
}

/** @internal Year of a packed year-month-day (see {@link packedYmdUnchecked}). */
export function yearOfPacked(packed: number): number {
  return Math.floor(packed / 512) + MIN_YEAR;
}

/** @internal Month 1..12 of a packed year-month-day. */
export function monthOfPacked(packed: number): number {
  return (packed >> 5) & 15;
}

/** @internal Day of month 1..31 of a packed year-month-day. */
export function dayOfPacked(packed: number): number {
  return packed & 31;
}

/** @internal Month index (`year * 12 + month - 1`) of a packed year-month-day. */
export function monthIndexOfPacked(packed: number): number {
  return (Math.floor(packed / 512) + MIN_YEAR) * 12 + ((packed >> 5) & 15) - 1;
}

/**
 * @internal Month index (`year * 12 + month - 1`) of the month that holds a day number: the computation of
 * {@link packedYmdUnchecked} stopped at the month (no day of the month, no packing). Measured against the
 * period layer's former biased Hinnant month computation in one process: as fast or faster (docs/civil.md).
 */
export function monthIndexOfDayNumberUnchecked(dayNumber: number): number {
  const n1 = 4 * (dayNumber + 102_987_368) + 3;
  const century = (n1 / 146097) >>> 0;
  const n2 = (((n1 % 146097) >>> 2) << 2) + 3;
  const p2 = 2939745 * n2;
  const z = Math.floor(p2 / 4294967296);
  const ny = ((p2 - z * 4294967296) / 11758980) >>> 0;
  const m = (2141 * ny + 197913) >>> 16;
  const jan = ny >= 306 ? 1 : 0;
  return (100 * century + z - 280_000 + jan) * 12 + (jan ? m - 13 : m - 1);
}

/** @internal */
function unpackYmd(packed: number): Ymd {
  return { year: yearOfPacked(packed), month: monthOfPacked(packed), day: dayOfPacked(packed) };
}

/** @internal */
export function yearOfDayNumberUnchecked(dayNumber: number): number {
  return yearOfPacked(packedYmdUnchecked(dayNumber));
}

/** @internal */
function monthOfDayNumberUnchecked(dayNumber: number): number {
  return monthOfPacked(packedYmdUnchecked(dayNumber));
}

/** @internal */
function dayOfMonthOfDayNumberUnchecked(dayNumber: number): number {
  return dayOfPacked(packedYmdUnchecked(dayNumber));
}

/**
 * Bulk civil-from-days: writes the year, month and day of each day number into three Int32Arrays, in one
 * pass with no per-element allocation. Returns the three arrays; those given in `out` are filled (each must hold
 * `dayNumbers.length` elements), the others are allocated.
 *
 * @example
 * ```ts
 * const { years, months, days } = ymdFromDayNumberBulk(Int32Array.of(0, 11017));
 * // years = [1970, 2000], months = [1, 3], days = [1, 1]
 * ```
 */
export function ymdFromDayNumberBulk(
  dayNumbers: ArrayLike<number>,
  out?: {
    /** Where to write the years (a new array when absent). */
    readonly years?: Int32Array;
    /** Where to write the months (a new array when absent). */
    readonly months?: Int32Array;
    /** Where to write the days (a new array when absent). */
    readonly days?: Int32Array;
  },
): {
  /** The year of each day. */
  years: Int32Array;
  /** The month of each day, 1..12. */
  months: Int32Array;
  /** The day of the month of each day, 1..31. */
  days: Int32Array;
} {
  const src = requireNumberArray('dayNumbers', dayNumbers);
  const n = src.length;
  const o = readOptions('out', out, ['years', 'months', 'days']);
  const years = requireOutArray('out.years', o['years'], Int32Array, n);
  const months = requireOutArray('out.months', o['months'], Int32Array, n);
  const days = requireOutArray('out.days', o['days'], Int32Array, n);
  for (let i = 0; i < n; i++) {
    const dn = src[i] as number;
    if (!(dn >= MIN_DAY_NUMBER && dn <= MAX_DAY_NUMBER && dn === Math.floor(dn))) requireDayNumber(dn, `dayNumbers[${i}]`);
    const p = packedYmdUnchecked(dn);
    years[i] = yearOfPacked(p);
    months[i] = monthOfPacked(p);
    days[i] = dayOfPacked(p);
  }
  return { years, months, days };
}

/**
 * Bulk days-from-civil: the day number of each (year, month, day) triple, validated, into an Int32Array.
 *
 * @example
 * ```ts
 * dayNumberFromYmdBulk(Int32Array.of(1970), Int32Array.of(1), Int32Array.of(2)); // Int32Array [1]
 * ```
 */
export function dayNumberFromYmdBulk(
  years: ArrayLike<number>,
  months: ArrayLike<number>,
  days: ArrayLike<number>,
  out?: Int32Array,
): Int32Array {
  const ys = requireNumberArray('years', years);
  const ms = requireNumberArray('months', months);
  const ds = requireNumberArray('days', days);
  const n = ys.length;
  if (ms.length !== n || ds.length !== n) {
    throw new KalendsRangeError(
      `months: expected years, months and days of the same length, got ${n}, ${ms.length}, ${ds.length} elements`,
      { code: 'length-mismatch', received: [n, ms.length, ds.length] },
    );
  }
  const result = requireOutArray('out', out, Int32Array, n);
  for (let i = 0; i < n; i++) {
    const y = ys[i] as number;
    const m = ms[i] as number;
    const d = ds[i] as number;
    const valid =
      y >= MIN_YEAR && y <= MAX_YEAR && m >= 1 && m <= 12 && d >= 1 &&
      (d <= 28 || d <= dayCountOfMonthUnchecked(y, m)) &&
      y === Math.floor(y) && m === (m | 0) && d === (d | 0);
    if (!valid) {
      // Throws with the field's name, its index and its value.
      requireYear(y, `years[${i}]`);
      requireInteger(`months[${i}]`, m, 1, 12);
      requireInteger(`days[${i}]`, d, 1, dayCountOfMonthUnchecked(y, m));
    }
    result[i] = dayNumberFromYmdUnchecked(y, m, d);
  }
  return result;
}

/**
 * ISO weekday of a day number: 1 = Monday .. 7 = Sunday (ISO 8601-1:2019, 3.1.1.8 / 4.3.2.2).
 * 1970-01-01 was a Thursday.
 *
 * @example
 * ```ts
 * weekdayOfDayNumber(0); // 4 (Thursday)
 * ```
 */
export function weekdayOfDayNumber(dayNumber: number): number {
  requireDayNumber(dayNumber);
  return weekdayOfDayNumberUnchecked(dayNumber);
}

/** @internal */
export function weekdayOfDayNumberUnchecked(dayNumber: number): number {
  // 1970-01-01 is Thursday (4). ((dn + 3) mod 7) + 1 maps Monday..Sunday to 1..7.
  const r = (dayNumber + 3) % 7;
  return (r < 0 ? r + 7 : r) + 1;
}

/**
 * Day of the year (1..366) of a day number.
 *
 * @example
 * ```ts
 * dayOfYearOfDayNumber(dayNumberFromYmd(2024, 12, 31)); // 366
 * ```
 */
export function dayOfYearOfDayNumber(dayNumber: number): number {
  requireDayNumber(dayNumber);
  const p = packedYmdUnchecked(dayNumber);
  const month = monthOfPacked(p);
  return CUMULATIVE_DAYS[month - 1]! + (month > 2 && isLeapYearUnchecked(yearOfPacked(p)) ? 1 : 0) + dayOfPacked(p);
}

/**
 * Day number of the given day of the year (1..365 or 366).
 *
 * @example
 * ```ts
 * dayNumberFromYearDay(1970, 32); // 31 (1970-02-01)
 * ```
 */
export function dayNumberFromYearDay(year: number, dayOfYear: number): number {
  requireYear(year);
  requireInteger('dayOfYear', dayOfYear, 1, isLeapYearUnchecked(year) ? 366 : 365);
  return dayNumberFromYmdUnchecked(year, 1, 1) + dayOfYear - 1;
}

/**
 * Validates a year against the supported range, throwing a RangeError that names it.
 *
 * @example
 * ```ts
 * requireYear(2025); // 2025
 * ```
 */
export function requireYear(year: unknown, name = 'year'): number {
  return requireInteger(name, year, MIN_YEAR, MAX_YEAR);
}

/**
 * Validates a day number against the supported range (MIN_DAY_NUMBER..MAX_DAY_NUMBER); a string or a date
 * object gets the name of the parser or coercion to call.
 *
 * @example
 * ```ts
 * requireDayNumber(0); // 0
 * ```
 */
export function requireDayNumber(dayNumber: unknown, name = 'dayNumber'): number {
  return requireDayNumberArgument(name, dayNumber);
}

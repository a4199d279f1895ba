/**
 * @internal The day-count formulas on valid day numbers, in integers: each returns the numerator of a fraction
 * whose denominator is fixed by the convention (or the denominator, for Actual/365L). The scalar function and the
 * bulk kernels both call these, so that the two give the same answer to the last bit. No validation here:
 * arguments are integer day numbers within the civil range, with `start <= end`.
 *
 * @module
 */
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked, isLeapYearUnchecked, packedYmdUnchecked } from '../civil/gregorian.js';
import { dayOfPacked, monthOfPacked, yearOfPacked } from '../civil/names.js';

/** 365 * 366: the common denominator of Actual/Actual (ISDA), so that its parts add up as integers. */
export const ISDA_DENOMINATOR = 133_590;

/**
 * Actual/Actual (ISDA), 2006 ISDA Definitions, section 4.16 (b): the numerator over {@link ISDA_DENOMINATOR}.
 * Days in a leap year count 365/133590 (= 1/366), days in other years 366/133590 (= 1/365); each whole year
 * between the first and the last counts exactly 133590. No floating point is involved, so nothing accumulates.
 */
export function actualActualIsdaNumerator(start: number, end: number): number {
  const ys = yearOfPacked(packedYmdUnchecked(start));
  const ye = yearOfPacked(packedYmdUnchecked(end));
  if (ys === ye) return (end - start) * (isLeapYearUnchecked(ys) ? 365 : 366);
  const firstPart = dayNumberFromYmdUnchecked(ys + 1, 1, 1) - start;
  const lastPart = end - dayNumberFromYmdUnchecked(ye, 1, 1);
  return (
    firstPart * (isLeapYearUnchecked(ys) ? 365 : 366) +
    lastPart * (isLeapYearUnchecked(ye) ? 365 : 366) +
    (ye - ys - 1) * 133_590
  );
}

/**
 * 30/360 and 30E/360: the numerator over 360, `360 * (Y2 - Y1) + 30 * (M2 - M1) + (D2 - D1)`.
 * - 30/360, 2006 ISDA Definitions, section 4.16 (f) (`euro` false): D1 = 31 becomes 30; D2 = 31 becomes 30 only
 *   when D1 (after that change) is greater than 29.
 * - 30E/360, section 4.16 (g) (`euro` true): D1 = 31 and D2 = 31 become 30.
 *
 * Neither has a February rule: the last day of February keeps its day (28 or 29).
 */
export function thirtyDays(start: number, end: number, euro: boolean): number {
  const p1 = packedYmdUnchecked(start);
  const p2 = packedYmdUnchecked(end);
  let d1 = dayOfPacked(p1);
  let d2 = dayOfPacked(p2);
  if (d1 === 31) d1 = 30;
  if (d2 === 31 && (euro || d1 > 29)) d2 = 30;
  return 360 * (yearOfPacked(p2) - yearOfPacked(p1)) + 30 * (monthOfPacked(p2) - monthOfPacked(p1)) + (d2 - d1);
}

/**
 * 30E/360 (ISDA), 2006 ISDA Definitions, section 4.16 (h): the numerator over 360. D1 becomes 30 when it is the
 * last day of February or 31; D2 becomes 30 when it is 31, or the last day of February unless `end` is the
 * Termination Date. A period of no length gives 0 (the formula alone would give -1 or -2 for a Termination Date
 * at the end of February).
 */
export function thirtyE360IsdaDays(start: number, end: number, termination: number): number {
  if (start === end) return 0;
  const p1 = packedYmdUnchecked(start);
  const p2 = packedYmdUnchecked(end);
  const y1 = yearOfPacked(p1);
  const y2 = yearOfPacked(p2);
  const m1 = monthOfPacked(p1);
  const m2 = monthOfPacked(p2);
  let d1 = dayOfPacked(p1);
  let d2 = dayOfPacked(p2);
  if (d1 === 31 || (m1 === 2 && d1 === dayCountOfMonthUnchecked(y1, 2))) d1 = 30;
  if (d2 === 31 || (m2 === 2 && d2 === dayCountOfMonthUnchecked(y2, 2) && end !== termination)) d2 = 30;
  return 360 * (y2 - y1) + 30 * (m2 - m1) + (d2 - d1);
}

/** How many 29 Februaries fall on or before `dayNumber`, counted from year 0 (only differences are used). */
function leapDaysThrough(dayNumber: number): number {
  const p = packedYmdUnchecked(dayNumber);
  const y = yearOfPacked(p);
  const before = y - 1;
  const m = monthOfPacked(p);
  const own = isLeapYearUnchecked(y) && (m > 2 || (m === 2 && dayOfPacked(p) === 29)) ? 1 : 0;
  return Math.floor(before / 4) - Math.floor(before / 100) + Math.floor(before / 400) + own;
}

/**
 * Actual/365L, ICMA Rule 251: the denominator, 365 or 366. With annual coupons it is 366 when a 29 February falls
 * in the period, counted from the day after `start` up to and including `end` (the coupon date); otherwise it is
 * 366 when `end` falls in a leap year.
 */
export function actual365LeapDenominator(start: number, end: number, annual: boolean): number {
  if (annual) return leapDaysThrough(end) - leapDaysThrough(start) > 0 ? 366 : 365;
  return isLeapYearUnchecked(yearOfPacked(packedYmdUnchecked(end))) ? 366 : 365;
}

/** Greatest common divisor of two non-negative integers (gcd(0, b) = b). */
export function greatestCommonDivisor(a: number, b: number): number {
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

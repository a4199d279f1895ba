/**
 * Day-count fractions: the year fraction of a period `[start, end)` of day numbers under a convention of the 2006
 * ISDA Definitions (section 4.16), ICMA Rule 251, or Business/252, as an exact reduced fraction and a double.
 * See docs/day-counts.md.
 *
 * @module
 */
import { countBusinessDays } from '../business/index.js';
import { readOptions, requireDayNumberArgument } from '../diagnostics/index.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { checkRegularPeriod, readCalendar, readCouponsPerYear, readTermination, refuseUnusedOptions, requireNotAfterTermination, requireConvention, requireOrder } from './checks.js';
import type { DayCountConvention, YearFraction, YearFractionOptions } from './conventions.js';
import {
  ISDA_DENOMINATOR,
  actual365LeapDenominator,
  actualActualIsdaNumerator,
  greatestCommonDivisor,
  thirtyDays,
  thirtyE360IsdaDays,
} from './formulas.js';

const SCALAR_KEYS: readonly string[] = ['couponsPerYear', 'regularStart', 'regularEnd', 'terminationDayNumber', 'calendar'];

/** @internal `numerator / denominator` reduced to lowest terms (denominator > 0), frozen. */
export function yearFractionFromParts(numerator: number, denominator: number): YearFraction {
  if (numerator === 0) return ZERO;
  const g = greatestCommonDivisor(Math.abs(numerator), denominator);
  const n = numerator / g;
  const d = denominator / g;
  return Object.freeze({ numerator: n, denominator: d, value: n / d });
}

const ZERO: YearFraction = /* @__PURE__ */ Object.freeze({ numerator: 0, denominator: 1, value: 0 });

/**
 * The year fraction of the period `[start, end)` (day numbers) under a day-count convention, exactly: the reduced
 * integer `numerator` and `denominator`, and the double `value`. The conventions and their trade names:
 *
 * - `one-one`: 1/1, 2006 ISDA Definitions, section 4.16 (a): 1 for any period (0 for a period of no length).
 * - `actual-actual-isda`: Actual/Actual (ISDA), 4.16 (b): days in leap years / 366 + days in other years / 365,
 *   summed as integers over 365 * 366 and then reduced, so no rounding accumulates across the years.
 * - `actual-actual-icma`: Actual/Actual (ICMA), 4.16 (c) and ICMA Rule 251: days / (couponsPerYear * days of the
 *   regular period that holds the period). Needs `couponsPerYear`, `regularStart` and `regularEnd`.
 * - `actual-365-fixed`: Actual/365 (Fixed), 4.16 (d): days / 365.
 * - `actual-360`: Actual/360, 4.16 (e): days / 360.
 * - `thirty-360`: 30/360 (Bond Basis), 4.16 (f): 360 * years + 30 * months + days, over 360; D1 = 31 becomes 30,
 *   D2 = 31 becomes 30 when D1 is 30 or 31. End of month: no February rule (28 or 29 February keeps its day).
 * - `thirty-e-360`: 30E/360 (Eurobond Basis), 4.16 (g): as 30/360, but D2 = 31 always becomes 30. End of month:
 *   no February rule.
 * - `thirty-e-360-isda`: 30E/360 (ISDA), 4.16 (h): D1 becomes 30 when it is 31 or the last day of February; D2
 *   becomes 30 when it is 31, or the last day of February unless `end` is the Termination Date. Needs
 *   `terminationDayNumber`.
 * - `actual-365-leap`: Actual/365L, ICMA Rule 251: days / 366 or 365. With annual coupons, 366 when a 29 February
 *   falls after `start` and on or before `end`; otherwise 366 when `end` falls in a leap year. Needs
 *   `couponsPerYear`.
 * - `business-252`: Business/252: business days in `[start, end)` of `calendar` / 252 (Brazilian practice). Needs
 *   `calendar`.
 *
 * `start` counts and `end` does not (day numbers of the unadjusted or adjusted dates, as the contract says). A
 * period of no length gives 0. A reversed period (`end < start`) is refused with a KalendsRangeError rather than
 * negated. Contracts define their own conventions: a confirmation or an agreement overrides any default here.
 *
 * @example
 * ```ts
 * const start = dayNumberFromYmd(2003, 11, 1);
 * const end = dayNumberFromYmd(2004, 5, 1);
 * yearFractionOfDays('actual-actual-isda', start, end); // { numerator: 66491, denominator: 133590, value: 0.4977244... } (61/365 + 121/366)
 * yearFractionOfDays('actual-actual-icma', start, end, { couponsPerYear: 2, regularStart: start, regularEnd: end }).value; // 0.5
 * yearFractionOfDays('actual-360', start, end).value; // 0.5055555555555555 (182/360)
 * ```
 */
export function yearFractionOfDays(convention: DayCountConvention, start: number, end: number, options?: YearFractionOptions): YearFraction {
  const c = requireConvention('convention', convention);
  requireDayNumberArgument('start', start);
  requireDayNumberArgument('end', end);
  requireOrder('start', start, 'end', end);
  const o = readOptions('options', options, SCALAR_KEYS);
  refuseUnusedOptions(c, o);
  switch (c) {
    case 'one-one':
      return start === end ? ZERO : yearFractionFromParts(1, 1);
    case 'actual-actual-isda':
      return yearFractionFromParts(actualActualIsdaNumerator(start, end), ISDA_DENOMINATOR);
    case 'actual-actual-icma': {
      const couponsPerYear = readCouponsPerYear(c, o);
      const regularStart = readRegularDay(o, 'regularStart');
      const regularEnd = readRegularDay(o, 'regularEnd');
      checkRegularPeriod(start, end, regularStart, regularEnd, couponsPerYear, {
        start: 'start',
        end: 'end',
        regularStart: 'options.regularStart',
        regularEnd: 'options.regularEnd',
      });
      return yearFractionFromParts(end - start, couponsPerYear * (regularEnd - regularStart));
    }
    case 'actual-365-fixed':
      return yearFractionFromParts(end - start, 365);
    case 'actual-360':
      return yearFractionFromParts(end - start, 360);
    case 'thirty-360':
      return yearFractionFromParts(thirtyDays(start, end, false), 360);
    case 'thirty-e-360':
      return yearFractionFromParts(thirtyDays(start, end, true), 360);
    case 'thirty-e-360-isda': {
      const termination = readTermination(o);
      requireNotAfterTermination('end', end, termination);
      return yearFractionFromParts(thirtyE360IsdaDays(start, end, termination), 360);
    }
    case 'actual-365-leap': {
      const annual = readCouponsPerYear(c, o) === 1;
      return yearFractionFromParts(end - start, actual365LeapDenominator(start, end, annual));
    }
    case 'business-252':
      return yearFractionFromParts(countBusinessDays(readCalendar(o), start, end), 252);
  }
}

function readRegularDay(options: Readonly<Record<string, unknown>>, key: 'regularStart' | 'regularEnd'): number {
  const value = Object.prototype.hasOwnProperty.call(options, key) ? options[key] : undefined;
  if (value === undefined) {
    throw new KalendsTypeError(
      `options.${key}: Actual/Actual (ICMA) needs the regular coupon period that holds the period (ICMA Rule 251), got undefined; pass { regularStart, regularEnd }: the period itself when it is regular, the notional regular period around a stub`,
      { code: 'invalid-type', received: undefined, path: `options.${key}` },
    );
  }
  return requireDayNumberArgument(`options.${key}`, value);
}

/**
 * The exact sum of year fractions, reduced: for a long stub under Actual/Actual (ICMA), whose parts are computed
 * each within its own notional regular period (ICMA Rule 251), or for the accrual of several periods. The sum is
 * kept in integers; a sum whose reduced denominator passes 2^53 - 1 is refused (`limit-exceeded`).
 *
 * @example
 * ```ts
 * // A long first period, 15 August 2002 to 15 July 2003, semi-annual coupons on 15 January and 15 July:
 * const opts = (regularStart: number, regularEnd: number) => ({ couponsPerYear: 2, regularStart, regularEnd });
 * const [a, b, c] = [dayNumberFromYmd(2002, 8, 15), dayNumberFromYmd(2003, 1, 15), dayNumberFromYmd(2003, 7, 15)];
 * sumOfYearFractions([
 *   yearFractionOfDays('actual-actual-icma', a, b, opts(dayNumberFromYmd(2002, 7, 15), b)), // 153 / (2 * 184)
 *   yearFractionOfDays('actual-actual-icma', b, c, opts(b, c)), // 181 / (2 * 181)
 * ]); // { numerator: 337, denominator: 368, value: 0.9157608695652174 }
 * ```
 */
export function sumOfYearFractions(fractions: readonly YearFraction[]): YearFraction {
  if (!Array.isArray(fractions)) {
    throw new KalendsTypeError(`fractions: expected an array of year fractions { numerator, denominator }, got ${describeValue(fractions)}`, {
      code: 'invalid-type',
      received: fractions,
    });
  }
  let num = 0n;
  let den = 1n;
  for (let i = 0; i < fractions.length; i++) {
    const f: unknown = fractions[i];
    const n = fieldOf(f, 'numerator', i);
    const d = fieldOf(f, 'denominator', i);
    if (!Number.isSafeInteger(n) || !Number.isSafeInteger(d) || d <= 0) {
      const [key, value] = !Number.isSafeInteger(n) ? ['numerator', n] : ['denominator', d];
      throw new KalendsRangeError(
        `fractions[${i}].${key}: expected ${key === 'numerator' ? 'a safe integer' : 'a positive safe integer'}, got ${describeValue(value)}`,
        { code: 'out-of-range', received: value, path: `fractions[${i}].${key}` },
      );
    }
    num = num * BigInt(d) + BigInt(n) * den;
    den *= BigInt(d);
    const g = bigGcd(num < 0n ? -num : num, den);
    num /= g;
    den /= g;
    if (den > 9007199254740991n || num > 9007199254740991n || num < -9007199254740991n) {
      throw new KalendsRangeError(
        `fractions: the exact sum of the first ${i + 1} fractions needs integers beyond 2^53 - 1 (numerator ${num}, denominator ${den}); add fewer fractions at a time, or add their values as doubles`,
        { code: 'limit-exceeded', received: fractions.length },
      );
    }
  }
  return num === 0n ? ZERO : Object.freeze({ numerator: Number(num), denominator: Number(den), value: Number(num) / Number(den) });
}

function fieldOf(f: unknown, key: 'numerator' | 'denominator', i: number): number {
  if (typeof f !== 'object' || f === null || !Object.prototype.hasOwnProperty.call(f, key) || typeof (f as Record<string, unknown>)[key] !== 'number') {
    const got = typeof f === 'object' && f !== null ? describeValue((f as Record<string, unknown>)[key]) : describeValue(f);
    throw new KalendsTypeError(`fractions[${i}].${key}: expected a year fraction's ${key} (a number, as yearFractionOfDays returns), got ${got}`, {
      code: 'invalid-type',
      received: f,
      path: `fractions[${i}].${key}`,
    });
  }
  return (f as Record<string, number>)[key]!;
}

function bigGcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

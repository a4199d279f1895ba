/**
 * The day-count conventions by name: our identifiers, the trade's names beside them, the trade's spellings that
 * suggest ours, and the options each convention needs. See docs/day-counts.md.
 *
 * @module
 */
import type { CalendarInput } from '../business/index.js';

/**
 * A day-count convention, by our identifier. The trade's name and source of each:
 *
 * | identifier | trade name | source |
 * | --- | --- | --- |
 * | `one-one` | 1/1 | 2006 ISDA Definitions, section 4.16 (a) |
 * | `actual-actual-isda` | Actual/Actual (ISDA), Act/Act (ISDA) | 2006 ISDA Definitions, section 4.16 (b) |
 * | `actual-actual-icma` | Actual/Actual (ICMA), Act/Act (ICMA) | 2006 ISDA Definitions, section 4.16 (c); ICMA Rule 251 |
 * | `actual-365-fixed` | Actual/365 (Fixed), Act/365 (Fixed), A/365F | 2006 ISDA Definitions, section 4.16 (d) |
 * | `actual-360` | Actual/360, Act/360, A/360 | 2006 ISDA Definitions, section 4.16 (e) |
 * | `thirty-360` | 30/360, 360/360, Bond Basis | 2006 ISDA Definitions, section 4.16 (f) |
 * | `thirty-e-360` | 30E/360, Eurobond Basis | 2006 ISDA Definitions, section 4.16 (g) |
 * | `thirty-e-360-isda` | 30E/360 (ISDA) | 2006 ISDA Definitions, section 4.16 (h) |
 * | `actual-365-leap` | Actual/365L | ICMA Rule 251 |
 * | `business-252` | Business/252 (BUS/252) | Brazilian market practice (common practice) |
 */
export type DayCountConvention =
  | 'one-one'
  | 'actual-actual-isda'
  | 'actual-actual-icma'
  | 'actual-365-fixed'
  | 'actual-360'
  | 'thirty-360'
  | 'thirty-e-360'
  | 'thirty-e-360-isda'
  | 'actual-365-leap'
  | 'business-252';

/**
 * Every day-count convention's identifier, in the order of the 2006 ISDA Definitions, section 4.16 (a) to (h),
 * then Actual/365L and Business/252.
 *
 * @example
 * ```ts
 * DAY_COUNT_CONVENTIONS.includes('thirty-e-360-isda'); // true
 * ```
 */
export const DAY_COUNT_CONVENTIONS: readonly DayCountConvention[] = /* @__PURE__ */ Object.freeze([
  'one-one',
  'actual-actual-isda',
  'actual-actual-icma',
  'actual-365-fixed',
  'actual-360',
  'thirty-360',
  'thirty-e-360',
  'thirty-e-360-isda',
  'actual-365-leap',
  'business-252',
] as const);

/**
 * The trade's name of each convention, as a confirmation or a prospectus writes it.
 *
 * @example
 * ```ts
 * DAY_COUNT_TRADE_NAMES['thirty-e-360']; // '30E/360'
 * ```
 */
export const DAY_COUNT_TRADE_NAMES: Readonly<Record<DayCountConvention, string>> = /* @__PURE__ */ Object.freeze({
  'one-one': '1/1',
  'actual-actual-isda': 'Actual/Actual (ISDA)',
  'actual-actual-icma': 'Actual/Actual (ICMA)',
  'actual-365-fixed': 'Actual/365 (Fixed)',
  'actual-360': 'Actual/360',
  'thirty-360': '30/360',
  'thirty-e-360': '30E/360',
  'thirty-e-360-isda': '30E/360 (ISDA)',
  'actual-365-leap': 'Actual/365L',
  'business-252': 'Business/252',
});

/**
 * @internal The trade's spellings of each convention, normalized as the suggestion helper reads text (lower case,
 * spaces and underscores as hyphens), mapped to our identifiers. They only feed "did you mean": a trade spelling is
 * never accepted in place of our identifier. "Actual/365" alone is left out on purpose: the 2000 ISDA Definitions
 * used it for Actual/Actual (ISDA), others use it for Actual/365 (Fixed).
 */
export const DAY_COUNT_SYNONYMS: Readonly<Record<string, DayCountConvention>> = /* @__PURE__ */ Object.freeze({
  '1/1': 'one-one',
  'actual/actual': 'actual-actual-isda',
  'act/act': 'actual-actual-isda',
  'actual/actual-(isda)': 'actual-actual-isda',
  'act/act-(isda)': 'actual-actual-isda',
  'act/act-isda': 'actual-actual-isda',
  'actual/actual-isda': 'actual-actual-isda',
  'actual/actual-(icma)': 'actual-actual-icma',
  'act/act-(icma)': 'actual-actual-icma',
  'act/act-icma': 'actual-actual-icma',
  'actual/actual-icma': 'actual-actual-icma',
  'actual/actual-(isma)': 'actual-actual-icma',
  'act/act-(isma)': 'actual-actual-icma',
  'act/act-isma': 'actual-actual-icma',
  'actual/365-(fixed)': 'actual-365-fixed',
  'act/365-(fixed)': 'actual-365-fixed',
  'actual/365-fixed': 'actual-365-fixed',
  'act/365-fixed': 'actual-365-fixed',
  'act/365f': 'actual-365-fixed',
  'a/365f': 'actual-365-fixed',
  'actual/360': 'actual-360',
  'act/360': 'actual-360',
  'a/360': 'actual-360',
  '30/360': 'thirty-360',
  '360/360': 'thirty-360',
  'bond-basis': 'thirty-360',
  '30e/360': 'thirty-e-360',
  'eurobond-basis': 'thirty-e-360',
  '30e/360-(isda)': 'thirty-e-360-isda',
  '30e/360-isda': 'thirty-e-360-isda',
  'actual/365l': 'actual-365-leap',
  'act/365l': 'actual-365-leap',
  'business/252': 'business-252',
  'bus/252': 'business-252',
});

/**
 * Coupon periods per year that Actual/Actual (ICMA) and Actual/365L accept: annual, semi-annual, every four
 * months, quarterly, every two months and monthly (each a whole number of months, as ICMA Rule 251 counts them).
 *
 * @example
 * ```ts
 * COUPONS_PER_YEAR_VALUES; // [1, 2, 3, 4, 6, 12]
 * ```
 */
export const COUPONS_PER_YEAR_VALUES: readonly number[] = /* @__PURE__ */ Object.freeze([1, 2, 3, 4, 6, 12]);

/** A year fraction, exactly: `numerator / denominator` in lowest terms, and the nearest double. */
export interface YearFraction {
  /** The numerator in lowest terms (0 for a period of no length). */
  readonly numerator: number;
  /** The denominator in lowest terms, a positive integer (1 for a whole number of years). */
  readonly denominator: number;
  /** `numerator / denominator` as a double (correctly rounded: both are exact integers). */
  readonly value: number;
}

/**
 * Options of {@link yearFractionOfDays}. Each convention takes only the options it needs, and needs all of them;
 * an option a convention does not use is refused, so that a misplaced option never passes unnoticed.
 */
export interface YearFractionOptions {
  /**
   * Coupon periods per year: 1, 2, 3, 4, 6 or 12. Needed by `actual-actual-icma` (the frequency of ICMA Rule 251)
   * and `actual-365-leap` (annual coupons test for 29 February, the others the end date's year).
   */
  readonly couponsPerYear?: number;
  /**
   * `actual-actual-icma` only: the regular coupon period, actual or notional, that holds `[start, end)`, as day
   * numbers (`regularStart <= start`, `end <= regularEnd`). For a regular period it is the period itself; for a
   * short stub the notional regular period around it; a long stub is split at its notional coupon dates and the
   * parts added with `sumOfYearFractions`.
   */
  readonly regularStart?: number;
  /** `actual-actual-icma` only: the end of the regular period (see `regularStart`). */
  readonly regularEnd?: number;
  /**
   * `thirty-e-360-isda` only: the Termination Date of the transaction (2006 ISDA Definitions, section 3.3) as a day
   * number. A period ending on the last day of February keeps its day (28 or 29) only when it ends on this date.
   */
  readonly terminationDayNumber?: number;
  /** `business-252` only: the business calendar whose business days are counted (a bundled name or a calendar). */
  readonly calendar?: CalendarInput;
}

/**
 * Options of {@link yearFractionOfDaysBulk}: those of {@link YearFractionOptions}, with the regular periods of
 * Actual/Actual (ICMA) given per pair as arrays.
 */
export interface YearFractionBulkOptions {
  /** As in {@link YearFractionOptions.couponsPerYear}: one frequency for every pair. */
  readonly couponsPerYear?: number;
  /** `actual-actual-icma` only: the start of the regular period of each pair (same length as `starts`). */
  readonly regularStarts?: ArrayLike<number>;
  /** `actual-actual-icma` only: the end of the regular period of each pair (same length as `starts`). */
  readonly regularEnds?: ArrayLike<number>;
  /** As in {@link YearFractionOptions.terminationDayNumber}: one Termination Date for every pair. */
  readonly terminationDayNumber?: number;
  /** As in {@link YearFractionOptions.calendar}. */
  readonly calendar?: CalendarInput;
}

/** @internal The option keys each convention needs (all of them are required). */
export const NEEDED_OPTIONS: Readonly<Record<DayCountConvention, readonly string[]>> = /* @__PURE__ */ Object.freeze({
  'one-one': [],
  'actual-actual-isda': [],
  'actual-actual-icma': ['couponsPerYear', 'regularStart', 'regularEnd'],
  'actual-365-fixed': [],
  'actual-360': [],
  'thirty-360': [],
  'thirty-e-360': [],
  'thirty-e-360-isda': ['terminationDayNumber'],
  'actual-365-leap': ['couponsPerYear'],
  'business-252': ['calendar'],
});

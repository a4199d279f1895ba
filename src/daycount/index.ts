/**
 * Public surface of the day-count layer: the year fraction of a period under the conventions of the 2006 ISDA
 * Definitions (section 4.16), ICMA Rule 251 and Business/252, exactly and in bulk. See docs/day-counts.md.
 */
export {
  type DayCountConvention,
  type YearFraction,
  type YearFractionOptions,
  type YearFractionBulkOptions,
  DAY_COUNT_CONVENTIONS,
  DAY_COUNT_TRADE_NAMES,
  COUPONS_PER_YEAR_VALUES,
} from './conventions.js';
export { yearFractionOfDays, sumOfYearFractions } from './fraction.js';
export { yearFractionOfDaysBulk } from './bulk.js';

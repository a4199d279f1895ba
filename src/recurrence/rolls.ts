/**
 * Roll dates of the trade as frequency rules, as data: the IMM dates, the quarterly credit roll dates and month
 * ends. Each is a plain rule definition: pass it to `defineRule`, or spread it to add a calendar, a convention, a
 * start or a count (`{ ...CREDIT_ROLL_DATES, calendar, convention: 'following' }`). See docs/schedules.md.
 *
 * @module
 */
import { deepFreeze } from './plain.js';
import type { AnchoredMonthRuleDefinition, MonthlyRuleDefinition } from './types.js';

/**
 * The IMM dates: the third Wednesday of March, June, September and December (always between the 15th and the
 * 21st), the quarterly dates on which the trade's money-market futures and many swaps roll. Unadjusted: add a
 * `calendar` and a `convention` to move them to business days.
 *
 * @example
 * ```ts
 * listOccurrenceDayNumbers(defineRule(IMM_DATES), '2025-01-01', '2026-01-01').map(formatPlainDate);
 * // ['2025-03-19', '2025-06-18', '2025-09-17', '2025-12-17']
 * ```
 */
export const IMM_DATES: AnchoredMonthRuleDefinition = deepFreeze({
  kind: 'quarterly',
  month: 3,
  on: { weekday: 'wednesday', nth: 3 },
  label: 'IMM dates',
});

/**
 * The quarterly credit roll dates: the 20th of March, June, September and December, unadjusted, as the trade's
 * standard credit default swaps use them for their scheduled termination and premium dates (ISDA names these
 * dates when it describes the single-name roll). Spread it with a `calendar` and `convention: 'following'` for the
 * adjusted dates; a confirmation says which calendar.
 *
 * @example
 * ```ts
 * const adjusted = defineRule({ ...CREDIT_ROLL_DATES, calendar: 'us-federal', convention: 'following' });
 * listOccurrenceDayNumbers(adjusted, '2025-07-01', '2026-01-01').map(formatPlainDate); // ['2025-09-22', '2025-12-22']
 * ```
 */
export const CREDIT_ROLL_DATES: AnchoredMonthRuleDefinition = deepFreeze({
  kind: 'quarterly',
  month: 3,
  on: { day: 20 },
  label: 'quarterly credit roll dates',
});

/**
 * Month-end rolls: the last day of every month (the trade's end-of-month rule makes a schedule that starts on a
 * month end stay on month ends). Spread it with `kind: 'quarterly'` and a `month`, or `every` and an `anchor`, for
 * longer steps.
 *
 * @example
 * ```ts
 * listOccurrenceDayNumbers(defineRule({ ...MONTH_END_DATES, kind: 'quarterly', month: 2 }), '2024-01-01', '2025-01-01').map(formatPlainDate);
 * // ['2024-02-29', '2024-05-31', '2024-08-31', '2024-11-30']
 * ```
 */
export const MONTH_END_DATES: MonthlyRuleDefinition = deepFreeze({
  kind: 'monthly',
  on: { day: 'last' },
  label: 'month ends',
});

/**
 * Public surface of the recurrence layer: frequency rules as plain data, their expansion into dates and
 * instants, finance schedules with stubs, and RFC 5545 recurrence text.
 */
export type {
  WeekdayInput,
  DateInput,
  InstantInput,
  RuleCalendarInput,
  WhenShort,
  DaySelector,
  DateRuleCommon,
  DaysRuleDefinition,
  BusinessDaysRuleDefinition,
  WeeklyRuleDefinition,
  MonthlyRuleDefinition,
  SemiMonthlyRuleDefinition,
  AnchoredMonthRuleDefinition,
  PeriodsRuleDefinition,
  IntradayRuleDefinition,
  Rfc5545Frequency,
  Rfc5545WeekdayNum,
  Rfc5545RuleDefinition,
  Rfc5545RuleParts,
  RuleDefinition,
  RuleKind,
  Rule,
} from './types.js';
export { defineRule } from './generate.js';
export {
  type RangeOptions,
  type IterateOptions,
  type StepOptions,
  listOccurrenceDayNumbers,
  listOccurrenceEpochMs,
  occurrenceDayNumberBulk,
  occurrenceEpochMsBulk,
  iterateOccurrenceDayNumbers,
  iterateOccurrenceEpochMs,
  nextOccurrenceDayNumber,
  nextOccurrenceEpochMs,
  previousOccurrenceDayNumber,
  previousOccurrenceEpochMs,
  isOccurrenceDayNumber,
  isOccurrenceEpochMs,
} from './occurrences.js';
export { type ParseRecurrenceOptions, type FormatRecurrenceOptions, parseRecurrenceRule, formatRecurrenceRule } from './rfc5545.js';
export {
  type StubPlacement,
  type ScheduleStep,
  type ScheduleOptions,
  type SchedulePeriod,
  type Schedule,
  type SchedulePaymentOptions,
  type ScheduleFixingOptions,
  type ScheduleDayCountOptions,
  defineSchedule,
} from './schedule.js';
export { describeRule } from './describe.js';
export { type ClosedDay, type DateMove, type OccurrenceAdjustment, adjustmentOfOccurrence } from './adjustments.js';
export { IMM_DATES, CREDIT_ROLL_DATES, MONTH_END_DATES } from './rolls.js';
export { type CalendarEvent, type FormatCalendarOptions, formatCalendar } from './icalendar.js';

/** Public surface of the business layer: holiday rules, business calendars, business-day arithmetic. */
export {
  type ObservanceShift,
  type Observance,
  type HolidayRuleBase,
  type FixedDateRule,
  type NthWeekdayRule,
  type WeekdayNearDateRule,
  type EasterRule,
  type RelativeRule,
  type HolidayRule,
  type DatedEntry,
  type BundledCalendarName,
  type CalendarDefinition,
  type BusinessDayConvention,
  HOLIDAY_CAUTION,
  BUSINESS_DAY_CONVENTIONS,
} from './definition.js';
export {
  type BusinessCalendar,
  type CalendarInput,
  type Holiday,
  type PeriodLike,
  UnknownCalendarError,
  defineCalendar,
  calendarFromName,
  isBusinessDay,
  nextBusinessDay,
  previousBusinessDay,
  shiftBusinessDays,
  countBusinessDays,
  adjustDayNumber,
  listHolidays,
  nthBusinessDayOfRange,
  nthBusinessDayOfPeriod,
} from './calendar.js';
export { isBusinessDayBulk, countBusinessDaysBulk, shiftBusinessDaysBulk, adjustDayNumberBulk } from './bulk.js';
export {
  BUNDLED_CALENDAR_NAMES,
  US_FEDERAL_HOLIDAYS,
  ENGLAND_AND_WALES_BANK_HOLIDAYS,
  EURO_T2_CLOSING_DAYS,
} from './jurisdictions/index.js';

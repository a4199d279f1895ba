/**
 * @internal The one place where the profile layer touches the layers below it (civil, zone, period, business,
 * recurrence, hours), so that their public names appear here once. Renames in those layers are reconciled in this file.
 *
 * @module
 */
export { type WeekdayName, WEEKDAY_NAMES, dayNumberFromYmd, isoWeekDateFromDayNumber, ymdFromDayNumber, weekdayOfDayNumber } from '../civil/index.js';
export { parsePlainDate, formatPlainDate } from '../instant/index.js';
export { type Zone, UnknownZoneError, toZone } from '../zone/index.js';
export {
  type CalendarUnitName,
  type ExtraWeekPlacement,
  type FiscalKind,
  type PeriodUnit,
  type UnitDefinition,
  type WeekLayout,
  type YearNaming,
  defineUnit,
} from '../period/index.js';
export {
  type BusinessCalendar,
  type BusinessDayConvention,
  type CalendarDefinition,
  BUNDLED_CALENDAR_NAMES,
  BUSINESS_DAY_CONVENTIONS,
  calendarFromName,
  defineCalendar,
} from '../business/index.js';
export { type Rule, type RuleDefinition, type RuleKind, defineRule } from '../recurrence/index.js';
export { type BusinessHours, type HoursDefinition, defineHours } from '../hours/index.js';

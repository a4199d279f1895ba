/**
 * @internal The one place where the warehouse layer touches the layers below it, so that their public names appear
 * here once. Renames in those layers are reconciled in this file.
 *
 * @module
 */
export { MS_PER_DAY, MIN_EPOCH_MS, MAX_EPOCH_MS, MAX_DIMENSION_DAYS } from '../bounds.js';
export { WEEKDAY_NAMES, dayNumberFromYmd, isoWeekDateFromDayNumber, weekdayOfDayNumber, ymdFromDayNumber } from '../civil/index.js';
export { formatPlainDate, parsePlainDate, toDayNumber } from '../instant/index.js';
export { type Zone, type ZoneInput, listTransitions, nextTransition, offsetSecondsFromEpochMs, previousTransition, toZone } from '../zone/index.js';
export { type PeriodUnit, formatOrdinalBulk, ordinalFromDayNumberBulk } from '../period/index.js';
export { type BusinessCalendar, type Holiday, adjustDayNumber, isBusinessDay, listHolidays, nextBusinessDay, previousBusinessDay } from '../business/index.js';
export { type Rule, type RuleDefinition, adjustmentOfOccurrence, defineRule, listOccurrenceDayNumbers } from '../recurrence/index.js';
export { reasonOfMove } from '../recurrence/adjustments.js';
export { type Profile, calendarOfProfile, unitOfProfile } from '../profile/index.js';
export { placeOfPeriod, fillTemplate, templateOfUnit, formatDayForPeople } from '../profile/labels.js';
export { calendarNamed, requireProfile } from '../profile/profile.js';

/** Public surface of the profile layer: one JSON document for a business's calendar, and labels for people. */
export {
  type ProfileDefinition,
  type MonthFiscalYear,
  type WeekFiscalYear,
  type ProfileUnitDefinition,
  type ProfileCalendarDefinition,
  type ProfileRuleDefinition,
  type ProfileHoursDefinition,
  type ProfileLabels,
  type ProfileWarehouse,
  type LabelFieldName,
  LABEL_FIELD_NAMES,
} from './document.js';
export { type Profile, type ProfileWarehouseRange, defineProfile, unitOfProfile, calendarOfProfile, ruleOfProfile, hoursOfProfile } from './profile.js';
export { type PeriodPlace, formatLabelForPeople, formatDayForPeople } from './labels.js';

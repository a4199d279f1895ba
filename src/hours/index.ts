/**
 * Public surface of the hours layer: opening hours, early closes, cut-off times and business time in elapsed
 * milliseconds, exact across DST changes, with bulk forms over typed arrays.
 */
export {
  type IntervalDefinition,
  type WeekDefinition,
  type SpecialDayDefinition,
  type HoursDefinition,
  HOURS_CAUTION,
} from './definition.js';
export { type BusinessHours, NoSessionError, defineHours } from './hours.js';
export {
  type Session,
  type NearestOptions,
  type ListSessionsOptions,
  isOpen,
  sessionOfEpochMs,
  nextOpeningEpochMs,
  nextClosingEpochMs,
  previousOpeningEpochMs,
  previousClosingEpochMs,
  shiftBusinessTime,
  countBusinessMs,
  valueDayNumberOfEpochMs,
  cutoffEpochMsOfDayNumber,
  listSessions,
} from './query.js';
export {
  isOpenBulk,
  countBusinessMsBulk,
  nextOpeningEpochMsBulk,
  nextClosingEpochMsBulk,
  shiftBusinessTimeBulk,
  valueDayNumberOfEpochMsBulk,
} from './bulk.js';

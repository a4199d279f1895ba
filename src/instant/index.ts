/**
 * Public surface of the instant layer: epoch milliseconds as the instant, RFC 3339 / RFC 9557 text, ISO 8601
 * dates and durations, and the one coercion point from what users hold.
 */
export {
  type SuffixTag,
  type LeapSecondHandling,
  type ParseDateTimeOptions,
  type ParsePlainDateTimeOptions,
  type ExtendedDateTime,
  type ParsedInstant,
  parseExtendedDateTime,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
} from './text.js';
export {
  type FractionDigits,
  type FormatInstantOptions,
  formatInstant,
  formatOffset,
  formatPlainDate,
  formatIsoWeekDate,
  formatOrdinalDate,
  formatPlainDateTime,
} from './format.js';
export {
  type Duration,
  type DurationFields,
  type ShiftOptions,
  durationFromFields,
  negateDuration,
  exactMsOfDuration,
  parseDuration,
  formatDuration,
  shiftDayNumber,
  shiftWallMs,
} from './duration.js';
export {
  type ToDayNumberOptions,
  type TemporalNamespaceLike,
  toEpochMs,
  toDayNumber,
  toWallMs,
  temporalInstantFromEpochMs,
  temporalPlainDateFromDayNumber,
  temporalPlainDateTimeFromWallMs,
} from './coerce.js';

/**
 * Every range kalends supports, declared once. Other modules import these; none restates them.
 *
 * The civil range covers whole proleptic Gregorian years -271821 through 275760, the years that the ECMAScript
 * time value range and Temporal.PlainDate touch. Instants are ECMAScript time values: ±8.64e15 ms from the epoch
 * (ECMA-262, "Time Values and Time Range").
 *
 * @module
 */

/** First supported year (proleptic Gregorian, astronomical numbering: year 0 = 1 BCE). */
export const MIN_YEAR = -271821;
/** Last supported year. */
export const MAX_YEAR = 275760;
/** Day number of MIN_YEAR-01-01 (days since 1970-01-01). */
export const MIN_DAY_NUMBER = -100_000_109;
/** Day number of MAX_YEAR-12-31. */
export const MAX_DAY_NUMBER = 100_000_109;
/** Smallest supported instant in epoch milliseconds (-271821-04-20T00:00:00Z). */
export const MIN_EPOCH_MS = -8.64e15;
/** Largest supported instant in epoch milliseconds (+275760-09-13T00:00:00Z). */
export const MAX_EPOCH_MS = 8.64e15;
/** Milliseconds in a civil day of 86,400 SI seconds (no leap seconds, as in POSIX time and ECMA-262). */
export const MS_PER_DAY = 86_400_000;
/** Largest absolute UTC offset accepted, in seconds (exclusive of 24 hours, as in RFC 9557 and Temporal). */
export const MAX_OFFSET_SECONDS = 86_399;

/** Largest magnitude of a duration's calendar field (years, months, weeks, days): below 2^32, as in Temporal. */
export const MAX_DURATION_CALENDAR_FIELD = 4_294_967_295;

// ---------------------------------------------------------------------------------------------------------
// Derived ranges

/** Longest period a unit may have, in days: a cycle of a century (`{ kind: 'cycle', lengthDays }`). */
export const MAX_CYCLE_DAYS = 36_525;
/**
 * The day numbers whose first instant the zone layer gives (`firstEpochMsOfDayNumber`, `lengthMsOfDayNumber`): the
 * civil range widened by the longest period on each side, so that the first day and the exclusive end of every
 * period of every unit, the partial periods at the ends of the range included, have a first instant. Days whose
 * start lies outside ±8.64e15 ms get instants outside it, computed with the zone's rules at the nearest end of the
 * instant range (its offset there before the range; its yearly rules repeated, 400 Gregorian years at a time,
 * after it).
 */
export const MIN_ZONED_DAY_NUMBER = MIN_DAY_NUMBER - MAX_CYCLE_DAYS;
/** The last day number of {@link MIN_ZONED_DAY_NUMBER}'s range. */
export const MAX_ZONED_DAY_NUMBER = MAX_DAY_NUMBER + MAX_CYCLE_DAYS;

// ---------------------------------------------------------------------------------------------------------
// Operational limits: work per call and memory are bounded (docs/design.md, "Limits")

/** How many zones the zone cache holds (least recently used ones are dropped first). */
export const ZONE_CACHE_LIMIT = 64;
/** How many compiled units the unit cache holds (the oldest is dropped first). */
export const UNIT_CACHE_LIMIT = 256;
/** Most periods a period list returns (`listSubPeriods`, `listOverlappingPeriods`) before `limit-exceeded`. */
export const MAX_LIST_LENGTH = 100_000;
/**
 * Most years of a zone's rules one `listTransitions` call walks before `limit-exceeded` (about a second for a
 * zone read from Intl), unless the rules have fallen quiet for good.
 */
export const MAX_TRANSITION_WALK_YEARS = 2_000;
/** Default `limit` of `listTransitions`: the most transitions one call returns. */
export const DEFAULT_TRANSITION_LIMIT = 100_000;
/** Largest `limit` of `listTransitions`. */
export const MAX_TRANSITION_LIMIT = 10_000_000;

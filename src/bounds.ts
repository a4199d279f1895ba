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
/** Most local days in one warehouse export (a calendar dimension): about 2,700 years. */
export const MAX_DIMENSION_DAYS = 1_000_000;

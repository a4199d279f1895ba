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

/** Default first year of opening hours defined without a business calendar (see docs/business-time.md). */
export const HOURS_DEFAULT_FIRST_YEAR = 1900;
/** Default last year of opening hours defined without a business calendar. */
export const HOURS_DEFAULT_LAST_YEAR = 2199;
/** Most opening intervals on one day of a definition of hours (week pattern or special day). */
export const MAX_HOURS_INTERVALS_PER_DAY = 16;
/** Most special days in one definition of hours. */
export const MAX_HOURS_SPECIAL_DAYS = 10_000;
/** Most named cut-off times in one definition of hours. */
export const MAX_HOURS_CUTOFFS = 32;
/** Largest `offset`, in business days, of a special day from the holiday it is relative to. */
export const MAX_HOURS_HOLIDAY_OFFSET = 10;
/**
 * Days a search for the next or previous session (an opening, a closing, the next business day, the end of a
 * business duration) walks without finding one before it throws a `no-business-day` error: about ten years.
 */
export const HOURS_SEARCH_LIMIT_DAYS = 3_660;
/**
 * Most years of sessions one compiled table of hours holds: one call may span at most this many years (a pair of
 * instants, or the instants of one bulk call); the table is rebuilt around each call's years as needed.
 */
export const HOURS_TABLE_MAX_YEARS = 400;
/** Default cap on the sessions `listSessions` returns before it throws `limit-exceeded`. */
export const HOURS_LIST_LIMIT = 10_000;
/** Largest `limit` `listSessions` accepts. */
export const MAX_HOURS_LIST_LIMIT = 1_000_000;

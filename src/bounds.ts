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

// Business and recurrence limits (docs/design.md, "Limits").

/** Most holidays one `listHolidays` call returns; longer ranges are listed a page (a narrower range) at a time. */
export const MAX_LISTED_HOLIDAYS = 100_000;
/** Longest search, in days, for a bank-holiday substitute day before a calendar gives up with an error. */
export const MAX_SUBSTITUTE_SEARCH = 60;
/** Consecutive years without a business day after which a search gives up with a 'no-business-day' error. */
export const MAX_EMPTY_YEARS = 100;
/** Most years of business-day bits a calendar keeps compiled at once (about 100 bytes a year). */
export const MAX_WINDOW_YEARS = 4096;
/**
 * Most years a single business-day count or shift evaluates one by one, for calendars whose years do not repeat
 * every 400 years (a Julian Easter rule, an Easter substitute day); beyond it the call throws 'limit-exceeded'.
 * Calendars that repeat count any span of years at the cost of one 400-year cycle.
 */
export const MAX_EVALUATED_YEARS = 50_000;
/** Largest total offset, in days, of an Easter or relative holiday rule from its base date. */
export const MAX_RULE_OFFSET = 300;
/**
 * Largest `count` of a frequency rule whose occurrences repeat (a fixed step, or the 400-year Gregorian cycle):
 * where its count ends is computed, not listed, at a cost that does not grow with the count.
 */
export const MAX_COUNT = 10_000_000;
/**
 * Largest `count` of a rule whose count is found by listing its occurrences: business-day selectors and steps,
 * fiscal periods, wall-clock intraday steps, RFC 5545 times of day in a zone.
 */
export const MAX_LISTED_COUNT = 100_000;
/** Most occurrences one list or bulk call returns by default (`maxCount`), and the most it may be raised to. */
export const DEFAULT_MAX_OCCURRENCES = 1_000_000;
/** Most occurrences `maxCount` may ask one list or bulk call for. */
export const MAX_OCCURRENCES = 10_000_000;
/** Largest RFC 5545 INTERVAL accepted (RFC 5545 sets no upper bound). */
export const MAX_RFC5545_INTERVAL = 1_000_000;
/** Most periods a finance schedule may have. */
export const MAX_SCHEDULE_PERIODS = 1_000_000;
/** Largest `every` of a rule stepping by days, weeks or business days, and largest step of a schedule. */
export const MAX_RULE_EVERY = 100_000;
/** Largest `every` of a rule stepping by months, quarters, years or fiscal periods. */
export const MAX_RULE_EVERY_PERIODS = 10_000;
/** Farthest, in days, a business-day convention may move a date before a rule reports `no-business-day`. */
export const MAX_ADJUSTMENT_DAYS = 4096;
/** Largest payment or fixing lag of a finance schedule, in business days. */
export const MAX_LAG_BUSINESS_DAYS = 1000;

/**
 * The most periods (rows) one series call may produce, even when asked: a bucket range, an alignment, a grid of
 * periods. More is almost certainly a mistaken unit or range.
 */
export const MAX_BUCKET_PERIODS = 50_000_000;
/**
 * The most rows a series call produces beyond its input unless the caller raises it with the call's `maxRows`
 * option (up to {@link MAX_BUCKET_PERIODS}): a bucket range, an alignment, a fill grid. One million days is
 * about 2,738 years; past it, page with a narrower range or a coarser unit.
 */
export const MAX_SERIES_ROWS = 1_000_000;

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

/** Most local days in one warehouse export (a calendar dimension): about 2,700 years. */
export const MAX_DIMENSION_DAYS = 1_000_000;

/**
 * The plain-data vocabulary of opening hours: the zone, the business calendar, the weekly pattern of opening
 * intervals, special days (by date or relative to a named holiday) and named cut-off times. Everything here is
 * JSON-serializable; `defineHours` validates and compiles it. See docs/business-time.md.
 *
 * @module
 */
import type { WeekdayName } from '../civil/names.js';
import type { BusinessCalendar, CalendarDefinition } from '../business/index.js';
import type { Disambiguation } from '../zone/index.js';

/**
 * One opening interval in wall-clock time, `HH:MM` or `HH:MM:SS` (24-hour clock). `open` is from 00:00 to
 * 23:59:59; `close` from 00:00 to 24:00. When `close` is earlier than `open` the interval runs overnight into the
 * next day (22:00 to 06:00) and belongs to the day it opens on. An interval of zero length (`close` equal to
 * `open`) is refused: a 24-hour session is written `{ open: '00:00', close: '24:00' }`.
 */
export interface IntervalDefinition {
  /** When the interval opens, `HH:MM` or `HH:MM:SS`, 00:00 to 23:59:59. */
  readonly open: string;
  /** When it closes, `HH:MM` or `HH:MM:SS`, 00:00 to 24:00; earlier than `open` for an overnight interval. */
  readonly close: string;
}

/** The weekly pattern: the opening intervals of each weekday (several allowed). A weekday left out is closed. */
export type WeekDefinition = { readonly [day in WeekdayName]?: readonly IntervalDefinition[] };

/**
 * A special day: which day (`date`, or `holiday` with an `offset` in business days), and what changes on it.
 *
 * Which day (exactly one):
 * - `date`: an ISO 8601 date, `YYYY-MM-DD`.
 * - `holiday`: the name (or rule id) of a holiday of the calendar, as `listHolidays` names it; with `offset`
 *   (default 0), the day that many business days of the calendar from the day the holiday is observed: -1 is the
 *   business day before it, 1 the business day after it, 0 the holiday itself.
 *
 * What changes (one of these; `cutoffs` and `name` may go with any but `closed`):
 * - `closed: true`: no session that day.
 * - `hours`: these intervals instead of the regular ones.
 * - `open` and/or `close`: a late open or an early close: the regular intervals cut at these wall times.
 * - `extra`: intervals added to the regular ones (alone or with `open` / `close`).
 */
export interface SpecialDayDefinition {
  /** Which day, as an ISO 8601 date (`YYYY-MM-DD`). */
  readonly date?: string;
  /** Which day, as a holiday of the calendar by name or rule id (with `offset`). */
  readonly holiday?: string;
  /** Business days from the day `holiday` is observed (default 0, the holiday itself). */
  readonly offset?: number;
  /** What the day is, for people ("Christmas Eve: early close"). */
  readonly name?: string;
  /** `true`: no session that day. */
  readonly closed?: boolean;
  /** The day's intervals, instead of the regular ones. */
  readonly hours?: readonly IntervalDefinition[];
  /** A late open: the day's regular intervals start no earlier than this wall time. */
  readonly open?: string;
  /** An early close: the day's regular intervals end no later than this wall time. */
  readonly close?: string;
  /** Intervals added to the day's regular ones. */
  readonly extra?: readonly IntervalDefinition[];
  /** Cut-off times that differ on this day, by name (the others stay as `cutoffs` sets them). */
  readonly cutoffs?: Readonly<Record<string, string>>;
}

/**
 * Opening hours as plain data. Compile with `defineHours`.
 *
 * - `zone`: the IANA zone (or fixed offset) of the wall clock the hours are written in.
 * - `calendar`: the business calendar whose weekend days and holidays close the day: a bundled name, an inline
 *   definition, or a compiled calendar (its definition is kept). Without one, no day is closed by a calendar.
 * - `week`: the regular opening intervals per weekday.
 * - `special`: days that differ, by date or relative to a named holiday.
 * - `cutoffs`: named cut-off times per business day (`{ payments: '17:00' }`), each inside the day's sessions
 *   unless `allowCutoffsOutsideSessions` is true.
 * - `disambiguation`: how a wall time the clocks skipped (a gap) or showed twice (an overlap) becomes an instant,
 *   in Temporal's words; default `'compatible'` (in a gap, later by the gap's length; in an overlap, the earlier).
 * - `years`: the years the hours answer for; defaults to the calendar's years (or 1900..2199 without a calendar).
 */
export interface HoursDefinition {
  /** A short identifier of the hours. */
  readonly id?: string;
  /** A name for people. */
  readonly name?: string;
  /** Where the hours come from (the institution's published hours). */
  readonly source?: string;
  /** A caution to carry with the hours. */
  readonly caution?: string;
  /** The IANA zone (or fixed offset) of the wall clock the hours are written in. */
  readonly zone: string;
  /** The business calendar whose weekend days and holidays close the day (none by default). */
  readonly calendar?: string | CalendarDefinition | BusinessCalendar;
  /** The regular opening intervals of each weekday. */
  readonly week: WeekDefinition;
  /** Days that differ from the regular week, by date or relative to a named holiday. */
  readonly special?: readonly SpecialDayDefinition[];
  /** Named cut-off times of each business day, `HH:MM` or `HH:MM:SS` (`{ payments: '17:00' }`). */
  readonly cutoffs?: Readonly<Record<string, string>>;
  /** Accept cut-off times outside the day's sessions (default false). */
  readonly allowCutoffsOutsideSessions?: boolean;
  /** How a wall time in a gap or an overlap becomes an instant (default `'compatible'`). */
  readonly disambiguation?: Disambiguation;
  /** The years the hours answer for (default: the calendar's years, or 1900..2199 without a calendar). */
  readonly years?: {
    /** The first year (inclusive). */
    readonly from?: number;
    /** The last year (inclusive). */
    readonly until?: number;
  };
}

/** The caution the docs and the CLI carry with every definition of hours. */
export const HOURS_CAUTION =
  'Official opening hours, early closes and cut-off times are set by the institution (the exchange, the bank, the ' +
  'payment system) and change by its notice. Verify every definition against the institution\'s published hours ' +
  'before relying on it where money or a deadline depends on it.';

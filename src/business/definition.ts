/**
 * The plain-data vocabulary of business calendars: holiday rules, observance shifts, one-off additions and
 * removals, weekends, composition. Everything here is JSON-serializable; `defineCalendar` validates and compiles
 * it. See docs/business-days.md.
 *
 * @module
 */

import type { WeekdayName } from '../civil/names.js';

/** A weekday by its lowercase English name, as written in definitions (the civil layer's type). */
export type { WeekdayName };

/**
 * Where a holiday moves when its date falls on one of the weekend days its rule names. A "non-weekend day" is a
 * day outside the calendar's weekend (it may still be another holiday, except for `substitute-day`).
 *
 * - `previous-non-weekend-day`: the nearest earlier day outside the weekend (Saturday -> Friday with a
 *   Saturday-Sunday weekend).
 * - `next-non-weekend-day`: the nearest later day outside the weekend (Sunday -> Monday).
 * - `nearest-non-weekend-day`: whichever of the two is closer; a tie goes to the later one.
 * - `substitute-day`: the first later day that is neither a weekend day nor already a holiday (the actual date of
 *   another holiday of this calendar, or a substitute given earlier), as with bank-holiday substitute days.
 *
 * Renamed in 0.2: `previous-weekday`, `next-weekday` and `nearest-weekday` (the old words read wrongly next to a
 * rule's `weekday: 'friday'`).
 */
export type ObservanceShift = 'previous-non-weekend-day' | 'next-non-weekend-day' | 'nearest-non-weekend-day' | 'substitute-day';

/**
 * Which weekend days move a holiday, and where to. Only the weekdays named here trigger a move: a rule with
 * `{ sunday: 'next-non-weekend-day' }` stays on a Saturday. Every key must be a weekend day of the calendar.
 */
export type Observance = { readonly [day in WeekdayName]?: ObservanceShift };

/** Fields shared by every holiday rule. */
export interface HolidayRuleBase {
  /** Identifier, unique within the calendar; needed for `relative` rules and to replace or omit a rule when extending. */
  readonly id?: string;
  /** The holiday's name, as listed by `listHolidays`. */
  readonly name: string;
  /** First year (inclusive) in which the rule applies. */
  readonly from?: number;
  /** Last year (inclusive) in which the rule applies. */
  readonly until?: number;
  /** Observance shift for weekend dates; `{}` means none. Defaults to the calendar's (or the extended calendar's) `observance`, or none. */
  readonly observance?: Observance;
  /** Free text: where the rule comes from (a statute, a proclamation). */
  readonly source?: string;
}

/** A fixed month and day each year. 29 February gives a date only in leap years. */
export interface FixedDateRule extends HolidayRuleBase {
  /** Selects this kind of rule. */
  readonly kind: 'fixed';
  /** The month, 1..12. */
  readonly month: number;
  /** The day of the month. */
  readonly day: number;
}

/**
 * The nth weekday of a month (1 to 5) or its last one. A 5th weekday that a month lacks in a given year (the 5th
 * Monday of February) gives no date that year.
 */
export interface NthWeekdayRule extends HolidayRuleBase {
  /** Selects this kind of rule. */
  readonly kind: 'nth-weekday';
  /** The month, 1..12. */
  readonly month: number;
  /** The weekday. */
  readonly weekday: WeekdayName;
  /** Which such weekday of the month: 1 to 5, or `'last'`. */
  readonly nth: 1 | 2 | 3 | 4 | 5 | 'last';
}

/** The first given weekday on or after (or on or before) a month and day: "the Saturday from 20 June". */
export interface WeekdayNearDateRule extends HolidayRuleBase {
  /** Selects the direction: the weekday on or after the date, or on or before it. */
  readonly kind: 'weekday-on-or-after' | 'weekday-on-or-before';
  /** The month of the date, 1..12. */
  readonly month: number;
  /** The day of the date. */
  readonly day: number;
  /** The weekday. */
  readonly weekday: WeekdayName;
}

/** `offset` days from Easter Sunday (Good Friday is -2, Easter Monday 1), by the Gregorian or Julian computus. */
export interface EasterRule extends HolidayRuleBase {
  /** Selects this kind of rule. */
  readonly kind: 'easter';
  /** Days from Easter Sunday (negative before it). */
  readonly offset: number;
  /** Defaults to `'gregorian'`. `'julian'` gives the Eastern Orthodox date as a Gregorian civil date. */
  readonly computus?: 'gregorian' | 'julian';
}

/**
 * `offset` days from the date another rule of the same calendar gives in the same year, before observance (the
 * day after the fourth Thursday of November). When the other rule gives no date, neither does this one.
 */
export interface RelativeRule extends HolidayRuleBase {
  /** Selects this kind of rule. */
  readonly kind: 'relative';
  /** The `id` of the other rule. */
  readonly to: string;
  /** Days from the other rule's date (negative before it). */
  readonly offset: number;
}

/** One holiday rule. */
export type HolidayRule = FixedDateRule | NthWeekdayRule | WeekdayNearDateRule | EasterRule | RelativeRule;

/** A single dated entry: a one-off holiday, or the removal of a holiday observed on that date. */
export interface DatedEntry {
  /** ISO 8601 calendar date, `YYYY-MM-DD` (or `±YYYYYY-MM-DD`). */
  readonly date: string;
  /** What it is: the extra holiday's name, or which holiday the removal takes away and why. */
  readonly name: string;
}

/** The bundled calendars' names. */
export type BundledCalendarName = 'us-federal' | 'england-and-wales' | 'euro-t2';

/**
 * A business calendar as plain data.
 *
 * Composition: `extends` takes another calendar (a definition or a bundled name) and adds to it: its rules,
 * additions and removals come first, rules here with the same `id` replace them, `omitRules` drops some, and
 * `weekend`, `observance` and `years` here override. `union` combines whole calendars: a day is a holiday if it is
 * one in any member, and a weekend day if it is one in any member; rules given beside `union` are evaluated with
 * the combined weekend. A calendar extending another inherits its default `observance`.
 */
export interface CalendarDefinition {
  /** Short identifier (`us-federal`); shown in messages. */
  readonly id?: string;
  /** Human-readable name. */
  readonly name?: string;
  /** The legal source of the rules. */
  readonly source?: string;
  /** The caution shown with the calendar: holidays change by proclamation; verify against the official calendar. */
  readonly caution?: string;
  /** The calendar this one adds to: a definition, a bundled name, or a compiled calendar (its definition is used). */
  readonly extends?: CalendarDefinition | BundledCalendarName | string | {
    /** A compiled calendar, whose definition is used. */
    readonly definition: CalendarDefinition;
  };
  /** Calendars combined into this one (definitions, bundled names or compiled calendars). */
  readonly union?: readonly (CalendarDefinition | BundledCalendarName | string | {
    /** A compiled calendar, whose definition is used. */
    readonly definition: CalendarDefinition;
  })[];
  /** Weekend days; defaults to Saturday and Sunday (or the extended calendar's). Never all seven. */
  readonly weekend?: readonly WeekdayName[];
  /** Default observance for rules that give none; a calendar that extends this one inherits it. */
  readonly observance?: Observance;
  /** The years (inclusive) the calendar answers for; queries outside them throw a KalendsRangeError. */
  readonly years?: {
    /** The first year (inclusive). */
    readonly from?: number;
    /** The last year (inclusive). */
    readonly until?: number;
  };
  /** The holiday rules. */
  readonly holidays?: readonly HolidayRule[];
  /** Ids of rules of the extended calendar to leave out. Only with `extends`. */
  readonly omitRules?: readonly string[];
  /** One-off extra holidays. */
  readonly additions?: readonly DatedEntry[];
  /** One-off removals: the holidays observed on these dates are not holidays (a holiday moved for one year). */
  readonly removals?: readonly DatedEntry[];
}

/** The caution every bundled calendar carries; calendars built on them should carry it too. */
export const HOLIDAY_CAUTION =
  'Holiday calendars change by law and by proclamation, sometimes at short notice. Verify every date against the ' +
  'official calendar of the jurisdiction before relying on it, and defer to local rules and to licensed professionals ' +
  'where money or a deadline depends on it.';

/** Business-day conventions: ISDA 2006 Definitions section 4.12 names, plus modified preceding and no adjustment. */
export type BusinessDayConvention = 'following' | 'modified-following' | 'preceding' | 'modified-preceding' | 'none';

/** The conventions, in the order docs list them. */
export const BUSINESS_DAY_CONVENTIONS: readonly BusinessDayConvention[] = Object.freeze([
  'following',
  'modified-following',
  'preceding',
  'modified-preceding',
  'none',
]);

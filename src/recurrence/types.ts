/**
 * The plain-data vocabulary of frequency rules. A rule definition is a JSON-serializable object; `defineRule`
 * validates it (collecting every fault with its dotted path) and compiles it into a {@link Rule}.
 *
 * Dates inside definitions are ISO 8601 calendar dates (`"2025-01-31"`) or day numbers; wall-clock times are
 * ISO 8601 local date-times (`"2025-03-09T01:30"`); instants are RFC 3339 strings or epoch milliseconds.
 *
 * @module
 */

import type { WeekdayName } from '../civil/index.js';
import type { BusinessDayConvention } from '../business/index.js';

export type { WeekdayName };

/** A weekday as a name or as its ISO 8601 number (1 = Monday .. 7 = Sunday). */
export type WeekdayInput = WeekdayName | number;

/** A calendar date: an ISO 8601 date string (`"2025-01-31"`) or a day number. */
export type DateInput = string | number;

/** An instant: an RFC 3339 / RFC 9557 string with an offset or `Z`, or epoch milliseconds. */
export type InstantInput = string | number;

/**
 * The business-day adjustment conventions of the business layer, by their ISDA 2006 Definitions names
 * (section 4.12): `'following'`, `'modified-following'`, `'preceding'`, `'modified-preceding'`, and `'none'`.
 */
export type Convention = BusinessDayConvention;

/**
 * A business calendar for a rule: a compiled calendar from the business layer, its plain-data definition, or
 * the id of a bundled calendar.
 */
export type RuleCalendarInput = object | string;

/**
 * What happens when a selected day does not exist in a period (day 31 of a 30-day month, day 30 of February):
 * `'last-day'` moves it to the period's last day, `'skip'` drops the period.
 */
export type WhenShort = 'last-day' | 'skip';

/**
 * Picks days inside one period (a month, a quarter's month, a fiscal period):
 * - `{ day: 15 }` the 15th day; `{ day: -1 }` or `{ day: 'last' }` the last day; `{ day: -2 }` the day before;
 *   `whenShort` says what happens when the period is shorter than `day` (required for days past 28);
 * - `{ weekday: 'friday', nth: 2 }` the second Friday; `nth: -1` or `'last'` the last Friday; a period without
 *   that many Fridays produces nothing;
 * - `{ businessDay: 1 }` the first business day; `{ businessDay: -1 }` or `'last'` the last (the rule's
 *   `calendar` decides which days are business days).
 */
export type DaySelector =
  | {
      /** The day of the period, from 1; negative counts from the end (-1 the last day), as does `'last'`. */
      readonly day: number | 'last';
      /** What happens when the period has fewer days than `day` (required for days past 28). */
      readonly whenShort?: WhenShort;
    }
  | {
      /** The weekday to pick. */
      readonly weekday: WeekdayInput;
      /** Which of the period's such weekdays: 1 the first, -1 or `'last'` the last. */
      readonly nth: number | 'last';
    }
  | {
      /** Which business day of the period: 1 the first, -1 or `'last'` the last (by the rule's `calendar`). */
      readonly businessDay: number | 'last';
    };

/** Fields shared by every date rule. */
export interface DateRuleCommon {
  /** First date the rule may produce (inclusive), before any adjustment. */
  readonly start?: DateInput;
  /** Dates the rule produces lie before this date (exclusive), before any adjustment. */
  readonly end?: DateInput;
  /**
   * At most this many occurrences, counted from `start` (which is then required), before any adjustment: the
   * first `count` dates of the rule, each then adjusted (two that adjust to the same day appear once).
   */
  readonly count?: number;
  /** Business calendar for business-day selectors and for `convention`. */
  readonly calendar?: RuleCalendarInput;
  /** Business-day adjustment of each produced date (default `'none'`). Needs `calendar`. */
  readonly convention?: Convention;
  /** A free label shown by `describeRule` and the CLI. */
  readonly label?: string;
}

/** Every `every` days, counted from `anchor` (default: `start`). */
export interface DaysRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'days';
  /** The step in days (default 1). */
  readonly every?: number;
  /** The date the steps count from (default `start`; required when `every` is more than 1 and there is no `start`). */
  readonly anchor?: DateInput;
}

/** Every `every` business days of `calendar`, counted from the first business day on or after `anchor`. */
export interface BusinessDaysRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'business-days';
  /** The step in business days of `calendar` (default 1). */
  readonly every?: number;
  /** The steps count from the first business day on or after this date (default `start`). */
  readonly anchor?: DateInput;
}

/**
 * On the given weekdays of every `every`-th week. Weeks start on `weekStart` (default monday); the week that
 * holds `anchor` (default: `start`) is week 0.
 */
export interface WeeklyRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'weekly';
  /** The weekdays of each selected week that the rule produces. */
  readonly weekdays: readonly WeekdayInput[];
  /** Every how many weeks (default 1). */
  readonly every?: number;
  /** A date in week 0 (default `start`). */
  readonly anchor?: DateInput;
  /** The first day of each week (default monday). */
  readonly weekStart?: WeekdayInput;
}

/**
 * Days picked by `on` in every `every`-th month, counted from the month of `anchor`; `months` (1..12) keeps
 * only those months of the year. Without `on`, the day comes from `anchor` (a month end stays on month ends when
 * `keepMonthEnd` is true; a day past 28 otherwise moves to the last day of shorter months).
 */
export interface MonthlyRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'monthly';
  /** The day or days to pick in each selected month; without it, the day of `anchor`. */
  readonly on?: DaySelector | readonly DaySelector[];
  /** Every how many months, counted from the month of `anchor` (default 1). */
  readonly every?: number;
  /** The date whose month is month 0, and whose day is used when `on` is absent (default `start`). */
  readonly anchor?: DateInput;
  /** Keep only these months of the year (1..12). */
  readonly months?: readonly number[];
  /** With no `on` and an anchor on a month end: put every date on a month end (default false). */
  readonly keepMonthEnd?: boolean;
}

/** Two days in each month, such as `[15, 'last']` (days past 28 need `whenShort`). */
export interface SemiMonthlyRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'semi-monthly';
  /** The two days of each month, each a day number from 1 or `'last'`. */
  readonly days: readonly (number | 'last')[];
  /** What happens in months shorter than a day given (required for days past 28). */
  readonly whenShort?: WhenShort;
}

/**
 * Quarterly, half-yearly or yearly: one month in each quarter, half or year, fixed by `month` (the month of
 * the year that belongs to the schedule, such as 3 for March, June, September and December) or by `anchor`.
 * `every` counts quarters, halves or years (counting from `anchor` when more than 1).
 */
export interface AnchoredMonthRuleDefinition extends DateRuleCommon {
  /** Selects the length of the step: a quarter, a half-year or a year. */
  readonly kind: 'quarterly' | 'half-yearly' | 'yearly';
  /** A month of the year (1..12) that belongs to the schedule; the others follow by the step. */
  readonly month?: number;
  /** The day or days to pick in each selected month; without it, the day of `anchor`. */
  readonly on?: DaySelector | readonly DaySelector[];
  /** Every how many quarters, halves or years (default 1). */
  readonly every?: number;
  /** A date whose month belongs to the schedule, and whose day is used when `on` is absent (default `start`). */
  readonly anchor?: DateInput;
  /** With no `on` and an anchor on a month end: put every date on a month end (default false). */
  readonly keepMonthEnd?: boolean;
}

/**
 * Days picked by `on` in every `every`-th period of a unit from the period layer: a fiscal quarter, a 4-5-4
 * period, a 52/53-week year. The period that holds `anchor` is period 0.
 */
export interface PeriodsRuleDefinition extends DateRuleCommon {
  /** Selects this kind of rule. */
  readonly kind: 'periods';
  /** A compiled period unit, a unit definition, or a calendar unit name such as `"quarter"`. */
  readonly unit: object | string;
  /** The day or days to pick in each selected period. */
  readonly on: DaySelector | readonly DaySelector[];
  /** Every how many periods (default 1). */
  readonly every?: number;
  /** A date in period 0 (default `start`). */
  readonly anchor?: DateInput;
}

/**
 * Every `every` minutes or hours in `zone`, counted from the wall-clock time `anchor`.
 * - `clock: 'wall'`: steps of wall-clock time (09:00, 09:30, ... local). A wall time that a DST gap skips is
 *   moved forward by the length of the gap (`skipped: 'later'`, the instant Temporal's `'later'` and
 *   `'compatible'` disambiguation give in a gap) or dropped (`'drop'`); a wall time that an overlap repeats
 *   happens once, at its earlier instant (`repeated: 'earlier'`) or its later one (`'later'`), or twice (`'both'`).
 * - `clock: 'elapsed'`: steps of absolute time from the anchor's instant; DST never moves or drops a step, so the
 *   local times shift by the change of offset.
 *
 * Renamed in 0.2: `skipped: 'shift-forward'` is `skipped: 'later'`.
 */
export interface IntradayRuleDefinition {
  /** Selects this kind of rule. */
  readonly kind: 'intraday';
  /** The zone of the wall-clock times: an IANA id, an offset, or a compiled zone. */
  readonly zone: string | object;
  /** The step: hours, minutes or both. */
  readonly every: {
    /** Hours of the step. */
    readonly hours?: number;
    /** Minutes of the step. */
    readonly minutes?: number;
  };
  /** The wall-clock time the steps count from, an ISO 8601 local date-time such as `"2025-03-09T01:30"`. */
  readonly anchor: string;
  /** `'wall'` steps local clock time; `'elapsed'` steps absolute time from the anchor's instant. */
  readonly clock: 'wall' | 'elapsed';
  /** A wall time in a DST gap: moved forward by the gap's length (`'later'`, the default) or dropped. */
  readonly skipped?: 'later' | 'drop';
  /** A wall time an overlap repeats: at its earlier instant (the default), its later one, or both. */
  readonly repeated?: 'earlier' | 'later' | 'both';
  /** First instant the rule may produce (inclusive). */
  readonly start?: InstantInput;
  /** Instants the rule produces lie before this one (exclusive). */
  readonly end?: InstantInput;
  /** At most this many occurrences, counted from `start`. */
  readonly count?: number;
  /** A free label shown by `describeRule` and the CLI. */
  readonly label?: string;
}

/** RFC 5545 frequency (the FREQ rule part), in lower case. */
export type Rfc5545Frequency = 'yearly' | 'monthly' | 'weekly' | 'daily' | 'hourly' | 'minutely' | 'secondly';

/** One BYDAY entry: a weekday, with an optional ordinal (RFC 5545 `weekdaynum`, e.g. `-1SU`). */
export interface Rfc5545WeekdayNum {
  /** The weekday. */
  readonly weekday: WeekdayName;
  /** Which occurrence of the weekday in the month or year (1 the first, -1 the last); absent for every one. */
  readonly nth?: number;
}

/**
 * The rule parts of one RFC 5545 RRULE (section 3.3.10) in our spelling: the parts a second or later RRULE of
 * the same text carries (`additionalRules` of {@link Rfc5545RuleDefinition}); it shares DTSTART and its zone.
 */
export interface Rfc5545RuleParts {
  /** FREQ. */
  readonly frequency: Rfc5545Frequency;
  /** INTERVAL (default 1). */
  readonly interval?: number;
  /** COUNT: at most this many occurrences, DTSTART included. */
  readonly count?: number;
  /** UNTIL, inclusive: a date, or an instant (RFC 3339, UTC). */
  readonly until?: string;
  /** BYMONTH (1..12). */
  readonly byMonth?: readonly number[];
  /** BYWEEKNO (1..53 or -53..-1). */
  readonly byWeekNo?: readonly number[];
  /** BYYEARDAY (1..366 or -366..-1). */
  readonly byYearDay?: readonly number[];
  /** BYMONTHDAY (1..31 or -31..-1). */
  readonly byMonthDay?: readonly number[];
  /** BYDAY. */
  readonly byDay?: readonly Rfc5545WeekdayNum[];
  /** BYHOUR: hours 0 to 23 of the local time. */
  readonly byHour?: readonly number[];
  /** BYMINUTE: minutes 0 to 59. */
  readonly byMinute?: readonly number[];
  /** BYSECOND: seconds 0 to 60 (60, a leap second, is read as 59: instants here have no leap seconds). */
  readonly bySecond?: readonly number[];
  /** BYSETPOS (1..366 or -366..-1). */
  readonly bySetPos?: readonly number[];
  /** WKST (default monday). */
  readonly weekStart?: WeekdayName;
}

/**
 * An RFC 5545 recurrence rule (section 3.3.10) with its DTSTART, as data. `parseRecurrenceRule` produces this;
 * the fields are the rule parts in our spelling.
 */
export interface Rfc5545RuleDefinition extends Rfc5545RuleParts {
  /** Selects this kind of rule. */
  readonly kind: 'rfc5545';
  /** DTSTART: a date (`"1997-09-02"`) or a local date-time (`"1997-09-02T09:00:00"`). */
  readonly start: string;
  /** TZID of DTSTART (an IANA id), `"UTC"` for a DTSTART in UTC; absent for a date or a floating time. */
  readonly zone?: string;
  /** RDATE values: dates or local date-times in the same form as `start`, added to the set. */
  readonly include?: readonly string[];
  /** Further RRULE lines of the same text (RFC 5545 Appendix A deprecates several RRULEs in one component). */
  readonly additionalRules?: readonly Rfc5545RuleParts[];
  /** EXDATE values: dates or local date-times in the same form as `start`. */
  readonly exclude?: readonly string[];
  /** A free label shown by `describeRule` and the CLI. */
  readonly label?: string;
}

/** Any rule definition. */
export type RuleDefinition =
  | DaysRuleDefinition
  | BusinessDaysRuleDefinition
  | WeeklyRuleDefinition
  | MonthlyRuleDefinition
  | SemiMonthlyRuleDefinition
  | AnchoredMonthRuleDefinition
  | PeriodsRuleDefinition
  | IntradayRuleDefinition
  | Rfc5545RuleDefinition;

/** The kinds of rule. */
export type RuleKind = RuleDefinition['kind'];

/**
 * A compiled, immutable rule. `values` says what its occurrences are: `'dates'` (day numbers) or `'instants'`
 * (epoch milliseconds).
 */
export interface Rule {
  /** The kind of the definition the rule was compiled from. */
  readonly kind: RuleKind;
  /** What the occurrences are: `'dates'` (day numbers) or `'instants'` (epoch milliseconds). */
  readonly values: 'dates' | 'instants';
  /** The definition, frozen, as given (serialize it to store the rule). */
  readonly definition: RuleDefinition;
}

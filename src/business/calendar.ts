/**
 * Business calendars: define one from plain data (or take a bundled one by name), then ask which days are
 * business days, list holidays, shift and count business days, and adjust dates by the ISDA business-day
 * conventions. Every operation works on day numbers (days since 1970-01-01) and is O(1) per year spanned.
 *
 * @module
 */
import { MAX_LISTED_HOLIDAYS } from '../bounds.js';
import { monthIndexOfDayNumberUnchecked } from '../civil/names.js';
import { yearOfDayNumberUnchecked } from '../civil/gregorian.js';
import { isRecord, lookupName, ownField, requireDayNumberArgument, requireEnum, requireWhole } from '../diagnostics/index.js';
import { DefinitionError, type DefinitionIssue, KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { formatPlainDate } from '../instant/index.js';
import { WEEKDAY_NAMES, type WeekdayName } from '../civil/names.js';
import { BUSINESS_DAY_CONVENTIONS, type BusinessDayConvention, type CalendarDefinition } from './definition.js';
import { Engine, nthInRange } from './engine.js';
import { BUNDLED_DEFINITIONS, listedCalendarNames, suggestCalendarNames, unknownCalendarText } from './jurisdictions/index.js';
import { holidaysOfYear, mostHolidaysOfYears } from './rules.js';
import { nodeOfTrustedDefinition } from './trusted.js';
import { type CalendarNode, normalizeDefinition } from './validate.js';

const ENGINE = Symbol('kalends.business.engine');

/**
 * A compiled, immutable business calendar. Pass it (or a bundled calendar's name) to the functions of this
 * module. It keeps its `definition`, so it can be serialized and defined again.
 */
export interface BusinessCalendar {
  /** The definition's `id`, or `"custom"`. */
  readonly id: string;
  /** The definition's `name`, if any. */
  readonly name: string | undefined;
  /** The legal source named by the definition. */
  readonly source: string | undefined;
  /** The caution carried by the definition. */
  readonly caution: string | undefined;
  /** Weekend days as ISO weekdays (1 = Monday .. 7 = Sunday), ascending. */
  readonly weekend: readonly number[];
  /** Weekend days by name. */
  readonly weekendNames: readonly WeekdayName[];
  /** First and last year (inclusive) the calendar answers for. */
  readonly firstYear: number;
  /** The last year (inclusive) the calendar answers for. */
  readonly lastYear: number;
  /** The definition it was compiled from (frozen). */
  readonly definition: CalendarDefinition;
}

/** A calendar, or the name of a bundled one (`'us-federal'`, `'england-and-wales'`, `'euro-t2'`). */
export type CalendarInput = BusinessCalendar | string;

interface Internal extends BusinessCalendar {
  readonly [ENGINE]: Engine;
}

/** A holiday as listed by {@link listHolidays}. */
export interface Holiday {
  /** The day the holiday is observed (the day that is not a business day). */
  readonly dayNumber: number;
  /** The date the rule gives before any weekend observance shift. Equal to `dayNumber` unless moved. */
  readonly actualDayNumber: number;
  /** `dayNumber` as `YYYY-MM-DD`. */
  readonly date: string;
  /** `actualDayNumber` as `YYYY-MM-DD`. */
  readonly actualDate: string;
  /** The holiday's name, from its rule or dated entry. */
  readonly name: string;
  /** True when the holiday was moved off a weekend day (an observed, "in lieu of" or substitute day). */
  readonly moved: boolean;
  /** True for a one-off addition rather than a yearly rule. */
  readonly oneOff: boolean;
  /** The rule's id, when it has one. */
  readonly ruleId: string | undefined;
}

/**
 * An unknown bundled calendar name; `suggestions` lists close names.
 *
 * @example
 * ```ts
 * try { calendarFromName('us-fedral'); } catch (e) { if (e instanceof UnknownCalendarError) e.suggestions; } // ['us-federal']
 * ```
 */
export class UnknownCalendarError extends KalendsRangeError {
  /** The closest bundled calendar names (empty when none is close), also shown in the message. */
  readonly suggestions: readonly string[];
  constructor(name: string, parameter: string) {
    const suggestions = suggestCalendarNames(name);
    super(
      `${parameter}: ${unknownCalendarText(name, suggestions)} (or pass a calendar from defineCalendar)`,
      { code: 'unknown-name', received: name },
    );
    this.name = 'UnknownCalendarError';
    this.suggestions = suggestions;
  }
}

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as object)) deepFreeze(v);
  }
  return value;
}

/** Checks that every removal of every node removes a holiday. */
function checkRemovals(node: CalendarNode, issues: DefinitionIssue[]): void {
  for (const m of node.members) checkRemovals(m, issues);
  for (const r of node.removals) {
    const year = yearOfDayNumberUnchecked(r.dayNumber);
    const list = holidaysOfYear(node, year, false);
    if (!list.some((h) => h.observed === r.dayNumber)) {
      const shown = list.map((h) => formatPlainDate(h.observed)).join(', ');
      issues.push({
        path: `${r.path}.date`,
        message: `no holiday of this calendar is observed on ${formatPlainDate(r.dayNumber)}, so there is nothing to remove; holidays in ${year}: ${shown || '(none)'}`,
      });
    }
  }
}

/**
 * Validates a calendar definition and compiles it. Every fault is reported at once in a DefinitionError whose
 * `issues` name the path of each (`holidays[3].day: expected an integer from 1 to 29 for month 2, got 30`).
 *
 * @example
 * ```ts
 * const company = defineCalendar({
 *   id: 'company',
 *   extends: 'us-federal',
 *   holidays: [{ id: 'day-after-thanksgiving', name: 'Day after Thanksgiving', kind: 'relative', to: 'thanksgiving-day', offset: 1 }],
 * });
 * isBusinessDay(company, dayNumberFromYmd(2025, 11, 28)); // false
 * ```
 */
export function defineCalendar(definition: CalendarDefinition): BusinessCalendar {
  const { node, issues } = normalizeDefinition(definition);
  if (!node) throw new DefinitionError(issues, definition);
  const removalIssues: DefinitionIssue[] = [];
  try {
    checkRemovals(node, removalIssues);
  } catch (e) {
    if (e instanceof KalendsRangeError && e.path !== undefined) removalIssues.push({ path: e.path, message: e.message });
    else throw e;
  }
  if (removalIssues.length) throw new DefinitionError(removalIssues, definition);
  const frozen = Object.isFrozen(definition) ? definition : deepFreeze(JSON.parse(JSON.stringify(definition)) as CalendarDefinition);
  return calendarOfNode(node, frozen, typeof definition === 'string' ? definition : 'custom');
}

/** A compiled calendar of a node and the frozen definition it came from; `fallbackId` when it has no `id`. */
function calendarOfNode(node: CalendarNode, definition: CalendarDefinition, fallbackId: string): BusinessCalendar {
  const own = (key: string): string | undefined => {
    const v = isRecord(definition) ? ownField(definition, key) : undefined;
    return typeof v === 'string' ? v : undefined;
  };
  const id = own('id') ?? fallbackId;
  const weekend: number[] = [];
  for (let wd = 1; wd <= 7; wd++) if (node.weekendMask & (1 << wd)) weekend.push(wd);
  const calendar: Internal = {
    id,
    name: own('name'),
    source: own('source'),
    caution: own('caution'),
    weekend: Object.freeze(weekend),
    weekendNames: Object.freeze(weekend.map((wd) => WEEKDAY_NAMES[wd - 1]!)),
    firstYear: node.firstYear,
    lastYear: node.lastYear,
    definition,
    [ENGINE]: new Engine(node, id, node.firstYear, node.lastYear),
  };
  return Object.freeze(calendar);
}

const bundledCache = new Map<string, BusinessCalendar>();

/**
 * A bundled calendar by name: `'us-federal'` (United States federal holidays, 5 U.S.C. 6103),
 * `'england-and-wales'` (bank holidays) or `'euro-t2'` (T2 closing days). Compiled once and cached. An unknown
 * name throws an {@link UnknownCalendarError} with suggestions.
 *
 * @example
 * ```ts
 * const us = calendarFromName('us-federal');
 * us.caution; // 'Holiday calendars change by law and by proclamation, ...'
 * ```
 */
export function calendarFromName(name: string): BusinessCalendar {
  return bundledCalendar(name, 'name');
}

function bundledCalendar(name: unknown, parameter: string): BusinessCalendar {
  if (typeof name !== 'string') {
    throw new KalendsTypeError(
      `${parameter}: expected the name of a bundled calendar (${listedCalendarNames()}), got ${describeValue(name)}`,
      { code: 'invalid-type', received: name },
    );
  }
  const cached = bundledCache.get(name);
  if (cached) return cached;
  const def = lookupName<CalendarDefinition>(BUNDLED_DEFINITIONS, name);
  if (!def) throw new UnknownCalendarError(name, parameter);
  // A bundled definition is frozen and checked by the tests: it is compiled without the validator.
  const cal = calendarOfNode(nodeOfTrustedDefinition(def), def, name);
  bundledCache.set(name, cal);
  return cal;
}

/** @internal The compiled engine of a calendar or bundled name; a KalendsTypeError for anything else. */
export function engineOf(calendar: CalendarInput): Engine {
  if (typeof calendar === 'string') return (bundledCalendar(calendar, 'calendar') as Internal)[ENGINE];
  const engine = typeof calendar === 'object' && calendar !== null ? (calendar as Internal)[ENGINE] : undefined;
  if (!engine) {
    throw new KalendsTypeError(
      `calendar: expected a BusinessCalendar from defineCalendar or a bundled calendar name (${listedCalendarNames()}), got ${describeValue(calendar)}`,
      { code: 'invalid-type', received: calendar },
    );
  }
  return engine;
}

/** @internal Validates a day number against the civil range and the calendar's years; `extra` allows one day past the end. */
export function requireDay(engine: Engine, dayNumber: unknown, name: string, extra = 0): number {
  requireDayNumberArgument(name, dayNumber);
  const dn = dayNumber as number;
  if (dn < engine.firstDay || dn >= engine.endDay + extra) {
    throw new KalendsRangeError(
      `${name}: expected a day in the years ${engine.firstYear}..${engine.lastYear} that calendar ${JSON.stringify(engine.label)} supports, got ${dn} (${formatPlainDate(dn)}); use a calendar whose years cover it (its "years" field)`,
      { code: 'out-of-range', received: dn },
    );
  }
  return dn;
}

/** Refuses a range whose end comes before its start (ranges are end-exclusive: start === end is empty). */
function requireOrderedRange(start: number, end: number): void {
  if (end < start) {
    throw new KalendsRangeError(`end: expected a day number not before start (${start}, ${formatPlainDate(start)}), got ${end} (${formatPlainDate(end)}); swap the two`, {
      code: 'out-of-range',
      received: end,
    });
  }
}

/**
 * Whether `dayNumber` is a business day: not a weekend day and not a holiday of the calendar.
 *
 * @example
 * ```ts
 * isBusinessDay('us-federal', dayNumberFromYmd(2025, 7, 4)); // false (Independence Day)
 * isBusinessDay('us-federal', dayNumberFromYmd(2025, 7, 7)); // true
 * ```
 */
export function isBusinessDay(calendar: CalendarInput, dayNumber: number): boolean {
  const e = engineOf(calendar);
  return e.isBusinessDay(requireDay(e, dayNumber, 'dayNumber'));
}

/**
 * The first business day strictly after `dayNumber`.
 *
 * @example
 * ```ts
 * nextBusinessDay('england-and-wales', dayNumberFromYmd(2025, 12, 24)); // day number of 2025-12-29
 * ```
 */
export function nextBusinessDay(calendar: CalendarInput, dayNumber: number): number {
  const e = engineOf(calendar);
  return e.shift(requireDay(e, dayNumber, 'dayNumber'), 1, 'dayNumber');
}

/**
 * The last business day strictly before `dayNumber`.
 *
 * @example
 * ```ts
 * previousBusinessDay('euro-t2', dayNumberFromYmd(2026, 4, 7)); // day number of 2026-04-02 (Good Friday and Easter Monday closed)
 * ```
 */
export function previousBusinessDay(calendar: CalendarInput, dayNumber: number): number {
  const e = engineOf(calendar);
  return e.shift(requireDay(e, dayNumber, 'dayNumber'), -1, 'dayNumber');
}

/**
 * Moves `n` business days from `dayNumber`. For n > 0 the result is the nth business day strictly after
 * `dayNumber`; for n < 0 the |n|th business day strictly before it; for n = 0 it is `dayNumber` itself when that
 * is a business day, otherwise the next business day (the following convention). The result is always a
 * business day. Cost: O(1) per year spanned, never day by day.
 *
 * Counting back: for a business day d, `countBusinessDays(cal, d, shiftBusinessDays(cal, d, n)) === n` for every
 * n. When d is not a business day, the count is n - 1 for n > 0 and n for n < 0 (d itself is not counted).
 *
 * @example
 * ```ts
 * shiftBusinessDays('us-federal', dayNumberFromYmd(2025, 12, 23), 2); // 2025-12-26 (25 December skipped)
 * ```
 */
export function shiftBusinessDays(calendar: CalendarInput, dayNumber: number, n: number): number {
  const e = engineOf(calendar);
  requireDay(e, dayNumber, 'dayNumber');
  requireWhole('n', n, -Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER);
  return e.shift(dayNumber, n);
}

/**
 * Business days in the end-exclusive range [start, end). When end < start the result is negative:
 * `countBusinessDays(cal, a, b) === -countBusinessDays(cal, b, a)`, so counts add up across ranges
 * (count(a, b) + count(b, c) = count(a, c)). `end` may be the day after the calendar's last supported day.
 *
 * @example
 * ```ts
 * countBusinessDays('us-federal', dayNumberFromYmd(2025, 1, 1), dayNumberFromYmd(2026, 1, 1)); // 250
 * ```
 */
export function countBusinessDays(calendar: CalendarInput, start: number, end: number): number {
  const e = engineOf(calendar);
  requireDay(e, start, 'start', 1);
  requireDay(e, end, 'end', 1);
  if (end >= start) return e.countBetween(start, end);
  const back = e.countBetween(end, start);
  return back === 0 ? 0 : -back;
}


/**
 * Adjusts a date that may fall on a non-business day, by a business-day convention. The first three are the
 * ISDA 2006 Definitions, section 4.12: `following` (the next business day), `modified-following` (the next
 * business day unless it is in the next calendar month, then the preceding business day), `preceding` (the
 * previous business day). `modified-preceding` (the previous business day unless it is in the previous month,
 * then the following one) is common practice, not an ISDA 2006 term. `none` returns the date unchanged. A
 * business day is never moved. When a modified convention finds no business day in the month on either side, a
 * KalendsRangeError with code 'no-business-day' is thrown rather than leave the month.
 *
 * @example
 * ```ts
 * adjustDayNumber('us-federal', dayNumberFromYmd(2026, 1, 31), 'modified-following'); // 2026-01-30 (Saturday -> Friday: Monday is in February)
 * ```
 */
export function adjustDayNumber(calendar: CalendarInput, dayNumber: number, convention: BusinessDayConvention): number {
  const e = engineOf(calendar);
  requireDay(e, dayNumber, 'dayNumber');
  requireEnum('convention', convention, BUSINESS_DAY_CONVENTIONS);
  if (convention === 'none' || e.isBusinessDay(dayNumber)) return dayNumber;
  if (convention === 'following') return e.shift(dayNumber, 1);
  if (convention === 'preceding') return e.shift(dayNumber, -1);
  const forward = convention === 'modified-following';
  const month = monthIndexOfDayNumberUnchecked(dayNumber);
  const first = e.shift(dayNumber, forward ? 1 : -1);
  if (monthIndexOfDayNumberUnchecked(first) === month) return first;
  const second = e.shift(dayNumber, forward ? -1 : 1);
  if (monthIndexOfDayNumberUnchecked(second) === month) return second;
  throw new KalendsRangeError(
    `convention: ${JSON.stringify(convention)} keeps the date in its month, but the month of ${formatPlainDate(dayNumber)} has no business day in calendar ${JSON.stringify(e.label)}; use "following" or "preceding" to leave the month`,
    { code: 'no-business-day', received: dayNumber },
  );
}

/**
 * The holidays observed in [start, end), in date order, with their names; each says where its rule put it
 * (`actualDayNumber`) and whether it was moved off a weekend. A holiday is listed by the day it is observed: the
 * United States New Year's Day of 2022 (a Saturday) is listed as 2021-12-31. Holidays that fall on a weekend day
 * and are not moved are listed too (they do not change which days are business days).
 *
 * @example
 * ```ts
 * listHolidays('us-federal', dayNumberFromYmd(2021, 12, 1), dayNumberFromYmd(2022, 1, 1)).map((h) => h.date);
 * // ['2021-12-24', '2021-12-31']
 * ```
 */
export function listHolidays(calendar: CalendarInput, start: number, end: number): Holiday[] {
  const e = engineOf(calendar);
  requireDay(e, start, 'start', 1);
  requireDay(e, end, 'end', 1);
  requireOrderedRange(start, end);
  const out: Holiday[] = [];
  if (end === start) return out;
  const ya = yearOfDayNumberUnchecked(start);
  const yb = yearOfDayNumberUnchecked(end - 1);
  // The cap is checked before anything is built, from the number of rule-years that can reach the range.
  const most = mostHolidaysOfYears(e.node, ya, yb);
  if (most > MAX_LISTED_HOLIDAYS) {
    const years = Math.max(1, Math.floor((MAX_LISTED_HOLIDAYS * (yb - ya + 1)) / most));
    throw new KalendsRangeError(
      `end: the range ${formatPlainDate(start)}..${formatPlainDate(end)} can hold up to ${most} holidays of calendar ${JSON.stringify(e.label)}, more than the ${MAX_LISTED_HOLIDAYS} one list may return; list at most about ${years} years at a time (page with consecutive ranges)`,
      { code: 'limit-exceeded', received: end },
    );
  }
  for (let y = ya; y <= yb; y++) {
    for (const h of holidaysOfYear(e.node, y)) {
      if (h.observed < start || h.observed >= end) continue;
      out.push(
        Object.freeze({
          dayNumber: h.observed,
          actualDayNumber: h.actual,
          date: formatPlainDate(h.observed),
          actualDate: formatPlainDate(h.actual),
          name: h.name,
          moved: h.observed !== h.actual,
          oneOff: h.oneOff,
          ruleId: h.ruleId,
        }),
      );
    }
  }
  return out;
}

/**
 * The nth business day in [start, end): n = 1 is the first, n = -1 the last, n = -2 the one before it. Throws a
 * KalendsRangeError with code 'no-business-day' when the range holds fewer than |n| business days (check with
 * {@link countBusinessDays} first when that can happen).
 *
 * @example
 * ```ts
 * nthBusinessDayOfRange('us-federal', dayNumberFromYmd(2025, 5, 1), dayNumberFromYmd(2025, 6, 1), -1); // 2025-05-30
 * ```
 */
export function nthBusinessDayOfRange(calendar: CalendarInput, start: number, end: number, n: number): number {
  const e = engineOf(calendar);
  requireDay(e, start, 'start', 1);
  requireDay(e, end, 'end', 1);
  requireOrderedRange(start, end);
  requireWhole('n', n, -Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER);
  if (n === 0) {
    throw new KalendsRangeError('n: expected a non-zero integer (1 is the first business day, -1 the last), got 0', {
      code: 'out-of-range',
      received: n,
    });
  }
  const available = e.countBetween(start, end);
  if (Math.abs(n) > available) {
    throw new KalendsRangeError(
      `n: the range ${formatPlainDate(start)}..${formatPlainDate(end)} (end-exclusive) holds ${available} business days in calendar ${JSON.stringify(e.label)}, so there is no business day number ${n}`,
      { code: 'no-business-day', received: n },
    );
  }
  return nthInRange(e, start, end, n); // the range holds it: never NaN here
}

/** What {@link nthBusinessDayOfPeriod} needs of a period: its unit's first-day mapping and its ordinal. */
export interface PeriodLike {
  /** The period's unit: only its mapping from an ordinal to the period's first day is used. */
  readonly unit: {
    /** The first day number of the period with this ordinal. */
    firstDayNumberFromOrdinal(ordinal: number): number;
  };
  /** The period's ordinal in its unit. */
  readonly ordinal: number;
}

/**
 * The nth business day of a period of the period layer (a month, a quarter, a fiscal year, a 4-4-5 period):
 * n = 1 is the first, n = -1 the last. The period is [unit.firstDayNumberFromOrdinal(ordinal),
 * unit.firstDayNumberFromOrdinal(ordinal + 1)).
 *
 * @example
 * ```ts
 * // The last business day (month-end close) of 2025-05, with the period layer's month unit:
 * nthBusinessDayOfPeriod('us-federal', periodFromDayNumber(MONTH, dayNumberFromYmd(2025, 5, 1)), -1); // 2025-05-30
 * ```
 */
export function nthBusinessDayOfPeriod(calendar: CalendarInput, period: PeriodLike, n: number): number {
  const unit = typeof period === 'object' && period !== null ? (period.unit as unknown) : undefined;
  const ordinal = typeof period === 'object' && period !== null ? (period.ordinal as unknown) : undefined;
  const first = typeof unit === 'object' && unit !== null ? (unit as Record<string, unknown>)['firstDayNumberFromOrdinal'] : undefined;
  if (typeof first !== 'function' || typeof ordinal !== 'number' || !Number.isInteger(ordinal)) {
    throw new KalendsTypeError(
      `period: expected a period { unit, ordinal } of the period layer (from periodFromDayNumber or parsePeriod), got ${describeValue(period)}`,
      { code: 'invalid-type', received: period },
    );
  }
  const u = unit as PeriodLike['unit'];
  const start = u.firstDayNumberFromOrdinal(ordinal);
  const end = u.firstDayNumberFromOrdinal(ordinal + 1);
  return nthBusinessDayOfRange(calendar, start, end, n);
}

/**
 * @internal {@link nthBusinessDayOfRange} without validation and without throwing: NaN when [start, end) holds
 * fewer than |n| business days (or n = 0). `calendar` must be a compiled calendar, and start <= end integer day
 * numbers with [start, end) inside its supported years. O(1) per 32 days walked from the end it counts from.
 */
export function nthBusinessDayInRangeUnchecked(calendar: BusinessCalendar, start: number, end: number, n: number): number {
  return nthInRange((calendar as Internal)[ENGINE], start, end, n);
}

/**
 * @internal Pushes every business day in [start, end) to `out` in increasing order, without validation:
 * `calendar` must be a compiled calendar and [start, end) inside its supported years.
 */
export function appendBusinessDaysUnchecked(calendar: BusinessCalendar, start: number, end: number, out: { push(dayNumber: number): void }): void {
  (calendar as Internal)[ENGINE].appendBusinessDays(start, end, out);
}

/**
 * Why an occurrence moved: the rule's dates that a business-day convention moved onto an occurrence, and every
 * closed day each passed over on its way, by cause (a weekend day, by name, and each holiday, by name). The CLI's
 * `schedule` table shows it for every date. See docs/schedules.md, "Why a date moved".
 *
 * @module
 */
import { KalendsRangeError } from '../errors.js';
import { requireDayNumberArgument } from '../diagnostics/index.js';
import { WEEKDAY_NAMES, type WeekdayName } from '../civil/names.js';
import { monthIndexOfDayNumberUnchecked, weekdayOfDayNumberUnchecked } from '../civil/gregorian.js';
import type { BusinessCalendar } from '../business/index.js';
import { type Compiled } from './compile.js';
import { formatPlainDate, listHolidays } from './deps.js';
import { Sink } from './engine.js';
import { adjustmentMargin, compiledOf, fillOccurrences } from './generate.js';
import type { Rule } from './types.js';

/** A day that is not a business day, and why. */
export interface ClosedDay {
  /** The closed day, as a day number. */
  readonly dayNumber: number;
  /** The weekday's name when it is a weekend day of the calendar, otherwise undefined. */
  readonly weekend: WeekdayName | undefined;
  /** The names of the holidays observed on it (none for a plain weekend day). */
  readonly holidays: readonly string[];
}

/** One date of a rule that a business-day convention moved. */
export interface DateMove {
  /** The rule's date before adjustment. */
  readonly unadjustedDayNumber: number;
  /**
   * Every closed day the convention passed over, in the order it met them: from the rule's date toward the
   * adjusted one; for a modified convention that turned back at the month's edge, first the closed days up to the
   * edge, then those back from the rule's date.
   */
  readonly closedDays: readonly ClosedDay[];
  /** True when a modified convention turned back to stay in the month (modified following, modified preceding). */
  readonly keptInMonth: boolean;
}

/** Why an occurrence is where it is. */
export interface OccurrenceAdjustment {
  /** The occurrence (the adjusted date). */
  readonly dayNumber: number;
  /** The rule's dates that adjust onto it, increasing: the occurrence itself when it did not move. */
  readonly unadjustedDayNumbers: readonly number[];
  /** One entry per rule date that moved onto it; empty when none moved. */
  readonly moves: readonly DateMove[];
  /**
   * The causes in words, empty when nothing moved: `weekend: sunday; holiday: Washington's Birthday (2026-02-16)`.
   * Each closed day after the first carries its date; with several moved dates, each is introduced by its date.
   */
  readonly reason: string;
}

function closedDayOf(calendar: BusinessCalendar, d: number, names: ReadonlyMap<number, readonly string[]>): ClosedDay {
  const wd = weekdayOfDayNumberUnchecked(d);
  return Object.freeze({
    dayNumber: d,
    weekend: calendar.weekend.includes(wd) ? WEEKDAY_NAMES[wd - 1]! : undefined,
    holidays: Object.freeze([...(names.get(d) ?? [])]),
  });
}

function moveOf(calendar: BusinessCalendar, convention: string, raw: number, adjusted: number, isBusinessDay: (d: number) => boolean): DateMove {
  const forward = adjusted > raw;
  const keptInMonth = (forward && convention === 'modified-preceding') || (!forward && convention === 'modified-following');
  const walk: number[] = [];
  if (keptInMonth) {
    // The convention first looked the other way, to the month's edge, and found no business day.
    const month = monthIndexOfDayNumberUnchecked(raw);
    const away = forward ? -1 : 1;
    for (let d = raw; monthIndexOfDayNumberUnchecked(d) === month; d += away) walk.push(d);
    for (let d = raw - away; d !== adjusted; d -= away) if (!isBusinessDay(d)) walk.push(d);
  } else {
    const step = forward ? 1 : -1;
    for (let d = raw; d !== adjusted; d += step) walk.push(d);
  }
  const lo = Math.min(...walk);
  const hi = Math.max(...walk);
  const names = new Map<number, string[]>();
  for (const h of listHolidays(calendar, lo, hi + 1)) {
    const list = names.get(h.dayNumber);
    if (list) list.push(h.name);
    else names.set(h.dayNumber, [h.name]);
  }
  return Object.freeze({
    unadjustedDayNumber: raw,
    closedDays: Object.freeze(walk.map((d) => closedDayOf(calendar, d, names))),
    keptInMonth,
  });
}

/** @internal The causes of one move in words (the warehouse's schedule table writes them per row). */
export function reasonOfMove(move: DateMove, convention: string): string {
  const parts = move.closedDays.map((c, i) => {
    const causes = [...(c.weekend ? [`weekend: ${c.weekend}`] : []), ...c.holidays.map((h) => `holiday: ${h}`)];
    const text = causes.length > 0 ? causes.join(', ') : 'closed';
    return i === 0 ? text : `${text} (${formatPlainDate(c.dayNumber)})`;
  });
  if (move.keptInMonth) {
    parts.push(`no business day ${convention === 'modified-following' ? 'after it' : 'before it'} in its month, so ${convention} turned back`);
  }
  return parts.join('; ');
}

function occursOn(c: Compiled, d: number): boolean {
  const out = new Sink(2);
  fillOccurrences(c, d, d + 1, out);
  return out.length > 0;
}

/**
 * Why the occurrence `dayNumber` of a rule of dates is where it is: the rule's dates that its business-day
 * convention moved onto it, and for each every closed day it passed over, with its cause: the weekend day by
 * name and each holiday by name. `reason` says it in words: a date on Sunday 15 February 2026, moved by
 * `'following'` on `'us-federal'`, passed Sunday and then Monday 16th, Washington's Birthday. An occurrence that
 * did not move has an empty `reason` and itself as its only unadjusted date; so has every occurrence of a rule
 * without a convention.
 *
 * @example
 * ```ts
 * const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following' });
 * const why = adjustmentOfOccurrence(rule, dayNumberFromYmd(2026, 2, 17));
 * why.unadjustedDayNumbers.map(formatPlainDate); // ['2026-02-15']
 * why.reason; // "weekend: sunday; holiday: Washington's Birthday (2026-02-16)"
 * ```
 */
export function adjustmentOfOccurrence(rule: Rule, dayNumber: number): OccurrenceAdjustment {
  const c = compiledOf(rule);
  if (c.values !== 'dates') {
    throw new KalendsRangeError(`rule: a rule of instants (kind ${JSON.stringify(rule.kind)}) is never moved by a business-day convention, got one; adjustmentOfOccurrence explains rules of dates`, {
      code: 'unsupported',
      received: rule.kind,
    });
  }
  const d = requireDayNumberArgument('dayNumber', dayNumber);
  if (!occursOn(c, d)) {
    throw new KalendsRangeError(`dayNumber: expected an occurrence of the rule, got ${d} (${formatPlainDate(d)}), which is not one; list the occurrences with listOccurrenceDayNumbers`, {
      code: 'out-of-range',
      received: d,
    });
  }
  if (c.convention === 'none' || !c.business) {
    return Object.freeze({ dayNumber: d, unadjustedDayNumbers: Object.freeze([d]), moves: Object.freeze([]), reason: '' });
  }
  const cal = c.business;
  const [mLo, mHi] = adjustmentMargin(c, d, d + 1, ['dayNumber', 'dayNumber']);
  const raw = new Sink(16);
  c.engine.fill(Math.max(d - mLo, c.rawStart), Math.min(d + 1 + mHi, c.rawEnd), raw);
  const unadjusted: number[] = [];
  const moves: DateMove[] = [];
  for (let i = 0; i < raw.length; i++) {
    const r = raw.data[i]!;
    if (cal.adjust(r, c.convention) !== d) continue;
    unadjusted.push(r);
    if (r !== d) moves.push(moveOf(cal.calendar as BusinessCalendar, c.convention, r, d, (x) => cal.isBusinessDay(x)));
  }
  const reasons = moves.map((m) => reasonOfMove(m, c.convention));
  const reason = moves.length > 1 ? moves.map((m, i) => `${formatPlainDate(m.unadjustedDayNumber)}: ${reasons[i]}`).join(' / ') : (reasons[0] ?? '');
  return Object.freeze({ dayNumber: d, unadjustedDayNumbers: Object.freeze(unadjusted), moves: Object.freeze(moves), reason });
}

/**
 * @internal Validation and compilation of rule definitions into engines, on the diagnostics kit: every fault is
 * recorded with its dotted path, unknown keys and misspelled values get a suggestion.
 *
 * @module
 */
import { MAX_COUNT, MAX_DAY_NUMBER, MAX_EPOCH_MS, MAX_RULE_EVERY, MAX_RULE_EVERY_PERIODS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { describeValue } from '../errors.js';
import { weekdayOfDayNumberUnchecked } from '../civil/gregorian.js';
import {
  WEEKDAY_NAMES,
  dayCountOfMonthIndex,
  dayOfPacked,
  monthIndexOfDayNumberUnchecked,
  monthIndexOfPacked,
  titleOfWeekday,
  weekdayFromName,
} from '../civil/names.js';
import { packedYmdUnchecked } from '../civil/gregorian.js';
import { type Issues, checkKeys, didYouMean, isRecord, ownField, readEnum, readInt } from '../diagnostics/index.js';
import {
  type BusinessOps,
  type Engine,
  type PeriodOps,
  type Selector,
  type ZoneOps,
  businessDaysEngine,
  stepEngine,
  mod,
  monthsCycleGap,
  monthsEngine,
  periodsCycleGap,
  periodsEngine,
  weeklyEngine,
} from './engine.js';
import { businessOps, periodOps, toDayNumber, toEpochMs } from './deps.js';
import type { Convention } from './types.js';

/** Everything generation needs to know about a rule. */
export interface Compiled {
  readonly values: 'dates' | 'instants';
  readonly engine: Engine;
  /** Calendar for adjustment (and business selectors). */
  readonly business: BusinessOps | undefined;
  readonly convention: Convention;
  /** Raw occurrences lie in [rawStart, rawEnd). */
  readonly rawStart: number;
  rawEnd: number;
  /** At most this many raw occurrences from `rawStart`; `rawEnd` is narrowed to the last of them when defined. */
  readonly count: number | undefined;
  /** Values removed from the set (RFC 5545 EXDATE). */
  readonly exclude: ReadonlySet<number> | undefined;
  readonly zone: ZoneOps | undefined;
  readonly period: PeriodOps | undefined;
}

/** Lowest and one-past-highest value of each kind. */
export const VALUE_MIN = { dates: MIN_DAY_NUMBER, instants: MIN_EPOCH_MS } as const;
export const VALUE_END = { dates: MAX_DAY_NUMBER + 1, instants: MAX_EPOCH_MS + 1 } as const;

const CONVENTIONS: readonly Convention[] = ['following', 'modified-following', 'preceding', 'modified-preceding', 'none'];
const COMMON_DATE_KEYS = ['kind', 'start', 'end', 'count', 'calendar', 'convention', 'label'];

/** ISO weekday number (1..7) of a weekday name or number, or NaN (recording the fault). */
function readWeekday(v: unknown, path: string, issues: Issues): number {
  if (typeof v === 'number' && Number.isInteger(v) && v >= 1 && v <= 7) return v;
  const wd = weekdayFromName(v);
  if (wd > 0) return wd;
  issues.add(path, `expected a weekday "monday".."sunday" or an ISO weekday number 1..7, got ${describeValue(v)}${didYouMean(typeof v === 'string' ? v.toLowerCase() : v, WEEKDAY_NAMES)}`);
  return Number.NaN;
}

/**
 * @internal The message of a parser or coercion error, without the function name it starts with: it quotes the
 * text given and says what is wrong, so it can follow a definition path.
 */
export function reasonOf(e: unknown): string {
  return (e as Error).message.replace(/^[A-Za-z]+: /, '');
}

function readDate(obj: Record<string, unknown>, key: string, path: string, issues: Issues): number | undefined {
  const v = ownField(obj, key);
  if (v === undefined) return undefined;
  try {
    return toDayNumber(v);
  } catch (e) {
    issues.add(path, `expected an ISO 8601 date such as "2025-01-31" or a day number; ${reasonOf(e)}`);
    return undefined;
  }
}

/** @internal An optional instant field: RFC 3339 text or epoch milliseconds. */
export function readInstant(obj: Record<string, unknown>, key: string, path: string, issues: Issues): number | undefined {
  const v = ownField(obj, key);
  if (v === undefined) return undefined;
  try {
    return toEpochMs(v);
  } catch (e) {
    issues.add(path, `expected an RFC 3339 instant such as "2025-03-09T06:00:00Z" or epoch milliseconds; ${reasonOf(e)}`);
    return undefined;
  }
}

interface CommonDate {
  start: number | undefined;
  end: number | undefined;
  count: number | undefined;
  business: BusinessOps | undefined;
  convention: Convention;
}

function readCommonDate(def: Record<string, unknown>, issues: Issues): CommonDate {
  const start = readDate(def, 'start', 'start', issues);
  const end = readDate(def, 'end', 'end', issues);
  if (start !== undefined && end !== undefined && end <= start) {
    issues.add('end', `expected a date after start (${describeValue(def['start'])}), got ${describeValue(def['end'])}`);
  }
  const countRaw = readInt(def, 'count', 'count', 1, MAX_COUNT, issues, Number.NaN);
  const count = Number.isNaN(countRaw) ? undefined : countRaw;
  if (count !== undefined && start === undefined && def['start'] === undefined) {
    issues.add('count', `counts occurrences from start, so start is required; got count ${count} without start`);
  }
  const convention = readEnum(def, 'convention', 'convention', CONVENTIONS, issues, 'none') ?? 'none';
  let business: BusinessOps | undefined;
  if (def['calendar'] !== undefined) {
    try {
      business = businessOps(def['calendar'], 'calendar');
    } catch (e) {
      issues.add('calendar', (e as Error).message);
    }
  } else if (convention !== 'none') {
    issues.add('calendar', `convention ${JSON.stringify(convention)} adjusts to business days, so a calendar is required`);
  }
  if (def['label'] !== undefined && typeof def['label'] !== 'string') issues.add('label', `expected a string, got ${describeValue(def['label'])}`);
  return { start, end, count, business, convention };
}

function readEvery(def: Record<string, unknown>, issues: Issues, max = MAX_RULE_EVERY): number {
  const v = def['every'];
  if (v === 0) {
    issues.add('every', `expected an integer of at least 1 (an interval of 0 would never move), got 0`);
    return Number.NaN;
  }
  return readInt(def, 'every', 'every', 1, max, issues, 1);
}

interface SelectorLimits {
  readonly maxDay: number;
  readonly maxNth: number;
  readonly what: string;
}
const MONTH_LIMITS: SelectorLimits = { maxDay: 31, maxNth: 5, what: 'month' };
const PERIOD_LIMITS: SelectorLimits = { maxDay: 371, maxNth: 53, what: 'period' };

function readOrdinal(v: unknown, path: string, max: number, issues: Issues, what: string): number {
  if (v === 'last') return -1;
  if (typeof v !== 'number' || !Number.isInteger(v) || v === 0 || v > max || v < -max) {
    issues.add(path, `expected an integer from 1 to ${max}, -1 to -${max} (counting from the end of the ${what}) or "last", got ${describeValue(v)}`);
    return Number.NaN;
  }
  return v;
}

function readSelector(v: unknown, path: string, limits: SelectorLimits, hasCalendar: boolean, issues: Issues): Selector | undefined {
  if (!isRecord(v)) {
    issues.add(path, `expected a day selector such as { "day": 15 }, { "weekday": "friday", "nth": -1 } or { "businessDay": -1 }, got ${describeValue(v)}`);
    return undefined;
  }
  const has = ['day', 'weekday', 'businessDay'].filter((k) => v[k] !== undefined);
  if (has.length !== 1) {
    issues.add(path, `expected exactly one of "day", "weekday" (with "nth") or "businessDay", got ${has.length === 0 ? 'none' : has.join(' and ')}`);
    return undefined;
  }
  if (v['day'] !== undefined) {
    checkKeys(v, ['day', 'whenShort'], path, issues);
    const n = readOrdinal(v['day'], `${path}.day`, limits.maxDay, issues, limits.what);
    const whenShort = readEnum(v, 'whenShort', `${path}.whenShort`, ['last-day', 'skip'] as const, issues, undefined);
    if (Number.isNaN(n)) return undefined;
    if (Math.abs(n) > 28 && whenShort === undefined && v['whenShort'] === undefined) {
      issues.add(`${path}.whenShort`, `day ${describeValue(v['day'])} is missing from shorter ${limits.what}s: state "last-day" (move to the ${n > 0 ? 'last' : 'first'} day) or "skip"`);
      return undefined;
    }
    return { kind: 0, n, weekday: 0, clamp: whenShort === 'last-day' };
  }
  if (v['weekday'] !== undefined) {
    checkKeys(v, ['weekday', 'nth'], path, issues);
    const weekday = readWeekday(v['weekday'], `${path}.weekday`, issues);
    if (v['nth'] === undefined) {
      issues.add(`${path}.nth`, `expected which ${String(v['weekday'])} of the ${limits.what}: 1..${limits.maxNth}, -1..-${limits.maxNth} or "last"; got undefined`);
      return undefined;
    }
    const n = readOrdinal(v['nth'], `${path}.nth`, limits.maxNth, issues, limits.what);
    if (Number.isNaN(n) || Number.isNaN(weekday)) return undefined;
    return { kind: 1, n, weekday, clamp: false };
  }
  checkKeys(v, ['businessDay'], path, issues);
  const n = readOrdinal(v['businessDay'], `${path}.businessDay`, limits.maxDay, issues, limits.what);
  if (!hasCalendar) issues.add('calendar', `${path}.businessDay needs a business calendar: add "calendar" to the rule`);
  if (Number.isNaN(n)) return undefined;
  return { kind: 2, n, weekday: 0, clamp: false };
}

function readSelectors(v: unknown, path: string, limits: SelectorLimits, hasCalendar: boolean, issues: Issues): Selector[] | undefined {
  if (Array.isArray(v)) {
    if (v.length === 0) {
      issues.add(path, 'expected at least one day selector, got an empty list');
      return undefined;
    }
    const out: Selector[] = [];
    v.forEach((s, i) => {
      const sel = readSelector(s, `${path}[${i}]`, limits, hasCalendar, issues);
      if (sel) out.push(sel);
    });
    return out.length === v.length ? out : undefined;
  }
  const sel = readSelector(v, path, limits, hasCalendar, issues);
  return sel ? [sel] : undefined;
}

function describeSelectors(sels: readonly Selector[]): string {
  const nth = (n: number) => (n > 0 ? `number ${n}` : n === -1 ? 'the last' : `number ${-n} from the end`);
  return sels
    .map((s) => (s.kind === 0 ? `day ${nth(s.n)}` : s.kind === 1 ? `${titleOfWeekday(s.weekday)} ${nth(s.n)}` : `business day ${nth(s.n)}`))
    .join(' or ');
}

/** The day selector implied by an anchor date: its day of the month, or the month end under `keepMonthEnd`. */
function selectorFromAnchor(anchor: number, keepMonthEnd: boolean): Selector {
  const p = packedYmdUnchecked(anchor);
  const day = dayOfPacked(p);
  const last = dayCountOfMonthIndex(monthIndexOfPacked(p));
  if (keepMonthEnd && day === last) return { kind: 0, n: -1, weekday: 0, clamp: false };
  return { kind: 0, n: day, weekday: 0, clamp: true };
}

const MONTH_KIND_LENGTH: Record<string, number> = { monthly: 1, quarterly: 3, 'half-yearly': 6, yearly: 12 };

function compileMonthFamily(def: Record<string, unknown>, kind: string, common: CommonDate, issues: Issues): Engine | undefined {
  const length = MONTH_KIND_LENGTH[kind] ?? 1;
  let selectors: Selector[] | undefined;
  let monthMask = 0;
  let every = 1;
  let anchor: number | undefined;
  let monthOfYear: number | undefined;
  if (kind === 'semi-monthly') {
    checkKeys(def, [...COMMON_DATE_KEYS, 'days', 'whenShort'], '', issues);
    const days = def['days'];
    if (!Array.isArray(days) || days.length !== 2) {
      issues.add('days', `expected two days of the month such as [15, "last"], got ${describeValue(days)}`);
      return undefined;
    }
    const whenShort = def['whenShort'];
    selectors = readSelectors(
      days.map((d) => (whenShort === undefined ? { day: d } : { day: d, whenShort })),
      'days',
      MONTH_LIMITS,
      true,
      issues,
    );
    if (selectors && selectors[0]!.n === selectors[1]!.n) issues.add('days', `expected two different days, got ${describeValue(days[0])} twice`);
  } else {
    const extra = kind === 'monthly' ? ['months'] : ['month'];
    checkKeys(def, [...COMMON_DATE_KEYS, 'on', 'every', 'anchor', 'keepMonthEnd', ...extra], '', issues);
    every = readEvery(def, issues, MAX_RULE_EVERY_PERIODS);
    anchor = readDate(def, 'anchor', 'anchor', issues) ?? common.start;
    if (def['keepMonthEnd'] !== undefined && typeof def['keepMonthEnd'] !== 'boolean') {
      issues.add('keepMonthEnd', `expected true or false, got ${describeValue(def['keepMonthEnd'])}`);
    }
    const keepMonthEnd = def['keepMonthEnd'] === true;
    if (def['on'] !== undefined) {
      selectors = readSelectors(def['on'], 'on', MONTH_LIMITS, common.business !== undefined, issues);
    } else if (anchor !== undefined) {
      selectors = [selectorFromAnchor(anchor, keepMonthEnd)];
    } else {
      issues.add('on', 'expected the day(s) to pick in each month, or an anchor date to take the day from; got neither');
    }
    if (kind === 'monthly' && def['months'] !== undefined) {
      const months = def['months'];
      if (!Array.isArray(months) || months.length === 0) issues.add('months', `expected a non-empty list of months 1..12, got ${describeValue(months)}`);
      else {
        months.forEach((m, i) => {
          if (typeof m !== 'number' || !Number.isInteger(m) || m < 1 || m > 12) issues.add(`months[${i}]`, `expected a month 1..12, got ${describeValue(m)}`);
          else monthMask |= 1 << m;
        });
      }
    }
    if (kind !== 'monthly') {
      const m = readInt(def, 'month', 'month', 1, 12, issues, Number.NaN);
      if (!Number.isNaN(m)) monthOfYear = m;
      else if (def['month'] === undefined && anchor === undefined) {
        issues.add('month', `expected the month of the year (1..12) that the ${kind} schedule uses, or an anchor date; got neither`);
      }
    }
    if (every > 1 && anchor === undefined) {
      issues.add('anchor', `every ${every} ${kind === 'monthly' ? 'months' : 'periods'} counts from an anchor: give "anchor" (or "start")`);
    }
  }
  if (!selectors || Number.isNaN(every)) return undefined;
  const step = length * every;
  let phase = 0;
  if (anchor !== undefined) {
    phase = monthIndexOfDayNumberUnchecked(anchor);
    if (monthOfYear !== undefined) phase += mod(monthOfYear - 1 - phase, length);
  } else if (monthOfYear !== undefined) {
    phase = monthOfYear - 1;
  }
  phase = mod(phase, step);
  const gap = monthsCycleGap(step, phase, monthMask, selectors);
  if (gap < 0) {
    issues.add(
      def['on'] !== undefined ? 'on' : kind === 'semi-monthly' ? 'days' : 'anchor',
      `the rule never produces a date: no candidate month in a full 400-year Gregorian cycle (4,800 months, after which dates and weekdays repeat) has ${describeSelectors(selectors)}`,
    );
    return undefined;
  }
  const hasBusiness = selectors.some((s) => s.kind === 2);
  return monthsEngine(step, phase, monthMask, selectors, common.business, hasBusiness ? Number.POSITIVE_INFINITY : gap);
}

function compileDays(def: Record<string, unknown>, common: CommonDate, issues: Issues): Engine | undefined {
  checkKeys(def, [...COMMON_DATE_KEYS, 'every', 'anchor'], '', issues);
  const every = readEvery(def, issues);
  const anchor = readDate(def, 'anchor', 'anchor', issues) ?? common.start;
  if (every > 1 && anchor === undefined) issues.add('anchor', `every ${every} days counts from an anchor: give "anchor" (or "start")`);
  if (Number.isNaN(every)) return undefined;
  return stepEngine(anchor ?? 0, every);
}

function compileBusinessDays(def: Record<string, unknown>, common: CommonDate, issues: Issues): Engine | undefined {
  checkKeys(def, [...COMMON_DATE_KEYS, 'every', 'anchor'], '', issues);
  const every = readEvery(def, issues);
  const anchor = readDate(def, 'anchor', 'anchor', issues) ?? common.start;
  if (def['calendar'] === undefined) issues.add('calendar', 'every n business days needs a business calendar; got none');
  if (every > 1 && anchor === undefined) issues.add('anchor', `every ${every} business days counts from an anchor: give "anchor" (or "start")`);
  if (Number.isNaN(every) || !common.business) return undefined;
  return businessDaysEngine(common.business, anchor ?? 0, every);
}

function compileWeekly(def: Record<string, unknown>, common: CommonDate, issues: Issues): Engine | undefined {
  checkKeys(def, [...COMMON_DATE_KEYS, 'weekdays', 'every', 'anchor', 'weekStart'], '', issues);
  const every = readEvery(def, issues);
  const anchor = readDate(def, 'anchor', 'anchor', issues) ?? common.start;
  const weekStart = def['weekStart'] === undefined ? 1 : readWeekday(def['weekStart'], 'weekStart', issues);
  const list = def['weekdays'];
  const weekdays: number[] = [];
  if (!Array.isArray(list) || list.length === 0) {
    issues.add('weekdays', `expected a non-empty list of weekdays such as ["monday", "friday"], got ${Array.isArray(list) ? 'an empty list' : describeValue(list)}`);
  } else {
    list.forEach((w, i) => {
      const wd = readWeekday(w, `weekdays[${i}]`, issues);
      if (!Number.isNaN(wd)) {
        if (weekdays.includes(wd)) issues.add(`weekdays[${i}]`, `${describeValue(w)} is listed twice`);
        weekdays.push(wd);
      }
    });
  }
  if (every > 1 && anchor === undefined) issues.add('anchor', `every ${every} weeks counts from an anchor: give "anchor" (or "start")`);
  if (!issues.ok || Number.isNaN(every) || Number.isNaN(weekStart)) return undefined;
  const a = anchor ?? 0;
  const weekZero = a - mod(weekdayOfDayNumberUnchecked(a) - weekStart, 7);
  const offsets = weekdays.map((w) => mod(w - weekStart, 7)).sort((x, y) => x - y);
  return weeklyEngine(weekZero, offsets, every);
}

function compilePeriods(def: Record<string, unknown>, common: CommonDate, issues: Issues): { engine: Engine; period: PeriodOps } | undefined {
  checkKeys(def, [...COMMON_DATE_KEYS, 'unit', 'on', 'every', 'anchor'], '', issues);
  const every = readEvery(def, issues, MAX_RULE_EVERY_PERIODS);
  const anchor = readDate(def, 'anchor', 'anchor', issues) ?? common.start;
  let period: PeriodOps | undefined;
  if (def['unit'] === undefined) issues.add('unit', 'expected a period unit (a compiled unit, a unit definition or a name such as "quarter"); got none');
  else {
    try {
      period = periodOps(def['unit'], 'unit');
    } catch (e) {
      issues.add('unit', (e as Error).message);
    }
  }
  if (def['on'] === undefined) issues.add('on', 'expected the day(s) to pick in each period, such as { "businessDay": -1 }; got none');
  const selectors = def['on'] === undefined ? undefined : readSelectors(def['on'], 'on', PERIOD_LIMITS, common.business !== undefined, issues);
  if (every > 1 && anchor === undefined) issues.add('anchor', `every ${every} periods counts from an anchor: give "anchor" (or "start")`);
  if (!period || !selectors || Number.isNaN(every)) return undefined;
  const phaseOrdinal = period.ordinalOf(anchor ?? 0);
  const gap = periodsCycleGap(period, every, phaseOrdinal, selectors);
  if (gap < 0) {
    issues.add('on', `the rule never produces a date: no candidate period in a full 400-year Gregorian cycle has ${describeSelectors(selectors)}`);
    return undefined;
  }
  const a = period.firstDayOf(phaseOrdinal);
  const stride = Math.max(1, (period.firstDayOf(phaseOrdinal + every) - a) / selectors.length);
  const hasBusiness = selectors.some((s) => s.kind === 2);
  return {
    engine: periodsEngine(period, every, mod(phaseOrdinal, every), selectors, common.business, stride, hasBusiness ? Number.POSITIVE_INFINITY : gap),
    period,
  };
}

/** Compiles a date rule (every kind but intraday and rfc5545). */
export function compileCivilRule(def: Record<string, unknown>, issues: Issues): Compiled | undefined {
  const common = readCommonDate(def, issues);
  let engine: Engine | undefined;
  let period: PeriodOps | undefined;
  switch (def['kind']) {
    case 'days':
      engine = compileDays(def, common, issues);
      break;
    case 'business-days':
      engine = compileBusinessDays(def, common, issues);
      break;
    case 'weekly':
      engine = compileWeekly(def, common, issues);
      break;
    case 'monthly':
    case 'semi-monthly':
    case 'quarterly':
    case 'half-yearly':
    case 'yearly':
      engine = compileMonthFamily(def, def['kind'], common, issues);
      break;
    case 'periods': {
      const r = compilePeriods(def, common, issues);
      engine = r?.engine;
      period = r?.period;
      break;
    }
    default:
      return undefined;
  }
  if (!engine || !issues.ok) return undefined;
  return {
    values: 'dates',
    engine,
    business: common.business,
    convention: common.business ? common.convention : 'none',
    // A rule on a business calendar ends where the calendar's years end.
    rawStart: Math.max(common.start ?? MIN_DAY_NUMBER, common.business?.firstDay ?? MIN_DAY_NUMBER),
    rawEnd: Math.min(common.end ?? MAX_DAY_NUMBER + 1, common.business?.endDay ?? MAX_DAY_NUMBER + 1),
    count: common.count,
    exclude: undefined,
    zone: undefined,
    period,
  };
}

/**
 * @internal Expansion of RFC 5545 recurrence rules (section 3.3.10) for the date-level frequencies (DAILY,
 * WEEKLY, MONTHLY, YEARLY), fixed steps for HOURLY, MINUTELY and SECONDLY, and the recurrence set of several
 * RRULEs and RDATE values; rules with time parts expand in ./rfc5545-times.ts.
 *
 * Each period of the frequency (a year, month, week or day, every INTERVAL-th one counted from DTSTART's) is
 * expanded to the days that satisfy every BYxxx part at once; this intersection is what the RFC's table of
 * "expand" and "limit" behaviours produces for date-level parts. Missing day information comes from DTSTART as
 * the RFC says. BYSETPOS then picks positions in each period's sorted set.
 *
 * @module
 */
import { MAX_COUNT, MAX_DAY_NUMBER, MAX_EPOCH_MS, MAX_RFC5545_INTERVAL, MIN_DAY_NUMBER, MS_PER_DAY } from '../bounds.js';
import { describeValue } from '../errors.js';
import {
  dayNumberFromYmdUnchecked,
  dayCountOfMonthUnchecked,
  isLeapYearUnchecked,
  packedYmdUnchecked,
  weekdayOfDayNumberUnchecked,
  yearOfDayNumberUnchecked,
} from '../civil/gregorian.js';
import {
  WEEKDAY_NAMES,
  dayOfPacked,
  firstDayNumberOfMonthIndex,
  monthIndexOfDayNumberUnchecked,
  monthOfPacked,
  weekdayFromName,
  yearOfPacked,
} from '../civil/names.js';
import { Issues, checkKeys, isRecord, readEnum, readInt } from '../diagnostics/index.js';
import { type Compiled, reasonOf } from './compile.js';
import { type Engine, Sink, type ZoneOps, CYCLE_DAYS, gcd, locateByCycle, mod } from './engine.js';
import { elapsedEngine, resolveWall, timeOfDayEngine } from './engine-instants.js';
import { rfcDayTimesEngine, rfcSubDailyEngine } from './rfc5545-times.js';
import { locateCount } from './generate.js';
import { parseInstant, parsePlainDate, parsePlainDateTime, zoneOps } from './deps.js';
import type { Rfc5545Frequency } from './types.js';

/** A zone of offset 0 for DTSTART values in UTC and for floating times. */
const UTC_OPS: ZoneOps = { id: 'UTC', zone: undefined, offsetSecondsFromEpochMs: () => 0, mayJumpHalfADay: () => false };

const FREQUENCIES: readonly Rfc5545Frequency[] = ['yearly', 'monthly', 'weekly', 'daily', 'hourly', 'minutely', 'secondly'];

function sortedUnique(values: readonly number[]): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted.filter((v, i) => i === 0 || v !== sorted[i - 1]);
}

/** The date-level parts of a rule, compiled. */
export interface RfcDaySpec {
  readonly frequency: 'yearly' | 'monthly' | 'weekly' | 'daily';
  readonly interval: number;
  readonly startDay: number;
  readonly byMonthMask: number;
  readonly byWeekNo: readonly number[] | undefined;
  readonly byYearDay: readonly number[] | undefined;
  readonly byMonthDay: readonly number[] | undefined;
  /** Bit w set: every weekday w (no ordinal). */
  readonly byDayMask: number;
  readonly byDayNth: readonly { readonly weekday: number; readonly nth: number }[] | undefined;
  readonly bySetPos: readonly number[] | undefined;
  readonly weekStart: number;
}

/** First day of week 1 of `year` for weeks starting on `weekStart`: the week holding January 4 (RFC 5545 BYWEEKNO, ISO 8601). */
function week1Start(year: number, weekStart: number): number {
  const jan4 = dayNumberFromYmdUnchecked(year, 1, 4);
  return jan4 - mod(weekdayOfDayNumberUnchecked(jan4) - weekStart, 7);
}

/** Week number (positive) and the number of weeks in its week-year. */
function weekNumber(dn: number, weekStart: number): [number, number] {
  let y = yearOfDayNumberUnchecked(dn);
  let s = week1Start(y, weekStart);
  if (dn < s) {
    y -= 1;
    s = week1Start(y, weekStart);
  } else {
    const next = week1Start(y + 1, weekStart);
    if (dn >= next) {
      y += 1;
      s = next;
    }
  }
  const weeks = (week1Start(y + 1, weekStart) - s) / 7;
  return [Math.floor((dn - s) / 7) + 1, weeks];
}

/** Whether day `dn` satisfies every date-level part. */
export function dayMatches(spec: RfcDaySpec, dn: number): boolean {
  const p = packedYmdUnchecked(dn);
  const y = yearOfPacked(p);
  const m = monthOfPacked(p);
  const dom = dayOfPacked(p);
  if (spec.byMonthMask !== 0 && ((spec.byMonthMask >> m) & 1) === 0) return false;
  if (spec.byWeekNo) {
    const [wn, weeks] = weekNumber(dn, spec.weekStart);
    let hit = false;
    for (const w of spec.byWeekNo) if (w === wn || w === wn - weeks - 1) hit = true;
    if (!hit) return false;
  }
  const yearLength = isLeapYearUnchecked(y) ? 366 : 365;
  const jan1 = dayNumberFromYmdUnchecked(y, 1, 1);
  const doy = dn - jan1 + 1;
  if (spec.byYearDay) {
    let hit = false;
    for (const v of spec.byYearDay) if (v === doy || v === doy - yearLength - 1) hit = true;
    if (!hit) return false;
  }
  const monthLength = dayCountOfMonthUnchecked(y, m);
  if (spec.byMonthDay) {
    let hit = false;
    for (const v of spec.byMonthDay) if (v === dom || v === dom - monthLength - 1) hit = true;
    if (!hit) return false;
  }
  if (spec.byDayMask !== 0 || spec.byDayNth) {
    const wd = weekdayOfDayNumberUnchecked(dn);
    if (((spec.byDayMask >> wd) & 1) === 0) {
      if (!spec.byDayNth) return false;
      // An ordinal counts within the month for MONTHLY, and for YEARLY with BYMONTH; otherwise within the year
      // (RFC 5545 section 3.3.10 as corrected by verified erratum EID 1913).
      const inMonth = spec.frequency === 'monthly' || spec.byMonthMask !== 0;
      const pos = inMonth ? dom : doy;
      const length = inMonth ? monthLength : yearLength;
      const fromStart = Math.floor((pos - 1) / 7) + 1;
      const fromEnd = -(Math.floor((length - pos) / 7) + 1);
      let hit = false;
      for (const e of spec.byDayNth) if (e.weekday === wd && (e.nth === fromStart || e.nth === fromEnd)) hit = true;
      if (!hit) return false;
    }
  }
  return true;
}

/** The period (index, first day, end day) of each frequency. */
export function periodIndexOf(spec: RfcDaySpec, dn: number): number {
  switch (spec.frequency) {
    case 'yearly':
      return yearOfDayNumberUnchecked(dn);
    case 'monthly':
      return monthIndexOfDayNumberUnchecked(dn);
    case 'weekly':
      return Math.floor((dn - mod(spec.weekStart - 4, 7)) / 7);
    default:
      return dn;
  }
}
function periodFirst(spec: RfcDaySpec, index: number): number {
  switch (spec.frequency) {
    case 'yearly':
      return dayNumberFromYmdUnchecked(index, 1, 1);
    case 'monthly':
      return firstDayNumberOfMonthIndex(index);
    case 'weekly':
      // Day 0 (1970-01-01) is a Thursday (ISO 4); weeks start on weekStart.
      return index * 7 + mod(spec.weekStart - 4, 7);
    default:
      return index;
  }
}

/** Appends the days of period `index` (after BYSETPOS), sorted. */
export function expandPeriod(spec: RfcDaySpec, index: number, scratch: number[]): void {
  scratch.length = 0;
  const first = periodFirst(spec, index);
  const end = periodFirst(spec, index + 1);
  const lo = Math.max(first, MIN_DAY_NUMBER);
  const hi = Math.min(end, MAX_DAY_NUMBER + 1);
  if (spec.frequency === 'yearly' && spec.byMonthMask !== 0 && !spec.byWeekNo) {
    // Only the listed months can hold a match.
    for (let m = 1; m <= 12; m++) {
      if (((spec.byMonthMask >> m) & 1) === 0) continue;
      const a = dayNumberFromYmdUnchecked(index, m, 1);
      const b = a + dayCountOfMonthUnchecked(index, m);
      for (let d = Math.max(a, lo); d < Math.min(b, hi); d++) if (dayMatches(spec, d)) scratch.push(d);
    }
  } else {
    for (let d = lo; d < hi; d++) if (dayMatches(spec, d)) scratch.push(d);
  }
  if (spec.bySetPos && scratch.length > 0) {
    const picked: number[] = [];
    for (const p of spec.bySetPos) {
      const i = p > 0 ? p - 1 : scratch.length + p;
      if (i >= 0 && i < scratch.length) picked.push(scratch[i]!);
    }
    picked.sort((a, b) => a - b);
    scratch.length = 0;
    let prev = Number.NaN;
    for (const d of picked) {
      if (d !== prev) scratch.push(d);
      prev = d;
    }
  }
}

/** Periods in one repeat of the pattern (the 400-year Gregorian cycle, counted in candidate periods). */
function cyclePeriods(spec: RfcDaySpec): number {
  return periodsPerCycle(spec) / gcd(spec.interval, periodsPerCycle(spec));
}
/** Periods of the frequency in one 400-year cycle. */
function periodsPerCycle(spec: RfcDaySpec): number {
  return spec.frequency === 'yearly' ? 400 : spec.frequency === 'monthly' ? 4800 : spec.frequency === 'weekly' ? 20_871 : CYCLE_DAYS;
}
function periodDays(spec: RfcDaySpec): number {
  return spec.frequency === 'yearly' ? 366 : spec.frequency === 'monthly' ? 31 : spec.frequency === 'weekly' ? 7 : 1;
}

/** The engine of a date-level rule; returns undefined when the rule can never produce a date. */
export function rfcDayEngine(spec: RfcDaySpec): Engine | undefined {
  const scratch: number[] = [];
  const startIndex = periodIndexOf(spec, spec.startDay);
  // Prove that the rule produces a date after DTSTART: the pattern repeats with the 400-year cycle, so one
  // full cycle of candidate periods (plus DTSTART's own period) decides it.
  const cycle = cyclePeriods(spec);
  let found = false;
  for (let k = 0; k <= cycle && !found; k++) {
    expandPeriod(spec, startIndex + k * spec.interval, scratch);
    for (const d of scratch) if (d >= spec.startDay) found = true;
  }
  if (!found) return undefined;
  const maxGap = (cycle + 1) * spec.interval * periodDays(spec);
  if (spec.frequency === 'daily' && !spec.byWeekNo && !spec.byYearDay && !spec.byMonthDay && spec.byMonthMask === 0 && spec.byDayMask === 0 && !spec.byDayNth) {
    const step = spec.interval;
    const a = spec.startDay;
    return {
      stride: step,
      maxGap: step,
      fill(lo, hi, out) {
        lo = Math.max(lo, a);
        let k = Math.ceil((lo - a) / step);
        for (let d = a + k * step; d < hi; d = a + ++k * step) out.push(d);
      },
      locate(lo, k, end) {
        const d = a + (Math.ceil((Math.max(lo, a) - a) / step) + k) * step;
        return d < end ? d : Number.NaN;
      },
    };
  }
  // The pattern repeats every cyclePeriods(spec) periods of the frequency: interval / gcd(interval, periods per
  // cycle) whole 400-year cycles of 146,097 days.
  const cycleDays = (spec.interval / gcd(spec.interval, periodsPerCycle(spec))) * CYCLE_DAYS;
  const engine: Engine = {
    stride: Math.max(1, (spec.interval * periodDays(spec)) / 2),
    maxGap,
    locate: (lo, k, end) => locateByCycle(engine, cycleDays, Math.max(lo, spec.startDay), k, end, MIN_DAY_NUMBER),
    fill(lo, hi, out) {
      lo = Math.max(lo, spec.startDay);
      if (lo >= hi) return;
      const iLo = periodIndexOf(spec, lo);
      const iHi = periodIndexOf(spec, hi - 1);
      for (let i = iLo + mod(startIndex - iLo, spec.interval); i <= iHi; i += spec.interval) {
        expandPeriod(spec, i, scratch);
        for (const d of scratch) if (d >= lo && d < hi) out.push(d);
      }
    },
  };
  return engine;
}

function readList(def: Record<string, unknown>, key: string, min: number, max: number, allowNegative: boolean, issues: Issues): number[] | undefined {
  const v = def[key];
  if (v === undefined) return undefined;
  if (!Array.isArray(v) || v.length === 0) {
    issues.add(key, `expected a non-empty list of integers, got ${describeValue(v)}`);
    return undefined;
  }
  const out: number[] = [];
  v.forEach((x, i) => {
    const ok = typeof x === 'number' && Number.isInteger(x) && ((x >= min && x <= max) || (allowNegative && x <= -min && x >= -max));
    if (!ok) issues.add(`${key}[${i}]`, `expected an integer from ${min} to ${max}${allowNegative ? ` or -${max} to -${min}` : ''}, got ${describeValue(x)}`);
    else out.push(x);
  });
  return out.length === v.length ? out : undefined;
}

interface StartValue {
  readonly day: number;
  /** Milliseconds into the day, or undefined for a DATE. */
  readonly timeMs: number | undefined;
}

function readStartLike(v: unknown, path: string, issues: Issues): StartValue | undefined {
  if (typeof v !== 'string') {
    issues.add(path, `expected a date "1997-09-02" or a local date-time "1997-09-02T09:00:00", got ${describeValue(v)}`);
    return undefined;
  }
  try {
    if (!v.includes('T')) return { day: parsePlainDate(v), timeMs: undefined };
    const wall = parsePlainDateTime(v);
    const day = Math.floor(wall / MS_PER_DAY);
    return { day, timeMs: wall - day * MS_PER_DAY };
  } catch (e) {
    issues.add(path, `expected a date "1997-09-02" or a local date-time "1997-09-02T09:00:00"; ${reasonOf(e)}`);
    return undefined;
  }
}

const RULE_PART_KEYS = ['frequency', 'interval', 'count', 'until', 'byMonth', 'byWeekNo', 'byYearDay', 'byMonthDay', 'byDay', 'byHour', 'byMinute', 'bySecond', 'bySetPos', 'weekStart'];

/**
 * Compiles an `rfc5545` definition: its RRULE, with any further RRULEs (`additionalRules`) and RDATE values
 * (`include`) joined to one set, from which the EXDATE values (`exclude`) are removed (RFC 5545 section 3.8.5.3:
 * "gathering all of the start DATE-TIME values generated by any of the specified RRULE and RDATE properties, and
 * then excluding any start DATE-TIME values specified by EXDATE properties"). Each RRULE keeps its own COUNT.
 */
export function compileRfc5545(def: Record<string, unknown>, issues: Issues): Compiled | undefined {
  checkKeys(def, ['kind', 'start', 'zone', 'exclude', 'include', 'additionalRules', 'label', ...RULE_PART_KEYS], '', issues);
  const more = def['additionalRules'];
  const include = def['include'];
  if (more === undefined && include === undefined) return compileOneRule(def, issues, '');
  const rules: Compiled[] = [];
  const main = compileOneRule({ ...def, include: undefined, additionalRules: undefined, exclude: undefined }, issues, '');
  if (main) rules.push(main);
  if (more !== undefined) {
    if (!Array.isArray(more) || more.length === 0) issues.add('additionalRules', `expected a non-empty list of rule parts { frequency, ... }, got ${describeValue(more)}`);
    else
      more.forEach((r, i) => {
        const path = `additionalRules[${i}]`;
        if (!isRecord(r)) {
          issues.add(path, `expected rule parts { "frequency": "daily", ... }, got ${describeValue(r)}`);
          return;
        }
        checkKeys(r as Record<string, unknown>, RULE_PART_KEYS, path, issues);
        const c = compileOneRule({ ...(r as Record<string, unknown>), kind: 'rfc5545', start: def['start'], zone: def['zone'] }, issues, `${path}.`);
        if (c) rules.push(c);
      });
  }
  if (!issues.ok || !main) return undefined;
  const start = readStartLike(def['start'], 'start', issues)!;
  const toValue = (v: StartValue): number => (main.values === 'dates' ? v.day : resolveWall(main.zone!, v.day * MS_PER_DAY + v.timeMs!).earlier);
  const extra: number[] = [];
  if (include !== undefined) {
    if (!Array.isArray(include)) issues.add('include', `expected a list of dates or date-times (RDATE values), got ${describeValue(include)}`);
    else include.forEach((x, i) => {
      const v = readStartLike(x, `include[${i}]`, issues);
      if (v && (v.timeMs === undefined) !== (start.timeMs === undefined)) {
        issues.add(`include[${i}]`, `expected the same value type as start (${start.timeMs === undefined ? 'a date' : 'a date-time'}), got ${describeValue(x)}`);
      } else if (v) extra.push(toValue(v));
    });
  }
  const exclude = readExcludes(def, start, issues);
  if (!issues.ok) return undefined;
  for (const c of rules) if (c.count !== undefined) locateCount(c, def);
  extra.sort((a, b) => a - b);
  return {
    values: main.values,
    engine: unionEngine(rules, extra),
    business: undefined,
    convention: 'none',
    rawStart: Math.min(main.rawStart, extra[0] ?? Number.POSITIVE_INFINITY),
    rawEnd: Math.max(...rules.map((c) => c.rawEnd), (extra[extra.length - 1] ?? Number.NEGATIVE_INFINITY) + 1),
    count: undefined,
    exclude: exclude.length > 0 ? new Set(exclude.map(toValue)) : undefined,
    zone: main.zone,
    period: undefined,
  };
}

/** The union of several bounded rules and a sorted list of extra values (RDATE). */
function unionEngine(rules: readonly Compiled[], extra: readonly number[]): Engine {
  const scratch = new Sink(64);
  const all: number[] = [];
  const unbounded = rules.filter((c) => c.rawEnd >= (c.values === 'dates' ? MAX_DAY_NUMBER + 1 : MAX_EPOCH_MS + 1));
  return {
    stride: Math.min(...rules.map((c) => c.engine.stride)),
    // After the bounded rules and the extra values end, the unbounded rules alone set the gap.
    maxGap: unbounded.length > 0 ? Math.max(...rules.map((c) => c.engine.maxGap)) : Number.POSITIVE_INFINITY,
    fill(lo, hi, out) {
      all.length = 0;
      for (const c of rules) {
        scratch.clear();
        c.engine.fill(Math.max(lo, c.rawStart), Math.min(hi, c.rawEnd), scratch);
        for (let i = 0; i < scratch.length; i++) all.push(scratch.data[i]!);
      }
      for (const v of extra) if (v >= lo && v < hi) all.push(v);
      all.sort((a, b) => a - b);
      let prev = Number.NaN;
      for (const v of all) {
        if (v !== prev) out.push(v);
        prev = v;
      }
    },
  };
}

function readExcludes(def: Record<string, unknown>, start: StartValue | undefined, issues: Issues): StartValue[] {
  const exclude = def['exclude'];
  const excludes: StartValue[] = [];
  if (exclude !== undefined) {
    if (!Array.isArray(exclude)) issues.add('exclude', `expected a list of dates or date-times, got ${describeValue(exclude)}`);
    else exclude.forEach((x, i) => {
      const v = readStartLike(x, `exclude[${i}]`, issues);
      if (v && start && (v.timeMs === undefined) !== (start.timeMs === undefined)) {
        issues.add(`exclude[${i}]`, `expected the same value type as start (${start.timeMs === undefined ? 'a date' : 'a date-time'}), got ${describeValue(x)}`);
      } else if (v) excludes.push(v);
    });
  }
  return excludes;
}

/** Compiles one RRULE with its DTSTART; `prefix` leads the paths of its faults (`additionalRules[0].`). */
function compileOneRule(def: Record<string, unknown>, issues: Issues, prefix: string): Compiled | undefined {
  if (prefix === '') return compileRule(def, issues);
  const local = new Issues();
  const c = compileRule(def, local);
  for (const x of local.list) issues.add(`${prefix}${x.path}`, x.message);
  return c;
}

function compileRule(def: Record<string, unknown>, issues: Issues): Compiled | undefined {
  const frequency = readEnum(def, 'frequency', 'frequency', FREQUENCIES, issues, undefined);
  if (def['frequency'] === undefined) issues.add('frequency', 'expected the FREQ rule part: "yearly", "monthly", "weekly", "daily", "hourly", "minutely" or "secondly"; got none');
  const start = readStartLike(def['start'], 'start', issues);
  if (def['interval'] === 0) issues.add('interval', 'expected an integer of at least 1 (INTERVAL=0 would never move), got 0');
  const interval = def['interval'] === 0 ? Number.NaN : readInt(def, 'interval', 'interval', 1, MAX_RFC5545_INTERVAL, issues, 1);
  const countRaw = readInt(def, 'count', 'count', 1, MAX_COUNT, issues, Number.NaN);
  if (def['count'] !== undefined && def['until'] !== undefined) issues.add('until', 'UNTIL and COUNT must not both occur in one rule (RFC 5545 section 3.3.10)');
  const byMonth = readList(def, 'byMonth', 1, 12, false, issues);
  const byWeekNo = readList(def, 'byWeekNo', 1, 53, true, issues);
  const byYearDay = readList(def, 'byYearDay', 1, 366, true, issues);
  const byMonthDay = readList(def, 'byMonthDay', 1, 31, true, issues);
  const bySetPos = readList(def, 'bySetPos', 1, 366, true, issues);
  const byHour = readList(def, 'byHour', 0, 23, false, issues);
  const byMinute = readList(def, 'byMinute', 0, 59, false, issues);
  // Second 60 (a leap second, RFC 5545 section 3.3.10) is read as 59: instants here have no leap seconds.
  const bySecond = readList(def, 'bySecond', 0, 60, false, issues)?.map((x) => Math.min(x, 59));
  const weekStartName = readEnum(def, 'weekStart', 'weekStart', WEEKDAY_NAMES, issues, 'monday') ?? 'monday';
  const weekStart = weekdayFromName(weekStartName);
  let byDayMask = 0;
  let byDayNth: { weekday: number; nth: number }[] | undefined;
  const byDay = def['byDay'];
  if (byDay !== undefined) {
    if (!Array.isArray(byDay) || byDay.length === 0) issues.add('byDay', `expected a non-empty list of { weekday, nth? }, got ${describeValue(byDay)}`);
    else {
      byDay.forEach((e, i) => {
        const path = `byDay[${i}]`;
        if (!isRecord(e)) {
          issues.add(path, `expected { "weekday": "monday", "nth"?: 1 }, got ${describeValue(e)}`);
          return;
        }
        const entry = e as Record<string, unknown>;
        checkKeys(entry, ['weekday', 'nth'], path, issues);
        const wdName = readEnum(entry, 'weekday', `${path}.weekday`, WEEKDAY_NAMES, issues, undefined);
        if (entry['weekday'] === undefined) issues.add(`${path}.weekday`, 'expected a weekday "monday".."sunday", got undefined');
        const nth = entry['nth'];
        if (nth !== undefined && (typeof nth !== 'number' || !Number.isInteger(nth) || nth === 0 || Math.abs(nth) > 53)) {
          issues.add(`${path}.nth`, `expected an integer from 1 to 53 or -53 to -1, got ${describeValue(nth)}`);
          return;
        }
        if (!wdName) return;
        const wd = weekdayFromName(wdName);
        if (nth === undefined) byDayMask |= 1 << wd;
        else (byDayNth ??= []).push({ weekday: wd, nth: nth as number });
      });
    }
  }
  // Combinations the RFC forbids ("N/A" in the table of section 3.3.10).
  if (frequency) {
    const na = (key: string, part: string, when: readonly string[]) => {
      if (def[key] !== undefined && when.includes(frequency)) {
        issues.add(key, `${part} must not be used with FREQ=${frequency.toUpperCase()} (RFC 5545 section 3.3.10)`);
      }
    };
    na('byWeekNo', 'BYWEEKNO', ['monthly', 'weekly', 'daily', 'hourly', 'minutely', 'secondly']);
    na('byYearDay', 'BYYEARDAY', ['monthly', 'weekly', 'daily']);
    na('byMonthDay', 'BYMONTHDAY', ['weekly']);
    if (byDayNth && !['monthly', 'yearly'].includes(frequency)) {
      issues.add('byDay', `a BYDAY ordinal (such as 1MO) needs FREQ=MONTHLY or YEARLY, got FREQ=${frequency.toUpperCase()} (RFC 5545 section 3.3.10)`);
    }
    if (byDayNth && frequency === 'yearly' && byWeekNo) {
      issues.add('byDay', 'a BYDAY ordinal must not be used with FREQ=YEARLY and BYWEEKNO (RFC 5545 section 3.3.10)');
    }
  }
  if (bySetPos && !byMonth && !byWeekNo && !byYearDay && !byMonthDay && byDay === undefined && !byHour && !byMinute && !bySecond) {
    issues.add('bySetPos', 'BYSETPOS must be used with another BYxxx rule part (RFC 5545 section 3.3.10)');
  }
  // Zone of DTSTART.
  let zone: ZoneOps | undefined;
  if (def['zone'] !== undefined) {
    if (start && start.timeMs === undefined) issues.add('zone', 'a TZID applies to a DTSTART with a time; this DTSTART is a date');
    else if (def['zone'] === 'UTC') zone = UTC_OPS;
    else {
      try {
        zone = zoneOps(def['zone'], 'zone');
      } catch (e) {
        issues.add('zone', (e as Error).message);
      }
    }
  }
  const subDaily = frequency === 'hourly' || frequency === 'minutely' || frequency === 'secondly';
  if (start && start.timeMs === undefined && subDaily) {
    issues.add('start', `FREQ=${frequency!.toUpperCase()} needs a DTSTART with a time, got the date ${describeValue(def['start'])}`);
  }
  if (start && start.timeMs === undefined) {
    for (const [key, part] of [['byHour', 'BYHOUR'], ['byMinute', 'BYMINUTE'], ['bySecond', 'BYSECOND']] as const) {
      if (def[key] !== undefined) issues.add(key, `${part} needs a DTSTART with a time (a DATE-TIME), got the date ${describeValue(def['start'])}`);
    }
  }
  const excludes = readExcludes(def, start, issues);
  if (def['label'] !== undefined && typeof def['label'] !== 'string') issues.add('label', `expected a string, got ${describeValue(def['label'])}`);
  if (!issues.ok || !frequency || !start || Number.isNaN(interval)) return undefined;

  const dated = start.timeMs === undefined;
  const tz = zone ?? UTC_OPS;
  const toValue = (v: StartValue): number => (dated ? v.day : resolveWall(tz, v.day * MS_PER_DAY + v.timeMs!).earlier);
  const startValue = toValue(start);

  // UNTIL (inclusive) as an exclusive end.
  let rawEnd = dated ? MAX_DAY_NUMBER + 1 : MAX_EPOCH_MS + 1;
  const until = def['until'];
  if (until !== undefined) {
    if (typeof until !== 'string') issues.add('until', `expected a date "1997-12-24" or an instant "1997-12-24T00:00:00Z", got ${describeValue(until)}`);
    else {
      try {
        if (!until.includes('T')) {
          const d = parsePlainDate(until);
          rawEnd = dated ? d + 1 : resolveWall(tz, (d + 1) * MS_PER_DAY).earlier;
        } else if (/[zZ]$|[+-]\d\d:?\d\d$/.test(until)) {
          const t = parseInstant(until).epochMs;
          rawEnd = dated ? Math.floor(t / MS_PER_DAY) + 1 : t + 1;
        } else {
          const w = parsePlainDateTime(until);
          rawEnd = dated ? Math.floor(w / MS_PER_DAY) + 1 : resolveWall(tz, w).earlier + 1;
        }
      } catch (e) {
        issues.add('until', `expected a date "1997-12-24" or an instant "1997-12-24T00:00:00Z"; ${reasonOf(e)}`);
      }
    }
  }
  if (!issues.ok) return undefined;

  let engine: Engine | undefined;
  const dateParts = byMonth !== undefined || byWeekNo !== undefined || byYearDay !== undefined || byMonthDay !== undefined || byDay !== undefined;
  const timeParts = byHour !== undefined || byMinute !== undefined || bySecond !== undefined;
  const p = packedYmdUnchecked(start.day);
  const daySpecOf = (f: RfcDaySpec['frequency'], every: number, defaults: boolean): RfcDaySpec => ({
    frequency: f,
    interval: every,
    startDay: start.day,
    byMonthMask: (byMonth ?? (defaults && f === 'yearly' ? [monthOfPacked(p)] : [])).reduce((mask, m) => mask | (1 << m), 0),
    byWeekNo,
    byYearDay,
    byMonthDay: byMonthDay ?? (defaults && (f === 'yearly' || f === 'monthly') ? [dayOfPacked(p)] : undefined),
    byDayMask: byDay === undefined && defaults && f === 'weekly' ? 1 << weekdayOfDayNumberUnchecked(start.day) : byDayMask,
    byDayNth,
    bySetPos,
    weekStart,
  });
  const never = 'the rule never produces a date on or after DTSTART: no period in a full 400-year Gregorian cycle (after which dates and weekdays repeat) satisfies every BYxxx part';
  if (subDaily) {
    const periodMs = frequency === 'hourly' ? 3_600_000 : frequency === 'minutely' ? 60_000 : 1000;
    if (!dateParts && !timeParts) engine = elapsedEngine(startValue, interval * periodMs);
    else {
      const t0 = start.timeMs!;
      const m0 = Math.floor(t0 / 60_000) % 60;
      const s0 = Math.floor(t0 / 1000) % 60;
      // Table of RFC 5545 section 3.3.10: HOURLY expands BYMINUTE and BYSECOND, MINUTELY expands BYSECOND; the
      // parts at or above the frequency limit.
      const minutes = frequency === 'hourly' ? (byMinute ?? [m0]) : [0];
      const seconds = frequency === 'secondly' ? [0] : (bySecond ?? [s0]);
      const offsets = sortedUnique(minutes.flatMap((m) => seconds.map((x) => (frequency === 'hourly' ? m * 60_000 : 0) + x * 1000)));
      const within = frequency === 'hourly' ? m0 * 60_000 + s0 * 1000 : frequency === 'minutely' ? s0 * 1000 : 0;
      engine = rfcSubDailyEngine(
        {
          periodMs,
          interval,
          firstPeriodMs: startValue - within - (t0 % 1000),
          offsets,
          hours: byHour,
          minutes: frequency === 'hourly' ? undefined : byMinute,
          seconds: frequency === 'secondly' ? bySecond : undefined,
          days: dateParts ? daySpecOf('daily', 1, false) : undefined,
          setPos: bySetPos,
        },
        tz,
        startValue,
      );
    }
  } else {
    const defaults = !byWeekNo && !byYearDay && !byMonthDay && byDay === undefined;
    const spec = daySpecOf(frequency, interval, defaults);
    if (timeParts) {
      const t0 = start.timeMs!;
      const times = sortedUnique(
        (byHour ?? [Math.floor(t0 / 3_600_000)]).flatMap((h) =>
          (byMinute ?? [Math.floor(t0 / 60_000) % 60]).flatMap((m) => (bySecond ?? [Math.floor(t0 / 1000) % 60]).map((x) => h * 3_600_000 + m * 60_000 + x * 1000)),
        ),
      );
      engine = rfcDayTimesEngine({ ...spec, bySetPos: undefined }, times, bySetPos, tz, startValue);
    } else {
      const days = rfcDayEngine(spec);
      engine = days && (dated ? days : timeOfDayEngine(days, tz, start.timeMs!));
    }
  }
  if (!engine) {
    issues.add(
      'frequency',
      subDaily && timeParts
        ? `the rule never produces an instant: steps of ${interval} x FREQ=${frequency.toUpperCase()} from DTSTART never reach a local time that BYHOUR, BYMINUTE and BYSECOND allow (or no day satisfies the date parts)`
        : never,
    );
    return undefined;
  }
  return {
    values: dated ? 'dates' : 'instants',
    engine,
    business: undefined,
    convention: 'none',
    rawStart: startValue,
    rawEnd,
    count: Number.isNaN(countRaw) ? undefined : countRaw,
    exclude: excludes.length > 0 ? new Set(excludes.map(toValue)) : undefined,
    zone: dated ? undefined : tz,
    period: undefined,
  };
}

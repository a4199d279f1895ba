/**
 * @internal Validation and normalization of a definition of hours. Every fault is collected with its dotted path
 * (the diagnostics kit's Issues collector) and thrown together as one DefinitionError.
 *
 * @module
 */
import {
  HOURS_DEFAULT_FIRST_YEAR,
  HOURS_DEFAULT_LAST_YEAR,
  MAX_HOURS_CUTOFFS,
  MAX_HOURS_HOLIDAY_OFFSET,
  MAX_HOURS_INTERVALS_PER_DAY,
  MAX_HOURS_SPECIAL_DAYS,
  MAX_YEAR,
  MIN_YEAR,
  MS_PER_DAY,
} from '../bounds.js';
import { dayNumberFromYmdUnchecked, weekdayOfDayNumberUnchecked } from '../civil/gregorian.js';
import { WEEKDAY_NAMES, titleOfWeekday } from '../civil/names.js';
import { describeValue } from '../errors.js';
import { Issues, checkKeys, didYouMean, hasOwn, isRecord, joinPath, ownField, readBoolean, readEnum, readString } from '../diagnostics/index.js';
import {
  type BusinessCalendar,
  DISAMBIGUATIONS,
  type Disambiguation,
  type Zone,
  calendarOfInput,
  formatPlainDate,
  holidaysBetween,
  isCalendarBusinessDay,
  parsePlainDate,
  toZone,
} from './deps.js';

/** An interval in wall ms from the start of its day: `open` in [0, 24 h), `close` in (open, open + 24 h]. */
export interface NormInterval {
  readonly open: number;
  readonly close: number;
  readonly path: string;
}

/** What a special day does. */
export const SPECIAL_CLOSED = 0;
export const SPECIAL_HOURS = 1;
export const SPECIAL_CUT = 2;

/** A validated special day. */
export interface NormSpecial {
  readonly path: string;
  readonly name: string | undefined;
  /** The date (date specials), else NaN. */
  readonly dayNumber: number;
  /** The holiday name or rule id (holiday specials). */
  readonly holiday: string | undefined;
  readonly offset: number;
  readonly kind: number;
  /** Replacement intervals (SPECIAL_HOURS). */
  readonly hours: readonly NormInterval[];
  /** Late open and early close (SPECIAL_CUT); -Infinity / +Infinity when absent. */
  readonly openMs: number;
  readonly closeMs: number;
  /** Added intervals (SPECIAL_CUT). */
  readonly extra: readonly NormInterval[];
  /** Cut-off times by index into the definition's cut-off names; NaN where the regular time holds. */
  readonly cutoffs: readonly number[];
}

/** A validated definition of hours. */
export interface NormHours {
  readonly zone: Zone;
  readonly calendar: BusinessCalendar | undefined;
  /** Regular intervals per ISO weekday: index 0 is Monday. */
  readonly week: readonly (readonly NormInterval[])[];
  readonly byDate: ReadonlyMap<number, NormSpecial>;
  readonly byHoliday: readonly NormSpecial[];
  readonly cutoffNames: readonly string[];
  /** Regular cut-off times (wall ms of the day), by index of `cutoffNames`. */
  readonly cutoffs: readonly number[];
  readonly allowCutoffsOutsideSessions: boolean;
  readonly disambiguation: Disambiguation;
  readonly firstYear: number;
  readonly lastYear: number;
}

const TOP_KEYS = ['id', 'name', 'source', 'caution', 'zone', 'calendar', 'week', 'special', 'cutoffs', 'allowCutoffsOutsideSessions', 'disambiguation', 'years'];
const SPECIAL_KEYS = ['date', 'holiday', 'offset', 'name', 'closed', 'hours', 'open', 'close', 'extra', 'cutoffs'];
const INTERVAL_KEYS = ['open', 'close'];
/** The first and last years whose every day has instants (the ECMAScript time range cuts the civil end years). */
const FIRST_ZONED_YEAR = MIN_YEAR + 1;
const LAST_ZONED_YEAR = MAX_YEAR - 1;
const H24 = MS_PER_DAY;

const TIME_RE = /^(\d{2}):(\d{2})(?::(\d{2}))?$/;

/** Wall ms of `HH:MM[:SS]`, or NaN with an issue. `allow24`: 24:00 is valid (a close, a cut-off). */
function readTime(v: unknown, path: string, issues: Issues, allow24: boolean): number {
  const range = allow24 ? '00:00 to 24:00' : '00:00 to 23:59:59';
  const m = typeof v === 'string' ? TIME_RE.exec(v) : null;
  if (!m) {
    issues.add(path, `expected a wall-clock time "HH:MM" or "HH:MM:SS" (24-hour clock, ${range}), got ${describeValue(v)}`);
    return Number.NaN;
  }
  const h = Number(m[1]);
  const min = Number(m[2]);
  const s = m[3] === undefined ? 0 : Number(m[3]);
  const ms = (h * 3600 + min * 60 + s) * 1000;
  if (min > 59 || s > 59 || ms > H24 || (ms === H24 && !allow24)) {
    issues.add(path, `expected a wall-clock time from ${range}, got ${describeValue(v)}`);
    return Number.NaN;
  }
  return ms;
}

/** `HH:MM` (or `HH:MM:SS`) of wall ms from a day's start; past 24 h, "HH:MM the next day". */
export function formatWallTime(ms: number): string {
  const next = ms > H24;
  const t = next ? ms - H24 : ms;
  const h = Math.floor(t / 3_600_000);
  const m = Math.floor((t % 3_600_000) / 60_000);
  const s = Math.floor((t % 60_000) / 1000);
  const text = `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}${s ? `:${String(s).padStart(2, '0')}` : ''}`;
  return next ? `${text} the next day` : text;
}

/** `09:00-17:00, 18:00-20:00` */
export function formatIntervals(list: readonly { open: number; close: number }[]): string {
  return list.length === 0 ? 'closed' : list.map((i) => `${formatWallTime(i.open)}-${formatWallTime(i.close)}`).join(', ');
}

/** Reads a list of intervals of one day, sorted by open, refusing zero lengths and overlaps. */
function readIntervals(v: unknown, path: string, issues: Issues): NormInterval[] {
  if (!Array.isArray(v)) {
    issues.add(path, `expected an array of intervals like [{ "open": "09:00", "close": "17:00" }], got ${describeValue(v)}`);
    return [];
  }
  if (v.length > MAX_HOURS_INTERVALS_PER_DAY) {
    issues.add(path, `expected at most ${MAX_HOURS_INTERVALS_PER_DAY} intervals on one day, got ${v.length}`);
    return [];
  }
  const out: NormInterval[] = [];
  v.forEach((item: unknown, k) => {
    const p = joinPath(path, k);
    if (!isRecord(item)) {
      issues.add(p, `expected an interval { "open": "HH:MM", "close": "HH:MM" }, got ${describeValue(item)}`);
      return;
    }
    checkKeys(item, INTERVAL_KEYS, p, issues);
    const open = readTime(ownField(item, 'open'), joinPath(p, 'open'), issues, false);
    const close = readTime(ownField(item, 'close'), joinPath(p, 'close'), issues, true);
    if (Number.isNaN(open) || Number.isNaN(close)) return;
    if (open === close) {
      issues.add(
        p,
        `an interval of zero length (open and close both ${describeValue(item['open'])}); a 24-hour session is written { "open": "00:00", "close": "24:00" }`,
      );
      return;
    }
    // A close before the open runs overnight into the next day.
    out.push({ open, close: close > open ? close : close + H24, path: p });
  });
  out.sort((a, b) => a.open - b.open);
  for (let k = 1; k < out.length; k++) {
    const a = out[k - 1]!;
    const b = out[k]!;
    if (b.open < a.close) {
      issues.add(b.path, `overlaps ${a.path} (${formatIntervals([a])}): intervals of one day must not overlap (${formatIntervals([b])})`);
    }
  }
  return out;
}

/** The intervals of `base` cut to [openMs, closeMs). */
export function cutIntervals(base: readonly NormInterval[], openMs: number, closeMs: number): NormInterval[] {
  const out: NormInterval[] = [];
  for (const i of base) {
    const o = Math.max(i.open, openMs);
    const c = Math.min(i.close, closeMs);
    if (c > o) out.push(o === i.open && c === i.close ? i : { open: o, close: c, path: i.path });
  }
  return out;
}

/** The intervals of a day with regular intervals `base`, under a special day. */
export function applySpecial(base: readonly NormInterval[], s: NormSpecial): readonly NormInterval[] {
  if (s.kind === SPECIAL_CLOSED) return [];
  if (s.kind === SPECIAL_HOURS) return s.hours;
  const cut = cutIntervals(base, s.openMs, s.closeMs);
  if (s.extra.length === 0) return cut;
  return [...cut, ...s.extra].sort((a, b) => a.open - b.open);
}

function readCutoffMap(v: unknown, path: string, issues: Issues, known: readonly string[] | undefined): Map<string, number> {
  const out = new Map<string, number>();
  if (!isRecord(v)) {
    issues.add(path, `expected an object of named cut-off times like { "payments": "17:00" }, got ${describeValue(v)}`);
    return out;
  }
  const keys = Object.keys(v);
  if (keys.length > MAX_HOURS_CUTOFFS) {
    issues.add(path, `expected at most ${MAX_HOURS_CUTOFFS} cut-off times, got ${keys.length}`);
    return out;
  }
  for (const key of keys) {
    const p = joinPath(path, key);
    if (key.length === 0 || key.length > 64) {
      issues.add(p, `expected a cut-off name of 1 to 64 characters, got ${describeValue(key)}`);
      continue;
    }
    if (known && !known.includes(key)) {
      issues.add(p, `unknown cut-off ${describeValue(key)}${didYouMean(key, known)}; a special day may change only the cut-offs named in "cutoffs" (${known.map((k) => JSON.stringify(k)).join(', ') || 'none'})`);
      continue;
    }
    const t = readTime(v[key], p, issues, true);
    if (!Number.isNaN(t)) out.set(key, t);
  }
  return out;
}

function isInside(list: readonly NormInterval[], t: number): boolean {
  return list.some((i) => i.open <= t && t <= i.close);
}

/** Validates a definition of hours; returns the normalized form, or undefined with the issues filled. */
export function normalizeHours(def: unknown, issues: Issues): NormHours | undefined {
  if (!isRecord(def)) {
    issues.add('(definition)', `expected a definition of hours { zone, week, ... }, got ${describeValue(def)}`);
    return undefined;
  }
  checkKeys(def, TOP_KEYS, '', issues);
  for (const key of ['id', 'name', 'source', 'caution']) readString(def, key, key, issues, undefined);

  // zone
  let zone: Zone | undefined;
  const zoneValue = ownField(def, 'zone');
  if (zoneValue === undefined) issues.add('zone', 'expected the IANA zone of the wall clock the hours are written in, such as "America/New_York"; got undefined');
  else {
    try {
      zone = toZone(zoneValue as string, 'zone');
    } catch (e) {
      issues.add('zone', e instanceof Error ? e.message.replace(/^zone: /, '') : String(e));
    }
  }

  // calendar
  let calendar: BusinessCalendar | undefined;
  const calValue = ownField(def, 'calendar');
  if (calValue !== undefined) {
    const r = calendarOfInput(calValue, 'calendar');
    for (const i of r.issues) issues.add(i.path, i.message);
    calendar = r.calendar;
  }

  // years
  let firstYear = calendar ? Math.max(calendar.firstYear, FIRST_ZONED_YEAR) : HOURS_DEFAULT_FIRST_YEAR;
  let lastYear = calendar ? Math.min(calendar.lastYear, LAST_ZONED_YEAR) : HOURS_DEFAULT_LAST_YEAR;
  const yearsValue = ownField(def, 'years');
  if (yearsValue !== undefined) {
    if (!isRecord(yearsValue)) issues.add('years', `expected { "from": year, "until": year }, got ${describeValue(yearsValue)}`);
    else {
      checkKeys(yearsValue, ['from', 'until'], 'years', issues);
      const lo = calendar ? Math.max(calendar.firstYear, FIRST_ZONED_YEAR) : FIRST_ZONED_YEAR;
      const hi = calendar ? Math.min(calendar.lastYear, LAST_ZONED_YEAR) : LAST_ZONED_YEAR;
      const within = calendar ? ` (the years of calendar ${JSON.stringify(calendar.id)})` : '';
      for (const key of ['from', 'until'] as const) {
        const v = ownField(yearsValue, key);
        if (v === undefined) continue;
        if (typeof v !== 'number' || !Number.isInteger(v) || v < lo || v > hi) {
          issues.add(`years.${key}`, `expected an integer year from ${lo} to ${hi}${within}, got ${describeValue(v)}`);
        } else if (key === 'from') firstYear = v;
        else lastYear = v;
      }
      if (lastYear < firstYear) issues.add('years.until', `expected a year not before years.from (${firstYear}), got ${lastYear}`);
    }
  }
  const firstDay = dayNumberFromYmdUnchecked(firstYear, 1, 1);
  const endDay = dayNumberFromYmdUnchecked(lastYear + 1, 1, 1);
  const yearsText = `${firstYear}..${lastYear}`;

  // cut-offs
  let cutoffNames: string[] = [];
  let cutoffs: number[] = [];
  const cutValue = ownField(def, 'cutoffs');
  if (cutValue !== undefined) {
    const m = readCutoffMap(cutValue, 'cutoffs', issues, undefined);
    cutoffNames = [...m.keys()];
    cutoffs = [...m.values()];
  }
  const allowOutside = readBoolean(def, 'allowCutoffsOutsideSessions', 'allowCutoffsOutsideSessions', issues, false);
  const disambiguation = readEnum(def, 'disambiguation', 'disambiguation', DISAMBIGUATIONS, issues, 'compatible') ?? 'compatible';

  // week
  const week: NormInterval[][] = [[], [], [], [], [], [], []];
  const beforeWeek = issues.count;
  const weekValue = ownField(def, 'week');
  if (!isRecord(weekValue)) {
    issues.add('week', `expected the opening intervals per weekday, like { "monday": [{ "open": "09:00", "close": "17:00" }] }, got ${describeValue(weekValue)}`);
  } else {
    checkKeys(weekValue, WEEKDAY_NAMES, 'week', issues);
    WEEKDAY_NAMES.forEach((name, k) => {
      if (hasOwn(weekValue, name)) week[k] = readIntervals(weekValue[name], `week.${name}`, issues);
    });
    // An overnight interval must not run into the next weekday's first intervals.
    for (let k = 0; k < 7; k++) {
      const last = week[k]![week[k]!.length - 1];
      if (!last || last.close <= H24) continue;
      const tail = last.close - H24;
      for (const next of week[(k + 1) % 7]!) {
        if (next.open < tail) {
          issues.add(next.path, `overlaps the overnight interval ${last.path} (${formatIntervals([last])}): it opens at ${formatWallTime(next.open)}, before that interval closes`);
        }
      }
    }
  }

  const weekOk = issues.count === beforeWeek;

  // special days
  const byDate = new Map<number, NormSpecial>();
  const byHoliday: NormSpecial[] = [];
  const specialValue = ownField(def, 'special');
  let holidayNames: Set<string> | undefined;
  const namesOfHolidays = (): Set<string> => {
    if (holidayNames) return holidayNames;
    holidayNames = new Set();
    if (!calendar) return holidayNames;
    // The names the calendar uses within the first 200 years of the hours (bounded work at definition).
    const end = Math.min(endDay, dayNumberFromYmdUnchecked(Math.min(lastYear, firstYear + 199) + 1, 1, 1));
    for (const h of holidaysBetween(calendar, firstDay, end)) {
      holidayNames.add(h.name);
      if (h.ruleId !== undefined) holidayNames.add(h.ruleId);
    }
    return holidayNames;
  };
  if (specialValue !== undefined) {
    if (!Array.isArray(specialValue)) issues.add('special', `expected an array of special days, got ${describeValue(specialValue)}`);
    else if (specialValue.length > MAX_HOURS_SPECIAL_DAYS) issues.add('special', `expected at most ${MAX_HOURS_SPECIAL_DAYS} special days, got ${specialValue.length}`);
    else {
      specialValue.forEach((item: unknown, k) => {
        const s = readSpecial(item, `special[${k}]`);
        if (!s) return;
        if (s.holiday === undefined) {
          const prev = byDate.get(s.dayNumber);
          if (prev) issues.add(`${s.path}.date`, `${formatPlainDate(s.dayNumber)} is already a special day at ${prev.path}; give each date one entry`);
          else byDate.set(s.dayNumber, s);
        } else byHoliday.push(s);
      });
    }
  }

  function readSpecial(item: unknown, path: string): NormSpecial | undefined {
    if (!isRecord(item)) {
      issues.add(path, `expected a special day like { "date": "2025-12-24", "close": "13:00" }, got ${describeValue(item)}`);
      return undefined;
    }
    const before = issues.count;
    checkKeys(item, SPECIAL_KEYS, path, issues);
    const name = readString(item, 'name', joinPath(path, 'name'), issues, undefined);
    const has = (k: string) => hasOwn(item, k) && item[k] !== undefined;
    let dayNumber = Number.NaN;
    let holiday: string | undefined;
    let offset = 0;
    if (has('date') === has('holiday')) {
      issues.add(path, 'expected exactly one of "date" (an ISO 8601 date) or "holiday" (a holiday of the calendar, with an optional "offset" in business days)');
    } else if (has('date')) {
      const text = item['date'];
      try {
        if (typeof text !== 'string') throw new Error(`expected an ISO 8601 date "YYYY-MM-DD", got ${describeValue(text)}`);
        dayNumber = parsePlainDate(text);
        if (dayNumber < firstDay || dayNumber >= endDay) {
          const cal = calendar ? `; the calendar ${JSON.stringify(calendar.id)} answers for ${calendar.firstYear}..${calendar.lastYear}` : '';
          issues.add(joinPath(path, 'date'), `${describeValue(text)} is outside the years ${yearsText} of these hours${cal}; move the date or set "years"`);
          dayNumber = Number.NaN;
        }
      } catch (e) {
        issues.add(joinPath(path, 'date'), e instanceof Error ? e.message.replace(/^text: /, '') : String(e));
      }
      if (has('offset')) issues.add(joinPath(path, 'offset'), 'an offset goes with "holiday" only; a dated special day names its date');
    } else {
      holiday = readString(item, 'holiday', joinPath(path, 'holiday'), issues, undefined, 200);
      if (!calendar) issues.add(joinPath(path, 'holiday'), 'a special day relative to a holiday needs a "calendar" that has the holiday');
      else if (holiday !== undefined && !namesOfHolidays().has(holiday)) {
        const within = `${firstYear}..${Math.min(lastYear, firstYear + 199)}`;
        issues.add(
          joinPath(path, 'holiday'),
          `no holiday of calendar ${JSON.stringify(calendar.id)} is named ${describeValue(holiday)} (by name or rule id) in ${within}${didYouMean(holiday, [...namesOfHolidays()])}`,
        );
      }
      const o = ownField(item, 'offset');
      if (o !== undefined) {
        if (typeof o !== 'number' || !Number.isInteger(o) || Math.abs(o) > MAX_HOURS_HOLIDAY_OFFSET) {
          issues.add(joinPath(path, 'offset'), `expected an integer from ${-MAX_HOURS_HOLIDAY_OFFSET} to ${MAX_HOURS_HOLIDAY_OFFSET} (business days from the holiday; -1 is the business day before it), got ${describeValue(o)}`);
        } else offset = o;
      }
    }
    // the effect
    const effects = ['closed', 'hours', 'open', 'close', 'extra'].filter(has);
    let kind = SPECIAL_CUT;
    let hours: NormInterval[] = [];
    let extra: NormInterval[] = [];
    let openMs = -Infinity;
    let closeMs = Infinity;
    if (effects.length === 0) {
      issues.add(path, 'expected what changes on the day: "closed": true, "hours", "open" (a late open), "close" (an early close) or "extra" (added intervals)');
    } else if (has('closed')) {
      if (item['closed'] !== true) issues.add(joinPath(path, 'closed'), `expected true (leave it out when the day is not closed), got ${describeValue(item['closed'])}`);
      if (effects.length > 1 || has('cutoffs')) issues.add(path, `a closed day takes nothing else; remove ${[...effects.filter((e) => e !== 'closed'), ...(has('cutoffs') ? ['cutoffs'] : [])].map((e) => JSON.stringify(e)).join(', ')}`);
      kind = SPECIAL_CLOSED;
    } else if (has('hours')) {
      if (effects.length > 1) issues.add(path, `"hours" replaces the day's intervals and takes no ${effects.filter((e) => e !== 'hours').map((e) => JSON.stringify(e)).join(', ')}; write the whole day in "hours"`);
      kind = SPECIAL_HOURS;
      hours = readIntervals(item['hours'], joinPath(path, 'hours'), issues);
      if (Array.isArray(item['hours']) && item['hours'].length === 0) issues.add(joinPath(path, 'hours'), 'expected at least one interval; a day with none is written "closed": true');
    } else {
      if (has('open')) openMs = readTime(item['open'], joinPath(path, 'open'), issues, false);
      if (has('close')) closeMs = readTime(item['close'], joinPath(path, 'close'), issues, true);
      if (has('close') && closeMs === 0) issues.add(joinPath(path, 'close'), 'an early close at 00:00 leaves nothing of the day; write "closed": true');
      if (openMs >= closeMs) issues.add(path, `the late open ${formatWallTime(openMs)} is not before the early close ${formatWallTime(closeMs)}; write "closed": true for a day with no session`);
      if (has('extra')) extra = readIntervals(item['extra'], joinPath(path, 'extra'), issues);
    }
    const cutoffMap = has('cutoffs') && kind !== SPECIAL_CLOSED ? readCutoffMap(item['cutoffs'], joinPath(path, 'cutoffs'), issues, cutoffNames) : new Map<string, number>();
    if (issues.count > before) return undefined;
    return {
      path,
      name,
      dayNumber,
      holiday,
      offset,
      kind,
      hours,
      openMs,
      closeMs,
      extra,
      cutoffs: cutoffNames.map((n) => cutoffMap.get(n) ?? Number.NaN),
    };
  }

  // The checks below read the week and the calendar: they run when both are sound, so that their messages are
  // never about a fault reported above.
  if (!weekOk || (calValue !== undefined && !calendar)) return undefined;

  // Hours that can never open, and weekdays whose intervals a calendar weekend always closes.
  if (week.every((list) => list.length === 0) && byHoliday.every((s) => s.kind === SPECIAL_CLOSED) && [...byDate.values()].every((s) => s.kind !== SPECIAL_HOURS && s.extra.length === 0)) {
    issues.add('week', 'no weekday has an opening interval and no special day adds one, so these hours would never open');
  }
  if (calendar) {
    for (const wd of calendar.weekend) {
      if (week[wd - 1]!.length > 0) {
        const name = WEEKDAY_NAMES[wd - 1]!;
        issues.add(
          `week.${name}`,
          `${titleOfWeekday(wd)} is a weekend day of calendar ${JSON.stringify(calendar.id)}, so these intervals would never apply; use a calendar whose weekend leaves ${titleOfWeekday(wd)} out (e.g. { "extends": ${JSON.stringify(calendar.id)}, "weekend": [${calendar.weekendNames.filter((n) => n !== name).map((n) => JSON.stringify(n)).join(', ')}] })`,
        );
      }
    }
  }

  // Dated special days against the regular hours of their date.
  for (const s of byDate.values()) {
    if (s.kind !== SPECIAL_CUT) continue;
    const dn = s.dayNumber;
    const wd = weekdayOfDayNumberUnchecked(dn);
    const open = !calendar || isCalendarBusinessDay(calendar, dn);
    const base = open ? week[wd - 1]! : [];
    const what = `${formatPlainDate(dn)} (${titleOfWeekday(wd)}${open ? '' : `, not a business day of calendar ${JSON.stringify(calendar!.id)}`})`;
    if ((s.openMs !== -Infinity || s.closeMs !== Infinity) && base.length === 0) {
      issues.add(s.path, `there are no regular hours on ${what} to open late or close early; give the day's "hours" instead`);
      continue;
    }
    if (base.length > 0) {
      const first = base[0]!.open;
      const last = base[base.length - 1]!.close;
      if (s.closeMs !== Infinity && s.closeMs >= last) issues.add(`${s.path}.close`, `${formatWallTime(s.closeMs)} is not an early close: the regular hours of ${what} are ${formatIntervals(base)}`);
      if (s.openMs !== -Infinity && s.openMs <= first) issues.add(`${s.path}.open`, `${formatWallTime(s.openMs)} is not a late open: the regular hours of ${what} are ${formatIntervals(base)}`);
    }
    const cut = cutIntervals(base, s.openMs, s.closeMs);
    if (cut.length === 0 && base.length > 0 && s.extra.length === 0) issues.add(s.path, `no session of ${what} (${formatIntervals(base)}) is left; write "closed": true`);
    for (const x of s.extra) {
      for (const b of cut) {
        if (x.open < b.close && b.open < x.close) issues.add(x.path, `overlaps the regular hours of ${what} (${formatIntervals([b])}) that stay`);
      }
    }
  }

  // Cut-offs inside the sessions of every kind of day (unless allowed outside).
  if (!allowOutside && cutoffNames.length > 0) {
    const fix = 'or set "allowCutoffsOutsideSessions": true if the institution keeps it there';
    for (let k = 0; k < 7; k++) {
      const list = week[k]!;
      if (list.length === 0) continue;
      cutoffNames.forEach((n, c) => {
        if (!isInside(list, cutoffs[c]!)) {
          issues.add(`cutoffs.${n}`, `${formatWallTime(cutoffs[c]!)} is outside every session of ${titleOfWeekday(k + 1)} (${formatIntervals(list)}); move it within them, ${fix}`);
        }
      });
    }
    const checkSpecial = (s: NormSpecial, list: readonly NormInterval[], what: string) => {
      if (list.length === 0) return;
      cutoffNames.forEach((n, c) => {
        const own = !Number.isNaN(s.cutoffs[c]!);
        const t = own ? s.cutoffs[c]! : cutoffs[c]!;
        if (!isInside(list, t)) {
          issues.add(
            own ? `${s.path}.cutoffs.${n}` : s.path,
            `the cut-off ${JSON.stringify(n)} at ${formatWallTime(t)} is outside the sessions of ${what} (${formatIntervals(list)}); ${own ? 'move it within them' : `give "cutoffs": { ${JSON.stringify(n)}: a time within them }`}, ${fix}`,
          );
        }
      });
    };
    for (const s of byDate.values()) {
      const wd = weekdayOfDayNumberUnchecked(s.dayNumber);
      const open = !calendar || isCalendarBusinessDay(calendar, s.dayNumber);
      checkSpecial(s, applySpecial(open ? week[wd - 1]! : [], s), `${formatPlainDate(s.dayNumber)}`);
    }
    for (const s of byHoliday) {
      if (s.kind === SPECIAL_HOURS) checkSpecial(s, s.hours, 'this day');
      else {
        for (let k = 0; k < 7; k++) {
          if (week[k]!.length > 0) checkSpecial(s, applySpecial(week[k]!, s), `this day when it is a ${titleOfWeekday(k + 1)}`);
        }
      }
    }
  }
  if (!issues.ok || !zone) return undefined;
  return {
    zone,
    calendar,
    week,
    byDate,
    byHoliday,
    cutoffNames,
    cutoffs,
    allowCutoffsOutsideSessions: allowOutside,
    disambiguation,
    firstYear,
    lastYear,
  };
}

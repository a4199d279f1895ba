/**
 * Business time on compiled hours, one instant (or one pair) at a time: open or not and the current session,
 * the next and previous opening and closing, a business duration added, the business time between two instants,
 * the value date under a named cut-off, and the sessions in a range. Every answer is a binary search in the
 * compiled table: logarithmic in the sessions of the years it holds, flat in the length of the span.
 *
 * @module
 */
import { HOURS_LIST_LIMIT, HOURS_SEARCH_LIMIT_DAYS, MAX_EPOCH_MS, MAX_HOURS_LIST_LIMIT, MS_PER_DAY } from '../bounds.js';
import { yearOfDayNumberUnchecked } from '../civil/gregorian.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { didYouMean, optionOf, readOptions, requireBoolean, requireDayNumberArgument, requireEpochMs, requireWhole } from '../diagnostics/index.js';
import { type HoursEngine, NO_DAY, type Table } from './compile.js';
import { type Duration, exactMsOfDuration, formatInstant, formatPlainDate, localDayNumber, localYear, readDuration } from './deps.js';
import { type BusinessHours, NoSessionError, engineOfHours } from './hours.js';

/** One session: a stretch of time in which the hours are open. */
export interface Session {
  /** First instant of the session (epoch ms). */
  readonly startEpochMs: number;
  /** First instant after the session (end-exclusive). */
  readonly endEpochMs: number;
  /** Elapsed length in ms: 8 h for 09:00-17:00 on most days, 7 or 9 h for 22:00-06:00 across a DST change. */
  readonly lengthMs: number;
  /** The business day the session belongs to: the day of its opening wall time. */
  readonly dayNumber: number;
}

/** Options of the `next…` and `previous…` functions. */
export interface NearestOptions {
  /** Also answer the given instant itself when an opening (closing) is exactly there (default false: strictly after / before). */
  readonly inclusive?: boolean;
}

/** Options of {@link listSessions}. */
export interface ListSessionsOptions {
  /** Most sessions to return before throwing `limit-exceeded` (default {@link HOURS_LIST_LIMIT}). */
  readonly limit?: number;
}

const SEARCH_MS = HOURS_SEARCH_LIMIT_DAYS * MS_PER_DAY;

// ---- shared pieces (the bulk module uses them too) ----------------------------------------------------------

/** @internal Count of the elements of ascending `a` that are at most `x`. */
export function countAtMost(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid]! <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** @internal Count of the elements of ascending `a` that are below `x`. */
export function countBelow(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid]! < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** @internal Index of the session holding `t` (S <= t < E), or -1. */
export function sessionIndexAt(T: Table, t: number): number {
  const i = countAtMost(T.starts, t) - 1;
  return i >= 0 && t < T.ends[i]! ? i : -1;
}

/** @internal Business ms of the table's sessions before `t`. */
export function businessMsBefore(T: Table, t: number): number {
  const i = countAtMost(T.starts, t);
  if (i > 0 && t < T.ends[i - 1]!) return T.cum[i - 1]! + (t - T.starts[i - 1]!);
  return T.cum[i]!;
}

function describeYears(e: HoursEngine): string {
  const cal = e.norm.calendar;
  return `the years ${e.norm.firstYear}..${e.norm.lastYear} that these hours answer for${cal ? ` (calendar ${JSON.stringify(cal.id)})` : ''}`;
}

function showInstant(t: number): string {
  return Number.isFinite(t) && Math.abs(t) <= MAX_EPOCH_MS ? formatInstant(Math.floor(t)) : String(t);
}

/** @internal An instant within the hours' years: [first instant of the first year, first instant after the last). */
export function requireHoursInstant(e: HoursEngine, name: string, value: unknown): number {
  const t = requireEpochMs(name, value);
  if (!(t >= e.startEpochMs && t < e.endEpochMs)) throw outsideYears(e, name, t);
  return t;
}

/** @internal The error for an instant outside the hours' years. */
export function outsideYears(e: HoursEngine, name: string, t: number): KalendsRangeError {
  return new KalendsRangeError(`${name}: ${showInstant(t)} (${describeValue(t)}) is outside ${describeYears(e)}; set "years" in the definition to answer for others`, {
    code: 'out-of-range',
    received: t,
  });
}

/** @internal The table holding the local years around `t` (the year before, its year, the year after). */
export function tableAround(e: HoursEngine, t: number, name: string): Table {
  const y = localYear(e.norm.zone, t);
  return e.tableFor(y - 1, y + 1, name);
}

/** @internal The table holding the years around both `a` and `b`. */
export function tableAcross(e: HoursEngine, a: number, b: number, name: string): Table {
  const ya = localYear(e.norm.zone, a);
  const yb = localYear(e.norm.zone, b);
  return e.tableFor(Math.min(ya, yb) - 1, Math.max(ya, yb) + 1, name);
}

/** @internal The index of a named cut-off, or a KalendsRangeError (unknown-name) with a suggestion. */
export function cutoffIndex(e: HoursEngine, cutoff: unknown): number {
  const names = e.norm.cutoffNames;
  const i = typeof cutoff === 'string' ? names.indexOf(cutoff) : -1;
  if (i >= 0) return i;
  const valid = names.length ? `one of ${names.map((n) => JSON.stringify(n)).join(', ')}` : 'none: the definition names no "cutoffs"';
  if (typeof cutoff !== 'string') {
    throw new KalendsTypeError(`cutoff: expected the name of a cut-off of these hours (${valid}), got ${describeValue(cutoff)}`, { code: 'invalid-type', received: cutoff });
  }
  throw new KalendsRangeError(`cutoff: unknown cut-off ${describeValue(cutoff)}${didYouMean(cutoff, names)}; the cut-offs of these hours are ${valid}`, {
    code: 'unknown-name',
    received: cutoff,
  });
}

/**
 * @internal Elapsed ms of a business duration: a Duration, ISO 8601 text, or a number of ms. Calendar fields
 * (years, months, weeks, days) are refused: a business day has no fixed length in elapsed time.
 */
export function businessDurationMs(duration: unknown, name = 'duration'): number {
  if (typeof duration === 'number') {
    if (!Number.isFinite(duration) || Math.abs(duration) > 2 * MAX_EPOCH_MS) {
      throw new KalendsRangeError(`${name}: expected elapsed milliseconds within ±${2 * MAX_EPOCH_MS}, got ${describeValue(duration)}`, { code: 'out-of-range', received: duration });
    }
    return duration;
  }
  let d: Duration;
  if (typeof duration === 'string') d = readDuration(duration, name);
  else if (typeof duration === 'object' && duration !== null && typeof (duration as Duration).sign === 'number') d = duration as Duration;
  else {
    throw new KalendsTypeError(`${name}: expected an ISO 8601 duration of elapsed time ("PT8H"), a Duration from parseDuration, or milliseconds, got ${describeValue(duration)}`, {
      code: 'invalid-type',
      received: duration,
    });
  }
  const calendar = (['years', 'months', 'weeks', 'days'] as const).filter((f) => d[f] !== 0);
  if (calendar.length > 0) {
    const shown = typeof duration === 'string' ? describeValue(duration) : 'the duration';
    throw new KalendsRangeError(
      `${name}: ${shown} has calendar fields (${calendar.join(', ')}); business time is elapsed time, and a business day has no fixed length here (8 h on a regular day, less on an early close, 7 or 9 h for a night session across a DST change), so a day of business time is ambiguous. Write the elapsed time, such as "PT8H", or move whole business days with shiftBusinessDays`,
      { code: 'unsupported', received: duration, path: name },
    );
  }
  return exactMsOfDuration(d);
}

function sessionAt(T: Table, i: number): Session {
  const s = T.starts[i]!;
  const e = T.ends[i]!;
  return Object.freeze({ startEpochMs: s, endEpochMs: e, lengthMs: e - s, dayNumber: T.days[i]! });
}

function noSession(e: HoursEngine, name: string, t: number, forward: boolean, what: string): Error {
  const edge = forward ? e.endEpochMs : e.startEpochMs;
  if (forward ? edge - t <= SEARCH_MS : t - edge <= SEARCH_MS) {
    return new KalendsRangeError(
      `${name}: no ${what} ${forward ? 'after' : 'before'} ${showInstant(t)} within ${describeYears(e)}; set "years" in the definition to search further`,
      { code: 'out-of-range', received: t },
    );
  }
  return new NoSessionError(
    `${name}: no ${what} within ${HOURS_SEARCH_LIMIT_DAYS} days ${forward ? 'after' : 'before'} ${showInstant(t)} (the search limit, HOURS_SEARCH_LIMIT_DAYS); check that the definition opens (and closes) at all in these years`,
    t,
    HOURS_SEARCH_LIMIT_DAYS,
  );
}

/**
 * @internal The first start (`ends` false) or end (`ends` true) strictly after `t` (or at `t` when inclusive),
 * within the search limit.
 */
export function searchForward(e: HoursEngine, t: number, ends: boolean, inclusive: boolean, name: string): number {
  let T = tableAround(e, t, name);
  for (let pass = 0; pass < 2; pass++) {
    const a = ends ? T.ends : T.starts;
    const i = inclusive ? countBelow(a, t) : countAtMost(a, t);
    if (i < T.n && a[i]! <= T.validTo) {
      if (a[i]! - t > SEARCH_MS) break;
      return a[i]!;
    }
    if (T.validTo === Infinity) break;
    T = tableAcross(e, t, Math.min(t + SEARCH_MS, e.endEpochMs - 1), name);
  }
  throw noSession(e, name, t, true, ends ? 'closing' : 'opening');
}

/** @internal The last start or end strictly before `t` (or at `t` when inclusive), within the search limit. */
export function searchBackward(e: HoursEngine, t: number, ends: boolean, inclusive: boolean, name: string): number {
  let T = tableAround(e, t, name);
  for (let pass = 0; pass < 2; pass++) {
    const a = ends ? T.ends : T.starts;
    const i = (inclusive ? countAtMost(a, t) : countBelow(a, t)) - 1;
    if (i >= 0 && a[i]! >= T.validFrom) {
      if (t - a[i]! > SEARCH_MS) break;
      return a[i]!;
    }
    if (T.validFrom === -Infinity) break;
    T = tableAcross(e, Math.max(t - SEARCH_MS, e.startEpochMs), t, name);
  }
  throw noSession(e, name, t, false, ends ? 'closing' : 'opening');
}

/**
 * @internal `t` moved by `ms` of business time: the first instant at which `ms` business ms have passed since
 * `t` (ms > 0), or the last instant from which `-ms` business ms pass until `t` (ms < 0).
 */
export function shiftOnEngine(e: HoursEngine, t: number, ms: number, name: string): number {
  if (ms === 0) return t;
  const forward = ms > 0;
  // Business time passes no faster than elapsed time: a shift past the hours' years fails at once.
  if (forward ? t + ms > e.endEpochMs : t + ms < e.startEpochMs) {
    throw new KalendsRangeError(
      `${name}: ${ms} ms of business time from ${showInstant(t)} ends after ${describeYears(e)} (business time passes no faster than elapsed time); set "years" in the definition to answer for later years`,
      { code: 'out-of-range', received: ms },
    );
  }
  // A shift into a stretch with no session at all fails like the searches: forward from a closed instant, the
  // next opening must come within the search limit; backward to one, the previous closing.
  const T0 = tableAround(e, t, name);
  if (forward && sessionIndexAt(T0, t) < 0) searchForward(e, t, false, false, name);
  if (!forward) {
    const i = countBelow(T0.starts, t) - 1;
    if (!(i >= 0 && T0.ends[i]! >= t)) searchBackward(e, t, true, true, name);
  }
  const y = localYear(e.norm.zone, t);
  let lo = y - 1;
  let hi = y + 1;
  for (;;) {
    const T = e.tableFor(lo, hi, name);
    const target = businessMsBefore(T, t) + ms;
    if (forward) {
      // The first session j whose end reaches the target: cum[j + 1] >= target.
      let a = 0;
      let b = T.n;
      while (a < b) {
        const mid = (a + b) >>> 1;
        if (T.cum[mid + 1]! < target) a = mid + 1;
        else b = mid;
      }
      if (a < T.n) {
        const r = T.starts[a]! + (target - T.cum[a]!);
        if (r <= T.validTo) return r;
      }
      if (T.validTo === Infinity) break;
      hi = T.lastYear + Math.max(2, T.lastYear - T.firstYear);
    } else {
      // The last session j whose start is at or before the target: cum[j] <= target.
      let a = 0;
      let b = T.n;
      while (a < b) {
        const mid = (a + b) >>> 1;
        if (T.cum[mid]! <= target) a = mid + 1;
        else b = mid;
      }
      const j = a - 1;
      if (j >= 0 && target >= 0) {
        const r = T.starts[j]! + (target - T.cum[j]!);
        if (r >= T.validFrom) return r;
      }
      if (T.validFrom === -Infinity) break;
      lo = T.firstYear - Math.max(2, T.lastYear - T.firstYear);
    }
  }
  throw new KalendsRangeError(
    `${name}: ${ms} ms of business time from ${showInstant(t)} run past ${describeYears(e)}; set "years" in the definition to answer for ${forward ? 'later' : 'earlier'} years`,
    { code: 'out-of-range', received: ms },
  );
}

/** @internal The value date of `t` under cut-off `c`. */
export function valueDayOnEngine(e: HoursEngine, t: number, c: number, name: string): number {
  const d = localDayNumber(e.norm.zone, t);
  const floor = Math.floor(t);
  let T = tableAround(e, t, name);
  for (let pass = 0; pass < 2; pass++) {
    const k = d - T.firstDay;
    if (floor <= T.cutoffs[c]![k]!) return d;
    const next = T.nextBusiness[k]!;
    if (next !== NO_DAY && next - d <= HOURS_SEARCH_LIMIT_DAYS) return next;
    if (next !== NO_DAY || T.validTo === Infinity) break;
    T = tableAcross(e, t, Math.min(t + SEARCH_MS, e.endEpochMs - 1), name);
  }
  throw noSession(e, name, t, true, 'business day');
}

// ---- public functions ----------------------------------------------------------------------------------------

/**
 * Whether the hours are open at an instant: some session holds it (start included, end excluded). A fraction of a
 * millisecond answers as its whole millisecond.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * isOpen(hours, Date.UTC(2025, 2, 31, 8)); // true (09:00 BST, Monday 2025-03-31)
 * isOpen(hours, Date.UTC(2025, 2, 31, 16)); // false (17:00 BST: the close is excluded)
 * ```
 */
export function isOpen(hours: BusinessHours, epochMs: number): boolean {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return sessionIndexAt(tableAround(e, t, 'epochMs'), t) >= 0;
}

/**
 * The session that holds an instant, or null when the hours are closed then. Touching sessions (an overnight
 * shift that runs into the next morning's) are one session.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { friday: [{ open: '22:00', close: '06:00' }] } });
 * sessionOfEpochMs(hours, Date.UTC(2025, 0, 4, 2))?.dayNumber; // 20091, Friday 2025-01-03: the night belongs to the day it opens
 * ```
 */
export function sessionOfEpochMs(hours: BusinessHours, epochMs: number): Session | null {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  const T = tableAround(e, t, 'epochMs');
  const i = sessionIndexAt(T, t);
  return i < 0 ? null : sessionAt(T, i);
}

function readInclusive(options: unknown): boolean {
  const o = readOptions('options', options, ['inclusive']);
  return requireBoolean('options.inclusive', optionOf(o, 'inclusive'), false);
}

/**
 * The next opening: the first session start strictly after an instant (`{ inclusive: true }`: at or after it).
 * Throws NoSessionError when none comes within {@link HOURS_SEARCH_LIMIT_DAYS} days.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'America/New_York', calendar: 'us-federal', week: { friday: [{ open: '09:00', close: '17:00' }], monday: [{ open: '09:00', close: '17:00' }] } });
 * nextOpeningEpochMs(hours, Date.UTC(2025, 6, 3, 22)); // Date.UTC(2025, 6, 7, 13): Friday 4 July is a holiday, so Monday 09:00 EDT
 * ```
 */
export function nextOpeningEpochMs(hours: BusinessHours, epochMs: number, options?: NearestOptions): number {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return searchForward(e, t, false, readInclusive(options), 'epochMs');
}

/**
 * The next closing: the first session end strictly after an instant (`{ inclusive: true }`: at or after it). When
 * the hours are open, the end of the current session.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * nextClosingEpochMs(hours, Date.UTC(2025, 2, 31, 10)); // Date.UTC(2025, 2, 31, 16) (17:00 BST)
 * ```
 */
export function nextClosingEpochMs(hours: BusinessHours, epochMs: number, options?: NearestOptions): number {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return searchForward(e, t, true, readInclusive(options), 'epochMs');
}

/**
 * The previous opening: the last session start strictly before an instant (`{ inclusive: true }`: at or before it).
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * previousOpeningEpochMs(hours, Date.UTC(2025, 2, 31, 10)); // Date.UTC(2025, 2, 31, 8) (09:00 BST)
 * ```
 */
export function previousOpeningEpochMs(hours: BusinessHours, epochMs: number, options?: NearestOptions): number {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return searchBackward(e, t, false, readInclusive(options), 'epochMs');
}

/**
 * The previous closing: the last session end strictly before an instant (`{ inclusive: true }`: at or before it).
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * previousClosingEpochMs(hours, Date.UTC(2025, 3, 1, 12)); // Date.UTC(2025, 2, 31, 16) (Monday 17:00 BST)
 * ```
 */
export function previousClosingEpochMs(hours: BusinessHours, epochMs: number, options?: NearestOptions): number {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return searchBackward(e, t, true, readInclusive(options), 'epochMs');
}

/**
 * An instant moved by a business duration: elapsed time counted only while the hours are open. `duration` is an
 * ISO 8601 duration of elapsed time (`'PT8H'`, `'-PT30M'`), a Duration from parseDuration, or milliseconds.
 * Calendar fields are refused (`'P1D'` is ambiguous here: a business day has no fixed length). Forward, the answer
 * is the first instant at which the duration has passed (a duration that ends exactly at a close answers the
 * close, not the next opening); backward, the last instant from which it passes until the given one. Zero
 * answers the instant itself.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'America/New_York', week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] } });
 * shiftBusinessTime(hours, Date.UTC(2025, 2, 10, 19), 'PT8H'); // Date.UTC(2025, 2, 11, 19): Monday 15:00 EDT + 8 h = Tuesday 15:00
 * ```
 */
export function shiftBusinessTime(hours: BusinessHours, epochMs: number, duration: Duration | string | number): number {
  const e = engineOfHours(hours);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return shiftOnEngine(e, t, businessDurationMs(duration), 'duration');
}

/**
 * The business time between two instants in ms: the elapsed time within sessions in [startEpochMs, endEpochMs).
 * Negative when end is before start, so that counts add up across ranges. Fractions of a millisecond are kept.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'America/New_York', week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] } });
 * countBusinessMs(hours, Date.UTC(2025, 2, 10, 19), Date.UTC(2025, 2, 11, 15)) / 3_600_000; // 4 (2 h Monday + 2 h Tuesday)
 * ```
 */
export function countBusinessMs(hours: BusinessHours, startEpochMs: number, endEpochMs: number): number {
  const e = engineOfHours(hours);
  const a = requireHoursInstant(e, 'startEpochMs', startEpochMs);
  const b = requireHoursInstant(e, 'endEpochMs', endEpochMs);
  const T = tableAcross(e, a, b, 'endEpochMs');
  return businessMsBefore(T, b) - businessMsBefore(T, a);
}

/**
 * The value date of an instruction received at an instant, under a named cut-off: the local day of the instant
 * when it is a business day (a day with a session) and the instant is at or before that day's cut-off (the cut-off
 * instant itself is in time); otherwise the next business day. Returns a day number.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', calendar: 'england-and-wales', week: { monday: [{ open: '08:00', close: '18:00' }], tuesday: [{ open: '08:00', close: '18:00' }] }, cutoffs: { payments: '17:00' } });
 * formatPlainDate(valueDayNumberOfEpochMs(hours, Date.UTC(2025, 2, 31, 16), 'payments')); // '2025-03-31' (17:00 BST: in time)
 * formatPlainDate(valueDayNumberOfEpochMs(hours, Date.UTC(2025, 2, 31, 16, 0, 0, 1), 'payments')); // '2025-04-01'
 * ```
 */
export function valueDayNumberOfEpochMs(hours: BusinessHours, epochMs: number, cutoff: string): number {
  const e = engineOfHours(hours);
  const c = cutoffIndex(e, cutoff);
  const t = requireHoursInstant(e, 'epochMs', epochMs);
  return valueDayOnEngine(e, t, c, 'epochMs');
}

/**
 * The instant of a named cut-off on a day, or null when the day is not a business day of the hours (it has no
 * session). A special day may move the cut-off.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'Europe/London', week: { monday: [{ open: '08:00', close: '18:00' }] }, cutoffs: { payments: '17:00' } });
 * cutoffEpochMsOfDayNumber(hours, dayNumberFromYmd(2025, 3, 31), 'payments'); // Date.UTC(2025, 2, 31, 16)
 * ```
 */
export function cutoffEpochMsOfDayNumber(hours: BusinessHours, dayNumber: number, cutoff: string): number | null {
  const e = engineOfHours(hours);
  const c = cutoffIndex(e, cutoff);
  const d = requireDayNumberArgument('dayNumber', dayNumber);
  const y = yearOfDayNumberUnchecked(d);
  if (y < e.norm.firstYear || y > e.norm.lastYear) {
    throw new KalendsRangeError(`dayNumber: ${formatPlainDate(d)} (day number ${d}) is outside ${describeYears(e)}`, { code: 'out-of-range', received: d });
  }
  const T = e.tableFor(y - 1, y + 1, 'dayNumber');
  const v = T.cutoffs[c]![d - T.firstDay]!;
  return Number.isNaN(v) ? null : v;
}

/**
 * The sessions that overlap [startEpochMs, endEpochMs), in order, each whole (not cut to the range). Throws
 * `limit-exceeded` before building anything when there are more than `options.limit` (default
 * {@link HOURS_LIST_LIMIT}); page by calling again from the last session's `endEpochMs`.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '12:00' }, { open: '13:00', close: '17:00' }] } });
 * listSessions(hours, Date.UTC(2025, 0, 6), Date.UTC(2025, 0, 7)).map((s) => s.lengthMs / 3_600_000); // [3, 4]
 * ```
 */
export function listSessions(hours: BusinessHours, startEpochMs: number, endEpochMs: number, options?: ListSessionsOptions): Session[] {
  const e = engineOfHours(hours);
  const a = requireHoursInstant(e, 'startEpochMs', startEpochMs);
  const b = requireHoursInstant(e, 'endEpochMs', endEpochMs);
  if (b < a) {
    throw new KalendsRangeError(`endEpochMs: expected an instant not before startEpochMs (${showInstant(a)}), got ${showInstant(b)}`, { code: 'out-of-range', received: b });
  }
  const o = readOptions('options', options, ['limit']);
  const limit = requireWhole('options.limit', optionOf(o, 'limit'), 1, MAX_HOURS_LIST_LIMIT, HOURS_LIST_LIMIT);
  const T = tableAcross(e, a, b, 'endEpochMs');
  const first = countAtMost(T.ends, a);
  const end = countBelow(T.starts, b);
  if (end - first > limit) {
    throw new KalendsRangeError(
      `options.limit: the range holds ${end - first} sessions, more than the limit ${limit}; narrow the range, or page: call again with startEpochMs set to the endEpochMs of the last session returned`,
      { code: 'limit-exceeded', received: limit },
    );
  }
  const out: Session[] = [];
  for (let i = first; i < end; i++) out.push(sessionAt(T, i));
  return out;
}

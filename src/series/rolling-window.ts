/**
 * Which rows a rolling window holds: window specs (a row count, a fixed length, a calendar span on the wall clock
 * of a zone, a number of business days), their validation, and their resolution against a series into a cursor
 * whose two pointers only move forward. The aggregates over those rows are in rolling-kernel.ts.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MS_PER_DAY } from '../bounds.js';
import {
  type BusinessCalendar,
  type CalendarInput,
  type Duration,
  type DurationFields,
  type Zone,
  type ZoneInput,
  calendarEdgeError,
  dayNumberFromEpochMsBulk,
  durationFromFields,
  epochMsFromWallMs,
  exactMsOfDuration,
  firstEpochMsOfDayNumber,
  formatDuration,
  isBusinessDay,
  negateDuration,
  previousBusinessDay,
  readDuration,
  resolveCalendar,
  resolveZone,
  shiftBusinessDays,
  shiftDayNumber,
  wallMsFromEpochMsBulk,
} from './deps.js';
import { optionOf, readOneOf, requireAmount, requirePositiveMs } from './options.js';

/**
 * A calendar span: an ISO 8601 duration string (`'P30D'`, `'P1M'`, `'P1W'`, `'PT12H'`), the instant layer's
 * {@link Duration}, or its fields (`{ days: 30 }`). It is subtracted on the wall clock by the instant layer's
 * `shiftWallMs` rule: years and months first (a day past the end of the shorter month is clamped to its last
 * day: 31 March minus one month is 28 or 29 February), then weeks and days, then hours and smaller parts.
 */
export type CalendarSpan = string | Duration | DurationFields;

/**
 * Which rows a window holds, for the row at time t:
 * - `{ rows: n }`: the last n rows up to and including this one (ties broken by row order); with
 *   `endInclusive: false`, the n rows before this one;
 * - `{ lengthMs: L }`: rows with times in (t - L, t] (bounds as set by `startInclusive` / `endInclusive`);
 * - `{ span, zone }`: rows in (s, t], where s is t's wall-clock time in `zone` minus the calendar span, turned
 *   back into an instant (a wall time in a DST gap or fold resolves as Temporal's `'compatible'`). Where that
 *   would move a window's start back before the previous row's start (a clamped month end, a repeated hour),
 *   the start is held, so windows only move forward and are never longer than the span;
 * - `{ businessDays: n, calendar, zone }`: rows from the first instant of the n-th business day back (the row's
 *   own local day counts when it is a business day) through t. Rows on non-business days in between count.
 *   `calendar` is a bundled calendar name (`'us-federal'`) or a calendar from `defineCalendar`.
 */
export type WindowSpec =
  | {
      /** The row and the rows before it: this many in all. */
      readonly rows: number;
    }
  | {
      /** The window's length in milliseconds, ending at the row's instant. */
      readonly lengthMs: number;
    }
  | {
      /** The calendar span back from the row's wall-clock time. */
      readonly span: CalendarSpan;
      /** The zone of the wall-clock time. */
      readonly zone: ZoneInput;
    }
  | {
      /** The number of business days the window covers. */
      readonly businessDays: number;
      /** The business calendar: a bundled name or a calendar from `defineCalendar`. */
      readonly calendar: BusinessCalendar | string;
      /** The zone of the local days. */
      readonly zone: ZoneInput;
    };

/** The window kinds and the keys each allows. */
const WINDOW_KINDS = {
  rows: ['rows'],
  lengthMs: ['lengthMs'],
  span: ['span', 'zone'],
  businessDays: ['businessDays', 'calendar', 'zone'],
} as const;

/** @internal Validates a calendar span and returns it as a positive {@link Duration}. */
export function readSpan(span: unknown, path: string): Duration {
  let d: Duration;
  try {
    if (typeof span === 'string') d = readDuration(span, path);
    else if (span !== null && typeof span === 'object') {
      d = 'sign' in span ? durationFromFields(Object.fromEntries(Object.entries(span).filter(([k]) => k !== 'sign'))) : durationFromFields(span as DurationFields);
    } else {
      throw new KalendsTypeError(`${path}: expected a span such as "P30D" or { days: 30 }, got ${describeValue(span)}`, {
        code: 'invalid-type',
        received: span,
        path,
      });
    }
  } catch (e) {
    if (e instanceof Error && !e.message.startsWith(path)) e.message = `${path}: ${e.message}`;
    throw e;
  }
  if (d.sign <= 0) {
    throw new KalendsRangeError(
      `${path}: expected a span longer than zero, got ${describeValue(typeof span === 'string' ? span : formatDuration(d))}; a window must have a positive length`,
      { code: 'out-of-range', received: span, path },
    );
  }
  return d;
}

/**
 * @internal A window resolved against a series: row i's window is rows [lo, hi), found by {@link WindowCursor}.
 * kind 0: the last `rows` rows; kind 1: instants in (t - lengthMs, t]; kind 2: instants in (starts[i], t]
 * (bounds as the inclusive flags say).
 */
export interface ResolvedWindow {
  readonly kind: 0 | 1 | 2;
  readonly rows: number;
  readonly lengthMs: number;
  readonly starts: Float64Array;
  readonly startInclusive: boolean;
  readonly endInclusive: boolean;
}

/** @internal Two pointers over a sorted series; `move(i)` sets `lo` and `hi` for row i (both never decrease). */
export class WindowCursor {
  lo = 0;
  hi = 0;
  private readonly t: Float64Array;
  private readonly w: ResolvedWindow;
  constructor(t: Float64Array, w: ResolvedWindow) {
    this.t = t;
    this.w = w;
  }
  move(i: number): void {
    const w = this.w;
    if (w.kind === 0) {
      // The last `rows` rows through row i, or (end open) the `rows` rows before it.
      const h = w.endInclusive ? i + 1 : i;
      const l = h - w.rows;
      this.lo = l > 0 ? l : 0;
      this.hi = h;
      return;
    }
    const t = this.t;
    const n = t.length;
    const e = t[i]!;
    const s = w.kind === 1 ? e - w.lengthMs : w.starts[i]!;
    let l = this.lo;
    let h = this.hi;
    if (w.startInclusive) while (l < n && t[l]! < s) l++;
    else while (l < n && t[l]! <= s) l++;
    if (w.endInclusive) while (h < n && t[h]! <= e) h++;
    else while (h < n && t[h]! < e) h++;
    this.lo = l;
    this.hi = h < l ? l : h;
  }
}

const NO_STARTS = /* @__PURE__ */ new Float64Array(0);

/**
 * @internal Validates a window spec against the edge options (`startGiven`: the caller's `startInclusive`, or
 * undefined) and resolves the window against the instants `t`. An edge option that a window
 * kind has no use for is refused, never ignored: a row-count window has no start instant, and a business-day
 * window always starts at the first instant of a day, which belongs to it.
 */
export function resolveWindow(t: Float64Array, spec: unknown, startGiven: boolean | undefined, endInclusive: boolean): ResolvedWindow {
  const { kind, fields } = readOneOf('options.window', spec, WINDOW_KINDS);
  const startInclusive = startGiven ?? false;
  const base = { rows: 0, lengthMs: 0, starts: NO_STARTS, startInclusive, endInclusive };
  if (kind === 'rows') {
    if (startGiven !== undefined) {
      throw new KalendsRangeError(
        `options.startInclusive: a window of { rows } has no start instant, got ${describeValue(startGiven)}; leave it out, or use a time window ({ lengthMs } or { span, zone })`,
        { code: 'unsupported', received: startGiven, path: 'options.startInclusive' },
      );
    }
    return { ...base, kind: 0, rows: requireAmount('options.window.rows', optionOf(fields, 'rows'), 1) };
  }
  if (kind === 'lengthMs') return { ...base, kind: 1, lengthMs: requirePositiveMs('options.window.lengthMs', optionOf(fields, 'lengthMs')) };
  if (kind === 'span') {
    const span = readSpan(optionOf(fields, 'span'), 'options.window.span');
    const zone = resolveZone(optionOf(fields, 'zone') as ZoneInput, 'options.window.zone');
    // shiftWallMs's rule (years and months, then weeks and days, then exact parts), computed once per local day:
    // the calendar parts move the date, the exact parts move the time.
    const calendarBack =
      span.years || span.months || span.weeks || span.days
        ? negateDuration(durationFromFields({ years: span.years, months: span.months, weeks: span.weeks, days: span.days }))
        : undefined;
    const exactBack = exactMsOfDuration(span);
    const starts = dayNumberWallStarts(t, zone, (day) => (calendarBack ? shiftDayNumber(day, calendarBack) : day), exactBack);
    return { ...base, kind: 2, starts };
  }
  const k = requireAmount('options.window.businessDays', optionOf(fields, 'businessDays'), 1);
  const cal = resolveCalendar(optionOf(fields, 'calendar'), 'options.window.calendar');
  const zone = resolveZone(optionOf(fields, 'zone') as ZoneInput, 'options.window.zone');
  if (startGiven === false) {
    throw new KalendsRangeError(
      'options.startInclusive: a business-day window starts at the first instant of a day, which always belongs to it, got false; leave it out',
      { code: 'unsupported', received: startGiven, path: 'options.startInclusive' },
    );
  }
  let starts: Float64Array;
  try {
    starts = businessDayStarts(t, zone, cal, k);
  } catch (e) {
    throw calendarEdgeError(e, 'series.epochMs', cal);
  }
  // The start is the first instant of a day: it belongs to the window.
  return { ...base, kind: 2, starts, startInclusive: true };
}

/** Window starts for `k` business days: the first instant of the k-th business day back from each row's day. */
function businessDayStarts(t: Float64Array, zone: Zone, cal: CalendarInput, k: number): Float64Array {
  const n = t.length;
  const days = dayNumberFromEpochMsBulk(zone, t);
  const starts = new Float64Array(n);
  let lastDay = Number.NaN;
  let lastStart = 0;
  for (let i = 0; i < n; i++) {
    const d = days[i]!;
    if (d !== lastDay) {
      const anchor = isBusinessDay(cal, d) ? d : previousBusinessDay(cal, d);
      lastStart = firstEpochMsOfDayNumber(zone, k === 1 ? anchor : shiftBusinessDays(cal, anchor, -(k - 1)));
      lastDay = d;
    }
    starts[i] = lastStart;
  }
  return starts;
}

/**
 * Window starts for a calendar span: each row's wall-clock time with its date moved by `shiftDay` and its time
 * by `exactMs` (both backwards), back to an instant ('compatible'), held so that starts never decrease.
 */
function dayNumberWallStarts(t: Float64Array, zone: Zone, shiftDay: (day: number) => number, exactMs: number): Float64Array {
  const n = t.length;
  const walls = wallMsFromEpochMsBulk(zone, t);
  let lastDay = Number.NaN;
  let shifted = 0;
  let prev = -Infinity;
  // Reuse the wall-time array for the starts: each entry is read before it is written.
  const starts = walls;
  for (let i = 0; i < n; i++) {
    const w = walls[i]!;
    const day = Math.floor(w / MS_PER_DAY);
    if (day !== lastDay) {
      shifted = shiftDay(day);
      lastDay = day;
    }
    const s = epochMsFromWallMs(zone, shifted * MS_PER_DAY + (w - day * MS_PER_DAY) - exactMs, 'compatible');
    prev = s > prev ? s : prev;
    starts[i] = prev;
  }
  return starts;
}

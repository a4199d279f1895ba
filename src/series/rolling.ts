/**
 * Rolling windows: for every row, an aggregate over the rows in a window that ends at that row. Windows are
 * given by a row count, a fixed length in milliseconds, a calendar span on the wall clock of a zone, or a
 * number of business days. Every kind of window moves forward monotonically, so each is computed in O(n):
 * two pointers, compensated running sums, a two-stack queue of mergeable variance states, and monotonic deques
 * for min and max.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MS_PER_DAY } from '../bounds.js';
import { type Zone, dayNumberFromEpochMsBulk, firstEpochMsOfDayNumber, epochMsFromWallMs, wallMsFromEpochMsBulk } from '../zone/index.js';
import { type BusinessCalendar, isBusinessDay, previousBusinessDay, shiftBusinessDays } from '../business/index.js';
import {
  type Duration,
  type DurationFields,
  durationFromFields,
  formatDuration,
  exactMsOfDuration,
  negateDuration,
  parseDuration,
  shiftDayNumber,
} from '../instant/index.js';
import { type AggregationName, compileAggregations } from './aggregate.js';
import { type ZoneInput, resolveZone } from './deps.js';
import { type Series, makeSeries, requireSeries } from './series.js';
import { fixedLengthSums } from './rolling-fixed.js';

/**
 * A calendar span: an ISO 8601 duration string (`'P30D'`, `'P1M'`, `'P1W'`, `'PT12H'`), the instant layer's
 * {@link Duration}, or its fields (`{ days: 30 }`). It is subtracted on the wall clock by the instant layer's
 * `shiftWallMs` rule: years and months first (a day past the end of the shorter month is clamped to its last
 * day: 31 March minus one month is 28 or 29 February), then weeks and days, then hours and smaller parts.
 */
export type CalendarSpan = string | Duration | DurationFields;

/**
 * Which rows a window holds, for the row at time t:
 * - `{ rows: n }`: the last n rows up to and including this one (ties broken by row order);
 * - `{ lengthMs: L }`: rows with times in (t - L, t] (bounds as set by `startInclusive` / `endInclusive`);
 * - `{ span, zone }`: rows in (s, t], where s is t's wall-clock time in `zone` minus the calendar span, turned
 *   back into an instant (a wall time in a DST gap or fold resolves as Temporal's `'compatible'`). Where that
 *   would move a window's start back before the previous row's start (a clamped month end, a repeated hour),
 *   the start is held, so windows only move forward and are never longer than the span;
 * - `{ businessDays: n, calendar, zone }`: rows from the first instant of the n-th business day back (the row's
 *   own local day counts when it is a business day) through t. Rows on non-business days in between count.
 */
export type WindowSpec =
  | { readonly rows: number }
  | { readonly lengthMs: number }
  | { readonly span: CalendarSpan | string; readonly zone: ZoneInput }
  | { readonly businessDays: number; readonly calendar: BusinessCalendar; readonly zone: ZoneInput };

/** The aggregations a rolling window offers. */
export type RollingAggregationName = Extract<AggregationName, 'count' | 'sum' | 'mean' | 'min' | 'max' | 'variance' | 'stddev'>;

/** A rolling aggregation by name or with settings (`as`, `column`, `estimator`). */
export type RollingAggregation =
  | RollingAggregationName
  | { readonly kind: RollingAggregationName; readonly column?: string; readonly as?: string; readonly estimator?: 'sample' | 'population' };

const ROLLING_NAMES: readonly AggregationName[] = ['count', 'sum', 'mean', 'min', 'max', 'variance', 'stddev'];

/** Options of {@link rollSeries}. */
export interface RollOptions {
  readonly window: WindowSpec;
  readonly aggregations: readonly RollingAggregation[];
  /** Default input column (default: the first). */
  readonly column?: string;
  /** Fewest non-missing values a window needs for a result; fewer gives NaN (count still reports). Default 1. */
  readonly minObservations?: number;
  /** Whether the window's start instant belongs to it (time windows; default false: the start is open). */
  readonly startInclusive?: boolean;
  /** Whether the window's end instant, the row's own time, belongs to it (time windows; default true). */
  readonly endInclusive?: boolean;
}

function positiveInteger(v: unknown, path: string): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < 1) {
    const Err = typeof v === 'number' ? KalendsRangeError : KalendsTypeError;
    throw new Err(`${path}: expected a positive integer (a window must hold at least one unit), got ${describeValue(v)}`, {
      code: typeof v === 'number' ? 'out-of-range' : 'invalid-type',
      received: v,
      path,
    });
  }
  return v;
}

/** @internal Validates a calendar span and returns it as a positive {@link Duration}. */
export function readSpan(span: unknown, path: string): Duration {
  let d: Duration;
  try {
    if (typeof span === 'string') d = parseDuration(span);
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
      const l = i - w.rows + 1;
      this.lo = l > 0 ? l : 0;
      this.hi = i + 1;
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

const NO_STARTS = new Float64Array(0);

/** @internal Validates a window spec and resolves it against the instants `t`. */
export function resolveWindow(t: Float64Array, spec: WindowSpec, startInclusive: boolean, endInclusive: boolean): ResolvedWindow {
  const n = t.length;
  if (spec === null || typeof spec !== 'object') {
    throw new KalendsTypeError(`options.window: expected { rows }, { lengthMs }, { span, zone } or { businessDays, calendar, zone }, got ${describeValue(spec)}`, {
      code: 'invalid-type',
      received: spec,
    });
  }
  const base = { rows: 0, lengthMs: 0, starts: NO_STARTS, startInclusive, endInclusive };
  if ('rows' in spec) return { ...base, kind: 0, rows: positiveInteger(spec.rows, 'options.window.rows') };
  if ('lengthMs' in spec) {
    const L = spec.lengthMs;
    if (typeof L !== 'number' || !Number.isFinite(L) || L <= 0) {
      const Err = typeof L === 'number' ? KalendsRangeError : KalendsTypeError;
      throw new Err(`options.window.lengthMs: expected a positive number of milliseconds, got ${describeValue(L)}`, {
        code: typeof L === 'number' ? 'out-of-range' : 'invalid-type',
        received: L,
        path: 'options.window.lengthMs',
      });
    }
    return { ...base, kind: 1, lengthMs: L };
  }
  if ('span' in spec) {
    const span = readSpan(spec.span, 'options.window.span');
    const zone = resolveZone(spec.zone, 'options.window.zone');
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
  if ('businessDays' in spec) {
    const k = positiveInteger(spec.businessDays, 'options.window.businessDays');
    const zone = resolveZone(spec.zone, 'options.window.zone');
    const cal = spec.calendar;
    if (cal === null || typeof cal !== 'object') {
      throw new KalendsTypeError(`options.window.calendar: expected a business calendar (defineCalendar(...)), got ${describeValue(cal)}`, {
        code: 'invalid-type',
        received: cal,
      });
    }
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
    // The start is the first instant of a day: it belongs to the window.
    return { ...base, kind: 2, starts, startInclusive: true };
  }
  throw new KalendsTypeError(
    `options.window: expected one of { rows }, { lengthMs }, { span, zone }, { businessDays, calendar, zone }, got ${describeValue(spec)} with keys ${Object.keys(spec).join(', ') || '(none)'}`,
    { code: 'invalid-type', received: spec },
  );
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

/**
 * @internal Rolling aggregate `kind` of `v` over the windows of `win`, written into `out`. O(n); allocates
 * nothing except the variance stacks.
 */
export function rollKernel(
  t: Float64Array,
  v: Float64Array,
  win: ResolvedWindow,
  kind: RollingAggregationName,
  minObs: number,
  ddof: number,
  out: Float64Array,
): Float64Array {
  const n = v.length;
  const cur = new WindowCursor(t, win);
  if ((kind === 'count' || kind === 'sum' || kind === 'mean') && win.kind === 1 && !win.startInclusive && win.endInclusive) {
    if (fixedLengthSums(t, v, win.lengthMs, kind === 'count' ? 0 : kind === 'sum' ? 1 : 2, minObs, out)) return out;
  }
  if (kind === 'count' || kind === 'sum' || kind === 'mean') {
    // Finite values go into a compensated running sum; infinite ones are counted apart (a running sum could not
    // take an infinity back out: Infinity - Infinity is NaN), and decide the result while any is in the window.
    let s = 0;
    let c = 0;
    let cnt = 0;
    let posInf = 0;
    let negInf = 0;
    let L = 0;
    let H = 0;
    const what = kind === 'count' ? 0 : kind === 'sum' ? 1 : 2;
    for (let i = 0; i < n; i++) {
      cur.move(i);
      const hiI = cur.hi;
      while (H < hiI) {
        const x = v[H++]!;
        if (x === x) {
          cnt++;
          if (x - x !== 0) {
            if (x > 0) posInf++;
            else negInf++;
            continue;
          }
          const y = s + x;
          if (Math.abs(s) >= Math.abs(x)) c += s - y + x;
          else c += x - y + s;
          s = y;
        }
      }
      const loI = cur.lo;
      while (L < loI) {
        const x = -v[L++]!;
        if (x === x) {
          if (x - x !== 0) {
            if (x < 0) posInf--;
            else negInf--;
          } else {
            const y = s + x;
            if (Math.abs(s) >= Math.abs(x)) c += s - y + x;
            else c += x - y + s;
            s = y;
          }
          if (--cnt === 0) s = c = 0;
        }
      }
      let total = s + c;
      if (posInf > 0) total = negInf > 0 ? Number.NaN : Number.POSITIVE_INFINITY;
      else if (negInf > 0) total = Number.NEGATIVE_INFINITY;
      out[i] = what === 0 ? cnt : cnt >= minObs ? (what === 2 ? total / cnt : total) : Number.NaN;
    }
    return out;
  }
  if (kind === 'variance' || kind === 'stddev') {
    // A queue made of two stacks, each element carrying the (count, mean, M2) of the values from it to the
    // stack's bottom, merged by Chan, Golub & LeVeque's pairwise formula. Values are only ever merged, never
    // subtracted, so a large value that has left the window leaves no cancellation error behind.
    // Front stack: rows [L, mid), with suffix aggregates fN/fMean/fM2 at each row; back stack: rows [mid, H),
    // kept as one running aggregate.
    const fN = new Float64Array(n);
    const fMean = new Float64Array(n);
    const fM2 = new Float64Array(n);
    let bN = 0;
    let bMean = 0;
    let bM2 = 0;
    let L = 0;
    let mid = 0;
    let H = 0;
    const variance = kind === 'variance';
    for (let i = 0; i < n; i++) {
      cur.move(i);
      const hiI = cur.hi;
      while (H < hiI) {
        const x = v[H++]!;
        if (x === x) {
          bN++;
          const d = x - bMean;
          bMean += d / bN;
          bM2 += d * (x - bMean);
        }
      }
      const loI = cur.lo;
      if (loI >= mid && loI > L) {
        // The front is used up: move the back stack over, computing suffix aggregates from the newest row.
        let cN = 0;
        let cMean = 0;
        let cM2 = 0;
        for (let j = H - 1; j >= mid; j--) {
          const x = v[j]!;
          if (x === x) {
            cN++;
            const d = x - cMean;
            cMean += d / cN;
            cM2 += d * (x - cMean);
          }
          fN[j] = cN;
          fMean[j] = cMean;
          fM2[j] = cM2;
        }
        mid = H;
        bN = 0;
        bMean = 0;
        bM2 = 0;
      }
      if (loI > L) L = loI;
      let cnt = bN;
      let m2 = bM2;
      if (L < mid) {
        const aN = fN[L]!;
        if (aN > 0) {
          if (bN === 0) {
            cnt = aN;
            m2 = fM2[L]!;
          } else {
            cnt = aN + bN;
            const d = bMean - fMean[L]!;
            m2 = fM2[L]! + bM2 + (d * d * aN * bN) / cnt;
          }
        }
      }
      if (cnt >= minObs && cnt > ddof) {
        const value = m2 > 0 ? m2 / (cnt - ddof) : 0;
        out[i] = variance ? value : Math.sqrt(value);
      } else out[i] = Number.NaN;
    }
    return out;
  }
  // min / max: a monotonic deque of row indices whose values are strictly better than every later one.
  const dq = new Int32Array(n);
  let head = 0;
  let tail = 0;
  let H = 0;
  let L = 0;
  let cnt = 0;
  const isMin = kind === 'min';
  for (let i = 0; i < n; i++) {
    cur.move(i);
    const hiI = cur.hi;
    while (H < hiI) {
      const x = v[H]!;
      if (x === x) {
        if (isMin) while (tail > head && v[dq[tail - 1]!]! >= x) tail--;
        else while (tail > head && v[dq[tail - 1]!]! <= x) tail--;
        dq[tail++] = H;
        cnt++;
      }
      H++;
    }
    const loI = cur.lo;
    while (L < loI) if (v[L] === v[L++]) cnt--;
    while (head < tail && dq[head]! < loI) head++;
    out[i] = head < tail && cnt >= minObs ? v[dq[head]!]! : Number.NaN;
  }
  return out;
}

function readMinObservations(v: unknown): number {
  const minObs = v ?? 1;
  if (typeof minObs !== 'number' || !Number.isInteger(minObs) || minObs < 0) {
    throw new KalendsRangeError(`options.minObservations: expected a non-negative integer, got ${describeValue(minObs)}`, {
      code: 'out-of-range',
      received: minObs,
    });
  }
  return minObs;
}

/**
 * For every row, aggregates over the rows of its window (see {@link WindowSpec}), computed in O(n). Missing
 * values are skipped; a window with fewer than `minObservations` non-missing values gives NaN (`count` always
 * reports). Sums are compensated (Neumaier); variance merges (count, mean, sum of squared deviations) states
 * in a two-stack queue (Chan, Golub & LeVeque's pairwise update), so nothing is ever subtracted; min and max use
 * monotonic deques. The result has the same instants as the input and one
 * column per aggregation.
 *
 * @example
 * ```ts
 * const smooth = rollSeries(sales, { window: { span: { days: 30 }, zone: 'America/Chicago' }, aggregations: ['mean'] });
 * const last5 = rollSeries(sales, { window: { rows: 5 }, aggregations: ['max', 'min'] });
 * ```
 */
export function rollSeries(series: Series, options: RollOptions): Series {
  requireSeries(series, 'series');
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected { window, aggregations }, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const aggs = compileAggregations(series, options.aggregations as never, 'options.aggregations', ROLLING_NAMES, options.column);
  const minObs = readMinObservations(options.minObservations);
  const win = resolveWindow(series.epochMs, options.window, options.startInclusive ?? false, options.endInclusive ?? true);
  const cols = aggs.map((a) =>
    rollKernel(series.epochMs, a.values, win, a.kind as RollingAggregationName, minObs, a.ddof, new Float64Array(series.length)),
  );
  return makeSeries(
    series.epochMs,
    aggs.map((a) => a.name),
    cols,
  );
}

/** Options of {@link rollBulk}: one aggregation, the rest as in {@link RollOptions}. */
export interface RollBulkOptions {
  readonly window: WindowSpec;
  readonly aggregation: RollingAggregation;
  readonly minObservations?: number;
  readonly startInclusive?: boolean;
  readonly endInclusive?: boolean;
}

/**
 * Throws unless `epochMs` is ascending with no NaN: a typed error naming the first row at fault. A function of its
 * own so that V8 optimizes this loop as a whole; inside `rollBulk` it was compiled on the fly in the middle of
 * every call, and the code after it then ran unoptimized.
 */
function requireAscending(epochMs: Float64Array): void {
  const n = epochMs.length;
  let previous = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = epochMs[i]!;
    if (x >= previous) {
      previous = x;
      continue;
    }
    throw x !== x
      ? new KalendsRangeError(`epochMs[${i}]: expected an instant, got NaN`, { code: 'out-of-range', received: x })
      : new KalendsRangeError(`epochMs: expected ascending instants, but [${i}] (${x}) comes before [${i - 1}] (${epochMs[i - 1]})`, {
          code: 'unsorted',
          received: x,
          path: `epochMs[${i}]`,
        });
  }
}

/**
 * {@link rollSeries} for one aggregation over bare typed arrays, writing into `out` when given (so that a caller
 * rolling many columns or many batches allocates nothing per call). `epochMs` must be ascending.
 *
 * @example
 * ```ts
 * const out = new Float64Array(times.length);
 * rollBulk(times, values, { window: { lengthMs: 30 * 86_400_000 }, aggregation: 'mean' }, out);
 * ```
 */
export function rollBulk(epochMs: Float64Array, values: Float64Array, options: RollBulkOptions, out?: Float64Array): Float64Array {
  if (!(epochMs instanceof Float64Array) || !(values instanceof Float64Array)) {
    throw new KalendsTypeError(`epochMs, values: expected two Float64Arrays, got ${describeValue(epochMs)} and ${describeValue(values)}`, {
      code: 'invalid-type',
      received: epochMs,
    });
  }
  const n = epochMs.length;
  if (values.length !== n) {
    throw new KalendsRangeError(`values: expected ${n} values (one per instant), got ${values.length}`, { code: 'length-mismatch', received: values.length });
  }
  if (out !== undefined && (!(out instanceof Float64Array) || out.length < n)) {
    throw new KalendsRangeError(`out: expected a Float64Array of at least ${n} elements, got ${describeValue(out)}`, {
      code: 'length-mismatch',
      received: out,
    });
  }
  requireAscending(epochMs);
  const series = makeSeries(epochMs, ['value'], [values]);
  const [agg] = compileAggregations(series, [options?.aggregation as never], 'options.aggregation', ROLLING_NAMES);
  const win = resolveWindow(epochMs, options.window, options.startInclusive ?? false, options.endInclusive ?? true);
  return rollKernel(epochMs, values, win, agg!.kind as RollingAggregationName, readMinObservations(options.minObservations), agg!.ddof, out ?? new Float64Array(n));
}

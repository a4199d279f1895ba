/**
 * Filling a series onto a regular grid of instants: the starts of the periods of a unit in a zone, the
 * occurrences of a recurrence rule, or any ascending list of instants.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type PeriodRange } from './bucket.js';
import { type UnitInput, type ZoneInput, periodStartMs, requireUnit, resolveZone } from './deps.js';
import { type RecurrenceGrid, gridFromRule } from './grid.js';
import { type Series, makeSeries, requireSeries } from './series.js';

/**
 * The grid to fill onto:
 * - `{ unit, zone, range }`: the first instant of each period of `range` (end-exclusive) in `zone`;
 * - `{ rule, zone, start, end }`: the occurrences of a recurrence rule (see {@link RecurrenceGrid});
 * - `{ epochMs }`: any ascending instants.
 */
export type FillGrid =
  | { readonly unit: UnitInput; readonly zone: ZoneInput; readonly range: PeriodRange }
  | RecurrenceGrid
  | { readonly epochMs: ArrayLike<number> };

/**
 * How a grid instant g gets its value, from the non-missing values around it:
 * - `'previous'`: the latest value at or before g (among equal instants, the last row);
 * - `'next'`: the earliest value at or after g (among equal instants, the first row);
 * - `'linear'`: the value at g if there is one (the last row at g), else linear interpolation in time between
 *   the latest value before g and the earliest after it; NaN outside the data (no extrapolation).
 */
export type FillMethod = 'previous' | 'next' | 'linear';

/** Options of {@link fillSeries}. */
export interface FillOptions {
  readonly grid: FillGrid;
  /** Default `'previous'`. */
  readonly method?: FillMethod;
  /**
   * Largest gap, in ms, that a value may cross: `'previous'` leaves g missing when g - t(prev) > maxGapMs,
   * `'next'` when t(next) - g > maxGapMs, `'linear'` when t(next) - t(prev) > maxGapMs (the whole gap must be
   * short). Default: no limit.
   */
  readonly maxGapMs?: number;
  /** Columns to fill (default: all). */
  readonly columns?: readonly string[];
}

/** @internal The grid instants of a grid spec, ascending. */
export function gridInstants(grid: FillGrid): Float64Array {
  if (grid === null || typeof grid !== 'object') {
    throw new KalendsTypeError(`options.grid: expected { unit, zone, range }, { rule, zone, start, end } or { epochMs }, got ${describeValue(grid)}`, {
      code: 'invalid-type',
      received: grid,
    });
  }
  if ('epochMs' in grid) {
    const a = grid.epochMs;
    if (!Array.isArray(a) && !ArrayBuffer.isView(a)) {
      throw new KalendsTypeError(`options.grid.epochMs: expected an array of instants, got ${describeValue(a)}`, {
        code: 'invalid-type',
        received: a,
      });
    }
    const out = Float64Array.from(a as ArrayLike<number>);
    for (let i = 0; i < out.length; i++) {
      if (out[i] !== out[i]) {
        throw new KalendsRangeError(`options.grid.epochMs[${i}]: expected an instant, got NaN`, { code: 'out-of-range', received: a[i] });
      }
      if (i > 0 && out[i]! < out[i - 1]!) {
        throw new KalendsRangeError(
          `options.grid.epochMs: expected ascending instants, but [${i}] (${out[i]}) comes before [${i - 1}] (${out[i - 1]})`,
          { code: 'unsorted', received: out[i], path: `grid.epochMs[${i}]` },
        );
      }
    }
    return out;
  }
  if ('rule' in grid) return gridFromRule(grid);
  if ('unit' in grid) {
    const unit = requireUnit(grid.unit, 'options.grid.unit');
    const zone = resolveZone(grid.zone, 'options.grid.zone');
    const r = grid.range;
    if (r === null || typeof r !== 'object') {
      throw new KalendsTypeError(`options.grid.range: expected { start, end } (ordinals or labels), got ${describeValue(r)}`, {
        code: 'invalid-type',
        received: r,
      });
    }
    const start = typeof r.start === 'string' ? unit.parseOrdinal(r.start) : r.start;
    const end = typeof r.end === 'string' ? unit.parseOrdinal(r.end) : r.end;
    if (!Number.isInteger(start) || !Number.isInteger(end) || end < start || end - start > 50_000_000) {
      throw new KalendsRangeError(
        `options.grid.range: expected start <= end, at most 50,000,000 periods apart, got ${describeValue(r.start)} to ${describeValue(r.end)}`,
        { code: end - start > 50_000_000 ? 'limit-exceeded' : 'out-of-range', received: r },
      );
    }
    const out = new Float64Array(end - start);
    for (let o = start; o < end; o++) out[o - start] = periodStartMs(unit, zone, o);
    return out;
  }
  throw new KalendsTypeError(`options.grid: expected { unit, zone, range }, { rule, zone, start, end } or { epochMs }, got keys ${Object.keys(grid).join(', ')}`, {
    code: 'invalid-type',
    received: grid,
  });
}

/**
 * @internal Fills column `v` (times `t`) onto `grid`. Two merged passes (one forward for the previous value,
 * one backward for the next), O(n + m).
 */
export function fillColumn(t: Float64Array, v: Float64Array, grid: Float64Array, method: FillMethod, maxGap: number): Float64Array {
  const n = t.length;
  const m = grid.length;
  const prevIdx = new Int32Array(m).fill(-1);
  const nextIdx = new Int32Array(m).fill(-1);
  if (method !== 'next') {
    let j = 0;
    let last = -1;
    for (let i = 0; i < m; i++) {
      const g = grid[i]!;
      while (j < n && t[j]! <= g) {
        if (v[j] === v[j]) last = j;
        j++;
      }
      prevIdx[i] = last;
    }
  }
  if (method !== 'previous') {
    let j = n - 1;
    let first = -1;
    for (let i = m - 1; i >= 0; i--) {
      const g = grid[i]!;
      while (j >= 0 && t[j]! >= g) {
        if (v[j] === v[j]) first = j;
        j--;
      }
      nextIdx[i] = first;
    }
  }
  const out = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const g = grid[i]!;
    const p = prevIdx[i]!;
    const q = nextIdx[i]!;
    let r = Number.NaN;
    if (method === 'previous') {
      if (p >= 0 && g - t[p]! <= maxGap) r = v[p]!;
    } else if (method === 'next') {
      if (q >= 0 && t[q]! - g <= maxGap) r = v[q]!;
    } else if (p >= 0 && t[p] === g) r = v[p]!;
    else if (p >= 0 && q >= 0 && t[q]! - t[p]! <= maxGap) {
      const tp = t[p]!;
      r = v[p]! + ((v[q]! - v[p]!) * (g - tp)) / (t[q]! - tp);
    }
    out[i] = r;
  }
  return out;
}

/**
 * The series on a grid of instants, each column filled by `method` from its non-missing values, within
 * `maxGapMs` (see {@link FillMethod} and {@link FillOptions}).
 *
 * @example
 * ```ts
 * // Daily readings onto every local hour of two days, interpolated, never across a gap over 6 hours.
 * fillSeries(readings, { grid: { unit: hourUnit, zone: 'Europe/Dublin', range }, method: 'linear', maxGapMs: 6 * 3_600_000 });
 * // Month-end balances onto the first day of each month, carried forward.
 * fillSeries(balances, { grid: { unit: 'month', zone: 'America/Chicago', range: { start: '2025-01', end: '2026-01' } } });
 * ```
 */
export function fillSeries(series: Series, options: FillOptions): Series {
  requireSeries(series, 'series');
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected { grid, method?, maxGapMs? }, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const method = options.method ?? 'previous';
  if (method !== 'previous' && method !== 'next' && method !== 'linear') {
    throw new KalendsRangeError(`options.method: expected "previous", "next" or "linear", got ${describeValue(method)}`, {
      code: 'out-of-range',
      received: method,
    });
  }
  const maxGap = options.maxGapMs ?? Infinity;
  if (typeof maxGap !== 'number' || Number.isNaN(maxGap) || maxGap < 0) {
    throw new KalendsRangeError(`options.maxGapMs: expected a non-negative number of milliseconds, got ${describeValue(maxGap)}`, {
      code: typeof maxGap === 'number' ? 'out-of-range' : 'invalid-type',
      received: maxGap,
    });
  }
  const names = options.columns ?? series.columnNames;
  for (const c of names) {
    if (series.columns[c] === undefined) {
      throw new KalendsRangeError(`options.columns: no column ${describeValue(c)}; valid columns are ${series.columnNames.join(', ')}`, {
        code: 'out-of-range',
        received: c,
      });
    }
  }
  const grid = gridInstants(options.grid);
  return makeSeries(
    grid,
    names,
    names.map((c) => fillColumn(series.epochMs, series.columns[c]!, grid, method, maxGap)),
  );
}

/**
 * Filling a series onto a regular grid of instants: the starts of the periods of a unit in a zone, the
 * occurrences of a recurrence rule, or any ascending list of instants.
 *
 * @module
 */
import { KalendsRangeError } from '../errors.js';
import type { MAX_BUCKET_PERIODS, MAX_SERIES_ROWS } from '../bounds.js';
import { type PeriodRange, readBucketRange } from './bucket.js';
import { type UnitInput, type ZoneInput, periodEdgeError, periodStartMs, requireUnit, resolveZone } from './deps.js';
import { type RecurrenceGrid, gridFromRule } from './grid.js';
import { optionOf, readMaxRows, readOneOf, readOptions, requireEnum, requireToleranceMs } from './options.js';
import { type Series, instantsFromArray, makeSeries, readColumnList, requireSeries } from './series.js';

/**
 * The grid to fill onto:
 * - `{ unit, zone, range }`: the first instant of each period of `range` (end-exclusive) in `zone`;
 * - `{ rule, zone, start, end }`: the occurrences of a recurrence rule (see {@link RecurrenceGrid});
 * - `{ epochMs }`: any ascending instants.
 */
export type FillGrid =
  | {
      /** The period unit. */
      readonly unit: UnitInput;
      /** The zone of the periods' first instants. */
      readonly zone: ZoneInput;
      /** The periods of the grid, end-exclusive. */
      readonly range: PeriodRange;
    }
  | RecurrenceGrid
  | {
      /** Ascending instants (epoch milliseconds). */
      readonly epochMs: ArrayLike<number>;
    };

/**
 * How a grid instant g gets its value, from the non-missing values around it:
 * - `'previous'`: the latest value at or before g (among equal instants, the last row);
 * - `'next'`: the earliest value at or after g (among equal instants, the first row);
 * - `'linear'`: the value at g if there is one (the last row at g), else linear interpolation in time between
 *   the latest value before g and the earliest after it; NaN outside the data (no extrapolation).
 */
export type FillMethod = 'previous' | 'next' | 'linear';

const FILL_METHODS: readonly FillMethod[] = ['previous', 'next', 'linear'];

/** Options of {@link fillSeries}. */
export interface FillOptions {
  /** The instants to fill onto. */
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
  /**
   * The most grid instants a grid of periods or of a rule's occurrences may give: default
   * {@link MAX_SERIES_ROWS} (one million), at most {@link MAX_BUCKET_PERIODS}. More is refused with
   * `limit-exceeded` before the grid is built.
   */
  readonly maxRows?: number;
}

/** The grid kinds and the keys each allows. */
const GRID_KINDS = {
  unit: ['unit', 'zone', 'range'],
  rule: ['rule', 'zone', 'start', 'end'],
  epochMs: ['epochMs'],
} as const;

/** @internal The grid instants of a grid spec, ascending; a grid of more than `maxRows` instants is refused. */
export function gridInstants(grid: unknown, maxRows: number): Float64Array {
  const { kind, fields } = readOneOf('options.grid', grid, GRID_KINDS);
  if (kind === 'epochMs') {
    const out = instantsFromArray('options.grid.epochMs', optionOf(fields, 'epochMs'));
    for (let i = 1; i < out.length; i++) {
      if (out[i]! < out[i - 1]!) {
        throw new KalendsRangeError(
          `options.grid.epochMs: expected ascending instants, but [${i}] (${out[i]}) comes before [${i - 1}] (${out[i - 1]})`,
          { code: 'unsorted', received: out[i], path: `options.grid.epochMs[${i}]` },
        );
      }
    }
    return out;
  }
  if (kind === 'rule') return gridFromRule(fields, maxRows);
  const unit = requireUnit(optionOf(fields, 'unit'), 'options.grid.unit');
  const zone = resolveZone(optionOf(fields, 'zone') as ZoneInput, 'options.grid.zone');
  const { start, end } = readBucketRange('options.grid.range', optionOf(fields, 'range'), unit, maxRows);
  const out = new Float64Array(end - start);
  try {
    for (let o = start; o < end; o++) out[o - start] = periodStartMs(unit, zone, o);
  } catch (e) {
    throw periodEdgeError(e, 'options.grid.range', unit, zone);
  }
  return out;
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
  const o = readOptions('options', options, ['grid', 'method', 'maxGapMs', 'columns', 'maxRows']);
  const method = requireEnum('options.method', optionOf(o, 'method'), FILL_METHODS, 'previous');
  const maxGap = requireToleranceMs('options.maxGapMs', optionOf(o, 'maxGapMs'));
  const names = readColumnList('options.columns', optionOf(o, 'columns'), series);
  const grid = gridInstants(optionOf(o, 'grid'), readMaxRows('options.maxRows', optionOf(o, 'maxRows')));
  return makeSeries(
    grid,
    names,
    names.map((c) => fillColumn(series.epochMs, series.columns[c]!, grid, method, maxGap)),
  );
}

/**
 * Bucketing: reduce a series to one row per period of any unit of the period layer, in a zone.
 *
 * Because a series is sorted, each period's rows are one contiguous run. The runs are found either by binary
 * search for each period's first instant (when there are fewer periods than rows, the common case: no
 * per-row zone conversion at all) or by one bulk pass of the period layer over every instant; both give the
 * same runs, and the tests check that they do.
 *
 * @module
 */
import { KalendsTypeError, describeValue } from '../errors.js';
import type { MAX_BUCKET_PERIODS, MAX_SERIES_ROWS } from '../bounds.js';
import { readPeriodRange } from '../diagnostics/index.js';
import { type Aggregation, type CompiledAggregation, aggregateRuns, compileAggregations } from './aggregate.js';
import {
  type PeriodUnit,
  type UnitInput,
  type Zone,
  type ZoneInput,
  periodEdgeError,
  ordinalAt,
  ordinalFromEpochMsBulk,
  periodStartMs,
  requireUnit,
  resolveZone,
} from './deps.js';
import { optionOf, optionalColumnName, readMaxRows, readOptions, requireEnum, requireRowsWithin } from './options.js';
import { type Series, lowerBound, makeSeries, requireSeries } from './series.js';

/** What an empty period (no rows) inside an explicit range shows: 0, NaN, or the previous period's value. */
export type EmptyPolicy = 'zero' | 'nan' | 'previous';

/** What missing values (NaN) do: be skipped (default) or make the group's result NaN. */
export type MissingPolicy = 'skip' | 'propagate';

/** A range of periods, end-exclusive: each end is an ordinal of the unit or a label the unit parses. */
export interface PeriodRange {
  /** The first period: an ordinal of the unit or a label it parses. */
  readonly start: number | string;
  /** The period after the last one (exclusive): an ordinal or a label. */
  readonly end: number | string;
}

/** Options of {@link bucketSeries}. */
export interface BucketOptions {
  /** The period unit: `'month'`, `'iso-week'`, a unit from `defineUnit` (fiscal quarter, retail week, ...). */
  readonly unit: UnitInput;
  /** The zone whose local days decide which period an instant falls in. */
  readonly zone: ZoneInput;
  /** What to compute per period. */
  readonly aggregations: readonly Aggregation[];
  /** Default input column of the aggregations (default: the first column). */
  readonly column?: string;
  /**
   * Periods to report, end-exclusive. With a range, every period in it appears (empty ones filled by `empty`)
   * and rows outside it are left out (and counted in `outsideRange`). Without one, only periods that hold at
   * least one row appear.
   */
  readonly range?: PeriodRange;
  /** Empty periods inside `range`: `'nan'` (default), `'zero'` or `'previous'`. `count` and `rows` are always 0. */
  readonly empty?: EmptyPolicy;
  /** Missing values: `'skip'` (default) or `'propagate'`. */
  readonly missing?: MissingPolicy;
  /**
   * The most periods `range` may hold: default {@link MAX_SERIES_ROWS} (one million), at most
   * {@link MAX_BUCKET_PERIODS}. A larger range is refused with `limit-exceeded` before anything is built.
   */
  readonly maxRows?: number;
}

/** One row per period: ordinals, labels, period bounds, and one column per aggregation. */
export interface BucketTable {
  /** The unit of the periods, compiled. */
  readonly unit: PeriodUnit;
  /** The zone of the local days, compiled. */
  readonly zone: Zone;
  /** Period ordinals, ascending. */
  readonly ordinals: Int32Array;
  /** `unit.formatOrdinal(ordinal)` for each period. */
  readonly labels: readonly string[];
  /** First instant of each period in the zone. */
  readonly startEpochMs: Float64Array;
  /** First instant of the next period (end-exclusive). */
  readonly endEpochMs: Float64Array;
  /** Rows that fell in each period (missing or not). */
  readonly rowCounts: Int32Array;
  /** Aggregated values by output name. */
  readonly columns: Readonly<Record<string, Float64Array>>;
  /** The names of `columns`, in the order of the aggregations. */
  readonly columnNames: readonly string[];
  /** Number of periods. */
  readonly length: number;
  /** Missing values that were skipped (0 with `missing: 'propagate'`). */
  readonly skippedMissing: number;
  /** Rows left out because they fall outside `range`. */
  readonly outsideRange: number;
  /** Periods in `range` that held no rows and were filled by the empty policy. */
  readonly emptyPeriods: number;
}

/** @internal Runs of rows per period. `starts` has `count + 1` entries. */
export interface Runs {
  readonly ordinals: Int32Array;
  readonly starts: Int32Array;
  readonly count: number;
}

/**
 * @internal Finds the non-empty periods of rows `[lo, hi)` of sorted `t`. `strategy` forces one of the two
 * equivalent methods (tests compare them); by default the boundary search is used when there are at most as
 * many periods as rows.
 */
export function findRuns(
  t: Float64Array,
  lo: number,
  hi: number,
  unit: PeriodUnit,
  zone: Zone,
  strategy?: 'boundaries' | 'bulk',
): Runs {
  if (hi <= lo) return { ordinals: new Int32Array(0), starts: new Int32Array(1).fill(lo), count: 0 };
  const o0 = ordinalAt(unit, zone, t[lo]!);
  const o1 = ordinalAt(unit, zone, t[hi - 1]!);
  const span = o1 - o0 + 1;
  const useBoundaries = strategy === 'boundaries' || (strategy === undefined && span <= hi - lo);
  if (useBoundaries) {
    const cap = Math.min(span, hi - lo);
    const ordinals = new Int32Array(cap);
    const starts = new Int32Array(cap + 1);
    let count = 0;
    let idx = lo;
    for (let o = o0; o <= o1 && idx < hi; o++) {
      const next = o === o1 ? hi : lowerBound(t, periodStartMs(unit, zone, o + 1), idx, hi);
      if (next > idx) {
        ordinals[count] = o;
        starts[count] = idx;
        count++;
        idx = next;
      }
    }
    starts[count] = hi;
    return { ordinals, starts, count };
  }
  const ords = ordinalFromEpochMsBulk(unit, zone, t.subarray(lo, hi));
  let count = 0;
  for (let i = 0; i < ords.length; i++) if (i === 0 || ords[i] !== ords[i - 1]) count++;
  const ordinals = new Int32Array(count);
  const starts = new Int32Array(count + 1);
  let k = -1;
  for (let i = 0; i < ords.length; i++) {
    if (i === 0 || ords[i] !== ords[i - 1]) {
      k++;
      ordinals[k] = ords[i]!;
      starts[k] = lo + i;
    }
  }
  starts[count] = hi;
  return { ordinals, starts, count };
}

/**
 * Reduces a series to one row per period of `unit` in `zone`, with the chosen aggregations. Rows are assigned
 * by their local day in the zone, so a month in America/New_York starts at local midnight, DST included.
 * Missing values are skipped and counted in `skippedMissing`. Without `range` only periods holding rows
 * appear; with one, every period of the range appears and `empty` fills those without rows.
 *
 * @example
 * ```ts
 * const monthly = bucketSeries(sales, { unit: MONTH_UNIT, zone: 'America/Chicago', aggregations: ['sum', 'count'] });
 * monthly.labels;          // ['2025-01', '2025-02', ...]
 * monthly.columns.sum;     // Float64Array of monthly totals
 * ```
 */
export function bucketSeries(series: Series, options: BucketOptions): BucketTable {
  requireSeries(series, 'series');
  const o = readOptions('options', options, BUCKET_KEYS);
  const unit = requireUnit(optionOf(o, 'unit'), 'options.unit');
  const zone = resolveZone(optionOf(o, 'zone') as ZoneInput, 'options.zone');
  const column = optionalColumnName('options.column', optionOf(o, 'column'));
  const aggs = compileAggregations(series, optionOf(o, 'aggregations'), 'options.aggregations', undefined, column);
  const empty = requireEnum('options.empty', optionOf(o, 'empty'), EMPTY_POLICIES, 'nan');
  const missing = requireEnum('options.missing', optionOf(o, 'missing'), MISSING_POLICIES, 'skip');
  const maxRows = readMaxRows('options.maxRows', optionOf(o, 'maxRows'));
  const range = optionOf(o, 'range') === undefined ? undefined : readBucketRange('options.range', optionOf(o, 'range'), unit, maxRows);
  const t = series.epochMs;
  try {
    const b = bucketRows(t, unit, zone, aggs, range, empty, missing === 'propagate');
    return assembleBucketTable(unit, zone, b.ordinals, b.rowCounts, aggs, b.columns, b);
  } catch (e) {
    throw periodEdgeError(e, range === undefined ? 'series.epochMs' : 'options.range', unit, zone);
  }
}

/** The keys of {@link BucketOptions}. */
const BUCKET_KEYS = ['unit', 'zone', 'aggregations', 'column', 'range', 'empty', 'missing', 'maxRows'];
const EMPTY_POLICIES: readonly EmptyPolicy[] = ['nan', 'zero', 'previous'];
const MISSING_POLICIES: readonly MissingPolicy[] = ['skip', 'propagate'];

/**
 * @internal A period range `{ start, end }` (ordinals or labels, end-exclusive) as `[first, end)` ordinals,
 * refused with `limit-exceeded` before anything is built when it holds more than `maxRows` periods.
 */
export function readBucketRange(name: string, value: unknown, unit: PeriodUnit, maxRows: number): { readonly start: number; readonly end: number } {
  const { first, last } = readPeriodRange(name, value, unit, false);
  requireRowsWithin(name, last - first + 1, maxRows, `a range of ${last - first + 1} periods of unit ${unit.id}`, 'options.maxRows');
  return { start: first, end: last + 1 };
}

/** @internal The periods of a bucketing, before their bounds and labels are added. */
export interface BucketRows {
  readonly ordinals: Int32Array;
  readonly rowCounts: Int32Array;
  readonly columns: Float64Array[];
  readonly skippedMissing: number;
  readonly outsideRange: number;
  readonly emptyPeriods: number;
}

/** @internal {@link bucketSeries} on validated arguments (`range` as `[start, end)` ordinals), without bounds and labels. */
export function bucketRows(
  t: Float64Array,
  unit: PeriodUnit,
  zone: Zone,
  aggs: readonly CompiledAggregation[],
  range: { readonly start: number; readonly end: number } | undefined,
  empty: EmptyPolicy,
  propagate: boolean,
): BucketRows {
  let lo = 0;
  let hi = t.length;
  const rangeStart = range?.start ?? 0;
  const rangeEnd = range?.end ?? 0;
  if (range !== undefined) {
    lo = lowerBound(t, periodStartMs(unit, zone, rangeStart), 0, t.length);
    hi = Math.max(lo, lowerBound(t, periodStartMs(unit, zone, rangeEnd), lo, t.length));
  }
  const runs = findRuns(t, lo, hi, unit, zone);
  const { columns: reduced, skipped } = aggregateRuns(aggs, runs.starts, runs.count, propagate);
  const rowsOfRun = new Int32Array(runs.count);
  for (let k = 0; k < runs.count; k++) rowsOfRun[k] = runs.starts[k + 1]! - runs.starts[k]!;

  let ordinals: Int32Array;
  let rowCounts: Int32Array;
  let columns: Float64Array[];
  let emptyPeriods = 0;
  if (range === undefined) {
    ordinals = runs.ordinals.slice(0, runs.count);
    rowCounts = rowsOfRun;
    columns = reduced;
  } else {
    const m = rangeEnd - rangeStart;
    ordinals = new Int32Array(m);
    rowCounts = new Int32Array(m);
    columns = aggs.map(() => new Float64Array(m));
    let k = 0;
    for (let j = 0; j < m; j++) {
      const o = rangeStart + j;
      ordinals[j] = o;
      if (k < runs.count && runs.ordinals[k] === o) {
        rowCounts[j] = rowsOfRun[k]!;
        for (let a = 0; a < aggs.length; a++) columns[a]![j] = reduced[a]![k]!;
        k++;
      } else {
        emptyPeriods++;
        for (let a = 0; a < aggs.length; a++) columns[a]![j] = emptyValue(aggs[a]!, empty, columns[a]!, j);
      }
    }
  }
  return { ordinals, rowCounts, columns, skippedMissing: skipped, outsideRange: t.length - (hi - lo), emptyPeriods };
}

/**
 * @internal Each period's first instant in the zone, the first instant of the next period (consecutive periods
 * share it, computed once) and its label.
 */
export function periodBounds(unit: PeriodUnit, zone: Zone, ordinals: Int32Array): { startEpochMs: Float64Array; endEpochMs: Float64Array; labels: string[] } {
  const n = ordinals.length;
  const startEpochMs = new Float64Array(n);
  const endEpochMs = new Float64Array(n);
  const labels: string[] = new Array<string>(n);
  for (let j = 0; j < n; j++) {
    const o = ordinals[j]!;
    startEpochMs[j] = j > 0 && ordinals[j - 1] === o - 1 ? endEpochMs[j - 1]! : periodStartMs(unit, zone, o);
    endEpochMs[j] = periodStartMs(unit, zone, o + 1);
    labels[j] = unit.formatOrdinal(o);
  }
  return { startEpochMs, endEpochMs, labels };
}

/**
 * @internal Builds a bucket table from its ordinals, row counts and one column per aggregation: each period's start
 * and end instants in the zone (a period's end is the next one's start, so consecutive periods share it) and label.
 * Shared by {@link bucketSeries} and the streaming accumulator.
 */
export function assembleBucketTable(
  unit: PeriodUnit,
  zone: Zone,
  ordinals: Int32Array,
  rowCounts: Int32Array,
  aggs: readonly { readonly name: string }[],
  columns: readonly Float64Array[],
  tallies: { readonly skippedMissing: number; readonly outsideRange: number; readonly emptyPeriods: number },
): BucketTable {
  const { skippedMissing, outsideRange, emptyPeriods } = tallies;
  const n = ordinals.length;
  const { startEpochMs, endEpochMs, labels } = periodBounds(unit, zone, ordinals);
  const byName: Record<string, Float64Array> = Object.create(null) as Record<string, Float64Array>;
  aggs.forEach((a, i) => {
    byName[a.name] = columns[i]!;
  });
  return Object.freeze({
    unit,
    zone,
    ordinals,
    labels: Object.freeze(labels),
    startEpochMs,
    endEpochMs,
    rowCounts,
    columns: Object.freeze(byName),
    columnNames: Object.freeze(aggs.map((a) => a.name)),
    length: n,
    skippedMissing,
    outsideRange,
    emptyPeriods,
  });
}


function emptyValue(a: CompiledAggregation, policy: EmptyPolicy, out: Float64Array, j: number): number {
  if (a.kind === 'count' || a.kind === 'rows') return 0;
  if (policy === 'zero') return 0;
  if (policy === 'nan') return Number.NaN;
  return j > 0 ? out[j - 1]! : Number.NaN;
}

/**
 * A bucket table as a series indexed by each period's first instant, with the same columns, so that rolling
 * windows, lags and joins apply to periods too.
 *
 * @example
 * ```ts
 * const weekly = seriesFromBuckets(bucketSeries(sales, { unit, zone, aggregations: ['sum'] }));
 * ```
 */
export function seriesFromBuckets(table: BucketTable): Series {
  if (table === null || typeof table !== 'object' || !(table.ordinals instanceof Int32Array)) {
    throw new KalendsTypeError(`table: expected a BucketTable (from bucketSeries), got ${describeValue(table)}`, {
      code: 'invalid-type',
      received: table,
    });
  }
  return makeSeries(
    table.startEpochMs,
    table.columnNames,
    table.columnNames.map((c) => table.columns[c]!),
  );
}

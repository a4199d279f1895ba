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
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { ordinalFromEpochMsBulk } from '../period/index.js';
import { type Aggregation, type CompiledAggregation, aggregateRuns, compileAggregations } from './aggregate.js';
import { type PeriodUnit, type UnitInput, type Zone, type ZoneInput, ordinalAt, periodStartMs, requireUnit, resolveZone } from './deps.js';
import { type Series, lowerBound, makeSeries, requireSeries } from './series.js';

/** What an empty period (no rows) inside an explicit range shows: 0, NaN, or the previous period's value. */
export type EmptyPolicy = 'zero' | 'nan' | 'previous';

/** What missing values (NaN) do: be skipped (default) or make the group's result NaN. */
export type MissingPolicy = 'skip' | 'propagate';

/** A range of periods, end-exclusive: each end is an ordinal of the unit or a label the unit parses. */
export interface PeriodRange {
  readonly start: number | string;
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
}

/** One row per period: ordinals, labels, period bounds, and one column per aggregation. */
export interface BucketTable {
  readonly unit: PeriodUnit;
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

/** Largest number of periods one call may report; more is almost certainly a mistaken unit or range. */
export const MAX_BUCKET_PERIODS = 50_000_000;

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

function rangeOrdinal(unit: PeriodUnit, v: unknown, path: string): number {
  if (typeof v === 'number') {
    if (!Number.isInteger(v)) {
      throw new KalendsRangeError(`${path}: expected an integer period ordinal or a label, got ${describeValue(v)}`, {
        code: 'out-of-range',
        received: v,
        path,
      });
    }
    return v;
  }
  if (typeof v === 'string') return unit.parseOrdinal(v);
  throw new KalendsTypeError(`${path}: expected a period ordinal or a label, got ${describeValue(v)}`, {
    code: 'invalid-type',
    received: v,
    path,
  });
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
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected { unit, zone, aggregations }, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const unit = requireUnit(options.unit, 'options.unit');
  const zone = resolveZone(options.zone, 'options.zone');
  const aggs = compileAggregations(series, options.aggregations, 'options.aggregations', undefined, options.column);
  const empty = options.empty ?? 'nan';
  if (empty !== 'zero' && empty !== 'nan' && empty !== 'previous') {
    throw new KalendsRangeError(`options.empty: expected "zero", "nan" or "previous", got ${describeValue(empty)}`, {
      code: 'out-of-range',
      received: empty,
    });
  }
  const missing = options.missing ?? 'skip';
  if (missing !== 'skip' && missing !== 'propagate') {
    throw new KalendsRangeError(`options.missing: expected "skip" or "propagate", got ${describeValue(missing)}`, {
      code: 'out-of-range',
      received: missing,
    });
  }
  const t = series.epochMs;
  let lo = 0;
  let hi = t.length;
  let rangeStart = 0;
  let rangeEnd = 0;
  if (options.range !== undefined) {
    const r = options.range;
    if (r === null || typeof r !== 'object') {
      throw new KalendsTypeError(`options.range: expected { start, end }, got ${describeValue(r)}`, {
        code: 'invalid-type',
        received: r,
      });
    }
    rangeStart = rangeOrdinal(unit, r.start, 'options.range.start');
    rangeEnd = rangeOrdinal(unit, r.end, 'options.range.end');
    if (rangeEnd < rangeStart) {
      throw new KalendsRangeError(
        `options.range.end: expected a period at or after the start (${unit.formatOrdinal(rangeStart)}), got ${unit.formatOrdinal(rangeEnd)}`,
        { code: 'out-of-range', received: r.end },
      );
    }
    if (rangeEnd - rangeStart > MAX_BUCKET_PERIODS) {
      throw new KalendsRangeError(
        `options.range: expected at most ${MAX_BUCKET_PERIODS} periods, got ${rangeEnd - rangeStart}; use a coarser unit or a shorter range`,
        { code: 'limit-exceeded', received: r },
      );
    }
    lo = lowerBound(t, periodStartMs(unit, zone, rangeStart), 0, t.length);
    hi = Math.max(lo, lowerBound(t, periodStartMs(unit, zone, rangeEnd), lo, t.length));
  }
  const runs = findRuns(t, lo, hi, unit, zone);
  const { columns: reduced, skipped } = aggregateRuns(aggs, runs.starts, runs.count, missing === 'propagate');
  const rowsOfRun = new Int32Array(runs.count);
  for (let k = 0; k < runs.count; k++) rowsOfRun[k] = runs.starts[k + 1]! - runs.starts[k]!;

  let ordinals: Int32Array;
  let rowCounts: Int32Array;
  let columns: Float64Array[];
  let emptyPeriods = 0;
  if (options.range === undefined) {
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
  return assembleBucketTable(unit, zone, ordinals, rowCounts, aggs, columns, {
    skippedMissing: skipped,
    outsideRange: t.length - (hi - lo),
    emptyPeriods,
  });
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
    ...tallies,
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

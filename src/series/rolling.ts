/**
 * Rolling windows: for every row, an aggregate over the rows in a window that ends at that row. Windows are
 * given by a row count, a fixed length in milliseconds, a calendar span on the wall clock of a zone, or a
 * number of business days (rolling-window.ts); every kind moves forward monotonically, so each aggregate is
 * computed in O(n) (rolling-kernel.ts). This module holds the public functions and their options.
 *
 * @module
 */
import { KalendsRangeError } from '../errors.js';
import { requireEpochMs, requireNumberArray, requireOutArray } from '../diagnostics/index.js';
import { type AggregationName, compileAggregations } from './aggregate.js';
import { type RollingAggregationName, rollKernel } from './rolling-kernel.js';
import { type WindowSpec, resolveWindow } from './rolling-window.js';
import { type OptionRecord, optionOf, optionalColumnName, readOptions, requireAmount, requireBoolean } from './options.js';
import { type Series, makeSeries, requireSeries } from './series.js';

/** A rolling aggregation by name or with settings (`as`, `column`, `estimator`). */
export type RollingAggregation =
  | RollingAggregationName
  | {
      /** What to compute. */
      readonly kind: RollingAggregationName;
      /** Input column (default: the option `column`, else the first). */
      readonly column?: string;
      /** Output column name (default: the kind, or `<column>-<kind>` when `column` is given). */
      readonly as?: string;
      /** For `variance` and `stddev`: `'sample'` (the default) or `'population'`. */
      readonly estimator?: 'sample' | 'population';
    };

const ROLLING_NAMES: readonly AggregationName[] = ['count', 'sum', 'mean', 'min', 'max', 'variance', 'stddev'];

/** Options of {@link rollSeries}. */
export interface RollOptions {
  /** Which rows each row's window holds. */
  readonly window: WindowSpec;
  /** What to compute over each window. */
  readonly aggregations: readonly RollingAggregation[];
  /** Default input column (default: the first). */
  readonly column?: string;
  /** Fewest non-missing values a window needs for a result; fewer gives NaN (count still reports). Default 1. */
  readonly minObservations?: number;
  /** Whether the window's start instant belongs to it (time windows only; default false: the start is open). */
  readonly startInclusive?: boolean;
  /** Whether the window's end, the row itself, belongs to it (default true). */
  readonly endInclusive?: boolean;
}

/** Options of {@link rollBulk}: one aggregation, the rest as in {@link RollOptions}. */
export interface RollBulkOptions {
  /** Which rows each row's window holds. */
  readonly window: WindowSpec;
  /** What to compute over each window. */
  readonly aggregation: RollingAggregation;
  /** Fewest non-missing values a window needs for a result (default 1). */
  readonly minObservations?: number;
  /** Whether the window's start instant belongs to it (time windows only; default false). */
  readonly startInclusive?: boolean;
  /** Whether the window's end, the row itself, belongs to it (default true). */
  readonly endInclusive?: boolean;
}

/** The options shared by both functions, read once. */
function readCommon(o: OptionRecord) {
  return {
    minObs: requireAmount('options.minObservations', optionOf(o, 'minObservations'), 0, 1),
    startGiven: optionOf(o, 'startInclusive') === undefined ? undefined : requireBoolean('options.startInclusive', optionOf(o, 'startInclusive'), false),
    endInclusive: requireBoolean('options.endInclusive', optionOf(o, 'endInclusive'), true),
  };
}

/**
 * For every row, aggregates over the rows of its window (see {@link WindowSpec}), computed in O(n). Missing
 * values are skipped; a window with fewer than `minObservations` non-missing values gives NaN (`count` always
 * reports). Sums are compensated (Neumaier); variance merges (count, mean, sum of squared deviations) states
 * in a two-stack queue (Chan, Golub & LeVeque's pairwise update), so nothing is ever subtracted; min and max use
 * monotonic deques. The result has the same instants as the input and one column per aggregation. On a series
 * of instants alone, `count` counts the rows of each window.
 *
 * @example
 * ```ts
 * const smooth = rollSeries(sales, { window: { span: { days: 30 }, zone: 'America/Chicago' }, aggregations: ['mean'] });
 * const last5 = rollSeries(sales, { window: { rows: 5 }, aggregations: ['max', 'min'] });
 * ```
 */
export function rollSeries(series: Series, options: RollOptions): Series {
  requireSeries(series, 'series');
  const o = readOptions('options', options, ['window', 'aggregations', 'column', 'minObservations', 'startInclusive', 'endInclusive']);
  const column = optionalColumnName('options.column', optionOf(o, 'column'));
  const aggs = compileAggregations(series, optionOf(o, 'aggregations'), 'options.aggregations', ROLLING_NAMES, column);
  const { minObs, startGiven, endInclusive } = readCommon(o);
  const win = resolveWindow(series.epochMs, optionOf(o, 'window'), startGiven, endInclusive);
  const cols = aggs.map((a) =>
    rollKernel(series.epochMs, a.values, win, a.kind as RollingAggregationName, minObs, a.ddof, new Float64Array(series.length)),
  );
  return makeSeries(
    series.epochMs,
    aggs.map((a) => a.name),
    cols,
  );
}

/**
 * Throws unless `epochMs` is ascending with no NaN: a typed error naming the first row at fault. A function of its
 * own so that V8 optimizes this loop as a whole; inside `rollBulk` it was compiled on the fly in the middle of
 * every call, and the code after it then ran unoptimized. Being ascending, the instants lie within the supported
 * range when the first and the last do, which is checked after the loop.
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
      ? new KalendsRangeError(`epochMs[${i}]: expected an instant, got NaN`, { code: 'out-of-range', received: x, path: `epochMs[${i}]` })
      : new KalendsRangeError(`epochMs: expected ascending instants, but [${i}] (${x}) comes before [${i - 1}] (${epochMs[i - 1]})`, {
          code: 'unsorted',
          received: x,
          path: `epochMs[${i}]`,
        });
  }
  if (n > 0) {
    requireEpochMs('epochMs[0]', epochMs[0]);
    requireEpochMs(`epochMs[${n - 1}]`, previous);
  }
}

/** A bulk input as a Float64Array: as it is when it is one (no copy), else copied once after its check. */
function float64Of(name: string, value: unknown): Float64Array {
  return value instanceof Float64Array ? value : Float64Array.from(requireNumberArray(name, value));
}

/**
 * {@link rollSeries} for one aggregation over bare arrays, writing into `out` when given (so that a caller
 * rolling many columns or many batches allocates nothing per call). `epochMs` must be ascending. Float64Arrays
 * are read as they are; other typed arrays and plain arrays of numbers are copied once (a non-number is named by
 * its index).
 *
 * @example
 * ```ts
 * const out = new Float64Array(times.length);
 * rollBulk(times, values, { window: { lengthMs: 30 * 86_400_000 }, aggregation: 'mean' }, out);
 * ```
 */
export function rollBulk(epochMs: ArrayLike<number>, values: ArrayLike<number>, options: RollBulkOptions, out?: Float64Array): Float64Array {
  const t = float64Of('epochMs', epochMs);
  const v = float64Of('values', values);
  const n = t.length;
  if (v.length !== n) {
    throw new KalendsRangeError(`values: expected ${n} values (one per instant), got ${v.length}`, { code: 'length-mismatch', received: v.length, path: 'values' });
  }
  const target = requireOutArray('out', out, Float64Array, n);
  const o = readOptions('options', options, ['window', 'aggregation', 'minObservations', 'startInclusive', 'endInclusive']);
  requireAscending(t);
  const [agg] = compileAggregations(makeSeries(t, ['value'], [v]), optionOf(o, 'aggregation'), 'options.aggregation', ROLLING_NAMES);
  const { minObs, startGiven, endInclusive } = readCommon(o);
  const win = resolveWindow(t, optionOf(o, 'window'), startGiven, endInclusive);
  return rollKernel(t, v, win, agg!.kind as RollingAggregationName, minObs, agg!.ddof, target);
}

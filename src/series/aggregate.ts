/**
 * Aggregations over groups of rows: their names, their definitions, and the kernels that compute them over
 * contiguous runs of a sorted series.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { didYouMean, isRecord } from '../diagnostics/index.js';
import { type QuantileMethod, compensatedSum, quantileOfSorted, sortedValid, twoPassVariance } from './numeric.js';
import { type OptionRecord, optionOf, optionalColumnName, readOptions, requireEnum, requireReal } from './options.js';
import { type Series, columnNamed } from './series.js';

/**
 * The aggregations a group of rows can be reduced to. Missing values (NaN) are skipped unless the caller asks
 * for `missing: 'propagate'`.
 *
 * - `count`: non-missing values; `rows`: rows, missing or not.
 * - `sum`: compensated (Neumaier) sum; the sum of no values is 0. `mean`: sum / count.
 * - `min`, `max`; `first`, `last`: the first and last non-missing value in time order.
 * - `open`, `high`, `low`, `close`: the trade's names for first, max, min and last.
 * - `variance`, `stddev`: by default the sample estimator (divisor n - 1); `estimator: 'population'` divides by n.
 * - `median`, `quantile` (`q` in 0..1): Hyndman & Fan (1996) definition 7 by default.
 */
export type AggregationName =
  | 'count'
  | 'rows'
  | 'sum'
  | 'mean'
  | 'min'
  | 'max'
  | 'first'
  | 'last'
  | 'open'
  | 'high'
  | 'low'
  | 'close'
  | 'variance'
  | 'stddev'
  | 'median'
  | 'quantile';

/** An aggregation with its settings. */
export interface AggregationSpec {
  /** What to compute. */
  readonly kind: AggregationName;
  /** Input column (default: the series' first column). */
  readonly column?: string;
  /** Output column name (default: the kind, `quantile-<q>` for quantiles, `<column>-<kind>` when `column` is given). */
  readonly as?: string;
  /** For `quantile`: the probability, 0..1. */
  readonly q?: number;
  /** For `variance` and `stddev`: `'sample'` (divisor n - 1, the default) or `'population'` (divisor n). */
  readonly estimator?: 'sample' | 'population';
  /** For `median` and `quantile`: `'hyndman-fan-7'` (default) or `'hyndman-fan-6'`. */
  readonly quantileMethod?: QuantileMethod;
}

/** An aggregation by name, or with settings. */
export type Aggregation = AggregationName | AggregationSpec;

/** All aggregation names, for messages and validation. */
export const AGGREGATION_NAMES: readonly AggregationName[] = /* @__PURE__ */ Object.freeze([
  'count',
  'rows',
  'sum',
  'mean',
  'min',
  'max',
  'first',
  'last',
  'open',
  'high',
  'low',
  'close',
  'variance',
  'stddev',
  'median',
  'quantile',
]);

/**
 * Common alternative words for our aggregation names, by meaning: an unknown name that is one of these gets the
 * aggregation it means as its first suggestion (`"std"` suggests `"stddev"`, not `"sum"`, which is nearer by
 * spelling). Keys are lower case with words joined by `-`, as the diagnostics kit normalizes received text.
 * @internal
 */
export const AGGREGATION_SYNONYMS: Readonly<Record<string, AggregationName>> = /* @__PURE__ */ Object.freeze({
  std: 'stddev',
  stdev: 'stddev',
  stdv: 'stddev',
  sd: 'stddev',
  sigma: 'stddev',
  'standard-deviation': 'stddev',
  'std-dev': 'stddev',
  var: 'variance',
  variation: 'variance',
  avg: 'mean',
  average: 'mean',
  'arithmetic-mean': 'mean',
  med: 'median',
  middle: 'median',
  p50: 'median',
  total: 'sum',
  add: 'sum',
  n: 'count',
  cnt: 'count',
  number: 'count',
  tally: 'count',
  len: 'rows',
  length: 'rows',
  size: 'rows',
  'row-count': 'rows',
  minimum: 'min',
  smallest: 'min',
  least: 'min',
  lowest: 'min',
  maximum: 'max',
  largest: 'max',
  biggest: 'max',
  greatest: 'max',
  highest: 'max',
  earliest: 'first',
  initial: 'first',
  begin: 'first',
  start: 'first',
  opening: 'open',
  latest: 'last',
  final: 'last',
  end: 'last',
  closing: 'close',
  percentile: 'quantile',
  quartile: 'quantile',
  pct: 'quantile',
  fractile: 'quantile',
});

/** Aggregations that read no value: on a series of instants alone they count its rows. */
const ROW_COUNTING: readonly AggregationName[] = ['count', 'rows'];

/** The keys an aggregation spec allows, by kind. */
function specKeys(kind: AggregationName): readonly string[] {
  const base = ['kind', 'column', 'as'];
  if (kind === 'quantile') return [...base, 'q', 'quantileMethod'];
  if (kind === 'median') return [...base, 'quantileMethod'];
  if (kind === 'variance' || kind === 'stddev') return [...base, 'estimator'];
  return base;
}

const ESTIMATORS: readonly ('sample' | 'population')[] = ['sample', 'population'];
const QUANTILE_METHODS: readonly QuantileMethod[] = ['hyndman-fan-7', 'hyndman-fan-6'];

/** A validated aggregation bound to its input column. @internal */
export interface CompiledAggregation {
  readonly name: string;
  readonly kind: AggregationName;
  /** The input column's name; `undefined` for a row count of a series of instants alone. */
  readonly column: string | undefined;
  readonly values: Float64Array;
  readonly q: number;
  readonly ddof: number;
  readonly method: QuantileMethod;
}

/**
 * @internal The aggregation name at `path`: one of `allowed`, or a KalendsRangeError with code `unknown-name`
 * that lists the valid names and suggests the nearest by meaning and by spelling.
 */
export function requireAggregationName(path: string, kind: unknown, allowed: readonly AggregationName[]): AggregationName {
  if (typeof kind === 'string' && (allowed as readonly string[]).includes(kind)) return kind as AggregationName;
  if (typeof kind !== 'string') {
    throw new KalendsTypeError(`${path}: expected an aggregation name (${allowed.join(', ')}), got ${describeValue(kind)}`, {
      code: 'invalid-type',
      received: kind,
      path,
    });
  }
  const suggestion = didYouMean(kind, allowed, { synonyms: AGGREGATION_SYNONYMS });
  if ((AGGREGATION_NAMES as readonly string[]).includes(kind)) {
    throw new KalendsRangeError(`${path}: aggregation ${describeValue(kind)} is not offered here; valid names are ${allowed.join(', ')}${suggestion}`, {
      code: 'unsupported',
      received: kind,
      path,
    });
  }
  throw new KalendsRangeError(`${path}: unknown aggregation ${describeValue(kind)}; valid names are ${allowed.join(', ')}${suggestion}`, {
    code: 'unknown-name',
    received: kind,
    path,
  });
}

/**
 * Validates aggregations against a series (and an allowed subset), naming the path of the first fault. On a
 * series of instants alone (no value column), `count` and `rows` count its rows and every other aggregation is
 * refused with a message that says why.
 * @internal
 */
export function compileAggregations(
  series: Series,
  list: unknown,
  path: string,
  allowed: readonly AggregationName[] = AGGREGATION_NAMES,
  defaultColumn?: string,
): CompiledAggregation[] {
  if (list === undefined) {
    throw new KalendsTypeError(`${path}: expected an aggregation name or a list of them (${allowed.join(', ')}), got undefined`, {
      code: 'invalid-type',
      received: list,
    });
  }
  const items: readonly unknown[] = Array.isArray(list) ? list : [list];
  if (items.length === 0) {
    throw new KalendsRangeError(`${path}: expected at least one aggregation (${allowed.join(', ')}), got none`, {
      code: 'out-of-range',
      received: list,
    });
  }
  const out: CompiledAggregation[] = [];
  const names = new Set<string>();
  let rowsOnly: Float64Array | undefined;
  // A loop, not forEach: forEach skips the holes of a sparse array, and a hole is refused like any non-name.
  for (let i = 0; i < items.length; i++) {
    const item = items[i];
    const p = Array.isArray(list) ? `${path}[${i}]` : path;
    let spec: OptionRecord;
    if (typeof item === 'string') spec = { kind: item };
    else if (isRecord(item)) spec = item;
    else {
      throw new KalendsTypeError(`${p}: expected an aggregation name or { kind, ... }, got ${describeValue(item)}`, {
        code: 'invalid-type',
        received: item,
        path: p,
      });
    }
    const kind = requireAggregationName(typeof item === 'string' ? p : `${p}.kind`, optionOf(spec, 'kind'), allowed);
    readOptions(p, spec, specKeys(kind));
    let q = Number.NaN;
    if (kind === 'quantile') q = requireReal(`${p}.q`, optionOf(spec, 'q'), 'a probability from 0 to 1', (x) => x >= 0 && x <= 1);
    else if (kind === 'median') q = 0.5;
    const estimator = requireEnum(`${p}.estimator`, optionOf(spec, 'estimator'), ESTIMATORS, 'sample');
    const method = requireEnum(`${p}.quantileMethod`, optionOf(spec, 'quantileMethod'), QUANTILE_METHODS, 'hyndman-fan-7');
    const asked = optionalColumnName(`${p}.column`, optionOf(spec, 'column'));
    const as = optionalColumnName(`${p}.as`, optionOf(spec, 'as'));
    const column = asked ?? defaultColumn ?? series.columnNames[0];
    let values: Float64Array;
    if (column === undefined) {
      if (!ROW_COUNTING.includes(kind)) {
        throw new KalendsRangeError(
          `${p}: ${JSON.stringify(kind)} needs a value column, and the series holds instants alone; use "count" or "rows" to count its rows, or build the series with a value column`,
          { code: 'unsupported', received: kind, path: p },
        );
      }
      // Every row is a value: a row count.
      rowsOnly ??= new Float64Array(series.length);
      values = rowsOnly;
    } else values = columnNamed(series, column, asked !== undefined ? `${p}.column` : defaultColumn !== undefined ? 'options.column' : p);
    const base = kind === 'quantile' ? `quantile-${q}` : kind;
    const name = as ?? (asked !== undefined && series.columnNames.length > 1 ? `${asked}-${base}` : base);
    if (names.has(name)) {
      throw new KalendsRangeError(`${p}: output column ${describeValue(name)} is produced twice; give one an "as" name`, {
        code: 'out-of-range',
        received: name,
        path: p,
      });
    }
    names.add(name);
    out.push({ name, kind, column, values, q, ddof: estimator === 'sample' ? 1 : 0, method });
  }
  return out;
}

/**
 * Reduces each run `[starts[k], starts[k + 1])` of rows to one value per compiled aggregation. `propagate`
 * makes any missing value in a run turn every aggregation but `count`, `rows`, `first` and `last` into NaN.
 * Returns one Float64Array per aggregation and the number of missing values skipped.
 * @internal
 */
export function aggregateRuns(
  aggs: readonly CompiledAggregation[],
  starts: Int32Array,
  runCount: number,
  propagate: boolean,
): { columns: Float64Array[]; skipped: number } {
  const scratch = new Float64Array(1);
  // Sums and counts are shared by sum, mean and count over the same column.
  const sums = new Map<Float64Array, { sum: Float64Array; count: Float64Array }>();
  const sumsOf = (values: Float64Array) => {
    let m = sums.get(values);
    if (!m) {
      const sum = new Float64Array(runCount);
      const count = new Float64Array(runCount);
      for (let k = 0; k < runCount; k++) {
        sum[k] = compensatedSum(values, starts[k]!, starts[k + 1]!, scratch);
        count[k] = scratch[0]!;
      }
      m = { sum, count };
      sums.set(values, m);
    }
    return m;
  };
  let maxRun = 0;
  for (let k = 0; k < runCount; k++) maxRun = Math.max(maxRun, starts[k + 1]! - starts[k]!);
  let sortScratch: Float64Array | undefined;
  const columns = aggs.map((a) => {
    const out = new Float64Array(runCount);
    const v = a.values;
    switch (a.kind) {
      case 'count':
        out.set(sumsOf(v).count);
        break;
      case 'rows':
        for (let k = 0; k < runCount; k++) out[k] = starts[k + 1]! - starts[k]!;
        break;
      case 'sum':
        out.set(sumsOf(v).sum);
        break;
      case 'mean': {
        const m = sumsOf(v);
        for (let k = 0; k < runCount; k++) out[k] = m.count[k]! > 0 ? m.sum[k]! / m.count[k]! : Number.NaN;
        break;
      }
      case 'min':
      case 'low':
      case 'max':
      case 'high': {
        const isMin = a.kind === 'min' || a.kind === 'low';
        for (let k = 0; k < runCount; k++) {
          let best = Number.NaN;
          for (let i = starts[k]!, e = starts[k + 1]!; i < e; i++) {
            const x = v[i]!;
            if (x !== x) continue;
            if (best !== best || (isMin ? x < best : x > best)) best = x;
          }
          out[k] = best;
        }
        break;
      }
      case 'first':
      case 'open':
        for (let k = 0; k < runCount; k++) {
          let r = Number.NaN;
          for (let i = starts[k]!, e = starts[k + 1]!; i < e; i++) {
            const x = v[i]!;
            if (x === x || propagate) {
              r = x;
              break;
            }
          }
          out[k] = r;
        }
        break;
      case 'last':
      case 'close':
        for (let k = 0; k < runCount; k++) {
          let r = Number.NaN;
          for (let i = starts[k + 1]! - 1, b = starts[k]!; i >= b; i--) {
            const x = v[i]!;
            if (x === x || propagate) {
              r = x;
              break;
            }
          }
          out[k] = r;
        }
        break;
      case 'variance':
      case 'stddev':
        for (let k = 0; k < runCount; k++) {
          const variance = twoPassVariance(v, starts[k]!, starts[k + 1]!, a.ddof, scratch);
          out[k] = a.kind === 'variance' ? variance : Math.sqrt(variance);
        }
        break;
      case 'median':
      case 'quantile': {
        sortScratch ??= new Float64Array(maxRun);
        for (let k = 0; k < runCount; k++) {
          const n = sortedValid(v, starts[k]!, starts[k + 1]!, sortScratch);
          out[k] = quantileOfSorted(sortScratch, n, a.q, a.method);
        }
        break;
      }
    }
    return out;
  });
  // Missing values: counted once per input column used.
  let skipped = 0;
  const seen = new Set<Float64Array>();
  for (const a of aggs) {
    if (seen.has(a.values)) continue;
    seen.add(a.values);
    const m = sumsOf(a.values);
    for (let k = 0; k < runCount; k++) skipped += starts[k + 1]! - starts[k]! - m.count[k]!;
  }
  if (propagate) {
    aggs.forEach((a, j) => {
      if (a.kind === 'count' || a.kind === 'rows' || a.kind === 'first' || a.kind === 'last' || a.kind === 'open' || a.kind === 'close') return;
      const m = sumsOf(a.values);
      const out = columns[j]!;
      for (let k = 0; k < runCount; k++) if (m.count[k]! < starts[k + 1]! - starts[k]!) out[k] = Number.NaN;
    });
  }
  return { columns, skipped: propagate ? 0 : skipped };
}

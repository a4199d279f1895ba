/**
 * Aggregations over groups of rows: their names, their definitions, and the kernels that compute them over
 * contiguous runs of a sorted series.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type QuantileMethod, compensatedSum, quantileOfSorted, sortedValid, twoPassVariance } from './numeric.js';
import { type Series, columnOfSeries } from './series.js';

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
export const AGGREGATION_NAMES: readonly AggregationName[] = Object.freeze([
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

/** A validated aggregation bound to its input column. @internal */
export interface CompiledAggregation {
  readonly name: string;
  readonly kind: AggregationName;
  readonly column: string;
  readonly values: Float64Array;
  readonly q: number;
  readonly ddof: number;
  readonly method: QuantileMethod;
}

function editDistance(a: string, b: string): number {
  const d = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let prev = d[0]!;
    d[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const tmp = d[j]!;
      d[j] = Math.min(d[j]! + 1, d[j - 1]! + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = tmp;
    }
  }
  return d[b.length]!;
}

/** @internal Message suffix suggesting the closest valid names. */
export function suggest(received: string, valid: readonly string[]): string {
  const ranked = valid
    .map((v) => ({ v, d: editDistance(received.toLowerCase(), v) }))
    .filter((x) => x.d <= Math.max(2, Math.floor(received.length / 2)))
    .sort((x, y) => x.d - y.d)
    .slice(0, 3)
    .map((x) => `"${x.v}"`);
  return ranked.length > 0 ? `; did you mean ${ranked.join(' or ')}?` : '';
}

/**
 * Validates aggregations against a series (and an allowed subset), naming the path of the first fault.
 * @internal
 */
export function compileAggregations(
  series: Series,
  list: readonly Aggregation[] | Aggregation | undefined,
  path: string,
  allowed: readonly AggregationName[] = AGGREGATION_NAMES,
  defaultColumn?: string,
): CompiledAggregation[] {
  if (list === undefined) {
    throw new KalendsTypeError(`${path}: expected a list of aggregations (${allowed.join(', ')}), got undefined`, {
      code: 'invalid-type',
      received: list,
    });
  }
  const items = Array.isArray(list) ? (list as readonly Aggregation[]) : [list as Aggregation];
  if (items.length === 0) {
    throw new KalendsRangeError(`${path}: expected at least one aggregation (${allowed.join(', ')}), got none`, {
      code: 'out-of-range',
      received: list,
    });
  }
  const out: CompiledAggregation[] = [];
  const names = new Set<string>();
  items.forEach((item, i) => {
    const p = `${path}[${i}]`;
    const spec: AggregationSpec = typeof item === 'string' ? { kind: item } : item;
    if (spec === null || typeof spec !== 'object') {
      throw new KalendsTypeError(`${p}: expected an aggregation name or { kind, ... }, got ${describeValue(item)}`, {
        code: 'invalid-type',
        received: item,
      });
    }
    const kind = spec.kind;
    if (typeof kind !== 'string' || !allowed.includes(kind)) {
      const shown = typeof kind === 'string' ? kind : '';
      throw new KalendsRangeError(
        `${p}: unknown aggregation ${describeValue(kind)}; valid names are ${allowed.join(', ')}${suggest(shown, allowed)}`,
        { code: 'out-of-range', received: kind, path: p },
      );
    }
    let q = Number.NaN;
    if (kind === 'quantile') {
      if (typeof spec.q !== 'number' || !(spec.q >= 0 && spec.q <= 1)) {
        throw new KalendsRangeError(`${p}.q: expected a probability from 0 to 1, got ${describeValue(spec.q)}`, {
          code: 'out-of-range',
          received: spec.q,
          path: `${p}.q`,
        });
      }
      q = spec.q;
    } else if (kind === 'median') q = 0.5;
    const estimator = spec.estimator ?? 'sample';
    if (estimator !== 'sample' && estimator !== 'population') {
      throw new KalendsRangeError(`${p}.estimator: expected "sample" or "population", got ${describeValue(estimator)}`, {
        code: 'out-of-range',
        received: estimator,
        path: `${p}.estimator`,
      });
    }
    const method = spec.quantileMethod ?? 'hyndman-fan-7';
    if (method !== 'hyndman-fan-7' && method !== 'hyndman-fan-6') {
      throw new KalendsRangeError(
        `${p}.quantileMethod: expected "hyndman-fan-7" or "hyndman-fan-6", got ${describeValue(method)}`,
        { code: 'out-of-range', received: method, path: `${p}.quantileMethod` },
      );
    }
    const column = spec.column ?? defaultColumn ?? series.columnNames[0];
    const values = columnOfSeries(series, column);
    const base = kind === 'quantile' ? `quantile-${q}` : kind;
    const name = spec.as ?? (spec.column !== undefined && series.columnNames.length > 1 ? `${spec.column}-${base}` : base);
    if (names.has(name)) {
      throw new KalendsRangeError(`${p}: output column ${describeValue(name)} is produced twice; give one an "as" name`, {
        code: 'out-of-range',
        received: name,
        path: p,
      });
    }
    names.add(name);
    out.push({ name, kind, column: column!, values, q, ddof: estimator === 'sample' ? 1 : 0, method });
  });
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

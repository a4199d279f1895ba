/**
 * Incremental bucketing for streams: rows arrive one at a time, in any order, and each period keeps a small
 * accumulator. Used by the CLI; gives the same table as {@link bucketSeries} on the same rows (variance by
 * Welford's update instead of two passes, equal to rounding).
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../bounds.js';
import { type Aggregation, type AggregationName, compileAggregations } from './aggregate.js';
import { type BucketTable, type EmptyPolicy, type MissingPolicy, type PeriodRange, MAX_BUCKET_PERIODS, assembleBucketTable } from './bucket.js';
import { type UnitInput, type ZoneInput, ordinalAt, requireUnit, resolveZone } from './deps.js';
import { quantileOfSorted } from './numeric.js';
import { makeSeries } from './series.js';

/** Options of {@link defineBucketAccumulator}. */
export interface BucketAccumulatorOptions {
  readonly unit: UnitInput;
  readonly zone: ZoneInput;
  /** Aggregations of the single value column (names or specs without `column`). */
  readonly aggregations: readonly Aggregation[];
  readonly missing?: MissingPolicy;
}

/** A streaming bucketer: `add` rows in any order, then `finish`. */
export interface BucketAccumulator {
  /** Adds one row. `value` NaN means missing. Throws for a NaN or out-of-range instant. */
  add(epochMs: number, value: number): void;
  /** Rows added so far. */
  readonly rows: number;
  /** The table so far (periods ascending). `range` and `empty` work as in bucketSeries. */
  finish(options?: { readonly range?: PeriodRange; readonly empty?: EmptyPolicy }): BucketTable;
}

interface Acc {
  rows: number;
  count: number;
  s: number;
  c: number;
  min: number;
  max: number;
  firstT: number;
  first: number;
  lastT: number;
  last: number;
  mean: number;
  m2: number;
  values: number[] | undefined;
}

/**
 * A streaming bucketer for rows that arrive one at a time and in any order: each period holds a constant-size
 * accumulator (plus its values when a median or quantile is asked for). `first`/`last` are the values at the
 * earliest/latest instant (ties: the earlier/later added row).
 *
 * @example
 * ```ts
 * const acc = defineBucketAccumulator({ unit: 'month', zone: 'America/Chicago', aggregations: ['sum', 'count'] });
 * acc.add(Date.parse('2025-03-02T15:00Z'), 12.5);
 * acc.finish().labels; // ['2025-03']
 * ```
 */
export function defineBucketAccumulator(options: BucketAccumulatorOptions): BucketAccumulator {
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected { unit, zone, aggregations }, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const unit = requireUnit(options.unit, 'options.unit');
  const zone = resolveZone(options.zone, 'options.zone');
  const dummy = makeSeries(new Float64Array(0), ['value'], [new Float64Array(0)]);
  const aggs = compileAggregations(dummy, options.aggregations, 'options.aggregations');
  const propagate = (options.missing ?? 'skip') === 'propagate';
  if (!propagate && options.missing !== undefined && options.missing !== 'skip') {
    throw new KalendsRangeError(`options.missing: expected "skip" or "propagate", got ${describeValue(options.missing)}`, {
      code: 'out-of-range',
      received: options.missing,
    });
  }
  const keepValues = aggs.some((a) => a.kind === 'median' || a.kind === 'quantile');
  const accs = new Map<number, Acc>();
  let rows = 0;
  let skipped = 0;

  function add(epochMs: number, value: number): void {
    if (typeof epochMs !== 'number' || !(epochMs >= MIN_EPOCH_MS && epochMs <= MAX_EPOCH_MS)) {
      throw new KalendsRangeError(`epochMs: expected an instant in epoch ms, got ${describeValue(epochMs)}`, {
        code: 'out-of-range',
        received: epochMs,
      });
    }
    if (typeof value !== 'number') {
      throw new KalendsTypeError(`value: expected a number (NaN for missing), got ${describeValue(value)}`, {
        code: 'invalid-type',
        received: value,
      });
    }
    const o = ordinalAt(unit, zone, epochMs);
    let a = accs.get(o);
    if (!a) {
      a = { rows: 0, count: 0, s: 0, c: 0, min: NaN, max: NaN, firstT: Infinity, first: NaN, lastT: -Infinity, last: NaN, mean: 0, m2: 0, values: keepValues ? [] : undefined };
      accs.set(o, a);
    }
    rows++;
    a.rows++;
    const valid = value === value;
    if (valid || propagate) {
      if (epochMs < a.firstT) {
        a.firstT = epochMs;
        a.first = value;
      }
      if (epochMs >= a.lastT) {
        a.lastT = epochMs;
        a.last = value;
      }
    }
    if (!valid) {
      skipped++;
      return;
    }
    a.count++;
    const t = a.s + value;
    if (Math.abs(a.s) >= Math.abs(value)) a.c += a.s - t + value;
    else a.c += value - t + a.s;
    a.s = t;
    if (!(value >= a.min)) a.min = value;
    if (!(value <= a.max)) a.max = value;
    const d = value - a.mean;
    a.mean += d / a.count;
    a.m2 += d * (value - a.mean);
    a.values?.push(value);
  }

  function valueOf(kind: AggregationName, a: Acc, q: number, ddof: number, method: 'hyndman-fan-7' | 'hyndman-fan-6'): number {
    if (propagate && a.count < a.rows && kind !== 'count' && kind !== 'rows' && kind !== 'first' && kind !== 'last' && kind !== 'open' && kind !== 'close') {
      return NaN;
    }
    switch (kind) {
      case 'count':
        return a.count;
      case 'rows':
        return a.rows;
      case 'sum':
        return a.s - a.s === 0 ? a.s + a.c : a.s;
      case 'mean':
        return a.count > 0 ? (a.s - a.s === 0 ? a.s + a.c : a.s) / a.count : NaN;
      case 'min':
      case 'low':
        return a.min;
      case 'max':
      case 'high':
        return a.max;
      case 'first':
      case 'open':
        return a.first;
      case 'last':
      case 'close':
        return a.last;
      case 'variance':
      case 'stddev': {
        const v = a.count > ddof ? Math.max(0, a.m2) / (a.count - ddof) : NaN;
        return kind === 'variance' ? v : Math.sqrt(v);
      }
      case 'median':
      case 'quantile': {
        const s = Float64Array.from(a.values ?? []).sort();
        return quantileOfSorted(s, s.length, q, method);
      }
    }
  }

  function finish(opts: { readonly range?: PeriodRange; readonly empty?: EmptyPolicy } = {}): BucketTable {
    const empty = opts.empty ?? 'nan';
    let ords = [...accs.keys()].sort((x, y) => x - y);
    let outside = 0;
    let emptyPeriods = 0;
    if (opts.range !== undefined) {
      const r = opts.range;
      const start = typeof r.start === 'string' ? unit.parseOrdinal(r.start) : r.start;
      const end = typeof r.end === 'string' ? unit.parseOrdinal(r.end) : r.end;
      if (!Number.isInteger(start) || !Number.isInteger(end) || end < start || end - start > MAX_BUCKET_PERIODS) {
        throw new KalendsRangeError(`range: expected start <= end within ${MAX_BUCKET_PERIODS} periods, got ${describeValue(r.start)} to ${describeValue(r.end)}`, {
          code: 'out-of-range',
          received: r,
        });
      }
      for (const o of ords) if (o < start || o >= end) outside += accs.get(o)!.rows;
      ords = Array.from({ length: end - start }, (_, i) => start + i);
    }
    const n = ords.length;
    const ordinals = Int32Array.from(ords);
    const rowCounts = new Int32Array(n);
    const cols = aggs.map(() => new Float64Array(n));
    for (let j = 0; j < n; j++) {
      const a = accs.get(ords[j]!);
      if (a) {
        rowCounts[j] = a.rows;
        aggs.forEach((g, k) => {
          cols[k]![j] = valueOf(g.kind, a, g.q, g.ddof, g.method);
        });
      } else {
        emptyPeriods++;
        aggs.forEach((g, k) => {
          cols[k]![j] =
            g.kind === 'count' || g.kind === 'rows' ? 0 : empty === 'zero' ? 0 : empty === 'nan' ? NaN : j > 0 ? cols[k]![j - 1]! : NaN;
        });
      }
    }
    return assembleBucketTable(unit, zone, ordinals, rowCounts, aggs, cols, {
      skippedMissing: propagate ? 0 : skipped,
      outsideRange: outside,
      emptyPeriods,
    });
  }

  return {
    add,
    get rows() {
      return rows;
    },
    finish,
  };
}

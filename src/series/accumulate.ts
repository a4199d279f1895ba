/**
 * Incremental bucketing for streams: rows arrive one at a time, in any order, and each period keeps a small
 * accumulator. Used by the CLI; gives the same table as {@link bucketSeries} on the same rows (variance by
 * Welford's update instead of two passes, equal to rounding).
 *
 * @module
 */
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { Issues, checkKeys, isRecord, joinPath, ownField, readEnum, requireEpochMs } from '../diagnostics/index.js';
import { type Aggregation, type AggregationName, type CompiledAggregation, compileAggregations } from './aggregate.js';
import { type BucketTable, type EmptyPolicy, type MissingPolicy, type PeriodRange, assembleBucketTable, readBucketRange } from './bucket.js';
import { type PeriodUnit, type UnitInput, type Zone, type ZoneInput, periodEdgeError, ordinalAt, requireUnit, resolveZone } from './deps.js';
import { optionOf, readMaxRows, readOptions, requireEnum } from './options.js';
import { quantileOfSorted } from './numeric.js';
import { makeSeries } from './series.js';

/** Options of {@link defineBucketAccumulator}. */
export interface BucketAccumulatorOptions {
  /** The period unit. */
  readonly unit: UnitInput;
  /** The zone whose local days decide which period an instant falls in. */
  readonly zone: ZoneInput;
  /** Aggregations of the single value column (names or specs without `column`). */
  readonly aggregations: readonly Aggregation[];
  /** Missing values: `'skip'` (default) or `'propagate'`. */
  readonly missing?: MissingPolicy;
}

/** A streaming bucketer: `add` rows in any order, then `finish`. */
export interface BucketAccumulator {
  /** Adds one row. `value` NaN means missing. Throws for a NaN or out-of-range instant. */
  add(epochMs: number, value: number): void;
  /** Rows added so far. */
  readonly rows: number;
  /** The table so far (periods ascending). `range`, `empty` and `maxRows` work as in bucketSeries. */
  finish(options?: BucketFinishOptions): BucketTable;
}

/** Options of {@link BucketAccumulator.finish}, as in {@link bucketSeries}. */
export interface BucketFinishOptions {
  /** Periods to report, end-exclusive. */
  readonly range?: PeriodRange;
  /** Empty periods inside `range`: `'nan'` (default), `'zero'` or `'previous'`. */
  readonly empty?: EmptyPolicy;
  /** The most periods `range` may hold. */
  readonly maxRows?: number;
}

const EMPTY_POLICIES: readonly EmptyPolicy[] = ['nan', 'zero', 'previous'];

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

const ACCUMULATOR_KEYS = ['unit', 'zone', 'aggregations', 'missing'];
const MISSING_POLICIES: readonly MissingPolicy[] = ['skip', 'propagate'];

/**
 * The series options validator of {@link defineBucketAccumulator}: like every `define…` function it reports
 * every fault of the definition at once, each with its path, in one DefinitionError (the kit's issue collector).
 */
function readAccumulatorDefinition(definition: unknown): { unit: PeriodUnit; zone: Zone; aggs: CompiledAggregation[]; propagate: boolean } {
  if (!isRecord(definition)) {
    throw new KalendsTypeError(`options: expected { unit, zone, aggregations, missing? }, got ${describeValue(definition)}`, {
      code: 'invalid-type',
      received: definition,
    });
  }
  const issues = new Issues();
  checkKeys(definition, ACCUMULATOR_KEYS, '', issues);
  const unit = collect(issues, 'unit', () => requireUnit(ownField(definition, 'unit'), 'unit'));
  const zone = collect(issues, 'zone', () => resolveZone(ownField(definition, 'zone') as ZoneInput, 'zone'));
  // A one-column series with no rows: the accumulator's single value column, validated like bucketSeries's.
  const dummy = makeSeries(new Float64Array(0), ['value'], [new Float64Array(0)]);
  const list = ownField(definition, 'aggregations');
  let aggs: CompiledAggregation[] | undefined;
  if (Array.isArray(list) && list.length > 0) {
    // Each aggregation on its own, so that every faulty one is reported.
    const each = list.map((item, i) => collect(issues, `aggregations[${i}]`, () => compileAggregations(dummy, item, `aggregations[${i}]`)[0]!));
    if (each.every((a) => a !== undefined)) aggs = collect(issues, 'aggregations', () => compileAggregations(dummy, list, 'aggregations'));
  } else aggs = collect(issues, 'aggregations', () => compileAggregations(dummy, list, 'aggregations'));
  const missing = readEnum(definition, 'missing', 'missing', MISSING_POLICIES, issues, 'skip');
  issues.throwIfAny(definition);
  return { unit: unit!, zone: zone!, aggs: aggs!, propagate: missing === 'propagate' };
}

/**
 * Runs one check that throws a kalends error and records the error as an issue instead (a definition error's
 * issues each under `path`), so that one DefinitionError lists every fault. Returns undefined after a fault.
 */
function collect<T>(issues: Issues, path: string, check: () => T): T | undefined {
  try {
    return check();
  } catch (e) {
    if (e instanceof DefinitionError) {
      // A unit definition's own faults, under `unit` (an unknown unit name has no field of its own).
      for (const i of e.issues) issues.add(i.path === '' || i.path.startsWith('(') ? path : joinPath(path, i.path), i.message);
    } else if (e instanceof KalendsRangeError || e instanceof KalendsTypeError || e instanceof KalendsSyntaxError) {
      // The message starts with the path of the field at fault, at or below `path`.
      const named = /^([^\s:]+): /.exec(e.message)?.[1];
      const at = named !== undefined && named.startsWith(path) ? named : path;
      issues.add(at, e.message.startsWith(`${at}: `) ? e.message.slice(at.length + 2) : e.message);
    } else throw e;
    return undefined;
  }
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
  const { unit, zone, aggs, propagate } = readAccumulatorDefinition(options);
  const keepValues = aggs.some((a) => a.kind === 'median' || a.kind === 'quantile');
  const accs = new Map<number, Acc>();
  let rows = 0;
  let skipped = 0;

  function add(epochMs: number, value: number): void {
    requireEpochMs('epochMs', epochMs);
    if (typeof value !== 'number') {
      throw new KalendsTypeError(`value: expected a number (NaN for missing), got ${describeValue(value)}`, {
        code: 'invalid-type',
        received: value,
      });
    }
    let o: number;
    try {
      o = ordinalAt(unit, zone, epochMs);
    } catch (e) {
      throw periodEdgeError(e, 'epochMs', unit, zone);
    }
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

  function finish(options?: BucketFinishOptions): BucketTable {
    const o = readOptions('options', options, ['range', 'empty', 'maxRows']);
    const empty = requireEnum('options.empty', optionOf(o, 'empty'), EMPTY_POLICIES, 'nan');
    const maxRows = readMaxRows('options.maxRows', optionOf(o, 'maxRows'));
    let ords = [...accs.keys()].sort((x, y) => x - y);
    let outside = 0;
    let emptyPeriods = 0;
    if (optionOf(o, 'range') !== undefined) {
      const { start, end } = readBucketRange('options.range', optionOf(o, 'range'), unit, maxRows);
      for (const k of ords) if (k < start || k >= end) outside += accs.get(k)!.rows;
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
    try {
      return assembleBucketTable(unit, zone, ordinals, rowCounts, aggs, cols, {
        skippedMissing: propagate ? 0 : skipped,
        outsideRange: outside,
        emptyPeriods,
      });
    } catch (e) {
      throw periodEdgeError(e, optionOf(o, 'range') === undefined ? 'epochMs' : 'options.range', unit, zone);
    }
  }

  return {
    add,
    get rows() {
      return rows;
    },
    finish,
  };
}

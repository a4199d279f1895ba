/**
 * As-of joins (for each time of one series, the latest value of another at or before it) and alignment of
 * several series on one period index.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type Aggregation } from './aggregate.js';
import { type BucketTable, type PeriodRange, bucketSeries } from './bucket.js';
import { type PeriodUnit, type UnitInput, type Zone, type ZoneInput, periodStartMs, requireUnit, resolveZone } from './deps.js';
import { type Series, makeSeries, requireSeries } from './series.js';

/** Options of {@link matchAsOf} and {@link joinAsOf}. */
export interface AsOfOptions {
  /** Largest allowed distance back in time, in ms (>= 0). Without it, any earlier row matches. */
  readonly toleranceMs?: number;
}

function readTolerance(v: unknown): number {
  if (v === undefined) return Infinity;
  if (typeof v !== 'number' || Number.isNaN(v) || v < 0) {
    throw new KalendsRangeError(`options.toleranceMs: expected a non-negative number of milliseconds, got ${describeValue(v)}`, {
      code: typeof v === 'number' ? 'out-of-range' : 'invalid-type',
      received: v,
    });
  }
  return v;
}

function requireSortedTimes(a: ArrayLike<number>, name: string): void {
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    if (typeof x !== 'number' || Number.isNaN(x)) {
      throw new KalendsRangeError(`${name}[${i}]: expected an instant in epoch ms, got ${describeValue(x)}`, {
        code: 'out-of-range',
        received: x,
      });
    }
    if (i > 0 && x < a[i - 1]!) {
      throw new KalendsRangeError(`${name}: expected ascending instants, but [${i}] (${x}) comes before [${i - 1}] (${a[i - 1]})`, {
        code: 'unsorted',
        received: x,
        path: `${name}[${i}]`,
      });
    }
  }
}

/**
 * For each left instant, the index of the last right instant at or before it (within `toleranceMs`), or -1.
 * Both arrays must be ascending. One merge pass: O(n + m). Among equal right instants, the last row wins.
 *
 * @example
 * ```ts
 * matchAsOf([5, 10, 20], [0, 10, 11]);                    // Int32Array [0, 1, 2]
 * matchAsOf([5, 10, 20], [0, 10, 11], { toleranceMs: 4 }); // Int32Array [-1, 1, -1]
 * ```
 */
export function matchAsOf(leftEpochMs: ArrayLike<number>, rightEpochMs: ArrayLike<number>, options: AsOfOptions = {}): Int32Array {
  requireSortedTimes(leftEpochMs, 'leftEpochMs');
  requireSortedTimes(rightEpochMs, 'rightEpochMs');
  return matchSorted(leftEpochMs, rightEpochMs, readTolerance(options.toleranceMs), undefined);
}

/** @internal As-of merge; with `valid`, only right rows whose value is not NaN qualify. */
function matchSorted(left: ArrayLike<number>, right: ArrayLike<number>, tol: number, valid: Float64Array | undefined): Int32Array {
  const n = left.length;
  const m = right.length;
  const out = new Int32Array(n);
  let j = 0; // right rows [0, j) are at or before the current left instant
  let lastValid = -1;
  for (let i = 0; i < n; i++) {
    const x = left[i]!;
    while (j < m && right[j]! <= x) {
      if (valid === undefined || valid[j] === valid[j]) lastValid = j;
      j++;
    }
    out[i] = lastValid >= 0 && x - right[lastValid]! <= tol ? lastValid : -1;
  }
  return out;
}

/** Options of {@link joinAsOf}. */
export interface JoinAsOfOptions extends AsOfOptions {
  /** Right columns to bring over (default: all). */
  readonly columns?: readonly string[];
  /** Prefix for the right columns' names in the result (default none; a name clash throws). */
  readonly prefix?: string;
}

/**
 * The left series with, for each of its rows, the latest non-missing value of each right column at or before
 * that row's time (within `toleranceMs`), or NaN. Each column is matched on its own, so a missing right value
 * falls back to the latest earlier one. O(n + m) per column.
 *
 * @example
 * ```ts
 * const priced = joinAsOf(orders, prices, { toleranceMs: 86_400_000, prefix: 'price.' });
 * ```
 */
export function joinAsOf(left: Series, right: Series, options: JoinAsOfOptions = {}): Series {
  requireSeries(left, 'left');
  requireSeries(right, 'right');
  const tol = readTolerance(options.toleranceMs);
  const prefix = options.prefix ?? '';
  const cols = options.columns ?? right.columnNames;
  const names = [...left.columnNames];
  const values = left.columnNames.map((c) => left.columns[c]!);
  for (const c of cols) {
    const rv = right.columns[c];
    if (rv === undefined) {
      throw new KalendsRangeError(`options.columns: right has no column ${describeValue(c)}; it has ${right.columnNames.join(', ')}`, {
        code: 'out-of-range',
        received: c,
      });
    }
    const name = prefix + c;
    if (names.includes(name)) {
      throw new KalendsRangeError(`joinAsOf: column ${describeValue(name)} is in both series; pass a prefix such as "right."`, {
        code: 'out-of-range',
        received: name,
      });
    }
    const idx = matchSorted(left.epochMs, right.epochMs, tol, rv);
    const out = new Float64Array(left.length);
    for (let i = 0; i < out.length; i++) out[i] = idx[i]! >= 0 ? rv[idx[i]!]! : Number.NaN;
    names.push(name);
    values.push(out);
  }
  return makeSeries(left.epochMs, names, values);
}

/** Options of {@link alignSeries}. */
export interface AlignOptions {
  readonly unit: UnitInput;
  readonly zone: ZoneInput;
  /** How each series is reduced per period (default `'last'`). */
  readonly aggregation?: Aggregation;
  /** Periods to report (end-exclusive). Default: every period from the earliest to the latest holding a row. */
  readonly range?: PeriodRange;
}

/** Several series on one period index: one column per input series, NaN where a series has no rows. */
export interface AlignedTable {
  readonly unit: PeriodUnit;
  readonly zone: Zone;
  readonly ordinals: Int32Array;
  readonly labels: readonly string[];
  readonly startEpochMs: Float64Array;
  readonly endEpochMs: Float64Array;
  readonly columns: Readonly<Record<string, Float64Array>>;
  readonly columnNames: readonly string[];
  readonly length: number;
}

/**
 * Aligns named series on the periods of one unit: each is reduced per period with `aggregation` (of its first
 * column) and placed in one table whose rows are consecutive periods.
 *
 * @example
 * ```ts
 * const t = alignSeries({ tea: teaSales, spice: spiceSales }, { unit: MONTH_UNIT, zone: 'America/Chicago', aggregation: 'sum' });
 * t.columns.tea; t.columns.spice; // one value per month
 * ```
 */
export function alignSeries(series: Readonly<Record<string, Series>>, options: AlignOptions): AlignedTable {
  if (series === null || typeof series !== 'object') {
    throw new KalendsTypeError(`series: expected an object of named series, got ${describeValue(series)}`, {
      code: 'invalid-type',
      received: series,
    });
  }
  const unit = requireUnit(options?.unit, 'options.unit');
  const zone = resolveZone(options.zone, 'options.zone');
  const names = Object.keys(series);
  if (names.length === 0) {
    throw new KalendsRangeError('series: expected at least one named series, got none', { code: 'out-of-range', received: series });
  }
  const agg = options.aggregation ?? 'last';
  const tables: BucketTable[] = names.map((name) => {
    requireSeries(series[name], `series.${name}`);
    return bucketSeries(series[name]!, {
      unit,
      zone,
      aggregations: [agg],
      ...(options.range ? { range: options.range } : {}),
    });
  });
  let start: number;
  let end: number;
  if (options.range) {
    start = tables[0]!.ordinals[0] ?? 0;
    end = start + tables[0]!.length;
  } else {
    start = Infinity;
    end = -Infinity;
    for (const t of tables) {
      if (t.length === 0) continue;
      start = Math.min(start, t.ordinals[0]!);
      end = Math.max(end, t.ordinals[t.length - 1]! + 1);
    }
    if (start === Infinity) {
      start = 0;
      end = 0;
    }
  }
  const m = end - start;
  const ordinals = new Int32Array(m);
  const startEpochMs = new Float64Array(m);
  const endEpochMs = new Float64Array(m);
  const labels: string[] = [];
  for (let j = 0; j < m; j++) {
    ordinals[j] = start + j;
    startEpochMs[j] = j > 0 ? endEpochMs[j - 1]! : periodStartMs(unit, zone, start);
    endEpochMs[j] = periodStartMs(unit, zone, start + j + 1);
    labels.push(unit.formatOrdinal(start + j));
  }
  const columns: Record<string, Float64Array> = Object.create(null) as Record<string, Float64Array>;
  names.forEach((name, k) => {
    const t = tables[k]!;
    const col = new Float64Array(m).fill(Number.NaN);
    const src = t.columns[t.columnNames[0]!]!;
    for (let i = 0; i < t.length; i++) col[t.ordinals[i]! - start] = src[i]!;
    columns[name] = col;
  });
  return Object.freeze({
    unit,
    zone,
    ordinals,
    labels: Object.freeze(labels),
    startEpochMs,
    endEpochMs,
    columns: Object.freeze(columns),
    columnNames: Object.freeze(names),
    length: m,
  });
}

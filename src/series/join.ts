/**
 * As-of joins (for each time of one series, the latest value of another at or before it) and alignment of
 * several series on one period index.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import type { MAX_BUCKET_PERIODS, MAX_SERIES_ROWS } from '../bounds.js';
import { isRecord } from '../diagnostics/index.js';
import { type Aggregation, compileAggregations } from './aggregate.js';
import { type BucketRows, type PeriodRange, bucketRows, periodBounds, readBucketRange } from './bucket.js';
import { type PeriodUnit, type UnitInput, type Zone, type ZoneInput, periodEdgeError, requireUnit, resolveZone } from './deps.js';
import { optionOf, readMaxRows, readOptions, requireColumnName, requireRowsWithin, requireToleranceMs } from './options.js';
import { type Series, columnNamed, instantsFromArray, makeSeries, readColumnList, requireSeries } from './series.js';

/** Options of {@link matchAsOf} and {@link joinAsOf}. */
export interface AsOfOptions {
  /** Largest allowed distance back in time, in ms (>= 0). Without it, any earlier row matches. */
  readonly toleranceMs?: number;
}

/** Ascending instants given as an array of numbers: copied, checked once (a non-number named by its index). */
function sortedInstants(name: string, value: unknown): Float64Array {
  const a = instantsFromArray(name, value);
  for (let i = 1; i < a.length; i++) {
    if (a[i]! < a[i - 1]!) {
      throw new KalendsRangeError(`${name}: expected ascending instants, but [${i}] (${a[i]}) comes before [${i - 1}] (${a[i - 1]})`, {
        code: 'unsorted',
        received: a[i],
        path: `${name}[${i}]`,
      });
    }
  }
  return a;
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
export function matchAsOf(leftEpochMs: ArrayLike<number>, rightEpochMs: ArrayLike<number>, options?: AsOfOptions): Int32Array {
  const left = sortedInstants('leftEpochMs', leftEpochMs);
  const right = sortedInstants('rightEpochMs', rightEpochMs);
  const o = readOptions('options', options, ['toleranceMs']);
  return matchSorted(left, right, requireToleranceMs('options.toleranceMs', optionOf(o, 'toleranceMs')), undefined);
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
export function joinAsOf(left: Series, right: Series, options?: JoinAsOfOptions): Series {
  requireSeries(left, 'left');
  requireSeries(right, 'right');
  const o = readOptions('options', options, ['toleranceMs', 'columns', 'prefix']);
  const tol = requireToleranceMs('options.toleranceMs', optionOf(o, 'toleranceMs'));
  const prefix = optionOf(o, 'prefix') === undefined ? '' : requireColumnName('options.prefix', optionOf(o, 'prefix'));
  const cols = readColumnList('options.columns', optionOf(o, 'columns'), right);
  const names = [...left.columnNames];
  const values = left.columnNames.map((c) => left.columns[c]!);
  for (const [i, c] of cols.entries()) {
    const rv = columnNamed(right, c, `options.columns[${i}]`);
    const name = prefix + c;
    if (names.includes(name)) {
      throw new KalendsRangeError(`options.prefix: column ${describeValue(name)} is in both series; pass a prefix such as "right."`, {
        code: 'out-of-range',
        received: name,
        path: 'options.prefix',
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
  /** The period unit. */
  readonly unit: UnitInput;
  /** The zone whose local days decide which period an instant falls in. */
  readonly zone: ZoneInput;
  /** How each series is reduced per period (default `'last'`). */
  readonly aggregation?: Aggregation;
  /** Periods to report (end-exclusive). Default: every period from the earliest to the latest holding a row. */
  readonly range?: PeriodRange;
  /**
   * The most periods the table may hold: default {@link MAX_SERIES_ROWS} (one million), at most
   * {@link MAX_BUCKET_PERIODS}. More is refused with `limit-exceeded` before the table is built.
   */
  readonly maxRows?: number;
}

/** Several series on one period index: one column per input series, NaN where a series has no rows. */
export interface AlignedTable {
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
  /** One column per input series, by name. */
  readonly columns: Readonly<Record<string, Float64Array>>;
  /** The names of `columns`, in the order of the input series. */
  readonly columnNames: readonly string[];
  /** Number of periods. */
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
  if (!isRecord(series)) {
    throw new KalendsTypeError(`series: expected an object of named series such as { tea: teaSales }, got ${describeValue(series)}`, {
      code: 'invalid-type',
      received: series,
    });
  }
  const o = readOptions('options', options, ['unit', 'zone', 'aggregation', 'range', 'maxRows']);
  const unit = requireUnit(optionOf(o, 'unit'), 'options.unit');
  const zone = resolveZone(optionOf(o, 'zone') as ZoneInput, 'options.zone');
  const names = Object.keys(series);
  if (names.length === 0) {
    throw new KalendsRangeError('series: expected at least one named series, got none', { code: 'out-of-range', received: series });
  }
  const agg = optionOf(o, 'aggregation') ?? 'last';
  if (Array.isArray(agg)) {
    throw new KalendsTypeError(`options.aggregation: expected one aggregation (a name or { kind, ... }), got ${describeValue(agg)}`, {
      code: 'invalid-type',
      received: agg,
    });
  }
  const maxRows = readMaxRows('options.maxRows', optionOf(o, 'maxRows'));
  const range = optionOf(o, 'range') === undefined ? undefined : readBucketRange('options.range', optionOf(o, 'range'), unit, maxRows);
  const compiled = names.map((name) => {
    const s = series[name];
    requireSeries(s, `series.${name}`);
    return compileAggregations(s, agg, 'options.aggregation');
  });
  const edge = range === undefined ? 'series' : 'options.range';
  let tables: BucketRows[];
  try {
    tables = names.map((name, k) => bucketRows(series[name]!.epochMs, unit, zone, compiled[k]!, range, 'nan', false));
  } catch (e) {
    throw periodEdgeError(e, edge, unit, zone);
  }
  let start: number;
  let end: number;
  if (range !== undefined) {
    start = range.start;
    end = range.end;
  } else {
    start = Infinity;
    end = -Infinity;
    for (const t of tables) {
      const k = t.ordinals.length;
      if (k === 0) continue;
      start = Math.min(start, t.ordinals[0]!);
      end = Math.max(end, t.ordinals[k - 1]! + 1);
    }
    if (start === Infinity) {
      start = 0;
      end = 0;
    }
    requireRowsWithin(
      'series',
      end - start,
      maxRows,
      `aligning periods ${unit.formatOrdinal(start)} to ${unit.formatOrdinal(end - 1)} of unit ${unit.id}`,
      'options.maxRows',
    );
  }
  const m = end - start;
  const ordinals = new Int32Array(m);
  for (let j = 0; j < m; j++) ordinals[j] = start + j;
  let bounds: ReturnType<typeof periodBounds>;
  try {
    bounds = periodBounds(unit, zone, ordinals);
  } catch (e) {
    throw periodEdgeError(e, edge, unit, zone);
  }
  const columns: Record<string, Float64Array> = Object.create(null) as Record<string, Float64Array>;
  names.forEach((name, k) => {
    const t = tables[k]!;
    const col = new Float64Array(m).fill(Number.NaN);
    const src = t.columns[0]!;
    for (let i = 0; i < t.ordinals.length; i++) col[t.ordinals[i]! - start] = src[i]!;
    columns[name] = col;
  });
  return Object.freeze({
    unit,
    zone,
    ordinals,
    labels: Object.freeze(bounds.labels),
    startEpochMs: bounds.startEpochMs,
    endEpochMs: bounds.endEpochMs,
    columns: Object.freeze(columns),
    columnNames: Object.freeze(names),
    length: m,
  });
}

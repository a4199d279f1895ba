/**
 * The series value: a sorted Float64Array of instants (epoch ms) and named Float64Array value columns, where
 * NaN means missing. Constructors copy and validate their input; the returned object is frozen, and its typed
 * arrays must be treated as read-only (JavaScript cannot freeze a typed array).
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { toEpochMs } from '../instant/index.js';

/**
 * Columnar time-indexed values. `epochMs` is sorted ascending (duplicates allowed, kept in input order); every
 * column has `length` entries; NaN in a column means "missing".
 */
export interface Series {
  /** Instants in epoch milliseconds, ascending. Read-only by contract. */
  readonly epochMs: Float64Array;
  /** Value columns by name, each of `length` entries. Read-only by contract. */
  readonly columns: Readonly<Record<string, Float64Array>>;
  /** Column names in order; the first is the default column of every operation. */
  readonly columnNames: readonly string[];
  /** Number of rows. */
  readonly length: number;
}

/**
 * How a constructor treats the order of its input. `'any'` (the default) sorts stably by time (rows with equal
 * times keep their input order); `'sorted'` promises ascending input and throws a `KalendsRangeError` with code
 * `'unsorted'` naming the first row out of order.
 */
export type InputOrder = 'any' | 'sorted';

/** Options shared by the series constructors. */
export interface SeriesOptions {
  /** `'any'` (default): sort stably. `'sorted'`: reject unsorted input instead. */
  readonly inputOrder?: InputOrder;
}

/** Options of {@link seriesFromRecords}. */
export interface RecordOptions extends SeriesOptions {
  /** Field holding the instant (default `'at'`). */
  readonly at?: string;
  /**
   * Value columns to read: a list of field names (each becomes a column of the same name), or a map from
   * column name to field name. Default: the single field `'value'`.
   */
  readonly columns?: readonly string[] | Readonly<Record<string, string>>;
}

/** Options of {@link seriesFromPairs}. */
export interface PairOptions extends SeriesOptions {
  /** Name of the value column (default `'value'`). */
  readonly column?: string;
}

/** The instant held by a record or pair: epoch ms, or anything the instant layer's `toEpochMs` accepts. */
export type InstantLike = number | string | Date | object;

function coerceInstant(value: unknown, name: string): number {
  if (typeof value === 'number') {
    if (Number.isNaN(value)) {
      throw new KalendsRangeError(`${name}: expected an instant (finite epoch ms), got NaN; remove or fill the row`, {
        code: 'out-of-range',
        received: value,
      });
    }
    if (!(value >= MIN_EPOCH_MS && value <= MAX_EPOCH_MS)) {
      throw new KalendsRangeError(
        `${name}: expected epoch ms from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(value)}`,
        { code: 'out-of-range', received: value },
      );
    }
    return value;
  }
  if (typeof toEpochMs !== 'function') {
    throw new KalendsTypeError(`${name}: expected epoch ms as a number, got ${describeValue(value)}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  try {
    return toEpochMs(value as never);
  } catch (e) {
    if (e instanceof Error) e.message = `${name}: ${e.message}`;
    throw e;
  }
}

function coerceValue(value: unknown, name: string): number {
  if (typeof value === 'number') return value;
  if (value === null || value === undefined) return Number.NaN;
  throw new KalendsTypeError(`${name}: expected a number (or null/undefined for missing), got ${describeValue(value)}`, {
    code: 'invalid-type',
    received: value,
  });
}

function requireColumnName(name: unknown, where: string): string {
  if (typeof name !== 'string' || name === '') {
    throw new KalendsTypeError(`${where}: expected a non-empty column name, got ${describeValue(name)}`, {
      code: 'invalid-type',
      received: name,
    });
  }
  return name;
}

/**
 * Builds a series from parallel arrays: instants and named value columns. The inputs are copied. Throws
 * `length-mismatch` when a column's length differs from the instants', `out-of-range` for a NaN instant (naming
 * its index), and `unsorted` when `inputOrder: 'sorted'` was promised but broken.
 *
 * @example
 * ```ts
 * const s = seriesFromColumns([3000, 1000, 2000], { kg: [3, 1, 2] });
 * Array.from(s.columns.kg!); // [1, 2, 3]
 * ```
 */
export function seriesFromColumns(
  epochMs: ArrayLike<number>,
  columns: Readonly<Record<string, ArrayLike<number>>>,
  options: SeriesOptions = {},
): Series {
  const order = readInputOrder(options);
  if (!isArrayLike(epochMs)) {
    throw new KalendsTypeError(`epochMs: expected an array or typed array of numbers, got ${describeValue(epochMs)}`, {
      code: 'invalid-type',
      received: epochMs,
    });
  }
  if (columns === null || typeof columns !== 'object') {
    throw new KalendsTypeError(`columns: expected an object of named arrays, got ${describeValue(columns)}`, {
      code: 'invalid-type',
      received: columns,
    });
  }
  const n = epochMs.length;
  const times = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = epochMs[i]!;
    times[i] = typeof t === 'number' && t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS ? t : coerceInstant(t, `epochMs[${i}]`);
  }
  const names = Object.keys(columns);
  const cols: Float64Array[] = [];
  for (const name of names) {
    const col = columns[name]!;
    if (!isArrayLike(col)) {
      throw new KalendsTypeError(`columns.${name}: expected an array or typed array, got ${describeValue(col)}`, {
        code: 'invalid-type',
        received: col,
      });
    }
    if (col.length !== n) {
      throw new KalendsRangeError(
        `columns.${name}: expected ${n} values (one per instant), got ${col.length}; every column must match epochMs`,
        { code: 'length-mismatch', received: col.length, path: `columns.${name}` },
      );
    }
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = coerceValue(col[i], `columns.${name}[${i}]`);
    cols.push(out);
  }
  return assemble(times, names, cols, order);
}

/**
 * Builds a series from records such as `{ at, value }`. `at` may be epoch ms or anything the instant layer's
 * `toEpochMs` accepts (an RFC 3339 string, a `Date`, a Temporal instant). A value of `null` or `undefined` is
 * stored as NaN (missing).
 *
 * @example
 * ```ts
 * const s = seriesFromRecords([{ at: 2000, value: 5 }, { at: 1000, value: 4 }]);
 * Array.from(s.epochMs); // [1000, 2000]
 * const t = seriesFromRecords([{ when: 0, kg: 1, eur: 2 }], { at: 'when', columns: ['kg', 'eur'] });
 * t.columnNames; // ['kg', 'eur']
 * ```
 */
export function seriesFromRecords(records: readonly object[], options: RecordOptions = {}): Series {
  const order = readInputOrder(options);
  if (!Array.isArray(records)) {
    throw new KalendsTypeError(`records: expected an array of objects, got ${describeValue(records)}`, {
      code: 'invalid-type',
      received: records,
    });
  }
  const atField = options.at === undefined ? 'at' : requireColumnName(options.at, 'options.at');
  const spec = options.columns ?? ['value'];
  const pairs: [string, string][] = Array.isArray(spec)
    ? (spec as readonly string[]).map((f, i) => [requireColumnName(f, `options.columns[${i}]`), f])
    : Object.entries(spec as Record<string, string>).map(([k, f]) => [k, requireColumnName(f, `options.columns.${k}`)]);
  if (pairs.length === 0) {
    throw new KalendsRangeError('options.columns: expected at least one column, got none', {
      code: 'out-of-range',
      received: spec,
    });
  }
  const n = records.length;
  const times = new Float64Array(n);
  const cols = pairs.map(() => new Float64Array(n));
  for (let i = 0; i < n; i++) {
    const r = records[i] as Record<string, unknown> | null | undefined;
    if (r === null || typeof r !== 'object') {
      throw new KalendsTypeError(`records[${i}]: expected an object, got ${describeValue(r)}`, {
        code: 'invalid-type',
        received: r,
      });
    }
    times[i] = coerceInstant(r[atField], `records[${i}].${atField}`);
    for (let c = 0; c < pairs.length; c++) cols[c]![i] = coerceValue(r[pairs[c]![1]], `records[${i}].${pairs[c]![1]}`);
  }
  return assemble(
    times,
    pairs.map((p) => p[0]),
    cols,
    order,
  );
}

/**
 * Builds a one-column series from `[at, value]` pairs.
 *
 * @example
 * ```ts
 * const s = seriesFromPairs([[1000, 2], [1000, 3]], { column: 'boxes' });
 * Array.from(s.columns.boxes!); // [2, 3] (equal times keep input order)
 * ```
 */
export function seriesFromPairs(pairs: readonly (readonly [InstantLike, number | null])[], options: PairOptions = {}): Series {
  const order = readInputOrder(options);
  if (!Array.isArray(pairs)) {
    throw new KalendsTypeError(`pairs: expected an array of [at, value] pairs, got ${describeValue(pairs)}`, {
      code: 'invalid-type',
      received: pairs,
    });
  }
  const column = options.column === undefined ? 'value' : requireColumnName(options.column, 'options.column');
  const n = pairs.length;
  const times = new Float64Array(n);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = pairs[i];
    if (!Array.isArray(p) || p.length !== 2) {
      throw new KalendsTypeError(`pairs[${i}]: expected an [at, value] pair, got ${describeValue(p)}`, {
        code: 'invalid-type',
        received: p,
      });
    }
    times[i] = coerceInstant(p[0], `pairs[${i}][0]`);
    values[i] = coerceValue(p[1], `pairs[${i}][1]`);
  }
  return assemble(times, [column], [values], order);
}

function readInputOrder(options: SeriesOptions): InputOrder {
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected an object, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const o = options.inputOrder ?? 'any';
  if (o !== 'any' && o !== 'sorted') {
    throw new KalendsRangeError(`options.inputOrder: expected "any" or "sorted", got ${describeValue(o)}`, {
      code: 'out-of-range',
      received: o,
    });
  }
  return o;
}

function isArrayLike(v: unknown): v is ArrayLike<unknown> {
  return Array.isArray(v) || ArrayBuffer.isView(v);
}

/** Index of the first row out of order, or -1. */
function firstUnsorted(times: Float64Array): number {
  for (let i = 1; i < times.length; i++) if (times[i]! < times[i - 1]!) return i;
  return -1;
}

function assemble(times: Float64Array, names: readonly string[], cols: Float64Array[], order: InputOrder): Series {
  const seen = new Set<string>();
  for (const name of names) {
    if (seen.has(name)) {
      throw new KalendsRangeError(`columns: the name ${describeValue(name)} appears twice; column names must be unique`, {
        code: 'out-of-range',
        received: name,
      });
    }
    seen.add(name);
  }
  const bad = firstUnsorted(times);
  if (bad >= 0) {
    if (order === 'sorted') {
      throw new KalendsRangeError(
        `epochMs: expected ascending instants (inputOrder "sorted"), but row ${bad} (${times[bad]}) comes before row ${bad - 1} (${times[bad - 1]}); pass inputOrder "any" to sort`,
        { code: 'unsorted', received: times[bad], path: `epochMs[${bad}]` },
      );
    }
    const perm = stableOrder(times);
    times = gather(times, perm);
    cols = cols.map((c) => gather(c, perm));
  }
  return makeSeries(times, names, cols);
}

/** Stable ascending permutation of `times` (ties keep their index order). */
function stableOrder(times: Float64Array): Uint32Array {
  const n = times.length;
  const perm = new Uint32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  // Typed-array sort with a comparator is stable (ECMA-262 requires stable sort since ES2019).
  perm.sort((a, b) => times[a]! - times[b]! || a - b);
  return perm;
}

function gather(src: Float64Array, perm: Uint32Array): Float64Array {
  const out = new Float64Array(src.length);
  for (let i = 0; i < perm.length; i++) out[i] = src[perm[i]!]!;
  return out;
}

/**
 * @internal Wraps already-validated arrays (sorted times, equal lengths) without copying.
 */
export function makeSeries(times: Float64Array, names: readonly string[], cols: readonly Float64Array[]): Series {
  const columns: Record<string, Float64Array> = Object.create(null) as Record<string, Float64Array>;
  names.forEach((n, i) => {
    columns[n] = cols[i]!;
  });
  return Object.freeze({
    epochMs: times,
    columns: Object.freeze(columns),
    columnNames: Object.freeze([...names]),
    length: times.length,
  });
}

/**
 * The values of one column. Without `name`, the first column. An unknown name throws, listing the valid ones.
 *
 * @example
 * ```ts
 * columnOfSeries(seriesFromPairs([[0, 1]]), 'value'); // Float64Array [1]
 * ```
 */
export function columnOfSeries(series: Series, name?: string): Float64Array {
  requireSeries(series, 'series');
  const key = name ?? series.columnNames[0];
  const col = key === undefined ? undefined : series.columns[key];
  if (col === undefined) {
    const valid = series.columnNames.map((c) => JSON.stringify(c)).join(', ') || '(none)';
    throw new KalendsRangeError(`column: no column named ${describeValue(key)}; valid columns are ${valid}`, {
      code: 'out-of-range',
      received: key,
    });
  }
  return col;
}

/** @internal Throws unless `series` looks like a Series. */
export function requireSeries(series: unknown, name: string): asserts series is Series {
  const s = series as Series | null;
  if (s === null || typeof s !== 'object' || !(s.epochMs instanceof Float64Array) || typeof s.columns !== 'object') {
    throw new KalendsTypeError(`${name}: expected a Series (see seriesFromColumns), got ${describeValue(series)}`, {
      code: 'invalid-type',
      received: series,
    });
  }
}

/**
 * A new series with one more column (or a column replaced). `values` must have one entry per row.
 *
 * @example
 * ```ts
 * const s = withColumn(seriesFromPairs([[0, 1], [1, 2]]), 'double', [2, 4]);
 * s.columnNames; // ['value', 'double']
 * ```
 */
export function withColumn(series: Series, name: string, values: ArrayLike<number>): Series {
  requireSeries(series, 'series');
  requireColumnName(name, 'name');
  if (!isArrayLike(values) || values.length !== series.length) {
    throw new KalendsRangeError(
      `values: expected ${series.length} values (one per row), got ${isArrayLike(values) ? values.length : describeValue(values)}`,
      { code: 'length-mismatch', received: values },
    );
  }
  const col = Float64Array.from(values, (v, i) => coerceValue(v, `values[${i}]`));
  const names = series.columnNames.includes(name) ? series.columnNames : [...series.columnNames, name];
  return makeSeries(
    series.epochMs,
    names,
    names.map((n) => (n === name ? col : series.columns[n]!)),
  );
}

/**
 * The rows whose instants fall in `[startEpochMs, endEpochMs)` (end-exclusive), found by binary search.
 *
 * @example
 * ```ts
 * sliceSeries(seriesFromPairs([[0, 1], [5, 2], [9, 3]]), 0, 9).length; // 2
 * ```
 */
export function sliceSeries(series: Series, startEpochMs: number, endEpochMs: number): Series {
  requireSeries(series, 'series');
  requireFiniteNumber(startEpochMs, 'startEpochMs');
  requireFiniteNumber(endEpochMs, 'endEpochMs');
  const lo = lowerBound(series.epochMs, startEpochMs, 0, series.length);
  const hi = Math.max(lo, lowerBound(series.epochMs, endEpochMs, lo, series.length));
  return makeSeries(
    series.epochMs.slice(lo, hi),
    series.columnNames,
    series.columnNames.map((n) => series.columns[n]!.slice(lo, hi)),
  );
}

/** @internal First index in [from, to) with `a[i] >= x` (or `to`). */
export function lowerBound(a: Float64Array, x: number, from: number, to: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid]! < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** @internal First index in [from, to) with `a[i] > x` (or `to`). */
export function upperBound(a: Float64Array, x: number, from: number, to: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid]! <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** @internal Throws unless `v` is a finite number. */
export function requireFiniteNumber(v: unknown, name: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    const Err = typeof v === 'number' ? KalendsRangeError : KalendsTypeError;
    throw new Err(`${name}: expected a finite number, got ${describeValue(v)}`, {
      code: typeof v === 'number' ? 'out-of-range' : 'invalid-type',
      received: v,
    });
  }
  return v;
}

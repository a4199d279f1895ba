/**
 * The series value: a sorted Float64Array of instants (epoch ms) and named Float64Array value columns, where
 * NaN means missing. Constructors copy and validate their input; the returned object is frozen, and its typed
 * arrays must be treated as read-only (JavaScript cannot freeze a typed array).
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { didYouMean, hasOwn, isRecord, ownField, requireEpochMs, requireNumberArray } from '../diagnostics/index.js';
import { toEpochMs } from './deps.js';
import { type OptionRecord, optionOf, readOptions, requireColumnName, requireEnum } from './options.js';

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
   * column name to field name. Default: the single field `'value'`. An empty list reads the instants alone (a
   * series with no value column, for counting events).
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

const INPUT_ORDERS: readonly InputOrder[] = ['any', 'sorted'];

/** An instant in a record or pair: a number as it is (fractions allowed), anything else through `toEpochMs`. */
function coerceInstant(value: unknown, name: string): number {
  if (typeof value === 'number') return requireInstant(name, value);
  try {
    return toEpochMs(value as never);
  } catch (e) {
    if (e instanceof Error && !e.message.startsWith(name)) e.message = `${name}: ${e.message}`;
    throw e;
  }
}

/** @internal An instant given as a number: within ±8.64e15 ms, fractions allowed; NaN names the fix. */
export function requireInstant(name: string, value: number): number {
  if (value >= MIN_EPOCH_MS && value <= MAX_EPOCH_MS) return value;
  const fix = value !== value ? '; remove or fill the row' : '';
  throw new KalendsRangeError(`${name}: expected an instant in epoch ms from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(value)}${fix}`, {
    code: 'out-of-range',
    received: value,
    path: name,
  });
}

function coerceValue(value: unknown, name: string): number {
  if (typeof value === 'number') return value;
  if (value === null || value === undefined) return Number.NaN;
  throw new KalendsTypeError(`${name}: expected a number (or null/undefined for missing), got ${describeValue(value)}`, {
    code: 'invalid-type',
    received: value,
    path: name,
  });
}

/**
 * @internal Instants given as an array of numbers: a copy in a Float64Array, each within ±8.64e15 ms (fractions
 * allowed); a non-number is named by its index.
 */
export function instantsFromArray(name: string, value: unknown): Float64Array {
  const a = requireNumberArray(name, value);
  const n = a.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = a[i]!;
    out[i] = t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS ? t : requireInstant(`${name}[${i}]`, t);
  }
  return out;
}

/** @internal A value column given as an array of numbers (NaN for missing), copied into a Float64Array of `n`. */
export function columnFromArray(name: string, value: unknown, n: number): Float64Array {
  const a = requireNumberArray(name, value);
  if (a.length !== n) {
    throw new KalendsRangeError(`${name}: expected ${n} values (one per instant), got ${a.length}; every column must match the instants`, {
      code: 'length-mismatch',
      received: a.length,
      path: name,
    });
  }
  return Float64Array.from(a);
}

function requireColumns(name: string, columns: unknown): Readonly<Record<string, unknown>> {
  if (columns === undefined) return {};
  if (!isRecord(columns)) {
    throw new KalendsTypeError(`${name}: expected an object of named arrays such as { amount: [...] }, got ${describeValue(columns)}`, {
      code: 'invalid-type',
      received: columns,
    });
  }
  return columns;
}

/**
 * Builds a series from parallel arrays: instants and named value columns (arrays or typed arrays of numbers,
 * NaN for missing). The inputs are copied. Without `columns` the series holds the instants alone, for counting
 * events. Throws `length-mismatch` when a column's length differs from the instants', `invalid-type` for an
 * element that is not a number (naming its index), `out-of-range` for a NaN instant, and `unsorted` when
 * `inputOrder: 'sorted'` was promised but broken. Instants may carry fractions of a millisecond.
 *
 * @example
 * ```ts
 * const s = seriesFromColumns([3000, 1000, 2000], { kg: [3, 1, 2] });
 * Array.from(s.columns.kg!); // [1, 2, 3]
 * seriesFromColumns([5, 1]).columnNames; // [] (instants alone)
 * ```
 */
export function seriesFromColumns(
  epochMs: ArrayLike<number>,
  columns?: Readonly<Record<string, ArrayLike<number>>>,
  options?: SeriesOptions,
): Series {
  const order = readInputOrder(readOptions('options', options, ['inputOrder']));
  const times = instantsFromArray('epochMs', epochMs);
  const given = requireColumns('columns', columns);
  const names = Object.keys(given);
  const cols = names.map((name) => columnFromArray(`columns.${name}`, given[name], times.length));
  return assemble(times, names, cols, order);
}

/**
 * Builds a series from records such as `{ at, value }`. `at` may be epoch ms (fractions allowed) or anything the
 * instant layer's `toEpochMs` accepts (an RFC 3339 string, a `Date`, a Temporal instant). A value of `null` or
 * `undefined` is stored as NaN (missing). `columns: []` reads the instants alone.
 *
 * @example
 * ```ts
 * const s = seriesFromRecords([{ at: 2000, value: 5 }, { at: 1000, value: 4 }]);
 * Array.from(s.epochMs); // [1000, 2000]
 * const t = seriesFromRecords([{ when: 0, kg: 1, eur: 2 }], { at: 'when', columns: ['kg', 'eur'] });
 * t.columnNames; // ['kg', 'eur']
 * ```
 */
export function seriesFromRecords(records: readonly object[], options?: RecordOptions): Series {
  const o = readOptions('options', options, ['at', 'columns', 'inputOrder']);
  const order = readInputOrder(o);
  if (!Array.isArray(records)) {
    throw new KalendsTypeError(`records: expected an array of objects, got ${describeValue(records)}`, {
      code: 'invalid-type',
      received: records,
    });
  }
  const atField = optionOf(o, 'at') === undefined ? 'at' : requireColumnName('options.at', optionOf(o, 'at'));
  const spec = optionOf(o, 'columns') ?? ['value'];
  let pairs: [string, string][];
  // Array.from, not map: map skips the holes of a sparse array, and a hole is refused like any non-name.
  if (Array.isArray(spec)) pairs = Array.from(spec as unknown[], (f: unknown, i) => [requireColumnName(`options.columns[${i}]`, f), f as string]);
  else if (isRecord(spec)) pairs = Object.keys(spec).map((k) => [k, requireColumnName(`options.columns.${k}`, spec[k])]);
  else {
    throw new KalendsTypeError(`options.columns: expected a list of field names or a map from column name to field name, got ${describeValue(spec)}`, {
      code: 'invalid-type',
      received: spec,
    });
  }
  const n = records.length;
  const times = new Float64Array(n);
  const cols = pairs.map(() => new Float64Array(n));
  for (let i = 0; i < n; i++) {
    const r: unknown = records[i];
    if (!isRecord(r)) {
      throw new KalendsTypeError(`records[${i}]: expected an object, got ${describeValue(r)}`, {
        code: 'invalid-type',
        received: r,
      });
    }
    times[i] = coerceInstant(ownField(r, atField), `records[${i}].${atField}`);
    for (let c = 0; c < pairs.length; c++) cols[c]![i] = coerceValue(ownField(r, pairs[c]![1]), `records[${i}].${pairs[c]![1]}`);
  }
  return assemble(
    times,
    pairs.map((p) => p[0]),
    cols,
    order,
  );
}

/**
 * Builds a one-column series from `[at, value]` pairs (`at` as in {@link seriesFromRecords}).
 *
 * @example
 * ```ts
 * const s = seriesFromPairs([[1000, 2], [1000, 3]], { column: 'boxes' });
 * Array.from(s.columns.boxes!); // [2, 3] (equal times keep input order)
 * ```
 */
export function seriesFromPairs(pairs: readonly (readonly [InstantLike, number | null])[], options?: PairOptions): Series {
  const o = readOptions('options', options, ['column', 'inputOrder']);
  const order = readInputOrder(o);
  if (!Array.isArray(pairs)) {
    throw new KalendsTypeError(`pairs: expected an array of [at, value] pairs, got ${describeValue(pairs)}`, {
      code: 'invalid-type',
      received: pairs,
    });
  }
  const column = optionOf(o, 'column') === undefined ? 'value' : requireColumnName('options.column', optionOf(o, 'column'));
  const n = pairs.length;
  const times = new Float64Array(n);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p: unknown = pairs[i];
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

function readInputOrder(o: OptionRecord): InputOrder {
  return requireEnum('options.inputOrder', optionOf(o, 'inputOrder'), INPUT_ORDERS, 'any');
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
 * The values of one column. Without `column`, the first column. An unknown name throws, listing the valid ones; a
 * series of instants alone (no value column) says so.
 *
 * @example
 * ```ts
 * columnOfSeries(seriesFromPairs([[0, 1]]), 'value'); // Float64Array [1]
 * ```
 */
export function columnOfSeries(series: Series, column?: string): Float64Array {
  requireSeries(series, 'series');
  if (column !== undefined) requireColumnName('column', column);
  return columnNamed(series, column, 'column');
}

/**
 * @internal Column `name` of `series` (the first when `name` is undefined); `parameter` names the option that
 * chose it in messages.
 */
export function columnNamed(series: Series, name: string | undefined, parameter: string): Float64Array {
  const key = name ?? series.columnNames[0];
  if (key === undefined) {
    throw new KalendsRangeError(
      `${parameter}: the series holds instants alone (no value column); count its rows with the "count" or "rows" aggregation, or build it with a value column`,
      { code: 'unsupported', received: name, path: parameter },
    );
  }
  const col = hasOwn(series.columns, key) ? series.columns[key] : undefined;
  if (col === undefined) {
    const valid = series.columnNames.map((c) => JSON.stringify(c)).join(', ') || '(none)';
    throw new KalendsRangeError(`${parameter}: no column named ${describeValue(key)}; valid columns are ${valid}${didYouMean(key, series.columnNames)}`, {
      code: 'unknown-name',
      received: key,
      path: parameter,
    });
  }
  return col;
}

/** @internal Throws unless `series` looks like a Series. */
export function requireSeries(series: unknown, name: string): asserts series is Series {
  const s = series as Series | null;
  if (s === null || typeof s !== 'object' || !(s.epochMs instanceof Float64Array) || typeof s.columns !== 'object' || !Array.isArray(s.columnNames)) {
    throw new KalendsTypeError(`${name}: expected a Series (see seriesFromColumns), got ${describeValue(series)}`, {
      code: 'invalid-type',
      received: series,
    });
  }
}

/**
 * @internal A list of column names of `series` (default: all of them), each checked: an unknown name lists the
 * valid ones.
 */
export function readColumnList(name: string, value: unknown, series: Series): readonly string[] {
  if (value === undefined) return series.columnNames;
  if (!Array.isArray(value)) {
    throw new KalendsTypeError(`${name}: expected a list of column names, got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  return value.map((c: unknown, i) => {
    columnNamed(series, requireColumnName(`${name}[${i}]`, c), `${name}[${i}]`);
    return c as string;
  });
}

/**
 * A new series sharing the instants of `series`, with the given columns added (or, for a name it already has,
 * replaced). Each column is an array or typed array of numbers with one entry per row (NaN for missing); the
 * other columns are shared, not copied.
 *
 * @example
 * ```ts
 * const s = seriesFromSeries(seriesFromPairs([[0, 1], [1, 2]]), { double: [2, 4] });
 * s.columnNames; // ['value', 'double']
 * ```
 */
export function seriesFromSeries(series: Series, columns: Readonly<Record<string, ArrayLike<number>>>): Series {
  requireSeries(series, 'series');
  if (!isRecord(columns)) {
    throw new KalendsTypeError(`columns: expected an object of named arrays such as { double: [...] }, got ${describeValue(columns)}`, {
      code: 'invalid-type',
      received: columns,
    });
  }
  const added = Object.keys(columns);
  const values = new Map<string, Float64Array>();
  for (const name of added) values.set(name, columnFromArray(`columns.${name}`, columns[name], series.length));
  const names = [...series.columnNames, ...added.filter((n) => !series.columnNames.includes(n))];
  return makeSeries(
    series.epochMs,
    names,
    names.map((n) => values.get(n) ?? series.columns[n]!),
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
  requireEpochMs('startEpochMs', startEpochMs);
  requireEpochMs('endEpochMs', endEpochMs);
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

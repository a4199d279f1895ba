/**
 * The series layer's option readers, built on the diagnostics kit: options objects (`undefined` or a plain
 * object, no unknown key), one-of-several shapes (a window, a lag amount, a grid: exactly one kind, no key of
 * another kind), amounts in milliseconds, and the row cap of calls that produce more rows than they read.
 * Every check runs once per call, before any loop. See docs/design.md, "Input rules" and "Limits".
 *
 * @module
 */
import { MAX_BUCKET_PERIODS, MAX_SERIES_ROWS } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { isRecord, readOptions, requireWhole } from '../diagnostics/index.js';

export { optionOf, readOptions, requireBoolean, requireEnum, requireWhole } from '../diagnostics/index.js';

/** Options as read by {@link readOptions}: own keys only. */
export type OptionRecord = Readonly<Record<string, unknown>>;

/** Largest whole amount (rows, business days, periods): the largest integer a double holds exactly. */
const MAX_WHOLE = Number.MAX_SAFE_INTEGER;

/** A whole amount of at least `min` (window rows, business days, periods, minimum observations). */
export function requireAmount(name: string, value: unknown, min: number, fallback?: number): number {
  return requireWhole(name, value, min, MAX_WHOLE, fallback);
}

/**
 * A number of milliseconds (or another real amount): `undefined` gives `fallback` when one is given; anything
 * but a number is a KalendsTypeError; NaN, or a number outside what `valid` accepts, a KalendsRangeError that
 * states `expected`.
 */
export function requireReal(name: string, value: unknown, expected: string, valid: (x: number) => boolean, fallback?: number): number {
  if (value === undefined && fallback !== undefined) return fallback;
  if (typeof value !== 'number') {
    throw new KalendsTypeError(`${name}: expected ${expected}, got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  if (value !== value || !valid(value)) {
    throw new KalendsRangeError(`${name}: expected ${expected}, got ${describeValue(value)}`, { code: 'out-of-range', received: value });
  }
  return value;
}

/** A positive finite length in milliseconds (a window, a duration back). */
export function requirePositiveMs(name: string, value: unknown): number {
  return requireReal(name, value, 'a positive number of milliseconds', (x) => x > 0 && x < Infinity);
}

/** A tolerance or gap in milliseconds: 0 or more, Infinity allowed; absent means no limit. */
export function requireToleranceMs(name: string, value: unknown): number {
  return requireReal(name, value, 'a number of milliseconds of at least 0', (x) => x >= 0, Infinity);
}

/** A non-empty string naming a column. */
export function requireColumnName(name: string, value: unknown): string {
  if (typeof value !== 'string' || value === '') {
    throw new KalendsTypeError(`${name}: expected a non-empty column name, got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  return value;
}

/** An optional column name: `undefined` stays undefined. */
export function optionalColumnName(name: string, value: unknown): string | undefined {
  return value === undefined ? undefined : requireColumnName(name, value);
}

/**
 * The row cap of one call: `options.maxRows` when given (1 to {@link MAX_BUCKET_PERIODS}), else
 * {@link MAX_SERIES_ROWS}.
 */
export function readMaxRows(name: string, value: unknown): number {
  return requireWhole(name, value, 1, MAX_BUCKET_PERIODS, MAX_SERIES_ROWS);
}

/**
 * Throws `limit-exceeded` before anything is built when a call would produce `rows` rows, more than `cap`: the
 * message says how to page and which option raises the cap.
 */
export function requireRowsWithin(name: string, rows: number, cap: number, what: string, maxRowsName: string): void {
  if (rows > cap) throw rowsLimitError(name, `${what} gives ${rows} rows`, cap, maxRowsName);
}

/** The `limit-exceeded` error of a call whose output would pass its row cap (`what` says what would). */
export function rowsLimitError(name: string, what: string, cap: number, maxRowsName: string): KalendsRangeError {
  const raise =
    cap < MAX_BUCKET_PERIODS
      ? `, or raise the cap with ${maxRowsName} (up to ${MAX_BUCKET_PERIODS})`
      : ` (${MAX_BUCKET_PERIODS} is the most any call produces)`;
  return new KalendsRangeError(`${name}: ${what}, more than the cap of ${cap}; page with a narrower range or a coarser unit${raise}`, {
    code: 'limit-exceeded',
    received: cap,
    path: name,
  });
}

/**
 * Reads a value that takes one of several shapes, each told apart by its own key (`{ rows }`, `{ lengthMs }`,
 * ...): `kinds` maps each distinguishing key to every key its shape allows. The value must be a plain object
 * with exactly one distinguishing key (two are a contradiction, refused) and no key outside its shape (an unknown
 * key gets code `unknown-name` and a suggestion).
 */
export function readOneOf<K extends string>(name: string, value: unknown, kinds: Readonly<Record<K, readonly string[]>>): { kind: K; fields: OptionRecord } {
  const keys = Object.keys(kinds) as K[];
  const shapes = keys.map((k) => `{ ${kinds[k].join(', ')} }`).join(', ');
  if (!isRecord(value)) {
    throw new KalendsTypeError(`${name}: expected one of ${shapes}, got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  const all = [...new Set(keys.flatMap((k) => kinds[k]))];
  readOptions(name, value, all);
  const present = keys.filter((k) => Object.prototype.hasOwnProperty.call(value, k));
  if (present.length !== 1) {
    const got = present.length === 0 ? `an object with keys ${Object.keys(value).map((k) => JSON.stringify(k)).join(', ') || '(none)'}` : present.map((k) => JSON.stringify(k)).join(' and ');
    throw new KalendsTypeError(
      `${name}: expected exactly one of ${keys.map((k) => JSON.stringify(k)).join(', ')}, got ${got}; ${present.length === 0 ? `give one of ${shapes}` : 'keep one of them'}`,
      { code: 'invalid-type', received: value },
    );
  }
  const kind = present[0]!;
  return { kind, fields: readOptions(name, value, kinds[kind]) };
}

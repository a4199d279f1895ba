/**
 * @internal Argument checks shared by every public function: options objects (no `null`, no unknown keys),
 * enum values, limits, instants and day numbers, numeric input arrays and caller-supplied output arrays.
 * Every check throws a kalends error whose message starts with the parameter name, quotes the value received,
 * states what is valid and, where one exists, the fix. See docs/design.md, "Input rules".
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { hasOwn, isPlainObject } from './issues.js';
import { didYouMean, type SuggestOptions } from './suggest.js';

const EMPTY: Readonly<Record<string, unknown>> = /* @__PURE__ */ Object.freeze({});

/**
 * Reads an options object: `undefined` gives an empty object; anything but a plain object (`null`, an array, a
 * `Date`, a `Map`, a typed array: objects whose prototype is not Object.prototype or null) is a KalendsTypeError; an own key outside `keys` is a KalendsTypeError with code `unknown-name` and a
 * spelling suggestion (a misspelled option must never be silently ignored).
 */
export function readOptions(name: string, options: unknown, keys: readonly string[]): Readonly<Record<string, unknown>> {
  if (options === undefined) return EMPTY;
  if (!isPlainObject(options)) {
    const hint = typeof options === 'object' && options !== null && !Array.isArray(options) ? '; options are a plain object such as { key: value }, whose own keys are read' : '';
    throw new KalendsTypeError(`${name}: expected an options object or undefined, got ${describeValue(options)}${hint}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const record = options as Record<string, unknown>;
  for (const key of Object.keys(record)) {
    if (!keys.includes(key)) {
      const valid = keys.length > 0 ? `valid options are ${keys.map((k) => JSON.stringify(k)).join(', ')}` : 'this function takes no options';
      throw new KalendsTypeError(`${name}.${key}: unknown option${didYouMean(key, keys)}; ${valid}`, {
        code: 'unknown-name',
        received: key,
        path: `${name}.${key}`,
      });
    }
  }
  return record;
}

/** The own option `key` of an object returned by {@link readOptions}. */
export function optionOf(options: Readonly<Record<string, unknown>>, key: string): unknown {
  return hasOwn(options, key) ? options[key] : undefined;
}

/**
 * An enum value: `undefined` gives `fallback` (when one is given); a value outside `values` is a KalendsRangeError
 * with code `unknown-name` (a string) or a KalendsTypeError (anything else), naming the valid values.
 */
export function requireEnum<T extends string>(name: string, value: unknown, values: readonly T[], fallback?: T, suggest?: SuggestOptions): T {
  if (value === undefined && fallback !== undefined) return fallback;
  if (typeof value === 'string' && (values as readonly string[]).includes(value)) return value as T;
  const expected = `expected one of ${values.map((v) => JSON.stringify(v)).join(', ')}, got ${describeValue(value)}`;
  if (typeof value !== 'string') throw new KalendsTypeError(`${name}: ${expected}`, { code: 'invalid-type', received: value });
  throw new KalendsRangeError(`${name}: ${expected}${didYouMean(value, values, suggest)}`, { code: 'unknown-name', received: value });
}

/** A boolean option: `undefined` gives `fallback`; anything but `true` or `false` is a KalendsTypeError. */
export function requireBoolean(name: string, value: unknown, fallback: boolean): boolean {
  if (value === undefined) return fallback;
  if (typeof value !== 'boolean') {
    throw new KalendsTypeError(`${name}: expected true or false, got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  return value;
}

/**
 * A whole number in [min, max] (counts, limits, amounts). `undefined` gives `fallback` when one is given.
 * NaN, ±Infinity, fractions, strings and out-of-range values are refused with the valid range in the message.
 */
export function requireWhole(name: string, value: unknown, min: number, max: number, fallback?: number): number {
  if (value === undefined && fallback !== undefined) return fallback;
  const expected = `expected an integer from ${min} to ${max}`;
  if (typeof value !== 'number') {
    const hint = typeof value === 'string' && /^\s*-?\d+\s*$/.test(value) ? ` (pass the number ${value.trim()}, not a string)` : '';
    throw new KalendsTypeError(`${name}: ${expected}, got ${describeValue(value)}${hint}`, { code: 'invalid-type', received: value });
  }
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new KalendsRangeError(`${name}: ${expected}, got ${describeValue(value)}`, { code: 'out-of-range', received: value });
  }
  return value;
}

/**
 * An instant in epoch milliseconds: a finite number within ±8.64e15 (ECMA-262 time values). Fractions of a
 * millisecond are allowed (docs/design.md, "Input rules"). A string gets the name of the parser to call.
 */
export function requireEpochMs(name: string, value: unknown): number {
  if (typeof value !== 'number') {
    const hint =
      typeof value === 'string'
        ? '; parse text first with parseInstant(text).epochMs, or coerce with toEpochMs(value)'
        : value instanceof Date
          ? '; use date.getTime(), or toEpochMs(value)'
          : '';
    throw new KalendsTypeError(`${name}: expected epoch milliseconds (a number), got ${describeValue(value)}${hint}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  if (!(value >= MIN_EPOCH_MS && value <= MAX_EPOCH_MS)) {
    throw new KalendsRangeError(`${name}: expected epoch milliseconds from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

/**
 * A day number: an integer within MIN_DAY_NUMBER..MAX_DAY_NUMBER. A string gets the name of the parser to call.
 */
export function requireDayNumberArgument(name: string, value: unknown): number {
  if (typeof value !== 'number') {
    const hint =
      typeof value === 'string'
        ? '; parse text first with parsePlainDate(text), or coerce with toDayNumber(value)'
        : typeof value === 'object' && value !== null
          ? '; coerce it with toDayNumber(value)'
          : '';
    throw new KalendsTypeError(`${name}: expected a day number (an integer), got ${describeValue(value)}${hint}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  if (!Number.isInteger(value) || value < MIN_DAY_NUMBER || value > MAX_DAY_NUMBER) {
    throw new KalendsRangeError(`${name}: expected an integer day number from ${MIN_DAY_NUMBER} to ${MAX_DAY_NUMBER}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

/** Typed arrays whose elements are numbers (not BigInt64Array / BigUint64Array). */
export type NumericTypedArray =
  | Float64Array
  | Float32Array
  | Int32Array
  | Uint32Array
  | Int16Array
  | Uint16Array
  | Int8Array
  | Uint8Array
  | Uint8ClampedArray;

/** True for a typed array of numbers. */
export function isNumericTypedArray(value: unknown): value is NumericTypedArray {
  return (
    value instanceof Float64Array ||
    value instanceof Int32Array ||
    value instanceof Float32Array ||
    value instanceof Uint32Array ||
    value instanceof Int16Array ||
    value instanceof Uint16Array ||
    value instanceof Int8Array ||
    value instanceof Uint8Array ||
    value instanceof Uint8ClampedArray
  );
}

/**
 * Bulk input: a typed array of numbers is accepted as it is (one check, no pass over the data); a plain array is
 * read once, and its first hole or non-number (a numeric string, a Date, null, true) is a KalendsTypeError that
 * names the index. The answer never depends on the array's length.
 */
export function requireNumberArray(name: string, value: unknown): ArrayLike<number> {
  if (isNumericTypedArray(value)) return value;
  if (Array.isArray(value)) {
    const n = value.length;
    for (let i = 0; i < n; i++) {
      const v: unknown = value[i];
      if (typeof v !== 'number') {
        const what = i in value ? describeValue(v) : 'a hole';
        throw new KalendsTypeError(`${name}[${i}]: expected a number, got ${what}; bulk functions read numbers only (convert text with the parse functions first)`, {
          code: 'invalid-type',
          received: v,
          path: `${name}[${i}]`,
        });
      }
    }
    return value as number[];
  }
  throw new KalendsTypeError(`${name}: expected a typed array or an array of numbers, got ${describeValue(value)}`, {
    code: 'invalid-type',
    received: value,
  });
}

/**
 * Refuses a parallel array whose length differs from its partner's (`other` names the partner in the message).
 *
 * @example
 * ```ts
 * requireSameLength('end', [1, 2], 3, 'start'); // throws KalendsRangeError: end: expected 3 elements, as many as start, got 2
 * ```
 */
export function requireSameLength(name: string, values: ArrayLike<unknown>, length: number, other: string): void {
  if (values.length !== length) {
    throw new KalendsRangeError(`${name}: expected ${length} elements, as many as ${other}, got ${values.length}`, { code: 'length-mismatch', received: values.length });
  }
}

/** A constructor of a typed array, as named in messages. */
export interface TypedArrayConstructorLike<T> {
  new (length: number): T;
  readonly name: string;
}

/**
 * A caller-supplied output array: `undefined` gives a new array of `length`; otherwise it must be an instance of
 * `ctor` holding at least `length` elements (elements past `length` are left untouched).
 */
export function requireOutArray<T extends { readonly length: number }>(name: string, out: unknown, ctor: TypedArrayConstructorLike<T>, length: number): T {
  if (out === undefined) return new ctor(length);
  if (!(out instanceof (ctor as unknown as new (n: number) => object))) {
    throw new KalendsTypeError(`${name}: expected a ${ctor.name} or undefined, got ${describeValue(out)}`, { code: 'invalid-type', received: out });
  }
  const arr = out as T;
  if (arr.length < length) {
    throw new KalendsRangeError(`${name}: expected a ${ctor.name} of at least ${length} elements, got ${arr.length}`, {
      code: 'length-mismatch',
      received: arr.length,
    });
  }
  return arr;
}

/**
 * Parameter kinds of the adversarial table. A kind knows the values that are valid for it (an arbitrary), the
 * hostile values that are special to it (beside the shared catalogue of hostile.ts), and, for any value, what
 * docs/design.md ("Input rules", "Errors") says a call must do with it:
 *
 * - `reject`: throw a kalends error of the named class (and code, where the rules fix one) whose message starts
 *   with the parameter's name (or the path inside it) and quotes the value;
 * - `same`: give what the call gives with another value (-0 gives what 0 gives; a fraction of an instant gives what
 *   `Math.floor` gives for days and fields; an alias gives what its canonical form gives; `undefined` for an
 *   optional parameter gives what its default gives);
 * - `shifted`: like `same`, but an instant or wall-time answer keeps the instant's fraction;
 * - `either`: a correct value (the entry's result checks) or a kalends error that names a parameter.
 */
import fc from 'fast-check';
import type { ErrorCode } from '../../src/index.js';
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MAX_ZONED_DAY_NUMBER, MIN_ZONED_DAY_NUMBER } from '../../src/index.js';
import { CATALOGUE, PROTOTYPE_NAMES, anyHostile, hostileArrays, type Hostile } from './hostile.js';

export type ErrorClassName = 'type' | 'range' | 'syntax' | 'definition';

export type Expectation =
  | {
      readonly kind: 'reject';
      readonly classes: readonly ErrorClassName[];
      readonly codes?: readonly ErrorCode[];
      readonly why: string;
      /** The path inside the parameter where the fault is (".limit", "[3]"), which the message must name. */
      readonly at?: string;
      /** The message names the fault by its path alone (an unknown key), with no value to quote. */
      readonly noQuote?: boolean;
    }
  | { readonly kind: 'same'; readonly as: unknown; readonly why: string }
  | { readonly kind: 'shifted'; readonly as: unknown; readonly delta: number; readonly deltas?: readonly number[]; readonly why: string }
  | { readonly kind: 'either' };

export const EITHER: Expectation = { kind: 'either' };
const reject = (classes: readonly ErrorClassName[], why: string, codes?: readonly ErrorCode[], at?: string): Expectation => ({
  kind: 'reject',
  classes,
  why,
  ...(codes ? { codes } : {}),
  ...(at ? { at } : {}),
});
const same = (as: unknown, why: string): Expectation => ({ kind: 'same', as, why });

/** What a kind says about one value. `name` is the parameter's name as messages show it. */
export interface Kind {
  readonly name: string;
  /** Values valid for the kind (the fuzz varies the parameters it is not attacking with these). */
  readonly valid: () => fc.Arbitrary<unknown>;
  /** Hostile values special to this kind, besides the shared catalogue. */
  readonly edges: () => readonly Hostile[];
  /** Generated hostile values special to this kind. */
  readonly fuzz?: () => fc.Arbitrary<unknown>;
  /** What a call must do with `value` in place of a valid one; `args` are the call's other arguments. */
  readonly expect: (value: unknown, args?: readonly unknown[]) => Expectation;
  /** True when the parameter may be left out (undefined means its default). */
  readonly optional?: boolean;
}

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v) && (Object.getPrototypeOf(v) === Object.prototype || Object.getPrototypeOf(v) === null);

const typeError = (what: string) => reject(['type'], `${what} is the wrong kind of value`, ['invalid-type']);
const rangeError = (why: string, codes: readonly ErrorCode[] = ['out-of-range']) => reject(['range'], why, codes);

/** `undefined` for an optional parameter: its default (when the kind knows it) or anything valid. */
function optionalOr(optional: boolean | undefined, fallback: unknown, hasDefault: boolean): Expectation | undefined {
  if (!optional) return undefined;
  return hasDefault ? same(fallback, 'undefined gives the default') : EITHER;
}

interface NumberKindOptions {
  readonly optional?: boolean;
  /** The value undefined stands for. */
  readonly fallback?: number;
}

/**
 * An integer in [min, max]: a fraction, NaN or ±Infinity is a range error; anything but a number a type error;
 * -0 gives what 0 gives. `validMin`/`validMax` narrow the values the fuzz uses when the kind is not attacked.
 */
export function integer(min: number, max: number, o: NumberKindOptions & { readonly validMin?: number; readonly validMax?: number; readonly outside?: 'range' | 'either' } = {}): Kind {
  return {
    name: `integer ${min}..${max}`,
    optional: o.optional,
    valid: () => fc.oneof(fc.integer({ min: Math.max(o.validMin ?? min, -(2 ** 31)), max: Math.min(o.validMax ?? max, 2 ** 31 - 1) }), fc.constantFrom(o.validMin ?? min, o.validMax ?? max)),
    edges: () => [
      { label: `${min} - 1`, make: () => min - 1 },
      { label: `${max} + 1`, make: () => max + 1 },
      { label: 'min', make: () => min },
      { label: 'max', make: () => max },
    ],
    fuzz: () => fc.oneof(fc.integer({ min: Math.max(min - 3, -(2 ** 53)), max: Math.max(min + 3, -(2 ** 53)) }), fc.integer({ min: Math.min(max - 3, 2 ** 53), max: Math.min(max + 3, 2 ** 53) }), fc.double({ min: min - 1, max: max + 1, noNaN: true })),
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      if (typeof v !== 'number') return typeError(typeof v);
      if (Object.is(v, -0)) return same(0, '-0 gives what 0 gives');
      if (!Number.isFinite(v) || !Number.isInteger(v)) return rangeError('a fraction, NaN or ±Infinity is not an integer');
      if (v < min || v > max) return o.outside === 'either' ? EITHER : rangeError(`outside ${min}..${max}`, ['out-of-range', 'limit-exceeded']);
      return EITHER;
    },
  };
}

/** A day number (an integer), in the civil range, or the zoned range when `zoned`. */
export function dayNumber(o: NumberKindOptions & { readonly zoned?: boolean; readonly validMin?: number; readonly validMax?: number } = {}): Kind {
  const min = o.zoned ? MIN_ZONED_DAY_NUMBER : MIN_DAY_NUMBER;
  const max = o.zoned ? MAX_ZONED_DAY_NUMBER : MAX_DAY_NUMBER;
  const k = integer(min, max, { ...o, validMin: o.validMin ?? -80_000, validMax: o.validMax ?? 80_000 });
  return {
    ...k,
    name: 'dayNumber',
    valid: () => fc.oneof({ weight: 4, arbitrary: fc.integer({ min: o.validMin ?? -80_000, max: o.validMax ?? 80_000 }) }, { weight: 1, arbitrary: fc.integer({ min, max }) }),
  };
}

/**
 * An instant (epoch ms), fractions allowed: `floor` when the answer is a field, a day, a period or a yes/no (it is
 * that of Math.floor(t)); `keep` when it is an instant or wall time that keeps the fraction.
 */
export function epochMs(o: NumberKindOptions & { readonly fraction: 'floor' | 'keep' | 'either'; readonly validMin?: number; readonly validMax?: number }): Kind {
  return instantLike(o, MIN_EPOCH_MS, MAX_EPOCH_MS, 'epochMs');
}

function instantLike(o: NumberKindOptions & { readonly fraction: 'floor' | 'keep' | 'either'; readonly validMin?: number; readonly validMax?: number }, MIN_EPOCH_MS: number, MAX_EPOCH_MS: number, name: string): Kind {
  return {
    name,
    optional: o.optional,
    valid: () =>
      fc.oneof(
        { weight: 4, arbitrary: fc.integer({ min: o.validMin ?? -3e12, max: o.validMax ?? 5e12 }) },
        { weight: 1, arbitrary: fc.integer({ min: MIN_EPOCH_MS, max: MAX_EPOCH_MS }) },
      ),
    edges: () => [
      { label: `the least ${name}`, make: () => MIN_EPOCH_MS },
      { label: `the greatest ${name}`, make: () => MAX_EPOCH_MS },
      { label: `the least ${name} - 1`, make: () => MIN_EPOCH_MS - 1 },
      { label: `the greatest ${name} + 1`, make: () => MAX_EPOCH_MS + 1 },
      { label: `the greatest ${name} - 0.5`, make: () => MAX_EPOCH_MS - 0.5 },
      { label: `the least ${name} + 0.5`, make: () => MIN_EPOCH_MS + 0.5 },
      { label: '1735689600000.75', make: () => 1_735_689_600_000.75 },
    ],
    fuzz: () => fc.oneof(fc.double({ min: -4e12, max: 4e12, noNaN: true }), fc.double({ min: MIN_EPOCH_MS - 10, max: MAX_EPOCH_MS + 10, noNaN: true })),
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      if (typeof v !== 'number') return typeError(typeof v);
      if (Object.is(v, -0)) return same(0, '-0 gives what 0 gives');
      if (!(v >= MIN_EPOCH_MS && v <= MAX_EPOCH_MS)) return rangeError(`outside ${MIN_EPOCH_MS}..${MAX_EPOCH_MS} or not a number`);
      if (Number.isInteger(v) || o.fraction === 'either') return EITHER;
      const floor = Math.floor(v);
      return o.fraction === 'floor'
        ? same(floor, 'an instant lies within the millisecond Math.floor(t)')
        : { kind: 'shifted', as: floor, delta: v - floor, why: 'an instant answer keeps the fraction' };
    },
  };
}

/**
 * A wall time (local ms: `dayNumber * 86,400,000 + ms of the day`), fractions allowed as for instants, over the
 * civil day range (docs/design.md, "The currency: integers").
 */
export function wallMs(o: NumberKindOptions & { readonly fraction: 'floor' | 'keep' | 'either' }): Kind {
  return instantLike(o, MIN_DAY_NUMBER * 86_400_000, (MAX_DAY_NUMBER + 1) * 86_400_000 - 1, 'wallMs');
}

/** Any finite number in [min, max] (fractions allowed). */
export function finite(min: number, max: number, o: NumberKindOptions = {}): Kind {
  return {
    name: `number ${min}..${max}`,
    optional: o.optional,
    valid: () => fc.double({ min, max, noNaN: true, noDefaultInfinity: true }),
    edges: () => [],
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      if (typeof v !== 'number') return typeError(typeof v);
      if (Number.isNaN(v)) return rangeError('NaN is no number here');
      if (v < min || v > max) return rangeError(`outside ${min}..${max}`);
      return EITHER;
    },
  };
}

/** One of a set of strings. */
export function enumOf(values: readonly string[], o: { readonly optional?: boolean; readonly fallback?: string } = {}): Kind {
  return {
    name: `one of ${values.join(', ')}`,
    optional: o.optional,
    valid: () => fc.constantFrom(...values),
    edges: () => values.flatMap((x) => [
      { label: JSON.stringify(x.toUpperCase()), make: () => x.toUpperCase() },
      { label: JSON.stringify(`${x} `), make: () => `${x} ` },
      { label: JSON.stringify(x.slice(0, -1)), make: () => x.slice(0, -1) },
    ]).filter((e) => !values.includes(e.make() as string)),
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      if (typeof v !== 'string') return typeError(typeof v);
      if (values.includes(v)) return EITHER;
      return rangeError('a string outside the set', ['unknown-name']);
    },
  };
}

/** true or false. */
export function bool(o: { readonly optional?: boolean; readonly fallback?: boolean } = {}): Kind {
  return {
    name: 'boolean',
    optional: o.optional,
    valid: () => fc.boolean(),
    edges: () => [],
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      return typeof v === 'boolean' ? EITHER : typeError(typeof v);
    },
  };
}

/**
 * A name that selects something (a zone id, a unit or calendar name, a cut-off): `names` are valid, `aliases` map
 * another spelling to the canonical one, any other string may be refused (as a range error with one of
 * `unknownCodes`, or a syntax error), and the prototype names always are. Objects are checked by `object`.
 */
export function named(o: {
  readonly names: readonly unknown[];
  readonly aliases?: readonly (readonly [unknown, unknown])[];
  readonly unknownCodes: readonly ErrorCode[];
  readonly object?: (v: object) => Expectation;
  readonly forged?: readonly Hostile[];
  readonly optional?: boolean;
  readonly fallback?: unknown;
  readonly label: string;
}): Kind {
  return {
    name: o.label,
    optional: o.optional,
    valid: () => fc.constantFrom(...o.names),
    edges: () => [...(o.forged ?? []), ...(o.aliases ?? []).map(([a]) => ({ label: `alias ${typeof a === 'string' ? JSON.stringify(a) : 'object'}`, make: () => a }))],
    fuzz: () => fc.oneof(fc.constantFrom(...o.names.filter((n): n is string => typeof n === 'string')).map((n) => n.toUpperCase()), fc.string({ maxLength: 12 })),
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      const alias = o.aliases?.find(([a]) => a === v);
      if (alias) return same(alias[1], 'an alias gives what its canonical name gives');
      if (typeof v === 'string') {
        if ((PROTOTYPE_NAMES as readonly string[]).includes(v)) return reject(['range'], 'an Object.prototype name is no name of ours', o.unknownCodes);
        return { kind: 'either' };
      }
      if (typeof v === 'object' && v !== null && o.object) return o.object(v);
      return typeError(typeof v);
    },
  };
}

/**
 * A compiled value (a rule, hours, a series, a profile, a period, a duration, a table): anything else is a type
 * error; a copy of a valid one (`forged`) is either refused or works as the original.
 */
export function compiled(label: string, example: () => unknown, o: { readonly optional?: boolean; readonly copies?: 'same' | 'either' | 'reject' } = {}): Kind {
  return {
    name: label,
    optional: o.optional,
    valid: () => fc.constant(null).map(() => example()),
    edges: () => [{ label: `a copy of a ${label}`, make: () => ({ ...(example() as object) }) }],
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, undefined, false) ?? typeError('undefined');
      if (typeof v !== 'object' || v === null) return typeError(typeof v);
      return EITHER;
    },
  };
}

/** Free text that is parsed by a grammar: anything but a string is a type error; strings either parse or not. */
export function text(valid: () => fc.Arbitrary<string>, o: { readonly optional?: boolean; readonly fallback?: string; readonly edges?: readonly string[] } = {}): Kind {
  return {
    name: 'text',
    optional: o.optional,
    valid,
    edges: () => (o.edges ?? []).map((s) => ({ label: JSON.stringify(s.length > 40 ? `${s.slice(0, 37)}...` : s), make: () => s })),
    fuzz: () => fc.oneof(fc.string({ maxLength: 30 }), valid().chain((s) => fc.integer({ min: 0, max: Math.max(0, s.length - 1) }).chain((i) => fc.string({ maxLength: 2 }).map((x) => s.slice(0, i) + x + s.slice(i + 1))))),
    expect: (v) => {
      if (v === undefined) return optionalOr(o.optional, o.fallback, o.fallback !== undefined) ?? typeError('undefined');
      return typeof v === 'string' ? EITHER : typeError(typeof v);
    },
  };
}

/** Whatever a user holds (the `to…` coercions): anything may be refused or converted. */
export function anything(o: { readonly valid: () => fc.Arbitrary<unknown> }): Kind {
  return { name: 'any value', valid: o.valid, edges: () => [], expect: () => EITHER };
}

/**
 * Bulk input: a typed array of numbers or a plain array of numbers, read once; a hole or non-number is a type error
 * that names its index. `element` says what each number must be: its expectation for a number is applied to the
 * whole array (an array with a -0 gives what the array with 0 gives, and so on).
 */
export function numbers(valid: () => number[], element: Kind, o: { readonly optional?: boolean; readonly label?: string } = {}): Kind {
  return {
    name: `numbers of ${element.name}`,
    optional: o.optional,
    valid: () => fc.array(element.valid() as fc.Arbitrary<number>, { minLength: 0, maxLength: 8 }).map((xs) => (xs.length % 2 ? Float64Array.from(xs) : xs)),
    edges: () => [
      ...hostileArrays(valid()),
      { label: 'a Float32Array', make: () => Float32Array.from(valid()) },
      { label: 'an Int16Array', make: () => Int16Array.from(valid().map((x) => x % 30_000)) },
      { label: 'an empty array', make: () => [] },
      { label: 'an array with -0', make: () => [...valid(), -0] },
      { label: 'an array with NaN', make: () => [...valid(), Number.NaN] },
      { label: 'an array with 0.5', make: () => [...valid(), 0.5] },
      { label: 'an array with Infinity', make: () => [...valid(), Number.POSITIVE_INFINITY] },
      { label: 'an array with 1e300', make: () => [...valid(), 1e300] },
    ],
    expect: (v) => {
      if (v === undefined) return o.optional ? EITHER : typeError('undefined');
      if (ArrayBuffer.isView(v)) {
        if (v instanceof BigInt64Array || v instanceof BigUint64Array || v instanceof DataView) return typeError('a BigInt or DataView array');
        return arrayExpectation(Array.from(v as unknown as ArrayLike<number>), element, v);
      }
      if (!Array.isArray(v)) return typeError(typeof v);
      for (let i = 0; i < v.length; i++) {
        if (!(i in v) || typeof v[i] !== 'number') return reject(['type'], 'a hole or a non-number in a bulk array', ['invalid-type'], `[${i}]`);
      }
      return arrayExpectation(v as number[], element, v);
    },
  };
}

/** The expectation of an array of numbers, from each element's (the first rejection wins; equivalents map). */
function arrayExpectation(xs: readonly number[], element: Kind, original: unknown): Expectation {
  let mapped: number[] | undefined;
  let delta: number[] | undefined;
  for (let i = 0; i < xs.length; i++) {
    const e = element.expect(xs[i]);
    if (e.kind === 'reject') return EITHER; // bulk functions may mark an element (a sentinel) or refuse it
    if (e.kind === 'either') continue;
    mapped ??= [...xs];
    mapped[i] = e.as as number;
    if (e.kind === 'shifted') {
      delta ??= xs.map(() => 0);
      delta[i] = e.delta;
    }
  }
  if (!mapped) return EITHER;
  const as = original instanceof Float64Array || original instanceof Float32Array ? Float64Array.from(mapped) : mapped;
  return delta ? { kind: 'shifted', as, delta: 0, deltas: delta, why: 'each instant keeps its fraction' } : same(as, 'element by element: -0 as 0, fractions as Math.floor');
}

/**
 * A caller-supplied output array: undefined makes one; another kind is a type error, a short one a range error.
 * Its length must reach that of the input array at `input` among the call's arguments.
 */
export function out(ctor: { new (n: number): ArrayLike<number>; readonly name: string }, input: number, example: () => number): Kind {
  const lengthOf = (args: readonly unknown[] | undefined): number | undefined => {
    const a = args?.[input];
    return Array.isArray(a) || (ArrayBuffer.isView(a) && !(a instanceof DataView)) ? (a as ArrayLike<unknown>).length : undefined;
  };
  const minLength = example;
  return {
    name: `out ${ctor.name}`,
    optional: true,
    valid: () => fc.constant(undefined),
    edges: () => [
      { label: `a ${ctor.name} one element short`, make: () => new ctor(Math.max(0, minLength() - 1)) },
      { label: `a ${ctor.name} of the right length`, make: () => new ctor(minLength()) },
      { label: `a ${ctor.name} longer than needed`, make: () => new ctor(minLength() + 3) },
      { label: 'a typed array of the wrong kind', make: () => (ctor === (Float64Array as unknown) ? new Int32Array(minLength()) : new Float64Array(minLength())) },
    ],
    expect: (v, args) => {
      if (v === undefined) return EITHER;
      if (!(v instanceof (ctor as unknown as new (n: number) => object))) return typeError('not the output array kind');
      const n = lengthOf(args);
      if (n === undefined) return EITHER;
      if ((v as ArrayLike<number>).length < n) return rangeError('too short', ['length-mismatch']);
      return EITHER;
    },
  };
}

/**
 * An options object: undefined (the defaults) or a plain object whose own keys are among `keys`; null, arrays, and
 * objects of other kinds (a Date, a Map) are type errors; an unknown key is a type error with code unknown-name.
 * Each key's value is checked by its own kind, under the name `options.<key>`.
 */
export function options(keys: Readonly<Record<string, Kind>>, o: { readonly optional?: boolean; readonly valid?: () => Record<string, unknown> } = {}): Kind & { readonly keys: Readonly<Record<string, Kind>> } {
  const optional = o.optional ?? true;
  return {
    name: 'options',
    keys,
    optional,
    valid: () => fc.constant(null).map(() => (o.valid ? o.valid() : undefined)),
    edges: () => [
      { label: 'an options object with an unknown key', make: () => ({ ...(o.valid?.() ?? {}), notAnOption: 1 }) },
      { label: 'an options object with a misspelled key', make: () => ({ ...(o.valid?.() ?? {}), [`${Object.keys(keys)[0] ?? 'limit'}x`]: 1 }) },
      ...PROTOTYPE_NAMES.filter((n) => n !== '__proto__').map((n) => ({ label: `an options object with own key ${n}`, make: () => ({ ...(o.valid?.() ?? {}), [n]: 1 }) })),
      { label: 'an options object with own key __proto__', make: () => Object.assign(JSON.parse('{"__proto__": 1}') as object, o.valid?.() ?? {}) },
      { label: 'an options object with no prototype', make: () => Object.assign(Object.create(null) as object, o.valid?.() ?? {}) },
      { label: 'an options object whose prototype holds the keys', make: () => Object.create(o.valid?.() ?? { x: 1 }) as object },
    ],
    fuzz: () => {
      const names = Object.keys(keys);
      if (names.length === 0) return fc.constant({ unknownKey: 1 });
      return fc.constantFrom(...names).chain((key) => hostileArbitrary(keys[key]!).map((x) => ({ ...(o.valid?.() ?? {}), [key]: x })));
    },
    expect: (v, args) => {
      if (v === undefined) return optional ? EITHER : typeError('undefined');
      if (!isPlainObject(v)) return typeError('options must be a plain object');
      for (const key of Object.keys(v)) {
        if (!Object.prototype.hasOwnProperty.call(keys, key)) return { ...reject(['type'], `unknown option ${key}`, ['unknown-name'], `.${key}`), noQuote: true };
      }
      let mapped: Record<string, unknown> | undefined;
      for (const key of Object.keys(v)) {
        const e = keys[key]!.expect(v[key], args);
        if (e.kind === 'reject') return { ...e, at: `.${key}${e.at ?? ''}` };
        if (e.kind === 'shifted') return EITHER;
        if (e.kind === 'same') {
          mapped ??= { ...v };
          if (e.as === undefined) delete mapped[key];
          else mapped[key] = e.as;
        }
      }
      return mapped ? same(mapped, 'each option as its equivalent') : EITHER;
    },
  };
}

/**
 * A plain-data definition (JSON): anything but an object is refused (a type error or a DefinitionError); faults
 * inside are one DefinitionError whose issues carry paths (the fuzz mutates the valid definition's fields).
 */
export function definition(example: () => unknown, o: { readonly strings?: boolean; readonly label?: string } = {}): Kind {
  return {
    name: o.label ?? 'definition',
    valid: () => fc.constant(null).map(() => example()),
    edges: () => [],
    expect: (v) => {
      if (typeof v === 'string' && o.strings) return EITHER;
      if (typeof v !== 'object' || v === null) return reject(['type', 'definition', 'range', 'syntax'], 'not a definition object');
      return EITHER;
    },
  };
}

/** The hostile values of a kind: the shared catalogue and the kind's own. */
export function hostileValues(kind: Kind): readonly Hostile[] {
  return [...CATALOGUE, ...kind.edges()];
}

/** A fast-check arbitrary of hostile values for a kind. */
export function hostileArbitrary(kind: Kind): fc.Arbitrary<unknown> {
  const own = kind.edges();
  const parts: fc.WeightedArbitrary<unknown>[] = [{ weight: 3, arbitrary: anyHostile() }];
  if (own.length > 0) parts.push({ weight: 2, arbitrary: fc.constantFrom(...own).map((x) => x.make()) });
  if (kind.fuzz) parts.push({ weight: 2, arbitrary: kind.fuzz() });
  parts.push({ weight: 1, arbitrary: kind.valid() });
  return fc.oneof(...parts);
}

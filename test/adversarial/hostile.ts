/**
 * The hostile values of the adversarial suite: a fixed catalogue (the sweep calls every parameter with each one)
 * and fast-check arbitraries that mix the catalogue with generated edge values (the fuzz). docs/design.md, "Input
 * rules", says what each must give; expect.ts turns a value and a parameter's kind into that expectation.
 *
 * The values are made by functions, never shared between calls: a call that mutated one would otherwise colour the
 * next call.
 */
import fc from 'fast-check';

/** One named hostile value. `make` builds a fresh copy for each call. */
export interface Hostile {
  readonly label: string;
  readonly make: () => unknown;
}

const h = (label: string, make: () => unknown): Hostile => ({ label, make });
const v = (label: string, value: unknown): Hostile => h(label, () => value);

/** The names every object inherits from Object.prototype (issue 12, defect 7). */
export const PROTOTYPE_NAMES = ['constructor', 'toString', '__proto__', 'valueOf', 'hasOwnProperty', 'isPrototypeOf', 'toLocaleString'] as const;

/** Numbers at the edges: NaN, ±Infinity, fractions, -0, huge and tiny. */
export const NUMBERS: readonly Hostile[] = [
  v('NaN', Number.NaN),
  v('Infinity', Number.POSITIVE_INFINITY),
  v('-Infinity', Number.NEGATIVE_INFINITY),
  v('-0', -0),
  v('0.5', 0.5),
  v('-0.5', -0.5),
  v('1.5', 1.5),
  v('-1.25', -1.25),
  v('1e300', 1e300),
  v('-1e300', -1e300),
  v('2^53', 2 ** 53),
  v('-2^53', -(2 ** 53)),
  v('9e15', 9e15),
  v('2^31', 2 ** 31),
  v('-2^31 - 1', -(2 ** 31) - 1),
  v('5e-324', 5e-324),
  v('-5e-324', -5e-324),
  v('Number.MAX_VALUE', Number.MAX_VALUE),
  v('Number.EPSILON', Number.EPSILON),
];

/** Strings: empty, numeric, dates, prototype names, control characters, and long. */
export const STRINGS: readonly Hostile[] = [
  v('""', ''),
  v('" "', ' '),
  v('"0"', '0'),
  v('"1"', '1'),
  v('"-1"', '-1'),
  v('"1e3"', '1e3'),
  v('"0x10"', '0x10'),
  v('" 5 "', ' 5 '),
  v('"NaN"', 'NaN'),
  v('"Infinity"', 'Infinity'),
  v('"2025-01-01"', '2025-01-01'),
  v('"2025-01-01T00:00:00Z"', '2025-01-01T00:00:00Z'),
  ...PROTOTYPE_NAMES.map((n) => v(JSON.stringify(n), n)),
  v('"\\u2212"', '\u2212'),
  v('"\\u0000"', '\u0000'),
  v('"\\ud800"', '\ud800'),
  v('a 10,000-character string', 'x'.repeat(10_000)),
];

/** Everything that is neither a number nor a string. */
export const OTHERS: readonly Hostile[] = [
  v('null', null),
  v('undefined', undefined),
  v('true', true),
  v('false', false),
  v('1n', 1n),
  h('a symbol', () => Symbol('hostile')),
  h('a function', () => () => 0),
  h('new Date(0)', () => new Date(0)),
  h('new Date(NaN)', () => new Date(Number.NaN)),
  h('{}', () => ({})),
  h('Object.create(null)', () => Object.create(null) as object),
  h('{ constructor: 1 }', () => ({ constructor: 1 })),
  h('JSON {"__proto__": 1}', () => JSON.parse('{"__proto__": 1}') as object),
  h('{ valueOf: () => 5 }', () => ({ valueOf: () => 5 })),
  h('[]', () => []),
  h('[1, 2, 3]', () => [1, 2, 3]),
  // eslint-disable-next-line no-sparse-arrays
  h('[1, <hole>, 3]', () => [1, , 3]),
  h('Array(3) (holes)', () => new Array(3)),
  h('new Float32Array(3)', () => new Float32Array(3)),
  h('new Uint8Array(0)', () => new Uint8Array(0)),
  h('new BigInt64Array(3)', () => new BigInt64Array(3)),
  h('new Map()', () => new Map()),
  h('/re/', () => /re/),
];

/** The whole catalogue, in the order the sweep uses it. */
export const CATALOGUE: readonly Hostile[] = [...NUMBERS, ...STRINGS, ...OTHERS];

/** Arrays of numbers that break the bulk rules: holes, strings, Dates, null, true and BigInt elements. */
export function hostileArrays(valid: readonly number[]): readonly Hostile[] {
  const at = (label: string, bad: unknown, hole = false): Hostile =>
    h(label, () => {
      const xs: unknown[] = [...valid];
      const i = xs.length >> 1;
      if (hole) delete xs[i];
      else xs[i] = bad;
      return xs;
    });
  return [
    at('an array with a hole', undefined, true),
    at('an array holding a numeric string', String(valid[0] ?? 0)),
    at('an array holding a Date', new Date(0)),
    at('an array holding null', null),
    at('an array holding true', true),
    at('an array holding undefined', undefined),
    at('an array holding 1n', 1n),
    h('a BigInt64Array', () => new BigInt64Array(valid.length)),
    h('a string of digits', () => valid.join(',')),
  ];
}

/** A fast-check arbitrary of any hostile value: the catalogue, generated numbers, strings, dates and arrays. */
export function anyHostile(): fc.Arbitrary<unknown> {
  return fc.oneof(
    { weight: 4, arbitrary: fc.constantFrom(...CATALOGUE).map((x) => x.make()) },
    { weight: 2, arbitrary: fc.double() },
    { weight: 1, arbitrary: fc.integer({ min: -(2 ** 31), max: 2 ** 31 }) },
    { weight: 1, arbitrary: fc.constantFrom(8.64e15, -8.64e15, 8.64e15 + 1, -8.64e15 - 1, 100_000_109, 100_000_110, -100_000_110, 275_760, 275_761, -271_822) },
    { weight: 1, arbitrary: fc.string({ maxLength: 40 }) },
    { weight: 1, arbitrary: fc.stringMatching(/^[+-]?\d{1,20}(\.\d{1,5})?$/) },
    { weight: 1, arbitrary: fc.date({ noInvalidDate: false }) },
    { weight: 1, arbitrary: fc.sparseArray(fc.integer(), { maxLength: 6 }) },
    { weight: 1, arbitrary: fc.oneof(fc.float32Array({ maxLength: 4 }), fc.int16Array({ maxLength: 4 }), fc.bigInt64Array({ maxLength: 4 })) },
    { weight: 1, arbitrary: fc.dictionary(fc.constantFrom(...PROTOTYPE_NAMES, 'x', 'kind', 'id'), fc.oneof(fc.integer(), fc.string({ maxLength: 4 })), { maxKeys: 2 }) },
  );
}

/** Short text naming a value for a report (never the whole of a long string). */
export function show(value: unknown): string {
  if (typeof value === 'string') return value.length > 60 ? `${JSON.stringify(value.slice(0, 57))}... (${value.length} chars)` : JSON.stringify(value);
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'bigint') return `${value}n`;
  if (typeof value === 'symbol' || typeof value === 'function') return typeof value;
  if (value === undefined) return 'undefined';
  if (value instanceof Date) return `Date(${value.getTime()})`;
  if (ArrayBuffer.isView(value)) return `${value.constructor.name}(${(value as unknown as { length: number }).length})`;
  if (Array.isArray(value)) {
    const items: string[] = [];
    for (let i = 0; i < Math.min(value.length, 6); i++) items.push(i in value ? show(value[i]) : '<hole>');
    return `[${items.join(', ')}${value.length > 6 ? `, ... (${value.length})` : ''}]`;
  }
  if (typeof value === 'object' && value !== null) {
    const proto = Object.getPrototypeOf(value) as { constructor?: { name?: string } } | null;
    if (proto !== null && proto !== Object.prototype) return `a ${proto.constructor?.name ?? 'object'}`;
    const keys = Object.keys(value);
    if (keys.length > 6) return `{${keys.slice(0, 6).join(', ')}, ...}`;
    try {
      const text = JSON.stringify(value);
      return text.length > 120 ? `${text.slice(0, 117)}...` : text;
    } catch {
      return `{${keys.join(', ')}}`;
    }
  }
  return String(value);
}

/**
 * The invariant of the adversarial suite (issue 12): every call returns a correct value, or throws a kalends error
 * class with a documented code, whose message names the parameter (or path) and quotes the value. Nothing else.
 *
 * `outcomeOf` runs one call and captures what happened (a generator is run for its first items, so that an error
 * thrown lazily counts as the call's); `faultOf` compares an outcome with the expectation kinds.ts gives for the
 * attacked value, and returns a description of the fault, or undefined.
 */
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError, type ErrorCode } from '../../src/index.js';
import { describeValue } from '../../src/errors.js';
import type { ErrorClassName, Expectation } from './kinds.js';

/** The codes docs/design.md ("Errors") and src/errors.ts (ErrorCode) document. */
export const DOCUMENTED_CODES: readonly ErrorCode[] = [
  'out-of-range',
  'invalid-type',
  'malformed',
  'invalid-definition',
  'unknown-zone',
  'skipped-time',
  'repeated-time',
  'corrupt-tzif',
  'no-business-day',
  'limit-exceeded',
  'unsorted',
  'length-mismatch',
  'unsupported',
  'unknown-name',
];

export type Outcome = { readonly ok: true; readonly value: unknown } | { readonly ok: false; readonly error: unknown };

/** Items of a returned generator that a call is run for (an error on the first `next()` is the call's). */
const ITERATED = 20;

/** Runs `f`; a returned generator is drained for its first items, inside the same try. */
export function outcomeOf(f: () => unknown): Outcome {
  try {
    const value = f();
    if (isIterator(value)) {
      const items: unknown[] = [];
      for (let i = 0; i < ITERATED; i++) {
        const step = value.next();
        if (step.done) break;
        items.push(step.value);
      }
      return { ok: true, value: { iterated: items } };
    }
    return { ok: true, value };
  } catch (error) {
    return { ok: false, error };
  }
}

function isIterator(v: unknown): v is Iterator<unknown> {
  return typeof v === 'object' && v !== null && typeof (v as { next?: unknown }).next === 'function' && typeof (v as { [Symbol.iterator]?: unknown })[Symbol.iterator] === 'function';
}

/** The kalends class of an error, or undefined when it is none of ours. */
export function classOf(e: unknown): ErrorClassName | undefined {
  if (e instanceof DefinitionError) return 'definition';
  if (e instanceof KalendsTypeError) return 'type';
  if (e instanceof KalendsSyntaxError) return 'syntax';
  if (e instanceof KalendsRangeError) return 'range';
  return undefined;
}

/** Short text for an error in a report. */
export function showError(e: unknown): string {
  if (e instanceof Error) {
    const code = (e as { code?: unknown }).code;
    const m = e.message.length > 300 ? `${e.message.slice(0, 297)}...` : e.message;
    return `${e.constructor.name}${code !== undefined ? ` [${String(code)}]` : ''}: ${m}`;
  }
  return `a thrown ${typeof e}: ${String(e)}`;
}

/**
 * The fault of a thrown value, if any: not a kalends class, an undocumented code, or a message that does not start
 * with one of `names` (a parameter, `options`, or a path inside them). DefinitionErrors name their paths in `issues`.
 */
export function errorFault(e: unknown, names: readonly string[]): string | undefined {
  const cls = classOf(e);
  if (!cls) return `threw ${showError(e)}, which is no kalends error class`;
  const err = e as Error & { code: ErrorCode; issues?: readonly { path: string; message: string }[] };
  if (!DOCUMENTED_CODES.includes(err.code)) return `threw ${showError(e)} with an undocumented code`;
  if (typeof err.message !== 'string' || err.message.length === 0) return `threw ${showError(e)} without a message`;
  if (cls === 'definition') {
    const issues = err.issues ?? [];
    if (issues.length === 0) return `threw ${showError(e)} with no issues`;
    const bad = issues.find((i) => typeof i.path !== 'string' || i.path === '' || typeof i.message !== 'string' || i.message === '');
    if (bad) return `threw ${showError(e)} with an issue without a path or message: ${JSON.stringify(bad)}`;
    return undefined;
  }
  const lead = /^[A-Za-z_$][\w$]*/.exec(err.message)?.[0];
  if (!lead || !names.includes(lead)) return `threw ${showError(e)}: the message does not start with a parameter name (${names.join(', ')})`;
  return undefined;
}

/**
 * The fault of an outcome against a `reject` expectation: the class and code must be those expected, and the
 * message must start with `name` (plus the path inside it) and quote the value.
 */
export function rejectFault(o: Outcome, x: Extract<Expectation, { kind: 'reject' }>, name: string, quoted: unknown, quote: boolean): string | undefined {
  if (o.ok) return `returned ${showResult(o.value)}; expected a ${x.classes.join(' or ')} error (${x.why})`;
  const cls = classOf(o.error);
  if (!cls) return `threw ${showError(o.error)}, which is no kalends error class (${x.why})`;
  const err = o.error as Error & { code: ErrorCode; issues?: readonly { path: string; message: string }[] };
  if (!x.classes.includes(cls)) return `threw ${showError(o.error)}; expected a ${x.classes.join(' or ')} error (${x.why})`;
  if (x.codes && !x.codes.includes(err.code)) return `threw ${showError(o.error)}; expected code ${x.codes.join(' or ')} (${x.why})`;
  if (!DOCUMENTED_CODES.includes(err.code)) return `threw ${showError(o.error)} with an undocumented code`;
  const where = `${name}${x.at ?? ''}`;
  if (cls === 'definition') {
    const issues = err.issues ?? [];
    const hit = issues.find((i) => related(i.path, x.at ?? '') || i.path.startsWith(name));
    if (!hit) return `threw ${showError(o.error)}; expected an issue at ${x.at ?? '(the definition)'}`;
    return undefined;
  }
  if (!startsWithName(err.message, where)) return `threw ${showError(o.error)}; the message should start with "${where}"`;
  if (quote) {
    const shown = describeValue(quoted);
    if (!err.message.includes(shown)) return `threw ${showError(o.error)}; the message should quote the value (${shown})`;
  } else if (x.at && /\[\d+\]$/.test(x.at) && !/\bhole\b|undefined/.test(err.message)) {
    return `threw ${showError(o.error)}; the message should say the element is a hole`;
  }
  return undefined;
}

/** True when a definition issue's path is the mutated path, inside it, or one of its parents. */
export function related(issuePath: string, at: string): boolean {
  const a = normalizePath(issuePath);
  const b = normalizePath(at);
  return a === b || a.startsWith(`${b}.`) || a.startsWith(`${b}[`) || b.startsWith(`${a}.`) || b.startsWith(`${a}[`) || b === '' || a === '';
}

function normalizePath(p: string): string {
  return p.replace(/^\./, '');
}

/** `message` starts with `where`, followed by the end of the name (":", " ", "." or "["). */
export function startsWithName(message: string, where: string): boolean {
  if (!message.startsWith(where)) return false;
  const next = message.charAt(where.length);
  return next === ':' || next === ' ' || next === '.' || next === '[' || next === '';
}

/** Short text for a result in a report. */
export function showResult(v: unknown): string {
  if (typeof v === 'number') return Object.is(v, -0) ? '-0' : String(v);
  if (typeof v === 'string') return JSON.stringify(v.length > 80 ? `${v.slice(0, 77)}...` : v);
  if (v === null || typeof v !== 'object') return String(v);
  if (ArrayBuffer.isView(v)) return `${v.constructor.name} [${Array.from(v as unknown as ArrayLike<number>).slice(0, 6).join(', ')}${(v as unknown as ArrayLike<number>).length > 6 ? ', ...' : ''}]`;
  try {
    const s = JSON.stringify(v, (_k, x: unknown) => (typeof x === 'bigint' ? `${x}n` : x));
    return s === undefined ? 'an object' : s.length > 160 ? `${s.slice(0, 157)}...` : s;
  } catch {
    return 'an object';
  }
}

/**
 * Structural equality of two results: numbers by value (so -0 equals 0, NaN equals NaN), typed arrays element by
 * element, objects by their own enumerable keys, functions by name. Bounded: deep structures compare their first
 * levels and a bounded number of nodes.
 */
export function sameValue(a: unknown, b: unknown): boolean {
  let budget = 200_000;
  const seen = new Map<object, object>();
  const eq = (x: unknown, y: unknown, depth: number): boolean => {
    if (--budget < 0) return true;
    if (typeof x === 'number' && typeof y === 'number') return x === y || (Number.isNaN(x) && Number.isNaN(y));
    if (typeof x !== 'object' || typeof y !== 'object' || x === null || y === null) {
      if (typeof x === 'function' && typeof y === 'function') return x.name === y.name;
      return Object.is(x, y);
    }
    if (x === y) return true;
    if (depth > 12) return true;
    if (seen.get(x) === y) return true;
    seen.set(x, y);
    if (ArrayBuffer.isView(x) || ArrayBuffer.isView(y)) {
      if (!ArrayBuffer.isView(x) || !ArrayBuffer.isView(y) || x.constructor !== y.constructor) return false;
      const p = x as unknown as ArrayLike<number>;
      const q = y as unknown as ArrayLike<number>;
      if (p.length !== q.length) return false;
      for (let i = 0; i < p.length; i++) if (!(p[i] === q[i] || (Number.isNaN(p[i]) && Number.isNaN(q[i])))) return false;
      return true;
    }
    if (Array.isArray(x) !== Array.isArray(y)) return false;
    if (x instanceof Date || y instanceof Date) return x instanceof Date && y instanceof Date && x.getTime() === y.getTime();
    if (x instanceof Map || y instanceof Map) {
      if (!(x instanceof Map) || !(y instanceof Map) || x.size !== y.size) return false;
      for (const [k, v] of x) if (!y.has(k) || !eq(v, y.get(k), depth + 1)) return false;
      return true;
    }
    const kx = Object.keys(x);
    const ky = Object.keys(y);
    if (kx.length !== ky.length) return false;
    for (const k of kx) {
      if (!Object.prototype.hasOwnProperty.call(y, k)) return false;
      if (!eq((x as Record<string, unknown>)[k], (y as Record<string, unknown>)[k], depth + 1)) return false;
    }
    return true;
  };
  return eq(a, b, 0);
}

/** The fault of two outcomes that must be the same (both values, equal; or both errors of one class and code). */
export function sameFault(o: Outcome, reference: Outcome, why: string, probe: (v: unknown) => unknown): string | undefined {
  if (o.ok && reference.ok) {
    const a = probe(o.value);
    const b = probe(reference.value);
    return sameValue(a, b) ? undefined : `returned ${showResult(a)}, but the equivalent input returned ${showResult(b)} (${why})`;
  }
  if (!o.ok && !reference.ok) {
    const ca = classOf(o.error);
    const cb = classOf(reference.error);
    const codeA = (o.error as { code?: unknown }).code;
    const codeB = (reference.error as { code?: unknown }).code;
    if (ca === cb && codeA === codeB) return undefined;
    return `threw ${showError(o.error)}, but the equivalent input threw ${showError(reference.error)} (${why})`;
  }
  if (o.ok) return `returned ${showResult(o.value)}, but the equivalent input threw ${showError((reference as { error: unknown }).error)} (${why})`;
  return `threw ${showError(o.error)}, but the equivalent input returned ${showResult((reference as { value: unknown }).value)} (${why})`;
}

/**
 * The fault of two outcomes where the first must be the second shifted by `delta` (an instant answer keeps the
 * fraction of the instant given): numbers by the delta, arrays of numbers element by element with `deltas`.
 */
export function shiftedFault(o: Outcome, reference: Outcome, delta: number, deltas: readonly number[] | undefined, why: string, probe: (v: unknown) => unknown): string | undefined {
  if (!o.ok || !reference.ok) return sameFault(o, reference, why, probe);
  const a = probe(o.value);
  const b = probe(reference.value);
  const close = (x: number, y: number, d: number) => x === y + d || Math.abs(x - y - d) <= Math.abs(y) * 2 ** -50 + 1e-9 || (Number.isNaN(x) && Number.isNaN(y));
  if (typeof a === 'number' && typeof b === 'number') {
    return close(a, b, delta) ? undefined : `returned ${a}, but ${b} + ${delta} was expected (${why})`;
  }
  if (ArrayBuffer.isView(a) && ArrayBuffer.isView(b) && deltas) {
    const p = a as unknown as ArrayLike<number>;
    const q = b as unknown as ArrayLike<number>;
    if (p.length !== q.length) return `returned ${p.length} elements, but the floored input gave ${q.length} (${why})`;
    for (let i = 0; i < p.length; i++) {
      if (!close(p[i]!, q[i]!, deltas[i] ?? 0)) return `element ${i}: returned ${p[i]}, but ${q[i]} + ${deltas[i]} was expected (${why})`;
    }
    return undefined;
  }
  return sameFault(o, reference, why, probe);
}

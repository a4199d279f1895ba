/**
 * @internal The issue collector and field readers shared by every definition validator (units, calendars, rules,
 * series options, profiles). A reader records a fault with its dotted path instead of throwing, so that one
 * {@link DefinitionError} lists every fault of a definition at once.
 *
 * Readers look fields up as own properties only: `constructor`, `toString` and the other names that every object
 * inherits are never mistaken for fields or for members of a name table.
 *
 * @module
 */
import { DefinitionError, type DefinitionIssue, describeValue } from '../errors.js';
import { didYouMean, type SuggestOptions } from './suggest.js';

/** Collects definition faults, each with its dotted path. */
export class Issues {
  readonly list: DefinitionIssue[] = [];
  add(path: string, message: string): void {
    this.list.push({ path, message });
  }
  get ok(): boolean {
    return this.list.length === 0;
  }
  /** Number of faults collected so far. */
  get count(): number {
    return this.list.length;
  }
  /** Throws one DefinitionError listing every fault, if there is any. */
  throwIfAny(received: unknown): void {
    if (this.list.length > 0) throw new DefinitionError(this.list, received);
  }
}

/** `path.key`, or `key` at the root. */
export function joinPath(path: string, key: string | number): string {
  if (typeof key === 'number') return `${path}[${key}]`;
  return path === '' ? key : `${path}.${key}`;
}

/**
 * True for a record of a definition: a plain object (JSON has no Dates, Maps or class instances, and their keys are
 * not data: a Date where a record belongs is refused rather than read as an empty record).
 */
export function isRecord(v: unknown): v is Record<string, unknown> {
  return isPlainObject(v);
}

/**
 * True for a plain object: one made by `{ ... }`, `JSON.parse` or `Object.create(null)`, whose prototype is
 * Object.prototype or null. Dates, Maps, typed arrays and class instances are not (their keys are not data).
 */
export function isPlainObject(v: unknown): v is Record<string, unknown> {
  if (typeof v !== 'object' || v === null) return false;
  const proto = Object.getPrototypeOf(v) as object | null;
  // Object.prototype of this realm or of another (an iframe's, a vm context's): a prototype without a prototype.
  return proto === null || proto === Object.prototype || (Object.getPrototypeOf(proto) === null && !Array.isArray(v));
}

/** True when `key` is an own property of `obj` (never an inherited one such as `constructor`). */
export function hasOwn(obj: object, key: PropertyKey): boolean {
  return Object.prototype.hasOwnProperty.call(obj, key);
}

/** The own property `key` of `obj`, or undefined (inherited names read as absent). */
export function ownField(obj: Record<string, unknown>, key: string): unknown {
  return hasOwn(obj, key) ? obj[key] : undefined;
}

/** The value stored under `key` in a name table, looked up as an own property only. */
export function lookupName<T>(table: Readonly<Record<string, T>>, key: unknown): T | undefined {
  return typeof key === 'string' && hasOwn(table, key) ? table[key] : undefined;
}

/** Records an issue for every own key of `obj` outside `allowed`, with a spelling suggestion. */
export function checkKeys(obj: Record<string, unknown>, allowed: readonly string[], path: string, issues: Issues): void {
  for (const key of Object.keys(obj)) {
    if (!allowed.includes(key)) {
      issues.add(
        joinPath(path, key),
        `unknown field${didYouMean(key, allowed)}; valid fields here are ${allowed.map((k) => JSON.stringify(k)).join(', ')}`,
      );
    }
  }
}

/** Reads an optional integer field in [min, max]; returns `fallback` when absent, NaN when invalid. */
export function readInt(obj: Record<string, unknown>, key: string, path: string, min: number, max: number, issues: Issues, fallback: number): number {
  const v = ownField(obj, key);
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || !Number.isInteger(v) || v < min || v > max) {
    issues.add(path, `expected an integer from ${min} to ${max}, got ${describeValue(v)}`);
    return Number.NaN;
  }
  return v;
}

/** Reads an optional finite number field in [min, max]; returns `fallback` when absent, NaN when invalid. */
export function readNumber(obj: Record<string, unknown>, key: string, path: string, min: number, max: number, issues: Issues, fallback: number): number {
  const v = ownField(obj, key);
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max) {
    issues.add(path, `expected a number from ${min} to ${max}, got ${describeValue(v)}`);
    return Number.NaN;
  }
  return v;
}

/** Reads an optional boolean field; returns `fallback` when absent (and records a fault for anything else). */
export function readBoolean(obj: Record<string, unknown>, key: string, path: string, issues: Issues, fallback: boolean): boolean {
  const v = ownField(obj, key);
  if (v === undefined) return fallback;
  if (typeof v !== 'boolean') {
    issues.add(path, `expected true or false, got ${describeValue(v)}`);
    return fallback;
  }
  return v;
}

/** Reads an optional non-empty string field of at most `maxLength` characters. */
export function readString(obj: Record<string, unknown>, key: string, path: string, issues: Issues, fallback: string | undefined, maxLength = 1000): string | undefined {
  const v = ownField(obj, key);
  if (v === undefined) return fallback;
  if (typeof v !== 'string' || v.length === 0 || v.length > maxLength) {
    issues.add(path, `expected a non-empty string of at most ${maxLength} characters, got ${describeValue(v)}`);
    return undefined;
  }
  return v;
}

/** Reads an optional string enum field, suggesting the closest valid value for a near miss. */
export function readEnum<T extends string>(
  obj: Record<string, unknown>,
  key: string,
  path: string,
  values: readonly T[],
  issues: Issues,
  fallback: T | undefined,
  suggest?: SuggestOptions,
): T | undefined {
  const v = ownField(obj, key);
  if (v === undefined) return fallback;
  if (typeof v !== 'string' || !(values as readonly string[]).includes(v)) {
    issues.add(path, `expected one of ${values.map((x) => JSON.stringify(x)).join(', ')}, got ${describeValue(v)}${didYouMean(v, values, suggest)}`);
    return undefined;
  }
  return v as T;
}

/**
 * @internal Small validation helpers: an issue collector and field readers that record a fault with its path
 * instead of throwing, so that one DefinitionError can list every fault.
 *
 * @module
 */
import { DefinitionError, type DefinitionIssue, describeValue } from '../errors.js';
import type { WeekdayName } from './types.js';

/** Weekday names in ISO order: index + 1 is the ISO weekday number. */
export const WEEKDAY_NAMES: readonly WeekdayName[] = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'];

/** Collects definition faults. */
export class Issues {
  readonly list: DefinitionIssue[] = [];
  add(path: string, message: string): void {
    this.list.push({ path, message });
  }
  get ok(): boolean {
    return this.list.length === 0;
  }
  /** Throws one DefinitionError listing every fault, if there is any. */
  throwIfAny(received: unknown): void {
    if (this.list.length > 0) throw new DefinitionError(this.list, received);
  }
}

export function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Reads an optional integer field in [min, max]; returns `fallback` when absent, NaN when invalid. */
export function readInt(obj: Record<string, unknown>, key: string, path: string, min: number, max: number, issues: Issues, fallback: number): number {
  const v = obj[key];
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || !Number.isInteger(v) || v < min || v > max) {
    issues.add(path, `expected an integer from ${min} to ${max}, got ${describeValue(v)}`);
    return Number.NaN;
  }
  return v;
}

/** Reads an optional string enum field. */
export function readEnum<T extends string>(obj: Record<string, unknown>, key: string, path: string, values: readonly T[], issues: Issues, fallback: T | undefined): T | undefined {
  const v = obj[key];
  if (v === undefined) return fallback;
  if (typeof v !== 'string' || !(values as readonly string[]).includes(v)) {
    issues.add(path, `expected one of ${values.map((x) => JSON.stringify(x)).join(', ')}, got ${describeValue(v)}`);
    return undefined;
  }
  return v as T;
}

/** ISO weekday number (1..7) of a weekday name or number, or NaN (recording the fault). */
export function readWeekday(v: unknown, path: string, issues: Issues): number {
  if (typeof v === 'number' && Number.isInteger(v) && v >= 1 && v <= 7) return v;
  if (typeof v === 'string') {
    const i = WEEKDAY_NAMES.indexOf(v.toLowerCase() as WeekdayName);
    if (i >= 0 && v === v.toLowerCase()) return i + 1;
  }
  issues.add(path, `expected a weekday "monday".."sunday" or an ISO weekday number 1..7, got ${describeValue(v)}`);
  return Number.NaN;
}

/** Throws unless `definition` has no keys outside `allowed` (a misspelled key is a silent wrong answer). */
export function checkKeys(obj: Record<string, unknown>, allowed: readonly string[], prefix: string, issues: Issues): void {
  for (const key of Object.keys(obj)) {
    if (!allowed.includes(key)) {
      issues.add(prefix === '' ? key : `${prefix}.${key}`, `unknown field; valid fields here are ${allowed.map((k) => JSON.stringify(k)).join(', ')}`);
    }
  }
}

/** Deep-freezes a plain JSON-like value (objects and arrays), leaving compiled objects as they are. */
export function deepFreeze<T>(value: T): T {
  if (typeof value !== 'object' || value === null || Object.isFrozen(value)) return value;
  const proto = Object.getPrototypeOf(value) as unknown;
  if (proto !== Object.prototype && proto !== Array.prototype && proto !== null) return value;
  for (const v of Object.values(value as Record<string, unknown>)) deepFreeze(v);
  return Object.freeze(value);
}

/** Deep copy of plain JSON-like data (compiled objects are kept by reference). */
export function plainCopy<T>(value: T): T {
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) return value.map((v: unknown) => plainCopy(v)) as T;
  const proto = Object.getPrototypeOf(value) as unknown;
  if (proto !== Object.prototype && proto !== null) return value;
  if (Object.isFrozen(value) && 'definition' in (value as object)) return value;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) out[k] = plainCopy(v);
  return out as T;
}

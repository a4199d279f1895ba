/**
 * @internal Plain JSON-like data: a deep copy (so that a definition cannot change after it is defined) and a deep
 * freeze. Compiled objects inside a definition (a business calendar, a period unit, a zone) are kept by reference.
 *
 * @module
 */

/** Deep-freezes a plain JSON-like value (objects and arrays), leaving compiled objects as they are. */
export function deepFreeze<T>(value: T): T {
  if (typeof value !== 'object' || value === null || Object.isFrozen(value)) return value;
  const proto = Object.getPrototypeOf(value) as unknown;
  if (proto !== Object.prototype && proto !== Array.prototype && proto !== null) return value;
  for (const v of Object.values(value as Record<string, unknown>)) deepFreeze(v);
  return Object.freeze(value);
}

/**
 * Deep copy of plain JSON-like data (compiled objects are kept by reference). Keys are copied as own properties,
 * so a `"__proto__"` key read from JSON stays a key (and is refused as unknown) instead of becoming a prototype.
 */
export function plainCopy<T>(value: T): T {
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) return value.map((v: unknown) => plainCopy(v)) as T;
  const proto = Object.getPrototypeOf(value) as unknown;
  if (proto !== Object.prototype && proto !== null) return value;
  if (Object.isFrozen(value) && 'definition' in (value as object)) return value;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    Object.defineProperty(out, k, { value: plainCopy(v), enumerable: true, writable: true, configurable: true });
  }
  return out as T;
}

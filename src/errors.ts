/**
 * The error vocabulary of kalends. Every error the library throws is one of these classes; each extends the
 * built-in class a JavaScript programmer would expect (`RangeError`, `TypeError`, `SyntaxError`), carries a
 * stable `code`, the `received` value, and, for definitions, the `path` of the offending field.
 *
 * @module
 */

/** Stable machine-readable error codes. See docs/design.md, "Errors". */
export type ErrorCode =
  | 'out-of-range'
  | 'invalid-type'
  | 'malformed'
  | 'invalid-definition'
  | 'unknown-zone'
  | 'skipped-time'
  | 'repeated-time'
  | 'corrupt-tzif'
  | 'no-business-day'
  | 'limit-exceeded'
  | 'unsorted'
  | 'length-mismatch'
  | 'unsupported'
  | 'unknown-name';

/** Fields shared by every kalends error. */
export interface KalendsErrorFields {
  /** Stable code; branch on this, not on the message. */
  readonly code: ErrorCode;
  /** The value that was rejected (the string, number or object received). */
  readonly received: unknown;
  /** Dotted path of the offending field inside a definition, when there is one. */
  readonly path: string | undefined;
}

/** Options accepted by every kalends error constructor. */
export interface KalendsErrorOptions {
  /** The error's stable code. */
  readonly code: ErrorCode;
  /** The value that was rejected. */
  readonly received: unknown;
  /** Dotted path of the offending field inside a definition, when there is one. */
  readonly path?: string | undefined;
}

/**
 * A value outside its valid range (a month of 13, a year past the supported range, a NaN instant).
 *
 * @example
 * ```ts
 * try { dayNumberFromYmd(2025, 13, 1); } catch (e) { if (e instanceof KalendsRangeError) e.code; } // 'out-of-range'
 * ```
 */
export class KalendsRangeError extends RangeError implements KalendsErrorFields {
  declare readonly code: ErrorCode;
  declare readonly received: unknown;
  declare readonly path: string | undefined;
  constructor(message: string, options: KalendsErrorOptions) {
    super(message);
    setFields(this, 'KalendsRangeError', options);
  }
}

/**
 * A value of the wrong type (a string where a number was expected, an object that is no known date kind).
 *
 * @example
 * ```ts
 * try { toEpochMs({}); } catch (e) { e instanceof KalendsTypeError; } // true
 * ```
 */
export class KalendsTypeError extends TypeError implements KalendsErrorFields {
  declare readonly code: ErrorCode;
  declare readonly received: unknown;
  declare readonly path: string | undefined;
  constructor(message: string, options: KalendsErrorOptions) {
    super(message);
    setFields(this, 'KalendsTypeError', options);
  }
}

/**
 * A string that does not follow its grammar (RFC 3339, RFC 9557, ISO 8601 durations, period labels).
 * `position` is the 0-based index of the first character that could not be read.
 *
 * @example
 * ```ts
 * try { parseInstant('2025-02-30T00:00Z'); } catch (e) { e instanceof KalendsSyntaxError; } // true
 * ```
 */
export class KalendsSyntaxError extends SyntaxError implements KalendsErrorFields {
  declare readonly code: ErrorCode;
  declare readonly received: unknown;
  declare readonly path: string | undefined;
  /** The 0-based index of the first character that could not be read. */
  declare readonly position: number;
  constructor(message: string, options: KalendsErrorOptions & {
    /** The 0-based index of the first character that could not be read (default 0). */
    readonly position?: number;
  }) {
    super(message);
    setFields(this, 'KalendsSyntaxError', options);
    this.position = options.position ?? 0;
  }
}

/**
 * Sets the fields of a kalends error in the order the classes have always had them (code, received, path, then
 * name), in one place so that each class stays small.
 */
function setFields(e: Error, name: string, options: KalendsErrorOptions): void {
  const t = e as { -readonly [K in keyof KalendsErrorFields]: KalendsErrorFields[K] } & Error;
  t.code = options.code;
  t.received = options.received;
  t.path = options.path;
  t.name = name;
}

/** One fault found while validating a definition. */
export interface DefinitionIssue {
  /** Dotted path, e.g. `fiscal.yearEnd.weekday`. */
  readonly path: string;
  /** What was expected and what was received. */
  readonly message: string;
}

/**
 * A plain-data definition (a fiscal unit, a business calendar, a frequency rule) that failed validation.
 * `issues` lists every fault with its path; the message shows them all.
 *
 * @example
 * ```ts
 * // DefinitionError: fiscal.start.day: expected 1..30 for month 6, got 31
 * ```
 */
export class DefinitionError extends RangeError implements KalendsErrorFields {
  readonly code: ErrorCode = 'invalid-definition';
  readonly received: unknown;
  readonly path: string | undefined;
  /** Every fault found, each with its dotted path. */
  readonly issues: readonly DefinitionIssue[];
  constructor(issues: readonly DefinitionIssue[], received: unknown) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    this.name = 'DefinitionError';
    this.issues = issues;
    this.received = received;
    this.path = issues[0]?.path;
  }
}

/** Shows a received value in an error message: strings quoted, objects by their kind. */
export function describeValue(value: unknown): string {
  if (typeof value === 'string') {
    const shown = value.length > 80 ? `${value.slice(0, 77)}...` : value;
    return JSON.stringify(shown);
  }
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'bigint') return `${value}n`;
  if (typeof value === 'function') return 'a function';
  // null, undefined, booleans and symbols (String gives a symbol's description: Symbol(x)).
  if (typeof value !== 'object' || value === null) return String(value);
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  const ctor = (value as { constructor?: { name?: string } }).constructor?.name;
  return ctor && ctor !== 'Object' ? `a ${ctor}` : 'an object';
}

/**
 * Throws a {@link KalendsRangeError} unless `value` is an integer within [min, max].
 * `name` is the parameter's name, shown in the message.
 */
export function requireInteger(name: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    const message = `${name}: expected an integer from ${min} to ${max}, got ${describeValue(value)}`;
    throw typeof value !== 'number'
      ? new KalendsTypeError(message, { code: 'invalid-type', received: value })
      : new KalendsRangeError(message, { code: 'out-of-range', received: value });
  }
  return value;
}

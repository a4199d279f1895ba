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
  readonly code: ErrorCode;
  readonly received: unknown;
  readonly path: string | undefined;
  constructor(message: string, options: KalendsErrorOptions) {
    super(message);
    this.name = 'KalendsRangeError';
    this.code = options.code;
    this.received = options.received;
    this.path = options.path;
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
  readonly code: ErrorCode;
  readonly received: unknown;
  readonly path: string | undefined;
  constructor(message: string, options: KalendsErrorOptions) {
    super(message);
    this.name = 'KalendsTypeError';
    this.code = options.code;
    this.received = options.received;
    this.path = options.path;
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
  readonly code: ErrorCode;
  readonly received: unknown;
  readonly path: string | undefined;
  /** The 0-based index of the first character that could not be read. */
  readonly position: number;
  constructor(message: string, options: KalendsErrorOptions & {
    /** The 0-based index of the first character that could not be read (default 0). */
    readonly position?: number;
  }) {
    super(message);
    this.name = 'KalendsSyntaxError';
    this.code = options.code;
    this.received = options.received;
    this.path = options.path;
    this.position = options.position ?? 0;
  }
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
  if (value === null) return 'null';
  if (value === undefined) return 'undefined';
  if (typeof value === 'function') return 'a function';
  if (typeof value === 'symbol') return value.toString();
  if (typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  const ctor = (value as { constructor?: { name?: string } }).constructor?.name;
  return ctor && ctor !== 'Object' ? `a ${ctor}` : 'an object';
}

/**
 * Throws a {@link KalendsRangeError} unless `value` is an integer within [min, max].
 * `name` is the parameter's name, shown in the message.
 */
export function requireInteger(name: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number') {
    throw new KalendsTypeError(`${name}: expected an integer from ${min} to ${max}, got ${describeValue(value)}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new KalendsRangeError(`${name}: expected an integer from ${min} to ${max}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

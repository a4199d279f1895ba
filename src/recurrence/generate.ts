/**
 * Generation: occurrences between bounds, the first n, lazy iteration, next and previous, membership and bulk
 * typed arrays. Every range is end-exclusive (`[start, end)`, docs/design.md "Ranges"); `endInclusive` says
 * otherwise where it is wanted.
 *
 * @module
 */
import { DefinitionError, KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MS_PER_DAY } from '../bounds.js';
import { type Compiled, MAX_COUNT, VALUE_END, VALUE_MIN, compileCivilRule, compileIntraday } from './compile.js';
import { Sink } from './engine.js';
import { toDayNumber, toEpochMs } from './deps.js';
import { compileRfc5545 } from './rfc5545-compile.js';
import type { Rule, RuleDefinition, RuleKind } from './types.js';
import { Issues, deepFreeze, isRecord, plainCopy } from './validate.js';

const compiledRules = new WeakMap<Rule, Compiled>();

const KINDS: readonly RuleKind[] = [
  'days',
  'business-days',
  'weekly',
  'monthly',
  'semi-monthly',
  'quarterly',
  'half-yearly',
  'yearly',
  'periods',
  'intraday',
  'rfc5545',
];

/**
 * Validates a rule definition (plain JSON data) and compiles it. Every fault is collected into one
 * {@link DefinitionError} whose `issues` name the path (`on.day`, `weekdays[2]`, `every`). A rule that can never
 * produce a date is rejected here (the check covers a full 400-year Gregorian cycle), so no later search hangs.
 *
 * @example
 * ```ts
 * const paydays = defineRule({ kind: 'monthly', on: [{ day: 15 }, { day: 'last' }] });
 * listOccurrences(paydays, '2025-02-01', '2025-04-01').map(formatPlainDate);
 * // ['2025-02-15', '2025-02-28', '2025-03-15', '2025-03-31']
 * ```
 */
export function defineRule(definition: RuleDefinition): Rule {
  if (!isRecord(definition)) {
    throw new DefinitionError([{ path: '', message: `expected a rule definition object with a "kind", got ${describeValue(definition)}` }], definition);
  }
  const kind = definition['kind' as keyof typeof definition] as unknown;
  if (typeof kind !== 'string' || !(KINDS as readonly string[]).includes(kind)) {
    throw new DefinitionError(
      [{ path: 'kind', message: `expected one of ${KINDS.map((k) => JSON.stringify(k)).join(', ')}, got ${describeValue(kind)}` }],
      definition,
    );
  }
  const copy = plainCopy(definition) as unknown as Record<string, unknown>;
  const issues = new Issues();
  const compiled =
    kind === 'intraday' ? compileIntraday(copy, issues) : kind === 'rfc5545' ? compileRfc5545(copy, issues) : compileCivilRule(copy, issues);
  issues.throwIfAny(definition);
  if (!compiled) throw new DefinitionError([{ path: '', message: 'could not compile the rule' }], definition);
  const rule: Rule = Object.freeze({ kind: kind as RuleKind, values: compiled.values, definition: deepFreeze(copy) as unknown as RuleDefinition });
  compiledRules.set(rule, compiled);
  if (compiled.count !== undefined) countOccurrences(compiled, definition);
  return rule;
}

/** @internal The compiled form of a rule, or a type error naming `name`. */
export function compiledOf(rule: unknown, name = 'rule'): Compiled {
  const c = typeof rule === 'object' && rule !== null ? compiledRules.get(rule as Rule) : undefined;
  if (!c) {
    throw new KalendsTypeError(`${name}: expected a rule from defineRule or parseRecurrenceRule, got ${describeValue(rule)}`, {
      code: 'invalid-type',
      received: rule,
    });
  }
  return c;
}

/** Reads a value argument as a day number or an instant, per the rule. */
function valueOf(c: Compiled, v: unknown, name: string): number {
  try {
    return c.values === 'dates' ? toDayNumber(v) : toEpochMs(v);
  } catch (e) {
    const what = c.values === 'dates' ? 'a date (ISO 8601 string or day number)' : 'an instant (RFC 3339 string or epoch milliseconds)';
    const err = e as Error & { code?: string };
    const Ctor = e instanceof TypeError ? KalendsTypeError : KalendsRangeError;
    throw new Ctor(`${name}: expected ${what}, got ${describeValue(v)}: ${err.message}`, {
      code: e instanceof TypeError ? 'invalid-type' : 'out-of-range',
      received: v,
    });
  }
}

/** Margin (units) around a range so that raw dates adjusted into it are seen. */
function adjustmentMargin(c: Compiled, lo: number, hi: number): [number, number] {
  const cal = c.business!;
  let before = 8;
  while (before <= 4096 && lo - before > cal.firstDay && cal.adjust(lo - before, c.convention) >= lo) before *= 2;
  let after = 8;
  while (after <= 4096 && hi + after < cal.endDay - 1 && cal.adjust(hi + after, c.convention) < hi) after *= 2;
  if (before > 4096 || after > 4096) {
    throw new KalendsRangeError(`calendar ${JSON.stringify(cal.id)}: no business day within 4,096 days of the range; the adjustment convention cannot be applied`, {
      code: 'no-business-day',
      received: [lo, hi],
    });
  }
  return [before, after];
}

const scratchSink = new Sink(256);

/**
 * @internal Appends the occurrences in [lo, hi) to `out`, in strictly increasing order: raw dates within the
 * rule's bounds, adjusted, de-duplicated, with exclusions removed unless `keepExcluded`.
 */
export function fillOccurrences(c: Compiled, lo: number, hi: number, out: Sink, keepExcluded = false): void {
  lo = Math.max(lo, VALUE_MIN[c.values]);
  hi = Math.min(hi, VALUE_END[c.values], keepExcluded ? VALUE_END[c.values] : c.countEnd);
  if (lo >= hi) return;
  const before = out.length;
  if (c.convention === 'none' || !c.business) {
    c.engine.fill(Math.max(lo, c.rawStart), Math.min(hi, c.rawEnd), out);
  } else {
    const [mLo, mHi] = adjustmentMargin(c, lo, hi);
    const raw = scratchSink;
    raw.clear();
    c.engine.fill(Math.max(lo - mLo, c.rawStart), Math.min(hi + mHi, c.rawEnd), raw);
    let prev = out.length > 0 ? out.last() : Number.NaN;
    for (let i = 0; i < raw.length; i++) {
      const a = c.business.adjust(raw.data[i]!, c.convention);
      if (a >= lo && a < hi && a !== prev) {
        out.push(a);
        prev = a;
      }
    }
    raw.clear();
  }
  if (c.exclude && !keepExcluded) {
    let w = before;
    for (let i = before; i < out.length; i++) {
      const v = out.data[i]!;
      if (!c.exclude.has(v)) out.data[w++] = v;
    }
    out.length = w;
  }
}

/** Distance a search may cover before it gives up: the proven gap, or about 800 years. */
function searchLimit(c: Compiled): number {
  const unit = c.values === 'dates' ? 1 : MS_PER_DAY;
  const fallback = 2 * 146_097 * unit;
  return Number.isFinite(c.engine.maxGap) ? Math.min(2 * c.engine.maxGap + 400 * unit, 8 * fallback) : fallback;
}

function limitError(c: Compiled, from: number, direction: string): KalendsRangeError {
  const unit = c.values === 'dates' ? 'days' : 'ms';
  return new KalendsRangeError(
    `no occurrence ${direction} ${from} within ${searchLimit(c)} ${unit} (about 800 years): the rule's business calendar leaves no matching day there; the search stops instead of running on`,
    { code: 'limit-exceeded', received: from },
  );
}

/** Highest value any occurrence can have (exclusive), to end searches early. */
function occurrenceCeiling(c: Compiled, keepExcluded = false): number {
  const adjMargin = c.convention === 'none' ? 0 : 4096;
  return Math.min(VALUE_END[c.values], keepExcluded ? VALUE_END[c.values] : c.countEnd, c.rawEnd + adjMargin);
}
function occurrenceFloor(c: Compiled): number {
  const adjMargin = c.convention === 'none' ? 0 : 4096;
  return Math.max(VALUE_MIN[c.values], c.rawStart - adjMargin);
}

/** @internal First occurrence >= from, or undefined. */
export function firstAtOrAfter(c: Compiled, from: number, keepExcluded = false): number | undefined {
  const ceiling = occurrenceCeiling(c, keepExcluded);
  let lo = Math.max(from, occurrenceFloor(c));
  const limit = searchLimit(c);
  const origin = lo;
  let width = Math.ceil(Math.max(c.engine.stride * 4, c.values === 'dates' ? 8 : 60_000));
  const out = new Sink(16);
  while (lo < ceiling) {
    const hi = Math.min(lo + width, ceiling);
    out.clear();
    fillOccurrences(c, lo, hi, out, keepExcluded);
    if (out.length > 0) return out.data[0]!;
    if (hi - origin > limit) throw limitError(c, from, 'on or after');
    lo = hi;
    width *= 2;
  }
  return undefined;
}

/** @internal Last occurrence < before, or undefined. */
export function lastBefore(c: Compiled, before: number): number | undefined {
  const floor = occurrenceFloor(c);
  let hi = Math.min(before, occurrenceCeiling(c));
  const limit = searchLimit(c);
  const origin = hi;
  let width = Math.ceil(Math.max(c.engine.stride * 4, c.values === 'dates' ? 8 : 60_000));
  const out = new Sink(16);
  while (hi > floor) {
    const lo = Math.max(hi - width, floor);
    out.clear();
    fillOccurrences(c, lo, hi, out);
    if (out.length > 0) return out.data[out.length - 1]!;
    if (origin - lo > limit) throw limitError(c, before, 'before');
    hi = lo;
    width *= 2;
  }
  return undefined;
}

/** Counts `count` occurrences from the rule's start and records where they stop. */
function countOccurrences(c: Compiled, definition: unknown): void {
  const target = c.count!;
  let seen = 0;
  let lo = occurrenceFloor(c);
  const ceiling = occurrenceCeiling(c, true);
  const out = new Sink(Math.min(target, 4096));
  const first = firstAtOrAfter(c, lo, true);
  if (first === undefined) return;
  lo = first;
  let width = Math.ceil(Math.max(c.engine.stride * 64, 64));
  while (lo < ceiling) {
    const hi = Math.min(lo + width, ceiling);
    out.clear();
    fillOccurrences(c, lo, hi, out, true);
    if (seen + out.length >= target) {
      c.countEnd = out.data[target - seen - 1]! + 1;
      return;
    }
    seen += out.length;
    if (out.length === 0) {
      const next = firstAtOrAfter(c, hi, true);
      if (next === undefined) return;
      lo = next;
      continue;
    }
    lo = hi;
    width = Math.ceil(Math.min(width * 2, c.engine.stride * 1_048_576));
  }
  void definition;
}

function requireRange(c: Compiled, start: unknown, end: unknown, endInclusive: boolean | undefined): [number, number] {
  const s = valueOf(c, start, 'start');
  let e = valueOf(c, end, 'end');
  if (endInclusive) e += 1;
  if (e < s) {
    throw new KalendsRangeError(`end: expected a value on or after start (${describeValue(start)}), got ${describeValue(end)}`, {
      code: 'out-of-range',
      received: end,
    });
  }
  return [s, e];
}

/** Options of {@link listOccurrences} and {@link occurrenceBulk}. */
export interface RangeOptions {
  /** Include an occurrence that falls exactly on `end` (default false: ranges are `[start, end)`). */
  readonly endInclusive?: boolean;
  /** Most occurrences accepted before a `limit-exceeded` error (default 10,000,000). */
  readonly maxCount?: number;
}

function fillRange(c: Compiled, s: number, e: number, out: Sink, maxCount: number): void {
  const chunk = Math.ceil(Math.max(c.engine.stride * 4096, c.values === 'dates' ? 4096 : 4096 * 60_000));
  for (let lo = s; lo < e; lo += chunk) {
    fillOccurrences(c, lo, Math.min(lo + chunk, e), out);
    if (out.length > maxCount) {
      throw new KalendsRangeError(`the range holds more than maxCount = ${maxCount} occurrences; narrow the range or raise options.maxCount`, {
        code: 'limit-exceeded',
        received: maxCount,
      });
    }
  }
}

/**
 * The occurrences of `rule` in `[start, end)`, in increasing order: day numbers for date rules, epoch
 * milliseconds for instant rules. Bounds accept what `toDayNumber` / `toEpochMs` accept (ISO strings, numbers).
 * With a business-day convention the adjusted dates are the occurrences: they are what falls in the range, and
 * two dates that adjust to the same day appear once.
 *
 * @example
 * ```ts
 * const fridays = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-03' });
 * listOccurrences(fridays, '2025-01-01', '2025-02-01').map(formatPlainDate);
 * // ['2025-01-03', '2025-01-17', '2025-01-31']
 * ```
 */
export function listOccurrences(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): number[] {
  const c = compiledOf(rule);
  const [s, e] = requireRange(c, start, end, options?.endInclusive);
  const out = new Sink(64);
  fillRange(c, s, e, out, options?.maxCount ?? MAX_COUNT);
  return Array.from(out.data.subarray(0, out.length));
}

/**
 * The occurrences of `rule` in `[start, end)` as a typed array: an `Int32Array` of day numbers for date rules,
 * a `Float64Array` of epoch milliseconds for instant rules. One pass, no per-occurrence allocation.
 *
 * @example
 * ```ts
 * const monthEnds = defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar: myCalendar });
 * occurrenceBulk(monthEnds, '1900-01-01', '2101-01-01'); // Int32Array(2412)
 * ```
 */
export function occurrenceBulk(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): Int32Array | Float64Array {
  const c = compiledOf(rule);
  const [s, e] = requireRange(c, start, end, options?.endInclusive);
  const out = new Sink(c.values === 'dates' ? Math.min(Math.max(16, Math.ceil((e - s) / Math.max(1, c.engine.stride)) + 16), 1 << 20) : 64);
  fillRange(c, s, e, out, options?.maxCount ?? MAX_COUNT);
  return c.values === 'dates' ? Int32Array.from(out.data.subarray(0, out.length)) : out.data.slice(0, out.length);
}

/** Options of {@link iterateOccurrences}. */
export interface IterateOptions {
  /**
   * The most occurrences to yield. Required unless the rule itself ends (it has `end`, `count` or UNTIL): an
   * unbounded expansion without a limit is an error, not an endless loop.
   */
  readonly limit?: number;
}

/**
 * Lazily yields the occurrences of `rule` from `from` (inclusive) in increasing order, at most `options.limit`
 * of them. A rule that never ends needs a limit.
 *
 * @example
 * ```ts
 * const daily = defineRule({ kind: 'days' });
 * [...iterateOccurrences(daily, '2025-01-30', { limit: 3 })].map(formatPlainDate);
 * // ['2025-01-30', '2025-01-31', '2025-02-01']
 * ```
 */
export function* iterateOccurrences(rule: Rule, from: unknown, options?: IterateOptions): Generator<number, void, undefined> {
  const c = compiledOf(rule);
  let lo = valueOf(c, from, 'from');
  const limit = options?.limit;
  const bounded = c.rawEnd < VALUE_END[c.values] || c.countEnd < VALUE_END[c.values] || c.count !== undefined;
  if (limit === undefined && !bounded) {
    throw new KalendsRangeError(
      'options.limit: the rule has no end, count or UNTIL, so iterating it needs a limit (the most occurrences to yield); got undefined',
      { code: 'limit-exceeded', received: limit },
    );
  }
  if (limit !== undefined && (typeof limit !== 'number' || !Number.isInteger(limit) || limit < 0)) {
    throw new KalendsRangeError(`options.limit: expected a non-negative integer, got ${describeValue(limit)}`, { code: 'out-of-range', received: limit });
  }
  let left = limit ?? Number.POSITIVE_INFINITY;
  const out = new Sink(64);
  while (left > 0) {
    const first = firstAtOrAfter(c, lo);
    if (first === undefined) return;
    const width = Math.ceil(Math.max(c.engine.stride * 64, c.values === 'dates' ? 64 : 3_600_000));
    out.clear();
    fillOccurrences(c, first, first + width, out);
    for (let i = 0; i < out.length && left > 0; i++, left--) yield out.data[i]!;
    lo = first + width;
  }
}

/**
 * The first `count` occurrences of `rule` on or after `from`, as an array (fewer when the rule ends first).
 *
 * @example
 * ```ts
 * listFirstOccurrences(defineRule({ kind: 'monthly', on: { day: 'last' } }), '2024-01-15', 3).map(formatPlainDate);
 * // ['2024-01-31', '2024-02-29', '2024-03-31']
 * ```
 */
export function listFirstOccurrences(rule: Rule, from: unknown, count: number): number[] {
  if (typeof count !== 'number' || !Number.isInteger(count) || count < 0 || count > MAX_COUNT) {
    throw new KalendsRangeError(`count: expected an integer from 0 to ${MAX_COUNT}, got ${describeValue(count)}`, { code: 'out-of-range', received: count });
  }
  return [...iterateOccurrences(rule, from, { limit: count })];
}

/** Options of {@link nextOccurrence} and {@link previousOccurrence}. */
export interface StepOptions {
  /** Count `from` itself when it is an occurrence (default false: strictly after / before). */
  readonly inclusive?: boolean;
}

/**
 * The first occurrence strictly after `from` (or on it, with `inclusive`), or null when the rule has ended.
 * Searches are bounded: a rule whose business calendar leaves no matching day for centuries gives a
 * `limit-exceeded` error instead of running on.
 *
 * @example
 * ```ts
 * const payday = defineRule({ kind: 'monthly', on: { day: 15 } });
 * formatPlainDate(nextOccurrence(payday, '2025-01-15')!); // '2025-02-15'
 * ```
 */
export function nextOccurrence(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledOf(rule);
  const v = valueOf(c, from, 'from');
  return firstAtOrAfter(c, options?.inclusive ? v : v + 1) ?? null;
}

/**
 * The last occurrence strictly before `from` (or on it, with `inclusive`), or null when there is none.
 *
 * @example
 * ```ts
 * const payday = defineRule({ kind: 'monthly', on: { day: 15 } });
 * formatPlainDate(previousOccurrence(payday, '2025-01-15')!); // '2024-12-15'
 * ```
 */
export function previousOccurrence(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledOf(rule);
  const v = valueOf(c, from, 'from');
  return lastBefore(c, options?.inclusive ? v + 1 : v) ?? null;
}

/**
 * Whether `value` (a date for date rules, an instant for instant rules) is an occurrence of `rule`.
 *
 * @example
 * ```ts
 * matchesRule(defineRule({ kind: 'monthly', on: { weekday: 'friday', nth: -1 } }), '2025-01-31'); // true
 * ```
 */
export function matchesRule(rule: Rule, value: unknown): boolean {
  const c = compiledOf(rule);
  const v = valueOf(c, value, 'value');
  const out = new Sink(4);
  fillOccurrences(c, v, v + 1, out);
  return out.length > 0;
}

/**
 * The occurrences of a rule, in functions whose names say their unit: `…DayNumber…` for rules of dates (day
 * numbers), `…EpochMs…` for rules of instants (epoch milliseconds). A rule says which it is in `rule.values`
 * (`'dates'` or `'instants'`); calling the form of the other unit is a `KalendsTypeError` that names the right
 * function. Every range is end-exclusive (`[start, end)`, docs/design.md "Ranges"); `endInclusive` says otherwise
 * where it is wanted. Range arguments (`start`, `end`, `from`) accept what `toDayNumber` / `toEpochMs` accept
 * (ISO 8601 text, numbers, Dates, Temporal objects); `isOccurrence…` takes a number.
 *
 * Renamed in 0.2: `listOccurrences`, `iterateOccurrences`, `nextOccurrence`, `previousOccurrence`, `matchesRule`
 * and `occurrenceBulk` (one function for both units); `listFirstOccurrences` is `iterate…` with a `limit`.
 *
 * @module
 */
import { DEFAULT_MAX_OCCURRENCES, MAX_OCCURRENCES } from '../bounds.js';
import { readOptions, requireBoolean, requireDayNumberArgument, requireEpochMs, requireWhole } from '../diagnostics/index.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type Compiled, VALUE_END } from './compile.js';
import { toDayNumber, toEpochMs } from './deps.js';
import { Sink } from './engine.js';
import { compiledOf, fillOccurrences, firstAtOrAfter, lastBefore } from './generate.js';
import type { Rule } from './types.js';

/** Options of the `list…` and `…Bulk` functions. */
export interface RangeOptions {
  /** Include an occurrence that falls exactly on `end` (default false: ranges are `[start, end)`). */
  readonly endInclusive?: boolean;
  /**
   * Most occurrences one call returns before a `limit-exceeded` error (default 1,000,000; at most 10,000,000).
   * Page through longer ranges with consecutive ranges, or iterate with a limit.
   */
  readonly maxCount?: number;
}

/** Options of the `iterate…` functions. */
export interface IterateOptions {
  /**
   * The most occurrences to yield. Required unless the rule itself ends (it has `end`, `count` or UNTIL): an
   * unbounded expansion without a limit is an error, not an endless loop.
   */
  readonly limit?: number;
}

/** Options of the `next…` and `previous…` functions. */
export interface StepOptions {
  /** Count `from` itself when it is an occurrence (default false: strictly after / before). */
  readonly inclusive?: boolean;
}

type Unit = 'dates' | 'instants';

const FORMS: Readonly<Record<string, readonly [string, string]>> = /* @__PURE__ */ Object.freeze({
  list: ['listOccurrenceDayNumbers', 'listOccurrenceEpochMs'],
  bulk: ['occurrenceDayNumberBulk', 'occurrenceEpochMsBulk'],
  iterate: ['iterateOccurrenceDayNumbers', 'iterateOccurrenceEpochMs'],
  next: ['nextOccurrenceDayNumber', 'nextOccurrenceEpochMs'],
  previous: ['previousOccurrenceDayNumber', 'previousOccurrenceEpochMs'],
  is: ['isOccurrenceDayNumber', 'isOccurrenceEpochMs'],
});

/** The compiled rule, when its occurrences are of `unit`; otherwise a type error naming the function to call. */
function compiledIn(rule: unknown, unit: Unit, form: keyof typeof FORMS): Compiled {
  const c = compiledOf(rule);
  if (c.values !== unit) {
    const r = rule as Rule;
    const [dates, instants] = FORMS[form]!;
    throw new KalendsTypeError(
      `rule: a rule of ${c.values === 'dates' ? 'dates' : 'instants'} (kind ${JSON.stringify(r.kind)}) has ${c.values === 'dates' ? 'day numbers' : 'epoch milliseconds'} as its occurrences, not ${unit === 'dates' ? 'day numbers' : 'epoch milliseconds'}; call ${c.values === 'dates' ? dates : instants} instead (rule.values says which)`,
      { code: 'invalid-type', received: r.kind },
    );
  }
  return c;
}

/** Reads a range argument (a date or an instant, as the rule's values are). */
/** @internal A date (day number) or an instant (epoch ms) as the rule's values are, from what a user holds. */
export function valueOf(c: Compiled, v: unknown, name: string): number {
  // Numbers are taken as they are (instants may carry a fraction of a millisecond, docs/design.md "Input rules").
  if (typeof v === 'number') return c.values === 'dates' ? requireDayNumberArgument(name, v) : requireEpochMs(name, v);
  try {
    return c.values === 'dates' ? toDayNumber(v) : toEpochMs(v);
  } catch (e) {
    const what = c.values === 'dates' ? 'a date (an ISO 8601 date such as "2025-01-31" or a day number)' : 'an instant (an RFC 3339 string such as "2025-01-31T09:00:00Z" or epoch milliseconds)';
    const reason = (e as Error).message.replace(/^[A-Za-z]+: /, '');
    const Ctor = e instanceof TypeError ? KalendsTypeError : KalendsRangeError;
    throw new Ctor(`${name}: expected ${what}; ${reason}`, { code: e instanceof TypeError ? 'invalid-type' : 'out-of-range', received: v });
  }
}

function rangeOf(c: Compiled, start: unknown, end: unknown, options: unknown): { s: number; e: number; maxCount: number } {
  const o = readOptions('options', options, ['endInclusive', 'maxCount']);
  const endInclusive = requireBoolean('options.endInclusive', o['endInclusive'], false);
  const maxCount = requireWhole('options.maxCount', o['maxCount'], 1, MAX_OCCURRENCES, DEFAULT_MAX_OCCURRENCES);
  const s = valueOf(c, start, 'start');
  let e = valueOf(c, end, 'end');
  // Occurrences are whole days or whole milliseconds: an inclusive end takes the whole unit it falls in.
  if (endInclusive) e = Math.floor(e) + 1;
  if (e < s) {
    throw new KalendsRangeError(`end: expected a value on or after start (${describeValue(start)}), got ${describeValue(end)}; swap the two`, {
      code: 'out-of-range',
      received: end,
    });
  }
  return { s, e, maxCount };
}

function tooMany(maxCount: number, list: string, iterate: string): KalendsRangeError {
  return new KalendsRangeError(
    `options.maxCount: the range holds more than ${maxCount} occurrences, the most one call returns; page with consecutive narrower ranges, use ${iterate} with a limit, or raise options.maxCount (at most ${MAX_OCCURRENCES}) for ${list}`,
    { code: 'limit-exceeded', received: maxCount },
  );
}

/** The occurrences in [s, e), refusing more than `maxCount` (by arithmetic first where the rule allows it). */
function fillRange(c: Compiled, s: number, e: number, maxCount: number, form: 'list' | 'bulk'): Sink {
  const names = FORMS[form]!;
  const list = c.values === 'dates' ? names[0] : names[1];
  const iterate = c.values === 'dates' ? FORMS['iterate']![0] : FORMS['iterate']![1];
  // At least one raw occurrence every maxGap units: a range that must hold too many fails before anything is built.
  const lo = Math.max(s, c.rawStart);
  const hi = Math.min(e, c.rawEnd);
  if (c.convention === 'none' && !c.exclude && Number.isFinite(c.engine.maxGap) && Math.floor((hi - lo) / c.engine.maxGap) > maxCount) {
    throw tooMany(maxCount, list, iterate);
  }
  const out = new Sink(64);
  const chunk = Math.ceil(Math.max(c.engine.stride * 4096, c.values === 'dates' ? 4096 : 4096 * 60_000));
  for (let a = s; a < e; a += chunk) {
    fillOccurrences(c, a, Math.min(a + chunk, e), out);
    if (out.length > maxCount) throw tooMany(maxCount, list, iterate);
  }
  return out;
}

/**
 * The occurrences of a rule of dates in `[start, end)`, as day numbers in increasing order. With a business-day
 * convention the adjusted dates are the occurrences: they are what falls in the range, and two dates that adjust
 * to the same day appear once. For a rule of instants, call {@link listOccurrenceEpochMs}.
 *
 * @example
 * ```ts
 * const fridays = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-03' });
 * listOccurrenceDayNumbers(fridays, '2025-01-01', '2025-02-01').map(formatPlainDate);
 * // ['2025-01-03', '2025-01-17', '2025-01-31']
 * ```
 */
export function listOccurrenceDayNumbers(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): number[] {
  const c = compiledIn(rule, 'dates', 'list');
  const { s, e, maxCount } = rangeOf(c, start, end, options);
  const out = fillRange(c, s, e, maxCount, 'list');
  return Array.from(out.data.subarray(0, out.length));
}

/**
 * The occurrences of a rule of instants (an intraday rule, or RFC 5545 text with a time of day) in
 * `[start, end)`, as epoch milliseconds in increasing order. For a rule of dates, call
 * {@link listOccurrenceDayNumbers}.
 *
 * @example
 * ```ts
 * const checks = defineRule({ kind: 'intraday', zone: 'America/Chicago', every: { hours: 4 }, anchor: '2026-03-08T00:00', clock: 'wall' });
 * listOccurrenceEpochMs(checks, '2026-03-08T06:00:00Z', '2026-03-08T18:00:00Z').map((t) => formatInstant(t));
 * // ['2026-03-08T06:00:00Z', '2026-03-08T09:00:00Z', '2026-03-08T13:00:00Z', '2026-03-08T17:00:00Z']
 * ```
 */
export function listOccurrenceEpochMs(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): number[] {
  const c = compiledIn(rule, 'instants', 'list');
  const { s, e, maxCount } = rangeOf(c, start, end, options);
  const out = fillRange(c, s, e, maxCount, 'list');
  return Array.from(out.data.subarray(0, out.length));
}

/**
 * {@link listOccurrenceDayNumbers} as an `Int32Array`: one pass, no per-occurrence allocation.
 *
 * @example
 * ```ts
 * const monthEnds = defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar: 'us-federal' });
 * occurrenceDayNumberBulk(monthEnds, '1990-01-01', '2091-01-01'); // Int32Array(1212)
 * ```
 */
export function occurrenceDayNumberBulk(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): Int32Array {
  const c = compiledIn(rule, 'dates', 'bulk');
  const { s, e, maxCount } = rangeOf(c, start, end, options);
  const out = fillRange(c, s, e, maxCount, 'bulk');
  return Int32Array.from(out.data.subarray(0, out.length));
}

/**
 * {@link listOccurrenceEpochMs} as a `Float64Array`: one pass, no per-occurrence allocation.
 *
 * @example
 * ```ts
 * const quarterHours = defineRule({ kind: 'intraday', zone: 'UTC', every: { minutes: 15 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
 * occurrenceEpochMsBulk(quarterHours, '2026-01-01T00:00Z', '2026-01-02T00:00Z').length; // 96
 * ```
 */
export function occurrenceEpochMsBulk(rule: Rule, start: unknown, end: unknown, options?: RangeOptions): Float64Array {
  const c = compiledIn(rule, 'instants', 'bulk');
  const { s, e, maxCount } = rangeOf(c, start, end, options);
  const out = fillRange(c, s, e, maxCount, 'bulk');
  return out.data.slice(0, out.length);
}

/** Validates the iteration up front (so that errors come from the call, not from the first `next()`). */
function iteration(c: Compiled, from: unknown, options: unknown): { lo: number; limit: number } {
  const o = readOptions('options', options, ['limit']);
  const lo = valueOf(c, from, 'from');
  const given = o['limit'];
  const bounded = c.rawEnd < VALUE_END[c.values] || c.count !== undefined;
  if (given === undefined && !bounded) {
    throw new KalendsRangeError(
      'options.limit: the rule has no end, count or UNTIL, so iterating it needs a limit (the most occurrences to yield), got undefined; pass { limit: n }',
      { code: 'limit-exceeded', received: given },
    );
  }
  const limit = given === undefined ? Number.POSITIVE_INFINITY : requireWhole('options.limit', given, 0, Number.MAX_SAFE_INTEGER);
  return { lo, limit };
}

function* occurrencesFrom(c: Compiled, from: number, limit: number): Generator<number, void, undefined> {
  let left = limit;
  let lo = from;
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
 * Lazily yields the occurrences of a rule of dates from `from` (inclusive) in increasing order, as day numbers,
 * at most `options.limit` of them. A rule that never ends needs a limit. The first n occurrences:
 * `Array.from(iterateOccurrenceDayNumbers(rule, from, { limit: n }))`.
 *
 * @example
 * ```ts
 * const monthEnds = defineRule({ kind: 'monthly', on: { day: 'last' } });
 * Array.from(iterateOccurrenceDayNumbers(monthEnds, '2024-01-15', { limit: 3 }), formatPlainDate);
 * // ['2024-01-31', '2024-02-29', '2024-03-31']
 * ```
 */
export function iterateOccurrenceDayNumbers(rule: Rule, from: unknown, options?: IterateOptions): Generator<number, void, undefined> {
  const c = compiledIn(rule, 'dates', 'iterate');
  const { lo, limit } = iteration(c, from, options);
  return occurrencesFrom(c, lo, limit);
}

/**
 * Lazily yields the occurrences of a rule of instants from `from` (inclusive) in increasing order, as epoch
 * milliseconds, at most `options.limit` of them. A rule that never ends needs a limit.
 *
 * @example
 * ```ts
 * const hourly = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
 * Array.from(iterateOccurrenceEpochMs(hourly, '2026-01-01T00:30Z', { limit: 2 }), (t) => formatInstant(t));
 * // ['2026-01-01T01:00:00Z', '2026-01-01T02:00:00Z']
 * ```
 */
export function iterateOccurrenceEpochMs(rule: Rule, from: unknown, options?: IterateOptions): Generator<number, void, undefined> {
  const c = compiledIn(rule, 'instants', 'iterate');
  const { lo, limit } = iteration(c, from, options);
  return occurrencesFrom(c, lo, limit);
}

function inclusiveOf(options: unknown): boolean {
  const o = readOptions('options', options, ['inclusive']);
  return requireBoolean('options.inclusive', o['inclusive'], false);
}

/**
 * The first occurrence of a rule of dates strictly after `from` (or on it, with `inclusive`), as a day number,
 * or null when the rule has ended. Searches are bounded: a rule whose business calendar leaves no matching day
 * for centuries gives a `limit-exceeded` error instead of running on.
 *
 * @example
 * ```ts
 * const payday = defineRule({ kind: 'monthly', on: { day: 15 } });
 * formatPlainDate(nextOccurrenceDayNumber(payday, '2025-01-15')!); // '2025-02-15'
 * ```
 */
export function nextOccurrenceDayNumber(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledIn(rule, 'dates', 'next');
  const inclusive = inclusiveOf(options);
  const v = valueOf(c, from, 'from');
  return firstAtOrAfter(c, inclusive ? v : v + 1) ?? null;
}

/**
 * The first occurrence of a rule of instants strictly after `from` (or at it, with `inclusive`), as epoch
 * milliseconds, or null when the rule has ended.
 *
 * @example
 * ```ts
 * const hourly = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
 * formatInstant(nextOccurrenceEpochMs(hourly, '2026-01-01T01:00Z')!); // '2026-01-01T02:00:00Z'
 * ```
 */
export function nextOccurrenceEpochMs(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledIn(rule, 'instants', 'next');
  const inclusive = inclusiveOf(options);
  const v = valueOf(c, from, 'from');
  // Occurrences are whole milliseconds: strictly after v is from the next whole millisecond.
  return firstAtOrAfter(c, inclusive ? v : Math.floor(v) + 1) ?? null;
}

/**
 * The last occurrence of a rule of dates strictly before `from` (or on it, with `inclusive`), as a day number,
 * or null when there is none.
 *
 * @example
 * ```ts
 * const payday = defineRule({ kind: 'monthly', on: { day: 15 } });
 * formatPlainDate(previousOccurrenceDayNumber(payday, '2025-01-15')!); // '2024-12-15'
 * ```
 */
export function previousOccurrenceDayNumber(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledIn(rule, 'dates', 'previous');
  const inclusive = inclusiveOf(options);
  const v = valueOf(c, from, 'from');
  return lastBefore(c, inclusive ? v + 1 : v) ?? null;
}

/**
 * The last occurrence of a rule of instants strictly before `from` (or at it, with `inclusive`), as epoch
 * milliseconds, or null when there is none.
 *
 * @example
 * ```ts
 * const hourly = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
 * formatInstant(previousOccurrenceEpochMs(hourly, '2026-01-01T01:00Z')!); // '2026-01-01T00:00:00Z'
 * ```
 */
export function previousOccurrenceEpochMs(rule: Rule, from: unknown, options?: StepOptions): number | null {
  const c = compiledIn(rule, 'instants', 'previous');
  const inclusive = inclusiveOf(options);
  const v = valueOf(c, from, 'from');
  return lastBefore(c, inclusive ? Math.floor(v) + 1 : Math.ceil(v)) ?? null;
}

function occursAt(c: Compiled, v: number, name: string): boolean {
  const out = new Sink(4);
  fillOccurrences(c, v, v + 1, out, [name, name]);
  return out.length > 0;
}

/**
 * Whether the day number `dayNumber` is an occurrence of a rule of dates (replaces `matchesRule`). Takes a
 * number: parse text first with `parsePlainDate`.
 *
 * @example
 * ```ts
 * isOccurrenceDayNumber(defineRule({ kind: 'monthly', on: { weekday: 'friday', nth: -1 } }), parsePlainDate('2025-01-31')); // true
 * ```
 */
export function isOccurrenceDayNumber(rule: Rule, dayNumber: number): boolean {
  const c = compiledIn(rule, 'dates', 'is');
  return occursAt(c, requireDayNumberArgument('dayNumber', dayNumber), 'dayNumber');
}

/**
 * Whether the instant `epochMs` is an occurrence of a rule of instants (replaces `matchesRule`); a fraction of a
 * millisecond answers for the millisecond it falls in. Takes a number: parse text first with `parseInstant`.
 *
 * @example
 * ```ts
 * const hourly = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
 * isOccurrenceEpochMs(hourly, parseInstant('2026-01-01T05:00:00Z').epochMs); // true
 * ```
 */
export function isOccurrenceEpochMs(rule: Rule, epochMs: number): boolean {
  const c = compiledIn(rule, 'instants', 'is');
  return occursAt(c, Math.floor(requireEpochMs('epochMs', epochMs)), 'epochMs');
}

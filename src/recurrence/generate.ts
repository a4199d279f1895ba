/**
 * Rules: `defineRule`, and the expansion every query is built on: the occurrences in a range (raw dates within
 * the rule's bounds, adjusted, de-duplicated, exclusions removed) and bounded searches for the nearest one. A
 * rule's `count` is located here, once, when the rule is defined. The public queries are in ./occurrences.ts.
 *
 * @module
 */
import { DefinitionError, KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MAX_ADJUSTMENT_DAYS, MAX_LISTED_COUNT, MS_PER_DAY } from '../bounds.js';
import { Issues, didYouMean, isRecord, ownField } from '../diagnostics/index.js';
import { type Compiled, VALUE_END, VALUE_MIN, compileCivilRule } from './compile.js';
import { compileIntraday } from './compile-intraday.js';
import { Sink } from './engine.js';
import { compileRfc5545 } from './rfc5545-compile.js';
import { formatInstant, formatPlainDate } from './deps.js';
import type { Rule, RuleDefinition, RuleKind } from './types.js';
import { deepFreeze, plainCopy } from './plain.js';

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
 * listOccurrenceDayNumbers(paydays, '2025-02-01', '2025-04-01').map(formatPlainDate);
 * // ['2025-02-15', '2025-02-28', '2025-03-15', '2025-03-31']
 * ```
 */
export function defineRule(definition: RuleDefinition): Rule {
  if (!isRecord(definition)) {
    throw new DefinitionError([{ path: 'definition', message: `expected a rule definition object with a "kind", got ${describeValue(definition)}` }], definition);
  }
  const kind = ownField(definition as unknown as Record<string, unknown>, 'kind');
  if (typeof kind !== 'string' || !(KINDS as readonly string[]).includes(kind)) {
    throw new DefinitionError(
      [{ path: 'kind', message: `expected one of ${KINDS.map((k) => JSON.stringify(k)).join(', ')}, got ${describeValue(kind)}${didYouMean(kind, KINDS)}` }],
      definition,
    );
  }
  const copy = plainCopy(definition) as unknown as Record<string, unknown>;
  const issues = new Issues();
  const compiled =
    kind === 'intraday' ? compileIntraday(copy, issues) : kind === 'rfc5545' ? compileRfc5545(copy, issues) : compileCivilRule(copy, issues);
  issues.throwIfAny(definition);
  if (!compiled) throw new DefinitionError([{ path: 'definition', message: 'could not compile the rule' }], definition);
  if (compiled.count !== undefined) locateCount(compiled, definition);
  const rule: Rule = Object.freeze({ kind: kind as RuleKind, values: compiled.values, definition: deepFreeze(copy) as unknown as RuleDefinition });
  compiledRules.set(rule, compiled);
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

/** @internal Margin (days) around [lo, hi) that holds every raw date adjusted into it; `names` name the range's parameters in messages. */
export function adjustmentMargin(c: Compiled, lo: number, hi: number, names: readonly [string, string]): [number, number] {
  const cal = c.business!;
  // Raw dates outside the calendar's years cannot be adjusted: say so by the range's own parameter.
  if (lo < cal.firstDay || hi > cal.endDay) {
    const [name, day] = lo < cal.firstDay ? [names[0], lo] : [names[1], hi - 1];
    throw new KalendsRangeError(
      `${name}: the rule's dates near ${formatPlainDate(day)} move by a business-day convention, and its calendar ${JSON.stringify(cal.id)} answers only for ${formatPlainDate(cal.firstDay)} to ${formatPlainDate(cal.endDay - 1)}; narrow the range to those years, or give the rule a calendar whose years cover it`,
      { code: 'out-of-range', received: day },
    );
  }
  let before = 8;
  while (before <= MAX_ADJUSTMENT_DAYS && lo - before > cal.firstDay && cal.adjust(lo - before, c.convention) >= lo) before *= 2;
  let after = 8;
  while (after <= MAX_ADJUSTMENT_DAYS && hi + after < cal.endDay - 1 && cal.adjust(hi + after, c.convention) < hi) after *= 2;
  if (before > MAX_ADJUSTMENT_DAYS || after > MAX_ADJUSTMENT_DAYS) {
    throw new KalendsRangeError(`calendar: ${JSON.stringify(cal.id)} has no business day within ${MAX_ADJUSTMENT_DAYS} days of the range, so the convention ${JSON.stringify(c.convention)} cannot be applied`, {
      code: 'no-business-day',
      received: [lo, hi],
    });
  }
  return [before, after];
}

const scratchSink = /* @__PURE__ */ new Sink(256);

/**
 * @internal Appends the occurrences in [lo, hi) to `out`, in strictly increasing order: raw dates within the
 * rule's bounds (start, end and count), adjusted, de-duplicated, with exclusions removed.
 */
export function fillOccurrences(c: Compiled, lo: number, hi: number, out: Sink, names: readonly [string, string] = ['start', 'end']): void {
  lo = Math.max(lo, VALUE_MIN[c.values]);
  hi = Math.min(hi, VALUE_END[c.values]);
  if (lo >= hi) return;
  const before = out.length;
  if (c.convention === 'none' || !c.business) {
    c.engine.fill(Math.max(lo, c.rawStart), Math.min(hi, c.rawEnd), out);
  } else {
    // Adjusted dates lie within MAX_ADJUSTMENT_DAYS of the rule's raw dates: no business day is asked outside.
    lo = Math.max(lo, occurrenceFloor(c));
    hi = Math.min(hi, occurrenceCeiling(c));
    if (lo >= hi) return;
    const [mLo, mHi] = adjustmentMargin(c, lo, hi, names);
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
  if (c.exclude) {
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
  const days = Math.round(searchLimit(c) / (c.values === 'dates' ? 1 : MS_PER_DAY));
  const shown = c.values === 'dates' ? `${from} (${formatPlainDate(from)})` : `${from} (${formatInstant(from)})`;
  return new KalendsRangeError(
    `from: the rule has no occurrence ${direction} ${shown} within ${days} days (about ${Math.round(days / 365.2425)} years), where its business calendar leaves no matching day; the search stops there instead of running on`,
    { code: 'limit-exceeded', received: from },
  );
}

/** Highest value any occurrence can have (exclusive), to end searches early. */
function occurrenceCeiling(c: Compiled): number {
  const adjMargin = c.convention === 'none' ? 0 : MAX_ADJUSTMENT_DAYS;
  return Math.min(VALUE_END[c.values], c.rawEnd + adjMargin);
}
function occurrenceFloor(c: Compiled): number {
  const adjMargin = c.convention === 'none' ? 0 : MAX_ADJUSTMENT_DAYS;
  return Math.max(VALUE_MIN[c.values], c.rawStart - adjMargin);
}

const FROM = ['from', 'from'] as const;

/** @internal First occurrence >= from, or undefined. */
export function firstAtOrAfter(c: Compiled, from: number): number | undefined {
  const ceiling = occurrenceCeiling(c);
  let lo = Math.max(from, occurrenceFloor(c));
  const limit = searchLimit(c);
  // The search gives up after `limit` units without an occurrence, counted from where occurrences can begin.
  const origin = Math.max(lo, c.rawStart);
  let width = Math.ceil(Math.max(c.engine.stride * 4, c.values === 'dates' ? 8 : 60_000));
  const out = new Sink(16);
  while (lo < ceiling) {
    const hi = Math.min(lo + width, ceiling);
    out.clear();
    fillOccurrences(c, lo, hi, out, FROM);
    if (out.length > 0) return out.data[0]!;
    // Past the rule's last raw date only adjusted dates remain, within MAX_ADJUSTMENT_DAYS: the search ends there.
    if (hi - origin > limit && hi < c.rawEnd) throw limitError(c, from, 'on or after');
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
  const origin = Math.min(hi, c.rawEnd);
  let width = Math.ceil(Math.max(c.engine.stride * 4, c.values === 'dates' ? 8 : 60_000));
  const out = new Sink(16);
  while (hi > floor) {
    const lo = Math.max(hi - width, floor);
    out.clear();
    fillOccurrences(c, lo, hi, out, FROM);
    if (out.length > 0) return out.data[out.length - 1]!;
    if (origin - lo > limit && lo > c.rawStart) throw limitError(c, before, 'before');
    hi = lo;
    width *= 2;
  }
  return undefined;
}

/**
 * Narrows `rawEnd` to just after the rule's `count`-th raw occurrence from `rawStart`. The count applies to the
 * raw dates, before any business-day adjustment (like `start` and `end`), and before RFC 5545 EXDATE exclusions
 * (RFC 5545 section 3.8.5.1: the recurrence set is generated, then the excluded dates removed). Engines whose
 * occurrences repeat locate it at a cost independent of the count; the others list up to MAX_LISTED_COUNT.
 */
export function locateCount(c: Compiled, definition: unknown): void {
  const k = c.count! - 1;
  let nth: number | undefined;
  try {
    nth = c.engine.locate?.(c.rawStart, k, c.rawEnd);
  } catch (e) {
    // A calendar that must evaluate too many years one by one: fall back to listing (bounded below).
    if (!(e instanceof KalendsRangeError)) throw e;
    nth = undefined;
  }
  if (nth === undefined) {
    if (c.count! > MAX_LISTED_COUNT) {
      throw new DefinitionError(
        [
          {
            path: 'count',
            message: `expected at most ${MAX_LISTED_COUNT} for this rule, got ${c.count}: its count is found by listing its occurrences (business-day selectors and steps, fiscal periods, wall-clock steps and RFC 5545 times of day do not repeat in a pattern that can be counted); give an end instead of a count, or a smaller count`,
          },
        ],
        definition,
      );
    }
    nth = listedNth(c, k);
  }
  if (nth === nth) c.rawEnd = Math.min(c.rawEnd, nth + 1);
}

/** The raw occurrence number k (0 = the first) from `rawStart`, by listing; NaN when the rule ends first. */
function listedNth(c: Compiled, k: number): number {
  const out = new Sink(1024);
  const unit = c.values === 'dates' ? 1 : MS_PER_DAY;
  const limit = searchLimit(c);
  let seen = 0;
  let lo = c.rawStart;
  let last = lo;
  let width = Math.ceil(Math.max(c.engine.stride * 256, 64 * unit));
  while (lo < c.rawEnd) {
    const hi = Math.min(lo + width, c.rawEnd);
    out.clear();
    c.engine.fill(lo, hi, out);
    if (seen + out.length > k) return out.data[k - seen]!;
    seen += out.length;
    if (out.length > 0) last = out.data[out.length - 1]!;
    else if (hi - last > limit) throw limitError(c, last, 'after');
    lo = hi;
    width = Math.ceil(Math.min(width * 2, c.engine.stride * 65_536 + 64 * unit));
  }
  return Number.NaN;
}

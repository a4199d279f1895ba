/**
 * Scalar queries on a zone: the offset at an instant, instant to wall clock, wall clock to instant with the
 * Temporal disambiguation options, local day starts and lengths, and transitions.
 *
 * @module
 */
import {
  DEFAULT_TRANSITION_LIMIT,
  MAX_EPOCH_MS,
  MAX_TRANSITION_LIMIT,
  MAX_TRANSITION_WALK_YEARS,
  MAX_ZONED_DAY_NUMBER,
  MIN_EPOCH_MS,
  MIN_ZONED_DAY_NUMBER,
  MS_PER_DAY,
} from '../bounds.js';
import {
  dayCountOfMonthUnchecked,
  dayNumberFromYmdUnchecked,
  dayOfPacked,
  monthOfPacked,
  packedYmdUnchecked,
  requireYear,
  weekdayOfDayNumberUnchecked,
  yearOfPacked,
} from '../civil/gregorian.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { optionOf, readOptions, requireDayNumberArgument, requireEnum, requireEpochMs, requireWhole } from '../diagnostics/index.js';
import { formatOffsetUnchecked, formatWallUnchecked, requireWallMs as requireWallText } from '../instant/format.js';
import { type Engine, type ZoneTransition, collectWithin, transitionAfter, transitionBefore } from './engine.js';
import { WallTimeRejectedError } from './errors.js';
import { type Zone, type ZoneInput, engineOf, toZone } from './zone.js';

export type { ZoneTransition } from './engine.js';

/** Temporal's disambiguation options (ECMA-262 Temporal, `ToTemporalDisambiguation`). */
export type Disambiguation = 'compatible' | 'earlier' | 'later' | 'reject';

/**
 * How a local date-time maps to instants in a zone. A gap and an overlap are described in one vocabulary, that
 * of {@link ZoneTransition}: the transition's instant and the offsets before and after it, and the range of wall
 * times `[startWallMs, endWallMs)` the transition skipped (a gap) or repeated (an overlap).
 */
export type WallResolution =
  | {
      /** The wall time happens once. */
      readonly kind: 'unique';
      /** Its instant. */
      readonly epochMs: number;
      /** The zone's offset at that instant. */
      readonly offsetSeconds: number;
    }
  | {
      /** The zone's clocks skipped the wall time. */
      readonly kind: 'gap';
      /** The transition that skipped this wall time. */
      readonly transitionEpochMs: number;
      /** Offset before the transition (seconds east of UTC). */
      readonly offsetBeforeSeconds: number;
      /** Offset after the transition (seconds east of UTC). */
      readonly offsetAfterSeconds: number;
      /** Start of the skipped wall-clock range [startWallMs, endWallMs). */
      readonly startWallMs: number;
      /** End of the skipped wall-clock range (exclusive). */
      readonly endWallMs: number;
    }
  | {
      /** The zone's clocks showed the wall time twice. */
      readonly kind: 'overlap';
      /** The transition after which this wall time came round again. */
      readonly transitionEpochMs: number;
      /** Offset before the transition (seconds east of UTC). */
      readonly offsetBeforeSeconds: number;
      /** Offset after the transition (seconds east of UTC). */
      readonly offsetAfterSeconds: number;
      /** Start of the repeated wall-clock range [startWallMs, endWallMs). */
      readonly startWallMs: number;
      /** End of the repeated wall-clock range (exclusive). */
      readonly endWallMs: number;
      /** The instant of this wall time before the transition (the earlier one). */
      readonly epochMsBeforeTransition: number;
      /** The instant of this wall time after the transition (the later one). */
      readonly epochMsAfterTransition: number;
    };

/** A local date-time as fields, with the zone's offset and the ISO weekday. */
export interface WallFields {
  /** The local year. */
  readonly year: number;
  /** The local month, 1..12. */
  readonly month: number;
  /** The local day of the month, 1..31. */
  readonly day: number;
  /** The local hour, 0..23. */
  readonly hour: number;
  /** The minute, 0..59. */
  readonly minute: number;
  /** The second, 0..59. */
  readonly second: number;
  /** The millisecond, 0..999. */
  readonly millisecond: number;
  /** Local day number (days since 1970-01-01). */
  readonly dayNumber: number;
  /** ISO weekday, 1 = Monday .. 7 = Sunday. */
  readonly weekday: number;
  /** The zone's offset at the instant (seconds east of UTC). */
  readonly offsetSeconds: number;
}

/** Input fields of {@link epochMsFromWallFields}: year, month and day required, the rest default to 0. */
export interface WallFieldsInput {
  /** The year. */
  readonly year: number;
  /** The month, 1..12. */
  readonly month: number;
  /** The day of the month, 1..31. */
  readonly day: number;
  /** The hour, 0..23 (default 0). */
  readonly hour?: number;
  /** The minute, 0..59 (default 0). */
  readonly minute?: number;
  /** The second, 0..59 (default 0). */
  readonly second?: number;
  /** The millisecond, 0..999 (default 0). */
  readonly millisecond?: number;
}

/** Wall-clock ms are accepted one day beyond the instant range on each side (as Temporal.PlainDateTime). */
const MIN_WALL_MS = MIN_EPOCH_MS - MS_PER_DAY;
const MAX_WALL_MS = MAX_EPOCH_MS + MS_PER_DAY;

function requireWallMs(name: string, value: unknown): number {
  return requireWallText(name, value, MIN_WALL_MS, MAX_WALL_MS);
}

function checkResult(epochMs: number, what: string, received: unknown): number {
  if (!(epochMs >= MIN_EPOCH_MS && epochMs <= MAX_EPOCH_MS)) {
    throw new KalendsRangeError(`${what}: the instant ${epochMs} falls outside ±8.64e15 ms`, { code: 'out-of-range', received });
  }
  return epochMs;
}

/*
 * Fractional instants (docs/design.md, "Input rules"): an instant t lies within millisecond Math.floor(t). The
 * engine's intervals start and end on whole milliseconds, so the offset at t is the offset at Math.floor(t);
 * answers that are instants or wall times (an offset added or subtracted) keep the fraction, and answers that are
 * days, fields or transitions are those of Math.floor(t).
 */

/**
 * The zone's UTC offset in seconds at an instant (seconds east of UTC; historic local mean times have seconds).
 *
 * @example
 * ```ts
 * offsetSecondsFromEpochMs('America/New_York', Date.UTC(2025, 6, 1)); // -14400
 * offsetSecondsFromEpochMs('Asia/Kolkata', Date.UTC(1900, 0, 1));     // 19270 (+05:21:10)
 * ```
 */
export function offsetSecondsFromEpochMs(zone: ZoneInput, epochMs: number): number {
  const e = engineOf(toZone(zone));
  return e.offsetAt(requireEpochMs('epochMs', epochMs));
}

/**
 * The local wall-clock time of an instant, as ms since 1970-01-01T00:00 on the local clock.
 *
 * @example
 * ```ts
 * wallMsFromEpochMs('Asia/Kathmandu', 0); // 19800000 (05:30 local on 1970-01-01)
 * ```
 */
export function wallMsFromEpochMs(zone: ZoneInput, epochMs: number): number {
  const e = engineOf(toZone(zone));
  requireEpochMs('epochMs', epochMs);
  return epochMs + e.offsetAt(epochMs) * 1000;
}

/**
 * The local day number (days since 1970-01-01 on the local calendar) of an instant.
 *
 * @example
 * ```ts
 * dayNumberFromEpochMs('Pacific/Kiritimati', Date.UTC(2025, 0, 1, 12)); // 20090 (2025-01-02 local)
 * ```
 */
export function dayNumberFromEpochMs(zone: ZoneInput, epochMs: number): number {
  const e = engineOf(toZone(zone));
  requireEpochMs('epochMs', epochMs);
  // Math.floor(t) first: a tiny negative fraction (-5e-324) would vanish in the division and give day 0.
  return Math.floor((Math.floor(epochMs) + e.offsetAt(epochMs) * 1000) / MS_PER_DAY);
}

/**
 * The local fields of an instant: date, time, ISO weekday, day number and offset (those of the millisecond that
 * holds a fractional instant). Allocates one object; in loops use {@link wallMsFromEpochMsBulk}.
 *
 * @example
 * ```ts
 * wallFieldsFromEpochMs('Europe/Dublin', Date.UTC(2025, 6, 1, 12)).hour; // 13
 * ```
 */
export function wallFieldsFromEpochMs(zone: ZoneInput, epochMs: number): WallFields {
  const e = engineOf(toZone(zone));
  const t = Math.floor(requireEpochMs('epochMs', epochMs));
  const offsetSeconds = e.offsetAt(t);
  const wall = t + offsetSeconds * 1000;
  const dayNumber = Math.floor(wall / MS_PER_DAY);
  const p = packedYmdUnchecked(dayNumber);
  const ms = wall - dayNumber * MS_PER_DAY;
  return {
    year: yearOfPacked(p),
    month: monthOfPacked(p),
    day: dayOfPacked(p),
    hour: Math.floor(ms / 3_600_000),
    minute: Math.floor((ms % 3_600_000) / 60_000),
    second: Math.floor((ms % 60_000) / 1000),
    millisecond: ms % 1000,
    dayNumber,
    weekday: weekdayOfDayNumberUnchecked(dayNumber),
    offsetSeconds,
  };
}

/** Resolution on an engine, without validation. */
function resolveOn(e: Engine, wall: number): WallResolution {
  // Fast path: one offset holds across the whole ±1 day window around the wall time.
  e.offsetAt(wall);
  if (e.lo <= wall - MS_PER_DAY && e.hi > wall + MS_PER_DAY) return { kind: 'unique', epochMs: wall - e.off * 1000, offsetSeconds: e.off };
  const at: number[] = [];
  const after: number[] = [];
  const before = e.collect(wall - MS_PER_DAY, wall + MS_PER_DAY + 1, at, after);
  const offsets = [before, ...after];
  const found: { t: number; o: number }[] = [];
  for (const o of offsets) {
    const t = wall - o * 1000;
    if (found.some((f) => f.t === t)) continue;
    if (t >= MIN_EPOCH_MS - MS_PER_DAY && t <= MAX_EPOCH_MS + MS_PER_DAY && e.offsetAt(Math.min(Math.max(t, MIN_EPOCH_MS), MAX_EPOCH_MS)) === o) found.push({ t, o });
  }
  found.sort((a, b) => a.t - b.t);
  if (found.length === 1) return { kind: 'unique', epochMs: found[0]!.t, offsetSeconds: found[0]!.o };
  if (found.length >= 2) {
    const a = found[0]!;
    const b = found[found.length - 1]!;
    // The transition between the two instants (the last one there when the rules change twice within a day).
    let k = at.length - 1;
    while (k > 0 && !(at[k]! <= b.t)) k--;
    const ob = k === 0 ? before : after[k - 1]!;
    const oa = after[k]!;
    const tr = at[k]!;
    return {
      kind: 'overlap',
      transitionEpochMs: tr,
      offsetBeforeSeconds: ob,
      offsetAfterSeconds: oa,
      startWallMs: tr + oa * 1000,
      endWallMs: tr + ob * 1000,
      epochMsBeforeTransition: a.t,
      epochMsAfterTransition: b.t,
    };
  }
  for (let i = 0; i < at.length; i++) {
    const ob = i === 0 ? before : after[i - 1]!;
    const oa = after[i]!;
    const start = at[i]! + ob * 1000;
    const end = at[i]! + oa * 1000;
    if (wall >= start && wall < end) {
      return { kind: 'gap', transitionEpochMs: at[i]!, offsetBeforeSeconds: ob, offsetAfterSeconds: oa, startWallMs: start, endWallMs: end };
    }
  }
  /* c8 ignore next 2 */
  throw new KalendsRangeError(`wallMs: could not resolve ${formatWallUnchecked(wall)}; the zone's rules have transitions closer than one day`, { code: 'unsupported', received: wall });
}

/**
 * How a local wall-clock time maps to instants in a zone: `unique` (one instant), `gap` (the clocks skipped it)
 * or `overlap` (it happened twice). A gap and an overlap name the same things: the transition, the offsets before
 * and after it, and the wall-clock range it skipped or repeated; an overlap adds the instant before and after the
 * transition. A fractional wall time keeps its fraction in the instants.
 *
 * @example
 * ```ts
 * // 2025-11-02T01:30 happened twice in New York:
 * resolveWallMs('America/New_York', Date.UTC(2025, 10, 2, 1, 30));
 * // { kind: 'overlap', transitionEpochMs: Date.UTC(2025, 10, 2, 6), offsetBeforeSeconds: -14400, offsetAfterSeconds: -18000,
 * //   startWallMs: <01:00>, endWallMs: <02:00>,
 * //   epochMsBeforeTransition: Date.UTC(2025, 10, 2, 5, 30), epochMsAfterTransition: Date.UTC(2025, 10, 2, 6, 30) }
 * ```
 */
export function resolveWallMs(zone: ZoneInput, wallMs: number): WallResolution {
  const e = engineOf(toZone(zone));
  return resolveOn(e, requireWallMs('wallMs', wallMs));
}

const DISAMBIGUATIONS: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];

/** @internal A disambiguation option: one of Temporal's four strings (a misspelling is named with the nearest). */
function requireDisambiguation(value: unknown, name = 'disambiguation'): Disambiguation {
  return requireEnum(name, value, DISAMBIGUATIONS, 'compatible');
}

function pick(z: Zone, r: WallResolution, wall: number, d: Disambiguation, name: string): number {
  if (r.kind === 'unique') return r.epochMs;
  if (r.kind === 'overlap') {
    if (d === 'reject') {
      throw new WallTimeRejectedError(
        `${name}: ${formatWallUnchecked(wall)} happened twice in ${z.id} (at offsets ${formatOffsetUnchecked(r.offsetBeforeSeconds)} and ${formatOffsetUnchecked(r.offsetAfterSeconds)}); use disambiguation 'earlier', 'later' or 'compatible' instead of 'reject'`,
        'overlap',
        z.id,
        wall,
      );
    }
    return d === 'later' ? r.epochMsAfterTransition : r.epochMsBeforeTransition;
  }
  if (d === 'reject') {
    throw new WallTimeRejectedError(
      `${name}: ${formatWallUnchecked(wall)} does not exist in ${z.id}: the clocks went from ${formatWallUnchecked(r.startWallMs)} to ${formatWallUnchecked(r.endWallMs)} (offset ${formatOffsetUnchecked(r.offsetBeforeSeconds)} to ${formatOffsetUnchecked(r.offsetAfterSeconds)}); use disambiguation 'compatible', 'earlier' or 'later' instead of 'reject'`,
      'gap',
      z.id,
      wall,
    );
  }
  // Temporal: 'earlier' reads the wall time with the offset after the gap, 'later'/'compatible' with the one before.
  return wall - (d === 'earlier' ? r.offsetAfterSeconds : r.offsetBeforeSeconds) * 1000;
}

/**
 * The instant of a local wall-clock time, with Temporal's disambiguation (default 'compatible': the earlier
 * instant in an overlap, the time shifted forward by the gap's length in a gap; 'reject' throws a
 * WallTimeRejectedError with code 'skipped-time' or 'repeated-time').
 *
 * @example
 * ```ts
 * const wall = Date.UTC(2025, 2, 9, 2, 30); // 2025-03-09T02:30, skipped in New York
 * epochMsFromWallMs('America/New_York', wall);            // Date.UTC(2025, 2, 9, 7, 30) (03:30 EDT)
 * epochMsFromWallMs('America/New_York', wall, 'earlier'); // Date.UTC(2025, 2, 9, 6, 30) (01:30 EST)
 * ```
 */
export function epochMsFromWallMs(zone: ZoneInput, wallMs: number, disambiguation?: Disambiguation): number {
  const z = toZone(zone);
  requireWallMs('wallMs', wallMs);
  const d = requireDisambiguation(disambiguation);
  return checkResult(pick(z, resolveOn(engineOf(z), wallMs), wallMs, d, 'wallMs'), 'wallMs', wallMs);
}

/**
 * The instant of local date-time fields (year, month, day required; hour, minute, second, millisecond default
 * to 0), with the same disambiguation as {@link epochMsFromWallMs}. Each field is range-checked by name.
 *
 * @example
 * ```ts
 * epochMsFromWallFields('Europe/London', { year: 2025, month: 7, day: 1, hour: 9 }); // Date.UTC(2025, 6, 1, 8)
 * ```
 */
export function epochMsFromWallFields(zone: ZoneInput, fields: WallFieldsInput, disambiguation?: Disambiguation): number {
  if (typeof fields !== 'object' || fields === null) {
    throw new KalendsTypeError(`fields: expected an object with year, month and day, got ${describeValue(fields)}`, { code: 'invalid-type', received: fields });
  }
  const year = requireYear(fields.year, 'fields.year');
  const month = requireInteger('fields.month', fields.month, 1, 12);
  const day = requireInteger('fields.day', fields.day, 1, dayCountOfMonthUnchecked(year, month));
  const hour = requireInteger('fields.hour', fields.hour ?? 0, 0, 23);
  const minute = requireInteger('fields.minute', fields.minute ?? 0, 0, 59);
  const second = requireInteger('fields.second', fields.second ?? 0, 0, 59);
  const millisecond = requireInteger('fields.millisecond', fields.millisecond ?? 0, 0, 999);
  const wall = dayNumberFromYmdUnchecked(year, month, day) * MS_PER_DAY + hour * 3_600_000 + minute * 60_000 + second * 1000 + millisecond;
  const z = toZone(zone);
  const d = requireDisambiguation(disambiguation);
  return checkResult(pick(z, resolveOn(engineOf(z), wall), wall, d, 'fields'), 'fields', fields);
}

/** Days in the 400-year Gregorian cycle: a whole number of weeks, so yearly rules repeat exactly after it. */
const CYCLE_DAYS = 146_097;
/** Days whose start is resolved directly: the ±1 day window around their midnight lies within ±8.64e15 ms. */
const FIRST_DIRECT_DAY = MIN_EPOCH_MS / MS_PER_DAY + 1;
const LAST_DIRECT_DAY = MAX_EPOCH_MS / MS_PER_DAY - 2;

function dayStartOn(e: Engine, dayNumber: number): number {
  if (dayNumber < FIRST_DIRECT_DAY) {
    // Before the instant range: the zone's offset at its start, which held since the zone's first transition
    // (Intl: none before 1800); rules that repeat every year (a POSIX rule alone) are read 400 years later.
    if (e.lowQuietMs >= (FIRST_DIRECT_DAY + 2) * MS_PER_DAY) return dayNumber * MS_PER_DAY - e.offsetAt(MIN_EPOCH_MS) * 1000;
    if (e.periodicFromMs === -Infinity) return dayStartOn(e, dayNumber + CYCLE_DAYS) - CYCLE_DAYS * MS_PER_DAY;
    throw outsideRules(dayNumber);
  }
  if (dayNumber > LAST_DIRECT_DAY) {
    // After the instant range: the zone's rules repeat every year there (Intl: from 2200), so the day 400
    // Gregorian years earlier starts at the same wall time with the same offset.
    if (e.periodicFromMs <= (LAST_DIRECT_DAY - CYCLE_DAYS - 2) * MS_PER_DAY) return dayStartOn(e, dayNumber - CYCLE_DAYS) + CYCLE_DAYS * MS_PER_DAY;
    throw outsideRules(dayNumber);
  }
  const wall = dayNumber * MS_PER_DAY;
  const r = resolveOn(e, wall);
  if (r.kind === 'unique') return r.epochMs;
  if (r.kind === 'overlap') return r.epochMsBeforeTransition;
  return r.transitionEpochMs;
}

function outsideRules(dayNumber: number): KalendsRangeError {
  return new KalendsRangeError(
    `dayNumber: the start of day ${dayNumber} lies outside ±8.64e15 ms, where this zone's rules (transitions near the end of the instant range) say nothing; use a day within ${FIRST_DIRECT_DAY} to ${LAST_DIRECT_DAY}`,
    { code: 'unsupported', received: dayNumber },
  );
}

/** A day number in the zoned range (bounds.ts); text gets the name of the parser to call. */
function requireZonedDay(value: unknown, max: number): number {
  if (typeof value !== 'number') return requireDayNumberArgument('dayNumber', value);
  return requireInteger('dayNumber', value, MIN_ZONED_DAY_NUMBER, max);
}

/**
 * The first instant of a local day. Usually local midnight, but not always: where the clocks skipped midnight
 * (spring-forward at 00:00, as in America/Santiago, America/Havana or Asia/Beirut) the day starts at the
 * transition, e.g. 01:00. A day that was skipped entirely (Pacific/Apia, 2011-12-30) starts where the next day
 * starts, so its length is 0. Every civil day is accepted, and the days just outside the civil range that partial
 * periods at its ends need (MIN_ZONED_DAY_NUMBER..MAX_ZONED_DAY_NUMBER in bounds.ts); a day that starts outside
 * ±8.64e15 ms gets an instant outside it, from the zone's rules at the nearest end of the instant range.
 *
 * @example
 * ```ts
 * firstEpochMsOfDayNumber('America/Santiago', dayNumberFromYmd(2025, 9, 7)); // Date.UTC(2025, 8, 7, 4) (01:00 local)
 * ```
 */
export function firstEpochMsOfDayNumber(zone: ZoneInput, dayNumber: number): number {
  const e = engineOf(toZone(zone));
  return dayStartOn(e, requireZonedDay(dayNumber, MAX_ZONED_DAY_NUMBER));
}

/**
 * The length of a local day in ms: 86,400,000 on most days, 23 or 25 hours on DST change days, 23.5 or 24.5
 * hours with a 30-minute change (Australia/Lord_Howe), 0 for a day that was skipped, and other values on
 * historic changes.
 *
 * @example
 * ```ts
 * lengthMsOfDayNumber('America/New_York', dayNumberFromYmd(2025, 3, 9)) / 3_600_000; // 23
 * ```
 */
export function lengthMsOfDayNumber(zone: ZoneInput, dayNumber: number): number {
  const e = engineOf(toZone(zone));
  const d = requireZonedDay(dayNumber, MAX_ZONED_DAY_NUMBER - 1);
  return dayStartOn(e, d + 1) - dayStartOn(e, d);
}

/** Options of {@link listTransitions}. */
export interface ListTransitionsOptions {
  /** The most transitions to return before throwing a 'limit-exceeded' error (default 100,000, at most 10,000,000). */
  readonly limit?: number;
}

/**
 * The offset changes within [startEpochMs, endEpochMs), in order, each with the offsets before and after. A
 * fractional bound stands for the millisecond that holds it. A call walks at most MAX_TRANSITION_WALK_YEARS years
 * of rules and returns at most `options.limit` changes; past either it throws `limit-exceeded`.
 *
 * @example
 * ```ts
 * listTransitions('Europe/Amsterdam', Date.UTC(2025, 0, 1), Date.UTC(2026, 0, 1)).map((t) => t.epochMs);
 * // [Date.UTC(2025, 2, 30, 1), Date.UTC(2025, 9, 26, 1)]
 * ```
 */
export function listTransitions(
  zone: ZoneInput,
  startEpochMs: number,
  endEpochMs: number,
  options?: ListTransitionsOptions,
): ZoneTransition[] {
  const e = engineOf(toZone(zone));
  const start = Math.floor(requireEpochMs('startEpochMs', startEpochMs));
  const end = Math.floor(requireEpochMs('endEpochMs', endEpochMs));
  const o = readOptions('options', options, ['limit']);
  const limit = requireWhole('options.limit', optionOf(o, 'limit'), 1, MAX_TRANSITION_LIMIT, DEFAULT_TRANSITION_LIMIT);
  const at: number[] = [];
  const after: number[] = [];
  let prev = collectWithin(e, start, end, at, after, MAX_TRANSITION_WALK_YEARS);
  if (at.length > limit) {
    throw new KalendsRangeError(
      `options.limit: the range holds ${at.length} transitions, more than the limit ${limit}; list a narrower range, or raise options.limit (at most ${MAX_TRANSITION_LIMIT})`,
      { code: 'limit-exceeded', received: limit },
    );
  }
  const out: ZoneTransition[] = [];
  for (let i = 0; i < at.length; i++) {
    out.push(Object.freeze({ epochMs: at[i]!, offsetBeforeSeconds: prev, offsetAfterSeconds: after[i]! }));
    prev = after[i]!;
  }
  return out;
}

/**
 * The first transition strictly after an instant (after the millisecond that holds a fractional one), or null
 * when the zone has no later change.
 *
 * @example
 * ```ts
 * nextTransition('Europe/London', Date.UTC(2025, 0, 1))?.epochMs; // Date.UTC(2025, 2, 30, 1)
 * ```
 */
export function nextTransition(zone: ZoneInput, epochMs: number): ZoneTransition | null {
  const e = engineOf(toZone(zone));
  const t = transitionAfter(e, Math.floor(requireEpochMs('epochMs', epochMs)));
  return t && t.epochMs <= MAX_EPOCH_MS ? Object.freeze(t) : null;
}

/**
 * The last transition strictly before an instant (before the millisecond that holds a fractional one), or null
 * when the zone has no earlier change.
 *
 * @example
 * ```ts
 * previousTransition('Asia/Kolkata', Date.UTC(2025, 0, 1))?.epochMs; // Date.UTC(1945, 9, 14, 17, 30)
 * ```
 */
export function previousTransition(zone: ZoneInput, epochMs: number): ZoneTransition | null {
  const e = engineOf(toZone(zone));
  const t = transitionBefore(e, Math.floor(requireEpochMs('epochMs', epochMs)));
  return t && t.epochMs >= MIN_EPOCH_MS ? Object.freeze(t) : null;
}

export { MAX_WALL_MS, MIN_WALL_MS };

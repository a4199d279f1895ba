/**
 * Scalar queries on a zone: the offset at an instant, instant to wall clock, wall clock to instant with the
 * Temporal disambiguation options, local day starts and lengths, and transitions.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import {
  dayNumberFromYmdUnchecked,
  dayCountOfMonthUnchecked,
  packedYmdUnchecked,
  requireDayNumber,
  requireYear,
  weekdayOfDayNumberUnchecked,
} from '../civil/gregorian.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { MIN_YEAR } from '../bounds.js';
import { type Engine, type ZoneTransition } from './engine.js';
import { WallTimeRejectedError } from './errors.js';
import { type Zone, type ZoneInput, engineOf, formatOffsetSeconds, toZone } from './zone.js';

export type { ZoneTransition } from './engine.js';

/** Temporal's disambiguation options (ECMA-262 Temporal, `ToTemporalDisambiguation`). */
export type Disambiguation = 'compatible' | 'earlier' | 'later' | 'reject';

/** How a local date-time maps to instants in a zone. */
export type WallResolution =
  | { readonly kind: 'unique'; readonly epochMs: number; readonly offsetSeconds: number }
  | {
      readonly kind: 'gap';
      /** Offset before and after the transition that skipped this wall time. */
      readonly offsetBeforeSeconds: number;
      readonly offsetAfterSeconds: number;
      /** The transition instant. */
      readonly transitionEpochMs: number;
      /** The skipped wall-clock range [gapStartWallMs, gapEndWallMs). */
      readonly gapStartWallMs: number;
      readonly gapEndWallMs: number;
    }
  | {
      readonly kind: 'overlap';
      readonly earlierEpochMs: number;
      readonly laterEpochMs: number;
      readonly earlierOffsetSeconds: number;
      readonly laterOffsetSeconds: number;
    };

/** A local date-time as fields, with the zone's offset and the ISO weekday. */
export interface WallFields {
  readonly year: number;
  readonly month: number;
  readonly day: number;
  readonly hour: number;
  readonly minute: number;
  readonly second: number;
  readonly millisecond: number;
  /** Local day number (days since 1970-01-01). */
  readonly dayNumber: number;
  /** ISO weekday, 1 = Monday .. 7 = Sunday. */
  readonly weekday: number;
  readonly offsetSeconds: number;
}

/** Input fields of {@link epochMsFromWallFields}: year, month and day required, the rest default to 0. */
export interface WallFieldsInput {
  readonly year: number;
  readonly month: number;
  readonly day: number;
  readonly hour?: number;
  readonly minute?: number;
  readonly second?: number;
  readonly millisecond?: number;
}

/** Wall-clock ms are accepted one day beyond the instant range on each side (as Temporal.PlainDateTime). */
const MIN_WALL_MS = MIN_EPOCH_MS - MS_PER_DAY;
const MAX_WALL_MS = MAX_EPOCH_MS + MS_PER_DAY;

/** @internal Validates an instant: a finite number within ±8.64e15 ms. */
export function requireEpochMs(name: string, value: unknown): number {
  if (typeof value !== 'number') {
    throw new KalendsTypeError(`${name}: expected epoch milliseconds (a number), got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  if (!(value >= MIN_EPOCH_MS && value <= MAX_EPOCH_MS)) {
    throw new KalendsRangeError(`${name}: expected epoch milliseconds from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

function requireWallMs(name: string, value: unknown): number {
  if (typeof value !== 'number') {
    throw new KalendsTypeError(`${name}: expected wall-clock milliseconds (a number), got ${describeValue(value)}`, { code: 'invalid-type', received: value });
  }
  if (!(value >= MIN_WALL_MS && value <= MAX_WALL_MS)) {
    throw new KalendsRangeError(`${name}: expected wall-clock milliseconds from ${MIN_WALL_MS} to ${MAX_WALL_MS}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

function checkResult(epochMs: number, what: string, received: unknown): number {
  if (!(epochMs >= MIN_EPOCH_MS && epochMs <= MAX_EPOCH_MS)) {
    throw new KalendsRangeError(`${what}: the instant ${epochMs} falls outside ±8.64e15 ms`, { code: 'out-of-range', received });
  }
  return epochMs;
}

/** ISO 8601 text of a wall-clock ms value, for messages. @internal */
export function isoWall(wallMs: number): string {
  const dn = Math.floor(wallMs / MS_PER_DAY);
  const p = packedYmdUnchecked(dn);
  const year = Math.floor(p / 512) + MIN_YEAR;
  const ms = wallMs - dn * MS_PER_DAY;
  const pad = (v: number, w = 2) => String(v).padStart(w, '0');
  const y = year >= 0 && year <= 9999 ? pad(year, 4) : `${year < 0 ? '-' : '+'}${pad(Math.abs(year), 6)}`;
  const hh = Math.floor(ms / 3_600_000);
  const mi = Math.floor((ms % 3_600_000) / 60_000);
  const ss = Math.floor((ms % 60_000) / 1000);
  const frac = ms % 1000;
  return `${y}-${pad((p >> 5) & 15)}-${pad(p & 31)}T${pad(hh)}:${pad(mi)}:${pad(ss)}${frac ? `.${pad(frac, 3)}` : ''}`;
}

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
  return Math.floor((epochMs + e.offsetAt(epochMs) * 1000) / MS_PER_DAY);
}

/**
 * The local fields of an instant: date, time, ISO weekday, day number and offset. Allocates one object; in loops
 * use {@link wallMsFromEpochMsBulk}.
 *
 * @example
 * ```ts
 * wallFieldsFromEpochMs('Europe/Dublin', Date.UTC(2025, 6, 1, 12)).hour; // 13
 * ```
 */
export function wallFieldsFromEpochMs(zone: ZoneInput, epochMs: number): WallFields {
  const e = engineOf(toZone(zone));
  requireEpochMs('epochMs', epochMs);
  const offsetSeconds = e.offsetAt(epochMs);
  const wall = epochMs + offsetSeconds * 1000;
  const dayNumber = Math.floor(wall / MS_PER_DAY);
  const p = packedYmdUnchecked(dayNumber);
  const ms = wall - dayNumber * MS_PER_DAY;
  return {
    year: Math.floor(p / 512) + MIN_YEAR,
    month: (p >> 5) & 15,
    day: p & 31,
    hour: Math.floor(ms / 3_600_000),
    minute: Math.floor((ms % 3_600_000) / 60_000),
    second: Math.floor((ms % 60_000) / 1000),
    millisecond: ms % 1000,
    dayNumber,
    weekday: weekdayOfDayNumberUnchecked(dayNumber),
    offsetSeconds,
  };
}

/** @internal Resolution on an engine, without validation. */
export function resolveOn(e: Engine, wall: number): WallResolution {
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
    return { kind: 'overlap', earlierEpochMs: a.t, laterEpochMs: b.t, earlierOffsetSeconds: a.o, laterOffsetSeconds: b.o };
  }
  for (let i = 0; i < at.length; i++) {
    const ob = i === 0 ? before : after[i - 1]!;
    const oa = after[i]!;
    const start = at[i]! + ob * 1000;
    const end = at[i]! + oa * 1000;
    if (wall >= start && wall < end) {
      return { kind: 'gap', offsetBeforeSeconds: ob, offsetAfterSeconds: oa, transitionEpochMs: at[i]!, gapStartWallMs: start, gapEndWallMs: end };
    }
  }
  /* c8 ignore next 2 */
  throw new KalendsRangeError(`wallMs: could not resolve ${isoWall(wall)}; the zone's rules have transitions closer than one day`, { code: 'unsupported', received: wall });
}

/**
 * How a local wall-clock time maps to instants in a zone: `unique` (one instant), `gap` (the clocks skipped it;
 * with the offsets before and after and the skipped range), or `overlap` (it happened twice; both instants).
 *
 * @example
 * ```ts
 * // 2025-11-02T01:30 happened twice in New York:
 * resolveWallMs('America/New_York', Date.UTC(2025, 10, 2, 1, 30));
 * // { kind: 'overlap', earlierEpochMs: Date.UTC(2025, 10, 2, 5, 30), laterEpochMs: Date.UTC(2025, 10, 2, 6, 30), ... }
 * ```
 */
export function resolveWallMs(zone: ZoneInput, wallMs: number): WallResolution {
  const e = engineOf(toZone(zone));
  return resolveOn(e, requireWallMs('wallMs', wallMs));
}

const DISAMBIGUATIONS: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];

/** @internal */
export function requireDisambiguation(value: unknown): Disambiguation {
  if (!DISAMBIGUATIONS.includes(value as Disambiguation)) {
    throw new KalendsRangeError(`disambiguation: expected 'compatible', 'earlier', 'later' or 'reject', got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value as Disambiguation;
}

function pick(z: Zone, r: WallResolution, wall: number, d: Disambiguation): number {
  if (r.kind === 'unique') return r.epochMs;
  if (r.kind === 'overlap') {
    if (d === 'reject') {
      throw new WallTimeRejectedError(
        `wallMs: ${isoWall(wall)} happened twice in ${z.id} (at offsets ${formatOffsetSeconds(r.earlierOffsetSeconds)} and ${formatOffsetSeconds(r.laterOffsetSeconds)}); use disambiguation 'earlier', 'later' or 'compatible' instead of 'reject'`,
        'overlap',
        z.id,
        wall,
      );
    }
    return d === 'later' ? r.laterEpochMs : r.earlierEpochMs;
  }
  if (d === 'reject') {
    throw new WallTimeRejectedError(
      `wallMs: ${isoWall(wall)} does not exist in ${z.id}: the clocks went from ${isoWall(r.gapStartWallMs)} to ${isoWall(r.gapEndWallMs)} (offset ${formatOffsetSeconds(r.offsetBeforeSeconds)} to ${formatOffsetSeconds(r.offsetAfterSeconds)}); use disambiguation 'compatible', 'earlier' or 'later' instead of 'reject'`,
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
export function epochMsFromWallMs(zone: ZoneInput, wallMs: number, disambiguation: Disambiguation = 'compatible'): number {
  const z = toZone(zone);
  requireWallMs('wallMs', wallMs);
  const d = requireDisambiguation(disambiguation);
  return checkResult(pick(z, resolveOn(engineOf(z), wallMs), wallMs, d), 'wallMs', wallMs);
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
export function epochMsFromWallFields(zone: ZoneInput, fields: WallFieldsInput, disambiguation: Disambiguation = 'compatible'): number {
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
  return epochMsFromWallMs(zone, wall, disambiguation);
}

function dayStartOn(e: Engine, dayNumber: number): number {
  const wall = dayNumber * MS_PER_DAY;
  const r = resolveOn(e, wall);
  if (r.kind === 'unique') return r.epochMs;
  if (r.kind === 'overlap') return r.earlierEpochMs;
  return r.transitionEpochMs;
}

/** Day numbers whose start is an instant within ±8.64e15 ms (one day of margin at each end). */
const MIN_ZONED_DAY = Math.max(MIN_DAY_NUMBER, MIN_EPOCH_MS / MS_PER_DAY + 1);
const MAX_ZONED_DAY = Math.min(MAX_DAY_NUMBER, MAX_EPOCH_MS / MS_PER_DAY - 2);

/**
 * The first instant of a local day. Usually local midnight, but not always: where the clocks skipped midnight
 * (spring-forward at 00:00, as in America/Santiago, America/Havana or Asia/Beirut) the day starts at the
 * transition, e.g. 01:00. A day that was skipped entirely (Pacific/Apia, 2011-12-30) starts where the next day
 * starts, so its length is 0.
 *
 * @example
 * ```ts
 * firstEpochMsOfDayNumber('America/Santiago', dayNumberFromYmd(2025, 9, 7)); // Date.UTC(2025, 8, 7, 4) (01:00 local)
 * ```
 */
export function firstEpochMsOfDayNumber(zone: ZoneInput, dayNumber: number): number {
  const e = engineOf(toZone(zone));
  requireDayNumber(dayNumber);
  requireInteger('dayNumber', dayNumber, MIN_ZONED_DAY, MAX_ZONED_DAY);
  return dayStartOn(e, dayNumber);
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
  requireDayNumber(dayNumber);
  requireInteger('dayNumber', dayNumber, MIN_ZONED_DAY, MAX_ZONED_DAY - 1);
  return dayStartOn(e, dayNumber + 1) - dayStartOn(e, dayNumber);
}

/** Options of {@link listTransitions}. */
export interface ListTransitionsOptions {
  /** The most transitions to return before throwing a 'limit-exceeded' error (default 100,000). */
  readonly limit?: number;
}

/** Most years of rules one listTransitions call may walk (keeps a call on an Intl zone bounded: about 1 s). */
const MAX_LIST_YEARS = 2_000;

/**
 * The offset changes within [startEpochMs, endEpochMs), in order, each with the offsets before and after.
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
  options: ListTransitionsOptions = {},
): ZoneTransition[] {
  const e = engineOf(toZone(zone));
  requireEpochMs('startEpochMs', startEpochMs);
  requireEpochMs('endEpochMs', endEpochMs);
  const limit = requireInteger('options.limit', options.limit ?? 100_000, 1, 10_000_000);
  const at: number[] = [];
  const after: number[] = [];
  let prev = e.collect(startEpochMs, endEpochMs, at, after, MAX_LIST_YEARS);
  if (at.length > limit) {
    throw new KalendsRangeError(`options.limit: the range holds ${at.length} transitions, more than the limit ${limit}`, { code: 'limit-exceeded', received: limit });
  }
  const out: ZoneTransition[] = [];
  for (let i = 0; i < at.length; i++) {
    out.push(Object.freeze({ epochMs: at[i]!, offsetBeforeSeconds: prev, offsetAfterSeconds: after[i]! }));
    prev = after[i]!;
  }
  return out;
}

/**
 * The first transition strictly after an instant, or null when the zone has no later change.
 *
 * @example
 * ```ts
 * nextTransition('Europe/London', Date.UTC(2025, 0, 1))?.epochMs; // Date.UTC(2025, 2, 30, 1)
 * ```
 */
export function nextTransition(zone: ZoneInput, epochMs: number): ZoneTransition | null {
  const e = engineOf(toZone(zone));
  requireEpochMs('epochMs', epochMs);
  const t = e.next(epochMs);
  return t && t.epochMs <= MAX_EPOCH_MS ? Object.freeze(t) : null;
}

/**
 * The last transition strictly before an instant, or null when the zone has no earlier change.
 *
 * @example
 * ```ts
 * previousTransition('Asia/Kolkata', Date.UTC(2025, 0, 1))?.epochMs; // Date.UTC(1945, 9, 14, 17, 30)
 * ```
 */
export function previousTransition(zone: ZoneInput, epochMs: number): ZoneTransition | null {
  const e = engineOf(toZone(zone));
  requireEpochMs('epochMs', epochMs);
  const t = e.previous(epochMs);
  return t && t.epochMs >= MIN_EPOCH_MS ? Object.freeze(t) : null;
}

export { MAX_WALL_MS, MIN_WALL_MS };

/**
 * RFC 3339 and RFC 9557 (Internet Extended Date/Time Format) text: instants with offsets, local (plain) dates
 * and date-times, bracketed zone and suffix annotations, and ISO 8601 week and ordinal dates.
 *
 * The grammar accepted, and every place it goes beyond RFC 3339 section 5.6, is listed in docs/instants.md.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MAX_OFFSET_SECONDS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MIN_YEAR, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import {
  dayOfYearOfDayNumber,
  dayCountOfMonthUnchecked,
  dayNumberFromYmdUnchecked,
  isLeapYearUnchecked,
  packedYmdUnchecked,
  requireDayNumber,
} from '../civil/gregorian.js';
import { isoWeekDateFromDayNumber, isoWeeksInYearUnchecked, isoWeekOneMonday } from '../civil/isoweek.js';
import { Scanner, formatYear, pad2, syntaxError } from './scan.js';

/** One RFC 9557 suffix tag such as `[u-ca=iso8601]` or `[!x-order=42]`. */
export interface SuffixTag {
  /** The key, lower-case (RFC 9557 section 3.1). */
  readonly key: string;
  /** The value: one or more alphanumeric parts joined by `-`. */
  readonly value: string;
  /** True when the tag was marked critical with `!` (RFC 9557 section 3.3). */
  readonly critical: boolean;
}

/** What to do with a leap second (`:60`). */
export type LeapSecondHandling = 'constrain' | 'reject';

/** Options shared by the date-time parsers. */
export interface ParseDateTimeOptions {
  /**
   * `'constrain'` (default) reads second 60 as second 59 of the same minute, keeping the fraction, as Temporal
   * does, and sets `leapSecond`; `'reject'` throws. In text with an offset, `:60` is accepted only where a UTC
   * leap second can occur: 23:59:60 UTC on the last day of a month (RFC 3339 section 5.7).
   */
  readonly leapSecond?: LeapSecondHandling;
  /**
   * Suffix keys the caller processes itself. A critical tag (`[!key=value]`) or an experimental tag (key starting
   * with `_`) whose key is not listed here is rejected, as RFC 9557 sections 3.2 and 3.3 require of a recipient
   * that does not act on it. `[!u-ca=iso8601]` is always understood: it is kalends's own calendar.
   */
  readonly understoodKeys?: readonly string[];
}

/**
 * Every piece of an RFC 9557 date-time string. `offsetSeconds` is undefined when the text has no offset (a local
 * date-time). Returned by {@link parseExtendedDateTime}; {@link parseInstant} and {@link parsePlainDateTime} are
 * stricter faces over it.
 */
export interface ExtendedDateTime {
  /** Local date of the written fields. */
  readonly dayNumber: number;
  /** Local wall-clock time of the written fields, in ms since 1970-01-01T00:00 (sub-ms digits floored). */
  readonly wallMs: number;
  /** Nanoseconds below the millisecond that were written and dropped (0..999,999). */
  readonly submillisecondNs: number;
  /** Whether the text had a time part (false for a bare date). */
  readonly hasTime: boolean;
  /** True when the text said `:60` and the value was read as `:59` (see {@link ParseDateTimeOptions.leapSecond}). */
  readonly leapSecond: boolean;
  /** The UTC offset written, in seconds east of UTC; undefined when there was none. `Z` and `-00:00` give 0. */
  readonly offsetSeconds: number | undefined;
  /** True for `Z`, `z` and `-00:00`: UTC is known but the local offset is not (RFC 9557 section 2). */
  readonly localOffsetUnknown: boolean;
  /** The bracketed zone annotation, unresolved (an IANA name or `±HH:MM`); undefined when there was none. */
  readonly zoneId: string | undefined;
  /** Whether the zone annotation was marked critical (`[!Europe/Paris]`). */
  readonly zoneCritical: boolean;
  /** Suffix tags in the order written (RFC 9557 section 3.3: for a repeated elective key, the first one counts). */
  readonly annotations: readonly SuffixTag[];
}

/** An instant read from text: {@link parseInstant}'s result. */
export interface ParsedInstant extends ExtendedDateTime {
  /** The instant, in epoch milliseconds (sub-millisecond digits floored: truncated toward the past). */
  readonly epochMs: number;
  readonly offsetSeconds: number;
}

const MS_PER_HOUR = 3_600_000;
const MS_PER_MINUTE = 60_000;
const INSTANT_GRAMMAR = 'an RFC 3339 / RFC 9557 date-time with an offset';
const DATE_TIME_GRAMMAR = 'an RFC 9557 date-time';

interface Fields {
  year: number;
  month: number;
  day: number;
  dayNumber: number;
  hasTime: boolean;
  msOfDay: number;
  ns: number;
  second: number;
  secondPos: number;
  offsetSeconds: number | undefined;
  localOffsetUnknown: boolean;
  /** Position of a `Z`/`z` offset, or -1. */
  zuluPos: number;
  zoneId: string | undefined;
  zoneCritical: boolean;
  annotations: SuffixTag[];
}

function requireString(fn: string, text: unknown, what: string): string {
  if (typeof text !== 'string') {
    throw new KalendsTypeError(`${fn}: expected ${what} as a string, got ${describeValue(text)}`, {
      code: 'invalid-type',
      received: text,
    });
  }
  return text;
}

/** Reads `YYYY-MM-DD` (with an expanded year if signed). */
function readCalendarDate(sc: Scanner): { year: number; month: number; day: number } {
  const year = sc.year();
  sc.expectChar(45, 'a "-" after the year');
  const month = sc.field2('month', 1, 12);
  sc.expectChar(45, 'a "-" after the month');
  const dayPos = sc.pos;
  const day = sc.digits(2, 'the day');
  const dim = dayCountOfMonthUnchecked(year, month);
  if (day < 1 || day > dim) {
    sc.fail(`day ${sc.text.slice(dayPos, dayPos + 2)} is out of range; ${formatYear(year)}-${pad2(month)} has days 01 to ${dim}`, dayPos, 'out-of-range');
  }
  return { year, month, day };
}

function readFields(sc: Scanner, opts: ParseDateTimeOptions | undefined): Fields {
  const { year, month, day } = readCalendarDate(sc);
  const f: Fields = {
    year,
    month,
    day,
    dayNumber: dayNumberFromYmdUnchecked(year, month, day),
    hasTime: false,
    msOfDay: 0,
    ns: 0,
    second: 0,
    secondPos: -1,
    offsetSeconds: undefined,
    localOffsetUnknown: false,
    zuluPos: -1,
    zoneId: undefined,
    zoneCritical: false,
    annotations: [],
  };
  const sep = sc.peek();
  if (sep === 84 /* T */ || sep === 116 /* t */ || sep === 32 /* space */) {
    sc.pos++;
    readTime(sc, f);
    readOffset(sc, f);
  } else if (!sc.done && sep !== 91 /* [ */) {
    sc.fail(`expected "T" (or "t" or a space) between the date and the time, found ${sc.here()}`);
  }
  readAnnotations(sc, f, opts);
  if (!sc.done) sc.fail(`unexpected ${sc.here()} after the end of the date-time`);
  return f;
}

function readTime(sc: Scanner, f: Fields): void {
  const hourPos = sc.pos;
  const hour = sc.digits(2, 'the hour');
  if (hour === 24) {
    sc.fail('hour 24 is not accepted (RFC 3339 section 5.6 allows 00 to 23); write 00:00 of the next day instead', hourPos, 'out-of-range');
  }
  if (hour > 23) sc.fail(`hour ${sc.text.slice(hourPos, hourPos + 2)} is out of range; expected 00 to 23`, hourPos, 'out-of-range');
  if (sc.peek() !== 58) {
    sc.fail(sc.countDigits() > 0 ? 'the time needs ":" between hour and minute (extended format)' : `expected ":" and the minute after the hour, found ${sc.here()}`);
  }
  sc.pos++;
  const minute = sc.field2('minute', 0, 59);
  let second = 0;
  let ns = 0;
  if (sc.peek() === 58) {
    sc.pos++;
    f.secondPos = sc.pos;
    second = sc.field2('second', 0, 60);
    ns = sc.fractionNs('the second');
    if (ns < 0) ns = 0;
  } else if (sc.countDigits() > 0) {
    sc.fail('the time needs ":" between minute and second (extended format)');
  } else if (sc.peek() === 46 || sc.peek() === 44) {
    sc.fail('a fraction is accepted only on the second; write HH:MM:SS.fff');
  }
  f.hasTime = true;
  f.second = second;
  f.ns = ns;
  f.msOfDay = hour * MS_PER_HOUR + minute * MS_PER_MINUTE + Math.min(second, 59) * 1000 + Math.floor(ns / 1e6);
}

function readOffset(sc: Scanner, f: Fields): void {
  const c = sc.peek();
  if (c === 90 /* Z */ || c === 122 /* z */) {
    f.zuluPos = sc.pos;
    sc.pos++;
    f.offsetSeconds = 0;
    f.localOffsetUnknown = true;
    return;
  }
  if (c !== 43 && c !== 45) return;
  const seconds = readNumericOffset(sc, true);
  f.offsetSeconds = seconds;
  f.localOffsetUnknown = seconds === 0 && c === 45; // -00:00, RFC 3339 section 4.3 / RFC 9557 section 2
}

/** Reads `±HH:MM` or, when `allowSeconds`, `±HH:MM:SS`. Returns seconds east of UTC. */
function readNumericOffset(sc: Scanner, allowSeconds: boolean): number {
  const start = sc.pos;
  const sign = sc.peek() === 45 ? -1 : 1;
  sc.pos++;
  const n = sc.countDigits();
  if (n !== 2) {
    sc.fail(
      n === 4
        ? 'the offset needs a colon: write ±HH:MM (e.g. +01:00)'
        : `the offset must be written ±HH:MM (e.g. -05:00), found ${n === 0 ? sc.here() : `${n} digits`}`,
      start,
    );
  }
  const hours = sc.field2('offset hour', 0, 23);
  if (sc.peek() !== 58) sc.fail('the offset needs minutes: write ±HH:MM (e.g. +01:00)', sc.pos);
  sc.pos++;
  const minutes = sc.field2('offset minute', 0, 59);
  let seconds = 0;
  if (sc.peek() === 58) {
    if (!allowSeconds) sc.fail('an offset in a zone annotation is ±HH:MM, without seconds (RFC 9557 section 4.1)');
    sc.pos++;
    seconds = sc.field2('offset second', 0, 59);
    if (sc.peek() === 46 || sc.peek() === 44) sc.fail('fractional seconds are not accepted in an offset');
  }
  return sign * (hours * 3600 + minutes * 60 + seconds);
}

function isAlpha(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}
function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

function readAnnotations(sc: Scanner, f: Fields, opts: ParseDateTimeOptions | undefined): void {
  // A string here would match substrings (String.prototype.includes): only an array of keys is accepted.
  const given: unknown = opts?.understoodKeys;
  if (given !== undefined && !(Array.isArray(given) && given.every((k) => typeof k === 'string'))) {
    throw new KalendsTypeError(`options.understoodKeys: expected an array of annotation keys (strings) such as ["_foo"], got ${describeValue(given)}`, {
      code: 'invalid-type',
      received: given,
    });
  }
  const understood = (given ?? []) as readonly string[];
  let sawTag = false;
  let seenKeys: Map<string, { value: string; differ: boolean; critical: boolean }> | undefined;
  while (sc.peek() === 91 /* [ */) {
    const open = sc.pos;
    const close = sc.text.indexOf(']', open);
    if (close < 0) sc.fail('an annotation opened with "[" is never closed with "]"', open);
    sc.pos++;
    let critical = false;
    if (sc.peek() === 33 /* ! */) {
      critical = true;
      sc.pos++;
    }
    const bodyStart = sc.pos;
    const body = sc.text.slice(bodyStart, close);
    const eq = body.indexOf('=');
    if (eq < 0) {
      // time-zone annotation
      if (f.zoneId !== undefined) sc.fail('a second zone annotation; at most one is allowed', open);
      if (sawTag) sc.fail('the zone annotation must come before the other annotations (RFC 9557 section 4.1)', open);
      if (body.length === 0) sc.fail('an empty annotation "[]"', open);
      const c0 = body.charCodeAt(0);
      if (c0 === 43 || c0 === 45) {
        readNumericOffset(sc, false);
        if (sc.pos !== close) sc.fail(`unexpected ${sc.here()} in the offset zone annotation`);
      } else {
        validateZoneName(sc, body, bodyStart);
      }
      f.zoneId = body;
      f.zoneCritical = critical;
    } else {
      const key = body.slice(0, eq);
      const value = body.slice(eq + 1);
      validateKey(sc, key, bodyStart);
      validateValue(sc, value, bodyStart + eq + 1);
      const builtIn = key === 'u-ca' && value === 'iso8601';
      if (critical && !builtIn && !understood.includes(key)) {
        sc.fail(
          `the critical annotation [!${key}=${value}] is not understood; a recipient must reject it (RFC 9557 section 3.3). Pass understoodKeys: [${JSON.stringify(key)}] if your code processes it`,
          open,
          'unsupported',
        );
      }
      if (key.charCodeAt(0) === 95 && !understood.includes(key)) {
        sc.fail(
          `the experimental key ${key} is rejected unless configured (RFC 9557 section 3.2); pass understoodKeys: [${JSON.stringify(key)}] to accept it`,
          bodyStart,
          'unsupported',
        );
      }
      seenKeys ??= new Map();
      const seen = seenKeys.get(key);
      if (seen === undefined) seenKeys.set(key, { value, differ: false, critical });
      else {
        const differ = seen.differ || seen.value !== value;
        if (differ && (seen.critical || critical)) {
          sc.fail(`the key ${key} is given twice with different values and one is critical (RFC 9557 section 3.3)`, open);
        }
        seen.differ = differ;
        seen.critical ||= critical;
      }
      f.annotations.push(Object.freeze({ key, value, critical }));
      sawTag = true;
    }
    sc.pos = close + 1;
  }
}

function validateZoneName(sc: Scanner, body: string, at: number): void {
  let partStart = 0;
  for (let i = 0; i <= body.length; i++) {
    const c = i < body.length ? body.charCodeAt(i) : 47;
    if (c === 47 /* / */) {
      const part = body.slice(partStart, i);
      if (part.length === 0) sc.fail('a zone name part is empty', at + i);
      if (part === '.' || part === '..') sc.fail(`"${part}" is not a valid zone name part`, at + partStart);
      partStart = i + 1;
      continue;
    }
    const initial = i === partStart;
    const ok = isAlpha(c) || c === 46 || c === 95 || (!initial && (isDigit(c) || c === 45 || c === 43));
    if (!ok) {
      sc.fail(
        `${JSON.stringify(body[i])} is not allowed ${initial ? 'at the start of' : 'in'} a zone name (RFC 9557 section 4.1: letters, ".", "_", then digits, "-", "+")`,
        at + i,
      );
    }
  }
}

function validateKey(sc: Scanner, key: string, at: number): void {
  if (key.length === 0) sc.fail('an annotation key is empty', at);
  for (let i = 0; i < key.length; i++) {
    const c = key.charCodeAt(i);
    const lower = (c >= 97 && c <= 122) || c === 95;
    const ok = i === 0 ? lower : lower || isDigit(c) || c === 45;
    if (!ok) {
      sc.fail(
        c >= 65 && c <= 90
          ? `annotation keys are lower-case only (RFC 9557 section 3.1), found ${JSON.stringify(key)}`
          : `${JSON.stringify(key[i])} is not allowed in an annotation key (RFC 9557 section 4.1)`,
        at + i,
      );
    }
  }
}

function validateValue(sc: Scanner, value: string, at: number): void {
  let run = 0;
  for (let i = 0; i <= value.length; i++) {
    const c = i < value.length ? value.charCodeAt(i) : 45;
    if (c === 45) {
      if (run === 0) sc.fail('an annotation value part is empty (values are alphanumeric parts joined by "-")', at + i);
      run = 0;
    } else if (isAlpha(c) || isDigit(c)) run++;
    else sc.fail(`${JSON.stringify(value[i])} is not allowed in an annotation value (RFC 9557 section 4.1)`, at + i);
  }
}

function checkLeapSecond(sc: Scanner, f: Fields, opts: ParseDateTimeOptions | undefined): boolean {
  if (f.second !== 60) return false;
  if ((opts?.leapSecond ?? 'constrain') === 'reject') {
    sc.fail('second 60 (a leap second) is rejected by the option leapSecond: "reject"', f.secondPos, 'out-of-range');
  }
  if (f.offsetSeconds !== undefined) {
    // The minute must be 23:59 UTC on the last day of a month (RFC 3339 section 5.7).
    const utcMinuteMs = f.dayNumber * MS_PER_DAY + f.msOfDay - (f.msOfDay % MS_PER_MINUTE) - f.offsetSeconds * 1000;
    const utcDay = Math.floor(utcMinuteMs / MS_PER_DAY);
    const utcMinuteOfDay = (utcMinuteMs - utcDay * MS_PER_DAY) / MS_PER_MINUTE;
    const p = packedYmdUnchecked(utcDay);
    const y = Math.floor(p / 512) + MIN_YEAR;
    const m = (p >> 5) & 15;
    const d = p & 31;
    if (utcMinuteOfDay !== 23 * 60 + 59 || d !== dayCountOfMonthUnchecked(y, m)) {
      sc.fail(
        'second 60 is a leap second, which occurs only at 23:59:60 UTC on the last day of a month (RFC 3339 section 5.7)',
        f.secondPos,
        'out-of-range',
      );
    }
  }
  return true;
}

const NO_ANNOTATIONS: readonly SuffixTag[] = Object.freeze([]);

/** Builds the frozen result in one object literal (one shape for every result, no spreading). */
function makeResult(f: Fields, leapSecond: boolean, epochMs: number): ParsedInstant {
  return Object.freeze({
    dayNumber: f.dayNumber,
    wallMs: f.dayNumber * MS_PER_DAY + f.msOfDay,
    submillisecondNs: f.ns % 1e6,
    hasTime: f.hasTime,
    leapSecond,
    offsetSeconds: f.offsetSeconds as number,
    localOffsetUnknown: f.localOffsetUnknown,
    zoneId: f.zoneId,
    zoneCritical: f.zoneCritical,
    annotations: f.annotations.length === 0 ? NO_ANNOTATIONS : Object.freeze(f.annotations),
    epochMs,
  });
}

/**
 * Parses any RFC 9557 date-time (or ISO 8601 calendar date) and returns all of its pieces without deciding what
 * it means: the offset and the zone annotation are returned as written, not resolved or checked against each
 * other (the zone layer does that). Use {@link parseInstant} when the text must name an instant and
 * {@link parsePlainDateTime} when it must be a local date-time.
 *
 * @example
 * ```ts
 * const p = parseExtendedDateTime('2025-03-30T02:30[Europe/Dublin]');
 * p.offsetSeconds; // undefined
 * p.zoneId;        // 'Europe/Dublin'
 * ```
 */
export function parseExtendedDateTime(text: string, options?: ParseDateTimeOptions): ExtendedDateTime {
  requireString('parseExtendedDateTime', text, 'a date-time');
  const sc: Scanner = new Scanner(text, 'parseExtendedDateTime', DATE_TIME_GRAMMAR);
  const f = readFields(sc, options);
  const leap = checkLeapSecond(sc, f, options);
  return Object.freeze({
    dayNumber: f.dayNumber,
    wallMs: f.dayNumber * MS_PER_DAY + f.msOfDay,
    submillisecondNs: f.ns % 1e6,
    hasTime: f.hasTime,
    leapSecond: leap,
    offsetSeconds: f.offsetSeconds,
    localOffsetUnknown: f.localOffsetUnknown,
    zoneId: f.zoneId,
    zoneCritical: f.zoneCritical,
    annotations: f.annotations.length === 0 ? NO_ANNOTATIONS : Object.freeze(f.annotations),
  });
}

/**
 * Parses an instant: an RFC 3339 date-time with a required UTC offset (`Z` or `±HH:MM`, or `±HH:MM:SS` as in
 * RFC 9557 and Temporal), optionally followed by RFC 9557 annotations: a zone `[Europe/Paris]`, critical
 * `[!Europe/Paris]`, and suffix tags `[u-ca=iso8601]`. The zone annotation is returned, not resolved; when
 * offset and zone disagree, both are returned and the zone layer can check them.
 *
 * Rules (docs/instants.md): the date-time separator may be `T`, `t` or a space (RFC 3339 section 5.6 note);
 * `z` is read as `Z`; seconds may be omitted (`09:30Z`); up to 9 fraction digits are accepted and the instant
 * is floored to the millisecond (truncated toward the past, as Temporal's `epochMilliseconds`); hour 24 is
 * rejected; second 60 is read as 59 where RFC 3339 section 5.7 allows a leap second (see
 * {@link ParseDateTimeOptions.leapSecond}); years are `0000`..`9999` or expanded `±YYYYYY`; the instant must lie
 * within ±8.64e15 ms.
 *
 * Throws {@link KalendsSyntaxError} for text that breaks the grammar (with `position`), including a missing
 * offset, and {@link KalendsRangeError} for an instant outside the supported range.
 *
 * @example
 * ```ts
 * parseInstant('1985-04-12T23:20:50.52Z').epochMs;     // 482196050520
 * parseInstant('1996-12-19T16:39:57-08:00[America/Los_Angeles]').zoneId; // 'America/Los_Angeles'
 * ```
 */
export function parseInstant(text: string, options?: ParseDateTimeOptions): ParsedInstant {
  requireString('parseInstant', text, 'an RFC 3339 date-time with an offset');
  const sc: Scanner = new Scanner(text, 'parseInstant', INSTANT_GRAMMAR);
  const f = readFields(sc, options);
  if (!f.hasTime) {
    sc.fail('it is a date without a time and offset; an instant needs both (e.g. 2025-02-14T09:30:00Z). To read a calendar date use parsePlainDate instead', text.length);
  }
  if (f.offsetSeconds === undefined) {
    throw syntaxError(
      'parseInstant',
      text,
      INSTANT_GRAMMAR,
      'the UTC offset is missing; an instant needs "Z" or ±HH:MM after the time. To read it as a local date-time use parsePlainDateTime instead',
      text.length,
    );
  }
  const leap = checkLeapSecond(sc, f, options);
  const epochMs = f.dayNumber * MS_PER_DAY + f.msOfDay - f.offsetSeconds * 1000;
  if (epochMs < MIN_EPOCH_MS || epochMs > MAX_EPOCH_MS || (epochMs === MAX_EPOCH_MS && f.ns % 1e6 !== 0)) {
    throw new KalendsRangeError(
      `parseInstant: ${describeValue(text)} is outside the supported range of instants, ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS} epoch ms (-271821-04-20T00:00Z to +275760-09-13T00:00Z)`,
      { code: 'out-of-range', received: text },
    );
  }
  return makeResult(f, leap, epochMs);
}

/** Options of {@link parsePlainDateTime}. */
export interface ParsePlainDateTimeOptions extends ParseDateTimeOptions {
  /**
   * `'reject'` (default): text with a numeric offset or a zone annotation is an error, because it names an
   * instant or a zoned time, not a plain local one. `'ignore'`: the offset and zone annotation are checked and
   * dropped, and the written wall-clock fields are returned. `Z` is always rejected: it says the local time is
   * unknown (RFC 9557 section 2), so its fields are UTC, not local.
   */
  readonly offset?: 'reject' | 'ignore';
}

/**
 * Parses a local (plain) date-time, `YYYY-MM-DDTHH:MM[:SS[.fff]]`, or a bare date (read as 00:00), into wall
 * milliseconds (`dayNumber * 86,400,000 + ms of the day`). Sub-millisecond digits are floored; second 60 is read
 * as 59 (as Temporal does; there is no UTC reference to check it against).
 *
 * @example
 * ```ts
 * parsePlainDateTime('1970-01-02T00:00:01'); // 86401000
 * parsePlainDateTime('2025-02-14T09:30:00+01:00', { offset: 'ignore' }); // wall ms of 09:30 on 2025-02-14
 * ```
 */
export function parsePlainDateTime(text: string, options?: ParsePlainDateTimeOptions): number {
  requireString('parsePlainDateTime', text, 'a local date-time');
  const sc: Scanner = new Scanner(text, 'parsePlainDateTime', 'a local ISO 8601 date-time');
  const f = readFields(sc, options);
  if (f.zuluPos >= 0) {
    throw syntaxError('parsePlainDateTime', text, 'a local ISO 8601 date-time', '"Z" gives a time in UTC, not a local time; use parseInstant instead', f.zuluPos);
  }
  if ((options?.offset ?? 'reject') === 'reject') {
    if (f.offsetSeconds !== undefined) {
      throw syntaxError(
        'parsePlainDateTime',
        text,
        'a local ISO 8601 date-time',
        'it has a UTC offset, so it names an instant; use parseInstant, or pass { offset: "ignore" } to keep only the wall-clock fields',
        text.length,
      );
    }
    if (f.zoneId !== undefined) {
      throw syntaxError(
        'parsePlainDateTime',
        text,
        'a local ISO 8601 date-time',
        'it has a zone annotation, so it names a zoned time; pass { offset: "ignore" } to keep only the wall-clock fields',
        text.indexOf('['),
      );
    }
  }
  checkLeapSecond(sc, { ...f, offsetSeconds: undefined }, options);
  return f.dayNumber * MS_PER_DAY + f.msOfDay;
}

/**
 * Parses a local (plain) date in any ISO 8601 extended form: a calendar date `2025-02-14`, a week date
 * `2025-W07-5` (ISO 8601-1:2019, 5.2.3) or an ordinal date `2025-045` (5.2.2). Years are `0000`..`9999` or
 * expanded `±YYYYYY`. Returns the day number. Anything after the date (a time, an offset) is an error naming
 * the function to use instead.
 *
 * @example
 * ```ts
 * parsePlainDate('2025-02-14'); // 20133
 * parsePlainDate('2025-W07-5'); // 20133
 * parsePlainDate('2025-045');   // 20133
 * ```
 */
export function parsePlainDate(text: string): number {
  requireString('parsePlainDate', text, 'an ISO 8601 date');
  const sc: Scanner = new Scanner(text, 'parsePlainDate', 'an ISO 8601 date (YYYY-MM-DD, YYYY-Www-D or YYYY-DDD)');
  const start = sc.pos;
  const year = sc.year();
  sc.expectChar(45, 'a "-" after the year');
  let dn: number;
  if (sc.peek() === 87 /* W */) {
    sc.pos++;
    const weeks = isoWeeksInYearUnchecked(year);
    const week = sc.field2('week', 1, weeks, ` in week-year ${formatYear(year)}`);
    if (sc.peek() !== 45) {
      sc.fail(sc.done ? 'a week without a weekday is a week, not a date; add the weekday, e.g. -1 for Monday' : `expected "-" and the weekday after the week, found ${sc.here()}`);
    }
    sc.pos++;
    const wdPos = sc.pos;
    const weekday = sc.digits(1, 'the weekday');
    if (weekday < 1 || weekday > 7) sc.fail(`weekday ${weekday} is out of range; expected 1 (Monday) to 7 (Sunday)`, wdPos, 'out-of-range');
    dn = isoWeekOneMonday(year) + (week - 1) * 7 + weekday - 1;
  } else if (sc.countDigits() === 3) {
    const pos = sc.pos;
    const doy = sc.digits(3, 'the day of the year');
    const max = isLeapYearUnchecked(year) ? 366 : 365;
    if (doy < 1 || doy > max) sc.fail(`day of year ${text.slice(pos, pos + 3)} is out of range; ${formatYear(year)} has days 001 to ${max}`, pos, 'out-of-range');
    dn = dayNumberFromYmdUnchecked(year, 1, 1) + doy - 1;
  } else {
    sc.pos = start;
    const { year: y, month, day } = readCalendarDate(sc);
    dn = dayNumberFromYmdUnchecked(y, month, day);
  }
  if (!sc.done) {
    const c = sc.peek();
    if (c === 84 || c === 116 || c === 32) sc.fail('it has a time part; use parsePlainDateTime or parseInstant to read a date-time');
    sc.fail(`unexpected ${sc.here()} after the date`);
  }
  if (dn < MIN_DAY_NUMBER || dn > MAX_DAY_NUMBER) {
    throw new KalendsRangeError(`parsePlainDate: ${describeValue(text)} falls outside the supported day numbers ${MIN_DAY_NUMBER} to ${MAX_DAY_NUMBER}`, {
      code: 'out-of-range',
      received: text,
    });
  }
  return dn;
}

/**
 * Formats a day number as an ISO 8601 calendar date, `YYYY-MM-DD`; years outside 0..9999 use the expanded form
 * `±YYYYYY` (ISO 8601-1:2019 4.3.2 / RFC 9557, as Temporal prints them).
 *
 * @example
 * ```ts
 * formatPlainDate(20133);   // '2025-02-14'
 * formatPlainDate(-719529); // '-000001-12-31'
 * ```
 */
export function formatPlainDate(dayNumber: number): string {
  requireDayNumber(dayNumber);
  return formatDayNumberUnchecked(dayNumber);
}

/** @internal */
export function formatDayNumberUnchecked(dayNumber: number): string {
  const p = packedYmdUnchecked(dayNumber);
  return `${formatYear(Math.floor(p / 512) + MIN_YEAR)}-${pad2((p >> 5) & 15)}-${pad2(p & 31)}`;
}

/**
 * Formats a day number as an ISO 8601 week date, `YYYY-Www-D` (the week-year can differ from the calendar year
 * near 1 January).
 *
 * @example
 * ```ts
 * formatIsoWeekDate(20133); // '2025-W07-5'
 * ```
 */
export function formatIsoWeekDate(dayNumber: number): string {
  const w = isoWeekDateFromDayNumber(dayNumber);
  return `${formatYear(w.weekYear)}-W${pad2(w.week)}-${w.weekday}`;
}

/**
 * Formats a day number as an ISO 8601 ordinal date, `YYYY-DDD`.
 *
 * @example
 * ```ts
 * formatOrdinalDate(20133); // '2025-045'
 * ```
 */
export function formatOrdinalDate(dayNumber: number): string {
  const doy = dayOfYearOfDayNumber(dayNumber);
  const year = Math.floor(packedYmdUnchecked(dayNumber) / 512) + MIN_YEAR;
  return `${formatYear(year)}-${String(doy).padStart(3, '0')}`;
}

/** How many fraction digits of the second to write: 0..9, or `'auto'` (as few as needed, at most 3). */
export type FractionDigits = 'auto' | 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9;

function requireFractionDigits(fn: string, v: unknown): FractionDigits {
  if (v === undefined || v === 'auto') return 'auto';
  if (typeof v === 'number' && Number.isInteger(v) && v >= 0 && v <= 9) return v as FractionDigits;
  throw new KalendsRangeError(`${fn}: options.fractionDigits: expected "auto" or an integer from 0 to 9, got ${describeValue(v)}`, {
    code: 'out-of-range',
    received: v,
    path: 'fractionDigits',
  });
}

/** Writes HH:MM:SS[.fff] for a ms-of-day; digits past the third are zeros, fewer digits truncate. */
function formatTimeOfDay(msOfDay: number, digits: FractionDigits): string {
  const h = Math.floor(msOfDay / MS_PER_HOUR);
  const m = Math.floor((msOfDay % MS_PER_HOUR) / MS_PER_MINUTE);
  const s = Math.floor((msOfDay % MS_PER_MINUTE) / 1000);
  const ms = msOfDay % 1000;
  let frac = '';
  if (digits === 'auto') {
    if (ms !== 0) frac = `.${String(ms).padStart(3, '0').replace(/0+$/, '')}`;
  } else if (digits > 0) {
    frac = `.${(String(ms).padStart(3, '0') + '000000').slice(0, digits)}`;
  }
  return `${pad2(h)}:${pad2(m)}:${pad2(s)}${frac}`;
}

function formatWall(wallMs: number, digits: FractionDigits): string {
  const dn = Math.floor(wallMs / MS_PER_DAY);
  return `${formatDayNumberUnchecked(dn)}T${formatTimeOfDay(wallMs - dn * MS_PER_DAY, digits)}`;
}

/**
 * Formats an offset in seconds as `±HH:MM`, or `±HH:MM:SS` when it has seconds.
 *
 * @example
 * ```ts
 * formatOffset(19800);  // '+05:30'
 * formatOffset(-12600); // '-03:30'
 * formatOffset(19270);  // '+05:21:10'
 * ```
 */
export function formatOffset(offsetSeconds: number): string {
  requireInteger('offsetSeconds', offsetSeconds, -MAX_OFFSET_SECONDS, MAX_OFFSET_SECONDS);
  const sign = offsetSeconds < 0 ? '-' : '+';
  const a = Math.abs(offsetSeconds);
  const hm = `${sign}${pad2(Math.floor(a / 3600))}:${pad2(Math.floor((a % 3600) / 60))}`;
  return a % 60 === 0 ? hm : `${hm}:${pad2(a % 60)}`;
}

/** Options of {@link formatInstant}. */
export interface FormatInstantOptions {
  /** Offset to write the local time in. Omitted: UTC written as `Z`. `0` writes `+00:00` (RFC 9557 section 2). */
  readonly offsetSeconds?: number;
  /** Fraction digits of the second: 0..9 (truncated, never rounded up) or `'auto'` (default: as few as needed). */
  readonly fractionDigits?: FractionDigits;
  /** A zone annotation to append, `[zoneId]`. It is checked against the RFC 9557 grammar, not resolved. */
  readonly zoneId?: string;
  /** Mark the zone annotation critical: `[!zoneId]`. */
  readonly zoneCritical?: boolean;
  /** Suffix tags to append after the zone annotation. */
  readonly annotations?: readonly SuffixTag[];
}

/**
 * Formats an instant as RFC 3339 text, with RFC 9557 annotations when asked. The local time is computed from
 * `offsetSeconds`; the instant itself does not change.
 *
 * @example
 * ```ts
 * formatInstant(482196050520);                           // '1985-04-12T23:20:50.52Z'
 * formatInstant(851042397000, { offsetSeconds: -28800, zoneId: 'America/Los_Angeles' });
 * // '1996-12-19T16:39:57-08:00[America/Los_Angeles]'
 * ```
 */
export function formatInstant(epochMs: number, options?: FormatInstantOptions): string {
  requireInteger('epochMs', epochMs, MIN_EPOCH_MS, MAX_EPOCH_MS);
  const digits = requireFractionDigits('formatInstant', options?.fractionDigits);
  const off = options?.offsetSeconds;
  let text: string;
  if (off === undefined) text = `${formatWall(epochMs, digits)}Z`;
  else text = `${formatWall(epochMs + requireInteger('options.offsetSeconds', off, -MAX_OFFSET_SECONDS, MAX_OFFSET_SECONDS) * 1000, digits)}${formatOffset(off)}`;
  return text + formatAnnotations('formatInstant', options);
}

function formatAnnotations(fn: string, options: FormatInstantOptions | undefined): string {
  let out = '';
  const zoneId = options?.zoneId;
  if (zoneId !== undefined) {
    const bang = options?.zoneCritical ? '!' : '';
    const candidate = `[${bang}${zoneId}]`;
    checkAnnotationText(fn, 'options.zoneId', zoneId, candidate, true);
    out += candidate;
  }
  for (const [i, tag] of (options?.annotations ?? []).entries()) {
    const candidate = `[${tag.critical ? '!' : ''}${tag.key}=${tag.value}]`;
    checkAnnotationText(fn, `options.annotations[${i}]`, tag, candidate, false);
    out += candidate;
  }
  return out;
}

function checkAnnotationText(fn: string, path: string, value: unknown, candidate: string, zone: boolean): void {
  // Re-use the parser on a fixed prefix so that the formatter can never write what the parser would refuse.
  const probe = `1970-01-01T00:00Z${candidate}`;
  try {
    const sc: Scanner = new Scanner(probe, fn, DATE_TIME_GRAMMAR);
    sc.pos = 17;
    const f = { zoneId: undefined, zoneCritical: false, annotations: [] } as unknown as Fields;
    readAnnotations(sc, f, { understoodKeys: zone ? [] : [(value as SuffixTag).key] });
    if (!sc.done || (zone && f.zoneId === undefined) || (!zone && f.annotations.length !== 1)) throw new Error('x');
  } catch {
    throw new KalendsRangeError(
      `${fn}: ${path}: ${describeValue(zone ? value : candidate)} is not a valid RFC 9557 ${zone ? 'zone annotation (an IANA name such as Europe/Dublin, or ±HH:MM)' : 'suffix tag (a lower-case key, "=", alphanumeric values joined by "-")'}`,
      { code: 'out-of-range', received: value, path },
    );
  }
}

/**
 * Formats wall milliseconds as a local (plain) ISO 8601 date-time, `YYYY-MM-DDTHH:MM:SS[.fff]`, without offset.
 *
 * @example
 * ```ts
 * formatPlainDateTime(86401000); // '1970-01-02T00:00:01'
 * ```
 */
export function formatPlainDateTime(wallMs: number, options?: { readonly fractionDigits?: FractionDigits }): string {
  requireInteger('wallMs', wallMs, MIN_DAY_NUMBER * MS_PER_DAY, MAX_DAY_NUMBER * MS_PER_DAY + MS_PER_DAY - 1);
  return formatWall(wallMs, requireFractionDigits('formatPlainDateTime', options?.fractionDigits));
}

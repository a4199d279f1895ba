/**
 * Reading RFC 3339 and RFC 9557 (Internet Extended Date/Time Format) text: instants with offsets, local (plain)
 * dates and date-times, bracketed zone and suffix annotations, and ISO 8601 week and ordinal dates; and the
 * internal readers of date and offset text that the zone, period and business layers use (this layer owns all
 * date, offset and year text). Writing is in format.ts; the grammar itself in grammar.ts.
 *
 * The grammar accepted, and every place it goes beyond RFC 3339 section 5.6, is listed in docs/instants.md.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { dayNumberFromYmdUnchecked, isLeapYearUnchecked } from '../civil/gregorian.js';
import { isoWeeksInYearUnchecked, isoWeekOneMonday } from '../civil/isoweek.js';
import { optionOf, readOptions, requireEnum } from '../diagnostics/index.js';
import {
  DATE_TIME_GRAMMAR,
  type ExtendedDateTime,
  INSTANT_GRAMMAR,
  type LeapSecondHandling,
  NO_ANNOTATIONS,
  type ParseDateTimeOptions,
  type ParsedInstant,
  checkLeapSecond,
  failMinusSign,
  makeResult,
  readFields,
  requireString,
} from './grammar.js';
import { Scanner, formatYear, readCalendarDate, syntaxError } from './scan.js';

export type { ExtendedDateTime, LeapSecondHandling, ParseDateTimeOptions, ParsedInstant, SuffixTag } from './grammar.js';

const LEAP_SECOND_HANDLING: readonly LeapSecondHandling[] = ['constrain', 'reject'];
const PLAIN_OFFSET_HANDLING: readonly ('reject' | 'ignore')[] = ['reject', 'ignore'];
const PARSE_KEYS = ['leapSecond', 'understoodKeys'] as const;
const NO_PARSE_OPTIONS = /* @__PURE__ */ Object.freeze({ record: Object.freeze({}), leapSecond: 'constrain' as LeapSecondHandling, understood: Object.freeze([]) as readonly string[] });

/** A scanner over `input`, which must be a string: `<name>: expected <grammar> as a string, got ...` otherwise. */
function scannerOf(input: unknown, name: string, grammar: string): Scanner {
  return new Scanner(requireString(name, input, grammar), name, grammar);
}

/** The options of a date-time parser, read once: unknown keys, foreign enum values and a bare string refused. */
function readParseOptions(options: unknown, extra: readonly string[] = []): { record: Readonly<Record<string, unknown>>; leapSecond: LeapSecondHandling; understood: readonly string[] } {
  // The common call passes no options: answer it without building the key list or a result object.
  if (options === undefined) return NO_PARSE_OPTIONS;
  const record = readOptions('options', options, [...PARSE_KEYS, ...extra]);
  const leapSecond = requireEnum('options.leapSecond', optionOf(record, 'leapSecond'), LEAP_SECOND_HANDLING, 'constrain');
  return { record, leapSecond, understood: readUnderstoodKeys(optionOf(record, 'understoodKeys')) };
}

/** `understoodKeys` is an array of strings; a bare string is refused (it would match keys by substring). */
function readUnderstoodKeys(value: unknown): readonly string[] {
  if (value === undefined) return [];
  if (!Array.isArray(value)) {
    const fix = typeof value === 'string' ? `; write [${JSON.stringify(value)}] instead` : '';
    throw new KalendsTypeError(`options.understoodKeys: expected an array of annotation keys such as ["x-order"], got ${describeValue(value)}${fix}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  for (let i = 0; i < value.length; i++) {
    if (typeof value[i] !== 'string') {
      throw new KalendsTypeError(`options.understoodKeys[${i}]: expected an annotation key (a string), got ${describeValue(value[i])}`, {
        code: 'invalid-type',
        received: value[i],
      });
    }
  }
  return value as string[];
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
  const sc: Scanner = scannerOf(text, 'text', DATE_TIME_GRAMMAR);
  const { leapSecond, understood } = readParseOptions(options);
  const f = readFields(sc, understood);
  const leap = checkLeapSecond(sc, f, leapSecond);
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
  return readInstant(text, options, 'text');
}

/** @internal {@link parseInstant}, with the name of the parameter that held the text (for messages). */
export function readInstant(input: unknown, options: unknown, name: string): ParsedInstant {
  const sc: Scanner = scannerOf(input, name, INSTANT_GRAMMAR);
  const text = sc.text;
  const { leapSecond, understood } = readParseOptions(options);
  const f = readFields(sc, understood);
  if (f.offsetSeconds === undefined) {
    sc.fail(
      `the ${f.hasTime ? 'UTC offset is' : 'time and the UTC offset are'} missing; an instant needs both (e.g. 2025-02-14T09:30:00Z): use ${f.hasTime ? 'parsePlainDateTime' : 'parsePlainDate'} for local text`,
      text.length,
    );
  }
  const leap = checkLeapSecond(sc, f, leapSecond);
  const epochMs = f.dayNumber * MS_PER_DAY + f.msOfDay - f.offsetSeconds * 1000;
  if (epochMs < MIN_EPOCH_MS || epochMs > MAX_EPOCH_MS || (epochMs === MAX_EPOCH_MS && f.ns % 1e6 !== 0)) {
    throw new KalendsRangeError(
      `${name}: ${describeValue(text)} is outside the supported range of instants, ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS} epoch ms (-271821-04-20T00:00Z to +275760-09-13T00:00Z)`,
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
  return readPlainDateTime(text, options, 'text');
}

/** @internal {@link parsePlainDateTime}, with the name of the parameter that held the text (for messages). */
export function readPlainDateTime(input: unknown, options: unknown, name: string): number {
  const sc: Scanner = scannerOf(input, name, 'a local ISO 8601 date-time');
  const text = sc.text;
  const { record, leapSecond, understood } = readParseOptions(options, ['offset']);
  const offset = requireEnum('options.offset', optionOf(record, 'offset'), PLAIN_OFFSET_HANDLING, 'reject');
  const f = readFields(sc, understood);
  if (f.zuluPos >= 0) sc.fail('"Z" gives a time in UTC, not a local time; use parseInstant instead', f.zuluPos);
  if (offset === 'reject' && (f.offsetSeconds !== undefined || f.zoneId !== undefined)) {
    const hasOffset = f.offsetSeconds !== undefined;
    sc.fail(
      `it has ${hasOffset ? 'a UTC offset, so it names an instant (use parseInstant)' : 'a zone annotation, so it names a zoned time'}; pass { offset: "ignore" } to keep only the wall-clock fields`,
      hasOffset ? text.length : text.indexOf('['),
    );
  }
  // The written offset, if any, is dropped: a local date-time has no UTC minute to check a leap second against.
  f.offsetSeconds = undefined;
  checkLeapSecond(sc, f, leapSecond);
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
  return readPlainDate(text, 'text');
}

/** @internal {@link parsePlainDate}, with the name of the parameter that held the text (for messages). */
export function readPlainDate(input: unknown, name: string): number {
  const sc: Scanner = scannerOf(input, name, 'an ISO 8601 date (YYYY-MM-DD, YYYY-Www-D or YYYY-DDD)');
  const text = sc.text;
  const start = sc.pos;
  const year = sc.year();
  sc.expectChar(45, 'a "-" after the year');
  let dn: number;
  if (sc.peek() === 87 /* W */) {
    sc.pos++;
    const weeks = isoWeeksInYearUnchecked(year);
    const week = sc.field2('week', 1, weeks, ` in week-year ${formatYear(year)}`);
    sc.expectChar(45, '"-" and the weekday (1 for Monday to 7) after the week');
    const weekday = sc.field(1, 'weekday', 1, 7, ' (Monday to Sunday)');
    dn = isoWeekOneMonday(year) + (week - 1) * 7 + weekday - 1;
  } else if (sc.countDigits() === 3) {
    const doy = sc.field(3, 'day of year', 1, isLeapYearUnchecked(year) ? 366 : 365, ` in ${formatYear(year)}`);
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
    throw new KalendsRangeError(`${name}: ${describeValue(text)} falls outside the supported day numbers ${MIN_DAY_NUMBER} to ${MAX_DAY_NUMBER}`, {
      code: 'out-of-range',
      received: text,
    });
  }
  return dn;
}

/**
 * @internal Reads an ISO 8601 calendar date `YYYY-MM-DD` (or `±YYYYYY-MM-DD`) and nothing else, for labels and
 * definitions: every fault, an impossible month or day and a year outside the supported years (plus `yearSlack`
 * years at each end) included, is a KalendsSyntaxError that starts with `name`, quotes the text and gives the
 * position.
 */
export function parseCalendarDateText(text: string, name: string, yearSlack = 0): number {
  const sc = new Scanner(text, name, 'an ISO 8601 calendar date YYYY-MM-DD such as "2025-03-14"', 'syntax', yearSlack);
  const { year, month, day } = readCalendarDate(sc);
  if (!sc.done) sc.fail(`unexpected ${sc.here()} after the date`);
  return dayNumberFromYmdUnchecked(year, month, day);
}

/**
 * @internal The day number of an ISO 8601 calendar date `YYYY-MM-DD` within the supported years, or, when the
 * text is not one, a message saying what is wrong with it (for definition validators that collect issues rather
 * than throw). The message quotes the text and gives the position.
 */
export function dayNumberFromIsoDateText(text: string): number | string {
  try {
    return parseCalendarDateText(text, 'date');
  } catch (e) {
    if (e instanceof KalendsSyntaxError) return e.message.slice('date: '.length);
    throw e;
  }
}

/**
 * @internal Reads a UTC offset written as a zone id, seconds east of UTC: `±HH`, `±HHMM`, `±HH:MM`, `±HHMMSS` or
 * `±HH:MM:SS` (the ISO 8601-1:2019 basic and extended forms; RFC 9557 offsets are the `±HH:MM` subset). Hours are
 * 00..23, minutes and seconds 00..59. The sign is the ASCII "+" or "-"; U+2212 is refused as in the date-time
 * grammar. Faults are KalendsSyntaxErrors that start with `name` and quote the text.
 */
export function parseOffsetText(name: string, text: string): number {
  const sc = new Scanner(text, name, 'a UTC offset like "+05:30", "-08:00" or "+05:21:10"');
  const c = sc.peek();
  if (c === 0x2212) failMinusSign(sc);
  if (c !== 43 && c !== 45) sc.fail(`an offset starts with "+" or "-", found ${sc.here()}`);
  sc.pos++;
  const hours = sc.field2('the offset hour', 0, 23);
  let minutes = 0;
  let seconds = 0;
  if (!sc.done) {
    if (sc.peek() === 58) sc.pos++;
    minutes = sc.field2('the offset minute', 0, 59);
    if (!sc.done) {
      if (sc.peek() === 58) sc.pos++;
      seconds = sc.field2('the offset second', 0, 59);
    }
  }
  if (!sc.done) sc.fail(`unexpected ${sc.here()} after the offset`);
  const v = hours * 3600 + minutes * 60 + seconds;
  return c === 43 ? v : 0 - v;
}

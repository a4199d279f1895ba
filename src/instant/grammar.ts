/**
 * @internal The RFC 3339 / RFC 9557 date-time grammar (Internet Extended Date/Time Format): the reader of every
 * field of a date-time string (date, time, offset, bracketed zone and suffix annotations) that the parsers in
 * text.ts and the formatter's self-check in format.ts share. The grammar accepted, and every place it goes beyond
 * RFC 3339 section 5.6, is listed in docs/instants.md.
 *
 * @module
 */
import { MS_PER_DAY } from '../bounds.js';
import { KalendsTypeError, describeValue } from '../errors.js';
import { dayNumberFromYmdUnchecked, packedYmdUnchecked, dayOfPacked } from '../civil/gregorian.js';
import { Scanner, readCalendarDate } from './scan.js';

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

/** @internal */
export const MS_PER_HOUR = 3_600_000;
/** @internal */
export const MS_PER_MINUTE = 60_000;
/** @internal */
export const INSTANT_GRAMMAR = 'an RFC 3339 / RFC 9557 date-time with an offset';
/** @internal */
export const DATE_TIME_GRAMMAR = 'an RFC 9557 date-time';

/** @internal */
export interface Fields {
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

/** @internal */
export function requireString(fn: string, text: unknown, what: string): string {
  if (typeof text !== 'string') {
    throw new KalendsTypeError(`${fn}: expected ${what} as a string, got ${describeValue(text)}`, {
      code: 'invalid-type',
      received: text,
    });
  }
  return text;
}

/** @internal */
export function readFields(sc: Scanner, understood: readonly string[]): Fields {
  const { year, month, day } = readCalendarDate(sc);
  const f: Fields = {
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
    sc.fail(`expected "T", "t" or a space after the date, found ${sc.here()}`);
  }
  readAnnotations(sc, f, understood);
  if (!sc.done) sc.fail(`unexpected ${sc.here()} after the date-time`);
  return f;
}

function readTime(sc: Scanner, f: Fields): void {
  const hourPos = sc.pos;
  const hour = sc.digits(2, 'the hour');
  if (hour > 23) {
    sc.fail(
      `hour ${sc.text.slice(hourPos, hourPos + 2)} is out of range; expected 00 to 23${hour === 24 ? ' (RFC 3339 section 5.6): write 00:00 of the next day instead' : ''}`,
      hourPos,
      'out-of-range',
    );
  }
  sc.expectChar(58, '":" and the minute after the hour (extended format HH:MM)');
  const minute = sc.field2('minute', 0, 59);
  let second = 0;
  let ns = 0;
  if (sc.peek() === 58) {
    sc.pos++;
    f.secondPos = sc.pos;
    second = sc.field2('second', 0, 60);
    ns = sc.fractionNs('the second');
    if (ns < 0) ns = 0;
  } else if (sc.countDigits() > 0 || sc.peek() === 46 || sc.peek() === 44) {
    sc.fail(`expected ":" and the second after the minute (extended format HH:MM:SS; a fraction only on the second), found ${sc.here()}`);
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
  if (c === 0x2212) failMinusSign(sc);
  if (c !== 43 && c !== 45) return;
  const seconds = readNumericOffset(sc, true);
  f.offsetSeconds = seconds;
  f.localOffsetUnknown = seconds === 0 && c === 45; // -00:00, RFC 3339 section 4.3 / RFC 9557 section 2
}

/**
 * U+2212 MINUS SIGN is refused as the sign of an offset, in an offset and in a zone annotation alike: RFC 3339
 * section 5.6 (`time-numoffset = ("+" / "-") ...`) and RFC 9557 section 4.1, which reuses it, allow only the ASCII
 * "+" and "-" (U+002D), and both Temporal polyfills (temporal-polyfill, @js-temporal/polyfill) refuse it.
 * ISO 8601-1:2019 writes the minus sign as U+2212 (from memory), but kalends reads the RFC grammar.
 */
export function failMinusSign(sc: Scanner): never {
  return sc.fail('U+2212 (the minus sign) is not an offset sign; RFC 3339 and RFC 9557 allow only "+" and "-": write the ASCII hyphen-minus (-05:00)');
}

/** @internal Reads `±HH:MM` or, when `allowSeconds`, `±HH:MM:SS`. Returns seconds east of UTC. */
function readNumericOffset(sc: Scanner, allowSeconds: boolean): number {
  const start = sc.pos;
  const sign = sc.peek() === 45 ? -1 : 1;
  sc.pos++;
  const n = sc.countDigits();
  if (n !== 2) badOffset(sc, n === 0 ? sc.here() : `${n} digits`, start);
  const hours = sc.field2('offset hour', 0, 23);
  if (sc.peek() !== 58) badOffset(sc, sc.here(), sc.pos);
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

function badOffset(sc: Scanner, found: string, at: number): never {
  return sc.fail(`an offset is written ±HH:MM (e.g. -05:00), found ${found}`, at);
}

/** @internal */
export function readAnnotations(sc: Scanner, f: Fields, understood: readonly string[]): void {
  let seenKeys: Map<string, { value: string; differ: boolean; critical: boolean }> | undefined;
  while (sc.peek() === 91 /* [ */) {
    const open = sc.pos;
    const close = sc.text.indexOf(']', open);
    if (close < 0) sc.fail('a "[" is never closed with "]"', open);
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
      if (f.annotations.length > 0) sc.fail('the zone annotation must come first (RFC 9557 section 4.1)', open);
      if (body.length === 0) sc.fail('an empty annotation "[]"', open);
      const c0 = body.charCodeAt(0);
      if (c0 === 0x2212) failMinusSign(sc);
      if (c0 === 43 || c0 === 45) {
        readNumericOffset(sc, false);
        if (sc.pos !== close) sc.fail(`unexpected ${sc.here()} in the offset zone annotation`);
      } else {
        validateName(sc, body, bodyStart, 0);
      }
      f.zoneId = body;
      f.zoneCritical = critical;
    } else {
      const key = body.slice(0, eq);
      const value = body.slice(eq + 1);
      validateName(sc, key, bodyStart, 1);
      validateName(sc, value, bodyStart + eq + 1, 2);
      // A critical tag (section 3.3) and an experimental key (section 3.2) are refused unless the caller acts on them.
      const unknownCritical = critical && !(key === 'u-ca' && value === 'iso8601');
      if ((unknownCritical || key.charCodeAt(0) === 95) && !understood.includes(key)) {
        sc.fail(
          `${unknownCritical ? `the critical annotation [!${key}=${value}]` : `the experimental key ${key}`} is refused unless understood (RFC 9557 section 3.${unknownCritical ? 3 : 2}); pass understoodKeys: [${JSON.stringify(key)}] if your code acts on it`,
          unknownCritical ? open : bodyStart,
          'unsupported',
        );
      }
      // A repeated key: any two values that differ, with any of its tags critical, is an error (section 3.3).
      seenKeys ??= new Map();
      const seen = seenKeys.get(key) ?? { value, differ: false, critical };
      seen.differ ||= seen.value !== value;
      seen.critical ||= critical;
      if (seen.differ && seen.critical) sc.fail(`the key ${key} is given twice with different values and one is critical (RFC 9557 section 3.3)`, open);
      seenKeys.set(key, seen);
      f.annotations.push(Object.freeze({ key, value, critical }));
    }
    sc.pos = close + 1;
  }
}

/** What each RFC 9557 name is called in messages, and the characters section 4.1 allows in it. */
const NAME_KINDS = [
  ['a zone name', 'letters, ".", "_", then digits, "-", "+"'],
  ['an annotation key', 'a lower-case letter or "_", then digits and "-"'],
  ['an annotation value', 'letters and digits, in parts joined by "-"'],
] as const;

/**
 * Checks a zone name (kind 0: parts joined by "/", none "." or ".."), an annotation key (kind 1: lower case only,
 * RFC 9557 section 3.1) or an annotation value (kind 2: parts joined by "-") against RFC 9557 section 4.1. `at` is
 * the position of `name` in the text.
 */
function validateName(sc: Scanner, name: string, at: number, kind: 0 | 1 | 2): void {
  const sep = kind === 0 ? 47 /* / */ : kind === 2 ? 45 /* - */ : -1;
  let partStart = 0;
  for (let i = 0; i <= name.length; i++) {
    const c = i < name.length ? name.charCodeAt(i) : sep;
    const initial = i === partStart;
    if (c === sep) {
      if (initial) sc.fail(`${NAME_KINDS[kind][0]} (or a part of it) is empty (RFC 9557 section 4.1: ${NAME_KINDS[kind][1]})`, at + i);
      // "." and ".." are not zone name parts (checked by length first: no slice on the common path).
      if (kind === 0 && i - partStart <= 2 && name.charCodeAt(partStart) === 46 && name.charCodeAt(i - 1) === 46) {
        sc.fail(`"${name.slice(partStart, i)}" is not a valid zone name part`, at + partStart);
      }
      partStart = i + 1;
      continue;
    }
    const upper = c >= 65 && c <= 90;
    const letter = upper || (c >= 97 && c <= 122);
    const digit = c >= 48 && c <= 57;
    const ok =
      kind === 2
        ? letter || digit
        : kind === 1
          ? (letter && !upper) || c === 95 || (!initial && (digit || c === 45))
          : letter || c === 46 || c === 95 || (!initial && (digit || c === 45 || c === 43));
    if (!ok) {
      sc.fail(
        kind === 1 && upper
          ? `annotation keys are lower-case only (RFC 9557 section 3.1), found ${JSON.stringify(name)}`
          : `${JSON.stringify(name[i])} is not allowed ${initial ? 'to start' : 'in'} ${NAME_KINDS[kind][0]} (RFC 9557 section 4.1: ${NAME_KINDS[kind][1]})`,
        at + i,
      );
    }
  }
}

/** @internal */
export function checkLeapSecond(sc: Scanner, f: Fields, leapSecond: LeapSecondHandling): boolean {
  if (f.second !== 60) return false;
  if (leapSecond === 'reject') {
    sc.fail('second 60 (a leap second) is rejected by the option leapSecond: "reject"', f.secondPos, 'out-of-range');
  }
  if (f.offsetSeconds !== undefined) {
    // The minute must be 23:59 UTC on the last day of a month (RFC 3339 section 5.7).
    const utcMinuteMs = f.dayNumber * MS_PER_DAY + f.msOfDay - (f.msOfDay % MS_PER_MINUTE) - f.offsetSeconds * 1000;
    const utcDay = Math.floor(utcMinuteMs / MS_PER_DAY);
    const utcMinuteOfDay = (utcMinuteMs - utcDay * MS_PER_DAY) / MS_PER_MINUTE;
    // The last day of a month is the day before a first of the month.
    if (utcMinuteOfDay !== 23 * 60 + 59 || dayOfPacked(packedYmdUnchecked(utcDay + 1)) !== 1) {
      sc.fail(
        'a leap second (second 60) occurs only at 23:59:60 UTC on the last day of a month (RFC 3339 section 5.7)',
        f.secondPos,
        'out-of-range',
      );
    }
  }
  return true;
}

/** @internal */
export const NO_ANNOTATIONS: readonly SuffixTag[] = /* @__PURE__ */ Object.freeze([]);

/** @internal Builds the frozen result in one object literal (one shape for every result, no spreading). */
export function makeResult(f: Fields, leapSecond: boolean, epochMs: number): ParsedInstant {
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

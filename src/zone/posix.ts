/**
 * POSIX TZ strings as used in the footer of TZif files (RFC 8536, section 3.3, with the extensions of section
 * 3.3.1: transition times whose hours range over -167..167). Example: `EST5EDT,M3.2.0,M11.1.0`.
 *
 * A rule here is data: a standard offset and, optionally, a daylight offset with its start and end dates. Offsets
 * are stored the kalends way (seconds east of UTC), the opposite sign of the POSIX text.
 *
 * @module
 */
import { KalendsSyntaxError, describeValue } from '../errors.js';
import {
  dayNumberFromYmdUnchecked,
  dayCountOfMonthUnchecked,
  isLeapYearUnchecked,
  weekdayOfDayNumberUnchecked,
  yearOfDayNumberUnchecked,
} from '../civil/gregorian.js';

/** A date rule of a POSIX TZ string. */
export type PosixDateRule =
  | { readonly kind: 'julian-no-leap'; readonly day: number } // Jn, 1..365, February 29 never counted
  | { readonly kind: 'julian'; readonly day: number } // n, 0..365, February 29 counted
  | { readonly kind: 'month-week-day'; readonly month: number; readonly week: number; readonly weekday: number }; // Mm.w.d, d: 0 = Sunday

/** A parsed POSIX TZ string. Offsets are seconds east of UTC; times are seconds after local midnight. */
export interface PosixTz {
  readonly text: string;
  readonly standardName: string;
  readonly standardOffsetSeconds: number;
  readonly daylight:
    | {
        readonly name: string;
        readonly offsetSeconds: number;
        readonly start: PosixDateRule;
        readonly startTimeSeconds: number;
        readonly end: PosixDateRule;
        readonly endTimeSeconds: number;
      }
    | undefined;
}

function fail(text: string, position: number, what: string): never {
  throw new KalendsSyntaxError(`POSIX TZ string ${describeValue(text)}: ${what} at position ${position}`, {
    code: 'malformed',
    received: text,
    position,
  });
}

/**
 * Parses a POSIX TZ string (RFC 8536 section 3.3). Throws a KalendsSyntaxError with the position of the fault.
 * A daylight name without rules is rejected: its default rules are implementation-defined (POSIX), and RFC 8536
 * footers always state them.
 *
 * @example
 * ```ts
 * parsePosixTz('<+0530>-5:30').standardOffsetSeconds; // 19800
 * ```
 * @internal
 */
export function parsePosixTz(text: string): PosixTz {
  let i = 0;
  const n = text.length;
  const name = (): string => {
    if (text[i] === '<') {
      const close = text.indexOf('>', i + 1);
      if (close < 0) fail(text, i, 'unclosed "<" in a zone abbreviation');
      const inner = text.slice(i + 1, close);
      if (inner.length < 3 || !/^[A-Za-z0-9+-]+$/.test(inner)) fail(text, i + 1, 'expected 3 or more letters, digits, "+" or "-" inside <...>');
      i = close + 1;
      return inner;
    }
    const start = i;
    while (i < n && /[A-Za-z]/.test(text[i]!)) i++;
    if (i - start < 3) fail(text, start, 'expected a zone abbreviation of 3 or more letters');
    return text.slice(start, i);
  };
  // [+-]hh[:mm[:ss]] with hh in 0..maxHours; returns seconds with the sign as written.
  const hms = (maxHours: number): number => {
    let sign = 1;
    if (text[i] === '+' || text[i] === '-') {
      sign = text[i] === '-' ? -1 : 1;
      i++;
    }
    const num = (maxDigits: number, max: number, what: string): number => {
      const start = i;
      while (i < n && i - start < maxDigits && text[i]! >= '0' && text[i]! <= '9') i++;
      if (i === start) fail(text, start, `expected ${what}`);
      const v = Number(text.slice(start, i));
      if (v > max) fail(text, start, `${what} ${v} is above ${max}`);
      return v;
    };
    let s = num(3, maxHours, 'hours') * 3600;
    if (text[i] === ':') {
      i++;
      s += num(2, 59, 'minutes') * 60;
      if (text[i] === ':') {
        i++;
        s += num(2, 59, 'seconds');
      }
    }
    return sign * s;
  };
  const dateRule = (): PosixDateRule => {
    const at = i;
    if (text[i] === 'M') {
      i++;
      const m = /^(\d{1,2})\.(\d)\.(\d)/.exec(text.slice(i));
      if (!m) fail(text, i, 'expected m.w.d after "M"');
      const month = Number(m[1]);
      const week = Number(m[2]);
      const weekday = Number(m[3]);
      if (month < 1 || month > 12) fail(text, i, `month ${month} is outside 1..12`);
      if (week < 1 || week > 5) fail(text, i, `week ${week} is outside 1..5`);
      if (weekday > 6) fail(text, i, `weekday ${weekday} is outside 0..6`);
      i += m[0].length;
      return { kind: 'month-week-day', month, week, weekday };
    }
    const julian = text[i] === 'J';
    if (julian) i++;
    const m = /^\d{1,3}/.exec(text.slice(i));
    if (!m) fail(text, at, 'expected a date rule (Jn, n or Mm.w.d)');
    const day = Number(m[0]);
    if (julian ? day < 1 || day > 365 : day > 365) fail(text, i, `day ${day} is outside ${julian ? '1..365' : '0..365'}`);
    i += m[0].length;
    return julian ? { kind: 'julian-no-leap', day } : { kind: 'julian', day };
  };

  const standardName = name();
  if (i >= n || !(text[i] === '+' || text[i] === '-' || (text[i]! >= '0' && text[i]! <= '9'))) {
    fail(text, i, 'expected the standard offset');
  }
  const standardOffsetSeconds = 0 - hms(24); // 0 - x: never -0
  if (i === n) return { text, standardName, standardOffsetSeconds, daylight: undefined };
  const daylightName = name();
  let daylightOffsetSeconds = standardOffsetSeconds + 3600;
  if (i < n && text[i] !== ',') daylightOffsetSeconds = 0 - hms(24);
  if (text[i] !== ',') fail(text, i, 'expected "," and the daylight-time rules (defaults are implementation-defined)');
  i++;
  const start = dateRule();
  let startTimeSeconds = 7200;
  if (text[i] === '/') {
    i++;
    startTimeSeconds = hms(167);
  }
  if (text[i] !== ',') fail(text, i, 'expected "," before the end rule');
  i++;
  const end = dateRule();
  let endTimeSeconds = 7200;
  if (text[i] === '/') {
    i++;
    endTimeSeconds = hms(167);
  }
  if (i !== n) fail(text, i, 'unexpected text after the end rule');
  return {
    text,
    standardName,
    standardOffsetSeconds,
    daylight: { name: daylightName, offsetSeconds: daylightOffsetSeconds, start, startTimeSeconds, end, endTimeSeconds },
  };
}

/** Day number of a POSIX date rule in `year`. */
function ruleDayNumber(rule: PosixDateRule, year: number): number {
  const jan1 = dayNumberFromYmdUnchecked(year, 1, 1);
  if (rule.kind === 'julian') return jan1 + rule.day;
  if (rule.kind === 'julian-no-leap') return jan1 + rule.day - 1 + (rule.day >= 60 && isLeapYearUnchecked(year) ? 1 : 0);
  const first = dayNumberFromYmdUnchecked(year, rule.month, 1);
  const firstWeekday = weekdayOfDayNumberUnchecked(first) % 7; // 0 = Sunday, as in POSIX
  let day = 1 + ((rule.weekday - firstWeekday + 7) % 7) + (rule.week - 1) * 7;
  const dim = dayCountOfMonthUnchecked(year, rule.month);
  while (day > dim) day -= 7;
  return first + day - 1;
}

/**
 * The two daylight-time events of `year` in epoch ms, in the order they occur, each with the offset in force
 * after it. Empty when the rule has no daylight time.
 */
function eventsOfYear(tz: PosixTz, year: number, out: number[]): void {
  const d = tz.daylight;
  if (!d) return;
  const startMs = ((ruleDayNumber(d.start, year) * 86400 + d.startTimeSeconds - tz.standardOffsetSeconds) * 1000);
  const endMs = ((ruleDayNumber(d.end, year) * 86400 + d.endTimeSeconds - d.offsetSeconds) * 1000);
  if (startMs <= endMs) out.push(startMs, d.offsetSeconds, endMs, tz.standardOffsetSeconds);
  else out.push(endMs, tz.standardOffsetSeconds, startMs, d.offsetSeconds);
}

/**
 * Offset changes of a POSIX rule within [startMs, endMs): fills `at` (epoch ms) and `after` (offset seconds) and
 * returns the offset in force just before `startMs`. Events that do not change the offset (for example the
 * year-round daylight time of RFC 8536 section 3.3.1, `EST5EDT,0/0,J365/25`) are dropped.
 * @internal
 */
export function posixTransitions(tz: PosixTz, startMs: number, endMs: number, at: number[], after: number[]): number {
  if (!tz.daylight) return tz.standardOffsetSeconds;
  const y0 = yearOfDayNumberUnchecked(Math.floor(startMs / 86_400_000)) - 1;
  const y1 = yearOfDayNumberUnchecked(Math.floor((endMs - 1) / 86_400_000)) + 1;
  const prev: number[] = [];
  eventsOfYear(tz, y0 - 1, prev);
  let state = prev.length > 0 ? prev[prev.length - 1]! : tz.standardOffsetSeconds;
  const ev: number[] = [];
  for (let y = y0; y <= y1; y++) eventsOfYear(tz, y, ev);
  // Events are ordered within a year; across years a wide rule (hours up to 167) may reorder them: sort stably.
  const order = Array.from({ length: ev.length / 2 }, (_, k) => k);
  order.sort((a, b) => ev[2 * a]! - ev[2 * b]! || a - b);
  let k = 0;
  while (k < order.length && ev[2 * order[k]!]! < startMs) {
    state = ev[2 * order[k]! + 1]!;
    k++;
  }
  const before = state;
  while (k < order.length) {
    const t = ev[2 * order[k]!]!;
    if (t >= endMs) break;
    let s = state;
    // Several events at one instant: the last one wins.
    while (k < order.length && ev[2 * order[k]!] === t) {
      s = ev[2 * order[k]! + 1]!;
      k++;
    }
    if (s !== state) {
      at.push(t);
      after.push(s);
      state = s;
    }
  }
  return before;
}

/** Offset in force at `epochMs` under a POSIX rule. @internal */
export function posixOffsetAt(tz: PosixTz, epochMs: number): number {
  if (!tz.daylight) return tz.standardOffsetSeconds;
  const at: number[] = [];
  const after: number[] = [];
  const before = posixTransitions(tz, epochMs, epochMs + 1, at, after);
  return after.length > 0 ? after[after.length - 1]! : before;
}

/**
 * A small character scanner shared by the instant layer's parsers. It reads ASCII digits and fixed characters by
 * char code (no regular expressions, no backtracking), so every parse is one linear pass, and every failure
 * becomes a {@link KalendsSyntaxError} that quotes the whole input and names the position.
 *
 * @internal
 * @module
 */
import { KalendsRangeError, KalendsSyntaxError, describeValue, type ErrorCode } from '../errors.js';
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { dayCountOfMonthUnchecked } from '../civil/gregorian.js';

/** @internal A cursor over one input string, with the name of the function reading it (for messages). */
export class Scanner {
  // Fields are assigned in the constructor, not declared as class fields: define-semantics fields made every
  // parse measurably slower (one Scanner per parsed text).
  declare pos: number;
  declare readonly text: string;
  declare readonly fn: string;
  declare readonly expected: string;
  declare readonly yearRange: 'range' | 'syntax';
  declare readonly yearSlack: number;
  /**
   * @param fn the function or parameter reading the text, for messages.
   * @param expected what the text should be ("an RFC 3339 date-time with an offset"), for messages.
   * @param yearRange how a year outside the supported range is reported: `'range'` (a KalendsRangeError, as the
   *   date and instant parsers do, like Temporal) or `'syntax'` (a KalendsSyntaxError with code `out-of-range`
   *   and the position, as the period label parsers do); and `yearSlack` years accepted past each end (the first
   *   and last periods of a unit may start or end outside the supported years).
   */
  constructor(text: string, fn: string, expected: string, yearRange: 'range' | 'syntax' = 'range', yearSlack = 0) {
    this.pos = 0;
    this.text = text;
    this.fn = fn;
    this.expected = expected;
    this.yearRange = yearRange;
    this.yearSlack = yearSlack;
  }

  get done(): boolean {
    return this.pos >= this.text.length;
  }

  peek(offset = 0): number {
    const i = this.pos + offset;
    return i < this.text.length ? this.text.charCodeAt(i) : -1;
  }

  /** Throws a syntax error: `<fn>: "<input>" is not <expected>: <detail> at position <p>`. */
  fail(detail: string, position = this.pos, code: ErrorCode = 'malformed'): never {
    throw syntaxError(this.fn, this.text, this.expected, detail, position, code);
  }

  /** Describes the character at the cursor for an error message. */
  here(): string {
    return this.done ? 'the end of the text' : JSON.stringify(this.text[this.pos]);
  }

  expectChar(code: number, what: string): void {
    if (this.peek() !== code) this.fail(`expected ${what} but found ${this.here()}`);
    this.pos++;
  }

  /** Reads exactly `n` ASCII digits and returns their value. */
  digits(n: number, field: string): number {
    let v = 0;
    for (let k = 0; k < n; k++) {
      const c = this.peek();
      if (c < 48 || c > 57) {
        this.fail(`${field} needs ${n} digits but found ${this.here()}`);
      }
      v = v * 10 + (c - 48);
      this.pos++;
    }
    return v;
  }

  /** Number of consecutive ASCII digits starting at the cursor. */
  countDigits(): number {
    let k = 0;
    for (;;) {
      const c = this.peek(k);
      if (c < 48 || c > 57) return k;
      k++;
    }
  }

  /** Reads a two-digit field and checks it lies in [min, max]. */
  field2(field: string, min: number, max: number, hint = ''): number {
    // Its own body, not a call of field(): the parsers read five of these per instant, and the fixed width
    // keeps the digit loop short (measured: a few per cent of a parse).
    const start = this.pos;
    const v = this.digits(2, field);
    if (v < min || v > max) {
      this.fail(`${field} ${this.text.slice(start, start + 2)} is out of range; expected ${pad2(min)} to ${pad2(max)}${hint}`, start, 'out-of-range');
    }
    return v;
  }

  /** Reads a field of exactly `width` digits and checks it lies in [min, max] (written with `width` digits). */
  field(width: number, field: string, min: number, max: number, hint = ''): number {
    const start = this.pos;
    const v = this.digits(width, field);
    if (v < min || v > max) {
      this.fail(
        `${field} ${this.text.slice(start, start + width)} is out of range; expected ${String(min).padStart(width, '0')} to ${String(max).padStart(width, '0')}${hint}`,
        start,
        'out-of-range',
      );
    }
    return v;
  }

  /**
   * Reads a year: four digits (0000..9999), or a sign and six digits (ISO 8601 expanded representation, as in
   * RFC 9557 and Temporal). `-000000` is invalid. Years outside the supported range throw a range error.
   */
  year(): number {
    const start = this.pos;
    const c = this.peek();
    let year: number;
    const signed = c === 43 /* + */ || c === 45; /* - */
    if (signed) this.pos++;
    const n = this.countDigits();
    if (n !== (signed ? 6 : 4)) {
      this.fail(`a year is 4 digits, or a sign and 6 digits (e.g. +012025), found ${n === 0 ? this.here() : `${n} digit${n === 1 ? '' : 's'}`}`, start);
    }
    year = signed ? this.digits(6, 'the year') : this.digits(4, 'the year');
    if (signed) {
      if (c === 45 && year === 0) this.fail('-000000 is not a valid year; write year zero as 0000 or +000000', start);
      if (c === 45) year = -year;
    }
    if (year < MIN_YEAR - this.yearSlack || year > MAX_YEAR + this.yearSlack) {
      if (this.yearRange === 'syntax') this.fail(`year ${year} is outside the supported years ${MIN_YEAR} to ${MAX_YEAR}`, start, 'out-of-range');
      throw new KalendsRangeError(
        `${this.fn}: ${describeValue(this.text)} is outside the supported range: year ${year} at position ${start}; expected ${MIN_YEAR} to ${MAX_YEAR}`,
        { code: 'out-of-range', received: this.text },
      );
    }
    return year;
  }

  /**
   * Reads an optional fraction: `.` or `,` then 1..9 digits. Returns nanoseconds (0..999,999,999), or -1 when
   * there is no fraction.
   */
  fractionNs(field: string): number {
    const c = this.peek();
    if (c !== 46 /* . */ && c !== 44 /* , */) return -1;
    const start = this.pos;
    this.pos++;
    const n = this.countDigits();
    if (n === 0) this.fail(`a decimal sign must be followed by digits (${field}), found ${this.here()}`, start);
    if (n > 9) this.fail(`${field} has ${n} fraction digits; at most 9 (nanoseconds) are accepted`, start, 'out-of-range');
    let v = 0;
    for (let k = 0; k < 9; k++) v = v * 10 + (k < n ? this.text.charCodeAt(this.pos + k) - 48 : 0);
    this.pos += n;
    return v;
  }
}

/** @internal Builds the syntax error every parser in this layer throws. */
export function syntaxError(fn: string, text: string, expected: string, detail: string, position: number, code: ErrorCode = 'malformed'): KalendsSyntaxError {
  return new KalendsSyntaxError(`${fn}: ${describeValue(text)} is not ${expected}: ${detail} (at position ${position})`, {
    code,
    received: text,
    position,
  });
}

/** @internal Two-digit zero padding. */
export function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** @internal Year as ISO 8601 / RFC 9557 text: 4 digits for 0..9999, otherwise a sign and 6 digits. */
export function formatYear(year: number): string {
  if (year >= 0 && year <= 9999) return String(year).padStart(4, '0');
  return `${year < 0 ? '-' : '+'}${String(Math.abs(year)).padStart(6, '0')}`;
}

/**
 * @internal Reads an ISO 8601 calendar date `YYYY-MM-DD` (with an expanded year if signed) at the cursor; an
 * impossible month or day is a syntax error with code `out-of-range` at its position.
 */
export function readCalendarDate(sc: Scanner): { year: number; month: number; day: number } {
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

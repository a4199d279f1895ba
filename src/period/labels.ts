/**
 * The pieces of the period label grammar shared by every unit: years (four digits, or a sign and six digits
 * for years outside 0000..9999, as the expanded representation of ISO 8601-1:2019 4.3.2 and RFC 9557 use) and
 * calendar dates (YYYY-MM-DD, ISO 8601 extended format).
 *
 * @module
 */
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { KalendsRangeError, KalendsSyntaxError, describeValue } from '../errors.js';
import { dayNumberFromYmdUnchecked, dayCountOfMonthUnchecked, packedYmdUnchecked } from '../civil/gregorian.js';

/** @internal The year part of a label: `2025`, `0042`, `+012025`, `-000044`. */
export function formatYearLabel(year: number): string {
  if (year >= 0 && year <= 9999) return String(year).padStart(4, '0');
  return `${year < 0 ? '-' : '+'}${String(Math.abs(year)).padStart(6, '0')}`;
}

/** @internal Two-digit zero-padded number. */
export function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

/** @internal YYYY-MM-DD of a day number (any integer; years beyond the civil range still format). */
export function formatDayLabel(dayNumber: number): string {
  const p = packedYmdUnchecked(dayNumber);
  const year = Math.floor(p / 512) + MIN_YEAR;
  return `${formatYearLabel(year)}-${pad2((p >> 5) & 15)}-${pad2(p & 31)}`;
}

/** @internal Source text of the year grammar, for building label patterns. */
export const YEAR_PATTERN = '(\\d{4}|[+-]\\d{6})';

/** @internal Reads a year matched by YEAR_PATTERN; rejects "-000000" (RFC 9557 / ISO 8601 forbid minus zero). */
export function yearFromMatch(text: string, yearText: string, name: string): number {
  if (yearText === '-000000') {
    throw new KalendsSyntaxError(`${name}: year -000000 is not allowed (write 0000 for year zero), got ${describeValue(text)}`, {
      code: 'malformed',
      received: text,
    });
  }
  return Number(yearText);
}

/** @internal Throws a KalendsRangeError quoting the label when its year is outside the supported years. */
export function requireLabelYear(text: string, year: number, name: string, slack = 1): void {
  if (year < MIN_YEAR - slack || year > MAX_YEAR + slack) {
    throw new KalendsRangeError(
      `${name}: year ${year} in ${describeValue(text)} is outside the supported years ${MIN_YEAR}..${MAX_YEAR}`,
      { code: 'out-of-range', received: text },
    );
  }
}

const DAY_RE = new RegExp(`^${YEAR_PATTERN}-(\\d{2})-(\\d{2})$`);

/**
 * @internal Parses YYYY-MM-DD (or the expanded ±YYYYYY-MM-DD) to a day number. Grammar faults give a
 * KalendsSyntaxError, impossible dates a KalendsRangeError; both quote the text.
 */
export function parseDayLabel(text: string, name = 'label', yearSlack = 0): number {
  const m = DAY_RE.exec(text);
  if (!m) {
    throw new KalendsSyntaxError(`${name}: expected a calendar date YYYY-MM-DD such as "2025-03-14", got ${describeValue(text)}`, {
      code: 'malformed',
      received: text,
      position: firstMismatch(text, '0000-00-00'),
    });
  }
  const year = yearFromMatch(text, m[1]!, name);
  const month = Number(m[2]);
  const day = Number(m[3]);
  requireLabelYear(text, year, name, yearSlack);
  if (month < 1 || month > 12) {
    throw new KalendsRangeError(`${name}: month ${month} in ${describeValue(text)} is not 01..12`, { code: 'out-of-range', received: text });
  }
  const dim = dayCountOfMonthUnchecked(year, month);
  if (day < 1 || day > dim) {
    throw new KalendsRangeError(`${name}: day ${day} in ${describeValue(text)} is not 01..${dim} for that month`, {
      code: 'out-of-range',
      received: text,
    });
  }
  return dayNumberFromYmdUnchecked(year, month, day);
}

/** @internal Index of the first character of `text` that does not fit the shape (digits as 0, rest literal). */
export function firstMismatch(text: string, shape: string): number {
  let i = 0;
  // Skip an expanded-year sign and its extra digits.
  let t = text;
  if (t.startsWith('+') || t.startsWith('-')) {
    t = t.slice(3);
    i = 3;
  }
  for (let k = 0; k < Math.min(t.length, shape.length); k++) {
    const c = t[k]!;
    const s = shape[k]!;
    const ok = s === '0' ? c >= '0' && c <= '9' : c === s;
    if (!ok) return i + k;
  }
  return i + Math.min(t.length, shape.length);
}

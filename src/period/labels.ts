/**
 * The pieces of the period label grammar shared by every unit, on the instant layer's text readers and writers
 * (the instant layer owns all date and year text): years (four digits, or a sign and six digits for years outside
 * 0000..9999, as the expanded representation of ISO 8601-1:2019 4.3.2 and RFC 9557 use) and calendar dates
 * (YYYY-MM-DD, ISO 8601 extended format).
 *
 * Every fault of a label is a KalendsSyntaxError (code `malformed`, or `out-of-range` for a field out of range,
 * such as month 13 or week 53 of a 52-week year) that starts with `label`, quotes the text, says what was
 * expected and gives the position (docs/design.md, "Errors").
 *
 * @module
 */
import { Scanner, formatYear, pad2, readCalendarDate } from '../instant/scan.js';
import { formatDayNumberUnchecked } from '../instant/format.js';
import { dayNumberFromYmdUnchecked } from '../civil/gregorian.js';

export { formatYear as formatYearLabel, pad2, formatDayNumberUnchecked as formatDayLabel };

/**
 * @internal A scanner over a label (the parameter `text` of parsePeriod and of a unit's parseOrdinal): `form` says what the label should be (`an ISO 8601 month YYYY-MM, e.g.
 * "2025-03"`); years may reach `yearSlack` years past each end of the supported range (the first and last periods
 * of a unit may start or end outside it).
 */
export function labelScanner(text: string, form: string, yearSlack = 1): Scanner {
  return new Scanner(text, 'text', form, 'syntax', yearSlack);
}

/** @internal Reads the exact characters `literal` at the cursor. */
export function readLiteral(sc: Scanner, literal: string): void {
  for (let i = 0; i < literal.length; i++) sc.expectChar(literal.charCodeAt(i), JSON.stringify(literal));
}

/** @internal Reads `digits` digits naming `what`, which must lie in [min, max] (else `out-of-range`). */
export function readIndex(sc: Scanner, digits: number, what: string, min: number, max: number, why = ''): number {
  const start = sc.pos;
  const v = sc.digits(digits, what);
  if (v < min || v > max) {
    const show = (n: number) => String(n).padStart(digits, '0');
    sc.fail(`${what} ${sc.text.slice(start, start + digits)} is out of range; expected ${show(min)} to ${show(max)}${why}`, start, 'out-of-range');
  }
  return v;
}

/** @internal Fails unless the whole label has been read. */
export function endLabel(sc: Scanner): void {
  if (!sc.done) sc.fail(`unexpected ${sc.here()} after the label`);
}

/** @internal Reads a calendar date `YYYY-MM-DD` at the cursor and returns its day number. */
export function readDayLabel(sc: Scanner): number {
  const { year, month, day } = readCalendarDate(sc);
  return dayNumberFromYmdUnchecked(year, month, day);
}

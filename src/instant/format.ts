/**
 * Writing RFC 3339 / RFC 9557 and ISO 8601 text: calendar, week and ordinal dates, offsets, instants and local
 * date-times; and the internal writers the zone, period and business layers use for dates, years and offsets
 * (this layer owns all date, offset and year text). Text carries whole milliseconds: a fractional instant or wall
 * time is written as the millisecond that holds it (docs/design.md, "Input rules").
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_OFFSET_SECONDS, MIN_DAY_NUMBER, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { dayOfYearOfDayNumber, dayOfPacked, monthOfPacked, packedYmdUnchecked, requireDayNumber, yearOfDayNumberUnchecked, yearOfPacked } from '../civil/gregorian.js';
import { isoWeekDateFromDayNumber } from '../civil/isoweek.js';
import { optionOf, readOptions, requireBoolean, requireEpochMs } from '../diagnostics/index.js';
import { DATE_TIME_GRAMMAR, type Fields, MS_PER_HOUR, MS_PER_MINUTE, type SuffixTag, readAnnotations } from './grammar.js';
import { Scanner, formatYear, pad2 } from './scan.js';

/** Smallest wall time: the first millisecond of the first supported day. */
const MIN_WALL_MS = MIN_DAY_NUMBER * MS_PER_DAY;
/** Largest wall time: the last millisecond of the last supported day (below the next day's first). */
const MAX_WALL_MS = MAX_DAY_NUMBER * MS_PER_DAY + MS_PER_DAY - 1;

/**
 * @internal A wall time (ms since 1970-01-01T00:00 on a local clock): a number within [min, max]; fractions of a
 * millisecond are allowed (docs/design.md, "Input rules"). Text gets the name of the parser to call.
 */
export function requireWallMs(name: string, value: unknown, min = MIN_WALL_MS, max = MAX_WALL_MS): number {
  if (typeof value !== 'number') {
    const hint = typeof value === 'string' ? '; parse text first with parsePlainDateTime(text), or coerce with toWallMs(value)' : typeof value === 'object' && value !== null ? '; coerce it with toWallMs(value)' : '';
    throw new KalendsTypeError(`${name}: expected wall-clock milliseconds (a number), got ${describeValue(value)}${hint}`, { code: 'invalid-type', received: value });
  }
  if (!(value >= min && value <= max)) {
    throw new KalendsRangeError(`${name}: expected wall-clock milliseconds from ${min} to ${max}, got ${describeValue(value)}`, { code: 'out-of-range', received: value });
  }
  return value;
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

/** @internal `YYYY-MM-DD` of any day number (years past the supported range still format, expanded). */
export function formatDayNumberUnchecked(dayNumber: number): string {
  const p = packedYmdUnchecked(dayNumber);
  return `${formatYear(yearOfPacked(p))}-${pad2(monthOfPacked(p))}-${pad2(dayOfPacked(p))}`;
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
  const year = yearOfDayNumberUnchecked(dayNumber);
  return `${formatYear(year)}-${String(doy).padStart(3, '0')}`;
}

/** How many fraction digits of the second to write: 0..9, or `'auto'` (as few as needed, at most 3). */
export type FractionDigits = 'auto' | 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9;

function requireFractionDigits(v: unknown): FractionDigits {
  if (v === undefined || v === 'auto') return 'auto';
  if (typeof v === 'number' && Number.isInteger(v) && v >= 0 && v <= 9) return v as FractionDigits;
  const expected = `options.fractionDigits: expected "auto" or an integer from 0 to 9, got ${describeValue(v)}`;
  if (typeof v === 'string') {
    throw new KalendsRangeError(`${expected}${/^\d$/.test(v) ? ` (pass the number ${v}, not a string)` : ''}`, { code: 'unknown-name', received: v, path: 'fractionDigits' });
  }
  if (typeof v !== 'number') throw new KalendsTypeError(expected, { code: 'invalid-type', received: v, path: 'fractionDigits' });
  throw new KalendsRangeError(expected, {
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

/** @internal `YYYY-MM-DDTHH:MM:SS[.fff]` of a wall time (floored to its millisecond), for text and messages. */
export function formatWallUnchecked(wallMs: number, digits: FractionDigits = 'auto'): string {
  const whole = Math.floor(wallMs);
  const dn = Math.floor(whole / MS_PER_DAY);
  return `${formatDayNumberUnchecked(dn)}T${formatTimeOfDay(whole - dn * MS_PER_DAY, digits)}`;
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
  return formatOffsetUnchecked(offsetSeconds);
}

/** @internal `±HH:MM`, or `±HH:MM:SS` when the offset has seconds, of an integer offset below a day. */
export function formatOffsetUnchecked(offsetSeconds: number): string {
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
 * `offsetSeconds`; the instant itself does not change. A fractional instant is written as the millisecond that
 * holds it (`-0.5` as `1969-12-31T23:59:59.999Z`).
 *
 * @example
 * ```ts
 * formatInstant(482196050520);                           // '1985-04-12T23:20:50.52Z'
 * formatInstant(851042397000, { offsetSeconds: -28800, zoneId: 'America/Los_Angeles' });
 * // '1996-12-19T16:39:57-08:00[America/Los_Angeles]'
 * ```
 */
export function formatInstant(epochMs: number, options?: FormatInstantOptions): string {
  const t = Math.floor(requireEpochMs('epochMs', epochMs));
  const o = readOptions('options', options, FORMAT_INSTANT_KEYS);
  const digits = requireFractionDigits(optionOf(o, 'fractionDigits'));
  const off = optionOf(o, 'offsetSeconds');
  let text: string;
  if (off === undefined) text = `${formatWallUnchecked(t, digits)}Z`;
  else {
    const seconds = requireInteger('options.offsetSeconds', off, -MAX_OFFSET_SECONDS, MAX_OFFSET_SECONDS);
    text = `${formatWallUnchecked(t + seconds * 1000, digits)}${formatOffsetUnchecked(seconds)}`;
  }
  return text + formatAnnotations('formatInstant', o);
}

const FORMAT_INSTANT_KEYS = ['offsetSeconds', 'fractionDigits', 'zoneId', 'zoneCritical', 'annotations'] as const;

function formatAnnotations(fn: string, o: Readonly<Record<string, unknown>>): string {
  let out = '';
  const zoneId = optionOf(o, 'zoneId');
  const critical = requireBoolean('options.zoneCritical', optionOf(o, 'zoneCritical'), false);
  if (zoneId !== undefined) {
    if (typeof zoneId !== 'string') {
      throw new KalendsTypeError(`options.zoneId: expected a zone id string such as "Europe/Dublin", got ${describeValue(zoneId)}`, { code: 'invalid-type', received: zoneId });
    }
    const candidate = `[${critical ? '!' : ''}${zoneId}]`;
    checkAnnotationText(fn, 'options.zoneId', zoneId, candidate, true);
    out += candidate;
  } else if (critical) {
    throw new KalendsTypeError('options.zoneCritical: true needs options.zoneId, the zone annotation it marks critical', { code: 'invalid-type', received: true });
  }
  const annotations = optionOf(o, 'annotations');
  if (annotations === undefined) return out;
  if (!Array.isArray(annotations)) {
    throw new KalendsTypeError(`options.annotations: expected an array of suffix tags { key, value, critical }, got ${describeValue(annotations)}`, { code: 'invalid-type', received: annotations });
  }
  for (const [i, tag] of (annotations as unknown[]).entries()) {
    const t = readOptions(`options.annotations[${i}]`, tag, ['key', 'value', 'critical']) as Partial<SuffixTag>;
    if (tag === undefined || typeof t.key !== 'string' || typeof t.value !== 'string') {
      throw new KalendsTypeError(`options.annotations[${i}]: expected a suffix tag { key, value, critical } with string key and value, got ${describeValue(tag)}`, { code: 'invalid-type', received: tag });
    }
    const isCritical = requireBoolean(`options.annotations[${i}].critical`, t.critical, false);
    const candidate = `[${isCritical ? '!' : ''}${t.key}=${t.value}]`;
    checkAnnotationText(fn, `options.annotations[${i}]`, tag, candidate, false);
    out += candidate;
  }
  return out;
}

function checkAnnotationText(fn: string, path: string, value: unknown, candidate: string, zone: boolean): void {
  // Re-use the parser's reader of annotations so that the formatter can never write what the parser would refuse.
  let ok = false;
  try {
    const sc: Scanner = new Scanner(candidate, fn, DATE_TIME_GRAMMAR);
    const f = { zoneId: undefined, zoneCritical: false, annotations: [] } as unknown as Fields;
    readAnnotations(sc, f, zone ? [] : [(value as SuffixTag).key]);
    ok = sc.done && (zone ? f.zoneId !== undefined : f.annotations.length === 1);
  } catch {
    // refused by the grammar: reported below
  }
  if (!ok) {
    throw new KalendsRangeError(
      `${path}: ${describeValue(zone ? value : candidate)} is not a valid RFC 9557 ${zone ? 'zone annotation (an IANA name such as Europe/Dublin, or ±HH:MM)' : 'suffix tag (a lower-case key, "=", alphanumeric values joined by "-")'}`,
      { code: 'out-of-range', received: value, path },
    );
  }
}

/**
 * Formats wall milliseconds as a local (plain) ISO 8601 date-time, `YYYY-MM-DDTHH:MM:SS[.fff]`, without offset
 * (a fractional wall time as the millisecond that holds it).
 *
 * @example
 * ```ts
 * formatPlainDateTime(86401000); // '1970-01-02T00:00:01'
 * ```
 */
export function formatPlainDateTime(wallMs: number, options?: { readonly fractionDigits?: FractionDigits }): string {
  requireWallMs('wallMs', wallMs);
  const o = readOptions('options', options, ['fractionDigits']);
  return formatWallUnchecked(wallMs, requireFractionDigits(optionOf(o, 'fractionDigits')));
}

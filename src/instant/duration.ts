/**
 * ISO 8601 durations (ISO 8601-1:2019, 5.5.2: `PnYnMnDTnHnMnS` and `PnW`), kept as calendar parts (years,
 * months, weeks, days: their length depends on where they are applied) and exact parts (hours, minutes,
 * seconds, milliseconds: fixed lengths), and the rule for adding them to local dates and date-times.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_DURATION_CALENDAR_FIELD, MAX_YEAR, MIN_DAY_NUMBER, MIN_YEAR, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked, dayOfPacked, monthIndexOfPacked, packedYmdUnchecked, requireDayNumber } from '../civil/gregorian.js';
import { monthOfMonthIndex, yearOfMonthIndex } from '../civil/names.js';
import { didYouMean, optionOf, readOptions, requireEnum } from '../diagnostics/index.js';
import { Scanner } from './scan.js';
import { formatDayNumberUnchecked, formatPlainDateTime, requireWallMs } from './format.js';

/**
 * A duration. Every field is an integer and all non-zero fields share one sign (`sign`). Calendar parts
 * (`years`, `months`, `weeks`, `days`) and exact parts (`hours`, `minutes`, `seconds`, `milliseconds`) are
 * never converted into each other: `P1D` is not `PT24H`, and `PT36H` stays 36 hours.
 */
export interface Duration {
  /** -1, 0 (every field zero) or 1: the sign every non-zero field shares. */
  readonly sign: -1 | 0 | 1;
  /** Calendar years. */
  readonly years: number;
  /** Calendar months. */
  readonly months: number;
  /** Weeks. */
  readonly weeks: number;
  /** Calendar days (not 24-hour periods). */
  readonly days: number;
  /** Hours. */
  readonly hours: number;
  /** Minutes. */
  readonly minutes: number;
  /** Seconds. */
  readonly seconds: number;
  /** Milliseconds. */
  readonly milliseconds: number;
}

/** The fields accepted by {@link durationFromFields}; omitted fields are zero. */
export type DurationFields = Partial<Omit<Duration, 'sign'>>;

const FIELD_NAMES = ['years', 'months', 'weeks', 'days', 'hours', 'minutes', 'seconds', 'milliseconds'] as const;
type FieldName = (typeof FIELD_NAMES)[number];

const MS_PER_HOUR = 3_600_000;
const MS_PER_MINUTE = 60_000;

/**
 * Builds a validated, frozen {@link Duration} from fields. Each field must be an integer; all non-zero fields
 * must share one sign; calendar fields are limited to magnitudes below 2^32; the exact parts together
 * (hours, minutes, seconds, milliseconds in ms) must be a safe integer.
 *
 * @example
 * ```ts
 * durationFromFields({ days: 30 });          // { sign: 1, days: 30, ... }
 * durationFromFields({ months: -1, days: -2 }).sign; // -1
 * ```
 */
export function durationFromFields(fields: DurationFields): Duration {
  // Any object, not only a plain one: a Temporal.Duration (from any implementation) is read by its getters.
  if (typeof fields !== 'object' || fields === null || Array.isArray(fields)) {
    throw new KalendsTypeError(`fields: expected an object of duration fields (${FIELD_NAMES.join(', ')}), got ${describeValue(fields)}`, {
      code: 'invalid-type',
      received: fields,
    });
  }
  for (const key of Object.keys(fields)) {
    if (!(FIELD_NAMES as readonly string[]).includes(key) && key !== 'sign') {
      throw new KalendsTypeError(`fields.${key}: unknown duration field${didYouMean(key, FIELD_NAMES)}; valid fields are ${FIELD_NAMES.join(', ')}`, {
        code: 'unknown-name',
        received: key,
        path: `fields.${key}`,
      });
    }
  }
  // Fields are read as properties, so that a Temporal.Duration (whose fields are getters) is read too.
  if (FIELD_NAMES.every((name) => (fields as Record<string, unknown>)[name] === undefined)) {
    // Temporal.Duration.from({}) throws a TypeError too: a duration names at least one field (PT0S is { seconds: 0 }).
    throw new KalendsTypeError(`fields: expected at least one of ${FIELD_NAMES.join(', ')}, got ${describeValue(fields)} with none; write { seconds: 0 } for a zero duration`, {
      code: 'invalid-type',
      received: fields,
    });
  }
  const out: Record<FieldName, number> = { years: 0, months: 0, weeks: 0, days: 0, hours: 0, minutes: 0, seconds: 0, milliseconds: 0 };
  let sign: -1 | 0 | 1 = 0;
  for (const name of FIELD_NAMES) {
    const v = (fields as Record<string, unknown>)[name];
    if (v === undefined) continue;
    const limit = name === 'years' || name === 'months' || name === 'weeks' || name === 'days' ? MAX_DURATION_CALENDAR_FIELD : Number.MAX_SAFE_INTEGER;
    requireInteger(`fields.${name}`, v, -limit, limit);
    const n = (v as number) === 0 ? 0 : (v as number); // normalise -0
    if (n !== 0) {
      const s = n < 0 ? -1 : 1;
      if (sign !== 0 && s !== sign) {
        throw new KalendsRangeError(`fields.${name}: ${n} has the opposite sign of the other fields; all non-zero fields of a duration share one sign`, {
          code: 'out-of-range',
          received: fields,
          path: name,
        });
      }
      sign = s;
    }
    out[name] = n;
  }
  const exact = Math.abs(out.hours) * MS_PER_HOUR + Math.abs(out.minutes) * MS_PER_MINUTE + Math.abs(out.seconds) * 1000 + Math.abs(out.milliseconds);
  if (!Number.isSafeInteger(exact)) {
    throw new KalendsRangeError(`fields: the exact parts (hours, minutes, seconds, milliseconds) total ${exact} ms, more than ${Number.MAX_SAFE_INTEGER} ms`, {
      code: 'out-of-range',
      received: fields,
    });
  }
  return Object.freeze({ sign, ...out });
}

/**
 * The duration with every field negated.
 *
 * @example
 * ```ts
 * formatDuration(negateDuration(parseDuration('P1M2D'))); // '-P1M2D'
 * ```
 */
export function negateDuration(duration: Duration): Duration {
  const d = requireDuration('negateDuration', duration);
  const out: Record<string, number> = {};
  for (const name of FIELD_NAMES) out[name] = d[name] === 0 ? 0 : -d[name];
  return durationFromFields(out);
}

/**
 * Total of the exact parts (hours, minutes, seconds, milliseconds) in ms, signed; calendar parts are ignored.
 *
 * @example
 * ```ts
 * exactMsOfDuration(parseDuration('PT1H30M')); // 5400000
 * exactMsOfDuration(parseDuration('-P1DT2S')); // -2000 (the day is a calendar part)
 * ```
 */
export function exactMsOfDuration(duration: Duration): number {
  const d = requireDuration('exactMsOfDuration', duration);
  return d.hours * MS_PER_HOUR + d.minutes * MS_PER_MINUTE + d.seconds * 1000 + d.milliseconds;
}

function requireDuration(fn: string, d: unknown): Duration {
  if (typeof d !== 'object' || d === null || typeof (d as Duration).sign !== 'number' || typeof (d as Duration).milliseconds !== 'number') {
    throw new KalendsTypeError(`duration: expected a Duration (from parseDuration or durationFromFields), got ${describeValue(d)}${typeof d === 'string' ? '; parse text first with parseDuration(text)' : ''}`, {
      code: 'invalid-type',
      received: d,
    });
  }
  return d as Duration;
}

const DURATION_GRAMMAR = 'an ISO 8601 duration (e.g. P1Y2M10DT2H30M, P3W, -PT1.5S)';

/**
 * Parses an ISO 8601 duration: `[±]P[nY][nM][nW][nD][T[nH][nM][nS]]`. Rules (docs/instants.md):
 * designators are upper-case; at least one component; `T` must be followed by at least one time component;
 * weeks may be combined with other parts (ISO 8601-2 and Temporal allow it; ISO 8601-1 has `PnW` alone);
 * a leading `-` (or `+`) applies to every part (ISO 8601-2, as in Temporal); a decimal fraction (`.` or `,`,
 * up to 9 digits) is accepted on the last component only, and only on hours, minutes or seconds, whose length
 * is exact. A fraction is spread into the smaller exact fields (`PT1.5H` is 1 hour 30 minutes) and digits finer
 * than a millisecond are truncated toward zero.
 *
 * @example
 * ```ts
 * parseDuration('P1Y2M10DT2H30M').months; // 2
 * parseDuration('PT1.5H').minutes;          // 30
 * parseDuration('-P3W').weeks;              // -3
 * ```
 */
export function parseDuration(text: string): Duration {
  return readDuration(text, 'text');
}

/** @internal {@link parseDuration}, with the name of the parameter that held the text (for messages). */
export function readDuration(input: unknown, name: string): Duration {
  if (typeof input !== 'string') {
    throw new KalendsTypeError(`${name}: expected an ISO 8601 duration as a string, got ${describeValue(input)}`, {
      code: 'invalid-type',
      received: input,
    });
  }
  const text = input;
  const sc: Scanner = new Scanner(text, name, DURATION_GRAMMAR);
  let sign = 1;
  const c0 = sc.peek();
  if (c0 === 45 || c0 === 43) {
    sign = c0 === 45 ? -1 : 1;
    sc.pos++;
  }
  if (sc.peek() !== 80 /* P */) {
    sc.fail(sc.peek() === 112 ? 'designators are upper-case: write "P", not "p"' : `a duration starts with "P", found ${sc.here()}`);
  }
  sc.pos++;
  const f: Record<FieldName, number> = { years: 0, months: 0, weeks: 0, days: 0, hours: 0, minutes: 0, seconds: 0, milliseconds: 0 };
  const dateOrder: Record<number, FieldName> = { 89: 'years', 77: 'months', 87: 'weeks', 68: 'days' };
  const timeOrder: Record<number, FieldName> = { 72: 'hours', 77: 'minutes', 83: 'seconds' };
  const dateRank = ['years', 'months', 'weeks', 'days'];
  const timeRank = ['hours', 'minutes', 'seconds'];
  let inTime = false;
  let lastRank = -1;
  let components = 0;
  let timeComponents = 0;
  let fractionAt = -1;
  while (!sc.done) {
    if (sc.peek() === 84 /* T */) {
      if (inTime) sc.fail('"T" appears twice');
      if (fractionAt >= 0) sc.fail('a fraction is allowed only on the last component', fractionAt);
      inTime = true;
      lastRank = -1;
      sc.pos++;
      continue;
    }
    const start = sc.pos;
    const n = sc.countDigits();
    if (n === 0) {
      const c = sc.peek();
      sc.fail(c >= 97 && c <= 122 ? 'designators are upper-case (Y, M, W, D, T, H, M, S)' : `expected a number, found ${sc.here()}`);
    }
    if (fractionAt >= 0) sc.fail('a fraction is allowed only on the last component', fractionAt);
    if (n > 16) sc.fail(`a component has ${n} digits; at most 16 are accepted`, start, 'out-of-range');
    const whole = Number(text.slice(start, start + n));
    sc.pos += n;
    const fracPos = sc.pos;
    const fracNs = sc.fractionNs('the component');
    const d = sc.peek();
    const name = inTime ? timeOrder[d] : dateOrder[d];
    if (name === undefined) {
      if (d === 83 || d === 72) sc.fail(`${String.fromCharCode(d)} (${d === 83 ? 'seconds' : 'hours'}) must come after "T"`);
      if (inTime && (d === 89 || d === 87 || d === 68)) sc.fail(`${String.fromCharCode(d)} must come before "T"`);
      sc.fail(d >= 97 && d <= 122 ? 'designators are upper-case (Y, M, W, D, H, M, S)' : `expected a designator (${inTime ? 'H, M or S' : 'Y, M, W or D'}) after the number, found ${sc.here()}`);
    }
    const rank = (inTime ? timeRank : dateRank).indexOf(name);
    if (rank <= lastRank) sc.fail(`${name} must come in the order ${inTime ? 'H, M, S' : 'Y, M, W, D'}, each at most once`);
    lastRank = rank;
    if (fracNs >= 0) {
      if (!inTime) sc.fail(`a fraction is not accepted on ${name}, whose length varies; only hours, minutes and seconds take a fraction`, fracPos);
      fractionAt = fracPos;
      const unitSeconds = name === 'hours' ? 3600 : name === 'minutes' ? 60 : 1;
      let rem = fracNs * unitSeconds; // nanoseconds, exact (< 3.6e12)
      if (name === 'hours') {
        f.minutes = Math.floor(rem / 6e10);
        rem -= f.minutes * 6e10;
      }
      if (name !== 'seconds') {
        f.seconds = Math.floor(rem / 1e9);
        rem -= f.seconds * 1e9;
      }
      f.milliseconds = Math.floor(rem / 1e6);
    }
    f[name] = whole;
    sc.pos++;
    components++;
    if (inTime) timeComponents++;
  }
  if (components === 0) sc.fail('a duration needs at least one component (e.g. PT0S)');
  if (inTime && timeComponents === 0) sc.fail('"T" must be followed by at least one of H, M, S', text.length);
  const signed: Record<string, number> = {};
  for (const name of FIELD_NAMES) signed[name] = f[name] === 0 ? 0 : sign * f[name];
  try {
    return durationFromFields(signed);
  } catch (e) {
    throw new KalendsRangeError(`${name}: ${describeValue(text)} is outside the supported range: ${(e as Error).message}`, {
      code: 'out-of-range',
      received: text,
    });
  }
}

/**
 * Formats a duration as ISO 8601 text: `P1Y2M3W4DT5H6M7.008S`, zero parts left out, milliseconds written as
 * a fraction of the second, a leading `-` for a negative duration, and `PT0S` for zero.
 *
 * @example
 * ```ts
 * formatDuration(durationFromFields({ days: 30 }));                   // 'P30D'
 * formatDuration(durationFromFields({ minutes: -1, milliseconds: -500 })); // '-PT1M0.5S'
 * ```
 */
export function formatDuration(duration: Duration): string {
  const d = requireDuration('formatDuration', duration);
  if (d.sign === 0) return 'PT0S';
  const a = (n: number) => Math.abs(n);
  let date = '';
  if (d.years) date += `${a(d.years)}Y`;
  if (d.months) date += `${a(d.months)}M`;
  if (d.weeks) date += `${a(d.weeks)}W`;
  if (d.days) date += `${a(d.days)}D`;
  let time = '';
  if (d.hours) time += `${a(d.hours)}H`;
  if (d.minutes) time += `${a(d.minutes)}M`;
  const totalMs = a(d.seconds) * 1000 + a(d.milliseconds);
  if (totalMs !== 0) {
    const s = Math.floor(totalMs / 1000);
    const ms = totalMs % 1000;
    time += ms === 0 ? `${s}S` : `${s}.${String(ms).padStart(3, '0').replace(/0+$/, '')}S`;
  }
  return `${d.sign < 0 ? '-' : ''}P${date}${time ? `T${time}` : ''}`;
}

/** Options of {@link shiftDayNumber} and {@link shiftWallMs}. */
export interface ShiftOptions {
  /**
   * What to do when years and months land on a day the month does not have (31 January + P1M):
   * `'constrain'` (default) clamps to the month's last day, as Temporal's `overflow: 'constrain'`;
   * `'reject'` throws a {@link KalendsRangeError}.
   */
  readonly overflow?: 'constrain' | 'reject';
}

function shiftDays(fn: string, dayNumber: number, d: Duration, overflow: 'constrain' | 'reject', shown: string): number {
  let dn = dayNumber;
  if (d.years !== 0 || d.months !== 0) {
    const p = packedYmdUnchecked(dn);
    let day = dayOfPacked(p);
    const total = monthIndexOfPacked(p) + d.years * 12 + d.months;
    const ny = yearOfMonthIndex(total);
    const nm = monthOfMonthIndex(total);
    if (ny < MIN_YEAR || ny > MAX_YEAR) {
      throw new KalendsRangeError(`duration: ${shown} + ${formatDuration(d)} reaches year ${ny}, outside the supported years ${MIN_YEAR} to ${MAX_YEAR}`, {
        code: 'out-of-range',
        received: d,
      });
    }
    const dim = dayCountOfMonthUnchecked(ny, nm);
    if (day > dim) {
      if (overflow === 'reject') {
        throw new KalendsRangeError(
          `duration: ${shown} + ${formatDuration(d)} asks for day ${day} of ${ny}-${String(nm).padStart(2, '0')}, which has ${dim} days, and options.overflow is "reject"; use "constrain" to clamp to the last day`,
          { code: 'out-of-range', received: d },
        );
      }
      day = dim;
    }
    dn = dayNumberFromYmdUnchecked(ny, nm, day);
  }
  dn += d.weeks * 7 + d.days;
  return dn;
}

const OVERFLOW: readonly ('constrain' | 'reject')[] = ['constrain', 'reject'];

function requireOverflow(options: ShiftOptions | undefined): 'constrain' | 'reject' {
  const o = readOptions('options', options, ['overflow']);
  return requireEnum('options.overflow', optionOf(o, 'overflow'), OVERFLOW, 'constrain');
}

/**
 * Adds a duration to a local date. The rule, in order: (1) years and months together, keeping the day of the
 * month and clamping it to the month's last day when the month is shorter (31 January + P1M = 28 or 29
 * February), or throwing with `overflow: 'reject'`; (2) weeks and days; (3) exact parts, which must come to a
 * whole number of days (PT48H is 2 days; PT5H is an error: use {@link shiftWallMs}). This is the order of
 * Temporal's `PlainDate.prototype.add`. Negative durations run the same steps backwards (31 March - P1M =
 * 28 or 29 February).
 *
 * @example
 * ```ts
 * formatPlainDate(shiftDayNumber(parsePlainDate('2025-01-31'), parseDuration('P1M'))); // '2025-02-28'
 * formatPlainDate(shiftDayNumber(parsePlainDate('2025-02-14'), parseDuration('P30D'))); // '2025-03-16'
 * ```
 */
export function shiftDayNumber(dayNumber: number, duration: Duration, options?: ShiftOptions): number {
  requireDayNumber(dayNumber);
  const d = requireDuration('shiftDayNumber', duration);
  const overflow = requireOverflow(options);
  const shown = formatDayNumberUnchecked(dayNumber);
  const exact = exactMsOfDuration(d);
  if (exact % MS_PER_DAY !== 0) {
    throw new KalendsRangeError(
      `duration: ${formatDuration(d)} has exact parts that are not a whole number of days, so it cannot move the date ${shown}; use shiftWallMs to move a date-time`,
      { code: 'out-of-range', received: duration },
    );
  }
  const dn = shiftDays('shiftDayNumber', dayNumber, d, overflow, shown) + exact / MS_PER_DAY;
  if (!(dn >= MIN_DAY_NUMBER && dn <= MAX_DAY_NUMBER)) {
    throw new KalendsRangeError(`duration: ${shown} + ${formatDuration(d)} falls outside the supported day numbers ${MIN_DAY_NUMBER} to ${MAX_DAY_NUMBER}`, {
      code: 'out-of-range',
      received: duration,
    });
  }
  return dn;
}

/**
 * Adds a duration to a local date-time (wall milliseconds): years and months first with the month-end rule of
 * {@link shiftDayNumber}, then weeks and days, then the exact parts as elapsed wall-clock time. This matches
 * Temporal's `PlainDateTime.prototype.add`. A local date-time has no zone, so there are no gaps or folds here:
 * to add to an instant in a zone, convert with the zone layer.
 *
 * @example
 * ```ts
 * formatPlainDateTime(shiftWallMs(parsePlainDateTime('2024-01-31T22:00'), parseDuration('P1MT3H'))); // '2024-03-01T01:00:00'
 * ```
 */
export function shiftWallMs(wallMs: number, duration: Duration, options?: ShiftOptions): number {
  requireWallMs('wallMs', wallMs);
  const d = requireDuration('shiftWallMs', duration);
  const overflow = requireOverflow(options);
  const dn = Math.floor(wallMs / MS_PER_DAY);
  const msOfDay = wallMs - dn * MS_PER_DAY;
  const shown = formatPlainDateTime(wallMs);
  const dn2 = shiftDays('shiftWallMs', dn, d, overflow, shown);
  const exact = exactMsOfDuration(d);
  const exactDays = Math.floor(exact / MS_PER_DAY);
  const dn3 = dn2 + exactDays;
  const result = dn3 * MS_PER_DAY + msOfDay + (exact - exactDays * MS_PER_DAY);
  if (!(result >= MIN_DAY_NUMBER * MS_PER_DAY && result <= MAX_DAY_NUMBER * MS_PER_DAY + MS_PER_DAY - 1)) {
    throw new KalendsRangeError(`duration: ${shown} + ${formatDuration(d)} falls outside the supported date-times`, {
      code: 'out-of-range',
      received: duration,
    });
  }
  return result;
}

/**
 * The one coercion point: whatever a user holds (text, a number, a `Date`, a Temporal object from any
 * polyfill or a native implementation) becomes epoch milliseconds, a day number or wall milliseconds. Temporal
 * objects are recognised by their shape, so kalends imports no polyfill; converting back takes the caller's
 * Temporal namespace as an argument.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { dayNumberFromYmd, requireDayNumber, ymdFromDayNumber } from '../civil/gregorian.js';
import { optionOf, readOptions, requireEnum, requireEpochMs } from '../diagnostics/index.js';
import { readInstant, readPlainDate, readPlainDateTime } from './text.js';
import { requireWallMs } from './format.js';

/** The name of a value's kind for messages: Temporal objects by their tag (`Temporal.PlainDate`), others as usual. */
function kindOf(value: unknown): string {
  if (typeof value === 'object' && value !== null) {
    const tag = (value as { [Symbol.toStringTag]?: unknown })[Symbol.toStringTag];
    if (typeof tag === 'string' && tag.startsWith('Temporal.')) return `a ${tag}`;
  }
  return describeValue(value);
}

function temporalTag(value: object): string | undefined {
  const tag = (value as { [Symbol.toStringTag]?: unknown })[Symbol.toStringTag];
  return typeof tag === 'string' && tag.startsWith('Temporal.') ? tag : undefined;
}

function floorDivBig(ns: bigint): number {
  const q = ns / 1_000_000n;
  return Number(ns < 0n && q * 1_000_000n !== ns ? q - 1n : q);
}

function checkEpochMs(fn: string, ms: number, received: unknown): number {
  if (!(ms >= MIN_EPOCH_MS && ms <= MAX_EPOCH_MS)) {
    throw new KalendsRangeError(`${fn}: ${kindOf(received)} gives ${ms} epoch ms, outside the supported ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}`, {
      code: 'out-of-range',
      received,
    });
  }
  return ms;
}

/**
 * Converts what a user holds into epoch milliseconds:
 *
 * | input | result |
 * | --- | --- |
 * | string | {@link parseInstant}: RFC 3339 / RFC 9557 with a required offset |
 * | number | a number within ±8.64e15 is taken as epoch ms, a fraction of a millisecond kept (the instant lies in millisecond `Math.floor(value)`); NaN and infinities are rejected |
 * | `Date` | its time value; an invalid `Date` is rejected |
 * | Temporal.Instant, Temporal.ZonedDateTime (any implementation) | `epochNanoseconds` floored to the ms, or `epochMilliseconds` |
 *
 * Anything else (a bigint, a Temporal.PlainDateTime, which has no instant without a zone, a plain object)
 * throws a {@link KalendsTypeError} naming what was received.
 *
 * @example
 * ```ts
 * toEpochMs('1970-01-01T00:00:01Z');   // 1000
 * toEpochMs(new Date(0));              // 0
 * toEpochMs(1.5);                      // 1.5 (in millisecond 1)
 * toEpochMs(Temporal.Now.instant());   // works with any Temporal implementation
 * ```
 */
export function toEpochMs(value: unknown): number {
  if (typeof value === 'string') return readInstant(value, undefined, 'value').epochMs;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new KalendsRangeError(`value: expected a finite number of epoch milliseconds, got ${describeValue(value)}`, { code: 'out-of-range', received: value });
    }
    // A fraction of a millisecond is kept: the instant lies within millisecond Math.floor(value) (docs/design.md).
    return checkEpochMs('value', value === 0 ? 0 : value, value);
  }
  if (value instanceof Date) {
    const t = value.getTime();
    if (Number.isNaN(t)) {
      throw new KalendsRangeError('value: got an invalid Date (its time value is NaN)', { code: 'out-of-range', received: value });
    }
    return t === 0 ? 0 : t;
  }
  if (typeof value === 'object' && value !== null) {
    const o = value as { epochNanoseconds?: unknown; epochMilliseconds?: unknown };
    if (typeof o.epochNanoseconds === 'bigint') return checkEpochMs('value', floorDivBig(o.epochNanoseconds), value);
    if (typeof o.epochMilliseconds === 'number' && Number.isInteger(o.epochMilliseconds)) {
      return checkEpochMs('value', o.epochMilliseconds, value);
    }
    const tag = temporalTag(value);
    if (tag === 'Temporal.PlainDateTime' || tag === 'Temporal.PlainDate') {
      throw new KalendsTypeError(
        `value: got a ${tag}, which names no instant until a zone is chosen; convert it with a zone (Temporal's toZonedDateTime, or the zone layer) first`,
        { code: 'invalid-type', received: value },
      );
    }
  }
  if (typeof value === 'bigint') {
    throw new KalendsTypeError(
      `value: got a bigint (${value}n); a bigint is ambiguous (nanoseconds? milliseconds?). Pass epoch milliseconds as a number, e.g. Number(ns / 1000000n)`,
      { code: 'invalid-type', received: value },
    );
  }
  throw new KalendsTypeError(
    `value: expected an RFC 3339 string with an offset, an integer number of epoch ms, a valid Date or a Temporal.Instant / ZonedDateTime, got ${kindOf(value)}`,
    { code: 'invalid-type', received: value },
  );
}

/** Options of {@link toDayNumber}. */
export interface ToDayNumberOptions {
  /**
   * How to read a `Date`, which is an instant and has no date of its own: `'utc'` takes its UTC calendar date
   * (`getUTCFullYear`...), `'local'` its date in the runtime's zone (`getFullYear`...). Without this option a
   * `Date` is rejected, so the choice is always visible in the caller's code.
   */
  readonly dateFields?: 'utc' | 'local';
}

const DATE_FIELDS: readonly ('utc' | 'local')[] = ['utc', 'local'];

function ymdObjectToDayNumber(fn: string, value: object, tag: string | undefined): number | undefined {
  const o = value as { year?: unknown; month?: unknown; day?: unknown; calendarId?: unknown; calendar?: unknown };
  if (typeof o.year !== 'number' || typeof o.month !== 'number' || typeof o.day !== 'number') return undefined;
  let calendar: unknown = o.calendarId;
  if (calendar === undefined && typeof o.calendar === 'object' && o.calendar !== null) calendar = (o.calendar as { id?: unknown }).id;
  if (calendar === undefined && typeof o.calendar === 'string') calendar = o.calendar;
  if (calendar !== undefined && calendar !== 'iso8601') {
    throw new KalendsRangeError(
      `${fn}: got ${tag ? `a ${tag}` : 'an object'} in the calendar ${describeValue(calendar)}; kalends works in the ISO 8601 calendar: convert it with withCalendar('iso8601') first`,
      { code: 'out-of-range', received: value },
    );
  }
  try {
    return dayNumberFromYmd(o.year, o.month, o.day);
  } catch (e) {
    throw new KalendsRangeError(`${fn}: got ${tag ? `a ${tag}` : 'an object'} with an invalid date: ${(e as Error).message}`, {
      code: 'out-of-range',
      received: value,
    });
  }
}

/**
 * Converts what a user holds into a day number (a local date):
 *
 * | input | result |
 * | --- | --- |
 * | string | {@link parsePlainDate}: `2025-02-14`, `2025-W07-5` or `2025-045` |
 * | number | an integer from -100,000,109 to 100,000,109 is taken as a day number (epoch ms and epoch seconds of any date after 2 January 1970 are larger, so they are caught with a hint) |
 * | Temporal.PlainDate, PlainDateTime, ZonedDateTime (any implementation), or a plain `{ year, month, day }` | its ISO calendar date (a ZonedDateTime gives its date in its own zone) |
 * | `Date` | only with `options.dateFields` `'utc'` or `'local'` |
 *
 * Anything else (a Temporal.Instant, which has no date without a zone; a non-ISO calendar) throws, naming what
 * was received.
 *
 * @example
 * ```ts
 * toDayNumber('2025-02-14');                            // 20133
 * toDayNumber(20133);                                   // 20133
 * toDayNumber({ year: 2025, month: 2, day: 14 });       // 20133
 * toDayNumber(new Date(Date.UTC(2025, 1, 14)), { dateFields: 'utc' }); // 20133
 * ```
 */
export function toDayNumber(value: unknown, options?: ToDayNumberOptions): number {
  const o = readOptions('options', options, ['dateFields']);
  const dateFields = optionOf(o, 'dateFields') === undefined ? undefined : requireEnum('options.dateFields', optionOf(o, 'dateFields'), DATE_FIELDS);
  if (typeof value === 'string') return readPlainDate(value, 'value');
  if (typeof value === 'number') {
    if (Number.isInteger(value) && (value > MAX_DAY_NUMBER || value < MIN_DAY_NUMBER)) {
      throw new KalendsRangeError(
        `value: ${describeValue(value)} is outside the day numbers ${MIN_DAY_NUMBER} to ${MAX_DAY_NUMBER}; if it is epoch milliseconds, it is an instant: choose a zone and use the zone layer's dayNumberFromEpochMs`,
        { code: 'out-of-range', received: value },
      );
    }
    return requireDayNumber(value === 0 ? 0 : value, 'value');
  }
  if (value instanceof Date) {
    const mode = dateFields;
    if (Number.isNaN(value.getTime())) {
      throw new KalendsRangeError('value: got an invalid Date (its time value is NaN)', { code: 'out-of-range', received: value });
    }
    if (mode === 'utc') return dayNumberFromYmd(value.getUTCFullYear(), value.getUTCMonth() + 1, value.getUTCDate());
    if (mode === 'local') return dayNumberFromYmd(value.getFullYear(), value.getMonth() + 1, value.getDate());
    throw new KalendsTypeError(
      `value: got a Date${mode === undefined ? '' : ` with options.dateFields ${describeValue(mode)}`}; a Date is an instant, and its calendar date depends on the zone. Pass { dateFields: 'utc' } or { dateFields: 'local' } to choose, or use the zone layer's dayNumberFromEpochMs`,
      { code: 'invalid-type', received: value },
    );
  }
  if (typeof value === 'object' && value !== null) {
    const tag = temporalTag(value);
    const dn = ymdObjectToDayNumber('value', value, tag);
    if (dn !== undefined) return dn;
    if (tag === 'Temporal.Instant') {
      throw new KalendsTypeError(
        'value: got a Temporal.Instant, which has no calendar date until a zone is chosen; use toEpochMs and the zone layer, or Temporal toZonedDateTimeISO first',
        { code: 'invalid-type', received: value },
      );
    }
  }
  throw new KalendsTypeError(
    `value: expected an ISO 8601 date string, an integer day number, a Temporal.PlainDate / PlainDateTime / ZonedDateTime or { year, month, day }, got ${kindOf(value)}`,
    { code: 'invalid-type', received: value },
  );
}

/**
 * Converts what a user holds into wall milliseconds (a local date-time): a local ISO 8601 date-time string
 * ({@link parsePlainDateTime}), a number taken as wall ms (a fraction of a millisecond kept), or a Temporal.PlainDateTime / PlainDate
 * (midnight) / ZonedDateTime (its wall-clock time in its own zone), duck-typed. Sub-millisecond fields of a
 * Temporal object are dropped (floored).
 *
 * @example
 * ```ts
 * toWallMs('1970-01-02T00:00');  // 86400000
 * ```
 */
export function toWallMs(value: unknown): number {
  const min = MIN_DAY_NUMBER * MS_PER_DAY;
  const max = MAX_DAY_NUMBER * MS_PER_DAY + MS_PER_DAY - 1;
  if (typeof value === 'string') return readPlainDateTime(value, undefined, 'value');
  if (typeof value === 'number') return requireWallMs('value', value === 0 ? 0 : value, min, max);
  if (typeof value === 'object' && value !== null && !(value instanceof Date)) {
    const tag = temporalTag(value);
    const dn = ymdObjectToDayNumber('value', value, tag);
    if (dn !== undefined) {
      const o = value as { hour?: unknown; minute?: unknown; second?: unknown; millisecond?: unknown };
      const part = (name: 'hour' | 'minute' | 'second' | 'millisecond', hi: number): number => {
        const v = o[name];
        if (v === undefined) return 0;
        return requireInteger(name, v, 0, hi);
      };
      return dn * MS_PER_DAY + part('hour', 23) * 3_600_000 + part('minute', 59) * 60_000 + part('second', 59) * 1000 + part('millisecond', 999);
    }
  }
  throw new KalendsTypeError(
    `value: expected a local ISO 8601 date-time string, an integer of wall ms, or a Temporal.PlainDateTime / PlainDate / ZonedDateTime, got ${kindOf(value)}${value instanceof Date ? '; a Date is an instant: use toEpochMs and the zone layer' : ''}`,
    { code: 'invalid-type', received: value },
  );
}

/**
 * The parts of a Temporal namespace that the conversions below use. Pass `Temporal` from the runtime or from
 * the polyfill you already use; kalends never imports one.
 */
export interface TemporalNamespaceLike {
  /** `Temporal.Instant`: only `fromEpochMilliseconds` is used. */
  readonly Instant: {
    /** Makes a `Temporal.Instant` from epoch milliseconds. */
    fromEpochMilliseconds(epochMilliseconds: number): unknown;
  };
  /** `Temporal.PlainDate`: only its constructor is used. */
  readonly PlainDate: {
    /** Makes a `Temporal.PlainDate` from the ISO year, month and day. */
    new (isoYear: number, isoMonth: number, isoDay: number): unknown;
  };
  /** `Temporal.PlainDateTime`: only its constructor is used. */
  readonly PlainDateTime: {
    /** Makes a `Temporal.PlainDateTime` from the ISO year, month and day and the time of day. */
    new (isoYear: number, isoMonth: number, isoDay: number, hour: number, minute: number, second: number, millisecond: number): unknown;
  };
}

function requireNamespace(fn: string, ns: unknown, member: 'Instant' | 'PlainDate' | 'PlainDateTime'): void {
  const m = typeof ns === 'object' && ns !== null ? (ns as Record<string, unknown>)[member] : undefined;
  if (typeof m !== 'function' && (typeof m !== 'object' || m === null)) {
    throw new KalendsTypeError(`temporal: expected a Temporal namespace (with Temporal.${member}) as the last argument, got ${describeValue(ns)}; pass Temporal from the runtime or from a polyfill`, {
      code: 'invalid-type',
      received: ns,
    });
  }
}

function wrapTemporal<T>(fn: string, received: unknown, make: () => T): T {
  try {
    return make();
  } catch (e) {
    throw new KalendsRangeError(`${fn}: the Temporal implementation refused ${describeValue(received)} (Temporal's range is -271821-04-19 to +275760-09-13): ${(e as Error).message}`, {
      code: 'out-of-range',
      received,
    });
  }
}

/**
 * A `Temporal.Instant` for an instant, built with the Temporal namespace the caller passes. Temporal objects carry
 * whole milliseconds here: a fractional instant gives the millisecond that holds it (`Math.floor`).
 *
 * @example
 * ```ts
 * import { Temporal } from '@js-temporal/polyfill'; // or the runtime's Temporal
 * temporalInstantFromEpochMs(0, Temporal).toString(); // '1970-01-01T00:00:00Z'
 * ```
 */
export function temporalInstantFromEpochMs<T extends Pick<TemporalNamespaceLike, 'Instant'>>(
  epochMs: number,
  temporal: T,
): ReturnType<T['Instant']['fromEpochMilliseconds']> {
  const whole = Math.floor(requireEpochMs('epochMs', epochMs));
  requireNamespace('temporalInstantFromEpochMs', temporal, 'Instant');
  return wrapTemporal('epochMs', epochMs, () => temporal.Instant.fromEpochMilliseconds(whole)) as ReturnType<
    T['Instant']['fromEpochMilliseconds']
  >;
}

/**
 * A `Temporal.PlainDate` for a day number, built with the caller's Temporal namespace. Temporal's range
 * (-271821-04-19 to +275760-09-13) is narrower than kalends's; dates outside it throw a {@link KalendsRangeError}.
 *
 * @example
 * ```ts
 * temporalPlainDateFromDayNumber(20133, Temporal).toString(); // '2025-02-14'
 * ```
 */
export function temporalPlainDateFromDayNumber<T extends Pick<TemporalNamespaceLike, 'PlainDate'>>(
  dayNumber: number,
  temporal: T,
): InstanceType<T['PlainDate']> {
  const { year, month, day } = ymdFromDayNumber(dayNumber);
  requireNamespace('temporalPlainDateFromDayNumber', temporal, 'PlainDate');
  return wrapTemporal('dayNumber', dayNumber, () => new temporal.PlainDate(year, month, day)) as InstanceType<T['PlainDate']>;
}

/**
 * A `Temporal.PlainDateTime` for wall milliseconds, built with the caller's Temporal namespace (a fractional wall
 * time gives the millisecond that holds it).
 *
 * @example
 * ```ts
 * temporalPlainDateTimeFromWallMs(86401000, Temporal).toString(); // '1970-01-02T00:00:01'
 * ```
 */
export function temporalPlainDateTimeFromWallMs<T extends Pick<TemporalNamespaceLike, 'PlainDateTime'>>(
  wallMs: number,
  temporal: T,
): InstanceType<T['PlainDateTime']> {
  const whole = Math.floor(requireWallMs('wallMs', wallMs));
  requireNamespace('temporalPlainDateTimeFromWallMs', temporal, 'PlainDateTime');
  const dn = Math.floor(whole / MS_PER_DAY);
  const { year, month, day } = ymdFromDayNumber(dn);
  let r = whole - dn * MS_PER_DAY;
  const h = Math.floor(r / 3_600_000);
  r -= h * 3_600_000;
  const mi = Math.floor(r / 60_000);
  r -= mi * 60_000;
  const s = Math.floor(r / 1000);
  const ms = r - s * 1000;
  return wrapTemporal('wallMs', wallMs, () => new temporal.PlainDateTime(year, month, day, h, mi, s, ms)) as InstanceType<
    T['PlainDateTime']
  >;
}

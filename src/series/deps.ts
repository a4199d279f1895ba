/**
 * The one door of the series layer to the layers below it (instant, zone, period, business, recurrence): every
 * name the series layer uses from them is imported here and nowhere else (test/series/layering.test.ts checks
 * it), with the few resolvers that turn a caller's input into a lower layer's value once per call. The shared
 * modules under every layer (`errors.ts`, `bounds.ts`, `diagnostics/`) are imported directly, as in every layer.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { type Zone, type ZoneInput, dayNumberFromEpochMs, firstEpochMsOfDayNumber, toZone } from '../zone/index.js';
import { type PeriodUnit, type UnitInput, toUnit } from '../period/index.js';
import { type BusinessCalendar, type CalendarInput, UnknownCalendarError, calendarFromName } from '../business/index.js';

export {
  type Duration,
  type DurationFields,
  durationFromFields,
  exactMsOfDuration,
  formatDuration,
  negateDuration,
  shiftDayNumber,
  shiftWallMs,
  toEpochMs,
} from '../instant/index.js';
export { readDuration } from '../instant/duration.js';
export { dayNumberFromEpochMsBulk, epochMsFromWallMs, firstEpochMsOfDayNumber, wallMsFromEpochMsBulk } from '../zone/index.js';
export { ordinalFromEpochMsBulk, shiftPeriodYears } from '../period/index.js';
export { isBusinessDay, nextBusinessDay, previousBusinessDay, shiftBusinessDays } from '../business/index.js';
export { type Rule, occurrenceDayNumberBulk, occurrenceEpochMsBulk } from '../recurrence/index.js';

export type { Zone, ZoneInput, PeriodUnit, UnitInput, BusinessCalendar, CalendarInput };

/** @internal A zone from a zone or an id string (IANA id or fixed offset). */
export function resolveZone(input: ZoneInput | undefined, name: string): Zone {
  if (input === undefined) {
    throw new KalendsTypeError(`${name}: expected a zone (an IANA id such as "America/New_York", or a Zone), got undefined`, {
      code: 'invalid-type',
      received: input,
    });
  }
  return toZone(input, name);
}

/** @internal A compiled unit from a unit, a unit definition, or a calendar unit name such as "month". */
export function requireUnit(unit: unknown, name: string): PeriodUnit {
  if (unit === undefined) {
    throw new KalendsTypeError(`${name}: expected a period unit ("month", "iso-week", a unit from defineUnit, ...), got undefined`, {
      code: 'invalid-type',
      received: unit,
    });
  }
  return toUnit(unit as UnitInput, name);
}

/**
 * @internal A business calendar from a calendar or the name of a bundled one, resolved once per call so that an
 * unknown name is reported with the caller's parameter name before any row is read.
 */
export function resolveCalendar(input: unknown, name: string): CalendarInput {
  if (typeof input === 'string') {
    try {
      return calendarFromName(input);
    } catch (e) {
      if (e instanceof UnknownCalendarError) throw new UnknownCalendarError(input, name);
      throw e;
    }
  }
  const c = input as Partial<BusinessCalendar> | null;
  if (c === null || typeof c !== 'object' || !Array.isArray(c.weekend) || typeof c.definition !== 'object') {
    throw new KalendsTypeError(
      `${name}: expected a bundled calendar name such as "us-federal", or a calendar from defineCalendar, got ${describeValue(input)}`,
      { code: 'invalid-type', received: input },
    );
  }
  return c as BusinessCalendar;
}

/** @internal The ordinal of the period of `unit` holding instant `epochMs` in `zone`. */
export function ordinalAt(unit: PeriodUnit, zone: Zone, epochMs: number): number {
  return unit.ordinalFromDayNumber(dayNumberFromEpochMs(zone, epochMs));
}

/** @internal First instant of period `ordinal` of `unit` in `zone`. */
export function periodStartMs(unit: PeriodUnit, zone: Zone, ordinal: number): number {
  return firstEpochMsOfDayNumber(zone, unit.firstDayNumberFromOrdinal(ordinal));
}

/**
 * @internal The error to throw for `e`, caught while turning instants into periods or business days: a range
 * error of a lower layer (a day or period past the supported range, or past a calendar's years) becomes one that
 * names the caller's parameter (`name`), says what reached past (`what`) and how to stay inside (`fix`), so that
 * no internal name (`dayNumber`, `ordinal`) reaches the user; anything else is returned as it is.
 * Used as `catch (e) { throw edgeError(e, 'series.epochMs', what, fix); }`.
 */
export function edgeError(e: unknown, name: string, what: string, fix: string): unknown {
  if (!(e instanceof KalendsRangeError) || e.code !== 'out-of-range' || e.message.startsWith(name)) return e;
  return new KalendsRangeError(`${name}: ${what} reach past the supported range (${e.message}); ${fix}`, {
    code: 'out-of-range',
    received: e.received,
    path: name,
  });
}

/** @internal {@link edgeError} for the periods of `unit` in `zone`. */
export function periodEdgeError(e: unknown, name: string, unit: PeriodUnit, zone: Zone): unknown {
  return edgeError(e, name, `the periods of unit ${unit.id} in zone ${zone.id}`, `leave out the instants within a period of its ends (years ${MIN_YEAR}..${MAX_YEAR})`);
}

/** @internal {@link edgeError} for the business days of a calendar. */
export function calendarEdgeError(e: unknown, name: string, calendar: CalendarInput): unknown {
  const c = calendar as BusinessCalendar;
  return edgeError(e, name, `the business days of calendar ${JSON.stringify(c.id)}`, `keep the instants within the years ${c.firstYear}..${c.lastYear} that it supports`);
}

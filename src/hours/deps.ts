/**
 * @internal The one place where the hours layer touches the zone, business and instant layers, so that each of
 * their names appears once here and nowhere else in src/hours (their names are being polished elsewhere).
 *
 * @module
 */
import { DefinitionError, KalendsTypeError, describeValue } from '../errors.js';
import { yearOfDayNumberUnchecked } from '../civil/gregorian.js';
import { type Duration, exactMsOfDuration, formatInstant, formatPlainDate, parsePlainDate } from '../instant/index.js';
import { readDuration } from '../instant/duration.js';
import {
  type Disambiguation,
  type Zone,
  WallTimeRejectedError,
  dayNumberFromEpochMs,
  dayNumberFromEpochMsBulk,
  epochMsFromWallMs,
  firstEpochMsOfDayNumber,
  lengthMsOfDayNumber,
  toZone,
} from '../zone/index.js';
import {
  type BusinessCalendar,
  type CalendarDefinition,
  type Holiday,
  calendarFromName,
  defineCalendar,
  isBusinessDay,
  listHolidays,
  shiftBusinessDays,
} from '../business/index.js';

export type { BusinessCalendar, CalendarDefinition, Disambiguation, Duration, Holiday, Zone };
export { exactMsOfDuration, formatInstant, formatPlainDate, parsePlainDate, readDuration, toZone };

/** Disambiguation words (Temporal's), in the order messages list them. */
export const DISAMBIGUATIONS: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];

// ---- zone ------------------------------------------------------------------------------------------------

/**
 * The instant of a wall time under the definition's policy. With `'reject'`, a wall time in a gap or an overlap
 * throws the zone layer's WallTimeRejectedError, its message led by the definition path that wrote the time.
 */
export function instantOfWall(zone: Zone, wallMs: number, policy: Disambiguation, path: string): number {
  try {
    return epochMsFromWallMs(zone, wallMs, policy);
  } catch (e) {
    if (e instanceof WallTimeRejectedError) {
      throw new WallTimeRejectedError(`${path}: ${e.message.replace(/^wallMs: /, '')}`, e.kind, e.zoneId, wallMs);
    }
    throw e;
  }
}

/** Whether the zone skipped the whole local day (its length is 0, as Pacific/Apia's 2011-12-30). */
export function isSkippedDay(zone: Zone, dayNumber: number): boolean {
  return lengthMsOfDayNumber(zone, dayNumber) === 0;
}

/** The first instant of a local day. */
export function dayStartEpochMs(zone: Zone, dayNumber: number): number {
  return firstEpochMsOfDayNumber(zone, dayNumber);
}

/** The local day number of an instant. */
export function localDayNumber(zone: Zone, epochMs: number): number {
  return dayNumberFromEpochMs(zone, epochMs);
}

/** The local year of an instant. */
export function localYear(zone: Zone, epochMs: number): number {
  return yearOfDayNumberUnchecked(dayNumberFromEpochMs(zone, epochMs));
}

/** The local day numbers of many instants, in one pass of the zone layer's bulk kernel. */
export function localDayNumberBulk(zone: Zone, epochMs: ArrayLike<number>, out: Int32Array): Int32Array {
  return dayNumberFromEpochMsBulk(zone, epochMs as Float64Array, out);
}

// ---- business --------------------------------------------------------------------------------------------

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function isCompiledCalendar(v: Record<string, unknown>): boolean {
  return Object.isFrozen(v) && typeof v['firstYear'] === 'number' && Array.isArray(v['weekend']) && 'definition' in v;
}

/**
 * A compiled calendar from a bundled name, an inline definition or a compiled calendar, or the faults of the
 * definition (each at its path under `path`) as issues.
 */
export function calendarOfInput(input: unknown, path: string): { calendar?: BusinessCalendar; issues: { path: string; message: string }[] } {
  try {
    if (typeof input === 'string') return { calendar: calendarFromName(input), issues: [] };
    if (isObject(input)) {
      if (isCompiledCalendar(input)) return { calendar: input as unknown as BusinessCalendar, issues: [] };
      return { calendar: defineCalendar(input as unknown as CalendarDefinition), issues: [] };
    }
    throw new KalendsTypeError(
      `${path}: expected a bundled calendar name such as "us-federal", a calendar definition or a compiled calendar, got ${describeValue(input)}`,
      { code: 'invalid-type', received: input },
    );
  } catch (e) {
    if (e instanceof DefinitionError) return { issues: e.issues.map((i) => ({ path: `${path}.${i.path}`, message: i.message })) };
    if (e instanceof Error && 'code' in e) return { issues: [{ path, message: e.message.replace(/^(name|calendar|\w+): /, '') }] };
    throw e;
  }
}

/** Whether a day is a business day of the calendar (not a weekend day, not a holiday). */
export function isCalendarBusinessDay(calendar: BusinessCalendar, dayNumber: number): boolean {
  return isBusinessDay(calendar, dayNumber);
}

/** The holidays observed in [start, end), clipped to the calendar's years. */
export function holidaysBetween(calendar: BusinessCalendar, start: number, end: number): readonly Holiday[] {
  return listHolidays(calendar, start, end);
}

/** `n` business days of the calendar from `dayNumber` (the business layer's rule), or NaN outside its years. */
export function shiftCalendarBusinessDays(calendar: BusinessCalendar, dayNumber: number, n: number): number {
  try {
    return shiftBusinessDays(calendar, dayNumber, n);
  } catch {
    return Number.NaN;
  }
}

/**
 * @internal The one place where the recurrence layer touches the layers below civil (instant, zone, period,
 * business), so that their names appear once and the engines depend only on small interfaces.
 *
 * @module
 */
import { KalendsTypeError, describeValue } from '../errors.js';
import { dayNumberFromYmdUnchecked } from '../civil/gregorian.js';
import {
  formatInstant,
  formatPlainDate,
  formatPlainDateTime,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
  toDayNumber,
  toEpochMs,
} from '../instant/index.js';
import { type Zone, offsetSecondsFromEpochMs, toZone } from '../zone/index.js';
import { type PeriodUnit, toUnit } from '../period/index.js';
import {
  type BusinessCalendar,
  adjustDayNumber,
  calendarFromName,
  countBusinessDays,
  defineCalendar,
  isBusinessDay,
  nthBusinessDayOfRange,
} from '../business/index.js';
import { appendBusinessDaysUnchecked, nthBusinessDayInRangeUnchecked } from '../business/calendar.js';
import type { BusinessOps, PeriodOps, ZoneOps } from './engine.js';

export { formatInstant, formatPlainDate, formatPlainDateTime, parseInstant, parsePlainDate, parsePlainDateTime, toDayNumber, toEpochMs };
export type { BusinessCalendar, PeriodUnit, Zone };

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null;
}

/** Whether `v` is a compiled business calendar (rather than a definition). */
function isCompiledCalendar(v: Record<string, unknown>): boolean {
  return Object.isFrozen(v) && typeof v['firstYear'] === 'number' && Array.isArray(v['weekend']) && 'definition' in v;
}

/** A business calendar from a compiled calendar, a calendar definition, or the name of a bundled calendar. */
export function businessOps(input: unknown, path: string): BusinessOps {
  let cal: BusinessCalendar;
  if (typeof input === 'string') cal = calendarFromName(input);
  else if (isObject(input)) cal = isCompiledCalendar(input) ? (input as unknown as BusinessCalendar) : defineCalendar(input as never);
  else {
    throw new KalendsTypeError(`${path}: expected a business calendar, its definition, or a bundled calendar name such as "us-federal", got ${describeValue(input)}`, {
      code: 'invalid-type',
      received: input,
      path,
    });
  }
  return {
    id: cal.id,
    calendar: cal,
    firstDay: dayNumberFromYmdUnchecked(cal.firstYear, 1, 1),
    endDay: dayNumberFromYmdUnchecked(cal.lastYear, 12, 31) + 1,
    isBusinessDay: (dn) => isBusinessDay(cal, dn),
    adjust: (dn, convention) => adjustDayNumber(cal, dn, convention as never),
    countBusinessDays: (a, b) => countBusinessDays(cal, a, b),
    nthInRangeUnchecked: (a, b, n) => nthBusinessDayInRangeUnchecked(cal, a, b, n),
    appendBusinessDaysUnchecked: (a, b, out) => appendBusinessDaysUnchecked(cal, a, b, out),
    nthBusinessDayOfRange: (a, b, n) => {
      try {
        return nthBusinessDayOfRange(cal, a, b, n);
      } catch {
        return undefined;
      }
    },
  };
}

/** A period unit from a compiled unit, a unit definition, or a calendar unit name such as "quarter". */
export function periodOps(input: unknown, path: string): PeriodOps {
  const unit = toUnit(input as never, path);
  return {
    id: unit.id,
    unit,
    ordinalOf: (dn) => unit.ordinalFromDayNumber(dn),
    firstDayOf: (o) => unit.firstDayNumberFromOrdinal(o),
  };
}

/** A zone from a compiled zone or an id (IANA id, "UTC", or a fixed offset such as "+05:30"). */
export function zoneOps(input: unknown, path: string): ZoneOps {
  const zone = toZone(input as never, path);
  return { id: zone.id, zone, offsetSecondsFromEpochMs: (ms) => offsetSecondsFromEpochMs(zone, ms) };
}

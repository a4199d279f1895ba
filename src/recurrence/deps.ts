/**
 * @internal The one place where the recurrence layer touches the layers below civil (instant, zone, period,
 * business), so that their names appear once and the engines depend only on small interfaces.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
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
import { type Zone, nextTransition, offsetSecondsFromEpochMs, toZone } from '../zone/index.js';
import { MIN_EPOCH_MS } from '../bounds.js';

/** Most zone transitions one check walks before answering "may". */
const MAX_TRANSITIONS_WALKED = 100_000;
import { type PeriodUnit, toUnit } from '../period/index.js';
import {
  type BusinessCalendar,
  UnknownCalendarError,
  adjustDayNumber,
  calendarFromName,
  countBusinessDays,
  defineCalendar,
  isBusinessDay,
  listHolidays,
  nthBusinessDayOfRange,
  shiftBusinessDays,
} from '../business/index.js';
import { appendBusinessDaysUnchecked, nthBusinessDayInRangeUnchecked } from '../business/calendar.js';
export { type DayCountConvention, type YearFraction, DAY_COUNT_TRADE_NAMES, NEEDED_OPTIONS } from '../daycount/conventions.js';
export { readCouponsPerYear, readTermination, refuseUnusedOptions, requireConvention, requireNotAfterTermination, missingDayCountOption, showDay } from '../daycount/checks.js';
export { yearFractionFromParts } from '../daycount/fraction.js';
export { ISDA_DENOMINATOR, actual365LeapDenominator, actualActualIsdaNumerator, greatestCommonDivisor, thirtyDays, thirtyE360IsdaDays } from '../daycount/formulas.js';
import type { BusinessOps, PeriodOps, ZoneOps } from './engine.js';

export { listHolidays };
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
  if (typeof input === 'string') {
    try {
      cal = calendarFromName(input);
    } catch (e) {
      // calendarFromName names its own parameter; the message names the option the caller gave.
      if (e instanceof UnknownCalendarError) throw new UnknownCalendarError(input, path);
      throw e;
    }
  } else if (isObject(input)) cal = isCompiledCalendar(input) ? (input as unknown as BusinessCalendar) : defineCalendar(input as never);
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
    shiftOrNaN: (dn, n) => {
      try {
        return shiftBusinessDays(cal, dn, n);
      } catch (e) {
        // Only "passes the first or last year" means "not within the calendar"; anything else is reported.
        if (e instanceof KalendsRangeError && e.code === 'out-of-range') return Number.NaN;
        throw e;
      }
    },
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
  return {
    id: zone.id,
    zone,
    offsetSecondsFromEpochMs: (ms) => offsetSecondsFromEpochMs(zone, ms),
    mayJumpHalfADay: (startMs, endMs) => {
      // Walk the transitions (about two a year where daylight saving is kept); give up, saying "may", after many.
      let t = Math.max(startMs, MIN_EPOCH_MS);
      for (let seen = 0; seen < MAX_TRANSITIONS_WALKED; seen++) {
        const next = nextTransition(zone, t);
        if (next === null || next.epochMs >= endMs) return false;
        if (Math.abs(next.offsetAfterSeconds - next.offsetBeforeSeconds) >= 43_200) return true;
        t = next.epochMs;
      }
      return true;
    },
  };
}

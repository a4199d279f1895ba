/**
 * The one place where the series layer touches the layers below it (zone, period, business, recurrence), so
 * that their names appear once.
 *
 * @module
 */
import { KalendsTypeError, describeValue } from '../errors.js';
import { type Zone, type ZoneInput, dayNumberFromEpochMs, firstEpochMsOfDayNumber, toZone } from '../zone/index.js';
import { type PeriodUnit, type UnitInput, toUnit } from '../period/index.js';

export type { Zone, ZoneInput, PeriodUnit, UnitInput };

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

/** @internal The ordinal of the period of `unit` holding instant `epochMs` in `zone`. */
export function ordinalAt(unit: PeriodUnit, zone: Zone, epochMs: number): number {
  return unit.ordinalFromDayNumber(dayNumberFromEpochMs(zone, epochMs));
}

/** @internal First instant of period `ordinal` of `unit` in `zone`. */
export function periodStartMs(unit: PeriodUnit, zone: Zone, ordinal: number): number {
  return firstEpochMsOfDayNumber(zone, unit.firstDayNumberFromOrdinal(ordinal));
}

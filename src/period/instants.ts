/**
 * Periods and instants. A period's start is the first instant of its first local day in a zone, and its end the
 * first instant of the next period's first day: DST-true, so a local day may be 23 or 25 hours and a period need
 * not start at 00:00 (a zone that skipped midnight starts the day at 01:00).
 *
 * @module
 */
import { requireNumberArray, requireOutArray } from '../diagnostics/index.js';
import { type BulkOptions, INVALID_DAY_NUMBER, type ZoneInput, dayNumberFromEpochMs, firstEpochMsOfDayNumber } from '../zone/index.js';
import { dayNumbersOfCheckedInstants, localDayFunctionBulk, readBulkOptions } from '../zone/bulk.js';
import { BULK_TABLE_MIN_ELEMENTS, ordinalDayFunction, ordinalsFromDaysKernel } from './bulk.js';
import { type Period, periodChecked, requirePeriod } from './period.js';
import { type UnitInput, coreOf, toUnit } from './units.js';

/**
 * The period of `unit` that holds the instant `epochMs`, on the local calendar of `zone`.
 *
 * @example
 * ```ts
 * // 2025-10-01T03:30Z is still 30 September in New York: the last day of US federal FY2025.
 * const fy = defineUnit({ kind: 'fiscal-year', start: { month: 10, day: 1 }, naming: 'end-year' });
 * formatPeriod(periodFromEpochMs(fy, 'America/New_York', Date.parse('2025-10-01T03:30Z'))); // 'FY2025'
 * ```
 */
export function periodFromEpochMs(unit: UnitInput, zone: ZoneInput, epochMs: number): Period {
  const u = toUnit(unit);
  return periodChecked(u, u.ordinalFromDayNumber(dayNumberFromEpochMs(zone, epochMs)), 'epochMs', 'periodFromEpochMs');
}

/**
 * The first instant of `p` in `zone`: the first instant of its first local day (not always 00:00).
 *
 * @example
 * ```ts
 * firstEpochMsOfPeriod(parsePeriod('month', '2025-03'), 'America/New_York'); // Date.parse('2025-03-01T05:00Z')
 * ```
 */
export function firstEpochMsOfPeriod(p: Period, zone: ZoneInput): number {
  const core = requirePeriod(p, 'p');
  return firstEpochMsOfDayNumber(zone, core.firstDayOf(p.ordinal));
}

/**
 * The end of `p` in `zone`, exclusive: the first instant of the next period. The period's length in
 * milliseconds is `firstEpochMsAfterPeriod(p, zone) - firstEpochMsOfPeriod(p, zone)`, DST changes included.
 *
 * @example
 * ```ts
 * firstEpochMsAfterPeriod(parsePeriod('month', '2025-03'), 'America/New_York'); // Date.parse('2025-04-01T04:00Z')
 * ```
 */
export function firstEpochMsAfterPeriod(p: Period, zone: ZoneInput): number {
  const core = requirePeriod(p, 'p');
  const end = core.firstDayOf(p.ordinal + 1);
  return firstEpochMsOfDayNumber(zone, end);
}

/**
 * Whether the instant `epochMs` falls in `p` on the local calendar of `zone`.
 *
 * @example
 * ```ts
 * isEpochMsInPeriod(parsePeriod('month', '2025-03'), 'America/New_York', Date.parse('2025-04-01T03:59Z')); // true
 * ```
 */
export function isEpochMsInPeriod(p: Period, zone: ZoneInput, epochMs: number): boolean {
  const core = requirePeriod(p, 'p');
  return core.ordinalOf(dayNumberFromEpochMs(zone, epochMs)) === p.ordinal;
}

/**
 * The ordinal written for an invalid instant under `{ invalid: 'sentinel' }`: -2**31, the zone layer's
 * INVALID_DAY_NUMBER, which no unit's ordinal reaches.
 */
export const INVALID_ORDINAL = INVALID_DAY_NUMBER;

/**
 * The ordinal in `unit` of each instant, on the local calendar of `zone`, into an Int32Array: the zone layer's
 * bulk local-day conversion, then one tight pass from day numbers to ordinals in the same array. NaN or
 * out-of-range instants throw a KalendsRangeError naming the index, or with `{ invalid: 'sentinel' }` give
 * {@link INVALID_ORDINAL}.
 *
 * @example
 * ```ts
 * const q = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
 * ordinalFromEpochMsBulk(q, 'America/New_York', Float64Array.of(Date.parse('2025-10-01T12:00Z'))); // Int32Array [8104] (FY2026-Q1)
 * ```
 */
export function ordinalFromEpochMsBulk(
  unit: UnitInput,
  zone: ZoneInput,
  epochMs: ArrayLike<number>,
  out?: Int32Array,
  options?: BulkOptions,
): Int32Array {
  const u = toUnit(unit);
  const core = coreOf(u)!;
  const src = requireNumberArray('epochMs', epochMs);
  const sentinel = readBulkOptions(options);
  const n = src.length;
  const result = requireOutArray('out', out, Int32Array, n);
  // Large inputs in a zone with rules: one pass over a per-UTC-day table of the unit's ordinals.
  if (n >= BULK_TABLE_MIN_ELEMENTS) {
    const direct = localDayFunctionBulk(zone, src, result, sentinel, ordinalDayFunction(core), INVALID_ORDINAL);
    if (direct) return direct;
  }
  const days = dayNumbersOfCheckedInstants(zone, src, result, sentinel);
  if (!sentinel) {
    ordinalsFromDaysKernel(core, days, days, n);
    return days;
  }
  const invalid: number[] = [];
  for (let i = 0; i < n; i++) {
    if (days[i] === INVALID_DAY_NUMBER) {
      invalid.push(i);
      days[i] = 0;
    }
  }
  ordinalsFromDaysKernel(core, days, days, n);
  for (const i of invalid) days[i] = INVALID_ORDINAL;
  return days;
}

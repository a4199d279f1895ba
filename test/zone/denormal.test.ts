/**
 * Issue 12 (defect 9, found by the adversarial suite): a negative denormal instant such as -5e-324 lies within
 * millisecond Math.floor(-5e-324) = -1 (docs/design.md, "Input rules": a fractional instant is read as the
 * millisecond that holds it), so its local day is 1969-12-31 in UTC (day -1). Scaling the raw value to days
 * underflows to -0 and gave day 0 (1970-01-01), scalar and bulk.
 *
 * Expected values from ECMA-262 Date: Date.UTC(1969, 11, 31) / 86,400,000 = -1. The zones are at offset 0 at the
 * epoch (IANA tz: Africa/Abidjan has kept GMT since 1912); Europe/London is not (British Standard Time, +01:00 from
 * 1968 to 1971), where -1 ms is already on 1970-01-01 local.
 */
import { describe, expect, it } from 'vitest';
import { dayNumberFromEpochMs, dayNumberFromEpochMsBulk, wallFieldsFromEpochMs, periodFromEpochMs } from '../../src/index.js';

const TINY = -5e-324;
const DAY_BEFORE_EPOCH = Date.UTC(1969, 11, 31) / 86_400_000;

describe('a negative denormal instant lies on the day before the epoch', () => {
  it('dayNumberFromEpochMs and its bulk form', () => {
    expect(DAY_BEFORE_EPOCH).toBe(-1);
    for (const zone of ['UTC', 'Africa/Abidjan', '+00:00']) {
      expect(dayNumberFromEpochMs(zone, TINY), zone).toBe(DAY_BEFORE_EPOCH);
      expect(Array.from(dayNumberFromEpochMsBulk(zone, new Float64Array([TINY, 0, -1]))), zone).toEqual([DAY_BEFORE_EPOCH, 0, DAY_BEFORE_EPOCH]);
    }
  });

  it('Europe/London was at +01:00 at the epoch (IANA tz), so -1 ms is on 1970-01-01 there', () => {
    expect(dayNumberFromEpochMs('Europe/London', TINY)).toBe(0);
    expect(dayNumberFromEpochMs('Europe/London', -3_600_001)).toBe(DAY_BEFORE_EPOCH);
  });

  it('wallFieldsFromEpochMs and periodFromEpochMs read the millisecond -1', () => {
    expect(wallFieldsFromEpochMs('UTC', TINY)).toEqual(wallFieldsFromEpochMs('UTC', -1));
    expect(periodFromEpochMs('day', 'UTC', TINY)).toEqual(periodFromEpochMs('day', 'UTC', -1));
  });
});

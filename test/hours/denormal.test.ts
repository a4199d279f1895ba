/**
 * Issue 12 (defect 9 and the adversarial suite's finding): a negative denormal instant such as -5e-324 is a
 * fraction of a millisecond before the epoch. The hours layer floors fractional instants (docs/design.md, "Input
 * rules"), so -5e-324 is read as -1 ms, on 1969-12-31, not on day 0: dividing the raw value by 86,400,000
 * underflows to -0 and puts it on 1970-01-01. The business-day functions take day numbers, which are integers: they
 * refuse -5e-324 as a fraction, quoting it.
 *
 * The weekdays come from ECMA-262 (Date.UTC(1969, 11, 31) is a Wednesday, Date.UTC(1970, 0, 1) a Thursday).
 */
import { describe, expect, it } from 'vitest';
import { KalendsRangeError, countBusinessDays, defineCalendar, defineHours, isBusinessDay, isOpen, isOpenBulk, nextBusinessDay, shiftBusinessDays, valueDayNumberOfEpochMs } from '../../src/index.js';

const calendar = defineCalendar({ id: 'around-the-epoch', weekend: ['saturday', 'sunday'], years: { from: 1960, until: 1990 }, holidays: [] });
// Open all day on Wednesdays only, so that 1969-12-31 (a Wednesday) is open and 1970-01-01 (a Thursday) is not.
const hours = defineHours({ zone: 'UTC', calendar, years: { from: 1960, until: 1990 }, week: { wednesday: [{ open: '00:00', close: '24:00' }] }, cutoffs: { noon: '12:00' } });
const TINY = -5e-324;

describe('a negative denormal instant is the millisecond before the epoch (floored), not day 0', () => {
  it('the weekdays of the two days (ECMA-262 Date)', () => {
    expect(new Date(Date.UTC(1969, 11, 31)).getUTCDay()).toBe(3);
    expect(new Date(Date.UTC(1970, 0, 1)).getUTCDay()).toBe(4);
  });

  it('isOpen and isOpenBulk answer for 1969-12-31 (open), as for -1 ms', () => {
    expect(isOpen(hours, -1)).toBe(true);
    expect(isOpen(hours, 0)).toBe(false);
    expect(isOpen(hours, TINY)).toBe(true);
    expect(Array.from(isOpenBulk(hours, [TINY, -1, 0]))).toEqual([1, 1, 0]);
  });

  it('valueDayNumberOfEpochMs gives what -1 ms gives', () => {
    expect(valueDayNumberOfEpochMs(hours, TINY, 'noon')).toBe(valueDayNumberOfEpochMs(hours, -1, 'noon'));
  });

  it('the business-day functions refuse it as a fraction of a day, quoting it', () => {
    for (const call of [() => isBusinessDay(calendar, TINY), () => shiftBusinessDays(calendar, TINY, 1), () => nextBusinessDay(calendar, TINY)]) {
      expect(call).toThrow(KalendsRangeError);
      expect(call).toThrow(/^dayNumber: .*-5e-324/);
    }
    expect(() => countBusinessDays(calendar, TINY, 10)).toThrow(/^start: .*-5e-324/);
  });
});

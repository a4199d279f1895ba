import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  dayNumberFromYearDay,
  dayNumberFromYmd,
  dayNumberFromYmdBulk,
  dayOfMonthOfDayNumber,
  dayOfYearOfDayNumber,
  dayCountOfMonth,
  dayCountOfYear,
  isLeapYear,
  KalendsRangeError,
  KalendsTypeError,
  MAX_DAY_NUMBER,
  MAX_YEAR,
  MIN_DAY_NUMBER,
  MIN_YEAR,
  monthOfDayNumber,
  weekdayOfDayNumber,
  yearOfDayNumber,
  ymdFromDayNumber,
  ymdFromDayNumberBulk,
} from '../../src/index.js';

const SEED = 20261202;
const anyDay = fc.integer({ min: MIN_DAY_NUMBER, max: MAX_DAY_NUMBER });

describe('civil: day numbers and year/month/day', () => {
  // ECMA-262 "Time Values and Time Range": time value 0 is 1970-01-01T00:00:00Z, the epoch of day numbers.
  it('day 0 is 1970-01-01 (ECMA-262 time value epoch)', () => {
    expect(dayNumberFromYmd(1970, 1, 1)).toBe(0);
    expect(ymdFromDayNumber(0)).toEqual({ year: 1970, month: 1, day: 1 });
  });

  // ECMA-262 Date.UTC is an outside reference over its whole range (±100,000,000 days).
  it('agrees with Date.UTC for random dates in the ECMAScript range', () => {
    fc.assert(
      fc.property(fc.integer({ min: -100_000_000, max: 100_000_000 }), (dn) => {
        const d = new Date(dn * 86_400_000);
        expect(ymdFromDayNumber(dn)).toEqual({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() });
        expect(weekdayOfDayNumber(dn)).toBe(d.getUTCDay() === 0 ? 7 : d.getUTCDay());
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });

  it('round-trips every day number over the whole supported range (property)', () => {
    fc.assert(
      fc.property(anyDay, (dn) => {
        const { year, month, day } = ymdFromDayNumber(dn);
        expect(dayNumberFromYmd(year, month, day)).toBe(dn);
      }),
      { seed: SEED, numRuns: 20000 },
    );
  });

  it('round-trips at the edges of the range and of every 400-year era boundary tested', () => {
    for (const dn of [MIN_DAY_NUMBER, MIN_DAY_NUMBER + 1, -719468, -719469, -1, 0, 1, 11016, 11017, MAX_DAY_NUMBER - 1, MAX_DAY_NUMBER]) {
      const { year, month, day } = ymdFromDayNumber(dn);
      expect(dayNumberFromYmd(year, month, day)).toBe(dn);
    }
    expect(ymdFromDayNumber(MIN_DAY_NUMBER)).toEqual({ year: MIN_YEAR, month: 1, day: 1 });
    expect(ymdFromDayNumber(MAX_DAY_NUMBER)).toEqual({ year: MAX_YEAR, month: 12, day: 31 });
  });

  it('consecutive day numbers are consecutive dates, and the weekday advances by one (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: MIN_DAY_NUMBER, max: MAX_DAY_NUMBER - 1 }), (dn) => {
        const a = ymdFromDayNumber(dn);
        const b = ymdFromDayNumber(dn + 1);
        if (a.day < dayCountOfMonth(a.year, a.month)) expect(b).toEqual({ ...a, day: a.day + 1 });
        else if (a.month < 12) expect(b).toEqual({ year: a.year, month: a.month + 1, day: 1 });
        else expect(b).toEqual({ year: a.year + 1, month: 1, day: 1 });
        expect(weekdayOfDayNumber(dn + 1)).toBe((weekdayOfDayNumber(dn) % 7) + 1);
      }),
      { seed: SEED, numRuns: 20000 },
    );
  });

  it('every day from 1600-01-01 to 2400-12-31 and around both range ends steps through the calendar one day at a time', () => {
    const windows: Array<[number, number]> = [
      [dayNumberFromYmd(1600, 1, 1), dayNumberFromYmd(2400, 12, 31)],
      [MIN_DAY_NUMBER, MIN_DAY_NUMBER + 150_000],
      [MAX_DAY_NUMBER - 150_000, MAX_DAY_NUMBER],
    ];
    for (const [from, to] of windows) {
      let { year, month, day } = ymdFromDayNumber(from);
      for (let dn = from + 1; dn <= to; dn++) {
        if (day < dayCountOfMonth(year, month)) day++;
        else if (month < 12) (month++, (day = 1));
        else (year++, (month = 1), (day = 1));
        const got = ymdFromDayNumber(dn);
        if (got.year !== year || got.month !== month || got.day !== day) {
          expect(got).toEqual({ year, month, day });
        }
        if (dayNumberFromYmd(year, month, day) !== dn) expect(dayNumberFromYmd(year, month, day)).toBe(dn);
      }
    }
  });

  it('year, month and day-of-month accessors agree with ymdFromDayNumber (property)', () => {
    fc.assert(
      fc.property(anyDay, (dn) => {
        const ymd = ymdFromDayNumber(dn);
        expect([yearOfDayNumber(dn), monthOfDayNumber(dn), dayOfMonthOfDayNumber(dn)]).toEqual([ymd.year, ymd.month, ymd.day]);
        expect(dayNumberFromYearDay(ymd.year, dayOfYearOfDayNumber(dn))).toBe(dn);
      }),
      { seed: SEED, numRuns: 5000 },
    );
  });

  // Reference library: @js-temporal/polyfill (the ECMA-262 Temporal proposal's reference implementation).
  it('agrees with @js-temporal/polyfill PlainDate on random dates (dayOfWeek, dayOfYear, dayCountOfMonth, inLeapYear)', () => {
    const epoch = Temporal.PlainDate.from('1970-01-01');
    fc.assert(
      fc.property(fc.integer({ min: -100_000_000, max: 100_000_000 }), (dn) => {
        const t = epoch.add({ days: dn });
        const ymd = ymdFromDayNumber(dn);
        expect(ymd).toEqual({ year: t.year, month: t.month, day: t.day });
        expect(weekdayOfDayNumber(dn)).toBe(t.dayOfWeek);
        expect(dayOfYearOfDayNumber(dn)).toBe(t.dayOfYear);
        expect(dayCountOfMonth(ymd.year, ymd.month)).toBe(t.daysInMonth);
        expect(dayCountOfYear(ymd.year)).toBe(t.daysInYear);
        expect(isLeapYear(ymd.year)).toBe(t.inLeapYear);
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });

  // Gregorian leap-year rule (Inter gravissimas, 1582; ISO 8601-1:2019, 3.2.1): 1900 common, 2000 leap.
  it('leap years follow the Gregorian rule', () => {
    expect([1600, 1700, 1800, 1900, 2000, 2024, 2100, 2400].map(isLeapYear)).toEqual([
      true, false, false, false, true, true, false, true,
    ]);
    expect(dayCountOfMonth(2024, 2)).toBe(29);
    expect(dayCountOfMonth(2023, 2)).toBe(28);
    expect(dayCountOfYear(1900)).toBe(365);
  });

  it('bulk conversions equal the scalar ones (property)', () => {
    fc.assert(
      fc.property(fc.array(anyDay, { maxLength: 200 }), (days) => {
        const dns = Int32Array.from(days);
        const { years, months, days: doms } = ymdFromDayNumberBulk(dns);
        days.forEach((dn, i) => expect({ year: years[i], month: months[i], day: doms[i] }).toEqual(ymdFromDayNumber(dn)));
        expect(Array.from(dayNumberFromYmdBulk(years, months, doms))).toEqual(days);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});

describe('civil: bad input', () => {
  const cases: Array<[string, () => unknown, RegExp]> = [
    ['month 13', () => dayNumberFromYmd(2025, 13, 1), /month: expected an integer from 1 to 12, got 13/],
    ['month 0', () => dayNumberFromYmd(2025, 0, 1), /month: .* got 0/],
    ['30 February', () => dayNumberFromYmd(2024, 2, 30), /day: expected an integer from 1 to 29, got 30/],
    ['29 February in a common year', () => dayNumberFromYmd(2023, 2, 29), /day: expected an integer from 1 to 28, got 29/],
    ['31 April', () => dayNumberFromYmd(2025, 4, 31), /got 31/],
    ['fractional day', () => dayNumberFromYmd(2025, 1, 1.5), /got 1.5/],
    ['NaN year', () => dayNumberFromYmd(Number.NaN, 1, 1), /year: .* got NaN/],
    ['year past the range', () => dayNumberFromYmd(MAX_YEAR + 1, 1, 1), /year: expected an integer from -271821 to 275760, got 275761/],
    ['year before the range', () => isLeapYear(MIN_YEAR - 1), /got -271822/],
    ['day number past the range', () => ymdFromDayNumber(MAX_DAY_NUMBER + 1), /dayNumber: .* got 100000110/],
    ['infinite day number', () => weekdayOfDayNumber(Number.POSITIVE_INFINITY), /got Infinity/],
    ['day of year 366 in a common year', () => dayNumberFromYearDay(2025, 366), /dayOfYear: .* got 366/],
    ['mismatched bulk lengths', () => dayNumberFromYmdBulk([2025], [1, 2], [1]), /same length, got 1, 2, 1/],
    ['bad element in bulk input', () => ymdFromDayNumberBulk([0, Number.NaN]), /dayNumbers\[1\]: .* got NaN/],
  ];
  for (const [name, fn, message] of cases) {
    it(`rejects ${name} with a KalendsRangeError naming the value`, () => {
      expect(fn).toThrow(KalendsRangeError);
      expect(fn).toThrow(message);
    });
  }

  it('rejects a string year with a KalendsTypeError', () => {
    expect(() => dayNumberFromYmd('2025' as unknown as number, 1, 1)).toThrow(KalendsTypeError);
    expect(() => dayNumberFromYmd('2025' as unknown as number, 1, 1)).toThrow(/year: .* got "2025"/);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  dayNumberFromIsoWeekDate,
  dayNumberFromYmd,
  easterDayNumberOfYear,
  isoWeekDateFromDayNumber,
  isoWeekCountOfYear,
  julianEasterDayNumberOfYear,
  KalendsRangeError,
  MAX_DAY_NUMBER,
  MIN_DAY_NUMBER,
  weekdayOfDayNumber,
  ymdFromDayNumber,
} from '../../src/index.js';

const SEED = 7_2026;
const iso = (dn: number) => {
  const w = isoWeekDateFromDayNumber(dn);
  return `${w.weekYear}-W${String(w.week).padStart(2, '0')}-${w.weekday}`;
};
const ymd = (dn: number) => {
  const { year, month, day } = ymdFromDayNumber(dn);
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
};

describe('ISO 8601 week dates', () => {
  // Week-date facts at year boundaries. Sources: Markus Kuhn, "A summary of the international standard date and
  // time notation" (week 1 of 1997 runs 1996-12-30 to 1997-01-05); ISO 8601 week-date summaries giving
  // 2006-12-31 = 2006-W52-7 and 2012-12-31 in week 1 of 2013; the others "from memory", each also checked below
  // against @js-temporal/polyfill.
  const examples: Array<[string, string]> = [
    ['1996-12-30', '1997-W01-1'],
    ['1997-01-05', '1997-W01-7'],
    ['2006-12-31', '2006-W52-7'],
    ['2012-12-31', '2013-W01-1'],
    ['2005-01-01', '2004-W53-6'],
    ['2005-01-02', '2004-W53-7'],
    ['2007-01-01', '2007-W01-1'],
    ['2008-12-28', '2008-W52-7'],
    ['2008-12-29', '2009-W01-1'],
    ['2009-12-31', '2009-W53-4'],
    ['2010-01-03', '2009-W53-7'],
    ['2010-01-04', '2010-W01-1'],
    ['2020-12-31', '2020-W53-4'],
    ['2021-01-03', '2020-W53-7'],
    ['2022-12-31', '2022-W52-6'],
  ];
  for (const [date, week] of examples) {
    it(`${date} is ${week}, both ways`, () => {
      const [y, m, d] = date.split('-').map(Number) as [number, number, number];
      const dn = dayNumberFromYmd(y, m, d);
      expect(iso(dn)).toBe(week);
      const [, wy, ww, wd] = /^(\d+)-W(\d+)-(\d)$/.exec(week)!.map(Number) as [number, number, number, number];
      expect(dayNumberFromIsoWeekDate(wy, ww, wd)).toBe(dn);
      const t = Temporal.PlainDate.from(date);
      expect([t.yearOfWeek, t.weekOfYear, t.dayOfWeek]).toEqual([wy, ww, wd]);
    });
  }

  it('agrees with @js-temporal/polyfill weekOfYear and yearOfWeek on random dates', () => {
    const epoch = Temporal.PlainDate.from('1970-01-01');
    fc.assert(
      fc.property(fc.integer({ min: -100_000_000, max: 100_000_000 }), (dn) => {
        const t = epoch.add({ days: dn });
        const w = isoWeekDateFromDayNumber(dn);
        expect([w.weekYear, w.week, w.weekday]).toEqual([t.yearOfWeek, t.weekOfYear, t.dayOfWeek]);
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });

  it('week dates round-trip over the whole range (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: MIN_DAY_NUMBER + 7, max: MAX_DAY_NUMBER - 7 }), (dn) => {
        const w = isoWeekDateFromDayNumber(dn);
        expect(dayNumberFromIsoWeekDate(w.weekYear, w.week, w.weekday)).toBe(dn);
        expect(w.weekday).toBe(weekdayOfDayNumber(dn));
      }),
      { seed: SEED, numRuns: 20000 },
    );
  });

  // ISO 8601-1:2019 3.1.1.23 / 3.2.2: week 01 contains the year's first Thursday (4 January), so a week-year has
  // 53 weeks exactly when it starts on a Thursday, or is a leap year starting on a Wednesday; it then spans 371 days.
  it('52/53-week counts agree with the ISO 8601 rule and with the span between week-one Mondays (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -271_000, max: 275_000 }), (y) => {
        const jan1 = weekdayOfDayNumber(dayNumberFromYmd(y, 1, 1));
        const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
        const expected = jan1 === 4 || (jan1 === 3 && leap) ? 53 : 52;
        expect(isoWeekCountOfYear(y)).toBe(expected);
        const span = dayNumberFromIsoWeekDate(y + 1, 1, 1) - dayNumberFromIsoWeekDate(y, 1, 1);
        expect(span).toBe(expected * 7);
      }),
      { seed: SEED, numRuns: 5000 },
    );
  });

  // "In every 400 years there are 71 years with 53 weeks" (ISO week date summaries; follows from the rule above).
  it('has 71 long years in every 400-year cycle', () => {
    let long = 0;
    for (let y = 2000; y < 2400; y++) if (isoWeekCountOfYear(y) === 53) long++;
    expect(long).toBe(71);
  });

  it('rejects week 53 in a 52-week year, week 0 and weekday 8', () => {
    expect(() => dayNumberFromIsoWeekDate(2021, 53, 1)).toThrow(/week: expected an integer from 1 to 52, got 53/);
    expect(() => dayNumberFromIsoWeekDate(2021, 0, 1)).toThrow(KalendsRangeError);
    expect(() => dayNumberFromIsoWeekDate(2021, 1, 8)).toThrow(/weekday: .* got 8/);
  });
});

/**
 * An independent Gregorian computus: the Astronomical Society of South Australia's "Easter Dating Method"
 * (Ronald W. Mallen), valid 1583–4099, transcribed from its published description.
 */
function assaEaster(year: number): string {
  const firstDig = Math.floor(year / 100);
  const remain19 = year % 19;
  let temp = Math.floor((firstDig - 15) / 2) + 202 - 11 * remain19;
  if ([21, 24, 25, 27, 28, 29, 30, 31, 32, 34, 35, 38].includes(firstDig)) temp -= 1;
  else if ([33, 36, 37, 39, 40].includes(firstDig)) temp -= 2;
  temp %= 30;
  let tA = temp + 21;
  if (temp === 29) tA -= 1;
  if (temp === 28 && remain19 > 10) tA -= 1;
  const tB = (tA - 19) % 7;
  let tC = (40 - firstDig) % 4;
  if (tC === 3) tC += 1;
  if (tC > 1) tC += 1;
  const t = year % 100;
  const tD = (t + Math.floor(t / 4)) % 7;
  const tE = ((20 - tB - tC - tD) % 7) + 1;
  const d = tA + tE;
  return d > 31 ? `${year}-04-${String(d - 31).padStart(2, '0')}` : `${year}-03-${String(d).padStart(2, '0')}`;
}

/** Gauss's Easter algorithm for the Julian calendar (M = 15, N = 6), returning a Julian-calendar month/day. */
function gaussJulianEaster(year: number): [number, number] {
  const a = year % 19;
  const b = year % 4;
  const c = year % 7;
  const d = (19 * a + 15) % 30;
  const e = (2 * b + 4 * c + 6 * d + 6) % 7;
  const day = 22 + d + e;
  return day > 31 ? [4, day - 31] : [3, day];
}

describe('Easter computus', () => {
  // ASSA Easter table values as quoted from its 1700–2299 list: 1700-04-11, 1891-03-29, 1981-04-19, 2135-04-03.
  // Extremes from memory: earliest 22 March (1818, 2285), latest 25 April (1943, 2038). Recent years from memory.
  const table: Array<[number, string]> = [
    [1700, '1700-04-11'], [1818, '1818-03-22'], [1891, '1891-03-29'], [1943, '1943-04-25'], [1981, '1981-04-19'],
    [2000, '2000-04-23'], [2008, '2008-03-23'], [2011, '2011-04-24'], [2019, '2019-04-21'], [2020, '2020-04-12'],
    [2024, '2024-03-31'], [2025, '2025-04-20'], [2026, '2026-04-05'], [2027, '2027-03-28'], [2038, '2038-04-25'],
    [2135, '2135-04-03'], [2285, '2285-03-22'],
  ];
  for (const [year, date] of table) {
    it(`Gregorian Easter ${year} is ${date}`, () => expect(ymd(easterDayNumberOfYear(year))).toBe(date));
  }

  it('agrees with the ASSA Easter Dating Method for every year 1583–4099', () => {
    for (let y = 1583; y <= 4099; y++) expect(ymd(easterDayNumberOfYear(y))).toBe(assaEaster(y));
  });

  it('is always a Sunday between 22 March and 25 April (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1583, max: 275_760 }), (y) => {
        const dn = easterDayNumberOfYear(y);
        expect(weekdayOfDayNumber(dn)).toBe(7);
        expect(dn).toBeGreaterThanOrEqual(dayNumberFromYmd(y, 3, 22));
        expect(dn).toBeLessThanOrEqual(dayNumberFromYmd(y, 4, 25));
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  // Orthodox Easter dates, from memory: 2021-05-02, 2022-04-24, 2023-04-16, 2024-05-05, 2025-04-20, 2026-04-12.
  const orthodox: Array<[number, string]> = [
    [2021, '2021-05-02'], [2022, '2022-04-24'], [2023, '2023-04-16'], [2024, '2024-05-05'], [2025, '2025-04-20'], [2026, '2026-04-12'],
  ];
  for (const [year, date] of orthodox) {
    it(`Julian-computus Easter ${year} is ${date} (Gregorian date)`, () => expect(ymd(julianEasterDayNumberOfYear(year))).toBe(date));
  }

  it("agrees with Gauss's Julian algorithm, shifted to the Gregorian calendar with @js-temporal/polyfill, 1583–2500", () => {
    for (let y = 1583; y <= 2500; y++) {
      const [m, d] = gaussJulianEaster(y);
      // From 1 March (Julian) of year y on, the Julian calendar trails the Gregorian by
      // floor(y/100) - floor(y/400) - 2 days (10 days in 1582–1700, 13 days in 1900–2100).
      const lag = Math.floor(y / 100) - Math.floor(y / 400) - 2;
      const expected = Temporal.PlainDate.from({ year: y, month: m, day: d }).add({ days: lag });
      expect(ymd(julianEasterDayNumberOfYear(y))).toBe(expected.toString());
    }
  });

  it('rejects years before the computus is offered', () => {
    expect(() => easterDayNumberOfYear(1582)).toThrow(/year: expected an integer from 1583 to 275760, got 1582/);
    expect(() => julianEasterDayNumberOfYear(100)).toThrow(KalendsRangeError);
  });
});

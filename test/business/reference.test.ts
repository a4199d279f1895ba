/**
 * Reference tests: the bundled calendars against the tables their authorities publish, and the business-day
 * conventions against the definitions in ISDA 2006 section 4.12.
 */
import { describe, expect, it } from 'vitest';
import {
  adjustDayNumber,
  calendarFromName,
  countBusinessDays,
  isBusinessDay,
  listHolidays,
  nextBusinessDay,
  previousBusinessDay,
} from '../../src/business/index.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

const dn = (iso: string): number => {
  const [y, m, d] = iso.split('-').map(Number) as [number, number, number];
  return dayNumberFromYmd(y, m, d);
};
const yearStart = (y: number) => dayNumberFromYmd(y, 1, 1);
const observedIn = (cal: string, year: number) =>
  listHolidays(cal, yearStart(year), yearStart(year + 1)).map((h) => `${h.date} ${h.name}`);

/*
 * U.S. Office of Personnel Management, "Federal Holidays" tables (opm.gov/policy-data-oversight/pay-leave/
 * federal-holidays/), the observed dates for employees with a Monday-Friday workweek. The OPM pages themselves
 * were not reachable from here: the 2022 table is checked against a reprint of it (USA Today, "New Year's Day
 * holiday will be observed on New Year's Eve 2021", December 2021, listing all eleven 2022 dates), the 2023 table
 * against a verbatim copy of the OPM page with its footnotes (5 U.S.C. 6103(b); E.O. 11582 section 3(a)), and the
 * 2024 dates against secondary listings; the other years are from memory of the OPM tables and agree with the
 * statutory rule. OPM lists New Year's Day of year Y+1 in the year-Y+1 table even when it is observed on
 * 31 December of year Y; here a holiday is listed in the year in which it is observed.
 */
const OPM: Readonly<Record<number, readonly string[]>> = {
  2020: ['2020-01-01', '2020-01-20', '2020-02-17', '2020-05-25', '2020-07-03', '2020-09-07', '2020-10-12', '2020-11-11', '2020-11-26', '2020-12-25'],
  2021: ['2021-01-01', '2021-01-18', '2021-02-15', '2021-05-31', '2021-06-18', '2021-07-05', '2021-09-06', '2021-10-11', '2021-11-11', '2021-11-25', '2021-12-24', '2021-12-31'],
  2022: ['2022-01-17', '2022-02-21', '2022-05-30', '2022-06-20', '2022-07-04', '2022-09-05', '2022-10-10', '2022-11-11', '2022-11-24', '2022-12-26'],
  2023: ['2023-01-02', '2023-01-16', '2023-02-20', '2023-05-29', '2023-06-19', '2023-07-04', '2023-09-04', '2023-10-09', '2023-11-10', '2023-11-23', '2023-12-25'],
  2024: ['2024-01-01', '2024-01-15', '2024-02-19', '2024-05-27', '2024-06-19', '2024-07-04', '2024-09-02', '2024-10-14', '2024-11-11', '2024-11-28', '2024-12-25'],
  2025: ['2025-01-01', '2025-01-20', '2025-02-17', '2025-05-26', '2025-06-19', '2025-07-04', '2025-09-01', '2025-10-13', '2025-11-11', '2025-11-27', '2025-12-25'],
  2026: ['2026-01-01', '2026-01-19', '2026-02-16', '2026-05-25', '2026-06-19', '2026-07-03', '2026-09-07', '2026-10-12', '2026-11-11', '2026-11-26', '2026-12-25'],
  2027: ['2027-01-01', '2027-01-18', '2027-02-15', '2027-05-31', '2027-06-18', '2027-07-05', '2027-09-06', '2027-10-11', '2027-11-11', '2027-11-25', '2027-12-24', '2027-12-31'],
};

describe('us-federal against the OPM federal holiday tables 2020-2027', () => {
  for (const [year, dates] of Object.entries(OPM)) {
    it(`observed holidays of ${year} (OPM table; 5 U.S.C. 6103(b), E.O. 11582)`, () => {
      expect(listHolidays('us-federal', yearStart(+year), yearStart(+year + 1)).map((h) => h.date)).toEqual(dates);
    });
  }

  it('New Year\'s Day 2022 (a Saturday) is observed on Friday 2021-12-31 (OPM 2022 table, footnote *)', () => {
    const h = listHolidays('us-federal', dn('2021-12-31'), dn('2022-01-01'));
    expect(h).toHaveLength(1);
    expect(h[0]).toMatchObject({ date: '2021-12-31', actualDate: '2022-01-01', name: "New Year's Day", moved: true });
    expect(isBusinessDay('us-federal', dn('2021-12-31'))).toBe(false);
    // and it is not listed again in 2022
    expect(observedIn('us-federal', 2022).some((s) => s.includes("New Year's Day"))).toBe(false);
  });

  it('2022-12-26 and 2023-01-02 are the Monday holidays for Sunday Christmas and New Year (OPM 2022, 2023 tables)', () => {
    const h = listHolidays('us-federal', dn('2022-12-20'), dn('2023-01-10'));
    expect(h.map((x) => [x.date, x.actualDate, x.name])).toEqual([
      ['2022-12-26', '2022-12-25', 'Christmas Day'],
      ['2023-01-02', '2023-01-01', "New Year's Day"],
    ]);
  });

  it('Juneteenth: none before 2021 (Pub. L. 117-17); observed Monday 2022-06-20 (OPM 2022 table)', () => {
    expect(observedIn('us-federal', 2020).some((s) => s.includes('Juneteenth'))).toBe(false);
    expect(observedIn('us-federal', 2021)).toContain('2021-06-18 Juneteenth National Independence Day');
    expect(observedIn('us-federal', 2022)).toContain('2022-06-20 Juneteenth National Independence Day');
  });

  it('Veterans Day was the fourth Monday of October 1971-1977 (Pub. L. 90-363) and 11 November from 1978 (Pub. L. 94-97)', () => {
    expect(observedIn('us-federal', 1975)).toContain('1975-10-27 Veterans Day');
    expect(observedIn('us-federal', 1978)).toContain('1978-11-10 Veterans Day'); // 11 November 1978 was a Saturday
    // The Birthday of Martin Luther King, Jr. starts in 1986 (Pub. L. 98-144): third Monday, 20 January 1986.
    expect(observedIn('us-federal', 1985).some((s) => s.includes('King'))).toBe(false);
    expect(observedIn('us-federal', 1986)).toContain('1986-01-20 Birthday of Martin Luther King, Jr.');
  });
});

/*
 * UK government, "UK bank holidays", England and Wales (gov.uk/bank-holidays, machine-readable at
 * gov.uk/bank-holidays.json). 2018-2025 are copied from a copy of that JSON document (titles and dates, events
 * 2018-01-01 .. 2025-12-26). 2026 and 2027 are computed from the statutory rules (Banking and Financial Dealings
 * Act 1971 Schedule 1 and the substitute-day practice) and cross-checked against press reports of the dates the
 * government announced (Boxing Day 2026 substitute on 28 December; 27 and 28 December 2027 substitutes); the
 * gov.uk page itself for those years was not seen here.
 */
const GOV_UK: Readonly<Record<number, readonly string[]>> = {
  2018: ['2018-01-01', '2018-03-30', '2018-04-02', '2018-05-07', '2018-05-28', '2018-08-27', '2018-12-25', '2018-12-26'],
  2019: ['2019-01-01', '2019-04-19', '2019-04-22', '2019-05-06', '2019-05-27', '2019-08-26', '2019-12-25', '2019-12-26'],
  2020: ['2020-01-01', '2020-04-10', '2020-04-13', '2020-05-08', '2020-05-25', '2020-08-31', '2020-12-25', '2020-12-28'],
  2021: ['2021-01-01', '2021-04-02', '2021-04-05', '2021-05-03', '2021-05-31', '2021-08-30', '2021-12-27', '2021-12-28'],
  2022: ['2022-01-03', '2022-04-15', '2022-04-18', '2022-05-02', '2022-06-02', '2022-06-03', '2022-08-29', '2022-09-19', '2022-12-26', '2022-12-27'],
  2023: ['2023-01-02', '2023-04-07', '2023-04-10', '2023-05-01', '2023-05-08', '2023-05-29', '2023-08-28', '2023-12-25', '2023-12-26'],
  2024: ['2024-01-01', '2024-03-29', '2024-04-01', '2024-05-06', '2024-05-27', '2024-08-26', '2024-12-25', '2024-12-26'],
  2025: ['2025-01-01', '2025-04-18', '2025-04-21', '2025-05-05', '2025-05-26', '2025-08-25', '2025-12-25', '2025-12-26'],
  2026: ['2026-01-01', '2026-04-03', '2026-04-06', '2026-05-04', '2026-05-25', '2026-08-31', '2026-12-25', '2026-12-28'],
  2027: ['2027-01-01', '2027-03-26', '2027-03-29', '2027-05-03', '2027-05-31', '2027-08-30', '2027-12-27', '2027-12-28'],
};

describe('england-and-wales against the gov.uk bank holiday list 2018-2027', () => {
  for (const [year, dates] of Object.entries(GOV_UK)) {
    const how = +year >= 2026 ? 'computed from the statutory rules, cross-checked' : 'gov.uk/bank-holidays.json';
    it(`bank holidays of ${year} (${how})`, () => {
      expect(listHolidays('england-and-wales', yearStart(+year), yearStart(+year + 1)).map((h) => h.date)).toEqual(dates);
    });
  }

  it('names the substitute days as gov.uk does (2022: Boxing Day 26, Christmas Day substitute 27 December)', () => {
    const h = listHolidays('england-and-wales', dn('2022-12-25'), dn('2023-01-03'));
    expect(h.map((x) => [x.date, x.name, x.moved])).toEqual([
      ['2022-12-26', 'Boxing Day', false],
      ['2022-12-27', 'Christmas Day', true],
      ['2023-01-02', "New Year's Day", true],
    ]);
  });

  it('the one-off proclamation days carry the gov.uk titles (2022, 2023)', () => {
    expect(observedIn('england-and-wales', 2022)).toContain('2022-09-19 Bank Holiday for the State Funeral of Queen Elizabeth II');
    expect(observedIn('england-and-wales', 2023)).toContain('2023-05-08 Bank holiday for the coronation of King Charles III');
    expect(observedIn('england-and-wales', 2022)).toContain('2022-06-03 Platinum Jubilee bank holiday');
  });

  it('2012: spring bank holiday moved to 4 June and the Diamond Jubilee on 5 June (Royal Proclamation; gov.uk list)', () => {
    expect(listHolidays('england-and-wales', dn('2012-05-01'), dn('2012-07-01')).map((h) => h.date)).toEqual([
      '2012-05-07',
      '2012-06-04',
      '2012-06-05',
    ]);
  });
});

/*
 * European Central Bank: press release "Long-term calendar for TARGET closing days" (14 December 2000): from 2002
 * until further notice TARGET is closed, in addition to Saturdays and Sundays, on New Year's Day, Good Friday,
 * Easter Monday, 1 May, Christmas Day and 26 December; the same list on the ECB's TARGET2 calendar page. The
 * per-year dates below apply that list (Easter dates: Good Friday 2024-03-29, 2025-04-18, 2026-04-03).
 */
const ECB: Readonly<Record<number, readonly string[]>> = {
  2024: ['2024-01-01', '2024-03-29', '2024-04-01', '2024-05-01', '2024-12-25', '2024-12-26'],
  2025: ['2025-01-01', '2025-04-18', '2025-04-21', '2025-05-01', '2025-12-25', '2025-12-26'],
  2026: ['2026-01-01', '2026-04-03', '2026-04-06', '2026-05-01', '2026-12-25', '2026-12-26'],
};

describe('euro-t2 against the ECB T2 closing days 2024-2026', () => {
  for (const [year, dates] of Object.entries(ECB)) {
    it(`closing days of ${year} (ECB press release 14 December 2000; TARGET2 calendar page)`, () => {
      expect(listHolidays('euro-t2', yearStart(+year), yearStart(+year + 1)).map((h) => h.date)).toEqual(dates);
      for (const d of dates) expect(isBusinessDay('euro-t2', dn(d))).toBe(false);
    });
  }

  it('has no substitute days: 1 May 2027 on a Saturday is not moved (ECB: closing days are the dates themselves)', () => {
    expect(isBusinessDay('euro-t2', dn('2027-04-30'))).toBe(true);
    expect(isBusinessDay('euro-t2', dn('2027-05-03'))).toBe(true);
  });

  it('the Easter closure of 2024 runs from Good Friday to Easter Monday: T2 reopens Tuesday 2 April (ECB closing days)', () => {
    expect(nextBusinessDay('euro-t2', dn('2024-03-28'))).toBe(dn('2024-04-02'));
    expect(previousBusinessDay('euro-t2', dn('2024-04-02'))).toBe(dn('2024-03-28'));
  });

  it('counts 256 T2 operating days in 2024: 262 weekdays (counted with Date.UTC) minus the 6 closing days, all on weekdays', () => {
    let weekdays = 0;
    for (let d = Date.UTC(2024, 0, 1); d < Date.UTC(2025, 0, 1); d += 86_400_000) {
      const w = new Date(d).getUTCDay();
      if (w !== 0 && w !== 6) weekdays++;
    }
    expect(weekdays).toBe(262);
    expect(countBusinessDays('euro-t2', yearStart(2024), yearStart(2025))).toBe(weekdays - 6);
  });
});

describe('business-day conventions, ISDA 2006 Definitions section 4.12', () => {
  // ISDA 2006 4.12(a) "Following": the date is postponed to the first following day that is a Business Day.
  it('following: Saturday 2026-01-31 -> Monday 2026-02-02', () => {
    expect(adjustDayNumber('us-federal', dn('2026-01-31'), 'following')).toBe(dn('2026-02-02'));
  });
  // 4.12(b) "Modified Following": ... unless that day falls in the next calendar month, in which case the date is
  // brought forward to the first preceding day that is a Business Day.
  it('modified following: Saturday 2026-01-31 -> Friday 2026-01-30 (Monday is in February)', () => {
    expect(adjustDayNumber('us-federal', dn('2026-01-31'), 'modified-following')).toBe(dn('2026-01-30'));
    expect(adjustDayNumber('us-federal', dn('2026-01-17'), 'modified-following')).toBe(dn('2026-01-20')); // MLK Monday skipped
  });
  // 4.12(c) "Preceding": the date is brought forward to the first preceding day that is a Business Day.
  it('preceding: Monday 2025-05-26 (Memorial Day) -> Friday 2025-05-23', () => {
    expect(adjustDayNumber('us-federal', dn('2025-05-26'), 'preceding')).toBe(dn('2025-05-23'));
  });
  // Modified Preceding (common practice, not an ISDA 2006 term): preceding, unless that is in the previous month.
  it('modified preceding: Sunday 2025-06-01 -> Monday 2025-06-02 (Friday is in May)', () => {
    expect(adjustDayNumber('us-federal', dn('2025-06-01'), 'modified-preceding')).toBe(dn('2025-06-02'));
    expect(adjustDayNumber('us-federal', dn('2025-06-01'), 'preceding')).toBe(dn('2025-05-30'));
  });
  it('none leaves the date alone; a business day is never moved by any convention', () => {
    expect(adjustDayNumber('us-federal', dn('2026-01-31'), 'none')).toBe(dn('2026-01-31'));
    for (const c of ['following', 'modified-following', 'preceding', 'modified-preceding', 'none'] as const) {
      expect(adjustDayNumber('us-federal', dn('2026-01-30'), c)).toBe(dn('2026-01-30'));
    }
  });
  it('modified following at a month end in England and Wales: Sunday 2027-02-28 -> Friday 2027-02-26', () => {
    expect(adjustDayNumber('england-and-wales', dn('2027-02-28'), 'modified-following')).toBe(dn('2027-02-26'));
  });
});

describe('bundled calendars carry their source and caution', () => {
  for (const name of ['us-federal', 'england-and-wales', 'euro-t2']) {
    it(`${name} names a legal source and the caution`, () => {
      const cal = calendarFromName(name);
      expect(cal.source).toBeTruthy();
      expect(cal.caution).toMatch(/verify/i);
      expect(cal.caution).toMatch(/proclamation/i);
    });
  }
});

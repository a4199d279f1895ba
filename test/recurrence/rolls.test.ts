/**
 * Roll dates as frequency rules: IMM_DATES, CREDIT_ROLL_DATES and MONTH_END_DATES.
 *
 * Sources:
 * - [IMM] The IMM dates are the third Wednesday of March, June, September and December, that is the Wednesday
 *   between the 15th and the 21st (the definition the futures exchanges publish, as restated in public
 *   references on IMM dates).
 * - [CME 2024] CME Group, "SR3 and TBF3 exposure periods" (article, 2024, cmegroup.com/articles/2024): the table of
 *   "currently listed components" gives the start and end dates of each Three-Month SOFR futures reference period,
 *   which the contract specification defines as running from the third Wednesday of a month to the third
 *   Wednesday three months later: Wednesday 16 October 2024, 20 November 2024, 18 December 2024, 15 January 2025,
 *   19 February 2025, 19 March 2025, 18 June 2025, 17 September 2025, 17 December 2025. The quarterly ones are the
 *   IMM dates of 2024 and 2025.
 * - [Index 2021, 2023] The credit index administrator's published roll tables (IHS Markit news, "CDX/iTraxx Index
 *   Tranches: Sept 2021 Roll Dates", 2 September 2021, and the September 2023 table): index roll date 20-Sep-2021
 *   with tranche roll date 24-Sep-2021, and 20-Sep-2023 with 26-Sep-2023, the tranche date "+4 Bus. Days" after.
 * - [ISDA 2015] ISDA, "Amending when single name CDS roll to new on-the-run contracts" (7 July 2015): the
 *   quarterly roll dates are March 20, June 20, September 20 and December 20, and the semi-annual roll "will
 *   go-live on December 21, 2015" (20 December 2015 was a Sunday: the 20th adjusted to the following business day).
 * - The adjustment of the 20th by the following business-day convention (2006 ISDA Definitions, section 4.12) is
 *   common practice for standard credit default swaps (from memory); a confirmation names its own calendar.
 * - Month ends: Temporal.PlainDate's daysInMonth.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  CREDIT_ROLL_DATES,
  IMM_DATES,
  MONTH_END_DATES,
  dayNumberFromYmd,
  defineCalendar,
  defineRule,
  defineSchedule,
  describeRule,
  formatPlainDate,
  listOccurrenceDayNumbers,
  shiftBusinessDays,
} from '../../src/index.js';

const SEED = 20261205;
const list = (definition: Parameters<typeof defineRule>[0], start: string, end: string) =>
  listOccurrenceDayNumbers(defineRule(definition), start, end).map(formatPlainDate);

/** The third Wednesday of a month, by Temporal (dayOfWeek: 1 = Monday .. 7 = Sunday). */
function thirdWednesday(year: number, month: number): string {
  const first = Temporal.PlainDate.from({ year, month, day: 1 });
  return first.add({ days: ((3 - first.dayOfWeek + 7) % 7) + 14 }).toString();
}

/** A date moved to the following Monday to Friday day, by Temporal. */
function followingWeekday(iso: string): string {
  let d = Temporal.PlainDate.from(iso);
  while (d.dayOfWeek > 5) d = d.add({ days: 1 });
  return d.toString();
}

const QUARTER_MONTHS = [3, 6, 9, 12];
const weekdaysOnly = defineCalendar({ id: 'weekdays', holidays: [] });

describe('IMM_DATES [IMM]', () => {
  it('the dates CME Group published for 2024 and 2025 [CME 2024]; each year also the third Wednesday by Temporal', () => {
    expect(list(IMM_DATES, '2024-10-01', '2026-01-01')).toEqual(['2024-12-18', '2025-03-19', '2025-06-18', '2025-09-17', '2025-12-17']);
    // The serial months of the same table: the third Wednesday of every month, the same rule spread monthly.
    expect(list({ kind: 'monthly', on: { weekday: 'wednesday', nth: 3 } }, '2024-10-01', '2025-03-01')).toEqual([
      '2024-10-16', '2024-11-20', '2024-12-18', '2025-01-15', '2025-02-19',
    ]);
  });

  it('2024, 2025 and 2026 (December 2024 to December 2025 as published [CME 2024], the others from memory), each the third Wednesday by Temporal and between the 15th and the 21st', () => {
    const dates = list(IMM_DATES, '2024-01-01', '2027-01-01');
    expect(dates).toEqual([
      '2024-03-20', '2024-06-19', '2024-09-18', '2024-12-18',
      '2025-03-19', '2025-06-18', '2025-09-17', '2025-12-17',
      '2026-03-18', '2026-06-17', '2026-09-16', '2026-12-16',
    ]);
    expect(dates).toEqual([2024, 2025, 2026].flatMap((y) => QUARTER_MONTHS.map((m) => thirdWednesday(y, m))));
    for (const d of dates) {
      const pd = Temporal.PlainDate.from(d);
      expect([pd.dayOfWeek, pd.day >= 15 && pd.day <= 21]).toEqual([3, true]);
    }
  });

  it('any range of years, against Temporal (fast-check)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -2000, max: 4000 }), fc.integer({ min: 1, max: 12 }), (year, years) => {
        const start = Temporal.PlainDate.from({ year, month: 1, day: 1 });
        const got = listOccurrenceDayNumbers(defineRule(IMM_DATES), start.toString(), start.add({ years }).toString()).map(formatPlainDate);
        const want: string[] = [];
        for (let y = year; y < year + years; y++) for (const m of QUARTER_MONTHS) want.push(Temporal.PlainDate.from(thirdWednesday(y, m)).toString());
        expect(got).toEqual(want);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('rolls a swap schedule from IMM date to IMM date; the definition is frozen data', () => {
    const s = defineSchedule({ start: '2025-03-19', end: '2026-03-18', step: defineRule(IMM_DATES) });
    expect(s.periods.map((p) => [formatPlainDate(p.unadjustedStart), p.stub])).toEqual([
      ['2025-03-19', undefined],
      ['2025-06-18', undefined],
      ['2025-09-17', undefined],
      ['2025-12-17', undefined],
    ]);
    expect(Object.isFrozen(IMM_DATES) && Object.isFrozen(IMM_DATES.on)).toBe(true);
    expect(describeRule(defineRule(IMM_DATES))).toBe('IMM dates: the third Wednesday of March, June, September and December, every quarter');
  });
});

describe('CREDIT_ROLL_DATES [ISDA 2015]', () => {
  it('the roll dates the index administrator published, 20-Sep-2021 and 20-Sep-2023, and their tranche dates 4 business days on [Index 2021, 2023]', () => {
    const adjusted = { ...CREDIT_ROLL_DATES, calendar: weekdaysOnly, convention: 'following' as const };
    expect(list(adjusted, '2021-09-01', '2021-10-01')).toEqual(['2021-09-20']);
    expect(list(adjusted, '2023-09-01', '2023-10-01')).toEqual(['2023-09-20']);
    expect(formatPlainDate(shiftBusinessDays(weekdaysOnly, dayNumberFromYmd(2021, 9, 20), 4))).toBe('2021-09-24');
    expect(formatPlainDate(shiftBusinessDays(weekdaysOnly, dayNumberFromYmd(2023, 9, 20), 4))).toBe('2023-09-26');
  });

  it('unadjusted: the 20th of March, June, September and December', () => {
    expect(list(CREDIT_ROLL_DATES, '2025-01-01', '2027-01-01')).toEqual([
      '2025-03-20', '2025-06-20', '2025-09-20', '2025-12-20',
      '2026-03-20', '2026-06-20', '2026-09-20', '2026-12-20',
    ]);
  });

  it('adjusted by the following convention: 20 December 2015, a Sunday, is 21 December 2015, the date ISDA published', () => {
    const adjusted = { ...CREDIT_ROLL_DATES, calendar: weekdaysOnly, convention: 'following' as const };
    expect(list(adjusted, '2015-12-01', '2016-01-01')).toEqual(['2015-12-21']);
    const got = list(adjusted, '2024-01-01', '2027-01-01');
    expect(got).toEqual([2024, 2025, 2026].flatMap((y) => QUARTER_MONTHS.map((m) => followingWeekday(`${y}-${String(m).padStart(2, '0')}-20`))));
    // Those that moved: 2025-09-20 and 2025-12-20 (Saturdays), 2026-06-20 (Saturday), 2026-09-20 and 2026-12-20 (Sundays).
    expect(got.filter((d) => !d.endsWith('-20'))).toEqual(['2025-09-22', '2025-12-22', '2026-06-22', '2026-09-21', '2026-12-21']);
  });
});

describe('MONTH_END_DATES', () => {
  it('the last day of every month, and of every third month, against Temporal daysInMonth', () => {
    const got = list(MONTH_END_DATES, '2023-11-01', '2024-04-01');
    expect(got).toEqual(['2023-11-30', '2023-12-31', '2024-01-31', '2024-02-29', '2024-03-31']);
    for (const d of got) expect(Temporal.PlainDate.from(d).day).toBe(Temporal.PlainDate.from(d).daysInMonth);
    expect(list({ ...MONTH_END_DATES, kind: 'quarterly', month: 2 }, '2024-01-01', '2025-01-01')).toEqual(['2024-02-29', '2024-05-31', '2024-08-31', '2024-11-30']);
  });
});

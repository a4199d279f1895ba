import { Temporal } from 'temporal-polyfill';
import { type BusinessCalendar, defineCalendar, defineRule, formatPlainDate, listHolidays, occurrenceDayNumberBulk, parsePlainDate } from '../src/index.js';
import type { Benchmark } from './harness.js';

/** Holidays of `calendar` in [start, end) as ISO strings: what a user's loop would check against. */
function holidaySet(calendar: BusinessCalendar | string, start: string, end: string): Set<string> {
  return new Set(listHolidays(calendar as BusinessCalendar, parsePlainDate(start), parsePlainDate(end)).map((h) => formatPlainDate(h.dayNumber)));
}

/**
 * The business month ends of 1900-2100 (2,412 months) on a calendar with a Saturday-Sunday weekend and the eleven
 * holiday rules of the present United States federal calendar (5 U.S.C. 6103), observed on the Friday before a
 * Saturday and the Monday after a Sunday, applied to every year 1899-2101. The bundled 'us-federal' calendar
 * starts in 1971 (the Uniform Monday Holiday Act), so this is a synthetic calendar for timing, not a historical
 * one. Two of its holidays move month ends: New Year's Day observed on 31 December, and Memorial Day on 31 May.
 */
function businessMonthEnds(): Benchmark {
  const calendar = defineCalendar({
    id: 'bench-present-us-federal-rules',
    years: { from: 1899, until: 2101 },
    observance: { saturday: 'previous-non-weekend-day', sunday: 'next-non-weekend-day' },
    holidays: [
      { id: 'new-year', name: "New Year's Day", kind: 'fixed', month: 1, day: 1 },
      { id: 'king', name: 'Birthday of Martin Luther King, Jr.', kind: 'nth-weekday', month: 1, weekday: 'monday', nth: 3 },
      { id: 'washington', name: "Washington's Birthday", kind: 'nth-weekday', month: 2, weekday: 'monday', nth: 3 },
      { id: 'memorial', name: 'Memorial Day', kind: 'nth-weekday', month: 5, weekday: 'monday', nth: 'last' },
      { id: 'juneteenth', name: 'Juneteenth National Independence Day', kind: 'fixed', month: 6, day: 19 },
      { id: 'independence', name: 'Independence Day', kind: 'fixed', month: 7, day: 4 },
      { id: 'labor', name: 'Labor Day', kind: 'nth-weekday', month: 9, weekday: 'monday', nth: 1 },
      { id: 'columbus', name: 'Columbus Day', kind: 'nth-weekday', month: 10, weekday: 'monday', nth: 2 },
      { id: 'veterans', name: 'Veterans Day', kind: 'fixed', month: 11, day: 11 },
      { id: 'thanksgiving', name: 'Thanksgiving Day', kind: 'nth-weekday', month: 11, weekday: 'thursday', nth: 4 },
      { id: 'christmas', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 },
    ],
  });
  const rule = defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar });
  const holidays = holidaySet(calendar, '1899-12-01', '2101-02-01');
  const months = (2100 - 1900 + 1) * 12;
  return {
    name: 'recurrence-business-month-ends',
    description: 'last business day of every month, 1900-2100 (weekends + 11 observed holidays, present US federal rules)',
    elements: months,
    unit: 'produced date',
    // One run of ours takes well under a millisecond: many rounds, so that the median is the steady state of
    // both cases rather than the first calls and timer noise (the same rounds for the baseline).
    rounds: 41,
    ours: { name: 'kalends occurrenceDayNumberBulk', run: () => occurrenceDayNumberBulk(rule, '1900-01-01', '2101-01-01') },
    baselines: [
      {
        name: 'Temporal.PlainDate loop (temporal-polyfill)',
        run: () => {
          const out: string[] = [];
          for (let y = 1900; y <= 2100; y++) {
            for (let m = 1; m <= 12; m++) {
              let d = Temporal.PlainDate.from({ year: y, month: m, day: 1 }).add({ months: 1 }).subtract({ days: 1 });
              while (d.dayOfWeek > 5 || holidays.has(d.toString())) d = d.subtract({ days: 1 });
              out.push(d.toString());
            }
          }
          return out;
        },
      },
    ],
  };
}

/** Every business day of 2000-2050 on the bundled US federal calendar (12,8xx dates over 18,628 days). */
function usFederalBusinessDays(): Benchmark {
  const rule = defineRule({ kind: 'business-days', calendar: 'us-federal' });
  const holidays = holidaySet('us-federal', '2000-01-01', '2051-01-01');
  const produced = occurrenceDayNumberBulk(rule, '2000-01-01', '2051-01-01').length;
  return {
    name: 'recurrence-us-federal-business-days',
    description: 'every business day of 2000-2050 on the US federal calendar',
    elements: produced,
    unit: 'produced date',
    rounds: 21,
    ours: { name: 'kalends occurrenceDayNumberBulk', run: () => occurrenceDayNumberBulk(rule, '2000-01-01', '2051-01-01') },
    baselines: [
      {
        name: 'Temporal.PlainDate loop (temporal-polyfill)',
        run: () => {
          const out: string[] = [];
          const end = Temporal.PlainDate.from('2051-01-01');
          for (let d = Temporal.PlainDate.from('2000-01-01'); Temporal.PlainDate.compare(d, end) < 0; d = d.add({ days: 1 })) {
            if (d.dayOfWeek <= 5 && !holidays.has(d.toString())) out.push(d.toString());
          }
          return out;
        },
      },
    ],
  };
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [businessMonthEnds, usFederalBusinessDays];

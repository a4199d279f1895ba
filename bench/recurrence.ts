import { Temporal } from 'temporal-polyfill';
import {
  type BusinessCalendar,
  dayNumberFromYmd,
  defineCalendar,
  defineRule,
  defineSchedule,
  formatPlainDate,
  listHolidays,
  occurrenceDayNumberBulk,
  parsePlainDate,
} from '../src/index.js';
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

const SWAPS = 64;
const SWAP_QUARTERS = 120;

/**
 * A plain loop that builds the same 30-year quarterly swap schedule as defineSchedule does below, on integers: the
 * dates rolled back from the end date (month arithmetic, the day kept where the month has it), modified following
 * on a Saturday-Sunday weekend and a holiday table (one byte per day), fixing two business days before each
 * adjusted start, payment two business days after each adjusted end, and Actual/360 of the adjusted dates. No
 * checks, no objects, no Date: numbers into a Float64Array. It is the loop a user would write with a precomputed
 * holiday table.
 */
function plainSwap(endY: number, endM: number, endD: number, quarters: number, closed: Uint8Array, base: number, out: Float64Array): number {
  let w = 0;
  let nextStart = 0;
  for (let k = 0; k < quarters; k++) {
    // Period k counted back from the end: [roll(k + 1), roll(k)).
    const b = k === 0 ? adjustPlain(endY, endM - 1 - 3 * k, endD, closed, base) : nextStart;
    const a = adjustPlain(endY, endM - 1 - 3 * (k + 1), endD, closed, base);
    nextStart = a;
    let fix = a;
    for (let n = 0; n < 2; ) if (isOpenPlain(--fix, closed, base)) n++;
    let pay = b;
    for (let n = 0; n < 2; ) if (isOpenPlain(++pay, closed, base)) n++;
    out[w++] = a;
    out[w++] = b;
    out[w++] = fix;
    out[w++] = pay;
    out[w++] = (b - a) / 360;
  }
  return w;
}

/** Monday to Friday and not in the holiday table (1970-01-01, day 0, was a Thursday). */
function isOpenPlain(dn: number, closed: Uint8Array, base: number): boolean {
  return (dn + 3) % 7 < 5 && closed[dn - base] === 0;
}

/**
 * The date `m0` months (0-based, may be negative or past 11) from January of year `y`, day `d` or the month's last,
 * moved by modified following: integer civil arithmetic (days from 1970-01-01 by the proleptic Gregorian formula).
 */
function adjustPlain(y: number, m0: number, d: number, closed: Uint8Array, base: number): number {
  const yy = y + Math.floor(m0 / 12);
  const mm = m0 - 12 * Math.floor(m0 / 12) + 1;
  const leap = (yy % 4 === 0 && yy % 100 !== 0) || yy % 400 === 0;
  const len = mm === 2 ? (leap ? 29 : 28) : mm === 4 || mm === 6 || mm === 9 || mm === 11 ? 30 : 31;
  const day = d < len ? d : len;
  const yAdj = mm <= 2 ? yy - 1 : yy;
  const era = Math.floor(yAdj / 400);
  const yoe = yAdj - era * 400;
  const doy = Math.floor((153 * (mm + (mm > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const raw = era * 146_097 + yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy - 719_468;
  let t = raw;
  while (!isOpenPlain(t, closed, base)) t++;
  if (day + (t - raw) <= len) return t;
  t = raw;
  while (!isOpenPlain(t, closed, base)) t--;
  return t;
}

/**
 * 30-year quarterly swap schedules (issue 15: under 50 µs per schedule): defineSchedule with payment and fixing
 * dates and Actual/360 fractions on the bundled US federal calendar, modified following, against the plain loop
 * above on the same calendar's holidays. 64 schedules per run, effective dates a week apart from 2026-01-15.
 */
function swapSchedules(): Benchmark {
  const starts = Array.from({ length: SWAPS }, (_, i) => dayNumberFromYmd(2026, 1, 15) + 7 * i);
  const ymd = starts.map((s) => {
    const d = new Date(s * 86_400_000);
    return [d.getUTCFullYear() + 30, d.getUTCMonth() + 1, d.getUTCDate()] as const;
  });
  const base = dayNumberFromYmd(2025, 1, 1);
  const closed = new Uint8Array(dayNumberFromYmd(2058, 1, 1) - base);
  for (const h of listHolidays('us-federal', base, base + closed.length)) closed[h.dayNumber - base] = 1;
  const options = starts.map((s, i) => ({
    start: s,
    end: dayNumberFromYmd(ymd[i]![0], ymd[i]![1], ymd[i]![2]),
    step: { months: 3 },
    calendar: 'us-federal',
    convention: 'modified-following' as const,
    payment: { businessDaysAfter: 2, from: 'end' as const },
    fixing: { businessDaysBefore: 2 },
    dayCount: { convention: 'actual-360' as const, accrueOn: 'adjusted' as const },
  }));
  // Check once that both build the same periods.
  const check = new Float64Array(5 * SWAP_QUARTERS);
  for (let i = 0; i < SWAPS; i++) {
    const s = defineSchedule(options[i]!);
    plainSwap(ymd[i]![0], ymd[i]![1], ymd[i]![2], SWAP_QUARTERS, closed, base, check);
    if (s.periods.length !== SWAP_QUARTERS) throw new Error(`swap ${i}: ${s.periods.length} periods`);
    s.periods.forEach((p, j) => {
      const k = 5 * (SWAP_QUARTERS - 1 - j);
      const got = [p.adjustedStart, p.adjustedEnd, p.fixingDayNumber, p.paymentDayNumber, p.yearFraction!.value];
      if (got.some((v, x) => v !== check[k + x])) throw new Error(`swap ${i} period ${j}: ${got.join(' ')} against ${Array.from(check.subarray(k, k + 5)).join(' ')}`);
    });
  }
  const out = new Float64Array(5 * SWAP_QUARTERS);
  return {
    name: 'recurrence-swap-schedule',
    description: '30-year quarterly swap schedules with payment, fixing and Actual/360 fractions (us-federal, modified following)',
    elements: SWAPS,
    unit: 'schedule',
    rounds: 31,
    // The goal is an absolute time, and this machine's speed drifts with its load: judge the median of 3 processes.
    processes: 3,
    ours: {
      name: 'kalends defineSchedule (payment, fixing, dayCount)',
      run: () => {
        let n = 0;
        for (let i = 0; i < SWAPS; i++) n += defineSchedule(options[i]!).periods.length;
        return n;
      },
    },
    baselines: [
      {
        name: 'plain loop (integers, holiday table, no checks)',
        run: () => {
          let n = 0;
          for (let i = 0; i < SWAPS; i++) n += plainSwap(ymd[i]![0], ymd[i]![1], ymd[i]![2], SWAP_QUARTERS, closed, base, out);
          return n;
        },
      },
    ],
  };
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [businessMonthEnds, usFederalBusinessDays, swapSchedules];

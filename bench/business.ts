import { Temporal } from 'temporal-polyfill';
import { countBusinessDays, isBusinessDay, listHolidays, shiftBusinessDays } from '../src/business/index.js';
import { dayNumberFromYmd } from '../src/civil/index.js';
import { type Benchmark, seededRandom } from './harness.js';

const N = 1_000_000;
const CALENDAR = 'us-federal';
const FIRST = dayNumberFromYmd(1971, 1, 1);

/** The calendar's observed holidays over 1971..2150 as ISO strings, for the naive loops. */
function holidaySet(): Set<string> {
  return new Set(listHolidays(CALENDAR, FIRST, dayNumberFromYmd(2151, 1, 1)).map((h) => h.date));
}

/** Naive: is a Temporal.PlainDate a business day (weekday and not in the holiday set)? */
function naiveIsBusiness(d: Temporal.PlainDate, holidays: Set<string>): boolean {
  return d.dayOfWeek <= 5 && !holidays.has(d.toString());
}

function plainDate(dayNumber: number): Temporal.PlainDate {
  return Temporal.PlainDate.from('1970-01-01').add({ days: dayNumber });
}

/** Adds 1..500 business days to 1M random dates (1980..2100), United States federal calendar. */
function businessShift(): Benchmark {
  const rnd = seededRandom(505);
  const start = dayNumberFromYmd(1980, 1, 1);
  const span = dayNumberFromYmd(2100, 1, 1) - start;
  const days = new Int32Array(N);
  const amounts = new Int32Array(N);
  for (let i = 0; i < N; i++) {
    days[i] = start + Math.floor(rnd() * span);
    amounts[i] = 1 + Math.floor(rnd() * 500);
  }
  const out = new Int32Array(N);
  const sample = 300;
  const holidays = holidaySet();
  return {
    name: 'business-shift',
    description: 'add 1..500 business days to random dates (us-federal)',
    elements: N,
    unit: 'date',
    ours: {
      name: 'kalends shiftBusinessDays',
      run: () => {
        for (let i = 0; i < N; i++) out[i] = shiftBusinessDays(CALENDAR, days[i]!, amounts[i]!);
        return out[N - 1];
      },
    },
    baselines: [
      {
        name: 'day-by-day loop with isBusinessDay',
        elements: 20_000,
        run: () => {
          let acc = 0;
          for (let i = 0; i < 20_000; i++) {
            let d = days[i]!;
            for (let left = amounts[i]!; left > 0; ) if (isBusinessDay(CALENDAR, ++d)) left--;
            acc += d;
          }
          return acc;
        },
      },
      {
        name: 'day-by-day loop over Temporal.PlainDate (temporal-polyfill)',
        elements: sample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < sample; i++) {
            let d = plainDate(days[i]!);
            for (let left = amounts[i]!; left > 0; ) {
              d = d.add({ days: 1 });
              if (naiveIsBusiness(d, holidays)) left--;
            }
            acc += d.day;
          }
          return acc;
        },
      },
    ],
  };
}

/** Counts business days over 1M random spans of up to 30 years (starting 1971..2070). */
function businessCount(): Benchmark {
  const rnd = seededRandom(5050);
  const span = dayNumberFromYmd(2070, 1, 1) - FIRST;
  const starts = new Int32Array(N);
  const ends = new Int32Array(N);
  for (let i = 0; i < N; i++) {
    starts[i] = FIRST + Math.floor(rnd() * span);
    ends[i] = starts[i]! + Math.floor(rnd() * 30 * 365.25);
  }
  const out = new Int32Array(N);
  const sample = 40;
  const holidays = holidaySet();
  return {
    name: 'business-count',
    description: 'count business days over random spans of up to 30 years (us-federal)',
    elements: N,
    unit: 'span',
    rounds: 3,
    ours: {
      name: 'kalends countBusinessDays',
      run: () => {
        for (let i = 0; i < N; i++) out[i] = countBusinessDays(CALENDAR, starts[i]!, ends[i]!);
        return out[N - 1];
      },
    },
    baselines: [
      {
        name: 'day-by-day loop with isBusinessDay',
        elements: 400,
        run: () => {
          let acc = 0;
          for (let i = 0; i < 400; i++) for (let d = starts[i]!; d < ends[i]!; d++) if (isBusinessDay(CALENDAR, d)) acc++;
          return acc;
        },
      },
      {
        name: 'day-by-day loop over Temporal.PlainDate (temporal-polyfill)',
        elements: sample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < sample; i++) {
            const end = plainDate(ends[i]!);
            for (let d = plainDate(starts[i]!); Temporal.PlainDate.compare(d, end) < 0; d = d.add({ days: 1 })) {
              if (naiveIsBusiness(d, holidays)) acc++;
            }
          }
          return acc;
        },
      },
    ],
  };
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [businessShift, businessCount];

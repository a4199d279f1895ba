import { Temporal } from 'temporal-polyfill';
import {
  adjustDayNumberBulk,
  countBusinessDays,
  countBusinessDaysBulk,
  isBusinessDay,
  isBusinessDayBulk,
  listHolidays,
  shiftBusinessDays,
  shiftBusinessDaysBulk,
} from '../src/business/index.js';
import { dayNumberFromYmd } from '../src/civil/index.js';
import { type Benchmark, seededRandom } from './harness.js';

const N = 1_000_000;
const CALENDAR = 'us-federal';
const FIRST = dayNumberFromYmd(1971, 1, 1);
/** The floors' tables cover 1971..2150, more than any day a case reads or produces. */
const END = dayNumberFromYmd(2151, 1, 1);

/**
 * The floors: the calendar precomputed as plain tables over 1971..2150, the cheapest honest way to answer each
 * question. `prefix[i]` = business days in [FIRST, FIRST + i) (a count is two loads), `days[k]` = the kth business
 * day (a shift is three loads), `flags[i]` = 1 for a business day (a byte a day), `following[i]` = the
 * modified-following adjustment of each day. Built once, outside every timed run, from the library's single forms.
 */
interface Floors {
  readonly prefix: Int32Array;
  readonly days: Int32Array;
  readonly flags: Uint8Array;
  readonly following: Int32Array;
}
let floors: Floors | undefined;
function floorTables(): Floors {
  if (floors) return floors;
  const n = END - FIRST;
  const prefix = new Int32Array(n + 1);
  const flags = new Uint8Array(n);
  const list: number[] = [];
  for (let i = 0; i < n; i++) {
    prefix[i] = list.length;
    if (isBusinessDay(CALENDAR, FIRST + i)) {
      flags[i] = 1;
      list.push(FIRST + i);
    }
  }
  prefix[n] = list.length;
  const following = new Int32Array(n);
  const inside = dayNumberFromYmd(2150, 12, 1);
  for (let i = 0; i < inside - FIRST; i++) following[i] = adjustDayNumberBulk(CALENDAR, [FIRST + i], 'modified-following')[0]!;
  floors = { prefix, days: Int32Array.from(list), flags, following };
  return floors;
}

// ---- floor kernels (small functions of their own, as V8 wants) --------------------------------------------------

function prefixCountLoop(prefix: Int32Array, base: number, a: Int32Array, b: Int32Array, out: Int32Array, n: number): number {
  for (let i = 0; i < n; i++) out[i] = prefix[b[i]! - base]! - prefix[a[i]! - base]!;
  return out[n - 1]!;
}

/** A shift by a binary search over the prefix array: the first day whose prefix exceeds the target rank. */
function prefixSearchShiftLoop(prefix: Int32Array, base: number, d: Int32Array, m: Int32Array, out: Int32Array, n: number): number {
  const last = prefix.length - 1;
  for (let i = 0; i < n; i++) {
    const k = prefix[d[i]! - base + 1]! + m[i]! - 1; // m > 0 in this benchmark
    let lo = 0;
    let hi = last;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (prefix[mid + 1]! > k) hi = mid;
      else lo = mid + 1;
    }
    out[i] = base + lo;
  }
  return out[n - 1]!;
}

function prefixTableShiftLoop(prefix: Int32Array, days: Int32Array, base: number, d: Int32Array, m: Int32Array, out: Int32Array, n: number): number {
  for (let i = 0; i < n; i++) out[i] = days[prefix[d[i]! - base + 1]! + m[i]! - 1]!;
  return out[n - 1]!;
}

function flagLoop(flags: Uint8Array, base: number, d: Int32Array, out: Uint8Array, n: number): number {
  for (let i = 0; i < n; i++) out[i] = flags[d[i]! - base]!;
  return out[n - 1]!;
}

function lookupLoop(table: Int32Array, base: number, d: Int32Array, out: Int32Array, n: number): number {
  for (let i = 0; i < n; i++) out[i] = table[d[i]! - base]!;
  return out[n - 1]!;
}

// ---- the lean Temporal baseline: fields and integer math, no text per element ----------------------------------

/** Observed holidays over 1971..2150 as integer keys year * 10000 + month * 100 + day. */
function holidayKeys(): Set<number> {
  return new Set(listHolidays(CALENDAR, FIRST, END).map((h) => Number(h.date.replaceAll('-', ''))));
}

const EPOCH = Temporal.PlainDate.from({ year: 1970, month: 1, day: 1 });
function plainDate(dayNumber: number): Temporal.PlainDate {
  return EPOCH.add({ days: dayNumber });
}
function temporalIsBusiness(d: Temporal.PlainDate, holidays: Set<number>): boolean {
  return d.dayOfWeek <= 5 && !holidays.has(d.year * 10000 + d.month * 100 + d.day);
}

/** Throws when a case's answers differ from the floor's (checked once, before anything is timed). */
function sameAnswers(what: string, a: ArrayLike<number>, b: ArrayLike<number>, n: number): void {
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) throw new Error(`${what}: element ${i} differs (${a[i]} vs ${b[i]})`);
}

interface ShiftData {
  readonly days: Int32Array;
  readonly amounts: Int32Array;
}
function shiftData(): ShiftData {
  const rnd = seededRandom(505);
  const start = dayNumberFromYmd(1980, 1, 1);
  const span = dayNumberFromYmd(2100, 1, 1) - start;
  const days = new Int32Array(N);
  const amounts = new Int32Array(N);
  for (let i = 0; i < N; i++) {
    days[i] = start + Math.floor(rnd() * span);
    amounts[i] = 1 + Math.floor(rnd() * 500);
  }
  return { days, amounts };
}

interface CountData {
  readonly starts: Int32Array;
  readonly ends: Int32Array;
}
function countData(): CountData {
  const rnd = seededRandom(5050);
  const span = dayNumberFromYmd(2070, 1, 1) - FIRST;
  const starts = new Int32Array(N);
  const ends = new Int32Array(N);
  for (let i = 0; i < N; i++) {
    starts[i] = FIRST + Math.floor(rnd() * span);
    ends[i] = starts[i]! + Math.floor(rnd() * 30 * 365.25);
  }
  return { starts, ends };
}

/** Adds 1..500 business days to 1M random dates (1980..2100), one call per date. */
function businessShift(): Benchmark {
  const { days, amounts } = shiftData();
  const t = floorTables();
  const out = new Int32Array(N);
  const check = new Int32Array(N);
  const sample = 300;
  const holidays = holidayKeys();
  for (let i = 0; i < N; i++) out[i] = shiftBusinessDays(CALENDAR, days[i]!, amounts[i]!);
  prefixSearchShiftLoop(t.prefix, FIRST, days, amounts, check, N);
  sameAnswers('business-shift', out, check, N);
  return {
    name: 'business-shift',
    description: 'add 1..500 business days to random dates (us-federal), one call per date',
    elements: N,
    unit: 'date',
    processes: 3,
    ours: {
      name: 'kalends shiftBusinessDays',
      run: () => {
        for (let i = 0; i < N; i++) out[i] = shiftBusinessDays(CALENDAR, days[i]!, amounts[i]!);
        return out[N - 1];
      },
    },
    baselines: [
      { name: 'floor: binary search over a precomputed prefix array', run: () => Reflect.apply(prefixSearchShiftLoop, undefined, [t.prefix, FIRST, days, amounts, check, N]) },
      {
        name: 'day-by-day loop over a byte-per-day array',
        run: () => {
          const flags = t.flags;
          let acc = 0;
          for (let i = 0; i < N; i++) {
            let x = days[i]! - FIRST;
            for (let left = amounts[i]!; left > 0; ) if (flags[++x] === 1) left--;
            acc += x;
          }
          return acc;
        },
      },
      {
        name: 'day-by-day Temporal.PlainDate loop, fields and integer keys (temporal-polyfill)',
        elements: sample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < sample; i++) {
            let d = plainDate(days[i]!);
            for (let left = amounts[i]!; left > 0; ) {
              d = d.add({ days: 1 });
              if (temporalIsBusiness(d, holidays)) left--;
            }
            acc += d.day;
          }
          return acc;
        },
      },
    ],
  };
}

/** The same shifts in one bulk call. */
function businessShiftBulk(): Benchmark {
  const { days, amounts } = shiftData();
  const t = floorTables();
  const out = new Int32Array(N);
  const check = new Int32Array(N);
  shiftBusinessDaysBulk(CALENDAR, days, amounts, out);
  prefixTableShiftLoop(t.prefix, t.days, FIRST, days, amounts, check, N);
  sameAnswers('business-shift-bulk', out, check, N);
  return {
    name: 'business-shift-bulk',
    description: 'add 1..500 business days to random dates (us-federal), one bulk call',
    elements: N,
    unit: 'date',
    processes: 3,
    ours: { name: 'kalends shiftBusinessDaysBulk', run: () => shiftBusinessDaysBulk(CALENDAR, days, amounts, out)[N - 1] },
    baselines: [{ name: 'floor: precomputed prefix and business-day arrays (3 loads)', run: () => Reflect.apply(prefixTableShiftLoop, undefined, [t.prefix, t.days, FIRST, days, amounts, check, N]) }],
  };
}

/** Counts business days over 1M random spans of up to 30 years (starting 1971..2070), one call per span. */
function businessCount(): Benchmark {
  const { starts, ends } = countData();
  const t = floorTables();
  const out = new Int32Array(N);
  const check = new Int32Array(N);
  const sample = 40;
  const holidays = holidayKeys();
  for (let i = 0; i < N; i++) out[i] = countBusinessDays(CALENDAR, starts[i]!, ends[i]!);
  prefixCountLoop(t.prefix, FIRST, starts, ends, check, N);
  sameAnswers('business-count', out, check, N);
  return {
    name: 'business-count',
    description: 'count business days over random spans of up to 30 years (us-federal), one call per span',
    elements: N,
    unit: 'span',
    processes: 3,
    ours: {
      name: 'kalends countBusinessDays',
      run: () => {
        for (let i = 0; i < N; i++) out[i] = countBusinessDays(CALENDAR, starts[i]!, ends[i]!);
        return out[N - 1];
      },
    },
    baselines: [
      { name: 'floor: two loads from a precomputed prefix array', run: () => Reflect.apply(prefixCountLoop, undefined, [t.prefix, FIRST, starts, ends, check, N]) },
      {
        name: 'day-by-day Temporal.PlainDate loop, fields and integer keys (temporal-polyfill)',
        elements: sample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < sample; i++) {
            const end = plainDate(ends[i]!);
            for (let d = plainDate(starts[i]!); Temporal.PlainDate.compare(d, end) < 0; d = d.add({ days: 1 })) {
              if (temporalIsBusiness(d, holidays)) acc++;
            }
          }
          return acc;
        },
      },
    ],
  };
}

/** The same counts in one bulk call. */
function businessCountBulk(): Benchmark {
  const { starts, ends } = countData();
  const t = floorTables();
  const out = new Int32Array(N);
  const check = new Int32Array(N);
  countBusinessDaysBulk(CALENDAR, starts, ends, out);
  prefixCountLoop(t.prefix, FIRST, starts, ends, check, N);
  sameAnswers('business-count-bulk', out, check, N);
  return {
    name: 'business-count-bulk',
    description: 'count business days over random spans of up to 30 years (us-federal), one bulk call',
    elements: N,
    unit: 'span',
    processes: 3,
    ours: { name: 'kalends countBusinessDaysBulk', run: () => countBusinessDaysBulk(CALENDAR, starts, ends, out)[N - 1] },
    baselines: [{ name: 'floor: two loads from a precomputed prefix array', run: () => Reflect.apply(prefixCountLoop, undefined, [t.prefix, FIRST, starts, ends, check, N]) }],
  };
}

/** Tests and adjusts 1M random dates (1980..2100) in bulk. */
function businessTestAdjustBulk(): readonly Benchmark[] {
  const { days } = shiftData();
  const t = floorTables();
  const flags = new Uint8Array(N);
  const flagsCheck = new Uint8Array(N);
  const adjusted = new Int32Array(N);
  const adjustedCheck = new Int32Array(N);
  isBusinessDayBulk(CALENDAR, days, flags);
  flagLoop(t.flags, FIRST, days, flagsCheck, N);
  sameAnswers('business-test-bulk', flags, flagsCheck, N);
  adjustDayNumberBulk(CALENDAR, days, 'modified-following', adjusted);
  lookupLoop(t.following, FIRST, days, adjustedCheck, N);
  sameAnswers('business-adjust-bulk', adjusted, adjustedCheck, N);
  return [
    {
      name: 'business-test-bulk',
      description: 'is each of 1M random dates a business day (us-federal), one bulk call',
      elements: N,
      unit: 'date',
      processes: 3,
      ours: { name: 'kalends isBusinessDayBulk', run: () => isBusinessDayBulk(CALENDAR, days, flags)[N - 1] },
      baselines: [{ name: 'floor: one load from a precomputed byte-per-day array', run: () => Reflect.apply(flagLoop, undefined, [t.flags, FIRST, days, flagsCheck, N]) }],
    },
    {
      name: 'business-adjust-bulk',
      description: 'modified-following adjustment of 1M random dates (us-federal), one bulk call',
      elements: N,
      unit: 'date',
      processes: 3,
      ours: { name: 'kalends adjustDayNumberBulk', run: () => adjustDayNumberBulk(CALENDAR, days, 'modified-following', adjusted)[N - 1] },
      baselines: [{ name: 'floor: one load from a precomputed per-day adjusted array', run: () => Reflect.apply(lookupLoop, undefined, [t.following, FIRST, days, adjustedCheck, N]) }],
    },
  ];
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [
  businessShift,
  businessShiftBulk,
  businessCount,
  businessCountBulk,
  () => businessTestAdjustBulk()[0]!,
  () => businessTestAdjustBulk()[1]!,
];

import { Temporal } from 'temporal-polyfill';
import { dayNumberFromEpochMsBulk } from '../src/zone/index.js';
import { defineUnit, ordinalFromDayNumberBulk, ordinalFromEpochMsBulk, type PeriodUnit } from '../src/period/index.js';
import { type Benchmark, seededRandom } from './harness.js';
import { keyFloorLoop, sameOutput, zoneDayFloorTable } from './floors.js';

const N = 1_000_000;
const SAMPLE = 20_000;
const ZONE = 'America/New_York';
const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;

/** 1 million seeded random instants between 2000 and 2040 (the same data every run). */
function instants(): Float64Array {
  const rnd = seededRandom(4545);
  const lo = Date.UTC(2000, 0, 1);
  const hi = Date.UTC(2040, 0, 1);
  const out = new Float64Array(N);
  for (let i = 0; i < N; i++) out[i] = Math.floor(lo + rnd() * (hi - lo));
  return out;
}

/** The Saturday nearest 31 January of `year`, the way a user would find it with Temporal. */
function retailYearEnd(year: number): Temporal.PlainDate {
  const jan31 = Temporal.PlainDate.from({ year, month: 1, day: 31 });
  const forward = (6 - jan31.dayOfWeek + 7) % 7;
  return forward <= 3 ? jan31.add({ days: forward }) : jan31.subtract({ days: 7 - forward });
}

/**
 * The baselines, cheapest first: the floor loop runs right after ours in every round, so that the machine's
 * drifting speed (this virtual machine's moves by up to 2x over seconds) falls on both alike; the per-element
 * Temporal sample, which takes most of a second, runs last.
 */
function baselines(data: Float64Array, out: Int32Array, unit: PeriodUnit, perElement: (ms: number) => number): Benchmark['baselines'] {
  // The floor: the local day from a precomputed per-UTC-day offset table (temporal-polyfill's transitions), then
  // the key from a precomputed per-day key table (the unit's ordinal of every day 1999..2040).
  const zt = zoneDayFloorTable(ZONE, Date.UTC(2000, 0, 1), Date.UTC(2040, 0, 1));
  const keyBase = Math.floor(Date.UTC(1999, 11, 1) / 86_400_000);
  const allDays = Int32Array.from({ length: Math.floor(Date.UTC(2040, 1, 1) / 86_400_000) - keyBase }, (_, i) => keyBase + i);
  const keys = ordinalFromDayNumberBulk(unit, allDays);
  const runFloor = (): number => Reflect.apply(keyFloorLoop, undefined, [zt.d0, zt.offsets, zt.before, zt.changeAt, zt.after, keys, keyBase, data, out, N]);
  runFloor();
  sameOutput('period floor', ordinalFromEpochMsBulk(unit, ZONE, data), out, N);
  return [
    { name: 'floor: per-UTC-day offset table, then a per-day key table (precomputed)', run: runFloor },
    {
      name: 'zone bulk day numbers alone (no period step)',
      run: () => dayNumberFromEpochMsBulk(ZONE, data, out)[N - 1],
    },
    {
      name: 'per-element Temporal (temporal-polyfill)',
      elements: SAMPLE,
      run: () => {
        let acc = 0;
        for (let i = 0; i < SAMPLE; i++) acc += perElement(data[i]!);
        return acc;
      },
    },
  ];
}

function bench(name: string, description: string, unit: PeriodUnit, perElement: (ms: number) => number): () => Benchmark {
  return () => {
    const data = instants();
    const out = new Int32Array(N);
    return {
      name,
      description,
      elements: N,
      unit: 'instant',
      rounds: 9,
      processes: 3,
      ours: { name: 'kalends ordinalFromEpochMsBulk', run: () => ordinalFromEpochMsBulk(unit, ZONE, data, out)[N - 1] },
      baselines: baselines(data, new Int32Array(N), unit, perElement),
    };
  };
}

const fiscalQuarter = bench(
  'period-fiscal-quarter',
  'instants in America/New_York -> fiscal quarter ordinals (fiscal year from 1 October)',
  defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }),
  (ms) => {
    const z = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(ZONE);
    const fiscalYear = z.month >= 10 ? z.year + 1 : z.year;
    return fiscalYear * 4 + Math.floor(((z.month + 2) % 12) / 3);
  },
);

const retailWeek = bench(
  'period-retail-week',
  'instants in America/New_York -> retail 4-5-4 week ordinals (Saturday nearest 31 January)',
  defineUnit({ kind: 'fiscal-week', ...RETAIL }),
  (ms) => {
    const date = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(ZONE).toPlainDate();
    let end = retailYearEnd(date.year);
    if (Temporal.PlainDate.compare(date, end) > 0) end = retailYearEnd(date.year + 1);
    const start = retailYearEnd(end.year - 1).add({ days: 1 });
    return (end.year - 1) * 53 + Math.floor(start.until(date).days / 7);
  },
);

const retailPeriod = bench(
  'period-retail-month',
  'instants in America/New_York -> retail 4-5-4 period (month) ordinals',
  defineUnit({ kind: 'fiscal-period', ...RETAIL }),
  (ms) => {
    const date = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(ZONE).toPlainDate();
    let end = retailYearEnd(date.year);
    if (Temporal.PlainDate.compare(date, end) > 0) end = retailYearEnd(date.year + 1);
    const start = retailYearEnd(end.year - 1).add({ days: 1 });
    const week = Math.floor(start.until(date).days / 7);
    const quarter = Math.min(3, Math.floor(week / 13));
    const w = week - 13 * quarter;
    return (end.year - 1) * 12 + quarter * 3 + (w < 4 ? 0 : w < 9 ? 1 : 2);
  },
);

/** The period step alone: local day numbers to ordinals, for the three units above, against a copy loop. */
function daysToOrdinals(): Benchmark {
  const rnd = seededRandom(77);
  const days = new Int32Array(N);
  for (let i = 0; i < N; i++) days[i] = 10_957 + Math.floor(rnd() * 14_610); // 2000-01-01 .. 2039-12-31
  const out = new Int32Array(N);
  const units = [
    defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }),
    defineUnit({ kind: 'fiscal-week', ...RETAIL }),
    defineUnit({ kind: 'fiscal-period', ...RETAIL }),
  ];
  const epoch = Temporal.PlainDate.from('1970-01-01');
  return {
    name: 'period-days-to-ordinals',
    description: 'local day numbers -> fiscal quarter, retail week and retail month ordinals (the period step alone)',
    elements: 3 * N,
    unit: 'day',
    ours: {
      name: 'kalends ordinalFromDayNumberBulk x3',
      run: () => {
        let acc = 0;
        for (const u of units) acc += ordinalFromDayNumberBulk(u, days, out)[N - 1]!;
        return acc;
      },
    },
    baselines: [
      {
        name: 'per-element Temporal PlainDate -> fiscal quarter',
        elements: SAMPLE,
        run: () => {
          let acc = 0;
          for (let i = 0; i < SAMPLE; i++) {
            const d = epoch.add({ days: days[i]! });
            acc += (d.month >= 10 ? d.year + 1 : d.year) * 4 + Math.floor(((d.month + 2) % 12) / 3);
          }
          return acc;
        },
      },
      {
        name: 'floor loop: copy with an add, x3',
        run: () => {
          for (let r = 0; r < 3; r++) for (let i = 0; i < N; i++) out[i] = days[i]! + r;
          return out[N - 1];
        },
      },
    ],
  };
}

export const benchmarks: readonly (() => Benchmark)[] = [fiscalQuarter, retailWeek, retailPeriod, daysToOrdinals];

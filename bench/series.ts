import { bucketSeries, rollBulk, rollSeries, seriesFromColumns, type Series } from '../src/index.js';
import { type Benchmark, seededRandom } from './harness.js';
import { windowStartBound } from './window-bound.js';
import { bucketFloorLoop, rollingCompensatedBoundLoop, rollingFloorLoop, sameOutput } from './floors.js';
import { Temporal } from 'temporal-polyfill';

const N = 10_000_000;
const YEAR_MS = 365.2425 * 86_400_000;
const START = Date.UTC(2015, 0, 1);

/** 10 million sorted, irregularly spaced instants over 10 years, with values. Made once, shared. */
let shared: Series | undefined;
function tenMillionPoints(): Series {
  if (shared) return shared;
  const rnd = seededRandom(2025);
  const t = new Float64Array(N);
  const v = new Float64Array(N);
  const meanGap = (10 * YEAR_MS) / N;
  let at = START;
  for (let i = 0; i < N; i++) {
    at += Math.floor(rnd() * 2 * meanGap);
    t[i] = at;
    v[i] = Math.round(rnd() * 10_000) / 100;
  }
  shared = seriesFromColumns(t, { amount: v }, { inputOrder: 'sorted' });
  return shared;
}

function mb(bytes: number): string {
  return `${(bytes / 1048576).toFixed(0)} MB`;
}

/**
 * Reports memory once (after the second run): rss and typed-array memory before a run (after a full GC, input
 * data included) and right after it, before anything is collected, so that the difference is what one run
 * allocates.
 */
function memoryProbe(label: string): { before: () => void; after: () => void } {
  let base: NodeJS.MemoryUsage | undefined;
  let runs = 0;
  return {
    before() {
      (globalThis as { gc?: () => void }).gc?.();
      base = process.memoryUsage();
    },
    after() {
      const m = process.memoryUsage();
      if (++runs === 2 && base) {
        console.log(
          `   memory (${label}): rss ${mb(base.rss)} -> ${mb(m.rss)}, array buffers ${mb(base.arrayBuffers)} -> ${mb(m.arrayBuffers)} (+${mb(m.arrayBuffers - base.arrayBuffers)} allocated by one run)`,
        );
      }
    },
  };
}

/**
 * The bucketing floor: a plain bucket loop (sum and count per month, then the means) over the month boundaries in
 * America/New_York precomputed with temporal-polyfill.
 */
function bucketFloorCase(s: Series) {
  const bounds: number[] = [];
  for (let m = 0; m <= 12 * 11 + 1; m++) {
    const date = Temporal.PlainDate.from({ year: 2014 + Math.floor((m + 11) / 12), month: ((m + 11) % 12) + 1, day: 1 });
    bounds.push(date.toZonedDateTime('America/New_York').epochMilliseconds);
  }
  const b = Float64Array.from(bounds);
  const sums = new Float64Array(b.length);
  const counts = new Float64Array(b.length);
  const means = new Float64Array(b.length);
  const t = s.epochMs;
  const v = s.columns.amount!;
  const run = (): number => {
    const last = Reflect.apply(bucketFloorLoop, undefined, [b, t, v, sums, counts, N]) as number;
    for (let p = 0; p <= last; p++) means[p] = sums[p]! / counts[p]!;
    return means[last]!;
  };
  return { name: 'floor: plain bucket loop over precomputed month boundaries (sum, count, mean)', run, sums, means };
}

/** The rolling floor: a plain, uncompensated two-pointer rolling sum (the mean of each window). */
function rollingFloorCase(s: Series, lengthMs: number, out: Float64Array) {
  return {
    name: 'floor: plain uncompensated two-pointer rolling mean',
    run: () => Reflect.apply(rollingFloorLoop, undefined, [s.epochMs, s.columns.amount!, lengthMs, out, N]) as number,
  };
}

/** 10M points over 10 years in America/New_York into monthly sums and means. */
function bucketMonthly(): Benchmark {
  const s = tenMillionPoints();
  const probe = memoryProbe('bucket');
  const floor = bucketFloorCase(s);
  floor.run();
  const table = bucketSeries(s, { unit: 'month', zone: 'America/New_York', aggregations: ['sum', 'mean'] });
  sameOutput('bucket floor sums', table.columns.sum!, floor.sums, table.length, 1e-9);
  sameOutput('bucket floor means', table.columns.mean!, floor.means, table.length, 1e-9);
  return {
    name: 'series-bucket-monthly',
    description: '10M irregular points over 10 years -> monthly sum and mean in America/New_York',
    elements: N,
    unit: 'point',
    processes: 3,
    ours: {
      name: 'bucketSeries (sum, mean)',
      run: () => {
        probe.before();
        const t = bucketSeries(s, { unit: 'month', zone: 'America/New_York', aggregations: ['sum', 'mean'] });
        probe.after();
        return t.columns.sum![t.length - 1]!;
      },
    },
    baselines: [floor],
  };
}

/**
 * A 30-day rolling mean over 10M irregular points. Ours writes into a reused output array (as a caller rolling
 * batch after batch would); rollSeries, which allocates its 80 MB output on each call, is shown beside it: on
 * this machine the first touch of freshly mapped memory costs about 100 ns per 8-byte element, far more than
 * the computation.
 */
function rolling30Days(): Benchmark {
  const s = tenMillionPoints();
  const probe = memoryProbe('rolling');
  const out = new Float64Array(N);
  const window = { lengthMs: 30 * 86_400_000 };
  const floorOut = new Float64Array(N);
  const boundOut = new Float64Array(N);
  const floor = rollingFloorCase(s, window.lengthMs, floorOut);
  floor.run();
  sameOutput('rolling floor', rollBulk(s.epochMs, s.columns.amount!, { window, aggregation: 'mean' }, out), floorOut, N, 1e-9);
  return {
    name: 'series-rolling-30d',
    description: '30-day (fixed-length) rolling mean over 10M irregular points',
    elements: N,
    unit: 'point',
    processes: 3,
    ours: {
      name: 'rollBulk { lengthMs: 30 days } mean, reused output',
      run: () => {
        probe.before();
        rollBulk(s.epochMs, s.columns.amount!, { window, aggregation: 'mean' }, out);
        probe.after();
        return out[N - 1]!;
      },
    },
    baselines: [
      floor,
      {
        name: 'bound: the floor loop with compensated (Neumaier) adds and subtracts',
        run: () => Reflect.apply(rollingCompensatedBoundLoop, undefined, [s.epochMs, s.columns.amount!, window.lengthMs, boundOut, N]) as number,
      },
      {
        name: 'rollSeries (allocates its output)',
        run: () => rollSeries(s, { window, aggregations: ['mean'] }).columns.mean![N - 1]!,
      },
    ],
  };
}

/** The same window as a calendar span on the New York wall clock (P30D), which costs a zone conversion per row. */
function rollingCalendar(): Benchmark {
  const s = tenMillionPoints();
  return {
    name: 'series-rolling-30d-calendar',
    description: '30-day calendar-span rolling mean (wall clock of America/New_York) over 10M irregular points',
    elements: N,
    unit: 'point',
    rounds: 3,
    ours: {
      name: 'rollSeries { span: P30D, zone } mean',
      run: () => rollSeries(s, { window: { span: 'P30D', zone: 'America/New_York' }, aggregations: ['mean'] }).columns.mean![N - 1]!,
    },
    baselines: [rollingFloorCase(s, 30 * 86_400_000, new Float64Array(N))],
  };
}

/**
 * The measured lower bound behind the rolling goal: only the window starts of the 30-day window, no sums (see
 * window-bound.ts), in plain JavaScript and in WebAssembly, against the same floor.
 */
function rollingBound(): Benchmark {
  const s = tenMillionPoints();
  return windowStartBound(s, 30 * 86_400_000, rollingFloorCase(s, 30 * 86_400_000, new Float64Array(N)));
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [bucketMonthly, rolling30Days, rollingBound, rollingCalendar];

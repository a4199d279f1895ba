/**
 * Day-count fractions over 1 million random periods, one benchmark per convention: `yearFractionOfDaysBulk`
 * (which checks every pair and dispatches to the convention's kernel) against a plain loop that computes the
 * same formula with no checks, in the same run. Goal (issue 15): at most 2x the plain loop.
 */
import { countBusinessDays } from '../src/business/index.js';
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked, isLeapYearUnchecked, packedYmdUnchecked } from '../src/civil/gregorian.js';
import { dayOfPacked, monthOfPacked, yearOfPacked } from '../src/civil/names.js';
import { type DayCountConvention, type YearFractionBulkOptions, dayNumberFromYmd, yearFractionOfDaysBulk } from '../src/index.js';
import { type Benchmark, seededRandom } from './harness.js';

const N = 1_000_000;
const FIRST = dayNumberFromYmd(1971, 1, 1);
const SPAN = dayNumberFromYmd(2100, 1, 1) - FIRST;

interface Pairs {
  readonly starts: Int32Array;
  readonly ends: Int32Array;
  readonly regularStarts: Int32Array;
  readonly regularEnds: Int32Array;
  /** The latest end: the Termination Date of 30E/360 (ISDA). */
  readonly termination: number;
}

/**
 * 1M random periods of 0 to 731 days starting 1971..2099; for Actual/Actual (ICMA), semi-annual regular periods
 * of 181 to 184 days with each period inside its own.
 */
function randomPairs(seed: number, icma: boolean): Pairs {
  const rnd = seededRandom(seed);
  const starts = new Int32Array(N);
  const ends = new Int32Array(N);
  const regularStarts = new Int32Array(icma ? N : 0);
  const regularEnds = new Int32Array(icma ? N : 0);
  for (let i = 0; i < N; i++) {
    if (icma) {
      const rs = FIRST + Math.floor(rnd() * SPAN);
      const re = rs + 181 + Math.floor(rnd() * 4);
      const a = rs + Math.floor(rnd() * (re - rs + 1));
      regularStarts[i] = rs;
      regularEnds[i] = re;
      starts[i] = a;
      ends[i] = a + Math.floor(rnd() * (re - a + 1));
    } else {
      starts[i] = FIRST + Math.floor(rnd() * SPAN);
      ends[i] = starts[i]! + Math.floor(rnd() * 732);
    }
  }
  let termination = ends[0]!;
  for (let i = 1; i < N; i++) if (ends[i]! > termination) termination = ends[i]!;
  return { starts, ends, regularStarts, regularEnds, termination };
}

type PlainLoop = (p: Pairs, out: Float64Array) => void;

// ---- the plain loops: the formula alone, no checks, no dispatch ----------------------------------------------

const plainLoops: Readonly<Record<DayCountConvention, PlainLoop>> = {
  'one-one': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) out[i] = starts[i] === ends[i] ? 0 : 1;
  },
  'actual-actual-isda': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) {
      const a = starts[i]!;
      const b = ends[i]!;
      const ys = yearOfPacked(packedYmdUnchecked(a));
      const ye = yearOfPacked(packedYmdUnchecked(b));
      let num: number;
      if (ys === ye) num = (b - a) * (isLeapYearUnchecked(ys) ? 365 : 366);
      else {
        num =
          (dayNumberFromYmdUnchecked(ys + 1, 1, 1) - a) * (isLeapYearUnchecked(ys) ? 365 : 366) +
          (b - dayNumberFromYmdUnchecked(ye, 1, 1)) * (isLeapYearUnchecked(ye) ? 365 : 366) +
          (ye - ys - 1) * 133_590;
      }
      out[i] = num / 133_590;
    }
  },
  'actual-actual-icma': ({ starts, ends, regularStarts, regularEnds }, out) => {
    for (let i = 0; i < N; i++) out[i] = (ends[i]! - starts[i]!) / (2 * (regularEnds[i]! - regularStarts[i]!));
  },
  'actual-365-fixed': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) out[i] = (ends[i]! - starts[i]!) / 365;
  },
  'actual-360': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) out[i] = (ends[i]! - starts[i]!) / 360;
  },
  'thirty-360': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) {
      const p1 = packedYmdUnchecked(starts[i]!);
      const p2 = packedYmdUnchecked(ends[i]!);
      let d1 = dayOfPacked(p1);
      let d2 = dayOfPacked(p2);
      if (d1 === 31) d1 = 30;
      if (d2 === 31 && d1 > 29) d2 = 30;
      out[i] = (360 * (yearOfPacked(p2) - yearOfPacked(p1)) + 30 * (monthOfPacked(p2) - monthOfPacked(p1)) + (d2 - d1)) / 360;
    }
  },
  'thirty-e-360': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) {
      const p1 = packedYmdUnchecked(starts[i]!);
      const p2 = packedYmdUnchecked(ends[i]!);
      const d1 = Math.min(dayOfPacked(p1), 30);
      const d2 = Math.min(dayOfPacked(p2), 30);
      out[i] = (360 * (yearOfPacked(p2) - yearOfPacked(p1)) + 30 * (monthOfPacked(p2) - monthOfPacked(p1)) + (d2 - d1)) / 360;
    }
  },
  'thirty-e-360-isda': ({ starts, ends, termination }, out) => {
    for (let i = 0; i < N; i++) {
      const a = starts[i]!;
      const b = ends[i]!;
      if (a === b) {
        out[i] = 0;
        continue;
      }
      const p1 = packedYmdUnchecked(a);
      const p2 = packedYmdUnchecked(b);
      const y1 = yearOfPacked(p1);
      const y2 = yearOfPacked(p2);
      const m1 = monthOfPacked(p1);
      const m2 = monthOfPacked(p2);
      let d1 = dayOfPacked(p1);
      let d2 = dayOfPacked(p2);
      if (d1 === 31 || (m1 === 2 && d1 === dayCountOfMonthUnchecked(y1, 2))) d1 = 30;
      if (d2 === 31 || (m2 === 2 && d2 === dayCountOfMonthUnchecked(y2, 2) && b !== termination)) d2 = 30;
      out[i] = (360 * (y2 - y1) + 30 * (m2 - m1) + (d2 - d1)) / 360;
    }
  },
  'actual-365-leap': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) {
      const b = ends[i]!;
      out[i] = (b - starts[i]!) / (isLeapYearUnchecked(yearOfPacked(packedYmdUnchecked(b))) ? 366 : 365);
    }
  },
  'business-252': ({ starts, ends }, out) => {
    for (let i = 0; i < N; i++) out[i] = countBusinessDays('us-federal', starts[i]!, ends[i]!) / 252;
  },
};

function optionsOf(convention: DayCountConvention, p: Pairs): YearFractionBulkOptions | undefined {
  switch (convention) {
    case 'actual-actual-icma':
      return { couponsPerYear: 2, regularStarts: p.regularStarts, regularEnds: p.regularEnds };
    case 'thirty-e-360-isda':
      return { terminationDayNumber: p.termination };
    case 'actual-365-leap':
      return { couponsPerYear: 2 };
    case 'business-252':
      return { calendar: 'us-federal' };
    default:
      return undefined;
  }
}

function dayCountBenchmark(convention: DayCountConvention, seed: number): () => Benchmark {
  return () => {
    const pairs = randomPairs(seed, convention === 'actual-actual-icma');
    const options = optionsOf(convention, pairs);
    const ours = new Float64Array(N);
    const plain = new Float64Array(N);
    const loop = plainLoops[convention];
    // The two must agree before anything is timed.
    yearFractionOfDaysBulk(convention, pairs.starts, pairs.ends, ours, options);
    loop(pairs, plain);
    for (let i = 0; i < N; i++) {
      if (!Object.is(ours[i], plain[i])) throw new Error(`daycount-${convention}: the plain loop disagrees at ${i}: ${ours[i]} vs ${plain[i]}`);
    }
    return {
      name: `daycount-${convention}`,
      description: `year fractions of 1M random periods (${convention}) vs the same formula in a plain loop`,
      elements: N,
      unit: 'period',
      processes: 3,
      ours: {
        name: 'kalends yearFractionOfDaysBulk',
        run: () => {
          yearFractionOfDaysBulk(convention, pairs.starts, pairs.ends, ours, options);
          return ours[N - 1];
        },
      },
      baselines: [
        {
          name: 'plain loop, same formula, no checks',
          run: () => {
            loop(pairs, plain);
            return plain[N - 1];
          },
        },
      ],
    };
  };
}

/** Benchmarks of this layer, one per convention. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [
  dayCountBenchmark('one-one', 1501),
  dayCountBenchmark('actual-actual-isda', 1502),
  dayCountBenchmark('actual-actual-icma', 1503),
  dayCountBenchmark('actual-365-fixed', 1504),
  dayCountBenchmark('actual-360', 1505),
  dayCountBenchmark('thirty-360', 1506),
  dayCountBenchmark('thirty-e-360', 1507),
  dayCountBenchmark('thirty-e-360-isda', 1508),
  dayCountBenchmark('actual-365-leap', 1509),
  dayCountBenchmark('business-252', 1510),
];

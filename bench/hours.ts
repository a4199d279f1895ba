/**
 * Business time between 1 million pairs of instants spanning up to 90 days (the service-level case: ticket opened,
 * ticket answered), support desk hours Monday to Friday 08:00-18:00 in America/New_York on the us-federal calendar.
 * `countBusinessMsBulk` against, in the same run:
 * - a plain loop over a precomputed array of the same session starts and ends with prefix sums (a binary search
 *   per instant, no checks): goal at most 2x its time (issue 16);
 * - a minute-stepping reference on a subsample: for each minute of each span, its wall clock from the zone layer,
 *   its business day from the calendar, and the day's interval compared by wall time: goal at least 10,000x faster.
 * The three are checked to agree before anything is timed.
 */
import {
  type BusinessHours,
  countBusinessMsBulk,
  defineHours,
  isBusinessDay,
  listSessions,
  wallMsFromEpochMs,
  weekdayOfDayNumber,
} from '../src/index.js';
import { type Benchmark, seededRandom } from './harness.js';

const N = 1_000_000;
const SAMPLE = 60;
const ZONE = 'America/New_York';
const MIN = 60_000;
const DAY = 86_400_000;
const OPEN_MS = 8 * 3_600_000;
const CLOSE_MS = 18 * 3_600_000;

/** The support desk of the benchmark (the demo's company keeps similar hours). */
export function benchHours(): BusinessHours {
  const day = [{ open: '08:00', close: '18:00' }];
  return defineHours({
    id: 'bench-desk',
    zone: ZONE,
    calendar: 'us-federal',
    week: { monday: day, tuesday: day, wednesday: day, thursday: day, friday: day },
  });
}

/** The plain loop: the same binary search and prefix sums over precomputed arrays, no checks. */
function plainLoop(starts: Float64Array, ends: Float64Array, cum: Float64Array, a: Float64Array, b: Float64Array, out: Float64Array): void {
  const n = starts.length;
  for (let k = 0; k < a.length; k++) {
    const ta = a[k]!;
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= ta) lo = mid + 1;
      else hi = mid;
    }
    const fa = lo > 0 && ta < ends[lo - 1]! ? cum[lo - 1]! + (ta - starts[lo - 1]!) : cum[lo]!;
    const tb = b[k]!;
    lo = 0;
    hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= tb) lo = mid + 1;
      else hi = mid;
    }
    const fb = lo > 0 && tb < ends[lo - 1]! ? cum[lo - 1]! + (tb - starts[lo - 1]!) : cum[lo]!;
    out[k] = fb - fa;
  }
}

/** The minute-stepping reference: open minutes in [a, b), each minute's wall clock and business day looked up. */
function minuteStepper(a: number, b: number): number {
  let open = 0;
  for (let m = a; m < b; m += MIN) {
    const wall = wallMsFromEpochMs(ZONE, m);
    const day = Math.floor(wall / DAY);
    const ms = wall - day * DAY;
    if (ms >= OPEN_MS && ms < CLOSE_MS && weekdayOfDayNumber(day) <= 5 && isBusinessDay('us-federal', day)) open++;
  }
  return open * MIN;
}

function hoursBenchmark(): Benchmark {
  const hours = benchHours();
  const rnd = seededRandom(1616);
  const first = Date.UTC(2020, 0, 1);
  const span = Date.UTC(2030, 0, 1) - first;
  const a = new Float64Array(N);
  const b = new Float64Array(N);
  for (let i = 0; i < N; i++) {
    a[i] = first + Math.floor((rnd() * span) / MIN) * MIN;
    b[i] = a[i]! + Math.floor((rnd() * 90 * DAY) / MIN) * MIN;
  }
  // The plain loop's arrays: the same sessions, listed once.
  const sessions = listSessions(hours, Date.UTC(2019, 11, 1), Date.UTC(2030, 3, 15), { limit: 1_000_000 });
  const starts = Float64Array.from(sessions, (s) => s.startEpochMs);
  const ends = Float64Array.from(sessions, (s) => s.endEpochMs);
  const cum = new Float64Array(sessions.length + 1);
  for (let i = 0; i < sessions.length; i++) cum[i + 1] = cum[i]! + (ends[i]! - starts[i]!);
  const ours = new Float64Array(N);
  const plain = new Float64Array(N);
  countBusinessMsBulk(hours, a, b, ours);
  plainLoop(starts, ends, cum, a, b, plain);
  for (let i = 0; i < N; i++) if (ours[i] !== plain[i]) throw new Error(`hours: the plain loop disagrees at ${i}: ${ours[i]} vs ${plain[i]}`);
  for (let i = 0; i < SAMPLE; i++) {
    const r = minuteStepper(a[i]!, b[i]!);
    if (r !== ours[i]) throw new Error(`hours: the minute stepper disagrees at ${i}: ${r} vs ${ours[i]}`);
  }
  return {
    name: 'hours-business-time',
    description: 'business time between 1M pairs of instants up to 90 days apart (desk 08:00-18:00 New York, us-federal)',
    elements: N,
    unit: 'pair',
    processes: 3,
    ours: {
      name: 'kalends countBusinessMsBulk',
      run: () => {
        countBusinessMsBulk(hours, a, b, ours);
        return ours[N - 1];
      },
    },
    baselines: [
      {
        name: 'plain loop, same arrays, no checks',
        run: () => {
          plainLoop(starts, ends, cum, a, b, plain);
          return plain[N - 1];
        },
      },
      {
        name: `minute-stepping reference (${SAMPLE} pairs)`,
        elements: SAMPLE,
        run: () => {
          let acc = 0;
          for (let i = 0; i < SAMPLE; i++) acc += minuteStepper(a[i]!, b[i]!);
          return acc;
        },
      },
    ],
  };
}

/** Benchmarks of this layer. */
export const benchmarks: readonly (() => Benchmark)[] = [hoursBenchmark];

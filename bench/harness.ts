/**
 * A small benchmark harness. A benchmark names a workload of `elements` items and several cases that do the
 * same work; one case is ours, the others are baselines measured in the same run. Each case runs `rounds`
 * times after three warm-up runs; the harness prints the median nanoseconds per element and the ratio of every case to
 * ours. Timings are never assertions: they are printed, and docs/performance.md records them.
 */

/** One way of doing a benchmark's work. `run` returns a value that depends on the work (to defeat dead-code elimination). */
export interface BenchCase {
  readonly name: string;
  /** Elements this case processes per run, if fewer than the benchmark's (slow baselines run on a sample). */
  readonly elements?: number;
  readonly run: () => unknown;
}

/** A named workload with our case first and baselines after it. */
export interface Benchmark {
  readonly name: string;
  /** What the benchmark measures, in one line. */
  readonly description: string;
  readonly elements: number;
  /** The element that a "per element" figure counts (e.g. "instant", "produced date"). */
  readonly unit?: string;
  readonly ours: BenchCase;
  readonly baselines: readonly BenchCase[];
  readonly rounds?: number;
  /**
   * Processes to run this benchmark in (default 1). With more, `bench/run.ts` prints the process whose ratio of ours
   * to the first baseline is the median, and every process's ratio: on this virtual machine a whole process can land
   * in a slow phase, and the goals near their limit are judged on the median process.
   */
  readonly processes?: number;
}

/** The measured result of one case. */
export interface CaseResult {
  readonly name: string;
  readonly nsPerElement: number;
  readonly samples: readonly number[];
}

function now(): number {
  return Number(process.hrtime.bigint()) / 1e6;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

let sink = 0;
function consume(v: unknown): void {
  if (typeof v === 'number') sink += v;
  else if (v && typeof v === 'object' && 'length' in v) sink += (v as { length: number }).length;
}

function fmtNs(ns: number): string {
  if (ns >= 1e6) return `${(ns / 1e6).toFixed(2)} ms`;
  if (ns >= 1e3) return `${(ns / 1e3).toFixed(2)} µs`;
  return `${ns.toFixed(2)} ns`;
}

/**
 * Runs a benchmark and prints a table: case, median time per element, and its ratio to ours. The rounds are
 * interleaved (ours, then each baseline, then ours again, ..., each round starting one case later) so that the
 * machine's slow and fast phases, and the cold caches after a slow baseline, fall on every case alike; the ratios
 * are what the figures mean.
 */
export function runBenchmark(b: Benchmark, print: (line: string) => void): CaseResult[] {
  const rounds = b.rounds ?? 5;
  print(`\n## ${b.name}: ${b.description}`);
  print(`   ${b.elements.toLocaleString('en-US')} ${b.unit ?? 'elements'}, median of ${rounds} interleaved rounds`);
  const cases = [b.ours, ...b.baselines];
  // Warm-up: three runs of every case before any is timed. V8 optimizes a kernel in steps (first the loop of the
  // running call, then the whole function on a later call), and the bulk kernels reach their steady speed on about
  // the fourth call; one warm-up run left the first rounds of ours in the median.
  for (let w = 0; w < 3; w++) for (const c of cases) consume(c.run());
  const samples: number[][] = cases.map(() => []);
  // Each round starts with a different case (round r with case r mod the number of cases), so that no case always
  // runs right after the slow per-element baselines, whose memory churn leaves the caches cold for whatever follows.
  for (let r = 0; r < rounds; r++) {
    for (let m = 0; m < cases.length; m++) {
      const k = (r + m) % cases.length;
      const c = cases[k]!;
      const g = (globalThis as { gc?: () => void }).gc;
      if (g) g();
      const t0 = now();
      consume(c.run());
      samples[k]!.push(((now() - t0) * 1e6) / (c.elements ?? b.elements));
    }
  }
  const results: CaseResult[] = cases.map((c, k) => ({ name: c.name, nsPerElement: median(samples[k]!), samples: samples[k]! }));
  const ours = results[0]!;
  const width = Math.max(...results.map((r) => r.name.length));
  for (const r of results) {
    const ratio = r === ours ? 'ours' : describeRatio(r.nsPerElement / ours.nsPerElement);
    print(`   ${r.name.padEnd(width)}  ${fmtNs(r.nsPerElement).padStart(10)} per ${b.unit ?? 'element'}  ${ratio}`);
  }
  if (sink === 0.5) print('');
  return results;
}

function describeRatio(ratio: number): string {
  return ratio >= 1 ? `ours is ${ratio.toFixed(ratio >= 100 ? 0 : 2)}x faster` : `ours is ${(1 / ratio).toFixed(2)}x the time of this`;
}

/** A seeded 32-bit PRNG (mulberry32), so every run measures the same data. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

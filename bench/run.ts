/**
 * `npm run bench [-- name-filter]`: runs every registered benchmark (or those whose name contains the filter)
 * and prints median time per element with ratios to the baselines of the same run.
 */
import { runBenchmark, type Benchmark } from './harness.js';
import { benchmarks as civil } from './civil.js';
import { benchmarks as instant } from './instant.js';
import { benchmarks as zone } from './zone.js';
import { benchmarks as period } from './period.js';
import { benchmarks as business } from './business.js';
import { benchmarks as recurrence } from './recurrence.js';
import { benchmarks as series } from './series.js';

const all: readonly (() => Benchmark)[] = [...civil, ...instant, ...zone, ...period, ...business, ...recurrence, ...series];
const filter = process.argv[2];
console.log(`kalends benchmarks, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`);
for (const make of all) {
  const b = make();
  if (filter && !b.name.includes(filter)) continue;
  runBenchmark(b, (line) => console.log(line));
}

/**
 * `npm run bench [-- name-filter]`: runs every registered benchmark (or those whose name contains the filter)
 * and prints median time per element with ratios to the baselines of the same run.
 *
 * Each benchmark runs in a child process of its own, so that the JIT state one benchmark leaves behind (functions
 * seen with other argument types, a heap full of another benchmark's data) never colours the next one's figures,
 * and with the garbage collector on the main thread only (see below).
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { runBenchmark, type Benchmark } from './harness.js';
import { benchmarks as civil } from './civil.js';
import { benchmarks as instant } from './instant.js';
import { benchmarks as zone } from './zone.js';
import { benchmarks as period } from './period.js';
import { benchmarks as business } from './business.js';
import { benchmarks as recurrence } from './recurrence.js';
import { benchmarks as series } from './series.js';

const all: readonly (() => Benchmark)[] = [...civil, ...instant, ...zone, ...period, ...business, ...recurrence, ...series];
const args = process.argv.slice(2);
const at = args.indexOf('--only-index');
const only = at >= 0 ? Number(args[at + 1]) : undefined;
const filter = args.filter((a, i) => a !== '--only-index' && (at < 0 || i !== at + 1))[0] ?? '';

if (only !== undefined) {
  const b = all[only]!();
  if (b.name.includes(filter)) runBenchmark(b, (line) => console.log(line));
} else {
  console.log(`kalends benchmarks, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}, one process per benchmark`);
  const script = fileURLToPath(import.meta.url);
  for (let k = 0; k < all.length; k++) {
    // --single-threaded-gc: the harness collects garbage before every measured round, and on a 2-core machine the
    // collector's background threads (concurrent sweeping after a heavy baseline such as the per-element Temporal
    // loops) would otherwise still be running during the next round and slow whichever case it is.
    const r = spawnSync(process.execPath, ['--expose-gc', '--single-threaded-gc', script, filter, '--only-index', String(k)], { stdio: 'inherit' });
    if (r.status !== 0) process.exitCode = 1;
  }
}

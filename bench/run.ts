/**
 * `npm run bench [-- name-filter]`: runs every registered benchmark (or those whose name contains the filter)
 * and prints median time per element with ratios to the baselines of the same run.
 *
 * Each benchmark runs in a child process of its own, so that the JIT state one benchmark leaves behind (functions
 * seen with other argument types, a heap full of another benchmark's data) never colours the next one's figures,
 * and with the garbage collector on the main thread only (see below). A benchmark that asks for several processes
 * (`processes` in its definition) runs in that many, and the process with the median ratio is printed.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { runBenchmark, type Benchmark } from './harness.js';
import { benchmarks as civil } from './civil.js';
import { benchmarks as instant } from './instant.js';
import { benchmarks as zone, firstAnswerChild } from './zone.js';
import { benchmarks as period } from './period.js';
import { benchmarks as business } from './business.js';
import { benchmarks as daycount } from './daycount.js';
import { benchmarks as recurrence } from './recurrence.js';
import { benchmarks as series } from './series.js';
import { benchmarks as hours } from './hours.js';

const all: readonly (() => Benchmark)[] = [...civil, ...instant, ...zone, ...period, ...business, ...daycount, ...recurrence, ...series, ...hours];
const args = process.argv.slice(2);
const at = args.indexOf('--only-index');
const only = at >= 0 ? Number(args[at + 1]) : undefined;
const filter = args.filter((a, i) => a !== '--only-index' && (at < 0 || i !== at + 1))[0] ?? '';

/** The line a child prints last, for the parent: processes wanted and the ratio of ours to the first baseline. */
const META = '#meta ';

const freshAt = args.indexOf('--fresh-child');
if (freshAt >= 0) {
  // A fresh process for the first-use benchmark (bench/zone.ts): one measurement, printed as JSON.
  firstAnswerChild(args[freshAt + 1] ?? '');
} else if (only !== undefined) {
  const b = all[only]!();
  if (b.name.includes(filter)) {
    const results = runBenchmark(b, (line) => console.log(line));
    const ratio = results.length > 1 ? results[0]!.nsPerElement / results[1]!.nsPerElement : 1;
    console.log(`${META}${JSON.stringify({ processes: b.processes ?? 1, ratio, first: results[1]?.name ?? '' })}`);
  }
} else {
  console.log(`kalends benchmarks, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}, one process per benchmark`);
  const script = fileURLToPath(import.meta.url);
  // --single-threaded-gc: the harness collects garbage before every measured round, and on a 2-core machine the
  // collector's background threads (concurrent sweeping after a heavy baseline such as the per-element Temporal
  // loops) would otherwise still be running during the next round and slow whichever case it is.
  const runOnce = (k: number): { text: string; meta?: { processes: number; ratio: number; first: string } } => {
    const r = spawnSync(process.execPath, ['--expose-gc', '--single-threaded-gc', script, filter, '--only-index', String(k)], {
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'inherit'],
      maxBuffer: 1 << 24,
    });
    if (r.status !== 0) process.exitCode = 1;
    const lines = (r.stdout ?? '').split('\n');
    const metaLine = lines.find((l) => l.startsWith(META));
    return { text: lines.filter((l) => !l.startsWith(META)).join('\n'), meta: metaLine ? JSON.parse(metaLine.slice(META.length)) : undefined };
  };
  for (let k = 0; k < all.length; k++) {
    const first = runOnce(k);
    const wanted = first.meta?.processes ?? 1;
    if (wanted <= 1 || !first.meta) {
      process.stdout.write(first.text);
      continue;
    }
    const runs = [first];
    while (runs.length < wanted) runs.push(runOnce(k));
    const sorted = [...runs].sort((a, b) => a.meta!.ratio - b.meta!.ratio);
    const median = sorted[(sorted.length - 1) >> 1]!;
    process.stdout.write(`${median.text.replace(/\s+$/, '')}\n`);
    console.log(`   ${runs.length} processes, ours / ${first.meta.first}: ${runs.map((r) => `${r.meta!.ratio.toFixed(2)}x`).join(', ')}; the median process is shown`);
  }
}

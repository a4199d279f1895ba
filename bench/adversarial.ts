/**
 * `npm run bench:adversarial`: how fast the adversarial corpus fails (issue 12). The goal is that a call which must
 * fail fails in under 50 ms; it is measured here, never asserted in a test.
 *
 * The corpus is that of test/adversarial/: for each public function, the sweep (every parameter and option key
 * with every hostile value of the catalogue and of its kind, every field of a definition) and the seeded fuzz
 * (FUZZ_RUNS, default 200, seed FUZZ_SEED). The whole corpus runs PASSES times (default 3) in one process, in the
 * same order each time, so each call is timed PASSES times; a call's time is the least of its times (the first
 * pass pays for compiling code and first-use tables, and a collection can land in any one pass). Per function the
 * report gives the slowest refused call (the call threw), the same in the first pass alone (compiling included) and
 * the slowest answered call; a summary line counts the functions whose slowest refused call took 50 ms or more.
 *
 * Single process, no watchdog (a hang would hang the run: `npx vitest run test/adversarial` finds hangs). The
 * functions that write files write into a temporary directory, removed at the end.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Temporal } from 'temporal-polyfill';
import { configureTable, functionRows } from '../test/adversarial/table.js';
import { runFuzz, runSweep, type Entry, type Monitor } from '../test/adversarial/runner.js';

const GOAL_MS = 50;
const PASSES = Number(process.env['PASSES'] ?? 3);
const RUNS = Number(process.env['FUZZ_RUNS'] ?? 200);
const SEED = Number(process.env['FUZZ_SEED'] ?? 20_261_212);
const filter = process.argv[2] ?? '';

// The repository (for the table's fixtures): npm runs the script from it; the bundle lives in .build/bench.
const root = `${process.cwd()}/`;
const sandbox = mkdtempSync(join(tmpdir(), 'kalends-bench-adversarial-'));
configureTable({ root, sandbox: join(sandbox, 'files'), temporal: Temporal });

interface Call {
  readonly describe: () => string;
  ms: number;
  refused: boolean;
}

/** Records each call of one pass in order. */
function recorder(calls: Call[]): Monitor {
  let current: Call | undefined;
  return {
    begin(describe) {
      current = { describe, ms: 0, refused: false };
    },
    end(ms, outcome) {
      current!.ms = ms;
      current!.refused = !outcome.ok;
      calls.push(current!);
    },
  };
}

function fmt(ms: number): string {
  return ms < 1 ? `${(ms * 1000).toFixed(0)} µs` : `${ms.toFixed(1)} ms`;
}

function short(text: string): string {
  return text.length > 150 ? `${text.slice(0, 147)}...` : text;
}

const rows = functionRows().filter((r) => r.name.includes(filter));
console.log(`kalends adversarial corpus, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}: ${rows.length} functions, sweep + fuzz (${RUNS} runs, seed ${SEED}), ${PASSES} passes, least time per call`);
const results: { name: string; calls: number; refused: number; slowRefused?: Call; slowAnswered?: Call; coldRefused?: Call }[] = [];
const t0 = performance.now();
for (const r of rows) {
  const entry: Entry = { name: r.name, f: r.f, row: r.row };
  const passes: Call[][] = [];
  for (let p = 0; p < PASSES; p++) {
    const calls: Call[] = [];
    const monitor = recorder(calls);
    runSweep(entry, monitor, Number.POSITIVE_INFINITY);
    runFuzz(entry, SEED, RUNS, monitor);
    passes.push(calls);
  }
  const calls = passes[0]!.map((c, i) => ({ ...c, ms: Math.min(...passes.map((q) => q[i]?.ms ?? Number.POSITIVE_INFINITY)) }));
  const slowest = (xs: Call[]) => xs.reduce<Call | undefined>((a, c) => (a === undefined || c.ms > a.ms ? c : a), undefined);
  const refused = calls.filter((c) => c.refused);
  results.push({ name: `${r.module === 'kalends' ? '' : `${r.module} `}${r.name}`, calls: calls.length, refused: refused.length, slowRefused: slowest(refused), slowAnswered: slowest(calls.filter((c) => !c.refused)), coldRefused: slowest(passes[0]!.filter((c) => c.refused)) });
}
results.sort((a, b) => (b.slowRefused?.ms ?? 0) - (a.slowRefused?.ms ?? 0));
const cell = (c: Call | undefined) => (c ? fmt(c.ms).padStart(9) : '        -');
results.forEach((x, i) => {
  console.log(`${x.name.padEnd(36)} ${String(x.calls).padStart(5)} calls, ${String(x.refused).padStart(5)} refused; slowest refused ${cell(x.slowRefused)} (first pass ${cell(x.coldRefused)}), answered ${cell(x.slowAnswered)}`);
  if (x.slowRefused && (i < 5 || x.slowRefused.ms >= 1)) console.log(`    refused: ${short(x.slowRefused.describe())}`);
});
const over = results.filter((x) => (x.slowRefused?.ms ?? 0) >= GOAL_MS);
const cold = results.reduce<{ name: string; c?: Call }>((a, x) => ((x.coldRefused?.ms ?? 0) > (a.c?.ms ?? 0) ? { name: x.name, c: x.coldRefused } : a), { name: '' });
if (cold.c) console.log(`slowest refused call of the first pass (compiling included): ${cold.name}, ${fmt(cold.c.ms)}: ${short(cold.c.describe())}`);
const all = results.reduce((s, x) => s + x.calls, 0);
console.log(`${all} calls per pass in ${((performance.now() - t0) / 1000).toFixed(1)} s for ${PASSES} passes; slowest refused call per function: ${over.length} of ${results.length} at ${GOAL_MS} ms or more${over.length ? ` (${over.map((x) => x.name).join(', ')})` : ''}`);
rmSync(sandbox, { recursive: true, force: true });

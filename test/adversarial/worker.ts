/**
 * The worker thread of the adversarial suite (started by pool.ts, bundled by esbuild): runs one pass of one entry
 * point at a time and answers with its faults. Before every call it bumps a counter in shared memory and writes the
 * call's description there, so that the main thread's watchdog can name a call that hangs, and end the worker.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { Temporal } from 'temporal-polyfill';
import { configureTable, functionRows } from './table.js';
import { runFuzz, runSweep, runValid, type Entry, type Fault, type Monitor } from './runner.js';

export interface Job {
  readonly id: number;
  readonly pass: 'valid' | 'sweep' | 'fuzz';
  readonly module: string;
  readonly entry: string;
  readonly seed: number;
  readonly runs: number;
}
export interface Answer {
  readonly id: number;
  readonly faults: readonly Fault[];
  readonly calls: number;
}

const { shared, root, sandbox } = workerData as { shared: SharedArrayBuffer; root: string; sandbox: string };
configureTable({ root, sandbox, temporal: Temporal });
const beat = new Int32Array(shared, 0, 2);
const text = new Uint8Array(shared, 8);
const encoder = new TextEncoder();
let calls = 0;
const monitor: Monitor = {
  begin(describe) {
    calls++;
    const { written } = encoder.encodeInto(describe(), text);
    Atomics.store(beat, 1, written);
    Atomics.add(beat, 0, 1);
  },
  end() {},
};

const entries = new Map<string, Entry>(functionRows().map((r) => [`${r.module} ${r.name}`, { name: r.name, f: r.f, row: r.row }]));

parentPort!.on('message', (job: Job) => {
  calls = 0;
  const entry = entries.get(`${job.module} ${job.entry}`);
  let faults: Fault[];
  try {
    if (!entry) faults = [{ entry: job.entry, call: '', fault: `no function row for ${job.module} ${job.entry}` }];
    else if (job.pass === 'valid') faults = runValid(entry, monitor);
    else if (job.pass === 'sweep') faults = runSweep(entry, monitor);
    else faults = runFuzz(entry, job.seed, job.runs, monitor);
  } catch (e) {
    faults = [{ entry: job.entry, call: '', fault: `the ${job.pass} pass itself failed (a table fault?): ${e instanceof Error ? (e.stack ?? e.message) : String(e)}` }];
  }
  const answer: Answer = { id: job.id, faults, calls };
  parentPort!.postMessage(answer);
});

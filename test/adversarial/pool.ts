/**
 * The main-thread side of the adversarial suite: bundles worker.ts (and the sources it tests) with esbuild, runs it
 * in a worker_threads Worker, and watches every call. A synchronous hang cannot be interrupted in-process, so the
 * watchdog ends the worker when one call has run longer than the limit, reports that call by the description the
 * worker wrote before starting it, and starts a fresh worker for the next job.
 */
import { build } from 'esbuild';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { Fault } from './runner.js';
import type { Answer, Job } from './worker.js';

/** The watchdog's limit for one call: generous, so that a busy 2-core CI machine never trips it. */
export const CALL_LIMIT_MS = 2_000;

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

export interface PoolResult {
  readonly faults: readonly Fault[];
  readonly calls: number;
}

export class Pool {
  private readonly dir = mkdtempSync(join(tmpdir(), 'kalends-adversarial-'));
  private readonly shared = new SharedArrayBuffer(8 + 16_384);
  private readonly beat = new Int32Array(this.shared, 0, 2);
  private readonly text = new Uint8Array(this.shared, 8);
  private script: string | undefined;
  private worker: Worker | undefined;
  private nextId = 1;

  /** Bundles the worker (about a second). */
  async start(): Promise<void> {
    const outfile = join(this.dir, 'worker.mjs');
    await build({
      entryPoints: [join(ROOT, 'test/adversarial/worker.ts')],
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      outfile,
      alias: { kalends: join(ROOT, 'src/index.ts') },
      logLevel: 'error',
      banner: { js: "import { createRequire as __kalendsRequire } from 'node:module'; const require = __kalendsRequire(import.meta.url);" },
    });
    this.script = outfile;
  }

  private spawn(): Worker {
    if (!this.script) throw new Error('Pool.start() first');
    this.worker = new Worker(this.script, { workerData: { shared: this.shared, root: ROOT, sandbox: join(this.dir, 'sandbox') } });
    this.worker.unref();
    return this.worker;
  }

  /** Runs one job; a call that runs past the limit ends the worker and is reported as a fault. */
  run(job: Omit<Job, 'id'>, limitMs = CALL_LIMIT_MS): Promise<PoolResult> {
    const worker = this.worker ?? this.spawn();
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      let seen = Atomics.load(this.beat, 0);
      let since = Date.now();
      const timer = setInterval(() => {
        const beat = Atomics.load(this.beat, 0);
        if (beat !== seen) {
          seen = beat;
          since = Date.now();
          return;
        }
        if (Date.now() - since < limitMs) return;
        cleanup();
        const length = Atomics.load(this.beat, 1);
        const call = new TextDecoder().decode(this.text.slice(0, length));
        void worker.terminate();
        this.worker = undefined;
        resolve({ faults: [{ entry: job.entry, call, fault: `${call}: still running after ${limitMs} ms (the watchdog ended it): a hang or unbounded work` }], calls: 0 });
      }, 50);
      const onMessage = (answer: Answer) => {
        if (answer.id !== id) return;
        cleanup();
        resolve({ faults: answer.faults, calls: answer.calls });
      };
      const onError = (error: Error) => {
        cleanup();
        this.worker = undefined;
        reject(error);
      };
      const cleanup = () => {
        clearInterval(timer);
        worker.off('message', onMessage);
        worker.off('error', onError);
      };
      worker.on('message', onMessage);
      worker.on('error', onError);
      worker.postMessage({ ...job, id } satisfies Job);
    });
  }

  async stop(): Promise<void> {
    await this.worker?.terminate();
    this.worker = undefined;
    rmSync(this.dir, { recursive: true, force: true });
  }
}

/** The seed of the suite's fuzz pass (FUZZ_SEED overrides it, for `npm run fuzz -- --seed n`). */
export const FUZZ_SEED = Number(process.env['FUZZ_SEED'] ?? 20_261_212);
/** Runs per entry point of the fuzz pass: 200 in CI, FUZZ_RUNS for long local runs. */
export const FUZZ_RUNS = Number(process.env['FUZZ_RUNS'] ?? 200);

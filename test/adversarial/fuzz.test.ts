/**
 * The fuzz pass (issue 12): for every public function, seeded fast-check runs with a generated hostile value in one
 * parameter, option key or definition field at a time, while the other parameters take generated valid values. The
 * invariant is that of check.ts: a correct value, or a kalends error of a documented class and code whose message
 * names the parameter and quotes the value. Every call runs in a worker under the watchdog (pool.ts).
 *
 * CI runs FUZZ_RUNS = 200 per entry point with a fixed seed; `npm run fuzz` runs 10,000 (DEVELOPERS.md, "The
 * adversarial suite"). A fault names the call, the seed and fast-check's path, so that it can be replayed.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FUZZ_RUNS, FUZZ_SEED, Pool } from './pool.js';
import { MODULES } from './table.js';

const pool = new Pool();
beforeAll(() => pool.start());
afterAll(() => pool.stop());

describe(`the fuzz: ${FUZZ_RUNS} generated hostile calls per public function (seed ${FUZZ_SEED})`, () => {
  for (const m of MODULES) {
    for (const [entry, row] of Object.entries(m.table)) {
      if (row.type !== 'function') continue;
      it(`${m.name === 'kalends' ? '' : `${m.name}: `}${entry}`, async () => {
        const r = await pool.run({ pass: 'fuzz', module: m.name, entry, seed: FUZZ_SEED, runs: FUZZ_RUNS });
        expect(r.faults.map((f) => f.fault)).toEqual([]);
      }, Math.max(60_000, FUZZ_RUNS * 200));
    }
  }
});

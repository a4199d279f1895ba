/**
 * Issue 13's sweep: every public function, called with one bad argument of each kind (the hostile catalogue of
 * hostile.ts and the edges of each parameter's kind, every option key, every field of a definition), must throw
 * the class and code docs/design.md ("Errors", "Input rules") gives, with a message that starts with the parameter
 * (or path) and quotes the value; or return what the equivalent input returns (-0 as 0, a fraction of an instant
 * as Math.floor, an alias as its canonical name). Each call runs in a worker under the watchdog (pool.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Pool } from './pool.js';
import { MODULES } from './table.js';

const pool = new Pool();
beforeAll(() => pool.start());
afterAll(() => pool.stop());

describe('the sweep: one bad argument of each kind, for every public function', () => {
  for (const m of MODULES) {
    for (const [entry, row] of Object.entries(m.table)) {
      if (row.type !== 'function') continue;
      it(`${m.name === 'kalends' ? '' : `${m.name}: `}${entry}`, async () => {
        const r = await pool.run({ pass: 'sweep', module: m.name, entry, seed: 0, runs: 0 });
        expect(r.faults.map((f) => f.fault)).toEqual([]);
      });
    }
  }
});

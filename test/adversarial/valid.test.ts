/**
 * Every row's valid example runs and gives a value of its shape (a row that cannot run its own example would make
 * the sweep and the fuzz meaningless), in the worker under the watchdog.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Pool } from './pool.js';
import { MODULES } from './table.js';

const pool = new Pool();
beforeAll(() => pool.start());
afterAll(() => pool.stop());

describe('the valid example of every function row', () => {
  for (const m of MODULES) {
    const names = Object.entries(m.table).filter(([, r]) => r.type === 'function').map(([n]) => n);
    it(`${m.name}: ${names.length} rows`, async () => {
      const faults: string[] = [];
      for (const entry of names) {
        const r = await pool.run({ pass: 'valid', module: m.name, entry, seed: 0, runs: 0 });
        faults.push(...r.faults.map((f) => `${f.call}: ${f.fault}`));
      }
      expect(faults).toEqual([]);
    });
  }
});

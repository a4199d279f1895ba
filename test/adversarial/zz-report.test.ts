import { writeFileSync } from 'node:fs';
import { it } from 'vitest';
import { Pool } from './pool.js';
import { MODULES } from './table.js';
it('report', async () => {
  const pool = new Pool();
  await pool.start();
  const pass = (process.env['PASS'] ?? 'sweep') as 'sweep' | 'fuzz' | 'valid';
  const only = process.env['ONLY'];
  const out: Record<string, string[]> = {};
  const t0 = Date.now();
  const times: Record<string, number> = {};
  for (const m of MODULES) for (const [entry, row] of Object.entries(m.table)) {
    if (row.type !== 'function') continue;
    if (only && !only.split(',').includes(entry)) continue;
    const t = Date.now();
    const r = await pool.run({ pass, module: m.name, entry, seed: Number(process.env['SEED'] ?? 1), runs: Number(process.env['RUNS'] ?? 200) });
    times[entry] = Date.now() - t;
    if (r.faults.length) out[entry] = r.faults.map((f) => f.fault);
  }
  await pool.stop();
  writeFileSync('/tmp/report.json', JSON.stringify({ total: Date.now() - t0, times, out }, null, 1));
}, 600_000);

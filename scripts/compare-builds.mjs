// A/B: an earlier build of kalends against this one, interleaved in one process (issue 13: benchmarks within 5%
// of the release before). Usage, from the repository root after `npm run build`:
//   git worktree add /tmp/release-0.1 2e4e172 && (cd /tmp/release-0.1 && npm ci && npx tsup --silent)
//   node scripts/compare-builds.mjs /tmp/release-0.1/dist/index.js     (ROUNDS=21 for more rounds)
// Only functions whose name and signature are the same in both builds are compared.
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
const A = await import(pathToFileURL(resolve(process.argv[2] ?? '/tmp/release-0.1/dist/index.js')).href);
const B = await import(pathToFileURL(resolve(process.argv[3] ?? 'dist/index.js')).href);
let seed = 12345; const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 4294967296);
const N = 1_000_000;
const lo = Date.UTC(2000, 0, 1), hi = Date.UTC(2040, 0, 1);
const inst = new Float64Array(N); for (let i = 0; i < N; i++) inst[i] = Math.floor(lo + rnd() * (hi - lo));
const sorted = Float64Array.from(inst).sort();
const days = new Int32Array(N); for (let i = 0; i < N; i++) days[i] = 10957 + Math.floor(rnd() * 14610);
const vals = new Float64Array(N); for (let i = 0; i < N; i++) vals[i] = rnd() * 100;
const out = new Int32Array(N); const outF = new Float64Array(N);
const texts = Array.from({ length: 20000 }, (_, i) => new Date(lo + Math.floor(rnd() * (hi - lo))).toISOString());
const pairs = Array.from({ length: 100000 }, () => [10957 + Math.floor(rnd() * 14610), Math.floor(rnd() * 400)]);
function cases(L) {
  const s = L.seriesFromColumns(sorted, { amount: vals });
  const cal = L.calendarFromName('us-federal');
  const unitFq = L.defineUnit('quarter');
  const win = { lengthMs: 30 * 86400000 };
  return {
    'zone dayNumberFromEpochMsBulk 1M': () => L.dayNumberFromEpochMsBulk('America/New_York', inst, out)[N - 1],
    'period ordinalFromEpochMsBulk month 1M': () => L.ordinalFromEpochMsBulk('month', 'America/New_York', inst, out)[N - 1],
    'period ordinalFromDayNumberBulk quarter 1M': () => L.ordinalFromDayNumberBulk(unitFq, days, out)[N - 1],
    'civil ymdFromDayNumberBulk 1M': () => L.ymdFromDayNumberBulk(days).years[N - 1],
    'series bucketSeries month sum,mean 1M': () => L.bucketSeries(s, { unit: 'month', zone: 'America/New_York', aggregations: ['sum', 'mean'] }).ordinals.length,
    'series rollBulk 30d mean 1M': () => L.rollBulk(sorted, vals, { window: win, aggregation: 'mean' }, outF)[N - 1],
    'business countBusinessDays 100k': () => { let a = 0; for (const [d, n] of pairs) a += L.countBusinessDays(cal, d, d + n); return a; },
    'business shiftBusinessDays 100k': () => { let a = 0; for (const [d, n] of pairs) a += L.shiftBusinessDays(cal, d, n); return a; },
    'instant parseInstant 20k': () => { let a = 0; for (const t of texts) a += L.parseInstant(t).epochMs; return a; },
  };
}
const ca = cases(A), cb = cases(B);
const names = Object.keys(ca);
const rounds = Number(process.env.ROUNDS ?? 9);
console.log(`A = ${process.argv[2] ?? '0.1'}, B = this build; ${rounds} interleaved rounds, median ms and median of per-round ratios B/A`);
for (const n of names) {
  if (ca[n]() !== cb[n]()) console.log(`  ! results differ for ${n}`);
  const ta = [], tb = [], r = [];
  for (let k = 0; k < rounds; k++) {
    const order = k % 2 ? [[ca, ta], [cb, tb]] : [[cb, tb], [ca, ta]];
    for (const [c, t] of order) { const t0 = performance.now(); c[n](); t.push(performance.now() - t0); }
    r.push(tb[k] / ta[k]);
  }
  const med = (x) => [...x].sort((a, b) => a - b)[x.length >> 1];
  console.log(`${n.padEnd(44)} A ${med(ta).toFixed(2).padStart(8)}  B ${med(tb).toFixed(2).padStart(8)}  B/A ${med(r).toFixed(3)}`);
}

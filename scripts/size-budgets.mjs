// Size budgets: bundles fixed sets of imports from the built package (dist/index.js, as a consumer's bundler
// would see it) with esbuild, minified, and gzips the result. A set over its budget fails with the sizes printed.
// Run after `npm run build`: `node scripts/size-budgets.mjs` (`--json` prints the figures as JSON).
import { build } from 'esbuild';
import { gzipSync } from 'node:zlib';
import { fileURLToPath } from 'node:url';
import { dirname, resolve } from 'node:path';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** Each set: the names imported, the budget in bytes (min+gz), and why the budget is what it is. */
export const SETS = [
  {
    name: 'instant parse/format',
    imports: ['parseInstant', 'formatInstant', 'parsePlainDate', 'formatPlainDate', 'parsePlainDateTime', 'formatPlainDateTime'],
    budget: 6000,
  },
  {
    name: 'civil + ISO weeks',
    imports: ['dayNumberFromYmd', 'ymdFromDayNumber', 'weekdayOfDayNumber', 'isoWeekDateFromDayNumber', 'dayNumberFromIsoWeekDate', 'isoWeekCountOfYear'],
    budget: 3000,
  },
  {
    name: 'period API with bulk',
    imports: [
      'defineUnit',
      'periodFromDayNumber',
      'periodFromEpochMs',
      'formatPeriod',
      'parsePeriod',
      'shiftPeriod',
      'firstDayNumberOfPeriod',
      'ordinalFromDayNumberBulk',
      'ordinalFromEpochMsBulk',
      'formatOrdinalBulk',
    ],
    budget: 12000,
  },
  {
    name: 'zone conversion',
    imports: ['zoneFromId', 'offsetSecondsFromEpochMs', 'wallMsFromEpochMs', 'epochMsFromWallMs', 'resolveWallMs', 'dayNumberFromEpochMsBulk'],
    budget: 10000,
  },
  {
    name: 'business days with one bundled calendar',
    imports: ['isBusinessDay', 'shiftBusinessDays', 'countBusinessDays', 'adjustDayNumber', 'defineCalendar', 'US_FEDERAL_HOLIDAYS'],
    budget: 8000,
  },
  {
    // Issue 17 measured 71.3 kB for the 0.1 surface; the budget allows 10% above it.
    name: 'everything',
    imports: '*',
    budget: 78400,
  },
];

async function measure(set) {
  const source =
    set.imports === '*'
      ? `import * as k from 'kalends';\nglobalThis.__keep = k;\n`
      : `import { ${set.imports.join(', ')} } from 'kalends';\nglobalThis.__keep = [${set.imports.join(', ')}];\n`;
  const result = await build({
    stdin: { contents: source, resolveDir: root, sourcefile: 'entry.mjs', loader: 'js' },
    bundle: true,
    write: false,
    minify: true,
    format: 'esm',
    platform: 'neutral',
    target: 'es2022',
    alias: { kalends: resolve(root, 'dist/index.js') },
    logLevel: 'silent',
  });
  const code = result.outputFiles[0].contents;
  return { min: code.length, gz: gzipSync(code, { level: 9 }).length };
}

async function main() {
  const asJson = process.argv.includes('--json');
  const rows = [];
  for (const set of SETS) rows.push({ ...set, ...(await measure(set)) });
  if (asJson) {
    console.log(JSON.stringify(rows.map(({ name, min, gz, budget }) => ({ name, min, gz, budget })), null, 2));
  } else {
    const kb = (n) => (n / 1000).toFixed(1).padStart(6);
    console.log('entry set                                   min kB  min+gz kB  budget kB');
    for (const r of rows) console.log(`${r.name.padEnd(42)} ${kb(r.min)}  ${kb(r.gz)}     ${kb(r.budget)}${r.gz > r.budget ? '   OVER BUDGET' : ''}`);
  }
  const over = rows.filter((r) => r.gz > r.budget);
  if (over.length > 0) {
    console.error(`size budgets: ${over.length} entry set(s) over budget: ${over.map((r) => `${r.name} ${r.gz} B > ${r.budget} B`).join('; ')}`);
    process.exit(1);
  }
}

if (process.argv[1] === fileURLToPath(import.meta.url)) await main();

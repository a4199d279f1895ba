/**
 * `npm run bench:warehouse`: the warehouse exports' cost, and the same bucketing in an engine and in the library.
 *
 * 1. A calendar dimension of 150 years (1971-01-01 .. 2121-01-01, 54,787 days; the demo's US federal calendar starts in 1971) of the demo profile with every
 *    column: rows per second to build it, and to write each format, with the file sizes.
 * 2. The transition table of every zone the runtime knows over the same years, with zones compiled from the
 *    runtime's Intl and from the pinned tz data (kalends/tzdata): rows per second and file sizes.
 * 3. 10 million events in America/Chicago, 1990..2040, bucketed to fiscal quarters: once in DuckDB (embedded,
 *    the exported tables, the documented range join, equality join and GROUP BY; loading not timed), once with
 *    bucketSeries (the series built beforehand, not timed). Both results are checked equal before any timing is
 *    printed. Three timed runs each; the medians and their ratio.
 *
 * Single process; absolute times drift on this machine (docs/performance.md), so run it twice.
 */
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DuckDBInstance } from '@duckdb/node-api';
import {
  bucketSeries,
  defineProfile,
  dimensionTableFromProfile,
  formatExampleQueriesSql,
  formatLoadSql,
  formatTableCsv,
  formatTableJsonLines,
  listZoneIds,
  seriesFromColumns,
  transitionTableFromZones,
  unitOfProfile,
  zoneFromId,
  type WarehouseTable,
} from '../src/index.js';
import { PINNED_TZDATA, pinnedZoneIds } from '../src/tzdata/index.js';
import { parquetFromTable } from '../src/warehouse/files.js';
import { seededRandom } from './harness.js';
import otterbrook from '../examples/otterbrook.profile.json';

const EVENTS = Number(process.env['KALENDS_BENCH_EVENTS'] ?? 10_000_000);
const ZONE = 'America/Chicago';

function timed<T>(f: () => T): { value: T; ms: number } {
  const t0 = performance.now();
  const value = f();
  return { value, ms: performance.now() - t0 };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

const fmt = (n: number) => Math.round(n).toLocaleString('en-US');
const mb = (bytes: number) => `${(bytes / 1048576).toFixed(2)} MB`;

function writeFormats(dir: string, t: WarehouseTable): void {
  const makers: [string, () => string | Uint8Array][] = [
    ['csv', () => formatTableCsv(t)],
    ['jsonl', () => formatTableJsonLines(t)],
    ['parquet', () => parquetFromTable(t)],
  ];
  for (const [ext, make] of makers) {
    const { value, ms } = timed(make);
    const path = join(dir, `${t.name}.${ext}`);
    writeFileSync(path, value);
    console.log(`  ${ext.padEnd(8)} ${fmt(ms).padStart(7)} ms  ${fmt((t.rowCount / ms) * 1000).padStart(11)} rows/s  ${mb(statSync(path).size).padStart(10)}`);
  }
}

async function main(): Promise<void> {
  console.log(`kalends warehouse benchmark, Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`);
  const profile = defineProfile(otterbrook as never);
  const dir = mkdtempSync(join(tmpdir(), 'kalends-bench-'));
  try {
    // 1. The dimension.
    dimensionTableFromProfile(profile, { start: '2000-01-01', end: '2001-01-01' }); // warm-up
    const dim = timed(() => dimensionTableFromProfile(profile, { start: '1971-01-01', end: '2121-01-01' }));
    console.log(`\ncalendar_day, 1971..2120: ${fmt(dim.value.rowCount)} rows, ${dim.value.columns.length} columns`);
    console.log(`  build    ${fmt(dim.ms).padStart(7)} ms  ${fmt((dim.value.rowCount / dim.ms) * 1000).padStart(11)} rows/s`);
    writeFormats(dir, dim.value);

    // 2. Every zone's offset periods.
    const startMs = Date.UTC(1900, 0, 1);
    const endMs = Date.UTC(2050, 0, 1);
    const ids = [...listZoneIds()];
    const intl = timed(() => transitionTableFromZones(ids, startMs, endMs));
    console.log(`\nzone_offset_period, ${ids.length} zones (runtime Intl), 1900..2049: ${fmt(intl.value.rowCount)} rows`);
    console.log(`  build    ${fmt(intl.ms).padStart(7)} ms  ${fmt((intl.value.rowCount / intl.ms) * 1000).padStart(11)} rows/s  (zones compiled from Intl while listing)`);
    writeFormats(dir, intl.value);
    const pinnedIds = [...pinnedZoneIds()];
    const pinnedZones = timed(() => pinnedIds.map((id) => zoneFromId(id, { source: PINNED_TZDATA })));
    const pinned = timed(() => transitionTableFromZones(pinnedZones.value, startMs, endMs));
    console.log(`zone_offset_period, ${pinnedIds.length} ids (pinned tz data), 1900..2049: ${fmt(pinned.value.rowCount)} rows`);
    console.log(`  build    ${fmt(pinned.ms).padStart(7)} ms  ${fmt((pinned.value.rowCount / pinned.ms) * 1000).padStart(11)} rows/s  (zones made in ${fmt(pinnedZones.ms)} ms, not counted)`);

    // 3. 10M events to fiscal quarters, in DuckDB and with bucketSeries.
    const rnd = seededRandom(20261204);
    const lo = Date.UTC(1990, 0, 1);
    const span = Date.UTC(2041, 0, 1) - lo;
    const times = new Float64Array(EVENTS);
    const amounts = new Float64Array(EVENTS);
    for (let i = 0; i < EVENTS; i++) {
      times[i] = lo + Math.floor(rnd() * span);
      amounts[i] = 1 + Math.floor(rnd() * 1000);
    }
    const events: WarehouseTable = {
      name: 'events',
      rowCount: EVENTS,
      description: 'benchmark events',
      columns: [
        { name: 'event_id', type: 'int32', values: Int32Array.from({ length: EVENTS }, (_, i) => i), description: '' },
        { name: 'epoch_ms', type: 'int64', values: times, description: '' },
        { name: 'amount', type: 'int64', values: amounts, description: '' },
      ],
    };
    writeFileSync(join(dir, 'events.parquet'), parquetFromTable(events));
    const tables = [dimensionTableFromProfile(profile, { start: '1989-12-30', end: '2041-01-03' }), transitionTableFromZones([ZONE], lo - 2 * 86_400_000, lo + span + 2 * 86_400_000)];
    for (const t of tables) writeFileSync(join(dir, `${t.name}.parquet`), parquetFromTable(t));
    const db = await DuckDBInstance.create(':memory:');
    const c = await db.connect();
    await c.run(`SET file_search_path = '${dir}'`);
    for (const s of formatLoadSql(tables, { dialect: 'duckdb', format: 'parquet' }).split(/;\s*\n/)) {
      const text = s.replace(/^--.*$/gm, '').trim();
      if (text) await c.run(text);
    }
    await c.run(`CREATE TABLE events AS SELECT event_id, epoch_ms, '${ZONE}' AS zone, CAST(amount AS DOUBLE) AS amount FROM read_parquet('events.parquet')`);
    const queries = formatExampleQueriesSql(tables[0]!, { labelColumns: ['fiscal_quarter_label'] });
    for (const s of queries.split('-- 3.')[0]!.split(/;\s*\n/)) {
      const text = s.replace(/^--.*$/gm, '').trim();
      if (text) await c.run(text);
    }
    const totals = queries.slice(queries.indexOf('-- 3.')).split(';')[0]!.replace(/^--.*$/gm, '');
    const threads = (await c.runAndReadAll("SELECT current_setting('threads')")).getRows()[0]![0];
    const built = timed(() => seriesFromColumns(times, { amount: amounts }));
    const series = built.value;
    // The pre-joined variant: a local-day column stored with the events (made once, not timed).
    await c.run('CREATE TABLE events_local AS SELECT event_id, day_number, amount FROM event_local_day');
    const preJoined = `SELECT d.fiscal_quarter_label, COUNT(*), SUM(e.amount) FROM events_local AS e JOIN calendar_day AS d ON d.day_number = e.day_number GROUP BY d.fiscal_quarter_label`;
    const unit = unitOfProfile(profile, 'fiscal-quarter');
    // Check the two agree before timing anything.
    const engineRows = (await c.runAndReadAll(totals)).getRows();
    const library = bucketSeries(series, { unit, zone: ZONE, aggregations: ['sum'] });
    const engine = new Map(engineRows.map((r) => [r[0] as string, Number(r[2])]));
    library.labels.forEach((label, k) => {
      if (engine.get(label) !== library.columns['sum']![k]) throw new Error(`DuckDB and bucketSeries disagree on ${label}: ${engine.get(label)} and ${library.columns['sum']![k]}`);
    });
    if (engine.size !== library.length) throw new Error(`DuckDB gave ${engine.size} quarters, bucketSeries ${library.length}`);
    const preRows = (await c.runAndReadAll(preJoined)).getRows();
    for (const r of preRows) if (engine.get(r[0] as string) !== Number(r[2])) throw new Error(`the pre-joined query disagrees on ${String(r[0])}`);
    const duck: number[] = [];
    const duckPre: number[] = [];
    const ours: number[] = [];
    for (let round = 0; round < 3; round++) {
      let t0 = performance.now();
      await c.runAndReadAll(totals);
      duck.push(performance.now() - t0);
      t0 = performance.now();
      await c.runAndReadAll(preJoined);
      duckPre.push(performance.now() - t0);
      ours.push(timed(() => bucketSeries(series, { unit, zone: ZONE, aggregations: ['sum'] })).ms);
    }
    console.log(`\n${fmt(EVENTS)} events in ${ZONE} to fiscal quarters (${library.length} quarters, results equal):`);
    console.log(`  DuckDB ${String(threads)} threads, range join + equality join + GROUP BY: ${fmt(median(duck))} ms (runs ${duck.map(fmt).join(', ')})`);
    console.log(`  DuckDB, a stored local-day column, equality join + GROUP BY: ${fmt(median(duckPre))} ms (runs ${duckPre.map(fmt).join(', ')})`);
    console.log(`  bucketSeries, one thread:                               ${fmt(median(ours))} ms (runs ${ours.map(fmt).join(', ')}; building the sorted series took ${fmt(built.ms)} ms once)`);
    console.log(`  ratio DuckDB / bucketSeries: ${(median(duck) / median(ours)).toFixed(1)} (range join), ${(median(duckPre) / median(ours)).toFixed(1)} (stored local day)`);
    c.closeSync();
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});

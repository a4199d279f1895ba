/**
 * The warehouse bridge checked in a real engine: DuckDB (the @duckdb/node-api dev dependency, embedded in this
 * process) loads the exported Parquet and CSV files of the demo profile, runs the documented queries
 * (queries.sql) over random events in three zones from 1990 to 2040 plus an instant on every transition ±1 s and
 * on every local midnight ±1 ms, and every event's local day, fiscal quarter label, retail week label and
 * business-day flag must equal the library's (ordinalFromEpochMsBulk, formatOrdinalBulk, isBusinessDay): 0
 * mismatches. The per-quarter sums of the documented GROUP BY must equal bucketSeries.
 *
 * Size: 1,000,000 random events (about 45 s on 2 cores; KALENDS_WAREHOUSE_EVENTS=n chooses another count), plus
 * about 170,000 edge instants, which are always all included.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DuckDBInstance, type DuckDBConnection } from '@duckdb/node-api';
import {
  bucketSeries,
  dayNumberFromYmd,
  defineProfile,
  dimensionTableFromProfile,
  firstEpochMsOfDayNumber,
  formatLoadSql,
  scheduleTableFromProfile,
  seriesFromColumns,
  transitionTableFromZones,
  unitOfProfile,
} from '../../src/index.js';
import { parquetFromTable, writeWarehouseExport } from '../../src/warehouse/files.js';
import { DIMENSION_RANGE, type Events, ZONES, libraryAnswers, makeEvents } from './events.js';

const RANDOM_EVENTS = Number(process.env['KALENDS_WAREHOUSE_EVENTS'] ?? 1_000_000);

const doc = JSON.parse(readFileSync(new URL('../../examples/otterbrook.profile.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const profile = defineProfile(doc as never);
const dir = mkdtempSync(join(tmpdir(), 'kalends-warehouse-'));
let connection: DuckDBConnection;
let instance: DuckDBInstance;

let events: Events;

async function rows(sql: string): Promise<unknown[][]> {
  return (await connection.runAndReadAll(sql)).getRows() as unknown[][];
}

async function runScript(sql: string): Promise<void> {
  // One statement at a time, so that a failure names its statement; psql-style lines never reach DuckDB.
  for (const statement of sql.split(/;\s*\n/)) {
    const text = statement.replace(/^--.*$/gm, '').trim();
    if (text !== '') await connection.run(text);
  }
}

beforeAll(async () => {
  // Local days from the day before the first instant to the day after the last, in every zone.
  writeWarehouseExport(profile, dir, { formats: ['parquet', 'csv'], ...DIMENSION_RANGE, zones: [...ZONES] });
  events = makeEvents(RANDOM_EVENTS);
  const table = {
    name: 'events',
    rowCount: events.epochMs.length,
    description: 'test events',
    columns: [
      { name: 'event_id', type: 'int32' as const, values: Int32Array.from({ length: events.epochMs.length }, (_, i) => i), description: '' },
      { name: 'epoch_ms', type: 'int64' as const, values: events.epochMs, description: '' },
      { name: 'zone', type: 'string' as const, values: Array.from(events.zone, (z) => ZONES[z]!), description: '' },
      { name: 'amount', type: 'int64' as const, values: events.amount, description: '' },
    ],
  };
  const { writeFileSync } = await import('node:fs');
  writeFileSync(join(dir, 'events.parquet'), parquetFromTable(table));
  instance = await DuckDBInstance.create(':memory:');
  connection = await instance.connect();
  await connection.run(`SET file_search_path = '${dir}'`);
  await runScript(readFileSync(join(dir, 'load.duckdb.sql'), 'utf8'));
  await connection.run(`CREATE TABLE events AS SELECT event_id, epoch_ms, zone, CAST(amount AS DOUBLE) AS amount FROM read_parquet('events.parquet')`);
  await runScript(readFileSync(join(dir, 'queries.sql'), 'utf8').split('-- 3.')[0]!);
}, 600_000);

afterAll(() => {
  connection?.closeSync();
  rmSync(dir, { recursive: true, force: true });
});

describe('the warehouse export in DuckDB', () => {
  it('loads the Parquet files with every row, and the CSV files load to the same tables', async () => {
    const counts = await rows('SELECT (SELECT COUNT(*) FROM calendar_day), (SELECT COUNT(*) FROM zone_offset_period), (SELECT COUNT(*) FROM schedule_occurrence)');
    const dimension = dimensionTableFromProfile(profile, DIMENSION_RANGE);
    const startMs = firstEpochMsOfDayNumber('UTC', dayNumberFromYmd(1989, 12, 30)) - 2 * 86_400_000;
    const endMs = firstEpochMsOfDayNumber('UTC', dayNumberFromYmd(2041, 1, 3)) + 2 * 86_400_000;
    const transitions = transitionTableFromZones([...ZONES], startMs, endMs);
    const schedules = scheduleTableFromProfile(profile, DIMENSION_RANGE);
    expect(counts[0]!.map(Number)).toEqual([dimension.rowCount, transitions.rowCount, schedules.rowCount]);
    await connection.run('CREATE SCHEMA from_csv');
    await connection.run('SET schema = \'from_csv\'');
    await runScript(formatLoadSql([dimension, transitions, schedules], { dialect: 'duckdb', format: 'csv' }).replace(/^CREATE (UNIQUE )?INDEX.*$/gm, ''));
    await connection.run('SET schema = \'main\'');
    for (const t of ['calendar_day', 'zone_offset_period', 'schedule_occurrence']) {
      const diff = await rows(
        `SELECT (SELECT COUNT(*) FROM (SELECT * FROM main.${t} EXCEPT ALL SELECT * FROM from_csv.${t})), (SELECT COUNT(*) FROM (SELECT * FROM from_csv.${t} EXCEPT ALL SELECT * FROM main.${t}))`,
      );
      expect({ table: t, differences: diff[0]!.map(Number) }).toEqual({ table: t, differences: [0, 0] });
    }
  });

  it('every event gets the library\'s local day, fiscal quarter, retail week and business-day flag: 0 mismatches', async () => {
    const n = events.epochMs.length;
    expect(n).toBeGreaterThan(RANDOM_EVENTS + 150_000);
    const reader = await connection.runAndReadAll(
      'SELECT l.event_id, l.day_number, c.fiscal_quarter_label, c.retail_week_label, c.is_business_day FROM event_local_day AS l JOIN event_calendar AS c ON c.event_id = l.event_id ORDER BY l.event_id',
    );
    const [ids, days, quarters, weeks, business] = reader.getColumns() as [number[], number[], string[], string[], boolean[]];
    expect(ids.length).toBe(n);
    const lib = libraryAnswers(profile, events);
    let mismatches = 0;
    const examples: string[] = [];
    for (let i = 0; i < n; i++) {
      const ok = ids[i] === i && days[i] === lib.day[i] && quarters[i] === lib.quarter[i] && weeks[i] === lib.week[i] && business[i] === lib.business[i];
      if (!ok) {
        mismatches++;
        if (examples.length < 5) examples.push(`${ZONES[events.zone[i]!]} ${events.epochMs[i]}: engine ${days[i]} ${quarters[i]} ${weeks[i]} ${business[i]}, library ${lib.day[i]} ${lib.quarter[i]} ${lib.week[i]} ${lib.business[i]}`);
      }
    }
    expect(examples).toEqual([]);
    expect(mismatches).toBe(0);
  });

  it('the documented GROUP BY per fiscal quarter equals bucketSeries, summed over the three zones', async () => {
    const queries = readFileSync(join(dir, 'queries.sql'), 'utf8');
    const totalsQuery = queries.slice(queries.indexOf('-- 3.')).split(';')[0]!.replace(/^--.*$/gm, '');
    const engine = new Map<string, number>();
    for (const [period, , amount] of await rows(totalsQuery)) engine.set(period as string, Number(amount));
    const library = new Map<string, number>();
    const fq = unitOfProfile(profile, 'fiscal-quarter');
    ZONES.forEach((zone, z) => {
      const idx: number[] = [];
      for (let i = 0; i < events.epochMs.length; i++) if (events.zone[i] === z) idx.push(i);
      const series = seriesFromColumns(Float64Array.from(idx, (i) => events.epochMs[i]!), { amount: Float64Array.from(idx, (i) => events.amount[i]!) });
      const table = bucketSeries(series, { unit: fq, zone, aggregations: ['sum'] });
      table.labels.forEach((label, k) => library.set(label, (library.get(label) ?? 0) + table.columns['sum']![k]!));
    });
    expect(engine.size).toBeGreaterThan(200);
    expect([...engine.entries()].sort()).toEqual([...library.entries()].sort());
  });
});

/**
 * The PostgreSQL side of the warehouse bridge, in a real server: a throwaway PostgreSQL cluster (Debian's
 * postgresql 15 package, on the project's machines; started by this test on a Unix socket in a temporary directory,
 * no TCP) loads the exported CSV files with load.postgresql.sql through psql (its `\copy`), and runs queries.sql,
 * the same text DuckDB runs, over 100,000 random events plus every transition ±1 s and local midnight ±1 ms in
 * three zones. Every event's local day, fiscal quarter, retail week and business-day flag must equal the
 * library's: 0 mismatches; the totals query must equal the library's sums.
 *
 * Where the server programs are missing the test is skipped, and says so on stderr.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { defineProfile, formatPlainDate } from '../../src/index.js';
import { writeWarehouseExport } from '../../src/warehouse/files.js';
import { DIMENSION_RANGE, type Events, ZONES, libraryAnswers, makeEvents } from './events.js';
import { note } from '../note.js';

const BIN = '/usr/lib/postgresql/15/bin';
const available = existsSync(join(BIN, 'initdb')) && existsSync(join(BIN, 'pg_ctl')) && existsSync(join(BIN, 'psql'));
if (!available) note(`postgresql.test.ts: skipped: no PostgreSQL 15 programs in ${BIN} (Debian package postgresql-15)`);

const profile = defineProfile(JSON.parse(readFileSync(new URL('../../examples/otterbrook.profile.json', import.meta.url), 'utf8')) as never);
const root = available ? mkdtempSync(join(tmpdir(), 'kalends-pg-')) : '';
const port = 50_000 + (process.pid % 10_000);
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
let events: Events;

/** Runs a server program, as the postgres user when this process is root (PostgreSQL refuses to run as root). */
function asServerUser(program: string, args: string[]): void {
  if (isRoot) {
    const quoted = [join(BIN, program), ...args].map((a) => `'${a.replace(/'/g, "'\\''")}'`).join(' ');
    execFileSync('su', ['postgres', '-s', '/bin/sh', '-c', quoted], { stdio: 'pipe' });
  } else execFileSync(join(BIN, program), args, { stdio: 'pipe' });
}

function psql(args: string[], cwd: string): string {
  const r = spawnSync(join(BIN, 'psql'), ['-X', '-q', '-v', 'ON_ERROR_STOP=1', '-h', root, '-p', String(port), '-U', 'postgres', '-d', 'postgres', ...args], {
    cwd,
    encoding: 'utf8',
    maxBuffer: 1 << 28,
  });
  if (r.status !== 0) throw new Error(`psql ${args.join(' ')} failed: ${r.stderr}`);
  return r.stdout;
}

function rows(sql: string, cwd: string): string[][] {
  return psql(['-A', '-t', '-F', '|', '-c', sql], cwd)
    .split('\n')
    .filter((l) => l !== '')
    .map((l) => l.split('|'));
}

describe.skipIf(!available)('the warehouse export in PostgreSQL', () => {
  const exportDir = join(root, 'export');

  beforeAll(() => {
    if (isRoot) {
      const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
      const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
      chownSync(root, uid, gid);
    }
    asServerUser('initdb', ['-D', join(root, 'data'), '-U', 'postgres', '--auth=trust', '--no-sync']);
    asServerUser('pg_ctl', ['-D', join(root, 'data'), '-o', `-k ${root} -c listen_addresses= -p ${port} -c fsync=off`, '-l', join(root, 'server.log'), '-w', 'start']);
    writeWarehouseExport(profile, exportDir, { formats: ['csv'], ...DIMENSION_RANGE, zones: [...ZONES] });
    events = makeEvents(100_000, 7);
    const lines = ['event_id,epoch_ms,zone,amount'];
    for (let i = 0; i < events.epochMs.length; i++) lines.push(`${i},${events.epochMs[i]},${ZONES[events.zone[i]!]},${events.amount[i]}`);
    writeFileSync(join(exportDir, 'events.csv'), `${lines.join('\n')}\n`);
    psql(['-f', 'load.postgresql.sql'], exportDir);
    psql(['-c', 'CREATE TABLE events (event_id bigint, epoch_ms bigint, zone varchar, amount double precision)', '-c', "\\copy events FROM 'events.csv' WITH (FORMAT csv, HEADER true)"], exportDir);
    const queries = readFileSync(join(exportDir, 'queries.sql'), 'utf8');
    writeFileSync(join(exportDir, 'views.sql'), queries.split('-- 3.')[0]!);
    psql(['-f', 'views.sql'], exportDir);
  }, 300_000);

  afterAll(() => {
    try {
      asServerUser('pg_ctl', ['-D', join(root, 'data'), '-m', 'immediate', 'stop']);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });

  it('loads every row of the CSV files', () => {
    const counts = rows('SELECT (SELECT COUNT(*) FROM calendar_day), (SELECT COUNT(*) FROM zone_offset_period), (SELECT COUNT(*) FROM schedule_occurrence)', exportDir)[0]!;
    const lines = (name: string) => readFileSync(join(exportDir, `${name}.csv`), 'utf8').trim().split('\n').length - 1;
    expect(counts.map(Number)).toEqual([lines('calendar_day'), lines('zone_offset_period'), lines('schedule_occurrence')]);
  });

  it('every event gets the library\'s local day, fiscal quarter, retail week and business-day flag: 0 mismatches', () => {
    const result = rows(
      'SELECT l.event_id, l.day_number, c.fiscal_quarter_label, c.retail_week_label, c.is_business_day FROM event_local_day AS l JOIN event_calendar AS c ON c.event_id = l.event_id ORDER BY l.event_id',
      exportDir,
    );
    const n = events.epochMs.length;
    expect(result.length).toBe(n);
    const lib = libraryAnswers(profile, events);
    const mismatches: string[] = [];
    result.forEach(([id, day, quarter, week, business], i) => {
      const ok = Number(id) === i && Number(day) === lib.day[i] && quarter === lib.quarter[i] && week === lib.week[i] && (business === 't') === lib.business[i];
      if (!ok && mismatches.length < 5) mismatches.push(`${id}: ${day} ${quarter} ${week} ${business} vs ${formatPlainDate(lib.day[i]!)} ${lib.quarter[i]} ${lib.week[i]} ${lib.business[i]}`);
    });
    expect(mismatches).toEqual([]);
  });

  it('the documented totals query equals the library\'s sums per fiscal quarter', () => {
    const queries = readFileSync(join(exportDir, 'queries.sql'), 'utf8');
    const totals = queries.slice(queries.indexOf('-- 3.')).split(';')[0]!.replace(/^--.*$/gm, '').trim();
    const engine = new Map(rows(totals, exportDir).map(([period, , amount]) => [period!, Number(amount)]));
    const lib = libraryAnswers(profile, events);
    const expected = new Map<string, number>();
    lib.quarter.forEach((q, i) => expected.set(q, (expected.get(q) ?? 0) + events.amount[i]!));
    expect([...engine.entries()].sort()).toEqual([...expected.entries()].sort());
  });
});

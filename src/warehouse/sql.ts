/**
 * The SQL that loads exported tables into an engine, and example queries: events to local days by a range join on
 * the transition table, then to fiscal periods and the business-day flag by an equality join on the dimension.
 * Two dialects only where loading differs (DuckDB, PostgreSQL); the queries are standard SQL both accept.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { readOptions, requireEnum } from '../diagnostics/index.js';
import type { WarehouseColumnType, WarehouseTable } from './table.js';
import { requireTable } from './text.js';

/** The engines whose loading SQL kalends writes. */
export type SqlDialect = 'duckdb' | 'postgresql';
const DIALECTS: readonly SqlDialect[] = ['duckdb', 'postgresql'];
/** The file formats the loading SQL reads. */
export type LoadFormat = 'csv' | 'parquet';
const FORMATS: readonly LoadFormat[] = ['csv', 'parquet'];

/** Options of {@link formatLoadSql}. */
export interface LoadSqlOptions {
  /** The SQL engine the statements are written for: `'duckdb'` or `'postgresql'`. */
  readonly dialect: SqlDialect;
  /** The files to read: `csv` (both dialects) or `parquet` (DuckDB). */
  readonly format: LoadFormat;
  /** Where the files are, as the engine sees it (default: the current directory, as relative names). */
  readonly directory?: string;
}

const SQL_TYPES: Readonly<Record<SqlDialect, Readonly<Record<WarehouseColumnType, string>>>> = {
  duckdb: { int32: 'INTEGER', int64: 'BIGINT', boolean: 'BOOLEAN', date: 'DATE', string: 'VARCHAR' },
  postgresql: { int32: 'integer', int64: 'bigint', boolean: 'boolean', date: 'date', string: 'text' },
};

function quoteLiteral(text: string): string {
  return `'${text.replace(/'/g, "''")}'`;
}

function fileOf(directory: string | undefined, table: WarehouseTable, extension: string): string {
  const name = `${table.name}.${extension}`;
  if (directory === undefined || directory === '') return name;
  return `${directory.replace(/\/+$/, '')}/${name}`;
}

/**
 * A SQL script that creates the tables and loads the exported files: for DuckDB from Parquet
 * (`read_parquet`) or CSV (`COPY ... FROM`), for PostgreSQL from CSV with psql's `\copy` (run it with `psql -f`),
 * with an index for the range join.
 *
 * @example
 * ```ts
 * formatLoadSql([dimension, transitions], { dialect: 'duckdb', format: 'parquet' });
 * // "CREATE OR REPLACE TABLE calendar_day AS SELECT * FROM read_parquet('calendar_day.parquet');\n..."
 * ```
 */
export function formatLoadSql(tables: readonly WarehouseTable[], options: LoadSqlOptions): string {
  const o = readOptions('options', options, ['dialect', 'format', 'directory']);
  const dialect = requireEnum('options.dialect', o['dialect'], DIALECTS);
  const format = requireEnum('options.format', o['format'], FORMATS);
  const directory = o['directory'] as string | undefined;
  if (dialect === 'postgresql' && format === 'parquet') {
    throw new KalendsRangeError('options.format: PostgreSQL reads no Parquet without an extension; load the CSV files (format "csv") instead', {
      code: 'unsupported',
      received: format,
    });
  }
  if (!Array.isArray(tables)) {
    throw new KalendsTypeError(`tables: expected an array of warehouse tables, got ${describeValue(tables)}`, { code: 'invalid-type', received: tables });
  }
  if (directory !== undefined && typeof directory !== 'string') {
    throw new KalendsTypeError(`options.directory: expected a directory path or undefined, got ${describeValue(directory)}`, { code: 'invalid-type', received: directory });
  }
  const types = SQL_TYPES[dialect];
  const out: string[] = [
    `-- Creates and loads the kalends warehouse tables in ${dialect === 'duckdb' ? 'DuckDB' : 'PostgreSQL'} from ${format === 'csv' ? 'CSV' : 'Parquet'} files.`,
    dialect === 'duckdb' ? '-- Run it with: duckdb warehouse.duckdb < this-file (from the directory of the files).' : '-- Run it with: psql -f this-file (from the directory of the files; \\copy is a psql command).',
    '',
  ];
  for (const raw of tables) {
    const t = requireTable(raw, 'tables[]');
    out.push(`-- ${t.name}: ${t.description} (${t.rowCount} rows when exported)`);
    const columns = t.columns.map((c) => `  ${c.name} ${types[c.type]}`).join(',\n');
    if (dialect === 'duckdb' && format === 'parquet') {
      out.push(`CREATE OR REPLACE TABLE ${t.name} AS SELECT * FROM read_parquet(${quoteLiteral(fileOf(directory, t, 'parquet'))});`);
    } else if (dialect === 'duckdb') {
      out.push(`CREATE OR REPLACE TABLE ${t.name} (\n${columns}\n);`);
      out.push(`COPY ${t.name} FROM ${quoteLiteral(fileOf(directory, t, 'csv'))} (FORMAT csv, HEADER true);`);
    } else {
      out.push(`DROP TABLE IF EXISTS ${t.name};`);
      out.push(`CREATE TABLE ${t.name} (\n${columns}\n);`);
      out.push(`\\copy ${t.name} FROM ${quoteLiteral(fileOf(directory, t, 'csv'))} WITH (FORMAT csv, HEADER true)`);
    }
    if (t.name === 'zone_offset_period') out.push(`CREATE INDEX zone_offset_period_by_start ON zone_offset_period (zone, from_epoch_ms);`);
    if (t.name === 'calendar_day') out.push(`CREATE ${dialect === 'postgresql' ? 'UNIQUE ' : ''}INDEX calendar_day_by_day ON calendar_day (day_number);`);
    out.push('');
  }
  return out.join('\n');
}

/** Options of {@link formatExampleQueriesSql}. */
export interface ExampleQueriesOptions {
  /** Label columns of the dimension to show per event (default: every `…_label` column). */
  readonly labelColumns?: readonly string[];
  /** The label column whose periods the totals query groups by (default: the first of `labelColumns`). */
  readonly groupBy?: string;
}

/**
 * Example queries in standard SQL that DuckDB and PostgreSQL both accept, over the tables of an export and a table
 * of your events `events(event_id, epoch_ms, zone, amount)`: (1) each event's local day, by a range join on
 * `zone_offset_period`; (2) each event's labels and business-day flag, by an equality join on `calendar_day`;
 * (3) totals per period; (4) the schedule's moved occurrences. Instants are whole epoch milliseconds.
 *
 * @example
 * ```ts
 * formatExampleQueriesSql(dimension, { labelColumns: ['fiscal_quarter_label', 'retail_week_label'] });
 * ```
 */
export function formatExampleQueriesSql(dimension: WarehouseTable, options?: ExampleQueriesOptions): string {
  const d = requireTable(dimension, 'dimension');
  const o = readOptions('options', options, ['labelColumns', 'groupBy']);
  const names = d.columns.map((c) => c.name);
  const given = o['labelColumns'];
  if (given !== undefined && (!Array.isArray(given) || Array.from(given as unknown[]).some((l) => typeof l !== 'string'))) {
    throw new KalendsTypeError(`options.labelColumns: expected an array of column names, got ${describeValue(given)}`, { code: 'invalid-type', received: given });
  }
  const labels = (given as readonly string[] | undefined) ?? names.filter((n) => n.endsWith('_label'));
  for (const l of labels) {
    if (!names.includes(l)) throw new KalendsRangeError(`options.labelColumns: the dimension has no column ${JSON.stringify(l)}`, { code: 'unknown-name', received: l });
  }
  if (o['groupBy'] !== undefined && typeof o['groupBy'] !== 'string') {
    throw new KalendsTypeError(`options.groupBy: expected a column name of the dimension, got ${describeValue(o['groupBy'])}`, { code: 'invalid-type', received: o['groupBy'] });
  }
  const groupBy = (o['groupBy'] as string | undefined) ?? labels[0] ?? 'calendar_date';
  if (!names.includes(groupBy)) throw new KalendsRangeError(`options.groupBy: the dimension has no column ${JSON.stringify(groupBy)}`, { code: 'unknown-name', received: groupBy });
  const business = names.includes('is_business_day');
  const shown = [...labels.map((l) => `d.${l}`), ...(business ? ['d.is_business_day'] : [])];
  return [
    '-- Example queries over the kalends warehouse tables, in standard SQL that DuckDB and PostgreSQL both accept.',
    '-- They read your events from a table shaped like:',
    '--   CREATE TABLE events (event_id bigint, epoch_ms bigint, zone varchar, amount double precision);',
    '-- epoch_ms is the instant in whole milliseconds since 1970-01-01T00:00Z; zone an IANA id exported in zone_offset_period.',
    '',
    '-- 1. Each event\'s local day: a range join on the zone\'s offset periods, then the local wall clock divided into days.',
    'CREATE OR REPLACE VIEW event_local_day AS',
    'SELECT e.event_id, e.epoch_ms, e.zone, e.amount, p.offset_seconds,',
    '       CAST(FLOOR((e.epoch_ms + p.offset_seconds * 1000) / 86400000.0) AS INTEGER) AS day_number',
    'FROM events AS e',
    'JOIN zone_offset_period AS p',
    '  ON p.zone = e.zone AND e.epoch_ms >= p.from_epoch_ms AND e.epoch_ms < p.to_epoch_ms;',
    '',
    '-- 2. Each event\'s periods and business-day flag: an equality join on the calendar dimension.',
    'CREATE OR REPLACE VIEW event_calendar AS',
    `SELECT l.event_id, l.epoch_ms, l.zone, l.amount, d.calendar_date${shown.length ? `, ${shown.join(', ')}` : ''}`,
    'FROM event_local_day AS l',
    'JOIN calendar_day AS d ON d.day_number = l.day_number;',
    '',
    `-- 3. Totals per period (${groupBy}), in period order.`,
    `SELECT d.${groupBy} AS period, COUNT(*) AS event_count, SUM(l.amount) AS amount`,
    'FROM event_local_day AS l',
    'JOIN calendar_day AS d ON d.day_number = l.day_number',
    `GROUP BY d.${groupBy}`,
    'ORDER BY MIN(d.day_number);',
    '',
    '-- 4. Occurrences of the named rules that a business-day convention moved, and why.',
    'SELECT rule_name, unadjusted_date, adjusted_date, moved_because, moved_because_detail',
    'FROM schedule_occurrence',
    'WHERE moved',
    'ORDER BY adjusted_date, rule_name;',
    '',
  ].join('\n');
}

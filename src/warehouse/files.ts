/**
 * `kalends/warehouse`: writes warehouse exports to files on Node.js: CSV, JSON Lines and Parquet (written by the
 * bundled hyparquet-writer, a pure-JavaScript Parquet writer, so that the core keeps no runtime dependency), and
 * the SQL that loads and queries them. Every file is written under a temporary name and renamed only when all of
 * an export's files are complete; a failure removes the temporary files and says so.
 *
 * This module uses the library's public surface only (like the CLI), so profiles and tables made with `kalends`
 * are the ones it takes.
 *
 * @module kalends/warehouse
 */
import { closeSync, existsSync, fsyncSync, mkdirSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { parquetWriteBuffer } from 'hyparquet-writer';
import {
  type Profile,
  type WarehouseColumn,
  type WarehouseTable,
  type Zone,
  type ZoneInput,
  KalendsRangeError,
  KalendsTypeError,
  dimensionTableFromProfile,
  firstEpochMsOfDayNumber,
  formatExampleQueriesSql,
  formatLoadSql,
  formatTableCsv,
  formatTableJsonLines,
  scheduleTableFromProfile,
  toZone,
  transitionTableFromZones,
} from 'kalends';

/**
 * A received value in a message, as the core's messages show it (strings quoted, other kinds named). This module
 * uses the public surface only, so it keeps its own small copy.
 */
function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value.length > 80 ? `${value.slice(0, 77)}...` : value);
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'bigint') return `${value}n`;
  if (value === null || value === undefined || typeof value === 'boolean') return String(value);
  if (typeof value === 'function') return 'a function';
  if (typeof value === 'symbol') return value.toString();
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  const name = (Object.getPrototypeOf(value) as { constructor?: { name?: string } } | null)?.constructor?.name;
  return name && name !== 'Object' ? `a ${name}` : 'an object';
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  if (typeof v !== 'object' || v === null || Array.isArray(v)) return false;
  const proto = Object.getPrototypeOf(v) as object | null;
  return proto === null || Object.getPrototypeOf(proto) === null;
}

/** The file formats of an export. */
export type WarehouseFileFormat = 'csv' | 'jsonl' | 'parquet';
const FORMATS: readonly WarehouseFileFormat[] = ['csv', 'jsonl', 'parquet'];

/** A schema element of a Parquet file (Apache Parquet format, parquet.thrift `SchemaElement`). */
interface ParquetSchemaElement {
  name: string;
  type?: 'BOOLEAN' | 'INT32' | 'INT64' | 'BYTE_ARRAY';
  converted_type?: 'DATE' | 'UTF8';
  repetition_type?: 'REQUIRED' | 'OPTIONAL';
  num_children?: number;
}

function parquetColumn(c: WarehouseColumn): { element: ParquetSchemaElement; data: ArrayLike<unknown> } {
  const valid = c.type === 'string' ? undefined : c.valid;
  const optional = c.type === 'string' || valid !== undefined;
  const element: ParquetSchemaElement = { name: c.name, repetition_type: optional ? 'OPTIONAL' : 'REQUIRED' };
  const masked = <T>(values: ArrayLike<number>, map: (v: number) => T): (T | null)[] =>
    Array.from(values, (v, i) => (valid && valid[i] !== 1 ? null : map(v)));
  switch (c.type) {
    case 'string':
      return { element: { ...element, type: 'BYTE_ARRAY', converted_type: 'UTF8' }, data: c.values };
    case 'boolean':
      return { element: { ...element, type: 'BOOLEAN' }, data: masked(c.values, (v) => v === 1) };
    case 'int64':
      return { element: { ...element, type: 'INT64' }, data: valid ? masked(c.values, (v) => BigInt(v)) : BigInt64Array.from(c.values, (v) => BigInt(v)) };
    case 'date':
      return { element: { ...element, type: 'INT32', converted_type: 'DATE' }, data: valid ? masked(c.values, (v) => v) : c.values };
    default:
      return { element: { ...element, type: 'INT32' }, data: valid ? masked(c.values, (v) => v) : c.values };
  }
}

/**
 * The table as a Parquet file (Apache Parquet format: dates as INT32 DATE, instants as INT64, text as UTF-8,
 * Snappy compression), written by the bundled hyparquet-writer.
 *
 * @example
 * ```ts
 * const bytes = parquetFromTable(dimensionTableFromProfile(profile));
 * // DuckDB: SELECT * FROM read_parquet('calendar_day.parquet')
 * ```
 */
export function parquetFromTable(table: WarehouseTable): Uint8Array {
  if (typeof table !== 'object' || table === null || !Array.isArray(table.columns)) {
    throw new KalendsTypeError(`table: expected a warehouse table (from dimensionTableFromProfile, transitionTableFromZones or scheduleTableFromProfile), got ${describe(table)}`, {
      code: 'invalid-type',
      received: table,
    });
  }
  const columns = table.columns.map(parquetColumn);
  const schema = [{ name: 'root', num_children: columns.length }, ...columns.map((c) => c.element)];
  const buffer = parquetWriteBuffer({
    columnData: table.columns.map((c, i) => ({ name: c.name, data: columns[i]!.data as never })),
    schema: schema as never,
    createdBy: 'kalends (hyparquet-writer)',
  });
  return new Uint8Array(buffer);
}

/** One file of an export: its name in the directory and a function that makes its content. */
export interface ExportFile {
  /** The file's name in the directory. */
  readonly name: string;
  /** Makes the file's content: text or bytes. */
  readonly content: () => string | Uint8Array;
}

/**
 * Writes files into `directory` so that none looks complete before all are: each is written (and flushed) under a
 * temporary name `.<name>.partial-<pid>`, and only when every one is written are they renamed to their names. If
 * making or writing any file fails, every temporary file is removed and the error says so; files of an earlier
 * export under the final names are left as they were. Returns the paths written.
 *
 * @example
 * ```ts
 * writeFilesAtomically('out', [{ name: 'calendar_day.csv', content: () => formatTableCsv(table) }]); // ['out/calendar_day.csv']
 * ```
 */
export function writeFilesAtomically(directory: string, files: readonly ExportFile[]): string[] {
  requireDirectory(directory);
  if (!Array.isArray(files)) {
    throw new KalendsTypeError(`files: expected an array of { name, content } files, got ${describe(files)}`, { code: 'invalid-type', received: files });
  }
  for (let i = 0; i < files.length; i++) {
    const f: unknown = files[i];
    const name = isPlainObject(f) ? f['name'] : undefined;
    if (!isPlainObject(f) || typeof f['content'] !== 'function') {
      throw new KalendsTypeError(`files[${i}]: expected { name, content } with content a function that makes the file, got ${describe(f)}`, { code: 'invalid-type', received: f });
    }
    if (typeof name !== 'string' || !/^[^/\\\0]+$/.test(name) || name === '.' || name === '..') {
      throw new KalendsTypeError(`files[${i}].name: expected a file name (no directory part), got ${describe(name)}`, { code: 'invalid-type', received: name });
    }
  }
  mkdirSync(directory, { recursive: true });
  const staged: { temp: string; final: string }[] = [];
  try {
    for (const f of files) {
      const final = join(directory, f.name);
      const temp = join(directory, `.${f.name}.partial-${process.pid}`);
      staged.push({ temp, final });
      const content: unknown = f.content();
      if (typeof content !== 'string' && !(content instanceof Uint8Array)) {
        throw new KalendsTypeError(`files[${staged.length - 1}].content: expected a function that returns a string or a Uint8Array, got one that returned ${describe(content)}`, {
          code: 'invalid-type',
          received: content,
        });
      }
      const fd = openSync(temp, 'w');
      try {
        const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
        let off = 0;
        while (off < bytes.length) off += writeSync(fd, bytes, off, bytes.length - off);
        fsyncSync(fd);
      } finally {
        closeSync(fd);
      }
    }
  } catch (e) {
    const removed: string[] = [];
    for (const s of staged) {
      if (existsSync(s.temp)) {
        rmSync(s.temp, { force: true });
        removed.push(s.temp);
      }
    }
    // A refused value (a kalends error) is the caller's to fix, and stays what it is.
    if (e instanceof KalendsTypeError || e instanceof KalendsRangeError) throw e;
    const why = e instanceof Error ? e.message : String(e);
    const error = new Error(
      `the export to ${directory} failed and wrote nothing under its final names: ${why}${removed.length ? `; removed the partial files ${removed.join(', ')}` : ''}`,
    );
    (error as Error & { cause?: unknown }).cause = e;
    throw error;
  }
  for (const s of staged) renameSync(s.temp, s.final);
  return staged.map((s) => s.final);
}

/** Options of {@link writeWarehouseExport}. */
export interface WarehouseExportOptions {
  /** The formats to write (default `['csv', 'parquet']`). */
  readonly formats?: readonly WarehouseFileFormat[];
  /** First local day (ISO 8601 text or a day number), default the profile's `warehouse.start`. */
  readonly start?: string | number;
  /** End of the range, exclusive, default the profile's `warehouse.end`. */
  readonly end?: string | number;
  /** The calendar of the business-day columns (a profile calendar's name). */
  readonly calendar?: string;
  /** Zones of the transition table (default: the profile's `warehouse.zones`, else its zone). */
  readonly zones?: readonly ZoneInput[];
}

const EXPORT_OPTIONS = ['formats', 'start', 'end', 'calendar', 'zones'];

/** The zones of options.zones, each checked under its own name (`options.zones[1]`). */
function exportZones(zones: unknown): Zone[] {
  if (!Array.isArray(zones) || zones.length === 0) {
    throw new KalendsTypeError(`options.zones: expected a non-empty array of zones or zone ids, got ${describe(zones)}`, { code: 'invalid-type', received: zones });
  }
  const out: Zone[] = [];
  for (let i = 0; i < zones.length; i++) out.push(toZone(zones[i] as ZoneInput, `options.zones[${i}]`));
  return out;
}

function requireDirectory(directory: unknown): asserts directory is string {
  if (typeof directory !== 'string' || directory === '' || directory.includes('\0')) {
    throw new KalendsTypeError(`directory: expected a directory path (a non-empty string), got ${describe(directory)}`, { code: 'invalid-type', received: directory });
  }
}

/**
 * Exports a profile for SQL engines into `directory`: `calendar_day`, `zone_offset_period` and
 * `schedule_occurrence` in each format, `load.duckdb.sql` (from Parquet when written, else CSV),
 * `load.postgresql.sql` (from CSV, with psql's `\copy`) and `queries.sql` (standard SQL for both). The transition
 * table covers the instants from two days before the first local day (as a UTC date) to two days after the range's
 * end, so that every instant of the range's local days, in any zone, falls in one of its rows. All files appear together or not at all (see {@link writeFilesAtomically}).
 *
 * @example
 * ```ts
 * writeWarehouseExport(profile, 'warehouse', { formats: ['parquet', 'csv'] });
 * // ['warehouse/calendar_day.parquet', ..., 'warehouse/queries.sql']
 * ```
 */
export function writeWarehouseExport(profile: Profile, directory: string, options: WarehouseExportOptions = {}): string[] {
  if (!isPlainObject(options as unknown)) {
    throw new KalendsTypeError(`options: expected an options object or undefined, got ${describe(options)}`, { code: 'invalid-type', received: options });
  }
  requireDirectory(directory);
  for (const key of Object.keys(options)) {
    if (!EXPORT_OPTIONS.includes(key)) {
      throw new KalendsTypeError(`options.${key}: unknown option; valid options are ${EXPORT_OPTIONS.map((k) => JSON.stringify(k)).join(', ')}`, {
        code: 'unknown-name',
        received: key,
        path: `options.${key}`,
      });
    }
  }
  const formats = options.formats ?? ['csv', 'parquet'];
  if (!Array.isArray(formats) || formats.length === 0) {
    throw new KalendsTypeError(`options.formats: expected a non-empty array of formats (${FORMATS.join(', ')}), got ${describe(formats)}`, { code: 'invalid-type', received: formats });
  }
  for (let i = 0; i < formats.length; i++) {
    const f: unknown = formats[i];
    if (typeof f !== 'string') {
      throw new KalendsTypeError(`options.formats[${i}]: expected one of ${FORMATS.map((x) => JSON.stringify(x)).join(', ')}, got ${describe(f)}`, { code: 'invalid-type', received: f });
    }
    if (!(FORMATS as readonly string[]).includes(f)) {
      throw new KalendsRangeError(`options.formats[${i}]: expected one of ${FORMATS.map((x) => JSON.stringify(x)).join(', ')}, got ${describe(f)}`, { code: 'unknown-name', received: f });
    }
  }
  const range = { ...(options.start !== undefined ? { start: options.start } : {}), ...(options.end !== undefined ? { end: options.end } : {}) };
  const dimension = dimensionTableFromProfile(profile, { ...range, ...(options.calendar !== undefined ? { calendar: options.calendar } : {}) });
  const schedules = scheduleTableFromProfile(profile, range);
  const days = dimension.columns[0]!.values as Int32Array;
  const first = days[0]!;
  const end = days[days.length - 1]! + 1;
  const zones = options.zones === undefined ? (profile.warehouse?.zones ?? [profile.zone]) : exportZones(options.zones);
  // Two days' margin: local days start up to 26 hours from UTC midnight in the zones of the tz database.
  const startMs = firstEpochMsOfDayNumber('UTC', first) - 86_400_000 * 2;
  const endMs = firstEpochMsOfDayNumber('UTC', end) + 86_400_000 * 2;
  const transitions = transitionTableFromZones(zones, startMs, endMs);
  const tables = [dimension, transitions, schedules];
  const files: ExportFile[] = [];
  for (const t of tables) {
    for (const f of formats) {
      files.push({
        name: `${t.name}.${f}`,
        content: () => (f === 'csv' ? formatTableCsv(t) : f === 'jsonl' ? formatTableJsonLines(t) : parquetFromTable(t)),
      });
    }
  }
  const duckFormat = formats.includes('parquet') ? 'parquet' : 'csv';
  if (formats.includes('csv') || formats.includes('parquet')) files.push({ name: 'load.duckdb.sql', content: () => formatLoadSql(tables, { dialect: 'duckdb', format: duckFormat }) });
  if (formats.includes('csv')) files.push({ name: 'load.postgresql.sql', content: () => formatLoadSql(tables, { dialect: 'postgresql', format: 'csv' }) });
  // The totals query groups by the profile's first fiscal quarter (else its first unit).
  const units = Object.entries(profile.units);
  const grouped = units.find(([, u]) => u.kind === 'fiscal-quarter') ?? units[0];
  const labelColumns = units.map(([name]) => `${name.replace(/-/g, '_')}_label`);
  const groupBy = grouped ? `${grouped[0].replace(/-/g, '_')}_label` : undefined;
  files.push({
    name: 'queries.sql',
    content: () => formatExampleQueriesSql(dimension, { labelColumns, ...(groupBy !== undefined ? { groupBy } : {}) }),
  });
  return writeFilesAtomically(directory, files);
}

/**
 * `kalends warehouse`: exports a profile's calendar for SQL engines: the calendar dimension, the zones' offset
 * periods and the rules' occurrences as CSV, JSON Lines and Parquet, with SQL that loads them into DuckDB or
 * PostgreSQL and example queries. Uses the public API, the warehouse file writers and the CLI kit.
 *
 * @module
 */
import { listZoneIds } from '../../index.js';
import { type WarehouseFileFormat, writeWarehouseExport } from '../../warehouse/files.js';
import { type Command, JSON_OPTION, UsageError, optionFlag, optionString } from '../kit.js';
import { profileOfArgs } from '../profile.js';

const FORMATS: readonly WarehouseFileFormat[] = ['csv', 'jsonl', 'parquet'];

const warehouse: Command = {
  name: 'warehouse',
  summary: "Export a profile's calendar for SQL engines (CSV, JSON Lines, Parquet) with loading SQL and queries",
  usage: ['--profile <file> --out <directory> [--format <list>] [--start <date>] [--end <date>] [--zones <list>] [--calendar <name>] [--json]'],
  description: `Writes, into the directory, the tables that carry the profile's calendar into a SQL engine:
  calendar_day         one row per local day: ISO week date, every unit of the profile (label, ordinal, year,
                       position), 53-week flags, business-day columns, holidays, labels for people
  zone_offset_period   one row per UTC-offset period of each zone, for a range join from instants to local days
  schedule_occurrence  one row per occurrence of each named rule, unadjusted and adjusted, and why it moved
in each chosen format, plus load.duckdb.sql, load.postgresql.sql (CSV, psql) and queries.sql (standard SQL).
All files appear together: they are written under temporary names and renamed at the end; after a failure
none is left. See docs/warehouse.md. --profile is required.`,
  options: [
    { name: 'out', value: '<directory>', text: 'where to write (created when missing; files of the same names are replaced)' },
    { name: 'format', value: '<list>', text: 'comma-separated: csv, jsonl, parquet (default csv,parquet)' },
    { name: 'start', value: '<date>', text: "first local day (default: the profile's warehouse.start)" },
    { name: 'end', value: '<date>', text: "end of the range, exclusive (default: the profile's warehouse.end)" },
    { name: 'zones', value: '<list>', text: 'comma-separated zone ids of the transition table, or "all" for every zone the runtime knows (default: the profile\'s warehouse.zones, else its zone)' },
    { name: 'calendar', value: '<name>', text: "the profile calendar of the business-day columns (default: the profile's)" },
    JSON_OPTION,
  ],
  examples: ['kalends warehouse --profile examples/otterbrook.profile.json --out warehouse --format parquet,csv'],
  async run(args, io) {
    const profile = profileOfArgs(args);
    if (!profile) throw new UsageError('--profile is required: the calendar profile to export (see docs/profiles.md)');
    const out = optionString(args, 'out');
    if (out === undefined) throw new UsageError('--out is required: the directory to write the files into');
    if (args.positionals.length > 0) throw new UsageError(`warehouse takes no arguments besides its options; got ${JSON.stringify(args.positionals[0])}`);
    const formats = optionString(args, 'format', 'csv,parquet')!.split(',').map((f) => f.trim()).filter((f) => f !== '');
    for (const f of formats) {
      if (!(FORMATS as readonly string[]).includes(f)) throw new UsageError(`--format: expected formats among ${FORMATS.join(', ')}, got ${JSON.stringify(f)}`);
    }
    const zonesText = optionString(args, 'zones');
    const zones = zonesText === undefined ? undefined : zonesText === 'all' ? [...listZoneIds()] : zonesText.split(',').map((z) => z.trim());
    const start = optionString(args, 'start');
    const end = optionString(args, 'end');
    const calendar = optionString(args, 'calendar');
    const written = writeWarehouseExport(profile, out, {
      formats: formats as WarehouseFileFormat[],
      ...(start !== undefined ? { start } : {}),
      ...(end !== undefined ? { end } : {}),
      ...(zones !== undefined ? { zones } : {}),
      ...(calendar !== undefined ? { calendar } : {}),
    });
    if (optionFlag(args, 'json')) for (const f of written) io.stdout(`${JSON.stringify({ file: f })}\n`);
    else io.stdout(`wrote ${written.length} files:\n${written.map((f) => `  ${f}\n`).join('')}`);
    return 0;
  },
};

/** Commands of the warehouse layer. */
export const commands: readonly Command[] = [warehouse];

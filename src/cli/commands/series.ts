/**
 * `kalends bucket`: streams a CSV of timestamp,value rows from stdin into periods with aggregations. Rows may
 * arrive in any order; each period keeps a small accumulator, and the table is written when the input ends.
 *
 * @module
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse';
import {
  type Aggregation,
  type BucketTable,
  type EmptyPolicy,
  type UnitDefinition,
  AGGREGATION_NAMES,
  defineBucketAccumulator,
  epochMsFromWallMs,
  formatInstant,
  offsetSecondsFromEpochMs,
  parsePlainDate,
  parsePlainDateTime,
  toEpochMs,
  toZone,
} from '../../index.js';
import { type CliIo, type Command, type ParsedArgs, UsageError, optionFlag, optionString, rejectUnknownOptions } from '../kit.js';

const HELP = `kalends bucket: aggregate a CSV of timestamp,value rows into periods.

Usage: kalends bucket --unit <unit> [--zone <zone>] [--aggregate <names>] [options] < rows.csv

Reads CSV rows from standard input: the first field is the instant, the second the value (choose others with
--time-field / --value-field, counted from 1). Rows may come in any order. Writes one row per period, in
period order, once the input ends: CSV with a header, or JSON Lines with --json.

Options:
  --unit <unit>          month, iso-week, day, quarter, half-year, year, a unit definition as JSON text
                         (e.g. '{"kind":"fiscal-quarter","start":{"month":10,"day":1},"naming":"end-year"}'),
                         or @file.json holding one.
  --zone <zone>          IANA zone id or fixed offset whose local days decide the period (default UTC).
  --aggregate <names>    comma-separated: ${AGGREGATION_NAMES.filter((n) => n !== 'quantile').join(', ')},
                         p<percent> for a quantile (p90 = 0.9, Hyndman & Fan definition 7). Default sum.
  --range <start>..<end> report every period from start up to end (exclusive), as labels; rows outside are
                         dropped and counted.
  --empty <policy>       empty periods inside --range: nan (default, written as an empty field), zero, previous.
  --header <mode>        auto (default: the first row is a header when its value field is not a number), yes, no.
  --delimiter <char>     field delimiter (default ",").
  --time-field <n>       1-based field of the instant (default 1).   --value-field <n>  of the value (default 2).
  --on-bad-row <policy>  stop (default): stop at the first malformed row, naming its line, exit code 1.
                         skip: leave malformed rows out, count them, report the count and the first one on
                         stderr at the end, exit code 0.

Instants: RFC 3339 with an offset (2025-03-01T10:00:00-05:00), epoch milliseconds, or a local date or
date-time without an offset (2025-03-01, 2025-03-01T10:00), read on the wall clock of --zone (a time in a
DST gap or fold resolves as Temporal's "compatible"). An empty value field is a missing value (skipped and
counted, not malformed). A row is malformed when its instant cannot be read, its value is not a number, it
lacks a field, or the CSV itself is broken (an unclosed quote).

Exit codes: 0 done; 1 stopped at a malformed row or a library error; 2 usage error.
A progress line (bytes read, rows, rows per second) appears on stderr when stderr is a terminal and the
input is large (past 4 MB, or still being read after one second).`;

const VALUE_OPTIONS = ['unit', 'zone', 'aggregate', 'range', 'empty', 'header', 'delimiter', 'time-field', 'value-field', 'on-bad-row'];

function readUnit(text: string): UnitDefinition | string {
  if (text.startsWith('@')) {
    let raw: string;
    try {
      raw = readFileSync(text.slice(1), 'utf8');
    } catch (e) {
      throw new UsageError(`--unit: cannot read ${text.slice(1)}: ${(e as Error).message}`);
    }
    return parseJson(raw, `--unit ${text}`) as UnitDefinition;
  }
  if (text.trimStart().startsWith('{')) return parseJson(text, '--unit') as UnitDefinition;
  return text;
}

function parseJson(text: string, what: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch (e) {
    throw new UsageError(`${what}: not valid JSON (${(e as Error).message})`);
  }
}

function readAggregations(text: string): { aggs: Aggregation[]; names: string[] } {
  const aggs: Aggregation[] = [];
  const names: string[] = [];
  for (const raw of text.split(',').map((s) => s.trim()).filter((s) => s !== '')) {
    const m = /^p(\d{1,3}(?:\.\d+)?)$/.exec(raw);
    if (m) {
      const q = Number(m[1]) / 100;
      if (!(q >= 0 && q <= 1)) throw new UsageError(`--aggregate: ${raw} asks for a quantile outside p0..p100`);
      aggs.push({ kind: 'quantile', q, as: raw });
    } else aggs.push(raw as Aggregation);
    names.push(raw);
  }
  if (aggs.length === 0) throw new UsageError('--aggregate: expected at least one aggregation name');
  return { aggs, names };
}

function positiveField(args: ParsedArgs, name: string, fallback: number): number {
  const v = optionString(args, name);
  if (v === undefined) return fallback;
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) throw new UsageError(`--${name}: expected a field number from 1, got ${JSON.stringify(v)}`);
  return n;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A malformed row: its line and why. */
class BadRow extends Error {
  constructor(
    readonly line: number,
    why: string,
  ) {
    super(`line ${line}: ${why}`);
  }
}

function formatNumber(v: number): string {
  return Number.isNaN(v) ? '' : String(v);
}

function csvCell(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

async function runBucket(args: ParsedArgs, io: CliIo): Promise<number> {
  rejectUnknownOptions(args, VALUE_OPTIONS);
  if (args.positionals.length > 0) throw new UsageError(`bucket reads rows from stdin; unexpected argument ${JSON.stringify(args.positionals[0])}`);
  const unitText = optionString(args, 'unit');
  if (unitText === undefined) throw new UsageError('--unit is required (e.g. --unit month)');
  const unit = readUnit(unitText);
  const zoneText = optionString(args, 'zone', 'UTC')!;
  const zone = toZone(zoneText, '--zone');
  const { aggs, names } = readAggregations(optionString(args, 'aggregate', 'sum')!);
  const empty = optionString(args, 'empty', 'nan')! as EmptyPolicy;
  if (!['nan', 'zero', 'previous'].includes(empty)) throw new UsageError(`--empty: expected nan, zero or previous, got ${JSON.stringify(empty)}`);
  const onBad = optionString(args, 'on-bad-row', 'stop')!;
  if (onBad !== 'stop' && onBad !== 'skip') throw new UsageError(`--on-bad-row: expected stop or skip, got ${JSON.stringify(onBad)}`);
  const header = optionString(args, 'header', 'auto')!;
  if (!['auto', 'yes', 'no'].includes(header)) throw new UsageError(`--header: expected auto, yes or no, got ${JSON.stringify(header)}`);
  const delimiter = optionString(args, 'delimiter', ',')!;
  const timeField = positiveField(args, 'time-field', 1) - 1;
  const valueField = positiveField(args, 'value-field', 2) - 1;
  let range: { start: string; end: string } | undefined;
  const rangeText = optionString(args, 'range');
  if (rangeText !== undefined) {
    const m = /^(.+?)\.\.(.+)$/.exec(rangeText);
    if (!m) throw new UsageError(`--range: expected <start>..<end> (labels, end exclusive), got ${JSON.stringify(rangeText)}`);
    range = { start: m[1]!, end: m[2]! };
  }
  const json = optionFlag(args, 'json');
  const acc = defineBucketAccumulator({ unit: unit as never, zone, aggregations: aggs });

  function instantOf(text: string, line: number): number {
    const s = text.trim();
    if (NUMBER.test(s)) {
      const n = Number(s);
      if (Number.isFinite(n)) return n;
    }
    try {
      return toEpochMs(s);
    } catch (first) {
      try {
        const wall = s.length <= 10 ? parsePlainDate(s) * 86_400_000 : parsePlainDateTime(s);
        return epochMsFromWallMs(zone, wall, 'compatible');
      } catch {
        throw new BadRow(line, `cannot read the instant ${JSON.stringify(s)} (${(first as Error).message})`);
      }
    }
  }

  let bytes = 0;
  const started = Date.now();
  let lastProgress = 0;
  let progressShown = false;
  const progress = (rows: number, force = false) => {
    if (!io.stderrIsTty) return;
    const now = Date.now();
    // "Large": past 4 MB, or still reading after a second.
    if (bytes < 4 * 1024 * 1024 && now - started < 1000) return;
    if (!force && now - lastProgress < 250) return;
    lastProgress = now;
    const secs = Math.max((now - started) / 1000, 0.001);
    io.stderr(`\rkalends bucket: ${(bytes / 1048576).toFixed(1)} MB read, ${rows.toLocaleString('en-US')} rows, ${Math.round(rows / secs).toLocaleString('en-US')} rows/s   `);
    progressShown = true;
  };

  async function* counted(): AsyncGenerator<string | Uint8Array> {
    if (!io.stdin) return;
    for await (const chunk of io.stdin) {
      bytes += typeof chunk === 'string' ? Buffer.byteLength(chunk) : chunk.length;
      yield chunk;
    }
  }

  let skipped = 0;
  let firstSkipped: string | undefined;
  const skip = (why: string) => {
    skipped++;
    firstSkipped ??= why;
  };
  const parser = parse({
    delimiter,
    relax_column_count: true,
    skip_empty_lines: true,
    trim: true,
    info: true,
    skip_records_with_error: onBad === 'skip',
  });
  parser.on('skip', (err: Error & { lines?: number }) => skip(`line ${err.lines ?? '?'}: ${err.message}`));
  let failure: unknown;
  parser.on('error', (e: unknown) => {
    failure ??= e;
  });
  let first = true;
  const handle = (record: string[], line: number) => {
    try {
      if (first) {
        first = false;
        const v = record[valueField];
        if (header === 'yes' || (header === 'auto' && v !== undefined && v !== '' && !NUMBER.test(v.trim()))) return;
      }
      if (record.length <= Math.max(timeField, valueField)) {
        throw new BadRow(line, `expected at least ${Math.max(timeField, valueField) + 1} fields, got ${record.length}`);
      }
      const t = instantOf(record[timeField]!, line);
      const vText = record[valueField]!.trim();
      if (vText !== '' && !NUMBER.test(vText)) throw new BadRow(line, `the value ${JSON.stringify(vText)} is not a number`);
      try {
        acc.add(t, vText === '' ? Number.NaN : Number(vText));
      } catch (e) {
        throw new BadRow(line, (e as Error).message);
      }
    } catch (e) {
      if (!(e instanceof BadRow) || onBad === 'stop') throw e;
      skip(e.message);
    }
  };
  // Records are drained synchronously after each chunk is written: no promise per record.
  const drain = () => {
    let item: { record: string[]; info: { lines: number } } | null;
    while ((item = parser.read() as typeof item) !== null) handle(item.record, item.info.lines);
    if (failure !== undefined) throw failure;
  };
  try {
    for await (const chunk of counted()) {
      parser.write(chunk);
      drain();
      progress(acc.rows);
    }
    await new Promise<void>((resolve) => {
      parser.end(() => resolve());
      parser.once('error', () => resolve());
    });
    drain();
  } catch (e) {
    if (progressShown) io.stderr('\n');
    if (e instanceof BadRow) {
      io.stderr(`kalends bucket: malformed row at ${e.message}; stopped (use --on-bad-row skip to leave such rows out)\n`);
      return 1;
    }
    const csv = e as Error & { lines?: number; code?: string };
    if (typeof csv.code === 'string' && csv.code.startsWith('CSV_')) {
      io.stderr(`kalends bucket: malformed CSV at line ${csv.lines ?? '?'}: ${csv.message}; stopped\n`);
      return 1;
    }
    throw e;
  }
  progress(acc.rows, true);
  if (progressShown) io.stderr('\n');
  const table = acc.finish(range ? { range, empty } : { empty });
  writeTable(table, names, json, io);
  if (table.outsideRange > 0) io.stderr(`kalends bucket: ${table.outsideRange} rows fell outside --range and were left out\n`);
  if (skipped > 0) io.stderr(`kalends bucket: skipped ${skipped} malformed row${skipped === 1 ? '' : 's'} (first: ${firstSkipped})\n`);
  return 0;
}

function writeTable(table: BucketTable, names: readonly string[], json: boolean, io: CliIo): void {
  const instant = (ms: number) => formatInstant(ms, { offsetSeconds: offsetSecondsFromEpochMs(table.zone, ms) });
  if (!json) io.stdout(`${['period', 'start', 'end', 'rows', ...names].map(csvCell).join(',')}\n`);
  for (let i = 0; i < table.length; i++) {
    const values = table.columnNames.map((c) => table.columns[c]![i]!);
    if (json) {
      const row: Record<string, string | number | null> = {
        period: table.labels[i]!,
        start: instant(table.startEpochMs[i]!),
        end: instant(table.endEpochMs[i]!),
        rows: table.rowCounts[i]!,
      };
      names.forEach((n, k) => {
        row[n] = Number.isNaN(values[k]!) ? null : values[k]!;
      });
      io.stdout(`${JSON.stringify(row)}\n`);
    } else {
      const cells = [table.labels[i]!, instant(table.startEpochMs[i]!), instant(table.endEpochMs[i]!), String(table.rowCounts[i]!), ...values.map(formatNumber)];
      io.stdout(`${cells.map(csvCell).join(',')}\n`);
    }
  }
}

/** Commands of the series layer. */
export const commands: readonly Command[] = [
  {
    name: 'bucket',
    summary: 'Aggregate CSV timestamp,value rows from stdin into periods (sum, mean, quantiles, ...)',
    help: HELP,
    valueOptions: VALUE_OPTIONS,
    run: runBucket,
  },
];

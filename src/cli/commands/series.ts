/**
 * `kalends bucket`: streams a CSV of timestamp,value rows from stdin into periods with aggregations. Rows may
 * arrive in any order; each period keeps a small accumulator, and the table is written when the input ends.
 *
 * @module
 */
import { CsvError, parse } from 'csv-parse';
import {
  type Aggregation,
  type BucketTable,
  type EmptyPolicy,
  type PeriodUnit,
  type UnitDefinition,
  AGGREGATION_NAMES,
  MAX_BUCKET_PERIODS,
  MAX_SERIES_ROWS,
  defineBucketAccumulator,
  epochMsFromWallMs,
  formatInstant,
  offsetSecondsFromEpochMs,
  parsePlainDate,
  parsePlainDateTime,
  toEpochMs,
  toUnit,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type ParsedArgs,
  CALENDAR_UNIT_NAMES,
  EXIT_DONE,
  EXIT_REFUSED,
  Output,
  UsageError,
  optionChoice,
  optionFlag,
  optionInteger,
  optionString,
  optionZone,
  quote,
  readDefinition,
  shellMessage,
} from '../kit.js';

/** `--range` may produce at most this many rows unless --max-rows allows more. */
const RANGE_ROWS_WITHOUT_FLAG = 100_000;
/** The longest CSV row, in characters; a longer one stops the command (it is no timestamp,value row). */
const MAX_ROW_LENGTH = 65_536;

const MALFORMED = ['stop', 'skip'] as const;

const DESCRIPTION = `Reads CSV rows from standard input: the first field is the instant, the second the value (choose others with
--time-field / --value-field, counted from 1). Rows may come in any order. Writes one row per period, in
period order, once the input ends: CSV with a header, or JSON Lines with --json.

Columns: period (the label), start and end (instants in --zone: [start, end), end-exclusive, so end is the
first instant of the next period), rows (rows read into it), then one column per aggregation. --json adds
startEpochMs and endEpochMs. kalends period uses the same names.

Instants: RFC 3339 with an offset (2025-03-01T10:00:00-05:00), epoch milliseconds, or a local date or
date-time without an offset (2025-03-01, 2025-03-01T10:00), read on the wall clock of --zone (a time in a
DST gap or fold resolves as Temporal's "compatible"). An empty value field is a missing value (skipped and
counted, not malformed). A row is malformed when its instant cannot be read, its value is not a number, or
it lacks a field. Broken CSV (an unclosed quote, a row over ${MAX_ROW_LENGTH} characters) always stops.

A progress line (bytes read, rows, rows per second) appears on stderr when stderr is a terminal and the
input is large (past 4 MB, or still being read after one second).`;

/** The delimiter of --delimiter: one character (not a quote or a line end), or the word "tab". */
function readDelimiter(args: ParsedArgs): string {
  const text = optionString(args, 'delimiter', ',')!;
  const d = text === 'tab' ? '\t' : text;
  if ([...d].length !== 1 || d === '"' || d === '\n' || d === '\r') {
    throw new UsageError(`--delimiter: expected one character other than a quote or a line end (such as ";" or "|"), or the word tab; got ${quote(text)}`);
  }
  return d;
}

/** Characters that separate fields in other CSV dialects, with the --delimiter value that reads them. */
const OTHER_DELIMITERS: readonly (readonly [string, string])[] = [
  [';', ';'],
  ['\t', 'tab'],
  ['|', '|'],
];

/** A hint for a row that has one field holding another dialect's delimiter. */
function delimiterHint(record: readonly string[], delimiter: string): string {
  if (record.length !== 1) return '';
  for (const [c, option] of OTHER_DELIMITERS) {
    if (c !== delimiter && record[0]!.includes(c)) {
      return `; the row has one field holding ${JSON.stringify(c)}: if the file is separated by it, add --delimiter ${option === ';' || option === '|' ? `'${option}'` : option}`;
    }
  }
  return '';
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

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** What is wrong with broken CSV, in our words (the CSV reader's own message may quote binary bytes). */
function csvProblem(e: CsvError): string {
  switch (e.code) {
    case 'CSV_MAX_RECORD_SIZE':
      return `a row longer than ${MAX_ROW_LENGTH} characters (is the input CSV?)`;
    case 'CSV_QUOTE_NOT_CLOSED':
      return 'a quote is opened and never closed';
    case 'INVALID_OPENING_QUOTE':
      return 'a quote inside a field that did not start with one';
    case 'CSV_INVALID_CLOSING_QUOTE':
    case 'CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE':
      return 'text right after a closing quote';
    default:
      return e.message.replace(/[^\x20-\x7e]/g, '?').slice(0, 200);
  }
}

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
  if (args.positionals.length > 0) throw new UsageError(`bucket reads rows from standard input; unexpected argument ${quote(args.positionals[0]!)}`);
  const unitText = optionString(args, 'unit');
  if (unitText === undefined) throw new UsageError('--unit is required (e.g. --unit month)');
  const unit: PeriodUnit = toUnit((await readDefinition(unitText, '--unit', io, CALENDAR_UNIT_NAMES)) as UnitDefinition, '--unit');
  const zone = optionZone(args, 'zone', 'UTC')!;
  const { aggs, names } = readAggregations(optionString(args, 'aggregate', 'sum')!);
  const empty: EmptyPolicy = optionChoice(args, 'empty', ['nan', 'zero', 'previous'] as const, 'nan')!;
  const malformed = optionChoice(args, 'malformed', MALFORMED, 'stop')!;
  const header = optionChoice(args, 'header', ['auto', 'yes', 'no'] as const, 'auto')!;
  const delimiter = readDelimiter(args);
  const timeField = optionInteger(args, 'time-field', 1, 10_000, 1)! - 1;
  const valueField = optionInteger(args, 'value-field', 1, 10_000, 2)! - 1;
  const maxRows = optionInteger(args, 'max-rows', 1, MAX_BUCKET_PERIODS);
  let range: { start: string; end: string } | undefined;
  const rangeText = optionString(args, 'range');
  if (rangeText !== undefined) {
    const m = /^(.+?)\.\.(.+)$/.exec(rangeText);
    if (!m) throw new UsageError(`--range: expected <start>..<end> (labels, end exclusive), got ${quote(rangeText)}`);
    range = { start: m[1]!, end: m[2]! };
    let rows: number;
    try {
      rows = unit.parseOrdinal(range.end) - unit.parseOrdinal(range.start);
    } catch (e) {
      throw new UsageError(`--range: ${shellMessage(e)}`);
    }
    if (rows < 0) throw new UsageError(`--range: the end ${quote(range.end)} is before the start ${quote(range.start)}`);
    const allowed = maxRows ?? RANGE_ROWS_WITHOUT_FLAG;
    if (rows > allowed) {
      throw new UsageError(
        `--range ${rangeText} holds ${rows} periods, more than ${allowed}${maxRows === undefined ? ' (the most without --max-rows)' : ' (--max-rows)'}; narrow --range or allow them with --max-rows ${rows}`,
      );
    }
  }
  if (maxRows !== undefined && range === undefined) throw new UsageError('--max-rows goes with --range (without --range only periods with rows are written)');
  const json = optionFlag(args, 'json');
  let acc: ReturnType<typeof defineBucketAccumulator>;
  try {
    acc = defineBucketAccumulator({ unit, zone, aggregations: aggs });
  } catch (e) {
    throw new UsageError(`--aggregate: ${shellMessage(e)}`);
  }

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
        throw new BadRow(line, `cannot read the instant ${quote(s)} (${shellMessage(first)})`);
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
  // Broken CSV always stops: the CSV reader's own skipping can lose the rows after a stray quote.
  const parser = parse({ delimiter, relax_column_count: true, skip_empty_lines: true, trim: true, info: true, max_record_size: MAX_ROW_LENGTH });
  let failure: unknown;
  parser.on('error', (e: unknown) => {
    failure ??= e;
  });
  let first = true;
  const needed = Math.max(timeField, valueField) + 1;
  const handle = (record: string[], line: number) => {
    try {
      if (first) {
        first = false;
        const v = record[valueField];
        if (header === 'yes' || (header === 'auto' && v !== undefined && v !== '' && !NUMBER.test(v.trim()))) return;
      }
      if (record.length < needed) throw new BadRow(line, `expected at least ${needed} fields, got ${record.length}${delimiterHint(record, delimiter)}`);
      const t = instantOf(record[timeField]!, line);
      const vText = record[valueField]!.trim();
      if (vText !== '' && !NUMBER.test(vText)) throw new BadRow(line, `the value ${quote(vText)} is not a number`);
      try {
        acc.add(t, vText === '' ? Number.NaN : Number(vText));
      } catch (e) {
        throw new BadRow(line, shellMessage(e));
      }
    } catch (e) {
      if (!(e instanceof BadRow) || malformed === 'stop') throw e;
      skipped++;
      firstSkipped ??= e.message;
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
      io.stderr(`kalends bucket: malformed row at ${e.message}; stopped (--malformed skip leaves such rows out)\n`);
      return EXIT_REFUSED;
    }
    if (e instanceof CsvError) {
      const lines = (e as CsvError & { lines?: number }).lines;
      io.stderr(`kalends bucket: malformed CSV at line ${lines ?? '?'}: ${csvProblem(e)}; stopped\n`);
      return EXIT_REFUSED;
    }
    throw e;
  }
  progress(acc.rows, true);
  if (progressShown) io.stderr('\n');
  const table = acc.finish(range ? { range, empty, ...(maxRows !== undefined && maxRows > MAX_SERIES_ROWS ? { maxRows } : {}) } : { empty });
  await writeTable(table, names, json, new Output(io));
  if (table.outsideRange > 0) io.stderr(`kalends bucket: ${table.outsideRange} rows fell outside --range and were left out\n`);
  if (skipped > 0) io.stderr(`kalends bucket: skipped ${skipped} malformed row${skipped === 1 ? '' : 's'} (first: ${firstSkipped})\n`);
  return EXIT_DONE;
}

async function writeTable(table: BucketTable, names: readonly string[], json: boolean, out: Output): Promise<void> {
  const instant = (ms: number) => formatInstant(ms, { offsetSeconds: offsetSecondsFromEpochMs(table.zone, ms) });
  if (!json) await out.write(`${['period', 'start', 'end', 'rows', ...names].map(csvCell).join(',')}\n`);
  for (let i = 0; i < table.length; i++) {
    const values = table.columnNames.map((c) => table.columns[c]![i]!);
    const startMs = table.startEpochMs[i]!;
    const endMs = table.endEpochMs[i]!;
    if (json) {
      const row: Record<string, string | number | null> = {
        period: table.labels[i]!,
        start: instant(startMs),
        end: instant(endMs),
        rows: table.rowCounts[i]!,
      };
      names.forEach((n, k) => {
        row[n] = Number.isNaN(values[k]!) ? null : values[k]!;
      });
      row['startEpochMs'] = startMs;
      row['endEpochMs'] = endMs;
      await out.write(`${JSON.stringify(row)}\n`);
    } else {
      const cells = [table.labels[i]!, instant(startMs), instant(endMs), String(table.rowCounts[i]!), ...values.map(formatNumber)];
      await out.write(`${cells.map(csvCell).join(',')}\n`);
    }
  }
  await out.flush();
}

/** Commands of the series layer. */
export const commands: readonly Command[] = [
  {
    name: 'bucket',
    summary: 'Aggregate CSV timestamp,value rows from stdin into periods (sum, mean, quantiles, ...)',
    usage: ['--unit <unit> [--zone <zone>] [--aggregate <names>] [options] < rows.csv'],
    description: DESCRIPTION,
    options: [
      {
        name: 'unit',
        value: '<unit>',
        text: `${CALENDAR_UNIT_NAMES.join(', ')}, a unit definition as JSON text ('{"kind":"fiscal-quarter","start":{"month":10,"day":1},"naming":"end-year"}'), the path of a JSON file holding one, or "-" for standard input. Required.`,
      },
      { name: 'zone', value: '<zone>', text: 'IANA zone id or fixed offset whose local days decide the period (default UTC)' },
      {
        name: 'aggregate',
        value: '<names>',
        text: `comma-separated: ${AGGREGATION_NAMES.filter((n) => n !== 'quantile').join(', ')}, p<percent> for a quantile (p90 = 0.9, Hyndman & Fan definition 7). Default sum.`,
      },
      { name: 'range', value: '<start>..<end>', text: 'report every period from start up to end (exclusive), as labels; rows outside are dropped and counted' },
      { name: 'max-rows', value: '<n>', text: `allow --range to write more than ${RANGE_ROWS_WITHOUT_FLAG} periods (up to n)` },
      { name: 'empty', value: '<policy>', text: 'empty periods inside --range: nan (default, written as an empty field), zero, previous' },
      { name: 'header', value: '<mode>', text: 'auto (default: the first row is a header when its value field is not a number), yes, no' },
      { name: 'delimiter', value: '<char>', text: 'field delimiter: one character (default ","), or tab' },
      { name: 'time-field', value: '<n>', text: '1-based field of the instant (default 1)' },
      { name: 'value-field', value: '<n>', text: '1-based field of the value (default 2)' },
      {
        name: 'malformed',
        value: '<policy>',
        text: 'stop (default): stop at the first malformed row, naming its line, exit code 1.\nskip: leave malformed rows out, count them, and report the count and the first one on stderr at the end, exit code 0.\n(Renamed in 0.2; it was --on-bad-row.)',
      },
      { name: 'json', text: 'one JSON object per line (JSON Lines) instead of CSV' },
    ],
    examples: [
      "printf 'at,amount\\n2025-03-01T04:30:00Z,10\\n' | kalends bucket --unit month --zone America/New_York",
      'kalends bucket --unit day --aggregate sum,count,p90 --range 2025-01-01..2025-02-01 --empty zero < rows.csv',
      "kalends bucket --unit iso-week --delimiter ';' --malformed skip --json < rows.csv",
    ],
    run: runBucket,
  },
];

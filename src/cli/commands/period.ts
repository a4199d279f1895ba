/**
 * Commands of the period layer: `period` gives the period of any unit that holds a date, an instant or a label;
 * `fiscal-layout` prints a fiscal year's periods with their first and last days. Uses only the public API
 * (`../../index.js`) and the CLI kit.
 *
 * @module
 */
import { readFileSync } from 'node:fs';
import {
  type Period,
  type PeriodUnit,
  type UnitDefinition,
  type ZoneInput,
  defineUnit,
  formatInstant,
  formatPeriod,
  formatPlainDate,
  listSubPeriods,
  offsetSecondsFromEpochMs,
  parseInstant,
  parsePeriod,
  parsePlainDate,
  parsePlainDateTime,
  periodFromPeriod,
  firstDayNumberAfterPeriod,
  firstEpochMsAfterPeriod,
  firstDayNumberOfPeriod,
  periodFromDayNumber,
  periodFromEpochMs,
  lastDayNumberOfPeriod,
  firstEpochMsOfPeriod,
  toZone,
  zoneFromOffset,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type ParsedArgs,
  type Row,
  RowWriter,
  UsageError,
  errorMessage,
  inputValues,
  optionFlag,
  optionString,
  rejectUnknownOptions,
} from '../kit.js';

const CALENDAR_NAMES = ['day', 'iso-week', 'month', 'quarter', 'half-year', 'year'];

/** Reads a unit definition: a calendar unit's name, JSON text, or the path of a JSON file. */
function readDefinition(text: string, option: string): unknown {
  if (CALENDAR_NAMES.includes(text)) return text;
  let json = text;
  if (!text.trimStart().startsWith('{')) {
    try {
      json = readFileSync(text, 'utf8');
    } catch (e) {
      throw new UsageError(
        `${option}: ${JSON.stringify(text)} is not a calendar unit (${CALENDAR_NAMES.join(', ')}), JSON text, or a readable file (${errorMessage(e)})`,
      );
    }
  }
  try {
    return JSON.parse(json) as unknown;
  } catch (e) {
    throw new UsageError(`${option}: ${text === json ? 'the JSON text' : JSON.stringify(text)} is not valid JSON (${errorMessage(e)})`);
  }
}

function readUnit(args: ParsedArgs): PeriodUnit {
  const text = optionString(args, 'unit');
  if (text === undefined) throw new UsageError(`--unit is required: one of ${CALENDAR_NAMES.join(', ')}, a unit definition as JSON, or a JSON file`);
  return defineUnit(readDefinition(text, '--unit') as UnitDefinition);
}

function instantText(epochMs: number, zone: ZoneInput): string {
  return formatInstant(epochMs, { offsetSeconds: offsetSecondsFromEpochMs(zone, epochMs) });
}

const PERIOD_COLUMNS = ['input', 'label', 'first', 'last', 'end', 'days', 'start', 'endInstant'] as const;

/** The period of one input value, and the zone its instants are shown in (when one is known). */
function periodOfValue(unit: PeriodUnit, value: string, zoneOption: ZoneInput | undefined): { period: Period; zone: ZoneInput | undefined } {
  try {
    return { period: parsePeriod(unit, value), zone: zoneOption };
  } catch {
    // Not a label of this unit: read it as a date or an instant below.
  }
  if (!/[Tt ]/.test(value)) {
    let dayNumber: number;
    try {
      dayNumber = parsePlainDate(value);
    } catch (e) {
      throw new UsageError(`${JSON.stringify(value)} is neither a label of unit ${unit.id} (${unit.formatOrdinal(unit.ordinalFromDayNumber(0))} is one) nor a date: ${errorMessage(e)}`);
    }
    return { period: periodFromDayNumber(unit, dayNumber), zone: zoneOption };
  }
  let parsed: ReturnType<typeof parseInstant> | undefined;
  try {
    parsed = parseInstant(value);
  } catch {
    parsed = undefined;
  }
  if (parsed === undefined) {
    // A local date-time without an offset: its period is that of its date, in any zone.
    const wallMs = parsePlainDateTime(value);
    return { period: periodFromDayNumber(unit, Math.floor(wallMs / 86_400_000)), zone: zoneOption };
  }
  const zone = zoneOption ?? (parsed.zoneId !== undefined ? toZone(parsed.zoneId) : zoneFromOffset(parsed.offsetSeconds));
  return { period: periodFromEpochMs(unit, zone, parsed.epochMs), zone };
}

function periodRow(input: string, p: Period, zone: ZoneInput | undefined): Row {
  const first = firstDayNumberOfPeriod(p);
  const end = firstDayNumberAfterPeriod(p);
  const start = zone === undefined ? null : firstEpochMsOfPeriod(p, zone);
  const endMs = zone === undefined ? null : firstEpochMsAfterPeriod(p, zone);
  return {
    input,
    label: formatPeriod(p),
    ordinal: p.ordinal,
    unit: p.unit.id,
    first: formatPlainDate(first),
    last: formatPlainDate(lastDayNumberOfPeriod(p)),
    end: formatPlainDate(end),
    days: end - first,
    zone: zone === undefined ? null : typeof zone === 'string' ? zone : zone.id,
    start: start === null || zone === undefined ? null : instantText(start, zone),
    endInstant: endMs === null || zone === undefined ? null : instantText(endMs, zone),
    startEpochMs: start,
    endEpochMs: endMs,
  };
}

const period: Command = {
  name: 'period',
  summary: 'The period of any unit (calendar, fiscal, 52/53-week) that holds dates, instants or labels',
  valueOptions: ['unit', 'zone'],
  help: `kalends period [value ...] --unit <unit> [--zone <zone>] [--json]

For each value, the period of the unit that holds it: its label, first and last day, the end-exclusive
end (the first day of the next period), its length in days and, when a zone is known, its start and
end instants (the first instants of its first day and of the next period's first day, DST-true).
With no values, reads one value per line from standard input.

A value can be
  a label of the unit   2025-03, 2025-W07, 2025-Q1, FY2026-Q1, FY2023-W53
  a date                2025-02-14 (also 2025-W07-5, 2025-045)
  an instant            2025-10-01T03:30:00Z, 2025-10-01T03:30:00-04:00[America/New_York]
                        (its local date in --zone; without --zone, in its annotated zone or its offset)
  a local date-time     2025-10-01T09:00 (its own date)

--unit takes
  a calendar unit       day, iso-week, month, quarter, half-year, year
  a definition as JSON  '{"kind":"fiscal-quarter","start":{"month":10,"day":1},"naming":"end-year"}'
  a JSON file           retail.json  (one unit definition; see docs/periods.md)

Options
  --unit <unit>   the unit (required)
  --zone <zone>   an IANA zone id or a fixed offset (+05:30) for instants and for start/end instants
  --json          one JSON object per line (JSON Lines) instead of a table; adds ordinal, unit, zone
                  and the start and end as epoch milliseconds

Examples
  kalends period 2025-10-01 --unit '{"kind":"fiscal-year","start":{"month":10,"day":1},"naming":"end-year"}'
  kalends period 2025-03 2025-11 --unit month --zone America/New_York
  printf '2025-10-01T03:30:00Z\\n' | kalends period --unit quarter --zone America/New_York --json
`,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    rejectUnknownOptions(args, ['unit', 'zone']);
    const json = optionFlag(args, 'json');
    const unit = readUnit(args);
    const zoneText = optionString(args, 'zone');
    const zone = zoneText === undefined ? undefined : toZone(zoneText, '--zone');
    const writer = new RowWriter(io, json, PERIOD_COLUMNS);
    let failed = 0;
    let seen = 0;
    for await (const value of inputValues(args, io)) {
      seen++;
      try {
        const r = periodOfValue(unit, value, zone);
        writer.write(periodRow(value, r.period, r.zone));
      } catch (e) {
        failed++;
        io.stderr(`kalends period: cannot place ${JSON.stringify(value)}: ${errorMessage(e)}\n`);
      }
    }
    if (seen === 0) throw new UsageError('no values: give dates, instants or labels as arguments, or one per line on standard input');
    if (seen > failed) writer.end();
    return failed > 0 ? 1 : 0;
  },
};

type Level = 'quarter' | 'period' | 'week';
const LEVELS: readonly Level[] = ['quarter', 'period', 'week'];

/** The fiscal-year unit and the unit of the chosen level, derived from any fiscal definition. */
function fiscalUnits(def: unknown, level: Level): { year: PeriodUnit; sub: PeriodUnit; quarter: PeriodUnit } {
  if (typeof def !== 'object' || def === null || Array.isArray(def)) {
    throw new UsageError('the definition must be a JSON object describing a fiscal unit (with "start" or "yearEnd")');
  }
  const base = { ...(def as Record<string, unknown>) };
  const kind = base['kind'];
  if (typeof kind !== 'string' || !kind.startsWith('fiscal-')) {
    // Validate as given so that the error names the path.
    defineUnit(base as unknown as UnitDefinition);
    throw new UsageError(`the definition is a ${JSON.stringify(kind)} unit; fiscal-layout needs a fiscal unit (kind fiscal-year, fiscal-quarter, fiscal-period, ...)`);
  }
  defineUnit(base as unknown as UnitDefinition); // reports every fault of the definition as given
  const year = defineUnit({ ...base, kind: 'fiscal-year' } as unknown as UnitDefinition);
  const weekBased = base['yearEnd'] !== undefined;
  if (level === 'week' && !weekBased) throw new UsageError('--level week needs a 52/53-week fiscal year (a definition with "yearEnd")');
  if (weekBased && base['layout'] === undefined && level !== 'week') {
    throw new UsageError(`the definition has no "layout"; add one ("4-4-5", "4-5-4", "5-4-4" or "13x4") or use --level week`);
  }
  const quarter = defineUnit({ ...base, kind: 'fiscal-quarter' } as unknown as UnitDefinition);
  const sub = level === 'quarter' ? quarter : defineUnit({ ...base, kind: level === 'week' ? 'fiscal-week' : 'fiscal-period' } as unknown as UnitDefinition);
  return { year, sub, quarter };
}

const LAYOUT_COLUMNS = ['label', 'quarter', 'first', 'last', 'days', 'weeks'] as const;

const fiscalLayout: Command = {
  name: 'fiscal-layout',
  summary: "Print a fiscal year's quarters, periods or weeks with their first and last days",
  valueOptions: ['year', 'date', 'level'],
  help: `kalends fiscal-layout <definition> [--year <FYyyyy | yyyy> | --date <date>] [--level quarter|period|week] [--json]

Prints the layout of one fiscal year: each quarter, period (default) or week with its first and last day,
its length in days and in weeks, and the quarter it belongs to. The definition is the path of a JSON file
(or JSON text) holding any fiscal unit definition; the other fiscal units are derived from it, so one file
describes the whole calendar. See docs/periods.md for the definition format.

Options
  --year <year>     the fiscal year, as its label (FY2026) or its number (2026)
  --date <date>     the fiscal year that holds this date (default: today's date in UTC)
  --level <level>   quarter, period (default) or week (52/53-week years only)
  --json            one JSON object per line (JSON Lines) instead of a table

Examples
  kalends fiscal-layout retail.json --year FY2023
  kalends fiscal-layout '{"kind":"fiscal-year","start":{"month":4,"day":6},"naming":"start-year"}' --date 2025-05-01
`,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    rejectUnknownOptions(args, ['year', 'date', 'level']);
    const json = optionFlag(args, 'json');
    if (args.positionals.length !== 1) {
      throw new UsageError(`give exactly one definition (a JSON file or JSON text), got ${args.positionals.length} arguments`);
    }
    const levelText = optionString(args, 'level', 'period')!;
    if (!(LEVELS as readonly string[]).includes(levelText)) {
      throw new UsageError(`--level: expected one of ${LEVELS.join(', ')}, got ${JSON.stringify(levelText)}`);
    }
    const level = levelText as Level;
    const def = readDefinition(args.positionals[0]!, 'definition');
    const { year, sub, quarter } = fiscalUnits(def, level);
    const yearText = optionString(args, 'year');
    const dateText = optionString(args, 'date');
    if (yearText !== undefined && dateText !== undefined) throw new UsageError('give --year or --date, not both');
    let fy: Period;
    if (yearText !== undefined) fy = parsePeriod(year, /^[+-]?\d+$/.test(yearText) ? `FY${yearText}` : yearText);
    else fy = periodFromDayNumber(year, dateText !== undefined ? parsePlainDate(dateText) : Math.floor(Date.now() / 86_400_000));
    const writer = new RowWriter(io, json, LAYOUT_COLUMNS);
    if (!json) io.stdout(`${formatPeriod(fy)}: ${formatPlainDate(firstDayNumberOfPeriod(fy))} .. ${formatPlainDate(lastDayNumberOfPeriod(fy))} (${firstDayNumberAfterPeriod(fy) - firstDayNumberOfPeriod(fy)} days)\n`);
    for (const p of listSubPeriods(fy, sub)) {
      const first = firstDayNumberOfPeriod(p);
      const days = firstDayNumberAfterPeriod(p) - first;
      writer.write({
        label: formatPeriod(p),
        quarter: formatPeriod(periodFromPeriod(quarter, p)),
        first: formatPlainDate(first),
        last: formatPlainDate(lastDayNumberOfPeriod(p)),
        days,
        weeks: days % 7 === 0 ? days / 7 : Math.round((days / 7) * 10) / 10,
      });
    }
    writer.end();
    return 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [period, fiscalLayout];

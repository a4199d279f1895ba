/**
 * Commands of the period layer: `period` gives the period of any unit that holds a date, an instant or a label;
 * `fiscal-layout` prints a fiscal year's periods with their first and last days. Uses only the public API
 * (`../../index.js`) and the CLI kit.
 *
 * @module
 */
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
  type OptionSpec,
  type ParsedArgs,
  type Row,
  CALENDAR_UNIT_NAMES,
  InputError,
  JSON_OPTION,
  Output,
  RowWriter,
  UsageError,
  writeRowsPerValue,
  optionChoice,
  optionFlag,
  optionString,
  optionZone,
  readDefinition,
  shellMessage,
} from '../kit.js';

/** The unit of `--unit`: a calendar unit's name, JSON text, "-" or a JSON file (the kit's one form). */
async function readUnit(args: ParsedArgs, io: CliIo): Promise<PeriodUnit> {
  const text = optionString(args, 'unit');
  if (text === undefined) throw new UsageError(`--unit is required: one of ${CALENDAR_UNIT_NAMES.join(', ')}, a unit definition as JSON text, or a JSON file`);
  return defineUnit((await readDefinition(text, '--unit', io, CALENDAR_UNIT_NAMES)) as UnitDefinition);
}

const UNIT_TEXT = `the unit: a calendar unit (${CALENDAR_UNIT_NAMES.join(', ')}), a unit definition as JSON text
('{"kind":"fiscal-quarter","start":{"month":10,"day":1},"naming":"end-year"}'), the path of a JSON file holding one, or "-" for standard input (see docs/periods.md)`;

/** The column vocabulary of periods, shared with \`kalends bucket\`. */
const PERIOD_COLUMNS_HELP = `Columns: period (the label), first and last (its first and last days, both included), days (its
length), start and end (instants, when a zone is known: [start, end), end-exclusive, so end is the first
instant of the next period; DST-true).`;

function instantText(epochMs: number, zone: ZoneInput): string {
  return formatInstant(epochMs, { offsetSeconds: offsetSecondsFromEpochMs(zone, epochMs) });
}

const PERIOD_COLUMNS = ['input', 'period', 'first', 'last', 'days', 'start', 'end'] as const;

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
      throw new InputError(`neither a label of unit ${unit.id} (${unit.formatOrdinal(unit.ordinalFromDayNumber(0))} is one) nor a date: ${shellMessage(e)}`);
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
  const days = firstDayNumberAfterPeriod(p) - first;
  const startMs = zone === undefined ? null : firstEpochMsOfPeriod(p, zone);
  const endMs = zone === undefined ? null : firstEpochMsAfterPeriod(p, zone);
  return {
    input,
    period: formatPeriod(p),
    ordinal: p.ordinal,
    unit: p.unit.id,
    first: formatPlainDate(first),
    last: formatPlainDate(lastDayNumberOfPeriod(p)),
    days,
    zone: zone === undefined ? null : typeof zone === 'string' ? zone : zone.id,
    start: startMs === null || zone === undefined ? null : instantText(startMs, zone),
    end: endMs === null || zone === undefined ? null : instantText(endMs, zone),
    startEpochMs: startMs,
    endEpochMs: endMs,
  };
}

const UNIT_OPTION: OptionSpec = { name: 'unit', value: '<unit>', text: `${UNIT_TEXT}. Required.` };

const period: Command = {
  name: 'period',
  summary: 'The period of any unit (calendar, fiscal, 52/53-week) that holds dates, instants or labels',
  usage: ['[<value>...] --unit <unit> [--zone <zone>] [--json]'],
  description: `For each value, the period of the unit that holds it: its label, first and last day, its length in days
and, when a zone is known, its start and end instants. With no values, reads one value per line from
standard input.

A value can be
  a label of the unit   2025-03, 2025-W07, 2025-Q1, FY2026-Q1, FY2023-W53
  a date                2025-02-14 (also 2025-W07-5, 2025-045)
  an instant            2025-10-01T03:30:00Z, 2025-10-01T03:30:00-04:00[America/New_York]
                        (its local date in --zone; without --zone, in its annotated zone or its offset)
  a local date-time     2025-10-01T09:00 (its own date)

${PERIOD_COLUMNS_HELP}
--json adds ordinal, unit, zone, and the start and end as epoch milliseconds (startEpochMs, endEpochMs).`,
  options: [UNIT_OPTION, { name: 'zone', value: '<zone>', text: 'an IANA zone id or a fixed offset (+05:30) for instants and for start and end' }, JSON_OPTION],
  examples: [
    `kalends period 2025-10-01 --unit '{"kind":"fiscal-year","start":{"month":10,"day":1},"naming":"end-year"}'`,
    'kalends period 2025-03 2025-11 --unit month --zone America/New_York',
    "printf '2025-10-01T03:30:00Z\\n' | kalends period --unit quarter --zone America/New_York --json",
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const unit = await readUnit(args, io);
    const zone = optionZone(args, 'zone');
    return writeRowsPerValue(args, io, {
      command: 'period',
      noun: 'values',
      columns: PERIOD_COLUMNS,
      handle(value, writer) {
        const r = periodOfValue(unit, value, zone);
        return writer.write(periodRow(value, r.period, r.zone));
      },
    });
  },
};

type Level = 'quarter' | 'period' | 'week';
const LEVELS: readonly Level[] = ['quarter', 'period', 'week'];

/** The fiscal-year unit and the unit of the chosen level, derived from any fiscal definition. */
function fiscalUnits(def: unknown, level: Level): { year: PeriodUnit; sub: PeriodUnit; quarter: PeriodUnit } {
  if (typeof def !== 'object' || def === null || Array.isArray(def)) {
    throw new UsageError('--unit: expected a fiscal unit definition (a JSON object with "start" or "yearEnd")');
  }
  const base = { ...(def as Record<string, unknown>) };
  const kind = base['kind'];
  if (typeof kind !== 'string' || !kind.startsWith('fiscal-')) {
    // Validate as given so that the error names the path.
    defineUnit(base as unknown as UnitDefinition);
    throw new UsageError(`--unit: the definition is a ${JSON.stringify(kind)} unit; fiscal-layout needs a fiscal unit (kind fiscal-year, fiscal-quarter, fiscal-period, ...)`);
  }
  defineUnit(base as unknown as UnitDefinition); // reports every fault of the definition as given
  const year = defineUnit({ ...base, kind: 'fiscal-year' } as unknown as UnitDefinition);
  const weekBased = base['yearEnd'] !== undefined;
  if (level === 'week' && !weekBased) throw new UsageError('--level week needs a 52/53-week fiscal year (a definition with "yearEnd")');
  if (weekBased && base['layout'] === undefined && level !== 'week') {
    throw new UsageError(`--unit: the definition has no "layout"; add one ("4-4-5", "4-5-4", "5-4-4" or "13x4") or use --level week`);
  }
  const quarter = defineUnit({ ...base, kind: 'fiscal-quarter' } as unknown as UnitDefinition);
  const sub = level === 'quarter' ? quarter : defineUnit({ ...base, kind: level === 'week' ? 'fiscal-week' : 'fiscal-period' } as unknown as UnitDefinition);
  return { year, sub, quarter };
}

const fiscalLayout: Command = {
  name: 'fiscal-layout',
  summary: "Print a fiscal year's quarters, periods or weeks with their first and last days",
  usage: ['--unit <definition> [--year <FYyyyy | yyyy> | --date <date>] [--level quarter|period|week] [--json]'],
  description: `Prints the layout of one fiscal year: each quarter, period (default) or week with its first and last day,
its length in days and in weeks, and the quarter it belongs to (below quarter level). --unit holds any
fiscal unit definition; the other fiscal units are derived from it, so one definition describes the whole
calendar. See docs/periods.md for the definition format.

Columns: period (the label), quarter, first and last (both days included), days, weeks.`,
  options: [
    { name: 'unit', value: '<definition>', text: 'a fiscal unit definition: JSON text, the path of a JSON file, or "-" for standard input. Required.' },
    { name: 'year', value: '<year>', text: 'the fiscal year, as its label (FY2026) or its number (2026)' },
    { name: 'date', value: '<date>', text: "the fiscal year that holds this date (default: today's date in UTC)" },
    { name: 'level', value: '<level>', text: 'quarter, period (default) or week (52/53-week years only)' },
    JSON_OPTION,
  ],
  examples: [
    'kalends fiscal-layout --unit retail.json --year FY2023',
    `kalends fiscal-layout --unit '{"kind":"fiscal-year","start":{"month":4,"day":6},"naming":"start-year"}' --date 2025-05-01`,
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    if (args.positionals.length > 0) throw new UsageError(`fiscal-layout takes no arguments (the definition goes in --unit), got ${JSON.stringify(args.positionals[0])}`);
    const level = optionChoice(args, 'level', LEVELS, 'period')!;
    const unitText = optionString(args, 'unit');
    if (unitText === undefined) throw new UsageError('--unit is required: a fiscal unit definition as JSON text or a JSON file');
    const { year, sub, quarter } = fiscalUnits(await readDefinition(unitText, '--unit', io, []), level);
    const yearText = optionString(args, 'year');
    const dateText = optionString(args, 'date');
    if (yearText !== undefined && dateText !== undefined) throw new UsageError('give --year or --date, not both');
    let fy: Period;
    try {
      if (yearText !== undefined) fy = parsePeriod(year, /^[+-]?\d+$/.test(yearText) ? `FY${yearText}` : yearText);
      else fy = periodFromDayNumber(year, dateText !== undefined ? parsePlainDate(dateText) : Math.floor(Date.now() / 86_400_000));
    } catch (e) {
      throw new UsageError(`--${yearText !== undefined ? 'year' : 'date'}: ${shellMessage(e, { 'label: ': '' })}`);
    }
    const json = optionFlag(args, 'json');
    const out = new Output(io);
    // At quarter level each row is its own quarter: no quarter column.
    const columns = level === 'quarter' ? ['period', 'first', 'last', 'days', 'weeks'] : ['period', 'quarter', 'first', 'last', 'days', 'weeks'];
    const writer = new RowWriter(out, json, columns);
    if (!json) await out.write(`${formatPeriod(fy)}: ${formatPlainDate(firstDayNumberOfPeriod(fy))} .. ${formatPlainDate(lastDayNumberOfPeriod(fy))} (${firstDayNumberAfterPeriod(fy) - firstDayNumberOfPeriod(fy)} days)\n`);
    for (const p of listSubPeriods(fy, sub)) {
      const first = firstDayNumberOfPeriod(p);
      const days = firstDayNumberAfterPeriod(p) - first;
      await writer.write({
        period: formatPeriod(p),
        ...(level === 'quarter' ? {} : { quarter: formatPeriod(periodFromPeriod(quarter, p)) }),
        first: formatPlainDate(first),
        last: formatPlainDate(lastDayNumberOfPeriod(p)),
        days,
        weeks: days % 7 === 0 ? days / 7 : Math.round((days / 7) * 10) / 10,
      });
    }
    await writer.end();
    return 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [period, fiscalLayout];

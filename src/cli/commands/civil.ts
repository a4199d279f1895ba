/**
 * Commands of the civil and instant layers. `describe` converts and describes dates and instants.
 * Uses only the public API (`../../index.js`) and the CLI kit.
 *
 * @module
 */
import {
  dayOfYearOfDayNumber,
  dayCountOfMonth,
  formatInstant,
  formatIsoWeekDate,
  formatOffset,
  formatPlainDate,
  formatPlainDateTime,
  isLeapYear,
  parseExtendedDateTime,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
  toDayNumber,
  toEpochMs,
  weekdayOfDayNumber,
  ymdFromDayNumber,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type ParsedArgs,
  type Row,
  JSON_OPTION,
  InputError,
  optionChoice,
  weekdayTitle,
  writeRowsPerValue,
} from '../kit.js';

/** How a bare integer on the command line is read (`--numbers`). */
type NumberReading = 'epoch-ms' | 'epoch-seconds' | 'day-number';
const NUMBER_READINGS: readonly NumberReading[] = ['epoch-ms', 'epoch-seconds', 'day-number'];

/** Columns of the table; JSON Lines carry these and a few more (weekdayNumber, offset, zoneAnnotation). */
const TABLE_COLUMNS = ['input', 'kind', 'utc', 'epochMs', 'local', 'date', 'weekday', 'isoWeek', 'dayOfYear', 'dayNumber', 'leapYear', 'daysInMonth'] as const;

/** The date facts of one local day. */
function dateFacts(dayNumber: number): Record<string, string | number | boolean> {
  const { year, month } = ymdFromDayNumber(dayNumber);
  const weekday = weekdayOfDayNumber(dayNumber);
  return {
    date: formatPlainDate(dayNumber),
    weekday: weekdayTitle(dayNumber),
    weekdayNumber: weekday,
    isoWeek: formatIsoWeekDate(dayNumber),
    dayOfYear: dayOfYearOfDayNumber(dayNumber),
    dayNumber,
    leapYear: isLeapYear(year),
    daysInMonth: dayCountOfMonth(year, month),
  };
}

function describeInstant(input: string, epochMs: number, offsetSeconds: number | null, zoneAnnotation: string | null, leapSecond = false): Row {
  // ZONE LAYER: a `--zone <id>` option belongs here. With a zone, add its local date-time and offset at
  // `epochMs` (wallMsFromEpochMs, offsetSecondsFromEpochMs) and take the date facts of the local day
  // (dayNumberFromEpochMs) instead of the UTC day. Without one, the facts stay those of the UTC date.
  const utcDay = Math.floor(epochMs / 86_400_000);
  return {
    input,
    kind: 'instant',
    utc: formatInstant(epochMs),
    epochMs,
    local: offsetSeconds === null ? null : formatPlainDateTime(epochMs + offsetSeconds * 1000),
    offset: offsetSeconds === null ? null : formatOffset(offsetSeconds),
    zoneAnnotation,
    leapSecond,
    ...dateFacts(utcDay),
  };
}

function describeValue(input: string, numbers: NumberReading | undefined): Row {
  if (/^[+-]?\d+$/.test(input)) {
    if (numbers === undefined) {
      throw new InputError(`a bare number, which could be epoch ms, epoch seconds or a day number; say which with --numbers ${NUMBER_READINGS.join('|')}`);
    }
    const n = Number(input);
    if (numbers === 'day-number') {
      const dn = toDayNumber(n);
      return { input, kind: 'date', utc: null, epochMs: null, local: null, offset: null, zoneAnnotation: null, leapSecond: null, ...dateFacts(dn) };
    }
    const ms = toEpochMs(numbers === 'epoch-seconds' ? n * 1000 : n);
    return describeInstant(input, ms, null, null);
  }
  if (!/[Tt ]/.test(input)) {
    const dn = parsePlainDate(input);
    return { input, kind: 'date', utc: null, epochMs: null, local: null, offset: null, zoneAnnotation: null, leapSecond: null, ...dateFacts(dn) };
  }
  const parts = parseExtendedDateTime(input);
  if (parts.offsetSeconds !== undefined) {
    const p = parseInstant(input);
    return describeInstant(input, p.epochMs, p.localOffsetUnknown ? null : p.offsetSeconds, p.zoneId ?? null, p.leapSecond);
  }
  // A local date-time: no instant until a zone is known (the zone layer's --zone will resolve it).
  const wallMs = parsePlainDateTime(input, { offset: 'ignore' });
  return {
    input,
    kind: 'local date-time',
    utc: null,
    epochMs: null,
    local: formatPlainDateTime(wallMs),
    offset: null,
    zoneAnnotation: parts.zoneId ?? null,
    leapSecond: null,
    ...dateFacts(Math.floor(wallMs / 86_400_000)),
  };
}

const describe: Command = {
  name: 'describe',
  summary: 'Convert and describe dates and instants (ISO week, weekday, day of year, day number)',
  usage: ['[<value>...] [--numbers epoch-ms|epoch-seconds|day-number] [--json]'],
  description: `Describes each value: its ISO date, weekday (name and number, 1 = Monday), ISO week date (2025-W07-5),
day of the year, day number (days since 1970-01-01), whether the year is a leap year, and the days in
its month. With no values, reads one value per line from standard input.

A value can be
  a date            2025-02-14, 2025-W07-5 (ISO week date), 2025-045 (ordinal date)
  an instant        2025-02-14T09:30:00Z, 2025-02-14T10:30:00+01:00[Europe/Dublin]
                    (described by its UTC date; epoch ms and the UTC date-time are shown)
  a local date-time 2025-02-14T09:30 (no offset: described by its own date)
  a number          only with --numbers, which says whether it is epoch-ms, epoch-seconds or a day-number

A value that cannot be read is named on standard error; the others are still described.`,
  options: [{ name: 'numbers', value: '<kind>', text: 'how to read bare integers: epoch-ms, epoch-seconds or day-number' }, JSON_OPTION],
  examples: [
    'kalends describe 2025-02-14 2025-W07-5 1996-12-19T16:39:57-08:00',
    "printf '2024-02-29\\n2025-045\\n' | kalends describe --json",
    'kalends describe 1739525400000 --numbers epoch-ms',
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const numbers = optionChoice(args, 'numbers', NUMBER_READINGS);
    return writeRowsPerValue(args, io, { command: 'describe', noun: 'values', columns: TABLE_COLUMNS, handle: (value, writer) => writer.write(describeValue(value, numbers)) });
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [describe];

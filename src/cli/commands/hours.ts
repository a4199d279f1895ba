/**
 * The `hours` command: business time on a definition of opening hours (JSON text or a file): open or closed at
 * instants, the next opening, a business duration added, the business time between two instants, and value
 * dates under a named cut-off. Reads its values from arguments or, with none, from standard input: plain lines
 * ("2025-03-10T14:00Z PT8H") or JSON Lines ({"at": "...", "duration": "PT8H"}). Uses only the public API and the
 * CLI kit.
 *
 * @module
 */
import {
  type BusinessHours,
  HOURS_CAUTION,
  type HoursDefinition,
  countBusinessMs,
  defineHours,
  formatInstant,
  hoursOfProfile,
  formatPlainDate,
  isOpen,
  nextClosingEpochMs,
  nextOpeningEpochMs,
  offsetSecondsFromEpochMs,
  parseInstant,
  shiftBusinessTime,
  toEpochMs,
  valueDayNumberOfEpochMs,
} from '../../index.js';
import { profileOfArgs } from '../profile.js';
import { type CliIo, type Command, JSON_OPTION, type ParsedArgs, type Row, UsageError, optionFlag, optionString, readDefinition, writeRowsPerValue } from '../kit.js';

const ACTIONS = ['open', 'next-open', 'shift', 'between', 'value-date'] as const;
type Action = (typeof ACTIONS)[number];

/** What each action reads from one input: field names, in order. */
const FIELDS: Readonly<Record<Action, readonly string[]>> = {
  open: ['at'],
  'next-open': ['at'],
  shift: ['at', 'duration'],
  between: ['start', 'end'],
  'value-date': ['at'],
};

/** The definition named by --hours: the name of the --profile's hours, JSON text, a JSON file, or "-" for standard input. */
async function hoursOption(args: ParsedArgs, io: CliIo): Promise<BusinessHours> {
  const value = optionString(args, 'hours');
  if (value === undefined) throw new UsageError('--hours is required: a definition of hours as JSON text, a JSON file or "-" (see docs/business-time.md), or with --profile the name of its hours');
  const profile = profileOfArgs(args);
  if (profile && Object.prototype.hasOwnProperty.call(profile.hours, value)) return hoursOfProfile(profile, value);
  return defineHours((await readDefinition(value, '--hours', io, [])) as HoursDefinition);
}

/** An instant: RFC 3339 / RFC 9557 text, or an integer of epoch milliseconds. */
function readInstant(value: unknown, field: string): number {
  if (typeof value === 'number') return toEpochMs(value);
  if (typeof value !== 'string') throw new UsageError(`${field}: expected an instant such as "2025-03-10T14:00:00Z" or epoch milliseconds, got ${JSON.stringify(value)}`);
  if (/^[+-]?\d+$/.test(value)) return toEpochMs(Number(value));
  return parseInstant(value).epochMs;
}

/** The instant in the hours' zone, with its offset ("2025-03-10T10:00:00-04:00"). */
function local(hours: BusinessHours, epochMs: number): string {
  const t = Math.floor(epochMs);
  return formatInstant(t, { offsetSeconds: offsetSecondsFromEpochMs(hours.zoneId, t) });
}

/** One input's fields, from a JSON object line or from whitespace- or comma-separated text. */
function fieldsOf(line: string, names: readonly string[]): unknown[] {
  if (line.startsWith('{')) {
    let obj: unknown;
    try {
      obj = JSON.parse(line);
    } catch (e) {
      throw new UsageError(`not a valid JSON line (${e instanceof Error ? e.message : String(e)}): ${line.slice(0, 80)}`);
    }
    if (typeof obj !== 'object' || obj === null || Array.isArray(obj)) throw new UsageError(`expected a JSON object with ${names.map((n) => JSON.stringify(n)).join(', ')}, got ${line.slice(0, 80)}`);
    const rec = obj as Record<string, unknown>;
    const unknown = Object.keys(rec).filter((k) => !names.includes(k));
    if (unknown.length > 0) throw new UsageError(`unknown field ${JSON.stringify(unknown[0])} in a JSON line; expected ${names.map((n) => JSON.stringify(n)).join(', ')}`);
    return names.map((n) => {
      if (!Object.prototype.hasOwnProperty.call(rec, n)) throw new UsageError(`missing field ${JSON.stringify(n)} in a JSON line: ${line.slice(0, 80)}`);
      return rec[n];
    });
  }
  const parts = line.split(/[\s,]+/).filter((p) => p !== '');
  if (parts.length !== names.length) throw new UsageError(`expected ${names.map((n) => `<${n}>`).join(' ')} on each input line, got ${JSON.stringify(line.slice(0, 80))}`);
  return parts;
}

function answer(action: Action, hours: BusinessHours, values: readonly unknown[], cutoff: string | undefined): Row {
  if (action === 'between') {
    const start = readInstant(values[0], 'start');
    const end = readInstant(values[1], 'end');
    const ms = countBusinessMs(hours, start, end);
    return { start: local(hours, start), end: local(hours, end), businessMs: ms, businessHours: Math.round((ms / 3_600_000) * 1e6) / 1e6 };
  }
  const at = readInstant(values[0], 'at');
  switch (action) {
    case 'open': {
      const open = isOpen(hours, at);
      return { at: local(hours, at), open, changesAt: local(hours, open ? nextClosingEpochMs(hours, at) : nextOpeningEpochMs(hours, at)) };
    }
    case 'next-open':
      return { at: local(hours, at), nextOpen: local(hours, nextOpeningEpochMs(hours, at)) };
    case 'shift': {
      const duration = values[1];
      if (typeof duration !== 'string') throw new UsageError(`duration: expected an ISO 8601 duration of elapsed time such as "PT8H", got ${JSON.stringify(duration)}`);
      return { at: local(hours, at), duration, result: local(hours, shiftBusinessTime(hours, at, duration)) };
    }
    default:
      return { at: local(hours, at), cutoff: cutoff!, valueDate: formatPlainDate(valueDayNumberOfEpochMs(hours, at, cutoff!)) };
  }
}

const COLUMNS: Readonly<Record<Action, readonly string[]>> = {
  open: ['at', 'open', 'changesAt'],
  'next-open': ['at', 'nextOpen'],
  shift: ['at', 'duration', 'result'],
  between: ['start', 'end', 'businessMs', 'businessHours'],
  'value-date': ['at', 'cutoff', 'valueDate'],
};

const hoursCommand: Command = {
  name: 'hours',
  summary: 'Business time on opening hours: open or closed, next opening, add business time, time between, value dates',
  usage: [
    'open [<instant>...] --hours <definition> [--json]',
    'next-open [<instant>...] --hours <definition> [--json]',
    'shift [<instant> <duration>...] --hours <definition> [--json]',
    'between [<start> <end>...] --hours <definition> [--json]',
    'value-date [<instant>...] --cutoff <name> --hours <definition> [--json]',
  ],
  description: `Answers business-time questions on a definition of opening hours (zone, calendar, weekly intervals, special
days, cut-offs; see docs/business-time.md). Business time is elapsed time counted while the hours are open.
  open        whether the hours are open at each instant, and when that changes (the next closing or opening)
  next-open   the next opening strictly after each instant
  shift       each instant moved by a business duration of elapsed time ("PT8H"; "P1D" is refused: a business
              day has no fixed length)
  between     the business time from start to end (negative when end comes first)
  value-date  the value date of an instruction under a named cut-off: the same business day when at or before
              the cut-off (the cut-off instant itself is in time), else the next business day

An instant is RFC 3339 / RFC 9557 text ("2025-03-10T14:00:00Z") or an integer of epoch milliseconds. With no
values after the action, reads standard input: one input per line, either plain ("2025-03-10T14:00Z PT8H") or a
JSON object ({"at": "2025-03-10T14:00Z", "duration": "PT8H"}; "start" and "end" for between). Instants are shown
with the offset of the hours' zone. Official hours and cut-offs are set by the institution: verify against it.`,
  options: [
    { name: 'hours', value: '<definition>', text: 'the definition: JSON text (starting with "{"), a JSON file, "-" for standard input, or with --profile the name of its hours (required)' },
    { name: 'cutoff', value: '<name>', text: 'the cut-off of value-date (a name from the definition\'s "cutoffs")' },
    JSON_OPTION,
  ],
  examples: [
    'kalends hours open 2025-07-03T17:30:00Z --hours desk.json',
    'kalends hours shift 2025-07-02T19:00:00Z PT8H --hours desk.json --json',
    `echo '{"start": "2025-07-02T19:00Z", "end": "2025-07-07T14:30Z"}' | kalends hours between --hours desk.json`,
    'kalends hours value-date 2025-11-25T23:30:00Z --cutoff payments --hours payments-office --profile examples/otterbrook.profile.json',
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const action = args.positionals[0];
    if (action === undefined || !(ACTIONS as readonly string[]).includes(action)) {
      throw new UsageError(`expected an action, one of ${ACTIONS.join(', ')}${action === undefined ? '' : `, got ${JSON.stringify(action)}`}`);
    }
    const act = action as Action;
    const cutoff = optionString(args, 'cutoff');
    if ((act === 'value-date') !== (cutoff !== undefined)) {
      throw new UsageError(act === 'value-date' ? 'value-date needs --cutoff <name> (a name from the definition\'s "cutoffs")' : `--cutoff goes with value-date only, not with ${act}`);
    }
    const hours = await hoursOption(args, io);
    const names = FIELDS[act];
    // Arguments after the action are grouped into inputs of the action's fields (shift: instant and duration).
    const given = args.positionals.slice(1);
    if (given.length % names.length !== 0) throw new UsageError(`${act} takes ${names.map((n) => `<${n}>`).join(' ')} for each input; got ${given.length} values`);
    const grouped: string[] = [];
    for (let i = 0; i < given.length; i += names.length) grouped.push(given.slice(i, i + names.length).join(' '));
    if (!optionFlag(args, 'json')) io.stderr(`note: ${HOURS_CAUTION}\n`);
    return writeRowsPerValue({ positionals: grouped, options: args.options }, io, {
      command: 'hours',
      noun: 'inputs',
      columns: COLUMNS[act],
      handle: (line, writer) => writer.write(answer(act, hours, fieldsOf(line, names), cutoff)),
    });
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [hoursCommand];

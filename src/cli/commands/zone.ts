/**
 * Commands of the zone layer: `zone-at` (offset and local time of instants), `zone-resolve` (local date-time to
 * instant with a disambiguation, showing gaps and overlaps) and `zone-changes` (offset changes in a range).
 * Uses only the public API (`../../index.js`) and the CLI kit.
 *
 * @module
 */
import {
  type Disambiguation,
  type Zone,
  dayNumberFromEpochMs,
  firstEpochMsOfDayNumber,
  epochMsFromWallMs,
  formatInstant,
  formatOffset,
  formatPlainDate,
  formatPlainDateTime,
  listTransitions,
  offsetSecondsFromEpochMs,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
  resolveWallMs,
  toEpochMs,
  zoneFromId,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type OptionSpec,
  type ParsedArgs,
  JSON_OPTION,
  UsageError,
  optionChoice,
  optionString,
  optionZone,
  shellMessage,
  writeRowsPerValue,
} from '../kit.js';

const ZONE_OPTION: OptionSpec = { name: 'zone', value: '<zone>', text: 'IANA zone id ("Europe/Dublin"), "UTC", or a fixed offset ("+05:30"). Required.' };

function requireZone(args: ParsedArgs): Zone {
  const zone = optionZone(args, 'zone');
  if (zone === undefined) throw new UsageError('--zone is required: an IANA id such as America/New_York, "UTC", or an offset such as +05:30');
  return zone;
}

/** An instant from an argument: RFC 3339 / RFC 9557 text, or an integer of epoch milliseconds. */
function readInstant(text: string): number {
  if (/^[+-]?\d+$/.test(text)) return toEpochMs(Number(text));
  return parseInstant(text).epochMs;
}

function hours(seconds: number): string {
  const sign = seconds < 0 ? '-' : '+';
  const a = Math.abs(seconds);
  const h = Math.floor(a / 3600);
  const m = Math.floor((a % 3600) / 60);
  const s = a % 60;
  return `${sign}${h}h${m ? `${String(m).padStart(2, '0')}m` : ''}${s ? `${String(s).padStart(2, '0')}s` : ''}`;
}

const zoneAt: Command = {
  name: 'zone-at',
  summary: "A zone's UTC offset and local time at instants",
  usage: ['[<instant>...] --zone <zone> [--json]'],
  description: `Shows, for each instant, the zone's UTC offset and the local date-time there. An instant is an RFC 3339 /
RFC 9557 date-time with an offset ("2025-03-09T07:00:00Z") or an integer of epoch milliseconds. With no
instants, reads one per line from standard input.`,
  options: [ZONE_OPTION, JSON_OPTION],
  examples: ['kalends zone-at 2025-03-30T00:59:59Z 2025-03-30T01:00:00Z --zone Europe/Dublin', 'echo 0 | kalends zone-at --zone Asia/Kolkata --json'],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const zone = requireZone(args);
    return writeRowsPerValue(args, io, {
      command: 'zone-at',
      noun: 'instants',
      columns: ['input', 'utc', 'local', 'offset', 'localDate'],
      handle(value, writer) {
        const epochMs = readInstant(value);
        const off = offsetSecondsFromEpochMs(zone, epochMs);
        return writer.write({
          input: value,
          zone: zone.id,
          utc: formatInstant(epochMs),
          epochMs,
          local: formatPlainDateTime(epochMs + off * 1000),
          offset: formatOffset(off),
          offsetSeconds: off,
          localDate: formatPlainDate(dayNumberFromEpochMs(zone, epochMs)),
        });
      },
    });
  },
};

const DISAMBIGUATIONS: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];

const zoneResolve: Command = {
  name: 'zone-resolve',
  summary: 'Local date-times to instants in a zone, showing gaps and overlaps',
  usage: ['[<local date-time>...] --zone <zone> [--disambiguation <how>] [--json]'],
  description: `Converts local date-times ("2025-03-09T02:30") in a zone to instants. The status column says whether the
local time is unique, fell in a gap (the clocks skipped it) or in an overlap (it happened twice). With no
date-times, reads one per line from standard input.

With --disambiguation reject, a local time in a gap or an overlap gets no instant: the note says why, and
the exit code is 1.`,
  options: [
    ZONE_OPTION,
    {
      name: 'disambiguation',
      value: '<how>',
      text: 'compatible (default: the earlier instant in an overlap, shifted forward in a gap),\nearlier, later, or reject (a gap or overlap gets no instant; exit code 1)',
    },
    JSON_OPTION,
  ],
  examples: [
    'kalends zone-resolve 2025-03-09T02:30 2025-11-02T01:30 --zone America/New_York',
    'kalends zone-resolve 2025-11-02T01:30 --zone America/New_York --disambiguation later --json',
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const zone = requireZone(args);
    const how = optionChoice(args, 'disambiguation', DISAMBIGUATIONS, 'compatible')!;
    return writeRowsPerValue(args, io, {
      command: 'zone-resolve',
      noun: 'local date-times',
      columns: ['input', 'status', 'instant', 'offset', 'note'],
      async handle(value, writer) {
        const wallMs = parsePlainDateTime(value);
        const local = formatPlainDateTime(wallMs);
        const r = resolveWallMs(zone, wallMs);
        let note = '';
        if (r.kind === 'gap') {
          note = `skipped: the clocks went from ${formatPlainDateTime(r.startWallMs)} to ${formatPlainDateTime(r.endWallMs)} (${formatOffset(r.offsetBeforeSeconds)} -> ${formatOffset(r.offsetAfterSeconds)})`;
        }
        if (r.kind === 'overlap') note = `twice: ${formatInstant(r.epochMsBeforeTransition)} and ${formatInstant(r.epochMsAfterTransition)}`;
        const rejected = how === 'reject' && r.kind !== 'unique';
        if (rejected) {
          note =
            r.kind === 'gap'
              ? `${local} does not exist in ${zone.id}: the clocks went from ${formatPlainDateTime(r.startWallMs)} to ${formatPlainDateTime(r.endWallMs)}; --disambiguation compatible, earlier or later picks an instant`
              : `${local} happened twice in ${zone.id}; --disambiguation earlier, later or compatible picks one of the two instants`;
        }
        const epochMs = rejected ? null : epochMsFromWallMs(zone, wallMs, how);
        const off = epochMs === null ? null : offsetSecondsFromEpochMs(zone, epochMs);
        await writer.write({
          input: value,
          zone: zone.id,
          status: r.kind,
          instant: epochMs === null ? null : formatInstant(epochMs, { offsetSeconds: off! }),
          epochMs,
          offset: off === null ? null : formatOffset(off),
          note,
          ...(r.kind !== 'unique' ? { offsetBefore: formatOffset(r.offsetBeforeSeconds), offsetAfter: formatOffset(r.offsetAfterSeconds) } : {}),
          ...(r.kind === 'overlap' ? { epochMsBeforeTransition: r.epochMsBeforeTransition, epochMsAfterTransition: r.epochMsAfterTransition } : {}),
        });
        return !rejected;
      },
    });
  },
};

/** A range bound: a year ("2025"), a local date ("2025-03-01", the day's first instant in the zone), or an instant. */
function readBound(zone: Zone, text: string): number {
  if (/^\d{4}$/.test(text)) return firstEpochMsOfDayNumber(zone, parsePlainDate(`${text}-01-01`));
  if (/^[+-]?\d{4,6}-\d{2}-\d{2}$/.test(text)) return firstEpochMsOfDayNumber(zone, parsePlainDate(text));
  return readInstant(text);
}

/** Reads a bound once in UTC, so that a malformed --from or --to is a usage error before any zone is read. */
function checkBound(option: string, text: string): void {
  try {
    readBound(zoneFromId('UTC'), text);
  } catch (e) {
    throw new UsageError(`--${option}: ${shellMessage(e)}`);
  }
}

/** Transitions are listed in windows of 400 Gregorian years (146,097 days), well inside the library's limit. */
const TRANSITION_WINDOW_MS = 146_097 * 86_400_000;

const zoneChanges: Command = {
  name: 'zone-changes',
  summary: "A zone's offset changes (transitions) in a range",
  usage: ['[<zone id>...] [--from <when>] [--to <when>] [--json]'],
  description: `Lists the instants where each zone's UTC offset changes within [from, to), with the local clock just before
and after, and whether the change skips local times (gap) or repeats them (overlap). With no zone ids,
reads one per line from standard input. Long ranges are streamed.`,
  options: [
    { name: 'from', value: '<when>', text: 'a year ("2025"), a local date ("2025-03-01"), or an instant. Default: this year.' },
    { name: 'to', value: '<when>', text: 'the end (exclusive), same forms. Default: one year after --from.' },
    JSON_OPTION,
  ],
  examples: ['kalends zone-changes Europe/Dublin America/Sao_Paulo --from 2018 --to 2020', 'echo Australia/Lord_Howe | kalends zone-changes --from 2025 --to 2026 --json'],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const thisYear = String(new Date().getUTCFullYear());
    const fromText = optionString(args, 'from') ?? thisYear;
    const toText = optionString(args, 'to') ?? String(Number(/^\d{4}/.exec(fromText)?.[0] ?? thisYear) + 1);
    checkBound('from', fromText);
    checkBound('to', toText);
    return writeRowsPerValue(args, io, {
      command: 'zone-changes',
      noun: 'zone ids',
      columns: ['zone', 'at', 'localBefore', 'localAfter', 'offsetBefore', 'offsetAfter', 'change', 'kind'],
      async handle(id, writer) {
        const zone = zoneFromId(id);
        const start = readBound(zone, fromText);
        const end = readBound(zone, toText);
        if (!(end > start)) throw new UsageError(`--to must be after --from, got ${formatInstant(start)} .. ${formatInstant(end)}`);
        for (let lo = start; lo < end; lo += TRANSITION_WINDOW_MS) {
          for (const t of listTransitions(zone, lo, Math.min(end, lo + TRANSITION_WINDOW_MS))) {
            const change = t.offsetAfterSeconds - t.offsetBeforeSeconds;
            await writer.write({
              zone: zone.id,
              at: formatInstant(t.epochMs),
              epochMs: t.epochMs,
              localBefore: formatPlainDateTime(t.epochMs + t.offsetBeforeSeconds * 1000),
              localAfter: formatPlainDateTime(t.epochMs + t.offsetAfterSeconds * 1000),
              offsetBefore: formatOffset(t.offsetBeforeSeconds),
              offsetAfter: formatOffset(t.offsetAfterSeconds),
              change: hours(change),
              kind: change > 0 ? 'gap' : 'overlap',
            });
          }
        }
      },
    });
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [zoneAt, zoneResolve, zoneChanges];

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
  type ParsedArgs,
  RowWriter,
  UsageError,
  errorMessage,
  inputValues,
  optionFlag,
  optionString,
  rejectUnknownOptions,
} from '../kit.js';

function requireZone(args: ParsedArgs): Zone {
  const id = optionString(args, 'zone');
  if (id === undefined) throw new UsageError('--zone is required: an IANA id such as America/New_York, "UTC", or an offset such as +05:30');
  return zoneFromId(id);
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
  valueOptions: ['zone'],
  help: `Usage: kalends zone-at <instant>... --zone <id> [--json]

Shows, for each instant, the zone's UTC offset and the local date-time there. An instant is an RFC 3339 /
RFC 9557 date-time with an offset ("2025-03-09T07:00:00Z") or an integer of epoch milliseconds. With no
instants, reads one per line from standard input.

Options
  --zone <id>   IANA zone id ("Europe/Dublin"), "UTC", or a fixed offset ("+05:30"). Required.
  --json        One JSON object per line.

Examples
  kalends zone-at 2025-03-30T00:59:59Z 2025-03-30T01:00:00Z --zone Europe/Dublin
  echo 0 | kalends zone-at --zone Asia/Kolkata --json
`,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    rejectUnknownOptions(args, ['zone']);
    const zone = requireZone(args);
    const writer = new RowWriter(io, optionFlag(args, 'json'), ['input', 'utc', 'local', 'offset', 'localDate']);
    let failed = 0;
    let seen = 0;
    for await (const value of inputValues(args, io)) {
      seen++;
      try {
        const epochMs = readInstant(value);
        const off = offsetSecondsFromEpochMs(zone, epochMs);
        writer.write({
          input: value,
          zone: zone.id,
          utc: formatInstant(epochMs),
          epochMs,
          local: formatPlainDateTime(epochMs + off * 1000),
          offset: formatOffset(off),
          offsetSeconds: off,
          localDate: formatPlainDate(dayNumberFromEpochMs(zone, epochMs)),
        });
      } catch (e) {
        failed++;
        io.stderr(`kalends zone-at: ${JSON.stringify(value)}: ${errorMessage(e)}\n`);
      }
    }
    if (seen === 0) throw new UsageError('no instants: give them as arguments, or one per line on standard input');
    if (seen > failed) writer.end();
    return failed > 0 ? 1 : 0;
  },
};

const DISAMBIGUATIONS: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];

const zoneResolve: Command = {
  name: 'zone-resolve',
  summary: 'Local date-times to instants in a zone, showing gaps and overlaps',
  valueOptions: ['zone', 'disambiguation'],
  help: `Usage: kalends zone-resolve <local date-time>... --zone <id> [--disambiguation <how>] [--json]

Converts local date-times ("2025-03-09T02:30") in a zone to instants. The status column says whether the
local time is unique, fell in a gap (the clocks skipped it) or in an overlap (it happened twice). With no
date-times, reads one per line from standard input.

Options
  --zone <id>               IANA zone id, "UTC", or a fixed offset. Required.
  --disambiguation <how>    compatible (default: earlier instant in an overlap, shifted forward in a gap),
                            earlier, later, or reject (a gap or overlap is an error; exit code 1).
  --json                    One JSON object per line.

Examples
  kalends zone-resolve 2025-03-09T02:30 2025-11-02T01:30 --zone America/New_York
  kalends zone-resolve 2025-11-02T01:30 --zone America/New_York --disambiguation later --json
`,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    rejectUnknownOptions(args, ['zone', 'disambiguation']);
    const zone = requireZone(args);
    const how = (optionString(args, 'disambiguation') ?? 'compatible') as Disambiguation;
    if (!DISAMBIGUATIONS.includes(how)) throw new UsageError(`--disambiguation: expected one of ${DISAMBIGUATIONS.join(', ')}, got ${JSON.stringify(how)}`);
    const writer = new RowWriter(io, optionFlag(args, 'json'), ['input', 'status', 'instant', 'offset', 'note']);
    let failed = 0;
    let seen = 0;
    for await (const value of inputValues(args, io)) {
      seen++;
      try {
        const wallMs = parsePlainDateTime(value);
        const r = resolveWallMs(zone, wallMs);
        let note = '';
        if (r.kind === 'gap') note = `skipped: ${formatPlainDateTime(r.startWallMs)} to ${formatPlainDateTime(r.endWallMs)} (${formatOffset(r.offsetBeforeSeconds)} -> ${formatOffset(r.offsetAfterSeconds)})`;
        if (r.kind === 'overlap') note = `twice: ${formatInstant(r.epochMsBeforeTransition)} and ${formatInstant(r.epochMsAfterTransition)}`;
        let epochMs: number | null = null;
        let error: string | null = null;
        try {
          epochMs = epochMsFromWallMs(zone, wallMs, how);
        } catch (e) {
          error = errorMessage(e);
        }
        const off = epochMs === null ? null : offsetSecondsFromEpochMs(zone, epochMs);
        writer.write({
          input: value,
          zone: zone.id,
          status: r.kind,
          instant: epochMs === null ? null : formatInstant(epochMs, { offsetSeconds: off! }),
          epochMs,
          offset: off === null ? null : formatOffset(off),
          note: error ?? note,
          ...(r.kind !== 'unique' ? { offsetBefore: formatOffset(r.offsetBeforeSeconds), offsetAfter: formatOffset(r.offsetAfterSeconds) } : {}),
          ...(r.kind === 'overlap' ? { epochMsBeforeTransition: r.epochMsBeforeTransition, epochMsAfterTransition: r.epochMsAfterTransition } : {}),
        });
        if (error !== null) failed++;
      } catch (e) {
        failed++;
        io.stderr(`kalends zone-resolve: ${JSON.stringify(value)}: ${errorMessage(e)}\n`);
      }
    }
    if (seen === 0) throw new UsageError('no local date-times: give them as arguments, or one per line on standard input');
    writer.end();
    return failed > 0 ? 1 : 0;
  },
};

/** A range bound: a year ("2025"), a local date ("2025-03-01", the day's first instant in the zone), or an instant. */
function readBound(zone: Zone, text: string): number {
  if (/^\d{4}$/.test(text)) return firstEpochMsOfDayNumber(zone, parsePlainDate(`${text}-01-01`));
  if (/^[+-]?\d{4,6}-\d{2}-\d{2}$/.test(text)) return firstEpochMsOfDayNumber(zone, parsePlainDate(text));
  return readInstant(text);
}

const zoneChanges: Command = {
  name: 'zone-changes',
  summary: "A zone's offset changes (transitions) in a range",
  valueOptions: ['from', 'to'],
  help: `Usage: kalends zone-changes <zone id>... --from <when> --to <when> [--json]

Lists the instants where each zone's UTC offset changes within [from, to), with the local clock just before
and after, and whether the change skips local times (gap) or repeats them (overlap). With no zone ids,
reads one per line from standard input.

Options
  --from <when>   A year ("2025"), a local date ("2025-03-01"), or an instant. Default: this year.
  --to <when>     The end (exclusive), same forms. Default: one year after --from.
  --json          One JSON object per line.

Examples
  kalends zone-changes Europe/Dublin America/Sao_Paulo --from 2018 --to 2020
  echo Australia/Lord_Howe | kalends zone-changes --from 2025 --to 2026 --json
`,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    rejectUnknownOptions(args, ['from', 'to']);
    const writer = new RowWriter(io, optionFlag(args, 'json'), ['zone', 'at', 'localBefore', 'localAfter', 'offsetBefore', 'offsetAfter', 'change', 'kind']);
    const thisYear = String(new Date().getUTCFullYear());
    let failed = 0;
    let seen = 0;
    for await (const id of inputValues(args, io)) {
      seen++;
      try {
        const zone = zoneFromId(id);
        const fromText = optionString(args, 'from') ?? thisYear;
        const start = readBound(zone, fromText);
        const toText = optionString(args, 'to');
        const end = toText !== undefined ? readBound(zone, toText) : readBound(zone, String(Number(/^\d{4}/.exec(fromText)?.[0] ?? thisYear) + 1));
        if (!(end > start)) throw new UsageError(`--to must be after --from, got ${formatInstant(start)} .. ${formatInstant(end)}`);
        for (const t of listTransitions(zone, start, end)) {
          const change = t.offsetAfterSeconds - t.offsetBeforeSeconds;
          writer.write({
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
      } catch (e) {
        if (e instanceof UsageError) throw e;
        failed++;
        io.stderr(`kalends zone-changes: ${JSON.stringify(id)}: ${errorMessage(e)}\n`);
      }
    }
    if (seen === 0) throw new UsageError('no zones: give zone ids as arguments, or one per line on standard input');
    if (seen > failed) writer.end();
    return failed > 0 ? 1 : 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [zoneAt, zoneResolve, zoneChanges];

/**
 * The `kalends` command-line tool: a thin face over the public API. Each layer adds its commands in
 * `src/cli/commands/<layer>.ts`.
 *
 * @module
 */
import { pathToFileURL } from 'node:url';
import { realpathSync } from 'node:fs';
import {
  type CliIo,
  type Command,
  EXIT_CODES_TEXT,
  EXIT_DONE,
  EXIT_REFUSED,
  EXIT_USAGE,
  MAX_LINE_LENGTH,
  OutputClosed,
  UsageError,
  VERSION,
  helpOf,
  PROFILE_OPTION,
  parseArgs,
  quote,
  shellMessage,
  suggestion,
} from './kit.js';
import { commands as civilCommands } from './commands/civil.js';
import { commands as zoneCommands } from './commands/zone.js';
import { commands as periodCommands } from './commands/period.js';
import { commands as businessCommands } from './commands/business.js';
import { commands as recurrenceCommands } from './commands/recurrence.js';
import { commands as seriesCommands } from './commands/series.js';
import { commands as hoursCommands } from './commands/hours.js';
import { commands as warehouseCommands } from './commands/warehouse.js';
import { applyProfileOption } from './profile.js';

/** Every command, in the order help lists them. */
export const allCommands: readonly Command[] = [
  ...civilCommands,
  ...zoneCommands,
  ...periodCommands,
  ...businessCommands,
  ...recurrenceCommands,
  ...seriesCommands,
  ...hoursCommands,
  ...warehouseCommands,
];

/** The overview `kalends help` prints: commands, the forms every command shares, and the exit codes. */
export function overview(): string {
  const width = Math.max(...allCommands.map((c) => c.name.length), 4);
  const lines = allCommands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    `kalends ${VERSION}: calendar-aware time indexing from the command line.`,
    '',
    'Usage: kalends <command> [arguments] [options]',
    '       kalends help [<command>]    kalends <command> --help    kalends --version',
    '',
    'Commands',
    ...lines,
    `  ${'help'.padEnd(width)}  Show this overview, or a command's help: kalends help <command>`,
    '',
    'Forms every command shares',
    '  Values      With no value arguments, a command reads one value per line from standard input, as a',
    `              stream: blank lines are skipped; a line longer than ${MAX_LINE_LENGTH} characters is refused.`,
    '  Output      A table, or with --json one JSON object per line (JSON Lines).',
    '  Definitions A unit (--unit), calendar (--calendar) or rule is given as a name, as JSON text',
    '              (starting with "{"), as the path of a file holding the JSON, or as "-" for standard input.',
    '  Periods     Columns name a period the same way everywhere: period (its label), first and last (its',
    '              first and last days, both included), start and end (instants: [start, end), end is',
    "              the first instant of the next period), days (its length).",
    '  Profiles    --profile <file> (every command) reads a calendar profile: its zone, units, calendars',
    '              and rules by name (docs/profiles.md).',
    '  Options     --name value or --name=value; flags take no value; each option may be given once.',
    '',
    EXIT_CODES_TEXT,
    '',
  ].join('\n');
}

/** Runs the CLI with `argv` (without node and script) and returns the exit code. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  const names = allCommands.map((c) => c.name);
  const unknown = (n: string) => {
    io.stderr(`kalends: no command named ${quote(n)}${suggestion(n, [...names, 'help'])}; run kalends help for the list\n`);
    return EXIT_USAGE;
  };
  try {
    if (name === '--version') {
      if (rest.length > 0) throw new UsageError('--version takes no arguments');
      io.stdout(`kalends ${VERSION}\n`);
      return EXIT_DONE;
    }
    if (name === undefined || name === 'help' || name === '--help' || name === '-h') {
      const topic = rest[0];
      if (rest.length > 1) throw new UsageError('help takes at most one command name');
      const command = topic === undefined ? undefined : allCommands.find((c) => c.name === topic);
      if (topic !== undefined && !command) return unknown(topic);
      io.stdout(command ? helpOf(command) : overview());
      return EXIT_DONE;
    }
    const command = allCommands.find((c) => c.name === name);
    if (!command) return unknown(name);
    try {
      const args = await applyProfileOption(parseArgs(rest, [...command.options, PROFILE_OPTION]), command, io);
      if (args.options.has('help')) {
        io.stdout(helpOf(command));
        return EXIT_DONE;
      }
      return await command.run(args, io);
    } catch (e) {
      if (e instanceof OutputClosed) return EXIT_DONE;
      io.stderr(`kalends ${command.name}: ${shellMessage(e)}\n`);
      return e instanceof UsageError ? EXIT_USAGE : EXIT_REFUSED;
    }
  } catch (e) {
    if (e instanceof OutputClosed) return EXIT_DONE;
    io.stderr(`kalends: ${shellMessage(e)}\n`);
    return e instanceof UsageError ? EXIT_USAGE : EXIT_REFUSED;
  }
}

/** The process's own streams as a CliIo: a closed stdout (EPIPE) becomes {@link OutputClosed}, never a trace. */
function processIo(): CliIo {
  const stdout = process.stdout;
  let closed = false;
  stdout.on('error', (e: NodeJS.ErrnoException) => {
    closed = true;
    if (e.code !== 'EPIPE') {
      process.stderr.write(`kalends: cannot write the output: ${e.message}\n`);
      process.exitCode = EXIT_REFUSED;
    }
  });
  // Nothing is to be done when stderr itself is gone.
  process.stderr.on('error', () => {});
  const isClosed = () => closed || stdout.destroyed || (stdout as { errored?: unknown }).errored != null;
  return {
    stdin: process.stdin.isTTY ? undefined : process.stdin,
    stdout: (text) => {
      if (isClosed()) throw new OutputClosed();
      const ok = stdout.write(text);
      if (isClosed()) throw new OutputClosed();
      return ok;
    },
    stdoutDrained: () =>
      new Promise<void>((resolve, reject) => {
        if (isClosed()) {
          reject(new OutputClosed());
          return;
        }
        const done = (error: boolean) => () => {
          stdout.off('drain', onDrain);
          stdout.off('close', onClose);
          stdout.off('error', onClose);
          if (error) reject(new OutputClosed());
          else resolve();
        };
        const onDrain = done(false);
        const onClose = done(true);
        stdout.once('drain', onDrain);
        stdout.once('close', onClose);
        stdout.once('error', onClose);
      }),
    stderr: (text) => {
      process.stderr.write(text);
    },
    stderrIsTty: Boolean(process.stderr.isTTY),
  };
}

function isMain(): boolean {
  const entry = process.argv[1];
  if (!entry) return false;
  try {
    return import.meta.url === pathToFileURL(realpathSync(entry)).href;
  } catch {
    return false;
  }
}

if (isMain()) {
  // A last guard: whatever escapes is reported in one line, never as a stack trace.
  const last = (e: unknown) => {
    if (e instanceof OutputClosed || (e as NodeJS.ErrnoException | undefined)?.code === 'EPIPE') process.exit(process.exitCode ?? EXIT_DONE);
    process.stderr.write(`kalends: ${shellMessage(e)}\n`);
    process.exit(EXIT_REFUSED);
  };
  process.on('uncaughtException', last);
  process.on('unhandledRejection', last);
  runCli(process.argv.slice(2), processIo()).then((code) => {
    process.exitCode = code;
  }, last);
}

/**
 * The `kalends` command-line tool: a thin face over the public API. Each layer adds its commands in
 * `src/cli/commands/<layer>.ts`.
 *
 * @module
 */
import { pathToFileURL } from 'node:url';
import { realpathSync } from 'node:fs';
import { type CliIo, type Command, UsageError, errorMessage, parseArgs } from './kit.js';
import { commands as civilCommands } from './commands/civil.js';
import { commands as zoneCommands } from './commands/zone.js';
import { commands as periodCommands } from './commands/period.js';
import { commands as businessCommands } from './commands/business.js';
import { commands as recurrenceCommands } from './commands/recurrence.js';
import { commands as seriesCommands } from './commands/series.js';
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
  ...warehouseCommands,
];

function overview(): string {
  const width = Math.max(...allCommands.map((c) => c.name.length), 4);
  const lines = allCommands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    'kalends: calendar-aware time indexing from the command line.',
    '',
    'Usage: kalends <command> [arguments] [--json]',
    '',
    'Commands:',
    ...lines,
    `  ${'help'.padEnd(width)}  Show this overview, or a command's help: kalends help <command>`,
    '',
    'With no value arguments, a command reads one value per line from standard input.',
    '--json writes one JSON object per line (JSON Lines) instead of a table.',
    '--profile <file> (every command) reads a calendar profile: its zone, units, calendars and rules by name.',
    '',
  ].join('\n');
}

/** Runs the CLI with `argv` (without node and script) and returns the exit code. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === 'help' || name === '--help' || name === '-h') {
    const topic = rest[0];
    const command = topic === undefined ? undefined : allCommands.find((c) => c.name === topic);
    if (topic !== undefined && !command) {
      io.stderr(`kalends: no command named ${JSON.stringify(topic)}\n\n${overview()}`);
      return 2;
    }
    io.stdout(command ? `${command.help.trimEnd()}\n` : overview());
    return 0;
  }
  const command = allCommands.find((c) => c.name === name);
  if (!command) {
    io.stderr(`kalends: no command named ${JSON.stringify(name)}\n\n${overview()}`);
    return 2;
  }
  try {
    const args = applyProfileOption(parseArgs(rest, [...(command.valueOptions ?? []), 'profile']), command);
    if (args.options.has('help')) {
      io.stdout(`${command.help.trimEnd()}\n`);
      return 0;
    }
    return await command.run(args, io);
  } catch (e) {
    io.stderr(`kalends ${command.name}: ${errorMessage(e)}\n`);
    return e instanceof UsageError ? 2 : 1;
  }
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
  const io: CliIo = {
    stdin: process.stdin.isTTY ? undefined : process.stdin,
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    stderrIsTty: Boolean(process.stderr.isTTY),
  };
  runCli(process.argv.slice(2), io).then(
    (code) => {
      process.exitCode = code;
    },
    (e: unknown) => {
      process.stderr.write(`kalends: ${errorMessage(e)}\n`);
      process.exitCode = 1;
    },
  );
}

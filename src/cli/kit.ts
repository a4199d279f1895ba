/**
 * The small toolkit every CLI command uses: option parsing (with "did you mean"), definitions given as a name,
 * JSON text or a file, values read from arguments or streamed from stdin line by line, output written in chunks
 * with backpressure (a readable table or JSON Lines), the one help layout, the exit codes and shell-worded
 * messages. Commands import the library only through `../../index.js` and this kit.
 *
 * The kit imports one internal helper, the "did you mean" of `src/diagnostics/suggest.ts`, so that the CLI and
 * the library suggest names the same way and with the same bounded work (tsup bundles it into `dist/cli.js`).
 *
 * @module
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import * as api from '../index.js';
import { didYouMean } from '../diagnostics/suggest.js';
import { version } from '../../package.json';

/** The package version, read from package.json when the CLI is bundled. */
export const VERSION: string = version;

// ---------------------------------------------------------------------------------------------------------------
// Exit codes and limits: declared once here, listed by `kalends help` and docs/design.md's CLI notes.

/** Every value was handled (also when the reader of the output closed the pipe early). */
export const EXIT_DONE = 0;
/** Some input was refused (each named on stderr), or a definition, unit, calendar or rule was invalid. */
export const EXIT_REFUSED = 1;
/** A usage mistake: unknown command or option, a missing or malformed option, an option given twice. */
export const EXIT_USAGE = 2;

/** A value-per-line command stops after refusing this many values, and says how many it refused. */
export const MAX_REFUSED = 100;
/** The longest line read as one value (characters); a longer line is refused without being kept in memory. */
export const MAX_LINE_LENGTH = 4096;
/** The longest definition (unit, calendar, rule) read from a file or stdin, in characters. */
export const MAX_DEFINITION_LENGTH = 1_048_576;
/** A table sets its column widths from this many rows, then streams (a wider later cell widens what follows). */
export const TABLE_SAMPLE_ROWS = 1000;
/** Output is handed to stdout in chunks of about this many characters (and at the end of each input chunk). */
const OUTPUT_CHUNK = 65_536;

/** The exit-code table shown by `kalends help` (the one place that spells it out). */
export const EXIT_CODES_TEXT = `Exit codes (the same for every command)
  ${EXIT_DONE}  done; also when the reader of the output stops early (a closed pipe, as with "| head")
  ${EXIT_REFUSED}  refused: some input could not be read or computed (each is named on standard error, with
     its line number), or a definition, unit, calendar or rule was invalid. A command stops after
     ${MAX_REFUSED} refused values and says how many it refused.
  ${EXIT_USAGE}  usage: an unknown command or option, a missing or malformed option value, an option given
     twice, or a flag given a value`;

/** The last section of every command's help. */
const EXIT_CODES_LINE = `Exit codes
  ${EXIT_DONE} done, ${EXIT_REFUSED} some input refused or an invalid definition, ${EXIT_USAGE} usage error (see kalends help)`;

// ---------------------------------------------------------------------------------------------------------------
// Where a command reads and writes.

/** Where a command reads and writes. Tests pass their own. */
export interface CliIo {
  readonly stdin: AsyncIterable<string | Uint8Array> | undefined;
  /**
   * Writes text to standard output. Returns `false` when the writer should wait for {@link CliIo.stdoutDrained}
   * (backpressure). Throws {@link OutputClosed} when the reader has gone.
   */
  readonly stdout: (text: string) => boolean | void;
  readonly stderr: (text: string) => void;
  /** True when stderr is an interactive terminal (progress lines are shown only then). */
  readonly stderrIsTty: boolean;
  /** Resolves when stdout takes more after `stdout` returned false; rejects with {@link OutputClosed}. */
  readonly stdoutDrained?: () => Promise<void>;
}

/** A usage mistake: printed without a stack trace, exit code 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** A value the command cannot take (a bare number without --numbers, a malformed row): refused, exit code 1. */
export class InputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InputError';
  }
}

/** The reader of standard output has gone (a closed pipe): the command ends quietly with exit code 0. */
export class OutputClosed extends Error {
  constructor() {
    super('standard output was closed by its reader');
    this.name = 'OutputClosed';
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Options and help.

/** One option of a command: a value option when it has a `value` placeholder, else a flag. */
export interface OptionSpec {
  readonly name: string;
  /** Placeholder of the option's value, as in `<zone>`; absent for a flag (which takes no value). */
  readonly value?: string;
  /** Its line(s) in the help's options table. */
  readonly text: string;
}

/** `--json`, which every command takes. */
export const JSON_OPTION: OptionSpec = { name: 'json', text: 'one JSON object per line (JSON Lines) instead of a table' };
/** `--profile`, which every command takes (src/cli/profile.ts fills in the profile's zone, units, calendars and rules). */
export const PROFILE_OPTION: OptionSpec = { name: 'profile', value: '<file>', text: 'a calendar profile (JSON): its zone, units, calendars and rules by name' };
const HELP_OPTION: OptionSpec = { name: 'help', text: 'show this help' };

/** One CLI command. Its help page is built by {@link helpOf}, in the same shape for every command. */
export interface Command {
  readonly name: string;
  readonly summary: string;
  /** The usage lines, each after `kalends <name> `. */
  readonly usage: readonly string[];
  /** What the command does: paragraphs, may hold indented lists. */
  readonly description: string;
  /** The command's options, `--json` included; `--help` is added. */
  readonly options: readonly OptionSpec[];
  /** Example command lines. */
  readonly examples: readonly string[];
  run(args: ParsedArgs, io: CliIo): Promise<number>;
}

/** The help page of a command: usage, description, options table, examples, exit codes. */
export function helpOf(command: Command): string {
  // Every command takes --profile (main.ts reads it before the command runs); its help says so.
  const profile = command.options.some((o) => o.name === PROFILE_OPTION.name) ? [] : [PROFILE_OPTION];
  const options = [...command.options, ...profile, HELP_OPTION];
  const heads = options.map((o) => `--${o.name}${o.value ? ` ${o.value}` : ''}`);
  const width = Math.max(...heads.map((h) => h.length)) + 2;
  const table = options.map((o, i) => `  ${heads[i]!.padEnd(width)}${wrap(o.text, HELP_WIDTH - 2 - width).join(`\n  ${' '.repeat(width)}`)}`);
  const usage = command.usage.map((u, i) => `${i === 0 ? 'Usage: ' : '       '}kalends ${command.name} ${u}`);
  return [
    ...usage,
    '',
    command.description.trimEnd(),
    '',
    'Options',
    ...table,
    '',
    'Examples',
    ...command.examples.map((e) => `  ${e}`),
    '',
    EXIT_CODES_LINE,
    '',
  ].join('\n');
}

/** Help text is wrapped to this many columns. */
const HELP_WIDTH = 110;

/** Wraps each line of `text` at word boundaries to at most `width` characters (a longer word stays whole). */
function wrap(text: string, width: number): string[] {
  const out: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const word of paragraph.split(' ')) {
      if (line !== '' && line.length + 1 + word.length > width) {
        out.push(line);
        line = word;
      } else line = line === '' ? word : `${line} ${word}`;
    }
    out.push(line);
  }
  return out;
}

/** Parsed command line: positional arguments and `--name value` / `--flag` options. */
export interface ParsedArgs {
  readonly positionals: readonly string[];
  readonly options: ReadonlyMap<string, string | true>;
}

/**
 * Parses `argv` (without the command name) against the command's options. `--name value` and `--name=value` both
 * work for value options; flags take no value; `--` ends options. An unknown option (with a suggestion), a flag
 * given a value, a missing value and an option given twice are usage errors.
 */
export function parseArgs(argv: readonly string[], specs: readonly OptionSpec[]): ParsedArgs {
  const all = [...specs, HELP_OPTION];
  const positionals: string[] = [];
  const options = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--') {
      for (let j = i + 1; j < argv.length; j++) positionals.push(argv[j]!);
      break;
    }
    if (!a.startsWith('--') || a.length === 2) {
      positionals.push(a);
      continue;
    }
    const eq = a.indexOf('=');
    const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
    const spec = all.find((s) => s.name === name);
    if (spec === undefined) {
      const names = all.map((s) => `--${s.name}`);
      throw new UsageError(`unknown option ${quote(`--${name}`)}${didYouMean(`--${name}`, names)}; valid options are ${names.join(', ')}`);
    }
    let value: string | true = true;
    if (spec.value === undefined) {
      if (eq >= 0) throw new UsageError(`--${name} is a flag and takes no value; got ${quote(a)} (give --${name} alone)`);
    } else if (eq >= 0) value = a.slice(eq + 1);
    else {
      const next = argv[i + 1];
      if (next === undefined) throw new UsageError(`--${name} needs a value: --${name} ${spec.value}`);
      value = next;
      i++;
    }
    const before = options.get(name);
    if (before !== undefined) {
      const both = before === true ? '' : ` (${quote(before)} and ${quote(value as string)})`;
      throw new UsageError(`--${name} is given twice${both}; each option may be given once`);
    }
    options.set(name, value);
  }
  return { positionals, options };
}

/** The string value of option `name`, or `fallback`. */
export function optionString(args: ParsedArgs, name: string, fallback?: string): string | undefined {
  const v = args.options.get(name);
  if (v === undefined) return fallback;
  if (v === true) throw new UsageError(`--${name} needs a value`);
  return v;
}

/** Whether flag `name` was given. */
export function optionFlag(args: ParsedArgs, name: string): boolean {
  return args.options.get(name) !== undefined;
}

/** The value of an option that takes one of `values`; anything else is a usage error with a suggestion. */
export function optionChoice<T extends string>(args: ParsedArgs, name: string, values: readonly T[], fallback?: T): T | undefined {
  const v = optionString(args, name);
  if (v === undefined) return fallback;
  if (!(values as readonly string[]).includes(v)) {
    throw new UsageError(`--${name}: expected one of ${values.join(', ')}, got ${quote(v)}${didYouMean(v, values)}`);
  }
  return v as T;
}

/** The value of an integer option within [min, max], or `fallback`. */
export function optionInteger(args: ParsedArgs, name: string, min: number, max: number, fallback?: number): number | undefined {
  const v = optionString(args, name);
  if (v === undefined) return fallback;
  const n = Number(v);
  if (!/^[+-]?\d+$/.test(v.trim()) || !Number.isSafeInteger(n) || n < min || n > max) {
    throw new UsageError(`--${name}: expected a whole number from ${min} to ${max}, got ${quote(v)}`);
  }
  return n;
}

/** Suggestion suffix (`; did you mean "x"?`) for a name given on the command line. */
export function suggestion(received: string, valid: readonly string[]): string {
  return didYouMean(received, valid);
}

// ---------------------------------------------------------------------------------------------------------------
// Definitions (units, calendars, rules): a name, JSON text, or a file; "-" reads standard input.

/** Where a definition's text came from: a name from the known list, or text (JSON or another grammar). */
export type DefinitionSource = { readonly name: string } | { readonly text: string; readonly origin: string };

/** What a definition option takes besides JSON text, "-" and files. */
export interface DefinitionForms {
  /** Names that stand for a definition (bundled calendars, calendar units). */
  readonly names?: readonly string[];
  /** Another text grammar the option takes as is (a rule's RFC 5545 text), and its name for messages. */
  readonly text?: { readonly test: (text: string) => boolean; readonly name: string };
}

/**
 * Reads a definition option the one way every command does: one of `forms.names`, JSON text (starting with `{`),
 * `-` for standard input, or the path of a file holding the definition. `what` names the option in messages
 * (`--unit`).
 */
export async function readDefinitionSource(given: string, what: string, io: CliIo, forms: DefinitionForms = {}): Promise<DefinitionSource> {
  const names = forms.names ?? [];
  if (names.includes(given)) return { name: given };
  if (given.trimStart().startsWith('{') || forms.text?.test(given)) return { text: given, origin: 'the text given' };
  if (given === '-') return { text: await readAllStdin(io, what), origin: 'standard input' };
  if (existsSync(given)) {
    let text: string;
    try {
      if (statSync(given).size > MAX_DEFINITION_LENGTH) throw new Error(`larger than ${MAX_DEFINITION_LENGTH} bytes`);
      text = readFileSync(given, 'utf8');
    } catch (e) {
      throw new UsageError(`${what}: cannot read the file ${quote(given)}: ${e instanceof Error ? e.message : String(e)}`);
    }
    return { text, origin: `the file ${quote(given)}` };
  }
  const kinds = [names.length > 0 ? `a name (${names.join(', ')})` : '', 'JSON text starting with "{"', forms.text?.name ?? ''].filter((k) => k !== '');
  throw new UsageError(`${what}: ${quote(given)} is not ${kinds.join(', ')}, "-" for standard input, or an existing file${didYouMean(given, names)}`);
}

/** Parses a definition's JSON text; a syntax error is a usage error naming where the text came from. */
export function parseDefinitionJson(source: { readonly text: string; readonly origin: string }, what: string): unknown {
  try {
    return JSON.parse(source.text) as unknown;
  } catch (e) {
    throw new UsageError(`${what}: ${source.origin} is not valid JSON (${e instanceof Error ? e.message : String(e)})`);
  }
}

/** A definition given as a name or as JSON: the name, or the parsed JSON. */
export async function readDefinition(given: string, what: string, io: CliIo, names: readonly string[]): Promise<unknown> {
  const source = await readDefinitionSource(given, what, io, { names });
  return 'name' in source ? source.name : parseDefinitionJson(source, what);
}

/** All of standard input as text, at most {@link MAX_DEFINITION_LENGTH} characters. */
async function readAllStdin(io: CliIo, what: string): Promise<string> {
  if (!io.stdin) throw new UsageError(`${what} is "-" but standard input is a terminal; pipe the definition in or give a file`);
  const decoder = new TextDecoder();
  let text = '';
  for await (const chunk of io.stdin) {
    text += typeof chunk === 'string' ? chunk : decoder.decode(chunk, { stream: true });
    if (text.length > MAX_DEFINITION_LENGTH) throw new UsageError(`${what}: standard input holds more than ${MAX_DEFINITION_LENGTH} characters; a definition is smaller`);
  }
  return text + decoder.decode();
}

// ---------------------------------------------------------------------------------------------------------------
// Input: values from arguments, or lines of stdin streamed in batches.

/** One line of input: its text (trimmed), its 1-based line number and its full length in characters. */
export interface InputLine {
  /** The trimmed text; for a line longer than `maxLength`, only its first characters. */
  readonly text: string;
  readonly line: number;
  /** The line's length; more than `maxLength` means the line was too long and its text is cut. */
  readonly length: number;
}

/**
 * Streams the lines of `input` in batches (one batch per chunk read), without line ends, skipping blank lines but
 * counting them in line numbers. Memory stays bounded: a line longer than `maxLength` characters is not kept
 * (its first characters and its length are reported instead). Bytes that are not UTF-8 become U+FFFD.
 */
export async function* readLineBatches(input: AsyncIterable<string | Uint8Array> | undefined, maxLength = MAX_LINE_LENGTH): AsyncGenerator<InputLine[]> {
  if (!input) return;
  const decoder = new TextDecoder();
  let partial = '';
  let partialLength = 0;
  let line = 0;
  const complete = (batch: InputLine[]) => {
    line++;
    let length = partialLength;
    let text = partial;
    if (length <= maxLength + 1 && text.endsWith('\r')) {
      text = text.slice(0, -1);
      length--;
    }
    partial = '';
    partialLength = 0;
    if (length > maxLength) batch.push({ text: text.slice(0, 40), line, length });
    else {
      text = text.trim();
      if (text !== '') batch.push({ text, line, length });
    }
  };
  const take = (s: string, batch: InputLine[]) => {
    let from = 0;
    for (;;) {
      const nl = s.indexOf('\n', from);
      const end = nl < 0 ? s.length : nl;
      if (partialLength <= maxLength + 1) partial += s.slice(from, Math.min(end, from + maxLength + 2 - partialLength));
      partialLength += end - from;
      if (nl < 0) return;
      complete(batch);
      from = nl + 1;
    }
  };
  for await (const chunk of input) {
    const batch: InputLine[] = [];
    take(typeof chunk === 'string' ? chunk : decoder.decode(chunk, { stream: true }), batch);
    if (batch.length > 0) yield batch;
  }
  const batch: InputLine[] = [];
  take(decoder.decode(), batch);
  if (partialLength > 0) complete(batch);
  if (batch.length > 0) yield batch;
}

/** Yields the input lines of stdin as text (blank lines skipped); see {@link readLineBatches}. */
export async function* readLines(input: AsyncIterable<string | Uint8Array> | undefined): AsyncGenerator<string> {
  for await (const batch of readLineBatches(input)) for (const l of batch) yield l.text;
}

/** How a value-per-line command names its values in messages. */
export interface ValueLoop {
  /** The command's name, as messages start `kalends <name>: `. */
  readonly command: string;
  /** The values in the plural, for messages: "dates", "instants", "zone ids". */
  readonly noun: string;
  /** Positional arguments before the values (not values themselves). */
  readonly skip?: number;
  /**
   * Handles one value: writes its rows, or throws to refuse it (the message goes to stderr). Returning `false`
   * refuses it without a message (the command showed why in its output).
   */
  handle(value: string): void | boolean | Promise<void | boolean>;
}

/**
 * Runs a value-per-line command: each positional argument, or each line of stdin, goes through `loop.handle`.
 * Refused values are named on stderr (with their line number); after {@link MAX_REFUSED} refusals the command
 * stops. Returns the exit code. Output is flushed after each chunk of input, with backpressure.
 */
export async function forEachValue(args: ParsedArgs, io: CliIo, out: Output, loop: ValueLoop): Promise<number> {
  let seen = 0;
  let refused = 0;
  const prefix = `kalends ${loop.command}: `;
  /** Handles one value; returns false when the command must stop. */
  const one = async (text: string, line: number | undefined, length: number): Promise<boolean> => {
    seen++;
    const where = line === undefined ? '' : `line ${line}: `;
    let ok = true;
    if (length > MAX_LINE_LENGTH) {
      ok = false;
      out.error(`${prefix}${where}${quote(text)}... is ${length} characters long, more than the ${MAX_LINE_LENGTH} a value may have\n`);
    } else {
      try {
        const r = loop.handle(text);
        ok = (r instanceof Promise ? await r : r) !== false;
      } catch (e) {
        if (e instanceof UsageError || e instanceof OutputClosed) throw e;
        ok = false;
        const message = shellMessage(e);
        // Library messages quote the value they refuse; the value is then not quoted twice.
        out.error(`${prefix}${where}${message.includes(quote(text)) ? '' : `${quote(text)}: `}${message}\n`);
      }
    }
    if (ok) return true;
    refused++;
    if (refused < MAX_REFUSED) return true;
    out.error(`${prefix}stopped after ${MAX_REFUSED} refused ${loop.noun}${line === undefined ? '' : ` (at line ${line})`}; ${seen - refused} done before that; the rest of the input was not read\n`);
    return false;
  };
  const given = args.positionals.slice(loop.skip ?? 0);
  if (given.length > 0) {
    for (const value of given) if (!(await one(value, undefined, value.length))) return EXIT_REFUSED;
  } else {
    for await (const batch of readLineBatches(io.stdin)) {
      for (const l of batch) if (!(await one(l.text, l.line, l.length))) return EXIT_REFUSED;
      await out.flush();
    }
  }
  if (seen === 0) throw new UsageError(`no ${loop.noun}: give them as arguments, or one per line on standard input`);
  if (refused > 0) out.error(`${prefix}${refused} of ${seen} ${loop.noun} refused\n`);
  return refused > 0 ? EXIT_REFUSED : EXIT_DONE;
}

/** A value-per-line command that writes rows: its columns, and what it writes for one value. */
export interface RowsPerValue extends Omit<ValueLoop, 'handle'> {
  /** The table's columns (JSON Lines carry every field of a row). */
  readonly columns: readonly string[];
  /** Writes the rows of one value, or throws to refuse it; see {@link ValueLoop.handle}. */
  handle(value: string, writer: RowWriter): void | boolean | Promise<void | boolean>;
}

/** Runs a value-per-line command that writes rows (a table, or JSON Lines with --json); returns the exit code. */
export async function writeRowsPerValue(args: ParsedArgs, io: CliIo, loop: RowsPerValue): Promise<number> {
  const out = new Output(io);
  const writer = new RowWriter(out, optionFlag(args, 'json'), loop.columns);
  const code = await forEachValue(args, io, out, { ...loop, handle: (value) => loop.handle(value, writer) });
  await writer.end();
  return code;
}

// ---------------------------------------------------------------------------------------------------------------
// Output.

/**
 * Standard output in chunks, with backpressure: `write` queues text and hands it on in chunks of about 64 KB;
 * when stdout asks the writer to wait, the returned promise resolves once it has drained. `error` writes to
 * stderr after flushing stdout, so that the two keep their order on a terminal.
 */
export class Output {
  private pending = '';
  constructor(private readonly io: CliIo) {}

  write(text: string): Promise<void> | undefined {
    this.pending += text;
    return this.pending.length >= OUTPUT_CHUNK ? this.flush() : undefined;
  }

  /** Hands what is queued to stdout; resolves when stdout can take more. */
  flush(): Promise<void> | undefined {
    if (this.pending === '') return undefined;
    const text = this.pending;
    this.pending = '';
    const ok = this.io.stdout(text);
    return ok === false && this.io.stdoutDrained ? this.io.stdoutDrained() : undefined;
  }

  error(text: string): void {
    void this.flush();
    this.io.stderr(text);
  }
}

/** A row of output: column name to value. */
export type Row = Readonly<Record<string, string | number | boolean | null>>;

/**
 * Writes rows as JSON Lines (every field, one object a line) or as a table of `columns` under a header line. The
 * table takes its column widths from its first {@link TABLE_SAMPLE_ROWS} rows and then streams; memory stays
 * bounded.
 */
export class RowWriter {
  private sample: string[][] | undefined = [];
  private readonly widths: number[];
  constructor(
    private readonly out: Output,
    private readonly json: boolean,
    private readonly columns: readonly string[],
  ) {
    this.widths = columns.map((c) => c.length);
  }

  write(row: Row): Promise<void> | undefined {
    if (this.json) return this.out.write(`${JSON.stringify(row)}\n`);
    const cells = this.columns.map((c) => formatCell(row[c]));
    if (this.sample !== undefined) {
      this.sample.push(cells);
      return this.sample.length >= TABLE_SAMPLE_ROWS ? this.release() : undefined;
    }
    return this.line(cells);
  }

  /** Writes what is held and flushes. A table with no rows writes nothing, not even its header. */
  end(): Promise<void> | undefined {
    if (!this.json && this.sample !== undefined && this.sample.length > 0) void this.release();
    return this.out.flush();
  }

  private release(): Promise<void> | undefined {
    const sample = this.sample!;
    this.sample = undefined;
    for (const cells of sample) for (let i = 0; i < cells.length; i++) if (cells[i]!.length > this.widths[i]!) this.widths[i] = cells[i]!.length;
    let wait = this.line(this.columns);
    for (const cells of sample) wait = this.line(cells) ?? wait;
    return wait;
  }

  private line(cells: readonly string[]): Promise<void> | undefined {
    let text = '';
    for (let i = 0; i < cells.length; i++) {
      const c = cells[i]!;
      if (c.length > this.widths[i]!) this.widths[i] = c.length;
      text += i === cells.length - 1 ? c : `${c.padEnd(this.widths[i]!)}  `;
    }
    return this.out.write(`${text.trimEnd()}\n`);
  }
}

function formatCell(v: string | number | boolean | null | undefined): string {
  if (v === null || v === undefined) return '-';
  return String(v);
}

// ---------------------------------------------------------------------------------------------------------------
// Messages in shell words.

/** Quotes text for a message, cutting it after 60 characters. */
export function quote(text: string): string {
  return JSON.stringify(text.length > 60 ? `${text.slice(0, 57)}...` : text);
}

const FUNCTION_NAMES = new Set(Object.keys(api).filter((k) => typeof (api as Record<string, unknown>)[k] === 'function'));
/** Parameter names that lead library messages and mean nothing in a shell: dropped where they lead. */
const LEADING_PARAMETERS = new Set(['id', 'text', 'value', 'input', 'wallMs', 'epochMs', 'dayNumber', 'startEpochMs', 'endEpochMs']);
/** Parameter names of the library that mean nothing in a shell, and the words a shell user knows. */
const SHELL_WORDS: Readonly<Record<string, string>> = {
  wallMs: 'local date-time',
  epochMs: 'instant',
  dayNumber: 'date',
  startEpochMs: 'start',
  endEpochMs: 'end',
};
const LONGEST_MESSAGE = 1000;

function isKalendsError(e: unknown): e is Error {
  return e instanceof api.KalendsRangeError || e instanceof api.KalendsTypeError || e instanceof api.KalendsSyntaxError || e instanceof api.DefinitionError;
}

/**
 * The message of an error in shell words: no class name, no stack, no library parameter names (`wallMs`) or
 * day numbers; a library function's name that leads a message is dropped. `words` maps a command's own library
 * words to its options (`options.start` to `--start`). An error that is neither a usage error nor a kalends
 * error is a defect, and says so.
 */
export function shellMessage(e: unknown, words: Readonly<Record<string, string>> = {}): string {
  let text: string;
  if (e instanceof UsageError || e instanceof InputError) text = e.message;
  else if (isKalendsError(e)) {
    text = e.message;
    const lead = /^([A-Za-z]+): /.exec(text);
    if (lead && (FUNCTION_NAMES.has(lead[1]!) || LEADING_PARAMETERS.has(lead[1]!))) text = text.slice(lead[0].length);
    text = text.replace(/\s*\(day number -?\d+\)/g, '');
    text = text.replace(/\bgot -?\d+ \(([+-]?\d{4,6}-\d{2}-\d{2})\)/g, 'got $1');
    text = text.replace(/\b(wallMs|epochMs|dayNumber|startEpochMs|endEpochMs)\b/g, (w) => SHELL_WORDS[w]!);
    for (const [word, shell] of Object.entries(words)) text = text.split(word).join(shell);
  } else if (e instanceof Error) text = `internal error (${e.name}: ${e.message}); this is a defect in kalends, please report it with the command line`;
  else text = `internal error (${String(e)}); this is a defect in kalends, please report it with the command line`;
  return text.length > LONGEST_MESSAGE ? `${text.slice(0, LONGEST_MESSAGE - 3)}...` : text;
}

// ---------------------------------------------------------------------------------------------------------------
// Small shared readings.

/** The weekday of a day number as a capitalized English name ("Monday"), from the library's weekday names. */
export function weekdayTitle(dayNumber: number): string {
  const name = api.WEEKDAY_NAMES[api.weekdayOfDayNumber(dayNumber) - 1]!;
  return name.charAt(0).toUpperCase() + name.slice(1);
}

/** The calendar units every `--unit` option takes by name. */
export const CALENDAR_UNIT_NAMES: readonly string[] = ['day', 'iso-week', 'month', 'quarter', 'half-year', 'year'];

/** The zone of option `name` (an IANA id, "UTC" or a fixed offset); an unknown id is a usage error. */
export function optionZone(args: ParsedArgs, name: string, fallback?: string): api.Zone | undefined {
  const text = optionString(args, name, fallback);
  if (text === undefined) return undefined;
  try {
    return api.toZone(text, `--${name}`);
  } catch (e) {
    throw new UsageError(shellMessage(e));
  }
}

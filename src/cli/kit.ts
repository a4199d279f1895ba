/**
 * The small toolkit every CLI command uses: option parsing, reading values from arguments or stdin, and
 * writing either a readable table or JSON Lines. Commands import the library only through `../index.js`.
 *
 * @module
 */

/** Where a command reads and writes. Tests pass their own. */
export interface CliIo {
  readonly stdin: AsyncIterable<string | Uint8Array> | undefined;
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** True when stderr is an interactive terminal (progress bars are shown only then). */
  readonly stderrIsTty: boolean;
}

/** Parsed command line: positional arguments and `--name value` / `--flag` options. */
export interface ParsedArgs {
  readonly positionals: readonly string[];
  readonly options: ReadonlyMap<string, string | true>;
}

/** One CLI command. `help` is shown by `kalends help <name>` and `kalends <name> --help`. */
export interface Command {
  readonly name: string;
  readonly summary: string;
  readonly help: string;
  /** Option names that take a value (all others are flags). */
  readonly valueOptions?: readonly string[];
  run(args: ParsedArgs, io: CliIo): Promise<number>;
}

/** A usage mistake: printed without a stack trace, exit code 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** Parses `argv` (without the command name). `--name=value` and `--name value` both work; `--` ends options. */
export function parseArgs(argv: readonly string[], valueOptions: readonly string[] = []): ParsedArgs {
  const positionals: string[] = [];
  const options = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (a.startsWith('--') && a.length > 2) {
      const eq = a.indexOf('=');
      const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
      if (eq >= 0) options.set(name, a.slice(eq + 1));
      else if (valueOptions.includes(name)) {
        const v = argv[i + 1];
        if (v === undefined) throw new UsageError(`option --${name} needs a value`);
        options.set(name, v);
        i++;
      } else options.set(name, true);
    } else positionals.push(a);
  }
  return { positionals, options };
}

/** The string value of option `name`, or `fallback`. A flag given without a value is a usage error. */
export function optionString(args: ParsedArgs, name: string, fallback?: string): string | undefined {
  const v = args.options.get(name);
  if (v === undefined) return fallback;
  if (v === true) throw new UsageError(`option --${name} needs a value`);
  return v;
}

/** Whether flag `name` was given. */
export function optionFlag(args: ParsedArgs, name: string): boolean {
  return args.options.get(name) !== undefined;
}

/** Rejects options the command does not know, naming them and the ones it does. */
export function rejectUnknownOptions(args: ParsedArgs, known: readonly string[]): void {
  for (const name of args.options.keys()) {
    if (!known.includes(name) && name !== 'json' && name !== 'help' && name !== 'profile') {
      const valid = [...known, 'json', 'help', 'profile'].map((k) => `--${k}`).join(', ');
      throw new UsageError(`unknown option --${name}; valid options are ${valid}`);
    }
  }
}

/** Yields the input lines of stdin, without line ends, skipping blank lines. */
export async function* readLines(input: AsyncIterable<string | Uint8Array> | undefined): AsyncGenerator<string> {
  if (!input) return;
  const decoder = new TextDecoder();
  let buffer = '';
  for await (const chunk of input) {
    buffer += typeof chunk === 'string' ? chunk : decoder.decode(chunk, { stream: true });
    let nl: number;
    while ((nl = buffer.indexOf('\n')) >= 0) {
      const line = buffer.slice(0, nl).replace(/\r$/, '');
      buffer = buffer.slice(nl + 1);
      if (line.trim() !== '') yield line.trim();
    }
  }
  buffer += decoder.decode();
  if (buffer.trim() !== '') yield buffer.trim();
}

/** The values a command works on: its positional arguments, or, when there are none, the lines of stdin. */
export async function* inputValues(args: ParsedArgs, io: CliIo, skip = 0): AsyncGenerator<string> {
  const given = args.positionals.slice(skip);
  if (given.length > 0) {
    yield* given;
    return;
  }
  yield* readLines(io.stdin);
}

/** A row of output: column name to value. */
export type Row = Readonly<Record<string, string | number | boolean | null>>;

/**
 * Collects rows and writes them either as JSON Lines (one object a line, as each row arrives) or as an aligned
 * table once all rows are in.
 */
export class RowWriter {
  private readonly rows: Row[] = [];
  constructor(
    private readonly io: CliIo,
    private readonly json: boolean,
    private readonly columns: readonly string[],
  ) {}

  write(row: Row): void {
    if (this.json) this.io.stdout(`${JSON.stringify(row)}\n`);
    else this.rows.push(row);
  }

  end(): void {
    if (this.json) return;
    const cells = this.rows.map((r) => this.columns.map((c) => formatCell(r[c])));
    const widths = this.columns.map((c, i) => Math.max(c.length, ...cells.map((row) => row[i]!.length)));
    const line = (values: readonly string[]) => values.map((v, i) => v.padEnd(widths[i]!)).join('  ').trimEnd();
    this.io.stdout(`${line(this.columns)}\n`);
    for (const row of cells) this.io.stdout(`${line(row)}\n`);
  }
}

function formatCell(v: string | number | boolean | null | undefined): string {
  if (v === null || v === undefined) return '-';
  return String(v);
}

/** Message of an error for the terminal: kalends errors and usage errors without a stack. */
export function errorMessage(e: unknown): string {
  if (e instanceof Error) return `${e.name}: ${e.message}`;
  return String(e);
}

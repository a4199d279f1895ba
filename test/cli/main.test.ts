/**
 * The CLI frame, in-process: the overview, --version, help pages in one shape, option parsing, "did you mean",
 * streamed stdin lines, the streaming table writer, output backpressure, a closed stdout and shell-worded
 * messages. The expected version comes from package.json; suggestions from the diagnostics kit's rule (edit
 * distance within a third of the length), checked here on names one letter off.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { KalendsRangeError } from '../../src/index.js';
import {
  type CliIo,
  EXIT_DONE,
  EXIT_REFUSED,
  EXIT_USAGE,
  MAX_LINE_LENGTH,
  OutputClosed,
  Output,
  RowWriter,
  TABLE_SAMPLE_ROWS,
  UsageError,
  helpOf,
  parseArgs,
  readLineBatches,
  readLines,
  shellMessage,
} from '../../src/cli/kit.js';
import { allCommands, runCli } from '../../src/cli/main.js';
import { cli } from './helpers.js';

const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

function memoryIo(overrides: Partial<CliIo> = {}): CliIo & { text: () => string } {
  let out = '';
  return { stdin: undefined, stdout: (t: string) => { out += t; }, stderr: () => {}, stderrIsTty: false, text: () => out, ...overrides };
}

describe('kalends CLI frame', () => {
  it('prints an overview listing every command, the shared forms and the exit codes', async () => {
    for (const argv of [[], ['help'], ['--help']]) {
      const r = await cli(argv);
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/^kalends \S+: calendar-aware time indexing/);
      for (const c of allCommands) expect(r.out).toContain(`  ${c.name} `);
      for (const code of [EXIT_DONE, EXIT_REFUSED, EXIT_USAGE]) expect(r.out).toMatch(new RegExp(`^  ${code}  \\w`, 'm'));
    }
  });

  it('--version prints the version of package.json', async () => {
    const r = await cli(['--version']);
    expect(r).toEqual({ code: 0, out: `kalends ${pkg.version}\n`, err: '' });
  });

  it('an unknown command is a usage error with a suggestion', async () => {
    const r = await cli(['no-such-command']);
    expect(r.code).toBe(EXIT_USAGE);
    expect(r.err).toContain('no command named "no-such-command"');
    const near = await cli(['zone-chnges']);
    expect(near.err).toContain('did you mean "zone-changes"?');
    const help = await cli(['help', 'holidys']);
    expect(help.code).toBe(EXIT_USAGE);
    expect(help.err).toContain('did you mean "holidays"?');
  });

  it('every command has a name, a one-line summary and a help page in one shape', () => {
    const names = new Set<string>();
    for (const c of allCommands) {
      expect(c.name).toMatch(/^[a-z][a-z-]*$/);
      expect(names.has(c.name)).toBe(false);
      names.add(c.name);
      expect(c.summary.length).toBeGreaterThan(5);
      expect(c.summary).not.toContain('\n');
      const help = helpOf(c);
      expect(help.startsWith(`Usage: kalends ${c.name} `)).toBe(true);
      const sections = help.split('\n').filter((l) => /^[A-Z][a-z]+( codes)?$/.test(l));
      expect(sections, c.name).toEqual(['Options', 'Examples', 'Exit codes']);
      expect(c.options.some((o) => o.name === 'json'), c.name).toBe(true);
      // --profile is read for every command (main.ts), so every help page lists it once.
      expect(help.match(/^  --profile\b/gm)?.length, c.name).toBe(1);
      for (const o of [...c.options, { name: 'help' }]) expect(help, c.name).toMatch(new RegExp(`^  --${o.name}\\b`, 'm'));
      for (const e of c.examples) expect(e.startsWith(`kalends ${c.name} `) || e.includes(`| kalends ${c.name} `), e).toBe(true);
      expect(help.trimEnd().split('\n').at(-1)).toMatch(/^ {2}0 done, 1 .*, 2 usage error/);
    }
  });

  it('help <command> and <command> --help print the same page', async () => {
    for (const c of allCommands) {
      const a = await cli(['help', c.name]);
      const b = await cli([c.name, '--help']);
      expect(a.out).toBe(b.out);
      expect(a.out).toBe(helpOf(c));
    }
  });

  it('parses --name value, --name=value, flags and --', () => {
    const specs = [{ name: 'zone', value: '<zone>', text: '' }, { name: 'unit', value: '<unit>', text: '' }, { name: 'json', text: '' }];
    const p = parseArgs(['a', '--zone', 'UTC', '--unit=month', '--json', '--', '--not-an-option'], specs);
    expect(p.positionals).toEqual(['a', '--not-an-option']);
    expect(p.options.get('zone')).toBe('UTC');
    expect(p.options.get('unit')).toBe('month');
    expect(p.options.get('json')).toBe(true);
    expect(() => parseArgs(['--zone'], specs)).toThrow(UsageError);
  });

  it('refuses a flag given a value, a repeated option and an unknown option (with a suggestion)', async () => {
    const flag = await cli(['describe', '2025-01-01', '--json=5']);
    expect(flag.code).toBe(EXIT_USAGE);
    expect(flag.err).toContain('--json is a flag and takes no value');
    const twice = await cli(['zone-at', '0', '--zone', 'UTC', '--zone', 'Europe/Dublin']);
    expect(twice.code).toBe(EXIT_USAGE);
    expect(twice.err).toContain('--zone is given twice ("UTC" and "Europe/Dublin")');
    const twiceFlag = await cli(['describe', '2025-01-01', '--json', '--json']);
    expect(twiceFlag.code).toBe(EXIT_USAGE);
    const unknown = await cli(['describe', '2025-01-01', '--jsn']);
    expect(unknown.code).toBe(EXIT_USAGE);
    expect(unknown.err).toContain('unknown option "--jsn"; did you mean "--json"?');
  });

  it('reads stdin lines across chunk boundaries, trimming CR and skipping blanks', async () => {
    async function* chunks() {
      yield 'one\r\ntw';
      yield new TextEncoder().encode('o\n\n  three  ');
    }
    const lines: string[] = [];
    for await (const l of readLines(chunks())) lines.push(l);
    expect(lines).toEqual(['one', 'two', 'three']);
  });

  it('numbers lines, cuts an over-long line without keeping it, and reads bad UTF-8 as U+FFFD', async () => {
    const long = 'x'.repeat(MAX_LINE_LENGTH + 10);
    async function* chunks() {
      yield 'a\n\n';
      for (let i = 0; i < long.length; i += 1000) yield long.slice(i, i + 1000);
      yield '\nb\n';
      yield new Uint8Array([0xff, 0xfe, 0x0a]);
    }
    const got = [];
    for await (const batch of readLineBatches(chunks())) got.push(...batch);
    expect(got.map((l) => [l.line, l.text.length, l.length])).toEqual([
      [1, 1, 1],
      [3, 40, MAX_LINE_LENGTH + 10],
      [4, 1, 1],
      [5, 2, 2],
    ]);
    expect(got[3]!.text).toBe('\ufffd\ufffd'); // WHATWG Encoding, UTF-8 decoder: each invalid byte is one U+FFFD
    // The same line as one value is refused without reaching the library, with the exit code for refused input.
    const r = await cli(['describe'], `2025-01-01\n${long}\n`);
    expect(r.code).toBe(EXIT_REFUSED);
    expect(r.err).toContain(`line 2: "${'x'.repeat(40)}"... is ${MAX_LINE_LENGTH + 10} characters long`);
  });

  it('writes aligned tables and JSON Lines; a table with no rows writes nothing', async () => {
    const io = memoryIo();
    const out = new Output(io);
    const table = new RowWriter(out, false, ['a', 'bb']);
    await table.write({ a: 'xyz', bb: 1 });
    await table.write({ a: 'q', bb: null });
    await table.end();
    expect(io.text()).toBe('a    bb\nxyz  1\nq    -\n');
    const io2 = memoryIo();
    const json = new RowWriter(new Output(io2), true, ['a']);
    await json.write({ a: 'x' });
    await json.end();
    expect(io2.text()).toBe('{"a":"x"}\n');
    const io3 = memoryIo();
    await new RowWriter(new Output(io3), false, ['a']).end();
    expect(io3.text()).toBe('');
  });

  it('a table streams after its sample rows: widths from the sample, wider later cells widen what follows', async () => {
    const io = memoryIo();
    const table = new RowWriter(new Output(io), false, ['n', 'v']);
    for (let i = 0; i < TABLE_SAMPLE_ROWS; i++) await table.write({ n: 'a', v: 1 });
    await table.write({ n: 'wide', v: 2 });
    await table.write({ n: 'b', v: 3 });
    await table.end();
    const lines = io.text().split('\n');
    expect(lines[0]).toBe('n  v');
    expect(lines[TABLE_SAMPLE_ROWS + 1]).toBe('wide  2');
    expect(lines[TABLE_SAMPLE_ROWS + 2]).toBe('b     3');
  });

  it('waits for stdout to drain when it asks to (backpressure)', async () => {
    let waits = 0;
    let writes = 0;
    const io = memoryIo({
      stdout: () => {
        writes++;
        return false;
      },
      stdoutDrained: () => {
        waits++;
        return Promise.resolve();
      },
    });
    const lines = Array.from({ length: 50_000 }, (_, i) => String(i * 60_000)).join('\n');
    const code = await runCli(['zone-at', '--zone', 'UTC', '--json'], { ...io, stdin: (async function* () { yield lines; })() });
    expect(code).toBe(0);
    expect(writes).toBeGreaterThan(10); // about 6 MB of JSON Lines, in chunks of about 64 KB
    expect(waits).toBe(writes);
  });

  it('a closed stdout ends the command quietly with exit code 0', async () => {
    let err = '';
    let writes = 0;
    const io: CliIo = {
      stdin: undefined,
      stdout: () => {
        if (++writes > 1) throw new OutputClosed();
      },
      stderr: (t) => { err += t; },
      stderrIsTty: false,
    };
    const code = await runCli(['holidays', '1971-01-01', '2971-01-01', '--calendar', 'us-federal', '--json'], io);
    expect(code).toBe(EXIT_DONE);
    expect(writes).toBe(2);
    expect(err).not.toMatch(/Error|at /);
  });

  it('messages are in shell words: no class names, no library parameter names, no stack', () => {
    const e = new KalendsRangeError('wallMs: 2025-03-09T02:30:00 does not exist; wallMs and epochMs (day number 20156)', { code: 'skipped-time', received: 0 });
    expect(shellMessage(e)).toBe('2025-03-09T02:30:00 does not exist; local date-time and instant');
    const lead = new KalendsRangeError('parsePlainDate: "x" is not an ISO 8601 date', { code: 'malformed', received: 'x' });
    expect(shellMessage(lead)).toBe('"x" is not an ISO 8601 date');
    expect(shellMessage(new TypeError('boom'))).toMatch(/^internal error \(TypeError: boom\); this is a defect in kalends/);
    expect(shellMessage(new KalendsRangeError(`start: ${'y'.repeat(5000)}`, { code: 'out-of-range', received: 0 })).length).toBe(1000);
  });
});

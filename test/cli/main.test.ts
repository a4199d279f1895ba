import { describe, expect, it } from 'vitest';
import { parseArgs, readLines, RowWriter, UsageError } from '../../src/cli/kit.js';
import { allCommands } from '../../src/cli/main.js';
import { cli } from './helpers.js';

describe('kalends CLI frame', () => {
  it('prints an overview listing every command with no arguments and with help', async () => {
    for (const argv of [[], ['help'], ['--help']]) {
      const r = await cli(argv);
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/^kalends: calendar-aware time indexing/);
      for (const c of allCommands) expect(r.out).toContain(c.name);
    }
  });

  it('rejects an unknown command with exit code 2, naming it', async () => {
    const r = await cli(['no-such-command']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('no command named "no-such-command"');
  });

  it('every command has a name, a one-line summary and help text that names it', () => {
    const names = new Set<string>();
    for (const c of allCommands) {
      expect(c.name).toMatch(/^[a-z][a-z-]*$/);
      expect(names.has(c.name)).toBe(false);
      names.add(c.name);
      expect(c.summary.length).toBeGreaterThan(5);
      expect(c.summary).not.toContain('\n');
      expect(c.help).toContain(c.name);
    }
  });

  it('parses --name value, --name=value, flags and --', () => {
    const p = parseArgs(['a', '--zone', 'UTC', '--unit=month', '--json', '--', '--not-an-option'], ['zone']);
    expect(p.positionals).toEqual(['a', '--not-an-option']);
    expect(p.options.get('zone')).toBe('UTC');
    expect(p.options.get('unit')).toBe('month');
    expect(p.options.get('json')).toBe(true);
    expect(() => parseArgs(['--zone'], ['zone'])).toThrow(UsageError);
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

  it('writes aligned tables and JSON Lines', () => {
    let text = '';
    const io = { stdin: undefined, stdout: (t: string) => { text += t; }, stderr: () => {}, stderrIsTty: false };
    const table = new RowWriter(io, false, ['a', 'bb']);
    table.write({ a: 'xyz', bb: 1 });
    table.write({ a: 'q', bb: null });
    table.end();
    expect(text).toBe('a    bb\nxyz  1\nq    -\n');
    text = '';
    const json = new RowWriter(io, true, ['a']);
    json.write({ a: 'x' });
    json.end();
    expect(text).toBe('{"a":"x"}\n');
  });
});

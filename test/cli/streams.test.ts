/**
 * The CLI under hostile input, as a shell user meets it: a million lines on stdin, binary garbage, one 10 MB line,
 * 200,000 bad lines and a reader that closes the pipe early. Exit codes are those `kalends help` lists (0 done,
 * 1 refused, 2 usage), and no stack trace ever reaches the user. The in-process tests use runCli with a fake
 * CliIo; the others run the built dist/cli.js as a child process (npm test builds it first).
 *
 * Expected instants are checked against ECMA-262 Date.parse (a general-purpose reference), not against kalends.
 */
import { describe, expect, it } from 'vitest';
import { EXIT_DONE, EXIT_REFUSED, MAX_LINE_LENGTH, MAX_REFUSED } from '../../src/cli/kit.js';
import { runCli } from '../../src/cli/main.js';
import { STACK_LINE, child } from './helpers.js';

/** `count` lines of text made by `line(i)`, yielded in chunks of about 64 KB (as a pipe delivers them). */
function* linesOf(count: number, line: (i: number) => string): Generator<string> {
  let chunk = '';
  for (let i = 1; i <= count; i++) {
    chunk += `${line(i)}\n`;
    if (chunk.length >= 65_536) {
      yield chunk;
      chunk = '';
    }
  }
  if (chunk !== '') yield chunk;
}

async function* asAsync<T>(items: Iterable<T>): AsyncGenerator<T> {
  yield* items;
}

/** Deterministic bytes of every value (a linear congruential generator, seed fixed): binary garbage. */
function garbage(length: number, seed = 12345): Uint8Array {
  const bytes = new Uint8Array(length);
  let x = seed;
  for (let i = 0; i < length; i++) {
    x = (Math.imul(x, 1_103_515_245) + 12_345) >>> 0;
    bytes[i] = x >>> 24;
  }
  return bytes;
}

const VALUE_COMMANDS: readonly (readonly string[])[] = [
  ['describe'],
  ['zone-at', '--zone', 'UTC'],
  ['zone-resolve', '--zone', 'UTC'],
  ['zone-changes'],
  ['period', '--unit', 'month'],
  ['business-day', '--calendar', 'us-federal'],
  ['business-shift', '--by', '1', '--calendar', 'us-federal'],
  ['business-count', '--calendar', 'us-federal'],
  ['adjust', '--convention', 'following', '--calendar', 'us-federal'],
];

describe('a million lines of stdin (in-process)', () => {
  it('streams 1,000,000 instants through zone-at as a table: one row each, in order, bounded memory', async () => {
    const n = 1_000_000;
    let lines = 0;
    let last = '';
    let firstRow = '';
    const code = await runCli(['zone-at', '--zone', 'UTC'], {
      stdin: asAsync(linesOf(n, (i) => String(i * 1000))),
      stdout: (t) => {
        let from = 0;
        for (let nl = t.indexOf('\n'); nl >= 0; nl = t.indexOf('\n', from)) {
          lines++;
          if (lines === 2) firstRow = t.slice(from, nl);
          from = nl + 1;
        }
        last = t;
      },
      stderr: (t) => {
        throw new Error(`unexpected stderr: ${t}`);
      },
      stderrIsTty: false,
    });
    expect(code).toBe(EXIT_DONE);
    expect(lines).toBe(n + 1); // the header and one row per input line
    const lastRow = last.trimEnd().split('\n').at(-1)!.split(/\s+/);
    expect(lastRow[0]).toBe(String(n * 1000));
    expect(Date.parse(lastRow[1]!)).toBe(n * 1000); // ECMA-262 Date.parse of the RFC 3339 text
    expect(Date.parse(firstRow.split(/\s+/)[1]!)).toBe(1000);
  });
});

describe('the built CLI as a child process', () => {
  it('a reader that closes the pipe early (| head) ends a long listing quietly with exit code 0', async () => {
    const r = await child(['holidays', '1971-01-01', '+100000-01-01', '--calendar', 'us-federal', '--json'], { closeAfter: 1 });
    expect(r.err).toBe('');
    expect(r.signal).toBe(null);
    expect(r.code).toBe(EXIT_DONE);
    expect(r.outBytes).toBeLessThan(10_000_000); // it stopped long before the 1M-row listing's end
  });

  it('a closed pipe while stdin still streams ends quietly with exit code 0', async () => {
    const r = await child(['zone-at', '--zone', 'UTC'], { stdin: linesOf(1_000_000, (i) => String(i)), closeAfter: 100 });
    expect(r.err).toBe('');
    expect(r.code).toBe(EXIT_DONE);
  });

  it('streams 200,000 lines of stdin through a value-per-line command', async () => {
    const r = await child(['zone-at', '--zone', 'UTC', '--json'], { stdin: linesOf(200_000, (i) => String(i * 60_000)) });
    expect(r.code).toBe(EXIT_DONE);
    expect(r.err).toBe('');
    expect(r.outBytes).toBeGreaterThan(200_000 * 100);
  });

  it(`200,000 bad lines: zone-changes names the first ${MAX_REFUSED}, stops, counts, exit code 1`, async () => {
    const r = await child(['zone-changes', '--from', '2025', '--to', '2026'], { stdin: linesOf(200_000, (i) => `Mars/Base${i}`) });
    expect(r.code).toBe(EXIT_REFUSED);
    expect(r.err).not.toMatch(STACK_LINE);
    const lines = r.err.trimEnd().split('\n');
    expect(lines).toHaveLength(MAX_REFUSED + 1);
    expect(lines[0]).toMatch(/^kalends zone-changes: line 1: unknown time zone "Mars\/Base1"/);
    expect(lines.at(-1)).toBe(`kalends zone-changes: stopped after ${MAX_REFUSED} refused zone ids (at line ${MAX_REFUSED}); 0 done before that; the rest of the input was not read`);
  });

  it('one 10 MB line is refused unread by a value command and stops bucket, exit code 1, no stack', async () => {
    const line = new Uint8Array(10 * 1024 * 1024).fill(0x61);
    const d = await child(['zone-changes'], { stdin: [line, '\nEurope/Dublin\n'] });
    expect(d.code).toBe(EXIT_REFUSED);
    expect(d.err).toContain(`line 1: "${'a'.repeat(40)}"... is ${10 * 1024 * 1024} characters long, more than the ${MAX_LINE_LENGTH}`);
    expect(d.out).toContain('Europe/Dublin'); // the next line is still read
    const b = await child(['bucket', '--unit', 'day'], { stdin: [line] });
    expect(b.code).toBe(EXIT_REFUSED);
    expect(b.err).toBe('kalends bucket: malformed CSV at line 1: a row longer than 65536 characters (is the input CSV?); stopped\n');
  });

  it('binary garbage: every value command and bucket refuse it with exit code 1 and no stack trace', async () => {
    const bytes = garbage(256 * 1024);
    for (const argv of [...VALUE_COMMANDS, ['bucket', '--unit', 'day'], ['bucket', '--unit', 'day', '--malformed', 'skip']]) {
      const r = await child([...argv], { stdin: [bytes] });
      expect(r.code, argv.join(' ')).toBe(EXIT_REFUSED);
      expect(r.err, argv.join(' ')).not.toMatch(STACK_LINE);
      expect(r.err, argv.join(' ')).not.toContain('internal error');
      for (const line of r.err.trimEnd().split('\n')) expect(line, argv.join(' ')).toMatch(/^(kalends [a-z-]+: |note: holiday calendars change)/);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';

async function run(argv: string[], input: string, chunk = 7, tty = false, delayMs = 0) {
  let out = '';
  let err = '';
  async function* stdin() {
    // Split the input into small chunks so that rows straddle chunk boundaries, as they do on a pipe.
    for (let i = 0; i < input.length; i += chunk) {
      if (delayMs > 0) await new Promise((r) => setTimeout(r, delayMs));
      yield new TextEncoder().encode(input.slice(i, i + chunk));
    }
  }
  const code = await runCli(argv, {
    stdin: stdin(),
    stdout: (t) => {
      out += t;
    },
    stderr: (t) => {
      err += t;
    },
    stderrIsTty: tty,
  });
  return { code, out, err };
}

const CSV = [
  'at,amount',
  '2025-03-01T04:30:00Z,10', // 23:30 on 28 February in New York (EST, UTC-5)
  '2025-03-01T05:00:00Z,20', // midnight, 1 March
  '2025-03-15T12:00:00-04:00,"30"',
  '2025-01-10,5', // a local date: its midnight in the zone
  '2025-03-20T12:00:00Z,',
].join('\n');

describe('kalends bucket (in-process, fake stdin)', () => {
  it('buckets unsorted rows into months in a zone, as CSV', async () => {
    const r = await run(['bucket', '--unit', 'month', '--zone', 'America/New_York', '--aggregate', 'sum,count,mean,max,p50'], CSV);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const lines = r.out.trim().split('\n');
    expect(lines[0]).toBe('period,start,end,rows,sum,count,mean,max,p50');
    expect(lines[1]).toBe('2025-01,2025-01-01T00:00:00-05:00,2025-02-01T00:00:00-05:00,1,5,1,5,5,5');
    expect(lines[2]).toBe('2025-02,2025-02-01T00:00:00-05:00,2025-03-01T00:00:00-05:00,1,10,1,10,10,10');
    // March: 20 and 30, plus one row with an empty (missing) value. DST starts 9 March 2025 (Energy Policy Act of 2005).
    expect(lines[3]).toBe('2025-03,2025-03-01T00:00:00-05:00,2025-04-01T00:00:00-04:00,3,50,2,25,30,25');
  });

  it('writes JSON Lines with --json, filling an explicit range', async () => {
    const r = await run(['bucket', '--unit', 'month', '--zone', 'America/New_York', '--range', '2024-12..2025-04', '--empty', 'zero', '--json'], CSV);
    expect(r.code).toBe(0);
    const rows = r.out.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    expect(rows.map((x) => x.period)).toEqual(['2024-12', '2025-01', '2025-02', '2025-03']);
    expect(rows.map((x) => x.sum)).toEqual([0, 5, 10, 50]);
  });

  it('stops at a malformed row with its line number and exit code 1', async () => {
    const bad = `${CSV}\nnot-a-time,4\n2025-03-21T00:00:00Z,x`;
    const r = await run(['bucket', '--unit', 'month'], bad);
    expect(r.code).toBe(1);
    expect(r.err).toContain('malformed row at line 7');
    expect(r.err).toContain('"not-a-time"');
  });

  it('skips malformed rows with --malformed skip, counting them on stderr, exit code 0', async () => {
    const bad = `${CSV}\nnot-a-time,4\n2025-03-21T00:00:00Z,x\n2025-03-22T00:00:00Z`;
    const r = await run(['bucket', '--unit', 'month', '--zone', 'UTC', '--malformed', 'skip'], bad);
    expect(r.code).toBe(0);
    expect(r.err).toContain('skipped 3 malformed rows (first: line 7');
    expect(r.out).toContain('2025-03,');
  });

  it('reports broken CSV (an unclosed quote) by line', async () => {
    const r = await run(['bucket', '--unit', 'day'], 'at,v\n2025-01-01T00:00:00Z,"5\n');
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/malformed CSV at line \d/);
  });

  it('takes a fiscal unit as JSON and rejects bad options with exit code 2', async () => {
    const fq = JSON.stringify({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    const r = await run(['bucket', '--unit', fq, '--zone', 'America/New_York'], CSV);
    expect(r.code).toBe(0);
    // US federal fiscal year: begins 1 October, named by the year in which it ends (31 U.S.C. 1102).
    expect(r.out.split('\n')[1]).toMatch(/^FY2025-Q2,/);
    expect((await run(['bucket'], CSV)).code).toBe(2);
    expect((await run(['bucket', '--unit', 'month', '--malformed', 'maybe'], CSV)).code).toBe(2);
    const renamed = await run(['bucket', '--unit', 'month', '--on-bad-row', 'skip'], CSV);
    expect(renamed.code).toBe(2); // renamed in 0.2, no alias
    expect(renamed.err).toContain('unknown option "--on-bad-row"');
    const unknown = await run(['bucket', '--unit', 'month', '--aggregate', 'avg'], CSV);
    expect(unknown.code).toBe(2);
    expect(unknown.err).toMatch(/unknown aggregation "avg"/);
  });

  it('shows progress on stderr only when it is a terminal and the input is large', async () => {
    // "Large" is past 4 MB or still reading after a second: a slow pipe (24 chunks, 60 ms apart) is large.
    const big = `at,v\n${Array.from({ length: 2_400 }, (_, i) => `${1_700_000_000_000 + i * 60_000},1.25`).join('\n')}`;
    const chunk = Math.ceil(big.length / 24);
    const quiet = await run(['bucket', '--unit', 'day'], big, chunk, false, 60);
    expect(quiet.err).toBe('');
    const fast = await run(['bucket', '--unit', 'day'], big, chunk, true, 0);
    expect(fast.err).toBe('');
    const tty = await run(['bucket', '--unit', 'day'], big, chunk, true, 60);
    expect(tty.err).toMatch(/MB read, [\d,]+ rows, [\d,]+ rows\/s/);
    expect(tty.out).toBe(quiet.out);
  });

  it('--delimiter takes one character or tab; anything else is a usage error that says what is valid', async () => {
    for (const bad of ['', ';;', '"', '\n']) {
      const r = await run(['bucket', '--unit', 'day', '--delimiter', bad], CSV);
      expect(r.code, JSON.stringify(bad)).toBe(2);
      expect(r.err).toContain('--delimiter: expected one character other than a quote or a line end (such as ";" or "|"), or the word tab');
      expect(r.err).not.toMatch(/Invalid option|CSV_/);
    }
    const semi = await run(['bucket', '--unit', 'month', '--delimiter', ';'], 'at;amount\n2025-03-01T05:00:00Z;20\n');
    expect(semi.code).toBe(0);
    expect(semi.out.split('\n')[1]).toMatch(/^2025-03,.*,1,20$/);
    const tab = await run(['bucket', '--unit', 'month', '--delimiter', 'tab'], 'at\tamount\n2025-03-01T05:00:00Z\t20\n');
    expect(tab.out.split('\n')[1]).toMatch(/^2025-03,.*,1,20$/);
  });

  it('a CSV with another delimiter gets a hint naming --delimiter', async () => {
    const semi = await run(['bucket', '--unit', 'month'], 'at;amount\n2025-03-01T05:00:00Z;20\n');
    expect(semi.code).toBe(1);
    expect(semi.err).toContain(`the row has one field holding ";": if the file is separated by it, add --delimiter ';'`);
    const tab = await run(['bucket', '--unit', 'month', '--malformed', 'skip'], 'at\tamount\n2025-03-01T05:00:00Z\t20\n');
    expect(tab.err).toContain('add --delimiter tab');
    const plain = await run(['bucket', '--unit', 'month'], 'at,amount\n2025-03-01T05:00:00Z\n');
    expect(plain.err).not.toContain('--delimiter');
  });

  it('broken CSV stops even with --malformed skip: the rows after a stray quote are never silently lost', async () => {
    // With its own skipping, the CSV reader would drop every row after x,"y"z. RFC 4180 section 2, rules 5 to 7:
    // double quotes enclose a whole field, so the row is broken CSV, not merely a malformed row.
    const r = await run(['bucket', '--unit', 'month', '--malformed', 'skip'], 'at,v\n2025-01-01T00:00:00Z,1\nx,"y"z\n2025-01-02T00:00:00Z,2\n', 1_000);
    expect(r.code).toBe(1);
    expect(r.err).toBe('kalends bucket: malformed CSV at line 3: text right after a closing quote; stopped\n');
    expect(r.out).toBe('');
  });

  it(`--range over more periods than the threshold needs --max-rows, named in the message`, async () => {
    // 10,000 years of days: 3,652,425 periods (400 Gregorian years have 146,097 days: 25 cycles).
    const r = await run(['bucket', '--unit', 'day', '--range', '2000-01-01..+012000-01-01'], '');
    expect(r.code).toBe(2);
    expect(r.err).toBe('kalends bucket: --range 2000-01-01..+012000-01-01 holds 3652425 periods, more than 100000 (the most without --max-rows); narrow --range or allow them with --max-rows 3652425\n');
    const ok = await run(['bucket', '--unit', 'month', '--range', '2025-01..2025-04', '--max-rows', '3', '--json'], CSV);
    expect(ok.code).toBe(0);
    expect(ok.out.trim().split('\n')).toHaveLength(3);
    const short = await run(['bucket', '--unit', 'month', '--range', '2025-01..2025-04', '--max-rows', '2'], CSV);
    expect(short.code).toBe(2);
    expect(short.err).toContain('holds 3 periods, more than 2 (--max-rows)');
  });

  it('names start and end as kalends period does, and --json adds them as epoch milliseconds', async () => {
    const r = await run(['bucket', '--unit', 'month', '--zone', 'America/New_York', '--json'], CSV);
    const first = JSON.parse(r.out.split('\n')[0]!) as Record<string, unknown>;
    expect(first).toMatchObject({ period: '2025-01', start: '2025-01-01T00:00:00-05:00', end: '2025-02-01T00:00:00-05:00' });
    expect(first['startEpochMs']).toBe(Date.parse('2025-01-01T00:00:00-05:00')); // ECMA-262 Date.parse
    expect(first['endEpochMs']).toBe(Date.parse('2025-02-01T00:00:00-05:00'));
  });
});

/** The zone commands, run in-process through runCli. Expected values follow IANA tz data (see facts.test.ts). */
import { describe, expect, it } from 'vitest';
import { MAX_REFUSED } from '../../src/cli/kit.js';
import { cli as run } from '../cli/helpers.js';


const lines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);

describe('kalends zone-at', () => {
  it('shows offsets and local times on both sides of the EU change (Directive 2000/84/EC: 01:00 UTC)', async () => {
    const r = await run(['zone-at', '2025-03-30T00:59:59Z', '2025-03-30T01:00:00Z', '--zone', 'Europe/Dublin', '--json']);
    expect(r.code).toBe(0);
    expect(lines(r.out).map((x) => [x.local, x.offset])).toEqual([
      ['2025-03-30T00:59:59', '+00:00'],
      ['2025-03-30T02:00:00', '+01:00'],
    ]);
  });
  it('reads stdin and epoch ms; prints a table', async () => {
    const r = await run(['zone-at', '--zone', 'Asia/Kolkata'], '0\n');
    expect(r.out).toContain('1970-01-01T05:30:00');
    expect(r.out.split('\n')[0]).toMatch(/^input\s+utc\s+local\s+offset\s+localDate/);
  });
  it('a missing or unknown --zone is a usage error (exit 2), with a suggestion', async () => {
    expect((await run(['zone-at', '0'])).code).toBe(2);
    const bad = await run(['zone-at', '0', '--zone', 'Europe/Londn']);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('did you mean "Europe/London"');
  });
});

describe('kalends zone-resolve', () => {
  it('shows unique, gap and overlap (Energy Policy Act of 2005: 2025-03-09 and 2025-11-02 in New York)', async () => {
    const r = await run(['zone-resolve', '2025-03-09T02:30', '2025-11-02T01:30', '2025-06-01T12:00', '--zone', 'America/New_York', '--json']);
    expect(r.code).toBe(0);
    const rows = lines(r.out);
    expect(rows.map((x) => x.status)).toEqual(['gap', 'overlap', 'unique']);
    expect(rows.map((x) => x.instant)).toEqual(['2025-03-09T03:30:00-04:00', '2025-11-02T01:30:00-04:00', '2025-06-01T12:00:00-04:00']);
    // Gaps and overlaps in one vocabulary: both name the offsets before and after the transition.
    expect(rows.map((x) => [x.offsetBefore, x.offsetAfter])).toEqual([['-05:00', '-04:00'], ['-04:00', '-05:00'], [undefined, undefined]]);
    expect([rows[1]!.epochMsBeforeTransition, rows[1]!.epochMsAfterTransition]).toEqual([Date.UTC(2025, 10, 2, 5, 30), Date.UTC(2025, 10, 2, 6, 30)]);
  });
  it('--disambiguation later and reject', async () => {
    const later = await run(['zone-resolve', '2025-11-02T01:30', '--zone', 'America/New_York', '--disambiguation', 'later', '--json']);
    expect(lines(later.out)[0]!.instant).toBe('2025-11-02T01:30:00-05:00');
    const reject = await run(['zone-resolve', '2025-03-09T02:30', '--zone', 'America/New_York', '--disambiguation', 'reject', '--json']);
    expect(reject.code).toBe(1);
    // In shell words: the local date-time text and the option to use, never the library's wallMs.
    expect(lines(reject.out)[0]!.note).toBe(
      '2025-03-09T02:30:00 does not exist in America/New_York: the clocks went from 2025-03-09T02:00:00 to 2025-03-09T03:00:00; --disambiguation compatible, earlier or later picks an instant',
    );
    const twice = await run(['zone-resolve', '2025-11-02T01:30', '--zone', 'America/New_York', '--disambiguation', 'reject']);
    expect(twice.code).toBe(1);
    expect(twice.out).toContain('2025-11-02T01:30:00 happened twice in America/New_York');
    expect(twice.out + twice.err).not.toMatch(/wallMs|epochMs|Error/);
    expect((await run(['zone-resolve', 'x', '--zone', 'UTC', '--disambiguation', 'sometimes'])).code).toBe(2);
    expect((await run(['zone-resolve', 'x', '--zone', 'UTC', '--disambiguation', 'eralier'])).err).toContain('did you mean "earlier"?');
  });
});

describe('kalends zone-changes', () => {
  it("lists Lord Howe's half-hour changes in 2025 (IANA tz data: first Sundays of April and October)", async () => {
    const r = await run(['zone-changes', 'Australia/Lord_Howe', '--from', '2025', '--to', '2026', '--json']);
    expect(r.code).toBe(0);
    expect(lines(r.out).map((x) => [x.localBefore, x.localAfter, x.change, x.kind])).toEqual([
      ['2025-04-06T02:00:00', '2025-04-06T01:30:00', '-0h30m', 'overlap'],
      ['2025-10-05T02:00:00', '2025-10-05T02:30:00', '+0h30m', 'gap'],
    ]);
  });
  it('reads zone ids from stdin', async () => {
    const r = await run(['zone-changes', '--from', '2024', '--to', '2025'], 'Europe/Dublin\nAsia/Tokyo\n');
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n').length).toBe(3); // header + two Dublin rows; Tokyo has none
  });
  it('bounds work: at most the stated number of refused zone ids, each suggestion on bounded text', async () => {
    const many = Array.from({ length: 200_000 }, (_, i) => `Europe/Nowhere${i}`).join('\n');
    const r = await run(['zone-changes', '--from', '2025', '--to', '2026'], many);
    expect(r.code).toBe(1);
    expect(r.err.trim().split('\n')).toHaveLength(MAX_REFUSED + 1);
    expect(r.err).toContain(`stopped after ${MAX_REFUSED} refused zone ids (at line ${MAX_REFUSED})`);
  });

  it('a malformed --from is a usage error before any zone is read', async () => {
    const r = await run(['zone-changes', 'Europe/Dublin', '--from', 'soon']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^kalends zone-changes: --from: /);
  });

  it('long ranges stream in windows: transitions across 400-year windows all appear once', async () => {
    // IANA tz data, europe file: Europe/Dublin changes its offset on the EU dates, twice a year, in every future year.
    const r = await run(['zone-changes', 'Europe/Dublin', '--from', '2001', '--to', '3001-01-01', '--json']);
    expect(r.code).toBe(0);
    const rows = lines(r.out);
    expect(rows).toHaveLength(2 * 1000);
    expect(new Set(rows.map((x) => x.at)).size).toBe(rows.length);
  });
});

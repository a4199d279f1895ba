/**
 * `kalends describe`, run in-process through runCli with a fake CliIo. Expected facts come from
 * @js-temporal/polyfill (a reference library) and ECMA-262 Date.UTC, not from kalends itself.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import { cli } from './helpers.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

/** The facts describe must print for a date, computed with Temporal. */
function expectedFacts(iso: string) {
  const d = Temporal.PlainDate.from(iso);
  return {
    date: d.toString(),
    weekday: WEEKDAYS[d.dayOfWeek - 1],
    weekdayNumber: d.dayOfWeek,
    isoWeek: `${d.yearOfWeek}-W${String(d.weekOfYear).padStart(2, '0')}-${d.dayOfWeek}`,
    dayOfYear: d.dayOfYear,
    dayNumber: d.since('1970-01-01', { largestUnit: 'days' }).days,
    leapYear: d.inLeapYear,
    daysInMonth: d.daysInMonth,
  };
}

const jsonLines = (out: string) => out.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);

describe('kalends describe', () => {
  it('describes a plain date with --json (facts checked against Temporal.PlainDate)', async () => {
    const r = await cli(['describe', '2025-02-14', '--json']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    const [row] = jsonLines(r.out);
    expect(row).toMatchObject({ input: '2025-02-14', kind: 'date', epochMs: null, ...expectedFacts('2025-02-14') });
  });

  it('week dates and ordinal dates describe the same day', async () => {
    const r = await cli(['describe', '2025-W07-5', '2025-045', '--json']);
    expect(r.code).toBe(0);
    for (const row of jsonLines(r.out)) expect(row).toMatchObject(expectedFacts('2025-02-14'));
  });

  it('ISO week-year differs from the calendar year at the boundary (2010-01-03 is 2009-W53-7)', async () => {
    const r = await cli(['describe', '2010-01-03', '--json']);
    expect(jsonLines(r.out)[0]).toMatchObject(expectedFacts('2010-01-03'));
    expect(jsonLines(r.out)[0]!.isoWeek).toBe('2009-W53-7'); // ISO 8601 week rule, from memory; Temporal agrees above
  });

  it('describes an instant by its UTC date: RFC 3339 5.8 / RFC 9557 4.2 example', async () => {
    const r = await cli(['describe', '1996-12-19T16:39:57-08:00[America/Los_Angeles]', '--json']);
    expect(r.code).toBe(0);
    const [row] = jsonLines(r.out);
    expect(row).toMatchObject({
      kind: 'instant',
      utc: '1996-12-20T00:39:57Z',
      epochMs: Date.UTC(1996, 11, 20, 0, 39, 57),
      local: '1996-12-19T16:39:57',
      offset: '-08:00',
      zoneAnnotation: 'America/Los_Angeles',
      ...expectedFacts('1996-12-20'),
    });
  });

  it('reports the RFC 3339 leap second example as 23:59:59Z and flags it', async () => {
    const r = await cli(['describe', '1990-12-31T23:59:60Z', '--json']);
    expect(jsonLines(r.out)[0]).toMatchObject({ utc: '1990-12-31T23:59:59Z', leapSecond: true });
  });

  it('describes a local date-time by its own date, with no instant', async () => {
    const r = await cli(['describe', '2025-02-14T09:30', '--json']);
    expect(jsonLines(r.out)[0]).toMatchObject({ kind: 'local date-time', utc: null, epochMs: null, local: '2025-02-14T09:30:00', ...expectedFacts('2025-02-14') });
  });

  it('reads one value per line from stdin when there are no arguments', async () => {
    const r = await cli(['describe', '--json'], '2024-02-29\n\n2025-045\r\n');
    expect(r.code).toBe(0);
    const rows = jsonLines(r.out);
    expect(rows.map((x) => x.date)).toEqual(['2024-02-29', '2025-02-14']);
    expect(rows[0]).toMatchObject(expectedFacts('2024-02-29'));
  });

  it('writes a table with a header by default', async () => {
    const r = await cli(['describe', '2025-02-14', '1985-04-12T23:20:50.52Z']);
    expect(r.code).toBe(0);
    const lines = r.out.trimEnd().split('\n');
    expect(lines).toHaveLength(3);
    expect(lines[0]!.split(/\s+/)).toEqual(['input', 'kind', 'utc', 'epochMs', 'local', 'date', 'weekday', 'isoWeek', 'dayOfYear', 'dayNumber', 'leapYear', 'daysInMonth']);
    expect(lines[1]).toMatch(/^2025-02-14\s+date\s+-\s+-\s+-\s+2025-02-14\s+Friday\s+2025-W07-5\s+45\s+20133\s+false\s+28$/);
    expect(lines[2]).toContain(String(Date.UTC(1985, 3, 12, 23, 20, 50, 520)));
  });

  it('a bad value is reported on stderr by name, the others still print, and the exit code is 1', async () => {
    const r = await cli(['describe', '2025-02-14', '2025-02-30', 'junk', '2025-W07-5', '--json']);
    expect(r.code).toBe(1);
    expect(jsonLines(r.out)).toHaveLength(2);
    expect(r.err).toContain('"2025-02-30"');
    expect(r.err).toContain('"junk"');
    expect(r.err.trim().split('\n')).toEqual([expect.stringContaining('"2025-02-30"'), expect.stringContaining('"junk"'), 'kalends describe: 2 of 4 values refused']);
  });

  it('bare numbers need --numbers to say what they are', async () => {
    const bare = await cli(['describe', '20133', '--json']);
    expect(bare.code).toBe(1);
    expect(bare.err).toContain('--numbers');
    const asDay = await cli(['describe', '20133', '--numbers', 'day-number', '--json']);
    expect(jsonLines(asDay.out)[0]).toMatchObject(expectedFacts('2025-02-14'));
    const asMs = await cli(['describe', String(Date.UTC(2025, 1, 14, 9, 30)), '--numbers=epoch-ms', '--json']);
    expect(jsonLines(asMs.out)[0]).toMatchObject({ utc: '2025-02-14T09:30:00Z' });
    const asSeconds = await cli(['describe', String(Date.UTC(2025, 1, 14, 9, 30) / 1000), '--numbers', 'epoch-seconds', '--json']);
    expect(jsonLines(asSeconds.out)[0]).toMatchObject({ utc: '2025-02-14T09:30:00Z' });
  });

  it('usage mistakes exit with code 2', async () => {
    expect((await cli(['describe', '2025-02-14', '--numbers', 'weeks'])).code).toBe(2);
    expect((await cli(['describe', '2025-02-14', '--zone', 'UTC'])).code).toBe(2);
    const none = await cli(['describe'], '');
    expect(none.code).toBe(2);
    expect(none.err).toContain('no values');
  });

  it('has help text naming its options', async () => {
    const r = await cli(['help', 'describe']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('kalends describe');
    expect(r.out).toContain('--numbers');
    expect(r.out).toContain('--json');
  });
});

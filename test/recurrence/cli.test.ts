/**
 * The recurrence commands, run in-process through runCli. Expected dates: RFC 5545 section 3.8.5.3 ("Daily for 10
 * occurrences"), the US federal holidays of 5 U.S.C. 6103, and calendar facts checked with @js-temporal/polyfill.
 */
import { describe, expect, it } from 'vitest';
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Temporal } from '@js-temporal/polyfill';
import { cli } from '../cli/helpers.js';

describe('kalends schedule', () => {
  it('lists a JSON rule between bounds as a table', async () => {
    const r = await cli(['schedule', '{"kind":"semi-monthly","days":[15,"last"]}', '--from', '2024-02-01', '--to', '2024-04-01']);
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n')).toEqual(['date        weekday', '2024-02-15  Thursday', '2024-02-29  Thursday', '2024-03-15  Friday', '2024-03-31  Sunday']);
    expect(Temporal.PlainDate.from('2024-02-29').dayOfWeek).toBe(4);
  });

  it('lists the first n business month ends as JSON Lines', async () => {
    const r = await cli(['schedule', '{"kind":"monthly","on":{"businessDay":"last"},"calendar":"us-federal"}', '--from', '2025-05-01', '--count', '2', '--json']);
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n').map((l) => JSON.parse(l))).toEqual([
      { date: '2025-05-30', weekday: 'Friday' },
      { date: '2025-06-30', weekday: 'Monday' },
    ]);
  });

  it('reads RFC 5545 text (RFC 5545 section 3.8.5.3, "Daily for 10 occurrences") from a file and prints instants', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-rec-'));
    const file = join(dir, 'daily.ics');
    writeFileSync(file, 'DTSTART;TZID=America/New_York:19970902T090000\r\nRRULE:FREQ=DAILY;COUNT=10\r\n');
    const r = await cli(['schedule', file, '--from', '1997-09-01T00:00:00Z', '--count', '100', '--json']);
    expect(r.code).toBe(0);
    const lines = r.out.trim().split('\n').map((l) => JSON.parse(l) as { instant: string });
    expect(lines).toHaveLength(10);
    expect(lines[0]!.instant).toBe(Temporal.ZonedDateTime.from('1997-09-02T09:00[America/New_York]').toInstant().toString());
  });

  it('reports bad input with an exit code and the reason', async () => {
    const bad = await cli(['schedule', '{"kind":"monthly","on":{"day":32}}', '--from', '2025-01-01', '--count', '1']);
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('on.day');
    const usage = await cli(['schedule', '{"kind":"days"}', '--from', '2025-01-01']);
    expect(usage.code).toBe(2);
    expect(usage.err).toContain('--to');
    const unsupported = await cli(['schedule', 'DTSTART:19970902T090000Z\\nRRULE:FREQ=DAILY;BYHOUR=24', '--from', '1997-01-01T00:00Z', '--count', '1']);
    expect(unsupported.code).toBe(1);
    expect(unsupported.err).toContain('BYHOUR');
    expect(unsupported.err).toContain('"24"');
  });
});

describe('kalends schedule: the one form of definitions, and bounds', () => {
  it('reads the rule from standard input with "-", like every definition option', async () => {
    const r = await cli(['schedule', '-', '--from', '2024-02-01', '--to', '2024-03-01', '--json'], '{"kind":"semi-monthly","days":[15,"last"]}\n');
    expect(r.code).toBe(0);
    // The last day of February 2024, from @js-temporal/polyfill (PlainDate.daysInMonth).
    const last = `2024-02-${Temporal.PlainDate.from('2024-02-01').daysInMonth}`;
    expect(r.out.trim().split('\n').map((l) => (JSON.parse(l) as { date: string }).date)).toEqual(['2024-02-15', last]);
  });

  it('--end-inclusive includes an occurrence on --to; it does not go with --count', async () => {
    const rule = '{"kind":"semi-monthly","days":[15,"last"]}';
    const open = await cli(['schedule', rule, '--from', '2024-03-01', '--to', '2024-03-15']);
    expect(open.out).toBe('');
    const closed = await cli(['schedule', rule, '--from', '2024-03-01', '--to', '2024-03-15', '--end-inclusive']);
    expect(closed.out.trim().split('\n')).toEqual(['date        weekday', '2024-03-15  Friday']);
    expect(Temporal.PlainDate.from('2024-03-15').dayOfWeek).toBe(5);
    const both = await cli(['schedule', rule, '--from', '2024-03-01', '--count', '2', '--end-inclusive']);
    expect(both.code).toBe(2);
  });

  it('a rule that is neither JSON, RFC 5545 nor a file says which forms are valid; bounds are usage errors', async () => {
    const r = await cli(['schedule', 'every friday', '--from', '2025-01-01', '--count', '1']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('is not JSON text starting with "{", RFC 5545 text (with FREQ=), "-" for standard input, or an existing file');
    const to = await cli(['schedule', '{"kind":"days"}', '--from', '2025-01-01', '--to', 'someday']);
    expect(to.code).toBe(2);
    expect(to.err).toMatch(/^kalends schedule: --to: /);
    const back = await cli(['schedule', '{"kind":"days"}', '--from', '2025-01-02', '--to', '2025-01-01']);
    expect(back.code).toBe(2);
  });
});

describe('kalends explain-rule', () => {
  it('explains a rule in words with its RFC 5545 text', async () => {
    const r = await cli(['explain-rule', '{"kind":"weekly","weekdays":["friday"],"every":2,"anchor":"2025-01-03"}']);
    expect(r.code).toBe(0);
    expect(r.out).toBe('Friday of every 2nd week, counted from the week of 2025-01-03\nRFC 5545:\nDTSTART;VALUE=DATE:20250103\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=FR\n');
  });

  it("names the CLI's own options in library messages (--start, not options.start)", async () => {
    const r = await cli(['explain-rule', 'FREQ=DAILY']);
    expect(r.code).toBe(1);
    expect(r.err).toContain('(or --start)');
    expect(r.err).not.toContain('options.');
  });

  it('--json, and a rule with no RFC 5545 form', async () => {
    const r = await cli(['explain-rule', '{"kind":"monthly","on":{"businessDay":1},"calendar":"us-federal"}', '--json']);
    expect(JSON.parse(r.out)).toEqual({ kind: 'monthly', values: 'dates', description: 'the first business day of every month; business days from calendar "us-federal"', rfc5545: null });
  });
});

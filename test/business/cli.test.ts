/**
 * The business commands, run in-process through runCli. Expected dates: OPM federal holiday tables and the gov.uk
 * bank holiday list (see reference.test.ts for the full tables and their sources), ISDA 2006 section 4.12.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/helpers.js';

const lines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);

describe('kalends holidays', () => {
  it('lists a year of England and Wales bank holidays with substitute days (gov.uk 2022)', async () => {
    const r = await cli(['holidays', '--year', '2022', '--calendar', 'england-and-wales', '--json']);
    expect(r.code).toBe(0);
    const rows = lines(r.out);
    expect(rows.map((x) => x['date'])).toEqual(['2022-01-03', '2022-04-15', '2022-04-18', '2022-05-02', '2022-06-02', '2022-06-03', '2022-08-29', '2022-09-19', '2022-12-26', '2022-12-27']);
    expect(rows[0]).toMatchObject({ name: "New Year's Day", actualDate: '2022-01-01', moved: true, weekday: 'Monday' });
  });
  it('a table in a range shows the observed New Year of 2022 on 2021-12-31 (OPM), and a caution on stderr', async () => {
    const r = await cli(['holidays', '2021-12-01', '2022-01-01', '--calendar', 'us-federal']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/2021-12-31\s+Friday\s+New Year's Day\s+2022-01-01\s+true/);
    expect(r.err).toMatch(/verify dates against the official calendar/);
  });
});

describe('kalends business-day, business-shift, business-count, adjust', () => {
  it('checks dates given as arguments or on stdin', async () => {
    const r = await cli(['business-day', '--calendar', 'us-federal', '--json'], '2025-07-04\n2025-07-07\n');
    const rows = lines(r.out);
    expect(rows[0]).toMatchObject({ date: '2025-07-04', businessDay: false, holidays: 'Independence Day', previous: '2025-07-03', next: '2025-07-07' });
    expect(rows[1]).toMatchObject({ date: '2025-07-07', businessDay: true, holidays: null });
  });
  it('shifts and counts', async () => {
    const s = await cli(['business-shift', '2025-12-23', '--by', '2', '--calendar', 'us-federal', '--json']);
    expect(lines(s.out)[0]).toMatchObject({ result: '2025-12-26', weekday: 'Friday' });
    const back = await cli(['business-shift', '2025-12-26', '--by=-2', '--calendar', 'us-federal', '--json']);
    expect(lines(back.out)[0]).toMatchObject({ result: '2025-12-23' });
    const c = await cli(['business-count', '2024-01-01', '2025-01-01', '--calendar', 'euro-t2', '--json']);
    expect(lines(c.out)[0]).toMatchObject({ businessDays: 256, calendarDays: 366 }); // 262 weekdays - 6 closing days
    const piped = await cli(['business-count', '--calendar', 'us-federal', '--json'], '2025-01-01,2026-01-01\n2026-01-01 2025-01-01\n');
    expect(lines(piped.out).map((x) => x['businessDays'])).toEqual([250, -250]);
  });
  it('adjusts by an ISDA convention (4.12: modified following keeps 2026-01-31 in January)', async () => {
    const r = await cli(['adjust', '2026-01-31', '2026-01-30', '--convention', 'modified-following', '--calendar', 'us-federal', '--json']);
    expect(lines(r.out).map((x) => [x['adjusted'], x['moved']])).toEqual([['2026-01-30', true], ['2026-01-30', false]]);
  });
  it('reads a JSON definition file that extends a bundled calendar', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-business-'));
    const file = join(dir, 'company.json');
    writeFileSync(file, JSON.stringify({ id: 'company', extends: 'us-federal', additions: [{ date: '2025-12-24', name: 'Company shutdown' }] }));
    const r = await cli(['business-day', '2025-12-24', '--calendar', file, '--json']);
    expect(r.code).toBe(0);
    expect(lines(r.out)[0]).toMatchObject({ businessDay: false, holidays: 'Company shutdown' });
    const bad = join(dir, 'bad.json');
    writeFileSync(bad, JSON.stringify({ holidays: [{ name: 'X', kind: 'fixed', month: 2, day: 30 }] }));
    const e = await cli(['holidays', '--year', '2025', '--calendar', bad]);
    expect(e.code).toBe(1);
    expect(e.err).toMatch(/holidays\[0\]\.day: expected 1\.\.29 for month 2/);
  });
});

describe('usage errors', () => {
  it('unknown calendar names get suggestions; a missing --calendar or --convention is a usage error', async () => {
    const r = await cli(['holidays', '--year', '2025', '--calendar', 'us-fedral']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/did you mean "us-federal"/);
    expect((await cli(['business-day', '2025-01-01'])).code).toBe(2);
    const conv = await cli(['adjust', '2025-01-01', '--convention', 'modified', '--calendar', 'us-federal']);
    expect(conv.code).toBe(2);
    expect(conv.err).toMatch(/expected one of following, modified-following/);
    const typo = await cli(['adjust', '2025-01-01', '--convention', 'modifed-folowing', '--calendar', 'us-federal']);
    expect(typo.err).toContain('did you mean "modified-following"?');
  });
  it('dates outside the calendar years are refused with the range, in shell words (no class name, no day number)', async () => {
    const r = await cli(['business-day', '1960-01-04', '2025-01-02', '--calendar', 'us-federal']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^kalends business-day: "1960-01-04": .*the years 1971\.\.275760 .*got 1960-01-04/m);
    expect(r.err).not.toMatch(/Kalends\w*Error|day number -?\d/);
    expect(r.out).toContain('2025-01-02'); // the other date is still checked
  });

  it('--calendar takes JSON text as well as a file (the one form of every definition option)', async () => {
    const r = await cli(['business-day', '2025-12-24', '--calendar', '{"id":"company","extends":"us-federal","additions":[{"date":"2025-12-24","name":"Company shutdown"}]}', '--json']);
    expect(r.code).toBe(0);
    expect(lines(r.out)[0]).toMatchObject({ businessDay: false, holidays: 'Company shutdown' });
    const missing = await cli(['business-day', '2025-12-24', '--calendar', 'no-such-file.json']);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('is not a name (us-federal, england-and-wales, euro-t2), JSON text starting with "{", "-" for standard input, or an existing file');
  });

  it('the caution comes first, so a reader that stops early still sees it', async () => {
    const r = await cli(['holidays', '--year', '2025', '--calendar', 'us-federal']);
    expect(r.err).toMatch(/^note: holiday calendars change by proclamation/);
  });
});

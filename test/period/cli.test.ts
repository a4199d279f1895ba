import { describe, expect, it } from 'vitest';
import { cli as run } from '../cli/helpers.js';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';


const US_FY = JSON.stringify({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
const RETAIL = { kind: 'fiscal-period', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' };

describe('cli: period', () => {
  // 31 U.S.C. 1102: the US federal fiscal year begins on 1 October.
  it('gives the period, first and last day, days, and start and end instants in a zone (31 U.S.C. 1102 quarters)', async () => {
    const r = await run(['period', '2025-10-01', '--unit', US_FY, '--zone', 'America/New_York', '--json']);
    expect(r.code).toBe(0);
    const row = JSON.parse(r.out.trim()) as Record<string, unknown>;
    expect(row).toMatchObject({
      period: 'FY2026-Q1',
      first: '2025-10-01',
      last: '2025-12-31',
      days: 92,
      start: '2025-10-01T00:00:00-04:00',
      end: '2026-01-01T00:00:00-05:00',
      startEpochMs: Date.parse('2025-10-01T04:00:00Z'),
      endEpochMs: Date.parse('2026-01-01T05:00:00Z'),
    });
  });

  it('names the columns as kalends bucket does: period, start, end (end-exclusive instants)', async () => {
    const p = await run(['period', '2025-03', '--unit', 'month', '--zone', 'America/New_York', '--json']);
    const b = await run(['bucket', '--unit', 'month', '--zone', 'America/New_York', '--json'], 'at,v\n2025-03-15T12:00:00Z,1\n');
    const pr = JSON.parse(p.out) as Record<string, unknown>;
    const br = JSON.parse(b.out) as Record<string, unknown>;
    for (const k of ['period', 'start', 'end', 'startEpochMs', 'endEpochMs']) expect(br[k], k).toEqual(pr[k]);
  });

  it('reads stdin when given no values; places instants by their local date in --zone', async () => {
    const r = await run(['period', '--unit', 'month', '--zone', 'America/New_York', '--json'], '2025-04-01T03:30:00Z\n2025-03\n');
    expect(r.code).toBe(0);
    const rows = r.out.trim().split('\n').map((l) => JSON.parse(l) as { period: string });
    expect(rows.map((x) => x.period)).toEqual(['2025-03', '2025-03']);
  });

  it('prints a table, reads a unit from a file, and reports bad values by name', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-period-'));
    const file = join(dir, 'retail.json');
    writeFileSync(file, JSON.stringify(RETAIL));
    const r = await run(['period', '2024-02-03', 'FY2024-P01', 'not-a-date', '--unit', file]);
    expect(r.code).toBe(1);
    expect(r.out.split('\n')[0]).toMatch(/^input\s+period\s+first\s+last\s+days\s+start\s+end$/);
    expect(r.out).toContain('FY2023-P12');
    expect(r.out).toMatch(/FY2024-P01\s+FY2024-P01\s+2024-02-04\s+2024-03-02\s+28/);
    expect(r.err).toContain('"not-a-date"');
  });

  it('rejects a bad unit definition with its path, and a missing --unit as a usage error', async () => {
    const bad = await run(['period', '2025-01-01', '--unit', '{"kind":"fiscal-year","start":{"month":6,"day":31},"naming":"end-year"}']);
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('start.day: expected 1..30 for month 6, got 31');
    const missing = await run(['period', '2025-01-01']);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('--unit is required');
  });
});

describe('cli: fiscal-layout', () => {
  // NRF 4-5-4 calendar: FY2023 is a 53-week year; the 53rd week goes to the last month (see reference.test.ts).
  it('prints the periods of a 4-5-4 year with their first and last days', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-layout-'));
    const file = join(dir, 'retail.json');
    writeFileSync(file, JSON.stringify(RETAIL));
    const r = await run(['fiscal-layout', '--unit', file, '--year', 'FY2023', '--json']);
    expect(r.code).toBe(0);
    const rows = r.out.trim().split('\n').map((l) => JSON.parse(l) as { period: string; weeks: number; first: string; last: string; quarter: string });
    expect(rows.map((x) => x.weeks)).toEqual([4, 5, 4, 4, 5, 4, 4, 5, 4, 4, 5, 5]);
    expect(rows[0]).toMatchObject({ period: 'FY2023-P01', quarter: 'FY2023-Q1', first: '2023-01-29', last: '2023-02-25' });
    expect(rows[11]).toMatchObject({ period: 'FY2023-P12', quarter: 'FY2023-Q4', last: '2024-02-03' });
  });

  // Income Tax Act 2007 s.4: the UK tax year runs 6 April to 5 April.
  it('lays out a year of calendar months from a date, at quarter level, as a table', async () => {
    const def = JSON.stringify({ kind: 'fiscal-year', start: { month: 4, day: 6 }, naming: 'start-year' });
    const r = await run(['fiscal-layout', '--unit', def, '--date', '2025-05-01', '--level', 'quarter']);
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toBe('FY2025: 2025-04-06 .. 2026-04-05 (365 days)');
    // At quarter level the quarter column would repeat the period: it is left out.
    expect(r.out.split('\n')[1]).toMatch(/^period\s+first\s+last\s+days\s+weeks$/);
    expect(r.out).toMatch(/\nFY2025-Q4\s+2026-01-06\s+2026-04-05\s+90\s/);
    const json = await run(['fiscal-layout', '--unit', def, '--date', '2025-05-01', '--level', 'quarter', '--json']);
    expect(Object.keys(JSON.parse(json.out.split('\n')[0]!) as object)).toEqual(['period', 'first', 'last', 'days', 'weeks']);
    const year = await run(['fiscal-layout', '--unit', def, '--year', 'FY999999']);
    expect(year.code).toBe(2);
    expect(year.err).toMatch(/^kalends fiscal-layout: --year: "FY999999" is not a fiscal year FYyyyy/);
    const positional = await run(['fiscal-layout', def]);
    expect(positional.code).toBe(2);
    expect(positional.err).toContain('the definition goes in --unit');
    const weeks = await run(['fiscal-layout', '--unit', def, '--level', 'week']);
    expect(weeks.code).toBe(2);
    expect(weeks.err).toContain('52/53-week');
  });
});

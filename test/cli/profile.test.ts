/**
 * `--profile` on the CLI: every command accepts it; period, fiscal-layout, holidays, schedule and bucket pick the
 * profile's units, calendar and rules by name and answer as with the definitions given directly; zone commands
 * take the profile's zone; a faulty profile stops with every fault at its path; `kalends warehouse` writes the
 * export.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { cli } from './helpers.js';
import { allCommands } from '../../src/cli/main.js';

const PROFILE = fileURLToPath(new URL('../../examples/otterbrook.profile.json', import.meta.url));
const doc = JSON.parse(readFileSync(PROFILE, 'utf8')) as Record<string, any>;
const company = JSON.stringify(doc.calendars.company).replace('"extends":"federal"', '"extends":"us-federal"');

describe('--profile', () => {
  it('period: a unit by its profile name, the zone from the profile', async () => {
    const viaProfile = await cli(['period', '2025-10-01T03:30:00Z', '--unit', 'fiscal-quarter', '--profile', PROFILE, '--json']);
    const direct = await cli(['period', '2025-10-01T03:30:00Z', '--unit', JSON.stringify({ kind: 'fiscal-quarter', ...doc.fiscalYears.wholesale }), '--zone', 'America/Chicago', '--json']);
    expect(viaProfile.code).toBe(0);
    expect(viaProfile.out).toBe(direct.out);
    // 03:30Z on 1 October is still 30 September in Chicago: the last day of FY2025 (US federal FY, 31 U.S.C. 1102).
    expect(JSON.parse(viaProfile.out).period).toBe('FY2025-Q4');
  });

  it('fiscal-layout: a fiscal year (or a unit) by name', async () => {
    const viaProfile = await cli(['fiscal-layout', '--unit', 'retail', '--year', 'FY2023', '--level', 'week', '--profile', PROFILE, '--json']);
    const direct = await cli(['fiscal-layout', '--unit', JSON.stringify({ kind: 'fiscal-year', ...doc.fiscalYears.retail }), '--year', 'FY2023', '--level', 'week', '--json']);
    expect(viaProfile.code).toBe(0);
    expect(viaProfile.out).toBe(direct.out);
    expect(viaProfile.out.trim().split('\n').length).toBe(53); // FY2023 of the 4-5-4 calendar has 53 weeks (from memory)
    expect((await cli(['fiscal-layout', '--unit', 'retail-week', '--year', 'FY2023', '--level', 'week', '--profile', PROFILE, '--json'])).out).toBe(direct.out);
  });

  it('holidays and the business commands: the default calendar, or a profile calendar by name', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-cli-'));
    try {
      writeFileSync(join(dir, 'company.json'), company);
      const direct = await cli(['holidays', '--year', '2026', '--calendar', join(dir, 'company.json'), '--json']);
      expect((await cli(['holidays', '--year', '2026', '--profile', PROFILE, '--json'])).out).toBe(direct.out);
      expect((await cli(['holidays', '--year', '2026', '--calendar', 'company', '--profile', PROFILE, '--json'])).out).toBe(direct.out);
      const federal = await cli(['holidays', '--year', '2026', '--calendar', 'federal', '--profile', PROFILE, '--json']);
      expect(federal.out).toBe((await cli(['holidays', '--year', '2026', '--calendar', 'us-federal', '--json'])).out);
      expect((await cli(['business-day', '2026-11-27', '--profile', PROFILE, '--json'])).out).toContain('false');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('schedule: a rule by name, with the profile calendar it names', async () => {
    const rule = JSON.parse(JSON.stringify(doc.rules['supplier-payments'])) as Record<string, unknown>;
    rule['calendar'] = JSON.parse(company);
    const direct = await cli(['schedule', JSON.stringify(rule), '--from', '2026-01-01', '--to', '2026-07-01', '--json']);
    const viaProfile = await cli(['schedule', 'supplier-payments', '--from', '2026-01-01', '--to', '2026-07-01', '--profile', PROFILE, '--json']);
    expect(viaProfile.code).toBe(0);
    expect(viaProfile.out).toBe(direct.out);
  });

  it('bucket: a unit by name, in the profile\'s zone', async () => {
    const rows = '2025-09-30T23:30:00-05:00,1\n2025-10-01T06:00:00Z,2\n';
    const viaProfile = await cli(['bucket', '--unit', 'fiscal-quarter', '--profile', PROFILE, '--json'], rows);
    const direct = await cli(['bucket', '--unit', JSON.stringify({ kind: 'fiscal-quarter', ...doc.fiscalYears.wholesale }), '--zone', 'America/Chicago', '--json'], rows);
    expect(viaProfile.out).toBe(direct.out);
    expect(viaProfile.out.split('\n').filter(Boolean).map((l) => JSON.parse(l).period)).toEqual(['FY2025-Q4', 'FY2026-Q1']);
  });

  it('hours: the profile\'s opening hours by name answer as the scenario\'s definition given directly', async () => {
    // examples/scenario.ts holds the payments office written out by hand; the profile's entry names the "federal"
    // calendar, which is us-federal.
    const { PAYMENTS_OFFICE_HOURS } = await import('../../examples/scenario.js');
    const instants = ['2025-11-25T22:59:59Z', '2025-11-25T23:00:00.001Z', '2025-11-26T23:30:00Z', '2025-12-24T18:30:00Z'];
    const viaProfile = await cli(['hours', 'value-date', ...instants, '--cutoff', 'payments', '--hours', 'payments-office', '--profile', PROFILE, '--json']);
    const direct = await cli(['hours', 'value-date', ...instants, '--cutoff', 'payments', '--hours', JSON.stringify(PAYMENTS_OFFICE_HOURS), '--json']);
    expect(viaProfile.code).toBe(0);
    expect(viaProfile.out).toBe(direct.out);
    // After the 17:00 cut-off of Tuesday 2025-11-25 (23:00Z is 17:00 CST): the next business day; 12:30 CST on
    // 2025-12-24 is after that day's 12:00 cut-off, and Christmas Day (5 U.S.C. 6103(a)) is closed.
    expect(viaProfile.out.split('\n').filter(Boolean).map((l) => JSON.parse(l).valueDate)).toEqual(['2025-11-25', '2025-11-26', '2025-11-28', '2025-12-26']);
    // A name the profile lacks is read as a file, and refused as such.
    expect((await cli(['hours', 'open', '2025-11-25T22:00:00Z', '--hours', 'support-dsk', '--profile', PROFILE])).code).not.toBe(0);
  });

  it('every command accepts --profile; zone commands take its zone', async () => {
    for (const c of allCommands) {
      const r = await cli([c.name, '--help', '--profile', PROFILE]);
      expect({ name: c.name, code: r.code }).toEqual({ name: c.name, code: 0 });
    }
    const at = await cli(['zone-at', '2025-07-01T12:00:00Z', '--profile', PROFILE, '--json']);
    expect(at.code).toBe(0);
    expect(at.out).toContain('America/Chicago');
  });

  it('a faulty profile stops the command with every fault at its path', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-cli-'));
    try {
      const bad = JSON.parse(JSON.stringify(doc));
      bad.zone = 'America/Chicgo';
      bad.rules['month-end-close'].calendar = 'compny';
      writeFileSync(join(dir, 'bad.json'), JSON.stringify(bad));
      const r = await cli(['holidays', '--year', '2026', '--profile', join(dir, 'bad.json')]);
      expect(r.code).toBe(1);
      expect(r.err).toMatch(/zone: unknown time zone "America\/Chicgo".*did you mean "America\/Chicago"/);
      expect(r.err).toMatch(/rules\.month-end-close\.calendar: no calendar named "compny"/);
      expect((await cli(['holidays', '--year', '2026', '--profile', join(dir, 'missing.json')])).code).toBe(2);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('warehouse writes every table and the SQL', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-cli-'));
    try {
      const r = await cli(['warehouse', '--profile', PROFILE, '--out', dir, '--format', 'csv,jsonl,parquet', '--start', '2026-01-01', '--end', '2027-01-01']);
      expect(r.code).toBe(0);
      expect(readdirSync(dir).sort()).toEqual([
        'calendar_day.csv',
        'calendar_day.jsonl',
        'calendar_day.parquet',
        'load.duckdb.sql',
        'load.postgresql.sql',
        'queries.sql',
        'schedule_occurrence.csv',
        'schedule_occurrence.jsonl',
        'schedule_occurrence.parquet',
        'zone_offset_period.csv',
        'zone_offset_period.jsonl',
        'zone_offset_period.parquet',
      ]);
      expect(readFileSync(join(dir, 'calendar_day.csv'), 'utf8').trim().split('\n').length).toBe(366);
      expect((await cli(['warehouse', '--out', dir])).code).toBe(2);
      expect((await cli(['warehouse', '--profile', PROFILE, '--out', dir, '--format', 'xlsx'])).code).toBe(2);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

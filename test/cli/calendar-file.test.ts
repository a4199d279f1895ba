/**
 * `kalends calendar-file`: writes an iCalendar file (RFC 5545) from a profile's named rules or a rule given on the
 * command line. Checked with the test validator written from the RFC's ABNF (test/recurrence/icalendar-validator.ts)
 * and against the library's own occurrences of the same rule; the close dates of the demo company's profile are
 * read back from the file.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { defineProfile, formatPlainDate, listOccurrenceDayNumbers, ruleOfProfile } from '../../src/index.js';
import { validateCalendar } from '../recurrence/icalendar-validator.js';
import { cli } from './helpers.js';

const PROFILE = 'examples/otterbrook.profile.json';
const profile = defineProfile(JSON.parse(readFileSync(new URL(`../../${PROFILE}`, import.meta.url), 'utf8')) as never);

describe('kalends calendar-file', () => {
  it("writes the profile's close calendar, one all-day event per close date", async () => {
    const r = await cli(['calendar-file', 'month-end-close', '--profile', PROFILE, '--from', '2026-01-01', '--to', '2027-01-01', '--occurrences', '--stamp', '2025-12-01T00:00:00Z', '--domain', 'otterbrook.example']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    expect(validateCalendar(r.out)).toEqual([]);
    const dates = [...r.out.matchAll(/DTSTART;VALUE=DATE:(\d{4})(\d{2})(\d{2})/g)].map((m) => `${m[1]}-${m[2]}-${m[3]}`);
    const want = listOccurrenceDayNumbers(ruleOfProfile(profile, 'month-end-close'), '2026-01-01', '2027-01-01').map(formatPlainDate);
    expect(dates).toEqual(want);
    expect(dates).toHaveLength(12);
    expect(r.out.replace(/\r\n /g, '')).toContain(`UID:month-end-close@otterbrook.example/${want[0]!.replace(/-/g, '')}`);
    expect(r.out).toContain('SUMMARY:Month-end close');
  });

  it('writes an RFC 5545 rule with its VTIMEZONE, and refuses a business-day rule without --occurrences', async () => {
    const r = await cli(['calendar-file', 'DTSTART;TZID=America/New_York:20260105T090000\\nRRULE:FREQ=WEEKLY;BYDAY=MO;BYHOUR=9,15', '--from', '2026-01-01', '--to', '2027-01-01', '--title', 'Stand-up, weekly', '--stamp', '2025-12-01T00:00:00Z']);
    expect(r.code).toBe(0);
    expect(validateCalendar(r.out)).toEqual([]);
    expect(r.out).toContain('BEGIN:VTIMEZONE\r\nTZID:America/New_York');
    expect(r.out).toContain('RRULE:FREQ=WEEKLY;BYDAY=MO;BYHOUR=9,15');
    expect(r.out).toContain('SUMMARY:Stand-up\\, weekly');
    const bad = await cli(['calendar-file', 'month-end-close', '--profile', PROFILE, '--from', '2026-01-01', '--to', '2027-01-01', '--stamp', '2025-12-01T00:00:00Z']);
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('no RFC 5545 form');
    const json = await cli(['calendar-file', 'month-end-close', '--profile', PROFILE, '--from', '2026-01-01', '--to', '2026-03-01', '--occurrences', '--stamp', '2025-12-01T00:00:00Z', '--json']);
    expect(validateCalendar((JSON.parse(json.out) as { calendar: string }).calendar)).toEqual([]);
    const usage = await cli(['calendar-file', 'month-end-close', '--profile', PROFILE, '--from', '2026-01-01']);
    expect(usage.code).toBe(2);
    expect(usage.err).toContain('--to');
  });
});

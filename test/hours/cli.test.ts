/**
 * The `hours` command, run in-process through runCli. Expected instants: New York is at UTC-4 in July 2025 (Energy
 * Policy Act of 2005, section 110); 4 July 2025 is Independence Day (5 U.S.C. 6103); the early close on the
 * business day before it is common practice (US exchanges close at 13:00), modelled as a special day.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/helpers.js';

const lines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
const day = [{ open: '09:00', close: '17:00' }];
const DESK = JSON.stringify({
  zone: 'America/New_York',
  calendar: 'us-federal',
  week: { monday: day, tuesday: day, wednesday: day, thursday: day, friday: day },
  special: [{ holiday: 'Independence Day', offset: -1, close: '13:00', cutoffs: { payments: '12:00' } }],
  cutoffs: { payments: '17:00' },
});

describe('kalends hours', () => {
  it('open: open or closed at each instant and when that changes, with the zone offset', async () => {
    const r = await cli(['hours', 'open', '2025-07-03T16:00:00Z', '2025-07-03T17:30:00Z', '--hours', DESK, '--json']);
    expect(r.code).toBe(0);
    expect(lines(r.out)).toEqual([
      { at: '2025-07-03T12:00:00-04:00', open: true, changesAt: '2025-07-03T13:00:00-04:00' },
      { at: '2025-07-03T13:30:00-04:00', open: false, changesAt: '2025-07-07T09:00:00-04:00' },
    ]);
  });

  it('next-open, shift and between, from arguments; a table and the caution without --json', async () => {
    const next = await cli(['hours', 'next-open', '2025-07-03T17:30:00Z', '--hours', DESK]);
    expect(next.out).toMatch(/^at\s+nextOpen\n2025-07-03T13:30:00-04:00\s+2025-07-07T09:00:00-04:00\n$/);
    expect(next.err).toMatch(/set by the institution/);
    const shift = await cli(['hours', 'shift', '2025-07-02T19:00:00Z', 'PT8H', '--hours', DESK, '--json']);
    // Wednesday 15:00 + 2 h, Thursday 09:00-13:00 (4 h), Friday a holiday, Monday 09:00 + 2 h.
    expect(lines(shift.out)).toEqual([{ at: '2025-07-02T15:00:00-04:00', duration: 'PT8H', result: '2025-07-07T11:00:00-04:00' }]);
    const between = await cli(['hours', 'between', '2025-07-02T19:00:00Z', '2025-07-07T15:00:00Z', '--hours', DESK, '--json']);
    expect(lines(between.out)).toEqual([{ start: '2025-07-02T15:00:00-04:00', end: '2025-07-07T11:00:00-04:00', businessMs: 28_800_000, businessHours: 8 }]);
  });

  it('reads JSON Lines and plain lines from stdin, and a definition file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-hours-'));
    const file = join(dir, 'desk.json');
    writeFileSync(file, DESK);
    const r = await cli(['hours', 'between', '--hours', file, '--json'], '{"start": "2025-07-02T19:00Z", "end": "2025-07-07T15:00Z"}\n2025-07-07T15:00Z 2025-07-02T19:00Z\n');
    expect(r.code).toBe(0);
    expect(lines(r.out).map((x) => x['businessHours'])).toEqual([8, -8]);
    const v = await cli(['hours', 'value-date', '--cutoff', 'payments', '--hours', file, '--json'], '{"at": "2025-07-03T16:00:00Z"}\n{"at": 1751558400001}\n');
    // 12:00 EDT is the moved cut-off on the early-close day: in time; a millisecond later (as epoch ms) is not.
    expect(lines(v.out).map((x) => x['valueDate'])).toEqual(['2025-07-03', '2025-07-07']);
  });

  it('exit 1 for a refused definition or value, naming it; exit 2 for usage mistakes', async () => {
    const bad = await cli(['hours', 'open', '2025-07-03T16:00:00Z', '--hours', JSON.stringify({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '09:00' }] } })]);
    expect(bad.code).toBe(1);
    expect(bad.err).toMatch(/kalends hours: week\.monday\[0\]: an interval of zero length/);
    const day1 = await cli(['hours', 'shift', '2025-07-02T19:00:00Z', 'P1D', '--hours', DESK]);
    expect(day1.code).toBe(1);
    expect(day1.err).toMatch(/duration: "P1D" has calendar fields \(days\)/);
    expect((await cli(['hours', 'opne', '--hours', DESK])).err).toMatch(/expected an action, one of open, next-open, shift, between, value-date, got "opne"/);
    expect((await cli(['hours', 'open', '2025-07-03T16:00:00Z'])).code).toBe(2);
    expect((await cli(['hours', 'value-date', '2025-07-03T16:00:00Z', '--hours', DESK])).code).toBe(2);
    expect((await cli(['hours', 'between', '2025-07-03T16:00:00Z', '--hours', DESK])).code).toBe(2);
    const line = await cli(['hours', 'between', '--hours', DESK], '{"start": "2025-07-02T19:00Z", "stop": "x"}\n');
    expect([line.code, line.err]).toEqual([2, expect.stringMatching(/unknown field "stop" in a JSON line/)]);
  });

  it('has a help page in the shape of the others', async () => {
    const r = await cli(['help', 'hours']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Usage: kalends hours open \[<instant>\.\.\.\] --hours <definition> \[--json\]/);
    expect(r.out).toMatch(/\nOptions\n/);
    expect(r.out).toMatch(/\nExit codes/);
    expect(r.out).toMatch(/\nExamples\n/);
  });
});

/**
 * The workbench's small pure pieces in Node: why a rule's date moved (workbench/src/why.ts, to be swapped for the
 * recurrence layer's explanation when it lands) and reading the profile text (workbench/src/faults.ts). The
 * conventions are those of the ISDA 2006 Definitions, section 4.12; weekdays are checked with ECMAScript's own
 * Date.prototype.getUTCDay (ECMA-262 section 21.4.4.13); the holidays are those of 5 U.S.C. 6103(a).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { adjustDayNumber, calendarFromName, dayNumberFromYmd } from '../../src/index.js';
import { whyItMoved } from '../../workbench/src/why.js';
import { placeOfPath, readProfileText } from '../../workbench/src/faults.js';

const federal = calendarFromName('us-federal');
const utcWeekday = (y: number, m: number, d: number) => new Date(Date.UTC(y, m - 1, d)).getUTCDay();

describe('whyItMoved', () => {
  it('says nothing for a date that did not move', () => {
    const d = dayNumberFromYmd(2025, 6, 10);
    expect(whyItMoved(federal, d, d, 'following')).toBe('');
  });

  it('names the weekend, the holidays passed over, and the convention', () => {
    // 2025-02-15 is a Saturday; Monday 2025-02-17 is Washington's Birthday (third Monday of February).
    expect(utcWeekday(2025, 2, 15)).toBe(6);
    const u = dayNumberFromYmd(2025, 2, 15);
    const a = adjustDayNumber(federal, u, 'following');
    expect(a).toBe(dayNumberFromYmd(2025, 2, 18));
    const why = whyItMoved(federal, u, a, 'following');
    expect(why).toBe(
      "Saturday 2025-02-15 is a weekend day. Sunday 2025-02-16 is a weekend day; Monday 2025-02-17 is a holiday, Washington's Birthday. By following: the next business day, Tuesday 2025-02-18.",
    );
  });

  it('explains modified following going back when the next business day is in the next month', () => {
    // 2025-05-31 is a Saturday; the next business day, Monday 2 June, is in June: modified following takes Friday 30 May.
    expect(utcWeekday(2025, 5, 31)).toBe(6);
    const u = dayNumberFromYmd(2025, 5, 31);
    const a = adjustDayNumber(federal, u, 'modified-following');
    expect(a).toBe(dayNumberFromYmd(2025, 5, 30));
    const why = whyItMoved(federal, u, a, 'modified-following');
    expect(why).toContain('The next business day, Monday 2025-06-02, is in the next month');
    expect(why).toContain('moves it back to Friday 2025-05-30');
  });

  it('names a holiday on a weekday, under preceding', () => {
    // Thanksgiving Day 2025 is Thursday 27 November (fourth Thursday of November).
    const u = dayNumberFromYmd(2025, 11, 27);
    const a = adjustDayNumber(federal, u, 'preceding');
    expect(whyItMoved(federal, u, a, 'preceding')).toBe('Thursday 2025-11-27 is a holiday, Thanksgiving Day. By preceding: the previous business day, Wednesday 2025-11-26.');
  });
});

describe('reading the profile text', () => {
  const demo = readFileSync(fileURLToPath(new URL('../../examples/otterbrook.profile.json', import.meta.url)), 'utf8');

  it('gives the profile, or a JSON fault with its line and column, or every fault at its path', () => {
    const ok = readProfileText(demo);
    expect(ok.ok && ok.profile.id).toBe('otterbrook');
    const json = readProfileText('{\n  "id": "x",\n  "name" "y"\n}');
    expect(json.ok).toBe(false);
    if (!json.ok) {
      expect(json.faults.map((f) => f.path)).toEqual(['(JSON text)']);
      expect(json.faults[0]!.message).toMatch(/line 3/);
    }
    const bad = readProfileText(demo.replace('"layout": "4-5-4"', '"layout": "4-4-4"').replace('"zone": "America/Chicago"', '"zone": "America/Chicgo"'));
    expect(bad.ok ? [] : bad.faults.map((f) => f.path).sort()).toEqual(['fiscalYears.retail.layout', 'zone']);
  });

  it('finds the place of a path in the text, key after key', () => {
    const at = placeOfPath(demo, 'fiscalYears.retail.layout');
    expect(at).toBe(demo.indexOf('"layout"', demo.indexOf('"retail"')));
    expect(placeOfPath(demo, 'rules.supplier-payments.on[0].day')).toBe(demo.indexOf('"day"', demo.indexOf('"supplier-payments"')));
    expect(placeOfPath(demo, 'nowhere.at.all')).toBeUndefined();
  });
});

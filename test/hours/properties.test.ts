/**
 * Properties of business time that hold for every definition (fast-check, seeded): counts add up across ranges
 * and change sign when reversed; a shift by d, counted back, is d; shifting forward then back returns to an
 * instant with the same business time before it; the bulk forms equal the scalar ones; the compiled table never
 * holds more than HOURS_TABLE_MAX_YEARS years.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  HOURS_TABLE_MAX_YEARS,
  NoSessionError,
  countBusinessMs,
  countBusinessMsBulk,
  defineCalendar,
  defineHours,
  isOpen,
  nextClosingEpochMs,
  nextOpeningEpochMs,
  shiftBusinessTime,
  zoneFromId,
} from '../../src/index.js';
import { engineOfHours } from '../../src/hours/hours.js';
import { HoursModel } from './reference.js';
import { caseArb } from './arbitraries.js';

describe('properties of business time (fast-check, seeded)', () => {
  it('count(a, b) + count(b, c) = count(a, c), count(b, a) = -count(a, b), and the bulk form equals the scalar', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        if (!c) return;
        const hours = defineHours(c.def);
        const base = new HoursModel(c.def, c.calendar, c.firstDay, c.firstDay + 1, c.step).dayStart(c.firstDay + 5);
        const [a, b, d] = c.picks.map((ms) => base + ms * 3.7 + 0.25); // fractional instants over about three weeks
        const ab = countBusinessMs(hours, a!, b!);
        const bd = countBusinessMs(hours, b!, d!);
        expect(Math.abs(ab + bd - countBusinessMs(hours, a!, d!))).toBeLessThan(1e-3);
        expect(countBusinessMs(hours, b!, a!) + ab).toBe(0);
        expect(Array.from(countBusinessMsBulk(hours, [a!, b!], [b!, d!]))).toEqual([ab, bd]);
      }),
      { seed: 1602, numRuns: 60 },
    );
  });

  it('a shift by d counted back is d; forward then back lands where the same business time has passed', () => {
    fc.assert(
      fc.property(caseArb, fc.integer({ min: 1, max: 40 * 3_600_000 }), (c, d) => {
        if (!c) return;
        const hours = defineHours(c.def);
        const t = new HoursModel(c.def, c.calendar, c.firstDay, c.firstDay + 1, c.step).dayStart(c.firstDay + 5) + c.picks[0]!;
        let r: number;
        try {
          r = shiftBusinessTime(hours, t, d);
        } catch (e) {
          if (e instanceof NoSessionError) return;
          throw e;
        }
        expect(countBusinessMs(hours, t, r)).toBe(d);
        // Back by d from r lands at t, or, when t is closed, at the opening where the d began: no business time
        // lies between them.
        const back = shiftBusinessTime(hours, r, -d);
        expect(countBusinessMs(hours, t, back)).toBe(0);
        if (isOpen(hours, t)) expect(back).toBe(t);
        // The answer is the first instant: a moment earlier, less than d has passed.
        expect(countBusinessMs(hours, t, r - 1)).toBeLessThan(d);
      }),
      { seed: 1603, numRuns: 60 },
    );
  });

  it('between an opening and the next closing the hours are open; just before the opening they are closed', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        if (!c) return;
        const hours = defineHours(c.def);
        const t = new HoursModel(c.def, c.calendar, c.firstDay, c.firstDay + 1, c.step).dayStart(c.firstDay + 5) + c.picks[1]!;
        let open: number;
        try {
          open = nextOpeningEpochMs(hours, t);
        } catch (e) {
          if (e instanceof NoSessionError) return;
          throw e;
        }
        const close = nextClosingEpochMs(hours, open);
        expect(isOpen(hours, open)).toBe(true);
        expect(isOpen(hours, open - 1)).toBe(false);
        expect(isOpen(hours, (open + close) / 2)).toBe(true);
        expect(isOpen(hours, close)).toBe(false);
      }),
      { seed: 1604, numRuns: 60 },
    );
  });
});

describe('the compiled table', () => {
  it('grows with the years asked about and never holds more than HOURS_TABLE_MAX_YEARS years', () => {
    const hours = defineHours({ zone: 'Europe/Dublin', week: { monday: [{ open: '09:00', close: '17:00' }] }, years: { from: 1700, until: 2199 } });
    const engine = engineOfHours(hours);
    isOpen(hours, Date.UTC(2000, 5, 5));
    expect([engine.current!.firstYear, engine.current!.lastYear]).toEqual([1999, 2001]);
    for (let y = 2002; y < 2150; y++) isOpen(hours, Date.UTC(y, 5, 5));
    const t = engine.current!;
    expect(t.firstYear).toBe(1999);
    expect(t.lastYear).toBeGreaterThanOrEqual(2150);
    expect(t.lastYear - t.firstYear + 1).toBeLessThanOrEqual(HOURS_TABLE_MAX_YEARS);
    // Far from the table: rebuilt around the new years, still within the cap.
    isOpen(hours, Date.UTC(1720, 5, 5));
    expect(engine.current!.lastYear - engine.current!.firstYear + 1).toBeLessThanOrEqual(HOURS_TABLE_MAX_YEARS);
    expect(engine.current!.firstYear).toBeLessThanOrEqual(1719);
    // Monday 1720-06-03 09:00-17:00 in Dublin's local mean time (-00:25:21): the answers stay right after rebuilding.
    expect(countBusinessMs(hours, Date.UTC(1720, 5, 3), Date.UTC(1720, 5, 4))).toBe(8 * 3_600_000);
  });
});

describe('definitions are data', () => {
  it('compiled hours keep a frozen JSON definition (a compiled calendar kept as its definition) that defines the same hours', () => {
    const calendar = defineCalendar({ id: 'shop', weekend: ['sunday'], holidays: [{ name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 }] });
    const hours = defineHours({ zone: zoneFromId('Europe/Dublin') as never, calendar, week: { saturday: [{ open: '10:00', close: '16:00' }] } });
    expect(Object.isFrozen(hours.definition)).toBe(true);
    const again = defineHours(JSON.parse(JSON.stringify(hours.definition)));
    expect(again.definition).toEqual(hours.definition);
    expect(again.definition.zone).toBe('Europe/Dublin');
    const a = Date.UTC(2025, 11, 1);
    const b = Date.UTC(2026, 0, 1);
    expect(countBusinessMs(again, a, b)).toBe(countBusinessMs(hours, a, b));
    expect(countBusinessMs(hours, a, b)).toBe(4 * 6 * 3_600_000); // four Saturdays of December 2025, none of them the 25th
  });
});

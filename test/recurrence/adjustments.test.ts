/**
 * Why an occurrence moved: adjustmentOfOccurrence, and the `why` column of `kalends schedule`.
 *
 * Sources:
 * - [5 U.S.C. 6103] The US federal holidays: Washington's Birthday is the third Monday in February (16 February
 *   2026); Independence Day is 4 July; a holiday on a Saturday is observed on the Friday before and one on a Sunday
 *   on the Monday after (5 U.S.C. 6103(b) and Executive Order 11582).
 * - [ISDA 2006] 2006 ISDA Definitions, section 4.12: following, modified following (the next business day unless
 *   it falls in the next calendar month, then the preceding one) and preceding; modified preceding is common
 *   practice.
 * - Weekdays by @js-temporal/polyfill; a brute-force reference that walks each day with isBusinessDay and
 *   listHolidays.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  KalendsRangeError,
  KalendsTypeError,
  adjustDayNumber,
  adjustmentOfOccurrence,
  defineRule,
  formatPlainDate,
  isBusinessDay,
  listHolidays,
  listOccurrenceDayNumbers,
} from '../../src/index.js';
import { cli } from '../cli/helpers.js';

const SEED = 20261206;
const day = (iso: string): number => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10))) / 86_400_000;
const iso = (dn: number) => formatPlainDate(dn);
const why = (definition: Parameters<typeof defineRule>[0], date: string) => {
  const a = adjustmentOfOccurrence(defineRule(definition), day(date));
  return [a.unadjustedDayNumbers.map(iso), a.reason];
};

describe('adjustmentOfOccurrence names every cause that pushed a date', () => {
  it('Sunday 15 February 2026, then Monday 16th, Washington\'s Birthday [5 U.S.C. 6103], by following [ISDA 2006, 4.12]', () => {
    expect(Temporal.PlainDate.from('2026-02-15').dayOfWeek).toBe(7);
    const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following' });
    const a = adjustmentOfOccurrence(rule, day('2026-02-17'));
    expect(a.reason).toBe("weekend: sunday; holiday: Washington's Birthday (2026-02-16)");
    expect(a.moves).toEqual([
      {
        unadjustedDayNumber: day('2026-02-15'),
        keptInMonth: false,
        closedDays: [
          { dayNumber: day('2026-02-15'), weekend: 'sunday', holidays: [] },
          { dayNumber: day('2026-02-16'), weekend: undefined, holidays: ["Washington's Birthday"] },
        ],
      },
    ]);
    expect(why({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following' }, '2026-01-15')).toEqual([['2026-01-15'], '']);
  });

  it('an observed holiday and the weekend after it; a weekend and the observed holiday after it [5 U.S.C. 6103(b)]', () => {
    const july3 = { kind: 'yearly', month: 7, on: { day: 3 }, calendar: 'us-federal', convention: 'following' } as const;
    // 4 July 2026 is a Saturday: Independence Day is observed on Friday 3 July.
    expect(why(july3, '2026-07-06')).toEqual([['2026-07-03'], 'holiday: Independence Day; weekend: saturday (2026-07-04); weekend: sunday (2026-07-05)']);
    // 4 July 2027 is a Sunday: observed on Monday 5 July.
    expect(why(july3, '2027-07-06')).toEqual([['2027-07-03'], 'weekend: saturday; weekend: sunday (2027-07-04); holiday: Independence Day (2027-07-05)']);
  });

  it('several dates moved onto one occurrence are each explained', () => {
    const daily = { kind: 'days', anchor: '2026-01-01', calendar: 'us-federal', convention: 'following' } as const;
    expect(why(daily, '2026-02-17')).toEqual([
      ['2026-02-14', '2026-02-15', '2026-02-16', '2026-02-17'],
      "2026-02-14: weekend: saturday; weekend: sunday (2026-02-15); holiday: Washington's Birthday (2026-02-16) / " +
        "2026-02-15: weekend: sunday; holiday: Washington's Birthday (2026-02-16) / 2026-02-16: holiday: Washington's Birthday",
    ]);
  });

  it('modified conventions say when they turned back at the month\'s edge [ISDA 2006, 4.12]', () => {
    // Saturday 31 January 2026: the next business day is in February, so modified following takes Friday 30th.
    expect(why({ kind: 'monthly', on: { day: 'last' }, calendar: 'us-federal', convention: 'modified-following' }, '2026-01-30')).toEqual([
      ['2026-01-31'],
      'weekend: saturday; no business day after it in its month, so modified-following turned back',
    ]);
    // Saturday 1 August 2026: the previous business day is in July, so modified preceding takes Monday 3rd.
    expect(why({ kind: 'monthly', on: { day: 1 }, calendar: 'us-federal', convention: 'modified-preceding' }, '2026-08-03')).toEqual([
      ['2026-08-01'],
      'weekend: saturday; weekend: sunday (2026-08-02); no business day before it in its month, so modified-preceding turned back',
    ]);
    expect(why({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'preceding' }, '2026-02-13')).toEqual([['2026-02-15'], 'weekend: sunday; weekend: saturday (2026-02-14)']);
  });

  it('agrees with a day-by-day walk on random rules and calendars (fast-check)', () => {
    const conventions = ['following', 'modified-following', 'preceding', 'modified-preceding'] as const;
    fc.assert(
      fc.property(
        fc.integer({ min: day('2003-01-01'), max: day('2060-01-01') }),
        fc.constantFrom('us-federal', 'england-and-wales', 'euro-t2'),
        fc.constantFrom(...conventions),
        fc.integer({ min: 1, max: 31 }),
        (start, calendar, convention, dayOfMonth) => {
          const rule = defineRule({ kind: 'monthly', on: { day: dayOfMonth, whenShort: 'last-day' }, calendar, convention });
          for (const d of listOccurrenceDayNumbers(rule, start, start + 120)) {
            const a = adjustmentOfOccurrence(rule, d);
            // The rule's dates within ten days that adjust onto d, found one by one.
            const rawDates: number[] = [];
            for (let r = d - 10; r <= d + 10; r++) {
              const p = Temporal.PlainDate.from(iso(r));
              const isRuleDate = p.day === Math.min(dayOfMonth, p.daysInMonth);
              if (isRuleDate && adjustDayNumber(calendar, r, convention) === d) rawDates.push(r);
            }
            expect(a.unadjustedDayNumbers).toEqual(rawDates);
            expect(a.reason === '').toBe(rawDates.length === 1 && rawDates[0] === d);
            for (const m of a.moves) {
              const walked = m.closedDays.map((c) => c.dayNumber);
              expect(walked[0]).toBe(m.unadjustedDayNumber);
              // Every day between the rule's date and the occurrence is closed and named.
              const lo = Math.min(m.unadjustedDayNumber, d);
              const hi = Math.max(m.unadjustedDayNumber, d);
              for (let x = lo; x <= hi; x++) if (x !== d) expect(walked).toContain(x);
              for (const c of m.closedDays) {
                expect(isBusinessDay(calendar, c.dayNumber)).toBe(false);
                const wd = Temporal.PlainDate.from(iso(c.dayNumber)).dayOfWeek;
                expect(c.weekend !== undefined).toBe(wd >= 6);
                expect(c.holidays).toEqual(listHolidays(calendar, c.dayNumber, c.dayNumber + 1).map((h) => h.name));
                expect(c.weekend !== undefined || c.holidays.length > 0).toBe(true);
              }
            }
          }
        },
      ),
      { seed: SEED, numRuns: 150 },
    );
  });
});

describe('bad input', () => {
  const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following' });
  it('a date that is not an occurrence, a string, a rule of instants', () => {
    expect(() => adjustmentOfOccurrence(rule, day('2026-02-15'))).toThrow(KalendsRangeError);
    expect(() => adjustmentOfOccurrence(rule, day('2026-02-15'))).toThrow(/^dayNumber: expected an occurrence of the rule, got 20499 \(2026-02-15\)/);
    expect(() => adjustmentOfOccurrence(rule, '2026-02-17' as unknown as number)).toThrow(KalendsTypeError);
    const hourly = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });
    expect(() => adjustmentOfOccurrence(hourly, 0)).toThrow(/^rule: a rule of instants \(kind "intraday"\)/);
    expect(() => adjustmentOfOccurrence({} as never, 0)).toThrow(/^rule: expected a rule from defineRule/);
  });
});

describe('kalends schedule: why each date moved', () => {
  it('adds the unadjusted date and the reason for a rule with a convention, in the table and as JSON', async () => {
    const r = await cli(['schedule', '{"kind":"monthly","on":{"day":15},"calendar":"us-federal","convention":"following"}', '--from', '2026-01-01', '--count', '3']);
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n')).toEqual([
      'date        weekday   unadjusted  why',
      '2026-01-15  Thursday  2026-01-15  -',
      "2026-02-17  Tuesday   2026-02-15  weekend: sunday; holiday: Washington's Birthday (2026-02-16)",
      '2026-03-16  Monday    2026-03-15  weekend: sunday',
    ]);
    const j = await cli(['schedule', '{"kind":"monthly","on":{"day":15},"calendar":"us-federal","convention":"following"}', '--from', '2026-02-01', '--count', '1', '--json']);
    expect(JSON.parse(j.out)).toEqual({ date: '2026-02-17', weekday: 'Tuesday', unadjusted: '2026-02-15', why: "weekend: sunday; holiday: Washington's Birthday (2026-02-16)" });
  });
});

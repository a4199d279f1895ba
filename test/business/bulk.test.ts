/**
 * The bulk forms of the business layer (isBusinessDayBulk, countBusinessDaysBulk, shiftBusinessDaysBulk,
 * adjustDayNumberBulk): each equals its single form element by element (seeded fast-check over bundled, composed
 * and custom calendars, days up to the edges of each calendar's years, shifts short and long), and a reference
 * check against a brute-force stepper written here that walks one day at a time over a business-day flag made
 * from the calendar's listed holidays and ECMA-262 Date weekdays (getUTCDay), not from the compiled bits. The
 * convention names are those of the ISDA 2006 Definitions, section 4.12 (modified preceding: common practice).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  type BusinessCalendar,
  type BusinessDayConvention,
  BUSINESS_DAY_CONVENTIONS,
  adjustDayNumber,
  adjustDayNumberBulk,
  calendarFromName,
  countBusinessDays,
  countBusinessDaysBulk,
  defineCalendar,
  isBusinessDay,
  isBusinessDayBulk,
  listHolidays,
  shiftBusinessDays,
  shiftBusinessDaysBulk,
} from '../../src/business/index.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';
import { KalendsRangeError, KalendsTypeError } from '../../src/errors.js';

const SEED = 20261204;
const DAY_MS = 86_400_000;

const calendars: readonly BusinessCalendar[] = [
  calendarFromName('us-federal'),
  calendarFromName('england-and-wales'),
  calendarFromName('euro-t2'),
  defineCalendar({ weekend: ['friday', 'saturday'], years: { from: 2000, until: 2060 }, holidays: [{ name: 'X', kind: 'fixed', month: 3, day: 21 }] }),
  defineCalendar({ extends: 'us-federal', holidays: [{ id: 'x', name: 'Day after', kind: 'relative', to: 'thanksgiving-day', offset: 1 }] }),
  defineCalendar({ weekend: [], years: { from: 1990, until: 2030 }, holidays: [{ name: 'Y', kind: 'fixed', month: 1, day: 1 }] }),
];

/** First day and the day after the last of a calendar's years (the last year capped at 2200 for the arbitraries). */
function daysOf(cal: BusinessCalendar): { first: number; end: number } {
  return { first: dayNumberFromYmd(cal.firstYear, 1, 1), end: dayNumberFromYmd(Math.min(cal.lastYear, 2200) + 1, 1, 1) };
}

/** A calendar and days in its years, most near a random centre, some at the edges of its years. */
const inputArb = fc.constantFrom(...calendars).chain((cal) => {
  const { first, end } = daysOf(cal);
  const near = fc.integer({ min: first, max: end - 1 });
  const day = fc.oneof({ weight: 6, arbitrary: near }, { weight: 1, arbitrary: fc.integer({ min: first, max: first + 40 }) }, { weight: 1, arbitrary: fc.integer({ min: end - 40, max: end - 1 }) });
  return fc.record({ cal: fc.constant(cal), days: fc.array(day, { minLength: 0, maxLength: 60 }), ends: fc.array(day, { minLength: 60, maxLength: 60 }) });
});
const amountArb = fc.oneof(fc.integer({ min: -30, max: 30 }), fc.integer({ min: -3000, max: 3000 }));

/** The single form's answer, or the class and message of what it throws. */
function outcome(f: () => number): number | string {
  try {
    return f();
  } catch (e) {
    return `${(e as Error).name}: ${(e as Error).message}`;
  }
}

describe('bulk forms equal their single forms element by element', () => {
  it('isBusinessDayBulk and countBusinessDaysBulk', () => {
    fc.assert(
      fc.property(inputArb, ({ cal, days, ends }) => {
        const tested = isBusinessDayBulk(cal, Int32Array.from(days));
        expect(Array.from(tested)).toEqual(days.map((d) => (isBusinessDay(cal, d) ? 1 : 0)));
        const end = Int32Array.from(ends.slice(0, days.length));
        const counted = countBusinessDaysBulk(cal, days, end);
        expect(Array.from(counted)).toEqual(days.map((d, i) => countBusinessDays(cal, d, end[i]!)));
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('shiftBusinessDaysBulk, with amounts per element and one amount for all (errors and all)', () => {
    fc.assert(
      fc.property(inputArb, fc.array(amountArb, { minLength: 60, maxLength: 60 }), amountArb, ({ cal, days }, amounts, one) => {
        const n = Int32Array.from(amounts.slice(0, days.length));
        const expected = days.map((d, i) => outcome(() => shiftBusinessDays(cal, d, n[i]!)));
        const all = outcome(() => {
          const out = shiftBusinessDaysBulk(cal, Int32Array.from(days), n);
          return Array.from(out) as unknown as number;
        });
        const firstError = expected.find((x) => typeof x === 'string');
        if (firstError === undefined) expect(all).toEqual(expected);
        else expect(all).toBe(firstError);
        const byOne = days.map((d) => outcome(() => shiftBusinessDays(cal, d, one)));
        const oneError = byOne.find((x) => typeof x === 'string');
        const bulkOne = outcome(() => Array.from(shiftBusinessDaysBulk(cal, days, one)) as unknown as number);
        if (oneError === undefined) expect(bulkOne).toEqual(byOne);
        else expect(bulkOne).toBe(oneError);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('adjustDayNumberBulk, every convention (errors and all)', () => {
    fc.assert(
      fc.property(inputArb, fc.constantFrom(...BUSINESS_DAY_CONVENTIONS), ({ cal, days }, convention) => {
        const expected = days.map((d) => outcome(() => adjustDayNumber(cal, d, convention)));
        const firstError = expected.find((x) => typeof x === 'string');
        const bulk = outcome(() => Array.from(adjustDayNumberBulk(cal, Float64Array.from(days), convention)) as unknown as number);
        if (firstError === undefined) expect(bulk).toEqual(expected);
        else expect(bulk).toBe(firstError);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

// ---- reference: a brute-force stepper ------------------------------------------------------------------------

/** Business-day flags over [first, end): weekday by Date.getUTCDay, holidays as listed (observed days). */
function stepperFlags(cal: BusinessCalendar, first: number, end: number): Uint8Array {
  const flags = new Uint8Array(end - first);
  for (let d = first; d < end; d++) {
    const isoWeekday = ((new Date(d * DAY_MS).getUTCDay() + 6) % 7) + 1;
    flags[d - first] = cal.weekend.includes(isoWeekday) ? 0 : 1;
  }
  for (const h of listHolidays(cal, first, end)) flags[h.dayNumber - first] = 0;
  return flags;
}

describe('bulk forms against a brute-force day-by-day stepper (us-federal and england-and-wales, 2005..2045)', () => {
  // Shifts of up to 600 business days (under 900 days) and counts of up to 8 years from 2012..2037 stay inside.
  const first = dayNumberFromYmd(2005, 1, 1);
  const end = dayNumberFromYmd(2046, 1, 1);
  for (const name of ['us-federal', 'england-and-wales'] as const) {
    const cal = calendarFromName(name);
    const flags = stepperFlags(cal, first, end);
    const flag = (d: number) => {
      if (d < first || d >= end) throw new Error(`stepper left its range at ${d}`);
      return flags[d - first] === 1;
    };
    const monthOf = (d: number) => new Date(d * DAY_MS).getUTCMonth();
    const step = (d: number, n: number): number => {
      let x = d;
      if (n === 0) {
        while (!flag(x)) x++;
        return x;
      }
      for (let left = Math.abs(n); left > 0; ) {
        x += n > 0 ? 1 : -1;
        if (flag(x)) left--;
      }
      return x;
    };
    const adjust = (d: number, c: BusinessDayConvention): number => {
      if (c === 'none' || flag(d)) return d;
      const f = step(d, 1);
      const p = step(d, -1);
      if (c === 'following') return f;
      if (c === 'preceding') return p;
      if (c === 'modified-following') return monthOf(f) === monthOf(d) ? f : p;
      return monthOf(p) === monthOf(d) ? p : f;
    };
    it(`${name}: every day, shifts of -600..600, counts over spans of up to 8 years, every convention`, () => {
      const inner = dayNumberFromYmd(2012, 1, 1);
      const days = new Int32Array(dayNumberFromYmd(2038, 1, 1) - inner);
      for (let i = 0; i < days.length; i++) days[i] = inner + i;
      const tested = isBusinessDayBulk(cal, days);
      const amounts = Int32Array.from(days, (_, i) => ((i * 7919) % 1201) - 600);
      const shifted = shiftBusinessDaysBulk(cal, days, amounts);
      const ends = Int32Array.from(days, (d, i) => d + ((i * 104729) % 2920) - (i % 3 === 0 ? 400 : 0));
      const counted = countBusinessDaysBulk(cal, days, ends);
      const adjusted = BUSINESS_DAY_CONVENTIONS.map((c) => adjustDayNumberBulk(cal, days, c));
      let mismatches = 0;
      for (let i = 0; i < days.length; i++) {
        const d = days[i]!;
        if (tested[i] !== (flag(d) ? 1 : 0)) mismatches++;
        if (shifted[i] !== step(d, amounts[i]!)) mismatches++;
        const e = ends[i]!;
        let c = 0;
        for (let x = Math.min(d, e); x < Math.max(d, e); x++) if (flag(x)) c++;
        if (counted[i] !== (e >= d ? c : -c)) mismatches++;
        BUSINESS_DAY_CONVENTIONS.forEach((conv, k) => {
          if (adjusted[k]![i] !== adjust(d, conv)) mismatches++;
        });
      }
      expect(mismatches).toBe(0);
    });
  }
});

describe('bulk forms: arguments', () => {
  const jan = dayNumberFromYmd(2025, 1, 6);
  it('names the first bad element, with the single form\'s rule', () => {
    expect(() => isBusinessDayBulk('us-federal', [jan, jan + 0.5])).toThrow(/^dayNumbers\[1\]: expected an integer day number .* got 20094\.5/);
    expect(() => isBusinessDayBulk('us-federal', [jan, dayNumberFromYmd(1960, 1, 1)])).toThrow(/^dayNumbers\[1\]: expected a day in the years 1971\.\./);
    expect(() => shiftBusinessDaysBulk('us-federal', [jan, jan], [1, 1.5])).toThrow(/^n\[1\]: /);
    expect(() => countBusinessDaysBulk('us-federal', [jan], [Number.NaN])).toThrow(KalendsRangeError);
    expect(() => isBusinessDayBulk('us-federal', ['2025-01-06' as unknown as number])).toThrow(KalendsTypeError);
  });
  it('refuses arrays of different lengths, a wrong or short out, an unknown convention', () => {
    expect(() => countBusinessDaysBulk('us-federal', [jan, jan], [jan])).toThrow(/^end: expected 2 elements, as many as start, got 1/);
    expect(() => shiftBusinessDaysBulk('us-federal', [jan, jan], [1])).toThrow(/^n: expected 2 elements, as many as dayNumbers, got 1/);
    expect(() => shiftBusinessDaysBulk('us-federal', [jan, jan], 1, new Int32Array(1))).toThrow(/^out: expected a Int32Array of at least 2 elements, got 1/);
    expect(() => isBusinessDayBulk('us-federal', [jan], new Int32Array(1) as unknown as Uint8Array)).toThrow(/^out: expected a Uint8Array/);
    expect(() => adjustDayNumberBulk('us-federal', [jan], 'modified-folowing' as BusinessDayConvention)).toThrow(/did you mean "modified-following"/);
  });
  it('writes into the given out and returns it; empty input gives empty output', () => {
    const out = new Int32Array(3);
    expect(shiftBusinessDaysBulk('us-federal', [jan], 1, out)).toBe(out);
    expect(out[0]).toBe(jan + 1);
    expect(countBusinessDaysBulk('us-federal', [], []).length).toBe(0);
    expect(countBusinessDaysBulk('us-federal', [jan, jan], [jan, jan])[1]).toBe(0);
  });
  it('a shift past the calendar\'s years throws what the single form throws', () => {
    const last = dayNumberFromYmd(2200, 12, 1);
    const cal = defineCalendar({ years: { from: 2000, until: 2200 }, holidays: [] });
    const single = outcome(() => shiftBusinessDays(cal, last, 40));
    expect(single).toMatch(/passes the last year \(2200\)/);
    expect(outcome(() => shiftBusinessDaysBulk(cal, [last - 100, last], 40)[0]!)).toBe(single);
  });
});

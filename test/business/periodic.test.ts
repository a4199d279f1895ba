/**
 * Counts and shifts over thousands of years skip whole 400-year cycles where a calendar's years repeat
 * (src/business/periodic.ts). The proleptic Gregorian calendar repeats every 400 years (146,097 days, exactly
 * 20,871 weeks: ISO 8601-1:2019 and ECMA-262 both use it); these tests check the shortcut against the sum of the
 * counts of each year on its own (the compiled window, which never skips), on seeded random calendars with
 * every rule kind, Easter rules by both computus rules, observance and substitute days, members, rules that
 * start and stop, and one-off additions and removals.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  type BusinessCalendar,
  type CalendarDefinition,
  type HolidayRule,
  calendarFromName,
  countBusinessDays,
  defineCalendar,
  isBusinessDay,
  shiftBusinessDays,
} from '../../src/business/index.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';
import { KalendsRangeError } from '../../src/errors.js';
import { MAX_DAY_NUMBER } from '../../src/bounds.js';

const SEED = 20261210;
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
const SHIFTS = ['previous-non-weekend-day', 'next-non-weekend-day', 'nearest-non-weekend-day', 'substitute-day'] as const;

const jan1 = (y: number) => dayNumberFromYmd(y, 1, 1);

/**
 * Business days in [a, b) counted in pieces of at most 2,000 years: each piece goes through the compiled window
 * (up to 4,096 years at once), which never skips a year. The reference the long counts must equal.
 */
function inPieces(cal: BusinessCalendar, a: number, b: number): number {
  let sum = 0;
  for (let d = a; d < b; d += 730_000) sum += countBusinessDays(cal, d, Math.min(d + 730_000, b));
  return sum;
}

const ruleArb: fc.Arbitrary<HolidayRule> = fc.oneof(
  fc.record({ kind: fc.constant('fixed' as const), month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) }),
  fc.record({
    kind: fc.constant('nth-weekday' as const),
    month: fc.integer({ min: 1, max: 12 }),
    weekday: fc.constantFrom(...WEEKDAYS),
    nth: fc.constantFrom<1 | 2 | 3 | 4 | 5 | 'last'>(1, 2, 3, 4, 5, 'last'),
  }),
  fc.record({
    kind: fc.constantFrom('weekday-on-or-after' as const, 'weekday-on-or-before' as const),
    month: fc.integer({ min: 1, max: 12 }),
    day: fc.integer({ min: 1, max: 28 }),
    weekday: fc.constantFrom(...WEEKDAYS),
  }),
  fc.record({ kind: fc.constant('easter' as const), offset: fc.integer({ min: -60, max: 60 }), computus: fc.constantFrom('gregorian' as const, 'julian' as const) }),
).map((r) => ({ ...r, name: 'H' }) as HolidayRule);

const calendarArb: fc.Arbitrary<CalendarDefinition> = fc
  .record({
    weekend: fc.subarray([...WEEKDAYS], { maxLength: 3 }),
    shift: fc.constantFrom(...SHIFTS, undefined),
    rules: fc.array(
      fc.record({
        rule: ruleArb,
        from: fc.option(fc.integer({ min: 1600, max: 4000 }), { nil: undefined }),
        span: fc.option(fc.integer({ min: 0, max: 3000 }), { nil: undefined }),
        own: fc.boolean(),
      }),
      { minLength: 1, maxLength: 8 },
    ),
    oneOff: fc.option(fc.integer({ min: 1700, max: 6000 }), { nil: undefined }),
    member: fc.boolean(),
  })
  .map(({ weekend, shift, rules, oneOff, member }) => {
    const holidays = rules.map(({ rule, from, span, own }, i) => ({
      ...rule,
      id: `r${i}`,
      name: `Rule ${i}`,
      ...(from !== undefined ? { from } : {}),
      ...(from !== undefined && span !== undefined ? { until: from + span } : {}),
      // A rule of its own may opt out of the default observance.
      ...(own ? { observance: {} } : {}),
    }));
    const base: CalendarDefinition = {
      weekend,
      years: { from: 1600 },
      ...(shift && weekend.length > 0 ? { observance: Object.fromEntries(weekend.map((w) => [w, shift])) } : {}),
      holidays,
      ...(oneOff !== undefined ? { additions: [{ date: `${oneOff}-06-15`, name: 'One-off' }] } : {}),
    };
    return member ? { union: [base, { weekend: ['sunday'], years: { from: 1600 }, holidays: [{ name: 'Fixed', kind: 'fixed', month: 11, day: 11 }] }] } : base;
  }) as fc.Arbitrary<CalendarDefinition>;

/** Calendars whose definition is valid (a shift may name no weekend day, a substitute search may fail). */
function compile(def: CalendarDefinition): BusinessCalendar | undefined {
  try {
    return defineCalendar(def);
  } catch {
    return undefined;
  }
}

describe('counts over long spans equal the sum of year-by-year counts (seeded fast-check)', () => {
  it('random calendars, spans of 4,097 to 7,000 years from random years', () => {
    fc.assert(
      fc.property(calendarArb, fc.integer({ min: 1600, max: 3000 }), fc.integer({ min: 4097, max: 7000 }), fc.integer({ min: 0, max: 364 }), (def, y0, years, offset) => {
        const cal = compile(def);
        if (!cal) return;
        const a = jan1(y0) + offset;
        const b = jan1(y0 + years) + offset;
        expect(countBusinessDays(cal, a, b)).toBe(inPieces(cal, a, b));
      }),
      { seed: SEED, numRuns: 30 },
    );
  });

  it('an Easter holiday that can meet another holiday makes the count irregular: counted year by year', () => {
    // Easter Monday (Gregorian) falls from 23 March to 26 April (Meeus, Astronomical Algorithms, ch. 8), so it
    // sometimes falls on 10 April, and then the two holidays take one business day between them, not two.
    const cal = defineCalendar({
      id: 'spring',
      holidays: [
        { name: 'Easter Monday', kind: 'easter', offset: 1 },
        { name: 'Tenth of April', kind: 'fixed', month: 4, day: 10 },
      ],
    });
    const a = jan1(2000);
    const b = jan1(12_000);
    expect(countBusinessDays(cal, a, b)).toBe(inPieces(cal, a, b));
  });

  it('shifts by more than 100,000 business days land on the day the count says, in both directions', () => {
    fc.assert(
      fc.property(calendarArb, fc.integer({ min: 100_001, max: 1_500_000 }), (def, n) => {
        const cal = compile(def);
        if (!cal) return;
        let d = jan1(2000);
        while (!isBusinessDay(cal, d)) d++;
        const far = shiftBusinessDays(cal, d, n);
        expect(isBusinessDay(cal, far)).toBe(true);
        expect(countBusinessDays(cal, d, far)).toBe(n);
        expect(shiftBusinessDays(cal, far, -n)).toBe(d);
      }),
      { seed: SEED, numRuns: 40 },
    );
  });
});

describe('the bundled calendars over the whole supported range', () => {
  it('count over 30,000 years and to the last day equals the sum of 2,000-year pieces', () => {
    for (const name of ['us-federal', 'england-and-wales', 'euro-t2'] as const) {
      const cal = calendarFromName(name);
      const a = jan1(cal.firstYear);
      expect(countBusinessDays(cal, a, jan1(cal.firstYear + 30_000))).toBe(inPieces(cal, a, jan1(cal.firstYear + 30_000)));
    }
    // To the last supported day (the last day itself can be no range's exclusive end).
    const uk = calendarFromName('england-and-wales');
    const far = jan1(260_000);
    expect(countBusinessDays(uk, jan1(1995), MAX_DAY_NUMBER)).toBe(countBusinessDays(uk, jan1(1995), far) + inPieces(uk, far, MAX_DAY_NUMBER));
  }, 60_000);

  it('a shift bound to leave the supported years fails by arithmetic, with the calendar and the year it passes', () => {
    for (const n of [1e15, -1e15, Number.MAX_SAFE_INTEGER]) {
      try {
        shiftBusinessDays('us-federal', dayNumberFromYmd(2025, 1, 2), n);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(KalendsRangeError);
        expect((e as KalendsRangeError).code).toBe('out-of-range');
        expect((e as Error).message).toMatch(n > 0 ? /passes the last year \(275760\).*us-federal/ : /passes the first year \(1971\).*us-federal/);
      }
    }
  });

  it('a calendar whose years do not repeat (Julian Easter) counts up to 50,000 years one by one, then says to count less', () => {
    const cal = defineCalendar({ id: 'orthodox', holidays: [{ name: 'Orthodox Easter Monday', kind: 'easter', offset: 1, computus: 'julian' }] });
    expect(countBusinessDays(cal, jan1(2000), jan1(8000))).toBe(inPieces(cal, jan1(2000), jan1(8000)));
    try {
      countBusinessDays(cal, jan1(2000), jan1(60_000));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(KalendsRangeError);
      expect((e as KalendsRangeError).code).toBe('limit-exceeded');
      expect((e as Error).message).toMatch(/orthodox.*50000 years/);
    }
  });
});

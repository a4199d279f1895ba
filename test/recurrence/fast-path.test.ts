/**
 * The fast path of business-day rules: the recurrence engines read the compiled calendar's per-year bitsets
 * through the business layer's internal nthBusinessDayInRangeUnchecked and appendBusinessDaysUnchecked instead
 * of calling the validated isBusinessDay once per day. Each is checked (seeded fast-check, random calendars)
 * against the slow path it replaced: a day-by-day scan with the public, validated isBusinessDay. That scan is
 * itself checked against a naive evaluation made here: weekdays by ECMA-262 Date.UTC / getUTCDay, holidays from
 * the business layer's listHolidays (the observed days, which do not go through the bitsets).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  type BusinessCalendar,
  type CalendarDefinition,
  KalendsRangeError,
  countBusinessDays,
  defineCalendar,
  defineRule,
  defineUnit,
  isBusinessDay,
  listHolidays,
  listOccurrenceDayNumbers,
  nthBusinessDayOfRange,
} from '../../src/index.js';
import { appendBusinessDaysUnchecked, nthBusinessDayInRangeUnchecked } from '../../src/business/calendar.js';

const SEED = 20261208;
const DAY_MS = 86_400_000;
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
const SHIFTS = ['previous-non-weekend-day', 'next-non-weekend-day', 'nearest-non-weekend-day'] as const;

const dayOf = (y: number, m: number, d: number) => Date.UTC(y, m - 1, d) / DAY_MS;
const weekdayOf = (dn: number) => ((new Date(dn * DAY_MS).getUTCDay() + 6) % 7) + 1;
/** Year * 12 + month - 1 of a day number, by ECMA-262 Date. */
const monthIndexOf = (dn: number) => {
  const d = new Date(dn * DAY_MS);
  return d.getUTCFullYear() * 12 + d.getUTCMonth();
};

interface Case {
  readonly cal: BusinessCalendar;
  readonly firstDay: number;
  /** The day after the calendar's last year. */
  readonly endDay: number;
  /** Business days of the whole calendar, from the slow path (validated isBusinessDay, day by day). */
  readonly business: readonly number[];
}

/** Random calendars: any weekend of 0..6 days, fixed and nth-weekday holidays, observance, a one-off, 1..10 years. */
const calendarArb = fc
  .record({
    from: fc.integer({ min: 1890, max: 2090 }),
    span: fc.integer({ min: 0, max: 9 }),
    weekend: fc.subarray([...WEEKDAYS], { maxLength: 6 }),
    shift: fc.constantFrom(...SHIFTS, undefined),
    fixed: fc.uniqueArray(fc.record({ month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) }), {
      maxLength: 40,
      selector: (h) => h.month * 32 + h.day,
    }),
    nth: fc.array(
      fc.record({
        month: fc.integer({ min: 1, max: 12 }),
        weekday: fc.constantFrom(...WEEKDAYS),
        nth: fc.constantFrom<1 | 2 | 3 | 4 | 'last'>(1, 2, 3, 4, 'last'),
      }),
      { maxLength: 6 },
    ),
    oneOff: fc.option(fc.integer({ min: 0, max: 364 }), { nil: undefined }),
  })
  .map(({ from, span, weekend, shift, fixed, nth, oneOff }): Case => {
    const until = from + span;
    const firstDay = dayOf(from, 1, 1);
    const endDay = dayOf(until + 1, 1, 1);
    const def: CalendarDefinition = {
      id: 'random',
      years: { from, until },
      weekend,
      ...(shift && weekend.length > 0 ? { observance: Object.fromEntries(weekend.map((w) => [w, shift])) } : {}),
      holidays: [
        ...fixed.map((h, i) => ({ id: `f${i}`, name: `Fixed ${i}`, kind: 'fixed' as const, month: h.month, day: h.day })),
        ...nth.map((h, i) => ({ id: `n${i}`, name: `Nth ${i}`, kind: 'nth-weekday' as const, month: h.month, weekday: h.weekday, nth: h.nth })),
      ],
      ...(oneOff === undefined ? {} : { additions: [{ date: new Date((firstDay + oneOff) * DAY_MS).toISOString().slice(0, 10), name: 'One-off closure' }] }),
    };
    const cal = defineCalendar(def);
    const business: number[] = [];
    for (let d = firstDay; d < endDay; d++) if (isBusinessDay(cal, d)) business.push(d);
    return { cal, firstDay, endDay, business };
  });

/** The slow path that the fast one replaces: the nth business day of [a, b) by a scan, or NaN. */
function scanNth(c: Case, a: number, b: number, n: number): number {
  let seen = 0;
  if (n > 0) {
    for (let d = a; d < b; d++) if (isBusinessDay(c.cal, d) && ++seen === n) return d;
  } else if (n < 0) {
    for (let d = b - 1; d >= a; d--) if (isBusinessDay(c.cal, d) && ++seen === -n) return d;
  }
  return Number.NaN;
}

/** A range [a, b) inside the calendar: from a random day, short (within a word or two) or long (across years). */
const rangeArb = (c: Case) =>
  fc
    .tuple(fc.integer({ min: c.firstDay, max: c.endDay }), fc.oneof(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 1200 })))
    .map(([a, len]) => [a, Math.min(a + len, c.endDay)] as const);

const nArb = fc.oneof(fc.integer({ min: 1, max: 3 }), fc.integer({ min: -3, max: -1 }), fc.integer({ min: -400, max: 400 }).filter((n) => n !== 0));

describe('the slow-path reference', () => {
  it('validated isBusinessDay equals the naive weekend + listHolidays evaluation (getUTCDay weekdays)', () => {
    fc.assert(
      fc.property(calendarArb, (c) => {
        const weekend = new Set(c.cal.weekend);
        const holidays = new Set(listHolidays(c.cal, c.firstDay, c.endDay).map((h) => h.dayNumber));
        const naive: number[] = [];
        for (let d = c.firstDay; d < c.endDay; d++) if (!weekend.has(weekdayOf(d)) && !holidays.has(d)) naive.push(d);
        expect(c.business).toEqual(naive);
      }),
      { seed: SEED, numRuns: 40 },
    );
  });
});

describe('business layer fast path (internal, unchecked)', () => {
  it('nthBusinessDayInRangeUnchecked equals the day-by-day scan for random ranges and n (NaN when too few)', () => {
    fc.assert(
      fc.property(
        calendarArb.chain((c) => fc.tuple(fc.constant(c), fc.array(fc.tuple(rangeArb(c), nArb), { minLength: 20, maxLength: 20 }))),
        ([c, queries]) => {
          for (const [[a, b], n] of queries) {
            const got = nthBusinessDayInRangeUnchecked(c.cal, a, b, n);
            const want = scanNth(c, a, b, n);
            expect({ a, b, n, got }).toEqual({ a, b, n, got: want });
          }
        },
      ),
      { seed: SEED, numRuns: 120 },
    );
  });

  it('nthBusinessDayInRangeUnchecked at the calendar ends, year ends and 32-day word edges', () => {
    fc.assert(
      fc.property(calendarArb, fc.integer({ min: -6, max: 6 }).filter((n) => n !== 0), (c, n) => {
        const edges = [c.firstDay, c.endDay];
        for (let y = new Date(c.firstDay * DAY_MS).getUTCFullYear(); dayOf(y, 1, 1) < c.endDay; y++) {
          for (const doy of [0, 31, 32, 63, 64, 351, 352, 364, 365]) edges.push(dayOf(y, 1, 1) + doy);
        }
        for (const e of edges) {
          for (const [a, b] of [
            [e - 9, e],
            [e, e + 9],
            [e - 40, e + 40],
            [e, e],
          ] as const) {
            const lo = Math.max(a, c.firstDay);
            const hi = Math.min(b, c.endDay);
            if (lo > hi) continue;
            expect(nthBusinessDayInRangeUnchecked(c.cal, lo, hi, n)).toEqual(scanNth(c, lo, hi, n));
          }
        }
      }),
      { seed: SEED, numRuns: 30 },
    );
  });

  it('appendBusinessDaysUnchecked lists exactly the business days of random ranges, in order', () => {
    fc.assert(
      fc.property(calendarArb.chain((c) => fc.tuple(fc.constant(c), fc.array(rangeArb(c), { minLength: 8, maxLength: 8 }))), ([c, ranges]) => {
        for (const [a, b] of ranges) {
          const got: number[] = [];
          appendBusinessDaysUnchecked(c.cal, a, b, got);
          expect(got).toEqual(c.business.filter((d) => d >= a && d < b));
        }
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('ranges longer than the compiled window (4,096 years) agree with the public nthBusinessDayOfRange and a scan', () => {
    const cal = defineCalendar({
      id: 'long',
      years: { from: 1, until: 5200 },
      holidays: [{ id: 'new-year', name: 'New Year', kind: 'fixed', month: 1, day: 1 }],
      observance: { saturday: 'previous-non-weekend-day', sunday: 'next-non-weekend-day' },
    });
    const year1 = new Date(0);
    year1.setUTCFullYear(1, 0, 1); // Date.UTC would read year 1 as 1901
    const first = year1.getTime() / DAY_MS;
    const start = first + 5;
    const end = dayOf(5200, 12, 31);
    const c: Case = { cal, firstDay: first, endDay: end + 1, business: [] };
    for (const n of [1, 2, 7, -1, -2, -7]) {
      const got = nthBusinessDayInRangeUnchecked(cal, start, end, n);
      expect(got).toBe(scanNth(c, start, end, n));
      expect(got).toBe(nthBusinessDayOfRange(cal, start, end, n));
    }
    const total = countBusinessDays(cal, start, end);
    expect(nthBusinessDayInRangeUnchecked(cal, start, end, total + 1)).toBeNaN();
    expect(nthBusinessDayInRangeUnchecked(cal, start, end, -total - 1)).toBeNaN();
    expect(nthBusinessDayInRangeUnchecked(cal, start, end, total)).toBe(nthBusinessDayOfRange(cal, start, end, -1));
  });
});

describe('recurrence rules on the fast path equal the slow path', () => {
  const selectorArb = fc.oneof(fc.integer({ min: 1, max: 31 }), fc.integer({ min: -31, max: -1 }), fc.constant('last' as const));

  it('monthly business-day selectors (one or two, every 1..3 months) pick what a per-month scan picks', () => {
    fc.assert(
      fc.property(calendarArb, fc.array(selectorArb, { minLength: 1, maxLength: 2 }), fc.integer({ min: 1, max: 3 }), (c, picks, every) => {
        const on = picks.map((p) => ({ businessDay: p }));
        const rule = defineRule({ kind: 'monthly', on: on.length === 1 ? on[0]! : on, every, anchor: c.firstDay, calendar: c.cal });
        const want: number[] = [];
        const miFirst = monthIndexOf(c.firstDay);
        for (let mi = miFirst; mi <= monthIndexOf(c.endDay - 1); mi += every) {
          const a = dayOf(Math.floor(mi / 12), (mi % 12) + 1, 1);
          const b = dayOf(Math.floor((mi + 1) / 12), ((mi + 1) % 12) + 1, 1);
          const days = picks.map((p) => scanNth(c, a, b, p === 'last' ? -1 : p)).filter((d) => !Number.isNaN(d));
          want.push(...[...new Set(days)].sort((x, y) => x - y));
        }
        expect(listOccurrenceDayNumbers(rule, c.firstDay, c.endDay)).toEqual(want);
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('every k business days from an anchor, over random sub-ranges, equals the filtered business days', () => {
    fc.assert(
      fc.property(
        calendarArb.chain((c) => fc.tuple(fc.constant(c), fc.integer({ min: c.firstDay, max: c.endDay - 1 }), fc.integer({ min: 1, max: 9 }), rangeArb(c))),
        ([c, anchor, every, [a, b]]) => {
          const rule = defineRule({ kind: 'business-days', every, anchor, calendar: c.cal });
          const zero = c.business.findIndex((d) => d >= anchor);
          const base = zero < 0 ? c.business.length : zero;
          const want = c.business.filter((d, i) => d >= a && d < b && (((i - base) % every) + every) % every === 0);
          expect(listOccurrenceDayNumbers(rule, a, b)).toEqual(want);
        },
      ),
      { seed: SEED, numRuns: 120 },
    );
  });

  it('business-day selectors of fiscal quarters and years (up to the 80th from either end) pick what a scan picks', () => {
    fc.assert(
      fc.property(
        calendarArb,
        fc.integer({ min: 1, max: 12 }),
        fc.oneof(fc.integer({ min: 1, max: 80 }), fc.integer({ min: -80, max: -1 })),
        fc.boolean(),
        (c, startMonth, n, yearly) => {
          const unit = defineUnit({ kind: yearly ? 'fiscal-year' : 'fiscal-quarter', start: { month: startMonth, day: 1 }, naming: 'end-year' });
          const rule = defineRule({ kind: 'periods', unit, on: { businessDay: n }, calendar: c.cal });
          // Whole periods inside the calendar's years (a period reaching past them takes the validated scan).
          const months = yearly ? 12 : 3;
          const bounds: number[] = [];
          for (let mi = monthIndexOf(c.firstDay) - 12; mi <= monthIndexOf(c.endDay) + 12; mi++) {
            if ((((mi % 12) + 1 - startMonth) % months + months) % months !== 0) continue;
            const d = dayOf(Math.floor(mi / 12), (mi % 12) + 1, 1);
            if (d >= c.firstDay && d <= c.endDay) bounds.push(d);
          }
          if (bounds.length < 2) return;
          const want: number[] = [];
          for (let i = 0; i + 1 < bounds.length; i++) {
            const d = scanNth(c, bounds[i]!, bounds[i + 1]!, n);
            if (!Number.isNaN(d)) want.push(d);
          }
          expect(listOccurrenceDayNumbers(rule, bounds[0]!, bounds[bounds.length - 1]!)).toEqual(want);
        },
      ),
      { seed: SEED, numRuns: 80 },
    );
  });

  it('a period reaching past the calendar years still takes the validated scan: the same day, or the range error', () => {
    const cal = defineCalendar({ id: 'short', years: { from: 2020, until: 2021 } });
    const quarters = defineUnit({ kind: 'fiscal-quarter', start: { month: 11, day: 1 }, naming: 'end-year' });
    // The quarter 2021-11-01..2022-02-01 reaches past 2021: its last business day is outside the calendar.
    const last = defineRule({ kind: 'periods', unit: quarters, on: { businessDay: 'last' }, calendar: cal });
    expect(() => listOccurrenceDayNumbers(last, '2021-11-01', '2022-01-01')).toThrow(KalendsRangeError);
    // Its first business day is found inside the calendar before the scan leaves it: 2021-11-01 is a Monday.
    const first = defineRule({ kind: 'periods', unit: quarters, on: { businessDay: 1 }, calendar: cal });
    expect(listOccurrenceDayNumbers(first, '2021-11-01', '2022-01-01')).toEqual([dayOf(2021, 11, 1)]);
  });
});

/**
 * Property tests (seeded fast-check) and brute-force references for the day-count fractions.
 *
 * The references are written here from the text of each convention (2006 ISDA Definitions, section 4.16; ICMA
 * Rule 251; Business/252 as Brazilian practice counts it), with dates decoded by ECMA-262 `Date` rather than by
 * our civil layer:
 * - Actual/Actual (ISDA): walk every day of the period and count it in its year (1/366 in a leap year, 1/365 in
 *   another), as 4.16 (b) describes it;
 * - Business/252: walk every day and count those that are not a weekend day and not a holiday of a calendar
 *   defined here, then divide by 252;
 * - 30/360, 30E/360, 30E/360 (ISDA): the formula of 4.16 (f), (g), (h) with year, month, day and the length of
 *   February from `Date`;
 * - Actual/365L: look for a 29 February day by day.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  type CalendarDefinition,
  DAY_COUNT_CONVENTIONS,
  type DayCountConvention,
  KalendsRangeError,
  type YearFraction,
  type YearFractionOptions,
  defineCalendar,
  sumOfYearFractions,
  yearFractionOfDays,
  yearFractionOfDaysBulk,
} from '../../src/index.js';

const SEED = 20261215;
const DAY_MS = 86_400_000;

// ---- references --------------------------------------------------------------------------------------------

const utc = (dn: number): Date => new Date(dn * DAY_MS);
const yearOf = (dn: number): number => utc(dn).getUTCFullYear();
const isLeapRef = (year: number): boolean => {
  const t = new Date(0);
  t.setUTCFullYear(year, 1, 29);
  return t.getUTCDate() === 29;
};
const februaryLength = (year: number): number => (isLeapRef(year) ? 29 : 28);

/** Exact equality of a result with n / d (cross-multiplied; both sides stay far below 2^53 here). */
function expectFraction(f: YearFraction, n: number, d: number): void {
  expect(f.numerator * d).toBe(n * f.denominator);
  expect(f.value).toBe(f.numerator / f.denominator);
}

/** 4.16 (b), day by day: the numerator over 365 * 366. */
function actualActualIsdaRef(start: number, end: number): number {
  let num = 0;
  for (let d = start; d < end; d++) num += isLeapRef(yearOf(d)) ? 365 : 366;
  return num;
}

/** 4.16 (f), (g), (h) transcribed, with the date's fields from Date. */
function thirtyRef(convention: 'thirty-360' | 'thirty-e-360' | 'thirty-e-360-isda', start: number, end: number, termination = Number.NaN): number {
  if (start === end) return 0;
  const a = utc(start);
  const b = utc(end);
  const [y1, m1] = [a.getUTCFullYear(), a.getUTCMonth() + 1];
  const [y2, m2] = [b.getUTCFullYear(), b.getUTCMonth() + 1];
  let d1 = a.getUTCDate();
  let d2 = b.getUTCDate();
  if (convention === 'thirty-360') {
    if (d1 === 31) d1 = 30;
    if (d2 === 31 && d1 > 29) d2 = 30;
  } else if (convention === 'thirty-e-360') {
    if (d1 === 31) d1 = 30;
    if (d2 === 31) d2 = 30;
  } else {
    if (d1 === 31 || (m1 === 2 && d1 === februaryLength(y1))) d1 = 30;
    if (d2 === 31 || (m2 === 2 && d2 === februaryLength(y2) && end !== termination)) d2 = 30;
  }
  return 360 * (y2 - y1) + 30 * (m2 - m1) + (d2 - d1);
}

/** ICMA Rule 251, Actual/365L: the denominator, looking for 29 February day by day in (start, end]. */
function actual365LeapRef(start: number, end: number, annual: boolean): number {
  if (!annual) return isLeapRef(yearOf(end)) ? 366 : 365;
  for (let d = start + 1; d <= end; d++) {
    const t = utc(d);
    if (t.getUTCMonth() === 1 && t.getUTCDate() === 29) return 366;
  }
  return 365;
}

// An invented calendar for Business/252 (Otterbrook's shops close on these days; none is a real holiday list):
// a Saturday-Sunday weekend and four fixed days with no observance shift.
const HOLIDAYS: readonly (readonly [number, number])[] = [
  [1, 2],
  [3, 17],
  [8, 14],
  [12, 26],
];
const TEST_CALENDAR_DEFINITION: CalendarDefinition = {
  id: 'otterbrook-closures',
  name: 'Otterbrook shop closures (invented)',
  weekend: ['saturday', 'sunday'],
  years: { from: 1900, until: 2300 },
  holidays: HOLIDAYS.map(([month, day], k) => ({ id: `closure-${k}`, name: `Closure ${k}`, kind: 'fixed' as const, month, day, observance: {} })),
};
const TEST_CALENDAR = defineCalendar(TEST_CALENDAR_DEFINITION);

/** Business days in [start, end), day by day: not Saturday or Sunday, not one of the four closures. */
function businessDaysRef(start: number, end: number): number {
  let count = 0;
  for (let d = start; d < end; d++) {
    const t = utc(d);
    const weekday = t.getUTCDay();
    const closed = HOLIDAYS.some(([m, day]) => t.getUTCMonth() + 1 === m && t.getUTCDate() === day);
    if (weekday !== 0 && weekday !== 6 && !closed) count++;
  }
  return count;
}

// ---- arbitraries -------------------------------------------------------------------------------------------

/** Day numbers over the years Date handles everywhere (about ±273,000 years). */
const anyDay = fc.integer({ min: -99_000_000, max: 99_000_000 });
/** Day numbers of 1900-01-01 .. 2199-06-30, inside the test calendar's years. */
const modernDay = fc.integer({ min: -25_567, max: 83_920 });
/** A period start and a length of up to `days` days. */
const period = (days: number, from = anyDay) => fc.tuple(from, fc.integer({ min: 0, max: days })).map(([a, n]) => [a, a + n] as const);

/** Options that satisfy every convention's needs for the period [a, b) (a regular period around it for ICMA). */
function optionsFor(convention: DayCountConvention, a: number, b: number): YearFractionOptions | undefined {
  switch (convention) {
    case 'actual-actual-icma':
      return { couponsPerYear: 2, regularStart: a - 3, regularEnd: a - 3 + 182 };
    case 'actual-365-leap':
      return { couponsPerYear: 1 };
    case 'thirty-e-360-isda':
      return { terminationDayNumber: b };
    case 'business-252':
      return { calendar: TEST_CALENDAR };
    default:
      return undefined;
  }
}

// ---- properties --------------------------------------------------------------------------------------------

describe('Actual/Actual (ISDA) against a day-by-day walk (2006 ISDA Definitions, 4.16 (b))', () => {
  it('equals the sum of 1/366 per day in a leap year and 1/365 per other day, exactly', () => {
    fc.assert(
      fc.property(period(3000), ([a, b]) => {
        expectFraction(yearFractionOfDays('actual-actual-isda', a, b), actualActualIsdaRef(a, b), 365 * 366);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('a run of whole calendar years from 1 January is exactly that many years (no rounding accumulates)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -200_000, max: 200_000 }), fc.integer({ min: 1, max: 400 }), (year, years) => {
        const jan1 = (y: number) => {
          const t = new Date(0);
          t.setUTCFullYear(y, 0, 1);
          return t.getTime() / DAY_MS;
        };
        const f = yearFractionOfDays('actual-actual-isda', jan1(year), jan1(year + years));
        expect([f.numerator, f.denominator, f.value]).toEqual([years, 1, years]);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});

describe('Business/252 against a day-by-day walk (Brazilian practice: business days / 252)', () => {
  it('counts the business days of [start, end) of the calendar, over 252', () => {
    fc.assert(
      fc.property(period(1500, modernDay), ([a, b]) => {
        expectFraction(yearFractionOfDays('business-252', a, b, { calendar: TEST_CALENDAR }), businessDaysRef(a, b), 252);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('takes the calendar as a definition or a bundled name too (CalendarInput)', () => {
    const a = Date.UTC(2025, 0, 1) / DAY_MS;
    const b = Date.UTC(2026, 0, 1) / DAY_MS;
    expect(yearFractionOfDays('business-252', a, b, { calendar: TEST_CALENDAR }).numerator * 252).toBe(
      businessDaysRef(a, b) * yearFractionOfDays('business-252', a, b, { calendar: TEST_CALENDAR }).denominator,
    );
    // us-federal, 2025: 261 weekdays less 11 holidays on weekdays = 250 business days (5 U.S.C. 6103; the
    // business layer's reference tests check the calendar itself).
    expect(yearFractionOfDays('business-252', a, b, { calendar: 'us-federal' })).toEqual({ numerator: 125, denominator: 126, value: 250 / 252 });
  });
});

describe('30/360, 30E/360, 30E/360 (ISDA) against the formulas of 4.16 (f), (g), (h) with Date fields', () => {
  it('agree with the transcribed formulas on random periods anywhere in the range', () => {
    fc.assert(
      fc.property(period(800), fc.boolean(), ([a, b], atTermination) => {
        const termination = atTermination ? b : b + 1;
        expectFraction(yearFractionOfDays('thirty-360', a, b), thirtyRef('thirty-360', a, b), 360);
        expectFraction(yearFractionOfDays('thirty-e-360', a, b), thirtyRef('thirty-e-360', a, b), 360);
        expectFraction(
          yearFractionOfDays('thirty-e-360-isda', a, b, { terminationDayNumber: termination }),
          thirtyRef('thirty-e-360-isda', a, b, termination),
          360,
        );
      }),
      { seed: SEED, numRuns: 500 },
    );
  });

  it('agree on every period between month ends and month starts of 2000-2030 (the cases the rules are about)', () => {
    const edges: number[] = [];
    for (let y = 2000; y <= 2030; y++) {
      for (let m = 0; m < 12; m++) {
        const first = Date.UTC(y, m, 1) / DAY_MS;
        edges.push(first - 2, first - 1, first, first + 27, first + 28);
      }
    }
    const rnd = fc.sample(fc.tuple(fc.nat(edges.length - 1), fc.nat(edges.length - 1)), { seed: SEED, numRuns: 3000 });
    for (const [i, j] of rnd) {
      const [a, b] = [Math.min(edges[i]!, edges[j]!), Math.max(edges[i]!, edges[j]!)];
      for (const c of ['thirty-360', 'thirty-e-360'] as const) expectFraction(yearFractionOfDays(c, a, b), thirtyRef(c, a, b), 360);
      expectFraction(yearFractionOfDays('thirty-e-360-isda', a, b, { terminationDayNumber: b }), thirtyRef('thirty-e-360-isda', a, b, b), 360);
    }
  });
});

describe('Actual/365L and Actual/Actual (ICMA) (ICMA Rule 251)', () => {
  it('Actual/365L: days over the denominator found day by day', () => {
    fc.assert(
      fc.property(period(800), fc.constantFrom(1, 2, 4, 12), ([a, b], couponsPerYear) => {
        expectFraction(yearFractionOfDays('actual-365-leap', a, b, { couponsPerYear }), b - a, actual365LeapRef(a, b, couponsPerYear === 1));
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  it('Actual/Actual (ICMA): a whole regular period is exactly 1 / couponsPerYear, and parts add up to it', () => {
    const lengths: Readonly<Record<number, readonly [number, number]>> = { 1: [365, 366], 2: [181, 184], 4: [89, 92], 12: [28, 31] };
    fc.assert(
      fc.property(anyDay, fc.constantFrom(1, 2, 4, 12), fc.nat(1000), fc.nat(1000), (rs, couponsPerYear, u, v) => {
        const [lo, hi] = lengths[couponsPerYear]!;
        const re = rs + lo + (u % (hi - lo + 1));
        const cut = rs + (v % (re - rs + 1));
        const options = { couponsPerYear, regularStart: rs, regularEnd: re };
        const whole = yearFractionOfDays('actual-actual-icma', rs, re, options);
        expect([whole.numerator, whole.denominator]).toEqual([1, couponsPerYear]);
        const parts = sumOfYearFractions([
          yearFractionOfDays('actual-actual-icma', rs, cut, options),
          yearFractionOfDays('actual-actual-icma', cut, re, options),
        ]);
        expect(parts).toEqual(whole);
        expectFraction(yearFractionOfDays('actual-actual-icma', rs, cut, options), cut - rs, couponsPerYear * (re - rs));
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('additivity, where the convention has it: f(a, b) + f(b, c) = f(a, c), exactly', () => {
  // Actual/360 and Actual/365 (Fixed) count actual days over a fixed basis; Actual/Actual (ISDA) and Business/252
  // count each day once; 30E/360 and 30E/360 (ISDA) adjust each date by a rule of the date alone (and a middle
  // date b < c is never the Termination Date), so their day counts telescope.
  const additive: readonly DayCountConvention[] = ['actual-360', 'actual-365-fixed', 'actual-actual-isda', 'business-252', 'thirty-e-360', 'thirty-e-360-isda'];
  it('holds for random a <= b <= c', () => {
    fc.assert(
      fc.property(modernDay, fc.nat(2000), fc.nat(2000), fc.constantFrom(...additive), (a, x, y, convention) => {
        const [b, c] = [a + x, a + x + y];
        const opts = optionsFor(convention, a, c);
        const sum = sumOfYearFractions([yearFractionOfDays(convention, a, b, opts), yearFractionOfDays(convention, b, c, opts)]);
        expect(sum).toEqual(yearFractionOfDays(convention, a, c, opts));
      }),
      { seed: SEED, numRuns: 600 },
    );
  });

  it('does not hold for 30/360, whose D2 rule looks at D1 (4.16 (f)): 15 + 0 days is not 16 days', () => {
    const [a, b, c] = [Date.UTC(2024, 0, 15), Date.UTC(2024, 0, 30), Date.UTC(2024, 0, 31)].map((t) => t / DAY_MS) as [number, number, number];
    expect(yearFractionOfDays('thirty-360', a, b).numerator * 360 / yearFractionOfDays('thirty-360', a, b).denominator).toBe(15);
    expect(yearFractionOfDays('thirty-360', b, c).numerator).toBe(0); // D1 = 30, so D2 = 31 becomes 30
    expect(yearFractionOfDays('thirty-360', a, c).numerator * 360 / yearFractionOfDays('thirty-360', a, c).denominator).toBe(16); // D1 = 15: D2 stays 31
  });
});

describe('zero length, order and exactness, in every convention', () => {
  it('a period of no length is exactly 0', () => {
    fc.assert(
      fc.property(modernDay, fc.constantFrom(...DAY_COUNT_CONVENTIONS), (a, convention) => {
        expect(yearFractionOfDays(convention, a, a, optionsFor(convention, a, a))).toEqual({ numerator: 0, denominator: 1, value: 0 });
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('symmetry is refused: a reversed period throws a KalendsRangeError naming end, never a negated fraction', () => {
    fc.assert(
      fc.property(modernDay, fc.integer({ min: 1, max: 150 }), fc.constantFrom(...DAY_COUNT_CONVENTIONS), (a, n, convention) => {
        const b = a + n;
        expect(() => yearFractionOfDays(convention, b, a, optionsFor(convention, a, b))).toThrow(KalendsRangeError);
        try {
          yearFractionOfDays(convention, b, a, optionsFor(convention, a, b));
        } catch (e) {
          expect((e as KalendsRangeError).code).toBe('out-of-range');
          expect((e as Error).message).toMatch(new RegExp(`^end: .*got ${a} \\(`));
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('every result is in lowest terms with a positive denominator, and its value is numerator / denominator', () => {
    const gcd = (x: number, y: number): number => (y === 0 ? x : gcd(y, x % y));
    fc.assert(
      fc.property(period(150, modernDay), fc.constantFrom(...DAY_COUNT_CONVENTIONS), ([a, b], convention) => {
        const f = yearFractionOfDays(convention, a, b, optionsFor(convention, a, b));
        expect(f.denominator).toBeGreaterThan(0);
        expect(gcd(Math.abs(f.numerator), f.denominator)).toBe(f.numerator === 0 ? f.denominator : 1);
        expect(f.value).toBe(f.numerator / f.denominator);
        expect(Object.isFrozen(f)).toBe(true);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('the bulk form equals the scalar form to the last bit', () => {
  it('on random periods, in every convention', () => {
    fc.assert(
      fc.property(fc.array(period(1200, modernDay), { minLength: 1, maxLength: 40 }), fc.constantFrom(...DAY_COUNT_CONVENTIONS), (pairs, convention) => {
        const starts = Int32Array.from(pairs, (p) => p[0]);
        const ends = Float64Array.from(pairs, (p) => p[1]);
        const termination = Math.max(...ends);
        // A semi-annual regular period around each pair when every pair fits one, otherwise an annual one.
        const couponsPerYear = pairs.every(([a, b]) => b - a <= 170) ? 2 : 1;
        const regularStarts = Int32Array.from(starts, (a) => a - 5);
        const regularEnds = Int32Array.from(regularStarts, (rs) => rs + (couponsPerYear === 2 ? 182 : 365));
        const fits = pairs.every(([, b], i) => b <= regularEnds[i]!);
        const scalarOptions = (i: number): YearFractionOptions | undefined => {
          if (convention === 'actual-actual-icma') return { couponsPerYear, regularStart: regularStarts[i]!, regularEnd: regularEnds[i]! };
          if (convention === 'thirty-e-360-isda') return { terminationDayNumber: termination };
          if (convention === 'actual-365-leap') return { couponsPerYear: 2 };
          if (convention === 'business-252') return { calendar: TEST_CALENDAR };
          return undefined;
        };
        if (convention === 'actual-actual-icma' && !fits) return;
        const bulkOptions =
          convention === 'actual-actual-icma'
            ? { couponsPerYear, regularStarts, regularEnds }
            : convention === 'thirty-e-360-isda'
              ? { terminationDayNumber: termination }
              : convention === 'actual-365-leap'
                ? { couponsPerYear: 2 }
                : convention === 'business-252'
                  ? { calendar: TEST_CALENDAR }
                  : undefined;
        const out = yearFractionOfDaysBulk(convention, starts, ends, undefined, bulkOptions);
        const plain = yearFractionOfDaysBulk(convention, Array.from(starts), Array.from(ends), new Float64Array(pairs.length + 2), bulkOptions);
        for (let i = 0; i < pairs.length; i++) {
          const scalar = yearFractionOfDays(convention, starts[i]!, ends[i]!, scalarOptions(i)).value;
          expect(Object.is(out[i], scalar)).toBe(true);
          expect(Object.is(plain[i], scalar)).toBe(true);
        }
        expect(plain.subarray(pairs.length)).toEqual(new Float64Array(2)); // elements past n are left untouched
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

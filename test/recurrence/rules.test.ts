/**
 * Date rules on the civil calendar. Reference: @js-temporal/polyfill (the ECMA-262 Temporal reference
 * implementation) computes the expected dates the way a user would: `PlainDate.add({ months: k })` from the
 * anchor (Temporal constrains a missing day to the month's last day), `dayOfWeek`, `dayCountOfMonth`.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  DefinitionError,
  KalendsRangeError,
  KalendsTypeError,
  type Rule,
  type RuleDefinition,
  defineRule,
  describeRule,
  formatPlainDate,
  iterateOccurrenceDayNumbers,
  listOccurrenceDayNumbers,
  isOccurrenceDayNumber,
  nextOccurrenceDayNumber,
  occurrenceDayNumberBulk,
  parsePlainDate,
  previousOccurrenceDayNumber,
} from '../../src/index.js';

const SEED = 20261206;
const iso = (dn: number) => formatPlainDate(dn);
const dates = (rule: Rule, a: string, b: string) => listOccurrenceDayNumbers(rule, a, b).map(iso);
const pd = (s: string) => Temporal.PlainDate.from(s);
/** The first n occurrences on or after `from`. */
const firstOf = (rule: Rule, from: string, n: number) => Array.from(iterateOccurrenceDayNumbers(rule, from, { limit: n }));

function definitionError(f: () => unknown): DefinitionError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(DefinitionError);
    return e as DefinitionError;
  }
  throw new Error('expected a DefinitionError');
}

describe('monthly rules', () => {
  it('day 31 with "last-day" moves to the month end, and comes back to the 31st (Temporal overflow "constrain")', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 31, whenShort: 'last-day' } });
    const expected: string[] = [];
    for (let m = 1; m <= 12; m++) expected.push(pd('2024-01-01').with({ month: m }).with({ day: 31 }, { overflow: 'constrain' }).toString());
    expect(dates(rule, '2024-01-01', '2025-01-01')).toEqual(expected);
  });

  it('day 31 with "skip" leaves out the months without a 31st', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 31, whenShort: 'skip' } });
    const got = dates(rule, '2024-01-01', '2025-01-01');
    const expected = [1, 3, 5, 7, 8, 10, 12].map((m) => pd('2024-01-31').with({ month: m }).toString());
    expect(got).toEqual(expected);
  });

  it('an anchored monthly schedule is anchor + n months, so the 31st does not drift (Temporal add from the anchor)', () => {
    const rule = defineRule({ kind: 'monthly', anchor: '2025-01-31' });
    const got = firstOf(rule, '2025-01-31', 14).map(iso);
    const expected = Array.from({ length: 14 }, (_, k) => pd('2025-01-31').add({ months: k }).toString());
    expect(got).toEqual(expected);
    expect(got.slice(0, 3)).toEqual(['2025-01-31', '2025-02-28', '2025-03-31']);
  });

  it('end-of-month rule: an anchor on a month end stays on month ends; without it the day is kept', () => {
    const eom = defineRule({ kind: 'monthly', anchor: '2025-02-28', keepMonthEnd: true });
    const plain = defineRule({ kind: 'monthly', anchor: '2025-02-28' });
    const eomDates = firstOf(eom, '2025-02-01', 6);
    for (const dn of eomDates) {
      const d = pd(iso(dn));
      expect(d.day).toBe(d.daysInMonth);
    }
    expect(firstOf(plain, '2025-02-01', 3).map(iso)).toEqual(['2025-02-28', '2025-03-28', '2025-04-28']);
  });

  it('every 3 months from an anchor, computed from the anchor month', () => {
    const rule = defineRule({ kind: 'monthly', every: 3, anchor: '2024-11-30', on: { day: 30, whenShort: 'last-day' } });
    const got = firstOf(rule, '2024-01-01', 5).map(iso);
    // The schedule extends backwards from the anchor too.
    const expected = [-9, -6, -3, 0, 3].map((k) => pd('2024-11-30').add({ months: k }).toString());
    expect(got).toEqual(expected);
  });

  it('nth weekday and last weekday agree with a scan over Temporal dates (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1900, max: 2200 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 7 }),
        fc.constantFrom(1, 2, 3, 4, 5, -1, -2, -5),
        (year, month, weekday, nth) => {
          const rule = defineRule({ kind: 'monthly', on: { weekday, nth } });
          const first = Temporal.PlainDate.from({ year, month, day: 1 });
          const matching: string[] = [];
          for (let d = first; d.month === month; d = d.add({ days: 1 })) if (d.dayOfWeek === weekday) matching.push(d.toString());
          const want = nth > 0 ? matching[nth - 1] : matching[matching.length + nth];
          const got = listOccurrenceDayNumbers(rule, first.toString(), first.add({ months: 1 }).toString()).map(iso);
          expect(got).toEqual(want === undefined ? [] : [want]);
        },
      ),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('semi-monthly on the 15th and the last day', () => {
    const rule = defineRule({ kind: 'semi-monthly', days: [15, 'last'] });
    expect(dates(rule, '2024-02-01', '2024-04-01')).toEqual(['2024-02-15', '2024-02-29', '2024-03-15', '2024-03-31']);
  });

  it('quarterly on the last day of March, June, September and December; yearly in June', () => {
    const q = defineRule({ kind: 'quarterly', month: 3, on: { day: 'last' } });
    expect(dates(q, '2025-01-01', '2026-01-01')).toEqual(['2025-03-31', '2025-06-30', '2025-09-30', '2025-12-31']);
    const h = defineRule({ kind: 'half-yearly', month: 1, on: { day: 1 } });
    expect(dates(h, '2025-01-01', '2026-01-01')).toEqual(['2025-01-01', '2025-07-01']);
    const y = defineRule({ kind: 'yearly', month: 6, on: { weekday: 'monday', nth: 'last' } });
    // Memorial Day is the last Monday of May (5 U.S.C. 6103); here the last Monday of June, checked with Temporal.
    const got = dates(y, '2025-01-01', '2028-01-01');
    for (const s of got) {
      const d = pd(s);
      expect(d.month).toBe(6);
      expect(d.dayOfWeek).toBe(1);
      expect(d.add({ days: 7 }).month).toBe(7);
    }
    expect(got).toHaveLength(3);
  });

  it('restricted to months: the 5th Monday of February happens only when February 29 is a Monday', () => {
    const rule = defineRule({ kind: 'monthly', months: [2], on: { weekday: 'monday', nth: 5 } });
    const got = dates(rule, '1900-01-01', '2100-01-01');
    const expected: string[] = [];
    for (let y = 1900; y < 2100; y++) {
      const d = Temporal.PlainDate.from({ year: y, month: 2, day: 29 }, { overflow: 'constrain' });
      if (d.day === 29 && d.dayOfWeek === 1) expected.push(d.toString());
    }
    expect(got).toEqual(expected);
  });
});

describe('days and weeks', () => {
  it('every 10 days from an anchor, in both directions (Temporal add)', () => {
    const rule = defineRule({ kind: 'days', every: 10, anchor: '2025-01-01' });
    const got = dates(rule, '2024-12-01', '2025-02-01');
    const expected = [-3, -2, -1, 0, 1, 2, 3].map((k) => pd('2025-01-01').add({ days: 10 * k }).toString());
    expect(got).toEqual(expected);
  });

  it('every second week on Monday and Friday, anchored on a reference date (Temporal add)', () => {
    const rule = defineRule({ kind: 'weekly', weekdays: ['friday', 'monday'], every: 2, anchor: '2025-01-08' });
    const got = dates(rule, '2025-01-01', '2025-02-15');
    const weekStart = pd('2025-01-06');
    const expected: string[] = [];
    for (let k = 0; k < 4; k++) for (const off of [0, 4]) expected.push(weekStart.add({ weeks: 2 * k, days: off }).toString());
    expect(got).toEqual(expected.filter((d) => d < '2025-02-15'));
  });

  it('weeks starting on Sunday change which weeks count', () => {
    const mon = defineRule({ kind: 'weekly', weekdays: ['sunday', 'tuesday'], every: 2, anchor: '1997-08-05' });
    const sun = defineRule({ kind: 'weekly', weekdays: ['sunday', 'tuesday'], every: 2, anchor: '1997-08-05', weekStart: 'sunday' });
    // The two WKST examples of RFC 5545 section 3.8.5.3.
    expect(firstOf(mon, '1997-08-05', 4).map(iso)).toEqual(['1997-08-05', '1997-08-10', '1997-08-19', '1997-08-24']);
    expect(firstOf(sun, '1997-08-05', 4).map(iso)).toEqual(['1997-08-05', '1997-08-17', '1997-08-19', '1997-08-31']);
  });
});

/** Random rules of every civil kind. */
const civilRule: fc.Arbitrary<RuleDefinition> = fc.oneof(
  fc.record({ kind: fc.constant('days' as const), every: fc.integer({ min: 1, max: 40 }), anchor: fc.integer({ min: -5000, max: 30000 }) }),
  fc.record({
    kind: fc.constant('weekly' as const),
    weekdays: fc.uniqueArray(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 7 }),
    every: fc.integer({ min: 1, max: 5 }),
    anchor: fc.integer({ min: -5000, max: 30000 }),
    weekStart: fc.integer({ min: 1, max: 7 }),
  }),
  fc.record({
    kind: fc.constant('monthly' as const),
    on: fc.oneof(
      fc.record({ day: fc.integer({ min: 1, max: 28 }) }),
      fc.record({ day: fc.integer({ min: 29, max: 31 }), whenShort: fc.constantFrom('last-day' as const, 'skip' as const) }),
      fc.record({ weekday: fc.integer({ min: 1, max: 7 }), nth: fc.constantFrom(1, 2, 3, 4, -1, -2) }),
    ),
    every: fc.integer({ min: 1, max: 7 }),
    anchor: fc.integer({ min: -5000, max: 30000 }),
  }),
  fc.record({ kind: fc.constant('semi-monthly' as const), days: fc.constantFrom([1, 15] as const, [15, 'last'] as const, [10, 25] as const) }).map(
    (r) => ({ ...r, days: [...r.days] }) as RuleDefinition,
  ),
  fc.record({
    kind: fc.constantFrom('quarterly' as const, 'half-yearly' as const, 'yearly' as const),
    month: fc.integer({ min: 1, max: 12 }),
    on: fc.record({ day: fc.constantFrom(1, 15, 28, -1) }),
  }),
);

describe('generation properties (seeded fast-check)', () => {
  const bounds = fc.tuple(fc.integer({ min: 0, max: 20000 }), fc.integer({ min: 0, max: 800 }), fc.integer({ min: 0, max: 800 }));

  it('expanding [a, c) equals expanding [a, b) then [b, c); results strictly increase and match the rule', () => {
    fc.assert(
      fc.property(civilRule, bounds, (def, [a, d1, d2]) => {
        const rule = defineRule(def);
        const b = a + d1;
        const c = b + d2;
        const whole = listOccurrenceDayNumbers(rule, a, c);
        expect([...listOccurrenceDayNumbers(rule, a, b), ...listOccurrenceDayNumbers(rule, b, c)]).toEqual(whole);
        for (let i = 1; i < whole.length; i++) expect(whole[i]!).toBeGreaterThan(whole[i - 1]!);
        for (const dn of whole) expect(isOccurrenceDayNumber(rule, dn)).toBe(true);
        expect(Array.from(occurrenceDayNumberBulk(rule, a, c))).toEqual(whole);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('next and previous occurrences are consistent with the list', () => {
    fc.assert(
      fc.property(civilRule, fc.integer({ min: 0, max: 20000 }), (def, x) => {
        const rule = defineRule(def);
        const n = nextOccurrenceDayNumber(rule, x)!;
        const p = previousOccurrenceDayNumber(rule, x)!;
        expect(n).toBeGreaterThan(x);
        expect(p).toBeLessThan(x);
        const between = listOccurrenceDayNumbers(rule, p, n + 1);
        expect(between[0]).toBe(p);
        expect(between[between.length - 1]).toBe(n);
        expect(between.filter((d) => d !== x).length).toBe(2);
        expect(previousOccurrenceDayNumber(rule, n)).toBe(isOccurrenceDayNumber(rule, x) ? x : p);
        expect(nextOccurrenceDayNumber(rule, x, { inclusive: true })).toBe(isOccurrenceDayNumber(rule, x) ? x : n);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('bounds, counts and iteration', () => {
  it('start, end (exclusive) and count bound a rule', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 1 }, start: '2025-03-01', count: 3 });
    expect(dates(rule, '2020-01-01', '2030-01-01')).toEqual(['2025-03-01', '2025-04-01', '2025-05-01']);
    const ended = defineRule({ kind: 'monthly', on: { day: 1 }, end: '2025-03-01' });
    expect(nextOccurrenceDayNumber(ended, '2025-02-01')).toBeNull();
    expect(listOccurrenceDayNumbers(ended, '2025-01-01', '2025-03-01', { endInclusive: true }).map(iso)).toEqual(['2025-01-01', '2025-02-01']);
    expect([...iterateOccurrenceDayNumbers(rule, '2025-01-01')].map(iso)).toEqual(['2025-03-01', '2025-04-01', '2025-05-01']);
  });

  it('listOccurrenceDayNumbers is end-exclusive; endInclusive includes the end', () => {
    const rule = defineRule({ kind: 'days' });
    expect(listOccurrenceDayNumbers(rule, '2025-01-01', '2025-01-03').map(iso)).toEqual(['2025-01-01', '2025-01-02']);
    expect(listOccurrenceDayNumbers(rule, '2025-01-01', '2025-01-03', { endInclusive: true }).map(iso)).toEqual(['2025-01-01', '2025-01-02', '2025-01-03']);
  });

  it('iteration yields at most the limit; the bulk form is a typed array', () => {
    const rule = defineRule({ kind: 'weekly', weekdays: ['friday'] });
    const got = [...iterateOccurrenceDayNumbers(rule, '2025-01-01', { limit: 5 })];
    expect(got).toHaveLength(5);
    expect(got.map(iso)[0]).toBe('2025-01-03');
    const bulk = occurrenceDayNumberBulk(rule, '2025-01-01', '2026-01-01');
    expect(bulk).toBeInstanceOf(Int32Array);
    expect(bulk.length).toBe(52); // 2025 has 52 Fridays (January 3 to December 26), checked with Temporal below
    expect(pd('2025-01-03').add({ weeks: 51 }).toString()).toBe('2025-12-26');
  });
});

describe('bad input gives typed errors naming the value; nothing hangs', () => {
  it('day 32', () => {
    const e = definitionError(() => defineRule({ kind: 'monthly', on: { day: 32 } }));
    expect(e.issues[0]!.path).toBe('on.day');
    expect(e.message).toContain('32');
  });

  it('a weekday list with no days', () => {
    const e = definitionError(() => defineRule({ kind: 'weekly', weekdays: [] }));
    expect(e.issues[0]!.path).toBe('weekdays');
    expect(e.message).toContain('empty list');
  });

  it('an interval of 0', () => {
    const e = definitionError(() => defineRule({ kind: 'days', every: 0 }));
    expect(e.issues[0]!.path).toBe('every');
    expect(e.message).toContain('got 0');
  });

  it('the 5th Monday of February in non-leap years only (yearly every 4 years from 2025) can never happen', () => {
    const t0 = performance.now();
    const e = definitionError(() => defineRule({ kind: 'yearly', month: 2, on: { weekday: 'monday', nth: 5 }, every: 4, anchor: '2025-02-01' }));
    expect(e.issues[0]!.path).toBe('on');
    expect(e.message).toContain('never produces a date');
    expect(performance.now() - t0).toBeLessThan(5000);
  });

  it('an unbounded expansion with no limit', () => {
    const rule = defineRule({ kind: 'days' });
    let caught: unknown;
    try {
      iterateOccurrenceDayNumbers(rule, '2025-01-01').next();
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(KalendsRangeError);
    expect((caught as KalendsRangeError).code).toBe('limit-exceeded');
    expect((caught as Error).message).toContain('options.limit');
    expect(() => listOccurrenceDayNumbers(rule, '0001-01-01', '9999-01-01', { maxCount: 1000 })).toThrow(/maxCount/);
  });

  it('collects every fault with its path: missing whenShort, unknown field, count without start, bad weekday', () => {
    const e = definitionError(() =>
      defineRule({ kind: 'monthly', on: [{ day: 30 }, { weekday: 'fri' as 'friday', nth: 1 }], count: 3, colour: 'red' } as unknown as RuleDefinition),
    );
    const paths = e.issues.map((i) => i.path).sort();
    expect(paths).toEqual(['colour', 'count', 'on[0].whenShort', 'on[1].weekday']);
    expect(e.message).toContain('"fri"');
  });

  it('unknown kinds and wrong argument types', () => {
    expect(definitionError(() => defineRule({ kind: 'fortnightly' } as unknown as RuleDefinition)).issues[0]!.path).toBe('kind');
    expect(() => listOccurrenceDayNumbers({} as Rule, 0, 1)).toThrow(KalendsTypeError);
    expect(() => listOccurrenceDayNumbers(defineRule({ kind: 'days' }), '2025-13-01', '2026-01-01')).toThrow(/start/);
    expect(() => listOccurrenceDayNumbers(defineRule({ kind: 'days' }), '2025-02-01', '2025-01-01')).toThrow(/end/);
  });
});

describe('describeRule', () => {
  it('states the rule in words', () => {
    expect(describeRule(defineRule({ kind: 'semi-monthly', days: [15, 'last'] }))).toBe('the 15th and the last day of every month');
    expect(describeRule(defineRule({ kind: 'monthly', on: { weekday: 'friday', nth: -2 } }))).toBe('the second-to-last Friday of every month');
    expect(describeRule(defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-03' }))).toBe(
      'Friday of every 2nd week, counted from the week of 2025-01-03',
    );
    expect(describeRule(defineRule({ kind: 'quarterly', month: 3, on: { day: 'last' } }))).toBe('the last day of March, June, September and December, every quarter');
    expect(parsePlainDate('2025-01-03')).toBe(pd('2025-01-03').since('1970-01-01').days);
  });
});

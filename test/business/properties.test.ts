/**
 * Property tests (seeded fast-check). The compiled calendar is checked against a naive evaluator written here
 * from the rule definitions alone: dates by ECMA-262 Date.UTC arithmetic, weekdays by getUTCDay, nth weekdays by
 * scanning the month, observance and substitute days by stepping day by day, business days one day at a time.
 * Easter Sunday comes from the civil layer, which is checked against Meeus and published tables in test/civil.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  type BusinessCalendar,
  type BusinessDayConvention,
  type CalendarDefinition,
  type HolidayRule,
  adjustDayNumber,
  countBusinessDays,
  defineCalendar,
  isBusinessDay,
  listHolidays,
  nextBusinessDay,
  nthBusinessDayOfRange,
  previousBusinessDay,
  shiftBusinessDays,
} from '../../src/business/index.js';
import { easterDayNumberOfYear, julianEasterDayNumberOfYear } from '../../src/civil/index.js';

const SEED = 20260505;
const DAY_MS = 86_400_000;
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
const SHIFTS = ['previous-non-weekend-day', 'next-non-weekend-day', 'nearest-non-weekend-day', 'substitute-day'] as const;
const CONVENTIONS: readonly BusinessDayConvention[] = ['following', 'modified-following', 'preceding', 'modified-preceding', 'none'];

// ---- naive evaluator -----------------------------------------------------------------------------------------

const dayOf = (y: number, m: number, d: number) => Date.UTC(y, m - 1, d) / DAY_MS;
const weekdayOf = (dn: number) => ((new Date(dn * DAY_MS).getUTCDay() + 6) % 7) + 1;
const monthOf = (dn: number) => {
  const d = new Date(dn * DAY_MS);
  return d.getUTCFullYear() * 12 + d.getUTCMonth();
};
const existsDay = (y: number, m: number, d: number) => new Date(Date.UTC(y, m - 1, d)).getUTCDate() === d;

interface NaiveCalendar {
  readonly weekend: Set<number>;
  readonly holidays: Map<number, string[]>;
}

function naiveRuleDay(r: HolidayRule, y: number, byId: Map<string, number>): number | undefined {
  if ((r.from !== undefined && y < r.from) || (r.until !== undefined && y > r.until)) return undefined;
  switch (r.kind) {
    case 'fixed':
      return existsDay(y, r.month, r.day) ? dayOf(y, r.month, r.day) : undefined;
    case 'nth-weekday': {
      const matches: number[] = [];
      for (let d = 1; existsDay(y, r.month, d); d++) {
        if (weekdayOf(dayOf(y, r.month, d)) === WEEKDAYS.indexOf(r.weekday) + 1) matches.push(dayOf(y, r.month, d));
      }
      return r.nth === 'last' ? matches[matches.length - 1] : matches[r.nth - 1];
    }
    case 'weekday-on-or-after':
    case 'weekday-on-or-before': {
      if (!existsDay(y, r.month, r.day)) return undefined;
      let d = dayOf(y, r.month, r.day);
      while (weekdayOf(d) !== WEEKDAYS.indexOf(r.weekday) + 1) d += r.kind === 'weekday-on-or-after' ? 1 : -1;
      return d;
    }
    case 'easter':
      return (r.computus === 'julian' ? julianEasterDayNumberOfYear(y) : easterDayNumberOfYear(y)) + r.offset;
    case 'relative': {
      const base = byId.get(r.to);
      return base === undefined ? undefined : base + r.offset;
    }
  }
}

/** Every holiday observed in years y0..y1 (evaluating rules over a wider span), by day number. */
function naive(def: CalendarDefinition, y0: number, y1: number): NaiveCalendar {
  const weekend = new Set((def.weekend ?? ['saturday', 'sunday']).map((w) => WEEKDAYS.indexOf(w) + 1));
  const rules = def.holidays ?? [];
  const inst: { actual: number; rule: HolidayRule; seq: number }[] = [];
  for (let y = y0 - 3; y <= y1 + 3; y++) {
    const byId = new Map<string, number>();
    for (const r of rules) {
      const d = naiveRuleDay(r, y, byId);
      if (d === undefined) continue;
      if (r.id) byId.set(r.id, d);
      inst.push({ actual: d, rule: r, seq: inst.length });
    }
  }
  inst.sort((a, b) => a.actual - b.actual || a.seq - b.seq);
  const shiftOf = (r: HolidayRule, d: number) => {
    const obs = r.observance ?? def.observance ?? {};
    return obs[WEEKDAYS[weekdayOf(d) - 1]!];
  };
  const isWeekend = (d: number) => weekend.has(weekdayOf(d));
  const occupied = new Set<number>();
  for (const i of inst) if (!shiftOf(i.rule, i.actual)) occupied.add(i.actual);
  const holidays = new Map<number, string[]>();
  const add = (d: number, name: string) => holidays.set(d, [...(holidays.get(d) ?? []), name]);
  for (const i of inst) {
    const s = shiftOf(i.rule, i.actual);
    let d = i.actual;
    if (s === 'previous-non-weekend-day') do d--; while (isWeekend(d));
    else if (s === 'next-non-weekend-day') do d++; while (isWeekend(d));
    else if (s === 'nearest-non-weekend-day') {
      let b = d;
      let a = d;
      do b--; while (isWeekend(b));
      do a++; while (isWeekend(a));
      d = d - b < a - d ? b : a;
    } else if (s === 'substitute-day') do d++; while (isWeekend(d) || occupied.has(d));
    if (s) occupied.add(d);
    add(d, i.rule.name);
  }
  for (const r of def.removals ?? []) holidays.delete(dayOfIso(r.date));
  for (const a of def.additions ?? []) add(dayOfIso(a.date), a.name);
  return { weekend, holidays };
}

function dayOfIso(iso: string): number {
  const [y, m, d] = iso.split('-').map(Number) as [number, number, number];
  return dayOf(y, m, d);
}
const isoOf = (dn: number) => new Date(dn * DAY_MS).toISOString().slice(0, 10);
const naiveBusiness = (n: NaiveCalendar, d: number) => !n.weekend.has(weekdayOf(d)) && !n.holidays.has(d);

// ---- random definitions --------------------------------------------------------------------------------------

const weekendArb = fc.subarray([...WEEKDAYS], { minLength: 0, maxLength: 3 });
const observanceArb = (weekend: readonly string[]) =>
  fc.option(
    fc.record(Object.fromEntries(weekend.map((w) => [w, fc.constantFrom(...SHIFTS)])), { requiredKeys: [] }),
    { nil: undefined },
  );

function ruleArb(index: number, weekend: readonly string[]): fc.Arbitrary<HolidayRule> {
  const common = {
    id: fc.constant(`r${index}`),
    name: fc.constant(`Rule ${index}`),
    observance: observanceArb(weekend),
  };
  const kinds: fc.Arbitrary<HolidayRule>[] = [
    fc.record({ ...common, kind: fc.constant('fixed' as const), month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) }),
    fc.record({ ...common, kind: fc.constant('fixed' as const), month: fc.constantFrom(1, 2, 12), day: fc.constantFrom(1, 29, 31) }).filter(
      (r) => r.day <= (r.month === 2 ? 29 : 31),
    ),
    fc.record({
      ...common,
      kind: fc.constant('nth-weekday' as const),
      month: fc.integer({ min: 1, max: 12 }),
      weekday: fc.constantFrom(...WEEKDAYS),
      nth: fc.constantFrom<1 | 2 | 3 | 4 | 5 | 'last'>(1, 2, 3, 4, 5, 'last'),
    }),
    fc.record({
      ...common,
      kind: fc.constantFrom('weekday-on-or-after' as const, 'weekday-on-or-before' as const),
      month: fc.integer({ min: 1, max: 12 }),
      day: fc.integer({ min: 1, max: 28 }),
      weekday: fc.constantFrom(...WEEKDAYS),
    }),
    fc.record({ ...common, kind: fc.constant('easter' as const), offset: fc.integer({ min: -60, max: 60 }), computus: fc.constantFrom('gregorian' as const, 'julian' as const) }),
  ];
  if (index > 0) {
    kinds.push(
      fc.record({ ...common, kind: fc.constant('relative' as const), to: fc.integer({ min: 0, max: index - 1 }).map((i) => `r${i}`), offset: fc.integer({ min: -40, max: 40 }) }),
    );
  }
  return fc.oneof(...kinds).chain((r) =>
    fc.record({ from: fc.option(fc.integer({ min: 1995, max: 2030 }), { nil: undefined }) }).map(({ from }) => {
      const out: Record<string, unknown> = { ...r };
      if (out['observance'] === undefined) delete out['observance'];
      if (from !== undefined) out['from'] = from;
      return out as unknown as HolidayRule;
    }),
  );
}

/** A random leaf definition (weekend, rules, a default observance, additions) for the years 1990..2060. */
const definitionArb: fc.Arbitrary<CalendarDefinition> = weekendArb.chain((weekend) =>
  fc.integer({ min: 0, max: 8 }).chain((count) =>
    fc
      .record({
        rules: count === 0 ? fc.constant([] as HolidayRule[]) : fc.tuple(...Array.from({ length: count }, (_, i) => ruleArb(i, weekend))),
        observance: observanceArb(weekend),
        additions: fc.array(fc.integer({ min: dayOf(1995, 1, 1), max: dayOf(2055, 12, 31) }), { maxLength: 3 }),
      })
      .map(({ rules, observance, additions }) => {
        const def: Record<string, unknown> = {
          weekend,
          years: { from: 1990, until: 2060 },
          holidays: rules,
          additions: additions.map((d, i) => ({ date: isoOf(d), name: `Extra ${i}` })),
        };
        if (observance !== undefined) def['observance'] = observance;
        return def as CalendarDefinition;
      }),
  ),
);

/** Adds removals picked from the naive holidays, so that each removes something. */
function withRemovals(def: CalendarDefinition, picks: readonly number[]): CalendarDefinition {
  const n = naive({ ...def, additions: [] }, 1995, 2055);
  const days = [...n.holidays.keys()].filter((d) => d >= dayOf(1995, 1, 1) && d <= dayOf(2055, 12, 31)).sort((a, b) => a - b);
  if (days.length === 0) return def;
  const removals = [...new Set(picks.map((p) => days[p % days.length]!))].map((d) => ({ date: isoOf(d), name: 'removed' }));
  return { ...def, removals, additions: (def.additions ?? []).filter((a) => !removals.some((r) => r.date === a.date)) };
}

const rangeArb = fc.record({ start: fc.integer({ min: dayOf(2000, 1, 1), max: dayOf(2045, 12, 31) }), length: fc.integer({ min: 0, max: 900 }) });

describe('compiled calendar == naive day-by-day evaluation (random rule sets, random ranges)', () => {
  it('agrees on every day, on counts, shifts, nth business days and holiday lists', () => {
    fc.assert(
      fc.property(definitionArb, fc.array(fc.nat(), { maxLength: 2 }), rangeArb, fc.integer({ min: -40, max: 40 }), (raw, picks, { start, length }, n) => {
        const def = withRemovals(raw, picks);
        const cal = defineCalendar(def);
        const nv = naive(def, 1995, 2055);
        const end = start + length;
        let count = 0;
        const business: number[] = [];
        for (let d = start; d < end; d++) {
          const b = naiveBusiness(nv, d);
          expect(isBusinessDay(cal, d), isoOf(d)).toBe(b);
          if (b) {
            count++;
            business.push(d);
          }
        }
        expect(countBusinessDays(cal, start, end)).toBe(count);
        expect(countBusinessDays(cal, end, start)).toBe(count === 0 ? 0 : -count); // +0, never -0
        // shift by stepping one day at a time
        let d = start;
        let left = Math.abs(n);
        if (n === 0) while (!naiveBusiness(nv, d)) d++;
        while (left > 0) {
          d += n > 0 ? 1 : -1;
          if (naiveBusiness(nv, d)) left--;
        }
        expect(isoOf(shiftBusinessDays(cal, start, n))).toBe(isoOf(d));
        if (business.length > 0) {
          expect(nthBusinessDayOfRange(cal, start, end, 1)).toBe(business[0]);
          expect(nthBusinessDayOfRange(cal, start, end, -1)).toBe(business[business.length - 1]);
          const k = (Math.abs(n) % business.length) + 1;
          expect(nthBusinessDayOfRange(cal, start, end, k)).toBe(business[k - 1]);
          expect(nthBusinessDayOfRange(cal, start, end, -k)).toBe(business[business.length - k]);
        }
        const listed = listHolidays(cal, start, end).map((h) => `${h.date} ${h.name}`).sort();
        const expected: string[] = [];
        for (const [day, names] of nv.holidays) if (day >= start && day < end) for (const name of names) expected.push(`${isoOf(day)} ${name}`);
        expect(listed).toEqual(expected.sort());
      }),
      { seed: SEED, numRuns: 150 },
    );
  });
});

// ---- properties of the operations ----------------------------------------------------------------------------

const bundled = ['us-federal', 'england-and-wales', 'euro-t2'] as const;
const calendars: readonly (BusinessCalendar | string)[] = [
  ...bundled,
  defineCalendar({ weekend: ['friday', 'saturday'], holidays: [{ name: 'X', kind: 'fixed', month: 3, day: 21 }] }),
  defineCalendar({ extends: 'us-federal', holidays: [{ id: 'x', name: 'Day after', kind: 'relative', to: 'thanksgiving-day', offset: 1 }] }),
];
const calArb = fc.constantFrom(...calendars);
const dayArb = fc.integer({ min: dayOf(2012, 1, 1), max: dayOf(2090, 12, 31) }); // shifts of 2000 business days stay within 2002..

describe('business-day properties (bundled and composed calendars)', () => {
  it('adjusting twice equals adjusting once; adjusted days are business days (except none)', () => {
    fc.assert(
      fc.property(calArb, dayArb, fc.constantFrom(...CONVENTIONS), (cal, d, c) => {
        const once = adjustDayNumber(cal, d, c);
        expect(adjustDayNumber(cal, once, c)).toBe(once);
        if (c !== 'none') expect(isBusinessDay(cal, once)).toBe(true);
        else expect(once).toBe(d);
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('modified following and modified preceding never leave the month', () => {
    fc.assert(
      fc.property(calArb, dayArb, (cal, d) => {
        expect(monthOf(adjustDayNumber(cal, d, 'modified-following'))).toBe(monthOf(d));
        expect(monthOf(adjustDayNumber(cal, d, 'modified-preceding'))).toBe(monthOf(d));
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('shift(d, n) then count(d, result) gives n for a business day d (n - 1 from a non-business day when n > 0)', () => {
    fc.assert(
      fc.property(calArb, dayArb, fc.integer({ min: -2000, max: 2000 }), (cal, d, n) => {
        const r = shiftBusinessDays(cal, d, n);
        expect(isBusinessDay(cal, r)).toBe(true);
        const c = countBusinessDays(cal, d, r);
        if (isBusinessDay(cal, d) || n <= 0) expect(c).toBe(n);
        else expect(c).toBe(n - 1);
        if (n > 0) expect(r).toBeGreaterThan(d);
        if (n < 0) expect(r).toBeLessThan(d);
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('next and previous business days are business days with none strictly between', () => {
    fc.assert(
      fc.property(calArb, dayArb, (cal, d) => {
        const next = nextBusinessDay(cal, d);
        const prev = previousBusinessDay(cal, d);
        expect(isBusinessDay(cal, next) && isBusinessDay(cal, prev)).toBe(true);
        expect(countBusinessDays(cal, d + 1, next)).toBe(0);
        expect(countBusinessDays(cal, prev + 1, d)).toBe(0);
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });

  it('counts are additive over adjacent ranges, in either order', () => {
    fc.assert(
      fc.property(calArb, dayArb, dayArb, dayArb, (cal, a, b, c) => {
        expect(countBusinessDays(cal, a, b) + countBusinessDays(cal, b, c)).toBe(countBusinessDays(cal, a, c));
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });
});

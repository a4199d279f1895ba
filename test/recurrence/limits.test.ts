/**
 * Limits, options and units of the recurrence layer (issues 12 and 13): large counts are located without listing
 * them, limits and options objects are validated, lists are capped, results say their unit, and names every
 * object inherits never reach a lookup. Expected dates are checked against @js-temporal/polyfill (ECMA-262
 * Temporal) arithmetic or against the layer's own listing (a different code path from the count's location).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  DefinitionError,
  KalendsRangeError,
  KalendsSyntaxError,
  KalendsTypeError,
  type Rule,
  type RuleDefinition,
  defineRule,
  defineSchedule,
  defineUnit,
  formatPlainDate,
  isOccurrenceDayNumber,
  isOccurrenceEpochMs,
  iterateOccurrenceDayNumbers,
  iterateOccurrenceEpochMs,
  listOccurrenceDayNumbers,
  listOccurrenceEpochMs,
  nextOccurrenceDayNumber,
  nextOccurrenceEpochMs,
  occurrenceDayNumberBulk,
  occurrenceEpochMsBulk,
  parseInstant,
  parsePlainDate,
  parseRecurrenceRule,
  formatRecurrenceRule,
  previousOccurrenceDayNumber,
  previousOccurrenceEpochMs,
} from '../../src/index.js';

const SEED = 20261211;
const pd = (s: string) => Temporal.PlainDate.from(s);
const dn = (s: string) => parsePlainDate(s);

function thrown(f: () => unknown): Error {
  try {
    f();
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected an error');
}

describe('large counts are located, not listed', () => {
  it('a count of 10,000,000 days, Mondays (RFC 5545 text) and weeks ends where Temporal arithmetic says', () => {
    // 0.1 listed every occurrence when the rule was defined: seconds for these rules.
    const days = defineRule({ kind: 'days', start: '2025-01-01', count: 10_000_000 });
    const lastDay = pd('2025-01-01').add({ days: 9_999_999 }).toString();
    expect(formatPlainDate(previousOccurrenceDayNumber(days, '+275000-01-01')!)).toBe(lastDay);
    expect(nextOccurrenceDayNumber(days, lastDay)).toBeNull();
    // 2025-01-06 is a Monday; COUNT=10000000 Mondays end 9,999,999 weeks later.
    const mondays = parseRecurrenceRule('DTSTART;VALUE=DATE:20250106\nRRULE:FREQ=DAILY;COUNT=10000000;BYDAY=MO');
    const lastMonday = pd('2025-01-06').add({ weeks: 9_999_999 }).toString();
    expect(formatPlainDate(previousOccurrenceDayNumber(mondays, '+275000-01-01')!)).toBe(lastMonday);
    expect(nextOccurrenceDayNumber(mondays, lastMonday)).toBeNull();
    const twice = defineRule({ kind: 'weekly', weekdays: ['tuesday', 'friday'], start: '2025-01-01', count: 10_000_000 });
    // Two a week from Friday 2025-01-03: the 10,000,000th is the Tuesday 4,999,999 weeks after 2025-01-07.
    expect(formatPlainDate(previousOccurrenceDayNumber(twice, '+275000-01-01')!)).toBe(pd('2025-01-07').add({ weeks: 4_999_999 }).toString());
  });

  it('where the count ends agrees with listing for every locatable kind (random rules and counts, seeded)', () => {
    const ruleArb: fc.Arbitrary<RuleDefinition> = fc.oneof(
      fc.record({ kind: fc.constant('days' as const), every: fc.integer({ min: 1, max: 30 }) }),
      fc.record({ kind: fc.constant('weekly' as const), weekdays: fc.uniqueArray(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 4 }), every: fc.integer({ min: 1, max: 3 }) }),
      fc.record({
        kind: fc.constant('monthly' as const),
        on: fc.oneof(
          fc.record({ day: fc.integer({ min: 29, max: 31 }), whenShort: fc.constant('skip' as const) }),
          fc.record({ weekday: fc.integer({ min: 1, max: 7 }), nth: fc.constantFrom(5, -5, 1, -1) }),
        ),
        every: fc.integer({ min: 1, max: 7 }),
      }),
      fc.record({ kind: fc.constant('yearly' as const), month: fc.integer({ min: 1, max: 12 }), on: fc.record({ weekday: fc.integer({ min: 1, max: 7 }), nth: fc.constantFrom(5, -5) }) }),
    );
    fc.assert(
      fc.property(ruleArb, fc.integer({ min: dn('1900-01-01'), max: dn('2100-01-01') }), fc.integer({ min: 1, max: 3000 }), (def, start, count) => {
        const open = defineRule({ ...def, anchor: start } as RuleDefinition);
        const counted = defineRule({ ...def, anchor: start, start, count } as RuleDefinition);
        const listed = Array.from(iterateOccurrenceDayNumbers(open, start, { limit: count }));
        const last = previousOccurrenceDayNumber(counted, dn('+200000-01-01'));
        expect(last).toBe(listed[count - 1]);
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('RFC 5545 rules with a time of day and business-day steps locate their count too', () => {
    // More than the 100,000 a listing may count, so only the located path can define it.
    const text = 'DTSTART;TZID=Asia/Kolkata:20250106T090000\nRRULE:FREQ=WEEKLY;COUNT=200000';
    const rule = parseRecurrenceRule(text);
    const last = Temporal.ZonedDateTime.from('2025-01-06T09:00[Asia/Kolkata]').add({ weeks: 199_999 }).epochMilliseconds;
    expect(previousOccurrenceEpochMs(rule, '+275000-01-01T00:00Z')).toBe(last);
    // Across daylight-saving changes: the 2,000th Monday at 09:00 in New York (Temporal ZonedDateTime add).
    const ny = parseRecurrenceRule('DTSTART;TZID=America/New_York:20250106T090000\nRRULE:FREQ=WEEKLY;COUNT=2000');
    const lastNy = Temporal.ZonedDateTime.from('2025-01-06T09:00[America/New_York]').add({ weeks: 1999 }).epochMilliseconds;
    expect(previousOccurrenceEpochMs(ny, '+275000-01-01T00:00Z')).toBe(lastNy);
    expect(nextOccurrenceEpochMs(ny, lastNy)).toBeNull();
    const steps = defineRule({ kind: 'business-days', every: 5, calendar: 'us-federal', start: '2025-01-02', count: 2_000_000 });
    const lastStep = previousOccurrenceDayNumber(steps, '+275000-01-01')!;
    const firstTen = Array.from(iterateOccurrenceDayNumbers(steps, '2025-01-01', { limit: 10 }));
    expect(firstTen[0]).toBe(dn('2025-01-02'));
    expect(nextOccurrenceDayNumber(steps, lastStep)).toBeNull();
  });

  it('counts that must be found by listing are bounded at 100,000 and say what to do; a fiscal count no longer fails inside', () => {
    // 0.1: count 3e6 on a business month end took seconds; count 1e7 on fiscal quarters ran 7 s then threw an
    // internal ordinal error.
    const monthEnds = thrown(() => defineRule({ kind: 'monthly', on: { businessDay: 'last' }, calendar: 'us-federal', start: '2025-01-01', count: 3_000_000 }));
    expect(monthEnds).toBeInstanceOf(DefinitionError);
    expect((monthEnds as DefinitionError).issues[0]!.path).toBe('count');
    expect(monthEnds.message).toMatch(/^count: expected at most 100000 for this rule, got 3000000: .*give an end instead of a count/);
    const quarters = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    expect(() => defineRule({ kind: 'periods', unit: quarters, on: { day: 1 }, start: '2025-01-01', count: 10_000_000 })).toThrow(DefinitionError);
    const some = defineRule({ kind: 'periods', unit: quarters, on: { day: 1 }, start: '2025-01-01', count: 8 });
    // Fiscal quarters from 1 October: 1 January, 1 April, 1 July, 1 October (the unit's definition).
    expect(listOccurrenceDayNumbers(some, '2025-01-01', '2030-01-01').map(formatPlainDate)).toEqual([
      '2025-01-01', '2025-04-01', '2025-07-01', '2025-10-01', '2026-01-01', '2026-04-01', '2026-07-01', '2026-10-01',
    ]);
  });

  it('RFC 5545 states no upper bound for COUNT and INTERVAL; ours are 10,000,000 and 1,000,000, refused in the text', () => {
    for (const [part, at] of [
      ['COUNT=10000001', 'COUNT='],
      ['INTERVAL=1000001', 'INTERVAL='],
      ['COUNT=0', 'COUNT='],
    ] as const) {
      const text = `DTSTART;VALUE=DATE:20250101\nRRULE:FREQ=DAILY;${part}`;
      const e = thrown(() => parseRecurrenceRule(text));
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      expect((e as KalendsSyntaxError).code).toBe('out-of-range');
      expect((e as KalendsSyntaxError).position).toBe(text.indexOf(at) + at.length);
    }
  });
});

describe('limits and options objects are validated', () => {
  const daily = defineRule({ kind: 'days' });

  it('maxCount: Infinity, NaN, -1, 0, 1.5 and "5" are refused with typed errors (0.1 ran 14 s on Infinity)', () => {
    for (const bad of [Number.POSITIVE_INFINITY, Number.NaN, -1, 0, 1.5, 10_000_001]) {
      const e = thrown(() => listOccurrenceDayNumbers(daily, '2025-01-01', '2025-02-01', { maxCount: bad }));
      expect(e, String(bad)).toBeInstanceOf(KalendsRangeError);
      expect(e.message).toMatch(/^options\.maxCount: expected an integer from 1 to 10000000/);
    }
    const s = thrown(() => listOccurrenceDayNumbers(daily, '2025-01-01', '2025-02-01', { maxCount: '5' as never }));
    expect(s).toBeInstanceOf(KalendsTypeError);
    expect(s.message).toContain('pass the number 5, not a string');
    expect(() => iterateOccurrenceDayNumbers(daily, '2025-01-01', { limit: -1 })).toThrow(/^options\.limit: expected an integer/);
  });

  it('options objects: null and arrays are refused, an unknown key is refused with a suggestion, enums are checked', () => {
    const nul = thrown(() => listOccurrenceDayNumbers(daily, '2025-01-01', '2025-02-01', null as never));
    expect(nul).toBeInstanceOf(KalendsTypeError);
    expect(nul.message).toMatch(/^options: expected an options object or undefined, got null/);
    const typo = thrown(() => listOccurrenceDayNumbers(daily, '2025-01-01', '2025-02-01', { endInclusve: true } as never));
    expect(typo).toBeInstanceOf(KalendsTypeError);
    expect((typo as KalendsTypeError).code).toBe('unknown-name');
    expect(typo.message).toContain('did you mean "endInclusive"?');
    expect(() => nextOccurrenceDayNumber(daily, '2025-01-01', { inclusiv: true } as never)).toThrow(/did you mean "inclusive"/);
    expect(() => nextOccurrenceDayNumber(daily, '2025-01-01', { inclusive: 'yes' } as never)).toThrow(/^options\.inclusive: expected true or false/);
    expect(() => formatRecurrenceRule(parseRecurrenceRule('DTSTART;VALUE=DATE:20250101\nRRULE:FREQ=DAILY'), { newline: '\r' as never })).toThrow(/^options\.newline/);
    expect(() => parseRecurrenceRule('FREQ=DAILY', { start: '2025-01-01', zon: 'UTC' } as never)).toThrow(/did you mean "zone"/);
    expect(() => defineSchedule({ start: '2025-01-01', end: '2026-01-01', step: { months: 1 }, stub: 'front' as never })).toThrow(/^options\.stub: expected one of/);
    expect(() => defineSchedule({ start: '2025-01-01', end: '2026-01-01', step: { month: 1 } as never })).toThrow(/did you mean "months"/);
    expect(() => defineSchedule({ start: '2025-01-01', end: '2026-01-01', step: { months: 1 }, keepMonthEnd: 1 as never })).toThrow(/^options\.keepMonthEnd/);
    expect(() => defineSchedule(null as never)).toThrow(KalendsTypeError);
  });

  it('a list that must pass its cap fails before building, and says how to page', () => {
    const e = thrown(() => listOccurrenceDayNumbers(daily, '0001-01-01', '9999-01-01', { maxCount: 1000 }));
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect((e as KalendsRangeError).code).toBe('limit-exceeded');
    expect(e.message).toMatch(/^options\.maxCount: the range holds more than 1000 occurrences.*iterateOccurrenceDayNumbers with a limit/);
    // By default at most 1,000,000 (about 2,700 years of days).
    expect(() => occurrenceDayNumberBulk(daily, '-100000-01-01', '+100000-01-01')).toThrow(/more than 1000000 occurrences/);
  });

  it('a schedule of more than a million periods fails by arithmetic', () => {
    expect(() => defineSchedule({ start: '-100000-01-01', end: '+100000-01-01', step: { days: 1 } })).toThrow(/more than 1000000 periods/);
  });
});

describe('results say their unit', () => {
  const dates = defineRule({ kind: 'monthly', on: { day: 15 } });
  const instants = defineRule({ kind: 'intraday', zone: 'UTC', every: { hours: 6 }, anchor: '2026-01-01T00:00', clock: 'elapsed' });

  it('each form answers in its unit', () => {
    expect(dates.values).toBe('dates');
    expect(occurrenceDayNumberBulk(dates, '2026-01-01', '2026-03-01')).toEqual(Int32Array.of(dn('2026-01-15'), dn('2026-02-15')));
    const t0 = parseInstant('2026-01-01T00:00:00Z').epochMs;
    expect(occurrenceEpochMsBulk(instants, t0, t0 + 86_400_000)).toEqual(Float64Array.from([0, 6, 12, 18], (h) => t0 + h * 3_600_000));
    expect(listOccurrenceEpochMs(instants, '2026-01-01T00:00Z', '2026-01-01T12:00Z')).toEqual([t0, t0 + 6 * 3_600_000]);
    expect(isOccurrenceEpochMs(instants, t0 + 6 * 3_600_000 + 0.5)).toBe(true); // within that millisecond
    expect(isOccurrenceDayNumber(dates, dn('2026-02-15'))).toBe(true);
    expect(nextOccurrenceEpochMs(instants, t0 + 0.5)).toBe(t0 + 6 * 3_600_000);
    expect(Array.from(iterateOccurrenceEpochMs(instants, t0, { limit: 2 }))).toEqual([t0, t0 + 6 * 3_600_000]);
  });

  it('the form of the other unit is a typed error naming the function to call', () => {
    const cases: [() => unknown, string][] = [
      [() => listOccurrenceDayNumbers(instants, 0, 1), 'listOccurrenceEpochMs'],
      [() => listOccurrenceEpochMs(dates, 0, 1), 'listOccurrenceDayNumbers'],
      [() => occurrenceDayNumberBulk(instants, 0, 1), 'occurrenceEpochMsBulk'],
      [() => nextOccurrenceDayNumber(instants, 0), 'nextOccurrenceEpochMs'],
      [() => previousOccurrenceEpochMs(dates, 0), 'previousOccurrenceDayNumber'],
      [() => isOccurrenceEpochMs(dates, 0), 'isOccurrenceDayNumber'],
      [() => iterateOccurrenceDayNumbers(instants, 0, { limit: 1 }), 'iterateOccurrenceEpochMs'],
    ];
    for (const [f, name] of cases) {
      const e = thrown(f);
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e.message).toMatch(new RegExp(`^rule: a rule of .* call ${name} instead`));
    }
  });

  it('isOccurrence… takes a number and names the parser for text', () => {
    expect(() => isOccurrenceDayNumber(dates, '2026-02-15' as never)).toThrow(/^dayNumber: .*parsePlainDate\(text\)/);
    expect(() => isOccurrenceEpochMs(instants, '2026-01-01T06:00Z' as never)).toThrow(/^epochMs: .*parseInstant\(text\)\.epochMs/);
  });
});

describe('names of our own and names every object inherits', () => {
  it('skipped "shift-forward" (0.1) is refused with "later" suggested; "later" and the overlap choice "later" follow Temporal', () => {
    const base = { kind: 'intraday' as const, zone: 'America/New_York', every: { minutes: 30 }, anchor: '2025-11-02T00:00', clock: 'wall' as const };
    const e = thrown(() => defineRule({ ...base, skipped: 'shift-forward' as never }));
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e.message).toMatch(/^skipped: expected one of "later", "drop", got "shift-forward"; did you mean "later"\?/);
    // 01:30 happened twice on 2025-11-02 in New York (IANA tz: DST ends the first Sunday of November at 02:00).
    const later = defineRule({ ...base, repeated: 'later' });
    const at = (d: 'earlier' | 'later') => Temporal.PlainDateTime.from('2025-11-02T01:30').toZonedDateTime('America/New_York', { disambiguation: d }).epochMilliseconds;
    const got = listOccurrenceEpochMs(later, at('earlier') - 1, at('later') + 1);
    expect(got).toContain(at('later'));
    expect(got).not.toContain(at('earlier'));
  });

  it('a "__proto__" key read from JSON stays a key and is refused; inherited names are no rule kinds', () => {
    const e = thrown(() => defineRule(JSON.parse('{"kind":"days","__proto__":{"every":0}}') as RuleDefinition));
    expect(e).toBeInstanceOf(DefinitionError);
    expect((e as DefinitionError).issues.map((i) => i.path)).toEqual(['__proto__']);
    for (const kind of ['constructor', 'toString', '__proto__']) {
      expect((thrown(() => defineRule({ kind } as never)) as DefinitionError).issues[0]!.path).toBe('kind');
    }
    expect(() => defineRule({ kind: 'weekly', weekdays: ['constructor'] } as never)).toThrow(/^weekdays\[0\]: expected a weekday/);
  });

  it('RFC 5545 field errors quote the text as written and point into it (0.1 quoted its own ISO form)', () => {
    const text = 'DTSTART:19970230T090000\nRRULE:FREQ=DAILY;COUNT=3';
    const e = thrown(() => parseRecurrenceRule(text));
    expect(e).toBeInstanceOf(KalendsSyntaxError);
    expect(e.message).toContain('"19970230T090000"');
    expect(e.message).not.toContain('1997-02-30');
    expect((e as KalendsSyntaxError).position).toBe(text.indexOf('30T'));
  });
});

/** Keep the helper type in use for readers of the file. */
export type { Rule };

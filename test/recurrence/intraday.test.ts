/**
 * Intraday rules across daylight-saving changes in America/New_York (IANA tz database: DST starts the second
 * Sunday of March at 02:00, ends the first Sunday of November at 02:00; 2025-03-09 and 2025-11-02). Expected
 * instants come from @js-temporal/polyfill's ZonedDateTime with the named disambiguation (ECMA-262 Temporal),
 * an outside reference for the zone step.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import { DefinitionError, type Rule, defineRule, describeRule, listOccurrenceEpochMs, isOccurrenceEpochMs, nextOccurrenceEpochMs, previousOccurrenceEpochMs } from '../../src/index.js';

const NY = 'America/New_York';
const SEED = 20261208;

function at(wall: string, disambiguation: 'earlier' | 'later' | 'compatible' = 'compatible'): number {
  return Temporal.PlainDateTime.from(wall).toZonedDateTime(NY, { disambiguation }).epochMilliseconds;
}
function local(ms: number): string {
  const z = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(NY);
  return `${z.toPlainDateTime().toString().slice(11, 16)}${z.offset}`;
}
const list = (rule: Rule, a: string, b: string) => listOccurrenceEpochMs(rule, at(a), at(b)).map(local);

describe('wall-clock mode across the spring gap (2025-03-09)', () => {
  it('a skipped time moves forward by the gap (as Temporal "later" and "compatible" do in a gap) and lands between the regular steps', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { minutes: 45 }, anchor: '2025-03-09T00:00', clock: 'wall' });
    expect(list(rule, '2025-03-09T00:00', '2025-03-09T04:00')).toEqual(['00:00-05:00', '00:45-05:00', '01:30-05:00', '03:00-04:00', '03:15-04:00', '03:45-04:00']);
    // 02:15 does not exist; Temporal's compatible disambiguation gives 03:15 EDT too.
    expect(local(at('2025-03-09T02:15'))).toBe('03:15-04:00');
  });

  it('"drop" leaves out the skipped time', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { minutes: 45 }, anchor: '2025-03-09T00:00', clock: 'wall', skipped: 'drop' });
    expect(list(rule, '2025-03-09T00:00', '2025-03-09T04:00')).toEqual(['00:00-05:00', '00:45-05:00', '01:30-05:00', '03:00-04:00', '03:45-04:00']);
  });

  it('hourly on the wall clock: a day of 23 hours has 23 occurrences (02:00 moves to 03:00, which already is one)', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { hours: 1 }, anchor: '2025-01-01T00:00', clock: 'wall' });
    expect(listOccurrenceEpochMs(rule, at('2025-03-09T00:00'), at('2025-03-10T00:00'))).toHaveLength(23);
  });
});

describe('wall-clock mode across the autumn overlap (2025-11-02)', () => {
  it('"earlier" (default): a repeated time happens once, at its first instant', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { minutes: 30 }, anchor: '2025-11-02T00:00', clock: 'wall' });
    const got = listOccurrenceEpochMs(rule, at('2025-11-02T00:00'), at('2025-11-02T03:00'));
    expect(got).toEqual(
      ['2025-11-02T00:00', '2025-11-02T00:30', '2025-11-02T01:00', '2025-11-02T01:30', '2025-11-02T02:00', '2025-11-02T02:30'].map((w) => at(w, 'earlier')),
    );
  });

  it('"both": a repeated time happens twice, in time order', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { minutes: 30 }, anchor: '2025-11-02T00:00', clock: 'wall', repeated: 'both' });
    expect(list(rule, '2025-11-02T00:00', '2025-11-02T02:30')).toEqual([
      '00:00-04:00', '00:30-04:00', '01:00-04:00', '01:30-04:00', '01:00-05:00', '01:30-05:00', '02:00-05:00',
    ]);
    expect(listOccurrenceEpochMs(rule, at('2025-11-02T01:00', 'later'), at('2025-11-02T01:00', 'later') + 1)).toEqual([at('2025-11-02T01:00', 'later')]);
  });
});

describe('elapsed-time mode', () => {
  it('fixed steps of absolute time: local times shift by the change of offset (Temporal add of hours)', () => {
    const rule = defineRule({ kind: 'intraday', zone: NY, every: { hours: 1 }, anchor: '2025-03-09T00:00', clock: 'elapsed' });
    const start = Temporal.ZonedDateTime.from({ timeZone: NY, year: 2025, month: 3, day: 9 });
    const expected = [0, 1, 2, 3].map((h) => start.add({ hours: h }).epochMilliseconds);
    expect(listOccurrenceEpochMs(rule, expected[0]!, expected[3]! + 1)).toEqual(expected);
    expect(expected.map(local)).toEqual(['00:00-05:00', '01:00-05:00', '03:00-04:00', '04:00-04:00']);
  });

  it('skipped/repeated settings are rejected for elapsed mode; the clock must be stated; a step of 0 is an error', () => {
    expect(() => defineRule({ kind: 'intraday', zone: NY, every: { hours: 1 }, anchor: '2025-03-09T00:00', clock: 'elapsed', skipped: 'drop' })).toThrow(/skipped/);
    expect(() => defineRule({ kind: 'intraday', zone: NY, every: { hours: 1 }, anchor: '2025-03-09T00:00' } as never)).toThrow(/clock/);
    const e = (() => {
      try {
        defineRule({ kind: 'intraday', zone: NY, every: { minutes: 0 }, anchor: '2025-03-09T00:00', clock: 'wall' });
      } catch (err) {
        return err as DefinitionError;
      }
      return undefined;
    })();
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e!.issues[0]!.path).toBe('every');
  });
});

describe('intraday properties (seeded fast-check)', () => {
  it('split ranges agree, results strictly increase, next/previous are consistent', () => {
    const base = at('2025-01-01T00:00');
    fc.assert(
      fc.property(
        fc.constantFrom(15, 30, 45, 60, 90, 180),
        fc.constantFrom('wall', 'elapsed') as fc.Arbitrary<'wall' | 'elapsed'>,
        fc.constantFrom('later', 'drop') as fc.Arbitrary<'later' | 'drop'>,
        fc.constantFrom('earlier', 'both') as fc.Arbitrary<'earlier' | 'both'>,
        fc.integer({ min: 0, max: 330 * 24 }),
        fc.integer({ min: 1, max: 48 }),
        fc.integer({ min: 1, max: 48 }),
        (minutes, clock, skipped, repeated, startHour, h1, h2) => {
          const def = clock === 'wall'
            ? { kind: 'intraday' as const, zone: NY, every: { minutes }, anchor: '2025-01-01T00:10', clock, skipped, repeated }
            : { kind: 'intraday' as const, zone: NY, every: { minutes }, anchor: '2025-01-01T00:10', clock };
          const rule = defineRule(def);
          const a = base + startHour * 3_600_000;
          const b = a + h1 * 3_600_000;
          const c = b + h2 * 3_600_000;
          const whole = listOccurrenceEpochMs(rule, a, c);
          expect([...listOccurrenceEpochMs(rule, a, b), ...listOccurrenceEpochMs(rule, b, c)]).toEqual(whole);
          for (let i = 1; i < whole.length; i++) expect(whole[i]!).toBeGreaterThan(whole[i - 1]!);
          for (const t of whole.slice(0, 3)) expect(isOccurrenceEpochMs(rule, t)).toBe(true);
          const n = nextOccurrenceEpochMs(rule, a)!;
          expect(n).toBeGreaterThan(a);
          expect(previousOccurrenceEpochMs(rule, n)! <= a || listOccurrenceEpochMs(rule, a + 1, n).length === 0).toBe(true);
        },
      ),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('describes the DST modes', () => {
    expect(describeRule(defineRule({ kind: 'intraday', zone: NY, every: { minutes: 30 }, anchor: '2025-01-01T09:00', clock: 'wall', skipped: 'drop', repeated: 'both' }))).toBe(
      'every 30 minutes on the America/New_York wall clock from 2025-01-01T09:00; a time skipped by a daylight-saving gap is dropped; a repeated time happens twice',
    );
  });
});

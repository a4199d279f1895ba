/**
 * ISO 8601 durations (ISO 8601-1:2019 5.5.2, from memory for the exact clauses; the Temporal grammar as a
 * reference library) and the month-end clamp rule, checked against @js-temporal/polyfill Duration.from,
 * PlainDate.add and PlainDateTime.add.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  durationFromFields,
  exactMsOfDuration,
  formatDuration,
  formatPlainDate,
  formatPlainDateTime,
  negateDuration,
  parseDuration,
  parsePlainDate,
  parsePlainDateTime,
  shiftDayNumber,
  shiftWallMs,
  type Duration,
} from '../../src/instant/index.js';
import { KalendsRangeError, KalendsTypeError } from '../../src/errors.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

const SEED = 8601;
const fieldsOf = (d: Duration) => ({
  years: d.years,
  months: d.months,
  weeks: d.weeks,
  days: d.days,
  hours: d.hours,
  minutes: d.minutes,
  seconds: d.seconds,
  milliseconds: d.milliseconds,
});
const temporalDateOf = (dn: number) => Temporal.PlainDate.from('1970-01-01').add({ days: dn });
const dayNumberOfTemporal = (t: Temporal.PlainDate) => t.since('1970-01-01', { largestUnit: 'days' }).days;

describe('parseDuration: examples', () => {
  it('P1Y2M10DT2H30M (the ISO 8601 style example) keeps every part apart', () => {
    expect(fieldsOf(parseDuration('P1Y2M10DT2H30M'))).toEqual({ years: 1, months: 2, weeks: 0, days: 10, hours: 2, minutes: 30, seconds: 0, milliseconds: 0 });
  });

  it('PnW alone, and weeks combined with other parts (as Temporal allows)', () => {
    expect(parseDuration('P3W').weeks).toBe(3);
    expect(fieldsOf(parseDuration('P1Y2W'))).toEqual(fieldsOf(durationFromFields(Temporal.Duration.from('P1Y2W'))));
  });

  it('a fraction on the last exact component spreads downward: PT1.5H is 1 hour 30 minutes (as Temporal)', () => {
    expect(fieldsOf(parseDuration('PT1.5H'))).toMatchObject({ hours: 1, minutes: 30 });
    expect(fieldsOf(parseDuration('PT0.5M'))).toMatchObject({ minutes: 0, seconds: 30 });
    expect(fieldsOf(parseDuration('PT7.008S'))).toMatchObject({ seconds: 7, milliseconds: 8 });
    expect(parseDuration('PT1,5H').minutes).toBe(30);
  });

  it('digits finer than a millisecond are truncated toward zero', () => {
    expect(parseDuration('PT0.0015S').milliseconds).toBe(1);
    expect(parseDuration('-PT0.0015S').milliseconds).toBe(-1);
  });

  it('a leading sign applies to every part', () => {
    expect(fieldsOf(parseDuration('-P1DT2H'))).toMatchObject({ days: -1, hours: -2 });
    expect(parseDuration('+P1D').days).toBe(1);
    expect(parseDuration('-P1D').sign).toBe(-1);
    expect(parseDuration('PT0S').sign).toBe(0);
  });

  it('the result is frozen, and zero fields are +0, never -0', () => {
    const d = parseDuration('-P1D');
    expect(Object.isFrozen(d)).toBe(true);
    expect(Object.is(d.years, 0)).toBe(true);
  });
});

describe('formatDuration', () => {
  it('writes the normal form', () => {
    expect(formatDuration(durationFromFields({ days: 30 }))).toBe('P30D');
    expect(formatDuration(durationFromFields({ seconds: 0 }))).toBe('PT0S');
    expect(formatDuration(durationFromFields({ minutes: -1, milliseconds: -500 }))).toBe('-PT1M0.5S');
    expect(formatDuration(durationFromFields({ milliseconds: 1500 }))).toBe('PT1.5S');
    expect(formatDuration(durationFromFields({ hours: 36 }))).toBe('PT36H');
  });

  it('agrees with Temporal Duration.toString() on generated durations', () => {
    fc.assert(
      fc.property(durationText, (s) => {
        const t = Temporal.Duration.from(s);
        const ours = parseDuration(s);
        // compare the millisecond fields, then the text without Temporal's micro/nano digits
        expect(fieldsOf(ours)).toEqual(fieldsOf(durationFromFields({ ...fieldsOf(t as unknown as Duration) })));
        const tMs = Temporal.Duration.from({ ...fieldsOf(t as unknown as Duration) });
        expect(formatDuration(ours)).toBe(tMs.toString());
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });

  it('parse(format(d)) is d', () => {
    fc.assert(
      fc.property(durationText, (s) => {
        const d = parseDuration(s);
        expect(parseDuration(formatDuration(d))).toEqual(d);
      }),
      { seed: SEED + 1, numRuns: 2000 },
    );
  });
});

/** Durations written from the grammar: sign, date parts, time parts, an optional fraction on the last exact part. */
const durationText: fc.Arbitrary<string> = fc
  .record({
    sign: fc.constantFrom('', '-', '+'),
    y: fc.option(fc.integer({ min: 0, max: 3000 }), { nil: undefined }),
    mo: fc.option(fc.integer({ min: 0, max: 500 }), { nil: undefined }),
    w: fc.option(fc.integer({ min: 0, max: 500 }), { nil: undefined }),
    d: fc.option(fc.integer({ min: 0, max: 5000 }), { nil: undefined }),
    h: fc.option(fc.integer({ min: 0, max: 100_000 }), { nil: undefined }),
    mi: fc.option(fc.integer({ min: 0, max: 100_000 }), { nil: undefined }),
    s: fc.option(fc.integer({ min: 0, max: 1_000_000 }), { nil: undefined }),
    frac: fc.option(fc.string({ unit: fc.constantFrom(...'0123456789'.split('')), minLength: 1, maxLength: 9 }), { nil: undefined }),
  })
  .map((r) => {
    let date = '';
    if (r.y !== undefined) date += `${r.y}Y`;
    if (r.mo !== undefined) date += `${r.mo}M`;
    if (r.w !== undefined) date += `${r.w}W`;
    if (r.d !== undefined) date += `${r.d}D`;
    const parts: string[] = [];
    if (r.h !== undefined) parts.push(`${r.h}H`);
    if (r.mi !== undefined) parts.push(`${r.mi}M`);
    if (r.s !== undefined) parts.push(`${r.s}S`);
    if (r.frac !== undefined && parts.length > 0) {
      const last = parts.pop()!;
      parts.push(`${last.slice(0, -1)}.${r.frac}${last.slice(-1)}`);
    }
    const time = parts.join('');
    if (date === '' && time === '') return `${r.sign}PT0S`;
    return `${r.sign}P${date}${time ? `T${time}` : ''}`;
  });

describe('durationFromFields and helpers', () => {
  it('rejects mixed signs, non-integers, unknown fields and non-objects, naming the field', () => {
    expect(() => durationFromFields({ days: 1, hours: -1 })).toThrow(/hours: -1 has the opposite sign/);
    expect(() => durationFromFields({ days: 1.5 })).toThrow(/days/);
    expect(() => durationFromFields({ dayz: 1 } as never)).toThrow(/^fields\.dayz: unknown duration field; did you mean "days"\?/);
    expect(() => durationFromFields(null as never)).toThrow(KalendsTypeError);
    expect(() => durationFromFields({ years: 2 ** 32 })).toThrow(KalendsRangeError);
  });

  it('negateDuration and exactMsOfDuration', () => {
    expect(formatDuration(negateDuration(parseDuration('P1M2D')))).toBe('-P1M2D');
    expect(exactMsOfDuration(parseDuration('PT1H1M1.001S'))).toBe(3_661_001);
    expect(exactMsOfDuration(parseDuration('P1D'))).toBe(0); // a day is a calendar part, not 86,400,000 ms
  });
});

describe('shiftDayNumber: the month-end clamp rule', () => {
  const shift = (date: string, dur: string, overflow?: 'constrain' | 'reject') =>
    formatPlainDate(shiftDayNumber(parsePlainDate(date), parseDuration(dur), overflow ? { overflow } : undefined));

  it('31 January + P1M is the last day of February (Temporal overflow "constrain")', () => {
    expect(shift('2025-01-31', 'P1M')).toBe('2025-02-28');
    expect(shift('2024-01-31', 'P1M')).toBe('2024-02-29');
    expect(Temporal.PlainDate.from('2024-01-31').add('P1M').toString()).toBe('2024-02-29');
  });

  it('29 February + P1Y is 28 February (Temporal agrees)', () => {
    expect(shift('2024-02-29', 'P1Y')).toBe('2025-02-28');
    expect(Temporal.PlainDate.from('2024-02-29').add('P1Y').toString()).toBe('2025-02-28');
  });

  it('years and months come first, then days: 31 January + P1M1D is 1 March, not 4 March', () => {
    expect(shift('2025-01-31', 'P1M1D')).toBe('2025-03-01');
    expect(Temporal.PlainDate.from('2025-01-31').add('P1M1D').toString()).toBe('2025-03-01');
  });

  it('negative: 31 March - P1M is 28 February', () => {
    expect(shift('2025-03-31', '-P1M')).toBe('2025-02-28');
  });

  it('overflow "reject" throws instead of clamping, naming the day and the month', () => {
    expect(() => shift('2025-01-31', 'P1M', 'reject')).toThrow(/day 31 of 2025-02, which has 28 days/);
    expect(() => Temporal.PlainDate.from('2025-01-31').add('P1M', { overflow: 'reject' })).toThrow(RangeError);
    expect(() => shift('2025-01-30', 'P1M', 'reject')).toThrow(KalendsRangeError);
    expect(shift('2025-01-28', 'P1M', 'reject')).toBe('2025-02-28');
  });

  it('exact parts must be whole days for a date', () => {
    expect(shift('2025-02-14', 'PT48H')).toBe('2025-02-16');
    expect(() => shift('2025-02-14', 'PT5H')).toThrow(/shiftWallMs/);
  });

  it('rejects results and arguments outside the supported range', () => {
    expect(() => shiftDayNumber(parsePlainDate('+275760-12-31'), parseDuration('P1D'))).toThrow(KalendsRangeError);
    expect(() => shiftDayNumber(0, parseDuration('P300000Y'))).toThrow(/outside the supported years/);
    expect(() => shiftDayNumber(0, {} as Duration)).toThrow(KalendsTypeError);
    expect(() => shiftDayNumber(0, parseDuration('P1D'), { overflow: 'clamp' as never })).toThrow(/overflow/);
  });

  const signedDuration = fc
    .record({
      sign: fc.constantFrom(1, -1),
      years: fc.integer({ min: 0, max: 60 }),
      months: fc.integer({ min: 0, max: 40 }),
      weeks: fc.integer({ min: 0, max: 20 }),
      days: fc.integer({ min: 0, max: 800 }),
      wholeDaysOfHours: fc.integer({ min: 0, max: 5 }),
    })
    .map((r) => ({
      years: r.sign * r.years,
      months: r.sign * r.months,
      weeks: r.sign * r.weeks,
      days: r.sign * r.days,
      hours: r.sign * r.wholeDaysOfHours * 24,
    }));
  const day = fc.integer({ min: dayNumberFromYmd(1600, 1, 1), max: dayNumberFromYmd(2400, 12, 31) });

  it('equals @js-temporal/polyfill PlainDate.add on random dates and durations (constrain)', () => {
    fc.assert(
      fc.property(day, signedDuration, (dn, f) => {
        const expected = dayNumberOfTemporal(temporalDateOf(dn).add(f));
        expect(shiftDayNumber(dn, durationFromFields(f))).toBe(expected);
      }),
      { seed: SEED + 2, numRuns: 3000 },
    );
  });

  it('throws exactly when PlainDate.add throws with overflow "reject"', () => {
    fc.assert(
      fc.property(day, signedDuration, (dn, f) => {
        let expected: number | 'throws';
        try {
          expected = dayNumberOfTemporal(temporalDateOf(dn).add(f, { overflow: 'reject' }));
        } catch {
          expected = 'throws';
        }
        let ours: number | 'throws';
        try {
          ours = shiftDayNumber(dn, durationFromFields(f), { overflow: 'reject' });
        } catch (e) {
          expect(e).toBeInstanceOf(KalendsRangeError);
          ours = 'throws';
        }
        expect(ours).toBe(expected);
      }),
      { seed: SEED + 3, numRuns: 3000 },
    );
  });
});

describe('shiftWallMs', () => {
  it('Jan 31 22:00 + P1MT3H is 1 March 01:00 in a leap year (months, clamp, then exact time)', () => {
    const r = shiftWallMs(parsePlainDateTime('2024-01-31T22:00'), parseDuration('P1MT3H'));
    expect(formatPlainDateTime(r)).toBe('2024-03-01T01:00:00');
    expect(Temporal.PlainDateTime.from('2024-01-31T22:00').add('P1MT3H').toString()).toBe('2024-03-01T01:00:00');
  });

  it('equals @js-temporal/polyfill PlainDateTime.add on random date-times and durations', () => {
    const wall = fc.integer({ min: Date.UTC(1600, 0, 1), max: Date.UTC(2400, 11, 31) });
    const dur = fc
      .record({
        sign: fc.constantFrom(1, -1),
        years: fc.integer({ min: 0, max: 30 }),
        months: fc.integer({ min: 0, max: 30 }),
        weeks: fc.integer({ min: 0, max: 10 }),
        days: fc.integer({ min: 0, max: 400 }),
        hours: fc.integer({ min: 0, max: 10_000 }),
        minutes: fc.integer({ min: 0, max: 10_000 }),
        seconds: fc.integer({ min: 0, max: 100_000 }),
        milliseconds: fc.integer({ min: 0, max: 100_000 }),
      })
      .map(({ sign, ...f }) => Object.fromEntries(Object.entries(f).map(([k, v]) => [k, v === 0 ? 0 : sign * v])));
    fc.assert(
      fc.property(wall, dur, (w, f) => {
        const t = Temporal.Instant.fromEpochMilliseconds(w).toZonedDateTimeISO('UTC').toPlainDateTime().add(f);
        const expected = t.toZonedDateTime('UTC').epochMilliseconds;
        expect(shiftWallMs(w, durationFromFields(f))).toBe(expected);
      }),
      { seed: SEED + 4, numRuns: 3000 },
    );
  });

  it('a local date-time has no gaps: PT24H and P1D give the same wall time', () => {
    const w = parsePlainDateTime('2025-03-30T00:30');
    expect(shiftWallMs(w, parseDuration('PT24H'))).toBe(shiftWallMs(w, parseDuration('P1D')));
    expect(formatPlainDateTime(shiftWallMs(w, parseDuration('P1D')))).toBe(`2025-03-31T00:30:00`);
  });
});

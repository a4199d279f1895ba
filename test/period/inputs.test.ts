/**
 * Input rules, names and edges of the period layer (docs/design.md, "Input rules" and "Errors"): bulk inputs read
 * once, labels refused as syntax errors with their position, unknown unit names named as such, day numbers given
 * as text, the periods at the ends of the supported range, fractional instants, and the renamed operations
 * `periodFromPeriod` and `shiftPeriodYears`. Reference values: @js-temporal/polyfill and temporal-polyfill
 * (PlainDate.add with `years`, weekOfYear, yearOfWeek, toZonedDateTime), and ISO 8601-1:2019 for week dates.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import { Temporal as TemporalPolyfill } from 'temporal-polyfill';
import {
  defineUnit,
  firstDayNumberAfterPeriod,
  firstDayNumberFromOrdinalBulk,
  firstDayNumberOfPeriod,
  firstEpochMsAfterPeriod,
  firstEpochMsOfPeriod,
  formatOrdinalBulk,
  formatPeriod,
  isDayNumberInPeriod,
  isEpochMsInPeriod,
  lastDayNumberOfPeriod,
  lengthDaysOfPeriod,
  ordinalFromDayNumberBulk,
  ordinalFromEpochMsBulk,
  parsePeriod,
  periodFromDayNumber,
  periodFromEpochMs,
  periodFromOrdinal,
  periodFromPeriod,
  shiftPeriod,
  shiftPeriodYears,
  toUnit,
  type UnitDefinition,
} from '../../src/period/index.js';
import { bucketSeries, seriesFromColumns } from '../../src/series/index.js';
import { dayNumberFromYmd, ymdFromDayNumber } from '../../src/civil/index.js';
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../../src/bounds.js';
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';

const DAY = 86_400_000;
const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;

function thrown(f: () => unknown): Error & { code?: string; position?: number; issues?: { path: string }[] } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

describe('period bulk inputs: non-numbers in plain arrays, whatever the length', () => {
  const bulk: readonly [string, string, (xs: unknown[]) => unknown][] = [
    ['ordinalFromDayNumberBulk', 'dayNumbers', (xs) => ordinalFromDayNumberBulk('quarter', xs as number[])],
    ['firstDayNumberFromOrdinalBulk', 'ordinals', (xs) => firstDayNumberFromOrdinalBulk('quarter', xs as number[])],
    ['formatOrdinalBulk', 'ordinals', (xs) => formatOrdinalBulk('quarter', xs as number[])],
  ];
  for (const [name, param, f] of bulk) {
    it(`${name} names the index of a numeric string, a Date, null or true at 3, 2,047, 2,048 and 5,000 elements`, () => {
      for (const n of [3, 2047, 2048, 5000]) {
        for (const bad of ['8100', new Date(0), null, true]) {
          const xs: unknown[] = new Array(n).fill(8100);
          xs[n - 1] = bad;
          const e = thrown(() => f(xs));
          expect(e).toBeInstanceOf(KalendsTypeError);
          expect(e.message.startsWith(`${param}[${n - 1}]: expected a number`)).toBe(true);
        }
      }
    });
  }
});

describe('labels: every fault is a KalendsSyntaxError with its position', () => {
  const cases: readonly [UnitDefinition | string, string, string, number][] = [
    ['month', '2025-13', 'out-of-range', 5],
    ['month', '2025-3', 'malformed', 6],
    ['iso-week', '2021-W53', 'out-of-range', 6], // 2021 has 52 ISO weeks (ISO 8601-1:2019, 3.2.2: it began on a Friday)
    ['quarter', '2025-Q5', 'out-of-range', 6],
    ['day', '2025-02-30', 'out-of-range', 8],
    ['year', '+275761', 'out-of-range', 0],
    [{ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }, '2025-Q1', 'malformed', 0],
    [{ kind: 'fiscal-week', ...RETAIL }, 'FY2024-W53', 'out-of-range', 8], // FY2024 (Feb 2024 - Feb 2025) has 52 weeks
    [{ kind: 'week', firstWeekday: 'saturday' }, '2025-03-07/P1W', 'malformed', 0], // a Friday
  ];
  for (const [unit, label, code, position] of cases) {
    it(`${JSON.stringify(unit)}: ${label} is ${code} at ${position}`, () => {
      const e = thrown(() => parsePeriod(unit as never, label));
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      expect(e.code).toBe(code);
      expect(e.position).toBe(position);
      expect(e.message.startsWith(`text: "${label}"`)).toBe(true);
    });
  }
});

describe('unit names: an unknown name is named as such, with the nearest names by spelling and by meaning', () => {
  it('a misspelling and a common alternative word', () => {
    const e = thrown(() => toUnit('quartr' as never));
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect(e.code).toBe('unknown-name');
    expect(e.message).toMatch(/^unit: unknown unit name "quartr"; expected one of "day", .* did you mean "quarter"\?$/);
    expect(thrown(() => periodFromDayNumber('monthly' as never, 0)).message).toContain('did you mean "month"?');
    expect(thrown(() => defineUnit('weekly' as never)).message).toMatch(/^definition: unknown unit name "weekly".*did you mean "iso-week"\?/);
    expect(thrown(() => defineUnit({ kind: 'quartely' } as never)).issues?.[0]?.path).toBe('kind');
    expect(thrown(() => defineUnit({ kind: 'quartely' } as never)).message).toContain('did you mean "quarter"?');
  });

  it('never reports a fault at "(definition)"', () => {
    const e = thrown(() => defineUnit({} as never));
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e.message).toMatch(/^kind: required/);
    expect(thrown(() => defineUnit(42 as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => toUnit(null as never)).message).toMatch(/^unit: expected a unit made by defineUnit/);
  });
});

describe('day numbers and amounts given as text or fractions', () => {
  it('names the parser to call', () => {
    const q = parsePeriod('quarter', '2025-Q1');
    for (const f of [() => periodFromDayNumber('month', '2025-01-01' as never), () => isDayNumberInPeriod(q, '2025-01-01' as never), () => toUnit('month').ordinalFromDayNumber('2025-01-01' as never)]) {
      const e = thrown(f);
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e.message).toContain('parsePlainDate(text)');
    }
    expect(thrown(() => shiftPeriod(q, 0.5)).code).toBe('out-of-range');
    expect(thrown(() => shiftPeriod(q, '1' as never)).message).toContain('pass the number 1, not a string');
    expect(thrown(() => periodFromEpochMs('month', 'UTC', '2025-01-01T00:00Z' as never)).message).toContain('parseInstant(text).epochMs');
  });
});

describe('fractional instants: the period of the millisecond that holds the instant', () => {
  it('-0.5 is in December 1969 in UTC (and in bulk)', () => {
    expect(formatPeriod(periodFromEpochMs('month', 'UTC', -0.5))).toBe('1969-12');
    expect(isEpochMsInPeriod(parsePeriod('month', '1970-01'), 'UTC', -0.5)).toBe(false);
    expect(formatOrdinalBulk('month', ordinalFromEpochMsBulk('month', 'UTC', Float64Array.of(-0.5, 0.5)))).toEqual(['1969-12', '1970-01']);
  });

  it('next to a local midnight that starts a quarter, against @js-temporal/polyfill (America/New_York)', () => {
    const start = Temporal.ZonedDateTime.from('2025-04-01T00:00[America/New_York]').epochMilliseconds;
    for (const n of [3, 3000]) {
      const xs = new Float64Array(n).fill(start - 0.5);
      xs[1] = start + 0.5;
      expect(formatOrdinalBulk('quarter', ordinalFromEpochMsBulk('quarter', 'America/New_York', xs).subarray(0, 2))).toEqual(['2025-Q1', '2025-Q2']);
    }
    expect(formatPeriod(periodFromEpochMs('quarter', 'America/New_York', start - 0.5))).toBe('2025-Q1');
  });
});

describe('the periods at the ends of the supported range: every accessor serves them', () => {
  const units: readonly (UnitDefinition | string)[] = [
    'day',
    'iso-week',
    'month',
    'year',
    { kind: 'week', firstWeekday: 'sunday' },
    { kind: 'cycle', lengthDays: 36525, anchor: '2025-01-03' },
    { kind: 'fiscal-year', start: { month: 10, day: 1 }, naming: 'end-year' },
    { kind: 'fiscal-year', start: { month: 4, day: 6 }, naming: 'start-year' },
    { kind: 'fiscal-week', ...RETAIL },
    { kind: 'fiscal-period', ...RETAIL },
  ];
  for (const def of units) {
    it(`${JSON.stringify(def)}: the first and last periods parse, format and have days and instants`, () => {
      const u = toUnit(def as never);
      for (const o of [u.minOrdinal, u.maxOrdinal]) {
        const p = periodFromOrdinal(u, o);
        expect(parsePeriod(u, formatPeriod(p)).ordinal).toBe(o);
        const first = firstDayNumberOfPeriod(p);
        const after = firstDayNumberAfterPeriod(p);
        expect(lastDayNumberOfPeriod(p)).toBe(after - 1);
        expect(lengthDaysOfPeriod(p)).toBe(after - first);
        // In UTC a period starts at its first day's midnight, whatever the range.
        expect(firstEpochMsOfPeriod(p, 'UTC')).toBe(first * DAY);
        expect(firstEpochMsAfterPeriod(p, 'UTC')).toBe(after * DAY);
        expect(firstEpochMsAfterPeriod(p, 'America/New_York')).toBeGreaterThan(firstEpochMsOfPeriod(p, 'America/New_York'));
        expect(formatPeriod(periodFromPeriod('year', p))).toMatch(/^[+-]?\d+$/);
      }
    });
  }

  it('the fiscal years at the edges (FY-271821 starts before the first supported day, FY+275761 ends after the last)', () => {
    const fy = defineUnit({ kind: 'fiscal-year', start: { month: 10, day: 1 }, naming: 'end-year' });
    const first = parsePeriod(fy, 'FY-271821');
    const last = parsePeriod(fy, 'FY+275761');
    // 1 October of the year before, and 1 October of the last year: the proleptic Gregorian dates of the rule.
    expect(firstDayNumberOfPeriod(first)).toBe(dayNumberFromYmd(-271821, 1, 1) - 92);
    expect(firstDayNumberOfPeriod(last)).toBe(dayNumberFromYmd(275760, 10, 1));
    expect(firstEpochMsOfPeriod(first, 'Europe/London')).toBeLessThan(MIN_EPOCH_MS);
    expect(firstEpochMsAfterPeriod(last, 'Europe/London')).toBeGreaterThan(MAX_EPOCH_MS);
  });

  it('bucketSeries over the first and last years of the range (the zone day range no longer surfaces)', () => {
    const s = seriesFromColumns([MIN_EPOCH_MS, MAX_EPOCH_MS], { v: [1, 2] });
    const table = bucketSeries(s, { unit: 'year', zone: 'America/New_York', aggregations: ['sum'] });
    expect(table.labels).toEqual(['-271821', '+275760']);
    // New York kept local mean time (-4:56:02, tz Zone line) before the range; the years start at local midnight.
    expect(table.startEpochMs[0]).toBe(dayNumberFromYmd(-271821, 1, 1) * DAY + (4 * 3600 + 56 * 60 + 2) * 1000);
    expect(table.endEpochMs[1]).toBeGreaterThan(MAX_EPOCH_MS);
  });
});

describe('periodFromPeriod (unit first, like periodFromDayNumber)', () => {
  it('the period of a unit that holds the first day of another', () => {
    expect(formatPeriod(periodFromPeriod('quarter', parsePeriod('month', '2025-05')))).toBe('2025-Q2');
    const fyq = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    expect(formatPeriod(periodFromPeriod(fyq, parsePeriod('month', '2025-10')))).toBe('FY2026-Q1');
    expect(thrown(() => periodFromPeriod(parsePeriod('month', '2025-05') as never, 'quarter' as never))).toBeInstanceOf(KalendsTypeError);
  });
});

describe('shiftPeriodYears: any whole number of years, the same rules per kind', () => {
  it('days: the same date, 29 February to 28 February (as PlainDate.add({ years }) in both Temporal polyfills)', () => {
    const leap = parsePeriod('day', '2024-02-29');
    for (const years of [-4, -1, 1, 3, 4, 100]) {
      const ref = Temporal.PlainDate.from('2024-02-29').add({ years }).toString();
      expect(ref).toBe(TemporalPolyfill.PlainDate.from('2024-02-29').add({ years }).toString());
      expect(formatPeriod(shiftPeriodYears(leap, years))).toBe(ref);
    }
    fc.assert(
      fc.property(fc.integer({ min: -700_000, max: 700_000 }), fc.integer({ min: -300, max: 300 }), (dn, years) => {
        const { year, month, day } = ymdFromDayNumber(dn);
        const ref = Temporal.PlainDate.from({ year, month, day }).add({ years });
        expect(firstDayNumberOfPeriod(shiftPeriodYears(periodFromOrdinal('day', dn), years))).toBe(dayNumberFromYmd(ref.year, ref.month, ref.day));
      }),
      { seed: 121301, numRuns: 500 },
    );
  });

  it('ISO weeks: the same week number, week 53 to the last week of a 52-week year (weekOfYear / yearOfWeek of @js-temporal/polyfill)', () => {
    const weeksIn = (y: number) => Temporal.PlainDate.from({ year: y, month: 12, day: 28 }).weekOfYear!;
    expect(weeksIn(2026)).toBe(53);
    for (const years of [-6, -1, 1, 2, 6, 11]) {
      const target = 2026 + years;
      const expected = `${target}-W${String(Math.min(53, weeksIn(target))).padStart(2, '0')}`;
      expect(formatPeriod(shiftPeriodYears(parsePeriod('iso-week', '2026-W53'), years))).toBe(expected);
    }
    expect(formatPeriod(shiftPeriodYears(parsePeriod('iso-week', '2025-W10'), 7))).toBe('2032-W10');
  });

  it('months, quarters, fiscal units: the same index; weeks from a weekday: 52 a year; cycles: 364 days a year', () => {
    expect(formatPeriod(shiftPeriodYears(parsePeriod('month', '2025-03'), -10))).toBe('2015-03');
    const fyp = defineUnit({ kind: 'fiscal-period', ...RETAIL });
    expect(formatPeriod(shiftPeriodYears(parsePeriod(fyp, 'FY2024-P12'), 2))).toBe('FY2026-P12');
    const fyw = defineUnit({ kind: 'fiscal-week', ...RETAIL });
    expect(formatPeriod(shiftPeriodYears(parsePeriod(fyw, 'FY2023-W53'), 1))).toBe('FY2024-W52');
    expect(formatPeriod(shiftPeriodYears(parsePeriod(fyw, 'FY2023-W53'), 0))).toBe('FY2023-W53');
    const sat = defineUnit({ kind: 'week', firstWeekday: 'saturday' });
    expect(firstDayNumberOfPeriod(shiftPeriodYears(parsePeriod(sat, '2025-03-08/P1W'), 3))).toBe(dayNumberFromYmd(2025, 3, 8) + 3 * 364);
    const cycle = defineUnit({ kind: 'cycle', lengthDays: 14, anchor: '2025-01-03' });
    const c = parsePeriod(cycle, '2025-01-03/P14D');
    expect(firstDayNumberOfPeriod(shiftPeriodYears(c, 2))).toBe(dayNumberFromYmd(2025, 1, 3) + 2 * 364);
    expect(firstDayNumberOfPeriod(shiftPeriodYears(c, -1))).toBe(dayNumberFromYmd(2025, 1, 3) - 364);
  });

  it('one year back equals the former one-year-earlier rule; index units compose', () => {
    fc.assert(
      fc.property(fc.integer({ min: 20_000, max: 30_000 }), fc.integer({ min: -50, max: 50 }), fc.integer({ min: -50, max: 50 }), (o, a, b) => {
        const p = periodFromOrdinal('quarter', o);
        expect(shiftPeriodYears(shiftPeriodYears(p, a), b).ordinal).toBe(shiftPeriodYears(p, a + b).ordinal);
        expect(shiftPeriodYears(p, a).ordinal).toBe(o + 4 * a);
      }),
      { seed: 121302, numRuns: 300 },
    );
  });

  it('refuses fractions, text and results past the range', () => {
    const m = parsePeriod('month', '2025-03');
    expect(thrown(() => shiftPeriodYears(m, 1.5)).code).toBe('out-of-range');
    expect(thrown(() => shiftPeriodYears(m, '1' as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => shiftPeriodYears(m, 1e15)).code).toBe('out-of-range');
    expect(thrown(() => shiftPeriodYears(parsePeriod('year', '+275760'), 1)).message).toMatch(/^years: shiftPeriodYears\(\+275760, 1\) gives ordinal 275761, outside the supported range of unit year; expected a result from -271821 to \+275760/);
  });
});

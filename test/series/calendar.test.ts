/**
 * The calendar-aware operations: windows and lags by wall-clock spans in a zone (checked against
 * @js-temporal/polyfill's ZonedDateTime arithmetic), by business days (checked against a day-by-day walk over
 * weekdays), by periods, changes between periods, alignment and grids.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  alignSeries,
  bucketSeries,
  defineCalendar,
  defineRule,
  defineUnit,
  fillSeries,
  formatPlainDate,
  lagSeries,
  leadSeries,
  periodChangeFromBuckets,
  shiftPeriodYears,
  rollSeries,
  seriesFromColumns,
} from '../../src/index.js';
import { reference, relativeError, same, valid } from './reference.js';

const HOUR = 3_600_000;
const START = Date.UTC(2024, 9, 20); // late October 2024: the US and Lord Howe DST changes fall inside the data

const rowsArb = fc
  .array(
    fc.tuple(
      fc.integer({ min: 0, max: 150 * 24 * 4 }).map((q) => START + q * 15 * 60_000),
      fc.oneof({ weight: 6, arbitrary: fc.integer({ min: -1000, max: 1000 }) }, { weight: 1, arbitrary: fc.constant(Number.NaN) }),
    ),
    { maxLength: 70 },
  )
  .map((r) => [...r].sort((a, b) => a[0] - b[0]));

const zdt = (ms: number, zone: string) => Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(zone);

describe('calendar-span windows (wall clock in a zone) against @js-temporal/polyfill', () => {
  it('P30D and P1M windows: start = ZonedDateTime.subtract(span) (compatible, month-end constrained), held non-decreasing', () => {
    fc.assert(
      fc.property(rowsArb, fc.constantFrom('P30D', 'P1M', 'P7D'), fc.constantFrom('America/New_York', 'Australia/Lord_Howe', 'Europe/Dublin'), (rows, span, zone) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const out = rollSeries(s, { window: { span, zone }, aggregations: ['sum', 'count', 'max'] });
        const dur = Temporal.Duration.from(span);
        let held = -Infinity;
        rows.forEach(([t], i) => {
          held = Math.max(held, zdt(t, zone).subtract(dur).epochMilliseconds);
          const w = valid(rows.filter(([u]) => u > held && u <= t).map((r) => r[1]));
          expect(out.columns.count![i]).toBe(w.length);
          expect(relativeError(out.columns.sum![i]!, w.length ? reference.sum(w) : NaN)).toBeLessThan(1e-12);
          expect(same(out.columns.max![i]!, reference.max(w))).toBe(true);
        });
      }),
      { seed: 7501, numRuns: 60 },
    );
  });

  it('rejects a zero span', () => {
    const s = seriesFromColumns([0], { v: [1] });
    expect(() => rollSeries(s, { window: { span: 'PT0S', zone: 'UTC' }, aggregations: ['sum'] })).toThrow(/options.window.span: expected a span longer than zero/);
  });
});

describe('business-day windows and lags against a day-by-day walk over weekdays', () => {
  const weekdays = defineCalendar({ id: 'weekdays-only', weekend: ['saturday', 'sunday'] });
  const zone = 'America/New_York';
  const isMondayToFriday = (d: Temporal.PlainDate) => d.dayOfWeek <= 5; // ISO 8601 weekday numbers: 6, 7 = Saturday, Sunday

  it('a window of n business days starts at the first instant of the n-th business day back (the own day counts when it is one)', () => {
    fc.assert(
      fc.property(rowsArb, fc.integer({ min: 1, max: 6 }), (rows, n) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const out = rollSeries(s, { window: { businessDays: n, calendar: weekdays, zone }, aggregations: ['count'] });
        rows.forEach(([t], i) => {
          let d = zdt(t, zone).toPlainDate();
          while (!isMondayToFriday(d)) d = d.subtract({ days: 1 });
          for (let k = 1; k < n; k++) {
            d = d.subtract({ days: 1 });
            while (!isMondayToFriday(d)) d = d.subtract({ days: 1 });
          }
          const start = d.toZonedDateTime({ timeZone: zone }).epochMilliseconds; // start of day, as Temporal defines it
          expect(out.columns.count![i]).toBe(valid(rows.filter(([u]) => u >= start && u <= t).map((r) => r[1])).length);
        });
      }),
      { seed: 7502, numRuns: 60 },
    );
  });

  it('lag by n business days: the latest value at or before the same wall time n business days earlier', () => {
    fc.assert(
      fc.property(rowsArb, fc.integer({ min: 1, max: 4 }), (rows, n) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const out = lagSeries(s, { businessDays: n, calendar: weekdays, zone });
        rows.forEach(([t], i) => {
          const z = zdt(t, zone);
          let d = z.toPlainDate();
          for (let k = 0; k < n; k++) {
            d = d.subtract({ days: 1 });
            while (!isMondayToFriday(d)) d = d.subtract({ days: 1 });
          }
          const target = d.toPlainDateTime(z.toPlainTime()).toZonedDateTime(zone, { disambiguation: 'compatible' }).epochMilliseconds;
          const before = rows.filter(([u, v]) => u <= target && !Number.isNaN(v));
          expect(same(out.columns.lag![i]!, before.length ? before[before.length - 1]![1] : NaN)).toBe(true);
        });
      }),
      { seed: 7503, numRuns: 60 },
    );
  });
});

describe('lags and leads by rows, durations and periods (brute force)', () => {
  it('rows and durations, both directions', () => {
    fc.assert(
      fc.property(rowsArb, fc.integer({ min: 1, max: 5 }), fc.integer({ min: 1, max: 48 }), (rows, k, hours) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const lagRows = lagSeries(s, { rows: k }).columns.lag!;
        const leadRows = leadSeries(s, { rows: k }).columns.lead!;
        const lagDur = lagSeries(s, { durationMs: hours * HOUR }).columns.lag!;
        const leadDur = leadSeries(s, { durationMs: hours * HOUR }).columns.lead!;
        rows.forEach(([t], i) => {
          expect(same(lagRows[i]!, rows[i - k]?.[1] ?? NaN)).toBe(true);
          expect(same(leadRows[i]!, rows[i + k]?.[1] ?? NaN)).toBe(true);
          const back = rows.filter(([u, v]) => u <= t - hours * HOUR && !Number.isNaN(v));
          expect(same(lagDur[i]!, back.length ? back[back.length - 1]![1] : NaN)).toBe(true);
          const ahead = rows.filter(([u, v]) => u >= t + hours * HOUR && !Number.isNaN(v));
          expect(same(leadDur[i]!, ahead.length ? ahead[0]![1] : NaN)).toBe(true);
        });
      }),
      { seed: 7504, numRuns: 150 },
    );
  });

  it('by periods: the closing value of the month before (labels from Temporal in America/Chicago)', () => {
    fc.assert(
      fc.property(rowsArb, (rows) => {
        const zone = 'America/Chicago';
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const out = lagSeries(s, { periods: 1, unit: 'month', zone }).columns.lag!;
        const monthOf = (t: number) => {
          const z = zdt(t, zone);
          return z.year * 12 + z.month - 1;
        };
        rows.forEach(([t], i) => {
          const prev = rows.filter(([u, v]) => monthOf(u) === monthOf(t) - 1 && !Number.isNaN(v));
          expect(same(out[i]!, prev.length ? prev[prev.length - 1]![1] : NaN)).toBe(true);
        });
      }),
      { seed: 7505, numRuns: 100 },
    );
  });

  it('rejects zero and negative amounts', () => {
    const s = seriesFromColumns([0], { v: [1] });
    expect(() => lagSeries(s, { rows: 0 })).toThrow(/by.rows: expected a positive integer, got 0/);
    expect(() => lagSeries(s, { durationMs: -5 })).toThrow(/by.durationMs/);
    expect(() => leadSeries(s, { periods: -1, unit: 'month', zone: 'UTC' })).toThrow(/by.periods/);
  });
});

describe('changes between periods', () => {
  it('against the previous month and the same month a year earlier', () => {
    const times: number[] = [];
    const values: number[] = [];
    for (let m = 0; m < 24; m++) {
      times.push(Date.UTC(2023, m, 10));
      values.push(100 + m);
    }
    const s = seriesFromColumns(times, { v: values });
    const table = bucketSeries(s, { unit: 'month', zone: 'UTC', aggregations: ['sum'], range: { start: '2023-01', end: '2025-01' } });
    const prev = periodChangeFromBuckets(table);
    expect(prev.base[1]).toBe(100);
    expect(prev.change[1]).toBe(1);
    expect(prev.relativeChange[1]).toBeCloseTo(0.01, 15);
    expect(prev.base[0]).toBeNaN();
    const yoy = periodChangeFromBuckets(table, { against: 'year-earlier' });
    expect(yoy.labels[12]).toBe('2024-01');
    expect(yoy.base[12]).toBe(100); // 2023-01
    expect(yoy.change[12]).toBe(12);
    expect(yoy.base[11]).toBeNaN(); // 2022-12 is not in the table
  });

  it('year-earlier on a 52/53-week retail calendar follows the period layer: week 53 compares with week 52', () => {
    // Retail 4-5-4 calendar: the year ends on the Saturday nearest the end of January (common practice).
    const week = defineUnit({ kind: 'fiscal-week', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'end-year' });
    const times: number[] = [];
    for (let d = 0; d < 3 * 371; d += 7) times.push(Date.UTC(2022, 0, 1) + d * 86_400_000);
    const s = seriesFromColumns(times, { v: times.map((_, i) => i + 1) });
    const table = bucketSeries(s, { unit: week, zone: 'UTC', aggregations: ['sum'] });
    const yoy = periodChangeFromBuckets(table, { against: 'year-earlier' });
    let sawWeek53 = false;
    for (let i = 0; i < table.length; i++) {
      const expected = shiftPeriodYears({ unit: week, ordinal: table.ordinals[i]! }, -1).ordinal;
      expect(yoy.baseOrdinals[i]).toBe(expected);
      if (/W53$/.test(table.labels[i]!)) {
        sawWeek53 = true;
        expect(week.formatOrdinal(expected)).toMatch(/W52$/);
      }
    }
    expect(sawWeek53).toBe(true);
  });
});

describe('alignment and grids', () => {
  it('aligns two series on one month index, NaN where one has no rows', () => {
    const a = seriesFromColumns([Date.UTC(2025, 0, 5), Date.UTC(2025, 2, 5)], { v: [1, 3] });
    const b = seriesFromColumns([Date.UTC(2025, 1, 5), Date.UTC(2025, 1, 6)], { v: [10, 20] });
    const t = alignSeries({ a, b }, { unit: 'month', zone: 'UTC', aggregation: 'sum' });
    expect([...t.labels]).toEqual(['2025-01', '2025-02', '2025-03']);
    expect(Array.from(t.columns.a!)).toEqual([1, NaN, 3]);
    expect(Array.from(t.columns.b!)).toEqual([NaN, 30, NaN]);
  });

  it('fills onto the starts of local days in a zone (DST-true: 23- and 25-hour days in America/New_York)', () => {
    const s = seriesFromColumns([Date.UTC(2025, 2, 8, 12), Date.UTC(2025, 2, 11, 12)], { v: [0, 72] });
    const out = fillSeries(s, { grid: { unit: 'day', zone: 'America/New_York', range: { start: '2025-03-08', end: '2025-03-12' } }, method: 'linear' });
    // Day starts from Temporal: 2025-03-09 begins at 05:00Z (EST); 10 March at 04:00Z (EDT from 9 March, 02:00).
    const starts = ['2025-03-08', '2025-03-09', '2025-03-10', '2025-03-11'].map((d) => Temporal.PlainDate.from(d).toZonedDateTime('America/New_York').epochMilliseconds);
    expect(Array.from(out.epochMs)).toEqual(starts);
    const hours = starts.map((ms) => (ms - Date.UTC(2025, 2, 8, 12)) / HOUR);
    expect(Array.from(out.columns.v!)).toEqual(hours.map((h) => (h < 0 ? NaN : h)));
  });

  it('fills onto the occurrences of a recurrence rule (the 15th and the last day of each month)', () => {
    const rule = defineRule({ kind: 'monthly', on: [{ day: 15 }, { day: 'last' }] });
    const s = seriesFromColumns([Date.UTC(2025, 0, 1), Date.UTC(2025, 1, 20)], { v: [5, 7] });
    const out = fillSeries(s, { grid: { rule, zone: 'UTC', start: '2025-01-01', end: '2025-04-01' } });
    expect(Array.from(out.epochMs).map((ms) => formatPlainDate(Math.floor(ms / 86_400_000)))).toEqual([
      '2025-01-15',
      '2025-01-31',
      '2025-02-15',
      '2025-02-28',
      '2025-03-15',
      '2025-03-31',
    ]);
    expect(Array.from(out.columns.v!)).toEqual([5, 5, 5, 7, 7, 7]);
  });
});

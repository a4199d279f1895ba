import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  KalendsRangeError,
  bucketSeries,
  defineBucketAccumulator,
  defineUnit,
  seriesFromColumns,
  seriesFromBuckets,
} from '../../src/index.js';
import { findRuns } from '../../src/series/bucket.js';
import { toZone } from '../../src/zone/index.js';
import { exactSum, reference, relativeError, same, valid } from './reference.js';

const DAY = 86_400_000;
const START = Date.UTC(2019, 11, 20); // late December 2019, so ISO week-years and DST both get crossed
const ZONES = ['UTC', 'America/New_York', 'Australia/Lord_Howe', 'Asia/Kolkata'];

/** The label a row's period must have, computed by @js-temporal/polyfill (an outside reference). */
function temporalLabel(unit: string, zone: string, epochMs: number): string {
  const z = Temporal.Instant.fromEpochMilliseconds(epochMs).toZonedDateTimeISO(zone);
  const p2 = (n: number) => String(n).padStart(2, '0');
  if (unit === 'month') return `${z.year}-${p2(z.month)}`;
  if (unit === 'day') return `${z.year}-${p2(z.month)}-${p2(z.day)}`;
  if (unit === 'quarter') return `${z.year}-Q${Math.ceil(z.month / 3)}`;
  return `${z.yearOfWeek}-W${p2(z.weekOfYear!)}`; // ISO 8601 week date
}

/** Sorted rows: instants over about 15 months (many hours apart, with exact duplicates) and values. */
const rowsArb = fc
  .array(
    fc.tuple(
      fc.integer({ min: 0, max: 460 * 24 }).map((h) => START + h * 3_600_000),
      fc.oneof(
        { weight: 7, arbitrary: fc.tuple(fc.integer({ min: -(2 ** 30) + 1, max: 2 ** 30 - 1 }), fc.integer({ min: 0, max: 30 })).map(([k, s]) => k / 2 ** s) },
        { weight: 1, arbitrary: fc.constant(Number.NaN) },
      ),
    ),
    { maxLength: 80 },
  )
  .map((r) => [...r].sort((a, b) => a[0] - b[0]));

/** Quantile by Hyndman & Fan (1996) definition 7, written out from the paper's formula. */
function hf7(v: number[], p: number): number {
  if (v.length === 0) return NaN;
  const s = [...v].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const k = Math.floor(h);
  return k + 1 < s.length ? s[k]! + (h - k) * (s[k + 1]! - s[k]!) : s[k]!;
}

describe('bucketSeries against brute force, with periods from @js-temporal/polyfill (fast-check, seeded)', () => {
  it('every aggregation per period; bucket totals equal the input total', () => {
    fc.assert(
      fc.property(rowsArb, fc.constantFrom('month', 'iso-week', 'day', 'quarter'), fc.constantFrom(...ZONES), (rows, unit, zone) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const table = bucketSeries(s, {
          unit: unit as 'month',
          zone,
          aggregations: ['count', 'rows', 'sum', 'mean', 'min', 'max', 'first', 'last', 'open', 'close', 'variance', 'median', { kind: 'quantile', q: 0.9 }],
        });
        const groups = new Map<string, number[]>();
        for (const [t, v] of rows) {
          const label = temporalLabel(unit, zone, t);
          if (!groups.has(label)) groups.set(label, []);
          groups.get(label)!.push(v);
        }
        expect([...table.labels]).toEqual([...groups.keys()]);
        table.labels.forEach((label, k) => {
          const all = groups.get(label)!;
          const v = valid(all);
          const c = table.columns;
          expect(c.count![k]).toBe(v.length);
          expect(c.rows![k]).toBe(all.length);
          expect(table.rowCounts[k]).toBe(all.length);
          expect(same(c.min![k]!, reference.min(v))).toBe(true);
          expect(same(c.max![k]!, reference.max(v))).toBe(true);
          expect(same(c.first![k]!, reference.first(v))).toBe(true);
          expect(same(c.open![k]!, reference.first(v))).toBe(true);
          expect(same(c.last![k]!, reference.last(v))).toBe(true);
          expect(same(c.close![k]!, reference.last(v))).toBe(true);
          expect(relativeError(c.sum![k]!, reference.sum(v))).toBeLessThan(1e-12);
          expect(relativeError(c.mean![k]!, reference.mean(v))).toBeLessThan(1e-12);
          expect(relativeError(c.variance![k]!, reference.variance(v, 1))).toBeLessThan(1e-10);
          expect(relativeError(c.median![k]!, hf7(v, 0.5))).toBeLessThan(1e-12);
          expect(relativeError(c['quantile-0.9']![k]!, hf7(v, 0.9))).toBeLessThan(1e-12);
        });
        // Bucket totals equal the input total (the exact sum of all non-missing values), and counts add up.
        const allValid = valid(rows.map((r) => r[1]));
        expect(relativeError(exactSum([...table.columns.sum!]), exactSum(allValid))).toBeLessThan(1e-12);
        expect(table.columns.count!.reduce((a, b) => a + b, 0)).toBe(allValid.length);
        expect(table.skippedMissing).toBe(rows.length - allValid.length);
      }),
      { seed: 7401, numRuns: 120 },
    );
  });

  it('the boundary search and the bulk pass give the same runs (month, ISO week, day, 4-5-4 retail week)', () => {
    const retail = defineUnit({ kind: 'fiscal-week', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'end-year' } as never);
    fc.assert(
      fc.property(rowsArb, fc.constantFrom<unknown>('month', 'iso-week', 'day', retail), fc.constantFrom(...ZONES), (rows, unit, zoneId) => {
        const t = Float64Array.from(rows.map((r) => r[0]));
        const zone = toZone(zoneId);
        const u = typeof unit === 'string' ? defineUnit(unit as 'month') : (unit as ReturnType<typeof defineUnit>);
        const a = findRuns(t, 0, t.length, u, zone, 'boundaries');
        const b = findRuns(t, 0, t.length, u, zone, 'bulk');
        expect(a.count).toBe(b.count);
        expect(Array.from(a.ordinals.subarray(0, a.count))).toEqual(Array.from(b.ordinals.subarray(0, b.count)));
        expect(Array.from(a.starts.subarray(0, a.count + 1))).toEqual(Array.from(b.starts.subarray(0, b.count + 1)));
      }),
      { seed: 7402, numRuns: 150 },
    );
  });

  it('the streaming accumulator gives the same table as bucketSeries on shuffled rows', () => {
    fc.assert(
      fc.property(rowsArb, fc.constantFrom(...ZONES), fc.integer(), (rows, zone, seed) => {
        const aggs = ['count', 'sum', 'mean', 'min', 'max', 'first', 'last', 'stddev', 'median'] as const;
        const table = bucketSeries(seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) }), { unit: 'month', zone, aggregations: aggs });
        const acc = defineBucketAccumulator({ unit: 'month', zone, aggregations: aggs });
        // Shuffle, but keep rows with equal instants in order (first/last among ties follow input order).
        const order = rows.map((r, i) => ({ r, i, key: ((seed ^ (r[0] / 3_600_000)) * 2654435761) >>> 0 }));
        const byTime = new Map<number, typeof order>();
        for (const o of order) byTime.set(o.r[0], [...(byTime.get(o.r[0]) ?? []), o]);
        const shuffled = [...byTime.values()].sort((x, y) => x[0]!.key - y[0]!.key).flat();
        for (const { r } of shuffled) acc.add(r[0], r[1]);
        const streamed = acc.finish();
        expect([...streamed.labels]).toEqual([...table.labels]);
        for (const a of aggs) {
          table.columns[a]!.forEach((x, k) => expect(relativeError(streamed.columns[a]![k]!, x)).toBeLessThan(1e-9));
        }
        expect(streamed.skippedMissing).toBe(table.skippedMissing);
      }),
      { seed: 7403, numRuns: 80 },
    );
  });
});

describe('bucketSeries: zones, ranges and empty periods', () => {
  it('a month in America/New_York starts at local midnight: 2025-03-01T05:00Z (EST, UTC-5 until the second Sunday of March, Energy Policy Act of 2005)', () => {
    const s = seriesFromColumns([Date.UTC(2025, 2, 1, 4, 59, 59, 999), Date.UTC(2025, 2, 1, 5)], { v: [1, 2] });
    const t = bucketSeries(s, { unit: 'month', zone: 'America/New_York', aggregations: ['sum'] });
    expect([...t.labels]).toEqual(['2025-02', '2025-03']);
    expect(t.startEpochMs[1]).toBe(Date.UTC(2025, 2, 1, 5));
    // April begins at 04:00Z: EDT (UTC-4) from 9 March 2025.
    expect(t.endEpochMs[1]).toBe(Date.UTC(2025, 3, 1, 4));
  });

  it('fills empty periods inside an explicit range by the stated policy; count is 0 under every policy', () => {
    const s = seriesFromColumns([Date.UTC(2025, 0, 15), Date.UTC(2025, 3, 15), Date.UTC(2025, 5, 1)], { v: [10, 40, 60] });
    const range = { start: '2025-01', end: '2025-05' };
    const make = (empty: 'zero' | 'nan' | 'previous') => bucketSeries(s, { unit: 'month', zone: 'UTC', aggregations: ['sum', 'count', 'last'], range, empty });
    const zero = make('zero');
    expect([...zero.labels]).toEqual(['2025-01', '2025-02', '2025-03', '2025-04']);
    expect(Array.from(zero.columns.sum!)).toEqual([10, 0, 0, 40]);
    expect(Array.from(zero.columns.count!)).toEqual([1, 0, 0, 1]);
    expect(Array.from(make('nan').columns.sum!)).toEqual([10, NaN, NaN, 40]);
    expect(Array.from(make('previous').columns.last!)).toEqual([10, 10, 10, 40]);
    expect(zero.emptyPeriods).toBe(2);
    expect(zero.outsideRange).toBe(1); // the June row
    // Without a range only the periods holding rows appear.
    expect([...bucketSeries(s, { unit: 'month', zone: 'UTC', aggregations: ['sum'] }).labels]).toEqual(['2025-01', '2025-04', '2025-06']);
  });

  it('missing values: skipped and counted by default; propagate makes the period NaN', () => {
    const s = seriesFromColumns([0, 1, 2], { v: [1, NaN, 3] });
    const skip = bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum', 'count', 'rows'] });
    expect([skip.columns.sum![0], skip.columns.count![0], skip.columns.rows![0], skip.skippedMissing]).toEqual([4, 2, 3, 1]);
    const prop = bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], missing: 'propagate' });
    expect(prop.columns.sum![0]).toBeNaN();
  });

  it('seriesFromBuckets indexes the table by period start', () => {
    const s = seriesFromColumns([DAY / 2, DAY * 1.5], { v: [1, 2] });
    const back = seriesFromBuckets(bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'] }));
    expect(Array.from(back.epochMs)).toEqual([0, DAY]);
  });

  it('rejects unknown aggregations (suggesting valid ones), bad policies and reversed ranges', () => {
    const s = seriesFromColumns([0], { v: [1] });
    const b = (o: object) => () => bucketSeries(s, { unit: 'month', zone: 'UTC', aggregations: ['sum'], ...o } as never);
    expect(b({ aggregations: ['avg'] })).toThrow(/options.aggregations\[0\]: unknown aggregation "avg"; valid names are count, rows, sum, mean/);
    expect(b({ aggregations: ['summ'] })).toThrow(/did you mean "sum"/);
    expect(b({ aggregations: [{ kind: 'quantile', q: 1.5 }] })).toThrow(/options.aggregations\[0\].q: expected a probability from 0 to 1, got 1.5/);
    expect(b({ empty: 'skip' })).toThrow(/options.empty: expected one of "nan", "zero", "previous", got "skip"/);
    expect(b({ range: { start: '2025-05', end: '2025-01' } })).toThrow(KalendsRangeError);
    expect(b({ aggregations: ['sum', 'sum'] })).toThrow(/produced twice/);
    expect(b({ unit: 'fortnight' })).toThrow(/unit/);
  });
});

describe('infinite values in buckets (IEEE 754 arithmetic: x + Infinity = Infinity, Infinity + -Infinity = NaN)', () => {
  const day = 86_400_000;
  const cases: Array<[string, number[], number, number]> = [
    ['one +Infinity', [1, Infinity, 2], Infinity, Infinity],
    ['one -Infinity', [1, -Infinity], -Infinity, -Infinity],
    ['both signs', [Infinity, 5, -Infinity], Number.NaN, Number.NaN],
    ['finite only', [1.5, 2.5], 4, 2],
  ];
  for (const [name, values, sum, mean] of cases) {
    it(`${name}: sum ${sum}, mean ${mean}, in bucketSeries and in the streaming accumulator`, () => {
      const times = values.map((_, i) => day + i * 1000);
      const table = bucketSeries(seriesFromColumns(times, { v: values }), { unit: 'day', zone: 'UTC', aggregations: ['sum', 'mean'] });
      expect(table.columns.sum![0]).toBe(sum);
      expect(table.columns.mean![0]).toBe(mean);
      const acc = defineBucketAccumulator({ unit: 'day', zone: 'UTC', aggregations: ['sum', 'mean'] });
      values.forEach((v, i) => acc.add(times[i]!, v));
      const streamed = acc.finish();
      expect(streamed.columns.sum![0]).toBe(sum);
      expect(streamed.columns.mean![0]).toBe(mean);
    });
  }
});

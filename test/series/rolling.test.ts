import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { KalendsRangeError, rollSeries, seriesFromColumns } from '../../src/index.js';
import { reference, relativeError, rowsArb, same, valid } from './reference.js';

type Row = [number, number];

/** Brute force: the rows of row i's window, by the stated edge rules, scanning every row. */
function windowRows(rows: Row[], i: number, spec: { rows: number } | { lengthMs: number }, startInc: boolean, endInc: boolean): number[] {
  const t = rows[i]![0];
  if ('rows' in spec) return rows.slice(Math.max(0, i - spec.rows + 1), i + 1).map((r) => r[1]);
  const s = t - spec.lengthMs;
  return rows.filter(([u]) => (startInc ? u >= s : u > s) && (endInc ? u <= t : u < t)).map((r) => r[1]);
}

const specArb = fc.oneof(
  fc.integer({ min: 1, max: 12 }).map((n) => ({ rows: n })),
  fc.integer({ min: 1, max: 600 }).map((L) => ({ lengthMs: L })),
);

describe('rolling windows against brute force (fast-check, seeded)', () => {
  it('count, min and max are exact; sum and mean within 1e-12 relative of the exact sums; variance and standard deviation within 1e-10 relative', () => {
    fc.assert(
      fc.property(rowsArb(90, 1500), specArb, fc.boolean(), fc.boolean(), fc.integer({ min: 0, max: 3 }), (rows, spec, startInc, endInc, minObs) => {
        const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) }, { inputOrder: 'sorted' });
        const out = rollSeries(s, {
          window: spec,
          aggregations: ['count', 'sum', 'mean', 'min', 'max', 'variance', { kind: 'stddev', estimator: 'population' }],
          minObservations: minObs,
          startInclusive: startInc,
          endInclusive: endInc,
        });
        rows.forEach((_, i) => {
          const w = valid(windowRows(rows, i, spec, startInc, endInc));
          const enough = w.length >= minObs; // with minObservations 0 an empty window still reports: sum 0, the rest NaN
          expect(out.columns.count![i]).toBe(w.length);
          expect(same(out.columns.min![i]!, enough ? reference.min(w) : NaN)).toBe(true);
          expect(same(out.columns.max![i]!, enough ? reference.max(w) : NaN)).toBe(true);
          expect(relativeError(out.columns.sum![i]!, enough ? reference.sum(w) : NaN)).toBeLessThan(1e-12);
          expect(relativeError(out.columns.mean![i]!, enough ? reference.mean(w) : NaN)).toBeLessThan(1e-12);
          const v = enough ? reference.variance(w, 1) : NaN;
          const ours = out.columns.variance![i]!;
          if (Number.isNaN(v)) expect(ours).toBeNaN();
          else expect(Math.abs(ours - v)).toBeLessThanOrEqual(1e-10 * v);
          const sd = enough ? Math.sqrt(reference.variance(w, 0)) : NaN;
          if (Number.isNaN(sd)) expect(out.columns.stddev![i]).toBeNaN();
          else expect(Math.abs(out.columns.stddev![i]! - sd)).toBeLessThanOrEqual(1e-10 * sd);
        });
      }),
      { seed: 7101, numRuns: 250 },
    );
  });

  it('fixed-length windows over columns without missing values (the branch-free fast path) match brute force', () => {
    fc.assert(
      fc.property(
        rowsArb(150, 3000).map((rows) => rows.map(([t, v]) => [t, Number.isNaN(v) ? 0.5 : v] as Row)),
        fc.integer({ min: 1, max: 900 }),
        fc.integer({ min: 1, max: 3 }),
        (rows, L, minObs) => {
          const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
          const out = rollSeries(s, { window: { lengthMs: L }, aggregations: ['count', 'sum', 'mean'], minObservations: minObs });
          rows.forEach((_, i) => {
            const w = windowRows(rows, i, { lengthMs: L }, false, true);
            expect(out.columns.count![i]).toBe(w.length);
            expect(relativeError(out.columns.sum![i]!, w.length >= minObs ? reference.sum(w) : NaN)).toBeLessThan(1e-12);
            expect(relativeError(out.columns.mean![i]!, w.length >= minObs ? reference.mean(w) : NaN)).toBeLessThan(1e-12);
          });
        },
      ),
      { seed: 7102, numRuns: 200 },
    );
  });

  it('the fast path never touches a row it has not added (a missing value right after a lone row)', () => {
    const s = seriesFromColumns([0, 100, 101], { v: [1, 2, NaN] });
    const out = rollSeries(s, { window: { lengthMs: 50 }, aggregations: ['sum'] });
    expect(Array.from(out.columns.sum!)).toEqual([1, 2, 2]);
  });

  it('a large value that has left the window leaves no error in the variance (two-stack merge, no subtraction)', () => {
    // Sample variance of 1, 2, 3 is 1 (mean 2, squares 1 + 0 + 1 = 2, divided by n - 1 = 2).
    const s = seriesFromColumns([0, 1, 2, 3, 4], { v: [1e12, -1e12, 1, 2, 3] });
    const out = rollSeries(s, { window: { rows: 3 }, aggregations: ['variance'] });
    expect(out.columns.variance![4]).toBe(1);
  });

  it('a 3-row window over a hand-made series (min observations 2)', () => {
    const s = seriesFromColumns([0, 1, 2, 3, 4], { v: [1, NaN, 3, 5, 7] });
    const out = rollSeries(s, { window: { rows: 3 }, aggregations: ['sum', 'min'], minObservations: 2 });
    expect(Array.from(out.columns.sum!)).toEqual([NaN, NaN, 4, 8, 15]);
    expect(Array.from(out.columns.min!)).toEqual([NaN, NaN, 1, 3, 3]);
  });

  it('time windows: end closed by default includes later rows at the same instant; start open by default', () => {
    const s = seriesFromColumns([0, 10, 10, 20], { v: [1, 2, 4, 8] });
    const out = rollSeries(s, { window: { lengthMs: 10 }, aggregations: ['sum'] });
    // (t-10, t]: row 0 -> {1}; rows 1 and 2 (t = 10) -> {2, 4}; row 3 (t = 20) -> {8}
    expect(Array.from(out.columns.sum!)).toEqual([1, 6, 6, 8]);
    const open = rollSeries(s, { window: { lengthMs: 10 }, aggregations: ['sum'], startInclusive: true, endInclusive: false });
    // [t-10, t): row 0 -> {}, rows at 10 -> {1}, row at 20 -> {2, 4}
    expect(Array.from(open.columns.sum!)).toEqual([NaN, 1, 1, 6]);
  });

  it('rejects zero and negative windows and unknown aggregations, naming the value', () => {
    const s = seriesFromColumns([0, 1], { v: [1, 2] });
    expect(() => rollSeries(s, { window: { rows: 0 }, aggregations: ['sum'] })).toThrow(/options.window.rows: expected a positive integer.*got 0/);
    expect(() => rollSeries(s, { window: { lengthMs: -5 }, aggregations: ['sum'] })).toThrow(/lengthMs.*got -5/);
    expect(() => rollSeries(s, { window: { lengthMs: 0 }, aggregations: ['sum'] })).toThrow(KalendsRangeError);
    expect(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['median' as never] })).toThrow(/unknown aggregation "median"; valid names are count, sum, mean, min, max, variance, stddev/);
    expect(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['maen' as never] })).toThrow(/did you mean "mean"/);
    expect(() => rollSeries(s, { window: { weeks: 2 } as never, aggregations: ['sum'] })).toThrow(/options.window: expected one of/);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fillSeries, joinAsOf, matchAsOf, seriesFromColumns } from '../../src/index.js';
import { rowsArb, same } from './reference.js';

describe('as-of join against brute force (fast-check, seeded)', () => {
  it('matchAsOf: the last right index at or before each left instant, within tolerance', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 500 }), { maxLength: 60 }).map((a) => a.sort((x, y) => x - y)),
        fc.array(fc.integer({ min: 0, max: 500 }), { maxLength: 60 }).map((a) => a.sort((x, y) => x - y)),
        fc.option(fc.integer({ min: 0, max: 100 }), { nil: undefined }),
        (left, right, tol) => {
          const idx = matchAsOf(left, right, tol === undefined ? {} : { toleranceMs: tol });
          left.forEach((x, i) => {
            let ref = -1;
            right.forEach((r, j) => {
              if (r <= x && (tol === undefined || x - r <= tol)) ref = j;
            });
            expect(idx[i]).toBe(ref);
          });
        },
      ),
      { seed: 7301, numRuns: 300 },
    );
  });

  it('joinAsOf: each right column takes its latest non-missing value at or before the left instant', () => {
    fc.assert(
      fc.property(rowsArb(40, 300), rowsArb(40, 300), fc.option(fc.integer({ min: 0, max: 60 }), { nil: undefined }), (l, r, tol) => {
        const left = seriesFromColumns(l.map((x) => x[0]), { a: l.map((x) => x[1]) });
        const right = seriesFromColumns(r.map((x) => x[0]), { b: r.map((x) => x[1]) });
        const out = joinAsOf(left, right, tol === undefined ? {} : { toleranceMs: tol });
        expect(out.columnNames).toEqual(['a', 'b']);
        l.forEach(([t], i) => {
          let ref = NaN;
          for (const [u, v] of r) if (u <= t && !Number.isNaN(v) && (tol === undefined || t - u <= tol)) ref = v;
          expect(same(out.columns.b![i]!, ref)).toBe(true);
        });
      }),
      { seed: 7302, numRuns: 300 },
    );
  });

  it('asks for a prefix on a name clash, and rejects unsorted arrays and negative tolerance', () => {
    const a = seriesFromColumns([0], { v: [1] });
    expect(() => joinAsOf(a, a)).toThrow(/pass a prefix/);
    expect(joinAsOf(a, a, { prefix: 'right.' }).columnNames).toEqual(['v', 'right.v']);
    expect(() => matchAsOf([2, 1], [0])).toThrow(/leftEpochMs: expected ascending instants, but \[1\] \(1\) comes before \[0\] \(2\)/);
    expect(() => matchAsOf([1], [0], { toleranceMs: -1 })).toThrow(/toleranceMs/);
  });
});

describe('filling onto a grid against brute force (fast-check, seeded)', () => {
  it('previous, next and linear, with a maximum gap', () => {
    fc.assert(
      fc.property(
        rowsArb(40, 400),
        fc.array(fc.integer({ min: -20, max: 420 }), { maxLength: 40 }).map((a) => a.sort((x, y) => x - y)),
        fc.constantFrom('previous', 'next', 'linear') as fc.Arbitrary<'previous' | 'next' | 'linear'>,
        fc.option(fc.integer({ min: 0, max: 80 }), { nil: undefined }),
        (rows, grid, method, maxGap) => {
          const s = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
          const out = fillSeries(s, { grid: { epochMs: grid }, method, ...(maxGap === undefined ? {} : { maxGapMs: maxGap }) });
          const gap = maxGap ?? Infinity;
          const ok = rows.filter((r) => !Number.isNaN(r[1]));
          grid.forEach((g, i) => {
            const before = ok.filter((r) => r[0] <= g);
            const after = ok.filter((r) => r[0] >= g);
            const p = before[before.length - 1];
            const q = after[0];
            let ref = NaN;
            if (method === 'previous') ref = p && g - p[0] <= gap ? p[1] : NaN;
            else if (method === 'next') ref = q && q[0] - g <= gap ? q[1] : NaN;
            else if (p && p[0] === g) ref = p[1];
            else if (p && q && q[0] - p[0] <= gap) ref = p[1] + ((q[1] - p[1]) * (g - p[0])) / (q[0] - p[0]);
            const ours = out.columns.v![i]!;
            if (Number.isNaN(ref)) expect(ours).toBeNaN();
            else expect(Math.abs(ours - ref)).toBeLessThanOrEqual(1e-12 * Math.max(Math.abs(p?.[1] ?? 0), Math.abs(q?.[1] ?? 0), 1));
          });
        },
      ),
      { seed: 7303, numRuns: 300 },
    );
  });

  it('linear interpolation halfway between two readings', () => {
    const s = seriesFromColumns([0, 100], { v: [10, 20] });
    expect(Array.from(fillSeries(s, { grid: { epochMs: [0, 25, 50, 100, 150] }, method: 'linear' }).columns.v!)).toEqual([10, 12.5, 15, 20, NaN]);
    expect(Array.from(fillSeries(s, { grid: { epochMs: [50] }, method: 'linear', maxGapMs: 99 }).columns.v!)).toEqual([NaN]);
  });

  it('rejects a bad method, an unsorted grid and a negative gap', () => {
    const s = seriesFromColumns([0], { v: [1] });
    expect(() => fillSeries(s, { grid: { epochMs: [0] }, method: 'nearest' as never })).toThrow(/options.method: expected one of "previous", "next", "linear", got "nearest"/);
    expect(() => fillSeries(s, { grid: { epochMs: [5, 1] } })).toThrow(/ascending/);
    expect(() => fillSeries(s, { grid: { epochMs: [0] }, maxGapMs: -1 })).toThrow(/maxGapMs/);
  });
});

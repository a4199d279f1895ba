import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { KalendsRangeError, KalendsTypeError, rollBulk, rollSeries, seriesFromColumns } from '../../src/index.js';
import { reference, relativeError, rowsArb, same, valid, valueArb } from './reference.js';

type Row = [number, number];

/** Brute force: the rows of row i's window, by the stated edge rules, scanning every row. */
function windowRows(rows: Row[], i: number, spec: { rows: number } | { lengthMs: number }, startInc: boolean, endInc: boolean): number[] {
  const t = rows[i]![0];
  // A window of n rows: the n rows through this one, or (end open) the n rows before it; no start instant.
  if ('rows' in spec) return (endInc ? rows.slice(Math.max(0, i - spec.rows + 1), i + 1) : rows.slice(Math.max(0, i - spec.rows), i)).map((r) => r[1]);
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
          ...('rows' in spec ? {} : { startInclusive: startInc }),
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

  it('fixed-length fast path over long series (several 4096-row blocks, runs of equal instants, bursts of removals) matches exact prefix sums', () => {
    // Reference: exact BigInt prefix sums over the generated values (k / 2^s, see reference.ts), window rows found by
    // scanning the instants directly; counts exact, sums and means within 1e-12 relative of the exact sums.
    const SCALE = 2 ** 40;
    fc.assert(
      fc.property(
        fc.integer({ min: 9000, max: 14000 }),
        fc.array(valueArb.filter((x) => !Number.isNaN(x)), { minLength: 64, maxLength: 64 }),
        fc.integer({ min: 1, max: 5 }),
        fc.integer({ min: 1, max: 400 }),
        fc.integer({ min: 0, max: 2 ** 31 - 1 }),
        (n, pool, maxGap, L, seed) => {
          let a = seed >>> 0;
          const rnd = () => {
            a = (Math.imul(a, 1664525) + 1013904223) >>> 0;
            return a / 2 ** 32;
          };
          const t = new Float64Array(n);
          const v = new Float64Array(n);
          let at = -5_000;
          for (let i = 0; i < n; i++) {
            // Mostly small gaps (0 makes runs of equal instants), now and then a jump that empties the window.
            at += rnd() < 0.002 ? L + Math.floor(rnd() * 3 * L) : Math.floor(rnd() * (maxGap + 1));
            t[i] = at;
            v[i] = pool[Math.floor(rnd() * pool.length)]!;
          }
          const out = rollSeries(seriesFromColumns(t, { v }, { inputOrder: 'sorted' }), { window: { lengthMs: L }, aggregations: ['count', 'sum', 'mean'] });
          const prefix: bigint[] = [0n];
          for (let i = 0; i < n; i++) prefix.push(prefix[i]! + BigInt(v[i]! * SCALE));
          let lo = 0;
          let hi = 0;
          for (let i = 0; i < n; i++) {
            while (t[lo]! <= t[i]! - L) lo++;
            while (hi < n && t[hi]! <= t[i]!) hi++;
            const exact = Number(prefix[hi]! - prefix[lo]!) / SCALE;
            if (out.columns.count![i] !== hi - lo) expect(`row ${i}: count ${out.columns.count![i]}`).toBe(`row ${i}: count ${hi - lo}`);
            const es = relativeError(out.columns.sum![i]!, exact);
            const em = relativeError(out.columns.mean![i]!, exact / (hi - lo));
            if (!(es < 1e-12 && em < 1e-12)) expect(`row ${i}: relative errors ${es}, ${em}`).toBe('below 1e-12');
          }
        },
      ),
      { seed: 7103, numRuns: 25 },
    );
  });

  it('a missing or infinite value late in a long column sends the fast path back to the general kernel (brute force agrees)', () => {
    const n = 9000;
    const t = Float64Array.from({ length: n }, (_, i) => i * 5 + (i % 3)); // ascending
    for (const bad of [Number.NaN, Infinity]) {
      const v = Float64Array.from({ length: n }, (_, i) => ((i * 37) % 101) / 8 - 6);
      v[n - 10] = bad;
      const out = rollSeries(seriesFromColumns(t, { v }), { window: { lengthMs: 40 }, aggregations: ['count', 'sum'] });
      const rows: Row[] = Array.from(t, (u, i) => [u, v[i]!]);
      for (const i of [0, 100, 5000, n - 11, n - 10, n - 1]) {
        const w = windowRows(rows, i, { lengthMs: 40 }, false, true);
        if (Number.isNaN(bad)) {
          expect(out.columns.count![i]).toBe(valid(w).length);
          expect(relativeError(out.columns.sum![i]!, reference.sum(valid(w)))).toBeLessThan(1e-12);
        } else {
          // Windows holding the infinite value sum to it; once it has left, the sums are finite and exact again.
          expect(out.columns.count![i]).toBe(w.length);
          if (w.includes(Infinity)) expect(out.columns.sum![i]).toBe(Infinity);
          else expect(relativeError(out.columns.sum![i]!, reference.sum(w))).toBeLessThan(1e-12);
        }
      }
    }
  });

  it('infinite values enter and leave windows like any other value (general kernel, property against brute force)', () => {
    // Brute force: the plain sum of each window's values (NaN skipped); +Infinity and -Infinity together give NaN.
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 400 }), fc.oneof(fc.integer({ min: -1_000_000, max: 1_000_000 }).map((k) => k / 16), fc.constantFrom(Infinity, -Infinity, NaN))), { minLength: 1, maxLength: 80 }),
        fc.integer({ min: 1, max: 120 }),
        (pairs, lengthMs) => {
          pairs.sort((a, b) => a[0] - b[0]);
          const t = Float64Array.from(pairs, (p) => p[0]);
          const v = Float64Array.from(pairs, (p) => p[1]);
          const out = rollSeries(seriesFromColumns(t, { v }, { inputOrder: 'sorted' }), { window: { lengthMs }, aggregations: ['count', 'sum', 'mean'] });
          const rows: Row[] = Array.from(t, (u, i) => [u, v[i]!]);
          for (let i = 0; i < rows.length; i++) {
            const w = valid(windowRows(rows, i, { lengthMs }, false, true));
            expect(out.columns.count![i]).toBe(w.length);
            const hasPos = w.some((x) => x === Infinity);
            const hasNeg = w.some((x) => x === -Infinity);
            const sum = out.columns.sum![i]!;
            if (w.length === 0) expect(sum).toBeNaN();
            else if (hasPos && hasNeg) expect(sum).toBeNaN();
            else if (hasPos || hasNeg) expect(sum).toBe(hasPos ? Infinity : -Infinity);
            else {
              // Finite values only, multiples of 1/16 whose sums are exact in a double: the plain sum is exact.
              let plain = 0;
              for (const x of w) plain += x;
              expect(sum).toBe(plain);
              expect(out.columns.mean![i]).toBe(plain / w.length);
            }
          }
        },
      ),
      { seed: 4242, numRuns: 300 },
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
    expect(() => rollSeries(s, { window: { rows: 0 }, aggregations: ['sum'] })).toThrow(/options.window.rows: expected an integer from 1 to .*got 0/);
    expect(() => rollSeries(s, { window: { lengthMs: -5 }, aggregations: ['sum'] })).toThrow(/lengthMs.*got -5/);
    expect(() => rollSeries(s, { window: { lengthMs: 0 }, aggregations: ['sum'] })).toThrow(KalendsRangeError);
    expect(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['median' as never] })).toThrow(/aggregation "median" is not offered here; valid names are count, sum, mean, min, max, variance, stddev/);
    expect(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['maen' as never] })).toThrow(/did you mean (".*" or )?"mean"/);
    expect(() => rollSeries(s, { window: { weeks: 2 } as never, aggregations: ['sum'] })).toThrow(/^options.window.weeks: unknown option; valid options are "rows", "lengthMs"/);
  });
});

describe('rollBulk (bare typed arrays, one aggregation)', () => {
  it('matches brute force for every aggregation, window kind and edge rule, with and without an out array (fast-check, seeded)', () => {
    // Same brute force as above (windowRows over every row); count, min and max exact, sum and mean within 1e-12
    // relative of the exact sums. Half the cases pass a longer out array, whose extra element must stay untouched.
    const names = ['count', 'sum', 'mean', 'min', 'max'] as const;
    fc.assert(
      fc.property(rowsArb(90, 1500), specArb, fc.constantFrom(...names), fc.boolean(), fc.boolean(), fc.integer({ min: 0, max: 3 }), fc.boolean(), (rows, spec, name, startInc, endInc, minObs, giveOut) => {
        const t = Float64Array.from(rows, (r) => r[0]);
        const v = Float64Array.from(rows, (r) => r[1]);
        const given = giveOut ? new Float64Array(rows.length + 1).fill(-7) : undefined;
        const edges = { ...('rows' in spec ? {} : { startInclusive: startInc }), endInclusive: endInc };
        const out = rollBulk(t, v, { window: spec, aggregation: name, minObservations: minObs, ...edges }, given);
        if (given) {
          expect(out).toBe(given);
          expect(given[rows.length]).toBe(-7);
        } else expect(out.length).toBe(rows.length);
        rows.forEach((_, i) => {
          const w = valid(windowRows(rows, i, spec, startInc, endInc));
          if (name === 'count') {
            expect(out[i]).toBe(w.length);
            return;
          }
          const want = w.length >= minObs ? reference[name](w) : NaN;
          if (name === 'min' || name === 'max') expect(same(out[i]!, want)).toBe(true);
          else expect(relativeError(out[i]!, want)).toBeLessThan(1e-12);
        });
      }),
      { seed: 7104, numRuns: 250 },
    );
  });

  it('rejects bad input with a typed error that names the value', () => {
    const t = Float64Array.from([0, 10, 20]);
    const v = Float64Array.from([1, 2, 3]);
    const opts = { window: { lengthMs: 15 }, aggregation: 'mean' } as const;
    // Plain arrays and other typed arrays are read once, each element checked (docs/design.md, "Input rules").
    expect(Array.from(rollBulk([0, 10, 20], Int32Array.from([1, 2, 3]), opts))).toEqual(Array.from(rollBulk(t, v, opts)));
    expect(() => rollBulk([0, '10', 20] as never, v, opts)).toThrow(KalendsTypeError);
    expect(() => rollBulk([0, '10', 20] as never, v, opts)).toThrow(/^epochMs\[1\]: expected a number, got "10"/);
    expect(() => rollBulk(t, [1, null, 3] as never, opts)).toThrow(/^values\[1\]: expected a number, got null/);
    expect(() => rollBulk(t, [1, , 3] as never, opts)).toThrow(/^values\[1\]: expected a number, got a hole/);
    expect(() => rollBulk(t, v, opts, [0, 0, 0] as never)).toThrow(/^out: expected a Float64Array or undefined, got an array/);
    expect(() => rollBulk(Float64Array.from([0, 1, 9e15]), v, opts)).toThrow(/^epochMs\[2\]: expected epoch milliseconds from/);
    expect(() => rollBulk(t, Float64Array.from([1, 2]), opts)).toThrow(/values: expected 3 values \(one per instant\), got 2/);
    expect(() => rollBulk(t, v, opts, new Float64Array(2))).toThrow(/out: expected a Float64Array of at least 3 elements/);
    expect(() => rollBulk(Float64Array.from([0, 20, 10]), v, opts)).toThrow(/epochMs: expected ascending instants, but \[2\] \(10\) comes before \[1\] \(20\)/);
    expect(() => rollBulk(Float64Array.from([0, NaN, 10]), v, opts)).toThrow(/epochMs\[1\]: expected an instant, got NaN/);
    expect(() => rollBulk(t, v, { window: { lengthMs: 0 }, aggregation: 'mean' })).toThrow(KalendsRangeError);
    expect(() => rollBulk(t, v, { window: { rows: -1 }, aggregation: 'sum' })).toThrow(/got -1/);
    expect(() => rollBulk(t, v, { window: { rows: 2 }, aggregation: 'median' as never })).toThrow(/aggregation "median" is not offered here/);
    let caught: unknown;
    try {
      rollBulk(Float64Array.from([0, 20, 10]), v, opts);
    } catch (e) {
      caught = e;
    }
    expect(caught).toMatchObject({ code: 'unsorted', received: 10, path: 'epochMs[2]' });
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { KalendsRangeError, seriesFromColumns, smoothSeries } from '../../src/index.js';
import { rowsArb, same } from './reference.js';

/**
 * NIST/SEMATECH e-Handbook of Statistical Methods, section 6.4.3.1 "Single Exponential Smoothing": S₂ = y₁,
 * Sₜ = α yₜ₋₁ + (1 − α) Sₜ₋₁. Its example smooths twelve observations (71, 70, 69, 68, 64, 65, 72, 78, 75, 75,
 * 75, 70; the data from memory) with α = 0.1; section 6.4.3.2 "Forecasting with Single Exponential Smoothing"
 * continues it: "The last data point in the previous example was 70 and its forecast (smoothed value S) was
 * 71.7". Our row i is the handbook's Sᵢ₊₁, so the row before the last carries that 71.7.
 */
const NIST_DATA = [71, 70, 69, 68, 64, 65, 72, 78, 75, 75, 75, 70];

function handbook(y: readonly number[], alpha: number): number[] {
  // S[t] for t = 2..n+1, straight from the handbook's definition.
  const S: number[] = [];
  S[2] = y[0]!;
  for (let t = 3; t <= y.length + 1; t++) S[t] = alpha * y[t - 2]! + (1 - alpha) * S[t - 1]!;
  return S;
}

describe('exponentially weighted mean (NIST/SEMATECH e-Handbook 6.4.3.1 and 6.4.3.2)', () => {
  const s = seriesFromColumns(
    NIST_DATA.map((_, i) => i * 86_400_000),
    { y: NIST_DATA },
  );
  it('α = 0.1: the smoothed value at the eleventh observation rounds to the handbook\'s 71.7', () => {
    const out = smoothSeries(s, { alpha: 0.1 }).columns.smoothed!;
    expect(Number(out[10]!.toFixed(1))).toBe(71.7);
    // The handbook's bootstrapping step in 6.4.3.2: S = .1(70) + .9(71.7) = 71.5 (rounded).
    expect(Number(out[11]!.toFixed(1))).toBe(71.5);
  });
  it('every row equals the handbook recursion Sᵢ₊₁ (α = 0.1 and 0.5)', () => {
    for (const alpha of [0.1, 0.5]) {
      const S = handbook(NIST_DATA, alpha);
      const out = smoothSeries(s, { alpha }).columns.smoothed!;
      NIST_DATA.forEach((_, i) => expect(out[i]).toBeCloseTo(S[i + 2]!, 12));
    }
  });
  it('equivalent window rows and half-life give α = 2/(n+1) and 1 - 2^(-1/h)', () => {
    const bySpan = smoothSeries(s, { equivalentWindowRows: 19 }).columns.smoothed!;
    const byAlpha = smoothSeries(s, { alpha: 0.1 }).columns.smoothed!;
    bySpan.forEach((v, i) => expect(v).toBeCloseTo(byAlpha[i]!, 12));
    const h = smoothSeries(s, { halfLife: 1 }).columns.smoothed!; // α = 1/2
    const half = smoothSeries(s, { alpha: 0.5 }).columns.smoothed!;
    h.forEach((v, i) => expect(v).toBeCloseTo(half[i]!, 12));
  });
  it('time-aware half-life on a regular daily grid equals the row half-life', () => {
    const timed = smoothSeries(s, { halfLifeMs: 3 * 86_400_000 }).columns.smoothed!;
    const rows = smoothSeries(s, { halfLife: 3 }).columns.smoothed!;
    timed.forEach((v, i) => expect(v).toBeCloseTo(rows[i]!, 12));
  });

  it('property: the normalized form equals Σ wⱼ yⱼ / Σ wⱼ with wⱼ = 2^(-(tᵢ - tⱼ)/h) over the values so far', () => {
    fc.assert(
      fc.property(rowsArb(60, 5000), fc.integer({ min: 1, max: 4000 }), (rows, h) => {
        const series = seriesFromColumns(rows.map((r) => r[0]), { v: rows.map((r) => r[1]) });
        const out = smoothSeries(series, { halfLifeMs: h, form: 'normalized' }).columns.smoothed!;
        rows.forEach(([ti], i) => {
          let num = 0;
          let den = 0;
          for (let j = 0; j <= i; j++) {
            const [tj, y] = rows[j]!;
            if (Number.isNaN(y)) continue;
            const w = 2 ** (-(ti - tj) / h);
            num += w * y;
            den += w;
          }
          const ref = den > 0 ? num / den : NaN;
          if (Number.isNaN(ref)) expect(out[i]).toBeNaN();
          else expect(Math.abs(out[i]! - ref)).toBeLessThanOrEqual(1e-9 * Math.max(1, ...rows.slice(0, i + 1).map((r) => (Number.isNaN(r[1]) ? 0 : Math.abs(r[1])))));
        });
      }),
      { seed: 7201, numRuns: 150 },
    );
  });

  it('missing values are skipped: the result at a missing row is the mean so far', () => {
    const m = seriesFromColumns([0, 1, 2, 3], { v: [NaN, 10, NaN, 20] });
    const out = smoothSeries(m, { alpha: 0.5 }).columns.smoothed!;
    expect([0, 1, 2, 3].map((i) => out[i]!)).toEqual([NaN, 10, 10, 15]);
    expect(same(smoothSeries(m, { alpha: 0.5, minObservations: 2 }).columns.smoothed![1]!, NaN)).toBe(true);
  });

  it('rejects bad parameters, naming them', () => {
    expect(() => smoothSeries(s, { alpha: 0 })).toThrow(/options.alpha: expected a number with 0 < alpha <= 1, got 0/);
    expect(() => smoothSeries(s, { alpha: 1.5 })).toThrow(KalendsRangeError);
    expect(() => smoothSeries(s, { equivalentWindowRows: 0.5 })).toThrow(/options.equivalentWindowRows/);
    expect(() => smoothSeries(s, { halfLifeMs: -1 })).toThrow(/options.halfLifeMs/);
    expect(() => smoothSeries(s, { alpha: 0.1, equivalentWindowRows: 3 })).toThrow(/exactly one of .* got alpha and equivalentWindowRows/);
    expect(() => smoothSeries(s, {})).toThrow(/got none/);
  });
});

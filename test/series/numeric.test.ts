import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { quantileOfSorted, twoPassVariance, compensatedSum } from '../../src/series/numeric.js';
import { exactSum, reference, relativeError, valueArb, valid } from './reference.js';

describe('quantiles (Hyndman & Fan 1996, The American Statistician 50(4):361-365)', () => {
  // Worked example: the 40th percentile of 15, 20, 35, 40, 50 (the data set from memory). The NIST/SEMATECH
  // e-Handbook, section 7.2.5.2 "Percentiles", gives rank p(N+1) (Hyndman & Fan definition 6) as its method and
  // notes p(N-1)+1 (definition 7) as an alternative; the encyclopedia article "Percentile", section "Alternative
  // methods", states that the two give 26 and 29 for this example (ranks 2.4 and 2.6 between 20 and 35).
  const data = Float64Array.of(15, 20, 35, 40, 50);
  it('definition 7 gives 29 for the 40th percentile of 15, 20, 35, 40, 50', () => {
    expect(quantileOfSorted(data, 5, 0.4, 'hyndman-fan-7')).toBeCloseTo(29, 12);
  });
  it('definition 6 (NIST primary method) gives 26 for the same data', () => {
    expect(quantileOfSorted(data, 5, 0.4, 'hyndman-fan-6')).toBeCloseTo(26, 12);
  });
  it('definition 7 gives the minimum at 0, the maximum at 1, and the middle value as the median', () => {
    expect(quantileOfSorted(data, 5, 0, 'hyndman-fan-7')).toBe(15);
    expect(quantileOfSorted(data, 5, 1, 'hyndman-fan-7')).toBe(50);
    expect(quantileOfSorted(data, 5, 0.5, 'hyndman-fan-7')).toBe(35);
    expect(quantileOfSorted(Float64Array.of(1, 2, 3, 4), 4, 0.5, 'hyndman-fan-7')).toBe(2.5);
  });
  it('definition 6 clamps below rank 1 and above rank n', () => {
    expect(quantileOfSorted(data, 5, 0.1, 'hyndman-fan-6')).toBe(15);
    expect(quantileOfSorted(data, 5, 0.99, 'hyndman-fan-6')).toBe(50);
  });
});

describe('compensated sums and two-pass variance against exact references', () => {
  it('property: compensated sum has relative error < 1e-12 against the exact (BigInt) sum', () => {
    fc.assert(
      fc.property(fc.array(valueArb, { maxLength: 300 }), (values) => {
        const a = Float64Array.from(values);
        const scratch = new Float64Array(1);
        const s = compensatedSum(a, 0, a.length, scratch);
        expect(scratch[0]).toBe(valid(values).length);
        expect(relativeError(s, exactSum(valid(values)))).toBeLessThan(1e-12);
      }),
      { seed: 7002, numRuns: 300 },
    );
  });
  it('Neumaier compensation recovers what naive summation loses (1e16 + 1 - 1e16)', () => {
    const a = Float64Array.of(1e16, 1, -1e16);
    expect(a[0]! + a[1]! + a[2]!).toBe(0); // the naive sum loses the 1
    expect(compensatedSum(a, 0, 3, new Float64Array(1))).toBe(1);
  });
  it('property: variance matches the definition within 1e-10 relative', () => {
    fc.assert(
      fc.property(fc.array(valueArb, { maxLength: 100 }), fc.constantFrom(0, 1), (values, ddof) => {
        const a = Float64Array.from(values);
        const ours = twoPassVariance(a, 0, a.length, ddof, new Float64Array(1));
        const ref = reference.variance(valid(values), ddof);
        expect(relativeError(ours, ref)).toBeLessThan(1e-10);
      }),
      { seed: 7003, numRuns: 300 },
    );
  });
  it('variance is stable for values with a large common offset (where the textbook one-pass formula fails)', () => {
    const a = Float64Array.of(1e9 + 4, 1e9 + 7, 1e9 + 13, 1e9 + 16);
    // Sample variance of 4, 7, 13, 16 is 30 (mean 10; squares 36+9+9+36 = 90; 90 / 3).
    expect(twoPassVariance(a, 0, 4, 1, new Float64Array(1))).toBe(30);
  });
});

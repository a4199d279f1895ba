/**
 * The bulk kernels find an instant's UTC day (and its local day from its wall-clock time) as
 * Math.floor(t * 1.1574074074074074e-8), the double nearest to 1 / 86,400,000, instead of
 * Math.floor(t / 86_400_000). This test proves the two equal for every double t of the supported range (±8.64e15
 * ms, ECMA-262 section 21.4.1.1, "Time Values and Time Range") widened by two days on each side (the kernels also
 * floor wall-clock times, an instant plus its offset): it checks both sides of every midnight in it, the midnight
 * itself and the largest double below it. Since a correctly rounded multiplication by a positive constant (IEEE
 * 754-2019, section 4.3) never decreases as t grows, a floor that is right at both sides of every midnight is right
 * everywhere between them.
 */
import { describe, expect, it } from 'vitest';

const DAY = 86_400_000;
const PER_DAY = 1.1574074074074074e-8;

describe('the multiplication that finds a UTC day', () => {
  it('is the double nearest to 1 / 86,400,000', () => {
    expect(PER_DAY).toBe(1 / DAY);
  });

  it('gives the same day as the division on both sides of all 200,000,005 midnights within two days of the range', () => {
    const f = new Float64Array(1);
    const bits = new BigInt64Array(f.buffer);
    let wrong = 0;
    let first: number | undefined;
    for (let m = -100_000_002; m <= 100_000_002; m++) {
      const midnight = m * DAY;
      // The largest double below the midnight: one step of the bit pattern toward -Infinity.
      f[0] = midnight;
      if (midnight > 0) bits[0] = bits[0]! - 1n;
      else if (midnight < 0) bits[0] = bits[0]! + 1n;
      const below = midnight === 0 ? -Number.MIN_VALUE : f[0]!;
      if (Math.floor(midnight * PER_DAY) !== Math.floor(midnight / DAY) || Math.floor(below * PER_DAY) !== Math.floor(below / DAY)) {
        wrong++;
        first ??= midnight;
      }
    }
    expect({ wrong, first }).toEqual({ wrong: 0, first: undefined });
  });
});

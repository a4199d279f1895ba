/**
 * Numerically careful kernels over contiguous runs of a Float64Array: compensated sums, two-pass variance and
 * sample quantiles. NaN is "missing" and is skipped.
 *
 * @module
 */

/**
 * Compensated (Neumaier) sum of the non-missing values in `a[lo, hi)`. Neumaier's improvement of Kahan
 * summation (A. Neumaier, "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher Summen", ZAMM 54,
 * 1974) also compensates when an addend is larger than the running sum. Writes the count of non-missing values
 * to `scratch[0]`.
 * @internal
 */
export function compensatedSum(a: Float64Array, lo: number, hi: number, scratch: Float64Array): number {
  let s = 0;
  let c = 0;
  let n = 0;
  for (let i = lo; i < hi; i++) {
    const x = a[i]!;
    if (x !== x) continue;
    const t = s + x;
    if (Math.abs(s) >= Math.abs(x)) c += s - t + x;
    else c += x - t + s;
    s = t;
    n++;
  }
  scratch[0] = n;
  // An infinite addend makes the compensation NaN (Infinity - Infinity); the plain sum is then the answer
  // (±Infinity, or NaN when both signs occurred).
  return s - s === 0 ? s + c : s;
}

/**
 * Variance of the non-missing values in `a[lo, hi)` by the corrected two-pass algorithm (T. F. Chan, G. H.
 * Golub, R. J. LeVeque, "Algorithms for computing the sample variance", The American Statistician 37(3), 1983):
 * `(Σ(x - m)² - (Σ(x - m))² / n) / (n - ddof)`, with `m` the compensated mean. NaN when fewer than `ddof + 1`
 * values.
 * @internal
 */
export function twoPassVariance(a: Float64Array, lo: number, hi: number, ddof: number, scratch: Float64Array): number {
  const sum = compensatedSum(a, lo, hi, scratch);
  const n = scratch[0]!;
  if (n <= ddof) return Number.NaN;
  const m = sum / n;
  let s2 = 0;
  let c2 = 0;
  let s1 = 0;
  for (let i = lo; i < hi; i++) {
    const x = a[i]!;
    if (x !== x) continue;
    const d = x - m;
    s1 += d;
    const sq = d * d;
    const t = s2 + sq;
    c2 += s2 >= sq ? s2 - t + sq : sq - t + s2;
    s2 = t;
  }
  const v = (s2 + c2 - (s1 * s1) / n) / (n - ddof);
  return v < 0 ? 0 : v;
}

/** How a sample quantile interpolates between order statistics. */
export type QuantileMethod = 'hyndman-fan-7' | 'hyndman-fan-6';

/**
 * Sample quantile `p` (0..1) of the sorted values `s[0, n)`, by definition 7 or 6 of R. J. Hyndman and Y. Fan,
 * "Sample quantiles in statistical packages", The American Statistician 50(4), 1996, 361-365.
 * Definition 7: h = (n - 1)p + 1 (1-based rank), linear between neighbours; the minimum at p = 0, the maximum at
 * p = 1. Definition 6: h = (n + 1)p, clamped to [1, n] (the NIST/SEMATECH e-Handbook's primary percentile
 * method, section 7.2.5.2).
 * @internal
 */
export function quantileOfSorted(s: Float64Array, n: number, p: number, method: QuantileMethod): number {
  if (n === 0) return Number.NaN;
  // h is a 1-based fractional rank.
  let h = method === 'hyndman-fan-7' ? (n - 1) * p + 1 : (n + 1) * p;
  if (h < 1) h = 1;
  if (h > n) h = n;
  const k = Math.floor(h);
  const d = h - k;
  const lower = s[k - 1]!;
  if (d === 0 || k >= n) return lower;
  return lower + d * (s[k]! - lower);
}

/**
 * Copies the non-missing values of `a[lo, hi)` into `scratch`, sorts them and returns how many there are.
 * @internal
 */
export function sortedValid(a: Float64Array, lo: number, hi: number, scratch: Float64Array): number {
  let n = 0;
  for (let i = lo; i < hi; i++) {
    const x = a[i]!;
    if (x === x) scratch[n++] = x;
  }
  scratch.subarray(0, n).sort();
  return n;
}

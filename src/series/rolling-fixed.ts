/**
 * The fast path of rolling `count`, `sum` and `mean` over a fixed-length window (t - L, t] of a column without
 * missing values: the benchmarked case, kept apart from the general kernel in rolling.ts.
 *
 * @module
 */

/** Rows per block; each block starts by moving the origin of both running sums (see {@link fixedLengthSums}). */
const BLOCK = 4096;

/**
 * @internal Rolling count (`what` 0), sum (1) or mean (2) over (t - lengthMs, t] for every row, written into
 * `out`. Returns false, leaving `out` partly written, when the column holds a missing or infinite value (or a
 * sum overflows): the caller then runs the general kernel.
 *
 * The window sum is the difference of two running sums that never subtract: a head sum of every row added so
 * far and a tail sum of every row removed so far, each kept as an unevaluated pair (sum, error) by Knuth's
 * TwoSum, so both are exact up to the rounding of the error term. Every {@link BLOCK} rows the tail sum is
 * subtracted from both (an exact TwoSum again), so the pairs only ever hold one window plus one block of rows
 * and their error does not grow with the length of the series.
 *
 * Three choices keep unpredictable branches out of the loop, which is what made the plain two-pointer version
 * slow (a mispredicted "one more row leaves?" test per row costs more than all the arithmetic):
 * - The head adds exactly row i at row i, with no loop. Rows that share an instant with the next row would then
 *   miss their later twins (the end of the window is closed), so the last row of each run of equal instants
 *   writes its result back over the run: each row is written at most twice.
 * - The tail tests its next three rows at once, branch-free (a comparison turned into 0 or 1 multiplies the
 *   value), and sums them exactly (TwoSum tree) before one update of the tail pair; only a fourth removed row
 *   takes a loop (about one row in fifteen in the benchmark).
 * - No value is tested for NaN in the loop: a NaN or infinity anywhere (even one multiplied by 0 in the
 *   look-ahead) makes the pairs NaN for good, which the single test at the end catches.
 * Row i never leaves its own window (t - L < t), so the tail stays at or before row i and the look-ahead reads
 * rows below i + 3; the last two rows take the plain loop.
 */
export function fixedLengthSums(t: Float64Array, v: Float64Array, lengthMs: number, what: 0 | 1 | 2, minObs: number, out: Float64Array): boolean {
  const n = t.length;
  // Every row must lie inside its own window (t - L < t); a length below half an ulp of the instants breaks that.
  if (n > 0 && !(t[0]! - lengthMs < t[0]! && t[n - 1]! - lengthMs < t[n - 1]!)) return false;
  // Head pair (ph, ch): rows [0, i]; tail pair (pt, ct): rows [0, l); both measured from the same origin.
  let ph = 0;
  let ch = 0;
  let pt = 0;
  let ct = 0;
  let l = 0;
  // First row of the current run of equal instants.
  let run = 0;
  const end = n - 2;
  let i = 0;
  for (let i0 = 0; i0 < end; i0 += BLOCK) {
    const i1 = i0 + BLOCK < end ? i0 + BLOCK : end;
    // Move the origin to the tail: (ph, ch) -= (pt, ct), the leading part by TwoSum.
    let y = ph - pt;
    let b = y - ph;
    ch = ch - ct + (ph - (y - b) + (-pt - b));
    ph = y;
    pt = 0;
    ct = 0;
    for (i = i0; i < i1; i++) {
      const e = t[i]!;
      const st = e - lengthMs;
      let x = v[i]!;
      y = ph + x;
      b = y - ph;
      ch += ph - (y - b) + (x - b);
      ph = y;
      const a0 = +(t[l]! <= st);
      const a1 = +(t[l + 1]! <= st);
      const a2 = +(t[l + 2]! <= st);
      const x0 = v[l]! * a0;
      const x1 = v[l + 1]! * a1;
      const x2 = v[l + 2]! * a2;
      const y01 = x0 + x1;
      b = y01 - x0;
      let er = x0 - (y01 - b) + (x1 - b);
      const r = y01 + x2;
      b = r - y01;
      er += y01 - (r - b) + (x2 - b);
      y = pt + r;
      b = y - pt;
      ct += pt - (y - b) + (r - b) + er;
      pt = y;
      l += a0 + a1 + a2;
      while (t[l]! <= st) {
        x = v[l++]!;
        y = pt + x;
        b = y - pt;
        ct += pt - (y - b) + (x - b);
        pt = y;
      }
      const cnt = i + 1 - l;
      const o = what === 0 ? cnt : cnt >= minObs ? (what === 2 ? (ph - pt + (ch - ct)) / cnt : ph - pt + (ch - ct)) : Number.NaN;
      out[i] = o;
      if (t[i + 1]! !== e) {
        for (let j = run; j < i; j++) out[j] = o;
        run = i + 1;
      }
    }
  }
  for (i = end > 0 ? end : 0; i < n; i++) {
    const e = t[i]!;
    const st = e - lengthMs;
    let x = v[i]!;
    let y = ph + x;
    let b = y - ph;
    ch += ph - (y - b) + (x - b);
    ph = y;
    while (t[l]! <= st) {
      x = v[l++]!;
      y = pt + x;
      b = y - pt;
      ct += pt - (y - b) + (x - b);
      pt = y;
    }
    const cnt = i + 1 - l;
    const o = what === 0 ? cnt : cnt >= minObs ? (what === 2 ? (ph - pt + (ch - ct)) / cnt : ph - pt + (ch - ct)) : Number.NaN;
    out[i] = o;
    if (i + 1 === n || t[i + 1]! !== e) {
      for (let j = run; j < i; j++) out[j] = o;
      run = i + 1;
    }
  }
  return Number.isFinite(ph + ch + pt + ct);
}

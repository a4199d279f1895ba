/**
 * The rolling aggregates over the windows of a {@link WindowCursor}, each in O(n): compensated running sums for
 * count, sum and mean (with the branch-free fixed-length fast path of rolling-fixed.ts), a two-stack queue of
 * mergeable variance states, and monotonic deques for min and max. Kept apart from the window specs
 * (rolling-window.ts) and the public functions (rolling.ts) so that V8 compiles each loop on its own.
 *
 * @module
 */
import type { AggregationName } from './aggregate.js';
import { fixedLengthSums } from './rolling-fixed.js';
import { type ResolvedWindow, WindowCursor } from './rolling-window.js';

/** The aggregations a rolling window offers. */
export type RollingAggregationName = Extract<AggregationName, 'count' | 'sum' | 'mean' | 'min' | 'max' | 'variance' | 'stddev'>;

/**
 * @internal Rolling aggregate `kind` of `v` over the windows of `win`, written into `out`. O(n); allocates
 * nothing except the variance stacks.
 */
export function rollKernel(
  t: Float64Array,
  v: Float64Array,
  win: ResolvedWindow,
  kind: RollingAggregationName,
  minObs: number,
  ddof: number,
  out: Float64Array,
): Float64Array {
  const n = v.length;
  const cur = new WindowCursor(t, win);
  if ((kind === 'count' || kind === 'sum' || kind === 'mean') && win.kind === 1 && !win.startInclusive && win.endInclusive) {
    if (fixedLengthSums(t, v, win.lengthMs, kind === 'count' ? 0 : kind === 'sum' ? 1 : 2, minObs, out)) return out;
  }
  if (kind === 'count' || kind === 'sum' || kind === 'mean') {
    // Finite values go into a compensated running sum; infinite ones are counted apart (a running sum could not
    // take an infinity back out: Infinity - Infinity is NaN), and decide the result while any is in the window.
    let s = 0;
    let c = 0;
    let cnt = 0;
    let posInf = 0;
    let negInf = 0;
    let L = 0;
    let H = 0;
    const what = kind === 'count' ? 0 : kind === 'sum' ? 1 : 2;
    for (let i = 0; i < n; i++) {
      cur.move(i);
      const hiI = cur.hi;
      while (H < hiI) {
        const x = v[H++]!;
        if (x === x) {
          cnt++;
          if (x - x !== 0) {
            if (x > 0) posInf++;
            else negInf++;
            continue;
          }
          const y = s + x;
          if (Math.abs(s) >= Math.abs(x)) c += s - y + x;
          else c += x - y + s;
          s = y;
        }
      }
      const loI = cur.lo;
      while (L < loI) {
        const x = -v[L++]!;
        if (x === x) {
          if (x - x !== 0) {
            if (x < 0) posInf--;
            else negInf--;
          } else {
            const y = s + x;
            if (Math.abs(s) >= Math.abs(x)) c += s - y + x;
            else c += x - y + s;
            s = y;
          }
          if (--cnt === 0) s = c = 0;
        }
      }
      let total = s + c;
      if (posInf > 0) total = negInf > 0 ? Number.NaN : Number.POSITIVE_INFINITY;
      else if (negInf > 0) total = Number.NEGATIVE_INFINITY;
      out[i] = what === 0 ? cnt : cnt >= minObs ? (what === 2 ? total / cnt : total) : Number.NaN;
    }
    return out;
  }
  if (kind === 'variance' || kind === 'stddev') {
    // A queue made of two stacks, each element carrying the (count, mean, M2) of the values from it to the
    // stack's bottom, merged by Chan, Golub & LeVeque's pairwise formula. Values are only ever merged, never
    // subtracted, so a large value that has left the window leaves no cancellation error behind.
    // Front stack: rows [L, mid), with suffix aggregates fN/fMean/fM2 at each row; back stack: rows [mid, H),
    // kept as one running aggregate.
    const fN = new Float64Array(n);
    const fMean = new Float64Array(n);
    const fM2 = new Float64Array(n);
    let bN = 0;
    let bMean = 0;
    let bM2 = 0;
    let L = 0;
    let mid = 0;
    let H = 0;
    const variance = kind === 'variance';
    for (let i = 0; i < n; i++) {
      cur.move(i);
      const hiI = cur.hi;
      while (H < hiI) {
        const x = v[H++]!;
        if (x === x) {
          bN++;
          const d = x - bMean;
          bMean += d / bN;
          bM2 += d * (x - bMean);
        }
      }
      const loI = cur.lo;
      if (loI >= mid && loI > L) {
        // The front is used up: move the back stack over, computing suffix aggregates from the newest row.
        let cN = 0;
        let cMean = 0;
        let cM2 = 0;
        for (let j = H - 1; j >= mid; j--) {
          const x = v[j]!;
          if (x === x) {
            cN++;
            const d = x - cMean;
            cMean += d / cN;
            cM2 += d * (x - cMean);
          }
          fN[j] = cN;
          fMean[j] = cMean;
          fM2[j] = cM2;
        }
        mid = H;
        bN = 0;
        bMean = 0;
        bM2 = 0;
      }
      if (loI > L) L = loI;
      let cnt = bN;
      let m2 = bM2;
      if (L < mid) {
        const aN = fN[L]!;
        if (aN > 0) {
          if (bN === 0) {
            cnt = aN;
            m2 = fM2[L]!;
          } else {
            cnt = aN + bN;
            const d = bMean - fMean[L]!;
            m2 = fM2[L]! + bM2 + (d * d * aN * bN) / cnt;
          }
        }
      }
      if (cnt >= minObs && cnt > ddof) {
        const value = m2 > 0 ? m2 / (cnt - ddof) : 0;
        out[i] = variance ? value : Math.sqrt(value);
      } else out[i] = Number.NaN;
    }
    return out;
  }
  // min / max: a monotonic deque of row indices whose values are strictly better than every later one.
  const dq = new Int32Array(n);
  let head = 0;
  let tail = 0;
  let H = 0;
  let L = 0;
  let cnt = 0;
  const isMin = kind === 'min';
  for (let i = 0; i < n; i++) {
    cur.move(i);
    const hiI = cur.hi;
    while (H < hiI) {
      const x = v[H]!;
      if (x === x) {
        if (isMin) while (tail > head && v[dq[tail - 1]!]! >= x) tail--;
        else while (tail > head && v[dq[tail - 1]!]! <= x) tail--;
        dq[tail++] = H;
        cnt++;
      }
      H++;
    }
    const loI = cur.lo;
    while (L < loI) if (v[L] === v[L++]) cnt--;
    while (head < tail && dq[head]! < loI) head++;
    out[i] = head < tail && cnt >= minObs ? v[dq[head]!]! : Number.NaN;
  }
  return out;
}

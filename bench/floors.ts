/**
 * The floors of the benchmarks (issue 17, section 1): for each job, the cheapest honest loop that does the same
 * job on tables precomputed outside the timed runs, so that a "x floor" figure measures our kernel against the
 * work itself, not against a loop doing less. Each kernel is a small function of its own, called through
 * `Reflect.apply` like ours (see DEVELOPERS.md, "Hot loops in V8"). The zone tables are built from
 * temporal-polyfill's own transition search, so they share nothing with kalends.
 */
import { Temporal } from 'temporal-polyfill';

/**
 * Per UTC day from d0: `offsets`, the day's offset (ms), NaN on a day with a transition; for those days, the
 * transition (`changeAt`, +Infinity on other days) and the offsets before and after it.
 */
export interface ZoneDayFloorTable {
  readonly d0: number;
  readonly offsets: Float64Array;
  readonly before: Float64Array;
  readonly changeAt: Float64Array;
  readonly after: Float64Array;
}

/** The offset table of `zone` over the UTC days [fromMs, toMs) (whole days), from temporal-polyfill. */
export function zoneDayFloorTable(zone: string, fromMs: number, toMs: number): ZoneDayFloorTable {
  const d0 = Math.floor(fromMs / 86_400_000);
  const days = Math.ceil(toMs / 86_400_000) - d0;
  const before = new Float64Array(days);
  const changeAt = new Float64Array(days).fill(Infinity);
  const after = new Float64Array(days);
  let z = Temporal.Instant.fromEpochMilliseconds(d0 * 86_400_000).toZonedDateTimeISO(zone);
  let off = z.offsetNanoseconds / 1e6;
  let next = z.getTimeZoneTransition('next');
  for (let k = 0; k < days; k++) {
    const end = (d0 + k + 1) * 86_400_000;
    before[k] = off;
    after[k] = off;
    if (next && next.epochMilliseconds < end) {
      if (changeAt[k] !== Infinity) throw new Error('zoneDayFloorTable: two transitions in one day');
      changeAt[k] = next.epochMilliseconds;
      off = next.offsetNanoseconds / 1e6;
      after[k] = off;
      z = next;
      next = z.getTimeZoneTransition('next');
      if (next && next.epochMilliseconds < end) throw new Error('zoneDayFloorTable: two transitions in one day');
    }
  }
  const offsets = Float64Array.from(changeAt, (c, k) => (c === Infinity ? before[k]! : Number.NaN));
  return { d0, offsets, before, changeAt, after };
}

/**
 * Local day numbers from instants: one load of the day's offset (on the rare transition day, which side of it by
 * one compare) and a multiplication, truncated (the benchmarks' instants are after 1970, where truncation is the
 * floor). No checks: the input lies inside the table.
 */
export function zoneDayFloorLoop(d0: number, offsets: Float64Array, before: Float64Array, changeAt: Float64Array, after: Float64Array, src: Float64Array, out: Int32Array, n: number): number {
  for (let i = 0; i < n; i++) {
    const t = src[i]!;
    const k = ((t * 1.1574074074074074e-8) | 0) - d0;
    let off = offsets[k]!;
    if (off !== off) off = t < changeAt[k]! ? before[k]! : after[k]!;
    out[i] = ((t + off) * 1.1574074074074074e-8) | 0;
  }
  return out[n - 1]!;
}

/** Keys from instants: the local day as in {@link zoneDayFloorLoop}, then one load from a per-day key table. */
export function keyFloorLoop(
  d0: number,
  offsets: Float64Array,
  before: Float64Array,
  changeAt: Float64Array,
  after: Float64Array,
  keys: Int32Array,
  keyBase: number,
  src: Float64Array,
  out: Int32Array,
  n: number,
): number {
  for (let i = 0; i < n; i++) {
    const t = src[i]!;
    const k = ((t * 1.1574074074074074e-8) | 0) - d0;
    let off = offsets[k]!;
    if (off !== off) off = t < changeAt[k]! ? before[k]! : after[k]!;
    out[i] = keys[(((t + off) * 1.1574074074074074e-8) | 0) - keyBase]!;
  }
  return out[n - 1]!;
}

/** Sums and counts per period of sorted instants, over precomputed period boundaries (bounds[p] = start of period p). */
export function bucketFloorLoop(bounds: Float64Array, t: Float64Array, v: Float64Array, sums: Float64Array, counts: Float64Array, n: number): number {
  let p = 0;
  let next = bounds[1]!;
  let sum = 0;
  let count = 0;
  for (let i = 0; i < n; i++) {
    const x = t[i]!;
    while (x >= next) {
      sums[p] = sum;
      counts[p] = count;
      sum = 0;
      count = 0;
      p++;
      next = bounds[p + 1]!;
    }
    sum += v[i]!;
    count++;
  }
  sums[p] = sum;
  counts[p] = count;
  return p;
}

/**
 * A plain, uncompensated two-pointer rolling mean over the rows whose instant lies in (t - lengthMs, t] (rows at
 * the same instant share one window, as in rollBulk).
 */
export function rollingFloorLoop(t: Float64Array, v: Float64Array, lengthMs: number, out: Float64Array, n: number): number {
  let lo = 0;
  let hi = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const x = t[i]!;
    while (hi < n && t[hi]! <= x) sum += v[hi++]!;
    const start = x - lengthMs;
    while (t[lo]! <= start) sum -= v[lo++]!;
    out[i] = sum / (hi - lo);
  }
  return out[n - 1]!;
}

/**
 * The least a compensated rolling mean can cost: {@link rollingFloorLoop} with each add and subtract compensated
 * (Neumaier's variant of Kahan summation: one TwoSum-like correction term per operation, no re-basing). It is a
 * bound for the compensated kernel, not a replacement: its error still grows with the series' length.
 */
export function rollingCompensatedBoundLoop(t: Float64Array, v: Float64Array, lengthMs: number, out: Float64Array, n: number): number {
  let lo = 0;
  let hi = 0;
  let sum = 0;
  let c = 0;
  for (let i = 0; i < n; i++) {
    const x = t[i]!;
    while (hi < n && t[hi]! <= x) {
      const a = v[hi++]!;
      const s = sum + a;
      c += Math.abs(sum) >= Math.abs(a) ? sum - s + a : a - s + sum;
      sum = s;
    }
    const start = x - lengthMs;
    while (t[lo]! <= start) {
      const a = -v[lo++]!;
      const s = sum + a;
      c += Math.abs(sum) >= Math.abs(a) ? sum - s + a : a - s + sum;
      sum = s;
    }
    out[i] = (sum + c) / (hi - lo);
  }
  return out[n - 1]!;
}

/** Days from 1970-01-01 of a proleptic Gregorian date, by integer math (for the lean Temporal baselines). */
export function daysFromCivil(y: number, m: number, d: number): number {
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

/** Throws when two outputs differ (checked once before anything is timed); `tolerance` for sums of floats. */
export function sameOutput(what: string, a: ArrayLike<number>, b: ArrayLike<number>, n: number, tolerance = 0): void {
  for (let i = 0; i < n; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (tolerance === 0 ? x !== y : !(Math.abs(x - y) <= tolerance * Math.max(1, Math.abs(x)))) throw new Error(`${what}: element ${i} differs (${x} vs ${y})`);
  }
}

/**
 * Bulk conversions over typed arrays: instants to local day numbers and to wall-clock ms, one pass, no
 * per-element allocation, no Intl call inside the loop.
 *
 * Method: one pass finds the input's range and checks every value; the zone's table is compiled for that range
 * first. When the range is not much wider than the input is long, a per-UTC-day lookup table of one byte a day
 * is built (the index of the day's offset, or a mark for the rare day with a transition inside), so each element
 * costs two floors and two loads from tables that stay in the first-level cache. Otherwise the loop keeps the
 * current transition interval and searches the compiled chunks on a miss.
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type Engine, FixedEngine } from './engine.js';
import { type ZoneInput, engineOf, toZone } from './zone.js';

/** Options of the bulk conversions. */
export interface BulkOptions {
  /**
   * What to do with NaN, infinite or out-of-range instants: 'throw' (default) throws a KalendsRangeError naming
   * the index of the first one; 'sentinel' writes {@link INVALID_DAY_NUMBER} (day numbers) or NaN (wall ms).
   */
  readonly invalid?: 'throw' | 'sentinel';
}

/** The day number written for an invalid instant under `invalid: 'sentinel'`: -2**31 (outside every valid day). */
export const INVALID_DAY_NUMBER = -2147483648;

type Input = Float64Array | readonly number[] | ArrayLike<number>;

interface Scan {
  readonly min: number;
  readonly max: number;
  readonly firstBad: number;
}

function scan(name: string, values: Input, options: BulkOptions | undefined): Scan {
  if (typeof values !== 'object' || values === null || typeof (values as { length?: unknown }).length !== 'number') {
    throw new KalendsTypeError(`${name}: expected a Float64Array or an array of epoch milliseconds, got ${describeValue(values)}`, {
      code: 'invalid-type',
      received: values,
    });
  }
  const mode = options?.invalid ?? 'throw';
  if (mode !== 'throw' && mode !== 'sentinel') {
    throw new KalendsRangeError(`options.invalid: expected 'throw' or 'sentinel', got ${describeValue(mode)}`, { code: 'out-of-range', received: mode });
  }
  // Fast pass: NaN and infinities turn `probe` into NaN; NaN never wins a comparison.
  let min = Infinity;
  let max = -Infinity;
  let probe = 0;
  const n = values.length;
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    min = v < min ? v : min;
    max = v > max ? v : max;
    probe += v * 0;
  }
  let firstBad = -1;
  if (probe !== 0 || min < MIN_EPOCH_MS || max > MAX_EPOCH_MS) {
    min = Infinity;
    max = -Infinity;
    for (let i = 0; i < n; i++) {
      const v = values[i] as number;
      if (v >= MIN_EPOCH_MS && v <= MAX_EPOCH_MS) {
        if (v < min) min = v;
        if (v > max) max = v;
      } else if (firstBad < 0) {
        firstBad = i;
        if (mode === 'throw') {
          throw new KalendsRangeError(
            `${name}[${i}]: expected epoch milliseconds from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(v)}; pass { invalid: 'sentinel' } to mark such elements instead`,
            { code: 'out-of-range', received: v },
          );
        }
      }
    }
  }
  return { min, max, firstBad };
}

/**
 * A per-UTC-day table over days [d0, d0 + days), one byte a day so that it stays in the first-level cache: the
 * index of the day's offset in `offsets` (ms) when the offset holds all day, CHANGE_DAY when one transition falls
 * inside the day (its instant and the offsets before and after are in the `change*` arrays, found through
 * `changeIndex`), or BUSY_DAY when two or more do (the loop asks the engine).
 */
interface DayTable {
  readonly codes: Uint8Array;
  readonly offsets: Float64Array;
  readonly changeIndex: Int32Array;
  readonly changeAt: Float64Array;
  readonly changeBefore: Float64Array;
  readonly changeAfter: Float64Array;
}

const CHANGE_DAY = 255;
const BUSY_DAY = 254;

function dayTable(e: Engine, d0: number, days: number): DayTable | undefined {
  const at: number[] = [];
  const after: number[] = [];
  const startMs = d0 * MS_PER_DAY;
  let cur = e.collect(startMs, startMs + days * MS_PER_DAY, at, after) * 1000;
  const distinct = new Map<number, number>();
  const index = (off: number): number => {
    let k = distinct.get(off);
    if (k === undefined) {
      k = distinct.size;
      distinct.set(off, k);
    }
    return k;
  };
  const codes = new Uint8Array(days);
  const changeIndex = new Int32Array(days);
  const cAt: number[] = [];
  const cBefore: number[] = [];
  const cAfter: number[] = [];
  let j = 0;
  for (let d = 0; d < days; d++) {
    const end = startMs + (d + 1) * MS_PER_DAY;
    if (j < at.length && at[j]! < end) {
      const before = cur;
      const t = at[j]!;
      cur = after[j]! * 1000;
      j++;
      if (j < at.length && at[j]! < end) {
        codes[d] = BUSY_DAY;
        while (j < at.length && at[j]! < end) cur = after[j++]! * 1000;
      } else {
        codes[d] = CHANGE_DAY;
        changeIndex[d] = cAt.length;
        cAt.push(t);
        cBefore.push(before);
        cAfter.push(cur);
      }
    } else {
      const k = index(cur);
      if (k >= BUSY_DAY) return undefined;
      codes[d] = k;
    }
  }
  return {
    codes,
    offsets: Float64Array.from(distinct.keys()),
    changeIndex,
    changeAt: Float64Array.from(cAt),
    changeBefore: Float64Array.from(cBefore),
    changeAfter: Float64Array.from(cAfter),
  };
}

/** Largest day table built for one call (days); past it, and when the range is much wider than the input, the loop searches instead. */
const MAX_TABLE_DAYS = 1 << 20;

function useTable(n: number, days: number): boolean {
  return days <= MAX_TABLE_DAYS && days <= 4 * n + 4096;
}

function checkOut<T extends Int32Array | Float64Array>(name: string, out: T | undefined, n: number, make: (n: number) => T, kind: string): T {
  if (out === undefined) return make(n);
  if (!(out instanceof (kind === 'Int32Array' ? Int32Array : Float64Array))) {
    throw new KalendsTypeError(`out: expected an ${kind}, got ${describeValue(out)}`, { code: 'invalid-type', received: out });
  }
  if (out.length < n) {
    throw new KalendsRangeError(`out: ${name} needs room for ${n} elements, got an ${kind} of length ${out.length}`, { code: 'length-mismatch', received: out.length });
  }
  return out;
}

/**
 * Local day numbers of many instants, in one pass: `out[i] = dayNumberFromEpochMs(zone, epochMs[i])`.
 * Invalid instants (NaN, ±Infinity, beyond ±8.64e15) throw naming the first index, or are written as
 * {@link INVALID_DAY_NUMBER} with `{ invalid: 'sentinel' }`. `out`, when given, must hold `epochMs.length`
 * elements; it is returned.
 *
 * @example
 * ```ts
 * dayNumberFromEpochMsBulk('America/New_York', Float64Array.of(Date.UTC(2025, 0, 1, 3))); // Int32Array [20088] (2024-12-31 local)
 * ```
 */
export function dayNumberFromEpochMsBulk(zone: ZoneInput, epochMs: Input, out?: Int32Array, options?: BulkOptions): Int32Array {
  const e = engineOf(toZone(zone));
  const s = scan('epochMs', epochMs, options);
  const n = epochMs.length;
  const result = checkOut('dayNumberFromEpochMsBulk', out, n, (k) => new Int32Array(k), 'Int32Array');
  const bad = s.firstBad >= 0;
  if (e instanceof FixedEngine) {
    const off = e.offsetSeconds * 1000;
    for (let i = 0; i < n; i++) {
      const t = epochMs[i] as number;
      result[i] = bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS) ? INVALID_DAY_NUMBER : Math.floor((t + off) / MS_PER_DAY);
    }
    return result;
  }
  if (n === 0 || s.min > s.max) {
    for (let i = 0; i < n; i++) result[i] = INVALID_DAY_NUMBER;
    return result;
  }
  const d0 = Math.floor(s.min / MS_PER_DAY);
  const days = Math.floor(s.max / MS_PER_DAY) - d0 + 1;
  const tab = useTable(n, days) ? dayTable(e, d0, days) : undefined;
  if (tab) {
    const { codes, offsets, changeIndex, changeAt, changeBefore, changeAfter } = tab;
    for (let i = 0; i < n; i++) {
      const t = epochMs[i] as number;
      if (bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS)) {
        result[i] = INVALID_DAY_NUMBER;
        continue;
      }
      const d = Math.floor(t / MS_PER_DAY) - d0;
      const c = codes[d]!;
      let off: number;
      if (c < BUSY_DAY) off = offsets[c]!;
      else if (c === CHANGE_DAY) {
        const k = changeIndex[d]!;
        off = t < changeAt[k]! ? changeBefore[k]! : changeAfter[k]!;
      } else off = e.offsetAt(t) * 1000;
      result[i] = Math.floor((t + off) / MS_PER_DAY);
    }
    return result;
  }
  for (let i = 0; i < n; i++) {
    const t = epochMs[i] as number;
    if (bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS)) {
      result[i] = INVALID_DAY_NUMBER;
      continue;
    }
    result[i] = Math.floor((t + e.offsetAt(t) * 1000) / MS_PER_DAY);
  }
  return result;
}

/**
 * Local wall-clock ms of many instants, in one pass: `out[i] = wallMsFromEpochMs(zone, epochMs[i])`. Invalid
 * instants throw naming the first index, or are written as NaN with `{ invalid: 'sentinel' }`.
 *
 * @example
 * ```ts
 * wallMsFromEpochMsBulk('Asia/Kathmandu', [0]); // Float64Array [19800000]
 * ```
 */
export function wallMsFromEpochMsBulk(zone: ZoneInput, epochMs: Input, out?: Float64Array, options?: BulkOptions): Float64Array {
  const e = engineOf(toZone(zone));
  const s = scan('epochMs', epochMs, options);
  const n = epochMs.length;
  const result = checkOut('wallMsFromEpochMsBulk', out, n, (k) => new Float64Array(k), 'Float64Array');
  const bad = s.firstBad >= 0;
  if (e instanceof FixedEngine) {
    const off = e.offsetSeconds * 1000;
    for (let i = 0; i < n; i++) {
      const t = epochMs[i] as number;
      result[i] = bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS) ? NaN : t + off;
    }
    return result;
  }
  if (n === 0 || s.min > s.max) {
    for (let i = 0; i < n; i++) result[i] = NaN;
    return result;
  }
  const d0 = Math.floor(s.min / MS_PER_DAY);
  const days = Math.floor(s.max / MS_PER_DAY) - d0 + 1;
  const tab = useTable(n, days) ? dayTable(e, d0, days) : undefined;
  if (tab) {
    const { codes, offsets, changeIndex, changeAt, changeBefore, changeAfter } = tab;
    for (let i = 0; i < n; i++) {
      const t = epochMs[i] as number;
      if (bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS)) {
        result[i] = NaN;
        continue;
      }
      const d = Math.floor(t / MS_PER_DAY) - d0;
      const c = codes[d]!;
      let off: number;
      if (c < BUSY_DAY) off = offsets[c]!;
      else if (c === CHANGE_DAY) {
        const k = changeIndex[d]!;
        off = t < changeAt[k]! ? changeBefore[k]! : changeAfter[k]!;
      } else off = e.offsetAt(t) * 1000;
      result[i] = t + off;
    }
    return result;
  }
  for (let i = 0; i < n; i++) {
    const t = epochMs[i] as number;
    if (bad && !(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS)) {
      result[i] = NaN;
      continue;
    }
    result[i] = t + e.offsetAt(t) * 1000;
  }
  return result;
}

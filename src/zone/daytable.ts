/**
 * @internal The per-UTC-day tables of the bulk conversions and the driver that runs their kernels.
 *
 * Method: a per-UTC-day lookup table (the day's offset in ms, or NaN for the rare day with a transition inside,
 * where the kernel reads the transition's instant and the offsets on both sides) turns each element into two
 * multiplications, two floors and one load, with no division. The table is built when an instant first falls
 * outside the zone's current table: first grown, without reading the input, to the whole years of the zone that
 * hold the instant and the old table (up to a few years); past that, the rest of the input is scanned once for its
 * range and the table is rebuilt to cover it (joined with the old range, within the supported range). The last
 * table of each zone is kept, so later calls over similar years neither scan nor build. When the input's range is
 * much wider than the input is long, the loop asks the compiled chunks for each element instead. Invalid instants
 * (NaN, infinities, out of range) fail the table's range test and are handled outside the hot loop; in 'throw'
 * mode, elements before the first invalid one have been written to `out`.
 *
 * Fractional instants (docs/design.md, "Input rules"): an instant t and Math.floor(t) fall on the same side of every
 * transition and midnight (both are whole milliseconds), so the day numbers are those of Math.floor(t), and wall
 * times keep the fraction; only a tiny negative t (a subnormal such as -5e-324) would vanish in the scaling to days,
 * so the kernel that can meet negative instants floors them first (the one for days after 1970 cannot).
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError, describeValue } from '../errors.js';
import { CHUNK_MS, type Engine } from './engine.js';

/** @internal A bulk input: a typed array or an array of numbers, already checked. */
export type Input = ArrayLike<number>;

/** @internal */
export function invalidInstant(name: string, i: number, v: number): never {
  throw new KalendsRangeError(
    `${name}[${i}]: expected epoch milliseconds from ${MIN_EPOCH_MS} to ${MAX_EPOCH_MS}, got ${describeValue(v)}; pass { invalid: 'sentinel' } to mark such elements instead`,
    { code: 'out-of-range', received: v },
  );
}

/** Smallest and largest valid instant in values[from..n) (Infinity / -Infinity when there is none). */
function validRange(values: Input, from: number): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = from; i < values.length; i++) {
    const v = values[i] as number;
    if (v >= MIN_EPOCH_MS && v <= MAX_EPOCH_MS) {
      min = v < min ? v : min;
      max = v > max ? v : max;
    }
  }
  return { min, max };
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
  /**
   * The offset (ms) of each day that holds one offset all day, NaN for the days with a transition inside: the
   * kernels read it directly (one load, no indirection through `codes`).
   */
  readonly dayOffsets: Float64Array;
  readonly changeIndex: Int32Array;
  readonly changeAt: Float64Array;
  readonly changeBefore: Float64Array;
  readonly changeAfter: Float64Array;
}

const CHANGE_DAY = 255;
const BUSY_DAY = 254;

/*
 * The kernels find an instant's UTC day, and its local day from its wall-clock time, as
 * Math.floor(x * 1.1574074074074074e-8) (the double nearest to 1 / 86,400,000) instead of dividing (a division
 * costs several times more than a multiplication). That is exactly Math.floor(x / 86_400_000) for every double x
 * within two days of the supported range: test/zone/day-division.test.ts checks both sides of every one of the
 * 200,000,005 midnights from 8.64e15 ms plus two days before the epoch to as many after it (the midnight itself
 * and the double just below it), and a rounded multiplication by a positive constant never decreases as x grows,
 * so no value between two midnights can land on another day. The constants are written as literals: the bundler
 * turns module constants into module variables, which V8 reloads on every element, while a literal is folded in.
 */

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
  const changeIndex = new Int32Array(days).fill(-1); // -1: no single transition inside the day
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
      if (!(Math.abs(cur) < MS_PER_DAY)) return undefined;
      const k = index(cur);
      if (k >= BUSY_DAY) return undefined;
      codes[d] = k;
    }
  }
  const offsetList = [...distinct.keys()];
  return {
    codes,
    offsets: Float64Array.from(offsetList),
    dayOffsets: Float64Array.from(codes, (c) => (c >= BUSY_DAY ? NaN : offsetList[c]!)),
    changeIndex,
    changeAt: Float64Array.from(cAt),
    changeBefore: Float64Array.from(cBefore),
    changeAfter: Float64Array.from(cAfter),
  };
}

/** Largest day table built (days, about 2,900 years); past it, the loop asks the engine for each element. */
const MAX_TABLE_DAYS = 1 << 20;
/**
 * Days added on each side of the input's range. Two: enough for a local day on either side, and no more, because
 * every year the table reaches costs a compiled year of the zone (2-3 ms from Intl) on first use; a later call
 * that reaches further grows the table (merged with the current one), reusing the years already compiled.
 */
const TABLE_MARGIN_DAYS = 2;
/** Most chunks (years) a table grows to before the driver scans the rest of the input for its range instead. */
const GROWN_CHUNKS = 8;

/** A day table with the range it covers: UTC days [d0, d0 + days). */
export interface RangedTable extends DayTable {
  readonly d0: number;
  readonly days: number;
}

/** The last day table built for each engine; a later call whose instants fall inside it reuses it. */
const tables = new WeakMap<Engine, RangedTable>();

/** The current table when it holds UTC days [lo, hi), else a table over them, kept as the engine's last table. */
function tableOver(e: Engine, lo: number, hi: number, current: RangedTable | undefined): RangedTable | undefined {
  if (current && current.d0 <= lo && current.d0 + current.days >= hi) return current;
  const table = dayTable(e, lo, hi - lo);
  if (!table) return undefined;
  const ranged: RangedTable = { ...table, d0: lo, days: hi - lo };
  tables.set(e, ranged);
  return ranged;
}

/**
 * A table covering the valid instants of values[from..n), joined with the engine's current table when the union is
 * not too wide; undefined when even the input's own range is too wide for a table (the caller then asks the engine
 * per element). The input is scanned once here.
 */
function tableCovering(e: Engine, values: Input, from: number, current: RangedTable | undefined): RangedTable | undefined {
  const { min, max } = validRange(values, from);
  if (min > max) return current;
  // The margins stop at the supported range (the engine is never asked about instants past it).
  let lo = Math.max(Math.floor(min / MS_PER_DAY) - TABLE_MARGIN_DAYS, MIN_EPOCH_MS / MS_PER_DAY);
  let hi = Math.min(Math.floor(max / MS_PER_DAY) + TABLE_MARGIN_DAYS + 1, MAX_EPOCH_MS / MS_PER_DAY);
  const limit = Math.max(4096, 4 * (values.length - from));
  if (hi - lo > MAX_TABLE_DAYS || hi - lo > limit + 2 * TABLE_MARGIN_DAYS) return undefined;
  if (current && Math.min(lo, current.d0) + MAX_TABLE_DAYS >= Math.max(hi, current.d0 + current.days)) {
    lo = Math.min(lo, current.d0);
    hi = Math.max(hi, current.d0 + current.days);
  }
  return tableOver(e, lo, hi, current);
}

/**
 * A table grown, without reading the input, to cover `t` (a valid instant) and the current table: every whole UTC
 * day of the zone's chunks (engine.ts: mean Gregorian years, the unit in which the engine compiles a zone) from
 * theirs to t's. The engine compiles those chunks in any case, so a first call over a year of instants compiles
 * that year's chunks and no more, and never scans the input for its range (on a first call that scan ran before V8
 * had optimized it, about a third of the call). `around` chunks more on each side: a large input's first table
 * takes the years on either side of its first instant, because a kernel stopped by a miss while V8 is still
 * tiering it up left the next call slower (second calls of 6.9 ms instead of 3.9, over 1M instants; bench/zone.ts,
 * first use). Undefined past GROWN_CHUNKS chunks (the caller then scans), except
 * for the last instant of the supported range, which no table holds (the caller asks the engine for it alone).
 */
function grownTable(e: Engine, t: number, current: RangedTable | undefined, around: number): RangedTable | undefined {
  const day = Math.floor(t / MS_PER_DAY);
  const k0 = Math.floor((Math.min(day, current?.d0 ?? day) * MS_PER_DAY) / CHUNK_MS) - around;
  const k1 = Math.floor((Math.max(day + 1, current ? current.d0 + current.days : 0) * MS_PER_DAY - 1) / CHUNK_MS) + around;
  if (k1 - k0 >= GROWN_CHUNKS) return t < MAX_EPOCH_MS ? undefined : current;
  // From the first day that starts in chunk k0 to the last that ends in chunk k1, within the supported range.
  const lo = Math.max(Math.ceil((k0 * CHUNK_MS) / MS_PER_DAY), MIN_EPOCH_MS / MS_PER_DAY);
  return tableOver(e, lo, Math.min(Math.floor(((k1 + 1) * CHUNK_MS) / MS_PER_DAY), MAX_EPOCH_MS / MS_PER_DAY), current);
}

/**
 * The hot loop of {@link dayNumberFromEpochMsBulk}: converts from index `i` while each instant's UTC day is inside
 * the table and has at most one transition; returns the index of the first element it did not convert (n when
 * done).
 */
function dayNumbersKernel(src: Input, dst: Int32Array, i: number, n: number, tab: RangedTable): number {
  const { dayOffsets, d0, days, changeIndex, changeAt, changeBefore, changeAfter } = tab;
  for (; i < n; i++) {
    // Floored first: a tiny negative fraction (-5e-324) times 1 / 86,400,000 underflows to -0, on day 0, not -1.
    const t = Math.floor(src[i] as number);
    const k = Math.floor(t * 1.1574074074074074e-8) - d0;
    if (!(k >= 0 && k < days)) return i;
    let off = dayOffsets[k]!;
    if (off !== off) {
      // A transition day: which side of its one transition t is on (a day with several stops the loop).
      const j = changeIndex[k]!;
      if (j < 0) return i;
      off = t < changeAt[j]! ? changeBefore[j]! : changeAfter[j]!;
    }
    dst[i] = Math.floor((t + off) * 1.1574074074074074e-8);
  }
  return i;
}

/**
 * {@link dayNumbersKernel} for a table that starts at least one day after the epoch (d0 >= 1), where every instant
 * it converts, and its wall-clock time, is positive: there truncation (`| 0`, and the Int32Array store) equals the
 * floor and costs less. An instant before the table (negative ones included, and NaN, whose truncation is 0) gets
 * k = -d0 or less and stops the loop as before.
 */
function dayNumbersKernelAfterEpoch(src: Input, dst: Int32Array, i: number, n: number, tab: RangedTable): number {
  const { dayOffsets, d0, days, changeIndex, changeAt, changeBefore, changeAfter } = tab;
  for (; i < n; i++) {
    const t = src[i] as number;
    const k = ((t * 1.1574074074074074e-8) | 0) - d0;
    if (!(k >= 0 && k < days)) return i;
    let off = dayOffsets[k]!;
    if (off !== off) {
      // A transition day: which side of its one transition t is on (a day with several stops the loop).
      const j = changeIndex[k]!;
      if (j < 0) return i;
      off = t < changeAt[j]! ? changeBefore[j]! : changeAfter[j]!;
    }
    dst[i] = (t + off) * 1.1574074074074074e-8;
  }
  return i;
}

/** The hot loop of {@link wallMsFromEpochMsBulk}; the same contract as {@link dayNumbersKernel}. */
function wallMsKernel(src: Input, dst: Float64Array, i: number, n: number, tab: RangedTable): number {
  const { dayOffsets, d0, days, changeIndex, changeAt, changeBefore, changeAfter } = tab;
  for (; i < n; i++) {
    const t = src[i] as number;
    const k = Math.floor(t * 1.1574074074074074e-8) - d0;
    if (!(k >= 0 && k < days)) return i;
    let off = dayOffsets[k]!;
    if (off !== off) {
      // A transition day: which side of its one transition t is on (a day with several stops the loop).
      const j = changeIndex[k]!;
      if (j < 0) return i;
      off = t < changeAt[j]! ? changeBefore[j]! : changeAfter[j]!;
    }
    dst[i] = t + off;
  }
  return i;
}

/**
 * What a bulk conversion computes, as module-level functions (never closures made per call: V8 inlines the
 * functions it sees at a call site and throws that code away when a call brings a new closure):
 * - `prepare` gives what the kernel needs besides the zone table (once per table);
 * - `run` is the hot loop over the table: it converts from `i` and returns the index of the first element it left
 *   alone (n when done);
 * - `local` is the output for one element resolved outside the loop, from its instant and offset.
 */
/*
 * The `run` functions call their kernel through Reflect.apply. Called directly, the kernel was inlined into the
 * driver once the driver had run about a dozen times, and the inlined loop ran at 1.5 to 1.7 times the kernel's own
 * time, from that call on (so that, in a benchmark's process, a later round could take the slow mode and keep it).
 * Through Reflect.apply V8 keeps the call, and the kernel keeps its own optimized code. The argument array is one
 * per kernel call (about one per bulk call), not one per element.
 */
export interface Conversion<T, C, A> {
  prepare(e: Engine, tab: RangedTable, context: C): A;
  run(src: Input, dst: T, i: number, n: number, tab: RangedTable, prepared: A, e: Engine, context: C): number;
  local(t: number, offsetMs: number, context: C): number;
}

/**
 * The driver shared by the bulk conversions. It runs a kernel over the zone's day table (the kernel itself
 * resolves days with one transition inside) and resolves, outside the hot loop, each element the kernel stops at:
 * a day with several transitions (from the engine), an instant outside the table (rebuilding the table over the
 * rest of the input), or an invalid instant (thrown, or written as `invalid` under the sentinel policy). When the
 * input's range is too wide for a table it asks the engine for each remaining element.
 */
export function fillFromDayTable<T extends Int32Array | Float64Array, C, A>(
  e: Engine,
  epochMs: Input,
  result: T,
  sentinel: boolean,
  conversion: Conversion<T, C, A>,
  context: C,
  invalid: number,
): T {
  const n = epochMs.length;
  const base = tables.get(e);
  let tab = base;
  let i = 0;
  while (i < n) {
    if (tab) {
      // The hot loop runs in a small kernel of its own (V8 optimizes it far better than a loop inside this
      // function); it stops at an instant outside the table (or NaN). Elements it leaves inside the table (a
      // conversion without a table of its own) are resolved here.
      const { codes, offsets, changeIndex, changeAt, changeBefore, changeAfter, d0, days } = tab;
      const prepared = conversion.prepare(e, tab, context);
      while (i < n) {
        i = conversion.run(epochMs, result, i, n, tab, prepared, e, context);
        if (i >= n) break;
        const t = epochMs[i] as number;
        const k = Math.floor(t / MS_PER_DAY) - d0;
        if (!(k >= 0 && k < days)) break;
        const c = codes[k]!;
        let off: number;
        if (c < BUSY_DAY) off = offsets[c]!;
        else if (c === CHANGE_DAY) {
          const j = changeIndex[k]!;
          off = t < changeAt[j]! ? changeBefore[j]! : changeAfter[j]!;
        } else off = e.offsetAt(t) * 1000;
        result[i++] = conversion.local(t, off, context);
      }
      if (i >= n) break;
    }
    const t = epochMs[i] as number;
    if (!(t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS)) {
      if (!sentinel) invalidInstant('epochMs', i, t);
      result[i++] = invalid;
      continue;
    }
    const wider = grownTable(e, t, tab, !tab && n - i >= 1 << 16 ? 1 : 0) ?? tableCovering(e, epochMs, i, base);
    if (wider) {
      const k = Math.floor(t / MS_PER_DAY) - wider.d0;
      tab = wider;
      if (k >= 0 && k < wider.days) continue;
      // An instant no table holds (the last day of the supported range): ask the engine for it alone.
      result[i++] = conversion.local(t, e.offsetAt(t) * 1000, context);
      continue;
    }
    // The input's range is too wide for a table: ask the engine for each remaining element.
    for (; i < n; i++) {
      const v = epochMs[i] as number;
      if (v >= MIN_EPOCH_MS && v <= MAX_EPOCH_MS) result[i] = conversion.local(v, e.offsetAt(v) * 1000, context);
      else if (sentinel) result[i] = invalid;
      else invalidInstant('epochMs', i, v);
    }
  }
  return result;
}

export const DAY_NUMBERS: Conversion<Int32Array, undefined, undefined> = {
  prepare: () => undefined,
  run: (src, dst, i, n, tab) => Reflect.apply(tab.d0 >= 1 ? dayNumbersKernelAfterEpoch : dayNumbersKernel, undefined, [src, dst, i, n, tab]) as number,
  local: (t, offsetMs) => Math.floor((Math.floor(t) + offsetMs) / MS_PER_DAY),
};

export const WALL_MS: Conversion<Float64Array, undefined, undefined> = {
  prepare: () => undefined,
  run: (src, dst, i, n, tab) => Reflect.apply(wallMsKernel, undefined, [src, dst, i, n, tab]) as number,
  local: (t, offsetMs) => t + offsetMs,
};

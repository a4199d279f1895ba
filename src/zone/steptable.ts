/**
 * @internal Step tables: a function of the local day (such as a period ordinal) for many instants at once, in one
 * pass over a table of the function per UTC day of a zone's day table (see {@link StepTable}).
 *
 * @module
 */
import { MS_PER_DAY } from '../bounds.js';
import type { Engine } from './engine.js';
import { type Conversion, type Input, type RangedTable } from './daytable.js';

/**
 * @internal A function of the local day that a caller wants for many instants at once, such as the ordinal of
 * the period that holds the day. Its values never decrease and step by at most one from a day to the next (a
 * period ordinal does, since periods are runs of whole days); the object itself is the cache key of the tables
 * built for it, so each function has one long-lived object.
 */
export interface LocalDayFunction {
  /**
   * Values for the local days [lo, hi), `values[d - start]` for day d (days the table leaves out, such as days
   * past the supported range, take the exact path); undefined when the range is too wide for a table.
   */
  valuesCovering(lo: number, hi: number): { readonly start: number; readonly values: Int32Array } | undefined;
  /** The value for one local day (days outside the tables). */
  valueOf(day: number): number;
}

/**
 * A per-UTC-day table of a {@link LocalDayFunction} in one zone, over the days of one zone day table: the value at
 * the start of each UTC day, and the instant inside the day where the value steps up by one (Infinity when it does
 * not). An element then costs one multiplication, two loads and a comparison, and no local day is computed at all.
 * A day with one transition inside is NaN in `step`; its entry in the zone table's change arrays (index j) has the
 * same pair for each side of the transition here (`firstBefore[j]`, `stepBefore[j]` for instants before it, and
 * `firstAfter[j]`, `stepAfter[j]`), so that the kernel resolves it without a call: each side has one offset and
 * lasts under a day, so it holds at most one local midnight. A NaN step there (or a day with several transitions)
 * stops the kernel, and the driver resolves the element.
 */
interface StepTable {
  readonly zoneTable: RangedTable;
  readonly first: Int32Array;
  readonly step: Float64Array;
  readonly firstBefore: Int32Array;
  readonly stepBefore: Float64Array;
  readonly firstAfter: Int32Array;
  readonly stepAfter: Float64Array;
}
const stepTables = new WeakMap<Engine, WeakMap<LocalDayFunction, StepTable>>();

function stepTableOf(e: Engine, tab: RangedTable, f: LocalDayFunction): StepTable | undefined {
  let perEngine = stepTables.get(e);
  const cached = perEngine?.get(f);
  if (cached && cached.zoneTable === tab) return cached;
  const { d0, days, dayOffsets } = tab;
  // Local days of UTC days [d0, d0 + days) lie within one day of them (offsets are below a day).
  const cover = f.valuesCovering(d0 - 1, d0 + days + 1);
  if (!cover) return undefined;
  const { start, values } = cover;
  /**
   * The value at instant `from` (offset `off` from there on) and the instant before `end` where it steps up by
   * one: Infinity when it does not step, NaN when the values do not cover the day or step by more than one.
   */
  const side = (from: number, end: number, off: number): [number, number] => {
    const day = Math.floor((from + off) / MS_PER_DAY);
    if (!(day >= start && day + 1 < start + values.length)) return [0, NaN];
    const a = values[day - start]!;
    const b = values[day + 1 - start]!;
    const next = (day + 1) * MS_PER_DAY - off; // the next local midnight
    if (b === a || next >= end) return [a, Infinity];
    return [a, b === a + 1 ? next : NaN];
  };
  const first = new Int32Array(days);
  const step = new Float64Array(days);
  for (let k = 0; k < days; k++) {
    const off = dayOffsets[k]!;
    const u = (d0 + k) * MS_PER_DAY;
    if (off === off) [first[k], step[k]] = side(u, u + MS_PER_DAY, off);
    else step[k] = NaN;
  }
  const changes = tab.changeAt.length;
  const firstBefore = new Int32Array(changes);
  const stepBefore = new Float64Array(changes);
  const firstAfter = new Int32Array(changes);
  const stepAfter = new Float64Array(changes);
  for (let j = 0; j < changes; j++) {
    const c = tab.changeAt[j]!;
    const u = Math.floor(c / MS_PER_DAY) * MS_PER_DAY;
    [firstBefore[j], stepBefore[j]] = side(u, c, tab.changeBefore[j]!);
    [firstAfter[j], stepAfter[j]] = side(c, u + MS_PER_DAY, tab.changeAfter[j]!);
  }
  const table = { zoneTable: tab, first, step, firstBefore, stepBefore, firstAfter, stepAfter };
  if (!perEngine) stepTables.set(e, (perEngine = new WeakMap()));
  perEngine.set(f, table);
  return table;
}

/** The hot loop of {@link localDayFunctionBulk}; the same contract as {@link dayNumbersKernel}. */
function stepKernel(src: Input, dst: Int32Array, i: number, n: number, st: StepTable, tab: RangedTable): number {
  const { first, step, firstBefore, stepBefore, firstAfter, stepAfter } = st;
  const { d0, days, changeIndex, changeAt } = tab;
  for (; i < n; i++) {
    const t = src[i] as number;
    const k = Math.floor(t * 1.1574074074074074e-8) - d0;
    if (!(k >= 0 && k < days)) return i;
    const s = step[k]!;
    if (s === s) dst[i] = first[k]! + +(t >= s);
    else {
      const j = changeIndex[k]!;
      if (j < 0) return i;
      const before = t < changeAt[j]!;
      const s2 = before ? stepBefore[j]! : stepAfter[j]!;
      if (s2 !== s2) return i;
      dst[i] = (before ? firstBefore[j]! : firstAfter[j]!) + +(t >= s2);
    }
  }
  return i;
}

/**
 * {@link stepKernel} for a table that starts at least one day after the epoch (see {@link dayNumbersKernelAfterEpoch}).
 * A copy on purpose: one kernel with a flag choosing between truncation and floor measured 20% slower.
 */
function stepKernelAfterEpoch(src: Input, dst: Int32Array, i: number, n: number, st: StepTable, tab: RangedTable): number {
  const { first, step, firstBefore, stepBefore, firstAfter, stepAfter } = st;
  const { d0, days, changeIndex, changeAt } = tab;
  for (; i < n; i++) {
    const t = src[i] as number;
    const k = ((t * 1.1574074074074074e-8) | 0) - d0;
    if (!(k >= 0 && k < days)) return i;
    const s = step[k]!;
    if (s === s) dst[i] = first[k]! + +(t >= s);
    else {
      const j = changeIndex[k]!;
      if (j < 0) return i;
      const before = t < changeAt[j]!;
      const s2 = before ? stepBefore[j]! : stepAfter[j]!;
      if (s2 !== s2) return i;
      dst[i] = (before ? firstBefore[j]! : firstAfter[j]!) + +(t >= s2);
    }
  }
  return i;
}

/** @internal */
export const DAY_FUNCTION: Conversion<Int32Array, LocalDayFunction, StepTable | undefined> = {
  // No step table (the range is too wide for the function's values): the driver resolves every element.
  prepare: (e, tab, f) => stepTableOf(e, tab, f),
  run: (src, dst, i, n, tab, st) => (!st ? i : Reflect.apply(tab.d0 >= 1 ? stepKernelAfterEpoch : stepKernel, undefined, [src, dst, i, n, st, tab]) as number),
  local: (t, offsetMs, f) => f.valueOf(Math.floor((t + offsetMs) / MS_PER_DAY)),
};


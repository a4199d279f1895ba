/**
 * Bulk conversions: day numbers to ordinals over typed arrays in one pass, with a loop specialized for each
 * kind of unit (a division for weeks and cycles; for month-based and 52/53-week units, a dense day-to-ordinal
 * table over the input's days, built from a packed civil computation or a cached per-week table). No per-element
 * allocation.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../bounds.js';
import { requireInteger } from '../errors.js';
import { dayNumberFromYmdUnchecked, dayOfPacked, monthIndexOfDayNumberUnchecked, monthIndexOfPacked, packedYmdUnchecked } from '../civil/gregorian.js';
import { dayCountOfMonthIndex } from '../civil/names.js';
import { requireNumberArray, requireOutArray } from '../diagnostics/index.js';
import type { LocalDayFunction } from '../zone/bulk.js';
import { type UnitCore, type UnitInput, coreOf, toUnit } from './units.js';

/** Anchor-year window of the cached week tables of 52/53-week units (weeks outside use the scalar path). */
const WEEK_TABLE_FIRST_YEAR = 1800;
const WEEK_TABLE_LAST_YEAR = 2400;

/**
 * @internal Below this many elements a table is not worth building: day numbers take the scalar path instead of
 * the week and dense tables, and instants go through day numbers instead of the zone layer's per-UTC-day table.
 */
export const BULK_TABLE_MIN_ELEMENTS = 2048;

interface WeekTable {
  readonly firstWeek: number;
  readonly ordinals: Int32Array;
}
const weekTables = new WeakMap<UnitCore, WeekTable>();

function weekTableOf(core: UnitCore, origin: number): WeekTable {
  let t = weekTables.get(core);
  if (t) return t;
  // Weeks of 52/53-week years start on the same weekday, so each whole week has one ordinal.
  const from = Math.floor((dayNumberFromYmdUnchecked(WEEK_TABLE_FIRST_YEAR, 1, 1) - origin) / 7);
  const to = Math.floor((dayNumberFromYmdUnchecked(WEEK_TABLE_LAST_YEAR, 1, 1) - origin) / 7);
  const ordinals = new Int32Array(to - from);
  for (let w = from; w < to; w++) ordinals[w - from] = core.ordinalOf(origin + 7 * w);
  t = { firstWeek: from, ordinals };
  weekTables.set(core, t);
  return t;
}

/** Validates every day number before conversion (one tight pass; the error names the first bad index). */
function validateDays(dayNumbers: ArrayLike<number>, n: number): void {
  const integral = dayNumbers instanceof Int32Array;
  for (let i = 0; i < n; i++) {
    const dn = dayNumbers[i]!;
    if (!(dn >= MIN_DAY_NUMBER && dn <= MAX_DAY_NUMBER) || (!integral && dn !== Math.floor(dn))) {
      requireInteger(`dayNumbers[${i}]`, dn, MIN_DAY_NUMBER, MAX_DAY_NUMBER);
    }
  }
}

/** Added to (day - origin) so that a week index is a positive 32-bit quotient: a multiple of 7 above the widest
 * day difference (two supported day numbers, about 2e8 apart), still far below 2**31. */
const WEEK_BIAS = 7 * 30_000_000;

/**
 * Month-based units repeat every 4 years (1461 days) between 1900-03-01 and 2100-02-28, where every fourth year is
 * a leap year: the ordinal of day D0 + 1461 * c + r is ordinal(D0) + c * 4 * (periods per year) + table[r]. So the
 * bulk loop costs one integer division and one load from a 6 KB table; days outside the window take the full
 * civil computation.
 */
const CYCLE_ORIGIN = -25_508; // 1900-03-01
const CYCLE_WINDOW = 49 * 1461 + 1460; // through 2100-02-28
interface CycleTable {
  readonly base: number;
  readonly perCycle: number;
  readonly offsets: Int32Array;
}
const cycleTables = new WeakMap<UnitCore, CycleTable>();

function cycleTableOf(core: UnitCore, perYear: number): CycleTable {
  let t = cycleTables.get(core);
  if (t) return t;
  const base = core.ordinalOf(CYCLE_ORIGIN);
  const offsets = new Int32Array(1461);
  for (let r = 0; r < 1461; r++) offsets[r] = core.ordinalOf(CYCLE_ORIGIN + r) - base;
  t = { base, perCycle: 4 * perYear, offsets };
  cycleTables.set(core, t);
  return t;
}

/** Days added on each side of the input's range when a dense day table is built, so nearby later calls reuse it. */
const DENSE_MARGIN_DAYS = 366;
/** Largest dense day table (days, about 2,900 years). */
const DENSE_MAX_DAYS = 1 << 20;

/** A dense table of ordinals for the days [lo, lo + ordinals.length). */
interface DenseTable {
  readonly lo: number;
  readonly ordinals: Int32Array;
}
/** The last dense table built for each unit; later calls over similar days reuse it. */
const denseTables = new WeakMap<UnitCore, DenseTable>();

/**
 * A dense table covering the day numbers src[from..n), joined with the unit's current table when the union is not
 * too wide; undefined when the input's own range is too wide (then the unit's arithmetic serves each element).
 */
function denseCovering(core: UnitCore, src: ArrayLike<number>, from: number, n: number, current: DenseTable | undefined): DenseTable | undefined {
  let min = Infinity;
  let max = -Infinity;
  for (let i = from; i < n; i++) {
    const d = src[i]!;
    min = d < min ? d : min;
    max = d > max ? d : max;
  }
  const lo = min - DENSE_MARGIN_DAYS;
  const hi = max + DENSE_MARGIN_DAYS + 1;
  if (hi - lo > 4 * (n - from) + 4096 + 2 * DENSE_MARGIN_DAYS) return undefined;
  return denseOver(core, lo, hi, current);
}

/**
 * A dense table over the days [lo, hi) (clipped to the supported range), joined with the unit's current table when
 * the union is not too wide; undefined when [lo, hi) itself is too wide.
 */
function denseOver(core: UnitCore, lo: number, hi: number, current: DenseTable | undefined): DenseTable | undefined {
  lo = Math.max(MIN_DAY_NUMBER, lo);
  hi = Math.min(MAX_DAY_NUMBER + 1, hi);
  if (hi - lo > DENSE_MAX_DAYS) return undefined;
  if (current && current.lo <= lo && current.lo + current.ordinals.length >= hi) return current;
  if (current && Math.max(hi, current.lo + current.ordinals.length) - Math.min(lo, current.lo) <= DENSE_MAX_DAYS) {
    hi = Math.max(hi, current.lo + current.ordinals.length);
    lo = Math.min(lo, current.lo);
  }
  const days = new Int32Array(hi - lo);
  for (let k = 0; k < days.length; k++) days[k] = lo + k;
  const ordinals = new Int32Array(days.length);
  computeOrdinals(core, days, ordinals, 0, days.length);
  const table = { lo, ordinals };
  denseTables.set(core, table);
  return table;
}

const dayFunctions = new WeakMap<UnitCore, LocalDayFunction>();

/**
 * @internal The ordinal of a unit as a function of the local day, for the zone layer's one-pass conversion of
 * instants (one long-lived object per unit, since the zone layer caches its tables by it).
 */
export function ordinalDayFunction(core: UnitCore): LocalDayFunction {
  let f = dayFunctions.get(core);
  if (!f) {
    f = {
      valuesCovering: (lo, hi) => {
        const t = denseOver(core, lo, hi, denseTables.get(core));
        return t && { start: t.lo, values: t.ordinals };
      },
      valueOf: core.ordinalOf,
    };
    dayFunctions.set(core, f);
  }
  return f;
}

/** The hot loop over a dense table: converts from `i` while the day is inside it; returns where it stopped. */
function denseKernel(src: ArrayLike<number>, out: Int32Array, i: number, n: number, ordinals: Int32Array, lo: number): number {
  const len = ordinals.length;
  for (; i < n; i++) {
    const k = src[i]! - lo;
    if (!(k >= 0 && k < len)) return i;
    out[i] = ordinals[k]!;
  }
  return i;
}

/**
 * @internal Converts validated day numbers with the unit's kernel into `out`. `src` may be `out`. Units of fixed
 * length (days, weeks, cycles) divide; month-based and 52/53-week units look each day up in a dense table of
 * ordinals built over the input's days (one load per element), falling back to their arithmetic when the input's
 * range is far wider than the input is long.
 */
export function ordinalsFromDaysKernel(core: UnitCore, src: ArrayLike<number>, out: Int32Array, n: number): void {
  if (core.kernel.type === 'linear' || n < BULK_TABLE_MIN_ELEMENTS) {
    computeOrdinals(core, src, out, 0, n);
    return;
  }
  let tab = denseTables.get(core);
  let i = 0;
  while (i < n) {
    if (tab) {
      i = denseKernel(src, out, i, n, tab.ordinals, tab.lo);
      if (i >= n) break;
    }
    const wider = denseCovering(core, src, i, n, tab);
    if (wider && wider !== tab) {
      tab = wider;
      continue;
    }
    computeOrdinals(core, src, out, i, n);
    break;
  }
}

/** Computes the ordinals of validated day numbers src[from..n) into `out` with the unit's own arithmetic. */
function computeOrdinals(core: UnitCore, src: ArrayLike<number>, out: Int32Array, from: number, n: number): void {
  const k = core.kernel;
  if (k.type === 'linear') {
    const origin = k.origin;
    const length = k.length;
    if (length === 1) {
      for (let i = from; i < n; i++) out[i] = src[i]! - origin;
    } else if (length === 7) {
      const shift = WEEK_BIAS - origin;
      const back = WEEK_BIAS / 7;
      for (let i = from; i < n; i++) out[i] = (((src[i]! + shift) / 7) | 0) - back;
    } else {
      for (let i = from; i < n; i++) out[i] = Math.floor((src[i]! - origin) / length);
    }
    return;
  }
  if (k.type === 'weeks' && n - from < BULK_TABLE_MIN_ELEMENTS) {
    const ordinalOf = core.ordinalOf;
    for (let i = from; i < n; i++) out[i] = ordinalOf(src[i]!);
    return;
  }
  if (k.type === 'weeks') {
    const origin = k.origin;
    const { firstWeek, ordinals } = weekTableOf(core, origin);
    const size = ordinals.length;
    const ordinalOf = core.ordinalOf;
    const shift = WEEK_BIAS - origin;
    const back = WEEK_BIAS / 7 + firstWeek;
    for (let i = from; i < n; i++) {
      const dn = src[i]!;
      const idx = (((dn + shift) / 7) | 0) - back;
      out[i] = idx >= 0 && idx < size ? ordinals[idx]! : ordinalOf(dn);
    }
    return;
  }
  const { base, perCycle, offsets } = cycleTableOf(core, 12 / k.monthsPer);
  const { monthsPer, startMonthIndex, startDay, addend } = k;
  for (let i = from; i < n; i++) {
    const dn = src[i]!;
    const z = dn - CYCLE_ORIGIN;
    if (z >= 0 && z < CYCLE_WINDOW) {
      const c = (z / 1461) | 0;
      out[i] = base + c * perCycle + offsets[z - c * 1461]!;
    } else {
      out[i] = monthsOrdinal(dn, monthsPer, startMonthIndex, startDay, addend);
    }
  }
}

/**
 * Month-based units outside the table window: the civil layer's civil-from-days (the only one in kalends),
 * stopped at the month index when periods start on the 1st, or with the day of the month otherwise.
 */
function monthsOrdinal(dn: number, monthsPer: number, startMonthIndex: number, startDay: number, addend: number): number {
  let cm: number;
  if (startDay > 1) {
    const p = packedYmdUnchecked(dn);
    cm = monthIndexOfPacked(p);
    const dim = dayCountOfMonthIndex(cm);
    if (dayOfPacked(p) < (startDay < dim ? startDay : dim)) cm -= 1;
  } else {
    cm = monthIndexOfDayNumberUnchecked(dn);
  }
  return Math.floor((cm - startMonthIndex) / monthsPer) + addend;
}

/**
 * The ordinal in `unit` of each day number, into an Int32Array (allocated, or `out`), in one pass with no
 * per-element allocation. Equal, element by element, to `unit.ordinalFromDayNumber`.
 *
 * @example
 * ```ts
 * ordinalFromDayNumberBulk('month', Int32Array.of(0, 31, 59)); // Int32Array [23640, 23641, 23642]
 * ```
 */
export function ordinalFromDayNumberBulk(unit: UnitInput, dayNumbers: ArrayLike<number>, out?: Int32Array): Int32Array {
  const u = toUnit(unit);
  const core = coreOf(u)!;
  const src = requireNumberArray('dayNumbers', dayNumbers);
  const n = src.length;
  const result = requireOutArray('out', out, Int32Array, n);
  validateDays(src, n);
  ordinalsFromDaysKernel(core, src, result, n);
  return result;
}

/**
 * The label of each ordinal of `unit`, as an array of strings (for output; labels are strings, so this
 * allocates one per element).
 *
 * @example
 * ```ts
 * formatOrdinalBulk('quarter', Int32Array.of(8100, 8101)); // ['2025-Q1', '2025-Q2']
 * ```
 */
export function formatOrdinalBulk(unit: UnitInput, ordinals: ArrayLike<number>): string[] {
  const u = toUnit(unit);
  const core = coreOf(u)!;
  const src = requireNumberArray('ordinals', ordinals);
  const n = src.length;
  const labels = new Array<string>(n);
  for (let i = 0; i < n; i++) {
    const o = src[i]!;
    if (!(o >= u.minOrdinal && o <= u.maxOrdinal) || o !== Math.floor(o)) requireInteger(`ordinals[${i}]`, o, u.minOrdinal, u.maxOrdinal);
    labels[i] = core.format(o);
  }
  return labels;
}

/**
 * The first day of each ordinal of `unit`, into an Int32Array (`unit.maxOrdinal + 1` gives the exclusive end of
 * the last period, as `unit.firstDayNumberFromOrdinal` does).
 *
 * @example
 * ```ts
 * firstDayNumberFromOrdinalBulk('month', Int32Array.of(23640, 23641)); // Int32Array [0, 31]
 * ```
 */
export function firstDayNumberFromOrdinalBulk(unit: UnitInput, ordinals: ArrayLike<number>, out?: Int32Array): Int32Array {
  const u = toUnit(unit);
  const core = coreOf(u)!;
  const src = requireNumberArray('ordinals', ordinals);
  const n = src.length;
  const result = requireOutArray('out', out, Int32Array, n);
  for (let i = 0; i < n; i++) {
    const o = src[i]!;
    if (!(o >= u.minOrdinal && o <= u.maxOrdinal + 1) || o !== Math.floor(o)) requireInteger(`ordinals[${i}]`, o, u.minOrdinal, u.maxOrdinal + 1);
    result[i] = core.firstDayOf(o);
  }
  return result;
}

/**
 * Business days in bulk: tests, counts, shifts and adjustments over typed arrays of day numbers. Every argument
 * is checked in one pass before any work (an error names the first bad index); the work itself is a loop of two
 * or three loads per element from a dense per-day table of the calendar (business days before each day, and the
 * day of each business day), built once over the days the input spans and kept for the next call. An element
 * whose answer lies outside the table (a shift past its end, a span longer than it) takes the scalar path, which
 * gives the same answer or the same error.
 *
 * @module
 */
import { monthIndexOfDayNumberUnchecked } from '../civil/names.js';
import { requireEnum, requireNumberArray, requireOutArray, requireSameLength, requireWhole } from '../diagnostics/index.js';
import { type CalendarInput, adjustDayNumber, engineOf, requireDay } from './calendar.js';
import { BUSINESS_DAY_CONVENTIONS, type BusinessDayConvention } from './definition.js';
import { type DayTable, type Engine, MAX_DAY_TABLE_DAYS, NOT_IN_TABLE } from './engine.js';

/** Smallest and largest value of a checked array. */
interface Span {
  readonly min: number;
  readonly max: number;
}

/** Checks every day number (integers in the calendar's years; `extra` = 1 allows the day after the last). */
function scanDays(e: Engine, name: string, days: ArrayLike<number>, len: number, extra: number): Span {
  const lo = e.firstDay;
  const hi = e.endDay + extra;
  const integral = days instanceof Int32Array;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < len; i++) {
    const v = days[i]!;
    if (!(v >= lo && v < hi) || (!integral && v !== Math.floor(v))) requireDay(e, v, `${name}[${i}]`, extra);
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** Checks every amount of a shift (whole numbers). */
function scanAmounts(n: ArrayLike<number>, len: number): Span {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < len; i++) {
    const v = n[i]!;
    if (!(v === Math.floor(v) && Math.abs(v) <= Number.MAX_SAFE_INTEGER)) requireWhole(`n[${i}]`, v, -Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER);
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** The table over [lo, hi), or undefined when the range is longer than a table may be. */
function tableFor(e: Engine, lo: number, hi: number): DayTable | undefined {
  return hi - lo <= MAX_DAY_TABLE_DAYS ? e.dayTable(lo, hi) : undefined;
}

// ---- kernels: no checks but the table's bounds, no allocation -------------------------------------------------
//
// Each kernel reads day numbers as offsets into a table of `days` days and stops at the first offset outside it,
// returning -1 - its index (the caller then checks the input in full, which names the bad element, or builds a
// table over the input's days). Offsets are compared unsigned (`x >>> 0`): a negative one is huge. Called with
// Int32Array inputs only (integers by construction), or after a full check.

function testKernel(rank: Int32Array, days: number, base: number, d: ArrayLike<number>, o: Uint8Array, len: number): number {
  for (let i = 0; i < len; i++) {
    const x = d[i]! - base;
    if (x >>> 0 >= days) return -1 - i;
    o[i] = rank[x + 1]! - rank[x]!;
  }
  return 0;
}

function countKernel(rank: Int32Array, days: number, base: number, a: ArrayLike<number>, b: ArrayLike<number>, o: Int32Array, len: number): number {
  for (let i = 0; i < len; i++) {
    const x = a[i]! - base;
    const y = b[i]! - base;
    if (x >>> 0 > days || y >>> 0 > days) return -1 - i;
    o[i] = rank[y]! - rank[x]!;
  }
  return 0;
}

/** Shifts by n[i]; returns the number of answers outside the table (written as NOT_IN_TABLE), or -1 - index. */
function shiftKernel(rank: Int32Array, businessDays: Int32Array, days: number, base: number, d: ArrayLike<number>, n: ArrayLike<number>, o: Int32Array, len: number): number {
  const total = businessDays.length;
  let missed = 0;
  for (let i = 0; i < len; i++) {
    const x = d[i]! - base;
    if (x >>> 0 >= days) return -1 - i;
    const m = n[i]!;
    const k = m > 0 ? rank[x + 1]! + m - 1 : rank[x]! + m;
    if (k >= 0 && k < total) o[i] = businessDays[k]!;
    else {
      o[i] = -2147483648;
      missed++;
    }
  }
  return missed;
}

function shiftByKernel(rank: Int32Array, businessDays: Int32Array, days: number, base: number, d: ArrayLike<number>, m: number, o: Int32Array, len: number): number {
  const total = businessDays.length;
  const step = m > 0 ? 1 : 0;
  const add = m > 0 ? m - 1 : m;
  let missed = 0;
  for (let i = 0; i < len; i++) {
    const x = d[i]! - base;
    if (x >>> 0 >= days) return -1 - i;
    const k = rank[x + step]! + add;
    if (k >= 0 && k < total) o[i] = businessDays[k]!;
    else {
      o[i] = -2147483648;
      missed++;
    }
  }
  return missed;
}

/** One load per element from a per-day table; returns the number of NOT_IN_TABLE answers, or -1 - index. */
function lookupKernel(table: Int32Array, base: number, d: ArrayLike<number>, o: Int32Array, len: number): number {
  const days = table.length;
  let missed = 0;
  for (let i = 0; i < len; i++) {
    const x = d[i]! - base;
    if (x >>> 0 >= days) return -1 - i;
    const v = table[x]!;
    o[i] = v;
    if (v === -2147483648) missed++;
  }
  return missed;
}

/** The adjusted day of every day of the table by one convention (NOT_IN_TABLE where it lies outside the table or the scalar form throws). */
function adjustedTable(t: DayTable, convention: BusinessDayConvention): Int32Array {
  const cached = t.adjusted.get(convention);
  if (cached) return cached;
  const { base, days, rank, businessDays } = t;
  const total = businessDays.length;
  const out = new Int32Array(days);
  for (let i = 0; i < days; i++) {
    const d = base + i;
    const r = rank[i]!;
    if (convention === 'none' || rank[i + 1]! > r) {
      out[i] = d;
      continue;
    }
    const following = r < total ? businessDays[r]! : NOT_IN_TABLE;
    const preceding = r > 0 ? businessDays[r - 1]! : NOT_IN_TABLE;
    const forward = convention === 'following' || convention === 'modified-following';
    const first = forward ? following : preceding;
    if (convention === 'following' || convention === 'preceding' || first === NOT_IN_TABLE) {
      out[i] = first;
      continue;
    }
    const month = monthIndexOfDayNumberUnchecked(d);
    if (monthIndexOfDayNumberUnchecked(first) === month) out[i] = first;
    else {
      const second = forward ? preceding : following;
      out[i] = second !== NOT_IN_TABLE && monthIndexOfDayNumberUnchecked(second) === month ? second : NOT_IN_TABLE;
    }
  }
  t.adjusted.set(convention, out);
  return out;
}

// ---- public functions ---------------------------------------------------------------------------------------

/**
 * The cached table, when every array is an Int32Array (integers by construction): the kernels then check each
 * day against the table's bounds as they go, and the input needs no pass of its own.
 */
function fastTable(e: Engine, ...arrays: ArrayLike<number>[]): DayTable | undefined {
  for (const a of arrays) if (!(a instanceof Int32Array)) return undefined;
  return e.cachedDayTable;
}

/**
 * {@link isBusinessDay} over many day numbers: 1 where the day is a business day, 0 where it is not. `out`, when
 * given, must be a Uint8Array at least as long as `dayNumbers`.
 *
 * @example
 * ```ts
 * isBusinessDayBulk('us-federal', Int32Array.of(dayNumberFromYmd(2025, 7, 4), dayNumberFromYmd(2025, 7, 7))); // Uint8Array [0, 1]
 * ```
 */
export function isBusinessDayBulk(calendar: CalendarInput, dayNumbers: ArrayLike<number>, out?: Uint8Array): Uint8Array {
  const e = engineOf(calendar);
  const d = requireNumberArray('dayNumbers', dayNumbers);
  const len = d.length;
  const o = requireOutArray('out', out, Uint8Array, len);
  if (len === 0) return o;
  const fast = fastTable(e, d);
  if (fast && Reflect.apply(testKernel, undefined, [fast.rank, fast.days, fast.base, d, o, len]) === 0) return o;
  const { min, max } = scanDays(e, 'dayNumbers', d, len, 0);
  const t = tableFor(e, min, max + 1);
  if (t) Reflect.apply(testKernel, undefined, [t.rank, t.days, t.base, d, o, len]);
  else for (let i = 0; i < len; i++) o[i] = e.isBusinessDay(d[i]!) ? 1 : 0;
  return o;
}

/**
 * {@link countBusinessDays} over many ranges: `out[k]` is the number of business days in
 * [`start[k]`, `end[k]`), negative when the end comes first. `end[k]` may be the day after the calendar's last day.
 *
 * @example
 * ```ts
 * const jan1 = dayNumberFromYmd(2025, 1, 1);
 * countBusinessDaysBulk('us-federal', Int32Array.of(jan1, jan1), Int32Array.of(dayNumberFromYmd(2025, 2, 1), dayNumberFromYmd(2026, 1, 1))); // Int32Array [21, 250]
 * ```
 */
export function countBusinessDaysBulk(calendar: CalendarInput, start: ArrayLike<number>, end: ArrayLike<number>, out?: Int32Array): Int32Array {
  const e = engineOf(calendar);
  const a = requireNumberArray('start', start);
  const b = requireNumberArray('end', end);
  const len = a.length;
  requireSameLength('end', b, len, 'start');
  const o = requireOutArray('out', out, Int32Array, len);
  if (len === 0) return o;
  const fast = fastTable(e, a, b);
  if (fast && Reflect.apply(countKernel, undefined, [fast.rank, fast.days, fast.base, a, b, o, len]) === 0) return o;
  const sa = scanDays(e, 'start', a, len, 1);
  const sb = scanDays(e, 'end', b, len, 1);
  const lo = Math.min(sa.min, sb.min);
  const hi = Math.max(sa.max, sb.max);
  // A table over [lo, hi) holds the rank of hi too (its last entry).
  const t = hi > lo ? tableFor(e, lo, hi) : undefined;
  if (hi === lo) o.fill(0, 0, len);
  else if (t) Reflect.apply(countKernel, undefined, [t.rank, t.days, t.base, a, b, o, len]);
  else for (let i = 0; i < len; i++) o[i] = a[i]! <= b[i]! ? e.countBetween(a[i]!, b[i]!) : -e.countBetween(b[i]!, a[i]!);
  return o;
}

/** Days a table must reach past a day for shifts of up to n business days: n weeks of business days and some room for holidays. */
function reachOf(e: Engine, n: number): number {
  return n <= 0 ? 0 : Math.ceil((n * 7 * 1.25) / e.weekdaysPerWeek) + 31;
}

/**
 * {@link shiftBusinessDays} over many day numbers: `out[k]` is `n[k]` business days from `dayNumbers[k]` (or `n`
 * business days from each, when `n` is one number), with the same sign rules as the single form.
 *
 * @example
 * ```ts
 * const days = Int32Array.of(dayNumberFromYmd(2025, 12, 23), dayNumberFromYmd(2025, 12, 29));
 * Array.from(shiftBusinessDaysBulk('us-federal', days, Int32Array.of(2, -2)), formatPlainDate); // ['2025-12-26', '2025-12-24']
 * ```
 */
export function shiftBusinessDaysBulk(calendar: CalendarInput, dayNumbers: ArrayLike<number>, n: ArrayLike<number> | number, out?: Int32Array): Int32Array {
  const e = engineOf(calendar);
  const d = requireNumberArray('dayNumbers', dayNumbers);
  const len = d.length;
  let each: ArrayLike<number> | undefined;
  if (typeof n === 'number') requireWhole('n', n, -Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER);
  else {
    each = requireNumberArray('n', n);
    requireSameLength('n', each, len, 'dayNumbers');
  }
  const o = requireOutArray('out', out, Int32Array, len);
  if (len === 0) return o;
  const run = (t: DayTable): number =>
    each
      ? Reflect.apply(shiftKernel, undefined, [t.rank, t.businessDays, t.days, t.base, d, each, o, len])
      : Reflect.apply(shiftByKernel, undefined, [t.rank, t.businessDays, t.days, t.base, d, n, o, len]);
  const fast = each ? fastTable(e, d, each) : fastTable(e, d);
  // The cached table, unless a day lies outside it or more than one answer in 64 does.
  let missed = fast ? run(fast) : -1;
  if (missed < 0 || missed > len >> 6) {
    const amounts = each ? scanAmounts(each, len) : { min: n as number, max: n as number };
    const { min, max } = scanDays(e, 'dayNumbers', d, len, 0);
    // The input's days, and as much room for the shifts on each side as a table allows.
    const core = max + 1 - min;
    if (core <= MAX_DAY_TABLE_DAYS) {
      const room = MAX_DAY_TABLE_DAYS - core;
      const before = Math.min(reachOf(e, -amounts.min), room >> 1, min - e.firstDay);
      const after = Math.min(reachOf(e, Math.max(amounts.max, 1)), room - before, e.endDay - max - 1);
      missed = run(e.dayTable(min - before, max + 1 + after));
    } else {
      o.fill(NOT_IN_TABLE, 0, len);
      missed = len;
    }
  }
  // Answers outside the table: the scalar path, which also throws what the single form throws.
  if (missed > 0) for (let i = 0; i < len; i++) if (o[i] === NOT_IN_TABLE) o[i] = e.shift(d[i]!, each ? each[i]! : (n as number));
  return o;
}

/**
 * {@link adjustDayNumber} over many day numbers, by one convention: business days are kept, other days moved.
 *
 * @example
 * ```ts
 * const days = Int32Array.of(dayNumberFromYmd(2026, 1, 31), dayNumberFromYmd(2026, 1, 30));
 * Array.from(adjustDayNumberBulk('us-federal', days, 'modified-following'), formatPlainDate); // ['2026-01-30', '2026-01-30']
 * ```
 */
export function adjustDayNumberBulk(calendar: CalendarInput, dayNumbers: ArrayLike<number>, convention: BusinessDayConvention, out?: Int32Array): Int32Array {
  const e = engineOf(calendar);
  const d = requireNumberArray('dayNumbers', dayNumbers);
  requireEnum('convention', convention, BUSINESS_DAY_CONVENTIONS);
  const len = d.length;
  const o = requireOutArray('out', out, Int32Array, len);
  if (len === 0) return o;
  const fast = fastTable(e, d);
  let missed = fast ? Reflect.apply(lookupKernel, undefined, [adjustedTable(fast, convention), fast.base, d, o, len]) : -1;
  if (missed < 0) {
    const { min, max } = scanDays(e, 'dayNumbers', d, len, 0);
    const t = tableFor(e, min, max + 1);
    if (t) missed = Reflect.apply(lookupKernel, undefined, [adjustedTable(t, convention), t.base, d, o, len]);
    else {
      o.fill(NOT_IN_TABLE, 0, len);
      missed = len;
    }
  }
  // Days whose answer lies outside the table, or that the single form refuses: the single form.
  if (missed > 0) for (let i = 0; i < len; i++) if (o[i] === NOT_IN_TABLE) o[i] = adjustDayNumber(calendar, d[i]!, convention);
  return o;
}

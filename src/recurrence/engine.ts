/**
 * @internal The expansion engines behind every date rule. An engine writes its raw occurrences in a half-open
 * range `[lo, hi)` in strictly increasing order, computing each one directly (anchor + n x step, or the n-th
 * period's selected day): nothing is found by adding a step repeatedly, and every loop is bounded by the range.
 * Engines whose occurrences repeat (a fixed step, or the 400-year Gregorian cycle) can also locate their k-th
 * occurrence from a point without listing the ones before it; a rule's `count` is found that way. The engines
 * of instants are in ./engine-instants.ts.
 *
 * Units are day numbers for date engines and epoch milliseconds for instant engines.
 *
 * @module
 */
import { dayNumberFromYmdUnchecked, dayCountOfMonthUnchecked, weekdayOfDayNumberUnchecked } from '../civil/gregorian.js';
import {
  dayCountOfMonthIndex,
  firstDayNumberOfMonthIndex,
  monthIndexFromYearMonth,
  monthIndexOfDayNumberUnchecked,
  monthOfMonthIndex,
  yearOfMonthIndex,
} from '../civil/names.js';
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../bounds.js';

/** A growable buffer of numbers: one allocation per doubling, none per element. */
export class Sink {
  data: Float64Array;
  length = 0;
  constructor(capacity = 64) {
    this.data = new Float64Array(Math.max(4, capacity));
  }
  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  clear(): void {
    this.length = 0;
  }
  last(): number {
    return this.length > 0 ? this.data[this.length - 1]! : Number.NaN;
  }
}

/** A raw occurrence generator. */
export interface Engine {
  /** Appends the occurrences in [lo, hi) in strictly increasing order. */
  fill(lo: number, hi: number, out: Sink): void;
  /**
   * The occurrence number k (0 = the first) at or after `lo`, found without listing the ones before it (cost
   * independent of k); NaN when it would lie at or after `end`. Undefined (or a missing method) when this engine
   * cannot locate it there, and the caller must list.
   */
  locate?(lo: number, k: number, end: number): number | undefined;
  /** Typical distance between occurrences (units), to size search windows. */
  readonly stride: number;
  /**
   * An upper bound on the distance between consecutive occurrences when one is proven (units); otherwise
   * Infinity, and searches give up after a bounded distance with a typed error.
   */
  readonly maxGap: number;
}

/** What a rule needs from a business calendar. */
export interface BusinessOps {
  readonly id: string;
  /** The calendar answers for days in [firstDay, endDay). */
  readonly firstDay: number;
  readonly endDay: number;
  isBusinessDay(dayNumber: number): boolean;
  adjust(dayNumber: number, convention: string): number;
  /** Business days in [start, end). */
  countBusinessDays(start: number, end: number): number;
  /** The n-th business day in [start, end) (n < 0 counts from the end), or undefined. For checks only. */
  nthBusinessDayOfRange(start: number, end: number, n: number): number | undefined;
  /**
   * Fast path of the engines: the n-th business day in [start, end) (n < 0 counts from the end), or NaN when
   * there are fewer than |n|. Unchecked: [start, end) must lie in [firstDay, endDay). Reads the compiled
   * calendar's bitsets a word (32 days) at a time.
   */
  nthInRangeUnchecked(start: number, end: number, n: number): number;
  /** Fast path of the engines: pushes the business days in [start, end) to `out`. Unchecked, as above. */
  appendBusinessDaysUnchecked(start: number, end: number, out: Sink): void;
  /** The business day n business days from `dayNumber` (as shiftBusinessDays), or NaN when it lies outside the calendar's years. */
  shiftOrNaN(dayNumber: number, n: number): number;
  /** The compiled calendar, for definitions that are serialized again. */
  readonly calendar: unknown;
}

/** What a rule needs from a period unit. */
export interface PeriodOps {
  readonly id: string;
  ordinalOf(dayNumber: number): number;
  firstDayOf(ordinal: number): number;
  readonly unit: unknown;
}

/** What a rule needs from a zone. */
export interface ZoneOps {
  readonly id: string;
  offsetSecondsFromEpochMs(epochMs: number): number;
  /**
   * True when the zone's offset may change by 12 hours or more at once within [startMs, endMs) (a zone that moved
   * across the date line skips or repeats a whole calendar day), or when that cannot be told cheaply.
   */
  mayJumpHalfADay(startMs: number, endMs: number): boolean;
  readonly zone: unknown;
}

/** Floor modulo for any integers. */
export function mod(a: number, n: number): number {
  const r = a % n;
  return r < 0 ? r + n : r;
}

/** Greatest common divisor of two positive integers. */
export function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}

/** Months in one 400-year Gregorian cycle: the calendar (and its weekdays) repeats after it. */
const CYCLE_MONTHS = 4800;
/** Days in one 400-year Gregorian cycle (146,097 = 20,871 weeks). */
export const CYCLE_DAYS = 146_097;
const MIN_MONTH_INDEX = /* @__PURE__ */ monthIndexOfDayNumberUnchecked(MIN_DAY_NUMBER);
const MAX_MONTH_INDEX = /* @__PURE__ */ monthIndexOfDayNumberUnchecked(MAX_DAY_NUMBER);

/**
 * The occurrence number k at or after `lo` of an engine whose occurrences repeat every `cycle` units: one cycle
 * is listed, then whole cycles are counted. Near the ends of the supported values (where a period of the
 * pattern may be cut short) it lists directly, at most two cycles; near the start it declines (undefined).
 */
export function locateByCycle(engine: Engine, cycle: number, lo: number, k: number, end: number, min: number): number | undefined {
  if (lo - min < cycle) return undefined;
  const sink = new Sink(64);
  if (lo + 2 * cycle >= end) {
    engine.fill(lo, end, sink);
    return k < sink.length ? sink.data[k]! : Number.NaN;
  }
  engine.fill(lo, lo + cycle, sink);
  const per = sink.length;
  if (per === 0) return Number.NaN;
  const q = Math.floor(k / per);
  const base = lo + q * cycle;
  if (base + 2 * cycle >= end) {
    sink.clear();
    engine.fill(base, end, sink);
    const i = k - q * per;
    return i < sink.length ? sink.data[i]! : Number.NaN;
  }
  return sink.data[k - q * per]! + q * cycle;
}

// ---------------------------------------------------------------------------------------------------------------
// Day selectors

/** A compiled day selector. `kind` 0 = day of period, 1 = nth weekday, 2 = nth business day. */
export interface Selector {
  readonly kind: 0 | 1 | 2;
  /** Day (1-based, negative from the end), weekday ordinal, or business-day ordinal. */
  readonly n: number;
  /** ISO weekday for kind 1. */
  readonly weekday: number;
  /** For kind 0: move a missing day to the last (or first) day instead of skipping the period. */
  readonly clamp: boolean;
}

/** Marks "no day selected". */
const NONE = Number.MIN_SAFE_INTEGER;

/** The day `s` picks in the period [first, end), or NONE. */
function pickDay(s: Selector, first: number, end: number, business: BusinessOps | undefined): number {
  if (s.kind === 0) {
    if (s.n > 0) {
      const d = first + s.n - 1;
      return d < end ? d : s.clamp ? end - 1 : NONE;
    }
    const d = end + s.n;
    return d >= first ? d : s.clamp ? first : NONE;
  }
  if (s.kind === 1) {
    if (s.n > 0) {
      const d = first + mod(s.weekday - weekdayOfDayNumberUnchecked(first), 7) + 7 * (s.n - 1);
      return d < end ? d : NONE;
    }
    const d = end - 1 - mod(weekdayOfDayNumberUnchecked(end - 1) - s.weekday, 7) + 7 * (s.n + 1);
    return d >= first ? d : NONE;
  }
  const cal = business!;
  if (first >= cal.firstDay && end <= cal.endDay) {
    const d = cal.nthInRangeUnchecked(first, end, s.n);
    return d === d ? d : NONE;
  }
  // A period that reaches past the calendar's years: scan with the validated check, which reports the day
  // outside them (unless the day is found first).
  let seen = 0;
  if (s.n > 0) {
    for (let d = first; d < end; d++) if (cal.isBusinessDay(d) && ++seen === s.n) return d;
  } else {
    for (let d = end - 1; d >= first; d--) if (cal.isBusinessDay(d) && ++seen === -s.n) return d;
  }
  return NONE;
}

/** Writes the days that `selectors` pick in [first, end), restricted to [lo, hi), sorted and distinct. */
function emitSelected(
  selectors: readonly Selector[],
  first: number,
  end: number,
  lo: number,
  hi: number,
  business: BusinessOps | undefined,
  scratch: number[],
  out: Sink,
): void {
  if (selectors.length === 1) {
    const d = pickDay(selectors[0]!, first, end, business);
    if (d !== NONE && d >= lo && d < hi) out.push(d);
    return;
  }
  scratch.length = 0;
  for (const s of selectors) {
    const d = pickDay(s, first, end, business);
    if (d !== NONE) scratch.push(d);
  }
  scratch.sort((a, b) => a - b);
  let prev = NONE;
  for (const d of scratch) {
    if (d !== prev && d >= lo && d < hi) out.push(d);
    prev = d;
  }
}

function selectsSomething(selectors: readonly Selector[], first: number, end: number, business: BusinessOps | undefined): boolean {
  for (const s of selectors) if (pickDay(s, first, end, business) !== NONE) return true;
  return false;
}

// ---------------------------------------------------------------------------------------------------------------
// Date engines

/** Every `step` units (days, or milliseconds of elapsed time) from `anchor`, in both directions. */
export function stepEngine(anchor: number, step: number): Engine {
  return {
    stride: step,
    maxGap: step,
    fill(lo, hi, out) {
      let k = Math.ceil((lo - anchor) / step);
      for (let d = anchor + k * step; d < hi; d = anchor + ++k * step) out.push(d);
    },
    locate(lo, k, end) {
      const d = anchor + (Math.ceil((lo - anchor) / step) + k) * step;
      return d < end ? d : Number.NaN;
    },
  };
}

/**
 * Every `step` business days, counting the first business day on or after `anchor` as number 0. The business
 * days come from the calendar's bitsets a word at a time (rule ranges lie inside the calendar's years: compile
 * clips `rawStart`/`rawEnd` to them); a range outside them falls back to the validated check, which reports it.
 */
export function businessDaysEngine(cal: BusinessOps, anchor: number, step: number): Engine {
  return {
    stride: step * 1.4,
    maxGap: Number.POSITIVE_INFINITY,
    fill(lo, hi, out) {
      if (lo >= hi) return;
      const fast = lo >= cal.firstDay && hi <= cal.endDay;
      if (step === 1) {
        if (fast) cal.appendBusinessDaysUnchecked(lo, hi, out);
        else for (let d = lo; d < hi; d++) if (cal.isBusinessDay(d)) out.push(d);
        return;
      }
      // Index (in business days from the anchor) of the first business day on or after lo.
      let index = lo >= anchor ? cal.countBusinessDays(anchor, lo) : -cal.countBusinessDays(lo, anchor);
      if (fast) {
        // Append all, then keep every step-th in place.
        const from = out.length;
        cal.appendBusinessDaysUnchecked(lo, hi, out);
        const data = out.data;
        let w = from;
        for (let i = from; i < out.length; i++, index++) if (mod(index, step) === 0) data[w++] = data[i]!;
        out.length = w;
        return;
      }
      for (let d = lo; d < hi; d++) {
        if (!cal.isBusinessDay(d)) continue;
        if (mod(index, step) === 0) out.push(d);
        index++;
      }
    },
    locate(lo, k, end) {
      if (lo < cal.firstDay || lo >= cal.endDay) return undefined;
      // The first business day on or after lo, its index from the anchor, then whole steps of business days.
      const first = cal.shiftOrNaN(lo, 0);
      if (first !== first) return Number.NaN;
      const index = first >= anchor ? cal.countBusinessDays(anchor, first) : -cal.countBusinessDays(first, anchor);
      const d = cal.shiftOrNaN(first, mod(-index, step) + k * step);
      return d === d && d < end ? d : Number.NaN;
    },
  };
}

/** On the given weekday offsets (0..6 from the week start) of every `step`-th week from the week starting `weekZero`. */
export function weeklyEngine(weekZero: number, offsets: readonly number[], step: number): Engine {
  const span = 7 * step;
  return {
    stride: span / offsets.length,
    maxGap: span,
    fill(lo, hi, out) {
      let k = Math.floor((lo - weekZero) / span);
      for (let base = weekZero + k * span; base < hi; base = weekZero + ++k * span) {
        for (const off of offsets) {
          const d = base + off;
          if (d >= lo && d < hi) out.push(d);
        }
      }
    },
    locate(lo, k, end) {
      // Occurrences in lo's span before lo, then k more from the span's first one.
      const w = Math.floor((lo - weekZero) / span);
      const base = weekZero + w * span;
      let before = 0;
      while (before < offsets.length && base + offsets[before]! < lo) before++;
      const i = before + k;
      const d = base + Math.floor(i / offsets.length) * span + offsets[i % offsets.length]!;
      return d < end ? d : Number.NaN;
    },
  };
}

/**
 * Days picked by `selectors` in every `step`-th month (month index congruent to `phase` modulo `step`), among
 * the months of the year in `monthMask` (bit m set for month m; 0 = all).
 */
export function monthsEngine(
  step: number,
  phase: number,
  monthMask: number,
  selectors: readonly Selector[],
  business: BusinessOps | undefined,
  maxGapMonths: number,
): Engine {
  const scratch: number[] = [];
  // Without business-day selectors the months repeat with the 400-year cycle: every lcm(step, 4,800) months.
  const civil = selectors.every((s) => s.kind !== 2);
  const cycleDays = (step / gcd(step, CYCLE_MONTHS)) * CYCLE_DAYS;
  const engine: Engine = {
    stride: (30.44 * step) / selectors.length,
    maxGap: Number.isFinite(maxGapMonths) ? (maxGapMonths + 1) * 31 : Number.POSITIVE_INFINITY,
    fill(lo, hi, out) {
      if (lo >= hi) return;
      const miLo = Math.max(monthIndexOfDayNumberUnchecked(lo), MIN_MONTH_INDEX);
      const miHi = Math.min(monthIndexOfDayNumberUnchecked(hi - 1), MAX_MONTH_INDEX);
      let mi = miLo + mod(phase - miLo, step);
      if (mi > miHi) return;
      // Walk the months by year and month, carrying the first day forward (no division per month).
      let y = yearOfMonthIndex(mi);
      let m = monthOfMonthIndex(mi);
      let first = dayNumberFromYmdUnchecked(y, m, 1);
      const one = selectors.length === 1 ? selectors[0]! : undefined;
      for (;;) {
        const end = first + dayCountOfMonthUnchecked(y, m);
        if (monthMask === 0 || ((monthMask >> m) & 1) !== 0) {
          if (one !== undefined) {
            const d = pickDay(one, first, end, business);
            if (d !== NONE && d >= lo && d < hi) out.push(d);
          } else emitSelected(selectors, first, end, lo, hi, business, scratch, out);
        }
        mi += step;
        if (mi > miHi) return;
        if (step === 1) {
          first = end;
          if (++m > 12) {
            m = 1;
            y++;
          }
        } else {
          y = yearOfMonthIndex(mi);
          m = monthOfMonthIndex(mi);
          first = dayNumberFromYmdUnchecked(y, m, 1);
        }
      }
    },
  };
  if (civil) engine.locate = (lo, k, end) => locateByCycle(engine, cycleDays, lo, k, end, MIN_DAY_NUMBER);
  return engine;
}

/**
 * Proves whether a months engine can produce a date, by checking every candidate month of one full 400-year
 * Gregorian cycle (the calendar and its weekdays repeat after 4,800 months), and returns the longest run of
 * candidate months without one (in months), or -1 when no month in the cycle produces a date.
 * Business-day selectors are checked as if every weekday were a business day (their calendar is not periodic).
 */
export function monthsCycleGap(step: number, phase: number, monthMask: number, selectors: readonly Selector[]): number {
  const civil = selectors.map((s) => (s.kind === 2 ? { ...s, kind: 0 as const, clamp: false, n: s.n > 0 ? 1 : -1 } : s));
  const candidates = CYCLE_MONTHS / gcd(step, CYCLE_MONTHS);
  const y2000 = monthIndexFromYearMonth(2000, 1);
  const base = y2000 + mod(phase - y2000, step);
  let firstHit = -1;
  let lastHit = -1;
  let maxGap = 0;
  for (let k = 0; k < candidates; k++) {
    const mi = base + k * step;
    const m = monthOfMonthIndex(mi);
    if (monthMask !== 0 && ((monthMask >> m) & 1) === 0) continue;
    const first = firstDayNumberOfMonthIndex(mi);
    if (!selectsSomething(civil, first, first + dayCountOfMonthIndex(mi), undefined)) continue;
    if (firstHit < 0) firstHit = k;
    else maxGap = Math.max(maxGap, k - lastHit);
    lastHit = k;
  }
  if (firstHit < 0) return -1;
  maxGap = Math.max(maxGap, firstHit + candidates - lastHit);
  return maxGap * step;
}

/** Days picked by `selectors` in every `step`-th period of a unit, counting from period `phase`. */
export function periodsEngine(
  unit: PeriodOps,
  step: number,
  phase: number,
  selectors: readonly Selector[],
  business: BusinessOps | undefined,
  stride: number,
  maxGap: number,
): Engine {
  const scratch: number[] = [];
  return {
    stride,
    maxGap,
    fill(lo, hi, out) {
      if (lo >= hi) return;
      const oLo = unit.ordinalOf(lo);
      const oHi = unit.ordinalOf(hi - 1);
      for (let o = oLo + mod(phase - oLo, step); o <= oHi; o += step) {
        emitSelected(selectors, unit.firstDayOf(o), unit.firstDayOf(o + 1), lo, hi, business, scratch, out);
      }
    },
  };
}

/**
 * Checks the candidate periods of one 400-year cycle from `anchorOrdinal` (at most 146,097 of them) and returns
 * the longest distance in days between producing periods, or -1 when none produces a date. Business-day
 * selectors are checked as in {@link monthsCycleGap}.
 */
export function periodsCycleGap(unit: PeriodOps, step: number, anchorOrdinal: number, selectors: readonly Selector[]): number {
  const civil = selectors.map((s) => (s.kind === 2 ? { ...s, kind: 0 as const, clamp: false, n: s.n > 0 ? 1 : -1 } : s));
  const startDay = unit.firstDayOf(anchorOrdinal);
  const stopDay = startDay + CYCLE_DAYS * step;
  let last = Number.NaN;
  let first = Number.NaN;
  let gap = 0;
  let count = 0;
  for (let o = anchorOrdinal; count < CYCLE_DAYS; o += step, count++) {
    const a = unit.firstDayOf(o);
    if (a >= stopDay) break;
    const b = unit.firstDayOf(o + 1);
    if (!selectsSomething(civil, a, b, undefined)) continue;
    if (Number.isNaN(first)) first = a;
    else gap = Math.max(gap, a - last);
    last = a;
  }
  if (Number.isNaN(first)) return -1;
  return Math.max(gap, first + (stopDay - startDay) - last) + 62;
}


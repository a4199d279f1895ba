/**
 * @internal The compiled form of a business calendar: one bit per day (set = business day) in 12 words of 32 bits
 * per year, plus a running count of business days before each word. A contiguous window of compiled years is
 * kept (compiled lazily, bounded to MAX_WINDOW_YEARS); inside it, the business days before any day are one
 * lookup and one popcount, and the kth business day is a binary search over the running counts, so counting and
 * shifting never walk day by day. Spans longer than the window are counted year by year, and where the
 * calendar's years repeat every 400 years (./periodic.ts) by whole 400-year cycles, so that a count or a shift
 * over the whole supported range costs one cycle's compilation.
 *
 * @module
 */
import { MAX_EMPTY_YEARS, MAX_WINDOW_YEARS } from '../bounds.js';
import {
  dayNumberFromYmdUnchecked,
  isLeapYearUnchecked,
  weekdayOfDayNumberUnchecked,
  yearOfDayNumberUnchecked,
} from '../civil/gregorian.js';
import { KalendsRangeError } from '../errors.js';
import { formatPlainDate } from '../instant/index.js';
import { CYCLE_YEARS, type YearBudget, YearCounts } from './periodic.js';
import { holidaysOfYear } from './rules.js';
import type { CalendarNode } from './validate.js';

/** Words of 32 days per compiled year (384 bits cover 366 days). */
const WORDS = 12;
/** Extra years compiled on each side when the window grows, so that nearby queries do not grow it again. */
const MARGIN_YEARS = 8;
/** Shifts of more business days than this skip whole years instead of growing the compiled window. */
const LONG_SHIFT = 100_000;

/** Number of set bits in a 32-bit word. */
function popcount32(x: number): number {
  x = x - ((x >>> 1) & 0x55555555);
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  x = (x + (x >>> 4)) & 0x0f0f0f0f;
  return Math.imul(x, 0x01010101) >>> 24;
}

/** Most days a dense per-day table spans (about 400 years; two Int32Arrays of this length at most). */
export const MAX_DAY_TABLE_DAYS = 146_100;

/**
 * @internal A dense per-day table over the days [base, base + days), for the bulk forms: `rank[i]` is the number
 * of business days in [base, base + i) (i = 0..days), and `businessDays[k]` the day number of the kth business
 * day from base. A count is two loads, a business-day test two loads, a shift three. `adjusted` caches, per
 * convention, the adjusted day of every day in the table (NOT_IN_TABLE where the answer lies outside it).
 */
export interface DayTable {
  readonly base: number;
  readonly days: number;
  readonly rank: Int32Array;
  readonly businessDays: Int32Array;
  readonly adjusted: Map<string, Int32Array>;
}

/** @internal Written by a bulk kernel where the answer lies outside its table; the caller answers those by the scalar path. */
export const NOT_IN_TABLE = -2147483648;

/** @internal The compiled, cached state of one calendar. */
export class Engine {
  /** First year of the window. */
  private lo = 0;
  /** @internal Years in the window (0 = empty). */
  count = 0;
  /** @internal The compiled bits: WORDS words per year of the window, bit set = business day. */
  words = new Uint32Array(0);
  /** cum[w] = business days in the window before word w; cum[count * 12] is the window's total. */
  private cum = new Int32Array(1);
  /** @internal yearStarts[i] = day number of 1 January of year lo + i, for i in 0..count (the last is the day after the window). */
  yearStarts = new Int32Array(1);

  /** The last dense per-day table built for a bulk call (see {@link dayTable}). */
  private table: DayTable | undefined;

  /** First supported day, and the day after the last one. */
  readonly firstDay: number;
  readonly endDay: number;
  /** Weekend mask, and the number of days of the week outside the weekend. */
  /** @internal Days of the week outside the weekend. */
  readonly weekdaysPerWeek: number;
  /** Business days of whole years (by 400-year cycles where the calendar repeats). */
  private readonly years: YearCounts;
  private readonly scratch = new Uint32Array(WORDS);

  constructor(
    readonly node: CalendarNode,
    readonly label: string,
    readonly firstYear: number,
    readonly lastYear: number,
  ) {
    this.firstDay = dayNumberFromYmdUnchecked(firstYear, 1, 1);
    this.endDay = dayNumberFromYmdUnchecked(lastYear + 1, 1, 1);
    let w = 0;
    for (let wd = 1; wd <= 7; wd++) if ((node.weekendMask & (1 << wd)) === 0) w++;
    this.weekdaysPerWeek = w;
    this.years = new YearCounts(node, label, (y) => this.yearCount(y));
  }

  /** Compiles one year's bits into `words` at `offset`. */
  private compileYear(year: number, words: Uint32Array, offset: number): void {
    const start = dayNumberFromYmdUnchecked(year, 1, 1);
    const len = isLeapYearUnchecked(year) ? 366 : 365;
    const mask = this.node.weekendMask;
    let wd = weekdayOfDayNumberUnchecked(start);
    for (let k = 0; k < WORDS; k++) words[offset + k] = 0;
    for (let doy = 0; doy < len; doy++) {
      if ((mask & (1 << wd)) === 0) words[offset + (doy >> 5)]! |= 1 << (doy & 31);
      wd = wd === 7 ? 1 : wd + 1;
    }
    for (const h of holidaysOfYear(this.node, year)) {
      const doy = h.observed - start;
      words[offset + (doy >> 5)]! &= ~(1 << (doy & 31));
    }
  }

  /** Makes the window exactly [newLo, newHi], reusing compiled years that overlap. */
  private setWindow(newLo: number, newHi: number): void {
    const n = newHi - newLo + 1;
    const words = new Uint32Array(n * WORDS);
    for (let y = newLo; y <= newHi; y++) {
      const old = y - this.lo;
      if (this.count > 0 && old >= 0 && old < this.count) words.set(this.words.subarray(old * WORDS, old * WORDS + WORDS), (y - newLo) * WORDS);
      else this.compileYear(y, words, (y - newLo) * WORDS);
    }
    const cum = new Int32Array(n * WORDS + 1);
    let acc = 0;
    for (let w = 0; w < n * WORDS; w++) {
      cum[w] = acc;
      acc += popcount32(words[w]!);
    }
    cum[n * WORDS] = acc;
    const yearStarts = new Int32Array(n + 1);
    for (let i = 0; i <= n; i++) yearStarts[i] = dayNumberFromYmdUnchecked(newLo + i, 1, 1);
    this.yearStarts = yearStarts;
    this.lo = newLo;
    this.count = n;
    this.words = words;
    this.cum = cum;
  }

  /** Ensures the window covers [yLo, yHi] (which must span at most MAX_WINDOW_YEARS years). */
  ensure(yLo: number, yHi: number): void {
    const hi = this.lo + this.count - 1;
    if (this.count > 0 && yLo >= this.lo && yHi <= hi) return;
    let newLo: number;
    let newHi: number;
    if (this.count > 0 && Math.max(hi, yHi) - Math.min(this.lo, yLo) + 1 <= MAX_WINDOW_YEARS) {
      // Grow by at least half the window, so that a walk through many years recompiles in O(years) overall.
      const margin = Math.max(MARGIN_YEARS, this.count >> 1);
      newLo = yLo < this.lo ? Math.max(this.firstYear, yLo - margin) : this.lo;
      newHi = yHi > hi ? Math.min(this.lastYear, yHi + margin) : hi;
    } else {
      newLo = Math.max(this.firstYear, yLo - MARGIN_YEARS);
      newHi = Math.min(this.lastYear, yHi + MARGIN_YEARS);
    }
    if (newHi - newLo + 1 > MAX_WINDOW_YEARS) {
      // Keep the requested years; trim the margins.
      newLo = Math.max(newLo, Math.min(yLo, newHi - MAX_WINDOW_YEARS + 1));
      newHi = Math.min(newHi, newLo + MAX_WINDOW_YEARS - 1);
    }
    this.setWindow(newLo, newHi);
    this.tableOverWindow();
  }

  /**
   * Keeps the dense per-day table over the compiled window when the window is short enough (the usual case: a
   * few decades), so that single counts, shifts and tests are answered by two or three loads from it.
   */
  private tableOverWindow(): void {
    const lo = this.yearStarts[0]!;
    const hi = this.yearStarts[this.count]!;
    if (hi - lo > MAX_DAY_TABLE_DAYS) return;
    const t = this.table;
    if (t && lo >= t.base && hi <= t.base + t.days) return;
    this.dayTable(lo, hi, 0);
  }

  private get total(): number {
    return this.cum[this.count * WORDS]!;
  }

  /** Business days in the window before `dn` (dn's year in the window, or dn the first day after it). */
  private rank(dn: number): number {
    const y = yearOfDayNumberUnchecked(dn);
    const yi = y - this.lo;
    if (yi === this.count) return this.total;
    const doy = dn - dayNumberFromYmdUnchecked(y, 1, 1);
    const w = yi * WORDS + (doy >> 5);
    const b = doy & 31;
    return this.cum[w]! + (b === 0 ? 0 : popcount32(this.words[w]! & (0xffffffff >>> (32 - b))));
  }

  /** Whether `dn` (in the window) is a business day. */
  private bit(dn: number): boolean {
    const y = yearOfDayNumberUnchecked(dn);
    const doy = dn - dayNumberFromYmdUnchecked(y, 1, 1);
    return ((this.words[(y - this.lo) * WORDS + (doy >> 5)]! >>> (doy & 31)) & 1) === 1;
  }

  /** The day of the business day with index k (0 <= k < total) in the window. */
  private select(k: number): number {
    const cum = this.cum;
    let a = 0;
    let b = this.count * WORDS - 1;
    while (a < b) {
      const mid = (a + b + 1) >> 1;
      if (cum[mid]! <= k) a = mid;
      else b = mid - 1;
    }
    let x = this.words[a]!;
    for (let r = k - cum[a]!; r > 0; r--) x &= x - 1;
    const bit = 31 - Math.clz32(x & -x);
    const yi = (a / WORDS) | 0;
    return dayNumberFromYmdUnchecked(this.lo + yi, 1, 1) + (a - yi * WORDS) * 32 + bit;
  }

  isBusinessDay(dn: number): boolean {
    const t = this.table;
    if (t !== undefined) {
      const x = dn - t.base;
      if (x >= 0 && x < t.days) return t.rank[x + 1]! !== t.rank[x]!;
    }
    const y = yearOfDayNumberUnchecked(dn);
    this.ensure(y, y);
    return this.bit(dn);
  }

  /**
   * The business day n business days from dn: n > 0 counts business days strictly after dn, n < 0 strictly
   * before, n = 0 gives dn if it is a business day, else the next one.
   */
  shift(dn: number, n: number, name = 'n'): number {
    const t = this.table;
    if (t !== undefined) {
      const x = dn - t.base;
      if (x >= 0 && x < t.days) {
        const k = n > 0 ? t.rank[x + 1]! + n - 1 : t.rank[x]! + n;
        if (k >= 0 && k < t.businessDays.length) return t.businessDays[k]!;
      }
    }
    // A shift that must leave the supported years fails at once: there are at most as many business days as
    // days outside the weekend.
    if (n > 0 && n > this.nonWeekendDays(dn + 1, this.endDay)) throw this.pastEnd(dn, n, 'last', this.lastYear, name);
    if (n < 0 && -n > this.nonWeekendDays(this.firstDay, dn)) throw this.pastEnd(dn, n, 'first', this.firstYear, name);
    if (n > LONG_SHIFT || n < -LONG_SHIFT) return this.shiftFar(dn, n, name);
    return this.shiftNear(dn, n, name);
  }

  /** {@link shift} by growing the compiled window as far as the count needs. */
  private shiftNear(dn: number, n: number, name: string): number {
    const y = yearOfDayNumberUnchecked(dn);
    this.ensure(y, y);
    if (n > 0 || (n === 0 && !this.bit(dn))) {
      let k = this.rank(dn) + (this.bit(dn) ? 1 : 0) + Math.max(n, 1) - 1;
      let emptyYears = 0;
      while (k >= this.total) {
        const hi = this.lo + this.count - 1;
        if (hi >= this.lastYear) throw this.pastEnd(dn, n, 'last', this.lastYear, name);
        const need = k - this.total + 1;
        const add = Math.min(this.lastYear - hi, Math.max(MARGIN_YEARS, Math.ceil(need / 366) + 1), MAX_WINDOW_YEARS);
        const before = this.total;
        if (hi + add - this.lo + 1 <= MAX_WINDOW_YEARS) this.setWindow(this.lo, hi + add);
        else {
          k -= this.total;
          this.setWindow(hi + 1, hi + add);
        }
        const gained = this.count > 0 && this.lo === hi + 1 ? this.total : this.total - before;
        emptyYears = gained === 0 ? emptyYears + add : 0;
        if (emptyYears >= MAX_EMPTY_YEARS) throw this.noBusinessDay(dn, 'after');
      }
      return this.select(k);
    }
    if (n === 0) return dn;
    let k = this.rank(dn) + n;
    let emptyYears = 0;
    while (k < 0) {
      if (this.lo <= this.firstYear) throw this.pastEnd(dn, n, 'first', this.firstYear, name);
      const add = Math.min(this.lo - this.firstYear, Math.max(MARGIN_YEARS, Math.ceil(-k / 366) + 1), MAX_WINDOW_YEARS);
      const hi = this.lo + this.count - 1;
      const before = this.total;
      let gained: number;
      if (hi - (this.lo - add) + 1 <= MAX_WINDOW_YEARS) {
        this.setWindow(this.lo - add, hi);
        gained = this.total - before;
      } else {
        this.setWindow(this.lo - add, this.lo - 1);
        gained = this.total;
      }
      k += gained;
      emptyYears = gained === 0 ? emptyYears + add : 0;
      if (emptyYears >= MAX_EMPTY_YEARS) throw this.noBusinessDay(dn, 'before');
    }
    return this.select(k);
  }

  /**
   * @internal A dense table covering at least [lo, hi) (firstDay <= lo < hi <= endDay, hi - lo <= MAX_DAY_TABLE_DAYS):
   * the cached one when it covers the range, else a new one over the range widened by up to a year on each side
   * (so that nearby calls reuse it), which replaces the cache.
   */
  /** @internal The table kept from the last call that built one, if any. */
  get cachedDayTable(): DayTable | undefined {
    return this.table;
  }

  dayTable(lo: number, hi: number, widen = 366): DayTable {
    const t = this.table;
    if (t && lo >= t.base && hi <= t.base + t.days) return t;
    const room = (MAX_DAY_TABLE_DAYS - (hi - lo)) >> 1;
    const pad = Math.min(widen, room);
    const from = Math.max(this.firstDay, lo - pad);
    const to = Math.min(this.endDay, hi + pad);
    const days = to - from;
    const businessDays = new Int32Array(this.countBetween(from, to));
    let k = 0;
    this.appendBusinessDays(from, to, { push: (d) => void (businessDays[k++] = d) });
    const rank = new Int32Array(days + 1);
    let r = 0;
    for (let i = 0; i < days; i++) {
      rank[i] = r;
      if (r < k && businessDays[r] === from + i) r++;
    }
    rank[days] = r;
    const made: DayTable = { base: from, days, rank, businessDays, adjusted: new Map() };
    this.table = made;
    return made;
  }

  /** @internal Index in the window of the year holding `dn` (which must be in the window). */
  yearIndex(dn: number): number {
    const ys = this.yearStarts;
    let yi = Math.min(((dn - ys[0]!) / 365.2425) | 0, this.count - 1);
    while (ys[yi]! > dn) yi--;
    while (ys[yi + 1]! <= dn) yi++;
    return yi;
  }

  /**
   * @internal Pushes every business day in [a, b) to `out`, in increasing order. Unchecked: a and b must be
   * integer day numbers with firstDay <= a and b <= endDay. Reads one word per 32 days and one bit scan per
   * business day.
   */
  appendBusinessDays(a: number, b: number, out: { push(dayNumber: number): void }): void {
    if (a >= b) return;
    const ya = yearOfDayNumberUnchecked(a);
    const yb = yearOfDayNumberUnchecked(b - 1);
    for (let chunk = ya; chunk <= yb; chunk += MAX_WINDOW_YEARS) {
      const chunkHi = Math.min(yb, chunk + MAX_WINDOW_YEARS - 1);
      this.ensure(chunk, chunkHi);
      const words = this.words;
      for (let y = chunk; y <= chunkHi; y++) {
        const jan1 = dayNumberFromYmdUnchecked(y, 1, 1);
        const from = Math.max(a, jan1) - jan1;
        const to = Math.min(b, dayNumberFromYmdUnchecked(y + 1, 1, 1)) - jan1; // exclusive, > from
        const base = (y - this.lo) * WORDS;
        const wLast = (to - 1) >> 5;
        for (let wi = from >> 5; wi <= wLast; wi++) {
          let x = words[base + wi]!;
          if (wi === from >> 5) x &= 0xffffffff << (from & 31);
          if (wi === wLast) x &= 0xffffffff >>> (31 - ((to - 1) & 31));
          const start = jan1 + wi * 32;
          while (x !== 0) {
            const t = x & -x;
            out.push(start + 31 - Math.clz32(t));
            x ^= t;
          }
        }
      }
    }
  }

  /** Business days in [a, b), a <= b; b may be the first day after the last supported year. */
  countBetween(a: number, b: number): number {
    if (a >= b) return 0;
    const t = this.table;
    if (t !== undefined && a >= t.base && b <= t.base + t.days) return t.rank[b - t.base]! - t.rank[a - t.base]!;
    const ya = yearOfDayNumberUnchecked(a);
    const yb = yearOfDayNumberUnchecked(b - 1);
    if (yb - ya + 1 <= MAX_WINDOW_YEARS) {
      this.ensure(ya, yb);
      return this.rank(b) - this.rank(a);
    }
    // The partial years at both ends through the window, the whole years between by years (or cycles).
    const head = this.countInYear(a, dayNumberFromYmdUnchecked(ya + 1, 1, 1));
    const middle = this.years.sum(ya + 1, yb - 1, { evaluated: 0, from: a, to: b });
    return head + middle + this.countInYear(dayNumberFromYmdUnchecked(yb, 1, 1), b);
  }

  /** Business days in [a, b) where both lie in one year (b may be 1 January of the next). */
  private countInYear(a: number, b: number): number {
    if (a >= b) return 0;
    const y = yearOfDayNumberUnchecked(a);
    this.ensure(y, y);
    return this.rank(b) - this.rank(a);
  }

  /** Days outside the weekend in [a, b): an upper bound on the business days there, by arithmetic. */
  private nonWeekendDays(a: number, b: number): number {
    if (a >= b) return 0;
    const weeks = Math.floor((b - a) / 7);
    let count = weeks * this.weekdaysPerWeek;
    const mask = this.node.weekendMask;
    let wd = weekdayOfDayNumberUnchecked(a);
    for (let d = a + weeks * 7; d < b; d++) {
      if ((mask & (1 << wd)) === 0) count++;
      wd = wd === 7 ? 1 : wd + 1;
    }
    return count;
  }

  /** Business days of year y: from the window when it holds y, else compiled on its own. */
  private yearCount(y: number): number {
    if (this.count > 0 && y >= this.lo && y < this.lo + this.count) {
      const w = (y - this.lo) * WORDS;
      return this.cum[w + WORDS]! - this.cum[w]!;
    }
    const words = this.scratch;
    this.compileYear(y, words, 0);
    let c = 0;
    for (let k = 0; k < WORDS; k++) c += popcount32(words[k]!);
    return c;
  }

  /**
   * {@link shift} for |n| > LONG_SHIFT: the business days left in dn's year, then whole years (whole 400-year
   * cycles where the years repeat), then the day within the year where the count ends.
   */
  private shiftFar(dn: number, n: number, name: string): number {
    const budget: YearBudget = { evaluated: 0, from: dn, to: dn };
    const years = this.years;
    let empty = 0;
    if (n > 0) {
      let y = yearOfDayNumberUnchecked(dn);
      let left = n - this.countInYear(dn + 1, dayNumberFromYmdUnchecked(y + 1, 1, 1));
      while (left > 0) {
        y++;
        if (y > this.lastYear) throw this.pastEnd(dn, n, 'last', this.lastYear, name);
        const s = years.stretchOf(y);
        if (s) {
          const t = years.table(s[0]);
          const room = Math.floor((Math.min(s[1], this.lastYear) - y + 1) / CYCLE_YEARS);
          const q = t.total > 0 ? Math.min(room, Math.floor((left - 1) / t.total)) : 0;
          if (q > 0) {
            left -= q * t.total;
            y += q * CYCLE_YEARS - 1;
            empty = 0;
            continue;
          }
        }
        const c = years.of(y, budget);
        if (left <= c) {
          this.ensure(y, y);
          return this.select(this.rank(dayNumberFromYmdUnchecked(y, 1, 1)) + left - 1);
        }
        left -= c;
        empty = c === 0 ? empty + 1 : 0;
        if (empty >= MAX_EMPTY_YEARS) throw this.noBusinessDay(dn, 'after');
      }
      // Only when n did not leave dn's year (not reached for |n| > LONG_SHIFT, kept for safety).
      return this.shiftNear(dn, n, name);
    }
    let y = yearOfDayNumberUnchecked(dn);
    let left = -n - this.countInYear(dayNumberFromYmdUnchecked(y, 1, 1), dn);
    while (left > 0) {
      y--;
      if (y < this.firstYear) throw this.pastEnd(dn, n, 'first', this.firstYear, name);
      const s = years.stretchOf(y);
      if (s) {
        const t = years.table(s[0]);
        const room = Math.floor((y - Math.max(s[0], this.firstYear) + 1) / CYCLE_YEARS);
        const q = t.total > 0 ? Math.min(room, Math.floor((left - 1) / t.total)) : 0;
        if (q > 0) {
          left -= q * t.total;
          y -= q * CYCLE_YEARS - 1;
          empty = 0;
          continue;
        }
      }
      const c = years.of(y, budget);
      if (left <= c) {
        this.ensure(y, y);
        return this.select(this.rank(dayNumberFromYmdUnchecked(y + 1, 1, 1)) - left);
      }
      left -= c;
      empty = c === 0 ? empty + 1 : 0;
      if (empty >= MAX_EMPTY_YEARS) throw this.noBusinessDay(dn, 'before');
    }
    return this.shiftNear(dn, n, name);
  }

  private pastEnd(dn: number, n: number, which: 'first' | 'last', year: number, name: string): KalendsRangeError {
    if (name !== 'n') {
      return new KalendsRangeError(
        `${name}: the business day ${n > 0 ? 'after' : 'before'} ${formatPlainDate(dn)} lies past the ${which} year (${year}) that calendar ${JSON.stringify(this.label)} supports; use a calendar whose years reach further`,
        { code: 'out-of-range', received: dn },
      );
    }
    return new KalendsRangeError(
      `n: shifting ${formatPlainDate(dn)} by ${n} business days passes the ${which} year (${year}) that calendar ${JSON.stringify(this.label)} supports; use a smaller shift, or a calendar whose years reach further`,
      { code: 'out-of-range', received: n },
    );
  }

  private noBusinessDay(dn: number, where: 'after' | 'before'): KalendsRangeError {
    return new KalendsRangeError(
      `calendar: ${JSON.stringify(this.label)} has no business day within ${MAX_EMPTY_YEARS} years ${where} ${formatPlainDate(dn)}; its holidays cover every day outside its weekend`,
      { code: 'no-business-day', received: dn },
    );
  }
}

/**
 * @internal The nth business day in [a, b) (n = 1 the first, n = -1 the last), or NaN when the range holds
 * fewer than |n| business days (or n = 0, or a >= b). Unchecked: a and b must be integer day numbers with
 * firstDay <= a and b <= endDay. O(1) per 32 days of the range walked, never day by day: it reads the range's
 * words from the end it counts from and picks the bit within one word.
 */
export function nthInRange(e: Engine, a: number, b: number, n: number): number {
  if (a >= b || n === 0) return Number.NaN;
  if (e.count === 0 || a < e.yearStarts[0]! || b > e.yearStarts[e.count]!) {
    const ya = yearOfDayNumberUnchecked(a);
    const yb = yearOfDayNumberUnchecked(b - 1);
    if (yb - ya + 1 > MAX_WINDOW_YEARS) return nthInLongRange(e, a, b, n);
    e.ensure(ya, yb);
  }
  const words = e.words;
  const ys = e.yearStarts;
  if (n > 0) {
    let yi = e.yearIndex(a);
    let doy = a - ys[yi]!;
    let w = yi * WORDS + (doy >> 5);
    let x = words[w]! & (0xffffffff << (doy & 31));
    let wordStart = a - (doy & 31);
    let left = n;
    for (;;) {
      const c = popcount32(x);
      if (c >= left) {
        for (let r = left - 1; r > 0; r--) x &= x - 1;
        const d = wordStart + (31 - Math.clz32(x & -x));
        return d < b ? d : Number.NaN;
      }
      left -= c;
      w++;
      wordStart += 32;
      // Past a year's last word: the next year's first word (the unused bits of a year's last word are zero).
      if (w % WORDS === 0) wordStart = ys[++yi]!;
      if (wordStart >= b) return Number.NaN;
      x = words[w]!;
    }
  }
  let yi = e.yearIndex(b - 1);
  let doy = b - 1 - ys[yi]!;
  let w = yi * WORDS + (doy >> 5);
  let x = words[w]! & (0xffffffff >>> (31 - (doy & 31)));
  let wordStart = b - 1 - (doy & 31);
  let left = -n;
  for (;;) {
    const c = popcount32(x);
    if (c >= left) {
      for (let r = c - left; r > 0; r--) x &= x - 1;
      const d = wordStart + (31 - Math.clz32(x & -x));
      return d >= a ? d : Number.NaN;
    }
    left -= c;
    if (wordStart <= a) return Number.NaN;
    // Before a year's first word: the previous year's last word.
    wordStart = w % WORDS === 0 ? ys[--yi]! + (WORDS - 1) * 32 : wordStart - 32;
    w--;
    x = words[w]!;
  }
}

/** {@link nthInRange} for ranges longer than the window: counts, then shifts. */
function nthInLongRange(e: Engine, a: number, b: number, n: number): number {
  const available = e.countBetween(a, b);
  if (Math.abs(n) > available) return Number.NaN;
  if (n > 0) {
    const first = e.shift(a, 0);
    return n === 1 ? first : e.shift(first, n - 1);
  }
  const last = e.isBusinessDay(b - 1) ? b - 1 : e.shift(b - 1, -1);
  return n === -1 ? last : e.shift(last, n + 1);
}

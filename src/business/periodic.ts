/**
 * @internal When a calendar's business days repeat every 400 years, and in which years.
 *
 * The proleptic Gregorian calendar repeats every 400 years: 146,097 days, exactly 20,871 weeks, so every date
 * keeps its weekday and every year its length. A holiday rule on a month and day, on an nth weekday, or on a
 * weekday near a date (and any rule relative to one of these) therefore gives the same dates, shifted by
 * 146,097 days, 400 years later. Easter does not repeat within the supported range, but a Gregorian Easter rule
 * always falls on the same weekday (Easter Sunday plus its offset), inside a window of about five weeks (22 March
 * to 25 April, plus the offset). When no other holiday of the calendar can come near that window, when no Easter
 * holiday is a substitute day, and when the window stays inside its year, each Easter rule takes away the same
 * number of business days every year, so the count of business days of a year still repeats every 400 years.
 *
 * What breaks the pattern is local: the first and last year of a rule (`from`, `until`) and the years of one-off
 * additions and removals. A year is "generic" when no such break lies within a few years of it
 * (a year's holidays depend on the rules of up to two years on each side, through observance and substitute
 * days, and on members' neighbouring years). Two generic years 400 years apart with no break between them have
 * the same number of business days. `test/business/periodic.test.ts` checks this against year-by-year counts.
 *
 * @module
 */
import { EASTER_MIN_YEAR } from '../civil/easter.js';
import { yearOfDayNumberUnchecked } from '../civil/gregorian.js';
import { MAX_EVALUATED_YEARS, MAX_SUBSTITUTE_SEARCH, MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { KalendsRangeError } from '../errors.js';
import { formatPlainDate } from '../instant/index.js';
import { KIND_EASTER, KIND_FIXED, KIND_NTH, KIND_ON_OR_AFTER, KIND_ON_OR_BEFORE, KIND_RELATIVE, SHIFT_NONE, SHIFT_SUBSTITUTE } from './codes.js';
import type { NormRule } from './holiday-rules.js';
import type { CalendarNode } from './validate.js';

/** What {@link periodicityOf} finds. */
export interface Periodicity {
  /** True when generic years repeat every 400 years. */
  readonly periodic: boolean;
  /** Sorted years at which a rule starts or stops applying, or a one-off falls; always holds the range ends. */
  readonly breaks: Int32Array;
  /**
   * A year is generic when no break lies in (year - margin, year + margin]: its holidays depend on the rules of
   * up to two years on each side (observance and substitute days) and one more per level of `union` members.
   */
  readonly margin: number;
}

/** Day of the year (0 = 1 January, non-leap reckoning) of a month and day. */
function dayOfYear(month: number, day: number): number {
  const starts = [0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334];
  return starts[month - 1]! + day - 1;
}

const MONTH_LENGTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/**
 * The days of the year (an interval, possibly reaching into the neighbouring years) where a rule's observed date
 * can fall, before any observance slack; or undefined for Easter-based rules.
 */
function baseWindow(rules: readonly NormRule[], r: NormRule, depth = 0): [number, number] | undefined {
  switch (r.kind) {
    case KIND_FIXED:
      return [dayOfYear(r.month, r.day), dayOfYear(r.month, r.day)];
    case KIND_NTH:
      return [dayOfYear(r.month, 1), dayOfYear(r.month, MONTH_LENGTH[r.month - 1]!)];
    case KIND_ON_OR_AFTER:
      return [dayOfYear(r.month, r.day), dayOfYear(r.month, r.day) + 6];
    case KIND_ON_OR_BEFORE:
      return [dayOfYear(r.month, r.day) - 6, dayOfYear(r.month, r.day)];
    case KIND_RELATIVE: {
      if (r.ref < 0 || depth > rules.length) return undefined;
      const w = baseWindow(rules, rules[r.ref]!, depth + 1);
      return w ? [w[0] + r.offset, w[1] + r.offset] : undefined;
    }
    default:
      return undefined;
  }
}

/** The Easter rule at the base of a chain of relative rules, or undefined. */
function easterBase(rules: readonly NormRule[], r: NormRule): NormRule | undefined {
  let cur = r;
  for (let guard = 0; cur.kind === KIND_RELATIVE && cur.ref >= 0 && guard <= rules.length; guard++) cur = rules[cur.ref]!;
  return cur.kind === KIND_EASTER ? cur : undefined;
}

/** Total offset from Easter Sunday along a chain ending in an Easter rule. */
function easterOffset(rules: readonly NormRule[], r: NormRule): number {
  let total = 0;
  let cur = r;
  for (let guard = 0; guard <= rules.length; guard++) {
    total += cur.offset;
    if (cur.kind !== KIND_RELATIVE) break;
    cur = rules[cur.ref]!;
  }
  return total;
}

function hasShift(r: NormRule, code?: number): boolean {
  for (let wd = 1; wd <= 7; wd++) if (code === undefined ? r.shifts[wd] !== SHIFT_NONE : r.shifts[wd] === code) return true;
  return false;
}

/** True when [a, b] and [c, d] (days, on a year of 365 or 366 days) can meet, counting years before and after. */
function mayMeet(a: number, b: number, c: number, d: number): boolean {
  for (const length of [365, 366]) {
    for (let k = -2; k <= 2; k++) if (a <= d + k * length && c + k * length <= b) return true;
  }
  return false;
}

/** Decides whether the calendar's generic years repeat every 400 years, and lists the breaks. */
function periodicityOf(root: CalendarNode): Periodicity {
  const breaks = new Set<number>();
  const easter: [number, number][] = [];
  const others: [number, number][] = [];
  let periodic = true;
  let depth = 0;
  const visit = (node: CalendarNode, level: number): void => {
    if (level > depth) depth = level;
    for (const m of node.members) visit(m, level + 1);
    for (const x of [...node.additions, ...node.removals]) breaks.add(yearOfDayNumberUnchecked(x.dayNumber));
    for (const r of node.rules) {
      breaks.add(r.from);
      breaks.add(r.until + 1);
      const slack = hasShift(r) ? 8 : 1; // a shift moves at most 6 days off a weekend; 1 day for leap years
      const base = easterBase(node.rules, r);
      if (base) {
        if (base.julian || hasShift(r, SHIFT_SUBSTITUTE)) periodic = false;
        breaks.add(EASTER_MIN_YEAR);
        const off = easterOffset(node.rules, r);
        // Gregorian Easter Sunday falls from 22 March (day 80) to 25 April (day 114).
        const w: [number, number] = [80 + off - slack, 114 + off + slack];
        if (w[0] < 0 || w[1] > 364) periodic = false; // could fall in either year
        easter.push(w);
        continue;
      }
      const w = baseWindow(node.rules, r);
      if (!w) {
        periodic = false;
        continue;
      }
      others.push([w[0] - slack, w[1] + slack + (hasShift(r, SHIFT_SUBSTITUTE) ? MAX_SUBSTITUTE_SEARCH : 0)]);
    }
  };
  // Rule evaluation stops at the ends of the supported years.
  breaks.add(MIN_YEAR);
  breaks.add(MAX_YEAR + 1);
  visit(root, 0);
  if (periodic) {
    for (const [a, b] of easter) for (const [c, d] of others) if (mayMeet(a, b, c, d)) periodic = false;
  }
  return { periodic, breaks: Int32Array.from([...breaks].sort((x, y) => x - y)), margin: 3 + depth };
}

/** Years in one Gregorian cycle. */
export const CYCLE_YEARS = 400;

/** Business days in one 400-year cycle of generic years, from its first year. */
export interface CycleTable {
  /** counts[i]: business days of year first + i. */
  readonly counts: Int32Array;
  /** Business days of the whole cycle. */
  readonly total: number;
}

/** Counts the years evaluated one by one in a call, so that a calendar that does not repeat stays bounded. */
export interface YearBudget {
  evaluated: number;
  /** The range (or the day and amount) of the call, for the message. */
  readonly from: number;
  readonly to: number;
}

/**
 * The business days of whole years: one year compiled on its own, or, in a stretch of generic years of a
 * calendar that repeats, a lookup in a table of one 400-year cycle.
 */
export class YearCounts {
  private periodicity: Periodicity | undefined;
  /** Cycle tables by the first year of their stretch of generic years. */
  private readonly tables = new Map<number, CycleTable>();

  constructor(
    private readonly node: CalendarNode,
    private readonly label: string,
    /** Business days of one year, compiled (or read from a compiled window). */
    private readonly compiledCount: (year: number) => number,
  ) {}

  /**
   * The stretch [first, last] of generic years holding `y` when the calendar repeats every 400 years and the
   * stretch holds at least two cycles; otherwise undefined.
   */
  stretchOf(y: number): readonly [number, number] | undefined {
    const p = (this.periodicity ??= periodicityOf(this.node));
    if (!p.periodic) return undefined;
    const b = p.breaks;
    const r = p.margin;
    // The last break at or before y + r, and the first one after it (the range ends are always breaks).
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (b[mid]! <= y + r) lo = mid + 1;
      else hi = mid;
    }
    const prev = b[lo - 1]!;
    const next = b[lo]!;
    if (prev > y - r) return undefined;
    const first = prev + r;
    const last = next - r - 1;
    return last - first + 1 >= 2 * CYCLE_YEARS ? [first, last] : undefined;
  }

  /** Business days of each year of the cycle that starts at `first` (the first year of a stretch). */
  table(first: number): CycleTable {
    let t = this.tables.get(first);
    if (!t) {
      const counts = new Int32Array(CYCLE_YEARS);
      let total = 0;
      for (let i = 0; i < CYCLE_YEARS; i++) {
        const c = this.compiledCount(first + i);
        counts[i] = c;
        total += c;
      }
      t = { counts, total };
      if (this.tables.size >= 16) this.tables.clear();
      this.tables.set(first, t);
    }
    return t;
  }

  /** Business days of year y; a year evaluated on its own counts against the call's budget. */
  of(y: number, budget: YearBudget): number {
    const s = this.stretchOf(y);
    if (s) return this.table(s[0]).counts[(y - s[0]) % CYCLE_YEARS]!;
    if (++budget.evaluated > MAX_EVALUATED_YEARS) throw this.tooManyYears(budget);
    return this.compiledCount(y);
  }

  /** Business days in the whole years [y0, y1] (none when y1 < y0), by whole cycles where the years repeat. */
  sum(y0: number, y1: number, budget: YearBudget): number {
    let sum = 0;
    let y = y0;
    while (y <= y1) {
      const s = this.stretchOf(y);
      if (!s) {
        sum += this.of(y, budget);
        y++;
        continue;
      }
      const t = this.table(s[0]);
      const last = Math.min(y1, s[1]);
      const n = last - y + 1;
      const q = Math.floor(n / CYCLE_YEARS);
      sum += q * t.total;
      let i = (y - s[0]) % CYCLE_YEARS;
      for (let k = q * CYCLE_YEARS; k < n; k++) {
        sum += t.counts[i]!;
        i = i === CYCLE_YEARS - 1 ? 0 : i + 1;
      }
      y = last + 1;
    }
    return sum;
  }

  private tooManyYears(budget: YearBudget): KalendsRangeError {
    const { from, to } = budget;
    return new KalendsRangeError(
      `calendar ${JSON.stringify(this.label)}: its holidays do not repeat every 400 years (a Julian Easter rule, an Easter substitute day, or an Easter holiday near other holidays), so its years are evaluated one by one, and this call (from ${formatPlainDate(from)}${to !== from ? ` to ${formatPlainDate(to)}` : ''}) needs more than the ${MAX_EVALUATED_YEARS} years one call may evaluate; use a shorter range or a smaller amount`,
      { code: 'limit-exceeded', received: to },
    );
  }
}

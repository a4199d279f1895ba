/**
 * @internal The compiled tables of a definition of hours. The definition is compiled a year at a time, lazily,
 * into sorted typed arrays of session starts and ends (epoch ms) with prefix sums of elapsed business ms, and
 * per-day arrays of cut-off instants and next business days. One table covers a contiguous range of years (at
 * most HOURS_TABLE_MAX_YEARS); it grows as queries need more years and is rebuilt around a call's years when
 * they lie too far from it. Every query is then a binary search: logarithmic in the sessions the table holds,
 * flat in the length of the span asked about.
 *
 * Sessions whose instants touch or overlap (an overnight shift running into the next morning's session, or two
 * sessions a DST gap pushed together) are merged: the hours are open while any of them is, and the union counts
 * once. A session whose end resolves to an instant not after its start (both ends in one DST gap) is dropped. A
 * day the zone skipped entirely has no sessions.
 *
 * @module
 */
import { HOURS_TABLE_MAX_YEARS, MS_PER_DAY } from '../bounds.js';
import { dayNumberFromYmdUnchecked, weekdayOfDayNumberUnchecked } from '../civil/gregorian.js';
import { KalendsRangeError } from '../errors.js';
import { dayStartEpochMs, holidaysBetween, instantOfWall, isCalendarBusinessDay, isSkippedDay, shiftCalendarBusinessDays } from './deps.js';
import { type NormHours, type NormInterval, type NormSpecial, applySpecial } from './validate.js';

/** No business day within the table (per-day `nextBusiness`). */
export const NO_DAY = -2147483648;

/** The raw sessions and day data of one year, before merging. */
interface YearData {
  readonly starts: number[];
  readonly ends: number[];
  readonly days: number[];
  /** 1 where the day has at least one session, by day of the year. */
  readonly open: Uint8Array;
  /** Cut-off instants by cut-off index, by day of the year (NaN where the day has no session). */
  readonly cutoffs: readonly Float64Array[];
}

/** A compiled table over the years [firstYear, lastYear]. */
export interface Table {
  readonly firstYear: number;
  readonly lastYear: number;
  /** Day number of 1 January of firstYear, and the number of days the table holds. */
  readonly firstDay: number;
  readonly dayCount: number;
  /** Merged sessions: starts and ends ascending, `cum[i]` the business ms of sessions before i (length n + 1). */
  readonly n: number;
  readonly starts: Float64Array;
  readonly ends: Float64Array;
  readonly cum: Float64Array;
  /** The business day of each merged session's first interval. */
  readonly days: Int32Array;
  /** Instants within which the table's answers are complete (its edge years are margins). */
  readonly validFrom: number;
  readonly validTo: number;
  readonly open: Uint8Array;
  readonly cutoffs: readonly Float64Array[];
  /** The first business day strictly after each day, or NO_DAY when there is none in the table. */
  readonly nextBusiness: Int32Array;
}

const EMPTY: readonly NormInterval[] = /* @__PURE__ */ Object.freeze([]);

/** The engine of one compiled definition: its normalized form and its current table. */
export class HoursEngine {
  /** First instant of the first day of the hours' years, and of the day after their last day. */
  readonly startEpochMs: number;
  readonly endEpochMs: number;
  private table: Table | undefined;
  private readonly years = new Map<number, YearData>();

  constructor(readonly norm: NormHours) {
    this.startEpochMs = dayStartEpochMs(norm.zone, dayNumberFromYmdUnchecked(norm.firstYear, 1, 1));
    this.endEpochMs = dayStartEpochMs(norm.zone, dayNumberFromYmdUnchecked(norm.lastYear + 1, 1, 1));
  }

  /** The current table, if any (for tests of the cache). */
  get current(): Table | undefined {
    return this.table;
  }

  /**
   * A table covering at least the years [lo, hi] (clipped to the hours' years). Grows the current table when the
   * union stays within the cap (by at least half its size, so that a walk through the years rebuilds it
   * O(log) times), else builds one for [lo, hi] alone; `what` names the call for the limit error.
   */
  tableFor(lo: number, hi: number, what: string): Table {
    const n = this.norm;
    lo = Math.max(lo, n.firstYear);
    hi = Math.min(hi, n.lastYear);
    const t = this.table;
    if (t && t.firstYear <= lo && t.lastYear >= hi) return t;
    if (hi - lo + 1 > HOURS_TABLE_MAX_YEARS) {
      throw new KalendsRangeError(
        `${what}: the instants span the years ${lo}..${hi}, more than the ${HOURS_TABLE_MAX_YEARS} years one call may cover; split the call into ranges of fewer years`,
        { code: 'limit-exceeded', received: hi - lo + 1 },
      );
    }
    let a = lo;
    let b = hi;
    if (t && Math.max(t.lastYear, hi) - Math.min(t.firstYear, lo) + 1 <= HOURS_TABLE_MAX_YEARS) {
      a = Math.min(t.firstYear, lo);
      b = Math.max(t.lastYear, hi);
      const grow = Math.max(1, (t.lastYear - t.firstYear + 1) >> 1);
      let room = HOURS_TABLE_MAX_YEARS - (b - a + 1);
      const down = lo < t.firstYear ? Math.min(grow, room) : 0;
      room -= down;
      const up = hi > t.lastYear ? Math.min(grow, room) : 0;
      a = Math.max(n.firstYear, a - down);
      b = Math.min(n.lastYear, b + up);
    }
    for (const y of [...this.years.keys()]) if (y < a || y > b) this.years.delete(y);
    const table = this.build(a, b);
    this.table = table;
    return table;
  }

  private yearData(y: number): YearData {
    let d = this.years.get(y);
    if (!d) {
      d = compileYear(this.norm, y);
      this.years.set(y, d);
    }
    return d;
  }

  private build(a: number, b: number): Table {
    const n = this.norm;
    const parts: YearData[] = [];
    for (let y = a; y <= b; y++) parts.push(this.yearData(y));
    let total = 0;
    for (const p of parts) total += p.starts.length;
    // Raw sessions in day order; DST gaps can put a later wall time at an earlier instant, so sort when needed.
    const rs = new Float64Array(total);
    const re = new Float64Array(total);
    const rd = new Int32Array(total);
    let k = 0;
    let sorted = true;
    for (const p of parts) {
      for (let i = 0; i < p.starts.length; i++, k++) {
        rs[k] = p.starts[i]!;
        re[k] = p.ends[i]!;
        rd[k] = p.days[i]!;
        if (k > 0 && rs[k]! < rs[k - 1]!) sorted = false;
      }
    }
    let order: Int32Array | undefined;
    if (!sorted) {
      const idx = Array.from({ length: total }, (_, i) => i);
      idx.sort((x, y) => rs[x]! - rs[y]! || rd[x]! - rd[y]!);
      order = Int32Array.from(idx);
    }
    const starts = new Float64Array(total);
    const ends = new Float64Array(total);
    const days = new Int32Array(total);
    let m = 0;
    for (let j = 0; j < total; j++) {
      const i = order ? order[j]! : j;
      const s = rs[i]!;
      const e = re[i]!;
      if (m > 0 && s <= ends[m - 1]!) {
        if (e > ends[m - 1]!) ends[m - 1] = e;
        continue;
      }
      starts[m] = s;
      ends[m] = e;
      days[m] = rd[i]!;
      m++;
    }
    const cum = new Float64Array(m + 1);
    for (let i = 0; i < m; i++) cum[i + 1] = cum[i]! + (ends[i]! - starts[i]!);

    const firstDay = dayNumberFromYmdUnchecked(a, 1, 1);
    const endDay = dayNumberFromYmdUnchecked(b + 1, 1, 1);
    const dayCount = endDay - firstDay;
    const open = new Uint8Array(dayCount);
    const cutoffs = n.cutoffNames.map(() => new Float64Array(dayCount));
    let at = 0;
    for (const p of parts) {
      open.set(p.open, at);
      p.cutoffs.forEach((c, i) => cutoffs[i]!.set(c, at));
      at += p.open.length;
    }
    const nextBusiness = new Int32Array(dayCount);
    let next = NO_DAY;
    for (let i = dayCount - 1; i >= 0; i--) {
      nextBusiness[i] = next;
      if (open[i]) next = firstDay + i;
    }
    // Sessions of a day start no earlier than a day before it and end no later than two days after it (an
    // overnight session, a gap of up to a day): three days inside each inner edge, the table is complete.
    const validFrom = a === n.firstYear ? -Infinity : dayStartEpochMs(n.zone, firstDay + 3);
    const validTo = b === n.lastYear ? Infinity : dayStartEpochMs(n.zone, endDay - 3);
    return Object.freeze({
      firstYear: a,
      lastYear: b,
      firstDay,
      dayCount,
      n: m,
      starts: starts.subarray(0, m),
      ends: ends.subarray(0, m),
      cum,
      days: days.subarray(0, m),
      validFrom,
      validTo,
      open,
      cutoffs,
      nextBusiness,
    });
  }
}

/** The special day of each day of year `y` that holiday rules give (the first rule in the list wins). */
function holidaySpecials(n: NormHours, y: number, firstDay: number, endDay: number): Map<number, NormSpecial> {
  const out = new Map<number, NormSpecial>();
  const cal = n.calendar;
  if (!cal || n.byHoliday.length === 0) return out;
  const calStart = dayNumberFromYmdUnchecked(cal.firstYear, 1, 1);
  const calEnd = dayNumberFromYmdUnchecked(cal.lastYear + 1, 1, 1);
  const list = holidaysBetween(cal, Math.max(calStart, firstDay - 40), Math.min(calEnd, endDay + 40));
  for (const s of n.byHoliday) {
    for (const h of list) {
      if (h.name !== s.holiday && h.ruleId !== s.holiday) continue;
      const target = s.offset === 0 ? h.dayNumber : shiftCalendarBusinessDays(cal, h.dayNumber, s.offset);
      if (target >= firstDay && target < endDay && !out.has(target)) out.set(target, s);
    }
  }
  return out;
}

/** The sessions, business days and cut-off instants of the days of year `y`. */
function compileYear(n: NormHours, y: number): YearData {
  const firstDay = dayNumberFromYmdUnchecked(y, 1, 1);
  const endDay = dayNumberFromYmdUnchecked(y + 1, 1, 1);
  const count = endDay - firstDay;
  const starts: number[] = [];
  const ends: number[] = [];
  const days: number[] = [];
  const open = new Uint8Array(count);
  const cutoffs = n.cutoffNames.map(() => new Float64Array(count).fill(Number.NaN));
  const byHoliday = holidaySpecials(n, y, firstDay, endDay);
  const cal = n.calendar;
  for (let d = firstDay; d < endDay; d++) {
    const regular = !cal || isCalendarBusinessDay(cal, d) ? n.week[weekdayOfDayNumberUnchecked(d) - 1]! : EMPTY;
    const special = n.byDate.get(d) ?? byHoliday.get(d);
    const list = special ? applySpecial(regular, special) : regular;
    if (list.length === 0 || isSkippedDay(n.zone, d)) continue;
    const wall = d * MS_PER_DAY;
    let any = false;
    for (const i of list) {
      const s = instantOfWall(n.zone, wall + i.open, n.disambiguation, `${i.path}.open`);
      const e = instantOfWall(n.zone, wall + i.close, n.disambiguation, `${i.path}.close`);
      if (e <= s) continue;
      starts.push(s);
      ends.push(e);
      days.push(d);
      any = true;
    }
    if (!any) continue;
    open[d - firstDay] = 1;
    for (let c = 0; c < cutoffs.length; c++) {
      const own = special ? special.cutoffs[c]! : Number.NaN;
      const t = Number.isNaN(own) ? n.cutoffs[c]! : own;
      const path = Number.isNaN(own) ? `cutoffs.${n.cutoffNames[c]}` : `${special!.path}.cutoffs.${n.cutoffNames[c]}`;
      cutoffs[c]![d - firstDay] = instantOfWall(n.zone, wall + t, n.disambiguation, path);
    }
  }
  return { starts, ends, days, open, cutoffs };
}

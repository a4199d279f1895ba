/**
 * @internal Evaluation of holiday rules: the actual date each rule gives in a year, observance shifts and
 * substitute days, one-off removals and additions. The result for a year is the list of holidays observed in it.
 *
 * @module
 */
import { MAX_SUBSTITUTE_SEARCH, MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { EASTER_MIN_YEAR, JULIAN_EASTER_MIN_YEAR, easterDayNumberOfYear, julianEasterDayNumberOfYear } from '../civil/easter.js';
import {
  dayNumberFromYmdUnchecked,
  dayCountOfMonthUnchecked,
  isLeapYearUnchecked,
  weekdayOfDayNumberUnchecked,
} from '../civil/gregorian.js';
import { KalendsRangeError } from '../errors.js';
import { formatPlainDate } from '../instant/index.js';
import {
  KIND_EASTER,
  KIND_FIXED,
  KIND_NTH,
  KIND_ON_OR_AFTER,
  KIND_ON_OR_BEFORE,
  KIND_RELATIVE,
  SHIFT_NEAREST,
  SHIFT_NEXT,
  SHIFT_NONE,
  SHIFT_PREVIOUS,
  SHIFT_SUBSTITUTE,
} from './codes.js';
import type { NormRule } from './holiday-rules.js';
import type { CalendarNode } from './validate.js';


/** @internal One holiday as evaluated: where it is observed, where the rule put it, its name. */
export interface HolidayInstance {
  readonly observed: number;
  readonly actual: number;
  readonly name: string;
  readonly ruleId: string | undefined;
  readonly oneOff: boolean;
}

/** @internal The date (day number) a rule gives in `year` before observance, or NaN when it gives none. */
export function actualDate(r: NormRule, year: number, dates: Float64Array): number {
  if (year < r.from || year > r.until) return NaN;
  switch (r.kind) {
    case KIND_FIXED:
      if (r.month === 2 && r.day === 29 && !isLeapYearUnchecked(year)) return NaN;
      return dayNumberFromYmdUnchecked(year, r.month, r.day);
    case KIND_NTH: {
      const dim = dayCountOfMonthUnchecked(year, r.month);
      if (r.nth > 0) {
        const first = dayNumberFromYmdUnchecked(year, r.month, 1);
        const d = 1 + ((r.weekday - weekdayOfDayNumberUnchecked(first) + 7) % 7) + 7 * (r.nth - 1);
        return d > dim ? NaN : first + d - 1;
      }
      const last = dayNumberFromYmdUnchecked(year, r.month, dim);
      return last - ((weekdayOfDayNumberUnchecked(last) - r.weekday + 7) % 7);
    }
    case KIND_ON_OR_AFTER:
    case KIND_ON_OR_BEFORE: {
      if (r.month === 2 && r.day === 29 && !isLeapYearUnchecked(year)) return NaN;
      const base = dayNumberFromYmdUnchecked(year, r.month, r.day);
      const wd = weekdayOfDayNumberUnchecked(base);
      return r.kind === KIND_ON_OR_AFTER ? base + ((r.weekday - wd + 7) % 7) : base - ((wd - r.weekday + 7) % 7);
    }
    case KIND_EASTER:
      if (r.julian ? year < JULIAN_EASTER_MIN_YEAR : year < EASTER_MIN_YEAR) return NaN;
      return (r.julian ? julianEasterDayNumberOfYear(year) : easterDayNumberOfYear(year)) + r.offset;
    case KIND_RELATIVE:
      return dates[r.ref]! + r.offset;
    default:
      return NaN;
  }
}

function isWeekend(mask: number, dn: number): boolean {
  return (mask & (1 << weekdayOfDayNumberUnchecked(dn))) !== 0;
}

/** Holidays of the node's members and own rules observed in `year`, before the node's removals and additions. */
function ruleHolidays(node: CalendarNode, year: number, out: HolidayInstance[]): void {
  const yearStart = dayNumberFromYmdUnchecked(year, 1, 1);
  const yearEnd = yearStart + (isLeapYearUnchecked(year) ? 366 : 365);
  const memberStart = out.length;
  for (const m of node.members) out.push(...holidaysOfYear(m, year));
  if (node.rules.length === 0) return;
  let needsNeighbours = false;
  let substitutes = false;
  for (const r of node.rules) {
    for (let wd = 1; wd <= 7; wd++) {
      if (r.shifts[wd] !== SHIFT_NONE) needsNeighbours = true;
      if (r.shifts[wd] === SHIFT_SUBSTITUTE) substitutes = true;
    }
  }
  // The actual dates of the own rules in the neighbouring years too: an observance shift or a rule's offset can
  // carry a holiday across New Year (1 January on a Saturday observed on the Friday before). With substitute days,
  // two years each side, so that the days taken by earlier substitutes are the same whichever year is compiled.
  const reach = substitutes ? 2 : 1;
  const cands: { actual: number; rule: number; seq: number }[] = [];
  const dates = new Float64Array(node.rules.length);
  for (let y = year - reach; y <= year + reach; y++) {
    if (y < MIN_YEAR || y > MAX_YEAR) continue;
    dates.fill(NaN);
    for (const i of node.order) {
      const d = actualDate(node.rules[i]!, y, dates);
      dates[i] = d;
      if (!Number.isNaN(d)) cands.push({ actual: d, rule: i, seq: cands.length });
    }
  }
  cands.sort((a, b) => a.actual - b.actual || a.seq - b.seq);
  const mask = node.weekendMask;
  let occupied: Set<number> | undefined;
  const occupy = (): Set<number> => {
    if (occupied) return occupied;
    occupied = new Set<number>();
    for (const c of cands) {
      if (node.rules[c.rule]!.shifts[weekdayOfDayNumberUnchecked(c.actual)] === SHIFT_NONE) occupied.add(c.actual);
    }
    for (let k = memberStart; k < out.length; k++) occupied.add(out[k]!.observed);
    if (needsNeighbours) {
      for (const m of node.members) {
        for (const h of holidaysOfYear(m, year - 1)) occupied.add(h.observed);
        for (const h of holidaysOfYear(m, year + 1)) occupied.add(h.observed);
      }
    }
    return occupied;
  };
  for (const c of cands) {
    const r = node.rules[c.rule]!;
    const code = r.shifts[weekdayOfDayNumberUnchecked(c.actual)]!;
    let observed = c.actual;
    if (code !== SHIFT_NONE) {
      if (code === SHIFT_PREVIOUS) {
        do observed--;
        while (isWeekend(mask, observed));
      } else if (code === SHIFT_NEXT) {
        do observed++;
        while (isWeekend(mask, observed));
      } else if (code === SHIFT_NEAREST) {
        let before = c.actual;
        do before--;
        while (isWeekend(mask, before));
        let after = c.actual;
        do after++;
        while (isWeekend(mask, after));
        observed = c.actual - before < after - c.actual ? before : after;
      } else {
        const occ = occupy();
        do {
          observed++;
          if (observed - c.actual > MAX_SUBSTITUTE_SEARCH) {
            throw new KalendsRangeError(
              `${r.path}: no substitute day for ${JSON.stringify(r.name)} of ${formatPlainDate(c.actual)} within ${MAX_SUBSTITUTE_SEARCH} days; every later day is a weekend day or a holiday`,
              { code: 'no-business-day', received: c.actual, path: r.path },
            );
          }
        } while (isWeekend(mask, observed) || occ.has(observed));
      }
      occupied?.add(observed);
    }
    if (observed >= yearStart && observed < yearEnd) {
      out.push({ observed, actual: c.actual, name: r.name, ruleId: r.id, oneOff: false });
    }
  }
}

/**
 * @internal The holidays observed in `year` (sorted by observed date, then by rule order), after removals and
 * with additions. With `applyRemovals` false, removals are ignored (used to check that each removal removes
 * something).
 */
export function holidaysOfYear(node: CalendarNode, year: number, applyRemovals = true): HolidayInstance[] {
  let list: HolidayInstance[] = [];
  ruleHolidays(node, year, list);
  const yearStart = dayNumberFromYmdUnchecked(year, 1, 1);
  const yearEnd = yearStart + (isLeapYearUnchecked(year) ? 366 : 365);
  if (applyRemovals && node.removals.length) {
    const removed = new Set<number>();
    for (const r of node.removals) if (r.dayNumber >= yearStart && r.dayNumber < yearEnd) removed.add(r.dayNumber);
    if (removed.size) list = list.filter((h) => !removed.has(h.observed));
  }
  for (const a of node.additions) {
    if (a.dayNumber >= yearStart && a.dayNumber < yearEnd) {
      list.push({ observed: a.dayNumber, actual: a.dayNumber, name: a.name, ruleId: undefined, oneOff: true });
    }
  }
  // Stable sort keeps members first, then rules in date order, then additions, on equal dates (usually the list
  // is in order already, and sorting it would only allocate).
  let sorted = true;
  for (let i = 1; i < list.length && sorted; i++) if (list[i]!.observed < list[i - 1]!.observed) sorted = false;
  if (sorted) return list;
  return list.map((h, i) => ({ h, i })).sort((a, b) => a.h.observed - b.h.observed || a.i - b.i).map((x) => x.h);
}

/**
 * @internal An upper bound on the holidays observed in the years [ya, yb], by counting alone: each rule gives at
 * most one holiday per year it applies in (a holiday observed across New Year comes from the neighbouring year,
 * hence one year of margin each side), plus the one-off additions. Nothing is evaluated.
 */
export function mostHolidaysOfYears(node: CalendarNode, ya: number, yb: number): number {
  let most = 0;
  for (const m of node.members) most += mostHolidaysOfYears(m, ya, yb);
  for (const r of node.rules) {
    const a = Math.max(ya - 1, r.from);
    const b = Math.min(yb + 1, r.until);
    if (b >= a) most += b - a + 1;
  }
  return most + node.additions.length;
}

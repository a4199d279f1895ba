/**
 * @internal The compiler of trusted calendar definitions: the bundled ones. It builds the node the evaluator reads
 * straight from the data, without the validator (./validate.ts and ./holiday-rules.ts, most of the business
 * layer's code), so that a program that takes a bundled calendar by name (`isBusinessDay('us-federal', d)`) does
 * not bundle it. It trusts its input: a definition that the validator accepts, flat (no `extends`, `union` or
 * `omitRules`), with dates written `YYYY-MM-DD`. test/business/trusted.test.ts checks, for every bundled
 * definition, that it gives the very node the validator gives; user definitions always go through
 * `defineCalendar` and its validator.
 *
 * @module
 */
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { EASTER_MIN_YEAR, JULIAN_EASTER_MIN_YEAR } from '../civil/easter.js';
import { dayNumberFromYmdUnchecked } from '../civil/gregorian.js';
import { weekdayFromName } from '../civil/names.js';
import { KIND_CODES, KIND_EASTER, KIND_RELATIVE, SHIFT_CODES } from './codes.js';
import type { CalendarDefinition, DatedEntry, Observance, ObservanceShift } from './definition.js';
import type { NormRule } from './holiday-rules.js';
import type { CalendarNode } from './validate.js';

/** Shift codes by ISO weekday (index 1..7) of an observance object. */
function shiftsOf(observance: Observance | undefined): Int8Array {
  const shifts = new Int8Array(8);
  if (observance) for (const [day, shift] of Object.entries(observance)) shifts[weekdayFromName(day)] = SHIFT_CODES[shift as ObservanceShift];
  return shifts;
}

/** One-off entries with their day numbers (`YYYY-MM-DD` read by position). */
function datedEntries(entries: readonly DatedEntry[] | undefined, key: string): { dayNumber: number; name: string; path: string }[] {
  return (entries ?? []).map(({ date, name }, i) => ({
    dayNumber: dayNumberFromYmdUnchecked(+date.slice(0, 4), +date.slice(5, 7), +date.slice(8, 10)),
    name,
    path: `${key}[${i}]`,
  }));
}

/** @internal The node of a trusted, flat definition (see the module comment). */
export function nodeOfTrustedDefinition(def: CalendarDefinition): CalendarNode {
  const defaultShifts = shiftsOf(def.observance);
  const rules: NormRule[] = (def.holidays ?? []).map((h, i) => {
    const r = h as Partial<Record<string, unknown>> & typeof h;
    const nth = r['nth'];
    return {
      path: `holidays[${i}]`,
      id: h.id,
      name: h.name,
      kind: KIND_CODES[h.kind]!,
      month: (r['month'] as number | undefined) ?? 0,
      day: (r['day'] as number | undefined) ?? 0,
      weekday: weekdayFromName(r['weekday']),
      nth: nth === 'last' ? -1 : ((nth as number | undefined) ?? 0),
      offset: (r['offset'] as number | undefined) ?? 0,
      julian: r['computus'] === 'julian',
      ref: -1,
      refId: r['to'] as string | undefined,
      from: h.from ?? MIN_YEAR,
      until: h.until ?? MAX_YEAR,
      shifts: h.observance === undefined ? defaultShifts : shiftsOf(h.observance),
    };
  });
  // Relative rules: the index of the rule referred to, and an order where each follows it.
  const order: number[] = [];
  const visit = (i: number): void => {
    const r = rules[i]!;
    if (order.includes(i)) return;
    if (r.kind === KIND_RELATIVE) visit((r.ref = rules.findIndex((x) => x.id === r.refId)));
    order.push(i);
  };
  rules.forEach((_, i) => visit(i));
  // The first year: the definition's, or the first year of the Easter computus its Easter rules need.
  let firstYear = def.years?.from;
  if (firstYear === undefined) {
    firstYear = MIN_YEAR;
    for (const r of rules) {
      let base = r;
      while (base.kind === KIND_RELATIVE) base = rules[base.ref]!;
      const min = base.julian ? JULIAN_EASTER_MIN_YEAR : EASTER_MIN_YEAR;
      if (base.kind === KIND_EASTER && r.from < min && min > firstYear) firstYear = min;
    }
  }
  let weekendMask = def.weekend ? 0 : (1 << 6) | (1 << 7);
  for (const day of def.weekend ?? []) weekendMask |= 1 << weekdayFromName(day);
  return {
    members: [],
    weekendMask,
    ownWeekendMask: weekendMask,
    rules,
    order,
    additions: datedEntries(def.additions, 'additions'),
    removals: datedEntries(def.removals, 'removals'),
    firstYear,
    lastYear: def.years?.until ?? MAX_YEAR,
  };
}

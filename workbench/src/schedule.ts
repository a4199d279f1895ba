/**
 * A named rule of the profile over one fiscal year: each date the rule gives (unadjusted), the date its
 * business-day convention makes of it (adjusted), and why it moved; and the marks those dates put on the picture.
 */
import { type BusinessCalendar, type BusinessDayConvention, type Profile, type RuleDefinition, adjustDayNumber, defineRule, formatPlainDate, listOccurrenceDayNumbers, ruleOfProfile } from 'kalends';
import { whyItMoved } from './why.js';
import type { ScheduleMark } from './year.js';

export interface Occurrence {
  readonly unadjusted: number;
  readonly adjusted: number;
  /** Why it moved, in words; empty when it did not. */
  readonly why: string;
}

export interface RuleSchedule {
  readonly name: string;
  /** The rule's label, or its name. */
  readonly title: string;
  readonly convention: BusinessDayConvention;
  /** The profile's name of the rule's calendar, when it has one. */
  readonly calendarName: string | undefined;
  readonly occurrences: readonly Occurrence[];
}

/** Whether the rule gives dates (rules of instants have no business-day adjustment and are not drawn). */
export function isRuleOfDates(profile: Profile, name: string): boolean {
  return ruleOfProfile(profile, name).values === 'dates';
}

/** The occurrences of rule `name` whose unadjusted date lies in [first, end), adjusted, each with why it moved. */
export function scheduleOfRule(profile: Profile, name: string, first: number, end: number): RuleSchedule {
  const rule = ruleOfProfile(profile, name);
  if (rule.values !== 'dates') throw new Error(`rule ${JSON.stringify(name)} gives instants, not dates: it has no business-day adjustment to draw`);
  const def = rule.definition as RuleDefinition & { calendar?: unknown; convention?: BusinessDayConvention; label?: string };
  const calendar = typeof def.calendar === 'object' && def.calendar !== null ? (def.calendar as BusinessCalendar) : undefined;
  const convention: BusinessDayConvention = def.convention ?? 'none';
  const calendarName = Object.entries(profile.calendars).find(([, c]) => c === calendar)?.[0];
  const plain = !calendar || convention === 'none' ? rule : defineRule({ ...def, convention: 'none' } as RuleDefinition);
  const occurrences = listOccurrenceDayNumbers(plain, first, end).map((u) => {
    const adjusted = calendar && convention !== 'none' ? adjustDayNumber(calendar, u, convention) : u;
    return { unadjusted: u, adjusted, why: calendar ? whyItMoved(calendar, u, adjusted, convention) : '' };
  });
  return { name, title: def.label ?? name, convention, calendarName, occurrences };
}

/** The marks a schedule puts on the days of the picture. */
export function marksOfSchedule(schedule: RuleSchedule): Map<number, ScheduleMark[]> {
  const marks = new Map<number, ScheduleMark[]>();
  const add = (d: number, mark: ScheduleMark) => {
    const list = marks.get(d);
    if (list) list.push(mark);
    else marks.set(d, [mark]);
  };
  for (const o of schedule.occurrences) {
    if (o.adjusted === o.unadjusted) add(o.adjusted, { kind: 'adjusted', text: `${schedule.title} falls here` });
    else {
      add(o.unadjusted, { kind: 'unadjusted', text: `${schedule.title}: the rule's date, moved to ${formatPlainDate(o.adjusted)}` });
      add(o.adjusted, { kind: 'adjusted', text: `${schedule.title}: moved here from ${formatPlainDate(o.unadjusted)}` });
    }
  }
  return marks;
}

/**
 * The schedule table: one row per occurrence of each named date rule of a profile, with its unadjusted and
 * adjusted dates and why it moved.
 *
 * @module
 */
import { readOptions } from '../diagnostics/index.js';
import {
  type Profile,
  type RuleDefinition,
  WEEKDAY_NAMES,
  adjustDayNumber,
  calendarOfProfile,
  defineRule,
  isBusinessDay,
  listHolidays,
  listOccurrenceDayNumbers,
  requireProfile,
  weekdayOfDayNumber,
  dayNumberFromYmd,
} from './deps.js';
import { type ExportRangeOptions, exportRange, requireCalendarYears } from './dimension.js';
import type { WarehouseTable } from './table.js';

/**
 * One row per occurrence of each date rule of the profile whose unadjusted date lies in `[start, end)`:
 * `rule_name`, `rule_label`, `calendar_name`, `unadjusted_date`, `adjusted_date` (after the rule's business-day
 * convention), `moved`, `moved_because` (`holiday` or `weekend`, null when not moved) and `moved_because_detail`
 * (the holiday's name, or the weekday). Rules of instants (intraday, and RFC 5545 rules with a time) are left out:
 * they have no business-day adjustment.
 *
 * @example
 * ```ts
 * const t = scheduleTableFromProfile(profile, { start: '2026-01-01', end: '2027-01-01' });
 * t.columns.find((c) => c.name === 'rule_name')!.values[0]; // 'supplier-payments'
 * ```
 */
export function scheduleTableFromProfile(profile: Profile, options?: Omit<ExportRangeOptions, 'calendar'>): WarehouseTable {
  const p = requireProfile(profile);
  const o = readOptions('options', options, ['start', 'end']);
  const { start, end } = exportRange(p, o);
  const ruleName: string[] = [];
  const ruleLabel: (string | null)[] = [];
  const calendarName: (string | null)[] = [];
  const unadjusted: number[] = [];
  const adjusted: number[] = [];
  const moved: number[] = [];
  const because: (string | null)[] = [];
  const detail: (string | null)[] = [];
  const calendarNames = new Map(Object.entries(p.calendars).map(([name, cal]) => [cal, name]));
  for (const [name, rule] of Object.entries(p.rules)) {
    if (rule.values !== 'dates') continue;
    const def = rule.definition as RuleDefinition & { calendar?: unknown; convention?: string; label?: string };
    const cal = typeof def.calendar === 'object' && def.calendar !== null ? (def.calendar as ReturnType<typeof calendarOfProfile>) : undefined;
    const convention = def.convention ?? 'none';
    const calName = cal ? (calendarNames.get(cal) ?? null) : null;
    if (cal && calName) requireCalendarYears(calName, cal, start, end);
    const plain = convention === 'none' ? rule : defineRule({ ...def, convention: 'none' } as RuleDefinition);
    const dates = listOccurrenceDayNumbers(plain, start, end);
    const holidays = new Map<number, string>();
    if (cal && convention !== 'none' && dates.length > 0) {
      for (const h of listHolidays(cal, Math.max(dates[0]!, dayNumberFromYmd(cal.firstYear, 1, 1)), dates[dates.length - 1]! + 1)) {
        holidays.set(h.dayNumber, holidays.has(h.dayNumber) ? `${holidays.get(h.dayNumber)}; ${h.name}` : h.name);
      }
    }
    for (const d of dates) {
      const a = cal && convention !== 'none' ? adjustDayNumber(cal, d, convention as never) : d;
      ruleName.push(name);
      ruleLabel.push(def.label ?? null);
      calendarName.push(calName);
      unadjusted.push(d);
      adjusted.push(a);
      moved.push(a !== d ? 1 : 0);
      if (a === d) {
        because.push(null);
        detail.push(null);
      } else if (holidays.has(d)) {
        because.push('holiday');
        detail.push(holidays.get(d)!);
      } else {
        because.push(isBusinessDay(cal!, d) ? null : 'weekend');
        detail.push(WEEKDAY_NAMES[weekdayOfDayNumber(d) - 1]!);
      }
    }
  }
  return Object.freeze({
    name: 'schedule_occurrence',
    rowCount: ruleName.length,
    description: 'one row per occurrence of a named rule: its unadjusted and adjusted dates, and why it moved',
    columns: Object.freeze([
      { name: 'rule_name', type: 'string' as const, values: ruleName, description: "the rule's name in the profile" },
      { name: 'rule_label', type: 'string' as const, values: ruleLabel, description: "the rule's label" },
      { name: 'calendar_name', type: 'string' as const, values: calendarName, description: 'the business calendar that adjusts it' },
      { name: 'unadjusted_date', type: 'date' as const, values: Int32Array.from(unadjusted), description: 'the date the rule gives' },
      { name: 'adjusted_date', type: 'date' as const, values: Int32Array.from(adjusted), description: "the date after the rule's business-day convention" },
      { name: 'moved', type: 'boolean' as const, values: Uint8Array.from(moved), description: 'whether the convention moved it' },
      { name: 'moved_because', type: 'string' as const, values: because, description: '"holiday" or "weekend"' },
      { name: 'moved_because_detail', type: 'string' as const, values: detail, description: "the holiday's name, or the weekday" },
    ]),
  });
}

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
  adjustDayNumber,
  adjustmentOfOccurrence,
  calendarOfProfile,
  defineRule,
  listOccurrenceDayNumbers,
  reasonOfMove,
  requireProfile,
} from './deps.js';
import { type ExportRangeOptions, exportRange, requireCalendarYears } from './dimension.js';
import type { WarehouseTable } from './table.js';

/**
 * One row per occurrence of each date rule of the profile whose unadjusted date lies in `[start, end)`:
 * `rule_name`, `rule_label`, `calendar_name`, `unadjusted_date`, `adjusted_date` (after the rule's business-day
 * convention), `moved`, `moved_because` (`holiday` when a holiday was among the closed days it passed over, else `weekend`;
 * null when not moved) and `moved_because_detail` (every closed day passed over, in order, with its cause:
 * `weekend: sunday; holiday: Washington's Birthday (2026-02-16)`, as `adjustmentOfOccurrence` says it). Rules of instants (intraday, and RFC 5545 rules with a time) are left out:
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
    for (const d of dates) {
      const a = cal && convention !== 'none' ? adjustDayNumber(cal, d, convention as never) : d;
      ruleName.push(name);
      ruleLabel.push(def.label ?? null);
      calendarName.push(calName);
      unadjusted.push(d);
      adjusted.push(a);
      moved.push(a !== d ? 1 : 0);
      const move = a === d ? undefined : adjustmentOfOccurrence(rule, a).moves.find((m) => m.unadjustedDayNumber === d);
      if (move === undefined) {
        because.push(null);
        detail.push(null);
      } else {
        // Every closed day the convention passed over, in order: "weekend: sunday; holiday: Washington's Birthday (2026-02-16)".
        because.push(move.closedDays.some((c) => c.holidays.length > 0) ? 'holiday' : 'weekend');
        detail.push(reasonOfMove(move, convention));
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
      { name: 'moved_because', type: 'string' as const, values: because, description: '"holiday" when a holiday was among the closed days it passed over, else "weekend"' },
      { name: 'moved_because_detail', type: 'string' as const, values: detail, description: 'every closed day it passed over, in order, with its cause (the weekday, or the holiday by name)' },
    ]),
  });
}

/**
 * Grids from recurrence rules: the occurrences of a rule as instants.
 *
 * @module
 */
import { KalendsTypeError, describeValue } from '../errors.js';
import { firstEpochMsOfDayNumber } from '../zone/index.js';
import { type Rule, occurrenceDayNumberBulk, occurrenceEpochMsBulk } from '../recurrence/index.js';
import { type ZoneInput, resolveZone } from './deps.js';

/**
 * The occurrences of a recurrence rule in `[start, end)`. A rule of dates gives the first instant of each
 * local date in `zone`; a rule of instants gives its instants (and `zone` is not used). Occurrences come from
 * the recurrence layer's `occurrenceDayNumberBulk` or `occurrenceEpochMsBulk`, as the rule's values are.
 */
export interface RecurrenceGrid {
  readonly rule: Rule;
  readonly zone: ZoneInput;
  /** Start of the range (inclusive): a day number or epoch ms (as the rule's values are), or an ISO string. */
  readonly start: number | string;
  /** End of the range (exclusive), in the same form. */
  readonly end: number | string;
}

/** @internal */
export function gridFromRule(grid: RecurrenceGrid): Float64Array {
  const rule = grid.rule;
  if (rule === null || typeof rule !== 'object') {
    throw new KalendsTypeError(`options.grid.rule: expected a rule from defineRule, got ${describeValue(rule)}`, {
      code: 'invalid-type',
      received: rule,
    });
  }
  if (rule.values === 'instants') return occurrenceEpochMsBulk(rule, grid.start, grid.end);
  const occurrences = occurrenceDayNumberBulk(rule, grid.start, grid.end);
  // A rule of dates: the first instant of each local date.
  const zone = resolveZone(grid.zone, 'options.grid.zone');
  const out = new Float64Array(occurrences.length);
  for (let i = 0; i < out.length; i++) out[i] = firstEpochMsOfDayNumber(zone, occurrences[i]!);
  return out;
}

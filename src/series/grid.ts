/**
 * Grids from recurrence rules: the occurrences of a rule as instants.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type Rule, type ZoneInput, firstEpochMsOfDayNumber, occurrenceDayNumberBulk, occurrenceEpochMsBulk, resolveZone } from './deps.js';
import { type OptionRecord, optionOf, rowsLimitError } from './options.js';

/**
 * The occurrences of a recurrence rule in `[start, end)`. A rule of dates gives the first instant of each
 * local date in `zone`; a rule of instants gives its instants (and `zone` is not used). Occurrences come from
 * the recurrence layer's `occurrenceDayNumberBulk` or `occurrenceEpochMsBulk`, as the rule's values are.
 */
export interface RecurrenceGrid {
  /** The recurrence rule whose occurrences make the grid. */
  readonly rule: Rule;
  /** The zone of the local dates (for a rule of dates). */
  readonly zone: ZoneInput;
  /** Start of the range (inclusive): a day number or epoch ms (as the rule's values are), or an ISO string. */
  readonly start: number | string;
  /** End of the range (exclusive), in the same form. */
  readonly end: number | string;
}

/** @internal The instants of a `{ rule, zone, start, end }` grid (its fields as read), at most `maxRows`. */
export function gridFromRule(grid: OptionRecord, maxRows: number): Float64Array {
  const rule = optionOf(grid, 'rule') as Rule;
  if (rule === null || typeof rule !== 'object') {
    throw new KalendsTypeError(`options.grid.rule: expected a rule from defineRule, got ${describeValue(rule)}`, {
      code: 'invalid-type',
      received: rule,
    });
  }
  let occurrences: Int32Array | Float64Array;
  try {
    occurrences =
      rule.values === 'instants'
        ? occurrenceEpochMsBulk(rule, optionOf(grid, 'start'), optionOf(grid, 'end'), { maxCount: maxRows })
        : occurrenceDayNumberBulk(rule, optionOf(grid, 'start'), optionOf(grid, 'end'), { maxCount: maxRows });
  } catch (e) {
    if (e instanceof KalendsRangeError && e.code === 'limit-exceeded') {
      const range = `from ${describeValue(optionOf(grid, 'start'))} to ${describeValue(optionOf(grid, 'end'))}`;
      throw rowsLimitError('options.grid', `the rule's occurrences ${range} are more rows`, maxRows, 'options.maxRows');
    }
    throw e;
  }
  if (occurrences instanceof Float64Array) return occurrences;
  // A rule of dates: the first instant of each local date.
  const zone = resolveZone(optionOf(grid, 'zone') as ZoneInput, 'options.grid.zone');
  const out = new Float64Array(occurrences.length);
  for (let i = 0; i < out.length; i++) out[i] = firstEpochMsOfDayNumber(zone, occurrences[i]!);
  return out;
}

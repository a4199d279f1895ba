/**
 * @internal The one reader for period ranges given as ordinals or labels (`{ start: 'FY2026-Q1', end: 24305 }`).
 * The caller supplies its unit's label parser and ordinal bounds, so this module needs no period layer.
 *
 * @module
 */
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { readOptions } from './arguments.js';

/** A period range end as given: an ordinal or a label. */
export type PeriodRangeEnd = number | string;

/** What a reader needs of a unit. */
export interface RangeUnitLike {
  readonly id: string;
  readonly minOrdinal: number;
  readonly maxOrdinal: number;
  parseOrdinal(text: string): number;
  formatOrdinal(ordinal: number): string;
}

function readEnd(name: string, value: unknown, unit: RangeUnitLike): number {
  if (typeof value === 'string') {
    try {
      return unit.parseOrdinal(value);
    } catch (e) {
      // The label parser names its own parameter (`text`); here the label is this range end.
      if (!(e instanceof KalendsSyntaxError)) throw e;
      throw new KalendsSyntaxError(`${name}: ${e.message.replace(/^text: /, '')}`, { code: e.code, received: value, position: e.position });
    }
  }
  if (typeof value !== 'number') {
    throw new KalendsTypeError(`${name}: expected a label of unit ${unit.id} or an ordinal, got ${describeValue(value)}`, {
      code: 'invalid-type',
      received: value,
    });
  }
  if (!Number.isInteger(value) || value < unit.minOrdinal || value > unit.maxOrdinal) {
    throw new KalendsRangeError(`${name}: expected an ordinal of unit ${unit.id} from ${unit.minOrdinal} to ${unit.maxOrdinal}, got ${describeValue(value)}`, {
      code: 'out-of-range',
      received: value,
    });
  }
  return value;
}

/**
 * Reads `{ start, end }` (ordinals or labels; `end` inclusive or exclusive as `endInclusive` says) into
 * `[first, last]` ordinals, last inclusive, refusing a range whose end comes before its start.
 */
export function readPeriodRange(name: string, value: unknown, unit: RangeUnitLike, endInclusive: boolean): { readonly first: number; readonly last: number } {
  const r = readOptions(name, value, ['start', 'end']);
  if (value === undefined) throw new KalendsTypeError(`${name}: expected { start, end }, got undefined`, { code: 'invalid-type', received: value });
  const first = readEnd(`${name}.start`, r['start'], unit);
  const endOrdinal = readEnd(`${name}.end`, r['end'], unit);
  const last = endInclusive ? endOrdinal : endOrdinal - 1;
  if (last < first) {
    throw new KalendsRangeError(
      `${name}.end: expected a period ${endInclusive ? 'at or after' : 'after'} the start (${unit.formatOrdinal(first)}), got ${describeValue(r['end'])}`,
      { code: 'out-of-range', received: r['end'] },
    );
  }
  return { first, last };
}

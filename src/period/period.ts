/**
 * Period values: a unit and an integer ordinal. Arithmetic on periods is integer arithmetic on ordinals; days
 * come from the unit, instants only when a zone is given (see instants.ts).
 *
 * @module
 */
import { MAX_DAY_NUMBER, MAX_LIST_LENGTH, MAX_YEAR, MIN_DAY_NUMBER, MIN_YEAR } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { requireDayNumberArgument, requireWhole } from '../diagnostics/index.js';
import { type PeriodUnit, type UnitCore, type UnitInput, coreOf, toUnit } from './units.js';

/** A period: a compiled unit and the period's ordinal in it. Immutable. */
export interface Period {
  /** The unit the period belongs to. */
  readonly unit: PeriodUnit;
  /** The period's ordinal in its unit. */
  readonly ordinal: number;
}

/** @internal Validates a period and returns its core. */
export function requirePeriod(p: unknown, name = 'period'): UnitCore {
  const core = typeof p === 'object' && p !== null ? coreOf((p as { unit?: unknown }).unit) : undefined;
  if (!core) {
    throw new KalendsTypeError(`${name}: expected a period {unit, ordinal} whose unit was made by defineUnit, got ${describeValue(p)}`, {
      code: 'invalid-type',
      received: p,
    });
  }
  const { unit, ordinal } = p as Period;
  requireInteger(`${name}.ordinal`, ordinal, unit.minOrdinal, unit.maxOrdinal);
  return core;
}

function make(unit: PeriodUnit, ordinal: number): Period {
  return Object.freeze({ unit, ordinal });
}

/**
 * @internal A period with a range-checked ordinal; `name` is the parameter that led there and `what` the
 * operation, for the message (`years: shiftPeriodYears(+275760, 1) gives ordinal 275761, ...`).
 */
export function periodChecked(unit: PeriodUnit, ordinal: number, name: string, what: string): Period {
  if (!(ordinal >= unit.minOrdinal && ordinal <= unit.maxOrdinal)) {
    const core = coreOf(unit)!;
    throw new KalendsRangeError(
      `${name}: ${what} gives ordinal ${ordinal}, outside the supported range of unit ${unit.id}; expected a result from ${core.format(unit.minOrdinal)} to ${core.format(unit.maxOrdinal)} (ordinals ${unit.minOrdinal}..${unit.maxOrdinal})`,
      { code: 'out-of-range', received: ordinal },
    );
  }
  return make(unit, ordinal);
}

/**
 * The period of `unit` with the given ordinal.
 *
 * @example
 * ```ts
 * formatPeriod(periodFromOrdinal('month', 2025 * 12 + 2)); // '2025-03'
 * ```
 */
export function periodFromOrdinal(unit: UnitInput, ordinal: number): Period {
  const u = toUnit(unit);
  return make(u, requireInteger('ordinal', ordinal, u.minOrdinal, u.maxOrdinal));
}

/**
 * The period of `unit` that holds the local date `dayNumber`.
 *
 * @example
 * ```ts
 * formatPeriod(periodFromDayNumber('iso-week', dayNumberFromYmd(2025, 2, 14))); // '2025-W07'
 * ```
 */
export function periodFromDayNumber(unit: UnitInput, dayNumber: number): Period {
  const u = toUnit(unit);
  return make(u, u.ordinalFromDayNumber(dayNumber));
}

/**
 * The period `n` periods after `p` (before, for negative `n`). Throws a KalendsRangeError past the supported range.
 *
 * @example
 * ```ts
 * formatPeriod(shiftPeriod(parsePeriod('quarter', '2025-Q4'), 1)); // '2026-Q1'
 * ```
 */
export function shiftPeriod(p: Period, n: number): Period {
  requirePeriod(p, 'p');
  requireWhole('n', n, -Number.MAX_SAFE_INTEGER, Number.MAX_SAFE_INTEGER);
  return periodChecked(p.unit, p.ordinal + n, 'n', `shiftPeriod(${formatPeriod(p)}, ${n})`);
}

function requireSameUnit(a: Period, b: Period): void {
  requirePeriod(a, 'a');
  requirePeriod(b, 'b');
  if (a.unit.id !== b.unit.id) {
    throw new KalendsTypeError(`b: expected a period of unit ${a.unit.id} (the unit of a), got a period of unit ${b.unit.id}`, {
      code: 'invalid-type',
      received: b,
    });
  }
}

/**
 * How many periods from `a` to `b`: `b.ordinal - a.ordinal` (negative when `b` is earlier). Both must have the
 * same unit.
 *
 * @example
 * ```ts
 * countPeriods(parsePeriod('month', '2025-01'), parsePeriod('month', '2026-03')); // 14
 * ```
 */
export function countPeriods(a: Period, b: Period): number {
  requireSameUnit(a, b);
  return b.ordinal - a.ordinal;
}

/**
 * Orders two periods of the same unit: -1 when `a` is earlier, 0 when equal, 1 when later. Usable as a sort
 * comparator.
 *
 * @example
 * ```ts
 * comparePeriods(parsePeriod('year', '2024'), parsePeriod('year', '2025')); // -1
 * ```
 */
export function comparePeriods(a: Period, b: Period): -1 | 0 | 1 {
  requireSameUnit(a, b);
  return a.ordinal < b.ordinal ? -1 : a.ordinal > b.ordinal ? 1 : 0;
}

/**
 * The first day of `p`.
 *
 * @example
 * ```ts
 * firstDayNumberOfPeriod(parsePeriod('month', '1970-02')); // 31
 * ```
 */
export function firstDayNumberOfPeriod(p: Period): number {
  return requirePeriod(p, 'p').firstDayOf(p.ordinal);
}

/**
 * The end of `p` as a day number, exclusive: the first day of the next period.
 *
 * @example
 * ```ts
 * firstDayNumberAfterPeriod(parsePeriod('month', '1970-01')); // 31
 * ```
 */
export function firstDayNumberAfterPeriod(p: Period): number {
  return requirePeriod(p, 'p').firstDayOf(p.ordinal + 1);
}

/**
 * The last day of `p` (inclusive): `firstDayNumberAfterPeriod(p) - 1`.
 *
 * @example
 * ```ts
 * lastDayNumberOfPeriod(parsePeriod('month', '1970-01')); // 30 (1970-01-31)
 * ```
 */
export function lastDayNumberOfPeriod(p: Period): number {
  return requirePeriod(p, 'p').firstDayOf(p.ordinal + 1) - 1;
}

/**
 * Number of days in `p`.
 *
 * @example
 * ```ts
 * lengthDaysOfPeriod(parsePeriod('month', '2024-02')); // 29
 * ```
 */
export function lengthDaysOfPeriod(p: Period): number {
  const core = requirePeriod(p, 'p');
  return core.firstDayOf(p.ordinal + 1) - core.firstDayOf(p.ordinal);
}

/**
 * Whether the local date `dayNumber` lies in `p`.
 *
 * @example
 * ```ts
 * isDayNumberInPeriod(parsePeriod('month', '1970-02'), 31); // true
 * ```
 */
export function isDayNumberInPeriod(p: Period, dayNumber: number): boolean {
  const core = requirePeriod(p, 'p');
  return core.ordinalOf(requireDayNumberArgument('dayNumber', dayNumber)) === p.ordinal;
}

/**
 * The label of `p` (see docs/periods.md, "Labels"): `2025-03-14`, `2025-W07`, `2025-03`, `2025-Q1`, `FY2026-Q1`.
 *
 * @example
 * ```ts
 * formatPeriod(periodFromDayNumber('quarter', dayNumberFromYmd(2025, 5, 2))); // '2025-Q2'
 * ```
 */
export function formatPeriod(p: Period): string {
  return requirePeriod(p, 'p').format(p.ordinal);
}

/**
 * The period of `unit` named by `text`. Every fault is a KalendsSyntaxError that quotes the label, says the
 * expected form and gives the position: code `malformed` for a label that breaks the grammar or belongs to another
 * unit, `out-of-range` for a well-formed label of a period that does not exist (`2021-W53`, `2025-13`) or lies
 * outside the supported range.
 *
 * @example
 * ```ts
 * const fy = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
 * firstDayNumberOfPeriod(parsePeriod(fy, 'FY2026-Q1')) === dayNumberFromYmd(2025, 10, 1); // true
 * ```
 */
export function parsePeriod(unit: UnitInput, text: string): Period {
  const u = toUnit(unit);
  return make(u, u.parseOrdinal(text));
}

/** Most whole years a period may move: the width of the supported range. */
const MAX_SHIFT_YEARS = MAX_YEAR - MIN_YEAR;

/**
 * The comparable period `years` years later (earlier, for a negative number), for year-over-year comparison. Rules
 * (docs/periods.md, "Years apart"):
 * - months, quarters, halves, years and every fiscal unit except weeks: the period with the same index in the
 *   (fiscal) year `years` away;
 * - ISO weeks and fiscal weeks: the same week number in that (week-)year; week 53 maps to the last week (52) when
 *   that year has only 52 weeks;
 * - days: the same calendar date, 29 February mapping to 28 February in a common year;
 * - weeks starting on a given weekday: 52 weeks a year; cycles: the cycle holding the day 364 days a year away
 *   from the first day.
 *
 * @example
 * ```ts
 * formatPeriod(shiftPeriodYears(parsePeriod('iso-week', '2026-W53'), -1)); // '2025-W52'
 * formatPeriod(shiftPeriodYears(parsePeriod('day', '2024-02-29'), 3));     // '2027-02-28'
 * ```
 */
export function shiftPeriodYears(p: Period, years: number): Period {
  const core = requirePeriod(p, 'p');
  requireWhole('years', years, -MAX_SHIFT_YEARS, MAX_SHIFT_YEARS);
  return periodChecked(p.unit, core.shiftYears(p.ordinal, years), 'years', `shiftPeriodYears(${formatPeriod(p)}, ${years})`);
}

function subPeriodRange(p: Period, unit: UnitInput): { sub: PeriodUnit; first: number; last: number; start: number; end: number } {
  const core = requirePeriod(p, 'p');
  const sub = toUnit(unit, 'unit');
  const subCore = coreOf(sub)!;
  const start = core.firstDayOf(p.ordinal);
  const end = core.firstDayOf(p.ordinal + 1);
  const lo = Math.max(start, MIN_DAY_NUMBER);
  const hi = Math.min(end - 1, MAX_DAY_NUMBER);
  const first = subCore.ordinalOf(lo);
  const last = subCore.ordinalOf(hi);
  if (last - first + 1 > MAX_LIST_LENGTH) {
    throw new KalendsRangeError(
      `unit: ${formatPeriod(p)} holds ${last - first + 1} periods of ${sub.id}, more than the ${MAX_LIST_LENGTH} a list may return`,
      { code: 'limit-exceeded', received: sub.id },
    );
  }
  return { sub, first, last, start, end };
}

/**
 * The periods of `unit` that make up `p`, in order: the months of a fiscal quarter, the weeks of a retail period.
 * The sub-periods must tile `p` exactly; when their boundaries do not match `p`'s (the ISO weeks of a month),
 * this throws a KalendsRangeError naming the straddling period; use {@link listOverlappingPeriods} instead.
 *
 * @example
 * ```ts
 * const q = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
 * listSubPeriods(parsePeriod(q, 'FY2026-Q1'), 'month').map(formatPeriod); // ['2025-10', '2025-11', '2025-12']
 * ```
 */
export function listSubPeriods(p: Period, unit: UnitInput): Period[] {
  const { sub, first, last, start, end } = subPeriodRange(p, unit);
  const subCore = coreOf(sub)!;
  if (subCore.firstDayOf(first) !== start || subCore.firstDayOf(last + 1) !== end) {
    const straddler = subCore.firstDayOf(first) !== start ? first : last;
    throw new KalendsRangeError(
      `unit: periods of ${sub.id} do not tile ${formatPeriod(p)}: ${subCore.format(straddler)} crosses its boundary (use listOverlappingPeriods to include partial periods)`,
      { code: 'out-of-range', received: sub.id },
    );
  }
  const out: Period[] = [];
  for (let o = first; o <= last; o++) out.push(make(sub, o));
  return out;
}

/**
 * The periods of `unit` that share at least one day with `p`, in order, including those that cross its
 * boundaries (the ISO weeks that touch a month).
 *
 * @example
 * ```ts
 * listOverlappingPeriods(parsePeriod('month', '2025-03'), 'iso-week').map(formatPeriod);
 * // ['2025-W09', '2025-W10', '2025-W11', '2025-W12', '2025-W13', '2025-W14']
 * ```
 */
export function listOverlappingPeriods(p: Period, unit: UnitInput): Period[] {
  const { sub, first, last } = subPeriodRange(p, unit);
  const out: Period[] = [];
  for (let o = first; o <= last; o++) out.push(make(sub, o));
  return out;
}

/**
 * The period of `unit` that holds the first day of `p` (the fiscal year of a fiscal week, the quarter of a month).
 * Unit first, like {@link periodFromDayNumber}.
 *
 * @example
 * ```ts
 * formatPeriod(periodFromPeriod('quarter', parsePeriod('month', '2025-05'))); // '2025-Q2'
 * ```
 */
export function periodFromPeriod(unit: UnitInput, p: Period): Period {
  const u = toUnit(unit, 'unit');
  const core = requirePeriod(p, 'p');
  const first = Math.max(core.firstDayOf(p.ordinal), MIN_DAY_NUMBER);
  return make(u, coreOf(u)!.ordinalOf(first));
}

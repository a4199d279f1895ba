/**
 * Compiling unit definitions into {@link PeriodUnit}s: for each kind, a core (cores.ts for the calendar units,
 * fiscal.ts for the fiscal ones) maps a day number to a period ordinal and back and reads and writes its labels;
 * this module wraps a core in the public unit, with every argument checked, and keeps the bounded unit cache.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER, UNIT_CACHE_LIMIT } from '../bounds.js';
import { KalendsSyntaxError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import { requireDayNumberArgument } from '../diagnostics/index.js';
import { type CalendarUnitName, type NormalizedUnit, type UnitDefinition, canonicalDefinition, normalizeUnitDefinition, unitId } from './definition.js';
import { type UnitCore, cycleCore, dayCore, isoWeekCore, monthsCore, weekCore } from './cores.js';
import { type FiscalKindName, monthFiscalCore, weekFiscalCore, weekYearCalendar } from './fiscal.js';

export type { BulkKernel, UnitCore } from './cores.js';

/** The kind names a unit can have. */
export type UnitKind = UnitDefinition['kind'];

/**
 * A compiled, immutable period unit. A period of the unit is an integer ordinal; the period with ordinal `o`
 * is the days `[firstDayNumberFromOrdinal(o), firstDayNumberFromOrdinal(o + 1))`. Make one with {@link defineUnit}.
 */
export interface PeriodUnit {
  /** A short canonical identifier: two units with the same id are the same unit. */
  readonly id: string;
  /** The definition, with defaults spelled out; `defineUnit(unit.definition)` gives the same unit. */
  readonly definition: UnitDefinition;
  /** The definition's kind. */
  readonly kind: UnitKind;
  /** Ordinal of the period holding the first supported day. */
  readonly minOrdinal: number;
  /** Ordinal of the period holding the last supported day. */
  readonly maxOrdinal: number;
  /** The ordinal of the period that holds `dayNumber`. */
  ordinalFromDayNumber(dayNumber: number): number;
  /**
   * The first day of period `ordinal`; `maxOrdinal + 1` is accepted too, whose first day is the exclusive end of the
   * last period (so that `[first(o), first(o + 1))` holds for every period).
   */
  firstDayNumberFromOrdinal(ordinal: number): number;
  /** The label of period `ordinal` (see docs/periods.md, "Labels"). */
  formatOrdinal(ordinal: number): string;
  /** The ordinal of a label of this unit. */
  parseOrdinal(text: string): number;
}

const cores = new WeakMap<PeriodUnit, UnitCore>();

/** @internal The core of a compiled unit, or undefined when `unit` was not made by defineUnit. */
export function coreOf(unit: unknown): UnitCore | undefined {
  return typeof unit === 'object' && unit !== null ? cores.get(unit as PeriodUnit) : undefined;
}


function coreFor(u: NormalizedUnit): UnitCore {
  switch (u.kind) {
    case 'day':
      return dayCore();
    case 'iso-week':
      return isoWeekCore();
    case 'month':
    case 'quarter':
    case 'half-year':
    case 'year':
      return monthsCore(u.kind);
    case 'week':
      return weekCore(u.firstWeekday);
    case 'cycle':
      return cycleCore(u.lengthDays, u.anchorDayNumber, u.anchor);
    default:
      if (u.basis === 'months') {
        return monthFiscalCore(u.kind as Exclude<FiscalKindName, 'fiscal-week'>, u.startMonth, u.startDay, u.naming);
      }
      return weekFiscalCore(u.kind, weekYearCalendar(u.endWeekday, u.endMonth, u.endRule, u.naming), u.layout, u.extraWeek);
  }
}

function compile(u: NormalizedUnit): PeriodUnit {
  const core = coreFor(u);
  const id = unitId(u);
  const definition = canonicalDefinition(u);
  const minOrdinal = core.ordinalOf(MIN_DAY_NUMBER);
  const maxOrdinal = core.ordinalOf(MAX_DAY_NUMBER);
  const requireOrdinal = (o: unknown): number => requireInteger('ordinal', o, minOrdinal, maxOrdinal);
  const requireDay = (d: unknown): number => requireDayNumberArgument('dayNumber', d);
  const unit: PeriodUnit = {
    id,
    definition,
    kind: u.kind,
    minOrdinal,
    maxOrdinal,
    ordinalFromDayNumber(dayNumber: number): number {
      return core.ordinalOf(requireDay(dayNumber));
    },
    firstDayNumberFromOrdinal(ordinal: number): number {
      // maxOrdinal + 1 too: its first day is the exclusive end of the last period.
      return core.firstDayOf(requireInteger('ordinal', ordinal, minOrdinal, maxOrdinal + 1));
    },
    formatOrdinal(ordinal: number): string {
      return core.format(requireOrdinal(ordinal));
    },
    parseOrdinal(text: string): number {
      if (typeof text !== 'string') {
        throw new KalendsTypeError(`text: expected a string such as ${core.labelForm.replace(/^.*e\.g\. /, '')}, got ${describeValue(text)}`, {
          code: 'invalid-type',
          received: text,
        });
      }
      const o = core.parse(text);
      if (o < minOrdinal || o > maxOrdinal) {
        throw new KalendsSyntaxError(
          `text: ${describeValue(text)} is outside the supported range of unit ${id}; expected a label from ${core.format(minOrdinal)} to ${core.format(maxOrdinal)}`,
          { code: 'out-of-range', received: text, position: 0 },
        );
      }
      return o;
    },
  };
  Object.freeze(unit);
  cores.set(unit, core);
  return unit;
}

const cache = new Map<string, PeriodUnit>();

/**
 * Validates a unit definition (plain data) and compiles it into an immutable {@link PeriodUnit}. A string names a
 * calendar unit: `'day'`, `'iso-week'`, `'month'`, `'quarter'`, `'half-year'` or `'year'`; any other name is a
 * KalendsRangeError with code `unknown-name` and the nearest names. Every fault of a definition is reported at
 * once in a DefinitionError whose `issues` carry dotted paths (`start.day`, `yearEnd.rule`).
 * Compiled units are cached by their id, so defining the same unit twice is cheap.
 *
 * @example
 * ```ts
 * const usFederal = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
 * usFederal.formatOrdinal(usFederal.ordinalFromDayNumber(dayNumberFromYmd(2025, 10, 1))); // 'FY2026-Q1'
 * defineUnit({ kind: 'fiscal-year', start: { month: 6, day: 31 }, naming: 'end-year' });
 * // DefinitionError: start.day: expected 1..30 for month 6, got 31
 * ```
 */
export function defineUnit(definition: UnitDefinition | CalendarUnitName): PeriodUnit {
  return defineNamed(definition, 'definition');
}

function defineNamed(definition: unknown, name: string): PeriodUnit {
  const u = normalizeUnitDefinition(definition, name);
  const id = unitId(u);
  const hit = cache.get(id);
  if (hit && JSON.stringify(hit.definition) === JSON.stringify(canonicalDefinition(u))) return hit;
  const unit = compile(u);
  if (cache.size >= UNIT_CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  cache.set(id, unit);
  return unit;
}

/** Anything that names a unit: a compiled unit, a definition, or a calendar unit's name. */
export type UnitInput = PeriodUnit | UnitDefinition | CalendarUnitName;

/**
 * The one coercion point for units: a compiled unit is returned as it is, a definition or a calendar unit name is
 * compiled (through the bounded unit cache). `name` is the parameter's name shown in error messages.
 *
 * @example
 * ```ts
 * toUnit('month') === MONTH_UNIT; // true
 * toUnit({ kind: 'fiscal-year', start: { month: 4, day: 6 }, naming: 'start-year' }).formatOrdinal(2025); // 'FY2025'
 * ```
 */
export function toUnit(input: UnitInput, name = 'unit'): PeriodUnit {
  if (typeof name !== 'string' || name === '') {
    throw new KalendsTypeError(`name: expected the parameter name to use in messages (a non-empty string), got ${describeValue(name)}`, { code: 'invalid-type', received: name });
  }
  if (coreOf(input)) return input as PeriodUnit;
  if (typeof input === 'object' && input !== null && 'unit' in input && 'ordinal' in input) {
    throw new KalendsTypeError(`${name}: expected a unit, got a period (${describeValue(input)}); pass its unit, p.unit`, { code: 'invalid-type', received: input });
  }
  if (typeof input === 'object' && input !== null && 'ordinalFromDayNumber' in input) {
    throw new KalendsTypeError(`${name}: expected a unit made by defineUnit (this object only looks like one), got ${describeValue(input)}`, {
      code: 'invalid-type',
      received: input,
    });
  }
  return defineNamed(input, name);
}

/** The calendar day as a unit: ordinal = day number, label YYYY-MM-DD. */
export const DAY_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('day');
/** The ISO 8601 week (Monday to Sunday, week-year by the Thursday), label YYYY-Www. */
export const ISO_WEEK_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('iso-week');
/** The calendar month, ordinal year * 12 + month - 1, label YYYY-MM. */
export const MONTH_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('month');
/** The calendar quarter (January, April, July, October), ordinal year * 4 + quarter - 1, label YYYY-Qn. */
export const QUARTER_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('quarter');
/** The calendar half-year, ordinal year * 2 + half - 1, label YYYY-Hn. */
export const HALF_YEAR_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('half-year');
/** The calendar year, ordinal = year, label YYYY. */
export const YEAR_UNIT: PeriodUnit = /* @__PURE__ */ defineUnit('year');

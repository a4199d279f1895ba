/**
 * Unit definitions as plain data, and their validation. A definition is a JSON-serializable object; validation
 * collects every fault with its dotted path and throws one {@link DefinitionError}.
 *
 * @module
 */
import { DefinitionError, type DefinitionIssue, describeValue } from '../errors.js';
import { dayCountOfMonthUnchecked } from '../civil/gregorian.js';
import { parseDayLabel } from './labels.js';

/** A weekday by its English name, lower case. */
import type { WeekdayName } from '../civil/names.js';
export type { WeekdayName };

/** The weekday names in ISO order: index + 1 is the ISO weekday number (1 = Monday). */
export const WEEKDAY_NAMES: readonly WeekdayName[] = Object.freeze([
  'monday',
  'tuesday',
  'wednesday',
  'thursday',
  'friday',
  'saturday',
  'sunday',
]);

/**
 * How a fiscal year is named: after the calendar year in which it ends (`'end-year'`, as the US federal fiscal
 * year, 31 U.S.C. 1102) or the one in which it starts (`'start-year'`, as the UK tax year "2007-08", Income Tax
 * Act 2007 s.4(4)). Required in every fiscal definition: there is no default.
 */
export type YearNaming = 'end-year' | 'start-year';

/** A day of the year without a year: month 1..12, day 1..(days in that month; 28 for February). */
export interface MonthDay {
  readonly month: number;
  readonly day: number;
}

/**
 * Where a 52/53-week year ends: on `weekday`, either the last one in `month` (`'last'`) or the one nearest the
 * last day of `month` (`'nearest'`, which may fall up to three days into the next month). These are the two
 * forms of 26 U.S.C. 441(f)(1) and 26 CFR 1.441-2(a)(1)(iii).
 */
export interface YearEndRule {
  readonly weekday: WeekdayName;
  readonly month: number;
  readonly rule: 'last' | 'nearest';
}

/**
 * Weeks per period in each quarter of a 52-week year: three periods of 4-4-5, 4-5-4 or 5-4-4 weeks per quarter
 * (12 periods), or `'13x4'`: thirteen periods of four weeks.
 */
export type WeekLayout = '4-4-5' | '4-5-4' | '5-4-4' | '13x4';

/**
 * Which period of a 53-week year takes the 53rd week: the last period (default; a 4-5-4 year's last quarter
 * becomes 4-5-5) or the first.
 */
export type ExtraWeekPlacement = 'last-period' | 'first-period';

/** Names of the calendar units that need no parameters; usable wherever a unit is expected. */
export type CalendarUnitName = 'day' | 'iso-week' | 'month' | 'quarter' | 'half-year' | 'year';

/** The kinds of fiscal unit. */
export type FiscalKind = 'fiscal-year' | 'fiscal-half' | 'fiscal-quarter' | 'fiscal-period' | 'fiscal-week';

/** A calendar unit: day, ISO week, month, quarter, half-year, year; a week starting on any weekday; a cycle. */
export type CalendarUnitDefinition =
  | { readonly kind: CalendarUnitName }
  | { readonly kind: 'week'; readonly firstWeekday: WeekdayName }
  | { readonly kind: 'cycle'; readonly lengthDays: number; readonly anchor: string };

/** A fiscal unit of a year that starts on a fixed month and day (periods are months starting on that day). */
export interface MonthFiscalDefinition {
  readonly kind: Exclude<FiscalKind, 'fiscal-week'>;
  readonly start: MonthDay;
  readonly naming: YearNaming;
}

/** A fiscal unit of a 52/53-week year. `layout` is required for halves, quarters and periods. */
export interface WeekFiscalDefinition {
  readonly kind: FiscalKind;
  readonly yearEnd: YearEndRule;
  readonly naming: YearNaming;
  readonly layout?: WeekLayout;
  readonly extraWeek?: ExtraWeekPlacement;
}

/** Any unit definition: plain JSON-serializable data. */
export type UnitDefinition = CalendarUnitDefinition | MonthFiscalDefinition | WeekFiscalDefinition;

/** @internal A validated definition in the compiler's terms. */
export type NormalizedUnit =
  | { readonly kind: CalendarUnitName }
  | { readonly kind: 'week'; readonly firstWeekday: number }
  | { readonly kind: 'cycle'; readonly lengthDays: number; readonly anchorDayNumber: number; readonly anchor: string }
  | {
      readonly kind: FiscalKind;
      readonly basis: 'months';
      readonly startMonth: number;
      readonly startDay: number;
      readonly naming: YearNaming;
    }
  | {
      readonly kind: FiscalKind;
      readonly basis: 'weeks';
      readonly endWeekday: number;
      readonly endMonth: number;
      readonly endRule: 'last' | 'nearest';
      readonly naming: YearNaming;
      readonly layout: WeekLayout | undefined;
      readonly extraWeek: ExtraWeekPlacement;
    };

const CALENDAR_NAMES: readonly string[] = ['day', 'iso-week', 'month', 'quarter', 'half-year', 'year'];
const FISCAL_KINDS: readonly string[] = ['fiscal-year', 'fiscal-half', 'fiscal-quarter', 'fiscal-period', 'fiscal-week'];
const ALL_KINDS: readonly string[] = [...CALENDAR_NAMES, 'week', 'cycle', ...FISCAL_KINDS];
const LAYOUTS: readonly string[] = ['4-4-5', '4-5-4', '5-4-4', '13x4'];
const PLACEMENTS: readonly string[] = ['last-period', 'first-period'];
const NAMINGS: readonly string[] = ['end-year', 'start-year'];
/** Longest cycle accepted, in days (a century). */
export const MAX_CYCLE_DAYS = 36_525;

function listOf(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(', ');
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function join(prefix: string, key: string): string {
  return prefix === '' ? key : `${prefix}.${key}`;
}

/**
 * Validates a unit definition found at `path` (empty for the top level) without throwing: returns every issue
 * (and, when there are none, the compiler's normalized form in `unit`). Definitions that embed a unit definition
 * (a company calendar, a business calendar) call this to report issues under their own paths.
 *
 * @example
 * ```ts
 * validateUnitDefinition({ kind: 'fiscal-year', start: { month: 6, day: 31 }, naming: 'end-year' }, 'fiscal').issues;
 * // [{ path: 'fiscal.start.day', message: 'expected 1..30 for month 6, got 31' }]
 * ```
 */
export function validateUnitDefinition(
  def: unknown,
  path = '',
): { issues: DefinitionIssue[]; unit: NormalizedUnit | undefined } {
  const issues: DefinitionIssue[] = [];
  const add = (p: string, message: string) => issues.push({ path: p === '' ? '(definition)' : p, message });
  if (typeof def === 'string') {
    if (CALENDAR_NAMES.includes(def)) return { issues, unit: { kind: def as CalendarUnitName } };
    add(path, `expected a unit definition object or one of ${listOf(CALENDAR_NAMES)}, got ${describeValue(def)}`);
    return { issues, unit: undefined };
  }
  if (!isRecord(def)) {
    add(path, `expected a unit definition object such as {"kind":"month"}, got ${describeValue(def)}`);
    return { issues, unit: undefined };
  }
  const kind = def['kind'];
  if (typeof kind !== 'string' || !ALL_KINDS.includes(kind)) {
    add(join(path, 'kind'), `expected one of ${listOf(ALL_KINDS)}, got ${describeValue(kind)}`);
    return { issues, unit: undefined };
  }
  const allowed = (keys: readonly string[]) => {
    for (const k of Object.keys(def)) {
      if (k !== 'kind' && !keys.includes(k)) {
        add(join(path, k), `unknown field for kind ${JSON.stringify(kind)}; valid fields are ${listOf(['kind', ...keys])}`);
      }
    }
  };
  if (CALENDAR_NAMES.includes(kind)) {
    allowed([]);
    return { issues, unit: issues.length ? undefined : { kind: kind as CalendarUnitName } };
  }
  if (kind === 'week') {
    allowed(['firstWeekday']);
    const wd = readWeekday(def['firstWeekday'], join(path, 'firstWeekday'), add);
    return { issues, unit: issues.length || wd === undefined ? undefined : { kind: 'week', firstWeekday: wd } };
  }
  if (kind === 'cycle') {
    allowed(['lengthDays', 'anchor']);
    const len = def['lengthDays'];
    let lengthDays: number | undefined;
    if (typeof len !== 'number' || !Number.isInteger(len) || len < 1 || len > MAX_CYCLE_DAYS) {
      add(join(path, 'lengthDays'), `expected an integer from 1 to ${MAX_CYCLE_DAYS}, got ${describeValue(len)}`);
    } else lengthDays = len;
    const anchor = def['anchor'];
    let anchorDayNumber: number | undefined;
    if (typeof anchor !== 'string') {
      add(join(path, 'anchor'), `expected the first day of any one cycle as an ISO 8601 date string such as "2025-01-03", got ${describeValue(anchor)}`);
    } else {
      try {
        anchorDayNumber = parseDayLabel(anchor, 'anchor');
      } catch (e) {
        add(join(path, 'anchor'), `expected an ISO 8601 calendar date such as "2025-01-03", got ${describeValue(anchor)}${e instanceof Error ? ` (${e.message.replace(/^anchor: /, '')})` : ''}`);
      }
    }
    if (issues.length || lengthDays === undefined || anchorDayNumber === undefined || typeof anchor !== 'string') {
      return { issues, unit: undefined };
    }
    return { issues, unit: { kind: 'cycle', lengthDays, anchorDayNumber, anchor } };
  }
  // Fiscal kinds.
  const fiscalKind = kind as FiscalKind;
  const naming = def['naming'];
  const namingOk = typeof naming === 'string' && NAMINGS.includes(naming);
  const hasStart = def['start'] !== undefined;
  const hasYearEnd = def['yearEnd'] !== undefined;
  if (hasStart === hasYearEnd) {
    add(
      path === '' ? 'start' : join(path, 'start'),
      hasStart
        ? 'give either "start" (a year of calendar months) or "yearEnd" (a 52/53-week year), not both'
        : `a fiscal unit needs either "start": {"month": 10, "day": 1} (a year of calendar months) or "yearEnd": {"weekday": "saturday", "month": 1, "rule": "nearest"} (a 52/53-week year)`,
    );
  }
  if (!namingOk) {
    add(
      join(path, 'naming'),
      `expected "end-year" (the fiscal year is named after the calendar year in which it ends) or "start-year" (the year in which it starts); there is no default, got ${describeValue(naming)}`,
    );
  }
  if (hasStart && !hasYearEnd) {
    allowed(['start', 'naming']);
    if (fiscalKind === 'fiscal-week') {
      add(join(path, 'kind'), 'fiscal weeks need a 52/53-week year: give "yearEnd" instead of "start"');
    }
    const start = def['start'];
    const sp = join(path, 'start');
    let startMonth: number | undefined;
    let startDay: number | undefined;
    if (!isRecord(start)) {
      add(sp, `expected {"month": 1..12, "day": 1..31}, got ${describeValue(start)}`);
    } else {
      for (const k of Object.keys(start)) {
        if (k !== 'month' && k !== 'day') add(join(sp, k), 'unknown field; valid fields are "month", "day"');
      }
      const m = start['month'];
      if (typeof m !== 'number' || !Number.isInteger(m) || m < 1 || m > 12) {
        add(join(sp, 'month'), `expected an integer from 1 to 12, got ${describeValue(m)}`);
      } else startMonth = m;
      const d = start['day'];
      if (startMonth !== undefined) {
        const max = dayCountOfMonthUnchecked(2001, startMonth); // 28 for February: 29 February is rejected.
        if (typeof d !== 'number' || !Number.isInteger(d) || d < 1 || d > max) {
          const hint =
            startMonth === 2 && d === 29
              ? ' (29 February exists only in leap years; use {"month": 2, "day": 28} or {"month": 3, "day": 1} instead)'
              : '';
          add(join(sp, 'day'), `expected 1..${max} for month ${startMonth}, got ${describeValue(d)}${hint}`);
        } else startDay = d;
      } else if (typeof d !== 'number' || !Number.isInteger(d) || d < 1 || d > 31) {
        add(join(sp, 'day'), `expected an integer from 1 to 31, got ${describeValue(d)}`);
      }
    }
    if (issues.length || startMonth === undefined || startDay === undefined) return { issues, unit: undefined };
    return {
      issues,
      unit: { kind: fiscalKind, basis: 'months', startMonth, startDay, naming: naming as YearNaming },
    };
  }
  if (hasYearEnd && !hasStart) {
    allowed(['yearEnd', 'naming', 'layout', 'extraWeek']);
    const ye = def['yearEnd'];
    const yp = join(path, 'yearEnd');
    let endWeekday: number | undefined;
    let endMonth: number | undefined;
    let endRule: 'last' | 'nearest' | undefined;
    if (!isRecord(ye)) {
      add(yp, `expected {"weekday": "saturday", "month": 1..12, "rule": "last" | "nearest"}, got ${describeValue(ye)}`);
    } else {
      for (const k of Object.keys(ye)) {
        if (k !== 'weekday' && k !== 'month' && k !== 'rule') add(join(yp, k), 'unknown field; valid fields are "weekday", "month", "rule"');
      }
      endWeekday = readWeekday(ye['weekday'], join(yp, 'weekday'), add);
      const m = ye['month'];
      if (typeof m !== 'number' || !Number.isInteger(m) || m < 1 || m > 12) {
        add(join(yp, 'month'), `expected an integer from 1 to 12, got ${describeValue(m)}`);
      } else endMonth = m;
      const r = ye['rule'];
      if (r !== 'last' && r !== 'nearest') {
        add(
          join(yp, 'rule'),
          `expected "last" (the last such weekday in the month) or "nearest" (the one nearest the month's last day), got ${describeValue(r)}`,
        );
      } else endRule = r;
    }
    const layout = def['layout'];
    if (layout !== undefined && (typeof layout !== 'string' || !LAYOUTS.includes(layout))) {
      add(join(path, 'layout'), `expected one of ${listOf(LAYOUTS)}, got ${describeValue(layout)}`);
    } else if (layout === undefined && (fiscalKind === 'fiscal-half' || fiscalKind === 'fiscal-quarter' || fiscalKind === 'fiscal-period')) {
      add(join(path, 'layout'), `required for ${fiscalKind}: expected one of ${listOf(LAYOUTS)}`);
    }
    const extra = def['extraWeek'];
    if (extra !== undefined && (typeof extra !== 'string' || !PLACEMENTS.includes(extra))) {
      add(join(path, 'extraWeek'), `expected one of ${listOf(PLACEMENTS)} (default "last-period"), got ${describeValue(extra)}`);
    } else if (extra === 'first-period' && layout === undefined && !issues.some((i) => i.path === join(path, 'layout'))) {
      add(join(path, 'layout'), 'required when extraWeek is "first-period": the layout decides how long the first period is');
    }
    if (issues.length || endWeekday === undefined || endMonth === undefined || endRule === undefined) {
      return { issues, unit: undefined };
    }
    return {
      issues,
      unit: {
        kind: fiscalKind,
        basis: 'weeks',
        endWeekday,
        endMonth,
        endRule,
        naming: naming as YearNaming,
        layout: layout as WeekLayout | undefined,
        extraWeek: (extra as ExtraWeekPlacement | undefined) ?? 'last-period',
      },
    };
  }
  return { issues, unit: undefined };
}

function readWeekday(v: unknown, p: string, add: (p: string, m: string) => void): number | undefined {
  if (typeof v === 'string') {
    const i = WEEKDAY_NAMES.indexOf(v.toLowerCase() as WeekdayName);
    if (i >= 0 && v === v.toLowerCase()) return i + 1;
    if (i >= 0) {
      add(p, `expected a lower-case weekday name, got ${describeValue(v)} (use ${JSON.stringify(v.toLowerCase())} instead)`);
      return undefined;
    }
  }
  add(p, `expected one of ${listOf(WEEKDAY_NAMES)}, got ${describeValue(v)}`);
  return undefined;
}

/** @internal Validates and normalizes, throwing one DefinitionError listing every issue. */
export function normalizeUnitDefinition(def: unknown): NormalizedUnit {
  const { issues, unit } = validateUnitDefinition(def);
  if (issues.length > 0 || unit === undefined) {
    throw new DefinitionError(issues.length ? issues : [{ path: '(definition)', message: 'invalid unit definition' }], def);
  }
  return unit;
}

/** @internal The canonical definition object (a fresh, frozen copy, with defaults spelled out). */
export function canonicalDefinition(u: NormalizedUnit): UnitDefinition {
  switch (u.kind) {
    case 'week':
      return Object.freeze({ kind: 'week', firstWeekday: WEEKDAY_NAMES[u.firstWeekday - 1]! });
    case 'cycle':
      return Object.freeze({ kind: 'cycle', lengthDays: u.lengthDays, anchor: u.anchor });
    default:
      if (!('basis' in u)) return Object.freeze({ kind: u.kind });
      if (u.basis === 'months') {
        return Object.freeze({
          kind: u.kind as Exclude<FiscalKind, 'fiscal-week'>,
          start: Object.freeze({ month: u.startMonth, day: u.startDay }),
          naming: u.naming,
        });
      }
      return Object.freeze({
        kind: u.kind,
        yearEnd: Object.freeze({ weekday: WEEKDAY_NAMES[u.endWeekday - 1]!, month: u.endMonth, rule: u.endRule }),
        naming: u.naming,
        ...(u.layout === undefined ? {} : { layout: u.layout }),
        extraWeek: u.extraWeek,
      });
  }
}

/** @internal A short canonical identifier; two units with the same id are the same unit. */
export function unitId(u: NormalizedUnit): string {
  switch (u.kind) {
    case 'week':
      return `week/${WEEKDAY_NAMES[u.firstWeekday - 1]}`;
    case 'cycle':
      return `cycle/${u.lengthDays}d/${u.anchor}`;
    default: {
      if (!('basis' in u)) return u.kind;
      const pad = (n: number) => String(n).padStart(2, '0');
      if (u.basis === 'months') return `${u.kind}/start-${pad(u.startMonth)}-${pad(u.startDay)}/${u.naming}`;
      const wd = WEEKDAY_NAMES[u.endWeekday - 1];
      const base = `${u.kind}/${u.endRule}-${wd}-of-${pad(u.endMonth)}`;
      // Layout and extra-week placement do not change fiscal years or fiscal weeks.
      if (u.kind === 'fiscal-year' || u.kind === 'fiscal-week') return `${base}/${u.naming}`;
      return `${base}/${u.layout ?? 'any-layout'}/${u.extraWeek}/${u.naming}`;
    }
  }
}

/**
 * Unit definitions as plain data, and their validation on the diagnostics kit: an {@link Issues} collector and its
 * field readers, so that one {@link DefinitionError} lists every fault of a definition with its dotted path.
 *
 * @module
 */
import { MAX_CYCLE_DAYS } from '../bounds.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { dayCountOfMonthUnchecked } from '../civil/gregorian.js';
import { WEEKDAY_NAMES, type WeekdayName, weekdayFromName } from '../civil/names.js';
import { Issues, didYouMean, isRecord, joinPath, ownField, readEnum, readInt } from '../diagnostics/index.js';
import { parseCalendarDateText } from '../instant/text.js';

/** A weekday by its English name, lower case (the civil layer's names). */
export type { WeekdayName };

/**
 * How a fiscal year is named: after the calendar year in which it ends (`'end-year'`, as the US federal fiscal
 * year, 31 U.S.C. 1102) or the one in which it starts (`'start-year'`, as the UK tax year "2007-08", Income Tax
 * Act 2007 s.4(4)). Required in every fiscal definition: there is no default.
 */
export type YearNaming = 'end-year' | 'start-year';

/** A day of the year without a year: month 1..12, day 1..(days in that month; 28 for February). */
export interface MonthDay {
  /** The month, 1..12. */
  readonly month: number;
  /** The day of the month, 1..(days in that month; 28 for February). */
  readonly day: number;
}

/**
 * Where a 52/53-week year ends: on `weekday`, either the last one in `month` (`'last'`) or the one nearest the
 * last day of `month` (`'nearest'`, which may fall up to three days into the next month). These are the two
 * forms of 26 U.S.C. 441(f)(1) and 26 CFR 1.441-2(a)(1)(iii).
 */
export interface YearEndRule {
  /** The weekday the year ends on. */
  readonly weekday: WeekdayName;
  /** The month (1..12) whose last such weekday, or the such weekday nearest whose last day, ends the year. */
  readonly month: number;
  /** `'last'`: the last `weekday` in `month`; `'nearest'`: the `weekday` nearest the last day of `month`. */
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
  | {
      /** A calendar unit's name. */
      readonly kind: CalendarUnitName;
    }
  | {
      /** Selects a week that starts on `firstWeekday`. */
      readonly kind: 'week';
      /** The first day of each week. */
      readonly firstWeekday: WeekdayName;
    }
  | {
      /** Selects a cycle of a fixed number of days. */
      readonly kind: 'cycle';
      /** Days in each cycle. */
      readonly lengthDays: number;
      /** An ISO 8601 date on which a cycle starts. */
      readonly anchor: string;
    };

/** A fiscal unit of a year that starts on a fixed month and day (periods are months starting on that day). */
export interface MonthFiscalDefinition {
  /** Which fiscal unit: the year, or its halves, quarters or (monthly) periods. */
  readonly kind: Exclude<FiscalKind, 'fiscal-week'>;
  /** The month and day on which each fiscal year starts. */
  readonly start: MonthDay;
  /** Whether a fiscal year is named after the calendar year it ends in or the one it starts in. */
  readonly naming: YearNaming;
}

/** A fiscal unit of a 52/53-week year. `layout` is required for halves, quarters and periods. */
export interface WeekFiscalDefinition {
  /** Which fiscal unit: the year, or its halves, quarters, periods or weeks. */
  readonly kind: FiscalKind;
  /** Where each 52/53-week year ends. */
  readonly yearEnd: YearEndRule;
  /** Whether a fiscal year is named after the calendar year it ends in or the one it starts in. */
  readonly naming: YearNaming;
  /** Weeks per period in each quarter (required for halves, quarters and periods). */
  readonly layout?: WeekLayout;
  /** Which period of a 53-week year takes the 53rd week (default `'last-period'`). */
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

const CALENDAR_NAMES: readonly CalendarUnitName[] = ['day', 'iso-week', 'month', 'quarter', 'half-year', 'year'];
const FISCAL_KINDS: readonly FiscalKind[] = ['fiscal-year', 'fiscal-half', 'fiscal-quarter', 'fiscal-period', 'fiscal-week'];
const ALL_KINDS: readonly UnitDefinition['kind'][] = [...CALENDAR_NAMES, 'week', 'cycle', ...FISCAL_KINDS];
const LAYOUTS: readonly WeekLayout[] = ['4-4-5', '4-5-4', '5-4-4', '13x4'];
const PLACEMENTS: readonly ExtraWeekPlacement[] = ['last-period', 'first-period'];
const NAMINGS: readonly string[] = ['end-year', 'start-year'];
/** Words people use for the calendar units, mapped to our names (suggestions by meaning, not only spelling). */
const UNIT_SYNONYMS: Readonly<Record<string, string>> = /* @__PURE__ */ Object.freeze({
  daily: 'day',
  date: 'day',
  week: 'iso-week',
  weekly: 'iso-week',
  isoweek: 'iso-week',
  monthly: 'month',
  quarterly: 'quarter',
  semester: 'half-year',
  halfyear: 'half-year',
  half: 'half-year',
  annual: 'year',
  yearly: 'year',
});

function listOf(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(', ');
}

/** The message of an unknown calendar unit name, with the nearest names by spelling and by meaning. */
function unknownUnitName(name: string): string {
  return `unknown unit name ${describeValue(name)}; expected one of ${listOf(CALENDAR_NAMES)} or a unit definition such as {"kind":"fiscal-year", ...}${didYouMean(name, CALENDAR_NAMES, { synonyms: UNIT_SYNONYMS })}`;
}

/**
 * @internal Reads a unit definition found at `path` (empty at the top level) into the compiler's normalized form,
 * recording every fault in `issues` under its dotted path; undefined when there is any. Definitions that embed a
 * unit definition (a company calendar, a business calendar) call this to report issues under their own paths.
 */
export function readUnitDefinition(def: unknown, path: string, issues: Issues): NormalizedUnit | undefined {
  const at = (key: string) => joinPath(path, key);
  const before = issues.count;
  if (typeof def === 'string') {
    if ((CALENDAR_NAMES as readonly string[]).includes(def)) return { kind: def as CalendarUnitName };
    issues.add(path === '' ? 'unit' : path, unknownUnitName(def));
    return undefined;
  }
  if (!isRecord(def)) {
    issues.add(path === '' ? 'definition' : path, `expected a unit definition object such as {"kind":"month"} or a unit name, got ${describeValue(def)}`);
    return undefined;
  }
  const kind = readEnum(def, 'kind', at('kind'), ALL_KINDS, issues, undefined, { synonyms: UNIT_SYNONYMS });
  if (kind === undefined) {
    if (ownField(def, 'kind') === undefined) issues.add(at('kind'), `required: expected one of ${listOf(ALL_KINDS)}`);
    return undefined;
  }
  const allowed = (keys: readonly string[]) => {
    const valid = ['kind', ...keys];
    for (const k of Object.keys(def)) {
      if (!valid.includes(k)) issues.add(at(k), `unknown field for kind ${JSON.stringify(kind)}${didYouMean(k, valid)}; valid fields are ${listOf(valid)}`);
    }
  };
  const ok = () => issues.count === before;
  if ((CALENDAR_NAMES as readonly string[]).includes(kind)) {
    allowed([]);
    return ok() ? { kind: kind as CalendarUnitName } : undefined;
  }
  if (kind === 'week') {
    allowed(['firstWeekday']);
    const wd = readWeekday(ownField(def, 'firstWeekday'), at('firstWeekday'), issues);
    return ok() && wd !== undefined ? { kind: 'week', firstWeekday: wd } : undefined;
  }
  if (kind === 'cycle') {
    allowed(['lengthDays', 'anchor']);
    if (ownField(def, 'lengthDays') === undefined) issues.add(at('lengthDays'), `required: expected an integer from 1 to ${MAX_CYCLE_DAYS}`);
    const lengthDays = readInt(def, 'lengthDays', at('lengthDays'), 1, MAX_CYCLE_DAYS, issues, Number.NaN);
    const anchor = ownField(def, 'anchor');
    let anchorDayNumber: number | undefined;
    if (typeof anchor !== 'string') {
      issues.add(at('anchor'), `expected the first day of any one cycle as an ISO 8601 date string such as "2025-01-03", got ${describeValue(anchor)}`);
    } else {
      try {
        anchorDayNumber = parseCalendarDateText(anchor, at('anchor'));
      } catch (e) {
        if (!(e instanceof KalendsSyntaxError)) throw e;
        issues.add(at('anchor'), e.message.slice(at('anchor').length + 2));
      }
    }
    if (!ok() || anchorDayNumber === undefined || typeof anchor !== 'string') return undefined;
    return { kind: 'cycle', lengthDays, anchorDayNumber, anchor };
  }
  return readFiscal(def, kind as FiscalKind, path, issues, allowed, ok);
}

function readFiscal(
  def: Record<string, unknown>,
  fiscalKind: FiscalKind,
  path: string,
  issues: Issues,
  allowed: (keys: readonly string[]) => void,
  ok: () => boolean,
): NormalizedUnit | undefined {
  const at = (key: string) => joinPath(path, key);
  const naming = ownField(def, 'naming');
  const namingOk = typeof naming === 'string' && NAMINGS.includes(naming);
  const hasStart = ownField(def, 'start') !== undefined;
  const hasYearEnd = ownField(def, 'yearEnd') !== undefined;
  if (hasStart === hasYearEnd) {
    issues.add(
      at('start'),
      hasStart
        ? 'give either "start" (a year of calendar months) or "yearEnd" (a 52/53-week year), not both'
        : `a fiscal unit needs either "start": {"month": 10, "day": 1} (a year of calendar months) or "yearEnd": {"weekday": "saturday", "month": 1, "rule": "nearest"} (a 52/53-week year)`,
    );
  }
  if (!namingOk) {
    issues.add(
      at('naming'),
      `expected "end-year" (the fiscal year is named after the calendar year in which it ends) or "start-year" (the year in which it starts); there is no default, got ${describeValue(naming)}${didYouMean(naming, NAMINGS)}`,
    );
  }
  if (hasStart && !hasYearEnd) {
    allowed(['start', 'naming']);
    if (fiscalKind === 'fiscal-week') issues.add(at('kind'), 'fiscal weeks need a 52/53-week year: give "yearEnd" instead of "start"');
    const start = def['start'];
    const sp = at('start');
    let startMonth: number | undefined;
    let startDay: number | undefined;
    if (!isRecord(start)) {
      issues.add(sp, `expected {"month": 1..12, "day": 1..31}, got ${describeValue(start)}`);
    } else {
      for (const k of Object.keys(start)) {
        if (k !== 'month' && k !== 'day') issues.add(joinPath(sp, k), `unknown field${didYouMean(k, ['month', 'day'])}; valid fields are "month", "day"`);
      }
      const m = readInt(start, 'month', joinPath(sp, 'month'), 1, 12, issues, Number.NaN);
      if (ownField(start, 'month') === undefined) issues.add(joinPath(sp, 'month'), 'required: expected an integer from 1 to 12');
      if (m === m) startMonth = m;
      const d = ownField(start, 'day');
      if (startMonth !== undefined) {
        const max = dayCountOfMonthUnchecked(2001, startMonth); // 28 for February: 29 February is rejected.
        if (typeof d !== 'number' || !Number.isInteger(d) || d < 1 || d > max) {
          const hint =
            startMonth === 2 && d === 29
              ? ' (29 February exists only in leap years; use {"month": 2, "day": 28} or {"month": 3, "day": 1} instead)'
              : '';
          issues.add(joinPath(sp, 'day'), `expected 1..${max} for month ${startMonth}, got ${describeValue(d)}${hint}`);
        } else startDay = d;
      } else if (typeof d !== 'number' || !Number.isInteger(d) || d < 1 || d > 31) {
        issues.add(joinPath(sp, 'day'), `expected an integer from 1 to 31, got ${describeValue(d)}`);
      }
    }
    if (!ok() || startMonth === undefined || startDay === undefined) return undefined;
    return { kind: fiscalKind, basis: 'months', startMonth, startDay, naming: naming as YearNaming };
  }
  if (hasYearEnd && !hasStart) {
    allowed(['yearEnd', 'naming', 'layout', 'extraWeek']);
    const ye = def['yearEnd'];
    const yp = at('yearEnd');
    let endWeekday: number | undefined;
    let endMonth: number | undefined;
    let endRule: 'last' | 'nearest' | undefined;
    if (!isRecord(ye)) {
      issues.add(yp, `expected {"weekday": "saturday", "month": 1..12, "rule": "last" | "nearest"}, got ${describeValue(ye)}`);
    } else {
      const keys = ['weekday', 'month', 'rule'];
      for (const k of Object.keys(ye)) {
        if (!keys.includes(k)) issues.add(joinPath(yp, k), `unknown field${didYouMean(k, keys)}; valid fields are "weekday", "month", "rule"`);
      }
      endWeekday = readWeekday(ownField(ye, 'weekday'), joinPath(yp, 'weekday'), issues);
      const m = readInt(ye, 'month', joinPath(yp, 'month'), 1, 12, issues, Number.NaN);
      if (ownField(ye, 'month') === undefined) issues.add(joinPath(yp, 'month'), 'required: expected an integer from 1 to 12');
      if (m === m) endMonth = m;
      const r = ownField(ye, 'rule');
      if (r !== 'last' && r !== 'nearest') {
        issues.add(
          joinPath(yp, 'rule'),
          `expected "last" (the last such weekday in the month) or "nearest" (the one nearest the month's last day), got ${describeValue(r)}${didYouMean(r, ['last', 'nearest'])}`,
        );
      } else endRule = r;
    }
    const layout = readEnum(def, 'layout', at('layout'), LAYOUTS, issues, undefined);
    const layoutGiven = ownField(def, 'layout') !== undefined;
    if (!layoutGiven && (fiscalKind === 'fiscal-half' || fiscalKind === 'fiscal-quarter' || fiscalKind === 'fiscal-period')) {
      issues.add(at('layout'), `required for ${fiscalKind}: expected one of ${listOf(LAYOUTS)}`);
    }
    const extraGiven = ownField(def, 'extraWeek');
    const extra = readEnum(def, 'extraWeek', at('extraWeek'), PLACEMENTS, issues, 'last-period');
    if (extraGiven === 'first-period' && !layoutGiven) {
      issues.add(at('layout'), 'required when extraWeek is "first-period": the layout decides how long the first period is');
    }
    if (!ok() || endWeekday === undefined || endMonth === undefined || endRule === undefined || extra === undefined) return undefined;
    return { kind: fiscalKind, basis: 'weeks', endWeekday, endMonth, endRule, naming: naming as YearNaming, layout, extraWeek: extra };
  }
  return undefined;
}

/** A weekday name (lower case, the civil layer's names); a capitalized one gets the lower-case spelling as the fix. */
function readWeekday(v: unknown, p: string, issues: Issues): number | undefined {
  const wd = weekdayFromName(v);
  if (wd > 0) return wd;
  if (typeof v === 'string' && weekdayFromName(v.toLowerCase()) > 0) {
    issues.add(p, `expected a lower-case weekday name, got ${describeValue(v)} (use ${JSON.stringify(v.toLowerCase())} instead)`);
    return undefined;
  }
  issues.add(p, `expected one of ${listOf(WEEKDAY_NAMES)}, got ${describeValue(v)}${didYouMean(v, WEEKDAY_NAMES)}`);
  return undefined;
}

/**
 * @internal Validates and normalizes a unit definition or a calendar unit's name. An unknown name is a
 * KalendsRangeError with code `unknown-name` and the nearest names; a value that is neither a name nor an object a
 * KalendsTypeError; any fault of a definition object one DefinitionError listing every issue with its path.
 */
export function normalizeUnitDefinition(def: unknown, name = 'unit'): NormalizedUnit {
  if (typeof def === 'string') {
    if ((CALENDAR_NAMES as readonly string[]).includes(def)) return { kind: def as CalendarUnitName };
    throw new KalendsRangeError(`${name}: ${unknownUnitName(def)}`, { code: 'unknown-name', received: def });
  }
  if (!isRecord(def)) {
    throw new KalendsTypeError(
      `${name}: expected a unit made by defineUnit, a unit definition such as {"kind":"month"}, or one of ${listOf(CALENDAR_NAMES)}; got ${describeValue(def)}`,
      { code: 'invalid-type', received: def },
    );
  }
  const issues = new Issues();
  const unit = readUnitDefinition(def, '', issues);
  issues.throwIfAny(def);
  return unit!;
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

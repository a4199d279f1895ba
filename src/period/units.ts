/**
 * Compiling unit definitions into {@link PeriodUnit}s: for each kind, the map from a day number to a period
 * ordinal, its inverse (the first day of an ordinal), and the label grammar. All integer arithmetic.
 *
 * Ordinal origins (chosen so that an ordinal reads at a glance):
 * - day: the day number itself; week, ISO week: weeks since the week that holds 1970-01-01;
 * - cycle: cycles since the anchor cycle (the anchor cycle is 0);
 * - month, quarter, half-year, year: `year * n + (index - 1)` with n = 12, 4, 2, 1 (so 2025-03 is 24302);
 * - fiscal year, half, quarter, period: `namedYear * n + (index - 1)` with n = 1, 2, 4, and 12 or 13;
 * - fiscal week: weeks since the week that holds 1970-01-01, counted from the fiscal week's first weekday.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../bounds.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue, requireInteger } from '../errors.js';
import {
  dayNumberFromYmdUnchecked,
  dayCountOfMonthUnchecked,
  packedYmdUnchecked,
  weekdayOfDayNumberUnchecked,
} from '../civil/gregorian.js';
import { isoWeekOneMonday, isoWeeksInYearUnchecked } from '../civil/isoweek.js';
import { MIN_YEAR } from '../bounds.js';
import {
  type CalendarUnitName,
  type NormalizedUnit,
  type UnitDefinition,
  type WeekLayout,
  WEEKDAY_NAMES,
  canonicalDefinition,
  normalizeUnitDefinition,
  unitId,
} from './definition.js';
import {
  YEAR_PATTERN,
  firstMismatch,
  formatDayLabel,
  formatYearLabel,
  pad2,
  parseDayLabel,
  requireLabelYear,
  yearFromMatch,
} from './labels.js';

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
  /** The first day of period `ordinal`. */
  firstDayNumberFromOrdinal(ordinal: number): number;
  /** The label of period `ordinal` (see docs/periods.md, "Labels"). */
  formatOrdinal(ordinal: number): string;
  /** The ordinal of a label of this unit. */
  parseOrdinal(text: string): number;
}

/** How the bulk conversion computes ordinals for a unit (see bulk.ts). */
export type BulkKernel =
  | { readonly type: 'linear'; readonly origin: number; readonly length: number }
  | {
      readonly type: 'months';
      /** Months per period. */
      readonly monthsPer: number;
      /** Calendar month (0-based) in which fiscal month 1 starts; 0 for calendar units. */
      readonly startMonthIndex: number;
      /** Day of the month on which each fiscal month starts (1 for calendar units). */
      readonly startDay: number;
      /** Added to the period count: periods-per-year times the year-naming shift. */
      readonly addend: number;
    }
  | { readonly type: 'weeks'; readonly origin: number };

/** @internal What the period functions need beyond the public unit. */
export interface UnitCore {
  readonly ordinalOf: (dayNumber: number) => number;
  readonly firstDayOf: (ordinal: number) => number;
  readonly format: (ordinal: number) => string;
  /** Returns the ordinal; throws KalendsSyntaxError / KalendsRangeError quoting the text. */
  readonly parse: (text: string) => number;
  readonly yearEarlier: (ordinal: number) => number;
  readonly kernel: BulkKernel;
  /** A short description of the label form, for error messages. */
  readonly labelForm: string;
}

const cores = new WeakMap<PeriodUnit, UnitCore>();

/** @internal The core of a compiled unit, or undefined when `unit` was not made by defineUnit. */
export function coreOf(unit: unknown): UnitCore | undefined {
  return typeof unit === 'object' && unit !== null ? cores.get(unit as PeriodUnit) : undefined;
}

function floorDiv(a: number, b: number): number {
  return Math.floor(a / b);
}

/** Year and month (1..12) and day of a day number, packed by the civil layer. */
function ymd(dn: number): { y: number; m: number; d: number } {
  const p = packedYmdUnchecked(dn);
  return { y: Math.floor(p / 512) + MIN_YEAR, m: (p >> 5) & 15, d: p & 31 };
}

function syntaxError(name: string, text: string, expected: string, position = 0): KalendsSyntaxError {
  return new KalendsSyntaxError(`${name}: expected ${expected}, got ${describeValue(text)}`, {
    code: 'malformed',
    received: text,
    position,
  });
}

function rangeError(name: string, text: string, why: string): KalendsRangeError {
  return new KalendsRangeError(`${name}: ${describeValue(text)} ${why}`, { code: 'out-of-range', received: text });
}

// ---------------------------------------------------------------------------------------------------------
// Calendar units

function dayCore(): UnitCore {
  return {
    ordinalOf: (dn) => dn,
    firstDayOf: (o) => o,
    format: formatDayLabel,
    parse: (text) => {
      try {
        return parseDayLabel(text, 'label');
      } catch (e) {
        if (e instanceof KalendsSyntaxError) throw syntaxError('label', text, 'a day label YYYY-MM-DD such as "2025-03-14"', e.position);
        throw e;
      }
    },
    yearEarlier: (o) => {
      const { y, m, d } = ymd(o);
      return dayNumberFromYmdUnchecked(y - 1, m, Math.min(d, dayCountOfMonthUnchecked(y - 1, m)));
    },
    kernel: { type: 'linear', origin: 0, length: 1 },
    labelForm: 'YYYY-MM-DD, e.g. "2025-03-14"',
  };
}

/** The day number of the `weekday` (1..7) on or before 1970-01-01 (a Thursday, weekday 4). */
function weekOrigin(weekday: number): number {
  return -((4 - weekday + 7) % 7);
}

function weekCore(firstWeekday: number): UnitCore {
  const origin = weekOrigin(firstWeekday);
  const name = WEEKDAY_NAMES[firstWeekday - 1]!;
  const form = `the first day and one week, YYYY-MM-DD/P1W, e.g. "${formatDayLabel(origin + 7 * 2880)}/P1W" (weeks start on ${name})`;
  const re = new RegExp(`^(.*)/P1W$`);
  return {
    ordinalOf: (dn) => floorDiv(dn - origin, 7),
    firstDayOf: (o) => origin + 7 * o,
    format: (o) => `${formatDayLabel(origin + 7 * o)}/P1W`,
    parse: (text) => {
      const m = re.exec(text);
      if (!m) throw syntaxError('label', text, form, text.indexOf('/') < 0 ? text.length : text.indexOf('/'));
      let dn: number;
      try {
        dn = parseDayLabel(m[1]!, 'label', 1);
      } catch (e) {
        if (e instanceof KalendsSyntaxError) throw syntaxError('label', text, form, e.position);
        throw rangeError('label', text, `has an impossible first day (${(e as Error).message})`);
      }
      if (weekdayOfDayNumberUnchecked(dn) !== firstWeekday) {
        throw syntaxError('label', text, `a week label whose first day is a ${name}; ${m[1]} is a ${WEEKDAY_NAMES[weekdayOfDayNumberUnchecked(dn) - 1]}`);
      }
      return floorDiv(dn - origin, 7);
    },
    yearEarlier: (o) => o - 52,
    kernel: { type: 'linear', origin, length: 7 },
    labelForm: form,
  };
}

const ISO_WEEK_RE = new RegExp(`^${YEAR_PATTERN}-W(\\d{2})$`);

function isoWeekCore(): UnitCore {
  const origin = weekOrigin(1);
  const weekYearOf = (monday: number) => {
    const thursday = monday + 3;
    return Math.floor(packedYmdUnchecked(thursday) / 512) + MIN_YEAR;
  };
  const form = 'an ISO 8601 week YYYY-Www, e.g. "2025-W07"';
  return {
    ordinalOf: (dn) => floorDiv(dn - origin, 7),
    firstDayOf: (o) => origin + 7 * o,
    format: (o) => {
      const monday = origin + 7 * o;
      const wy = weekYearOf(monday);
      const week = (monday - isoWeekOneMonday(wy)) / 7 + 1;
      return `${formatYearLabel(wy)}-W${pad2(week)}`;
    },
    parse: (text) => {
      const m = ISO_WEEK_RE.exec(text);
      if (!m) throw syntaxError('label', text, form, firstMismatch(text, '0000-W00'));
      const wy = yearFromMatch(text, m[1]!, 'label');
      requireLabelYear(text, wy, 'label');
      const week = Number(m[2]);
      const weeks = isoWeeksInYearUnchecked(wy);
      if (week < 1 || week > weeks) throw rangeError('label', text, `names week ${week}, but ISO week-year ${wy} has weeks 01..${weeks}`);
      return floorDiv(isoWeekOneMonday(wy) + 7 * (week - 1) - origin, 7);
    },
    yearEarlier: (o) => {
      const monday = origin + 7 * o;
      const wy = weekYearOf(monday);
      const week = (monday - isoWeekOneMonday(wy)) / 7 + 1;
      const prior = Math.min(week, isoWeeksInYearUnchecked(wy - 1));
      return floorDiv(isoWeekOneMonday(wy - 1) + 7 * (prior - 1) - origin, 7);
    },
    kernel: { type: 'linear', origin, length: 7 },
    labelForm: form,
  };
}

function monthsCore(kind: 'month' | 'quarter' | 'half-year' | 'year'): UnitCore {
  const perYear = kind === 'month' ? 12 : kind === 'quarter' ? 4 : kind === 'half-year' ? 2 : 1;
  const monthsPer = 12 / perYear;
  const letter = kind === 'quarter' ? 'Q' : kind === 'half-year' ? 'H' : '';
  const re =
    kind === 'month'
      ? new RegExp(`^${YEAR_PATTERN}-(\\d{2})$`)
      : kind === 'year'
        ? new RegExp(`^${YEAR_PATTERN}$`)
        : new RegExp(`^${YEAR_PATTERN}-${letter}(\\d)$`);
  const form =
    kind === 'month'
      ? 'an ISO 8601 month YYYY-MM, e.g. "2025-03"'
      : kind === 'year'
        ? 'an ISO 8601 year YYYY, e.g. "2025"'
        : kind === 'quarter'
          ? 'a quarter YYYY-Qn (n = 1..4), e.g. "2025-Q1"'
          : 'a half-year YYYY-Hn (n = 1..2), e.g. "2025-H1"';
  const shape = kind === 'month' ? '0000-00' : kind === 'year' ? '0000' : `0000-${letter}0`;
  return {
    ordinalOf: (dn) => {
      const p = packedYmdUnchecked(dn);
      const cm = (Math.floor(p / 512) + MIN_YEAR) * 12 + ((p >> 5) & 15) - 1;
      return floorDiv(cm, monthsPer);
    },
    firstDayOf: (o) => {
      const cm = o * monthsPer;
      const y = floorDiv(cm, 12);
      return dayNumberFromYmdUnchecked(y, cm - 12 * y + 1, 1);
    },
    format: (o) => {
      const y = floorDiv(o, perYear);
      const i = o - perYear * y + 1;
      if (kind === 'year') return formatYearLabel(y);
      if (kind === 'month') return `${formatYearLabel(y)}-${pad2(i)}`;
      return `${formatYearLabel(y)}-${letter}${i}`;
    },
    parse: (text) => {
      const m = re.exec(text);
      if (!m) throw syntaxError('label', text, form, firstMismatch(text, shape));
      const y = yearFromMatch(text, m[1]!, 'label');
      requireLabelYear(text, y, 'label');
      const i = kind === 'year' ? 1 : Number(m[2]);
      if (i < 1 || i > perYear) {
        throw rangeError('label', text, `names ${kind === 'month' ? 'month' : kind} ${i}; expected 1..${perYear}`);
      }
      return y * perYear + i - 1;
    },
    yearEarlier: (o) => o - perYear,
    kernel: { type: 'months', monthsPer, startMonthIndex: 0, startDay: 1, addend: 0 },
    labelForm: form,
  };
}

function cycleCore(lengthDays: number, anchorDayNumber: number, anchor: string): UnitCore {
  const form = `the first day and the cycle length, YYYY-MM-DD/P${lengthDays}D, e.g. "${anchor}/P${lengthDays}D"`;
  const suffix = `/P${lengthDays}D`;
  return {
    ordinalOf: (dn) => floorDiv(dn - anchorDayNumber, lengthDays),
    firstDayOf: (o) => anchorDayNumber + lengthDays * o,
    format: (o) => `${formatDayLabel(anchorDayNumber + lengthDays * o)}${suffix}`,
    parse: (text) => {
      if (!text.endsWith(suffix)) throw syntaxError('label', text, form, text.indexOf('/') < 0 ? text.length : text.indexOf('/'));
      let dn: number;
      try {
        // The first cycle in range may start up to a cycle (at most a century) before the first supported day.
        dn = parseDayLabel(text.slice(0, -suffix.length), 'label', 101);
      } catch (e) {
        if (e instanceof KalendsSyntaxError) throw syntaxError('label', text, form, e.position);
        throw rangeError('label', text, `has an impossible first day (${(e as Error).message})`);
      }
      const offset = dn - anchorDayNumber;
      if (offset % lengthDays !== 0) {
        throw syntaxError('label', text, `the first day of a cycle: cycles start on ${anchor} and every ${lengthDays} days before and after it`);
      }
      return offset / lengthDays;
    },
    yearEarlier: (o) => floorDiv(anchorDayNumber + lengthDays * o - 364 - anchorDayNumber, lengthDays),
    kernel: { type: 'linear', origin: anchorDayNumber, length: lengthDays },
    labelForm: form,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Fiscal units

const FISCAL_LETTER = { 'fiscal-year': '', 'fiscal-half': 'H', 'fiscal-quarter': 'Q', 'fiscal-period': 'P', 'fiscal-week': 'W' } as const;
type FiscalKindName = keyof typeof FISCAL_LETTER;

function fiscalForm(kind: FiscalKindName, perYear: number): { re: RegExp; form: string; shape: string } {
  const letter = FISCAL_LETTER[kind];
  if (kind === 'fiscal-year') return { re: new RegExp(`^FY${YEAR_PATTERN}$`), form: 'a fiscal year FYyyyy, e.g. "FY2026"', shape: 'FY0000' };
  const digits = kind === 'fiscal-period' || kind === 'fiscal-week' ? 2 : 1;
  const example = kind === 'fiscal-period' ? '03' : kind === 'fiscal-week' ? '05' : '1';
  const what = { 'fiscal-half': 'fiscal half', 'fiscal-quarter': 'fiscal quarter', 'fiscal-period': 'fiscal period', 'fiscal-week': 'fiscal week' }[kind];
  const range = kind === 'fiscal-week' ? '01..53' : digits === 2 ? `01..${pad2(perYear)}` : `1..${perYear}`;
  return {
    re: new RegExp(`^FY${YEAR_PATTERN}-${letter}(\\d{${digits}})$`),
    form: `a ${what} FYyyyy-${letter}${digits === 2 ? 'nn' : 'n'} (${range}), e.g. "FY2026-${letter}${example}"`,
    shape: `FY0000-${letter}${'0'.repeat(digits)}`,
  };
}

/** Parses the fiscal year and index of a fiscal label; the caller validates the index. */
function parseFiscal(text: string, kind: FiscalKindName, re: RegExp, form: string, shape: string): { year: number; index: number } {
  const m = re.exec(text);
  if (!m) {
    const pos = text.startsWith('FY') ? 2 + firstMismatch(text.slice(2), shape.slice(2)) : 0;
    throw syntaxError('label', text, form, pos);
  }
  const year = yearFromMatch(text, m[1]!, 'label');
  requireLabelYear(text, year, 'label', 2);
  return { year, index: kind === 'fiscal-year' ? 1 : Number(m[2]) };
}

function fiscalLabel(kind: FiscalKindName, year: number, index: number): string {
  const y = `FY${formatYearLabel(year)}`;
  if (kind === 'fiscal-year') return y;
  const letter = FISCAL_LETTER[kind];
  return kind === 'fiscal-period' || kind === 'fiscal-week' ? `${y}-${letter}${pad2(index)}` : `${y}-${letter}${index}`;
}

/**
 * Labels of a fiscal unit with a fixed number of periods a year, whose ordinal is `year * perYear + index - 1`:
 * formatting, parsing (the index checked against `perYear`) and the same period one year earlier.
 */
function indexedFiscalLabels(kind: FiscalKindName, perYear: number): Pick<UnitCore, 'format' | 'parse' | 'yearEarlier'> {
  const { re, form, shape } = fiscalForm(kind, perYear);
  return {
    format: (o) => {
      const y = floorDiv(o, perYear);
      return fiscalLabel(kind, y, o - perYear * y + 1);
    },
    parse: (text) => {
      const { year, index } = parseFiscal(text, kind, re, form, shape);
      if (index < 1 || index > perYear) throw rangeError('label', text, `names ${FISCAL_LETTER[kind]}${index}; this fiscal unit has ${perYear} per year`);
      return year * perYear + index - 1;
    },
    yearEarlier: (o) => o - perYear,
  };
}

function monthFiscalCore(kind: Exclude<FiscalKindName, 'fiscal-week'>, startMonth: number, startDay: number, naming: string): UnitCore {
  const perYear = kind === 'fiscal-year' ? 1 : kind === 'fiscal-half' ? 2 : kind === 'fiscal-quarter' ? 4 : 12;
  const monthsPer = 12 / perYear;
  // A fiscal year that starts on 1 January ends in the same calendar year; any other ends in the next.
  const shift = naming === 'end-year' && !(startMonth === 1 && startDay === 1) ? 1 : 0;
  const s0 = startMonth - 1;
  const { form } = fiscalForm(kind, perYear);
  /** Continuous fiscal-month index: 12 * (fiscal start year) + (fiscal month - 1). */
  const fiscalMonthIndex = (dn: number) => {
    const p = packedYmdUnchecked(dn);
    const y = Math.floor(p / 512) + MIN_YEAR;
    const m = (p >> 5) & 15;
    const d = p & 31;
    let cm = y * 12 + m - 1;
    if (startDay > 1 && d < Math.min(startDay, dayCountOfMonthUnchecked(y, m))) cm -= 1;
    return cm - s0;
  };
  const firstDayOf = (o: number) => {
    const cm = (o - perYear * shift) * monthsPer + s0;
    const y = floorDiv(cm, 12);
    const m = cm - 12 * y + 1;
    return dayNumberFromYmdUnchecked(y, m, Math.min(startDay, dayCountOfMonthUnchecked(y, m)));
  };
  return {
    ordinalOf: (dn) => floorDiv(fiscalMonthIndex(dn), monthsPer) + perYear * shift,
    firstDayOf,
    ...indexedFiscalLabels(kind, perYear),
    kernel: { type: 'months', monthsPer, startMonthIndex: s0, startDay, addend: perYear * shift },
    labelForm: form,
  };
}

const LAYOUT_WEEKS: Record<WeekLayout, readonly number[]> = {
  '4-4-5': [4, 4, 5, 4, 4, 5, 4, 4, 5, 4, 4, 5],
  '4-5-4': [4, 5, 4, 4, 5, 4, 4, 5, 4, 4, 5, 4],
  '5-4-4': [5, 4, 4, 5, 4, 4, 5, 4, 4, 5, 4, 4],
  '13x4': [4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 4],
};

/** @internal The shape of a 52/53-week fiscal calendar: its year ends, naming and sub-period boundaries. */
export interface WeekYearCalendar {
  /** Last day of the fiscal year whose year end falls in (or nearest) month `endMonth` of `anchorYear`. */
  yearEnd(anchorYear: number): number;
  /** Anchor year of the fiscal year that holds `dayNumber`. */
  anchorYearOf(dayNumber: number): number;
  /** Named year = anchor year + this. */
  readonly nameShift: number;
  /** Day number of a day on which fiscal weeks start, on or before 1970-01-01. */
  readonly weekOrigin: number;
}

function weekYearCalendar(endWeekday: number, endMonth: number, endRule: 'last' | 'nearest', naming: string): WeekYearCalendar {
  const yearEnd = (a: number) => {
    const last = dayNumberFromYmdUnchecked(a, endMonth, dayCountOfMonthUnchecked(a, endMonth));
    const wd = weekdayOfDayNumberUnchecked(last);
    const back = (wd - endWeekday + 7) % 7;
    if (endRule === 'last') return last - back;
    const forward = (endWeekday - wd + 7) % 7;
    return forward <= 3 ? last + forward : last - back;
  };
  return {
    yearEnd,
    anchorYearOf: (dn) => {
      const p = packedYmdUnchecked(dn);
      let a = Math.floor(p / 512) + MIN_YEAR;
      if (((p >> 5) & 15) > endMonth) a += 1;
      if (dn > yearEnd(a)) a += 1;
      else if (dn <= yearEnd(a - 1)) a -= 1;
      return a;
    },
    nameShift: naming === 'end-year' || endMonth === 12 ? 0 : -1,
    weekOrigin: weekOrigin((endWeekday % 7) + 1),
  };
}

function weekFiscalCore(
  kind: FiscalKindName,
  cal: WeekYearCalendar,
  layout: WeekLayout | undefined,
  extraWeek: 'last-period' | 'first-period',
): UnitCore {
  const { yearEnd, anchorYearOf, nameShift, weekOrigin: origin } = cal;
  const yearStart = (a: number) => yearEnd(a - 1) + 1;
  const weeksIn = (a: number) => (yearEnd(a) - yearEnd(a - 1)) / 7;
  if (kind === 'fiscal-week') {
    const { re, form, shape } = fiscalForm(kind, 53);
    const split = (o: number) => {
      const first = origin + 7 * o;
      const a = anchorYearOf(first);
      return { a, week: (first - yearStart(a)) / 7 + 1 };
    };
    return {
      ordinalOf: (dn) => floorDiv(dn - origin, 7),
      firstDayOf: (o) => origin + 7 * o,
      format: (o) => {
        const { a, week } = split(o);
        return fiscalLabel(kind, a + nameShift, week);
      },
      parse: (text) => {
        const { year, index } = parseFiscal(text, kind, re, form, shape);
        const a = year - nameShift;
        const weeks = weeksIn(a);
        if (index < 1 || index > weeks) throw rangeError('label', text, `names week ${index}, but fiscal year ${fiscalLabel('fiscal-year', year, 1)} has weeks 01..${weeks}`);
        return floorDiv(yearStart(a) + 7 * (index - 1) - origin, 7);
      },
      yearEarlier: (o) => {
        const { a, week } = split(o);
        const prior = Math.min(week, weeksIn(a - 1));
        return floorDiv(yearStart(a - 1) + 7 * (prior - 1) - origin, 7);
      },
      kernel: { type: 'linear', origin, length: 7 },
      labelForm: form,
    };
  }
  const periodWeeks = layout ? LAYOUT_WEEKS[layout] : [52];
  // Base (52-week) start week of each sub-period.
  let bounds: number[];
  if (kind === 'fiscal-year') bounds = [0];
  else if (kind === 'fiscal-half') bounds = [0, 26];
  else if (kind === 'fiscal-quarter') bounds = [0, 13, 26, 39];
  else {
    bounds = [];
    let acc = 0;
    for (const w of periodWeeks) {
      bounds.push(acc);
      acc += w;
    }
  }
  const perYear = bounds.length;
  // The 53rd week goes after base week X (the end of the period that takes it); later boundaries move by one.
  const x = extraWeek === 'first-period' ? periodWeeks[0]! : 52;
  const bounds53 = bounds.map((b) => (b > 0 && b >= x ? b + 1 : b));
  const map52 = new Uint8Array(53);
  const map53 = new Uint8Array(53);
  for (let w = 0; w < 53; w++) {
    let i52 = 0;
    let i53 = 0;
    for (let k = 0; k < perYear; k++) {
      if (bounds[k]! <= w) i52 = k;
      if (bounds53[k]! <= w) i53 = k;
    }
    map52[w] = i52;
    map53[w] = i53;
  }
  const { form } = fiscalForm(kind, perYear);
  const ordinalOf = (dn: number) => {
    const a = anchorYearOf(dn);
    const start = yearStart(a);
    const w = ((dn - start) / 7) | 0;
    const idx = yearEnd(a) - start === 370 ? map53[w]! : map52[w]!;
    return (a + nameShift) * perYear + idx;
  };
  const firstDayOf = (o: number) => {
    const named = floorDiv(o, perYear);
    const idx = o - named * perYear;
    const a = named - nameShift;
    const start = yearStart(a);
    const b = yearEnd(a) - start === 370 ? bounds53 : bounds;
    return start + 7 * b[idx]!;
  };
  return {
    ordinalOf,
    firstDayOf,
    ...indexedFiscalLabels(kind, perYear),
    kernel: { type: 'weeks', origin },
    labelForm: form,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Compilation

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
  const unit: PeriodUnit = {
    id,
    definition,
    kind: u.kind,
    minOrdinal,
    maxOrdinal,
    ordinalFromDayNumber(dayNumber: number): number {
      return core.ordinalOf(requireInteger('dayNumber', dayNumber, MIN_DAY_NUMBER, MAX_DAY_NUMBER));
    },
    firstDayNumberFromOrdinal(ordinal: number): number {
      return core.firstDayOf(requireOrdinal(ordinal));
    },
    formatOrdinal(ordinal: number): string {
      return core.format(requireOrdinal(ordinal));
    },
    parseOrdinal(text: string): number {
      if (typeof text !== 'string') {
        throw new KalendsTypeError(`label: expected a string such as ${core.labelForm.replace(/^.*e\.g\. /, '')}, got ${describeValue(text)}`, {
          code: 'invalid-type',
          received: text,
        });
      }
      const o = core.parse(text);
      if (o < minOrdinal || o > maxOrdinal) {
        throw rangeError('label', text, `is outside the supported range of unit ${id} (${core.format(minOrdinal)} .. ${core.format(maxOrdinal)})`);
      }
      return o;
    },
  };
  Object.freeze(unit);
  cores.set(unit, core);
  return unit;
}

const cache = new Map<string, PeriodUnit>();
const CACHE_LIMIT = 256;

/**
 * Validates a unit definition (plain data) and compiles it into an immutable {@link PeriodUnit}. A string names a
 * calendar unit: `'day'`, `'iso-week'`, `'month'`, `'quarter'`, `'half-year'` or `'year'`. Every fault is
 * reported at once in a DefinitionError whose `issues` carry dotted paths (`start.day`, `yearEnd.rule`).
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
  const u = normalizeUnitDefinition(definition);
  const id = unitId(u);
  const hit = cache.get(id);
  if (hit && JSON.stringify(hit.definition) === JSON.stringify(canonicalDefinition(u))) return hit;
  const unit = compile(u);
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
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
  if (coreOf(input)) return input as PeriodUnit;
  if (typeof input === 'string' || (typeof input === 'object' && input !== null && 'kind' in input && !('ordinalFromDayNumber' in input))) {
    return defineUnit(input as UnitDefinition);
  }
  throw new KalendsTypeError(
    `${name}: expected a unit made by defineUnit, a unit definition such as {"kind":"month"}, or one of "day", "iso-week", "month", "quarter", "half-year", "year"; got ${describeValue(input)}`,
    { code: 'invalid-type', received: input },
  );
}

/** The calendar day as a unit: ordinal = day number, label YYYY-MM-DD. */
export const DAY_UNIT: PeriodUnit = defineUnit('day');
/** The ISO 8601 week (Monday to Sunday, week-year by the Thursday), label YYYY-Www. */
export const ISO_WEEK_UNIT: PeriodUnit = defineUnit('iso-week');
/** The calendar month, ordinal year * 12 + month - 1, label YYYY-MM. */
export const MONTH_UNIT: PeriodUnit = defineUnit('month');
/** The calendar quarter (January, April, July, October), ordinal year * 4 + quarter - 1, label YYYY-Qn. */
export const QUARTER_UNIT: PeriodUnit = defineUnit('quarter');
/** The calendar half-year, ordinal year * 2 + half - 1, label YYYY-Hn. */
export const HALF_YEAR_UNIT: PeriodUnit = defineUnit('half-year');
/** The calendar year, ordinal = year, label YYYY. */
export const YEAR_UNIT: PeriodUnit = defineUnit('year');

/**
 * The picture of one fiscal year as plain data: rows (a quarter, a period or a week each) of cells (a day or a
 * week each), with everything a cell shows and says: its date, whether it is a business day, the holidays that
 * close it, the 53rd week, today, the quarter and period boundaries, and the schedule marks. Built from the
 * library's public surface only; the page (grid.ts) turns it into markup.
 */
import {
  type BusinessCalendar,
  type Holiday,
  type PeriodUnit,
  type Profile,
  type UnitDefinition,
  calendarOfProfile,
  dayNumberFromYmd,
  defineUnit,
  formatDayForPeople,
  formatLabelForPeople,
  formatPlainDate,
  isBusinessDay,
  listHolidays,
  weekdayOfDayNumber,
  ymdFromDayNumber,
} from 'kalends';

export type RowLevel = 'quarter' | 'period' | 'week';
export type CellLevel = 'day' | 'week';

/** A unit of the picture, with the profile's name for it when the profile has one (for labels for people). */
export interface NamedUnit {
  readonly unit: PeriodUnit;
  readonly name: string | undefined;
}

/** The units one fiscal year of a profile is drawn with. */
export interface FiscalYearUnits {
  readonly name: string;
  readonly year: PeriodUnit;
  /** True for a 52/53-week year. */
  readonly byWeeks: boolean;
  /** Undefined for a 52/53-week year without a week layout. */
  readonly quarter: NamedUnit | undefined;
  readonly period: NamedUnit | undefined;
  /** The fiscal weeks of a 52/53-week year; the profile's week convention for a year of months. */
  readonly week: NamedUnit;
}

/** A mark a schedule puts on a day: where a rule's date fell, and where it was paid. */
export interface ScheduleMark {
  /** `'adjusted'`: the date after the convention; `'unadjusted'`: the rule's date that moved away. */
  readonly kind: 'adjusted' | 'unadjusted';
  readonly text: string;
}

/** What every cell has: its first day, the holidays in it, today, the 53rd week, a period start, marks, a label. */
interface CellCommon {
  readonly dayNumber: number;
  /** Names of the holidays observed in the cell (a week cell adds each one's date). */
  readonly holidays: readonly string[];
  readonly today: boolean;
  readonly extraWeek: boolean;
  readonly periodStart: boolean;
  readonly marks: readonly ScheduleMark[];
  /** Everything the cell says, for its accessible label and its tooltip. */
  readonly label: string;
}

export interface DayCell extends CellCommon {
  readonly kind: 'day';
  readonly date: string;
  readonly dayOfMonth: number;
  /** The month's short name on the first of a month, for the eye. */
  readonly monthMark: string | undefined;
  readonly business: boolean;
  readonly weekend: boolean;
}

export interface WeekCell extends CellCommon {
  readonly kind: 'week';
  readonly endDayNumber: number;
  readonly weekLabel: string;
  /** 1-based position of the week in the fiscal year. */
  readonly index: number;
  readonly businessDays: number;
}

export type Cell = DayCell | WeekCell;

export interface Row {
  readonly label: string;
  readonly peopleLabel: string | undefined;
  readonly first: number;
  readonly end: number;
  /** The quarter's label when this row starts a quarter (and rows are not quarters). */
  readonly quarterStart: string | undefined;
  /** The period's label when this row starts a period (rows of weeks). */
  readonly periodStart: string | undefined;
  /** Empty columns before the first cell, so that weekdays line up. */
  readonly offset: number;
  readonly extraWeek: boolean;
  readonly cells: readonly Cell[];
}

export interface YearView {
  readonly fiscalYear: string;
  readonly ordinal: number;
  readonly label: string;
  readonly peopleLabel: string | undefined;
  readonly first: number;
  readonly end: number;
  /** Weeks in a 52/53-week year, else undefined. */
  readonly weeks: number | undefined;
  readonly rows: readonly Row[];
  readonly columns: number;
  /** Column headings: weekday names for day cells, week positions for week cells. */
  readonly columnHeads: readonly { readonly text: string; readonly full: string }[];
  readonly calendarName: string;
  readonly businessDays: number;
  /** Weekdays (not weekend days) closed by a holiday. */
  readonly holidayClosures: number;
  readonly rowLevel: RowLevel;
  readonly cellLevel: CellLevel;
}

export interface YearChoice {
  readonly fiscalYear: string;
  readonly ordinal: number;
  readonly rows: RowLevel;
  readonly cells: CellLevel;
  readonly calendar: string;
  readonly today: number;
  readonly marks?: ReadonlyMap<number, readonly ScheduleMark[]>;
}

const FISCAL_KINDS = { quarter: 'fiscal-quarter', period: 'fiscal-period', week: 'fiscal-week' } as const;

/** The units of fiscal year `name`: the profile's own where it has them, else defined from the year's fields. */
export function unitsOfFiscalYear(profile: Profile, name: string): FiscalYearUnits {
  const year = profile.fiscalYears[name];
  const fields = profile.definition.fiscalYears?.[name];
  if (!year || !fields) throw new Error(`no fiscal year named ${JSON.stringify(name)} in this profile`);
  const byWeeks = 'yearEnd' in fields;
  const find = (level: keyof typeof FISCAL_KINDS): NamedUnit | undefined => {
    const kind = FISCAL_KINDS[level];
    for (const [unitName, unit] of Object.entries(profile.units)) {
      if (unit.kind === kind && profile.unitFiscalYears[unitName] === name) return { unit, name: unitName };
    }
    if (level === 'week' && !byWeeks) return undefined;
    if (level !== 'week' && byWeeks && !('layout' in fields && fields.layout)) return undefined;
    return { unit: defineUnit({ ...fields, kind } as UnitDefinition), name: undefined };
  };
  return {
    name,
    year,
    byWeeks,
    quarter: find('quarter'),
    period: find('period'),
    week: find('week') ?? { unit: profile.week, name: 'week' },
  };
}

/** The profile calendar names, the default first. */
export function calendarNamesOf(profile: Profile): string[] {
  const names = Object.keys(profile.calendars);
  const d = profile.defaultCalendarName;
  return d === undefined ? names : [d, ...names.filter((n) => n !== d)];
}

/** The label of a period for people, when the profile has a template for its unit. */
function peopleLabelOf(profile: Profile, named: NamedUnit | undefined, ordinal: number): string | undefined {
  if (!named?.name || !profile.labels?.units?.[named.name]) return undefined;
  return formatLabelForPeople(profile, named.name, ordinal);
}

/** Intl formats by locale and field, made once (making one costs far more than using it). */
const FORMATS = new Map<string, Intl.DateTimeFormat>();
function formatField(locale: string, field: 'weekday' | 'month', style: 'long' | 'short', dayNumber: number): string {
  const key = `${locale}|${field}|${style}`;
  let f = FORMATS.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, { [field]: style, timeZone: 'UTC' });
    FORMATS.set(key, f);
  }
  return f.format(dayNumber * 86_400_000);
}

function weekdayName(locale: string, dayNumber: number, style: 'long' | 'short'): string {
  return formatField(locale, 'weekday', style, dayNumber);
}

function monthShortName(locale: string, dayNumber: number): string {
  return formatField(locale, 'month', 'short', dayNumber);
}

/** A day for people: the profile's day template, or the weekday and ISO date. */
export function dayText(profile: Profile, dayNumber: number): string {
  const iso = formatPlainDate(dayNumber);
  const people = profile.labels ? formatDayForPeople(profile, dayNumber) : iso;
  return people === iso ? `${weekdayName(profile.labels?.locale ?? 'en-US', dayNumber, 'long')} ${iso}` : `${people} (${iso})`;
}

/** The holidays observed in [first, end) within the calendar's years, by day. */
function holidaysByDay(calendar: BusinessCalendar, first: number, end: number): Map<number, Holiday[]> {
  const out = new Map<number, Holiday[]>();
  const lo = ymdFromDayNumber(first).year < calendar.firstYear ? dayNumberFromYmd(calendar.firstYear, 1, 1) : first;
  const hi = ymdFromDayNumber(end - 1).year > calendar.lastYear ? dayNumberFromYmd(calendar.lastYear, 12, 31) + 1 : end;
  if (hi <= lo) return out;
  for (const h of listHolidays(calendar, lo, hi)) {
    const list = out.get(h.dayNumber);
    if (list) list.push(h);
    else out.set(h.dayNumber, [h]);
  }
  return out;
}

function holidayText(h: Holiday): string {
  return h.moved ? `${h.name} (observed; falls on ${h.actualDate})` : h.name;
}

/**
 * The picture of fiscal year `choice.ordinal` of the profile's fiscal year `choice.fiscalYear`. Throws when the
 * choice cannot be drawn (weeks as cells of a year of months); the page offers only what can be drawn.
 */
export function buildYearView(profile: Profile, choice: YearChoice): YearView {
  const units = unitsOfFiscalYear(profile, choice.fiscalYear);
  const calendar = calendarOfProfile(profile, choice.calendar);
  const locale = profile.labels?.locale ?? 'en-US';
  const first = units.year.firstDayNumberFromOrdinal(choice.ordinal);
  const end = units.year.firstDayNumberFromOrdinal(choice.ordinal + 1);
  const weeks = units.byWeeks ? (end - first) / 7 : undefined;
  const holidays = holidaysByDay(calendar, first, end);
  const weekend = new Set(calendar.weekend);
  const marks = choice.marks ?? new Map<number, readonly ScheduleMark[]>();
  const rowUnit = choice.rows === 'quarter' ? units.quarter : choice.rows === 'period' ? units.period : units.week;
  if (!rowUnit) throw new Error(`fiscal year ${JSON.stringify(units.name)} has no ${choice.rows}s: a 52/53-week year needs a "layout" for quarters and periods`);
  if (choice.cells === 'week' && (!units.byWeeks || choice.rows === 'week')) {
    throw new Error(units.byWeeks ? 'rows of weeks are drawn with a cell per day' : `fiscal year ${JSON.stringify(units.name)} is made of calendar months, whose weeks do not fit its periods; draw it with a cell per day`);
  }
  const weekUnit = units.week.unit;
  const firstWeek = weekUnit.ordinalFromDayNumber(first);
  // The 53rd week: the last week of a 53-week year.
  const extraWeekFirst = weeks === 53 ? end - 7 : Number.POSITIVE_INFINITY;
  const periodUnit = units.period?.unit;
  const isPeriodStart = (d: number) => periodUnit !== undefined && periodUnit.firstDayNumberFromOrdinal(periodUnit.ordinalFromDayNumber(d)) === d;
  const quarterUnit = units.quarter?.unit;

  // Columns line up by weekday: the first weekday of the year's weeks (a 52/53-week year's periods start on it).
  const anchor = weekdayOfDayNumber(units.byWeeks ? first : weekUnit.firstDayNumberFromOrdinal(firstWeek));
  let businessDays = 0;
  let holidayClosures = 0;

  const dayCell = (d: number): DayCell => {
    const wd = weekdayOfDayNumber(d);
    const business = isBusinessDay(calendar, d);
    const hs = holidays.get(d) ?? [];
    const isWeekend = weekend.has(wd);
    if (business) businessDays++;
    else if (!isWeekend) holidayClosures++;
    const extra = d >= extraWeekFirst;
    const today = d === choice.today;
    const m = marks.get(d) ?? [];
    const ymd = ymdFromDayNumber(d);
    const parts = [dayText(profile, d)];
    if (periodUnit) parts.push(periodUnit.formatOrdinal(periodUnit.ordinalFromDayNumber(d)));
    if (units.byWeeks) parts.push(`week ${weekUnit.ordinalFromDayNumber(d) - firstWeek + 1}`);
    let state = business ? 'business day' : 'closed';
    if (!business) {
      const why: string[] = [];
      if (hs.length > 0) why.push(`holiday: ${hs.map(holidayText).join('; ')}`);
      if (isWeekend) why.push('weekend');
      state += `: ${why.join(', ') || 'closing day'}`;
    } else if (hs.length > 0) state += ` (${hs.map(holidayText).join('; ')} is listed but does not close the day)`;
    let label = `${parts.join(', ')}: ${state}`;
    if (extra) label += '; in the 53rd week';
    if (today) label += '; today';
    for (const mark of m) label += `; ${mark.text}`;
    return {
      kind: 'day',
      dayNumber: d,
      date: formatPlainDate(d),
      dayOfMonth: ymd.day,
      monthMark: ymd.day === 1 ? monthShortName(locale, d) : undefined,
      business,
      weekend: isWeekend,
      holidays: hs.map((h) => h.name),
      today,
      extraWeek: extra,
      periodStart: isPeriodStart(d),
      marks: m,
      label,
    };
  };

  const weekCell = (w: number): WeekCell => {
    const a = weekUnit.firstDayNumberFromOrdinal(w);
    const b = weekUnit.firstDayNumberFromOrdinal(w + 1);
    let count = 0;
    const names: string[] = [];
    const m: ScheduleMark[] = [];
    for (let d = a; d < b; d++) {
      const cell = dayCell(d);
      if (cell.business) count++;
      for (const h of holidays.get(d) ?? []) names.push(`${h.name} (${formatPlainDate(d)})`);
      m.push(...cell.marks);
    }
    const index = w - firstWeek + 1;
    const today = choice.today >= a && choice.today < b;
    const extra = a >= extraWeekFirst;
    const weekLabel = weekUnit.formatOrdinal(w);
    let label = `${weekLabel}, ${formatPlainDate(a)} to ${formatPlainDate(b - 1)}: ${count} business day${count === 1 ? '' : 's'}`;
    if (names.length > 0) label += `; holiday: ${names.join('; ')}`;
    if (extra) label += '; the 53rd week';
    if (today) label += '; holds today';
    for (const mark of m) label += `; ${mark.text}`;
    return { kind: 'week', dayNumber: a, endDayNumber: b, weekLabel, index, businessDays: count, holidays: names, today, extraWeek: extra, periodStart: isPeriodStart(a), marks: m, label };
  };

  const rows: Row[] = [];
  const u = rowUnit.unit;
  for (let o = u.ordinalFromDayNumber(first); ; o++) {
    const rowFirst = Math.max(u.firstDayNumberFromOrdinal(o), first);
    if (rowFirst >= end) break;
    const rowEnd = Math.min(u.firstDayNumberFromOrdinal(o + 1), end);
    const cells: Cell[] = [];
    if (choice.cells === 'day') for (let d = rowFirst; d < rowEnd; d++) cells.push(dayCell(d));
    else for (let w = weekUnit.ordinalFromDayNumber(rowFirst); weekUnit.firstDayNumberFromOrdinal(w) < rowEnd; w++) cells.push(weekCell(w));
    const startsQuarter = choice.rows !== 'quarter' && quarterUnit !== undefined && quarterUnit.firstDayNumberFromOrdinal(quarterUnit.ordinalFromDayNumber(rowFirst)) === rowFirst;
    const startsPeriod = choice.rows === 'week' && isPeriodStart(rowFirst);
    rows.push({
      label: u.formatOrdinal(o),
      peopleLabel: peopleLabelOf(profile, rowUnit, o),
      first: rowFirst,
      end: rowEnd,
      quarterStart: startsQuarter ? quarterUnit!.formatOrdinal(quarterUnit!.ordinalFromDayNumber(rowFirst)) : undefined,
      periodStart: startsPeriod ? periodUnit!.formatOrdinal(periodUnit!.ordinalFromDayNumber(rowFirst)) : undefined,
      offset: choice.cells === 'day' ? (weekdayOfDayNumber(rowFirst) - anchor + 7) % 7 : 0,
      extraWeek: rowEnd > extraWeekFirst,
      cells,
    });
  }
  const columns = Math.max(...rows.map((r) => r.offset + r.cells.length));
  const columnHeads =
    choice.cells === 'day'
      ? Array.from({ length: columns }, (_, i) => {
          const d = first - ((weekdayOfDayNumber(first) - anchor + 7) % 7) + i; // a day on the column's weekday
          return { text: weekdayName(locale, d, 'short'), full: weekdayName(locale, d, 'long') };
        })
      : Array.from({ length: columns }, (_, i) => ({ text: `${i + 1}`, full: `week ${i + 1} of the row` }));
  return {
    fiscalYear: units.name,
    ordinal: choice.ordinal,
    label: units.year.formatOrdinal(choice.ordinal),
    peopleLabel: peopleLabelOf(profile, namedYearUnit(profile, units.name, units.year), choice.ordinal),
    first,
    end,
    weeks,
    rows,
    columns,
    columnHeads,
    calendarName: choice.calendar,
    // Every day of the year is drawn once, in a day cell or inside a week cell, so the counts cover the year.
    businessDays,
    holidayClosures,
    rowLevel: choice.rows,
    cellLevel: choice.cells,
  };
}

function namedYearUnit(profile: Profile, fiscalYear: string, unit: PeriodUnit): NamedUnit {
  for (const [name, u] of Object.entries(profile.units)) {
    if (u.kind === 'fiscal-year' && profile.unitFiscalYears[name] === fiscalYear) return { unit: u, name };
  }
  return { unit, name: undefined };
}

/**
 * The calendar dimension: one row per local day over a range, with the ISO week date, the Gregorian fields, every
 * unit of a profile (label, ordinal, named year, position in its year), the 53-week flags, the business-day
 * columns of one calendar, holidays, and the labels for people.
 *
 * @module
 */
import { KalendsRangeError, describeValue } from '../errors.js';
import { readOptions } from '../diagnostics/index.js';
import {
  type BusinessCalendar,
  type PeriodUnit,
  type Profile,
  MAX_DIMENSION_DAYS,
  calendarNamed,
  dayNumberFromYmd,
  fillTemplate,
  formatDayForPeople,
  formatOrdinalBulk,
  formatPlainDate,
  isBusinessDay,
  isoWeekDateFromDayNumber,
  listHolidays,
  nextBusinessDay,
  ordinalFromDayNumberBulk,
  placeOfPeriod,
  previousBusinessDay,
  requireProfile,
  templateOfUnit,
  toDayNumber,
  ymdFromDayNumber,
} from './deps.js';
import { type WarehouseColumn, type WarehouseTable, columnName } from './table.js';

/** Options of {@link dimensionTableFromProfile} and the other profile exports. */
export interface ExportRangeOptions {
  /** First local day (a date: ISO 8601 text or a day number), inclusive. Default: the profile's `warehouse.start`. */
  readonly start?: string | number;
  /** End of the range, exclusive. Default: the profile's `warehouse.end`. */
  readonly end?: string | number;
  /** The profile calendar of the business-day columns. Default: `warehouse.calendar`, then the default calendar. */
  readonly calendar?: string;
}

/** @internal The day range of an export: from the options, else from the profile's warehouse section. */
export function exportRange(profile: Profile, options: Readonly<Record<string, unknown>>): { start: number; end: number } {
  const read = (key: 'start' | 'end'): number => {
    const v = options[key];
    if (v === undefined) {
      const w = profile.warehouse;
      if (!w) {
        throw new KalendsRangeError(`options.${key}: expected a date (the profile has no "warehouse" section to take it from), got undefined`, {
          code: 'out-of-range',
          received: v,
        });
      }
      return w[key];
    }
    try {
      return toDayNumber(v);
    } catch (e) {
      throw new KalendsRangeError(`options.${key}: expected a date (ISO 8601 text or a day number), got ${describeValue(v)} (${(e as Error).message})`, {
        code: 'out-of-range',
        received: v,
      });
    }
  };
  const start = read('start');
  const end = read('end');
  if (end <= start) {
    throw new KalendsRangeError(`options.end: expected a day after start (${formatPlainDate(start)}), got ${formatPlainDate(end)}`, { code: 'out-of-range', received: end });
  }
  if (end - start > MAX_DIMENSION_DAYS) {
    throw new KalendsRangeError(`options.end: the range holds ${end - start} days, more than the ${MAX_DIMENSION_DAYS} one export may hold; export a narrower range, or several`, {
      code: 'limit-exceeded',
      received: end,
    });
  }
  return { start, end };
}

/** @internal The calendar of an export, or undefined when the profile has none. */
export function exportCalendar(profile: Profile, name: unknown): { name: string; calendar: BusinessCalendar } | undefined {
  const chosen = name !== undefined ? name : (profile.warehouse?.calendarName ?? profile.defaultCalendarName);
  if (chosen === undefined) return undefined;
  return { name: chosen as string, calendar: calendarNamed(profile, chosen, 'options.calendar') };
}

/** @internal Refuses a range outside a calendar's years, naming them. */
export function requireCalendarYears(name: string, calendar: BusinessCalendar, start: number, end: number): void {
  const first = dayNumberFromYmd(calendar.firstYear, 1, 1);
  const after = dayNumberFromYmd(calendar.lastYear, 12, 31) + 1;
  if (start < first || end > after) {
    throw new KalendsRangeError(
      `options.start..end: ${formatPlainDate(start)}..${formatPlainDate(end)} reaches beyond the years ${calendar.firstYear}..${calendar.lastYear} that calendar ${JSON.stringify(name)} supports; export a range within them`,
      { code: 'out-of-range', received: [start, end] },
    );
  }
}

function int32(name: string, description: string, n: number): { name: string; type: 'int32'; values: Int32Array; description: string } {
  return { name, type: 'int32', values: new Int32Array(n), description };
}

/** The units of a profile in export order: the week convention, then the units as the document lists them. */
function unitsOf(profile: Profile): [string, PeriodUnit][] {
  return [['week', profile.week], ...Object.entries(profile.units)];
}

/**
 * The calendar dimension of a profile: one row per local day in `[start, end)`. Columns: `day_number` and
 * `calendar_date`; the ISO 8601 week date (`iso_week_year`, `iso_week`, `iso_weekday`); `year`, `quarter`,
 * `month`, `day_of_month`, `day_of_year`; for the week convention and each unit `<unit>_label` (the canonical
 * label), `_ordinal`, `_year` (the year it is named after) and `_index` (its position in that year); for each
 * 52/53-week fiscal year `<year>_53_weeks`; with a calendar `is_business_day`, `business_day_ordinal` (business
 * days from the range's start up to and including the day), `previous_business_day`, `next_business_day`,
 * `holiday_name`, `holiday_observed_date` and `holiday_actual_date` (on both dates of a moved holiday); with a
 * `labels` section `day_text`, `month_name`, `weekday_name` and `<unit>_text` for each unit with a template.
 *
 * @example
 * ```ts
 * const table = dimensionTableFromProfile(profile, { start: '2026-01-01', end: '2027-01-01' });
 * table.rowCount; // 365
 * table.columns.map((c) => c.name).includes('fiscal_quarter_label'); // true
 * ```
 */
export function dimensionTableFromProfile(profile: Profile, options?: ExportRangeOptions): WarehouseTable {
  const p = requireProfile(profile);
  const o = readOptions('options', options, ['start', 'end', 'calendar']);
  const { start, end } = exportRange(p, o);
  const cal = exportCalendar(p, o['calendar']);
  if (cal) requireCalendarYears(cal.name, cal.calendar, start, end);
  const n = end - start;
  const columns: WarehouseColumn[] = [];
  const days = new Int32Array(n);
  for (let i = 0; i < n; i++) days[i] = start + i;
  columns.push({ name: 'day_number', type: 'int32', values: days, description: 'days since 1970-01-01 (the local date as an integer)' });
  columns.push({ name: 'calendar_date', type: 'date', values: days, description: 'the local date' });
  const isoYear = int32('iso_week_year', 'ISO 8601 week-numbering year', n);
  const isoWeek = int32('iso_week', 'ISO 8601 week 1..53', n);
  const isoDay = int32('iso_weekday', 'ISO 8601 weekday, 1 = Monday .. 7 = Sunday', n);
  const year = int32('year', 'calendar year', n);
  const quarter = int32('quarter', 'calendar quarter 1..4', n);
  const month = int32('month', 'month 1..12', n);
  const dom = int32('day_of_month', 'day of the month', n);
  const doy = int32('day_of_year', 'day of the year, 1..366', n);
  for (let i = 0; i < n; i++) {
    const d = start + i;
    const w = isoWeekDateFromDayNumber(d);
    isoYear.values[i] = w.weekYear;
    isoWeek.values[i] = w.week;
    isoDay.values[i] = w.weekday;
    const ymd = ymdFromDayNumber(d);
    year.values[i] = ymd.year;
    quarter.values[i] = ((ymd.month - 1) / 3 | 0) + 1;
    month.values[i] = ymd.month;
    dom.values[i] = ymd.day;
    doy.values[i] = d - dayNumberFromYmd(ymd.year, 1, 1) + 1;
  }
  columns.push(isoYear, isoWeek, isoDay, year, quarter, month, dom, doy);

  const texts: WarehouseColumn[] = [];
  const locale = p.labels?.locale;
  for (const [name, unit] of unitsOf(p)) {
    const col = columnName(name);
    const ordinals = ordinalFromDayNumberBulk(unit, days);
    const labels = formatOrdinalBulk(unit, ordinals);
    const named = int32(`${col}_year`, `the year the ${name} is named after`, n);
    const index = int32(`${col}_index`, `position of the ${name} in its year, from 1`, n);
    const template = locale === undefined ? undefined : templateOfUnit(p, name);
    const text: (string | null)[] | undefined = template === undefined ? undefined : new Array<string | null>(n);
    let last = Number.NaN;
    let place = { year: 0, index: 0, firstDayNumber: 0, endDayNumber: 0 };
    let lastText = '';
    for (let i = 0; i < n; i++) {
      const ord = ordinals[i]!;
      if (ord !== last) {
        place = placeOfPeriod(p, name, unit, ord);
        if (text) lastText = fillTemplate(template!, locale!, labels[i]!, place);
        last = ord;
      }
      named.values[i] = place.year;
      index.values[i] = place.index;
      if (text) text[i] = lastText;
    }
    columns.push(
      { name: `${col}_label`, type: 'string', values: labels, description: `the ${name}'s canonical label` },
      { name: `${col}_ordinal`, type: 'int32', values: ordinals, description: `the ${name}'s ordinal` },
      named,
      index,
    );
    if (text) texts.push({ name: `${col}_text`, type: 'string', values: text, description: `the ${name} written for people (${locale})` });
  }

  for (const [name, fy] of Object.entries(p.fiscalYears)) {
    if (!('yearEnd' in fy.definition)) continue;
    const flag = new Uint8Array(n);
    let last = Number.NaN;
    let long = 0;
    for (let i = 0; i < n; i++) {
      const y = fy.ordinalFromDayNumber(start + i);
      if (y !== last) {
        long = fy.firstDayNumberFromOrdinal(y + 1) - fy.firstDayNumberFromOrdinal(y) === 371 ? 1 : 0;
        last = y;
      }
      flag[i] = long;
    }
    columns.push({ name: `${columnName(name)}_53_weeks`, type: 'boolean', values: flag, description: `whether the day's ${name} fiscal year has 53 weeks` });
  }

  if (cal) columns.push(...businessColumns(cal.calendar, start, end));

  if (locale !== undefined) {
    const monthName = new Intl.DateTimeFormat(locale, { month: 'long', timeZone: 'UTC' });
    const weekdayName = new Intl.DateTimeFormat(locale, { weekday: 'long', timeZone: 'UTC' });
    const monthNames = Array.from({ length: 12 }, (_, m) => monthName.format(Date.UTC(2001, m, 15)));
    const weekdayNames = Array.from({ length: 7 }, (_, k) => weekdayName.format(Date.UTC(2001, 0, 1 + k)));
    const dayText = new Array<string | null>(n);
    const mn = new Array<string | null>(n);
    const wn = new Array<string | null>(n);
    for (let i = 0; i < n; i++) {
      dayText[i] = formatDayForPeople(p, start + i);
      mn[i] = monthNames[month.values[i]! - 1]!;
      wn[i] = weekdayNames[isoDay.values[i]! - 1]!;
    }
    columns.push(
      { name: 'day_text', type: 'string', values: dayText, description: `the day written for people (${locale})` },
      { name: 'month_name', type: 'string', values: mn, description: `the month's name (${locale})` },
      { name: 'weekday_name', type: 'string', values: wn, description: `the weekday's name (${locale})` },
      ...texts,
    );
  }
  return Object.freeze({ name: 'calendar_day', rowCount: n, columns: Object.freeze(columns), description: 'one row per local day' });
}

function businessColumns(calendar: BusinessCalendar, start: number, end: number): WarehouseColumn[] {
  const n = end - start;
  const flag = new Uint8Array(n);
  const running = new Int32Array(n);
  const prev = new Int32Array(n);
  const prevValid = new Uint8Array(n);
  const next = new Int32Array(n);
  const nextValid = new Uint8Array(n);
  let count = 0;
  let lastBusiness: number | undefined;
  try {
    lastBusiness = previousBusinessDay(calendar, start);
  } catch {
    lastBusiness = undefined; // the calendar's first supported day: none before it
  }
  for (let i = 0; i < n; i++) {
    const d = start + i;
    if (lastBusiness !== undefined) {
      prev[i] = lastBusiness;
      prevValid[i] = 1;
    }
    if (isBusinessDay(calendar, d)) {
      flag[i] = 1;
      count++;
      lastBusiness = d;
    }
    running[i] = count;
  }
  let nextBusiness: number | undefined;
  try {
    nextBusiness = nextBusinessDay(calendar, end - 1);
  } catch {
    nextBusiness = undefined;
  }
  for (let i = n - 1; i >= 0; i--) {
    if (nextBusiness !== undefined) {
      next[i] = nextBusiness;
      nextValid[i] = 1;
    }
    if (flag[i] === 1) nextBusiness = start + i;
  }
  // Holidays observed or falling in the range (a moved holiday shows on both days).
  const names = new Array<string | null>(n).fill(null);
  const observed = new Int32Array(n);
  const actual = new Int32Array(n);
  const holidayValid = new Uint8Array(n);
  const lo = Math.max(start - 14, dayNumberFromYmd(calendar.firstYear, 1, 1));
  const hi = Math.min(end + 14, dayNumberFromYmd(calendar.lastYear, 12, 31) + 1);
  for (const h of listHolidays(calendar, lo, hi)) {
    for (const d of h.dayNumber === h.actualDayNumber ? [h.dayNumber] : [h.dayNumber, h.actualDayNumber]) {
      const i = d - start;
      if (i < 0 || i >= n) continue;
      if (names[i] === null) {
        names[i] = h.name;
        observed[i] = h.dayNumber;
        actual[i] = h.actualDayNumber;
        holidayValid[i] = 1;
      } else names[i] = `${names[i]}; ${h.name}`;
    }
  }
  return [
    { name: 'is_business_day', type: 'boolean', values: flag, description: `a business day of calendar ${JSON.stringify(calendar.id)}` },
    { name: 'business_day_ordinal', type: 'int32', values: running, description: 'business days from the range start up to and including this day' },
    { name: 'previous_business_day', type: 'date', values: prev, valid: prevValid, description: 'the last business day strictly before this day' },
    { name: 'next_business_day', type: 'date', values: next, valid: nextValid, description: 'the first business day strictly after this day' },
    { name: 'holiday_name', type: 'string', values: names, description: 'the holiday observed or falling on this day (names joined by "; ")' },
    { name: 'holiday_observed_date', type: 'date', values: observed, valid: holidayValid, description: 'the day the holiday is observed' },
    { name: 'holiday_actual_date', type: 'date', values: actual, valid: holidayValid, description: 'the date its rule gives, before any weekend shift' },
  ];
}

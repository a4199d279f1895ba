/**
 * Labels for people. The canonical machine labels (`FY2026-Q1`, `2025-W07`) stay as they are and round-trip; a
 * profile may also ask for labels written for people in a locale, from a template of named fields in braces:
 * `"Q{index} FY{yearShort}"` gives "Q1 FY26"; `"{monthName} {year}"` gives "Oktober 2025" in `de-DE`. Month and
 * weekday names, digits and dates come from the runtime's Intl (ECMA-402); the template language is ours: text,
 * and field names in braces, nothing else. See docs/profiles.md, "Labels for people".
 *
 * @module
 */
import { KalendsRangeError } from '../errors.js';
import { requireWhole } from '../diagnostics/index.js';
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../bounds.js';
import { type PeriodUnit, dayNumberFromYmd, formatPlainDate, isoWeekDateFromDayNumber, weekdayOfDayNumber, ymdFromDayNumber } from './deps.js';
import type { LabelFieldName } from './document.js';
import { type Profile, requireProfile, unitNamed } from './profile.js';

/** Where a period sits: the year its labels name and its 1-based position in that year. */
export interface PeriodPlace {
  /** The named year: the fiscal year for fiscal units, the ISO week-year for ISO weeks, else the calendar year of the first day. */
  readonly year: number;
  /** 1-based position of the period in that year (the quarter number, the fiscal week number, the day of year). */
  readonly index: number;
  /** The first day of the period. */
  readonly firstDayNumber: number;
  /** The first day after the period. */
  readonly endDayNumber: number;
}

/** @internal The year and position of period `ordinal` of the profile's unit `name`. */
export function placeOfPeriod(profile: Profile, name: string, unit: PeriodUnit, ordinal: number): PeriodPlace {
  const first = unit.firstDayNumberFromOrdinal(ordinal);
  const end = unit.firstDayNumberFromOrdinal(ordinal + 1);
  const fyName = name === 'week' ? undefined : profile.unitFiscalYears[name];
  if (fyName !== undefined) {
    const fy = profile.fiscalYears[fyName]!;
    const year = fy.ordinalFromDayNumber(first);
    return { year, index: ordinal - unit.ordinalFromDayNumber(fy.firstDayNumberFromOrdinal(year)) + 1, firstDayNumber: first, endDayNumber: end };
  }
  if (unit.kind === 'iso-week') {
    const w = isoWeekDateFromDayNumber(first);
    return { year: w.weekYear, index: w.week, firstDayNumber: first, endDayNumber: end };
  }
  const year = ymdFromDayNumber(first).year;
  const jan1 = dayNumberFromYmd(year, 1, 1);
  let firstOfYear = unit.ordinalFromDayNumber(jan1);
  if (unit.firstDayNumberFromOrdinal(firstOfYear) < jan1) firstOfYear += 1;
  return { year, index: ordinal - firstOfYear + 1, firstDayNumber: first, endDayNumber: end };
}

/** Names and number formats of one locale, made once. */
interface LocaleTexts {
  readonly monthNames: readonly string[];
  readonly monthShort: readonly string[];
  readonly weekdayNames: readonly string[];
  readonly weekdayShort: readonly string[];
  readonly number: Intl.NumberFormat;
  readonly twoDigits: Intl.NumberFormat;
  readonly date: Intl.DateTimeFormat;
}

const localeCache = new Map<string, LocaleTexts>();

function textsOf(locale: string): LocaleTexts {
  let t = localeCache.get(locale);
  if (t) return t;
  const month = (style: 'long' | 'short') => {
    const f = new Intl.DateTimeFormat(locale, { month: style, timeZone: 'UTC' });
    return Array.from({ length: 12 }, (_, i) => f.format(Date.UTC(2001, i, 15)));
  };
  const weekday = (style: 'long' | 'short') => {
    const f = new Intl.DateTimeFormat(locale, { weekday: style, timeZone: 'UTC' });
    // 2001-01-01 was a Monday: index i is ISO weekday i + 1.
    return Array.from({ length: 7 }, (_, i) => f.format(Date.UTC(2001, 0, 1 + i)));
  };
  t = {
    monthNames: month('long'),
    monthShort: month('short'),
    weekdayNames: weekday('long'),
    weekdayShort: weekday('short'),
    number: new Intl.NumberFormat(locale, { useGrouping: false }),
    twoDigits: new Intl.NumberFormat(locale, { useGrouping: false, minimumIntegerDigits: 2 }),
    date: new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone: 'UTC' }),
  };
  if (localeCache.size >= 32) localeCache.delete(localeCache.keys().next().value as string);
  localeCache.set(locale, t);
  return t;
}

const FIELD = /\{([A-Za-z0-9]+)\}/g;

/** @internal Fills a template for the days [first, end) of a period placed at `place`, with its machine label. */
export function fillTemplate(template: string, locale: string, label: string, place: PeriodPlace): string {
  const t = textsOf(locale);
  const first = place.firstDayNumber;
  const middle = first + Math.floor((place.endDayNumber - 1 - first) / 2);
  const mid = ymdFromDayNumber(middle);
  const firstYmd = ymdFromDayNumber(first);
  const value = (field: LabelFieldName): string => {
    switch (field) {
      case 'label':
        return label;
      case 'year':
        return t.number.format(place.year);
      case 'yearShort':
        return t.twoDigits.format(((place.year % 100) + 100) % 100);
      case 'index':
        return t.number.format(place.index);
      case 'index2':
        return t.twoDigits.format(place.index);
      case 'month':
        return t.number.format(mid.month);
      case 'month2':
        return t.twoDigits.format(mid.month);
      case 'monthName':
        return t.monthNames[mid.month - 1]!;
      case 'monthShort':
        return t.monthShort[mid.month - 1]!;
      case 'day':
        return t.number.format(firstYmd.day);
      case 'weekdayName':
        return t.weekdayNames[weekdayOfDayNumber(first) - 1]!;
      case 'weekdayShort':
        return t.weekdayShort[weekdayOfDayNumber(first) - 1]!;
      case 'firstDate':
        return t.date.format(first * 86_400_000);
      case 'lastDate':
        return t.date.format((place.endDayNumber - 1) * 86_400_000);
    }
  };
  return template.replace(FIELD, (_, name: string) => value(name as LabelFieldName));
}

function labelsOf(profile: Profile): NonNullable<Profile['labels']> {
  if (!profile.labels) {
    throw new KalendsRangeError(`profile: profile ${JSON.stringify(profile.id)} has no "labels" section; add {"labels": {"locale": "en-US", "units": {...}}} to ask for labels for people`, {
      code: 'unsupported',
      received: profile.id,
    });
  }
  return profile.labels;
}

/** @internal The template of unit `name`, or undefined. */
export function templateOfUnit(profile: Profile, name: string): string | undefined {
  const units = profile.labels?.units;
  return units && Object.prototype.hasOwnProperty.call(units, name) ? units[name] : undefined;
}

/**
 * The label for people of period `ordinal` of the profile's unit `unitName`, from the unit's template in the
 * profile's `labels` section and its locale. Without a template for the unit, the machine label is returned.
 * Months are named after the month that holds the period's middle day (a 4-5-4 period from 2 February to
 * 1 March is "February").
 *
 * @example
 * ```ts
 * // labels: { locale: 'en-US', units: { 'fiscal-quarter': 'Q{index} FY{yearShort}' } }
 * const q = unitOfProfile(profile, 'fiscal-quarter');
 * formatLabelForPeople(profile, 'fiscal-quarter', q.ordinalFromDayNumber(dayNumberFromYmd(2025, 10, 1))); // 'Q1 FY26'
 * ```
 */
export function formatLabelForPeople(profile: Profile, unitName: string, ordinal: number): string {
  const p = requireProfile(profile);
  const labels = labelsOf(p);
  const unit = unitNamed(p, unitName, 'unitName');
  requireWhole('ordinal', ordinal, unit.minOrdinal, unit.maxOrdinal);
  const label = unit.formatOrdinal(ordinal);
  const template = templateOfUnit(p, unitName);
  if (template === undefined) return label;
  return fillTemplate(template, labels.locale, label, placeOfPeriod(p, unitName, unit, ordinal));
}

/**
 * A day written for people by the profile's `labels.day` template (the ISO 8601 date when there is none). The
 * day's `{index}` is its day of the year.
 *
 * @example
 * ```ts
 * // labels: { locale: 'de-DE', day: '{weekdayName}, {day}. {monthName} {year}' }
 * formatDayForPeople(profile, dayNumberFromYmd(2025, 10, 3)); // 'Freitag, 3. Oktober 2025'
 * ```
 */
export function formatDayForPeople(profile: Profile, dayNumber: number): string {
  const p = requireProfile(profile);
  const labels = labelsOf(p);
  requireWhole('dayNumber', dayNumber, MIN_DAY_NUMBER, MAX_DAY_NUMBER);
  const year = ymdFromDayNumber(dayNumber).year;
  const label = formatPlainDate(dayNumber);
  if (labels.day === undefined) return label;
  const index = dayNumber - dayNumberFromYmd(year, 1, 1) + 1;
  return fillTemplate(labels.day, labels.locale, label, { year, index, firstDayNumber: dayNumber, endDayNumber: dayNumber + 1 });
}

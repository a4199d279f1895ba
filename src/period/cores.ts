/**
 * @internal The compiled form of a unit (its core: day to ordinal, ordinal to first day, labels, the same period
 * some years away, and how the bulk conversion computes it), and the cores of the calendar units: day, week from
 * any weekday, ISO week, month, quarter, half-year, year and cycle. The fiscal units are in fiscal.ts.
 *
 * Ordinal origins (chosen so that an ordinal reads at a glance):
 * - day: the day number itself; week, ISO week: weeks since the week that holds 1970-01-01;
 * - cycle: cycles since the anchor cycle (the anchor cycle is 0);
 * - month, quarter, half-year, year: the civil month index (`year * 12 + month - 1`) divided by the months per
 *   period (so 2025-03 is 24302);
 * - fiscal year, half, quarter, period: `namedYear * n + (index - 1)` with n = 1, 2, 4, and 12 or 13;
 * - fiscal week: weeks since the week that holds 1970-01-01, counted from the fiscal week's first weekday.
 *
 * @module
 */
import {
  dayCountOfMonthUnchecked,
  dayNumberFromYmdUnchecked,
  dayOfPacked,
  monthIndexOfDayNumberUnchecked,
  monthOfPacked,
  packedYmdUnchecked,
  weekdayOfDayNumberUnchecked,
  yearOfDayNumberUnchecked,
  yearOfPacked,
} from '../civil/gregorian.js';
import { isoWeekOneMonday, isoWeeksInYearUnchecked } from '../civil/isoweek.js';
import { WEEKDAY_NAMES, firstDayNumberOfMonthIndex } from '../civil/names.js';
import { endLabel, formatDayLabel, formatYearLabel, labelScanner, pad2, readDayLabel, readIndex, readLiteral } from './labels.js';

/** @internal How the bulk conversion computes ordinals for a unit (see bulk.ts). */
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
  /** Returns the ordinal; throws a KalendsSyntaxError quoting the text. */
  readonly parse: (text: string) => number;
  /** The comparable period `years` (a whole number) years away: see `shiftPeriodYears` in period.ts. */
  readonly shiftYears: (ordinal: number, years: number) => number;
  readonly kernel: BulkKernel;
  /** A short description of the label form, for error messages. */
  readonly labelForm: string;
}

/** @internal */
export function floorDiv(a: number, b: number): number {
  return Math.floor(a / b);
}

/** @internal The day number of the `weekday` (1..7) on or before 1970-01-01 (a Thursday, weekday 4). */
export function weekOrigin(weekday: number): number {
  return -((4 - weekday + 7) % 7);
}

export function dayCore(): UnitCore {
  const form = 'a day label YYYY-MM-DD, e.g. "2025-03-14"';
  return {
    ordinalOf: (dn) => dn,
    firstDayOf: (o) => o,
    format: formatDayLabel,
    parse: (text) => {
      const sc = labelScanner(text, form);
      const dn = readDayLabel(sc);
      endLabel(sc);
      return dn;
    },
    // The same date `years` years away; 29 February maps to 28 February in a common year.
    shiftYears: (o, years) => {
      const p = packedYmdUnchecked(o);
      const y = yearOfPacked(p) + years;
      const m = monthOfPacked(p);
      return dayNumberFromYmdUnchecked(y, m, Math.min(dayOfPacked(p), dayCountOfMonthUnchecked(y, m)));
    },
    kernel: { type: 'linear', origin: 0, length: 1 },
    labelForm: 'YYYY-MM-DD, e.g. "2025-03-14"',
  };
}

export function weekCore(firstWeekday: number): UnitCore {
  const origin = weekOrigin(firstWeekday);
  const name = WEEKDAY_NAMES[firstWeekday - 1]!;
  const form = `the first day and one week, YYYY-MM-DD/P1W, e.g. "${formatDayLabel(origin + 7 * 2880)}/P1W" (weeks start on ${name})`;
  return {
    ordinalOf: (dn) => floorDiv(dn - origin, 7),
    firstDayOf: (o) => origin + 7 * o,
    format: (o) => `${formatDayLabel(origin + 7 * o)}/P1W`,
    parse: (text) => {
      const sc = labelScanner(text, form);
      const dn = readDayLabel(sc);
      readLiteral(sc, '/P1W');
      endLabel(sc);
      const wd = weekdayOfDayNumberUnchecked(dn);
      if (wd !== firstWeekday) sc.fail(`its first day ${text.slice(0, text.indexOf('/'))} is a ${WEEKDAY_NAMES[wd - 1]}, not a ${name}`, 0);
      return floorDiv(dn - origin, 7);
    },
    // 52 weeks a year.
    shiftYears: (o, years) => o + 52 * years,
    kernel: { type: 'linear', origin, length: 7 },
    labelForm: form,
  };
}

export function isoWeekCore(): UnitCore {
  const origin = weekOrigin(1);
  const weekYearOf = (monday: number) => yearOfDayNumberUnchecked(monday + 3); // the Thursday decides
  const form = 'an ISO 8601 week YYYY-Www, e.g. "2025-W07"';
  const fromWeek = (wy: number, week: number) => floorDiv(isoWeekOneMonday(wy) + 7 * (week - 1) - origin, 7);
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
      const sc = labelScanner(text, form);
      const wy = sc.year();
      readLiteral(sc, '-W');
      const weeks = isoWeeksInYearUnchecked(wy);
      const week = readIndex(sc, 2, 'week', 1, weeks, ` in ISO week-year ${formatYearLabel(wy)}`);
      endLabel(sc);
      return fromWeek(wy, week);
    },
    // The same week number in the week-year `years` away; week 53 maps to week 52 when that year has 52.
    shiftYears: (o, years) => {
      const monday = origin + 7 * o;
      const wy = weekYearOf(monday);
      const week = (monday - isoWeekOneMonday(wy)) / 7 + 1;
      return fromWeek(wy + years, Math.min(week, isoWeeksInYearUnchecked(wy + years)));
    },
    kernel: { type: 'linear', origin, length: 7 },
    labelForm: form,
  };
}

export function monthsCore(kind: 'month' | 'quarter' | 'half-year' | 'year'): UnitCore {
  const perYear = kind === 'month' ? 12 : kind === 'quarter' ? 4 : kind === 'half-year' ? 2 : 1;
  const monthsPer = 12 / perYear;
  const letter = kind === 'quarter' ? 'Q' : kind === 'half-year' ? 'H' : '';
  const form =
    kind === 'month'
      ? 'an ISO 8601 month YYYY-MM, e.g. "2025-03"'
      : kind === 'year'
        ? 'an ISO 8601 year YYYY, e.g. "2025"'
        : kind === 'quarter'
          ? 'a quarter YYYY-Qn (n = 1..4), e.g. "2025-Q1"'
          : 'a half-year YYYY-Hn (n = 1..2), e.g. "2025-H1"';
  return {
    ordinalOf: (dn) => floorDiv(monthIndexOfDayNumberUnchecked(dn), monthsPer),
    firstDayOf: (o) => firstDayNumberOfMonthIndex(o * monthsPer),
    format: (o) => {
      const y = floorDiv(o, perYear);
      const i = o - perYear * y + 1;
      if (kind === 'year') return formatYearLabel(y);
      if (kind === 'month') return `${formatYearLabel(y)}-${pad2(i)}`;
      return `${formatYearLabel(y)}-${letter}${i}`;
    },
    parse: (text) => {
      const sc = labelScanner(text, form);
      const y = sc.year();
      let i = 1;
      if (kind !== 'year') {
        readLiteral(sc, `-${letter}`);
        i = readIndex(sc, kind === 'month' ? 2 : 1, kind === 'month' ? 'month' : kind, 1, perYear);
      }
      endLabel(sc);
      return y * perYear + i - 1;
    },
    shiftYears: (o, years) => o + perYear * years,
    kernel: { type: 'months', monthsPer, startMonthIndex: 0, startDay: 1, addend: 0 },
    labelForm: form,
  };
}

export function cycleCore(lengthDays: number, anchorDayNumber: number, anchor: string): UnitCore {
  const form = `the first day and the cycle length, YYYY-MM-DD/P${lengthDays}D, e.g. "${anchor}/P${lengthDays}D"`;
  const suffix = `/P${lengthDays}D`;
  return {
    ordinalOf: (dn) => floorDiv(dn - anchorDayNumber, lengthDays),
    firstDayOf: (o) => anchorDayNumber + lengthDays * o,
    format: (o) => `${formatDayLabel(anchorDayNumber + lengthDays * o)}${suffix}`,
    parse: (text) => {
      // The first cycle in range may start up to a cycle (at most a century) before the first supported day.
      const sc = labelScanner(text, form, 101);
      const dn = readDayLabel(sc);
      readLiteral(sc, suffix);
      endLabel(sc);
      const offset = dn - anchorDayNumber;
      if (offset % lengthDays !== 0) sc.fail(`cycles start on ${anchor} and every ${lengthDays} days before and after it`, 0);
      return offset / lengthDays;
    },
    // The cycle that holds the day 364 days a year away from the first day.
    shiftYears: (o, years) => floorDiv(lengthDays * o + 364 * years, lengthDays),
    kernel: { type: 'linear', origin: anchorDayNumber, length: lengthDays },
    labelForm: form,
  };
}

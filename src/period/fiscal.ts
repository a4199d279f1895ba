/**
 * @internal The cores of the fiscal units: fiscal years, halves, quarters and periods of calendar months starting on
 * a fixed day, and 52/53-week fiscal years with their halves, quarters, periods (4-4-5, 4-5-4, 5-4-4, 13x4) and
 * weeks (26 U.S.C. 441(f); 26 CFR 1.441-2). Labels are `FYyyyy[-Hn|-Qn|-Pnn|-Wnn]`.
 *
 * @module
 */
import { dayCountOfMonthUnchecked, dayNumberFromYmdUnchecked, dayOfPacked, monthIndexOfPacked, monthOfPacked, packedYmdUnchecked, weekdayOfDayNumberUnchecked, yearOfPacked } from '../civil/gregorian.js';
import { dayCountOfMonthIndex, monthOfMonthIndex, yearOfMonthIndex } from '../civil/names.js';
import type { Scanner } from '../instant/scan.js';
import type { WeekLayout } from './definition.js';
import { type UnitCore, floorDiv, weekOrigin } from './cores.js';
import { endLabel, formatYearLabel, labelScanner, pad2, readIndex, readLiteral } from './labels.js';

const FISCAL_LETTER = { 'fiscal-year': '', 'fiscal-half': 'H', 'fiscal-quarter': 'Q', 'fiscal-period': 'P', 'fiscal-week': 'W' } as const;
/** @internal */
export type FiscalKindName = keyof typeof FISCAL_LETTER;

function fiscalForm(kind: FiscalKindName, perYear: number): string {
  const letter = FISCAL_LETTER[kind];
  if (kind === 'fiscal-year') return 'a fiscal year FYyyyy, e.g. "FY2026"';
  const digits = kind === 'fiscal-period' || kind === 'fiscal-week' ? 2 : 1;
  const example = kind === 'fiscal-period' ? '03' : kind === 'fiscal-week' ? '05' : '1';
  const what = { 'fiscal-half': 'fiscal half', 'fiscal-quarter': 'fiscal quarter', 'fiscal-period': 'fiscal period', 'fiscal-week': 'fiscal week' }[kind];
  const range = kind === 'fiscal-week' ? '01..53' : digits === 2 ? `01..${pad2(perYear)}` : `1..${perYear}`;
  return `a ${what} FYyyyy-${letter}${digits === 2 ? 'nn' : 'n'} (${range}), e.g. "FY2026-${letter}${example}"`;
}

/**
 * Reads `FY` and the fiscal year of a label (years up to two past the supported range: a fiscal year named after
 * its end can end a year after the last supported day), then, unless the unit is a fiscal year, `-` and its
 * letter; the caller reads the index.
 */
function readFiscalYear(text: string, kind: FiscalKindName, form: string): { sc: Scanner; year: number } {
  const sc = labelScanner(text, form, 2);
  readLiteral(sc, 'FY');
  const year = sc.year();
  if (kind !== 'fiscal-year') readLiteral(sc, `-${FISCAL_LETTER[kind]}`);
  return { sc, year };
}

const INDEX_NAME = { 'fiscal-year': 'year', 'fiscal-half': 'half', 'fiscal-quarter': 'quarter', 'fiscal-period': 'period', 'fiscal-week': 'week' } as const;

function fiscalLabel(kind: FiscalKindName, year: number, index: number): string {
  const y = `FY${formatYearLabel(year)}`;
  if (kind === 'fiscal-year') return y;
  const letter = FISCAL_LETTER[kind];
  return kind === 'fiscal-period' || kind === 'fiscal-week' ? `${y}-${letter}${pad2(index)}` : `${y}-${letter}${index}`;
}

/**
 * Labels of a fiscal unit with a fixed number of periods a year, whose ordinal is `year * perYear + index - 1`:
 * formatting, parsing (the index checked against `perYear`) and the same period some years away.
 */
function indexedFiscalLabels(kind: FiscalKindName, perYear: number): Pick<UnitCore, 'format' | 'parse' | 'shiftYears' | 'labelForm'> {
  const form = fiscalForm(kind, perYear);
  const digits = kind === 'fiscal-period' ? 2 : 1;
  return {
    format: (o) => {
      const y = floorDiv(o, perYear);
      return fiscalLabel(kind, y, o - perYear * y + 1);
    },
    parse: (text) => {
      const { sc, year } = readFiscalYear(text, kind, form);
      const index = kind === 'fiscal-year' ? 1 : readIndex(sc, digits, INDEX_NAME[kind], 1, perYear, `; this fiscal unit has ${perYear} per year`);
      endLabel(sc);
      return year * perYear + index - 1;
    },
    // The same index in the fiscal year `years` away.
    shiftYears: (o, years) => o + perYear * years,
    labelForm: form,
  };
}

export function monthFiscalCore(kind: Exclude<FiscalKindName, 'fiscal-week'>, startMonth: number, startDay: number, naming: string): UnitCore {
  const perYear = kind === 'fiscal-year' ? 1 : kind === 'fiscal-half' ? 2 : kind === 'fiscal-quarter' ? 4 : 12;
  const monthsPer = 12 / perYear;
  // A fiscal year that starts on 1 January ends in the same calendar year; any other ends in the next.
  const shift = naming === 'end-year' && !(startMonth === 1 && startDay === 1) ? 1 : 0;
  const s0 = startMonth - 1;
  /** Continuous fiscal-month index: 12 * (fiscal start year) + (fiscal month - 1). */
  const fiscalMonthIndex = (dn: number) => {
    const p = packedYmdUnchecked(dn);
    let cm = monthIndexOfPacked(p);
    if (startDay > 1 && dayOfPacked(p) < Math.min(startDay, dayCountOfMonthIndex(cm))) cm -= 1;
    return cm - s0;
  };
  const firstDayOf = (o: number) => {
    const cm = (o - perYear * shift) * monthsPer + s0;
    const y = yearOfMonthIndex(cm);
    const m = monthOfMonthIndex(cm);
    return dayNumberFromYmdUnchecked(y, m, Math.min(startDay, dayCountOfMonthUnchecked(y, m)));
  };
  return {
    ordinalOf: (dn) => floorDiv(fiscalMonthIndex(dn), monthsPer) + perYear * shift,
    firstDayOf,
    ...indexedFiscalLabels(kind, perYear),
    kernel: { type: 'months', monthsPer, startMonthIndex: s0, startDay, addend: perYear * shift },
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

export function weekYearCalendar(endWeekday: number, endMonth: number, endRule: 'last' | 'nearest', naming: string): WeekYearCalendar {
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
      let a = yearOfPacked(p);
      if (monthOfPacked(p) > endMonth) a += 1;
      if (dn > yearEnd(a)) a += 1;
      else if (dn <= yearEnd(a - 1)) a -= 1;
      return a;
    },
    nameShift: naming === 'end-year' || endMonth === 12 ? 0 : -1,
    weekOrigin: weekOrigin((endWeekday % 7) + 1),
  };
}

export function weekFiscalCore(
  kind: FiscalKindName,
  cal: WeekYearCalendar,
  layout: WeekLayout | undefined,
  extraWeek: 'last-period' | 'first-period',
): UnitCore {
  const { yearEnd, anchorYearOf, nameShift, weekOrigin: origin } = cal;
  const yearStart = (a: number) => yearEnd(a - 1) + 1;
  const weeksIn = (a: number) => (yearEnd(a) - yearEnd(a - 1)) / 7;
  if (kind === 'fiscal-week') {
    const form = fiscalForm(kind, 53);
    const split = (o: number) => {
      const first = origin + 7 * o;
      const a = anchorYearOf(first);
      return { a, week: (first - yearStart(a)) / 7 + 1 };
    };
    const fromWeek = (a: number, week: number) => floorDiv(yearStart(a) + 7 * (week - 1) - origin, 7);
    return {
      ordinalOf: (dn) => floorDiv(dn - origin, 7),
      firstDayOf: (o) => origin + 7 * o,
      format: (o) => {
        const { a, week } = split(o);
        return fiscalLabel(kind, a + nameShift, week);
      },
      parse: (text) => {
        const { sc, year } = readFiscalYear(text, kind, form);
        const a = year - nameShift;
        const weeks = weeksIn(a);
        const index = readIndex(sc, 2, 'week', 1, weeks, `; fiscal year ${fiscalLabel('fiscal-year', year, 1)} has weeks 01..${weeks}`);
        endLabel(sc);
        return fromWeek(a, index);
      },
      // The same week number in the fiscal year `years` away; week 53 maps to the last week of a 52-week year.
      shiftYears: (o, years) => {
        const { a, week } = split(o);
        return fromWeek(a + years, Math.min(week, weeksIn(a + years)));
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
  };
}


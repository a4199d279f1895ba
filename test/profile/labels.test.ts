/**
 * Labels for people in three locales (and a fourth with other digits), each checked against the runtime's
 * Intl.DateTimeFormat / Intl.NumberFormat output for the same day (ECMA-402, sections 11 and 15), and the machine
 * labels checked to stay as they are.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  KalendsRangeError,
  dayNumberFromYmd,
  defineProfile,
  formatDayForPeople,
  formatLabelForPeople,
  formatPeriod,
  parsePeriod,
  periodFromDayNumber,
  unitOfProfile,
  ymdFromDayNumber,
} from '../../src/index.js';

function profileIn(locale: string, day: string, units: Record<string, string>) {
  return defineProfile({
    id: 'labels',
    name: 'Labels',
    zone: 'America/Chicago',
    week: 'iso',
    fiscalYears: {
      federal: { start: { month: 10, day: 1 }, naming: 'end-year' },
      retail: { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' },
    },
    units: {
      'fiscal-quarter': { kind: 'fiscal-quarter', fiscalYear: 'federal' },
      'retail-period': { kind: 'fiscal-period', fiscalYear: 'retail' },
      'retail-week': { kind: 'fiscal-week', fiscalYear: 'retail' },
      month: { kind: 'month' },
    },
    labels: { locale, units, day },
  });
}

const utc = (dayNumber: number) => dayNumber * 86_400_000;
const formatters = new Map<string, Intl.DateTimeFormat>();
const intl = (locale: string, options: Intl.DateTimeFormatOptions, dayNumber: number) => {
  const key = `${locale} ${JSON.stringify(options)}`;
  let f = formatters.get(key);
  if (!f) formatters.set(key, (f = new Intl.DateTimeFormat(locale, { ...options, timeZone: 'UTC' })));
  return f.format(utc(dayNumber));
};

describe('labels for people', () => {
  const LOCALES = ['en-US', 'de-DE', 'ja-JP', 'fr-FR'];

  it.each(LOCALES)('%s: month, weekday and day fields equal Intl.DateTimeFormat on every day of 2024-2026', (locale) => {
    const p = profileIn(locale, '{weekdayName}|{weekdayShort}|{monthName}|{monthShort}|{day}|{year}|{firstDate}', { month: '{monthName} {year}' });
    const nf = new Intl.NumberFormat(locale, { useGrouping: false });
    for (let d = dayNumberFromYmd(2024, 1, 1); d < dayNumberFromYmd(2027, 1, 1); d++) {
      const { year, day } = ymdFromDayNumber(d);
      const expected = [
        intl(locale, { weekday: 'long' }, d),
        intl(locale, { weekday: 'short' }, d),
        intl(locale, { month: 'long' }, d),
        intl(locale, { month: 'short' }, d),
        nf.format(day),
        nf.format(year),
        intl(locale, { dateStyle: 'medium' }, d),
      ].join('|');
      expect(formatDayForPeople(p, d)).toBe(expected);
    }
  });

  it('a fiscal quarter written the way a company writes it, in three locales (US federal FY: 31 U.S.C. 1102, named by its end year)', () => {
    const d = dayNumberFromYmd(2025, 10, 1); // first day of FY2026
    const cases: [string, string, string][] = [
      ['en-US', 'Q{index} FY{yearShort}', 'Q1 FY26'],
      ['de-DE', '{index}. Quartal GJ {year}', '1. Quartal GJ 2026'],
      ['ja-JP', '{year}年度 第{index}四半期', '2026年度 第1四半期'],
    ];
    for (const [locale, template, expected] of cases) {
      const p = profileIn(locale, '{day}', { 'fiscal-quarter': template });
      const q = unitOfProfile(p, 'fiscal-quarter');
      expect(formatLabelForPeople(p, 'fiscal-quarter', q.ordinalFromDayNumber(d))).toBe(expected);
      // The machine label stays canonical.
      expect(formatPeriod(periodFromDayNumber(q, d))).toBe('FY2026-Q1');
    }
  });

  it('digits come from the locale (Arabic-Indic digits in ar-EG, as Intl.NumberFormat writes them)', () => {
    const p = profileIn('ar-EG', '{day}', { 'fiscal-quarter': '{index}/{year}' });
    const q = unitOfProfile(p, 'fiscal-quarter');
    const nf = new Intl.NumberFormat('ar-EG', { useGrouping: false });
    expect(formatLabelForPeople(p, 'fiscal-quarter', q.ordinalFromDayNumber(dayNumberFromYmd(2025, 10, 1)))).toBe(`${nf.format(1)}/${nf.format(2026)}`);
  });

  it('a retail period is named after the month holding its middle day, and weeks count from the retail year start', () => {
    // The 4-5-4 year ending on the Saturday nearest 31 January: FY2025 runs 2025-02-02 .. 2026-01-31 (52 weeks,
    // common practice of the retail 4-5-4 calendar); its P1 is 2025-02-02 .. 2025-03-01, mostly February.
    const p = profileIn('en-US', '{day}', { 'retail-period': '{monthName} {year} (P{index2})', 'retail-week': 'Week {index}, {year}' });
    const period = parsePeriod(unitOfProfile(p, 'retail-period'), 'FY2025-P01');
    expect(formatLabelForPeople(p, 'retail-period', period.ordinal)).toBe('February 2025 (P01)');
    const week = parsePeriod(unitOfProfile(p, 'retail-week'), 'FY2025-W05');
    expect(formatLabelForPeople(p, 'retail-week', week.ordinal)).toBe('Week 5, 2025');
  });

  it('{index} equals the number in the machine label for every fiscal unit, over random days', () => {
    const p = profileIn('en-US', '{day}', { 'fiscal-quarter': '{index}', 'retail-period': '{index2}', 'retail-week': '{index2}', month: '{month2}' });
    fc.assert(
      fc.property(fc.integer({ min: dayNumberFromYmd(1900, 1, 1), max: dayNumberFromYmd(2200, 1, 1) }), (d) => {
        for (const name of ['fiscal-quarter', 'retail-period', 'retail-week', 'month']) {
          const unit = unitOfProfile(p, name);
          const o = unit.ordinalFromDayNumber(d);
          const machine = unit.formatOrdinal(o);
          const tail = /(\d+)$/.exec(machine)![1]!;
          expect(formatLabelForPeople(p, name, o)).toBe(tail);
        }
      }),
      { seed: 41, numRuns: 400 },
    );
  });

  it('weeks from a chosen weekday count from the first such week that starts in the calendar year (brute force by day walking)', () => {
    const p = defineProfile({ id: 'sunday', name: 'Sunday weeks', zone: 'UTC', week: { firstWeekday: 'sunday' }, labels: { locale: 'en-US', units: { week: '{year}/{index}' } } });
    const week = unitOfProfile(p, 'week');
    fc.assert(
      fc.property(fc.integer({ min: dayNumberFromYmd(1900, 1, 1), max: dayNumberFromYmd(2200, 1, 1) }), (d) => {
        const o = week.ordinalFromDayNumber(d);
        const first = week.firstDayNumberFromOrdinal(o);
        const year = ymdFromDayNumber(first).year;
        // Walk from 1 January to the first Sunday on or after it, then count weeks to `first`.
        let sunday = dayNumberFromYmd(year, 1, 1);
        while (new Date(sunday * 86_400_000).getUTCDay() !== 0) sunday++;
        expect(formatLabelForPeople(p, 'week', o)).toBe(`${year}/${(first - sunday) / 7 + 1}`);
      }),
      { seed: 42, numRuns: 300 },
    );
  });

  it('without a template the machine label is returned; without a labels section it is an error', () => {
    const p = profileIn('en-US', '{day}', {});
    const m = unitOfProfile(p, 'month');
    expect(formatLabelForPeople(p, 'month', m.ordinalFromDayNumber(0))).toBe('1970-01');
    const bare = defineProfile({ id: 'bare', name: 'Bare', zone: 'UTC', week: 'iso' });
    expect(() => formatDayForPeople(bare, 0)).toThrow(KalendsRangeError);
    expect(() => formatLabelForPeople(p, 'mnth', 0)).toThrow(/did you mean "month"/);
  });
});

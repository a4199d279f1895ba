import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import { dayNumberFromYmd, ymdFromDayNumber } from '../../src/civil/index.js';
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../../src/bounds.js';
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';
import {
  DAY_UNIT,
  MONTH_UNIT,
  type Period,
  type UnitDefinition,
  comparePeriods,
  countPeriods,
  defineUnit,
  formatPeriod,
  formatOrdinalBulk,
  firstDayNumberFromOrdinalBulk,
  listOverlappingPeriods,
  listSubPeriods,
  ordinalFromDayNumberBulk,
  parsePeriod,
  isDayNumberInPeriod,
  periodFromPeriod,
  firstDayNumberAfterPeriod,
  firstDayNumberOfPeriod,
  periodFromDayNumber,
  periodFromOrdinal,
  lastDayNumberOfPeriod,
  lengthDaysOfPeriod,
  shiftPeriodYears,
  shiftPeriod,
} from '../../src/period/index.js';
import { readUnitDefinition } from '../../src/period/definition.js';
import { Issues } from '../../src/diagnostics/index.js';

const d = (y: number, m: number, day: number) => dayNumberFromYmd(y, m, day);
/** ISO date text of a day number, via the civil layer. */
const iso = (dn: number) => {
  const { year, month, day } = ymdFromDayNumber(dn);
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
};
const span = (p: Period) => `${iso(firstDayNumberOfPeriod(p))}..${iso(lastDayNumberOfPeriod(p))}`;

const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;

function definitionIssues(def: unknown): string[] {
  try {
    defineUnit(def as UnitDefinition);
  } catch (e) {
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e).toBeInstanceOf(RangeError);
    return (e as DefinitionError).issues.map((i) => `${i.path}: ${i.message}`);
  }
  throw new Error(`expected a DefinitionError for ${JSON.stringify(def)}`);
}

describe('period: calendar units', () => {
  // ISO 8601-1:2019 5.2.2 (calendar month: YYYY-MM), 5.2.3 (week: YYYY-Www), 5.2.2.1 (date YYYY-MM-DD), 5.2.2.3 (year YYYY).
  it('labels calendar periods in the ISO 8601 forms', () => {
    const day = d(2025, 3, 14);
    expect(formatPeriod(periodFromDayNumber('day', day))).toBe('2025-03-14');
    expect(formatPeriod(periodFromDayNumber('month', day))).toBe('2025-03');
    expect(formatPeriod(periodFromDayNumber('year', day))).toBe('2025');
    expect(formatPeriod(periodFromDayNumber('iso-week', d(2025, 2, 14)))).toBe('2025-W07');
    expect(formatPeriod(periodFromDayNumber('quarter', day))).toBe('2025-Q1');
    expect(formatPeriod(periodFromDayNumber('half-year', d(2025, 7, 1)))).toBe('2025-H2');
  });

  it('uses the documented ordinal origins', () => {
    expect(MONTH_UNIT.ordinalFromDayNumber(d(2025, 3, 14))).toBe(2025 * 12 + 2);
    expect(defineUnit('quarter').ordinalFromDayNumber(d(2025, 5, 1))).toBe(2025 * 4 + 1);
    expect(defineUnit('year').ordinalFromDayNumber(d(2025, 5, 1))).toBe(2025);
    expect(DAY_UNIT.ordinalFromDayNumber(12345)).toBe(12345);
    // ISO week 0 is the week of 1970-01-01 (Monday 1969-12-29 .. Sunday 1970-01-04).
    expect(defineUnit('iso-week').ordinalFromDayNumber(d(1969, 12, 29))).toBe(0);
    expect(defineUnit('iso-week').ordinalFromDayNumber(d(1969, 12, 28))).toBe(-1);
  });

  it('gives end-exclusive ranges and lengths', () => {
    const feb = parsePeriod('month', '2024-02');
    expect(span(feb)).toBe('2024-02-01..2024-02-29');
    expect(firstDayNumberAfterPeriod(feb)).toBe(d(2024, 3, 1));
    expect(lengthDaysOfPeriod(feb)).toBe(29);
    expect(lengthDaysOfPeriod(parsePeriod('year', '2100'))).toBe(365);
    expect(isDayNumberInPeriod(feb, d(2024, 2, 29))).toBe(true);
    expect(isDayNumberInPeriod(feb, d(2024, 3, 1))).toBe(false);
  });

  it('weeks start on any weekday and are labelled by first day and length (ISO 8601 interval start/duration)', () => {
    const friWeeks = defineUnit({ kind: 'week', firstWeekday: 'saturday' }); // weeks ending Friday
    const p = periodFromDayNumber(friWeeks, d(2025, 3, 14)); // a Friday
    expect(formatPeriod(p)).toBe('2025-03-08/P1W');
    expect(span(p)).toBe('2025-03-08..2025-03-14');
    expect(parsePeriod(friWeeks, '2025-03-08/P1W')).toEqual(p);
    expect(() => parsePeriod(friWeeks, '2025-03-09/P1W')).toThrow(/2025-03-09 is a sunday/);
  });

  it('cycles of n days count from their anchor', () => {
    const pay = defineUnit({ kind: 'cycle', lengthDays: 14, anchor: '2025-01-03' });
    expect(pay.ordinalFromDayNumber(d(2025, 1, 3))).toBe(0);
    expect(pay.ordinalFromDayNumber(d(2025, 1, 2))).toBe(-1);
    const p = periodFromDayNumber(pay, d(2025, 3, 13)); // 2025-01-03 + 4 * 14 days = 2025-02-28
    expect(formatPeriod(p)).toBe('2025-02-28/P14D');
    expect(formatPeriod(periodFromDayNumber(pay, d(2025, 3, 14)))).toBe('2025-03-14/P14D');
    expect(span(p)).toBe('2025-02-28..2025-03-13');
    expect(() => parsePeriod(pay, '2025-03-01/P14D')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod(pay, '2025-02-28/P7D')).toThrow(/2025-02-28\/P7D/);
  });

  it('arithmetic: shift, count, compare', () => {
    const q = parsePeriod('quarter', '2025-Q4');
    expect(formatPeriod(shiftPeriod(q, 1))).toBe('2026-Q1');
    expect(formatPeriod(shiftPeriod(q, -8))).toBe('2023-Q4');
    expect(countPeriods(parsePeriod('month', '2025-01'), parsePeriod('month', '2026-03'))).toBe(14);
    expect(comparePeriods(parsePeriod('year', '2024'), parsePeriod('year', '2025'))).toBe(-1);
    expect(comparePeriods(parsePeriod('year', '2025'), parsePeriod('year', '2025'))).toBe(0);
    expect(() => countPeriods(parsePeriod('year', '2024'), parsePeriod('month', '2025-01'))).toThrow(KalendsTypeError);
    expect(() => shiftPeriod(q, 0.5)).toThrow(KalendsRangeError);
  });

  it('sub-periods tile exactly or the call says which period crosses', () => {
    expect(listSubPeriods(parsePeriod('quarter', '2025-Q2'), 'month').map(formatPeriod)).toEqual(['2025-04', '2025-05', '2025-06']);
    expect(listSubPeriods(parsePeriod('month', '2025-02'), 'day')).toHaveLength(28);
    expect(() => listSubPeriods(parsePeriod('month', '2025-03'), 'iso-week')).toThrow(/2025-W09 crosses/);
    expect(listOverlappingPeriods(parsePeriod('month', '2025-03'), 'iso-week').map(formatPeriod)).toEqual([
      '2025-W09',
      '2025-W10',
      '2025-W11',
      '2025-W12',
      '2025-W13',
      '2025-W14',
    ]);
    expect(formatPeriod(periodFromPeriod('quarter', parsePeriod('month', '2025-05')))).toBe('2025-Q2');
    expect(() => listSubPeriods(parsePeriod('year', '2025'), { kind: 'cycle', lengthDays: 1, anchor: '2025-01-01' })).not.toThrow();
  });

  it('year earlier: same index, ISO week 53 -> 52, 29 February -> 28 February', () => {
    expect(formatPeriod(shiftPeriodYears(parsePeriod('month', '2025-03'), -1))).toBe('2024-03');
    expect(formatPeriod(shiftPeriodYears(parsePeriod('iso-week', '2026-W53'), -1))).toBe('2025-W52');
    expect(formatPeriod(shiftPeriodYears(parsePeriod('iso-week', '2021-W01'), -1))).toBe('2020-W01');
    expect(formatPeriod(shiftPeriodYears(parsePeriod('day', '2024-02-29'), -1))).toBe('2023-02-28');
    const sat = defineUnit({ kind: 'week', firstWeekday: 'saturday' });
    expect(firstDayNumberOfPeriod(shiftPeriodYears(parsePeriod(sat, '2025-03-08/P1W'), -1))).toBe(d(2025, 3, 8) - 364);
  });

  it('expanded years (ISO 8601-1:2019 4.3.2, six digits and a sign as in RFC 9557) round-trip', () => {
    const far = periodFromDayNumber('month', d(12025, 3, 1));
    expect(formatPeriod(far)).toBe('+012025-03');
    expect(parsePeriod('month', '+012025-03')).toEqual(far);
    expect(formatPeriod(periodFromDayNumber('day', d(-44, 3, 15)))).toBe('-000044-03-15');
    expect(formatPeriod(periodFromDayNumber('year', d(0, 6, 1)))).toBe('0000');
    expect(() => parsePeriod('year', '-000000')).toThrow(KalendsSyntaxError);
  });

  it('bulk conversions equal the scalar ones, and ordinals go to labels and first days', () => {
    const days = Int32Array.of(0, 31, 59, d(2025, 3, 14), MIN_DAY_NUMBER, MAX_DAY_NUMBER);
    const ords = ordinalFromDayNumberBulk('month', days);
    expect([...ords]).toEqual([...days].map((x) => MONTH_UNIT.ordinalFromDayNumber(x)));
    expect(formatOrdinalBulk('month', ords.subarray(0, 4))).toEqual(['1970-01', '1970-02', '1970-03', '2025-03']);
    expect([...firstDayNumberFromOrdinalBulk('month', ords.subarray(0, 3))]).toEqual([0, 31, 59]);
    expect(() => ordinalFromDayNumberBulk('month', Float64Array.of(1.5))).toThrow(/dayNumbers\[0\]/);
    expect(() => ordinalFromDayNumberBulk('month', [0, MAX_DAY_NUMBER + 1])).toThrow(/dayNumbers\[1\]/);
    expect(() => ordinalFromDayNumberBulk('month', [0, 1], new Int32Array(1))).toThrow(/at least 2 elements/);
  });
});

describe('period: fiscal years of calendar months', () => {
  const usQ = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });

  it('quarters, halves, periods and years with their labels', () => {
    expect(formatPeriod(periodFromDayNumber(usQ, d(2025, 10, 1)))).toBe('FY2026-Q1');
    expect(formatPeriod(periodFromDayNumber(usQ, d(2025, 9, 30)))).toBe('FY2025-Q4');
    const half = defineUnit({ kind: 'fiscal-half', start: { month: 10, day: 1 }, naming: 'end-year' });
    expect(formatPeriod(periodFromDayNumber(half, d(2026, 4, 1)))).toBe('FY2026-H2');
    const per = defineUnit({ kind: 'fiscal-period', start: { month: 10, day: 1 }, naming: 'end-year' });
    const p3 = parsePeriod(per, 'FY2026-P03');
    expect(span(p3)).toBe('2025-12-01..2025-12-31');
    expect(listSubPeriods(parsePeriod(usQ, 'FY2026-Q1'), 'month').map(formatPeriod)).toEqual(['2025-10', '2025-11', '2025-12']);
    expect(listSubPeriods(parsePeriod(usQ, 'FY2026-Q1'), per).map(formatPeriod)).toEqual(['FY2026-P01', 'FY2026-P02', 'FY2026-P03']);
  });

  it('a start on 1 January names the fiscal year after the calendar year under both conventions', () => {
    for (const naming of ['end-year', 'start-year'] as const) {
      const u = defineUnit({ kind: 'fiscal-year', start: { month: 1, day: 1 }, naming });
      expect(formatPeriod(periodFromDayNumber(u, d(2025, 6, 1)))).toBe('FY2025');
    }
  });

  it('fiscal months start on the start day, clamped to the end of shorter months', () => {
    const u = defineUnit({ kind: 'fiscal-period', start: { month: 1, day: 31 }, naming: 'start-year' });
    expect(span(parsePeriod(u, 'FY2024-P01'))).toBe('2024-01-31..2024-02-28');
    expect(span(parsePeriod(u, 'FY2024-P02'))).toBe('2024-02-29..2024-03-30');
    expect(span(parsePeriod(u, 'FY2025-P02'))).toBe('2025-02-28..2025-03-30');
    expect(span(parsePeriod(u, 'FY2024-P12'))).toBe('2024-12-31..2025-01-30');
  });

  it('fiscal labels of another unit or malformed give a KalendsSyntaxError quoting the label', () => {
    for (const bad of ['2025-Q1', 'FY2026Q1', 'FY26-Q1', 'FY2026-P1', 'fy2026-Q1', '', 'FY2026-Q1 ']) {
      let caught: unknown;
      try {
        parsePeriod(usQ, bad);
      } catch (e) {
        caught = e;
      }
      expect(caught, bad).toBeInstanceOf(KalendsSyntaxError);
      expect((caught as Error).message).toContain(JSON.stringify(bad));
    }
    expect(() => parsePeriod(usQ, 'FY2026-Q5')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod(usQ, 42 as unknown as string)).toThrow(KalendsTypeError);
  });
});

describe('period: 52/53-week fiscal years', () => {
  const year = defineUnit({ kind: 'fiscal-year', ...RETAIL });
  const period = defineUnit({ kind: 'fiscal-period', ...RETAIL });
  const quarter = defineUnit({ kind: 'fiscal-quarter', ...RETAIL });
  const week = defineUnit({ kind: 'fiscal-week', ...RETAIL });

  it('the 53rd week goes to the last period by default (4-5-4 becomes 4-5-5 in the last quarter) and is week 53', () => {
    const fy = parsePeriod(year, 'FY2023');
    expect(lengthDaysOfPeriod(fy)).toBe(371);
    const weeks = listSubPeriods(parsePeriod(quarter, 'FY2023-Q4'), period).map((p) => lengthDaysOfPeriod(p) / 7);
    expect(weeks).toEqual([4, 5, 5]);
    const last = listSubPeriods(fy, week).at(-1)!;
    expect(formatPeriod(last)).toBe('FY2023-W53');
    expect(formatPeriod(periodFromPeriod(period, last))).toBe('FY2023-P12');
    expect(() => parsePeriod(week, 'FY2024-W53')).toThrow(/has weeks 01..52/);
  });

  it('extraWeek "first-period" lengthens the first period instead', () => {
    const first = defineUnit({ kind: 'fiscal-period', ...RETAIL, extraWeek: 'first-period' });
    const p = listSubPeriods(parsePeriod(year, 'FY2023'), first).map((x) => lengthDaysOfPeriod(x) / 7);
    expect(p).toEqual([5, 5, 4, 4, 5, 4, 4, 5, 4, 4, 5, 4]);
    const q = defineUnit({ kind: 'fiscal-quarter', ...RETAIL, extraWeek: 'first-period' });
    expect(listSubPeriods(parsePeriod(year, 'FY2023'), q).map((x) => lengthDaysOfPeriod(x) / 7)).toEqual([14, 13, 13, 13]);
  });

  it('13x4 layouts have thirteen periods, the 13th taking the 53rd week; quarters stay 13 weeks', () => {
    const p13 = defineUnit({ kind: 'fiscal-period', ...RETAIL, layout: '13x4' });
    const ps = listSubPeriods(parsePeriod(year, 'FY2023'), p13);
    expect(ps.map(formatPeriod).at(-1)).toBe('FY2023-P13');
    expect(ps.map((x) => lengthDaysOfPeriod(x) / 7)).toEqual([4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 4, 5]);
    const q13 = defineUnit({ kind: 'fiscal-quarter', ...RETAIL, layout: '13x4' });
    expect(listSubPeriods(parsePeriod(year, 'FY2022'), q13).map((x) => lengthDaysOfPeriod(x) / 7)).toEqual([13, 13, 13, 13]);
  });

  it('year earlier: fiscal week 53 maps to week 52; other units keep their index', () => {
    expect(formatPeriod(shiftPeriodYears(parsePeriod(week, 'FY2024-W10'), -1))).toBe('FY2023-W10');
    expect(formatPeriod(shiftPeriodYears(parsePeriod(week, 'FY2023-W53'), -1))).toBe('FY2022-W52');
    expect(formatPeriod(shiftPeriodYears(parsePeriod(period, 'FY2024-P12'), -1))).toBe('FY2023-P12');
  });

  it('names a December year end after its anchor month even when it ends in January', () => {
    const dec = defineUnit({ kind: 'fiscal-year', yearEnd: { weekday: 'saturday', month: 12, rule: 'nearest' }, naming: 'end-year' });
    // The Saturday nearest 31 December 2022 is 31 December 2022; nearest 31 December 2016 is 31 December 2016;
    // nearest 31 December 2021 is 1 January 2022 (computed below with Temporal, ECMA-262 Temporal proposal).
    const nearest = (y: number) => {
      const end = Temporal.PlainDate.from({ year: y, month: 12, day: 31 });
      const f = (6 - end.dayOfWeek + 7) % 7;
      return f <= 3 ? end.add({ days: f }) : end.subtract({ days: 7 - f });
    };
    expect(iso(lastDayNumberOfPeriod(parsePeriod(dec, 'FY2021')))).toBe(nearest(2021).toString());
    expect(nearest(2021).toString()).toBe('2022-01-01');
    expect(iso(firstDayNumberOfPeriod(parsePeriod(dec, 'FY2022')))).toBe('2022-01-02');
  });

  it('a fiscal-week unit needs a week-based year; halves, quarters and periods need a layout', () => {
    expect(definitionIssues({ kind: 'fiscal-week', start: { month: 1, day: 1 }, naming: 'end-year' })).toEqual([
      'kind: fiscal weeks need a 52/53-week year: give "yearEnd" instead of "start"',
    ]);
    expect(definitionIssues({ kind: 'fiscal-quarter', yearEnd: RETAIL.yearEnd, naming: 'end-year' })[0]).toMatch(/^layout: required/);
  });
});

describe('period: bad definitions and out-of-range periods', () => {
  it('rejects each fault with its path and the value received', () => {
    expect(definitionIssues({ kind: 'fiscal-year', start: { month: 13, day: 1 }, naming: 'end-year' })).toEqual([
      'start.month: expected an integer from 1 to 12, got 13',
    ]);
    expect(definitionIssues({ kind: 'fiscal-year', start: { month: 6, day: 31 }, naming: 'end-year' })).toEqual([
      'start.day: expected 1..30 for month 6, got 31',
    ]);
    expect(definitionIssues({ kind: 'fiscal-year', start: { month: 2, day: 29 }, naming: 'end-year' })[0]).toMatch(
      /^start\.day: expected 1\.\.28 for month 2, got 29 \(29 February exists only in leap years/,
    );
    expect(definitionIssues({ kind: 'week', firstWeekday: 'fri' })).toEqual([
      'firstWeekday: expected one of "monday", "tuesday", "wednesday", "thursday", "friday", "saturday", "sunday", got "fri"',
    ]);
    expect(definitionIssues({ kind: 'week', firstWeekday: 'Friday' })[0]).toMatch(/use "friday" instead/);
    expect(definitionIssues({ kind: 'fiscal-quarter', ...RETAIL, layout: '4-4-4' })).toEqual([
      'layout: expected one of "4-4-5", "4-5-4", "5-4-4", "13x4", got "4-4-4"; did you mean "4-4-5" or "4-5-4" or "5-4-4"?',
    ]);
    expect(definitionIssues({ kind: 'cycle', lengthDays: 0, anchor: '2025-01-03' })).toEqual([
      'lengthDays: expected an integer from 1 to 36525, got 0',
    ]);
    expect(definitionIssues({ kind: 'fiscal-year', start: { month: 10, day: 1 } })[0]).toMatch(/^naming: .*there is no default, got undefined/);
    expect(definitionIssues({ kind: 'monthly' })[0]).toMatch(/^kind: expected one of .*got "monthly"/);
    expect(definitionIssues({ kind: 'month', start: 1 })).toEqual(['start: unknown field for kind "month"; valid fields are "kind"']);
    expect(definitionIssues({ kind: 'fiscal-year', ...RETAIL, yearEnd: { weekday: 'friday', month: 0, rule: 'closest' } })).toEqual([
      'yearEnd.month: expected an integer from 1 to 12, got 0',
      `yearEnd.rule: expected "last" (the last such weekday in the month) or "nearest" (the one nearest the month's last day), got "closest"`,
    ]);
  });

  it('reports issues under a caller-given path for embedding', () => {
    const issues = new Issues();
    readUnitDefinition({ kind: 'fiscal-year', start: { month: 6, day: 31 }, naming: 'end-year' }, 'fiscal', issues);
    expect(issues.list).toEqual([{ path: 'fiscal.start.day', message: 'expected 1..30 for month 6, got 31' }]);
  });

  it('periods past the supported range give KalendsRangeError', () => {
    const m = MONTH_UNIT;
    expect(() => periodFromOrdinal(m, m.maxOrdinal + 1)).toThrow(KalendsRangeError);
    expect(() => shiftPeriod(periodFromOrdinal(m, m.maxOrdinal), 1)).toThrow(/outside the supported range/);
    expect(() => shiftPeriod(periodFromOrdinal(m, m.minOrdinal), -1)).toThrow(KalendsRangeError);
    expect(() => m.ordinalFromDayNumber(MAX_DAY_NUMBER + 1)).toThrow(/dayNumber: expected an integer/);
    expect(() => parsePeriod('year', '+275761')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod('year', '+999999')).toThrow(/outside the supported years/);
    expect(() => m.firstDayNumberFromOrdinal(Number.NaN)).toThrow(KalendsRangeError);
    expect(() => formatPeriod({ unit: m, ordinal: m.maxOrdinal + 1 })).toThrow(/p\.ordinal/);
    expect(() => formatPeriod({ unit: { ...m }, ordinal: 1 } as Period)).toThrow(KalendsTypeError);
    expect(() => periodFromDayNumber({ kind: 'month' }, MIN_DAY_NUMBER)).not.toThrow();
  });

  it('malformed calendar labels quote the label', () => {
    expect(() => parsePeriod('month', '2025-3')).toThrow('"2025-3"');
    expect(() => parsePeriod('month', '2025-13')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod('iso-week', '2025-W7')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod('quarter', '2025-03')).toThrow(/is not a quarter YYYY-Qn/);
    expect(() => parsePeriod('day', '2025-02-30')).toThrow(KalendsSyntaxError);
    expect(() => parsePeriod('day', '20250214')).toThrow(KalendsSyntaxError);
  });
});

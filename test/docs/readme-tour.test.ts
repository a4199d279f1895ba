/**
 * The README's tour, statement by statement, with the values its comments promise. Facts behind the values:
 * US DST rules (Energy Policy Act of 2005, section 110: 2025-03-09 and 2025-11-02), the US federal fiscal year
 * (31 U.S.C. 1102), the NRF 4-5-4 calendar (fiscal 2025 began 2025-02-02, from memory), US federal holidays
 * (5 U.S.C. 6103 with the observance rule for weekend holidays), ISDA 2006 Definitions section 4.12.
 */
import { describe, expect, it } from 'vitest';
import {
  adjustDayNumber, bucketSeries, countBusinessDays, lengthMsOfDayNumber, defineRule, defineUnit, epochMsFromWallMs,
  formatInstant, formatPeriod, formatPlainDate, formatOrdinalBulk, listHolidays, listOccurrenceDayNumbers,
  ordinalFromEpochMsBulk, parseInstant, parsePlainDate, parsePlainDateTime, periodFromEpochMs, resolveWallMs,
  rollSeries, seriesFromRecords, shiftBusinessDays,
} from '../../src/index.js';

describe('README tour', () => {
  const ny = 'America/New_York';
  const sale = parseInstant('2025-11-28T23:30:00-05:00').epochMs;

  it('zones', () => {
    const gap = parsePlainDateTime('2025-03-09T02:30');
    expect(resolveWallMs(ny, gap).kind).toBe('gap');
    expect(formatInstant(epochMsFromWallMs(ny, gap, 'compatible'))).toBe('2025-03-09T07:30:00Z');
    expect(lengthMsOfDayNumber(ny, parsePlainDate('2025-11-02')) / 3_600_000).toBe(25);
  });

  it('reporting periods', () => {
    const fiscalQuarter = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    expect(formatPeriod(periodFromEpochMs(fiscalQuarter, ny, sale))).toBe('FY2026-Q1');
    const retailWeek = defineUnit({ kind: 'fiscal-week', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year' });
    expect(formatPeriod(periodFromEpochMs(retailWeek, ny, sale))).toBe('FY2025-W43');
    const ordinals = ordinalFromEpochMsBulk(fiscalQuarter, ny, Float64Array.of(sale, Date.parse('2026-01-01T03:00Z')));
    expect(formatOrdinalBulk(fiscalQuarter, ordinals)).toEqual(['FY2026-Q1', 'FY2026-Q1']);
  });

  it('business days', () => {
    expect(formatPlainDate(shiftBusinessDays('us-federal', parsePlainDate('2025-11-26'), 2))).toBe('2025-12-01');
    expect(formatPlainDate(adjustDayNumber('us-federal', parsePlainDate('2026-01-31'), 'modified-following'))).toBe('2026-01-30');
    expect(countBusinessDays('us-federal', parsePlainDate('2025-12-01'), parsePlainDate('2026-01-01'))).toBe(22);
    expect(listHolidays('us-federal', parsePlainDate('2021-12-01'), parsePlainDate('2022-01-01')).map((h) => h.date)).toEqual([
      '2021-12-24',
      '2021-12-31',
    ]);
  });

  it('schedules', () => {
    const supplierPay = defineRule({
      kind: 'monthly', on: [{ day: 15 }, { businessDay: 'last' }], calendar: 'us-federal', convention: 'modified-following',
    });
    expect(listOccurrenceDayNumbers(supplierPay, '2025-05-01', '2025-07-01').map(formatPlainDate)).toEqual([
      '2025-05-15', '2025-05-30', '2025-06-16', '2025-06-30',
    ]);
  });

  it('series', () => {
    const sales = seriesFromRecords([
      { at: '2025-03-01T15:20:00-06:00', value: 12.5 },
      { at: '2025-03-31T23:10:00-05:00', value: 30 },
      { at: '2025-04-01T09:05:00-05:00', value: 8 },
    ]);
    const monthly = bucketSeries(sales, { unit: 'month', zone: 'America/Chicago', aggregations: ['sum', 'count'] });
    expect(monthly.labels).toEqual(['2025-03', '2025-04']);
    expect(Array.from(monthly.columns.sum!)).toEqual([42.5, 8]);
    const rolled = rollSeries(sales, { window: { span: 'P30D', zone: 'America/Chicago' }, aggregations: ['mean'] });
    expect(Array.from(rolled.columns.mean!)).toEqual([12.5, 30, 19]);
  });
});

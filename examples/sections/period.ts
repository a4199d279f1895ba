import {
  defineUnit,
  formatPeriod,
  formatPlainDate,
  formatOrdinalBulk,
  listSubPeriods,
  ordinalFromEpochMsBulk,
  parsePeriod,
  firstDayNumberOfPeriod,
  periodFromEpochMs,
  lastDayNumberOfPeriod,
  lengthDaysOfPeriod,
  firstEpochMsOfPeriod,
  shiftPeriodYears,
  formatInstant,
  offsetSecondsFromEpochMs,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';
import { BOOKING_ZONE, inventedSales } from '../scenario.js';

/** The wholesale business: fiscal years from 1 October, named by the year in which they end. */
const WHOLESALE = { start: { month: 10, day: 1 }, naming: 'end-year' } as const;
/** The shops: a 4-5-4 retail calendar ending on the Saturday nearest 31 January, named by its start year. */
const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;

export const section: DemoSection = {
  title: 'Reporting periods: the wholesale fiscal year and the shops\' 4-5-4 calendar',
  run(print) {
    const wholesaleQuarter = defineUnit({ kind: 'fiscal-quarter', ...WHOLESALE });
    const retailYear = defineUnit({ kind: 'fiscal-year', ...RETAIL });
    const retailMonth = defineUnit({ kind: 'fiscal-period', ...RETAIL });
    const retailWeek = defineUnit({ kind: 'fiscal-week', ...RETAIL });

    // A few invented events, placed in both calendars on the booking zone's local date.
    const events = [
      ['Autumn price list published', '2024-09-30T23:30:00-05:00'],
      ['Harbour Row shop opens', '2024-11-02T09:00:00-05:00'],
      ['Year-end stock count', '2025-02-01T18:00:00-06:00'],
    ] as const;
    for (const [what, when] of events) {
      const ms = Date.parse(when);
      const q = periodFromEpochMs(wholesaleQuarter, BOOKING_ZONE, ms);
      const w = periodFromEpochMs(retailWeek, BOOKING_ZONE, ms);
      print(`${what} (${when}): wholesale ${formatPeriod(q)}, shops ${formatPeriod(w)} in ${formatPeriod(periodFromEpochMs(retailMonth, BOOKING_ZONE, ms))}`);
    }

    // The shops' FY2024 (a 52-week year) and its periods.
    const fy = parsePeriod(retailYear, 'FY2024');
    print(`Shops' ${formatPeriod(fy)}: ${formatPlainDate(firstDayNumberOfPeriod(fy))} to ${formatPlainDate(lastDayNumberOfPeriod(fy))}, ${lengthDaysOfPeriod(fy) / 7} weeks;`);
    print(`  it starts at ${formatInstant(firstEpochMsOfPeriod(fy, BOOKING_ZONE), { offsetSeconds: offsetSecondsFromEpochMs(BOOKING_ZONE, firstEpochMsOfPeriod(fy, BOOKING_ZONE)) })} in ${BOOKING_ZONE}.`);

    // Invented sales for two retail years, bucketed into retail months in one pass, then compared year over year.
    const startMs = Date.parse('2023-01-29T06:00:00Z');
    const sales = inventedSales(startMs, 2 * 371);
    const times = Float64Array.from(sales, (s) => s.epochMs);
    const ordinals = ordinalFromEpochMsBulk(retailMonth, BOOKING_ZONE, times);
    const totals = new Map<number, number>();
    ordinals.forEach((o, i) => totals.set(o, (totals.get(o) ?? 0) + sales[i]!.amount));
    print(`${sales.length} invented sales bucketed into ${totals.size} retail months; FY2024 against the year before:`);
    const months = listSubPeriods(fy, retailMonth);
    const labels = formatOrdinalBulk(retailMonth, months.map((p) => p.ordinal));
    months.forEach((p, i) => {
      const prior = shiftPeriodYears(p, -1);
      const now = totals.get(p.ordinal) ?? 0;
      const before = totals.get(prior.ordinal) ?? 0;
      const change = before > 0 ? `${(((now - before) / before) * 100).toFixed(1).padStart(6)}%` : '     -';
      print(`  ${labels[i]} (${lengthDaysOfPeriod(p) / 7} wk)  $${now.toFixed(2).padStart(10)}  vs ${formatPeriod(prior)} (${lengthDaysOfPeriod(prior) / 7} wk) $${before.toFixed(2).padStart(10)}  ${change}`);
    });
    print('(FY2023 had 53 weeks: its P12 is five weeks long, so the January comparison is five weeks against four.)');
  },
};

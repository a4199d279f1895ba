/**
 * Demo section for the series layer: the shops' invented sales bucketed by fiscal week of the 4-5-4 retail
 * calendar, smoothed, compared year over year, and drawn as an SVG chart with vega-lite. `salesChartSvg` is
 * also used by scripts/draw-series-chart.ts to write docs/img/series-fiscal-weeks.svg.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  type Series,
  alignSeries,
  bucketSeries,
  defineUnit,
  formatPlainDate,
  joinAsOf,
  periodChangeFromBuckets,
  rollSeries,
  seriesFromBuckets,
  seriesFromColumns,
  seriesFromRecords,
  smoothSeries,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';
import { BOOKING_ZONE, inventedSales } from '../scenario.js';

/** The shops' 4-5-4 retail calendar (as in the period section): years end on the Saturday nearest 31 January. */
const RETAIL = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' } as const;
const retailWeek = defineUnit({ kind: 'fiscal-week', ...RETAIL });
const retailQuarter = defineUnit({ kind: 'fiscal-quarter', ...RETAIL });

/** Fiscal years 2024 and 2025 of the retail calendar: 2024-02-04 to 2026-01-31. */
const FIRST_DAY = Date.UTC(2024, 1, 4);
const DAYS = 728;

/** The invented sales as a series (one row per sale, amount in dollars). */
export function salesSeries(): Series {
  return seriesFromRecords(inventedSales(FIRST_DAY, DAYS), { at: 'epochMs', columns: ['amount'] });
}

/** Weekly totals by fiscal week and their 4-week rolling mean. */
export function weeklySales(sales: Series = salesSeries()) {
  const weekly = bucketSeries(sales, {
    unit: retailWeek,
    zone: BOOKING_ZONE,
    aggregations: ['sum', 'count'],
    range: { start: 'FY2024-W01', end: 'FY2026-W01' },
    empty: 'zero',
  });
  const rolling = rollSeries(seriesFromBuckets(weekly), { window: { rows: 4 }, aggregations: ['mean'], column: 'sum', minObservations: 4 });
  return { weekly, rolling };
}

/** The vega-lite specification of the chart: weekly sales as bars, the rolling mean as a line, quarter starts as rules. */
export function salesChartSpec(sales: Series = salesSeries()): Record<string, unknown> {
  const { weekly, rolling } = weeklySales(sales);
  const rows = Array.from({ length: weekly.length }, (_, i) => ({
    week: weekly.labels[i],
    start: formatPlainDate(retailWeek.firstDayNumberFromOrdinal(weekly.ordinals[i]!)),
    sales: Math.round(weekly.columns.sum![i]! * 100) / 100,
    mean: Number.isNaN(rolling.columns.mean![i]!) ? null : Math.round(rolling.columns.mean![i]! * 100) / 100,
  }));
  const firstQuarter = retailQuarter.parseOrdinal('FY2024-Q1');
  const quarters = Array.from({ length: 8 }, (_, k) => ({
    start: formatPlainDate(retailQuarter.firstDayNumberFromOrdinal(firstQuarter + k)),
    label: retailQuarter.formatOrdinal(firstQuarter + k),
  }));
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v5.json',
    title: {
      text: 'Otterbrook Tea & Spice Co. (invented): shop sales by fiscal week',
      subtitle: '4-5-4 retail calendar, years ending on the Saturday nearest 31 January; America/Chicago; 4-week rolling mean',
    },
    width: 760,
    height: 300,
    layer: [
      {
        data: { values: rows },
        mark: { type: 'bar', color: '#b9cfe4', width: 4 },
        encoding: {
          x: { field: 'start', type: 'temporal', scale: { type: 'utc' }, axis: { title: 'first day of the fiscal week', format: '%b %Y' } },
          y: { field: 'sales', type: 'quantitative', axis: { title: 'sales (USD)' } },
        },
      },
      {
        data: { values: rows },
        mark: { type: 'line', color: '#c0392b', strokeWidth: 2 },
        encoding: {
          x: { field: 'start', type: 'temporal', scale: { type: 'utc' } },
          y: { field: 'mean', type: 'quantitative' },
        },
      },
      {
        data: { values: quarters },
        mark: { type: 'rule', color: '#888', strokeDash: [3, 3] },
        encoding: { x: { field: 'start', type: 'temporal', scale: { type: 'utc' } } },
      },
      {
        data: { values: quarters },
        mark: { type: 'text', align: 'left', dx: 3, dy: -6, fontSize: 10, color: '#555' },
        encoding: { x: { field: 'start', type: 'temporal', scale: { type: 'utc' } }, y: { value: 0 }, text: { field: 'label' } },
      },
    ],
  };
}

/** Renders the chart to SVG in Node (vega-lite compiles, vega renders with no canvas). */
export async function salesChartSvg(): Promise<string> {
  const vl = await import('vega-lite');
  const vega = await import('vega');
  const compiled = vl.compile(salesChartSpec() as never).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

export const section: DemoSection = {
  title: 'Series: sales by period, rolling and smoothed, joined and charted',
  async run(print) {
    const sales = salesSeries();
    print(`${sales.length.toLocaleString('en-US')} invented sales over fiscal years 2024 and 2025 of the shops' 4-5-4 calendar.`);

    const monthly = bucketSeries(sales, { unit: 'month', zone: BOOKING_ZONE, aggregations: ['sum', 'count', 'median', { kind: 'quantile', q: 0.9 }] });
    print('Monthly, booked in America/Chicago (first four months):');
    for (let i = 0; i < 4; i++) {
      const c = monthly.columns;
      print(`  ${monthly.labels[i]}  ${c.count![i]} sales  total $${c.sum![i]!.toFixed(2)}  median $${c.median![i]!.toFixed(2)}  90th percentile $${c['quantile-0.9']![i]!.toFixed(2)}`);
    }

    // The most common job: counting events per period from their instants alone (no value column).
    const counted = bucketSeries(seriesFromColumns(sales.epochMs), { unit: 'month', zone: BOOKING_ZONE, aggregations: ['count'] });
    print(`Counted from the instants alone: ${counted.columns.count![0]} sales in ${counted.labels[0]}, ${counted.columns.count![1]} in ${counted.labels[1]}.`);

    const { weekly, rolling } = weeklySales(sales);
    const busiest = weekly.columns.sum!.indexOf(Math.max(...weekly.columns.sum!));
    print(`By fiscal week: ${weekly.length} weeks from ${weekly.labels[0]} to ${weekly.labels[weekly.length - 1]}; the busiest is ${weekly.labels[busiest]} ($${weekly.columns.sum![busiest]!.toFixed(2)}), 4-week mean then $${rolling.columns.mean![busiest]!.toFixed(2)}.`);

    const quarterly = bucketSeries(sales, { unit: retailQuarter, zone: BOOKING_ZONE, aggregations: ['sum'] });
    const yoy = periodChangeFromBuckets(quarterly, { against: 'year-earlier' });
    for (let i = 4; i < yoy.length; i++) {
      print(`  ${yoy.labels[i]} vs ${retailQuarter.formatOrdinal(yoy.baseOrdinals[i]!)}: ${(yoy.relativeChange[i]! * 100).toFixed(1)} %`);
    }

    const daily = seriesFromBuckets(bucketSeries(sales, { unit: 'day', zone: BOOKING_ZONE, aggregations: ['sum'] }));
    const smooth = smoothSeries(daily, { halfLifeMs: 7 * 86_400_000, form: 'normalized' });
    print(`Daily takings smoothed with a 7-day half-life: $${smooth.columns.smoothed![smooth.length - 1]!.toFixed(2)} a day at the end of FY2025.`);
    const businessWeek = rollSeries(daily, { window: { businessDays: 5, calendar: 'us-federal', zone: BOOKING_ZONE }, aggregations: ['sum'] });
    print(`Takings over the last 5 US federal business days of FY2025: $${businessWeek.columns.sum![businessWeek.length - 1]!.toFixed(2)}.`);
    print('  (holiday calendars change by proclamation: verify against the official calendar)');

    // An invented weekly tea-leaf price list, joined to each day as of that day.
    const priceDays = Array.from({ length: 104 }, (_, k) => FIRST_DAY + k * 7 * 86_400_000);
    const prices = seriesFromColumns(priceDays, { pricePerKg: priceDays.map((_, k) => 31 + Math.round(8 * Math.sin(k / 9) * 100) / 100) });
    const joined = joinAsOf(daily, prices, { toleranceMs: 7 * 86_400_000 });
    print(`As-of join: on the last day the price list in force says $${joined.columns.pricePerKg![joined.length - 1]!.toFixed(2)} per kg.`);

    const byShop = (shop: string) =>
      seriesFromRecords(
        inventedSales(FIRST_DAY, DAYS).filter((s) => s.shop === shop),
        { at: 'epochMs', columns: ['amount'] },
      );
    const aligned = alignSeries({ Lakeside: byShop('Lakeside'), 'Old Mill': byShop('Old Mill') }, { unit: retailQuarter, zone: BOOKING_ZONE, aggregation: 'sum' });
    print(`Aligned by fiscal quarter: ${aligned.labels[0]} Lakeside $${aligned.columns.Lakeside![0]!.toFixed(2)}, Old Mill $${aligned.columns['Old Mill']![0]!.toFixed(2)}.`);

    const file = resolve('.build', 'series-sales-by-fiscal-week.svg');
    mkdirSync(resolve('.build'), { recursive: true });
    writeFileSync(file, await salesChartSvg());
    print(`Chart of sales by fiscal week with the 4-week rolling mean written to ${file}`);
  },
};

/**
 * Business time on the invented company's hours: the support desk's 8-business-hour answer target over a million
 * invented tickets, the payments office's 17:00 cut-off, and a week of warehouse shifts with an early close and the
 * end of daylight saving time, drawn as an SVG chart with vega-lite. `hoursChartSvg` is also used by
 * scripts/draw-hours-chart.ts to write docs/img/hours-week.svg.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  type BusinessHours,
  countBusinessMsBulk,
  defineHours,
  formatInstant,
  formatPlainDate,
  listSessions,
  offsetSecondsFromEpochMs,
  parseInstant,
  shiftBusinessTime,
  valueDayNumberOfEpochMs,
  wallMsFromEpochMs,
  weekdayOfDayNumber,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';
import { PAYMENTS_OFFICE_HOURS, SUPPORT_DESK_HOURS, SUPPORT_TARGET_MS, WAREHOUSE_HOURS, inventedTickets } from '../scenario.js';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
const H = 3_600_000;
const DAY = 86_400_000;

/** An instant with the offset of the hours' zone. */
function local(hours: BusinessHours, t: number): string {
  return formatInstant(t, { offsetSeconds: offsetSecondsFromEpochMs(hours.zoneId, t) }).replace('T', ' ');
}

/** The week the chart shows: Monday 2025-10-27 to Monday 2025-11-03 in Chicago (DST ends Sunday 2 November). */
export const CHART_WEEK = { start: '2025-10-27T00:00:00-05:00', end: '2025-11-03T00:00:00-06:00' };

/** The warehouse's sessions of the chart week as bars: one per local day a session touches, with its length. */
export function weekBars(): { day: string; from: number; to: number; label: string; kind: string }[] {
  const hours = defineHours(WAREHOUSE_HOURS);
  const start = parseInstant(CHART_WEEK.start).epochMs;
  const end = parseInstant(CHART_WEEK.end).epochMs;
  const bars: { day: string; from: number; to: number; label: string; kind: string }[] = [];
  for (const s of listSessions(hours, start, end)) {
    const a = wallMsFromEpochMs(hours.zoneId, s.startEpochMs);
    const b = wallMsFromEpochMs(hours.zoneId, s.endEpochMs);
    const length = `${s.lengthMs / H} h`;
    const dayA = Math.floor(a / DAY);
    const kind = s.lengthMs === 8 * H ? 'regular' : s.endEpochMs - s.startEpochMs !== b - a ? 'across the DST change' : 'early close';
    const name = (d: number) => `${WEEKDAYS[weekdayOfDayNumber(d) - 1]} ${formatPlainDate(d).slice(5)}`;
    // A night session is drawn in two parts: to midnight on its own day, and from midnight on the next.
    if (Math.floor((b - 1) / DAY) > dayA) {
      bars.push({ day: name(dayA), from: (a - dayA * DAY) / H, to: 24, label: length, kind });
      bars.push({ day: name(dayA + 1), from: 0, to: (b - (dayA + 1) * DAY) / H, label: '', kind });
    } else bars.push({ day: name(dayA), from: (a - dayA * DAY) / H, to: (b - dayA * DAY) / H, label: length, kind });
  }
  return bars;
}

/** The vega-lite specification of the chart: a row per local day, a bar per session in wall-clock hours. */
export function hoursChartSpec(): Record<string, unknown> {
  const bars = weekBars();
  const days = [...new Set(bars.map((b) => b.day)), 'Sun 11-02'].filter((d, i, all) => all.indexOf(d) === i);
  const y = { field: 'day', type: 'ordinal', sort: days, axis: { title: null } };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v5.json',
    title: {
      text: 'Otterbrook warehouse (invented): one week of sessions, America/Chicago',
      subtitle: 'Friday 31 October closes at 12:00 (no night shift); the Saturday night shift spans the end of DST (02:00 -> 01:00) and lasts 9 h',
    },
    width: 640,
    height: 220,
    data: { values: bars },
    layer: [
      {
        mark: { type: 'bar', height: 16, cornerRadius: 2 },
        encoding: {
          y,
          x: { field: 'from', type: 'quantitative', scale: { domain: [0, 24] }, axis: { title: 'local wall-clock hour', values: [0, 3, 6, 9, 12, 15, 18, 21, 24] } },
          x2: { field: 'to' },
          color: {
            field: 'kind',
            type: 'nominal',
            scale: { domain: ['regular', 'early close', 'across the DST change'], range: ['#7fa7cf', '#e3a13b', '#c0392b'] },
            legend: { title: 'session', orient: 'bottom', labelLimit: 240 },
          },
        },
      },
      {
        mark: { type: 'text', align: 'left', dx: 4, fontSize: 11, color: '#333' },
        encoding: { y, x: { field: 'from', type: 'quantitative' }, text: { field: 'label' } },
      },
    ],
  };
}

/** Renders the chart to SVG in Node (vega-lite compiles, vega renders with no canvas). */
export async function hoursChartSvg(): Promise<string> {
  const vl = await import('vega-lite');
  const vega = await import('vega');
  const compiled = vl.compile(hoursChartSpec() as never).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

export const section: DemoSection = {
  title: 'Business time: support tickets within 8 business hours, payment cut-offs, warehouse shifts',
  async run(print) {
    const desk = defineHours(SUPPORT_DESK_HOURS);
    const { opened, answered } = inventedTickets(1_000_000, Date.UTC(2025, 0, 1), 365);
    const t0 = performance.now();
    const toAnswer = countBusinessMsBulk(desk, opened, answered);
    const ms = performance.now() - t0;
    let met = 0;
    for (let i = 0; i < toAnswer.length; i++) if (toAnswer[i]! <= SUPPORT_TARGET_MS) met++;
    const sorted = Float64Array.from(toAnswer).sort();
    print(`Support desk (Chicago, weekdays 08:00-18:00, US federal holidays, early closes before Thanksgiving and Christmas):`);
    print(`  ${opened.length.toLocaleString('en-US')} invented tickets of 2025: ${((met / opened.length) * 100).toFixed(1)} % answered within 8 business hours (answered at exactly 8 h counts as met).`);
    print(`  Median business time to answer ${(sorted[sorted.length >> 1]! / H).toFixed(2)} h; 95th percentile ${(sorted[Math.floor(sorted.length * 0.95)]! / H).toFixed(2)} h; computed in ${ms.toFixed(0)} ms.`);
    const late = parseInstant('2025-11-26T19:30:00Z').epochMs;
    print(`  A ticket opened ${local(desk, late)} (Thanksgiving eve, the desk closes at 15:00) is due ${local(desk, shiftBusinessTime(desk, late, 'PT8H'))}.`);

    const office = defineHours(PAYMENTS_OFFICE_HOURS);
    print('Payments office (cut-off 17:00; 12:00 on the early close before Christmas Day): value dates');
    for (const text of ['2025-11-25T22:59:59Z', '2025-11-25T23:00:00Z', '2025-11-25T23:00:00.001Z', '2025-11-26T23:30:00Z', '2025-12-24T17:30:00Z']) {
      const t = parseInstant(text).epochMs;
      const v = valueDayNumberOfEpochMs(office, t, 'payments');
      print(`  instructed ${local(office, t)}  value date ${WEEKDAYS[weekdayOfDayNumber(v) - 1]} ${formatPlainDate(v)}`);
    }

    const warehouse = defineHours(WAREHOUSE_HOURS);
    print('Warehouse shifts, week of Monday 2025-10-27 (stocktake on Friday; DST ends Sunday 02:00):');
    for (const s of listSessions(warehouse, parseInstant(CHART_WEEK.start).epochMs, parseInstant(CHART_WEEK.end).epochMs)) {
      print(`  ${WEEKDAYS[weekdayOfDayNumber(s.dayNumber) - 1]} ${formatPlainDate(s.dayNumber)}  ${local(warehouse, s.startEpochMs)} to ${local(warehouse, s.endEpochMs)}  ${s.lengthMs / H} h`);
    }
    const file = resolve('.build', 'hours-week.svg');
    mkdirSync(resolve('.build'), { recursive: true });
    writeFileSync(file, await hoursChartSvg());
    print(`Chart of the week written to ${file}`);
    print('Caution: opening hours, early closes and cut-offs are set by the institution; verify them against its published hours.');
  },
};

import {
  lengthMsOfDayNumber,
  dayNumberFromEpochMsBulk,
  dayNumberFromYmd,
  epochMsFromWallFields,
  formatInstant,
  formatOffset,
  formatPlainDate,
  formatPlainDateTime,
  listTransitions,
  offsetSecondsFromEpochMs,
  resolveWallMs,
  wallMsFromEpochMs,
} from '../../src/index.js';
import { OFFICES, inventedSales } from '../scenario.js';
import type { DemoSection } from '../demo.js';

export const section: DemoSection = {
  title: "Zones: the offices' wall clocks, DST gaps and overlaps, local days in bulk",
  run(print) {
    // A Monday 09:00 stand-up called from the Chicago head office: what time is it in each office?
    const standUp = epochMsFromWallFields('America/Chicago', { year: 2026, month: 3, day: 30, hour: 9 });
    print(`Stand-up at ${formatInstant(standUp)} (09:00 in Chicago, Monday 2026-03-30):`);
    for (const o of OFFICES) {
      const off = offsetSecondsFromEpochMs(o.zone, standUp);
      print(`  ${o.city.padEnd(9)} ${formatPlainDateTime(wallMsFromEpochMs(o.zone, standUp)).slice(0, 16)}  (UTC${formatOffset(off)}, ${o.zone})`);
    }
    // The nightly stock count at 02:30 Chicago time does not exist on the spring-forward day.
    const r = resolveWallMs('America/Chicago', dayNumberFromYmd(2026, 3, 8) * 86_400_000 + 2.5 * 3_600_000);
    if (r.kind === 'gap') {
      print(`The 02:30 stock count on 2026-03-08 falls in a gap: Chicago clocks jump from ${formatPlainDateTime(r.startWallMs).slice(11, 16)} to ${formatPlainDateTime(r.endWallMs).slice(11, 16)}; 'compatible' runs it at 03:30.`);
    }
    // Day lengths at the Dublin and Auckland desks in 2026.
    for (const o of OFFICES.filter((x) => x.zone !== 'Asia/Kolkata' && x.zone !== 'America/Chicago')) {
      const changes = listTransitions(o.zone, Date.UTC(2026, 0, 1), Date.UTC(2027, 0, 1));
      const days = changes.map((t) => {
        const dn = Math.floor((t.epochMs + t.offsetAfterSeconds * 1000) / 86_400_000);
        return `${formatPlainDate(dn)} (${lengthMsOfDayNumber(o.zone, dn) / 3_600_000} h)`;
      });
      print(`  ${o.city}: clock changes in 2026 on ${days.join(' and ')}`);
    }
    // A month of invented sales, bucketed by local day in the booking zone, in one bulk call.
    const sales = inventedSales(Date.UTC(2026, 2, 1), 31);
    const days = dayNumberFromEpochMsBulk('America/Chicago', Float64Array.from(sales, (s) => s.epochMs));
    const first = days[0]!;
    const perDay = new Map<number, number>();
    days.forEach((d, i) => perDay.set(d, (perDay.get(d) ?? 0) + sales[i]!.amount));
    const busiest = [...perDay].sort((a, b) => b[1] - a[1])[0]!;
    print(`March 2026: ${sales.length} invented sales over ${perDay.size} Chicago days from ${formatPlainDate(first)}; busiest ${formatPlainDate(busiest[0])} at $${busiest[1].toFixed(2)}.`);
  },
};

import {
  formatDuration,
  formatInstant,
  formatPlainDate,
  parseDuration,
  parseInstant,
  shiftDayNumber,
  toDayNumber,
  toEpochMs,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';

/** Invented orders received by the European sales desk, as its order system writes them (RFC 9557 text). */
const ORDERS = [
  { ref: 'EU-1042', received: '2025-01-31T16:45:12.345678+00:00[Europe/Dublin]', customer: 'a cafe chain (invented)' },
  { ref: 'EU-1043', received: '2025-02-14T09:30:00Z[Europe/Dublin]', customer: 'a hotel group (invented)' },
  { ref: 'EU-0417', received: '2016-12-31T23:59:60Z', customer: 'a grocer (invented); an archived order stamped during a leap second' },
  { ref: 'EU-1045', received: '2025-02-14T09:30:00', customer: 'a deli (invented); the desk forgot the offset' },
];

export const section: DemoSection = {
  title: 'Instants and durations: order timestamps, invoice due dates',
  run(print) {
    const net30 = parseDuration('P30D');
    const monthly = parseDuration('P1M');
    for (const o of ORDERS) {
      let p;
      try {
        p = parseInstant(o.received);
      } catch (e) {
        print(`${o.ref} for ${o.customer}: refused rather than guessed: ${(e as Error).message}`);
        continue;
      }
      // The invoice is dated on the date written in the timestamp: the desk's own wall-clock date.
      const invoiceDay = p.dayNumber;
      print(
        `${o.ref} for ${o.customer}: received ${formatInstant(p.epochMs)} (epoch ms ${p.epochMs}, zone note ${p.zoneId ?? 'none'}); ` +
          `net ${formatDuration(net30)} due ${formatPlainDate(shiftDayNumber(invoiceDay, net30))}; ` +
          `first monthly instalment ${formatPlainDate(shiftDayNumber(invoiceDay, monthly))}` +
          (p.submillisecondNs ? ` (the ${p.submillisecondNs} ns past the millisecond are floored away)` : '') +
          (p.leapSecond ? ' (second :60 read as :59, as Temporal does)' : ''),
      );
    }
    print(`Payment terms typed as a date are read the same way in every ISO form: ${['2025-03-03', '2025-W10-1', '2025-062'].map((t) => toDayNumber(t)).join(' = ')} (day numbers).`);
    print(`The same instant from a Date and from text: ${toEpochMs(new Date(Date.UTC(2025, 1, 14, 9, 30)))} = ${toEpochMs('2025-02-14T10:30:00+01:00')}.`);
  },
};

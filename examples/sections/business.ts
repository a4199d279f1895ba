import {
  type CalendarDefinition,
  MONTH_UNIT,
  adjustDayNumber,
  countBusinessDays,
  dayNumberFromYmd,
  defineCalendar,
  formatPeriod,
  formatPlainDate,
  listHolidays,
  nthBusinessDayOfPeriod,
  periodFromDayNumber,
  shiftBusinessDays,
  shiftPeriod,
  weekdayOfDayNumber,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
const day = (dn: number) => `${WEEKDAYS[weekdayOfDayNumber(dn) - 1]} ${formatPlainDate(dn)}`;

/**
 * The invented company's closing calendar: United States federal holidays (its head office is in Chicago), plus
 * two company shutdown days of its own. A plain definition, as it would sit in a JSON file.
 */
export const OTTERBROOK_CLOSING_DAYS: CalendarDefinition = {
  id: 'otterbrook',
  name: 'Otterbrook Tea & Spice Co. closing days (invented)',
  extends: 'us-federal',
  holidays: [
    { id: 'day-after-thanksgiving', name: 'Company shutdown (day after Thanksgiving)', kind: 'relative', to: 'thanksgiving-day', offset: 1 },
    { id: 'christmas-eve', name: 'Company shutdown (Christmas Eve)', kind: 'fixed', month: 12, day: 24 },
  ],
};

export const section: DemoSection = {
  title: 'Business calendars: closing days, month-end close, payment dates',
  run(print) {
    const cal = defineCalendar(OTTERBROOK_CLOSING_DAYS);
    const y0 = dayNumberFromYmd(2026, 1, 1);
    const y1 = dayNumberFromYmd(2027, 1, 1);
    print('Closing days of 2026 (US federal holidays as observed, plus two company shutdown days):');
    for (const h of listHolidays(cal, y0, y1)) {
      print(`  ${day(h.dayNumber)}  ${h.name}${h.moved ? ` (falls on ${day(h.actualDayNumber)})` : ''}`);
    }
    print(`Business days in 2026: ${countBusinessDays(cal, y0, y1)}.`);

    print('Month-end close (the last business day of each month), first half of 2026:');
    let month = periodFromDayNumber(MONTH_UNIT, y0);
    for (let i = 0; i < 6; i++, month = shiftPeriod(month, 1)) {
      print(`  ${formatPeriod(month)}  close on ${day(nthBusinessDayOfPeriod(cal, month, -1))}, ledgers locked on business day 3 of the next month: ${day(nthBusinessDayOfPeriod(cal, shiftPeriod(month, 1), 3))}`);
    }

    print('Supplier payments due on the 15th and on the last calendar day, modified following (ISDA 2006 4.12):');
    for (const [m, d] of [[2, 15], [2, 28], [5, 31], [11, 15], [11, 30]] as const) {
      const due = dayNumberFromYmd(2026, m, d);
      const paid = adjustDayNumber(cal, due, 'modified-following');
      print(`  due ${day(due)} -> paid ${day(paid)}${paid === due ? '' : ' (moved)'}`);
    }
    const invoice = dayNumberFromYmd(2026, 11, 20);
    print(`An invoice issued ${day(invoice)} on terms of 10 business days is due ${day(shiftBusinessDays(cal, invoice, 10))} (Thanksgiving and the shutdown day skipped).`);
    print('Caution: holiday calendars change by proclamation; check the official calendar before relying on a date.');
  },
};

import {
  defineSchedule,
  defineCalendar,
  defineRule,
  describeRule,
  formatInstant,
  formatPlainDate,
  formatRecurrenceRule,
  listOccurrenceDayNumbers,
  listOccurrenceEpochMs,
  offsetSecondsFromEpochMs,
  weekdayOfDayNumber,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';
import { BOOKING_ZONE } from '../scenario.js';
import { OTTERBROOK_CLOSING_DAYS } from './business.js';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
const day = (dn: number) => `${WEEKDAYS[weekdayOfDayNumber(dn) - 1]} ${formatPlainDate(dn)}`;

export const section: DemoSection = {
  title: 'Schedules: supplier payments, payroll, a loan, and reminders across a DST change',
  run(print) {
    const calendar = defineCalendar(OTTERBROOK_CLOSING_DAYS);

    // Suppliers are paid on the 15th and on the last business day of each month; a 15th that is a closing day
    // moves by modified following (ISDA 2006 Definitions, section 4.12).
    const suppliers = defineRule({
      kind: 'monthly',
      on: [{ day: 15 }, { businessDay: 'last' }],
      calendar,
      convention: 'modified-following',
      label: 'Supplier payments',
    });
    print(describeRule(suppliers));
    print(`  ${listOccurrenceDayNumbers(suppliers, '2026-01-01', '2026-07-01').map(day).join(', ')}`);

    // Hourly staff are paid every other Friday; a Friday that is a closing day pays the business day before.
    const biweekly = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2026-01-09', calendar, convention: 'preceding', label: 'Hourly payroll' });
    print(describeRule(biweekly));
    print(`  ${listOccurrenceDayNumbers(biweekly, '2026-10-01', '2027-01-01').map(day).join(', ')}`);
    const plainBiweekly = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2026-01-09', start: '2026-01-09' });
    print(`  the same Fridays as RFC 5545 text for the staff calendar (before adjustment):`);
    for (const line of formatRecurrenceRule(plainBiweekly).split('\n')) print(`    ${line}`);

    // Salaried staff are paid semi-monthly, on the 15th and the last day, moved to the business day before.
    const salaried = defineRule({ kind: 'semi-monthly', days: [15, 'last'], calendar, convention: 'preceding', label: 'Salaried payroll' });
    print(describeRule(salaried));
    print(`  ${listOccurrenceDayNumbers(salaried, '2026-11-01', '2027-01-01').map(day).join(', ')}`);

    // The company's (invented) term loan: quarterly interest periods rolled back from maturity, short front stub.
    const loan = defineSchedule({
      start: '2026-02-10',
      end: '2027-06-30',
      step: { months: 3 },
      stub: 'short-front',
      keepMonthEnd: true,
      calendar,
      convention: 'modified-following',
    });
    print('Term loan interest periods (unadjusted -> adjusted end, stub marked):');
    for (const p of loan.periods) {
      print(`  ${formatPlainDate(p.unadjustedStart)} .. ${formatPlainDate(p.unadjustedEnd)} -> pays ${day(p.adjustedEnd)}${p.stub ? `  (${p.stub} stub)` : ''}`);
    }

    // The roastery logs its ovens every 30 minutes on the Chicago wall clock; on 2026-03-08 clocks skip 02:00-03:00.
    const ovens = defineRule({ kind: 'intraday', zone: BOOKING_ZONE, every: { minutes: 30 }, anchor: '2026-03-08T00:00', clock: 'wall', skipped: 'drop' });
    print(describeRule(ovens));
    const times = listOccurrenceEpochMs(ovens, '2026-03-08T07:00:00Z', '2026-03-08T09:30:00Z');
    print(`  ${times.map((t) => formatInstant(t, { offsetSeconds: offsetSecondsFromEpochMs(BOOKING_ZONE, t) }).slice(11)).join(', ')}`);
    print('  (holiday calendars change by proclamation: verify payment dates against the official calendar)');
  },
};

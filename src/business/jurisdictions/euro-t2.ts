/**
 * T2 (formerly TARGET and TARGET2) closing days, as data.
 *
 * @module
 */
import { type CalendarDefinition, HOLIDAY_CAUTION } from '../definition.js';
import { deepFreezeDefinition } from './freeze.js';

/**
 * The closing days of the Eurosystem's real-time gross settlement system (TARGET, then TARGET2, since March 2023
 * T2): Saturdays, Sundays, New Year's Day, Good Friday, Easter Monday, 1 May, Christmas Day and 26 December, with
 * no substitute days. Decided by the ECB Governing Council on 14 December 2000 for 2002 onwards "until further
 * notice". These are not settlement days for the euro money market or for foreign exchange transactions involving
 * the euro.
 */
export const EURO_T2_CLOSING_DAYS: CalendarDefinition = deepFreezeDefinition({
  id: 'euro-t2',
  name: 'T2 (TARGET) closing days',
  source:
    'European Central Bank, press release "Long-term calendar for TARGET closing days" (14 December 2000), applying ' +
    'from 2002 until further notice; kept for TARGET2 and T2 as published on the ECB website.',
  caution:
    `${HOLIDAY_CAUTION} National holidays in euro-area countries are not T2 closing days; markets and banks may still be ` +
    'closed. The ECB has consulted on changing T2 operating days, so check its current calendar.',
  weekend: ['saturday', 'sunday'],
  years: { from: 2002 },
  holidays: [
    { id: 'new-years-day', name: "New Year's Day", kind: 'fixed', month: 1, day: 1 },
    { id: 'good-friday', name: 'Good Friday', kind: 'easter', offset: -2 },
    { id: 'easter-monday', name: 'Easter Monday', kind: 'easter', offset: 1 },
    { id: 'labour-day', name: 'Labour Day (1 May)', kind: 'fixed', month: 5, day: 1 },
    { id: 'christmas-day', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 },
    { id: 'boxing-day', name: '26 December', kind: 'fixed', month: 12, day: 26 },
  ],
});

import { dayNumberFromYmd, easterDayNumberOfYear, isoWeekDateFromDayNumber, weekdayOfDayNumber, ymdFromDayNumber } from '../../src/index.js';
import type { DemoSection } from '../demo.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

export const section: DemoSection = {
  title: 'Civil calendar: day numbers, weekdays, ISO weeks',
  run(print) {
    const founded = dayNumberFromYmd(2011, 3, 14);
    const w = isoWeekDateFromDayNumber(founded);
    print(`The company was founded on 2011-03-14: day number ${founded}, a ${WEEKDAYS[weekdayOfDayNumber(founded) - 1]}, ISO week ${w.weekYear}-W${String(w.week).padStart(2, '0')}.`);
    const e = ymdFromDayNumber(easterDayNumberOfYear(2026));
    print(`The shops close on Easter Sunday; in 2026 that is ${e.year}-${String(e.month).padStart(2, '0')}-${String(e.day).padStart(2, '0')}.`);
  },
};

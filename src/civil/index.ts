/** Public surface of the civil layer: proleptic Gregorian arithmetic on day numbers. */
export {
  type Ymd,
  isLeapYear,
  dayCountOfMonth,
  dayCountOfYear,
  dayNumberFromYmd,
  ymdFromDayNumber,
  yearOfDayNumber,
  monthOfDayNumber,
  dayOfMonthOfDayNumber,
  ymdFromDayNumberBulk,
  dayNumberFromYmdBulk,
  weekdayOfDayNumber,
  dayOfYearOfDayNumber,
  dayNumberFromYearDay,
} from './gregorian.js';
export {
  type IsoWeekDate,
  isoWeekCountOfYear,
  isoWeekDateFromDayNumber,
  dayNumberFromIsoWeekDate,
} from './isoweek.js';
export { type WeekdayName, WEEKDAY_NAMES } from './names.js';
export { easterDayNumberOfYear, julianEasterDayNumberOfYear, EASTER_MIN_YEAR, JULIAN_EASTER_MIN_YEAR } from './easter.js';

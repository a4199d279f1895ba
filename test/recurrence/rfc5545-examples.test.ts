/**
 * The examples of RFC 5545 section 3.8.5.3 ("Recurrence Rule"), each in its own test named by the example's
 * description in the RFC, expecting the occurrences the RFC lists (RFC 5545, pages 123-132). "Forever" examples
 * are checked on the occurrences the RFC writes out. Local times are read back in America/New_York through
 * @js-temporal/polyfill (the ECMA-262 Temporal reference implementation), an outside check of the zone step.
 *
 * Every example passes, apart from the one the RFC's verified erratum EID 3883 corrects ("Every 3 hours from
 * 9:00 AM to 5:00 PM on a specific day"): the RFC prints UNTIL=19970902T170000Z (13:00 EDT) but lists 09:00, 12:00
 * and 15:00; the erratum corrects UNTIL to 19970902T210000Z (17:00 EDT). The corrected text gives the listed
 * occurrences; the printed text gives 09:00 and 12:00 (UNTIL is inclusive, section 3.3.10). Both are asserted.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import { iterateOccurrenceEpochMs, parseRecurrenceRule } from '../../src/index.js';

const NY = 'America/New_York';

/** Local "YYYY-MM-DDTHH:MM" in New York of an instant, by @js-temporal/polyfill. */
function local(ms: number): string {
  return Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(NY).toPlainDateTime().toString().slice(0, 16);
}

/** Dates of `year`-`month` at `time`, as the RFC lists them ("September 2,4,6"). */
function on(year: number, month: number, days: readonly number[], time = '09:00'): string[] {
  return days.map((d) => `${year}-${String(month).padStart(2, '0')}-${String(d).padStart(2, '0')}T${time}`);
}
function range(a: number, b: number, step = 1): number[] {
  const out: number[] = [];
  for (let i = a; i <= b; i += step) out.push(i);
  return out;
}

/**
 * Expands `text` from its DTSTART and compares with `expected`. For bounded rules (COUNT or UNTIL) the whole
 * set is compared; for "forever" rules, the first `expected.length` occurrences.
 */
function check(text: string, expected: readonly string[], bounded: boolean): void {
  const rule = parseRecurrenceRule(text);
  const dtstart = /DTSTART;TZID=America\/New_York:(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})/.exec(text)!;
  const startMs = Temporal.ZonedDateTime.from({
    timeZone: NY,
    year: Number(dtstart[1]),
    month: Number(dtstart[2]),
    day: Number(dtstart[3]),
    hour: Number(dtstart[4]),
    minute: Number(dtstart[5]),
  }).epochMilliseconds;
  const got = Array.from(iterateOccurrenceEpochMs(rule, startMs, { limit: bounded ? 10_000 : expected.length }), local);
  expect(got).toEqual(expected);
}

describe('RFC 5545 section 3.8.5.3 examples', () => {
  it('Daily for 10 occurrences', () => {
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;COUNT=10', on(1997, 9, range(2, 11)), true);
  });

  it('Daily until December 24, 1997', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;UNTIL=19971224T000000Z',
      [...on(1997, 9, range(2, 30)), ...on(1997, 10, range(1, 31)), ...on(1997, 11, range(1, 30)), ...on(1997, 12, range(1, 23))],
      true,
    );
  });

  it('Every other day - forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;INTERVAL=2',
      [...on(1997, 9, range(2, 30, 2)), ...on(1997, 10, range(2, 30, 2)), ...on(1997, 11, range(1, 29, 2)), ...on(1997, 12, [1, 3])],
      false,
    );
  });

  it('Every 10 days, 5 occurrences', () => {
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;INTERVAL=10;COUNT=5', [...on(1997, 9, [2, 12, 22]), ...on(1997, 10, [2, 12])], true);
  });

  it('Every day in January, for 3 years (both forms)', () => {
    const expected = [...on(1998, 1, range(1, 31)), ...on(1999, 1, range(1, 31)), ...on(2000, 1, range(1, 31))];
    check('DTSTART;TZID=America/New_York:19980101T090000\nRRULE:FREQ=YEARLY;UNTIL=20000131T140000Z;\n BYMONTH=1;BYDAY=SU,MO,TU,WE,TH,FR,SA', expected, true);
    check('DTSTART;TZID=America/New_York:19980101T090000\nRRULE:FREQ=DAILY;UNTIL=20000131T140000Z;BYMONTH=1', expected, true);
  });

  it('Weekly for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;COUNT=10',
      [...on(1997, 9, [2, 9, 16, 23, 30]), ...on(1997, 10, [7, 14, 21, 28]), ...on(1997, 11, [4])],
      true,
    );
  });

  it('Weekly until December 24, 1997', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;UNTIL=19971224T000000Z',
      [...on(1997, 9, [2, 9, 16, 23, 30]), ...on(1997, 10, [7, 14, 21, 28]), ...on(1997, 11, [4, 11, 18, 25]), ...on(1997, 12, [2, 9, 16, 23])],
      true,
    );
  });

  it('Every other week - forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;WKST=SU',
      [...on(1997, 9, [2, 16, 30]), ...on(1997, 10, [14, 28]), ...on(1997, 11, [11, 25]), ...on(1997, 12, [9, 23]), ...on(1998, 1, [6, 20]), ...on(1998, 2, [3, 17])],
      false,
    );
  });

  it('Weekly on Tuesday and Thursday for five weeks (both forms)', () => {
    const expected = [...on(1997, 9, [2, 4, 9, 11, 16, 18, 23, 25, 30]), ...on(1997, 10, [2])];
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;UNTIL=19971007T000000Z;WKST=SU;BYDAY=TU,TH', expected, true);
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;COUNT=10;WKST=SU;BYDAY=TU,TH', expected, true);
  });

  it('Every other week on Monday, Wednesday, and Friday until December 24, 1997, starting on Monday, September 1, 1997', () => {
    check(
      'DTSTART;TZID=America/New_York:19970901T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;\n BYDAY=MO,WE,FR',
      [
        ...on(1997, 9, [1, 3, 5, 15, 17, 19, 29]),
        ...on(1997, 10, [1, 3, 13, 15, 17, 27, 29, 31]),
        ...on(1997, 11, [10, 12, 14, 24, 26, 28]),
        ...on(1997, 12, [8, 10, 12, 22]),
      ],
      true,
    );
  });

  it('Every other week on Tuesday and Thursday, for 8 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH',
      [...on(1997, 9, [2, 4, 16, 18, 30]), ...on(1997, 10, [2, 14, 16])],
      true,
    );
  });

  it('Monthly on the first Friday for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970905T090000\nRRULE:FREQ=MONTHLY;COUNT=10;BYDAY=1FR',
      [
        ...on(1997, 9, [5]),
        ...on(1997, 10, [3]),
        ...on(1997, 11, [7]),
        ...on(1997, 12, [5]),
        ...on(1998, 1, [2]),
        ...on(1998, 2, [6]),
        ...on(1998, 3, [6]),
        ...on(1998, 4, [3]),
        ...on(1998, 5, [1]),
        ...on(1998, 6, [5]),
      ],
      true,
    );
  });

  it('Monthly on the first Friday until December 24, 1997', () => {
    check(
      'DTSTART;TZID=America/New_York:19970905T090000\nRRULE:FREQ=MONTHLY;UNTIL=19971224T000000Z;BYDAY=1FR',
      [...on(1997, 9, [5]), ...on(1997, 10, [3]), ...on(1997, 11, [7]), ...on(1997, 12, [5])],
      true,
    );
  });

  it('Every other month on the first and last Sunday of the month for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970907T090000\nRRULE:FREQ=MONTHLY;INTERVAL=2;COUNT=10;BYDAY=1SU,-1SU',
      [...on(1997, 9, [7, 28]), ...on(1997, 11, [2, 30]), ...on(1998, 1, [4, 25]), ...on(1998, 3, [1, 29]), ...on(1998, 5, [3, 31])],
      true,
    );
  });

  it('Monthly on the second-to-last Monday of the month for 6 months', () => {
    check(
      'DTSTART;TZID=America/New_York:19970922T090000\nRRULE:FREQ=MONTHLY;COUNT=6;BYDAY=-2MO',
      [...on(1997, 9, [22]), ...on(1997, 10, [20]), ...on(1997, 11, [17]), ...on(1997, 12, [22]), ...on(1998, 1, [19]), ...on(1998, 2, [16])],
      true,
    );
  });

  it('Monthly on the third-to-the-last day of the month, forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970928T090000\nRRULE:FREQ=MONTHLY;BYMONTHDAY=-3',
      [...on(1997, 9, [28]), ...on(1997, 10, [29]), ...on(1997, 11, [28]), ...on(1997, 12, [29]), ...on(1998, 1, [29]), ...on(1998, 2, [26])],
      false,
    );
  });

  it('Monthly on the 2nd and 15th of the month for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MONTHLY;COUNT=10;BYMONTHDAY=2,15',
      [...on(1997, 9, [2, 15]), ...on(1997, 10, [2, 15]), ...on(1997, 11, [2, 15]), ...on(1997, 12, [2, 15]), ...on(1998, 1, [2, 15])],
      true,
    );
  });

  it('Monthly on the first and last day of the month for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970930T090000\nRRULE:FREQ=MONTHLY;COUNT=10;BYMONTHDAY=1,-1',
      [...on(1997, 9, [30]), ...on(1997, 10, [1, 31]), ...on(1997, 11, [1, 30]), ...on(1997, 12, [1, 31]), ...on(1998, 1, [1, 31]), ...on(1998, 2, [1])],
      true,
    );
  });

  it('Every 18 months on the 10th thru 15th of the month for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970910T090000\nRRULE:FREQ=MONTHLY;INTERVAL=18;COUNT=10;BYMONTHDAY=10,11,12,\n 13,14,15',
      [...on(1997, 9, range(10, 15)), ...on(1999, 3, [10, 11, 12, 13])],
      true,
    );
  });

  it('Every Tuesday, every other month', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MONTHLY;INTERVAL=2;BYDAY=TU',
      [...on(1997, 9, [2, 9, 16, 23, 30]), ...on(1997, 11, [4, 11, 18, 25]), ...on(1998, 1, [6, 13, 20, 27]), ...on(1998, 3, [3, 10, 17, 24, 31])],
      false,
    );
  });

  it('Yearly in June and July for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970610T090000\nRRULE:FREQ=YEARLY;COUNT=10;BYMONTH=6,7',
      [1997, 1998, 1999, 2000, 2001].flatMap((y) => [...on(y, 6, [10]), ...on(y, 7, [10])]),
      true,
    );
  });

  it('Every other year on January, February, and March for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970310T090000\nRRULE:FREQ=YEARLY;INTERVAL=2;COUNT=10;BYMONTH=1,2,3',
      [...on(1997, 3, [10]), ...[1999, 2001, 2003].flatMap((y) => [...on(y, 1, [10]), ...on(y, 2, [10]), ...on(y, 3, [10])])],
      true,
    );
  });

  it('Every third year on the 1st, 100th, and 200th day for 10 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970101T090000\nRRULE:FREQ=YEARLY;INTERVAL=3;COUNT=10;BYYEARDAY=1,100,200',
      [
        ...on(1997, 1, [1]),
        ...on(1997, 4, [10]),
        ...on(1997, 7, [19]),
        ...on(2000, 1, [1]),
        ...on(2000, 4, [9]),
        ...on(2000, 7, [18]),
        ...on(2003, 1, [1]),
        ...on(2003, 4, [10]),
        ...on(2003, 7, [19]),
        ...on(2006, 1, [1]),
      ],
      true,
    );
  });

  // The ordinal counts within the year here: RFC 5545 section 3.3.10 as corrected by verified erratum EID 1913.
  it('Every 20th Monday of the year, forever', () => {
    check('DTSTART;TZID=America/New_York:19970519T090000\nRRULE:FREQ=YEARLY;BYDAY=20MO', [...on(1997, 5, [19]), ...on(1998, 5, [18]), ...on(1999, 5, [17])], false);
  });

  it('Monday of week number 20 (where the default start of the week is Monday), forever', () => {
    check('DTSTART;TZID=America/New_York:19970512T090000\nRRULE:FREQ=YEARLY;BYWEEKNO=20;BYDAY=MO', [...on(1997, 5, [12]), ...on(1998, 5, [11]), ...on(1999, 5, [17])], false);
  });

  it('Every Thursday in March, forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970313T090000\nRRULE:FREQ=YEARLY;BYMONTH=3;BYDAY=TH',
      [...on(1997, 3, [13, 20, 27]), ...on(1998, 3, [5, 12, 19, 26]), ...on(1999, 3, [4, 11, 18, 25])],
      false,
    );
  });

  it('Every Thursday, but only during June, July, and August, forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970605T090000\nRRULE:FREQ=YEARLY;BYDAY=TH;BYMONTH=6,7,8',
      [
        ...on(1997, 6, [5, 12, 19, 26]),
        ...on(1997, 7, [3, 10, 17, 24, 31]),
        ...on(1997, 8, [7, 14, 21, 28]),
        ...on(1998, 6, [4, 11, 18, 25]),
        ...on(1998, 7, [2, 9, 16, 23, 30]),
        ...on(1998, 8, [6, 13, 20, 27]),
        ...on(1999, 6, [3, 10, 17, 24]),
        ...on(1999, 7, [1, 8, 15, 22, 29]),
        ...on(1999, 8, [5, 12, 19, 26]),
      ],
      false,
    );
  });

  it('Every Friday the 13th, forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nEXDATE;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MONTHLY;BYDAY=FR;BYMONTHDAY=13',
      [...on(1998, 2, [13]), ...on(1998, 3, [13]), ...on(1998, 11, [13]), ...on(1999, 8, [13]), ...on(2000, 10, [13])],
      false,
    );
  });

  it('The first Saturday that follows the first Sunday of the month, forever', () => {
    check(
      'DTSTART;TZID=America/New_York:19970913T090000\nRRULE:FREQ=MONTHLY;BYDAY=SA;BYMONTHDAY=7,8,9,10,11,12,13',
      [
        ...on(1997, 9, [13]),
        ...on(1997, 10, [11]),
        ...on(1997, 11, [8]),
        ...on(1997, 12, [13]),
        ...on(1998, 1, [10]),
        ...on(1998, 2, [7]),
        ...on(1998, 3, [7]),
        ...on(1998, 4, [11]),
        ...on(1998, 5, [9]),
        ...on(1998, 6, [13]),
      ],
      false,
    );
  });

  it('Every 4 years, the first Tuesday after a Monday in November, forever (U.S. Presidential Election day)', () => {
    check(
      'DTSTART;TZID=America/New_York:19961105T090000\nRRULE:FREQ=YEARLY;INTERVAL=4;BYMONTH=11;BYDAY=TU;\n BYMONTHDAY=2,3,4,5,6,7,8',
      [...on(1996, 11, [5]), ...on(2000, 11, [7]), ...on(2004, 11, [2])],
      false,
    );
  });

  it('The third instance into the month of one of Tuesday, Wednesday, or Thursday, for the next 3 months', () => {
    check(
      'DTSTART;TZID=America/New_York:19970904T090000\nRRULE:FREQ=MONTHLY;COUNT=3;BYDAY=TU,WE,TH;BYSETPOS=3',
      [...on(1997, 9, [4]), ...on(1997, 10, [7]), ...on(1997, 11, [6])],
      true,
    );
  });

  it('The second-to-last weekday of the month', () => {
    check(
      'DTSTART;TZID=America/New_York:19970929T090000\nRRULE:FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-2',
      [...on(1997, 9, [29]), ...on(1997, 10, [30]), ...on(1997, 11, [27]), ...on(1997, 12, [30]), ...on(1998, 1, [29]), ...on(1998, 2, [26]), ...on(1998, 3, [30])],
      false,
    );
  });

  // RFC 5545 section 3.8.5.3 (page 130) with verified erratum EID 3883, which corrects UNTIL from 17:00Z to
  // 21:00Z; the printed UNTIL (13:00 EDT) bounds the set inclusively (section 3.3.10) and drops 15:00.
  it('Every 3 hours from 9:00 AM to 5:00 PM on a specific day', () => {
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=HOURLY;INTERVAL=3;UNTIL=19970902T210000Z', on(1997, 9, [2], '09:00').concat(on(1997, 9, [2], '12:00'), on(1997, 9, [2], '15:00')), true);
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=HOURLY;INTERVAL=3;UNTIL=19970902T170000Z', on(1997, 9, [2], '09:00').concat(on(1997, 9, [2], '12:00')), true);
    expect(Temporal.Instant.from('1997-09-02T17:00:00Z').toZonedDateTimeISO(NY).toPlainTime().toString()).toBe('13:00:00');
  });

  it('Every 15 minutes for 6 occurrences', () => {
    check(
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MINUTELY;INTERVAL=15;COUNT=6',
      ['09:00', '09:15', '09:30', '09:45', '10:00', '10:15'].map((t) => `1997-09-02T${t}`),
      true,
    );
  });

  it('Every hour and a half for 4 occurrences', () => {
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MINUTELY;INTERVAL=90;COUNT=4', ['09:00', '10:30', '12:00', '13:30'].map((t) => `1997-09-02T${t}`), true);
  });

  // RFC 5545 section 3.8.5.3 (page 131): both forms; the RFC lists two days and "...": we check three days.
  it('Every 20 minutes from 9:00 AM to 4:40 PM every day (both forms)', () => {
    const day = (d: number): string[] => range(9, 16).flatMap((h) => [0, 20, 40].map((m) => `1997-09-0${d}T${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`));
    const expected = [...day(2), ...day(3), ...day(4)];
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;BYHOUR=9,10,11,12,13,14,15,16;BYMINUTE=0,20,40', expected, false);
    check('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MINUTELY;INTERVAL=20;BYHOUR=9,10,11,12,13,14,15,16', expected, false);
    expect(expected).toHaveLength(72);
  });

  it('An example where the days generated makes a difference because of WKST', () => {
    check('DTSTART;TZID=America/New_York:19970805T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=4;BYDAY=TU,SU;WKST=MO', on(1997, 8, [5, 10, 19, 24]), true);
  });

  it('changing only WKST from MO to SU, yields different results...', () => {
    check('DTSTART;TZID=America/New_York:19970805T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=4;BYDAY=TU,SU;WKST=SU', on(1997, 8, [5, 17, 19, 31]), true);
  });

  it('An example where an invalid date (i.e., February 30) is ignored.', () => {
    check('DTSTART;TZID=America/New_York:20070115T090000\nRRULE:FREQ=MONTHLY;BYMONTHDAY=15,30;COUNT=5', [...on(2007, 1, [15, 30]), ...on(2007, 2, [15]), ...on(2007, 3, [15, 30])], true);
  });
});

/**
 * Hand-checked business time across DST changes, a half-hour change, a skipped day, overnight sessions and early
 * closes. Every expected instant is computed here with temporal-polyfill (`ZonedDateTime.from` with Temporal's
 * disambiguation), and the zone facts behind the dates are named beside each case:
 * - United States: DST from the second Sunday of March to the first Sunday of November at 02:00 local (Energy
 *   Policy Act of 2005, section 110; 15 U.S.C. 260a): 2025-03-09 and 2025-11-02.
 * - United Kingdom: summer time from the last Sunday of March to the last Sunday of October at 01:00 GMT (Summer
 *   Time Order 2002, SI 2002/262): 2025-03-30 and 2025-10-26.
 * - Lord Howe Island: a 30-minute DST, ending on the first Sunday of April at 02:00 (to 01:30) and starting on the
 *   first Sunday of October at 02:00 (to 02:30) (IANA tz database, file `australasia`, rule LH; from memory, and
 *   checked here through temporal-polyfill's reading of the runtime's tz data).
 * - Samoa skipped Friday 2011-12-30, moving from UTC-10 to UTC+14 at the end of 2011-12-29 (IANA tz database,
 *   file `australasia`, zone Pacific/Apia).
 * - US stock exchanges close early (13:00 ET) on the day before Independence Day, the day after Thanksgiving and
 *   Christmas Eve: common practice, modelled here as special days relative to holidays.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import {
  type HoursDefinition,
  WallTimeRejectedError,
  countBusinessMs,
  cutoffEpochMsOfDayNumber,
  dayNumberFromYmd,
  defineHours,
  formatPlainDate,
  isOpen,
  listSessions,
  nextClosingEpochMs,
  nextOpeningEpochMs,
  sessionOfEpochMs,
  shiftBusinessTime,
  valueDayNumberOfEpochMs,
} from '../../src/index.js';

const H = 3_600_000;

/** The instant of a local date-time in a zone, by temporal-polyfill. */
function at(text: string, zone: string, disambiguation: 'compatible' | 'earlier' | 'later' = 'compatible'): number {
  return Temporal.PlainDateTime.from(text).toZonedDateTime(zone, { disambiguation }).epochMilliseconds;
}

const EVERY_DAY = (open: string, close: string) =>
  Object.fromEntries(['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'].map((d) => [d, [{ open, close }]]));
const WEEKDAYS = (open: string, close: string) => Object.fromEntries(['monday', 'tuesday', 'wednesday', 'thursday', 'friday'].map((d) => [d, [{ open, close }]]));

describe('New York across the 2025 DST changes (Energy Policy Act of 2005, section 110)', () => {
  const ny = 'America/New_York';
  const night = defineHours({ zone: ny, week: EVERY_DAY('22:00', '06:00') });

  it('a 22:00-06:00 night shift keeps its wall-clock ends: 7 h on the night clocks spring forward, 9 h when they fall back', () => {
    const spring = sessionOfEpochMs(night, at('2025-03-09T01:00', ny))!;
    expect(spring.startEpochMs).toBe(at('2025-03-08T22:00', ny));
    expect(spring.endEpochMs).toBe(at('2025-03-09T06:00', ny));
    expect(spring.lengthMs).toBe(7 * H);
    expect(formatPlainDate(spring.dayNumber)).toBe('2025-03-08'); // the night belongs to the day it opens
    const fall = sessionOfEpochMs(night, at('2025-11-02T03:00', ny))!;
    expect(fall.lengthMs).toBe(9 * H);
    expect(formatPlainDate(fall.dayNumber)).toBe('2025-11-01');
    // A week of nights around the spring change: 6 of 8 h and one of 7 h.
    expect(countBusinessMs(night, at('2025-03-05T12:00', ny), at('2025-03-12T12:00', ny))).toBe(55 * H);
  });

  it('a 09:00-17:00 day on a change day is 8 h (the change is at 02:00); a 01:00-04:00 session is 2 h', () => {
    const day = defineHours({ zone: ny, week: { sunday: [{ open: '01:00', close: '04:00' }, { open: '09:00', close: '17:00' }] } });
    const [early, office] = listSessions(day, at('2025-03-09T00:00', ny), at('2025-03-10T00:00', ny));
    expect(early!.lengthMs).toBe(2 * H);
    expect(early!.endEpochMs).toBe(at('2025-03-09T04:00', ny));
    expect(office!.lengthMs).toBe(8 * H);
    expect(listSessions(day, at('2025-11-02T00:00', ny), at('2025-11-03T00:00', ny))[0]!.lengthMs).toBe(4 * H);
  });

  it('an opening at 02:30 on 2025-03-09 (skipped) and at 01:30 on 2025-11-02 (twice) follows the stated disambiguation', () => {
    const def = (disambiguation: 'compatible' | 'earlier' | 'later' | 'reject'): HoursDefinition => ({
      zone: ny,
      disambiguation,
      week: { sunday: [{ open: '02:30', close: '08:00' }], saturday: [{ open: '20:00', close: '21:00' }] },
      special: [{ date: '2025-11-02', hours: [{ open: '01:30', close: '08:00' }] }],
    });
    for (const d of ['compatible', 'earlier', 'later'] as const) {
      const h = defineHours(def(d));
      expect(nextOpeningEpochMs(h, at('2025-03-09T00:00', ny)), d).toBe(at('2025-03-09T02:30', ny, d));
      expect(nextOpeningEpochMs(h, at('2025-11-02T00:00', ny)), d).toBe(at('2025-11-02T01:30', ny, d));
    }
    expect(at('2025-03-09T02:30', ny)).toBe(Date.UTC(2025, 2, 9, 7, 30)); // compatible: 03:30 EDT
    const strict = defineHours(def('reject'));
    expect(() => nextOpeningEpochMs(strict, at('2025-03-08T12:00', ny))).toThrow(WallTimeRejectedError);
    // The table is compiled by years (the year before and after too), so the first spring Sunday met is named.
    expect(() => nextOpeningEpochMs(strict, at('2025-03-08T12:00', ny))).toThrow(/^week\.sunday\[0\]\.open: 20\d\d-03-\d\dT02:30:00 does not exist in America\/New_York/);
  });
});

describe('London across the 2025 changes (Summer Time Order 2002)', () => {
  const london = 'Europe/London';
  const shifts = defineHours({ zone: london, week: { ...WEEKDAYS('08:00', '16:00'), saturday: [{ open: '22:00', close: '06:00' }] } });

  it('the Saturday night shift is 7 h on 2025-03-29 and 9 h on 2025-10-25', () => {
    expect(sessionOfEpochMs(shifts, at('2025-03-30T03:00', london))!.lengthMs).toBe(7 * H);
    expect(sessionOfEpochMs(shifts, at('2025-10-26T01:30', london, 'later'))!.lengthMs).toBe(9 * H);
    // The week from Monday: five 8-hour days and the long night.
    expect(countBusinessMs(shifts, at('2025-10-20T00:00', london), at('2025-10-27T00:00', london))).toBe((40 + 9) * H);
  });

  it('8 business hours from Friday 14:00 run through the short night into Monday', () => {
    const t = at('2025-03-28T14:00', london);
    // 2 h on Friday, 7 h on the night of Saturday 29 March: the 8th hour ends at Monday 09:00 BST.
    expect(shiftBusinessTime(shifts, t, 'PT8H')).toBe(at('2025-03-30T05:00', london));
    expect(shiftBusinessTime(shifts, t, 'PT10H')).toBe(at('2025-03-31T09:00', london));
    expect(shiftBusinessTime(shifts, at('2025-03-31T09:00', london), '-PT10H')).toBe(t);
  });
});

describe('Lord Howe Island: the half-hour change (IANA tz, rule LH)', () => {
  const lh = 'Australia/Lord_Howe';
  const allDay = defineHours({ zone: lh, week: EVERY_DAY('00:00', '24:00') });

  it('a whole day is 24.5 h on 2025-04-06 and 23.5 h on 2025-10-05', () => {
    expect(countBusinessMs(allDay, at('2025-04-06T00:00', lh), at('2025-04-07T00:00', lh))).toBe(24.5 * H);
    expect(countBusinessMs(allDay, at('2025-10-05T00:00', lh), at('2025-10-06T00:00', lh))).toBe(23.5 * H);
    expect(at('2025-10-06T00:00', lh) - at('2025-10-05T00:00', lh)).toBe(23.5 * H); // Temporal agrees on the day's length
  });

  it('a 01:00-03:00 session on 2025-10-05 is 1.5 h; one of 01:00-03:00 on 2025-04-06 is 2.5 h', () => {
    const h = defineHours({ zone: lh, week: { sunday: [{ open: '01:00', close: '03:00' }] } });
    const oct = listSessions(h, at('2025-10-05T00:00', lh), at('2025-10-06T00:00', lh))[0]!;
    expect([oct.startEpochMs, oct.endEpochMs, oct.lengthMs]).toEqual([at('2025-10-05T01:00', lh), at('2025-10-05T03:00', lh), 1.5 * H]);
    expect(listSessions(h, at('2025-04-06T00:00', lh), at('2025-04-07T00:00', lh))[0]!.lengthMs).toBe(2.5 * H);
  });
});

describe('Pacific/Apia skipped 2011-12-30', () => {
  const apia = 'Pacific/Apia';
  const office = defineHours({ zone: apia, week: WEEKDAYS('09:00', '17:00'), cutoffs: { payments: '15:00' } });

  it('the skipped Friday has no session: Thursday 29 December, then Monday 2 January', () => {
    const list = listSessions(office, at('2011-12-29T00:00', apia), at('2012-01-03T00:00', apia));
    expect(list.map((s) => formatPlainDate(s.dayNumber))).toEqual(['2011-12-29', '2012-01-02']);
    expect(countBusinessMs(office, at('2011-12-29T12:00', apia), at('2012-01-02T12:00', apia))).toBe(8 * H);
    expect(cutoffEpochMsOfDayNumber(office, dayNumberFromYmd(2011, 12, 30), 'payments')).toBeNull();
  });

  it('after the Thursday cut-off the value date is Monday; Saturday 31 December started 24 h after Thursday ended', () => {
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2011-12-29T16:00', apia), 'payments'))).toBe('2012-01-02');
    expect(at('2011-12-31T00:00', apia)).toBe(at('2011-12-29T00:00', apia) + 24 * H); // Temporal: the 30th has no instant
  });

  it('a Thursday night shift 22:00-06:00 runs into Saturday morning and lasts 8 h', () => {
    const night = defineHours({ zone: apia, week: { thursday: [{ open: '22:00', close: '06:00' }] } });
    const s = sessionOfEpochMs(night, at('2011-12-29T23:00', apia))!;
    expect(s.endEpochMs).toBe(at('2011-12-31T06:00', apia));
    expect(s.lengthMs).toBe(8 * H);
  });
});

describe('early closes and cut-offs (common practice: US exchanges close at 13:00 ET before and after some holidays)', () => {
  const ny = 'America/New_York';
  const desk = defineHours({
    zone: ny,
    calendar: 'us-federal',
    week: WEEKDAYS('09:30', '16:00'),
    special: [
      { holiday: 'Independence Day', offset: -1, close: '13:00', cutoffs: { payments: '12:00' } },
      { holiday: 'Thanksgiving Day', offset: 1, close: '13:00', cutoffs: { payments: '12:00' } },
      { holiday: 'Christmas Day', offset: -1, close: '13:00', cutoffs: { payments: '12:00' } },
      { date: '2025-12-31', open: '10:00' },
    ],
    cutoffs: { payments: '15:00' },
  });

  it('2025: Thursday 3 July, Friday 28 November and Wednesday 24 December close at 13:00; 31 December opens late', () => {
    const short = (y: number, m: number, d: number) => {
      const list = listSessions(desk, at(`${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}T00:00`, ny), at(`${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}T23:59`, ny));
      return list.map((s) => [s.startEpochMs, s.endEpochMs]);
    };
    expect(short(2025, 7, 3)).toEqual([[at('2025-07-03T09:30', ny), at('2025-07-03T13:00', ny)]]);
    expect(short(2025, 11, 28)).toEqual([[at('2025-11-28T09:30', ny), at('2025-11-28T13:00', ny)]]);
    expect(short(2025, 12, 24)).toEqual([[at('2025-12-24T09:30', ny), at('2025-12-24T13:00', ny)]]);
    expect(short(2025, 12, 31)).toEqual([[at('2025-12-31T10:00', ny), at('2025-12-31T16:00', ny)]]);
    expect(nextClosingEpochMs(desk, at('2025-07-03T10:00', ny))).toBe(at('2025-07-03T13:00', ny));
    expect(isOpen(desk, at('2025-07-03T13:30', ny))).toBe(false);
  });

  it('in 2026 Independence Day (a Saturday) is observed on Friday 3 July (5 U.S.C. 6103), so Thursday 2 July closes early', () => {
    expect(nextClosingEpochMs(desk, at('2026-07-02T10:00', ny))).toBe(at('2026-07-02T13:00', ny));
    expect(nextOpeningEpochMs(desk, at('2026-07-02T14:00', ny))).toBe(at('2026-07-06T09:30', ny));
  });

  it('the value date: at or before the cut-off the same day (the cut-off instant itself is in time), else the next business day', () => {
    const cut = at('2025-07-02T15:00', ny);
    expect(cutoffEpochMsOfDayNumber(desk, dayNumberFromYmd(2025, 7, 2), 'payments')).toBe(cut);
    expect(formatPlainDate(valueDayNumberOfEpochMs(desk, cut, 'payments'))).toBe('2025-07-02');
    expect(formatPlainDate(valueDayNumberOfEpochMs(desk, cut + 0.5, 'payments'))).toBe('2025-07-02'); // a fraction answers as its whole ms
    expect(formatPlainDate(valueDayNumberOfEpochMs(desk, cut + 1, 'payments'))).toBe('2025-07-03');
    // On the early-close day the cut-off moves to 12:00; after it, the holiday and the weekend pass.
    expect(formatPlainDate(valueDayNumberOfEpochMs(desk, at('2025-07-03T12:30', ny), 'payments'))).toBe('2025-07-07');
    expect(formatPlainDate(valueDayNumberOfEpochMs(desk, at('2025-07-05T09:00', ny), 'payments'))).toBe('2025-07-07');
  });

  it('business time across the early close and the holiday: Wednesday 15:00 to Monday 10:30 is 1 + 3.5 + 1 h', () => {
    expect(countBusinessMs(desk, at('2025-07-02T15:00', ny), at('2025-07-07T10:30', ny))).toBe(5.5 * H);
    expect(countBusinessMs(desk, at('2025-07-07T10:30', ny), at('2025-07-02T15:00', ny))).toBe(-5.5 * H);
    expect(shiftBusinessTime(desk, at('2025-07-02T15:00', ny), 'PT5H30M')).toBe(at('2025-07-07T10:30', ny));
    // A duration that ends exactly at a close answers the close, not the next opening.
    expect(shiftBusinessTime(desk, at('2025-07-03T12:00', ny), 'PT1H')).toBe(at('2025-07-03T13:00', ny));
  });

  it('fractions of a millisecond: open until the close, and kept in business time', () => {
    const close = at('2025-07-03T13:00', ny);
    expect(isOpen(desk, close - 0.5)).toBe(true);
    expect(isOpen(desk, close)).toBe(false);
    expect(countBusinessMs(desk, close - 1.5, close + 5)).toBe(1.5);
  });
});

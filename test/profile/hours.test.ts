/**
 * The profile's `hours` section: named opening hours compiled with defineHours, taking the profile's zone by
 * default and a business calendar by name (bundled or the profile's), by inline definition, or by an inline
 * definition that extends a profile calendar. The reference for the demo's entries is the hand-written definitions
 * of examples/scenario.ts (SUPPORT_DESK_HOURS, PAYMENTS_OFFICE_HOURS), compiled by defineHours alone; the dates
 * are checked against 5 U.S.C. 6103(a) (Thanksgiving Day: the fourth Thursday in November; Christmas Day: 25
 * December). Every fault is reported at its path inside the profile.
 */
import { describe, expect, it } from 'vitest';
import {
  KalendsRangeError,
  KalendsTypeError,
  countBusinessMs,
  defineHours,
  defineProfile,
  formatPlainDate,
  hoursOfProfile,
  isOpen,
  listSessions,
  parseInstant,
  valueDayNumberOfEpochMs,
} from '../../src/index.js';
import { copy, demo, issuesOf } from './helpers.js';
import { PAYMENTS_OFFICE_HOURS, SUPPORT_DESK_HOURS } from '../../examples/scenario.js';

const at = (text: string) => parseInstant(text).epochMs;
const H = 3_600_000;

describe('the demo profile\'s opening hours', () => {
  const profile = defineProfile(demo as never);
  const desk = hoursOfProfile(profile, 'support-desk');
  const office = hoursOfProfile(profile, 'payments-office');

  it('take the profile\'s zone and its "federal" calendar by name', () => {
    expect(desk.zoneId).toBe('America/Chicago');
    expect(desk.calendarId).toBe('us-federal');
    expect(office.cutoffNames).toEqual(['payments']);
    expect(Object.keys(profile.hours)).toEqual(['support-desk', 'payments-office']);
  });

  it('give the same sessions and value dates as the scenario\'s hand-written definitions, over 2024-2026', () => {
    const start = at('2024-01-01T00:00:00Z');
    const end = at('2027-01-01T00:00:00Z');
    expect(listSessions(desk, start, end)).toEqual(listSessions(defineHours(SUPPORT_DESK_HOURS), start, end));
    const byHand = defineHours(PAYMENTS_OFFICE_HOURS);
    expect(listSessions(office, start, end)).toEqual(listSessions(byHand, start, end));
    for (let t = start; t < end; t += 7 * H + 1234) {
      expect(valueDayNumberOfEpochMs(office, t, 'payments')).toBe(valueDayNumberOfEpochMs(byHand, t, 'payments'));
    }
  });

  it('close early the day before Thanksgiving Day (2025-11-27, the fourth Thursday of November, 5 U.S.C. 6103(a))', () => {
    // 2025-11-26 is a Wednesday; Chicago is on CST (UTC-6) in late November.
    expect(isOpen(desk, at('2025-11-26T14:59:59-06:00'))).toBe(true);
    expect(isOpen(desk, at('2025-11-26T15:00:00-06:00'))).toBe(false);
    expect(isOpen(desk, at('2025-11-27T10:00:00-06:00'))).toBe(false); // Thanksgiving Day
    expect(countBusinessMs(desk, at('2025-11-26T00:00:00-06:00'), at('2025-11-27T00:00:00-06:00'))).toBe(7 * H);
  });

  it('move a payment past the 17:00 cut-off to the next business day, and the day before Christmas Day to 12:00', () => {
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2025-11-25T17:00:00-06:00'), 'payments'))).toBe('2025-11-25');
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2025-11-25T17:00:00.001-06:00'), 'payments'))).toBe('2025-11-26');
    // Wednesday 2025-11-26 after the cut-off: Thursday is Thanksgiving Day, so the value date is Friday.
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2025-11-26T17:30:00-06:00'), 'payments'))).toBe('2025-11-28');
    // 2025-12-24 (the business day before Christmas Day): 12:00 cut-off; Thursday 25 is Christmas Day.
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2025-12-24T11:59:00-06:00'), 'payments'))).toBe('2025-12-24');
    expect(formatPlainDate(valueDayNumberOfEpochMs(office, at('2025-12-24T12:30:00-06:00'), 'payments'))).toBe('2025-12-26');
  });

  it('hoursOfProfile suggests the nearest name and refuses a name that is not a string', () => {
    expect(() => hoursOfProfile(profile, 'suport-desk')).toThrow(KalendsRangeError);
    expect(() => hoursOfProfile(profile, 'suport-desk')).toThrow(/did you mean "support-desk"/);
    expect(() => hoursOfProfile(profile, 42 as never)).toThrow(KalendsTypeError);
    expect(() => hoursOfProfile({} as never, 'support-desk')).toThrow(KalendsTypeError);
  });

  it('survive defining the profile again from its kept definition', () => {
    const again = defineProfile(profile.definition);
    const t = at('2025-12-24T17:30:00Z');
    expect(isOpen(hoursOfProfile(again, 'support-desk'), t)).toBe(isOpen(desk, t));
  });
});

describe('profile hours take a calendar by name, inline, or extending the profile\'s', () => {
  const WEEKDAYS = { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }], wednesday: [{ open: '09:00', close: '17:00' }], thursday: [{ open: '09:00', close: '17:00' }], friday: [{ open: '09:00', close: '17:00' }] };
  // Friday 2025-11-28 is the company's shutdown day after Thanksgiving (the demo profile's "company" calendar),
  // and a business day of the bundled us-federal calendar.
  const friday = at('2025-11-28T12:00:00-06:00');

  it('a profile calendar by name closes its own days; the bundled one does not', () => {
    const doc = copy();
    doc.hours = {
      company: { calendar: 'company', week: WEEKDAYS },
      bundled: { calendar: 'us-federal', week: WEEKDAYS },
      inline: { calendar: { extends: 'company', holidays: [{ kind: 'fixed', name: 'Stocktake (invented)', month: 12, day: 1 }] }, week: WEEKDAYS },
      none: { week: WEEKDAYS, zone: 'Europe/Dublin' },
    };
    const p = defineProfile(doc as never);
    expect(isOpen(hoursOfProfile(p, 'company'), friday)).toBe(false);
    expect(isOpen(hoursOfProfile(p, 'bundled'), friday)).toBe(true);
    expect(isOpen(hoursOfProfile(p, 'inline'), friday)).toBe(false);
    // Monday 2025-12-01, the inline calendar's own closing day.
    expect(isOpen(hoursOfProfile(p, 'inline'), at('2025-12-01T12:00:00-06:00'))).toBe(false);
    expect(isOpen(hoursOfProfile(p, 'company'), at('2025-12-01T12:00:00-06:00'))).toBe(true);
    // An explicit zone wins over the profile's: 12:00 in Dublin (UTC+0 in November) is 06:00 in Chicago.
    expect(hoursOfProfile(p, 'none').zoneId).toBe('Europe/Dublin');
    expect(isOpen(hoursOfProfile(p, 'none'), at('2025-11-28T12:00:00Z'))).toBe(true);
  });

  it('every fault at its path inside the profile, all at once', () => {
    const bad = copy();
    bad.hours['support-desk'].calendar = 'federl';
    bad.hours['payments-office'].week.monday = [{ open: '09:00', close: '09:00' }];
    bad.hours['payments-office'].special[0].holiday = 'Christmass Day';
    bad.hours.night = {
      zone: 'America/Chicgo',
      calendar: { extends: 'compny' },
      week: { monday: [{ open: '10:00', close: '12:00' }, { open: '11:00', close: '13:00' }] },
      special: [{ holiday: 'Christmas Day', close: '11:00' }],
    };
    const byPath = Object.fromEntries(issuesOf(bad).map((i) => [i.path, i.message]));
    expect(Object.keys(byPath).sort()).toEqual(
      [
        'hours.support-desk.calendar',
        'hours.payments-office.week.monday[0]',
        'hours.payments-office.special[0].holiday',
        'hours.night.zone',
        'hours.night.calendar.extends',
        'hours.night.week.monday[1]',
      ].sort(),
    );
    expect(byPath['hours.support-desk.calendar']).toMatch(/did you mean "federal"/);
    expect(byPath['hours.payments-office.special[0].holiday']).toMatch(/did you mean "Christmas Day"/);
    expect(byPath['hours.night.zone']).toMatch(/did you mean "America\/Chicago"/);
    expect(byPath['hours.night.calendar.extends']).toMatch(/did you mean "company"/);
    // The night entry's holiday is not reported: its calendar could not be built, so its names are unknown.
  });

  it('a calendar with faults of its own is reported once, under calendars', () => {
    const bad = copy();
    bad.calendars.company.holidays[0].offset = 'one';
    const paths = issuesOf(bad).map((i) => i.path);
    expect(paths.some((p) => p.startsWith('calendars.company.holidays[0]'))).toBe(true);
    expect(paths.filter((p) => p.startsWith('hours.'))).toEqual([]);
    const hoursOnCompany = copy();
    hoursOnCompany.calendars.company.holidays[0].offset = 'one';
    hoursOnCompany.hours['support-desk'].calendar = 'company';
    expect(issuesOf(hoursOnCompany).map((i) => i.path).filter((p) => p.startsWith('hours.'))).toEqual([]);
  });

  it('a profile whose zone is faulty reports the zone once, not again for hours that take it', () => {
    const bad = copy();
    bad.zone = 'Mars/Olympus';
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['zone']);
  });

  it('structural faults the schema states: an entry that is no object, a missing week, a time that is no time, a cut-off name', () => {
    const bad = copy();
    bad.hours.a = 'nine to five';
    bad.hours.b = { calendar: 'federal' };
    bad.hours.c = { week: { monday: [{ open: '9am', close: '17:00' }] } };
    bad.hours.d = { week: { funday: [] } };
    bad.hours.e = { week: { monday: [{ open: '09:00', close: '17:00' }] }, cutoffs: { 'Late Payments': '16:00' } };
    const byPath = Object.fromEntries(issuesOf(bad).map((i) => [i.path, i.message]));
    expect(Object.keys(byPath).sort()).toEqual(['hours.a', 'hours.b.week', 'hours.c.week.monday[0].open', 'hours.d.week.funday', 'hours.e.cutoffs.Late Payments'].sort());
    expect(byPath['hours.d.week.funday']).toMatch(/did you mean "sunday"|valid fields/);
  });
});

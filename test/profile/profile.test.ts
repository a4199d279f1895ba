/**
 * defineProfile: the demo profile compiles into the same units, calendars and rules as the definitions written
 * out by hand (the period, business and recurrence layers are the reference here; their own tests check them
 * against the sources they name), and every bad input of the profiles issue is reported at its path, all at once.
 */
import { describe, expect, it } from 'vitest';
import {
  KalendsRangeError,
  KalendsSyntaxError,
  KalendsTypeError,
  calendarOfProfile,
  countBusinessDays,
  dayNumberFromYmd,
  defineCalendar,
  defineProfile,
  defineRule,
  defineUnit,
  listOccurrenceDayNumbers,
  ruleOfProfile,
  unitOfProfile,
} from '../../src/index.js';
import { copy, demo, issuesOf } from './helpers.js';



describe('defineProfile on the demo profile', () => {
  const profile = defineProfile(demo as never);

  it('hands out units equal to the definitions written out by hand', () => {
    const retail = { yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4', extraWeek: 'last-period' } as const;
    expect(unitOfProfile(profile, 'fiscal-quarter')).toBe(defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }));
    expect(unitOfProfile(profile, 'retail-week').id).toBe(defineUnit({ kind: 'fiscal-week', ...retail }).id);
    expect(unitOfProfile(profile, 'retail-period').id).toBe(defineUnit({ kind: 'fiscal-period', ...retail }).id);
    expect(unitOfProfile(profile, 'week').id).toBe('iso-week');
    expect(profile.zone.id).toBe('America/Chicago');
  });

  it('hands out calendars and rules that answer as the hand-written ones', () => {
    const byHand = defineCalendar({
      extends: 'us-federal',
      holidays: [
        { id: 'day-after-thanksgiving', name: 'x', kind: 'relative', to: 'thanksgiving-day', offset: 1 },
        { id: 'christmas-eve', name: 'y', kind: 'fixed', month: 12, day: 24 },
      ],
    });
    const a = dayNumberFromYmd(2000, 1, 1);
    const b = dayNumberFromYmd(2040, 1, 1);
    expect(countBusinessDays(calendarOfProfile(profile), a, b)).toBe(countBusinessDays(byHand, a, b));
    expect(calendarOfProfile(profile, 'federal').id).toBe('us-federal');
    const rule = defineRule({ kind: 'monthly', on: [{ day: 15 }, { businessDay: 'last' }], calendar: byHand, convention: 'modified-following' });
    expect(listOccurrenceDayNumbers(ruleOfProfile(profile, 'supplier-payments'), '2020-01-01', '2030-01-01')).toEqual(listOccurrenceDayNumbers(rule, '2020-01-01', '2030-01-01'));
  });

  it('keeps the document, and defining it again gives the same answers', () => {
    const again = defineProfile(profile.definition);
    expect(Object.keys(again.units)).toEqual(Object.keys(profile.units));
    expect(Object.isFrozen(profile.definition)).toBe(true);
    expect(again.warehouse?.start).toBe(dayNumberFromYmd(1990, 1, 1));
  });

  it('accepts JSON text, and refuses text that is not JSON with a syntax error', () => {
    expect(defineProfile(JSON.stringify(demo)).id).toBe('otterbrook');
    expect(() => defineProfile('{"id": ')).toThrow(KalendsSyntaxError);
  });

  it('accessors suggest the nearest name and refuse what is not a profile', () => {
    expect(() => unitOfProfile(profile, 'retail-wek')).toThrow(/did you mean "retail-week"/);
    expect(() => ruleOfProfile(profile, 'payroll')).toThrow(KalendsRangeError);
    expect(() => calendarOfProfile({} as never)).toThrow(KalendsTypeError);
  });
});

describe('defineProfile: every fault at its path, all at once', () => {
  it('reports the faults the profiles issue names, each with its path, in one error', () => {
    const bad = copy();
    bad.zone = 'America/Chicgo'; // unknown zone
    bad.calendars.company.extends = 'us-fedral'; // unknown calendar name
    bad.units['retail-period'].layout = '4-4-5'; // inconsistent with the fiscal year
    bad.rules['month-end-close'].calendar = 'compny'; // a calendar the profile lacks
    bad.rules['supplier-payments'].on[0].day = 40; // a fault inside a nested rule
    bad.fiscalYears.wholesale.start.day = 31; // (October has 31 days: no fault)
    bad.fiscalYears.retail.yearEnd.month = 13; // a fault inside a nested unit
    const issues = issuesOf(bad);
    const byPath = Object.fromEntries(issues.map((i) => [i.path, i.message]));
    expect(Object.keys(byPath).sort()).toEqual(
      ['zone', 'calendars.company.extends', 'rules.month-end-close.calendar', 'rules.supplier-payments.on[0].day', 'fiscalYears.retail.yearEnd.month'].sort(),
    );
    expect(byPath['zone']).toMatch(/did you mean "America\/Chicago"/);
    expect(byPath['calendars.company.extends']).toMatch(/did you mean "us-federal"/);
    expect(byPath['rules.month-end-close.calendar']).toMatch(/did you mean "company"/);
  });

  it('a unit inconsistent with its fiscal year', () => {
    const bad = copy();
    bad.units['retail-period'].layout = '4-4-5';
    bad.units['fiscal-month'].kind = 'fiscal-week';
    bad.units['fiscal-month'].layout = '4-4-5';
    expect(issuesOf(bad).map((i) => i.path).sort()).toEqual(['units.fiscal-month.kind', 'units.fiscal-month.layout', 'units.retail-period.layout']);
    const noLayout = copy();
    delete noLayout.fiscalYears.retail.layout;
    delete noLayout.units['retail-period'].layout;
    expect(issuesOf(noLayout).map((i) => i.path).sort()).toEqual(['units.retail-period.kind', 'units.retail-quarter.kind']);
  });

  it('faults inside nested calendar and rule definitions are re-prefixed with the profile path', () => {
    const bad = copy();
    bad.calendars.company.holidays[1].month = 13;
    bad.rules['hourly-payroll'].weekdays = ['fryday'];
    const paths = issuesOf(bad).map((i) => i.path);
    expect(paths).toContain('calendars.company.holidays[1].month');
    expect(paths.some((p) => p.startsWith('rules.hourly-payroll.weekdays'))).toBe(true);
  });

  it('an export range beyond the supported years (the calendar\'s, then the civil range)', () => {
    const bad = copy();
    bad.warehouse.start = '1960-01-01'; // us-federal starts in 1971 (5 U.S.C. 6103 as amended, the bundled calendar's first year)
    bad.warehouse.end = '+300000-01-01'; // past the supported years
    const byPath = Object.fromEntries(issuesOf(bad).map((i) => [i.path, i.message]));
    expect(Object.keys(byPath).sort()).toEqual(['warehouse.end', 'warehouse.start']);
    expect(byPath['warehouse.start']).toMatch(/1971/);
    const late = copy();
    late.warehouse.end = '2400-01-01';
    expect(issuesOf(late)).toEqual([]);
  });

  it('structural faults: unknown fields with suggestions, wrong kinds, bad names, calendars in a cycle', () => {
    const bad = copy();
    bad.fiscalYear = {};
    bad.week = { firstWeekday: 'Sunday' };
    bad.units['Retail Week'] = { kind: 'month' };
    bad.calendars.loop = { extends: 'loop2' };
    bad.calendars.loop2 = { extends: 'loop' };
    bad.labels.day = 'Q{quarter}';
    const paths = issuesOf(bad).map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['fiscalYear', 'week.firstWeekday', 'units.Retail Week', 'labels.day']));
    expect(paths.some((p) => p.startsWith('calendars.loop'))).toBe(true);
    expect(issuesOf(bad).find((i) => i.path === 'fiscalYear')!.message).toMatch(/did you mean "fiscalYears"/);
  });

  it('a document that is not an object', () => {
    for (const doc of [null, [], 42]) expect(issuesOf(doc).map((i) => i.path)).toEqual(['(profile)']);
  });
});

import {
  calendarOfProfile,
  countBusinessDays,
  dayNumberFromYmd,
  defineProfile,
  dimensionTableFromProfile,
  formatDayForPeople,
  formatExampleQueriesSql,
  formatLabelForPeople,
  formatPeriod,
  formatPlainDate,
  hoursOfProfile,
  listOccurrenceDayNumbers,
  parseInstant,
  periodFromEpochMs,
  ruleOfProfile,
  scheduleTableFromProfile,
  transitionTableFromZones,
  unitOfProfile,
  valueDayNumberOfEpochMs,
} from '../../src/index.js';
import type { DemoSection } from '../demo.js';
import otterbrook from '../otterbrook.profile.json';

export const section: DemoSection = {
  title: 'One profile for the whole calendar, and the warehouse tables it makes',
  run(print) {
    // The company's calendar, in one JSON document (examples/otterbrook.profile.json, explained in docs/profiles.md).
    const profile = defineProfile(otterbrook as never);
    print(`${profile.name}: zone ${profile.zone.id}, units ${Object.keys(profile.units).join(', ')}; calendars ${Object.keys(profile.calendars).join(', ')}; rules ${Object.keys(profile.rules).join(', ')}`);

    // The same units, calendars and rules the other sections built by hand, now by name.
    const ms = Date.parse('2025-10-01T03:30:00Z');
    for (const name of ['fiscal-quarter', 'retail-period', 'retail-week']) {
      const p = periodFromEpochMs(unitOfProfile(profile, name), profile.zone, ms);
      print(`  2025-10-01T03:30Z in ${profile.zone.id}: ${name} ${formatPeriod(p)}, for people "${formatLabelForPeople(profile, name, p.ordinal)}"`);
    }
    print(`  that day for people: ${formatDayForPeople(profile, dayNumberFromYmd(2025, 9, 30))}`);
    const cal = calendarOfProfile(profile);
    print(`  business days in 2026 (calendar "${profile.defaultCalendarName}"): ${countBusinessDays(cal, dayNumberFromYmd(2026, 1, 1), dayNumberFromYmd(2027, 1, 1))}`);
    // The hours the business-time section wrote out by hand, now from the profile by name.
    const office = hoursOfProfile(profile, 'payments-office');
    const late = parseInstant('2025-11-26T17:30:00-06:00').epochMs;
    print(`  hours ${Object.keys(profile.hours).join(', ')}; a payment instructed 2025-11-26 17:30 in Chicago (after the 17:00 cut-off, before Thanksgiving Day) takes value date ${formatPlainDate(valueDayNumberOfEpochMs(office, late, 'payments'))}`);

    // The warehouse tables of 2026: the dimension, the zones' offset periods, the rules' occurrences.
    const dim = dimensionTableFromProfile(profile, { start: '2026-01-01', end: '2027-01-01' });
    const zones = transitionTableFromZones(profile.warehouse!.zones, Date.UTC(2025, 11, 30), Date.UTC(2027, 0, 2));
    const schedule = scheduleTableFromProfile(profile, { start: '2026-01-01', end: '2027-01-01' });
    print(`Warehouse tables for 2026: calendar_day ${dim.rowCount} rows x ${dim.columns.length} columns, zone_offset_period ${zones.rowCount} rows, schedule_occurrence ${schedule.rowCount} rows.`);
    const col = (name: string) => schedule.columns.find((c) => c.name === name)!.values as ArrayLike<unknown>;
    const moved: string[] = [];
    for (let i = 0; i < schedule.rowCount && moved.length < 4; i++) {
      if (col('moved')[i] === 1 && col('rule_name')[i] === 'supplier-payments') {
        moved.push(`${formatPlainDate(col('unadjusted_date')[i] as number)} -> ${formatPlainDate(col('adjusted_date')[i] as number)} (${col('moved_because')[i]}: ${col('moved_because_detail')[i]})`);
      }
    }
    print(`  supplier payments moved in 2026: ${moved.join('; ')}`);
    const close = ruleOfProfile(profile, 'month-end-close');
    print(`  ${close.definition.label}, first quarter of 2026, from the profile's rule: ${listOccurrenceDayNumbers(close, '2026-01-01', '2026-04-01').map(formatPlainDate).join(', ')}`);
    const query = formatExampleQueriesSql(dim, { labelColumns: ['fiscal_quarter_label', 'retail_week_label'] });
    print('  events to local days and fiscal quarters in any SQL engine (from queries.sql):');
    for (const line of query.split('\n').slice(6, 12)) print(`    ${line}`);
    print('  `kalends warehouse --profile examples/otterbrook.profile.json --out warehouse` writes the files (docs/warehouse.md).');
    print('  (holiday calendars change by proclamation: verify closing and payment dates against the official calendar)');
  },
};

/**
 * The compiler of trusted definitions (src/business/trusted.ts), which compiles the bundled calendars without the
 * validator: for each bundled definition, and for flat definitions that use every rule kind, it must give the very
 * node that the validator (src/business/validate.ts) gives, field by field (rules with their observance shifts,
 * their evaluation order and references, one-offs with their dates, weekend, years). The holiday dates themselves
 * are checked against the official tables in reference.test.ts, through calendars taken by name, which now come
 * from this compiler.
 */
import { describe, expect, it } from 'vitest';
import { calendarFromName, defineCalendar, listHolidays } from '../../src/business/index.js';
import type { CalendarDefinition } from '../../src/business/definition.js';
import { BUNDLED_CALENDAR_NAMES, BUNDLED_DEFINITIONS } from '../../src/business/jurisdictions/index.js';
import { nodeOfTrustedDefinition } from '../../src/business/trusted.js';
import { normalizeDefinition } from '../../src/business/validate.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

function validatedNode(def: CalendarDefinition): unknown {
  const { node, issues } = normalizeDefinition(def);
  expect(issues).toEqual([]);
  return node;
}

describe('trusted compiler', () => {
  it.each(BUNDLED_CALENDAR_NAMES)('gives the node the validator gives for the bundled %s', (name) => {
    const def = BUNDLED_DEFINITIONS[name];
    expect(nodeOfTrustedDefinition(def)).toEqual(validatedNode(def));
  });

  it.each(BUNDLED_CALENDAR_NAMES)('a calendar taken by name matches defineCalendar of its definition (%s)', (name) => {
    const byName = calendarFromName(name);
    const defined = defineCalendar(BUNDLED_DEFINITIONS[name]);
    for (const key of ['id', 'name', 'source', 'caution', 'weekend', 'weekendNames', 'firstYear', 'lastYear', 'definition'] as const) {
      expect(byName[key]).toEqual(defined[key]);
    }
    const start = dayNumberFromYmd(byName.firstYear, 1, 1);
    const end = dayNumberFromYmd(2060, 1, 1);
    expect(listHolidays(byName, start, end)).toEqual(listHolidays(defined, start, end));
  });

  const flat: [string, CalendarDefinition][] = [
    [
      'every rule kind, a relative chain, a default weekend and no years',
      {
        id: 'kinds',
        observance: { sunday: 'next-non-weekend-day' },
        holidays: [
          { id: 'b', name: 'B', kind: 'relative', to: 'a', offset: 1 },
          { id: 'a', name: 'A', kind: 'nth-weekday', month: 11, weekday: 'thursday', nth: 4 },
          { id: 'c', name: 'C', kind: 'relative', to: 'b', offset: 2, observance: {} },
          { name: 'Last', kind: 'nth-weekday', month: 5, weekday: 'monday', nth: 'last' },
          { name: 'After', kind: 'weekday-on-or-after', month: 6, day: 20, weekday: 'saturday' },
          { name: 'Before', kind: 'weekday-on-or-before', month: 2, day: 29, weekday: 'friday', from: 2000, until: 2100 },
          { name: 'Orthodox', kind: 'easter', offset: 1, computus: 'julian' },
          { name: 'Pentecost', kind: 'easter', offset: 49, computus: 'gregorian', observance: { saturday: 'substitute-day' } },
          { name: 'Fixed', kind: 'fixed', month: 12, day: 31, observance: { saturday: 'nearest-non-weekend-day', sunday: 'previous-non-weekend-day' } },
        ],
      },
    ],
    [
      'a Friday-Saturday weekend, Julian Easter only, years until',
      {
        weekend: ['friday', 'saturday'],
        years: { until: 3000 },
        holidays: [{ id: 'e', name: 'E', kind: 'easter', offset: 0, computus: 'julian' }, { name: 'R', kind: 'relative', to: 'e', offset: -2 }],
        additions: [{ date: '2030-01-02', name: 'One-off' }],
      },
    ],
  ];
  it.each(flat)('gives the node the validator gives: %s', (_, def) => {
    expect(nodeOfTrustedDefinition(def)).toEqual(validatedNode(def));
  });
});

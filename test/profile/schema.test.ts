/**
 * The published JSON Schema of profiles against the library's validator. Reference: JSON Schema draft 2020-12
 * (json-schema.org, "JSON Schema Validation", sections 6.1-6.5), as implemented by ajv 8 (a dev dependency).
 *
 * - The committed schema file equals the one generated from the profile's one field description (no drift).
 * - A fast-check property builds documents, valid ones and ones broken by faults the schema can state, and asserts
 *   that ajv's verdict equals defineProfile's verdict on every one.
 * - What the schema cannot state (zone ids the runtime knows, references between sections, days per month,
 *   nested calendar and rule definitions, locales, export ranges against a calendar's years) the generator keeps
 *   valid, and DEVIATIONS below lists each with a document that the schema accepts and the library refuses.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import Ajv2020 from 'ajv/dist/2020.js';
import { DefinitionError, LABEL_FIELD_NAMES, WEEKDAY_NAMES, defineProfile } from '../../src/index.js';
import { profileJsonSchema, profileJsonSchemaText } from '../../src/profile/schema.js';

const schemaPath = fileURLToPath(new URL('../../schema/profile.schema.json', import.meta.url));
const ajv = new Ajv2020({ allErrors: true, strict: true });
const validate = ajv.compile(JSON.parse(readFileSync(schemaPath, 'utf8')) as object);

function libraryAccepts(doc: unknown): boolean {
  try {
    defineProfile(doc as never);
    return true;
  } catch (e) {
    if (e instanceof DefinitionError) return false;
    throw e;
  }
}

const BASE = {
  id: 'base',
  name: 'A profile',
  zone: 'America/Chicago',
  week: 'iso',
};

describe('profile JSON Schema', () => {
  it('the committed schema file equals the one generated from the field description', () => {
    expect(readFileSync(schemaPath, 'utf8')).toBe(profileJsonSchemaText());
  });

  it('is a valid draft 2020-12 schema in ajv strict mode', () => {
    expect(ajv.validateSchema(profileJsonSchema())).toBe(true);
  });

  it('the demo profile and a minimal one pass both', () => {
    const demo = JSON.parse(readFileSync(fileURLToPath(new URL('../../examples/otterbrook.profile.json', import.meta.url)), 'utf8')) as unknown;
    for (const doc of [demo, BASE]) {
      expect(validate(doc)).toBe(true);
      expect(libraryAccepts(doc)).toBe(true);
    }
  });

  // Each rule the schema cannot state, with a document that the schema accepts and the library refuses.
  const DEVIATIONS: Record<string, object> = {
    'zone ids the runtime knows': { ...BASE, zone: 'America/Chicgo' },
    'a unit names a fiscal year the profile lacks': { ...BASE, units: { q: { kind: 'fiscal-quarter', fiscalYear: 'missing' } } },
    'a unit inconsistent with its fiscal year': {
      ...BASE,
      fiscalYears: { fy: { start: { month: 10, day: 1 }, naming: 'end-year' } },
      units: { w: { kind: 'fiscal-week', fiscalYear: 'fy' } },
    },
    'days per month in a fiscal start': { ...BASE, fiscalYears: { fy: { start: { month: 2, day: 30 }, naming: 'end-year' } } },
    'calendar names (bundled or the profile\'s)': { ...BASE, calendars: { c: 'us-fedral' } },
    'nested calendar definitions': { ...BASE, calendars: { c: { holidays: [{ kind: 'fixed', name: 'x', month: 13, day: 1 }] } } },
    'a rule names a calendar the profile lacks': { ...BASE, rules: { r: { kind: 'monthly', on: { day: 15 }, calendar: 'missing' } } },
    'nested rule definitions': { ...BASE, rules: { r: { kind: 'monthly', on: { day: 40 } } } },
    'the default calendar names one of the profile\'s': { ...BASE, calendars: { c: 'us-federal' }, defaultCalendar: 'd' },
    'label templates name the profile\'s units': { ...BASE, labels: { locale: 'en-US', units: { missing: '{label}' } } },
    'locales (BCP 47 tags)': { ...BASE, labels: { locale: 'not a locale!' } },
    'export dates that exist': { ...BASE, warehouse: { start: '2025-02-30', end: '2026-01-01' } },
    'an export range within the calendar\'s years': { ...BASE, calendars: { c: 'us-federal' }, warehouse: { start: '1900-01-01', end: '1950-01-01' } },
    'export zones the runtime knows': { ...BASE, warehouse: { start: '2025-01-01', end: '2026-01-01', zones: ['Mars/Olympus'] } },
    'the unit name "week" is the week convention': { ...BASE, units: { week: { kind: 'month' } } },
    'nested hours definitions (overlapping intervals)': { ...BASE, hours: { desk: { week: { monday: [{ open: '09:00', close: '12:00' }, { open: '11:00', close: '13:00' }] } } } },
    'an hours calendar the profile lacks': { ...BASE, hours: { desk: { calendar: 'missing', week: { monday: [{ open: '09:00', close: '17:00' }] } } } },
    'hours zones the runtime knows': { ...BASE, hours: { desk: { zone: 'Mars/Olympus', week: { monday: [{ open: '09:00', close: '17:00' }] } } } },
    'an opening time of 24:00': { ...BASE, hours: { desk: { week: { monday: [{ open: '24:00', close: '06:00' }] } } } },
    'hours on a weekday the calendar\'s weekend always closes': { ...BASE, hours: { desk: { calendar: 'us-federal', week: { saturday: [{ open: '09:00', close: '17:00' }] } } } },
    'cut-offs within the sessions': { ...BASE, hours: { desk: { week: { monday: [{ open: '09:00', close: '17:00' }] }, cutoffs: { payments: '18:00' } } } },
  };

  it.each(Object.entries(DEVIATIONS))('deviation, kept valid by the generator: %s', (_, doc) => {
    expect(validate(doc)).toBe(true);
    expect(libraryAccepts(doc)).toBe(false);
  });

  it('ajv and defineProfile give the same verdict on generated documents, valid and broken', () => {
    const name = fc.constantFrom('main', 'retail', 'wholesale', 'a1', 'fiscal-quarter', 'x-y-z');
    const monthYear = fc.record({
      start: fc.record({ month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) }),
      naming: fc.constantFrom('end-year', 'start-year'),
    });
    const weekYear = fc.record(
      {
        yearEnd: fc.record({ weekday: fc.constantFrom(...WEEKDAY_NAMES), month: fc.integer({ min: 1, max: 12 }), rule: fc.constantFrom('last', 'nearest') }),
        naming: fc.constantFrom('end-year', 'start-year'),
        layout: fc.constantFrom('4-4-5', '4-5-4', '5-4-4', '13x4'),
        extraWeek: fc.constantFrom('last-period', 'first-period'),
      },
      { requiredKeys: ['yearEnd', 'naming', 'layout'] },
    );
    const fiscalYears = fc.dictionary(name, fc.oneof(monthYear, weekYear), { maxKeys: 3 });
    const calendarsArb = fc.dictionary(
      fc.constantFrom('company', 'bank', 'shop'),
      fc.constantFrom<unknown>('us-federal', 'england-and-wales', { extends: 'us-federal', weekend: ['saturday', 'sunday'] }, { weekend: ['friday', 'saturday'] }),
      { maxKeys: 3 },
    );
    const docArb = fc
      .record({
        id: name,
        name: fc.string({ minLength: 1, maxLength: 30 }),
        zone: fc.constantFrom('America/Chicago', 'Europe/Dublin', 'Asia/Kolkata', 'UTC', '+05:30'),
        week: fc.oneof(fc.constant<unknown>('iso'), fc.record({ firstWeekday: fc.constantFrom(...WEEKDAY_NAMES) })),
        fiscalYears,
        calendars: calendarsArb,
        unitPicks: fc.array(fc.tuple(name, fc.constantFrom('fiscal-year', 'fiscal-half', 'fiscal-quarter', 'fiscal-period', 'fiscal-week', 'month', 'day', 'iso-week'), fc.nat(5)), { maxLength: 5 }),
        template: fc.array(fc.oneof(fc.constantFrom(...LABEL_FIELD_NAMES).map((f) => `{${f}}`), fc.constantFrom(' ', 'Q', 'FY', '-', 'Woche ')), { maxLength: 6 }).map((p) => p.join('')),
        withLabels: fc.boolean(),
        withWarehouse: fc.boolean(),
        ruleShape: fc.constantFrom<object>({ kind: 'monthly', on: { day: 15 } }, { kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-03' }),
        hours: fc.option(
          fc.record(
            {
              // Monday to Thursday: no generated calendar has one of them in its weekend (a deviation below).
              days: fc.subarray(['monday', 'tuesday', 'wednesday', 'thursday'], { minLength: 1 }),
              open: fc.constantFrom('08:00', '09:00', '07:30:15'),
              close: fc.constantFrom('17:00', '18:00', '24:00', '02:00'),
              zone: fc.constantFrom('Europe/Dublin', '+05:30'),
              cutoff: fc.constantFrom('12:00', '13:30'),
              calendar: fc.constantFrom('first', 'us-federal', 'inline'),
            },
            { requiredKeys: ['days', 'open', 'close'] },
          ),
          { nil: undefined },
        ),
      })
      .map((g) => {
        const doc: Record<string, unknown> = { id: g.id, name: g.name, zone: g.zone, week: g.week };
        const fyNames = Object.keys(g.fiscalYears);
        if (fyNames.length > 0) doc['fiscalYears'] = g.fiscalYears;
        const units: Record<string, unknown> = {};
        for (const [unitName, kind, pick] of g.unitPicks) {
          if (['month', 'day', 'iso-week'].includes(kind)) units[unitName] = { kind };
          else if (fyNames.length > 0) {
            const fyName = fyNames[pick % fyNames.length]!;
            const fy = g.fiscalYears[fyName] as Record<string, unknown>;
            if (kind === 'fiscal-week' && fy['yearEnd'] === undefined) continue;
            units[unitName] = { kind, fiscalYear: fyName };
          }
        }
        if (Object.keys(units).length > 0) doc['units'] = units;
        const calNames = Object.keys(g.calendars);
        if (calNames.length > 0) {
          doc['calendars'] = g.calendars;
          doc['rules'] = { payday: { ...g.ruleShape, calendar: calNames[0], convention: 'following' } };
          if (calNames.length > 1) doc['defaultCalendar'] = calNames[1];
        }
        if (g.withLabels) doc['labels'] = { locale: 'de-DE', units: Object.fromEntries(Object.keys(units).slice(0, 2).map((u) => [u, g.template || '{label}'])), day: g.template || '{day}' };
        if (g.hours) {
          const h = g.hours;
          const entry: Record<string, unknown> = { week: Object.fromEntries(h.days.map((d) => [d, [{ open: h.open, close: h.close }]])) };
          if (h.zone) entry['zone'] = h.zone;
          if (h.cutoff) entry['cutoffs'] = { payments: h.cutoff };
          if (h.calendar === 'inline') entry['calendar'] = { extends: calNames[0] ?? 'us-federal', holidays: [{ kind: 'fixed', name: 'Stocktake', month: 8, day: 3 }] };
          else if (h.calendar === 'first') entry['calendar'] = calNames[0] ?? 'england-and-wales';
          else if (h.calendar) entry['calendar'] = h.calendar;
          doc['hours'] = { desk: entry };
        }
        if (g.withWarehouse) doc['warehouse'] = { start: '2010-01-01', end: '2011-01-01', zones: ['Europe/Dublin'] };
        return doc;
      });

    // Faults the schema can state. Each returns a broken copy, or undefined when the document has no such place.
    type Fault = (doc: Record<string, unknown>, pick: number) => Record<string, unknown> | undefined;
    const copy = (d: Record<string, unknown>) => JSON.parse(JSON.stringify(d)) as Record<string, any>;
    const faults: Fault[] = [
      (d) => ({ ...copy(d), colour: 'teal' }),
      (d, p) => {
        const c = copy(d);
        delete c[['id', 'name', 'zone', 'week'][p % 4]!];
        return c;
      },
      (d) => ({ ...copy(d), zone: 42 }),
      (d) => ({ ...copy(d), week: 'iso8601' }),
      (d) => ({ ...copy(d), week: { firstWeekday: 'Sunday' } }),
      (d) => ({ ...copy(d), id: 'Has Spaces' }),
      (d) => ({ ...copy(d), name: '' }),
      (d) => ({ ...copy(d), name: 'x'.repeat(201) }),
      (d, p) => {
        const c = copy(d);
        const names = Object.keys(c.fiscalYears ?? {});
        if (names.length === 0) return undefined;
        const fy = c.fiscalYears[names[p % names.length]!];
        if (fy.start) fy.start.month = [0, 13, 1.5, '3'][p % 4];
        else fy.yearEnd.rule = 'closest';
        return c;
      },
      (d, p) => {
        const c = copy(d);
        const names = Object.keys(c.fiscalYears ?? {});
        if (names.length === 0) return undefined;
        const fy = c.fiscalYears[names[p % names.length]!];
        if (fy.yearEnd) fy.layout = '4-4-4';
        else delete fy.naming;
        return c;
      },
      (d) => {
        const c = copy(d);
        c.fiscalYears = { ...(c.fiscalYears ?? {}), 'Bad Name': { start: { month: 1, day: 1 }, naming: 'end-year' } };
        return c;
      },
      (d, p) => {
        const c = copy(d);
        const names = Object.keys(c.units ?? {});
        if (names.length === 0) return undefined;
        c.units[names[p % names.length]!].kind = 'fortnight';
        return c;
      },
      (d, p) => {
        const c = copy(d);
        const names = Object.keys(c.units ?? {});
        if (names.length === 0) return undefined;
        c.units[names[p % names.length]!].extra = true;
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.labels) return undefined;
        c.labels.day = 'Q{quarter}';
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.labels) return undefined;
        delete c.labels.locale;
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.warehouse) return undefined;
        c.warehouse.start = '2010-1-1';
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.warehouse) return undefined;
        c.warehouse.zones = [];
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.rules) return undefined;
        c.rules.payday.convention = 'next';
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.rules) return undefined;
        delete c.rules.payday.kind;
        return c;
      },
      (d) => {
        const c = copy(d);
        if (!c.calendars) return undefined;
        c.calendars[Object.keys(c.calendars)[0]!] = 7;
        return c;
      },
      (d) => ({ ...copy(d), hours: { desk: 'nine to five' } }),
      (d, p) => {
        const c = copy(d);
        if (!c.hours) return undefined;
        const desk = c.hours.desk;
        if (typeof desk !== 'object' || typeof desk.week !== 'object') return undefined;
        const day = Object.keys(desk.week)[0]!;
        if (p % 4 === 0) delete desk.week;
        else if (p % 4 === 1) desk.week[day][0].open = ['9am', '25:00'][p >> 2];
        else if (p % 4 === 2) desk.week.funday = [];
        else desk.week[day][0].extra = true;
        return c;
      },
      (d, p) => {
        const c = copy(d);
        if (!c.hours) return undefined;
        const desk = c.hours.desk;
        if (typeof desk !== 'object') return undefined;
        if (p % 3 === 0) desk.cutoffs = { 'Late Payments': '12:00' };
        else if (p % 3 === 1) desk.zone = 42;
        else desk.calendar = 7;
        return c;
      },
      (d) => ({ ...copy(d), defaultCalendar: 12 }),
    ];
    let broken = 0;
    let valid = 0;
    const applied = new Array<number>(faults.length).fill(0);
    fc.assert(
      fc.property(docArb, fc.array(fc.tuple(fc.nat(faults.length - 1), fc.nat(7)), { maxLength: 2 }), (doc, faultPicks) => {
        let d: Record<string, unknown> = doc;
        for (const [f, p] of faultPicks) {
          const next = faults[f]!(d, p);
          if (next) {
            applied[f]!++;
            d = next;
          }
        }
        const schemaVerdict = validate(d) as boolean;
        const libraryVerdict = libraryAccepts(d);
        if (schemaVerdict) valid++;
        else broken++;
        expect({ doc: d, verdict: libraryVerdict }).toEqual({ doc: d, verdict: schemaVerdict });
      }),
      { seed: 20261204, numRuns: 1500 },
    );
    // Every fault was tried often enough to matter.
    expect(Math.min(...applied)).toBeGreaterThan(15);
    // Both kinds occur often enough to matter.
    expect(valid).toBeGreaterThan(60);
    expect(broken).toBeGreaterThan(60);
  });
});

/**
 * Periods and instants, checked against @js-temporal/polyfill (ECMA-262 Temporal proposal: PlainDate.toZonedDateTime
 * gives the first instant of a local day) over the IANA tz data of the runtime.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import { dayNumberFromYmd } from '../../src/civil/index.js';
import { KalendsRangeError } from '../../src/errors.js';
import { dayNumberFromEpochMs } from '../../src/zone/index.js';
import {
  INVALID_ORDINAL,
  defineUnit,
  formatPeriod,
  ordinalFromEpochMsBulk,
  parsePeriod,
  isEpochMsInPeriod,
  firstEpochMsAfterPeriod,
  periodFromDayNumber,
  periodFromEpochMs,
  firstEpochMsOfPeriod,
  shiftPeriod,
} from '../../src/period/index.js';

const SEED = 7_2025;
const ZONES = ['America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'Asia/Kolkata', 'America/Asuncion', 'Pacific/Chatham', 'UTC'];
const epochDay = Temporal.PlainDate.from('1970-01-01');
const firstInstant = (dayNumber: number, zone: string) =>
  epochDay.add({ days: dayNumber }).toZonedDateTime({ timeZone: zone }).epochMilliseconds;

const usQuarter = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
const retailWeek = defineUnit({ kind: 'fiscal-week', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year' });
const retailPeriod = defineUnit({
  kind: 'fiscal-period',
  yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' },
  naming: 'start-year',
  layout: '4-5-4',
});

describe('period: instants in a zone', () => {
  it('a period starts at the first instant of its first local day (Temporal PlainDate.toZonedDateTime)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('month', 'iso-week', 'quarter', 'year'),
        fc.constantFrom(...ZONES),
        fc.integer({ min: dayNumberFromYmd(1950, 1, 1), max: dayNumberFromYmd(2060, 1, 1) }),
        (unit, zone, dn) => {
          const p = periodFromDayNumber(unit, dn);
          expect(firstEpochMsOfPeriod(p, zone)).toBe(firstInstant(p.unit.firstDayNumberFromOrdinal(p.ordinal), zone));
          expect(firstEpochMsAfterPeriod(p, zone)).toBe(firstEpochMsOfPeriod(shiftPeriod(p, 1), zone));
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });

  // IANA tz data: Paraguay began DST at 00:00 on Sunday 1 October 2017, so that day began at 01:00 (checked with
  // Temporal: 2017-10-01T01:00:00-03:00[America/Asuncion]).
  it('is DST-true: a month can start at 01:00 and last 23 hours less than its days', () => {
    const oct = parsePeriod('month', '2017-10');
    const start = firstEpochMsOfPeriod(oct, 'America/Asuncion');
    expect(start).toBe(Date.parse('2017-10-01T01:00:00-03:00'));
    // March 2025 in New York loses an hour (US DST from the second Sunday of March, 15 U.S.C. 260a).
    const march = parsePeriod('month', '2025-03');
    const ny = 'America/New_York';
    expect(firstEpochMsOfPeriod(march, ny)).toBe(Date.parse('2025-03-01T05:00:00Z'));
    expect(firstEpochMsAfterPeriod(march, ny)).toBe(Date.parse('2025-04-01T04:00:00Z'));
    expect(firstEpochMsAfterPeriod(march, ny) - firstEpochMsOfPeriod(march, ny)).toBe(31 * 86_400_000 - 3_600_000);
  });

  it('maps instants to the period of their local date (31 U.S.C. 1102 fiscal year, in New York)', () => {
    const fy = defineUnit({ kind: 'fiscal-year', start: { month: 10, day: 1 }, naming: 'end-year' });
    expect(formatPeriod(periodFromEpochMs(fy, 'America/New_York', Date.parse('2025-10-01T03:30:00Z')))).toBe('FY2025');
    expect(formatPeriod(periodFromEpochMs(fy, 'America/New_York', Date.parse('2025-10-01T04:00:00Z')))).toBe('FY2026');
    expect(formatPeriod(periodFromEpochMs(fy, 'UTC', Date.parse('2025-10-01T03:30:00Z')))).toBe('FY2026');
    const q = parsePeriod(usQuarter, 'FY2026-Q1');
    expect(isEpochMsInPeriod(q, 'America/New_York', Date.parse('2026-01-01T04:59:59.999Z'))).toBe(true);
    expect(isEpochMsInPeriod(q, 'America/New_York', Date.parse('2026-01-01T05:00:00Z'))).toBe(false);
  });

  it('bulk instants to ordinals equal the scalar route and Temporal, for month, fiscal and 52/53-week units', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(usQuarter, retailWeek, retailPeriod, defineUnit('month'), defineUnit({ kind: 'cycle', lengthDays: 14, anchor: '2025-01-03' })),
        fc.constantFrom(...ZONES),
        fc.array(fc.integer({ min: Date.parse('1900-01-01T00:00Z'), max: Date.parse('2200-01-01T00:00Z') }), { minLength: 1, maxLength: 50 }),
        (unit, zone, instants) => {
          const out = ordinalFromEpochMsBulk(unit, zone, Float64Array.from(instants));
          instants.forEach((ms, i) => {
            const viaTemporal = Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(zone).toPlainDate();
            const dn = epochDay.until(viaTemporal).days;
            expect(out[i]).toBe(unit.ordinalFromDayNumber(dn));
            expect(out[i]).toBe(periodFromEpochMs(unit, zone, ms).ordinal);
          });
        },
      ),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('large bulk inputs (the week-table path) equal the scalar route', () => {
    const n = 20_000;
    const rnd = fc.sample(fc.integer({ min: Date.parse('1990-01-01T00:00Z'), max: Date.parse('2040-01-01T00:00Z') }), { numRuns: n, seed: SEED });
    const instants = Float64Array.from(rnd);
    for (const unit of [retailWeek, retailPeriod, usQuarter]) {
      const out = ordinalFromEpochMsBulk(unit, 'America/New_York', instants);
      for (let i = 0; i < n; i++) {
        if (out[i] !== unit.ordinalFromDayNumber(dayNumberFromEpochMs('America/New_York', instants[i]!))) expect.fail(`${unit.id} at ${i}`);
      }
    }
  });

  it('invalid instants throw naming the index, or give INVALID_ORDINAL on request', () => {
    const data = Float64Array.of(Date.parse('2025-01-01T00:00Z'), Number.NaN);
    expect(() => ordinalFromEpochMsBulk('month', 'UTC', data)).toThrow(KalendsRangeError);
    expect(() => ordinalFromEpochMsBulk('month', 'UTC', data)).toThrow(/\[1\]/);
    const out = ordinalFromEpochMsBulk('month', 'UTC', data, undefined, { invalid: 'sentinel' });
    expect([...out]).toEqual([2025 * 12, INVALID_ORDINAL]);
    expect(() => periodFromEpochMs('month', 'UTC', Number.NaN)).toThrow(KalendsRangeError);
  });
});

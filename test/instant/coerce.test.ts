/**
 * The one coercion point, checked with two independent Temporal implementations (@js-temporal/polyfill and
 * temporal-polyfill) as reference libraries, and ECMA-262 Date.UTC.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal as JsTemporal } from '@js-temporal/polyfill';
import { Temporal as FastTemporal } from 'temporal-polyfill';
import {
  temporalInstantFromEpochMs,
  temporalPlainDateFromDayNumber,
  temporalPlainDateTimeFromWallMs,
  toDayNumber,
  toEpochMs,
  toWallMs,
} from '../../src/instant/index.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../../src/bounds.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

const IMPLEMENTATIONS = [
  ['@js-temporal/polyfill', JsTemporal],
  ['temporal-polyfill', FastTemporal],
] as const;

describe('toEpochMs', () => {
  it('reads RFC 3339 strings with an offset (RFC 3339 5.8 example)', () => {
    expect(toEpochMs('1996-12-19T16:39:57-08:00')).toBe(Date.UTC(1996, 11, 20, 0, 39, 57));
  });

  it('rejects a string without an offset, suggesting the local parser', () => {
    expect(() => toEpochMs('2025-02-14T09:30')).toThrow(/parsePlainDateTime/);
  });

  it('takes integer numbers as epoch ms, within ±8.64e15 (ECMA-262 time value range)', () => {
    expect(toEpochMs(0)).toBe(0);
    expect(Object.is(toEpochMs(-0), 0)).toBe(true);
    expect(toEpochMs(MAX_EPOCH_MS)).toBe(MAX_EPOCH_MS);
    expect(() => toEpochMs(MAX_EPOCH_MS + 1)).toThrow(KalendsRangeError);
    expect(() => toEpochMs(MIN_EPOCH_MS - 1)).toThrow(KalendsRangeError);
  });

  it('rejects NaN and infinities with a range error quoting the value', () => {
    expect(() => toEpochMs(Number.NaN)).toThrow(/got NaN/);
    expect(() => toEpochMs(Infinity)).toThrow(/got Infinity/);
  });

  it('keeps a fraction of a millisecond (docs/design.md, "Input rules": the instant lies in millisecond floor(t))', () => {
    expect(toEpochMs(1.5)).toBe(1.5);
    expect(toEpochMs(-0.5)).toBe(-0.5);
    expect(toEpochMs(1e12 + 0.25)).toBe(1e12 + 0.25);
  });

  it('reads a valid Date and rejects an invalid one', () => {
    expect(toEpochMs(new Date(Date.UTC(2025, 1, 14)))).toBe(Date.UTC(2025, 1, 14));
    expect(() => toEpochMs(new Date('not a date'))).toThrow(/invalid Date/);
  });

  it.each(IMPLEMENTATIONS)('reads Instant and ZonedDateTime from %s by their shape, flooring nanoseconds', (_name, T) => {
    const i = T.Instant.from('1969-12-31T23:59:59.9999Z');
    expect(toEpochMs(i)).toBe(i.epochMilliseconds);
    expect(toEpochMs(i)).toBe(-1);
    const z = T.ZonedDateTime.from('2025-02-14T10:30:00+01:00[+01:00]');
    expect(toEpochMs(z)).toBe(Date.UTC(2025, 1, 14, 9, 30));
  });

  it('reads an object with only epochMilliseconds (a minimal Temporal-like value)', () => {
    expect(toEpochMs({ epochMilliseconds: 1000 })).toBe(1000);
  });

  it.each(IMPLEMENTATIONS)('rejects a PlainDateTime from %s: it names no instant without a zone', (_name, T) => {
    expect(() => toEpochMs(T.PlainDateTime.from('2025-02-14T09:30'))).toThrow(/Temporal.PlainDateTime, which names no instant/);
  });

  it.each([
    [new Map(), 'a Map'],
    [{}, 'an object'],
    [null, 'null'],
    [undefined, 'undefined'],
    [true, 'true'],
    [[1], 'an array'],
    [10n, 'bigint'],
  ] as const)('rejects %s naming what it got', (v, name) => {
    expect(() => toEpochMs(v)).toThrow(KalendsTypeError);
    expect(() => toEpochMs(v)).toThrow(name);
  });
});

describe('toDayNumber', () => {
  const dn = dayNumberFromYmd(2025, 2, 14);

  it('reads the three ISO 8601 date forms', () => {
    for (const s of ['2025-02-14', '2025-W07-5', '2025-045']) expect(toDayNumber(s)).toBe(dn);
  });

  it('takes an integer within the day-number range as a day number', () => {
    expect(toDayNumber(dn)).toBe(dn);
    expect(() => toDayNumber(1.5)).toThrow(KalendsRangeError);
  });

  it('catches epoch ms passed by mistake, with a hint', () => {
    expect(() => toDayNumber(Date.UTC(2025, 1, 14))).toThrow(/epoch milliseconds/);
  });

  it.each(IMPLEMENTATIONS)('reads PlainDate, PlainDateTime and ZonedDateTime from %s', (_name, T) => {
    expect(toDayNumber(T.PlainDate.from('2025-02-14'))).toBe(dn);
    expect(toDayNumber(T.PlainDateTime.from('2025-02-14T23:59'))).toBe(dn);
    // a ZonedDateTime gives its date in its own zone
    expect(toDayNumber(T.ZonedDateTime.from('2025-02-14T23:30:00-05:00[-05:00]'))).toBe(dn);
  });

  it.each(IMPLEMENTATIONS)('rejects an Instant from %s: no date without a zone', (_name, T) => {
    expect(() => toDayNumber(T.Instant.from('2025-02-14T00:00Z'))).toThrow(/Temporal.Instant, which has no calendar date/);
  });

  it('rejects a non-ISO calendar, and reads a plain { year, month, day }', () => {
    const hebrew = JsTemporal.PlainDate.from('2025-02-14').withCalendar('hebrew');
    expect(() => toDayNumber(hebrew)).toThrow(/calendar "hebrew"/);
    expect(toDayNumber({ year: 2025, month: 2, day: 14 })).toBe(dn);
    expect(() => toDayNumber({ year: 2025, month: 2, day: 30 })).toThrow(KalendsRangeError);
  });

  it('reads a Date only when the caller says which fields to use', () => {
    const d = new Date(Date.UTC(2025, 1, 14, 23, 30));
    expect(() => toDayNumber(d)).toThrow(/dateFields/);
    expect(toDayNumber(d, { dateFields: 'utc' })).toBe(dn);
    const local = new Date(2025, 1, 14, 12, 0);
    expect(toDayNumber(local, { dateFields: 'local' })).toBe(dn);
  });

  it('rejects other kinds naming them', () => {
    expect(() => toDayNumber(new Set())).toThrow(/got a Set/);
    expect(() => toDayNumber('2025-02-14T09:30')).toThrow(KalendsSyntaxError);
  });
});

describe('toWallMs', () => {
  it('reads local date-time text, numbers and Temporal objects', () => {
    const w = Date.UTC(2025, 1, 14, 9, 30, 15, 250);
    expect(toWallMs('2025-02-14T09:30:15.25')).toBe(w);
    expect(toWallMs(w)).toBe(w);
    for (const [, T] of IMPLEMENTATIONS) {
      expect(toWallMs(T.PlainDateTime.from('2025-02-14T09:30:15.250999'))).toBe(w);
      expect(toWallMs(T.PlainDate.from('2025-02-14'))).toBe(Date.UTC(2025, 1, 14));
    }
  });

  it('rejects a Date, pointing to toEpochMs', () => {
    expect(() => toWallMs(new Date(0))).toThrow(/toEpochMs/);
  });
});

describe('back to Temporal, with the caller\'s namespace', () => {
  it.each(IMPLEMENTATIONS)('round-trips instants, dates and date-times through %s', (_name, T) => {
    fc.assert(
      fc.property(fc.integer({ min: MIN_EPOCH_MS, max: MAX_EPOCH_MS }), (ms) => {
        const i = temporalInstantFromEpochMs(ms, T);
        expect(i.epochMilliseconds).toBe(ms);
        expect(toEpochMs(i)).toBe(ms);
      }),
      { seed: 42, numRuns: 300 },
    );
    const d = temporalPlainDateFromDayNumber(dayNumberFromYmd(2025, 2, 14), T);
    expect(d.toString()).toBe('2025-02-14');
    const dt = temporalPlainDateTimeFromWallMs(Date.UTC(2025, 1, 14, 9, 30, 0, 5), T);
    expect(dt.toString()).toBe('2025-02-14T09:30:00.005');
    expect(toWallMs(dt)).toBe(Date.UTC(2025, 1, 14, 9, 30, 0, 5));
  });

  it('a date outside Temporal\'s range becomes a kalends range error', () => {
    expect(() => temporalPlainDateFromDayNumber(dayNumberFromYmd(-271821, 1, 1), JsTemporal)).toThrow(KalendsRangeError);
  });

  it('a missing namespace is a type error that says what to pass', () => {
    expect(() => temporalInstantFromEpochMs(0, undefined as never)).toThrow(/Temporal namespace/);
    expect(() => temporalPlainDateFromDayNumber(0, {} as never)).toThrow(KalendsTypeError);
  });
});

import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import {
  formatInstant,
  formatIsoWeekDate,
  formatOffset,
  formatOrdinalDate,
  formatPlainDate,
  formatPlainDateTime,
  parseExtendedDateTime,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
} from '../../src/instant/index.js';
import { KalendsRangeError, KalendsSyntaxError } from '../../src/errors.js';
import { MAX_DAY_NUMBER, MAX_EPOCH_MS, MIN_DAY_NUMBER, MIN_EPOCH_MS } from '../../src/bounds.js';
import { dayNumberFromYmd } from '../../src/civil/index.js';

/** Epoch ms by ECMA-262 Date.UTC (month 1..12 here), an outside reference for the arithmetic. */
const utc = (y: number, mo: number, d: number, h = 0, mi = 0, s = 0, ms = 0) => Date.UTC(y, mo - 1, d, h, mi, s, ms);
/** Epoch ms by @js-temporal/polyfill, the second outside reference. */
const temporalMs = (s: string) => Temporal.Instant.from(s).epochMilliseconds;

describe('parseInstant: RFC 3339 section 5.8 examples', () => {
  it('"1985-04-12T23:20:50.52Z" is 20 minutes and 50.52 seconds after 23:00 UTC on 12 April 1985', () => {
    const p = parseInstant('1985-04-12T23:20:50.52Z');
    expect(p.epochMs).toBe(utc(1985, 4, 12, 23, 20, 50, 520));
    expect(p.epochMs).toBe(temporalMs('1985-04-12T23:20:50.52Z'));
    expect(p.offsetSeconds).toBe(0);
    expect(p.localOffsetUnknown).toBe(true);
  });

  it('"1996-12-19T16:39:57-08:00" is 1996-12-20T00:39:57Z (RFC 3339 5.8; RFC 9557 section 4.2 says the same)', () => {
    const p = parseInstant('1996-12-19T16:39:57-08:00');
    expect(p.epochMs).toBe(utc(1996, 12, 20, 0, 39, 57));
    expect(p.offsetSeconds).toBe(-8 * 3600);
    expect(p.localOffsetUnknown).toBe(false);
    expect(p.wallMs).toBe(utc(1996, 12, 19, 16, 39, 57));
  });

  it('"1990-12-31T23:59:60Z" (leap second) is read as 23:59:59Z, as Temporal does, and flagged', () => {
    const p = parseInstant('1990-12-31T23:59:60Z');
    expect(p.epochMs).toBe(utc(1990, 12, 31, 23, 59, 59));
    expect(p.epochMs).toBe(temporalMs('1990-12-31T23:59:60Z'));
    expect(p.leapSecond).toBe(true);
  });

  it('"1990-12-31T15:59:60-08:00" is the same leap second in Pacific Standard Time (RFC 3339 5.8)', () => {
    expect(parseInstant('1990-12-31T15:59:60-08:00').epochMs).toBe(parseInstant('1990-12-31T23:59:60Z').epochMs);
  });

  it('"1937-01-01T12:00:27.87+00:20" is 11:40:27.87 UTC (RFC 3339 5.8, Netherlands time)', () => {
    const p = parseInstant('1937-01-01T12:00:27.87+00:20');
    expect(p.epochMs).toBe(utc(1937, 1, 1, 11, 40, 27, 870));
    expect(p.offsetSeconds).toBe(20 * 60);
  });
});

describe('parseInstant: RFC 9557 annotations (sections 3 and 4)', () => {
  it('section 4.2: a zone name is returned, not resolved', () => {
    const p = parseInstant('1996-12-19T16:39:57-08:00[America/Los_Angeles]');
    expect(p.zoneId).toBe('America/Los_Angeles');
    expect(p.zoneCritical).toBe(false);
    expect(p.epochMs).toBe(utc(1996, 12, 20, 0, 39, 57));
  });

  it('section 4.2: a calendar tag after the zone is returned as an elective suffix tag', () => {
    const p = parseInstant('1996-12-19T16:39:57-08:00[America/Los_Angeles][u-ca=hebrew]');
    expect(p.annotations).toEqual([{ key: 'u-ca', value: 'hebrew', critical: false }]);
  });

  it('section 4.2: experimental keys (leading "_") are rejected unless the caller understands them (section 3.2)', () => {
    const s = '1996-12-19T16:39:57-08:00[_foo=bar][_baz=bat]';
    expect(() => parseInstant(s)).toThrow(KalendsSyntaxError);
    const p = parseInstant(s, { understoodKeys: ['_foo', '_baz'] });
    expect(p.annotations.map((a) => a.key)).toEqual(['_foo', '_baz']);
  });

  it('section 3.3: an inconsistent elective zone is returned with the offset, for the zone layer to check', () => {
    const p = parseInstant('2022-07-08T00:14:07+01:00[Europe/Paris]');
    expect(p.offsetSeconds).toBe(3600);
    expect(p.zoneId).toBe('Europe/Paris');
    expect(p.epochMs).toBe(utc(2022, 7, 7, 23, 14, 7));
  });

  it('section 3.3: a critical zone is returned with its flag', () => {
    const p = parseInstant('2022-07-08T00:14:07+01:00[!Europe/Paris]');
    expect(p.zoneCritical).toBe(true);
    expect(p.zoneId).toBe('Europe/Paris');
  });

  it('section 3.3: "Z" with a zone says nothing about the local offset', () => {
    const p = parseInstant('2022-07-08T00:14:07Z[Europe/Paris]');
    expect(p.localOffsetUnknown).toBe(true);
    expect(p.epochMs).toBe(utc(2022, 7, 8, 0, 14, 7));
  });

  it('section 3.3: an unknown elective tag is returned and may be ignored', () => {
    expect(parseInstant('2022-07-08T00:14:07+01:00[knort=blargel]').annotations).toEqual([{ key: 'knort', value: 'blargel', critical: false }]);
  });

  it.each([
    '2022-07-08T00:14:07Z[!u-ca=chinese][u-ca=japanese]',
    '2022-07-08T00:14:07Z[u-ca=chinese][!u-ca=japanese]',
    '2022-07-08T00:14:07Z[!knort=blargel]',
  ])('section 3.3: %s must be treated as erroneous', (s) => {
    expect(() => parseInstant(s)).toThrow(KalendsSyntaxError);
  });

  it('section 3.3: a critical key the caller processes is accepted with understoodKeys', () => {
    const p = parseInstant('2022-07-08T00:14:07Z[!knort=blargel]', { understoodKeys: ['knort'] });
    expect(p.annotations[0]).toEqual({ key: 'knort', value: 'blargel', critical: true });
  });

  it('section 3.3: repeated elective keys are all returned in order (the first one counts)', () => {
    const p = parseInstant('2022-07-08T00:14:07Z[u-ca=chinese][u-ca=japanese]');
    expect(p.annotations.map((a) => a.value)).toEqual(['chinese', 'japanese']);
  });

  it('"[!u-ca=iso8601]" is understood: it is kalends\'s own calendar', () => {
    expect(parseInstant('2025-02-14T09:30Z[!u-ca=iso8601]').annotations[0]?.critical).toBe(true);
  });

  it('section 2: "-00:00" means the local offset is unknown, like "Z"; "+00:00" does not', () => {
    expect(parseInstant('2025-02-14T09:30:00-00:00').localOffsetUnknown).toBe(true);
    expect(parseInstant('2025-02-14T09:30:00+00:00').localOffsetUnknown).toBe(false);
  });

  it('section 4.1: an offset may be the zone annotation', () => {
    expect(parseInstant('2025-02-14T09:30:00+05:30[+05:30]').zoneId).toBe('+05:30');
  });

  it('section 4.1: zone names with "+", "-", "_" and digits after the first character are accepted', () => {
    expect(parseInstant('2025-02-14T09:30Z[Etc/GMT+5]').zoneId).toBe('Etc/GMT+5');
    expect(parseInstant('2025-02-14T09:30Z[America/Port-au-Prince]').zoneId).toBe('America/Port-au-Prince');
    expect(parseInstant('2025-02-14T09:30Z[America/Argentina/Buenos_Aires]').zoneId).toBe('America/Argentina/Buenos_Aires');
  });
});

describe('parseInstant: rules beyond the bare RFC 3339 grammar (docs/instants.md)', () => {
  it('lower-case "t" and "z" are accepted (RFC 3339 section 5.6 note)', () => {
    expect(parseInstant('2025-02-14t09:30:00z').epochMs).toBe(utc(2025, 2, 14, 9, 30));
  });

  it('a space may separate date and time (RFC 3339 section 5.6 note)', () => {
    expect(parseInstant('2025-02-14 09:30:00Z').epochMs).toBe(utc(2025, 2, 14, 9, 30));
  });

  it('seconds may be omitted (ISO 8601 reduced precision, as Temporal accepts)', () => {
    expect(parseInstant('2025-02-14T09:30Z').epochMs).toBe(temporalMs('2025-02-14T09:30Z'));
  });

  it('a comma may be the decimal sign (ISO 8601-1:2019; Temporal accepts it too)', () => {
    expect(parseInstant('2025-02-14T09:30:00,25Z').epochMs).toBe(utc(2025, 2, 14, 9, 30, 0, 250));
    expect(parseInstant('2025-02-14T09:30:00,25Z').epochMs).toBe(temporalMs('2025-02-14T09:30:00,25Z'));
  });

  it('up to 9 fraction digits; the instant is floored to the ms and the rest reported', () => {
    const p = parseInstant('2025-02-14T09:30:00.123456789Z');
    expect(p.epochMs).toBe(utc(2025, 2, 14, 9, 30, 0, 123));
    expect(p.submillisecondNs).toBe(456789);
  });

  it('sub-ms floor goes toward the past before 1970, as Temporal epochMilliseconds does', () => {
    const s = '1969-12-31T23:59:59.9999Z';
    expect(parseInstant(s).epochMs).toBe(-1);
    expect(parseInstant(s).epochMs).toBe(temporalMs(s));
  });

  it('offsets with seconds are accepted (RFC 9557 / Temporal sub-minute offsets)', () => {
    const p = parseInstant('1900-01-01T00:00:00+00:19:32');
    expect(p.offsetSeconds).toBe(19 * 60 + 32);
    expect(p.epochMs).toBe(temporalMs('1900-01-01T00:00:00+00:19:32'));
  });

  it('second 60 away from 23:59:60 UTC at a month end is rejected (RFC 3339 section 5.7)', () => {
    expect(() => parseInstant('1990-12-30T23:59:60Z')).toThrow(/leap second/);
    expect(() => parseInstant('1990-12-31T12:59:60Z')).toThrow(/leap second/);
    expect(() => parseInstant('1990-12-31T23:59:60+01:00')).toThrow(/leap second/);
  });

  it('second 60 is rejected outright with leapSecond: "reject"', () => {
    expect(() => parseInstant('1990-12-31T23:59:60Z', { leapSecond: 'reject' })).toThrow(KalendsSyntaxError);
  });

  it('a leap second with a fraction keeps its fraction (Temporal maps 23:59:60.5 to 23:59:59.5)', () => {
    const s = '2016-12-31T23:59:60.5Z';
    expect(parseInstant(s).epochMs).toBe(temporalMs(s));
  });

  it('hour 24 is rejected with a hint (RFC 3339 section 5.6: hours 00 to 23; Temporal also rejects)', () => {
    expect(() => parseInstant('2025-02-14T24:00:00Z')).toThrow(/hour 24.*next day/);
    expect(() => Temporal.Instant.from('2025-02-14T24:00:00Z')).toThrow(RangeError);
  });

  it('a missing offset says so and suggests parsePlainDateTime', () => {
    expect(() => parseInstant('2025-02-14T09:30:00')).toThrow(/offset is missing.*parsePlainDateTime/);
  });

  it('expanded years (ISO 8601 / RFC 9557, six digits and a sign) agree with Temporal', () => {
    for (const s of ['-000001-01-01T00:00:00Z', '+010000-01-01T00:00:00Z', '+275760-09-13T00:00:00Z', '-271821-04-20T00:00:00Z']) {
      expect(parseInstant(s).epochMs).toBe(temporalMs(s));
    }
  });

  it('the range is exactly ±8.64e15 ms (ECMA-262 time values); one nanosecond beyond is out of range', () => {
    expect(parseInstant('+275760-09-13T00:00:00Z').epochMs).toBe(MAX_EPOCH_MS);
    expect(parseInstant('-271821-04-20T00:00:00Z').epochMs).toBe(MIN_EPOCH_MS);
    expect(() => parseInstant('+275760-09-13T00:00:00.000000001Z')).toThrow(KalendsRangeError);
    expect(() => parseInstant('-271821-04-19T23:59:59.999Z')).toThrow(KalendsRangeError);
    expect(() => Temporal.Instant.from('+275760-09-13T00:00:00.000000001Z')).toThrow(RangeError);
  });

  it('the result is frozen', () => {
    const p = parseInstant('2025-02-14T09:30Z[u-ca=iso8601]');
    expect(Object.isFrozen(p)).toBe(true);
    expect(Object.isFrozen(p.annotations)).toBe(true);
  });
});

describe('formatInstant', () => {
  it('writes RFC 3339 "Z" text that Temporal reads back to the same instant', () => {
    expect(formatInstant(utc(1985, 4, 12, 23, 20, 50, 520))).toBe('1985-04-12T23:20:50.52Z');
    expect(Temporal.Instant.from(formatInstant(-1)).epochMilliseconds).toBe(-1);
  });

  it('matches Temporal Instant.toString() for whole-ms instants (auto digits)', () => {
    for (const ms of [0, -1, 1, 999, 1000, 1739525400123, -62198755200000, MAX_EPOCH_MS, MIN_EPOCH_MS]) {
      expect(formatInstant(ms)).toBe(Temporal.Instant.fromEpochMilliseconds(ms).toString());
    }
  });

  it('fractionDigits truncates toward the past, as Temporal toString({ fractionalSecondDigits })', () => {
    for (const ms of [-1, 1739525400987]) {
      for (const d of [0, 1, 2, 3, 6, 9] as const) {
        expect(formatInstant(ms, { fractionDigits: d })).toBe(Temporal.Instant.fromEpochMilliseconds(ms).toString({ fractionalSecondDigits: d }));
      }
    }
  });

  it('writes the local time at an offset (RFC 3339 5.8 example in reverse)', () => {
    expect(formatInstant(utc(1996, 12, 20, 0, 39, 57), { offsetSeconds: -28800 })).toBe('1996-12-19T16:39:57-08:00');
    expect(formatInstant(utc(1937, 1, 1, 11, 40, 27, 870), { offsetSeconds: 1200 })).toBe('1937-01-01T12:00:27.87+00:20');
    expect(formatInstant(0, { offsetSeconds: 0 })).toBe('1970-01-01T00:00:00+00:00');
    expect(formatInstant(0, { offsetSeconds: 1172 })).toBe('1970-01-01T00:19:32+00:19:32');
  });

  it('appends RFC 9557 annotations (section 4.2 example)', () => {
    const s = formatInstant(utc(1996, 12, 20, 0, 39, 57), {
      offsetSeconds: -28800,
      zoneId: 'America/Los_Angeles',
      annotations: [{ key: 'u-ca', value: 'hebrew', critical: false }],
    });
    expect(s).toBe('1996-12-19T16:39:57-08:00[America/Los_Angeles][u-ca=hebrew]');
    expect(formatInstant(0, { zoneId: 'Europe/Paris', zoneCritical: true })).toBe('1970-01-01T00:00:00Z[!Europe/Paris]');
  });

  it('rejects annotations that the grammar would not read back', () => {
    expect(() => formatInstant(0, { zoneId: 'Europe/Paris]x' })).toThrow(KalendsRangeError);
    expect(() => formatInstant(0, { zoneId: '../etc' })).toThrow(KalendsRangeError);
    expect(() => formatInstant(0, { annotations: [{ key: 'U-CA', value: 'x', critical: false }] })).toThrow(KalendsRangeError);
  });

  it('rejects bad arguments with typed errors naming them', () => {
    expect(() => formatInstant(Number.NaN)).toThrow(/epochMs/);
    expect(() => formatInstant(MAX_EPOCH_MS + 1)).toThrow(KalendsRangeError);
    expect(() => formatInstant(0, { offsetSeconds: 86_400 })).toThrow(/offsetSeconds/);
    expect(() => formatInstant(0, { fractionDigits: 10 as 9 })).toThrow(/fractionDigits/);
  });

  it('formatOffset writes ±HH:MM, and ±HH:MM:SS only when there are seconds', () => {
    expect(formatOffset(-28800)).toBe('-08:00');
    expect(formatOffset(19800)).toBe('+05:30');
    expect(formatOffset(0)).toBe('+00:00');
    expect(formatOffset(-(3600 + 1))).toBe('-01:00:01');
  });
});

describe('plain dates: calendar, ISO week and ordinal forms (ISO 8601-1:2019 5.2)', () => {
  it('2025-02-14, 2025-W07-5 and 2025-045 are the same day (cross-checked with Temporal)', () => {
    const t = Temporal.PlainDate.from('2025-02-14');
    expect(t.weekOfYear).toBe(7);
    expect(t.dayOfWeek).toBe(5);
    expect(t.dayOfYear).toBe(45);
    const dn = dayNumberFromYmd(2025, 2, 14);
    expect(parsePlainDate('2025-02-14')).toBe(dn);
    expect(parsePlainDate('2025-W07-5')).toBe(dn);
    expect(parsePlainDate('2025-045')).toBe(dn);
  });

  it('week dates across the year boundary (ISO 8601 week rule; from memory, checked with Temporal)', () => {
    // 2008-12-29 is Monday of week 1 of 2009; 2010-01-03 is Sunday of week 53 of 2009.
    expect(parsePlainDate('2009-W01-1')).toBe(dayNumberFromYmd(2008, 12, 29));
    expect(parsePlainDate('2009-W53-7')).toBe(dayNumberFromYmd(2010, 1, 3));
    expect(Temporal.PlainDate.from('2010-01-03').yearOfWeek).toBe(2009);
    expect(Temporal.PlainDate.from('2010-01-03').weekOfYear).toBe(53);
  });

  it('week 53 exists only in long years; day 366 only in leap years', () => {
    expect(() => parsePlainDate('2025-W53-1')).toThrow(/week 53 is out of range/);
    expect(parsePlainDate('2020-W53-1')).toBe(dayNumberFromYmd(2020, 12, 28));
    expect(parsePlainDate('2024-366')).toBe(dayNumberFromYmd(2024, 12, 31));
    expect(() => parsePlainDate('2025-366')).toThrow(KalendsSyntaxError);
  });

  it('formats a day number in the three forms', () => {
    const dn = dayNumberFromYmd(2025, 2, 14);
    expect(formatPlainDate(dn)).toBe('2025-02-14');
    expect(formatIsoWeekDate(dn)).toBe('2025-W07-5');
    expect(formatOrdinalDate(dn)).toBe('2025-045');
  });

  it('formatPlainDate uses expanded years outside 0000..9999, as Temporal PlainDate.toString()', () => {
    for (const [y, m, d] of [[-1, 12, 31], [0, 1, 1], [9999, 12, 31], [10000, 1, 1], [-271821, 4, 19], [275760, 9, 13]] as const) {
      expect(formatPlainDate(dayNumberFromYmd(y, m, d))).toBe(Temporal.PlainDate.from({ year: y, month: m, day: d }).toString());
    }
  });

  it('the whole civil range parses and formats, including days outside Temporal\'s range', () => {
    expect(formatPlainDate(MIN_DAY_NUMBER)).toBe('-271821-01-01');
    expect(formatPlainDate(MAX_DAY_NUMBER)).toBe('+275760-12-31');
    expect(parsePlainDate('-271821-01-01')).toBe(MIN_DAY_NUMBER);
    expect(parsePlainDate('+275760-12-31')).toBe(MAX_DAY_NUMBER);
  });

  it('a date-time given to parsePlainDate names the function to use', () => {
    expect(() => parsePlainDate('2025-02-14T09:30')).toThrow(/parsePlainDateTime/);
  });
});

describe('plain date-times', () => {
  it('wall ms are day number times 86,400,000 plus the time of day', () => {
    expect(parsePlainDateTime('1970-01-02T00:00:01')).toBe(86_401_000);
    expect(parsePlainDateTime('2025-02-14T09:30:15.5')).toBe(utc(2025, 2, 14, 9, 30, 15, 500));
  });

  it('a bare date is midnight (as Temporal PlainDateTime.from)', () => {
    expect(parsePlainDateTime('2025-02-14')).toBe(utc(2025, 2, 14));
    expect(Temporal.PlainDateTime.from('2025-02-14').toString()).toBe('2025-02-14T00:00:00');
  });

  it('an offset is rejected by default, and dropped with offset: "ignore"', () => {
    expect(() => parsePlainDateTime('2025-02-14T09:30+01:00')).toThrow(/parseInstant/);
    expect(parsePlainDateTime('2025-02-14T09:30+01:00', { offset: 'ignore' })).toBe(utc(2025, 2, 14, 9, 30));
    expect(parsePlainDateTime('2025-02-14T09:30[Europe/Dublin]', { offset: 'ignore' })).toBe(utc(2025, 2, 14, 9, 30));
    expect(() => parsePlainDateTime('2025-02-14T09:30[Europe/Dublin]')).toThrow(KalendsSyntaxError);
  });

  it('"Z" is always rejected: its fields are UTC, not local (RFC 9557 section 2; Temporal rejects it too)', () => {
    expect(() => parsePlainDateTime('2025-02-14T09:30Z', { offset: 'ignore' })).toThrow(/UTC, not a local time/);
    expect(() => Temporal.PlainDateTime.from('2025-02-14T09:30Z')).toThrow(RangeError);
  });

  it('second 60 is read as 59, as Temporal PlainDateTime.from does', () => {
    expect(formatPlainDateTime(parsePlainDateTime('2025-02-14T09:30:60'))).toBe(Temporal.PlainDateTime.from('2025-02-14T09:30:60').toString());
  });

  it('formatPlainDateTime matches Temporal PlainDateTime.toString()', () => {
    for (const s of ['2025-02-14T09:30:15.5', '-000001-12-31T23:59:59.999', '1970-01-01T00:00:00']) {
      expect(formatPlainDateTime(parsePlainDateTime(s))).toBe(Temporal.PlainDateTime.from(s).toString());
    }
  });

  it('the whole civil range of wall ms formats', () => {
    expect(formatPlainDateTime(MAX_DAY_NUMBER * 86_400_000 + 86_399_999)).toBe('+275760-12-31T23:59:59.999');
    expect(() => formatPlainDateTime(MAX_DAY_NUMBER * 86_400_000 + 86_400_000)).toThrow(KalendsRangeError);
  });
});

describe('parseExtendedDateTime', () => {
  it('returns a local date-time with a zone annotation and no offset (for the zone layer)', () => {
    const p = parseExtendedDateTime('2025-03-30T02:30[Europe/Dublin]');
    expect(p.offsetSeconds).toBeUndefined();
    expect(p.zoneId).toBe('Europe/Dublin');
    expect(p.wallMs).toBe(utc(2025, 3, 30, 2, 30));
  });

  it('returns a bare date with hasTime false', () => {
    const p = parseExtendedDateTime('2025-02-14');
    expect(p.hasTime).toBe(false);
    expect(p.dayNumber).toBe(dayNumberFromYmd(2025, 2, 14));
  });
});

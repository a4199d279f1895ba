/**
 * Options, enum values, fractional instants and the internal text readers of the instant layer (docs/design.md,
 * "Input rules"). Expected values come from RFC 3339 / RFC 9557 (named beside each check) and from the two
 * Temporal polyfills.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { Temporal as JsTemporal } from '@js-temporal/polyfill';
import {
  durationFromFields,
  formatInstant,
  formatPlainDateTime,
  parseDuration,
  parseExtendedDateTime,
  parseInstant,
  parsePlainDateTime,
  shiftDayNumber,
  shiftWallMs,
  temporalInstantFromEpochMs,
  temporalPlainDateTimeFromWallMs,
  toDayNumber,
  toWallMs,
} from '../../src/instant/index.js';
import { dayNumberFromIsoDateText, parseCalendarDateText, parseOffsetText } from '../../src/instant/text.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError } from '../../src/errors.js';

function thrown(f: () => unknown): Error & { code?: string; position?: number } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

const LEAP = '2016-12-31T23:59:60Z'; // a real leap second (IERS Bulletin C 52; RFC 3339 section 5.7 shape)

describe('enum options are validated, never silently ignored', () => {
  it('parsePlainDateTime offset: a foreign value does not drop the offset', () => {
    const text = '2025-02-14T09:30:00+01:00';
    for (const bad of ['use', 'ignor']) {
      const e = thrown(() => parsePlainDateTime(text, { offset: bad } as never));
      expect(e).toBeInstanceOf(KalendsRangeError);
      expect(e.code).toBe('unknown-name');
      expect(e.message).toMatch(/^options\.offset: expected one of "reject", "ignore", got "/);
    }
    expect(thrown(() => parsePlainDateTime(text, { offset: 'ignor' } as never)).message).toContain('did you mean "ignore"?');
    expect(thrown(() => parsePlainDateTime(text, { offset: false } as never))).toBeInstanceOf(KalendsTypeError);
    // The valid values keep their meaning.
    expect(() => parsePlainDateTime(text)).toThrow(KalendsSyntaxError);
    expect(parsePlainDateTime(text, { offset: 'ignore' })).toBe(Date.UTC(2025, 1, 14, 9, 30));
  });

  it('parseInstant leapSecond: a misspelling does not accept the leap second', () => {
    const e = thrown(() => parseInstant(LEAP, { leapSecond: 'rejct' } as never));
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect(e.code).toBe('unknown-name');
    expect(e.message).toBe('options.leapSecond: expected one of "constrain", "reject", got "rejct"; did you mean "reject"?');
    expect(() => parseInstant(LEAP, { leapSecond: 'reject' })).toThrow(KalendsSyntaxError);
    expect(parseInstant(LEAP).leapSecond).toBe(true);
    expect(() => parseExtendedDateTime(LEAP, { leapSecond: 1 } as never)).toThrow(KalendsTypeError);
  });

  it('shift overflow and toDayNumber dateFields', () => {
    const e = thrown(() => shiftDayNumber(0, parseDuration('P1M'), { overflow: 'clamp' } as never));
    expect(e.code).toBe('unknown-name');
    expect(e.message).toMatch(/^options\.overflow: expected one of "constrain", "reject", got "clamp"/);
    expect(thrown(() => shiftWallMs(0, parseDuration('P1M'), { overflow: 'Reject' } as never)).message).toContain('did you mean "reject"?');
    const d = thrown(() => toDayNumber(new Date(0), { dateFields: 'UTC' } as never));
    expect(d.code).toBe('unknown-name');
    expect(d.message).toContain('did you mean "utc"?');
  });

  it('formatInstant and formatPlainDateTime options', () => {
    expect(thrown(() => formatInstant(0, { fractionDigits: '3' } as never)).message).toContain('(pass the number 3, not a string)');
    expect(thrown(() => formatInstant(0, { fractionDigits: 10 } as never)).code).toBe('out-of-range');
    expect(thrown(() => formatInstant(0, { zoneId: 'Europe/Paris', zoneCritical: 'yes' } as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => formatInstant(0, { zoneCritical: true }))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => formatInstant(0, { annotations: 'u-ca=iso8601' } as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => formatPlainDateTime(0, { fractionDigits: 'auto', zone: 'x' } as never)).code).toBe('unknown-name');
  });
});

describe('options objects: null, arrays and unknown keys', () => {
  it('refuses null and arrays with a KalendsTypeError', () => {
    for (const bad of [null, [], 'reject', 5]) {
      const e = thrown(() => parseInstant('2025-01-01T00:00Z', bad as never));
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e.message).toMatch(/^options: expected an options object or undefined/);
    }
  });

  it('names an unknown key with the nearest valid one', () => {
    const e = thrown(() => formatInstant(0, { fractionDigit: 3 } as never));
    expect(e).toBeInstanceOf(KalendsTypeError);
    expect(e.code).toBe('unknown-name');
    expect(e.message).toMatch(/^options\.fractionDigit: unknown option; did you mean "fractionDigits"\?/);
    expect(thrown(() => parsePlainDateTime('2025-01-01', { leapSeconds: 'reject' } as never)).message).toContain('did you mean "leapSecond"?');
    expect(thrown(() => toDayNumber('2025-01-01', { datefields: 'utc' } as never)).code).toBe('unknown-name');
  });

  it('understoodKeys must be an array: a string would match keys by substring', () => {
    const text = '2025-01-01T00:00Z[!x-order=1]';
    // RFC 9557 section 3.3: a critical tag the recipient does not act on must be rejected.
    const e = thrown(() => parseInstant(text, { understoodKeys: 'x-order-id' } as never));
    expect(e).toBeInstanceOf(KalendsTypeError);
    expect(e.message).toContain('write ["x-order-id"] instead');
    expect(() => parseInstant(text, { understoodKeys: ['x-order-id'] })).toThrow(KalendsSyntaxError);
    expect(parseInstant(text, { understoodKeys: ['x-order'] }).annotations[0]!.key).toBe('x-order');
    expect(thrown(() => parseInstant(text, { understoodKeys: [1] } as never)).message).toMatch(/^options\.understoodKeys\[0\]/);
  });
});

describe('U+2212 minus sign: refused as an offset sign (RFC 3339 section 5.6, RFC 9557 section 4.1)', () => {
  it('is refused in an offset and in a zone annotation, as both Temporal polyfills do', () => {
    for (const text of ['2025-01-01T00:00\u221205:00', '2025-01-01T00:00-05:00[\u221205:00]']) {
      expect(() => Temporal.Instant.from(text)).toThrow(RangeError);
      expect(() => JsTemporal.Instant.from(text)).toThrow(RangeError);
      const e = thrown(() => parseInstant(text));
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      expect(e.message).toContain('U+2212');
      expect(e.message).toContain('write the ASCII hyphen-minus');
      expect(e.position).toBe(text.indexOf('\u2212'));
    }
    const z = thrown(() => parseOffsetText('zone', '\u221205:00'));
    expect(z).toBeInstanceOf(KalendsSyntaxError);
    expect(z.message).toMatch(/^zone: "\u221205:00" is not a UTC offset .*U\+2212/);
  });
});

describe('durationFromFields({}): refused as Temporal refuses it', () => {
  it('an empty field set is a TypeError (Temporal.Duration.from({}) throws a TypeError in both polyfills)', () => {
    expect(() => Temporal.Duration.from({})).toThrow(TypeError);
    expect(() => JsTemporal.Duration.from({})).toThrow(TypeError);
    const e = thrown(() => durationFromFields({}));
    expect(e).toBeInstanceOf(KalendsTypeError);
    expect(e.message).toMatch(/^fields: expected at least one of years, .* write \{ seconds: 0 \} for a zero duration/);
    expect(thrown(() => durationFromFields({ days: undefined }))).toBeInstanceOf(KalendsTypeError);
    // A zero field is a field: Temporal.Duration.from({ days: 0 }) is PT0S.
    expect(Temporal.Duration.from({ days: 0 }).toString()).toBe('PT0S');
    expect(durationFromFields({ days: 0 }).sign).toBe(0);
  });
});

describe('fractional instants and wall times (docs/design.md, "Input rules")', () => {
  it('text and Temporal objects carry the millisecond that holds the instant', () => {
    // -0.5 ms lies in millisecond -1: 1969-12-31T23:59:59.999Z (Temporal prints millisecond -1 so).
    expect(formatInstant(-0.5)).toBe(Temporal.Instant.fromEpochMilliseconds(-1).toString());
    expect(formatInstant(1.999, { offsetSeconds: 3600 })).toBe('1970-01-01T01:00:00.001+01:00');
    expect(temporalInstantFromEpochMs(1.5, Temporal).epochMilliseconds).toBe(1);
    expect(temporalInstantFromEpochMs(-0.5, JsTemporal).epochMilliseconds).toBe(-1);
    expect(formatPlainDateTime(-0.5)).toBe('1969-12-31T23:59:59.999');
    expect(temporalPlainDateTimeFromWallMs(86_400_000.75, Temporal).toString()).toBe('1970-01-02T00:00:00');
  });

  it('wall-time arithmetic keeps the fraction', () => {
    expect(shiftWallMs(0.5, parseDuration('P1D'))).toBe(86_400_000.5);
    expect(toWallMs(0.25)).toBe(0.25);
    expect(thrown(() => shiftWallMs('1970-01-01T00:00' as never, parseDuration('P1D'))).message).toContain('parsePlainDateTime(text)');
  });
});

describe('internal readers other layers use', () => {
  it('parseCalendarDateText: every fault is a syntax error with its position', () => {
    expect(parseCalendarDateText('2025-02-14', 'anchor')).toBe(20133);
    const e = thrown(() => parseCalendarDateText('2025-02-30', 'anchor'));
    expect(e).toBeInstanceOf(KalendsSyntaxError);
    expect(e.code).toBe('out-of-range');
    expect(e.position).toBe(8);
    expect(e.message).toMatch(/^anchor: "2025-02-30" is not an ISO 8601 calendar date/);
    const y = thrown(() => parseCalendarDateText('+275761-01-01', 'label'));
    expect(y).toBeInstanceOf(KalendsSyntaxError);
    expect(y.code).toBe('out-of-range');
    expect(parseCalendarDateText('+275761-01-01', 'label', 1)).toBe(100_000_110);
    expect(thrown(() => parseCalendarDateText('2025-02-14T00:00', 'x')).code).toBe('malformed');
  });

  it('dayNumberFromIsoDateText: a day number or what is wrong', () => {
    expect(dayNumberFromIsoDateText('2024-02-29')).toBe(19782);
    expect(dayNumberFromIsoDateText('2023-02-29')).toMatch(/^"2023-02-29" is not an ISO 8601 calendar date .*day 29 is out of range; 2023-02 has days 01 to 28/);
    expect(dayNumberFromIsoDateText('-000000-01-01')).toMatch(/-000000 is not a valid year/);
  });

  it('parseOffsetText: ISO 8601 basic and extended offsets', () => {
    expect(parseOffsetText('offset', '+05:30')).toBe(19_800);
    expect(parseOffsetText('offset', '-0800')).toBe(-28_800);
    expect(parseOffsetText('offset', '+05:21:10')).toBe(19_270);
    expect(parseOffsetText('offset', '-08')).toBe(-28_800);
    for (const bad of ['05:30', '+5:30', '+24:00', '+05:60', '+05:30Z']) expect(() => parseOffsetText('offset', bad)).toThrow(KalendsSyntaxError);
  });
});

/**
 * Grammar-driven fuzzing: strings generated from the RFC 3339 section 5.6 grammar (with the RFC 9557 section 4.1
 * suffix and the extensions listed in docs/instants.md) must parse to the instant @js-temporal/polyfill finds,
 * and must round-trip through formatInstant to a normal form.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  formatInstant,
  formatIsoWeekDate,
  formatOrdinalDate,
  formatPlainDate,
  formatPlainDateTime,
  parseInstant,
  parsePlainDate,
  parsePlainDateTime,
} from '../../src/instant/index.js';
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../../src/bounds.js';
import { dayCountOfMonth, dayNumberFromYmd } from '../../src/civil/index.js';

const SEED = 3339_9557;
const pad = (n: number, w = 2) => String(n).padStart(w, '0');
const yearText = (y: number) => (y >= 0 && y <= 9999 ? pad(y, 4) : `${y < 0 ? '-' : '+'}${pad(Math.abs(y), 6)}`);

/** Fields of one generated RFC 3339 date-time, and the text written from them in a random allowed spelling. */
interface Generated {
  text: string;
  canonical: string; // the normal form formatInstant must produce for the same offset
}

const ZONES = ['Europe/Dublin', 'America/Chicago', 'Asia/Kolkata', 'Pacific/Auckland', 'UTC'];

const generated: fc.Arbitrary<Generated> = fc
  .record({
    year: fc.oneof(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: -271820, max: 275759 })),
    month: fc.integer({ min: 1, max: 12 }),
    dayPick: fc.nat(),
    hour: fc.integer({ min: 0, max: 23 }),
    minute: fc.integer({ min: 0, max: 59 }),
    second: fc.option(fc.integer({ min: 0, max: 59 }), { nil: undefined }),
    fraction: fc.string({ unit: fc.constantFrom(...'0123456789'.split('')), minLength: 1, maxLength: 9 }),
    hasFraction: fc.boolean(),
    decimalSign: fc.constantFrom('.', ','),
    sep: fc.constantFrom('T', 't', ' '),
    offset: fc.oneof(
      fc.constantFrom('Z', 'z'),
      fc.record({
        sign: fc.constantFrom('+', '-'),
        h: fc.integer({ min: 0, max: 23 }),
        m: fc.integer({ min: 0, max: 59 }),
        s: fc.option(fc.integer({ min: 1, max: 59 }), { nil: undefined }),
      }),
    ),
    zone: fc.option(fc.record({ id: fc.constantFrom(...ZONES), critical: fc.boolean() }), { nil: undefined }),
    calendar: fc.option(fc.constantFrom('[u-ca=iso8601]', '[!u-ca=iso8601]', '[u-ca=hebrew]', '[x-shop=lakeside]'), { nil: undefined }),
  })
  .map((g) => {
    const day = 1 + (g.dayPick % dayCountOfMonth(g.year, g.month));
    const date = `${yearText(g.year)}-${pad(g.month)}-${pad(day)}`;
    const sec = g.second === undefined ? '' : `:${pad(g.second)}`;
    const frac = g.second !== undefined && g.hasFraction ? `${g.decimalSign}${g.fraction}` : '';
    let off: string;
    let canonOff: string;
    if (typeof g.offset === 'string') {
      off = g.offset;
      canonOff = 'Z';
    } else {
      const o = g.offset;
      off = `${o.sign}${pad(o.h)}:${pad(o.m)}${o.s === undefined ? '' : `:${pad(o.s)}`}`;
      canonOff = o.sign === '-' && o.h === 0 && o.m === 0 && o.s === undefined ? 'Z' : `${o.h === 0 && o.m === 0 && !o.s ? '+' : o.sign}${pad(o.h)}:${pad(o.m)}${o.s === undefined ? '' : `:${pad(o.s)}`}`;
    }
    const zone = g.zone === undefined ? '' : `[${g.zone.critical ? '!' : ''}${g.zone.id}]`;
    const text = `${date}${g.sep}${pad(g.hour)}:${pad(g.minute)}${sec}${frac}${off}${zone}${g.calendar ?? ''}`;
    // Normal form: upper-case T, seconds always, fraction floored to ms and trimmed, "." as decimal sign.
    const ms = frac === '' ? '' : g.fraction.padEnd(3, '0').slice(0, 3).replace(/0+$/, '');
    const canonical = `${date}T${pad(g.hour)}:${pad(g.minute)}:${pad(g.second ?? 0)}${ms ? `.${ms}` : ''}${canonOff}`;
    return { text, canonical };
  })
  .filter(({ canonical }) => {
    // keep instants inside the range (edges are tested by hand in parse.test.ts)
    const ms = Temporal.Instant.from(canonical).epochMilliseconds;
    return ms > MIN_EPOCH_MS + 86_400_000 && ms < MAX_EPOCH_MS - 86_400_000;
  });

describe('generated RFC 3339 / RFC 9557 strings', () => {
  it('parseInstant gives the epochMilliseconds of @js-temporal/polyfill Temporal.Instant.from', () => {
    fc.assert(
      fc.property(generated, ({ text }) => {
        expect(parseInstant(text).epochMs).toBe(Temporal.Instant.from(text).epochMilliseconds);
      }),
      { seed: SEED, numRuns: 3000 },
    );
  });

  it('format(parse(s)) is the normal form of s: T, seconds, floored trimmed fraction, the written offset', () => {
    fc.assert(
      fc.property(generated, ({ text, canonical }) => {
        const p = parseInstant(text);
        const out = formatInstant(p.epochMs, p.localOffsetUnknown ? {} : { offsetSeconds: p.offsetSeconds });
        expect(out).toBe(canonical);
        // and the normal form parses to the same instant
        expect(parseInstant(out).epochMs).toBe(p.epochMs);
      }),
      { seed: SEED + 1, numRuns: 3000 },
    );
  });

  it('zone annotations and suffix tags come back as written', () => {
    fc.assert(
      fc.property(generated, ({ text }) => {
        const p = parseInstant(text);
        const m = /\[(!?)([A-Za-z_/]+)\]/.exec(text);
        expect(p.zoneId).toBe(m?.[2]);
        expect(p.zoneCritical).toBe(m?.[1] === '!');
        expect(p.annotations.length).toBe((text.match(/=/g) ?? []).length);
      }),
      { seed: SEED + 2, numRuns: 1000 },
    );
  });
});

describe('parse(format(x)) for instants, offsets and digits', () => {
  const epochMs = fc.integer({ min: MIN_EPOCH_MS + 86_400_000, max: MAX_EPOCH_MS - 86_400_000 });
  const offsetSeconds = fc.integer({ min: -86_399, max: 86_399 });

  it('returns the same instant and offset for every offset and fractionDigits 3 or auto', () => {
    fc.assert(
      fc.property(epochMs, offsetSeconds, fc.constantFrom<3 | 'auto'>(3, 'auto'), (ms, off, digits) => {
        const p = parseInstant(formatInstant(ms, { offsetSeconds: off, fractionDigits: digits }));
        expect(p.epochMs).toBe(ms);
        expect(p.offsetSeconds).toBe(off);
      }),
      { seed: SEED + 3, numRuns: 3000 },
    );
  });

  it('matches Temporal Instant.toString({ timeZone }) for minute offsets', () => {
    fc.assert(
      fc.property(epochMs, fc.integer({ min: -1439, max: 1439 }), (ms, minutes) => {
        const off = minutes * 60;
        const sign = off < 0 ? '-' : '+';
        const tz = `${sign}${pad(Math.floor(Math.abs(minutes) / 60))}:${pad(Math.abs(minutes) % 60)}`;
        expect(formatInstant(ms, { offsetSeconds: off })).toBe(Temporal.Instant.fromEpochMilliseconds(ms).toString({ timeZone: tz }));
      }),
      { seed: SEED + 4, numRuns: 2000 },
    );
  });
});

describe('plain dates and date-times against Temporal', () => {
  // Temporal.PlainDate's range: -271821-04-19 .. +275760-09-13
  const temporalDay = fc.integer({ min: dayNumberFromYmd(-271821, 4, 19), max: dayNumberFromYmd(275760, 9, 13) });

  it('formatPlainDate equals PlainDate.toString() and parses back', () => {
    fc.assert(
      fc.property(temporalDay, (dn) => {
        const t = Temporal.PlainDate.from('1970-01-01').add({ days: dn });
        expect(formatPlainDate(dn)).toBe(t.toString());
        expect(parsePlainDate(t.toString())).toBe(dn);
      }),
      { seed: SEED + 5, numRuns: 2000 },
    );
  });

  it('week dates and ordinal dates agree with yearOfWeek / weekOfYear / dayOfWeek / dayOfYear and parse back', () => {
    fc.assert(
      fc.property(fc.integer({ min: dayNumberFromYmd(-9999, 1, 1), max: dayNumberFromYmd(99999, 12, 1) }), (dn) => {
        const t = Temporal.PlainDate.from('1970-01-01').add({ days: dn });
        expect(formatIsoWeekDate(dn)).toBe(`${yearText(t.yearOfWeek!)}-W${pad(t.weekOfYear!)}-${t.dayOfWeek}`);
        expect(formatOrdinalDate(dn)).toBe(`${yearText(t.year)}-${pad(t.dayOfYear, 3)}`);
        expect(parsePlainDate(formatIsoWeekDate(dn))).toBe(dn);
        expect(parsePlainDate(formatOrdinalDate(dn))).toBe(dn);
      }),
      { seed: SEED + 6, numRuns: 2000 },
    );
  });

  it('formatPlainDateTime equals PlainDateTime.toString() and parses back', () => {
    fc.assert(
      fc.property(fc.integer({ min: -8.64e15 + 86_400_000, max: 8.64e15 - 86_400_000 }), (wallMs) => {
        const t = Temporal.Instant.fromEpochMilliseconds(wallMs).toZonedDateTimeISO('UTC').toPlainDateTime();
        expect(formatPlainDateTime(wallMs)).toBe(t.toString());
        expect(parsePlainDateTime(t.toString())).toBe(wallMs);
      }),
      { seed: SEED + 7, numRuns: 2000 },
    );
  });
});

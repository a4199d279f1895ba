/**
 * RFC 5545 time parts and recurrence sets (issue 15): BYHOUR, BYMINUTE, BYSECOND, FREQ=SECONDLY (section
 * 3.3.10), local times in a DST gap or overlap (sections 3.3.5 and 3.3.10), RDATE, several EXDATE lines and
 * lists, several RRULE lines (section 3.8.5.3; Appendix A), the round trip parse -> format -> parse on random rules,
 * and the typed errors for bad parts. Local times are resolved independently by @js-temporal/polyfill (the
 * ECMA-262 Temporal reference implementation): its 'compatible' disambiguation is the RFC 5545 section 3.3.5 rule
 * (a time in a gap is read with the offset before the gap; a repeated time is its first occurrence).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, describeRule, formatRecurrenceRule, iterateOccurrenceEpochMs, listOccurrenceEpochMs, listOccurrenceDayNumbers, formatPlainDate, parseRecurrenceRule } from '../../src/index.js';

const SEED = 20261204;
const NY = 'America/New_York';
const ms = (iso: string): number => Temporal.Instant.from(iso).epochMilliseconds;
/** Epoch ms of a local time in `zone` by Temporal, with the RFC 5545 section 3.3.5 disambiguation. */
function local(zone: string, wall: string): number {
  return Temporal.PlainDateTime.from(wall).toZonedDateTime(zone, { disambiguation: 'compatible' }).epochMilliseconds;
}
function thrown(f: () => unknown): Error {
  try {
    f();
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected an error');
}

describe('time parts (RFC 5545 section 3.3.10)', () => {
  it('DAILY with BYHOUR x BYMINUTE x BYSECOND: every combination, in order (the "Expand" column of the table)', () => {
    const rule = parseRecurrenceRule('DTSTART:20250101T000000Z\nRRULE:FREQ=DAILY;COUNT=8;BYHOUR=6,18;BYMINUTE=15,45;BYSECOND=0,30');
    const got = Array.from(iterateOccurrenceEpochMs(rule, ms('2025-01-01T00:00Z'), { limit: 100 }));
    const want = ['06:15:00', '06:15:30', '06:45:00', '06:45:30', '18:15:00', '18:15:30', '18:45:00', '18:45:30'].map((t) => ms(`2025-01-01T${t}Z`));
    expect(got).toEqual(want);
  });

  it('the plain-words description names the time parts, RDATE and further RRULEs', () => {
    const rule = parseRecurrenceRule('DTSTART:20250106T090000Z\nRRULE:FREQ=WEEKLY;BYHOUR=9,15;BYMINUTE=30\nRRULE:FREQ=SECONDLY;COUNT=2\nRDATE:20250110T120000Z');
    const text = describeRule(rule);
    for (const part of ['at hour 9', '15', 'at minute 30', 'every second', 'also 2025-01-10T12:00:00']) expect(text).toContain(part);
  });

  it('missing time parts come from DTSTART (section 3.3.10: "the same as DTSTART")', () => {
    const rule = parseRecurrenceRule('DTSTART:20250101T091522Z\nRRULE:FREQ=WEEKLY;COUNT=2;BYHOUR=8,17');
    expect(Array.from(iterateOccurrenceEpochMs(rule, ms('2025-01-01T00:00Z'), { limit: 10 }))).toEqual([ms('2025-01-01T17:15:22Z'), ms('2025-01-08T08:15:22Z')]);
  });

  it('SECONDLY steps, and BYSECOND as a limit of SECONDLY', () => {
    const a = parseRecurrenceRule('DTSTART:20250101T000000Z\nRRULE:FREQ=SECONDLY;INTERVAL=15;COUNT=5');
    expect(Array.from(iterateOccurrenceEpochMs(a, 0, { limit: 10 }))).toEqual([0, 15, 30, 45, 60].map((s) => ms('2025-01-01T00:00Z') + s * 1000));
    const b = parseRecurrenceRule('DTSTART:20250101T000000Z\nRRULE:FREQ=SECONDLY;BYSECOND=10,50;COUNT=4');
    expect(Array.from(iterateOccurrenceEpochMs(b, 0, { limit: 10 }))).toEqual(['00:00:10', '00:00:50', '00:01:10', '00:01:50'].map((t) => ms(`2025-01-01T${t}Z`)));
  });

  it('HOURLY expands BYMINUTE and limits by BYDAY; BYSETPOS picks within each period of times', () => {
    const a = parseRecurrenceRule('DTSTART:20250103T220000Z\nRRULE:FREQ=HOURLY;BYMINUTE=0,30;BYDAY=FR;COUNT=4');
    // 2025-01-03 is a Friday (ISO 8601 calendar; checked by Temporal below); Saturday hours are limited away.
    expect(Temporal.PlainDate.from('2025-01-03').dayOfWeek).toBe(5);
    expect(Array.from(iterateOccurrenceEpochMs(a, 0, { limit: 10 }))).toEqual(['2025-01-03T22:00Z', '2025-01-03T22:30Z', '2025-01-03T23:00Z', '2025-01-03T23:30Z'].map(ms));
    const b = parseRecurrenceRule('DTSTART:20250101T090000Z\nRRULE:FREQ=DAILY;BYHOUR=9,12,17;BYSETPOS=-1;COUNT=2');
    expect(Array.from(iterateOccurrenceEpochMs(b, 0, { limit: 10 }))).toEqual(['2025-01-01T17:00Z', '2025-01-02T17:00Z'].map(ms));
  });

  it('local times in a gap move forward by the gap; repeated ones take the first instant (sections 3.3.5, 3.3.10)', () => {
    // New York, 2025-03-09: 02:00 EST jumps to 03:00 EDT; 2025-11-02: 02:00 EDT falls back to 01:00 EST (IANA tz).
    for (const [start, days] of [
      ['20250308T003000', ['2025-03-08', '2025-03-09', '2025-03-10', '2025-03-11']],
      ['20251101T003000', ['2025-11-01', '2025-11-02', '2025-11-03', '2025-11-04']],
    ] as const) {
      const rule = parseRecurrenceRule(`DTSTART;TZID=${NY}:${start}\nRRULE:FREQ=DAILY;COUNT=12;BYHOUR=0,1,2,3;BYMINUTE=30`);
      const want = [...new Set(days.flatMap((d) => ['00:30', '01:30', '02:30', '03:30'].map((t) => local(NY, `${d}T${t}`))))].sort((x, y) => x - y).slice(0, 12);
      expect(Array.from(iterateOccurrenceEpochMs(rule, 0, { limit: 20 }))).toEqual(want);
    }
  });
});

describe('recurrence sets: RDATE, EXDATE lines and lists, several RRULEs (section 3.8.5.3)', () => {
  it('RDATE adds, EXDATE (several lines, lists) removes, several RRULEs join', () => {
    const text = [
      'DTSTART;VALUE=DATE:20250106',
      'RRULE:FREQ=WEEKLY;COUNT=4;BYDAY=MO',
      'RRULE:FREQ=MONTHLY;COUNT=2;BYMONTHDAY=15',
      'RDATE;VALUE=DATE:20250103,20250201',
      'EXDATE;VALUE=DATE:20250113',
      'EXDATE;VALUE=DATE:20250120,20250215',
    ].join('\r\n');
    const rule = parseRecurrenceRule(text);
    expect(listOccurrenceDayNumbers(rule, '2025-01-01', '2026-01-01').map(formatPlainDate)).toEqual(['2025-01-03', '2025-01-06', '2025-01-15', '2025-01-27', '2025-02-01']);
    // Each RRULE keeps its own COUNT; the text round-trips.
    const again = parseRecurrenceRule(formatRecurrenceRule(rule));
    expect(listOccurrenceDayNumbers(again, '2025-01-01', '2026-01-01')).toEqual(listOccurrenceDayNumbers(rule, '2025-01-01', '2026-01-01'));
  });

  it('RDATE of the other value type, and EXRULE (removed by Appendix A), are typed errors naming the value or part', () => {
    const e = thrown(() => parseRecurrenceRule('DTSTART;VALUE=DATE:20250106\nRRULE:FREQ=WEEKLY\nRDATE:20250103T090000Z'));
    expect(e).toBeInstanceOf(DefinitionError);
    expect(e.message).toContain('include[0]');
    expect((thrown(() => parseRecurrenceRule('DTSTART:20250106T090000Z\nRRULE:FREQ=DAILY\nEXRULE:FREQ=WEEKLY')) as KalendsSyntaxError).code).toBe('unsupported');
  });
});

describe('bad input names the value', () => {
  it('parts out of range, COUNT with UNTIL, time parts on a date', () => {
    for (const [text, names] of [
      ['DTSTART:20250101T000000Z\nRRULE:FREQ=DAILY;BYHOUR=24', ['BYHOUR', '"24"', '0 to 23']],
      ['DTSTART:20250101T000000Z\nRRULE:FREQ=DAILY;BYMINUTE=60', ['BYMINUTE', '"60"', '0 to 59']],
      ['DTSTART:20250101T000000Z\nRRULE:FREQ=DAILY;BYSECOND=61', ['BYSECOND', '"61"', '0 to 60']],
      ['DTSTART:20250101T000000Z\nRRULE:FREQ=DAILY;COUNT=3;UNTIL=20250110T000000Z', ['COUNT', 'UNTIL', '"3"', '"20250110T000000Z"']],
    ] as const) {
      const e = thrown(() => parseRecurrenceRule(text));
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      for (const n of names) expect(e.message).toContain(n);
    }
    const d = thrown(() => parseRecurrenceRule('DTSTART;VALUE=DATE:20250101\nRRULE:FREQ=DAILY;BYHOUR=9'));
    expect(d).toBeInstanceOf(DefinitionError);
    expect(d.message).toContain('BYHOUR needs a DTSTART with a time');
  });

  it('an unbounded expansion without a limit is refused, naming the parameter', () => {
    const rule = parseRecurrenceRule('DTSTART:20250101T000000Z\nRRULE:FREQ=SECONDLY');
    const e = thrown(() => iterateOccurrenceEpochMs(rule, ms('2025-01-01T00:00Z')));
    expect(e.message).toContain('options.limit');
    expect(e.message).toContain('got undefined');
    expect(listOccurrenceEpochMs(rule, ms('2025-01-01T00:00Z'), ms('2025-01-01T00:01Z'))).toHaveLength(60);
  });
});

describe('round trip: parse, format, parse again give the same occurrences (property)', () => {
  const list = (xs: number[], lo: number, hi: number) => fc.uniqueArray(fc.integer({ min: lo, max: hi }), { minLength: 1, maxLength: xs.length || 3 });
  const ruleText = fc
    .record({
      frequency: fc.constantFrom('SECONDLY', 'MINUTELY', 'HOURLY', 'DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'),
      interval: fc.integer({ min: 1, max: 5 }),
      count: fc.integer({ min: 1, max: 40 }),
      byHour: fc.option(list([], 0, 23), { nil: undefined }),
      byMinute: fc.option(list([], 0, 59), { nil: undefined }),
      bySecond: fc.option(list([], 0, 59), { nil: undefined }),
      byMonth: fc.option(list([], 1, 12), { nil: undefined }),
      byDay: fc.option(fc.uniqueArray(fc.constantFrom('MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'), { minLength: 1, maxLength: 3 }), { nil: undefined }),
      zone: fc.constantFrom('America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'UTC'),
      day: fc.integer({ min: 0, max: 3000 }),
      time: fc.integer({ min: 0, max: 86_399 }),
      rdate: fc.option(fc.integer({ min: 1, max: 400 }), { nil: undefined }),
      exdateIndex: fc.option(fc.integer({ min: 0, max: 5 }), { nil: undefined }),
    })
    .map((r) => {
      const start = Temporal.PlainDate.from('2020-01-01').add({ days: r.day }).toPlainDateTime(Temporal.PlainTime.from({ second: 0 }).add({ seconds: r.time }));
      const compact = (p: Temporal.PlainDateTime) => p.toString().slice(0, 19).replace(/[-:]/g, '');
      const parts = [`FREQ=${r.frequency}`, `INTERVAL=${r.interval}`, `COUNT=${r.count}`];
      if (r.byHour) parts.push(`BYHOUR=${r.byHour.join(',')}`);
      if (r.byMinute) parts.push(`BYMINUTE=${r.byMinute.join(',')}`);
      if (r.bySecond) parts.push(`BYSECOND=${r.bySecond.join(',')}`);
      if (r.byMonth) parts.push(`BYMONTH=${r.byMonth.join(',')}`);
      if (r.byDay) parts.push(`BYDAY=${r.byDay.join(',')}`);
      const dt = r.zone === 'UTC' ? `DTSTART:${compact(start)}Z` : `DTSTART;TZID=${r.zone}:${compact(start)}`;
      const lines = [dt, `RRULE:${parts.join(';')}`];
      if (r.rdate !== undefined) {
        const v = compact(start.add({ hours: r.rdate }));
        lines.push(r.zone === 'UTC' ? `RDATE:${v}Z` : `RDATE;TZID=${r.zone}:${v}`);
      }
      return { text: lines.join('\n'), exdateIndex: r.exdateIndex };
    });

  it('random rules (seeded)', () => {
    fc.assert(
      fc.property(ruleText, ({ text }) => {
        let rule;
        try {
          rule = parseRecurrenceRule(text);
        } catch (e) {
          // A random rule may never produce an instant (its steps miss every allowed local time in the allowed
          // months): a typed error when it is defined or its count is located, not an endless loop.
          expect(e instanceof DefinitionError || e instanceof KalendsRangeError).toBe(true);
          return;
        }
        const first = Array.from(iterateOccurrenceEpochMs(rule, ms('2019-12-01T00:00Z'), { limit: 60 }));
        const again = parseRecurrenceRule(formatRecurrenceRule(rule));
        expect(Array.from(iterateOccurrenceEpochMs(again, ms('2019-12-01T00:00Z'), { limit: 60 }))).toEqual(first);
      }),
      { seed: SEED, numRuns: 120 },
    );
  });
});

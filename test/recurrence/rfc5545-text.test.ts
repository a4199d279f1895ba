/**
 * RFC 5545 text in and out: the grammar of section 3.3.10 (RECUR) and 3.1 (content lines and folding), its
 * forbidden combinations, and our translation of native rules to RFC 5545 text (checked by expanding both).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DefinitionError,
  KalendsRangeError,
  KalendsSyntaxError,
  type RuleDefinition,
  defineRule,
  formatPlainDate,
  formatRecurrenceRule,
  listOccurrenceDayNumbers,
  parseRecurrenceRule,
} from '../../src/index.js';

const SEED = 20261209;

function syntaxError(f: () => unknown): KalendsSyntaxError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(KalendsSyntaxError);
    return e as KalendsSyntaxError;
  }
  throw new Error('expected a KalendsSyntaxError');
}

describe('parsing', () => {
  it('a DATE DTSTART gives a rule of dates; a bare rule takes options.start', () => {
    const rule = parseRecurrenceRule('DTSTART;VALUE=DATE:20250131\nRRULE:FREQ=MONTHLY;BYMONTHDAY=-1;COUNT=3');
    expect(rule.values).toBe('dates');
    expect(listOccurrenceDayNumbers(rule, '2025-01-01', '2026-01-01').map(formatPlainDate)).toEqual(['2025-01-31', '2025-02-28', '2025-03-31']);
    const bare = parseRecurrenceRule('FREQ=WEEKLY;BYDAY=MO,FR;COUNT=3', { start: '2025-01-06' });
    expect(listOccurrenceDayNumbers(bare, '2025-01-01', '2026-01-01').map(formatPlainDate)).toEqual(['2025-01-06', '2025-01-10', '2025-01-13']);
  });

  it('rule parts in any order, lower case, folded lines (RFC 5545 sections 3.1 and 3.3.10)', () => {
    const a = parseRecurrenceRule('DTSTART;VALUE=DATE:19970902\r\nRRULE:count=4;freq=weekly;\r\n byday=TU,TH');
    expect(listOccurrenceDayNumbers(a, '1997-01-01', '1998-01-01').map(formatPlainDate)).toEqual(['1997-09-02', '1997-09-04', '1997-09-09', '1997-09-11']);
  });

  it('unsupported parts name the part', () => {
    for (const [text, part] of [
      ['DTSTART:19970902T090000Z\nRRULE:FREQ=DAILY\nEXRULE:FREQ=WEEKLY', 'EXRULE'],
      ['DTSTART:19970902T090000Z\nRRULE:FREQ=DAILY\nRDATE;VALUE=PERIOD:19970910T090000Z/PT1H', 'PERIOD'],
      ['DTSTART:19970902T090000Z\nRRULE:FREQ=YEARLY;RSCALE=HEBREW', 'RSCALE'],
    ] as const) {
      const e = syntaxError(() => parseRecurrenceRule(text));
      expect(e.code).toBe('unsupported');
      expect(e.message).toContain(part);
    }
  });

  it('grammar faults are malformed, with a position', () => {
    const cases = [
      'DTSTART:19970902T090000Z\nRRULE:FREQ=DAILY;COUNT=3;UNTIL=19971224T000000Z',
      'DTSTART:19970902T090000Z\nRRULE:INTERVAL=2',
      'DTSTART:19970902T090000Z\nRRULE:FREQ=DAILY;FREQ=WEEKLY',
      'DTSTART:19970902T090000Z\nRRULE:FREQ=MONTHLY;BYMONTHDAY=32',
      'DTSTART:19970902T090000Z\nRRULE:FREQ=MONTHLY;BYDAY=0MO',
      'DTSTART:1997-09-02\nRRULE:FREQ=DAILY',
      'RRULE:FREQ=DAILY',
    ];
    for (const text of cases) {
      const e = syntaxError(() => parseRecurrenceRule(text));
      expect(e.code).toBe('malformed');
      expect(e.position).toBeGreaterThanOrEqual(0);
    }
  });

  it('combinations RFC 5545 forbids and rules that never produce a date are definition errors; INTERVAL=0 is out of range in the text', () => {
    const forbidden = [
      ['RRULE:FREQ=MONTHLY;BYWEEKNO=20', 'byWeekNo'],
      ['RRULE:FREQ=WEEKLY;BYMONTHDAY=1', 'byMonthDay'],
      ['RRULE:FREQ=DAILY;BYDAY=1MO', 'byDay'],
      ['RRULE:FREQ=DAILY;BYSETPOS=1', 'bySetPos'],
      ['RRULE:FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=30', 'frequency'],
    ] as const;
    for (const [rrule, path] of forbidden) {
      let caught: unknown;
      try {
        parseRecurrenceRule(`DTSTART;VALUE=DATE:19970902\n${rrule}`);
      } catch (e) {
        caught = e;
      }
      expect(caught, rrule).toBeInstanceOf(DefinitionError);
      expect((caught as DefinitionError).issues.map((i) => i.path)).toContain(path);
    }
    // INTERVAL is 1*DIGIT (RFC 5545 section 3.3.10) and a rule of interval 0 would never move: the text's field is
    // out of range, reported where it stands.
    const text = 'DTSTART;VALUE=DATE:19970902\nRRULE:FREQ=DAILY;INTERVAL=0';
    try {
      parseRecurrenceRule(text);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(KalendsSyntaxError);
      expect((e as KalendsSyntaxError).code).toBe('out-of-range');
      expect((e as KalendsSyntaxError).position).toBe(text.indexOf('INTERVAL=0') + 9);
    }
  });
});

describe('formatting', () => {
  it('parse then format gives back the same rule parts', () => {
    const texts = [
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MONTHLY;INTERVAL=2;COUNT=10;BYDAY=1SU,-1SU',
      'DTSTART;VALUE=DATE:19970929\nRRULE:FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-2',
      'DTSTART:19970101T090000Z\nRRULE:FREQ=YEARLY;INTERVAL=3;UNTIL=20060101T000000Z;BYYEARDAY=1,100,200',
      'DTSTART;VALUE=DATE:19970805\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=4;BYDAY=TU,SU;WKST=SU',
      'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=MONTHLY;BYMONTHDAY=13;BYDAY=FR\nEXDATE;TZID=America/New_York:19970902T090000',
    ];
    for (const t of texts) expect(formatRecurrenceRule(parseRecurrenceRule(t))).toBe(t);
  });

  it('folds lines longer than 75 octets (RFC 5545 section 3.1) and unfolds them again', () => {
    const text = formatRecurrenceRule(
      parseRecurrenceRule('DTSTART;VALUE=DATE:19970101\nRRULE:FREQ=YEARLY;BYYEARDAY=1,2,3,4,5,6,7,8,9,10,11,12,13,14,15,16,17,18,19,20,21,22,23,24,25'),
    );
    for (const line of text.split('\n')) expect(line.length).toBeLessThanOrEqual(75);
    expect(formatRecurrenceRule(parseRecurrenceRule(text))).toBe(text);
  });

  it('native rules translate to RFC 5545 text that expands to the same dates (property)', () => {
    const native: fc.Arbitrary<RuleDefinition> = fc.oneof(
      fc.record({ kind: fc.constant('days' as const), every: fc.integer({ min: 1, max: 20 }), start: fc.integer({ min: 9000, max: 20000 }) }),
      fc.record({
        kind: fc.constant('weekly' as const),
        weekdays: fc.uniqueArray(fc.constantFrom('monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'), { minLength: 1, maxLength: 4 }),
        every: fc.integer({ min: 1, max: 4 }),
        start: fc.integer({ min: 9000, max: 20000 }),
        weekStart: fc.constantFrom('monday', 'sunday', 'wednesday'),
      }),
      fc.record({
        kind: fc.constant('monthly' as const),
        on: fc.oneof(
          fc.record({ day: fc.integer({ min: 1, max: 28 }) }),
          fc.record({ day: fc.integer({ min: 29, max: 31 }), whenShort: fc.constantFrom('last-day' as const, 'skip' as const) }),
          fc.record({ weekday: fc.constantFrom('monday', 'friday'), nth: fc.constantFrom(1, 3, -1, -2) }),
        ),
        every: fc.integer({ min: 1, max: 6 }),
        start: fc.integer({ min: 9000, max: 20000 }),
      }),
      fc.record({ kind: fc.constant('semi-monthly' as const), days: fc.constant([15, 'last']), start: fc.integer({ min: 9000, max: 20000 }) }),
      fc.record({ kind: fc.constantFrom('quarterly' as const, 'yearly' as const), month: fc.integer({ min: 1, max: 12 }), on: fc.constant({ day: -1 }), start: fc.integer({ min: 9000, max: 20000 }) }),
    ) as fc.Arbitrary<RuleDefinition>;
    fc.assert(
      fc.property(native, fc.integer({ min: 0, max: 3000 }), (def, span) => {
        const rule = defineRule(def);
        const text = formatRecurrenceRule(rule);
        const back = parseRecurrenceRule(text);
        const a = (def as { start: number }).start;
        expect(listOccurrenceDayNumbers(back, a, a + 400 + span), text).toEqual(listOccurrenceDayNumbers(rule, a, a + 400 + span));
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('rules with no RFC 5545 form say what is missing', () => {
    const cases: [RuleDefinition, string][] = [
      [{ kind: 'monthly', on: { businessDay: -1 }, calendar: 'us-federal', start: '2025-01-01' }, 'business-day selector'],
      [{ kind: 'business-days', calendar: 'us-federal', start: '2025-01-01' }, 'business days'],
      [{ kind: 'intraday', zone: 'UTC', every: { hours: 1 }, anchor: '2025-01-01T00:00', clock: 'wall' }, 'wall clock'],
      [{ kind: 'monthly', on: { day: 15 } }, 'options.start'],
    ];
    for (const [def, what] of cases) {
      let caught: unknown;
      try {
        formatRecurrenceRule(defineRule(def));
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(KalendsRangeError);
      expect((caught as Error).message).toContain(what);
    }
    expect(formatRecurrenceRule(defineRule({ kind: 'monthly', on: { day: 15 } }), { start: '2025-01-01' })).toBe('DTSTART;VALUE=DATE:20250115\nRRULE:FREQ=MONTHLY;BYMONTHDAY=15');
    expect(formatRecurrenceRule(defineRule({ kind: 'intraday', zone: 'America/Chicago', every: { minutes: 90 }, anchor: '2025-01-01T08:00', clock: 'elapsed' }))).toBe(
      'DTSTART;TZID=America/Chicago:20250101T080000\nRRULE:FREQ=MINUTELY;INTERVAL=90',
    );
  });
});

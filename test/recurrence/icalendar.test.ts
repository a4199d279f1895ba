/**
 * iCalendar out (issue 15): `formatCalendar` against (1) our own parser reading the file back to the same
 * occurrences, (2) a validator written from the ABNF of RFC 5545 sections 3.1, 3.3 and 3.6
 * (./icalendar-validator.ts), which accepts every file written here and rejects a corpus of broken ones, each
 * naming the rule it breaks, and (3) the VTIMEZONE's STANDARD and DAYLIGHT parts, expanded by our own RRULE/RDATE
 * engine, giving the compiled zone's transitions, each offset checked against @js-temporal/polyfill (IANA tz data
 * through Intl).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import {
  defineProfile,
  defineRule,
  formatCalendar,
  formatPlainDate,
  iterateOccurrenceEpochMs,
  listOccurrenceDayNumbers,
  listOccurrenceEpochMs,
  listTransitions,
  parseRecurrenceRule,
  ruleOfProfile,
} from '../../src/index.js';
import { validateCalendar } from './icalendar-validator.js';

const FROM = '2025-01-01T00:00:00Z';
const TO = '2027-01-01T00:00:00Z';
const ms = (iso: string) => Temporal.Instant.from(iso).epochMilliseconds;
const profile = defineProfile(JSON.parse(readFileSync(new URL('../../examples/otterbrook.profile.json', import.meta.url), 'utf8')) as never);

/** Unfolded content lines of each component named `name`. */
function components(text: string, name: string): string[][] {
  const lines = text.replace(/\r\n[ \t]/g, '').split('\r\n');
  const out: string[][] = [];
  let cur: string[] | undefined;
  for (const l of lines) {
    if (l === `BEGIN:${name}`) cur = [];
    else if (l === `END:${name}`) {
      out.push(cur!);
      cur = undefined;
    } else cur?.push(l);
  }
  return out;
}
const recurrenceLines = (lines: string[]) => lines.filter((l) => /^(DTSTART|RRULE|RDATE|EXDATE)[;:]/.test(l)).join('\n');

const nyTimes = parseRecurrenceRule('DTSTART;TZID=America/New_York:20250106T090000\nRRULE:FREQ=WEEKLY;BYDAY=MO,WE;BYHOUR=9,15;BYMINUTE=0,30\nEXDATE;TZID=America/New_York:20250108T150000');
const fridays = defineRule({ kind: 'weekly', weekdays: ['friday'], every: 2, anchor: '2025-01-03' });
const events = [
  { rule: nyTimes, summary: 'Stand-up; review, and plan \\ notes', uid: 'standup@otterbrook.example', description: 'Line one\nLine two — ünïcödé, long enough to be folded across several lines of seventy-five octets each 🦦🦦🦦' },
  { rule: fridays, summary: 'Payroll run', uid: 'payroll@otterbrook.example' },
];

describe('formatCalendar: rule form', () => {
  const text = formatCalendar(events, { stamp: '2025-01-01T00:00:00Z', from: FROM, to: TO });

  it('is valid by the RFC 5545 ABNF checks (sections 3.1, 3.3, 3.6)', () => {
    expect(validateCalendar(text)).toEqual([]);
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.split('\r\n').some((l) => l.startsWith(' '))).toBe(true); // the description is folded
  });

  it('our parser reads each VEVENT back to the same occurrences', () => {
    const [a, b] = components(text, 'VEVENT');
    const back = parseRecurrenceRule(recurrenceLines(a!));
    expect(listOccurrenceEpochMs(back, ms(FROM), ms(TO))).toEqual(listOccurrenceEpochMs(nyTimes, ms(FROM), ms(TO)));
    const fri = parseRecurrenceRule(recurrenceLines(b!));
    expect(listOccurrenceDayNumbers(fri, '2025-01-01', '2027-01-01')).toEqual(listOccurrenceDayNumbers(fridays, '2025-01-01', '2027-01-01'));
    // TEXT escaping (3.3.11) undone gives the summary back.
    const summary = a!.find((l) => l.startsWith('SUMMARY:'))!.slice(8);
    expect(summary.replace(/\\([\\;,])/g, '$1')).toBe(events[0]!.summary);
  });

  it('a rule with no RFC 5545 form (business days) says to use the occurrences form', () => {
    expect(() => formatCalendar([{ rule: ruleOfProfile(profile, 'month-end-close'), summary: 'Close', uid: 'c' }], { stamp: FROM, from: FROM, to: TO })).toThrow(/no RFC 5545 form/);
  });
});

describe('formatCalendar: occurrences form (the close calendar of examples/otterbrook.profile.json)', () => {
  const close = ruleOfProfile(profile, 'month-end-close');
  const text = formatCalendar([{ rule: close, summary: 'Month-end close', uid: 'close@otterbrook.example' }, ...events], {
    stamp: '2025-01-01T00:00:00Z',
    from: FROM,
    to: TO,
    form: 'occurrences',
  });

  it('is valid, one VEVENT per occurrence, each read back by our parser', () => {
    expect(validateCalendar(text)).toEqual([]);
    const vevents = components(text, 'VEVENT');
    const dates = listOccurrenceDayNumbers(close, '2025-01-01', '2027-01-01');
    const times = listOccurrenceEpochMs(nyTimes, ms(FROM), ms(TO));
    const fri = listOccurrenceDayNumbers(fridays, '2025-01-01', '2027-01-01');
    expect(vevents).toHaveLength(dates.length + times.length + fri.length);
    const closeBack = vevents.slice(0, dates.length).map((v) => listOccurrenceDayNumbers(parseRecurrenceRule(recurrenceLines(v)), '2025-01-01', '2027-01-01')[0]);
    expect(closeBack.map((d) => formatPlainDate(d!))).toEqual(dates.map(formatPlainDate));
    // Every 20th timed event (the rest have the same shape), to keep the test short.
    const sample = (xs: readonly unknown[]) => xs.filter((_, k) => k % 20 === 0);
    const timesBack = sample(vevents.slice(dates.length, dates.length + times.length)).map((v) => Array.from(iterateOccurrenceEpochMs(parseRecurrenceRule(recurrenceLines(v as string[])), 0, { limit: 1 }))[0]);
    expect(timesBack).toEqual(sample(times));
    expect(new Set(vevents.map((v) => v.find((l) => l.startsWith('UID:')))).size).toBe(vevents.length);
  });
});

describe('the validator rejects broken files, each naming the rule it breaks', () => {
  const good = formatCalendar(events, { stamp: '2025-01-01T00:00:00Z', from: FROM, to: TO });
  const cases: [string, string, string][] = [
    ['LF line ends', good.replace(/\r\n/g, '\n'), '3.1'],
    ['a line over 75 octets', good.replace('UID:standup@otterbrook.example', `UID:${'x'.repeat(80)}`), '75 octets'],
    ['a continuation with nothing to continue', ` BEGIN:VCALENDAR\r\n${good}`, 'continuation'],
    ['no colon', good.replace('VERSION:2.0', 'VERSION 2.0'), '3.1 contentline'],
    ['a missing END', good.replace('END:VCALENDAR\r\n', ''), 'not closed'],
    ['no PRODID', good.replace(/PRODID:[^\r]*\r\n/, ''), 'lacks PRODID'],
    ['no UID', good.replace('UID:payroll@otterbrook.example\r\n', ''), 'lacks UID'],
    ['a bad UTC offset', good.replace(/TZOFFSETTO:-0400/, 'TZOFFSETTO:-4'), '3.3.14'],
    ['a -0000 offset', good.replace(/TZOFFSETTO:-0400/, 'TZOFFSETTO:-0000'), '3.3.14'],
    ['a bad DATE-TIME', good.replace('DTSTAMP:20250101T000000Z', 'DTSTAMP:20251301T000000Z'), '3.3.5'],
    ['a DTSTAMP not in UTC', good.replace('DTSTAMP:20250101T000000Z', 'DTSTAMP:20250101T000000'), '3.8.7.2'],
    ['an unescaped comma in TEXT', good.replace('SUMMARY:Payroll run', 'SUMMARY:Payroll, run'), '3.3.11'],
    ['a bad escape in TEXT', good.replace('SUMMARY:Payroll run', 'SUMMARY:Payroll \\x run'), '3.3.11'],
    ['COUNT with UNTIL', good.replace('RRULE:FREQ=WEEKLY;INTERVAL=2', 'RRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=2;UNTIL=20250101'), 'COUNT and UNTIL'],
    ['a VTIMEZONE without parts', good.replace(/BEGIN:VTIMEZONE\r\nTZID:America\/New_York\r\n[\s\S]*?END:VTIMEZONE/, 'BEGIN:VTIMEZONE\r\nTZID:America/New_York\r\nEND:VTIMEZONE'), '3.6.5'],
    ['a VEVENT outside VCALENDAR', `${good}BEGIN:VEVENT\r\nUID:x\r\nDTSTAMP:20250101T000000Z\r\nDTSTART:20250101T000000Z\r\nEND:VEVENT\r\n`, 'inside VCALENDAR'],
    ['VERSION 3.0', good.replace('VERSION:2.0', 'VERSION:3.0'), '3.7.4'],
  ];
  for (const [what, text, rule] of cases) {
    it(what, () => {
      expect(text).not.toBe(good);
      expect(validateCalendar(text).join('\n')).toContain(rule);
    });
  }
});

describe('VTIMEZONE parts, expanded by our own engine, reproduce the zone (RFC 5545 section 3.6.5)', () => {
  for (const zone of ['America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'Asia/Kolkata']) {
    it(zone, () => {
      const rule = parseRecurrenceRule(`DTSTART;TZID=${zone}:20250101T120000\nRRULE:FREQ=DAILY;INTERVAL=10`);
      const from = ms('2020-01-01T00:00Z');
      const to = ms('2031-01-01T00:00Z');
      const text = formatCalendar([{ rule, summary: 'x', uid: 'x' }], { stamp: FROM, from, to });
      expect(validateCalendar(text)).toEqual([]);
      const onsets: [number, number][] = [];
      for (const part of [...components(text, 'STANDARD'), ...components(text, 'DAYLIGHT')]) {
        const offset = (name: string) => {
          const m = /^([+-])(\d\d)(\d\d)(\d\d)?$/.exec(part.find((l) => l.startsWith(`${name}:`))!.slice(name.length + 1))!;
          return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 3600 + Number(m[3]) * 60 + Number(m[4] ?? 0));
        };
        // Onsets are local times at TZOFFSETFROM: read them floating (as UTC) and take the offset off.
        const expanded = Array.from(iterateOccurrenceEpochMs(parseRecurrenceRule(recurrenceLines(part)), -8.64e15, { limit: 10_000 }));
        for (const wall of expanded) onsets.push([wall - offset('TZOFFSETFROM') * 1000, offset('TZOFFSETTO')]);
      }
      onsets.sort((a, b) => a[0] - b[0]);
      const inSpan = onsets.filter(([t]) => t >= from);
      expect(inSpan.map(([t, o]) => [t, o])).toEqual(listTransitions(zone, from, to).map((t) => [t.epochMs, t.offsetAfterSeconds]));
      // The offset in force at the start of the span, and after every onset, as IANA tz data via Intl says.
      const tzOffset = (t: number) => Temporal.Instant.fromEpochMilliseconds(t).toZonedDateTimeISO(zone).offsetNanoseconds / 1e9;
      expect(onsets.filter(([t]) => t <= from).at(-1)?.[1] ?? onsets[0]![1]).toBe(tzOffset(from));
      for (const [t, o] of inSpan) expect(o).toBe(tzOffset(t));
      if (zone === 'Asia/Kolkata') expect(inSpan).toHaveLength(0);
      else expect(inSpan.length).toBeGreaterThanOrEqual(20);
    });
  }
});

describe('formatCalendar: a list of dates (the payment dates of a finance schedule)', () => {
  it('rule form: one VEVENT with DTSTART and RDATE; occurrences form: one per date; both read back', async () => {
    const { defineSchedule } = await import('../../src/index.js');
    const schedule = defineSchedule({ start: '2025-01-15', end: '2026-01-15', step: { months: 3 } } as never);
    const dates = schedule.periods.map((p) => p.adjustedEnd);
    const event = { dates, summary: 'Coupon', uid: 'coupon@otterbrook.example' };
    const ruleForm = formatCalendar([event], { stamp: FROM, from: FROM, to: TO });
    expect(validateCalendar(ruleForm)).toEqual([]);
    const [v] = components(ruleForm, 'VEVENT');
    expect(listOccurrenceDayNumbers(parseRecurrenceRule(recurrenceLines(v!)), '2025-01-01', '2027-01-01')).toEqual(dates);
    // Quarterly from 2025-01-15 to 2026-01-15: April, July, October, January (Temporal month arithmetic).
    expect(dates.map(formatPlainDate)).toEqual([1, 2, 3, 4].map((k) => Temporal.PlainDate.from('2025-01-15').add({ months: 3 * k }).toString()));
    const each = formatCalendar([event], { stamp: FROM, from: FROM, to: '2026-01-01T00:00:00Z', form: 'occurrences' });
    expect(validateCalendar(each)).toEqual([]);
    expect(components(each, 'VEVENT')).toHaveLength(3);
  });

  it('folds at 75 octets without splitting a character (RFC 5545 section 3.1)', () => {
    const text = formatCalendar([{ dates: [20_000], summary: '🦦é'.repeat(40), uid: 'u' }], { stamp: FROM, from: FROM, to: TO });
    for (const line of text.split('\r\n')) {
      expect(new TextEncoder().encode(line).length).toBeLessThanOrEqual(75);
      expect(line).not.toMatch(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/);
    }
    expect(text.replace(/\r\n /g, '')).toContain(`SUMMARY:${'🦦é'.repeat(40)}`);
  });
});

describe('formatCalendar: a native rule keeps its own start and count', () => {
  it('a counted rule starting before the span is written from its start, so COUNT means the same', () => {
    const rule = defineRule({ kind: 'monthly', on: { day: 10 }, start: '2024-11-01', count: 5 });
    const text = formatCalendar([{ rule, summary: 'x', uid: 'x' }], { stamp: FROM, from: FROM, to: TO });
    expect(validateCalendar(text)).toEqual([]);
    const [v] = components(text, 'VEVENT');
    const back = parseRecurrenceRule(recurrenceLines(v!));
    expect(listOccurrenceDayNumbers(back, '2024-01-01', '2027-01-01')).toEqual(listOccurrenceDayNumbers(rule, '2024-01-01', '2027-01-01'));
    // 2024-11-10, 2024-12-10, 2025-01-10, 2025-02-10, 2025-03-10: five months from November (count 5).
    expect(listOccurrenceDayNumbers(back, '2024-01-01', '2027-01-01').map(formatPlainDate).at(-1)).toBe('2025-03-10');
  });
});

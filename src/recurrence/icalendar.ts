/**
 * iCalendar out (RFC 5545): `formatCalendar` writes rules as a VCALENDAR object, either as VEVENTs that carry
 * the rule (DTSTART, RRULE, RDATE, EXDATE) or as one VEVENT per occurrence in a range, with a VTIMEZONE per zone
 * used (section 3.6.5), built from the compiled zone's transitions over the range. Lines end in CRLF and are
 * folded at 75 octets of UTF-8 (section 3.1); TEXT values are escaped (section 3.3.11).
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { isRecord, readOptions, requireDayNumberArgument, requireEnum } from '../diagnostics/index.js';
import { listTransitions, offsetSecondsFromEpochMs } from '../zone/index.js';
import { MS_PER_DAY } from '../bounds.js';
import { compiledOf } from './generate.js';
import { listOccurrenceDayNumbers, listOccurrenceEpochMs } from './occurrences.js';
import { foldContentLine, formatRecurrenceRule } from './rfc5545.js';
import { formatInstant, formatPlainDate, formatPlainDateTime, toEpochMs } from './deps.js';
import type { Rule } from './types.js';

/**
 * One event of a calendar: a rule (or a list of dates, such as the payment dates of a `defineSchedule` schedule),
 * its title, and a unique id.
 */
export interface CalendarEvent {
  /** The rule whose occurrences the event has (from `defineRule`, `parseRecurrenceRule` or `ruleOfProfile`). */
  readonly rule?: Rule;
  /** Instead of a rule: the event's dates as day numbers (e.g. `schedule.periods.map((p) => p.adjustedEnd)`). */
  readonly dates?: readonly number[];
  /** SUMMARY: the event's title. */
  readonly summary: string;
  /** UID: unique and stable across versions of the file, so that a subscribed calendar updates in place. */
  readonly uid: string;
  /** DESCRIPTION, optional. */
  readonly description?: string;
}

/** Options of {@link formatCalendar}. */
export interface FormatCalendarOptions {
  /** DTSTAMP of every event: when the file was made (an instant, RFC 3339). Required: the function reads no clock. */
  readonly stamp: unknown;
  /** The instants the calendar covers, [from, to): the VTIMEZONEs' observances, and the occurrences listed. */
  readonly from: unknown;
  /** The end of the span, exclusive: an instant in any form `toEpochMs` takes, not before `from`. */
  readonly to: unknown;
  /** `'rule'` (default): each event carries its rule (RRULE); `'occurrences'`: one VEVENT per occurrence in range. */
  readonly form?: 'rule' | 'occurrences';
  /** PRODID: who made the file (default `-//kalends//kalends//EN`). */
  readonly productId?: string;
}

/** Escapes a TEXT value (RFC 5545 section 3.3.11): backslash, semicolon, comma and line breaks. */
function escapeText(s: string): string {
  return s.replace(/\\/g, '\\\\').replace(/;/g, '\\;').replace(/,/g, '\\,').replace(/\r\n|\r|\n/g, '\\n');
}

/** `+HHMM[SS]` (RFC 5545 section 3.3.14 UTC-OFFSET) of an offset in seconds. */
function utcOffset(seconds: number): string {
  const sign = seconds < 0 ? '-' : '+';
  const a = Math.abs(seconds);
  const hh = String(Math.floor(a / 3600)).padStart(2, '0');
  const mm = String(Math.floor((a % 3600) / 60)).padStart(2, '0');
  const ss = a % 60;
  return `${sign}${hh}${mm}${ss === 0 ? '' : String(ss).padStart(2, '0')}`;
}

/** DATE-TIME text `YYYYMMDDTHHMMSS` of a wall time in ms. */
function compactWall(wallMs: number): string {
  return formatPlainDateTime(wallMs).slice(0, 19).replace(/[-:]/g, '');
}

function requireText(path: string, v: unknown): string {
  if (typeof v !== 'string' || v === '') throw new KalendsTypeError(`${path}: expected a non-empty string, got ${describeValue(v)}`, { code: 'invalid-type', received: v });
  return v;
}

/**
 * The VTIMEZONE of `zone` over [from, to) (RFC 5545 section 3.6.5): one STANDARD or DAYLIGHT part per pair of
 * offsets, its first onset as DTSTART and the later ones as RDATE, each onset in the local time before the change
 * (TZOFFSETFROM). The offset in force at `from` is the part whose onset is the last change before it (or, for a
 * zone with no change at all, a STANDARD part at `from`). A change to a larger offset is a DAYLIGHT part.
 */
function timezoneLines(zone: string, from: number, to: number): string[] {
  const changes = listTransitions(zone, from, to);
  // The change in force at `from`: search back a year at a time (at most 200 years).
  let before: { epochMs: number; offsetBeforeSeconds: number; offsetAfterSeconds: number } | undefined;
  for (let back = 1; back <= 200 && !before; back++) {
    const earlier = listTransitions(zone, from - back * 366 * MS_PER_DAY, from - (back - 1) * 366 * MS_PER_DAY);
    before = earlier[earlier.length - 1];
  }
  const all = before ? [before, ...changes] : changes;
  const lines = ['BEGIN:VTIMEZONE', `TZID:${zone}`];
  if (all.length === 0) {
    const seconds = offsetSecondsFromEpochMs(zone, from);
    const off = utcOffset(seconds);
    lines.push('BEGIN:STANDARD', `DTSTART:${compactWall(from + seconds * 1000)}`, `TZOFFSETFROM:${off}`, `TZOFFSETTO:${off}`, 'END:STANDARD');
  }
  const groups = new Map<string, number[]>();
  for (const t of all) {
    const key = `${t.offsetBeforeSeconds}/${t.offsetAfterSeconds}`;
    const local = t.epochMs + t.offsetBeforeSeconds * 1000;
    const list = groups.get(key);
    if (list) list.push(local);
    else groups.set(key, [local]);
  }
  for (const [key, onsets] of groups) {
    const [fromOff, toOff] = key.split('/').map(Number) as [number, number];
    const part = toOff > fromOff ? 'DAYLIGHT' : 'STANDARD';
    lines.push(`BEGIN:${part}`, `DTSTART:${compactWall(onsets[0]!)}`);
    if (onsets.length > 1) lines.push(`RDATE:${onsets.slice(1).map(compactWall).join(',')}`);
    lines.push(`TZOFFSETFROM:${utcOffset(fromOff)}`, `TZOFFSETTO:${utcOffset(toOff)}`, `END:${part}`);
  }
  lines.push('END:VTIMEZONE');
  return lines;
}

/** Sorted, distinct day numbers of an event's `dates`, or a typed error naming the path. */
function datesOf(v: unknown, path: string): number[] {
  if (!Array.isArray(v) || v.length === 0) {
    throw new KalendsTypeError(`${path}: expected a rule or a non-empty list of dates (day numbers), got dates ${describeValue(v)}`, { code: 'invalid-type', received: v });
  }
  const days = v.map((d, k) => requireDayNumberArgument(`${path}.dates[${k}]`, d));
  days.sort((a, b) => a - b);
  return days.filter((d, k) => k === 0 || d !== days[k - 1]);
}

/** An instant option, with its name in the error. */
function instantOption(path: string, v: unknown): number {
  try {
    return toEpochMs(v);
  } catch (e) {
    throw new KalendsTypeError(`${path}: expected an instant (RFC 3339 text or epoch milliseconds), got ${describeValue(v)}; ${(e as Error).message}`, {
      code: 'invalid-type',
      received: v,
    });
  }
}

/**
 * Writes rules (or lists of dates, such as a schedule's payment dates) as an RFC 5545 iCalendar object (a
 * VCALENDAR), ready to save as a `.ics` file or to serve for subscription. An event of `dates` is one VEVENT with
 * DTSTART and RDATE in the rule form, and one VEVENT per date in [from, to) in the occurrences form. With `form: 'rule'` each event carries its rule as DTSTART, RRULE, RDATE and EXDATE (a rule
 * with no RFC 5545 form, such as one on business days, is a `KalendsRangeError` `'unsupported'`: use
 * `'occurrences'`); with `form: 'occurrences'` each occurrence in [from, to) is its own VEVENT (UID
 * `uid/date`). Occurrences of dates are all-day events (DTSTART;VALUE=DATE); instants carry a TZID and a
 * VTIMEZONE for each zone used, whose STANDARD and DAYLIGHT parts cover [from, to). Lines end in CRLF and fold at
 * 75 octets of UTF-8; SUMMARY and DESCRIPTION are escaped TEXT.
 *
 * @example
 * ```ts
 * const close = defineRule({ kind: 'monthly', on: { day: 'last' }, start: '2025-01-01' });
 * formatCalendar([{ rule: close, summary: 'Month-end close', uid: 'close@example.com' }], {
 *   stamp: '2025-01-01T00:00:00Z', from: '2025-01-01T00:00:00Z', to: '2026-01-01T00:00:00Z', form: 'occurrences',
 * }).split('\r\n').filter((l) => l.startsWith('DTSTART')).length; // 12
 * ```
 */
export function formatCalendar(events: readonly CalendarEvent[], options: FormatCalendarOptions): string {
  if (!Array.isArray(events)) throw new KalendsTypeError(`events: expected a list of { rule, summary, uid }, got ${describeValue(events)}`, { code: 'invalid-type', received: events });
  const o = readOptions('options', options, ['stamp', 'from', 'to', 'form', 'productId']);
  const stamp = formatInstant(instantOption('options.stamp', o['stamp'])).replace(/[-:]/g, '').replace(/\.\d+/, '');
  const from = instantOption('options.from', o['from']);
  const to = instantOption('options.to', o['to']);
  if (to < from) {
    throw new KalendsRangeError(`options.to: expected an instant on or after options.from (${formatInstant(from)}), got ${formatInstant(to)}; swap the two`, {
      code: 'out-of-range',
      received: o['to'],
    });
  }
  const form = requireEnum<'rule' | 'occurrences'>('options.form', o['form'], ['rule', 'occurrences'], 'rule');
  const productId = o['productId'] === undefined ? '-//kalends//kalends//EN' : requireText('options.productId', o['productId']);
  const zones = new Set<string>();
  const body: string[] = [];
  events.forEach((e, i) => {
    if (!isRecord(e)) throw new KalendsTypeError(`events[${i}]: expected { rule, summary, uid }, got ${describeValue(e)}`, { code: 'invalid-type', received: e });
    const summary = requireText(`events[${i}].summary`, e.summary);
    const uid = requireText(`events[${i}].uid`, e.uid);
    const description = e.description === undefined ? undefined : requireText(`events[${i}].description`, e.description);
    const head = (id: string): string[] => {
      const l = ['BEGIN:VEVENT', `UID:${escapeText(id)}`, `DTSTAMP:${stamp}`, `SUMMARY:${escapeText(summary)}`];
      if (description !== undefined) l.push(`DESCRIPTION:${escapeText(description)}`);
      return l;
    };
    if (e.rule === undefined) {
      const days = datesOf(e.dates, `events[${i}]`);
      const values = days.map((d) => formatPlainDate(d).replace(/-/g, ''));
      if (form === 'rule') {
        body.push(...head(uid), `DTSTART;VALUE=DATE:${values[0]}`);
        if (values.length > 1) body.push(`RDATE;VALUE=DATE:${values.slice(1).join(',')}`);
        body.push('END:VEVENT');
      } else {
        days.forEach((d, k) => {
          if (d >= Math.floor(from / MS_PER_DAY) && d < Math.ceil(to / MS_PER_DAY)) body.push(...head(`${uid}/${values[k]}`), `DTSTART;VALUE=DATE:${values[k]}`, 'END:VEVENT');
        });
      }
      return;
    }
    const c = compiledOf(e.rule, `events[${i}].rule`);
    const rule = e.rule as Rule;
    const zone = c.values === 'instants' && c.zone && c.zone.id !== 'UTC' ? c.zone.id : undefined;
    if (zone) zones.add(zone);
    if (form === 'rule') {
      // A rule with its own start or anchor keeps it (its COUNT counts from there); one without starts at `from`.
      const d = rule.definition as unknown as Record<string, unknown>;
      const own = d['start'] !== undefined || d['anchor'] !== undefined;
      let text: string;
      try {
        text = formatRecurrenceRule(rule, own ? undefined : { start: c.values === 'dates' ? formatPlainDate(Math.floor(from / MS_PER_DAY)) : formatInstant(from) });
      } catch (err) {
        // A rule with no RFC 5545 form: the message names the event that holds it, and the way out.
        if (err instanceof KalendsRangeError && err.code === 'unsupported') {
          throw new KalendsRangeError(`events[${i}].${err.message}; or write this calendar with options.form "occurrences"`, { code: 'unsupported', received: err.received });
        }
        throw err;
      }
      body.push(...head(uid), ...text.replace(/\n /g, '').split('\n'), 'END:VEVENT');
      return;
    }
    if (c.values === 'dates') {
      for (const d of listOccurrenceDayNumbers(rule, Math.floor(from / MS_PER_DAY), Math.ceil(to / MS_PER_DAY))) {
        const v = formatPlainDate(d).replace(/-/g, '');
        body.push(...head(`${uid}/${v}`), `DTSTART;VALUE=DATE:${v}`, 'END:VEVENT');
      }
    } else {
      for (const t of listOccurrenceEpochMs(rule, from, to)) {
        const wall = zone ? compactWall(t + c.zone!.offsetSecondsFromEpochMs(t) * 1000) : `${compactWall(t)}Z`;
        body.push(...head(`${uid}/${compactWall(t)}Z`), zone ? `DTSTART;TZID=${zone}:${wall}` : `DTSTART:${wall}`, 'END:VEVENT');
      }
    }
  });
  const lines = ['BEGIN:VCALENDAR', 'VERSION:2.0', `PRODID:${escapeText(productId)}`, 'CALSCALE:GREGORIAN'];
  for (const z of [...zones].sort()) lines.push(...timezoneLines(z, from, to));
  lines.push(...body, 'END:VCALENDAR');
  return `${lines.map((l) => foldContentLine(l, '\r\n')).join('\r\n')}\r\n`;
}

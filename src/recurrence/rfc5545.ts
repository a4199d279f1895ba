/**
 * RFC 5545 text: `parseRecurrenceRule` reads a recurrence rule (DTSTART, one or more RRULE lines, RDATE and
 * EXDATE lines) into an `rfc5545` rule definition; `formatRecurrenceRule` writes a rule back as text. Supported
 * parts: every part of section 3.3.10 (FREQ from SECONDLY to YEARLY, INTERVAL, COUNT, UNTIL, BYSECOND, BYMINUTE,
 * BYHOUR, BYDAY with ordinals, BYMONTHDAY, BYYEARDAY, BYWEEKNO, BYMONTH, BYSETPOS, WKST); DTSTART with
 * VALUE=DATE or TZID. EXRULE (removed by RFC 5545, Appendix A), RDATE;VALUE=PERIOD and RFC 7529 RSCALE/SKIP give
 * a `KalendsSyntaxError` with code `'unsupported'` that names the part.
 *
 * @module
 */
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { lookupName, readOptions, requireEnum } from '../diagnostics/index.js';
import { MAX_COUNT, MAX_DAY_NUMBER, MAX_EPOCH_MS, MAX_RFC5545_INTERVAL } from '../bounds.js';
import { dayCountOfMonthUnchecked, packedYmdUnchecked } from '../civil/gregorian.js';
import { WEEKDAY_NAMES, dayCountOfMonthIndex, dayOfPacked, monthIndexOfPacked, weekdayFromName } from '../civil/names.js';
import { defineRule, compiledOf, firstAtOrAfter } from './generate.js';
import { resolveWall } from './engine-instants.js';
import { valueOf } from './occurrences.js';
import { formatInstant, formatPlainDate, formatPlainDateTime, parsePlainDateTime, toDayNumber, toEpochMs } from './deps.js';
import type { Rfc5545Frequency, Rfc5545RuleDefinition, Rfc5545RuleParts, Rfc5545WeekdayNum, Rule, WeekdayName } from './types.js';

const WEEKDAY_CODES = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'] as const;

function syntax(message: string, text: string, position: number, code: 'malformed' | 'unsupported' | 'out-of-range' = 'malformed'): KalendsSyntaxError {
  return new KalendsSyntaxError(`text: ${message} (at position ${position})`, { code, received: text, position });
}

/** Options of {@link parseRecurrenceRule}. */
export interface ParseRecurrenceOptions {
  /** DTSTART for text that is only a rule (`FREQ=...`): a date or a local date-time, ISO 8601. */
  readonly start?: string;
  /** Zone for a floating DTSTART (a local time without TZID); without it, floating times are read as UTC. */
  readonly zone?: string;
}

interface Line {
  readonly name: string;
  readonly params: ReadonlyMap<string, string>;
  readonly value: string;
  readonly at: number;
  readonly valueAt: number;
}

/** Unfolds content lines (RFC 5545 section 3.1: a line break followed by a space or tab continues the line). */
function contentLines(text: string): Line[] {
  const lines: { text: string; at: number }[] = [];
  let at = 0;
  for (const raw of text.split(/\r?\n/)) {
    if ((raw.startsWith(' ') || raw.startsWith('\t')) && lines.length > 0) {
      lines[lines.length - 1]!.text += raw.slice(1);
    } else if (raw.trim() !== '') {
      lines.push({ text: raw.trim(), at });
    }
    at += raw.length + 1;
  }
  return lines.map(({ text: l, at: start }) => {
    if (/^FREQ=/i.test(l)) return { name: 'RRULE', params: new Map(), value: l, at: start, valueAt: start };
    const colon = l.indexOf(':');
    if (colon < 0) throw syntax(`expected a content line NAME[;PARAM=VALUE]:VALUE or a rule FREQ=..., got ${describeValue(l)}`, text, start);
    const head = l.slice(0, colon).split(';');
    const params = new Map<string, string>();
    for (const p of head.slice(1)) {
      const eq = p.indexOf('=');
      if (eq <= 0) throw syntax(`expected a parameter NAME=VALUE, got ${describeValue(p)}`, text, start);
      params.set(p.slice(0, eq).toUpperCase(), p.slice(eq + 1).replace(/^"(.*)"$/, '$1'));
    }
    return { name: head[0]!.toUpperCase(), params, value: l.slice(colon + 1), at: start, valueAt: start + colon + 1 };
  });
}

/**
 * Reads a DATE (`19970902`) or DATE-TIME (`19970902T090000`, optional `Z`) value into ISO text. Fields out of
 * range are a syntax error that quotes the value as written and points at it in the text.
 */
function readDateValue(value: string, text: string, at: number, part: string): { iso: string; utc: boolean; dated: boolean } {
  const m = /^(\d{4})(\d{2})(\d{2})(?:T(\d{2})(\d{2})(\d{2})(Z)?)?$/.exec(value);
  if (!m) throw syntax(`${part}: expected a DATE (YYYYMMDD) or DATE-TIME (YYYYMMDDTHHMMSS, optional Z) value, got ${describeValue(value)}`, text, at);
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const outOfRange = (what: string, offset: number): KalendsSyntaxError =>
    syntax(`${part}: ${describeValue(value)} ${what}`, text, at + offset, 'out-of-range');
  if (month < 1 || month > 12) throw outOfRange(`has month ${m[2]}; expected 01 to 12`, 4);
  const days = dayCountOfMonthUnchecked(year, month);
  if (day < 1 || day > days) throw outOfRange(`has day ${m[3]}, but ${m[1]}-${m[2]} has days 01 to ${days}`, 6);
  if (m[4] !== undefined) {
    if (Number(m[4]) > 23) throw outOfRange(`has hour ${m[4]}; expected 00 to 23`, 9);
    if (Number(m[5]) > 59) throw outOfRange(`has minute ${m[5]}; expected 00 to 59`, 11);
    if (Number(m[6]) > 60) throw outOfRange(`has second ${m[6]}; expected 00 to 60`, 13);
  }
  const date = `${m[1]}-${m[2]}-${m[3]}`;
  if (m[4] === undefined) return { iso: date, utc: false, dated: true };
  const second = m[6] === '60' ? '59' : m[6]; // RFC 5545 section 3.3.5: without leap seconds, read 60 as 59
  return { iso: `${date}T${m[4]}:${m[5]}:${second}${m[7] ? 'Z' : ''}`, utc: m[7] !== undefined, dated: false };
}

function readIntList(value: string, part: string, min: number, max: number, signed: boolean, text: string, at: number): number[] {
  return value.split(',').map((x) => {
    const ok = signed ? /^[+-]?\d{1,3}$/.test(x) : /^\d{1,2}$/.test(x);
    const n = Number(x);
    if (!ok || !(Math.abs(n) >= min && Math.abs(n) <= max) || (!signed && n < 0)) {
      throw syntax(`${part}: expected integers from ${min} to ${max}${signed ? ` or -${max} to -${min}` : ''}, got ${describeValue(x)}`, text, at);
    }
    return n;
  });
}

function readWeekdayCode(code: string, part: string, text: string, at: number): WeekdayName {
  const i = WEEKDAY_CODES.indexOf(code.toUpperCase() as (typeof WEEKDAY_CODES)[number]);
  if (i < 0) throw syntax(`${part}: expected a weekday SU, MO, TU, WE, TH, FR or SA, got ${describeValue(code)}`, text, at);
  return WEEKDAY_NAMES[i]!;
}

const UNSUPPORTED_PARTS: Record<string, string> = {
  RSCALE: 'RSCALE (RFC 7529, non-Gregorian calendars) is not supported',
  SKIP: 'SKIP (RFC 7529) is not supported',
};

/**
 * Parses RFC 5545 recurrence text into a rule: an RRULE line with its DTSTART line (and optional EXDATE lines),
 * or a bare rule `FREQ=...` with `options.start`. The result expands like any other rule: dates for a DATE
 * DTSTART, instants for a DATE-TIME one (in its TZID zone; `Z` is UTC; a floating time uses `options.zone` or
 * UTC). Grammar faults give a `KalendsSyntaxError` (`'malformed'`); parts outside the supported subset give one
 * with code `'unsupported'` naming the part; a rule the RFC forbids (BYWEEKNO with FREQ=MONTHLY) or one that
 * can never produce a date gives a `DefinitionError`.
 *
 * @example
 * ```ts
 * const rule = parseRecurrenceRule('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY;COUNT=10');
 * listOccurrenceEpochMs(rule, '1997-09-01T00:00Z', '1997-10-01T00:00Z').length; // 10
 * ```
 */
export function parseRecurrenceRule(text: string, options?: ParseRecurrenceOptions): Rule {
  if (typeof text !== 'string') {
    throw new KalendsTypeError(`text: expected RFC 5545 text (DTSTART and RRULE lines, or FREQ=...), got ${describeValue(text)}`, { code: 'invalid-type', received: text });
  }
  const o = readOptions('options', options, ['start', 'zone']);
  const givenStart = optionalText('options.start', o['start']);
  const givenZone = optionalText('options.zone', o['zone']);
  let dtstart: { iso: string; utc: boolean; dated: boolean; tzid: string | undefined } | undefined;
  const rrules: Line[] = [];
  const exdates: string[] = [];
  const rdates: string[] = [];
  for (const line of contentLines(text)) {
    switch (line.name) {
      case 'DTSTART': {
        if (dtstart) throw syntax('DTSTART occurs more than once', text, line.at);
        const v = readDateValue(line.value, text, line.valueAt, 'DTSTART');
        const valueType = line.params.get('VALUE');
        if (valueType === 'DATE' && !v.dated) throw syntax('DTSTART;VALUE=DATE needs a DATE value (YYYYMMDD)', text, line.valueAt);
        const tzid = line.params.get('TZID');
        if (tzid !== undefined && v.utc) throw syntax('a DTSTART in UTC (ending in Z) must not have a TZID (RFC 5545 section 3.3.5)', text, line.at);
        dtstart = { ...v, tzid };
        break;
      }
      case 'RRULE':
        // Several RRULEs: RFC 5545 section 3.8.5.3 joins their sets (Appendix A deprecates this; we read it).
        rrules.push(line);
        break;
      case 'EXDATE':
      case 'RDATE': {
        if (line.params.get('VALUE') === 'PERIOD') throw syntax('RDATE;VALUE=PERIOD is not supported: list the start of each period as a DATE-TIME', text, line.at, 'unsupported');
        let partAt = line.valueAt;
        for (const part of line.value.split(',')) {
          (line.name === 'EXDATE' ? exdates : rdates).push(readDateValue(part, text, partAt, line.name).iso);
          partAt += part.length + 1;
        }
        break;
      }
      case 'EXRULE':
        throw syntax('EXRULE is not supported: RFC 5545 removed it (Appendix A); list the excluded values in EXDATE', text, line.at, 'unsupported');
      default:
        throw syntax(`${line.name} is not part of a recurrence rule: only DTSTART, RRULE, RDATE and EXDATE are read`, text, line.at, 'unsupported');
    }
  }
  if (rrules.length === 0 && rdates.length === 0 && !dtstart) throw syntax('expected an RRULE line (or a rule starting with FREQ=), or DTSTART with RDATE lines', text, 0);
  if (!dtstart && givenStart !== undefined) {
    dtstart = { iso: givenStart, utc: false, dated: !givenStart.includes('T'), tzid: undefined };
  }
  if (!dtstart) throw syntax('expected a DTSTART line (or options.start): the rule takes its first occurrence and missing parts from it', text, 0);

  // Without an RRULE the set is DTSTART and any RDATE values (section 3.8.5.3): a rule of DTSTART alone.
  const first = rrules.length > 0 ? readRuleParts(rrules[0]!, text) : { frequency: 'yearly', count: 1 };
  const def: Record<string, unknown> = { kind: 'rfc5545', ...first };
  if (rrules.length > 1) def['additionalRules'] = rrules.slice(1).map((line) => readRuleParts(line, text));
  def['start'] = dtstart.iso.replace(/Z$/, '');
  if (dtstart.utc) def['zone'] = 'UTC';
  else if (dtstart.tzid !== undefined) def['zone'] = dtstart.tzid;
  else if (!dtstart.dated && givenZone !== undefined) def['zone'] = givenZone;
  if (exdates.length > 0) def['exclude'] = exdates.map((x) => x.replace(/Z$/, ''));
  if (rdates.length > 0) def['include'] = rdates.map((x) => x.replace(/Z$/, ''));
  return defineRule(def as unknown as Rfc5545RuleDefinition);
}

/** The parts of one RRULE value (RFC 5545 section 3.3.10), in our spelling. */
function readRuleParts(rrule: Line, text: string): Record<string, unknown> {
  const def: Record<string, unknown> = {};
  const seen = new Set<string>();
  let at = rrule.valueAt;
  for (const part of rrule.value.split(';')) {
    const eq = part.indexOf('=');
    if (eq <= 0) throw syntax(`expected a rule part NAME=VALUE, got ${describeValue(part)}`, text, at);
    const name = part.slice(0, eq).toUpperCase();
    const value = part.slice(eq + 1);
    if (seen.has(name)) throw syntax(`${name} occurs more than once (RFC 5545 section 3.3.10)`, text, at);
    seen.add(name);
    const unsupported = lookupName(UNSUPPORTED_PARTS, name);
    if (unsupported) throw syntax(unsupported, text, at, 'unsupported');
    switch (name) {
      case 'FREQ': {
        const f = value.toUpperCase();
        if (!['YEARLY', 'MONTHLY', 'WEEKLY', 'DAILY', 'HOURLY', 'MINUTELY', 'SECONDLY'].includes(f)) {
          throw syntax(`FREQ: expected SECONDLY, MINUTELY, HOURLY, DAILY, WEEKLY, MONTHLY or YEARLY, got ${describeValue(value)}`, text, at);
        }
        def['frequency'] = f.toLowerCase() as Rfc5545Frequency;
        break;
      }
      case 'INTERVAL':
      case 'COUNT': {
        // RFC 5545 section 3.3.10 gives both as 1*DIGIT with no upper bound; ours are stated in docs/schedules.md.
        const max = name === 'INTERVAL' ? MAX_RFC5545_INTERVAL : MAX_COUNT;
        if (!/^\d+$/.test(value)) throw syntax(`${name}: expected a positive integer, got ${describeValue(value)}`, text, at + eq + 1);
        const n = value.length > 12 ? Number.POSITIVE_INFINITY : Number(value);
        if (n < 1 || n > max) {
          throw syntax(`${name}: expected an integer from 1 to ${max}, got ${describeValue(value)}${n === 0 ? '' : '; use UNTIL for a longer rule'}`, text, at + eq + 1, 'out-of-range');
        }
        def[name === 'INTERVAL' ? 'interval' : 'count'] = n;
        break;
      }
      case 'UNTIL': {
        const v = readDateValue(value, text, at + eq + 1, 'UNTIL');
        def['until'] = v.iso;
        break;
      }
      case 'BYMONTH':
        def['byMonth'] = readIntList(value, name, 1, 12, false, text, at);
        break;
      case 'BYWEEKNO':
        def['byWeekNo'] = readIntList(value, name, 1, 53, true, text, at);
        break;
      case 'BYYEARDAY':
        def['byYearDay'] = readIntList(value, name, 1, 366, true, text, at);
        break;
      case 'BYMONTHDAY':
        def['byMonthDay'] = readIntList(value, name, 1, 31, true, text, at);
        break;
      case 'BYHOUR':
        def['byHour'] = readIntList(value, name, 0, 23, false, text, at);
        break;
      case 'BYMINUTE':
        def['byMinute'] = readIntList(value, name, 0, 59, false, text, at);
        break;
      case 'BYSECOND':
        def['bySecond'] = readIntList(value, name, 0, 60, false, text, at);
        break;
      case 'BYSETPOS':
        def['bySetPos'] = readIntList(value, name, 1, 366, true, text, at);
        break;
      case 'WKST':
        def['weekStart'] = readWeekdayCode(value, name, text, at);
        break;
      case 'BYDAY':
        def['byDay'] = value.split(',').map((x): Rfc5545WeekdayNum => {
          const m = /^([+-]?\d{1,2})?([A-Za-z]{2})$/.exec(x);
          if (!m) throw syntax(`BYDAY: expected entries such as MO, 1FR or -1SU, got ${describeValue(x)}`, text, at);
          const weekday = readWeekdayCode(m[2]!, name, text, at);
          if (m[1] === undefined) return { weekday };
          const nth = Number(m[1]);
          if (nth === 0 || Math.abs(nth) > 53) throw syntax(`BYDAY: expected an ordinal from 1 to 53 or -53 to -1, got ${describeValue(m[1])}`, text, at);
          return { weekday, nth };
        });
        break;
      default:
        throw syntax(`unknown rule part ${describeValue(name)}`, text, at);
    }
    at += part.length + 1;
  }
  if (!seen.has('FREQ')) throw syntax('the FREQ rule part is required (RFC 5545 section 3.3.10)', text, rrule.valueAt);
  if (seen.has('COUNT') && seen.has('UNTIL')) {
    const raw = (n: string): string => JSON.stringify(rrule.value.split(';').find((x) => x.toUpperCase().startsWith(`${n}=`))!.slice(n.length + 1));
    throw syntax(`UNTIL and COUNT must not both occur in one rule (RFC 5545 section 3.3.10), got COUNT=${raw('COUNT')} and UNTIL=${raw('UNTIL')}; keep one of them`, text, rrule.valueAt);
  }
  return def;
}

/** An optional string option. */
function optionalText(name: string, v: unknown): string | undefined {
  if (v === undefined || typeof v === 'string') return v;
  throw new KalendsTypeError(`${name}: expected a string or undefined, got ${describeValue(v)}`, { code: 'invalid-type', received: v });
}

function compact(iso: string): string {
  return iso.replace(/[-:]/g, '').replace(/\.\d+/, '');
}

/** UTF-8 length of the code point starting at `s[i]` (a surrogate pair is one 4-octet character). */
function octetsAt(s: string, i: number): number {
  const c = s.charCodeAt(i);
  return c < 0x80 ? 1 : c < 0x800 ? 2 : c >= 0xd800 && c <= 0xdbff ? 4 : 3;
}

/**
 * @internal Folds a content line into lines of at most 75 octets of UTF-8 (RFC 5545 section 3.1), each
 * continuation starting with a space, never splitting a character. Joined with `newline`.
 */
export function foldContentLine(line: string, newline = '\n'): string {
  const out: string[] = [];
  let start = 0;
  let octets = 0;
  let limit = 75;
  for (let i = 0; i < line.length; ) {
    const n = octetsAt(line, i);
    if (octets + n > limit) {
      out.push(line.slice(start, i));
      start = i;
      octets = 0;
      limit = 74; // a continuation line begins with one space
    }
    octets += n;
    i += n === 4 ? 2 : 1;
  }
  out.push(line.slice(start));
  return out.map((l, i) => (i === 0 ? l : ` ${l}`)).join(newline);
}
const fold = (line: string): string => foldContentLine(line);

function unsupported(what: string): KalendsRangeError {
  return new KalendsRangeError(`rule: ${what} has no RFC 5545 form; list its occurrences instead of writing it as RFC 5545 text`, { code: 'unsupported', received: what });
}

/** Options of {@link formatRecurrenceRule}. */
export interface FormatRecurrenceOptions {
  /** DTSTART for a rule without a start or anchor: the text starts at the first occurrence on or after it. */
  readonly start?: unknown;
  /** Line ending between content lines: `'\n'` (default) or `'\r\n'` as an iCalendar file requires. */
  readonly newline?: '\n' | '\r\n';
}

/**
 * Writes a rule as RFC 5545 text: a DTSTART line, an RRULE line and any EXDATE lines. Rules parsed from text
 * come back in the same meaning; native rules that RFC 5545 can express (every n days, weekly, monthly on days
 * or nth weekdays, quarterly and yearly, intraday in elapsed steps) are translated, starting at their first
 * occurrence on or after their start (or anchor). Business-day selectors, adjustments, fiscal periods and
 * wall-clock intraday steps have no RFC 5545 form: a `KalendsRangeError` with code `'unsupported'` says which.
 *
 * @example
 * ```ts
 * formatRecurrenceRule(defineRule({ kind: 'monthly', on: { weekday: 'friday', nth: -1 }, start: '2025-01-01' }));
 * // 'DTSTART;VALUE=DATE:20250131\nRRULE:FREQ=MONTHLY;BYDAY=-1FR'
 * ```
 */
export function formatRecurrenceRule(rule: Rule, options?: FormatRecurrenceOptions): string {
  const o = readOptions('options', options, ['start', 'newline']);
  const newline = requireEnum<'\n' | '\r\n'>('options.newline', o['newline'], ['\n', '\r\n'], '\n');
  const def = rfcDefinitionOf(rule, o['start']);
  const dated = !def.start.includes('T');
  const lines: string[] = [];
  const startValue = compact(def.start);
  if (dated) lines.push(`DTSTART;VALUE=DATE:${startValue}`);
  else if (def.zone === 'UTC') lines.push(`DTSTART:${startValue}Z`);
  else if (def.zone !== undefined) lines.push(`DTSTART;TZID=${def.zone}:${startValue}`);
  else lines.push(`DTSTART:${startValue}`);
  lines.push(`RRULE:${ruleValue(def)}`);
  for (const more of def.additionalRules ?? []) lines.push(`RRULE:${ruleValue(more)}`);
  const listLine = (name: string, values: readonly string[] | undefined): void => {
    if (!values || values.length === 0) return;
    if (dated) lines.push(`${name};VALUE=DATE:${values.map(compact).join(',')}`);
    else if (def.zone === 'UTC') lines.push(`${name}:${values.map((x) => `${compact(x)}Z`).join(',')}`);
    else if (def.zone !== undefined) lines.push(`${name};TZID=${def.zone}:${values.map(compact).join(',')}`);
    else lines.push(`${name}:${values.map(compact).join(',')}`);
  };
  listLine('RDATE', def.include);
  listLine('EXDATE', def.exclude);
  return lines.map(fold).join(newline);
}

/** The value of an RRULE line (RFC 5545 section 3.3.10 `recur`) for the given parts. */
function ruleValue(def: Rfc5545RuleParts): string {
  const parts = [`FREQ=${def.frequency.toUpperCase()}`];
  if (def.interval !== undefined && def.interval !== 1) parts.push(`INTERVAL=${def.interval}`);
  if (def.count !== undefined) parts.push(`COUNT=${def.count}`);
  if (def.until !== undefined) parts.push(`UNTIL=${compact(def.until)}`);
  if (def.byMonth) parts.push(`BYMONTH=${def.byMonth.join(',')}`);
  if (def.byWeekNo) parts.push(`BYWEEKNO=${def.byWeekNo.join(',')}`);
  if (def.byYearDay) parts.push(`BYYEARDAY=${def.byYearDay.join(',')}`);
  if (def.byMonthDay) parts.push(`BYMONTHDAY=${def.byMonthDay.join(',')}`);
  if (def.byDay) parts.push(`BYDAY=${def.byDay.map((e) => `${e.nth ?? ''}${WEEKDAY_CODES[weekdayFromName(e.weekday) - 1]}`).join(',')}`);
  if (def.byHour) parts.push(`BYHOUR=${def.byHour.join(',')}`);
  if (def.byMinute) parts.push(`BYMINUTE=${def.byMinute.join(',')}`);
  if (def.bySecond) parts.push(`BYSECOND=${def.bySecond.join(',')}`);
  if (def.bySetPos) parts.push(`BYSETPOS=${def.bySetPos.join(',')}`);
  if (def.weekStart !== undefined && def.weekStart !== 'monday') parts.push(`WKST=${WEEKDAY_CODES[weekdayFromName(def.weekStart) - 1]}`);
  return parts.join(';');
}

function weekdayName(v: unknown): WeekdayName {
  return typeof v === 'number' ? WEEKDAY_NAMES[v - 1]! : (v as WeekdayName);
}

/**
 * @internal The RFC 5545 definition that expands like `rule` from its first occurrence on or after `origin`
 * (default: the rule's start, else its anchor), or an `'unsupported'` error naming what has no RFC 5545 form.
 */
function rfcDefinitionOf(rule: Rule, origin?: unknown): Rfc5545RuleDefinition {
  const c = compiledOf(rule);
  const d = rule.definition as unknown as Record<string, unknown>;
  if (rule.kind === 'rfc5545') return rule.definition as Rfc5545RuleDefinition;
  if (d['convention'] !== undefined && d['convention'] !== 'none') {
    throw unsupported(`a business-day adjustment ("convention": ${JSON.stringify(d['convention'])})`);
  }
  if (rule.kind === 'business-days') throw unsupported('a rule of business days');
  if (rule.kind === 'periods') throw unsupported('a rule on the periods of a unit (fiscal periods)');
  let from: number;
  if (origin !== undefined) from = valueOf(c, origin, 'options.start');
  else if (d['start'] !== undefined) from = c.rawStart;
  else if (d['anchor'] !== undefined) {
    from = rule.kind === 'intraday' ? resolveWall(c.zone!, parsePlainDateTime(d['anchor'] as string)).earlier : toDayNumber(d['anchor']);
  } else {
    throw new KalendsRangeError('options.start: the rule has no start or anchor, so its RFC 5545 form needs a DTSTART: pass options.start', {
      code: 'out-of-range',
      received: undefined,
    });
  }
  const first = firstAtOrAfter(c, from);
  if (first === undefined) throw unsupported('a rule with no occurrence on or after its start');
  const out: Record<string, unknown> = { kind: 'rfc5545' };
  if (rule.kind === 'intraday') {
    if (d['clock'] !== 'elapsed') throw unsupported('an intraday rule on the wall clock (RFC 5545 HOURLY and MINUTELY steps are read here as elapsed time)');
    const every = d['every'] as { hours?: number; minutes?: number };
    const minutes = (every.hours ?? 0) * 60 + (every.minutes ?? 0);
    const hourly = minutes % 60 === 0;
    out['frequency'] = hourly ? 'hourly' : 'minutely';
    const interval = hourly ? minutes / 60 : minutes;
    if (interval !== 1) out['interval'] = interval;
    const zone = c.zone!;
    out['start'] = formatPlainDateTime(first + zone.offsetSecondsFromEpochMs(first) * 1000).slice(0, 19);
    out['zone'] = zone.id;
    if (c.count !== undefined) out['count'] = c.count;
    else if (c.rawEnd <= MAX_EPOCH_MS) out['until'] = formatInstant(c.rawEnd - 1);
    return out as unknown as Rfc5545RuleDefinition;
  }
  out['start'] = formatPlainDate(first);
  if (c.count !== undefined) out['count'] = c.count;
  else if (c.rawEnd <= MAX_DAY_NUMBER) out['until'] = formatPlainDate(c.rawEnd - 1);
  switch (rule.kind) {
    case 'days':
      out['frequency'] = 'daily';
      if ((d['every'] ?? 1) !== 1) out['interval'] = d['every'];
      break;
    case 'weekly':
      out['frequency'] = 'weekly';
      if ((d['every'] ?? 1) !== 1) out['interval'] = d['every'];
      out['byDay'] = (d['weekdays'] as unknown[]).map((w) => ({ weekday: weekdayName(w) }));
      if (d['weekStart'] !== undefined) out['weekStart'] = weekdayName(d['weekStart']);
      break;
    default:
      monthlyParts(rule, d, out);
  }
  return out as unknown as Rfc5545RuleDefinition;
}

type LooseSelector = { day?: number | 'last'; whenShort?: string; weekday?: unknown; nth?: number | 'last'; businessDay?: unknown };

function monthlyParts(rule: Rule, d: Record<string, unknown>, out: Record<string, unknown>): void {
  const length = ({ monthly: 1, 'semi-monthly': 1, quarterly: 3, 'half-yearly': 6, yearly: 12 } as Record<string, number>)[rule.kind] ?? 1;
  out['frequency'] = 'monthly';
  const every = length * ((d['every'] as number | undefined) ?? 1);
  if (every !== 1) out['interval'] = every;
  if (Array.isArray(d['months'])) out['byMonth'] = [...(d['months'] as number[])].sort((a, b) => a - b);
  const sels: LooseSelector[] = [];
  if (rule.kind === 'semi-monthly') {
    for (const x of d['days'] as (number | 'last')[]) sels.push({ day: x, whenShort: d['whenShort'] as string });
  } else if (d['on'] !== undefined) {
    sels.push(...(Array.isArray(d['on']) ? (d['on'] as LooseSelector[]) : [d['on'] as LooseSelector]));
  } else {
    // The day comes from the anchor: its day of the month, or the month end under keepMonthEnd.
    const p = packedYmdUnchecked(toDayNumber(d['anchor'] ?? d['start']));
    const day = dayOfPacked(p);
    const isLast = d['keepMonthEnd'] === true && day === dayCountOfMonthIndex(monthIndexOfPacked(p));
    sels.push(isLast ? { day: 'last' } : { day, whenShort: 'last-day' });
  }
  const days: number[] = [];
  const weekdays: Rfc5545WeekdayNum[] = [];
  let setPos: number[] | undefined;
  for (const s of sels) {
    if (s.businessDay !== undefined) throw unsupported('a business-day selector ({ businessDay })');
    if (s.weekday !== undefined) {
      weekdays.push({ weekday: weekdayName(s.weekday), nth: s.nth === 'last' ? -1 : (s.nth as number) });
      continue;
    }
    const n = s.day === 'last' ? -1 : (s.day as number);
    if (Math.abs(n) > 28 && s.whenShort === 'last-day') {
      // Day n, or the month end in shorter months: the last of days 28..n that the month has.
      if (sels.length > 1 || n < 0) throw unsupported(`day ${n} moved to the month end within a list of days`);
      for (let k = 28; k <= n; k++) days.push(k);
      setPos = [-1];
    } else days.push(n);
  }
  if (days.length > 0 && weekdays.length > 0) throw unsupported('a mix of days of the month and weekdays (RFC 5545 intersects BYMONTHDAY with BYDAY)');
  if (days.length > 0) out['byMonthDay'] = days;
  if (weekdays.length > 0) out['byDay'] = weekdays;
  if (setPos) out['bySetPos'] = setPos;
}

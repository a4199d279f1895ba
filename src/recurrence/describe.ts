/**
 * `describeRule`: a rule in plain English words, for people checking a schedule.
 *
 * @module
 */
import { titleOfWeekday, weekdayFromName } from '../civil/names.js';
import { compiledOf } from './generate.js';
import { formatPlainDate, toDayNumber } from './deps.js';
import type { Rule } from './types.js';

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const ORDINAL_WORDS = ['', 'first', 'second', 'third', 'fourth', 'fifth'];

type Loose = Record<string, unknown>;

/** "1st", "2nd", "23rd", "111th". */
function ordinalSuffix(n: number): string {
  const t = n % 100;
  if (t >= 11 && t <= 13) return `${n}th`;
  const u = n % 10;
  return `${n}${u === 1 ? 'st' : u === 2 ? 'nd' : u === 3 ? 'rd' : 'th'}`;
}

function nthWord(n: number): string {
  return n <= 5 ? ORDINAL_WORDS[n]! : ordinalSuffix(n);
}

function weekdayOf(v: unknown): string {
  const wd = typeof v === 'number' && Number.isInteger(v) && v >= 1 && v <= 7 ? v : weekdayFromName(v);
  return wd > 0 ? titleOfWeekday(wd) : String(v);
}

function list(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function fromEnd(n: number, noun: string): string {
  if (n === -1) return `the last ${noun}`;
  return `the ${nthWord(-n)}-to-last ${noun}`;
}

/** Words for one day selector. */
function describeSelector(s: Loose, periodNoun: string): string {
  if (s['day'] !== undefined) {
    const n = s['day'] === 'last' ? -1 : (s['day'] as number);
    const base = n > 0 ? `the ${ordinalSuffix(n)}` : fromEnd(n, 'day');
    if (n > 28 || n < -28) {
      return `${base} (${s['whenShort'] === 'skip' ? `skipping ${periodNoun}s without it` : `or the ${n > 0 ? 'last' : 'first'} day of shorter ${periodNoun}s`})`;
    }
    return base;
  }
  if (s['weekday'] !== undefined) {
    const n = s['nth'] === 'last' ? -1 : (s['nth'] as number);
    const wd = weekdayOf(s['weekday']);
    return n > 0 ? `the ${nthWord(n)} ${wd}` : fromEnd(n, wd);
  }
  const n = s['businessDay'] === 'last' ? -1 : (s['businessDay'] as number);
  return n > 0 ? `the ${nthWord(n)} business day` : fromEnd(n, 'business day');
}

function selectorsOf(d: Loose): Loose[] | undefined {
  const on = d['on'];
  if (on === undefined) return undefined;
  return Array.isArray(on) ? (on as Loose[]) : [on as Loose];
}

function dateText(v: unknown): string {
  try {
    return formatPlainDate(toDayNumber(v));
  } catch {
    return String(v);
  }
}

function every(n: unknown, singular: string, plural: string): string {
  const k = (n as number | undefined) ?? 1;
  return k === 1 ? `every ${singular}` : `every ${k} ${plural}`;
}

function anchorText(d: Loose): string {
  const a = d['anchor'] ?? d['start'];
  return a === undefined ? '' : `, counted from ${dateText(a)}`;
}

function describeMonthFamily(rule: Rule, d: Loose): string {
  const sels = selectorsOf(d);
  let days: string;
  if (rule.kind === 'semi-monthly') {
    days = list((d['days'] as unknown[]).map((x) => describeSelector({ day: x, whenShort: d['whenShort'] }, 'month')));
  } else if (sels) {
    days = list(sels.map((s) => describeSelector(s, 'month')));
  } else {
    const a = dateText(d['anchor'] ?? d['start']);
    days = d['keepMonthEnd'] === true ? `the day of ${a} (the month end, when that is a month end)` : `the day of the month of ${a} (or the last day of shorter months)`;
  }
  const n = (d['every'] as number | undefined) ?? 1;
  switch (rule.kind) {
    case 'monthly': {
      const months = Array.isArray(d['months']) ? ` of ${list((d['months'] as number[]).slice().sort((a, b) => a - b).map((m) => MONTHS[m - 1]!))}` : '';
      if (n === 1) return `${days} of every month${months}`;
      return `${days} of every ${ordinalSuffix(n)} month${months}${anchorText(d)}`;
    }
    case 'semi-monthly':
      return `${days} of every month`;
    default: {
      const length = rule.kind === 'quarterly' ? 3 : rule.kind === 'half-yearly' ? 6 : 12;
      const unit = rule.kind === 'quarterly' ? 'quarter' : rule.kind === 'half-yearly' ? 'half-year' : 'year';
      let first = d['month'] as number | undefined;
      if (first === undefined) first = ((toDayNumberMonth(d['anchor'] ?? d['start']) - 1) % length) + 1;
      const months: string[] = [];
      for (let m = ((first - 1) % length) + 1; m <= 12; m += length) months.push(MONTHS[m - 1]!);
      const which = n === 1 ? `every ${unit}` : `every ${n} ${unit}s${anchorText(d)}`;
      return `${days} of ${list(months)}, ${which}`;
    }
  }
}

function toDayNumberMonth(v: unknown): number {
  return Number(dateText(v).slice(-5, -3)) || 1;
}

function describeCommon(d: Loose, rule: Rule): string {
  const parts: string[] = [];
  const c = compiledOf(rule);
  if (d['start'] !== undefined && rule.kind !== 'rfc5545') parts.push(`from ${rule.values === 'dates' ? dateText(d['start']) : String(d['start'])}`);
  if (d['end'] !== undefined) parts.push(`before ${rule.values === 'dates' ? dateText(d['end']) : String(d['end'])}`);
  if (d['count'] !== undefined && rule.kind !== 'rfc5545') parts.push(`${String(d['count'])} times`);
  if (c.business && d['convention'] !== undefined && d['convention'] !== 'none') {
    parts.push(`moved to a business day of calendar ${JSON.stringify(c.business.id)} by the ${String(d['convention'])} convention (dates that land on the same day count once)`);
  } else if (c.business && rule.kind !== 'business-days') {
    parts.push(`business days from calendar ${JSON.stringify(c.business.id)}`);
  }
  return parts.length ? `; ${parts.join('; ')}` : '';
}

function describeRfc(d: Loose): string {
  const main = describeRfcParts(d);
  const more = Array.isArray(d['additionalRules']) ? (d['additionalRules'] as Loose[]).map((r) => `; and ${describeRfcParts(r)}`).join('') : '';
  const extra: string[] = [];
  const start = String(d['start']);
  const zone = d['zone'] === undefined ? (start.includes('T') ? ' (floating time, read as UTC)' : '') : ` ${String(d['zone'])}`;
  extra.push(`starting ${start}${zone}`);
  if (Array.isArray(d['include'])) extra.push(`also ${list((d['include'] as string[]).map(String))}`);
  if (Array.isArray(d['exclude'])) extra.push(`except ${list((d['exclude'] as string[]).map(String))}`);
  return `${main}${more}; ${extra.join(', ')}`;
}

function describeRfcParts(d: Loose): string {
  const freq = String(d['frequency']);
  const n = (d['interval'] as number | undefined) ?? 1;
  const unit = { yearly: 'year', monthly: 'month', weekly: 'week', daily: 'day', hourly: 'hour', minutely: 'minute', secondly: 'second' }[freq] ?? freq;
  const parts = [n === 1 ? `every ${unit}` : `every ${n} ${unit}s`];
  if (Array.isArray(d['byMonth'])) parts.push(`in ${list((d['byMonth'] as number[]).map((m) => MONTHS[m - 1]!))}`);
  if (Array.isArray(d['byWeekNo'])) parts.push(`in week ${list((d['byWeekNo'] as number[]).map(String))} of the year`);
  if (Array.isArray(d['byYearDay'])) parts.push(`on day ${list((d['byYearDay'] as number[]).map(String))} of the year`);
  if (Array.isArray(d['byMonthDay'])) parts.push(`on day ${list((d['byMonthDay'] as number[]).map(String))} of the month`);
  if (Array.isArray(d['byDay'])) {
    parts.push(
      `on ${list(
        (d['byDay'] as Loose[]).map((e) =>
          e['nth'] === undefined ? `${weekdayOf(e['weekday'])}s` : describeSelector({ weekday: e['weekday'], nth: e['nth'] }, 'month'),
        ),
      )}`,
    );
  }
  if (Array.isArray(d['byHour'])) parts.push(`at hour ${list((d['byHour'] as number[]).map(String))}`);
  if (Array.isArray(d['byMinute'])) parts.push(`at minute ${list((d['byMinute'] as number[]).map(String))}`);
  if (Array.isArray(d['bySecond'])) parts.push(`at second ${list((d['bySecond'] as number[]).map(String))}`);
  if (Array.isArray(d['bySetPos'])) parts.push(`keeping position ${list((d['bySetPos'] as number[]).map(String))} of each ${unit}'s set`);
  if (d['count'] !== undefined) parts.push(`${String(d['count'])} times`);
  if (d['until'] !== undefined) parts.push(`until ${String(d['until'])} inclusive`);
  if (d['weekStart'] !== undefined && d['weekStart'] !== 'monday') parts.push(`weeks start on ${weekdayOf(d['weekStart'])}`);
  return parts.join(', ');
}

/**
 * The rule in plain words.
 *
 * @example
 * ```ts
 * describeRule(defineRule({ kind: 'monthly', on: [{ day: 15 }, { businessDay: 'last' }], calendar: 'us-federal', convention: 'modified-following' }));
 * // 'the 15th and the last business day of every month; moved to a business day of calendar "us-federal" by the modified-following convention (dates that land on the same day count once)'
 * ```
 */
export function describeRule(rule: Rule): string {
  const c = compiledOf(rule);
  const d = rule.definition as unknown as Loose;
  let text: string;
  switch (rule.kind) {
    case 'days':
      text = `${every(d['every'], 'day', 'days')}${(d['every'] ?? 1) === 1 ? '' : anchorText(d)}`;
      break;
    case 'business-days':
      text = `${every(d['every'], 'business day', 'business days')} of calendar ${JSON.stringify(c.business?.id)}${(d['every'] ?? 1) === 1 ? '' : anchorText(d)}`;
      break;
    case 'weekly': {
      const days = list((d['weekdays'] as unknown[]).map(weekdayOf));
      const n = (d['every'] as number | undefined) ?? 1;
      const ws = d['weekStart'] === undefined ? '' : ` (weeks start on ${weekdayOf(d['weekStart'])})`;
      text = n === 1 ? `every ${days}` : `${days} of every ${ordinalSuffix(n)} week${anchorText(d).replace('counted from', 'counted from the week of')}${ws}`;
      break;
    }
    case 'periods': {
      const sels = selectorsOf(d) ?? [];
      const n = (d['every'] as number | undefined) ?? 1;
      text = `${list(sels.map((s) => describeSelector(s, 'period')))} of ${n === 1 ? 'every' : `every ${ordinalSuffix(n)}`} period of unit ${JSON.stringify(c.period?.id)}${n === 1 ? '' : anchorText(d)}`;
      break;
    }
    case 'intraday': {
      const e = d['every'] as { hours?: number; minutes?: number };
      const minutes = (e.hours ?? 0) * 60 + (e.minutes ?? 0);
      const step = minutes % 60 === 0 ? (minutes === 60 ? 'hour' : `${minutes / 60} hours`) : minutes === 1 ? 'minute' : `${minutes} minutes`;
      const zone = c.zone?.id ?? String(d['zone']);
      if (d['clock'] === 'elapsed') {
        text = `every ${step} of elapsed time from ${String(d['anchor'])} ${zone} (daylight-saving changes shift the local times; no step is skipped or repeated)`;
      } else {
        const gap = d['skipped'] === 'drop' ? 'a time skipped by a daylight-saving gap is dropped' : 'a time skipped by a daylight-saving gap moves forward by the length of the gap';
        const fold =
          d['repeated'] === 'both'
            ? 'a repeated time happens twice'
            : d['repeated'] === 'later'
              ? 'a repeated time happens once, at its later instant'
              : 'a repeated time happens once, at its earlier instant';
        text = `every ${step} on the ${zone} wall clock from ${String(d['anchor'])}; ${gap}; ${fold}`;
      }
      break;
    }
    case 'rfc5545':
      text = `RFC 5545 rule: ${describeRfc(d)}`;
      break;
    default:
      text = describeMonthFamily(rule, d);
  }
  const label = typeof d['label'] === 'string' ? `${d['label']}: ` : '';
  return `${label}${text}${describeCommon(d, rule)}`;
}

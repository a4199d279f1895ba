/**
 * @internal The holiday-rule vocabulary of calendar definitions, read field by field: rule kinds and observance
 * shifts as small codes, one rule, an observance object, a weekend list and one-off dated entries. Every fault is
 * recorded in the diagnostics kit's issue collector with its dotted path; names are looked up as own properties
 * only, so `constructor` or `toString` is never taken for a rule kind or a shift.
 *
 * @module
 */
import { MAX_RULE_OFFSET, MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { dayCountOfMonthUnchecked } from '../civil/gregorian.js';
import { WEEKDAY_NAMES, weekdayFromName } from '../civil/names.js';
import {
  type Issues,
  checkKeys,
  didYouMean,
  isRecord,
  joinPath,
  lookupName,
  ownField,
  readInt,
  readString,
} from '../diagnostics/index.js';
import { describeValue } from '../errors.js';
import { parsePlainDate } from '../instant/index.js';
import {
  KIND_CODES,
  KIND_EASTER,
  KIND_FIXED,
  KIND_NTH,
  KIND_ON_OR_AFTER,
  KIND_ON_OR_BEFORE,
  KIND_RELATIVE,
  SHIFT_CODES,
} from './codes.js';

const SHIFT_NAMES = Object.keys(SHIFT_CODES);

/** Words of 0.1 for the observance shifts, so that a message can name the new spelling. */
const SHIFT_SYNONYMS: Readonly<Record<string, string>> = Object.freeze({
  'previous-weekday': 'previous-non-weekend-day',
  'next-weekday': 'next-non-weekend-day',
  'nearest-weekday': 'nearest-non-weekend-day',
});

const COMMON_RULE_KEYS = ['id', 'name', 'kind', 'from', 'until', 'observance', 'source'];
const RULE_KEYS: Readonly<Record<string, readonly string[]>> = Object.freeze({
  fixed: ['month', 'day'],
  'nth-weekday': ['month', 'weekday', 'nth'],
  'weekday-on-or-after': ['month', 'day', 'weekday'],
  'weekday-on-or-before': ['month', 'day', 'weekday'],
  easter: ['offset', 'computus'],
  relative: ['to', 'offset'],
});
const KIND_NAMES = Object.keys(KIND_CODES);

const listed = (names: readonly string[]): string => names.map((n) => JSON.stringify(n)).join(', ');

/** A rule read from a definition, before its observance default and references are resolved. */
export interface RawRule {
  readonly path: string;
  readonly id: string | undefined;
  readonly name: string;
  readonly kind: number;
  readonly month: number;
  readonly day: number;
  /** ISO weekday 1..7 (0 when unused). */
  readonly weekday: number;
  /** 1..5, or -1 for the last. */
  readonly nth: number;
  readonly offset: number;
  readonly julian: boolean;
  /** Id of the referenced rule (relative rules). */
  readonly refId: string | undefined;
  readonly from: number;
  readonly until: number;
  /** The rule's own observance object (undefined: take the default). */
  readonly observance: unknown;
  readonly observancePath: string;
}

/** A validated rule, as the evaluator reads it. */
export interface NormRule extends Omit<RawRule, 'observance' | 'observancePath'> {
  /** Index of the referenced rule in the node's `rules` (relative rules), else -1. */
  ref: number;
  /** Shift code per ISO weekday (index 1..7). */
  readonly shifts: Int8Array;
}

/** A required integer field: absent or out of [min, max] records a fault; returns NaN then. */
function requiredInt(obj: Record<string, unknown>, key: string, path: string, min: number, max: number, issues: Issues): number {
  const at = joinPath(path, key);
  if (ownField(obj, key) === undefined) {
    issues.add(at, `expected an integer from ${min} to ${max}, got undefined; add "${key}"`);
    return Number.NaN;
  }
  return readInt(obj, key, at, min, max, issues, Number.NaN);
}

/** A weekday name field (required). */
function requiredWeekday(obj: Record<string, unknown>, key: string, path: string, issues: Issues): number {
  const v = ownField(obj, key);
  const wd = weekdayFromName(v);
  if (wd === 0) issues.add(joinPath(path, key), `expected a weekday name (${listed(WEEKDAY_NAMES)}), got ${describeValue(v)}${didYouMean(v, WEEKDAY_NAMES)}`);
  return wd;
}

/** Parses an observance object into shift codes by weekday, checking its keys against the weekend. */
export function observanceCodes(v: unknown, path: string, weekendMask: number, issues: Issues): Int8Array {
  const shifts = new Int8Array(8);
  if (!isRecord(v)) {
    issues.add(path, `expected an object such as { "saturday": "previous-non-weekend-day", "sunday": "next-non-weekend-day" }, got ${describeValue(v)}`);
    return shifts;
  }
  for (const key of Object.keys(v)) {
    const at = joinPath(path, key);
    const wd = weekdayFromName(key);
    if (wd === 0) {
      issues.add(at, `expected a weekday name as key (${listed(WEEKDAY_NAMES)}), got ${JSON.stringify(key)}${didYouMean(key, WEEKDAY_NAMES)}`);
      continue;
    }
    if ((weekendMask & (1 << wd)) === 0) {
      issues.add(at, `${key} is not a weekend day of this calendar, so nothing falls on it to move; remove it or add it to weekend`);
      continue;
    }
    const value = v[key];
    const code = lookupName(SHIFT_CODES, value);
    if (code === undefined) {
      issues.add(at, `expected one of ${listed(SHIFT_NAMES)}, got ${describeValue(value)}${didYouMean(value, SHIFT_NAMES, { synonyms: SHIFT_SYNONYMS })}`);
      continue;
    }
    shifts[wd] = code;
  }
  return shifts;
}

/** The weekend mask (bit w set for ISO weekday w) of a list of weekday names, or undefined after a fault. */
export function weekendMaskOf(v: unknown, path: string, issues: Issues): number | undefined {
  if (!Array.isArray(v)) {
    issues.add(path, `expected an array of weekday names such as ["saturday", "sunday"], got ${describeValue(v)}`);
    return undefined;
  }
  let mask = 0;
  for (let i = 0; i < v.length; i++) {
    const name: unknown = v[i];
    const wd = weekdayFromName(name);
    if (wd === 0) issues.add(`${path}[${i}]`, `expected a weekday name (${listed(WEEKDAY_NAMES)}), got ${i in v ? describeValue(name) : 'a hole'}${didYouMean(name, WEEKDAY_NAMES)}`);
    else if (mask & (1 << wd)) issues.add(`${path}[${i}]`, `${JSON.stringify(name)} is listed twice; list each weekend day once`);
    else mask |= 1 << wd;
  }
  return mask;
}

/** Reads one holiday rule, or records its faults and returns undefined. */
export function parseRule(v: unknown, path: string, issues: Issues): RawRule | undefined {
  if (!isRecord(v)) {
    issues.add(path, `expected a holiday rule object such as { "name": "...", "kind": "fixed", "month": 7, "day": 4 }, got ${describeValue(v)}`);
    return undefined;
  }
  const before = issues.count;
  const kindName = ownField(v, 'kind');
  const kind = lookupName(KIND_CODES, kindName);
  if (kind === undefined) {
    issues.add(joinPath(path, 'kind'), `expected one of ${listed(KIND_NAMES)}, got ${describeValue(kindName)}${didYouMean(kindName, KIND_NAMES)}`);
    return undefined;
  }
  checkKeys(v, [...COMMON_RULE_KEYS, ...RULE_KEYS[kindName as string]!], path, issues);
  const name = requiredText(v, 'name', path, issues);
  const id = readString(v, 'id', joinPath(path, 'id'), issues, undefined);
  const from = readInt(v, 'from', joinPath(path, 'from'), MIN_YEAR, MAX_YEAR, issues, MIN_YEAR);
  const until = readInt(v, 'until', joinPath(path, 'until'), MIN_YEAR, MAX_YEAR, issues, MAX_YEAR);
  if (from > until) issues.add(joinPath(path, 'until'), `expected a year not before from (${from}), got ${until}`);
  readString(v, 'source', joinPath(path, 'source'), issues, undefined, 100_000);
  let month = 0;
  let day = 0;
  let weekday = 0;
  let nth = 0;
  let offset = 0;
  let julian = false;
  let refId: string | undefined;
  if (kind === KIND_FIXED || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE || kind === KIND_NTH) {
    month = requiredInt(v, 'month', path, 1, 12, issues);
  }
  if ((kind === KIND_FIXED || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE) && month >= 1) {
    const max = month === 2 ? 29 : dayCountOfMonthUnchecked(2001, month);
    const d = ownField(v, 'day');
    if (typeof d === 'number' && Number.isInteger(d) && d >= 1 && d <= max) day = d;
    else issues.add(joinPath(path, 'day'), `expected 1..${max} for month ${month}${month === 2 ? ' (29 gives a date in leap years only)' : ''}, got ${describeValue(d)}`);
  }
  if (kind === KIND_NTH || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE) weekday = requiredWeekday(v, 'weekday', path, issues);
  if (kind === KIND_NTH) {
    const n = ownField(v, 'nth');
    if (n === 'last') nth = -1;
    else if (typeof n === 'number' && Number.isInteger(n) && n >= 1 && n <= 5) nth = n;
    else {
      const why = typeof n === 'number' && Number.isInteger(n) && n > 5 ? ` (no month has a ${n}th ${String(ownField(v, 'weekday') ?? 'weekday')})` : '';
      issues.add(joinPath(path, 'nth'), `expected 1, 2, 3, 4, 5 or "last", got ${describeValue(n)}${why}`);
    }
  }
  if (kind === KIND_EASTER || kind === KIND_RELATIVE) offset = requiredInt(v, 'offset', path, -MAX_RULE_OFFSET, MAX_RULE_OFFSET, issues);
  if (kind === KIND_EASTER) {
    const comp = ownField(v, 'computus');
    if (comp === 'julian') julian = true;
    else if (comp !== undefined && comp !== 'gregorian') {
      issues.add(joinPath(path, 'computus'), `expected "gregorian" or "julian", got ${describeValue(comp)}${didYouMean(comp, ['gregorian', 'julian'])}`);
    }
  }
  if (kind === KIND_RELATIVE) refId = requiredText(v, 'to', path, issues);
  if (issues.count > before || name === undefined) return undefined;
  return {
    path,
    id,
    name,
    kind,
    month,
    day,
    weekday,
    nth,
    offset,
    julian,
    refId,
    from,
    until,
    observance: ownField(v, 'observance'),
    observancePath: joinPath(path, 'observance'),
  };
}

/** A required non-empty text field. */
function requiredText(obj: Record<string, unknown>, key: string, path: string, issues: Issues): string | undefined {
  const v = ownField(obj, key);
  if (typeof v !== 'string' || v.trim() === '') {
    issues.add(joinPath(path, key), `expected a non-empty string, got ${describeValue(v)}`);
    return undefined;
  }
  return v;
}

/** One-off entries (`additions`, `removals`): `{ date, name }` with an ISO 8601 date, read by `parsePlainDate`. */
export function readDatedEntries(v: unknown, path: string, issues: Issues): { dayNumber: number; name: string; path: string }[] {
  if (v === undefined) return [];
  if (!Array.isArray(v)) {
    issues.add(path, `expected an array of { "date": "YYYY-MM-DD", "name": "..." }, got ${describeValue(v)}`);
    return [];
  }
  const out: { dayNumber: number; name: string; path: string }[] = [];
  for (let i = 0; i < v.length; i++) {
    const entry: unknown = v[i];
    const p = `${path}[${i}]`;
    if (!isRecord(entry)) {
      issues.add(p, `expected { "date": "YYYY-MM-DD", "name": "..." }, got ${i in v ? describeValue(entry) : 'a hole'}`);
      continue;
    }
    checkKeys(entry, ['date', 'name'], p, issues);
    const name = requiredText(entry, 'name', p, issues);
    const date = ownField(entry, 'date');
    if (typeof date !== 'string') {
      issues.add(joinPath(p, 'date'), `expected an ISO 8601 date such as "2025-12-24", got ${describeValue(date)}`);
      continue;
    }
    let dayNumber: number;
    try {
      dayNumber = parsePlainDate(date);
    } catch (e) {
      // The parser's message quotes the text given; drop its function-name prefix, the path names the field.
      issues.add(joinPath(p, 'date'), (e as Error).message.replace(/^text: /, ''));
      continue;
    }
    if (name !== undefined) out.push({ dayNumber, name, path: p });
  }
  return out;
}

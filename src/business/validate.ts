/**
 * @internal Validation and normalization of calendar definitions. Every fault is collected with its dotted path
 * and thrown together as one DefinitionError. The result is a tree of normalized nodes that the compiler reads.
 *
 * @module
 */
import { MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { EASTER_MIN_YEAR, JULIAN_EASTER_MIN_YEAR } from '../civil/easter.js';
import { dayCountOfMonthUnchecked } from '../civil/gregorian.js';
import { type DefinitionIssue, describeValue } from '../errors.js';
import { type CalendarDefinition, type ObservanceShift, WEEKDAY_NAMES } from './definition.js';
import { dayNumberFromIsoDate } from './dates.js';
import { BUNDLED_DEFINITIONS, suggestCalendarNames } from './jurisdictions/index.js';

/** Rule kinds as small integers. */
export const KIND_FIXED = 0;
export const KIND_NTH = 1;
export const KIND_ON_OR_AFTER = 2;
export const KIND_ON_OR_BEFORE = 3;
export const KIND_EASTER = 4;
export const KIND_RELATIVE = 5;

/** Observance shift codes (0 = stay). */
export const SHIFT_NONE = 0;
export const SHIFT_PREVIOUS = 1;
export const SHIFT_NEXT = 2;
export const SHIFT_NEAREST = 3;
export const SHIFT_SUBSTITUTE = 4;

const SHIFT_CODES: Readonly<Record<ObservanceShift, number>> = {
  'previous-weekday': SHIFT_PREVIOUS,
  'next-weekday': SHIFT_NEXT,
  'nearest-weekday': SHIFT_NEAREST,
  'substitute-day': SHIFT_SUBSTITUTE,
};

/** Largest total offset, in days, of an Easter or relative rule from its base date (keeps every date within a year of its base). */
export const MAX_RULE_OFFSET = 300;

/** A validated rule. */
export interface NormRule {
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
  /** Index of the referenced rule in the node's `rules` (relative rules), else -1. */
  ref: number;
  /** Id of the referenced rule (relative rules). */
  readonly refId: string | undefined;
  readonly from: number;
  readonly until: number;
  /** Shift code per ISO weekday (index 1..7). */
  readonly shifts: Int8Array;
}

/** A validated calendar node: its members (for unions), its own rules, one-offs and years. */
export interface CalendarNode {
  readonly members: readonly CalendarNode[];
  /** Bit w set when ISO weekday w (1..7) is a weekend day, counting members' weekends. */
  readonly weekendMask: number;
  readonly ownWeekendMask: number;
  readonly rules: readonly NormRule[];
  /** Rule indices in an order where every relative rule follows the rule it refers to. */
  readonly order: readonly number[];
  readonly additions: readonly { readonly dayNumber: number; readonly name: string }[];
  readonly removals: readonly { readonly dayNumber: number; readonly name: string; readonly path: string }[];
  readonly firstYear: number;
  readonly lastYear: number;
}

const DEFINITION_KEYS = [
  'id',
  'name',
  'source',
  'caution',
  'extends',
  'union',
  'weekend',
  'observance',
  'years',
  'holidays',
  'omitRules',
  'additions',
  'removals',
];
const COMMON_RULE_KEYS = ['id', 'name', 'kind', 'from', 'until', 'observance', 'source'];
const RULE_KEYS: Readonly<Record<string, readonly string[]>> = {
  fixed: ['month', 'day'],
  'nth-weekday': ['month', 'weekday', 'nth'],
  'weekday-on-or-after': ['month', 'day', 'weekday'],
  'weekday-on-or-before': ['month', 'day', 'weekday'],
  easter: ['offset', 'computus'],
  relative: ['to', 'offset'],
};
const KIND_CODES: Readonly<Record<string, number>> = {
  fixed: KIND_FIXED,
  'nth-weekday': KIND_NTH,
  'weekday-on-or-after': KIND_ON_OR_AFTER,
  'weekday-on-or-before': KIND_ON_OR_BEFORE,
  easter: KIND_EASTER,
  relative: KIND_RELATIVE,
};

const ALL_SEVEN = 0b1111_1110;

function join(path: string, key: string): string {
  return path === '' ? key : `${path}.${key}`;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

class Collector {
  readonly issues: DefinitionIssue[] = [];
  add(path: string, message: string): void {
    this.issues.push({ path, message });
  }
  unknownKeys(obj: Record<string, unknown>, path: string, allowed: readonly string[], what: string): void {
    for (const key of Object.keys(obj)) {
      if (!allowed.includes(key)) {
        this.add(join(path, key), `unknown field in ${what}; valid fields are ${allowed.join(', ')}`);
      }
    }
  }
  integer(obj: Record<string, unknown>, path: string, key: string, min: number, max: number, hint = ''): number | undefined {
    const v = obj[key];
    if (typeof v !== 'number' || !Number.isInteger(v) || v < min || v > max) {
      this.add(join(path, key), `expected an integer from ${min} to ${max}${hint}, got ${describeValue(v)}`);
      return undefined;
    }
    return v;
  }
  text(obj: Record<string, unknown>, path: string, key: string, required: boolean): string | undefined {
    const v = obj[key];
    if (v === undefined && !required) return undefined;
    if (typeof v !== 'string' || v.trim() === '') {
      this.add(join(path, key), `expected a non-empty string, got ${describeValue(v)}`);
      return undefined;
    }
    return v;
  }
  weekday(obj: Record<string, unknown>, path: string, key: string): number | undefined {
    const v = obj[key];
    const i = typeof v === 'string' ? WEEKDAY_NAMES.indexOf(v as (typeof WEEKDAY_NAMES)[number]) : -1;
    if (i < 0) {
      this.add(join(path, key), `expected one of ${WEEKDAY_NAMES.join(', ')}, got ${describeValue(v)}`);
      return undefined;
    }
    return i + 1;
  }
}

/** Parses an observance object into shift codes by weekday; checks its keys against the weekend. */
function observanceCodes(v: unknown, path: string, weekendMask: number, c: Collector): Int8Array {
  const shifts = new Int8Array(8);
  if (!isPlainObject(v)) {
    c.add(path, `expected an object such as { "saturday": "previous-weekday", "sunday": "next-weekday" }, got ${describeValue(v)}`);
    return shifts;
  }
  for (const [key, value] of Object.entries(v)) {
    const wd = WEEKDAY_NAMES.indexOf(key as (typeof WEEKDAY_NAMES)[number]) + 1;
    if (wd === 0) {
      c.add(join(path, key), `expected a weekday name (${WEEKDAY_NAMES.join(', ')}) as key`);
      continue;
    }
    if ((weekendMask & (1 << wd)) === 0) {
      c.add(join(path, key), `${key} is not a weekend day of this calendar, so nothing falls on it to move; remove it or add it to weekend`);
      continue;
    }
    const code = typeof value === 'string' ? SHIFT_CODES[value as ObservanceShift] : undefined;
    if (code === undefined) {
      c.add(join(path, key), `expected one of ${Object.keys(SHIFT_CODES).join(', ')}, got ${describeValue(value)}`);
      continue;
    }
    shifts[wd] = code;
  }
  return shifts;
}

function weekendMaskOf(v: unknown, path: string, c: Collector): number | undefined {
  if (!Array.isArray(v)) {
    c.add(path, `expected an array of weekday names such as ["saturday", "sunday"], got ${describeValue(v)}`);
    return undefined;
  }
  let mask = 0;
  v.forEach((name, i) => {
    const wd = typeof name === 'string' ? WEEKDAY_NAMES.indexOf(name as (typeof WEEKDAY_NAMES)[number]) + 1 : 0;
    if (wd === 0) c.add(`${path}[${i}]`, `expected one of ${WEEKDAY_NAMES.join(', ')}, got ${describeValue(name)}`);
    else if (mask & (1 << wd)) c.add(`${path}[${i}]`, `${name} is listed twice`);
    else mask |= 1 << wd;
  });
  return mask;
}

/** Raw (not yet observance-resolved) rule from a definition. */
interface RawRule {
  readonly path: string;
  readonly id: string | undefined;
  readonly name: string;
  readonly kind: number;
  readonly month: number;
  readonly day: number;
  readonly weekday: number;
  readonly nth: number;
  readonly offset: number;
  readonly julian: boolean;
  readonly refId: string | undefined;
  readonly from: number;
  readonly until: number;
  /** The rule's own observance object (undefined: take the default). */
  readonly observance: unknown;
  readonly observancePath: string;
}

function parseRule(v: unknown, path: string, c: Collector): RawRule | undefined {
  if (!isPlainObject(v)) {
    c.add(path, `expected a holiday rule object, got ${describeValue(v)}`);
    return undefined;
  }
  const before = c.issues.length;
  const kindName = v['kind'];
  const kind = typeof kindName === 'string' ? KIND_CODES[kindName] : undefined;
  if (kind === undefined) {
    c.add(join(path, 'kind'), `expected one of ${Object.keys(KIND_CODES).join(', ')}, got ${describeValue(kindName)}`);
    return undefined;
  }
  c.unknownKeys(v, path, [...COMMON_RULE_KEYS, ...RULE_KEYS[kindName as string]!], `a "${kindName as string}" rule`);
  const name = c.text(v, path, 'name', true);
  let id: string | undefined;
  if (v['id'] !== undefined) id = c.text(v, path, 'id', true);
  let from = MIN_YEAR;
  let until = MAX_YEAR;
  if (v['from'] !== undefined) from = c.integer(v, path, 'from', MIN_YEAR, MAX_YEAR) ?? MIN_YEAR;
  if (v['until'] !== undefined) until = c.integer(v, path, 'until', MIN_YEAR, MAX_YEAR) ?? MAX_YEAR;
  if (from > until) c.add(join(path, 'until'), `expected a year not before from (${from}), got ${until}`);
  if (v['source'] !== undefined) c.text(v, path, 'source', false);
  let month = 0;
  let day = 0;
  let weekday = 0;
  let nth = 0;
  let offset = 0;
  let julian = false;
  let refId: string | undefined;
  if (kind === KIND_FIXED || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE || kind === KIND_NTH) {
    month = c.integer(v, path, 'month', 1, 12) ?? 0;
  }
  if (kind === KIND_FIXED || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE) {
    if (month >= 1) {
      const max = month === 2 ? 29 : dayCountOfMonthUnchecked(2001, month);
      const d = v['day'];
      if (typeof d === 'number' && Number.isInteger(d) && d >= 1 && d <= max) day = d;
      else c.add(join(path, 'day'), `expected 1..${max} for month ${month}${month === 2 ? ' (29 gives a date in leap years only)' : ''}, got ${describeValue(d)}`);
    }
  }
  if (kind === KIND_NTH || kind === KIND_ON_OR_AFTER || kind === KIND_ON_OR_BEFORE) {
    weekday = c.weekday(v, path, 'weekday') ?? 0;
  }
  if (kind === KIND_NTH) {
    const n = v['nth'];
    if (n === 'last') nth = -1;
    else if (typeof n === 'number' && Number.isInteger(n) && n >= 1 && n <= 5) nth = n;
    else {
      const why = typeof n === 'number' && Number.isInteger(n) && n > 5 ? ` (no month has a ${n}th ${String(v['weekday'] ?? 'weekday')})` : '';
      c.add(join(path, 'nth'), `expected 1, 2, 3, 4, 5 or "last", got ${describeValue(n)}${why}`);
    }
  }
  if (kind === KIND_EASTER || kind === KIND_RELATIVE) {
    offset = c.integer(v, path, 'offset', -MAX_RULE_OFFSET, MAX_RULE_OFFSET) ?? 0;
  }
  if (kind === KIND_EASTER && v['computus'] !== undefined) {
    const comp = v['computus'];
    if (comp === 'julian') julian = true;
    else if (comp !== 'gregorian') c.add(join(path, 'computus'), `expected "gregorian" or "julian", got ${describeValue(comp)}`);
  }
  if (kind === KIND_RELATIVE) refId = c.text(v, path, 'to', true);
  if (c.issues.length > before || name === undefined) return undefined;
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
    observance: v['observance'],
    observancePath: join(path, 'observance'),
  };
}

function readDatedEntries(v: unknown, path: string, c: Collector): { dayNumber: number; name: string; path: string }[] {
  if (v === undefined) return [];
  if (!Array.isArray(v)) {
    c.add(path, `expected an array of { "date": "YYYY-MM-DD", "name": "..." }, got ${describeValue(v)}`);
    return [];
  }
  const out: { dayNumber: number; name: string; path: string }[] = [];
  v.forEach((entry, i) => {
    const p = `${path}[${i}]`;
    if (!isPlainObject(entry)) {
      c.add(p, `expected { "date": "YYYY-MM-DD", "name": "..." }, got ${describeValue(entry)}`);
      return;
    }
    c.unknownKeys(entry, p, ['date', 'name'], 'a dated entry');
    const name = c.text(entry, p, 'name', true);
    const date = entry['date'];
    if (typeof date !== 'string') {
      c.add(join(p, 'date'), `expected an ISO 8601 date YYYY-MM-DD, got ${describeValue(date)}`);
      return;
    }
    const dn = dayNumberFromIsoDate(date);
    if (typeof dn === 'string') {
      c.add(join(p, 'date'), dn);
      return;
    }
    if (name !== undefined) out.push({ dayNumber: dn, name, path: p });
  });
  return out;
}

/** Intermediate node: rules not yet resolved (so that extension can merge before references are resolved). */
interface Draft {
  members: CalendarNode[];
  ownWeekendMask: number;
  /** Effective weekend of the members alone. */
  memberWeekendMask: number;
  rules: { raw: RawRule; shifts: Int8Array }[];
  additions: { dayNumber: number; name: string }[];
  removals: { dayNumber: number; name: string; path: string }[];
  years: { from: number | undefined; until: number | undefined; path: string };
  hasMembers: boolean;
  /** Observance for rules that give none (inherited through extends). */
  defaultShifts: Int8Array;
}

/**
 * Validates a definition and returns its normalized node, or records issues and returns undefined.
 * `stack` holds the definitions being expanded (to catch a calendar that extends itself).
 */
function draftOf(def: unknown, path: string, c: Collector, stack: Set<unknown>): Draft | undefined {
  if (typeof def === 'string') {
    const bundled = Object.prototype.hasOwnProperty.call(BUNDLED_DEFINITIONS, def)
      ? (BUNDLED_DEFINITIONS as Readonly<Record<string, CalendarDefinition>>)[def]
      : undefined;
    if (!bundled) {
      const s = suggestCalendarNames(def);
      c.add(
        path === '' ? 'calendar' : path,
        `unknown calendar ${JSON.stringify(def)}${s.length ? `; did you mean ${s.map((x) => JSON.stringify(x)).join(' or ')}?` : ''} (bundled calendars: ${Object.keys(BUNDLED_DEFINITIONS).join(', ')})`,
      );
      return undefined;
    }
    return draftOf(bundled, path, c, stack);
  }
  if (!isPlainObject(def)) {
    c.add(path === '' ? 'definition' : path, `expected a calendar definition object or a bundled calendar name, got ${describeValue(def)}`);
    return undefined;
  }
  // A compiled calendar stands in for its definition.
  if (typeof def['firstYear'] === 'number' && Array.isArray(def['weekendNames']) && isPlainObject(def['definition'])) {
    return draftOf(def['definition'], path, c, stack);
  }
  if (stack.has(def)) {
    c.add(path, 'a calendar cannot extend or contain itself');
    return undefined;
  }
  stack.add(def);
  try {
    return draftOfObject(def, path, c, stack);
  } finally {
    stack.delete(def);
  }
}

function draftOfObject(def: Record<string, unknown>, path: string, c: Collector, stack: Set<unknown>): Draft | undefined {
  const before = c.issues.length;
  c.unknownKeys(def, path, DEFINITION_KEYS, 'a calendar definition');
  for (const key of ['id', 'name', 'source', 'caution']) if (def[key] !== undefined) c.text(def, path, key, false);
  if (def['extends'] !== undefined && def['union'] !== undefined) {
    c.add(join(path, 'union'), 'a definition takes either extends or union, not both; extend the union instead');
  }
  let draft: Draft;
  if (def['extends'] !== undefined) {
    const parent = draftOf(def['extends'], join(path, 'extends'), c, stack);
    if (!parent) return undefined;
    draft = {
      members: parent.members,
      ownWeekendMask: parent.ownWeekendMask,
      memberWeekendMask: parent.memberWeekendMask,
      rules: parent.rules.slice(),
      additions: parent.additions.slice(),
      removals: parent.removals.slice(),
      years: parent.years,
      hasMembers: parent.hasMembers,
      defaultShifts: parent.defaultShifts,
    };
  } else if (def['union'] !== undefined) {
    const u = def['union'];
    const members: CalendarNode[] = [];
    if (!Array.isArray(u) || u.length === 0) {
      c.add(join(path, 'union'), `expected a non-empty array of calendar definitions or bundled names, got ${describeValue(u)}`);
    } else {
      u.forEach((m, i) => {
        const node = nodeOf(m, `${join(path, 'union')}[${i}]`, c, stack);
        if (node) members.push(node);
      });
    }
    let memberMask = 0;
    for (const m of members) memberMask |= m.weekendMask;
    draft = {
      members,
      ownWeekendMask: 0,
      memberWeekendMask: memberMask,
      rules: [],
      additions: [],
      removals: [],
      years: {
        from: members.length ? Math.max(...members.map((m) => m.firstYear)) : undefined,
        until: members.length ? Math.min(...members.map((m) => m.lastYear)) : undefined,
        path: join(path, 'union'),
      },
      hasMembers: true,
      defaultShifts: new Int8Array(8),
    };
  } else {
    draft = {
      members: [],
      ownWeekendMask: (1 << 6) | (1 << 7),
      memberWeekendMask: 0,
      rules: [],
      additions: [],
      removals: [],
      years: { from: undefined, until: undefined, path: join(path, 'years') },
      hasMembers: false,
      defaultShifts: new Int8Array(8),
    };
  }
  if (def['weekend'] !== undefined) {
    const mask = weekendMaskOf(def['weekend'], join(path, 'weekend'), c);
    if (mask !== undefined) draft.ownWeekendMask = mask;
  }
  const weekendMask = draft.ownWeekendMask | draft.memberWeekendMask;
  if ((weekendMask & ALL_SEVEN) === ALL_SEVEN) {
    c.add(
      join(path, 'weekend'),
      'all seven days are weekend days, so no business day could exist; leave at least one day of the week out of the weekend',
    );
  }
  if (def['observance'] !== undefined) draft.defaultShifts = observanceCodes(def['observance'], join(path, 'observance'), weekendMask, c);
  const defaultShifts = draft.defaultShifts;
  if (def['years'] !== undefined) {
    const y = def['years'];
    const p = join(path, 'years');
    if (!isPlainObject(y)) c.add(p, `expected { "from": year, "until": year }, got ${describeValue(y)}`);
    else {
      c.unknownKeys(y, p, ['from', 'until'], 'years');
      const from = y['from'] === undefined ? undefined : c.integer(y, p, 'from', MIN_YEAR, MAX_YEAR);
      const until = y['until'] === undefined ? undefined : c.integer(y, p, 'until', MIN_YEAR, MAX_YEAR);
      if (from !== undefined && until !== undefined && from > until) c.add(join(p, 'until'), `expected a year not before from (${from}), got ${until}`);
      draft.years = { from: from ?? draft.years.from, until: until ?? draft.years.until, path: p };
    }
  }
  if (def['omitRules'] !== undefined) {
    const o = def['omitRules'];
    const p = join(path, 'omitRules');
    if (def['extends'] === undefined) c.add(p, 'omitRules drops rules of an extended calendar; it needs extends');
    else if (!Array.isArray(o)) c.add(p, `expected an array of rule ids, got ${describeValue(o)}`);
    else {
      o.forEach((id, i) => {
        const at = draft.rules.findIndex((r) => r.raw.id === id);
        if (at < 0) {
          const ids = draft.rules.map((r) => r.raw.id).filter((x): x is string => x !== undefined);
          c.add(`${p}[${i}]`, `the extended calendar has no rule with id ${describeValue(id)}; its rule ids are ${ids.join(', ') || '(none)'}`);
        } else draft.rules.splice(at, 1);
      });
    }
  }
  const h = def['holidays'];
  if (h !== undefined) {
    const p = join(path, 'holidays');
    if (!Array.isArray(h)) c.add(p, `expected an array of holiday rules, got ${describeValue(h)}`);
    else {
      const ownIds = new Set<string>();
      h.forEach((rv, i) => {
        const raw = parseRule(rv, `${p}[${i}]`, c);
        if (!raw) return;
        const shifts =
          raw.observance === undefined ? defaultShifts : observanceCodes(raw.observance, raw.observancePath, weekendMask, c);
        if (raw.id !== undefined) {
          if (ownIds.has(raw.id)) {
            c.add(join(raw.path, 'id'), `id ${JSON.stringify(raw.id)} is used by an earlier rule; ids must be unique`);
            return;
          }
          ownIds.add(raw.id);
          const at = draft.rules.findIndex((r) => r.raw.id === raw.id);
          if (at >= 0) {
            draft.rules[at] = { raw, shifts }; // replaces the extended calendar's rule of the same id
            return;
          }
        }
        draft.rules.push({ raw, shifts });
      });
    }
  }
  // Rules inherited from an extended calendar may name weekend days that this calendar no longer has.
  for (const r of draft.rules) {
    for (let wd = 1; wd <= 7; wd++) {
      if (r.shifts[wd] !== SHIFT_NONE && (weekendMask & (1 << wd)) === 0) {
        c.add(r.raw.observancePath, `${WEEKDAY_NAMES[wd - 1]} is not a weekend day of this calendar, so nothing falls on it to move`);
      }
    }
  }
  draft.additions.push(...readDatedEntries(def['additions'], join(path, 'additions'), c));
  draft.removals.push(...readDatedEntries(def['removals'], join(path, 'removals'), c));
  if (c.issues.length > before) return undefined;
  return draft;
}

function finish(draft: Draft, path: string, c: Collector): CalendarNode | undefined {
  const before = c.issues.length;
  const rules: NormRule[] = draft.rules.map(({ raw, shifts }) => ({
    path: raw.path,
    id: raw.id,
    name: raw.name,
    kind: raw.kind,
    month: raw.month,
    day: raw.day,
    weekday: raw.weekday,
    nth: raw.nth,
    offset: raw.offset,
    julian: raw.julian,
    ref: -1,
    refId: raw.refId,
    from: raw.from,
    until: raw.until,
    shifts,
  }));
  const byId = new Map<string, number>();
  rules.forEach((r, i) => {
    if (r.id !== undefined) byId.set(r.id, i);
  });
  for (const r of rules) {
    if (r.kind !== KIND_RELATIVE) continue;
    const target = byId.get(r.refId!);
    if (target === undefined) {
      c.add(join(r.path, 'to'), `no rule of this calendar has id ${JSON.stringify(r.refId)}; ids are ${[...byId.keys()].join(', ') || '(none)'}`);
    } else r.ref = target;
  }
  if (c.issues.length > before) return undefined;
  // Topological order; detect cycles and check the total offset from each chain's base.
  const order: number[] = [];
  const state = new Int8Array(rules.length); // 0 new, 1 visiting, 2 done
  const totalOffset = new Float64Array(rules.length);
  const visit = (i: number, chain: number[]): void => {
    if (state[i] === 2) return;
    const r = rules[i]!;
    if (state[i] === 1) {
      const cycle = [...chain.slice(chain.indexOf(i)), i].map((k) => rules[k]!.id).join(' -> ');
      c.add(join(r.path, 'to'), `relative rules form a cycle (${cycle}); one of them must be anchored to a date`);
      return;
    }
    state[i] = 1;
    if (r.kind === KIND_RELATIVE) {
      visit(r.ref, [...chain, i]);
      totalOffset[i] = totalOffset[r.ref]! + r.offset;
    } else totalOffset[i] = r.kind === KIND_EASTER ? r.offset : 0;
    if (Math.abs(totalOffset[i]!) > MAX_RULE_OFFSET) {
      c.add(
        join(r.path, 'offset'),
        `the offsets along this chain of relative rules add up to ${totalOffset[i]} days; keep the total within ±${MAX_RULE_OFFSET} days of the base date`,
      );
    }
    state[i] = 2;
    order.push(i);
  };
  for (let i = 0; i < rules.length; i++) if (state[i] === 0) visit(i, []);
  // Years: the calendar's own, narrowed by the Easter computus where needed.
  let easterMin = MIN_YEAR;
  let easterRule: NormRule | undefined;
  for (const r of rules) {
    const base = baseRule(rules, r);
    if (base.kind !== KIND_EASTER) continue;
    const min = base.julian ? JULIAN_EASTER_MIN_YEAR : EASTER_MIN_YEAR;
    const need = r.from < min ? min : MIN_YEAR;
    if (need > easterMin) {
      easterMin = need;
      easterRule = r;
    }
  }
  let firstYear = draft.years.from;
  const lastYear = draft.years.until ?? MAX_YEAR;
  if (firstYear === undefined) firstYear = easterMin;
  else if (firstYear < easterMin) {
    c.add(
      join(draft.years.path, 'from'),
      `${easterRule!.path} uses the ${easterRule!.julian ? 'Julian' : 'Gregorian'} Easter computus, which starts in ${easterMin}; expected a year from ${easterMin}, got ${firstYear} (or give the rule "from": ${easterMin})`,
    );
  }
  if (firstYear > lastYear) c.add(draft.years.path, `the calendar covers no year: from ${firstYear} until ${lastYear}`);
  if (c.issues.length > before) return undefined;
  let weekendMask = draft.ownWeekendMask | draft.memberWeekendMask;
  for (const m of draft.members) weekendMask |= m.weekendMask;
  return {
    members: draft.members,
    weekendMask,
    ownWeekendMask: draft.ownWeekendMask,
    rules,
    order,
    additions: draft.additions,
    removals: draft.removals,
    firstYear,
    lastYear,
  };
}

function baseRule(rules: readonly NormRule[], r: NormRule): NormRule {
  let cur = r;
  for (let guard = 0; cur.kind === KIND_RELATIVE && cur.ref >= 0 && guard <= rules.length; guard++) cur = rules[cur.ref]!;
  return cur;
}

function nodeOf(def: unknown, path: string, c: Collector, stack: Set<unknown>): CalendarNode | undefined {
  const draft = draftOf(def, path, c, stack);
  return draft ? finish(draft, path, c) : undefined;
}

/** Validates a definition; returns its node and the issues found (empty when valid). */
export function normalizeDefinition(def: unknown): { node: CalendarNode | undefined; issues: readonly DefinitionIssue[] } {
  const c = new Collector();
  const node = nodeOf(def, '', c, new Set());
  return { node: c.issues.length ? undefined : node, issues: c.issues };
}

/**
 * @internal Validation and normalization of calendar definitions: composition (`extends`, `union`, `omitRules`),
 * weekends, years, and the resolution of relative rules. The fields of each rule are read by ./holiday-rules.ts.
 * Every fault is collected with its dotted path (the diagnostics kit's issue collector) and thrown together as
 * one DefinitionError. The result is a tree of normalized nodes that the evaluator reads.
 *
 * @module
 */
import { MAX_RULE_OFFSET, MAX_YEAR, MIN_YEAR } from '../bounds.js';
import { EASTER_MIN_YEAR, JULIAN_EASTER_MIN_YEAR } from '../civil/easter.js';
import { WEEKDAY_NAMES } from '../civil/names.js';
import { type DefinitionIssue, describeValue } from '../errors.js';
import { Issues, checkKeys, didYouMean, isRecord, joinPath, lookupName, ownField, readInt, readString } from '../diagnostics/index.js';
import type { CalendarDefinition } from './definition.js';
import { KIND_EASTER, KIND_RELATIVE, SHIFT_NONE } from './codes.js';
import {
  type NormRule,
  type RawRule,
  observanceCodes,
  parseRule,
  readDatedEntries,
  weekendMaskOf,
} from './holiday-rules.js';
import { BUNDLED_DEFINITIONS, unknownCalendarText } from './jurisdictions/index.js';

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

const ALL_SEVEN = 0b1111_1110;

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
function draftOf(def: unknown, path: string, c: Issues, stack: Set<unknown>): Draft | undefined {
  if (typeof def === 'string') {
    const bundled = lookupName<CalendarDefinition>(BUNDLED_DEFINITIONS, def);
    if (!bundled) {
      c.add(path === '' ? 'calendar' : path, unknownCalendarText(def));
      return undefined;
    }
    return draftOf(bundled, path, c, stack);
  }
  if (!isRecord(def)) {
    c.add(path === '' ? 'definition' : path, `expected a calendar definition object or a bundled calendar name, got ${describeValue(def)}`);
    return undefined;
  }
  // A compiled calendar stands in for its definition.
  if (typeof ownField(def, 'firstYear') === 'number' && Array.isArray(ownField(def, 'weekendNames')) && isRecord(ownField(def, 'definition'))) {
    return draftOf(ownField(def, 'definition'), path, c, stack);
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

function draftOfObject(def: Record<string, unknown>, path: string, c: Issues, stack: Set<unknown>): Draft | undefined {
  const before = c.count;
  const field = (key: string): unknown => ownField(def, key);
  checkKeys(def, DEFINITION_KEYS, path, c);
  for (const key of ['id', 'name', 'source', 'caution']) readString(def, key, joinPath(path, key), c, undefined, 100_000);
  if (field('extends') !== undefined && field('union') !== undefined) {
    c.add(joinPath(path, 'union'), 'a definition takes either extends or union, not both; extend the union instead');
  }
  let draft: Draft;
  if (field('extends') !== undefined) {
    const parent = draftOf(field('extends'), joinPath(path, 'extends'), c, stack);
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
  } else if (field('union') !== undefined) {
    const u = field('union');
    const members: CalendarNode[] = [];
    if (!Array.isArray(u) || u.length === 0) {
      c.add(joinPath(path, 'union'), `expected a non-empty array of calendar definitions or bundled names, got ${describeValue(u)}`);
    } else {
      u.forEach((m, i) => {
        const node = nodeOf(m, `${joinPath(path, 'union')}[${i}]`, c, stack);
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
        path: joinPath(path, 'union'),
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
      years: { from: undefined, until: undefined, path: joinPath(path, 'years') },
      hasMembers: false,
      defaultShifts: new Int8Array(8),
    };
  }
  if (field('weekend') !== undefined) {
    const mask = weekendMaskOf(field('weekend'), joinPath(path, 'weekend'), c);
    if (mask !== undefined) draft.ownWeekendMask = mask;
  }
  const weekendMask = draft.ownWeekendMask | draft.memberWeekendMask;
  if ((weekendMask & ALL_SEVEN) === ALL_SEVEN) {
    c.add(
      joinPath(path, 'weekend'),
      'all seven days are weekend days, so no business day could exist; leave at least one day of the week out of the weekend',
    );
  }
  if (field('observance') !== undefined) draft.defaultShifts = observanceCodes(field('observance'), joinPath(path, 'observance'), weekendMask, c);
  const defaultShifts = draft.defaultShifts;
  if (field('years') !== undefined) {
    const y = field('years');
    const p = joinPath(path, 'years');
    if (!isRecord(y)) c.add(p, `expected { "from": year, "until": year }, got ${describeValue(y)}`);
    else {
      checkKeys(y, ['from', 'until'], p, c);
      const from = readInt(y, 'from', joinPath(p, 'from'), MIN_YEAR, MAX_YEAR, c, Number.NaN);
      const until = readInt(y, 'until', joinPath(p, 'until'), MIN_YEAR, MAX_YEAR, c, Number.NaN);
      if (from > until) c.add(joinPath(p, 'until'), `expected a year not before from (${from}), got ${until}`);
      draft.years = { from: Number.isNaN(from) ? draft.years.from : from, until: Number.isNaN(until) ? draft.years.until : until, path: p };
    }
  }
  if (field('omitRules') !== undefined) {
    const o = field('omitRules');
    const p = joinPath(path, 'omitRules');
    if (field('extends') === undefined) c.add(p, 'omitRules drops rules of an extended calendar; it needs extends');
    else if (!Array.isArray(o)) c.add(p, `expected an array of rule ids, got ${describeValue(o)}`);
    else {
      o.forEach((id, i) => {
        const at = draft.rules.findIndex((r) => r.raw.id === id);
        if (at < 0) {
          const ids = draft.rules.map((r) => r.raw.id).filter((x): x is string => x !== undefined);
          c.add(`${p}[${i}]`, `the extended calendar has no rule with id ${describeValue(id)}${didYouMean(id, ids)}; its rule ids are ${ids.map((k) => JSON.stringify(k)).join(', ') || '(none)'}`);
        } else draft.rules.splice(at, 1);
      });
    }
  }
  const h = field('holidays');
  if (h !== undefined) {
    const p = joinPath(path, 'holidays');
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
            c.add(joinPath(raw.path, 'id'), `id ${JSON.stringify(raw.id)} is used by an earlier rule; ids must be unique`);
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
  // Loops, not spreads: a definition may list more one-offs than a call's arguments may hold.
  for (const x of readDatedEntries(field('additions'), joinPath(path, 'additions'), c)) draft.additions.push(x);
  for (const x of readDatedEntries(field('removals'), joinPath(path, 'removals'), c)) draft.removals.push(x);
  if (c.count > before) return undefined;
  return draft;
}

function finish(draft: Draft, path: string, c: Issues): CalendarNode | undefined {
  const before = c.count;
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
      c.add(
        joinPath(r.path, 'to'),
        `no rule of this calendar has id ${JSON.stringify(r.refId)}${didYouMean(r.refId, [...byId.keys()])}; ids are ${[...byId.keys()].map((k) => JSON.stringify(k)).join(', ') || '(none)'}`,
      );
    } else r.ref = target;
  }
  if (c.count > before) return undefined;
  // Topological order; detect cycles and check the total offset from each chain's base.
  const order: number[] = [];
  const state = new Int8Array(rules.length); // 0 new, 1 visiting, 2 done
  const totalOffset = new Float64Array(rules.length);
  const visit = (i: number, chain: number[]): void => {
    if (state[i] === 2) return;
    const r = rules[i]!;
    if (state[i] === 1) {
      const cycle = [...chain.slice(chain.indexOf(i)), i].map((k) => rules[k]!.id).join(' -> ');
      c.add(joinPath(r.path, 'to'), `relative rules form a cycle (${cycle}); one of them must be anchored to a date`);
      return;
    }
    state[i] = 1;
    if (r.kind === KIND_RELATIVE) {
      visit(r.ref, [...chain, i]);
      totalOffset[i] = totalOffset[r.ref]! + r.offset;
    } else totalOffset[i] = r.kind === KIND_EASTER ? r.offset : 0;
    if (Math.abs(totalOffset[i]!) > MAX_RULE_OFFSET) {
      c.add(
        joinPath(r.path, 'offset'),
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
      joinPath(draft.years.path, 'from'),
      `${easterRule!.path} uses the ${easterRule!.julian ? 'Julian' : 'Gregorian'} Easter computus, which starts in ${easterMin}; expected a year from ${easterMin}, got ${firstYear} (or give the rule "from": ${easterMin})`,
    );
  }
  if (firstYear > lastYear) c.add(draft.years.path, `the calendar covers no year: from ${firstYear} until ${lastYear}`);
  if (c.count > before) return undefined;
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

function nodeOf(def: unknown, path: string, c: Issues, stack: Set<unknown>): CalendarNode | undefined {
  const draft = draftOf(def, path, c, stack);
  return draft ? finish(draft, path, c) : undefined;
}

/** Validates a definition; returns its node and the issues found (empty when valid). */
export function normalizeDefinition(def: unknown): { node: CalendarNode | undefined; issues: readonly DefinitionIssue[] } {
  const c = new Issues();
  const node = nodeOf(def, '', c, new Set());
  return { node: c.count ? undefined : node, issues: c.list };
}

/**
 * Calendar profiles: one JSON document that composes a business's zone, week convention, fiscal years and units,
 * business calendars and frequency rules, validated as a whole and compiled into values every other function
 * takes. See docs/profiles.md.
 *
 * @module
 */
import { DefinitionError, KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../errors.js';
import { Issues, didYouMean, hasOwn, isRecord, joinPath } from '../diagnostics/index.js';
import { checkShape } from './shape.js';
import {
  type BusinessCalendar,
  type BusinessHours,
  type CalendarDefinition,
  type HoursDefinition,
  type PeriodUnit,
  type Rule,
  type RuleDefinition,
  type UnitDefinition,
  type Zone,
  BUNDLED_CALENDAR_NAMES,
  UnknownZoneError,
  calendarFromName,
  defineCalendar,
  defineHours,
  defineRule,
  defineUnit,
  dayNumberFromYmd,
  parsePlainDate,
  toZone,
  ymdFromDayNumber,
} from './deps.js';
import {
  CALENDAR_KINDS,
  type MonthFiscalYear,
  PROFILE_SHAPE,
  type ProfileDefinition,
  type ProfileLabels,
  type WeekFiscalYear,
} from './document.js';

/** The compiled export range of a profile's `warehouse` section. */
export interface ProfileWarehouseRange {
  /** First local day (day number, inclusive). */
  readonly start: number;
  /** End of the range (day number, exclusive). */
  readonly end: number;
  /** Zones of the transition table. */
  readonly zones: readonly Zone[];
  /** The calendar's name in the profile, or undefined when the profile has no calendar. */
  readonly calendarName: string | undefined;
}

/**
 * A compiled calendar profile: immutable, with every unit, calendar and rule ready for the other functions
 * (`periodFromDayNumber(profile.units['fiscal-quarter'], d)`, `isBusinessDay(profile.calendars.company, d)`).
 * Look entries up by name with {@link unitOfProfile}, {@link calendarOfProfile}, {@link ruleOfProfile} and
 * {@link hoursOfProfile}, which suggest the nearest name when one is misspelled.
 */
export interface Profile {
  /** The profile's id. */
  readonly id: string;
  /** The profile's name for people. */
  readonly name: string;
  /** The home zone. */
  readonly zone: Zone;
  /** The week convention as a unit: the ISO week, or weeks starting on the chosen weekday. */
  readonly week: PeriodUnit;
  /** The fiscal years as fiscal-year units, by name. */
  readonly fiscalYears: Readonly<Record<string, PeriodUnit>>;
  /** The units, by name. */
  readonly units: Readonly<Record<string, PeriodUnit>>;
  /** For each unit name, the name of the fiscal year it was derived from (fiscal units only). */
  readonly unitFiscalYears: Readonly<Record<string, string>>;
  /** The business calendars, by name. */
  readonly calendars: Readonly<Record<string, BusinessCalendar>>;
  /** The name of the calendar used where none is named, or undefined. */
  readonly defaultCalendarName: string | undefined;
  /** The frequency rules, by name. */
  readonly rules: Readonly<Record<string, Rule>>;
  /** The opening hours, by name (business time: sessions, cut-offs), each with the profile's calendar it names. */
  readonly hours: Readonly<Record<string, BusinessHours>>;
  /** Label settings for people, or undefined. */
  readonly labels: ProfileLabels | undefined;
  /** The export range of the `warehouse` section, or undefined. */
  readonly warehouse: ProfileWarehouseRange | undefined;
  /** The document as given (a frozen copy); `defineProfile(profile.definition)` gives the same profile. */
  readonly definition: ProfileDefinition;
}

const PROFILES = new WeakSet<Profile>();

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as object)) deepFreeze(v);
  }
  return value;
}

/** The issues of a nested definition error, re-prefixed with the path of the definition inside the profile. */
function reprefix(e: unknown, prefix: string, issues: Issues): void {
  if (e instanceof DefinitionError) {
    for (const i of e.issues) issues.add(nestedPath(prefix, i.path), i.message);
  } else if (e instanceof KalendsRangeError || e instanceof KalendsTypeError || e instanceof KalendsSyntaxError) {
    issues.add(e.path !== undefined ? nestedPath(prefix, e.path) : prefix, e.message);
  } else throw e;
}

/** Root spellings the layers' validators use for "the definition itself". */
const ROOT_PATHS = /* @__PURE__ */ new Set(['', '(definition)', 'definition', 'calendar', 'rule', 'unit']);

function nestedPath(prefix: string, path: string): string {
  if (ROOT_PATHS.has(path)) return prefix;
  return path.startsWith('[') ? `${prefix}${path}` : `${prefix}.${path}`;
}

/** True when no issue was recorded at `path` or inside it. */
function clean(issues: Issues, path: string): boolean {
  return !issues.list.some((i) => i.path === path || i.path.startsWith(`${path}.`) || i.path.startsWith(`${path}[`));
}

function entries(section: unknown): [string, unknown][] {
  return isRecord(section) ? Object.entries(section) : [];
}

function unknownName(what: string, received: string, names: readonly string[]): string {
  const listed = names.length > 0 ? names.map((n) => JSON.stringify(n)).join(', ') : '(none)';
  return `no ${what} named ${JSON.stringify(received)} in this profile${didYouMean(received, names)}; its ${what}s are ${listed}`;
}

interface Context {
  readonly doc: Record<string, unknown>;
  readonly issues: Issues;
  readonly fiscalYears: Record<string, PeriodUnit>;
  readonly units: Record<string, PeriodUnit>;
  readonly unitFiscalYears: Record<string, string>;
  readonly calendars: Record<string, BusinessCalendar>;
  readonly rules: Record<string, Rule>;
  readonly hours: Record<string, BusinessHours>;
}

/**
 * How the other sections reach the profile's calendars: a name (a profile calendar, compiled on demand, or a
 * bundled one), and an inline definition whose `extends` and `union` name them. Both return undefined after
 * recording an issue, or silently when the named calendar's own faults are reported under `calendars`.
 */
interface CalendarLinks {
  readonly resolve: (name: string, at: string) => BusinessCalendar | undefined;
  readonly link: (raw: Record<string, unknown>, path: string, self?: string) => Record<string, unknown> | undefined;
}

function compileZone(ctx: Context): Zone | undefined {
  const { doc, issues } = ctx;
  if (!clean(issues, 'zone')) return undefined;
  try {
    return toZone(doc['zone'] as string, 'zone');
  } catch (e) {
    if (e instanceof UnknownZoneError) {
      issues.add('zone', e.message.replace(/^zone: /, ''));
      return undefined;
    }
    reprefix(e, 'zone', issues);
    return undefined;
  }
}

function compileWeek(ctx: Context): PeriodUnit | undefined {
  if (!clean(ctx.issues, 'week')) return undefined;
  const w = ctx.doc['week'];
  return w === 'iso' ? defineUnit('iso-week') : defineUnit({ kind: 'week', firstWeekday: (w as { firstWeekday: never }).firstWeekday });
}

function compileFiscalYears(ctx: Context): void {
  for (const [name, fy] of entries(ctx.doc['fiscalYears'])) {
    const path = `fiscalYears.${name}`;
    if (!clean(ctx.issues, path)) continue;
    try {
      ctx.fiscalYears[name] = defineUnit({ kind: 'fiscal-year', ...(fy as object) } as UnitDefinition);
    } catch (e) {
      reprefix(e, path, ctx.issues);
    }
  }
}

function compileUnits(ctx: Context): void {
  const fiscalNames = Object.keys(isRecord(ctx.doc['fiscalYears']) ? ctx.doc['fiscalYears'] : {});
  for (const [name, raw] of entries(ctx.doc['units'])) {
    const path = `units.${name}`;
    if (!clean(ctx.issues, path)) continue;
    const def = raw as { kind: string; fiscalYear?: string; layout?: string };
    if ((CALENDAR_KINDS as readonly string[]).includes(def.kind)) {
      ctx.units[name] = defineUnit(def.kind as UnitDefinition['kind'] as never);
      continue;
    }
    const fyName = def.fiscalYear!;
    const fyRaw = isRecord(ctx.doc['fiscalYears']) && hasOwn(ctx.doc['fiscalYears'], fyName) ? ctx.doc['fiscalYears'][fyName] : undefined;
    if (fyRaw === undefined) {
      ctx.issues.add(joinPath(path, 'fiscalYear'), unknownName('fiscal year', fyName, fiscalNames));
      continue;
    }
    if (!hasOwn(ctx.fiscalYears, fyName)) continue; // its own faults are reported under fiscalYears
    const fy = fyRaw as MonthFiscalYear & WeekFiscalYear;
    const byWeeks = fy.yearEnd !== undefined;
    let consistent = true;
    if (!byWeeks && def.kind === 'fiscal-week') {
      ctx.issues.add(joinPath(path, 'kind'), `fiscal weeks need a 52/53-week fiscal year, but fiscal year ${JSON.stringify(fyName)} is made of calendar months (it has "start"); use a fiscal year with "yearEnd", or the profile's week convention`);
      consistent = false;
    }
    if (def.layout !== undefined && !byWeeks) {
      ctx.issues.add(joinPath(path, 'layout'), `fiscal year ${JSON.stringify(fyName)} is made of calendar months, so it has no week layout; remove "layout" here`);
      consistent = false;
    } else if (def.layout !== undefined && def.layout !== fy.layout) {
      ctx.issues.add(
        joinPath(path, 'layout'),
        `inconsistent with fiscal year ${JSON.stringify(fyName)}, whose layout is ${fy.layout === undefined ? 'not given' : JSON.stringify(fy.layout)}; a unit restates its fiscal year's layout, got ${JSON.stringify(def.layout)} (change the fiscal year's "layout" instead)`,
      );
      consistent = false;
    }
    if (byWeeks && fy.layout === undefined && (def.kind === 'fiscal-half' || def.kind === 'fiscal-quarter' || def.kind === 'fiscal-period')) {
      ctx.issues.add(
        joinPath(path, 'kind'),
        `a ${def.kind} of the 52/53-week fiscal year ${JSON.stringify(fyName)} needs the year's week layout: add "layout" ("4-4-5", "4-5-4", "5-4-4" or "13x4") to fiscalYears.${fyName}`,
      );
      consistent = false;
    }
    if (!consistent) continue;
    try {
      ctx.units[name] = defineUnit({ ...(fyRaw as object), kind: def.kind } as UnitDefinition);
      ctx.unitFiscalYears[name] = fyName;
    } catch (e) {
      reprefix(e, path, ctx.issues);
    }
  }
}

function compileCalendars(ctx: Context): CalendarLinks {
  const section = isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {};
  const own = Object.keys(section);
  const known = [...own, ...BUNDLED_CALENDAR_NAMES];
  const visiting = new Set<string>();
  const failed = new Set<string>();
  /** The compiled calendar a name refers to, compiling profile calendars on demand (undefined after an issue). */
  const resolve = (name: string, at: string): BusinessCalendar | undefined => {
    if (hasOwn(section, name)) return compileOne(name);
    if ((BUNDLED_CALENDAR_NAMES as readonly string[]).includes(name)) return calendarFromName(name);
    ctx.issues.add(at, `unknown calendar ${JSON.stringify(name)}${didYouMean(name, known)}; name one of the profile's calendars (${own.map((n) => JSON.stringify(n)).join(', ') || 'none'}) or a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')})`);
    return undefined;
  };
  /** A copy of an inline definition whose `extends` and `union` names are compiled calendars (`self` stays a name). */
  const link = (raw: Record<string, unknown>, path: string, self?: string): Record<string, unknown> | undefined => {
    const def = { ...raw };
    let ok = true;
    if (typeof def['extends'] === 'string' && def['extends'] !== self) {
      const parent = resolve(def['extends'], `${path}.extends`);
      if (parent) def['extends'] = parent;
      else ok = false;
    }
    if (Array.isArray(def['union'])) {
      def['union'] = def['union'].map((m: unknown, i: number) => {
        if (typeof m !== 'string' || m === self) return m;
        const member = resolve(m, `${path}.union[${i}]`);
        if (!member) ok = false;
        return member ?? m;
      });
    }
    return ok ? def : undefined;
  };
  const compileOne = (name: string): BusinessCalendar | undefined => {
    if (hasOwn(ctx.calendars, name)) return ctx.calendars[name];
    if (failed.has(name)) return undefined;
    const path = `calendars.${name}`;
    if (!clean(ctx.issues, path)) {
      failed.add(name);
      return undefined;
    }
    if (visiting.has(name)) {
      ctx.issues.add(path, `calendars refer to each other in a cycle (${[...visiting, name].join(' -> ')}); one of them must stand on its own`);
      failed.add(name);
      return undefined;
    }
    visiting.add(name);
    try {
      const raw = section[name];
      let cal: BusinessCalendar | undefined;
      if (typeof raw === 'string') {
        if (raw === name && !(BUNDLED_CALENDAR_NAMES as readonly string[]).includes(raw)) {
          ctx.issues.add(path, `a calendar cannot be another name for itself`);
        } else cal = raw === name ? calendarFromName(raw) : resolve(raw, path);
      } else {
        const def = link(raw as Record<string, unknown>, path, name);
        if (def) {
          try {
            cal = defineCalendar(def as unknown as CalendarDefinition);
          } catch (e) {
            reprefix(e, path, ctx.issues);
          }
        }
      }
      if (cal) ctx.calendars[name] = cal;
      else failed.add(name);
      return cal;
    } finally {
      visiting.delete(name);
    }
  };
  for (const name of own) compileOne(name);
  return { resolve, link };
}

function compileRules(ctx: Context): void {
  const calendarNames = Object.keys(isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {});
  for (const [name, raw] of entries(ctx.doc['rules'])) {
    const path = `rules.${name}`;
    if (!clean(ctx.issues, path)) continue;
    const def = { ...(raw as Record<string, unknown>) };
    const calName = def['calendar'];
    let placeholder = false;
    if (typeof calName === 'string') {
      if (!calendarNames.includes(calName)) ctx.issues.add(`${path}.calendar`, unknownName('calendar', calName, calendarNames));
      // A calendar with faults of its own (reported under calendars) or an unknown one: the rule's other fields are
      // still checked, against a calendar of weekends only, and the rule is not kept.
      const cal = ctx.calendars[calName];
      placeholder = cal === undefined;
      def['calendar'] = cal ?? defineCalendar({ id: 'placeholder' });
    }
    const unitName = def['unit'];
    if (def['kind'] === 'periods' && typeof unitName === 'string' && hasOwn(ctx.units, unitName)) def['unit'] = ctx.units[unitName];
    try {
      const rule = defineRule(def as unknown as RuleDefinition);
      if (!placeholder) ctx.rules[name] = rule;
    } catch (e) {
      reprefix(e, path, ctx.issues);
    }
  }
}

/**
 * Compiles each entry of `hours` with defineHours: the zone defaults to the profile's, and the calendar is a
 * bundled or profile calendar by name, or an inline definition linked to the profile's calendars.
 */
function compileHours(ctx: Context, zone: Zone | undefined, calendars: CalendarLinks): void {
  for (const [name, raw] of entries(ctx.doc['hours'])) {
    const path = `hours.${name}`;
    if (!clean(ctx.issues, path)) continue;
    const def = { ...(raw as Record<string, unknown>) };
    if (!hasOwn(def, 'zone')) {
      if (!zone) continue; // the profile's zone has a fault of its own, reported at "zone"
      def['zone'] = ctx.doc['zone'];
    }
    const cal = def['calendar'];
    let compiled: BusinessCalendar | Record<string, unknown> | undefined = undefined;
    if (typeof cal === 'string') compiled = calendars.resolve(cal, `${path}.calendar`);
    else if (isRecord(cal)) compiled = calendars.link(cal, `${path}.calendar`);
    // A calendar with faults (reported above): the hours' other fields are still checked, against a calendar that
    // closes no day, and the hours are not kept. Holiday names cannot be checked without the calendar.
    const placeholder = cal !== undefined && compiled === undefined;
    if (cal !== undefined) def['calendar'] = compiled ?? defineCalendar({ id: 'placeholder', weekend: [] });
    try {
      const hours = defineHours(def as unknown as HoursDefinition);
      if (!placeholder) ctx.hours[name] = hours;
    } catch (e) {
      if (placeholder && e instanceof DefinitionError) {
        for (const i of e.issues) if (!/^special\[\d+\]\.holiday$/.test(i.path)) ctx.issues.add(nestedPath(path, i.path), i.message);
      } else reprefix(e, path, ctx.issues);
    }
  }
}

function compileLabels(ctx: Context): ProfileLabels | undefined {
  const labels = ctx.doc['labels'];
  if (labels === undefined || !clean(ctx.issues, 'labels')) return undefined;
  const l = labels as ProfileLabels;
  try {
    const [canonical] = Intl.getCanonicalLocales(l.locale);
    if (Intl.DateTimeFormat.supportedLocalesOf([canonical!]).length === 0) {
      ctx.issues.add('labels.locale', `the runtime's Intl has no date data for ${JSON.stringify(l.locale)}, so month and weekday names would silently come from another locale; choose a locale it supports`);
    }
  } catch (e) {
    ctx.issues.add('labels.locale', `expected a BCP 47 language tag such as "en-US" or "de-DE", got ${describeValue(l.locale)} (${(e as Error).message})`);
  }
  const unitNames = Object.keys(isRecord(ctx.doc['units']) ? ctx.doc['units'] : {});
  for (const key of Object.keys(l.units ?? {})) {
    if (!unitNames.includes(key) && key !== 'week') ctx.issues.add(`labels.units.${key}`, unknownName('unit', key, [...unitNames, 'week']));
  }
  return l;
}

function compileWarehouse(ctx: Context, zone: Zone | undefined): ProfileWarehouseRange | undefined {
  const w = ctx.doc['warehouse'];
  if (w === undefined || !clean(ctx.issues, 'warehouse')) return undefined;
  const { start, end, zones, calendar } = w as { start: string; end: string; zones?: string[]; calendar?: string };
  const day = (text: string, key: string): number | undefined => {
    try {
      return parsePlainDate(text);
    } catch (e) {
      ctx.issues.add(`warehouse.${key}`, (e as Error).message.replace(/^[a-zA-Z]+: /, ''));
      return undefined;
    }
  };
  const s = day(start, 'start');
  const e = day(end, 'end');
  if (s !== undefined && e !== undefined && e <= s) ctx.issues.add('warehouse.end', `expected a date after start (${start}), got ${JSON.stringify(end)}`);
  const calName = calendar ?? defaultCalendarOf(ctx);
  if (calendar !== undefined && !hasOwn(isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {}, calendar)) {
    ctx.issues.add('warehouse.calendar', unknownName('calendar', calendar, Object.keys(isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {})));
  }
  const cal = calName !== undefined && hasOwn(ctx.calendars, calName) ? ctx.calendars[calName] : undefined;
  if (cal) {
    const firstYear = cal.firstYear;
    const lastYear = cal.lastYear;
    if (s !== undefined && ymdFromDayNumber(s).year < firstYear) ctx.issues.add('warehouse.start', `${start} is before the years ${firstYear}..${lastYear} that calendar ${JSON.stringify(calName)} supports; start in ${firstYear} or later`);
    if (e !== undefined && e > dayNumberFromYmd(lastYear, 12, 31) + 1) {
      ctx.issues.add('warehouse.end', `${end} is beyond the years ${firstYear}..${lastYear} that calendar ${JSON.stringify(calName)} supports; end on ${lastYear + 1}-01-01 at the latest`);
    }
  }
  const compiledZones: Zone[] = [];
  (zones ?? []).forEach((id, i) => {
    try {
      compiledZones.push(toZone(id, `warehouse.zones[${i}]`));
    } catch (err) {
      if (err instanceof UnknownZoneError) ctx.issues.add(`warehouse.zones[${i}]`, err.message.replace(/^[^:]+: /, ''));
      else reprefix(err, `warehouse.zones[${i}]`, ctx.issues);
    }
  });
  if (s === undefined || e === undefined) return undefined;
  return { start: s, end: e, zones: zones === undefined ? (zone ? [zone] : []) : compiledZones, calendarName: calName };
}

function defaultCalendarOf(ctx: Context): string | undefined {
  const d = ctx.doc['defaultCalendar'];
  if (typeof d === 'string') return d;
  const names = Object.keys(isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {});
  return names.length === 1 ? names[0] : undefined;
}

function checkNames(ctx: Context): void {
  const d = ctx.doc['defaultCalendar'];
  const names = Object.keys(isRecord(ctx.doc['calendars']) ? ctx.doc['calendars'] : {});
  if (typeof d === 'string' && clean(ctx.issues, 'defaultCalendar') && !names.includes(d)) ctx.issues.add('defaultCalendar', unknownName('calendar', d, names));
  if (isRecord(ctx.doc['units']) && hasOwn(ctx.doc['units'], 'week')) {
    ctx.issues.add('units.week', 'the name "week" is the profile\'s week convention (see "week"); give this unit another name');
  }
}

function readDocument(json: unknown): unknown {
  if (typeof json !== 'string') return json;
  try {
    return JSON.parse(json) as unknown;
  } catch (e) {
    throw new KalendsSyntaxError(`json: the profile is not valid JSON text (${(e as Error).message})`, { code: 'malformed', received: json });
  }
}

/**
 * Validates a calendar profile (a JSON document, parsed or as text) as a whole and compiles it. Every fault is
 * reported at once in one {@link DefinitionError} whose `issues` name the path of each, including faults inside
 * the nested unit, calendar and rule definitions (`rules.supplier-payments.on[0].day`): an unknown zone or
 * calendar name (with the nearest names), a unit inconsistent with its fiscal year, a rule that names a calendar
 * the profile lacks, an export range beyond the calendar's years.
 *
 * @example
 * ```ts
 * const profile = defineProfile({
 *   id: 'otterbrook', name: 'Otterbrook Tea & Spice Co.', zone: 'America/Chicago', week: 'iso',
 *   fiscalYears: { wholesale: { start: { month: 10, day: 1 }, naming: 'end-year' } },
 *   units: { 'fiscal-quarter': { kind: 'fiscal-quarter', fiscalYear: 'wholesale' } },
 *   calendars: { company: 'us-federal' },
 *   rules: { 'month-end-close': { kind: 'monthly', on: { businessDay: 'last' }, calendar: 'company' } },
 * });
 * formatPeriod(periodFromDayNumber(unitOfProfile(profile, 'fiscal-quarter'), dayNumberFromYmd(2025, 10, 1))); // 'FY2026-Q1'
 * ```
 */
export function defineProfile(json: ProfileDefinition | string): Profile {
  const doc = readDocument(json);
  const issues = new Issues();
  checkShape(doc, PROFILE_SHAPE, '', issues);
  if (!isRecord(doc)) issues.throwIfAny(json);
  const ctx: Context = {
    doc: doc as Record<string, unknown>,
    issues,
    // Tables without a prototype: a name such as "constructor" is never found in them unless it was defined.
    fiscalYears: Object.create(null) as Context['fiscalYears'],
    units: Object.create(null) as Context['units'],
    unitFiscalYears: Object.create(null) as Context['unitFiscalYears'],
    calendars: Object.create(null) as Context['calendars'],
    rules: Object.create(null) as Context['rules'],
    hours: Object.create(null) as Context['hours'],
  };
  const zone = compileZone(ctx);
  const week = compileWeek(ctx);
  compileFiscalYears(ctx);
  compileUnits(ctx);
  const calendarLinks = compileCalendars(ctx);
  checkNames(ctx);
  compileRules(ctx);
  compileHours(ctx, zone, calendarLinks);
  const labels = compileLabels(ctx);
  const warehouse = compileWarehouse(ctx, zone);
  issues.throwIfAny(json);
  const d = ctx.doc as unknown as ProfileDefinition;
  const profile: Profile = Object.freeze({
    id: d.id,
    name: d.name,
    zone: zone!,
    week: week!,
    fiscalYears: Object.freeze(ctx.fiscalYears),
    units: Object.freeze(ctx.units),
    unitFiscalYears: Object.freeze(ctx.unitFiscalYears),
    calendars: Object.freeze(ctx.calendars),
    defaultCalendarName: defaultCalendarOf(ctx),
    rules: Object.freeze(ctx.rules),
    hours: Object.freeze(ctx.hours),
    labels: labels === undefined ? undefined : deepFreeze(JSON.parse(JSON.stringify(labels)) as ProfileLabels),
    warehouse: warehouse === undefined ? undefined : Object.freeze({ ...warehouse, zones: Object.freeze([...warehouse.zones]) }),
    definition: deepFreeze(JSON.parse(JSON.stringify(d)) as ProfileDefinition),
  });
  PROFILES.add(profile);
  return profile;
}

/** @internal Throws a KalendsTypeError unless `value` is a profile made by {@link defineProfile}. */
export function requireProfile(value: unknown, name = 'profile'): Profile {
  if (typeof value === 'object' && value !== null && PROFILES.has(value as Profile)) return value as Profile;
  throw new KalendsTypeError(`${name}: expected a profile made by defineProfile(document), got ${describeValue(value)}`, {
    code: 'invalid-type',
    received: value,
  });
}

function lookup<T>(profile: Profile, table: Readonly<Record<string, T>>, what: string, name: unknown, param: string, extra: readonly string[] = []): T {
  if (typeof name !== 'string') {
    throw new KalendsTypeError(`${param}: expected the name of one of the profile's ${what}s, got ${describeValue(name)}`, { code: 'invalid-type', received: name });
  }
  if (hasOwn(table, name)) return table[name]!;
  const names = [...Object.keys(table), ...extra];
  throw new KalendsRangeError(`${param}: ${unknownName(what, name, names).replace(' in this profile', ` in profile ${JSON.stringify(profile.id)}`)}`, {
    code: 'unknown-name',
    received: name,
  });
}

/**
 * The profile's unit named `name` (`'week'` is the week convention's unit). An unknown name is a
 * KalendsRangeError with code `unknown-name` that suggests the nearest names.
 *
 * @example
 * ```ts
 * const quarter = unitOfProfile(profile, 'fiscal-quarter');
 * formatPeriod(periodFromDayNumber(quarter, dayNumberFromYmd(2025, 10, 1))); // 'FY2026-Q1'
 * ```
 */
export function unitOfProfile(profile: Profile, name: string): PeriodUnit {
  return unitNamed(requireProfile(profile), name, 'name');
}

/** @internal The profile's unit `name`, where `param` is the parameter that named it (for messages). */
export function unitNamed(p: Profile, name: unknown, param: string): PeriodUnit {
  if (name === 'week') return p.week;
  return lookup(p, p.units, 'unit', name, param, ['week']);
}

/**
 * The profile's business calendar named `name`, or its default calendar when `name` is omitted (a
 * KalendsRangeError when the profile has several calendars and names no default).
 *
 * @example
 * ```ts
 * isBusinessDay(calendarOfProfile(profile, 'company'), dayNumberFromYmd(2025, 7, 4)); // false
 * ```
 */
export function calendarOfProfile(profile: Profile, name?: string): BusinessCalendar {
  const p = requireProfile(profile);
  if (name === undefined) {
    if (p.defaultCalendarName === undefined) {
      throw new KalendsRangeError(
        `name: profile ${JSON.stringify(p.id)} has ${Object.keys(p.calendars).length} calendars and no "defaultCalendar"; name one of ${Object.keys(p.calendars).map((n) => JSON.stringify(n)).join(', ') || '(none)'}`,
        { code: 'unknown-name', received: name },
      );
    }
    return p.calendars[p.defaultCalendarName]!;
  }
  return calendarNamed(p, name, 'name');
}

/** @internal The profile's calendar `name`, where `param` is the parameter that named it (for messages). */
export function calendarNamed(p: Profile, name: unknown, param: string): BusinessCalendar {
  return lookup(p, p.calendars, 'calendar', name, param);
}

/**
 * The profile's frequency rule named `name`, compiled with the profile's calendars.
 *
 * @example
 * ```ts
 * listOccurrenceDayNumbers(ruleOfProfile(profile, 'month-end-close'), '2026-01-01', '2026-04-01').map(formatPlainDate);
 * // ['2026-01-30', '2026-02-27', '2026-03-31']
 * ```
 */
export function ruleOfProfile(profile: Profile, name: string): Rule {
  const p = requireProfile(profile);
  return lookup(p, p.rules, 'rule', name, 'name');
}

/**
 * The profile's opening hours named `name`, compiled with the profile's zone and calendars, ready for the hours
 * layer's functions (`isOpen`, `shiftBusinessTime`, `valueDayNumberOfEpochMs`, ...). An unknown name is a
 * KalendsRangeError with code `unknown-name` that suggests the nearest names.
 *
 * @example
 * ```ts
 * const desk = hoursOfProfile(profile, 'support-desk');
 * isOpen(desk, parseInstant('2025-11-26T21:30:00Z').epochMs); // false: 15:30 in Chicago, and the desk closes at 15:00 before Thanksgiving
 * ```
 */
export function hoursOfProfile(profile: Profile, name: string): BusinessHours {
  const p = requireProfile(profile);
  return lookup(p, p.hours, 'hours definition', name, 'name');
}

/**
 * The table of every public entry point: one row for each export of `kalends` (src/index.ts) and of the
 * `kalends/tzdata` and `kalends/warehouse` subpaths (src/tzdata/index.ts, src/warehouse/files.ts). surface.test.ts builds the list of exports from the modules
 * themselves and fails, naming the export, when one has no row here (or a row names no export).
 *
 * A function's row gives its parameters in order, each with its kind (kinds.ts: what a hostile value must give) and
 * a valid example; the shape of its result; and, where a rule can say what is right for an edge input, a check.
 * Constants and classes have rows of their own kinds. Rows are grouped by layer, in the order of src/index.ts.
 *
 * Adding an export: add its row here, in its layer's group. Options: list every key the function reads (the
 * surface test finds the keys a call reads and compares).
 */
import fc from 'fast-check';
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import * as k from '../../src/index.js';
import * as files from '../../src/warehouse/files.js';
import * as tzdata from '../../src/tzdata/index.js';
import {
  EITHER,
  anything,
  bool,
  compiled,
  dayNumber,
  definition,
  enumOf,
  epochMs,
  finite,
  integer,
  named,
  numbers,
  options,
  out,
  text,
  wallMs,
  type Expectation,
  type Kind,
} from './kinds.js';
import { PROTOTYPE_NAMES } from './hostile.js';

// ---------------------------------------------------------------------------------------------------------
// Row types

/** One positional parameter: the name messages use for it, its kind, and a valid example. */
export interface Param {
  readonly name: string;
  readonly kind: Kind;
  readonly example: () => unknown;
  /** The name messages give the parameter when it is not its declared name (toZone's `input` is "zone"). */
  readonly label?: string;
}

/** A result shape: a predicate and its description. */
export interface Shape {
  readonly what: string;
  readonly test: (v: unknown) => boolean;
}

export interface FunctionRow {
  readonly type: 'function';
  readonly params: readonly Param[];
  readonly returns: Shape;
  /** A rule the result must meet for the given arguments (undefined when it does), beyond its shape. */
  readonly check?: (result: unknown, args: readonly unknown[]) => string | undefined;
  /** The comparable form of a result, for `same` expectations (compiled values compare by behaviour). */
  readonly probe?: (result: unknown) => unknown;
  /** Names a message may start with besides the parameters' (an option's own name, a definition's root). */
  readonly names?: readonly string[];
  /** The parameter holding a plain-data definition whose fields the fuzz and sweep mutate. */
  readonly mutates?: number;
  /** The definition is data but not JSON (typed arrays are fine in it): non-JSON values need not be refused. */
  readonly notJson?: boolean;
  /** Leave the sweep's catalogue out of these parameters (they would write files outside the sandbox). */
  readonly sandboxed?: readonly number[];
}

export interface ConstantRow {
  readonly type: 'constant';
}

export interface ClassRow {
  readonly type: 'class';
  /** Valid constructor arguments. */
  readonly example: () => readonly unknown[];
  /** The built-in class it extends. */
  readonly base: typeof RangeError | typeof TypeError | typeof SyntaxError;
}

export type Row = FunctionRow | ConstantRow | ClassRow;

// ---------------------------------------------------------------------------------------------------------
// Shapes

const shape = (what: string, test: (v: unknown) => boolean): Shape => ({ what, test });
const isInt = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v);
const R = {
  dayNumber: shape('a day number', (v) => isInt(v) && v >= k.MIN_ZONED_DAY_NUMBER && v <= k.MAX_ZONED_DAY_NUMBER),
  integer: shape('an integer', isInt),
  number: shape('a number', (v) => typeof v === 'number' && !Number.isNaN(v)),
  epochMs: shape('an instant', (v) => typeof v === 'number' && Number.isFinite(v)),
  boolean: shape('a boolean', (v) => typeof v === 'boolean'),
  string: shape('a string', (v) => typeof v === 'string'),
  object: shape('an object', (v) => typeof v === 'object' && v !== null),
  array: shape('an array', Array.isArray),
  iterated: shape('a generator', (v) => typeof v === 'object' && v !== null && Array.isArray((v as { iterated?: unknown }).iterated)),
  typed: (ctor: new (n: number) => object) => shape(`a ${ctor.name}`, (v) => v instanceof ctor),
  orNull: (s: Shape) => shape(`${s.what} or null`, (v) => v === null || s.test(v)),
  void: shape('undefined', (v) => v === undefined),
  weekday: shape('a weekday 1..7', (v) => isInt(v) && v >= 1 && v <= 7),
};

const P = (name: string, kind: Kind, example: unknown, label?: string): Param => ({
  name,
  kind,
  example: typeof example === 'function' ? (example as () => unknown) : () => example,
  ...(label ? { label } : {}),
});
const fn = (params: readonly Param[], returns: Shape, extra: Omit<FunctionRow, 'type' | 'params' | 'returns'> = {}): FunctionRow => ({ type: 'function', params, returns, ...extra });
const CONSTANT: ConstantRow = { type: 'constant' };

const once = <T>(make: () => T): (() => T) => {
  let made: { v: T } | undefined;
  return () => (made ??= { v: make() }).v;
};

// ---------------------------------------------------------------------------------------------------------
// Valid values shared by the rows

const D2025 = 20_089; // 2025-01-01 (ECMA-262 Date.UTC(2025, 0, 1) / 86,400,000)
const T2025 = Date.UTC(2025, 0, 15, 12); // 2025-01-15T12:00Z

/** Where the table finds the repository (for fixtures), writes files (a temporary sandbox) and gets Temporal. */
export interface TableSetting {
  readonly root: string;
  readonly sandbox: string;
  readonly temporal: unknown;
}
let setting: TableSetting | undefined;
/** Sets where the table's examples find their fixtures and write their files; called once by each runner. */
export function configureTable(s: TableSetting): void {
  setting = s;
  mkdirSync(s.sandbox, { recursive: true });
}
const configured = (): TableSetting => {
  if (!setting) throw new Error('configureTable() was not called');
  return setting;
};
const SANDBOX = (): string => configured().sandbox;

const ZONE_NAMES = ['America/New_York', 'UTC', 'Europe/Dublin', 'Australia/Lord_Howe', '+05:30', 'Asia/Kolkata'];
const zoneKind = (o: { optional?: boolean } = {}): Kind =>
  named({
    label: 'zone',
    names: ZONE_NAMES,
    aliases: [
      ['Etc/UTC', 'UTC'],
      ['US/Eastern', 'America/New_York'],
    ],
    unknownCodes: ['unknown-zone'],
    object: (v) => (k.isZone(v) ? EITHER : reject('type', 'an object that is no Zone')),
    forged: [{ label: 'a copy of a Zone', make: () => ({ ...k.toZone('America/New_York') }) }],
    ...o,
  });
const unitKind = (o: { optional?: boolean } = {}): Kind =>
  named({
    label: 'unit',
    names: ['month', 'day', 'iso-week', 'quarter', 'half-year', 'year', k.MONTH_UNIT],
    aliases: [
      [k.MONTH_UNIT, 'month'],
      [k.QUARTER_UNIT, 'quarter'],
    ],
    unknownCodes: ['unknown-name'],
    object: () => EITHER,
    forged: [
      { label: 'a copy of a unit', make: () => ({ ...k.MONTH_UNIT }) },
      { label: 'a unit definition { kind: "constructor" }', make: () => ({ kind: 'constructor' }) },
    ],
    ...o,
  });
const calendarKind = (o: { optional?: boolean } = {}): Kind =>
  named({
    label: 'calendar',
    names: ['us-federal', 'england-and-wales', 'euro-t2'],
    aliases: [],
    unknownCodes: ['unknown-name'],
    object: () => EITHER,
    forged: [{ label: 'a copy of a compiled calendar', make: () => ({ ...k.calendarFromName('us-federal') }) }],
    ...o,
  });
function reject(cls: 'type' | 'range', why: string): Expectation {
  return { kind: 'reject', classes: [cls], why, ...(cls === 'type' ? { codes: ['invalid-type'] as const } : {}) };
}

const FISCAL_QUARTER = once(() => k.defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' } as k.UnitDefinition));
const PERIOD = once(() => k.periodFromDayNumber('month', D2025));
const periodKind = compiled('period', PERIOD);
const DURATION = once(() => k.parseDuration('P1M2DT3H'));
const durationKind = compiled('Duration', DURATION);
const DATE_DURATION = once(() => k.parseDuration('P1M2D'));
const US = once(() => k.calendarFromName('us-federal'));
const DATE_RULE = once(() => k.defineRule({ kind: 'monthly', on: { day: 15 }, start: '2025-01-01', count: 12, calendar: 'us-federal', convention: 'following' }));
const INSTANT_RULE = once(() => k.parseRecurrenceRule('DTSTART;TZID=America/New_York:20250310T090000\nRRULE:FREQ=DAILY;COUNT=20'));
const ruleKind = compiled('rule', DATE_RULE);
const instantRuleKind = compiled('rule', INSTANT_RULE);
const HOURS_DEFINITION = (): k.HoursDefinition => ({
  zone: 'America/New_York',
  calendar: 'us-federal',
  week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }], friday: [{ open: '22:00', close: '06:00' }] },
  cutoffs: { payments: '16:00' },
  allowCutoffsOutsideSessions: true,
});
const HOURS = once(() => k.defineHours(HOURS_DEFINITION()));
const hoursKind = compiled('hours', HOURS);
const SERIES = once(() => k.seriesFromColumns([T2025, T2025 + 3_600_000, T2025 + 86_400_000, T2025 + 3 * 86_400_000], { kg: [1, 2, 3, 4], eur: [5, 6, 7, 8] }));
const seriesKind = compiled('series', SERIES);
const BUCKETS = once(() => k.bucketSeries(SERIES(), { unit: 'day', zone: 'UTC', aggregations: ['sum', 'count'] }));
const bucketsKind = compiled('table', BUCKETS);
const PROFILE_DEFINITION = (): k.ProfileDefinition =>
  ({
    id: 'adversarial',
    name: 'Otterbrook Tea & Spice Co. (invented), trimmed',
    zone: 'America/Chicago',
    week: 'iso',
    fiscalYears: { wholesale: { start: { month: 10, day: 1 }, naming: 'end-year' } },
    units: { 'fiscal-quarter': { kind: 'fiscal-quarter', fiscalYear: 'wholesale' }, month: { kind: 'month' } },
    calendars: { company: 'us-federal' },
    defaultCalendar: 'company',
    rules: { 'month-end-close': { kind: 'monthly', on: { businessDay: 'last' }, calendar: 'company', label: 'Month-end close' } },
    hours: { desk: { calendar: 'company', week: { monday: [{ open: '08:00', close: '18:00' }], friday: [{ open: '08:00', close: '18:00' }] } } },
    labels: { locale: 'en-US', units: { 'fiscal-quarter': 'Q{index} FY{yearShort}' }, day: '{weekdayName}, {monthName} {day}, {year}' },
    warehouse: { start: '2026-01-01', end: '2026-01-15', zones: ['America/Chicago', 'Europe/Dublin'], calendar: 'company' },
  }) as unknown as k.ProfileDefinition;
const PROFILE = once(() => k.defineProfile(PROFILE_DEFINITION()));
const profileKind = compiled('profile', PROFILE);
const DIMENSION = once(() => k.dimensionTableFromProfile(PROFILE(), { start: '2026-01-01', end: '2026-01-08' }));
const tableKind = compiled('table', DIMENSION);
const YEAR_FRACTION = once(() => k.yearFractionOfDays('actual-360', D2025, D2025 + 90));
const TZIF = once(() => new Uint8Array(readFileSync(join(configured().root, 'test/fixtures/tzif/Europe/Dublin'))));

const dayNumbers = (o: { zoned?: boolean } = {}) => dayNumber(o);
const dayArray = () => numbers(() => [D2025, D2025 + 31, D2025 + 400, -1], dayNumber());
const instantArray = (fraction: 'floor' | 'keep' | 'either' = 'floor') => numbers(() => [T2025, T2025 + 86_400_000, 0, -1], epochMs({ fraction }));
const ymdInt = (min: number, max: number) => integer(min, max, { outside: 'either' });
const years = () => integer(k.MIN_YEAR, k.MAX_YEAR, { validMin: 1583, validMax: 3000 });
const free = (o: { optional?: boolean } = {}) => text(() => fc.string({ maxLength: 12 }), o);
const dateText = () => text(() => fc.constantFrom('2025-01-01', '2024-02-29', '+002025-06-30', '1970-01-01'));
const instantText = () => text(() => fc.constantFrom('2025-01-01T00:00:00Z', '2024-02-29T23:59:60Z', '2025-03-09T02:30:00-05:00[America/New_York]', '1970-01-01T00:00:00.123456789+00:00'));
const wallText = () => text(() => fc.constantFrom('2025-01-01T00:00', '2024-02-29T23:59:59.999', '2025-03-09T02:30:00'));
/** The parameter name a coercion gives its messages (toZone's and toUnit's `name`): messages start with it. */
const messageName = (label: string) => text(() => fc.constant(label), { optional: true });
const nested = (example: () => unknown, o: { optional?: boolean } = {}): Kind => ({
  name: 'a nested value',
  optional: o.optional,
  valid: () => fc.constant(null).map(() => example()),
  edges: () => [],
  expect: () => EITHER,
});
const PARSE_OPTIONS = {
  leapSecond: enumOf(['constrain', 'reject'], { optional: true, fallback: 'constrain' }),
  understoodKeys: nested(() => ['u-ca'], { optional: true }),
};
const limit = (max: number, fallback: number) => integer(1, max, { optional: true, fallback, validMax: 50 });
const inclusive = () => options({ inclusive: bool({ optional: true, fallback: false }) });
const rangeText = (kind: 'date' | 'instant') =>
  anything({ valid: () => (kind === 'date' ? fc.oneof(fc.constantFrom('2025-01-01', '2026-01-01'), fc.integer({ min: D2025 - 400, max: D2025 + 400 })) : fc.integer({ min: T2025 - 1e10, max: T2025 + 1e10 })) });

// Checks by rule (the result of an edge input compared with a rule, not with a stored value).
const roundTrip =
  (back: (r: unknown) => unknown, same: (a: unknown, b: unknown) => boolean = (a, b) => a === b) =>
  (r: unknown, args: readonly unknown[]): string | undefined => {
    const again = back(r);
    return same(again, args[0]) ? undefined : `round trip: ${String(args[0])} gave ${String(r)}, which gives back ${String(again)}`;
  };
const weekdayRule = (r: unknown, args: readonly unknown[]) =>
  r === ((((Math.floor(args[0] as number) + 3) % 7) + 7) % 7) + 1 ? undefined : `weekday of ${String(args[0])}: ${String(r)} (ISO 8601: 1970-01-01 was a Thursday)`;

// ---------------------------------------------------------------------------------------------------------
// The table

const civil: Record<string, Row> = {
  isLeapYear: fn([P('year', years(), 2024)], R.boolean, { check: (r, [y]) => (r === (((y as number) % 4 === 0 && (y as number) % 100 !== 0) || (y as number) % 400 === 0) ? undefined : 'Gregorian leap rule (ISO 8601-1 3.2.1)') }),
  dayCountOfMonth: fn([P('year', years(), 2024), P('month', integer(1, 12), 2)], R.integer),
  dayCountOfYear: fn([P('year', years(), 2024)], R.integer),
  dayNumberFromYmd: fn([P('year', years(), 2025), P('month', integer(1, 12), 1), P('day', ymdInt(1, 31), 1)], R.dayNumber, {
    check: (r, [y, m, d]) => {
      // ECMA-262 MakeDay through setUTCFullYear (Date.UTC would read years 0..99 as 1900..1999), within its range.
      if (Math.abs(y as number) > 270_000) return undefined;
      const date = new Date(0);
      date.setUTCFullYear(y as number, (m as number) - 1, d as number);
      const expected = date.getTime() / 86_400_000;
      return expected === r ? undefined : `ECMA-262 MakeDay gives ${expected}`;
    },
  }),
  ymdFromDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.object, { check: roundTrip((r) => { const x = r as k.Ymd; return k.dayNumberFromYmd(x.year, x.month, x.day); }) }),
  yearOfDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.integer),
  monthOfDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.integer),
  dayOfMonthOfDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.integer),
  ymdFromDayNumberBulk: fn(
    [
      P('dayNumbers', dayArray(), () => [D2025, D2025 + 31]),
      P('out', options({ years: out(Int32Array, 0, () => 2), months: out(Int32Array, 0, () => 2), days: out(Int32Array, 0, () => 2) }), undefined),
    ],
    R.object,
  ),
  dayNumberFromYmdBulk: fn(
    [
      P('years', numbers(() => [2025, 2024], integer(k.MIN_YEAR, k.MAX_YEAR)), () => [2025, 2024]),
      P('months', numbers(() => [1, 2], integer(1, 12)), () => [1, 2]),
      P('days', numbers(() => [1, 29], integer(1, 31)), () => [1, 29]),
      P('out', out(Int32Array, 0, () => 2), undefined),
    ],
    R.typed(Int32Array),
  ),
  weekdayOfDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.weekday, { check: weekdayRule }),
  dayOfYearOfDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.integer),
  dayNumberFromYearDay: fn([P('year', years(), 2025), P('dayOfYear', ymdInt(1, 366), 60)], R.dayNumber),
  isoWeekCountOfYear: fn([P('weekYear', years(), 2026)], R.integer, { check: (r) => (r === 52 || r === 53 ? undefined : 'ISO 8601 week-years have 52 or 53 weeks') }),
  isoWeekDateFromDayNumber: fn([P('dayNumber', dayNumbers(), D2025)], R.object, {
    check: roundTrip((r) => { const x = r as k.IsoWeekDate; return k.dayNumberFromIsoWeekDate(x.weekYear, x.week, x.weekday); }),
  }),
  // The week-years one beyond each end hold supported days (-271821-01-01 is in week 53 of -271822).
  dayNumberFromIsoWeekDate: fn([P('weekYear', integer(k.MIN_YEAR - 1, k.MAX_YEAR + 1, { validMin: 1583, validMax: 3000 }), 2025), P('week', ymdInt(1, 53), 1), P('weekday', integer(1, 7), 1)], R.dayNumber),
  WEEKDAY_NAMES: CONSTANT,
  easterDayNumberOfYear: fn([P('year', integer(k.EASTER_MIN_YEAR, k.MAX_YEAR, { validMax: 3000 }), 2025)], R.dayNumber, { check: (r) => (k.weekdayOfDayNumber(r as number) === 7 ? undefined : 'Easter is a Sunday') }),
  julianEasterDayNumberOfYear: fn([P('year', integer(k.JULIAN_EASTER_MIN_YEAR, k.MAX_YEAR, { validMax: 3000 }), 2025)], R.dayNumber, { check: (r) => (k.weekdayOfDayNumber(r as number) === 7 ? undefined : 'Easter is a Sunday') }),
  EASTER_MIN_YEAR: CONSTANT,
  JULIAN_EASTER_MIN_YEAR: CONSTANT,
};

const instant: Record<string, Row> = {
  parseExtendedDateTime: fn([P('text', instantText(), '2025-01-01T00:00:00Z'), P('options', options(PARSE_OPTIONS), undefined)], R.object),
  parseInstant: fn([P('text', instantText(), '2025-01-01T00:00:00Z'), P('options', options(PARSE_OPTIONS), undefined)], R.object, {
    check: (r) => {
      const t = (r as k.ParsedInstant).epochMs;
      return Number.isInteger(t) && t >= k.MIN_EPOCH_MS && t <= k.MAX_EPOCH_MS ? undefined : `epochMs ${t} is no whole instant in range`;
    },
  }),
  parsePlainDate: fn([P('text', dateText(), '2025-01-01')], R.dayNumber, { check: roundTrip((r) => k.parsePlainDate(k.formatPlainDate(r as number)), () => true) }),
  parsePlainDateTime: fn([P('text', wallText(), '2025-01-01T00:00'), P('options', options({ ...PARSE_OPTIONS, offset: enumOf(['reject', 'ignore'], { optional: true, fallback: 'reject' }) }), undefined)], R.epochMs),
  formatInstant: fn(
    [
      P('epochMs', epochMs({ fraction: 'floor' }), T2025),
      P(
        'options',
        options({
          offsetSeconds: integer(-k.MAX_OFFSET_SECONDS, k.MAX_OFFSET_SECONDS, { optional: true, validMin: -50_000, validMax: 50_000 }),
          fractionDigits: nested(() => 3, { optional: true }),
          zoneId: free({ optional: true }),
          zoneCritical: bool({ optional: true, fallback: false }),
          annotations: nested(() => [], { optional: true }),
        }),
        undefined,
      ),
    ],
    R.string,
    { check: (r, [t]) => (typeof t === 'number' && (r as string).endsWith('Z') && k.parseInstant(r as string).epochMs !== Math.floor(t) ? `parses back to ${k.parseInstant(r as string).epochMs}, not Math.floor(${t})` : undefined) },
  ),
  formatOffset: fn([P('offsetSeconds', integer(-k.MAX_OFFSET_SECONDS, k.MAX_OFFSET_SECONDS), -18_000)], R.string),
  formatPlainDate: fn([P('dayNumber', dayNumbers(), D2025)], R.string, { check: roundTrip((r) => k.parsePlainDate(r as string)) }),
  formatIsoWeekDate: fn([P('dayNumber', dayNumbers(), D2025)], R.string),
  formatOrdinalDate: fn([P('dayNumber', dayNumbers(), D2025)], R.string),
  formatPlainDateTime: fn([P('wallMs', wallMs({ fraction: 'floor' }), T2025), P('options', options({ fractionDigits: nested(() => 3, { optional: true }) }), undefined)], R.string),
  durationFromFields: fn([P('fields', nested(() => ({ months: 1, days: 2 })), { months: 1, days: 2 })], R.object, { names: ['fields'] }),
  negateDuration: fn([P('duration', durationKind, DURATION)], R.object),
  exactMsOfDuration: fn([P('duration', durationKind, () => k.parseDuration('PT3H'))], R.number),
  parseDuration: fn([P('text', text(() => fc.constantFrom('P1Y2M3DT4H5M6.789S', 'PT0S', '-P1W', 'P1D')), 'P1D')], R.object, { check: roundTrip((r) => k.formatDuration(k.parseDuration(k.formatDuration(r as k.Duration))), () => true) }),
  formatDuration: fn([P('duration', durationKind, DURATION)], R.string),
  shiftDayNumber: fn([P('dayNumber', dayNumbers(), D2025), P('duration', compiled('Duration', DATE_DURATION), DATE_DURATION), P('options', options({ overflow: enumOf(['constrain', 'reject'], { optional: true, fallback: 'constrain' }) }), undefined)], R.dayNumber),
  shiftWallMs: fn([P('wallMs', wallMs({ fraction: 'keep' }), T2025), P('duration', durationKind, DURATION), P('options', options({ overflow: enumOf(['constrain', 'reject'], { optional: true, fallback: 'constrain' }) }), undefined)], R.epochMs),
  toEpochMs: fn([P('value', anything({ valid: () => fc.oneof(fc.integer({ min: -1e12, max: 4e12 }), fc.constantFrom('2025-01-01T00:00:00Z', new Date(0))) }), '2025-01-01T00:00:00Z')], R.epochMs),
  toDayNumber: fn([P('value', anything({ valid: () => fc.oneof(fc.integer({ min: -1e5, max: 1e5 }), fc.constantFrom('2025-01-01')) }), '2025-01-01'), P('options', options({ dateFields: enumOf(['utc', 'local'], { optional: true }) }), undefined)], R.dayNumber),
  toWallMs: fn([P('value', anything({ valid: () => fc.oneof(fc.integer({ min: -1e12, max: 4e12 }), fc.constantFrom('2025-01-01T10:00')) }), '2025-01-01T10:00')], R.epochMs),
  temporalInstantFromEpochMs: fn([P('epochMs', epochMs({ fraction: 'either' }), T2025), P('temporal', nested(() => TEMPORAL()), () => TEMPORAL())], R.object),
  temporalPlainDateFromDayNumber: fn([P('dayNumber', dayNumbers(), D2025), P('temporal', nested(() => TEMPORAL()), () => TEMPORAL())], R.object),
  temporalPlainDateTimeFromWallMs: fn([P('wallMs', wallMs({ fraction: 'either' }), T2025), P('temporal', nested(() => TEMPORAL()), () => TEMPORAL())], R.object),
};

/** The Temporal namespace the temporal… conversions are given (temporal-polyfill, set by the runner). */
const TEMPORAL = () => configured().temporal;

const zone: Record<string, Row> = {
  UTC_ZONE: CONSTANT,
  zoneFromId: fn([P('id', free(), 'Europe/Dublin'), P('options', options({ source: nested(() => undefined, { optional: true }) }), undefined)], R.object),
  zoneFromOffset: fn([P('offset', nested(() => '+05:30'), '+05:30')], R.object),
  zoneFromTzif: fn([P('bytes', nested(TZIF), TZIF), P('id', free({ optional: true }), 'Europe/Dublin'), P('options', options({ tzRelease: free({ optional: true }) }), undefined)], R.object),
  zoneFromRules: fn([P('data', nested(() => ({ id: 'Example/Fixed', initialOffsetSeconds: 3600, transitionsSeconds: [0], offsetsSeconds: [7200] })), () => ({ id: 'Example/Fixed', initialOffsetSeconds: 3600, transitionsSeconds: [0], offsetsSeconds: [7200] }))], R.object, { mutates: 0, notJson: true }),
  toZone: fn([P('input', zoneKind(), 'Europe/Dublin', 'zone'), P('name', messageName('zone'), undefined)], R.object, { probe: (z) => (z as k.Zone).canonicalId }),
  isZone: fn([P('value', anything({ valid: () => fc.constant(k.UTC_ZONE) }), () => k.UTC_ZONE)], R.boolean),
  listZoneIds: fn([], R.array),
  clearZoneCache: fn([], R.void),
  offsetSecondsFromEpochMs: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.integer),
  wallMsFromEpochMs: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'keep' }), T2025)], R.epochMs),
  dayNumberFromEpochMs: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.dayNumber),
  wallFieldsFromEpochMs: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.object),
  resolveWallMs: fn([P('zone', zoneKind(), 'America/New_York'), P('wallMs', wallMs({ fraction: 'either' }), T2025)], R.object),
  epochMsFromWallMs: fn([P('zone', zoneKind(), 'America/New_York'), P('wallMs', wallMs({ fraction: 'keep' }), T2025), P('disambiguation', enumOf(['compatible', 'earlier', 'later', 'reject'], { optional: true, fallback: 'compatible' }), undefined)], R.epochMs),
  epochMsFromWallFields: fn(
    [P('zone', zoneKind(), 'America/New_York'), P('fields', nested(() => ({ year: 2025, month: 3, day: 9, hour: 2, minute: 30 })), () => ({ year: 2025, month: 3, day: 9, hour: 2, minute: 30 })), P('disambiguation', enumOf(['compatible', 'earlier', 'later', 'reject'], { optional: true, fallback: 'compatible' }), undefined)],
    R.epochMs,
  ),
  firstEpochMsOfDayNumber: fn([P('zone', zoneKind(), 'America/New_York'), P('dayNumber', dayNumbers({ zoned: true }), D2025)], R.epochMs),
  lengthMsOfDayNumber: fn([P('zone', zoneKind(), 'America/New_York'), P('dayNumber', dayNumbers({ zoned: true }), D2025)], R.integer),
  listTransitions: fn([P('zone', zoneKind(), 'America/New_York'), P('startEpochMs', epochMs({ fraction: 'floor' }), T2025), P('endEpochMs', epochMs({ fraction: 'floor' }), T2025 + 400 * 86_400_000), P('options', options({ limit: limit(k.MAX_TRANSITION_LIMIT, k.DEFAULT_TRANSITION_LIMIT) }), undefined)], R.array),
  nextTransition: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.orNull(R.object)),
  previousTransition: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.orNull(R.object)),
  INVALID_DAY_NUMBER: CONSTANT,
  dayNumberFromEpochMsBulk: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', instantArray(), () => [T2025, 0]), P('out', out(Int32Array, 1, () => 2), undefined), P('options', options({ invalid: enumOf(['throw', 'sentinel'], { optional: true, fallback: 'throw' }) }), undefined)], R.typed(Int32Array)),
  wallMsFromEpochMsBulk: fn([P('zone', zoneKind(), 'America/New_York'), P('epochMs', instantArray('keep'), () => [T2025, 0]), P('out', out(Float64Array, 1, () => 2), undefined), P('options', options({ invalid: enumOf(['throw', 'sentinel'], { optional: true, fallback: 'throw' }) }), undefined)], R.typed(Float64Array)),
  UnknownZoneError: { type: 'class', base: RangeError, example: () => ['zone', 'Mars/Base', []] },
  WallTimeRejectedError: { type: 'class', base: RangeError, example: () => ['wallMs: in a gap', 'gap', 'America/New_York', 0] },
  CorruptTzifError: { type: 'class', base: SyntaxError, example: () => ['bad magic', 0, new Uint8Array(4)] },
};

const period: Record<string, Row> = {
  defineUnit: fn([P('definition', definition(() => ({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }), { strings: true }), () => ({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }))], R.object, { mutates: 0, probe: (u) => (u as k.PeriodUnit).id, names: ['unit', 'definition'] }),
  toUnit: fn([P('input', unitKind(), 'month', 'unit'), P('name', messageName('unit'), undefined)], R.object, { probe: (u) => (u as k.PeriodUnit).id }),
  DAY_UNIT: CONSTANT,
  ISO_WEEK_UNIT: CONSTANT,
  MONTH_UNIT: CONSTANT,
  QUARTER_UNIT: CONSTANT,
  HALF_YEAR_UNIT: CONSTANT,
  YEAR_UNIT: CONSTANT,
  periodFromOrdinal: fn([P('unit', unitKind(), 'month'), P('ordinal', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: 0, validMax: 30_000 }), 2025 * 12)], R.object, { probe: periodProbe }),
  periodFromDayNumber: fn([P('unit', unitKind(), 'month'), P('dayNumber', dayNumbers(), D2025)], R.object, { probe: periodProbe }),
  shiftPeriod: fn([P('p', periodKind, PERIOD), P('n', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: -1000, validMax: 1000 }), 3)], R.object, { probe: periodProbe }),
  countPeriods: fn([P('a', periodKind, PERIOD), P('b', periodKind, () => k.periodFromDayNumber('month', D2025 + 400))], R.integer),
  comparePeriods: fn([P('a', periodKind, PERIOD), P('b', periodKind, () => k.periodFromDayNumber('month', D2025 + 400))], shape('-1, 0 or 1', (v) => v === -1 || v === 0 || v === 1)),
  firstDayNumberOfPeriod: fn([P('p', periodKind, PERIOD)], R.dayNumber),
  lastDayNumberOfPeriod: fn([P('p', periodKind, PERIOD)], R.dayNumber),
  firstDayNumberAfterPeriod: fn([P('p', periodKind, PERIOD)], R.dayNumber),
  lengthDaysOfPeriod: fn([P('p', periodKind, PERIOD)], R.integer),
  isDayNumberInPeriod: fn([P('p', periodKind, PERIOD), P('dayNumber', dayNumbers(), D2025)], R.boolean),
  formatPeriod: fn([P('p', periodKind, PERIOD)], R.string),
  parsePeriod: fn([P('unit', unitKind(), 'month'), P('text', text(() => fc.constantFrom('2025-01', '2025-12', '+275760-09', '-271821-04')), '2025-01')], R.object, { probe: periodProbe }),
  shiftPeriodYears: fn([P('p', periodKind, PERIOD), P('years', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: -100, validMax: 100 }), 1)], R.object, { probe: periodProbe }),
  listSubPeriods: fn([P('p', periodKind, () => k.periodFromDayNumber('quarter', D2025)), P('unit', unitKind(), 'month')], R.array, { probe: periodsProbe }),
  listOverlappingPeriods: fn([P('p', periodKind, PERIOD), P('unit', unitKind(), 'iso-week')], R.array, { probe: periodsProbe }),
  periodFromPeriod: fn([P('unit', unitKind(), 'quarter'), P('p', periodKind, PERIOD)], R.object, { probe: periodProbe }),
  ordinalFromDayNumberBulk: fn([P('unit', unitKind(), 'month'), P('dayNumbers', dayArray(), () => [D2025, D2025 + 40]), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
  formatOrdinalBulk: fn([P('unit', unitKind(), 'month'), P('ordinals', numbers(() => [24300, 24301, 0, -1], integer(-3_261_852, 3_309_131)), () => [24300, 24301])], R.array),
  firstDayNumberFromOrdinalBulk: fn([P('unit', unitKind(), 'month'), P('ordinals', numbers(() => [24300, 24301, 0, -1], integer(-3_261_852, 3_309_131)), () => [24300, 24301]), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
  periodFromEpochMs: fn([P('unit', unitKind(), 'month'), P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.object, { probe: periodProbe }),
  firstEpochMsOfPeriod: fn([P('p', periodKind, PERIOD), P('zone', zoneKind(), 'America/New_York')], R.epochMs),
  firstEpochMsAfterPeriod: fn([P('p', periodKind, PERIOD), P('zone', zoneKind(), 'America/New_York')], R.epochMs),
  isEpochMsInPeriod: fn([P('p', periodKind, PERIOD), P('zone', zoneKind(), 'America/New_York'), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.boolean),
  ordinalFromEpochMsBulk: fn(
    [P('unit', unitKind(), 'month'), P('zone', zoneKind(), 'America/New_York'), P('epochMs', instantArray(), () => [T2025, 0]), P('out', out(Int32Array, 2, () => 2), undefined), P('options', options({ invalid: enumOf(['throw', 'sentinel'], { optional: true, fallback: 'throw' }) }), undefined)],
    R.typed(Int32Array),
  ),
  INVALID_ORDINAL: CONSTANT,
};
/** A result that carries its zone and unit, compared by their canonical ids (an alias gives the same table). */
function zonedProbe(t: unknown): unknown {
  const x = t as { zone?: k.Zone; unit?: k.PeriodUnit };
  return { ...(t as object), zone: x.zone?.canonicalId, unit: x.unit?.id };
}
function periodProbe(p: unknown): unknown {
  const x = p as k.Period;
  return { unit: x.unit.id, ordinal: x.ordinal };
}
function periodsProbe(ps: unknown): unknown {
  return (ps as k.Period[]).map(periodProbe);
}

const CALENDAR_DEFINITION = () => ({
  id: 'adversarial',
  name: 'An invented calendar',
  extends: 'us-federal',
  holidays: [{ id: 'founders-day', name: 'Founders Day (invented)', kind: 'fixed', month: 3, day: 14, observance: { saturday: 'previous-non-weekend-day', sunday: 'next-non-weekend-day' } }],
});
const business: Record<string, Row> = {
  HOLIDAY_CAUTION: CONSTANT,
  BUSINESS_DAY_CONVENTIONS: CONSTANT,
  UnknownCalendarError: { type: 'class', base: RangeError, example: () => ['us-federl', 'calendar'] },
  defineCalendar: fn([P('definition', definition(CALENDAR_DEFINITION), CALENDAR_DEFINITION)], R.object, { mutates: 0, probe: calendarProbe }),
  calendarFromName: fn([P('name', calendarKind(), 'us-federal')], R.object, { probe: calendarProbe }),
  isBusinessDay: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumber', dayNumbers({}), D2025)], R.boolean),
  isBusinessDayBulk: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumbers', dayArray(), () => [D2025, D2025 + 5]), P('out', out(Uint8Array, 1, () => 2), undefined)], R.typed(Uint8Array)),
  countBusinessDaysBulk: fn([P('calendar', calendarKind(), 'us-federal'), P('start', dayArray(), () => [D2025, D2025 + 5]), P('end', dayArray(), () => [D2025 + 30, D2025 + 90]), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
  shiftBusinessDaysBulk: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumbers', dayArray(), () => [D2025, D2025 + 5]), P('n', anything({ valid: () => fc.oneof(fc.integer({ min: -1000, max: 1000 }), fc.constant([1, -2])) }), 10), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
  adjustDayNumberBulk: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumbers', dayArray(), () => [D2025, D2025 + 5]), P('convention', enumOf(['following', 'modified-following', 'preceding', 'modified-preceding', 'none']), 'following'), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
  nextBusinessDay: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumber', dayNumbers(), D2025)], R.dayNumber, { check: (r, [, d]) => ((r as number) > (d as number) ? undefined : 'next is strictly after') }),
  previousBusinessDay: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumber', dayNumbers(), D2025)], R.dayNumber, { check: (r, [, d]) => ((r as number) < (d as number) ? undefined : 'previous is strictly before') }),
  shiftBusinessDays: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumber', dayNumbers(), D2025), P('n', integer(-(2 ** 53), 2 ** 53, { outside: 'either', validMin: -1000, validMax: 1000 }), 10)], R.dayNumber),
  countBusinessDays: fn([P('calendar', calendarKind(), 'us-federal'), P('start', dayNumbers(), D2025), P('end', dayNumbers(), D2025 + 100)], R.integer, {
    check: (r, [c, s, e]) => (Math.sign(r as number) === -Math.sign(k.countBusinessDays(c as k.CalendarInput, e as number, s as number)) || r === 0 ? undefined : 'count(a, b) = -count(b, a) (docs/design.md, "Counting backwards")'),
  }),
  adjustDayNumber: fn([P('calendar', calendarKind(), 'us-federal'), P('dayNumber', dayNumbers(), D2025), P('convention', enumOf(['following', 'modified-following', 'preceding', 'modified-preceding', 'none']), 'following')], R.dayNumber),
  listHolidays: fn([P('calendar', calendarKind(), 'us-federal'), P('start', dayNumbers(), D2025), P('end', dayNumbers(), D2025 + 365)], R.array),
  nthBusinessDayOfRange: fn([P('calendar', calendarKind(), 'us-federal'), P('start', dayNumbers(), D2025), P('end', dayNumbers(), D2025 + 31), P('n', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: -25, validMax: 25 }), 1)], R.dayNumber),
  nthBusinessDayOfPeriod: fn([P('calendar', calendarKind(), 'us-federal'), P('period', periodKind, PERIOD), P('n', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: -25, validMax: 25 }), -1)], R.dayNumber),
  BUNDLED_CALENDAR_NAMES: CONSTANT,
  US_FEDERAL_HOLIDAYS: CONSTANT,
  ENGLAND_AND_WALES_BANK_HOLIDAYS: CONSTANT,
  EURO_T2_CLOSING_DAYS: CONSTANT,
};
function calendarProbe(c: unknown): unknown {
  const cal = c as k.BusinessCalendar;
  const days: boolean[] = [];
  for (let d = D2025; d < D2025 + 120; d++) days.push(k.isBusinessDay(cal, d));
  return days;
}

// Each convention refuses the options it does not use (code unsupported, docs/design.md), whatever their value: the
// options' own checks are those of the conventions that use them, so here any value may be refused.
const YF_OPTIONS = {
  couponsPerYear: nested(() => 2, { optional: true }),
  regularStart: nested(() => undefined, { optional: true }),
  regularEnd: nested(() => undefined, { optional: true }),
  terminationDayNumber: nested(() => undefined, { optional: true }),
  calendar: nested(() => undefined, { optional: true }),
};
const daycount: Record<string, Row> = {
  DAY_COUNT_CONVENTIONS: CONSTANT,
  DAY_COUNT_TRADE_NAMES: CONSTANT,
  COUPONS_PER_YEAR_VALUES: CONSTANT,
  yearFractionOfDays: fn([P('convention', enumOf(['actual-360', 'actual-365-fixed', 'thirty-360', 'actual-actual-isda', 'one-one']), 'actual-360'), P('start', dayNumbers(), D2025), P('end', dayNumbers(), D2025 + 90), P('options', options(YF_OPTIONS), undefined)], R.object),
  sumOfYearFractions: fn([P('fractions', nested(() => [YEAR_FRACTION(), YEAR_FRACTION()]), () => [YEAR_FRACTION(), YEAR_FRACTION()])], R.object),
  yearFractionOfDaysBulk: fn(
    [
      P('convention', enumOf(['actual-360', 'actual-365-fixed', 'thirty-360', 'actual-actual-isda']), 'actual-360'),
      P('starts', dayArray(), () => [D2025, D2025 + 10]),
      P('ends', dayArray(), () => [D2025 + 90, D2025 + 400]),
      P('out', out(Float64Array, 1, () => 2), undefined),
      P('options', options({ couponsPerYear: nested(() => 2, { optional: true }), regularStarts: nested(() => undefined, { optional: true }), regularEnds: nested(() => undefined, { optional: true }), terminationDayNumber: nested(() => undefined, { optional: true }), calendar: nested(() => undefined, { optional: true }) }), undefined),
    ],
    R.typed(Float64Array),
  ),
};

const RULE_DEFINITION = () => ({ kind: 'monthly', on: { day: 15 }, start: '2025-01-01', count: 12, calendar: 'us-federal', convention: 'following' });
/** An iterator's limit: any whole number (0 yields nothing; an iterator holds no list, so no cap applies). */
const ITERATE_LIMIT = () => integer(0, Number.MAX_SAFE_INTEGER, { optional: true, validMax: 50 });
const RANGE_OPTIONS = () => options({ endInclusive: bool({ optional: true, fallback: false }), maxCount: limit(k.MAX_OCCURRENCES, k.DEFAULT_MAX_OCCURRENCES) });
const ruleProbe = (r: unknown) => k.listOccurrenceDayNumbers(r as k.Rule, D2025 - 400, D2025 + 800, { maxCount: 50 });
const recurrence: Record<string, Row> = {
  defineRule: fn([P('definition', definition(RULE_DEFINITION), RULE_DEFINITION)], R.object, { mutates: 0, probe: (r) => { try { return ruleProbe(r); } catch { return 'instants'; } } }),
  listOccurrenceDayNumbers: fn([P('rule', ruleKind, DATE_RULE), P('start', rangeText('date'), '2025-01-01'), P('end', rangeText('date'), '2026-01-01'), P('options', RANGE_OPTIONS(), undefined)], R.array),
  listOccurrenceEpochMs: fn([P('rule', instantRuleKind, INSTANT_RULE), P('start', rangeText('instant'), T2025), P('end', rangeText('instant'), T2025 + 90 * 86_400_000), P('options', RANGE_OPTIONS(), undefined)], R.array),
  occurrenceDayNumberBulk: fn([P('rule', ruleKind, DATE_RULE), P('start', rangeText('date'), '2025-01-01'), P('end', rangeText('date'), '2026-01-01'), P('options', RANGE_OPTIONS(), undefined)], R.typed(Int32Array)),
  occurrenceEpochMsBulk: fn([P('rule', instantRuleKind, INSTANT_RULE), P('start', rangeText('instant'), T2025), P('end', rangeText('instant'), T2025 + 90 * 86_400_000), P('options', RANGE_OPTIONS(), undefined)], R.typed(Float64Array)),
  iterateOccurrenceDayNumbers: fn([P('rule', ruleKind, DATE_RULE), P('from', rangeText('date'), '2025-01-01'), P('options', options({ limit: ITERATE_LIMIT() }), undefined)], R.iterated),
  iterateOccurrenceEpochMs: fn([P('rule', instantRuleKind, INSTANT_RULE), P('from', rangeText('instant'), T2025), P('options', options({ limit: ITERATE_LIMIT() }), undefined)], R.iterated),
  nextOccurrenceDayNumber: fn([P('rule', ruleKind, DATE_RULE), P('from', rangeText('date'), '2025-03-01'), P('options', inclusive(), undefined)], R.orNull(R.dayNumber)),
  nextOccurrenceEpochMs: fn([P('rule', instantRuleKind, INSTANT_RULE), P('from', rangeText('instant'), T2025), P('options', inclusive(), undefined)], R.orNull(R.epochMs)),
  previousOccurrenceDayNumber: fn([P('rule', ruleKind, DATE_RULE), P('from', rangeText('date'), '2025-06-01'), P('options', inclusive(), undefined)], R.orNull(R.dayNumber)),
  previousOccurrenceEpochMs: fn([P('rule', instantRuleKind, INSTANT_RULE), P('from', rangeText('instant'), T2025 + 90 * 86_400_000), P('options', inclusive(), undefined)], R.orNull(R.epochMs)),
  isOccurrenceDayNumber: fn([P('rule', ruleKind, DATE_RULE), P('dayNumber', dayNumbers(), D2025 + 14)], R.boolean),
  isOccurrenceEpochMs: fn([P('rule', instantRuleKind, INSTANT_RULE), P('epochMs', epochMs({ fraction: 'floor' }), Date.UTC(2025, 2, 10, 13))], R.boolean),
  parseRecurrenceRule: fn([P('text', text(() => fc.constantFrom('FREQ=DAILY;COUNT=10', 'DTSTART:20250101T090000Z\nRRULE:FREQ=WEEKLY;BYDAY=MO,WE;COUNT=6', 'FREQ=MONTHLY;BYMONTHDAY=-1;UNTIL=20251231')), 'FREQ=DAILY;COUNT=10'), P('options', options({ start: free({ optional: true }), zone: free({ optional: true }) }), () => ({ start: '2025-01-01' }))], R.object, { probe: (r) => { try { return ruleProbe(r); } catch { return 'instants'; } } }),
  formatRecurrenceRule: fn([P('rule', ruleKind, () => k.defineRule({ kind: 'weekly', weekdays: ['monday'], start: '2025-01-06', count: 5 })), P('options', options({ start: nested(() => undefined, { optional: true }), newline: enumOf(['\n', '\r\n'], { optional: true, fallback: '\n' }) }), undefined)], R.string),
  defineSchedule: fn(
    [
      P(
        'options',
        options(
          {
            start: nested(() => '2025-01-15'),
            end: nested(() => '2027-01-15'),
            step: nested(() => ({ months: 6 })),
            stub: enumOf(['short-front', 'long-front', 'short-back', 'long-back'], { optional: true }),
            keepMonthEnd: bool({ optional: true }),
            calendar: calendarKind({ optional: true }),
            convention: enumOf(['following', 'modified-following', 'preceding', 'modified-preceding', 'none'], { optional: true }),
            payment: nested(() => ({ businessDaysAfter: 2, from: 'end', calendar: 'us-federal' }), { optional: true }),
            fixing: nested(() => ({ businessDaysBefore: 2, calendar: 'us-federal' }), { optional: true }),
            dayCount: nested(() => ({ convention: 'actual-360', accrueOn: 'adjusted' }), { optional: true }),
          },
          { optional: false, valid: () => ({ start: '2025-01-15', end: '2027-01-15', step: { months: 6 } }) },
        ),
        () => ({ start: '2025-01-15', end: '2027-01-15', step: { months: 6 } }),
      ),
    ],
    R.object,
  ),
  describeRule: fn([P('rule', ruleKind, DATE_RULE)], R.string),
  formatCalendar: fn(
    [
      P('events', nested(() => [{ rule: DATE_RULE(), summary: 'Supplier payments', uid: 'payments@example.invalid' }]), () => [{ rule: DATE_RULE(), summary: 'Supplier payments', uid: 'payments@example.invalid' }]),
      P(
        'options',
        options(
          {
            // Instants in any form toEpochMs takes (epoch ms, RFC 3339 text, Date, Temporal.Instant).
            stamp: anything({ valid: () => fc.constantFrom('2025-01-01T00:00:00Z', 1_735_689_600_000) }),
            from: anything({ valid: () => fc.constantFrom('2025-01-01T00:00:00Z', 1_735_689_600_000) }),
            to: anything({ valid: () => fc.constantFrom('2026-01-01T00:00:00Z', 1_767_225_600_000) }),
            form: enumOf(['rule', 'occurrences'], { optional: true }),
            productId: free({ optional: true }),
          },
          { optional: false, valid: () => ({ stamp: '2025-01-01T00:00:00Z', from: '2025-01-01T00:00:00Z', to: '2026-01-01T00:00:00Z', form: 'occurrences' }) },
        ),
        () => ({ stamp: '2025-01-01T00:00:00Z', from: '2025-01-01T00:00:00Z', to: '2026-01-01T00:00:00Z', form: 'occurrences' }),
      ),
    ],
    R.string,
  ),
  adjustmentOfOccurrence: fn([P('rule', ruleKind, DATE_RULE), P('dayNumber', dayNumbers(), D2025 + 14)], R.object),
  IMM_DATES: CONSTANT,
  CREDIT_ROLL_DATES: CONSTANT,
  MONTH_END_DATES: CONSTANT,
};

const NEAREST = () => inclusive();
const hours: Record<string, Row> = {
  HOURS_CAUTION: CONSTANT,
  NoSessionError: { type: 'class', base: RangeError, example: () => ['epochMs: no session', 0, 3660] },
  defineHours: fn([P('definition', definition(HOURS_DEFINITION), HOURS_DEFINITION)], R.object, { mutates: 0, probe: (h) => k.listSessions(h as k.BusinessHours, T2025, T2025 + 14 * 86_400_000) }),
  isOpen: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.boolean),
  sessionOfEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025)], R.orNull(R.object)),
  nextOpeningEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025), P('options', NEAREST(), undefined)], R.epochMs),
  nextClosingEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025), P('options', NEAREST(), undefined)], R.epochMs),
  previousOpeningEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025), P('options', NEAREST(), undefined)], R.epochMs),
  previousClosingEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025), P('options', NEAREST(), undefined)], R.epochMs),
  shiftBusinessTime: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'either' }), T2025), P('duration', nested(() => 'PT8H'), 'PT8H')], R.epochMs),
  countBusinessMs: fn([P('hours', hoursKind, HOURS), P('startEpochMs', epochMs({ fraction: 'either' }), T2025), P('endEpochMs', epochMs({ fraction: 'either' }), T2025 + 7 * 86_400_000)], R.number),
  valueDayNumberOfEpochMs: fn([P('hours', hoursKind, HOURS), P('epochMs', epochMs({ fraction: 'floor' }), T2025), P('cutoff', cutoffKind(), 'payments')], R.dayNumber),
  cutoffEpochMsOfDayNumber: fn([P('hours', hoursKind, HOURS), P('dayNumber', dayNumbers(), D2025 + 12), P('cutoff', cutoffKind(), 'payments')], R.orNull(R.epochMs)),
  listSessions: fn([P('hours', hoursKind, HOURS), P('startEpochMs', epochMs({ fraction: 'either' }), T2025), P('endEpochMs', epochMs({ fraction: 'either' }), T2025 + 14 * 86_400_000), P('options', options({ limit: limit(k.MAX_HOURS_LIST_LIMIT, k.HOURS_LIST_LIMIT) }), undefined)], R.array),
  isOpenBulk: fn([P('hours', hoursKind, HOURS), P('epochMs', instantArray(), () => [T2025, T2025 + 3_600_000]), P('out', out(Uint8Array, 1, () => 2), undefined)], R.typed(Uint8Array)),
  countBusinessMsBulk: fn([P('hours', hoursKind, HOURS), P('startEpochMs', instantArray(), () => [T2025, T2025]), P('endEpochMs', instantArray(), () => [T2025 + 86_400_000, T2025 + 2 * 86_400_000]), P('out', out(Float64Array, 1, () => 2), undefined)], R.typed(Float64Array)),
  nextOpeningEpochMsBulk: fn([P('hours', hoursKind, HOURS), P('epochMs', instantArray(), () => [T2025, T2025 + 3_600_000]), P('out', out(Float64Array, 1, () => 2), undefined), P('options', NEAREST(), undefined)], R.typed(Float64Array)),
  nextClosingEpochMsBulk: fn([P('hours', hoursKind, HOURS), P('epochMs', instantArray(), () => [T2025, T2025 + 3_600_000]), P('out', out(Float64Array, 1, () => 2), undefined), P('options', NEAREST(), undefined)], R.typed(Float64Array)),
  shiftBusinessTimeBulk: fn([P('hours', hoursKind, HOURS), P('epochMs', instantArray('keep'), () => [T2025, T2025 + 3_600_000]), P('duration', nested(() => 'PT8H'), 'PT8H'), P('out', out(Float64Array, 1, () => 2), undefined)], R.typed(Float64Array)),
  valueDayNumberOfEpochMsBulk: fn([P('hours', hoursKind, HOURS), P('epochMs', instantArray(), () => [T2025, T2025 + 3_600_000]), P('cutoff', cutoffKind(), 'payments'), P('out', out(Int32Array, 1, () => 2), undefined)], R.typed(Int32Array)),
};
function cutoffKind(): Kind {
  return named({ label: 'cutoff', names: ['payments'], unknownCodes: ['unknown-name'] });
}

const seriesColumns = () => nested(() => ({ kg: [1, 2, 3, 4] }));
const series: Record<string, Row> = {
  // Instants are kept as given (fractions too) and ordered by their values: no floor equivalence here.
  seriesFromColumns: fn([P('epochMs', instantArray('either'), () => [T2025, T2025 + 1000]), P('columns', nested(() => ({ kg: [1, 2] }), { optional: true }), () => ({ kg: [1, 2] })), P('options', options({ inputOrder: enumOf(['any', 'sorted'], { optional: true, fallback: 'any' }) }), undefined)], R.object),
  seriesFromRecords: fn([P('records', nested(() => [{ at: 1000, value: 4 }, { at: '2025-01-01T00:00:00Z', value: 5 }]), () => [{ at: 1000, value: 4 }, { at: '2025-01-01T00:00:00Z', value: 5 }]), P('options', options({ at: free({ optional: true }), columns: nested(() => ['value'], { optional: true }), inputOrder: enumOf(['any', 'sorted'], { optional: true, fallback: 'any' }) }), undefined)], R.object),
  seriesFromPairs: fn([P('pairs', nested(() => [[1000, 2], ['2025-01-01T00:00:00Z', 3]]), () => [[1000, 2], ['2025-01-01T00:00:00Z', 3]]), P('options', options({ column: free({ optional: true }), inputOrder: enumOf(['any', 'sorted'], { optional: true, fallback: 'any' }) }), undefined)], R.object),
  columnOfSeries: fn([P('series', seriesKind, SERIES), P('column', named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }), 'kg')], R.typed(Float64Array)),
  seriesFromSeries: fn([P('series', seriesKind, SERIES), P('columns', seriesColumns(), () => ({ doubled: [2, 4, 6, 8] }))], R.object),
  sliceSeries: fn([P('series', seriesKind, SERIES), P('startEpochMs', epochMs({ fraction: 'either' }), T2025), P('endEpochMs', epochMs({ fraction: 'either' }), T2025 + 2 * 86_400_000)], R.object),
  AGGREGATION_NAMES: CONSTANT,
  bucketSeries: fn(
    [
      P('series', seriesKind, SERIES),
      P(
        'options',
        options(
          {
            unit: unitKind(),
            zone: zoneKind(),
            aggregations: nested(() => ['sum', 'count']),
            column: named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }),
            range: nested(() => ({ start: '2025-01-14', end: '2025-01-20' }), { optional: true }),
            empty: enumOf(['nan', 'zero', 'previous'], { optional: true, fallback: 'nan' }),
            missing: enumOf(['skip', 'propagate'], { optional: true, fallback: 'skip' }),
            maxRows: integer(1, k.MAX_BUCKET_PERIODS, { optional: true, validMax: 1000 }),
          },
          { optional: false, valid: () => ({ unit: 'day', zone: 'UTC', aggregations: ['sum', 'count'] }) },
        ),
        () => ({ unit: 'day', zone: 'UTC', aggregations: ['sum', 'count'] }),
      ),
    ],
    R.object,
    { probe: zonedProbe },
  ),
  seriesFromBuckets: fn([P('table', bucketsKind, BUCKETS)], R.object),
  // Its options are a definition (define…): every fault is one DefinitionError with paths.
  defineBucketAccumulator: fn([P('options', definition(() => ({ unit: 'month', zone: 'UTC', aggregations: ['sum'], missing: 'skip' })), () => ({ unit: 'month', zone: 'UTC', aggregations: ['sum'], missing: 'skip' }))], R.object, { mutates: 0 }),
  rollSeries: fn(
    [
      P('series', seriesKind, SERIES),
      P(
        'options',
        options(
          {
            window: nested(() => ({ rows: 2 })),
            aggregations: nested(() => ['mean']),
            column: named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }),
            minObservations: integer(1, 2 ** 31, { optional: true, outside: 'either', validMax: 5 }),
            startInclusive: bool({ optional: true }),
            endInclusive: bool({ optional: true }),
          },
          { optional: false, valid: () => ({ window: { rows: 2 }, aggregations: ['mean'] }) },
        ),
        () => ({ window: { rows: 2 }, aggregations: ['mean'] }),
      ),
    ],
    R.object,
  ),
  rollBulk: fn(
    [
      P('epochMs', instantArray('either'), () => [1000, 2000, 3000, 4000]),
      P('values', numbers(() => [1, 2, 3, 4], finite(-1e300, 1e300)), () => [1, 2, 3, 4]),
      P('options', options({ window: nested(() => ({ rows: 2 })), aggregation: nested(() => 'mean'), minObservations: integer(1, 2 ** 31, { optional: true, outside: 'either', validMax: 5 }), startInclusive: bool({ optional: true }), endInclusive: bool({ optional: true }) }, { optional: false, valid: () => ({ window: { rows: 2 }, aggregation: 'mean' }) }), () => ({ window: { rows: 2 }, aggregation: 'mean' })),
      P('out', out(Float64Array, 0, () => 4), undefined),
    ],
    R.typed(Float64Array),
  ),
  smoothSeries: fn(
    [
      P('series', seriesKind, SERIES),
      P(
        'options',
        options(
          {
            alpha: finite(0, 1, { optional: true }),
            equivalentWindowRows: nested(() => undefined, { optional: true }),
            halfLife: nested(() => undefined, { optional: true }),
            halfLifeMs: nested(() => undefined, { optional: true }),
            form: nested(() => undefined, { optional: true }),
            column: named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }),
            as: free({ optional: true }),
            minObservations: integer(1, 2 ** 31, { optional: true, outside: 'either', validMax: 5 }),
          },
          { optional: false, valid: () => ({ alpha: 0.5 }) },
        ),
        () => ({ alpha: 0.5 }),
      ),
    ],
    R.object,
  ),
  lagSeries: fn([P('series', seriesKind, SERIES), P('by', nested(() => ({ rows: 1 })), () => ({ rows: 1 })), P('options', options({ column: named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }), as: free({ optional: true }) }), undefined)], R.object),
  leadSeries: fn([P('series', seriesKind, SERIES), P('by', nested(() => ({ rows: 1 })), () => ({ rows: 1 })), P('options', options({ column: named({ label: 'column', names: ['kg', 'eur'], unknownCodes: ['unknown-name'], optional: true }), as: free({ optional: true }) }), undefined)], R.object),
  periodChangeFromBuckets: fn([P('table', bucketsKind, BUCKETS), P('options', options({ column: named({ label: 'column', names: ['sum', 'count'], unknownCodes: ['unknown-name'], optional: true }), against: enumOf(['previous', 'year-earlier'], { optional: true, fallback: 'previous' }) }), undefined)], R.object),
  matchAsOf: fn([P('leftEpochMs', instantArray('either'), () => [5, 10, 20]), P('rightEpochMs', instantArray('either'), () => [0, 10, 11]), P('options', options({ toleranceMs: nested(() => 4, { optional: true }) }), undefined)], R.typed(Int32Array)),
  joinAsOf: fn([P('left', seriesKind, SERIES), P('right', seriesKind, () => k.seriesFromColumns([T2025 - 1000, T2025 + 5000], { price: [10, 11] })), P('options', options({ toleranceMs: nested(() => 86_400_000, { optional: true }), columns: nested(() => ['price'], { optional: true }), prefix: free({ optional: true }) }), undefined)], R.object),
  alignSeries: fn(
    [
      P('series', nested(() => ({ a: SERIES(), b: SERIES() })), () => ({ a: SERIES(), b: SERIES() })),
      P('options', options({ unit: unitKind(), zone: zoneKind(), aggregation: nested(() => 'sum', { optional: true }), range: nested(() => undefined, { optional: true }), maxRows: integer(1, k.MAX_BUCKET_PERIODS, { optional: true, validMax: 1000 }) }, { optional: false, valid: () => ({ unit: 'day', zone: 'UTC', aggregation: 'sum' }) }), () => ({ unit: 'day', zone: 'UTC', aggregation: 'sum' })),
    ],
    R.object,
    { probe: zonedProbe },
  ),
  fillSeries: fn(
    [
      P('series', seriesKind, SERIES),
      P(
        'options',
        options(
          {
            grid: nested(() => ({ unit: 'day', zone: 'UTC', range: { start: '2025-01-14', end: '2025-01-20' } })),
            method: enumOf(['previous', 'next', 'linear'], { optional: true, fallback: 'previous' }),
            maxGapMs: nested(() => undefined, { optional: true }),
            columns: nested(() => undefined, { optional: true }),
            maxRows: integer(1, k.MAX_BUCKET_PERIODS, { optional: true, validMax: 1000 }),
          },
          { optional: false, valid: () => ({ grid: { unit: 'day', zone: 'UTC', range: { start: '2025-01-14', end: '2025-01-20' } } }) },
        ),
        () => ({ grid: { unit: 'day', zone: 'UTC', range: { start: '2025-01-14', end: '2025-01-20' } } }),
      ),
    ],
    R.object,
  ),
};

const profile: Record<string, Row> = {
  LABEL_FIELD_NAMES: CONSTANT,
  defineProfile: fn([P('json', definition(PROFILE_DEFINITION, { strings: true }), PROFILE_DEFINITION)], R.object, { mutates: 0, probe: (p) => (p as k.Profile).id }),
  unitOfProfile: fn([P('profile', profileKind, PROFILE), P('name', named({ label: 'name', names: ['fiscal-quarter', 'month'], unknownCodes: ['unknown-name'] }), 'fiscal-quarter')], R.object, { probe: (u) => (u as k.PeriodUnit).id }),
  calendarOfProfile: fn([P('profile', profileKind, PROFILE), P('name', named({ label: 'name', names: ['company'], unknownCodes: ['unknown-name'], optional: true }), 'company')], R.object, { probe: calendarProbe }),
  ruleOfProfile: fn([P('profile', profileKind, PROFILE), P('name', named({ label: 'name', names: ['month-end-close'], unknownCodes: ['unknown-name'] }), 'month-end-close')], R.object, { probe: ruleProbe }),
  hoursOfProfile: fn([P('profile', profileKind, PROFILE), P('name', named({ label: 'name', names: ['desk'], unknownCodes: ['unknown-name'] }), 'desk')], R.object, { probe: (h) => k.isOpen(h as k.BusinessHours, T2025) }),
  formatLabelForPeople: fn([P('profile', profileKind, PROFILE), P('unitName', named({ label: 'unitName', names: ['fiscal-quarter', 'month'], unknownCodes: ['unknown-name'] }), 'fiscal-quarter'), P('ordinal', integer(-(2 ** 31), 2 ** 31, { outside: 'either', validMin: 8000, validMax: 8200 }), () => FISCAL_QUARTER().ordinalFromDayNumber(D2025))], R.string),
  formatDayForPeople: fn([P('profile', profileKind, PROFILE), P('dayNumber', dayNumbers(), D2025)], R.string),
};

const RANGE = () => options({ start: nested(() => '2026-01-01', { optional: true }), end: nested(() => '2026-01-08', { optional: true }) });
const warehouse: Record<string, Row> = {
  dimensionTableFromProfile: fn([P('profile', profileKind, PROFILE), P('options', options({ start: nested(() => '2026-01-01', { optional: true }), end: nested(() => '2026-01-08', { optional: true }), calendar: named({ label: 'calendar', names: ['company'], unknownCodes: ['unknown-name'], optional: true }) }, { valid: () => ({ start: '2026-01-01', end: '2026-01-08' }) }), () => ({ start: '2026-01-01', end: '2026-01-08' }))], R.object, {}),
  transitionTableFromZones: fn([P('zones', nested(() => ['Europe/Dublin', 'America/New_York']), () => ['Europe/Dublin', 'America/New_York']), P('startEpochMs', epochMs({ fraction: 'floor' }), T2025), P('endEpochMs', epochMs({ fraction: 'floor' }), T2025 + 400 * 86_400_000)], R.object),
  scheduleTableFromProfile: fn([P('profile', profileKind, PROFILE), P('options', RANGE(), () => ({ start: '2026-01-01', end: '2026-03-01' }))], R.object),
  formatTableCsv: fn([P('table', tableKind, DIMENSION)], R.string),
  formatTableJsonLines: fn([P('table', tableKind, DIMENSION)], R.string),
  formatLoadSql: fn([P('tables', nested(() => [DIMENSION()]), () => [DIMENSION()]), P('options', options({ dialect: enumOf(['duckdb', 'postgresql']), format: enumOf(['csv', 'parquet']), directory: free({ optional: true }) }, { optional: false, valid: () => ({ dialect: 'duckdb', format: 'csv' }) }), () => ({ dialect: 'duckdb', format: 'csv' }))], R.string),
  formatExampleQueriesSql: fn([P('dimension', tableKind, DIMENSION), P('options', options({ labelColumns: nested(() => undefined, { optional: true }), groupBy: nested(() => undefined, { optional: true }) }), undefined)], R.string),
};

/** The rows of `kalends` (src/index.ts). */
export const CORE_TABLE: Readonly<Record<string, Row>> = {
  // errors.ts
  KalendsRangeError: { type: 'class', base: RangeError, example: () => ['x: out of range', { code: 'out-of-range', received: 1 }] },
  KalendsTypeError: { type: 'class', base: TypeError, example: () => ['x: wrong type', { code: 'invalid-type', received: 1 }] },
  KalendsSyntaxError: { type: 'class', base: SyntaxError, example: () => ['x: malformed', { code: 'malformed', received: 'x' }] },
  DefinitionError: { type: 'class', base: RangeError, example: () => [[{ path: 'kind', message: 'expected a kind' }], {}] },
  // bounds.ts: every limit is a constant row
  ...Object.fromEntries(
    [
      'MIN_YEAR', 'MAX_YEAR', 'MIN_DAY_NUMBER', 'MAX_DAY_NUMBER', 'MIN_EPOCH_MS', 'MAX_EPOCH_MS', 'MS_PER_DAY', 'MAX_OFFSET_SECONDS',
      'MAX_DURATION_CALENDAR_FIELD', 'MAX_CYCLE_DAYS', 'MIN_ZONED_DAY_NUMBER', 'MAX_ZONED_DAY_NUMBER', 'ZONE_CACHE_LIMIT', 'UNIT_CACHE_LIMIT',
      'MAX_LIST_LENGTH', 'MAX_TRANSITION_WALK_YEARS', 'DEFAULT_TRANSITION_LIMIT', 'MAX_TRANSITION_LIMIT', 'MAX_LISTED_HOLIDAYS',
      'MAX_SUBSTITUTE_SEARCH', 'MAX_EMPTY_YEARS', 'MAX_WINDOW_YEARS', 'MAX_EVALUATED_YEARS', 'MAX_RULE_OFFSET', 'MAX_COUNT',
      'MAX_LISTED_COUNT', 'DEFAULT_MAX_OCCURRENCES', 'MAX_OCCURRENCES', 'MAX_RFC5545_INTERVAL', 'MAX_SCHEDULE_PERIODS', 'MAX_RULE_EVERY',
      'MAX_RULE_EVERY_PERIODS', 'MAX_ADJUSTMENT_DAYS', 'MAX_BUCKET_PERIODS', 'MAX_SERIES_ROWS', 'HOURS_DEFAULT_FIRST_YEAR',
      'HOURS_DEFAULT_LAST_YEAR', 'MAX_HOURS_INTERVALS_PER_DAY', 'MAX_HOURS_SPECIAL_DAYS', 'MAX_HOURS_CUTOFFS', 'MAX_HOURS_HOLIDAY_OFFSET',
      'HOURS_SEARCH_LIMIT_DAYS', 'HOURS_TABLE_MAX_YEARS', 'HOURS_LIST_LIMIT', 'MAX_HOURS_LIST_LIMIT', 'MAX_DIMENSION_DAYS', 'MAX_LAG_BUSINESS_DAYS',
    ].map((name) => [name, CONSTANT]),
  ),
  ...civil,
  ...instant,
  ...zone,
  ...period,
  ...business,
  ...daycount,
  ...recurrence,
  ...hours,
  ...series,
  ...profile,
  ...warehouse,
};

/** The rows of `kalends/warehouse` (src/warehouse/files.ts). */
export const WAREHOUSE_TABLE: Readonly<Record<string, Row>> = {
  parquetFromTable: fn([P('table', tableKind, DIMENSION)], R.typed(Uint8Array)),
  writeFilesAtomically: fn([P('directory', sandboxPath(), () => join(SANDBOX(), 'atomic')), P('files', nested(() => [{ name: 'a.csv', content: () => 'x\n' }]), () => [{ name: 'a.csv', content: () => 'x\n' }])], R.array, { sandboxed: [0] }),
  writeWarehouseExport: fn(
    [
      P('profile', profileKind, PROFILE),
      P('directory', sandboxPath(), () => join(SANDBOX(), 'export')),
      P('options', options({ formats: nested(() => ['csv']), start: nested(() => '2026-01-01', { optional: true }), end: nested(() => '2026-01-03', { optional: true }), calendar: named({ label: 'calendar', names: ['company'], unknownCodes: ['unknown-name'], optional: true }), zones: nested(() => undefined, { optional: true }) }, { valid: () => ({ formats: ['csv'], start: '2026-01-01', end: '2026-01-03' }) }), () => ({ formats: ['csv'], start: '2026-01-01', end: '2026-01-03' })),
    ],
    R.array,
    { sandboxed: [1] },
  ),
};

/**
 * The rows of `kalends/tzdata` (src/tzdata/index.ts). `pinnedZoneRules` answers undefined for any id the pinned data
 * does not have (its TSDoc), a non-string too: it is a lookup, and `zoneFromId(id, { source })` checks the id first.
 * Its check: a result is the rules of exactly the id asked for.
 */
export const TZDATA_TABLE: Readonly<Record<string, Row>> = {
  TZDATA_RELEASE: CONSTANT,
  PINNED_TZDATA: CONSTANT,
  pinnedZoneIds: fn([], shape('sorted zone ids', (v) => Array.isArray(v) && v.length > 400 && v.every((x, i) => typeof x === 'string' && (i === 0 || v[i - 1] < x)))),
  pinnedZoneRules: fn([P('id', anything({ valid: () => fc.constantFrom('Europe/Dublin', 'Asia/Kolkata', 'UTC', 'America/New_York') }), 'Europe/Dublin')], shape('zone rules or undefined', (v) => v === undefined || (typeof v === 'object' && v !== null)), {
    check: (v, args) => (v === undefined || (v as { id?: unknown }).id === args[0] ? undefined : `returned the rules of ${String((v as { id?: unknown }).id)} for ${String(args[0])}`),
  }),
};

/** A directory inside the sandbox (the suite never writes outside it): strings are refused by the sweep. */
function sandboxPath(): Kind {
  return {
    name: 'a directory in the sandbox',
    valid: () => fc.constant(null).map(() => join(SANDBOX(), 'valid')),
    edges: () => [],
    fuzz: () => fc.string({ maxLength: 8 }).map((s) => join(SANDBOX(), 'fuzz', s.replace(/[^\w.-]/g, '_'))),
    expect: (v) => (typeof v === 'string' ? EITHER : reject('type', 'a directory is a string')),
  };
}

/** The modules whose exports the table covers, by the name a user imports. */
export const MODULES: readonly { readonly name: string; readonly exports: Readonly<Record<string, unknown>>; readonly table: Readonly<Record<string, Row>> }[] = [
  { name: 'kalends', exports: k as unknown as Record<string, unknown>, table: CORE_TABLE },
  { name: 'kalends/tzdata', exports: tzdata as unknown as Record<string, unknown>, table: TZDATA_TABLE },
  { name: 'kalends/warehouse', exports: files as unknown as Record<string, unknown>, table: WAREHOUSE_TABLE },
];

/** Every function row with its module, export name and function. */
export function functionRows(): { readonly module: string; readonly name: string; readonly f: (...args: unknown[]) => unknown; readonly row: FunctionRow }[] {
  const rows: { module: string; name: string; f: (...args: unknown[]) => unknown; row: FunctionRow }[] = [];
  for (const m of MODULES) {
    for (const [name, row] of Object.entries(m.table)) {
      if (row.type !== 'function') continue;
      const f = m.exports[name];
      if (typeof f === 'function') rows.push({ module: m.name, name, f: f as (...args: unknown[]) => unknown, row });
    }
  }
  return rows;
}

export { PROTOTYPE_NAMES };

/**
 * Lags and leads (a row's value set beside the value from earlier or later), and changes between periods.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { MS_PER_DAY } from '../bounds.js';
import { hasOwn } from '../diagnostics/index.js';
import { type BucketTable, findRuns } from './bucket.js';
import {
  type BusinessCalendar,
  type CalendarInput,
  type Duration,
  type PeriodUnit,
  type UnitInput,
  type Zone,
  type ZoneInput,
  calendarEdgeError,
  dayNumberFromEpochMsBulk,
  periodEdgeError,
  epochMsFromWallMs,
  negateDuration,
  nextBusinessDay,
  shiftPeriodYears,
  previousBusinessDay,
  requireUnit,
  resolveCalendar,
  resolveZone,
  shiftBusinessDays,
  shiftWallMs,
  wallMsFromEpochMsBulk,
} from './deps.js';
import { optionOf, optionalColumnName, readOneOf, readOptions, requireAmount, requireEnum, requirePositiveMs, requireToleranceMs } from './options.js';
import { type CalendarSpan, readSpan } from './rolling-window.js';
import { type Series, columnNamed, makeSeries, requireSeries } from './series.js';

/**
 * How far to look back (lag) or ahead (lead), always a positive amount:
 * - `{ rows: n }`: the value n rows earlier (later), missing or not; NaN past the ends;
 * - `{ durationMs: d }`: the value at t - d (t + d): the latest non-missing value at or before t - d for a lag,
 *   the earliest at or after t + d for a lead, within `toleranceMs` when given;
 * - `{ span, zone }`: the same with t's wall-clock time in `zone` moved by a calendar span (31 March minus one
 *   month is 28 or 29 February; a wall time in a DST gap or fold resolves as Temporal's `'compatible'`);
 * - `{ businessDays: n, calendar, zone }`: the same at the same wall-clock time on the n-th business day
 *   strictly before (after) the row's local day (`calendar`: a bundled name such as `'us-federal'`, or a calendar
 *   from `defineCalendar`);
 * - `{ periods: n, unit, zone }`: the last non-missing value of the period n periods before (after) the row's
 *   period (the period's closing value); NaN when that period has no values.
 */
export type LagAmount =
  | {
      /** How many rows back (forward for a lead). */
      readonly rows: number;
    }
  | {
      /** How far back (forward) in milliseconds. */
      readonly durationMs: number;
      /** How far before the target instant (after it, for a lead) the value found may lie (default: no limit). */
      readonly toleranceMs?: number;
    }
  | {
      /** The calendar span to move the row's wall-clock time by. */
      readonly span: CalendarSpan;
      /** The zone of the wall-clock time. */
      readonly zone: ZoneInput;
      /** How far before the target instant (after it, for a lead) the value found may lie (default: no limit). */
      readonly toleranceMs?: number;
    }
  | {
      /** How many business days back (forward). */
      readonly businessDays: number;
      /** The business calendar: a bundled name or a calendar from `defineCalendar`. */
      readonly calendar: BusinessCalendar | string;
      /** The zone of the local days. */
      readonly zone: ZoneInput;
      /** How far before the target instant (after it, for a lead) the value found may lie (default: no limit). */
      readonly toleranceMs?: number;
    }
  | {
      /** How many periods back (forward). */
      readonly periods: number;
      /** The period unit. */
      readonly unit: UnitInput;
      /** The zone whose local days decide the periods. */
      readonly zone: ZoneInput;
    };

/** Options of {@link lagSeries} and {@link leadSeries}. */
export interface LagOptions {
  /** Input column (default: the first). */
  readonly column?: string;
  /** Output column name (default `'lag'` or `'lead'`). */
  readonly as?: string;
}

/** The kinds of {@link LagAmount} and the keys each allows. */
const LAG_KINDS = {
  rows: ['rows'],
  durationMs: ['durationMs', 'toleranceMs'],
  span: ['span', 'zone', 'toleranceMs'],
  businessDays: ['businessDays', 'calendar', 'zone', 'toleranceMs'],
  periods: ['periods', 'unit', 'zone'],
} as const;

/** A positive whole amount; a negative one is pointed to the function that looks the other way. */
function requireSteps(name: string, value: unknown, dir: -1 | 1): number {
  if (typeof value === 'number' && Number.isInteger(value) && value < 1) {
    throw new KalendsRangeError(
      `${name}: expected a positive integer, got ${value}; amounts are positive, use ${dir < 0 ? 'leadSeries' : 'lagSeries'} to look the other way`,
      { code: 'out-of-range', received: value, path: name },
    );
  }
  return requireAmount(name, value, 1);
}

/**
 * Each row's value from earlier: n rows back, a duration back, a calendar span back, n business days back or
 * n periods back (see {@link LagAmount}). Returns a one-column series on the same instants.
 *
 * @example
 * ```ts
 * lagSeries(daily, { rows: 1 });                                                  // yesterday's row
 * lagSeries(daily, { businessDays: 5, calendar: usCalendar, zone: 'America/New_York' });
 * lagSeries(sales, { periods: 1, unit: 'month', zone: 'America/Chicago' });       // last month's closing value
 * ```
 */
export function lagSeries(series: Series, by: LagAmount, options?: LagOptions): Series {
  return shifted(series, by, options, -1);
}

/**
 * Each row's value from later: the mirror of {@link lagSeries}.
 *
 * @example
 * ```ts
 * leadSeries(daily, { rows: 1 }); // tomorrow's row
 * ```
 */
export function leadSeries(series: Series, by: LagAmount, options?: LagOptions): Series {
  return shifted(series, by, options, 1);
}

/** For each row, the same wall-clock time on the k-th business day strictly before (dir -1) or after (1) its day. */
function businessDayTargets(t: Float64Array, zone: Zone, cal: CalendarInput, k: number, dir: -1 | 1): Float64Array {
  const n = t.length;
  const walls = wallMsFromEpochMsBulk(zone, t);
  const days = dayNumberFromEpochMsBulk(zone, t);
  const targets = new Float64Array(n);
  let lastDay = Number.NaN;
  let target = 0;
  for (let i = 0; i < n; i++) {
    const d = days[i]!;
    if (d !== lastDay) {
      const first = dir < 0 ? previousBusinessDay(cal, d) : nextBusinessDay(cal, d);
      target = k === 1 ? first : shiftBusinessDays(cal, first, dir * (k - 1));
      lastDay = d;
    }
    const msOfDay = walls[i]! - d * MS_PER_DAY;
    targets[i] = epochMsFromWallMs(zone, target * MS_PER_DAY + msOfDay, 'compatible');
  }
  return targets;
}

/** Looks up, for each target instant, the latest valid value at or before it (dir -1) or earliest at or after (dir 1). */
function lookup(t: Float64Array, v: Float64Array, targets: Float64Array, dir: -1 | 1, tol: number): Float64Array {
  const n = targets.length;
  const m = t.length;
  const out = new Float64Array(n).fill(Number.NaN);
  // Targets are not always sorted (a month clamp can move two targets onto one day); search each one, starting
  // from the previous answer when they are.
  for (let i = 0; i < n; i++) {
    const x = targets[i]!;
    if (x !== x) continue;
    if (dir < 0) {
      // last index with t <= x, then back to the latest valid value
      let lo = 0;
      let hi = m;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (t[mid]! <= x) lo = mid + 1;
        else hi = mid;
      }
      let j = lo - 1;
      while (j >= 0 && v[j] !== v[j]) j--;
      if (j >= 0 && x - t[j]! <= tol) out[i] = v[j]!;
    } else {
      let lo = 0;
      let hi = m;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (t[mid]! < x) lo = mid + 1;
        else hi = mid;
      }
      let j = lo;
      while (j < m && v[j] !== v[j]) j++;
      if (j < m && t[j]! - x <= tol) out[i] = v[j]!;
    }
  }
  return out;
}

function shifted(series: Series, by: LagAmount, options: LagOptions | undefined, dir: -1 | 1): Series {
  requireSeries(series, 'series');
  const o = readOptions('options', options, ['column', 'as']);
  const { kind, fields: f } = readOneOf('by', by, LAG_KINDS);
  const asked = optionalColumnName('options.column', optionOf(o, 'column'));
  const v = columnNamed(series, asked, 'options.column');
  const t = series.epochMs;
  const n = t.length;
  const name = optionalColumnName('options.as', optionOf(o, 'as')) ?? (dir < 0 ? 'lag' : 'lead');
  const tolerance = () => requireToleranceMs('by.toleranceMs', optionOf(f, 'toleranceMs'));
  let out: Float64Array;
  if (kind === 'rows') {
    const k = requireSteps('by.rows', optionOf(f, 'rows'), dir) * dir;
    out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const j = i + k;
      out[i] = j >= 0 && j < n ? v[j]! : Number.NaN;
    }
  } else if (kind === 'durationMs') {
    const d = requirePositiveMs('by.durationMs', optionOf(f, 'durationMs'));
    const tol = tolerance();
    const targets = new Float64Array(n);
    for (let i = 0; i < n; i++) targets[i] = t[i]! + dir * d;
    out = lookup(t, v, targets, dir, tol);
  } else if (kind === 'span') {
    const span = readSpan(optionOf(f, 'span'), 'by.span');
    const step: Duration = dir < 0 ? negateDuration(span) : span;
    const zone = resolveZone(optionOf(f, 'zone') as ZoneInput, 'by.zone');
    const tol = tolerance();
    const walls = wallMsFromEpochMsBulk(zone, t);
    const targets = new Float64Array(n);
    for (let i = 0; i < n; i++) targets[i] = epochMsFromWallMs(zone, shiftWallMs(walls[i]!, step), 'compatible');
    out = lookup(t, v, targets, dir, tol);
  } else if (kind === 'businessDays') {
    const k = requireSteps('by.businessDays', optionOf(f, 'businessDays'), dir);
    const cal = resolveCalendar(optionOf(f, 'calendar'), 'by.calendar');
    const zone = resolveZone(optionOf(f, 'zone') as ZoneInput, 'by.zone');
    const tol = tolerance();
    let targets: Float64Array;
    try {
      targets = businessDayTargets(t, zone, cal, k, dir);
    } catch (e) {
      throw calendarEdgeError(e, 'series.epochMs', cal);
    }
    out = lookup(t, v, targets, dir, tol);
  } else {
    const k = requireSteps('by.periods', optionOf(f, 'periods'), dir);
    const unit = requireUnit(optionOf(f, 'unit'), 'by.unit');
    const zone = resolveZone(optionOf(f, 'zone') as ZoneInput, 'by.zone');
    let runs: ReturnType<typeof findRuns>;
    try {
      runs = findRuns(t, 0, n, unit, zone);
    } catch (e) {
      throw periodEdgeError(e, 'series.epochMs', unit, zone);
    }
    const closing = new Float64Array(runs.count);
    for (let r = 0; r < runs.count; r++) {
      let c = Number.NaN;
      for (let i = runs.starts[r + 1]! - 1; i >= runs.starts[r]!; i--) {
        if (v[i] === v[i]) {
          c = v[i]!;
          break;
        }
      }
      closing[r] = c;
    }
    const byOrdinal = new Map<number, number>();
    for (let r = 0; r < runs.count; r++) byOrdinal.set(runs.ordinals[r]!, closing[r]!);
    out = new Float64Array(n);
    for (let r = 0; r < runs.count; r++) {
      const value = byOrdinal.get(runs.ordinals[r]! + dir * k) ?? Number.NaN;
      out.fill(value, runs.starts[r]!, runs.starts[r + 1]!);
    }
  }
  return makeSeries(t, [name], [out]);
}

/** Options of {@link periodChangeFromBuckets}. */
export interface PeriodChangeOptions {
  /** Column of the table to compare (default: the first). */
  readonly column?: string;
  /**
   * `'previous'` (default): each period against the one before it. `'year-earlier'`: against the period
   * the period layer's `shiftPeriodYears(p, -1)` names (the same month, quarter or fiscal period of the prior year;
   * for week-based fiscal years week 53 is compared with week 52 of a 52-week prior year).
   */
  readonly against?: 'previous' | 'year-earlier';
}

const AGAINST: readonly ('previous' | 'year-earlier')[] = ['previous', 'year-earlier'];

/** Each period's value beside its base period's value, with the change and the relative change. */
export interface PeriodChange {
  /** The unit of the periods, compiled. */
  readonly unit: PeriodUnit;
  /** Period ordinals, ascending. */
  readonly ordinals: Int32Array;
  /** `unit.formatOrdinal(ordinal)` for each period. */
  readonly labels: readonly string[];
  /** Ordinal of each base period (NaN when it has none). */
  readonly baseOrdinals: Float64Array;
  /** Each period's value. */
  readonly value: Float64Array;
  /** The base period's value; NaN when the base period is not in the table. */
  readonly base: Float64Array;
  /** value - base. */
  readonly change: Float64Array;
  /** (value - base) / base, a fraction (0.05 is 5 %); NaN when base is 0 or missing. */
  readonly relativeChange: Float64Array;
  /** Number of periods. */
  readonly length: number;
}

/**
 * Change and relative change of a bucketed column against the previous period or the same period a year
 * earlier. Base periods are looked up by ordinal in the table, so a table from `bucketSeries` with a `range`
 * (every period present) gives a base for every period after the first one (or year).
 *
 * @example
 * ```ts
 * const monthly = bucketSeries(sales, { unit: 'month', zone: 'America/Chicago', aggregations: ['sum'], range });
 * periodChangeFromBuckets(monthly, { against: 'year-earlier' }).relativeChange; // growth over the same month last year
 * ```
 */
export function periodChangeFromBuckets(table: BucketTable, options?: PeriodChangeOptions): PeriodChange {
  if (table === null || typeof table !== 'object' || !(table.ordinals instanceof Int32Array)) {
    throw new KalendsTypeError(`table: expected a BucketTable (from bucketSeries), got ${describeValue(table)}`, {
      code: 'invalid-type',
      received: table,
    });
  }
  const o = readOptions('options', options, ['column', 'against']);
  const against = requireEnum('options.against', optionOf(o, 'against'), AGAINST, 'previous');
  const colName = optionalColumnName('options.column', optionOf(o, 'column')) ?? table.columnNames[0];
  const value = colName !== undefined && hasOwn(table.columns, colName) ? table.columns[colName] : undefined;
  if (value === undefined) {
    throw new KalendsRangeError(`options.column: no column ${describeValue(colName)}; valid columns are ${table.columnNames.map((c) => JSON.stringify(c)).join(', ') || '(none)'}`, {
      code: 'unknown-name',
      received: colName,
      path: 'options.column',
    });
  }
  const n = table.length;
  const index = new Map<number, number>();
  for (let i = 0; i < n; i++) index.set(table.ordinals[i]!, i);
  const baseOrdinals = new Float64Array(n);
  const base = new Float64Array(n);
  const change = new Float64Array(n);
  const relativeChange = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const o = table.ordinals[i]!;
    let b: number;
    if (against === 'previous') b = o - 1;
    else {
      try {
        b = shiftPeriodYears({ unit: table.unit, ordinal: o }, -1).ordinal;
      } catch (e) {
        if (!(e instanceof RangeError)) throw e;
        b = Number.NaN;
      }
    }
    baseOrdinals[i] = b;
    const j = index.get(b);
    const bv = j === undefined ? Number.NaN : value[j]!;
    base[i] = bv;
    change[i] = value[i]! - bv;
    relativeChange[i] = bv === 0 || bv !== bv ? Number.NaN : (value[i]! - bv) / bv;
  }
  return Object.freeze({ unit: table.unit, ordinals: table.ordinals, labels: table.labels, baseOrdinals, value, base, change, relativeChange, length: n });
}

/**
 * Business time over typed arrays: the same answers as the scalar functions, one pass each, with an optional
 * `out` array and no allocation per element. Each call checks its instants once (all within the hours' years),
 * makes sure the compiled table holds their years, and then runs a loop of binary searches with no checks.
 *
 * @module
 */
import { HOURS_SEARCH_LIMIT_DAYS, MS_PER_DAY } from '../bounds.js';
import { KalendsRangeError } from '../errors.js';
import { optionOf, readOptions, requireBoolean, requireNumberArray, requireOutArray, requireSameLength } from '../diagnostics/index.js';
import { type HoursEngine, NO_DAY, type Table } from './compile.js';
import { type Duration, localDayNumberBulk, localYear } from './deps.js';
import { type BusinessHours, engineOfHours } from './hours.js';
import {
  type NearestOptions,
  businessDurationMs,
  cutoffIndex,
  outsideYears,
  searchForward,
  shiftOnEngine,
  valueDayOnEngine,
} from './query.js';

const SEARCH_MS = HOURS_SEARCH_LIMIT_DAYS * MS_PER_DAY;

// ---- checks, once per call ------------------------------------------------------------------------------------

/** The smallest and largest instant of a bulk input, after checking that every one lies in the hours' years. */
function scanInstants(e: HoursEngine, name: string, values: ArrayLike<number>): { min: number; max: number } {
  const lo = e.startEpochMs;
  const hi = e.endEpochMs;
  let min = Infinity;
  let max = -Infinity;
  const n = values.length;
  for (let i = 0; i < n; i++) {
    const v = values[i]!;
    if (!(v >= lo && v < hi)) throw outsideYears(e, `${name}[${i}]`, v);
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** The table holding the years of every instant in [min, max] (and a year on each side). */
function tableOver(e: HoursEngine, min: number, max: number, name: string): Table {
  return e.tableFor(localYear(e.norm.zone, min) - 1, localYear(e.norm.zone, max) + 1, name);
}

// ---- kernels: no checks, no allocation -------------------------------------------------------------------------

function countKernel(starts: Float64Array, ends: Float64Array, cum: Float64Array, a: ArrayLike<number>, b: ArrayLike<number>, out: Float64Array, len: number): void {
  const n = starts.length;
  for (let k = 0; k < len; k++) {
    const ta = a[k]!;
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= ta) lo = mid + 1;
      else hi = mid;
    }
    const fa = lo > 0 && ta < ends[lo - 1]! ? cum[lo - 1]! + (ta - starts[lo - 1]!) : cum[lo]!;
    const tb = b[k]!;
    lo = 0;
    hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= tb) lo = mid + 1;
      else hi = mid;
    }
    const fb = lo > 0 && tb < ends[lo - 1]! ? cum[lo - 1]! + (tb - starts[lo - 1]!) : cum[lo]!;
    out[k] = fb - fa;
  }
}

function openKernel(starts: Float64Array, ends: Float64Array, t: ArrayLike<number>, out: Uint8Array, len: number): void {
  const n = starts.length;
  for (let k = 0; k < len; k++) {
    const v = t[k]!;
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= v) lo = mid + 1;
      else hi = mid;
    }
    out[k] = lo > 0 && v < ends[lo - 1]! ? 1 : 0;
  }
}

/**
 * The first element of `a` after (or at, `inclusive`) each instant, or NaN when the table cannot tell or the
 * answer lies past the search limit (`searchMs`): the scalar search then answers or throws.
 */
function nextKernel(a: Float64Array, validTo: number, searchMs: number, inclusive: boolean, t: ArrayLike<number>, out: Float64Array, len: number): void {
  const n = a.length;
  for (let k = 0; k < len; k++) {
    const v = t[k]!;
    let lo = 0;
    let hi = n;
    if (inclusive) {
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (a[mid]! < v) lo = mid + 1;
        else hi = mid;
      }
    } else {
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (a[mid]! <= v) lo = mid + 1;
        else hi = mid;
      }
    }
    out[k] = lo < n && a[lo]! <= validTo && a[lo]! - v <= searchMs ? a[lo]! : Number.NaN;
  }
}

/**
 * Each instant moved by its business ms (`ms`, or `each[k]`), or NaN when the table cannot tell or the answer
 * lies farther than the search limit (`searchMs`) from the instant: the scalar shift then answers or throws.
 */
function shiftKernel(T: Table, t: ArrayLike<number>, ms: number, each: ArrayLike<number> | null, searchMs: number, out: Float64Array, len: number): void {
  const starts = T.starts;
  const ends = T.ends;
  const cum = T.cum;
  const n = starts.length;
  const validFrom = T.validFrom;
  const validTo = T.validTo;
  for (let k = 0; k < len; k++) {
    const v = t[k]!;
    const d = each === null ? ms : each[k]!;
    if (d === 0) {
      out[k] = v;
      continue;
    }
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (starts[mid]! <= v) lo = mid + 1;
      else hi = mid;
    }
    const target = (lo > 0 && v < ends[lo - 1]! ? cum[lo - 1]! + (v - starts[lo - 1]!) : cum[lo]!) + d;
    let r = Number.NaN;
    if (d > 0) {
      lo = 0;
      hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (cum[mid + 1]! < target) lo = mid + 1;
        else hi = mid;
      }
      if (lo < n) r = starts[lo]! + (target - cum[lo]!);
      if (!(r <= validTo && r - v <= searchMs)) r = Number.NaN;
    } else {
      lo = 0;
      hi = n;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (cum[mid]! <= target) lo = mid + 1;
        else hi = mid;
      }
      if (lo > 0 && target >= 0) r = starts[lo - 1]! + (target - cum[lo - 1]!);
      if (!(r >= validFrom && v - r <= searchMs)) r = Number.NaN;
    }
    out[k] = r;
  }
}

/**
 * Value dates from local day numbers (in `out`): NO_DAY where the table cannot tell or the next business day
 * lies past the search limit (`searchDays`): the scalar function then answers or throws.
 */
function valueKernel(T: Table, c: number, t: ArrayLike<number>, searchDays: number, out: Int32Array, len: number): void {
  const cut = T.cutoffs[c]!;
  const next = T.nextBusiness;
  const first = T.firstDay;
  for (let k = 0; k < len; k++) {
    const d = out[k]!;
    const i = d - first;
    if (Math.floor(t[k]!) <= cut[i]!) continue;
    const nd = next[i]!;
    out[k] = nd - d <= searchDays ? nd : NO_DAY;
  }
}

// ---- public functions ----------------------------------------------------------------------------------------

/**
 * {@link isOpen} over many instants: 1 where the hours are open, 0 where closed.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * isOpenBulk(hours, Float64Array.of(Date.UTC(2025, 0, 6, 10), Date.UTC(2025, 0, 6, 18))); // Uint8Array [1, 0]
 * ```
 */
export function isOpenBulk(hours: BusinessHours, epochMs: ArrayLike<number>, out?: Uint8Array): Uint8Array {
  const e = engineOfHours(hours);
  const t = requireNumberArray('epochMs', epochMs);
  const len = t.length;
  const o = requireOutArray('out', out, Uint8Array, len);
  if (len === 0) return o;
  const { min, max } = scanInstants(e, 'epochMs', t);
  const T = tableOver(e, min, max, 'epochMs');
  Reflect.apply(openKernel, undefined, [T.starts, T.ends, t, o, len]);
  return o;
}

/**
 * {@link countBusinessMs} over many pairs: `out[k]` is the business time in ms between `startEpochMs[k]` and
 * `endEpochMs[k]`, negative when the end comes first. The service-level check is one comparison on the result:
 * a ticket opened at `opened[k]` and answered at `answered[k]` met an 8-business-hour target when
 * `out[k] <= 8 * 3_600_000` (answered at exactly 8 business hours counts as met).
 *
 * @example
 * ```ts
 * const desk = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] } });
 * const toAnswer = countBusinessMsBulk(desk, Float64Array.of(Date.UTC(2025, 0, 6, 15)), Float64Array.of(Date.UTC(2025, 0, 7, 12)));
 * toAnswer[0] / 3_600_000; // 5 (2 h Monday + 3 h Tuesday): within 8 business hours
 * ```
 */
export function countBusinessMsBulk(hours: BusinessHours, startEpochMs: ArrayLike<number>, endEpochMs: ArrayLike<number>, out?: Float64Array): Float64Array {
  const e = engineOfHours(hours);
  const a = requireNumberArray('startEpochMs', startEpochMs);
  const b = requireNumberArray('endEpochMs', endEpochMs);
  const len = a.length;
  requireSameLength('endEpochMs', b, len, 'startEpochMs');
  const o = requireOutArray('out', out, Float64Array, len);
  if (len === 0) return o;
  const ra = scanInstants(e, 'startEpochMs', a);
  const rb = scanInstants(e, 'endEpochMs', b);
  const T = tableOver(e, Math.min(ra.min, rb.min), Math.max(ra.max, rb.max), 'endEpochMs');
  Reflect.apply(countKernel, undefined, [T.starts, T.ends, T.cum, a, b, o, len]);
  return o;
}

function nearestBulk(hours: BusinessHours, epochMs: ArrayLike<number>, out: Float64Array | undefined, options: NearestOptions | undefined, ends: boolean): Float64Array {
  const e = engineOfHours(hours);
  const t = requireNumberArray('epochMs', epochMs);
  const len = t.length;
  const o = requireOutArray('out', out, Float64Array, len);
  const inclusive = requireBoolean('options.inclusive', optionOf(readOptions('options', options, ['inclusive']), 'inclusive'), false);
  if (len === 0) return o;
  const { min, max } = scanInstants(e, 'epochMs', t);
  const T = tableOver(e, min, max, 'epochMs');
  Reflect.apply(nextKernel, undefined, [ends ? T.ends : T.starts, T.validTo, SEARCH_MS, inclusive, t, o, len]);
  // The few whose answer lies past the table: one search each, which grows the table.
  for (let k = 0; k < len; k++) if (Number.isNaN(o[k]!)) o[k] = searchForward(e, t[k]!, ends, inclusive, `epochMs[${k}]`);
  return o;
}

/**
 * {@link nextOpeningEpochMs} over many instants.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * nextOpeningEpochMsBulk(hours, Float64Array.of(Date.UTC(2025, 0, 6, 10)))[0]; // Date.UTC(2025, 0, 13, 9)
 * ```
 */
export function nextOpeningEpochMsBulk(hours: BusinessHours, epochMs: ArrayLike<number>, out?: Float64Array, options?: NearestOptions): Float64Array {
  return nearestBulk(hours, epochMs, out, options, false);
}

/**
 * {@link nextClosingEpochMs} over many instants.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '17:00' }] } });
 * nextClosingEpochMsBulk(hours, Float64Array.of(Date.UTC(2025, 0, 6, 10)))[0]; // Date.UTC(2025, 0, 6, 17)
 * ```
 */
export function nextClosingEpochMsBulk(hours: BusinessHours, epochMs: ArrayLike<number>, out?: Float64Array, options?: NearestOptions): Float64Array {
  return nearestBulk(hours, epochMs, out, options, true);
}

/**
 * {@link shiftBusinessTime} over many instants: one duration for all (a Duration, ISO 8601 text of elapsed time,
 * or milliseconds), or an array of milliseconds, one per instant (a due time per ticket priority).
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] } });
 * shiftBusinessTimeBulk(hours, Float64Array.of(Date.UTC(2025, 0, 6, 15)), 'PT8H')[0]; // Date.UTC(2025, 0, 7, 15)
 * ```
 */
export function shiftBusinessTimeBulk(
  hours: BusinessHours,
  epochMs: ArrayLike<number>,
  duration: Duration | string | number | ArrayLike<number>,
  out?: Float64Array,
): Float64Array {
  const e = engineOfHours(hours);
  const t = requireNumberArray('epochMs', epochMs);
  const len = t.length;
  let each: ArrayLike<number> | null = null;
  let ms = 0;
  if (typeof duration === 'object' && duration !== null && 'length' in duration) {
    each = requireNumberArray('duration', duration);
    requireSameLength('duration', each, len, 'epochMs');
    for (let k = 0; k < len; k++) businessDurationMs(each[k]!, `duration[${k}]`);
  } else ms = businessDurationMs(duration);
  const o = requireOutArray('out', out, Float64Array, len);
  if (len === 0) return o;
  const { min, max } = scanInstants(e, 'epochMs', t);
  const T = tableOver(e, min, max, 'epochMs');
  Reflect.apply(shiftKernel, undefined, [T, t, ms, each, SEARCH_MS, o, len]);
  for (let k = 0; k < len; k++) {
    if (Number.isNaN(o[k]!)) o[k] = shiftOnEngine(e, t[k]!, each === null ? ms : each[k]!, `duration${each === null ? '' : `[${k}]`}`);
  }
  return o;
}

/**
 * {@link valueDayNumberOfEpochMs} over many instants: the value date (a day number) of each instruction under
 * one named cut-off.
 *
 * @example
 * ```ts
 * const hours = defineHours({ zone: 'UTC', week: { monday: [{ open: '08:00', close: '18:00' }], tuesday: [{ open: '08:00', close: '18:00' }] }, cutoffs: { payments: '17:00' } });
 * valueDayNumberOfEpochMsBulk(hours, Float64Array.of(Date.UTC(2025, 0, 6, 16), Date.UTC(2025, 0, 6, 18)), 'payments'); // Int32Array [20094, 20095]
 * ```
 */
export function valueDayNumberOfEpochMsBulk(hours: BusinessHours, epochMs: ArrayLike<number>, cutoff: string, out?: Int32Array): Int32Array {
  const e = engineOfHours(hours);
  const c = cutoffIndex(e, cutoff);
  const t = requireNumberArray('epochMs', epochMs);
  const len = t.length;
  const o = requireOutArray('out', out, Int32Array, len);
  if (len === 0) return o;
  const { min, max } = scanInstants(e, 'epochMs', t);
  const T = tableOver(e, min, max, 'epochMs');
  localDayNumberBulk(e.norm.zone, t, o);
  Reflect.apply(valueKernel, undefined, [T, c, t, HOURS_SEARCH_LIMIT_DAYS, o, len]);
  for (let k = 0; k < len; k++) if (o[k] === NO_DAY) o[k] = valueDayOnEngine(e, t[k]!, c, `epochMs[${k}]`);
  return o;
}

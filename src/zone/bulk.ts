/**
 * Bulk conversions over typed arrays: instants to local day numbers and to wall-clock ms, one pass, no
 * per-element allocation, no Intl call inside the loop. The tables and kernels are in daytable.ts (per UTC day)
 * and steptable.ts (a function of the local day, for the period layer).
 *
 * Inputs are read once, before any loop (docs/design.md, "Input rules"): a typed array of numbers as it is, a plain
 * array checked element by element (the first non-number, hole, string, Date, null or boolean is a
 * KalendsTypeError naming its index), so that the answer never depends on the input's length.
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { optionOf, readOptions, requireEnum, requireNumberArray, requireOutArray } from '../diagnostics/index.js';
import { FixedEngine } from './engine.js';
import { DAY_NUMBERS, type Input, WALL_MS, fillFromDayTable, invalidInstant } from './daytable.js';
import { DAY_FUNCTION, type LocalDayFunction } from './steptable.js';
import { type ZoneInput, engineOf, toZone } from './zone.js';

export type { LocalDayFunction } from './steptable.js';

/** Options of the bulk conversions. */
export interface BulkOptions {
  /**
   * What to do with NaN, infinite or out-of-range instants: 'throw' (default) throws a KalendsRangeError naming
   * the index of the first one; 'sentinel' writes {@link INVALID_DAY_NUMBER} (day numbers) or NaN (wall ms).
   */
  readonly invalid?: 'throw' | 'sentinel';
}

/** The day number written for an invalid instant under `invalid: 'sentinel'`: -2**31 (outside every valid day). */
export const INVALID_DAY_NUMBER = -2147483648;

const INVALID_POLICIES: readonly ('throw' | 'sentinel')[] = ['throw', 'sentinel'];

/**
 * @internal Reads the options of a bulk conversion: true for the sentinel policy. Unknown keys and foreign values
 * are refused (`{ invalid: 'sentinal' }` names "sentinel").
 */
export function readBulkOptions(options: unknown): boolean {
  const o = readOptions('options', options, ['invalid']);
  return requireEnum('options.invalid', optionOf(o, 'invalid'), INVALID_POLICIES, 'throw') === 'sentinel';
}

/**
 * @internal `out[i] = f.valueOf(dayNumberFromEpochMs(zone, epochMs[i]))` for many instants, in one pass over a
 * table of f per UTC day (see steptable.ts); the same errors as {@link dayNumberFromEpochMsBulk}, with `invalid`
 * written for invalid instants under the sentinel policy. The caller has checked `epochMs` and `out` (which holds
 * `epochMs.length` elements) and read the options. Undefined for a fixed-offset zone (the caller converts to day
 * numbers and maps those, which is as fast there).
 */
export function localDayFunctionBulk(
  zone: ZoneInput,
  epochMs: Input,
  out: Int32Array,
  sentinel: boolean,
  f: LocalDayFunction,
  invalid: number,
): Int32Array | undefined {
  const e = engineOf(toZone(zone));
  if (e instanceof FixedEngine) return undefined;
  return fillFromDayTable(e, epochMs, out, sentinel, DAY_FUNCTION, f, invalid);
}

/**
 * Local day numbers of many instants, in one pass: `out[i] = dayNumberFromEpochMs(zone, epochMs[i])`.
 * Invalid instants (NaN, ±Infinity, beyond ±8.64e15) throw naming the first index, or are written as
 * {@link INVALID_DAY_NUMBER} with `{ invalid: 'sentinel' }`. A plain array is read once first: a non-number in it
 * (a numeric string, a Date, null, true, a hole) is a KalendsTypeError naming its index. A fractional instant gives
 * the day of the millisecond that holds it. `out`, when given, must hold `epochMs.length`
 * elements; it is returned.
 *
 * @example
 * ```ts
 * dayNumberFromEpochMsBulk('America/New_York', Float64Array.of(Date.UTC(2025, 0, 1, 3))); // Int32Array [20088] (2024-12-31 local)
 * ```
 */
export function dayNumberFromEpochMsBulk(zone: ZoneInput, epochMs: ArrayLike<number>, out?: Int32Array, options?: BulkOptions): Int32Array {
  const z = toZone(zone);
  const src = requireNumberArray('epochMs', epochMs);
  const sentinel = readBulkOptions(options);
  return dayNumbersOfCheckedInstants(z, src, requireOutArray('out', out, Int32Array, src.length), sentinel);
}

/**
 * @internal {@link dayNumberFromEpochMsBulk} for an input, output and policy the caller has checked (so that a
 * plain array is read once per call, not once per layer).
 */
export function dayNumbersOfCheckedInstants(zone: ZoneInput, src: Input, result: Int32Array, sentinel: boolean): Int32Array {
  const e = engineOf(toZone(zone));
  const n = src.length;
  if (e instanceof FixedEngine) {
    const off = e.offsetSeconds * 1000;
    for (let i = 0; i < n; i++) {
      const t = src[i] as number;
      if (t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS) result[i] = Math.floor((Math.floor(t) + off) / MS_PER_DAY);
      else if (sentinel) result[i] = INVALID_DAY_NUMBER;
      else invalidInstant('epochMs', i, t);
    }
    return result;
  }
  return fillFromDayTable(e, src, result, sentinel, DAY_NUMBERS, undefined, INVALID_DAY_NUMBER);
}

/**
 * Local wall-clock ms of many instants, in one pass: `out[i] = wallMsFromEpochMs(zone, epochMs[i])` (a fraction
 * kept). Invalid instants throw naming the first index, or are written as NaN with `{ invalid: 'sentinel' }`; a
 * non-number in a plain array is a KalendsTypeError naming its index.
 *
 * @example
 * ```ts
 * wallMsFromEpochMsBulk('Asia/Kathmandu', [0]); // Float64Array [19800000]
 * ```
 */
export function wallMsFromEpochMsBulk(zone: ZoneInput, epochMs: ArrayLike<number>, out?: Float64Array, options?: BulkOptions): Float64Array {
  const e = engineOf(toZone(zone));
  const src = requireNumberArray('epochMs', epochMs);
  const sentinel = readBulkOptions(options);
  const n = src.length;
  const result = requireOutArray('out', out, Float64Array, n);
  if (e instanceof FixedEngine) {
    const off = e.offsetSeconds * 1000;
    for (let i = 0; i < n; i++) {
      const t = src[i] as number;
      if (t >= MIN_EPOCH_MS && t <= MAX_EPOCH_MS) result[i] = t + off;
      else if (sentinel) result[i] = NaN;
      else invalidInstant('epochMs', i, t);
    }
    return result;
  }
  return fillFromDayTable(e, src, result, sentinel, WALL_MS, undefined, NaN);
}

/**
 * The bulk form of the day-count fractions: one convention over arrays of periods, into a Float64Array.
 *
 * Each convention has a kernel of its own, called through `Reflect.apply` (see DEVELOPERS.md, "Hot loops in V8"):
 * a loop over the pairs that checks each pair with a few comparisons (integers in the civil range, in order) and
 * calls a cold function to throw the precise error. The formulas are those of the scalar function
 * (`formulas.ts`), and the double of each pair is `numerator / denominator` of the same integers, so that the bulk
 * and scalar answers agree to the last bit.
 *
 * @module
 */
import { type CalendarInput, calendarFromName, countBusinessDays } from '../business/index.js';
import { dayNumberFromYmdUnchecked, yearOfDayNumberUnchecked } from '../civil/gregorian.js';
import { readOptions, requireDayNumberArgument, requireNumberArray, requireOutArray } from '../diagnostics/index.js';
import { KalendsRangeError, KalendsTypeError } from '../errors.js';
import {
  checkRegularPeriod,
  readCalendar,
  readCouponsPerYear,
  readTermination,
  refuseUnusedOptions,
  regularSpanBounds,
  requireConvention,
  requireNotAfterTermination,
  requireOrder,
  showDay,
} from './checks.js';
import type { DayCountConvention, YearFractionBulkOptions } from './conventions.js';
import {
  actual365LeapDenominator,
  actualActualIsdaNumerator,
  thirtyDays,
  thirtyE360IsdaDays,
} from './formulas.js';

type Days = ArrayLike<number>;

const BULK_KEYS: readonly string[] = ['couponsPerYear', 'regularStarts', 'regularEnds', 'terminationDayNumber', 'calendar'];
const BULK_NAMES: Readonly<Record<string, string>> = /* @__PURE__ */ Object.freeze({ regularStart: 'regularStarts', regularEnd: 'regularEnds' });

/** True when a pair is not two integer day numbers in the civil range with `b >= a` (day numbers fit in int32). */
function badPair(a: number, b: number): boolean {
  return (a | 0) !== a || (b | 0) !== b || a < -100_000_109 || b > 100_000_109 || b < a;
}

/** Cold: throws the precise error for pair i (called only when {@link badPair} said so). */
function failPair(starts: Days, ends: Days, i: number, startName = 'starts', endName = 'ends'): never {
  const a = requireDayNumberArgument(`${startName}[${i}]`, starts[i]);
  const b = requireDayNumberArgument(`${endName}[${i}]`, ends[i]);
  requireOrder(`${startName}[${i}]`, a, `${endName}[${i}]`, b);
  throw new KalendsRangeError(`${startName}[${i}]: unexpected pair ${a}, ${b}`, { code: 'out-of-range', received: a });
}

function oneOneKernel(s: Days, e: Days, out: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    out[i] = a === b ? 0 : 1;
  }
}

function actualActualIsdaKernel(s: Days, e: Days, out: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    out[i] = actualActualIsdaNumerator(a, b) / 133_590;
  }
}

function actualOverKernel(s: Days, e: Days, out: Float64Array, n: number, denominator: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    out[i] = (b - a) / denominator;
  }
}

function thirtyKernel(s: Days, e: Days, out: Float64Array, n: number, euro: boolean): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    out[i] = thirtyDays(a, b, euro) / 360;
  }
}

function thirtyE360IsdaKernel(s: Days, e: Days, out: Float64Array, n: number, termination: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    if (b > termination) requireNotAfterTermination(`ends[${i}]`, b, termination);
    out[i] = thirtyE360IsdaDays(a, b, termination) / 360;
  }
}

function actual365LeapKernel(s: Days, e: Days, out: Float64Array, n: number, annual: boolean): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    out[i] = (b - a) / actual365LeapDenominator(a, b, annual);
  }
}

function icmaKernel(s: Days, e: Days, rs: Days, re: Days, out: Float64Array, n: number, couponsPerYear: number, shortest: number, longest: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    const x = rs[i]!;
    const y = re[i]!;
    if (badPair(a, b) || badPair(x, y) || a < x || b > y || y - x < shortest || y - x > longest) failIcma(s, e, rs, re, i, couponsPerYear);
    out[i] = (b - a) / (couponsPerYear * (y - x));
  }
}

/** Cold: the precise error for an Actual/Actual (ICMA) pair and its regular period. */
function failIcma(s: Days, e: Days, rs: Days, re: Days, i: number, couponsPerYear: number): never {
  if (badPair(s[i]!, e[i]!)) failPair(s, e, i);
  if (badPair(rs[i]!, re[i]!)) failPair(rs, re, i, 'options.regularStarts', 'options.regularEnds');
  checkRegularPeriod(s[i]!, e[i]!, rs[i]!, re[i]!, couponsPerYear, {
    start: `starts[${i}]`,
    end: `ends[${i}]`,
    regularStart: `options.regularStarts[${i}]`,
    regularEnd: `options.regularEnds[${i}]`,
  });
  throw new KalendsRangeError(`starts[${i}]: unexpected regular period`, { code: 'out-of-range', received: s[i] });
}

function business252Kernel(s: Days, e: Days, out: Float64Array, n: number, calendar: CalendarInput, first: number, after: number): void {
  for (let i = 0; i < n; i++) {
    const a = s[i]!;
    const b = e[i]!;
    if (badPair(a, b)) failPair(s, e, i);
    if (a < first || b > after) failCalendarYears(calendar, a, b, i, first, after);
    out[i] = countBusinessDays(calendar, a, b) / 252;
  }
}

/** Cold: a pair outside the years the calendar answers for. */
function failCalendarYears(calendar: CalendarInput, a: number, b: number, i: number, first: number, after: number): never {
  const [name, value] = a < first ? [`starts[${i}]`, a] : [`ends[${i}]`, b];
  const id = typeof calendar === 'string' ? calendar : (calendar as { id?: string }).id;
  const years = `${yearOfDayNumberUnchecked(first)}..${yearOfDayNumberUnchecked(after - 1)}`;
  throw new KalendsRangeError(
    `${name}: expected a day number in the years ${years} that calendar ${JSON.stringify(id)} answers for (an end may be the day after), got ${showDay(value)}`,
    { code: 'out-of-range', received: value },
  );
}

/** The first day and the day after the last day that a calendar answers for (NaN when it does not say). */
function calendarBounds(calendar: CalendarInput): readonly [number, number] {
  const compiled: unknown = typeof calendar === 'string' ? calendarFromName(calendar) : calendar;
  const firstYear = typeof compiled === 'object' && compiled !== null ? (compiled as { firstYear?: unknown }).firstYear : undefined;
  const lastYear = typeof compiled === 'object' && compiled !== null ? (compiled as { lastYear?: unknown }).lastYear : undefined;
  if (typeof firstYear !== 'number' || typeof lastYear !== 'number') return [Number.NaN, Number.NaN];
  return [dayNumberFromYmdUnchecked(firstYear, 1, 1), dayNumberFromYmdUnchecked(lastYear + 1, 1, 1)];
}

/**
 * The year fraction of every period `[starts[i], ends[i])` under one day-count convention, as doubles, in one pass
 * with no allocation per period: `out[i]` equals `yearFractionOfDays(convention, starts[i], ends[i], ...).value` to
 * the last bit. `starts` and `ends` are typed arrays or arrays of day numbers of the same length; `out` (a
 * Float64Array of at least that length) is filled and returned, or a new one is made. The options are those of
 * {@link yearFractionOfDays}, except that Actual/Actual (ICMA) takes the regular period of each pair as arrays,
 * `regularStarts` and `regularEnds`. A bad pair throws an error naming its index (`ends[7]`).
 *
 * @example
 * ```ts
 * const starts = Int32Array.of(dayNumberFromYmd(2006, 2, 28), dayNumberFromYmd(2006, 8, 31));
 * const ends = Int32Array.of(dayNumberFromYmd(2006, 8, 31), dayNumberFromYmd(2007, 2, 28));
 * yearFractionOfDaysBulk('thirty-360', starts, ends); // Float64Array [0.5083333333333333, 0.49444444444444446] (183/360, 178/360)
 * yearFractionOfDaysBulk('thirty-e-360-isda', starts, ends, undefined, { terminationDayNumber: ends[1] }); // [0.5, 0.49444444444444446]
 * ```
 */
export function yearFractionOfDaysBulk(
  convention: DayCountConvention,
  starts: ArrayLike<number>,
  ends: ArrayLike<number>,
  out?: Float64Array,
  options?: YearFractionBulkOptions,
): Float64Array {
  const c = requireConvention('convention', convention);
  const s = requireNumberArray('starts', starts);
  const e = requireNumberArray('ends', ends);
  const n = s.length;
  requireSameLength('ends', e, n);
  const o = readOptions('options', options, BULK_KEYS);
  refuseUnusedOptions(c, o, BULK_NAMES);
  const result = requireOutArray('out', out, Float64Array, n);
  switch (c) {
    case 'one-one':
      Reflect.apply(oneOneKernel, undefined, [s, e, result, n]);
      break;
    case 'actual-actual-isda':
      Reflect.apply(actualActualIsdaKernel, undefined, [s, e, result, n]);
      break;
    case 'actual-actual-icma': {
      const couponsPerYear = readCouponsPerYear(c, o);
      const rs = readRegularDays(o, 'regularStarts', n);
      const re = readRegularDays(o, 'regularEnds', n);
      const { shortest, longest } = regularSpanBounds(couponsPerYear);
      Reflect.apply(icmaKernel, undefined, [s, e, rs, re, result, n, couponsPerYear, shortest, longest]);
      break;
    }
    case 'actual-365-fixed':
      Reflect.apply(actualOverKernel, undefined, [s, e, result, n, 365]);
      break;
    case 'actual-360':
      Reflect.apply(actualOverKernel, undefined, [s, e, result, n, 360]);
      break;
    case 'thirty-360':
      Reflect.apply(thirtyKernel, undefined, [s, e, result, n, false]);
      break;
    case 'thirty-e-360':
      Reflect.apply(thirtyKernel, undefined, [s, e, result, n, true]);
      break;
    case 'thirty-e-360-isda':
      Reflect.apply(thirtyE360IsdaKernel, undefined, [s, e, result, n, readTermination(o)]);
      break;
    case 'actual-365-leap':
      Reflect.apply(actual365LeapKernel, undefined, [s, e, result, n, readCouponsPerYear(c, o) === 1]);
      break;
    case 'business-252': {
      const calendar = readCalendar(o);
      const [first, after] = calendarBounds(calendar);
      Reflect.apply(business252Kernel, undefined, [s, e, result, n, calendar, first, after]);
      break;
    }
  }
  return result;
}

function requireSameLength(name: string, values: ArrayLike<number>, n: number): void {
  if (values.length !== n) {
    throw new KalendsRangeError(`${name}: expected ${n} elements (as many as starts), got ${values.length}`, {
      code: 'length-mismatch',
      received: values.length,
    });
  }
}

function readRegularDays(options: Readonly<Record<string, unknown>>, key: 'regularStarts' | 'regularEnds', n: number): ArrayLike<number> {
  const value = Object.prototype.hasOwnProperty.call(options, key) ? options[key] : undefined;
  if (value === undefined) {
    throw new KalendsTypeError(
      `options.${key}: Actual/Actual (ICMA) needs the regular coupon period of each pair (ICMA Rule 251), got undefined; pass { regularStarts, regularEnds } as arrays of day numbers, one per pair`,
      { code: 'invalid-type', received: undefined, path: `options.${key}` },
    );
  }
  const days = requireNumberArray(`options.${key}`, value);
  requireSameLength(`options.${key}`, days, n);
  return days;
}

/**
 * Exponentially weighted means.
 *
 * Source: NIST/SEMATECH e-Handbook of Statistical Methods, section 6.4.3.1 "Single Exponential Smoothing":
 * S₂ = y₁ and Sₜ = α yₜ₋₁ + (1 − α) Sₜ₋₁ for 0 < α ≤ 1. The handbook indexes the smoothed value by the period
 * it forecasts; here the value at row i includes row i, so row i of the result is the handbook's Sᵢ₊₁.
 *
 * @module
 */
import { KalendsTypeError } from '../errors.js';
import { optionOf, optionalColumnName, readOptions, requireAmount, requireEnum, requireReal } from './options.js';
import { type Series, columnNamed, makeSeries, requireSeries } from './series.js';

/** How the weights of {@link smoothSeries} are applied. */
export type SmoothingForm = 'recursive' | 'normalized';

/**
 * Options of {@link smoothSeries}. Give exactly one of `alpha`, `equivalentWindowRows`, `halfLife` or
 * `halfLifeMs`.
 */
export interface SmoothOptions {
  /** Smoothing constant, 0 < alpha <= 1: the weight of the newest value. */
  readonly alpha?: number;
  /**
   * The length n (>= 1 rows) of the rolling mean whose weights have the same mean age as the smoothing's:
   * alpha = 2 / (n + 1). (The mean age of the weights α(1 − α)^k is (1 − α) / α rows; that of a rolling mean
   * over n rows is (n − 1) / 2.) Renamed in 0.2 (was `span`).
   */
  readonly equivalentWindowRows?: number;
  /** Half-life in rows (> 0): alpha = 1 - 2^(-1 / halfLife); a value's weight halves every `halfLife` rows. */
  readonly halfLife?: number;
  /**
   * Half-life in milliseconds (> 0), for irregular times: a value observed Δt ms before another weighs
   * 2^(-Δt / halfLifeMs) times as much; the recursive form uses alpha_i = 1 - 2^(-(t_i - t_prev) / halfLifeMs).
   */
  readonly halfLifeMs?: number;
  /**
   * `'recursive'` (default): s₁ = y₁, sᵢ = α yᵢ + (1 − α) sᵢ₋₁, the handbook's form. `'normalized'`: the
   * weighted mean Σ wᵢⱼ yⱼ / Σ wᵢⱼ over all values so far, the weights divided by their sum, with
   * wᵢⱼ = (1 − α)^(i − j) (or 2^(−(tᵢ − tⱼ)/h)), which does not over-weight the first value. Renamed in 0.2 (was
   * `'adjusted'`).
   */
  readonly form?: SmoothingForm;
  /** Input column (default: the first). */
  readonly column?: string;
  /** Output column name (default `'smoothed'`). */
  readonly as?: string;
  /** Values needed before a result is given (default 1); earlier rows are NaN. */
  readonly minObservations?: number;
}

/** The four ways to give the smoothing constant; exactly one is given. */
const RATES = ['alpha', 'equivalentWindowRows', 'halfLife', 'halfLifeMs'] as const;
const FORMS: readonly SmoothingForm[] = ['recursive', 'normalized'];

/**
 * Exponentially weighted mean of one column. Missing values (NaN) are skipped: they neither update the mean
 * nor, in the row-based forms, count as a step of decay (in the time-based form decay follows elapsed time);
 * the result at a missing row is the mean so far.
 *
 * @example
 * ```ts
 * const s = seriesFromPairs([[0, 71], [1, 70], [2, 69]]);
 * smoothSeries(s, { alpha: 0.1 }).columns.smoothed; // [71, 70.9, 70.71]
 * smoothSeries(s, { equivalentWindowRows: 19 });    // alpha = 0.1
 * smoothSeries(s, { halfLifeMs: 7 * 86_400_000 });  // weights halve every 7 days
 * ```
 */
export function smoothSeries(series: Series, options: SmoothOptions): Series {
  requireSeries(series, 'series');
  const o = readOptions('options', options, [...RATES, 'form', 'column', 'as', 'minObservations']);
  const given = RATES.filter((k) => optionOf(o, k) !== undefined);
  if (given.length !== 1) {
    throw new KalendsTypeError(
      `options: expected exactly one of ${RATES.join(', ')}, got ${given.length === 0 ? 'none' : given.join(' and ')}; ${given.length === 0 ? 'give one, such as { alpha: 0.1 }' : 'keep one of them'}`,
      { code: 'invalid-type', received: options },
    );
  }
  let alpha = Number.NaN;
  let halfLifeMs = Number.NaN;
  const rate = given[0]!;
  const value = optionOf(o, rate);
  if (rate === 'alpha') alpha = requireReal('options.alpha', value, 'a number with 0 < alpha <= 1', (x) => x > 0 && x <= 1);
  else if (rate === 'equivalentWindowRows') alpha = 2 / (requireReal('options.equivalentWindowRows', value, 'a number of rows of at least 1', (x) => x >= 1 && x < Infinity) + 1);
  else if (rate === 'halfLife') alpha = 1 - 2 ** (-1 / requireReal('options.halfLife', value, 'a positive number of rows', (x) => x > 0 && x < Infinity));
  else halfLifeMs = requireReal('options.halfLifeMs', value, 'a positive number of milliseconds', (x) => x > 0 && x < Infinity);
  const form = requireEnum('options.form', optionOf(o, 'form'), FORMS, 'recursive');
  const minObs = requireAmount('options.minObservations', optionOf(o, 'minObservations'), 0, 1);
  const as = optionalColumnName('options.as', optionOf(o, 'as')) ?? 'smoothed';
  const v = columnNamed(series, optionalColumnName('options.column', optionOf(o, 'column')), 'options.column');
  const t = series.epochMs;
  const n = v.length;
  const out = new Float64Array(n);
  const timed = alpha !== alpha;
  let num = 0; // recursive: the mean; normalized: Σ w y
  let den = 0; // normalized: Σ w
  let seen = 0;
  let lastT = 0;
  for (let i = 0; i < n; i++) {
    const y = v[i]!;
    if (y === y) {
      if (seen === 0) {
        num = y;
        den = 1;
      } else {
        const keep = timed ? 2 ** (-(t[i]! - lastT) / halfLifeMs) : 1 - alpha;
        if (form === 'recursive') {
          const a = timed ? 1 - keep : alpha;
          num = a * y + (1 - a) * num;
        } else {
          num = y + keep * num;
          den = 1 + keep * den;
        }
      }
      seen++;
      lastT = t[i]!;
    }
    out[i] = seen >= minObs && seen > 0 ? (form === 'recursive' ? num : num / den) : Number.NaN;
  }
  return makeSeries(t, [as], [out]);
}

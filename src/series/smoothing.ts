/**
 * Exponentially weighted means.
 *
 * Source: NIST/SEMATECH e-Handbook of Statistical Methods, section 6.4.3.1 "Single Exponential Smoothing":
 * S₂ = y₁ and Sₜ = α yₜ₋₁ + (1 − α) Sₜ₋₁ for 0 < α ≤ 1. The handbook indexes the smoothed value by the period
 * it forecasts; here the value at row i includes row i, so row i of the result is the handbook's Sᵢ₊₁.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { type Series, columnOfSeries, makeSeries, requireSeries } from './series.js';

/** Options of {@link smoothSeries}. Give exactly one of `alpha`, `span`, `halfLife` or `halfLifeMs`. */
export interface SmoothOptions {
  /** Smoothing constant, 0 < alpha <= 1: the weight of the newest value. */
  readonly alpha?: number;
  /** Span in rows (>= 1): alpha = 2 / (span + 1). */
  readonly span?: number;
  /** Half-life in rows (> 0): alpha = 1 - 2^(-1 / halfLife); a value's weight halves every `halfLife` rows. */
  readonly halfLife?: number;
  /**
   * Half-life in milliseconds (> 0), for irregular times: a value observed Δt ms before another weighs
   * 2^(-Δt / halfLifeMs) times as much; the recursive form uses alpha_i = 1 - 2^(-(t_i - t_prev) / halfLifeMs).
   */
  readonly halfLifeMs?: number;
  /**
   * `'recursive'` (default): s₁ = y₁, sᵢ = α yᵢ + (1 − α) sᵢ₋₁, the handbook's form. `'adjusted'`: the
   * weighted mean Σ wᵢⱼ yⱼ / Σ wᵢⱼ over all values so far with wᵢⱼ = (1 − α)^(i − j) (or 2^(−(tᵢ − tⱼ)/h)), which
   * does not over-weight the first value.
   */
  readonly form?: 'recursive' | 'adjusted';
  /** Input column (default: the first). */
  readonly column?: string;
  /** Output column name (default `'smoothed'`). */
  readonly as?: string;
  /** Values needed before a result is given (default 1); earlier rows are NaN. */
  readonly minObservations?: number;
}

function positive(v: unknown, path: string, extra: string, ok: (x: number) => boolean): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || !ok(v)) {
    throw new KalendsRangeError(`${path}: expected ${extra}, got ${describeValue(v)}`, {
      code: typeof v === 'number' ? 'out-of-range' : 'invalid-type',
      received: v,
      path,
    });
  }
  return v;
}

/**
 * Exponentially weighted mean of one column. Missing values (NaN) are skipped: they neither update the mean
 * nor, in the row-based forms, count as a step of decay (in the time-based form decay follows elapsed time);
 * the result at a missing row is the mean so far.
 *
 * @example
 * ```ts
 * const s = seriesFromPairs([[0, 71], [1, 70], [2, 69]]);
 * smoothSeries(s, { alpha: 0.1 }).columns.smoothed; // [71, 70.9, 70.71]
 * smoothSeries(s, { span: 19 });                    // alpha = 0.1
 * smoothSeries(s, { halfLifeMs: 7 * 86_400_000 });  // weights halve every 7 days
 * ```
 */
export function smoothSeries(series: Series, options: SmoothOptions): Series {
  requireSeries(series, 'series');
  if (options === null || typeof options !== 'object') {
    throw new KalendsTypeError(`options: expected { alpha | span | halfLife | halfLifeMs }, got ${describeValue(options)}`, {
      code: 'invalid-type',
      received: options,
    });
  }
  const given = (['alpha', 'span', 'halfLife', 'halfLifeMs'] as const).filter((k) => options[k] !== undefined);
  if (given.length !== 1) {
    throw new KalendsRangeError(
      `options: expected exactly one of alpha, span, halfLife, halfLifeMs, got ${given.length === 0 ? 'none' : given.join(' and ')}`,
      { code: 'out-of-range', received: options },
    );
  }
  let alpha = Number.NaN;
  let halfLifeMs = Number.NaN;
  if (options.alpha !== undefined) alpha = positive(options.alpha, 'options.alpha', 'a number with 0 < alpha <= 1', (x) => x > 0 && x <= 1);
  else if (options.span !== undefined) alpha = 2 / (positive(options.span, 'options.span', 'a number >= 1', (x) => x >= 1) + 1);
  else if (options.halfLife !== undefined) alpha = 1 - 2 ** (-1 / positive(options.halfLife, 'options.halfLife', 'a positive number of rows', (x) => x > 0));
  else halfLifeMs = positive(options.halfLifeMs, 'options.halfLifeMs', 'a positive number of milliseconds', (x) => x > 0);
  const form = options.form ?? 'recursive';
  if (form !== 'recursive' && form !== 'adjusted') {
    throw new KalendsRangeError(`options.form: expected "recursive" or "adjusted", got ${describeValue(form)}`, {
      code: 'out-of-range',
      received: form,
    });
  }
  const minObs = options.minObservations ?? 1;
  if (typeof minObs !== 'number' || !Number.isInteger(minObs) || minObs < 0) {
    throw new KalendsRangeError(`options.minObservations: expected a non-negative integer, got ${describeValue(minObs)}`, {
      code: 'out-of-range',
      received: minObs,
    });
  }
  const v = columnOfSeries(series, options.column);
  const t = series.epochMs;
  const n = v.length;
  const out = new Float64Array(n);
  const timed = alpha !== alpha;
  let num = 0; // recursive: the mean; adjusted: Σ w y
  let den = 0; // adjusted: Σ w
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
  return makeSeries(t, [options.as ?? 'smoothed'], [out]);
}

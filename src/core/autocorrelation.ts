/**
 * Autocovariance and autocorrelation, the biased (divide-by-n) estimator:
 *   γ̂_k = Σ_{t=k+1..n} d_t d_{t−k} / n,   r_k = Σ_{t=k+1..n} d_t d_{t−k} / c₀,
 * with no n/(n−k) factor, which keeps the sequence positive semi-definite and |r_k| ≤ 1.
 * Sources: Box, Jenkins & Reinsel, *Time Series Analysis*; NIST/SEMATECH e-Handbook §1.3.5.12;
 * NIST StRD univariate definitions.
 *
 * Gap-aware: gaps have d_t = 0, so each lag sum runs over the pairs where both values exist, and n
 * is the number of values present. A lag with no available pair is `NaN` (undefined, not zero).
 * The lag sums and their two paths are in lagProductSums.ts, the pair counts in pairCounts.ts.
 */
import { centre } from "./centre";
import { invalid } from "./errors";
import { seriesName } from "./seriesName";
import { lagProductSums } from "./lagProductSums";
import { pairCounts } from "./pairCounts";
import type { Series } from "./types";

export interface Autocorrelation {
  readonly n: number;
  readonly mean: number;
  /** c₀/scale² = Σ d_t² of the stored deviations (centre.ts). */
  readonly sumSquares: number;
  /** d_t/scale (centre.ts). */
  readonly deviations: Float64Array;
  /** Power of two the deviations were divided by; 1 for data of ordinary size. */
  readonly scale: number;
  /** γ̂_k for k = 0..K, in the data's own units. */
  readonly autocovariance: Float64Array;
  /** r_k for k = 0..K (r_0 = 1); NaN where a lag has no available pair. */
  readonly correlation: Float64Array;
  /** Pairs available at each lag, k = 0..K. */
  readonly pairs: Int32Array;
}

/**
 * Autocovariance and autocorrelation of a series to lag `maxLag` (assumed already validated,
 * 0 ≤ maxLag < series length). Refuses a constant series: its autocorrelation is undefined.
 * `into`: an array of the series' length the caller gives up for the deviations (centre.ts), so
 * that a series the caller made (the squared deviations) is centred where it lies.
 *
 * @example
 * // 1, 2, 3, 4: deviations −1.5, −0.5, 0.5, 1.5 from the mean 2.5; Σd² = 5 and n = 4.
 * const series = seriesFromNumbers([1, 2, 3, 4]);
 * autocorrelation(series, 2).autocovariance; // → [1.25, 0.3125, -0.375]
 * autocorrelation(series, 2).correlation; // → [1, 0.25, -0.3]
 * // A gap keeps its position: only the pair (3, 4) is one step apart.
 * autocorrelation(seriesFromValues([1, "", 3, 4]), 1).pairs; // → [3, 1]
 */
export function autocorrelation(
  series: Series,
  maxLag: number,
  into?: Float64Array,
): Autocorrelation {
  const { n, mean, deviations, sumSquares, scale } = centre(series, into);
  if (!(sumSquares > 0)) {
    invalid(
      `${seriesName(series.label)} is constant (every value is ${mean}): its autocorrelation is undefined`,
    );
  }
  // One buffer for the three per-lag results: each small typed array of its own would cost an
  // allocation that, for a short series, takes longer than the arithmetic.
  const lags = maxLag + 1;
  const buffer = new ArrayBuffer(20 * lags);
  const autocovariance = new Float64Array(buffer, 0, lags);
  const correlation = new Float64Array(buffer, 8 * lags, lags);
  const pairs = pairCounts(series, maxLag, new Int32Array(buffer, 16 * lags, lags));
  // The lag sums s_k, turned into γ̂_k = s_k/n in place.
  lagProductSums(deviations, maxLag, autocovariance);
  for (let k = 0; k <= maxLag; k++) {
    const s = k === 0 ? sumSquares : (pairs[k] as number) > 0 ? (autocovariance[k] as number) : NaN;
    autocovariance[k] = scale === 1 ? s / n : (s / n) * scale * scale;
    correlation[k] = k === 0 ? 1 : s / sumSquares;
  }
  return { n, mean, sumSquares, deviations, scale, autocovariance, correlation, pairs };
}

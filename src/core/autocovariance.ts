/**
 * Autocovariance and autocorrelation, the biased (divide-by-n) estimator:
 *   γ̂_k = Σ_{t=k+1..n} d_t d_{t−k} / n,   r_k = Σ_{t=k+1..n} d_t d_{t−k} / c₀,
 * with no n/(n−k) factor, which keeps the sequence positive semi-definite and |r_k| ≤ 1.
 * Sources: Box, Jenkins & Reinsel, *Time Series Analysis*; NIST/SEMATECH e-Handbook §1.3.5.12;
 * NIST StRD univariate definitions.
 *
 * Gap-aware: gaps have d_t = 0, so each lag sum runs over the pairs where both values exist, and n
 * is the number of values present. A lag with no available pair is `NaN` (undefined, not zero).
 * Lag sums are blocked and compensated (see sums.ts). Cost O(n·K).
 */
import { centre } from "./centre";
import { invalid } from "./errors";
import { BLOCK, CompensatedSum } from "./sums";
import type { Series } from "./types";

/** s_k = Σ_t a_t a_{t−k} for k = 0..maxLag (blocked compensated sums). O(n·K). */
export function lagProductSums(a: Float64Array, maxLag: number): Float64Array {
  const length = a.length;
  const sums = new Float64Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) {
    const acc = new CompensatedSum();
    for (let from = k; from < length; from += BLOCK) {
      const to = Math.min(length, from + BLOCK);
      let block = 0;
      for (let t = from; t < to; t++) block += (a[t] as number) * (a[t - k] as number);
      acc.add(block);
    }
    sums[k] = acc.value;
  }
  return sums;
}

/** Number of pairs (t, t−k) with both values present, k = 0..maxLag. O(n·K) with gaps, O(K) without. */
export function pairCounts(series: Series, maxLag: number): Int32Array {
  const counts = new Int32Array(maxLag + 1);
  const { present } = series;
  const length = present.length;
  for (let k = 0; k <= maxLag; k++) {
    if (series.gaps === 0) {
      counts[k] = Math.max(0, length - k);
      continue;
    }
    let c = 0;
    for (let t = k; t < length; t++) c += (present[t] as number) & (present[t - k] as number);
    counts[k] = c;
  }
  return counts;
}

export interface Autocorrelation {
  readonly n: number;
  readonly mean: number;
  /** c₀ = Σ d_t². */
  readonly sumSquares: number;
  readonly deviations: Float64Array;
  /** γ̂_k for k = 0..K. */
  readonly autocovariance: Float64Array;
  /** r_k for k = 0..K (r_0 = 1); NaN where a lag has no available pair. */
  readonly correlation: Float64Array;
  /** Pairs available at each lag, k = 0..K. */
  readonly pairs: Int32Array;
}

/**
 * Autocovariance and autocorrelation of a series to lag `maxLag` (assumed already validated,
 * 0 ≤ maxLag < series length). Refuses a constant series: its autocorrelation is undefined.
 */
export function autocorrelation(series: Series, maxLag: number): Autocorrelation {
  const { n, mean, deviations, sumSquares } = centre(series);
  if (!(sumSquares > 0)) {
    invalid(
      `the series${series.label ? ` "${series.label}"` : ""} is constant (every value is ${mean}): its autocorrelation is undefined`,
    );
  }
  const sums = lagProductSums(deviations, maxLag);
  const pairs = pairCounts(series, maxLag);
  const autocovariance = new Float64Array(maxLag + 1);
  const correlation = new Float64Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) {
    const s = k === 0 ? sumSquares : (pairs[k] as number) > 0 ? (sums[k] as number) : NaN;
    autocovariance[k] = s / n;
    correlation[k] = k === 0 ? 1 : s / sumSquares;
  }
  return { n, mean, sumSquares, deviations, autocovariance, correlation, pairs };
}

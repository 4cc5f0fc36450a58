/**
 * Bias of h-step-ahead forecast errors: is their mean zero?
 *
 * The errors of an optimal h-step forecast are MA(h−1), so their long-run variance needs only the
 * autocovariances of lags 0..h−1 (a rectangular kernel):
 *   V = γ̂_0 + 2 Σ_{j=1}^{h−1} γ̂_j   (γ̂ divided by n, autocorrelation.ts),   t = x̄ / √(V/n),
 * with the small-sample correction of Harvey, Leybourne & Newbold (1997, Int. J. Forecasting
 * 13:281–291), t* = t · √((n + 1 − 2h + h(h−1)/n) / n), referred to Student's t with n − 1 df.
 * The rectangular V can be negative in a sample; then the plain variance γ̂_0 is used instead, and
 * `fallback` says so. With gaps each γ̂_j sums over the pairs present. Cost O(n·h).
 */
import { meanMoments } from "./bias";
import { studentTwoSided } from "./distributions";
import type { Series } from "./types";

export interface HorizonBias {
  readonly n: number;
  readonly horizon: number;
  readonly mean: number;
  /** V, the rectangular long-run variance over lags 0..h−1 (γ̂_0 when `fallback`). */
  readonly longRunVariance: number;
  readonly se: number;
  /** t before the correction. */
  readonly t: number;
  /** The Harvey–Leybourne–Newbold factor √((n + 1 − 2h + h(h−1)/n)/n). */
  readonly correction: number;
  /** t* = t · correction. */
  readonly tCorrected: number;
  /** Student's t degrees of freedom, n − 1. */
  readonly df: number;
  /** Two-sided p of t* against t(n − 1). */
  readonly p: number;
  /** V was not positive, so γ̂_0 was used. */
  readonly fallback: boolean;
}

/** The corrected t of a mean with n values, horizon h and long-run variance V (shared with the audit's draws). */
export function horizonT(mean: number, longRunVariance: number, n: number, h: number): number {
  return (mean / Math.sqrt(longRunVariance / n)) * hlnCorrection(n, h);
}

export function hlnCorrection(n: number, h: number): number {
  return Math.sqrt(Math.max(0, n + 1 - 2 * h + (h * (h - 1)) / n) / n);
}

/** V over lags 0..h−1 from γ̂_0..γ̂_{h−1}; γ̂_0 when that is not positive. */
export function rectangularVariance(
  gamma: ArrayLike<number>,
  h: number,
): { value: number; fallback: boolean } {
  let v = gamma[0] as number;
  for (let j = 1; j < h; j++) {
    const g = gamma[j] as number;
    if (Number.isFinite(g)) v += 2 * g;
  }
  return v > 0 ? { value: v, fallback: false } : { value: gamma[0] as number, fallback: true };
}

export function horizonBias(series: Series, horizon: number): HorizonBias {
  const n = series.count;
  const { gamma, mean, scale } = meanMoments(series, horizon - 1);
  const { value, fallback } = rectangularVariance(gamma, horizon);
  const t = mean / scale / Math.sqrt(value / n);
  const se = Math.sqrt(value / n) * scale;
  const correction = hlnCorrection(n, horizon);
  const tCorrected = t * correction;
  return {
    n,
    horizon,
    mean,
    longRunVariance: value * scale * scale,
    se,
    t,
    correction,
    tCorrected,
    df: n - 1,
    p: studentTwoSided(tCorrected, n - 1),
    fallback,
  };
}

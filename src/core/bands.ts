/**
 * Significance bands for r_k: standard errors se_k under three nulls, and the half-width
 * z_{1−α/2}·se_k drawn around zero.
 *
 * - `noise` (iid null): se_k = 1/√n. Box, Jenkins & Reinsel, *Time Series Analysis*, §2.1.6.
 * - `bartlett` (MA(k−1) null at lag k): se_k = √((1 + 2 Σ_{j=1}^{k−1} r_j²)/n), Bartlett (1946),
 *   JRSS Suppl. 8:27–41. The sum stops at k−1, not k.
 * - `robust` (uncorrelated but heteroskedastic, e.g. volatility clustering):
 *   se_k² = v̂_k = Σ_{t>k} d_t² d_{t−k}² / c₀², Taylor (1984), JRSS C 33:300–308; Lobato,
 *   Nankervis & Savin (2001), Int. Econ. Rev. 42:187–205.
 * Output index k−1 holds lag k. Cost O(K) for noise and Bartlett, O(n·K) for robust.
 */
import type { Autocorrelation } from "./autocorrelation";
import { lagProductSums } from "./lagProductSums";
import type { BandKind } from "./types";

/** v̂_k = Σ_{t>k} d_t² d_{t−k}² / c₀² for k = 1..K (index k−1). O(n·K). */
export function robustVariances(ac: Autocorrelation, maxLag: number): Float64Array {
  const squares = new Float64Array(ac.deviations.length);
  for (let t = 0; t < squares.length; t++) {
    const d = ac.deviations[t] as number;
    squares[t] = d * d;
  }
  const sums = lagProductSums(squares, maxLag);
  const c0Squared = ac.sumSquares * ac.sumSquares;
  const variances = new Float64Array(maxLag);
  for (let k = 1; k <= maxLag; k++) variances[k - 1] = (sums[k] as number) / c0Squared;
  return variances;
}

/**
 * se_k for k = 1..K under the chosen null. `robust` needs `robustVariance` (from
 * `robustVariances`), computed once by the caller because the robust Q* uses it too.
 */
export function standardErrors(
  kind: BandKind,
  ac: Autocorrelation,
  maxLag: number,
  robustVariance?: Float64Array,
): Float64Array {
  const n = ac.n;
  const se = new Float64Array(maxLag);
  if (kind === "noise") {
    se.fill(1 / Math.sqrt(n));
  } else if (kind === "bartlett") {
    let sumSquares = 0;
    for (let k = 1; k <= maxLag; k++) {
      se[k - 1] = Math.sqrt((1 + 2 * sumSquares) / n);
      const r = ac.correlation[k] as number;
      if (Number.isFinite(r)) sumSquares += r * r;
    }
  } else {
    const v = robustVariance ?? robustVariances(ac, maxLag);
    for (let k = 1; k <= maxLag; k++) se[k - 1] = Math.sqrt(v[k - 1] as number);
  }
  return se;
}

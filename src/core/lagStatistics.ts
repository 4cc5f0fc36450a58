/**
 * The statistics the verdict rests on, for one arrangement of a subject's deviations: each lag's
 * standardised value z_k = r_k / se_k (noise, Bartlett or robust band, bands.ts) and the joint
 * statistic Q of the chosen kind (portmanteau.ts). The observed series and every permuted copy of
 * it go through this one function, so a draw equal to the observed arrangement gives bit for bit
 * the observed statistic and ties are ties (a permutation p-value needs that).
 *
 * Plain sums, not the compensated ones of lagProductSums.ts: under a permutation the mean and
 * c₀ = Σ d_t² are the same for every arrangement, so r_k = s_k / c₀ needs only the lag sums, and
 * their rounding (about n·eps relative) is far below the resolution of any reference drawn here.
 * Cost O(n·K), twice that for the robust kinds (lag sums of the squares too).
 */
import type { BandKind, TestKind } from "./types";

export interface LagStatisticsSpec {
  /** Values present. */
  readonly n: number;
  readonly maxLag: number;
  readonly bandKind: BandKind;
  readonly testKind: TestKind;
  /** c₀ = Σ d_t², the same for every arrangement. */
  readonly sumSquares: number;
  /** Pairs available at lag k (index k); a lag with none is left out, as in the core tests. */
  readonly pairs: ArrayLike<number>;
}

/** Reusable buffers, so that thousands of draws allocate nothing. */
export interface LagStatisticsWork {
  /** s_k at index k (index 0 unused). */
  readonly sums: Float64Array;
  readonly squareSums: Float64Array;
  readonly squares: Float64Array;
  /** z_k at index k−1 (NaN for a lag without pairs). */
  readonly z: Float64Array;
  /** r_0..r_K (r_0 = 1; NaN for a lag without pairs). */
  readonly r: Float64Array;
}

export function lagStatisticsWork(length: number, maxLag: number): LagStatisticsWork {
  return {
    sums: new Float64Array(maxLag + 1),
    squareSums: new Float64Array(maxLag + 1),
    squares: new Float64Array(length),
    z: new Float64Array(maxLag),
    r: new Float64Array(maxLag + 1).fill(1),
  };
}

/**
 * s_k = Σ_t a_t a_{t−k}, k = 1..K, each with four interleaved partial sums: one running sum is
 * bound by the latency of floating-point addition, four keep the multiplier busy.
 */
function plainLagSums(a: Float64Array, maxLag: number, into: Float64Array): void {
  const length = a.length;
  for (let k = 1; k <= maxLag; k++) {
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    let t = k;
    for (; t + 3 < length; t += 4) {
      s0 += (a[t] as number) * (a[t - k] as number);
      s1 += (a[t + 1] as number) * (a[t + 1 - k] as number);
      s2 += (a[t + 2] as number) * (a[t + 2 - k] as number);
      s3 += (a[t + 3] as number) * (a[t + 3 - k] as number);
    }
    for (; t < length; t++) s0 += (a[t] as number) * (a[t - k] as number);
    into[k] = s0 + s1 + (s2 + s3);
  }
}

/**
 * Fills `work.z` with z_1..z_K of the arrangement `a` (deviations at present positions, 0 at
 * gaps) and returns Q. With `withQOnly` the z values are left untouched (for draws that only
 * refine the joint test's p).
 */
export function lagStatistics(
  a: Float64Array,
  spec: LagStatisticsSpec,
  work: LagStatisticsWork,
  withQOnly = false,
): number {
  const { n, maxLag: K, bandKind, testKind, sumSquares: c0, pairs } = spec;
  const { sums, squareSums, squares, z } = work;
  plainLagSums(a, K, sums);
  const robust = bandKind === "robust" || testKind === "robust";
  if (robust) {
    for (let t = 0; t < a.length; t++) {
      const d = a[t] as number;
      squares[t] = d * d;
    }
    plainLagSums(squares, K, squareSums);
  }
  const c0Squared = c0 * c0;
  const rootN = Math.sqrt(n);
  let q = 0;
  let bartlettSum = 0;
  for (let k = 1; k <= K; k++) {
    if (!((pairs[k] as number) > 0)) {
      work.r[k] = NaN;
      if (!withQOnly) z[k - 1] = NaN;
      continue;
    }
    const r = (sums[k] as number) / c0;
    work.r[k] = r;
    const v = robust ? (squareSums[k] as number) / c0Squared : 0;
    switch (testKind) {
      case "box-pierce":
        q += n * r * r;
        break;
      case "robust":
        q += v > 0 ? (r * r) / v : 0;
        break;
      case "ljung-box":
      case "squares":
        q += (n * (n + 2) * r * r) / (n - k);
        break;
    }
    if (withQOnly) continue;
    if (bandKind === "noise") z[k - 1] = r * rootN;
    else if (bandKind === "bartlett") {
      z[k - 1] = r / Math.sqrt((1 + 2 * bartlettSum) / n);
      bartlettSum += r * r;
    } else z[k - 1] = v > 0 ? r / Math.sqrt(v) : NaN;
  }
  return q;
}

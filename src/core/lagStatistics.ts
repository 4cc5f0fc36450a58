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
 * bound by the latency of floating-point addition, four keep the multiplier busy. Lag k's sum
 * s0 takes t = k, k+4, …, s1 t = k+1, k+5, … over its whole groups of four (t ≤ k + 4G − 1,
 * G = ⌊(length − k)/4⌋), then s0 the rest in order; s_k = s0 + s1 + (s2 + s3).
 *
 * Lags go in pairs (k, k+1) through one loop, which loads each a_t once for both: the pair's
 * loop runs over lag k+1's whole groups, and lag k's additions there fall into its own partial
 * sums in the same order (its classes shifted by one), so each s_k is bit for bit the sum above.
 */
export function plainLagSums(a: Float64Array, maxLag: number, into: Float64Array): void {
  let k = 1;
  for (; k + 1 <= maxLag; k += 2) pairOfLagSums(a, k, into);
  if (k <= maxLag) into[k] = oneLagSum(a, k);
}

/** s_k alone, as the file's comment orders its additions. */
function oneLagSum(a: Float64Array, k: number): number {
  const length = a.length;
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
  return s0 + s1 + (s2 + s3);
}

/** s_k and s_{k+1} in one pass (see `plainLagSums`). */
function pairOfLagSums(a: Float64Array, k: number, into: Float64Array): void {
  const length = a.length;
  const j = k + 1;
  // Lag k: its first addition (t = k, class 0) comes before the shared loop.
  let p0 = k < length ? (a[k] as number) * (a[0] as number) : 0;
  let p1 = 0;
  let p2 = 0;
  let p3 = 0;
  let q0 = 0;
  let q1 = 0;
  let q2 = 0;
  let q3 = 0;
  let t = j;
  for (; t + 3 < length; t += 4) {
    const x0 = a[t] as number;
    const x1 = a[t + 1] as number;
    const x2 = a[t + 2] as number;
    const x3 = a[t + 3] as number;
    const y0 = a[t - k] as number;
    const y1 = a[t + 1 - k] as number;
    const y2 = a[t + 2 - k] as number;
    const y3 = a[t + 3 - k] as number;
    // t − k ≡ 1, 2, 3, 0 (mod 4) for lag k; 0, 1, 2, 3 for lag k + 1.
    p1 += x0 * y0;
    p2 += x1 * y1;
    p3 += x2 * y2;
    p0 += x3 * y3;
    q0 += x0 * (a[t - j] as number);
    q1 += x1 * y0;
    q2 += x2 * y1;
    q3 += x3 * y2;
  }
  // Lag k + 1's whole groups are done: the rest is its tail, into q0 in order.
  for (let u = t; u < length; u++) q0 += (a[u] as number) * (a[u - j] as number);
  // Lag k may have one whole group more (into its own classes), then its tail into p0.
  const groupsEnd = k + 4 * Math.floor((length - k) / 4);
  for (let u = t; u < length; u++) {
    const product = (a[u] as number) * (a[u - k] as number);
    if (u >= groupsEnd) p0 += product;
    else {
      const c = (u - k) & 3;
      if (c === 0) p0 += product;
      else if (c === 1) p1 += product;
      else if (c === 2) p2 += product;
      else p3 += product;
    }
  }
  into[k] = p0 + p1 + (p2 + p3);
  into[j] = q0 + q1 + (q2 + q3);
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

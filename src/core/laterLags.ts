/**
 * Joint test of the lags from h on, for h-step-ahead forecast errors.
 *
 * The errors of an optimal h-step forecast are MA(h−1): r_1..r_{h−1} are expected to differ from
 * zero and are not tested. Under that hypothesis Bartlett's formula for the covariance of sample
 * autocorrelations (Bartlett 1946, JRSS Suppl. 8:27–41; Box, Jenkins & Reinsel, *Time Series
 * Analysis*, §2.1.6) reduces, for lags k, l ≥ h, to
 *   n·cov(r_k, r_l) ≈ c_{l−k},   c_s = Σ_{|v|<h} ρ_v ρ_{v+s}   (ρ_0 = 1, ρ_{±v} = ρ_v, ρ = 0 from h on),
 * because every other term of the formula carries ρ_k or ρ_l. With ρ_v estimated by r_v, the test
 * is the quadratic form
 *   Q = r̃ᵀ C⁻¹ r̃,   C = [c_{l−k}],   r̃_k = r_k √(n(n+2)/(n−k)),
 * against χ² with one degree of freedom per tested lag. The scaling of r̃ is Ljung & Box's (1978,
 * Biometrika 65:297–303) small-sample factor, so for h = 1 (C = I) Q is exactly the Ljung–Box
 * statistic. C is the Gram matrix of shifted copies of (ρ_{1−h}, …, ρ_{h−1}), positive definite
 * because ρ_0 = 1. A lag with no available pair (NaN r) is left out, with its row and column of C.
 * Q = ‖L⁻¹ r̃‖² with C = L Lᵀ by Cholesky (Golub & Van Loan, *Matrix Computations*, §4.2), in
 * buffers the caller may reuse (the audit's Monte Carlo reference computes Q for every draw).
 * Cost O(K³), K ≤ n.
 */
import { chiSquareUpperTail } from "./distributions";
import { invalid } from "./errors";

export interface LaterLagsTest {
  /** h, the first lag tested. */
  readonly firstLag: number;
  /** K, the last lag tested. */
  readonly maxLag: number;
  readonly q: number;
  readonly df: number;
  /** NaN when no lag from h to K has a pair of values. */
  readonly p: number;
}

/**
 * `correlation` holds r_0..r_K (r_0 = 1) of a series with `n` values present; lags h..K are
 * tested, lags 1..h−1 shape the covariance. Requires 1 ≤ h ≤ K < n.
 */
export function laterLagsTest(
  correlation: ArrayLike<number>,
  n: number,
  firstLag: number,
  buffers: LaterLagsBuffers = laterLagsBuffers(correlation.length - 1),
): LaterLagsTest {
  const maxLag = correlation.length - 1;
  const h = firstLag;
  const { q, m } = laterLagsQ(correlation, n, h, buffers);
  if (m === 0) return { firstLag: h, maxLag, q: NaN, df: 0, p: NaN };
  return { firstLag: h, maxLag, q, df: m, p: chiSquareUpperTail(q, m) };
}

/**
 * Q and its df m without the p-value: the covariances c_s of the MA(h−1) shape from r_1..r_{h−1}
 * (into the buffers), then `laterLagsStatistic`. A Monte Carlo reference calls this once a draw
 * and ranks the Q values, so it allocates nothing and computes no tail.
 */
export function laterLagsQ(
  correlation: ArrayLike<number>,
  n: number,
  h: number,
  buffers: LaterLagsBuffers,
): { q: number; m: number } {
  const maxLag = correlation.length - 1;
  const rho = (v: number): number => {
    const lag = Math.abs(v);
    if (lag === 0) return 1;
    if (lag >= h) return 0;
    const r = correlation[lag] as number;
    return Number.isFinite(r) ? r : 0;
  };
  const c = buffers.covariances;
  for (let s = 0; s <= maxLag - h; s++) {
    let sum = 0;
    for (let v = 1 - h; v <= h - 1; v++) sum += rho(v) * rho(v + s);
    c[s] = sum;
  }
  return laterLagsStatistic(correlation, n, h, c, buffers);
}

/** Work space for `laterLagsStatistic` with up to K tested lags. */
export interface LaterLagsBuffers {
  readonly lags: Int32Array;
  readonly scaled: Float64Array;
  readonly factor: Float64Array;
  /** c_0..c_{K−h}, the covariances of the MA(h−1) shape. */
  readonly covariances: Float64Array;
}

export function laterLagsBuffers(maxLag: number): LaterLagsBuffers {
  return {
    lags: new Int32Array(maxLag + 1),
    scaled: new Float64Array(maxLag + 1),
    factor: new Float64Array((maxLag + 1) * (maxLag + 1)),
    covariances: new Float64Array(maxLag + 1),
  };
}

/**
 * Q = r̃ᵀ C⁻¹ r̃ over the lags h..K with a pair (m of them), C from the covariances c_s.
 * Cholesky in place; a C that is not positive definite (impossible for a Gram matrix with
 * c_0 ≥ 1, barring rounding) is refused.
 */
export function laterLagsStatistic(
  correlation: ArrayLike<number>,
  n: number,
  h: number,
  c: Float64Array,
  buffers: LaterLagsBuffers,
): { q: number; m: number } {
  const maxLag = correlation.length - 1;
  const { lags, scaled, factor } = buffers;
  let m = 0;
  for (let k = h; k <= maxLag; k++) {
    const r = correlation[k] as number;
    if (!Number.isFinite(r)) continue;
    lags[m] = k;
    scaled[m] = r * Math.sqrt((n * (n + 2)) / (n - k));
    m++;
  }
  // Lower triangle of C = L Lᵀ, row by row.
  for (let i = 0; i < m; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = c[Math.abs((lags[i] as number) - (lags[j] as number))] as number;
      for (let p = 0; p < j; p++)
        sum -= (factor[i * m + p] as number) * (factor[j * m + p] as number);
      if (i === j) {
        if (!(sum > 0)) invalid("the later-lags covariance is not positive definite");
        factor[i * m + i] = Math.sqrt(sum);
      } else factor[i * m + j] = sum / (factor[j * m + j] as number);
    }
  }
  // Forward substitution L y = r̃; Q = ‖y‖².
  let q = 0;
  for (let i = 0; i < m; i++) {
    let y = scaled[i] as number;
    for (let p = 0; p < i; p++) y -= (factor[i * m + p] as number) * (scaled[p] as number);
    y /= factor[i * m + i] as number;
    scaled[i] = y;
    q += y * y;
  }
  return { q, m };
}

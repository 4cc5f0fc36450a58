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
 * The system C x = r̃ is solved by least squares (leastSquares.ts). Cost O(K³), K ≤ n.
 */
import { chiSquareUpperTail } from "./distributions";
import { leastSquares } from "./leastSquares";

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
): LaterLagsTest {
  const maxLag = correlation.length - 1;
  const h = firstLag;
  const rho = (v: number): number => {
    const lag = Math.abs(v);
    if (lag === 0) return 1;
    if (lag >= h) return 0;
    const r = correlation[lag] as number;
    return Number.isFinite(r) ? r : 0;
  };
  const c = new Float64Array(maxLag - h + 1);
  for (let s = 0; s < c.length; s++) {
    let sum = 0;
    for (let v = 1 - h; v <= h - 1; v++) sum += rho(v) * rho(v + s);
    c[s] = sum;
  }

  const lags: number[] = [];
  for (let k = h; k <= maxLag; k++) if (Number.isFinite(correlation[k] as number)) lags.push(k);
  const m = lags.length;
  if (m === 0) return { firstLag: h, maxLag, q: NaN, df: 0, p: NaN };
  const scaled = new Float64Array(m);
  const matrix = new Float64Array(m * m);
  lags.forEach((k, i) => {
    scaled[i] = (correlation[k] as number) * Math.sqrt((n * (n + 2)) / (n - k));
    lags.forEach((l, j) => {
      matrix[j * m + i] = c[Math.abs(l - k)] as number;
    });
  });
  const x = leastSquares(matrix, m, m, scaled).coefficients;
  let q = 0;
  for (let i = 0; i < m; i++) q += (scaled[i] as number) * (x[i] as number);
  return { firstLag: h, maxLag, q, df: m, p: chiSquareUpperTail(q, m) };
}

/**
 * Joint (portmanteau) tests of lags 1..k, cumulatively for k = 1..K.
 *
 * - `box-pierce`: Q = n Σ r_k² (Box & Pierce 1970, JASA 65:1509–1526);
 * - `ljung-box`: Q = n(n+2) Σ r_k²/(n−k) (Ljung & Box 1978, Biometrika 65:297–303);
 * - `robust`: Q* = Σ r_k²/v̂_k, the diagonal form of Lobato, Nankervis & Savin (2001), Int. Econ.
 *   Rev. 42:187–205, valid under heteroskedasticity;
 * - `squares`: Ljung–Box on the squared deviations (McLeod & Li 1983, J. Time Ser. Anal.
 *   4:269–273); the caller passes the squares' autocorrelations as `correlation`.
 * Reference χ² with df = k − fittedParams; a fitted mean does not reduce df, and `squares` is not
 * reduced by ARMA parameters (McLeod & Li). Lags with no available pair (NaN r) are left out of
 * the sum and of df. p from the χ² upper tail directly. Cost O(K).
 */
import { chiSquareUpperTail } from "./distributions";
import { CompensatedSum } from "./sums";
import type { TestKind } from "./types";

export const TEST_NAMES: Readonly<Record<TestKind, string>> = {
  "ljung-box": "Ljung–Box",
  "box-pierce": "Box–Pierce",
  robust: "robust Q*",
  squares: "McLeod–Li (squares)",
};

export interface JointTestInput {
  readonly kind: TestKind;
  /** Values present. */
  readonly n: number;
  /** r_0..r_K of the series (or of its squared deviations for `squares`). */
  readonly correlation: ArrayLike<number>;
  /** v̂_k for k = 1..K (index k−1), required by `robust`. */
  readonly robustVariance?: ArrayLike<number>;
  readonly fittedParams: number;
}

export interface CumulativeJointTest {
  /** Q over lags 1..k at index k−1. */
  readonly q: Float64Array;
  readonly df: Int32Array;
  /** p-value at index k−1; NaN where df ≤ 0. */
  readonly p: Float64Array;
}

export interface JointTest {
  readonly test: TestKind;
  readonly q: number;
  readonly df: number;
  readonly p: number;
}

/** Q_k, df_k and p_k for k = 1..K. */
export function cumulativeJointTest(input: JointTestInput): CumulativeJointTest {
  const { kind, n, correlation, robustVariance, fittedParams } = input;
  const maxLag = correlation.length - 1;
  const q = new Float64Array(maxLag);
  const df = new Int32Array(maxLag);
  const p = new Float64Array(maxLag);
  const reduction = kind === "squares" ? 0 : fittedParams;
  const total = new CompensatedSum();
  let used = 0;
  for (let k = 1; k <= maxLag; k++) {
    const r = correlation[k] as number;
    if (Number.isFinite(r)) {
      total.add(term(kind, n, k, r, robustVariance));
      used++;
    }
    const dfK = used - reduction;
    q[k - 1] = total.value;
    df[k - 1] = dfK;
    p[k - 1] = dfK > 0 ? chiSquareUpperTail(total.value, dfK) : NaN;
  }
  return { q, df, p };
}

function term(
  kind: TestKind,
  n: number,
  k: number,
  r: number,
  robustVariance: ArrayLike<number> | undefined,
): number {
  switch (kind) {
    case "box-pierce":
      return n * r * r;
    case "robust": {
      const v = robustVariance?.[k - 1];
      if (v === undefined) throw new Error("robust joint test needs the robust variances");
      return v > 0 ? (r * r) / v : 0;
    }
    case "ljung-box":
    case "squares":
      return (n * (n + 2) * r * r) / (n - k);
  }
}

/** The joint test over all K lags, the last entry of the cumulative test. */
export function jointTestAt(kind: TestKind, cumulative: CumulativeJointTest): JointTest {
  const last = cumulative.q.length - 1;
  return {
    test: kind,
    q: cumulative.q[last] as number,
    df: cumulative.df[last] as number,
    p: cumulative.p[last] as number,
  };
}

/**
 * The joint test over all K lags alone: the same terms summed in the same order as the
 * cumulative test, so it equals `jointTestAt` of it exactly, at one χ² tail instead of K (for
 * the noise and block checks, which need only the verdict).
 */
export function jointTest(input: JointTestInput): JointTest {
  const { kind, n, correlation, robustVariance, fittedParams } = input;
  const total = new CompensatedSum();
  let used = 0;
  for (let k = 1; k < correlation.length; k++) {
    const r = correlation[k] as number;
    if (Number.isFinite(r)) {
      total.add(term(kind, n, k, r, robustVariance));
      used++;
    }
  }
  const df = used - (kind === "squares" ? 0 : fittedParams);
  return { test: kind, q: total.value, df, p: df > 0 ? chiSquareUpperTail(total.value, df) : NaN };
}

/**
 * Distribution functions, from stdlib's maintained special-function packages (no hand ports).
 * Upper tails are computed directly — the regularised upper incomplete gamma Q(ν/2, x/2) for
 * χ², erfc for the normal, the regularised incomplete beta for the binomial — never as 1 − cdf,
 * so a p of 1e-40 keeps its leading digits.
 *
 * A p-value too small for a double to hold meaningfully is reported as the bound
 * `P_VALUE_FLOOR` (1e-300), never 0; `isPValueBound(p)` tells displays to show "< 1e-300".
 */
import gammainc from "@stdlib/math-base-special-gammainc";
import betainc from "@stdlib/math-base-special-betainc";
import erfc from "@stdlib/math-base-special-erfc";
import normalQuantileStdlib from "@stdlib/stats-base-dists-normal-quantile";
import { upperGammaRegularised } from "./chiSquareTail";

export const P_VALUE_FLOOR = 1e-300;

function floored(p: number): number {
  if (Number.isNaN(p)) return NaN;
  return p < P_VALUE_FLOOR ? P_VALUE_FLOOR : Math.min(1, p);
}

/** True when p is the floor, i.e. the true p-value is at most 1e-300. */
export function isPValueBound(p: number): boolean {
  return p <= P_VALUE_FLOOR;
}

/** Above this χ² statistic (or df) the tail comes from chiSquareTail.ts, not from stdlib. */
const LARGE_CHI_SQUARE = 1000;

/**
 * P(χ²_df ≥ x) = Q(df/2, x/2), the regularised upper incomplete gamma: stdlib's gammainc for
 * ordinary arguments, and Echolot's own series and continued fraction (chiSquareTail.ts) beyond
 * 1000, where stdlib's is off by up to a few percent.
 *
 * @example
 * // With 2 df the χ² law is exponential with mean 2: P(χ² ≥ x) = e^(−x/2).
 * chiSquareUpperTail(2 * Math.log(20), 2); // ≈ 0.05
 * chiSquareUpperTail(0, 3); // → 1
 */
export function chiSquareUpperTail(x: number, df: number): number {
  if (Number.isNaN(x) || !(df > 0)) return NaN;
  if (x <= 0) return 1;
  if (x > LARGE_CHI_SQUARE || df > LARGE_CHI_SQUARE) {
    return floored(upperGammaRegularised(df / 2, x / 2));
  }
  return floored(gammainc(x / 2, df / 2, true, true));
}

/**
 * P(Z ≥ z) for the standard normal, erfc(z/√2)/2.
 *
 * @example
 * normalUpperTail(0); // → 0.5
 */
export function normalUpperTail(z: number): number {
  if (Number.isNaN(z)) return NaN;
  return floored(0.5 * erfc(z / Math.SQRT2));
}

/** Two-sided normal p-value P(|Z| ≥ |z|) = erfc(|z|/√2). */
export function normalTwoSided(z: number): number {
  if (Number.isNaN(z)) return NaN;
  return floored(erfc(Math.abs(z) / Math.SQRT2));
}

/** Standard normal quantile z_p with Φ(z_p) = p. */
export function normalQuantile(p: number): number {
  return normalQuantileStdlib(p, 0, 1);
}

/**
 * P(X ≥ m) for X ~ Binomial(trials, prob), as the regularised incomplete beta I_prob(m, trials−m+1)
 * (the standard identity; Abramowitz & Stegun 26.5.24), not as 1 − cdf.
 */
export function binomialUpperTail(m: number, trials: number, prob: number): number {
  if (!(m > 0)) return 1;
  if (m > trials) return 0;
  return betainc(prob, m, trials - m + 1, true, false);
}

/**
 * Two-sided p of Student's t with ν degrees of freedom, P(|T| ≥ |t|) = I_{ν/(ν+t²)}(ν/2, 1/2),
 * the regularised incomplete beta taken directly (Abramowitz & Stegun 26.7.1), so a far-tail p
 * keeps its digits.
 */
export function studentTwoSided(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0)) return NaN;
  if (!Number.isFinite(t)) return P_VALUE_FLOOR;
  return floored(betainc(df / (df + t * t), df / 2, 0.5, true, false));
}

/**
 * Large-sample theory for sample autocorrelations, used to set simulation tolerances.
 *
 * Bartlett's formula (Bartlett 1946, JRSS Suppl. 8:27–41; in the form of Brockwell & Davis,
 * *Time Series: Theory and Methods*, Thm 7.2.1, eq. 7.2.6): for a linear process with ACF ρ,
 *   n·cov(r_i, r_j) → w_ij = Σ_{m≥1} [ρ(m+i) + ρ(m−i) − 2ρ(i)ρ(m)]·[ρ(m+j) + ρ(m−j) − 2ρ(j)ρ(m)].
 * The partial φ_kk is a smooth function of (r_1..r_k), so its asymptotic variance follows by the
 * delta method, gᵀWg/n with g = ∂φ_kk/∂r; beyond an AR(p) order this gives Quenouille's 1/n.
 */
import { partialAutocorrelation } from "../../src/core";

/** ρ(m) for any integer m from a function of m ≥ 0 (ρ is even). */
export type Acf = (lag: number) => number;

export function ar1Acf(phi: number): Acf {
  return (lag) => phi ** Math.abs(lag);
}

/** MA(1) x_t = e_t + θe_{t−1}: ρ_1 = θ/(1+θ²), 0 beyond. */
export function ma1Acf(theta: number): Acf {
  return (lag) => {
    const m = Math.abs(lag);
    return m === 0 ? 1 : m === 1 ? theta / (1 + theta * theta) : 0;
  };
}

/** Terms of the infinite sum: 0.6^400 is below 1e-88, far under a double's resolution. */
const TERMS = 400;

/** Bartlett's w_ij (n times the asymptotic covariance of r_i and r_j). */
export function bartlettCovariance(rho: Acf, i: number, j: number): number {
  let sum = 0;
  for (let m = 1; m <= TERMS; m++) {
    const a = rho(m + i) + rho(m - i) - 2 * rho(i) * rho(m);
    const b = rho(m + j) + rho(m - j) - 2 * rho(j) * rho(m);
    sum += a * b;
  }
  return sum;
}

/** Asymptotic standard error of r_k by Bartlett's formula. */
export function bartlettStandardError(rho: Acf, k: number, n: number): number {
  return Math.sqrt(bartlettCovariance(rho, k, k) / n);
}

/** Theoretical partials φ_kk, k = 1..K, by Durbin–Levinson on the theoretical ρ. */
export function theoreticalPartials(rho: Acf, maxLag: number): Float64Array {
  return partialAutocorrelation(Array.from({ length: maxLag + 1 }, (_, k) => rho(k)));
}

/** Asymptotic standard error of the sample partial φ̂_kk (delta method on Bartlett's W). */
export function partialStandardError(rho: Acf, k: number, n: number): number {
  const base = Array.from({ length: k + 1 }, (_, m) => rho(m));
  const h = 1e-6;
  const gradient: number[] = [];
  for (let i = 1; i <= k; i++) {
    const up = [...base];
    const down = [...base];
    up[i] = (up[i] as number) + h;
    down[i] = (down[i] as number) - h;
    const plus = partialAutocorrelation(up)[k - 1] as number;
    const minus = partialAutocorrelation(down)[k - 1] as number;
    gradient.push((plus - minus) / (2 * h));
  }
  let variance = 0;
  for (let i = 1; i <= k; i++) {
    for (let j = 1; j <= k; j++) {
      variance +=
        (gradient[i - 1] as number) * (gradient[j - 1] as number) * bartlettCovariance(rho, i, j);
    }
  }
  return Math.sqrt(variance / n);
}

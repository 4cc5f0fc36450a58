/**
 * An MA(q) model matched to a series' first q autocorrelations, for the forecast audit's Monte
 * Carlo null (the errors of an optimal h-step forecast are MA(h−1)).
 *
 * The innovations algorithm (Brockwell & Davis, *Introduction to Time Series and Forecasting*,
 * §5.2.2) run on the autocovariance sequence (1, r_1, …, r_q, 0, 0, …): its coefficients θ_{m,j}
 * converge, as m grows, to the invertible MA(q) whose autocorrelations are r_1..r_q, and its
 * innovation variances v_m to that model's innovation variance. When r_1..r_q belong to no MA(q)
 * (the spectrum 1 + 2 Σ r_j cos(jω) dips below zero), v_m falls to zero; the autocorrelations are
 * then shrunk towards zero by a factor 0.9 until they do (a nearby valid null, stated in the doc of
 * the audit). Cost O(m·q) with m ≤ 400 steps.
 */

export interface MovingAverageModel {
  /** θ_1..θ_q: x_t = e_t + Σ θ_j e_{t−j}. */
  readonly thetas: Float64Array;
  /** The factor the autocorrelations were shrunk by (1 when they were used as they are). */
  readonly shrink: number;
}

const STEPS = 400;

function innovations(rho: Float64Array, q: number): Float64Array | null {
  // v_m for every m so far; θ_{m,j} only for the last q + 1 values of m, in a ring: step m reads
  // θ_{k,·} for k ≥ m − q. Its own row is written at j ≤ q and read (as zeros beyond q) up to
  // j = 2q, so each row holds 2q + 1 entries, cleared before reuse.
  const v: number[] = [1];
  const rows = Array.from({ length: q + 1 }, () => new Float64Array(2 * q + 1));
  const gamma = (lag: number) => (lag === 0 ? 1 : lag <= q ? (rho[lag - 1] as number) : 0);
  for (let m = 1; m <= STEPS; m++) {
    const row = rows[m % (q + 1)] as Float64Array;
    row.fill(0);
    for (let k = Math.max(0, m - q); k < m; k++) {
      let sum = gamma(m - k);
      const rowK = rows[k % (q + 1)] as Float64Array;
      for (let j = Math.max(0, k - q); j < k; j++) {
        sum -= (row[m - j] as number) * (rowK[k - j] as number) * (v[j] as number);
      }
      row[m - k] = sum / (v[k] as number);
    }
    let vm = 1;
    for (let j = Math.max(0, m - q); j < m; j++)
      vm -= (row[m - j] as number) ** 2 * (v[j] as number);
    if (!(vm > 1e-8)) return null;
    v.push(vm);
  }
  const last = rows[STEPS % (q + 1)] as Float64Array;
  return Float64Array.from({ length: q }, (_, j) => last[j + 1] as number);
}

/** The MA(q) model whose autocorrelations are `rho` (r_1..r_q, index j−1), shrunk if need be. */
export function fitMovingAverage(rho: ArrayLike<number>, q: number): MovingAverageModel {
  if (q === 0) return { thetas: new Float64Array(0), shrink: 1 };
  let shrink = 1;
  for (let attempt = 0; attempt < 200; attempt++) {
    const scaled = Float64Array.from({ length: q }, (_, j) => {
      const r = rho[j] as number;
      return Number.isFinite(r) ? r * shrink : 0;
    });
    const thetas = innovations(scaled, q);
    if (thetas !== null) return { thetas, shrink };
    shrink *= 0.9;
  }
  return { thetas: new Float64Array(q), shrink: 0 };
}

/**
 * Seeded simulated processes for tests, demos and the bench: white noise, AR(1), MA(q) and a
 * GARCH(1,1)-like series (uncorrelated, with volatility clustering; Bollerslev 1986,
 * J. Econometrics 31:307–327). A burn-in of 200 steps removes the start-up transient.
 */
import type { Random } from "./random";

const BURN_IN = 200;

export function whiteNoise(random: Random, n: number, sd = 1): Float64Array {
  const x = new Float64Array(n);
  for (let t = 0; t < n; t++) x[t] = sd * random.normal();
  return x;
}

/** x_t = φ x_{t−1} + e_t. */
export function ar1(random: Random, n: number, phi: number): Float64Array {
  const x = new Float64Array(n);
  let previous = 0;
  for (let t = -BURN_IN; t < n; t++) {
    previous = phi * previous + random.normal();
    if (t >= 0) x[t] = previous;
  }
  return x;
}

/** x_t = e_t + θ_1 e_{t−1} + … + θ_q e_{t−q}. */
export function movingAverage(random: Random, n: number, thetas: readonly number[]): Float64Array {
  const q = thetas.length;
  const shocks = new Float64Array(n + q);
  for (let i = 0; i < shocks.length; i++) shocks[i] = random.normal();
  const x = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    let value = shocks[t + q] as number;
    for (let j = 1; j <= q; j++) value += (thetas[j - 1] as number) * (shocks[t + q - j] as number);
    x[t] = value;
  }
  return x;
}

/** e_t = σ_t z_t, σ_t² = ω + a e_{t−1}² + b σ_{t−1}². Defaults give strong clustering. */
export function garch11(random: Random, n: number, omega = 0.05, a = 0.15, b = 0.8): Float64Array {
  const x = new Float64Array(n);
  let variance = omega / (1 - a - b);
  let previous = 0;
  for (let t = -BURN_IN; t < n; t++) {
    variance = omega + a * previous * previous + b * variance;
    previous = Math.sqrt(variance) * random.normal();
    if (t >= 0) x[t] = previous;
  }
  return x;
}

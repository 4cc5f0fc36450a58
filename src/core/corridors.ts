/**
 * The two corridors a lag's standardised value z_k is judged against, for the noise check and the
 * forecast audit alike:
 * - inner: ±z_{1−α/2}, one lag on its own at level α;
 * - outer: ±z_{1−a/2} with the Šidák per-test level a = 1 − (1 − α)^{1/K} (multiplicity.ts), which
 *   holds the level α for the K lags counted together.
 * z is the standard normal quantile (distributions.ts). Cost O(1): two quantiles.
 */
import { normalQuantile } from "./distributions";
import { sidakLevel } from "./multiplicity";

export interface CorridorLevels {
  readonly innerLevel: number;
  readonly outerLevel: number;
}

/** The inner and outer corridor levels for `lags` lags counted at family-wise level `alpha`. */
export function corridorLevels(alpha: number, lags: number): CorridorLevels {
  return {
    innerLevel: normalQuantile(1 - alpha / 2),
    outerLevel: normalQuantile(1 - sidakLevel(alpha, lags) / 2),
  };
}

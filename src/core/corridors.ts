/**
 * The two corridors a lag's standardised value z_k = r_k / se_k is judged against, for the noise
 * check and the forecast audit alike:
 * - inner: ±z_{1−α/2}, one lag on its own at level α;
 * - outer: ±z_{1−a/2} with the Šidák per-test level a = 1 − (1 − α)^{1/K} (multiplicity.ts), which
 *   holds the level α for the K lags counted together.
 * z is the standard normal quantile (distributions.ts). Both comparisons are strict, so a NaN z
 * (a lag with no pairs) crosses neither and is not counted as tested. Cost O(1) for the levels,
 * O(K) for the crossings.
 *
 * A value's zone names the same comparisons in one word: `beyond` past the outer corridor,
 * `between` past the inner one only, `inside` otherwise, and `none` for a NaN z.
 */
import { normalQuantile } from "./distributions";
import { sidakLevel } from "./multiplicity";
import type { VerdictLag } from "./verdict";

export interface CorridorLevels {
  readonly innerLevel: number;
  readonly outerLevel: number;
}

/** The inner corridor z_{1−α/2}: one lag on its own at level α. */
export function innerCorridor(alpha: number): number {
  return normalQuantile(1 - alpha / 2);
}

/** The inner and Šidák outer corridor levels for `lags` lags counted at family-wise level `alpha`. */
export function corridorLevels(alpha: number, lags: number): CorridorLevels {
  return {
    innerLevel: normalQuantile(1 - alpha / 2),
    outerLevel: normalQuantile(1 - sidakLevel(alpha, lags) / 2),
  };
}

/** Where a standardised value lies against the two corridors; "none" when z is NaN. */
export type CorridorZone = "inside" | "between" | "beyond" | "none";

/**
 * The zone of z: the strict comparisons of `corridorCrossings` (|z| > outer, then |z| > inner),
 * so a z exactly on a corridor's edge stays inside it.
 */
export function corridorZone(z: number, levels: CorridorLevels): CorridorZone {
  if (Number.isNaN(z)) return "none";
  const size = Math.abs(z);
  if (size > levels.outerLevel) return "beyond";
  if (size > levels.innerLevel) return "between";
  return "inside";
}

export interface CorridorCrossings {
  /** Lag k at index k−1: r_k, z_k and the two corridors (false for lags not counted). */
  readonly lags: VerdictLag[];
  /** Lags counted with a defined z. */
  readonly tested: number;
  /** Counted lags beyond the inner corridor. */
  readonly crossingLags: number[];
}

/**
 * z_k = r_k / se_k for k = 1..K (`correlation` holds r_0..r_K, `se` lag k at index k−1) and where
 * each lies; lags below `firstLag` are shown but not counted (h-step forecast errors).
 */
export function corridorCrossings(
  correlation: ArrayLike<number>,
  se: ArrayLike<number>,
  levels: CorridorLevels,
  firstLag = 1,
): CorridorCrossings {
  const { innerLevel, outerLevel } = levels;
  const maxLag = correlation.length - 1;
  const lags: VerdictLag[] = [];
  const crossingLags: number[] = [];
  let tested = 0;
  for (let k = 1; k <= maxLag; k++) {
    const r = correlation[k] as number;
    const z = r / (se[k - 1] as number);
    const counted = k >= firstLag;
    const crossesBand = counted && Math.abs(z) > innerLevel;
    if (counted && Number.isFinite(z)) tested++;
    if (crossesBand) crossingLags.push(k);
    lags.push({
      lag: k,
      correlation: r,
      z,
      crossesBand,
      outer: counted && Math.abs(z) > outerLevel,
    });
  }
  return { lags, tested, crossingLags };
}

/** The largest |z_k| = |r_k / se_k| over lags 1..K with a finite z (0 when none). */
export function largestZ(correlation: ArrayLike<number>, se: ArrayLike<number>): number {
  let largest = 0;
  for (let k = 1; k < correlation.length; k++) {
    const size = Math.abs((correlation[k] as number) / (se[k - 1] as number));
    if (size > largest) largest = size;
  }
  return largest;
}

/**
 * Adjustments for testing many lags (or many series) at once.
 *
 * - Šidák (1967, JASA 62:626–633): with K independent tests, the per-test level that holds the
 *   family-wise level α is a = 1 − (1 − α)^{1/K}; the adjusted p of one test is 1 − (1 − p)^K.
 *   Both are computed with log1p/expm1 so that small values keep their digits.
 * - Holm (1979, Scand. J. Stat. 6:65–70): step-down, adjusted p_(i) = max_{j≤i} min(1, (K−j+1)p_(j)).
 * - Benjamini & Hochberg (1995, JRSS B 57:289–300): step-up false-discovery-rate q-values,
 *   q_(i) = min_{j≥i} min(1, K p_(j)/j).
 * NaN p-values are left out of the family and stay NaN. Cost O(K log K) for Holm and BH.
 */

/**
 * Per-test level a = 1 − (1 − α)^{1/K} that keeps the family-wise level at α.
 *
 * @example
 * sidakLevel(0.05, 1); // → 0.05
 * // 1 − 0.95^(1/2) = 1 − 0.974679434480896…
 * sidakLevel(0.05, 2); // ≈ 0.025320565519103666
 */
export function sidakLevel(alpha: number, tests: number): number {
  return -Math.expm1(Math.log1p(-alpha) / tests);
}

/** Šidák-adjusted p-value 1 − (1 − p)^K. */
export function sidakAdjust(p: number, tests: number): number {
  if (Number.isNaN(p)) return NaN;
  return Math.min(1, -Math.expm1(tests * Math.log1p(-p)));
}

function rankedFinite(pValues: ArrayLike<number>): number[] {
  const order: number[] = [];
  for (let i = 0; i < pValues.length; i++) if (!Number.isNaN(pValues[i] as number)) order.push(i);
  return order.sort((a, b) => (pValues[a] as number) - (pValues[b] as number));
}

/**
 * Holm step-down adjusted p-values, in input order.
 *
 * @example
 * // Sorted: 0.01 × 3, then 0.03 × 2, then 0.04 × 1 raised to the running maximum 0.06.
 * holmAdjust([0.01, 0.04, 0.03]); // → [0.03, 0.06, 0.06]
 */
export function holmAdjust(pValues: ArrayLike<number>): Float64Array {
  const adjusted = new Float64Array(pValues.length).fill(NaN);
  const order = rankedFinite(pValues);
  const m = order.length;
  let running = 0;
  order.forEach((index, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * (pValues[index] as number)));
    adjusted[index] = running;
  });
  return adjusted;
}

/**
 * Benjamini–Hochberg q-values (adjusted p-values), in input order.
 *
 * @example
 * // 3 × 0.04 / 3 = 0.04; 3 × 0.03 / 2 = 0.045 lowered to 0.04; 3 × 0.01 / 1 = 0.03.
 * benjaminiHochberg([0.01, 0.04, 0.03]); // → [0.03, 0.04, 0.04]
 */
export function benjaminiHochberg(pValues: ArrayLike<number>): Float64Array {
  const adjusted = new Float64Array(pValues.length).fill(NaN);
  const order = rankedFinite(pValues);
  const m = order.length;
  let running = 1;
  for (let rank = m - 1; rank >= 0; rank--) {
    const index = order[rank] as number;
    running = Math.min(running, (m * (pValues[index] as number)) / (rank + 1));
    adjusted[index] = running;
  }
  return adjusted;
}

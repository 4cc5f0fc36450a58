/**
 * Partial autocorrelation by the Durbin–Levinson recursion (Levinson 1947, J. Math. Phys.
 * 25:261–278; Durbin 1960, Rev. Int. Stat. Inst. 28:233–244):
 *   φ_11 = r_1,
 *   φ_kk = (r_k − Σ_{j<k} φ_{k−1,j} r_{k−j}) / (1 − Σ_{j<k} φ_{k−1,j} r_j),
 *   φ_kj = φ_{k−1,j} − φ_kk φ_{k−1,k−j}.
 * Two coefficient rows of length K are reused, so the cost is O(K²) time and O(K) memory.
 * Input: r_0..r_K (r_0 = 1). Output: φ_kk for k = 1..K at index k−1. A NaN lag makes every later
 * partial NaN (undefined from there on).
 *
 * @example
 * // The correlations of an AR(1) with φ = 0.5 (r_k = 0.5^k): one partial, then none.
 * partialAutocorrelation([1, 0.5, 0.25, 0.125]); // → [0.5, 0, 0]
 */
export function partialAutocorrelation(correlation: ArrayLike<number>): Float64Array {
  const maxLag = correlation.length - 1;
  const partials = new Float64Array(Math.max(0, maxLag));
  let previous = new Float64Array(maxLag + 1);
  let current = new Float64Array(maxLag + 1);
  for (let k = 1; k <= maxLag; k++) {
    let numerator = correlation[k] as number;
    let denominator = 1;
    for (let j = 1; j < k; j++) {
      numerator -= (previous[j] as number) * (correlation[k - j] as number);
      denominator -= (previous[j] as number) * (correlation[j] as number);
    }
    const phi = numerator / denominator;
    current[k] = phi;
    for (let j = 1; j < k; j++) {
      current[j] = (previous[j] as number) - phi * (previous[k - j] as number);
    }
    partials[k - 1] = phi;
    const swap = previous;
    previous = current;
    current = swap;
  }
  return partials;
}

/**
 * The standardised partial autocorrelation z = φ̂_kk·√n. Under white noise the sample partials
 * have standard error 1/√n at every lag k ≥ 1, whatever band kind the autocorrelations use
 * (Quenouille 1949, JRSS B 11:68–84), so their z is measured against the same two corridors as
 * the autocorrelations' (corridors.ts). A NaN partial gives a NaN z.
 *
 * @example
 * partialZ(0.25, 64); // → 2
 */
export function partialZ(partial: number, n: number): number {
  return partial * Math.sqrt(n);
}

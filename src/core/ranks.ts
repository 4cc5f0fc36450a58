/**
 * Rank helpers for Monte Carlo and permutation references. Ties count on both sides (≥), which
 * keeps every p-value built from them valid when the statistic is discrete. Each sorts one copy
 * with the typed array's own numeric sort: O(m log m). NaN values are not expected.
 */

/** For each i, #{j : values[j] ≥ values[i]} (i itself included). */
export function upperCounts(values: Float64Array): Int32Array {
  const m = values.length;
  const sorted = values.slice().sort();
  const counts = new Int32Array(m);
  for (let i = 0; i < m; i++) counts[i] = m - lowerBound(sorted, values[i] as number);
  return counts;
}

/** The first index whose value is ≥ x in an ascending array. */
function lowerBound(sorted: Float64Array, x: number): number {
  let low = 0;
  let high = sorted.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if ((sorted[middle] as number) < x) low = middle + 1;
    else high = middle;
  }
  return low;
}

/** The j-th smallest (1-based) of `values[from..]`; +Infinity when j is out of range. */
export function kthSmallest(values: Float64Array, j: number, from = 0): number {
  const count = values.length - from;
  if (!(j >= 1) || j > count) return Infinity;
  return values.slice(from).sort()[j - 1] as number;
}

/** The j-th largest (1-based) of `values[from..]`; +Infinity when j < 1, −Infinity past the end. */
export function kthLargest(values: Float64Array, j: number, from = 0): number {
  const count = values.length - from;
  if (!(j >= 1)) return Infinity;
  if (j > count) return -Infinity;
  return values.slice(from).sort()[count - j] as number;
}

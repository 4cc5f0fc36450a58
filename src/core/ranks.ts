/**
 * Rank helpers for Monte Carlo and permutation references. Ties count on both sides (≥), which
 * keeps every p-value built from them valid when the statistic is discrete. Each sorts one copy
 * with the typed array's own numeric sort: O(m log m). NaN values are not expected.
 */

/** For each i, #{j : values[j] ≥ values[i]} (i itself included). */
export function upperCounts(values: Float64Array): Int32Array {
  return upperCountsSorted(values, values.slice().sort());
}

/** `upperCounts` with the values already sorted ascending (`sorted`), so one sort serves twice. */
export function upperCountsSorted(values: Float64Array, sorted: Float64Array): Int32Array {
  const m = values.length;
  const counts = new Int32Array(m);
  for (let i = 0; i < m; i++) counts[i] = m - lowerBound(sorted, values[i] as number);
  return counts;
}

/** #{j : values[j] ≥ x}: one entry of `upperCounts`, in one pass without a sort. */
export function countAtLeast(values: Float64Array, x: number): number {
  let count = 0;
  for (let j = 0; j < values.length; j++) if ((values[j] as number) >= x) count++;
  return count;
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

/**
 * `kthLargest(values, j, 1)` from the values sorted ascending (`sorted`, every value, the first
 * included): the j-th largest of the values after the first. Leaving one copy of values[0] out of
 * the sorted list gives the sorted rest without a second sort: rest[i] = sorted[i] before the
 * place of values[0], sorted[i + 1] from there on (equal values are the same number).
 */
export function kthLargestOfRest(values: Float64Array, sorted: Float64Array, j: number): number {
  const count = values.length - 1;
  if (!(j >= 1)) return Infinity;
  if (j > count) return -Infinity;
  const index = count - j;
  const place = lowerBound(sorted, values[0] as number);
  return (index < place ? sorted[index] : sorted[index + 1]) as number;
}

/** The j-th largest (1-based) of `values[from..]`; +Infinity when j < 1, −Infinity past the end. */
export function kthLargest(values: Float64Array, j: number, from = 0): number {
  const count = values.length - from;
  if (!(j >= 1)) return Infinity;
  if (j > count) return -Infinity;
  return values.slice(from).sort()[count - j] as number;
}

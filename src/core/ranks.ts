/**
 * Rank helpers for Monte Carlo and permutation references. Ties count on both sides (≥), which
 * keeps every p-value built from them valid when the statistic is discrete. Each sorts one copy
 * (`sortAscending`, O(m log m)) or selects in it (`kthSmallest`, O(m) expected). NaN values are
 * not expected; where one occurs, the result is still that of the typed array's own sort.
 */

/** For each i, #{j : values[j] ≥ values[i]} (i itself included). */
export function upperCounts(values: Float64Array): Int32Array {
  return upperCountsSorted(values, sortAscending(values.slice()));
}

/** Below this length a range is finished by insertion sort. */
const INSERTION_LENGTH = 24;

/**
 * Sorts `values` ascending in place and returns it: the order of the typed array's own `sort()`
 * (−0 before +0, NaN last), reached by a median-of-three quicksort on plain `<` comparisons, about
 * twice as fast on the few hundred draws of a reference (the built-in sort boxes its values).
 */
export function sortAscending(values: Float64Array): Float64Array {
  let end = values.length;
  // NaN last, as the built-in sort puts it; `<` cannot order it.
  for (let i = end - 1; i >= 0; i--) {
    if (Number.isNaN(values[i])) {
      values[i] = values[--end] as number;
      values[end] = NaN;
    }
  }
  quicksort(values, 0, end);
  orderSignedZeros(values, end);
  return values;
}

/** Where the last `partition` left its two sides: a[first..partitionLow] and a[partitionHigh..last]. */
let partitionLow = 0;
let partitionHigh = 0;

/**
 * Hoare's partition of a[first..last] (inclusive) around the median of its first, middle and last
 * values, returned. Afterwards a[first..partitionLow] ≤ pivot ≤ a[partitionHigh..last], and the
 * values between the two sides equal the pivot. (Module state rather than a returned pair: the
 * sort calls this thousands of times per reference and should allocate nothing.)
 */
function partition(a: Float64Array, first: number, last: number): number {
  const x = a[first] as number;
  const y = a[(first + last + 1) >>> 1] as number;
  const z = a[last] as number;
  const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
  let i = first;
  let j = last;
  while (i <= j) {
    while ((a[i] as number) < pivot) i++;
    while ((a[j] as number) > pivot) j--;
    if (i <= j) {
      const swap = a[i] as number;
      a[i++] = a[j] as number;
      a[j--] = swap;
    }
  }
  partitionLow = j;
  partitionHigh = i;
  return pivot;
}

function quicksort(a: Float64Array, low: number, high: number): void {
  while (high - low > INSERTION_LENGTH) {
    partition(a, low, high - 1);
    const i = partitionHigh;
    const j = partitionLow;
    // The smaller side by recursion, the larger by the loop: stack depth O(log m).
    if (j + 1 - low < high - i) {
      quicksort(a, low, j + 1);
      low = i;
    } else {
      quicksort(a, i, high);
      high = j + 1;
    }
  }
  for (let i = low + 1; i < high; i++) {
    const value = a[i] as number;
    let j = i - 1;
    while (j >= low && (a[j] as number) > value) {
      a[j + 1] = a[j] as number;
      j--;
    }
    a[j + 1] = value;
  }
}

/** `<` sees −0 and +0 as equal: within the run of zeros, the −0s go first. */
function orderSignedZeros(a: Float64Array, end: number): void {
  const first = lowerBound(a.subarray(0, end), 0);
  let last = first;
  let negative = 0;
  for (; last < end && a[last] === 0; last++) if (Object.is(a[last], -0)) negative++;
  for (let i = first; i < last; i++) a[i] = i - first < negative ? -0 : 0;
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

/**
 * The j-th smallest (1-based) of `values[from..]`; +Infinity when j is out of range. Selected by
 * Hoare's quickselect in a copy (O(m) expected: a reference needs the 25th of 500); a zero or a
 * NaN anywhere sends it to the full sort, whose −0/+0 and NaN order it must match.
 */
export function kthSmallest(values: Float64Array, j: number, from = 0): number {
  const count = values.length - from;
  if (!(j >= 1) || j > count) return Infinity;
  const copy = values.slice(from);
  for (let i = 0; i < count; i++) {
    const value = copy[i] as number;
    if (value === 0 || Number.isNaN(value)) return sortAscending(copy)[j - 1] as number;
  }
  return select(copy, j - 1);
}

/** The value that sorted order puts at `index`, rearranging `a` (no NaN, no zero). */
function select(a: Float64Array, index: number): number {
  let low = 0;
  let high = a.length - 1;
  while (high - low > INSERTION_LENGTH) {
    const pivot = partition(a, low, high);
    if (index <= partitionLow) high = partitionLow;
    else if (index >= partitionHigh) low = partitionHigh;
    else return pivot;
  }
  quicksort(a, low, high + 1);
  return a[index] as number;
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
  return sortAscending(values.slice(from))[count - j] as number;
}

/**
 * Pairs (t, t−k) with both values present, k = 0..K: the lag sums of autocorrelation.ts run over
 * these pairs, and a lag with none is undefined (NaN).
 */
import { fftLagProductSums } from "./fft";
import { prefersFft } from "./lagProductSums";
import type { Series } from "./types";

/**
 * Number of pairs (t, t−k) with both values present, k = 0..maxLag. O(K) without gaps. With gaps,
 * by inclusion–exclusion: of the length − k pairs at lag k, those with a gap at t or at t − k are
 * lost, and those with gaps at both ends were counted twice; the last term needs only the pairs of
 * gaps at most K apart, O(n + gaps·K) at worst. Above the crossover, by transforming the presence
 * mask instead (the same path as the lag sums). Written into `into` when given.
 */
export function pairCounts(series: Series, maxLag: number, into?: Int32Array): Int32Array {
  const { present, gaps } = series;
  const length = present.length;
  const counts = into ?? new Int32Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) counts[k] = Math.max(0, length - k);
  if (gaps === 0) return counts;
  if (prefersFft(length, maxLag)) {
    const sums = fftLagProductSums(present, maxLag);
    for (let k = 0; k <= maxLag; k++) counts[k] = Math.round(sums[k] as number);
    return counts;
  }
  const positions = new Int32Array(gaps);
  let found = 0;
  for (let t = 0; t < length; t++) if (present[t] === 0) positions[found++] = t;
  // Gaps at t ≥ k (the later end missing) and at t < length − k (the earlier end missing).
  let gapsBefore = 0;
  let gapsAfter = 0;
  for (let k = 0; k <= maxLag && k <= length; k++) {
    counts[k] = (counts[k] as number) - (found - gapsBefore) - (found - gapsAfter);
    if (k < length) {
      gapsBefore += 1 - (present[k] as number);
      gapsAfter += 1 - (present[length - 1 - k] as number);
    }
  }
  // Pairs with both ends at gaps, added back once.
  for (let i = 0; i < found; i++) {
    const p = positions[i] as number;
    for (let j = i; j < found && (positions[j] as number) - p <= maxLag; j++) {
      const lag = (positions[j] as number) - p;
      counts[lag] = (counts[lag] as number) + 1;
    }
  }
  return counts;
}

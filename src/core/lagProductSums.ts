/**
 * Lag product sums s_k = Σ_t a_t a_{t−k}, k = 0..K, of the centred deviations: the numerators of
 * the autocovariance and autocorrelation (autocorrelation.ts). Gaps have a_t = 0, so each sum runs
 * over the pairs where both values exist.
 * Two paths: the direct one (cache-blocked, fused over six lags, compensated across blocks:
 * O(n·K)) below a measured crossover and the transform one (fft.ts: O(n log K)) above it.
 */
import { fftBlockSize, fftLagProductSums } from "./fft";
import { BLOCK, CompensatedSums } from "./sums";

/**
 * Lags summed together in one pass of the direct path: six running sums and a window of the six
 * values a_{t−k} still fit in the processor's registers, so each value is loaded once per
 * group instead of once per lag.
 */
const LAG_GROUP = 6;

/**
 * s_k = Σ_t a_t a_{t−k} for k = 0..maxLag, the direct way: O(n·K).
 *
 * Cache-blocked and fused: the series is walked in blocks of `BLOCK` positions (the last one up
 * to 1.5·BLOCK); within a block, each group of six lags is summed in one loop that reuses every
 * loaded value six times (a sliding window a_{t−k0}, …, a_{t−k0−5}). Block sums are plain and
 * are added across blocks with Neumaier compensation (sums.ts). Written into `into`
 * (zero-filled) when given.
 */
export function directLagProductSums(
  a: Float64Array,
  maxLag: number,
  into?: Float64Array,
): Float64Array {
  const length = a.length;
  const totals = new CompensatedSums(maxLag + 1, into);
  const group = new Float64Array(LAG_GROUP);
  for (let from = 0; from < length;) {
    let to = Math.min(length, from + BLOCK);
    // A short last block joins the one before: fewer passes for short series.
    if (length - to < BLOCK / 2) to = length;
    for (let k0 = 0; k0 <= maxLag; k0 += LAG_GROUP) {
      groupBlockSums(a, from, to, k0, group);
      const lastLag = Math.min(maxLag, k0 + LAG_GROUP - 1);
      for (let k = k0; k <= lastLag; k++) totals.add(k, group[k - k0] as number);
    }
    from = to;
  }
  return totals.totals();
}

/**
 * Σ_{t ∈ [from, to), t ≥ k} a_t a_{t−k} for the six lags k = k0..k0+5, into `out`. A function of
 * its own, called once per block and group, so the engine optimises it early and keeps it.
 */
function groupBlockSums(
  a: Float64Array,
  from: number,
  to: number,
  k0: number,
  out: Float64Array,
): void {
  // Positions where all six lags of the group have a partner (t − k0 − 5 ≥ 0).
  const start = Math.min(to, Math.max(from, k0 + LAG_GROUP - 1));
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let s4 = 0;
  let s5 = 0;
  if (start < to) {
    const base = start - k0;
    let w1 = a[base - 1] as number;
    let w2 = a[base - 2] as number;
    let w3 = a[base - 3] as number;
    let w4 = a[base - 4] as number;
    let w5 = a[base - 5] as number;
    for (let t = start; t < to; t++) {
      const x = a[t] as number;
      const w0 = a[t - k0] as number;
      s0 += x * w0;
      s1 += x * w1;
      s2 += x * w2;
      s3 += x * w3;
      s4 += x * w4;
      s5 += x * w5;
      w5 = w4;
      w4 = w3;
      w3 = w2;
      w2 = w1;
      w1 = w0;
    }
  }
  out[0] = s0;
  out[1] = s1;
  out[2] = s2;
  out[3] = s3;
  out[4] = s4;
  out[5] = s5;
  // The first positions of the series, where only some lags of the group have a partner.
  for (let j = 0; j < LAG_GROUP; j++) {
    const k = k0 + j;
    let head = 0;
    for (let t = Math.max(from, k); t < start; t++) head += (a[t] as number) * (a[t - k] as number);
    out[j] = (out[j] as number) + head;
  }
}

/**
 * Cost of one transform step (one element of one radix-2 stage, with its share of the block
 * copying and spectrum sums) in units of one multiply-add of the direct path. Measured on the
 * development machine by `npm run bench` (the `crossover` line); the choice is not sensitive to
 * it: a factor of two moves the crossover by less than a factor of two in K.
 */
export const FFT_STEP_COST = 7;

/**
 * Expected cost, in direct multiply-adds, of lags 0..maxLag on `length` positions by each path:
 * Σ_{k≤K} (length − k) for the direct path, (blocks + 1)·N·log₂N transform steps (fft.ts).
 */
export function lagSumCosts(length: number, maxLag: number): { direct: number; fft: number } {
  const lags = Math.min(maxLag, length - 1) + 1;
  const size = fftBlockSize(length, maxLag);
  const blocks = Math.ceil(length / (size - maxLag));
  return {
    direct: lags * (length - (lags - 1) / 2),
    fft: (blocks + 1) * size * Math.log2(size) * FFT_STEP_COST,
  };
}

const crossoverCache = new Map<number, number>();

/**
 * The crossover for a series of `length` positions: the smallest K at which the transform path
 * is expected to be faster (`length` when it never is). One threshold per length, so a longer
 * lag list never switches back to the direct path. Remembered for the last few lengths seen.
 */
export function fftCrossover(length: number): number {
  const known = crossoverCache.get(length);
  if (known !== undefined) return known;
  let lag = 1;
  while (lag < length) {
    const cost = lagSumCosts(length, lag);
    if (cost.fft < cost.direct) break;
    lag++;
  }
  if (crossoverCache.size >= 64) crossoverCache.clear();
  crossoverCache.set(length, lag);
  return lag;
}

/** Whether lags 0..maxLag on `length` positions take the transform path: maxLag ≥ the crossover. */
export function prefersFft(length: number, maxLag: number): boolean {
  return maxLag >= fftCrossover(length);
}

/**
 * s_k = Σ_t a_t a_{t−k} for k = 0..maxLag: the direct path below the crossover, the transform
 * path above it (`prefersFft`). Written into `into` (zero-filled) when given.
 */
export function lagProductSums(a: Float64Array, maxLag: number, into?: Float64Array): Float64Array {
  if (!prefersFft(a.length, maxLag)) return directLagProductSums(a, maxLag, into);
  const sums = fftLagProductSums(a, maxLag);
  if (into === undefined) return sums;
  into.set(sums);
  return into;
}

/**
 * Mean and centred deviations, two-pass with compensated sums.
 *
 * Pass 1: x̄₀ = Σx/n (Neumaier-compensated). Pass 2: the corrected two-pass step
 * x̄ = x̄₀ + Σ(x − x̄₀)/n (Chan, Golub & LeVeque 1983, Am. Stat. 37:242–247), which removes the
 * rounding left in x̄₀. Then d_t = x_t − x̄ and c₀ = Σ d_t² (compensated). The mean itself is a
 * double, so every d_t carries the same rounding offset x̄ − x̄_exact; when the deviations' own
 * mean δ = Σd/n is not zero it is taken out too (d_t − δ), so that data spread over a few units in
 * the last place of a large level (200 values in {1, 1 + 2⁻⁵²}) are centred exactly instead of
 * around a point half an ulp away. Values so large that their sum would overflow (beyond
 * 2^1000) are summed divided by a power of two (exact) and the mean multiplied back. The one-pass
 * Σx² − n·x̄² is never used: it loses every digit on the NIST StRD NumAcc files.
 * Each sum adds blocks of `BLOCK` terms plainly and the block totals with compensation
 * (sums.ts); a series without gaps skips the presence test.
 * Gaps contribute d_t = 0, so every lag sum over d runs over the available pairs only. O(n).
 *
 * Memory: the deviations take a fresh array of the series' length, or `into` when the caller gives
 * one up — the series' own values among them (a series the caller made and no longer needs, such
 * as the squared deviations): every value is read before its place is written, and the result is
 * the same, bit for bit, as with a fresh array.
 *
 * Extreme magnitudes: when the root-mean-square deviation lies outside 2^±200 (about 1e±60), the
 * deviations are divided by a power of two (exact) so that their squares and fourth powers
 * neither overflow nor sink into the subnormal range; `scale` says by how much. Correlations,
 * z values and tests are scale-free; absolute figures (variance, autocovariance) multiply back
 * by scale². Ordinary data have scale 1 and take no extra pass.
 */
import { tooShort } from "./errors";
import { BLOCK, CompensatedSum } from "./sums";
import type { Series } from "./types";

export interface Centred {
  /** Number of values present. */
  readonly n: number;
  readonly mean: number;
  /** d_t = (x_t − x̄)/scale at present positions, 0 at gaps. */
  readonly deviations: Float64Array;
  /** c₀/scale² = Σ d_t² of the stored deviations. */
  readonly sumSquares: number;
  /** The power of two the deviations were divided by: 1 unless the data are extreme in size. */
  readonly scale: number;
}

const SAFE_LOW = 2 ** -200;
/** Beyond this magnitude a sum of a few values can overflow. */
const HUGE = 2 ** 1000;
const SAFE_HIGH = 2 ** 200;

/** Blocked compensated Σ d_t². */
function sumOfSquares(deviations: Float64Array): number {
  const length = deviations.length;
  const squares = new CompensatedSum();
  for (let from = 0; from < length; from += BLOCK) {
    const to = Math.min(length, from + BLOCK);
    let block = 0;
    for (let t = from; t < to; t++) {
      const d = deviations[t] as number;
      block += d * d;
    }
    squares.add(block);
  }
  return squares.value;
}

/** Divides the deviations by a power of two near their largest magnitude; returns it (or 1). */
function rescale(deviations: Float64Array): number {
  let largest = 0;
  for (let t = 0; t < deviations.length; t++) {
    largest = Math.max(largest, Math.abs(deviations[t] as number));
  }
  if (!(largest > 0 && Number.isFinite(largest))) return 1;
  const scale = 2 ** Math.round(Math.log2(largest));
  for (let t = 0; t < deviations.length; t++) deviations[t] = (deviations[t] as number) / scale;
  return scale;
}

/** Σ (x_t − shift) over the present positions, blocked and compensated. */
function shiftedSum(series: Series, shift: number): number {
  const { values, present } = series;
  const length = values.length;
  const total = new CompensatedSum();
  for (let from = 0; from < length; from += BLOCK) {
    const to = Math.min(length, from + BLOCK);
    let block = 0;
    if (series.gaps === 0) {
      for (let t = from; t < to; t++) block += (values[t] as number) - shift;
    } else {
      for (let t = from; t < to; t++) if (present[t] === 1) block += (values[t] as number) - shift;
    }
    total.add(block);
  }
  return total.value;
}

/** The corrected two-pass mean; for values beyond 2^1000, of the values divided by 2^64. */
function meanOf(series: Series): number {
  const n = series.count;
  let largest = 0;
  for (let t = 0; t < series.values.length; t++) {
    if (series.present[t] === 1) largest = Math.max(largest, Math.abs(series.values[t] as number));
  }
  if (largest > HUGE) {
    const scaled = { ...series, values: series.values.map((x) => x / 2 ** 64) };
    const rough = shiftedSum(scaled, 0) / n;
    return (rough + shiftedSum(scaled, rough) / n) * 2 ** 64;
  }
  const rough = shiftedSum(series, 0) / n;
  return rough + shiftedSum(series, rough) / n;
}

export function centre(series: Series, into?: Float64Array): Centred {
  const { values, present, count: n } = series;
  if (!(n >= 1)) tooShort("the series has no values");
  let mean = meanOf(series);

  const length = values.length;
  const gapFree = series.gaps === 0;
  const deviations = into ?? new Float64Array(length);
  // A fresh array is zero-filled; a given one must read 0 at the gaps too.
  if (into !== undefined && !gapFree) {
    for (let t = 0; t < length; t++) if (present[t] !== 1) deviations[t] = 0;
  }
  const squares = new CompensatedSum();
  const sums = new CompensatedSum();
  for (let from = 0; from < length; from += BLOCK) {
    const to = Math.min(length, from + BLOCK);
    let block = 0;
    let blockSum = 0;
    for (let t = from; t < to; t++) {
      if (gapFree || present[t] === 1) {
        const d = (values[t] as number) - mean;
        deviations[t] = d;
        block += d * d;
        blockSum += d;
      }
    }
    squares.add(block);
    sums.add(blockSum);
  }
  let sumSquares = squares.value;
  // The rounding of the mean, seen as the deviations' own mean: taken out when it is more than
  // 1e-8 of their spread (below that its effect on any r_k is under 1e-16).
  const offset = sums.value / n;
  if (Math.abs(offset) > 1e-8 * Math.sqrt(sumSquares / n) && Number.isFinite(offset)) {
    for (let t = 0; t < length; t++) {
      if (gapFree || present[t] === 1) deviations[t] = (deviations[t] as number) - offset;
    }
    mean += offset;
    sumSquares = sumOfSquares(deviations);
  }
  const rms = Math.sqrt(sumSquares / n);
  if (rms >= SAFE_LOW && rms <= SAFE_HIGH) return { n, mean, deviations, sumSquares, scale: 1 };
  const scale = rescale(deviations);
  if (scale === 1) return { n, mean, deviations, sumSquares, scale };
  return { n, mean, deviations, sumSquares: sumOfSquares(deviations), scale };
}

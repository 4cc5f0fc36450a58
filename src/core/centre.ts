/**
 * Mean and centred deviations, two-pass with compensated sums.
 *
 * Pass 1: x̄₀ = Σx/n (Neumaier-compensated). Pass 2: the corrected two-pass step
 * x̄ = x̄₀ + Σ(x − x̄₀)/n (Chan, Golub & LeVeque 1983, Am. Stat. 37:242–247), which removes the
 * rounding left in x̄₀. Then d_t = x_t − x̄ and c₀ = Σ d_t² (compensated). The one-pass
 * Σx² − n·x̄² is never used: it loses every digit on the NIST StRD NumAcc files.
 * Gaps contribute d_t = 0, so every lag sum over d runs over the available pairs only. O(n).
 */
import { tooShort } from "./errors";
import { CompensatedSum } from "./sums";
import type { Series } from "./types";

export interface Centred {
  /** Number of values present. */
  readonly n: number;
  readonly mean: number;
  /** d_t = x_t − x̄ at present positions, 0 at gaps. */
  readonly deviations: Float64Array;
  /** c₀ = Σ d_t². */
  readonly sumSquares: number;
}

export function centre(series: Series): Centred {
  const { values, present, count: n } = series;
  if (!(n >= 1)) tooShort("the series has no values");
  const first = new CompensatedSum();
  for (let t = 0; t < values.length; t++) if (present[t] === 1) first.add(values[t] as number);
  const rough = first.value / n;
  const correction = new CompensatedSum();
  for (let t = 0; t < values.length; t++) {
    if (present[t] === 1) correction.add((values[t] as number) - rough);
  }
  const mean = rough + correction.value / n;

  const deviations = new Float64Array(values.length);
  const squares = new CompensatedSum();
  for (let t = 0; t < values.length; t++) {
    if (present[t] === 1) {
      const d = (values[t] as number) - mean;
      deviations[t] = d;
      squares.add(d * d);
    }
  }
  return { n, mean, deviations, sumSquares: squares.value };
}

/**
 * Two cautions on the size of the sample, decided once for every view of a lag table:
 * - small sample: fewer than SMALL_SAMPLE values. The bands ±z·se shrink like 1/√n, so with few
 *   values they are wide and a clear verdict has little power to find weak structure. The
 *   threshold 50 is common practice (no source).
 * - many lags: K > n/5 on a verdict that is not short (a short verdict already says the sample is
 *   too small for K). The joint tests' χ² reference is a large-sample one, and with many lags and
 *   few values they over-reject a little; n/5 is the bound of the default lags (defaultLags.ts).
 *   Common practice (no source).
 * Cost O(1).
 */
import type { VerdictWord } from "./types";

/** Below this many values the bands are wide and a clear verdict has little power. */
export const SMALL_SAMPLE = 50;

export interface SampleCautions {
  /** n < SMALL_SAMPLE. */
  readonly smallSample: boolean;
  /** K > n/5 and the verdict is not short. */
  readonly manyLags: boolean;
  /** n/5, the number of lags past which `manyLags` holds. */
  readonly manyLagsLimit: number;
}

/**
 * The cautions for n values, K lags and the verdict's word.
 *
 * @example
 * sampleCautions(40, 10, "clear"); // → { smallSample: true, manyLags: true, manyLagsLimit: 8 }
 * sampleCautions(240, 10, "clear"); // → { smallSample: false, manyLags: false, manyLagsLimit: 48 }
 */
export function sampleCautions(n: number, maxLag: number, word: VerdictWord): SampleCautions {
  const manyLagsLimit = n / 5;
  return {
    smallSample: n < SMALL_SAMPLE,
    manyLags: maxLag > manyLagsLimit && word !== "short",
    manyLagsLimit,
  };
}

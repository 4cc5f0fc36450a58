/**
 * Normality of the values by Jarque & Bera (1980, Econ. Letters 6:255–259; 1987, Int. Stat. Rev.
 * 55:163–172): with central moments m_j = Σ d^j / n (divide-by-n, about the mean),
 *   S = m₃ / m₂^{3/2},   K = m₄ / m₂²,   JB = (n/6)(S² + (K − 3)²/4),
 * referred to χ²₂, whose upper tail is exactly e^{−JB/2}. The order of the values does not matter,
 * so gaps are simply absent values. Moments from the two-pass deviations (centre.ts) with
 * compensated sums. The check flags at the request's alpha when p < alpha. Cost O(n).
 */
import { centre } from "./centre";
import { chiSquareUpperTail } from "./distributions";
import { invalid } from "./errors";
import { requireValues, resolveAlpha } from "./options";
import { seriesName } from "./seriesName";
import { CompensatedSum } from "./sums";
import type { Series } from "./types";

export interface NormalityOptions {
  /** Level at which `flagged` is set; default 0.05. */
  readonly alpha?: number | null;
}

export interface NormalityCheck {
  readonly label: string;
  /** Values present. */
  readonly n: number;
  readonly skewness: number;
  /** Kurtosis m₄/m₂² (3 for the normal, not the excess). */
  readonly kurtosis: number;
  readonly jb: number;
  readonly p: number;
  readonly alpha: number;
  /** The values depart from normality at alpha: p < alpha. */
  readonly flagged: boolean;
}

export function normalityCheck(series: Series, options: NormalityOptions = {}): NormalityCheck {
  requireValues(series, 3, "the Jarque–Bera test");
  const alpha = resolveAlpha(options.alpha);
  const { n, deviations, sumSquares } = centre(series);
  if (!(sumSquares > 0)) {
    invalid(`${seriesName(series.label)} is constant: its skewness and kurtosis are undefined`);
  }
  const third = new CompensatedSum();
  const fourth = new CompensatedSum();
  for (let t = 0; t < deviations.length; t++) {
    const d = deviations[t] as number;
    const d2 = d * d;
    third.add(d2 * d);
    fourth.add(d2 * d2);
  }
  const m2 = sumSquares / n;
  const skewness = third.value / n / Math.pow(m2, 1.5);
  const kurtosis = fourth.value / n / (m2 * m2);
  const jb = (n / 6) * (skewness * skewness + (kurtosis - 3) ** 2 / 4);
  const p = chiSquareUpperTail(jb, 2);
  return { label: series.label, n, skewness, kurtosis, jb, p, alpha, flagged: p < alpha };
}

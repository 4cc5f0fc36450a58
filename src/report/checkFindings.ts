/**
 * One-sentence findings of the side checks — volatility (Engle's LM with McLeod–Li), bias
 * (Newey–West), runs about the median, Jarque–Bera — worded for the pane's explanation, the CLI's
 * text and summaries. Each returns whether the check flagged (decided in the core at the check's
 * alpha) and the sentence; the figures come from the core, this file only words them.
 */
import {
  formatLevel,
  formatNumber,
  pPhrase,
  type BiasCheck,
  type NormalityCheck,
  type RunsCheck,
  type VolatilityCheck,
} from "../core";

export interface CheckFinding {
  readonly flagged: boolean;
  readonly text: string;
}

export function volatilityFinding(check: VolatilityCheck): CheckFinding {
  const figures = `Engle's LM = ${formatNumber(check.lm, 4)} over ${check.rows} rows, df ${check.df}, ${pPhrase(check.p)}; McLeod–Li Q = ${formatNumber(check.mcleodLiQ, 4)}, ${pPhrase(check.mcleodLiP)}`;
  return check.flagged
    ? {
        flagged: true,
        text: `The size of the deviations follows their recent size (${figures}): volatility clusters, so plain bands are too narrow; prefer robust bands and the robust joint test.`,
      }
    : {
        flagged: false,
        text: `No volatility clustering found at ${formatLevel(check.alpha)} (${figures}).`,
      };
}

export function biasFinding(check: BiasCheck): CheckFinding {
  const figures = `mean ${formatNumber(check.mean, 4)}, Newey–West se ${formatNumber(check.se, 3)} over ${check.hacLags} lag${check.hacLags === 1 ? "" : "s"}, t = ${formatNumber(check.t, 3)}, ${pPhrase(check.p)} fixed-b`;
  return check.flagged
    ? {
        flagged: true,
        text: `The mean differs from zero (${figures}). Residuals and forecast errors should average zero: if these are errors, they run ${check.mean > 0 ? "high" : "low"} on average, which a lag pattern cannot show.`,
      }
    : { flagged: false, text: `No bias found at ${formatLevel(check.alpha)} (${figures}).` };
}

export function runsFinding(check: RunsCheck): CheckFinding {
  const figures = `${check.runs} runs about the median ${formatNumber(check.median, 4)}, ${formatNumber(check.expected, 4)} expected, z = ${formatNumber(check.z, 3)}, ${pPhrase(check.p)}`;
  if (!check.flagged) return { flagged: false, text: `Runs as expected (${figures}).` };
  const how =
    check.runs < check.expected
      ? "too few runs: the series stays on one side of its median for long stretches"
      : "too many runs: the series alternates about its median";
  return { flagged: true, text: `Wald–Wolfowitz runs test: ${how} (${figures}).` };
}

export function normalityFinding(check: NormalityCheck): CheckFinding {
  const figures = `Jarque–Bera = ${formatNumber(check.jb, 4)}, skewness ${formatNumber(check.skewness, 3)}, kurtosis ${formatNumber(check.kurtosis, 3)}, ${pPhrase(check.p)}`;
  return check.flagged
    ? {
        flagged: true,
        text: `The values are not normal (${figures}): intervals that assume normal errors are off, though the lag tests do not need normality.`,
      }
    : { flagged: false, text: `No departure from normality found (${figures}).` };
}

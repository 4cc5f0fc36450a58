/**
 * The forecast audit of h-step-ahead forecast errors: are they unbiased, and free of dependence
 * beyond what the horizon explains?
 *
 * The errors of an optimal h-step forecast are MA(h−1) (Box, Jenkins & Reinsel, *Time Series
 * Analysis*, §5.1: the error is Σ_{j<h} ψ_j a_{t−j}), so lags 1..h−1 are expected to be non-zero.
 * They are reported, not counted against the forecast:
 * - bias: the mean error with the rectangular long-run variance over lags 0..h−1 and the Harvey,
 *   Leybourne & Newbold correction, against Student's t with n − 1 df (horizonBias.ts);
 * - dependence: lags h..K, Bartlett bands (bands.ts, se_k from the lags before k) and the joint
 *   test of lags h..K that allows for the expected MA(h−1) dependence (laterLags.ts; exactly
 *   Ljung–Box for h = 1), judged by the same rules and words as the noise check (verdict.ts) with
 *   the false-alarm note over the lags counted;
 * - the levels: one Monte Carlo reference under the fitted MA(h−1) null holds the bias test, the
 *   joint test and the outer corridor together at alpha (auditReference.ts), so correct h-step
 *   errors are called `structure` about alpha of the time; the dependence p shown is that
 *   reference's;
 * - the verdict: `structure` when the bias is flagged (a systematic error the forecast should
 *   remove), otherwise the dependence verdict; `short` when that is short.
 * K defaults to h − 1 plus the usual number of lags, min(10, ⌊n/5⌋) or min(2m, ⌊n/5⌋) with season
 * m (raised to include the seasonal lags where n allows), so as many lags are counted as in the
 * noise check. Cost O(n·K + K³) plus the reference's draws.
 */
import { autocorrelation } from "./autocorrelation";
import { standardErrors } from "./bands";
import { auditLevels, type AuditLevels } from "./auditReference";
import { defaultMaxLag, untestedSeasonalLags } from "./defaultLags";
import { corridorCrossings, innerCorridor } from "./corridors";
import { normalTwoSided } from "./distributions";
import { requireWholeNumber } from "./errors";
import { falseAlarmNote, type FalseAlarmNote } from "./falseAlarms";
import { formatLevel, formatNumber, pPhrase } from "./format";
import { horizonBias, type HorizonBias } from "./horizonBias";
import { laterLagsTest, type LaterLagsTest } from "./laterLags";
import { requireValues, resolveAlpha, resolveSeason } from "./options";
import type { Series } from "./types";
import { judge, seasonalLags, type Verdict, type VerdictLag } from "./verdict";

export interface ForecastAuditOptions {
  /** h, the forecast horizon in periods: 1 for one-step-ahead errors. */
  readonly horizon: number;
  readonly season?: number | null;
  readonly alpha?: number | null;
  /** K, the last lag tested; default h − 1 + min(10, ⌊n/5⌋) (or 2m with a season). */
  readonly maxLag?: number | null;
}

export interface AuditLag extends VerdictLag {
  readonly standardError: number;
  /** Band half-width z_{1−α/2}·se_k (Bartlett). */
  readonly band: number;
  readonly pLag: number;
  /** False for lags below h: expected for h-step errors, shown but not counted. */
  readonly counted: boolean;
}

export interface ForecastAudit {
  readonly label: string;
  readonly n: number;
  readonly gaps: number;
  readonly horizon: number;
  readonly season: number | null;
  readonly alpha: number;
  readonly maxLag: number;
  readonly bias: HorizonBias;
  /** The Monte Carlo reference's levels and the dependence p it gives. */
  readonly levels: AuditLevels;
  readonly rows: readonly AuditLag[];
  readonly innerLevel: number;
  readonly outerLevel: number;
  readonly dependenceTest: LaterLagsTest;
  readonly falseAlarm: FalseAlarmNote;
  /** The judgement of lags h..K alone. */
  readonly dependence: Verdict;
  /** Bias and dependence together. */
  readonly verdict: Verdict;
}

/** Validates h: a whole number from 1 to n − 1 (at least lag h must be left to test). */
function resolveHorizon(horizon: number | null | undefined, n: number): number {
  return requireWholeNumber(
    "horizon",
    horizon,
    1,
    n - 1,
    () =>
      `horizon must be a whole number from 1 to ${Math.max(1, n - 1)}, the number of periods ahead the forecasts were made (1 for one-step-ahead; got ${String(horizon)})`,
  );
}

function resolveAuditMaxLag(
  options: ForecastAuditOptions,
  h: number,
  n: number,
  season: number | null,
): number {
  const given = options.maxLag;
  if (given === null || given === undefined) {
    return Math.min(n - 1, h - 1 + defaultMaxLag(n, season));
  }
  return requireWholeNumber(
    "maxLag",
    given,
    h,
    n - 1,
    () =>
      `maxLag must be a whole number from the horizon ${h} to ${n - 1} (the series has ${n} values; got ${given})`,
  );
}

export function forecastAudit(series: Series, options: ForecastAuditOptions): ForecastAudit {
  requireValues(series, 3, "a forecast audit");
  const n = series.count;
  const h = resolveHorizon(options.horizon, n);
  const alpha = resolveAlpha(options.alpha);
  const season = resolveSeason(options.season, n);
  const K = resolveAuditMaxLag(options, h, n, season);

  const bias = horizonBias(series, h);
  const ac = autocorrelation(series, K);
  const se = standardErrors("bartlett", ac, K);
  const innerLevel = innerCorridor(alpha);
  const z = Float64Array.from(
    { length: K },
    (_, i) => (ac.correlation[i + 1] as number) / (se[i] as number),
  );
  const dependenceTest = laterLagsTest(ac.correlation, ac.n, h);
  const keyLags = [h, ...seasonalLags(season, K).filter((lag) => lag >= h)];
  const levels = auditLevels({
    present: series.present,
    n: ac.n,
    horizon: h,
    maxLag: K,
    alpha,
    pairs: ac.pairs,
    correlation: ac.correlation,
    tCorrected: bias.tCorrected,
    q: dependenceTest.q,
    z,
    innerLevel,
    keyLags,
    values: series.values,
    seedWords: ["audit", String(h), String(K), String(alpha), String(season)],
  });
  const crossings = corridorCrossings(
    ac.correlation,
    se,
    { innerLevel, outerLevel: levels.outerLevel },
    h,
  );
  const { tested, crossingLags } = crossings;
  const rows: AuditLag[] = crossings.lags.map(({ lag, correlation, z, crossesBand, outer }) => {
    const s = se[lag - 1] as number;
    return {
      lag,
      correlation,
      standardError: s,
      band: innerLevel * s,
      z,
      pLag: normalTwoSided(z),
      crossesBand,
      outer,
      counted: lag >= h,
    };
  });
  const falseAlarm = falseAlarmNote(tested, alpha, crossingLags);
  const testName = h === 1 ? "Ljung–Box" : `Ljung–Box (adjusted for the ${h}-step horizon)`;
  const dependence = judge({
    n: ac.n,
    maxLag: K,
    alpha,
    season,
    lags: rows,
    joint: { test: "ljung-box", q: dependenceTest.q, df: dependenceTest.df, p: dependenceTest.p },
    levels,
    falseAlarm,
    untestedSeasonal: untestedSeasonalLags(season, K),
    firstLag: h,
    testName,
  });
  return {
    label: series.label,
    n: ac.n,
    gaps: series.gaps,
    horizon: h,
    season,
    alpha,
    maxLag: K,
    bias,
    levels,
    rows,
    innerLevel,
    outerLevel: levels.outerLevel,
    dependenceTest,
    falseAlarm,
    dependence,
    verdict: combined(bias, levels, alpha, dependence),
  };
}

function combined(
  bias: HorizonBias,
  levels: AuditLevels,
  alpha: number,
  dependence: Verdict,
): Verdict {
  if (dependence.word === "short" || !levels.biasFlagged) return dependence;
  const variance = bias.fallback
    ? "plain variance (the rectangular long-run variance was not positive)"
    : `long-run variance over lags 0–${bias.horizon - 1}`;
  const sentence = `The forecasts are biased: mean error ${formatNumber(bias.mean, 4)} (se ${formatNumber(bias.se, 3)} from the ${variance}, corrected t = ${formatNumber(bias.tCorrected, 3)}, ${pPhrase(bias.p)} against t with ${bias.df} df; bias, dependence and the all-lags corridor together are set to fire for ${formatLevel(alpha)} of correct forecasts, the bias at p < ${formatNumber(levels.biasLevel, 2)}).`;
  const finding = `${sentence} Dependence (${dependence.word}): ${dependence.finding}`;
  return {
    word: "structure",
    reason: `${finding} ${dependence.note}`,
    finding,
    note: dependence.note,
    triggers: dependence.triggers,
  };
}

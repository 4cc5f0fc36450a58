/**
 * The forecast audit of h-step-ahead forecast errors: are they unbiased, and free of dependence
 * beyond what the horizon explains?
 *
 * The errors of an optimal h-step forecast are MA(h−1) (Box, Jenkins & Reinsel, *Time Series
 * Analysis*, §5.1: the error is Σ_{j<h} ψ_j a_{t−j}), so lags 1..h−1 are expected to be non-zero.
 * They are reported, not counted against the forecast:
 * - bias: the mean error with a Newey–West standard error over L ≥ h−1 lags (bias.ts);
 * - dependence: lags h..K, Bartlett bands (bands.ts, se_k from the lags before k) and the joint
 *   test of lags h..K that allows for the expected MA(h−1) dependence (laterLags.ts; exactly
 *   Ljung–Box for h = 1), judged by the same rules and words as the noise check (verdict.ts) with
 *   the false-alarm note over the lags counted;
 * - the verdict: `structure` when the bias test rejects at alpha (a systematic error the forecast
 *   should remove), otherwise the dependence verdict; `short` when that is short.
 * K defaults to h − 1 plus the usual number of lags, min(10, ⌊n/5⌋) or min(2m, ⌊n/5⌋) with season
 * m, so as many lags are counted as in the noise check. Cost O(n·K + K³).
 */
import { autocorrelation } from "./autocovariance";
import { standardErrors } from "./bands";
import { biasCheck, defaultHacLags, type BiasCheck } from "./bias";
import { defaultMaxLag } from "./defaultLags";
import { corridorCrossings, corridorLevels } from "./corridors";
import { normalTwoSided } from "./distributions";
import { invalid } from "./errors";
import { falseAlarmNote, type FalseAlarmNote } from "./falseAlarms";
import { formatNumber, pPhrase } from "./format";
import { laterLagsTest, type LaterLagsTest } from "./laterLags";
import { requireValues, resolveAlpha, resolveSeason } from "./options";
import type { Series } from "./types";
import { judge, type Verdict, type VerdictLag } from "./verdict";

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
  readonly bias: BiasCheck;
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
  if (!(Number.isInteger(horizon) && (horizon as number) >= 1 && (horizon as number) <= n - 1)) {
    invalid(
      `horizon must be a whole number from 1 to ${Math.max(1, n - 1)}, the number of periods ahead the forecasts were made (1 for one-step-ahead; got ${String(horizon)})`,
    );
  }
  return horizon as number;
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
  if (!(Number.isInteger(given) && given >= h && given <= n - 1)) {
    invalid(
      `maxLag must be a whole number from the horizon ${h} to ${n - 1} (the series has ${n} values; got ${given})`,
    );
  }
  return given;
}

export function forecastAudit(series: Series, options: ForecastAuditOptions): ForecastAudit {
  requireValues(series, 3, "a forecast audit");
  const n = series.count;
  const h = resolveHorizon(options.horizon, n);
  const alpha = resolveAlpha(options.alpha);
  const season = resolveSeason(options.season, n);
  const K = resolveAuditMaxLag(options, h, n, season);

  const bias = biasCheck(series, { hacLags: Math.max(defaultHacLags(n), h - 1), alpha });
  const ac = autocorrelation(series, K);
  const se = standardErrors("bartlett", ac, K);
  const counted = K - h + 1;
  const levels = corridorLevels(alpha, counted);
  const { innerLevel, outerLevel } = levels;
  const crossings = corridorCrossings(ac.correlation, se, levels, h);
  const { tested, beyondLags } = crossings;
  const rows: AuditLag[] = crossings.lags.map(({ lag, correlation, z, beyond, outer }) => {
    const s = se[lag - 1] as number;
    return {
      lag,
      correlation,
      standardError: s,
      band: innerLevel * s,
      z,
      pLag: normalTwoSided(z),
      beyond,
      outer,
      counted: lag >= h,
    };
  });
  const dependenceTest = laterLagsTest(ac.correlation, ac.n, h);
  const falseAlarm = falseAlarmNote(tested, alpha, beyondLags);
  const testName = h === 1 ? "Ljung–Box" : `Ljung–Box (adjusted for the ${h}-step horizon)`;
  const dependence = judge({
    n: ac.n,
    maxLag: K,
    alpha,
    season,
    lags: rows,
    joint: { test: "ljung-box", q: dependenceTest.q, df: dependenceTest.df, p: dependenceTest.p },
    falseAlarm,
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
    rows,
    innerLevel,
    outerLevel,
    dependenceTest,
    falseAlarm,
    dependence,
    verdict: combined(bias, dependence),
  };
}

function combined(bias: BiasCheck, dependence: Verdict): Verdict {
  if (dependence.word === "short" || !bias.flagged) return dependence;
  const sentence = `The forecasts are biased: mean error ${formatNumber(bias.mean, 4)} (Newey–West se ${formatNumber(bias.se, 3)} over ${bias.hacLags} lag${bias.hacLags === 1 ? "" : "s"}, t = ${formatNumber(bias.t, 3)}, ${pPhrase(bias.p)}).`;
  return {
    word: "structure",
    reason: `${sentence} Dependence (${dependence.word}): ${dependence.reason}`,
    triggers: dependence.triggers,
  };
}

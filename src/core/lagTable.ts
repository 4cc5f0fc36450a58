/**
 * The lag table: everything Echolot reports about one series, computed once and shared by the
 * cell functions, the pane and the CLI — autocorrelation, partial autocorrelation, standard errors
 * and bands of the chosen kind, per-lag z and p (own and Šidák-adjusted), the cumulative joint
 * test, the false-alarm note and the verdict. Each formula lives in its own file; this file only
 * assembles. Cost O(n·K) plus O(K²) for the partials.
 */
import { autocorrelation } from "./autocovariance";
import { robustVariances, standardErrors } from "./bands";
import { normalQuantile, normalTwoSided } from "./distributions";
import { falseAlarmNote, type FalseAlarmNote } from "./falseAlarms";
import { sidakAdjust, sidakLevel } from "./multiplicity";
import { resolveLagOptions, type LagOptions, type ResolvedLagOptions } from "./options";
import { partialAutocorrelation } from "./partial";
import { cumulativeJointTest, jointTestAt, type JointTest } from "./portmanteau";
import { centre } from "./centre";
import { squaredDeviationCorrelation } from "./squares";
import type { Series } from "./types";
import { judge, type Verdict } from "./verdict";

export interface LagRow {
  readonly lag: number;
  readonly correlation: number;
  readonly partial: number;
  /** se_k under the chosen band kind. */
  readonly standardError: number;
  /** Band half-width z_{1−α/2}·se_k. */
  readonly band: number;
  /** Standardised value z_k = r_k / se_k. */
  readonly z: number;
  /** Two-sided p of this lag alone. */
  readonly pLag: number;
  /** That p adjusted by Šidák for all K lags. */
  readonly pSidak: number;
  /** |z_k| beyond the inner corridor (its own band). */
  readonly beyond: boolean;
  /** |z_k| beyond the outer corridor (Šidák over K lags). */
  readonly outer: boolean;
  /** Joint test over lags 1..k. */
  readonly jointQ: number;
  readonly jointDf: number;
  readonly jointP: number;
}

/** What the lag rows describe: the series, or its squared deviations (testKind "squares"). */
export type LagSubject = "series" | "squares";

export interface LagTable extends ResolvedLagOptions {
  readonly label: string;
  readonly subject: LagSubject;
  /** Values present. */
  readonly n: number;
  /** Positions from the first to the last value. */
  readonly length: number;
  readonly gaps: number;
  readonly mean: number;
  /** c₀/n, the biased variance. */
  readonly variance: number;
  /** γ̂_k for k = 0..K of the subject. */
  readonly autocovariance: Float64Array;
  /** Inner corridor ±z_{1−α/2}. */
  readonly innerLevel: number;
  /** Outer corridor ±z_{1−a/2}, a = 1 − (1−α)^{1/K}. */
  readonly outerLevel: number;
  readonly rows: readonly LagRow[];
  readonly joint: JointTest;
  readonly falseAlarm: FalseAlarmNote;
  readonly verdict: Verdict;
}

/**
 * With testKind "squares" the rows describe the squared deviations (the McLeod–Li view of
 * volatility clustering); mean and variance always describe the series itself.
 */
export function lagTable(series: Series, options: LagOptions = {}): LagTable {
  const resolved = resolveLagOptions(series, options);
  const { maxLag: K, alpha, bandKind, testKind, fittedParams, season } = resolved;
  const subject: LagSubject = testKind === "squares" ? "squares" : "series";
  const ac =
    subject === "squares" ? squaredDeviationCorrelation(series, K) : autocorrelation(series, K);
  const level = subject === "squares" ? centre(series) : ac;
  const partials = partialAutocorrelation(ac.correlation);
  const needsRobust = bandKind === "robust" || testKind === "robust";
  const robust = needsRobust ? robustVariances(ac, K) : undefined;
  const se = standardErrors(bandKind, ac, K, robust);
  const cumulative = cumulativeJointTest({
    kind: testKind,
    n: ac.n,
    correlation: ac.correlation,
    fittedParams,
    ...(robust === undefined ? {} : { robustVariance: robust }),
  });

  const innerLevel = normalQuantile(1 - alpha / 2);
  const outerLevel = normalQuantile(1 - sidakLevel(alpha, K) / 2);
  const rows: LagRow[] = [];
  const beyondLags: number[] = [];
  let tested = 0;
  for (let k = 1; k <= K; k++) {
    const r = ac.correlation[k] as number;
    const s = se[k - 1] as number;
    const z = r / s;
    const pLag = normalTwoSided(z);
    const beyond = Math.abs(z) > innerLevel;
    if (Number.isFinite(z)) tested++;
    if (beyond) beyondLags.push(k);
    rows.push({
      lag: k,
      correlation: r,
      partial: partials[k - 1] as number,
      standardError: s,
      band: innerLevel * s,
      z,
      pLag,
      pSidak: sidakAdjust(pLag, K),
      beyond,
      outer: Math.abs(z) > outerLevel,
      jointQ: cumulative.q[k - 1] as number,
      jointDf: cumulative.df[k - 1] as number,
      jointP: cumulative.p[k - 1] as number,
    });
  }
  const joint = jointTestAt(testKind, cumulative);
  const falseAlarm = falseAlarmNote(tested, alpha, beyondLags);
  const verdict = judge({
    n: ac.n,
    maxLag: K,
    alpha,
    season,
    lags: rows,
    joint,
    falseAlarm,
    subject,
  });
  // Fields listed one by one (not spread from `resolved`): the spread builds a slow object.
  return {
    maxLag: K,
    alpha,
    season,
    fittedParams,
    bandKind,
    testKind,
    label: series.label,
    subject,
    n: ac.n,
    length: series.values.length,
    gaps: series.gaps,
    mean: level.mean,
    variance: level.sumSquares / ac.n,
    autocovariance: ac.autocovariance,
    innerLevel,
    outerLevel,
    rows,
    joint,
    falseAlarm,
    verdict,
  };
}

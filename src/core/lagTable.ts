/**
 * The lag table: everything Echolot reports about one series, computed once and shared by the
 * cell functions, the pane and the CLI — autocorrelation, partial autocorrelation, standard errors
 * and bands of the chosen kind, per-lag z and p (own and Šidák-adjusted), the cumulative joint
 * test, the false-alarm note and the verdict. Each formula lives in its own file; this file only
 * assembles. Cost O(n·K) plus O(K²) for the partials. `noiseCheck` gives the same verdict from
 * the same steps without the per-lag table.
 */
import { autocorrelation, type Autocorrelation } from "./autocovariance";
import { robustVariances, standardErrors } from "./bands";
import { corridorCrossings, corridorLevels } from "./corridors";
import { normalTwoSided } from "./distributions";
import { falseAlarmNote, type FalseAlarmNote } from "./falseAlarms";
import { sidakAdjust } from "./multiplicity";
import { resolveLagOptions, type LagOptions, type ResolvedLagOptions } from "./options";
import { partialAutocorrelation } from "./partial";
import {
  cumulativeJointTest,
  jointTest,
  jointTestAt,
  type JointTest,
  type JointTestInput,
} from "./portmanteau";
import { centre, type Centred } from "./centre";
import { squaredDeviationCorrelation } from "./squares";
import type { Series } from "./types";
import { judge, type Verdict, type VerdictLag } from "./verdict";

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
  /** The level the joint test's χ² p is compared with for `structure` (the verdict's common level). */
  readonly jointLevel: number;
  readonly rows: readonly LagRow[];
  readonly joint: JointTest;
  readonly falseAlarm: FalseAlarmNote;
  readonly verdict: Verdict;
}

/** The verdict of one series and what it rests on: the noise check, without the per-lag table. */
export interface NoiseCheck extends ResolvedLagOptions {
  readonly label: string;
  readonly subject: LagSubject;
  /** Values present. */
  readonly n: number;
  readonly joint: JointTest;
  /** The level the joint test's χ² p is compared with for `structure` (the verdict's common level). */
  readonly jointLevel: number;
  readonly falseAlarm: FalseAlarmNote;
  readonly verdict: Verdict;
}

/** What the verdict rests on, computed once for the noise check and the lag table alike. */
interface Screen {
  readonly resolved: ResolvedLagOptions;
  readonly subject: LagSubject;
  readonly ac: Autocorrelation;
  /** Mean and c₀ of the series itself (the subject's for "series"). */
  readonly level: Centred;
  readonly robust: Float64Array | undefined;
  readonly se: Float64Array;
  readonly innerLevel: number;
  readonly outerLevel: number;
  /** Lag k at index k−1: r_k, z_k and the two corridors. */
  readonly lags: readonly VerdictLag[];
  readonly tested: number;
  readonly beyondLags: readonly number[];
}

function screen(series: Series, options: LagOptions): Screen {
  const resolved = resolveLagOptions(series, options);
  const { maxLag: K, alpha, bandKind, testKind } = resolved;
  const subject: LagSubject = testKind === "squares" ? "squares" : "series";
  const ac =
    subject === "squares" ? squaredDeviationCorrelation(series, K) : autocorrelation(series, K);
  const level = subject === "squares" ? centre(series) : ac;
  const needsRobust = bandKind === "robust" || testKind === "robust";
  const robust = needsRobust ? robustVariances(ac, K) : undefined;
  const se = standardErrors(bandKind, ac, K, robust);
  const levels = corridorLevels(alpha, K);
  const { innerLevel, outerLevel } = levels;
  const { lags, tested, beyondLags } = corridorCrossings(ac.correlation, se, levels);
  return {
    resolved,
    subject,
    ac,
    level,
    robust,
    se,
    innerLevel,
    outerLevel,
    lags,
    tested,
    beyondLags,
  };
}

function jointTestInput(s: Screen): JointTestInput {
  const { testKind: kind, fittedParams } = s.resolved;
  const { n, correlation } = s.ac;
  return s.robust === undefined
    ? { kind, n, correlation, fittedParams }
    : { kind, n, correlation, fittedParams, robustVariance: s.robust };
}

function conclude(s: Screen, joint: JointTest): { falseAlarm: FalseAlarmNote; verdict: Verdict } {
  const { maxLag, alpha, season } = s.resolved;
  const falseAlarm = falseAlarmNote(s.tested, alpha, s.beyondLags);
  const verdict = judge({
    n: s.ac.n,
    maxLag,
    alpha,
    season,
    lags: s.lags,
    joint,
    falseAlarm,
    subject: s.subject,
  });
  return { falseAlarm, verdict };
}

/**
 * The noise check alone: the same verdict as `lagTable(series, options).verdict`, from the same
 * steps, without what only the table shows (partials, per-lag p-values, the joint test at every
 * k), so one χ² tail instead of K. For the noise and block checks.
 */
export function noiseCheck(series: Series, options: LagOptions = {}): NoiseCheck {
  const s = screen(series, options);
  const joint = jointTest(jointTestInput(s));
  const { falseAlarm, verdict } = conclude(s, joint);
  const { maxLag, alpha, season, fittedParams, bandKind, testKind } = s.resolved;
  return {
    maxLag,
    alpha,
    season,
    fittedParams,
    bandKind,
    testKind,
    label: series.label,
    subject: s.subject,
    n: s.ac.n,
    joint,
    jointLevel: alpha,
    falseAlarm,
    verdict,
  };
}

/**
 * With testKind "squares" the rows describe the squared deviations (the McLeod–Li view of
 * volatility clustering); mean and variance always describe the series itself.
 */
export function lagTable(series: Series, options: LagOptions = {}): LagTable {
  const s = screen(series, options);
  const { maxLag: K, alpha, season, fittedParams, bandKind, testKind } = s.resolved;
  const { ac, level, se, innerLevel, outerLevel } = s;
  const partials = partialAutocorrelation(ac.correlation);
  const cumulative = cumulativeJointTest(jointTestInput(s));
  const rows: LagRow[] = [];
  for (let k = 1; k <= K; k++) {
    const { correlation, z, beyond, outer } = s.lags[k - 1] as VerdictLag;
    const standardError = se[k - 1] as number;
    const pLag = normalTwoSided(z);
    rows.push({
      lag: k,
      correlation,
      partial: partials[k - 1] as number,
      standardError,
      band: innerLevel * standardError,
      z,
      pLag,
      pSidak: sidakAdjust(pLag, K),
      beyond,
      outer,
      jointQ: cumulative.q[k - 1] as number,
      jointDf: cumulative.df[k - 1] as number,
      jointP: cumulative.p[k - 1] as number,
    });
  }
  const joint = jointTestAt(testKind, cumulative);
  const { falseAlarm, verdict } = conclude(s, joint);
  // Fields listed one by one (not spread from the options): the spread builds a slow object.
  return {
    maxLag: K,
    alpha,
    season,
    fittedParams,
    bandKind,
    testKind,
    label: series.label,
    subject: s.subject,
    n: ac.n,
    length: series.values.length,
    gaps: series.gaps,
    mean: level.mean,
    variance: (level.sumSquares / ac.n) * level.scale * level.scale,
    autocovariance: ac.autocovariance,
    innerLevel,
    outerLevel,
    jointLevel: alpha,
    rows,
    joint,
    falseAlarm,
    verdict,
  };
}

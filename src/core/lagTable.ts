/**
 * The lag table: everything Echolot reports about one series, computed once and shared by the
 * cell functions, the pane and the CLI — autocorrelation, partial autocorrelation, standard errors
 * and bands of the chosen kind, per-lag z and p (own and Šidák-adjusted), the cumulative joint
 * test, the false-alarm note, the verdict and the cautions on the sample's size; each lag's zone
 * against the two corridors, for its autocorrelation and its partial. Each formula and each
 * decision lives in its own file; this file only assembles. Cost O(n·K) plus O(K²) for the
 * partials. `noiseCheck` gives the same verdict from the same steps without the per-lag table.
 */
import { autocorrelation, type Autocorrelation } from "./autocorrelation";
import { robustVariances, standardErrors } from "./bands";
import {
  corridorCrossings,
  corridorZone,
  innerCorridor,
  largestZ,
  type CorridorZone,
} from "./corridors";
import { normalTwoSided } from "./distributions";
import { falseAlarmNote, type FalseAlarmNote } from "./falseAlarms";
import { sidakAdjust } from "./multiplicity";
import { resolveLagOptions, type LagOptions, type ResolvedLagOptions } from "./options";
import { partialAutocorrelation, partialZ } from "./partial";
import {
  cumulativeJointTest,
  type CumulativeJointTest,
  jointTest,
  jointTestAt,
  type JointTest,
  type JointTestInput,
} from "./portmanteau";
import { centre, type Centred } from "./centre";
import { sampleCautions, type SampleCautions } from "./sampleCautions";
import { squaredDeviationCorrelation } from "./squares";
import type { Series } from "./types";
import { untestedSeasonalLags } from "./defaultLags";
import { chiSquareUpperTail } from "./distributions";
import { judge, seasonalLags, type Verdict, type VerdictLag } from "./verdict";
import { verdictLevels, type SeriesLevels } from "./verdictReference";

export interface LagRow {
  readonly lag: number;
  readonly correlation: number;
  readonly partial: number;
  /** The partial's z = φ_kk·√n (se 1/√n whatever the band kind: partial.ts). */
  readonly partialZ: number;
  /** Where `partialZ` lies against the two corridors (corridors.ts). */
  readonly partialZone: CorridorZone;
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
  readonly crossesBand: boolean;
  /** |z_k| beyond the outer corridor (Šidák over K lags). */
  readonly outer: boolean;
  /** Where z_k lies: `beyond` when `outer`, `between` when only `crossesBand`, else `inside`; NaN z: `none`. */
  readonly zone: CorridorZone;
  /** Joint test over lags 1..k. */
  readonly jointQ: number;
  readonly jointDf: number;
  readonly jointP: number;
  /** jointP < alpha: the joint test over lags 1..k rejects at the request's alpha (χ² scale). */
  readonly jointBelowAlpha: boolean;
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
  /** Outer corridor: |z_k| beyond it fires `structure` (the verdict's common level a*). */
  readonly outerLevel: number;
  /**
   * The χ² p below which the joint test rejects (the χ² tail at the critical Q): the verdict's
   * common level expressed on the textbook χ² scale, for reports that only have that scale.
   */
  readonly jointLevel: number;
  /** The reference, levels and the joint p the verdict used (verdictReference.ts). */
  readonly levels: SeriesLevels;
  readonly rows: readonly LagRow[];
  readonly joint: JointTest;
  /**
   * joint.p < alpha: the joint test over all K lags rejects at the request's alpha on the
   * textbook χ² scale (for the squares' table: McLeod–Li finds volatility clustering).
   */
  readonly jointBelowAlpha: boolean;
  readonly falseAlarm: FalseAlarmNote;
  readonly verdict: Verdict;
  /** The small-sample and many-lags cautions (sampleCautions.ts). */
  readonly cautions: SampleCautions;
}

/** The verdict of one series and what it rests on: the noise check, without the per-lag table. */
export interface NoiseCheck extends ResolvedLagOptions {
  readonly label: string;
  readonly subject: LagSubject;
  /** Values present. */
  readonly n: number;
  readonly joint: JointTest;
  /** The χ² p below which the joint test rejects (see LagTable). */
  readonly jointLevel: number;
  /** The reference, levels and the joint p the verdict used (verdictReference.ts). */
  readonly levels: SeriesLevels;
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
  readonly joint: JointTest;
  readonly levels: SeriesLevels;
  /** Lag k at index k−1: r_k, z_k and the two corridors. */
  readonly lags: readonly VerdictLag[];
  readonly tested: number;
  readonly crossingLags: readonly number[];
}

function jointTestInput(
  resolved: ResolvedLagOptions,
  ac: Autocorrelation,
  robust: Float64Array | undefined,
): JointTestInput {
  const { testKind: kind, fittedParams } = resolved;
  const { n, correlation } = ac;
  return robust === undefined
    ? { kind, n, correlation, fittedParams }
    : { kind, n, correlation, fittedParams, robustVariance: robust };
}

/** `joint` given when the caller has the cumulative test already (the lag table). */
function screen(
  series: Series,
  options: LagOptions,
  given?: (input: JointTestInput) => JointTest,
): Screen {
  const resolved = resolveLagOptions(series, options);
  const { maxLag: K, alpha, bandKind, testKind, season, fittedParams } = resolved;
  const subject: LagSubject = testKind === "squares" ? "squares" : "series";
  const ac =
    subject === "squares" ? squaredDeviationCorrelation(series, K) : autocorrelation(series, K);
  const level = subject === "squares" ? centre(series) : ac;
  const needsRobust = bandKind === "robust" || testKind === "robust";
  const robust = needsRobust ? robustVariances(ac, K) : undefined;
  const se = standardErrors(bandKind, ac, K, robust);
  const innerLevel = innerCorridor(alpha);
  const input = jointTestInput(resolved, ac, robust);
  const joint = given === undefined ? jointTest(input) : given(input);
  const levels = verdictLevels(
    {
      deviations: ac.deviations,
      present: series.present,
      spec: { n: ac.n, maxLag: K, bandKind, testKind, sumSquares: ac.sumSquares, pairs: ac.pairs },
      alpha,
      fittedParams,
      innerLevel,
      keyLags: [1, ...seasonalLags(season, K)],
      q: joint.q,
      df: joint.df,
      largest: largestZ(ac.correlation, se),
    },
    [testKind, bandKind, String(K), String(alpha), String(season)],
  );
  const { lags, tested, crossingLags } = corridorCrossings(ac.correlation, se, {
    innerLevel,
    outerLevel: levels.outerLevel,
  });
  return {
    resolved,
    subject,
    ac,
    level,
    robust,
    se,
    innerLevel,
    joint,
    levels,
    lags,
    tested,
    crossingLags,
  };
}

function conclude(s: Screen): { falseAlarm: FalseAlarmNote; verdict: Verdict } {
  const { maxLag, alpha, season } = s.resolved;
  const falseAlarm = falseAlarmNote(s.tested, alpha, s.crossingLags);
  const verdict = judge({
    n: s.ac.n,
    maxLag,
    alpha,
    season,
    lags: s.lags,
    joint: s.joint,
    levels: s.levels,
    falseAlarm,
    untestedSeasonal: untestedSeasonalLags(season, maxLag),
    subject: s.subject,
  });
  return { falseAlarm, verdict };
}

/** The χ² p of the critical Q: below it the joint test rejects. */
function jointLevelOf(s: Screen): number {
  const { criticalQ } = s.levels;
  if (!Number.isFinite(criticalQ)) return 0;
  return chiSquareUpperTail(criticalQ, s.joint.df);
}

/**
 * The noise check alone: the same verdict as `lagTable(series, options).verdict`, from the same
 * steps, without what only the table shows (partials, per-lag p-values, the joint test at every
 * k), so one χ² tail instead of K. For the noise and block checks.
 */
export function noiseCheck(series: Series, options: LagOptions = {}): NoiseCheck {
  const s = screen(series, options);
  const { joint } = s;
  const { falseAlarm, verdict } = conclude(s);
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
    jointLevel: jointLevelOf(s),
    levels: s.levels,
    falseAlarm,
    verdict,
  };
}

/**
 * With testKind "squares" the rows describe the squared deviations (the McLeod–Li view of
 * volatility clustering); mean and variance always describe the series itself.
 */
export function lagTable(series: Series, options: LagOptions = {}): LagTable {
  let cumulative: CumulativeJointTest | undefined;
  const s = screen(series, options, (input) => {
    cumulative = cumulativeJointTest(input);
    return jointTestAt(input.kind, cumulative);
  });
  if (cumulative === undefined) throw new Error("the lag table's cumulative test was not computed");
  const { maxLag: K, alpha, season, fittedParams, bandKind, testKind } = s.resolved;
  const { ac, level, se, innerLevel, joint } = s;
  const outerLevel = s.levels.outerLevel;
  const corridors = { innerLevel, outerLevel };
  const partials = partialAutocorrelation(ac.correlation);
  const rows: LagRow[] = [];
  for (let k = 1; k <= K; k++) {
    const { correlation, z, crossesBand, outer } = s.lags[k - 1] as VerdictLag;
    const standardError = se[k - 1] as number;
    const pLag = normalTwoSided(z);
    const partial = partials[k - 1] as number;
    const pz = partialZ(partial, ac.n);
    const jointP = cumulative.p[k - 1] as number;
    rows.push({
      lag: k,
      correlation,
      partial,
      partialZ: pz,
      partialZone: corridorZone(pz, corridors),
      standardError,
      band: innerLevel * standardError,
      z,
      pLag,
      pSidak: sidakAdjust(pLag, K),
      crossesBand,
      outer,
      // Every lag of the table is counted, so the zone's comparisons are `crossesBand` and `outer`.
      zone: corridorZone(z, corridors),
      jointQ: cumulative.q[k - 1] as number,
      jointDf: cumulative.df[k - 1] as number,
      jointP,
      jointBelowAlpha: jointP < alpha,
    });
  }
  const { falseAlarm, verdict } = conclude(s);
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
    jointLevel: jointLevelOf(s),
    levels: s.levels,
    rows,
    joint,
    jointBelowAlpha: joint.p < alpha,
    falseAlarm,
    verdict,
    cautions: sampleCautions(ac.n, K, verdict.word),
  };
}

/** The per-lag figures alone, for the cell functions that show only them. */
export interface LagFigures {
  /** γ̂_k for k = 0..K. */
  readonly autocovariance: Float64Array;
  /** r_k for k = 1..K (index k−1). */
  readonly correlation: Float64Array;
  /** φ̂_kk for k = 1..K (index k−1). */
  readonly partial: Float64Array;
  /** Band half-width z_{1−α/2}·se_k for k = 1..K (index k−1). */
  readonly band: Float64Array;
}

/**
 * The lag table's per-lag figures without its verdict: the same functions on the same options
 * (so the same numbers, bit for bit), without the verdict's reference draws. O(n·K + K²).
 */
export function lagFigures(series: Series, options: LagOptions = {}): LagFigures {
  const resolved = resolveLagOptions(series, options);
  const { maxLag: K, alpha, bandKind } = resolved;
  const ac = autocorrelation(series, K);
  const se = standardErrors(bandKind, ac, K);
  const inner = innerCorridor(alpha);
  return {
    autocovariance: ac.autocovariance,
    correlation: ac.correlation.slice(1),
    partial: Float64Array.from(partialAutocorrelation(ac.correlation)),
    band: se.map((s) => inner * s),
  };
}

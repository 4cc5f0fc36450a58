/**
 * The `check --json` document: the lag table's fields under stable names. Numbers keep full
 * precision (JSON.stringify writes the shortest round-trip form); an undefined figure (NaN) is
 * written as null.
 */
import type {
  AuditBatch,
  BatchCheck,
  ForecastAuditOptions,
  LagTable,
  ReferencedP,
  VerdictLevels,
} from "../core";
import { isPValueBound, rankedAuditItems, rankedRows } from "../core";
import type { SideChecks } from "../report/sideChecksText";

export function lagTableJson(table: LagTable): Record<string, unknown> {
  return {
    label: table.label,
    n: table.n,
    gaps: table.gaps,
    maxLag: table.maxLag,
    alpha: table.alpha,
    bandKind: table.bandKind,
    testKind: table.testKind,
    season: table.season,
    fittedParams: table.fittedParams,
    mean: table.mean,
    variance: table.variance,
    innerLevel: table.innerLevel,
    outerLevel: table.outerLevel,
    lags: table.rows.map((row) => ({
      lag: row.lag,
      corr: row.correlation,
      partial: row.partial,
      band: row.band,
      beyond: row.beyond,
      z: row.z,
      pLag: row.pLag,
      pSidak: row.pSidak,
      pBound: isPValueBound(row.pLag),
      outer: row.outer,
      jointQ: row.jointQ,
      jointDf: row.jointDf,
      jointP: row.jointP,
      jointPReference: "chi-square",
    })),
    joint: {
      test: table.joint.test,
      q: table.joint.q,
      df: table.joint.df,
      p: table.joint.p,
      reference: "chi-square",
      pBound: isPValueBound(table.joint.p),
    },
    verdictJoint: { p: table.levels.jointP.p, ...referenceFields(table.levels.jointP) },
    levels: levelFields(table.levels),
    jointLevel: table.jointLevel,
    falseAlarm: {
      tested: table.falseAlarm.tested,
      expected: table.falseAlarm.expected,
      beyond: table.falseAlarm.beyond,
      beyondLags: table.falseAlarm.beyondLags,
      chance: table.falseAlarm.chance,
    },
    verdict: { word: table.verdict.word, reason: table.verdict.reason },
  };
}

/**
 * The side checks under the names the `check --json` document promises; a check the data could
 * not support is null, and its reason is listed under `notComputed`.
 */
export function sideChecksJson(side: SideChecks): Record<string, unknown> {
  const notComputed: Record<string, string> = {};
  const field = <T>(name: string, value: T | string, shape: (v: T) => Record<string, unknown>) => {
    if (typeof value !== "string") return shape(value);
    notComputed[name] = value;
    return null;
  };
  const document: Record<string, unknown> = {
    volatility: field("volatility", side.volatility, (v) => ({
      lm: v.lm,
      df: v.df,
      p: v.p,
      mcleodLiQ: v.mcleodLiQ,
      mcleodLiP: v.mcleodLiP,
    })),
    bias: field("bias", side.bias, (b) => ({
      mean: b.mean,
      se: b.se,
      t: b.t,
      p: b.p,
      hacLags: b.hacLags,
    })),
    runs: field("runs", side.runs, (r) => ({ runs: r.runs, expected: r.expected, z: r.z, p: r.p })),
    normality: field("normality", side.normality, (j) => ({ jb: j.jb, p: j.p })),
  };
  if (Object.keys(notComputed).length > 0) document.notComputed = notComputed;
  return document;
}

/** The `batch --json` document: one entry per series in the order of the file. */
export function batchJson(batch: BatchCheck): Record<string, unknown> {
  return {
    alpha: batch.alpha,
    series: rankedRows(batch).map((row) => ({
      label: row.label,
      n: row.n,
      q: row.q,
      df: row.df,
      p: row.p,
      qValue: row.qValue,
      kept: row.kept,
      word: row.headline?.word ?? null,
      title: row.headline?.title ?? null,
      finding: row.headline?.finding ?? null,
      reading: row.reading,
      volatilityP: row.volatilityP,
      mean: row.mean,
      biasP: row.biasP,
      biasQValue: row.biasQValue,
      verdict: row.verdict,
      reason: row.reason,
    })),
    flaggedRaw: batch.flaggedRaw,
    flaggedFdr: batch.flaggedFdr,
    biasFlaggedRaw: batch.biasFlaggedRaw,
    biasFlaggedFdr: batch.biasFlaggedFdr,
  };
}

/**
 * The `audit --json` document: the batch shape (q, df and p are the dependence test of lags h..K,
 * qValue its Benjamini–Hochberg value across the series, verdict the audit's), with each series'
 * bias and lags beside it. `flaggedRaw`/`flaggedFdr` count the dependence tests; `biasFlaggedRaw`/
 * `biasFlaggedFdr` the bias tests. A series that could not be audited has null figures and its
 * reason.
 */
export function auditJson(
  batch: AuditBatch,
  options: ForecastAuditOptions,
): Record<string, unknown> {
  return {
    horizon: options.horizon,
    season: options.season ?? null,
    alpha: batch.alpha,
    series: rankedAuditItems(batch).map((item) => {
      const audit = item.audit;
      if (audit === null) {
        return {
          label: item.label,
          n: null,
          q: null,
          df: null,
          p: null,
          qValue: null,
          verdict: null,
          reason: item.problem,
        };
      }
      return {
        label: item.label,
        n: audit.n,
        q: audit.dependenceTest.q,
        df: audit.dependenceTest.df,
        p: audit.levels.jointP.p,
        ...referenceFields(audit.levels.jointP),
        pChiSquare: audit.dependenceTest.p,
        qValue: item.dependenceQValue,
        kept: item.kept,
        biased: item.biased,
        word: item.headline?.word ?? null,
        title: item.headline?.title ?? null,
        finding: item.headline?.finding ?? null,
        verdict: audit.verdict.word,
        reason: audit.verdict.reason,
        firstLag: audit.dependenceTest.firstLag,
        maxLag: audit.maxLag,
        dependence: audit.dependence.word,
        bias: {
          mean: audit.bias.mean,
          se: audit.bias.se,
          t: audit.bias.tCorrected,
          tUncorrected: audit.bias.t,
          df: audit.bias.df,
          p: audit.bias.p,
          reference: "student-t",
          qValue: item.biasQValue,
          longRunLags: audit.bias.horizon - 1,
          flagged: audit.levels.biasFlagged,
          level: audit.levels.biasLevel,
        },
        levels: levelFields(audit.levels),
        lags: audit.rows.map((row) => ({
          lag: row.lag,
          corr: row.correlation,
          band: row.band,
          z: row.z,
          pLag: row.pLag,
          counted: row.counted,
          beyond: row.beyond,
          outer: row.outer,
        })),
      };
    }),
    flaggedRaw: batch.flaggedRaw,
    flaggedFdr: batch.flaggedFdr,
    biasFlaggedRaw: batch.biasFlaggedRaw,
    biasFlaggedFdr: batch.biasFlaggedFdr,
  };
}

/** Where a p comes from: its reference, the draws behind it, and whether it is only a bound. */
export function referenceFields(rp: ReferencedP): Record<string, unknown> {
  return { reference: rp.reference, draws: rp.draws, pBound: rp.bound || isPValueBound(rp.p) };
}

/** The levels the verdict was judged at. */
export function levelFields(levels: VerdictLevels): Record<string, unknown> {
  return {
    reference: levels.reference,
    draws: levels.draws,
    structureLevel: levels.structureLevel,
    criticalQ: levels.criticalQ,
    outerLevel: levels.outerLevel,
    watchLevel: levels.watchLevel,
  };
}

/** JSON text with NaN and ±Infinity written as null. */
export function toJsonText(document: unknown): string {
  return JSON.stringify(
    document,
    (_key, value: unknown) => (typeof value === "number" && !Number.isFinite(value) ? null : value),
    2,
  );
}

/**
 * The `batch --json`, `audit --json` and `fdr --json` documents: one entry per series in ranked
 * order (core/batchRanking.ts by way of batchOrder.ts), each with its `rank` (1 = look first), its
 * `position` in the input (from 1), whether its lag structure is `kept` and its bias kept
 * (`biased`) by the false-discovery steps, and its headline (`word`, `title`, `finding`). The joint test's statistic is
 * `statistic` and its Benjamini–Hochberg value `qValue`: never `q` beside `qValue`. `--top` and
 * `--kept` select entries as they select rows of the text; `total` counts every series.
 */
import type {
  AuditBatch,
  AuditBatchItem,
  BatchCheck,
  BatchRow,
  Headline,
  PReference,
  Reading,
  VerdictWord,
} from "../core";
import {
  ALL_RANKED,
  rankedAuditItems,
  rankedBatchRows,
  selectRanked,
  type Ranked,
  type RankedSelection,
} from "../report/batchOrder";
import {
  JSON_VERSION,
  levelFields,
  referenceFields,
  type LevelsJson,
  type ReferenceJson,
} from "./json";

/** What every ranked entry carries. */
export interface RankedEntryJson {
  readonly rank: number;
  readonly label: string;
  /** Place in the input, from 1 (the column among the series, or the id's first appearance). */
  readonly position: number;
  /** The lag structure (an audit: the dependence) is kept by the false-discovery step. */
  readonly kept: boolean;
  /** The bias is kept by the false-discovery step on the bias p-values. */
  readonly biased: boolean;
  /** The headline across the batch (core/batchHeadline.ts); null when not analysed. */
  readonly word: VerdictWord | null;
  readonly title: string | null;
  readonly finding: string | null;
  /** The series' own verdict, before the false-discovery step. */
  readonly verdict: VerdictWord | null;
  /** The verdict's reason, or why the series could not be analysed. */
  readonly reason: string;
}

function headlineFields(headline: Headline | null) {
  return {
    word: headline?.word ?? null,
    title: headline?.title ?? null,
    finding: headline?.finding ?? null,
  };
}

export interface BatchEntryJson extends RankedEntryJson {
  readonly n: number;
  /** The joint test's statistic (Ljung–Box Q, or the chosen test's), its df and p. */
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
  readonly reference: PReference | null;
  readonly draws: number;
  readonly pBound: boolean;
  /** Benjamini–Hochberg q-value of p across the series. */
  readonly qValue: number;
  readonly qValueBound: boolean;
  /** Robust when the volatility check fired (null when not analysed); Engle's LM p. */
  readonly reading: Reading | null;
  readonly volatilityP: number;
  /** The mean, its bias-check p and that p's q-value across the series. */
  readonly mean: number;
  readonly biasP: number;
  readonly biasQValue: number;
}

/** Which ranked entries a document holds. */
export interface SelectionJson {
  readonly top: number | null;
  readonly keptOnly: boolean;
}

/** A column or id of the input not read as a series, and why. */
export interface NotAnalysedJson {
  readonly name: string;
  readonly reason: string;
}

/**
 * What `batch --json` and `audit --json` write around their document (rankedOutput.ts): `source`
 * (what was read) after `version`, and last the columns or ids not read as series. `fdr --json`
 * reads parts, not a file, and writes the document alone.
 */
export interface ReadJson {
  readonly source: string;
  readonly notAnalysed: readonly NotAnalysedJson[];
}

/** The whole `batch --json` document. */
export type BatchDocumentJson = BatchJson & ReadJson;

/** The whole `audit --json` document. */
export type AuditDocumentJson = AuditJson & ReadJson;

export interface BatchJson {
  readonly version: number;
  readonly alpha: number;
  /** Every series of the batch, shown or not. */
  readonly total: number;
  readonly selection: SelectionJson;
  readonly series: readonly BatchEntryJson[];
  readonly flaggedRaw: number;
  readonly flaggedFdr: number;
  readonly biasFlaggedRaw: number;
  readonly biasFlaggedFdr: number;
}

function batchEntry({ item: row, rank, index }: Ranked<BatchRow>): BatchEntryJson {
  return {
    rank,
    label: row.label,
    position: index + 1,
    n: row.n,
    statistic: row.q,
    df: row.df,
    p: row.p,
    reference: row.reference,
    draws: row.draws,
    pBound: row.pBound,
    qValue: row.qValue,
    qValueBound: row.qValueBound,
    reading: row.reading,
    volatilityP: row.volatilityP,
    mean: row.mean,
    biasP: row.biasP,
    biasQValue: row.biasQValue,
    kept: row.kept,
    biased: row.headline?.biased ?? false,
    ...headlineFields(row.headline),
    verdict: row.verdict,
    reason: row.reason,
  };
}

export function batchJson(batch: BatchCheck, selection: RankedSelection = ALL_RANKED): BatchJson {
  const all = rankedBatchRows(batch);
  return {
    version: JSON_VERSION,
    alpha: batch.alpha,
    total: all.length,
    selection: { top: selection.top, keptOnly: selection.keptOnly },
    series: selectRanked(all, selection).map(batchEntry),
    flaggedRaw: batch.flaggedRaw,
    flaggedFdr: batch.flaggedFdr,
    biasFlaggedRaw: batch.biasFlaggedRaw,
    biasFlaggedFdr: batch.biasFlaggedFdr,
  };
}

export interface AuditLagJson {
  readonly lag: number;
  readonly corr: number;
  readonly band: number;
  readonly z: number;
  readonly pLag: number;
  readonly counted: boolean;
  /** The JSON key as published; the core's `crossesBand`. */
  readonly beyond: boolean;
  readonly outer: boolean;
}

/** An audited series; `statistic`, `df`, `p` and `qValue` are the dependence test's (lags h..K). */
export interface AuditEntryJson extends RankedEntryJson, ReferenceJson {
  readonly n: number;
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
  /** The dependence test's χ² p, beside the Monte Carlo one the verdict reads. */
  readonly pChiSquare: number;
  readonly qValue: number;
  readonly verdict: VerdictWord;
  readonly firstLag: number;
  readonly maxLag: number;
  readonly dependence: VerdictWord;
  readonly bias: {
    readonly mean: number;
    readonly se: number;
    readonly t: number;
    readonly tUncorrected: number;
    readonly df: number;
    readonly p: number;
    readonly reference: "student-t";
    readonly qValue: number;
    readonly longRunLags: number;
    readonly flagged: boolean;
    readonly level: number;
  };
  readonly levels: LevelsJson;
  readonly lags: readonly AuditLagJson[];
}

/** A series that could not be audited: its place and why, figures null. */
export interface NotAuditedEntryJson extends RankedEntryJson {
  readonly n: null;
  readonly statistic: null;
  readonly df: null;
  readonly p: null;
  readonly qValue: null;
  readonly verdict: null;
}

export interface AuditJson {
  readonly version: number;
  readonly horizon: number;
  readonly season: number | null;
  readonly alpha: number;
  readonly total: number;
  readonly selection: SelectionJson;
  readonly series: readonly (AuditEntryJson | NotAuditedEntryJson)[];
  /** Dependence tests with p < alpha, and with q-value ≤ alpha. */
  readonly flaggedRaw: number;
  readonly flaggedFdr: number;
  /** Bias tests with p < alpha, and with q-value ≤ alpha. */
  readonly biasFlaggedRaw: number;
  readonly biasFlaggedFdr: number;
}

function auditEntry({
  item,
  rank,
  index,
}: Ranked<AuditBatchItem>): AuditEntryJson | NotAuditedEntryJson {
  const place = {
    rank,
    label: item.label,
    position: index + 1,
    kept: item.kept,
    biased: item.biased,
    ...headlineFields(item.headline),
  };
  const audit = item.audit;
  if (audit === null) {
    return {
      ...place,
      n: null,
      statistic: null,
      df: null,
      p: null,
      qValue: null,
      verdict: null,
      reason: item.problem,
    };
  }
  return {
    ...place,
    n: audit.n,
    statistic: audit.dependenceTest.q,
    df: audit.dependenceTest.df,
    p: audit.levels.jointP.p,
    ...referenceFields(audit.levels.jointP),
    pChiSquare: audit.dependenceTest.p,
    qValue: item.dependenceQValue,
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
      beyond: row.crossesBand,
      outer: row.outer,
    })),
  };
}

export function auditJson(batch: AuditBatch, selection: RankedSelection = ALL_RANKED): AuditJson {
  const all = rankedAuditItems(batch);
  return {
    version: JSON_VERSION,
    horizon: batch.horizon,
    season: batch.season,
    alpha: batch.alpha,
    total: all.length,
    selection: { top: selection.top, keptOnly: selection.keptOnly },
    series: selectRanked(all, selection).map(auditEntry),
    flaggedRaw: batch.flaggedRaw,
    flaggedFdr: batch.flaggedFdr,
    biasFlaggedRaw: batch.biasFlaggedRaw,
    biasFlaggedFdr: batch.biasFlaggedFdr,
  };
}

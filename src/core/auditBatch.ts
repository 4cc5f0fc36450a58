/**
 * The forecast audit of many series at once (one forecast-error series per item): each series'
 * audit (forecastAudit.ts), and across the items Benjamini–Hochberg q-values (Benjamini & Hochberg
 * 1995, JRSS B 57:289–300; multiplicity.ts) of the dependence test and of the bias test
 * separately, with how many items each flags raw (p < alpha) and under the false-discovery rate
 * (q ≤ alpha). The dependence p is the audit's Monte Carlo one (auditReference.ts), the bias p
 * the Harvey–Leybourne–Newbold t (horizonBias.ts). An item that cannot be audited (too few values, constant) keeps its place with
 * the reason and stays out of both families; when no item can be audited the first refusal is
 * thrown. The result carries the options its audits resolved (alpha, horizon, season) and the raw
 * flags expected by chance (falseAlarms.ts). Cost: one audit per series.
 */
import { batchLabel } from "./batch";
import { EcholotError, isEcholotError, type RefusedParameter } from "./errors";
import { expectedFalseFlags } from "./falseAlarms";
import { forecastAudit, type ForecastAudit, type ForecastAuditOptions } from "./forecastAudit";
import { batchNote, lagWord, qPhrase } from "./batchHeadline";
import { formatNumber, pPhrase } from "./format";
import { biasSentence, composeHeadline, type Headline } from "./headline";
import { benjaminiHochberg } from "./multiplicity";
import { resolveAlpha } from "./options";
import type { Series } from "./types";

export interface AuditBatchItem {
  readonly label: string;
  /** The audit, or null when the series could not be audited. */
  readonly audit: ForecastAudit | null;
  /** Why the series could not be audited ("" when it was). */
  readonly problem: string;
  /** BH q-values across the items audited (NaN for the others). */
  readonly dependenceQValue: number;
  readonly biasQValue: number;
  /** The dependence test survives the false-discovery step (q-value ≤ alpha, not short). */
  readonly kept: boolean;
  /** The bias test survives its own false-discovery step. */
  readonly biased: boolean;
  /** The headline across the audit (batchHeadline.ts rules); null when not audited. */
  readonly headline: Headline | null;
}

export interface AuditBatch {
  /** alpha, h and the season as every audit of the batch resolved them. */
  readonly alpha: number;
  readonly horizon: number;
  readonly season: number | null;
  readonly items: readonly AuditBatchItem[];
  /** Items audited (the BH families). */
  readonly analysed: number;
  /** Raw dependence flags expected by chance if every forecast were sound: analysed·α. */
  readonly expectedRawFlags: number;
  /** Dependence tests with p < alpha, and with q-value ≤ alpha. */
  readonly flaggedRaw: number;
  readonly flaggedFdr: number;
  /** Bias tests with p < alpha, and with q-value ≤ alpha. */
  readonly biasFlaggedRaw: number;
  readonly biasFlaggedFdr: number;
}

/** One item's audit before the cross-item step: the per-series stage, run anywhere. */
export interface AuditBatchEntry {
  readonly label: string;
  readonly audit: ForecastAudit | null;
  readonly problem: string;
  /** The argument `problem` refuses, when it refuses one (kept across worker threads). */
  readonly refused?: RefusedParameter;
}

/** The audit of one series of a batch; `index` names an unlabelled series. */
export function auditEntry(
  series: Series,
  index: number,
  options: ForecastAuditOptions,
): AuditBatchEntry {
  const label = batchLabel(series, index);
  try {
    return { label, audit: forecastAudit(series, options), problem: "" };
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    const refused = error.parameter === undefined ? {} : { refused: error.parameter };
    return { label, audit: null, problem: error.message, ...refused };
  }
}

export function auditBatch(
  seriesList: readonly Series[],
  options: ForecastAuditOptions,
): AuditBatch {
  // A bad alpha is refused once, before any audit.
  resolveAlpha(options.alpha);
  const entries = seriesList.map((series, index) => auditEntry(series, index, options));
  // When no item can be audited, the first one's refusal is thrown as it was (its kind too).
  const first = seriesList[0];
  if (first !== undefined && entries.every((entry) => entry.audit === null)) {
    forecastAudit(first, options);
  }
  return auditBatchOf(entries);
}

/** The options the audits resolved, the same for every audit of one batch. */
function sharedSettings(audits: readonly ForecastAudit[]): {
  alpha: number;
  horizon: number;
  season: number | null;
} {
  const { alpha, horizon, season } = audits[0] as ForecastAudit;
  for (const audit of audits) {
    if (audit.alpha !== alpha || audit.horizon !== horizon || audit.season !== season) {
      throw new Error("the audits of one batch must share alpha, horizon and season");
    }
  }
  return { alpha, horizon, season };
}

/**
 * The cross-item step over the entries, in their order: q-values of the dependence and the bias
 * tests across the items audited, and the counts, at the alpha the audits resolved. When no entry
 * was audited, it refuses with the first one's reason.
 */
export function auditBatchOf(entries: readonly AuditBatchEntry[]): AuditBatch {
  const audits = entries.flatMap((entry) => (entry.audit === null ? [] : [entry.audit]));
  if (audits.length === 0) {
    const first = entries[0];
    throw new EcholotError(
      "invalid",
      first?.problem ?? "there are no series to audit",
      first?.refused,
    );
  }
  const { alpha, horizon, season } = sharedSettings(audits);
  const dependenceP = entries.map((item) => item.audit?.levels.jointP.p ?? NaN);
  const biasP = entries.map((item) => item.audit?.bias.p ?? NaN);
  const dependenceQ = benjaminiHochberg(dependenceP);
  const biasQ = benjaminiHochberg(biasP);
  const analysed = audits.length;
  const items = entries.map((item, i) => {
    const dependenceQValue = dependenceQ[i] as number;
    const biasQValue = biasQ[i] as number;
    const step = { qValue: dependenceQValue, biasQValue, alpha, analysed };
    return { ...item, dependenceQValue, biasQValue, ...auditHeadline(item.audit, step) };
  });
  const count = (values: ArrayLike<number>, pass: (x: number) => boolean) =>
    Array.from(values).filter(pass).length;
  return {
    alpha,
    horizon,
    season,
    items,
    analysed,
    expectedRawFlags: expectedFalseFlags(analysed, alpha),
    flaggedRaw: count(dependenceP, (p) => p < alpha),
    flaggedFdr: count(dependenceQ, (q) => q <= alpha),
    biasFlaggedRaw: count(biasP, (p) => p < alpha),
    biasFlaggedFdr: count(biasQ, (q) => q <= alpha),
  };
}

/**
 * One audited item's headline under the batch rules (batchHeadline.ts): the dependence word
 * respects the false-discovery step on the dependence p-values, and the bias is carried when the
 * bias p-values' own step keeps it.
 */
function auditHeadline(
  audit: ForecastAudit | null,
  step: { qValue: number; biasQValue: number; alpha: number; analysed: number },
): { kept: boolean; biased: boolean; headline: Headline | null } {
  if (audit === null) return { kept: false, biased: false, headline: null };
  const { alpha, biasQValue } = step;
  const own = audit.dependence.word;
  const kept = own !== "short" && step.qValue <= alpha;
  const jointFigures = `dependence ${pPhrase(audit.levels.jointP.p)}, ${qPhrase(step.qValue)}`;
  const { word, lagFinding } = lagWord(own, kept, audit.dependence.finding, jointFigures, step);
  const { bias } = audit;
  const biased = biasQValue <= alpha;
  const figures = { mean: bias.mean, se: bias.se, t: bias.tCorrected, p: bias.p };
  const biasFinding = biased
    ? biasSentence(figures, `${qPhrase(biasQValue)}: kept by the false-discovery step on bias`, {
        se: "long-run se",
        reference: `against t with ${bias.df} df`,
      })
    : bias.p < alpha
      ? `On its own the mean error ${formatNumber(bias.mean, 4)} would count as bias (${pPhrase(bias.p)}), but across ${step.analysed} series the false-discovery step does not keep it (${qPhrase(biasQValue)}).`
      : null;
  const headline = composeHeadline({
    word,
    lagFinding,
    note: batchNote(alpha, step.analysed),
    reading: "plain",
    switched: false,
    plainWord: own,
    volatility: null,
    biased,
    biasFinding,
  });
  return { kept, biased, headline };
}

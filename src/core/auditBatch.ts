/**
 * The forecast audit of many series at once (one forecast-error series per item): each series'
 * audit (forecastAudit.ts), and across the items Benjamini–Hochberg q-values (Benjamini & Hochberg
 * 1995, JRSS B 57:289–300; multiplicity.ts) of the dependence test and of the bias test
 * separately, with how many items each flags raw (p < alpha) and under the false-discovery rate
 * (q ≤ alpha). The dependence p is the audit's Monte Carlo one (auditReference.ts), the bias p
 * the Harvey–Leybourne–Newbold t (horizonBias.ts). An item that cannot be audited (too few values, constant) keeps its place with
 * the reason and stays out of both families; when no item can be audited the first refusal is
 * thrown. Cost: one audit per series.
 */
import { batchLabel } from "./batch";
import { invalid, isEcholotError } from "./errors";
import { forecastAudit, type ForecastAudit, type ForecastAuditOptions } from "./forecastAudit";
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
}

export interface AuditBatch {
  readonly alpha: number;
  readonly items: readonly AuditBatchItem[];
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
    return { label, audit: null, problem: error.message };
  }
}

export function auditBatch(
  seriesList: readonly Series[],
  options: ForecastAuditOptions,
): AuditBatch {
  const alpha = resolveAlpha(options.alpha);
  const entries = seriesList.map((series, index) => auditEntry(series, index, options));
  // When no item can be audited, the first one's refusal is thrown as it was (its kind too).
  const first = seriesList[0];
  if (first !== undefined && entries.every((entry) => entry.audit === null)) {
    forecastAudit(first, options);
  }
  return auditBatchOf(entries, alpha);
}

/**
 * The cross-item step over the entries, in their order: q-values of the dependence and the bias
 * tests across the items audited, and the counts. When no entry was audited, it refuses with the
 * first one's reason.
 */
export function auditBatchOf(entries: readonly AuditBatchEntry[], alpha: number): AuditBatch {
  if (entries.every((entry) => entry.audit === null)) {
    invalid(entries[0]?.problem ?? "there are no series to audit");
  }
  const dependenceP = entries.map((item) => item.audit?.levels.jointP.p ?? NaN);
  const biasP = entries.map((item) => item.audit?.bias.p ?? NaN);
  const dependenceQ = benjaminiHochberg(dependenceP);
  const biasQ = benjaminiHochberg(biasP);
  const items = entries.map((item, i) => ({
    ...item,
    dependenceQValue: dependenceQ[i] as number,
    biasQValue: biasQ[i] as number,
  }));
  const count = (values: ArrayLike<number>, pass: (x: number) => boolean) =>
    Array.from(values).filter(pass).length;
  return {
    alpha,
    items,
    flaggedRaw: count(dependenceP, (p) => p < alpha),
    flaggedFdr: count(dependenceQ, (q) => q <= alpha),
    biasFlaggedRaw: count(biasP, (p) => p < alpha),
    biasFlaggedFdr: count(biasQ, (q) => q <= alpha),
  };
}

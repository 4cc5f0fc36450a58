/**
 * A batch in parts, for batches that outgrow one machine. Each series' noise check depends on that
 * series alone; only the false-discovery step (Benjamini & Hochberg 1995, JRSS B 57:289–300) needs
 * every p-value. So a batch splits into a per-series stage (`seriesResult`, run on any partition
 * of the series, anywhere) and one merge (`mergeSeriesResults`) that applies Benjamini–Hochberg
 * across all the parts — the same q-values and counts as the whole batch (`batchCheck`), whatever
 * the split.
 *
 * The merged rows are ordered by id (code-unit order), so the merge does not depend on how the
 * series were split or in which order the parts arrive.
 */
import { batchLabel, boundedQValues, type BatchCheck, type BatchRow } from "./batch";
import { isPValueBound } from "./distributions";
import { invalid, isEcholotError } from "./errors";
import { noiseCheck } from "./lagTable";
import { benjaminiHochberg } from "./multiplicity";
import { parseTestKind, resolveAlpha, type LagOptions } from "./options";
import type { Series, TestKind, VerdictWord } from "./types";

/** One series' result, without the cross-series step (one line of `batch --format jsonl`). */
export interface SeriesResult {
  readonly id: string;
  readonly n: number;
  /** The joint test's statistic, df and p (null when the series could not be analysed). */
  readonly statistic: number | null;
  readonly df: number | null;
  readonly p: number | null;
  /** Which reference p comes from ("permutation", "chi-square", …; null when not analysed). */
  readonly reference: BatchRow["reference"];
  /** Draws behind p (0 for a χ² tail). */
  readonly draws: number;
  /** p is only an upper bound (no draw reached the statistic, or the 1e-300 floor). */
  readonly pBound: boolean;
  readonly verdict: VerdictWord | null;
  /** The verdict's reason, or why the series could not be analysed. */
  readonly reason: string;
  /** The level the verdict was judged at: every part of one batch must share it. */
  readonly alpha: number;
  /** The joint test used. */
  readonly test: TestKind;
}

/** The noise check of one series as a batch part's line; `index` names an unlabelled series. */
export function seriesResult(
  series: Series,
  index: number,
  options: LagOptions = {},
): SeriesResult {
  const id = batchLabel(series, index);
  const alpha = resolveAlpha(options.alpha);
  const test = parseTestKind(options.testKind);
  try {
    // The same p as the whole batch's (batch.ts): the joint p the verdict uses.
    const check = noiseCheck(series, options);
    const exact = check.levels.jointP;
    return {
      id,
      n: check.n,
      statistic: check.joint.q,
      df: check.joint.df,
      p: exact.p,
      reference: exact.reference,
      draws: exact.draws,
      pBound: exact.bound || isPValueBound(exact.p),
      verdict: check.verdict.word,
      reason: check.verdict.reason,
      alpha,
      test,
    };
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    return {
      id,
      n: series.count,
      statistic: null,
      df: null,
      p: null,
      reference: null,
      draws: 0,
      pBound: false,
      verdict: null,
      reason: error.message,
      alpha,
      test,
    };
  }
}

/**
 * The cross-series step over the results of every part: Benjamini–Hochberg q-values across all
 * series with a p-value, and the raw and false-discovery counts, as `batchCheck` gives them.
 */
export function mergeSeriesResults(results: readonly SeriesResult[]): BatchCheck {
  if (results.length === 0) invalid("there are no series results to merge");
  const first = results[0] as SeriesResult;
  const alpha = first.alpha;
  const ids = new Set<string>();
  for (const r of results) {
    if (r.alpha !== alpha) {
      invalid(
        `the parts were checked at different levels (alpha ${alpha} and ${r.alpha}): run every part with the same --alpha`,
      );
    }
    if (r.test !== first.test) {
      invalid(
        `the parts used different joint tests (${first.test} and ${r.test}): run every part with the same --test`,
      );
    }
    if (ids.has(r.id))
      invalid(`the series "${r.id}" is in the parts twice: each series belongs to one part`);
    ids.add(r.id);
  }
  const sorted = results.slice().sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  return crossSeriesStep(sorted, alpha);
}

/**
 * The whole batch from its series' results in the order given (the same figures as `batchCheck`
 * on the same series, row for row): the step that runs once, on one thread, after the per-series
 * stage ran anywhere. As `batchCheck`, it needs two series at least, and when no series could be
 * analysed it refuses with the first one's reason.
 */
export function batchOfResults(results: readonly SeriesResult[]): BatchCheck {
  if (results.length < 2) {
    invalid(
      `a batch check needs at least 2 series (one per column); got ${results.length}: for a single series use the noise check`,
    );
  }
  const first = results[0] as SeriesResult;
  if (results.every((r) => r.verdict === null)) invalid(first.reason);
  return crossSeriesStep(results, first.alpha);
}

/** Benjamini–Hochberg across the results, in their order, and the counts. */
function crossSeriesStep(results: readonly SeriesResult[], alpha: number): BatchCheck {
  const qValues = benjaminiHochberg(results.map((r) => r.p ?? NaN));
  const qBounds = boundedQValues(results.map((r) => ({ p: r.p ?? NaN, pBound: r.pBound })));
  const rows: BatchRow[] = results.map((r, i) => ({
    label: r.id,
    n: r.n,
    q: r.statistic ?? NaN,
    df: r.df ?? 0,
    p: r.p ?? NaN,
    reference: r.reference,
    draws: r.draws,
    pBound: r.pBound,
    qValue: qValues[i] as number,
    qValueBound: qBounds[i] as boolean,
    verdict: r.verdict,
    reason: r.reason,
  }));
  let flaggedRaw = 0;
  let flaggedFdr = 0;
  let analysed = 0;
  for (const row of rows) {
    if (row.p < alpha) flaggedRaw++;
    if (row.qValue <= alpha) flaggedFdr++;
    if (!Number.isNaN(row.p)) analysed++;
  }
  return { alpha, rows, flaggedRaw, flaggedFdr, analysed };
}

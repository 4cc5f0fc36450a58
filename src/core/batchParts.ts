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
import { batchLabel, type BatchCheck, type BatchRow } from "./batch";
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
  /** Which reference distribution p comes from ("chi-square", "permutation", …). */
  readonly reference: string | null;
  /** Draws of a permutation or Monte Carlo reference, when p comes from one. */
  readonly draws?: number;
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
    const check = noiseCheck(series, options);
    const joint = check.joint as typeof check.joint & { reference?: string; draws?: number };
    const base = {
      id,
      n: check.n,
      statistic: joint.q,
      df: joint.df,
      p: joint.p,
      reference: joint.reference ?? "chi-square",
      verdict: check.verdict.word,
      reason: check.verdict.reason,
      alpha,
      test,
    };
    return joint.draws === undefined ? base : { ...base, draws: joint.draws };
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    return {
      id,
      n: series.count,
      statistic: null,
      df: null,
      p: null,
      reference: null,
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
  const qValues = benjaminiHochberg(sorted.map((r) => r.p ?? NaN));
  const rows: BatchRow[] = sorted.map((r, i) => ({
    label: r.id,
    n: r.n,
    q: r.statistic ?? NaN,
    df: r.df ?? 0,
    p: r.p ?? NaN,
    qValue: qValues[i] as number,
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

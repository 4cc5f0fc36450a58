/**
 * A batch in parts, for batches that outgrow one machine. Each series' checks depend on that
 * series alone; only the false-discovery step (Benjamini & Hochberg 1995, JRSS B 57:289–300)
 * needs every p-value. So a batch splits into a per-series stage (`seriesResult`, run on any
 * partition of the series, anywhere) and one merge (`mergeSeriesResults`) that applies
 * Benjamini–Hochberg across all the parts — the same q-values, words and counts as the whole
 * batch (`batchCheck`), whatever the split.
 *
 * The merged rows are ordered by id (code-unit order), so the merge does not depend on how the
 * series were split or in which order the parts arrive.
 */
import { askedLags, batchLabel, combineResults, type BatchCheck, type BatchRow } from "./batch";
import { biasCheck } from "./bias";
import { isPValueBound } from "./distributions";
import { EcholotError, invalid, isEcholotError, type RefusedParameter } from "./errors";
import { isRobustReading, robustOptions, type Reading } from "./headline";
import { noiseCheck } from "./lagTable";
import { parseTestKind, resolveAlpha, type LagOptions } from "./options";
import type { Series, TestKind, VerdictWord } from "./types";
import { volatilityCheck } from "./volatility";

/** One series' result, without the cross-series step (one line of `batch --format jsonl`). */
export interface SeriesResult {
  readonly id: string;
  readonly n: number;
  /** The joint test's statistic and df in the reading used (null when not analysed). */
  readonly statistic: number | null;
  readonly df: number | null;
  /** The structure p: the joint test and the largest lag as one test (verdictReference.ts). */
  readonly p: number | null;
  /** Which reference p comes from ("permutation", "chi-square", …; null when not analysed). */
  readonly reference: BatchRow["reference"];
  /** Draws behind p (0 for a χ² tail). */
  readonly draws: number;
  /** p is only an upper bound (no draw reached the statistic, or the 1e-300 floor). */
  readonly pBound: boolean;
  /** The series' own verdict in the reading used, before the false-discovery step. */
  readonly verdict: VerdictWord | null;
  /** The verdict's reason, or why the series could not be analysed. */
  readonly reason: string;
  /** The verdict's finding and note, the reason's two parts ("" when not analysed). */
  readonly finding: string;
  readonly note: string;
  /** Robust when the volatility check fired (headline.ts); null when not analysed. */
  readonly reading: Reading | null;
  /** The reading was switched to robust by the volatility check. */
  readonly switched: boolean;
  /** The plain reading's word (the same as `verdict` unless switched). */
  readonly plainVerdict: VerdictWord | null;
  /** Engle's LM test of the squared deviations over the same K (null when not computed). */
  readonly volatility: { readonly lm: number; readonly df: number; readonly p: number } | null;
  /** The bias check's figures (null when not computed). */
  readonly bias: {
    readonly mean: number;
    readonly se: number;
    readonly t: number;
    readonly p: number;
  } | null;
  /** The level the verdict was judged at: every part of one batch must share it. */
  readonly alpha: number;
  /** The joint test chosen (the robust reading's own test is used where `switched`). */
  readonly test: TestKind;
  /** The argument `reason` refuses, when the series was not analysed because of one. */
  readonly refused?: RefusedParameter;
}

/** The series' result and, when it could not be analysed, the refusal itself. */
export function analyseSeries(
  series: Series,
  index: number,
  options: LagOptions = {},
): { result: SeriesResult; refusal: EcholotError | null } {
  const id = batchLabel(series, index);
  const alpha = resolveAlpha(options.alpha);
  const test = parseTestKind(options.testKind);
  try {
    const plain = noiseCheck(series, options);
    const volatility = sideFigures(() => {
      const v = volatilityCheck(series, { lags: plain.maxLag, alpha });
      return { lm: v.lm, df: v.df, p: v.p };
    });
    const bias = sideFigures(() => {
      const b = biasCheck(series, { alpha });
      return { mean: b.mean, se: b.se, t: b.t, p: b.p };
    });
    const switched = volatility !== null && volatility.p < alpha && !isRobustReading(plain);
    // The p of the structure rule in the reading the series' own headline uses (headline.ts):
    // the joint test and the largest lag as one test (verdictReference.ts).
    const used = switched ? noiseCheck(series, robustOptions(options)) : plain;
    const exact = used.levels.structureP;
    const result: SeriesResult = {
      id,
      n: used.n,
      statistic: used.joint.q,
      df: used.joint.df,
      p: exact.p,
      reference: exact.reference,
      draws: exact.draws,
      pBound: exact.bound || isPValueBound(exact.p),
      verdict: used.verdict.word,
      reason: used.verdict.reason,
      finding: used.verdict.finding,
      note: used.verdict.note,
      reading: isRobustReading(used) ? "robust" : "plain",
      switched,
      plainVerdict: plain.verdict.word,
      volatility,
      bias,
      alpha,
      test,
    };
    return { result, refusal: null };
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    const result: SeriesResult = {
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
      finding: "",
      note: "",
      reading: null,
      switched: false,
      plainVerdict: null,
      volatility: null,
      bias: null,
      alpha,
      test,
      ...(error.parameter === undefined ? {} : { refused: error.parameter }),
    };
    return { result, refusal: error };
  }
}

/** The checks of one series as a batch part's line; `index` names an unlabelled series. */
export function seriesResult(
  series: Series,
  index: number,
  options: LagOptions = {},
): SeriesResult {
  return analyseSeries(series, index, options).result;
}

/** A side check's figures, or null when the series cannot support it (too short, constant). */
function sideFigures<T>(compute: () => T): T | null {
  try {
    return compute();
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    return null;
  }
}

/**
 * The cross-series step over the results of every part: Benjamini–Hochberg q-values across all
 * series with a p-value, the words and the counts, as `batchCheck` gives them.
 */
export function mergeSeriesResults(results: readonly SeriesResult[]): BatchCheck {
  if (results.length === 0) invalid("there are no series results to merge");
  const first = results[0] as SeriesResult;
  const ids = new Set<string>();
  for (const r of results) {
    if (r.alpha !== first.alpha) {
      invalid(
        `the parts were checked at different levels (alpha ${first.alpha} and ${r.alpha}): run every part with the same --alpha`,
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
  // A part's lines do not record the lags and season asked for.
  return combineResults(sorted, {
    alpha: first.alpha,
    testKind: first.test,
    maxLag: null,
    season: null,
  });
}

/**
 * The whole batch from its series' results in the order given (the same figures as `batchCheck`
 * on the same series, row for row): the step that runs once, on one thread, after the per-series
 * stage ran anywhere (the CLI's worker threads). As `batchCheck`, it needs two series at least,
 * and when no series could be analysed it refuses with the first one's reason. `options` are the
 * ones the results were computed with: the result records the lags and season asked for (alpha
 * and the joint test come from the results themselves).
 */
export function batchOfResults(
  results: readonly SeriesResult[],
  options: LagOptions = {},
): BatchCheck {
  if (results.length < 2) {
    invalid(
      `a batch check needs at least 2 series (one per column); got ${results.length}: for a single series use the noise check`,
    );
  }
  const first = results[0] as SeriesResult;
  if (results.every((r) => r.verdict === null)) {
    throw new EcholotError("invalid", first.reason, first.refused);
  }
  return combineResults(results, {
    alpha: first.alpha,
    testKind: first.test,
    ...askedLags(options),
  });
}

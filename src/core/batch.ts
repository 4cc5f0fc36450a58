/**
 * The batch check: one noise check per series (its verdict and the p of its structure rule — the
 * joint test and the largest lag as one test, exact by permutation for ordinary lengths:
 * verdictReference.ts), and
 * Benjamini–Hochberg q-values across the series (Benjamini & Hochberg 1995, JRSS B 57:289–300;
 * multiplicity.ts), so that an auditor with 200 items sees which few to look at without the
 * five-percent false alarms of 200 separate tests.
 *
 * - `flaggedRaw`: series whose structure p is below alpha (what 200 separate checks would flag;
 *   among pure-noise series about alpha of them: `expectedRawFlags`, falseAlarms.ts);
 * - `flaggedFdr`: series whose q-value is at most alpha (the BH step-up rule), which keeps the
 *   expected share of false flags among the flagged at most alpha for independent series.
 * Each series also gets the volatility check (its joint p then comes from the robust reading,
 * headline.ts) and the bias check, whose p-values get their own Benjamini–Hochberg step; the word
 * shown per series respects both steps (batchHeadline.ts).
 * The result carries the options its series share as resolved (alpha, the joint test, the lags and
 * season asked for), so a view reads them from it rather than from the request.
 * A series that cannot be analysed (too few values, constant) keeps its row with the reason and
 * NaN figures, and stays out of the family of p-values; when no series can be analysed, the first
 * refusal is thrown instead. Cost per series: one noise check (the lag table's verdict, without
 * its per-lag columns), a volatility and a bias check, and a second noise check where the
 * volatility check fires.
 */
import { invalid } from "./errors";
import { analyseSeries, type SeriesResult } from "./batchParts";
import { batchRowHeadline } from "./batchHeadline";
import type { Headline, Reading } from "./headline";
import { expectedFalseFlags } from "./falseAlarms";
import { benjaminiHochberg } from "./multiplicity";
import { parseTestKind, resolveAlpha, type LagOptions } from "./options";
import { seriesName } from "./seriesName";
import type { Series, TestKind, VerdictWord } from "./types";
import type { ReferencedP } from "./verdictReference";

export interface BatchRow {
  readonly label: string;
  readonly n: number;
  /** Joint-test statistic Q, df and p (NaN when the series could not be analysed). */
  readonly q: number;
  readonly df: number;
  /**
   * The structure p in the reading used: the joint test and the largest lag as one test, the p
   * the false-discovery step uses (verdictReference.ts).
   */
  readonly p: number;
  /** Where p comes from and how many draws are behind it (null when not analysed). */
  readonly reference: ReferencedP["reference"] | null;
  readonly draws: number;
  /** p is only an upper bound (no draw reached the statistic, or the 1e-300 floor). */
  readonly pBound: boolean;
  /** Benjamini–Hochberg q-value across the series analysed. */
  readonly qValue: number;
  /** The q-value rests on a p that is only a bound, so it is itself an upper bound. */
  readonly qValueBound: boolean;
  /** The series' own verdict (before the false-discovery step); null when not analysed. */
  readonly verdict: VerdictWord | null;
  /** The verdict's reason, or why the series could not be analysed. */
  readonly reason: string;
  /** Robust when the volatility check fired; null when not analysed. */
  readonly reading: Reading | null;
  /** Engle's LM p of the squared deviations (NaN when not computed). */
  readonly volatilityP: number;
  /** The mean and its bias-check p (NaN when not computed), and the bias q-value. */
  readonly mean: number;
  readonly biasP: number;
  readonly biasQValue: number;
  /** Kept by the false-discovery step on the joint p: q-value ≤ alpha (and not short). */
  readonly kept: boolean;
  /** The headline across the batch (batchHeadline.ts); null when not analysed. */
  readonly headline: Headline | null;
}

/** The options every series of a batch shares, as resolved. */
export interface BatchSettings {
  readonly alpha: number;
  /** The joint test chosen (a series switched to the robust reading uses the robust test). */
  readonly testKind: TestKind;
  /** The lags asked for; null: each series' default (it depends on n), or not recorded (a merge of parts). */
  readonly maxLag: number | null;
  /** The season asked for; null: none, or not recorded (a merge of parts). */
  readonly season: number | null;
}

export interface BatchCheck extends BatchSettings {
  /** One row per series, in the order given. */
  readonly rows: readonly BatchRow[];
  /** Series with p < alpha. */
  readonly flaggedRaw: number;
  /** Series with q-value ≤ alpha. */
  readonly flaggedFdr: number;
  /** Series with a p-value (the BH family). */
  readonly analysed: number;
  /** Raw flags expected by chance if every series analysed were noise: analysed·α (falseAlarms.ts). */
  readonly expectedRawFlags: number;
  /** Series whose bias p < alpha, and whose bias q-value ≤ alpha. */
  readonly biasFlaggedRaw: number;
  readonly biasFlaggedFdr: number;
}

/** A series' name among many: its label, or "series i" (counting from 1) when it has none. */
export function batchLabel(series: Series, index: number): string {
  return seriesName(series.label, "cell", { item: index });
}

export function batchCheck(seriesList: readonly Series[], options: LagOptions = {}): BatchCheck {
  if (seriesList.length < 2) {
    invalid(
      `a batch check needs at least 2 series (one per column); got ${seriesList.length}: for a single series use the noise check`,
    );
  }
  const alpha = resolveAlpha(options.alpha);
  const testKind = parseTestKind(options.testKind);
  let firstRefusal: unknown;
  const results = seriesList.map((series, index) => {
    const { result, refusal } = analyseSeries(series, index, options);
    if (refusal !== null) firstRefusal ??= refusal;
    return result;
  });
  // When no series at all can be analysed the options themselves are at fault: say so once.
  if (results.every((r) => r.verdict === null)) throw firstRefusal;
  return combineResults(results, { alpha, testKind, ...askedLags(options) });
}

/** The lags and season as asked for, null when not given (each series then resolves its own). */
export function askedLags(options: LagOptions): Pick<BatchSettings, "maxLag" | "season"> {
  return { maxLag: options.maxLag ?? null, season: options.season ?? null };
}

/**
 * The cross-series step, shared by the whole batch and the merge of its parts: Benjamini–Hochberg
 * q-values of the joint p and of the bias p, then each row's headline, in the order given.
 */
export function combineResults(
  results: readonly SeriesResult[],
  settings: BatchSettings,
): BatchCheck {
  const { alpha } = settings;
  const pOf = (r: SeriesResult) => r.p ?? NaN;
  const biasPOf = (r: SeriesResult) => r.bias?.p ?? NaN;
  const qValues = benjaminiHochberg(results.map(pOf));
  const biasQValues = benjaminiHochberg(results.map(biasPOf));
  const qBounds = boundedQValues(results.map((r) => ({ p: pOf(r), pBound: r.pBound })));
  const analysed = results.filter((r) => r.p !== null).length;
  const rows: BatchRow[] = results.map((r, i) => {
    const qValue = qValues[i] as number;
    const biasQValue = biasQValues[i] as number;
    const { kept, headline } = batchRowHeadline(r, { qValue, biasQValue, alpha, analysed });
    return {
      label: r.id,
      n: r.n,
      q: r.statistic ?? NaN,
      df: r.df ?? 0,
      p: pOf(r),
      reference: r.reference,
      draws: r.draws,
      pBound: r.pBound,
      qValue,
      qValueBound: qBounds[i] as boolean,
      verdict: r.verdict,
      reason: r.reason,
      reading: r.reading,
      volatilityP: r.volatility?.p ?? NaN,
      mean: r.bias?.mean ?? NaN,
      biasP: biasPOf(r),
      biasQValue,
      kept,
      headline,
    };
  });
  let flaggedRaw = 0;
  let flaggedFdr = 0;
  let biasFlaggedRaw = 0;
  let biasFlaggedFdr = 0;
  for (const row of rows) {
    if (row.p < alpha) flaggedRaw++;
    if (row.qValue <= alpha) flaggedFdr++;
    if (row.biasP < alpha) biasFlaggedRaw++;
    if (row.biasQValue <= alpha) biasFlaggedFdr++;
  }
  return {
    alpha,
    testKind: settings.testKind,
    maxLag: settings.maxLag,
    season: settings.season,
    rows,
    flaggedRaw,
    flaggedFdr,
    analysed,
    expectedRawFlags: expectedFalseFlags(analysed, alpha),
    biasFlaggedRaw,
    biasFlaggedFdr,
  };
}

/**
 * q_i = min over p_j ≥ p_i of m·p_j/rank_j, so q_i is only an upper bound when some p_j ≥ p_i
 * in that minimum is a bound: that is, when p_i is at most the largest bounded p.
 */
export function boundedQValues(rows: readonly { p: number; pBound: boolean }[]): boolean[] {
  let largestBound = -Infinity;
  for (const row of rows) if (row.pBound && row.p > largestBound) largestBound = row.p;
  return rows.map((row) => !Number.isNaN(row.p) && row.p <= largestBound);
}

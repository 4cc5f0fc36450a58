/**
 * The batch check: one noise check per series (its verdict and the joint test's p as the verdict
 * uses it: exact, by permutation, for ordinary lengths — verdictReference.ts), and
 * Benjamini–Hochberg q-values across the series (Benjamini & Hochberg 1995, JRSS B 57:289–300;
 * multiplicity.ts), so that an auditor with 200 items sees which few to look at without the
 * five-percent false alarms of 200 separate tests.
 *
 * - `flaggedRaw`: series whose joint-test p is below alpha (what 200 separate checks would flag;
 *   among pure-noise series about alpha of them);
 * - `flaggedFdr`: series whose q-value is at most alpha (the BH step-up rule), which keeps the
 *   expected share of false flags among the flagged at most alpha for independent series.
 * A series that cannot be analysed (too few values, constant) keeps its row with the reason and
 * NaN figures, and stays out of the family of p-values; when no series can be analysed, the first
 * refusal is thrown instead. Cost: one noise check (the lag table's verdict, without its
 * per-lag columns) per series.
 */
import { invalid, isEcholotError } from "./errors";
import { noiseCheck } from "./lagTable";
import { benjaminiHochberg } from "./multiplicity";
import { resolveAlpha, type LagOptions } from "./options";
import type { Series, VerdictWord } from "./types";
import { isPValueBound } from "./distributions";
import type { ReferencedP } from "./verdictReference";

export interface BatchRow {
  readonly label: string;
  readonly n: number;
  /** Joint-test statistic Q, df and p (NaN when the series could not be analysed). */
  readonly q: number;
  readonly df: number;
  /** The joint test's p as the verdict uses it (permutation for ordinary lengths; χ² beyond). */
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
  /** The noise check's verdict; null when the series could not be analysed. */
  readonly verdict: VerdictWord | null;
  /** The verdict's reason, or why the series could not be analysed. */
  readonly reason: string;
}

export interface BatchCheck {
  readonly alpha: number;
  /** One row per series, in the order given. */
  readonly rows: readonly BatchRow[];
  /** Series with p < alpha. */
  readonly flaggedRaw: number;
  /** Series with q-value ≤ alpha. */
  readonly flaggedFdr: number;
  /** Series with a p-value (the BH family). */
  readonly analysed: number;
}

/** A series' name among many: its label, or "series i" (counting from 1) when it has none. */
export function batchLabel(series: Series, index: number): string {
  return series.label === "" ? `series ${index + 1}` : series.label;
}

export function batchCheck(seriesList: readonly Series[], options: LagOptions = {}): BatchCheck {
  if (seriesList.length < 2) {
    invalid(
      `a batch check needs at least 2 series (one per column); got ${seriesList.length}: for a single series use the noise check`,
    );
  }
  const alpha = resolveAlpha(options.alpha);
  let firstRefusal: unknown;
  const partial = seriesList.map((series, index) => {
    const label = batchLabel(series, index);
    try {
      const table = noiseCheck(series, options);
      const { q, df } = table.joint;
      const exact = table.levels.jointP;
      return {
        label,
        n: table.n,
        q,
        df,
        p: exact.p,
        reference: exact.reference,
        draws: exact.draws,
        pBound: exact.bound || isPValueBound(exact.p),
        verdict: table.verdict.word,
        reason: table.verdict.reason,
      };
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      firstRefusal ??= error;
      return {
        label,
        n: series.count,
        q: NaN,
        df: 0,
        p: NaN,
        reference: null,
        draws: 0,
        pBound: false,
        verdict: null,
        reason: error.message,
      };
    }
  });
  // When no series at all can be analysed the options themselves are at fault: say so once.
  if (partial.every((row) => row.verdict === null)) throw firstRefusal;
  const qValues = benjaminiHochberg(partial.map((row) => row.p));
  const qBounds = boundedQValues(partial);
  const rows: BatchRow[] = partial.map((row, i) => ({
    ...row,
    qValue: qValues[i] as number,
    qValueBound: qBounds[i] as boolean,
  }));
  return {
    alpha,
    rows,
    flaggedRaw: rows.filter((row) => row.p < alpha).length,
    flaggedFdr: rows.filter((row) => row.qValue <= alpha).length,
    analysed: rows.filter((row) => !Number.isNaN(row.p)).length,
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

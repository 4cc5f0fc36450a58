/**
 * The headline of a series among many (a batch or a forecast audit). With 150 items, about
 * alpha·150 of pure-noise items pass any one-series rule by chance, so in a batch the word obeys
 * the false-discovery step (Benjamini & Hochberg 1995, JRSS B 57:289–300; multiplicity.ts):
 *
 * - `structure` only when the item is kept: the q-value of its structure p (the joint test and the
 *   largest lag as one test, verdictReference.ts) is at most alpha, and the series is long
 *   enough to judge. Kept items are a list in which the expected share of false
 *   flags is at most alpha.
 * - A finding the step does not keep — the series' own verdict is `structure` or `watch`, but its
 *   q-value is above alpha — is at most `watch`, and the finding says so.
 * - Otherwise the series' own word (`clear`, or `short`).
 * - Biased only when the bias p-values' own false-discovery step keeps it; a raw-only bias is
 *   named as such without the flag.
 * - The reading (plain or robust) is the series' own (headline.ts): it depends on that series
 *   alone, so sharded batches stay exact.
 * The ranking that agrees with these words is in batchRanking.ts.
 */
import type { SeriesResult } from "./batchParts";
import { formatLevel, formatNumber, pPhrase } from "./format";
import { biasSentence, composeHeadline, type Headline } from "./headline";
import { TEST_NAMES } from "./portmanteau";
import type { VerdictWord } from "./types";

export interface BatchStep {
  readonly qValue: number;
  readonly biasQValue: number;
  readonly alpha: number;
  /** Series in the family (with a p-value). */
  readonly analysed: number;
}

/** "q = 0.012" or "q < 0.001" (the q-value phrased like a p-value). */
export function qPhrase(q: number): string {
  return pPhrase(q).replace(/^p/, "q");
}

/** The false-discovery note every batch headline carries. */
export function batchNote(alpha: number, analysed: number): string {
  return `Across ${analysed} series the false-discovery step keeps lag structure and bias separately, each so that on average at most ${formatLevel(alpha)} of the items it keeps are false flags.`;
}

/**
 * The word and headline of one series of a batch (null headline when the series could not be
 * analysed). `kept`: the joint test survives the false-discovery step.
 */
export function batchRowHeadline(
  result: SeriesResult,
  step: BatchStep,
): { kept: boolean; headline: Headline | null } {
  const own = result.verdict;
  if (own === null || result.reading === null || result.plainVerdict === null) {
    return { kept: false, headline: null };
  }
  const { alpha, qValue, biasQValue } = step;
  const kept = own !== "short" && qValue <= alpha;
  const testName = TEST_NAMES[result.reading === "robust" ? "robust" : result.test];
  const jointFigures = `structure ${pPhrase(result.p ?? NaN)} from ${testName} and the largest lag together, ${qPhrase(qValue)}`;
  const { word, lagFinding } = lagWord(own, kept, result.finding, jointFigures, step);
  const bias = result.bias;
  const biased = bias !== null && biasQValue <= alpha;
  const biasFinding =
    bias === null
      ? null
      : biased
        ? biasSentence(bias, `${qPhrase(biasQValue)}: kept by the false-discovery step on bias`)
        : bias.p < alpha
          ? `On its own the mean ${formatNumber(bias.mean, 4)} would count as bias (${pPhrase(bias.p)}), but across ${step.analysed} series the false-discovery step does not keep it (${qPhrase(biasQValue)}).`
          : null;
  const volatility = result.volatility;
  const headline = composeHeadline({
    word,
    lagFinding,
    note: batchNote(alpha, step.analysed),
    reading: result.reading,
    switched: result.switched,
    plainWord: result.plainVerdict,
    volatility: volatility === null ? null : { ...volatility, flagged: volatility.p < alpha },
    biased,
    biasFinding,
  });
  return { kept, headline };
}

/** The lag word after the false-discovery step, and the sentence behind it. */
export function lagWord(
  own: VerdictWord,
  kept: boolean,
  ownFinding: string,
  jointFigures: string,
  step: BatchStep,
): { word: VerdictWord; lagFinding: string } {
  const { alpha, analysed } = step;
  if (kept) {
    const detail = own === "structure" ? ` ${ownFinding}` : "";
    return {
      word: "structure",
      lagFinding: `Kept by the false-discovery step across ${analysed} series (${jointFigures} ≤ ${alpha}).${detail}`,
    };
  }
  if (own === "structure" || own === "watch") {
    return {
      word: "watch",
      lagFinding: `On its own this series would be ${own}: ${ownFinding} But across ${analysed} series the false-discovery step does not keep it (${jointFigures}), so it is at most watch.`,
    };
  }
  return { word: own, lagFinding: ownFinding };
}

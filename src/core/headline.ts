/**
 * The headline of one series: one word and one finding that agree with every check that fired.
 * The rules (DESIGN.md, "The verdict"):
 *
 * - Volatility first. When Engle's LM test (volatility.ts) rejects constant volatility at alpha,
 *   plain bands and the plain joint test are too narrow — they over-alarm on uncorrelated returns
 *   whose size clusters — so the word comes from the robust reading: robust bands and the robust
 *   joint test (bands.ts, portmanteau.ts), calibrated like the plain ones (verdictReference.ts).
 *   The plain reading stays one line away (`plain`), and the finding says which reading the word
 *   is. When the caller chose robust bands and the robust test already, there is one reading.
 * - Bias is carried, never hidden. When the bias check (bias.ts) rejects a zero mean at alpha,
 *   the headline says "biased" beside the word: a lag pattern cannot show a shifted mean, so a
 *   `clear` series can be biased.
 * - The word is the verdict of the reading used (verdict.ts), at its calibrated level: `structure`
 *   fires for alpha of pure noise. The bias finding is a second test at alpha, stated as such.
 *
 * In a batch or an audit the same parts are decided across the series (batchHeadline.ts).
 */
import { biasCheck, type BiasCheck } from "./bias";
import { isEcholotError } from "./errors";
import { formatLevel, formatNumber, pPhrase } from "./format";
import { noiseCheck, type NoiseCheck } from "./lagTable";
import type { LagOptions } from "./options";
import type { VerdictWord } from "./types";
import { volatilityCheck, type VolatilityCheck } from "./volatility";

/** Which options the headline's word comes from. */
export type Reading = "plain" | "robust";

export interface Headline {
  /** The lag-structure word of the reading used. */
  readonly word: VerdictWord;
  readonly reading: Reading;
  /** The reading was switched to robust because the volatility check fired. */
  readonly switched: boolean;
  /** The bias check fired (in a batch: kept by the false-discovery step on the bias p-values). */
  readonly biased: boolean;
  /** The volatility check fired. */
  readonly volatile: boolean;
  /** The word with what qualifies it, for a badge or a table cell: "clear, biased". */
  readonly title: string;
  /** What was found, in order of weight: the lag finding, then bias, then volatility. */
  readonly finding: string;
  /** How the levels were set and the false alarms to expect. */
  readonly note: string;
  /** Every finding that fired, one sentence each (what "Copy summary" must carry). */
  readonly findings: readonly string[];
}

/** One series' headline and every check it rests on. */
export interface SeriesHeadline {
  readonly headline: Headline;
  /** The noise check with the caller's options. */
  readonly plain: NoiseCheck;
  /** The robust reading, when the volatility check switched to it; otherwise null. */
  readonly robust: NoiseCheck | null;
  /** The check, or why the series cannot support it. */
  readonly volatility: VolatilityCheck | string;
  readonly bias: BiasCheck | string;
}

/** Robust bands and the robust joint test: the reading that allows for volatility clustering. */
export function robustOptions(options: LagOptions): LagOptions {
  return { ...options, bandKind: "robust", testKind: "robust" };
}

/** Whether the options already are the robust reading. */
export function isRobustReading(options: { bandKind: string; testKind: string }): boolean {
  return options.bandKind === "robust" && options.testKind === "robust";
}

/** The result, or the refusal's message when the data cannot support the check. */
function checkOrReason<T>(compute: () => T): T | string {
  try {
    return compute();
  } catch (error) {
    if (!isEcholotError(error)) throw error;
    return error.message;
  }
}

/**
 * The headline of one series: the noise check with the caller's options, the volatility check
 * over the same K at the same alpha, the robust reading when that fires, and the bias check.
 * Throws what `noiseCheck` throws (the options or the series refused).
 */
export function seriesHeadline(
  series: Parameters<typeof noiseCheck>[0],
  options: LagOptions = {},
): SeriesHeadline {
  const plain = noiseCheck(series, options);
  const volatility = checkOrReason(() =>
    volatilityCheck(series, { lags: plain.maxLag, alpha: plain.alpha }),
  );
  const bias = checkOrReason(() => biasCheck(series, { alpha: plain.alpha }));
  const robust = needsRobustReading(plain, volatility)
    ? noiseCheck(series, robustOptions(options))
    : null;
  return { headline: headlineOf(plain, robust, volatility, bias), plain, robust, volatility, bias };
}

/** The volatility check fired and the caller's options are not the robust reading already. */
export function needsRobustReading(
  plain: { bandKind: string; testKind: string },
  volatility: VolatilityCheck | string,
): boolean {
  return typeof volatility !== "string" && volatility.flagged && !isRobustReading(plain);
}

/** A check whose verdict can give the headline's word (a noise check or a lag table). */
export interface ReadingCheck {
  readonly verdict: { readonly word: VerdictWord; readonly finding: string; readonly note: string };
  readonly bandKind: string;
  readonly testKind: string;
}

/**
 * The headline of one series from checks already made: `robust` is the robust reading when
 * `needsRobustReading` asked for it (otherwise null).
 */
export function headlineOf(
  plain: ReadingCheck,
  robust: ReadingCheck | null,
  volatility: VolatilityCheck | string,
  bias: BiasCheck | string,
): Headline {
  const used = robust ?? plain;
  const biased = typeof bias !== "string" && bias.flagged;
  return composeHeadline({
    word: used.verdict.word,
    lagFinding: used.verdict.finding,
    note: used.verdict.note,
    reading: isRobustReading(used) ? "robust" : "plain",
    switched: robust !== null,
    plainWord: plain.verdict.word,
    volatility: typeof volatility === "string" ? null : volatility,
    biased,
    biasFinding:
      typeof bias !== "string" && biased
        ? biasSentence(bias, `judged at ${formatLevel(bias.alpha)} on its own`)
        : null,
  });
}

/** What the volatility sentence needs (a batch line carries no more). */
export type VolatilityFigures = Pick<VolatilityCheck, "lm" | "df" | "p" | "flagged">;
/** What the bias sentence needs. */
export type BiasFigures = Pick<BiasCheck, "mean" | "se" | "t" | "p">;

export interface HeadlineParts {
  /** The word shown: the reading's verdict, or a batch's word after its false-discovery step. */
  readonly word: VerdictWord;
  /** The sentence behind the word. */
  readonly lagFinding: string;
  /** How the levels were set and the false alarms to expect. */
  readonly note: string;
  readonly reading: Reading;
  readonly switched: boolean;
  /** The plain reading's word, named when the reading was switched. */
  readonly plainWord: VerdictWord;
  readonly volatility: VolatilityFigures | null;
  /** Whether the bias counts as found (the check's own flag, or the false-discovery step's). */
  readonly biased: boolean;
  /** The bias sentence when biased; a batch may also word a raw-only bias here. */
  readonly biasFinding: string | null;
}

/** The headline from its parts: the only place the words are put together. */
export function composeHeadline(parts: HeadlineParts): Headline {
  const { word, switched, volatility, biased } = parts;
  const volatile = volatility?.flagged === true;
  const findings: string[] = [parts.lagFinding];
  if (parts.biasFinding !== null) findings.push(parts.biasFinding);
  if (volatile && volatility !== null) {
    findings.push(volatilitySentence(volatility, switched, parts.plainWord, word));
  }
  return {
    word,
    reading: parts.reading,
    switched,
    biased,
    volatile,
    title: headlineTitle(word, biased, switched),
    finding: findings.join(" "),
    note: parts.note,
    findings,
  };
}

/** "structure", "clear, biased", "watch (robust reading), biased". */
export function headlineTitle(word: VerdictWord, biased: boolean, switched: boolean): string {
  return `${word}${switched ? " (robust reading)" : ""}${biased ? ", biased" : ""}`;
}

/**
 * The bias finding: the mean is off zero, which no lag pattern shows. `judged` says at which
 * level ("judged at 5% on its own", or a batch's q-value); `method` names the standard error and
 * the p's reference.
 */
export function biasSentence(
  bias: BiasFigures,
  judged: string,
  method = { se: "Newey–West se", reference: "fixed-b" },
): string {
  return `Biased: the mean is ${formatNumber(bias.mean, 4)}, not zero (${method.se} ${formatNumber(bias.se, 3)}, t = ${formatNumber(bias.t, 3)}, ${pPhrase(bias.p)} ${method.reference}; ${judged}): these errors run ${bias.mean > 0 ? "high" : "low"} on average, which the lag figures cannot show.`;
}

function volatilitySentence(
  check: VolatilityFigures,
  switched: boolean,
  plainWord: VerdictWord,
  word: VerdictWord,
): string {
  const figures = `Engle's LM = ${formatNumber(check.lm, 4)}, df ${check.df}, ${pPhrase(check.p)}`;
  const head = `Volatility clusters (${figures}): the size of the deviations follows their recent size, so ordinary standard errors of a model fitted to these data are suspect.`;
  if (!switched) return `${head} The robust bands and robust joint test in use allow for it.`;
  const plain =
    plainWord === word
      ? `the plain reading agrees (${plainWord})`
      : `the plain reading, whose bands are too narrow here, says ${plainWord}`;
  return `${head} So this headline is the robust reading (robust bands, robust joint test); ${plain}.`;
}

/**
 * Number formatting for sentences people read (the verdict reason). Figures in tables and JSON
 * keep full precision; only prose is rounded.
 */
import { isPValueBound } from "./distributions";
import type { ReferencedP } from "./verdictReference";

/**
 * A p-value for prose: "0.42", "0.0054", "3.2e-7", or "< 1e-300" at the floor.
 *
 * @example
 * formatP(0.4213); // → "0.42"
 * formatP(0.00536); // → "0.0054"
 * formatP(3.24e-7); // → "3.2e-7"
 */
export function formatP(p: number): string {
  if (Number.isNaN(p)) return "undefined";
  if (isPValueBound(p)) return "< 1e-300";
  if (p >= 0.001) return String(Number(p.toPrecision(2)));
  return p.toExponential(1);
}

/** A p-value as a clause: "p = 0.012", or "p < 1e-300" at the floor. */
export function pPhrase(p: number): string {
  return isPValueBound(p) ? "p < 1e-300" : `p = ${formatP(p)}`;
}

/** A statistic for prose, to `digits` significant figures, without trailing zeros. */
export function formatNumber(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const magnitude = Math.abs(x);
  if (magnitude >= 1e6 || magnitude < 1e-4) return x.toExponential(digits - 1);
  return String(Number(x.toPrecision(digits)));
}

/** A probability as a percentage for prose: "34%", "5%", "0.3%", "less than 0.1%". */
export function formatPercent(p: number): string {
  const percent = p * 100;
  if (percent >= 99.5 && percent < 100) return "more than 99%";
  if (percent >= 10) return `${Math.round(percent)}%`;
  if (percent >= 1) return `${Number(percent.toPrecision(2))}%`;
  if (percent >= 0.1) return `${Number(percent.toPrecision(1))}%`;
  return "less than 0.1%";
}

/** A significance level as a percentage for prose, to 3 significant figures: 0.05 → "5%". */
export function formatLevel(alpha: number): string {
  return `${Number((alpha * 100).toPrecision(3))}%`;
}

/**
 * Names for a message, quoted, at most `most` of them: `"a", "b", "c"` or
 * `"a", "b", … "j" and 141 more` (a file of 151 columns must not fill the screen).
 */
export function formatNameList(names: readonly string[], most = 10): string {
  const shown = names
    .slice(0, most)
    .map((name) => `"${name}"`)
    .join(", ");
  const rest = names.length - most;
  return rest > 0 ? `${shown} and ${rest} more` : shown;
}

/**
 * "lag 7", "lags 7, 19", "lags 1, 2, 3 and 9 more".
 *
 * @example
 * formatLagList([7]); // → "lag 7"
 * formatLagList([7, 19]); // → "lags 7, 19"
 * formatLagList([1, 2, 3, 4, 5], 3); // → "lags 1, 2, 3 and 2 more"
 */
export function formatLagList(lags: readonly number[], most = 8): string {
  if (lags.length === 1) return `lag ${lags[0]}`;
  const shown = lags.slice(0, most).join(", ");
  const rest = lags.length - most;
  return `lags ${shown}${rest > 0 ? ` and ${rest} more` : ""}`;
}

const REFERENCE_WORDS: Readonly<Record<ReferencedP["reference"], string>> = {
  permutation: "permutation",
  "chi-square": "χ²",
  "monte-carlo": "Monte Carlo",
  "normal-limit": "the normal limit",
};

/** Where a p-value comes from, for labels: "permutation, 499 draws", "χ²". */
export function pReferenceLabel(rp: ReferencedP): string {
  return rp.draws > 0
    ? `${REFERENCE_WORDS[rp.reference]}, ${rp.draws.toLocaleString("en-US")} draws`
    : REFERENCE_WORDS[rp.reference];
}

/**
 * A p-value with its reference, as a clause without brackets (it often stands inside some):
 * "p = 0.004 by permutation of 499 draws", "p < 5e-5 by permutation of 19,999 draws" when no draw
 * reached the statistic, "p = 0.012 from χ²", "p < 1e-300 from χ²".
 */
export function referencedPPhrase(rp: ReferencedP): string {
  const from =
    rp.draws > 0
      ? `by ${REFERENCE_WORDS[rp.reference]} of ${rp.draws.toLocaleString("en-US")} draws`
      : `from ${REFERENCE_WORDS[rp.reference]}`;
  if (rp.bound) return `p < ${rp.p >= 0.001 ? formatP(rp.p) : rp.p.toExponential(0)} ${from}`;
  return `${pPhrase(rp.p)} ${from}`;
}

/** The text with its first character in upper case, for a phrase or message that opens a sentence. */
export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

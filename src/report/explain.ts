/**
 * The verdict explained, as structured text the pane, the HTML report and the summary all show:
 * the verdict and its reason, the false-alarm note with its numbers, then the cautions that apply
 * — seasonality, gaps, a small sample, volatility clustering, bias — and always the screening
 * caution. Every figure and every decision comes from the core's lag table (its cautions, its
 * joint test at alpha) or the optional extra checks; this file only words them.
 */
import {
  formatLagList,
  formatNumber,
  pPhrase,
  seasonalLags,
  seriesName,
  TEST_NAMES,
  type Headline,
  type LagTable,
  type VerdictWord,
} from "../core";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";

export type ExplanationTopic =
  | "verdict"
  | "false-alarms"
  | "season"
  | "gaps"
  | "small-sample"
  | "volatility"
  | "bias"
  | "screening";

export interface ExplanationItem {
  readonly topic: ExplanationTopic;
  readonly heading: string;
  readonly text: string;
}

export interface FalseAlarmFigures {
  /** Lags tested (with a defined value). */
  readonly tested: number;
  /** Crossings of the one-lag band expected by chance, K·α. */
  readonly expected: number;
  /** Crossings seen. */
  readonly seen: number;
  readonly lags: readonly number[];
  /** Chance that pure noise crosses at least `seen` times (binomial upper tail). */
  readonly chance: number;
}

export interface Explanation {
  readonly word: VerdictWord;
  readonly shape: string;
  readonly colour: string;
  readonly label: string;
  /** The verdict's reason, as the core wrote it: its finding, then its note. */
  readonly reason: string;
  readonly falseAlarm: FalseAlarmFigures;
  readonly items: readonly ExplanationItem[];
}

/** A flagged side check (volatility or bias) worded by its caller, with its own figures. */
export interface SideFinding {
  readonly flagged: boolean;
  readonly text: string;
}

export interface ExplainContext {
  /**
   * The series' headline (core/headline.ts): when given, the first paragraph is its title and
   * findings (lag structure, bias, volatility), and the separate bias and volatility paragraphs
   * are left out when the headline already carries them.
   */
  readonly headline?: Headline;
  /** The lag table of the squared deviations (testKind "squares"), for the volatility caution. */
  readonly squares?: LagTable;
  /** Extra volatility finding (e.g. Engle's LM test), shown when it flags. */
  readonly volatility?: SideFinding;
  /** Bias finding (mean error with a HAC standard error), shown when it flags. */
  readonly bias?: SideFinding;
}

export function explainVerdict(table: LagTable, context: ExplainContext = {}): Explanation {
  const { verdict, falseAlarm } = table;
  const badge = BADGES[verdict.word];
  const items: ExplanationItem[] = [];

  const headline = context.headline;
  items.push(
    headline === undefined
      ? { topic: "verdict", heading: `${badge.shape} ${badge.word}`, text: verdict.finding }
      : { topic: "verdict", heading: `${badge.shape} ${headline.title}`, text: headline.finding },
  );
  items.push({ topic: "false-alarms", heading: "False alarms", text: falseAlarmText(table) });

  const season = seasonText(table);
  if (season !== undefined) items.push({ topic: "season", heading: "Season", text: season });
  if (table.gaps > 0) items.push({ topic: "gaps", heading: "Gaps", text: gapsText(table) });
  const small = smallSampleText(table);
  if (small !== undefined)
    items.push({ topic: "small-sample", heading: "Sample size", text: small });
  const volatility = headline?.volatile === true ? undefined : volatilityText(table, context);
  if (volatility !== undefined) {
    items.push({ topic: "volatility", heading: "Volatility", text: volatility });
  }
  if (context.bias?.flagged === true && headline?.biased !== true) {
    items.push({ topic: "bias", heading: "Bias", text: context.bias.text });
  }
  items.push({ topic: "screening", heading: "A screen, not a decision", text: SCREENING_CAUTION });

  return {
    word: verdict.word,
    shape: badge.shape,
    colour: badge.colour,
    label: table.label,
    reason: verdict.reason,
    falseAlarm: {
      tested: falseAlarm.tested,
      expected: falseAlarm.expected,
      seen: falseAlarm.crossings,
      lags: falseAlarm.crossingLags,
      chance: falseAlarm.chance,
    },
    items,
  };
}

/** The verdict's own note (the false-alarm sentence, after any untested seasonal lag), then the corridors. */
function falseAlarmText(table: LagTable): string {
  const outer = table.rows.filter((r) => r.outer).map((r) => r.lag);
  const corridor = `In the chart the inner corridor (±${formatNumber(table.innerLevel, 3)}) judges one lag on its own; the outer one (±${formatNumber(table.outerLevel, 3)}) holds for all ${table.maxLag} lags together`;
  const outerSentence =
    outer.length === 0
      ? "no lag lies beyond it."
      : `${formatLagList(outer)} ${outer.length === 1 ? "lies" : "lie"} beyond it and ${outer.length === 1 ? "survives" : "survive"} the multiple-lag correction.`;
  return `${table.verdict.note} ${corridor}: ${outerSentence}`;
}

function seasonText(table: LagTable): string | undefined {
  if (table.season === null) {
    if (table.subject === "squares") return undefined;
    return "No season set. If the data have a cycle (12 for monthly, 13 or 52 for weekly, 7 for daily), set it so lags m and 2m are watched.";
  }
  const m = table.season;
  const watched = seasonalLags(m, table.maxLag);
  const parts = [`Season m = ${m}: lags ${m} and ${2 * m} are watched.`];
  if (watched.length < 2) {
    parts.push(
      `Lag ${watched.length === 0 ? m : 2 * m} is beyond the ${table.maxLag} lags tested.`,
    );
  }
  for (const lag of watched) {
    const row = table.rows[lag - 1];
    if (row === undefined) continue;
    parts.push(
      `Lag ${lag} (r = ${formatNumber(row.correlation, 3)}, z = ${formatNumber(row.z, 3)}) ${row.outer ? "lies beyond the all-lags corridor" : row.crossesBand ? "crosses its band" : "stays inside its band"}.`,
    );
  }
  return parts.join(" ");
}

function gapsText(table: LagTable): string {
  const gaps = `${table.gaps} gap${table.gaps === 1 ? "" : "s"}`;
  return `${gaps} inside the series (${table.n} values over ${table.length} positions) are kept in place, so lags stay positions in time; each lag uses only the pairs where both values exist.`;
}

function smallSampleText(table: LagTable): string | undefined {
  const parts: string[] = [];
  const { smallSample, manyLags, manyLagsLimit } = table.cautions;
  if (smallSample) {
    parts.push(
      `Only ${table.n} values: the bands are wide, so a clear verdict has little power to find weak structure.`,
    );
  }
  if (manyLags) {
    parts.push(
      `${table.maxLag} lags is more than n/5 = ${formatNumber(manyLagsLimit, 3)}: the joint test over-rejects a little with many lags and few values.`,
    );
  }
  return parts.length === 0 ? undefined : parts.join(" ");
}

function volatilityText(table: LagTable, context: ExplainContext): string | undefined {
  const robust = table.bandKind === "robust";
  const allowed = "The robust bands in use allow for it.";
  // The volatility check's sentence already carries McLeod–Li; the squares table is the fallback.
  if (context.volatility?.flagged === true) {
    return robust ? `${context.volatility.text} ${allowed}` : context.volatility.text;
  }
  const squares = context.squares;
  if (squares === undefined || !squares.jointBelowAlpha) return undefined;
  const figures = `${TEST_NAMES.squares}, Q = ${formatNumber(squares.joint.q, 4)}, df ${squares.joint.df}, ${pPhrase(squares.joint.p)}`;
  return robust
    ? `The squared deviations are correlated (${figures}): volatility clusters. ${allowed}`
    : `The squared deviations are correlated (${figures}): volatility clusters, so plain bands are too narrow and over-alarm. Choose robust bands${table.testKind === "robust" ? "" : " and the robust joint test"} before trusting this verdict.`;
}

/** The explanation as plain paragraphs: "heading: text", one per line. */
export function explanationText(explanation: Explanation): string {
  return explanation.items.map((item) => `${item.heading}: ${item.text}`).join("\n");
}

/**
 * What "Copy summary" puts on the clipboard: the headline with every finding that fired (or, with
 * no headline, the verdict and its reason), the false-alarm note, and the caution.
 */
export function summaryText(table: LagTable, headline?: Headline): string {
  const badge = BADGES[headline?.word ?? table.verdict.word];
  const name = seriesName(table.label, "heading");
  const options = [
    `${table.maxLag} lags`,
    `alpha ${table.alpha}`,
    `${table.bandKind} bands`,
    TEST_NAMES[table.testKind],
    ...(table.season === null ? [] : [`season ${table.season}`]),
    ...(table.fittedParams > 0 ? [`${table.fittedParams} fitted parameters`] : []),
  ].join(", ");
  return [
    `${name} (n = ${table.n}${table.gaps > 0 ? `, ${table.gaps} gaps` : ""}; ${options}): ${badge.shape} ${headline?.title ?? badge.word}`,
    ...(headline === undefined ? [table.verdict.reason] : [...headline.findings, headline.note]),
    SCREENING_CAUTION,
  ].join("\n");
}

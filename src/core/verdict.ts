/**
 * The verdict: one word and a reason sentence that always carries the false-alarm note.
 *
 * - `short`: fewer than 20 values, or K above n/4 — the figures are still shown;
 * - `structure`: the joint test over K lags rejects at α, or a single lag lies beyond the Šidák
 *   corridor for all K lags, |z_k| > z_{1−a/2} with a = 1 − (1−α)^{1/K};
 * - `watch`: neither, but lag 1 or a seasonal lag (m, 2m) lies beyond its band, or more lags lie
 *   beyond the band than chance explains (binomial upper tail below α);
 * - `clear`: otherwise.
 * The thresholds 20 and n/4 are common practice (no source): below them the χ² reference of the
 * joint tests is poor. The joint test is the one chosen by `testKind` (Ljung–Box by default).
 */
import type { FalseAlarmNote } from "./falseAlarms";
import { formatLagList, formatLevel, formatNumber, formatP, formatPercent } from "./format";
import type { JointTest } from "./portmanteau";
import { TEST_NAMES } from "./portmanteau";
import type { VerdictWord } from "./types";

export const MIN_VALUES_TO_JUDGE = 20;

export interface VerdictLag {
  readonly lag: number;
  readonly correlation: number;
  readonly z: number;
  /** Beyond the inner corridor ±z_{1−α/2} (its own band). */
  readonly beyond: boolean;
  /** Beyond the outer (Šidák) corridor. */
  readonly outer: boolean;
}

export interface VerdictInput {
  readonly n: number;
  readonly maxLag: number;
  readonly alpha: number;
  readonly season: number | null;
  readonly lags: readonly VerdictLag[];
  readonly joint: JointTest;
  readonly falseAlarm: FalseAlarmNote;
  /** "squares" when the lags are those of the squared deviations (volatility clustering). */
  readonly subject?: "series" | "squares";
  /**
   * The first lag judged, h for h-step-ahead forecast errors (default 1): lags below it are
   * expected to be non-zero, so they are shown but neither judged nor counted; lag h then plays
   * the part of lag 1.
   */
  readonly firstLag?: number;
  /** The joint test's name in the reason, when it is not the test kind's own. */
  readonly testName?: string;
}

export interface Verdict {
  readonly word: VerdictWord;
  readonly reason: string;
  /** Which rules fired, for the pane's explanation and the tests. */
  readonly triggers: {
    readonly jointRejects: boolean;
    readonly outerLags: readonly number[];
    readonly lagOne: boolean;
    readonly seasonalLags: readonly number[];
    readonly excessCrossings: boolean;
  };
}

/** The seasonal lags m and 2m that are within 1..K. */
export function seasonalLags(season: number | null, maxLag: number): number[] {
  if (season === null) return [];
  return [season, 2 * season].filter((lag) => lag <= maxLag);
}

/** "24 lags tested at 5%: about 1.2 would cross … ; 2 did (lags 7, 19); pure noise does that 34% of the time." */
export function falseAlarmSentence(note: FalseAlarmNote, alpha: number): string {
  const head = `${note.tested} lag${note.tested === 1 ? "" : "s"} tested at ${formatLevel(alpha)}: about ${formatNumber(note.expected, 2)} would cross the band by chance even for pure noise`;
  if (note.beyond === 0) return `${head}; none did.`;
  return `${head}; ${note.beyond} did (${formatLagList(note.beyondLags)}); pure noise does that ${formatPercent(note.chance)} of the time.`;
}

export function judge(input: VerdictInput): Verdict {
  const { n, maxLag, alpha, joint, falseAlarm, lags } = input;
  const firstLag = input.firstLag ?? 1;
  const seasonal = seasonalLags(input.season, maxLag).filter((lag) => lag >= firstLag);
  const beyondLag = (lag: number) => lags[lag - 1]?.beyond === true;
  const triggers = {
    jointRejects: joint.p < alpha,
    outerLags: lags.filter((l) => l.outer && l.lag >= firstLag).map((l) => l.lag),
    lagOne: beyondLag(firstLag),
    seasonalLags: seasonal.filter(beyondLag),
    excessCrossings: falseAlarm.beyond > 0 && falseAlarm.chance < alpha,
  };
  const note = falseAlarmSentence(falseAlarm, alpha);
  const testName = input.testName ?? TEST_NAMES[joint.test];
  const span = firstLag === 1 ? `${maxLag} lags` : `lags ${firstLag}–${maxLag}`;
  const jointFigures = `Q = ${formatNumber(joint.q, 4)}, df ${joint.df}, p = ${formatP(joint.p)}`;

  if (n < MIN_VALUES_TO_JUDGE) {
    return {
      word: "short",
      reason: `Only ${n} values: a verdict needs at least ${MIN_VALUES_TO_JUDGE}; the figures are shown for reference. ${note}`,
      triggers,
    };
  }
  if (maxLag > n / 4) {
    return {
      word: "short",
      reason: `${maxLag} lags is more than a quarter of the ${n} values, too many to judge; use maxLag ${Math.floor(n / 4)} or fewer. ${note}`,
      triggers,
    };
  }

  const describeLag = (lag: number) => {
    const row = lags[lag - 1];
    return row === undefined
      ? `lag ${lag}`
      : `lag ${lag} (r = ${formatNumber(row.correlation, 3)})`;
  };
  const parts: string[] = [];
  if (triggers.jointRejects || triggers.outerLags.length > 0) {
    if (triggers.jointRejects) {
      const hypothesis =
        input.subject === "squares"
          ? "constant volatility"
          : firstLag === 1
            ? "white noise"
            : `no dependence beyond lag ${firstLag - 1}`;
      parts.push(`${testName} over ${span} rejects ${hypothesis} (${jointFigures}).`);
    }
    if (triggers.outerLags.length > 0) {
      const shown = triggers.outerLags.slice(0, 3).map(describeLag).join(", ");
      const more = triggers.outerLags.length - 3;
      const which = more > 0 ? `${shown} and ${more} more lags` : shown;
      const verb = triggers.outerLags.length === 1 ? "lies" : "lie";
      parts.push(
        `${capitalise(which)} ${verb} beyond the corridor that holds for all ${maxLag} lags together.`,
      );
    }
    return { word: "structure", reason: `${parts.join(" ")} ${note}`, triggers };
  }

  if (triggers.lagOne || triggers.seasonalLags.length > 0 || triggers.excessCrossings) {
    const signs: string[] = [];
    if (triggers.lagOne) signs.push(`${describeLag(firstLag)} crosses its band`);
    for (const lag of triggers.seasonalLags)
      signs.push(`seasonal ${describeLag(lag)} crosses its band`);
    if (triggers.excessCrossings) signs.push("more lags cross the band than chance explains");
    parts.push(
      `${capitalise(signs.join("; "))}, though ${testName} over ${span} does not reject (p = ${formatP(joint.p)}).`,
    );
    return { word: "watch", reason: `${parts.join(" ")} ${note}`, triggers };
  }

  parts.push(
    `No leftover structure found: ${testName} over ${span} gives p = ${formatP(joint.p)}.`,
  );
  if (falseAlarm.beyond === 1) {
    parts.push(
      `${capitalise(describeLag(falseAlarm.beyondLags[0] as number))} crosses its band alone; a lone lag that is neither lag ${firstLag} nor seasonal is weak evidence.`,
    );
  }
  return { word: "clear", reason: `${parts.join(" ")} ${note}`, triggers };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * The verdict: one word and a reason sentence that always carries the false-alarm note.
 *
 * - `short`: fewer than 20 values, or K above n/4 — the figures are still shown;
 * - `structure`: the joint test over K lags rejects, or a single lag lies beyond the outer
 *   corridor — both at one common level a*, chosen so that together they fire with probability
 *   alpha for pure noise (verdictReference.ts);
 * - `watch`: neither, but lag 1 or a seasonal lag (m, 2m) lies beyond the watch line, or more lags
 *   lie beyond the inner corridor than chance explains — one rule at level w*, calibrated the same
 *   way, so that it fires for at most alpha of pure noise;
 * - `clear`: otherwise.
 * The thresholds 20 and n/4 are common practice (no source): below them too few pairs remain per
 * lag for a verdict to mean much. The joint test is the one chosen by `testKind` (Ljung–Box by
 * default). The levels and the joint p come in with the input; this file decides the word and
 * writes the reason.
 */
import type { FalseAlarmNote } from "./falseAlarms";
import { normalQuantile, normalTwoSided } from "./distributions";
import {
  capitalise,
  formatLagList,
  formatLevel,
  formatNumber,
  formatPercent,
  referencedPPhrase,
} from "./format";
import type { JointTest } from "./portmanteau";
import { TEST_NAMES } from "./portmanteau";
import type { VerdictWord } from "./types";
import type { VerdictLevels } from "./verdictReference";

export const MIN_VALUES_TO_JUDGE = 20;

export interface VerdictLag {
  readonly lag: number;
  readonly correlation: number;
  readonly z: number;
  /** Beyond the inner corridor ±z_{1−α/2} (its own band). */
  readonly crossesBand: boolean;
  /** Beyond the outer corridor (the all-lags corridor at the verdict's common level). */
  readonly outer: boolean;
}

export interface VerdictInput {
  readonly n: number;
  readonly maxLag: number;
  readonly alpha: number;
  readonly season: number | null;
  readonly lags: readonly VerdictLag[];
  readonly joint: JointTest;
  /** The levels the rules are judged at and the joint p they use (verdictReference.ts). */
  readonly levels: VerdictLevels;
  readonly falseAlarm: FalseAlarmNote;
  /** Seasonal lags (m, 2m) that lie beyond K and were not tested; the reason says so. */
  readonly untestedSeasonal?: readonly number[];
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
  /** The finding followed by the note: the one sentence block every view shows. */
  readonly reason: string;
  /** What was found and at which level, without the note. */
  readonly finding: string;
  /** The untested-seasonal-lag remark (if any) and the false-alarm sentence. */
  readonly note: string;
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
  if (note.crossings === 0) return `${head}; none did.`;
  return `${head}; ${note.crossings} did (${formatLagList(note.crossingLags)}); pure noise does that ${formatPercent(note.chance)} of the time.`;
}

export function judge(input: VerdictInput): Verdict {
  const { n, maxLag, alpha, joint, falseAlarm, lags, levels } = input;
  const firstLag = input.firstLag ?? 1;
  const seasonal = seasonalLags(input.season, maxLag).filter((lag) => lag >= firstLag);
  const pastWatchLine = (lag: number) => {
    const z = lags[lag - 1]?.z;
    return z !== undefined && normalTwoSided(z) < levels.watchLevel;
  };
  const triggers = {
    jointRejects: levels.jointRejects,
    outerLags: lags.filter((l) => l.outer && l.lag >= firstLag).map((l) => l.lag),
    lagOne: pastWatchLine(firstLag),
    seasonalLags: seasonal.filter(pastWatchLine),
    excessCrossings: falseAlarm.crossings > 0 && falseAlarm.chance < levels.watchLevel,
  };
  const note = [untestedNote(input), falseAlarmSentence(falseAlarm, alpha)].join("");
  const testName = input.testName ?? TEST_NAMES[joint.test];
  const span = firstLag === 1 ? `${maxLag} lags` : `lags ${firstLag}–${maxLag}`;
  const jointP = referencedPPhrase(levels.jointP);
  const jointFigures = `Q = ${formatNumber(joint.q, 4)}, df ${joint.df}, ${jointP}`;

  if (n < MIN_VALUES_TO_JUDGE) {
    const finding = `Only ${n} values: a verdict needs at least ${MIN_VALUES_TO_JUDGE}; the figures are shown for reference.`;
    return inParts("short", finding, note, triggers);
  }
  if (maxLag > n / 4) {
    const finding = `${maxLag} lags is more than a quarter of the ${n} values, too many to judge; use maxLag ${Math.floor(n / 4)} or fewer.`;
    return inParts("short", finding, note, triggers);
  }

  const describeLag = (lag: number) => {
    const row = lags[lag - 1];
    return row === undefined
      ? `lag ${lag}`
      : `lag ${lag} (r = ${formatNumber(row.correlation, 3)})`;
  };
  const levelNote = `The joint test and the all-lags corridor together are set to fire for ${formatLevel(alpha)} of pure noise; each is judged at ${formatLevel(levels.structureLevel)}.`;
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
    parts.push(levelNote);
    return inParts("structure", parts.join(" "), note, triggers);
  }

  if (triggers.lagOne || triggers.seasonalLags.length > 0 || triggers.excessCrossings) {
    const signs: string[] = [];
    if (triggers.lagOne) signs.push(`${describeLag(firstLag)} lies beyond the watch line`);
    for (const lag of triggers.seasonalLags)
      signs.push(`seasonal ${describeLag(lag)} lies beyond the watch line`);
    if (triggers.excessCrossings) signs.push("more lags cross the band than chance explains");
    parts.push(
      `${capitalise(signs.join("; "))}, though ${testName} over ${span} does not reject (${jointP}).`,
    );
    parts.push(
      `The watch line (|z| > ${formatNumber(watchLine(levels.watchLevel), 3)}) is set so that lag ${firstLag}, the seasonal lags and the crossing count together raise watch for at most ${formatLevel(alpha)} of pure noise.`,
    );
    return inParts("watch", parts.join(" "), note, triggers);
  }

  parts.push(`No leftover structure found: ${testName} over ${span} gives ${jointP}.`);
  if (falseAlarm.crossings === 1) {
    parts.push(
      `${capitalise(describeLag(falseAlarm.crossingLags[0] as number))} crosses its band alone; a lone lag that is neither lag ${firstLag} nor seasonal is weak evidence.`,
    );
  }
  return inParts("clear", parts.join(" "), note, triggers);
}

function inParts(
  word: VerdictWord,
  finding: string,
  note: string,
  triggers: Verdict["triggers"],
): Verdict {
  return { word, reason: `${finding} ${note}`, finding, note, triggers };
}

/** z of the watch line: |z| beyond it has a two-sided p below w*. */
export function watchLine(watchLevel: number): number {
  return normalQuantile(1 - watchLevel / 2);
}

/** "Seasonal lag 12 not tested: 40 values allow at most 10 lags. " or "". */
function untestedNote(input: VerdictInput): string {
  const untested = input.untestedSeasonal ?? [];
  if (untested.length === 0) return "";
  const which = untested.length === 1 ? `lag ${untested[0]}` : `lags ${untested.join(" and ")}`;
  return `Seasonal ${which} not tested: ${input.maxLag} lags tested, and ${input.n} values allow at most ${Math.floor(input.n / 4)} for a verdict. `;
}

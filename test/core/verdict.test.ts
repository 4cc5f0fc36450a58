/**
 * The verdict rules (DESIGN.md "The verdict"; src/core/verdict.ts) on constructed inputs, the
 * false-alarm note every reason carries, and the default-lag rule. The thresholds 20 values and
 * K ≤ n/4, and the default lags, are common practice (no source).
 */
import { describe, expect, it } from "vitest";
import {
  binomialUpperTail,
  defaultMaxLag,
  falseAlarmNote,
  falseAlarmSentence,
  judge,
  lagTable,
  seriesFromNumbers,
  type Verdict,
  type VerdictInput,
  type VerdictLag,
} from "../../src/core";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";

interface Scenario {
  readonly n?: number;
  readonly maxLag?: number;
  readonly alpha?: number;
  readonly season?: number | null;
  /** Lags beyond their own band. */
  readonly crossing?: readonly number[];
  /** Lags beyond the outer (Šidák) corridor as well. */
  readonly outer?: readonly number[];
  readonly jointP?: number;
  /** The watch rule's level w* (default alpha). */
  readonly watchLevel?: number;
  readonly subject?: "series" | "squares";
}

/** A verdict input with lags inside their bands except those named; z 2.5 beyond, 4 outer. */
function scenario(s: Scenario): VerdictInput {
  const n = s.n ?? 100;
  const maxLag = s.maxLag ?? 10;
  const alpha = s.alpha ?? 0.05;
  const outer = s.outer ?? [];
  const crossing = [...new Set([...(s.crossing ?? []), ...outer])].sort((a, b) => a - b);
  const lags: VerdictLag[] = Array.from({ length: maxLag }, (_, i) => {
    const lag = i + 1;
    const z = outer.includes(lag) ? 4 : crossing.includes(lag) ? 2.5 : 0.3;
    return {
      lag,
      correlation: z / Math.sqrt(n),
      z,
      crossesBand: crossing.includes(lag),
      outer: outer.includes(lag),
    };
  });
  return {
    n,
    maxLag,
    alpha,
    season: s.season ?? null,
    lags,
    joint: { test: "ljung-box", q: 12.3456, df: maxLag, p: s.jointP ?? 0.5 },
    // Constructed levels: the joint p judged at alpha itself, the watch rule at `watchLevel`.
    levels: {
      reference: "permutation",
      draws: 499,
      structureLevel: alpha,
      criticalQ: NaN,
      outerLevel: 3.5,
      watchLevel: s.watchLevel ?? alpha,
      jointP: { p: s.jointP ?? 0.5, reference: "permutation", draws: 499, bound: false },
      jointRejects: (s.jointP ?? 0.5) < alpha,
    },
    falseAlarm: falseAlarmNote(maxLag, alpha, crossing),
    ...(s.subject === undefined ? {} : { subject: s.subject }),
  };
}

/** Every reason carries the false-alarm note, whatever the word. */
function expectNote(verdict: Verdict, input: VerdictInput): void {
  const note = falseAlarmSentence(input.falseAlarm, input.alpha);
  expect(verdict.reason, `reason of a "${verdict.word}" verdict`).toContain(note);
}

function judged(s: Scenario): Verdict {
  const input = scenario(s);
  const verdict = judge(input);
  expectNote(verdict, input);
  return verdict;
}

describe("judge(input): short", () => {
  it("judge(n 19) is short even when the joint test rejects, and says why", () => {
    const verdict = judged({ n: 19, maxLag: 3, jointP: 0.001 });
    expect(verdict.word).toBe("short");
    expect(verdict.reason).toMatch(/^Only 19 values: a verdict needs at least 20/);
  });

  it("judge(K 11 > n/4 with n 40) is short and names the largest K allowed", () => {
    const verdict = judged({ n: 40, maxLag: 11 });
    expect(verdict.word).toBe("short");
    expect(verdict.reason).toMatch(
      /11 lags is more than a quarter of the 40 values.*maxLag 10 or fewer/,
    );
  });

  it("judge(n 20, K 5 = n/4) judges: both limits are inclusive", () => {
    expect(judged({ n: 20, maxLag: 5 }).word).toBe("clear");
    expect(judged({ n: 40, maxLag: 10 }).word).toBe("clear");
  });
});

describe("judge(input): structure", () => {
  it("judge(joint p 0.001 < α) is structure and quotes the joint test", () => {
    const verdict = judged({ jointP: 0.001 });
    expect(verdict.word).toBe("structure");
    expect(verdict.triggers.jointRejects).toBe(true);
    expect(verdict.reason).toMatch(
      /^Ljung–Box over 10 lags rejects white noise \(Q = 12\.35, df 10, p = 0\.001 by permutation of 499 draws\)\. The joint test and the all-lags corridor together are set to fire for 5% of pure noise; each is judged at 5%\./,
    );
  });

  it("judge(one lag beyond the Šidák corridor) is structure even when the joint test does not reject", () => {
    const verdict = judged({ outer: [7], jointP: 0.3 });
    expect(verdict.word).toBe("structure");
    expect(verdict.triggers.jointRejects).toBe(false);
    expect(verdict.triggers.outerLags).toEqual([7]);
    expect(verdict.reason).toMatch(
      /^Lag 7 \(r = 0\.4\) lies beyond the corridor that holds for all 10 lags together\./,
    );
  });

  it("judge(joint p exactly α) does not reject: the rule is p < α", () => {
    expect(judged({ jointP: 0.05 }).word).toBe("clear");
  });

  it("judge(squares subject) says the test rejects constant volatility", () => {
    expect(judged({ jointP: 0.001, subject: "squares" }).reason).toMatch(
      /rejects constant volatility/,
    );
  });
});

describe("judge(input): watch", () => {
  it("judge(lag 1 beyond its band) is watch when the joint test does not reject", () => {
    const verdict = judged({ crossing: [1], jointP: 0.2 });
    expect(verdict.word).toBe("watch");
    expect(verdict.triggers.lagOne).toBe(true);
    expect(verdict.reason).toMatch(
      /^Lag 1 \(r = 0\.25\) lies beyond the watch line, though Ljung–Box over 10 lags does not reject \(p = 0\.2 by permutation of 499 draws\)\. The watch line \(\|z\| > 1\.96\) is set so that lag 1, the seasonal lags and the crossing count together raise watch for at most 5% of pure noise\./,
    );
  });

  it("judge(seasonal lag 2m beyond its band) is watch and names the seasonal lag", () => {
    const verdict = judged({ season: 4, crossing: [8] });
    expect(verdict.word).toBe("watch");
    expect(verdict.triggers.seasonalLags).toEqual([8]);
    expect(verdict.reason).toMatch(/^Seasonal lag 8 \(r = 0\.25\) lies beyond the watch line/);
  });

  it("judge(seasonal lag m beyond its band) is watch", () => {
    expect(judged({ season: 4, crossing: [4] }).word).toBe("watch");
    // Without the season, the same lag alone is a lone far lag: clear.
    expect(judged({ crossing: [4] }).word).toBe("clear");
  });

  it("judge(4 of 20 lags beyond) is watch: more crossings than chance explains", () => {
    // Binomial upper tail P(X ≥ 4), X ~ Bin(20, 0.05) ≈ 0.016 < α (derived, binomialUpperTail).
    const input = scenario({ n: 200, maxLag: 20, crossing: [3, 7, 11, 15] });
    expectClose(
      input.falseAlarm.chance,
      binomialUpperTail(4, 20, 0.05),
      { rel: 1e-15 },
      "chance of 4 of 20",
    );
    expect(input.falseAlarm.chance).toBeLessThan(0.05);
    const verdict = judge(input);
    expectNote(verdict, input);
    expect(verdict.word).toBe("watch");
    expect(verdict.triggers.excessCrossings).toBe(true);
    expect(verdict.reason).toMatch(/^More lags cross the band than chance explains/);
  });

  it("judge(2 of 10 lags beyond) is not excess: chance 8.6% ≥ α", () => {
    const verdict = judged({ crossing: [3, 7] });
    expect(verdict.triggers.excessCrossings).toBe(false);
    expect(verdict.word).toBe("clear");
  });
});

describe("judge(input): clear", () => {
  it("judge(nothing beyond) is clear and says none crossed", () => {
    const verdict = judged({ jointP: 0.62 });
    expect(verdict.word).toBe("clear");
    expect(verdict.reason).toBe(
      "No leftover structure found: Ljung–Box over 10 lags gives p = 0.62 by permutation of 499 draws. 10 lags tested at 5%: about 0.5 would cross the band by chance even for pure noise; none did.",
    );
  });

  it("judge(a lone far lag) is clear and names that lag as weak evidence", () => {
    const verdict = judged({ crossing: [7] });
    expect(verdict.word).toBe("clear");
    expect(verdict.reason).toContain(
      "Lag 7 (r = 0.25) crosses its band alone; a lone lag that is neither lag 1 nor seasonal is weak evidence.",
    );
    // The note: 1 of 10 lags crossing happens 40% of the time for pure noise (P(X ≥ 1) = 0.401).
    expect(verdict.reason).toContain(
      "10 lags tested at 5%: about 0.5 would cross the band by chance even for pure noise; 1 did (lag 7); pure noise does that 40% of the time.",
    );
  });
});

describe("falseAlarmSentence(note, alpha)", () => {
  it("falseAlarmSentence(24 lags, 2 beyond) counts the expected and observed crossings", () => {
    // P(X ≥ 2), X ~ Bin(24, 0.05) = 0.339183 (derived) → "34%".
    const note = falseAlarmNote(24, 0.05, [7, 19]);
    expect(falseAlarmSentence(note, 0.05)).toBe(
      "24 lags tested at 5%: about 1.2 would cross the band by chance even for pure noise; 2 did (lags 7, 19); pure noise does that 34% of the time.",
    );
  });

  it("falseAlarmSentence(1 lag at 1%) uses the singular and the level given", () => {
    expect(falseAlarmSentence(falseAlarmNote(1, 0.01, []), 0.01)).toBe(
      "1 lag tested at 1%: about 0.01 would cross the band by chance even for pure noise; none did.",
    );
  });
});

describe("defaultMaxLag(n, season) and lagTable's default lags (common practice (no source))", () => {
  it("defaultMaxLag gives min(10, ⌊n/5⌋) without a season and min(2m, ⌊n/5⌋) with one, within 1..n−1", () => {
    const cases: readonly (readonly [number, number | null, number])[] = [
      [70, null, 10],
      [30, null, 6],
      [1000, null, 10],
      [200, 12, 24],
      [60, 12, 12],
      [100, 4, 8],
      [9, null, 1],
      [3, null, 1],
      [2, null, 1],
    ];
    for (const [n, season, expected] of cases) {
      expect(defaultMaxLag(n, season), `defaultMaxLag(${n}, ${season})`).toBe(expected);
    }
  });

  it("lagTable(series) without maxLag uses the default rule", () => {
    const seriesF = seriesFromNumbers(readSeriesF());
    expect(lagTable(seriesF).maxLag).toBe(10);
    expect(lagTable(seriesF, { season: 4 }).maxLag).toBe(8);
    expect(lagTable(seriesF, { season: 12 }).maxLag).toBe(14);
  });
});

describe("lagTable(series).verdict end to end", () => {
  it("lagTable(Series F) is structure: Ljung–Box over 10 lags rejects, p by permutation", () => {
    // Series F Ljung–Box Q(10) = 21.59155 (derived, METHODS.md; χ² p 0.017). With 70 values the
    // verdict refers Q to its permutation distribution, and says so.
    const { verdict, levels } = lagTable(seriesFromNumbers(readSeriesF()));
    expect(verdict.word).toBe("structure");
    expect(levels.reference).toBe("permutation");
    expect(verdict.reason).toMatch(
      /^Ljung–Box over 10 lags rejects white noise \(Q = 21\.59, df 10, p = 0\.0\d+ by permutation of 499 draws\)/,
    );
    expect(verdict.reason).toMatch(
      /10 lags tested at 5%: about 0\.5 would cross the band by chance even for pure noise; /,
    );
  });

  it("lagTable(series, alpha 0.01) judges Series F at 1% with levels of its own", () => {
    const { verdict, joint, levels, rows } = lagTable(seriesFromNumbers(readSeriesF()), {
      alpha: 0.01,
    });
    // Series F: Ljung–Box χ² p(10) = 0.017 (derived, METHODS.md), above 1%.
    expect(joint.p).toBeGreaterThan(0.01);
    expect(levels.jointP.p).toBeGreaterThan(0.01);
    expect(levels.jointRejects).toBe(false);
    // Lag 1 (r = −0.39, z = −3.26, derived): beyond the all-lags corridor exactly when the
    // calibrated corridor is narrower than 3.26; the word follows that rule.
    const lagOne = Math.abs(rows[0]?.z ?? NaN);
    expect(verdict.word).toBe(lagOne > levels.outerLevel ? "structure" : "watch");
    expect(verdict.reason).toContain("10 lags tested at 1%");
  });
});

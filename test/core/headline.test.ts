/**
 * The headline rules (README "The headline"; src/core/headline.ts, batchHeadline.ts,
 * batchRanking.ts). The planner's 150 items (src/sim/plannerItems.ts: 125 sound, 12 AR(1) 0.4,
 * 8 with a 13-week cycle, 5 biased by 6.4 with error sd 10) are the case the rules were written for.
 */
import { describe, expect, it } from "vitest";
import {
  batchCheck,
  batchRowHeadline,
  mergeSeriesResults,
  rankedRows,
  rankGroup,
  seriesFromNumbers,
  seriesHeadline,
  seriesResult,
  type SeriesResult,
} from "../../src/core";
import { summaryText } from "../../src/report";
import { lagTable } from "../../src/core";
import { plannerItems } from "../../src/sim/plannerItems";
import { garch11, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

const planner = plannerItems();
const kindOf = new Map(planner.map((item) => [item.label, item.kind]));
const plannerSeries = planner.map((item) => seriesFromNumbers(Array.from(item.errors), item.label));

/** A hand-made batch line: only the fields the rule reads matter. */
function line(over: Partial<SeriesResult>): SeriesResult {
  return {
    id: "x",
    n: 104,
    statistic: 30,
    df: 10,
    p: 0.01,
    reference: "permutation",
    draws: 499,
    pBound: false,
    verdict: "structure",
    reason: "Own finding. Own note.",
    finding: "Own finding.",
    note: "Own note.",
    reading: "plain",
    switched: false,
    plainVerdict: "structure",
    volatility: { lm: 3, df: 10, p: 0.9 },
    bias: { mean: 0.1, se: 1, t: 0.1, p: 0.9 },
    alpha: 0.05,
    test: "ljung-box",
    ...over,
  };
}

const step = { qValue: 0.2, biasQValue: 0.9, alpha: 0.05, analysed: 150 };

describe("batchRowHeadline: the word obeys the false-discovery step", () => {
  it("a series whose own verdict is structure but is not kept is at most watch, and says so", () => {
    const { kept, headline } = batchRowHeadline(line({}), step);
    expect(kept).toBe(false);
    expect(headline?.word).toBe("watch");
    expect(headline?.finding).toContain("On its own this series would be structure");
    expect(headline?.finding).toContain("does not keep it");
  });

  it("a kept series is structure, whatever its own word", () => {
    const { kept, headline } = batchRowHeadline(line({ verdict: "clear" }), {
      ...step,
      qValue: 0.04,
    });
    expect(kept).toBe(true);
    expect(headline?.word).toBe("structure");
    expect(headline?.finding).toContain("Kept by the false-discovery step across 150 series");
  });

  it("a short series is never kept", () => {
    const { kept, headline } = batchRowHeadline(line({ verdict: "short" }), {
      ...step,
      qValue: 0.01,
    });
    expect(kept).toBe(false);
    expect(headline?.word).toBe("short");
  });

  it("biased only when the bias step keeps it; a raw-only bias is named without the flag", () => {
    const biasedLine = line({ verdict: "clear", bias: { mean: 6.4, se: 1, t: 6.4, p: 1e-10 } });
    const kept = batchRowHeadline(biasedLine, { ...step, biasQValue: 1e-8 }).headline;
    expect(kept?.biased).toBe(true);
    expect(kept?.title).toBe("clear, biased");
    expect(kept?.findings.some((f) => f.startsWith("Biased: the mean is 6.4"))).toBe(true);
    const rawOnly = batchRowHeadline(
      line({ verdict: "clear", bias: { mean: 1.2, se: 0.55, t: 2.2, p: 0.03 } }),
      { ...step, biasQValue: 0.6 },
    ).headline;
    expect(rawOnly?.biased).toBe(false);
    expect(rawOnly?.title).toBe("clear");
    expect(rawOnly?.finding).toContain("would count as bias");
  });

  it("a series that could not be analysed has no headline", () => {
    expect(batchRowHeadline(line({ verdict: null, reading: null }), step).headline).toBeNull();
  });
});

describe("batchCheck on the planner's 150 items", () => {
  const batch = batchCheck(plannerSeries, { season: 13 });
  const ranked = rankedRows(batch);

  it("calls structure exactly the kept items, and marks every biased item", () => {
    for (const row of batch.rows) {
      expect(row.headline?.word === "structure", row.label).toBe(row.kept);
      expect(row.kept, row.label).toBe(row.qValue <= 0.05);
    }
    const biased = batch.rows.filter((row) => row.headline?.biased === true);
    expect(biased.map((row) => kindOf.get(row.label))).toEqual(Array(5).fill("biased"));
  });

  it("ranks so that the words never go backwards, kept findings first", () => {
    const groups = ranked.map((row) => rankGroup(row.headline, row.kept));
    expect(groups).toEqual(groups.slice().sort((a, b) => a - b));
    // The five biased items (mean 6.4, t about 6.5) are among the first rows, not 44th.
    const firstTwenty = ranked.slice(0, 20).map((row) => kindOf.get(row.label));
    expect(firstTwenty.filter((kind) => kind === "biased")).toHaveLength(5);
    // Within a group the q-value ascends (in the kept group the smaller kept q-value of lag
    // structure and bias), ties broken by p.
    const keyQ = (row: (typeof ranked)[number]) =>
      rankGroup(row.headline, row.kept) > 0
        ? row.qValue
        : Math.min(
            row.kept ? row.qValue : Infinity,
            row.headline?.biased ? row.biasQValue : Infinity,
          );
    for (let i = 1; i < ranked.length; i++) {
      const [a, b] = [ranked[i - 1], ranked[i]];
      if (a === undefined || b === undefined) continue;
      if (rankGroup(a.headline, a.kept) !== rankGroup(b.headline, b.kept)) continue;
      expect(keyQ(a) <= keyQ(b), `${a.label} before ${b.label}`).toBe(true);
      if (keyQ(a) === keyQ(b)) expect(a.p <= b.p, `${a.label} before ${b.label}`).toBe(true);
    }
  });

  it("keeps most of the items with a lag structure, since the structure p counts the largest lag", () => {
    const kept = batch.rows.filter((row) => row.kept);
    const real = kept.filter((row) => kindOf.get(row.label) !== "sound");
    // Seeded: 13 kept, 11 of them under-reacting or cyclic (2 sound items are the false flags
    // the step allows for; the rate is asserted by test/calibration/batchFalseDiscoveries.test.ts).
    expect(kept.length).toBe(13);
    expect(real.length).toBe(11);
  });

  it("gives the same words, q-values and order when merged from shuffled parts", () => {
    const results = plannerSeries.map((series, i) => seriesResult(series, i, { season: 13 }));
    const shuffled = results.slice().reverse();
    const merged = mergeSeriesResults([...shuffled.slice(0, 70), ...shuffled.slice(70)]);
    const byLabel = new Map(batch.rows.map((row) => [row.label, row]));
    for (const row of merged.rows) {
      const whole = byLabel.get(row.label);
      expect(row.qValue).toBe(whole?.qValue);
      expect(row.headline?.title).toBe(whole?.headline?.title);
    }
    expect(rankedRows(merged).map((row) => row.label)).toEqual(ranked.map((row) => row.label));
  });
});

describe("seriesHeadline: volatility switches the reading, bias travels with the word", () => {
  it("clustered volatility: robust reading, the plain word named, the model's standard errors flagged", () => {
    const series = seriesFromNumbers(Array.from(garch11(seededRandom(5), 800, 0.05, 0.2, 0.75)));
    const { headline, plain, robust } = seriesHeadline(series);
    expect(headline.volatile).toBe(true);
    expect(headline.switched).toBe(true);
    expect(headline.reading).toBe("robust");
    expect(robust?.bandKind).toBe("robust");
    expect(headline.word).toBe(robust?.verdict.word);
    expect(headline.finding).toContain(`plain reading`);
    expect(headline.finding).toContain(plain.verdict.word);
    expect(headline.finding).toContain("ordinary standard errors");
  });

  it("a biased clear series says both, and Copy summary carries every finding", () => {
    const noise = whiteNoise(seededRandom(11), 300);
    const series = seriesFromNumbers(Array.from(noise, (x) => x + 0.5));
    const { headline } = seriesHeadline(series);
    expect(headline.biased).toBe(true);
    expect(headline.title).toBe(`${headline.word}, biased`);
    const summary = summaryText(lagTable(series), headline);
    for (const finding of headline.findings) expect(summary).toContain(finding);
    expect(summary).toContain(headline.note);
  });
});

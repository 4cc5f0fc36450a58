import { describe, expect, it } from "vitest";
import { lagTable, seriesFromNumbers, seriesFromValues } from "../../src/core";
import { explainVerdict, explanationText, SCREENING_CAUTION, summaryText } from "../../src/report";
import { garch11 } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { expectClose } from "../helpers/expectClose";
import { seriesF } from "./chartTree";

describe("explainVerdict(table)", () => {
  it("states the expected crossings, the count seen and the binomial chance (K = 24, α = 0.05)", () => {
    const table = lagTable(seriesF(), { maxLag: 24, alpha: 0.05 });
    const explained = explainVerdict(table);
    expect(explained.falseAlarm.tested).toBe(24);
    expectClose(explained.falseAlarm.expected, 1.2, { rel: 1e-12 }, "expected crossings K·α");
    expect(explained.falseAlarm.seen).toBe(2);
    expect(explained.falseAlarm.lags).toEqual([1, 2]);
    // P(≥2) for Binomial(24, 0.05) = 0.339183 (METHODS.md, derived with the published binomial tail).
    expectClose(explained.falseAlarm.chance, 0.339183, { abs: 1e-6 }, "P(≥2 of 24 at 5%)");
    const note = explained.items.find((i) => i.topic === "false-alarms")?.text ?? "";
    expect(note).toContain("24 lags tested at 5%");
    expect(note).toContain("about 1.2 would cross the band by chance");
    expect(note).toContain("2 did (lags 1, 2)");
    expect(note).toContain("34% of the time");
  });

  it("uses the same tail at K = 10: two crossings happen 8.6% of the time", () => {
    const explained = explainVerdict(lagTable(seriesF(), { maxLag: 10 }));
    // P(≥2) for Binomial(10, 0.05) = 0.086138 (METHODS.md, derived).
    expectClose(explained.falseAlarm.chance, 0.086138, { abs: 1e-6 }, "P(≥2 of 10 at 5%)");
    expect(explained.items.find((i) => i.topic === "false-alarms")?.text).toContain(
      "8.6% of the time",
    );
  });

  it("takes the verdict in its parts: the finding first, the note in the false-alarm paragraph", () => {
    // Season 12 with 12 lags leaves lag 24 untested: the note starts with that remark.
    const table = lagTable(seriesF(), { maxLag: 12, season: 12 });
    const { finding, note, reason } = table.verdict;
    expect(note).toMatch(/^Seasonal lag 24 not tested: 12 lags tested, /);
    expect(reason).toBe(`${finding} ${note}`);
    const explained = explainVerdict(table);
    expect(explained.items.find((i) => i.topic === "verdict")?.text).toBe(finding);
    const falseAlarms = explained.items.find((i) => i.topic === "false-alarms")?.text ?? "";
    expect(falseAlarms.startsWith(`${note} In the chart the inner corridor`)).toBe(true);
  });

  it("leads with the verdict and its reason and always ends with the screening caution", () => {
    const table = lagTable(seriesF(), {});
    const explained = explainVerdict(table);
    expect(explained.word).toBe("structure");
    expect(explained.shape).toBe("■");
    expect(explained.colour).toBe("#D55E00");
    expect(explained.items[0]?.topic).toBe("verdict");
    expect(explained.items[0]?.text).toContain("Ljung–Box over 10 lags rejects white noise");
    expect(explained.items[0]?.text).not.toContain("would cross the band by chance");
    expect(explained.reason).toBe(table.verdict.reason);
    expect(explained.items.at(-1)).toEqual({
      topic: "screening",
      heading: "A screen, not a decision",
      text: SCREENING_CAUTION,
    });
    expect(explanationText(explained).split("\n")).toHaveLength(explained.items.length);
  });

  it("explains the season: which of m and 2m were tested and where they lie", () => {
    const withSeason = explainVerdict(lagTable(seriesF(), { maxLag: 17, season: 6 }));
    const text = withSeason.items.find((i) => i.topic === "season")?.text ?? "";
    expect(text).toContain("Season m = 6: lags 6 and 12 are watched.");
    expect(text).toMatch(/Lag 6 \(r = -0\.0471, z = -0\.394\) stays inside its band\./);
    const beyond = explainVerdict(lagTable(seriesF(), { maxLag: 10, season: 6 }));
    expect(beyond.items.find((i) => i.topic === "season")?.text).toContain(
      "Lag 12 is beyond the 10 lags tested.",
    );
    const none = explainVerdict(lagTable(seriesF(), {}));
    expect(none.items.find((i) => i.topic === "season")?.text).toContain("No season set.");
  });

  it("explains gaps and a small sample", () => {
    const values: (number | null)[] = [
      ...Array.from({ length: 30 }, (_, i) => Math.sin(i * 1.7) + (i % 3)),
    ];
    values[7] = null;
    values[12] = null;
    const table = lagTable(seriesFromValues(values), {});
    const explained = explainVerdict(table);
    expect(explained.items.find((i) => i.topic === "gaps")?.text).toContain(
      "2 gaps inside the series (28 values over 30 positions)",
    );
    expect(explained.items.find((i) => i.topic === "small-sample")?.text).toContain(
      "Only 28 values",
    );
    expect(explainVerdict(lagTable(seriesF(), {})).items.some((i) => i.topic === "gaps")).toBe(
      false,
    );
  });

  it("warns about volatility clustering when the squared deviations are correlated, and names the remedy", () => {
    const series = seriesFromNumbers(garch11(seededRandom(5), 800, 0.05, 0.2, 0.75));
    const squares = lagTable(series, { testKind: "squares" });
    expect(squares.joint.p).toBeLessThan(0.05);
    const plain = explainVerdict(lagTable(series, {}), { squares });
    const warning = plain.items.find((i) => i.topic === "volatility")?.text ?? "";
    expect(warning).toContain("McLeod–Li");
    expect(warning).toContain("Choose robust bands and the robust joint test");
    const robust = explainVerdict(lagTable(series, { bandKind: "robust", testKind: "robust" }), {
      squares,
    });
    expect(robust.items.find((i) => i.topic === "volatility")?.text).toContain(
      "The robust bands in use allow for it.",
    );
    const calm = explainVerdict(lagTable(seriesF(), {}), {
      squares: lagTable(seriesF(), { testKind: "squares" }),
    });
    expect(calm.items.some((i) => i.topic === "volatility")).toBe(false);
  });

  it("adds flagged side findings (volatility, bias) and leaves out unflagged ones", () => {
    const table = lagTable(seriesF(), {});
    const flagged = explainVerdict(table, {
      bias: { flagged: true, text: "Mean error 3.1 (t = 2.9)." },
      volatility: { flagged: true, text: "Engle's LM flags it." },
    });
    expect(flagged.items.find((i) => i.topic === "bias")?.text).toBe("Mean error 3.1 (t = 2.9).");
    expect(flagged.items.find((i) => i.topic === "volatility")?.text).toBe("Engle's LM flags it.");
    const quiet = explainVerdict(table, {
      bias: { flagged: false, text: "x" },
      volatility: { flagged: false, text: "y" },
    });
    expect(quiet.items.some((i) => i.topic === "bias" || i.topic === "volatility")).toBe(false);
  });
});

describe("summaryText(table)", () => {
  it("gives the label, the settings, the verdict with its reason, and the caution", () => {
    const table = lagTable(seriesF(), {});
    const lines = summaryText(table).split("\n");
    expect(lines[0]).toBe(
      "yield (n = 70; 10 lags, alpha 0.05, noise bands, Ljung–Box): ■ structure",
    );
    expect(lines[1]).toBe(table.verdict.reason);
    expect(lines[2]).toBe(SCREENING_CAUTION);
  });
});

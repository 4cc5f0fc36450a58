import { describe, expect, it } from "vitest";
import { seriesFromNumbers } from "../../src/core";
import { seriesReport } from "../../src/report";
import { garch11, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

const topics = (report: ReturnType<typeof seriesReport>) =>
  report.explanation.items.map((i) => i.topic);

describe("seriesReport(series, options)", () => {
  it("reads clustered volatility robustly: the headline says so, the plain table stays beside it", () => {
    const report = seriesReport(
      seriesFromNumbers(garch11(seededRandom(5), 800, 0.05, 0.2, 0.75)),
      {},
    );
    expect(report.volatility?.flagged).toBe(true);
    expect(typeof report.squares).not.toBe("string");
    expect(report.headline.switched).toBe(true);
    expect(report.table.bandKind).toBe("robust");
    expect(report.table.testKind).toBe("robust");
    expect(report.plain.bandKind).toBe("noise");
    // The volatility finding is the headline's own paragraph, not a separate one.
    expect(topics(report)).not.toContain("volatility");
    const first = report.explanation.items[0];
    expect(first?.text).toContain("Engle's LM");
    expect(first?.text).toContain("robust reading");
    expect(first?.heading).toContain("(robust reading)");
  });

  it("adds the bias line when the mean is off zero, and neither line for centred noise", () => {
    const noise = whiteNoise(seededRandom(11), 300);
    const shifted = seriesReport(seriesFromNumbers(noise.map((x) => x + 0.5)), {});
    expect(shifted.bias?.flagged).toBe(true);
    expect(shifted.headline.biased).toBe(true);
    expect(shifted.headline.title).toBe(`${shifted.headline.word}, biased`);
    expect(shifted.explanation.items[0]?.text).toContain("Biased: the mean is");
    const centred = seriesReport(
      seriesFromNumbers(noise.map((x) => x - noise.reduce((a, b) => a + b, 0) / noise.length)),
      {},
    );
    expect(topics(centred)).not.toContain("bias");
    expect(topics(centred)).not.toContain("volatility");
    expect(centred.headline.biased).toBe(false);
    expect(centred.headline.switched).toBe(false);
    expect(centred.table).toBe(centred.plain);
  });

  it("keeps the squares view's reason when it cannot be computed", () => {
    // Every value equally far from the mean: the squared deviations are constant.
    const report = seriesReport(
      seriesFromNumbers(Array.from({ length: 40 }, (_, i) => (i % 2 === 0 ? 1 : -1))),
      {},
    );
    expect(typeof report.squares).toBe("string");
    expect(report.squares).toContain("squared deviations");
  });
});

import { describe, expect, it } from "vitest";
import { seriesFromNumbers } from "../../src/core";
import { seriesReport } from "../../src/report";
import { garch11, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

const topics = (report: ReturnType<typeof seriesReport>) =>
  report.explanation.items.map((i) => i.topic);

describe("seriesReport(series, options)", () => {
  it("adds the volatility line when clustering flags, and the squares view beside it", () => {
    const report = seriesReport(
      seriesFromNumbers(garch11(seededRandom(5), 800, 0.05, 0.2, 0.75)),
      {},
    );
    expect(report.volatility?.flagged).toBe(true);
    expect(typeof report.squares).not.toBe("string");
    expect(topics(report)).toContain("volatility");
    expect(report.explanation.items.find((i) => i.topic === "volatility")?.text).toContain(
      "Engle's LM",
    );
  });

  it("adds the bias line when the mean is off zero, and neither line for centred noise", () => {
    const noise = whiteNoise(seededRandom(11), 300);
    const shifted = seriesReport(seriesFromNumbers(noise.map((x) => x + 0.5)), {});
    expect(shifted.bias?.flagged).toBe(true);
    expect(topics(shifted)).toContain("bias");
    const centred = seriesReport(
      seriesFromNumbers(noise.map((x) => x - noise.reduce((a, b) => a + b, 0) / noise.length)),
      {},
    );
    expect(topics(centred)).not.toContain("bias");
    expect(topics(centred)).not.toContain("volatility");
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

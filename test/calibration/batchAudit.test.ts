/**
 * What the batch and the forecast audit promise, by seeded simulation (limits from the
 * calibration issue; replication counts and 95% intervals in each message):
 * - the batch's Benjamini–Hochberg step holds the false-discovery rate at 5% among 180 noise and
 *   20 AR(1) φ 0.35 series: the mean false-discovery proportion over 200 replications has a
 *   Monte Carlo standard error of about 0.017 (most replications flag 0 or 1 series), so the test
 *   asserts that the one-sided 95% lower bound of the mean, mean − 1.645·se, is at most 0.05 —
 *   the data must not contradict the promise — and that the mean stays below 0.09;
 * - the forecast audit calls correct 3-step errors (MA(2)) `structure` at most 6.5% of the time,
 *   and still finds a bias of 0.3σ and AR(1) one-step errors;
 * - the calibrated verdict keeps its power against AR(1) φ 0.2 and MA(1) θ 0.3 at n 104.
 */
import { describe, expect, it } from "vitest";
import { auditRate, batchOf, powerOf } from "../../src/sim/calibration";
import { describeShare, expectShareWithin } from "./helpers";

describe("batchCheck(180 noise + 20 AR(1) φ 0.35 series): false discoveries under control", () => {
  it("batchCheck(n 52) holds the false-discovery rate at 5% over 200 replications and finds some of the 20", () => {
    const result = batchOf(52, 200, 401);
    const { falseDiscoveryProportion: mean, fdpStandardError: se } = result;
    const message = `n 52, 200 replications: mean FDP ${mean.toFixed(4)} (se ${se.toFixed(4)}), found ${result.found} of 20, raw noise flags ${result.rawNoiseFlags} of 180`;
    expect(mean - 1.645 * se, message).toBeLessThanOrEqual(0.05);
    expect(mean, message).toBeLessThanOrEqual(0.09);
    // At n 52 an AR(1) φ 0.35 series is hard to pick out of 200 (the study: about 0.3 of 20 at
    // n 52, most of them from n 260); the step must still find some.
    expect(result.found, message).toBeGreaterThanOrEqual(0.2);
    // Raw p < 0.05 flags about 5% of the 180 noise series (9): the p-values are exact.
    expect(result.rawNoiseFlags, message).toBeGreaterThanOrEqual(7.5);
    expect(result.rawNoiseFlags, message).toBeLessThanOrEqual(10.5);
  }, 300_000);
});

describe("forecastAudit(correct 3-step errors): structure ≤ 6.5%", () => {
  for (const [n, thetas, seed] of [
    [52, [0.5, 0.25], 501],
    [52, [0.8, 0.64], 502],
    [104, [0.5, 0.25], 503],
    [104, [0.8, 0.64], 504],
  ] as const) {
    it(`forecastAudit(MA(2) θ ${thetas.join(", ")}, n ${n}, horizon 3) says structure ≤ 6.5% of 800 replications`, () => {
      const rate = auditRate(n, 3, thetas, 800, seed);
      expectShareWithin(
        rate,
        800,
        0,
        0.065,
        `audit structure, MA(2) θ ${thetas.join(", ")}, n ${n}`,
      );
    }, 240_000);
  }
});

describe("power that the calibration keeps", () => {
  it("forecastAudit(one-step errors with a bias of 0.3σ, n 200) finds it in ≥ 90% of 400 replications", () => {
    const rate = auditRate(200, 1, [], 400, 601, 0.3);
    expect(rate, `bias 0.3σ found: ${describeShare(rate, 400)}`).toBeGreaterThanOrEqual(0.9);
  }, 240_000);

  it("forecastAudit(AR(1) φ 0.3 one-step errors, n 104) is structure in ≥ 50% of 400 replications", () => {
    const rate = auditRate(104, 1, [], 400, 602, 0, 0.3);
    expect(rate, `AR(1) 0.3 audit: ${describeShare(rate, 400)}`).toBeGreaterThanOrEqual(0.5);
  }, 240_000);

  it("noiseCheck(AR(1) φ 0.2, n 104) is structure in ≥ 20% and noiseCheck(MA(1) θ 0.3, n 104) in ≥ 38% of 1,000", () => {
    const ar = powerOf(104, { kind: "ar1", phi: 0.2 }, {}, 1000, 603);
    const ma = powerOf(104, { kind: "ma", thetas: [0.3] }, {}, 1000, 604);
    expect(ar, `AR(1) 0.2: ${describeShare(ar, 1000)}`).toBeGreaterThanOrEqual(0.2);
    expect(ma, `MA(1) 0.3: ${describeShare(ma, 1000)}`).toBeGreaterThanOrEqual(0.38);
  }, 240_000);
});

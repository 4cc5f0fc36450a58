/**
 * The power the calibration keeps, by seeded simulation (limits from the calibration issue;
 * replication counts and 95% intervals in each message): the forecast audit still finds a bias
 * of 0.3σ and AR(1) one-step errors, and the calibrated verdict keeps its power against AR(1)
 * φ 0.2 and MA(1) θ 0.3 at n 104.
 */
import { describe, expect, it } from "vitest";
import { auditRate, powerOf } from "../../src/sim/calibration";
import { describeShare } from "./helpers";

describe("power that the calibration keeps", () => {
  it("forecastAudit(one-step errors with a bias of 0.3σ, n 200) finds it in ≥ 90% of 400 replications", () => {
    const rate = auditRate(200, 1, [], 400, 601, 0.3);
    expect(rate, `bias 0.3σ found: ${describeShare(rate, 400)}`).toBeGreaterThanOrEqual(0.9);
  }, 3_600_000);

  it("forecastAudit(AR(1) φ 0.3 one-step errors, n 104) is structure in ≥ 50% of 400 replications", () => {
    const rate = auditRate(104, 1, [], 400, 602, 0, 0.3);
    expect(rate, `AR(1) 0.3 audit: ${describeShare(rate, 400)}`).toBeGreaterThanOrEqual(0.5);
  }, 3_600_000);

  it("noiseCheck(AR(1) φ 0.2, n 104) is structure in ≥ 20% and noiseCheck(MA(1) θ 0.3, n 104) in ≥ 38% of 1,000", () => {
    const ar = powerOf(104, { kind: "ar1", phi: 0.2 }, {}, 1000, 603);
    const ma = powerOf(104, { kind: "ma", thetas: [0.3] }, {}, 1000, 604);
    expect(ar, `AR(1) 0.2: ${describeShare(ar, 1000)}`).toBeGreaterThanOrEqual(0.2);
    expect(ma, `MA(1) 0.3: ${describeShare(ma, 1000)}`).toBeGreaterThanOrEqual(0.38);
  }, 3_600_000);
});

/**
 * What the forecast audit promises on correct forecasts, by seeded simulation (limit from the
 * calibration issue; replication counts and 95% intervals in each message): it calls correct
 * 3-step errors (MA(2)) `structure` at most 6.5% of the time.
 */
import { describe, it } from "vitest";
import { auditRate } from "../../src/sim/calibration";
import { expectShareWithin } from "./helpers";

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
    }, 3_600_000);
  }
});

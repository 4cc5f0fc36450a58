/**
 * What the batch promises, by seeded simulation (limits from the calibration issue; replication
 * counts and 95% intervals in each message): the batch's Benjamini–Hochberg step keeps the mean
 * false-discovery proportion ≤ 0.06 among 180 noise and 20 AR(1) φ 0.35 series, and still finds
 * the AR(1) series.
 */
import { describe, expect, it } from "vitest";
import { batchOf } from "../../src/sim/calibration";
import { SIMULATION_TIMEOUT } from "./helpers";

describe("batchCheck(180 noise + 20 AR(1) φ 0.35 series): false discoveries under control", () => {
  it(
    "batchCheck(n 52) keeps the mean false-discovery proportion ≤ 0.06 over 200 replications and finds ≥ 0.3 of 20",
    () => {
      const result = batchOf(52, 200, 401);
      const message = `n 52, 200 replications: mean FDP ${result.falseDiscoveryProportion}, found ${result.found} of 20, raw noise flags ${result.rawNoiseFlags} of 180`;
      expect(result.falseDiscoveryProportion, message).toBeLessThanOrEqual(0.06);
      expect(result.found, message).toBeGreaterThanOrEqual(0.3);
      // Raw p < 0.05 flags about 5% of the 180 noise series (9): the p-values are exact.
      expect(result.rawNoiseFlags, message).toBeGreaterThanOrEqual(7.5);
      expect(result.rawNoiseFlags, message).toBeLessThanOrEqual(10.5);
    },
    SIMULATION_TIMEOUT,
  );
});

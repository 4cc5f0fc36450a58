/**
 * The verdict's level on long series (n = 1000) for normal and heavy-tailed noise, and under
 * volatility clustering with the robust options. Limits from DESIGN.md: `structure` within
 * [4.0%, 6.0%], `watch` ≤ 5%; with GARCH(1,1) noise (a 0.1, b 0.85), robust bands and the robust
 * joint test, `structure` ≤ 6.5%. Seeded; replication counts and 95% intervals in each message.
 */
import { describe, it } from "vitest";
import { sizeOf } from "../../src/sim/calibration";
import { expectShareWithin } from "./helpers";

describe("noiseCheck(long and clustered noise) at its level", () => {
  for (const [law, seed] of [
    ["normal", 301],
    ["t3", 302],
  ] as const) {
    it(`noiseCheck(${law} noise, n 1000) keeps structure within [4%, 6%] over 2,500 replications`, () => {
      const result = sizeOf({ n: 1000, law, options: {}, replications: 2500, seed });
      expectShareWithin(result.structure, 2500, 0.04, 0.06, `structure, ${law}, n 1000`);
      expectShareWithin(result.watch, 2500, 0, 0.05, `watch, ${law}, n 1000`);
    }, 3_600_000);
  }

  it("noiseCheck(GARCH(1,1) noise, n 260, robust bands and robust test) keeps structure ≤ 6.5% over 1,500 replications", () => {
    const options = { bandKind: "robust", testKind: "robust" } as const;
    const result = sizeOf({ n: 260, law: "garch", options, replications: 1500, seed: 303 });
    expectShareWithin(result.structure, 1500, 0, 0.065, "structure, GARCH, robust options, n 260");
  }, 3_600_000);
});

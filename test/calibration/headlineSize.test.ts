/**
 * The headline at its stated levels (README "The headline"). Seeded simulations; each message
 * states the share, its replication count and its 95% Wilson interval.
 *
 * - The bias check alone on white noise, 4,000 replications a length: within [4%, 6%] at 5%
 *   (the normal reference it replaced gave 9.1% at n 25 and 7.3% at n 52; bias.ts).
 * - The headline's word on pure noise, 1,000 replications: `structure` within [3.5%, 6.5%]
 *   (binomial standard error 0.69% at 5%), and bias within [3.5%, 6.5%]: two tests, each at 5%,
 *   so some finding fires for at most about 10% of pure noise — the headline says each is judged
 *   on its own.
 * - Volatility clustering without linear dependence (GARCH(1,1), a 0.1, b 0.85) at n 260, 1,000
 *   replications: the plain reading alone calls about 19% `structure` there (README calibration
 *   table); the headline, switching to the robust reading when Engle's LM fires, stays within
 *   [3%, 7.5%].
 * The timeouts allow for a loaded 2-core machine (test/calibration/helpers.ts).
 */
import { describe, it } from "vitest";
import { biasSizeOf, headlineSizeOf } from "../../src/sim/calibration";
import { expectShareWithin } from "./helpers";

describe("biasCheck on white noise: within [4%, 6%] at 5% (4,000 replications a length)", () => {
  for (const [n, seed] of [
    [25, 401],
    [52, 402],
    [104, 403],
  ] as const) {
    it(`n ${n}`, () => {
      const share = biasSizeOf({ n, law: "normal", options: {}, replications: 4000, seed });
      expectShareWithin(share, 4000, 0.04, 0.06, `bias check on noise, n ${n}`);
    }, 3_600_000);
  }
});

describe("seriesHeadline on pure noise and on clustered volatility (1,000 replications a cell)", () => {
  it("normal noise, n 104: structure and bias each within [3.5%, 6.5%]", () => {
    const result = headlineSizeOf({
      n: 104,
      law: "normal",
      options: {},
      replications: 1000,
      seed: 411,
    });
    expectShareWithin(result.structure, 1000, 0.035, 0.065, "headline structure, normal n 104");
    expectShareWithin(result.biased, 1000, 0.035, 0.065, "headline biased, normal n 104");
    expectShareWithin(result.either, 1000, 0, 0.11, "headline with any finding, normal n 104");
  }, 3_600_000);

  it("GARCH(1,1) residuals, n 260: the robust reading keeps structure within [3%, 7.5%]", () => {
    const result = headlineSizeOf({
      n: 260,
      law: "garch",
      options: {},
      replications: 1000,
      seed: 412,
    });
    expectShareWithin(result.structure, 1000, 0.03, 0.075, "headline structure, GARCH n 260");
    expectShareWithin(result.switched, 1000, 0.3, 1, "robust reading chosen, GARCH n 260");
  }, 3_600_000);
});

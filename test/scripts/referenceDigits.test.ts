/**
 * The computed columns of test/fixtures/ come from their committed generator
 * (scripts/referenceDigits.ts, written out by scripts/generate-fixture-digits.ts): regenerating
 * each file in memory gives the committed file byte for byte, and the generator's evaluation is
 * checked where the definition has a closed form.
 */
import { describe, expect, it } from "vitest";
import {
  chiSquareCritical,
  chiSquareTable,
  High,
  lewTable,
  lowerGammaRatio,
  normalQuantileAbove,
  normalQuantileTable,
} from "../../scripts/referenceDigits";
import { fixtureText, readStrdText } from "../helpers/fixtures";

describe("scripts/referenceDigits.ts regenerates the committed fixtures", () => {
  it("chiSquareTable(chisq-table.tsv) gives the committed file (ours_30sig, printed_ok)", () => {
    const committed = fixtureText("chisq-table.tsv");
    expect(chiSquareTable(committed)).toBe(committed);
  }, 120_000);

  it("normalQuantileTable(normal-quantiles.tsv) gives the committed file (ours_50sig, printed_ok)", () => {
    const committed = fixtureText("normal-quantiles.tsv");
    expect(normalQuantileTable(committed)).toBe(committed);
  }, 120_000);

  it("lewTable(lew-acf-ehandbook.tsv, Lew.dat) gives the committed file (exact_r_k, matches_rounding)", () => {
    const committed = fixtureText("lew-acf-ehandbook.tsv");
    expect(lewTable(committed, readStrdText("Lew").map(BigInt))).toBe(committed);
  }, 120_000);
});

describe("the generator's evaluation where the definition has a closed form", () => {
  type HighNumber = InstanceType<typeof High>;
  /** Relative difference below 1e-100: 10 digits short of the working precision. */
  function expectAgree(ours: HighNumber, closed: HighNumber, what: string): void {
    const relative = ours.minus(closed).abs().dividedBy(closed.abs());
    expect(relative.lt("1e-100"), `${what}: ours ${ours}, closed form ${closed}`).toBe(true);
  }

  it("lowerGammaRatio(1, y) is 1 − e^(−y) to 100 digits", () => {
    // The exponential law: P(1, y) = 1 − e^(−y) (Abramowitz & Stegun 6.5.13 with a = 1).
    for (const y of ["0.001", "1", "7.5", "30"]) {
      const closed = new High(1).minus(new High(y).negated().exp());
      expectAgree(lowerGammaRatio(new High(1), new High(y)), closed, `P(1, ${y})`);
    }
  });

  it("chiSquareCritical(2, p) is −2·ln p to 100 digits", () => {
    // χ² with 2 df is exponential with mean 2, so its upper-tail-p critical value is −2 ln p.
    for (const p of ["0.05", "0.01"]) {
      const closed = new High(p).ln().times(-2);
      expectAgree(chiSquareCritical(2, p), closed, `χ²₂ critical value at ${p}`);
    }
  });

  it("normalQuantileAbove(p) at Φ(1) = ½ + ½·erf(1/√2) returns 1", () => {
    // P(½, z²/2) = erf(z/√2) (A&S 6.5.17 with 7.1.1); at z = 1 the series value itself is the
    // reference, so this checks the inversion: the quantile of Φ(1) is 1 to 100 digits.
    const half = new High("0.5");
    const p = half.plus(half.times(lowerGammaRatio(half, half))).toPrecision(110);
    expectAgree(normalQuantileAbove(p), new High(1), "z at Φ(1)");
  });
});

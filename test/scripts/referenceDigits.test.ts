/**
 * The computed columns of test/fixtures/ come from their committed generator
 * (scripts/referenceDigits.ts and scripts/derivedDigits.ts, written out by
 * scripts/generate-fixture-digits.ts): regenerating each file in memory gives the committed file
 * byte for byte, and the generator's evaluation is checked where the definition has a closed form.
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
import { chiSquareTail, derivedTable, durbinLevinson } from "../../scripts/derivedDigits";
import { fixtureText, readColumnCsv, readStrdText } from "../helpers/fixtures";

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

  it("derivedTable(series-f.csv) gives the committed derived-values.tsv", () => {
    const seriesF = Array.from(readColumnCsv("series-f.csv").values, (v) => BigInt(v));
    expect(derivedTable(seriesF)).toBe(fixtureText("derived-values.tsv"));
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

  it("chiSquareTail(x, 2) is e^(−x/2) to 45 digits down to 1e−60", () => {
    // χ² with 2 df is exponential with mean 2: Q(1, x/2) = e^(−x/2) (A&S 6.5.13 with a = 1).
    // As 1 − P it loses −log10 Q of the 110 digits; at its floor of 1e−60, 50 remain.
    for (const x of ["0.5", "24", "150", "270"]) {
      const closed = new High(x).dividedBy(-2).exp();
      const relative = chiSquareTail(new High(x), 2).minus(closed).abs().dividedBy(closed);
      expect(relative.lt("1e-45"), `χ²₂ upper tail at ${x}: relative ${relative}`).toBe(true);
    }
    expect(() => chiSquareTail(new High(300), 2)).toThrow(/too far out/);
  });

  it("durbinLevinson(MA(1) correlations) gives −(−θ)^k(1 − θ²)/(1 − θ^{2(k+1)}) to 100 digits", () => {
    // The MA(1) partials in closed form (Box, Jenkins & Reinsel, ch. 3), θ = 0.5: ρ_1 = 0.4.
    const theta = new High("0.5");
    const rho = [new High(1), new High("0.4"), ...Array.from({ length: 6 }, () => new High(0))];
    durbinLevinson(rho).forEach((phi, i) => {
      const k = i + 1;
      const closed = theta
        .negated()
        .pow(k)
        .negated()
        .times(new High(1).minus(theta.pow(2)))
        .dividedBy(new High(1).minus(theta.pow(2 * (k + 1))));
      expectAgree(phi, closed, `MA(1) φ_${k}${k}`);
    });
  });

  it("normalQuantileAbove(p) at Φ(1) = ½ + ½·erf(1/√2) returns 1", () => {
    // P(½, z²/2) = erf(z/√2) (A&S 6.5.17 with 7.1.1); at z = 1 the series value itself is the
    // reference, so this checks the inversion: the quantile of Φ(1) is 1 to 100 digits.
    const half = new High("0.5");
    const p = half.plus(half.times(lowerGammaRatio(half, half))).toPrecision(110);
    expectAgree(normalQuantileAbove(p), new High(1), "z at Φ(1)");
  });
});

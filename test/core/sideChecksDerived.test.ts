/**
 * The side checks against values derived from published definitions and data:
 * test/fixtures/derived-values.tsv, each value evaluated with decimal.js at 110 digits by
 * scripts/derivedDigits.ts (`npm run fixtures`) and kept to 15 significant digits, the definition
 * named beside each check; the NIST e-Handbook's printed coin example for the runs test, and the
 * Benjamini–Hochberg worked example (from memory).
 *
 * Tolerances, from what double precision allows (unit roundoff u = 1.1e−16): the fixture's
 * rounding to 15 digits is at most 5e−15 relative, and each statistic is a few compensated sums
 * over at most 70 values, a small least-squares fit or a few divisions and roots, within a few
 * tens of u (measured: at most 1.5e−14, for Engle's LM at q = 1, whose R² of 0.0018 is a
 * difference). So a statistic must agree to STATISTIC (relative 1e−13); a p-value magnifies that
 * by the χ² tail's condition number x·f(x)/Q(x), under 10 here, so P_VALUE is relative 1e−12.
 */
import { describe, expect, it } from "vitest";
import {
  benjaminiHochberg,
  biasCheck,
  forecastAudit,
  laterLagsTest,
  lagTable,
  leastSquares,
  normalityCheck,
  runsCheck,
  runsTest,
  seriesFromNumbers,
  seriesFromValues,
  volatilityCheck,
  autocorrelation,
} from "../../src/core";
import { solveLinear } from "../../scripts/derivedDigits";
import { Exact, exactOfDouble, type ExactNumber } from "../helpers/exact";
import { expectClose } from "../helpers/expectClose";
import { derivedValue, readSeriesF } from "../helpers/fixtures";

/** Relative, for a statistic (see the header). */
const STATISTIC = { rel: 1e-13 } as const;
/** Relative, for a p-value (see the header). */
const P_VALUE = { rel: 1e-12 } as const;

const seriesF = seriesFromNumbers(readSeriesF(), "yield");
const oneToFive = seriesFromNumbers([1, 2, 3, 4, 5]);

describe("volatilityCheck(Series F): Engle's LM test (derived from series-f.csv with Engle's 1982 formula, T = n − q)", () => {
  // T·R² of s_t = d_t² on 1, s_{t−1}, …, s_{t−q}, R² = 1 − RSS/TSS about the mean, β from the
  // normal equations, and the χ²_q upper tail: derived-values.tsv seriesF.engleLm.q, engleP.q.
  it("q = 1 gives T·R² = 0.122090191469692 over 69 rows, p 0.726778472775317", () => {
    const check = volatilityCheck(seriesF, { lags: 1 });
    expect(check.rows, "Series F q = 1: rows T = n − q").toBe(69);
    expectClose(check.lm, derivedValue("seriesF.engleLm.1"), STATISTIC, "Series F LM(q = 1)");
    expectClose(check.p, derivedValue("seriesF.engleP.1"), P_VALUE, "Series F LM(q = 1) p");
    expect(check.df, "df = q").toBe(1);
  });

  it("q = 4 gives T·R² = 5.60329977538057 over 66 rows, p 0.230797463552424", () => {
    const check = volatilityCheck(seriesF, { lags: 4 });
    expect(check.rows, "Series F q = 4: rows T = n − q").toBe(66);
    expectClose(check.lm, derivedValue("seriesF.engleLm.4"), STATISTIC, "Series F LM(q = 4)");
    expectClose(check.p, derivedValue("seriesF.engleP.4"), P_VALUE, "Series F LM(q = 4) p");
  });

  it("q = 5 reports McLeod–Li Q(5) = 4.62740364258968, p 0.463020286169123 beside the LM test", () => {
    // Derived from Series F: Ljung–Box on the squared deviations (McLeod & Li 1983), χ²_5:
    // derived-values.tsv seriesF.mcleodLiQ.5, seriesF.mcleodLiP.5.
    const check = volatilityCheck(seriesF, { lags: 5 });
    const q = derivedValue("seriesF.mcleodLiQ.5");
    expectClose(check.mcleodLiQ, q, STATISTIC, "Series F McLeod–Li Q(5)");
    const p = derivedValue("seriesF.mcleodLiP.5");
    expectClose(check.mcleodLiP, p, P_VALUE, "Series F McLeod–Li p(5)");
  });

  it("q = 2 gives T·R² = 0.710706731243737, p 0.700925716390424", () => {
    const check = volatilityCheck(seriesF, { lags: 2 });
    expectClose(check.lm, derivedValue("seriesF.engleLm.2"), STATISTIC, "Series F LM(q = 2)");
    expectClose(check.p, derivedValue("seriesF.engleP.2"), P_VALUE, "Series F LM(q = 2) p");
  });
});

describe("biasCheck: Newey–West long-run variance (derived with Newey & West's 1987 formula)", () => {
  it("biasCheck(1..5, hacLags 1) gives LRV = 2.8 and Var(x̄) = 0.56", () => {
    const check = biasCheck(oneToFive, { hacLags: 1 });
    expectClose(check.longRunVariance, 2.8, { rel: 1e-14 }, "1..5 LRV(L = 1)");
    expectClose(check.se ** 2, 0.56, { rel: 1e-14 }, "1..5 Var(x̄)(L = 1)");
    expectClose(check.t, 3 / Math.sqrt(0.56), { rel: 1e-14 }, "1..5 t = x̄/se");
  });

  it("biasCheck(Series F, hacLags 3) gives LRV 89.0231049562682 and se 1.12772276833999", () => {
    // Derived from series-f.csv: LRV = γ̂_0 + 2Σ_{j≤3} (1 − j/4) γ̂_j, se = √(LRV/n)
    // (derived-values.tsv seriesF.neweyWestLrv.3, seriesF.neweyWestSe.3).
    const check = biasCheck(seriesF, { hacLags: 3 });
    const lrv = derivedValue("seriesF.neweyWestLrv.3");
    expectClose(check.longRunVariance, lrv, STATISTIC, "Series F LRV(L = 3)");
    expectClose(
      check.se,
      derivedValue("seriesF.neweyWestSe.3"),
      STATISTIC,
      "Series F se(x̄)(L = 3)",
    );
    expect(check.hacLags).toBe(3);
  });

  it("biasCheck(Series F) defaults to L = ⌊4(70/100)^{2/9}⌋ = 3", () => {
    // The default rule ⌊4(n/100)^{2/9}⌋ is from memory (Newey & West 1994's preliminary lag).
    expect(biasCheck(seriesF).hacLags).toBe(3);
    expect(biasCheck(seriesF).longRunVariance).toBe(
      biasCheck(seriesF, { hacLags: 3 }).longRunVariance,
    );
  });

  it("biasCheck(hacLags 0) is the plain standard error √(γ̂_0/n)", () => {
    const check = biasCheck(seriesF, { hacLags: 0 });
    const gamma0 = autocorrelation(seriesF, 0).autocovariance[0] as number;
    expectClose(check.se, Math.sqrt(gamma0 / 70), { rel: 1e-14 }, "Series F se(L = 0)");
  });
});

describe("runs about the median (Wald & Wolfowitz 1940; NIST e-Handbook §1.3.5.13)", () => {
  it("runsTest(the coin example) counts 9 runs of 11 heads and 9 tails, Z = −0.882303091205556", () => {
    // Printed (NIST/SEMATECH e-Handbook §1.3.5.13): H H T T H T H H H H T H H T T T T T H H has
    // 9 runs, 11 heads, 9 tails; R̄ = 10.9; s_R and Z derived with the printed formula
    // (derived-values.tsv coin.runsSd, coin.runsZ).
    const coin = "HHTTHTHHHHTHHTTTTTHH".split("").map((c) => c === "H");
    const result = runsTest(coin);
    expect([result.runs, result.above, result.below], "runs, heads, tails").toEqual([9, 11, 9]);
    expectClose(result.expected, 10.9, { rel: 1e-14 }, "coin R̄");
    expectClose(result.sd, derivedValue("coin.runsSd"), STATISTIC, "coin s_R");
    expectClose(result.z, derivedValue("coin.runsZ"), STATISTIC, "coin Z");
  });

  it("runsCheck(series) counts runs about the median, leaving out values equal to it", () => {
    // By hand: median of (1, 5, 2, 6, 3, 7, 4) is 4; signs − + − + − + (4 left out): 6 runs of 3 and 3.
    const result = runsCheck(seriesFromNumbers([1, 5, 2, 6, 3, 7, 4]));
    expect([result.median, result.runs, result.above, result.below]).toEqual([4, 6, 3, 3]);
  });

  it("runsCheck(series with a gap) lets the gap neither end nor start a run", () => {
    const withGap = runsCheck(seriesFromValues([1, 2, null, 3, 10, 11, 12]));
    // median of 1, 2, 3, 10, 11, 12 is 6.5: − − | − + + + → 2 runs.
    expect(withGap.runs).toBe(2);
  });
});

describe("normalityCheck: Jarque–Bera (derived with Jarque & Bera's formula)", () => {
  it("normalityCheck(1..5) gives JB = 0.352083333333333", () => {
    // (n/6)(S² + (K − 3)²/4) with S = 0, K = 1.7: derived-values.tsv oneToFive.jarqueBera.
    const check = normalityCheck(oneToFive);
    expectClose(check.jb, derivedValue("oneToFive.jarqueBera"), STATISTIC, "1..5 JB");
    expectClose(check.skewness, 0, { abs: 1e-15 }, "1..5 skewness");
    expectClose(check.kurtosis, 1.7, { rel: 1e-14 }, "1..5 kurtosis");
    expectClose(check.p, Math.exp(-check.jb / 2), { rel: 1e-13 }, "1..5 p = e^{−JB/2}");
  });

  it("normalityCheck(Series F) gives S = −0.0738236265819983, K = 3.02509626335988, JB = 0.0654194735877135", () => {
    // Derived from series-f.csv: S = m₃/m₂^{3/2}, K = m₄/m₂², m_j = Σ d^j/n
    // (derived-values.tsv seriesF.skewness, seriesF.kurtosis, seriesF.jarqueBera).
    const check = normalityCheck(seriesF);
    expectClose(check.skewness, derivedValue("seriesF.skewness"), STATISTIC, "Series F skewness");
    expectClose(check.kurtosis, derivedValue("seriesF.kurtosis"), STATISTIC, "Series F kurtosis");
    expectClose(check.jb, derivedValue("seriesF.jarqueBera"), STATISTIC, "Series F JB");
  });
});

describe("Benjamini–Hochberg across series (the 15 p-values of the 1995 worked example, from memory)", () => {
  it("benjaminiHochberg(the example) gives q 0.0015, 0.003, 0.0095, 0.035625 and keeps 4 at 0.05, as batchCheck counts", () => {
    // From memory: Benjamini & Hochberg (1995) worked example; BH rejects 4 at 0.05.
    const p = [
      0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719,
      0.6528, 0.759, 1,
    ];
    const q = benjaminiHochberg(p);
    [0.0015, 0.003, 0.0095, 0.035625].forEach((value, i) => {
      expectClose(q[i] as number, value, { rel: 1e-12 }, `BH q-value ${i + 1}`);
    });
    // batchCheck flags a series when its q-value is at most alpha (the BH step-up rule).
    expect(Array.from(q).filter((v) => v <= 0.05).length, "BH rejections at 0.05").toBe(4);
  });
});

describe("forecastAudit and its joint test of later lags", () => {
  it("laterLagsTest(r, n, 1) is exactly Ljung–Box: Series F Q(10) = 21.5915487230517, p 0.0173261341886925", () => {
    // Derived from Series F with Q = n(n+2)Σ r_k²/(n−k) (Ljung & Box 1978) and its χ²_10 tail
    // (derived-values.tsv seriesF.ljungBoxQ.10, seriesF.ljungBoxP.10).
    const ac = autocorrelation(seriesF, 10);
    const test = laterLagsTest(ac.correlation, ac.n, 1);
    const q = derivedValue("seriesF.ljungBoxQ.10");
    expectClose(test.q, q, STATISTIC, "Series F later-lags test h = 1, Q(10)");
    const p = derivedValue("seriesF.ljungBoxP.10");
    expectClose(test.p, p, P_VALUE, "Series F later-lags test h = 1, p");
    expectClose(
      test.q,
      lagTable(seriesF, { maxLag: 10 }).joint.q,
      { rel: 1e-12 },
      "same as lagTable",
    );
  });

  it("laterLagsTest(h = 2) weighs lags by Bartlett's MA(1) covariance: equals the quadratic form evaluated exactly", () => {
    // High-precision evaluation (decimal.js) of the published covariance under an MA(h−1) null
    // (Bartlett 1946): C = [c_{l−k}], c_0 = 1 + 2r₁², c_1 = 2r₁, c_2 = r₁²; Q = r̃ᵀC⁻¹r̃.
    const K = 6;
    const ac = autocorrelation(seriesF, K);
    const n = ac.n;
    const r1 = exactOfDouble(ac.correlation[1] as number);
    const c = [new Exact(1).plus(r1.pow(2).times(2)), r1.times(2), r1.pow(2)];
    const lags = [2, 3, 4, 5, 6];
    const matrix = lags.map((k) => lags.map((l) => c[Math.abs(k - l)] ?? new Exact(0)));
    const scaled = lags.map((k) =>
      exactOfDouble(ac.correlation[k] as number).times(
        new Exact(n * (n + 2)).dividedBy(n - k).sqrt(),
      ),
    );
    const x = solveLinear(matrix, scaled);
    const q = scaled.reduce((s, v, i) => s.plus(v.times(x[i] as ExactNumber)), new Exact(0));
    const test = laterLagsTest(ac.correlation, n, 2);
    expectClose(test.q, q.toNumber(), { rel: 1e-12 }, "Series F later-lags test h = 2, K = 6");
    expect(test.df).toBe(5);
  });

  it("forecastAudit(Series F, horizon 3) uses the long-run variance over lags 0..h−1 and judges lags 3..12 only", () => {
    const audit = forecastAudit(seriesF, { horizon: 3 });
    expect(audit.bias.horizon).toBe(3);
    expect(audit.maxLag, "K = h − 1 + min(10, ⌊70/5⌋)").toBe(12);
    expect(audit.rows.filter((r) => !r.counted).map((r) => r.lag)).toEqual([1, 2]);
    expect(audit.falseAlarm.tested).toBe(10);
    // Series F's r₁ = −0.39 is far outside its band but lies below the horizon: not counted.
    expect(audit.rows[0]?.crossesBand).toBe(false);
    expect(audit.dependence.word).toBe("clear");
    expect(audit.dependence.reason).toMatch(/over lags 3–12/);
  });

  it("forecastAudit(horizon 1) judges as the noise check with Bartlett bands", () => {
    const audit = forecastAudit(seriesF, { horizon: 1 });
    const table = lagTable(seriesF, { bandKind: "bartlett" });
    expect(audit.dependence.word).toBe(table.verdict.word);
    expectClose(
      audit.dependenceTest.p,
      table.joint.p,
      { rel: 1e-12 },
      "audit h = 1 joint p vs Ljung–Box",
    );
    audit.rows.forEach((row, i) => {
      expectClose(
        row.band,
        table.rows[i]?.band ?? NaN,
        { rel: 1e-14 },
        `audit h = 1 band at lag ${i + 1}`,
      );
    });
  });
});

describe("leastSquares(design, rows, columns, y)", () => {
  it("recovers an exact quadratic y = 2 + 3x − x² and a zero residual", () => {
    // Constructed: an exactly representable polynomial (no outside source needed).
    const xs = [-3, -1, 0, 2, 5, 7];
    const design = [...xs.map(() => 1), ...xs, ...xs.map((x) => x * x)];
    const y = xs.map((x) => 2 + 3 * x - x * x);
    const fit = leastSquares(design, xs.length, 3, y);
    [2, 3, -1].forEach((b, j) =>
      expectClose(fit.coefficients[j] as number, b, { abs: 1e-12 }, `β_${j}`),
    );
    expectClose(fit.residualSumSquares, 0, { abs: 1e-20 }, "RSS");
  });

  it("does not mutate its inputs", () => {
    const design = new Float64Array([1, 1, 1, 1, 2, 4]);
    const y = new Float64Array([1, 2, 2]);
    leastSquares(design, 3, 2, y);
    expect(Array.from(design)).toEqual([1, 1, 1, 1, 2, 4]);
    expect(Array.from(y)).toEqual([1, 2, 2]);
  });
});

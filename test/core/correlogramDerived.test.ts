/**
 * The lag table, its tests and the distribution tails against values derived from published
 * definitions and data: test/fixtures/derived-values.tsv, each value evaluated with decimal.js at
 * 110 digits by scripts/derivedDigits.ts (`npm run fixtures`) and kept to 15 significant digits,
 * the definition named beside each check. Also the printed Holton exercise, the
 * Benjamini–Hochberg worked example (from memory) and the theoretical ACF/PACF of AR(1), MA(1)
 * and AR(2) processes.
 *
 * Tolerances, from what double precision allows (unit roundoff u = 1.1e−16): the fixture's
 * rounding to 15 digits is at most 5e−15 relative; each statistic here is a few compensated sums
 * over 70 values and a few divisions and roots, which stay within a few tens of u (measured: at
 * most 1.5e−14). So a statistic must agree to STATISTIC (relative 1e−13). A partial
 * autocorrelation is a difference of order-one terms (|φ_kk| ≤ 1), so its error is absolute:
 * PARTIAL (1e−14 absolute). A p-value magnifies the statistic's relative error by the χ² tail's
 * condition number x·f(x)/Q(x), about 10 here and under 100 in the far tails checked, so
 * P_VALUE is relative 1e−12.
 */
import { describe, expect, it } from "vitest";
import {
  benjaminiHochberg,
  binomialUpperTail,
  chiSquareUpperTail,
  cumulativeJointTest,
  holmAdjust,
  isPValueBound,
  lagTable,
  normalQuantile,
  normalUpperTail,
  P_VALUE_FLOOR,
  partialAutocorrelation,
  robustVariances,
  autocorrelation,
  seriesFromNumbers,
} from "../../src/core";
import { expectClose, expectWithin } from "../helpers/expectClose";
import { derivedValue, readSeriesF, readTsv } from "../helpers/fixtures";

/** Relative, for a statistic (see the header). */
const STATISTIC = { rel: 1e-13 } as const;
/** Absolute, for a partial autocorrelation or a correlation (see the header). */
const PARTIAL = { abs: 1e-14 } as const;
/** Relative, for a p-value or a tail probability (see the header). */
const P_VALUE = { rel: 1e-12 } as const;

const seriesF = seriesFromNumbers(readSeriesF(), "yield");

describe("Series F derived values (derived from series-f.csv with the published formulas)", () => {
  it("lagTable(Series F) gives the Durbin–Levinson partials φ_11..φ_66", () => {
    // Derived from Series F with the Durbin–Levinson recursion (Levinson 1947; Durbin 1960)
    // on r_k = Σ d_t d_{t−k} / Σ d_t²: derived-values.tsv seriesF.partial.k.
    const table = lagTable(seriesF, { maxLag: 6 });
    for (let k = 1; k <= 6; k++) {
      expectClose(
        table.rows[k - 1]?.partial ?? NaN,
        derivedValue(`seriesF.partial.${k}`),
        PARTIAL,
        `Series F φ_${k}${k}`,
      );
    }
  });

  it("lagTable(Series F, bartlett) gives se_1..se_6 with the sum stopping at k−1", () => {
    // Derived from Series F with Bartlett's (1946) formula se_k = √((1 + 2Σ_{j<k} r_j²)/n):
    // derived-values.tsv seriesF.bartlettSe.k.
    const table = lagTable(seriesF, { maxLag: 6, bandKind: "bartlett" });
    for (let k = 1; k <= 6; k++) {
      expectClose(
        table.rows[k - 1]?.standardError ?? NaN,
        derivedValue(`seriesF.bartlettSe.${k}`),
        STATISTIC,
        `Series F Bartlett se_${k}`,
      );
    }
  });

  it("robustVariances(Series F) gives n·v̂_1..n·v̂_5", () => {
    // Derived from Series F with v̂_k = Σ_{t>k} d_t² d_{t−k}² / c0² (Taylor 1984; Lobato,
    // Nankervis & Savin 2001): derived-values.tsv seriesF.robustNv.k.
    const ac = autocorrelation(seriesF, 5);
    const v = robustVariances(ac, 5);
    const table = lagTable(seriesF, { maxLag: 5, bandKind: "robust" });
    for (let k = 1; k <= 5; k++) {
      const value = derivedValue(`seriesF.robustNv.${k}`);
      expectClose(70 * (v[k - 1] as number), value, STATISTIC, `Series F n·v̂_${k}`);
      // The robust band's standard error is √v̂_k.
      const se = table.rows[k - 1]?.standardError ?? NaN;
      expectClose(70 * se * se, value, STATISTIC, `Series F robust se_${k}² · n`);
    }
  });

  it("lagTable(Series F, robust) gives Q*(5) = 24.0859376217913 and p = 0.000209010515353692", () => {
    // Derived from Series F with the diagonal robust Q* = Σ r_k²/v̂_k (Lobato, Nankervis &
    // Savin 2001) and its χ²_5 upper tail Q(5/2, Q*/2): derived-values.tsv seriesF.robustQ.5,
    // seriesF.robustP.5.
    const { joint } = lagTable(seriesF, { maxLag: 5, testKind: "robust" });
    expectClose(joint.q, derivedValue("seriesF.robustQ.5"), STATISTIC, "Series F robust Q*(5)");
    expect(joint.df).toBe(5);
    expectClose(joint.p, derivedValue("seriesF.robustP.5"), P_VALUE, "Series F robust Q*(5) p");
  });

  it("lagTable(Series F) gives the cumulative Ljung–Box Q(1), Q(5), Q(10), Q(12) and p", () => {
    // Derived from Series F with Q = n(n+2)Σ r_k²/(n−k) (Ljung & Box 1978) and its χ²_k upper
    // tail: derived-values.tsv seriesF.ljungBoxQ.k, seriesF.ljungBoxP.k.
    const table = lagTable(seriesF, { maxLag: 12 });
    for (const k of [1, 5, 10, 12]) {
      const row = table.rows[k - 1];
      const q = derivedValue(`seriesF.ljungBoxQ.${k}`);
      expectClose(row?.jointQ ?? NaN, q, STATISTIC, `Series F Ljung–Box Q(${k})`);
      expect(row?.jointDf, `Series F Ljung–Box df at ${k}`).toBe(k);
      const p = derivedValue(`seriesF.ljungBoxP.${k}`);
      expectClose(row?.jointP ?? NaN, p, P_VALUE, `Series F Ljung–Box p(${k})`);
    }
  });

  it("lagTable(Series F, box-pierce) gives Q(10) = 20.4450074361762 and p = 0.0253137696344665", () => {
    // Derived from Series F with Q = nΣ r_k² (Box & Pierce 1970) and its χ²_10 upper tail:
    // derived-values.tsv seriesF.boxPierceQ.10, seriesF.boxPierceP.10.
    const { joint } = lagTable(seriesF, { maxLag: 10, testKind: "box-pierce" });
    const q = derivedValue("seriesF.boxPierceQ.10");
    expectClose(joint.q, q, STATISTIC, "Series F Box–Pierce Q(10)");
    const p = derivedValue("seriesF.boxPierceP.10");
    expectClose(joint.p, p, P_VALUE, "Series F Box–Pierce p(10)");
  });

  it("lagTable(Series F, squares) gives McLeod–Li Q(5) = 4.62740364258968 and p = 0.463020286169123", () => {
    // Derived from Series F: Ljung–Box on the squared deviations (McLeod & Li 1983), χ²_5:
    // derived-values.tsv seriesF.mcleodLiQ.5, seriesF.mcleodLiP.5.
    const { joint } = lagTable(seriesF, { maxLag: 5, testKind: "squares" });
    const q = derivedValue("seriesF.mcleodLiQ.5");
    expectClose(joint.q, q, STATISTIC, "Series F McLeod–Li Q(5)");
    expectClose(joint.p, derivedValue("seriesF.mcleodLiP.5"), P_VALUE, "Series F McLeod–Li p(5)");
  });

  it("lagTable(Series F, squares, fittedParams 2) keeps the McLeod–Li df at K", () => {
    // McLeod & Li (1983): the squares' test is not reduced by fitted ARMA parameters.
    const { joint } = lagTable(seriesF, { maxLag: 5, testKind: "squares", fittedParams: 2 });
    expect(joint.df).toBe(5);
    // Ljung & Box (1978): df = K − fitted ARMA parameters for the series itself.
    expect(lagTable(seriesF, { maxLag: 10, fittedParams: 2 }).joint.df).toBe(8);
  });
});

describe("Holton, Value-at-Risk, exercise 4.17 solution (printed)", () => {
  it("cumulativeJointTest(ljung-box, n 250, r 0.085 −0.027 0.109) gives Q ≈ 5.02 below 7.81", () => {
    // Source: Holton, Value-at-Risk, exercise 4.17 solution: Q = 5.02 against the χ²_3 5%
    // critical value 7.81; from the rounded r's the formula gives 5.0436, so ±0.06.
    const test = cumulativeJointTest({
      kind: "ljung-box",
      n: 250,
      correlation: [1, 0.085, -0.027, 0.109],
      fittedParams: 0,
    });
    const q = test.q[2] as number;
    expectClose(q, 5.02, { abs: 0.06 }, "Holton Q(3)");
    expect(q).toBeLessThan(7.81);
    // The printed critical value 7.81 (2 decimals) brackets the 5% upper tail of χ²_3.
    expectWithin(
      0.05,
      chiSquareUpperTail(7.815, 3),
      chiSquareUpperTail(7.805, 3),
      "χ²_3 at 7.81 ± 0.005",
    );
    expect(test.p[2] as number).toBeGreaterThan(0.05);
  });
});

describe("false-alarm chances (derived with the binomial upper tail)", () => {
  it("binomialUpperTail(m, K, 0.05) gives the chance of m or more chance crossings", () => {
    // Derived: Σ_{j≥m} C(K,j) α^j (1−α)^{K−j}, α = 0.05 (the double 0.05 is 5.6e−17 above it
    // relative, which moves the tail by at most K times that, far inside P_VALUE):
    // derived-values.tsv binomialTail.m.K.
    const cases = readTsv("derived-values.tsv")
      .map((row) => (row.key ?? "").split("."))
      .filter(([name]) => name === "binomialTail")
      .map(([, m, trials]) => [Number(m), Number(trials)] as const);
    expect(cases.length, "binomial cases in derived-values.tsv").toBe(7);
    for (const [m, trials] of cases) {
      expectClose(
        binomialUpperTail(m, trials, 0.05),
        derivedValue(`binomialTail.${m}.${trials}`),
        P_VALUE,
        `P(X ≥ ${m}), X ~ Bin(${trials}, 0.05)`,
      );
    }
  });

  it("binomialUpperTail keeps 0 and trials at their exact values", () => {
    // Definition: P(X ≥ 0) = 1, P(X ≥ K+1) = 0, P(X ≥ K) = α^K.
    expect(binomialUpperTail(0, 10, 0.05)).toBe(1);
    expect(binomialUpperTail(11, 10, 0.05)).toBe(0);
    expectClose(
      binomialUpperTail(10, 10, 0.05),
      0.05 ** 10,
      { rel: 1e-12 },
      "P(X ≥ 10), Bin(10, 0.05)",
    );
  });
});

describe("Benjamini & Hochberg (1995) worked example (from memory)", () => {
  // From memory: the 15 p-values of Benjamini & Hochberg's worked example.
  const pValues = [
    0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719,
    0.6528, 0.759, 1,
  ];

  it("benjaminiHochberg(p) rejects 4 at 0.05 with q = 0.0015, 0.003, 0.0095, 0.035625", () => {
    // From memory (BH worked example); the q-values are exact decimals of m·p_(i)/i.
    const q = benjaminiHochberg(pValues);
    [0.0015, 0.003, 0.0095, 0.035625].forEach((value, i) => {
      expectClose(q[i] as number, value, { rel: 1e-12 }, `BH q_(${i + 1})`);
    });
    expect(Array.from(q).filter((v) => v <= 0.05).length).toBe(4);
  });

  it("holmAdjust(p) and Bonferroni reject 3 at 0.05", () => {
    // From memory (BH worked example): Holm and Bonferroni both reject 3.
    const holm = holmAdjust(pValues);
    expect(Array.from(holm).filter((v) => v <= 0.05).length).toBe(3);
    // Bonferroni by its definition: reject p ≤ α/m.
    expect(pValues.filter((p) => p <= 0.05 / pValues.length).length).toBe(3);
    // Holm step-down, adjusted p_(i) = max_{j≤i} (m−j+1)p_(j): 15·0.0001, 14·0.0004, 13·0.0019.
    [0.0015, 0.0056, 0.0247].forEach((value, i) => {
      expectClose(holm[i] as number, value, { rel: 1e-12 }, `Holm adjusted p_(${i + 1})`);
    });
  });

  it("benjaminiHochberg(p) and holmAdjust(p) leave NaN out of the family and in place", () => {
    const withGap = [0.01, NaN, 0.04];
    const q = benjaminiHochberg(withGap);
    expect(Number.isNaN(q[1] as number)).toBe(true);
    // m = 2: q_(1) = min(2·0.01/1, 2·0.04/2) = 0.02, q_(2) = 0.04.
    expectClose(q[0] as number, 0.02, { rel: 1e-12 }, "BH q with a NaN, first");
    expectClose(q[2] as number, 0.04, { rel: 1e-12 }, "BH q with a NaN, last");
    expect(Number.isNaN(holmAdjust(withGap)[1] as number)).toBe(true);
  });
});

describe("distribution tails (derived in high precision from the published definitions)", () => {
  it("chiSquareUpperTail(x, df) gives the derived upper tails", () => {
    // Derived: Q(ν/2, x/2), the regularised upper incomplete gamma.
    expectClose(
      chiSquareUpperTail(3.841458820694124, 1),
      0.05,
      { rel: 1e-13 },
      "sf(3.8414588…; 1)",
    );
    expectClose(
      chiSquareUpperTail(18.307038053275146, 10),
      0.05,
      { rel: 1e-13 },
      "sf(18.307038…; 10)",
    );
    // Q(5, 25) and Q(10, 100): derived-values.tsv chiSquareTail.50.10, chiSquareTail.200.20.
    const near = derivedValue("chiSquareTail.50.10");
    expectClose(chiSquareUpperTail(50, 10), near, P_VALUE, "sf(50; 10)");
    const far = derivedValue("chiSquareTail.200.20");
    expectClose(chiSquareUpperTail(200, 20), far, P_VALUE, "sf(200; 20)");
  });

  it("normalUpperTail(8) gives Φᶜ(8) = 6.22096057427178e−16 directly, not as 1 − Φ", () => {
    // Derived: ½ erfc(8/√2) = ½(1 − P(½, 32)) in high precision (derived-values.tsv
    // normalTail.8); 1 − Φ(8) in double would be 6.7e−16 or 0.
    expectClose(normalUpperTail(8), derivedValue("normalTail.8"), P_VALUE, "Φᶜ(8)");
  });

  it("normalQuantile gives z_0.975 = 1.95996398454005 and z_0.995 = 2.57582930354890", () => {
    // Derived: normal-quantiles.tsv ours_50sig (Φ(z) = ½ + ½P(½, z²/2) inverted in decimal.js,
    // scripts/referenceDigits.ts); printed: Fisher 1925 Table 1 gives 1.959964.
    const ours = new Map(readTsv("normal-quantiles.tsv").map((row) => [row.p, row.ours_50sig]));
    expectClose(normalQuantile(0.975), Number(ours.get("0.975")), STATISTIC, "z_0.975");
    expectClose(normalQuantile(0.995), Number(ours.get("0.995")), STATISTIC, "z_0.995");
  });

  it("chiSquareUpperTail(x, df) reports a p below the smallest double as the bound 1e-300, never 0", () => {
    // The true value of sf(5000; 1) is about 1e−1088, below every double.
    const p = chiSquareUpperTail(5000, 1);
    expect(p).toBe(P_VALUE_FLOOR);
    expect(isPValueBound(p)).toBe(true);
    expect(isPValueBound(chiSquareUpperTail(200, 20))).toBe(false);
  });

  it("chiSquareUpperTail(x, df) is 1 at x ≤ 0 and NaN for df ≤ 0 or x NaN", () => {
    expect(chiSquareUpperTail(0, 3)).toBe(1);
    expect(Number.isNaN(chiSquareUpperTail(1, 0))).toBe(true);
    expect(Number.isNaN(chiSquareUpperTail(NaN, 3))).toBe(true);
  });
});

describe("theoretical ACF → partialAutocorrelation (Box, Jenkins & Reinsel, ch. 3)", () => {
  it("partialAutocorrelation(φ^k) of an AR(1) gives (φ, 0, 0, …)", () => {
    // Theory: AR(1) ρ_k = φ^k, partials φ at lag 1 and 0 beyond.
    for (const phi of [0.6, -0.8, 0.95]) {
      const rho = Array.from({ length: 11 }, (_, k) => phi ** k);
      const partials = partialAutocorrelation(rho);
      expectClose(partials[0] as number, phi, { abs: 1e-15 }, `AR(1) φ = ${phi}, φ_11`);
      for (let k = 2; k <= 10; k++) {
        expectClose(partials[k - 1] as number, 0, { abs: 1e-13 }, `AR(1) φ = ${phi}, φ_${k}${k}`);
      }
    }
  });

  it("partialAutocorrelation of an MA(1) θ = 0.5 gives 0.4, −0.190476…, 0.0941176…, −0.0469208…", () => {
    // Theory: MA(1) x_t = e_t + θe_{t−1}: ρ_1 = θ/(1+θ²) = 0.4, 0 beyond; partials by
    // Durbin–Levinson in decimal.js (derived-values.tsv ma1.partial.k).
    const rho = [1, 0.5 / 1.25, 0, 0, 0];
    const partials = partialAutocorrelation(rho);
    for (let k = 1; k <= 4; k++) {
      expectClose(
        partials[k - 1] as number,
        derivedValue(`ma1.partial.${k}`),
        PARTIAL,
        `MA(1) θ = 0.5, φ_${k}${k}`,
      );
    }
    // Closed form (Box, Jenkins & Reinsel): φ_kk = −(−θ)^k (1−θ²)/(1−θ^{2(k+1)}).
    for (let k = 1; k <= 4; k++) {
      const closed = (-((-0.5) ** k) * (1 - 0.25)) / (1 - 0.5 ** (2 * (k + 1)));
      expectClose(
        partials[k - 1] as number,
        closed,
        { rel: 1e-14 },
        `MA(1) closed-form φ_${k}${k}`,
      );
    }
  });

  it("partialAutocorrelation of an AR(2) (0.5, 0.3) gives (5/7, 0.3, 0, …)", () => {
    // Theory: Yule–Walker ρ_1 = φ1/(1−φ2), ρ_k = φ1ρ_{k−1} + φ2ρ_{k−2}, in decimal.js
    // (derived-values.tsv ar2.rho.k); partials (ρ_1, φ2, 0, …).
    const rho = [1, 0.5 / 0.7];
    for (let k = 2; k <= 8; k++)
      rho.push(0.5 * (rho[k - 1] as number) + 0.3 * (rho[k - 2] as number));
    for (let k = 1; k <= 3; k++) {
      expectClose(rho[k] as number, derivedValue(`ar2.rho.${k}`), PARTIAL, `AR(2) ρ_${k}`);
    }
    const partials = partialAutocorrelation(rho);
    expectClose(partials[0] as number, derivedValue("ar2.rho.1"), PARTIAL, "AR(2) φ_11");
    expectClose(partials[1] as number, 0.3, { abs: 1e-14 }, "AR(2) φ_22");
    for (let k = 3; k <= 8; k++) {
      expectClose(partials[k - 1] as number, 0, { abs: 1e-14 }, `AR(2) φ_${k}${k}`);
    }
  });
});

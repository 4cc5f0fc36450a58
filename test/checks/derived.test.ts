/**
 * The side checks against values derived from published definitions and data (METHODS.md in the
 * shared reference notes, "derived from <data> with the published formula" beside each), the
 * NIST e-Handbook's printed coin example for the runs test, and the Benjamini–Hochberg worked
 * example (from memory).
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
import { Exact, exactOfDouble, type ExactNumber } from "../helpers/exact";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";

/** Half a unit in the last decimal of a value printed with `decimals` decimals. */
const half = (decimals: number) => 0.5 * 10 ** -decimals;

const seriesF = seriesFromNumbers(readSeriesF(), "yield");
const oneToFive = seriesFromNumbers([1, 2, 3, 4, 5]);

describe("volatilityCheck(Series F): Engle's LM test (derived from series-f.csv with Engle's 1982 formula, T = n − q)", () => {
  it("q = 1 gives T·R² = 0.122090 over 69 rows, p 0.72678", () => {
    const check = volatilityCheck(seriesF, { lags: 1 });
    expect(check.rows, "Series F q = 1: rows T = n − q").toBe(69);
    expectClose(check.lm, 0.12209, { abs: half(6) }, "Series F LM(q = 1)");
    expectClose(check.p, 0.72678, { abs: half(5) }, "Series F LM(q = 1) p");
    expect(check.df, "df = q").toBe(1);
  });

  it("q = 4 gives T·R² = 5.603300 over 66 rows, p 0.23080", () => {
    const check = volatilityCheck(seriesF, { lags: 4 });
    expect(check.rows, "Series F q = 4: rows T = n − q").toBe(66);
    expectClose(check.lm, 5.6033, { abs: half(6) }, "Series F LM(q = 4)");
    expectClose(check.p, 0.2308, { abs: half(5) }, "Series F LM(q = 4) p");
  });

  it("q = 5 reports McLeod–Li Q(5) = 4.627404, p 0.46302 beside the LM test", () => {
    // Derived from Series F: Ljung–Box on the squared deviations (McLeod & Li 1983).
    const check = volatilityCheck(seriesF, { lags: 5 });
    expectClose(check.mcleodLiQ, 4.627404, { abs: half(6) }, "Series F McLeod–Li Q(5)");
    expectClose(check.mcleodLiP, 0.46302, { abs: half(5) }, "Series F McLeod–Li p(5)");
  });

  it("the LM equals T·R² of the same regression evaluated exactly (decimal.js, normal equations)", () => {
    // High-precision evaluation of Engle's published definition on Series F, q = 2: the normal
    // equations solved in 60-digit arithmetic, R² = 1 − RSS/TSS about the mean.
    const q = 2;
    const x = Array.from(readSeriesF(), exactOfDouble);
    const mean = x.reduce((s, v) => s.plus(v), new Exact(0)).dividedBy(x.length);
    const s = x.map((v) => v.minus(mean).pow(2));
    const rows: ExactNumber[][] = [];
    const y: ExactNumber[] = [];
    for (let t = q; t < s.length; t++) {
      rows.push([new Exact(1), s[t - 1] as ExactNumber, s[t - 2] as ExactNumber]);
      y.push(s[t] as ExactNumber);
    }
    const beta = solveNormalEquations(rows, y);
    const ybar = y.reduce((a, v) => a.plus(v), new Exact(0)).dividedBy(y.length);
    let rss = new Exact(0);
    let tss = new Exact(0);
    rows.forEach((row, i) => {
      const fit = row.reduce((a, v, j) => a.plus(v.times(beta[j] as ExactNumber)), new Exact(0));
      rss = rss.plus((y[i] as ExactNumber).minus(fit).pow(2));
      tss = tss.plus((y[i] as ExactNumber).minus(ybar).pow(2));
    });
    const exactLm = new Exact(1).minus(rss.dividedBy(tss)).times(rows.length).toNumber();
    expectClose(
      volatilityCheck(seriesF, { lags: q }).lm,
      exactLm,
      { rel: 1e-12 },
      "Series F LM(q = 2) vs exact",
    );
  });
});

describe("biasCheck: Newey–West long-run variance (derived with Newey & West's 1987 formula)", () => {
  it("biasCheck(1..5, hacLags 1) gives LRV = 2.8 and Var(x̄) = 0.56", () => {
    const check = biasCheck(oneToFive, { hacLags: 1 });
    expectClose(check.longRunVariance, 2.8, { rel: 1e-14 }, "1..5 LRV(L = 1)");
    expectClose(check.se ** 2, 0.56, { rel: 1e-14 }, "1..5 Var(x̄)(L = 1)");
    expectClose(check.t, 3 / Math.sqrt(0.56), { rel: 1e-14 }, "1..5 t = x̄/se");
  });

  it("biasCheck(Series F, hacLags 3) gives LRV 89.02310 and se 1.127723", () => {
    // Derived from series-f.csv.
    const check = biasCheck(seriesF, { hacLags: 3 });
    expectClose(check.longRunVariance, 89.0231, { abs: half(5) }, "Series F LRV(L = 3)");
    expectClose(check.se, 1.127723, { abs: half(6) }, "Series F se(x̄)(L = 3)");
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
  it("runsTest(the coin example) counts 9 runs of 11 heads and 9 tails, Z = −0.882303", () => {
    // Printed (NIST/SEMATECH e-Handbook §1.3.5.13): H H T T H T H H H H T H H T T T T T H H has
    // 9 runs, 11 heads, 9 tails; R̄ = 10.9, s_R = 2.153455 and Z derived with the printed formula.
    const coin = "HHTTHTHHHHTHHTTTTTHH".split("").map((c) => c === "H");
    const result = runsTest(coin);
    expect([result.runs, result.above, result.below], "runs, heads, tails").toEqual([9, 11, 9]);
    expectClose(result.expected, 10.9, { rel: 1e-14 }, "coin R̄");
    expectClose(result.sd, 2.153455, { abs: half(6) }, "coin s_R");
    expectClose(result.z, -0.882303, { abs: half(6) }, "coin Z");
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
  it("normalityCheck(1..5) gives JB = 0.3520833", () => {
    const check = normalityCheck(oneToFive);
    expectClose(check.jb, 0.3520833, { abs: half(7) }, "1..5 JB");
    expectClose(check.skewness, 0, { abs: 1e-15 }, "1..5 skewness");
    expectClose(check.kurtosis, 1.7, { rel: 1e-14 }, "1..5 kurtosis");
    expectClose(check.p, Math.exp(-check.jb / 2), { rel: 1e-13 }, "1..5 p = e^{−JB/2}");
  });

  it("normalityCheck(Series F) gives S = −0.073823627, K = 3.0250963, JB = 0.065419474", () => {
    // Derived from series-f.csv.
    const check = normalityCheck(seriesF);
    expectClose(check.skewness, -0.073823627, { abs: half(9) }, "Series F skewness");
    expectClose(check.kurtosis, 3.0250963, { abs: half(7) }, "Series F kurtosis");
    expectClose(check.jb, 0.065419474, { abs: half(9) }, "Series F JB");
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
  it("laterLagsTest(r, n, 1) is exactly Ljung–Box: Series F Q(10) = 21.59155, p 0.017326", () => {
    // Derived from Series F (Ljung & Box 1978): METHODS' Ljung–Box Q(10) and p.
    const ac = autocorrelation(seriesF, 10);
    const test = laterLagsTest(ac.correlation, ac.n, 1);
    expectClose(test.q, 21.59155, { abs: half(5) }, "Series F later-lags test h = 1, Q(10)");
    expectClose(test.p, 0.017326, { abs: half(6) }, "Series F later-lags test h = 1, p");
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

/** Solves A x = b in exact arithmetic by Gaussian elimination with partial pivoting. */
function solveLinear(
  a: readonly (readonly ExactNumber[])[],
  b: readonly ExactNumber[],
): ExactNumber[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i] as ExactNumber]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) {
      if ((m[r]?.[col] as ExactNumber).abs().gt((m[pivot]?.[col] as ExactNumber).abs())) pivot = r;
    }
    [m[col], m[pivot]] = [m[pivot] as ExactNumber[], m[col] as ExactNumber[]];
    const head = m[col] as ExactNumber[];
    for (let r = col + 1; r < n; r++) {
      const row = m[r] as ExactNumber[];
      const factor = (row[col] as ExactNumber).dividedBy(head[col] as ExactNumber);
      for (let c = col; c <= n; c++)
        row[c] = (row[c] as ExactNumber).minus(factor.times(head[c] as ExactNumber));
    }
  }
  const x: ExactNumber[] = new Array<ExactNumber>(n);
  for (let r = n - 1; r >= 0; r--) {
    const row = m[r] as ExactNumber[];
    let s = row[n] as ExactNumber;
    for (let c = r + 1; c < n; c++) s = s.minus((row[c] as ExactNumber).times(x[c] as ExactNumber));
    x[r] = s.dividedBy(row[r] as ExactNumber);
  }
  return x;
}

/** β from the normal equations XᵀX β = Xᵀy, in exact arithmetic. */
function solveNormalEquations(
  rows: readonly (readonly ExactNumber[])[],
  y: readonly ExactNumber[],
): ExactNumber[] {
  const p = rows[0]?.length ?? 0;
  const xtx = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) =>
      rows.reduce(
        (s, row) => s.plus((row[i] as ExactNumber).times(row[j] as ExactNumber)),
        new Exact(0),
      ),
    ),
  );
  const xty = Array.from({ length: p }, (_, i) =>
    rows.reduce(
      (s, row, t) => s.plus((row[i] as ExactNumber).times(y[t] as ExactNumber)),
      new Exact(0),
    ),
  );
  return solveLinear(xtx, xty);
}

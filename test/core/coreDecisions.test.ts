/**
 * The decisions the views only show, made once in the core: each lag's corridor zone and the
 * partials' z and zone, the joint test below alpha, the runs and normality flags at the request's
 * alpha, the sample-size cautions, the raw flags expected by chance across a batch or an audit,
 * and the options a batch or an audit resolved. Each expected value follows from the definition
 * written beside it, or from the runs test's published formula worked by hand.
 */
import { describe, expect, it } from "vitest";
import {
  auditBatch,
  auditBatchOf,
  auditEntry,
  batchCheck,
  batchOfResults,
  expectedFalseFlags,
  lagTable,
  mergeSeriesResults,
  normalityCheck,
  partialZ,
  runsCheck,
  sampleCautions,
  SMALL_SAMPLE,
  seriesFromNumbers,
  seriesResult,
  type Series,
} from "../../src/core";
import { corridorLevels, corridorZone } from "../../src/core/corridors";
import { sideChecks } from "../../src/report/sideChecks";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";

const seriesF = seriesFromNumbers(readSeriesF(), "yield");

/** The next double above a positive finite x. */
function nextUp(x: number): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  view.setBigUint64(0, view.getBigUint64(0) + 1n);
  return view.getFloat64(0);
}

describe("corridorZone(z, levels)", () => {
  // Definition (corridors.ts): strict comparisons, |z| > outer is beyond, |z| > inner between.
  const levels = corridorLevels(0.05, 10);

  it("keeps a z exactly on the inner corridor inside, and the next double above it between", () => {
    const inner = levels.innerLevel;
    expect(corridorZone(inner, levels)).toBe("inside");
    expect(corridorZone(-inner, levels)).toBe("inside");
    expect(corridorZone(nextUp(inner), levels)).toBe("between");
    expect(corridorZone(-nextUp(inner), levels)).toBe("between");
  });

  it("keeps a z exactly on the outer corridor between, and the next double above it beyond", () => {
    const outer = levels.outerLevel;
    expect(outer, "the outer corridor lies outside the inner one").toBeGreaterThan(
      levels.innerLevel,
    );
    expect(corridorZone(outer, levels)).toBe("between");
    expect(corridorZone(nextUp(outer), levels)).toBe("beyond");
    expect(corridorZone(-Infinity, levels)).toBe("beyond");
  });

  it("gives none for a NaN z (a lag with no pairs)", () => {
    expect(corridorZone(NaN, levels)).toBe("none");
    expect(corridorZone(0, levels)).toBe("inside");
  });
});

describe("lagTable(series) rows: zones, partial z and the joint test at alpha", () => {
  const table = lagTable(seriesF, { maxLag: 12 });
  const levels = { innerLevel: table.innerLevel, outerLevel: table.outerLevel };

  it("gives each row the zone its z and the table's corridors define, agreeing with beyond and outer", () => {
    for (const row of table.rows) {
      expect(row.zone, `lag ${row.lag}`).toBe(corridorZone(row.z, levels));
      const fromFlags = row.outer ? "beyond" : row.crossesBand ? "between" : "inside";
      expect(row.zone, `lag ${row.lag} flags`).toBe(fromFlags);
    }
    // Series F's lag 1 (r = −0.39, n = 70: z ≈ −3.26) lies past both corridors; a later lag does not.
    expect(table.rows[0]?.zone).toBe("beyond");
    expect(table.rows.some((row) => row.zone === "inside")).toBe(true);
  });

  it("gives each row the partial's z = φ_kk·√n and its zone against the same corridors", () => {
    // Definition: se of a sample partial under white noise is 1/√n (Quenouille 1949).
    for (const row of table.rows) {
      expect(row.partialZ, `lag ${row.lag}`).toBe(row.partial * Math.sqrt(table.n));
      expect(row.partialZone, `lag ${row.lag}`).toBe(corridorZone(row.partialZ, levels));
    }
    expect(partialZ(0.25, 64), "0.25·√64").toBe(2);
    expect(partialZ(NaN, 64)).toBeNaN();
  });

  it("marks the joint test below alpha by joint p < alpha, for the table and for each k", () => {
    for (const alpha of [0.05, 0.01]) {
      const at = lagTable(seriesF, { alpha });
      expect(at.jointBelowAlpha, `alpha ${alpha}`).toBe(at.joint.p < alpha);
      for (const row of at.rows) expect(row.jointBelowAlpha).toBe(row.jointP < alpha);
    }
    // Series F's Ljung–Box p over 10 lags lies between 0.01 and 0.05: both answers occur.
    expect(lagTable(seriesF, { alpha: 0.05 }).jointBelowAlpha).toBe(true);
    expect(lagTable(seriesF, { alpha: 0.01 }).jointBelowAlpha).toBe(false);
  });
});

describe("runsCheck and normalityCheck flag at the request's alpha", () => {
  // Worked by hand with the runs test's formula (Wald & Wolfowitz 1940; NIST/SEMATECH e-Handbook
  // §1.3.5.13): (1, 5, 2, 6, 3, 7, 4) about its median 4 has 6 runs of 3 above and 3 below,
  // R̄ = 2·3·3/6 + 1 = 4, s_R² = 2·9·(18 − 6)/(36·5) = 1.2, Z = 2/√1.2 = 1.8257419,
  // two-sided p = erfc(Z/√2) = 0.0678892.
  const alternating = seriesFromNumbers([1, 5, 2, 6, 3, 7, 4]);

  it("runsCheck(p 0.0679) does not flag at the default 0.05 and flags at 0.1", () => {
    const plain = runsCheck(alternating);
    expectClose(plain.z, 1.8257419, { abs: 5e-8 }, "runs Z of the alternating series");
    expectClose(plain.p, 0.0678892, { abs: 5e-8 }, "runs p of the alternating series");
    expect([plain.alpha, plain.flagged]).toEqual([0.05, false]);
    expect(runsCheck(alternating, { alpha: 0.1 }).flagged).toBe(true);
  });

  it("runsCheck with alpha equal to its own p does not flag (p < alpha is strict)", () => {
    const { p } = runsCheck(alternating);
    expect(runsCheck(alternating, { alpha: p }).flagged).toBe(false);
  });

  it("normalityCheck(1..5) (p = e^{−0.352083/2} = 0.83858) flags only at an alpha above its p", () => {
    // Jarque & Bera's JB of 1..5 is 0.3520833 (test/core/sideChecksDerived.test.ts); χ²₂'s tail is e^{−JB/2}.
    const oneToFive = seriesFromNumbers([1, 2, 3, 4, 5]);
    const plain = normalityCheck(oneToFive);
    expect([plain.alpha, plain.flagged]).toEqual([0.05, false]);
    expect(normalityCheck(oneToFive, { alpha: 0.9 }).flagged).toBe(true);
    expect(normalityCheck(oneToFive, { alpha: plain.p }).flagged).toBe(false);
  });

  it("runsCheck and normalityCheck refuse an alpha outside (0, 1) as every check does", () => {
    expect(() => runsCheck(alternating, { alpha: 1 })).toThrow(/alpha must be a number/);
    expect(() => normalityCheck(alternating, { alpha: 0 })).toThrow(/alpha must be a number/);
  });

  it("sideChecks(series, table) runs both at the lag table's alpha", () => {
    const side = sideChecks(seriesF, lagTable(seriesF, { alpha: 0.1 }));
    for (const check of [side.runs, side.normality]) {
      if (typeof check === "string") throw new Error(`not computed: ${check}`);
      expect(check.alpha).toBe(0.1);
      expect(check.flagged).toBe(check.p < 0.1);
    }
  });
});

describe("sampleCautions(n, maxLag, word)", () => {
  // Definitions (sampleCautions.ts): small below 50 values, many lags above n/5 unless short;
  // both thresholds are common practice (no source).
  it("holds at the thresholds themselves: n = 50 is not small, K = n/5 is not many", () => {
    expect(SMALL_SAMPLE).toBe(50);
    expect(sampleCautions(50, 10, "clear")).toEqual({
      smallSample: false,
      manyLags: false,
      manyLagsLimit: 10,
    });
    expect(sampleCautions(49, 10, "clear").smallSample).toBe(true);
    expect(sampleCautions(49, 10, "clear").manyLags).toBe(true);
  });

  it("leaves the many-lags caution to a verdict that is not short", () => {
    expect(sampleCautions(40, 12, "short").manyLags).toBe(false);
    expect(sampleCautions(40, 9, "watch")).toEqual({
      smallSample: true,
      manyLags: true,
      manyLagsLimit: 8,
    });
  });

  it("is what lagTable(series) carries for its n, K and verdict", () => {
    for (const maxLag of [10, 16]) {
      const table = lagTable(seriesF, { maxLag });
      expect(table.cautions).toEqual(sampleCautions(table.n, maxLag, table.verdict.word));
    }
    // Series F: n = 70, so 16 lags exceed n/5 = 14 and 10 do not.
    expect(lagTable(seriesF, { maxLag: 16 }).cautions.manyLags).toBe(true);
    expect(lagTable(seriesF, { maxLag: 10 }).cautions.manyLags).toBe(false);
  });
});

/** 12 series of 40–62 values, noise and AR(1) φ 0.5, and one constant that cannot be analysed. */
function someSeries(): Series[] {
  const random = seededRandom(13_07);
  const list = Array.from({ length: 12 }, (_, i) => {
    const n = 40 + 2 * i;
    return seriesFromNumbers(
      i % 4 === 0 ? ar1(random, n, 0.5) : whiteNoise(random, n),
      `item ${i + 1}`,
    );
  });
  list.push(seriesFromNumbers(new Float64Array(40).fill(3), "flat"));
  return list;
}

describe("batch and audit results carry their resolved options and expected raw flags", () => {
  const list = someSeries();

  it("batchCheck(list) records the defaults it resolved and analysed·α raw flags by chance", () => {
    const batch = batchCheck(list);
    expect([batch.alpha, batch.testKind, batch.maxLag, batch.season]).toEqual([
      0.05,
      "ljung-box",
      null,
      null,
    ]);
    // The constant series stays out of the family: 12 analysed.
    expect(batch.analysed).toBe(12);
    // Definition: each of m null p-values falls below α with chance α; expectations add.
    expect(batch.expectedRawFlags).toBe(12 * 0.05);
    expect(batch.expectedRawFlags).toBe(expectedFalseFlags(12, 0.05));
  });

  it("batchCheck(list, options) and batchOfResults(results, options) record the options asked for", () => {
    const options = { alpha: 0.1, testKind: "box-pierce" as const, maxLag: 6, season: 3 };
    const batch = batchCheck(list, options);
    expect([batch.alpha, batch.testKind, batch.maxLag, batch.season]).toEqual([
      0.1,
      "box-pierce",
      6,
      3,
    ]);
    expect(batch.expectedRawFlags).toBe(12 * 0.1);
    const staged = batchOfResults(
      list.map((s, i) => seriesResult(s, i, options)),
      options,
    );
    expect([staged.alpha, staged.testKind, staged.maxLag, staged.season]).toEqual([
      0.1,
      "box-pierce",
      6,
      3,
    ]);
  });

  it("mergeSeriesResults(parts) takes alpha and the test from the parts and records no lags or season", () => {
    const options = { alpha: 0.1, testKind: "box-pierce" as const, season: 3 };
    const merged = mergeSeriesResults(list.map((s, i) => seriesResult(s, i, options)));
    expect([merged.alpha, merged.testKind, merged.maxLag, merged.season]).toEqual([
      0.1,
      "box-pierce",
      null,
      null,
    ]);
  });

  it("auditBatch(list, options) and auditBatchOf(entries) record alpha, horizon and season as resolved", () => {
    const options = { horizon: 2, season: 3, alpha: 0.1 };
    const whole = auditBatch(list, options);
    const staged = auditBatchOf(list.map((s, i) => auditEntry(s, i, options)));
    for (const audit of [whole, staged]) {
      expect([audit.alpha, audit.horizon, audit.season]).toEqual([0.1, 2, 3]);
      expect(audit.analysed).toBe(12);
      expect(audit.expectedRawFlags).toBe(12 * 0.1);
    }
    const plain = auditBatch(list, { horizon: 1 });
    expect([plain.alpha, plain.horizon, plain.season]).toEqual([0.05, 1, null]);
  });

  it("auditBatchOf(entries audited at different levels) refuses to combine them", () => {
    const entries = [
      auditEntry(list[1] as Series, 0, { horizon: 1 }),
      auditEntry(list[2] as Series, 1, { horizon: 1, alpha: 0.1 }),
    ];
    expect(() => auditBatchOf(entries)).toThrow(/share alpha, horizon and season/);
  });
});

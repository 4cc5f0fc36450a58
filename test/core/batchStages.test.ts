/**
 * The batch and the audit in two stages — a per-series stage that worker threads run, and the
 * cross-series step (Benjamini–Hochberg) once at the end — give bit for bit what the one-call
 * functions give. The reference here is the project's own one-call path (batchCheck,
 * auditBatch); the equality is exact (Object.is on every number), not a tolerance.
 */
import { describe, expect, it } from "vitest";
import {
  auditBatch,
  auditBatchOf,
  auditEntry,
  batchCheck,
  batchOfResults,
  seriesFromNumbers,
  seriesFromValues,
  seriesResult,
  type Series,
} from "../../src/core";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

/** Every leaf of two values compared with Object.is (so NaN equals NaN and −0 is not 0). */
function expectIdentical(actual: unknown, expected: unknown, path = "result"): void {
  if (typeof expected === "number") {
    if (!Object.is(actual, expected)) {
      throw new Error(`${path}: got ${String(actual)}, expected ${expected} (exact equality)`);
    }
    return;
  }
  if (expected === null || typeof expected !== "object") {
    expect(actual, path).toBe(expected);
    return;
  }
  expect(typeof actual, path).toBe("object");
  const keys = Object.keys(expected);
  expect(Object.keys(actual as object).sort(), path).toEqual(keys.slice().sort());
  for (const key of keys) {
    expectIdentical(
      (actual as Record<string, unknown>)[key],
      (expected as Record<string, unknown>)[key],
      `${path}.${key}`,
    );
  }
}

/** 24 series of 30–80 values: noise, AR(1) with φ 0.5, one constant, one too short, one with a gap. */
function mixedBatch(): Series[] {
  const random = seededRandom(2026_12_02);
  const list: Series[] = [];
  for (let i = 0; i < 20; i++) {
    const n = 30 + ((i * 7) % 51);
    const values = i % 3 === 0 ? ar1(random, n, 0.5) : whiteNoise(random, n);
    list.push(seriesFromNumbers(values, `item ${i}`));
  }
  list.push(seriesFromNumbers(new Float64Array(40).fill(2), "flat"));
  list.push(seriesFromNumbers(whiteNoise(random, 4), "tiny"));
  const gapped: (number | null)[] = Array.from(whiteNoise(random, 60));
  gapped[17] = null;
  list.push(seriesFromValues(gapped, { label: "gapped" }));
  list.push(seriesFromNumbers(whiteNoise(random, 50), ""));
  return list;
}

describe("batchOfResults(series results)", () => {
  it("gives batchCheck's rows and counts bit for bit, in the order given", () => {
    const list = mixedBatch();
    for (const options of [
      {},
      { maxLag: 6, season: 4 },
      { alpha: 0.01, testKind: "box-pierce" as const },
    ]) {
      const whole = batchCheck(list, options);
      const staged = batchOfResults(
        list.map((s, i) => seriesResult(s, i, options)),
        options,
      );
      expectIdentical(staged, whole);
    }
  });

  it("refuses fewer than two series and a batch where no series can be analysed, as batchCheck does", () => {
    const one = [seriesFromNumbers(whiteNoise(seededRandom(1), 40), "a")];
    expect(() => batchOfResults(one.map((s, i) => seriesResult(s, i)))).toThrow(
      /at least 2 series/,
    );
    const flat = [1, 2].map((k) => seriesFromNumbers(new Float64Array(30).fill(k), `f${k}`));
    let message = "";
    try {
      batchCheck(flat);
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toMatch(/constant/);
    expect(() => batchOfResults(flat.map((s, i) => seriesResult(s, i)))).toThrow(message);
  });
});

describe("auditBatchOf(audit entries)", () => {
  it("gives auditBatch's items, q-values and counts bit for bit", () => {
    const list = mixedBatch();
    for (const options of [{ horizon: 1 }, { horizon: 3, season: 4 }]) {
      const whole = auditBatch(list, options);
      const staged = auditBatchOf(list.map((s, i) => auditEntry(s, i, options)));
      expectIdentical(staged, whole);
    }
  });
});

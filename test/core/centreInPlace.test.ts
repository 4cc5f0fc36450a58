/**
 * Centring where the values lie (centre(series, into), autocorrelation(series, K, into)) and one
 * array of deviations shared by the volatility check's two tests save the long check two arrays
 * of the series' length; the figures must not move by a bit. The reference is the path without
 * `into` (a fresh array each time), compared with Object.is on every element: exact, no
 * tolerance. The series cover the branches of centre.ts: gaps, the mean's rounding offset (values
 * a few units in the last place apart), data beyond 2^1000 and below 2^-200 (rescaled), and Box–
 * Jenkins Series F (test/fixtures/series-f.csv).
 */
import { describe, expect, it } from "vitest";
import {
  autocorrelation,
  centre,
  seriesFromNumbers,
  seriesFromValues,
  squaredDeviationCorrelation,
  volatilityCheck,
  type Series,
} from "../../src/core";
import { ar1 } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { readSeriesF } from "../helpers/fixtures";

function expectSameArray(actual: ArrayLike<number>, expected: ArrayLike<number>, what: string) {
  expect(actual.length, what).toBe(expected.length);
  for (let i = 0; i < expected.length; i++) {
    if (!Object.is(actual[i], expected[i])) {
      throw new Error(`${what}[${i}]: got ${actual[i]}, expected ${expected[i]} (exact equality)`);
    }
  }
}

/** A copy with its own values array, which the in-place path may overwrite. */
function copyOf(series: Series): Series {
  return { ...series, values: series.values.slice() };
}

function cases(): [string, Series][] {
  const random = seededRandom(77);
  const gapped: (number | null)[] = Array.from(ar1(random, 120, 0.6));
  for (const t of [3, 4, 50, 97]) gapped[t] = null;
  const ulps = Array.from({ length: 200 }, (_, i) => (i % 3 === 0 ? 1 + 2 ** -52 : 1));
  return [
    ["Series F", seriesFromNumbers(readSeriesF())],
    ["AR(1) with four gaps", seriesFromValues(gapped)],
    ["values one ulp apart", seriesFromNumbers(ulps)],
    ["values near 1e305", seriesFromNumbers(Array.from(ar1(random, 80, 0.3), (x) => x * 1e305))],
    ["values near 1e-250", seriesFromNumbers(Array.from(ar1(random, 80, 0.3), (x) => x * 1e-250))],
  ];
}

describe("centre(series, into) and autocorrelation(series, K, into)", () => {
  it("give the fresh-array path's mean, deviations, sums and lags bit for bit", () => {
    for (const [name, series] of cases()) {
      const fresh = centre(series);
      const copy = copyOf(series);
      const inPlace = centre(copy, copy.values);
      expect(inPlace.deviations, name).toBe(copy.values);
      expectSameArray(inPlace.deviations, fresh.deviations, `${name} deviations`);
      expectSameArray(
        [inPlace.mean, inPlace.sumSquares, inPlace.scale, inPlace.n],
        [fresh.mean, fresh.sumSquares, fresh.scale, fresh.n],
        `${name} mean, sumSquares, scale, n`,
      );
      const other = copyOf(series);
      const a = autocorrelation(series, 8);
      const b = autocorrelation(other, 8, other.values);
      expectSameArray(b.correlation, a.correlation, `${name} correlation`);
      expectSameArray(b.autocovariance, a.autocovariance, `${name} autocovariance`);
    }
  });
});

describe("squaredDeviationCorrelation and volatilityCheck with shared deviations", () => {
  it("give the figures of the squares made from a fresh centring, bit for bit", () => {
    for (const [name, series] of cases()) {
      // The earlier path, spelled out: fresh deviations, squared into a series of their own,
      // centred into a fresh array.
      const d = centre(series).deviations;
      const squares = Float64Array.from(d, (x, t) => (series.present[t] === 1 ? x * x : NaN));
      let expected;
      try {
        expected = autocorrelation({ ...series, values: squares }, 6);
      } catch {
        continue; // constant squares (values one ulp apart): refused on both paths alike
      }
      const shared = squaredDeviationCorrelation(series, 6, centre(series).deviations);
      const own = squaredDeviationCorrelation(series, 6);
      for (const [path, got] of [
        ["given deviations", shared],
        ["own deviations", own],
      ] as const) {
        expectSameArray(got.correlation, expected.correlation, `${name} ${path} correlation`);
        expectSameArray(got.deviations, expected.deviations, `${name} ${path} deviations`);
      }
    }
  });

  it("volatilityCheck(series) does not touch the series' values", () => {
    const [, series] = cases()[1] as [string, Series];
    const before = series.values.slice();
    const check = volatilityCheck(series, { lags: 4 });
    expectSameArray(series.values, before, "values after the check");
    expect(check.rows).toBeGreaterThan(0);
  });
});

/**
 * Long series at many lags, where the core sums lags by transform (fft.ts) above a cost-model
 * crossover and directly below it: both paths are checked against exact values of the published
 * definition and against the pairwise definition with gaps.
 */
import { describe, expect, it } from "vitest";
import { lagTable, prefersFft, seriesFromNumbers, seriesFromValues } from "../../src/core";
import { ar1 } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { Exact } from "../helpers/exact";
import { expectClose } from "../helpers/expectClose";
import { readStrd } from "../helpers/fixtures";

/**
 * Exact r_0..r_K of integer data (biased estimator, Box, Jenkins & Reinsel): with S_k = Σ x_t x_{t−k},
 * A_k = Σ_{t≥k} x_t and B_k = Σ_{t<n−k} x_t (all integers, exact in double here),
 * Σ (x_t − m)(x_{t−k} − m) = S_k − m(A_k + B_k) + (n − k)m², evaluated in 60-digit decimals.
 */
function exactIntegerAutocorrelations(x: Float64Array, maxLag: number): number[] {
  const n = x.length;
  const total = x.reduce((s, v) => s + v, 0);
  const mean = new Exact(total).dividedBy(n);
  const lagSum = (k: number) => {
    let s = 0;
    let a = 0;
    let b = 0;
    for (let t = k; t < n; t++) {
      s += (x[t] as number) * (x[t - k] as number);
      a += x[t] as number;
      b += x[t - k] as number;
    }
    if (!Number.isSafeInteger(s)) throw new Error("lag sum not exact in double");
    return new Exact(s).minus(mean.times(a + b)).plus(mean.times(mean).times(n - k));
  };
  const c0 = lagSum(0);
  return Array.from({ length: maxLag + 1 }, (_, k) => lagSum(k).dividedBy(c0).toNumber());
}

describe("lagTable(series) at many lags", () => {
  const digits = readStrd("PiDigits");
  const exact = exactIntegerAutocorrelations(digits, 300);

  it.each([
    [300, true],
    [60, false],
  ] as const)(
    "lagTable(PiDigits, maxLag %i) matches the exact r_k at every lag (transform path: %s)",
    (maxLag, transform) => {
      // NIST StRD PiDigits data; reference: the exact definition above.
      expect(prefersFft(digits.length, maxLag)).toBe(transform);
      const table = lagTable(seriesFromNumbers(digits), { maxLag });
      for (const row of table.rows) {
        // Absolute, as r_k of digits is near 0: 1e-15 is about 4.5 eps on the scale of r_0 = 1
        // (both paths measured at 6e-17 or better).
        expectClose(
          row.correlation,
          exact[row.lag] as number,
          { abs: 1e-15 },
          `PiDigits r_${row.lag}`,
        );
      }
    },
  );

  it("lagTable(long series with gaps, maxLag 300) equals the pairwise definition on the transform path", () => {
    // Seeded AR(1) φ 0.6, n 5000 positions, every 17th position and a run of 40 left blank.
    const x = ar1(seededRandom(5_000_300), 5000, 0.6);
    const cells: (number | null)[] = Array.from(x, (v, t) =>
      t % 17 === 5 || (t >= 2000 && t < 2040) ? null : v,
    );
    const series = seriesFromValues(cells);
    expect(prefersFft(series.values.length, 300)).toBe(true);
    const table = lagTable(series, { maxLag: 300 });
    // The pairwise definition: mean of the values present; Σ over pairs both present; ÷ c0.
    const present = cells.filter((c): c is number => c !== null);
    const mean = present.reduce((s, v) => s + v, 0) / present.length;
    const c0 = present.reduce((s, v) => s + (v - mean) ** 2, 0);
    for (const row of table.rows) {
      let sum = 0;
      for (let t = row.lag; t < cells.length; t++) {
        const now = cells[t];
        const before = cells[t - row.lag];
        if (now === null || now === undefined || before === null || before === undefined) continue;
        sum += (now - mean) * (before - mean);
      }
      expectClose(row.correlation, sum / c0, { abs: 1e-12 }, `gappy AR(1) r_${row.lag}`);
    }
  });
});

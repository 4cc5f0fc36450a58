/**
 * crossCorrelation(x, y): the published divide-by-n definition evaluated exactly (decimal.js), its
 * relation to the autocorrelation, the sign convention, and the pairing rules (row by row, a gap
 * in either is a gap of the pair).
 */
import { describe, expect, it } from "vitest";
import {
  autocorrelation,
  crossCorrelation,
  seriesFromCells,
  seriesFromNumbers,
  seriesFromValues,
} from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { Exact, exactOfDouble, type ExactNumber } from "../helpers/exact";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";

const seriesF = readSeriesF();

/** r_xy(k) from the definition (Box, Jenkins & Reinsel) in 60-digit arithmetic, gap-free. */
function exactCross(x: ArrayLike<number>, y: ArrayLike<number>, k: number): number {
  const ex = Array.from(x, exactOfDouble);
  const ey = Array.from(y, exactOfDouble);
  const n = ex.length;
  const mean = (v: ExactNumber[]) => v.reduce((s, a) => s.plus(a), new Exact(0)).dividedBy(n);
  const mx = mean(ex);
  const my = mean(ey);
  const dx = ex.map((v) => v.minus(mx));
  const dy = ey.map((v) => v.minus(my));
  const ss = (d: ExactNumber[]) => d.reduce((s, a) => s.plus(a.times(a)), new Exact(0));
  let sum = new Exact(0);
  for (let t = 0; t < n; t++) {
    const later = t + Math.abs(k);
    if (later >= n) break;
    sum =
      k >= 0
        ? sum.plus((dx[t] as ExactNumber).times(dy[later] as ExactNumber))
        : sum.plus((dx[later] as ExactNumber).times(dy[t] as ExactNumber));
  }
  return sum.dividedBy(ss(dx).times(ss(dy)).sqrt()).toNumber();
}

describe("crossCorrelation(x, y, { maxLag })", () => {
  it("matches the definition evaluated exactly at every lag −8..8 (Series F against seeded noise)", () => {
    const random = seededRandom(11);
    const y = Float64Array.from(seriesF, (v) => 0.3 * v + random.normal() * 5);
    const result = crossCorrelation(seriesFromNumbers(seriesF), seriesFromNumbers(y), {
      maxLag: 8,
    });
    expect(result.rows.map((r) => r.lag)).toEqual(Array.from({ length: 17 }, (_, i) => i - 8));
    for (const row of result.rows) {
      expectClose(
        row.correlation,
        exactCross(seriesF, y, row.lag),
        { rel: 1e-13 },
        `r_xy(${row.lag})`,
      );
    }
  });

  it("crossCorrelation(x, x) is the autocorrelation, the same at −k and k", () => {
    const x = seriesFromNumbers(seriesF);
    const cross = crossCorrelation(x, x, { maxLag: 10 });
    const auto = autocorrelation(x, 10).correlation;
    for (let k = 0; k <= 10; k++) {
      const plus = cross.rows[10 + k]?.correlation ?? NaN;
      const minus = cross.rows[10 - k]?.correlation ?? NaN;
      expectClose(plus, auto[k] as number, { rel: 1e-14 }, `r_xx(${k}) vs r_${k}`);
      expectClose(minus, plus, { rel: 1e-14 }, `r_xx(−${k}) vs r_xx(${k})`);
    }
  });

  it("puts a copy of x delayed by 3 periods at lag +3 (x leads y)", () => {
    const random = seededRandom(12);
    const x = Array.from({ length: 200 }, () => random.normal());
    const y = x.map((_, t) => (t >= 3 ? (x[t - 3] as number) : random.normal()));
    const result = crossCorrelation(seriesFromNumbers(x), seriesFromNumbers(y), { maxLag: 5 });
    const peak = result.rows.reduce((a, b) =>
      Math.abs(b.correlation) > Math.abs(a.correlation) ? b : a,
    );
    expect(peak.lag).toBe(3);
    expect(peak.correlation).toBeGreaterThan(0.9);
    expectClose(
      result.rows[0]?.band ?? NaN,
      1.959963984540054 / Math.sqrt(200),
      { rel: 1e-12 },
      "noise band z/√n",
    );
  });

  it("treats a gap in either series as a gap of the pair", () => {
    const random = seededRandom(13);
    const x: (number | null)[] = Array.from({ length: 60 }, () => random.normal());
    const y: (number | null)[] = Array.from({ length: 60 }, () => random.normal());
    x[10] = null;
    y[20] = null;
    const both = (v: (number | null)[]) => v.map((a, t) => (t === 10 || t === 20 ? null : a));
    const result = crossCorrelation(seriesFromValues(x), seriesFromValues(y), { maxLag: 4 });
    const expected = crossCorrelation(seriesFromValues(both(x)), seriesFromValues(both(y)), {
      maxLag: 4,
    });
    expect(result.n).toBe(58);
    result.rows.forEach((row, i) => {
      expectClose(
        row.correlation,
        expected.rows[i]?.correlation ?? NaN,
        { rel: 1e-14 },
        `gapped r_xy(${row.lag})`,
      );
      expect(row.pairs).toBe(expected.rows[i]?.pairs);
    });
  });

  it("pairs cells row by row when one range has a label and leading gaps", () => {
    const values = [3, 1, 4, 1, 5, 9, 2, 6, 5, 3, 5, 8];
    const other = [2, 7, 1, 8, 2, 8, 1, 8, 2, 8, 4, 5];
    const x = seriesFromCells([["sales"], [null], ...values.slice(1).map((v) => [v])]);
    const y = seriesFromCells([[0], ...other.map((v) => [v])]);
    // x covers rows 3..13 (row 2 is a gap); y rows 1..13. Pairs: rows 3..13 → values[1..] with other[1..].
    const result = crossCorrelation(x, y, { maxLag: 2 });
    const plain = crossCorrelation(
      seriesFromNumbers(values.slice(1)),
      seriesFromNumbers(other.slice(1)),
      { maxLag: 2 },
    );
    expect(result.n).toBe(11);
    result.rows.forEach((row, i) => {
      expectClose(
        row.correlation,
        plain.rows[i]?.correlation ?? NaN,
        { rel: 1e-14 },
        `aligned r_xy(${row.lag})`,
      );
    });
  });
});

/**
 * The checks of `echolot check` on long series, in bounded memory: Engle's regression is fitted
 * block by block, the runs test's median comes from a typed copy. Each is checked against the
 * direct computation it replaced.
 */
import { describe, expect, it } from "vitest";
import {
  centre,
  leastSquares,
  runsTest,
  runsCheck,
  seriesFromColumn,
  volatilityCheck,
} from "../../src/core";
import { garch11 } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { expectClose } from "../helpers/expectClose";

describe("volatilityCheck(a series longer than one regression block)", () => {
  it("gives the LM of one Householder fit over all rows (to 1e-9 relative)", () => {
    // 30,000 values with volatility clustering and a few gaps: several blocks of 8,192 rows.
    const values = garch11(seededRandom(30000), 30000);
    for (const t of [5, 9000, 9001, 20000]) values[t] = NaN;
    const series = seriesFromColumn(values, "clustered");
    const q = 4;
    const check = volatilityCheck(series, { lags: q });

    // The direct fit: every usable row in one design (Golub & Van Loan §5.3, leastSquares.ts).
    const { deviations } = centre(series);
    const rows: number[] = [];
    for (let t = q; t < values.length; t++) {
      let complete = true;
      for (let j = 0; j <= q; j++) complete &&= series.present[t - j] === 1;
      if (complete) rows.push(t);
    }
    const design = new Float64Array(rows.length * (q + 1));
    const response = new Float64Array(rows.length);
    rows.forEach((t, i) => {
      response[i] = (deviations[t] as number) ** 2;
      design[i] = 1;
      for (let j = 1; j <= q; j++) design[j * rows.length + i] = (deviations[t - j] as number) ** 2;
    });
    const c = leastSquares(design, rows.length, q + 1, response).rotatedResponse;
    let explained = 0;
    let total = 0;
    for (let i = 1; i < rows.length; i++) {
      total += (c[i] as number) ** 2;
      if (i <= q) explained += (c[i] as number) ** 2;
    }
    expect(check.rows).toBe(rows.length);
    expectClose(check.rSquared, explained / total, { rel: 1e-9 }, "R² of 30,000 GARCH values");
    expectClose(check.lm, rows.length * (explained / total), { rel: 1e-9 }, "LM");
  });
});

describe("runsCheck(series)", () => {
  it("counts the runs of the sides about the median, as runsTest of the sides does", () => {
    const values = garch11(seededRandom(77), 5001);
    const check = runsCheck(seriesFromColumn(values, ""));
    const sorted = Array.from(values).sort((a, b) => a - b);
    const median = sorted[2500] as number;
    expect(check.median).toBe(median);
    const sides = Array.from(values)
      .filter((x) => x !== median)
      .map((x) => x > median);
    expect(check.runs).toBe(runsTest(sides).runs);
  });
});

/**
 * Gaps keep their positions (DESIGN.md "Numbers": lags are positions in time; each lag sum runs
 * over the pairs where both values exist). Small cases worked by hand from that definition.
 */
import { describe, expect, it } from "vitest";
import { lagTable, seriesFromCells, seriesFromNumbers, seriesFromValues } from "../../src/core";
import { expectClose } from "../helpers/expectClose";

describe("lagTable(series) with gaps", () => {
  it("lagTable(series) keeps lags aligned across an interior gap", () => {
    // x = 1, 3, _, 2, 6: mean 3, d = −2, 0, _, −1, 3, c0 = 14. By hand over the pairs present:
    // r_1 = (0·−2 + 3·−1)/14 = −3/14; r_2 = (−1·0)/14 = 0 (one pair); r_3 = (−1·−2 + 3·0)/14 = 2/14.
    const table = lagTable(seriesFromValues([1, 3, null, 2, 6]), { maxLag: 3 });
    expect(table.n).toBe(4);
    expect(table.gaps).toBe(1);
    expect(table.length).toBe(5);
    expectClose(table.mean, 3, { abs: 0 }, "mean of the values present");
    expectClose(table.rows[0]?.correlation ?? NaN, -3 / 14, { abs: 1e-16 }, "r_1 across the gap");
    expectClose(table.rows[1]?.correlation ?? NaN, 0, { abs: 1e-16 }, "r_2 across the gap");
    expectClose(table.rows[2]?.correlation ?? NaN, 2 / 14, { abs: 1e-16 }, "r_3 across the gap");
    // Dropping the gap instead would shift every later value: r_2 of 1, 3, 2, 6 is 2/14, not 0.
    const dropped = lagTable(seriesFromValues([1, 3, 2, 6]), { maxLag: 3 });
    expectClose(
      dropped.rows[1]?.correlation ?? NaN,
      2 / 14,
      { abs: 1e-16 },
      "r_2 with the gap dropped",
    );
  });

  it("lagTable(series) makes a lag with no available pair NaN and leaves it out of the tests", () => {
    // Values at positions 0, 1, 4, 5: no pair is 2 apart. Undefined, not zero (STYLE.md policy).
    const table = lagTable(seriesFromValues([1, 4, null, null, 2, 7]), { maxLag: 3 });
    const [lag1, lag2, lag3] = table.rows;
    expect(Number.isFinite(lag1?.correlation)).toBe(true);
    expect(Number.isNaN(lag2?.correlation)).toBe(true);
    // Durbin–Levinson cannot continue past an undefined lag.
    expect(Number.isNaN(lag2?.partial)).toBe(true);
    expect(Number.isNaN(lag3?.partial)).toBe(true);
    // Lag 3 has one pair (positions 4 and 1) and stays defined.
    expect(Number.isFinite(lag3?.correlation)).toBe(true);
    expect(lag3?.jointDf).toBe(2);
    expect(table.falseAlarm.tested).toBe(2);
    expect(lag2?.crossesBand).toBe(false);
  });

  it("seriesFromCells(column with leading and trailing blanks) gives the same lagTable as the bare values", () => {
    const x = [2.5, -1, 4, 0.5, 3, -2, 1, 6, -0.5, 2];
    const padded = seriesFromCells([
      [null],
      [""],
      ...x.map((v) => [v]),
      [{ code: "#N/A" }],
      [null],
    ]);
    const bare = seriesFromNumbers(x);
    const a = lagTable(padded, { maxLag: 5 });
    const b = lagTable(bare, { maxLag: 5 });
    expect(padded.gaps).toBe(0);
    a.rows.forEach((row, i) => {
      expect(row.correlation, `r_${i + 1}`).toBe(b.rows[i]?.correlation);
    });
  });

  it("lagTable(series with gaps) counts n as the values present in bands and tests", () => {
    // The noise band is z/√n with n the number of values present (7 here, not 9 positions).
    const table = lagTable(seriesFromValues([1, 5, null, 2, 8, null, 3, 4, 9]), { maxLag: 2 });
    expect(table.n).toBe(7);
    expectClose(
      table.rows[0]?.standardError ?? NaN,
      1 / Math.sqrt(7),
      { rel: 1e-15 },
      "noise se with gaps",
    );
  });
});

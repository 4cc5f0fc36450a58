import { describe, expect, it } from "vitest";
import { lagTable } from "../../src/core";
import { jointRibbonSvg, PALETTE, ribbonStrength } from "../../src/report";
import { expectClose } from "../helpers/expectClose";
import { seriesF, withClass } from "./chartTree";

describe("jointRibbonSvg(table)", () => {
  it("has one cell per k holding the joint p of lags 1..k", () => {
    const table = lagTable(seriesF(), { maxLag: 12 });
    const cells = withClass(jointRibbonSvg(table), "joint-cell");
    expect(cells.map((c) => Number(c.attributes["data-k"]))).toEqual(
      Array.from({ length: 12 }, (_, i) => i + 1),
    );
    // Series F, Ljung–Box: p(1) 0.000862, p(5) 0.000761, p(10) 0.017326, p(12) 0.027433
    // (METHODS.md, derived from the Series F data with the published Ljung–Box formula).
    const printed: [number, number][] = [
      [1, 0.000862],
      [5, 0.000761],
      [10, 0.017326],
      [12, 0.027433],
    ];
    for (const [k, p] of printed) {
      const cell = cells[k - 1];
      expectClose(
        Number(cell?.attributes["data-p"]),
        p,
        { rel: 1e-3 },
        `Series F joint p at k = ${k}`,
      );
    }
  });

  it("is neutral at or above alpha, vermillion below and deeper as p falls, with the chosen K outlined", () => {
    const table = lagTable(seriesF(), { maxLag: 12, alpha: 0.01 });
    const cells = withClass(jointRibbonSvg(table), "joint-cell");
    cells.forEach((cell, i) => {
      const row = table.rows[i];
      if (row === undefined) throw new Error("missing row");
      const below = row.jointP < 0.01;
      expect(
        cell.attributes.class?.includes(below ? "below" : "above"),
        `k = ${row.lag}, p = ${row.jointP}`,
      ).toBe(true);
      expect(cell.attributes.fill).toBe(below ? PALETTE.structure : PALETTE.outerCorridor);
      if (below) {
        expectClose(
          Number(cell.attributes["fill-opacity"]),
          ribbonStrength(row.jointP, 0.01),
          { abs: 5e-4 },
          `k = ${row.lag} strength`,
        );
      }
    });
    expect(cells.filter((c) => c.attributes.class?.includes("below")).length).toBeGreaterThan(0);
    expect(cells.filter((c) => c.attributes.class?.includes("above")).length).toBeGreaterThan(0);
    expect(
      cells
        .filter((c) => c.attributes.class?.includes("chosen"))
        .map((c) => c.attributes["data-k"]),
    ).toEqual(["12"]);
  });

  it("ribbonStrength(p, alpha) grows with −log10 p from 0.25 at alpha to 1, and stays there", () => {
    expectClose(ribbonStrength(0.05, 0.05), 0.25, { abs: 1e-12 }, "strength at alpha");
    expectClose(ribbonStrength(1e-6, 0.05), 1, { abs: 1e-12 }, "strength at 1e-6");
    expectClose(ribbonStrength(1e-300, 0.05), 1, { abs: 1e-12 }, "strength at the p floor");
    const ps = [0.04, 0.01, 1e-3, 1e-4, 1e-5];
    const strengths = ps.map((p) => ribbonStrength(p, 0.05));
    expect(strengths.every((s, i) => i === 0 || s > (strengths[i - 1] as number))).toBe(true);
  });

  it("leaves a cell neutral and says why when fitted parameters leave no degrees of freedom", () => {
    const table = lagTable(seriesF(), { maxLag: 6, fittedParams: 2 });
    const cells = withClass(jointRibbonSvg(table), "joint-cell");
    expect(cells.slice(0, 2).map((c) => c.attributes.class)).toEqual([
      "joint-cell undefined",
      "joint-cell undefined",
    ]);
    expect(cells[0]?.children[0]?.text).toContain(
      "no degrees of freedom left after 2 fitted parameters",
    );
  });
});

import { describe, expect, it } from "vitest";
import { formatP, lagTable } from "../../src/core";
import { jointRibbonSvg, PALETTE, ribbonFill, ribbonStrength } from "../../src/report";
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

  it("is neutral (outlined) at or above alpha, vermillion below and darker as p falls, the chosen K outlined in ink", () => {
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
      expect(cell.attributes.fill).toBe(
        below ? ribbonFill(row.jointP, 0.01) : PALETTE.ribbonNeutral,
      );
      if (!below && row.lag !== 12) expect(cell.attributes.stroke).toBe(PALETTE.outerEdge);
    });
    expect(cells.filter((c) => c.attributes.class?.includes("below")).length).toBeGreaterThan(0);
    expect(cells.filter((c) => c.attributes.class?.includes("above")).length).toBeGreaterThan(0);
    expect(
      cells
        .filter((c) => c.attributes.class?.includes("chosen"))
        .map((c) => c.attributes["data-k"]),
    ).toEqual(["12"]);
    expect(cells[11]?.attributes.stroke).toBe(PALETTE.ink);
  });

  it("ribbonFill(p, alpha) runs from vermillion at alpha to the deepest shade, never lighter", () => {
    expect(ribbonFill(0.05, 0.05)).toBe("rgb(213, 94, 0)"); // #D55E00
    expect(ribbonFill(1e-6, 0.05)).toBe("rgb(117, 52, 0)"); // #753400
    expect(ribbonFill(1e-300, 0.05)).toBe("rgb(117, 52, 0)");
    const red = (p: number) => Number(/rgb\((\d+)/.exec(ribbonFill(p, 0.05))?.[1]);
    const ps = [0.04, 0.01, 1e-3, 1e-4, 1e-5];
    expect(ps.every((p, i) => i === 0 || red(p) < red(ps[i - 1] as number))).toBe(true);
  });

  it("shows the joint test of the table it is given: McLeod–Li for the squared deviations", () => {
    const squares = lagTable(seriesF(), { maxLag: 8, testKind: "squares" });
    const svg = jointRibbonSvg(squares);
    expect(withClass(svg, "caption")[0]?.text).toBe(
      "Joint test McLeod–Li of lags 1…k, χ² p by cell",
    );
    const cells = withClass(svg, "joint-cell");
    expect(cells.map((c) => Number(c.attributes["data-p"]))).toEqual(
      squares.rows.map((r) => Number(r.jointP.toPrecision(6))),
    );
  });

  it("carries its key: an outlined cell for p at or above alpha, filled cells for below", () => {
    const table = lagTable(seriesF(), { maxLag: 12 });
    const svg = jointRibbonSvg(table);
    expect(withClass(svg, "key").map((e) => e.text)).toEqual([
      "p ≥ 0.05",
      "p < 0.05, darker as p falls",
    ]);
    expect(withClass(svg, "key-swatch").map((e) => e.attributes.fill)).toEqual([
      PALETTE.ribbonNeutral,
      PALETTE.structure,
      PALETTE.ribbonDeepest,
    ]);
    expect(withClass(svg, "chosen-p")[0]?.text).toBe(
      `outlined K = 12: χ² p = ${formatP(table.joint.p)}`,
    );
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

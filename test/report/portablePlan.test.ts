import { describe, expect, it } from "vitest";
import { lagTable, seriesFromValues, type LagOptions } from "../../src/core";
import {
  chartPartXml,
  PERMUTATION_NOTE,
  fileFormula,
  functionsCalled,
  NATIVE_FUNCTIONS,
  PALETTE,
  portableBatchPlan,
  portablePlan,
  SCREENING_CAUTION,
  type PortablePlan,
} from "../../src/report";
import { seriesFColumn } from "../pane/seriesF";

const SOURCE = { sheet: "Data", column: 0, firstRow: 1, rows: 170 };

function seriesF() {
  return seriesFromValues(seriesFColumn());
}

function plan(options: LagOptions = {}): PortablePlan {
  const series = seriesF();
  return portablePlan(lagTable(series, options), series, SOURCE, {
    sheetName: "Portable report",
    placedOn: "2026-12-02",
    roomToGrow: true,
  });
}

function formulas(p: PortablePlan): string[] {
  return p.sheets.flatMap((s) =>
    s.cells.flatMap((c) => ("formula" in c.content ? [c.content.formula] : [])),
  );
}

function texts(p: PortablePlan): string[] {
  return p.sheets.flatMap((s) =>
    s.cells.flatMap((c) => ("value" in c.content ? [String(c.content.value)] : [])),
  );
}

describe("portablePlan(table, series, source, options)", () => {
  const kinds: LagOptions[] = [
    {},
    { bandKind: "bartlett", testKind: "box-pierce", season: 4, maxLag: 12 },
    { bandKind: "robust", testKind: "robust", fittedParams: 2 },
  ];

  it("uses only the native functions Excel 2010+, LibreOffice Calc and Google Sheets share, none volatile", () => {
    for (const options of kinds) {
      const all = formulas(plan(options));
      expect(all.length).toBeGreaterThan(1000);
      const called = new Set(all.flatMap(functionsCalled));
      for (const name of called) expect(NATIVE_FUNCTIONS[name], name).toBeDefined();
      for (const f of all) expect(f).not.toMatch(/OFFSET|INDIRECT|TODAY|NOW|RAND/);
      expect(all.every((f) => f.startsWith("="))).toBe(true);
    }
  });

  it("sums each lag over INDEX(range, i):INDEX(range, j) of the helper columns", () => {
    const cells = plan().sheets[0]?.cells ?? [];
    const r3 = cells.find((c) => c.figure === "r.3");
    expect(r3?.content).toEqual({
      formula:
        '=IF($B$39>0,SUMPRODUCT(INDEX($Z$37:$Z$206,1+$A$39):INDEX($Z$37:$Z$206,170),INDEX($Z$37:$Z$206,1):INDEX($Z$37:$Z$206,170-$A$39))/$B$14,"")',
    });
    // A gap adds nothing and shifts nothing: the deviation helper is 0 there, in place.
    const deviation = cells.find((c) => c.row === 40 && c.column === 25);
    expect(deviation?.content).toEqual({
      formula: "=IF($X$41=1,'Data'!$A$6-$B$13,0)",
    });
  });

  it("carries Echolot's figures for every figure cell, and the levels as constants", () => {
    const series = seriesF();
    const table = lagTable(series, {});
    const p = plan();
    const cells = p.sheets[0]?.cells ?? [];
    for (const c of cells) if (c.figure !== undefined) expect(p.figures.has(c.figure)).toBe(true);
    expect(p.figures.get("Q")).toBe(table.joint.q);
    expect(p.figures.get("p")).toBe(table.joint.p);
    expect(p.figures.get("addInVerdict")).toBe(table.verdict.word);
    // Series F (Box, Jenkins & Reinsel): r1 = -0.39, far beyond any corridor, so the sheet's rule
    // and the add-in both read structure.
    expect(p.figures.get("verdict")).toBe("structure");
    expect(p.figures.get("r.1")).toBe(table.rows[0]?.correlation);
    expect(p.figures.get("pairs.10")).toBe(60);
    const values = cells.flatMap((c) => ("value" in c.content ? [c.content.value] : []));
    expect(values).toContain(table.innerLevel);
    expect(values).toContain(table.outerLevel);
    expect(values).toContain(table.jointLevel);
  });

  it("says what it is: what it computes, live without the add-in, the screening caution, the date", () => {
    const all = texts(plan());
    expect(all[0]).toBe("Echolot portable report: yield");
    expect(all.some((t) => t.startsWith("Lag correlations of 'Data'!$A$2:$A$171"))).toBe(true);
    expect(all.some((t) => t.includes("with or without the Echolot add-in"))).toBe(true);
    expect(all).toContain(SCREENING_CAUTION);
    expect(all).toContain("Placed on 2026-12-02 by Echolot.");
    // The line beside the verdict: the add-in permutes series with n·K ≤ 250,000, no fitted
    // parameters and α ≥ 0.001 (src/core/verdictReference.ts), so its reading may differ there.
    const exact = formulas(plan()).find((f) => f.includes("exact permutation reference"));
    expect(exact).toContain("AND($B$18=0,$B$11*$B$15<=250000,$B$16>=0.001)");
    expect(PERMUTATION_NOTE).toContain("n·K ≤ 250,000");
    expect(PERMUTATION_NOTE).toContain("may differ");
  });

  it("refuses the squares' test, which needs a second series", () => {
    const series = seriesF();
    expect(() =>
      portablePlan(lagTable(series, { testKind: "squares" }), series, SOURCE, {
        sheetName: "x",
        placedOn: "2026-12-02",
      }),
    ).toThrow(/squares/);
  });

  it("does not mutate the lag table it reads", () => {
    const series = seriesF();
    const table = lagTable(series, {});
    const before = JSON.stringify(table);
    portablePlan(table, series, SOURCE, { sheetName: "x", placedOn: "2026-12-02" });
    expect(JSON.stringify(table)).toBe(before);
  });
});

describe("fileFormula(formula)", () => {
  it("adds _xlfn. to functions added in Excel 2010, never inside quoted text or twice", () => {
    expect(fileFormula('=IF(A1>0,CHISQ.DIST.RT(A1,2),"CHISQ.DIST.RT(")')).toBe(
      'IF(A1>0,_xlfn.CHISQ.DIST.RT(A1,2),"CHISQ.DIST.RT(")',
    );
    expect(fileFormula("=2*NORM.S.DIST(-ABS(B2),TRUE)+BINOM.DIST(1,2,0.5,FALSE)")).toBe(
      "2*_xlfn.NORM.S.DIST(-ABS(B2),TRUE)+_xlfn.BINOM.DIST(1,2,0.5,FALSE)",
    );
    expect(fileFormula("SUMPRODUCT(A1:A3,B1:B3)")).toBe("SUMPRODUCT(A1:A3,B1:B3)");
    expect(fileFormula("_xlfn.CHISQ.DIST.RT(1,2)")).toBe("_xlfn.CHISQ.DIST.RT(1,2)");
  });
});

describe("chartPartXml(sheet, chart)", () => {
  it("draws diamonds coloured by zone over flat stacked corridors, with no stems, bars or dashed lines", () => {
    const chart = plan().sheets[0]?.chart;
    if (chart === undefined) throw new Error("no chart");
    const xml = chartPartXml("Portable report", chart);
    expect(xml).toContain('<c:grouping val="stacked"/>');
    expect(xml.match(/<c:symbol val="diamond"\/>/g)).toHaveLength(3);
    for (const colour of [PALETTE.inside, PALETTE.watch, PALETTE.structure]) {
      expect(xml).toContain(`<a:srgbClr val="${colour.slice(1)}"/>`);
    }
    expect(xml).not.toMatch(/dropLines|hiLowLines|errBars|barChart|prstDash/);
    expect(xml).toContain("<c:f>&#39;Portable report&#39;!$S$37:$S$46</c:f>");
  });
});

describe("portableBatchPlan(items, options)", () => {
  it("links each column's row to its block's Q, df, p and verdict, and keeps a row for a column it cannot analyse", () => {
    const series = seriesF();
    const table = lagTable(series, {});
    const p = portableBatchPlan(
      [
        { label: "F", source: SOURCE, analysis: { table, series } },
        { label: "flat", source: { ...SOURCE, column: 1 }, analysis: { reason: "constant" } },
      ],
      { summarySheet: "Batch", workSheet: "Work", placedOn: "2026-12-02", roomToGrow: true },
    );
    const [summary, work] = p.sheets;
    const row = (summary?.cells ?? []).filter((c) => c.row === 6).map((c) => c.content);
    expect(row).toEqual([
      { value: "F" },
      { formula: "='Work'!$B$11" },
      { formula: "='Work'!$B$24" },
      { formula: "='Work'!$B$25" },
      { formula: "='Work'!$B$26" },
      { formula: "='Work'!$B$7" },
      expect.objectContaining({}),
    ]);
    expect((summary?.cells ?? []).filter((c) => c.row === 7).map((c) => c.content)).toEqual([
      { value: "flat" },
      { value: "constant" },
    ]);
    expect(p.figures.get("row0:Q")).toBe(table.joint.q);
    expect(p.figures.get("row0:verdict")).toBe(table.verdict.word);
    expect(work?.chart).toBeUndefined();
  });
});

import { describe, expect, it } from "vitest";
import { lagTable, seriesFromCells } from "../../src/core";
import { PALETTE, portablePlan, type PortablePlan } from "../../src/report";
import { absoluteReference } from "../../taskpane/host/address";
import {
  PORTABLE_ROW_LIMIT,
  placePortable,
  portableSource,
} from "../../taskpane/host/placePortable";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { FakeExcel } from "./fakeExcel";
import { seriesFColumn } from "./seriesF";

async function seriesFPlan(): Promise<{ host: FakeExcel; plan: PortablePlan }> {
  const host = new FakeExcel("Forecast errors");
  host.sheet("Forecast errors").fill(
    "A1",
    seriesFColumn().map((v) => [v]),
  );
  await host.select("Forecast errors", "A1:A71");
  const read = await readSelectedRange(host.run);
  const series = seriesFromCells(read.cells);
  const source = portableSource(absoluteReference(read.address));
  const plan = portablePlan(lagTable(series, {}), series, source, {
    sheetName: "yield portable",
    placedOn: "2026-12-02",
  });
  return { host, plan };
}

describe("portableSource(reference)", () => {
  it("reads the sheet, column, first row and length of a one-column reference", () => {
    expect(portableSource("'Forecast errors'!$B$1:$B$105")).toEqual({
      sheet: "Forecast errors",
      column: 1,
      firstRow: 0,
      rows: 105,
    });
  });

  it("refuses a block of columns and a range beyond the row limit, saying what to do", () => {
    expect(() => portableSource("Sheet1!$B$1:$C$9")).toThrow(/one column/);
    expect(() => portableSource(`Sheet1!$A$1:$A$${PORTABLE_ROW_LIMIT + 1}`)).toThrow(
      /place a snapshot instead/,
    );
  });
});

describe("placePortable(run, portablePlan(...))", () => {
  it("writes every cell of the plan on a new sheet, formulas referring to the source or the sheet itself", async () => {
    const { host, plan } = await seriesFPlan();
    const placed = await placePortable(host.run, plan);
    expect(placed.sheetName).toBe("Echolot yield portable");
    const sheet = host.sheet("Echolot yield portable");
    const cells = plan.sheets[0]?.cells ?? [];
    expect(placed.cellsWritten).toBe(cells.length);
    // The verdict cell holds the native rule, the lag table's r_1 its lag sum.
    expect(sheet.get(6, 1).formula).toMatch(/^=IF\(OR\(\$B\$11<20,10>\$B\$11\/4\),"short"/);
    expect(sheet.get(36, 2).formula).toContain("SUMPRODUCT(INDEX($Z$37:$Z$107,1+$A$37)");
    // Per data row: the helpers read the source cell by cell (row 1 is the label: a gap).
    expect(sheet.get(36, 23).formula).toBe("=IF(ISNUMBER('Forecast errors'!$A$1),1,0)");
    const formulas = host.writes.filter((w) => w.kind === "formula").map((w) => String(w.content));
    expect(formulas.length).toBeGreaterThan(400);
    for (const f of formulas) {
      expect(f.replace(/'Forecast errors'!\$A\$\d+(:\$A\$\d+)?/g, ""), f).not.toMatch(/!/);
    }
    expect(host.writes.every((w) => w.sheet === "Echolot yield portable" && !w.overwrote)).toBe(
      true,
    );
    expect(host.activeSheet).toBe("Echolot yield portable");
  });

  it("adds a native chart bound to its cells: stacked corridors, diamonds coloured by zone", async () => {
    const { host, plan } = await seriesFPlan();
    await placePortable(host.run, plan);
    const [chart] = host.sheet("Echolot yield portable").charts;
    if (chart === undefined) throw new Error("no chart placed");
    expect(chart.type).toBe("AreaStacked");
    expect(chart.sourceAddress).toBe("O36:O46");
    const series = chart.seriesList.map((s) => ({
      values: s.valuesAddress,
      x: s.xValuesAddress,
      type: s.chartType,
      marker: s.markerBackgroundColor,
      fill: s.format.fill.colour,
      cleared: s.format.fill.cleared,
    }));
    expect(series).toEqual([
      {
        values: "O37:O46",
        x: "A37:A46",
        type: undefined,
        marker: undefined,
        fill: undefined,
        cleared: true,
      },
      {
        values: "P37:P46",
        x: "A37:A46",
        type: undefined,
        marker: undefined,
        fill: PALETTE.outerCorridor,
        cleared: false,
      },
      {
        values: "Q37:Q46",
        x: "A37:A46",
        type: undefined,
        marker: undefined,
        fill: PALETTE.innerCorridor,
        cleared: false,
      },
      {
        values: "R37:R46",
        x: "A37:A46",
        type: undefined,
        marker: undefined,
        fill: PALETTE.outerCorridor,
        cleared: false,
      },
      {
        values: "S37:S46",
        x: "A37:A46",
        type: "LineMarkers",
        marker: PALETTE.inside,
        fill: undefined,
        cleared: false,
      },
      {
        values: "T37:T46",
        x: "A37:A46",
        type: "LineMarkers",
        marker: PALETTE.watch,
        fill: undefined,
        cleared: false,
      },
      {
        values: "U37:U46",
        x: "A37:A46",
        type: "LineMarkers",
        marker: PALETTE.structure,
        fill: undefined,
        cleared: false,
      },
    ]);
    expect(chart.seriesList.slice(4).every((s) => s.format.line.lineStyle === "None")).toBe(true);
  });

  it("writes a long column in runs with a sync every 20,000 cells, within the host's request size", async () => {
    const host = new FakeExcel("Long");
    const values = Array.from({ length: 12_000 }, (_, t) => Math.sin(t * 0.7) + (t % 5));
    host.sheet("Long").fill(
      "B1",
      values.map((v) => [v]),
    );
    const series = seriesFromCells(values.map((v) => [v]));
    const plan = portablePlan(lagTable(series, {}), series, portableSource("Long!$B$1:$B$12000"), {
      sheetName: "long portable",
      placedOn: "2026-12-02",
    });
    const syncsBefore = host.syncs;
    const placed = await placePortable(host.run, plan);
    expect(placed.cellsWritten).toBeGreaterThan(6 * 12_000);
    // Three syncs of its own (names, emptiness check, last) and at least three in between.
    expect(host.syncs - syncsBefore).toBeGreaterThanOrEqual(6);
    const sheet = host.sheet("Echolot long portable");
    expect(sheet.get(36 + 11_999, 23).formula).toBe("=IF(ISNUMBER('Long'!$B$12000),1,0)");
  });

  it("refuses a plan of several sheets (a batch is the command line's)", async () => {
    const { host, plan } = await seriesFPlan();
    const [sheet] = plan.sheets;
    if (sheet === undefined) throw new Error("no sheet");
    await expect(
      placePortable(host.run, { sheets: [sheet, sheet], figures: plan.figures }),
    ).rejects.toThrow(/one series/);
  });
});

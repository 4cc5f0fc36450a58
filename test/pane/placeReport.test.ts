import { describe, expect, it } from "vitest";
import { lagTable, seriesFromCells, type LagTable } from "../../src/core";
import { PALETTE, ZONE_SHORT, liveReportPlan, snapshotReportPlan } from "../../src/report";
import { absoluteReference } from "../../taskpane/host/address";
import { literalText, placeReport } from "../../taskpane/host/placeReport";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { FakeExcel } from "./fakeExcel";
import { seriesFColumn } from "./seriesF";

async function workbookWithSeriesF(): Promise<{
  host: FakeExcel;
  table: LagTable;
  reference: string;
}> {
  const host = new FakeExcel("Forecast errors");
  host.sheet("Forecast errors").fill(
    "A1",
    seriesFColumn().map((v) => [v]),
  );
  await host.select("Forecast errors", "A1:A71");
  const read = await readSelectedRange(host.run);
  const table = lagTable(seriesFromCells(read.cells), {});
  return { host, table, reference: absoluteReference(read.address) };
}

describe("placeReport(run, liveReportPlan(table, source))", () => {
  it("writes the three ECHOLOT formulas on a new sheet, referencing the source range", async () => {
    const { host, table, reference } = await workbookWithSeriesF();
    expect(reference).toBe("'Forecast errors'!$A$1:$A$71");
    const placed = await placeReport(host.run, liveReportPlan(table, { reference }));

    expect(placed.sheetName).toBe("Echolot yield");
    const sheet = host.sheet("Echolot yield");
    expect(sheet.get(4, 1).formula).toBe(
      "=ECHOLOT.SERIESNOISECHECK('Forecast errors'!$A$1:$A$71,10,0,0,0.05)",
    );
    expect(sheet.get(6, 1).formula).toBe(
      "=ECHOLOT.SERIESPORTMANTEAU('Forecast errors'!$A$1:$A$71,10,0,\"ljung-box\")",
    );
    expect(sheet.get(8, 0).formula).toBe(
      "=ECHOLOT.SERIESLAGTABLE('Forecast errors'!$A$1:$A$71,10,0.05,\"noise\")",
    );
    // The marker columns follow the spilled z column (D10:D19) live.
    expect(sheet.get(9, 12).formula).toBe("=IF(ISNUMBER($D10),IF(ABS($D10)<=$R$9,$D10,NA()),NA())");
    expect(sheet.get(18, 14).formula).toBe(
      "=IF(ISNUMBER($D19),IF(ABS($D19)>$R$10,$D19,NA()),NA())",
    );
    expect(sheet.get(8, 17).value).toBe(table.innerLevel);
    expect(sheet.get(9, 17).value).toBe(table.outerLevel);

    // Every formula on the report sheet refers to the source range or to the report sheet itself.
    const formulas = host.writes.filter((w) => w.kind === "formula").map((w) => String(w.content));
    expect(formulas).toHaveLength(3 + 3 * table.maxLag);
    for (const f of formulas) {
      expect(f.replace(/'Forecast errors'!\$A\$1:\$A\$71/g, "")).not.toMatch(/!/);
    }
    expect(host.writes.every((w) => w.sheet === "Echolot yield" && !w.overwrote)).toBe(true);
    // The report sheet is not activated, so the selection (and the pane) stays on the source.
    expect(host.activeSheet).toBe("Forecast errors");
    expect(host.selection).toEqual({ sheet: "Forecast errors", range: "A1:A71" });
  });

  it("adds a native chart bound to the table: corridors as stacked areas, diamonds in our palette", async () => {
    const { host, table, reference } = await workbookWithSeriesF();
    await placeReport(host.run, liveReportPlan(table, { reference }));
    const [chart] = host.sheet("Echolot yield").charts;
    expect(chart).toBeDefined();
    if (chart === undefined) return;
    expect(chart.type).toBe("AreaStacked");
    expect(chart.sourceAddress).toBe("I9:L19");
    const series = chart.seriesList.map((s) => ({
      name: s.name,
      values: s.valuesAddress,
      x: s.xValuesAddress,
      type: s.chartType ?? "AreaStacked",
      marker: s.markerStyle,
      colour:
        s.markerBackgroundColor ??
        s.format.fill.colour ??
        (s.format.fill.cleared ? "none" : undefined),
    }));
    expect(series).toEqual([
      {
        name: "corridor base",
        values: "I10:I19",
        x: "A10:A19",
        type: "AreaStacked",
        marker: undefined,
        colour: "none",
      },
      {
        name: "all-lags corridor, lower",
        values: "J10:J19",
        x: "A10:A19",
        type: "AreaStacked",
        marker: undefined,
        colour: PALETTE.outerCorridor,
      },
      {
        name: "one-lag corridor",
        values: "K10:K19",
        x: "A10:A19",
        type: "AreaStacked",
        marker: undefined,
        colour: PALETTE.innerCorridor,
      },
      {
        name: "all-lags corridor, upper",
        values: "L10:L19",
        x: "A10:A19",
        type: "AreaStacked",
        marker: undefined,
        colour: PALETTE.outerCorridor,
      },
      {
        name: "inside",
        values: "M10:M19",
        x: "A10:A19",
        type: "LineMarkers",
        marker: "Diamond",
        colour: "#56636F",
      },
      {
        name: "between corridors",
        values: "N10:N19",
        x: "A10:A19",
        type: "LineMarkers",
        marker: "Diamond",
        colour: "#8A5F00",
      },
      {
        name: "beyond all-lags corridor",
        values: "O10:O19",
        x: "A10:A19",
        type: "LineMarkers",
        marker: "Diamond",
        colour: "#D55E00",
      },
    ]);
    for (const s of chart.seriesList.slice(4)) expect(s.format.line.lineStyle).toBe("None");
    // The stacked corridor block reaches the two levels: −outer, then −inner, +inner, +outer.
    const block = host.sheet("Echolot yield").grid("I10:L10").values[0] as number[];
    const edges = block.reduce<number[]>((acc, v) => [...acc, (acc[acc.length - 1] ?? 0) + v], []);
    const expected = [-table.outerLevel, -table.innerLevel, table.innerLevel, table.outerLevel];
    edges.forEach((edge, i) =>
      expect(
        Math.abs(edge - (expected[i] as number)),
        `corridor edge ${i}: got ${edge}, expected ${expected[i]}, tolerance 1e-12`,
      ).toBeLessThan(1e-12),
    );
  });

  it("never writes over a non-empty cell: an existing report sheet is left alone and a new name is taken", async () => {
    const { host, table, reference } = await workbookWithSeriesF();
    const earlier = host.addSheet("Echolot yield");
    earlier.fill("A1", [["an earlier note"], [42]]);
    const before = JSON.stringify([...earlier.cells]);
    const placed = await placeReport(host.run, liveReportPlan(table, { reference }));
    expect(placed.sheetName).toBe("Echolot yield (2)");
    expect(JSON.stringify([...earlier.cells])).toBe(before);
    expect(host.writes.some((w) => w.sheet === "Echolot yield")).toBe(false);
    expect(host.writes.every((w) => !w.overwrote)).toBe(true);
  });

  it("refuses, writing nothing, when a cell the report needs already holds something", async () => {
    const { host, table, reference } = await workbookWithSeriesF();
    host.onSheetAdded = (sheet) => sheet.fill("C12", [["keep me"]]);
    await expect(placeReport(host.run, liveReportPlan(table, { reference }))).rejects.toThrow(
      /already holds data at C12; nothing was written/,
    );
    expect(host.writes).toEqual([]);
    expect(host.sheet("Echolot yield").get(11, 2).value).toBe("keep me");
  });
});

describe("placeReport(run, snapshotReportPlan(table))", () => {
  it("writes values only: the verdict, the joint test, the lag table and the explanation", async () => {
    const { host, table } = await workbookWithSeriesF();
    await placeReport(host.run, snapshotReportPlan(table));
    const sheet = host.sheet("Echolot yield");
    expect(host.writes.filter((w) => w.kind === "formula")).toEqual([]);
    expect(sheet.get(0, 0).value).toBe("Echolot snapshot: yield");
    expect(sheet.get(4, 1).value).toBe(table.verdict.word);
    expect(sheet.get(4, 2).value).toBe(table.verdict.reason);
    expect(sheet.get(6, 1).value).toBe(table.joint.q);
    const rows = sheet.grid("A10:G19").values;
    rows.forEach((row, i) => {
      const r = table.rows[i];
      expect(row).toEqual([
        r?.lag,
        r?.correlation,
        r?.partial,
        r?.z,
        r === undefined ? "" : ZONE_SHORT[r.zone],
        r?.pLag,
        r?.pSidak,
      ]);
    });
    // One diamond column per zone holds each lag's z; the other two are empty.
    const markers = sheet.grid("M10:O19").values;
    markers.forEach((row, i) => expect(row.filter((v) => v !== "")).toEqual([table.rows[i]?.z]));
    expect(sheet.charts).toHaveLength(1);
  });
});

describe("literalText(text)", () => {
  it("keeps text that looks like a formula, or starts with an apostrophe, as text", () => {
    expect(literalText('=HYPERLINK("x")')).toBe('\'=HYPERLINK("x")');
    expect(literalText("'Forecast errors'!$A$1")).toBe("''Forecast errors'!$A$1");
    expect(literalText("-0.39 at lag 1")).toBe("'-0.39 at lag 1");
    expect(literalText("Verdict")).toBe("Verdict");
  });
});

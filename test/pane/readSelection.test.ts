import { describe, expect, it } from "vitest";
import { seriesFromCells } from "../../src/core";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { FakeExcel } from "./fakeExcel";
import { seriesFColumn } from "./seriesF";

describe("readSelectedRange(run)", () => {
  it("reads the used part of a selected column, its text label and its blank cells", async () => {
    const host = new FakeExcel("Forecast errors");
    const column = seriesFColumn();
    column[5] = ""; // two blanks inside the series become gaps
    column[40] = "";
    host.sheet("Forecast errors").fill(
      "B1",
      column.map((v) => [v]),
    );
    await host.select("Forecast errors", "B1:B500");

    const read = await readSelectedRange(host.run);
    expect(read.address).toBe("'Forecast errors'!B1:B71");
    expect(read.selected).toBe("'Forecast errors'!B1:B500");
    expect(read.rows).toBe(71);
    expect(read.cells[0]).toEqual(["yield"]);
    expect(read.cells[5]).toEqual([""]);
    expect(read.tooLargeForFunctions).toBe(false);

    const series = seriesFromCells(read.cells);
    expect(series.label).toBe("yield");
    expect(series.count).toBe(68);
    expect(series.gaps).toBe(2);
    expect(Number.isNaN(series.values[4] as number)).toBe(true);
  });

  it("reads a long column in chunks and reports progress after each", async () => {
    const host = new FakeExcel();
    const rows = 3_500;
    host.sheet("Sheet1").fill(
      "A1",
      Array.from({ length: rows }, (_, i) => [Math.sin(i)]),
    );
    await host.select("Sheet1", "A1:A3500");
    const progress: number[] = [];
    const read = await readSelectedRange(host.run, {
      chunkRows: 1_000,
      onProgress: (done, total) => {
        expect(total).toBe(rows);
        progress.push(done);
      },
    });
    expect(progress).toEqual([1_000, 2_000, 3_000, 3_500]);
    expect(read.cells).toHaveLength(rows);
    const valueLoads = host.loads.filter((l) => l.property === "values");
    expect(valueLoads.map((l) => l.cells)).toEqual([1_000, 1_000, 1_000, 500]);
    expect(read.cells[2_999]).toEqual([Math.sin(2_999)]);
  });

  it("flags a range too large for a cell function's payload, reading it 100,000 rows at a time", async () => {
    const host = new FakeExcel();
    const rows = 200_001;
    host.sheet("Sheet1").fill(
      "A1",
      Array.from({ length: rows }, (_, i) => [i % 7]),
    );
    await host.select("Sheet1", "A1:A200001");
    const read = await readSelectedRange(host.run);
    expect(read.tooLargeForFunctions).toBe(true);
    const valueLoads = host.loads.filter((l) => l.property === "values");
    expect(valueLoads.map((l) => l.cells)).toEqual([100_000, 100_000, 1]);
  });

  it("returns no cells for an empty selection", async () => {
    const host = new FakeExcel();
    await host.select("Sheet1", "C3:C9");
    const read = await readSelectedRange(host.run);
    expect(read.rows).toBe(0);
    expect(read.cells).toEqual([]);
  });
});

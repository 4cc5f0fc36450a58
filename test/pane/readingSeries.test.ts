import { describe, expect, it } from "vitest";
import { seriesOfReading } from "../../taskpane/host/hostMode";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { FakeExcel } from "./fakeExcel";
import { seriesFColumn } from "./seriesF";

describe("seriesOfReading(read)", () => {
  it("reads a block as one series per column, leaving out an empty column, each with its own reference", async () => {
    const host = new FakeExcel("Errors");
    const f = seriesFColumn();
    host.sheet("Errors").fill(
      "B2",
      f.map((v, i) => [v, "", i === 0 ? "second" : Number(v) % 5]),
    );
    await host.select("Errors", "B2:D71");
    const { series, references } = seriesOfReading(await readSelectedRange(host.run));
    expect(series.map((s) => s.label)).toEqual(["yield", "second"]);
    expect(references).toEqual(["'Errors'!$B$2:$B$71", "'Errors'!$D$2:$D$71"]);
    expect(series[0]?.count).toBe(69);
  });

  it("reads a single row as one series", async () => {
    const host = new FakeExcel();
    host.sheet("Sheet1").fill("A1", [["row series", 3, 1, 4, 1, 5, 9, 2, 6]]);
    await host.select("Sheet1", "A1:I1");
    const { series, references } = seriesOfReading(await readSelectedRange(host.run));
    expect(series).toHaveLength(1);
    expect(series[0]?.label).toBe("row series");
    expect(references).toEqual(["'Sheet1'!$A$1:$I$1"]);
  });
});

/**
 * Why a cell failed: the pane reads a failed ECHOLOT formula's arguments from the (fake) workbook
 * and recomputes the built function's message (dist/functions.js, as the page loads it).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { readEcholotCall } from "../../taskpane/host/cellFormula";
import { explainFailedCell } from "../../taskpane/host/whyFailed";
import { loadBuiltFunctions, type LoadedAddIn } from "../functions/host";
import { errorValue, FakeExcel } from "./fakeExcel";
import { seriesFColumn } from "./seriesF";

describe("readEcholotCall(formula)", () => {
  it("reads references (quoted sheets too), numbers, quoted text and omitted arguments", () => {
    expect(
      readEcholotCall(`=ECHOLOT.SERIESLAGTABLE('Q3 ''raw'' errors'!$B$1:$B$71,10,,"a, ""b""")`),
    ).toEqual({
      id: "SERIESLAGTABLE",
      args: [
        { kind: "reference", sheet: "Q3 'raw' errors", range: "$B$1:$B$71" },
        { kind: "number", value: 10 },
        { kind: "omitted" },
        { kind: "text", value: 'a, "b"' },
      ],
    });
    expect(readEcholotCall("=ECHOLOT.SERIESROLLCHECK(B:B, 250)")?.args[0]).toEqual({
      kind: "reference",
      sheet: null,
      range: "B:B",
    });
  });

  it("gives up on anything it cannot follow: a nested call, arithmetic, a defined name", () => {
    expect(readEcholotCall("=ECHOLOT.SERIESLAGCORR(OFFSET(A1,0,0,70),5)")).toBeNull();
    expect(readEcholotCall("=ECHOLOT.SERIESLAGCORR(A1:A70, 2+3)")).toBeNull();
    expect(readEcholotCall("=ECHOLOT.SERIESLAGCORR(residuals)")).toBeNull();
    expect(readEcholotCall("=SUM(A1:A3)")).toBeNull();
  });
});

describe("explainFailedCell(run, address, formula, shown)", () => {
  let addIn: LoadedAddIn;
  beforeAll(() => {
    addIn = loadBuiltFunctions();
  });

  const explain = (host: FakeExcel, address: string, formula: string, code: string) =>
    explainFailedCell(host.run, address, formula, { code }, addIn.byId);

  async function workbook(): Promise<FakeExcel> {
    const host = new FakeExcel("Errors");
    host.sheet("Errors").fill(
      "B1",
      seriesFColumn().map((v) => [v]),
    );
    host.addSheet("Report");
    return host;
  }

  it("shows the function's own message for a cell the host shows as a bare #VALUE!", async () => {
    const host = await workbook();
    host.sheet("Errors").fill("B13", [[errorValue("#DIV/0!")]]);
    const formula = `=ECHOLOT.SERIESLAGTABLE('Errors'!$B$1:$B$71,10,0.05,"noise")`;
    host.sheet("Report").setFormula("B5", formula, errorValue("#VALUE!"));
    const why = await explain(host, "Report!B5", formula, "#VALUE!");
    expect(why).toBe(
      "Cell Report!B5 shows #VALUE!. ECHOLOT.SERIESLAGTABLE, recomputed from the same arguments, gives #VALUE!: row 13 of the range holds the error #DIV/0!; fix that cell or make it blank or #N/A (a gap).",
    );
  });

  it("reads a whole-column reference on the formula's own sheet only down to its data", async () => {
    const host = await workbook();
    const formula = "=ECHOLOT.SERIESLAGCORR(B:B,80)";
    const why = await explain(host, "Errors!D2", formula, "#VALUE!");
    expect(why).toContain(
      "gives #VALUE!: maxLag must be a whole number from 1 to 69 (the series has 70 values)",
    );
    expect(host.loads.reduce((most, l) => Math.max(most, l.cells), 0)).toBeLessThanOrEqual(71);
  });

  it("says the error is the sheet's when the function, recomputed, gives a result", async () => {
    const host = await workbook();
    const formula = "=ECHOLOT.SERIESLAGCORR(Errors!B1:B71)";
    const why = await explain(host, "Report!A1", formula, "#SPILL!");
    expect(why).toBe(
      "Cell Report!A1 shows #SPILL!. ECHOLOT.SERIESLAGCORR, recomputed from the same arguments, gives a result, so the cells it spills into are not all empty, or the spill would run off the sheet; clear the cells below and to the right of it.",
    );
  });

  it("returns null for a formula it cannot follow", async () => {
    const host = await workbook();
    expect(
      await explainFailedCell(host.run, "Report!A1", "=1+ECHOLOT.SERIESLAGCORR(B1:B71)", {
        code: "#VALUE!",
      }),
    ).toBeNull();
  });
});

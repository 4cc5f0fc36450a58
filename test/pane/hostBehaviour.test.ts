/**
 * The pane's host glue against the documented behaviour of the fake host (test/pane/fakeExcel.ts,
 * each behaviour cited there): error cells as the host sends them, multi-area selections, reports
 * that keep the pane on its series, a pane that listens only while shown, failed syncs, the
 * request limits and the sheet-name rules.
 */
import { describe, expect, it, vi } from "vitest";
import { lagTable } from "../../src/core";
import { liveReportPlan, snapshotReportPlan, uniqueSheetName } from "../../src/report";
import { listenWhileVisible, messageOf, seriesOfReading } from "../../taskpane/host/hostMode";
import { placeReport } from "../../taskpane/host/placeReport";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { HostSession } from "../../taskpane/host/session";
import { errorValue, FakeExcel, sheetNameProblem } from "./fakeExcel";
import { recorder } from "./recorder";
import { seriesFColumn } from "./seriesF";

/** Series F in B1:B71 of "Forecast errors", selected. */
async function seriesFWorkbook(): Promise<FakeExcel> {
  const host = new FakeExcel("Forecast errors");
  host.sheet("Forecast errors").fill(
    "B1",
    seriesFColumn().map((v) => [v]),
  );
  await host.select("Forecast errors", "B1:B71");
  return host;
}

describe("error cells as the host sends them (values: the error string; valueTypes: Error)", () => {
  it("readSelectedRange + seriesOfReading take #N/A cells as gaps, the first one too", async () => {
    const host = await seriesFWorkbook();
    const sheet = host.sheet("Forecast errors");
    sheet.fill("B13", [[errorValue("#N/A")]]);
    sheet.fill("B40", [[errorValue("#N/A")]]);
    const read = await readSelectedRange(host.run);
    const [series] = seriesOfReading(read).series;
    expect(series?.label).toBe("yield");
    expect(series?.count).toBe(68);
    expect(series?.gaps).toBe(2);

    // An #N/A in place of the label is a leading gap, not a label called "#N/A".
    sheet.fill("B1", [[errorValue("#N/A")]]);
    const unlabelled = seriesOfReading(await readSelectedRange(host.run)).series[0];
    expect(unlabelled?.label).toBe("");
    expect(unlabelled?.count).toBe(68);
  });

  it("refuses any other error cell, naming the sheet cell it sits in", async () => {
    const host = await seriesFWorkbook();
    host.sheet("Forecast errors").fill("B13", [[errorValue("#DIV/0!")]]);
    const read = await readSelectedRange(host.run);
    expect(() => seriesOfReading(read)).toThrow(
      "cell B13 holds the error #DIV/0!; fix that cell or make it blank or #N/A (a gap)",
    );
  });

  it("tells a text cell that reads #N/A from an error cell by its value type", async () => {
    const host = await seriesFWorkbook();
    host.sheet("Forecast errors").fill("B20", [["#N/A"]]);
    const read = await readSelectedRange(host.run);
    expect(() => seriesOfReading(read)).toThrow('cell B20 holds the text "#N/A"');
  });
});

describe("a selection of several areas (getSelectedRange throws)", () => {
  it("says how many areas it saw where ExcelApi 1.9 can count them", async () => {
    const host = await seriesFWorkbook();
    await host.select("Forecast errors", "B1:B71,D1:D71");
    await expect(readSelectedRange(host.run, { support: host.supports })).rejects.toThrow(
      "the selection has 2 separate areas ('Forecast errors'!B1:B71,'Forecast errors'!D1:D71); select one column, row or block",
    );
  });

  it("reads the InvalidSelection code on an ExcelApi 1.8 host, never calling getSelectedRanges", async () => {
    const host = await seriesFWorkbook();
    host.apiVersion = "1.8";
    await host.select("Forecast errors", "B1:B71,D1:D71");
    const refused = readSelectedRange(host.run, { support: host.supports });
    await expect(refused).rejects.toThrow(
      "the selection has several separate areas; select one column, row or block",
    );
    expect(host.used.has("Workbook.getSelectedRanges")).toBe(false);
  });
});

describe("placing a report keeps the pane on its series", () => {
  it("a live report and a snapshot leave the selection, and the session's reading, where they were", async () => {
    const host = await seriesFWorkbook();
    const log = recorder();
    const session = new HostSession(host.run, log.listener, { support: host.supports });
    await session.start();
    const read = log.reads[0];
    if (read === undefined) throw new Error("no reading");
    const table = lagTable(seriesOfReading(read).series[0] as never, {});
    await placeReport(
      host.run,
      liveReportPlan(table, { reference: "'Forecast errors'!$B$1:$B$71" }),
    );
    await placeReport(host.run, snapshotReportPlan(table));
    await host.settle();
    expect(host.selection).toEqual({ sheet: "Forecast errors", range: "B1:B71" });
    expect(log.reads.map((r) => r.address)).toEqual(["'Forecast errors'!B1:B71"]);
    expect(log.errors).toEqual([]);
    await session.stop();
  });

  it("a pinned range ignores the change events the pane's own writes fire", async () => {
    const host = await seriesFWorkbook();
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await session.start();
    await session.pin();
    // A write by the add-in into the pinned sheet (as a report would, were it placed there).
    await host.run(async (context) => {
      context.workbook.worksheets.getItem("Forecast errors").getRange("B5").values = [[7]];
      await context.sync();
    });
    await host.settle();
    expect(log.reads).toHaveLength(1);
    // A user's edit of the same cell recomputes.
    await host.edit("Forecast errors", "B5", [[8]]);
    expect(log.reads).toHaveLength(2);
    await session.stop();
  });
});

describe("listenWhileVisible(session, Office.addin): the pane sleeps while hidden", () => {
  it("removes the selection and pin handlers when hidden, and reads afresh when shown", async () => {
    const host = await seriesFWorkbook();
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await listenWhileVisible(session, host.addin, (error: unknown) => log.errors.push(error));
    expect(log.reads).toHaveLength(1);
    expect(host.selectionHandlers).toHaveLength(1);
    await session.pin();
    expect(host.sheet("Forecast errors").changeHandlers).toHaveLength(1);

    await host.setVisibility("Hidden");
    expect(session.listening).toBe(false);
    // Removing handlers is a request of its own: it completes shortly after the event.
    await vi.waitFor(() => {
      expect(host.selectionHandlers).toHaveLength(0);
      expect(host.sheet("Forecast errors").changeHandlers).toHaveLength(0);
      expect(host.sheet("Forecast errors").calculatedHandlers).toHaveLength(0);
    });
    // While hidden, nothing the user does makes the pane read.
    await host.edit("Forecast errors", "B3", [[30]]);
    await host.select("Forecast errors", "D4");
    const syncs = host.syncs;
    expect(log.reads).toHaveLength(1);

    await host.setVisibility("Taskpane");
    await vi.waitFor(() => expect(log.reads).toHaveLength(2));
    expect(host.syncs).toBeGreaterThan(syncs);
    expect(session.pinnedAddress).toBe("'Forecast errors'!B1:B71");
    expect(host.sheet("Forecast errors").changeHandlers).toHaveLength(1);
    expect(log.reads).toHaveLength(2);
    expect(log.reads[1]?.cells[2]).toEqual([30]);
    expect(log.errors).toEqual([]);
    await session.stop();
  });
});

describe("failures the host reports", () => {
  it("a failed sync writes nothing and reaches the user as a message with its code", async () => {
    const host = await seriesFWorkbook();
    const read = await readSelectedRange(host.run);
    const table = lagTable(seriesOfReading(read).series[0] as never, {});
    host.failNextSync("GeneralException", "There was an internal error.");
    const placing = placeReport(host.run, snapshotReportPlan(table));
    await expect(placing).rejects.toThrow("There was an internal error.");
    expect(host.writes).toEqual([]);
    const error = await placing.catch((e: unknown) => e);
    expect(messageOf(error)).toBe(
      "The workbook refused the request (GeneralException): There was an internal error. Nothing was changed; try again, and reopen the pane if it keeps failing.",
    );
  });

  it("the fake refuses a response over 5 MB; the pane's chunked reads of a long column stay under it", async () => {
    const host = new FakeExcel();
    const rows = 250_000;
    const long = Array.from({ length: rows }, (_, i) => [Math.sin(i) * 1e-3 + i]);
    host.sheet("Sheet1").fill("A1", long);
    // One request for the whole column would carry about 7 MB of numbers and value types.
    const whole = host.run(async (context) => {
      const range = context.workbook.worksheets.getItem("Sheet1").getRange(`A1:A${rows}`);
      range.load(["values", "valueTypes"]);
      await context.sync();
    });
    await expect(whole).rejects.toMatchObject({ code: "ResponsePayloadSizeLimitExceeded" });
    await host.select("Sheet1", `A1:A${rows}`);
    const read = await readSelectedRange(host.run);
    expect(read.rows).toBe(rows);
    expect(messageOf(await whole.catch((e: unknown) => e))).toContain("select fewer cells");
  }, 60_000);
});

describe("report sheet names meet the host's rules", () => {
  it("uniqueSheetName(label) gives a name worksheets.add accepts for hostile labels", () => {
    const labels = [
      "a very long residual label that runs past thirty-one characters",
      "x".repeat(22) + "'quoted",
      "ratio: a/b [net]*?",
      "'",
      "",
    ];
    for (const label of labels) {
      const name = uniqueSheetName(label, ["Echolot report"]);
      expect(sheetNameProblem(name), `${label} → ${name}`).toBeUndefined();
    }
  });
});

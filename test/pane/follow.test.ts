import { describe, expect, it } from "vitest";
import { lagTable, seriesFromCells } from "../../src/core";
import type { RangeRead } from "../../taskpane/host/readRange";
import { HostSession } from "../../taskpane/host/session";
import { FakeExcel } from "./fakeExcel";
import { recorder } from "./recorder";
import { seriesFColumn } from "./seriesF";

function lagOne(read: RangeRead | undefined): number {
  if (read === undefined) throw new Error("no reading");
  return lagTable(seriesFromCells(read.cells), {}).rows[0]?.correlation ?? NaN;
}

describe("HostSession", () => {
  it("recomputes on selection change while it follows the selection", async () => {
    const host = new FakeExcel();
    host.sheet("Sheet1").fill(
      "A1",
      seriesFColumn().map((v) => [v]),
    );
    host.sheet("Sheet1").fill("C1", [["other"], ...Array.from({ length: 40 }, (_, i) => [i % 5])]);
    await host.select("Sheet1", "A1:A71");
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await session.start();
    expect(log.reads.map((r) => r.address)).toEqual(["Sheet1!A1:A71"]);
    await host.select("Sheet1", "C1:C41");
    expect(log.reads.map((r) => r.address)).toEqual(["Sheet1!A1:A71", "Sheet1!C1:C41"]);
    expect(log.errors).toEqual([]);
  });

  it("follows a pinned range: a change event inside it recomputes, one outside or a new selection does not", async () => {
    const host = new FakeExcel("Batch yields");
    host.sheet("Batch yields").fill(
      "B1",
      seriesFColumn().map((v) => [v]),
    );
    await host.select("Batch yields", "B1:B71");
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await session.start();
    await session.pin();
    expect(log.pins).toEqual(["'Batch yields'!B1:B71"]);
    const before = lagOne(log.reads.at(-1));

    await host.select("Batch yields", "D4");
    await host.edit("Batch yields", "E2", [[99]]);
    expect(log.reads).toHaveLength(1);

    // Series F's third value (23, in B3) becomes 30: the pinned range changes, so the lag table does.
    await host.edit("Batch yields", "B3", [[30]]);
    expect(log.reads).toHaveLength(2);
    expect(log.reads[1]?.cells[2]).toEqual([30]);
    const edited = seriesFColumn();
    edited[2] = 30;
    const expected = lagTable(seriesFromCells(edited.map((v) => [v])), {}).rows[0]?.correlation;
    const after = lagOne(log.reads.at(-1));
    expect(after).not.toBe(before);
    expect(after).toBe(expected);

    await session.unpin();
    expect(log.pins).toEqual(["'Batch yields'!B1:B71", null]);
    expect(host.sheet("Batch yields").changeHandlers).toHaveLength(0);
    await host.select("Batch yields", "B1:B40");
    expect(log.reads.at(-1)?.address).toBe("'Batch yields'!B1:B40");
    await session.stop();
    expect(host.selectionHandlers).toHaveLength(0);
  });

  it("follows a pinned range of formulas: a recalculation that moves its values recomputes, one that does not is ignored", async () => {
    const host = new FakeExcel("Model");
    host.sheet("Model").fill(
      "B1",
      seriesFColumn().map((v) => [v]),
    );
    await host.select("Model", "B1:B71");
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await session.start();
    await session.pin();
    expect(log.reads).toHaveLength(1);

    // A recalculation elsewhere on the sheet leaves the residuals as they were: no new reading.
    await host.recalculate("Model");
    expect(log.reads).toHaveLength(1);

    // The model's inputs change, so its residual formulas give new values without any edit there.
    await host.recalculate("Model", "B3", [[30]]);
    expect(log.reads).toHaveLength(2);
    expect(log.reads[1]?.cells[2]).toEqual([30]);

    await session.unpin();
    expect(host.sheet("Model").calculatedHandlers).toHaveLength(0);
    await session.stop();
  });

  it("refuses to pin before anything with values was read", async () => {
    const host = new FakeExcel();
    await host.select("Sheet1", "A1:A5");
    const log = recorder();
    const session = new HostSession(host.run, log.listener);
    await session.start();
    await expect(session.pin()).rejects.toThrow(/select a range with values first/);
  });
});

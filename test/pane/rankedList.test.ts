/**
 * The pane's ranked list (src/report/rankedList.ts) and where "Export ranked list" puts it in a
 * workbook (taskpane/host/placeRankedList.ts): one order for table, picker and export, the kept
 * mark at the false-discovery cut-off, CSV as RFC 4180 writes it, and a new sheet of values.
 */
import { describe, expect, it } from "vitest";
import { auditBatch, batchCheck, seriesFromValues, type Series } from "../../src/core";
import { rankedAudit, rankedBatch, rankedListCsv, rankedListGrid } from "../../src/report";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { placeRankedList } from "../../taskpane/host/placeRankedList";
import { FakeExcel } from "./fakeExcel";

function items(): Series[] {
  const random = seededRandom(7);
  const make = (label: string, values: Float64Array) =>
    seriesFromValues([label, ...Array.from(values)]);
  return [
    make("calm one", whiteNoise(random, 120)),
    make('=sneaky, "quoted"', whiteNoise(random, 120)),
    make("strong", ar1(random, 120, 0.7)),
    make("calm two", whiteNoise(random, 120)),
    make(
      "biased",
      whiteNoise(random, 120).map((e) => e + 1),
    ),
  ];
}

describe("rankedBatch(batch)", () => {
  it("ranks by ascending q-value, keeps the items at or below alpha, and remembers each place", () => {
    const batch = batchCheck(items(), {});
    const list = rankedBatch(batch);
    expect(list.items.map((item) => item.rank)).toEqual([1, 2, 3, 4, 5]);
    const q = list.items.map((item) => item.qValue);
    expect(q.every((v, i) => i === 0 || v >= (q[i - 1] as number))).toBe(true);
    expect(list.items[0]!.label).toBe("strong");
    expect(list.items[0]!.index).toBe(2);
    for (const item of list.items) {
      expect(item.kept).toBe(item.qValue <= batch.alpha);
      expect(batch.rows[item.index]!.label).toBe(item.label);
    }
    expect(list.keptCount).toBe(list.items.filter((item) => item.kept).length);
  });
});

describe("rankedAudit(audit)", () => {
  it("ranks the strong and the biased item first and keeps both", () => {
    const list = rankedAudit(auditBatch(items(), { horizon: 1 }));
    expect(list.kind).toBe("audit");
    expect(
      list.items
        .slice(0, 2)
        .map((item) => item.label)
        .sort(),
    ).toEqual(["biased", "strong"]);
    expect(list.items.slice(0, 2).every((item) => item.kept)).toBe(true);
    const biased = list.items.find((item) => item.label === "biased")!;
    expect(biased.biasQValue).toBeLessThanOrEqual(0.05);
  });
});

describe("rankedListCsv(list)", () => {
  it("writes a header and one line per item, quoting as RFC 4180 and defusing formulas", () => {
    const list = rankedBatch(batchCheck(items(), {}));
    const lines = rankedListCsv(list).split("\r\n");
    expect(lines[0]).toBe("rank,item,n,p,q-value,kept (q-value at most 0.05),verdict,reason");
    expect(lines).toHaveLength(7);
    expect(lines[6]).toBe("");
    const sneaky = lines.find((line) => line.includes("sneaky"))!;
    // OWASP, "CSV Injection": a leading apostrophe keeps "=…" text from running as a formula.
    expect(sneaky).toMatch(/^\d,"'=sneaky, ""quoted""",120,/);
    const strong = lines[1]!.split(",");
    expect(strong.slice(0, 3)).toEqual(["1", "strong", "120"]);
    expect(Number(strong[3])).toBe(list.items[0]!.p);
  });
});

describe("placeRankedList(run, grid)", () => {
  it("writes the list as values on a new sheet, leaves the selection, and names the sheet", async () => {
    const host = new FakeExcel("Data");
    await host.select("Data", "A1");
    const list = rankedBatch(batchCheck(items(), {}));
    const grid = rankedListGrid(list);
    const name = await placeRankedList(host.run, grid);
    expect(name).toBe("Echolot ranked");
    const placed = host.sheet("Echolot ranked").grid("A1:H6");
    expect(placed.values[0]).toEqual(grid[0]);
    expect(placed.values[1]?.[1]).toBe("strong");
    expect(placed.values.map((row) => row[1])).toContain('\'=sneaky, "quoted"');
    expect(host.selection).toEqual({ sheet: "Data", range: "A1" });
    expect(await placeRankedList(host.run, grid)).toBe("Echolot ranked (2)");
  });
});

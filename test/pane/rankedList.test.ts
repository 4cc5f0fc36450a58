/**
 * The pane's ranked list (src/report/rankedList.ts) and where "Export ranked list" puts it in a
 * workbook (taskpane/host/placeRankedList.ts): one order for table, picker and export, the kept
 * mark at the false-discovery cut-off, CSV as RFC 4180 writes it, and a new sheet of values.
 */
import { describe, expect, it } from "vitest";
import { auditBatch, batchCheck, seriesFromValues, type Series } from "../../src/core";
import {
  keptWords,
  rankedAudit,
  rankedBatch,
  rankedListCsv,
  rankedListGrid,
  type RankedList,
} from "../../src/report";
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

/** The labels of the first two ranked items, in alphabetical order. */
function firstTwo(list: RankedList): string[] {
  return list.items
    .slice(0, 2)
    .map((item) => item.label)
    .sort();
}

describe("rankedBatch(batch)", () => {
  it("lists kept findings first, marks what each step keeps, and remembers each place", () => {
    const batch = batchCheck(items(), {});
    const list = rankedBatch(batch);
    expect(list.items.map((item) => item.rank)).toEqual([1, 2, 3, 4, 5]);
    // The strong lag-1 item and the one running high are the two kept, in either order.
    expect(list.keptCount).toBe(2);
    expect(firstTwo(list)).toEqual(["biased", "strong"]);
    const strong = list.items.find((item) => item.label === "strong")!;
    const biased = list.items.find((item) => item.label === "biased")!;
    expect(strong.keptLags).toBe(true);
    expect(biased.keptBias).toBe(true);
    expect(keptWords(strong)).toBe(strong.keptBias ? "kept: lags, bias" : "kept");
    expect(keptWords(biased)).toMatch(/bias$/);
    expect(biased.title).toMatch(/, biased$/);
    for (const item of list.items) {
      const row = batch.rows[item.index]!;
      expect(row.label).toBe(item.label);
      expect(item.kept).toBe(row.kept || row.headline?.biased === true);
      expect(item.reason).toBe(row.headline?.finding);
    }
  });
});

describe("rankedAudit(audit)", () => {
  it("ranks the strong and the biased item first and keeps both", () => {
    const list = rankedAudit(auditBatch(items(), { horizon: 1 }));
    expect(list.kind).toBe("audit");
    expect(firstTwo(list)).toEqual(["biased", "strong"]);
    expect(list.items.slice(0, 2).every((item) => item.kept)).toBe(true);
    const biased = list.items.find((item) => item.label === "biased")!;
    expect(biased.biasQValue).toBeLessThanOrEqual(0.05);
  });
});

describe("rankedListCsv(list)", () => {
  it("writes a header and one line per item, quoting as RFC 4180 and defusing formulas", () => {
    const list = rankedBatch(batchCheck(items(), {}));
    const lines = rankedListCsv(list).split("\r\n");
    expect(lines[0]).toBe(
      "rank,item,n,p,q-value,bias p,bias q-value,volatility p,kept (q-value at most 0.05),verdict,finding",
    );
    expect(lines).toHaveLength(7);
    expect(lines[6]).toBe("");
    const sneaky = lines.find((line) => line.includes("sneaky"))!;
    // OWASP, "CSV Injection": a leading apostrophe keeps "=…" text from running as a formula.
    expect(sneaky).toMatch(/^\d,"'=sneaky, ""quoted""",120,/);
    const first = lines[1]!.split(",");
    expect(first.slice(0, 3)).toEqual(["1", list.items[0]!.label, "120"]);
    expect(Number(first[3])).toBe(list.items[0]!.p);
    expect(Number(first[5])).toBe(list.items[0]!.biasP);
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
    const placed = host.sheet("Echolot ranked").grid("A1:K6");
    expect(placed.values[0]).toEqual(grid[0]);
    expect(placed.values[1]?.[1]).toBe(list.items[0]!.label);
    expect(placed.values.map((row) => row[1])).toContain('\'=sneaky, "quoted"');
    expect(host.selection).toEqual({ sheet: "Data", range: "A1" });
    expect(await placeRankedList(host.run, grid)).toBe("Echolot ranked (2)");
  });
});

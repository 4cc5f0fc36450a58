import { describe, expect, it } from "vitest";
import { lagTable } from "../../src/core";
import {
  columnLetters,
  liveReportFormulas,
  liveReportPlan,
  snapshotReportPlan,
  uniqueSheetName,
} from "../../src/report";
import { seriesF } from "./chartTree";

describe("liveReportFormulas(table, source)", () => {
  it("passes every setting explicitly, an unset season as 0 (none), never an empty middle argument", () => {
    const reference = "'Q3 errors'!$B$1:$B$71";
    expect(liveReportFormulas(lagTable(seriesF(), {}), { reference })).toEqual({
      noiseCheck: "=ECHOLOT.SERIESNOISECHECK('Q3 errors'!$B$1:$B$71,10,0,0,0.05)",
      lagTable: "=ECHOLOT.SERIESLAGTABLE('Q3 errors'!$B$1:$B$71,10,0.05,\"noise\")",
      portmanteau: "=ECHOLOT.SERIESPORTMANTEAU('Q3 errors'!$B$1:$B$71,10,0,\"ljung-box\")",
    });
    const seasonal = lagTable(seriesF(), {
      maxLag: 14,
      season: 7,
      fittedParams: 2,
      alpha: 0.01,
      bandKind: "robust",
      testKind: "robust",
    });
    expect(liveReportFormulas(seasonal, { reference })).toEqual({
      noiseCheck: "=ECHOLOT.SERIESNOISECHECK('Q3 errors'!$B$1:$B$71,14,7,2,0.01)",
      lagTable: "=ECHOLOT.SERIESLAGTABLE('Q3 errors'!$B$1:$B$71,14,0.01,\"robust\",7)",
      portmanteau: "=ECHOLOT.SERIESPORTMANTEAU('Q3 errors'!$B$1:$B$71,14,2,\"robust\")",
    });
    for (const formula of Object.values(liveReportFormulas(lagTable(seriesF(), {}), { reference })))
      expect(formula, formula).not.toMatch(/,,|,\)/);
  });
});

describe("liveReportPlan(table, source) and snapshotReportPlan(table)", () => {
  it("keep every cell inside the extent the host checks for emptiness, with no cell written twice", () => {
    const table = lagTable(seriesF(), { maxLag: 17, season: 6 });
    for (const plan of [
      liveReportPlan(table, { reference: "'S'!$A$1:$A$71" }),
      snapshotReportPlan(table),
    ]) {
      const seen = new Set<string>();
      for (const cell of plan.cells) {
        expect(
          cell.row < plan.extent.rows && cell.column < plan.extent.columns,
          `${plan.kind} cell ${cell.row},${cell.column}`,
        ).toBe(true);
        const key = `${cell.row},${cell.column}`;
        expect(seen.has(key), `${plan.kind} writes ${key} twice`).toBe(false);
        seen.add(key);
      }
      // The spilled table (header + K rows, 7 columns) lands on cells the plan leaves empty.
      for (let r = 8; r <= 8 + 17; r++)
        for (let c = 0; c < 7; c++) {
          if (plan.kind === "live" && !(r === 8 && c === 0))
            expect(seen.has(`${r},${c}`)).toBe(false);
        }
      expect(plan.chart.series).toHaveLength(7);
      expect(plan.chart.categories).toBe("A10:A26");
    }
  });

  it("snapshot holds no formula at all", () => {
    const plan = snapshotReportPlan(lagTable(seriesF(), {}));
    expect(plan.cells.filter((c) => "formula" in c.content)).toEqual([]);
  });
});

describe("uniqueSheetName(label, existing)", () => {
  it("avoids taken names (ignoring case), forbidden characters and the 31-character limit", () => {
    expect(uniqueSheetName("yield", [])).toBe("Echolot yield");
    expect(uniqueSheetName("yield", ["echolot YIELD"])).toBe("Echolot yield (2)");
    expect(uniqueSheetName("yield", ["Echolot yield", "Echolot yield (2)"])).toBe(
      "Echolot yield (3)",
    );
    expect(uniqueSheetName("", [])).toBe("Echolot report");
    expect(uniqueSheetName("a/b:c*d?[e]", [])).toBe("Echolot a b c d e");
    const long = uniqueSheetName("Harbour Dawn weekly forecast errors", [
      "Echolot Harbour Dawn weekly for",
    ]);
    expect(long.length).toBeLessThanOrEqual(31);
    expect(long).toBe("Echolot Harbour Dawn weekly (2)");
  });
});

describe("columnLetters(column)", () => {
  it("counts A..Z, AA..ZZ, AAA", () => {
    expect([0, 25, 26, 51, 701, 702].map(columnLetters)).toEqual([
      "A",
      "Z",
      "AA",
      "AZ",
      "ZZ",
      "AAA",
    ]);
  });
});

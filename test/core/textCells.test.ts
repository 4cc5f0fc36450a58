import { describe, expect, it } from "vitest";
import { isNumberColumn, readTextCell } from "../../src/core";

describe("readTextCell(cell)", () => {
  it("reads gaps, plain numbers, and passes any other text on for the intake to refuse", () => {
    // Rules of our own (DESIGN.md "Numbers"; the CLI issue: empty and NA cells are gaps).
    for (const gap of ["", "  ", "NA", "na", "N/A", "#N/A"])
      expect(readTextCell(gap), gap).toBe(null);
    expect(readTextCell("-1.5")).toBe(-1.5);
    expect(readTextCell("2e-3")).toBe(0.002);
    expect(readTextCell(" 7 ")).toBe(7);
    for (const text of ["12abc", "Infinity", "1,5", "0x10", "TRUE"]) {
      expect(readTextCell(text), text).toBe(text);
    }
  });
});

describe("isNumberColumn(cells)", () => {
  it("is decided by the first cell that is not a gap", () => {
    expect(isNumberColumn(["", "NA", "3", "x"])).toBe(true);
    expect(isNumberColumn(["2024-01-07", "5"])).toBe(false);
    expect(isNumberColumn(["", "NA"])).toBe(false);
  });
});

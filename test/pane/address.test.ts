import { describe, expect, it } from "vitest";
import { absoluteReference, parseAreas, splitAddress, touches } from "../../taskpane/host/address";

describe("splitAddress(address)", () => {
  it("splits quoted and plain sheet names from the range", () => {
    expect(splitAddress("Sheet1!B1:B71")).toEqual({ sheet: "Sheet1", range: "B1:B71" });
    expect(splitAddress("'Q3 errors'!B:B")).toEqual({ sheet: "Q3 errors", range: "B:B" });
    expect(splitAddress("'Tom''s sheet'!A1")).toEqual({ sheet: "Tom's sheet", range: "A1" });
    expect(splitAddress("C5")).toEqual({ sheet: "", range: "C5" });
  });
});

describe("absoluteReference(address)", () => {
  it("quotes the sheet and makes every corner absolute, for a formula", () => {
    expect(absoluteReference("Sheet1!B1:B71")).toBe("'Sheet1'!$B$1:$B$71");
    expect(absoluteReference("'Tom''s sheet'!A1")).toBe("'Tom''s sheet'!$A$1");
    expect(absoluteReference("Data!B:B")).toBe("'Data'!$B:$B");
  });
});

describe("touches(changed, pinned)", () => {
  it("is true exactly when the areas overlap", () => {
    expect(touches("B3", "B1:B71")).toBe(true);
    expect(touches("A1:C2", "B2:B9")).toBe(true);
    expect(touches("C3", "B1:B71")).toBe(false);
    expect(touches("B72", "B1:B71")).toBe(false);
    expect(touches("B100000", "B:B")).toBe(true);
    expect(touches("D4, B9", "B1:B71")).toBe(true);
    expect(parseAreas("3:5")).toEqual([
      { firstRow: 2, lastRow: 4, firstColumn: 0, lastColumn: 16_383 },
    ]);
  });
});

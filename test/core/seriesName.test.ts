import { describe, expect, it } from "vitest";
import { seriesName } from "../../src/core";

// The wording is ours (DESIGN.md leaves it open): these pin each use so every view agrees.
describe("seriesName(label, use, standIn)", () => {
  it("names a labelled series in each use", () => {
    expect(seriesName("Sales")).toBe('the series "Sales"');
    expect(seriesName("Sales", "prose")).toBe("“Sales”");
    expect(seriesName("Sales", "heading")).toBe("Sales");
    expect(seriesName("Sales", "cell")).toBe("Sales");
  });

  it("gives each use its plain stand-in when the series has no label", () => {
    expect(seriesName("")).toBe("the series");
    expect(seriesName("", "prose")).toBe("the series");
    expect(seriesName("", "heading")).toBe("Series");
    expect(seriesName("", "cell")).toBe("series");
  });

  it("puts a position or an argument in the place of a missing label, counting from 1", () => {
    expect(seriesName("", "cell", { column: 0 })).toBe("column 1");
    expect(seriesName("", "cell", { item: 4 })).toBe("series 5");
    expect(seriesName("", "message", { argument: "y" })).toBe("y");
    expect(seriesName("Sales", "message", { argument: "y" })).toBe('y ("Sales")');
    // A label always wins over a position.
    expect(seriesName("Sales", "cell", { column: 3 })).toBe("Sales");
  });
});

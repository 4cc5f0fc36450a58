/**
 * The standalone pane's reading of pasted or dropped text: the same table reader as the CLI, so
 * an empty line is a gap, a semicolon file with decimal commas reads, and a bad first cell is
 * refused at its line instead of the next column being analysed.
 */
import { describe, expect, it } from "vitest";
import { seriesFromText } from "../../taskpane/standalone/delimited";

describe("seriesFromText(text, origin)", () => {
  it("reads an empty line of a one-column paste as a gap", () => {
    const { series } = seriesFromText("x\n1\n2\n\n4\n5\n3\n", "the pasted values");
    expect(series[0]!.count).toBe(5);
    expect(series[0]!.gaps).toBe(1);
  });

  it("reads a semicolon file with decimal commas and names the date column it left aside", () => {
    const { series, skipped } = seriesFromText(
      "Datum;Fehler\n2024-01-01;-0,25\n2024-01-02;1,5\n2024-01-03;0,75\n",
      "fehler.csv",
    );
    expect(Array.from(series[0]!.values)).toEqual([-0.25, 1.5, 0.75]);
    expect(series[0]!.label).toBe("Fehler");
    expect(skipped).toEqual(["Datum (dates)"]);
  });

  it("refuses a residual column starting with nan at that line, not the next column", () => {
    expect(() => seriesFromText("resid,fitted\nnan,10\n0.5,11\n-1,12\n", "drop.csv")).toThrow(
      /^line 2, column 1 \("resid"\) of drop\.csv holds "nan", which is not a number: if it marks a missing value, replace "nan" with an empty cell/,
    );
  });

  it("reads pasted cells without a header and one row of values as a series", () => {
    expect(seriesFromText("1.5\t2\n3\t-4\n0\t7\n", "the pasted values").series).toHaveLength(2);
    expect(seriesFromText("1 2 3 5 8", "the pasted values").series[0]!.count).toBe(5);
  });

  it("reads decimal commas pasted one a line as one column of decimals, and says how", () => {
    // The case: split at the comma, the whole-number parts were judged instead.
    const { series, reading } = seriesFromText("-0,272644\n0,1\n1,25\n", "the pasted values");
    expect(series).toHaveLength(1);
    expect(Array.from(series[0]!.values)).toEqual([-0.272644, 0.1, 1.25]);
    expect(reading).toBe('Read as one value a line, decimal comma: "-0,272644" is -0.272644.');
  });

  it("reads semicolon-separated decimal commas on one line as one series, and says how", () => {
    const { series, reading } = seriesFromText("-0,5;0,25;1,75", "the pasted values");
    expect(Array.from(series[0]!.values)).toEqual([-0.5, 0.25, 1.75]);
    expect(reading).toBe('Read as one row of values, decimal comma: "-0,5" is -0.5.');
  });

  it("says a comma-separated file with a header was read with a decimal point", () => {
    const { reading } = seriesFromText("a,b\n1.5,2\n3,4.25\n", "t.csv");
    expect(reading).toBe('Read as comma-separated columns, decimal point: "1.5" is 1.5.');
  });
});

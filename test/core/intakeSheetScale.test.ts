/**
 * The one-pass intake at sheet scale: a full 1,048,576-row column reads without copying the
 * cells (and without overflowing the stack, which a spread over the rows would), gives the series
 * the rules describe, and still names the first offending cell although the trailing gaps are
 * trimmed before the cells are read.
 */
import { describe, expect, it } from "vitest";
import { seriesFromCells, seriesFromNumbers, seriesFromValues } from "../../src/core";
import { seededRandom } from "../../src/sim/random";

const SHEET_ROWS = 1_048_576;

describe("seriesFromCells(a full sheet column)", () => {
  it("reads 1,048,576 rows of numbers and blanks into the series the rules give", () => {
    const random = seededRandom(1_048_576);
    const rows: unknown[][] = new Array<unknown[]>(SHEET_ROWS);
    // The first 3 and last 5 rows are blank (trimmed); about 1% blanks in between stay as gaps.
    const first = 3;
    const last = SHEET_ROWS - 6;
    for (let r = 0; r < SHEET_ROWS; r++) {
      const blank = r < first || r > last || (r > first && r < last && random.uniform() < 0.01);
      rows[r] = [blank ? "" : (r % 1000) - 500.5];
    }
    const series = seriesFromCells(rows);
    const length = last - first + 1;
    expect(series.values.length).toBe(length);
    let gaps = 0;
    for (let t = 0; t < length; t++) {
      const cell = rows[first + t]?.[0];
      const gap = cell === "";
      if (gap) gaps++;
      const ok = gap
        ? series.present[t] === 0 && Number.isNaN(series.values[t])
        : series.present[t] === 1 && series.values[t] === cell;
      if (!ok) expect.fail(`position ${t}: cell ${String(cell)}, read ${series.values[t]}`);
    }
    expect(gaps > 5000, "the column has interior gaps").toBe(true);
    expect(series.gaps).toBe(gaps);
    expect(series.count).toBe(length - gaps);
  });

  it("names the first offending row even when later rows are bad too or blank", () => {
    // Rows: label, 1, 2, "x", 3, TRUE, blank, blank → row 4 is the first that is refused.
    const rows = [["Errors"], [1], [2], ["x"], [3], [true], [""], [""]];
    expect(() => seriesFromCells(rows)).toThrow(/^row 4 of the range holds the text "x"/);
    // Leading blanks, then a bad cell: the bad cell is named by its row, not skipped.
    expect(() => seriesFromCells([[""], [null], [{ code: "#DIV/0!" }], [1]])).toThrow(
      /^row 3 of the range holds the error #DIV\/0!/,
    );
    // A trailing bad cell after trailing blanks is still read (and refused).
    expect(() => seriesFromCells([[1], [2], [""], ["12"], [""]])).toThrow(
      /^row 4 of the range holds the text "12"; numbers stored as text/,
    );
  });

  it("reads a one-row range by columns and names columns", () => {
    const series = seriesFromCells([["Q1", 1, "", 3, ""]]);
    expect(series.label).toBe("Q1");
    expect(Array.from(series.values)).toEqual([1, NaN, 3]);
    expect(() => seriesFromCells([[1, 2, "n/a", 4]])).toThrow(/^column 3 of the range holds/);
  });

  it("does not mutate the cells", () => {
    const rows = [["Label"], [""], [1], [{ code: "#N/A" }], [2], [""]];
    const copy = JSON.stringify(rows);
    seriesFromCells(rows);
    expect(JSON.stringify(rows)).toBe(copy);
  });
});

describe("seriesFromNumbers(typed array) and seriesFromValues(list) agree", () => {
  it("a Float64Array and the same numbers as a list give the same series", () => {
    const random = seededRandom(42);
    const numbers = Float64Array.from({ length: 1000 }, () => random.normal());
    const fromTyped = seriesFromNumbers(numbers, "x");
    const fromList = seriesFromValues(Array.from(numbers), {
      label: "x",
      labelFromFirstCell: false,
    });
    expect(Array.from(fromTyped.values)).toEqual(Array.from(fromList.values));
    expect(fromTyped.count).toBe(1000);
    expect(fromTyped.gaps).toBe(0);
    expect(fromTyped.values).not.toBe(numbers);
  });

  it("refuses NaN among numbers, naming its item", () => {
    expect(() => seriesFromNumbers(Float64Array.from([1, NaN, 2]))).toThrow(
      /^item 2 holds NaN, which is not a finite number/,
    );
  });
});

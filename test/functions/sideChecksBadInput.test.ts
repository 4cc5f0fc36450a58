/**
 * Bad input through the eight side-check functions of the built add-in: each case gives the right
 * error value (#VALUE! when the user must fix the input or an argument, #N/A when there is not
 * enough data) and a message that says what is wrong and, where it can, what to do.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { readSeriesF } from "../helpers/fixtures";
import { columnRange, ErrorCode, loadBuiltFunctions, type LoadedAddIn } from "./host";

const seriesF = [...readSeriesF()];
const F = columnRange(["yield", ...seriesF]);
const VALUE = ErrorCode.invalidValue;
const NA = ErrorCode.notAvailable;
const alternating = columnRange(Array.from({ length: 40 }, (_, t) => (t % 2 === 0 ? 1 : -1)));
const flat = columnRange(Array.from({ length: 30 }, () => 7));

interface BadCase {
  readonly what: string;
  readonly id: string;
  readonly args: readonly unknown[];
  readonly code: string;
  /** Text the message must contain. */
  readonly says: string;
}

const CASES: readonly BadCase[] = [
  {
    what: "lags 0",
    id: "SERIESVOLCHECK",
    args: [F, 0],
    code: VALUE,
    says: "lags must be a whole number from 1 to 69 (the series has 70 values)",
  },
  {
    what: "lags leaving too few rows",
    id: "SERIESVOLCHECK",
    args: [F, 40],
    code: NA,
    says: "use fewer lags",
  },
  {
    what: "constant squared deviations",
    id: "SERIESVOLCHECK",
    args: [alternating, 2],
    code: VALUE,
    says: "squared deviations",
  },
  {
    what: "lags given as text",
    id: "SERIESVOLCHECK",
    args: [F, "4"],
    code: VALUE,
    says: "lags must be a number, not text",
  },
  {
    what: "hacLags −1",
    id: "SERIESBIASCHECK",
    args: [F, -1],
    code: VALUE,
    says: "hacLags must be a whole number from 0 to 69",
  },
  {
    what: "a constant series",
    id: "SERIESBIASCHECK",
    args: [flat],
    code: VALUE,
    says: "is constant: its mean has no sampling error",
  },
  {
    what: "two values",
    id: "SERIESBIASCHECK",
    args: [columnRange([1, 2])],
    code: NA,
    says: "the bias check needs at least 3 values",
  },
  {
    what: "horizon 0",
    id: "SERIESFORECASTAUDIT",
    args: [F, 0],
    code: VALUE,
    says: "horizon must be a whole number from 1 to 69",
  },
  {
    what: "horizon −3",
    id: "SERIESFORECASTAUDIT",
    args: [F, -3],
    code: VALUE,
    says: "the number of periods ahead the forecasts were made",
  },
  {
    what: "horizon 2.5",
    id: "SERIESFORECASTAUDIT",
    args: [F, 2.5],
    code: VALUE,
    says: "horizon must be a whole number",
  },
  {
    what: "season 1",
    id: "SERIESFORECASTAUDIT",
    args: [F, 1, 1],
    code: VALUE,
    says: "season must be a whole number from 2",
  },
  {
    what: "alpha 1.5",
    id: "SERIESFORECASTAUDIT",
    args: [F, 1, null, 1.5],
    code: VALUE,
    says: "alpha must be a number between 0 and 1",
  },
  {
    what: "a block with one column",
    id: "SERIESBATCHCHECK",
    args: [F],
    code: VALUE,
    says: "a batch check needs at least 2 series (one per column); got 1",
  },
  {
    what: "text inside a column",
    id: "SERIESBATCHCHECK",
    args: [
      [
        ["a", "b"],
        [1, 2],
        [3, "x"],
        [4, 5],
      ],
    ],
    code: VALUE,
    says: 'row 3, column 2 of the block holds the text "x"',
  },
  {
    what: "an empty column",
    id: "SERIESBATCHCHECK",
    args: [
      [
        ["a", "b"],
        [1, ""],
        [3, ""],
        [4, ""],
      ],
    ],
    code: NA,
    says: '"b" has no values',
  },
  {
    what: "a value instead of a block",
    id: "SERIESBATCHCHECK",
    args: [5],
    code: VALUE,
    says: "block must be a range of cells with one series per column",
  },
  {
    what: "mismatched lengths",
    id: "SERIESCROSSCORR",
    args: [F, columnRange(["other", ...seriesF.slice(1)])],
    code: VALUE,
    says: 'covers 71 rows and y ("other") 70: give two ranges of the same size',
  },
  {
    what: "a constant y",
    id: "SERIESCROSSCORR",
    args: [columnRange(seriesF.slice(0, 30)), flat],
    code: VALUE,
    says: "is constant over the periods where both series have a value",
  },
  {
    what: "maxLag 70 for 70 pairs",
    id: "SERIESCROSSCORR",
    args: [F, F, 70],
    code: VALUE,
    says: "maxLag must be a whole number from 1 to 69",
  },
  {
    what: "a window larger than the series",
    id: "SERIESROLLCHECK",
    args: [F, 71],
    code: VALUE,
    says: "window must be a whole number from 3 to 70 (rows per window, at most the 70 rows the series spans)",
  },
  {
    what: "no window",
    id: "SERIESROLLCHECK",
    args: [F],
    code: VALUE,
    says: "window was not given (omitted, or a blank cell): give the rows per window, a whole number from 3 to the length of the series",
  },
  {
    what: "a blank cell as the window",
    id: "SERIESROLLCHECK",
    args: [F, ""],
    code: VALUE,
    says: "window was not given (omitted, or a blank cell): give the rows per window",
  },
  {
    what: "two values",
    id: "SERIESROLLCHECK",
    args: [columnRange([1, 2]), 3],
    code: NA,
    says: "a rolling check needs a series of at least 3 rows; this one spans 2",
  },
  {
    what: "lags as many as the window",
    id: "SERIESROLLCHECK",
    args: [F, 20, 20],
    code: VALUE,
    says: "lags must be a whole number from 1 to 19 (fewer than the window of 20)",
  },
  {
    what: "step 0",
    id: "SERIESROLLCHECK",
    args: [F, 20, 4, 0],
    code: VALUE,
    says: "step must be a whole number from 1 to 70",
  },
  {
    what: "a constant series",
    id: "SERIESRUNSCHECK",
    args: [flat],
    code: VALUE,
    says: "has values on only one side of its median 7",
  },
  {
    what: "two values",
    id: "SERIESRUNSCHECK",
    args: [columnRange([1, 2])],
    code: NA,
    says: "a runs test needs at least 3 values",
  },
  {
    what: "a constant series",
    id: "SERIESNORMALCHECK",
    args: [flat],
    code: VALUE,
    says: "is constant: its skewness and kurtosis are undefined",
  },
  {
    what: "a 2-D block as the series",
    id: "SERIESNORMALCHECK",
    args: [
      [
        [1, 2],
        [3, 4],
        [5, 6],
      ],
    ],
    code: VALUE,
    says: "must be a single row or column",
  },
];

let addIn: LoadedAddIn;
beforeAll(() => {
  addIn = loadBuiltFunctions();
});

describe("bad input through the side-check functions", () => {
  for (const c of CASES) {
    it(`${c.id} refuses ${c.what} with ${c.code} and says what to change`, () => {
      const result = addIn.invoke(c.id, ...c.args);
      if (!("error" in result)) {
        throw new Error(`${c.id}: expected ${c.code}, got a value ${JSON.stringify(result.value)}`);
      }
      const { code, message } = result.error;
      expect(code, `${c.id} (${c.what}): error value; message was "${message}"`).toBe(c.code);
      expect(message, `${c.id} (${c.what}): message`).toContain(c.says);
      expect(message).not.toMatch(/EcholotError|got undefined|\bNaN\b|\[object|\bat .*\.js/);
    });
  }
});

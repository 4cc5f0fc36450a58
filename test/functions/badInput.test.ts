/**
 * Bad input through the built functions: each case follows DESIGN.md's rules, gives the right
 * error value (#VALUE! when the user must fix the input or an argument, #N/A when there is not
 * enough data) and a message that says what is wrong and, where it can, what to do.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { readSeriesF } from "../helpers/fixtures";
import {
  columnRange,
  ErrorCode,
  errorCell,
  loadBuiltFunctions,
  rowRange,
  type LoadedAddIn,
} from "./host";

const seriesF = [...readSeriesF()];
const F = columnRange(["yield", ...seriesF]);
const VALUE = ErrorCode.invalidValue;
const NA = ErrorCode.notAvailable;

interface BadCase {
  readonly what: string;
  readonly id: string;
  readonly args: readonly unknown[];
  readonly code: string;
  /** Text the message must contain. */
  readonly says: string;
}

function withCell(at: number, cell: unknown): unknown[][] {
  const cells: unknown[] = ["yield", ...seriesF];
  cells[at] = cell;
  return columnRange(cells);
}

const alternating = columnRange(Array.from({ length: 40 }, (_, t) => (t % 2 === 0 ? 1 : -1)));

const CASES: readonly BadCase[] = [
  {
    what: "a 2-D block as the series",
    id: "SERIESLAGCORR",
    args: [
      [
        [1, 2],
        [3, 4],
        [5, 6],
      ],
    ],
    code: VALUE,
    says: "must be a single row or column; the range given is 3 rows × 2 columns",
  },
  {
    what: "a single value instead of a range",
    id: "SERIESLAGTABLE",
    args: [5],
    code: VALUE,
    says: "series must be a range of cells",
  },
  {
    what: "text in the data",
    id: "SERIESLAGTABLE",
    args: [withCell(5, "n/a")],
    code: VALUE,
    says: 'row 6 of the range holds the text "n/a"',
  },
  {
    what: "a number stored as text",
    id: "SERIESLAGCORR",
    args: [withCell(9, "52")],
    code: VALUE,
    says: "numbers stored as text are not read; convert the cell to a number",
  },
  {
    what: "a second text cell after the label",
    id: "SERIESLAGCOV",
    args: [columnRange(["yield", "batch", ...seriesF])],
    code: VALUE,
    says: 'row 2 of the range holds the text "batch"',
  },
  {
    what: "a boolean in the data",
    id: "SERIESPARTIALCORR",
    args: [withCell(3, true)],
    code: VALUE,
    says: "row 4 of the range holds TRUE",
  },
  {
    what: "a #DIV/0! cell in a column",
    id: "SERIESNOISECHECK",
    args: [withCell(12, errorCell(ErrorCode.divisionByZero))],
    code: VALUE,
    says: "row 13 of the range holds the error #DIV/0!; fix that cell or make it blank or #N/A",
  },
  {
    what: "a #REF! cell in a row",
    id: "SERIESPORTMANTEAU",
    args: [rowRange([1, 2, errorCell(ErrorCode.invalidReference), 4, 5, 6])],
    code: VALUE,
    says: "column 3 of the range holds the error #REF!",
  },
  {
    what: "an empty range",
    id: "SERIESLAGCORR",
    args: [columnRange(["", null, ""])],
    code: NA,
    says: "has no values: give a range with numbers",
  },
  {
    what: "a label and no values",
    id: "SERIESNOISECHECK",
    args: [columnRange(["yield", "", null])],
    code: NA,
    says: 'the series "yield" has no values',
  },
  {
    what: "two values",
    id: "SERIESLAGTABLE",
    args: [columnRange([1, 2])],
    code: NA,
    says: "needs at least 3 values; the series has 2 values",
  },
  {
    what: "two values and gaps, for the noise check",
    id: "SERIESNOISECHECK",
    args: [columnRange([4, "", errorCell(ErrorCode.notAvailable), 7])],
    code: NA,
    says: "needs at least 3 values; the series has 2 values",
  },
  {
    what: "a constant series",
    id: "SERIESLAGCORR",
    args: [columnRange(["flat", 3, 3, 3, 3, 3, 3])],
    code: VALUE,
    says: 'the series "flat" is constant (every value is 3)',
  },
  {
    what: "constant squared deviations for the squares test",
    id: "SERIESPORTMANTEAU",
    args: [alternating, 5, null, "squares"],
    code: VALUE,
    says: "squared deviations of the series are constant",
  },
  {
    what: "maxLag 0",
    id: "SERIESLAGCORR",
    args: [F, 0],
    code: VALUE,
    says: "maxLag must be a whole number from 1 to 69 (the series has 70 values)",
  },
  {
    what: "maxLag as long as the series",
    id: "SERIESLAGTABLE",
    args: [F, 70],
    code: VALUE,
    says: "maxLag must be a whole number from 1 to 69 (the series has 70 values)",
  },
  {
    what: "a fractional maxLag",
    id: "SERIESPARTIALCORR",
    args: [F, 2.5],
    code: VALUE,
    says: "maxLag must be a whole number from 1 to 69",
  },
  {
    what: "a negative maxLag",
    id: "SERIESLAGCOV",
    args: [F, -3],
    code: VALUE,
    says: "maxLag must be a whole number from 1 to 69",
  },
  {
    what: "maxLag given as text",
    id: "SERIESBAND",
    args: [F, "12"],
    code: VALUE,
    says: 'maxLag must be a number, not text (got the text "12")',
  },
  {
    what: "maxLag given as a boolean",
    id: "SERIESNOISECHECK",
    args: [F, true],
    code: VALUE,
    says: "maxLag must be a number (got TRUE)",
  },
  {
    what: "alpha 0",
    id: "SERIESBAND",
    args: [F, 10, 0],
    code: VALUE,
    says: "alpha must be a number between 0 and 1, such as 0.05 (got 0)",
  },
  {
    what: "alpha given in percent",
    id: "SERIESLAGTABLE",
    args: [F, 10, 5],
    code: VALUE,
    says: "alpha must be a number between 0 and 1, such as 0.05 (got 5)",
  },
  {
    what: "alpha 1",
    id: "SERIESNOISECHECK",
    args: [F, null, null, null, 1],
    code: VALUE,
    says: "alpha must be a number between 0 and 1",
  },
  {
    what: "an unknown bandKind",
    id: "SERIESBAND",
    args: [F, 10, 0.05, "wide"],
    code: VALUE,
    says: 'bandKind must be one of "noise", "bartlett" or "robust" (got "wide")',
  },
  {
    what: "a number as bandKind",
    id: "SERIESLAGTABLE",
    args: [F, 10, 0.05, 2],
    code: VALUE,
    says: 'bandKind must be one of "noise", "bartlett" or "robust" (got 2)',
  },
  {
    what: "an unknown testKind",
    id: "SERIESPORTMANTEAU",
    args: [F, 10, 0, "portmanteau"],
    code: VALUE,
    says: 'testKind must be one of "ljung-box", "box-pierce", "robust" or "squares"',
  },
  {
    what: "season 1",
    id: "SERIESLAGTABLE",
    args: [F, null, null, null, 1],
    code: VALUE,
    says: "season must be a whole number from 2 to 69, the number of periods in one cycle",
  },
  {
    what: "a fractional season",
    id: "SERIESNOISECHECK",
    args: [F, null, 3.5],
    code: VALUE,
    says: "season must be a whole number from 2 to 69",
  },
  {
    what: "fittedParams that leave no degrees of freedom",
    id: "SERIESPORTMANTEAU",
    args: [F, 10, 10],
    code: VALUE,
    says: "fittedParams must be a whole number from 0 to 9",
  },
  {
    what: "negative fittedParams",
    id: "SERIESNOISECHECK",
    args: [F, 10, null, -1],
    code: VALUE,
    says: "fittedParams must be a whole number from 0 to 9",
  },
  {
    what: "lags 0 for the portmanteau test",
    id: "SERIESPORTMANTEAU",
    args: [F, 0],
    code: VALUE,
    says: "lags must be a whole number from 1 to 69 (the series has 70 values)",
  },
  {
    what: "more lags than the series allows",
    id: "SERIESPORTMANTEAU",
    args: [F, 100],
    code: VALUE,
    says: "lags must be a whole number from 1 to 69",
  },
  {
    what: "lags for a series too short for any test",
    id: "SERIESPORTMANTEAU",
    args: [columnRange([1, 2]), 1],
    code: NA,
    says: "a lag analysis needs at least 3 values; the series has 2 values",
  },
  {
    what: "lags as text",
    id: "SERIESPORTMANTEAU",
    args: [F, "12"],
    code: VALUE,
    says: 'lags must be a number, not text (got the text "12"); type it without quotes',
  },
  {
    what: "an error value as an argument",
    id: "SERIESLAGCORR",
    args: [F, errorCell(ErrorCode.notAvailable)],
    code: VALUE,
    says: "maxLag must be a number (got the error #N/A)",
  },
];

let addIn: LoadedAddIn;
beforeAll(() => {
  addIn = loadBuiltFunctions();
});

describe("bad input through the built functions", () => {
  it("has at least 25 cases", () => {
    expect(CASES.length).toBeGreaterThanOrEqual(25);
  });

  for (const c of CASES) {
    it(`${c.id} refuses ${c.what} with ${c.code} and says what to change`, () => {
      const result = addIn.invoke(c.id, ...c.args);
      if (!("error" in result)) {
        throw new Error(`${c.id}: expected ${c.code}, got a value ${JSON.stringify(result.value)}`);
      }
      const { code, message } = result.error;
      expect(code, `${c.id} (${c.what}): error value; message was "${message}"`).toBe(c.code);
      expect(message, `${c.id} (${c.what}): message`).toContain(c.says);
      // A message people read: no internal names, no stack, no unprinted values.
      expect(message).not.toMatch(/EcholotError|got undefined|\bNaN\b|\[object|\bat .*\.js/);
    });
  }
});

describe("SERIESPORTMANTEAU names the core's maxLag as its own argument, lags", () => {
  it("gives a 2-value series one message, with lags or without", () => {
    const short = columnRange([1, 2]);
    const refusals = [[short], [short, 1], [short, 5], [short, null, 0]].map((args) => {
      const result = addIn.invoke("SERIESPORTMANTEAU", ...args);
      if (!("error" in result)) throw new Error("SERIESPORTMANTEAU of 2 values gave a value");
      return result.error;
    });
    for (const error of refusals) {
      expect({ code: error.code, message: error.message }).toEqual({
        code: NA,
        message: "a lag analysis needs at least 3 values; the series has 2 values",
      });
    }
  });

  it("refuses lags out of range with the core's message, the argument named lags", () => {
    for (const lags of [0, 70, 2.5]) {
      const result = addIn.invoke("SERIESPORTMANTEAU", F, lags);
      if (!("error" in result)) throw new Error(`lags ${lags} gave a value`);
      expect(result.error.code).toBe(VALUE);
      expect(result.error.message).toBe(
        `lags must be a whole number from 1 to 69 (the series has 70 values)`,
      );
    }
  });
});

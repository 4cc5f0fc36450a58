/**
 * Every cell function of the built add-in given a whole-column reference: 1,048,576 rows (the
 * row count of a worksheet column), a label in the first row. Before, a spread of the rows into
 * Math.max overflowed the stack from about 125,000 rows, and one empty column of a block turned
 * SERIESBATCHCHECK's whole block into #N/A.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";
import { batchCheck, noiseCheck, seriesFromNumbers } from "../../src/core";
import { whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { loadBuiltFunctions, spilled, type CellResult, type LoadedAddIn } from "./host";

const ROWS = 1_048_576;
// Each test may take 30 minutes: the calls are bounded work that cannot hang, and the slowest
// (SERIESCROSSCORR over two whole columns) took 39 s on a 2-core machine at load average 8 with
// the files run one at a time, 77 s with both workers busy; a machine at load 19 is slower still.
vi.setConfig({ testTimeout: 1_800_000 });
let addIn: LoadedAddIn;
const noise = whiteNoise(seededRandom(1048576), ROWS - 1);
const other = whiteNoise(seededRandom(7), ROWS - 1);

/** A column range of ROWS rows: the label, then the values (a full column). */
function wholeColumn(label: string, values: Float64Array): unknown[][] {
  const cells: unknown[][] = [[label]];
  for (const v of values) cells.push([v]);
  return cells;
}

const x = wholeColumn("resid", noise);
const y = wholeColumn("other", other);
/** A whole column with values in its first 2,000 rows below the label, blank below them. */
const partColumn: unknown[][] = x.map((row, i) => (i <= 2000 ? row : [""]));

/** Each function with the arguments it needs, its first argument a whole column. */
const CALLS: readonly { id: string; args: () => unknown[]; rows: number }[] = [
  { id: "SERIESLAGCOV", args: () => [x], rows: 11 },
  { id: "SERIESLAGCORR", args: () => [x], rows: 10 },
  { id: "SERIESPARTIALCORR", args: () => [x], rows: 10 },
  { id: "SERIESBAND", args: () => [x], rows: 10 },
  { id: "SERIESLAGTABLE", args: () => [x], rows: 11 },
  { id: "SERIESPORTMANTEAU", args: () => [x], rows: 1 },
  { id: "SERIESNOISECHECK", args: () => [x], rows: 1 },
  { id: "SERIESVOLCHECK", args: () => [x], rows: 1 },
  { id: "SERIESBIASCHECK", args: () => [x], rows: 1 },
  // The audit's Monte Carlo reference makes a million-value audit take minutes: its whole column
  // holds 2,000 errors and blanks below them, as a sheet column usually does.
  { id: "SERIESFORECASTAUDIT", args: () => [partColumn, 1], rows: -1 },
  { id: "SERIESCROSSCORR", args: () => [x, y], rows: 22 },
  { id: "SERIESROLLCHECK", args: () => [x, 50, 2, 1000], rows: ROWS },
  { id: "SERIESRUNSCHECK", args: () => [x], rows: 1 },
  { id: "SERIESNORMALCHECK", args: () => [x], rows: 1 },
];

beforeAll(() => {
  addIn = loadBuiltFunctions();
});

describe("every cell function with a 1,048,576-row whole-column reference", () => {
  it("covers every registered function", () => {
    const ids = [...CALLS.map((c) => c.id), "SERIESBATCHCHECK"].sort();
    expect(ids).toEqual([...addIn.registered].sort());
  });

  it.each(CALLS)("$id returns its result, not an error", ({ id, args, rows }) => {
    const result: CellResult = spilled(addIn.invoke(id, ...args()), id);
    if (rows > 0) expect(result).toHaveLength(rows);
    else expect(result.length).toBeGreaterThan(0);
    if (id === "SERIESNOISECHECK") {
      expect(result[0]![0]).toBe(noiseCheck(seriesFromNumbers(noise)).verdict.word);
    }
  });

  it("SERIESBATCHCHECK keeps a row for an empty column and a column with text, with the reason", () => {
    const block: unknown[][] = [["a", "b", "empty", "words"]];
    for (let i = 0; i < ROWS - 1; i++) {
      block.push([noise[i], other[i], "", i === 5 ? "oops" : i]);
    }
    const result = spilled(addIn.invoke("SERIESBATCHCHECK", block), "SERIESBATCHCHECK");
    expect(result).toHaveLength(5);
    expect(result.map((r) => r[0])).toEqual(["label", "a", "b", "empty", "words"]);
    expect(result[3]![6]).toMatch(/^not analysed: the series "empty" has no values/);
    expect(result[4]![6]).toMatch(
      /^not analysed: row 7, column 4 of the block holds the text "oops"/,
    );
    const core = batchCheck([seriesFromNumbers(noise, "a"), seriesFromNumbers(other, "b")]);
    expect(result[1]![5]).toBe(core.rows[0]!.qValue);
    // The verdict cell is the headline across the batch (structure only when kept).
    expect(result[2]![6]).toBe(core.rows[1]!.headline?.title);
  });
});

/**
 * The eight side-check functions of the built add-in, called as the host calls them (host.ts):
 * values against the core (the same computation, so exactly equal) and against outside figures
 * (METHODS.md derived values, each with its source beside it), and the spreadsheet shape of each
 * result — SERIESROLLCHECK aligned row for row with its input.
 */
import { beforeAll, describe, expect, it } from "vitest";
import {
  batchCheck,
  crossCorrelation,
  forecastAudit,
  rollingCheck,
  runsCheck,
  seriesFromNumbers,
  seriesFromValues,
} from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";
import { EXTRA_FUNCTIONS } from "./sideCheckFunctions";
import {
  columnRange,
  loadBuiltFunctions,
  rowRange,
  spilled,
  type CellResult,
  type LoadedAddIn,
} from "./host";

let addIn: LoadedAddIn;
const seriesF = readSeriesF();
const seriesFColumn = columnRange(["yield", ...seriesF]);
const coreF = seriesFromNumbers(seriesF, "yield");

beforeAll(() => {
  addIn = loadBuiltFunctions();
});

function call(id: string, ...args: unknown[]): CellResult {
  return spilled(addIn.invoke(id, ...args), `${id}(${args.length} arguments)`);
}

function numberAt(result: CellResult, r: number, c: number): number {
  const cell = result[r]?.[c];
  if (typeof cell !== "number") throw new Error(`cell [${r}][${c}] is ${JSON.stringify(cell)}`);
  return cell;
}

function expectHostShaped(result: CellResult, what: string): void {
  for (const [r, row] of result.entries()) {
    for (const [c, cell] of row.entries()) {
      const ok = typeof cell === "string" || (typeof cell === "number" && Number.isFinite(cell));
      expect(ok, `${what}: cell [${r}][${c}] is ${String(cell)} (${typeof cell})`).toBe(true);
    }
  }
}

/** A 3-column block: labels in the first row, then 80 rows. */
function block(): unknown[][] {
  const random = seededRandom(31);
  const rows: unknown[][] = [["north", "south", "east"]];
  let previous = 0;
  for (let t = 0; t < 80; t++) {
    previous = 0.6 * previous + random.normal();
    rows.push([random.normal(), previous, t === 40 ? "" : random.normal() + 0.1]);
  }
  return rows;
}

describe("the eight side-check functions, loaded as the host loads them", () => {
  it("are registered and return host-shaped arrays for Series F with omitted optionals", () => {
    for (const id of EXTRA_FUNCTIONS) expect(addIn.registered, id).toContain(id);
    for (const id of [
      "SERIESVOLCHECK",
      "SERIESBIASCHECK",
      "SERIESFORECASTAUDIT",
      "SERIESRUNSCHECK",
      "SERIESNORMALCHECK",
    ]) {
      expectHostShaped(call(id, seriesFColumn), `${id}(Series F)`);
    }
    expectHostShaped(call("SERIESBATCHCHECK", block()), "SERIESBATCHCHECK(block)");
    expectHostShaped(
      call("SERIESCROSSCORR", seriesFColumn, seriesFColumn),
      "SERIESCROSSCORR(F, F)",
    );
    expectHostShaped(call("SERIESROLLCHECK", seriesFColumn, 30), "SERIESROLLCHECK(F, 30)");
  });
});

describe("SERIESVOLCHECK(series, lags)", () => {
  it("spills LM, df, p for Series F: T·R² = 0.122090 at q = 1 and 5.603300 at q = 4", () => {
    // Derived from series-f.csv with Engle's (1982) formula, T = n − q (METHODS.md).
    const one = call("SERIESVOLCHECK", seriesFColumn, 1);
    expect(one[0]?.length).toBe(3);
    expectClose(numberAt(one, 0, 0), 0.12209, { abs: 5e-7 }, "SERIESVOLCHECK(F, 1) LM");
    expectClose(numberAt(one, 0, 2), 0.72678, { abs: 5e-6 }, "SERIESVOLCHECK(F, 1) p");
    const four = call("SERIESVOLCHECK", seriesFColumn, 4);
    expectClose(numberAt(four, 0, 0), 5.6033, { abs: 5e-7 }, "SERIESVOLCHECK(F, 4) LM");
    expect(numberAt(four, 0, 1)).toBe(4);
  });
});

describe("SERIESBIASCHECK(series, hacLags)", () => {
  it("spills mean, Newey–West se, t, p for Series F: se 1.127723 at L = 3", () => {
    // Derived from series-f.csv with Newey & West's (1987) formula (METHODS.md).
    const result = call("SERIESBIASCHECK", seriesFColumn, 3);
    expect(result[0]?.length).toBe(4);
    expectClose(numberAt(result, 0, 1), 1.127723, { abs: 5e-7 }, "SERIESBIASCHECK(F, 3) se");
    expectClose(numberAt(result, 0, 0), 51.128571428571, { rel: 1e-12 }, "SERIESBIASCHECK(F) mean");
    expect(call("SERIESBIASCHECK", seriesFColumn)).toEqual(result); // default L = 3 for n = 70
  });
});

describe("SERIESFORECASTAUDIT(errors, horizon, season, alpha)", () => {
  it("spills the two-column audit table equal to the core's audit", () => {
    const result = call("SERIESFORECASTAUDIT", seriesFColumn, 3);
    const audit = forecastAudit(coreF, { horizon: 3 });
    const drawn = audit.levels.jointP;
    expect(result.map((r) => r[0])).toEqual([
      "bias: mean error",
      "bias: se (long-run variance, lags 0–2)",
      "bias: corrected t",
      "bias: p (t, 69 df)",
      "dependence: lags tested",
      "dependence: Q",
      "dependence: df",
      `dependence: p (Monte Carlo, ${drawn.draws.toLocaleString("en-US")} draws)`,
      "verdict",
      "reason",
    ]);
    expect(result.map((r) => r[1])).toEqual([
      audit.bias.mean,
      audit.bias.se,
      audit.bias.tCorrected,
      audit.bias.p,
      "3–12",
      audit.dependenceTest.q,
      10,
      drawn.p,
      "structure",
      audit.verdict.reason,
    ]);
    // Derived (METHODS.md, Harvey, Leybourne & Newbold 1997 with exact sums and 40-digit
    // tails): Series F as 3-step errors, t* = 38.3151803494, p = 3.09141041114e−48.
    expectClose(numberAt(result, 2, 1), 38.3151803494, { rel: 1e-9 }, "Series F h 3: t*");
    expectClose(numberAt(result, 3, 1), 3.09141041114e-48, { rel: 1e-8 }, "Series F h 3: p");
  });

  it("defaults the horizon to 1 (every lag counted)", () => {
    expect(call("SERIESFORECASTAUDIT", seriesFColumn)[4]?.[1]).toBe("1–10");
  });
});

describe("SERIESBATCHCHECK(block, …)", () => {
  it("spills a header and one row per column, labels from the text first row, equal to the core's batch", () => {
    const cells = block();
    const result = call("SERIESBATCHCHECK", cells);
    expect(result[0]).toEqual(["label", "n", "Q", "df", "p", "q-value", "verdict"]);
    expect(result.map((r) => r[0])).toEqual(["label", "north", "south", "east"]);
    const columns = [0, 1, 2].map((c) => seriesFromValues(cells.map((r) => r[c])));
    const batch = batchCheck(columns);
    batch.rows.forEach((row, i) => {
      expect(result[i + 1], `row of ${row.label}`).toEqual([
        row.label,
        row.n,
        row.q,
        row.df,
        row.p,
        row.qValue,
        row.verdict,
      ]);
    });
    expect(result[3]?.[1], "east has a gap at row 42").toBe(79);
    expect(result[2]?.[6], "the AR(1) column").toBe("structure");
  });

  it("names columns without a label 'column N'", () => {
    const cells = block().slice(1);
    expect(call("SERIESBATCHCHECK", cells).map((r) => r[0])).toEqual([
      "label",
      "column 1",
      "column 2",
      "column 3",
    ]);
  });
});

describe("SERIESCROSSCORR(x, y, maxLag)", () => {
  it("spills a header and lags −K..K equal to the core's cross-correlation", () => {
    const random = seededRandom(32);
    const y = Array.from(seriesF, (v) => v + 10 * random.normal());
    const result = call("SERIESCROSSCORR", seriesFColumn, columnRange(["noisy yield", ...y]), 4);
    expect(result[0]).toEqual(["lag", "cross-correlation", "band"]);
    expect(result.length).toBe(10);
    const core = crossCorrelation(coreF, seriesFromNumbers(y), { maxLag: 4 });
    core.rows.forEach((row, i) => {
      expect(result[i + 1]).toEqual([row.lag, row.correlation, row.band]);
    });
  });

  it("pairs a row range with a column range of the same size", () => {
    const asRow = call("SERIESCROSSCORR", rowRange(["yield", ...seriesF]), seriesFColumn, 2);
    expect(asRow).toEqual(call("SERIESCROSSCORR", seriesFColumn, seriesFColumn, 2));
  });
});

describe("SERIESROLLCHECK(series, window, lags, step)", () => {
  it("is aligned row for row with its input down to its last value: label and leading gaps empty, then one p per window end", () => {
    const cells = ["yield", "", "", ...seriesF, ""];
    const result = call("SERIESROLLCHECK", columnRange(cells), 30, 5, 2);
    // The trailing blank row gets no output row: the spill ends at the last value.
    expect(result.length, "one output row per input row to the last value").toBe(cells.length - 1);
    const core = rollingCheck(coreF, { window: 30, lags: 5, step: 2 });
    for (let r = 0; r < result.length; r++) {
      const position = r - 3;
      const expected = position >= 0 && position < 70 ? core.p[position] : NaN;
      const cell = result[r]?.[0];
      if (expected === undefined || Number.isNaN(expected)) expect(cell, `row ${r + 1}`).toBe("");
      else expect(cell, `row ${r + 1}`).toBe(expected);
    }
    expect(result[3 + 28]?.[0], "before the first full window").toBe("");
    expect(typeof result[3 + 29]?.[0], "the first full window ends at the 30th value").toBe(
      "number",
    );
  });

  it("returns a row for a row input", () => {
    const result = call("SERIESROLLCHECK", rowRange([...seriesF]), 20);
    expect(result.length).toBe(1);
    expect(result[0]?.length).toBe(70);
  });
});

describe("SERIESRUNSCHECK and SERIESNORMALCHECK", () => {
  it("SERIESRUNSCHECK(Series F) spills runs, expected runs, p equal to the core", () => {
    const core = runsCheck(coreF);
    expect(call("SERIESRUNSCHECK", seriesFColumn)).toEqual([[core.runs, core.expected, core.p]]);
  });

  it("SERIESNORMALCHECK(Series F) spills JB = 0.065419474 and p", () => {
    // Derived from series-f.csv with Jarque & Bera's formula (METHODS.md).
    const result = call("SERIESNORMALCHECK", seriesFColumn);
    expectClose(numberAt(result, 0, 0), 0.065419474, { abs: 5e-10 }, "SERIESNORMALCHECK(F) JB");
    expectClose(
      numberAt(result, 0, 1),
      Math.exp(-numberAt(result, 0, 0) / 2),
      { rel: 1e-13 },
      "p = e^{−JB/2}",
    );
  });
});

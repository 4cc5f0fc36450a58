/**
 * The built add-in, called as the host calls it: dist/functions.js loaded into a fresh scope with
 * a fake CustomFunctions/Office (host.ts), every function invoked with cells shaped as the host
 * passes them. Values are checked against the core (the same computation, so exactly equal) and
 * against outside figures, each with its source beside it.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import {
  chiSquareUpperTail,
  lagTable,
  seriesFromCells,
  seriesFromNumbers,
  type LagRow,
  type LagTable,
} from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { whiteNoise } from "../../src/sim/processes";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF, readStrd, readStrdCertified } from "../helpers/fixtures";
import {
  columnRange,
  ErrorCode,
  errorCell,
  loadBuiltFunctions,
  rowRange,
  spilled,
  type CellResult,
  type LoadedAddIn,
} from "./host";
import { EXTRA_FUNCTIONS } from "./sideCheckFunctions";

const SEVEN = [
  "SERIESLAGCOV",
  "SERIESLAGCORR",
  "SERIESPARTIALCORR",
  "SERIESBAND",
  "SERIESLAGTABLE",
  "SERIESPORTMANTEAU",
  "SERIESNOISECHECK",
];

let addIn: LoadedAddIn;
const seriesF = readSeriesF();
/** Series F as the host passes a column range whose first cell holds the label. */
const seriesFColumn = columnRange(["yield", ...seriesF]);
let coreF10: LagTable;

beforeAll(() => {
  addIn = loadBuiltFunctions();
  coreF10 = lagTable(seriesFromNumbers(seriesF), { maxLag: 10 });
});

function call(id: string, ...args: unknown[]): CellResult {
  return spilled(addIn.invoke(id, ...args), `${id}(${args.length} arguments)`);
}

function numberAt(result: CellResult, r: number, c: number): number {
  const cell = result[r]?.[c];
  if (typeof cell !== "number") throw new Error(`cell [${r}][${c}] is ${JSON.stringify(cell)}`);
  return cell;
}

/** The cells SERIESLAGTABLE should spill for one row of the core's lag table. */
function lagTableCells(row: LagRow): (number | string)[] {
  const zone = row.outer ? "beyond" : row.crossesBand ? "between" : "inside";
  return [row.lag, row.correlation, row.partial, row.z, zone, row.pLag, row.pSidak];
}

/** Column of numbers → plain array (each row one cell). */
function columnValues(result: CellResult): number[] {
  return result.map((row, r) => {
    expect(row.length, `row ${r} of a column result has ${row.length} cells`).toBe(1);
    return numberAt(result, r, 0);
  });
}

/** Every cell of every result is a finite number or a string: never null, undefined or NaN. */
function expectHostShaped(result: CellResult, what: string): void {
  expect(Array.isArray(result), `${what}: result is not an array`).toBe(true);
  for (const [r, row] of result.entries()) {
    expect(Array.isArray(row), `${what}: row ${r} is not an array`).toBe(true);
    for (const [c, cell] of row.entries()) {
      const ok = typeof cell === "string" || (typeof cell === "number" && Number.isFinite(cell));
      expect(ok, `${what}: cell [${r}][${c}] is ${String(cell)} (${typeof cell})`).toBe(true);
    }
  }
}

describe("the built bundle, loaded as the host loads it", () => {
  it("registers exactly the functions of functions.json (these seven and the eight side checks), once each", () => {
    const all = [...SEVEN, ...EXTRA_FUNCTIONS].sort();
    expect([...addIn.registered].sort()).toEqual(all);
    expect(addIn.metadata.functions.map((f) => f.id).sort()).toEqual(all);
  });

  it("returns host-shaped arrays from every function, with omitted optionals as null", () => {
    for (const id of SEVEN) {
      const result = call(id, seriesFColumn);
      expectHostShaped(result, `${id}(Series F)`);
    }
  });
});

describe("SERIESLAGTABLE(series, maxLag)", () => {
  it("spills a header and 10 rows for Series F that equal the core's lag table", () => {
    const result = call("SERIESLAGTABLE", seriesFColumn, 10);
    expect(result[0]).toEqual([
      "lag",
      "autocorrelation",
      "partial autocorrelation",
      "z",
      "corridor",
      "p (this lag)",
      "p (Šidák, 10 lags)",
    ]);
    expect(result.length).toBe(11);
    coreF10.rows.forEach((row, i) => {
      expect(result[i + 1], `row for lag ${row.lag}`).toEqual(lagTableCells(row));
    });
  });

  it("writes the spilled table to test-output/functions/series-f-lagtable.tsv for the record", () => {
    const result = call("SERIESLAGTABLE", seriesFColumn, 10);
    const folder = join(
      dirname(fileURLToPath(import.meta.url)),
      "..",
      "..",
      "test-output",
      "functions",
    );
    mkdirSync(folder, { recursive: true });
    const text = result.map((row) => row.map((cell) => String(cell)).join("\t")).join("\n");
    writeFileSync(join(folder, "series-f-lagtable.tsv"), `${text}\n`);
    expect(text.split("\n").length).toBe(11);
  });

  it("matches the printed Series F autocorrelations r_1..r_10", () => {
    // Printed: NIST/SEMATECH e-Handbook §6.4.4.9 (Series F, 9 decimals); half a unit in the 9th
    // decimal plus rounding of the double.
    const printed = [
      -0.389878319, 0.304394082, -0.165554717, 0.070719321, -0.097039288, -0.047057692, 0.035373112,
      -0.043458199, -0.004796162, 0.014393137,
    ];
    const result = call("SERIESLAGTABLE", seriesFColumn, 10);
    printed.forEach((r, i) =>
      expectClose(numberAt(result, i + 1, 1), r, { abs: 5.1e-10 }, `Series F r_${i + 1}`),
    );
  });

  it("matches the Series F partials derived with the published formula, and names each corridor", () => {
    const result = call("SERIESLAGTABLE", seriesFColumn, 10);
    // Derived from the Series F data with the Durbin–Levinson recursion (shared reference
    // METHODS.md, 6 decimals).
    const partials = [-0.389878, 0.179705, 0.002264, -0.044277, -0.069406, -0.120622];
    partials.forEach((phi, i) =>
      expectClose(numberAt(result, i + 1, 2), phi, { abs: 5.1e-7 }, `Series F partial ${i + 1}`),
    );
    // The corridor column: lag 1 (z = −3.26) lies beyond the all-lags corridor (±2.80 for 10
    // lags), lag 2 (z = 2.55) between the corridors, lag 3 (z = −1.39) inside.
    expect([1, 2, 3].map((k) => result[k]?.[4])).toEqual(["beyond", "between", "inside"]);
  });

  it("gives z = r_k·√n and p (this lag) from the two-sided normal tail under the noise band", () => {
    const result = call("SERIESLAGTABLE", seriesFColumn, 10);
    // Printed r_1 (e-Handbook §6.4.4.9) times √70: the noise band's z, to the printed digits.
    expectClose(numberAt(result, 1, 3), -0.389878319 * Math.sqrt(70), { abs: 5e-9 }, "z_1");
    // Šidák: 1 − (1 − p)^10 for the lag's own p (Šidák 1967), from the table's own p.
    const p1 = numberAt(result, 1, 5);
    expectClose(numberAt(result, 1, 6), 1 - (1 - p1) ** 10, { rel: 1e-12 }, "Šidák p of lag 1");
  });

  it("reads a row range exactly as the same values in a column", () => {
    const fromRow = call("SERIESLAGTABLE", rowRange(["yield", ...seriesF]), 10);
    expect(fromRow).toEqual(call("SERIESLAGTABLE", seriesFColumn, 10));
  });

  it('trims leading and trailing blanks given as "" and null', () => {
    const padded = columnRange([null, "", ...seriesF, "", null, ""]);
    expect(call("SERIESLAGTABLE", padded, 10)).toEqual(call("SERIESLAGTABLE", seriesFColumn, 10));
  });

  it("reads an absent cell (a short row, undefined) as a blank", () => {
    const absent: unknown[][] = [[], ...seriesFColumn.slice(1), [undefined], []];
    expect(call("SERIESLAGTABLE", absent, 10)).toEqual(call("SERIESLAGTABLE", seriesFColumn, 10));
  });

  it("handles a column of 300,000 rows as the core does", () => {
    const noise = whiteNoise(seededRandom(7), 300_000);
    const result = call("SERIESNOISECHECK", columnRange(["residual", ...noise]));
    const core = lagTable(seriesFromNumbers(noise));
    expect(result).toEqual([[core.verdict.word, core.verdict.reason]]);
  });

  it('keeps an interior #N/A, "" or null as a gap in place, never as 0', () => {
    for (const gap of [errorCell(ErrorCode.notAvailable), "", null]) {
      const cells = ["yield", ...seriesF] as unknown[];
      cells[20] = gap;
      const result = call("SERIESLAGTABLE", columnRange(cells), 10);
      const core = lagTable(seriesFromCells(columnRange(cells)), { maxLag: 10 });
      expect(core.gaps).toBe(1);
      core.rows.forEach((row, i) =>
        expect(result[i + 1], `lag ${row.lag} with a gap at row 21`).toEqual(lagTableCells(row)),
      );
      const zeroed = [...cells];
      zeroed[20] = 0;
      expect(call("SERIESLAGTABLE", columnRange(zeroed), 10)).not.toEqual(result);
    }
  });

  it("uses the default K = min(10, ⌊n/5⌋) when maxLag is omitted (null)", () => {
    // Default rule: common practice (no source), DESIGN.md. n = 70 → K = 10; n = 30 → K = 6.
    expect(call("SERIESLAGTABLE", seriesFColumn).length).toBe(1 + 10);
    expect(call("SERIESLAGTABLE", columnRange([...seriesF.slice(0, 30)])).length).toBe(1 + 6);
    // With season 4: K = min(8, 14) = 8.
    expect(call("SERIESLAGTABLE", seriesFColumn, null, null, null, 4).length).toBe(1 + 8);
  });

  it("takes bandKind case-insensitively and applies it to z", () => {
    const robust = call("SERIESLAGTABLE", seriesFColumn, 5, null, " Robust ");
    const core = lagTable(seriesFromNumbers(seriesF), { maxLag: 5, bandKind: "robust" });
    core.rows.forEach((row, i) => expect(numberAt(robust, i + 1, 3)).toBe(row.z));
    // Derived from the Series F data with the robust variance formula (Taylor 1984; METHODS.md):
    // n·v̂_1 = 0.852773, so z_1 = r_1 / √(v̂_1).
    expectClose(
      numberAt(robust, 1, 3),
      -0.389878319 / Math.sqrt(0.852773 / 70),
      { rel: 1e-6 },
      "robust z_1",
    );
  });
});

describe("SERIESLAGCOV(series, maxLag)", () => {
  it("spills lags 0..K of the autocovariance; lag 0 is the divide-by-n variance", () => {
    const result = columnValues(call("SERIESLAGCOV", seriesFColumn, 10));
    expect(result).toEqual(Array.from(coreF10.autocovariance));
    expect(result.length).toBe(11);
    // Printed: e-Handbook §6.4.4.9 gives the (n−1) variance 141.8238 (4 decimals); ×69/70.
    expectClose(result[0] as number, (141.8238 * 69) / 70, { abs: 5e-5 }, "Series F γ̂_0");
    // r_1 printed (e-Handbook §6.4.4.9) = γ̂_1/γ̂_0.
    expectClose(
      (result[1] as number) / (result[0] as number),
      -0.389878319,
      { abs: 5.1e-10 },
      "Series F γ̂_1/γ̂_0",
    );
  });
});

describe("SERIESLAGCORR(series, maxLag)", () => {
  it("spills r_1..r_K equal to the core's", () => {
    expect(columnValues(call("SERIESLAGCORR", seriesFColumn, 10))).toEqual(
      coreF10.rows.map((r) => r.correlation),
    );
  });

  it("matches the printed Series F r_11, r_12 and r_24", () => {
    // Printed: NIST/SEMATECH e-Handbook §6.4.4.9, 9 decimals.
    const r = columnValues(call("SERIESLAGCORR", seriesFColumn, 24));
    expectClose(r[10] as number, 0.1099172, { abs: 5.1e-10 }, "Series F r_11");
    expectClose(r[11] as number, -0.068778492, { abs: 5.1e-10 }, "Series F r_12");
    expectClose(r[23] as number, -0.073114034, { abs: 5.1e-10 }, "Series F r_24");
  });

  it("reaches the NIST StRD certified lag-1 autocorrelation through a column of cells", () => {
    // Printed: NIST StRD univariate certified values (15 significant digits), CERTIFIED.tsv.
    // Required: relative error below 1e-12 (12 of the 15 digits), which a compensated two-pass
    // computation in doubles reaches on every file (see test/core/strd.test.ts for the LREs).
    for (const certified of readStrdCertified()) {
      const data = readStrd(certified.dataset);
      expect(data.length, `${certified.dataset} n`).toBe(certified.n);
      const result = columnValues(call("SERIESLAGCORR", columnRange([...data]), 1));
      expectClose(
        result[0] as number,
        Number(certified.r1),
        { rel: 1e-12 },
        `${certified.dataset} r1`,
      );
    }
  });

  it("leaves a lag with no pair of values as an empty cell, not 0 or null", () => {
    // Values at positions 1, 2, 6, 7 only: lags 2 and 3 have no pair with both values present.
    const cells = columnRange([1, 2, "", null, errorCell(ErrorCode.notAvailable), 3, 5]);
    const result = call("SERIESLAGCORR", cells, 3);
    expectHostShaped(result, "SERIESLAGCORR with gaps");
    expect(result[1]).toEqual([""]);
    expect(result[2]).toEqual([""]);
    expect(result[0]?.[0]).toBe(
      lagTable(seriesFromCells(cells), { maxLag: 3 }).rows[0]?.correlation,
    );
    // The partials after an undefined lag are undefined too.
    expect(call("SERIESPARTIALCORR", cells, 3).slice(1)).toEqual([[""], [""]]);
  });
});

describe("SERIESPARTIALCORR(series, maxLag)", () => {
  it("spills φ_11..φ_KK equal to the core's and to the derived Series F partials", () => {
    const result = columnValues(call("SERIESPARTIALCORR", seriesFColumn, 6));
    expect(result).toEqual(coreF10.rows.slice(0, 6).map((r) => r.partial));
    // Derived from the Series F data with the Durbin–Levinson recursion (METHODS.md).
    expectClose(result[1] as number, 0.179705, { abs: 5.1e-7 }, "Series F φ_22");
    expectClose(result[5] as number, -0.120622, { abs: 5.1e-7 }, "Series F φ_66");
  });
});

describe("SERIESBAND(series, maxLag, alpha, bandKind)", () => {
  // Printed: z_0.975 = 1.95996398454005423552 (normal-quantiles.tsv; Fisher 1925 Table 1 gives
  // 1.959964); z_0.995 = 2.5758293035489007609 (OEIS A329283).
  const z975 = Number("1.95996398454005423552");
  const z995 = Number("2.5758293035489007609");

  it("gives ±z/√n for the default noise band", () => {
    const result = columnValues(call("SERIESBAND", seriesFColumn, 4));
    for (const [k, band] of result.entries()) {
      expectClose(band, z975 / Math.sqrt(70), { rel: 1e-14 }, `noise band at lag ${k + 1}`);
    }
    const at1 = columnValues(call("SERIESBAND", seriesFColumn, 4, 0.01));
    expectClose(at1[0] as number, z995 / Math.sqrt(70), { rel: 1e-14 }, "noise band at alpha 0.01");
  });

  it("gives Bartlett half-widths from the derived Series F standard errors", () => {
    // Derived from the Series F data with Bartlett's formula (1946), METHODS.md, 5 decimals.
    const se = [0.11952, 0.13649, 0.14586, 0.14852, 0.149, 0.1499];
    const result = columnValues(call("SERIESBAND", seriesFColumn, 6, null, "BARTLETT"));
    se.forEach((s, i) =>
      expectClose(
        result[i] as number,
        z975 * s,
        { abs: z975 * 5.1e-6 },
        `Bartlett band lag ${i + 1}`,
      ),
    );
  });

  it("gives robust half-widths from the derived Series F robust variances", () => {
    // Derived from the Series F data with the robust variance of Taylor (1984), METHODS.md.
    const nv = [0.852773, 0.755375, 1.13766, 0.51132, 1.01231];
    const result = columnValues(call("SERIESBAND", seriesFColumn, 5, 0.05, "robust"));
    nv.forEach((v, i) =>
      expectClose(
        result[i] as number,
        z975 * Math.sqrt(v / 70),
        { rel: 5e-6 },
        `robust band lag ${i + 1}`,
      ),
    );
  });
});

describe("SERIESPORTMANTEAU(series, lags, fittedParams, testKind)", () => {
  // Derived from the Series F data with each published formula (METHODS.md).
  const cases: [string | null, number, number, number, number][] = [
    [null, 10, 21.59155, 10, 0.017326],
    ["Ljung-Box", 5, 21.14423, 5, 0.000761],
    ["box-pierce", 10, 20.44501, 10, 0.025314],
    ["robust", 5, 24.08594, 5, 0.000209],
    ["SQUARES", 5, 4.627404, 5, 0.46302],
  ];
  for (const [kind, lags, q, df, p] of cases) {
    it(`gives one row Q, df, p for testKind ${kind ?? "(omitted)"} at ${lags} lags`, () => {
      const result = call("SERIESPORTMANTEAU", seriesFColumn, lags, null, kind);
      expect(result.length).toBe(1);
      expect(result[0]?.length).toBe(3);
      expectClose(numberAt(result, 0, 0), q, { abs: 5.1e-6 * Math.max(1, q / 10) }, `${kind} Q`);
      expect(numberAt(result, 0, 1)).toBe(df);
      expectClose(numberAt(result, 0, 2), p, { abs: 5.1e-7 }, `${kind} p`);
    });
  }

  it("lowers df by fittedParams and takes p from the χ² upper tail", () => {
    const result = call("SERIESPORTMANTEAU", seriesFColumn, 10, 2);
    expect(numberAt(result, 0, 1)).toBe(8);
    const q = numberAt(result, 0, 0);
    expect(numberAt(result, 0, 2)).toBe(chiSquareUpperTail(q, 8));
    // A fitted model does not lower McLeod–Li's df (McLeod & Li 1983).
    expect(numberAt(call("SERIESPORTMANTEAU", seriesFColumn, 5, 2, "squares"), 0, 1)).toBe(5);
  });

  it("uses the default number of lags when lags is omitted", () => {
    expect(call("SERIESPORTMANTEAU", seriesFColumn)).toEqual(
      call("SERIESPORTMANTEAU", seriesFColumn, 10),
    );
  });
});

describe("SERIESNOISECHECK(series, maxLag, season, fittedParams, alpha)", () => {
  it("finds structure in Series F and gives the core's verdict and reason", () => {
    const result = call("SERIESNOISECHECK", seriesFColumn);
    expect(result).toEqual([[coreF10.verdict.word, coreF10.verdict.reason]]);
    // Ljung–Box over 10 lags rejects at 5% (derived p 0.017326, METHODS.md).
    expect(result[0]?.[0]).toBe("structure");
    expect(String(result[0]?.[1])).toContain("10 lags tested at 5%");
  });

  it("judges seeded white noise as the core does, with the false-alarm note", () => {
    const noise = whiteNoise(seededRandom(20260301), 240);
    const result = call("SERIESNOISECHECK", columnRange(["residual", ...noise]), 24, null, 0, 0.05);
    const core = lagTable(seriesFromNumbers(noise), { maxLag: 24 });
    expect(result).toEqual([[core.verdict.word, core.verdict.reason]]);
    expect(String(result[0]?.[1])).toContain("24 lags tested at 5%");
  });

  it("says short, and why, for fewer than 20 values", () => {
    const result = call("SERIESNOISECHECK", columnRange([...seriesF.slice(0, 12)]));
    expect(result[0]?.[0]).toBe("short");
    expect(String(result[0]?.[1])).toContain("Only 12 values");
  });
});

/**
 * The portable report, proven in an independent spreadsheet engine: LibreOffice Calc (Debian's
 * libreoffice-calc-nogui, headless, recalculating every formula on load) opens each workbook
 * Echolot writes, and every figure it computes is compared with Echolot's own: r_k, pairs, se,
 * band, z, p per lag, Q, df and p to every lag, n, gaps, mean, c0, the crossing counts and their
 * binomial chance — numbers to 1e-9 relative, words exactly. Then the data are changed inside the
 * workbooks (a value, a blank gap, an #N/A gap, a longer column), LibreOffice recalculates, and
 * the figures are compared with Echolot on the changed data, judged at the levels the sheet was
 * written with (the add-in recomputes its permutation levels from the new data; the sheet keeps
 * its constants until a new report is placed).
 *
 * Tolerance 1e-9 relative: the core sums lag products with compensated (Neumaier) summation and
 * takes p from stdlib's special functions; the spreadsheet adds its SUMPRODUCTs plainly and uses
 * its own CHISQ.DIST.RT, NORM.S.DIST and BINOM.DIST, and LibreOffice writes 15 significant digits
 * into xlsx. Plain sums of n ≤ 1,300 terms lose at most about n·2⁻⁵³ ≈ 1e-13 relative to the sum
 * of magnitudes, so 1e-9 leaves room for the distribution functions' own accuracy while still
 * catching any wrong formula (an off-by-one lag or a shifted gap moves figures by 1e-3 or more).
 * A zero is compared exactly.
 *
 * All workbooks go through one soffice start (the slow part), so the whole file stays well
 * under a minute on an idle machine; the timeout allows for a busy one.
 */
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import {
  batchCheck,
  corridorZone,
  defaultMaxLag,
  lagTable,
  noiseCheck,
  referenceKind,
  seriesFromValues,
  type LagOptions,
  type LagTable,
  type Series,
} from "../../src/core";
import type { CheckJson } from "../../src/cli/json";
import { portablePlan, type Figure, type PortablePlan } from "../../src/report";
import {
  DATA_SHEET,
  readWorkbookData,
  roomToGrow,
  workbookPlan,
  type WorkbookData,
} from "../../src/cli/workbook";
import {
  demoPortablePlans,
  demoWorkbookBytes,
  LARKVALE_PORTABLE,
  readDemoCsv,
  type DemoTableOf,
} from "../../scripts/demoWorkbook";
import { seededRandom } from "../../src/sim/random";
import { csvFile, ROOT, runCli } from "../cli/run";
import { FIXTURES } from "../helpers/fixtures";
import {
  convertWithLibreOffice,
  readCell,
  readWorkbook,
  soffice,
  type CellReading,
} from "../helpers/libreoffice";

const TOLERANCE = 1e-9;
const LONG_TIMEOUT = 420_000;
const SERIES_F = join(FIXTURES, "series-f.csv");
const DEMO = join(ROOT, "demo");

interface Case {
  readonly name: string;
  /** The workbook as written (input to LibreOffice). */
  readonly file: string;
  /** The plan whose figures the recalculated cells must show. */
  readonly expected: PortablePlan;
  /** Held examples: label, n, the add-in's verdict, and where the portable verdict is. */
  readonly verdicts: readonly HeldVerdict[];
  recalculated?: ExcelJS.Workbook | undefined;
}

interface HeldVerdict {
  readonly example: string;
  /** Prefix of the report's figure keys ("" for a single report, "b3:" for a batch block). */
  readonly key: string;
  readonly n: number;
  /** Whether the add-in reads this series by its permutation reference (n·K ≤ 250,000). */
  readonly permuted: boolean;
  readonly addIn: string;
  readonly sheet: string;
  readonly row: number;
  readonly column: number;
}

interface Tally {
  count: number;
  largest: number;
  where: string;
}

/**
 * The verdict rule as DESIGN.md and src/core/verdict.ts state it — short, then structure, then
 * watch, else clear — applied to the sheet's own constants (levels) and Echolot's figures for one
 * report (keys with `key` as prefix): what the portable report promises, checked on every
 * example whatever reference the add-in itself reads its joint p from.
 */
function ruleVerdict(plan: PortablePlan, key: string): string {
  const f = (name: string) => plan.figures.get(`${key}${name}`);
  const num = (name: string) => f(name) as number;
  if (num("n") < 20 || num("maxLag") > num("n") / 4) return "short";
  if (num("p") < num("jointLevel") || num("outerCount") > 0) return "structure";
  const excess = num("crossings") > 0 && num("chance") < num("alpha");
  if (f("lagOne") === "yes" || f("seasonal") === "yes" || excess) return "watch";
  return "clear";
}

function relativeDifference(reading: number, expected: number): number {
  if (expected === 0) return Math.abs(reading);
  return Math.abs(reading - expected) / Math.abs(expected);
}

/** Every figure of `plan` against the recalculated workbook; failures as readable lines. */
function compareFigures(
  name: string,
  plan: PortablePlan,
  book: ExcelJS.Workbook,
  tally: Tally,
): string[] {
  const problems: string[] = [];
  for (const sheet of plan.sheets) {
    const recalculated = book.getWorksheet(sheet.name);
    if (recalculated === undefined) {
      problems.push(`no sheet "${sheet.name}"`);
      continue;
    }
    for (const cell of sheet.cells) {
      // Verdicts are held to the rule and to the add-in in their own test, below.
      if (cell.figure === undefined || cell.figure.endsWith("verdict")) continue;
      const expected = plan.figures.get(cell.figure) as Figure;
      const reading: CellReading = readCell(recalculated.getCell(cell.row + 1, cell.column + 1));
      const where = `${sheet.name}!R${cell.row + 1}C${cell.column + 1} (${cell.figure})`;
      tally.count++;
      if (typeof expected === "number") {
        const diff = typeof reading === "number" ? relativeDifference(reading, expected) : Infinity;
        if (diff > tally.largest) {
          tally.largest = diff;
          tally.where = `${name}: ${where}`;
        }
        if (!(diff <= TOLERANCE)) {
          problems.push(
            `${where}: LibreOffice ${String(reading)}, Echolot ${expected}, relative difference ${diff}, tolerance ${TOLERANCE}`,
          );
        }
      } else if ((reading ?? "") !== expected) {
        problems.push(`${where}: LibreOffice "${String(reading)}", Echolot "${expected}"`);
      }
    }
  }
  return problems;
}

/** A seeded AR(1) series (φ = 0.45) with blank and NA gaps, as CSV text; the gaps as null. */
function gappySeries(length: number, seed: number): (number | null)[] {
  const random = seededRandom(seed);
  const values: (number | null)[] = [];
  let previous = 0;
  for (let t = 0; t < length; t++) {
    previous = 0.45 * previous + random.normal();
    values.push(Math.round((20 + 3 * previous) * 1e4) / 1e4);
  }
  for (const gap of [7, 8, 31, 64, 90]) values[gap] = null;
  return values;
}

function csvText(header: string, values: readonly (number | null)[], gapText = ""): string {
  return `${header}\n${values.map((v, i) => (v === null ? (i % 2 === 0 ? gapText : "") : String(v))).join("\n")}\n`;
}

/**
 * Echolot's lag table of changed data, judged at the levels a sheet was written with: the
 * all-lags corridor and the joint level stay the written constants, so each lag's place against
 * the outer corridor is re-read from its z.
 */
function atWrittenLevels(fresh: LagTable, written: LagTable): LagTable {
  const outerLevel = written.outerLevel;
  return {
    ...fresh,
    outerLevel,
    jointLevel: written.jointLevel,
    rows: fresh.rows.map((row) => ({
      ...row,
      outer: Math.abs(row.z) > outerLevel,
      zone: corridorZone(row.z, { innerLevel: fresh.innerLevel, outerLevel }),
      partialZone: corridorZone(row.partialZ, { innerLevel: fresh.innerLevel, outerLevel }),
    })),
  };
}

/** The one series of a workbook's data. */
function onlySeries(data: WorkbookData): Series {
  const analysis = data.columns[0]?.analysis;
  if (analysis === undefined || !("series" in analysis)) throw new Error("no series read");
  return analysis.series;
}

/** Echolot's series of a data column as the changed workbook holds it (null for a gap). */
function seriesOf(values: readonly (number | null)[], label: string): Series {
  return seriesFromValues([label, ...values]);
}

/** Reads the first column of the Data sheet as Echolot would (numbers; anything else a gap). */
function dataColumn(sheet: ExcelJS.Worksheet, column: number, rows: number): (number | null)[] {
  const values: (number | null)[] = [];
  for (let r = 2; r <= rows + 1; r++) {
    const v = sheet.getCell(r, column).value;
    values.push(typeof v === "number" ? v : null);
  }
  while (values.length > 0 && values[values.length - 1] === null) values.pop();
  return values;
}

/** A value, a blank gap, an #N/A gap and `extra` more values at the end of a column. */
function changeColumn(
  sheet: ExcelJS.Worksheet,
  column: number,
  first: number,
  last: number,
  extra: readonly number[],
): void {
  const middle = Math.floor((first + last) / 2);
  const original = sheet.getCell(middle, column).value as number;
  sheet.getCell(middle, column).value = original * 1.5 + 1;
  sheet.getCell(first + 4, column).value = null;
  sheet.getCell(last - 6, column).value = { error: "#N/A" } as ExcelJS.CellErrorValue;
  extra.forEach((v, i) => {
    sheet.getCell(last + 1 + i, column).value = v;
  });
}

function extraValues(count: number, seed: number, scale: number, centre: number): number[] {
  const random = seededRandom(seed);
  return Array.from(
    { length: count },
    () => Math.round((centre + scale * random.normal()) * 1e4) / 1e4,
  );
}

const cases: Case[] = [];
const tally: Tally = { count: 0, largest: 0, where: "" };

beforeAll(async () => {
  soffice(); // fails at once, with the install hint, where LibreOffice is missing
  const dir = mkdtempSync(join(tmpdir(), "echolot-portable-"));
  const placedOn = "2026-12-02";

  // 1. Series F through the command line, as a user writes it.
  const fFile = join(dir, "f.xlsx");
  const written = runCli(["workbook", SERIES_F, "--out", fFile]);
  expect(written.status, written.stderr).toBe(0);
  const fData = await readWorkbookData(SERIES_F, {}, false);
  const fPlan = workbookPlan(fData, {}, { batch: false, placedOn });
  const fSeries = onlySeries(fData);
  cases.push({
    name: "Series F",
    file: fFile,
    expected: fPlan,
    verdicts: [held("Series F", fSeries, {}, "Portable report")],
  });

  // Series F judged over 20 lags: more than n/4, so `short`.
  const shortFile = join(dir, "f-short.xlsx");
  expect(runCli(["workbook", SERIES_F, "--lags", "20", "--out", shortFile]).status).toBe(0);
  cases.push({
    name: "Series F over 20 lags",
    file: shortFile,
    expected: workbookPlan(fData, { maxLag: 20 }, { batch: false, placedOn }),
    verdicts: [held("Series F over 20 lags", fSeries, { maxLag: 20 }, "Portable report")],
  });

  // 2–3. A series with blank and NA gaps, under each band kind and joint test.
  const gappy = gappySeries(150, 11);
  const gappyCsv = csvFile("gappy.csv", csvText("level", gappy, "NA"));
  const gappyData = await readWorkbookData(gappyCsv, {}, false);
  const gappySeriesValue = onlySeries(gappyData);
  const variants: [string, string[], LagOptions][] = [
    [
      "gaps, Bartlett, Box–Pierce, season 12",
      ["--bands", "bartlett", "--test", "box-pierce", "--season", "12", "--lags", "24"],
      { bandKind: "bartlett", testKind: "box-pierce", season: 12, maxLag: 24 },
    ],
    [
      "gaps, robust bands and Q*, alpha 0.1",
      ["--bands", "robust", "--test", "robust", "--alpha", "0.1", "--fitted", "1"],
      { bandKind: "robust", testKind: "robust", alpha: 0.1, fittedParams: 1 },
    ],
  ];
  variants.forEach(([name, args, options], i) => {
    const file = join(dir, `gappy-${i}.xlsx`);
    const result = runCli(["workbook", gappyCsv, ...args, "--out", file]);
    expect(result.status, result.stderr).toBe(0);
    cases.push({
      name,
      file,
      expected: workbookPlan(gappyData, options, { batch: false, placedOn }),
      verdicts: [held(name, gappySeriesValue, options, "Portable report")],
    });
  });

  // 4. A long noise series: 1,200 values (n·K within the add-in's permutation range).
  const noise = extraValues(1200, 29, 1, 0);
  const noiseCsv = csvFile("noise.csv", csvText("noise", noise));
  const noiseFile = join(dir, "noise.xlsx");
  expect(runCli(["workbook", noiseCsv, "--out", noiseFile]).status).toBe(0);
  cases.push({
    name: "1,200 values of noise",
    file: noiseFile,
    expected: workbookPlan(
      await readWorkbookData(noiseCsv, {}, false),
      {},
      {
        batch: false,
        placedOn,
      },
    ),
    verdicts: [held("1,200 values of noise", seriesOf(noise, "noise"), {}, "Portable report")],
  });

  // 5. The demo workbook (a portable batch of 24 blends and the fund's report with its chart).
  const demoFile = join(dir, "demo.xlsx");
  writeFileSync(demoFile, await demoWorkbookBytes(DEMO, placedOn));
  // The tables the demo's sheets were written with, kept to judge its changed data at their levels.
  const demoTables = new Map<string, LagTable>();
  const demoPlans = demoPortablePlans(DEMO, placedOn, null, (series, options, where) => {
    const table = lagTable(series, options);
    demoTables.set(where, table);
    return table;
  });
  for (const d of demoPlans) {
    cases.push({
      name: `demo: ${d.name}`,
      file: demoFile,
      expected: d.plan,
      verdicts: demoVerdicts(d.name, d.plan),
    });
  }

  // 6. Changed data: Series F and the gappy Bartlett case, changed in their Data sheets.
  await changedCase(fFile, join(dir, "f-changed.xlsx"), "Series F, changed", {
    options: {},
    table: lagTable(fSeries, {}),
    label: "yield",
    rows: 70,
  });
  const bartlett = variants[0]?.[2] ?? {};
  await changedCase(
    join(dir, "gappy-0.xlsx"),
    join(dir, "gappy-0-changed.xlsx"),
    "gaps, Bartlett, Box–Pierce, changed",
    {
      options: bartlett,
      table: lagTable(gappySeriesValue, bartlett),
      label: "level",
      rows: 150,
    },
  );
  await changedDemo(demoFile, join(dir, "demo-changed.xlsx"), placedOn, demoTables);

  // One LibreOffice start for every file.
  const files = [...new Set(cases.map((c) => c.file))];
  const converted = convertWithLibreOffice(files, "xlsx");
  const books = new Map<string, ExcelJS.Workbook>();
  for (let i = 0; i < files.length; i++) {
    books.set(files[i] as string, await readWorkbook(converted[i] as string));
  }
  for (const c of cases) c.recalculated = books.get(c.file);
}, LONG_TIMEOUT);

function held(example: string, series: Series, options: LagOptions, sheet: string): HeldVerdict {
  const check = noiseCheck(series, options);
  const permuted = check.levels.reference === "permutation";
  return {
    example,
    key: "",
    n: check.n,
    permuted,
    addIn: check.verdict.word,
    sheet,
    row: 6,
    column: 1,
  };
}

/** The demo's held examples: each blend's summary row, and the fund's report. */
function demoVerdicts(name: string, plan: PortablePlan): HeldVerdict[] {
  const found: HeldVerdict[] = [];
  for (const sheet of plan.sheets) {
    for (const cell of sheet.cells) {
      const key = cell.figure ?? "";
      const isSummary = /^row\d+:verdict$/.test(key);
      if (!(isSummary || (name === "larkvale" && key === "verdict"))) continue;
      const prefix = isSummary ? key.replace(/^row(\d+):verdict$/, "b$1:") : "";
      const n = plan.figures.get(`${prefix}n`) as number;
      const K = plan.figures.get(`${prefix}maxLag`) as number;
      const label = sheet.cells.find((c) => c.row === cell.row && c.column === 0)?.content;
      found.push({
        example: isSummary && label !== undefined && "value" in label ? String(label.value) : name,
        key: prefix,
        n,
        // The demo's reports have no fitted parameters.
        permuted:
          referenceKind(n, K, 0, plan.figures.get(`${prefix}alpha`) as number) === "permutation",
        addIn: plan.figures.get(`${prefix}addInVerdict`) as string,
        sheet: sheet.name,
        row: cell.row,
        column: cell.column,
      });
    }
  }
  return found;
}

interface Written {
  readonly options: LagOptions;
  /** The table the report was written from: its K and levels, which a change to the data does not move. */
  readonly table: LagTable;
  readonly label: string;
  readonly rows: number;
}

async function changedCase(
  from: string,
  to: string,
  name: string,
  written: Written,
): Promise<void> {
  const { options, label, rows } = written;
  const book = await readWorkbook(from);
  const data = book.getWorksheet(DATA_SHEET);
  if (data === undefined) throw new Error("no Data sheet");
  changeColumn(data, 1, 2, rows + 1, extraValues(25, 5, 10, 50));
  await book.xlsx.writeFile(to);
  const series = seriesOf(dataColumn(data, 1, rows + 40), label);
  const same: LagOptions = { ...options, maxLag: written.table.maxLag };
  const table = atWrittenLevels(lagTable(series, same), written.table);
  const plan = portablePlan(
    table,
    series,
    { sheet: DATA_SHEET, column: 0, firstRow: 1, rows: rows + roomToGrow(rows) },
    { sheetName: "Portable report", placedOn: "2026-12-02", roomToGrow: true },
  );
  cases.push({
    name,
    file: to,
    expected: plan,
    verdicts: [held(name, series, same, "Portable report")],
  });
}

/** The fund's residuals and one blend changed inside the demo workbook. */
async function changedDemo(
  from: string,
  to: string,
  placedOn: string,
  written: ReadonlyMap<string, LagTable>,
): Promise<void> {
  const book = await readWorkbook(from);
  const fund = book.getWorksheet("Larkvale residuals");
  const blends = book.getWorksheet("Ternpoint errors");
  if (fund === undefined || blends === undefined) throw new Error("demo sheets missing");
  changeColumn(fund, 2, 2, 751, extraValues(60, 17, 0.8, 0));
  changeColumn(blends, 3, 2, 105, extraValues(30, 23, 40, 0));
  await book.xlsx.writeFile(to);
  // The same plans from the changed data, written as CSV files the demo builder reads.
  const changedDir = mkdtempSync(join(tmpdir(), "echolot-demo-changed-"));
  for (const [sheet, file, width] of [
    [blends, "ternpoint-roasters-forecast-errors.csv", 25],
    [fund, "larkvale-fund-residuals.csv", 2],
  ] as const) {
    const lines: string[] = [];
    const header = readFileSync(join(DEMO, file), "utf8").split("\n")[0] as string;
    lines.push(header);
    for (let r = 2; r <= sheet.rowCount; r++) {
      const cells: string[] = [];
      for (let c = 1; c <= width; c++) {
        const v = sheet.getCell(r, c).value;
        cells.push(typeof v === "number" ? String(v) : typeof v === "string" ? v : "");
      }
      if (cells.some((cell) => cell !== "")) lines.push(cells.join(","));
    }
    writeFileSync(join(changedDir, file), `${lines.join("\n")}\n`);
  }
  // The blends' reports keep the K they were written with (the default for 104 weeks).
  const atWritten: DemoTableOf = (series, options, where) => {
    const table = written.get(where);
    if (table === undefined) throw new Error(`no written table for ${where}`);
    return atWrittenLevels(lagTable(series, options), table);
  };
  for (const d of demoPortablePlans(changedDir, placedOn, defaultMaxLag(104, 13), atWritten)) {
    cases.push({
      name: `demo: ${d.name}, changed`,
      file: to,
      expected: d.plan,
      verdicts: demoVerdicts(d.name, d.plan),
    });
  }
}

describe("portable reports recalculated in LibreOffice Calc", () => {
  it("show Echolot's figures on every written workbook and after each change to the data", () => {
    const problems: string[] = [];
    for (const c of cases) {
      if (c.recalculated === undefined) throw new Error(`${c.name} was not converted`);
      for (const p of compareFigures(c.name, c.expected, c.recalculated, tally)) {
        problems.push(`${c.name}: ${p}`);
      }
    }
    console.log(
      `portable report vs Echolot: ${tally.count} figures compared over ${cases.length} reports; largest relative difference ${tally.largest.toExponential(2)} at ${tally.where}`,
    );
    expect(problems.slice(0, 20)).toEqual([]);
    expect(tally.count).toBeGreaterThan(5000);
  });

  it("applies the verdict rule to the sheet's own levels and figures on every held example, and says when the add-in's permutation reading may differ", () => {
    const rows: string[] = [];
    let agree = 0;
    let parted = 0;
    let total = 0;
    for (const c of cases) {
      const book = c.recalculated as ExcelJS.Workbook;
      for (const v of c.verdicts) {
        const sheet = book.getWorksheet(v.sheet) as ExcelJS.Worksheet;
        const portable = readCell(sheet.getCell(v.row + 1, v.column + 1));
        const where = `${c.name} / ${v.example}`;
        // The sheet's rule, applied to its own constants and Echolot's figures of this report.
        expect(portable, where).toBe(ruleVerdict(c.expected, v.key));
        expect(c.expected.figures.get(`${v.key}verdict`), where).toBe(portable);
        total++;
        if (portable === v.addIn) agree++;
        else if (v.permuted) parted++;
        rows.push(
          `${where}: n ${v.n}, ${v.permuted ? "permutation" : "normal limit"}, add-in ${v.addIn}, portable ${String(portable)}`,
        );
        // Where the add-in reads the normal limit, its joint level is the χ² tail at its critical
        // Q, so the two agree on structure; the watch rule's level w* may still part them.
        if (!v.permuted) {
          expect(portable === "structure", where).toBe(v.addIn === "structure");
        }
      }
    }
    // Agreement with the add-in is reported, not asserted: for series of ordinary length the add-in
    // judges by permutation levels and p, which the sheet cannot draw (its note says so).
    console.log(
      `verdicts: ${agree} of ${total} held examples agree with the add-in (${parted} differ under its permutation reference)\n${rows.join("\n")}`,
    );
    expect(total).toBeGreaterThan(50);
    // The line beside the verdict: the add-in's permutation reading may differ for n·K ≤ 250,000.
    const line = (name: string) => {
      const c = cases.find((x) => x.name === name) as Case;
      const sheet = c.recalculated?.getWorksheet("Portable report") as ExcelJS.Worksheet;
      return String(readCell(sheet.getCell(8, 2)));
    };
    expect(line("Series F")).toContain("exact permutation reference");
    expect(line("Series F")).toContain("n·K ≤ 250,000");
    expect(line("1,200 values of noise")).toContain("may differ");
    // Fitted parameters: the add-in reads the normal limit, with its χ² p.
    expect(line("gaps, robust bands and Q*, alpha 0.1")).toContain("too reads the joint p from χ²");
    const fund = cases.find((x) => x.name === "demo: larkvale")?.recalculated;
    expect(String(readCell(fund?.getWorksheet(LARKVALE_PORTABLE)?.getCell(8, 2)))).toContain(
      "may differ",
    );
  });

  it("matches what `echolot check` and `echolot batch` print for Series F and the demo blends", () => {
    const check = JSON.parse(runCli(["check", SERIES_F, "--json"]).stdout) as CheckJson;
    const f = cases
      .find((c) => c.name === "Series F")
      ?.recalculated?.getWorksheet("Portable report");
    const at = (row: number) => readCell(f?.getCell(row, 2));
    expect(relativeDifference(at(24) as number, check.joint.q)).toBeLessThanOrEqual(TOLERANCE);
    expect(at(25)).toBe(check.joint.df);
    expect(relativeDifference(at(26) as number, check.joint.p)).toBeLessThanOrEqual(TOLERANCE);
    const fCase = cases.find((c) => c.name === "Series F") as Case;
    expect(at(7)).toBe(ruleVerdict(fCase.expected, ""));
    console.log(`Series F: add-in (check) ${check.verdict.word}, portable ${String(at(7))}`);

    const grid = readDemoCsv(DEMO, "ternpoint-roasters-forecast-errors.csv");
    const [headers = [], ...body] = grid;
    const columns = headers.slice(1).map((h, i) =>
      seriesFromValues([
        String(h),
        ...body.map((r) => {
          const v = r[i + 1];
          return typeof v === "number" ? v : null;
        }),
      ]),
    );
    const batch = batchCheck(columns, { season: 13 });
    const blendCase = cases.find((c) => c.name === "demo: ternpoint") as Case;
    const summary = blendCase.recalculated?.getWorksheet("Ternpoint portable");
    let chiSquareRows = 0;
    batch.rows.forEach((row, i) => {
      const cell = (column: number) => readCell(summary?.getCell(7 + i, column));
      expect(cell(1), `row ${i}`).toBe(row.label);
      // The sheet is the plain reading (Ljung–Box, noise bands); the batch reads a series whose
      // volatility check fires robustly, so its figures are compared with the plain noise check.
      const plain = noiseCheck(columns[i] as (typeof columns)[number], { season: 13 });
      expect(relativeDifference(cell(3) as number, plain.joint.q)).toBeLessThanOrEqual(TOLERANCE);
      expect(cell(4)).toBe(plain.joint.df);
      // The sheet's p is the χ² p of the joint test, which the core also gives.
      chiSquareRows++;
      expect(relativeDifference(cell(5) as number, plain.joint.p)).toBeLessThanOrEqual(TOLERANCE);
      expect(cell(6)).toBe(ruleVerdict(blendCase.expected, `b${i}:`));
    });
    console.log(
      `demo blends: ${chiSquareRows} of ${batch.rows.length} χ² p-values match the core's`,
    );
  });
});

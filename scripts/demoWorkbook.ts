/**
 * The demo workbook: the two invented scenarios of demo/ as sheets, each with live ECHOLOT
 * formulas beside its data, so someone with the add-in opens it and sees diagnostics at once —
 * and, beside those, portable reports written in the spreadsheet's own functions
 * (src/report/portablePlan.ts), so a reader without the add-in sees live figures too: a portable
 * batch of the 24 blends (season 13) and a portable report with its chart of the fund's residuals
 * (20 lags), each linked into the scenario's sheet next to the add-in's verdicts.
 *
 * The data cells are the CSV cells unchanged (numbers as numbers, dates as the text they are).
 * Each formula is written as an array formula over the exact size of what it returns — the file
 * format's way of holding a multi-cell result that every spreadsheet version reads — with the
 * result cached: the values the cell functions themselves compute now, so the figures show even
 * before the add-in is loaded (it recomputes them once it is).
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import ExcelJS from "exceljs";
import {
  seriesBatchCheck,
  seriesBiasCheck,
  seriesLagTable,
  seriesNoiseCheck,
  seriesPortmanteau,
  seriesVolCheck,
} from "../functions/functions";
import {
  cellReader,
  csvParseOptions,
  detectDialect,
  lagTable,
  seriesFromValues,
  type LagOptions,
  type LagTable,
  type Series,
} from "../src/core";
import {
  batchVerdictCell,
  columnLetters,
  echolotFormula,
  portableBatchPlan,
  portableBlockCells,
  portablePlan,
  SCREENING_CAUTION,
  type PortableBatchItem,
  type PortablePlan,
  type PortableSource,
} from "../src/report";
import {
  addPortableSheets,
  portableWorkbookBytes,
  type PlacedChart,
} from "../src/cli/portableWorkbook";

type Cell = string | number;
type Grid = Cell[][];
type CellFunction = (...args: unknown[]) => unknown[][];

const FUNCTIONS: Readonly<Record<string, CellFunction>> = {
  SERIESNOISECHECK: seriesNoiseCheck as CellFunction,
  SERIESBIASCHECK: seriesBiasCheck as CellFunction,
  SERIESBATCHCHECK: seriesBatchCheck as CellFunction,
  SERIESPORTMANTEAU: seriesPortmanteau as CellFunction,
  SERIESVOLCHECK: seriesVolCheck as CellFunction,
  SERIESLAGTABLE: seriesLagTable as CellFunction,
};

export interface DemoSheet {
  readonly name: string;
  readonly file: string;
  /** The CSV as read: header row, then data rows, numbers converted. */
  readonly data: Grid;
}

/** A formula placed on a sheet: what it computes on which data columns, and where it goes. */
export interface LiveFormula {
  readonly name: string;
  /** Zero-based first and last data column it reads (header row included, so labels travel). */
  readonly columns: readonly [number, number];
  readonly args: readonly (string | number | null)[];
  /** Top-left cell of the result, zero-based. */
  readonly row: number;
  readonly column: number;
}

/** The CSV cells, read with the table reader's dialect and cell rules (numbers as numbers). */
export function readDemoCsv(directory: string, file: string): Grid {
  const text = readFileSync(join(directory, file), "utf8");
  const dialect = detectDialect(text, true);
  const reader = cellReader({ decimal: dialect.decimal });
  const records = parse(text, csvParseOptions(dialect)) as string[][];
  return records.map((row, r) =>
    row.map((cell) => {
      const value = r > 0 ? reader.read(cell) : undefined;
      return value !== undefined && Number.isFinite(value) ? value : cell;
    }),
  );
}

function rangeOf(data: Grid, columns: readonly [number, number]): string {
  return `${columnLetters(columns[0])}1:${columnLetters(columns[1])}${data.length}`;
}

/** The formula text as the sheet holds it (no leading "="). */
export function formulaText(data: Grid, live: LiveFormula): string {
  return echolotFormula(live.name, rangeOf(data, live.columns), live.args).slice(1);
}

/** What the cell function returns for these cells: the cached result of the formula. */
export function computeResult(data: Grid, live: LiveFormula): Grid {
  const fn = FUNCTIONS[live.name];
  if (fn === undefined) throw new Error(`no cell function ${live.name}`);
  const cells = data.map((row) =>
    row.slice(live.columns[0], live.columns[1] + 1).map((c) => c ?? ""),
  );
  return fn(cells, ...live.args) as Grid;
}

const TERNPOINT_SEASON = 13;
const LARKVALE_LAGS = 20;

function ternpointFormulas(data: Grid): {
  heading: [number, number, string][];
  live: LiveFormula[];
} {
  const blends = (data[0]?.length ?? 1) - 1;
  const left = blends + 2; // one empty column after the data
  const heading: [number, number, string][] = [
    [0, left, `Echolot checks, season ${TERNPOINT_SEASON} (live formulas of the Echolot add-in)`],
    [2, left, "blend"],
    [2, left + 1, "verdict"],
    [2, left + 2, "reason"],
    [2, left + 3, "mean error"],
    [2, left + 4, "HAC standard error"],
    [2, left + 5, "t"],
    [2, left + 6, "p (bias)"],
    [4 + blends, left, "All blends at once, with false-discovery control"],
  ];
  const live: LiveFormula[] = [];
  for (let b = 0; b < blends; b++) {
    const column = b + 1;
    heading.push([3 + b, left, String(data[0]?.[column] ?? `blend ${b + 1}`)]);
    live.push({
      name: "SERIESNOISECHECK",
      columns: [column, column],
      args: [null, TERNPOINT_SEASON],
      row: 3 + b,
      column: left + 1,
    });
    live.push({
      name: "SERIESBIASCHECK",
      columns: [column, column],
      args: [],
      row: 3 + b,
      column: left + 3,
    });
  }
  live.push({
    name: "SERIESBATCHCHECK",
    columns: [1, blends],
    args: [null, TERNPOINT_SEASON],
    row: 5 + blends,
    column: left,
  });
  return { heading, live };
}

function larkvaleFormulas(): { heading: [number, number, string][]; live: LiveFormula[] } {
  const left = 3;
  const heading: [number, number, string][] = [
    [0, left, "Echolot checks (live formulas of the Echolot add-in)"],
    [2, left, "Plain reading: noise bands, Ljung–Box (over-alarms under volatility clustering)"],
    [3, left, "verdict"],
    [4, left, "Ljung–Box Q, df, p"],
    [6, left, "Robust reading: robust bands, robust Q*"],
    [7, left, "robust Q*, df, p"],
    [8, left, "Engle's LM, df, p"],
    [10, left, "Lag table with robust bands"],
  ];
  const series: [number, number] = [1, 1];
  const live: LiveFormula[] = [
    { name: "SERIESNOISECHECK", columns: series, args: [LARKVALE_LAGS], row: 3, column: left + 1 },
    {
      name: "SERIESPORTMANTEAU",
      columns: series,
      args: [LARKVALE_LAGS, 0, "ljung-box"],
      row: 4,
      column: left + 1,
    },
    {
      name: "SERIESPORTMANTEAU",
      columns: series,
      args: [LARKVALE_LAGS, 0, "robust"],
      row: 7,
      column: left + 1,
    },
    { name: "SERIESVOLCHECK", columns: series, args: [LARKVALE_LAGS], row: 8, column: left + 1 },
    {
      name: "SERIESLAGTABLE",
      columns: series,
      args: [LARKVALE_LAGS, 0.05, "robust"],
      row: 11,
      column: left,
    },
  ];
  return { heading, live };
}

export interface DemoLayout {
  readonly sheet: DemoSheet;
  readonly heading: readonly [number, number, string][];
  readonly live: readonly LiveFormula[];
}

export function demoLayouts(directory: string): DemoLayout[] {
  const ternpoint: DemoSheet = {
    name: "Ternpoint errors",
    file: "ternpoint-roasters-forecast-errors.csv",
    data: readDemoCsv(directory, "ternpoint-roasters-forecast-errors.csv"),
  };
  const larkvale: DemoSheet = {
    name: "Larkvale residuals",
    file: "larkvale-fund-residuals.csv",
    data: readDemoCsv(directory, "larkvale-fund-residuals.csv"),
  };
  return [
    { sheet: ternpoint, ...ternpointFormulas(ternpoint.data) },
    { sheet: larkvale, ...larkvaleFormulas() },
  ];
}

const ABOUT = [
  "Echolot demo workbook",
  "",
  "Two invented scenarios, each on its own sheet with live ECHOLOT formulas beside the data.",
  "Ternpoint errors: 104 weeks of forecast errors for 24 coffee blends of an imagined roaster (some clean, some under-react, some keep a 13-week promotion cycle, two are biased).",
  "Larkvale residuals: 750 days of return-model residuals of an imagined fund, with volatility clustering and no linear dependence: compare the plain and the robust reading.",
  "",
  "The formulas need the Echolot add-in. The figures shown were computed by Echolot when this file was built; with the add-in loaded they recompute whenever the data change. Without it a spreadsheet shows #NAME? once it recalculates.",
  "The portable sheets (Ternpoint portable, Larkvale portable) hold the same evidence in the spreadsheet's own functions: they recompute for everyone, with or without the add-in, and their verdicts are linked beside the add-in's.",
  "Select any column of errors and open the Echolot pane for the evidence chart and the explanation.",
  "",
  SCREENING_CAUTION,
];

/** Builds the workbook in memory, without the portable sheets (see `buildDemoBook`). */
export function buildDemoWorkbook(directory: string): ExcelJS.Workbook {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Echolot";
  workbook.created = new Date(Date.UTC(2026, 0, 1));
  workbook.modified = workbook.created;
  const about = workbook.addWorksheet("About");
  ABOUT.forEach((line, i) => {
    about.getCell(i + 1, 1).value = line;
  });
  about.getCell(1, 1).font = { bold: true, size: 14 };
  about.getColumn(1).width = 120;

  for (const layout of demoLayouts(directory)) {
    const sheet = workbook.addWorksheet(layout.sheet.name);
    layout.sheet.data.forEach((row, r) =>
      row.forEach((value, c) => {
        sheet.getCell(r + 1, c + 1).value = value;
      }),
    );
    sheet.getRow(1).font = { bold: true };
    for (const [r, c, text] of layout.heading) sheet.getCell(r + 1, c + 1).value = text;
    for (const live of layout.live) {
      const result = computeResult(layout.sheet.data, live);
      const rows = result.length;
      const columns = result.reduce((w, row) => Math.max(w, row.length), 0);
      const ref = `${columnLetters(live.column)}${live.row + 1}:${columnLetters(live.column + columns - 1)}${live.row + rows}`;
      result.forEach((row, i) =>
        row.forEach((value, j) => {
          const cell = sheet.getCell(live.row + i + 1, live.column + j + 1);
          if (i === 0 && j === 0) {
            cell.value = {
              formula: formulaText(layout.sheet.data, live),
              result: value,
              shareType: "array",
              ref,
            } as ExcelJS.CellValue;
          } else {
            cell.value = value;
          }
        }),
      );
    }
  }
  return workbook;
}

export const TERNPOINT_PORTABLE = "Ternpoint portable";
export const TERNPOINT_WORK = "Ternpoint portable work";
export const LARKVALE_PORTABLE = "Larkvale portable";

/** Data rows below each scenario's last row that its portable reports include (room to grow). */
const ROOM = 100;

/** The data column `column` of a scenario as a series, as the cell functions read it. */
function scenarioSeries(data: Grid, column: number) {
  return seriesFromValues(data.map((row) => row[column] ?? null).map((v) => (v === "" ? null : v)));
}

export interface DemoPortable {
  readonly name: string;
  readonly plan: PortablePlan;
  /** Lag options each report was computed with (the same K is written into the sheet). */
  readonly options: LagOptions;
}

/**
 * How a series' lag table is made: Echolot's `lagTable`, or (in a test that changes the data in
 * the written workbook) one that keeps the levels the sheets were written with. `where` is "fund"
 * or "blend C" for data column C.
 */
export type DemoTableOf = (series: Series, options: LagOptions, where: string) => LagTable;

/**
 * The demo's portable plans: the blends' batch and the fund's report. `blendLags` fixes the
 * blends' K (a report keeps the K it was written with when its data grow); by default each
 * blend's K is the add-in's default for its length and season.
 */
export function demoPortablePlans(
  directory: string,
  placedOn: string,
  blendLags: number | null = null,
  tableOf: DemoTableOf = lagTable,
): DemoPortable[] {
  const [ternpoint, larkvale] = demoLayouts(directory);
  if (ternpoint === undefined || larkvale === undefined) throw new Error("demo layouts missing");
  const blendOptions: LagOptions = { season: TERNPOINT_SEASON, maxLag: blendLags };
  const tdata = ternpoint.sheet.data;
  const items: PortableBatchItem[] = [];
  for (let c = 1; c < (tdata[0]?.length ?? 1); c++) {
    const series = scenarioSeries(tdata, c);
    const source: PortableSource = {
      sheet: ternpoint.sheet.name,
      column: c,
      firstRow: 1,
      rows: tdata.length - 1 + ROOM,
    };
    items.push({
      label: String(tdata[0]?.[c] ?? `blend ${c}`),
      source,
      analysis: { table: tableOf(series, blendOptions, `blend ${c}`), series },
    });
  }
  const ldata = larkvale.sheet.data;
  const fundOptions: LagOptions = { maxLag: LARKVALE_LAGS };
  const fund = scenarioSeries(ldata, 1);
  // The fund's report first: its sheet, with the chart, is the one a reader opens first.
  return [
    {
      name: "larkvale",
      plan: portablePlan(
        tableOf(fund, fundOptions, "fund"),
        fund,
        { sheet: larkvale.sheet.name, column: 1, firstRow: 1, rows: ldata.length - 1 + ROOM },
        { sheetName: LARKVALE_PORTABLE, placedOn, roomToGrow: true },
      ),
      options: fundOptions,
    },
    {
      name: "ternpoint",
      plan: portableBatchPlan(items, {
        summarySheet: TERNPOINT_PORTABLE,
        workSheet: TERNPOINT_WORK,
        placedOn,
        roomToGrow: true,
      }),
      options: blendOptions,
    },
  ];
}

export interface DemoBook {
  readonly workbook: ExcelJS.Workbook;
  readonly charts: readonly PlacedChart[];
  readonly portable: readonly DemoPortable[];
}

/**
 * The whole demo workbook: the scenarios with live ECHOLOT formulas, the portable sheets, and a
 * link to each portable verdict beside the add-in's verdicts.
 */
export function buildDemoBook(directory: string, placedOn: string): DemoBook {
  const workbook = buildDemoWorkbook(directory);
  const portable = demoPortablePlans(directory, placedOn);
  const charts = portable.flatMap(({ plan }) => addPortableSheets(workbook, plan));
  const [ternpoint, larkvale] = demoLayouts(directory);
  const tsheet = workbook.getWorksheet(ternpoint?.sheet.name ?? "");
  const lsheet = workbook.getWorksheet(larkvale?.sheet.name ?? "");
  if (tsheet === undefined || lsheet === undefined || ternpoint === undefined) {
    throw new Error("demo sheets missing");
  }
  // Beside the add-in's per-blend columns: the portable verdict, live for every reader.
  const blends = (ternpoint.sheet.data[0]?.length ?? 1) - 1;
  const linkColumn = blends + 2 + 7;
  tsheet.getCell(3, linkColumn + 1).value = "verdict (portable, no add-in needed)";
  for (let b = 0; b < blends; b++) {
    tsheet.getCell(4 + b, linkColumn + 1).value = {
      formula: batchVerdictCell(TERNPOINT_PORTABLE, b),
    } as ExcelJS.CellFormulaValue;
  }
  const fund = portableBlockCells(LARKVALE_PORTABLE, { row: 0, column: 0 });
  lsheet.getCell(2, 4).value = "Portable verdict (no add-in needed)";
  lsheet.getCell(2, 5).value = { formula: fund.verdict } as ExcelJS.CellFormulaValue;
  lsheet.getCell(2, 6).value =
    "The sheet Larkvale portable holds the same evidence in the spreadsheet's own functions, with its chart.";
  return { workbook, charts, portable };
}

/** The demo workbook as xlsx bytes, charts included. */
export async function demoWorkbookBytes(directory: string, placedOn: string): Promise<Buffer> {
  const { workbook, charts } = buildDemoBook(directory, placedOn);
  return portableWorkbookBytes(workbook, charts);
}

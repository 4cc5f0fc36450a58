/**
 * `echolot workbook FILE.csv [check options] --out book.xlsx [--force] [--batch]`: an xlsx
 * workbook with the CSV's data on the sheet "Data" and a portable report of the column checked
 * (or, with --batch, of every numeric column, one summary row each), written in the spreadsheet's
 * own functions so it stays live without the add-in. The data range of each report runs past the
 * last row, so values added below are included. An existing file is kept unless --force.
 */
import { existsSync, writeFileSync } from "node:fs";
import {
  isEcholotError,
  isGapText,
  isNumberColumn,
  isNumberText,
  lagTable,
  type LagOptions,
} from "../core";
import {
  portableBatchPlan,
  portablePlan,
  type PortableBatchItem,
  type PortablePlan,
  type PortableSource,
} from "../report";
import { columnSeries, pickColumn, readCsv, type CsvTable } from "./csv";
import { UsageError } from "./errors";
import { lagOptionsFrom, parseCommand } from "./options";
import type { CellValue } from "exceljs";
import { addPortableSheets, portableWorkbookBytes } from "./portableWorkbook";

export const DATA_SHEET = "Data";

/** Empty rows left below the data inside each report's range, for the column to grow into. */
export function roomToGrow(rows: number): number {
  return Math.max(100, rows);
}

function sourceOf(table: CsvTable, column: number): PortableSource {
  return {
    sheet: DATA_SHEET,
    column,
    firstRow: 1,
    rows: table.rows.length + roomToGrow(table.rows.length),
  };
}

/** The plan of one column, or of every numeric column with `batch`. */
export function workbookPlan(
  table: CsvTable,
  options: LagOptions,
  choice: { readonly batch: boolean; readonly column?: string; readonly placedOn: string },
): PortablePlan {
  if (options.testKind === "squares") {
    throw new UsageError(
      "a portable report computes --test ljung-box, box-pierce or robust; the squares' test needs the add-in",
    );
  }
  if (!choice.batch) {
    const column = pickColumn(table, choice.column);
    const series = columnSeries(table, column);
    const result = lagTable(series, options);
    return portablePlan(result, series, sourceOf(table, column), {
      sheetName: "Portable report",
      placedOn: choice.placedOn,
      roomToGrow: true,
    });
  }
  const items: PortableBatchItem[] = [];
  table.headers.forEach((header, column) => {
    if (!isNumberColumn(table.rows.map((row) => row[column] ?? ""))) return;
    const series = columnSeries(table, column);
    const label = header === "" ? `column ${column + 1}` : header;
    try {
      const result = lagTable(series, options);
      items.push({ label, source: sourceOf(table, column), analysis: { table: result, series } });
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      items.push({ label, source: sourceOf(table, column), analysis: { reason: error.message } });
    }
  });
  if (items.length === 0) throw new UsageError(`${table.file} has no column of numbers`);
  return portableBatchPlan(items, {
    summarySheet: "Portable batch",
    workSheet: "Portable work",
    placedOn: choice.placedOn,
    roomToGrow: true,
  });
}

/** The CSV's cells as the Data sheet holds them: numbers, blanks, #N/A for a written gap, text. */
function dataCell(text: string, header: boolean): string | number | { error: "#N/A" } | null {
  if (header) return text;
  if (text.trim() === "") return null;
  if (isGapText(text)) return { error: "#N/A" };
  return isNumberText(text) ? Number(text) : text;
}

export async function runWorkbook(argv: readonly string[]): Promise<string> {
  const force = argv.includes("--force");
  const batch = argv.includes("--batch");
  const { file, values } = parseCommand(argv.filter((a) => a !== "--force" && a !== "--batch"));
  if (file === undefined) {
    throw new UsageError("workbook needs a CSV file: echolot workbook FILE.csv --out book.xlsx");
  }
  const out = values.out;
  if (typeof out !== "string" || out.trim() === "") {
    throw new UsageError("workbook needs --out FILE.xlsx: where to write the workbook");
  }
  if (values.json === true) throw new UsageError("--json does not apply to workbook");
  if (batch && values.column !== undefined) {
    throw new UsageError("--batch reads every numeric column; --column is for one");
  }
  if (existsSync(out) && !force) {
    throw new UsageError(
      `${out} exists; nothing was written. Choose another --out, or add --force to replace it`,
    );
  }
  const table = readCsv(file);
  const plan = workbookPlan(table, lagOptionsFrom(values), {
    batch,
    ...(typeof values.column === "string" ? { column: values.column } : {}),
    placedOn: new Date().toISOString().slice(0, 10),
  });

  // Loaded here, not at start-up: the other commands do not need the xlsx library.
  const { default: ExcelJS } = await import("exceljs");
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Echolot";
  const data = workbook.addWorksheet(DATA_SHEET);
  [table.headers, ...table.rows].forEach((row, r) =>
    row.forEach((text, c) => {
      const value = dataCell(text, r === 0);
      if (value !== null) data.getCell(r + 1, c + 1).value = value as CellValue;
    }),
  );
  data.getRow(1).font = { bold: true };
  const charts = addPortableSheets(workbook, plan);
  const bytes = await portableWorkbookBytes(workbook, charts);
  try {
    writeFileSync(out, bytes);
  } catch {
    throw new UsageError(`cannot write ${out}: check that its folder exists and is writable`);
  }
  const verdicts = [...plan.figures].filter(([k]) => k.endsWith("verdict") && !k.startsWith("b"));
  const summary = verdicts.map(([, v]) => v).join(", ");
  return `wrote ${out}: ${batch ? `${verdicts.length} columns` : "one column"}, portable verdict${verdicts.length === 1 ? "" : "s"} at writing: ${summary}`;
}

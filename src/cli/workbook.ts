/**
 * `echolot workbook FILE [check options] [--batch] --out book.xlsx [--force]`: an xlsx workbook
 * with the file's cells on the sheet "Data" and a portable report of the column checked (or, with
 * --batch, of every column that is a series, one summary row each), written in the spreadsheet's
 * own functions so it stays live without the add-in. The data range of each report runs past the
 * last row, so values added below are included.
 *
 * The file is read once, by the same reader as `check` and `batch` (input.ts): the series and the
 * choice of columns come from it, and the records it reads are kept for the Data sheet (numbers
 * by the file's own cell rules, gaps as blanks or #N/A, text as text). The workbook is written as
 * `report` writes (output.ts): never over the input, never over an existing file without
 * --force, never half-written.
 */
import {
  cellReader,
  isEcholotError,
  lagTable,
  seriesName,
  type Dialect,
  type LagOptions,
  type Series,
} from "../core";
import {
  portableBatchPlan,
  portablePlan,
  type PortableBatchItem,
  type PortablePlan,
  type PortableSource,
} from "../report";
import { cellRulesOf, readingFrom, type Reading } from "./csv";
import { UsageError } from "./errors";
import { readManySeries, readOneSeries } from "./input";
import {
  LAG_OPTIONS,
  lagOptionsFromFlags,
  READ_OPTIONS,
  textOption,
  type OptionValues,
  type ParsedCommand,
} from "./options";
import { writeOutFile } from "./output";
import type { CellValue } from "exceljs";
import { addPortableSheets, portableWorkbookBytes } from "./portableWorkbook";

export const WORKBOOK_OPTIONS = [
  "column",
  ...LAG_OPTIONS,
  ...READ_OPTIONS,
  "batch",
  "out",
  "force",
];

export const DATA_SHEET = "Data";

/** Rows of an xlsx worksheet (ECMA-376 and every spreadsheet that opens one). */
const SHEET_ROWS = 1_048_576;

/** Empty rows left below the data inside each report's range, for the column to grow into. */
export function roomToGrow(rows: number): number {
  return Math.max(100, rows);
}

/** A cell of the Data sheet: a number, a gap (#N/A for a written gap word), or text. */
export type DataCell = number | string | { readonly error: "#N/A" } | null;

/** One analysed column: its 0-based position in the file and its series. */
export interface WorkbookColumn {
  readonly label: string;
  readonly column: number;
  readonly analysis: { readonly series: Series } | { readonly reason: string };
}

/** What the workbook is made of: the file's cells, where its data rows start, the columns. */
export interface WorkbookData {
  readonly cells: readonly (readonly DataCell[])[];
  /** The first data row on the Data sheet, 0-based: 1 below a header row, else 0. */
  readonly firstRow: number;
  readonly columns: readonly WorkbookColumn[];
  /** One line on what was read, as `check` and `batch` say it. */
  readonly source: string;
}

/** Keeps the records the reader reads, as Data sheet cells by the file's own cell rules. */
function keeper(reading: Reading, cells: DataCell[][]) {
  return (dialect: Dialect) => {
    const reader = cellReader(cellRulesOf(reading, dialect));
    let header = reading.header;
    return (record: readonly string[]) => {
      if (cells.length >= SHEET_ROWS) {
        throw new UsageError(
          `${reading.origin} has more than ${SHEET_ROWS.toLocaleString("en")} lines, more than a worksheet holds`,
        );
      }
      if (header) {
        header = false;
        cells.push([...record]);
        return;
      }
      cells.push(
        record.map((text) => {
          if (text.trim() === "") return null;
          const value = reader.read(text);
          if (value === undefined) return text;
          return Number.isNaN(value) ? { error: "#N/A" } : value;
        }),
      );
    };
  };
}

/** Reads the file once: the column checked (or every series with `batch`) and its cells. */
export async function readWorkbookData(
  file: string,
  values: OptionValues,
  batch: boolean,
): Promise<WorkbookData> {
  const cells: DataCell[][] = [];
  const plain = readingFrom(file, values);
  const reading: Reading = { ...plain, tap: keeper(plain, cells) };
  const firstRow = reading.header ? 1 : 0;
  if (!batch) {
    const one = await readOneSeries(reading, textOption(values, "column"));
    const label = seriesName(one.series.label, "cell", { column: one.column.index });
    return {
      cells,
      firstRow,
      columns: [{ label, column: one.column.index, analysis: { series: one.series } }],
      source: one.source,
    };
  }
  const many = await readManySeries(reading, values);
  const columns: WorkbookColumn[] = many.series.map((series, i) => {
    const column = many.columns?.[i]?.index ?? i;
    const label = seriesName(series.label, "cell", { column });
    return { label, column, analysis: { series } };
  });
  if (columns.length === 0) {
    const left = many.notAnalysed.map((n) => `${n.name} ${n.reason}`).join("; ");
    throw new UsageError(
      `${reading.origin} has no column of numbers${left === "" ? "" : `: ${left}`}`,
    );
  }
  // Each column left out keeps its row in the summary, with why (input.ts names it
  // `column N ("name")`).
  for (const { name, reason } of many.notAnalysed) {
    const place = /^column (\d+)(?: \("(.*)"\))?$/.exec(name);
    if (place === null) continue;
    columns.push({
      label: place[2] ?? name,
      column: Number(place[1]) - 1,
      analysis: { reason: `not analysed: ${reason}` },
    });
  }
  columns.sort((a, b) => a.column - b.column);
  return { cells, firstRow, columns, source: many.source };
}

function sourceOf(data: WorkbookData, column: number): PortableSource {
  const rows = data.cells.length - data.firstRow;
  return {
    sheet: DATA_SHEET,
    column,
    firstRow: data.firstRow,
    rows: Math.min(rows + roomToGrow(rows), SHEET_ROWS - data.firstRow),
  };
}

/** The plan of the column checked, or of every column with `batch`. */
export function workbookPlan(
  data: WorkbookData,
  options: LagOptions,
  choice: { readonly batch: boolean; readonly placedOn: string },
): PortablePlan {
  if (options.testKind === "squares") {
    throw new UsageError(
      "a portable report computes --test ljung-box, box-pierce or robust; the squares' test needs the add-in",
    );
  }
  const first = data.columns[0];
  if (!choice.batch && first !== undefined && "series" in first.analysis) {
    const { series } = first.analysis;
    return portablePlan(lagTable(series, options), series, sourceOf(data, first.column), {
      sheetName: "Portable report",
      placedOn: choice.placedOn,
      roomToGrow: true,
    });
  }
  const items: PortableBatchItem[] = data.columns.map(({ label, column, analysis }) => {
    const source = sourceOf(data, column);
    if ("reason" in analysis) return { label, source, analysis };
    try {
      return {
        label,
        source,
        analysis: { table: lagTable(analysis.series, options), ...analysis },
      };
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      return { label, source, analysis: { reason: error.message } };
    }
  });
  return portableBatchPlan(items, {
    summarySheet: "Portable batch",
    workSheet: "Portable work",
    placedOn: choice.placedOn,
    roomToGrow: true,
  });
}

export async function runWorkbook({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined) {
    throw new UsageError("workbook needs a CSV file: echolot workbook FILE.csv --out book.xlsx");
  }
  const out = textOption(values, "out");
  if (out === undefined || out.trim() === "") {
    throw new UsageError("workbook needs --out FILE.xlsx: where to write the workbook");
  }
  const batch = values.batch === true;
  if (batch && values.column !== undefined) {
    throw new UsageError("--batch reads every column of numbers; --column is for one");
  }
  const options = lagOptionsFromFlags(values);
  const data = await readWorkbookData(file, values, batch);
  const plan = workbookPlan(data, options, {
    batch,
    placedOn: new Date().toISOString().slice(0, 10),
  });

  // Loaded here, not at start-up: the other commands do not need the xlsx library.
  const { default: ExcelJS } = await import("exceljs");
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Echolot";
  const sheet = workbook.addWorksheet(DATA_SHEET);
  data.cells.forEach((row, r) =>
    row.forEach((value, c) => {
      if (value !== null) sheet.getCell(r + 1, c + 1).value = value as CellValue;
    }),
  );
  if (data.firstRow === 1) sheet.getRow(1).font = { bold: true };
  const charts = addPortableSheets(workbook, plan);
  writeOutFile(out, await portableWorkbookBytes(workbook, charts), values.force === true, [file]);
  const verdicts = [...plan.figures].filter(([k]) => k.endsWith("verdict") && !k.startsWith("b"));
  const summary = verdicts.map(([, v]) => v).join(", ");
  return `read: ${data.source}\nwrote ${out}: ${batch ? `${verdicts.length} columns` : "one column"}, portable verdict${verdicts.length === 1 ? "" : "s"} at writing: ${summary}`;
}

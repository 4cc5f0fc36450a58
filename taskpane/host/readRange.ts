/**
 * Reading a range's values from the workbook: only its used part (a whole-column selection reads
 * the rows that hold data, not a million blanks), in chunks of rows so no single request passes
 * the host's payload cap (5 MB; learn.microsoft.com, "Resource limits and performance
 * optimization for Office Add-ins", Excel add-ins), with progress reported after each chunk.
 *
 * `Range.values` gives an error cell as its error string ("#N/A"), the same as a text cell
 * holding those characters; `Range.valueTypes` tells them apart ("Error"). So both are read, and
 * an error cell becomes an error value `{ code: "#N/A" }`, which the core's intake takes as a gap
 * (#N/A) or refuses naming its cell (any other error), as it does for the cell functions.
 */
import { HostError, requestErrorCode, type ApiSupport, type ExcelRun } from "./excel";

/**
 * Cells per request: 100,000 numbers with their value types come to about 3 MB as the host
 * serialises them (about 20 bytes a number and 9 a type name), under its 5 MB cap.
 */
export const CHUNK_ROWS = 100_000;

/**
 * Above this many cells a cell function's input or result would pass the ~5 MB payload cap
 * (at roughly 25 bytes per number as the host serialises it: an estimate, not a documented
 * figure), so the pane says the live report's formulas may fail there.
 */
export const FUNCTION_PAYLOAD_CELLS = 200_000;

/** More cells than this are not read at all: the pane would hold them all in memory. */
export const MAX_READ_CELLS = 5_000_000;

export interface RangeRead {
  /** The address read, sheet-qualified as the host writes it ("Sheet1!B1:B71"). */
  readonly address: string;
  /** The address selected, which may be larger (a whole column). */
  readonly selected: string;
  readonly rows: number;
  readonly columns: number;
  /** Cell values; empty cells are "". Empty when the range holds no data at all. */
  readonly cells: unknown[][];
  /** Whether the range is larger than a cell function's payload can carry. */
  readonly tooLargeForFunctions: boolean;
  /** For a single cell: its formula as `Range.formulas` gives it (its value when it has none). */
  readonly formula?: unknown;
}

/** An error cell as the intake takes it (the shape the cell functions receive, too). */
export interface ErrorCell {
  readonly code: string;
}

export interface ReadOptions {
  readonly chunkRows?: number;
  /** Which ExcelApi sets the host supports; without it, only ExcelApi 1.8 calls are made. */
  readonly support?: ApiSupport;
  /** Called after each chunk with rows read so far and the total. */
  readonly onProgress?: (done: number, total: number) => void;
}

const SELECT_ONE_AREA =
  "select one column, row or block (hold Ctrl or Cmd only to pick cells in one area)";

/**
 * The selection, read as one range. `getSelectedRange` fails when the selection has several
 * areas (its doc comment in @types/office-js); where ExcelApi 1.9 is supported the areas are
 * counted first, so the pane can say what it saw; elsewhere the failure's code says it.
 */
export async function readSelectedRange(
  run: ExcelRun,
  options: ReadOptions = {},
): Promise<RangeRead> {
  if (options.support?.("1.9") === true) {
    const areas = await run(async (context) => {
      const selected = context.workbook.getSelectedRanges();
      selected.load(["areaCount", "address"]);
      await context.sync();
      return { count: selected.areaCount, address: selected.address };
    });
    if (areas.count > 1) {
      throw new HostError(
        `the selection has ${areas.count} separate areas (${areas.address}); ${SELECT_ONE_AREA}`,
      );
    }
  }
  try {
    return await run((context) => readRange(context, context.workbook.getSelectedRange(), options));
  } catch (error) {
    if (requestErrorCode(error) === "InvalidSelection") {
      throw new HostError(`the selection has several separate areas; ${SELECT_ONE_AREA}`);
    }
    throw error;
  }
}

export async function readRangeAt(
  run: ExcelRun,
  sheet: string,
  range: string,
  options: ReadOptions = {},
): Promise<RangeRead> {
  return run((context) =>
    readRange(context, context.workbook.worksheets.getItem(sheet).getRange(range), options),
  );
}

async function readRange(
  context: Excel.RequestContext,
  range: Excel.Range,
  options: ReadOptions,
): Promise<RangeRead> {
  const used = range.getIntersectionOrNullObject(range.worksheet.getUsedRangeOrNullObject(true));
  range.load("address");
  used.load(["address", "rowCount", "columnCount"]);
  await context.sync();
  if (used.isNullObject) {
    return {
      address: range.address,
      selected: range.address,
      rows: 0,
      columns: 0,
      cells: [],
      tooLargeForFunctions: false,
    };
  }
  const rows = used.rowCount;
  const columns = used.columnCount;
  if (rows * columns > MAX_READ_CELLS) {
    throw new HostError(
      `the selection holds ${rows.toLocaleString("en")} × ${columns} cells; select at most ${MAX_READ_CELLS.toLocaleString("en")} cells, or use the command-line tool on a CSV export`,
    );
  }
  const chunk = Math.max(1, Math.floor((options.chunkRows ?? CHUNK_ROWS) / Math.max(1, columns)));
  const cells: unknown[][] = [];
  const single = rows === 1 && columns === 1;
  let formula: unknown;
  for (let start = 0; start < rows; start += chunk) {
    const count = Math.min(chunk, rows - start);
    const part = used.getCell(start, 0).getResizedRange(count - 1, columns - 1);
    // A single cell may be a formula whose error the pane explains: its formula is read too.
    part.load(single ? ["values", "valueTypes", "formulas"] : ["values", "valueTypes"]);
    await context.sync();
    const types = part.valueTypes;
    part.values.forEach((row, i) => cells.push(withErrorCells(row, types[i] ?? [])));
    if (single) formula = part.formulas[0]?.[0];
    options.onProgress?.(start + count, rows);
  }
  return {
    address: used.address,
    selected: range.address,
    rows,
    columns,
    cells,
    tooLargeForFunctions: rows * columns > FUNCTION_PAYLOAD_CELLS,
    ...(single ? { formula } : {}),
  };
}

/** A row of `values` with each error cell (value type "Error") as an error value. */
export function withErrorCells(row: unknown[], types: readonly string[]): unknown[] {
  if (!types.includes("Error")) return row;
  return row.map((cell, j): unknown =>
    types[j] === "Error" ? ({ code: String(cell) } satisfies ErrorCell) : cell,
  );
}

/**
 * Reading a range's values from the workbook: only its used part (a whole-column selection reads
 * the rows that hold data, not a million blanks), in chunks of rows so no single request passes
 * the host's payload cap (about 5 MB), with progress reported after each chunk.
 */
import { HostError, type ExcelRun } from "./excel";

/** Rows per request: 100,000 one-column numbers stay well under the host's ~5 MB cap. */
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
}

export interface ReadOptions {
  readonly chunkRows?: number;
  /** Called after each chunk with rows read so far and the total. */
  readonly onProgress?: (done: number, total: number) => void;
}

export async function readSelectedRange(
  run: ExcelRun,
  options: ReadOptions = {},
): Promise<RangeRead> {
  return run((context) => readRange(context, context.workbook.getSelectedRange(), options));
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
  for (let start = 0; start < rows; start += chunk) {
    const count = Math.min(chunk, rows - start);
    const part = used.getCell(start, 0).getResizedRange(count - 1, columns - 1);
    part.load("values");
    await context.sync();
    for (const row of part.values) cells.push(row);
    options.onProgress?.(start + count, rows);
  }
  return {
    address: used.address,
    selected: range.address,
    rows,
    columns,
    cells,
    tooLargeForFunctions: rows * columns > FUNCTION_PAYLOAD_CELLS,
  };
}

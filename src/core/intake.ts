/**
 * Series intake: spreadsheet-shaped cells or plain lists → a `Series` (values, presence mask,
 * label, gap count), by one set of rules:
 *
 * - a blank (`undefined`, `null`, a string of only spaces) or a #N/A error is a gap;
 * - leading and trailing gaps are trimmed, interior gaps keep their positions;
 * - a text first cell is the series' label;
 * - any other text (including numbers typed as text), a boolean, any other error value, a
 *   non-finite number or any other object is refused, naming its position.
 * Nothing is silently dropped: dropping a value would shift every lag after it. O(n), one pass
 * over the cells, no copy of them.
 */
import { EcholotError, invalid, tooShort } from "./errors";
import { seriesName } from "./seriesName";
import type { Series } from "./types";

/** How a position is named in messages, from its 0-based index in the list given. */
export type PositionNamer = (index: number) => string;

export interface IntakeOptions {
  /** Label to use when the data carries none (a CSV header, say). */
  readonly label?: string;
  /** Names a position for messages; default "item N". */
  readonly describePosition?: PositionNamer;
  /** Whether a text first cell may be the label (default true). */
  readonly labelFromFirstCell?: boolean;
}

/** An error value as a host hands it over: an object whose `code` is "#N/A", "#VALUE!", … */
export function cellErrorCode(cell: unknown): string | undefined {
  if (typeof cell !== "object" || cell === null) return undefined;
  const code = (cell as { code?: unknown }).code;
  if (typeof code === "string" && code.startsWith("#")) return code;
  return dataTypeErrorCode(cell);
}

/**
 * The code of an error given as a data-type value, which a host passes when data types are on
 * (Excel.ErrorCellValue: `{ type: "Error", basicValue: "#N/A", errorType: "NotAvailable" }`;
 * learn.microsoft.com, "Use data types with custom functions in Excel").
 */
function dataTypeErrorCode(cell: object): string | undefined {
  const { type, basicValue } = cell as { type?: unknown; basicValue?: unknown };
  return type === "Error" && typeof basicValue === "string" && basicValue.startsWith("#")
    ? basicValue
    : undefined;
}

function isBlank(cell: unknown): boolean {
  return cell === undefined || cell === null || (typeof cell === "string" && cell.trim() === "");
}

function isGap(cell: unknown): boolean {
  return isBlank(cell) || cellErrorCode(cell) === "#N/A";
}

/**
 * Reads a spreadsheet range (rows of cells) that must be one row or one column.
 * Positions are named "row N of the range" for a column and "column N of the range" for a row.
 */
export function seriesFromCells(
  cells: readonly (readonly unknown[])[],
  options: Omit<IntakeOptions, "describePosition"> = {},
): Series {
  const rows = cells.length;
  let columns = 0;
  for (let r = 0; r < rows; r++)
    columns = Math.max(columns, (cells[r] as readonly unknown[]).length);
  if (rows > 1 && columns > 1) {
    invalid(
      `the series must be a single row or column; the range given is ${rows} rows × ${columns} columns`,
    );
  }
  if (rows === 1 && columns > 1) {
    return intakeCells(cells[0] as readonly unknown[], false, {
      ...options,
      describePosition: (i) => `column ${i + 1} of the range`,
    });
  }
  return intakeCells(cells, true, {
    ...options,
    describePosition: (i) => `row ${i + 1} of the range`,
  });
}

/**
 * Reads a plain list of cells or numbers by the intake rules above.
 *
 * @example
 * // A text first cell is the label; the blank inside stays as a gap; trailing blanks are trimmed.
 * const series = seriesFromValues(["resid", 1.5, "", 2, 4, ""]);
 * [series.label, series.count, series.gaps, series.values.length]; // → ["resid", 3, 1, 4]
 */
export function seriesFromValues(list: readonly unknown[], options: IntakeOptions = {}): Series {
  return intakeCells(list, false, options);
}

/** A gap-free series from numbers already known to be finite (tests, generators, the bench). */
export function seriesFromNumbers(numbers: ArrayLike<number>, label = ""): Series {
  return intakeCells(numbers, false, { label, labelFromFirstCell: false });
}

/** Cell i of a list, or the first cell of row i of a one-column range. */
function cellAt(source: ArrayLike<unknown>, fromColumn: boolean, i: number): unknown {
  return fromColumn ? (source[i] as readonly unknown[])[0] : source[i];
}

/**
 * The intake itself, in one pass over the cells without copying them: the label, the trim of
 * leading and trailing gaps (found first, so the arrays are allocated at their final length),
 * then each cell in order, so the first offending cell is the one named.
 */
function intakeCells(
  source: ArrayLike<unknown>,
  fromColumn: boolean,
  options: IntakeOptions,
): Series {
  const describe = options.describePosition ?? ((i: number) => `item ${i + 1}`);
  let label = options.label ?? "";
  let first = 0;
  const head = source.length > 0 ? cellAt(source, fromColumn, 0) : undefined;
  if (
    options.labelFromFirstCell !== false &&
    typeof head === "string" &&
    head.trim() !== "" &&
    cellErrorCode(head) === undefined
  ) {
    label = head.trim();
    first = 1;
  }
  let last = source.length;
  while (first < last && isGap(cellAt(source, fromColumn, first))) first++;
  while (last > first && isGap(cellAt(source, fromColumn, last - 1))) last--;
  if (first === last) {
    tooShort(`${seriesName(label)} has no values: give a range with numbers`);
  }

  const length = last - first;
  const values = new Float64Array(length);
  const present = new Uint8Array(length);
  let count = 0;
  for (let i = 0; i < length; i++) {
    const cell = cellAt(source, fromColumn, first + i);
    if (typeof cell === "number" && Number.isFinite(cell)) {
      values[i] = cell;
      present[i] = 1;
      count++;
    } else {
      values[i] = gapOrRefusal(cell, first + i, describe);
    }
  }
  return {
    values,
    present,
    label,
    count,
    gaps: length - count,
    start: first,
    cells: source.length,
  };
}

/** NaN for a gap cell; otherwise throws the refusal that names the cell's position. */
function gapOrRefusal(cell: unknown, index: number, describe: PositionNamer): number {
  if (isBlank(cell)) return NaN;
  const code = cellErrorCode(cell);
  if (code === "#N/A") return NaN;
  const where = describe(index);
  if (code !== undefined) {
    invalid(`${where} holds the error ${code}; fix that cell or make it blank or #N/A (a gap)`);
  }
  if (typeof cell === "number") {
    invalid(`${where} holds ${String(cell)}, which is not a finite number`);
  }
  if (typeof cell === "string") {
    const shown = cell.length > 24 ? `${cell.slice(0, 24)}…` : cell;
    const hint = Number.isFinite(Number(cell.trim()))
      ? "numbers stored as text are not read; convert the cell to a number"
      : "only numbers, blanks and #N/A (gaps) may follow the label";
    invalid(`${where} holds the text "${shown}"; ${hint}`);
  }
  if (typeof cell === "boolean") {
    invalid(`${where} holds ${cell ? "TRUE" : "FALSE"}; only numbers, blanks and #N/A are read`);
  }
  invalid(`${where} holds a value that is not a number; only numbers, blanks and #N/A are read`);
}

/**
 * A series from a column of numbers with NaN at its gaps (a table column as the table reader
 * keeps it): leading and trailing gaps trimmed, interior gaps in place. The values are a view of
 * the column, not a copy, so a long column costs one presence byte a value more.
 */
export function seriesFromColumn(values: Float64Array, label: string): Series {
  let first = 0;
  let last = values.length;
  while (first < last && Number.isNaN(values[first] as number)) first++;
  while (last > first && Number.isNaN(values[last - 1] as number)) last--;
  if (first === last) tooShort(`${seriesName(label)} has no values: give a column with numbers`);
  const kept = values.subarray(first, last);
  const present = new Uint8Array(kept.length);
  let count = 0;
  for (let i = 0; i < kept.length; i++) {
    if (!Number.isNaN(kept[i] as number)) {
      present[i] = 1;
      count++;
    }
  }
  return {
    values: kept,
    present,
    label,
    count,
    gaps: kept.length - count,
    start: first,
    cells: values.length,
  };
}

/** One column of a block: its series, or why it has none. */
export interface BlockColumn {
  readonly label: string;
  /** The column's series, or undefined when it could not be read. */
  readonly series: Series | undefined;
  /** Why the column could not be read (undefined when it was). */
  readonly refusal: EcholotError | undefined;
}

/**
 * A block's columns, each read by the intake rules (a text first cell is its label). A column that
 * cannot be read (empty, or holding text) keeps its place with the reason, so one bad column does
 * not take the others down with it. Rows may be ragged; the widest row sets the columns.
 */
export function blockColumns(rows: readonly (readonly unknown[])[]): BlockColumn[] {
  let width = 0;
  for (const row of rows) width = Math.max(width, row.length);
  const columns: BlockColumn[] = [];
  for (let c = 0; c < width; c++) {
    const cells = rows.map((r) => r[c]);
    const head = cells[0];
    const fallback = seriesName("", "cell", { column: c });
    try {
      const series = seriesFromValues(cells, {
        label: fallback,
        describePosition: (i) => `row ${i + 1}, column ${c + 1} of the block`,
      });
      columns.push({ label: series.label, series, refusal: undefined });
    } catch (error) {
      if (!(error instanceof EcholotError)) throw error;
      const label = typeof head === "string" && head.trim() !== "" ? head.trim() : fallback;
      columns.push({ label, series: undefined, refusal: error });
    }
  }
  return columns;
}

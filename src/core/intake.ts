/**
 * Series intake: spreadsheet-shaped cells or plain lists → a `Series` (values, presence mask,
 * label, gap count), by one set of rules:
 *
 * - a blank (`undefined`, `null`, a string of only spaces) or a #N/A error is a gap;
 * - leading and trailing gaps are trimmed, interior gaps keep their positions;
 * - a text first cell is the series' label;
 * - any other text (including numbers typed as text), a boolean, any other error value, a
 *   non-finite number or any other object is refused, naming its position.
 * Nothing is silently dropped: dropping a value would shift every lag after it. O(n).
 */
import { invalid, tooShort } from "./errors";
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
  return typeof code === "string" && code.startsWith("#") ? code : undefined;
}

function isBlank(cell: unknown): boolean {
  return cell === undefined || cell === null || (typeof cell === "string" && cell.trim() === "");
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
  const columns = rows === 0 ? 0 : Math.max(...cells.map((row) => row.length));
  if (rows > 1 && columns > 1) {
    invalid(
      `the series must be a single row or column; the range given is ${rows} rows × ${columns} columns`,
    );
  }
  const isRow = rows === 1 && columns > 1;
  const list: unknown[] = isRow ? [...(cells[0] ?? [])] : cells.map((row) => row[0]);
  const describePosition: PositionNamer = isRow
    ? (i) => `column ${i + 1} of the range`
    : (i) => `row ${i + 1} of the range`;
  return seriesFromValues(list, { ...options, describePosition });
}

/** Reads a plain list of cells or numbers by the intake rules above. */
export function seriesFromValues(list: readonly unknown[], options: IntakeOptions = {}): Series {
  const describe = options.describePosition ?? ((i: number) => `item ${i + 1}`);
  let label = options.label ?? "";
  let start = 0;
  const first = list[0];
  if (
    options.labelFromFirstCell !== false &&
    typeof first === "string" &&
    first.trim() !== "" &&
    cellErrorCode(first) === undefined
  ) {
    label = first.trim();
    start = 1;
  }

  const length = list.length - start;
  const values = new Float64Array(length);
  const present = new Uint8Array(length);
  for (let i = 0; i < length; i++) {
    const cell = list[i + start];
    const where = describe(i + start);
    if (isBlank(cell)) {
      values[i] = NaN;
      continue;
    }
    const code = cellErrorCode(cell);
    if (code !== undefined) {
      if (code === "#N/A") {
        values[i] = NaN;
        continue;
      }
      invalid(`${where} holds the error ${code}; fix that cell or make it blank or #N/A (a gap)`);
    }
    if (typeof cell === "number") {
      if (!Number.isFinite(cell)) {
        invalid(`${where} holds ${String(cell)}, which is not a finite number`);
      }
      values[i] = cell;
      present[i] = 1;
      continue;
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
  return trimmed(values, present, label);
}

function trimmed(values: Float64Array, present: Uint8Array, label: string): Series {
  let from = 0;
  let to = present.length;
  while (from < to && present[from] === 0) from++;
  while (to > from && present[to - 1] === 0) to--;
  if (from === to) {
    tooShort(`the series${label ? ` "${label}"` : ""} has no values: give a range with numbers`);
  }
  const keptPresent = present.slice(from, to);
  let count = 0;
  for (let t = 0; t < keptPresent.length; t++) count += keptPresent[t] as number;
  return {
    values: values.slice(from, to),
    present: keptPresent,
    label,
    count,
    gaps: keptPresent.length - count,
  };
}

/** A gap-free series from numbers already known to be finite (tests, generators, the bench). */
export function seriesFromNumbers(numbers: ArrayLike<number>, label = ""): Series {
  return seriesFromValues(Array.from(numbers), { label, labelFromFirstCell: false });
}

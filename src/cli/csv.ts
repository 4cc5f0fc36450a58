/**
 * CSV intake for the CLI: the first row holds headers; cells are read by the core's text-cell
 * rules (textCells.ts, shared with the standalone pane): an empty cell or NA (also N/A, #N/A) is
 * a gap; any other text is refused with its row and column named. The series rules themselves
 * (trimming, labels, gaps) are the core's intake.
 */
import { readFileSync } from "node:fs";
import { parse } from "csv-parse/sync";
import {
  invalid,
  isGapText,
  isNumberColumn,
  isNumberText,
  seriesFromValues,
  type Series,
} from "../core";
import { UsageError } from "./errors";

export interface CsvTable {
  readonly file: string;
  readonly headers: readonly string[];
  /** Data rows as text, without the header row. */
  readonly rows: readonly (readonly string[])[];
}

export function readCsv(file: string): CsvTable {
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch {
    throw new UsageError(`cannot read ${file}: check the path`);
  }
  let records: string[][];
  try {
    records = parse(text, { bom: true, trim: true, skip_empty_lines: true }) as string[][];
  } catch (error) {
    invalid(`${file} is not a well-formed CSV file: ${(error as Error).message}`);
  }
  const [headers, ...rows] = records;
  if (headers === undefined) invalid(`${file} is empty: the first row must hold the column names`);
  return { file, headers, rows };
}

/**
 * Whether a column holds a series: its first non-gap cell is a number. A column of dates or names
 * is skipped; a numeric column with a stray word further down is read, and the word refused with
 * its row and column, so nothing is silently dropped.
 */
function isNumericColumn(table: CsvTable, column: number): boolean {
  return isNumberColumn(table.rows.map((row) => row[column] ?? ""));
}

/** Resolves `--column NAME|N` (N counts from 1); without it, the first numeric column. */
export function pickColumn(table: CsvTable, choice: string | undefined): number {
  if (choice === undefined) {
    const found = table.headers.findIndex((_, i) => isNumericColumn(table, i));
    if (found < 0) invalid(`${table.file} has no column of numbers`);
    return found;
  }
  const byName = table.headers.indexOf(choice);
  if (byName >= 0) return byName;
  if (/^\d+$/.test(choice)) {
    const index = Number(choice) - 1;
    if (index >= 0 && index < table.headers.length) return index;
  }
  throw new UsageError(
    `--column ${choice} matches no column of ${table.file}: give a name (${table.headers.map((h) => `"${h}"`).join(", ")}) or a number from 1 to ${table.headers.length}`,
  );
}

/** Reads one column as a series; row numbers in messages count the header as row 1. */
export function columnSeries(table: CsvTable, column: number): Series {
  const header = table.headers[column] ?? `column ${column + 1}`;
  const where = (i: number) => `row ${i + 2}, column ${column + 1} ("${header}") of ${table.file}`;
  const cells = table.rows.map((row, i): number | null => {
    const cell = row[column] ?? "";
    if (isGapText(cell)) return null;
    if (!isNumberText(cell)) {
      invalid(
        `${where(i)} holds "${cell}", which is not a number; write a number, or leave it empty or NA for a gap`,
      );
    }
    return Number(cell);
  });
  return seriesFromValues(cells, {
    label: header,
    labelFromFirstCell: false,
    describePosition: where,
  });
}

/** Every numeric column of the table, as series (for batch and audit). */
export function numericColumns(table: CsvTable): Series[] {
  const series: Series[] = [];
  table.headers.forEach((_, i) => {
    if (isNumericColumn(table, i)) series.push(columnSeries(table, i));
  });
  if (series.length === 0) invalid(`${table.file} has no column of numbers`);
  return series;
}

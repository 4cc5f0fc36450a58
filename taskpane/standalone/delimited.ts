/**
 * Pasted cells and CSV text as series, for the standalone pane, by the same table reader as the
 * command line (src/core/table.ts): the delimiter (tab, semicolon or comma) and decimal mark are
 * found from the first lines, an empty line is a row of gaps, messages name the text's own line
 * numbers. A first row with text in it holds the column names. Columns that are not series (names,
 * dates, ids) are left aside and named; a column of numbers with a bad cell is refused at that
 * cell, never passed over. One line of values separated by spaces, or a single row of numbers, is
 * one series laid out as a row.
 */
import { parse } from "csv-parse/browser/esm/sync";
import {
  cellReader,
  columnPlace,
  columnSeries,
  csvParseOptions,
  delimiterName,
  detectDialect,
  extraLines,
  invalid,
  seriesColumnsOf,
  seriesFromValues,
  TableBuilder,
  type ColumnLook,
  type Dialect,
  type OptionWords,
  type Series,
} from "../../src/core";

/** How the reader's hints are worded in the pane, which has no reading options to point to. */
const PANE_WORDS: OptionWords = {
  percent: "convert the cells to plain numbers",
  gapWord: (word) => `replace "${word}" with an empty cell`,
  decimalComma: "use one decimal mark throughout",
  noHeader: "remove that row",
};

const LOOK_WORDS: Readonly<Record<ColumnLook, string>> = {
  series: "numbers",
  empty: "empty",
  text: "text",
  dates: "dates",
  yyyymmdd: "yyyymmdd dates",
  "serial dates": "date serials",
  counter: "an id or time column",
};

function records(text: string, origin: string): { rows: string[][]; dialect: Dialect } {
  const dialect = detectDialect(text, true);
  try {
    return { rows: parse(text, csvParseOptions(dialect)) as string[][], dialect };
  } catch (error) {
    invalid(
      `${origin} is not well-formed ${delimiterName(dialect.delimiter)}-separated text: ${(error as Error).message}`,
    );
  }
}

export interface TextSeries {
  readonly series: Series[];
  /** Columns left aside because they are not series, each with a word on why: "date (dates)". */
  readonly skipped: string[];
  /** How the text was read, for a note beside the result: delimiter, decimal mark, an example. */
  readonly reading: string;
}

/** "-0,272644" (a cell as written) and how it was read, for the note. */
function firstNumberCell(rows: readonly string[][], decimal: "." | ","): string {
  const reader = cellReader({ decimal });
  for (const row of rows) {
    for (const cell of row) {
      const value = reader.read(cell);
      if (value !== undefined && Number.isFinite(value) && /\d[.,]\d/.test(cell)) {
        return `: "${cell.trim()}" is ${value}`;
      }
    }
  }
  return "";
}

/** How the text was read: "one value a line, decimal comma: "-0,272644" is -0.272644". */
function readingNote(
  rows: readonly string[][],
  dialect: Dialect,
  columns: number,
  asRow: boolean,
): string {
  const layout = asRow
    ? "one row of values"
    : columns === 1
      ? "one value a line"
      : `${delimiterName(dialect.delimiter)}-separated columns`;
  const mark = dialect.decimal === "," ? "decimal comma" : "decimal point";
  return `Read as ${layout}, ${mark}${firstNumberCell(rows, dialect.decimal)}.`;
}

/** One line of several values separated by spaces or a delimiter: one series as a row. */
function rowSeries(
  cells: readonly string[],
  dialect: Dialect,
  origin: string,
  rows: readonly string[][],
): TextSeries | undefined {
  const decimal = dialect.decimal;
  const reader = cellReader({ decimal });
  if (cells.length < 2 || !cells.every((c) => reader.read(c) !== undefined)) return undefined;
  const values = cells.map((c) => {
    const value = reader.read(c) as number;
    return Number.isNaN(value) ? null : value;
  });
  return {
    series: [seriesFromValues(values, { describePosition: (i) => `value ${i + 1} of ${origin}` })],
    skipped: [],
    reading: readingNote(rows, dialect, 1, true),
  };
}

/** Reads every series column of the text; `origin` names the text in messages. */
export function seriesFromText(text: string, origin: string): TextSeries {
  if (text.trim() === "") invalid(`${origin} is empty: paste or open some numbers`);
  const { rows, dialect } = records(text, origin);
  const decimal = dialect.decimal;
  const nonEmpty = rows.filter((r) => r.some((c) => c.trim() !== ""));
  if (nonEmpty.length === 1) {
    const only = nonEmpty[0] as string[];
    const cells = only.length === 1 ? (only[0] as string).trim().split(/\s+/) : only;
    const row = rowSeries(cells, dialect, origin, [cells]);
    if (row !== undefined) return row;
  }

  const builder = new TableBuilder({
    origin,
    header: "auto",
    cells: { decimal },
    words: PANE_WORDS,
  });
  let line = 1;
  for (const record of rows) {
    builder.push(record, line);
    line += 1 + extraLines(record);
  }
  const table = builder.finish();
  const { series: columns, leftOut } = seriesColumnsOf(table);
  if (columns.length === 0) {
    const why = leftOut.map((l) => `${columnPlace(table, l.column)} ${l.reason}`).join("; ");
    invalid(`${origin} has no column of numbers${why === "" ? "" : `: ${why}`}`);
  }
  // The pane's line under the label is short: each column left aside with a word on why.
  const skipped = leftOut.map((l) => `${l.column.name} (${LOOK_WORDS[l.column.look]})`);
  return {
    series: columns.map((column) => columnSeries(table, column)),
    skipped,
    reading: readingNote(rows, dialect, table.columns.length, false),
  };
}

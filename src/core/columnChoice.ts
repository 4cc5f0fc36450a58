/**
 * Which columns of a table are series, said out loud. A column is left out only when it is not a
 * series at all — empty, names, dates, or whole numbers that read as an id or a time index
 * (steadily rising or falling, yyyymmdd dates, spreadsheet date serials) — and every column left
 * out is named with the reason. A column of numbers with a bad cell (a "nan", a "1.5%", a
 * "#DIV/0!") is a series with a bad cell: it is refused with that cell's line, never passed over
 * for the next column.
 */
import { invalid } from "./errors";
import { seriesFromColumn } from "./intake";
import { columnPlace, offenderMessage, type Table, type TableColumn } from "./table";
import type { Series } from "./types";

export interface LeftOut {
  readonly column: TableColumn;
  readonly reason: string;
}

function examples(column: TableColumn): string {
  const shown = column.examples.map((e) => (/^[\d.+-]/.test(e) ? e : `"${e}"`));
  return `${shown.join(", ")}${shown.length === 3 ? ", …" : ""}`;
}

/** Why a column is not a series, or undefined when it is one. */
export function notSeriesReason(column: TableColumn): string | undefined {
  switch (column.look) {
    case "series":
      return undefined;
    case "empty":
      return "has no values";
    case "text":
      return `holds text (${examples(column)}), not numbers`;
    case "dates":
      return `holds dates (${examples(column)}): a time column`;
    case "yyyymmdd":
      return `holds dates written as yyyymmdd (${examples(column)}): a time column`;
    case "serial dates":
      return `holds whole numbers that read as spreadsheet dates (${examples(column)}): a time column`;
    case "counter":
      return `holds whole numbers that only rise or only fall (${examples(column)}): an id or time column`;
  }
}

/** The columns that are series, and every other column with why it was left out. */
export function seriesColumnsOf(table: Table): {
  readonly series: readonly TableColumn[];
  readonly leftOut: readonly LeftOut[];
} {
  const series: TableColumn[] = [];
  const leftOut: LeftOut[] = [];
  for (const column of table.columns) {
    const reason = notSeriesReason(column);
    if (reason === undefined) series.push(column);
    else leftOut.push({ column, reason });
  }
  return { series, leftOut };
}

/** How the columns left out are listed: `"id" (holds …); "date" (holds …)`. */
export function leftOutText(table: Table, leftOut: readonly LeftOut[]): string {
  return leftOut.map((l) => `${columnPlace(table, l.column)} ${l.reason}`).join("; ");
}

/** The first column that is a series, with the columns before it that were left out. */
export function firstSeriesColumn(table: Table): {
  readonly column: TableColumn;
  readonly leftOut: readonly LeftOut[];
} {
  const leftOut: LeftOut[] = [];
  for (const column of table.columns) {
    const reason = notSeriesReason(column);
    if (reason === undefined) return { column, leftOut };
    leftOut.push({ column, reason });
  }
  invalid(
    `${table.origin} has no column of numbers${leftOut.length > 0 ? `: ${leftOutText(table, leftOut)}` : ""}`,
  );
}

/**
 * A column as a series, labelled by its name (none without a header row); its first bad cell,
 * if any, is refused with line, column and what to do.
 */
export function columnSeries(table: Table, column: TableColumn): Series {
  if (column.offender !== undefined) invalid(offenderMessage(table, column, column.offender));
  if (column.values === null) {
    throw new Error(`column ${column.index + 1} of ${table.origin} was not kept`);
  }
  return seriesFromColumn(column.values, table.hasHeader ? column.name : "");
}

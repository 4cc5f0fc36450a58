/**
 * From a file on the command line to the series a command analyses, with every choice said out
 * loud: the column analysed is named, and each column or id not analysed is listed with why.
 */
import {
  columnPlace,
  columnSeries,
  firstSeriesColumn,
  formatNameList,
  leftOutText,
  LongBuilder,
  seriesColumnsOf,
  calendarName,
  type LeftOut,
  type Series,
  type Table,
  type TableColumn,
} from "../core";
import { cellRulesOf, CLI_WORDS, readTable, streamRecords, type Reading } from "./csv";
import { UsageError } from "./errors";
import { textOption, type OptionValues } from "./options";

export interface OneSeries {
  readonly series: Series;
  readonly table: Table;
  readonly column: TableColumn;
  /** "column 3 ("resid") of data.csv; not analysed: column 1 ("id") holds …" */
  readonly source: string;
}

/** The column `--column NAME|N` names, or the first column that is a series. */
export async function readOneSeries(
  reading: Reading,
  choice: string | undefined,
): Promise<OneSeries> {
  const matches = (index: number, name: string) =>
    choice === undefined ||
    name === choice ||
    (/^\d+$/.test(choice) && Number(choice) === index + 1);
  const table = await readTable(reading, matches);
  let column: TableColumn | undefined;
  let leftOut: readonly LeftOut[] = [];
  if (choice === undefined) {
    ({ column, leftOut } = firstSeriesColumn(table));
  } else {
    column =
      table.columns.find((c) => table.hasHeader && c.name === choice) ??
      table.columns.find(
        (c) => c.values !== null && /^\d+$/.test(choice) && Number(choice) === c.index + 1,
      );
    if (column === undefined) {
      const names = table.hasHeader
        ? `a name (${formatNameList(table.columns.map((c) => c.name))}) or `
        : "";
      throw new UsageError(
        `--column ${choice} matches no column of ${reading.origin}: give ${names}a number from 1 to ${table.columns.length}`,
      );
    }
  }
  const series = columnSeries(table, column);
  const skipped = leftOut.length > 0 ? `; left out: ${leftOutText(table, leftOut)}` : "";
  return {
    series,
    table,
    column,
    source: `${columnPlace(table, column)} of ${reading.origin}${skipped}`,
  };
}

export interface ManySeries {
  readonly series: readonly Series[];
  /** The column of each series, in the same order (wide format only). */
  readonly columns?: readonly TableColumn[];
  /** Columns or ids not analysed, each with why. */
  readonly notAnalysed: readonly { readonly name: string; readonly reason: string }[];
  /** One line on what was read. */
  readonly source: string;
}

/** Whether the long-format options were given; all three or none. */
function longColumns(
  values: OptionValues,
): { id: string; time: string; value: string } | undefined {
  const id = textOption(values, "id");
  const time = textOption(values, "time");
  const value = textOption(values, "value");
  if (id === undefined && time === undefined && value === undefined) return undefined;
  if (id === undefined || time === undefined || value === undefined) {
    throw new UsageError("long format needs all three of --id COL --time COL --value COL");
  }
  return { id, time, value };
}

/** Every series of a file: one per column (wide), or one per id with --id/--time/--value (long). */
export async function readManySeries(reading: Reading, values: OptionValues): Promise<ManySeries> {
  const long = longColumns(values);
  if (long !== undefined) {
    if (!reading.header)
      throw new UsageError(
        "long format names its columns: it needs the header row, so --no-header does not apply",
      );
    let builder: LongBuilder | undefined;
    await streamRecords(reading, (dialect) => {
      builder = new LongBuilder({
        origin: reading.origin,
        columns: long,
        cells: cellRulesOf(reading, dialect),
        words: CLI_WORDS,
      });
      return (record, line) => (builder as LongBuilder).push(record, line);
    });
    const result = (builder as unknown as LongBuilder).finish();
    const { calendar, names } = result;
    const filled =
      calendar.filled === 0
        ? "no missing periods"
        : `${calendar.filled} missing period${calendar.filled === 1 ? "" : "s"} read as gaps`;
    return {
      series: result.series,
      notAnalysed: result.notAnalysed.map((n) => ({
        name: `${names.id} "${n.label}"`,
        reason: n.reason,
      })),
      source: `${reading.origin}: long format, ${result.rows} rows, ${result.series.length + result.notAnalysed.length} ids in "${names.id}", values "${names.value}", times "${names.time}" ${calendarName(calendar)} (${filled})`,
    };
  }
  const table = await readTable(reading);
  const { series: columns, leftOut } = seriesColumnsOf(table);
  const series: Series[] = [];
  const kept: TableColumn[] = [];
  const notAnalysed: { name: string; reason: string }[] = leftOut.map((l) => ({
    name: columnPlace(table, l.column),
    reason: l.reason,
  }));
  for (const column of columns) {
    try {
      series.push(columnSeries(table, column));
      kept.push(column);
    } catch (error) {
      if ((error as { name?: string }).name !== "EcholotError") throw error;
      notAnalysed.push({ name: columnPlace(table, column), reason: (error as Error).message });
    }
  }
  return {
    series,
    columns: kept,
    notAnalysed,
    source: `${reading.origin}: ${table.columns.length} column${table.columns.length === 1 ? "" : "s"}, ${series.length} analysed`,
  };
}

/** The lines listing what was not analysed, for the end of a text report. */
export function notAnalysedLines(many: ManySeries): string[] {
  return many.notAnalysed.map((n) => `not analysed: ${n.name}: ${n.reason}`);
}

/** `echolot check FILE.csv [options]`: the lag table and verdict of one column. */
import { lagTable } from "../core";
import { lagTableText } from "../report";
import { columnSeries, pickColumn, readCsv } from "./csv";
import { UsageError } from "./errors";
import { lagTableJson, toJsonText } from "./json";
import { lagOptionsFrom, parseCommand } from "./options";

export function runCheck(argv: readonly string[]): string {
  const { file, values } = parseCommand(argv);
  if (file === undefined) throw new UsageError("check needs a CSV file: echolot check FILE.csv");
  const options = lagOptionsFrom(values);
  const table = readCsv(file);
  const column = pickColumn(table, typeof values.column === "string" ? values.column : undefined);
  const result = lagTable(columnSeries(table, column), options);
  return values.json === true ? toJsonText(lagTableJson(result)) : lagTableText(result);
}

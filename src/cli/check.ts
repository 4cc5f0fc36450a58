/**
 * `echolot check FILE.csv [options]`: the lag table and verdict of one column, with the side
 * checks beside it — volatility (Engle's LM over the table's lags, McLeod–Li), bias (Newey–West),
 * runs about the median and Jarque–Bera. A side check the data cannot support (say, constant
 * squared deviations) is left out of the text and written as null in the JSON, with its reason.
 */
import { lagTable } from "../core";
import { jointSpanText, lagTableText } from "../report";
import { sideChecks, sideChecksText } from "../report/sideChecksText";
import { columnSeries, pickColumn, readCsv } from "./csv";
import { UsageError } from "./errors";
import { lagTableJson, sideChecksJson, toJsonText } from "./json";
import { lagOptionsFrom, parseCommand } from "./options";

export function runCheck(argv: readonly string[]): string {
  const { file, values } = parseCommand(argv);
  if (file === undefined) throw new UsageError("check needs a CSV file: echolot check FILE.csv");
  const options = lagOptionsFrom(values);
  const table = readCsv(file);
  const column = pickColumn(table, typeof values.column === "string" ? values.column : undefined);
  const series = columnSeries(table, column);
  const result = lagTable(series, options);
  const side = sideChecks(series, result);
  return values.json === true
    ? toJsonText({ ...lagTableJson(result), ...sideChecksJson(side) })
    : `${lagTableText(result)}\n\n${jointSpanText(result)}\n\n${sideChecksText(side)}`;
}

/**
 * `echolot check FILE.csv [options]`: the lag table and verdict of one column, with the side
 * checks beside it — volatility (Engle's LM over the table's lags, McLeod–Li), bias (Newey–West),
 * runs about the median and Jarque–Bera. A side check the data cannot support (say, constant
 * squared deviations) is left out of the text and written as null in the JSON, with its reason.
 */
import {
  biasCheck,
  isEcholotError,
  lagTable,
  normalityCheck,
  runsCheck,
  volatilityCheck,
  type LagTable,
  type Series,
} from "../core";
import { lagTableText } from "../report";
import { sideChecksText, type SideChecks } from "../report/sideChecksText";
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
    : `${lagTableText(result)}\n\n${sideChecksText(side)}`;
}

/** The outcome of one side check: its result, or why the data cannot support it. */
function attempt<T>(compute: () => T): T | string {
  try {
    return compute();
  } catch (error) {
    if (isEcholotError(error)) return error.message;
    throw error;
  }
}

function sideChecks(series: Series, table: LagTable): SideChecks {
  return {
    alpha: table.alpha,
    volatility: attempt(() => volatilityCheck(series, { lags: table.maxLag, alpha: table.alpha })),
    bias: attempt(() => biasCheck(series, { alpha: table.alpha })),
    runs: attempt(() => runsCheck(series)),
    normality: attempt(() => normalityCheck(series)),
  };
}

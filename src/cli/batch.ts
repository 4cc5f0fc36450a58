/** `echolot batch FILE.csv [options]`: the noise check of every numeric column, with BH q-values across them. */
import { batchCheck } from "../core";
import { batchText } from "../report/batchText";
import { numericColumns, readCsv } from "./csv";
import { UsageError } from "./errors";
import { batchJson, toJsonText } from "./json";
import { lagOptionsFrom, parseCommand } from "./options";

export function runBatch(argv: readonly string[]): string {
  const { file, values } = parseCommand(argv);
  if (file === undefined) throw new UsageError("batch needs a CSV file: echolot batch FILE.csv");
  if (values.column !== undefined) {
    throw new UsageError("batch reads every numeric column; --column is for check");
  }
  const options = lagOptionsFrom(values);
  const result = batchCheck(numericColumns(readCsv(file)), options);
  if (values.json === true) return toJsonText(batchJson(result));
  return batchText(result, {
    maxLag: options.maxLag ?? null,
    season: options.season ?? null,
    testKind: options.testKind ?? "ljung-box",
  });
}

/**
 * `echolot batch FILE [options]`: the noise check of every series — every numeric column, or
 * every id in long format (`--id COL --time COL --value COL`) — with Benjamini–Hochberg q-values
 * across them. Every column or id not analysed is listed with why.
 *
 * `--format jsonl` writes one line per series without the cross-series step, for batches split
 * across machines; `echolot fdr` merges such parts (fdr.ts).
 */
import { batchCheck, seriesResult } from "../core";
import { batchText } from "../report/batchText";
import { readingFrom } from "./csv";
import { UsageError } from "./errors";
import { notAnalysedLines, readManySeries } from "./input";
import { batchJson, toJsonText } from "./json";
import {
  formatOption,
  LAG_OPTIONS,
  lagOptionsFrom,
  LONG_OPTIONS,
  READ_OPTIONS,
  type ParsedCommand,
} from "./options";

export const BATCH_OPTIONS = [...LAG_OPTIONS, ...READ_OPTIONS, ...LONG_OPTIONS, "json", "format"];

export async function runBatch({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined)
    throw new UsageError(
      "batch needs a CSV file: echolot batch FILE.csv (or - for standard input)",
    );
  const format = formatOption(values, ["text", "json", "jsonl"]);
  const options = lagOptionsFrom(values);
  const many = await readManySeries(readingFrom(file, values), values);
  if (format === "jsonl") {
    const lines: string[] = [];
    many.series.forEach((series, i) =>
      lines.push(JSON.stringify(seriesResult(series, i, options))),
    );
    return lines.join("\n");
  }
  let result;
  try {
    result = batchCheck(many.series, options);
  } catch (error) {
    const left = many.notAnalysed.map((n) => `${n.name} ${n.reason}`).join("; ");
    if (left !== "" && error instanceof Error) error.message += ` (not analysed: ${left})`;
    throw error;
  }
  if (format === "json") {
    return toJsonText({ source: many.source, ...batchJson(result), notAnalysed: many.notAnalysed });
  }
  const text = batchText(result, {
    maxLag: options.maxLag ?? null,
    season: options.season ?? null,
    testKind: options.testKind ?? "ljung-box",
  });
  return [`read: ${many.source}`, "", text, ...notAnalysedLines(many)].join("\n");
}

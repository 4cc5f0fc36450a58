/**
 * `echolot batch FILE [options]`: the noise check of every series — every numeric column, or
 * every id in long format (`--id COL --time COL --value COL`) — with Benjamini–Hochberg q-values
 * across them. Every column or id not analysed is listed with why.
 *
 * `--format jsonl` writes one line per series without the cross-series step, for batches split
 * across machines; `echolot fdr` merges such parts (fdr.ts). The per-series stage runs in worker
 * threads (`--workers N`, default every core; parallel.ts) with the same results for any N.
 */
import { batchOfResults, parseTestKind, resolveAlpha } from "../core";
import { batchText } from "../report/batchText";
import { UsageError } from "./errors";
import { notAnalysedLines } from "./input";
import { batchJson, toJsonText } from "./json";
import {
  formatOption,
  LAG_OPTIONS,
  lagOptionsFrom,
  LONG_OPTIONS,
  READ_OPTIONS,
  type ParsedCommand,
} from "./options";
import { eachSeriesOf } from "./parallel";

export const BATCH_OPTIONS = [
  ...LAG_OPTIONS,
  ...READ_OPTIONS,
  ...LONG_OPTIONS,
  "json",
  "format",
  "workers",
];

export async function runBatch({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined)
    throw new UsageError(
      "batch needs a CSV file: echolot batch FILE.csv (or - for standard input)",
    );
  const format = formatOption(values, ["text", "json", "jsonl"]);
  const options = lagOptionsFrom(values);
  // Options every series shares are refused here, once, not in each worker.
  resolveAlpha(options.alpha);
  parseTestKind(options.testKind);
  // The per-series stage in worker threads; the cross-series step once, here, in series order.
  const { many, results } = await eachSeriesOf(
    file,
    values,
    { kind: "batch", options },
    "checking",
  );
  if (format === "jsonl") return results.map((r) => JSON.stringify(r)).join("\n");
  let result;
  try {
    result = batchOfResults(results);
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

/**
 * `echolot batch FILE [options]`: the noise check of every series — every numeric column, or
 * every id in long format (`--id COL --time COL --value COL`) — with Benjamini–Hochberg q-values
 * across them, ranked (the series to look at first on top). Every column or id not analysed is
 * listed with why. `--top N` and `--kept` choose rows, `--reasons` adds each one's reason, `--csv`
 * writes the ranked table as CSV, `--out FILE` writes to a file.
 *
 * `--format jsonl` writes one line per series without the cross-series step, for batches split
 * across machines; `echolot fdr` merges such parts (fdr.ts). The per-series stage runs in worker
 * threads (`--workers N`, default every core; parallel.ts) with the same results for any N.
 */
import { batchOfResults, parseTestKind, resolveAlpha } from "../core";
import { selectRanked, rankedBatchRows } from "../report/batchOrder";
import { batchText } from "../report/batchText";
import { batchCsv } from "../report/rankedCsv";
import { UsageError } from "./errors";
import { batchJson } from "./jsonBatch";
import {
  formatOption,
  LAG_OPTIONS,
  lagOptionsFromFlags,
  LONG_OPTIONS,
  RANKED_OPTIONS,
  READ_OPTIONS,
  selectionOption,
  type ParsedCommand,
} from "./options";
import { eachSeriesOf } from "./parallel";
import { deliver, deliverRanked } from "./rankedOutput";

export const BATCH_OPTIONS = [
  ...LAG_OPTIONS,
  ...LONG_OPTIONS,
  ...READ_OPTIONS,
  "json",
  "format",
  ...RANKED_OPTIONS,
  "workers",
];

export async function runBatch({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined)
    throw new UsageError(
      "batch needs a CSV file: echolot batch FILE.csv (or - for standard input)",
    );
  const format = formatOption(values, ["text", "json", "jsonl", "csv"]);
  const selection = selectionOption(values);
  if (format === "jsonl" && (selection.top !== null || selection.keptOnly)) {
    throw new UsageError(
      "--top and --kept rank after the false-discovery step, which --format jsonl leaves to echolot fdr: give them to fdr",
    );
  }
  const options = lagOptionsFromFlags(values);
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
  if (format === "jsonl") {
    const lines = results.map((r) => JSON.stringify(r));
    return deliver(lines.join("\n"), values, [file], {
      source: many.source,
      rows: lines.length,
      total: lines.length,
    });
  }
  let result;
  try {
    result = batchOfResults(results, options);
  } catch (error) {
    const left = many.notAnalysed.map((n) => `${n.name} ${n.reason}`).join("; ");
    if (left !== "" && error instanceof Error) error.message += ` (not analysed: ${left})`;
    throw error;
  }
  const rows = {
    shown: selectRanked(rankedBatchRows(result), selection).length,
    total: result.rows.length,
  };
  const batch = result;
  return deliverRanked(format, many, file, values, rows, {
    csv: () => batchCsv(batch, selection),
    json: () => batchJson(batch, selection),
    text: (leftOut) =>
      batchText(batch, {
        selection,
        reasons: values.reasons === true,
        leftOut,
      }),
  });
}

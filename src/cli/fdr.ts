/**
 * `echolot fdr [PART.jsonl …] [--json | --format text|json|jsonl]`: the last stage of a batch split
 * across machines. It merges the parts that `echolot batch --format jsonl` wrote (files, or
 * standard input when none or `-` is given) and applies Benjamini–Hochberg across all of them:
 * the same q-values and verdicts as one whole batch, whatever the split. Rows come out in the
 * batch's ranked order (q-value, ties by p, then id), so the order does not depend on the split
 * either; `--top`, `--kept`, `--csv` and `--out` work as for batch.
 */
import { createReadStream } from "node:fs";
import { createInterface } from "node:readline";
import { invalid, mergeSeriesResults, TEST_KINDS, type SeriesResult } from "../core";
import { batchText } from "../report/batchText";
import { UsageError } from "./errors";
import { rankedBatchRows, selectRanked } from "../report/batchOrder";
import { batchCsv } from "../report/rankedCsv";
import { toJsonText } from "./json";
import { batchJson } from "./jsonBatch";
import { formatOption, RANKED_OPTIONS, selectionOption, type ParsedCommand } from "./options";
import { deliver } from "./rankedOutput";

export const FDR_OPTIONS = ["json", "format", ...RANKED_OPTIONS];

const VERDICTS = new Set(["clear", "watch", "structure", "short"]);
const REFERENCES = new Set(["permutation", "chi-square", "monte-carlo"]);

function isNumberOrNull(x: unknown): boolean {
  return x === null || (typeof x === "number" && Number.isFinite(x));
}

/** One line of a part, checked field by field. */
function partLine(text: string, where: string): SeriesResult {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    invalid(`${where} is not a JSON line of echolot batch --format jsonl`);
  }
  const r = value as Record<string, unknown>;
  const ok =
    typeof r === "object" &&
    r !== null &&
    typeof r.id === "string" &&
    typeof r.n === "number" &&
    isNumberOrNull(r.statistic) &&
    isNumberOrNull(r.df) &&
    (r.p === null || (typeof r.p === "number" && r.p >= 0 && r.p <= 1)) &&
    (r.reference === null || REFERENCES.has(r.reference as string)) &&
    typeof r.draws === "number" &&
    typeof r.pBound === "boolean" &&
    (r.verdict === null || VERDICTS.has(r.verdict as string)) &&
    typeof r.reason === "string" &&
    typeof r.alpha === "number" &&
    TEST_KINDS.includes(r.test as never);
  if (!ok) {
    invalid(
      `${where} lacks a field of echolot batch --format jsonl (id, n, statistic, df, p, reference, draws, pBound, verdict, reason, alpha, test)`,
    );
  }
  return r as unknown as SeriesResult;
}

async function readPart(file: string, into: SeriesResult[]): Promise<void> {
  const origin = file === "-" ? "standard input" : file;
  const input = file === "-" ? process.stdin : createReadStream(file);
  const lines = createInterface({ input, crlfDelay: Infinity });
  let number = 0;
  try {
    for await (const line of lines) {
      number++;
      if (line.trim() === "") continue;
      into.push(partLine(line, `line ${number} of ${origin}`));
    }
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "ENOENT")
      throw new UsageError(`cannot read ${origin}: no such file; check the path`);
    if (code !== undefined)
      throw new UsageError(`cannot read ${origin}: ${(error as Error).message}`);
    throw error;
  }
}

export async function runFdr({ files, values }: ParsedCommand): Promise<string> {
  const format = formatOption(values, ["text", "json", "jsonl", "csv"]);
  const selection = selectionOption(values);
  if (files.length === 0 && process.stdin.isTTY === true) {
    throw new UsageError(
      "fdr needs the parts: echolot fdr PART.jsonl … (or - to read them from standard input)",
    );
  }
  const parts = files.length === 0 ? ["-"] : files;
  if (parts.filter((f) => f === "-").length > 1)
    throw new UsageError("standard input (-) can be read once");
  const results: SeriesResult[] = [];
  for (const part of parts) await readPart(part, results);
  const batch = mergeSeriesResults(results);
  const shown = selectRanked(rankedBatchRows(batch), selection);
  const said = { source: null, rows: shown.length, total: batch.rows.length };
  if (format === "json")
    return deliver(toJsonText(batchJson(batch, selection)), values, parts, said);
  if (format === "csv") return deliver(batchCsv(batch, selection), values, parts, said);
  if (format === "jsonl") {
    const lines = shown
      .map(({ item: row }) =>
        JSON.stringify({
          id: row.label,
          n: row.n,
          p: Number.isNaN(row.p) ? null : row.p,
          qValue: Number.isNaN(row.qValue) ? null : row.qValue,
          verdict: row.verdict,
          reason: row.reason,
        }),
      )
      .join("\n");
    return deliver(lines, values, parts, said);
  }
  const first = results[0] as SeriesResult;
  const text = batchText(batch, {
    maxLag: null,
    season: null,
    testKind: first.test,
    selection,
    reasons: values.reasons === true,
  });
  return deliver(text, values, parts, said);
}

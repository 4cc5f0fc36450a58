/**
 * `echolot fdr [PART.jsonl …] [--json | --format text|json|jsonl]`: the last stage of a batch split
 * across machines. It merges the parts that `echolot batch --format jsonl` wrote (files, or
 * standard input when none or `-` is given) and applies Benjamini–Hochberg across all of them:
 * the same q-values and verdicts as one whole batch, whatever the split. Rows come out in the
 * batch's ranked order (core/batchRanking.ts; ties by id), so the order does not depend on the
 * split either; `--top`, `--kept`, `--reasons`, `--csv` and `--out` work as for batch.
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
const READINGS = new Set(["plain", "robust"]);

/** null, or an object whose named fields are all finite numbers. */
function figuresOrNull(x: unknown, names: readonly string[]): boolean {
  if (x === null) return true;
  if (typeof x !== "object") return false;
  const o = x as Record<string, unknown>;
  return names.every((name) => typeof o[name] === "number" && Number.isFinite(o[name]));
}

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
    typeof r.finding === "string" &&
    typeof r.note === "string" &&
    (r.reading === null || READINGS.has(r.reading as string)) &&
    typeof r.switched === "boolean" &&
    (r.plainVerdict === null || VERDICTS.has(r.plainVerdict as string)) &&
    figuresOrNull(r.volatility, ["lm", "df", "p"]) &&
    figuresOrNull(r.bias, ["mean", "se", "t", "p"]) &&
    typeof r.alpha === "number" &&
    TEST_KINDS.includes(r.test as never);
  if (!ok) {
    invalid(
      `${where} lacks a field of echolot batch --format jsonl (id, n, statistic, df, p, reference, draws, pBound, verdict, reason, finding, note, reading, switched, plainVerdict, volatility, bias, alpha, test)`,
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
  const orNull = (x: number) => (Number.isNaN(x) ? null : x);
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
          p: orNull(row.p),
          qValue: orNull(row.qValue),
          kept: row.kept,
          biasP: orNull(row.biasP),
          biasQValue: orNull(row.biasQValue),
          word: row.headline?.word ?? null,
          title: row.headline?.title ?? null,
          finding: row.headline?.finding ?? row.reason,
        }),
      )
      .join("\n");
    return deliver(lines, values, parts, said);
  }
  const text = batchText(batch, {
    selection,
    reasons: values.reasons === true,
  });
  return deliver(text, values, parts, said);
}

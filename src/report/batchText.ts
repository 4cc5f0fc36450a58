/**
 * The batch check as a fixed-width text table for the terminal: one row per series, sorted by
 * the core's ranking (kept findings first, then watch, clear, short), then the count the raw p-values flag against the
 * count the false-discovery rate keeps, and the reasons of series that could not be analysed.
 */
import {
  formatLevel,
  formatNumber,
  rankedRows,
  TEST_NAMES,
  type BatchCheck,
  type TestKind,
} from "../core";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";
import { pCell, numberCell } from "./tableCells";

export interface BatchTextContext {
  readonly maxLag: number | null;
  readonly season: number | null;
  readonly testKind: TestKind;
}

export function batchText(batch: BatchCheck, context: BatchTextContext): string {
  const { alpha } = batch;
  const width = batch.rows.reduce((w, row) => Math.max(w, row.label.length), 6);
  const order = rankedRows(batch);
  const lines: string[] = [];
  lines.push(
    `batch: ${batch.rows.length} series; ${TEST_NAMES[context.testKind]} over ${context.maxLag === null ? "the default lags" : `${context.maxLag} lags`}${context.season === null ? "" : `, season ${context.season}`}; alpha ${alpha}; ranked: kept findings first`,
  );
  lines.push("");
  lines.push(
    `${"series".padEnd(width)}      n         Q   df         p   q-value  headline             flagged`,
  );
  for (const row of order) {
    const { headline } = row;
    const badge =
      headline === null ? "— not analysed" : `${BADGES[headline.word].shape} ${headline.title}`;
    const flags = [row.p < alpha ? "raw" : "", row.kept ? "kept" : ""]
      .filter((f) => f !== "")
      .join(" + ");
    lines.push(
      [
        row.label.padEnd(width),
        String(row.n).padStart(6),
        numberCell(row.q, 2, 9),
        String(row.df).padStart(4),
        pCell(row.p, 9),
        pCell(row.qValue, 9),
        ` ${badge.padEnd(20)}`,
        flags,
      ].join(" "),
    );
  }
  lines.push("");
  const expected = formatNumber(batch.analysed * alpha, 2);
  lines.push(
    `raw p < ${alpha}: ${batch.flaggedRaw} of ${batch.analysed} series flagged; about ${expected} would be by chance if every series were noise.`,
  );
  lines.push(
    `false-discovery rate ${alpha}: ${batch.flaggedFdr} kept (Benjamini–Hochberg q ≤ ${alpha}); among the kept, false flags are held to about ${formatLevel(alpha)} on average. Only kept series are called structure; a finding the step does not keep is at most watch.`,
  );
  lines.push(
    `bias: raw p < ${alpha} flags ${batch.biasFlaggedRaw}; the false-discovery step on bias keeps ${batch.biasFlaggedFdr} (marked "biased").`,
  );
  for (const row of order) {
    if (row.verdict === null) lines.push(`not analysed: ${row.label}: ${row.reason}`);
  }
  lines.push("");
  lines.push(SCREENING_CAUTION);
  return lines.map((line) => line.trimEnd()).join("\n");
}

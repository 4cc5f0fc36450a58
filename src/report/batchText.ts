/**
 * The batch check as fixed-width text for the terminal, within 80 columns: one row per series in
 * the core's ranked order (batchOrder.ts: the ones to look at first on top) with its lag-structure
 * p and q-value, its bias q-value and its headline (core/batchHeadline.ts), a line closing the
 * rows kept after the false-discovery step, the count the raw p-values flag against the counts
 * the false-discovery steps keep, the reasons of series that could not be analysed, and each
 * shown series' finding when asked (`reasons`). The joint test's statistic is in --json and
 * --csv (`statistic`).
 */
import { formatLevel, formatNumber, TEST_NAMES, type BatchCheck, type BatchRow } from "../core";
import { ALL_RANKED, rankedBatchRows, selectRanked, type RankedSelection } from "./batchOrder";
import { headlineCell, leftOutLines, rankedBodyLines } from "./rankedFooter";
import { groupHeader, lastColumnWidth, rankedTableText, type TextColumn } from "./rankedTable";
import { paddedP } from "./tableCells";
import { appendLines, wrapText } from "./textWrap";

/** How to show the batch; the options it was checked with are the batch's own (core/batch.ts). */
export interface BatchTextContext {
  /** Which ranked rows to show (all when absent). */
  readonly selection?: RankedSelection;
  /** Print each shown series' reason under the table. */
  readonly reasons?: boolean;
  /** Lines on columns or ids of the input that were not read as series. */
  readonly leftOut?: readonly string[];
}

function columns(batch: BatchCheck): TextColumn<BatchRow>[] {
  const nWidth = batch.rows.reduce((w, row) => Math.max(w, String(row.n).length), 4);
  const width = lastColumnWidth(
    batch.rows.map((row) => headlineCell(row.headline)),
    "headline",
  );
  return [
    { header: "n", width: nWidth, cell: (row) => String(row.n) },
    { header: "p", width: 8, cell: (row) => paddedP(row.p, 8) },
    { header: "q-value", width: 8, cell: (row) => paddedP(row.qValue, 8) },
    { header: "q-value", width: 8, cell: (row) => paddedP(row.biasQValue, 8) },
    {
      header: " headline",
      width,
      left: true,
      cell: (row) => ` ${headlineCell(row.headline)}`,
    },
  ];
}

export function batchText(batch: BatchCheck, context: BatchTextContext = {}): string {
  const { alpha } = batch;
  const selection = context.selection ?? ALL_RANKED;
  const all = rankedBatchRows(batch);
  const shown = selectRanked(all, selection);
  const lines: string[] = [];
  const lags = batch.maxLag === null ? "the default lags" : `${batch.maxLag} lags`;
  appendLines(
    lines,
    wrapText(
      `batch: ${batch.rows.length} series; ${TEST_NAMES[batch.testKind]} over ${lags}${batch.season === null ? "" : `, season ${batch.season}`}; alpha ${alpha}. Lag structure: p of the joint test and the largest lag as one test, and its q-value across the series; bias: the q-value of the mean's test. Ranked: kept findings first, then watch, clear, short; within each by q-value, ties by p, then file order.`,
    ),
  );
  lines.push("");
  const expected = formatNumber(batch.expectedRawFlags, 2);
  const nWidth = columns(batch)[0]?.width ?? 4;
  appendLines(
    lines,
    rankedBodyLines({
      ...{ alpha, all, shown, selection },
      table: rankedTableText(
        shown,
        (row) => row.label,
        columns(batch),
        groupHeader(nWidth, [
          ["lag structure", 17],
          ["bias", 8],
        ]),
      ),
      headerLines: 2,
      counts: [
        `raw p < ${alpha}: ${batch.flaggedRaw} of ${batch.analysed} series flagged; about ${expected} would be by chance if every series were noise.`,
        `false-discovery rate ${alpha}: ${batch.flaggedFdr} kept (Benjamini–Hochberg q-value ≤ ${alpha}); among the kept, false flags are held to about ${formatLevel(alpha)} on average. Only kept series are called structure; a finding the step does not keep is at most watch.`,
        `bias: raw p < ${alpha} flags ${batch.biasFlaggedRaw}; the false-discovery step on bias keeps ${batch.biasFlaggedFdr} (marked "biased").`,
      ],
      reasons: shown.map(({ rank, item }) => ({
        rank,
        label: item.label,
        headline: item.headline,
        reason: item.headline?.finding ?? item.reason,
      })),
      showReasons: context.reasons === true,
      includeClear: false,
      notAnalysed: leftOutLines(
        all,
        "not analysed",
        (row) => (row.verdict === null ? row : null),
        context.leftOut,
      ),
    }),
  );
  return lines.map((line) => line.trimEnd()).join("\n");
}

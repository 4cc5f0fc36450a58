/**
 * The batch check as fixed-width text for the terminal, within 80 columns: one row per series in
 * ranked order (batchOrder.ts: the ones to look at first on top), a line closing the rows kept
 * after the false-discovery step, the count the raw p-values flag against the count the
 * false-discovery rate keeps, the reasons of series that could not be analysed, and each shown
 * series' reason when asked (`reasons`).
 */
import {
  formatLevel,
  formatNumber,
  TEST_NAMES,
  type BatchCheck,
  type BatchRow,
  type TestKind,
} from "../core";
import { ALL_RANKED, rankedBatchRows, selectRanked, type RankedSelection } from "./batchOrder";
import { rankedBodyLines, verdictCell } from "./rankedFooter";
import { rankedTableText, type TextColumn } from "./rankedTable";
import { pCell, numberCell } from "./tableCells";
import { appendLines, wrapText } from "./textWrap";

export interface BatchTextContext {
  readonly maxLag: number | null;
  readonly season: number | null;
  readonly testKind: TestKind;
  /** Which ranked rows to show (all when absent). */
  readonly selection?: RankedSelection;
  /** Print each shown series' reason under the table. */
  readonly reasons?: boolean;
  /** Lines on columns or ids of the input that were not read as series. */
  readonly leftOut?: readonly string[];
}

function columns(batch: BatchCheck): TextColumn<BatchRow>[] {
  const { alpha } = batch;
  const nWidth = batch.rows.reduce((w, row) => Math.max(w, String(row.n).length), 4);
  return [
    { header: "n", width: nWidth, cell: (row) => String(row.n) },
    { header: "statistic", width: 9, cell: (row) => numberCell(row.q, 2, 9) },
    { header: "df", width: 3, cell: (row) => (Number.isNaN(row.df) ? "—" : String(row.df)) },
    { header: "p", width: 8, cell: (row) => pCell(row.p, 8) },
    { header: "q-value", width: 7, cell: (row) => pCell(row.qValue, 7) },
    { header: " verdict", width: 12, left: true, cell: (row) => ` ${verdictCell(row.verdict)}` },
    {
      header: "flagged",
      width: 7,
      left: true,
      cell: (row) =>
        [row.p < alpha ? "raw" : "", row.qValue <= alpha ? "FDR" : ""]
          .filter((f) => f !== "")
          .join("+"),
    },
  ];
}

export function batchText(batch: BatchCheck, context: BatchTextContext): string {
  const { alpha } = batch;
  const selection = context.selection ?? ALL_RANKED;
  const all = rankedBatchRows(batch);
  const shown = selectRanked(all, selection);
  const lines: string[] = [];
  const lags = context.maxLag === null ? "the default lags" : `${context.maxLag} lags`;
  appendLines(
    lines,
    wrapText(
      `batch: ${batch.rows.length} series; ${TEST_NAMES[context.testKind]} over ${lags}${context.season === null ? "" : `, season ${context.season}`}; alpha ${alpha}; ranked by q-value, ties by p, then file order; statistic is the joint test's Q`,
    ),
  );
  lines.push("");
  const expected = formatNumber(batch.analysed * alpha, 2);
  appendLines(
    lines,
    rankedBodyLines({
      alpha,
      all,
      shown,
      selection,
      table: rankedTableText(shown, (row) => row.label, columns(batch)),
      headerLines: 1,
      counts: [
        `raw p < ${alpha}: ${batch.flaggedRaw} of ${batch.analysed} series flagged; about ${expected} would be by chance if every series were noise.`,
        `false-discovery rate ${alpha}: ${batch.flaggedFdr} kept flagged (Benjamini–Hochberg q-value ≤ ${alpha}); among series flagged this way, false flags are held to about ${formatLevel(alpha)} on average (less strictly for short series, where Ljung–Box p-values run a little small in the far tail).`,
      ],
      reasons: shown.map(({ rank, item }) => ({
        rank,
        label: item.label,
        word: item.verdict,
        reason: item.reason,
      })),
      showReasons: context.reasons === true,
      includeClear: false,
      notAnalysed: [
        ...all
          .filter((r) => r.item.verdict === null)
          .map((r) => `not analysed: ${r.item.label}: ${r.item.reason}`),
        ...(context.leftOut ?? []),
      ],
    }),
  );
  return lines.map((line) => line.trimEnd()).join("\n");
}

/**
 * The forecast audit of many error series as fixed-width text for the terminal, within 80
 * columns: per series in the core's ranked order (batchOrder.ts) the bias (mean error and its
 * q-value across the series), the joint test of the lags from h on (its p and q-value) and the
 * headline (core/batchHeadline.ts rules); a line closing the rows kept after the false-discovery
 * step; the raw and false-discovery-rate counts for dependence and for bias; and, when asked
 * (`reasons`), each shown series' finding with the lags below the horizon that h-step errors are
 * expected to carry (shown, not counted).
 */
import { formatNumber, type AuditBatch, type AuditBatchItem, type ForecastAudit } from "../core";
import { ALL_RANKED, rankedAuditItems, selectRanked, type RankedSelection } from "./batchOrder";
import { headlineCell, leftOutLines, rankedBodyLines } from "./rankedFooter";
import { groupHeader, lastColumnWidth, rankedTableText, type TextColumn } from "./rankedTable";
import { paddedP } from "./tableCells";
import { appendLines, wrapText } from "./textWrap";

/** How to show the audit; its horizon, season and alpha are the batch's own (core/auditBatch.ts). */
export interface AuditTextContext {
  /** Which ranked rows to show (all when absent). */
  readonly selection?: RankedSelection;
  /** Print each shown series' reason under the table. */
  readonly reasons?: boolean;
  /** Lines on columns or ids of the input that were not read as series. */
  readonly leftOut?: readonly string[];
}

const audited =
  <T>(pick: (audit: ForecastAudit) => T) =>
  (item: AuditBatchItem) =>
    item.audit === null ? null : pick(item.audit);

function columns(batch: AuditBatch): TextColumn<AuditBatchItem>[] {
  const nWidth = batch.items.reduce(
    (w, item) => Math.max(w, String(item.audit?.n ?? "").length),
    4,
  );
  const n = audited((a) => String(a.n));
  const mean = audited((a) => formatNumber(a.bias.mean, 3));
  const dependenceP = audited((a) => paddedP(a.levels.jointP.p, 7));
  const width = lastColumnWidth(
    batch.items.map((item) => headlineCell(item.headline)),
    "headline",
  );
  return [
    { header: "n", width: nWidth, cell: (item) => n(item) ?? "—" },
    { header: "mean", width: 9, cell: (item) => mean(item) ?? "—" },
    { header: "q-value", width: 7, cell: (item) => paddedP(item.biasQValue, 7) },
    { header: "p", width: 7, cell: (item) => dependenceP(item) ?? "—" },
    { header: "q-value", width: 7, cell: (item) => paddedP(item.dependenceQValue, 7) },
    { header: " headline", width, left: true, cell: (item) => ` ${headlineCell(item.headline)}` },
  ];
}

/** The lags below the horizon, as a sentence for the reasons. */
function expectedLags(audit: ForecastAudit, horizon: number): string {
  if (horizon === 1) return "";
  const r = audit.rows.filter((row) => !row.counted).map((row) => formatNumber(row.correlation, 2));
  return ` Lags 1–${horizon - 1} are expected to be non-zero for ${horizon}-step errors and are not counted; their autocorrelations: ${r.join(", ")}.`;
}

export function auditText(batch: AuditBatch, context: AuditTextContext = {}): string {
  const { alpha, horizon, season, analysed } = batch;
  const selection = context.selection ?? ALL_RANKED;
  const all = rankedAuditItems(batch);
  const shown = selectRanked(all, selection);
  const audits = batch.items.flatMap((item) => (item.audit === null ? [] : [item.audit]));
  const lines: string[] = [];
  const lagsNote =
    horizon === 1
      ? "one-step errors: every lag counts"
      : `${horizon}-step errors: lags 1–${horizon - 1} are expected to be non-zero, so they are not counted (--reasons lists them)`;
  appendLines(
    lines,
    wrapText(
      `forecast audit: ${batch.items.length} series, horizon ${horizon}; ${lagsNote}; Bartlett bands; alpha ${alpha}${season === null ? "" : `; season ${season}`}. Ranked: kept findings first (by the smaller kept q-value), then watch, clear, short; within each by the dependence q-value, ties by p, then file order.`,
    ),
  );
  if (audits.length > 0) {
    const spread = (pick: (audit: ForecastAudit) => number) => {
      let lo = Infinity;
      let hi = -Infinity;
      for (const audit of audits) {
        lo = Math.min(lo, pick(audit));
        hi = Math.max(hi, pick(audit));
      }
      return lo === hi ? String(lo) : `${lo}–${hi}`;
    };
    const test = horizon === 1 ? "Ljung–Box" : `Ljung–Box adjusted for the ${horizon}-step horizon`;
    appendLines(
      lines,
      wrapText(
        `bias: mean error, corrected t with the long-run variance over lags 0–${horizon - 1}, against t with n − 1 df. dependence: joint test of lags ${horizon} to ${spread((a) => a.maxLag)} (${test}), p by Monte Carlo under the fitted MA(${horizon - 1}) null.`,
      ),
    );
  }
  lines.push("");
  const cols = columns(batch);
  const nWidth = cols[0]?.width ?? 4;
  appendLines(
    lines,
    rankedBodyLines({
      ...{ alpha, all, shown, selection },
      table: rankedTableText(
        shown,
        (item) => item.label,
        cols,
        groupHeader(nWidth, [
          ["bias", 17],
          ["dependence", 15],
        ]),
      ),
      headerLines: 2,
      counts: [
        `dependence: raw p < ${alpha} flags ${batch.flaggedRaw} of ${analysed}; false-discovery rate ${alpha} keeps ${batch.flaggedFdr} (about ${formatNumber(batch.expectedRawFlags, 2)} raw flags expected by chance if every forecast were sound).`,
        `bias: raw p < ${alpha} flags ${batch.biasFlaggedRaw} of ${analysed}; false-discovery rate ${alpha} keeps ${batch.biasFlaggedFdr} (marked "biased").`,
        `Only kept items are called structure or biased; a finding the false-discovery step does not keep is at most watch.`,
      ],
      reasons: shown.map(({ rank, item }) => ({
        rank,
        label: item.label,
        headline: item.headline,
        reason:
          item.audit === null || item.headline === null
            ? item.problem
            : `${item.headline.finding}${expectedLags(item.audit, horizon)}`,
      })),
      showReasons: context.reasons === true,
      // Beyond one step every audited row has lags to show: the expected ones below the horizon.
      includeClear: horizon > 1,
      notAnalysed: leftOutLines(
        all,
        "not audited",
        (item) => (item.audit === null ? { label: item.label, reason: item.problem } : null),
        context.leftOut,
      ),
    }),
  );
  return lines.map((line) => line.trimEnd()).join("\n");
}

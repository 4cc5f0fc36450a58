/**
 * A self-contained HTML report of one series: the label, n and gaps, the verdict badge, the
 * evidence chart in its three views, the joint-test ribbon, the explanation and the figures. No
 * script, no external resource (its CSP allows nothing but the inline style), so it can be
 * mailed, archived or opened offline.
 */
import { TEST_NAMES, type LagTable } from "../core";
import { escapeMarkup } from "./escape";
import { evidenceChartSvg } from "./evidenceChart";
import { explainVerdict, type ExplainContext, type Explanation } from "./explain";
import { badgeHtml, explanationHtml, figuresTableHtml } from "./htmlParts";
import { jointRibbonSvg } from "./jointRibbon";
import { VIEW_NAMES, type ChartView } from "./lagViews";
import { PALETTE } from "./palette";
import type { SeriesReport } from "./seriesReport";
import { element, textElement } from "./svg";

export interface ReportInput {
  /** The lag table of the series. */
  readonly table: LagTable;
  /** The lag table of its squared deviations (testKind "squares"), for the third view. */
  readonly squares?: LagTable;
  /** Extra findings (volatility, bias) for the explanation. */
  readonly context?: Omit<ExplainContext, "squares">;
  /** The explanation, when the caller already has it (seriesReport); else it is built here. */
  readonly explanation?: Explanation;
  /** Where the data came from, shown under the title (a file name, a range address). */
  readonly source?: string;
}

const WIDTH = 560;

const STYLE = `
body { font-family: system-ui, "Segoe UI", sans-serif; color: ${PALETTE.ink}; margin: 24px auto; max-width: ${WIDTH + 40}px; padding: 0 16px; line-height: 1.45; }
h1 { font-size: 1.25rem; margin: 0; }
h2 { font-size: 1rem; margin: 1.4em 0 0.4em; }
.meta { color: ${PALETTE.muted}; margin: 2px 0 10px; }
.badge { display: inline-flex; align-items: center; gap: 6px; font-weight: 600; font-size: 1.05rem; border: 1px solid #D7D2C8; border-radius: 4px; padding: 3px 10px 3px 8px; }
.explanation p { margin: 0.5em 0; }
table.figures { border-collapse: collapse; font-size: 0.8rem; margin: 6px 0 12px; font-variant-numeric: tabular-nums; }
table.figures caption { text-align: left; color: ${PALETTE.muted}; padding-bottom: 4px; }
table.figures th, table.figures td { padding: 2px 8px; text-align: right; border-bottom: 1px solid #ECE8E0; }
.zone-between { color: #8A5A00; }
.zone-beyond { color: #A64400; font-weight: 600; }
footer { color: ${PALETTE.muted}; font-size: 0.8rem; margin-top: 2em; }
`;

function viewSection(table: LagTable, view: ChartView): string {
  return element(
    "section",
    { class: `view view-${view}` },
    textElement("h2", {}, `Evidence: ${VIEW_NAMES[view]}`) +
      evidenceChartSvg(table, { view, width: WIDTH, height: 240, idPrefix: `report-${view}` }) +
      figuresTableHtml(table, view),
  );
}

export function reportHtml(input: ReportInput): string {
  const { table, squares } = input;
  const explanation =
    input.explanation ??
    explainVerdict(table, { ...input.context, ...(squares === undefined ? {} : { squares }) });
  const name = table.label === "" ? "Series" : table.label;
  const settings = [
    `${table.maxLag} lags`,
    `alpha ${table.alpha}`,
    `${table.bandKind} bands`,
    `joint test ${TEST_NAMES[table.testKind]}`,
    table.season === null ? "no season" : `season ${table.season}`,
    `${table.fittedParams} fitted parameters`,
  ].join(" · ");
  const body = [
    element(
      "header",
      {},
      textElement("h1", {}, name) +
        textElement(
          "p",
          { class: "meta" },
          `n = ${table.n} · ${table.gaps === 0 ? "no gaps" : `${table.gaps} gap${table.gaps === 1 ? "" : "s"}`}${input.source === undefined ? "" : ` · ${input.source}`}`,
        ) +
        badgeHtml(table.verdict.word) +
        textElement("p", { class: "meta" }, settings),
    ),
    viewSection(table, "correlation"),
    element(
      "section",
      { class: "ribbon" },
      textElement("h2", {}, "Joint test") +
        jointRibbonSvg(table, { width: WIDTH, idPrefix: "report-ribbon" }),
    ),
    element("section", {}, textElement("h2", {}, "What it means") + explanationHtml(explanation)),
    viewSection(table, "partial"),
    ...(squares === undefined ? [] : [viewSection(squares, "squares")]),
    textElement(
      "footer",
      {},
      "Echolot report. Computed on this machine; the file holds no script and loads nothing.",
    ),
  ].join("\n");
  return [
    "<!doctype html>",
    '<html lang="en">',
    "<head>",
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeMarkup(`Echolot report: ${name}`)}</title>`,
    `<style>${STYLE}</style>`,
    "</head>",
    "<body>",
    body,
    "</body>",
    "</html>",
    "",
  ].join("\n");
}

/** The HTML report of a series report (the pane's and the CLI's one call). */
export function seriesReportHtml(report: SeriesReport, source?: string): string {
  return reportHtml({
    table: report.table,
    ...(typeof report.squares === "string" ? {} : { squares: report.squares }),
    explanation: report.explanation,
    ...(source === undefined ? {} : { source }),
  });
}

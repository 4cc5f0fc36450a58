/**
 * Self-contained HTML reports: one series (`reportHtml`) or a block of series (`batchReportHtml`).
 * A report explains itself to someone who did not make it: its first line says what question it
 * answers; it carries the date, Echolot's version and the input's file name (never a folder
 * path); the diamonds have a legend and the ribbon a key; the side checks are there. No script,
 * no external resource (its CSP allows nothing but the inline style), so it can be mailed,
 * archived or opened offline. Charts are drawn at a fixed 320 px, so their text stays at 11 px
 * and the page fits a 350 px screen without sideways scrolling.
 */
import {
  formatP,
  rankedRows,
  seriesName,
  type BatchCheck,
  type BatchRow,
  type Headline,
  type LagTable,
} from "../core";
import { escapeMarkup } from "./escape";
import { evidenceChartSvg } from "./evidenceChart";
import { explainVerdict, type ExplainContext, type Explanation } from "./explain";
import {
  badgeHtml,
  batchTableHtml,
  explanationHtml,
  figuresTableHtml,
  jointSpanTableHtml,
  sideChecksHtml,
  zoneLegendHtml,
} from "./htmlParts";
import { jointRibbonSvg } from "./jointRibbon";
import { BAND_WORDS, jointTestName, VIEW_NAMES, type ChartView } from "./lagViews";
import { PALETTE } from "./palette";
import type { SeriesReport } from "./seriesReport";
import type { SideChecks } from "./sideChecks";
import { element, textElement } from "./svg";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";

/** Where and when a report was made: shown under its title. */
export interface ReportMeta {
  /** Where the data came from: a file name (no folders) and column, or a range address. */
  readonly source?: string;
  /** When the report was made. */
  readonly made?: Date;
  /** Echolot's version. */
  readonly version?: string;
}

export interface ReportInput extends ReportMeta {
  /** The lag table of the series. */
  readonly table: LagTable;
  /** The lag table of its squared deviations (testKind "squares"), for the third view. */
  readonly squares?: LagTable;
  /** Extra findings (volatility, bias) for the explanation. */
  readonly context?: Omit<ExplainContext, "squares">;
  /** The explanation, when the caller already has it (seriesReport); else it is built here. */
  readonly explanation?: Explanation;
  /** The side checks (volatility, bias, runs, normality). */
  readonly side?: SideChecks;
  /** The headline (core/headline.ts), when the caller has it: its title goes on the badge. */
  readonly headline?: Headline;
}

/** The width of every chart in a report: the pane's, so chart text stays at 11 px. */
const CHART_WIDTH = 320;

const STYLE = `
body { font-family: system-ui, "Segoe UI", sans-serif; color: ${PALETTE.ink}; margin: 16px auto; max-width: 720px; padding: 0 12px; line-height: 1.45; overflow-wrap: break-word; }
h1 { font-size: 1.25rem; margin: 0.2em 0 0; }
h2 { font-size: 1rem; margin: 1.4em 0 0.4em; }
.question { font-size: 1.05rem; margin: 0 0 0.6em; }
.meta { color: ${PALETTE.muted}; margin: 2px 0 8px; font-size: 0.9rem; }
.badge { display: inline-flex; align-items: center; gap: 6px; font-weight: 600; font-size: 1.05rem; border: 1px solid ${PALETTE.outerEdge}; border-radius: 4px; padding: 3px 10px 3px 8px; }
.legend { display: flex; flex-wrap: wrap; gap: 2px 14px; font-size: 0.8rem; margin: 4px 0 8px; }
.legend span { display: inline-flex; align-items: center; gap: 5px; }
svg { display: block; max-width: none; }
.explanation p { margin: 0.5em 0; }
table { border-collapse: collapse; font-size: 0.8rem; margin: 6px 0 12px; font-variant-numeric: tabular-nums; width: 100%; max-width: 560px; }
caption { text-align: left; color: ${PALETTE.muted}; padding-bottom: 4px; }
th, td { padding: 2px 3px; text-align: right; border-bottom: 1px solid #ECE8E0; vertical-align: top; }
td { white-space: nowrap; }
table.figures { font-size: 0.75rem; }
table.side-checks td.side-text { white-space: normal; }
table.batch tr.flagged th { box-shadow: inset 3px 0 0 ${PALETTE.structure}; }
table.side-checks th, table.side-checks td { text-align: left; }
table.batch th[scope="row"] { text-align: left; }
table.batch td[data-word] { white-space: normal; text-align: left; }
tr.chosen { font-weight: 600; }
.side-flag .side-word, .zone-beyond { color: #A64400; font-weight: 600; }
.zone-between { color: ${PALETTE.watch}; }
details { border-top: 1px solid #ECE8E0; padding: 6px 0; }
summary { cursor: pointer; }
footer { color: ${PALETTE.muted}; font-size: 0.8rem; margin-top: 2em; }
`;

const FOOTER =
  "Computed on the machine that made this report; the file holds no script and loads nothing.";

/** "2026-12-02 07:55 UTC": minutes are enough to tell two reports apart. */
export function reportDate(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** The line that says when, with what and from what the report was made. */
function madeLine(meta: ReportMeta): string {
  const parts = [
    ...(meta.made === undefined ? [] : [`Made ${reportDate(meta.made)}`]),
    `by Echolot${meta.version === undefined ? "" : ` ${meta.version}`}`,
    ...(meta.source === undefined ? [] : [`from ${meta.source}`]),
  ];
  return `${parts.join(" ")}.`;
}

function page(title: string, body: string): string {
  return [
    "<!doctype html>",
    '<html lang="en">',
    "<head>",
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeMarkup(title)}</title>`,
    `<style>${STYLE}</style>`,
    "</head>",
    "<body>",
    body,
    "</body>",
    "</html>",
    "",
  ].join("\n");
}

/** The settings a lag table was computed with, in one line. */
export function settingsLine(table: LagTable): string {
  return [
    `${table.maxLag} lags`,
    `alpha ${table.alpha}`,
    BAND_WORDS[table.bandKind],
    `joint test ${jointTestName(table)}`,
    table.season === null ? "no season" : `season ${table.season}`,
    `${table.fittedParams} fitted parameters`,
  ].join(" · ");
}

/** A chart with its diamond legend and the ribbon (with its key) of the same table. */
function evidenceBlock(table: LagTable, view: ChartView, prefix: string): string {
  const withRibbon = view !== "partial";
  return (
    evidenceChartSvg(table, { view, width: CHART_WIDTH, idPrefix: `${prefix}-${view}` }) +
    element("p", { class: "legend" }, zoneLegendHtml(table)) +
    (withRibbon
      ? jointRibbonSvg(table, { width: CHART_WIDTH, idPrefix: `${prefix}-ribbon-${view}` }) +
        element(
          "details",
          { class: "spans" },
          textElement("summary", {}, "The ribbon's figures: joint test by lag span") +
            jointSpanTableHtml(table),
        )
      : "")
  );
}

function viewSection(table: LagTable, view: ChartView, prefix: string): string {
  return element(
    "section",
    { class: `view view-${view}` },
    textElement("h2", {}, `Evidence: ${VIEW_NAMES[view]}`) +
      evidenceBlock(table, view, prefix) +
      figuresTableHtml(table, view),
  );
}

/** The question a one-series report answers, in one line. */
export function reportQuestion(table: LagTable): string {
  return `Is what is left in ${seriesName(table.label, "prose")} noise, or does it still carry a pattern from one period to the next (lags 1–${table.maxLag})?`;
}

function gapsWords(gaps: number): string {
  return gaps === 0 ? "no gaps" : `${gaps} gap${gaps === 1 ? "" : "s"}`;
}

export function reportHtml(input: ReportInput): string {
  const { table, squares } = input;
  const explanation =
    input.explanation ??
    explainVerdict(table, { ...input.context, ...(squares === undefined ? {} : { squares }) });
  const name = seriesName(table.label, "heading");
  const body = [
    element(
      "header",
      {},
      textElement("p", { class: "question" }, reportQuestion(table)) +
        textElement("h1", {}, name) +
        textElement("p", { class: "meta" }, `n = ${table.n} · ${gapsWords(table.gaps)}`) +
        badgeHtml(
          input.headline?.word ?? table.verdict.word,
          input.headline?.title ?? table.verdict.word,
        ) +
        textElement("p", { class: "meta" }, settingsLine(table)) +
        textElement("p", { class: "meta made" }, madeLine(input)),
    ),
    viewSection(table, "correlation", "report"),
    element("section", {}, textElement("h2", {}, "What it means") + explanationHtml(explanation)),
    ...(input.side === undefined
      ? []
      : [
          element("section", {}, textElement("h2", {}, "Side checks") + sideChecksHtml(input.side)),
        ]),
    viewSection(table, "partial", "report"),
    ...(squares === undefined ? [] : [viewSection(squares, "squares", "report")]),
    textElement("footer", {}, FOOTER),
  ].join("\n");
  return page(`Echolot report: ${name}`, body);
}

/** The HTML report of a series report (the pane's and the CLI's one call). */
export function seriesReportHtml(report: SeriesReport, meta: ReportMeta = {}): string {
  return reportHtml({
    ...meta,
    table: report.table,
    ...(typeof report.squares === "string" ? {} : { squares: report.squares }),
    explanation: report.explanation,
    side: report.side,
    headline: report.headline,
  });
}

/** One series of a batch, for its fold-out section: its report, or why it was not analysed. */
export type BatchItem = SeriesReport | { readonly label: string; readonly reason: string };

function itemSection(rank: number, item: BatchItem, index: number, row: BatchRow): string {
  if (!("table" in item)) {
    return element(
      "details",
      { class: "item" },
      textElement("summary", {}, `${rank}. ${item.label}: not analysed`) +
        textElement("p", {}, item.reason),
    );
  }
  const { table } = item;
  // The word across the batch (structure only when kept), as the ranked table shows it.
  const word = row.headline?.word ?? table.verdict.word;
  const title = row.headline?.title ?? word;
  const summary = `${rank}. ${row.label}: ${BADGES[word].shape} ${title}, p = ${formatP(row.p)}, q = ${formatP(row.qValue)}`;
  const prefix = `item${index + 1}`;
  return element(
    "details",
    { class: "item", "data-word": word },
    textElement("summary", {}, summary) +
      evidenceBlock(table, "correlation", prefix) +
      explanationHtml(item.explanation) +
      sideChecksHtml(item.side) +
      figuresTableHtml(table, "correlation"),
  );
}

/**
 * The report of a block of series: the ranked table first, then each series' chart, explanation
 * and side checks folded away under its rank (open one with a click or the keyboard).
 * `items[i]` belongs to `batch.rows[i]`.
 */
export function batchReportHtml(
  batch: BatchCheck,
  items: readonly BatchItem[],
  meta: ReportMeta & { readonly title: string; readonly settings: string },
): string {
  const ranked = rankedRows(batch);
  const indexOf = new Map(batch.rows.map((row, i) => [row, i]));
  const sections = ranked.map((row, rank) => {
    const index = indexOf.get(row) ?? 0;
    const item = items[index];
    if (item === undefined) throw new Error(`no report for batch row ${index + 1}`);
    return itemSection(rank + 1, item, index, row);
  });
  const body = [
    element(
      "header",
      {},
      textElement(
        "p",
        { class: "question" },
        `Which of these ${batch.rows.length} series still carry a pattern from one period to the next, and which should be looked at first?`,
      ) +
        textElement("h1", {}, meta.title) +
        textElement("p", { class: "meta" }, meta.settings) +
        textElement("p", { class: "meta made" }, madeLine(meta)),
    ),
    element(
      "section",
      {},
      textElement("h2", {}, "Ranked, most telling first") + batchTableHtml(batch),
    ),
    element(
      "section",
      { class: "items" },
      textElement("h2", {}, "Each series (open one to see its chart)") + sections.join("\n"),
    ),
    textElement("footer", {}, `${SCREENING_CAUTION} ${FOOTER}`),
  ].join("\n");
  return page(`Echolot batch report: ${meta.title}`, body);
}

/**
 * Puts an analysis on the page. Every piece of markup comes from src/report (escaped there);
 * this file only finds the page's elements and swaps their contents.
 */
import { seriesName } from "../../src/core";
import {
  chartDescription,
  evidenceChartSvg,
  explanationHtml,
  figuresTableHtml,
  jointRibbonSvg,
  badgeHtml,
  zoneLegendHtml,
  VIEW_NAMES,
  type ChartView,
  type SeriesReport,
} from "../../src/report";

export interface PaneElements {
  readonly main: HTMLElement;
  readonly status: HTMLElement;
  readonly progress: HTMLElement;
  readonly problem: HTMLElement;
  readonly result: HTMLElement;
  readonly label: HTMLElement;
  readonly meta: HTMLElement;
  readonly badge: HTMLElement;
  readonly sizeNote: HTMLElement;
  readonly tabs: readonly HTMLButtonElement[];
  readonly chartPanel: HTMLElement;
  readonly chart: HTMLElement;
  readonly chartDescription: HTMLElement;
  readonly legend: HTMLElement;
  readonly figures: HTMLElement;
  readonly ribbon: HTMLElement;
  readonly explanation: HTMLElement;
  readonly batchPanel: HTMLElement;
  readonly settingsPanel: HTMLElement;
  readonly exportRanked: HTMLButtonElement;
  readonly exportStatus: HTMLElement;
  readonly verdictStatus: HTMLElement;
  readonly auditLine: HTMLElement;
  readonly readingNote: HTMLElement;
  readonly batch: HTMLElement;
  readonly columnPick: HTMLSelectElement;
  readonly settings: HTMLFormElement;
  readonly settingsProblem: HTMLElement;
  readonly horizon: HTMLInputElement;
  readonly placeLive: HTMLButtonElement;
  readonly placeSnapshot: HTMLButtonElement;
  readonly copySummary: HTMLButtonElement;
  readonly saveReport: HTMLButtonElement;
  readonly actionStatus: HTMLElement;
  readonly copyBuffer: HTMLTextAreaElement;
}

function byId<T extends HTMLElement>(doc: Document, id: string): T {
  const found = doc.getElementById(id);
  if (found === null) throw new Error(`the pane page has no #${id}`);
  return found as T;
}

export function findElements(doc: Document): PaneElements {
  return {
    main: byId(doc, "pane"),
    status: byId(doc, "pane-status"),
    progress: byId(doc, "progress"),
    problem: byId(doc, "problem"),
    result: byId(doc, "result"),
    label: byId(doc, "series-label"),
    meta: byId(doc, "series-meta"),
    badge: byId(doc, "verdict-badge"),
    sizeNote: byId(doc, "size-note"),
    tabs: Array.from(doc.querySelectorAll<HTMLButtonElement>('#view-tabs [role="tab"]')),
    chartPanel: byId(doc, "chart-panel"),
    chart: byId(doc, "chart"),
    chartDescription: byId(doc, "chart-description"),
    legend: byId(doc, "chart-legend"),
    figures: byId(doc, "figures"),
    ribbon: byId(doc, "ribbon"),
    explanation: byId(doc, "explanation"),
    batchPanel: byId(doc, "batch-panel"),
    settingsPanel: byId(doc, "settings-panel"),
    exportRanked: byId(doc, "export-ranked"),
    exportStatus: byId(doc, "export-status"),
    verdictStatus: byId(doc, "verdict-status"),
    auditLine: byId(doc, "audit-line"),
    readingNote: byId(doc, "reading-note"),
    batch: byId(doc, "batch"),
    columnPick: byId(doc, "column-pick"),
    settings: byId(doc, "settings"),
    settingsProblem: byId(doc, "settings-problem"),
    horizon: byId(doc, "set-horizon"),
    placeLive: byId(doc, "place-live"),
    placeSnapshot: byId(doc, "place-snapshot"),
    copySummary: byId(doc, "copy-summary"),
    saveReport: byId(doc, "save-report"),
    actionStatus: byId(doc, "action-status"),
    copyBuffer: byId(doc, "copy-buffer"),
  };
}

/** The chart's width: the panel's, within what a narrow pane and the chart's text allow. */
export function chartWidth(el: PaneElements): number {
  const available = el.chartPanel.clientWidth;
  return Math.round(Math.min(480, Math.max(260, available > 0 ? available : 320)));
}

export function showMessage(target: HTMLElement, message: string | null): void {
  target.textContent = message ?? "";
  target.hidden = message === null;
}

function gapsText(analysis: SeriesReport): string {
  const { table } = analysis;
  const gaps = table.gaps === 0 ? "no gaps" : `${table.gaps} gap${table.gaps === 1 ? "" : "s"}`;
  return `n = ${table.n} · ${gaps}`;
}

export function renderAnalysis(
  el: PaneElements,
  analysis: SeriesReport,
  view: ChartView,
  source: string,
): void {
  const { table } = analysis;
  el.result.hidden = false;
  el.label.textContent = seriesName(table.label, "heading");
  el.meta.textContent = `${gapsText(analysis)} · ${source}`;
  el.badge.innerHTML = badgeHtml(analysis.headline.word, analysis.headline.title);
  el.explanation.innerHTML = explanationHtml(analysis.explanation);
  renderView(el, analysis, view);
}

/** The chart, its description, its key and its figures table for one tab. */
export function renderView(el: PaneElements, analysis: SeriesReport, view: ChartView): void {
  for (const tab of el.tabs) {
    const selected = tab.dataset.view === view;
    tab.setAttribute("aria-selected", String(selected));
    tab.tabIndex = selected ? 0 : -1;
    if (selected) el.chartPanel.setAttribute("aria-labelledby", tab.id);
  }
  const table = view === "squares" ? analysis.squares : analysis.table;
  if (typeof table === "string") {
    el.chart.textContent = `No ${VIEW_NAMES[view]} view: ${table}.`;
    el.chartDescription.textContent = el.chart.textContent;
    el.legend.innerHTML = "";
    el.figures.innerHTML = "";
    el.ribbon.innerHTML = "";
    return;
  }
  const width = chartWidth(el);
  // The ribbon follows the tab: the squared deviations' tab shows their own joint test.
  el.ribbon.innerHTML = jointRibbonSvg(table, { width, idPrefix: "pane-ribbon" });
  el.chart.innerHTML = evidenceChartSvg(table, { view, width, idPrefix: `pane-${view}` });
  el.chartDescription.textContent = chartDescription(table, view);
  el.legend.innerHTML = zoneLegendHtml(table);
  el.figures.innerHTML = figuresTableHtml(table, view);
}

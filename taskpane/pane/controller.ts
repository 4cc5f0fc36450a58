/**
 * The pane's state and its page, whatever the data's origin (a workbook range, pasted text, a CSV
 * file, a demo): the data shown, the settings, the chosen tab. Any change recomputes through the
 * core and redraws through src/report. Workbook actions are wired by the host glue on top.
 */
import { batchCheck, isEcholotError, type LagOptions, type Series } from "../../src/core";
import {
  batchTableHtml,
  seriesReport,
  seriesReportHtml,
  summaryText,
  type ChartView,
  type SeriesReport,
} from "../../src/report";
import { copyText } from "./clipboard";
import { lagOptionsFrom, readSettingsForm, writeSettingsForm } from "./settings";
import { wireTabs } from "./tabs";
import { renderAnalysis, renderView, showMessage, type PaneElements } from "./view";

export interface PaneInput {
  /** One series, or several (a block of columns) shown one at a time beside the batch view. */
  readonly series: readonly Series[];
  /** Where the data came from, in words ("Sheet1!B1:B71", "pasted values"). */
  readonly source: string;
  /** The absolute reference a live report's formulas use (workbook only), one per series. */
  readonly references?: readonly string[];
  /** The range is beyond what a cell function's payload carries. */
  readonly tooLargeForFunctions?: boolean;
}

export interface Shown {
  readonly input: PaneInput;
  readonly index: number;
  readonly analysis: SeriesReport;
}

export class PaneController {
  private input: PaneInput | null = null;
  private index = 0;
  private analysis: SeriesReport | null = null;
  private view: ChartView = "correlation";
  private settingsTimer: ReturnType<typeof setTimeout> | undefined;
  /** Called after every successful redraw (the host glue enables its buttons). */
  onShown: (shown: Shown | null) => void = () => {};

  constructor(private readonly el: PaneElements) {
    el.main.setAttribute("aria-busy", "false");
    wireTabs(el.tabs, (view) => this.choose(view));
    el.settings.addEventListener("input", () => this.settingsChanged(300));
    el.settings.addEventListener("change", () => this.settingsChanged(0));
    el.settings.addEventListener("submit", (event) => event.preventDefault());
    el.columnPick.addEventListener("change", () => {
      this.index = Number(el.columnPick.value);
      this.recompute();
    });
    el.copySummary.addEventListener("click", () => void this.copySummary());
    el.saveReport.addEventListener("click", () => this.saveReport());
    let resizeTimer: ReturnType<typeof setTimeout> | undefined;
    window.addEventListener("resize", () => {
      clearTimeout(resizeTimer);
      resizeTimer = setTimeout(() => this.redraw(), 150);
    });
  }

  get shown(): Shown | null {
    if (this.input === null || this.analysis === null) return null;
    return { input: this.input, index: this.index, analysis: this.analysis };
  }

  /** Shows new data; `suggested` settings (a demo scenario's) replace the form's. */
  show(input: PaneInput, suggested?: LagOptions): void {
    if (suggested !== undefined) writeSettingsForm(this.el.settings, suggested);
    const sameShape =
      this.input !== null &&
      this.input.series.length === input.series.length &&
      this.input.series.every((s, i) => s.label === input.series[i]?.label);
    this.input = input;
    if (!sameShape) this.index = 0;
    this.fillColumnPick(input);
    this.recompute();
  }

  /** The data could not be read at all: say what to fix, show nothing stale. */
  showDataProblem(message: string): void {
    this.input = null;
    this.analysis = null;
    this.el.result.hidden = true;
    showMessage(this.el.problem, message);
    this.onShown(null);
  }

  recompute(): void {
    const input = this.input;
    if (input === null) return;
    showMessage(this.el.problem, null);
    let options: LagOptions;
    try {
      options = lagOptionsFrom(readSettingsForm(this.el.settings));
      const series = input.series[this.index] ?? input.series[0];
      if (series === undefined) throw new Error("no series to show");
      this.analysis = seriesReport(series, options);
      showMessage(this.el.settingsProblem, null);
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      this.analysis = null;
      this.el.result.hidden = true;
      // A refused option belongs beside the settings; refused data beside the data.
      const target = /^(maxLag|season|fittedParams|alpha|bandKind|testKind)\b/.test(error.message)
        ? this.el.settingsProblem
        : this.el.problem;
      showMessage(target, capitalise(error.message));
      this.onShown(null);
      return;
    }
    this.renderBatch(input, options);
    this.redraw();
  }

  private redraw(): void {
    const input = this.input;
    const analysis = this.analysis;
    if (input === null || analysis === null) return;
    renderAnalysis(this.el, analysis, this.view, this.sourceText(input));
    const tooLarge = input.tooLargeForFunctions === true;
    showMessage(
      this.el.sizeNote,
      tooLarge
        ? "This range is larger than a cell function's payload (about 5 MB) can carry: the pane and a snapshot work, live formulas would fail. For more, use the command-line tool on a CSV export."
        : null,
    );
    this.onShown(this.shown);
  }

  private sourceText(input: PaneInput): string {
    return input.series.length > 1
      ? `${input.source}, column ${this.index + 1} of ${input.series.length}`
      : input.source;
  }

  private choose(view: ChartView): void {
    this.view = view;
    if (this.analysis !== null) renderView(this.el, this.analysis, view);
  }

  private settingsChanged(delay: number): void {
    clearTimeout(this.settingsTimer);
    this.settingsTimer = setTimeout(() => this.recompute(), delay);
  }

  private fillColumnPick(input: PaneInput): void {
    const pick = this.el.columnPick;
    pick.replaceChildren(
      ...input.series.map((s, i) => {
        const option = document.createElement("option");
        option.value = String(i);
        option.textContent = s.label === "" ? `column ${i + 1}` : s.label;
        return option;
      }),
    );
    pick.value = String(this.index);
  }

  private renderBatch(input: PaneInput, options: LagOptions): void {
    const several = input.series.length > 1;
    this.el.batchPanel.hidden = !several;
    if (!several) {
      this.el.batch.innerHTML = "";
      return;
    }
    try {
      this.el.batch.innerHTML = batchTableHtml(batchCheck(input.series, options));
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      this.el.batch.textContent = capitalise(error.message);
    }
  }

  private async copySummary(): Promise<void> {
    const analysis = this.analysis;
    if (analysis === null) {
      showMessage(this.el.actionStatus, "Nothing to copy yet: choose some data first.");
      return;
    }
    const copied = await copyText(
      summaryText(analysis.table, analysis.headline),
      this.el.copyBuffer,
    );
    showMessage(
      this.el.actionStatus,
      copied
        ? "Summary copied."
        : "The host refused the clipboard; select the explanation and copy it by hand.",
    );
  }

  private saveReport(): void {
    const shown = this.shown;
    if (shown === null) return;
    const { table } = shown.analysis;
    const source = this.sourceText(shown.input);
    const html = seriesReportHtml(shown.analysis, { source, made: new Date() });
    const link = document.createElement("a");
    link.href = URL.createObjectURL(new Blob([html], { type: "text/html" }));
    link.download = `echolot-${(table.label || "series").replace(/[^A-Za-z0-9_-]+/g, "-")}.html`;
    link.click();
    setTimeout(() => URL.revokeObjectURL(link.href), 10_000);
    showMessage(this.el.actionStatus, `Saved ${link.download}.`);
  }
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

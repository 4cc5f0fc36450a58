/**
 * The pane's state and its page, whatever the data's origin (a workbook range, pasted text, a CSV
 * file, a demo): the data shown, the settings, the chosen tab. Any change recomputes through the
 * core and redraws through src/report. Workbook actions are wired by the host glue on top.
 */
import {
  auditBatch,
  batchCheck,
  isEcholotError,
  seriesName,
  type AuditBatch,
  type EcholotError,
  type LagOptions,
  type Series,
  type VerdictWord,
} from "../../src/core";
import {
  rankedAudit,
  rankedBatch,
  rankedListCsv,
  seriesReport,
  seriesReportHtml,
  summaryText,
  badgeHtml,
  keptWords,
  verdictCellText,
  type ChartView,
  type RankedItem,
  type RankedList,
  type SeriesReport,
} from "../../src/report";
import { copyText } from "./clipboard";
import { downloadText, fileNamePart } from "./download";
import { RankedTable } from "./rankedTable";
import {
  auditHorizonFrom,
  lagOptionsFromSettings,
  readSettingsForm,
  writeSettingsForm,
  type SettingsText,
} from "./settings";
import { inLabelWords, markInvalid, refusedSetting } from "./settingsProblem";
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
  /** How pasted or opened text was read (delimiter, decimal mark), shown under the label. */
  readonly reading?: string;
}

/** The ranked list of the data shown, kept while the data and the settings stay the same. */
interface Ranking {
  readonly input: PaneInput;
  readonly settings: string;
  readonly list: RankedList;
  /** The audit behind the list, in audit mode. */
  readonly audit: AuditBatch | null;
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
  private announceTimer: ReturnType<typeof setTimeout> | undefined;
  private ranking: Ranking | null = null;
  private renderedList: RankedList | null = null;
  /** The data the result on screen was computed from. */
  private shownInput: PaneInput | null = null;
  /** New data: show the top-ranked item once the ranking is known. */
  private pickTop = false;
  private readonly table: RankedTable;
  /** Called after every successful redraw (the host glue enables its buttons). */
  onShown: (shown: Shown | null) => void = () => {};
  /**
   * Writes the ranked list and says where it went. Standalone: a CSV download, as a web page
   * saves a file; the host glue replaces this with a new sheet in the workbook.
   */
  exportRanked: (list: RankedList, source: string) => Promise<string> = (list, source) => {
    const name = `echolot-ranked-${fileNamePart(source, "items")}.csv`;
    downloadText(rankedListCsv(list), name, "text/csv");
    return Promise.resolve(`Saved ${name}: ${list.items.length} items, most telling first.`);
  };

  constructor(private readonly el: PaneElements) {
    this.table = new RankedTable(el.batch, (index) => this.showItem(index));
    el.main.setAttribute("aria-busy", "false");
    wireTabs(el.tabs, (view) => this.choose(view));
    el.settings.addEventListener("input", () => this.settingsChanged(300));
    el.settings.addEventListener("change", () => this.settingsChanged(0));
    el.settings.addEventListener("submit", (event) => event.preventDefault());
    el.columnPick.addEventListener("change", () => this.showItem(Number(el.columnPick.value)));
    el.exportRanked.addEventListener("click", () => void this.exportList());
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
    this.ranking = null;
    if (!sameShape) {
      this.index = 0;
      this.pickTop = true;
    }
    this.recompute();
  }

  /** Shows item `index` of the data (a row of the ranked table, or the picker). */
  showItem(index: number): void {
    if (this.input === null || index === this.index) return;
    this.index = index;
    this.recompute();
  }

  /** The data could not be read at all: say what to fix, show nothing stale. */
  showDataProblem(message: string): void {
    this.input = null;
    this.ranking = null;
    this.hideResult();
    showMessage(this.el.problem, message);
  }

  recompute(): void {
    const input = this.input;
    if (input === null) return;
    showMessage(this.el.problem, null);
    const text = readSettingsForm(this.el.settings);
    // The horizon belongs to the forecast audit: off (and out of the tab order) otherwise.
    this.el.horizon.disabled = text.check !== "audit";
    let ranking: Ranking | null;
    let index = this.index;
    let analysis: SeriesReport;
    try {
      const options = lagOptionsFromSettings(text);
      ranking = this.rankingFor(input, text, options);
      const top = ranking?.list.items[0];
      if (this.pickTop && top !== undefined) index = top.index;
      const series = input.series[index] ?? input.series[0];
      if (series === undefined) throw new Error("no series to show");
      analysis = seriesReport(series, options);
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      this.refused(error);
      return;
    }
    // Index and analysis change together, so the actions never act on a mismatched pair.
    this.index = index;
    this.analysis = analysis;
    this.shownInput = input;
    this.pickTop = false;
    showMessage(this.el.settingsProblem, null);
    markInvalid(this.el.settings, undefined, this.el.settingsProblem);
    this.renderRanking(input, ranking);
    this.redraw();
    this.announce(this.verdictLine());
  }

  /**
   * A refusal. A refused setting is marked at its field in the label's words, and the last valid
   * result stays on screen; refused data hide the result (it would be of other data).
   */
  private refused(error: EcholotError): void {
    const setting = refusedSetting(error);
    const form = this.el.settings;
    const words = inLabelWords(form, error, setting);
    // The last result stays only while it is of the data now given.
    const current = this.analysis !== null && this.shownInput === this.input;
    if (!current) this.hideResult();
    if (setting !== undefined) {
      showMessage(
        this.el.settingsProblem,
        current
          ? `${words}. The result shown is still the one for the last valid settings.`
          : words,
      );
      markInvalid(form, setting, this.el.settingsProblem);
      return;
    }
    this.hideResult();
    showMessage(this.el.problem, words);
  }

  /** Takes the result (and a ranking of other data) off the screen. */
  private hideResult(): void {
    this.analysis = null;
    this.el.result.hidden = true;
    if (this.ranking?.input !== this.input || this.renderedList !== this.ranking?.list) {
      this.el.batchPanel.hidden = true;
      this.table.clear();
      this.renderedList = null;
    }
    this.el.verdictStatus.textContent = "";
    this.onShown(null);
  }

  /** The ranked list for a block or an audit (null for one series in the noise check). */
  private rankingFor(input: PaneInput, text: SettingsText, options: LagOptions): Ranking | null {
    const horizon = auditHorizonFrom(text);
    if (input.series.length < 2 && horizon === null) return null;
    const settings = JSON.stringify(text);
    const cached = this.ranking;
    if (cached !== null && cached.input === input && cached.settings === settings) return cached;
    let ranking: Ranking;
    if (horizon === null) {
      ranking = {
        input,
        settings,
        list: rankedBatch(batchCheck(input.series, options)),
        audit: null,
      };
    } else {
      const audit = auditBatch(input.series, {
        horizon,
        season: options.season ?? null,
        alpha: options.alpha ?? null,
        maxLag: options.maxLag ?? null,
      });
      ranking = { input, settings, list: rankedAudit(audit), audit };
    }
    this.ranking = ranking;
    return ranking;
  }

  /** The shown item's row of the ranked list, when there is one. */
  private rankedItem(): RankedItem | undefined {
    return this.ranking?.list.items.find((item) => item.index === this.index);
  }

  /**
   * The headline shown and said: among many items the ranked list's (its word obeys the
   * false-discovery step), for one series its own.
   */
  private headlineShown(): { word: VerdictWord | null; title: string } | null {
    const item = this.rankedItem();
    if (item !== undefined) return item;
    return this.analysis?.headline ?? null;
  }

  /** The verdict said in the live region: the item, its headline, its rank among many. */
  private verdictLine(): string {
    const analysis = this.analysis;
    const headline = this.headlineShown();
    if (analysis === null || headline === null) return "";
    const label = seriesName(analysis.table.label, "heading");
    const item = this.rankedItem();
    const check = (this.ranking?.audit ?? null) === null ? "" : "forecast audit: ";
    const count = this.ranking?.list.items.length ?? 1;
    const rank = item === undefined || count < 2 ? "" : `, ranked ${item.rank} of ${count}`;
    const kept = item?.kept === true ? `, ${keptWords(item)} after the false-discovery step` : "";
    return `${label}: ${check}${verdictCellText(headline)}${rank}${kept}.`;
  }

  /**
   * Says `text` in the live region once the page shows it: emptied first and set a moment later,
   * so a screen reader announces it even when it repeats the last one.
   */
  private announce(text: string): void {
    clearTimeout(this.announceTimer);
    this.el.verdictStatus.textContent = "";
    this.announceTimer = setTimeout(() => {
      this.el.verdictStatus.textContent = text;
    }, 150);
  }

  private redraw(): void {
    const input = this.input;
    const analysis = this.analysis;
    if (input === null || analysis === null) return;
    renderAnalysis(this.el, analysis, this.view, this.sourceText(input));
    showMessage(this.el.readingNote, input.reading ?? null);
    const headline = this.headlineShown();
    const word = headline?.word ?? null;
    if (headline !== null && word !== null) {
      this.el.badge.innerHTML = badgeHtml(word, headline.title);
    }
    showMessage(this.el.auditLine, this.rankLine());
    const tooLarge = input.tooLargeForFunctions === true;
    showMessage(
      this.el.sizeNote,
      tooLarge
        ? "This range is larger than a cell function's payload (about 5 MB) can carry: the pane and a snapshot work, live formulas would fail. For more, use the command-line tool on a CSV export."
        : null,
    );
    this.onShown(this.shown);
  }

  /**
   * Why the item has its headline among many, in one line under the badge: its rank and the
   * finding under the false-discovery step (the explanation below reads the series on its own).
   */
  private rankLine(): string | null {
    const item = this.rankedItem();
    const list = this.ranking?.list;
    if (item === undefined || list === undefined) return null;
    const audit = this.ranking?.audit?.items[item.index]?.audit ?? null;
    const check = audit === null ? "" : `Forecast audit, horizon ${audit.horizon}: `;
    return `${check}ranked ${item.rank} of ${list.items.length}. ${item.reason}`;
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

  /** The item picker in ranked order, each item with its rank and verdict. */
  private fillColumnPick(list: RankedList): void {
    const pick = this.el.columnPick;
    pick.replaceChildren(
      ...list.items.map((item) => {
        const option = document.createElement("option");
        option.value = String(item.index);
        option.textContent = `${item.rank}. ${item.label} (${verdictCellText(item)})`;
        return option;
      }),
    );
    pick.value = String(this.index);
  }

  /**
   * The ranked table, the picker and where the settings sit: with many items (or an audit) the
   * settings come first, then the ranked table, then the item shown; one series keeps the
   * settings under its result.
   */
  private renderRanking(input: PaneInput, ranking: Ranking | null): void {
    const batchFirst = ranking !== null;
    this.el.batchPanel.hidden = !batchFirst;
    // Moved only when it must: moving the panel would take the focus out of a field being typed in.
    const { main, settingsPanel, batchPanel, result } = this.el;
    if (batchFirst && settingsPanel.nextElementSibling !== batchPanel) {
      main.insertBefore(settingsPanel, batchPanel);
    } else if (!batchFirst && result.nextElementSibling !== settingsPanel) {
      result.after(settingsPanel);
    }
    if (ranking === null) {
      this.table.clear();
      return;
    }
    if (this.renderedList !== ranking.list) {
      this.table.render(ranking.list, this.index);
      this.fillColumnPick(ranking.list);
      this.renderedList = ranking.list;
    }
    this.table.markShown(this.index);
    this.el.columnPick.value = String(this.index);
    this.el.exportRanked.disabled = input.series.length === 0;
  }

  private async exportList(): Promise<void> {
    const ranking = this.ranking;
    if (ranking === null) return;
    showMessage(this.el.exportStatus, "Exporting the ranked list…");
    try {
      showMessage(
        this.el.exportStatus,
        await this.exportRanked(ranking.list, ranking.input.source),
      );
    } catch (error) {
      showMessage(
        this.el.exportStatus,
        `The ranked list was not exported: ${error instanceof Error ? error.message : String(error)}`,
      );
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
    const name = `echolot-${fileNamePart(table.label, "series")}.html`;
    downloadText(html, name, "text/html");
    showMessage(this.el.actionStatus, `Saved ${name}.`);
  }
}

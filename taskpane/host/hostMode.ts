/**
 * The pane inside a workbook: the session reads the selection (or the pinned range) and hands
 * each reading to the pane; the actions place reports on a new sheet. The readings become series
 * through the core's intake: one column or row is one series, a block is one series per column.
 */
import { isEcholotError, seriesFromCells, type Series } from "../../src/core";
import { liveReportPlan, snapshotReportPlan } from "../../src/report";
import type { PaneController } from "../pane/controller";
import { showMessage, type PaneElements } from "../pane/view";
import { absoluteReference, columnReferences } from "./address";
import { HostError, hostRun, type ExcelRun } from "./excel";
import { installPortableAction } from "./placePortable";
import { placeReport } from "./placeReport";
import type { RangeRead } from "./readRange";
import { HostSession } from "./session";

function byId<T extends HTMLElement>(id: string): T {
  const found = document.getElementById(id);
  if (found === null) throw new Error(`the pane page has no #${id}`);
  return found as T;
}

export interface ReadingSeries {
  readonly series: Series[];
  /** The reference a live report's formulas use, one per series. */
  readonly references: string[];
}

function isBlank(cell: unknown): boolean {
  return cell === "" || cell === null || cell === undefined;
}

/**
 * One series per column of a block (a column with no value at all is left out); a single row or
 * column is one series.
 */
export function seriesOfReading(read: RangeRead): ReadingSeries {
  if (read.rows <= 1 || read.columns <= 1) {
    return { series: [seriesFromCells(read.cells)], references: [absoluteReference(read.address)] };
  }
  const columnRefs = columnReferences(read.address);
  const series: Series[] = [];
  const references: string[] = [];
  for (let c = 0; c < read.columns; c++) {
    const cells = read.cells.map((row) => [row[c]]);
    if (cells.every(([cell]) => isBlank(cell))) continue;
    series.push(seriesFromCells(cells));
    references.push(columnRefs[c] as string);
  }
  return { series, references };
}

function messageOf(error: unknown): string {
  if (error instanceof HostError || isEcholotError(error)) {
    return error.message.charAt(0).toUpperCase() + error.message.slice(1);
  }
  return `The workbook refused the request: ${error instanceof Error ? error.message : String(error)}`;
}

export async function startHost(
  el: PaneElements,
  pane: PaneController,
  run: ExcelRun = hostRun,
): Promise<void> {
  const sourcePanel = byId<HTMLElement>("source-panel");
  const sourceLine = byId<HTMLElement>("source-line");
  const pinToggle = byId<HTMLButtonElement>("pin-toggle");
  sourcePanel.hidden = false;
  el.placeLive.hidden = false;
  el.placeSnapshot.hidden = false;
  showMessage(el.status, null);

  const session = new HostSession(run, {
    onRead(read) {
      showMessage(el.progress, null);
      if (read.rows === 0) {
        sourceLine.textContent = `Selected: ${read.selected}`;
        pane.showDataProblem(
          "Select a column of numbers (a text first cell is taken as its label), or a block with one series per column.",
        );
        return;
      }
      const pinned = session.pinnedAddress;
      sourceLine.textContent =
        pinned === null
          ? `Following the selection: ${read.address}`
          : `Pinned: ${pinned} (reading ${read.address})`;
      try {
        const { series, references } = seriesOfReading(read);
        pane.show({
          series,
          source: read.address,
          references,
          tooLargeForFunctions: read.tooLargeForFunctions,
        });
      } catch (error) {
        pane.showDataProblem(messageOf(error));
      }
    },
    onProgress(done, total) {
      if (total > 0 && done < total) {
        showMessage(
          el.progress,
          `Reading rows: ${done.toLocaleString("en")} of ${total.toLocaleString("en")}…`,
        );
      }
    },
    onError(error) {
      showMessage(el.progress, null);
      pane.showDataProblem(messageOf(error));
    },
    onPinChange(pinned) {
      pinToggle.setAttribute("aria-pressed", String(pinned !== null));
      pinToggle.textContent =
        pinned === null ? "Pin this range" : "Unpin (follow the selection again)";
      sourceLine.textContent =
        pinned === null
          ? "Following the selection."
          : `Pinned: ${pinned}. Changes to it recompute the pane.`;
    },
  });

  pinToggle.addEventListener("click", () => {
    const action = session.pinnedAddress === null ? session.pin() : session.unpin();
    action.catch((error: unknown) => showMessage(el.actionStatus, messageOf(error)));
  });

  pane.onShown = (shown) => {
    const ready = shown !== null;
    el.placeSnapshot.disabled = !ready;
    const tooLarge = shown?.input.tooLargeForFunctions === true;
    el.placeLive.disabled = !ready || tooLarge;
    el.placeLive.title = tooLarge
      ? "Too large for a cell function's payload: place a snapshot instead"
      : "";
  };
  pane.onShown(null);

  const place = async (kind: "live" | "snapshot") => {
    const shown = pane.shown;
    if (shown === null) return;
    showMessage(
      el.actionStatus,
      kind === "live" ? "Placing the live report…" : "Placing the snapshot…",
    );
    try {
      const table = shown.analysis.table;
      const reference = shown.input.references?.[shown.index];
      if (kind === "live" && reference === undefined)
        throw new HostError("no source range to refer to");
      const plan =
        kind === "live" && reference !== undefined
          ? liveReportPlan(table, { reference })
          : snapshotReportPlan(table, shown.analysis.explanation);
      const placed = await placeReport(run, plan);
      showMessage(
        el.actionStatus,
        `${kind === "live" ? "Live report" : "Snapshot"} placed on the new sheet “${placed.sheetName}”.`,
      );
    } catch (error) {
      showMessage(el.actionStatus, messageOf(error));
    }
  };
  el.placeLive.addEventListener("click", () => void place("live"));
  el.placeSnapshot.addEventListener("click", () => void place("snapshot"));
  installPortableAction(el, pane, run);

  await session.start();
}

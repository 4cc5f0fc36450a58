/**
 * The pane inside a workbook: the session reads the selection (or the pinned range) and hands
 * each reading to the pane; the actions place reports on a new sheet. The readings become series
 * through the core's intake: one column or row is one series, a block is one series per column.
 */
import { capitalise, isEcholotError, seriesFromValues, type Series } from "../../src/core";
import { cellAddress, liveReportPlan, rankedListGrid, snapshotReportPlan } from "../../src/report";
import type { PaneController } from "../pane/controller";
import { showMessage, type PaneElements } from "../pane/view";
import { absoluteReference, columnReferences, parseAreas, splitAddress } from "./address";
import {
  HostError,
  hostRun,
  hostSupport,
  requestErrorCode,
  type ApiSupport,
  type ExcelRun,
} from "./excel";
import { installPortableAction } from "./placePortable";
import { placeRankedList } from "./placeRankedList";
import { placeReport } from "./placeReport";
import type { ErrorCell, RangeRead } from "./readRange";
import { HostSession } from "./session";
import { isEcholotFormula } from "./cellFormula";
import { explainFailedCell } from "./whyFailed";

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

/** Names the sheet cell of position i of a column (or row) that starts at (row, column). */
function cellNamer(row: number, column: number, alongRow: boolean): (i: number) => string {
  return (i) => `cell ${alongRow ? cellAddress(row, column + i) : cellAddress(row + i, column)}`;
}

/**
 * One series per column of a block (a column with no value at all is left out); a single row or
 * column is one series. A refused cell is named by its address on the sheet ("cell B13").
 */
export function seriesOfReading(read: RangeRead): ReadingSeries {
  const [area] = parseAreas(splitAddress(read.address).range);
  const top = area?.firstRow ?? 0;
  const left = area?.firstColumn ?? 0;
  if (read.rows <= 1 || read.columns <= 1) {
    const alongRow = read.rows === 1 && read.columns > 1;
    const list = alongRow ? (read.cells[0] ?? []) : read.cells.map((row) => row[0]);
    const series = seriesFromValues(list, { describePosition: cellNamer(top, left, alongRow) });
    return { series: [series], references: [absoluteReference(read.address)] };
  }
  const columnRefs = columnReferences(read.address);
  const series: Series[] = [];
  const references: string[] = [];
  for (let c = 0; c < read.columns; c++) {
    const list = read.cells.map((row) => row[c]);
    if (list.every((cell) => isBlank(cell))) continue;
    series.push(seriesFromValues(list, { describePosition: cellNamer(top, left + c, false) }));
    references.push(columnRefs[c] as string);
  }
  return { series, references };
}

/** What to do about a request the host refused, by its code (Excel.ErrorCodes). */
const REQUEST_ADVICE: Readonly<Record<string, string>> = {
  RangeExceedsLimit:
    "the range is too large for one request; select fewer cells, or use the command-line tool on a CSV export",
  ResponsePayloadSizeLimitExceeded:
    "the answer would pass the host's 5 MB limit; select fewer cells, or use the command-line tool on a CSV export",
  RequestPayloadSizeLimitExceeded:
    "the request would pass the host's 5 MB limit; place a smaller report",
  ItemNotFound: "the sheet or range is no longer there; select the data again",
  InvalidSelection: "select one column, row or block",
};

export function messageOf(error: unknown): string {
  if (error instanceof HostError || isEcholotError(error)) {
    return capitalise(error.message);
  }
  const code = requestErrorCode(error);
  const said = (error instanceof Error ? error.message : String(error)).replace(/\.$/, "");
  const advice = code === undefined ? undefined : REQUEST_ADVICE[code];
  if (advice !== undefined) return `The workbook refused the request (${code}): ${advice}.`;
  return `The workbook refused the request${code === undefined ? "" : ` (${code})`}: ${said}. Nothing was changed; try again, and reopen the pane if it keeps failing.`;
}

/** `Office.addin.onVisibilityModeChanged`: "Taskpane" or "Hidden" (Office.VisibilityMode). */
export interface VisibilityEvents {
  onVisibilityModeChanged(
    handler: (message: { readonly visibilityMode: string }) => void,
  ): Promise<() => Promise<void>>;
}

/** What the pane needs from office.js: `Excel.run`, requirement-set checks, `Office.addin`. */
export interface HostEnvironment {
  readonly run: ExcelRun;
  readonly support: ApiSupport;
  /** `Office.addin` (shared runtime), or undefined where the host has none. */
  readonly addin: VisibilityEvents | undefined;
}

export function officeEnvironment(): HostEnvironment {
  const addin =
    typeof Office !== "undefined" && hostSupportsSharedRuntime() ? Office.addin : undefined;
  return { run: hostRun, support: hostSupport, addin };
}

function hostSupportsSharedRuntime(): boolean {
  return Office.context?.requirements?.isSetSupported("SharedRuntime", "1.1") === true;
}

export async function startHost(
  el: PaneElements,
  pane: PaneController,
  env: HostEnvironment = officeEnvironment(),
): Promise<void> {
  const { run } = env;
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
      explaining++;
      if (isEcholotFormula(read.formula)) {
        explainCell(read, read.formula);
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

  // The latest cell being explained: an older explanation never replaces a newer reading.
  let explaining = 0;
  const explainCell = (read: RangeRead, formula: string) => {
    const ticket = ++explaining;
    sourceLine.textContent = `Selected: ${read.address}`;
    const shown = read.cells[0]?.[0];
    const isError = typeof shown === "object" && shown !== null && "code" in shown;
    if (!isError) {
      pane.showDataProblem(
        `Cell ${read.address} holds an ECHOLOT formula (${formula}); select the data it reads to see its analysis here.`,
      );
      return;
    }
    pane.showDataProblem(
      `Cell ${read.address} shows ${(shown as ErrorCell).code}; finding out why…`,
    );
    explainFailedCell(run, read.address, formula, shown as ErrorCell)
      .then((why) => {
        if (ticket !== explaining) return;
        pane.showDataProblem(
          why ??
            `Cell ${read.address} shows ${(shown as ErrorCell).code}; its formula is more than one ECHOLOT call with plain arguments, so the pane cannot recompute it.`,
        );
      })
      .catch((error: unknown) => {
        if (ticket === explaining) pane.showDataProblem(messageOf(error));
      });
  };

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
        `${kind === "live" ? "Live report" : "Snapshot"} placed on the new sheet “${placed.sheetName}” (open its tab to see it); the pane stays on this series.`,
      );
    } catch (error) {
      showMessage(el.actionStatus, messageOf(error));
    }
  };
  el.placeLive.addEventListener("click", () => void place("live"));
  el.placeSnapshot.addEventListener("click", () => void place("snapshot"));
  installPortableAction(el, pane, run);
  pane.exportRanked = async (list) => {
    const sheet = await placeRankedList(run, rankedListGrid(list));
    return `Ranked list placed on the new sheet “${sheet}” (open its tab to see it): ${list.items.length} items, most telling first.`;
  };

  await listenWhileVisible(session, env.addin, (error) => pane.showDataProblem(messageOf(error)));
}

/**
 * Listens to the workbook only while the pane is shown: `Office.addin.onVisibilityModeChanged`
 * reports "Taskpane" or "Hidden" (Office.VisibilityMode; learn.microsoft.com, "Show or hide the
 * task pane of your Office Add-in"). A shared runtime can start hidden, when a workbook with
 * ECHOLOT formulas opens: the page is then not visible, and the session waits for the pane to be
 * shown. Cell functions never wait on any of this: they run in their own calls.
 */
export async function listenWhileVisible(
  session: HostSession,
  addin: HostEnvironment["addin"],
  onError: (error: unknown) => void,
): Promise<void> {
  if (addin !== undefined) {
    await addin.onVisibilityModeChanged((message) => {
      const change = message.visibilityMode === "Hidden" ? session.stop() : session.start();
      change.catch(onError);
    });
  }
  if (typeof document === "undefined" || document.visibilityState !== "hidden") {
    await session.start();
  }
}

/**
 * The task pane's entry. Inside a spreadsheet host the pane follows the workbook (host/); opened
 * anywhere else — office.js reports no host — the same page runs standalone (standalone/). The
 * cell functions share this page's runtime and register themselves from their own bundle.
 */
import { PaneController } from "./pane/controller";
import { findElements, showMessage } from "./pane/view";
import { startHost } from "./host/hostMode";
import { startStandalone } from "./standalone/standalone";

function start(host: Office.HostType | null | undefined): void {
  const el = findElements(document);
  const pane = new PaneController(el);
  if (host !== null && host !== undefined && host === Office.HostType.Excel) {
    startHost(el, pane).catch((error: unknown) => {
      showMessage(
        el.problem,
        `The pane could not reach the workbook: ${error instanceof Error ? error.message : String(error)}`,
      );
    });
    return;
  }
  startStandalone(el, pane);
}

if (typeof Office === "undefined") {
  // office.js did not load (opened from a file, or blocked): the standalone pane still works.
  document.addEventListener("DOMContentLoaded", () => start(null));
} else {
  void Office.onReady((info) => start(info.host));
}

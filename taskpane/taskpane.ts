/**
 * The task pane's entry. For now it only reports where the page runs; the cell functions share
 * this page's runtime and register themselves from their own bundle.
 */

function showStatus(text: string): void {
  const status = document.getElementById("pane-status");
  if (status !== null) status.textContent = text;
}

Office.onReady((info) => {
  showStatus(
    info.host === null
      ? "Opened outside a spreadsheet host: the ECHOLOT cell functions need a workbook."
      : "Echolot is loaded: the ECHOLOT cell functions are ready in this workbook. The pane is loading…",
  );
});

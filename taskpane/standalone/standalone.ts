/**
 * Standalone mode: the same pane outside a workbook. Data come from pasted text, a CSV file
 * (opened or dropped) or a bundled demo scenario; nothing is sent anywhere.
 */
import { capitalise, isEcholotError, type LagOptions } from "../../src/core";
import type { PaneController } from "../pane/controller";
import { showMessage, type PaneElements } from "../pane/view";
import { seriesFromText } from "./delimited";
import { DEMOS } from "./demos";

function byId<T extends HTMLElement>(id: string): T {
  const found = document.getElementById(id);
  if (found === null) throw new Error(`the pane page has no #${id}`);
  return found as T;
}

export function startStandalone(el: PaneElements, pane: PaneController): void {
  const panel = byId<HTMLDetailsElement>("data-panel");
  const dataSummary = byId<HTMLElement>("data-summary");
  const pasteBox = byId<HTMLTextAreaElement>("paste-box");
  const pasteRead = byId<HTMLButtonElement>("paste-read");
  const filePick = byId<HTMLInputElement>("file-pick");
  const dropZone = byId<HTMLElement>("drop-zone");
  const demoPick = byId<HTMLSelectElement>("demo-pick");
  const demoOpen = byId<HTMLButtonElement>("demo-open");
  const demoStory = byId<HTMLElement>("demo-story");
  panel.hidden = false;
  el.saveReport.hidden = false;
  showMessage(el.status, null);

  const load = (text: string, origin: string, suggested?: LagOptions) => {
    try {
      const { series, skipped, reading } = seriesFromText(text, origin);
      const aside = skipped.length > 0 ? ` (left aside: ${skipped.join("; ")})` : "";
      pane.show({ series, source: `${origin}${aside}`, reading }, suggested);
      // The data are in: the panel folds away to one line, and opens again to change them.
      const count = series.length === 1 ? "1 series" : `${series.length} items`;
      dataSummary.textContent = `${origin}, ${count} (open to change)`;
      panel.open = false;
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      pane.showDataProblem(capitalise(error.message));
    }
  };

  pasteRead.addEventListener("click", () => load(pasteBox.value, "the pasted values"));
  pasteBox.addEventListener("paste", () => {
    // Read right after the paste lands in the box.
    setTimeout(() => load(pasteBox.value, "the pasted values"), 0);
  });

  const readFile = (file: File) => {
    file
      .text()
      .then((text) => load(text, file.name))
      .catch(() => pane.showDataProblem(`Could not read ${file.name}.`));
  };
  filePick.addEventListener("change", () => {
    const file = filePick.files?.[0];
    if (file !== undefined) readFile(file);
  });
  dropZone.addEventListener("dragover", (event) => {
    event.preventDefault();
    dropZone.classList.add("dragging");
  });
  dropZone.addEventListener("dragleave", () => dropZone.classList.remove("dragging"));
  dropZone.addEventListener("drop", (event) => {
    event.preventDefault();
    dropZone.classList.remove("dragging");
    const file = event.dataTransfer?.files[0];
    if (file !== undefined) readFile(file);
  });

  demoPick.replaceChildren(
    ...DEMOS.map((demo) => {
      const option = document.createElement("option");
      option.value = demo.id;
      option.textContent = demo.title;
      option.title = demo.story;
      return option;
    }),
  );
  const chosenDemo = () => DEMOS.find((d) => d.id === demoPick.value) ?? DEMOS[0];
  const tellStory = () => {
    demoStory.textContent = chosenDemo()?.story ?? "";
  };
  tellStory();
  demoPick.addEventListener("change", tellStory);
  demoOpen.addEventListener("click", () => {
    const demo = chosenDemo();
    if (demo !== undefined) load(demo.text, `demo: ${demo.file}`, demo.options);
  });
}

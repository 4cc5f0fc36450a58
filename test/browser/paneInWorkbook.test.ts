/**
 * The built pane as if inside a workbook: office.js is replaced by a stand-in whose `Excel.run`
 * works on the in-memory workbook of test/pane (test/browser/fakeHostEntry.ts), so the page's
 * own host glue runs end to end — reading the selection, pinning and following a range, placing
 * a live report and a snapshot — in Chromium. Runs (or skips) like pane.test.ts.
 */
import { mkdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { buildSync } from "esbuild";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  builtPane,
  launchChromium,
  ROOT,
  servePane,
  type Browser,
  type PaneServer,
} from "./paneServer";

function stubOfficeJs(): string {
  const lines = readFileSync(join(ROOT, "test", "fixtures", "series-f.csv"), "utf8")
    .trim()
    .split(/\r?\n/);
  const column = lines.map((line, i) => (i === 0 ? line : Number(line)));
  const bundle = buildSync({
    entryPoints: [join(__dirname, "fakeHostEntry.ts")],
    bundle: true,
    format: "iife",
    write: false,
    target: "es2022",
  });
  return `window.echolotSeriesF = ${JSON.stringify(column)};\n${bundle.outputFiles[0]?.text ?? ""}`;
}

interface SheetView {
  readonly names: string[];
  readonly formulas: Record<string, string>;
  readonly charts: number;
}

describe("the built pane in a workbook (simulated host)", () => {
  let server: PaneServer;
  let context: BrowserContext;
  let page: Page;
  let browser: Browser | undefined;
  const problems: string[] = [];

  beforeAll(async () => {
    server = await servePane(builtPane());
    browser = await launchChromium();
    context = browser.context;
    const stub = stubOfficeJs();
    await context.route("**/*", (route) => {
      const url = new URL(route.request().url());
      if (url.hostname !== "127.0.0.1") return route.abort("blockedbyclient");
      if (url.pathname.endsWith("/office-js/office.js")) {
        return route.fulfill({ status: 200, contentType: "text/javascript", body: stub });
      }
      return route.continue();
    });
    page = context.pages()[0] ?? (await context.newPage());
    page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
    page.on("console", (message) => {
      if (message.type() === "error") problems.push(`console error: ${message.text()}`);
    });
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#result").waitFor({ state: "visible" });
  }, 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  const sheet = (name: string) =>
    page.evaluate((sheetName): SheetView => {
      const host = window.echolotHost;
      const target = host.sheets.find((s) => s.name === sheetName);
      const formulas: Record<string, string> = {};
      for (const [key, cell] of target?.cells ?? [])
        if (cell.formula !== "") formulas[key] = cell.formula;
      return {
        names: host.sheets.map((s) => s.name),
        formulas,
        charts: target?.charts.length ?? 0,
      };
    }, name);

  it("reads the selected column and shows its verdict, with the workbook actions", async () => {
    expect(await page.textContent("#series-label")).toBe("yield");
    expect(await page.textContent("#verdict-badge")).toContain("structure");
    expect(await page.textContent("#source-line")).toContain("'Forecast errors'!A1:A71");
    expect(await page.isVisible("#place-live")).toBe(true);
    expect(await page.isVisible("#data-panel")).toBe(false);
    expect(await page.locator("#chart svg path.lag").count()).toBe(10);
  });

  it("recomputes on a selection change, and follows a pinned range through an edit", async () => {
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "C1:C71"));
    await expect.poll(() => page.textContent("#series-label")).toBe("other");
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:A71"));
    await expect.poll(() => page.textContent("#series-label")).toBe("yield");
    await page.click("#pin-toggle");
    await expect.poll(() => page.getAttribute("#pin-toggle", "aria-pressed")).toBe("true");
    const before = await page.textContent("#explanation");
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "C1:C71"));
    expect(await page.textContent("#series-label")).toBe("yield");
    await page.evaluate(() => window.echolotHost.edit("Forecast errors", "A3", [[30]]));
    await expect.poll(() => page.textContent("#explanation")).not.toBe(before);
    await page.click("#pin-toggle");
    await expect.poll(() => page.getAttribute("#pin-toggle", "aria-pressed")).toBe("false");
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:A71"));
  });

  it("places a live report of formulas and a chart on a new sheet, then a snapshot on another", async () => {
    await page.click("#place-live");
    await expect
      .poll(() => page.textContent("#action-status"))
      .toContain("Live report placed on the new sheet “Echolot yield”");
    const live = await sheet("Echolot yield");
    expect(live.formulas["4,1"]).toBe(
      "=ECHOLOT.SERIESNOISECHECK('Forecast errors'!$A$1:$A$71,10,0,0,0.05)",
    );
    expect(live.formulas["6,1"]).toBe(
      "=ECHOLOT.SERIESPORTMANTEAU('Forecast errors'!$A$1:$A$71,10,0,\"ljung-box\")",
    );
    expect(live.formulas["8,0"]).toBe(
      "=ECHOLOT.SERIESLAGTABLE('Forecast errors'!$A$1:$A$71,10,0.05,\"noise\")",
    );
    expect(live.charts).toBe(1);
    await page.click("#place-snapshot");
    await expect
      .poll(() => page.textContent("#action-status"))
      .toContain("Snapshot placed on the new sheet “Echolot yield (2)”");
    const snapshot = await sheet("Echolot yield (2)");
    expect(snapshot.formulas).toEqual({});
    expect(snapshot.charts).toBe(1);
    expect(snapshot.names).toEqual(["Forecast errors", "Echolot yield", "Echolot yield (2)"]);
    // Neither report took the selection: the pane still shows the series it was showing.
    await page.evaluate(() => window.echolotHost.settle());
    expect(await page.textContent("#series-label")).toBe("yield");
    expect(await page.textContent("#source-line")).toContain("'Forecast errors'!A1:A71");
    expect(await page.isDisabled("#place-live")).toBe(false);
  });

  it("analyses a column whose gaps are #N/A error cells", async () => {
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "E1:E71"));
    await expect.poll(() => page.textContent("#series-meta")).toContain("n = 68 · 2 gaps");
    expect(await page.textContent("#series-label")).toBe("yield");
    expect(await page.isVisible("#problem")).toBe(false);
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:A71"));
    await expect.poll(() => page.textContent("#series-meta")).toContain("n = 70 · no gaps");
  });

  it("explains a selected ECHOLOT cell that shows an error with the function's own message", async () => {
    await page.evaluate(() => {
      const formula = "=ECHOLOT.SERIESLAGCORR('Forecast errors'!$A$1:$A$71,80)";
      const sheet = window.echolotHost.sheet("Forecast errors");
      sheet.setFormula("G2", formula, window.echolotErrorValue("#VALUE!"));
      return window.echolotHost.select("Forecast errors", "G2");
    });
    await expect
      .poll(() => page.textContent("#problem"))
      .toBe(
        "Cell 'Forecast errors'!G2 shows #VALUE!. ECHOLOT.SERIESLAGCORR, recomputed from the same arguments, gives #VALUE!: maxLag must be a whole number from 1 to 69 (the series has 70 values).",
      );
    mkdirSync(join(ROOT, "test-output"), { recursive: true });
    await page.screenshot({ path: join(ROOT, "test-output", "pane-why-failed.png") });
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:A71"));
    await expect.poll(() => page.textContent("#series-label")).toBe("yield");
  });

  it("goes quiet while hidden, and reads the selection again when shown", async () => {
    await page.evaluate(() => window.echolotHost.setVisibility("Hidden"));
    await expect
      .poll(() => page.evaluate(() => window.echolotHost.selectionHandlers.length))
      .toBe(0);
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "C1:C71"));
    expect(await page.textContent("#series-label")).toBe("yield");
    await page.evaluate(() => window.echolotHost.setVisibility("Taskpane"));
    await expect.poll(() => page.textContent("#series-label")).toBe("other");
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:A71"));
    await expect.poll(() => page.textContent("#series-label")).toBe("yield");
  });

  it("offers the batch view for a selected block", async () => {
    await page.evaluate(() => window.echolotHost.select("Forecast errors", "A1:C71"));
    await expect.poll(() => page.isVisible("#batch-panel")).toBe(true);
    expect(await page.locator("#batch table tbody tr:not(.cutoff)").count()).toBe(2);
    // Inside a workbook the ranked list goes on a new sheet, as values, in the table's order.
    const labels = await page.locator("#batch .item-button").allTextContents();
    await page.click("#export-ranked");
    await expect
      .poll(() => page.textContent("#export-status"))
      .toContain("Ranked list placed on the new sheet “Echolot ranked”");
    const placed = await page.evaluate(() =>
      window.echolotHost.sheet("Echolot ranked").grid("A1:I3"),
    );
    expect(placed.values[0]?.slice(0, 3)).toEqual(["rank", "item", "n"]);
    expect(placed.values.slice(1).map((row) => row[1])).toEqual(labels);
    expect(placed.values[1]?.[0]).toBe(1);
    expect(await page.textContent("#series-label")).toBe(labels[0]);
    expect(problems).toEqual([]);
  });
});

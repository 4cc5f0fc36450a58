/**
 * The pane at scale and by measurement, in Debian's Chromium: the demand planner's 150-item file
 * (ranked first item, row buttons, keyboard, export, audit mode), the finance analyst's 500
 * clustered residuals pasted with decimal commas, the verdict in a live region, a refused setting
 * marked at its field, and no sideways scroll at 300 px. Screenshots land in test-output/ for a
 * person to look at. The data come from the seeded generator beside this file.
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  builtPane,
  launchChromium,
  wordsInRankedOrder,
  openDataPanel,
  ROOT,
  servePane,
  type Browser,
  type PaneServer,
} from "./paneServer";
import { analystResiduals, plannerCsv, plannerItems } from "./userFiles";

const OUTPUT = join(ROOT, "test-output");
/** How long a poll waits for a recomputation: generous, for a loaded 2-core machine. */
const WAIT = { timeout: 60_000 };
const PLANNER_FILE = join(OUTPUT, "planner-150-items.csv");
const items = plannerItems();
const kindOf = new Map(items.map((item) => [item.label, item.kind]));

describe("the pane with the planner's 150 items and the analyst's residuals", () => {
  let server: PaneServer;
  let browser: Browser | undefined;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    mkdirSync(OUTPUT, { recursive: true });
    writeFileSync(PLANNER_FILE, plannerCsv(items));
    server = await servePane(builtPane());
    browser = await launchChromium();
    const context = browser.context;
    await context.route("**/*", (route) =>
      new URL(route.request().url()).hostname === "127.0.0.1"
        ? route.continue()
        : route.abort("blockedbyclient"),
    );
    page = context.pages()[0] ?? (await context.newPage());
    page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#data-panel").waitFor({ state: "visible" });
    await page.setInputFiles("#file-pick", PLANNER_FILE);
    await page.locator("#result").waitFor({ state: "visible", timeout: 120_000 });
  }, 240_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  const rowLabels = () =>
    page.locator("#batch tbody tr:not(.cutoff) .item-button").allTextContents();
  const status = () => page.textContent("#verdict-status");
  const top = (selector: string) =>
    page.evaluate((s) => document.querySelector(s)?.getBoundingClientRect().top ?? NaN, selector);

  it("opens on the top-ranked item, with settings above a ranked table of buttons near the top", async () => {
    const labels = await rowLabels();
    expect(labels).toHaveLength(150);
    const first = labels[0] as string;
    expect(await page.textContent("#series-label")).toBe(first);
    // The seeded file's most telling item has a real finding (lags or bias), not sound errors.
    expect(kindOf.get(first)).not.toBe("sound");
    expect(
      await page.getAttribute("#batch tbody tr:first-child .item-button", "aria-current"),
    ).toBe("true");
    // The order agrees with the words: kept rows first, then watch, then clear, then short.
    expect(await wordsInRankedOrder(page)).toBe(true);
    // The data panel folded to one line; settings, then the table, within the first screen.
    expect(
      await page.evaluate(() => (document.getElementById("data-panel") as HTMLDetailsElement).open),
    ).toBe(false);
    expect(await page.textContent("#data-summary")).toContain("planner-150-items.csv, 150 items");
    const settingsTop = await top("#settings-panel");
    const tableTop = await top("#batch-panel");
    expect(settingsTop).toBeLessThan(tableTop);
    expect(tableTop).toBeLessThan(600);
    // The picker lists the items in the table's order.
    const picked = await page
      .locator("#column-pick option")
      .evaluateAll((options) => options.map((o) => (o as HTMLOptionElement).value));
    const rowIndices = await page
      .locator("#batch tbody tr:not(.cutoff) .item-button")
      .evaluateAll((buttons) => buttons.map((b) => (b as HTMLElement).dataset.index));
    expect(picked).toEqual(rowIndices);
    expect(await page.locator("#column-pick option").first().textContent()).toMatch(
      new RegExp(`^1\\. ${first} \\(`),
    );
    await expect.poll(status, WAIT).toMatch(new RegExp(`^${first}: .\\s\\w+.*, ranked 1 of 150`));
    await page.screenshot({ path: join(OUTPUT, "pane-planner-150.png") });
  });

  it("marks the kept rows with a style and a word, and draws the cut-off after the last", async () => {
    const rows = page.locator("#batch tbody tr");
    const classes = await rows.evaluateAll((trs) =>
      trs.map((tr) => ["kept", "cutoff"].find((c) => tr.classList.contains(c)) ?? ""),
    );
    const kept = classes.filter((c) => c === "kept").length;
    expect(kept).toBeGreaterThan(0);
    // Kept rows first, then exactly one cut-off row, then the rest.
    expect(classes.slice(0, kept).every((c) => c === "kept")).toBe(true);
    expect(classes[kept]).toBe("cutoff");
    expect(classes.slice(kept + 1).every((c) => c !== "kept" && c !== "cutoff")).toBe(true);
    // A kept row's q-value, or its bias q-value, is at most alpha; the tag says which.
    const keptRows = await page.locator("#batch tbody tr.kept").evaluateAll((trs) =>
      trs.map((tr) => ({
        label: tr.querySelector(".item-button")?.textContent ?? "",
        q: Number(tr.querySelector("td:nth-child(4)")?.textContent),
        biasQ: Number(tr.querySelector("td:nth-child(5)")?.textContent),
        tag: tr.querySelector(".kept-tag")?.textContent ?? "",
      })),
    );
    for (const row of keptRows) {
      expect(row.q <= 0.05 || row.biasQ <= 0.05, JSON.stringify(row)).toBe(true);
      expect(row.tag.includes("bias"), JSON.stringify(row)).toBe(row.biasQ <= 0.05);
    }
    // The five items that run high (mean 6.4, sd 10, 104 weeks: t near 6.5) are kept for bias.
    const biased = items.filter((item) => item.kind === "biased").map((item) => item.label);
    for (const label of biased) {
      expect(keptRows.find((row) => row.label === label)?.tag, label).toMatch(/bias/);
    }
    const look = (selector: string) =>
      page.evaluate((s) => {
        const row = document.querySelector(s) as HTMLElement;
        return getComputedStyle(row).backgroundColor;
      }, selector);
    expect(await look("#batch tbody tr.kept")).not.toBe(await look("#batch tbody tr:last-child"));
    expect(
      await page.evaluate(
        () =>
          getComputedStyle(document.querySelector("#batch tr.cutoff td") as Element).borderTopWidth,
      ),
    ).toBe("3px");
    expect(await page.locator("#batch tr.kept .kept-tag").count()).toBe(kept);
  });

  it("shows an item when its row button is clicked, and says its verdict", async () => {
    const labels = await rowLabels();
    const fifth = labels[4] as string;
    await page.locator("#batch tbody tr:not(.cutoff)").nth(4).locator("button").click();
    await expect.poll(() => page.textContent("#series-label"), WAIT).toBe(fifth);
    await expect.poll(status, WAIT).toMatch(new RegExp(`^${fifth}: .+, ranked 5 of 150`));
    const current = await page
      .locator('#batch .item-button[aria-current="true"]')
      .allTextContents();
    expect(current).toEqual([fifth]);
    expect(await page.inputValue("#column-pick")).toBe(
      await page
        .locator("#batch tbody tr:not(.cutoff)")
        .nth(4)
        .locator("button")
        .getAttribute("data-index"),
    );
  });

  it("works from the keyboard alone: Tab reaches the rows, arrows move, Enter and Space show", async () => {
    const labels = await rowLabels();
    await page.focus("#column-pick");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe(labels[0]);
    await page.keyboard.press("Enter");
    await expect.poll(() => page.textContent("#series-label"), WAIT).toBe(labels[0]);
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Space");
    await expect.poll(() => page.textContent("#series-label"), WAIT).toBe(labels[2]);
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe(labels[3]);
    await page.keyboard.press("End");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("export-ranked");
    // A visible focus ring on the row buttons (the page's :focus-visible rule).
    await page.keyboard.press("Shift+Tab");
    const outline = await page.evaluate(
      () => getComputedStyle(document.activeElement as Element).outlineStyle,
    );
    expect(outline).toBe("solid");
  });

  it("exports the ranked list as a CSV download in the table's order", async () => {
    const labels = await rowLabels();
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.click("#export-ranked"),
    ]);
    expect(download.suggestedFilename()).toBe(
      "echolot-ranked-planner-150-items-csv-left-aside-week-an-id-or-time-column.csv",
    );
    const text = readFileSync(await download.path(), "utf8");
    const lines = text.trimEnd().split("\r\n");
    expect(lines).toHaveLength(151);
    expect(lines[0]).toBe(
      "rank,item,n,p,q-value,bias p,bias q-value,volatility p,kept (q-value at most 0.05),verdict,finding",
    );
    const exported = lines.slice(1).map((line) => line.split(",")[1]);
    expect(exported).toEqual(labels);
    expect(lines[1]?.startsWith(`1,${labels[0]},104,`)).toBe(true);
    await expect
      .poll(() => page.textContent("#export-status"), WAIT)
      .toContain("150 items, most telling first");
  });

  it("audits the forecasts with a horizon: bias and dependence q-values, the biased items kept", async () => {
    await page.selectOption("#set-check", "audit");
    await expect.poll(() => page.locator("#batch table.audit").count(), WAIT).toBe(1);
    const head = await page.locator("#batch thead th").allTextContents();
    expect(head).toEqual(["#", "item", "q, lags", "q, bias", "verdict"]);
    const kept = await page.locator("#batch tbody tr.kept .item-button").allTextContents();
    const biased = items.filter((item) => item.kind === "biased").map((item) => item.label);
    // Mean 6.4 with sd 10 over 104 weeks: t near 6.5, far beyond any false-discovery threshold.
    for (const label of biased) expect(kept).toContain(label);
    await expect
      .poll(() => page.textContent("#audit-line"), WAIT)
      .toMatch(/^Forecast audit, horizon 1: /);
    await expect.poll(status, WAIT).toMatch(/: forecast audit: .\s\w+/);
    // A refused horizon is marked at its field, in the label's words; the result stays.
    await page.fill("#set-horizon", "0");
    await page.dispatchEvent("#set-horizon", "change");
    await expect.poll(() => page.getAttribute("#set-horizon", "aria-invalid"), WAIT).toBe("true");
    expect(await page.textContent("#settings-problem")).toMatch(
      /^Horizon must be a whole number from 1 to /,
    );
    expect(await page.isVisible("#result")).toBe(true);
    await page.fill("#set-horizon", "");
    await page.selectOption("#set-check", "noise");
    await expect.poll(() => page.locator("#batch table.batch").count(), WAIT).toBe(1);
    expect(await page.getAttribute("#set-horizon", "aria-invalid")).toBeNull();
  });

  it("marks a refused setting in the label's words and keeps the last valid result", async () => {
    const shown = await page.textContent("#series-label");
    await page.fill("#set-max-lag", "500");
    await page.dispatchEvent("#set-max-lag", "change");
    await expect.poll(() => page.getAttribute("#set-max-lag", "aria-invalid"), WAIT).toBe("true");
    const message = (await page.textContent("#settings-problem")) ?? "";
    expect(message).toMatch(/^Max lag must be a whole number from 1 to 103/);
    expect(message).not.toContain("maxLag");
    expect(message).toContain("The result shown is still the one for the last valid settings.");
    expect(await page.getAttribute("#set-max-lag", "aria-describedby")).toContain(
      "settings-problem",
    );
    expect(await page.isVisible("#result")).toBe(true);
    expect(await page.textContent("#series-label")).toBe(shown);
    await page.fill("#set-max-lag", "");
    await page.dispatchEvent("#set-max-lag", "change");
    await expect.poll(() => page.getAttribute("#set-max-lag", "aria-invalid"), WAIT).toBeNull();
    expect(await page.isVisible("#settings-problem")).toBe(false);
  });

  it("has no sideways scroll at 300 px, and nothing sticks out of the page", async () => {
    await page.setViewportSize({ width: 300, height: 900 });
    await page.waitForTimeout(400);
    const measure = () =>
      page.evaluate(() => {
        const root = document.documentElement;
        const outside = Array.from(document.querySelectorAll("#pane *"))
          .filter((e) => e.getClientRects().length > 0 && !e.closest(".visually-hidden"))
          .filter((e) => e.getBoundingClientRect().right > root.clientWidth + 0.5)
          .map((e) => `${e.tagName.toLowerCase()}#${e.id}.${e.className}`);
        return { scroll: root.scrollWidth, client: root.clientWidth, outside };
      });
    const batch = await measure();
    // The raw p and the volatility p give way as columns and show under the item's name instead;
    // the q-value and the bias q stay columns.
    const first = "#batch tbody tr:first-child";
    expect(await page.isVisible(`${first} td.fold-360`)).toBe(false);
    expect(await page.isVisible(`${first} td.fold-330`)).toBe(false);
    expect(await page.textContent(`${first} .folded.fold-360`)).toMatch(/^p \S+$/);
    expect(await page.textContent(`${first} .folded.fold-330`)).toMatch(/^volatility p \S+$/);
    expect(await page.isVisible(`${first} .folded.fold-330`)).toBe(true);
    const heads = await page.locator("#batch thead th:visible").allTextContents();
    expect(heads).toEqual(["#", "item", "q-value", "bias q", "verdict"]);
    expect(batch.scroll).toBeLessThanOrEqual(batch.client);
    expect(batch.outside).toEqual([]);
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: join(OUTPUT, "pane-planner-300px.png") });
    await page.screenshot({ path: join(OUTPUT, "pane-planner-300px-full.png"), fullPage: true });
    await page.evaluate(
      () => ((document.getElementById("figures-box") as HTMLDetailsElement).open = true),
    );
    const figures = await measure();
    expect(figures.scroll).toBeLessThanOrEqual(figures.client);
    expect(figures.outside).toEqual([]);
    await page.setViewportSize({ width: 360, height: 900 });
  });

  it("reads the analyst's residuals pasted with decimal commas as decimals, and says so", async () => {
    const residuals = Array.from(analystResiduals());
    await openDataPanel(page);
    await page.fill("#paste-box", residuals.map((r) => String(r)).join("\n"));
    await page.click("#paste-read");
    await expect.poll(() => page.textContent("#series-meta"), WAIT).toContain("n = 500");
    const pointFigures = await page.textContent("#figures");
    // Volatility clusters, so the headline is the robust reading, and the chart's caption says
    // which bands and which joint test it draws.
    await expect.poll(status, WAIT).toMatch(/^Series: .\s\w+ \(robust reading\)\.$/);
    const pointStatus = await status();
    expect(await page.textContent("#verdict-badge")).toContain("(robust reading)");
    const caption = (await page.locator("#chart svg").textContent()) ?? "";
    expect(caption).toContain("robust bands");
    expect(caption).toContain("robust Q*");
    const comma = residuals.map((r) => String(r).replace(".", ",")).join("\n");
    await openDataPanel(page);
    await page.fill("#paste-box", comma);
    await page.click("#paste-read");
    const example = String(residuals[0]);
    await expect
      .poll(() => page.textContent("#reading-note"), WAIT)
      .toBe(
        `Read as one value a line, decimal comma: "${example.replace(".", ",")}" is ${example}.`,
      );
    expect(await page.textContent("#series-meta")).toContain("n = 500");
    expect(await page.textContent("#figures")).toBe(pointFigures);
    await expect.poll(status, WAIT).toBe(pointStatus);
    expect(await page.isVisible("#batch-panel")).toBe(false);
    // Semicolon-separated on one line: one series, read the same.
    await openDataPanel(page);
    await page.fill("#paste-box", residuals.map((r) => String(r).replace(".", ",")).join(";"));
    await page.click("#paste-read");
    await expect
      .poll(() => page.textContent("#reading-note"), WAIT)
      .toMatch(/^Read as one row of values, decimal comma/);
    expect(await page.textContent("#figures")).toBe(pointFigures);
    await page.screenshot({ path: join(OUTPUT, "pane-analyst-decimal-comma.png") });
    expect(problems).toEqual([]);
  });

  it("does not keep a result of other data when new data refuse the settings", async () => {
    await page.fill("#set-max-lag", "40");
    await page.dispatchEvent("#set-max-lag", "change");
    await expect.poll(() => page.textContent("#chart-description"), WAIT).toContain("40");
    await openDataPanel(page);
    const thirty = Array.from(analystResiduals().slice(0, 30), String).join("\n");
    await page.fill("#paste-box", thirty);
    await page.click("#paste-read");
    await expect.poll(() => page.isVisible("#result"), WAIT).toBe(false);
    const message = (await page.textContent("#settings-problem")) ?? "";
    expect(message).toMatch(/^Max lag must be a whole number from 1 to 29/);
    expect(message).not.toContain("still");
    expect(await page.getAttribute("#set-max-lag", "aria-invalid")).toBe("true");
    await page.fill("#set-max-lag", "");
    await page.dispatchEvent("#set-max-lag", "change");
    await expect.poll(() => page.textContent("#series-meta"), WAIT).toContain("n = 30");
    expect(await page.isVisible("#result")).toBe(true);
  });

  it("goes from a fresh page to an item and an export with the keyboard alone", async () => {
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#data-panel").waitFor({ state: "visible" });
    const focused = () => page.evaluate(() => document.activeElement?.id ?? "");
    const tabUntil = async (id: string, most: number) => {
      for (let i = 0; i < most && (await focused()) !== id; i++) await page.keyboard.press("Tab");
      expect(await focused()).toBe(id);
    };
    // The demo picker's first scenario is the 24 roasting blends; Open it with Enter.
    await tabUntil("demo-open", 12);
    await page.keyboard.press("Enter");
    await expect.poll(() => page.locator("#batch .item-button").count(), WAIT).toBe(24);
    const labels = await rowLabels();
    expect(await page.textContent("#series-label")).toBe(labels[0]);
    await expect.poll(status, WAIT).toMatch(new RegExp(`^${labels[0]}: .+, ranked 1 of 24`));
    // On through the settings and the picker to the first row; the second row shows with Enter.
    await tabUntil("column-pick", 20);
    await page.keyboard.press("Tab");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe(labels[1]);
    await page.keyboard.press("Enter");
    await expect.poll(() => page.textContent("#series-label"), WAIT).toBe(labels[1]);
    await expect.poll(status, WAIT).toMatch(new RegExp(`^${labels[1]}: .+, ranked 2 of 24`));
    await page.keyboard.press("End");
    await page.keyboard.press("Tab");
    expect(await focused()).toBe("export-ranked");
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.keyboard.press("Enter"),
    ]);
    expect(download.suggestedFilename()).toMatch(/^echolot-ranked-demo-ternpoint.*\.csv$/);
    // Then on to the chart's tabs, which the arrow keys switch.
    await tabUntil("tab-correlation", 6);
    await page.keyboard.press("ArrowRight");
    expect(await page.getAttribute("#tab-partial", "aria-selected")).toBe("true");
  });
});

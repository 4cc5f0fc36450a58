/**
 * The HTML reports in a real browser (Debian's Chromium through playwright-core) on a 350 px
 * screen: the one-series report of the Larkvale residuals and the batch report of the 24
 * Ternpoint blends fit without sideways scrolling, their chart text is drawn at 11 px or more
 * (the charts are not scaled down), a fold-out opens from the keyboard, and the page asks for
 * nothing over the network. Screenshots are saved under test-output/ for a person to look at.
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { batchCheck, seriesFromValues, type Series } from "../../src/core";
import { batchReportHtml, seriesReport, seriesReportHtml } from "../../src/report";
import { launchChromium, ROOT, type Browser } from "./paneServer";

const OUTPUT = join(ROOT, "test-output", "report");
const MADE = new Date(Date.UTC(2026, 2, 14, 9, 5));

/** Every numeric column of a demo CSV (first column: dates), as series. */
function demoColumns(file: string): Series[] {
  const [head, ...lines] = readFileSync(join(ROOT, "demo", file), "utf8")
    .trim()
    .split(/\r?\n/);
  const names = (head ?? "").split(",").slice(1);
  return names.map((label, c) =>
    seriesFromValues(
      lines.map((line) => Number(line.split(",")[c + 1])),
      { label },
    ),
  );
}

function writeReports(): { single: string; batch: string } {
  mkdirSync(OUTPUT, { recursive: true });
  const [residuals] = demoColumns("larkvale-fund-residuals.csv");
  if (residuals === undefined) throw new Error("no Larkvale column");
  const single = join(OUTPUT, "larkvale.html");
  writeFileSync(
    single,
    seriesReportHtml(seriesReport(residuals, {}), {
      source: "larkvale-fund-residuals.csv, column “residual”",
      made: MADE,
      version: "test",
    }),
  );
  const blends = demoColumns("ternpoint-roasters-forecast-errors.csv");
  const options = { season: 13 };
  const batch = join(OUTPUT, "ternpoint.html");
  writeFileSync(
    batch,
    batchReportHtml(
      batchCheck(blends, options),
      blends.map((s) => seriesReport(s, options)),
      {
        title: "ternpoint-roasters-forecast-errors.csv",
        settings: "24 columns of numbers",
        made: MADE,
        version: "test",
      },
    ),
  );
  return { single, batch };
}

/** Sideways overflow of the page, and the smallest chart text and chart scale drawn. */
async function measure(page: Page) {
  return page.evaluate(() => {
    const root = document.documentElement;
    const texts = Array.from(document.querySelectorAll("svg text")).filter(
      (t) => (t as SVGGraphicsElement).getBoundingClientRect().width > 0,
    );
    const sizes = texts.map((t) => parseFloat(getComputedStyle(t).fontSize));
    const scales = Array.from(document.querySelectorAll("svg.evidence-chart, svg.joint-ribbon"))
      .filter((s) => s.getBoundingClientRect().width > 0)
      .map((s) => s.getBoundingClientRect().width / Number(s.getAttribute("width")));
    return {
      overflow: root.scrollWidth - root.clientWidth,
      texts: sizes.length,
      smallestText: sizes.reduce((a, b) => Math.min(a, b), Infinity),
      smallestScale: scales.reduce((a, b) => Math.min(a, b), Infinity),
    };
  });
}

describe("the HTML reports on a 350 px screen", () => {
  let browser: Browser | undefined;
  let page: Page;
  const outside: string[] = [];
  let files: { single: string; batch: string };

  beforeAll(async () => {
    files = writeReports();
    browser = await launchChromium();
    await browser.context.route("**/*", (route) => {
      const url = route.request().url();
      if (url.startsWith("file://")) return route.continue();
      outside.push(url);
      return route.abort("blockedbyclient");
    });
    page = browser.context.pages()[0] ?? (await browser.context.newPage());
    await page.setViewportSize({ width: 350, height: 800 });
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("one series: fits without sideways scrolling, chart text at 11 px or more, unscaled", async () => {
    await page.goto(`file://${files.single}`);
    const seen = await measure(page);
    expect(seen.overflow, "sideways overflow (px)").toBeLessThanOrEqual(0);
    expect(seen.texts).toBeGreaterThan(20);
    expect(seen.smallestText).toBeGreaterThanOrEqual(11);
    expect(seen.smallestScale).toBeCloseTo(1, 6);
    expect(await page.locator("p.question").first().textContent()).toMatch(
      /^Is what is left in “residual”/,
    );
    await page.screenshot({ path: join(OUTPUT, "larkvale-350.png"), fullPage: true });
  });

  it("a batch: the ranked table fits, a fold-out opens from the keyboard, and all of them open still fit", async () => {
    await page.goto(`file://${files.batch}`);
    expect((await measure(page)).overflow).toBeLessThanOrEqual(0);
    await page.focus("details.item summary");
    await page.keyboard.press("Enter");
    const opened = page.locator("details.item[open]");
    expect(await opened.count()).toBe(1);
    expect(await opened.locator("svg.evidence-chart").isVisible()).toBe(true);
    const seen = await measure(page);
    expect(seen.overflow, "sideways overflow with a fold-out open (px)").toBeLessThanOrEqual(0);
    expect(seen.smallestText).toBeGreaterThanOrEqual(11);
    await page.screenshot({ path: join(OUTPUT, "ternpoint-350.png"), fullPage: true });
    // Every fold-out open at once: the widest figures table of the 24 still fits.
    await page.evaluate(() =>
      document.querySelectorAll("details").forEach((d) => d.setAttribute("open", "")),
    );
    expect((await measure(page)).overflow, "overflow with all open (px)").toBeLessThanOrEqual(0);
    expect(outside).toEqual([]);
  });
});

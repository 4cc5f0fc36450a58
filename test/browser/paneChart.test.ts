/**
 * The pane's chart says what it shows, in a real browser (Debian's Chromium, the built pane,
 * standalone) at 350 px: the analyst's clustered residuals (the Larkvale demo file) get a caption
 * naming the band kind and the joint test, which follows the band and test settings; the squared
 * deviations' tab brings its own joint test (McLeod–Li) into the ribbon; chart and ribbon text is
 * 11 px or larger. Screenshots are saved under test-output/ for a person to look at.
 */
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  builtPane,
  launchChromium,
  ROOT,
  servePane,
  type Browser,
  type PaneServer,
} from "./paneServer";

const OUTPUT = join(ROOT, "test-output", "pane-chart");

describe("the pane's chart and ribbon, on the analyst's clustered residuals", () => {
  let server: PaneServer;
  let browser: Browser | undefined;
  let page: Page;

  const captions = (where: string) => page.locator(`${where} svg text.caption`).allTextContents();

  beforeAll(async () => {
    server = await servePane(builtPane());
    browser = await launchChromium();
    page = browser.context.pages()[0] ?? (await browser.context.newPage());
    await page.setViewportSize({ width: 350, height: 900 });
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#data-panel").waitFor({ state: "visible" });
    await page.setInputFiles("#file-pick", join(ROOT, "demo", "larkvale-fund-residuals.csv"));
    await page.waitForFunction(
      () => document.getElementById("series-label")?.textContent === "residual",
    );
    mkdirSync(OUTPUT, { recursive: true });
  }, 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("names the band kind and the joint test in the chart's caption, and follows the settings", async () => {
    // Asked for noise bands, but Engle's LM fires on these residuals: the headline takes the
    // robust reading (core/headline.ts), and the chart draws and names that reading.
    expect(await page.textContent("#verdict-badge")).toContain("(robust reading)");
    expect(await captions("#chart")).toEqual([
      "Autocorrelation, robust bands (volatility)",
      "Joint test robust Q* over lags 1–10:",
      expect.stringMatching(/^p [=<] \S+ (by|from) /),
    ]);
    await page.screenshot({ path: join(OUTPUT, "larkvale-noise-350.png"), fullPage: true });
    await page.selectOption("#set-band", "robust");
    await page.selectOption("#set-test", "robust");
    await expect
      .poll(() => captions("#chart"))
      .toEqual([
        "Autocorrelation, robust bands (volatility)",
        "Joint test robust Q* over lags 1–10:",
        expect.stringMatching(/^p [=<] \S+ (by|from) /),
      ]);
    expect((await captions("#ribbon"))[0]).toBe("Joint test robust Q* of lags 1…k, χ² p by cell");
  });

  it("puts the squared deviations' own joint test (McLeod–Li) in the ribbon on their tab", async () => {
    await page.click("#tab-squares");
    await expect
      .poll(() => captions("#chart"))
      .toContain("Squared deviations, noise bands (se 1/√n)");
    expect((await captions("#ribbon"))[0]).toBe("Joint test McLeod–Li of lags 1…k, χ² p by cell");
    // Volatility clusters in this scenario: McLeod–Li rejects at every k, so every cell is filled.
    expect(await page.locator("#ribbon rect.joint-cell.below").count()).toBe(10);
    await page.screenshot({ path: join(OUTPUT, "larkvale-squares-350.png"), fullPage: true });
    await page.click("#tab-correlation");
    expect((await captions("#ribbon"))[0]).toBe("Joint test robust Q* of lags 1…k, χ² p by cell");
  });

  it("draws every chart and ribbon text at 11 px or larger", async () => {
    const sizes = await page.evaluate(() =>
      Array.from(document.querySelectorAll("#chart svg text, #ribbon svg text")).map((t) => {
        const box = (t as SVGGraphicsElement).getBoundingClientRect();
        const svg = t.closest("svg");
        const scale =
          svg === null ? 1 : svg.getBoundingClientRect().width / svg.width.baseVal.value;
        return box.width > 0 ? parseFloat(getComputedStyle(t).fontSize) * scale : Infinity;
      }),
    );
    expect(sizes.length).toBeGreaterThan(10);
    for (const size of sizes) expect(size).toBeGreaterThanOrEqual(11);
  });

  it("keeps every caption and key inside its chart at the pane's narrowest chart width (260 px)", async () => {
    await page.setViewportSize({ width: 280, height: 900 });
    await page.selectOption("#set-band", "noise");
    for (const tab of ["#tab-partial", "#tab-squares", "#tab-correlation"]) {
      await page.click(tab);
      const outside = await page.evaluate(() =>
        Array.from(document.querySelectorAll("#chart svg text, #ribbon svg text"))
          .map((t) => {
            const svg = (t as SVGGraphicsElement).ownerSVGElement;
            const box = (t as SVGGraphicsElement).getBBox();
            const width = svg?.width.baseVal.value ?? 0;
            return { text: t.textContent, left: box.x, right: box.x + box.width, width };
          })
          .filter((t) => t.left < 0 || t.right > t.width),
      );
      expect(outside, tab).toEqual([]);
    }
    const widths = await page.evaluate(() =>
      Array.from(document.querySelectorAll("#chart svg, #ribbon svg")).map((s) =>
        s.getAttribute("width"),
      ),
    );
    expect(widths).toEqual(["260", "260"]);
  });
});

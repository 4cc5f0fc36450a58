/**
 * The built pane in a real browser (Debian's Chromium through playwright-core), standalone as it
 * runs outside a workbook: Series F pasted in, the verdict, the evidence chart and the
 * false-alarm note shown; every request kept on 127.0.0.1; a hostile label shown as text; the
 * keyboard alone enough. A screenshot is saved under test-output/ for a person to look at.
 *
 * vitest.config.mts leaves this folder out, saying so plainly, only on a machine without Chromium
 * and without CI=true; with CI=true a missing Chromium fails these tests.
 */
import { mkdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  builtPane,
  launchChromium,
  wordsInRankedOrder,
  openDataPanel,
  recordViolations,
  violations,
  ROOT,
  servePane,
  type Browser,
  type PaneServer,
} from "./paneServer";

const SERIES_F = readFileSync(join(ROOT, "test", "fixtures", "series-f.csv"), "utf8");
const XSS_LABEL = "<img src=x onerror=alert(1)>";
const OUTPUT = join(ROOT, "test-output");

describe("the built pane in a browser, standalone", () => {
  let server: PaneServer;
  let context: BrowserContext;
  let page: Page;
  let browser: Browser | undefined;
  const requests: string[] = [];
  const dialogs: string[] = [];
  const problems: string[] = [];

  beforeAll(async () => {
    server = await servePane(builtPane());
    browser = await launchChromium();
    context = browser.context;
    context.on("request", (request) => requests.push(request.url()));
    // Anything not on 127.0.0.1 fails at once, so a request out could not succeed either.
    await context.route("**/*", (route) =>
      new URL(route.request().url()).hostname === "127.0.0.1"
        ? route.continue()
        : route.abort("blockedbyclient"),
    );
    page = context.pages()[0] ?? (await context.newPage());
    page.on("dialog", (dialog) => {
      dialogs.push(dialog.message());
      void dialog.dismiss();
    });
    page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
    page.on("console", (message) => {
      // Content-security reports are checked one by one below, with their source.
      if (message.type() === "error" && !/Content Security Policy/i.test(message.text())) {
        problems.push(`console ${message.type()}: ${message.text()}`);
      }
    });
    await recordViolations(page);
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#data-panel").waitFor({ state: "visible" });
  }, 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  async function paste(text: string): Promise<void> {
    await openDataPanel(page);
    await page.fill("#paste-box", text);
    await page.click("#paste-read");
    await page.locator("#result").waitFor({ state: "visible" });
  }

  it("shows Series F's verdict, an evidence chart with 10 diamonds and the false-alarm note", async () => {
    await paste(SERIES_F);
    await expect.poll(() => page.textContent("#series-label")).toBe("yield");
    expect(await page.textContent("#verdict-badge")).toContain("structure");
    expect(await page.locator("#verdict-badge svg").count()).toBe(1);
    expect(await page.locator("#chart svg.evidence-chart path.lag").count()).toBe(10);
    expect(await page.locator("#chart svg rect.corridor").count()).toBe(2);
    expect(await page.locator("#ribbon svg rect.joint-cell").count()).toBe(10);
    const explanation = (await page.textContent("#explanation")) ?? "";
    expect(explanation).toContain(
      "10 lags tested at 5%: about 0.5 would cross the band by chance even for pure noise",
    );
    expect(explanation).toContain("A verdict is a statistical screen, not a decision");
    expect(await page.textContent("#series-meta")).toContain("n = 70 · no gaps");
    mkdirSync(OUTPUT, { recursive: true });
    await page.screenshot({ path: join(OUTPUT, "pane-series-f.png"), fullPage: true });
  });

  it("copies the summary: the headline, every finding and the caution", async () => {
    await context.grantPermissions(["clipboard-read", "clipboard-write"], {
      origin: server.origin,
    });
    await page.click("#copy-summary");
    await expect.poll(() => page.textContent("#action-status")).toBe("Summary copied.");
    const copied = await page.evaluate(() => navigator.clipboard.readText());
    const lines = copied.split("\n");
    expect(lines[0]).toBe(
      "yield (n = 70; 10 lags, alpha 0.05, noise bands, Ljung–Box): ■ structure, biased",
    );
    // Every finding that fired: the lag structure, then the bias (Series F is raw yields, mean 51).
    expect(lines[1]).toContain("Ljung–Box over 10 lags rejects white noise");
    expect(lines[2]).toMatch(/^Biased: the mean is 51\.13, not zero/);
    expect(lines.at(-1)).toContain("A verdict is a statistical screen, not a decision");
  });

  it("repeats the chart as a text table and an aria description", async () => {
    const rows = await page.locator("#figures table.figures tbody tr").count();
    expect(rows).toBe(10);
    const description = (await page.textContent("#chart-description")) ?? "";
    expect(description).toContain("Lags beyond the all-lags corridor: 1.");
    expect(await page.getAttribute("#chart-panel", "aria-describedby")).toBe("chart-description");
  });

  it("works from the keyboard: arrow keys switch the chart tabs", async () => {
    await page.focus("#tab-correlation");
    await page.keyboard.press("ArrowRight");
    expect(await page.getAttribute("#tab-partial", "aria-selected")).toBe("true");
    expect(await page.locator("#chart svg.view-partial").count()).toBe(1);
    await page.keyboard.press("ArrowRight");
    expect(await page.locator("#chart svg.view-squares path.lag").count()).toBe(10);
    await page.keyboard.press("Home");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("tab-correlation");
    // Settings change from the keyboard too: a season of 3 tags lags 3 and 6.
    await page.focus("#set-season");
    await page.keyboard.type("3");
    await page.keyboard.press("Tab");
    await expect.poll(() => page.locator("#chart svg text.season-tag").count()).toBe(2);
    await page.fill("#set-season", "");
    await page.dispatchEvent("#set-season", "change");
    await expect.poll(() => page.locator("#chart svg text.season-tag").count()).toBe(0);
  });

  it("shows a hostile label as text, and no dialog fires", async () => {
    const values = SERIES_F.trim().split(/\r?\n/).slice(1).join("\n");
    await paste(`${XSS_LABEL}\n${values}`);
    await expect.poll(() => page.textContent("#series-label")).toBe(XSS_LABEL);
    expect(await page.locator("img").count()).toBe(0);
    expect(await page.locator("#chart svg desc").textContent()).toContain(XSS_LABEL);
    await page.waitForTimeout(300);
    expect(dialogs).toEqual([]);
  });

  it("opens a demo scenario with its settings and a batch view in ranked order", async () => {
    await openDataPanel(page);
    await page.selectOption("#demo-pick", "ternpoint");
    await page.click("#demo-open");
    await expect.poll(() => page.locator("#batch table tbody tr:not(.cutoff)").count()).toBe(24);
    expect(await page.inputValue("#set-season")).toBe("13");
    // The order agrees with the words: kept rows first, then watch, then clear, then short.
    expect(await wordsInRankedOrder(page)).toBe(true);
    const copper = page.locator("#column-pick option", { hasText: "Copper Kettle" });
    await page.selectOption("#column-pick", (await copper.getAttribute("value")) ?? "");
    await expect.poll(() => page.textContent("#series-label")).toBe("Copper Kettle");
    await page.screenshot({ path: join(OUTPUT, "pane-demo-ternpoint.png"), fullPage: true });
  });

  it("opens a CSV file, leaving its date column aside", async () => {
    await page.setInputFiles("#file-pick", join(ROOT, "demo", "larkvale-fund-residuals.csv"));
    await expect.poll(() => page.textContent("#series-label")).toBe("residual");
    expect(await page.textContent("#series-meta")).toBe(
      "n = 750 · no gaps · larkvale-fund-residuals.csv (left aside: date (dates))",
    );
    expect(await page.isVisible("#batch-panel")).toBe(false);
  });

  it("names a refused setting by its label, whole message, at its own field", async () => {
    await paste(SERIES_F);
    const change = async (selector: string, value: string) => {
      await page.fill(selector, value);
      await page.dispatchEvent(selector, "change");
    };
    const kept = " The result shown is still the one for the last valid settings.";
    await change("#set-max-lag", "10");
    await change("#set-fitted", "10");
    await expect.poll(() => page.getAttribute("#set-fitted", "aria-invalid")).toBe("true");
    expect(await page.textContent("#settings-problem")).toBe(
      `Fitted parameters must be a whole number from 0 to 9: the test's degrees of freedom, 10 lags minus the fitted parameters, must be at least 1 (got 10).${kept}`,
    );
    expect(await page.getAttribute("#set-max-lag", "aria-invalid")).toBeNull();
    await change("#set-fitted", "");
    await change("#set-max-lag", "12abc");
    await expect.poll(() => page.getAttribute("#set-max-lag", "aria-invalid")).toBe("true");
    expect(await page.textContent("#settings-problem")).toBe(
      `Max lag must be a number (got "12abc").${kept}`,
    );
    await change("#set-max-lag", "");
    await expect.poll(() => page.getAttribute("#set-max-lag", "aria-invalid")).toBeNull();
    expect(await page.isVisible("#settings-problem")).toBe(false);
    expect(await page.isVisible("#result")).toBe(true);
  });

  it("says what to fix when pasted text holds a word among the numbers", async () => {
    await openDataPanel(page);
    await page.fill("#paste-box", "errors\n1.5\n2\nabc\n4\n5");
    await page.click("#paste-read");
    await expect.poll(() => page.isVisible("#problem")).toBe(true);
    expect(await page.textContent("#problem")).toBe(
      'Line 4, column 1 ("errors") of the pasted values holds "abc", which is not a number: write a number, or leave the cell empty or NA for a gap',
    );
    expect(await page.isVisible("#result")).toBe(false);
  });

  it("made no request beyond 127.0.0.1; the page's policy blocked office.js's telemetry frame", async () => {
    // office.js, loaded outside a host, tries a hidden telemetry frame after about 3 s: wait for it.
    await page.waitForFunction(() => performance.now() > 4_500);
    expect(requests.length).toBeGreaterThan(0);
    const outside = requests.filter((url) => new URL(url).hostname !== "127.0.0.1");
    expect(outside, `requests: ${requests.join(", ")}`).toEqual([]);
    const seen = await violations(page);
    // What the policy blocked, attempt by attempt: office.js's telemetry frame (and that frame's
    // inline style attribute), and eval in a feature probe of a bundled library (stdlib checks
    // generator support with eval inside try/catch and falls back). Nothing else, and nothing
    // loaded: the request log above is all 127.0.0.1.
    for (const v of seen) {
      const where = new URL(v.source).pathname;
      const officeFrame =
        where.startsWith("/office-js/") &&
        (v.blocked === "inline" || new URL(v.blocked).hostname !== "127.0.0.1");
      const evalProbe =
        v.directive === "script-src" &&
        v.blocked === "eval" &&
        /^\/(functions|taskpane)\.js$/.test(where);
      expect(officeFrame || evalProbe, JSON.stringify(v)).toBe(true);
    }
    expect(
      seen.some((v) => v.directive === "frame-src"),
      JSON.stringify(seen),
    ).toBe(true);
    expect(problems).toEqual([]);
  });
});

/**
 * The production page (office.js from its CDN) in Chromium, under its own content-security
 * policy. This machine has no network, so requests to the CDN's hosted path are answered with the
 * same files from the local office.js package (@microsoft/office-js, the files the CDN serves);
 * every other request that leaves 127.0.0.1 fails. The policy must let office.js load itself and
 * everything it loads from beside itself, and the page must work. Runs (or skips) like
 * pane.test.ts.
 */
import { existsSync, readFileSync } from "node:fs";
import { dirname, extname, join, normalize } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  builtCdnPane,
  launchChromium,
  recordViolations,
  violations,
  ROOT,
  servePane,
  type Browser,
  type PaneServer,
} from "./paneServer";

const HOSTED = "https://appsforoffice.microsoft.com/lib/1/hosted/";
const LOCAL_COPY = dirname(require.resolve("@microsoft/office-js/dist/office.js"));

describe("the production page (office.js from its CDN) under its content-security policy", () => {
  let server: PaneServer;
  let browser: Browser | undefined;
  let page: Page;
  const cdnRequests: string[] = [];
  const refused: string[] = [];
  const problems: string[] = [];

  beforeAll(async () => {
    server = await servePane(builtCdnPane());
    browser = await launchChromium();
    await browser.context.route("**/*", (route) => {
      const url = route.request().url();
      if (new URL(url).hostname === "127.0.0.1") return route.continue();
      if (url.startsWith(HOSTED)) {
        cdnRequests.push(url);
        const file = normalize(
          join(LOCAL_COPY, new URL(url).pathname.slice(new URL(HOSTED).pathname.length)),
        );
        if (file.startsWith(LOCAL_COPY) && existsSync(file)) {
          const type = extname(file) === ".js" ? "text/javascript" : "text/html";
          return route.fulfill({ status: 200, contentType: type, body: readFileSync(file) });
        }
      }
      refused.push(url);
      return route.abort("blockedbyclient");
    });
    page = browser.context.pages()[0] ?? (await browser.context.newPage());
    page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
    await recordViolations(page);
    await page.goto(`${server.origin}/taskpane.html`);
    await page.locator("#data-panel").waitFor({ state: "visible" });
  }, 240_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it("loads office.js from the CDN and the page works: Series F's verdict", async () => {
    expect(cdnRequests[0]).toBe(`${HOSTED}office.js`);
    expect(await page.evaluate(() => typeof (window as { Office?: unknown }).Office)).toBe(
      "object",
    );
    const seriesF = readFileSync(join(ROOT, "test", "fixtures", "series-f.csv"), "utf8");
    await page.fill("#paste-box", seriesF);
    await page.click("#paste-read");
    await expect.poll(() => page.textContent("#series-label")).toBe("yield");
    expect(await page.textContent("#verdict-badge")).toContain("structure");
  });

  it("blocks nothing office.js needs from the CDN; only its telemetry and a feature probe are refused", async () => {
    // office.js, outside a host, tries its telemetry after about 3 s: wait for that.
    await page.waitForFunction(() => performance.now() > 4_500);
    const seen = await violations(page);
    for (const v of seen) {
      const blocked = v.blocked.startsWith("http") ? new URL(v.blocked).hostname : v.blocked;
      // Anything office.js loads from the CDN's own folder must be allowed.
      expect(v.blocked.startsWith(HOSTED), JSON.stringify(v)).toBe(false);
      // office.js's telemetry: a hidden frame from telemetryservice.firstpartyapps.oaspapps.com
      // (and that frame's inline style), or requests to *.aria.microsoft.com.
      const telemetry =
        /(^|\.)(aria\.microsoft\.com|firstpartyapps\.oaspapps\.com)$/.test(blocked) ||
        blocked === "inline";
      const evalProbe = v.directive === "script-src" && v.blocked === "eval";
      expect(telemetry || evalProbe, JSON.stringify(v)).toBe(true);
    }
    // Every request that left 127.0.0.1 went to the CDN (served from the local copy) or was
    // refused: list the refused ones, none of which is on the CDN.
    expect(refused.filter((url) => url.startsWith(HOSTED))).toEqual([]);
    expect(problems).toEqual([]);
  });
});

/**
 * For the browser tests: the built pane (the current build from `npm run build:test`; a test never
 * builds) served on 127.0.0.1, and Debian's Chromium located.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { createServer, type Server } from "node:http";
import { extname, join, normalize, resolve } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { requireFreshBuild } from "../runner/builds";

export const ROOT = resolve(__dirname, "..", "..");
export const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
export const INSTALL_HINT =
  "install Debian's Chromium with `apt-get install -y chromium` (or point CHROMIUM_PATH at a Chromium binary)";

const TYPES: Readonly<Record<string, string>> = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json",
  ".map": "application/json",
  ".png": "image/png",
  ".xml": "application/xml",
};

/** The current local build (dist/, from `npm run build:test`); never built here. */
export function builtPane(): string {
  return requireFreshBuild("local");
}

/** The current production build that loads office.js from its CDN (`npm run build:test`). */
export function builtCdnPane(): string {
  return requireFreshBuild("cdn");
}

export interface PaneServer {
  readonly origin: string;
  close(): Promise<void>;
}

export async function servePane(dir: string): Promise<PaneServer> {
  const server: Server = createServer((request, response) => {
    const path = normalize(
      decodeURIComponent(new URL(request.url ?? "/", "http://127.0.0.1").pathname),
    );
    const file = join(dir, path === "/" ? "taskpane.html" : path);
    if (!file.startsWith(dir) || !existsSync(file) || statSync(file).isDirectory()) {
      response.writeHead(404).end();
      return;
    }
    response.writeHead(200, { "content-type": TYPES[extname(file)] ?? "application/octet-stream" });
    response.end(readFileSync(file));
  });
  await new Promise<void>((ready) => server.listen(0, "127.0.0.1", ready));
  const address = server.address();
  const port = typeof address === "object" && address !== null ? address.port : 0;
  return {
    origin: `http://127.0.0.1:${port}`,
    close: () => new Promise((done) => server.close(() => done())),
  };
}

export interface Browser {
  readonly context: BrowserContext;
  /** The fresh profile folder, removed by `close`. */
  readonly profile: string;
  close(): Promise<void>;
}

/**
 * Debian's Chromium, headless, in a fresh profile, with the flags that keep it off the network
 * (PLATFORM.md), at the pane's width. Throws with the install hint when there is no Chromium.
 */
export async function launchChromium(): Promise<Browser> {
  if (!existsSync(CHROMIUM))
    throw new Error(`there is no Chromium at ${CHROMIUM}: ${INSTALL_HINT}`);
  const profile = mkdtempSync(join(tmpdir(), "echolot-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 360, height: 900 },
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  return {
    context,
    profile,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** A content-security violation the page reported: the directive, what it blocked, and where. */
export interface Violation {
  readonly directive: string;
  readonly blocked: string;
  readonly source: string;
}

/** From the next navigation on, keeps the page's security-policy violations for `violations`. */
export async function recordViolations(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const seen: { directive: string; blocked: string; source: string }[] = [];
    Object.assign(window, { echolotViolations: seen });
    document.addEventListener("securitypolicyviolation", (event) => {
      seen.push({
        directive: event.violatedDirective,
        blocked: event.blockedURI,
        source: event.sourceFile,
      });
    });
  });
}

export function violations(page: Page): Promise<Violation[]> {
  return page.evaluate(
    () => (window as unknown as { echolotViolations: Violation[] }).echolotViolations,
  );
}

/** Unfolds the standalone page's data panel (it folds away once data are in), as a user would. */
export async function openDataPanel(page: Page): Promise<void> {
  const open = await page.evaluate(
    () => (document.getElementById("data-panel") as HTMLDetailsElement).open,
  );
  if (!open) await page.click("#data-panel > summary");
}

/**
 * Whether the ranked table's rows below the cut-off run watch, then clear, then short, then not
 * analysed: the order agrees with the words.
 */
export async function wordsInRankedOrder(page: Page): Promise<boolean> {
  const words = await page
    .locator("#batch tbody tr:not(.cutoff):not(.kept) td.verdict")
    .evaluateAll((tds) => tds.map((td) => (td as HTMLElement).dataset.word ?? ""));
  const groups = words.map((w) => ["watch", "clear", "short", ""].indexOf(w));
  return groups.every((g, i) => g >= 0 && (i === 0 || g >= (groups[i - 1] as number)));
}

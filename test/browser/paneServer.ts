/**
 * For the browser tests: the built pane (dist/, or a fresh build of our own when dist/ is missing
 * or older than the pane's sources) served on 127.0.0.1, and Debian's Chromium located.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { createServer, type Server } from "node:http";
import { dirname, extname, join, normalize, resolve } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

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

/** Where a build gets office.js: its local copy (tests, offline) or the CDN (publishing). */
export type OfficeJsSource = "local" | "cdn";

/** Why a built pane in `dir` cannot be used, or undefined when it is current. */
function staleness(dir: string, officeJs: OfficeJsSource): string | undefined {
  const page = join(dir, "taskpane.html");
  const bundle = join(dir, "taskpane.js");
  const map = join(dir, "taskpane.js.map");
  if (!existsSync(page) || !existsSync(bundle) || !existsSync(map))
    return `${dir} has no built pane`;
  // The minified page may leave the attribute unquoted: src=office-js/office.js.
  const local = /src="?office-js\/office\.js/.test(readFileSync(page, "utf8"));
  if (local !== (officeJs === "local"))
    return `${dir} is not a build with the ${officeJs} office.js`;
  const built = Math.min(statSync(page).mtimeMs, statSync(bundle).mtimeMs);
  const sources = (JSON.parse(readFileSync(map, "utf8")) as { sources: string[] }).sources
    .map((s) => /^webpack:\/\/[^/]*\/\.\/((?:src|taskpane|demo)\/[^?]+)/.exec(s)?.[1])
    .filter((s): s is string => s !== undefined);
  const config = ["taskpane/taskpane.html", "taskpane/taskpane.css", "scripts/content-policy.cjs"];
  for (const file of [...sources, ...config, "webpack.config.js"]) {
    const path = join(ROOT, file);
    if (!existsSync(path) || statSync(path).mtimeMs > built)
      return `${file} is newer than the build`;
  }
  return undefined;
}

/** Builds into `own` (under test-output/) unless a current build is there already. */
function buildInto(own: string, officeJs: OfficeJsSource, reason: string): string {
  // Several test files may get here at once: one builds, the others wait for it.
  const lock = `${own}.lock`;
  mkdirSync(dirname(lock), { recursive: true });
  for (;;) {
    if (staleness(own, officeJs) === undefined) return own;
    try {
      mkdirSync(lock);
    } catch {
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 250);
      continue;
    }
    try {
      if (staleness(own, officeJs) === undefined) return own;
      console.log(`browser tests: ${reason}; building the pane into ${own}`);
      const webpack = join(ROOT, "node_modules", "webpack-cli", "bin", "cli.js");
      const args = ["--mode", "production", "--env", `officeJs=${officeJs}`, "--output-path", own];
      execFileSync(process.execPath, [webpack, ...args], { cwd: ROOT, stdio: "ignore" });
      return own;
    } finally {
      rmSync(lock, { recursive: true, force: true });
    }
  }
}

/** The directory of a current local build: dist/, or our own build under test-output/. */
export function builtPane(): string {
  const dist = join(ROOT, "dist");
  const reason = staleness(dist, "local");
  if (reason === undefined) return dist;
  // Not over dist/: other tests may be reading it right now.
  return buildInto(join(ROOT, "test-output", "pane-build"), "local", reason);
}

/** A current production build that loads office.js from its CDN (never dist/). */
export function builtCdnPane(): string {
  const own = join(ROOT, "test-output", "cdn-build");
  return buildInto(own, "cdn", staleness(own, "cdn") ?? "no CDN build yet");
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

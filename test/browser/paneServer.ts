/**
 * For the browser tests: the built pane (dist/, or a fresh build of our own when dist/ is missing
 * or older than the pane's sources) served on 127.0.0.1, and Debian's Chromium located.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { createServer, type Server } from "node:http";
import { dirname, extname, join, normalize, resolve } from "node:path";
import { chromium, type BrowserContext } from "playwright-core";

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

/** Why a built pane in `dir` cannot be used, or undefined when it is current. */
function staleness(dir: string): string | undefined {
  const page = join(dir, "taskpane.html");
  const bundle = join(dir, "taskpane.js");
  const map = join(dir, "taskpane.js.map");
  if (!existsSync(page) || !existsSync(bundle) || !existsSync(map))
    return `${dir} has no built pane`;
  const built = Math.min(statSync(page).mtimeMs, statSync(bundle).mtimeMs);
  const sources = (JSON.parse(readFileSync(map, "utf8")) as { sources: string[] }).sources
    .map((s) => /^webpack:\/\/[^/]*\/\.\/((?:src|taskpane|demo)\/[^?]+)/.exec(s)?.[1])
    .filter((s): s is string => s !== undefined);
  for (const local of [...sources, "taskpane/taskpane.html", "taskpane/taskpane.css"]) {
    const file = join(ROOT, local);
    if (!existsSync(file) || statSync(file).mtimeMs > built)
      return `${local} is newer than the build`;
  }
  return undefined;
}

/** The directory of a current build: dist/, or our own build under test-output/ if dist/ is stale. */
export function builtPane(): string {
  const dist = join(ROOT, "dist");
  const reason = staleness(dist);
  if (reason === undefined) return dist;
  const own = join(ROOT, "test-output", "pane-build");
  // Both browser test files may get here at once: one builds, the other waits for it.
  const lock = `${own}.lock`;
  mkdirSync(dirname(lock), { recursive: true });
  for (;;) {
    if (staleness(own) === undefined) return own;
    try {
      mkdirSync(lock);
    } catch {
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 250);
      continue;
    }
    try {
      if (staleness(own) === undefined) return own;
      // Not over dist/: other tests may be reading it right now.
      console.log(`browser tests: ${reason}; building the pane into ${own}`);
      const webpack = join(ROOT, "node_modules", "webpack-cli", "bin", "cli.js");
      execFileSync(process.execPath, [webpack, "--mode", "production", "--output-path", own], {
        cwd: ROOT,
        stdio: "ignore",
      });
      return own;
    } finally {
      rmSync(lock, { recursive: true, force: true });
    }
  }
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

/**
 * The builds the tests read, made once per run by the npm scripts (never by a test): the local
 * add-in build in dist/ and the CDN build in test-output/cdn-build/ (`npm run build:test`), and
 * the CLI bundles in build/ (`npm run build:cli`). A build is usable when every project file that
 * went into it is older than it: a test of a stale bundle would check old code.
 *
 * test/runner/freshBuilds.ts checks all three once when the run starts; a test that reads a build
 * calls `requireFreshBuild`, which fails with the reason and the command that fixes it.
 */
import { existsSync, readFileSync, statSync } from "node:fs";
import { join, resolve } from "node:path";
import { inject } from "vitest";

export const ROOT = resolve(__dirname, "..", "..");

export type BuildKind = "local" | "cdn" | "cli";

/** Where each build is written. */
export const BUILD_DIRECTORY: Readonly<Record<BuildKind, string>> = {
  local: join(ROOT, "dist"),
  cdn: join(ROOT, "test-output", "cdn-build"),
  cli: join(ROOT, "build"),
};

/** The command that makes each build. */
export const BUILD_COMMAND: Readonly<Record<BuildKind, string>> = {
  local: "npm run build:test",
  cdn: "npm run build:test",
  cli: "npm run build:cli",
};

/** Files read by the webpack build that its source maps do not list. */
const WEBPACK_INPUTS = [
  "webpack.config.js",
  "scripts/content-policy.cjs",
  "scripts/allow-error-cells-plugin.cjs",
  "scripts/help-pages-plugin.cjs",
  "taskpane/taskpane.html",
  "taskpane/taskpane.css",
  "manifest/manifest.xml",
  "functions/help.json",
];

/** The CLI bundles scripts/build-cli.mjs writes, each with its list of inputs beside it. */
export const CLI_BUNDLES = ["echolot", "generate-demo", "build-demo-workbook"];

/** The first of `files` (relative to the root) that is missing or newer than `built`. */
function firstNewer(files: readonly string[], built: number): string | undefined {
  for (const file of files) {
    const path = join(ROOT, file);
    if (!existsSync(path)) return `${file} is missing`;
    if (statSync(path).mtimeMs > built) return `${file} is newer than the build`;
  }
  return undefined;
}

/** Project files (src, functions, taskpane, demo) listed in a webpack source map. */
function webpackSources(map: string): string[] {
  const sources = (JSON.parse(readFileSync(map, "utf8")) as { sources: string[] }).sources;
  return sources
    .map((s) => /^webpack:\/\/[^/]*\/\.\/((?:src|functions|taskpane|demo)\/[^?]+)/.exec(s)?.[1])
    .filter((s): s is string => s !== undefined);
}

/** Why the add-in build in `dir` cannot be used, or undefined when it is current. */
function addInStaleness(kind: "local" | "cdn"): string | undefined {
  const dir = BUILD_DIRECTORY[kind];
  const outputs = ["taskpane.html", "functions.js", "taskpane.js", "functions.json"];
  const maps = ["functions.js.map", "taskpane.js.map"];
  for (const file of [...outputs, ...maps]) {
    if (!existsSync(join(dir, file))) return `${dir} has no ${file}`;
  }
  // The minified page may leave the attribute unquoted: src=office-js/office.js.
  const local = /src="?office-js\/office\.js/.test(
    readFileSync(join(dir, "taskpane.html"), "utf8"),
  );
  if (local !== (kind === "local")) return `${dir} is not a build with the ${kind} office.js`;
  const built = outputs.reduce((oldest, file) => {
    return Math.min(oldest, statSync(join(dir, file)).mtimeMs);
  }, Infinity);
  const sources = new Set(maps.flatMap((map) => webpackSources(join(dir, map))));
  return firstNewer([...sources, ...WEBPACK_INPUTS], built);
}

/** Why the CLI bundles in build/ cannot be used, or undefined when they are current. */
function cliStaleness(): string | undefined {
  for (const name of CLI_BUNDLES) {
    const bundle = join(BUILD_DIRECTORY.cli, `${name}.cjs`);
    const inputs = join(BUILD_DIRECTORY.cli, `${name}.inputs.json`);
    if (!existsSync(bundle) || !existsSync(inputs))
      return `build/ has no ${name}.cjs with its inputs`;
    const built = statSync(bundle).mtimeMs;
    const files = JSON.parse(readFileSync(inputs, "utf8")) as string[];
    const newer = firstNewer([...files, "scripts/build-cli.mjs"], built);
    if (newer !== undefined) return `build/${name}.cjs: ${newer}`;
  }
  return undefined;
}

/** Why a build cannot be used, or undefined when it is current. */
export function staleness(kind: BuildKind): string | undefined {
  return kind === "cli" ? cliStaleness() : addInStaleness(kind);
}

export type BuildStaleness = Partial<Record<BuildKind, string>>;

declare module "vitest" {
  export interface ProvidedContext {
    /** Each stale build with its reason, as test/runner/freshBuilds.ts found them. */
    staleBuilds: BuildStaleness;
  }
}

/**
 * The build's directory, or an error that names the reason and the command to run. Uses the
 * check made when the run started (test/runner/freshBuilds.ts).
 */
export function requireFreshBuild(kind: BuildKind): string {
  const reason = inject("staleBuilds")[kind];
  if (reason !== undefined) {
    throw new Error(`the ${kind} build cannot be used (${reason}): run "${BUILD_COMMAND[kind]}"`);
  }
  return BUILD_DIRECTORY[kind];
}

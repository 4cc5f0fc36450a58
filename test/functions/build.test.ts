/**
 * The built add-in as a whole: the page that the manifest names loads office.js from the local
 * copy before both bundles (one shared runtime), the pane's bundle registers no function, the
 * bundles send nothing out, and OFFICE_JS=cdn switches the page to the official CDN without
 * copying office.js.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { DIST, distFile, readFunctionsJson } from "./host";

const ROOT = join(DIST, "..");

function scriptSources(html: string): string[] {
  return [...html.matchAll(/<script[^>]*\ssrc="?([^"\s>]+)"?/g)].map((m) => m[1] as string);
}

describe("npm run build", () => {
  it("emits functions.js, functions.json, taskpane.html/.js, the manifest, icons and office.js", () => {
    for (const file of [
      "functions.js",
      "functions.json",
      "taskpane.html",
      "taskpane.js",
      "manifest.xml",
      "assets/icon-16.png",
      "assets/icon-32.png",
      "assets/icon-64.png",
      "assets/icon-80.png",
      "office-js/office.js",
    ]) {
      expect(existsSync(join(DIST, file)), `dist/${file}`).toBe(true);
    }
    // office.js loads host-specific files from its own folder at run time: the folder is whole.
    expect(existsSync(join(DIST, "office-js", "excel-web-16.00.js"))).toBe(true);
  });

  it("writes a pane page that loads the local office.js first, then both bundles", () => {
    const scripts = scriptSources(readFileSync(distFile("taskpane.html"), "utf8"));
    expect(scripts[0], `scripts: ${scripts.join(", ")}`).toBe("office-js/office.js");
    expect(scripts.indexOf("functions.js")).toBeGreaterThan(0);
    expect(scripts.indexOf("taskpane.js")).toBeGreaterThan(0);
    expect(existsSync(join(DIST, scripts[0] ?? ""))).toBe(true);
  });

  it("registers the cell functions from the functions bundle only", () => {
    // One runtime: the page loads both bundles, so a second registration would clash.
    const associations = (file: string) =>
      readFileSync(distFile(file), "utf8").match(/CustomFunctions\.associate\(/g)?.length ?? 0;
    expect(associations("functions.js")).toBe(readFunctionsJson().functions.length);
    expect(associations("taskpane.js")).toBe(0);
  });

  it("builds bundles that make no network call and name no outside address", () => {
    // XML namespace names (www.w3.org, schemas.microsoft.com) are identifiers, not addresses.
    const namespace = /^https?:\/\/(www\.w3\.org|schemas\.microsoft\.com)\//;
    for (const file of ["functions.js", "taskpane.js"]) {
      const code = readFileSync(distFile(file), "utf8");
      const found =
        code.match(/fetch\(|XMLHttpRequest|WebSocket|sendBeacon|https?:\/\/[^"'`\s)]*/g) ?? [];
      expect(
        found.filter((hit) => !namespace.test(hit)),
        file,
      ).toEqual([]);
    }
  });

  it("switches to the office.js CDN with OFFICE_JS=cdn and then copies no local office.js", () => {
    const out = mkdtempSync(join(tmpdir(), "echolot-cdn-"));
    try {
      try {
        execFileSync(
          process.execPath,
          [
            join(ROOT, "node_modules", "webpack-cli", "bin", "cli.js"),
            "--mode",
            "production",
            "--output-path",
            out,
          ],
          { cwd: ROOT, env: { ...process.env, OFFICE_JS: "cdn" }, stdio: "pipe" },
        );
      } catch (error) {
        const { stdout, stderr } = error as { stdout?: Buffer; stderr?: Buffer };
        const output = `${stdout?.toString() ?? ""}${stderr?.toString() ?? ""}`;
        const tail = output.split("\n").slice(-30).join("\n");
        throw new Error(`OFFICE_JS=cdn build failed:\n${tail}`, { cause: error });
      }
      const html = readFileSync(join(out, "taskpane.html"), "utf8");
      const scripts = scriptSources(html);
      expect(scripts[0]).toBe("https://appsforoffice.microsoft.com/lib/1/hosted/office.js");
      expect(scripts.slice(1)).toEqual(expect.arrayContaining(["functions.js", "taskpane.js"]));
      expect(existsSync(join(out, "office-js"))).toBe(false);
      const metadata = JSON.parse(readFileSync(join(out, "functions.json"), "utf8")) as {
        allowErrorForDataTypeAny?: boolean;
      };
      expect(metadata.allowErrorForDataTypeAny).toBe(true);
    } finally {
      rmSync(out, { recursive: true, force: true });
    }
  });
});

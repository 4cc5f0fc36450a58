/**
 * The built add-in as a whole: the page that the manifest names loads office.js from the local
 * copy before both bundles (one shared runtime), the pane's bundle registers no function, the
 * bundles send nothing out, each page states its content-security policy, and the production
 * build (`--env officeJs=cdn`) loads office.js from its CDN with exactly the origins it needs.
 * Both builds are made once per run by `npm run build:test`; the tests only read them.
 */
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { builtCdnPane } from "../browser/paneServer";
import { DIST, distFile, readFunctionsJson } from "./host";

const ROOT = join(DIST, "..");

/** The page's Content-Security-Policy meta element, as directive → sources. */
function contentPolicyOf(html: string): Record<string, string[]> {
  const meta = /<meta\s+http-equiv="?Content-Security-Policy"?\s+content="([^"]*)"/.exec(html);
  if (meta === null) throw new Error("the page has no Content-Security-Policy meta element");
  const policy: Record<string, string[]> = {};
  for (const directive of (meta[1] as string).split(";")) {
    const [name, ...sources] = directive.trim().split(/\s+/);
    if (name !== undefined && name !== "") policy[name] = sources;
  }
  return policy;
}

function scriptSources(html: string): string[] {
  return [...html.matchAll(/<script[^>]*\ssrc="?([^"\s>]+)"?/g)].map((m) => m[1] as string);
}

describe("npm run build:local (the local office.js: tests, offline)", () => {
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

  it("states the local page's policy: its own origin only, no connections", () => {
    expect(contentPolicyOf(readFileSync(distFile("taskpane.html"), "utf8"))).toEqual({
      "default-src": ["'none'"],
      "script-src": ["'self'"],
      "style-src": ["'self'"],
      "img-src": ["'self'", "data:"],
      "font-src": ["'self'"],
      "connect-src": ["'none'"],
      "frame-src": ["'self'"],
      "base-uri": ["'none'"],
      "form-action": ["'none'"],
    });
  });
});

describe("npm run build (production: office.js from its CDN)", () => {
  // The same production build with the CDN's office.js, written by `npm run build:test` (which
  // npm test runs once) into test-output/cdn-build/.
  let out: string;
  beforeAll(() => {
    out = builtCdnPane();
  });

  it("references office.js on its CDN first, then both bundles, and copies no local office.js", () => {
    const scripts = scriptSources(readFileSync(join(out, "taskpane.html"), "utf8"));
    expect(scripts[0]).toBe("https://appsforoffice.microsoft.com/lib/1/hosted/office.js");
    expect(scripts.slice(1)).toEqual(expect.arrayContaining(["functions.js", "taskpane.js"]));
    expect(existsSync(join(out, "office-js"))).toBe(false);
    const metadata = JSON.parse(readFileSync(join(out, "functions.json"), "utf8")) as {
      allowErrorForDataTypeAny?: boolean;
    };
    expect(metadata.allowErrorForDataTypeAny).toBe(true);
  });

  it("emits a policy that adds exactly the origins office.js needs from there", () => {
    // The CDN's origin for office.js and the host- and locale-specific scripts it loads from beside
    // itself, and for the web host's hidden check frame; the Microsoft Ajax library's origin,
    // which office.js loads on some hosts. Source: the OfficeDev/office-js tracker, issue #1005
    // ("Document required CSP values"), checked against office.js's own script and frame URLs.
    // No connect-src: office.js's telemetry is not needed, and nothing leaves the page.
    expect(contentPolicyOf(readFileSync(join(out, "taskpane.html"), "utf8"))).toEqual({
      "default-src": ["'none'"],
      "script-src": ["'self'", "https://appsforoffice.microsoft.com", "https://ajax.aspnetcdn.com"],
      "style-src": ["'self'"],
      "img-src": ["'self'", "data:"],
      "font-src": ["'self'"],
      "connect-src": ["'none'"],
      "frame-src": ["'self'", "https://appsforoffice.microsoft.com"],
      "base-uri": ["'none'"],
      "form-action": ["'none'"],
    });
  });

  it("office.js builds those script and frame addresses itself (checked in the local copy)", () => {
    const officeJs = readFileSync(
      join(ROOT, "node_modules/@microsoft/office-js/dist/office.js"),
      "utf8",
    );
    // The Ajax library's address, and host scripts named relative to office.js's own folder.
    expect(officeJs).toContain("//ajax.aspnetcdn.com/ajax/3.5/MicrosoftAjax.js");
    expect(officeJs).toMatch(/hostSpecificFileVersion/);
    const web = readFileSync(
      join(ROOT, "node_modules/@microsoft/office-js/dist/excel-web-16.00.js"),
      "utf8",
    );
    expect(web).toContain('createElement("iframe")');
  });
});

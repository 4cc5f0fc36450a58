/**
 * The import direction of DESIGN.md ("Parts": functions, taskpane and cli → report → core; core
 * imports nothing of the others) and "no arithmetic in the edges" (STYLE.md 2) are enforced by
 * the project's ESLint configuration: probe files, linted in memory with ESLint's Node API at the
 * path they would have, fail for each forbidden arrow and pass for the allowed ones.
 */
import { resolve } from "node:path";
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

const ROOT = resolve(__dirname, "..", "..");

/** Rule ids of the errors ESLint reports for `code` as the file `path` (relative to the root). */
async function errorsOf(eslint: ESLint, path: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: resolve(ROOT, path) });
  if (result === undefined) throw new Error(`no lint result for ${path}`);
  return result.messages
    .filter((message) => message.severity === 2)
    .map((message) => message.ruleId ?? `fatal: ${message.message}`);
}

/** [probe file, imported module]: every arrow DESIGN.md forbids. */
const FORBIDDEN_IMPORTS: readonly (readonly [string, string])[] = [
  ["src/core/probe.ts", "../report"],
  ["src/core/probe.ts", "../report/explain"],
  ["src/core/probe.ts", "../cli/main"],
  ["src/core/probe.ts", "../sim/random"],
  ["src/core/probe.ts", "../../functions/functions"],
  ["src/core/probe.ts", "../../taskpane/pane/view"],
  ["src/core/probe.ts", "node:fs"],
  ["src/report/probe.ts", "../cli/main"],
  ["src/report/probe.ts", "../sim/calibration"],
  ["src/report/probe.ts", "../../functions/shape"],
  ["src/report/probe.ts", "../../taskpane/pane/controller"],
  ["src/report/probe.ts", "node:path"],
  ["functions/probe.ts", "../src/cli/main"],
  ["functions/probe.ts", "../taskpane/taskpane"],
  ["functions/probe.ts", "../taskpane/host/excel"],
  ["src/cli/probe.ts", "../../functions/functions"],
  ["src/cli/probe.ts", "../../taskpane/pane/view"],
  ["taskpane/probe.ts", "../functions/shape"],
  ["taskpane/probe.ts", "../src/cli/output"],
  ["taskpane/pane/probe.ts", "../../functions/arguments"],
  ["taskpane/pane/probe.ts", "../../src/cli/main"],
];

/** [probe file, imported module]: the arrows DESIGN.md allows. */
const ALLOWED_IMPORTS: readonly (readonly [string, string])[] = [
  ["src/core/probe.ts", "./types"],
  ["src/report/probe.ts", "../core"],
  ["src/report/probe.ts", "./palette"],
  ["src/cli/probe.ts", "../report"],
  ["src/cli/probe.ts", "../core"],
  ["src/cli/probe.ts", "node:fs"],
  ["functions/probe.ts", "../src/core"],
  ["functions/probe.ts", "../src/report/lagTableHeader"],
  ["taskpane/probe.ts", "../src/report"],
  ["taskpane/pane/probe.ts", "../../src/core"],
  ["taskpane/standalone/probe.ts", "../../demo/larkvale-fund-residuals.csv?raw"],
];

describe("eslint.config.mjs enforces the parts' import direction (DESIGN.md, Parts)", () => {
  let eslint: ESLint;
  beforeAll(() => {
    eslint = new ESLint({ cwd: ROOT });
  });

  it("refuses every forbidden arrow, as a plain import and as a re-export", async () => {
    for (const [path, module] of FORBIDDEN_IMPORTS) {
      for (const code of [`import "${module}";\n`, `export * from "${module}";\n`]) {
        expect(await errorsOf(eslint, path, code), `${path}: ${code.trim()}`).toEqual([
          "no-restricted-imports",
        ]);
      }
    }
  }, 120_000);

  it("refuses a forbidden arrow that imports only types", async () => {
    const code = `import type { Verdict } from "../report";\nexport type Probe = Verdict;\n`;
    expect(await errorsOf(eslint, "src/core/probe.ts", code)).toEqual(["no-restricted-imports"]);
  }, 120_000);

  it("passes every allowed arrow", async () => {
    for (const [path, module] of ALLOWED_IMPORTS) {
      const code = `import "${module}";\n`;
      expect(await errorsOf(eslint, path, code), `${path}: ${code.trim()}`).toEqual([]);
    }
  }, 120_000);
});

describe("eslint.config.mjs keeps arithmetic out of functions/ and taskpane/ (STYLE.md 2)", () => {
  let eslint: ESLint;
  beforeAll(() => {
    eslint = new ESLint({ cwd: ROOT });
  });

  it("refuses Math arithmetic in a cell function and in the pane", async () => {
    for (const path of ["functions/probe.ts", "taskpane/pane/probe.ts", "taskpane/probe.ts"]) {
      for (const expression of [
        "Math.sqrt(2)",
        "Math.exp(-1)",
        "Math.log(3)",
        "Math.abs(-1)",
        "Math.PI",
      ]) {
        const code = `export const probe = ${expression};\n`;
        expect(await errorsOf(eslint, path, code), `${path}: ${expression}`).toEqual([
          "no-restricted-syntax",
        ]);
      }
    }
  }, 120_000);

  it("passes index and pixel clamping there, and Math arithmetic in src/core", async () => {
    const clamp =
      "export const probe = (n: number) => Math.max(1, Math.min(Math.floor(n), Math.round(n)));\n";
    for (const path of ["functions/probe.ts", "taskpane/host/probe.ts"]) {
      expect(await errorsOf(eslint, path, clamp), path).toEqual([]);
    }
    const core = "export const probe = (x: number) => Math.sqrt(Math.abs(x));\n";
    expect(await errorsOf(eslint, "src/core/probe.ts", core)).toEqual([]);
  }, 120_000);
});

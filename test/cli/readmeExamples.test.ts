/**
 * The README's ranked-table examples are the CLI's real output: each command is run on the
 * invented demo file and its output must stand in the README as printed.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT, runCli } from "./run";

const DEMO = "demo/ternpoint-roasters-forecast-errors.csv";
const README = readFileSync(join(ROOT, "README.md"), "utf8");

/** The ```text block that follows `marker` in the README. */
function blockAfter(marker: string): string {
  const at = README.indexOf(marker);
  expect(at, `README holds ${marker}`).toBeGreaterThanOrEqual(0);
  const start = README.indexOf("```text\n", at) + "```text\n".length;
  return README.slice(start, README.indexOf("\n```", start));
}

function output(args: readonly string[]): string {
  const result = runCli(args);
  expect(result.status, result.stderr).toBe(0);
  return result.stdout.replace(/\n$/, "");
}

describe("README: many items, ranked tables", () => {
  it("shows the real output of batch --top 8", () => {
    const args = ["batch", DEMO, "--top", "8"];
    expect(blockAfter(`\`npx echolot ${args.join(" ")}\``)).toBe(output(args));
  });

  it("shows the real output of audit --horizon 1 --top 8", () => {
    const args = ["audit", DEMO, "--horizon", "1", "--top", "8"];
    expect(blockAfter(`\`npx echolot ${args.join(" ")}\``)).toBe(output(args));
  });

  it("shows the real first eleven CSV columns of batch --csv --top 5", () => {
    const args = ["batch", DEMO, "--csv", "--top", "5"];
    // What `| cut -d, -f1-11` keeps: these fields hold no quoted comma.
    const cut = output(args)
      .split("\r\n")
      .map((line) => line.split(",").slice(0, 11).join(","))
      .join("\n");
    expect(blockAfter(`\`npx echolot ${args.join(" ")} | cut -d, -f1-11\``)).toBe(cut);
  });
});

/**
 * The command line's own words, through the built CLI: --version, each command's --help (after
 * anything), one-line messages of ours for unknown options and missing values (exit 2, nothing on
 * stdout, like every other usage error), a short list for a wrong --column, and the JSON
 * documents' version and names.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { csvFile, ROOT, runCli } from "./run";

const SERIES_F = "test/fixtures/series-f.csv";
const DEMO = "demo/ternpoint-roasters-forecast-errors.csv";

/** One message on stderr, status 2, nothing on stdout; returns the message. */
function refused(args: readonly string[]): string {
  const result = runCli(args);
  expect(result.stdout, `stdout of ${args.join(" ")}`).toBe("");
  expect(result.status, `status of ${args.join(" ")}: ${result.stderr}`).toBe(2);
  const lines = result.stderr.trim().split("\n");
  expect(lines, `one line on stderr: ${result.stderr}`).toHaveLength(1);
  return lines[0] as string;
}

function ok(args: readonly string[]): string {
  const result = runCli(args);
  expect(result.stderr, `stderr of ${args.join(" ")}`).toBe("");
  expect(result.status, `status of ${args.join(" ")}`).toBe(0);
  return result.stdout;
}

/** The options each command takes, as its help must list them. */
const TAKES: Readonly<Record<string, readonly string[]>> = {
  check: ["column", "lags", "season", "fitted", "alpha", "bands", "test", "json", "na"],
  audit: ["horizon", "season", "alpha", "lags", "id", "json", "format", "top", "kept", "csv"],
  batch: ["lags", "id", "time", "value", "json", "format", "top", "kept", "reasons", "csv", "out"],
  report: ["column", "lags", "out", "force"],
  workbook: ["column", "batch", "out", "force"],
  fdr: ["json", "format", "top", "kept", "csv", "out"],
  demo: [],
};

describe("echolot --version", () => {
  it.each(["--version", "-V"])("%s prints the version of package.json", (flag) => {
    const { version } = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8")) as {
      version: string;
    };
    expect(ok([flag])).toBe(`${version}\n`);
  });
});

describe("echolot COMMAND --help", () => {
  it.each(Object.keys(TAKES))("%s --help prints its own usage and every option it takes", (c) => {
    const help = ok([c, "--help"]);
    expect(help).toMatch(new RegExp(`^usage: echolot ${c}\\b`));
    expect(help).toMatch(/^options:$/m);
    for (const option of TAKES[c] ?? []) {
      expect(help, `${c} --help lists --${option}`).toMatch(new RegExp(`^  --${option}\\b`, "m"));
    }
    for (const line of help.split("\n"))
      expect(Array.from(line).length, line).toBeLessThanOrEqual(80);
  });

  it("--help works after any command, whatever else the line holds", () => {
    for (const args of [
      ["batch", "--help"],
      ["batch", "-h"],
      ["batch", "missing.csv", "--foo", "--help"],
      ["batch", "--lags", "--help"],
      ["audit", DEMO, "--top", "0", "-h"],
      ["help", "batch"],
    ]) {
      expect(ok(args), args.join(" ")).toMatch(/^usage: echolot batch|^usage: echolot audit/);
    }
    expect(ok(["batch", "--help"])).not.toMatch(/needs a CSV file/);
  });

  it("echolot --help lists the commands and how to get each one's help", () => {
    const help = ok(["--help"]);
    for (const command of Object.keys(TAKES))
      expect(help).toMatch(new RegExp(`^  ${command} `, "m"));
    expect(help).toMatch(/echolot COMMAND --help/);
  });
});

describe("echolot: our own messages for options", () => {
  it("an unknown option is one line of ours naming the command and what it takes", () => {
    const message = refused(["batch", DEMO, "--foo"]);
    expect(message).toMatch(
      /^echolot: unknown option --foo for batch; batch takes: --lags, --season, .*--top, --kept/,
    );
    // Never the parser's text, with its unbalanced quotes.
    expect(message).not.toMatch(/['"]|Unknown option|positional/);
    expect(refused(["demo", "--x"])).toBe(
      "echolot: unknown option --x for demo; demo takes no options",
    );
    expect(refused(["check", SERIES_F, "-x"])).toMatch(/^echolot: unknown option -x for check;/);
  });

  it("an unknown option close to a known one is named", () => {
    expect(refused(["check", SERIES_F, "--Lags", "3"])).toMatch(
      /unknown option --Lags for check \(did you mean --lags\?\)/,
    );
  });

  it("a missing value, a value given to a switch and an option taken for a value are ours too", () => {
    expect(refused(["check", SERIES_F, "--lags"])).toBe("echolot: --lags needs a value: --lags K");
    expect(refused(["audit", SERIES_F, "--horizon"])).toBe(
      "echolot: --horizon needs a value: --horizon H",
    );
    expect(refused(["batch", DEMO, "--json=yes"])).toBe(
      "echolot: --json takes no value (got --json=yes)",
    );
    expect(refused(["batch", DEMO, "--lags", "--json"])).toMatch(
      /^echolot: --lags needs a value: --lags K \(--json after it reads as an option/,
    );
  });

  it("--top, --csv and --format are checked with messages that say what to give", () => {
    expect(refused(["batch", DEMO, "--top", "0"])).toMatch(/--top must be a whole number from 1/);
    expect(refused(["batch", DEMO, "--top", "2.5"])).toBe(
      'echolot: --top must be a whole number from 1 (got "2.5")',
    );
    expect(refused(["batch", DEMO, "--csv", "--json"])).toMatch(/give only one of --json, --csv/);
    expect(refused(["batch", DEMO, "--format", "jsonl", "--kept"])).toMatch(
      /--top and --kept .* give them to fdr/,
    );
    expect(refused(["audit", DEMO, "--horizon", "1", "--format", "jsonl"])).toMatch(
      /--format must be "text" or "json" or "csv"/,
    );
  });

  it("a wrong --column lists at most ten column names and how many more", () => {
    const header = ["week", ...Array.from({ length: 150 }, (_, i) => `item-${i + 1}`)];
    const row = (t: number) => [
      `2025-01-${String(t + 1).padStart(2, "0")}`,
      ...header.slice(1).map((_, i) => ((i * 7 + t * 3) % 11) - 5),
    ];
    const lines = [header.join(","), ...Array.from({ length: 25 }, (_, t) => row(t).join(","))];
    const wide = csvFile("wide-151.csv", lines.join("\n"));
    const message = refused(["check", wide, "--column", "itme-7"]);
    expect(message).toMatch(/--column itme-7 matches no column of .*wide-151\.csv/);
    expect(message.match(/"[^"]*"/g)).toHaveLength(10);
    expect(message).toMatch(/"item-9" and 141 more\) or a number from 1 to 151/);
    const long = refused(["batch", wide, "--id", "itme", "--time", "week", "--value", "item-1"]);
    expect(long.match(/"[^"]*"/g)?.length ?? 0).toBeLessThanOrEqual(11);
    expect(long).toMatch(/and 141 more/);
  });
});

describe("echolot --json: a version, and the statistic named apart from the q-value", () => {
  it("check, batch, audit and fdr documents start with version 2", () => {
    const parts = csvFile("parts.jsonl", ok(["batch", DEMO, "--format", "jsonl"]));
    for (const args of [
      ["check", SERIES_F, "--json"],
      ["batch", DEMO, "--json"],
      ["audit", DEMO, "--horizon", "1", "--json"],
      ["fdr", parts, "--json"],
    ]) {
      const doc = JSON.parse(ok(args)) as Record<string, unknown>;
      expect(Object.keys(doc)[0], args.join(" ")).toBe("version");
      expect(doc.version, args.join(" ")).toBe(2);
    }
  });

  it("batch and audit entries carry statistic and qValue, never q", () => {
    for (const args of [
      ["batch", DEMO, "--json"],
      ["audit", DEMO, "--horizon", "1", "--json"],
    ]) {
      const doc = JSON.parse(ok(args)) as { series: Record<string, unknown>[] };
      for (const entry of doc.series) {
        expect(entry, args.join(" ")).not.toHaveProperty("q");
        expect(typeof entry.statistic).toBe("number");
        expect(typeof entry.qValue).toBe("number");
        expect(typeof entry.rank).toBe("number");
      }
    }
  });
});

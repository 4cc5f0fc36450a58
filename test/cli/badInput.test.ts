import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { csvFile, ROOT, runCli } from "./run";

const SERIES_F = join(ROOT, "test", "fixtures", "series-f.csv");
const numbers = (count: number) => Array.from({ length: count }, (_, i) => String((i * 37) % 17));

const column = (name: string, cells: readonly string[]) =>
  csvFile(name, ["value", ...cells].join("\n") + "\n");

/** Two columns of 30 numbers each. */
const twoColumns = () =>
  csvFile(
    "two.csv",
    ["a,b", ...numbers(30).map((x, i) => `${x},${(i * 11) % 7}`)].join("\n") + "\n",
  );

interface BadCase {
  readonly name: string;
  readonly args: () => string[];
  /** What the one stderr message must say. */
  readonly message: RegExp;
}

const cases: readonly BadCase[] = [
  { name: "no command", args: () => [], message: /no command given/ },
  { name: "unknown command", args: () => ["inspect"], message: /unknown command "inspect"/ },
  { name: "no file", args: () => ["check"], message: /check needs a CSV file/ },
  {
    name: "missing file",
    args: () => ["check", "nowhere.csv"],
    message: /cannot read nowhere\.csv/,
  },
  {
    name: "two files",
    args: () => ["check", SERIES_F, SERIES_F],
    message: /expected one CSV file, got 2/,
  },
  { name: "unknown option", args: () => ["check", SERIES_F, "--wobble"], message: /wobble/ },
  {
    name: "K = 0",
    args: () => ["check", SERIES_F, "--lags", "0"],
    message: /--lags must be a whole number from 1 to 69 \(the series has 70 values\)/,
  },
  {
    name: "K ≥ n",
    args: () => ["check", SERIES_F, "--lags", "70"],
    message: /--lags must be a whole number from 1 to 69/,
  },
  {
    name: "fractional K",
    args: () => ["check", SERIES_F, "--lags", "2.5"],
    message: /--lags must be a whole number/,
  },
  {
    name: "negative K",
    args: () => ["check", SERIES_F, "--lags=-3"],
    message: /--lags must be a whole number/,
  },
  {
    name: "K as text",
    args: () => ["check", SERIES_F, "--lags", "ten"],
    message: /--lags must be a number written in decimal \(got "ten"\)/,
  },
  {
    name: "alpha 0",
    args: () => ["check", SERIES_F, "--alpha", "0"],
    message: /--alpha must be a number between 0 and 1/,
  },
  {
    name: "alpha above 1",
    args: () => ["check", SERIES_F, "--alpha", "1.5"],
    message: /--alpha must be a number between 0 and 1/,
  },
  {
    name: "df ≤ 0",
    args: () => ["check", SERIES_F, "--lags", "3", "--fitted", "3"],
    message:
      /^echolot: --fitted must be a whole number from 0 to 2: the test's degrees of freedom, 3 lags minus the fitted parameters, must be at least 1 \(got 3\)$/m,
  },
  {
    name: "negative fitted",
    args: () => ["check", SERIES_F, "--fitted=-1"],
    message: /--fitted must be a whole number/,
  },
  {
    name: "unknown band kind",
    args: () => ["check", SERIES_F, "--bands", "wide"],
    message: /--bands must be one of "noise", "bartlett" or "robust" \(got "wide"\)/,
  },
  {
    name: "unknown test kind",
    args: () => ["check", SERIES_F, "--test", "portmanteau"],
    message: /--test must be one of "ljung-box", "box-pierce", "robust" or "squares"/,
  },
  {
    name: "season 1",
    args: () => ["check", SERIES_F, "--season", "1"],
    message: /--season must be a whole number from 2 to 69/,
  },
  {
    name: "audit horizon 0",
    args: () => ["audit", SERIES_F, "--horizon", "0"],
    message:
      /^echolot: --horizon must be a whole number from 1 to 69, the number of periods ahead/m,
  },
  {
    name: "audit lags below the horizon",
    args: () => ["audit", SERIES_F, "--horizon", "3", "--lags", "2"],
    message: /^echolot: --lags must be a whole number from the horizon 3 to 69 /m,
  },
  {
    name: "batch lags beyond every series",
    args: () => ["batch", twoColumns(), "--lags", "40"],
    message: /^echolot: --lags must be a whole number from 1 to 29 \(the series has 30 values\)/m,
  },
  {
    name: "batch lags beyond every series, in worker threads",
    args: () => ["batch", twoColumns(), "--lags", "40", "--workers", "2"],
    message: /^echolot: --lags must be a whole number from 1 to 29 \(the series has 30 values\)/m,
  },
  {
    name: "unknown column",
    args: () => ["check", SERIES_F, "--column", "price"],
    message: /--column price matches no column/,
  },
  {
    name: "column number out of range",
    args: () => ["check", SERIES_F, "--column", "3"],
    message: /a number from 1 to 1/,
  },
  {
    name: "text mid-series",
    args: () => ["check", column("text.csv", [...numbers(10), "oops", ...numbers(20)])],
    message: /line 12, column 1 \("value"\) of .*text\.csv holds "oops", which is not a number/,
  },
  {
    name: "boolean text",
    args: () => ["check", column("bool.csv", [...numbers(5), "TRUE", ...numbers(30)])],
    message: /line 7, column 1 .* holds "TRUE"/,
  },
  {
    name: "non-finite number",
    args: () => ["check", column("inf.csv", [...numbers(5), "1e999", ...numbers(30)])],
    message: /line 7, column 1 .* holds 1e999, which is not a finite number/,
  },
  {
    name: "Infinity spelled out",
    args: () => ["check", column("inf2.csv", [...numbers(5), "Infinity", ...numbers(30)])],
    message: /line 7, column 1 .* holds "Infinity"/,
  },
  {
    name: "blank-only column",
    args: () => ["check", csvFile("blank.csv", "a,b\n1,\n2,NA\n3,\n"), "--column", "b"],
    message: /has no values/,
  },
  {
    name: "one value",
    args: () => ["check", column("one.csv", ["4"])],
    message: /needs at least 3 values; the series has 1 value/,
  },
  {
    name: "constant series",
    args: () => ["check", column("flat.csv", Array(30).fill("2.5"))],
    message: /is constant \(every value is 2\.5\)/,
  },
  {
    name: "header only",
    args: () => ["check", csvFile("header.csv", "value\n")],
    message: /has no column of numbers/,
  },
  {
    name: "ragged CSV",
    args: () => ["check", csvFile("ragged.csv", "a,b\n1,2\n3\n4,5\n")],
    message: /line 3 of .*ragged\.csv has 1 field where line 1 has 2/,
  },
  {
    name: "no numeric column",
    args: () => ["check", csvFile("words.csv", "a\nx\ny\n")],
    message: /has no column of numbers/,
  },
];

describe("echolot with bad input or arguments", () => {
  it.each(cases)(
    "$name: exit 2, one clear message on stderr, nothing on stdout",
    ({ args, message }) => {
      const argv = args();
      const result = runCli(argv);
      expect(result.status, `exit status of ${argv.join(" ")}`).toBe(2);
      expect(result.stdout, `stdout of ${argv.join(" ")}`).toBe("");
      const firstLine = result.stderr.split("\n")[0] ?? "";
      expect(firstLine, `stderr of ${argv.join(" ")}`).toMatch(/^echolot: /);
      expect(result.stderr).toMatch(message);
    },
  );

  it("has at least 20 distinct cases", () => {
    expect(new Set(cases.map((c) => c.name)).size).toBeGreaterThanOrEqual(20);
  });
});

describe("echolot option parsing", () => {
  it("writes a parser complaint as one line", () => {
    const result = runCli(["check", SERIES_F, "--fitted", "-1"]);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe("");
    expect(result.stderr.trim().split("\n")).toHaveLength(1);
    expect(result.stderr).toMatch(/--fitted/);
  });
});

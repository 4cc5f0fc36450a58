/**
 * What `echolot --help` and `echolot COMMAND --help` print: the commands, and each command's own
 * usage and options. The option lines are made from the list of options the command accepts
 * (the same list its parser reads), so help and parser cannot disagree. Within 80 columns.
 */
import { appendLines, wrapText } from "../report/textWrap";
import { optionUsage } from "./options";

/** What each command does, in one line. */
export const COMMAND_SUMMARIES: Readonly<Record<string, string>> = {
  check: "the lag table, verdict and side checks of one column",
  audit: "the forecast audit of many error series: bias and dependence, ranked",
  batch: "one verdict per series with false-discovery q-values, ranked",
  report: "a self-contained HTML report (a batch report for many columns)",
  workbook: "an .xlsx workbook with the data and a portable report",
  fdr: "merges the parts of a batch split across machines",
  demo: "runs the invented demo scenarios",
};

/** The file argument of each command. */
const ARGUMENTS: Readonly<Record<string, string>> = {
  check: "FILE.csv|-",
  audit: "FILE.csv|- --horizon H",
  batch: "FILE.csv|-",
  report: "FILE.csv|- --out report.html",
  workbook: "FILE.csv|- --out book.xlsx",
  fdr: "[PART.jsonl … | -]",
  demo: "",
};

/** Each option's meaning (options.ts names its value). */
const OPTION_HELP: Readonly<Record<string, string>> = {
  column: "the column to read, by header or number from 1 (default: the first series)",
  lags: "lags tested (default min(10, n/5); with a season, 2 seasons)",
  season: "season length in periods: lags M and 2M are watched",
  fitted: "parameters of the fitted model, taken off the joint test's df",
  alpha: "the level of every test and of the false-discovery step (default 0.05)",
  bands: "the band kind (default noise)",
  test: "the joint test (default ljung-box)",
  horizon: "how many periods ahead the forecasts were made (1: one step ahead)",
  json: "every figure as one JSON document",
  format: "the output: text (default), json, csv or jsonl (one line a series)",
  csv: "the ranked table as CSV (the same as --format csv)",
  top: "only the first N ranked rows",
  kept: "only the rows kept after the false-discovery step (q-value ≤ alpha)",
  reasons: "the reason of each shown row that is not clear, under the table",
  out: "write to FILE, never over an existing file unless --force",
  force: "let --out replace an existing file",
  batch: "one portable row per column of numbers",
  delimiter: "the field delimiter (default: found from the first lines)",
  decimal: "the decimal mark (default: found from the file)",
  na: "more words read as gaps, such as nan,null",
  percent: "read 1.5% as 0.015",
  "no-header": "the first line is data, not column names",
  id: "long format: the column naming each item",
  time: "long format: the column of dates or period numbers",
  value: "long format: the column of values",
};

/** The formats each command writes, for its --format line. */
const FORMATS: Readonly<Record<string, string>> = {
  batch: "text (default), json, csv or jsonl (one line a series, for fdr)",
  audit: "text (default), json or csv",
  fdr: "text (default), json, csv or jsonl",
};

function optionLine(name: string, command: string): string[] {
  const meaning = OPTION_HELP[name] ?? "";
  const text = name === "format" ? `the output: ${FORMATS[command] ?? meaning}` : meaning;
  const left = `  ${optionUsage(name)}`;
  const indent = " ".repeat(26);
  if (left.length <= 24) return wrapText(text, indent, left.padEnd(26));
  return [left, ...wrapText(text, indent, indent)];
}

/** `echolot COMMAND --help`: usage, what it does, and each of its options. */
export function commandHelp(command: string, options: readonly string[]): string {
  const args = ARGUMENTS[command] ?? "";
  const lines = [
    `usage: echolot ${command}${args === "" ? "" : ` ${args}`}${options.length > 0 ? " [options]" : ""}`,
    "",
    ...wrapText(`${command}: ${COMMAND_SUMMARIES[command] ?? ""}.`),
  ];
  lines.push("", "options:");
  for (const name of options) appendLines(lines, optionLine(name, command));
  lines.push(`${"  --help, -h".padEnd(26)}this text`);
  return lines.join("\n");
}

/** `echolot --help`: the commands. */
export function mainHelp(): string {
  return [
    "usage: echolot COMMAND FILE.csv|- [options]",
    "",
    "commands:",
    ...Object.entries(COMMAND_SUMMARIES).map(([name, text]) => `  ${name.padEnd(10)}${text}`),
    "",
    ...wrapText(
      "echolot COMMAND --help prints a command's usage and options; echolot --version prints Echolot's version.",
    ),
  ].join("\n");
}

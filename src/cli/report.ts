/**
 * `echolot report FILE.csv [check options] --out report.html`: the pane's view of one column as a
 * self-contained HTML file — verdict badge, evidence chart (correlation, partial, squared
 * deviations), joint-test ribbon, explanation and figures; no script, nothing loaded from
 * anywhere.
 */
import { writeFileSync } from "node:fs";
import { BADGES, seriesReport, seriesReportHtml } from "../report";
import { columnSeries, pickColumn, readCsv } from "./csv";
import { UsageError } from "./errors";
import { lagOptionsFrom, parseCommand } from "./options";

export function runReport(argv: readonly string[]): string {
  const { file, values } = parseCommand(argv);
  if (file === undefined) {
    throw new UsageError("report needs a CSV file: echolot report FILE.csv --out report.html");
  }
  const out = values.out;
  if (typeof out !== "string" || out.trim() === "") {
    throw new UsageError("report needs --out FILE.html: where to write the report");
  }
  if (values.json === true)
    throw new UsageError("--json does not apply to report; use check --json");
  const options = lagOptionsFrom(values);
  const table = readCsv(file);
  const column = pickColumn(table, typeof values.column === "string" ? values.column : undefined);
  const report = seriesReport(columnSeries(table, column), options);
  const html = seriesReportHtml(report, `${file}, column ${column + 1}`);
  try {
    writeFileSync(out, html, "utf8");
  } catch {
    throw new UsageError(`cannot write ${out}: check that its folder exists and is writable`);
  }
  const badge = BADGES[report.table.verdict.word];
  const name = report.table.label === "" ? "the series" : report.table.label;
  return `wrote ${out}: ${name}, ${badge.shape} ${badge.word}`;
}

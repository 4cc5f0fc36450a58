/**
 * `echolot report FILE [check options] --out report.html [--force]`: the pane's view of one
 * column as a self-contained HTML file — verdict badge, evidence chart (correlation, partial,
 * squared deviations), joint-test ribbon, explanation and figures; no script, nothing loaded from
 * anywhere. The file is written safely (output.ts): never over the input, never over an existing
 * file without --force, never half-written.
 */
import { BADGES, seriesReport, seriesReportHtml } from "../report";
import { readingFrom } from "./csv";
import { UsageError } from "./errors";
import { readOneSeries } from "./input";
import {
  LAG_OPTIONS,
  lagOptionsFrom,
  READ_OPTIONS,
  textOption,
  type ParsedCommand,
} from "./options";
import { writeOutFile } from "./output";

export const REPORT_OPTIONS = ["column", ...LAG_OPTIONS, ...READ_OPTIONS, "out", "force"];

export async function runReport({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined) {
    throw new UsageError("report needs a CSV file: echolot report FILE.csv --out report.html");
  }
  const out = textOption(values, "out");
  if (out === undefined || out.trim() === "") {
    throw new UsageError("report needs --out FILE.html: where to write the report");
  }
  const options = lagOptionsFrom(values);
  const { series, source, column } = await readOneSeries(
    readingFrom(file, values),
    textOption(values, "column"),
  );
  const report = seriesReport(series, options);
  const html = seriesReportHtml(report, `${file}, column ${column.index + 1}`);
  writeOutFile(out, html, values.force === true, [file]);
  const badge = BADGES[report.table.verdict.word];
  const name = report.table.label === "" ? "the series" : report.table.label;
  return `read: ${source}\nwrote ${out}: ${name}, ${badge.shape} ${badge.word}`;
}

/**
 * `echolot report FILE.csv [check options] --out report.html`: a self-contained HTML file. One
 * column (named with --column, or the only column of numbers) gives the pane's view of it —
 * verdict badge, evidence chart (correlation, partial, squared deviations), joint-test ribbon,
 * explanation, side checks and figures. A file with several columns of numbers gives a batch
 * report: the ranked table, then each column's chart on demand. The report names the input by its
 * file name only: a folder path says nothing to a reader and may say too much about the writer.
 */
import { writeFileSync } from "node:fs";
import { basename } from "node:path";
import { batchCheck, isEcholotError, type LagOptions, type Series } from "../core";
import {
  BADGES,
  batchReportHtml,
  seriesReport,
  seriesReportHtml,
  settingsLine,
  type BatchItem,
} from "../report";
import { columnSeries, numericColumns, pickColumn, readCsv } from "./csv";
import { UsageError } from "./errors";
import { lagOptionsFrom, parseCommand } from "./options";
import { ECHOLOT_VERSION } from "./version";

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
  const meta = { made: new Date(), version: ECHOLOT_VERSION };
  const name = basename(file);
  const chosen = typeof values.column === "string" ? values.column : undefined;
  const columns = chosen === undefined ? numericColumns(table) : [];
  let html: string;
  let said: string;
  if (columns.length >= 2) {
    ({ html, said } = batchReport(columns, options, { ...meta, title: name }));
  } else {
    const column = pickColumn(table, chosen);
    const report = seriesReport(columnSeries(table, column), options);
    const label = table.headers[column] ?? `column ${column + 1}`;
    html = seriesReportHtml(report, { ...meta, source: `${name}, column “${label}”` });
    const badge = BADGES[report.table.verdict.word];
    const shown = report.table.label === "" ? "the series" : report.table.label;
    said = `${shown}, ${badge.shape} ${badge.word}`;
  }
  try {
    writeFileSync(out, html, "utf8");
  } catch {
    throw new UsageError(`cannot write ${out}: check that its folder exists and is writable`);
  }
  return `wrote ${out}: ${said}`;
}

function batchReport(
  columns: readonly Series[],
  options: LagOptions,
  meta: { made: Date; version: string; title: string },
): { html: string; said: string } {
  const batch = batchCheck(columns, options);
  const items: BatchItem[] = columns.map((series, i) => {
    try {
      return seriesReport(series, options);
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      return { label: batch.rows[i]?.label ?? `series ${i + 1}`, reason: error.message };
    }
  });
  const first = items.find((item) => "table" in item);
  const settings =
    first === undefined || !("table" in first) ? "" : `${settingsLine(first.table)} (each series)`;
  const html = batchReportHtml(batch, items, {
    ...meta,
    source: meta.title,
    settings: `${columns.length} columns of numbers · ${settings}`,
  });
  return {
    html,
    said: `batch report of ${columns.length} columns, ${batch.flaggedFdr} flagged after the false-discovery step`,
  };
}

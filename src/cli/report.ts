/**
 * `echolot report FILE [check options] --out report.html [--force]`: a self-contained HTML file.
 * One column (named with --column, or the only series in the file) gives the pane's view of it —
 * verdict badge, evidence chart (correlation, partial, squared deviations), joint-test ribbon,
 * explanation, side checks and figures. A file with several series gives a batch report: the
 * ranked table, then each series' chart on demand. The report names the input by its file name
 * only: a folder path says nothing to a reader and may say too much about the writer. The file is
 * written safely (output.ts): never over the input, never over an existing file without --force,
 * never half-written.
 */
import { basename } from "node:path";
import { batchCheck, isEcholotError, seriesName, type LagOptions, type Series } from "../core";
import {
  BADGES,
  batchReportHtml,
  seriesReport,
  seriesReportHtml,
  settingsLine,
  type BatchItem,
} from "../report";
import { readingFrom } from "./csv";
import { UsageError } from "./errors";
import { readManySeries, readOneSeries } from "./input";
import {
  LAG_OPTIONS,
  lagOptionsFromFlags,
  READ_OPTIONS,
  textOption,
  type ParsedCommand,
} from "./options";
import { writeOutFile } from "./output";
import { ECHOLOT_VERSION } from "./version";

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
  const options = lagOptionsFromFlags(values);
  const meta = { made: new Date(), version: ECHOLOT_VERSION };
  const name = file === "-" ? "standard input" : basename(file);
  const chosen = textOption(values, "column");
  let html: string;
  let said: string;
  let source: string;
  let single: { series: Series; label: string } | undefined;
  if (chosen === undefined) {
    const many = await readManySeries(readingFrom(file, values), values);
    source = many.source;
    if (many.series.length >= 2) {
      ({ html, said } = batchReport(many.series, options, { ...meta, title: name }));
    } else {
      const series = many.series[0];
      if (series === undefined) throw new UsageError(`${name} has no series to report on`);
      const column = many.columns?.[0]?.index ?? 0;
      single = { series, label: seriesName(series.label, "cell", { column }) };
    }
  } else {
    const one = await readOneSeries(readingFrom(file, values), chosen);
    source = one.source;
    single = { series: one.series, label: one.column.name };
  }
  if (single !== undefined) {
    const report = seriesReport(single.series, options);
    html = seriesReportHtml(report, { ...meta, source: `${name}, column “${single.label}”` });
    const badge = BADGES[report.headline.word];
    said = `${single.label}, ${badge.shape} ${report.headline.title}`;
  }
  writeOutFile(out, html!, values.force === true, [file]);
  return `read: ${source}\nwrote ${out}: ${said!}`;
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
      return { label: seriesName(series.label, "cell", { item: i }), reason: error.message };
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
    said: `batch report of ${columns.length} columns, ${batch.flaggedFdr} kept after the false-discovery step${batch.biasFlaggedFdr > 0 ? `, ${batch.biasFlaggedFdr} biased` : ""}`,
  };
}

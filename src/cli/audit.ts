/**
 * `echolot audit FILE --horizon H [--season M] [--alpha A] [--lags K] [--json]`: the forecast
 * audit of every series — every numeric column, or every id in long format (`--id COL --time COL
 * --value COL`) — each an error series of H-step-ahead forecasts. Every column or id not audited
 * is listed with why. Each series' audit runs in worker threads (`--workers N`, default every
 * core; parallel.ts) with the same results for any N.
 */
import { auditBatchOf, resolveAlpha, type ForecastAuditOptions } from "../core";
import { auditText } from "../report/auditText";
import { UsageError } from "./errors";
import { notAnalysedLines } from "./input";
import { auditJson, toJsonText } from "./json";
import { LONG_OPTIONS, numberOption, READ_OPTIONS, type ParsedCommand } from "./options";
import { eachSeriesOf } from "./parallel";

export const AUDIT_OPTIONS = [
  "horizon",
  "season",
  "alpha",
  "lags",
  ...READ_OPTIONS,
  ...LONG_OPTIONS,
  "json",
  "workers",
];

export async function runAudit({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined) {
    throw new UsageError("audit needs a CSV file: echolot audit FILE.csv --horizon H");
  }
  const horizon = numberOption("horizon", values.horizon);
  if (horizon === undefined) {
    throw new UsageError(
      "audit needs --horizon H, how many periods ahead the forecasts were made (1 for one-step-ahead)",
    );
  }
  const options: ForecastAuditOptions = {
    horizon,
    season: numberOption("season", values.season) ?? null,
    alpha: numberOption("alpha", values.alpha) ?? null,
    maxLag: numberOption("lags", values.lags) ?? null,
  };
  const alpha = resolveAlpha(options.alpha);
  // Each series' audit in worker threads; the q-values across them once, here, in series order.
  const { many, results: entries } = await eachSeriesOf(
    file,
    values,
    { kind: "audit", options },
    "auditing",
  );
  if (entries.length === 0) {
    throw new UsageError(
      `${file} has no series to audit: ${many.notAnalysed.map((n) => `${n.name} ${n.reason}`).join("; ")}`,
    );
  }
  const result = auditBatchOf(entries, alpha);
  return values.json === true
    ? toJsonText({
        source: many.source,
        ...auditJson(result, options),
        notAnalysed: many.notAnalysed,
      })
    : [
        `read: ${many.source}`,
        "",
        auditText(result, horizon, options.season ?? null),
        ...notAnalysedLines(many),
      ].join("\n");
}

/**
 * `echolot audit FILE --horizon H [options]`: the forecast audit of every series — every numeric
 * column, or every id in long format (`--id COL --time COL --value COL`) — each an error series
 * of H-step-ahead forecasts, ranked as batch ranks (the series to look at first on top). Every
 * column or id not audited is listed with why. `--top N` and `--kept` choose rows, `--reasons`
 * adds each one's reason, `--csv` writes the ranked table as CSV, `--out FILE` writes to a file.
 * Each series' audit runs in worker threads (`--workers N`, default every core; parallel.ts) with
 * the same results for any N; the q-values across them are taken once, here.
 */
import { auditBatchOf, resolveAlpha, type ForecastAuditOptions } from "../core";
import { rankedAuditItems, selectRanked } from "../report/batchOrder";
import { auditText } from "../report/auditText";
import { auditCsv } from "../report/rankedCsv";
import { UsageError } from "./errors";
import { auditJson } from "./jsonBatch";
import {
  formatOption,
  LONG_OPTIONS,
  numberOption,
  RANKED_OPTIONS,
  READ_OPTIONS,
  selectionOption,
  type ParsedCommand,
} from "./options";
import { eachSeriesOf } from "./parallel";
import { deliverRanked } from "./rankedOutput";

export const AUDIT_OPTIONS = [
  "horizon",
  "season",
  "alpha",
  "lags",
  ...LONG_OPTIONS,
  ...READ_OPTIONS,
  "json",
  "format",
  ...RANKED_OPTIONS,
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
  const format = formatOption(values, ["text", "json", "csv"]) as "text" | "json" | "csv";
  const selection = selectionOption(values);
  const options: ForecastAuditOptions = {
    horizon,
    season: numberOption("season", values.season) ?? null,
    alpha: numberOption("alpha", values.alpha) ?? null,
    maxLag: numberOption("lags", values.lags) ?? null,
  };
  // A bad alpha is refused here, once, not in each worker.
  resolveAlpha(options.alpha);
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
  const result = auditBatchOf(entries);
  const rows = {
    shown: selectRanked(rankedAuditItems(result), selection).length,
    total: result.items.length,
  };
  return deliverRanked(format, many, file, values, rows, {
    csv: () => auditCsv(result, selection),
    json: () => auditJson(result, selection),
    text: (leftOut) =>
      auditText(result, {
        selection,
        reasons: values.reasons === true,
        leftOut,
      }),
  });
}

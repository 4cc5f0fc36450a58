/**
 * `echolot audit FILE --horizon H [options]`: the forecast audit of every series — every numeric
 * column, or every id in long format (`--id COL --time COL --value COL`) — each an error series
 * of H-step-ahead forecasts, ranked as batch ranks (the series to look at first on top). Every
 * column or id not audited is listed with why. `--top N` and `--kept` choose rows, `--reasons`
 * adds each one's reason, `--csv` writes the ranked table as CSV, `--out FILE` writes to a file.
 */
import { auditBatch, type ForecastAuditOptions } from "../core";
import { rankedAuditItems, selectRanked } from "../report/batchOrder";
import { auditText } from "../report/auditText";
import { auditCsv } from "../report/rankedCsv";
import { readingFrom } from "./csv";
import { UsageError } from "./errors";
import { readManySeries } from "./input";
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
  const many = await readManySeries(readingFrom(file, values), values);
  if (many.series.length === 0) {
    throw new UsageError(
      `${file} has no series to audit: ${many.notAnalysed.map((n) => `${n.name} ${n.reason}`).join("; ")}`,
    );
  }
  const result = auditBatch(many.series, options);
  const rows = {
    shown: selectRanked(rankedAuditItems(result), selection).length,
    total: result.items.length,
  };
  return deliverRanked(format, many, file, values, rows, {
    csv: () => auditCsv(result, selection),
    json: () => auditJson(result, options, selection),
    text: (leftOut) =>
      auditText(result, {
        horizon,
        season: options.season ?? null,
        selection,
        reasons: values.reasons === true,
        leftOut,
      }),
  });
}

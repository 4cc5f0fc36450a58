/**
 * `echolot audit FILE.csv --horizon H [--season M] [--alpha A] [--lags K] [--json]`: the forecast
 * audit of every numeric column, each an error series of H-step-ahead forecasts.
 */
import { auditBatch, type ForecastAuditOptions } from "../core";
import { auditText } from "../report/auditText";
import { numericColumns, readCsv } from "./csv";
import { UsageError } from "./errors";
import { auditJson, toJsonText } from "./json";
import { numberOption, parseCommand } from "./options";

const AUDIT_OPTIONS = new Set(["horizon", "season", "alpha", "lags", "json"]);

export function runAudit(argv: readonly string[]): string {
  const { file, values } = parseCommand(argv);
  if (file === undefined) {
    throw new UsageError("audit needs a CSV file: echolot audit FILE.csv --horizon H");
  }
  for (const name of Object.keys(values)) {
    if (values[name] !== undefined && !AUDIT_OPTIONS.has(name)) {
      throw new UsageError(
        `audit does not take --${name}; it takes --horizon, --season, --alpha, --lags and --json`,
      );
    }
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
  const result = auditBatch(numericColumns(readCsv(file)), options);
  return values.json === true
    ? toJsonText(auditJson(result, options))
    : auditText(result, horizon, options.season ?? null);
}

/**
 * The command-line options shared by `check` (and the commands built on it), turned into the
 * core's options. Values are read strictly: "12abc" is refused, not read as 12.
 */
import { parseArgs } from "node:util";
import { parseBandKind, parseTestKind, type LagOptions } from "../core";
import { UsageError } from "./errors";

const LAG_OPTION_SPEC = {
  column: { type: "string" },
  lags: { type: "string" },
  season: { type: "string" },
  fitted: { type: "string" },
  alpha: { type: "string" },
  bands: { type: "string" },
  test: { type: "string" },
  json: { type: "boolean" },
  out: { type: "string" },
  horizon: { type: "string" },
  help: { type: "boolean" },
} as const;

export interface ParsedCommand {
  readonly file: string | undefined;
  readonly values: Readonly<Record<string, string | boolean | undefined>>;
}

export function parseCommand(argv: readonly string[]): ParsedCommand {
  try {
    const { values, positionals } = parseArgs({
      args: [...argv],
      options: LAG_OPTION_SPEC,
      allowPositionals: true,
      strict: true,
    });
    if (positionals.length > 1) {
      throw new UsageError(
        `expected one CSV file, got ${positionals.length}: ${positionals.join(" ")}`,
      );
    }
    return { file: positionals[0], values };
  } catch (error) {
    if (error instanceof UsageError) throw error;
    throw new UsageError((error as Error).message.replace(/\s*\n\s*/g, " "));
  }
}

/** A number option read strictly; `undefined` when absent. */
export function numberOption(name: string, text: string | boolean | undefined): number | undefined {
  if (text === undefined || typeof text === "boolean") return undefined;
  const trimmed = text.trim();
  const value = trimmed === "" ? NaN : Number(trimmed);
  if (!Number.isFinite(value)) throw new UsageError(`--${name} must be a number (got "${text}")`);
  return value;
}

export function lagOptionsFrom(values: ParsedCommand["values"]): LagOptions {
  const text = (name: string) => {
    const v = values[name];
    return typeof v === "string" ? v : undefined;
  };
  return {
    maxLag: numberOption("lags", values.lags) ?? null,
    season: numberOption("season", values.season) ?? null,
    fittedParams: numberOption("fitted", values.fitted) ?? null,
    alpha: numberOption("alpha", values.alpha) ?? null,
    bandKind: parseBandKind(text("bands")),
    testKind: parseTestKind(text("test")),
  };
}

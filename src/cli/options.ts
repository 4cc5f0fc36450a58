/**
 * The command-line options, read strictly and the same way by every command: each command names
 * the options it takes and refuses any other; an option given twice is refused (not "the last
 * one wins"); numbers are written in decimal ("0x10", "12abc" and "1e" are refused); `--help`
 * after any command prints that command's usage.
 */
import { parseArgs } from "node:util";
import {
  isNumberText,
  parseBandKind,
  parseTestKind,
  type DecimalMark,
  type Delimiter,
  type LagOptions,
} from "../core";
import { UsageError } from "./errors";

type Spec = { readonly type: "string" | "boolean" };

/** Every option of the command line, by name, with how it is spelled in usage. */
const OPTIONS: Readonly<Record<string, Spec>> = {
  column: { type: "string" },
  lags: { type: "string" },
  season: { type: "string" },
  fitted: { type: "string" },
  alpha: { type: "string" },
  bands: { type: "string" },
  test: { type: "string" },
  horizon: { type: "string" },
  json: { type: "boolean" },
  format: { type: "string" },
  out: { type: "string" },
  force: { type: "boolean" },
  batch: { type: "boolean" },
  delimiter: { type: "string" },
  decimal: { type: "string" },
  na: { type: "string" },
  percent: { type: "boolean" },
  "no-header": { type: "boolean" },
  id: { type: "string" },
  time: { type: "string" },
  value: { type: "string" },
  workers: { type: "string" },
  help: { type: "boolean" },
};

/** The options that say how a file is read, taken by every command that reads one. */
export const READ_OPTIONS = ["delimiter", "decimal", "na", "percent", "no-header"] as const;
/** The options of the lag table and verdict. */
export const LAG_OPTIONS = ["lags", "season", "fitted", "alpha", "bands", "test"] as const;
/** The long-format columns. */
export const LONG_OPTIONS = ["id", "time", "value"] as const;

export type OptionValues = Readonly<Record<string, string | boolean | undefined>>;

export interface ParsedCommand {
  readonly files: readonly string[];
  readonly values: OptionValues;
  /** `--help` was given: print the command's usage and nothing else. */
  readonly help: boolean;
}

/**
 * Parses a command's arguments against the options it takes. `maxFiles` is how many file
 * arguments it takes (Infinity for `fdr`); `-` is standard input.
 */
export function parseCommand(
  command: string,
  argv: readonly string[],
  accepted: readonly string[],
  maxFiles = 1,
): ParsedCommand {
  const options: Record<string, Spec> = { help: { type: "boolean" } };
  for (const name of accepted) options[name] = OPTIONS[name] as Spec;
  let parsed: ReturnType<typeof parseArgs>;
  try {
    parsed = parseArgs({
      args: [...argv],
      options,
      allowPositionals: true,
      strict: true,
      tokens: true,
    });
  } catch (error) {
    const message = (error as Error).message.replace(/\s*\n\s*/g, " ");
    const unknown = /Unknown option '(--?[^']+)'/.exec(message);
    if (unknown !== null) {
      const takes = accepted.map((a) => `--${a}`).join(", ");
      throw new UsageError(
        `${command} does not take ${unknown[1]}${takes === "" ? "; it takes no options" : `; it takes ${takes}`}`,
      );
    }
    throw new UsageError(message);
  }
  const seen = new Set<string>();
  for (const token of parsed.tokens ?? []) {
    if (token.kind !== "option") continue;
    if (seen.has(token.name)) {
      throw new UsageError(`--${token.name} is given twice; give it once`);
    }
    seen.add(token.name);
  }
  const values = parsed.values as OptionValues;
  const files = parsed.positionals;
  if (values.help !== true && files.length > maxFiles) {
    throw new UsageError(`expected one CSV file, got ${files.length}: ${files.join(" ")}`);
  }
  return { files, values, help: values.help === true };
}

/** A string option, or undefined when absent. */
export function textOption(values: OptionValues, name: string): string | undefined {
  const v = values[name];
  return typeof v === "string" ? v : undefined;
}

/** A number option read strictly (decimal notation only); `undefined` when absent. */
export function numberOption(name: string, text: string | boolean | undefined): number | undefined {
  if (text === undefined || typeof text === "boolean") return undefined;
  const value = isNumberText(text) ? Number(text.trim()) : NaN;
  if (!Number.isFinite(value)) {
    throw new UsageError(`--${name} must be a number written in decimal (got "${text}")`);
  }
  return value;
}

export function lagOptionsFrom(values: OptionValues): LagOptions {
  return {
    maxLag: numberOption("lags", values.lags) ?? null,
    season: numberOption("season", values.season) ?? null,
    fittedParams: numberOption("fitted", values.fitted) ?? null,
    alpha: numberOption("alpha", values.alpha) ?? null,
    bandKind: parseBandKind(textOption(values, "bands")),
    testKind: parseTestKind(textOption(values, "test")),
  };
}

/** `--delimiter , | ; | tab`. */
export function delimiterOption(values: OptionValues): Delimiter | undefined {
  const text = textOption(values, "delimiter");
  if (text === undefined) return undefined;
  if (text === "," || text === ";") return text;
  if (text === "tab" || text === "\t" || text === "\\t") return "\t";
  throw new UsageError(`--delimiter must be "," or ";" or "tab" (got "${text}")`);
}

/** `--decimal . | ,`. */
export function decimalOption(values: OptionValues): DecimalMark | undefined {
  const text = textOption(values, "decimal");
  if (text === undefined) return undefined;
  if (text === "." || text === ",") return text;
  throw new UsageError(`--decimal must be "." or "," (got "${text}")`);
}

/** `--na WORD[,WORD…]`: further words read as gaps. */
export function gapWordsOption(values: OptionValues): string[] {
  const text = textOption(values, "na");
  if (text === undefined) return [];
  const words = text.split(",").map((w) => w.trim());
  if (words.some((w) => w === "")) {
    throw new UsageError(
      `--na takes words separated by commas, such as --na nan,null (got "${text}")`,
    );
  }
  return words;
}

/** The output format of batch-like commands: `--json` or `--format text|json|jsonl`. */
export function formatOption(
  values: OptionValues,
  allowed: readonly string[],
): "text" | "json" | "jsonl" {
  const format = textOption(values, "format");
  if (format !== undefined && values.json === true) {
    throw new UsageError("give either --json or --format, not both");
  }
  if (values.json === true) return "json";
  if (format === undefined) return "text";
  if (!allowed.includes(format)) {
    throw new UsageError(
      `--format must be ${allowed.map((a) => `"${a}"`).join(" or ")} (got "${format}")`,
    );
  }
  return format as "text" | "json" | "jsonl";
}

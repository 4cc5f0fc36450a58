/**
 * The command-line options, read strictly and the same way by every command: each command names
 * the options it takes and refuses any other with its own one-line message (never the parser's
 * text); an option given twice is refused (not "the last one wins"); numbers are written in
 * decimal ("0x10", "12abc" and "1e" are refused); `--help` or `-h` anywhere after a command
 * prints that command's help, whatever else is on the line.
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
import type { RankedSelection } from "../report/batchOrder";
import { UsageError } from "./errors";

/** An option's kind and, for a string option, how usage names its value. */
type Spec = { readonly type: "boolean" } | { readonly type: "string"; readonly value: string };

/** The options that say how a file is read, taken by every command that reads one. */
const READ_SPECS = {
  delimiter: { type: "string", value: ",|;|tab" },
  decimal: { type: "string", value: ".|," },
  na: { type: "string", value: "WORD,…" },
  percent: { type: "boolean" },
  "no-header": { type: "boolean" },
} as const satisfies Readonly<Record<string, Spec>>;

/** The options of the lag table and verdict. */
const LAG_SPECS = {
  lags: { type: "string", value: "K" },
  season: { type: "string", value: "M" },
  fitted: { type: "string", value: "P" },
  alpha: { type: "string", value: "A" },
  bands: { type: "string", value: "noise|bartlett|robust" },
  test: { type: "string", value: "ljung-box|box-pierce|robust|squares" },
} as const satisfies Readonly<Record<string, Spec>>;

/** The long-format columns. */
const LONG_SPECS = {
  id: { type: "string", value: "COL" },
  time: { type: "string", value: "COL" },
  value: { type: "string", value: "COL" },
} as const satisfies Readonly<Record<string, Spec>>;

/** What to show of a ranked table, and where to write it (batch, audit, fdr). */
const RANKED_SPECS = {
  top: { type: "string", value: "N" },
  kept: { type: "boolean" },
  reasons: { type: "boolean" },
  csv: { type: "boolean" },
  out: { type: "string", value: "FILE" },
  force: { type: "boolean" },
} as const satisfies Readonly<Record<string, Spec>>;

/** The options a command takes on their own: the column, the audit's horizon, output and work. */
const SINGLE_SPECS = {
  column: { type: "string", value: "NAME|N" },
  horizon: { type: "string", value: "H" },
  json: { type: "boolean" },
  format: { type: "string", value: "FORMAT" },
  batch: { type: "boolean" },
  workers: { type: "string", value: "N" },
} as const satisfies Readonly<Record<string, Spec>>;

/** Every option by name, for parsing and usage: the groups above together. */
const OPTIONS: Readonly<Record<string, Spec>> = {
  ...READ_SPECS,
  ...LAG_SPECS,
  ...LONG_SPECS,
  ...RANKED_SPECS,
  ...SINGLE_SPECS,
};

function namesOf<T extends object>(specs: T): readonly (keyof T & string)[] {
  return Object.keys(specs) as (keyof T & string)[];
}

/** Each group's names, for the commands' lists of the options they take. */
export const READ_OPTIONS = namesOf(READ_SPECS);
export const LAG_OPTIONS = namesOf(LAG_SPECS);
export const LONG_OPTIONS = namesOf(LONG_SPECS);
export const RANKED_OPTIONS = namesOf(RANKED_SPECS);

export type OptionValues = Readonly<Record<string, string | boolean | undefined>>;

export interface ParsedCommand {
  readonly files: readonly string[];
  readonly values: OptionValues;
  /** `--help` was given: print the command's help and nothing else. */
  readonly help: boolean;
}

/** How usage spells an option: "--lags K", "--json". */
export function optionUsage(name: string): string {
  const spec = OPTIONS[name];
  return spec?.type === "string" ? `--${name} ${spec.value}` : `--${name}`;
}

/** Whether `argv` asks for help: `--help` or `-h` before any `--`. */
export function asksForHelp(argv: readonly string[]): boolean {
  for (const arg of argv) {
    if (arg === "--") return false;
    if (arg === "--help" || arg === "-h") return true;
  }
  return false;
}

/** Edit distance of two short names (insertions, deletions, substitutions), for "did you mean". */
function distance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      current[j] = Math.min(
        (previous[j] as number) + 1,
        (current[j - 1] as number) + 1,
        (previous[j - 1] as number) + cost,
      );
    }
    previous = current;
  }
  return previous[b.length] as number;
}

function unknownOption(command: string, raw: string, accepted: readonly string[]): UsageError {
  const name = raw.replace(/^-+/, "").toLowerCase();
  const near = accepted.find((a) => a === name || distance(a, name) <= (name.length > 4 ? 2 : 1));
  const hint = near === undefined ? "" : ` (did you mean --${near}?)`;
  const takes =
    accepted.length === 0
      ? `${command} takes no options`
      : `${command} takes: ${accepted.map((a) => `--${a}`).join(", ")}`;
  return new UsageError(`unknown option ${raw} for ${command}${hint}; ${takes}`);
}

/**
 * Parses a command's arguments against the options it takes. `maxFiles` is how many file
 * arguments it takes (Infinity for `fdr`); `-` is standard input. The parser runs leniently and
 * every token is checked here, so each mistake gets a message of ours.
 */
export function parseCommand(
  command: string,
  argv: readonly string[],
  accepted: readonly string[],
  maxFiles = 1,
): ParsedCommand {
  if (asksForHelp(argv)) return { files: [], values: {}, help: true };
  const options: Record<string, { type: Spec["type"] }> = {};
  for (const name of accepted) options[name] = { type: (OPTIONS[name] as Spec).type };
  const { tokens } = parseArgs({
    args: [...argv],
    options,
    allowPositionals: true,
    strict: false,
    tokens: true,
  });
  const values: Record<string, string | boolean> = {};
  const files: string[] = [];
  for (const token of tokens) {
    if (token.kind === "positional") files.push(token.value);
    if (token.kind !== "option") continue;
    const spec = accepted.includes(token.name) ? OPTIONS[token.name] : undefined;
    if (spec === undefined) throw unknownOption(command, token.rawName, accepted);
    if (token.name in values) throw new UsageError(`--${token.name} is given twice; give it once`);
    if (spec.type === "boolean") {
      if (token.value !== undefined) {
        throw new UsageError(
          `--${token.name} takes no value (got ${token.rawName}=${token.value})`,
        );
      }
      values[token.name] = true;
      continue;
    }
    if (token.value === undefined) {
      throw new UsageError(`--${token.name} needs a value: --${token.name} ${spec.value}`);
    }
    if (!token.inlineValue && token.value.startsWith("-") && token.value !== "-") {
      throw new UsageError(
        `--${token.name} needs a value: --${token.name} ${spec.value} (${token.value} after it reads as an option; a value starting with - is written --${token.name}=VALUE)`,
      );
    }
    values[token.name] = token.value;
  }
  if (files.length > maxFiles) {
    throw new UsageError(
      maxFiles === 0
        ? `${command} takes no file (got ${files.join(" ")})`
        : `expected one CSV file, got ${files.length}: ${files.join(" ")}`,
    );
  }
  return { files, values, help: false };
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

/**
 * A whole-number option from `low` to `high` (`Infinity`: no upper end), read by `numberOption`;
 * `undefined` when absent. `hint` says what the number means, in the message.
 */
export function wholeNumberOption(
  values: OptionValues,
  name: string,
  low: number,
  high: number,
  hint?: string,
): number | undefined {
  const value = numberOption(name, values[name]);
  if (value === undefined || (Number.isInteger(value) && value >= low && value <= high)) {
    return value;
  }
  const range = high === Infinity ? `from ${low}` : `from ${low} to ${high}`;
  const got = `got "${String(values[name])}"`;
  throw new UsageError(
    `--${name} must be a whole number ${range} (${hint === undefined ? got : `${hint}; ${got}`})`,
  );
}

/** The lag table and verdict options from the command's flags (`--lags`, `--season`, …). */
export function lagOptionsFromFlags(values: OptionValues): LagOptions {
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

export type OutputFormat = "text" | "json" | "jsonl" | "csv";

/**
 * The output format of batch-like commands: `--json`, `--csv` or `--format text|json|jsonl|csv`,
 * at most one of them.
 */
export function formatOption(values: OptionValues, allowed: readonly OutputFormat[]): OutputFormat {
  const format = textOption(values, "format");
  const given = [
    values.json === true ? "--json" : "",
    values.csv === true ? "--csv" : "",
    format === undefined ? "" : "--format",
  ].filter((g) => g !== "");
  if (given.length > 1) {
    throw new UsageError(`give only one of ${given.join(", ")}: each chooses the output format`);
  }
  if (values.json === true) return "json";
  if (values.csv === true) return "csv";
  if (format === undefined) return "text";
  if (!allowed.includes(format as OutputFormat)) {
    throw new UsageError(
      `--format must be ${allowed.map((a) => `"${a}"`).join(" or ")} (got "${format}")`,
    );
  }
  return format as OutputFormat;
}

/** `--top N` (a whole number from 1) and `--kept`: which ranked rows to show. */
export function selectionOption(values: OptionValues): RankedSelection {
  const top = wholeNumberOption(values, "top", 1, Infinity);
  return { top: top ?? null, keptOnly: values.kept === true };
}

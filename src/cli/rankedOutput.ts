/**
 * Where the output of batch, audit and fdr goes: standard output, or `--out FILE` written safely
 * (output.ts: never over the input, never over an existing file without --force, never
 * half-written), with one line on standard output saying what was written.
 */
import { wrapText } from "../report/textWrap";
import { UsageError } from "./errors";
import { notAnalysedLines, type ManySeries } from "./input";
import { toJsonText } from "./json";
import { textOption, type OptionValues } from "./options";
import { writeOutFile } from "./output";

export function deliver(
  output: string,
  values: OptionValues,
  inputs: readonly string[],
  said: { readonly source: string | null; readonly rows: number; readonly total: number },
): string {
  const out = textOption(values, "out");
  if (out === undefined) {
    if (values.force === true) {
      throw new UsageError("--force goes with --out FILE: it lets --out replace an existing file");
    }
    return output;
  }
  if (out.trim() === "") throw new UsageError("--out needs a file name: --out FILE");
  writeOutFile(out, output.endsWith("\n") ? output : `${output}\n`, values.force === true, inputs);
  const rows =
    said.rows === said.total ? `${said.total} rows` : `${said.rows} of ${said.total} rows`;
  return `${said.source === null ? "" : `read: ${said.source}\n`}wrote ${out}: ${rows}`;
}

/** The three ways a ranked table of many series is written; each is built only when chosen. */
export interface RankedOutputs {
  readonly csv: () => string;
  /** The JSON document (its `version` is written first, then `source`, then the rest). */
  readonly json: () => { readonly version: number };
  /** The text view, given the lines on columns or ids that were not read as series. */
  readonly text: (leftOut: readonly string[]) => string;
}

/** Writes the chosen output of batch or audit, with the line on what was read. */
export function deliverRanked(
  format: "text" | "json" | "csv",
  many: ManySeries,
  file: string,
  values: OptionValues,
  rows: { readonly shown: number; readonly total: number },
  outputs: RankedOutputs,
): string {
  let output: string;
  if (format === "csv") output = outputs.csv();
  else if (format === "json") {
    const { version, ...document } = outputs.json();
    output = toJsonText({
      version,
      source: many.source,
      ...document,
      notAnalysed: many.notAnalysed,
    });
  } else {
    const read = wrapText(`read: ${many.source}`, "  ");
    output = [...read, "", outputs.text(notAnalysedLines(many))].join("\n");
  }
  return deliver(output, values, [file], {
    source: many.source,
    rows: rows.shown,
    total: rows.total,
  });
}

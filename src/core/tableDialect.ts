/**
 * The dialect of a delimited text file as people export it: the field delimiter (comma, semicolon
 * or tab) and the decimal mark (point or comma), found from the first lines when not given.
 *
 * - Delimiter: the first of tab, semicolon, comma that occurs the same number of times (at least
 *   once) on every sampled line, quotes respected; a file whose first line holds none of them is
 *   one column. A semicolon file is the usual export where the comma is the decimal mark.
 * - Decimal mark: a comma when the delimiter is not a comma and the sampled fields hold numbers
 *   written with a decimal comma ("-0,25") and none with a decimal point.
 * - One decimal-comma number a line ("-0,272644"), on every sampled line (at least two): one
 *   column with a decimal comma. Read with the comma as delimiter it would be two columns of whole
 *   numbers whose second column is never negative, which no error or residual column is; a header
 *   row or a delimiter choice still reads such text as two columns.
 * Common practice (no source): spreadsheet programs in decimal-comma locales export `;`-separated
 * files; tab-separated text is what copying cells gives, one column one value a line.
 */
import { invalid } from "./errors";

export type Delimiter = "," | ";" | "\t";
export type DecimalMark = "." | ",";

export interface Dialect {
  readonly delimiter: Delimiter;
  readonly decimal: DecimalMark;
}

export interface DialectChoice {
  readonly delimiter?: Delimiter | undefined;
  readonly decimal?: DecimalMark | undefined;
}

const SAMPLE_LINES = 50;
const CANDIDATES: readonly Delimiter[] = ["\t", ";", ","];

/** Occurrences of the delimiter outside double quotes on one line. */
function countOutsideQuotes(line: string, delimiter: string): number {
  let count = 0;
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (c === '"') quoted = !quoted;
    else if (c === delimiter && !quoted) count++;
  }
  return count;
}

/** The first non-empty lines of the sample; the last line is dropped when the sample was cut. */
function sampleLines(sample: string, complete: boolean): string[] {
  const lines = sample.split(/\r\n|\n|\r/);
  if (!complete && lines.length > 1) lines.pop();
  const kept: string[] = [];
  for (const line of lines) {
    if (line.trim() !== "") kept.push(line);
    if (kept.length === SAMPLE_LINES) break;
  }
  return kept;
}

function detectDelimiter(lines: readonly string[], decimal: DecimalMark | undefined): Delimiter {
  const candidates = CANDIDATES.filter((d) => !(d === "," && decimal === ","));
  for (const d of candidates) {
    const first = countOutsideQuotes(lines[0] ?? "", d);
    if (first > 0 && lines.every((line) => countOutsideQuotes(line, d) === first)) return d;
  }
  const head = lines[0] ?? "";
  // No consistent delimiter: take the one of the first line (the parser then names the line
  // whose width differs), or, when the first line has none, read one column.
  for (const d of candidates) if (countOutsideQuotes(head, d) > 0) return d;
  return "\t";
}

function detectDecimal(lines: readonly string[], delimiter: Delimiter): DecimalMark {
  if (delimiter === ",") return ".";
  let commas = 0;
  let points = 0;
  for (const line of lines) {
    for (const field of line.split(delimiter)) {
      const text = field.trim().replace(/^"|"$/g, "");
      if (/^[+-]?\d*,\d+([eE][+-]?\d+)?%?$/.test(text)) commas++;
      else if (/^[+-]?\d*\.\d+([eE][+-]?\d+)?%?$/.test(text)) points++;
    }
  }
  return commas > 0 && points === 0 ? "," : ".";
}

/** Every line one number written with a decimal comma, and at least two lines. */
function decimalCommaColumn(lines: readonly string[]): boolean {
  return (
    lines.length >= 2 &&
    lines.every((line) => /^[+-]?\d+,\d+$/.test(line.trim().replace(/^"(.*)"$/, "$1")))
  );
}

/**
 * The dialect of a file from the text at its start (`complete` when that is the whole file),
 * with any choice the user gave taking precedence. A comma cannot be both delimiter and decimal
 * mark.
 */
export function detectDialect(
  sample: string,
  complete: boolean,
  given: DialectChoice = {},
): Dialect {
  if (given.delimiter === "," && given.decimal === ",") {
    invalid("the comma cannot be both the delimiter and the decimal mark");
  }
  const lines = sampleLines(sample, complete);
  if (given.delimiter === undefined && given.decimal === undefined && decimalCommaColumn(lines)) {
    return { delimiter: "\t", decimal: "," };
  }
  const delimiter = given.delimiter ?? detectDelimiter(lines, given.decimal);
  const decimal = given.decimal ?? detectDecimal(lines, delimiter);
  return { delimiter, decimal };
}

/** How a delimiter is named in messages. */
export function delimiterName(delimiter: Delimiter): string {
  return delimiter === "\t" ? "tab" : delimiter === ";" ? "semicolon" : "comma";
}

/**
 * The options of the CSV parser (csv-parse) for a dialect, the same for the CLI's stream and the
 * pane's text: every line is a record (an empty line too: it is a row of gaps), records may differ
 * in width (the table reader names the line that does), a UTF-8 byte-order mark is dropped.
 */
export function csvParseOptions(dialect: Dialect): {
  delimiter: Delimiter;
  bom: true;
  relax_column_count: true;
  skip_empty_lines: false;
} {
  return {
    delimiter: dialect.delimiter,
    bom: true,
    relax_column_count: true,
    skip_empty_lines: false,
  };
}

/**
 * Pasted cells and CSV text as series, for the standalone pane: tab-, semicolon- or
 * comma-separated (or one value per line, or values separated by spaces on one line). A first
 * row with text in it holds the column names. A column whose first value is a number is read as a
 * series; any other column (dates, names) is left aside. Empty cells and NA, N/A or #N/A are gaps;
 * any other text inside a series column is refused by the core's intake, naming its row and
 * column.
 */
import { parse } from "csv-parse/browser/esm/sync";
import {
  invalid,
  isGapText as isGap,
  isNumberColumn,
  isNumberText as isNumber,
  readTextCell,
  seriesFromValues,
  type Series,
} from "../../src/core";

function delimiterOf(text: string): string | undefined {
  const firstLine = text.split(/\r?\n/, 1)[0] ?? "";
  if (text.includes("\t")) return "\t";
  if (firstLine.includes(";") && !firstLine.includes(",")) return ";";
  if (text.includes(",")) return ",";
  return undefined;
}

function records(text: string): string[][] {
  const delimiter = delimiterOf(text);
  if (delimiter === undefined) {
    const lines = text.split(/\r?\n/).filter((line) => line.trim() !== "");
    // One line of values separated by spaces is a row; otherwise one value per line.
    if (lines.length === 1) return [(lines[0] ?? "").trim().split(/\s+/)];
    return lines.map((line) => [line.trim()]);
  }
  try {
    return parse(text, {
      delimiter,
      trim: true,
      skip_empty_lines: true,
      relax_column_count: true,
      bom: true,
    }) as string[][];
  } catch (error) {
    invalid(
      `the text is not well-formed ${delimiter === "\t" ? "tab-separated" : "CSV"} data: ${(error as Error).message}`,
    );
  }
}

export interface TextSeries {
  readonly series: Series[];
  /** Columns left aside because they do not hold numbers (dates, names). */
  readonly skipped: string[];
}

/** Reads every numeric column of the text as a series; `origin` names the text in messages. */
export function seriesFromText(text: string, origin: string): TextSeries {
  const rows = records(text);
  if (rows.length === 0) invalid(`${origin} is empty: paste or open some numbers`);

  // A single data row of several numbers is one series laid out as a row.
  const first = rows[0] ?? [];
  if (rows.length === 1 && first.length > 1 && first.every((c) => isNumber(c) || isGap(c))) {
    const values = first.map((c) => (isGap(c) ? null : Number(c)));
    return {
      series: [
        seriesFromValues(values, { describePosition: (i) => `value ${i + 1} of ${origin}` }),
      ],
      skipped: [],
    };
  }

  const hasHeader = first.some((c) => !isNumber(c) && !isGap(c));
  const headers = hasHeader ? first : first.map((_, i) => `column ${i + 1}`);
  const body = hasHeader ? rows.slice(1) : rows;
  const width = Math.max(headers.length, ...body.map((r) => r.length));
  const series: Series[] = [];
  const skipped: string[] = [];
  for (let c = 0; c < width; c++) {
    const name = headers[c] ?? `column ${c + 1}`;
    const cells = body.map((r) => r[c] ?? "");
    if (!isNumberColumn(cells)) {
      skipped.push(name);
      continue;
    }
    const values = cells.map(readTextCell);
    const rowOffset = hasHeader ? 2 : 1;
    series.push(
      seriesFromValues(values, {
        label: hasHeader ? name : "",
        labelFromFirstCell: false,
        describePosition: (i) =>
          `row ${i + rowOffset}, column ${c + 1}${hasHeader ? ` ("${name}")` : ""} of ${origin}`,
      }),
    );
  }
  if (series.length === 0) {
    invalid(
      `${origin} has no column of numbers${skipped.length > 0 ? ` (columns seen: ${skipped.join(", ")})` : ""}`,
    );
  }
  return { series, skipped };
}

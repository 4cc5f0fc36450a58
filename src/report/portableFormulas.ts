/**
 * The native-function vocabulary of the portable report and the little A1 arithmetic its plan
 * needs. Every formula of the report uses only the functions in `NATIVE_FUNCTIONS`, each present
 * in Excel 2010 and later, LibreOffice Calc and Google Sheets (their function references list
 * them all); a test holds every written formula to that list.
 *
 * In the xlsx file format the functions added in Excel 2010 are stored with the `_xlfn.` prefix
 * (ECMA-376 and Excel's "future function" convention); without it LibreOffice and older Excel read
 * #NAME?. Through office.js `range.formulas` takes the plain names, so the plan keeps plain names
 * and the file writer adds the prefix with `fileFormula`.
 */
import { cellAddress } from "./a1Address";
import type { PortableColumn } from "./portableTypes";

/** Functions the portable report may use; those marked `future` need `_xlfn.` in a file. */
export const NATIVE_FUNCTIONS: Readonly<Record<string, { readonly future: boolean }>> = {
  ABS: { future: false },
  AND: { future: false },
  "BINOM.DIST": { future: true },
  "CHISQ.DIST.RT": { future: true },
  COUNT: { future: false },
  COUNTIF: { future: false },
  IF: { future: false },
  INDEX: { future: false },
  ISNUMBER: { future: false },
  MAX: { future: false },
  MIN: { future: false },
  NA: { future: false },
  "NORM.S.DIST": { future: true },
  OR: { future: false },
  SQRT: { future: false },
  SUM: { future: false },
  SUMIF: { future: false },
  SUMPRODUCT: { future: false },
  SUMSQ: { future: false },
  TEXT: { future: false },
};

/** Function names called in a formula (text in double quotes is skipped). */
export function functionsCalled(formula: string): string[] {
  const names: string[] = [];
  for (const part of outsideQuotes(formula)) {
    for (const match of part.matchAll(/([A-Z][A-Z0-9.]*)\(/g)) names.push(match[1] as string);
  }
  return names;
}

/** The parts of a formula outside double-quoted text, in order. */
function outsideQuotes(formula: string): string[] {
  return formula.split('"').filter((_, i) => i % 2 === 0);
}

/**
 * The formula as an xlsx file stores it: no leading "=", and `_xlfn.` before each function added
 * in Excel 2010 (never inside quoted text).
 */
export function fileFormula(formula: string): string {
  const body = formula.startsWith("=") ? formula.slice(1) : formula;
  return body
    .split('"')
    .map((part, i) =>
      i % 2 === 1
        ? part
        : part.replace(
            /(^|[^A-Z0-9._])([A-Z][A-Z0-9.]*)\(/g,
            (whole, before: string, name: string) =>
              NATIVE_FUNCTIONS[name]?.future === true ? `${before}_xlfn.${name}(` : whole,
          ),
    )
    .join('"');
}

/** A sheet name as a formula writes it: always quoted, inner quotes doubled. */
export function quotedSheet(sheet: string): string {
  return `'${sheet.replace(/'/g, "''")}'`;
}

/** `$C$7`, or `'Sheet'!$C$7` with a sheet; rows and columns 0-based. */
export function absoluteCell(row: number, column: number, sheet?: string): string {
  const cell = cellAddress(row, column, true);
  return sheet === undefined ? cell : `${quotedSheet(sheet)}!${cell}`;
}

/** `$C$7:$C$40` (one column, `rows` rows), or sheet-qualified. */
export function absoluteColumn(row: number, column: number, rows: number, sheet?: string): string {
  const range = `${absoluteCell(row, column)}:${absoluteCell(row + rows - 1, column)}`;
  return sheet === undefined ? range : `${quotedSheet(sheet)}!${range}`;
}

/** A formula string literal: the text in double quotes, inner quotes doubled. */
export function textLiteral(text: string): string {
  return `"${text.replace(/"/g, '""')}"`;
}

/** The sheet-qualified A1 range of a plan column, for a chart or a writer. */
export function columnRange(sheet: string, c: PortableColumn): string {
  return `${quotedSheet(sheet)}!${absoluteColumn(c.row, c.column, c.rows)}`;
}

/**
 * A1 addresses as the host writes them ("Sheet1!B1:B71", "'Q3 errors'!B:B", "B5") and the
 * little arithmetic the pane needs on them: split off the sheet, write an absolute reference for
 * a formula, and tell whether a changed area touches a pinned range.
 */
import { columnLetters } from "../../src/report";

export interface SheetAddress {
  /** The sheet's name, unquoted ("" when the address names none). */
  readonly sheet: string;
  /** The range part, such as "B1:B71". */
  readonly range: string;
}

/** Zero-based inclusive bounds of one rectangular area. */
export interface Area {
  readonly firstRow: number;
  readonly firstColumn: number;
  readonly lastRow: number;
  readonly lastColumn: number;
}

const MAX_ROW = 1_048_575;
const MAX_COLUMN = 16_383;

export function splitAddress(address: string): SheetAddress {
  const bang = address.lastIndexOf("!");
  if (bang < 0) return { sheet: "", range: address };
  const rawSheet = address.slice(0, bang);
  const sheet =
    rawSheet.startsWith("'") && rawSheet.endsWith("'")
      ? rawSheet.slice(1, -1).replace(/''/g, "'")
      : rawSheet;
  return { sheet, range: address.slice(bang + 1) };
}

/** A sheet name as a formula writes it: always quoted, inner quotes doubled (valid for any name). */
export function quoteSheet(sheet: string): string {
  return `'${sheet.replace(/'/g, "''")}'`;
}

function columnNumber(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

const CELL = /^\$?([A-Za-z]{1,3})?\$?(\d+)?$/;

function parseCorner(text: string): { row: number | undefined; column: number | undefined } {
  const match = CELL.exec(text.trim());
  if (match === null || (match[1] === undefined && match[2] === undefined)) {
    throw new Error(`not an A1 cell reference: "${text}"`);
  }
  return {
    column: match[1] === undefined ? undefined : columnNumber(match[1]),
    row: match[2] === undefined ? undefined : Number(match[2]) - 1,
  };
}

/** The areas of a range part: "B1:B71", "B:B", "3:5", "A1", or a comma-separated list. */
export function parseAreas(range: string): Area[] {
  return range.split(",").map((part) => {
    const [from, to = from] = part.trim().split(":") as [string, string?];
    const a = parseCorner(from);
    const b = parseCorner(to);
    return {
      firstRow: Math.min(a.row ?? 0, b.row ?? 0),
      lastRow: Math.max(a.row ?? MAX_ROW, b.row ?? MAX_ROW),
      firstColumn: Math.min(a.column ?? 0, b.column ?? 0),
      lastColumn: Math.max(a.column ?? MAX_COLUMN, b.column ?? MAX_COLUMN),
    };
  });
}

function overlaps(a: Area, b: Area): boolean {
  return (
    a.firstRow <= b.lastRow &&
    b.firstRow <= a.lastRow &&
    a.firstColumn <= b.lastColumn &&
    b.firstColumn <= a.lastColumn
  );
}

/** Whether any area of `changed` touches any area of `pinned` (range parts, same sheet). */
export function touches(changed: string, pinned: string): boolean {
  const left = parseAreas(changed);
  const right = parseAreas(pinned);
  return left.some((a) => right.some((b) => overlaps(a, b)));
}

/** "'Sheet 1'!$B$1:$B$71" from "Sheet 1!B1:B71" or "'Sheet 1'!B1:B71": for a formula. */
export function absoluteReference(address: string): string {
  const { sheet, range } = splitAddress(address);
  const absolute = range
    .split(":")
    .map((corner) =>
      corner
        .replace(/\$/g, "")
        .replace(/^([A-Za-z]+)?(\d+)?$/, (_, c, r) => `${c ? `$${c}` : ""}${r ? `$${r}` : ""}`),
    )
    .join(":");
  return sheet === "" ? absolute : `${quoteSheet(sheet)}!${absolute}`;
}

/** The absolute reference of each column of a rectangular address, for one formula per column. */
export function columnReferences(address: string): string[] {
  const { sheet, range } = splitAddress(address);
  const [area] = parseAreas(range);
  if (area === undefined) return [];
  const references: string[] = [];
  for (let c = area.firstColumn; c <= area.lastColumn; c++) {
    const column = columnLetters(c);
    const part = `$${column}$${area.firstRow + 1}:$${column}$${area.lastRow + 1}`;
    references.push(sheet === "" ? part : `${quoteSheet(sheet)}!${part}`);
  }
  return references;
}

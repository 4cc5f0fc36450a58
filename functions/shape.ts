/**
 * Spreadsheet-shaped output. The host spills a returned 2-D array; a `null` in it would show as 0,
 * so a quantity the core leaves undefined (NaN: a lag with no pair of values; ±Infinity) becomes
 * an empty cell `""`. Numbers stay numbers, at full precision.
 */

/** One spilled cell: a number or text, `""` for empty. */
export type Cell = number | string;

/** A finite number as itself, anything undefined as an empty cell. */
export function numberCell(x: number): Cell {
  return Number.isFinite(x) ? x : "";
}

/** A column of numbers, one per row. */
export function column(values: Iterable<number>): Cell[][] {
  return Array.from(values, (x) => [numberCell(x)]);
}

/** A single row of cells. */
export function row(...cells: readonly (number | string)[]): Cell[][] {
  return [cells.map((c) => (typeof c === "number" ? numberCell(c) : c))];
}

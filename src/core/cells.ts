/**
 * Where a series sat in the cells it was read from, for results placed back beside their input
 * rows and for pairing two series row by row. A series not read from cells (no `start`, no
 * `cells`) sits at position 0 and covers exactly its own positions.
 */
import type { Series } from "./types";

export interface CellExtent {
  /** The cell of position 0. */
  readonly start: number;
  /** The cells read, label and trimmed gaps included. */
  readonly cells: number;
}

export function cellExtent(series: Series): CellExtent {
  const start = series.start ?? 0;
  return { start, cells: series.cells ?? start + series.values.length };
}

/**
 * Values by position (one per position of `series`) placed back on the cells the series was read
 * from, NaN on the label and trimmed gaps.
 */
export function placeOnCells(byPosition: Float64Array, series: Series): Float64Array {
  const { start, cells } = cellExtent(series);
  const placed = new Float64Array(cells).fill(NaN);
  placed.set(byPosition, start);
  return placed;
}

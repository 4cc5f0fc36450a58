/**
 * The columns of the spilled lag table (SERIESLAGTABLE) and of the placed reports, built around
 * Echolot's own reading of a lag: its z, the corridor that holds it (the verdict's calibrated
 * corridors), and its p alone and, by Šidák, for all K lags together. The joint test over lags 1..k is not a per-lag figure and has its own view
 * (`jointSpanText`, the ribbon, SERIESPORTMANTEAU). z stays in column D: the placed live report's
 * chart formulas read it there.
 */
import type { LagRow, LagTable } from "../core";
import { ZONE_SHORT } from "./palette";

export function lagTableHeader(table: LagTable): string[] {
  return [
    "lag",
    "autocorrelation",
    "partial autocorrelation",
    "z",
    "corridor",
    "p (this lag)",
    `p (Šidák, ${table.maxLag} lags)`,
  ];
}

/** The 0-based column of z in `lagTableHeader` (column D). */
export const LAG_TABLE_Z_COLUMN = 3;

/** One lag's figures, in the columns of `lagTableHeader`; the corridor as a word. */
export function lagTableValues(row: LagRow): (number | string)[] {
  return [row.lag, row.correlation, row.partial, row.z, ZONE_SHORT[row.zone], row.pLag, row.pSidak];
}

import { TEST_NAMES, type LagRow, type LagTable } from "../core";

/** The header row of the spilled lag table (SERIESLAGTABLE) and of the placed reports. */
export function lagTableHeader(table: LagTable): string[] {
  return [
    "lag",
    "autocorrelation",
    "partial autocorrelation",
    "z",
    "p (this lag)",
    `p (Šidák, ${table.maxLag} lags)`,
    `p (${TEST_NAMES[table.testKind]} to lag)`,
  ];
}

/** One lag's figures, in the columns of `lagTableHeader`. */
export function lagTableValues(row: LagRow): number[] {
  return [row.lag, row.correlation, row.partial, row.z, row.pLag, row.pSidak, row.jointP];
}

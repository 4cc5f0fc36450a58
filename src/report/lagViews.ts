/**
 * The three views of the evidence chart, as lists of standardised points:
 *
 * - `correlation`: r_k and z_k = r_k / se_k with se_k of the table's band kind (from the core);
 * - `partial`: φ_kk and z = φ_kk·√n. Under white noise the sample partial autocorrelations have
 *   standard error 1/√n whatever the band kind (Quenouille 1949, JRSS B 11:68–84), so their z is
 *   measured against the same two corridors;
 * - `squares`: the autocorrelation of the squared deviations, from a lag table computed with
 *   testKind "squares" (the McLeod–Li view of volatility clustering).
 *
 * A point's zone says which corridor holds it: inside ±z_{1−α/2}, between that and the outer level
 * for K lags, or beyond. The comparisons are the core's (`beyond`, `outer`) for the correlation
 * views and the same strict inequalities for the partials.
 */
import { TEST_NAMES, type BandKind, type LagRow, type LagTable } from "../core";
import type { Zone } from "./palette";

export type ChartView = "correlation" | "partial" | "squares";

/** Tab names and what the values are, in plain words. */
export const VIEW_NAMES: Readonly<Record<ChartView, string>> = {
  correlation: "correlation",
  partial: "partial correlation",
  squares: "squared deviations",
};

export const VIEW_QUANTITIES: Readonly<Record<ChartView, string>> = {
  correlation: "autocorrelation",
  partial: "partial autocorrelation",
  squares: "autocorrelation of the squared deviations",
};

/** Each band kind in a few words, for captions and headings. */
export const BAND_WORDS: Readonly<Record<BandKind, string>> = {
  noise: "noise bands (se 1/√n)",
  bartlett: "Bartlett bands",
  robust: "robust bands (volatility)",
};

/**
 * The bands a view's z is measured against: the table's kind, except for the partials, whose
 * standard error is 1/√n whatever the kind (Quenouille 1949).
 */
export function viewBandWords(table: LagTable, view: ChartView): string {
  return view === "partial" ? "bands (se 1/√n)" : BAND_WORDS[table.bandKind];
}

/** The joint test that goes with a view: the table's own (McLeod–Li for the squares' table). */
export function jointTestName(table: LagTable): string {
  return table.testKind === "squares" ? "McLeod–Li" : TEST_NAMES[table.testKind];
}

export interface LagPoint {
  readonly lag: number;
  /** r_k, φ_kk, or the squares' r_k. */
  readonly value: number;
  /** The standardised value; NaN where the lag has no pairs. */
  readonly z: number;
  /** "none" for a lag with no pairs of values (z is NaN). */
  readonly zone: Zone | "none";
}

function zoneOf(z: number, innerLevel: number, outerLevel: number): Zone | "none" {
  if (Number.isNaN(z)) return "none";
  const size = Math.abs(z);
  if (size > outerLevel) return "beyond";
  if (size > innerLevel) return "between";
  return "inside";
}

/** A lag row's zone, from the core's comparisons: `outer` is beyond, `crossesBand` alone is between. */
export function rowZone(row: LagRow): Zone | "none" {
  if (Number.isNaN(row.z)) return "none";
  return row.outer ? "beyond" : row.crossesBand ? "between" : "inside";
}

/** The points of one view. `squares` needs a table whose subject is the squared deviations. */
export function lagPoints(table: LagTable, view: ChartView): LagPoint[] {
  if ((view === "squares") !== (table.subject === "squares")) {
    throw new Error(
      `the ${view} view needs a lag table of ${view === "squares" ? "the squared deviations (testKind squares)" : "the series itself"}`,
    );
  }
  if (view === "partial") {
    const root = Math.sqrt(table.n);
    return table.rows.map((row) => {
      const z = row.partial * root;
      return {
        lag: row.lag,
        value: row.partial,
        z,
        zone: zoneOf(z, table.innerLevel, table.outerLevel),
      };
    });
  }
  return table.rows.map((row) => ({
    lag: row.lag,
    value: row.correlation,
    z: row.z,
    zone: rowZone(row),
  }));
}

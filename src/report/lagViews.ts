/**
 * The three views of the evidence chart, as lists of standardised points:
 *
 * - `correlation`: r_k and z_k = r_k / se_k with se_k of the table's band kind;
 * - `partial`: φ_kk and its z, measured against the same two corridors (core/partial.ts says why);
 * - `squares`: the autocorrelation of the squared deviations, from a lag table computed with
 *   testKind "squares" (the McLeod–Li view of volatility clustering).
 *
 * A point's zone says which corridor holds it: inside ±z_{1−α/2}, between that and the outer level
 * for K lags, or beyond. Every z and zone is the core's (the lag table's rows); this file only
 * picks them.
 */
import { TEST_NAMES, type BandKind, type LagTable } from "../core";
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

/** The points of one view. `squares` needs a table whose subject is the squared deviations. */
export function lagPoints(table: LagTable, view: ChartView): LagPoint[] {
  if ((view === "squares") !== (table.subject === "squares")) {
    throw new Error(
      `the ${view} view needs a lag table of ${view === "squares" ? "the squared deviations (testKind squares)" : "the series itself"}`,
    );
  }
  if (view === "partial") {
    return table.rows.map((row) => ({
      lag: row.lag,
      value: row.partial,
      z: row.partialZ,
      zone: row.partialZone,
    }));
  }
  return table.rows.map((row) => ({
    lag: row.lag,
    value: row.correlation,
    z: row.z,
    zone: row.zone,
  }));
}

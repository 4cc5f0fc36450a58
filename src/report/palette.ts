/**
 * The Okabe–Ito colours Echolot uses (colour-blind safe), under the names DESIGN.md gives them.
 * Nothing is told by colour alone: badges carry a word and a shape, diamonds a class and a title.
 *
 * Every mark a reader must see meets a contrast of 3:1 against what it sits on (WCAG 2.1, 1.4.11
 * non-text contrast); test/report/contrast.test.ts computes the ratios. Two shades are therefore
 * darker than the Okabe–Ito originals, with the same hue: watch is #E69F00 at 60% (#8A5F00; the
 * original is 2.0:1 on the outer corridor), and the corridors keep light fills, which help the
 * eye but carry nothing on their own, while their solid edges carry the contrast.
 */
import type { CorridorZone } from "../core";

export const PALETTE = {
  /** Verdict clear. */
  clear: "#0072B2",
  /** Verdict watch, and a lag between the two corridors: Okabe–Ito orange, darkened. */
  watch: "#8A5F00",
  /** Verdict structure, and a lag beyond the outer corridor. */
  structure: "#D55E00",
  /** A lag inside the inner corridor. */
  inside: "#56636F",
  /** The inner corridor ±z_{1−α/2}: one lag on its own. */
  innerCorridor: "#E8E4DC",
  /** The outer corridor (the verdict's level for all K lags together). */
  outerCorridor: "#F4F1EA",
  /** The inner corridor's edge: 3:1 against both corridor fills. */
  innerEdge: "#6F685C",
  /** The outer corridor's edge: 3:1 against the page and the outer corridor's fill. */
  outerEdge: "#857D6E",
  /** The columns of the seasonal lags m and 2m. */
  seasonalTint: "#EAF2F7",
  /** The seasonal columns' edges: Okabe–Ito blue. */
  seasonalEdge: "#0072B2",
  /** Joint-test ribbon: a cell whose p is at or above alpha (outlined, light fill). */
  ribbonNeutral: "#F4F1EA",
  /** Joint-test ribbon: the darkest cell, p at full strength (vermillion darkened to 55%). */
  ribbonDeepest: "#753400",
  /** The page behind every chart. */
  page: "#FFFFFF",
  /** Axis lines, tick labels and captions. */
  ink: "#2B3137",
  /** Secondary text. */
  muted: "#56636F",
} as const;

/** Where a lag's standardised value lies (decided in the core), and the colour that says so. */
export type Zone = Exclude<CorridorZone, "none">;

export const ZONE_COLOURS: Readonly<Record<Zone, string>> = {
  inside: PALETTE.inside,
  between: PALETTE.watch,
  beyond: PALETTE.structure,
};

/** Plain words for each zone, used in titles, legends and the figures table. */
export const ZONE_WORDS: Readonly<Record<Zone, string>> = {
  inside: "inside the one-lag corridor",
  between: "between the corridors: could be chance, given how many lags were tested",
  beyond: "beyond the all-lags corridor: survives the multiple-lag correction",
};

/** One word per zone, for table cells: the lag table's "corridor" column. */
export const ZONE_SHORT: Readonly<Record<Zone | "none", string>> = {
  inside: "inside",
  between: "between",
  beyond: "beyond",
  none: "no pairs",
};

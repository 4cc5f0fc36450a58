/**
 * The Okabe–Ito colours Echolot uses (colour-blind safe), under the names DESIGN.md gives them.
 * Nothing is told by colour alone: badges carry a word and a shape, diamonds a class and a title.
 */
export const PALETTE = {
  /** Verdict clear. */
  clear: "#0072B2",
  /** Verdict watch, and a lag between the two corridors. */
  watch: "#E69F00",
  /** Verdict structure, and a lag beyond the outer corridor. */
  structure: "#D55E00",
  /** A lag inside the inner corridor. */
  inside: "#56636F",
  /** The inner corridor ±z_{1−α/2}: one lag on its own. */
  innerCorridor: "#E8E4DC",
  /** The outer corridor (Šidák over K lags): all lags together. */
  outerCorridor: "#F4F1EA",
  /** The columns of the seasonal lags m and 2m. */
  seasonalTint: "#EAF2F7",
  /** Axis lines, tick labels and captions. */
  ink: "#2B3137",
  /** Secondary text. */
  muted: "#56636F",
} as const;

/** Where a lag's standardised value lies, and the colour that says so. */
export type Zone = "inside" | "between" | "beyond";

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

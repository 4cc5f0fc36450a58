/**
 * The verdict's badge: word, shape and colour together, so nothing depends on colour alone.
 * Shapes and Okabe–Ito colours as DESIGN.md assigns them.
 */
import type { VerdictWord } from "../core";
import { PALETTE } from "./palette";

export interface Badge {
  readonly word: VerdictWord;
  readonly shape: string;
  readonly colour: string;
}

export const BADGES: Readonly<Record<VerdictWord, Badge>> = {
  clear: { word: "clear", shape: "●", colour: PALETTE.clear },
  watch: { word: "watch", shape: "▲", colour: PALETTE.watch },
  structure: { word: "structure", shape: "■", colour: PALETTE.structure },
  short: { word: "short", shape: "◌", colour: PALETTE.inside },
};

export const SCREENING_CAUTION =
  "A verdict is a statistical screen, not a decision: a clear result does not prove a model right, and investment or inventory decisions stay with the people and rules responsible for them.";

/**
 * Shared shapes of the core: the series as the core sees it and the option keywords.
 */

/**
 * A series laid out by position in time.
 * `values[t]` is the value at position t, or `NaN` at a gap; `present[t]` is 1 where a value
 * exists. Leading and trailing gaps have been trimmed, so `present[0]` and `present[length-1]`
 * are 1. Interior gaps keep their positions so that lags stay positions in time.
 */
export interface Series {
  readonly values: Float64Array;
  readonly present: Uint8Array;
  /** The series' name: a text first cell, a CSV header, or "" when none was given. */
  readonly label: string;
  /** Number of values present (the n of every formula). */
  readonly count: number;
  /** Number of interior gaps. */
  readonly gaps: number;
  /**
   * Where position 0 sat in the cells read (after a label and leading gaps), so results can be
   * placed back beside their input rows; absent for series not read from cells.
   */
  readonly start?: number;
  /** How many cells were read (label and trimmed gaps included); absent as for `start`. */
  readonly cells?: number;
}

export type BandKind = "noise" | "bartlett" | "robust";
export type TestKind = "ljung-box" | "box-pierce" | "robust" | "squares";
export type VerdictWord = "clear" | "watch" | "structure" | "short";

export const BAND_KINDS: readonly BandKind[] = ["noise", "bartlett", "robust"];
export const TEST_KINDS: readonly TestKind[] = ["ljung-box", "box-pierce", "robust", "squares"];

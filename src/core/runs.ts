/**
 * Runs about the median (Wald & Wolfowitz 1940, Ann. Math. Stat. 11:147–162; NIST/SEMATECH
 * e-Handbook §1.3.5.13): too few runs of values on one side of the median means the series
 * wanders (positive dependence, a drifting level); too many means it alternates.
 *
 * With n₁ values above and n₂ below and R runs,
 *   R̄ = 2n₁n₂/(n₁+n₂) + 1,   s_R² = 2n₁n₂(2n₁n₂ − n₁ − n₂) / ((n₁+n₂)²(n₁+n₂−1)),
 *   Z = (R − R̄)/s_R, two-sided p from the standard normal (the large-sample reference).
 * Values equal to the median belong to neither side and are left out (common practice (no
 * source)). Runs follow the values present in time order: a gap neither ends nor starts a run.
 * The check flags at the request's alpha when p < alpha. Cost O(n log n) for the median.
 */
import { normalTwoSided } from "./distributions";
import { invalid, tooShort } from "./errors";
import { requireValues, resolveAlpha } from "./options";
import { seriesName } from "./seriesName";
import type { Series } from "./types";

export interface RunsCount {
  /** Values above (n₁) and below (n₂). */
  readonly above: number;
  readonly below: number;
  readonly runs: number;
  readonly expected: number;
  readonly sd: number;
  readonly z: number;
  /** Two-sided p. */
  readonly p: number;
}

export interface RunsOptions {
  /** Level at which `flagged` is set; default 0.05. */
  readonly alpha?: number | null;
}

export interface RunsCheck extends RunsCount {
  readonly label: string;
  /** Values present. */
  readonly n: number;
  readonly median: number;
  readonly alpha: number;
  /** Too few or too many runs at alpha: p < alpha. */
  readonly flagged: boolean;
}

/**
 * The runs test of a two-valued sequence in order: `sides[i]` is true (or 1) for one kind (above the
 * median, heads) and false for the other.
 */
export function runsTest(sides: ArrayLike<boolean | number>): RunsCount {
  let above = 0;
  let runs = 0;
  for (let i = 0; i < sides.length; i++) {
    if (sides[i]) above++;
    if (i === 0 || sides[i] !== sides[i - 1]) runs++;
  }
  const below = sides.length - above;
  if (above === 0 || below === 0) {
    invalid(
      `a runs test needs values of both kinds; all ${sides.length} are on one side of the median`,
    );
  }
  const total = above + below;
  const product = 2 * above * below;
  const expected = product / total + 1;
  const variance = (product * (product - total)) / (total * total * (total - 1));
  if (!(variance > 0)) {
    tooShort(
      `a runs test needs at least 3 values off the median; got ${above} above and ${below} below, whose number of runs cannot vary`,
    );
  }
  const sd = Math.sqrt(variance);
  const z = (runs - expected) / sd;
  return { above, below, runs, expected, sd, z, p: normalTwoSided(z) };
}

/** The median of the values present, from a typed copy (sorted numerically, 8 bytes a value). */
function medianOf(series: Series): number {
  const { values, present } = series;
  const sorted = new Float64Array(series.count);
  for (let t = 0, k = 0; t < values.length; t++) {
    if (present[t] === 1) sorted[k++] = values[t] as number;
  }
  sorted.sort();
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1
    ? (sorted[middle] as number)
    : ((sorted[middle - 1] as number) + (sorted[middle] as number)) / 2;
}

export function runsCheck(series: Series, options: RunsOptions = {}): RunsCheck {
  requireValues(series, 3, "a runs test");
  const alpha = resolveAlpha(options.alpha);
  const { values, present } = series;
  const median = medianOf(series);
  // One byte a value: 1 above the median, 0 below; values equal to it are left out.
  const all = new Uint8Array(series.count);
  let m = 0;
  for (let t = 0; t < values.length; t++) {
    const x = values[t] as number;
    if (present[t] === 1 && x !== median) all[m++] = x > median ? 1 : 0;
  }
  const sides = all.subarray(0, m);
  if (sides.length < 2 || sides.every((s) => s === sides[0])) {
    invalid(
      `${seriesName(series.label)} has values on only one side of its median ${median} (the others equal it), so its runs cannot be counted`,
    );
  }
  const count = runsTest(sides);
  return {
    label: series.label,
    n: series.count,
    median,
    ...count,
    alpha,
    flagged: count.p < alpha,
  };
}

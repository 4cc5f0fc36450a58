/**
 * Where everything of a portable report block sits (offsets from its top-left cell), its labels
 * and its number formats, in one place for the plan, the batch's summary links and the tests.
 */
import { PERMUTATION_WORK_LIMIT, SMALLEST_PERMUTATION_ALPHA } from "../core";
import { absoluteCell } from "./portableFormulas";

/**
 * The sheet's test of whether the add-in judges this series by its permutation reference
 * (src/core/verdictReference.ts `referenceKind`): no fitted parameters, n·K ≤ 250,000 and
 * α ≥ 0.001. Its levels and its joint p then come from permutations of the data, which
 * spreadsheet functions cannot draw.
 */
export function addInPermutes(n: string, maxLag: string, fitted: string, alpha: string): string {
  return `AND(${fitted}=0,${n}*${maxLag}<=${PERMUTATION_WORK_LIMIT},${alpha}>=${SMALLEST_PERMUTATION_ALPHA})`;
}

/** What the line beside a permuted verdict says. */
export const PERMUTATION_NOTE = `The add-in uses an exact permutation reference for series of ordinary length (n·K ≤ ${PERMUTATION_WORK_LIMIT.toLocaleString("en")}, no fitted parameters, α ≥ ${SMALLEST_PERMUTATION_ALPHA}), so its reading may differ from this portable one, which reads the joint p from χ² at the levels written here.`;

/** z beyond this is drawn at the chart's edge (the pane pins at the same place). */
export const PIN = 6;

export const PORTABLE_FORMATS = {
  fixed: "0.0000",
  statistic: "0.000",
  p: "[<0.0001]0.00E+00;0.0000",
  count: "0",
} as const;

/** Columns of the lag table, left to right (offsets from the report's first column). */
export const COL = {
  lag: 0,
  pairs: 1,
  r: 2,
  se: 3,
  band: 4,
  z: 5,
  pLag: 6,
  zone: 7,
  robustVar: 8,
  term: 9,
  jointQ: 10,
  jointDf: 11,
  jointP: 12,
  pmf: 13,
  base: 14,
  outerLower: 15,
  inner: 16,
  outerUpper: 17,
  inside: 18,
  between: 19,
  beyond: 20,
} as const;

/** Columns of the per-data-cell helpers, after one empty column. */
export const HELP = {
  position: 22,
  present: 23,
  value: 24,
  deviation: 25,
  square: 26,
  where: 27,
} as const;

/** Columns a report block spans (a batch places blocks this far apart). */
export const PORTABLE_BLOCK_WIDTH = HELP.where + 2;

/** Rows of the header and the figures list; the lag table's header follows. */
export const ROW = {
  title: 0,
  computes: 1,
  live: 2,
  caution: 3,
  placed: 4,
  verdict: 6,
  exact: 7,
  figures: 9,
} as const;

export const FIGURE_ROWS = [
  "source",
  "n",
  "gaps",
  "mean",
  "c0",
  "maxLag",
  "alpha",
  "season",
  "fittedParams",
  "bandKind",
  "testKind",
  "innerLevel",
  "outerLevel",
  "jointLevel",
  "Q",
  "df",
  "p",
  "tested",
  "expected",
  "crossings",
  "outerCount",
  "chance",
  "lagOne",
  "seasonal",
] as const;
export type FigureRow = (typeof FIGURE_ROWS)[number];

export const FIGURE_LABELS: Readonly<Record<FigureRow, string>> = {
  source: "Data range",
  n: "Values present (n)",
  gaps: "Gaps between the first and last value",
  mean: "Mean of the values present",
  c0: "Sum of squared deviations (c0)",
  maxLag: "Lags judged (K)",
  alpha: "Level alpha",
  season: "Season m",
  fittedParams: "Fitted parameters",
  bandKind: "Band kind",
  testKind: "Joint test",
  innerLevel: "One-lag corridor (z)",
  outerLevel: "All-lags corridor (z)",
  jointLevel: "Level the joint p is judged at",
  Q: "Joint test Q",
  df: "Degrees of freedom",
  p: "p (χ² reference)",
  tested: "Lags tested",
  expected: "Crossings expected by chance for pure noise",
  crossings: "Lags beyond the one-lag corridor",
  outerCount: "Lags beyond the all-lags corridor",
  chance: "Chance of that many crossings for pure noise",
  lagOne: "Lag 1 beyond its band",
  seasonal: "Seasonal lag (m, 2m) beyond its band",
};

export const TABLE_HEADERS: Readonly<Record<keyof typeof COL, string>> = {
  lag: "lag",
  pairs: "pairs",
  r: "r",
  se: "se",
  band: "band ±",
  z: "z",
  pLag: "p (this lag)",
  zone: "zone",
  robustVar: "robust variance",
  term: "Q term",
  jointQ: "Q to lag",
  jointDf: "df to lag",
  jointP: "p to lag",
  pmf: "binomial P(crossings = lag)",
  base: "chart: corridor base",
  outerLower: "chart: all-lags corridor, lower part",
  inner: "chart: one-lag corridor",
  outerUpper: "chart: all-lags corridor, upper part",
  inside: "inside",
  between: "between corridors",
  beyond: "beyond all-lags corridor",
};

export const HELP_HEADERS: Readonly<Record<keyof typeof HELP, string>> = {
  position: "position",
  present: "present",
  value: "value or 0",
  deviation: "deviation or 0",
  square: "squared deviation",
  where: "position if present",
};

/** The test kinds a portable report can compute (the squares' test needs a second series). */
export const PORTABLE_TEST_KINDS = ["ljung-box", "box-pierce", "robust"] as const;

/** Column widths of a block placed at `column`, in characters. */
export function blockWidths(column: number): { column: number; width: number }[] {
  const widths = [{ column, width: 40 }];
  for (let c = 1; c < PORTABLE_BLOCK_WIDTH - 1; c++) widths.push({ column: column + c, width: 12 });
  return widths;
}

/** Where a report block's verdict and joint test are, for a batch's summary rows. */
export interface PortableBlockCells {
  readonly n: string;
  readonly q: string;
  readonly df: string;
  readonly p: string;
  readonly verdict: string;
  readonly exact: string;
  readonly maxLag: string;
  readonly fittedParams: string;
  readonly alpha: string;
}

/** The cells of a block placed at `origin` on `sheet`, sheet-qualified. */
export function portableBlockCells(
  sheet: string,
  origin: { readonly row: number; readonly column: number },
): PortableBlockCells {
  const at = (name: FigureRow) =>
    absoluteCell(origin.row + ROW.figures + FIGURE_ROWS.indexOf(name), origin.column + 1, sheet);
  return {
    n: at("n"),
    q: at("Q"),
    df: at("df"),
    p: at("p"),
    verdict: absoluteCell(origin.row + ROW.verdict, origin.column + 1, sheet),
    exact: absoluteCell(origin.row + ROW.exact, origin.column + 1, sheet),
    maxLag: at("maxLag"),
    fittedParams: at("fittedParams"),
    alpha: at("alpha"),
  };
}

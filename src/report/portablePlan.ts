/**
 * The portable report of one series: the evidence of the live report written in the
 * spreadsheet's own functions (portableFormulas.ts lists them), so it stays live for a reader
 * without the add-in, in Excel, LibreOffice Calc or Google Sheets. One plan, two writers: the
 * pane (office.js) and `echolot workbook` (an xlsx file).
 *
 * What the cells compute, as the core does (autocovariance.ts, bands.ts, portmanteau.ts,
 * corridors.ts, falseAlarms.ts, verdict.ts):
 * - per data cell, helper columns: present (1/0), the value or 0, the deviation from the mean of
 *   the values present or 0 at a gap, and its square. A gap (blank, #N/A, any non-number) adds
 *   nothing to any sum and shifts nothing, so each lag sum runs over the pairs where both values
 *   exist; trailing blank cells are harmless, which is how a column can grow into its range;
 * - per lag k: pairs = Σ p_t p_{t−k}, r_k = Σ d_t d_{t−k} / c₀ (blank when no pair), se_k of the
 *   band kind, band = z_{1−α/2}·se_k, z_k = r_k/se_k, its two-sided p, its zone, the joint
 *   test's term, Q and p over lags 1..k, the binomial probability of k crossings;
 * - the verdict's rules at the levels of the add-in, written as constants for this K.
 * Lag sums are SUMPRODUCT over INDEX(range, i):INDEX(range, j), never OFFSET or INDIRECT, so
 * nothing is volatile.
 *
 * The plan carries the figures Echolot computed (`figures`, keyed as the cells' `figure`), so a
 * test can read the cells back from a spreadsheet engine and compare. Pure: no Office, no files.
 */
import { pairCounts, TEST_NAMES, type LagTable, type Series } from "../core";
import { PALETTE } from "./palette";
import { absoluteCell, absoluteColumn, quotedSheet, textLiteral } from "./portableFormulas";
import type { PlanCellContent } from "./placedReport";
import { SCREENING_CAUTION } from "./verdictBadge";

/** The data column a portable report reads: rows and columns 0-based. */
export interface PortableSource {
  readonly sheet: string;
  readonly column: number;
  /** The first cell of the range (a text label there is read as a gap, like any non-number). */
  readonly firstRow: number;
  /** Cells in the range, room to grow included. */
  readonly rows: number;
}

export type PortableStyle = "title" | "heading" | "verdict" | "note";

export interface PortableCell {
  readonly row: number;
  readonly column: number;
  readonly content: PlanCellContent;
  /** A number format code; absent for General. */
  readonly format?: string;
  readonly style?: PortableStyle;
  /** The key of the Echolot figure this cell shows, in `PortablePlan.figures`. */
  readonly figure?: string;
}

/** One column of cells on the report's sheet: 0-based first row and column, and its length. */
export interface PortableColumn {
  readonly row: number;
  readonly column: number;
  readonly rows: number;
}

export interface PortableChartSeries {
  readonly name: string;
  readonly values: PortableColumn;
  /** Fill or marker colour; null for the corridors' invisible base. */
  readonly colour: string | null;
  /** Corridor areas are stacked (base, lower band, inner band, upper band); diamonds are markers without a line. */
  readonly type: "area" | "diamonds";
  /** Whether the legend names it (each corridor is two areas, named once). */
  readonly inLegend: boolean;
}

export interface PortableChart {
  readonly title: string;
  readonly categories: PortableColumn;
  readonly series: readonly PortableChartSeries[];
  readonly xTitle: string;
  readonly yTitle: string;
  /** Top-left and bottom-right cells it covers, 0-based. */
  readonly from: { readonly row: number; readonly column: number };
  readonly to: { readonly row: number; readonly column: number };
}

export interface PortableSheet {
  readonly name: string;
  readonly cells: readonly PortableCell[];
  /** Rows × columns from A1 that the report uses (must be empty before it is placed). */
  readonly extent: { readonly rows: number; readonly columns: number };
  readonly widths: readonly { readonly column: number; readonly width: number }[];
  readonly chart?: PortableChart;
  /** What a printout shows (rows × columns from A1): the report and its chart, not the helpers. */
  readonly print?: { readonly rows: number; readonly columns: number };
}

export type Figure = number | string;

export interface PortablePlan {
  readonly sheets: readonly PortableSheet[];
  /** What Echolot computed, by the key of the cell that shows it ("" where a figure is undefined). */
  readonly figures: ReadonlyMap<string, Figure>;
}

export interface PortableOptions {
  /** The report sheet's name. */
  readonly sheetName: string;
  /** The date the report is placed, as shown in its header (for example 2026-12-02). */
  readonly placedOn: string;
  /** The top-left cell of the report on its sheet (default A1); 0-based. */
  readonly origin?: { readonly row: number; readonly column: number };
  /** Leave out the chart (a batch's blocks). */
  readonly chart?: boolean;
  /** Prefix of the figure keys (several reports in one plan). */
  readonly key?: string;
  /** Whether the source range runs past the data, so values added below are included. */
  readonly roomToGrow?: boolean;
}

/** Below this many values the add-in may read the joint test from an exact small-sample reference. */
export const EXACT_REFERENCE_BELOW = 1000;

/** z beyond this is drawn at the chart's edge (the pane pins at the same place). */
const PIN = 6;

export const PORTABLE_FORMATS = {
  fixed: "0.0000",
  statistic: "0.000",
  p: "[<0.0001]0.00E+00;0.0000",
  count: "0",
} as const;

/** Columns of the lag table, left to right (offsets from the report's first column). */
const COL = {
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
const HELP = {
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
const ROW = {
  title: 0,
  computes: 1,
  live: 2,
  caution: 3,
  placed: 4,
  verdict: 6,
  exact: 7,
  figures: 9,
} as const;

const FIGURE_ROWS = [
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
  "beyond",
  "outerCount",
  "chance",
  "lagOne",
  "seasonal",
] as const;
type FigureRow = (typeof FIGURE_ROWS)[number];

const FIGURE_LABELS: Readonly<Record<FigureRow, string>> = {
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
  beyond: "Lags beyond the one-lag corridor",
  outerCount: "Lags beyond the all-lags corridor",
  chance: "Chance of that many crossings for pure noise",
  lagOne: "Lag 1 beyond its band",
  seasonal: "Seasonal lag (m, 2m) beyond its band",
};

const TABLE_HEADERS: Readonly<Record<keyof typeof COL, string>> = {
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

const HELP_HEADERS: Readonly<Record<keyof typeof HELP, string>> = {
  position: "position",
  present: "present",
  value: "value or 0",
  deviation: "deviation or 0",
  square: "squared deviation",
  where: "position if present",
};

/** The test kinds a portable report can compute (the squares' test needs a second series). */
export const PORTABLE_TEST_KINDS = ["ljung-box", "box-pierce", "robust"] as const;

function zoneOf(z: number, beyond: boolean, outer: boolean): string {
  if (!Number.isFinite(z)) return "";
  return outer ? "beyond" : beyond ? "between" : "inside";
}

function finiteOr(x: number): Figure {
  return Number.isFinite(x) ? x : "";
}

/**
 * The plan of one series' portable report. `table` is Echolot's lag table of `series` (the
 * figures the cells must reproduce); `source` is where the series' cells are in the workbook.
 */
export function portablePlan(
  table: LagTable,
  series: Series,
  source: PortableSource,
  options: PortableOptions,
): PortablePlan {
  const figures = new Map<string, Figure>();
  const cells = portableBlock(table, series, source, options, figures);
  const origin = options.origin ?? { row: 0, column: 0 };
  const K = table.maxLag;
  const tableTop = origin.row + ROW.figures + FIGURE_ROWS.length + 2;
  const first = tableTop + 1;
  const column = (c: number): PortableColumn => ({
    row: first,
    column: origin.column + c,
    rows: K,
  });
  const series_: PortableChartSeries[] = [
    area("corridor base", column(COL.base), null, false),
    area("all-lags corridor", column(COL.outerLower), PALETTE.outerCorridor, true),
    area("one-lag corridor", column(COL.inner), PALETTE.innerCorridor, true),
    area("all-lags corridor (upper part)", column(COL.outerUpper), PALETTE.outerCorridor, false),
    diamonds("inside", column(COL.inside), PALETTE.inside),
    diamonds("between the corridors", column(COL.between), PALETTE.watch),
    diamonds("beyond the all-lags corridor", column(COL.beyond), PALETTE.structure),
  ];
  // The chart sits beside the figures list, in the columns the lag table uses below it.
  const chartTop = origin.row + ROW.figures;
  const tableEnd = first + K;
  const chart: PortableChart = {
    title: `z by lag: ${table.label === "" ? "series" : table.label}`,
    categories: column(COL.lag),
    series: series_,
    xTitle: "lag",
    yTitle: `z = r / se (beyond ±${PIN} drawn at the edge)`,
    from: { row: chartTop, column: origin.column + 3 },
    to: { row: chartTop + FIGURE_ROWS.length, column: origin.column + COL.pmf },
  };
  const sheet: PortableSheet = {
    name: options.sheetName,
    cells,
    extent: {
      rows: Math.max(first + source.rows, tableEnd),
      columns: origin.column + PORTABLE_BLOCK_WIDTH,
    },
    widths: blockWidths(origin.column),
    ...(options.chart === false
      ? {}
      : { chart, print: { rows: tableEnd, columns: origin.column + COL.pmf + 1 } }),
  };
  return { sheets: [sheet], figures };
}

function area(name: string, values: PortableColumn, colour: string | null, inLegend: boolean) {
  return { name, values, colour, type: "area", inLegend } as const;
}

function diamonds(name: string, values: PortableColumn, colour: string) {
  return { name, values, colour, type: "diamonds", inLegend: true } as const;
}

function blockWidths(column: number): { column: number; width: number }[] {
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
  };
}

/** The cells of one report block; Echolot's figures go into `figures` under the block's keys. */
export function portableBlock(
  table: LagTable,
  series: Series,
  source: PortableSource,
  options: PortableOptions,
  figures: Map<string, Figure>,
): PortableCell[] {
  if (table.subject !== "series" || table.testKind === "squares") {
    throw new Error(
      `a portable report computes the ${PORTABLE_TEST_KINDS.join(", ")} tests; the squares' test needs the add-in`,
    );
  }
  const origin = options.origin ?? { row: 0, column: 0 };
  const key = (name: string) => `${options.key ?? ""}${name}`;
  const K = table.maxLag;
  const L = source.rows;
  const cells: PortableCell[] = [];
  const put = (
    row: number,
    column: number,
    content: PlanCellContent,
    extra: Omit<PortableCell, "row" | "column" | "content"> = {},
  ) => cells.push({ row: origin.row + row, column: origin.column + column, content, ...extra });
  const text = (row: number, column: number, value: string, style?: PortableStyle) =>
    put(row, column, { value }, style === undefined ? {} : { style });
  const cell = (row: number, column: number) =>
    absoluteCell(origin.row + row, origin.column + column);

  // Where things are.
  const figureRow = (name: FigureRow) => ROW.figures + FIGURE_ROWS.indexOf(name);
  const fig = (name: FigureRow) => cell(figureRow(name), 1);
  const tableTop = ROW.figures + FIGURE_ROWS.length + 2;
  const firstLagRow = tableTop + 1;
  const lagColumn = (c: number) => absoluteColumn(origin.row + firstLagRow, origin.column + c, K);
  const lagCell = (k: number, c: number) => cell(firstLagRow + k - 1, c);
  const helpColumn = (c: number) => absoluteColumn(origin.row + firstLagRow, origin.column + c, L);
  const src = absoluteColumn(source.firstRow, source.column, L, source.sheet);
  const srcCell = (i: number) => absoluteCell(source.firstRow + i, source.column, source.sheet);
  const name = table.label === "" ? "series" : table.label;

  // The header: what it is.
  text(ROW.title, 0, `Echolot portable report: ${name}`, "title");
  text(
    ROW.computes,
    0,
    `Lag correlations of ${src} over the pairs where both values exist (a blank, #N/A or text cell is a gap), their bands, the ${TEST_NAMES[table.testKind]} joint test over ${K} lags with its χ² p, the two corridors, the count of crossings against chance, and the verdict.`,
    "note",
  );
  text(
    ROW.live,
    0,
    `Written in the spreadsheet's own functions: it recomputes when the data change, with or without the Echolot add-in, in Excel, LibreOffice Calc or Google Sheets. ${options.roomToGrow === true ? "The data range runs past the last value: values added below it are included." : "It reads exactly the cells of the data range: to cover more rows, place a new report."}`,
    "note",
  );
  text(ROW.caution, 0, SCREENING_CAUTION, "note");
  text(ROW.placed, 0, `Placed on ${options.placedOn} by Echolot.`, "note");

  // The figures list.
  FIGURE_ROWS.forEach((f) => text(figureRow(f), 0, FIGURE_LABELS[f]));
  const figure = (
    f: FigureRow,
    content: PlanCellContent,
    expected: Figure | undefined,
    format?: string,
  ) => {
    const extra: { figure?: string; format?: string } = {};
    if (expected !== undefined) {
      extra.figure = key(f);
      figures.set(key(f), expected);
    }
    if (format !== undefined) extra.format = format;
    put(figureRow(f), 1, content, extra);
  };
  const n = fig("n");
  const inner = fig("innerLevel");
  const outer = fig("outerLevel");
  const alpha = fig("alpha");
  const tested = fig("tested");
  const beyond = fig("beyond");
  figure("source", { value: src }, undefined);
  figure("n", { formula: `=COUNT(${src})` }, table.n, PORTABLE_FORMATS.count);
  const where = helpColumn(HELP.where);
  figure(
    "gaps",
    { formula: `=IF(${n}=0,0,MAX(${where})-MIN(${where})+1-${n})` },
    table.gaps,
    PORTABLE_FORMATS.count,
  );
  figure("mean", { formula: `=SUM(${helpColumn(HELP.value)})/${n}` }, table.mean);
  figure("c0", { formula: `=SUMSQ(${helpColumn(HELP.deviation)})` }, table.variance * table.n);
  figure("maxLag", { value: K }, undefined);
  figure("alpha", { value: table.alpha }, undefined);
  figure("season", { value: table.season ?? "none" }, undefined);
  figure("fittedParams", { value: table.fittedParams }, undefined);
  figure("bandKind", { value: table.bandKind }, undefined);
  figure("testKind", { value: TEST_NAMES[table.testKind] }, undefined);
  figure("innerLevel", { value: table.innerLevel }, undefined, PORTABLE_FORMATS.fixed);
  figure("outerLevel", { value: table.outerLevel }, undefined, PORTABLE_FORMATS.fixed);
  figure("jointLevel", { value: table.jointLevel }, undefined, PORTABLE_FORMATS.fixed);
  const lastLag = firstLagRow + K - 1;
  figure(
    "Q",
    { formula: `=${cell(lastLag, COL.jointQ)}` },
    table.joint.q,
    PORTABLE_FORMATS.statistic,
  );
  figure(
    "df",
    { formula: `=${cell(lastLag, COL.jointDf)}` },
    table.joint.df,
    PORTABLE_FORMATS.count,
  );
  figure(
    "p",
    { formula: `=${cell(lastLag, COL.jointP)}` },
    finiteOr(table.joint.p),
    PORTABLE_FORMATS.p,
  );
  const note = table.falseAlarm;
  figure("tested", { formula: `=COUNT(${lagColumn(COL.z)})` }, note.tested, PORTABLE_FORMATS.count);
  figure("expected", { formula: `=${tested}*${alpha}` }, note.expected, PORTABLE_FORMATS.fixed);
  const zones = lagColumn(COL.zone);
  figure(
    "beyond",
    { formula: `=COUNTIF(${zones},"between")+COUNTIF(${zones},"beyond")` },
    note.beyond,
    PORTABLE_FORMATS.count,
  );
  figure(
    "outerCount",
    { formula: `=COUNTIF(${zones},"beyond")` },
    table.verdict.triggers.outerLags.length,
    PORTABLE_FORMATS.count,
  );
  figure(
    "chance",
    {
      formula: `=IF(${beyond}=0,1,SUMIF(${lagColumn(COL.lag)},">="&${beyond},${lagColumn(COL.pmf)}))`,
    },
    note.chance,
    PORTABLE_FORMATS.p,
  );
  const crosses = (k: number) =>
    `OR(${lagCell(k, COL.zone)}="between",${lagCell(k, COL.zone)}="beyond")`;
  figure(
    "lagOne",
    { formula: `=IF(${crosses(1)},"yes","no")` },
    table.verdict.triggers.lagOne ? "yes" : "no",
  );
  const seasonal =
    table.season === null ? [] : [table.season, 2 * table.season].filter((m) => m <= K);
  figure(
    "seasonal",
    seasonal.length === 0
      ? { value: "not tested" }
      : { formula: `=IF(OR(${seasonal.map(crosses).join(",")}),"yes","no")` },
    seasonal.length === 0
      ? "not tested"
      : table.verdict.triggers.seasonalLags.length > 0
        ? "yes"
        : "no",
  );

  // The verdict, by the add-in's rules (verdict.ts) at its levels.
  const p = fig("p");
  const verdictCell = cell(ROW.verdict, 1);
  text(ROW.verdict, 0, "Verdict", "heading");
  put(
    ROW.verdict,
    1,
    {
      formula: `=IF(OR(${n}<20,${K}>${n}/4),"short",IF(OR(${p}<${fig("jointLevel")},${fig("outerCount")}>0),"structure",IF(OR(${fig("lagOne")}="yes",${fig("seasonal")}="yes",AND(${beyond}>0,${fig("chance")}<${alpha})),"watch","clear")))`,
    },
    { style: "verdict", figure: key("verdict") },
  );
  figures.set(key("verdict"), table.verdict.word);
  put(ROW.verdict, 2, { formula: reasonFormula(table, verdictCell, fig) });
  put(
    ROW.exact,
    1,
    {
      formula: `=IF(${n}<${EXACT_REFERENCE_BELOW},${textLiteral(`Fewer than ${EXACT_REFERENCE_BELOW.toLocaleString("en")} values: the add-in may read the joint test from an exact small-sample reference that spreadsheet functions cannot compute, so its verdict may differ from this χ² reading.`)},${textLiteral("The joint test is read from χ², as the add-in reads it for series this long.")})`,
    },
    { style: "note" },
  );

  // The lag table.
  (Object.keys(COL) as (keyof typeof COL)[]).forEach((c) =>
    text(tableTop, COL[c], TABLE_HEADERS[c], "heading"),
  );
  const pairs = pairCounts(series, K);
  const c0 = fig("c0");
  const lagSum = (helper: number, k: string) => {
    const h = helpColumn(helper);
    const [first, last] = h.split(":") as [string, string];
    const from = `INDEX(${first}:${last},`;
    return `SUMPRODUCT(${from}1+${k}):${from}${L}),${from}1):${from}${L}-${k}))`;
  };
  table.rows.forEach((row, i) => {
    const k = row.lag;
    const r = firstLagRow + i;
    const at = (c: number) => cell(r, c);
    const lag = at(COL.lag);
    const expect = (
      c: keyof typeof COL,
      content: PlanCellContent,
      value: Figure,
      format?: string,
    ) => {
      figures.set(key(`${c}.${k}`), value);
      put(r, COL[c], content, {
        figure: key(`${c}.${k}`),
        ...(format === undefined ? {} : { format }),
      });
    };
    put(r, COL.lag, { value: k }, { format: PORTABLE_FORMATS.count });
    expect(
      "pairs",
      { formula: `=${lagSum(HELP.present, lag)}` },
      pairs[k] as number,
      PORTABLE_FORMATS.count,
    );
    expect(
      "r",
      { formula: `=IF(${at(COL.pairs)}>0,${lagSum(HELP.deviation, lag)}/${c0},"")` },
      finiteOr(row.correlation),
      PORTABLE_FORMATS.fixed,
    );
    put(
      r,
      COL.robustVar,
      { formula: `=${lagSum(HELP.square, lag)}/${c0}^2` },
      { format: PORTABLE_FORMATS.fixed },
    );
    const earlier = i === 0 ? undefined : `${cell(firstLagRow, COL.r)}:${cell(r - 1, COL.r)}`;
    expect(
      "se",
      { formula: `=${standardErrorFormula(table, earlier, n, at)}` },
      row.standardError,
      PORTABLE_FORMATS.fixed,
    );
    expect("band", { formula: `=${inner}*${at(COL.se)}` }, row.band, PORTABLE_FORMATS.fixed);
    const z = at(COL.z);
    expect(
      "z",
      { formula: `=IF(ISNUMBER(${at(COL.r)}),${at(COL.r)}/${at(COL.se)},"")` },
      finiteOr(row.z),
      PORTABLE_FORMATS.fixed,
    );
    expect(
      "pLag",
      { formula: `=IF(ISNUMBER(${z}),2*NORM.S.DIST(-ABS(${z}),TRUE),"")` },
      finiteOr(row.pLag),
      PORTABLE_FORMATS.p,
    );
    expect(
      "zone",
      {
        formula: `=IF(ISNUMBER(${z}),IF(ABS(${z})>${outer},"beyond",IF(ABS(${z})>${inner},"between","inside")),"")`,
      },
      zoneOf(row.z, row.beyond, row.outer),
    );
    put(
      r,
      COL.term,
      { formula: `=${termFormula(table, n, at)}` },
      { format: PORTABLE_FORMATS.statistic },
    );
    const upTo = (c: number) => `${cell(firstLagRow, c)}:${at(c)}`;
    expect(
      "jointQ",
      { formula: `=SUM(${upTo(COL.term)})` },
      row.jointQ,
      PORTABLE_FORMATS.statistic,
    );
    expect(
      "jointDf",
      { formula: `=COUNT(${upTo(COL.r)})-${fig("fittedParams")}` },
      row.jointDf,
      PORTABLE_FORMATS.count,
    );
    expect(
      "jointP",
      {
        formula: `=IF(${at(COL.jointDf)}>0,CHISQ.DIST.RT(${at(COL.jointQ)},${at(COL.jointDf)}),"")`,
      },
      finiteOr(row.jointP),
      PORTABLE_FORMATS.p,
    );
    put(
      r,
      COL.pmf,
      {
        formula: `=IF(${lag}<=${tested},BINOM.DIST(${lag},${tested},${alpha},FALSE),0)`,
      },
      { format: PORTABLE_FORMATS.p },
    );
    // The corridors as stacked areas: an invisible base up to −outer, then the bands on it.
    put(r, COL.base, { formula: `=-${outer}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.outerLower, { formula: `=${outer}-${inner}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.inner, { formula: `=2*${inner}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.outerUpper, { formula: `=${outer}-${inner}` }, { format: PORTABLE_FORMATS.fixed });
    for (const zone of ["inside", "between", "beyond"] as const) {
      put(
        r,
        COL[zone],
        {
          formula: `=IF(${at(COL.zone)}="${zone}",MAX(-${PIN},MIN(${PIN},${z})),NA())`,
        },
        { format: PORTABLE_FORMATS.fixed },
      );
    }
  });

  // One helper row per data cell.
  (Object.keys(HELP) as (keyof typeof HELP)[]).forEach((c) =>
    text(tableTop, HELP[c], HELP_HEADERS[c], "heading"),
  );
  const mean = fig("mean");
  for (let i = 0; i < L; i++) {
    const r = firstLagRow + i;
    const value = srcCell(i);
    const present = cell(r, HELP.present);
    put(r, HELP.position, { value: i + 1 });
    put(r, HELP.present, { formula: `=IF(ISNUMBER(${value}),1,0)` });
    put(r, HELP.value, { formula: `=IF(${present}=1,${value},0)` });
    put(r, HELP.deviation, { formula: `=IF(${present}=1,${value}-${mean},0)` });
    put(r, HELP.square, { formula: `=${cell(r, HELP.deviation)}^2` });
    put(r, HELP.where, { formula: `=IF(${present}=1,${i + 1},"")` });
  }
  return cells;
}

/** se_k of the band kind (bands.ts): 1/√n, Bartlett's √((1 + 2Σ_{j<k} r_j²)/n), or robust √v̂_k. */
function standardErrorFormula(
  table: LagTable,
  earlier: string | undefined,
  n: string,
  at: (c: number) => string,
): string {
  switch (table.bandKind) {
    case "noise":
      return `1/SQRT(${n})`;
    case "bartlett":
      // SUMSQ skips the blank text of a lag without pairs, as the core skips its NaN.
      return earlier === undefined ? `SQRT(1/${n})` : `SQRT((1+2*SUMSQ(${earlier}))/${n})`;
    case "robust":
      return `SQRT(${at(COL.robustVar)})`;
  }
}

/** The joint test's term of lag k (portmanteau.ts); a lag without pairs adds nothing. */
function termFormula(table: LagTable, n: string, at: (c: number) => string): string {
  const r = at(COL.r);
  const k = at(COL.lag);
  const v = at(COL.robustVar);
  switch (table.testKind) {
    case "ljung-box":
      return `IF(ISNUMBER(${r}),${n}*(${n}+2)*${r}^2/(${n}-${k}),0)`;
    case "box-pierce":
      return `IF(ISNUMBER(${r}),${n}*${r}^2,0)`;
    case "robust":
      return `IF(ISNUMBER(${r}),IF(${v}>0,${r}^2/${v},0),0)`;
    case "squares":
      throw new Error("the squares' test is not portable");
  }
}

/** One sentence that says what the verdict rests on, in the sheet's own text functions. */
function reasonFormula(table: LagTable, verdict: string, fig: (name: FigureRow) => string): string {
  const p = fig("p");
  const joint = `${textLiteral(`${TEST_NAMES[table.testKind]} over ${table.maxLag} lags: Q = `)}&TEXT(${fig("Q")},"0.00")&", df "&${fig("df")}&IF(${p}<0.0001,", p < 0.0001",", p = "&TEXT(${p},"0.0000"))`;
  const note = `${fig("tested")}&" lags tested at "&TEXT(${fig("alpha")},"0.0%")&": about "&TEXT(${fig("expected")},"0.0")&" would cross the one-lag band by chance even for pure noise; "&${fig("beyond")}&" did, "&${fig("outerCount")}&" of them beyond the all-lags corridor."`;
  const short = textLiteral(
    "Not judged: a verdict needs at least 20 values and at most n/4 lags; the figures are shown for reference. ",
  );
  return `=IF(${verdict}="short",${short},"")&${joint}&". "&${note}`;
}

/** The sheet-qualified A1 range of a plan column, for a chart or a writer. */
export function columnRange(sheet: string, c: PortableColumn): string {
  return `${quotedSheet(sheet)}!${absoluteColumn(c.row, c.column, c.rows)}`;
}

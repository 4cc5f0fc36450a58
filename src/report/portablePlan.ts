/**
 * The portable report of one series: the evidence of the live report written in the
 * spreadsheet's own functions (portableFormulas.ts lists them), so it stays live for a reader
 * without the add-in, in Excel, LibreOffice Calc or Google Sheets. One plan, two writers: the
 * pane (office.js) and `echolot workbook` (an xlsx file).
 *
 * What the cells compute, as the core does (autocorrelation.ts, bands.ts, portmanteau.ts,
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
import { seriesName, type LagTable, type Series } from "../core";
import { PALETTE } from "./palette";
import { portableBlock } from "./portableBlock";
import { blockWidths, COL, FIGURE_ROWS, PIN, PORTABLE_BLOCK_WIDTH, ROW } from "./portableLayout";
import type {
  Figure,
  PortableChart,
  PortableChartSeries,
  PortableColumn,
  PortableOptions,
  PortablePlan,
  PortableSheet,
  PortableSource,
} from "./portableTypes";

export { portableBlock } from "./portableBlock";
export {
  addInPermutes,
  PERMUTATION_NOTE,
  PORTABLE_BLOCK_WIDTH,
  PORTABLE_FORMATS,
  PORTABLE_TEST_KINDS,
  portableBlockCells,
  type PortableBlockCells,
} from "./portableLayout";

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
    title: `z by lag: ${seriesName(table.label, "cell")}`,
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

/**
 * The shapes of a portable report plan (portablePlan.ts): cells with their formats and the
 * figures they show, the native chart, the sheets. Shared by the plan, its writers and the tests.
 */
import type { PlanCellContent } from "./placedReport";

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

/**
 * The portable batch: one row per column with n, Q, df, p and the verdict, each read from a full
 * portable report block (portablePlan.ts) of that column, the blocks side by side on a working
 * sheet. A column Echolot cannot analyse (too few values, constant) keeps its row with the reason
 * and no block. Pure, like the single report; the figures carry Echolot's numbers for the tests.
 */
import type { LagTable, Series } from "../core";
import { absoluteCell, textLiteral } from "./portableFormulas";
import { portableBlock } from "./portableBlock";
import {
  addInPermutes,
  PORTABLE_BLOCK_WIDTH,
  PORTABLE_FORMATS,
  portableBlockCells,
} from "./portableLayout";
import type { Figure, PortableCell, PortablePlan, PortableSource } from "./portableTypes";
import { SCREENING_CAUTION } from "./verdictBadge";

/** One column of the batch: its label and source, and Echolot's table or why there is none. */
export interface PortableBatchItem {
  readonly label: string;
  readonly source: PortableSource;
  readonly analysis:
    { readonly table: LagTable; readonly series: Series } | { readonly reason: string };
}

export interface PortableBatchOptions {
  readonly summarySheet: string;
  readonly workSheet: string;
  readonly placedOn: string;
  /** Whether the source ranges run past the data (see PortableOptions). */
  readonly roomToGrow: boolean;
}

const HEADERS = ["series", "n", "Q", "df", "p (χ²)", "verdict", "note"] as const;
const FIRST_ROW = 6;

export function portableBatchPlan(
  items: readonly PortableBatchItem[],
  options: PortableBatchOptions,
): PortablePlan {
  const figures = new Map<string, Figure>();
  const summary: PortableCell[] = [];
  const work: PortableCell[] = [];
  const text = (row: number, column: number, value: string, style?: PortableCell["style"]) =>
    summary.push({ row, column, content: { value }, ...(style === undefined ? {} : { style }) });
  text(0, 0, "Echolot portable batch", "title");
  text(
    1,
    0,
    `One row per column: the joint test over the lags judged and the verdict, each from the column's full portable report on the sheet "${options.workSheet}" (lag correlations over the pairs present, bands, corridors, crossings against chance).`,
    "note",
  );
  text(
    2,
    0,
    "Written in the spreadsheet's own functions: live without the Echolot add-in, in Excel, LibreOffice Calc or Google Sheets. No false-discovery step across the columns (the add-in's batch adds q-values).",
    "note",
  );
  text(3, 0, SCREENING_CAUTION, "note");
  text(4, 0, `Placed on ${options.placedOn} by Echolot.`, "note");
  HEADERS.forEach((h, c) => text(FIRST_ROW - 1, c, h, "heading"));

  let block = 0;
  items.forEach((item, i) => {
    const row = FIRST_ROW + i;
    text(row, 0, item.label);
    if ("reason" in item.analysis) {
      text(row, 6, item.analysis.reason);
      return;
    }
    const { table, series } = item.analysis;
    const origin = { row: 0, column: block * PORTABLE_BLOCK_WIDTH };
    block++;
    const key = `b${i}:`;
    const cells = portableBlock(
      table,
      series,
      item.source,
      {
        sheetName: options.workSheet,
        placedOn: options.placedOn,
        origin,
        chart: false,
        key,
        roomToGrow: options.roomToGrow,
      },
      figures,
    );
    for (const cell of cells) work.push(cell);
    const at = portableBlockCells(options.workSheet, origin);
    const link = (column: number, ref: string, name: string, format?: string) => {
      summary.push({
        row,
        column,
        content: { formula: `=${ref}` },
        figure: `row${i}:${name}`,
        ...(format === undefined ? {} : { format }),
      });
      figures.set(`row${i}:${name}`, figures.get(`${key}${name}`) as Figure);
    };
    link(1, at.n, "n", PORTABLE_FORMATS.count);
    link(2, at.q, "Q", PORTABLE_FORMATS.statistic);
    link(3, at.df, "df", PORTABLE_FORMATS.count);
    link(4, at.p, "p", PORTABLE_FORMATS.p);
    link(5, at.verdict, "verdict");
    summary.push({
      row,
      column: 6,
      content: {
        formula: `=IF(${addInPermutes(at.n, at.maxLag, at.fittedParams, at.alpha)},${textLiteral("n·K ≤ 250,000: the add-in's permutation reading may differ")},"")`,
      },
      style: "note",
    });
  });

  let workRows = 1;
  for (const cell of work) if (cell.row + 1 > workRows) workRows = cell.row + 1;
  return {
    sheets: [
      {
        name: options.summarySheet,
        cells: summary,
        extent: { rows: FIRST_ROW + items.length, columns: HEADERS.length },
        print: { rows: FIRST_ROW + items.length, columns: HEADERS.length },
        widths: [
          { column: 0, width: 28 },
          { column: 6, width: 50 },
        ],
      },
      {
        name: options.workSheet,
        cells: work,
        extent: { rows: workRows, columns: Math.max(1, block) * PORTABLE_BLOCK_WIDTH },
        widths: [],
      },
    ],
    figures,
  };
}

/** The cell of the verdict in the summary row of item `index`, for a writer that links to it. */
export function batchVerdictCell(summarySheet: string, index: number): string {
  return absoluteCell(FIRST_ROW + index, 5, summarySheet);
}

/**
 * "Place portable report": writes the portable report plan (src/report/portablePlan.ts) of the
 * series the pane shows on a new sheet — formulas in the spreadsheet's own functions that refer
 * to the source range, number formats, and a native chart bound to its cells (the corridors as
 * stacked areas, the diamonds in three series by zone) — so the report stays live for readers
 * without the add-in. Nothing is written over a non-empty cell. The button is added beside
 * "Place snapshot" by `installPortableAction`, the one call the pane's host glue makes.
 */
import { capitalise, isEcholotError } from "../../src/core";
import {
  absoluteColumn,
  portablePlan,
  uniqueSheetName,
  type PortableCell,
  type PortableChart,
  type PortableColumn,
  type PortablePlan,
  type PortableSource,
} from "../../src/report";
import type { PaneController } from "../pane/controller";
import { showMessage, type PaneElements } from "../pane/view";
import { parseAreas, splitAddress } from "./address";
import { HostError, type ExcelRun } from "./excel";
import { literalText } from "./placeReport";

/** Rows a portable report may read: each data cell gets a row of helper formulas. */
export const PORTABLE_ROW_LIMIT = 50_000;

/** A single-column reference such as `'Q3 errors'!$B$1:$B$105` as the plan's source. */
export function portableSource(reference: string): PortableSource {
  const { sheet, range } = splitAddress(reference);
  const [area] = parseAreas(range);
  if (area === undefined || area.firstColumn !== area.lastColumn) {
    throw new HostError("a portable report reads one column: select a single column of values");
  }
  const rows = area.lastRow - area.firstRow + 1;
  if (rows > PORTABLE_ROW_LIMIT) {
    throw new HostError(
      `a portable report writes a row of helper formulas for each data cell, so it reads at most ${PORTABLE_ROW_LIMIT.toLocaleString("en")} rows (this range has ${rows.toLocaleString("en")}); place a snapshot instead`,
    );
  }
  return { sheet, column: area.firstColumn, firstRow: area.firstRow, rows };
}

export interface PortablePlacement {
  readonly sheetName: string;
  readonly cellsWritten: number;
}

const FONTS = {
  title: { bold: true, size: 14 },
  heading: { bold: true },
  verdict: { bold: true, size: 12 },
  note: { italic: true },
} as const;

/** Writes the plan's one sheet under a unique name; refuses to write over anything. */
export async function placePortable(run: ExcelRun, plan: PortablePlan): Promise<PortablePlacement> {
  const [report] = plan.sheets;
  if (report === undefined || plan.sheets.length !== 1) {
    throw new Error("the pane places a portable report of one series");
  }
  return run(async (context) => {
    const sheets = context.workbook.worksheets;
    sheets.load("items/name");
    await context.sync();
    const name = uniqueSheetName(
      report.name,
      sheets.items.map((s) => s.name),
    );
    const sheet = sheets.add(name);
    const area = sheet.getRangeByIndexes(0, 0, report.extent.rows, report.extent.columns);
    area.load("formulas");
    await context.sync();
    if (area.formulas.some((row) => row.some((cell) => cell !== "" && cell !== null))) {
      throw new HostError(
        `the new sheet "${name}" already holds data; nothing was written. Remove or rename that sheet, then place the report again`,
      );
    }
    // Column by column, in runs of consecutive rows: one request per run rather than per cell,
    // and a sync every so often, so a long column stays within the host's request size.
    let pending = 0;
    for (const run of columnRuns(report.cells)) {
      const target = sheet.getRangeByIndexes(run[0]?.row ?? 0, run[0]?.column ?? 0, run.length, 1);
      target.formulas = run.map((cell) => [cellInput(cell)]);
      if (run.some((cell) => cell.format !== undefined)) {
        target.numberFormat = run.map((cell) => [cell.format ?? "General"]);
      }
      for (const cell of run) {
        if (cell.style === undefined) continue;
        const font = sheet.getRangeByIndexes(cell.row, cell.column, 1, 1).format.font;
        Object.assign(font, FONTS[cell.style]);
      }
      pending += run.length;
      if (pending >= CELLS_PER_SYNC) {
        await context.sync();
        pending = 0;
      }
    }
    for (const { column, width } of report.widths) {
      // Excel measures column widths in points; a character is about 7 points wide.
      sheet.getRangeByIndexes(0, column, 1, 1).format.columnWidth = width * 7;
    }
    if (report.chart !== undefined) addPortableChart(sheet, report.chart);
    sheet.activate();
    await context.sync();
    return { sheetName: name, cellsWritten: report.cells.length };
  });
}

/** Cells written before each sync: well under the host's 5 MB request limit. */
const CELLS_PER_SYNC = 20_000;

/** What a cell is given through `range.formulas`: a formula, a number, or literal text. */
function cellInput(cell: PortableCell): string | number {
  if ("formula" in cell.content) return cell.content.formula;
  const value = cell.content.value;
  return typeof value === "string" ? literalText(value) : value;
}

/**
 * The cells grouped by column into runs of consecutive rows (at most CELLS_PER_SYNC each), in
 * column then row order.
 */
function columnRuns(cells: readonly PortableCell[]): PortableCell[][] {
  const sorted = [...cells].sort((a, b) => a.column - b.column || a.row - b.row);
  const runs: PortableCell[][] = [];
  let run: PortableCell[] = [];
  for (const cell of sorted) {
    const last = run[run.length - 1];
    const apart = last !== undefined && (last.column !== cell.column || last.row + 1 !== cell.row);
    if (apart || run.length >= CELLS_PER_SYNC) {
      runs.push(run);
      run = [];
    }
    run.push(cell);
  }
  if (run.length > 0) runs.push(run);
  return runs;
}

function local(column: PortableColumn): string {
  return absoluteColumn(column.row, column.column, column.rows);
}

function addPortableChart(sheet: Excel.Worksheet, plan: PortableChart): void {
  const [base, ...rest] = plan.series;
  if (base === undefined) return;
  // Created from the base column with its header cell above it, which every host reads as the
  // series' name rather than as a first value.
  const withHeader = { ...base.values, row: base.values.row - 1, rows: base.values.rows + 1 };
  const chart = sheet.charts.add("AreaStacked", sheet.getRange(local(withHeader)), "Columns");
  chart.title.text = plan.title;
  chart.legend.position = "Bottom";
  const corner = (at: { row: number; column: number }) =>
    absoluteColumn(at.row, at.column, 1).split(":")[0] as string;
  chart.setPosition(corner(plan.from), corner(plan.to));
  const categories = sheet.getRange(local(plan.categories));
  [base, ...rest].forEach((spec, index) => {
    const series = index === 0 ? chart.series.getItemAt(0) : chart.series.add(spec.name);
    if (index === 0) series.name = spec.name;
    else series.setValues(sheet.getRange(local(spec.values)));
    series.setXAxisValues(categories);
    if (spec.type === "diamonds") {
      series.chartType = "LineMarkers";
      series.markerStyle = "Diamond";
      series.markerSize = 7;
      series.format.line.lineStyle = "None";
      if (spec.colour !== null) {
        series.markerBackgroundColor = spec.colour;
        series.markerForegroundColor = spec.colour;
      }
    } else if (spec.colour === null) {
      series.format.fill.clear();
    } else {
      series.format.fill.setSolidColor(spec.colour);
    }
  });
  chart.axes.valueAxis.title.text = plan.yTitle;
  chart.axes.categoryAxis.title.text = plan.xTitle;
}

function messageOf(error: unknown): string {
  if (error instanceof HostError || isEcholotError(error)) {
    return capitalise(error.message);
  }
  return `The workbook refused the request: ${error instanceof Error ? error.message : String(error)}`;
}

/** Today as the report's header shows it. */
function today(): string {
  return new Date().toISOString().slice(0, 10);
}

/**
 * Adds "Place portable report" after "Place snapshot" and wires it to the series the pane shows;
 * it is enabled whenever the pane shows a series from the workbook.
 */
export function installPortableAction(
  el: PaneElements,
  pane: PaneController,
  run: ExcelRun,
): HTMLButtonElement {
  const button = el.placeSnapshot.ownerDocument.createElement("button");
  button.type = "button";
  button.id = "place-portable";
  button.textContent = "Place portable report";
  button.title =
    "Writes the evidence in the spreadsheet's own functions: live for every reader, with or without the add-in";
  el.placeSnapshot.after(button);
  const previous = pane.onShown;
  pane.onShown = (shown) => {
    previous(shown);
    button.disabled = shown === null;
  };
  button.disabled = pane.shown === null;
  button.addEventListener("click", () => {
    const shown = pane.shown;
    if (shown === null) return;
    void (async () => {
      showMessage(el.actionStatus, "Placing the portable report…");
      try {
        const reference = shown.input.references?.[shown.index];
        const series = shown.input.series[shown.index];
        if (reference === undefined || series === undefined) {
          throw new HostError("no source range to refer to");
        }
        const table = shown.analysis.table;
        const plan = portablePlan(table, series, portableSource(reference), {
          sheetName: `${table.label === "" ? "" : `${table.label} `}portable`,
          placedOn: today(),
        });
        const placed = await placePortable(run, plan);
        showMessage(
          el.actionStatus,
          `Portable report placed on the new sheet “${placed.sheetName}”: it recomputes without the add-in.`,
        );
      } catch (error) {
        showMessage(el.actionStatus, messageOf(error));
      }
    })();
  });
  return button;
}

/**
 * Carries out a report plan (src/report/placedReport.ts) in the workbook: a new sheet with a
 * unique name, a check that every cell the report will use is empty (nothing is ever written over
 * a value or a formula), the cells, and a native chart in our palette — the corridors as stacked
 * areas, the standardised values as diamonds.
 *
 * The new sheet is not activated: activating it would move the workbook's selection there and
 * fire the selection event (Excel.Worksheet.activate, Excel.Workbook.onSelectionChanged), and the
 * pane, following the selection, would leave the series it was showing for the report sheet.
 * The pane names the new sheet instead.
 */
import { cellAddress, uniqueSheetName, type PlanChart, type ReportPlan } from "../../src/report";
import { HostError, type ExcelRun } from "./excel";

export interface Placement {
  readonly sheetName: string;
  readonly cellsWritten: number;
}

/**
 * Text a cell must show as text: one that starts with = + - @ would be read as a formula and a
 * leading apostrophe would be swallowed, so those get the apostrophe that marks literal text.
 */
export function literalText(text: string): string {
  return /^[=+\-@']/.test(text) ? `'${text}` : text;
}

export async function placeReport(run: ExcelRun, plan: ReportPlan): Promise<Placement> {
  return run(async (context) => {
    const sheets = context.workbook.worksheets;
    sheets.load("items/name");
    await context.sync();
    const name = uniqueSheetName(
      plan.sheetName,
      sheets.items.map((s) => s.name),
    );
    const sheet = sheets.add(name);
    const area = sheet.getRangeByIndexes(0, 0, plan.extent.rows, plan.extent.columns);
    area.load("formulas");
    await context.sync();
    const occupied = firstOccupied(area.formulas);
    if (occupied !== undefined) {
      throw new HostError(
        `the new sheet "${name}" already holds data at ${cellAddress(occupied.row, occupied.column)}; nothing was written. Remove or rename that sheet, then place the report again`,
      );
    }

    for (const cell of plan.cells) {
      const target = sheet.getRangeByIndexes(cell.row, cell.column, 1, 1);
      if ("formula" in cell.content) {
        target.formulas = [[cell.content.formula]];
      } else {
        const value = cell.content.value;
        target.values = [[typeof value === "string" ? literalText(value) : value]];
      }
    }
    sheet.getRangeByIndexes(0, 0, 1, 1).format.font.bold = true;
    addChart(sheet, plan.chart);
    await context.sync();
    return { sheetName: name, cellsWritten: plan.cells.length };
  });
}

function firstOccupied(
  grid: readonly (readonly unknown[])[],
): { row: number; column: number } | undefined {
  for (let row = 0; row < grid.length; row++) {
    const cells = grid[row] ?? [];
    for (let column = 0; column < cells.length; column++) {
      const cell = cells[column];
      if (cell !== "" && cell !== null && cell !== undefined) return { row, column };
    }
  }
  return undefined;
}

function addChart(sheet: Excel.Worksheet, plan: PlanChart): void {
  const chart = sheet.charts.add("AreaStacked", sheet.getRange(plan.corridorSource), "Columns");
  chart.title.text = plan.title;
  chart.legend.position = "Bottom";
  chart.setPosition(plan.from, plan.to);
  const categories = sheet.getRange(plan.categories);
  plan.series.forEach((spec, index) => {
    const series =
      spec.type === "area" ? chart.series.getItemAt(index) : chart.series.add(spec.name);
    if (spec.type === "diamonds") {
      series.setValues(sheet.getRange(spec.values));
      series.chartType = "LineMarkers";
      series.markerStyle = "Diamond";
      series.markerSize = 7;
      series.format.line.lineStyle = "None";
    }
    series.setXAxisValues(categories);
    if (spec.colour === undefined) {
      series.format.fill.clear();
    } else if (spec.type === "area") {
      series.format.fill.setSolidColor(spec.colour);
    } else {
      series.markerBackgroundColor = spec.colour;
      series.markerForegroundColor = spec.colour;
    }
  });
  chart.axes.valueAxis.title.text = "z";
  chart.axes.categoryAxis.title.text = "lag";
}

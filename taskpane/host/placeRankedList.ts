/**
 * "Export ranked list" inside a workbook: the ranked list goes on a new sheet, as values, because
 * a spreadsheet user expects a list in the workbook they are working in (sortable, filterable,
 * saved with it) rather than a file download, which a task pane inside a desktop host may not
 * offer at all. Like the reports: a new sheet with a unique name, never activated (activating it
 * would move the selection and the pane would leave the item it shows), and text that would read
 * as a formula kept literal.
 */
import { uniqueSheetName } from "../../src/report";
import type { ExcelRun } from "./excel";
import { literalText } from "./placeReport";

export async function placeRankedList(
  run: ExcelRun,
  grid: readonly (readonly (string | number)[])[],
  baseName = "ranked",
): Promise<string> {
  const rows = grid.length;
  const columns = grid[0]?.length ?? 0;
  return run(async (context) => {
    const sheets = context.workbook.worksheets;
    sheets.load("items/name");
    await context.sync();
    const name = uniqueSheetName(
      baseName,
      sheets.items.map((s) => s.name),
    );
    const sheet = sheets.add(name);
    const area = sheet.getRangeByIndexes(0, 0, rows, columns);
    area.values = grid.map((row) =>
      row.map((value) => (typeof value === "string" ? literalText(value) : value)),
    );
    sheet.getRangeByIndexes(0, 0, 1, columns).format.font.bold = true;
    await context.sync();
    return name;
  });
}

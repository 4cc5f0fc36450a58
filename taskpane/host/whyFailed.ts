/**
 * Why a cell failed: when the selected cell holds an ECHOLOT formula that shows an error, the pane
 * reads the formula's arguments from the workbook, calls the same function with them, and shows
 * the message it gives. Some hosts show a custom function's error without its message (office-js
 * issue #4813 on the OfficeDev tracker), so the pane is where the reason can always be read.
 */
import { splitAddress } from "./address";
import { readEcholotCall, type FormulaArgument } from "./cellFormula";
import { HostError, type ExcelRun } from "./excel";
import { FUNCTION_PAYLOAD_CELLS, withErrorCells, type ErrorCell } from "./readRange";

/** A cell function as registered: any arguments in, a spilled grid out, a thrown error on failure. */
type CellFunction = (...args: unknown[]) => unknown;

/** The functions bundle's registry (functions/functions.ts puts it on the page's global scope). */
export function registeredFunctions(): Readonly<Record<string, CellFunction>> | undefined {
  return (globalThis as { echolotCellFunctions?: Record<string, CellFunction> })
    .echolotCellFunctions;
}

/** What a shown error means when the function itself answers without one. */
const SHEET_ERRORS: Readonly<Record<string, string>> = {
  "#SPILL!":
    "the cells it spills into are not all empty, or the spill would run off the sheet; clear the cells below and to the right of it",
  "#NAME?": "the host does not know the function: the add-in is not loaded in this workbook",
  "#BUSY!": "the host is still computing it; wait a moment",
  "#CALC!": "the host could not compute the formula around the function",
  "#CONNECT!": "the host lost the add-in's runtime while computing it; reopen the workbook",
};

/** A range's cells as a cell function receives them: blanks "", error cells as error values. */
async function readArgumentRange(
  run: ExcelRun,
  sheetName: string,
  range: string,
): Promise<unknown[][]> {
  return run(async (context) => {
    const sheet = context.workbook.worksheets.getItem(sheetName);
    const whole = sheet.getRange(range);
    const used = sheet.getUsedRangeOrNullObject(true);
    whole.load(["rowIndex", "columnIndex", "rowCount", "columnCount"]);
    used.load(["rowIndex", "columnIndex", "rowCount", "columnCount"]);
    await context.sync();
    // Rows and columns beyond the sheet's used part are blank: leave them out, as the function's
    // intake trims trailing blanks anyway, so a whole-column reference reads only its data.
    const rows = used.isNullObject
      ? 1
      : Math.max(1, Math.min(whole.rowCount, used.rowIndex + used.rowCount - whole.rowIndex));
    const columns = used.isNullObject
      ? 1
      : Math.max(
          1,
          Math.min(whole.columnCount, used.columnIndex + used.columnCount - whole.columnIndex),
        );
    if (rows * columns > FUNCTION_PAYLOAD_CELLS) {
      throw new HostError(
        `its range ${range} holds ${(rows * columns).toLocaleString("en")} cells, more than the pane recomputes; select the data itself to analyse it`,
      );
    }
    const part = sheet.getRangeByIndexes(whole.rowIndex, whole.columnIndex, rows, columns);
    part.load(["values", "valueTypes"]);
    await context.sync();
    const types = part.valueTypes;
    return part.values.map((row, i) => withErrorCells(row, types[i] ?? []));
  });
}

async function argumentValue(
  run: ExcelRun,
  arg: FormulaArgument,
  formulaSheet: string,
): Promise<unknown> {
  switch (arg.kind) {
    case "omitted":
      return null;
    case "number":
    case "text":
      return arg.value;
    case "reference": {
      const cells = await readArgumentRange(run, arg.sheet ?? formulaSheet, arg.range);
      // A one-cell reference to a scalar argument arrives as the cell's value.
      return cells.length === 1 && cells[0]?.length === 1 && !arg.range.includes(":")
        ? cells[0][0]
        : cells;
    }
  }
}

/**
 * The pane's explanation for a selected cell showing `shown` (an error value) whose formula is
 * `formula`, or null when the formula is not an ECHOLOT call the pane can follow.
 */
export async function explainFailedCell(
  run: ExcelRun,
  address: string,
  formula: string,
  shown: ErrorCell,
  functions: Readonly<Record<string, CellFunction>> | undefined = registeredFunctions(),
): Promise<string | null> {
  const call = readEcholotCall(formula);
  if (call === null) return null;
  const intro = `Cell ${address} shows ${shown.code}.`;
  const fn = functions?.[call.id];
  if (fn === undefined) {
    return `${intro} ECHOLOT.${call.id} is not a function of this add-in; check its name.`;
  }
  const sheet = splitAddress(address).sheet;
  const args: unknown[] = [];
  for (const arg of call.args) args.push(await argumentValue(run, arg, sheet));
  try {
    fn(...args);
  } catch (error) {
    const { code, message } = error as { code?: unknown; message?: unknown };
    const said =
      typeof message === "string" && message !== "" ? message.replace(/\.$/, "") : "(no message)";
    const codeText = typeof code === "string" ? code : shown.code;
    return `${intro} ECHOLOT.${call.id}, recomputed from the same arguments, gives ${codeText}: ${said}.`;
  }
  const meaning = SHEET_ERRORS[shown.code] ?? "the error comes from the sheet, not the function";
  return `${intro} ECHOLOT.${call.id}, recomputed from the same arguments, gives a result, so ${meaning}.`;
}

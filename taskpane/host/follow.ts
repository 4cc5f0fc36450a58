/**
 * Follow mode: once a range is pinned, the pane recomputes when its values may have changed —
 * an edit on its sheet that touches it (`onChanged`), or a recalculation of its sheet
 * (`onCalculated`: residual columns are usually formulas, whose values change without any edit
 * in the range). `onChange` receives the edited address, or `null` after a recalculation (the
 * caller then compares the values it reads with those it has). Handlers live as long as the pane
 * does (the host does not keep them across sessions); `stop` removes them.
 */
import { splitAddress, touches } from "./address";
import type { ExcelRun } from "./excel";
import { removeHandlers } from "./selection";

export interface Following {
  readonly address: string;
  stop(): Promise<void>;
}

export async function followRange(
  run: ExcelRun,
  address: string,
  onChange: (changedAddress: string | null) => void | Promise<void>,
): Promise<Following> {
  const { sheet, range } = splitAddress(address);
  const handlers = await run(async (context) => {
    const worksheet =
      sheet === ""
        ? context.workbook.worksheets.getActiveWorksheet()
        : context.workbook.worksheets.getItem(sheet);
    const edited = worksheet.onChanged.add(async (event) => {
      // The pane's own writes (reports on new sheets) never change the data it follows.
      if (event.triggerSource === "ThisLocalAddin") return;
      if (touches(event.address, range)) await onChange(event.address);
    });
    const recalculated = worksheet.onCalculated.add(async () => {
      await onChange(null);
    });
    await context.sync();
    return [edited, recalculated] as OfficeExtension.EventHandlerResult<unknown>[];
  });
  return { address, stop: () => removeHandlers(run, handlers) };
}

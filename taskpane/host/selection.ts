/** Selection changes in the workbook, for the pane's "follow the selection" default. */
import type { ExcelRun } from "./excel";

export interface Watching {
  stop(): Promise<void>;
}

export async function watchSelection(
  run: ExcelRun,
  onSelect: () => void | Promise<void>,
): Promise<Watching> {
  const handler = await run(async (context) => {
    const result = context.workbook.onSelectionChanged.add(async () => {
      await onSelect();
    });
    await context.sync();
    return result;
  });
  return { stop: () => removeHandlers(run, [handler]) };
}

/**
 * Removes event handlers through the context they were added in, inside an `Excel.run` of that
 * context, as the host requires (OfficeExtension.EventHandlerResult; learn.microsoft.com, "Work
 * with events using the Excel JavaScript API", "Remove an event handler").
 */
export async function removeHandlers(
  run: ExcelRun,
  handlers: readonly OfficeExtension.EventHandlerResult<unknown>[],
): Promise<void> {
  const first = handlers[0];
  if (first === undefined) return;
  await run(first.context, async (context) => {
    for (const handler of handlers) handler.remove();
    await context.sync();
  });
}

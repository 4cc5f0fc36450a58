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
  return {
    async stop() {
      handler.remove();
      await handler.context.sync();
    },
  };
}

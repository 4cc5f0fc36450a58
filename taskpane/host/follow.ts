/**
 * Follow mode: once a range is pinned, a change on its sheet that touches it calls back, so the
 * pane recomputes. Handlers live as long as the pane does (the host does not keep them across
 * sessions); `stop` removes the handler.
 */
import { splitAddress, touches } from "./address";
import type { ExcelRun } from "./excel";

export interface Following {
  readonly address: string;
  stop(): Promise<void>;
}

export async function followRange(
  run: ExcelRun,
  address: string,
  onChange: (changedAddress: string) => void | Promise<void>,
): Promise<Following> {
  const { sheet, range } = splitAddress(address);
  const handler = await run(async (context) => {
    const worksheet =
      sheet === ""
        ? context.workbook.worksheets.getActiveWorksheet()
        : context.workbook.worksheets.getItem(sheet);
    const result = worksheet.onChanged.add(async (event) => {
      if (touches(event.address, range)) await onChange(event.address);
    });
    await context.sync();
    return result;
  });
  return {
    address,
    async stop() {
      handler.remove();
      await handler.context.sync();
    },
  };
}

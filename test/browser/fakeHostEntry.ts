/**
 * Stands in for office.js when the built pane is opened as if inside a workbook: `Office.onReady`
 * reports the spreadsheet host, `Excel.run` works on the in-memory workbook of test/pane, and
 * `CustomFunctions` takes the functions bundle's registrations. The workbook starts with Series F
 * in column A of a sheet "Forecast errors", selected, and is reachable as `window.echolotHost`.
 */
import { FakeExcel } from "../pane/fakeExcel";

declare global {
  interface Window {
    echolotSeriesF: (string | number)[];
    echolotHost: FakeExcel;
  }
}

const host = new FakeExcel("Forecast errors");
host.sheet("Forecast errors").fill(
  "A1",
  window.echolotSeriesF.map((v) => [v]),
);
host
  .sheet("Forecast errors")
  .fill("C1", [["other"], ...window.echolotSeriesF.slice(1).map((v) => [Number(v) % 7])]);
host.selection = { sheet: "Forecast errors", range: "A1:A71" };
window.echolotHost = host;

const info = { host: "Excel", platform: "PC" };
Object.assign(window, {
  Excel: { run: host.run },
  Office: {
    HostType: { Excel: "Excel" },
    onReady: (callback?: (i: typeof info) => void) =>
      Promise.resolve(info).then((i) => {
        callback?.(i);
        return i;
      }),
  },
  CustomFunctions: {
    associate: () => undefined,
    Error: class extends Error {},
    ErrorCode: { invalidValue: "#VALUE!", notAvailable: "#N/A" },
  },
});

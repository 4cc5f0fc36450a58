/**
 * Stands in for office.js when the built pane is opened as if inside a workbook: `Office.onReady`
 * reports the spreadsheet host, `Excel.run` works on the in-memory workbook of test/pane,
 * `Office.context.requirements.isSetSupported` and `Office.addin` answer as that workbook does,
 * and `CustomFunctions` takes the functions bundle's registrations. The workbook starts with
 * Series F in column A of a sheet "Forecast errors", selected; column E holds Series F with two
 * #N/A error cells (gaps written with NA()). It is reachable as `window.echolotHost`.
 */
import { errorValue, FakeExcel } from "../pane/fakeExcel";

declare global {
  interface Window {
    echolotSeriesF: (string | number)[];
    echolotHost: FakeExcel;
    echolotErrorValue: typeof errorValue;
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
host.sheet("Forecast errors").fill(
  "E1",
  window.echolotSeriesF.map((v, i) => [i === 12 || i === 40 ? errorValue("#N/A") : v]),
);
host.selection = { sheet: "Forecast errors", range: "A1:A71" };
window.echolotHost = host;
window.echolotErrorValue = errorValue;

const info = { host: "Excel", platform: "PC" };
Object.assign(window, {
  Excel: { run: host.run },
  Office: {
    HostType: { Excel: "Excel" },
    VisibilityMode: { hidden: "Hidden", taskpane: "Taskpane" },
    context: {
      requirements: {
        isSetSupported: (name: string, version: string) =>
          name === "SharedRuntime" || (name === "ExcelApi" && host.supports(version)),
      },
    },
    addin: host.addin,
    onReady: (callback?: (i: typeof info) => void) =>
      Promise.resolve(info).then((i) => {
        callback?.(i);
        return i;
      }),
  },
  CustomFunctions: {
    associate: () => undefined,
    // As the runtime's CustomFunctions.Error: a code and a message.
    Error: class extends Error {
      constructor(
        readonly code: string,
        message?: string,
      ) {
        super(message ?? "");
      }
    },
    ErrorCode: { invalidValue: "#VALUE!", notAvailable: "#N/A" },
  },
});

/**
 * Declared requirements: every Excel API member the pane's host glue touches, with the ExcelApi
 * requirement set it needs. The sets come from the "[Api set: ExcelApi x.y]" remarks of the
 * members' doc comments in @types/office-js (the same text as the learn.microsoft.com reference
 * pages), read from node_modules; the members come from the fake host's record of what the glue
 * touched while it read, followed, placed reports and explained a failed cell. The test fails
 * when a member is missing from the list, when the list disagrees with the doc comments, or when a
 * member needs more than the manifest declares without being checked with isSetSupported first.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { lagTable } from "../../src/core";
import { liveReportPlan, snapshotReportPlan } from "../../src/report";
import { seriesOfReading } from "../../taskpane/host/hostMode";
import { placeReport } from "../../taskpane/host/placeReport";
import { readSelectedRange } from "../../taskpane/host/readRange";
import { HostSession } from "../../taskpane/host/session";
import { explainFailedCell } from "../../taskpane/host/whyFailed";
import { loadBuiltFunctions } from "../functions/host";
import { at, parseXml } from "../manifest/xml";
import { errorValue, FakeExcel } from "./fakeExcel";
import { recorder } from "./recorder";
import { seriesFColumn } from "./seriesF";

const ROOT = join(__dirname, "..", "..");

/** Every member the pane calls, and the ExcelApi set its doc comment names. */
const PANE_API: Readonly<Record<string, string>> = {
  "ChartAxes.categoryAxis": "1.1",
  "ChartAxes.valueAxis": "1.1",
  "ChartAxis.title": "1.1",
  "ChartAxisTitle.text": "1.1",
  "Chart.axes": "1.1",
  "Chart.legend": "1.1",
  "Chart.series": "1.1",
  "Chart.setPosition": "1.1",
  "Chart.title": "1.1",
  "ChartCollection.add": "1.1",
  "ChartFill.clear": "1.1",
  "ChartFill.setSolidColor": "1.1",
  "ChartLegend.position": "1.1",
  "ChartLineFormat.lineStyle": "1.7",
  "ChartSeries.chartType": "1.7",
  "ChartSeries.format": "1.1",
  "ChartSeries.markerBackgroundColor": "1.7",
  "ChartSeries.markerForegroundColor": "1.7",
  "ChartSeries.markerSize": "1.7",
  "ChartSeries.markerStyle": "1.7",
  "ChartSeries.setValues": "1.7",
  "ChartSeries.setXAxisValues": "1.7",
  "ChartSeriesCollection.add": "1.7",
  "ChartSeriesCollection.getItemAt": "1.1",
  "ChartSeriesFormat.fill": "1.1",
  "ChartSeriesFormat.line": "1.1",
  "ChartTitle.text": "1.1",
  "Range.address": "1.1",
  "Range.columnCount": "1.1",
  "Range.columnIndex": "1.1",
  "Range.format": "1.1",
  "Range.formulas": "1.1",
  "Range.getCell": "1.1",
  "Range.getIntersectionOrNullObject": "1.4",
  "Range.getResizedRange": "1.2",
  "Range.isNullObject": "1.1",
  "Range.load": "1.1",
  "Range.rowCount": "1.1",
  "Range.rowIndex": "1.1",
  "Range.valueTypes": "1.1",
  "Range.values": "1.1",
  "Range.worksheet": "1.1",
  "RangeAreas.address": "1.9",
  "RangeAreas.areaCount": "1.9",
  "RangeAreas.load": "1.9",
  "RangeFont.bold": "1.1",
  "RangeFormat.font": "1.1",
  "Workbook.getSelectedRange": "1.1",
  "Workbook.getSelectedRanges": "1.9",
  "Workbook.onSelectionChanged": "1.2",
  "Workbook.worksheets": "1.1",
  "Worksheet.charts": "1.1",
  "Worksheet.getRange": "1.1",
  "Worksheet.getRangeByIndexes": "1.7",
  "Worksheet.getUsedRangeOrNullObject": "1.4",
  "Worksheet.name": "1.1",
  "Worksheet.onCalculated": "1.8",
  "Worksheet.onChanged": "1.7",
  "WorksheetCollection.add": "1.1",
  "WorksheetCollection.getItem": "1.1",
  "WorksheetCollection.items": "1.1",
  "WorksheetCollection.load": "1.1",
  // Read from the change event's arguments (the fake does not record event arguments): on an
  // older host it is undefined, and follow.ts then treats the event as anyone's edit.
  "WorksheetChangedEventArgs.triggerSource": "1.14",
};

/**
 * Members beyond the declared set, each used only after `isSetSupported` (or where absence is
 * harmless), with the source file and the text of the check.
 */
const CHECKED_BEYOND: Readonly<Record<string, { file: string; check: string }>> = {
  "Workbook.getSelectedRanges": {
    file: "taskpane/host/readRange.ts",
    check: 'options.support?.("1.9") === true',
  },
  "RangeAreas.address": { file: "taskpane/host/readRange.ts", check: 'support?.("1.9")' },
  "RangeAreas.areaCount": { file: "taskpane/host/readRange.ts", check: 'support?.("1.9")' },
  "RangeAreas.load": { file: "taskpane/host/readRange.ts", check: 'support?.("1.9")' },
  "WorksheetChangedEventArgs.triggerSource": {
    file: "taskpane/host/follow.ts",
    check: 'event.triggerSource === "ThisLocalAddin"',
  },
};

/** The ExcelApi set the doc comment of Excel.<type>.<member> names, from @types/office-js. */
function documentedSet(lines: readonly string[], type: string, member: string): string {
  // Inherited from OfficeExtension.ClientObject, the common API every host has: no ExcelApi set.
  if (member === "isNullObject") return "1.1";
  const head = new RegExp(`^ {4}(?:class|interface) ${type}\\b`);
  // The declarations of namespace Excel come first; Excel.Interfaces repeats names later.
  const start = lines.findIndex((line, i) => head.test(line) && i > EXCEL_NAMESPACE);
  if (start < 0) throw new Error(`@types/office-js has no Excel.${type}`);
  const declaration = new RegExp(`^ {8}(?:readonly )?${member}\\??\\s*[:(<]`);
  for (let i = start + 1; i < lines.length && !/^ {4}\}/.test(lines[i] ?? ""); i++) {
    if (!declaration.test(lines[i] ?? "")) continue;
    for (let j = i - 1; j > start && !(lines[j] ?? "").includes("/**"); j--) {
      const set = /\[Api set: ExcelApi (\d+\.\d+)/.exec(lines[j] ?? "")?.[1];
      if (set !== undefined) return set;
    }
    // load() and a collection's items carry no remark of their own: they come with their
    // class, whose remark names the set.
    for (let j = start - 1; j > 0 && !(lines[j] ?? "").includes("/**"); j--) {
      const set = /\[Api set: ExcelApi (\d+\.\d+)/.exec(lines[j] ?? "")?.[1];
      if (set !== undefined) return set;
    }
    break;
  }
  throw new Error(`@types/office-js has no Excel.${type}.${member}`);
}

let EXCEL_NAMESPACE = 0;

function versionAbove(a: string, b: string): boolean {
  const [am = 0, an = 0] = a.split(".").map(Number);
  const [bm = 0, bn = 0] = b.split(".").map(Number);
  return am !== bm ? am > bm : an > bn;
}

/** Runs the pane's host glue through everything it does, on a host of `apiVersion`. */
async function exercise(apiVersion: string): Promise<Set<string>> {
  const host = new FakeExcel("Errors");
  host.apiVersion = apiVersion;
  host.sheet("Errors").fill(
    "B1",
    seriesFColumn().map((v) => [v]),
  );
  await host.select("Errors", "B1:B71");
  const log = recorder();
  const session = new HostSession(host.run, log.listener, { support: host.supports });
  await session.start();
  await session.pin();
  await host.edit("Errors", "B3", [[30]]);
  await session.unpin();
  await session.stop();
  const read = await readSelectedRange(host.run, { support: host.supports });
  const table = lagTable(seriesOfReading(read).series[0] as never, {});
  await placeReport(host.run, liveReportPlan(table, { reference: "'Errors'!$B$1:$B$71" }));
  await placeReport(host.run, snapshotReportPlan(table));
  const formula = "=ECHOLOT.SERIESLAGCORR(Errors!B:B,80)";
  host.sheet("Errors").setFormula("D2", formula, errorValue("#VALUE!"));
  await explainFailedCell(host.run, "Errors!D2", formula, { code: "#VALUE!" }, BY_ID);
  expect(log.errors).toEqual([]);
  return host.used;
}

let BY_ID: ReturnType<typeof loadBuiltFunctions>["byId"];

describe("the Excel API the pane calls, and the requirement sets it needs", () => {
  let lines: string[];
  let declared: string;
  let usedModern: Set<string>;
  let usedOld: Set<string>;

  beforeAll(async () => {
    const types = readFileSync(join(ROOT, "node_modules/@types/office-js/index.d.ts"), "utf8");
    lines = types.split("\n");
    EXCEL_NAMESPACE = lines.findIndex((line) => /^declare namespace Excel \{/.test(line));
    const manifest = parseXml(readFileSync(join(ROOT, "manifest/manifest.xml"), "utf8"));
    const sets = at(manifest, "Requirements", "Sets").children;
    declared = sets.find((s) => s.attributes.Name === "ExcelApi")?.attributes.MinVersion ?? "none";
    BY_ID = loadBuiltFunctions().byId;
    usedModern = await exercise("1.17");
    usedOld = await exercise(declared);
  });

  it("lists every member the pane touched", () => {
    const missing = [...usedModern, ...usedOld].filter((m) => PANE_API[m] === undefined);
    expect(missing).toEqual([]);
    // And lists nothing the pane no longer calls (event arguments are not recorded).
    const unused = Object.keys(PANE_API).filter(
      (m) => !usedModern.has(m) && !m.startsWith("WorksheetChangedEventArgs."),
    );
    expect(unused).toEqual([]);
  });

  it("gives each member the set its doc comment in @types/office-js names", () => {
    const wrong = Object.entries(PANE_API)
      .map(([member, set]) => {
        const [type, name] = member.split(".") as [string, string];
        const documented = documentedSet(lines, type, name);
        return documented === set ? null : `${member}: listed ${set}, documented ${documented}`;
      })
      .filter((line) => line !== null);
    expect(wrong).toEqual([]);
  });

  it("declares in the manifest the highest set the unchecked calls need", () => {
    const needed = Object.entries(PANE_API)
      .filter(([member]) => CHECKED_BEYOND[member] === undefined)
      .map(([, set]) => set)
      .reduce((a, b) => (versionAbove(b, a) ? b : a), "1.1");
    expect(declared).toBe(needed);
  });

  it("checks every member beyond the declared set before using it, and degrades without it", () => {
    for (const [member, set] of Object.entries(PANE_API)) {
      if (!versionAbove(set, declared)) continue;
      const guard = CHECKED_BEYOND[member];
      expect(
        guard,
        `${member} needs ExcelApi ${set} > ${declared} and is not checked`,
      ).toBeDefined();
      if (guard === undefined) continue;
      expect(readFileSync(join(ROOT, guard.file), "utf8")).toContain(guard.check);
      // On a host with only the declared set, the pane never calls it.
      expect(usedOld.has(member), `${member} called on an ExcelApi ${declared} host`).toBe(false);
    }
  });
});

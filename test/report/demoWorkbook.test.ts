import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { lagTable, seriesFromValues } from "../../src/core";
import {
  buildDemoBook,
  buildDemoWorkbook,
  LARKVALE_PORTABLE,
  TERNPOINT_PORTABLE,
  TERNPOINT_WORK,
} from "../../scripts/demoWorkbook";
import { ROOT } from "../cli/run";

const DEMO = join(ROOT, "demo");

/** The CSV's cells by a plain split (these files hold no quoted fields), numbers as numbers. */
function csvCells(file: string): (string | number)[][] {
  const text = readFileSync(join(DEMO, file), "utf8");
  expect(text).not.toContain('"');
  return text
    .trim()
    .split("\n")
    .map((line, r) =>
      line
        .split(",")
        .map((cell) =>
          r > 0 && cell !== "" && Number.isFinite(Number(cell)) ? Number(cell) : cell,
        ),
    );
}

interface Formula {
  readonly formula: string;
  readonly ref: string | undefined;
  readonly result: unknown;
}

function formulaAt(sheet: ExcelJS.Worksheet, address: string): Formula {
  const value = sheet.getCell(address).value as {
    formula?: string;
    ref?: string;
    result?: unknown;
  } | null;
  return { formula: value?.formula ?? "", ref: value?.ref, result: value?.result };
}

describe("the demo workbook (demo/echolot-demo.xlsx)", () => {
  let workbook: ExcelJS.Workbook;

  beforeAll(async () => {
    const file = join(mkdtempSync(join(tmpdir(), "echolot-xlsx-")), "echolot-demo.xlsx");
    await buildDemoWorkbook(DEMO).xlsx.writeFile(file);
    workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(file);
  });

  it("opens with the same library and holds the About sheet and the two scenarios", () => {
    expect(workbook.worksheets.map((s) => s.name)).toEqual([
      "About",
      "Ternpoint errors",
      "Larkvale residuals",
    ]);
    const about = workbook.getWorksheet("About");
    expect(String(about?.getCell("A1").value)).toBe("Echolot demo workbook");
    const lines = (about?.getColumn(1).values ?? []).map(String).join("\n");
    expect(lines).toContain("A verdict is a statistical screen, not a decision");
  });

  it("leaves every cell of the scenario data as the CSV has it", () => {
    for (const [name, file] of [
      ["Ternpoint errors", "ternpoint-roasters-forecast-errors.csv"],
      ["Larkvale residuals", "larkvale-fund-residuals.csv"],
    ] as const) {
      const sheet = workbook.getWorksheet(name);
      if (sheet === undefined) throw new Error(`no sheet ${name}`);
      const cells = csvCells(file);
      cells.forEach((row, r) =>
        row.forEach((expected, c) => {
          const cell = sheet.getCell(r + 1, c + 1);
          expect(cell.value, `${name}!${cell.address}`).toBe(expected);
        }),
      );
      // Nothing else inside the data's rectangle, and the column after it is empty.
      const width = cells[0]?.length ?? 0;
      for (let r = 1; r <= cells.length; r++)
        expect(sheet.getCell(r, width + 1).value, `${name} row ${r}`).toBeNull();
    }
  });

  it("holds live ECHOLOT formulas beside the data, sized to their results", () => {
    const ternpoint = workbook.getWorksheet("Ternpoint errors");
    const larkvale = workbook.getWorksheet("Larkvale residuals");
    if (ternpoint === undefined || larkvale === undefined) throw new Error("missing sheet");
    expect(formulaAt(ternpoint, "AB4")).toMatchObject({
      formula: "ECHOLOT.SERIESNOISECHECK(B1:B105,,13)",
      ref: "AB4:AC4",
    });
    expect(formulaAt(ternpoint, "AD4")).toMatchObject({
      formula: "ECHOLOT.SERIESBIASCHECK(B1:B105)",
      ref: "AD4:AG4",
    });
    expect(formulaAt(ternpoint, "AB27")).toMatchObject({
      formula: "ECHOLOT.SERIESNOISECHECK(Y1:Y105,,13)",
      ref: "AB27:AC27",
    });
    expect(formulaAt(ternpoint, "AA30")).toMatchObject({
      formula: "ECHOLOT.SERIESBATCHCHECK(B1:Y105,,13)",
      ref: "AA30:AG54",
    });
    expect(formulaAt(larkvale, "E4")).toMatchObject({
      formula: "ECHOLOT.SERIESNOISECHECK(B1:B751,20)",
      ref: "E4:F4",
    });
    expect(formulaAt(larkvale, "E5")).toMatchObject({
      formula: 'ECHOLOT.SERIESPORTMANTEAU(B1:B751,20,0,"ljung-box")',
      ref: "E5:G5",
    });
    expect(formulaAt(larkvale, "E8")).toMatchObject({
      formula: 'ECHOLOT.SERIESPORTMANTEAU(B1:B751,20,0,"robust")',
      ref: "E8:G8",
    });
    expect(formulaAt(larkvale, "E9")).toMatchObject({
      formula: "ECHOLOT.SERIESVOLCHECK(B1:B751,20)",
      ref: "E9:G9",
    });
    expect(formulaAt(larkvale, "D12")).toMatchObject({
      formula: 'ECHOLOT.SERIESLAGTABLE(B1:B751,20,0.05,"robust")',
      ref: "D12:J32",
    });
    const formulas = [ternpoint, larkvale].flatMap((sheet) => {
      const found: string[] = [];
      sheet.eachRow((row) =>
        row.eachCell((cell) => {
          if (cell.formula) found.push(cell.formula);
        }),
      );
      return found;
    });
    expect(formulas).toHaveLength(24 * 2 + 1 + 5);
    expect(formulas.every((f) => f.startsWith("ECHOLOT.SERIES"))).toBe(true);
  });

  it("caches the verdicts the core gives, so the figures show before the add-in loads", () => {
    const ternpoint = workbook.getWorksheet("Ternpoint errors");
    if (ternpoint === undefined) throw new Error("missing sheet");
    const cells = csvCells("ternpoint-roasters-forecast-errors.csv");
    for (let b = 1; b <= 24; b++) {
      const column = cells.map((row) => row[b]);
      const table = lagTable(seriesFromValues(column), { season: 13 });
      const row = 3 + b;
      expect(formulaAt(ternpoint, `AB${row}`).result, `blend ${column[0]}`).toBe(
        table.verdict.word,
      );
      expect(ternpoint.getCell(`AC${row}`).value).toBe(table.verdict.reason);
      expect(ternpoint.getCell(`AA${row}`).value).toBe(column[0]);
    }
  });
});

describe("buildDemoBook(directory, placedOn): the portable reports beside the live formulas", () => {
  it("adds the fund's portable report with its chart and the blends' portable batch, linked beside the add-in's verdicts", () => {
    const { workbook, charts, portable } = buildDemoBook(DEMO, "2026-12-02");
    expect(workbook.worksheets.map((s) => s.name)).toEqual([
      "About",
      "Ternpoint errors",
      "Larkvale residuals",
      LARKVALE_PORTABLE,
      TERNPOINT_PORTABLE,
      TERNPOINT_WORK,
    ]);
    expect(charts.map((c) => c.sheet)).toEqual([LARKVALE_PORTABLE]);
    expect(portable.map((p) => p.name)).toEqual(["larkvale", "ternpoint"]);
    const ternpoint = workbook.getWorksheet("Ternpoint errors");
    const larkvale = workbook.getWorksheet("Larkvale residuals");
    // Beside the live per-blend columns (AB..AG): the portable verdict of each blend.
    expect(ternpoint?.getCell("AH3").value).toBe("verdict (portable, no add-in needed)");
    expect(formulaAt(ternpoint as ExcelJS.Worksheet, "AH4").formula).toBe(
      "'Ternpoint portable'!$F$7",
    );
    expect(formulaAt(ternpoint as ExcelJS.Worksheet, "AH27").formula).toBe(
      "'Ternpoint portable'!$F$30",
    );
    expect(formulaAt(larkvale as ExcelJS.Worksheet, "E2").formula).toBe("'Larkvale portable'!$B$7");
  });
});

import { existsSync, mkdtempSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { describe, expect, it } from "vitest";
import { FIXTURES } from "../helpers/fixtures";
import { csvFile, runCli } from "./run";

const SERIES_F = join(FIXTURES, "series-f.csv");

function outPath(name: string): string {
  return join(mkdtempSync(join(tmpdir(), "echolot-workbook-")), name);
}

describe("echolot workbook FILE.csv --out book.xlsx", () => {
  it("writes the data and a portable report whose formulas carry the file format's _xlfn. prefixes", async () => {
    const out = outPath("f.xlsx");
    const result = runCli(["workbook", SERIES_F, "--out", out]);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout).toMatch(/^read: column 1 \("yield"\) of .*series-f\.csv\n/);
    expect(result.stdout).toMatch(
      /\nwrote .*f\.xlsx: one column, portable verdict at writing: structure/,
    );
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(out);
    expect(book.worksheets.map((s) => s.name)).toEqual(["Data", "Portable report"]);
    expect(book.getWorksheet("Data")?.getCell("A1").value).toBe("yield");
    expect(book.getWorksheet("Data")?.getCell("A71").value).toBe(23);
    const report = book.getWorksheet("Portable report");
    expect((report?.getCell("B26").value as { formula: string }).formula).toBe("$M$46");
    expect((report?.getCell("M37").value as { formula: string }).formula).toBe(
      'IF($L$37>0,_xlfn.CHISQ.DIST.RT($K$37,$L$37),"")',
    );
    // The chart travels as DrawingML parts exceljs does not write itself.
    const zip = await JSZip.loadAsync(readFileSync(out));
    expect(zip.file("xl/charts/chart1.xml")).not.toBeNull();
    const sheetXml = await zip.file("xl/worksheets/sheet2.xml")?.async("string");
    expect(sheetXml).toMatch(/<drawing r:id="rIdEcholotDrawing1"\/><\/worksheet>$/);
  });

  it("refuses to overwrite an existing file unless --force", () => {
    const out = outPath("kept.xlsx");
    writeFileSync(out, "not a workbook");
    const refused = runCli(["workbook", SERIES_F, "--out", out]);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/already exists: give --force to replace it/);
    expect(readFileSync(out, "utf8")).toBe("not a workbook");
    const forced = runCli(["workbook", SERIES_F, "--out", out, "--force"]);
    expect(forced.status, forced.stderr).toBe(0);
    expect(statSync(out).size).toBeGreaterThan(10_000);
  });

  it("with --batch writes one portable row per column of numbers, and keeps a row for each it cannot analyse", async () => {
    const rows = Array.from(
      { length: 60 },
      (_, t) => `${t},${Math.sin(t * 1.3)},${(t * 7) % 11},5`,
    );
    const csv = csvFile("three.csv", `t,wave,saw,flat\n${rows.join("\n")}\n`);
    const out = outPath("batch.xlsx");
    const result = runCli(["workbook", csv, "--batch", "--out", out]);
    expect(result.status, result.stderr).toBe(0);
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(out);
    expect(book.worksheets.map((s) => s.name)).toEqual(["Data", "Portable batch", "Portable work"]);
    const summary = book.getWorksheet("Portable batch");
    const labels = [7, 8, 9, 10].map((r) => summary?.getCell(r, 1).value);
    expect(labels).toEqual(["t", "wave", "saw", "flat"]);
    // t counts 0, 1, 2, …: the reader leaves it out, as `echolot batch` does, and says why.
    expect(String(summary?.getCell(7, 7).value)).toMatch(/^not analysed: /);
    expect(String(summary?.getCell(10, 7).value)).toMatch(/constant/);
    // wave is the first report block on the work sheet.
    expect((summary?.getCell(8, 6).value as { formula: string }).formula).toBe(
      "'Portable work'!$B$7",
    );
  });

  it("reads the file as check does (standard input, decimal comma, gap words) and never writes over it", async () => {
    const values = Array.from({ length: 60 }, (_, t) => (Math.cos(t * 0.7) * 2).toFixed(3));
    values[10] = "nan";
    const text = `woche;fehler\n${values.map((v, t) => `${t + 1};${v.replace(".", ",")}`).join("\n")}\n`;
    const out = outPath("comma.xlsx");
    const result = runCli(
      ["workbook", "-", "--column", "fehler", "--na", "nan", "--out", out],
      text,
    );
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout).toMatch(/^read: column 2 \("fehler"\) of standard input/);
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(out);
    const data = book.getWorksheet("Data");
    expect(data?.getCell("B2").value).toBe(Number(values[0]));
    expect(data?.getCell("B12").value).toEqual({ error: "#N/A" });
    expect(data?.getCell("A3").value).toBe(2);

    const input = csvFile("own.csv", text.replace(/;/g, ",").replace(/(\d),(\d)/g, "$1.$2"));
    const before = readFileSync(input, "utf8");
    const over = runCli(["workbook", input, "--na", "nan", "--out", input, "--force"]);
    expect(over.status).toBe(2);
    expect(over.stderr).toMatch(/is the input file/);
    expect(readFileSync(input, "utf8")).toBe(before);
  });

  it("refuses what a portable report cannot hold, saying why", () => {
    const out = outPath("never.xlsx");
    const squares = runCli(["workbook", SERIES_F, "--test", "squares", "--out", out]);
    expect(squares.status).toBe(2);
    expect(squares.stderr).toMatch(/squares' test needs the add-in/);
    expect(runCli(["workbook", SERIES_F]).stderr).toMatch(/needs --out/);
    expect(existsSync(out)).toBe(false);
  });
});

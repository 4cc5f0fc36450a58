/**
 * The ranked CSV opened by a real spreadsheet program: LibreOffice Calc (headless) imports the
 * CSV of `batch --csv` with formula evaluation switched on, the strictest reading a user's
 * spreadsheet could apply, and converts it to xlsx, read back with exceljs. Series names that
 * start like formulas must arrive as text, never as formulas; the figures as numbers.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../../src/sim/random";
import { whiteNoise } from "../../src/sim/processes";
import { soffice } from "../helpers/libreoffice";
import { csvFile, runCli } from "./run";

/**
 * LibreOffice's CSV import options (its "Filter Options for CSV" page): comma, double quote,
 * UTF-8 (76), from line 1, …, token 13 "evaluate formulas" true.
 */
const EVALUATE_FORMULAS = "CSV:44,34,76,1,,0,false,true,false,false,false,-1,true";

const NAMES = ["=1+1", "@SUM(1,2)", "+2+2", "-3+4", "plain"];

describe("batch --csv in LibreOffice Calc", () => {
  it("keeps names that look like formulas as text, guarded by a leading apostrophe, and figures as numbers", async () => {
    const program = soffice();
    const columns = NAMES.map((_, i) => whiteNoise(seededRandom(40 + i), 60));
    const lines = [NAMES.map((n) => `"${n}"`).join(",")];
    for (let t = 0; t < 60; t++) lines.push(columns.map((c) => c[t]!.toFixed(3)).join(","));
    const input = csvFile("formula-names.csv", lines.join("\n"));
    const result = runCli(["batch", input, "--csv"]);
    expect(result.status, result.stderr).toBe(0);
    const folder = mkdtempSync(join(tmpdir(), "echolot-csv-lo-"));
    const ranked = join(folder, "ranked.csv");
    writeFileSync(ranked, result.stdout);
    const converted = spawnSync(
      program,
      [
        `-env:UserInstallation=file://${join(folder, "profile")}`,
        "--headless",
        "--norestore",
        `--infilter=${EVALUATE_FORMULAS}`,
        "--convert-to",
        "xlsx",
        "--outdir",
        folder,
        ranked,
      ],
      { encoding: "utf8", timeout: 180_000 },
    );
    expect(converted.status, converted.stderr).toBe(0);
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(join(folder, "ranked.xlsx"));
    const sheet = book.worksheets[0]!;
    const header = sheet.getRow(1).values as unknown[];
    const labelColumn = header.indexOf("label");
    const statisticColumn = header.indexOf("statistic");
    const labels: unknown[] = [];
    for (let r = 2; r <= NAMES.length + 1; r++) {
      const label = sheet.getRow(r).getCell(labelColumn).value;
      labels.push(label);
      expect(typeof sheet.getRow(r).getCell(statisticColumn).value, `statistic, row ${r}`).toBe(
        "number",
      );
    }
    // Every name came back as the text written, and none as a formula or its result.
    expect(
      labels.every((l) => typeof l === "string"),
      JSON.stringify(labels),
    ).toBe(true);
    expect([...(labels as string[])].sort()).toEqual(
      ["'=1+1", "'@SUM(1,2)", "'+2+2", "'-3+4", "plain"].sort(),
    );
  }, 240_000);
});

/**
 * LibreOffice Calc as an independent spreadsheet engine: open workbooks headless with a fresh
 * profile that forces recalculation on load (so no cached value is ever read back), convert
 * them, and read the recalculated cells with exceljs. Several files go through one soffice
 * start, which is the slow part (about 10 s on a busy machine).
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join } from "node:path";
import ExcelJS from "exceljs";

export const INSTALL_HINT =
  "LibreOffice Calc is needed for the portable-report tests: apt-get install -y libreoffice-calc-nogui (Debian), or set SOFFICE to its soffice program";

/** The soffice program, or a thrown error with the install hint. */
export function soffice(): string {
  const candidate = process.env.SOFFICE ?? "soffice";
  const found = spawnSync(candidate, ["--version"], { encoding: "utf8", timeout: 60_000 });
  if (found.error !== undefined || found.status !== 0) throw new Error(INSTALL_HINT);
  return candidate;
}

/**
 * A profile whose registrymodifications.xcu sets Calc's OOXMLRecalcMode (and ODF's) to 0,
 * "always recalculate" (LibreOffice's configuration schema officecfg Calc.xcs,
 * Formula/Load), so every formula is computed by LibreOffice itself.
 */
function recalculatingProfile(): string {
  const profile = mkdtempSync(join(tmpdir(), "echolot-lo-profile-"));
  mkdirSync(join(profile, "user"), { recursive: true });
  const item = (name: string) =>
    `<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="${name}" oor:op="fuse"><value>0</value></prop></item>`;
  writeFileSync(
    join(profile, "user", "registrymodifications.xcu"),
    `<?xml version="1.0" encoding="UTF-8"?>\n<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">${item("OOXMLRecalcMode")}${item("ODFRecalcMode")}</oor:items>\n`,
  );
  return profile;
}

/**
 * Converts `files` to `format` ("xlsx" or "pdf") in one soffice run; returns the paths written,
 * in the order given. Input names must differ.
 */
export function convertWithLibreOffice(files: readonly string[], format: "xlsx" | "pdf"): string[] {
  const program = soffice();
  const out = mkdtempSync(join(tmpdir(), "echolot-lo-out-"));
  const profile = recalculatingProfile();
  const result = spawnSync(
    program,
    [
      `-env:UserInstallation=file://${profile}`,
      "--headless",
      "--norestore",
      "--convert-to",
      format,
      "--outdir",
      out,
      ...files,
    ],
    { encoding: "utf8", timeout: 170_000 },
  );
  if (result.status !== 0) {
    throw new Error(`soffice failed (${result.status}): ${result.stderr}${result.stdout}`);
  }
  return files.map((file) => join(out, basename(file).replace(/\.xlsx$/, `.${format}`)));
}

/** A cell's value as computed: a number, a string, an error text such as "#N/A", or null. */
export type CellReading = number | string | null;

/**
 * What a cell shows after LibreOffice computed it. A formula's result is taken from the cell's
 * model: exceljs's `value` leaves out a result of 0.
 */
export function readCell(cell: ExcelJS.Cell | undefined): CellReading {
  if (cell === undefined) return null;
  if (cell.type === ExcelJS.ValueType.Formula) {
    const result = (cell.model as { result?: unknown }).result;
    return result === undefined ? null : cellReading(result as ExcelJS.CellValue);
  }
  return cellReading(cell.value);
}

export function cellReading(value: ExcelJS.CellValue): CellReading {
  if (value === null || value === undefined) return null;
  if (typeof value === "number" || typeof value === "string") return value;
  if (typeof value === "boolean") return value ? "TRUE" : "FALSE";
  if (typeof value === "object" && "error" in value) return String(value.error);
  if (typeof value === "object" && ("formula" in value || "sharedFormula" in value)) {
    const result = (value as { result?: unknown }).result;
    if (result === undefined) return null;
    return cellReading(result as ExcelJS.CellValue);
  }
  if (typeof value === "object" && "richText" in value) {
    return value.richText.map((r) => r.text).join("");
  }
  return String(value as unknown as string);
}

export async function readWorkbook(path: string): Promise<ExcelJS.Workbook> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.readFile(path);
  return workbook;
}

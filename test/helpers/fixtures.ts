/**
 * Readers for the outside reference files copied into test/fixtures/ (provenance in
 * test/fixtures/README.md). They read the files as published and never regenerate data.
 */
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

export const FIXTURES = join(dirname(fileURLToPath(import.meta.url)), "..", "fixtures");

export function fixtureText(relativePath: string): string {
  return readFileSync(join(FIXTURES, relativePath), "utf8");
}

/** Lines of a file without comment (`#`) and blank lines; CRLF tolerated. */
function dataLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== "" && !line.startsWith("#"));
}

/** A tab-separated table with a header row: one record per data row, cells as text. */
export function readTsv(relativePath: string): Record<string, string>[] {
  const [header, ...rows] = dataLines(fixtureText(relativePath)).map((line) => line.split("\t"));
  if (header === undefined) throw new Error(`${relativePath} has no header row`);
  return rows.map((cells) => {
    const record: Record<string, string> = {};
    header.forEach((name, i) => {
      record[name] = cells[i] ?? "";
    });
    return record;
  });
}

/** The data lines of a NIST StRD univariate file, as the decimal text printed in the file. */
export function readStrdText(name: string): string[] {
  return dataLines(fixtureText(`strd/${name}.dat`));
}

/** The data of a NIST StRD univariate file as doubles (what a spreadsheet would hand over). */
export function readStrd(name: string): Float64Array {
  return Float64Array.from(readStrdText(name), Number);
}

export interface StrdCertified {
  readonly dataset: string;
  readonly n: number;
  /** Certified values as printed (15 significant digits, or exact). */
  readonly mean: string;
  readonly sd: string;
  readonly r1: string;
}

export function readStrdCertified(): StrdCertified[] {
  return readTsv("strd/CERTIFIED.tsv").map((row) => ({
    dataset: row.dataset ?? "",
    n: Number(row.n),
    mean: row.mean ?? "",
    sd: row.sd ?? "",
    r1: row.r1 ?? "",
  }));
}

/** A one-column CSV with a header row (series-f.csv). */
export function readColumnCsv(relativePath: string): { label: string; values: Float64Array } {
  const [label, ...rows] = dataLines(fixtureText(relativePath));
  return { label: label ?? "", values: Float64Array.from(rows, Number) };
}

/** Box–Jenkins Series F, 70 batch yields in time order. */
export function readSeriesF(): Float64Array {
  return readColumnCsv("series-f.csv").values;
}

/**
 * A value of derived-values.tsv (15 significant digits, evaluated from its published definition
 * with decimal.js by scripts/derivedDigits.ts) by its key.
 */
export function derivedValue(key: string): number {
  const row = readTsv("derived-values.tsv").find((record) => record.key === key);
  if (row === undefined) throw new Error(`derived-values.tsv has no key ${key}`);
  return Number(row.value_15sig);
}

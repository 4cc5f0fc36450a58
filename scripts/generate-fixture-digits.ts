/**
 * Writes the computed columns of the reference fixtures in test/fixtures/ (see
 * scripts/referenceDigits.ts for what each column is and how it is evaluated); the printed columns
 * and their sources are transcriptions and stay as they are. derived-values.tsv is computed
 * whole (scripts/derivedDigits.ts). `--check` computes in memory and fails if a committed file
 * differs. Run from the project folder:
 *   npm run fixtures [-- --check]
 */
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { derivedTable } from "./derivedDigits";
import { chiSquareTable, lewTable, normalQuantileTable } from "./referenceDigits";

// Run from the project folder (`npm run fixtures` does so).
const FIXTURES = join(process.cwd(), "test", "fixtures");

/** The data lines of a NIST StRD file (header lines start with `#`; CRLF line ends). */
function strdIntegers(name: string): bigint[] {
  return readFileSync(join(FIXTURES, "strd", `${name}.dat`), "utf8")
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== "" && !line.startsWith("#"))
    .map((line) => BigInt(line));
}

/** series-f.csv's values (a header line, then one whole number a line). */
function seriesFIntegers(): bigint[] {
  const [, ...lines] = readFileSync(join(FIXTURES, "series-f.csv"), "utf8").split(/\r?\n/);
  return lines.filter((line) => line.trim() !== "").map((line) => BigInt(line.trim()));
}

const FILES: Readonly<Record<string, (text: string) => string>> = {
  "chisq-table.tsv": chiSquareTable,
  "normal-quantiles.tsv": normalQuantileTable,
  "lew-acf-ehandbook.tsv": (text) => lewTable(text, strdIntegers("Lew")),
  "derived-values.tsv": () => derivedTable(seriesFIntegers()),
};

const check = process.argv.includes("--check");
let stale = 0;
for (const [name, make] of Object.entries(FILES)) {
  const path = join(FIXTURES, name);
  const current = existsSync(path) ? readFileSync(path, "utf8") : "";
  const text = make(current);
  if (check) {
    if (text !== current) {
      stale++;
      process.stderr.write(`test/fixtures/${name} differs from what the generator computes\n`);
    }
  } else {
    writeFileSync(path, text);
    process.stdout.write(`wrote test/fixtures/${name}\n`);
  }
}
process.exitCode = stale > 0 ? 1 : 0;

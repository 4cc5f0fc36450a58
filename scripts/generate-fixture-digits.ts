/**
 * Writes the computed columns of the reference fixtures in test/fixtures/ (see
 * scripts/referenceDigits.ts for what each column is and how it is evaluated); the printed columns
 * and their sources are transcriptions and stay as they are. `--check` computes in memory and
 * fails if a committed file differs. Run from the project folder:
 *   npm run fixtures [-- --check]
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
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

const FILES: Readonly<Record<string, (text: string) => string>> = {
  "chisq-table.tsv": chiSquareTable,
  "normal-quantiles.tsv": normalQuantileTable,
  "lew-acf-ehandbook.tsv": (text) => lewTable(text, strdIntegers("Lew")),
};

const check = process.argv.includes("--check");
let stale = 0;
for (const [name, make] of Object.entries(FILES)) {
  const path = join(FIXTURES, name);
  const current = readFileSync(path, "utf8");
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

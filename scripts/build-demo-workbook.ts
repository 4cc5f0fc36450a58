/**
 * Writes demo/echolot-demo.xlsx (see demoWorkbook.ts) from the demo CSVs beside it.
 * Run by `npm run demo`; bundled to build/build-demo-workbook.cjs by scripts/build-cli.mjs.
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { demoWorkbookBytes } from "./demoWorkbook";

const directory = join(__dirname, "..", "demo");
const target = join(directory, "echolot-demo.xlsx");

demoWorkbookBytes(directory, new Date().toISOString().slice(0, 10))
  .then((bytes) => writeFileSync(target, bytes))
  .then(() => process.stdout.write(`wrote demo/echolot-demo.xlsx\n`))
  .catch((error: unknown) => {
    process.stderr.write(
      `could not write ${target}: ${error instanceof Error ? error.message : String(error)}\n`,
    );
    process.exitCode = 1;
  });

/**
 * Writes demo/echolot-demo.xlsx (see demoWorkbook.ts) from the demo CSVs beside it.
 * Run by `npm run demo`; bundled to build/build-demo-workbook.cjs by scripts/build-cli.mjs.
 */
import { join } from "node:path";
import { buildDemoWorkbook } from "./demoWorkbook";

const directory = join(__dirname, "..", "demo");
const target = join(directory, "echolot-demo.xlsx");

buildDemoWorkbook(directory)
  .xlsx.writeFile(target)
  .then(() => process.stdout.write(`wrote demo/echolot-demo.xlsx\n`))
  .catch((error: unknown) => {
    process.stderr.write(
      `could not write ${target}: ${error instanceof Error ? error.message : String(error)}\n`,
    );
    process.exitCode = 1;
  });

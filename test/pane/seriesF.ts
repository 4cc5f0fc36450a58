/** Box–Jenkins Series F (70 batch yields), read from the fixture copy of the outside dataset. */
import { readFileSync } from "node:fs";
import { join } from "node:path";

export function seriesFColumn(): (string | number)[] {
  const lines = readFileSync(join(__dirname, "..", "fixtures", "series-f.csv"), "utf8")
    .trim()
    .split(/\r?\n/);
  return lines.map((line, i) => (i === 0 ? line.trim() : Number(line)));
}

// Runs a TypeScript entry point under plain Node: bundles it with esbuild into a temporary
// CommonJS file, runs that with the remaining arguments, and removes it afterwards.
// Usage: node scripts/run-ts.mjs [node flags…] <entry.ts> [args…]
// Flags before the entry (such as --expose-gc) go to Node; arguments after it go to the program.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { build } from "esbuild";

const given = process.argv.slice(2);
const entryIndex = given.findIndex((arg) => !arg.startsWith("-"));
const flags = entryIndex < 0 ? given : given.slice(0, entryIndex);
const entry = entryIndex < 0 ? undefined : given[entryIndex];
const args = entryIndex < 0 ? [] : given.slice(entryIndex + 1);
if (entry === undefined) {
  console.error("usage: node scripts/run-ts.mjs [node flags…] <entry.ts> [args…]");
  process.exit(2);
}

const directory = mkdtempSync(join(tmpdir(), "echolot-run-"));
const outfile = join(directory, "entry.cjs");
let status;
try {
  await build({
    entryPoints: [resolve(entry)],
    outfile,
    bundle: true,
    platform: "node",
    target: "node20",
    format: "cjs",
    sourcemap: "inline",
    logLevel: "warning",
  });
  const child = spawnSync(process.execPath, [...flags, "--enable-source-maps", outfile, ...args], {
    stdio: "inherit",
  });
  status = child.status ?? 1;
} finally {
  rmSync(directory, { recursive: true, force: true });
}
process.exit(status);

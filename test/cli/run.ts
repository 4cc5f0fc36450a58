/** Runs the built CLI (build/echolot.cjs, made by `npm run build:cli`) as a user would. */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";

export const ROOT = resolve(__dirname, "..", "..");
const CLI = join(ROOT, "build", "echolot.cjs");

export interface CliResult {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

export function runCli(args: readonly string[]): CliResult {
  const result = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, encoding: "utf8" });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const scratch = mkdtempSync(join(tmpdir(), "echolot-cli-"));

/** Writes a CSV file into a scratch folder and returns its path. */
export function csvFile(name: string, text: string): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

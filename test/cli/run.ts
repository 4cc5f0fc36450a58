/**
 * Runs the built CLI (build/echolot.cjs, made by `npm run build:cli`) as a user would; a bundle
 * older than its sources is refused (test/runner/builds.ts).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { requireFreshBuild } from "../runner/builds";

export const ROOT = resolve(__dirname, "..", "..");
const CLI = join(requireFreshBuild("cli"), "echolot.cjs");

export interface CliResult {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/** Runs the CLI with `args`, and `input` (text or bytes) on standard input when given. */
export function runCli(args: readonly string[], input?: string | Buffer): CliResult {
  const result = spawnSync(process.execPath, [CLI, ...args], {
    cwd: ROOT,
    encoding: "utf8",
    ...(input === undefined ? {} : { input }),
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const scratch = mkdtempSync(join(tmpdir(), "echolot-cli-"));

/** Writes a CSV file (text or bytes) into a scratch folder and returns its path. */
export function csvFile(name: string, text: string | Buffer): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

/** The path of the built CLI, for runs through a shell. */
export const CLI_PATH = CLI;

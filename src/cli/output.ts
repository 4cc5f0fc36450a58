/**
 * Output that never destroys data.
 *
 * - `--out FILE` refuses a file that exists unless `--force` is given, and refuses the input file
 *   itself even then; the text goes to a temporary file beside the target, which is renamed over
 *   it only once it is completely written, so a failed write (a full disk, say) leaves the old
 *   file as it was and no half-written one.
 * - Standard output: a reader that stops early (`| head -1`) closes the pipe; that ends the run
 *   quietly with status 0. Any other write error (a full disk) is one line on stderr and status 2.
 */
import {
  closeSync,
  existsSync,
  fsyncSync,
  openSync,
  renameSync,
  statSync,
  unlinkSync,
  writeSync,
} from "node:fs";
import { basename, dirname, join } from "node:path";
import { UsageError } from "./errors";

function sameFile(a: string, b: string): boolean {
  try {
    const x = statSync(a);
    const y = statSync(b);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    return false;
  }
}

/** One line for a failed write: "no space left on device" rather than a stack trace. */
export function writeFailure(target: string, error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  const why =
    code === "ENOSPC"
      ? "no space left on the device"
      : code === "EACCES" || code === "EPERM"
        ? "permission denied"
        : code === "ENOENT"
          ? "its folder does not exist"
          : code === "EROFS"
            ? "the file system is read-only"
            : ((error as Error).message ?? String(error));
  return `cannot write ${target}: ${why}`;
}

/**
 * Writes `text` (UTF-8) or raw bytes (an xlsx) to `out` by way of a temporary file and a rename.
 * `inputs` are the files the command read: `out` may never be one of them.
 */
export function writeOutFile(
  out: string,
  text: string | Uint8Array,
  force: boolean,
  inputs: readonly string[],
): void {
  for (const input of inputs) {
    if (input !== "-" && sameFile(out, input)) {
      throw new UsageError(
        `--out ${out} is the input file: choose another name (nothing was written)`,
      );
    }
  }
  if (existsSync(out)) {
    if (!force)
      throw new UsageError(
        `${out} already exists: give --force to replace it, or choose another name`,
      );
    if (statSync(out).isDirectory())
      throw new UsageError(`--out ${out} is a folder: give a file name`);
  }
  const temporary = join(dirname(out), `.${basename(out)}.${process.pid}.partial`);
  let fd: number | undefined;
  try {
    fd = openSync(temporary, "wx");
    const bytes = typeof text === "string" ? Buffer.from(text, "utf8") : text;
    let written = 0;
    while (written < bytes.length) written += writeSync(fd, bytes, written);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(temporary, out);
  } catch (error) {
    if (fd !== undefined) closeSync(fd);
    try {
      unlinkSync(temporary);
    } catch {
      // nothing was created
    }
    throw new UsageError(writeFailure(out, error));
  }
}

/**
 * Writes the output to standard output and resolves with the exit status: 0 when written (or when
 * the reader closed the pipe), 2 with one line on stderr when the write failed.
 */
export function writeStdout(text: string): Promise<number> {
  return new Promise((resolve) => {
    const stdout = process.stdout;
    let settled = false;
    const failed = (error: NodeJS.ErrnoException) => {
      if (settled) return;
      settled = true;
      if (error.code === "EPIPE") resolve(0);
      else {
        process.stderr.write(`echolot: ${writeFailure("standard output", error)}\n`);
        resolve(2);
      }
    };
    stdout.on("error", failed);
    try {
      stdout.write(text, (error) => {
        if (error) failed(error);
        else if (!settled) {
          settled = true;
          resolve(0);
        }
      });
    } catch (error) {
      failed(error as NodeJS.ErrnoException);
    }
  });
}

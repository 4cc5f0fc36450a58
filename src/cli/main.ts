/**
 * The `echolot` command line: CSV in, text or JSON out. Exit 0 on success; exit 2 on bad input or
 * arguments, with one message on stderr and nothing on stdout; exit 1 on an internal failure.
 */
import { isEcholotError } from "../core";
import { runAudit } from "./audit";
import { runBatch } from "./batch";
import { runCheck } from "./check";
import { runDemo } from "./demo";
import { runReport } from "./report";
import { runWorkbook } from "./workbook";
import { UsageError } from "./errors";

const USAGE = `usage:
  echolot check FILE.csv [--column NAME|N] [--lags K] [--season M] [--fitted P] [--alpha A]
                         [--bands noise|bartlett|robust] [--test ljung-box|box-pierce|robust|squares] [--json]
  echolot audit FILE.csv --horizon H [--season M] [--alpha A] [--lags K] [--json]
  echolot batch FILE.csv [--lags K] [--season M] [--fitted P] [--alpha A]
                         [--bands noise|bartlett|robust] [--test ljung-box|box-pierce|robust|squares] [--json]
  echolot report FILE.csv [same options as check] --out report.html
  echolot workbook FILE.csv [same options as check] [--batch] --out book.xlsx [--force]
  echolot demo`;

type Command = (argv: readonly string[]) => string | Promise<string>;

const COMMANDS: Readonly<Record<string, Command>> = {
  check: runCheck,
  audit: runAudit,
  batch: runBatch,
  report: runReport,
  workbook: runWorkbook,
  demo: () => runDemo(),
};

/** Option names of the core's messages, as the CLI spells them. */
function cliWording(message: string): string {
  return message
    .replace(/^maxLag\b/, "--lags")
    .replace(/^fittedParams\b/, "--fitted")
    .replace(/^alpha\b/, "--alpha")
    .replace(/^season\b/, "--season")
    .replace(/^bandKind\b/, "--bands")
    .replace(/^testKind\b/, "--test")
    .replace(/^horizon\b/, "--horizon");
}

export function main(argv: readonly string[]): number | Promise<number> {
  const [name, ...rest] = argv;
  if (name === "--help" || name === "help") {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  if (name === undefined) {
    process.stderr.write(`echolot: no command given\n${USAGE}\n`);
    return 2;
  }
  const command = COMMANDS[name];
  try {
    if (command === undefined) throw new UsageError(`unknown command "${name}"\n${USAGE}`);
    const output = command(rest);
    if (typeof output !== "string") return output.then(written, failed);
    return written(output);
  } catch (error) {
    return failed(error);
  }
}

function written(output: string): number {
  process.stdout.write(output.endsWith("\n") ? output : `${output}\n`);
  return 0;
}

function failed(error: unknown): number {
  if (error instanceof UsageError || isEcholotError(error)) {
    process.stderr.write(`echolot: ${cliWording(error.message)}\n`);
    return 2;
  }
  process.stderr.write(`echolot: internal error: ${(error as Error).stack ?? String(error)}\n`);
  return 1;
}

void Promise.resolve(main(process.argv.slice(2))).then((code) => {
  process.exitCode = code;
});

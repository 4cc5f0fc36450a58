/**
 * The `echolot` command line: CSV in, text, JSON or CSV out. Exit 0 on success (and when the
 * reader of the output closes the pipe early); exit 2 on bad input or arguments or a failed
 * write, with one message on stderr and nothing on stdout; exit 1 on an internal failure.
 * `echolot --version` (or `-V`) prints the version; `--help` (or `-h`) after any command prints
 * that command's usage and options.
 */
import { isEcholotError, type EcholotError, type ParameterName } from "../core";
import { AUDIT_OPTIONS, runAudit } from "./audit";
import { BATCH_OPTIONS, runBatch } from "./batch";
import { CHECK_OPTIONS, runCheck } from "./check";
import { runDemo } from "./demo";
import { FDR_OPTIONS, runFdr } from "./fdr";
import { REPORT_OPTIONS, runReport } from "./report";
import { runWorkbook, WORKBOOK_OPTIONS } from "./workbook";
import { UsageError } from "./errors";
import { commandHelp, mainHelp } from "./help";
import { parseCommand, type ParsedCommand } from "./options";
import { isSeriesWorker, serveSeriesTasks } from "./parallel";
import { writeStdout } from "./output";
import { ECHOLOT_VERSION } from "./version";

interface Command {
  readonly options: readonly string[];
  readonly maxFiles: number;
  readonly run: (parsed: ParsedCommand) => Promise<string> | string;
}

const COMMANDS: Readonly<Record<string, Command>> = {
  check: { options: CHECK_OPTIONS, maxFiles: 1, run: runCheck },
  audit: { options: AUDIT_OPTIONS, maxFiles: 1, run: runAudit },
  batch: { options: BATCH_OPTIONS, maxFiles: 1, run: runBatch },
  report: { options: REPORT_OPTIONS, maxFiles: 1, run: runReport },
  workbook: { options: WORKBOOK_OPTIONS, maxFiles: 1, run: runWorkbook },
  fdr: { options: FDR_OPTIONS, maxFiles: Infinity, run: runFdr },
  demo: { options: [], maxFiles: 0, run: () => runDemo() },
};

/** The option that sets each core parameter the CLI takes, as users type it. */
const OPTION_OF: Readonly<Partial<Record<ParameterName, string>>> = {
  maxLag: "--lags",
  fittedParams: "--fitted",
  alpha: "--alpha",
  season: "--season",
  bandKind: "--bands",
  testKind: "--test",
  horizon: "--horizon",
};

/** A refusal as the CLI says it: a refused parameter named by its option. */
function cliMessage(error: UsageError | EcholotError): string {
  if (error instanceof UsageError || error.parameter === undefined) return error.message;
  return error.messageNaming(OPTION_OF[error.parameter.name] ?? error.parameter.name);
}

function helpOf(name: string | undefined): string {
  const command = name === undefined ? undefined : COMMANDS[name];
  return command === undefined || name === undefined
    ? mainHelp()
    : commandHelp(name, command.options);
}

async function run(argv: readonly string[]): Promise<{ status: number; output: string }> {
  const [name, ...rest] = argv;
  if (name === "--help" || name === "-h") return { status: 0, output: mainHelp() };
  if (name === "--version" || name === "-V") return { status: 0, output: ECHOLOT_VERSION };
  if (name === "help") {
    if (rest[0] !== undefined && COMMANDS[rest[0]] === undefined) {
      throw new UsageError(`unknown command "${rest[0]}": echolot --help lists the commands`);
    }
    return { status: 0, output: helpOf(rest[0]) };
  }
  if (name === undefined) throw new UsageError(`no command given\n${mainHelp()}`);
  const command = COMMANDS[name];
  if (command === undefined) {
    throw new UsageError(`unknown command "${name}": echolot --help lists the commands`);
  }
  const parsed = parseCommand(name, rest, command.options, command.maxFiles);
  if (parsed.help) return { status: 0, output: helpOf(name) };
  return { status: 0, output: await command.run(parsed) };
}

export async function main(argv: readonly string[]): Promise<number> {
  try {
    const { output } = await run(argv);
    return await writeStdout(output.endsWith("\n") ? output : `${output}\n`);
  } catch (error) {
    if (error instanceof UsageError || isEcholotError(error)) {
      process.stderr.write(`echolot: ${cliMessage(error)}\n`);
      return 2;
    }
    process.stderr.write(`echolot: internal error: ${(error as Error).stack ?? String(error)}\n`);
    return 1;
  }
}

// The same file runs the batch workers (parallel.ts): in a worker thread it serves series tasks.
if (isSeriesWorker()) {
  serveSeriesTasks();
} else {
  void main(process.argv.slice(2)).then((status) => {
    process.exitCode = status;
  });
}

/**
 * The large-input measurements of the README (`npm run scale`): generates seeded files, runs the
 * built CLI (build/echolot.cjs) on them under `/usr/bin/time -v` at lowered priority (nice 10: the
 * machine may be shared), and writes the table between the scale markers of README.md from what
 * it measured. Each case's latest measurement is kept in scripts/scale-results.json, so the cases
 * can be run one at a time and the table always shows all of them.
 *
 * Cases:
 * - `check`: one column of N values of white noise written with 4 decimals (default 30,000,000
 *   rows), `echolot check FILE --json`;
 * - `batch`: long format (item, week, error), S items × 52 weeks of white noise (default 100,000
 *   items; `--series 1000000` for the full size), `echolot batch FILE --id item --time week
 *   --value error` with the default workers (every core);
 * - `batch-fitted`: the same at full size (default 1,000,000 items) with `--fitted 1`, residuals
 *   of a model with one fitted parameter, whose verdict takes the normal-limit reference and draws
 *   nothing per series: reading 52 million rows, grouping, handing a million series to the
 *   workers, Benjamini–Hochberg and the output, at a fraction of the permutation's CPU.
 *
 * Run it at lowered priority on a shared machine: `nice -n 10 npm run scale -- …`.
 *
 * Usage: npm run scale -- [check|batch|batch-fitted … | table] [--rows N] [--series S] [--periods P] [--dir DIR]
 *        [--keep]   (files go to a scratch folder and are removed afterwards unless --keep)
 */
import { spawnSync } from "node:child_process";
import {
  closeSync,
  existsSync,
  mkdtempSync,
  openSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
  writeSync,
} from "node:fs";
import { availableParallelism, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { seededRandom } from "../src/sim/random";

// Run from the project folder (npm run scale): the script itself is bundled to a scratch folder.
const ROOT = process.cwd();
const CLI = join(ROOT, "build", "echolot.cjs");
const README = join(ROOT, "README.md");
const RESULTS = join(ROOT, "scripts", "scale-results.json");
const START = "<!-- scale table: written by npm run scale -->";
const END = "<!-- end of scale table -->";

interface Measurement {
  readonly command: string;
  readonly rows: number;
  readonly series: number;
  readonly fileBytes: number;
  readonly wallSeconds: number;
  readonly userSeconds: number;
  readonly systemSeconds: number;
  readonly peakKiB: number;
  readonly workers: number;
  readonly loadAverage: number;
  readonly node: string;
  readonly date: string;
  /** The commit measured (with "+" when the worktree had changes). */
  readonly commit: string;
}

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  if (at < 0) return fallback;
  const value = Number(process.argv[at + 1]);
  if (!(Number.isInteger(value) && value > 0)) throw new Error(`--${name} needs a whole number`);
  return value;
}

/** Writes `lines` lines produced by `line(i)` to `path`, in blocks, without holding the file. */
function writeLines(
  path: string,
  header: string,
  lines: number,
  line: (i: number) => string,
): number {
  const fd = openSync(path, "w");
  let block = `${header}\n`;
  for (let i = 0; i < lines; i++) {
    block += `${line(i)}\n`;
    if (block.length > 1 << 20) {
      writeSync(fd, block);
      block = "";
    }
  }
  writeSync(fd, block);
  closeSync(fd);
  return statSync(path).size;
}

/** ISO date of the Monday `week` weeks after 2025-01-06. */
function weekDate(week: number): string {
  return new Date(Date.UTC(2025, 0, 6 + 7 * week)).toISOString().slice(0, 10);
}

/** The short hash of HEAD, with "+" when tracked files other than this script's outputs differ. */
function commitMeasured(): string {
  const git = (args: string[]) =>
    spawnSync("git", args, { cwd: ROOT, encoding: "utf8" }).stdout.trim();
  const dirty =
    git([
      "status",
      "--porcelain",
      "--untracked-files=no",
      "--",
      ".",
      ":!README.md",
      ":!scripts/scale-results.json",
    ]) !== "";
  return `${git(["rev-parse", "--short", "HEAD"])}${dirty ? "+" : ""}`;
}

/** Runs the CLI under /usr/bin/time -v at nice 10; the figures of the run. */
function measure(args: readonly string[], rows: number, series: number, file: string): Measurement {
  const stats = `${file}.time`;
  const load = loadavg()[0] as number;
  const run = spawnSync(
    "nice",
    ["-n", "10", "/usr/bin/time", "-v", "-o", stats, process.execPath, CLI, ...args],
    { stdio: ["ignore", "ignore", "pipe"], encoding: "utf8", maxBuffer: 1 << 26 },
  );
  if (run.status !== 0) throw new Error(`echolot ${args.join(" ")} failed: ${run.stderr}`);
  const text = readFileSync(stats, "utf8");
  const field = (label: string): string => {
    const match = new RegExp(`${label}: (.*)`).exec(text);
    if (match === null) throw new Error(`no "${label}" in the time report`);
    return (match[1] as string).trim();
  };
  const wall = field("Elapsed \\(wall clock\\) time \\(h:mm:ss or m:ss\\)")
    .split(":")
    .reduce((total, part) => total * 60 + Number(part), 0);
  return {
    command: `echolot ${args.map((a) => (a === file ? "FILE" : a)).join(" ")}`,
    rows,
    series,
    fileBytes: statSync(file).size,
    wallSeconds: Math.round(wall * 100) / 100,
    userSeconds: Number(field("User time \\(seconds\\)")),
    systemSeconds: Number(field("System time \\(seconds\\)")),
    peakKiB: Number(field("Maximum resident set size \\(kbytes\\)")),
    workers: args.includes("batch") ? availableParallelism() : 1,
    loadAverage: Math.round(load * 10) / 10,
    node: process.version,
    date: new Date().toISOString().slice(0, 10),
    commit: commitMeasured(),
  };
}

function checkCase(dir: string): Measurement {
  const rows = option("rows", 30_000_000);
  const file = join(dir, `check-${rows}.csv`);
  const random = seededRandom(30_000_000);
  console.log(`writing ${rows.toLocaleString("en")} rows to ${file}`);
  writeLines(file, "error", rows, () => random.normal().toFixed(4));
  console.log("running check");
  const measured = measure(["check", file, "--json"], rows, 1, file);
  rmSync(file, { force: true });
  return measured;
}

function batchCase(dir: string, fitted: boolean): Measurement {
  const series = option("series", fitted ? 1_000_000 : 100_000);
  const periods = option("periods", 52);
  const file = join(dir, `long-${series}x${periods}.csv`);
  const random = seededRandom(52_000_000);
  const weeks = Array.from({ length: periods }, (_, w) => weekDate(w));
  console.log(`writing ${series.toLocaleString("en")} items × ${periods} weeks to ${file}`);
  writeLines(file, "item,week,error", series * periods, (i) => {
    const item = Math.floor(i / periods);
    return `item-${String(item).padStart(7, "0")},${weeks[i % periods]},${random.normal().toFixed(4)}`;
  });
  console.log("running batch");
  const args = ["batch", file, "--id", "item", "--time", "week", "--value", "error"];
  const measured = measure(
    [...args, ...(fitted ? ["--fitted", "1"] : [])],
    series * periods,
    series,
    file,
  );
  rmSync(file, { force: true });
  return measured;
}

const grouped = (x: number) => Math.round(x).toLocaleString("en");
const duration = (seconds: number) =>
  seconds < 120
    ? `${seconds.toFixed(0)} s`
    : `${Math.floor(seconds / 60)} min ${Math.round(seconds % 60)} s`;

function table(results: Record<string, Measurement>): string {
  const lines = [
    "| case | command | rows (values) | series | file size | wall time | user + system CPU | peak resident memory | per value |",
    "| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |",
  ];
  const notes: string[] = [];
  for (const [name, m] of Object.entries(results)) {
    const cpu = m.userSeconds + m.systemSeconds;
    lines.push(
      `| ${name} | \`${m.command}\` | ${grouped(m.rows)} | ${grouped(m.series)} | ${grouped(m.fileBytes / 1e6)} MB | ${duration(m.wallSeconds)} | ${duration(cpu)} | ${grouped(m.peakKiB)} KiB | ${((m.peakKiB * 1024) / m.rows).toFixed(1)} bytes |`,
    );
    notes.push(
      `${name}: ${m.date}, commit ${m.commit ?? "not recorded"}, Node ${m.node}, ${m.workers} worker${m.workers === 1 ? "" : "s"}, load average ${m.loadAverage} at the start`,
    );
    if (name === "batch") {
      const perSeries = (cpu / m.series) * 1000;
      const million = (perSeries * 1e6) / 1000;
      // A projection only where the run was smaller than the full size; otherwise it is measured.
      const atFullSize =
        m.series >= 1_000_000
          ? "measured at the full size"
          : `at that rate 1,000,000 series take about ${duration(million)} of CPU (a projection, not a measurement)`;
      notes.push(
        `batch: ${perSeries.toFixed(2)} ms of CPU a series, reading included; ${atFullSize}; the wall time is that of a shared machine (run at nice 10)`,
      );
    }
  }
  return [...lines, "", ...notes.map((n) => `- ${n}`)].join("\n");
}

function main(): void {
  const known = ["check", "batch", "batch-fitted"];
  const cases = process.argv.slice(2).filter((a) => known.includes(a));
  // `table` measures nothing: it rewrites the README table from the results kept.
  const wanted = process.argv.includes("table") ? [] : cases.length === 0 ? known : cases;
  const given = process.argv.indexOf("--dir");
  const dir =
    given >= 0
      ? (process.argv[given + 1] as string)
      : mkdtempSync(join(tmpdir(), "echolot-scale-"));
  const results = (existsSync(RESULTS) ? JSON.parse(readFileSync(RESULTS, "utf8")) : {}) as Record<
    string,
    Measurement
  >;
  try {
    for (const name of wanted) {
      results[name] = name === "check" ? checkCase(dir) : batchCase(dir, name === "batch-fitted");
      writeFileSync(RESULTS, `${JSON.stringify(results, null, 2)}\n`);
      console.log(JSON.stringify(results[name]));
    }
  } finally {
    if (!process.argv.includes("--keep") && given < 0)
      rmSync(dir, { recursive: true, force: true });
  }
  const readme = readFileSync(README, "utf8");
  const from = readme.indexOf(START);
  const to = readme.indexOf(END);
  if (from < 0 || to < from) throw new Error(`README.md has no scale markers (${START} … ${END})`);
  writeFileSync(
    README,
    `${readme.slice(0, from + START.length)}\n${table(results)}\n${readme.slice(to)}`,
  );
  console.log(table(results));
}

main();

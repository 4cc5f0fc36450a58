/**
 * `batch` and `audit` run their per-series stage in worker threads (`--workers N`): whatever N,
 * the output is byte for byte that of the in-process run (`--workers 1`), and that run's figures
 * are the core's one-call batch on the same numbers (exact equality, no tolerance).
 */
import { tmpdir } from "node:os";
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { batchCheck, seriesFromValues, type Series } from "../../src/core";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { CLI_PATH, csvFile, runCli } from "./run";

const IDS = 200;
const WEEKS = 40;
const random = seededRandom(20261202);
/** Per id its weekly errors as written (4 decimals); id 7 misses week 12 (a gap). */
const written: (string | null)[][] = Array.from({ length: IDS }, (_, i) => {
  const errors = i % 4 === 0 ? ar1(random, WEEKS, 0.4) : whiteNoise(random, WEEKS);
  return Array.from(errors, (e, t) => (i === 7 && t === 11 ? null : e.toFixed(4)));
});
const lines = ["item,week,error"];
// Rows interleaved by week, so every id's rows are spread over the whole file.
for (let t = 0; t < WEEKS; t++) {
  written.forEach((errors, i) => {
    const text = errors[t];
    if (text !== null && text !== undefined)
      lines.push(`id-${String(i).padStart(3, "0")},${t + 1},${text}`);
  });
}
// One id whose value cell is text: listed as not analysed.
lines.push("id-bad,1,oops", "id-bad,2,0.5");
const file = csvFile("workers-long.csv", lines.join("\n"));
/** The first 40 ids, for the audit (several times a batch's work a series). */
const few = csvFile(
  "workers-few.csv",
  lines.filter((line) => !/^id-(0[4-9]|1)/.test(line)).join("\n"),
);
const LONG = ["--id", "item", "--time", "week", "--value", "error"];

function outputs(args: readonly string[]): string[] {
  return [1, 2, 3].map((workers) => {
    const result = runCli([...args, "--workers", String(workers)]);
    expect(result.stderr, `--workers ${workers}`).toBe("");
    expect(result.status, `--workers ${workers}`).toBe(0);
    return result.stdout;
  });
}

describe("echolot batch/audit --workers N", () => {
  it("batch --json gives the same bytes for 1, 2 and 3 workers, and the core's batch figures", () => {
    const [one, two, three] = outputs(["batch", file, ...LONG, "--json"]);
    expect(two).toBe(one);
    expect(three).toBe(one);
    const document = JSON.parse(one!) as {
      series: { label: string; p: number; qValue: number; verdict: string }[];
      notAnalysed: { name: string }[];
    };
    expect(document.notAnalysed.map((n) => n.name)).toEqual(['item "id-bad"']);
    const series: Series[] = written.map((errors, i) =>
      seriesFromValues(
        errors.map((e) => (e === null ? null : Number(e))),
        { label: `id-${String(i).padStart(3, "0")}`, labelFromFirstCell: false },
      ),
    );
    const whole = batchCheck(series);
    expect(document.series.map((s) => s.label)).toEqual(whole.rows.map((r) => r.label));
    document.series.forEach((row, i) => {
      const expected = whole.rows[i]!;
      expect(row.p, row.label).toBe(expected.p);
      expect(row.qValue, row.label).toBe(expected.qValue);
      expect(row.verdict, row.label).toBe(expected.verdict);
    });
  });

  it("batch --format jsonl gives the same bytes for 1, 2 and 3 workers", () => {
    const [one, two, three] = outputs(["batch", file, ...LONG, "--format", "jsonl"]);
    expect(one!.trim().split("\n")).toHaveLength(IDS);
    expect(two).toBe(one);
    expect(three).toBe(one);
  });

  it("audit --json gives the same bytes for 1, 2 and 3 workers", () => {
    const [one, two, three] = outputs(["audit", few, ...LONG, "--horizon", "2", "--json"]);
    expect((JSON.parse(one!) as { series: unknown[] }).series).toHaveLength(40);
    expect(two).toBe(one);
    expect(three).toBe(one);
  });

  it("runs its workers from any folder, and draws no progress line when stderr is not a terminal", () => {
    const inPlace = runCli(["batch", file, ...LONG, "--format", "jsonl", "--workers", "1"]);
    const elsewhere = spawnSync(
      process.execPath,
      [CLI_PATH, "batch", file, ...LONG, "--format", "jsonl", "--workers", "2"],
      { cwd: tmpdir(), encoding: "utf8" },
    );
    expect(elsewhere.stderr).toBe("");
    expect(elsewhere.stdout).toBe(inPlace.stdout);
  });

  it("refuses --workers that is not a whole number from 1 to 256", () => {
    for (const bad of ["0", "1.5", "257", "two"]) {
      const result = runCli(["batch", file, ...LONG, "--workers", bad]);
      expect(result.status, bad).toBe(2);
      expect(result.stderr, bad).toMatch(
        /--workers must be a whole number from 1 to 256|--workers must be a number/,
      );
    }
  });
});

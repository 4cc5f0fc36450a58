/**
 * `batch` and `audit` run their per-series stage in worker threads (`--workers N`): whatever N
 * (2 and 3 here, more workers than chunks in places), the output is byte for byte that of the
 * in-process run (`--workers 1`), and that run's figures
 * are the core's one-call batch on the same numbers (exact equality, no tolerance).
 */
import { tmpdir } from "node:os";
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import type { AuditDocumentJson, BatchDocumentJson } from "../../src/cli/jsonBatch";
import { batchCheck, seriesFromValues, type Series } from "../../src/core";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import { CLI_PATH, csvFile, runCli } from "./run";

const IDS = 200;
const WEEKS = 30;
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
/** The first 32 ids (two chunks of an audit), for the audit: several times a batch's work a series. */
const few = csvFile(
  "workers-few.csv",
  lines.filter((line) => !/^id-(0[4-9]|1|03[2-9])/.test(line)).join("\n"),
);
const LONG = ["--id", "item", "--time", "week", "--value", "error"];

function outputs(args: readonly string[], counts: readonly number[]): string[] {
  return counts.map((workers) => {
    const result = runCli([...args, "--workers", String(workers)]);
    expect(result.stderr, `--workers ${workers}`).toBe("");
    expect(result.status, `--workers ${workers}`).toBe(0);
    return result.stdout;
  });
}

describe("echolot batch/audit --workers N", () => {
  it("batch --json gives the same bytes for 1 and 3 workers, and the core's batch figures", () => {
    const [one, three] = outputs(["batch", file, ...LONG, "--json"], [1, 3]);
    expect(three).toBe(one);
    const document = JSON.parse(one!) as BatchDocumentJson;
    expect(document.notAnalysed.map((n) => n.name)).toEqual(['item "id-bad"']);
    const series: Series[] = written.map((errors, i) =>
      seriesFromValues(
        errors.map((e) => (e === null ? null : Number(e))),
        { label: `id-${String(i).padStart(3, "0")}`, labelFromFirstCell: false },
      ),
    );
    const whole = batchCheck(series);
    // The document lists the rows in its ranked order: matched by label.
    expect(document.series.map((s) => s.label).sort()).toEqual(
      whole.rows.map((r) => r.label).sort(),
    );
    const byLabel = new Map(whole.rows.map((r) => [r.label, r]));
    document.series.forEach((row) => {
      const expected = byLabel.get(row.label)!;
      expect(row.p, row.label).toBe(expected.p);
      expect(row.qValue, row.label).toBe(expected.qValue);
      expect(row.verdict, row.label).toBe(expected.verdict);
    });
  });

  it("batch --format jsonl gives the same bytes for 1 and 2 workers", () => {
    const [one, two] = outputs(["batch", file, ...LONG, "--format", "jsonl"], [1, 2]);
    expect(one!.trim().split("\n")).toHaveLength(IDS);
    expect(two).toBe(one);
  });

  it("audit --json gives the same bytes for 1 and 3 workers", () => {
    const [one, three] = outputs(["audit", few, ...LONG, "--horizon", "2", "--json"], [1, 3]);
    expect((JSON.parse(one!) as AuditDocumentJson).series).toHaveLength(32);
    expect(three).toBe(one);
  });

  it("runs its workers from any folder, and draws no progress line when stderr is not a terminal", () => {
    const inPlace = runCli(["batch", few, ...LONG, "--format", "jsonl", "--workers", "1"]);
    const elsewhere = spawnSync(
      process.execPath,
      [CLI_PATH, "batch", few, ...LONG, "--format", "jsonl", "--workers", "2"],
      { cwd: tmpdir(), encoding: "utf8" },
    );
    expect(elsewhere.stderr).toBe("");
    expect(elsewhere.stdout).toBe(inPlace.stdout);
  });

  it("refuses --workers that is not a whole number from 1 to 256", () => {
    for (const bad of ["0", "1.5", "257"]) {
      const result = runCli(["batch", file, ...LONG, "--workers", bad]);
      expect(result.status, bad).toBe(2);
      expect(result.stderr, bad).toBe(
        `echolot: --workers must be a whole number from 1 to 256 (1 runs in-process; got "${bad}")\n`,
      );
    }
    const text = runCli(["batch", file, ...LONG, "--workers", "two"]);
    expect(text.status).toBe(2);
    expect(text.stderr).toBe(
      'echolot: --workers must be a number written in decimal (got "two")\n',
    );
  });
});

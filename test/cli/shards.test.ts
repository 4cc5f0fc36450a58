/**
 * A batch split across machines: each part runs `batch --format jsonl` on its own ids, `fdr`
 * merges the parts. Whatever the split, the merge gives the whole batch's q-values and verdicts,
 * and one order (q-value, then id).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import type { BatchDocumentJson, BatchJson } from "../../src/cli/jsonBatch";
import { csvFile, runCli } from "./run";

const ITEMS = Array.from({ length: 14 }, (_, i) => `item-${String(i).padStart(2, "0")}`);
const rng = seededRandom(1202);
/** Long-format rows (item, week, error), 52 weeks an item; a third of the items carry lag-1 dependence. */
const rows = ITEMS.flatMap((item, i) => {
  const errors = i % 3 === 0 ? ar1(rng, 52, 0.5) : whiteNoise(rng, 52);
  return Array.from(errors, (e, t) => `${item},${1 + t},${e.toFixed(4)}`);
});
const header = "item,week,error";
const LONG = ["--id", "item", "--time", "week", "--value", "error"];

function partFile(name: string, items: readonly string[]): string {
  const source = csvFile(
    `${name}.csv`,
    [header, ...rows.filter((r) => items.includes(r.split(",")[0]!))].join("\n"),
  );
  const result = runCli(["batch", source, ...LONG, "--format", "jsonl"]);
  expect(result.stderr).toBe("");
  return csvFile(`${name}.jsonl`, result.stdout);
}

function merged(parts: readonly string[]): string {
  const result = runCli(["fdr", ...parts, "--json"]);
  expect(result.stderr).toBe("");
  expect(result.status).toBe(0);
  return result.stdout;
}

describe("batch --format jsonl and fdr", () => {
  const whole = JSON.parse(
    runCli(["batch", csvFile("whole.csv", [header, ...rows].join("\n")), ...LONG, "--json"]).stdout,
  ) as BatchDocumentJson;
  const all = partFile("all", ITEMS);

  it("writes one line per series with id, n, statistic, df, p, reference, verdict and reason", () => {
    const lines = readFileSync(all, "utf8").trim().split("\n");
    expect(lines).toHaveLength(ITEMS.length);
    const first = JSON.parse(lines[0]!) as Record<string, unknown>;
    for (const field of ["id", "n", "statistic", "df", "p", "reference", "verdict", "reason"]) {
      expect(first, field).toHaveProperty(field);
    }
    expect(first.n).toBe(52);
  });

  it("merges any split into the whole batch's q-values, verdicts and counts, in one order", () => {
    const splits = [
      [ITEMS.filter((_, i) => i % 2 === 0), ITEMS.filter((_, i) => i % 2 === 1)],
      [ITEMS.slice(9), ITEMS.slice(0, 4), ITEMS.slice(4, 9)],
      ITEMS.map((item) => [item]).reverse(),
    ];
    const reference = merged([all]);
    const doc = JSON.parse(reference) as BatchJson;
    const byLabel = new Map(whole.series.map((s) => [s.label, s]));
    for (const row of doc.series) {
      const same = byLabel.get(row.label)!;
      expect(row.qValue, row.label).toBe(same.qValue);
      expect(row.verdict, row.label).toBe(same.verdict);
    }
    expect([doc.flaggedRaw, doc.flaggedFdr]).toEqual([whole.flaggedRaw, whole.flaggedFdr]);
    splits.forEach((split, s) => {
      const parts = split.map((items, k) => partFile(`split${s}-${k}`, items));
      expect(merged(parts), `split ${s}`).toBe(reference);
    });
    // Standard input works as a part too.
    const viaStdin = runCli(["fdr", "--json"], readFileSync(all, "utf8"));
    expect(viaStdin.stdout).toBe(reference);
  });

  it("lists the merged rows in the whole batch's ranked order (ids are in column order here)", () => {
    const result = runCli(["fdr", all, "--format", "jsonl"]);
    const order = result.stdout
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l) as { id: string; qValue: number });
    // Both follow the core's one ranking (batchRanking.ts); ties fall to input order, which
    // for the merge is id order, and the ids here are in column order.
    expect(order.map((o) => o.id)).toEqual(whole.series.map((s) => s.label));
  });

  it("refuses a line that is not a batch line, naming it", () => {
    const bad = csvFile("bad.jsonl", `${readFileSync(all, "utf8").split("\n")[0]}\n{"id": 3}\n`);
    const result = runCli(["fdr", bad]);
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(
      /line 2 of .*bad\.jsonl lacks a field of echolot batch --format jsonl/,
    );
  });
});

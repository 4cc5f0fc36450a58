/**
 * Peak extra memory of one lag table on 2^20 values, measured in a fresh Node process so that
 * nothing the other cases allocated is counted: the child builds the series, collects garbage,
 * notes its resident set size, runs the lag table once and reports the process's peak resident
 * set size. Peak minus the starting size bounds the table's extra memory from above (the peak
 * also covers anything the child did before, which is only building its input).
 */
import { spawnSync } from "node:child_process";
import { lagTable } from "../src/core";
import { residualSeries } from "./inputs";
import { collectGarbage } from "./timing";

export const MEMORY_CHILD_FLAG = "--memory-child";

export interface MemoryReading {
  readonly n: number;
  readonly k: number;
  readonly startBytes: number;
  readonly peakBytes: number;
  readonly extraBytes: number;
}

/** Runs in the child: one lag table, then the reading as JSON on stdout. */
export function memoryChild(n: number, k: number): void {
  const series = residualSeries(n);
  collectGarbage();
  collectGarbage();
  const startBytes = process.memoryUsage.rss();
  const table = lagTable(series, { maxLag: k });
  const peakBytes = process.resourceUsage().maxRSS * 1024;
  const reading: MemoryReading = {
    n,
    k,
    startBytes,
    peakBytes,
    extraBytes: Math.max(0, peakBytes - startBytes),
  };
  if (table.rows.length !== k) throw new Error("lag table has the wrong number of rows");
  process.stdout.write(`${JSON.stringify(reading)}\n`);
}

/** Starts the child (this same bundled script) and reads its report. */
export function measureMemory(n: number, k: number): MemoryReading {
  const script = process.argv[1];
  if (script === undefined) throw new Error("cannot find the bench script to start a child");
  const child = spawnSync(
    process.execPath,
    ["--expose-gc", script, MEMORY_CHILD_FLAG, String(n), String(k)],
    { encoding: "utf8" },
  );
  if (child.status !== 0) {
    throw new Error(`memory child failed (${child.status}): ${child.stderr}`);
  }
  return JSON.parse(child.stdout.trim()) as MemoryReading;
}

/**
 * `npm run bench` — Echolot measured against the irreducible work, in one run.
 * `npm run bench -- --json` prints one JSON object {"cases": [...]} on stdout (the table goes to
 * stderr); `-- --only batch,growth` runs some cases only (keys: memory, lagtable, acf, cells,
 * batch, growth, crossover). Not part of `npm test`: unit tests never time anything.
 * Node runs it with --expose-gc (a full collection before each timing) and --single-threaded-gc
 * (collection work stays on the thread that causes it, so its cost is counted in that case and a
 * busy second core does not change how much of it is hidden).
 */
import {
  crossoverCase,
  batchCase,
  checkCase,
  cellsCase,
  growthCase,
  lagTableCase,
  longAcfCase,
} from "./cases";
import { measureMemory, memoryChild, MEMORY_CHILD_FLAG } from "./memory";
import { resultTable, withinTarget, type CaseResult } from "./result";
import { residualSeries } from "./inputs";

const MILLION = 1_048_576;

function memoryCase(): CaseResult {
  const k = 40;
  const reading = measureMemory(MILLION, k);
  const ratio = reading.extraBytes / reading.n;
  const target = 32;
  return {
    name: "memory-lagtable-1M-k40",
    n: reading.n,
    k,
    medianMs: null,
    floorMs: null,
    ratio,
    target,
    ok: withinTarget(ratio, target),
    measure: "peak extra RSS bytes per value (fresh process)",
    detail: {
      startBytes: reading.startBytes,
      peakBytes: reading.peakBytes,
      extraBytes: reading.extraBytes,
    },
  };
}

function main(): void {
  const args = process.argv.slice(2);
  if (args[0] === MEMORY_CHILD_FLAG) {
    memoryChild(Number(args[1]), Number(args[2]));
    return;
  }
  const json = args.includes("--json");
  const onlyAt = args.indexOf("--only");
  const only = onlyAt >= 0 ? args[onlyAt + 1] : undefined;
  const progress = (text: string) => process.stderr.write(`bench: ${text}\n`);
  const series = residualSeries(MILLION);
  const cases: CaseResult[] = [];
  const steps: [string, string, () => CaseResult][] = [
    ["memory", "memory (fresh process)", memoryCase],
    ["lagtable", "lag table, 2^20 values, K = 40", () => lagTableCase(series)],
    ["acf", "autocorrelation, 2^20 values, K = 1000", () => longAcfCase(series)],
    ["cells", "intake of 2^20 cells", () => cellsCase(series)],
    ["batch", "block check, 2000 × 260, K = 26", batchCase],
    ["check", "calibrated noise check, 260 values, K = 10", checkCase],
    ["growth", "growth, n = 2^14 … 2^20", () => growthCase(series)],
    ["crossover", "crossover, n = 2^16", () => crossoverCase(series)],
  ];
  for (const [key, label, run] of steps) {
    if (only !== undefined && !only.split(",").includes(key)) continue;
    progress(label);
    const result = run();
    cases.push(result);
    progress(`  ratio ${result.ratio.toFixed(3)} (${result.measure}), ok ${result.ok}`);
  }
  const table = resultTable(cases);
  if (json) {
    process.stderr.write(`${table}\n`);
    process.stdout.write(`${JSON.stringify({ cases })}\n`);
  } else {
    process.stdout.write(`${table}\n`);
  }
  if (!cases.every((c) => c.ok)) process.exitCode = 1;
}

main();

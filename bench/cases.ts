/**
 * The bench cases. Each compares Echolot's code with an arithmetic floor (or with another case)
 * measured in the same run, interleaved, so the ratio carries over between machines.
 */
import {
  autocorrelation,
  baseDrawCount,
  centre,
  noiseCheck,
  directLagProductSums,
  FFT_STEP_COST,
  lagSumCosts,
  lagTable,
  prefersFft,
  seriesFromCells,
  type Series,
} from "../src/core";
import { fftLagProductSums } from "../src/core/fft";
import { BATCH_CORE, batchCore } from "./batch";
import { floorLagDotProducts } from "./floor";
import { itemBlock, residualCells } from "./inputs";
import type { CaseResult } from "./result";
import { withinTarget } from "./result";
import { interleaved, median, timeOnce } from "./timing";

const MILLION = 1_048_576;

function judged(result: Omit<CaseResult, "ok">): CaseResult {
  return { ...result, ok: withinTarget(result.ratio, result.target) };
}

/** The full lag table (default options) on 2^20 gap-free values, K = 40. */
export function lagTableCase(series: Series): CaseResult {
  const k = 40;
  const { deviations } = centre(series);
  const timing = interleaved(
    () => lagTable(series, { maxLag: k }),
    () => floorLagDotProducts(deviations, k),
    21,
  );
  return judged({
    name: "lagtable-1M-k40",
    n: series.count,
    k,
    medianMs: timing.caseMs,
    floorMs: timing.floorMs,
    ratio: timing.caseMs / timing.floorMs,
    target: 1,
    measure: "lag table time / floor",
  });
}

/** Autocorrelation to K = 1,000 through the automatic path, against the direct floor. */
export function longAcfCase(series: Series): CaseResult {
  const k = 1000;
  const { deviations } = centre(series);
  const timing = interleaved(
    () => autocorrelation(series, k),
    () => floorLagDotProducts(deviations, k),
    7,
    1,
  );
  return judged({
    name: "acf-1M-k1000",
    n: series.count,
    k,
    medianMs: timing.caseMs,
    floorMs: timing.floorMs,
    ratio: timing.caseMs / timing.floorMs,
    target: 0.25,
    measure: "autocorrelation time / direct floor",
    detail: { path: prefersFft(series.values.length, k) ? "fft" : "direct" },
  });
}

/** Intake of a 2^20 × 1 range of cells, against the lag table's core time on as many values. */
export function cellsCase(series: Series): CaseResult {
  const cells = residualCells(MILLION);
  const timing = interleaved(
    () => seriesFromCells(cells),
    () => lagTable(series, { maxLag: 40 }),
    21,
  );
  return judged({
    name: "cells-1M",
    n: cells.length,
    k: 40,
    medianMs: timing.caseMs,
    floorMs: timing.floorMs,
    ratio: timing.caseMs / timing.floorMs,
    target: 1,
    measure: "intake time / lag table time (floor ms = lagtable-1M-k40)",
  });
}

/**
 * The floor of a calibrated verdict: the lag dot-products once for the observed series and once
 * for each of the B permutation draws (B = 499 at alpha 5%), the least arithmetic any reference
 * drawn from the data needs.
 */
function calibratedFloor(d: Float64Array, k: number): number {
  let sink = 0;
  const draws = baseDrawCount(0.05) + 1;
  for (let b = 0; b < draws; b++) sink += floorLagDotProducts(d, k)[k] as number;
  return sink;
}

/**
 * The block check's core on 2,000 series of 260 values, K = 26, season 13: each series'
 * calibrated verdict (500 permutation arrangements) and Benjamini–Hochberg across them, against
 * the summed calibrated floors.
 */
export function batchCase(): CaseResult {
  const count = 2000;
  const length = 260;
  const k = 26;
  const block = itemBlock(count, length);
  const deviations = block.map((s) => centre(s).deviations);
  const timing = interleaved(
    () => batchCore(block, { maxLag: k, season: 13 }),
    () => deviations.map((d) => calibratedFloor(d, k)),
    3,
    1,
  );
  return judged({
    name: "batch-2000x260-k26",
    n: count * length,
    k,
    medianMs: timing.caseMs,
    floorMs: timing.floorMs,
    ratio: timing.caseMs / timing.floorMs,
    target: 2,
    measure: "calibrated block check time / summed floors of its draws",
    detail: { series: count, length, core: BATCH_CORE, draws: baseDrawCount(0.05) + 1 },
  });
}

/** One calibrated noise check of 260 values, K = 10, against the floor of its draws. */
export function checkCase(): CaseResult {
  const length = 260;
  const k = 10;
  const block = itemBlock(40, length);
  const deviations = block.map((s) => centre(s).deviations);
  const timing = interleaved(
    () => block.map((s) => noiseCheck(s, { maxLag: k })),
    () => deviations.map((d) => calibratedFloor(d, k)),
    9,
  );
  return judged({
    name: "check-260-k10",
    n: length,
    k,
    medianMs: timing.caseMs / block.length,
    floorMs: timing.floorMs / block.length,
    ratio: timing.caseMs / timing.floorMs,
    target: 2,
    measure: "calibrated noise check time / floor of its draws",
    detail: { draws: baseDrawCount(0.05) + 1 },
  });
}

/** Least-squares slope of y on x. */
function slope(x: readonly number[], y: readonly number[]): number {
  const mx = x.reduce((a, b) => a + b, 0) / x.length;
  const my = y.reduce((a, b) => a + b, 0) / y.length;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < x.length; i++) {
    sxy += ((x[i] as number) - mx) * ((y[i] as number) - my);
    sxx += ((x[i] as number) - mx) ** 2;
  }
  return sxy / sxx;
}

/**
 * The lag table at K = 40 for n = 2^14 … 2^20: the slope of log time on log n. Sizes are timed
 * round-robin, each timing covering 2^20 values (2^20/n calls), so load falls on all alike.
 */
export function growthCase(series: Series): CaseResult {
  const k = 40;
  const sizes = [14, 15, 16, 17, 18, 19, 20].map((p) => 2 ** p);
  const inputs = sizes.map((n) => ({
    ...series,
    values: series.values.subarray(0, n),
    present: series.present.subarray(0, n),
    count: n,
  }));
  const sink: unknown[] = [];
  const times = sizes.map(() => [] as number[]);
  const rounds = 15;
  for (let round = -2; round < rounds; round++) {
    inputs.forEach((input, i) => {
      const calls = MILLION / input.count;
      const ms = timeOnce(() => {
        let last: unknown;
        for (let c = 0; c < calls; c++) last = lagTable(input, { maxLag: k });
        return last;
      }, sink);
      if (round >= 0) times[i]?.push(ms / calls);
    });
  }
  const medians = times.map(median);
  const fitted = slope(
    sizes.map((n) => Math.log(n)),
    medians.map((t) => Math.log(t)),
  );
  return judged({
    name: "growth-k40",
    n: MILLION,
    k,
    medianMs: medians[medians.length - 1] as number,
    floorMs: null,
    ratio: fitted,
    target: [0.9, 1.1],
    measure: "slope of log time on log n, n = 2^14…2^20",
    detail: { sizes, medianMs: medians },
  });
}

/**
 * Where the transform path overtakes the direct one, at n = 2^16: both timed at a ladder of K.
 * ratio = the automatic choice's time over the faster path's, at worst over the ladder; the
 * detail gives the measured crossover and the step cost the timings imply (FFT_STEP_COST in
 * lagProductSums.ts is set from it).
 */
export function crossoverCase(series: Series): CaseResult {
  const n = 65_536;
  const d = centre({
    ...series,
    values: series.values.subarray(0, n),
    present: series.present.subarray(0, n),
    count: n,
  }).deviations;
  const ladder = [10, 20, 30, 40, 60, 80, 100, 120, 160, 240, 320];
  let worst = 0;
  let measuredCrossover: number | null = null;
  const rows: { k: number; directMs: number; fftMs: number; automatic: string }[] = [];
  const impliedStepCosts: number[] = [];
  for (const k of ladder) {
    const timing = interleaved(
      () => fftLagProductSums(d, k),
      () => directLagProductSums(d, k),
      9,
    );
    const automatic = prefersFft(n, k) ? timing.caseMs : timing.floorMs;
    worst = Math.max(worst, automatic / Math.min(timing.caseMs, timing.floorMs));
    if (measuredCrossover === null && timing.caseMs < timing.floorMs) measuredCrossover = k;
    // The step cost these timings imply: time per transform step over time per multiply-add.
    const cost = lagSumCosts(n, k);
    impliedStepCosts.push(
      FFT_STEP_COST * (timing.caseMs / timing.floorMs) * (cost.direct / cost.fft),
    );
    rows.push({
      k,
      directMs: timing.floorMs,
      fftMs: timing.caseMs,
      automatic: prefersFft(n, k) ? "fft" : "direct",
    });
  }
  const modelCrossover = ladder.find((k) => prefersFft(n, k)) ?? null;
  return judged({
    name: "crossover-64K",
    n,
    k: modelCrossover ?? 0,
    medianMs: null,
    floorMs: null,
    ratio: worst,
    target: 1.25,
    measure: "automatic path time / faster path's, worst K on the ladder",
    detail: {
      measuredCrossover,
      modelCrossover,
      stepCost: FFT_STEP_COST,
      impliedStepCost: median(impliedStepCosts),
      ladder: rows,
    },
  });
}

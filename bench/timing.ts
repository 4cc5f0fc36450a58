/**
 * Timing for the bench: medians over repetitions, with the floor and the case interleaved so
 * that load from other processes on the machine falls on both alike.
 */

type GarbageCollector = (options?: {
  type: "major" | "minor";
  execution: "sync" | "async";
}) => void;

/**
 * Forces a full garbage collection when Node runs with --expose-gc, so one run's garbage is not
 * collected inside the next one's timing. A plain `gc()` is the memory-saving collection, which
 * also throws away the engine's type feedback and so deoptimises the code under test; a
 * synchronous major collection does not.
 */
export function collectGarbage(): void {
  const gc = (globalThis as { gc?: GarbageCollector }).gc;
  if (gc !== undefined) gc({ type: "major", execution: "sync" });
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1
    ? (sorted[middle] as number)
    : ((sorted[middle - 1] as number) + (sorted[middle] as number)) / 2;
}

/** Milliseconds of one call. The result is kept so the work cannot be optimised away. */
export function timeOnce(run: () => unknown, sink: unknown[]): number {
  collectGarbage();
  const start = performance.now();
  const result = run();
  const elapsed = performance.now() - start;
  sink.push(result);
  if (sink.length > 8) sink.length = 0;
  return elapsed;
}

export interface PairedTiming {
  readonly caseMs: number;
  readonly floorMs: number;
  readonly repetitions: number;
}

/**
 * Runs `warmups` untimed calls of each, then `repetitions` rounds that time both, alternating
 * which goes first; returns the two medians.
 */
export function interleaved(
  runCase: () => unknown,
  runFloor: () => unknown,
  repetitions: number,
  warmups = 2,
): PairedTiming {
  const sink: unknown[] = [];
  for (let i = 0; i < warmups; i++) {
    sink.push(runCase(), runFloor());
  }
  const caseTimes: number[] = [];
  const floorTimes: number[] = [];
  for (let i = 0; i < repetitions; i++) {
    if (i % 2 === 0) {
      caseTimes.push(timeOnce(runCase, sink));
      floorTimes.push(timeOnce(runFloor, sink));
    } else {
      floorTimes.push(timeOnce(runFloor, sink));
      caseTimes.push(timeOnce(runCase, sink));
    }
  }
  return { caseMs: median(caseTimes), floorMs: median(floorTimes), repetitions };
}

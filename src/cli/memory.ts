/**
 * Between the steps of a check on a long series, the arrays a finished step allocated (each as
 * long as the series) are garbage, but V8 collects typed arrays only when its heuristics say so:
 * without a nudge they pile up, and a 30-million-value check peaked at 37 bytes a value instead
 * of about 20. A full collection between steps keeps the peak to the step that needs most.
 * Node exposes `gc` only with --expose-gc; V8's flag can be set at run time and the function
 * fetched from a fresh context, which is what this does, once, and only for long series.
 */
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";

/** Series at least this long get a full collection between steps. */
const LONG_SERIES = 1_000_000;

let collect: (() => void) | undefined;

/** Runs a full garbage collection when the series is long; a no-op otherwise. */
export function releaseBetweenSteps(values: number): void {
  if (values < LONG_SERIES) return;
  if (collect === undefined) {
    setFlagsFromString("--expose-gc");
    collect = runInNewContext("gc") as () => void;
  }
  collect();
}

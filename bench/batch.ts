/**
 * The core of the block check, as the bench runs it: the lag table of every column and
 * Benjamini–Hochberg q-values over their joint p-values.
 *
 * Stand-in: SERIESBATCHCHECK's own core function is not in src/core yet, so the bench runs the
 * same work it is specified to do (one lag table per column, then the q-values).
 */
import { benjaminiHochberg, lagTable, type LagOptions, type Series } from "../src/core";

export const BATCH_CORE = "stand-in: lagTable per column + benjaminiHochberg";

export function batchCore(block: readonly Series[], options: LagOptions): Float64Array {
  const p = new Float64Array(block.length);
  for (let i = 0; i < block.length; i++) {
    p[i] = lagTable(block[i] as Series, options).joint.p;
  }
  return benjaminiHochberg(p);
}

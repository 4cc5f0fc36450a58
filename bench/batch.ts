/**
 * The core of the block check (SERIESBATCHCHECK) as the bench runs it: `batchCheck` from
 * src/core/batch.ts — one noise check per column and Benjamini–Hochberg q-values across them.
 */
import { batchCheck, type BatchCheck } from "../src/core/batch";
import type { LagOptions, Series } from "../src/core";

export const BATCH_CORE = "batchCheck (src/core/batch.ts)";

export function batchCore(block: readonly Series[], options: LagOptions): BatchCheck {
  return batchCheck(block, options);
}

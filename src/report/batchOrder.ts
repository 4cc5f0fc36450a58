import type { BatchCheck, BatchRow } from "../core";

/**
 * The batch rows in the order both batch views show them, the most telling first: ascending
 * q-value, series without one (not analysed) last, ties in the order given.
 */
export function rowsByQValue(batch: BatchCheck): BatchRow[] {
  const key = (q: number) => (Number.isNaN(q) ? Infinity : q);
  return batch.rows
    .map((row, index) => ({ row, index }))
    .sort((a, b) => key(a.row.qValue) - key(b.row.qValue) || a.index - b.index)
    .map(({ row }) => row);
}

import {
  rankedAuditItems as coreRankedAuditItems,
  rankedRows,
  type AuditBatch,
  type AuditBatchItem,
  type BatchCheck,
  type BatchRow,
} from "../core";

/**
 * One item of a batch or audit in the order every view shows them — the core's one ranking
 * (core/batchRanking.ts: kept findings first, then watch, clear, short, not analysed; within a
 * group by q-value, ties by p, then input order) — with its rank (1 = look first) and whether it
 * is kept after the false-discovery step: its lag structure or its bias survives that step.
 */
export interface Ranked<T> {
  readonly item: T;
  /** 1 for the item to look at first. */
  readonly rank: number;
  /** A finding kept by the false-discovery step: lag structure (q-value ≤ alpha) or bias. */
  readonly kept: boolean;
  /** Position in the input, from 0. */
  readonly index: number;
}

function ranked<T>(inputOrder: readonly T[], order: readonly T[], kept: (item: T) => boolean) {
  const indexOf = new Map(inputOrder.map((item, index) => [item, index]));
  return order.map((item, i) => ({
    item,
    rank: i + 1,
    kept: kept(item),
    index: indexOf.get(item) ?? i,
  }));
}

/** The batch's rows, ranked. */
export function rankedBatchRows(batch: BatchCheck): Ranked<BatchRow>[] {
  return ranked(batch.rows, rankedRows(batch), (row) => row.kept || row.headline?.biased === true);
}

/** The audit's items, ranked. */
export function rankedAuditItems(audit: AuditBatch): Ranked<AuditBatchItem>[] {
  return ranked(audit.items, coreRankedAuditItems(audit), (item) => item.kept || item.biased);
}

/** Which ranked items a view shows: `--kept` keeps the kept ones, `--top N` the first N of those. */
export interface RankedSelection {
  readonly top: number | null;
  readonly keptOnly: boolean;
}

export const ALL_RANKED: RankedSelection = { top: null, keptOnly: false };

export function selectRanked<T>(
  all: readonly Ranked<T>[],
  selection: RankedSelection,
): Ranked<T>[] {
  const kept = selection.keptOnly ? all.filter((r) => r.kept) : all.slice();
  return selection.top === null ? kept : kept.slice(0, selection.top);
}

/** "showing the first 10 of 150 ranked rows", or "" when every row is shown. */
export function selectionNote(shown: number, total: number, selection: RankedSelection): string {
  if (shown === total) return "";
  if (shown === 0)
    return `none of the ${total} ranked rows is kept after the false-discovery step.`;
  const rows = shown === 1 ? "row" : `${shown}`;
  if (!selection.keptOnly) return `showing the first ${rows} of ${total} ranked rows.`;
  const kept =
    selection.top !== null && shown === selection.top
      ? `the first ${rows} kept`
      : `the ${shown} kept`;
  return `showing ${kept} of ${total} ranked rows.`;
}

import type { AuditBatch, AuditBatchItem, BatchCheck, BatchRow } from "../core";

/**
 * One item of a batch or audit in the order every view shows them: its rank (1 = look first) and
 * whether it survives the false-discovery step (a q-value ≤ alpha).
 *
 * The order is one rule for both: ascending q-value, ties broken by p, then by the order of the
 * input; an item without a q-value (not analysed) comes last. For an audit item, q and p are the
 * smaller of its two families (dependence and bias), so an item kept for either finding ranks with
 * the kept ones. The core's ranking (one key agreeing with the headline words) replaces the body
 * of these two functions once it lands; the views only read `rank`, `kept` and `item`.
 */
export interface Ranked<T> {
  readonly item: T;
  /** 1 for the item to look at first. */
  readonly rank: number;
  /** Kept after the false-discovery step: q-value ≤ alpha. */
  readonly kept: boolean;
  /** Position in the input, from 0. */
  readonly index: number;
}

interface Keyed<T> {
  readonly item: T;
  readonly index: number;
  readonly q: number;
  readonly p: number;
}

function ranked<T>(keyed: readonly Keyed<T>[], alpha: number): Ranked<T>[] {
  const key = (x: number) => (Number.isNaN(x) ? Infinity : x);
  return keyed
    .slice()
    .sort((a, b) => key(a.q) - key(b.q) || key(a.p) - key(b.p) || a.index - b.index)
    .map(({ item, index, q }, i) => ({ item, rank: i + 1, kept: q <= alpha, index }));
}

/** The batch's rows, ranked. */
export function rankedBatchRows(batch: BatchCheck): Ranked<BatchRow>[] {
  return ranked(
    batch.rows.map((row, index) => ({ item: row, index, q: row.qValue, p: row.p })),
    batch.alpha,
  );
}

/** The smaller of two figures, NaN only when both are. */
function smaller(a: number, b: number): number {
  if (Number.isNaN(a)) return b;
  if (Number.isNaN(b)) return a;
  return Math.min(a, b);
}

/** The audit's items, ranked by the smaller of their dependence and bias q-values. */
export function rankedAuditItems(audit: AuditBatch): Ranked<AuditBatchItem>[] {
  return ranked(
    audit.items.map((item, index) => ({
      item,
      index,
      q: smaller(item.dependenceQValue, item.biasQValue),
      p: smaller(item.audit?.levels.jointP.p ?? NaN, item.audit?.bias.p ?? NaN),
    })),
    audit.alpha,
  );
}

/** The batch rows in ranked order (the HTML views). */
export function rowsByQValue(batch: BatchCheck): BatchRow[] {
  return rankedBatchRows(batch).map((r) => r.item);
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

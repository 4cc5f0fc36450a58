/**
 * The one order in which every batch and audit view lists its items, agreeing with the words
 * (batchHeadline.ts): the items with a kept finding first — kept lag structure or kept bias,
 * most telling first by the smaller of their kept q-values — then `watch`, then `clear`, then
 * `short`, then the items that could not be analysed. Within a group, by the joint test's q-value,
 * ties broken by its p, then by the order given. So the first row is the item to look at first,
 * and no `clear` row is listed above a `watch` one.
 */
import type { AuditBatch, AuditBatchItem } from "./auditBatch";
import type { BatchCheck, BatchRow } from "./batch";
import type { Headline } from "./headline";

/** The rank group of a headline: 0 kept finding, 1 watch, 2 clear, 3 short, 4 not analysed. */
export function rankGroup(headline: Headline | null, kept: boolean): number {
  if (headline === null) return 4;
  if (kept || headline.biased) return 0;
  return { structure: 0, watch: 1, clear: 2, short: 3 }[headline.word];
}

export interface RankKey {
  readonly group: number;
  /** Within the kept group the smaller kept q-value; elsewhere the joint q-value. */
  readonly q: number;
  readonly p: number;
  readonly index: number;
}

function keyOf(
  headline: Headline | null,
  kept: boolean,
  figures: { q: number; biasQ: number; p: number },
  index: number,
): RankKey {
  const group = rankGroup(headline, kept);
  const keptQ = Math.min(
    kept ? figures.q : Infinity,
    headline?.biased === true ? figures.biasQ : Infinity,
  );
  const missing = (x: number) => (Number.isNaN(x) ? Infinity : x);
  return {
    group,
    q: group === 0 ? keptQ : missing(figures.q),
    p: missing(figures.p),
    index,
  };
}

export function compareRankKeys(a: RankKey, b: RankKey): number {
  return a.group - b.group || a.q - b.q || a.p - b.p || a.index - b.index;
}

/** The batch rows in ranked order (see the file's comment). */
export function rankedRows(batch: BatchCheck): BatchRow[] {
  return batch.rows
    .map((row, index) => ({
      row,
      key: keyOf(row.headline, row.kept, { q: row.qValue, biasQ: row.biasQValue, p: row.p }, index),
    }))
    .sort((a, b) => compareRankKeys(a.key, b.key))
    .map(({ row }) => row);
}

/** The audit's items in ranked order, by the dependence q and p (see the file's comment). */
export function rankedAuditItems(audit: AuditBatch): AuditBatchItem[] {
  return audit.items
    .map((item, index) => ({
      item,
      key: keyOf(
        item.headline,
        item.kept,
        {
          q: item.dependenceQValue,
          biasQ: item.biasQValue,
          p: item.audit?.levels.jointP.p ?? NaN,
        },
        index,
      ),
    }))
    .sort((a, b) => compareRankKeys(a.key, b.key))
    .map(({ item }) => item);
}

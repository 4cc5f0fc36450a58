/**
 * The ranked list of a batch or an audit of many items, as the pane's table shows it and as
 * "Export ranked list" writes it: one row per item, most telling first, with the item's place in
 * the input (to show it), whether the false-discovery step keeps it, and the figures behind the
 * rank. The order and the kept mark come from one place each (rowsByQValue, keptRow), so the table,
 * the picker and the export always agree.
 */
import {
  formatP,
  type AuditBatch,
  type BatchCheck,
  type BatchRow,
  type VerdictWord,
} from "../core";
import { rowsByQValue } from "./batchOrder";
import { BADGES } from "./verdictBadge";

export interface RankedItem {
  /** 1 for the item to look at first. */
  readonly rank: number;
  /** The item's place among the series given (0-based), to show it. */
  readonly index: number;
  readonly label: string;
  readonly n: number;
  /** The p-value the rank rests on, and its Benjamini–Hochberg q-value (NaN: not analysed). */
  readonly p: number;
  readonly qValue: number;
  /** Bias test p and q-value (audit only; NaN otherwise). */
  readonly biasP: number;
  readonly biasQValue: number;
  /** Kept after the false-discovery step (q-value at most alpha). */
  readonly kept: boolean;
  /** The item's verdict word, or null when it could not be analysed. */
  readonly word: VerdictWord | null;
  /** The verdict's reason, or why the item could not be analysed. */
  readonly reason: string;
}

export interface RankedList {
  readonly kind: "batch" | "audit";
  readonly alpha: number;
  readonly items: readonly RankedItem[];
  /** How many items the false-discovery step keeps (they come first). */
  readonly keptCount: number;
}

/** Kept after the false-discovery step: q-value at most alpha. */
function keptRow(qValue: number, alpha: number): boolean {
  return qValue <= alpha;
}

export function rankedBatch(batch: BatchCheck): RankedList {
  const place = new Map<BatchRow, number>(batch.rows.map((row, index) => [row, index]));
  const items = rowsByQValue(batch).map((row, i) => ({
    rank: i + 1,
    index: place.get(row) as number,
    label: row.label,
    n: row.n,
    p: row.p,
    qValue: row.qValue,
    biasP: NaN,
    biasQValue: NaN,
    kept: keptRow(row.qValue, batch.alpha),
    word: row.verdict,
    reason: row.reason,
  }));
  return listOf("batch", batch.alpha, items);
}

/**
 * An audit's items ranked by the smaller of their two q-values (dependence, bias), ties by the
 * smaller p, items that could not be audited last; kept when either q-value is at most alpha.
 */
export function rankedAudit(audit: AuditBatch): RankedList {
  const finite = (x: number) => (Number.isNaN(x) ? Infinity : x);
  const rows = audit.items.map((item, index) => {
    const p = item.audit?.levels.jointP.p ?? NaN;
    const biasP = item.audit?.bias.p ?? NaN;
    const qValue = item.dependenceQValue;
    const key = Math.min(finite(qValue), finite(item.biasQValue));
    const tie = Math.min(finite(p), finite(biasP));
    return { item, index, p, biasP, qValue, key, tie };
  });
  rows.sort((a, b) => a.key - b.key || a.tie - b.tie || a.index - b.index);
  const items = rows.map((r, i) => ({
    rank: i + 1,
    index: r.index,
    label: r.item.label,
    n: r.item.audit?.n ?? 0,
    p: r.p,
    qValue: r.qValue,
    biasP: r.biasP,
    biasQValue: r.item.biasQValue,
    kept: keptRow(r.qValue, audit.alpha) || keptRow(r.item.biasQValue, audit.alpha),
    word: r.item.audit?.verdict.word ?? null,
    reason: r.item.audit?.verdict.reason ?? r.item.problem,
  }));
  return listOf("audit", audit.alpha, items);
}

function listOf(kind: RankedList["kind"], alpha: number, items: RankedItem[]): RankedList {
  return { kind, alpha, items, keptCount: items.filter((item) => item.kept).length };
}

/** A verdict as the table shows it: shape and word, never colour alone. */
export function verdictCellText(word: VerdictWord | null): string {
  return word === null ? "not analysed" : `${BADGES[word].shape} ${word}`;
}

/** A p- or q-value as the table shows it ("—" when there is none). */
export function rankedPText(p: number): string {
  return Number.isNaN(p) ? "—" : formatP(p);
}

/** The export's header and rows as cell values (numbers stay numbers, full precision). */
export function rankedListGrid(list: RankedList): (string | number)[][] {
  const audit = list.kind === "audit";
  const header = [
    "rank",
    "item",
    "n",
    audit ? "dependence p" : "p",
    audit ? "dependence q-value" : "q-value",
    ...(audit ? ["bias p", "bias q-value"] : []),
    `kept (q-value at most ${list.alpha})`,
    "verdict",
    "reason",
  ];
  const number = (x: number) => (Number.isNaN(x) ? "" : x);
  const rows = list.items.map((item) => [
    item.rank,
    item.label,
    item.n,
    number(item.p),
    number(item.qValue),
    ...(audit ? [number(item.biasP), number(item.biasQValue)] : []),
    item.kept ? "yes" : "no",
    item.word ?? "not analysed",
    item.reason,
  ]);
  return [header, ...rows];
}

/**
 * One CSV field (RFC 4180: quoted when it holds a comma, quote or line break, quotes doubled).
 * Text that a spreadsheet would run as a formula (= + - @ first) gets a leading apostrophe:
 * OWASP, "CSV Injection".
 */
function csvField(value: string | number): string {
  if (typeof value === "number") return String(value);
  const safe = /^[=+\-@]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/** The ranked list as CSV text (comma-separated, decimal point, CRLF line ends as RFC 4180). */
export function rankedListCsv(list: RankedList): string {
  return `${rankedListGrid(list)
    .map((row) => row.map(csvField).join(","))
    .join("\r\n")}\r\n`;
}

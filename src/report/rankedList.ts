/**
 * The ranked list of a batch or an audit of many items, as the pane's table shows it and as
 * "Export ranked list" writes it: one row per item in the core's one ranking order
 * (batchRanking.ts), with the item's place in the input (to show it), its headline
 * (batchHeadline.ts), whether a false-discovery step keeps a finding of it, and the figures behind
 * the rank. Table, picker and export all read this list, so they always agree.
 */
import {
  rankedAuditItems,
  rankedRows,
  formatP,
  type AuditBatch,
  type AuditBatchItem,
  type BatchCheck,
  type BatchRow,
  type Headline,
  type VerdictWord,
} from "../core";
import { BADGES } from "./verdictBadge";

export interface RankedItem {
  /** 1 for the item to look at first. */
  readonly rank: number;
  /** The item's place among the series given (0-based), to show it. */
  readonly index: number;
  readonly label: string;
  readonly n: number;
  /** The p-value of the lag (or dependence) finding and its Benjamini–Hochberg q-value. */
  readonly p: number;
  readonly qValue: number;
  /** The bias check's p and q-value (NaN when it could not run). */
  readonly biasP: number;
  readonly biasQValue: number;
  /** Engle's LM p of the volatility check (NaN in an audit, or when it could not run). */
  readonly volatilityP: number;
  /** The false-discovery step keeps the lag structure, the bias, or both. */
  readonly keptLags: boolean;
  readonly keptBias: boolean;
  /** Either of the two: the item is above the cut-off line. */
  readonly kept: boolean;
  /** The headline's word and title ("clear, biased"); null when the item was not analysed. */
  readonly word: VerdictWord | null;
  readonly title: string;
  /** The headline's finding, or why the item could not be analysed. */
  readonly reason: string;
}

export interface RankedList {
  readonly kind: "batch" | "audit";
  readonly alpha: number;
  readonly items: readonly RankedItem[];
  /** How many items a false-discovery step keeps (they come first). */
  readonly keptCount: number;
}

function headlineParts(headline: Headline | null, why: string) {
  return {
    word: headline?.word ?? null,
    title: headline?.title ?? "not analysed",
    reason: headline?.finding ?? why,
  };
}

export function rankedBatch(batch: BatchCheck): RankedList {
  const place = new Map<BatchRow, number>(batch.rows.map((row, index) => [row, index]));
  const items = rankedRows(batch).map((row, i) => {
    const keptBias = row.headline?.biased === true;
    return {
      rank: i + 1,
      index: place.get(row) as number,
      label: row.label,
      n: row.n,
      p: row.p,
      qValue: row.qValue,
      biasP: row.biasP,
      biasQValue: row.biasQValue,
      volatilityP: row.volatilityP,
      keptLags: row.kept,
      keptBias,
      kept: row.kept || keptBias,
      ...headlineParts(row.headline, row.reason),
    };
  });
  return listOf("batch", batch.alpha, items);
}

export function rankedAudit(audit: AuditBatch): RankedList {
  const place = new Map<AuditBatchItem, number>(audit.items.map((item, index) => [item, index]));
  const items = rankedAuditItems(audit).map((item, i) => ({
    rank: i + 1,
    index: place.get(item) as number,
    label: item.label,
    n: item.audit?.n ?? 0,
    p: item.audit?.levels.jointP.p ?? NaN,
    qValue: item.dependenceQValue,
    biasP: item.audit?.bias.p ?? NaN,
    biasQValue: item.biasQValue,
    volatilityP: NaN,
    keptLags: item.kept,
    keptBias: item.biased,
    kept: item.kept || item.biased,
    ...headlineParts(item.headline, item.problem),
  }));
  return listOf("audit", audit.alpha, items);
}

function listOf(kind: RankedList["kind"], alpha: number, items: RankedItem[]): RankedList {
  return { kind, alpha, items, keptCount: items.filter((item) => item.kept).length };
}

/** What the false-discovery steps keep of an item, in a word or two ("" when nothing). */
export function keptWords(item: RankedItem): string {
  if (item.keptLags && item.keptBias) return "kept: lags, bias";
  if (item.keptLags) return "kept";
  return item.keptBias ? "kept: bias" : "";
}

/** A headline as the table shows it: shape and title, never colour alone. */
export function verdictCellText(item: { word: VerdictWord | null; title: string }): string {
  return item.word === null ? item.title : `${BADGES[item.word].shape}\u00a0${item.title}`;
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
    "bias p",
    "bias q-value",
    ...(audit ? [] : ["volatility p"]),
    `kept (q-value at most ${list.alpha})`,
    "verdict",
    "finding",
  ];
  const number = (x: number) => (Number.isNaN(x) ? "" : x);
  const rows = list.items.map((item) => [
    item.rank,
    item.label,
    item.n,
    number(item.p),
    number(item.qValue),
    number(item.biasP),
    number(item.biasQValue),
    ...(audit ? [] : [number(item.volatilityP)]),
    keptWords(item) === ""
      ? "no"
      : keptWords(item)
          .replace(/^kept: /, "")
          .replace(/^kept$/, "lags"),
    item.title,
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

/**
 * The ranked table of a batch or audit as CSV (RFC 4180: comma-separated, CRLF line ends, a field
 * holding a comma, a double quote or a line break enclosed in double quotes with its quotes
 * doubled), one row per item in ranked order, under a header of the JSON documents' names.
 * Numbers are written at full precision (the shortest round-trip form); an undefined figure is
 * an empty cell.
 *
 * A text cell that a spreadsheet would read as a formula — one starting with =, +, -, @, a tab or
 * a carriage return — gets a leading apostrophe, so opening the file never runs a name taken from
 * the input as a formula (common practice (no source): the usual guard against formula injection
 * in exported CSV). Numbers are written by Echolot, never taken from a cell as text, so a
 * negative figure stays a number.
 */
import type { AuditBatch, AuditBatchItem, BatchCheck, BatchRow, Headline } from "../core";
import {
  rankedAuditItems,
  rankedBatchRows,
  selectRanked,
  type Ranked,
  type RankedSelection,
} from "./batchOrder";

export type CsvCell = string | number | boolean | null;

const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell as RFC 4180 text, text guarded against being read as a formula. */
export function csvCell(cell: CsvCell): string {
  if (cell === null) return "";
  if (typeof cell === "number") return Number.isFinite(cell) ? String(cell) : "";
  if (typeof cell === "boolean") return cell ? "true" : "false";
  const text = FORMULA_START.test(cell) ? `'${cell}` : cell;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A header and rows as one RFC 4180 document (CRLF after every record, the last one too). */
export function csvText(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((row) => `${row.map(csvCell).join(",")}\r\n`).join("");
}

const BATCH_HEADER = [
  "rank",
  "label",
  "position",
  "n",
  "statistic",
  "df",
  "p",
  "pReference",
  "qValue",
  "kept",
  "mean",
  "biasP",
  "biasQValue",
  "biased",
  "reading",
  "word",
  "title",
  "finding",
];

/** The headline's word, title and finding; for an item not analysed, why. */
function headlineCells(headline: Headline | null, reason: string): CsvCell[] {
  return [headline?.word ?? null, headline?.title ?? null, headline?.finding ?? reason];
}

function batchRecord({ item: row, rank, index }: Ranked<BatchRow>): CsvCell[] {
  return [
    rank,
    row.label,
    index + 1,
    row.n,
    row.q,
    row.df,
    row.p,
    row.reference,
    row.qValue,
    row.kept,
    row.mean,
    row.biasP,
    row.biasQValue,
    row.headline?.biased ?? false,
    row.reading,
    ...headlineCells(row.headline, row.reason),
  ];
}

/** The batch's ranked table as CSV. */
export function batchCsv(batch: BatchCheck, selection: RankedSelection): string {
  return csvText(BATCH_HEADER, selectRanked(rankedBatchRows(batch), selection).map(batchRecord));
}

const AUDIT_HEADER = [
  "rank",
  "label",
  "position",
  "n",
  "biasMean",
  "biasSe",
  "biasT",
  "biasP",
  "biasQValue",
  "biased",
  "firstLag",
  "maxLag",
  "statistic",
  "df",
  "p",
  "pReference",
  "qValue",
  "kept",
  "word",
  "title",
  "finding",
];

function auditRecord({ item, rank, index }: Ranked<AuditBatchItem>): CsvCell[] {
  const audit = item.audit;
  if (audit === null) {
    const figures = Array<CsvCell>(AUDIT_HEADER.length - 7).fill(null);
    return [rank, item.label, index + 1, ...figures, false, ...headlineCells(null, item.problem)];
  }
  const { bias, dependenceTest } = audit;
  return [
    rank,
    item.label,
    index + 1,
    audit.n,
    bias.mean,
    bias.se,
    bias.tCorrected,
    bias.p,
    item.biasQValue,
    item.biased,
    dependenceTest.firstLag,
    audit.maxLag,
    dependenceTest.q,
    dependenceTest.df,
    audit.levels.jointP.p,
    audit.levels.jointP.reference,
    item.dependenceQValue,
    item.kept,
    ...headlineCells(item.headline, item.problem),
  ];
}

/** The audit's ranked table as CSV (statistic, df, p and qValue are the dependence test's). */
export function auditCsv(batch: AuditBatch, selection: RankedSelection): string {
  return csvText(AUDIT_HEADER, selectRanked(rankedAuditItems(batch), selection).map(auditRecord));
}

/**
 * The ranked table of a batch or audit as fixed-width text within 80 columns: a rank, the item's
 * name in whatever width the figures leave (a longer name is shortened with "…"; --csv and --json
 * carry it whole), then the figures. Shared by batchText and auditText.
 */
import { TEXT_WIDTH } from "./textWrap";
import type { Ranked } from "./batchOrder";

export interface TextColumn<T> {
  readonly header: string;
  /** Width of the cell; figures are right-aligned, words (`left`) left-aligned. */
  readonly width: number;
  readonly cell: (item: T) => string;
  readonly left?: boolean;
}

function fit<T>(column: TextColumn<T>, text: string): string {
  return column.left === true ? text.padEnd(column.width) : text.padStart(column.width);
}

/** The narrowest the name column gets, even when the figures leave less room. */
const LEAST_NAME = 6;

export interface RankedTableText {
  readonly lines: string[];
  /** Some name was shortened to fit. */
  readonly shortened: boolean;
}

/**
 * The header line(s) and one line per ranked item. `label` names the item; `group` is an optional
 * line above the header that labels groups of columns (it is given the offset of the figures).
 */
export function rankedTableText<T>(
  rows: readonly Ranked<T>[],
  label: (item: T) => string,
  columns: readonly TextColumn<T>[],
  group?: (figuresStart: number) => string,
): RankedTableText {
  const rankWidth = Math.max(3, String(rows.reduce((m, r) => Math.max(m, r.rank), 0)).length);
  const figures = columns.reduce((w, c) => w + 1 + c.width, 0);
  const room = Math.max(LEAST_NAME, TEXT_WIDTH - rankWidth - 1 - figures);
  const longest = rows.reduce((w, r) => Math.max(w, label(r.item).length), "series".length);
  const nameWidth = Math.min(longest, room);
  let shortened = false;
  const name = (text: string) => {
    if (text.length <= nameWidth) return text.padEnd(nameWidth);
    shortened = true;
    return `${text.slice(0, nameWidth - 1)}…`;
  };
  const lines: string[] = [];
  if (group !== undefined) lines.push(group(rankWidth + 1 + nameWidth));
  lines.push(
    [
      "#".padStart(rankWidth),
      "series".padEnd(nameWidth),
      ...columns.map((c) => fit(c, c.header)),
    ].join(" "),
  );
  for (const row of rows) {
    lines.push(
      [
        String(row.rank).padStart(rankWidth),
        name(label(row.item)),
        ...columns.map((c) => fit(c, c.cell(row.item))),
      ].join(" "),
    );
  }
  return { lines: lines.map((line) => line.trimEnd()), shortened };
}

/**
 * Where the line closing the kept rows goes (its index among `rows`), when the kept rows are
 * exactly the first ones shown and some dropped rows follow; -1 otherwise.
 */
export function keptCutLine(rows: readonly Ranked<unknown>[]): number {
  const firstDropped = rows.findIndex((r) => !r.kept);
  if (firstDropped <= 0) return -1;
  return rows.slice(firstDropped).some((r) => r.kept) ? -1 : firstDropped;
}

export function keptCutText(alpha: number): string {
  return `    ── above: kept after the false-discovery step (q-value ≤ ${alpha}) ──`;
}

/** `text` centred in `width` between rules: "──── bias ────". */
export function groupLabel(text: string, width: number): string {
  const left = Math.floor((width - text.length - 2) / 2);
  const right = width - text.length - 2 - left;
  return `${"─".repeat(left)} ${text} ${"─".repeat(right)}`;
}

/**
 * The line over a ranked table's figures: labelled groups of columns, each label centred in its
 * width, the first starting past the rank, the name and the n column (`nWidth` wide).
 */
export function groupHeader(
  nWidth: number,
  groups: readonly (readonly [label: string, width: number])[],
): (figuresStart: number) => string {
  const labels = groups.map(([label, width]) => groupLabel(label, width)).join(" ");
  return (start) => `${" ".repeat(start + 1 + nWidth + 1)}${labels}`;
}

/** Width of a left-aligned last column of words: its longest cell, one space before it. */
export function lastColumnWidth(cells: readonly string[], header: string): number {
  return cells.reduce((w, cell) => Math.max(w, Array.from(cell).length), header.length) + 1;
}

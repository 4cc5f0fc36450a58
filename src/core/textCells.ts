/**
 * How a cell given as text (a CSV field, pasted cells) is read, the same way by the CLI and the
 * standalone pane: empty, NA, N/A or #N/A (any case, surrounding spaces ignored) is a gap; a
 * number must be written plainly ("-1.5", "2e-3"): text such as "12abc", "Infinity" or "1,5"
 * is not a number, and the intake refuses it with its position.
 */
const GAP_WORDS = new Set(["", "NA", "N/A", "#N/A"]);
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export function isGapText(cell: string): boolean {
  return GAP_WORDS.has(cell.trim().toUpperCase());
}

export function isNumberText(cell: string): boolean {
  return NUMBER.test(cell.trim());
}

/**
 * A text cell as the intake takes it: null for a gap, a number for a plain number, else the text
 * itself (which the intake then refuses, naming its position).
 */
export function readTextCell(cell: string): number | string | null {
  if (isGapText(cell)) return null;
  return isNumberText(cell) ? Number(cell) : cell;
}

/** Whether a column of text cells holds a series: its first non-gap cell is a number. */
export function isNumberColumn(cells: Iterable<string>): boolean {
  for (const cell of cells) if (!isGapText(cell)) return isNumberText(cell);
  return false;
}

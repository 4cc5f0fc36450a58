/** A1 addresses of cells and ranges from 0-based rows and columns, for every report plan. */

/** Column letters of a 0-based column index: 0 → A, 25 → Z, 26 → AA. */
export function columnLetters(column: number): string {
  let n = column + 1;
  let letters = "";
  while (n > 0) {
    const rest = (n - 1) % 26;
    letters = String.fromCharCode(65 + rest) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

/** `C7`, or `$C$7` when `absolute`; rows and columns 0-based. */
export function cellAddress(row: number, column: number, absolute = false): string {
  const d = absolute ? "$" : "";
  return `${d}${columnLetters(column)}${d}${row + 1}`;
}

/** `B3:D9`: `rows` rows and `columns` columns from (row, column), relative. */
export function rangeAddress(row: number, column: number, rows: number, columns: number): string {
  return `${cellAddress(row, column)}:${cellAddress(row + rows - 1, column + columns - 1)}`;
}

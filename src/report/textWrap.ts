/**
 * Prose for the terminal within a fixed width (80 columns by default): words are moved to the next
 * line, which starts with `indent` (the first line with `first`); a single word longer than the
 * width stays whole on its line (a file path, say) rather than being cut.
 */
export const TEXT_WIDTH = 80;

export function wrapText(text: string, indent = "", first = "", width = TEXT_WIDTH): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/ +/)) {
    if (word === "") continue;
    const start = lines.length === 0 ? first : indent;
    if (line === "") line = `${start}${word}`;
    else if (line.length + 1 + word.length <= width) line += ` ${word}`;
    else {
      lines.push(line);
      line = `${indent}${word}`;
    }
  }
  if (line !== "" || lines.length === 0) lines.push(line);
  return lines;
}

/** Appends `more` to `lines` one by one (a spread into push overflows the stack on long lists). */
export function appendLines(lines: string[], more: readonly string[]): void {
  for (const line of more) lines.push(line);
}

/**
 * Escaping for text placed in SVG or HTML markup. Every text node and attribute value that the
 * report builders write goes through `escapeMarkup`, so a series label such as
 * `<img src=x onerror=alert(1)>` shows as the characters it is made of.
 */
const REPLACEMENTS: Readonly<Record<string, string>> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

/** Text safe inside an element or inside a double- or single-quoted attribute. */
export function escapeMarkup(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => REPLACEMENTS[ch] ?? ch);
}

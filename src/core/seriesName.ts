/**
 * How every view names a series, and what it says when the series has no label (its label is
 * "" unless its first cell or a header gave one: intake.ts). One place, so that a refusal, a
 * sentence, a heading and a table cell each name an unlabelled series the same way everywhere.
 */

/**
 * Where the name stands:
 * - `message`: in a refusal message — `the series "Sales"`, or `the series`;
 * - `prose`: in a sentence of the pane or a report — `“Sales”`, or `the series`;
 * - `heading`: a title at the start of a line — `Sales`, or `Series`;
 * - `cell`: a table cell, a chart title or a list entry — `Sales`, or `series`.
 */
export type SeriesNameUse = "message" | "prose" | "heading" | "cell";

/**
 * What stands in for a missing label when there is more than the use's plain word to say: the
 * series' place among many (0-based `column` of a file or block, or `item` of a list), or the
 * argument that holds it (`x` of a cross-correlation, which a message then names with its label:
 * `x ("Sales")`).
 */
export type SeriesStandIn =
  { readonly column: number } | { readonly item: number } | { readonly argument: string };

const PLAIN: Readonly<Record<SeriesNameUse, string>> = {
  message: "the series",
  prose: "the series",
  heading: "Series",
  cell: "series",
};

function standInText(standIn: SeriesStandIn): string {
  if ("column" in standIn) return `column ${standIn.column + 1}`;
  if ("item" in standIn) return `series ${standIn.item + 1}`;
  return standIn.argument;
}

/**
 * The name of a series with label `label` where it is used; without a label, the stand-in (if
 * given) or the use's plain word.
 *
 * @example
 * seriesName("Sales"); // → 'the series "Sales"'
 * seriesName(""); // → "the series"
 * seriesName("", "heading"); // → "Series"
 * seriesName("", "cell", { item: 2 }); // → "series 3"
 * seriesName("Sales", "message", { argument: "x" }); // → 'x ("Sales")'
 */
export function seriesName(
  label: string,
  use: SeriesNameUse = "message",
  standIn?: SeriesStandIn,
): string {
  if (label === "") return standIn === undefined ? PLAIN[use] : standInText(standIn);
  if (standIn !== undefined && "argument" in standIn && use === "message") {
    return `${standIn.argument} ("${label}")`;
  }
  if (use === "message") return `the series "${label}"`;
  if (use === "prose") return `“${label}”`;
  return label;
}

/**
 * The body of the batch and audit text views, below their heading: the ranked table with a line
 * closing the rows kept after the false-discovery step, which rows are shown, the raw and
 * false-discovery counts, the reasons (each shown item that is not plainly clear, behind
 * `--reasons`: its headline and finding),
 * the items that could not be analysed, and the screening caution — all within 80 columns.
 */
import type { Headline } from "../core";
import { selectionNote, type Ranked, type RankedSelection } from "./batchOrder";
import { keptCutLine, keptCutText, type RankedTableText } from "./rankedTable";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";
import { appendLines, wrapText } from "./textWrap";

/**
 * The headline as a table cell: shape, word, "(robust)" when the robust reading gave the word,
 * ", biased" when the bias is kept; "— see below" for an item not analysed.
 */
export function headlineCell(headline: Headline | null): string {
  if (headline === null) return "— see below";
  const robust = headline.switched ? " (robust)" : "";
  const biased = headline.biased ? ", biased" : "";
  return `${BADGES[headline.word].shape} ${headline.word}${robust}${biased}`;
}

export interface ReasonItem {
  readonly rank: number;
  readonly label: string;
  /** null: the item could not be analysed (it is listed apart, with why). */
  readonly headline: Headline | null;
  readonly reason: string;
}

export interface RankedBody {
  readonly alpha: number;
  readonly all: readonly Ranked<unknown>[];
  readonly shown: readonly Ranked<unknown>[];
  readonly selection: RankedSelection;
  readonly table: RankedTableText;
  /** Lines of the table above its first row (the header, and a group line if any). */
  readonly headerLines: number;
  /** The sentences with the raw and false-discovery counts. */
  readonly counts: readonly string[];
  /** The reason of each shown item, in the order shown. */
  readonly reasons: readonly ReasonItem[];
  /** Print the reasons (`--reasons`); otherwise say how many there are. */
  readonly showReasons: boolean;
  /** A clear item has a reason worth reading too (the audit's expected lags beyond one step). */
  readonly includeClear: boolean;
  /** One line per item, or column of the input, that could not be analysed. */
  readonly notAnalysed: readonly string[];
}

/**
 * The lines for the items a ranked text could not check: "`word`: label: reason" for each item
 * whose `reasonIfLeftOut` is not null, in rank order, then the caller's own (columns left out).
 */
export function leftOutLines<T>(
  all: readonly Ranked<T>[],
  word: string,
  reasonIfLeftOut: (item: T) => { label: string; reason: string } | null,
  more: readonly string[] = [],
): string[] {
  const lines: string[] = [];
  for (const { item } of all) {
    const left = reasonIfLeftOut(item);
    if (left !== null) lines.push(`${word}: ${left.label}: ${left.reason}`);
  }
  return [...lines, ...more];
}

export function rankedBodyLines(body: RankedBody): string[] {
  const lines: string[] = [];
  const cut = keptCutLine(body.shown);
  body.table.lines.forEach((line, i) => {
    if (cut >= 0 && i === cut + body.headerLines) lines.push(keptCutText(body.alpha));
    lines.push(line);
  });
  lines.push("");
  const note = selectionNote(body.shown.length, body.all.length, body.selection);
  if (note !== "") appendLines(lines, wrapText(note));
  for (const sentence of body.counts) appendLines(lines, wrapText(sentence));
  if (body.table.shortened) {
    appendLines(
      lines,
      wrapText("Long names are shortened with …; --csv and --json give them whole."),
    );
  }
  const worth = body.reasons.filter(
    (r) =>
      r.headline !== null &&
      (body.includeClear || r.headline.word !== "clear" || r.headline.biased),
  );
  if (worth.length > 0) lines.push("");
  if (body.showReasons) {
    for (const item of worth) {
      const { headline } = item;
      if (headline === null) continue;
      lines.push(
        `${String(item.rank).padStart(3)} ${item.label}: ${BADGES[headline.word].shape} ${headline.title}`,
      );
      appendLines(lines, wrapText(item.reason, "    ", "    "));
    }
  } else if (worth.length > 0) {
    const rows = worth.length === 1 ? "1 shown row" : `${worth.length} shown rows`;
    appendLines(lines, wrapText(`The reasons of ${rows}: add --reasons.`));
  }
  if (body.notAnalysed.length > 0) {
    lines.push("");
    for (const line of body.notAnalysed) appendLines(lines, wrapText(line, "    "));
  }
  lines.push("");
  appendLines(lines, wrapText(SCREENING_CAUTION));
  return lines;
}

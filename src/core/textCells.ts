/**
 * How a cell given as text (a CSV field, pasted cells) is read, the same way by the CLI, the
 * standalone pane and the demo builder:
 *
 * - empty, NA, N/A or #N/A (any case, surrounding spaces ignored) is a gap, and so is any extra
 *   gap word the reader was given (the CLI's `--na WORD`, say `nan`);
 * - a number is written plainly ("-1.5", "2e-3"), with a decimal point or — when the file uses
 *   one — a decimal comma ("-1,5"); a percent cell ("1.5%") is a number (0.015) only when percent
 *   cells were allowed;
 * - anything else ("12abc", "Infinity", "$1.50", "1,234.5", "#DIV/0!") is text, which a series
 *   column refuses with its position and a hint (`textCellHint`), never reads as a guess.
 */

export interface CellRules {
  /** The decimal mark of the file: "." (default) or ",". */
  readonly decimal?: "." | ",";
  /** Whether "1.5%" reads as 0.015 (otherwise it is refused, with that hint). */
  readonly percent?: boolean;
  /** Further words read as gaps, compared without case and surrounding spaces. */
  readonly gapWords?: readonly string[];
}

const GAP_WORDS = ["", "NA", "N/A", "#N/A"];
const POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;

/** The gap words of a reader, upper-cased once. */
export function gapWordSet(rules: CellRules = {}): ReadonlySet<string> {
  const words = new Set(GAP_WORDS);
  for (const word of rules.gapWords ?? []) words.add(word.trim().toUpperCase());
  return words;
}

/**
 * A reader of text cells under fixed rules, made once per table so each cell costs one regular
 * expression test: `read(cell)` is NaN for a gap, the number for a number, or `undefined` for
 * text the intake must refuse.
 */
export interface CellReader {
  readonly rules: CellRules;
  read(cell: string): number | undefined;
  isGap(cell: string): boolean;
}

export function cellReader(rules: CellRules = {}): CellReader {
  const gaps = gapWordSet(rules);
  const comma = rules.decimal === ",";
  const pattern = comma ? COMMA_NUMBER : POINT_NUMBER;
  const percent = rules.percent === true;
  const isGap = (cell: string) => gaps.has(cell.trim().toUpperCase());
  const plain = (text: string): number | undefined => {
    if (!pattern.test(text)) return undefined;
    return Number(comma ? text.replace(",", ".") : text);
  };
  return {
    rules,
    isGap,
    read(cell: string): number | undefined {
      const text = cell.trim();
      const value = plain(text);
      if (value !== undefined) return value;
      if (gaps.has(text.toUpperCase())) return NaN;
      if (percent && text.endsWith("%")) {
        const share = plain(text.slice(0, -1).trimEnd());
        if (share !== undefined) return share / 100;
      }
      return undefined;
    },
  };
}

const PLAIN = cellReader();

export function isGapText(cell: string): boolean {
  return PLAIN.isGap(cell);
}

export function isNumberText(cell: string): boolean {
  return POINT_NUMBER.test(cell.trim());
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

/** How the reader's options are spelled where the hint is shown (CLI flags, pane wording). */
export interface OptionWords {
  /** Allowing percent cells, e.g. "give --percent". */
  readonly percent: string;
  /** Adding a gap word, e.g. (w) => `give --na ${w}`. */
  readonly gapWord: (word: string) => string;
  /** Reading a decimal comma, e.g. "give --decimal ,". */
  readonly decimalComma: string;
  /** Reading the first row as data, e.g. "give --no-header". */
  readonly noHeader: string;
}

const SPREADSHEET_ERROR = /^#(DIV\/0!|VALUE!|REF!|NAME\?|NUM!|NULL!|SPILL!|CALC!|GETTING_DATA)$/i;
const MISSING_WORDS = /^(nan|null|none|nil|missing|-+|\.|n\.a\.|na\.|\?)$/i;

/**
 * Whether refused text looks like a number or a missing value in some other spelling (a percent,
 * a currency, thousands separators, "nan", "-", a spreadsheet error): such text in a column marks
 * the column as a series with a bad cell, not as a column of names.
 */
export function looksNumeric(cell: string): boolean {
  const text = cell.trim();
  return /\d/.test(text) || MISSING_WORDS.test(text) || SPREADSHEET_ERROR.test(text);
}

/** What to do about a refused text cell, in the words of the place that shows it. */
export function textCellHint(cell: string, rules: CellRules, words: OptionWords): string {
  const text = cell.trim();
  const comma = rules.decimal === ",";
  if (/^[+-]?[\d.,]+\s*%$/.test(text)) {
    return rules.percent === true
      ? "write the percentage as a plain number"
      : `percent cells are read only on request: ${words.percent} to read "1.5%" as 0.015`;
  }
  if (SPREADSHEET_ERROR.test(text)) {
    return "it is a spreadsheet error: fix the formula behind it, or leave the cell empty for a gap";
  }
  if (MISSING_WORDS.test(text)) {
    return `if it marks a missing value, ${words.gapWord(text)} to read it as a gap`;
  }
  if (/^[+-]?\s*[$€£¥]|[$€£¥]\s*$/.test(text)) {
    return "currency signs are not read: export the column as plain numbers";
  }
  if (!comma && /^[+-]?\d+,\d+$/.test(text)) {
    return `it has a decimal comma: ${words.decimalComma} if the file uses one`;
  }
  if (/^[+-]?\d{1,3}([,. '’]\d{3})+([.,]\d+)?$/.test(text)) {
    return "thousands separators are not read: export the column without them";
  }
  if (/^[+-]?(inf|infinity)$/i.test(text)) return "only finite numbers are read";
  return "write a number, or leave the cell empty or NA for a gap";
}

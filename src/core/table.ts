/**
 * The table reader: records of text fields (from any CSV parser, in file order, each with the
 * file line it starts on) → columns of numbers, one pass, in bounded memory. The CLI feeds it from
 * a stream, the standalone pane and the demo builder from text; all three read a file the same
 * way.
 *
 * - The first record is the header row unless the reader is told there is none; a header row
 *   that holds only numbers is refused with the hint to say so (it is data, and reading it as
 *   names would lose the first value).
 * - An empty line is a row of gaps: in a one-column file that is how a blank cell is saved, and
 *   skipping it would shift every later lag. A record of another width is refused, naming its
 *   line.
 * - Each cell is read by the text-cell rules (textCells.ts); a kept column holds its values in a
 *   growable Float64Array (NaN at gaps and at refused cells), never an array of row objects, so
 *   a column costs 8 bytes a row. What each column looks like (numbers, text, dates, ids) is
 *   tracked as the rows pass, so the choice of column needs no second pass.
 * - Messages name the file's own line numbers, header included.
 */
import { looksLikeDate, SERIAL_DATE_RANGE, yyyymmddDay } from "./dates";
import { invalid } from "./errors";
import { GrowableNumbers } from "./growable";
import { seriesName } from "./seriesName";
import {
  cellReader,
  looksNumeric,
  textCellHint,
  type CellRules,
  type OptionWords,
} from "./textCells";

export interface TableOptions {
  /** How the file is named in messages. */
  readonly origin: string;
  /** true: the first record holds the column names; false: it is data; "auto": names if any cell of it is text. */
  readonly header?: boolean | "auto";
  readonly cells?: CellRules;
  /** How the reader's options are spelled in hints. */
  readonly words: OptionWords;
  /** Which columns keep their values (default all); the others are only described. */
  readonly keep?: (index: number, name: string) => boolean;
  /** About how many rows to expect (from the file size), so kept columns rarely grow. */
  readonly expectedRows?: number;
}

/** The first refused cell of a column. */
export interface Offender {
  readonly line: number;
  readonly text: string;
}

/** What a column looks like, for choosing which columns are series. */
export type ColumnLook =
  "series" | "empty" | "text" | "dates" | "yyyymmdd" | "serial dates" | "counter";

export interface TableColumn {
  /** 0-based position in the record. */
  readonly index: number;
  readonly name: string;
  /** The values (NaN at gaps and refused cells), or null when the column was not kept. */
  readonly values: Float64Array | null;
  readonly numbers: number;
  /** Text cells that look like a number or a missing value in another spelling. */
  readonly numericTexts: number;
  /** Other text cells (names, dates). */
  readonly texts: number;
  readonly look: ColumnLook;
  /** The first cell refused as a value (text or a non-finite number). */
  readonly offender: Offender | undefined;
  /** Up to three of the first non-gap cells, as written, for messages. */
  readonly examples: readonly string[];
}

export interface Table {
  readonly origin: string;
  readonly hasHeader: boolean;
  readonly columns: readonly TableColumn[];
  /** Data rows read (empty lines included). */
  readonly rows: number;
  /** The file line of data row `row` (0-based). */
  lineOf(row: number): number;
  /** How a refused cell is explained, in the reader's words. */
  hint(text: string): string;
}

/** Running description of one column, updated cell by cell. */
class ColumnTally {
  readonly values: GrowableNumbers | null;
  numbers = 0;
  numericTexts = 0;
  texts = 0;
  dates = 0;
  offender: Offender | undefined;
  readonly examples: string[] = [];
  private integers = true;
  private rising = true;
  private falling = true;
  private neverFalls = true;
  private yyyymmdd = true;
  private serial = true;
  private previous = NaN;

  constructor(
    readonly index: number,
    readonly name: string,
    keep: boolean,
    capacity: number | undefined,
  ) {
    this.values = keep ? new GrowableNumbers(capacity) : null;
  }

  number(value: number, text: string, line: number): void {
    if (!Number.isFinite(value)) {
      this.refused(text, line, true);
      return;
    }
    this.values?.push(value);
    this.numbers++;
    if (this.examples.length < 3) this.examples.push(text.trim());
    if (!Number.isInteger(value)) {
      this.integers = false;
      return;
    }
    if (this.yyyymmdd && yyyymmddDay(value) === undefined) this.yyyymmdd = false;
    if (this.serial && !(value >= SERIAL_DATE_RANGE[0] && value <= SERIAL_DATE_RANGE[1])) {
      this.serial = false;
    }
    if (!Number.isNaN(this.previous)) {
      if (!(value > this.previous)) this.rising = false;
      if (!(value < this.previous)) this.falling = false;
      if (value < this.previous) this.neverFalls = false;
    }
    this.previous = value;
  }

  gap(): void {
    this.values?.push(NaN);
  }

  refused(text: string, line: number, numeric: boolean): void {
    this.values?.push(NaN);
    this.offender ??= { line, text };
    if (this.examples.length < 3) this.examples.push(text.trim());
    if (!numeric && looksLikeDate(text)) {
      this.texts++;
      this.dates++;
    } else if (numeric || looksNumeric(text)) this.numericTexts++;
    else this.texts++;
  }

  finish(): TableColumn {
    return {
      index: this.index,
      name: this.name,
      values: this.values === null ? null : this.values.view(),
      numbers: this.numbers,
      numericTexts: this.numericTexts,
      texts: this.texts,
      look: this.look(),
      offender: this.offender,
      examples: this.examples,
    };
  }

  private look(): ColumnLook {
    if (this.numbers + this.numericTexts + this.texts === 0) return "empty";
    if (this.numbers + this.numericTexts <= this.texts) {
      return this.dates === this.texts && this.numbers + this.numericTexts === 0 ? "dates" : "text";
    }
    if (this.numericTexts > 0 || this.texts > 0 || !this.integers) return "series";
    if (this.yyyymmdd) return "yyyymmdd";
    if (this.serial && this.neverFalls) return "serial dates";
    if (this.numbers >= 3 && (this.rising || this.falling)) return "counter";
    return "series";
  }
}

/** Builds a table from records pushed one at a time. */
export class TableBuilder {
  private readonly reader;
  private readonly header: boolean | "auto";
  private tallies: ColumnTally[] | undefined;
  private width = 0;
  private hasHeader = false;
  private firstDataLine = 0;
  private firstLine = 0;
  private lastLine = 0;
  private rows = 0;
  /** Rows whose line is not the previous row's line + 1 (after a quoted line break): [row, line]. */
  private readonly jumps: number[] = [];

  constructor(private readonly options: TableOptions) {
    this.reader = cellReader(options.cells ?? {});
    this.header = options.header ?? true;
  }

  push(record: readonly string[], line: number): void {
    if (this.tallies === undefined) {
      this.start(record, line);
      if (this.hasHeader) return;
    }
    const tallies = this.tallies as ColumnTally[];
    if (
      record.length !== this.width &&
      !(record.length === 1 && (record[0] as string).trim() === "")
    ) {
      invalid(
        `line ${line} of ${this.options.origin} has ${record.length} field${record.length === 1 ? "" : "s"} where line ${this.firstLine} has ${this.width}: every line needs the same number of fields (an empty line is read as a row of gaps)`,
      );
    }
    if (this.rows === 0) this.firstDataLine = line;
    else if (line !== this.lastLine + 1) this.jumps.push(this.rows, line);
    this.lastLine = line;
    this.rows++;
    const blank = record.length !== this.width;
    for (let c = 0; c < this.width; c++) {
      const tally = tallies[c] as ColumnTally;
      const text = blank ? "" : (record[c] as string);
      const value = this.reader.read(text);
      if (value === undefined) tally.refused(text, line, false);
      else if (Number.isNaN(value)) tally.gap();
      else tally.number(value, text, line);
    }
  }

  private start(record: readonly string[], line: number): void {
    const isData = (c: string) => this.reader.read(c) !== undefined;
    const numbersOnly = record.every(isData) && record.some((c) => !this.reader.isGap(c));
    if (this.header === true && numbersOnly) {
      const shown = record
        .slice(0, 3)
        .map((c) => c.trim())
        .join(", ");
      invalid(
        `line ${line} of ${this.options.origin} holds only numbers (${shown}${record.length > 3 ? ", …" : ""}), not column names: ${this.options.words.noHeader} if the file has no header row`,
      );
    }
    this.hasHeader = this.header === true || (this.header === "auto" && !numbersOnly);
    this.width = record.length;
    this.firstLine = line;
    this.firstDataLine = this.hasHeader ? line + 1 : line;
    const keep = this.options.keep ?? (() => true);
    this.tallies = record.map((cell, c) => {
      const name = this.hasHeader ? cell.trim() : "";
      return new ColumnTally(
        c,
        seriesName(name, "cell", { column: c }),
        keep(c, name),
        this.options.expectedRows,
      );
    });
  }

  lineOf(row: number): number {
    let base = 0;
    let baseLine = this.firstDataLine;
    for (let j = 0; j < this.jumps.length && (this.jumps[j] as number) <= row; j += 2) {
      base = this.jumps[j] as number;
      baseLine = this.jumps[j + 1] as number;
    }
    return baseLine + (row - base);
  }

  finish(): Table {
    if (this.tallies === undefined) {
      invalid(`${this.options.origin} is empty: the first line must hold the column names`);
    }
    const { origin, cells = {}, words } = this.options;
    return {
      origin,
      hasHeader: this.hasHeader,
      columns: this.tallies.map((t) => t.finish()),
      rows: this.rows,
      lineOf: (row) => this.lineOf(row),
      hint: (text) => textCellHint(text, cells, words),
    };
  }
}

/** How a column is named in messages: `column 3 ("resid")`. */
export function columnPlace(table: Table, column: TableColumn): string {
  return table.hasHeader
    ? `column ${column.index + 1} ("${column.name}")`
    : `column ${column.index + 1}`;
}

/** The refusal of a column's first bad cell: line, column, the cell, and what to do. */
export function offenderMessage(table: Table, column: TableColumn, offender: Offender): string {
  return cellRefusal(
    `line ${offender.line}, ${columnPlace(table, column)} of ${table.origin}`,
    offender.text,
    table.hint,
  );
}

/** "WHERE holds "nan", which is not a number: HINT" (or "…not a finite number" for 1e999). */
export function cellRefusal(where: string, cell: string, hint: (text: string) => string): string {
  const text = cell.trim();
  const shown = text.length > 24 ? `${text.slice(0, 24)}…` : text;
  if (/^[+-]?(\d+[.,]?\d*|[.,]\d+)([eE][+-]?\d+)?$/.test(text)) {
    return `${where} holds ${shown}, which is not a finite number`;
  }
  return `${where} holds "${shown}", which is not a number: ${hint(text)}`;
}

/**
 * How many lines a record spans beyond its first: the line breaks inside its quoted fields. A
 * parser that yields every line as a record (empty lines too) then gives each record's first line
 * as 1 + the lines of the records before it.
 */
export function extraLines(record: readonly string[]): number {
  let breaks = 0;
  for (const field of record) {
    if (field.length > 0 && (field.includes("\n") || field.includes("\r"))) {
      breaks += field.split(/\r\n|\n|\r/).length - 1;
    }
  }
  return breaks;
}

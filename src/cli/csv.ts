/**
 * Files in for the CLI: a path or `-` (standard input), streamed through the maintained CSV
 * parser (csv-parse) into the core's table reader, so a file of any size is read in one pass and
 * only the numbers kept stay in memory.
 *
 * - Encoding: UTF-8 with or without a byte-order mark, UTF-16 (little or big endian) with one.
 * - Dialect: delimiter and decimal mark from `--delimiter`/`--decimal`, else found from the
 *   first lines (tableDialect.ts).
 * - Lines: an empty line is a record (a row of gaps); each record's first line is counted from
 *   the line breaks before it, so messages name the file's own line numbers.
 */
import { createReadStream, statSync } from "node:fs";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { parse } from "csv-parse";
import {
  csvParseOptions,
  delimiterName,
  extraLines,
  detectDialect,
  invalid,
  TableBuilder,
  type CellRules,
  type Dialect,
  type DialectChoice,
  type OptionWords,
  type Table,
} from "../core";
import { UsageError } from "./errors";
import { progressLine } from "./progress";
import { decimalOption, delimiterOption, gapWordsOption, type OptionValues } from "./options";

/** How a file is to be read, from the command line. */
export interface Reading {
  /** A path, or "-" for standard input. */
  readonly file: string;
  /** How the file is named in messages. */
  readonly origin: string;
  readonly header: boolean;
  readonly dialect: DialectChoice;
  readonly percent: boolean;
  readonly gapWords: readonly string[];
  /** Also hands every record, as read, to this sink (the workbook keeps the file's cells). */
  readonly tap?: (dialect: Dialect) => RecordSink;
}

/** How the reader's options are spelled in hints on the command line. */
export const CLI_WORDS: OptionWords = {
  percent: "give --percent",
  gapWord: (word) => `give --na ${/^-/.test(word) ? `=${word}` : word}`,
  decimalComma: "give --decimal ,",
  noHeader: "give --no-header",
};

export function readingFrom(file: string, values: OptionValues): Reading {
  return {
    file,
    origin: file === "-" ? "standard input" : file,
    header: values["no-header"] !== true,
    dialect: { delimiter: delimiterOption(values), decimal: decimalOption(values) },
    percent: values.percent === true,
    gapWords: gapWordsOption(values),
  };
}

const SAMPLE_BYTES = 64 * 1024;

type Encoding = "utf-8" | "utf-16le" | "utf-16be";

function encodingOf(head: Buffer, origin: string): Encoding {
  if (head[0] === 0xff && head[1] === 0xfe) return "utf-16le";
  if (head[0] === 0xfe && head[1] === 0xff) return "utf-16be";
  const probe = head.subarray(0, 4096);
  if (probe.length >= 2 && probe.includes(0)) {
    invalid(
      `${origin} holds zero bytes, as UTF-16 text without a byte-order mark does: save it as UTF-8, or as UTF-16 with a byte-order mark`,
    );
  }
  return "utf-8";
}

/**
 * About how many lines a file has, from its size and the line length at its start, so kept
 * columns are allocated once at about their final size instead of growing (growing holds the old
 * and the new buffer at once). Undefined for standard input, whose size is not known.
 */
function expectedRows(reading: Reading, start: Buffer, ended: boolean): number | undefined {
  let lines = 0;
  for (let i = start.indexOf(10); i >= 0; i = start.indexOf(10, i + 1)) lines++;
  if (ended) return lines + 1;
  if (reading.file === "-" || lines === 0) return undefined;
  const size = statSync(reading.file).size;
  return Math.ceil((size / start.length) * lines * 1.02) + 16;
}

function openSource(reading: Reading): AsyncIterable<Buffer> {
  if (reading.file === "-") return process.stdin;
  return createReadStream(reading.file, { highWaterMark: SAMPLE_BYTES });
}

function readError(error: unknown, reading: Reading): never {
  const code = (error as NodeJS.ErrnoException).code;
  const file = reading.origin;
  if (code === "ENOENT") throw new UsageError(`cannot read ${file}: no such file; check the path`);
  if (code === "EISDIR") throw new UsageError(`cannot read ${file}: it is a folder, not a file`);
  if (code === "EACCES") throw new UsageError(`cannot read ${file}: permission denied`);
  throw new UsageError(`cannot read ${file}: ${(error as Error).message}`);
}

/** Takes records, each with the file line it starts on. */
export type RecordSink = (record: readonly string[], line: number) => void;

/**
 * Streams the records of a file to the sink that `open` makes once the dialect is known, and
 * returns that dialect.
 */
export async function streamRecords(
  reading: Reading,
  open: (dialect: Dialect, expectedRows: number | undefined) => RecordSink,
): Promise<Dialect> {
  const chunks = openSource(reading)[Symbol.asyncIterator]();
  // The start of the file: enough bytes to know its encoding and dialect.
  const head: Buffer[] = [];
  let headBytes = 0;
  let ended = false;
  try {
    while (headBytes < SAMPLE_BYTES) {
      const next = await chunks.next();
      if (next.done === true) {
        ended = true;
        break;
      }
      head.push(next.value);
      headBytes += next.value.length;
    }
  } catch (error) {
    readError(error, reading);
  }
  const start = Buffer.concat(head);
  const encoding = encodingOf(start, reading.origin);
  const decoder = new TextDecoder(encoding);
  const sample = new TextDecoder(encoding).decode(start, { stream: !ended });
  const dialect = detectDialect(sample, ended, reading.dialect);
  const opened = open(dialect, expectedRows(reading, start, ended));
  const tap = reading.tap?.(dialect);
  const sink: RecordSink =
    tap === undefined
      ? opened
      : (record, line) => {
          tap(record, line);
          opened(record, line);
        };

  // UTF-8 goes to the parser as it is (the parser drops its byte-order mark); UTF-16 is decoded
  // and handed over as UTF-8.
  const asUtf8 = (chunk: Buffer, last: boolean): Buffer =>
    encoding === "utf-8" ? chunk : Buffer.from(decoder.decode(chunk, { stream: !last }), "utf8");
  async function* bytes(): AsyncGenerator<Buffer> {
    yield asUtf8(start, ended);
    if (ended) return;
    for (;;) {
      let next: IteratorResult<Buffer>;
      try {
        next = await chunks.next();
      } catch (error) {
        readError(error, reading);
      }
      if (next.done === true) break;
      yield asUtf8(next.value, false);
    }
    if (encoding !== "utf-8") yield Buffer.from(decoder.decode(), "utf8");
  }

  const parser = parse(csvParseOptions(dialect));
  const feeding = pipeline(Readable.from(bytes()), parser);
  let line = 1;
  const progress = progressLine();
  try {
    for await (const record of parser as AsyncIterable<string[]>) {
      sink(record, line);
      line += 1 + extraLines(record);
      if ((line & 0xfffff) === 0) {
        progress.show(`reading ${reading.origin}: line ${line.toLocaleString("en")}`);
      }
    }
    await feeding;
    progress.done();
  } catch (error) {
    feeding.catch(() => undefined);
    if (error instanceof UsageError || (error as { name?: string }).name === "EcholotError") {
      throw error;
    }
    if ((error as { code?: string }).code?.startsWith("CSV_") === true) {
      invalid(
        `${reading.origin} is not well-formed ${delimiterName(dialect.delimiter)}-separated text: ${(error as Error).message}`,
      );
    }
    throw error;
  }
  return dialect;
}

/** The rules of the file's cells: its decimal mark, percent cells, gap words. */
export function cellRulesOf(reading: Reading, dialect: Dialect): CellRules {
  return { decimal: dialect.decimal, percent: reading.percent, gapWords: reading.gapWords };
}

/**
 * Reads a file into a table. `keep` says which columns keep their values (by 0-based index and
 * header name); the others are only described.
 */
export async function readTable(
  reading: Reading,
  keep?: (index: number, name: string) => boolean,
): Promise<Table> {
  let builder: TableBuilder | undefined;
  await streamRecords(reading, (dialect, expectedRows) => {
    builder = new TableBuilder({
      origin: reading.origin,
      header: reading.header,
      cells: cellRulesOf(reading, dialect),
      words: CLI_WORDS,
      ...(keep === undefined ? {} : { keep }),
      ...(expectedRows === undefined ? {} : { expectedRows }),
    });
    return (record, line) => (builder as TableBuilder).push(record, line);
  });
  return (builder as unknown as TableBuilder).finish();
}

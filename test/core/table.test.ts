import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import {
  cellReader,
  columnSeries,
  csvParseOptions,
  dayNumber,
  detectDialect,
  extraLines,
  firstSeriesColumn,
  isoDate,
  seriesColumnsOf,
  TableBuilder,
  type Table,
} from "../../src/core";
import { CLI_LIKE_WORDS } from "../helpers/words";

/** A table from text, read as the CLI and the pane read it (dialect, parser options, lines). */
function tableOf(text: string, header: boolean | "auto" = true, percent = false): Table {
  const dialect = detectDialect(text, true);
  const builder = new TableBuilder({
    origin: "t.csv",
    header,
    cells: { decimal: dialect.decimal, percent },
    words: CLI_LIKE_WORDS,
  });
  let line = 1;
  for (const record of parse(text, csvParseOptions(dialect)) as string[][]) {
    builder.push(record, line);
    line += 1 + extraLines(record);
  }
  return builder.finish();
}

describe("TableBuilder(one-column file)", () => {
  it("reads an empty line as a gap, so later lags do not shift", () => {
    const table = tableOf("x\n1\n2\n\n4\n5\n3\n");
    const series = columnSeries(table, table.columns[0]!);
    expect(series.count).toBe(5);
    expect(series.gaps).toBe(1);
    expect(Array.from(series.present)).toEqual([1, 1, 0, 1, 1, 1]);
  });

  it("names the file's own line of a bad cell after empty lines and a quoted line break", () => {
    const table = tableOf('note,y\n"a\nb",1\n\n"c",3\n"d",oops\n"e",7\n');
    const y = table.columns[1]!;
    expect(y.offender).toEqual({ line: 6, text: "oops" });
    expect(table.lineOf(0)).toBe(2);
    expect(table.lineOf(1)).toBe(4);
    expect(table.lineOf(3)).toBe(6);
  });

  it("refuses a line of another width, naming it", () => {
    expect(() => tableOf("a,b\n1,2\n3\n")).toThrow(
      /line 3 of t\.csv has 1 field where line 1 has 2/,
    );
  });

  it("refuses a header row of numbers with the --no-header hint, and reads it as data when told", () => {
    expect(() => tableOf("0.5\n1.5\n2\n")).toThrow(
      /line 1 of t\.csv holds only numbers \(0\.5\), not column names: give --no-header/,
    );
    const table = tableOf("0.5\n1.5\n2\n", false);
    expect(table.hasHeader).toBe(false);
    expect(columnSeries(table, table.columns[0]!).count).toBe(3);
  });

  it("takes a text first row as names under header 'auto' and numbers as data", () => {
    expect(tableOf("a\n1\n2\n", "auto").hasHeader).toBe(true);
    expect(tableOf("1\n2\n3\n", "auto").hasHeader).toBe(false);
  });
});

describe("detectDialect(sample)", () => {
  it("finds comma, semicolon and tab files", () => {
    expect(detectDialect("a,b\n1.5,2\n", true)).toEqual({ delimiter: ",", decimal: "." });
    expect(detectDialect("a;b\n1,5;2\n-0,25;3\n", true)).toEqual({ delimiter: ";", decimal: "," });
    expect(detectDialect("a\tb\n1.5\t2\n", true)).toEqual({ delimiter: "\t", decimal: "." });
  });

  it("reads a one-column file with decimal commas as one column", () => {
    expect(detectDialect("value\n1,5\n-2,25\n", true)).toEqual({ delimiter: "\t", decimal: "," });
  });

  it("reads one decimal-comma number a line, without a header, as one column", () => {
    // The pane's paste of cells copied in a decimal-comma locale (issue 14).
    expect(detectDialect("-0,272644\n0,1\n12,5\n", true)).toEqual({
      delimiter: "\t",
      decimal: ",",
    });
    // A negative second field, a header or a single line keeps the comma as delimiter.
    expect(detectDialect("3,-5\n4,7\n", true).delimiter).toBe(",");
    expect(detectDialect("a,b\n3,5\n4,7\n", true).delimiter).toBe(",");
    expect(detectDialect("3,5\n", true).delimiter).toBe(",");
  });

  it("lets the user's choice win, and refuses the comma as both delimiter and decimal mark", () => {
    expect(detectDialect("a,b\n1,2\n", true, { delimiter: ";" }).delimiter).toBe(";");
    expect(() => detectDialect("a\n1\n", true, { delimiter: ",", decimal: "," })).toThrow(
      /both the delimiter and the decimal mark/,
    );
  });
});

describe("cellReader(rules)", () => {
  it("reads decimal commas, percent cells on request, and extra gap words", () => {
    expect(cellReader({ decimal: "," }).read(" -1,5 ")).toBe(-1.5);
    expect(cellReader({ decimal: "," }).read("1.5")).toBeUndefined();
    expect(cellReader({ percent: true }).read("1.5%")).toBeCloseTo(0.015, 15);
    expect(cellReader().read("1.5%")).toBeUndefined();
    expect(cellReader({ gapWords: ["nan"] }).read("NaN")).toBeNaN();
    expect(cellReader().read("nan")).toBeUndefined();
    expect(cellReader().read("0x10")).toBeUndefined();
  });
});

describe("column looks and the choice of column", () => {
  const csv = [
    "id,day,serial,ymd,name,resid",
    "1,2024-01-01,45292,20240101,north,0.5",
    "2,2024-01-02,45293,20240102,south,-0.25",
    "3,2024-01-03,45294,20240103,east,1.75",
    "4,2024-01-04,45295,20240104,west,-1",
  ].join("\n");

  it("leaves out id, date, serial-date, yyyymmdd and text columns and says why", () => {
    const table = tableOf(csv);
    const { series, leftOut } = seriesColumnsOf(table);
    expect(series.map((c) => c.name)).toEqual(["resid"]);
    expect(leftOut.map((l) => [l.column.name, l.column.look])).toEqual([
      ["id", "counter"],
      ["day", "dates"],
      ["serial", "serial dates"],
      ["ymd", "yyyymmdd"],
      ["name", "text"],
    ]);
    expect(leftOut[0]!.reason).toMatch(/whole numbers that only rise or only fall \(1, 2, 3, …\)/);
    expect(firstSeriesColumn(table).column.name).toBe("resid");
  });

  it.each(["nan", "-", "#DIV/0!", "1.5%", "$1.50", '"1,234.5"'])(
    "a column whose first cell is %s is chosen and refused at that cell, not passed over",
    (bad) => {
      const table = tableOf(`resid,fitted\n${bad},10\n0.5,11\n-0.25,12.5\n1,9\n`);
      const { column } = firstSeriesColumn(table);
      expect(column.name).toBe("resid");
      expect(() => columnSeries(table, column)).toThrow(
        /^line 2, column 1 \("resid"\) of t\.csv holds/,
      );
    },
  );

  it("gives each refusal its hint", () => {
    const hint = (bad: string) => {
      const table = tableOf(`v\n${bad}\n1\n2\n`);
      try {
        columnSeries(table, table.columns[0]!);
      } catch (error) {
        return (error as Error).message;
      }
      return "";
    };
    expect(hint("nan")).toMatch(/give --na nan/);
    expect(hint("1.5%")).toMatch(/give --percent/);
    expect(hint("#DIV/0!")).toMatch(/spreadsheet error/);
    expect(hint("$1.50")).toMatch(/currency/);
    expect(hint('"1,234.5"')).toMatch(/thousands separators/);
    expect(hint("1e999")).toMatch(/holds 1e999, which is not a finite number/);
  });

  it("reads percent cells when allowed", () => {
    const table = tableOf("r\n1.5%\n-2%\n0.5%\n", true, true);
    expect(Array.from(columnSeries(table, table.columns[0]!).values)).toEqual([
      0.015, -0.02, 0.005,
    ]);
  });
});

describe("dayNumber(text)", () => {
  // ISO 8601 week dates: week 1 holds the year's first Thursday (from memory; 2020 has 53 weeks).
  it("reads ISO dates, dotted dates, months and ISO weeks", () => {
    expect(isoDate(dayNumber("2024-02-29")!)).toBe("2024-02-29");
    expect(dayNumber("2023-02-29")).toBeUndefined();
    expect(isoDate(dayNumber("31.01.2024")!)).toBe("2024-01-31");
    expect(isoDate(dayNumber("2024-03")!)).toBe("2024-03-01");
    expect(isoDate(dayNumber("2024-W01")!)).toBe("2024-01-01");
    expect(isoDate(dayNumber("2021-W01")!)).toBe("2021-01-04");
    expect(isoDate(dayNumber("2020-W53")!)).toBe("2020-12-28");
    expect(dayNumber("2021-W53")).toBeUndefined();
    expect(dayNumber("03/04/2024")).toBeUndefined();
  });
});

/**
 * Bad input through the intake and the options: each case names the call, the error kind it must
 * raise (EcholotError `invalid`: the user must fix something; `short`: too few values) and what
 * the message must name — the position of the offending cell or the allowed range.
 */
import { describe, expect, it } from "vitest";
import {
  EcholotError,
  lagTable,
  parseBandKind,
  parseTestKind,
  seriesFromCells,
  seriesFromNumbers,
  seriesFromValues,
  type EcholotErrorKind,
} from "../../src/core";

/** A column of cells as a host hands it over: one value per row. */
const column = (...cells: unknown[]): unknown[][] => cells.map((cell) => [cell]);
/** 30 non-constant numbers (enough for every option check). */
const thirty = seriesFromNumbers(Array.from({ length: 30 }, (_, t) => Math.sin(t) + t / 10));

interface BadCase {
  readonly name: string;
  readonly call: () => unknown;
  readonly kind: EcholotErrorKind;
  /** What the message must say: the position or the allowed range. */
  readonly names: RegExp;
}

const cases: readonly BadCase[] = [
  {
    name: "seriesFromCells(blank-only column) is short",
    call: () => seriesFromCells(column(null, "", "   ", undefined)),
    kind: "short",
    names: /no values/,
  },
  {
    name: "seriesFromValues([]) is short",
    call: () => seriesFromValues([]),
    kind: "short",
    names: /no values/,
  },
  {
    name: "seriesFromCells(label only) is short and names the label",
    call: () => seriesFromCells(column("Residual", null)),
    kind: "short",
    names: /"Residual" has no values/,
  },
  {
    name: "lagTable(one value) is short and names how many are needed",
    call: () => lagTable(seriesFromValues([5])),
    kind: "short",
    names: /at least 3 values; the series has 1 value\b/,
  },
  {
    name: "lagTable(two values around a gap) is short",
    call: () => lagTable(seriesFromValues([5, null, 6])),
    kind: "short",
    names: /at least 3 values; the series has 2 values/,
  },
  {
    name: "lagTable(constant series) is invalid and says it is constant",
    call: () => lagTable(seriesFromValues([4, 4, 4, 4, 4, 4])),
    kind: "invalid",
    names: /constant \(every value is 4\)/,
  },
  {
    name: "seriesFromCells(text mid-series) names the row",
    call: () => seriesFromCells(column("Errors", 1.5, 2, "n/a?", 4)),
    kind: "invalid",
    names: /row 4 of the range holds the text "n\/a\?"/,
  },
  {
    name: "seriesFromCells(number stored as text) names the row and says to convert it",
    call: () => seriesFromCells(column(1, 2, " 3.5 ", 4)),
    kind: "invalid",
    names: /row 3 of the range .*numbers stored as text/,
  },
  {
    name: "seriesFromCells(text in a row range) names the column",
    call: () => seriesFromCells([[1, 2, 3, "x", 5]]),
    kind: "invalid",
    names: /column 4 of the range holds the text "x"/,
  },
  {
    name: "seriesFromCells(boolean) names the row",
    call: () => seriesFromCells(column(1, 2, true, 4)),
    kind: "invalid",
    names: /row 3 of the range holds TRUE/,
  },
  {
    name: "seriesFromCells(FALSE) names the row",
    call: () => seriesFromCells(column(false, 1, 2, 4)),
    kind: "invalid",
    names: /row 1 of the range holds FALSE/,
  },
  {
    name: "seriesFromCells(#VALUE! error cell) names the row and the error",
    call: () => seriesFromCells(column(1, 2, 3, { code: "#VALUE!" }, 5)),
    kind: "invalid",
    names: /row 4 of the range holds the error #VALUE!/,
  },
  {
    name: "seriesFromCells(#DIV/0! error cell) names the row and the error",
    call: () => seriesFromCells(column(1, { code: "#DIV/0!" }, 3)),
    kind: "invalid",
    names: /row 2 of the range holds the error #DIV\/0!/,
  },
  {
    name: "seriesFromValues(NaN) names the item",
    call: () => seriesFromValues([1, 2, NaN, 4]),
    kind: "invalid",
    names: /item 3 holds NaN, which is not a finite number/,
  },
  {
    name: "seriesFromValues(Infinity) names the item",
    call: () => seriesFromValues([1, Infinity, 3]),
    kind: "invalid",
    names: /item 2 holds Infinity/,
  },
  {
    name: "seriesFromCells(−Infinity) names the row",
    call: () => seriesFromCells(column(-Infinity, 1, 2)),
    kind: "invalid",
    names: /row 1 of the range holds -Infinity/,
  },
  {
    name: "seriesFromNumbers(NaN inside) names the item",
    call: () => seriesFromNumbers([1, 2, 3, NaN, 5]),
    kind: "invalid",
    names: /item 4 holds NaN/,
  },
  {
    name: "seriesFromValues(a plain object) names the item",
    call: () => seriesFromValues([1, {}, 3]),
    kind: "invalid",
    names: /item 2 holds a value that is not a number/,
  },
  {
    name: "seriesFromCells(2-D block) gives its size",
    call: () =>
      seriesFromCells([
        [1, 2],
        [3, 4],
        [5, 6],
      ]),
    kind: "invalid",
    names: /single row or column; the range given is 3 rows × 2 columns/,
  },
  {
    name: "lagTable(maxLag 0) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 0 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29 \(the series has 30 values\)/,
  },
  {
    name: "lagTable(maxLag = n) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 30 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "lagTable(maxLag 2.5) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 2.5 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "lagTable(maxLag −3) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: -3 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "lagTable(maxLag NaN) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: NaN }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "lagTable(alpha 0) gives the allowed range",
    call: () => lagTable(thirty, { alpha: 0 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1.*\(got 0\)/,
  },
  {
    name: "lagTable(alpha 1) gives the allowed range",
    call: () => lagTable(thirty, { alpha: 1 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1.*\(got 1\)/,
  },
  {
    name: "lagTable(alpha 5, a percentage) gives the allowed range",
    call: () => lagTable(thirty, { alpha: 5 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1.*\(got 5\)/,
  },
  {
    name: "lagTable(alpha NaN) gives the allowed range",
    call: () => lagTable(thirty, { alpha: NaN }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1.*\(got NaN\)/,
  },
  {
    name: "lagTable(fittedParams = maxLag, df 0) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 4, fittedParams: 4 }),
    kind: "invalid",
    names: /fittedParams must be a whole number from 0 to 3.*\(got 4\)/,
  },
  {
    name: "lagTable(fittedParams −1) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 4, fittedParams: -1 }),
    kind: "invalid",
    names: /fittedParams must be a whole number from 0 to 3/,
  },
  {
    name: "lagTable(fittedParams 1.5) gives the allowed range",
    call: () => lagTable(thirty, { maxLag: 4, fittedParams: 1.5 }),
    kind: "invalid",
    names: /fittedParams must be a whole number from 0 to 3/,
  },
  {
    name: "lagTable(season 1) gives the allowed range",
    call: () => lagTable(thirty, { season: 1 }),
    kind: "invalid",
    names: /season must be a whole number from 2 to 29.*\(got 1\)/,
  },
  {
    name: "lagTable(season = n) gives the allowed range",
    call: () => lagTable(thirty, { season: 30 }),
    kind: "invalid",
    names: /season must be a whole number from 2 to 29.*\(got 30\)/,
  },
  {
    name: "lagTable(season 4.5) gives the allowed range",
    call: () => lagTable(thirty, { season: 4.5 }),
    kind: "invalid",
    names: /season must be a whole number from 2 to 29/,
  },
  {
    name: "parseBandKind(unknown keyword) lists the allowed keywords",
    call: () => parseBandKind("wide"),
    kind: "invalid",
    names: /bandKind must be one of "noise", "bartlett" or "robust" \(got "wide"\)/,
  },
  {
    name: "parseBandKind(a number) lists the allowed keywords",
    call: () => parseBandKind(3),
    kind: "invalid",
    names: /bandKind must be one of "noise", "bartlett" or "robust" \(got 3\)/,
  },
  {
    name: "parseTestKind(unknown keyword) lists the allowed keywords",
    call: () => parseTestKind("portmanteau"),
    kind: "invalid",
    names:
      /testKind must be one of "ljung-box", "box-pierce", "robust" or "squares" \(got "portmanteau"\)/,
  },
  {
    name: "lagTable(squares of a ±c series) is invalid: the squared deviations are constant",
    call: () => lagTable(seriesFromNumbers([1, -1, 1, -1, 1, -1, 1, -1]), { testKind: "squares" }),
    kind: "invalid",
    names: /squared deviations .* are constant/,
  },
];

describe("bad input is refused with its kind and a message that names where or what range", () => {
  it("covers at least 20 distinct cases", () => {
    expect(cases.length).toBeGreaterThanOrEqual(20);
    expect(new Set(cases.map((c) => c.name)).size).toBe(cases.length);
  });

  it.each(cases.map((c) => [c.name, c] as const))("%s", (_name, badCase) => {
    let caught: unknown;
    try {
      badCase.call();
    } catch (error) {
      caught = error;
    }
    expect(caught, `${badCase.name}: no error was thrown`).toBeInstanceOf(EcholotError);
    const error = caught as EcholotError;
    expect(error.kind, `${badCase.name}: ${error.message}`).toBe(badCase.kind);
    expect(error.message).toMatch(badCase.names);
  });
});

describe("accepted input that looks unusual", () => {
  it("seriesFromCells(#N/A cell) reads it as a gap, not an error", () => {
    const series = seriesFromCells(column("Errors", 1, { code: "#N/A" }, 3, 4));
    expect(series.label).toBe("Errors");
    expect(series.count).toBe(3);
    expect(series.gaps).toBe(1);
    expect(Array.from(series.present)).toEqual([1, 0, 1, 1]);
  });

  it("seriesFromCells(column) trims leading and trailing gaps and keeps interior ones", () => {
    const series = seriesFromCells(column(null, "", 1, null, 2, 3, "  ", undefined));
    expect(Array.from(series.present)).toEqual([1, 0, 1, 1]);
    expect(series.gaps).toBe(1);
    expect(series.values.length).toBe(4);
  });

  it("parseBandKind and parseTestKind read keywords case-insensitively and default when blank", () => {
    expect(parseBandKind(" Robust ")).toBe("robust");
    expect(parseBandKind(null)).toBe("noise");
    expect(parseBandKind("")).toBe("noise");
    expect(parseTestKind("LJUNG-BOX")).toBe("ljung-box");
    expect(parseTestKind(undefined)).toBe("ljung-box");
  });

  it("lagTable(alpha null, season null) uses the defaults 0.05 and no season", () => {
    const table = lagTable(thirty, { alpha: null, season: null, maxLag: null });
    expect(table.alpha).toBe(0.05);
    expect(table.season).toBeNull();
  });

  it("seriesFromValues(list) does not mutate its input", () => {
    const list: unknown[] = ["Label", 1, null, { code: "#N/A" }, 2, 3];
    const copy = JSON.parse(JSON.stringify(list)) as unknown[];
    seriesFromValues(list);
    expect(list).toEqual(copy);
  });
});

/**
 * The pieces of the ranked views: the one ranking rule (rankedBatchRows, rankedAuditItems), the
 * CSV cells (RFC 4180 and the formula guard) and prose wrapped to 80 columns.
 */
import { parse } from "csv-parse/sync";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { BatchCheck, BatchRow, Headline, VerdictWord } from "../../src/core";
import { rankedBatchRows, selectRanked } from "../../src/report/batchOrder";
import { batchText } from "../../src/report/batchText";
import { csvCell, csvText } from "../../src/report/rankedCsv";
import { wrapText } from "../../src/report/textWrap";

function headline(word: VerdictWord, biased = false): Headline {
  return {
    word,
    reading: "plain",
    switched: false,
    biased,
    volatile: false,
    title: `${word}${biased ? ", biased" : ""}`,
    finding: `A ${word} finding, with a comma.`,
    note: "",
    findings: [],
  };
}

/** A batch row as the core makes it; `biasQ` below alpha marks the bias kept. */
function row(label: string, p: number, qValue: number, biasQ = NaN): BatchRow {
  const analysed = !Number.isNaN(p);
  const word: VerdictWord = qValue <= 0.05 ? "structure" : p < 0.05 ? "watch" : "clear";
  return {
    label,
    n: 50,
    q: 1,
    df: 10,
    p,
    reference: analysed ? "permutation" : null,
    draws: 999,
    pBound: false,
    qValue,
    qValueBound: false,
    verdict: analysed ? word : null,
    reason: analysed ? "" : "too few values",
    reading: analysed ? "plain" : null,
    volatilityP: NaN,
    mean: 0,
    biasP: NaN,
    biasQValue: biasQ,
    kept: analysed && qValue <= 0.05,
    headline: analysed ? headline(word, biasQ <= 0.05) : null,
  };
}

function batch(rows: BatchRow[]): BatchCheck {
  return {
    alpha: 0.05,
    testKind: "ljung-box",
    maxLag: null,
    season: null,
    rows,
    flaggedRaw: 0,
    flaggedFdr: 0,
    analysed: rows.length,
    expectedRawFlags: rows.length * 0.05,
    biasFlaggedRaw: 0,
    biasFlaggedFdr: 0,
  };
}

describe("rankedBatchRows(batch)", () => {
  it("numbers the core's ranking from 1, keeps each row's input position, and marks kept structure or kept bias", () => {
    const ranked = rankedBatchRows(
      batch([
        row("none", NaN, NaN),
        row("tie-later-p", 0.02, 0.04),
        row("alone", 0.3, 0.5),
        row("tie-first-p", 0.01, 0.04),
        row("tie-same-p-b", 0.02, 0.04),
        row("best", 0.001, 0.01),
        row("biased only", 0.4, 0.6, 0.001),
      ]),
    );
    expect(ranked.map((r) => r.item.label)).toEqual([
      "biased only",
      "best",
      "tie-first-p",
      "tie-later-p",
      "tie-same-p-b",
      "alone",
      "none",
    ]);
    expect(ranked.map((r) => r.rank)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(ranked.map((r) => r.kept)).toEqual([true, true, true, true, true, false, false]);
    expect(ranked.map((r) => r.index)).toEqual([6, 5, 3, 1, 4, 2, 0]);
  });

  it("selectRanked keeps the kept rows, then the first N of them", () => {
    const ranked = rankedBatchRows(
      batch([row("a", 0.3, 0.5), row("b", 0.001, 0.01), row("c", 0.01, 0.03)]),
    );
    const labels = (top: number | null, keptOnly: boolean) =>
      selectRanked(ranked, { top, keptOnly }).map((r) => r.item.label);
    expect(labels(null, false)).toEqual(["b", "c", "a"]);
    expect(labels(2, false)).toEqual(["b", "c"]);
    expect(labels(null, true)).toEqual(["b", "c"]);
    expect(labels(1, true)).toEqual(["b"]);
    expect(labels(10, false)).toEqual(["b", "c", "a"]);
  });
});

describe("batchText(batch, context)", () => {
  it("shortens a long name with … to stay within 80 columns, and says where it is whole", () => {
    const long = "Northern warehouse, slow-moving spare parts, weekly";
    const text = batchText(batch([row(long, 0.001, 0.002), row("short", 0.5, 0.5)]), {});
    for (const line of text.split("\n"))
      expect(Array.from(line).length, line).toBeLessThanOrEqual(80);
    expect(text).toMatch(/^\s+1 Northern warehouse[^\n]*… +50 /m);
    expect(text).toMatch(/Long names are shortened with …; --csv and --json give them whole\./);
  });

  it("says so when --kept leaves no row", () => {
    const text = batchText(batch([row("a", 0.5, 0.6), row("b", 0.7, 0.7)]), {
      selection: { top: null, keptOnly: true },
    });
    expect(text).toMatch(/none of the 2 ranked rows is kept after the false-discovery step\./);
    expect(text).not.toMatch(/^\s+\d+ [ab] /m);
  });
});

describe("csvCell(cell) and csvText(header, rows)", () => {
  it("quotes a field with a comma, a double quote or a line break and doubles its quotes (RFC 4180 section 2, rules 6 and 7)", () => {
    expect(csvCell("plain")).toBe("plain");
    expect(csvCell("a,b")).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell("two\r\nlines")).toBe('"two\r\nlines"');
    expect(csvCell(null)).toBe("");
    expect(csvCell(NaN)).toBe("");
    expect(csvCell(true)).toBe("true");
  });

  it("guards text that a spreadsheet would read as a formula with a leading apostrophe, and leaves numbers numbers", () => {
    // The guard against formula injection in exported CSV: common practice (no source).
    for (const text of ["=SUM(A1:A9)", "+1+1", "-2+3", "@cmd", "\tx", "\rx"]) {
      expect(csvCell(text).replace(/^"/, "")).toMatch(/^'/);
    }
    expect(csvCell("=1,2")).toBe(`"'=1,2"`);
    expect(csvCell(-0.25)).toBe("-0.25");
    expect(csvCell(1.5e-9)).toBe("1.5e-9");
    expect(csvCell("item-7")).toBe("item-7");
  });

  it("writes CRLF after every record, and csv-parse (a general-purpose reader) gives every cell back", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.string(), fc.double({ noNaN: true, noDefaultInfinity: true })), {
          maxLength: 20,
        }),
        (records) => {
          const text = csvText(["label", "value"], records);
          expect(text.endsWith("\r\n")).toBe(true);
          const back = parse(text, { columns: true, relax_quotes: false }) as {
            label: string;
            value: string;
          }[];
          expect(back).toHaveLength(records.length);
          back.forEach((cells, i) => {
            const [label, value] = records[i] as [string, number];
            const guarded = /^[=+\-@\t\r]/.test(label) ? `'${label}` : label;
            expect(cells.label).toBe(guarded);
            expect(Number(cells.value)).toBe(value === 0 ? 0 : value);
          });
        },
      ),
    );
  });
});

describe("wrapText(text, indent, first)", () => {
  it("keeps every line within 80 columns and every word, in order", () => {
    fc.assert(
      fc.property(fc.array(fc.stringMatching(/^[a-zé–]{1,20}$/), { maxLength: 60 }), (words) => {
        const lines = wrapText(words.join(" "), "    ");
        for (const line of lines) expect(Array.from(line).length).toBeLessThanOrEqual(80);
        expect(
          lines
            .join(" ")
            .split(/ +/)
            .filter((w) => w !== ""),
        ).toEqual(words);
      }),
    );
  });

  it("leaves a word longer than the width whole on its own line", () => {
    const long = "x".repeat(90);
    expect(wrapText(`short ${long} end`)).toEqual(["short", long, "end"]);
  });
});

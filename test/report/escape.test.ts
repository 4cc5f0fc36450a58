import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { lagTable, seriesFromNumbers } from "../../src/core";
import { escapeMarkup, evidenceChartSvg, jointRibbonSvg } from "../../src/report";
import { elements } from "./chartTree";

const VALUES = [
  47, 64, 23, 71, 38, 64, 55, 41, 59, 48, 71, 35, 57, 40, 58, 44, 80, 55, 37, 74, 51, 57, 50, 60,
];

function unescape(text: string): string {
  return text
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, "&");
}

describe("escapeMarkup(text)", () => {
  it("leaves no markup character raw and loses nothing, for any text", () => {
    fc.assert(
      fc.property(fc.string({ unit: "grapheme" }), (text) => {
        const escaped = escapeMarkup(text);
        expect(escaped).not.toMatch(/[<>"']|&(?!(amp|lt|gt|quot|#39);)/);
        expect(unescape(escaped)).toBe(text);
      }),
    );
  });
});

describe("evidenceChartSvg and jointRibbonSvg with any label", () => {
  it("stay well-formed XML and carry the label as text", () => {
    fc.assert(
      fc.property(
        fc.string({ unit: fc.constantFrom("<", ">", "&", '"', "'", "a", " ", "é", "/", "=") }),
        (label) => {
          const table = lagTable(seriesFromNumbers(VALUES, label), { maxLag: 5 });
          const chart = elements(evidenceChartSvg(table));
          const desc = chart.find((e) => e.local === "desc")?.text ?? "";
          expect(desc).toContain(label === "" ? "the series" : `“${label}”`);
          expect(() => elements(jointRibbonSvg(table))).not.toThrow();
        },
      ),
      { numRuns: 60 },
    );
  });
});

/**
 * Contrast of every mark in the charts against what it sits on, by the WCAG 2.1 formulas:
 * relative luminance L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised sRGB channels
 * (c ≤ 0.04045 ? c/12.92 : ((c + 0.055)/1.055)^2.4), and contrast (L1 + 0.05)/(L2 + 0.05).
 * Source: W3C, Web Content Accessibility Guidelines 2.1, definitions "relative luminance" and
 * "contrast ratio"; the thresholds are success criteria 1.4.11 (3:1 for graphical objects) and
 * 1.4.3 (4.5:1 for text).
 */
import { describe, expect, it } from "vitest";
import { lagTable, seriesFromNumbers } from "../../src/core";
import { ar1 } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import {
  BADGES,
  evidenceChartSvg,
  jointRibbonSvg,
  PALETTE,
  ribbonFill,
  ZONE_COLOURS,
} from "../../src/report";
import { elements, withClass } from "./chartTree";

function channels(colour: string): [number, number, number] {
  const hex = /^#([0-9a-f]{6})$/i.exec(colour);
  if (hex !== null) {
    const n = parseInt(hex[1] as string, 16);
    return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
  }
  const rgb = /^rgb\((\d+), (\d+), (\d+)\)$/.exec(colour);
  if (rgb !== null) return [Number(rgb[1]), Number(rgb[2]), Number(rgb[3])];
  throw new Error(`not a colour: ${colour}`);
}

function luminance(colour: string): number {
  const [r, g, b] = channels(colour).map((c) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: string, b: string): number {
  const [x, y] = [luminance(a), luminance(b)];
  return (Math.max(x, y) + 0.05) / (Math.min(x, y) + 0.05);
}

/** `top` at `opacity` over `under`, as the browser composites it (in sRGB values). */
function over(top: string, opacity: number, under: string): string {
  const t = channels(top);
  const u = channels(under);
  const mixed = t.map((c, i) => Math.round(opacity * c + (1 - opacity) * (u[i] as number)));
  return `rgb(${mixed.join(", ")})`;
}

/** Each background plain and under the seasonal tint (drawn at 0.75 over everything in its column). */
function withTint(...backgrounds: string[]): string[] {
  return backgrounds.flatMap((b) => [b, over(PALETTE.seasonalTint, 0.75, b)]);
}

function expectAtLeast(ratio: number, mark: string, against: string[], what: string): void {
  for (const background of against) {
    const found = contrast(mark, background);
    expect(
      found,
      `${what}: ${mark} on ${background} has contrast ${found.toFixed(2)}:1, needs ${ratio}:1`,
    ).toBeGreaterThanOrEqual(ratio);
  }
}

describe("contrast ratios of the charts' colours (WCAG 2.1)", () => {
  it("contrast(a, b) reproduces the WCAG end points and a known grey", () => {
    // Black on white is 21:1 and equal colours 1:1, by the definition.
    expect(contrast("#000000", "#FFFFFF")).toBeCloseTo(21, 10);
    expect(contrast("#56636F", "#56636F")).toBe(1);
    // #767676 on white is 4.54:1, the lightest grey that passes 4.5:1 (from memory).
    expect(contrast("#767676", "#FFFFFF")).toBeCloseTo(4.54, 2);
  });

  it("every diamond meets 3:1 against the corridor or page it sits on, tinted or not", () => {
    expectAtLeast(3, ZONE_COLOURS.inside, withTint(PALETTE.innerCorridor), "inside diamond");
    expectAtLeast(3, ZONE_COLOURS.between, withTint(PALETTE.outerCorridor), "between diamond");
    expectAtLeast(3, ZONE_COLOURS.beyond, withTint(PALETTE.page), "beyond diamond");
  });

  it("the corridors' edges meet 3:1 against both sides, and the seasonal edges against all fills", () => {
    expectAtLeast(
      3,
      PALETTE.outerEdge,
      withTint(PALETTE.page, PALETTE.outerCorridor),
      "outer edge",
    );
    expectAtLeast(
      3,
      PALETTE.innerEdge,
      withTint(PALETTE.outerCorridor, PALETTE.innerCorridor),
      "inner edge",
    );
    expectAtLeast(
      3,
      PALETTE.seasonalEdge,
      withTint(PALETTE.page, PALETTE.outerCorridor, PALETTE.innerCorridor),
      "seasonal edge",
    );
  });

  it("every ribbon cell meets 3:1 against the page: neutral by its outline, the rest by fill", () => {
    expectAtLeast(3, PALETTE.outerEdge, [PALETTE.page], "neutral cell outline");
    expectAtLeast(3, PALETTE.ink, [PALETTE.page], "chosen K outline");
    for (const p of [0.0499, 0.02, 0.01, 1e-3, 1e-4, 1e-5, 1e-6, 1e-40]) {
      expectAtLeast(3, ribbonFill(p, 0.05), [PALETTE.page], `cell at p = ${p}`);
    }
  });

  it("the badges' shapes meet 3:1 against the page", () => {
    for (const badge of Object.values(BADGES)) {
      expectAtLeast(3, badge.colour, [PALETTE.page], `${badge.word} badge`);
    }
  });

  it("chart text meets 4.5:1 against the page and the corridors; the seasonal tag, above the plot, on the page", () => {
    for (const ink of [PALETTE.ink, PALETTE.muted]) {
      expectAtLeast(
        4.5,
        ink,
        [PALETTE.page, PALETTE.outerCorridor, PALETTE.innerCorridor],
        "chart text",
      );
    }
    expectAtLeast(4.5, PALETTE.seasonalEdge, [PALETTE.page], "seasonal tag");
  });

  it("the drawn chart and ribbon use only colours checked above", () => {
    const table = lagTable(seriesFromNumbers(ar1(seededRandom(3), 300, 0.3)), {
      maxLag: 24,
      season: 12,
    });
    const checked = new Set<string>([
      ...Object.values(PALETTE),
      ...Object.values(ZONE_COLOURS),
      "none",
    ]);
    for (const row of table.rows)
      if (row.jointP < table.alpha) checked.add(ribbonFill(row.jointP, table.alpha));
    for (const svg of [evidenceChartSvg(table), jointRibbonSvg(table)]) {
      for (const e of elements(svg)) {
        for (const attribute of ["fill", "stroke"]) {
          const colour = e.attributes[attribute];
          if (colour !== undefined)
            expect(checked.has(colour), `${e.local} ${attribute} ${colour}`).toBe(true);
        }
      }
    }
    expect(withClass(evidenceChartSvg(table), "lag").length).toBe(24);
  });
});

import { describe, expect, it } from "vitest";
import { lagTable, referencedPPhrase, seriesFromNumbers, type LagTable } from "../../src/core";
import { ar1, movingAverage, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import {
  evidenceChartSvg,
  jointRibbonSvg,
  PALETTE,
  PIN_LIMIT,
  ZONE_COLOURS,
  zLimit,
} from "../../src/report";
import { expectClose } from "../helpers/expectClose";
import { corridors, diamonds, elements, seriesF, withClass } from "./chartTree";

/** Pixels per unit of z and the pixel row of z = 0, from the inner corridor's rectangle. */
function yScale(svg: string): { zero: number; perUnit: number } {
  const inner = corridors(svg).find((c) => c.name === "inner");
  if (inner === undefined) throw new Error("no inner corridor");
  return {
    zero: (inner.top + inner.bottom) / 2,
    perUnit: (inner.bottom - inner.top) / (2 * inner.level),
  };
}

describe("evidenceChartSvg(table)", () => {
  it("draws one diamond per lag, at the height of its standardised value", () => {
    const table = lagTable(seriesF(), { maxLag: 24 });
    const svg = evidenceChartSvg(table);
    const shown = diamonds(svg);
    expect(shown.map((d) => d.lag)).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
    const { zero, perUnit } = yScale(svg);
    for (const d of shown) {
      const row = table.rows[d.lag - 1];
      if (row === undefined) throw new Error(`no row for lag ${d.lag}`);
      expectClose(d.z, row.z, { rel: 1e-5 }, `lag ${d.lag}: data-z against the lag table's z`);
      // Coordinates are rounded to 0.1 px, so the centre may be off by 0.05 (plus the scale's own rounding).
      expectClose(
        d.y,
        zero - row.z * perUnit,
        { abs: 0.2 },
        `lag ${d.lag}: diamond height for z = ${row.z} (px)`,
      );
    }
    // Columns step evenly from left to right.
    const steps = shown.slice(1).map((d, i) => d.x - (shown[i] as { x: number }).x);
    for (const step of steps)
      expectClose(step, steps[0] as number, { abs: 0.15 }, "lag column step (px)");
  });

  it("puts the corridors at ±z(1−α/2) and at the verdict's all-lags level (K = 24, α = 0.05)", () => {
    const table = lagTable(seriesF(), { maxLag: 24, alpha: 0.05 });
    const svg = evidenceChartSvg(table);
    const found = corridors(svg);
    const inner = found.find((c) => c.name === "inner");
    const outer = found.find((c) => c.name === "outer");
    if (inner === undefined || outer === undefined) throw new Error("missing corridor");
    // z_0.975 = 1.959964: Fisher (1925), Table 1; OEIS/printed value in test/fixtures/normal-quantiles.tsv.
    expectClose(inner.level, 1.959964, { abs: 1e-6 }, "inner corridor level, alpha 0.05");
    // The outer corridor is the core's calibrated level for all 24 lags: drawn as given, and
    // wider than one lag's own corridor.
    expectClose(outer.level, table.outerLevel, { rel: 1e-9 }, "outer corridor level, K = 24");
    expect(outer.level).toBeGreaterThan(inner.level);
    // Nested, centred on zero, in the palette's colours.
    const { zero, perUnit } = yScale(svg);
    expectClose((outer.top + outer.bottom) / 2, zero, { abs: 0.1 }, "outer corridor centre (px)");
    expectClose(
      (outer.bottom - outer.top) / 2,
      outer.level * perUnit,
      { abs: 0.15 },
      "outer corridor half-height (px)",
    );
    const fills = withClass(svg, "corridor").map(
      (e) => `${e.attributes.class} ${e.attributes.fill}`,
    );
    expect(fills).toEqual([
      `corridor outer ${PALETTE.outerCorridor}`,
      `corridor inner ${PALETTE.innerCorridor}`,
    ]);
  });

  it("colours each diamond by the corridor that holds it", () => {
    const random = seededRandom(61);
    const cases: LagTable[] = [
      lagTable(seriesF(), { maxLag: 24 }),
      lagTable(seriesF(), { maxLag: 10, bandKind: "bartlett" }),
      lagTable(seriesFromNumbers(ar1(random, 150, 0.3)), { maxLag: 20 }),
      lagTable(seriesFromNumbers(whiteNoise(random, 300)), { maxLag: 30, alpha: 0.2 }),
    ];
    let seen = new Set<string>();
    for (const table of cases) {
      for (const view of ["correlation", "partial"] as const) {
        for (const d of diamonds(evidenceChartSvg(table, { view }))) {
          const size = Math.abs(d.z);
          const expected =
            size > table.outerLevel ? "beyond" : size > table.innerLevel ? "between" : "inside";
          expect(d.zone, `${view} lag ${d.lag}, z = ${d.z}`).toBe(expected);
          expect(d.fill).toBe(ZONE_COLOURS[expected]);
          seen = seen.add(expected);
        }
      }
    }
    expect([...seen].sort()).toEqual(["between", "beyond", "inside"]);
    // Okabe–Ito slate and vermillion; the orange darkened to 60% for 3:1 contrast (palette.ts).
    expect(ZONE_COLOURS).toEqual({ inside: "#56636F", between: "#8A5F00", beyond: "#D55E00" });
  });

  it("shows a vermillion diamond exactly when the verdict's single-lag rule fires, at those lags", () => {
    let fired = 0;
    let quiet = 0;
    for (let seed = 1; seed <= 36; seed++) {
      const random = seededRandom(1000 + seed);
      const n = 120 + 10 * (seed % 5);
      const values =
        seed % 3 === 0
          ? whiteNoise(random, n)
          : seed % 3 === 1
            ? ar1(random, n, 0.1 + 0.02 * seed)
            : movingAverage(random, n, [0.25 + 0.01 * seed]);
      const table = lagTable(seriesFromNumbers(values), { maxLag: 12 });
      const vermillion = diamonds(evidenceChartSvg(table)).filter(
        (d) => d.fill === PALETTE.structure,
      );
      expect(
        vermillion.map((d) => d.lag),
        `seed ${seed}`,
      ).toEqual(table.verdict.triggers.outerLags);
      if (vermillion.length > 0) {
        expect(table.verdict.word).toBe("structure");
        fired++;
      } else quiet++;
    }
    expect(
      fired > 0 && quiet > 0,
      `cases with and without the rule: ${fired} fired, ${quiet} quiet`,
    ).toBe(true);
  });

  it("tags the seasonal lags m and 2m in tinted columns", () => {
    const svg = evidenceChartSvg(lagTable(seriesF(), { maxLag: 24, season: 6 }));
    const tags = withClass(svg, "season-tag").map((e) => [
      Number(e.attributes["data-lag"]),
      e.text,
    ]);
    expect(tags).toEqual([
      [6, "m"],
      [12, "2m"],
    ]);
    const columns = withClass(svg, "season");
    expect(columns.map((e) => [Number(e.attributes["data-lag"]), e.attributes.fill])).toEqual([
      [6, PALETTE.seasonalTint],
      [12, PALETTE.seasonalTint],
    ]);
    // Each tint sits over its lag's diamond.
    const byLag = new Map(diamonds(svg).map((d) => [d.lag, d.x]));
    for (const column of columns) {
      const left = Number(column.attributes.x);
      const x = byLag.get(Number(column.attributes["data-lag"])) as number;
      expect(x > left && x < left + Number(column.attributes.width)).toBe(true);
    }
    const oneInRange = evidenceChartSvg(lagTable(seriesF(), { maxLag: 17, season: 13 }));
    expect(withClass(oneInRange, "season-tag").map((e) => e.attributes["data-lag"])).toEqual([
      "13",
    ]);
    expect(withClass(evidenceChartSvg(lagTable(seriesF(), {})), "season")).toEqual([]);
  });

  it("pins values beyond ±6 to the edge under an arrowhead", () => {
    const table = lagTable(seriesFromNumbers(ar1(seededRandom(7), 600, 0.95)), { maxLag: 10 });
    expect(table.rows[0]?.z ?? 0).toBeGreaterThan(PIN_LIMIT);
    const svg = evidenceChartSvg(table);
    const shown = diamonds(svg);
    const pinned = shown.filter((d) => d.pinned);
    expect(pinned.map((d) => d.lag)).toEqual(
      table.rows.filter((r) => Math.abs(r.z) > PIN_LIMIT).map((r) => r.lag),
    );
    const { zero, perUnit } = yScale(svg);
    for (const d of pinned) {
      expectClose(
        d.y,
        zero - PIN_LIMIT * perUnit,
        { abs: 0.2 },
        `pinned lag ${d.lag} sits at the +6 edge (px)`,
      );
      expect(d.title).toContain("pinned to the edge");
    }
    expect(withClass(svg, "arrowhead").map((e) => Number(e.attributes["data-lag"]))).toEqual(
      pinned.map((d) => d.lag),
    );
  });

  it("draws no stems, no bars from zero and no dashed lines: only tick marks are lines", () => {
    const svg = evidenceChartSvg(lagTable(seriesF(), { maxLag: 24, season: 6 }));
    expect(svg).not.toContain("stroke-dasharray");
    const lines = elements(svg).filter((e) => e.local === "line");
    expect(lines.every((e) => e.attributes.class === "tick")).toBe(true);
    const rects = elements(svg).filter((e) => e.local === "rect");
    expect(
      rects.every((e) =>
        /^(corridor (inner|outer)|corridor-edge (inner|outer)|season)$/.test(
          e.attributes.class ?? "",
        ),
      ),
    ).toBe(true);
    // The corridors' edges are solid outlines of the same rectangles, not lines of their own.
    const edges = withClass(svg, "corridor-edge");
    expect(edges.map((e) => [e.attributes.fill, e.attributes.stroke])).toEqual([
      ["none", PALETTE.outerEdge],
      ["none", PALETTE.innerEdge],
    ]);
    const fills = withClass(svg, "corridor");
    expect(edges.map((e) => e.attributes.y)).toEqual(fills.map((e) => e.attributes.y));
  });

  it("escapes every text: a label <img src=x onerror=alert(1)> stays text", () => {
    const label = "<img src=x onerror=alert(1)>";
    const svg = evidenceChartSvg(lagTable(seriesF(label), {}));
    expect(svg).not.toContain("<img");
    expect(svg).toContain("&lt;img src=x onerror=alert(1)&gt;");
    const desc = elements(svg).find((e) => e.local === "desc");
    expect(desc?.text).toContain(label);
    expect(evidenceChartSvg(lagTable(seriesF("a\"b'c&d"), {}), { idPrefix: 'x"y' })).toContain(
      'id="x&quot;y-title"',
    );
  });

  it("gives byte-equal output for equal input, coordinates rounded to 0.1 px", () => {
    const table = lagTable(seriesF(), { maxLag: 24, season: 6 });
    const first = evidenceChartSvg(table, { view: "partial", width: 300 });
    expect(evidenceChartSvg(table, { view: "partial", width: 300 })).toBe(first);
    const geometry = elements(first).flatMap((e) =>
      ["x", "y", "width", "height", "x1", "x2", "y1", "y2", "d"].map((a) => e.attributes[a] ?? ""),
    );
    for (const value of geometry) {
      for (const number of value.match(/-?\d+(\.\d+)?/g) ?? []) {
        expect(number, `coordinate ${number} in "${value}"`).toMatch(/^-?\d+(\.\d)?$/);
      }
    }
  });

  it("standardises partial autocorrelations by 1/√n in the partial view", () => {
    const table = lagTable(seriesF(), {});
    const shown = diamonds(evidenceChartSvg(table, { view: "partial" }));
    // Series F partial at lag 1 = r_1 = −0.389878 (METHODS.md, derived from the Series F data with
    // the published Durbin–Levinson recursion); z = φ_11·√70.
    expectClose(
      shown[0]?.z ?? NaN,
      -0.389878 * Math.sqrt(70),
      { rel: 1e-5 },
      "Series F partial z at lag 1",
    );
    expectClose(
      shown[1]?.z ?? NaN,
      0.179705 * Math.sqrt(70),
      { rel: 1e-5 },
      "Series F partial z at lag 2",
    );
  });

  it("draws the squared deviations from a squares lag table, and refuses a mismatch", () => {
    const series = seriesF();
    const squares = lagTable(series, { testKind: "squares" });
    const svg = evidenceChartSvg(squares);
    expect(svg).toContain('class="evidence-chart view-squares"');
    expect(diamonds(svg).map((d) => d.z)).toEqual(
      squares.rows.map((r) => Number(r.z.toPrecision(6))),
    );
    expect(() => evidenceChartSvg(lagTable(series, {}), { view: "squares" })).toThrow(
      /squared deviations/,
    );
    expect(() => evidenceChartSvg(squares, { view: "correlation" })).toThrow(/series itself/);
  });

  it("describes itself for assistive technology: a title and a description with the figures", () => {
    const table = lagTable(seriesF(), { maxLag: 24 });
    const svg = evidenceChartSvg(table, { idPrefix: "f" });
    const root = elements(svg)[0];
    expect(root?.attributes.role).toBe("img");
    expect(root?.attributes["aria-labelledby"]).toBe("f-title f-desc");
    const desc = elements(svg).find((e) => e.local === "desc")?.text ?? "";
    expect(desc).toContain("Lags beyond the all-lags corridor: 1.");
    expect(desc).toContain("Lags between the corridors: 2.");
    expect(desc).toContain("±1.96");
    expect(desc).toContain(`all-lags corridor ±${Number(table.outerLevel.toPrecision(3))} for 24`);
  });

  it("names its values, band kind, joint test and the p the verdict reads, with its reference, on every tab", () => {
    const series = seriesF();
    const robust = lagTable(series, { maxLag: 12, bandKind: "robust", testKind: "robust" });
    const captions = (svg: string) => withClass(svg, "caption").map((e) => e.text);
    expect(captions(evidenceChartSvg(robust))).toEqual([
      "Autocorrelation, robust bands (volatility)",
      "Joint test robust Q* over lags 1–12:",
      referencedPPhrase(robust.levels.jointP),
    ]);
    expect(captions(evidenceChartSvg(robust))[2]).toMatch(/^p [=<] \S+ (by|from) /);
    expect(captions(evidenceChartSvg(robust, { view: "partial" }))[0]).toBe(
      "Partial autocorrelation, bands (se 1/√n)",
    );
    const squares = lagTable(series, { maxLag: 12, testKind: "squares" });
    expect(captions(evidenceChartSvg(squares)).slice(0, 2)).toEqual([
      "Squared deviations, noise bands (se 1/√n)",
      "Joint test McLeod–Li over lags 1–12:",
    ]);
    const fitted = lagTable(series, { maxLag: 12, bandKind: "bartlett", fittedParams: 2 });
    expect(captions(evidenceChartSvg(fitted)).slice(0, 2)).toEqual([
      "Autocorrelation, Bartlett bands",
      "Joint test Ljung–Box over lags 1–12:",
    ]);
  });

  it("keeps one y scale on every tab, ±6 (or just past a wider outer corridor), and says so", () => {
    const series = seriesFromNumbers(ar1(seededRandom(5), 200, 0.5));
    const table = lagTable(series, { maxLag: 10 });
    const squares = lagTable(series, { maxLag: 10, testKind: "squares" });
    const charts = [
      evidenceChartSvg(table),
      evidenceChartSvg(table, { view: "partial" }),
      evidenceChartSvg(squares),
    ];
    const scales = charts.map((svg) => yScale(svg));
    for (const s of scales) {
      expectClose(s.zero, scales[0]?.zero ?? NaN, { abs: 0.1 }, "z = 0 row (px) across tabs");
      expectClose(s.perUnit, scales[0]?.perUnit ?? NaN, { rel: 1e-3 }, "px per z across tabs");
    }
    for (const svg of charts) {
      expect(elements(svg)[0]?.attributes["data-z-limit"]).toBe(String(PIN_LIMIT));
      expect(withClass(svg, "scale-rule")[0]?.text).toBe(
        "z scale ±6 on every tab; beyond it: pinned",
      );
    }
    // An outer corridor wider than ±6 (a very small alpha) widens the scale to 1.1 times it, so
    // the corridor still shows; the same rule as zLimit.
    const wide = { ...table, outerLevel: 6.4 };
    const limit = Number(elements(evidenceChartSvg(wide))[0]?.attributes["data-z-limit"]);
    expectClose(limit, 7.04, { rel: 1e-9 }, "z limit past a wide corridor");
    expectClose(zLimit(6.4), limit, { rel: 1e-9 }, "zLimit(6.4) against the chart");
    expect(zLimit(2.8)).toBe(PIN_LIMIT);
  });

  it("writes every text at 11 px or larger (chart and ribbon)", () => {
    const table = lagTable(seriesF(), { maxLag: 24, season: 6 });
    for (const svg of [evidenceChartSvg(table), jointRibbonSvg(table)]) {
      const texts = elements(svg).filter((e) => e.local === "text");
      expect(texts.length).toBeGreaterThan(3);
      for (const t of texts) {
        expect(Number(t.attributes["font-size"]), `"${t.text}"`).toBeGreaterThanOrEqual(11);
      }
    }
  });
});

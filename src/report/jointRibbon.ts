/**
 * The joint-test ribbon as an SVG string: one cell per k = 1..K, under the evidence chart's lag
 * columns, holding the χ² p-value of the joint test over lags 1..k (the verdict's own p for K, by
 * permutation where it uses one, is in the chart's caption). At or above alpha a cell is
 * neutral: a light fill inside a solid outline. Below alpha it is vermillion, deeper as −log10 p
 * grows, from #D55E00 at alpha to the palette's deepest shade at full strength (p = 1e-6, or twice
 * −log10 alpha when alpha is smaller still) — darker, never lighter, so every filled cell keeps 3:1
 * against the page. The chosen K, the test the verdict uses, is outlined in ink. A key under the
 * cells says all this in words. The ribbon shows the joint test of the table it is given, so the
 * squared deviations' table gives its own test (McLeod–Li). Whether a cell is below alpha is the
 * core's (each row's `jointBelowAlpha`). Pure; coordinates rounded; text escaped.
 */
import { scaleLinear } from "d3-scale";
import { formatNumber, formatP, type LagTable } from "../core";
import { CHART_TEXT_PX, lagColumns, lagFrame } from "./evidenceChart";
import { jointTestName } from "./lagViews";
import { PALETTE } from "./palette";
import { element, figure, px, svgRoot, textElement } from "./svg";

export interface JointRibbonOptions {
  /** The same width as the evidence chart above it, so the cells sit under their lags. */
  readonly width?: number;
  readonly idPrefix?: string;
}

/** −log10 p at which a cell reaches full strength: a display choice, not a statistical threshold. */
const FULL_STRENGTH = 6;

/** How deep a cell whose p is below alpha is shaded: 0.25 at alpha, 1 at full strength. */
export function ribbonStrength(p: number, alpha: number): number {
  const start = -Math.log10(alpha);
  const end = Math.max(FULL_STRENGTH, 2 * start);
  return scaleLinear().domain([start, end]).range([0.25, 1]).clamp(true)(-Math.log10(p));
}

/** The fill of a cell below alpha: vermillion at strength 0.25, the deepest shade at 1. */
export function ribbonFill(p: number, alpha: number): string {
  return scaleLinear<string>()
    .domain([0.25, 1])
    .range([PALETTE.structure, PALETTE.ribbonDeepest])
    .clamp(true)(ribbonStrength(p, alpha));
}

export function jointRibbonSvg(table: LagTable, options: JointRibbonOptions = {}): string {
  const width = options.width ?? 320;
  const id = options.idPrefix ?? "echolot-ribbon";
  const height = 74;
  const frame = lagFrame(width);
  const x = lagColumns(table.maxLag, frame);
  const cellTop = 20;
  const cellHeight = 14;
  const testName = jointTestName(table);
  const alpha = figure(table.alpha, 3);
  const parts: string[] = [];
  const text = (className: string, tx: number, ty: number, words: string, anchor?: "end") =>
    textElement(
      "text",
      {
        class: className,
        x: px(tx),
        y: px(ty),
        "text-anchor": anchor,
        "font-size": CHART_TEXT_PX,
        fill: PALETTE.ink,
      },
      words,
    );
  parts.push(
    textElement(
      "title",
      { id: `${id}-title` },
      `${testName} p-value of lags 1 to k, k = 1..${table.maxLag}`,
    ),
  );
  const below = table.rows.filter((r) => r.jointBelowAlpha).map((r) => r.lag);
  parts.push(
    textElement(
      "desc",
      { id: `${id}-desc` },
      `Joint test ribbon (${testName}): one cell per k. ${below.length === 0 ? "No k" : `k = ${below.join(", ")}`} ${below.length === 1 ? "has" : "have"} p below alpha ${alpha}. At the chosen K = ${table.maxLag}: p = ${formatP(table.joint.p)}.`,
    ),
  );
  parts.push(text("caption", 4, 12, `Joint test ${testName} of lags 1…k, χ² p by cell`));

  for (const row of table.rows) {
    const p = row.jointP;
    const state = Number.isNaN(p) ? "undefined" : row.jointBelowAlpha ? "below" : "above";
    const chosen = row.lag === table.maxLag;
    const fill =
      state === "below"
        ? ribbonFill(p, table.alpha)
        : state === "above"
          ? PALETTE.ribbonNeutral
          : PALETTE.page;
    const tip =
      state === "undefined"
        ? `lags 1–${row.lag}: no degrees of freedom left after ${table.fittedParams} fitted parameters`
        : `lags 1–${row.lag}: Q = ${formatNumber(row.jointQ, 4)}, df ${row.jointDf}, p = ${formatP(p)}${state === "below" ? ", below alpha" : ""}`;
    parts.push(
      element(
        "rect",
        {
          class: `joint-cell ${state}${chosen ? " chosen" : ""}`,
          x: px(x(row.lag) ?? frame.left),
          y: cellTop,
          width: px(x.bandwidth()),
          height: cellHeight,
          fill,
          stroke: chosen ? PALETTE.ink : state === "below" ? PALETTE.page : PALETTE.outerEdge,
          "stroke-width": chosen ? 2 : state === "below" ? 0.5 : 1,
          "data-k": row.lag,
          "data-p": figure(p),
        },
        textElement("title", {}, tip),
      ),
    );
  }
  parts.push(
    text(
      "caption chosen-p",
      frame.right,
      cellTop + cellHeight + 14,
      `outlined K = ${table.maxLag}: χ² p = ${formatP(table.joint.p)}`,
      "end",
    ),
  );

  // The key: an outlined light cell for p at or above alpha, two filled cells for below.
  const keyY = height - 16;
  const swatch = (sx: number, fill: string, stroke: string) =>
    element("rect", {
      class: "key-swatch",
      x: px(sx),
      y: px(keyY),
      width: 12,
      height: 12,
      fill,
      stroke,
      "stroke-width": 1,
    });
  parts.push(swatch(4, PALETTE.ribbonNeutral, PALETTE.outerEdge));
  parts.push(text("key", 20, keyY + 10, `p ≥ ${alpha}`));
  const second = 20 + (`p ≥ ${alpha}`.length + 2) * 6.5;
  parts.push(swatch(second, PALETTE.structure, PALETTE.page));
  parts.push(swatch(second + 12, PALETTE.ribbonDeepest, PALETTE.page));
  parts.push(text("key", second + 29, keyY + 10, `p < ${alpha}, darker as p falls`));
  return svgRoot("joint-ribbon", width, height, id, parts.join(""));
}

/**
 * The joint-test ribbon as an SVG string: one cell per k = 1..K, under the evidence chart's lag
 * columns, filled by the p-value of the joint test over lags 1..k. At or above alpha a cell is
 * neutral; below alpha it is vermillion, deeper as −log10 p grows (full strength at p = 1e-6, or
 * at twice −log10 alpha when alpha is smaller still). The chosen K, the test the verdict uses, is
 * outlined. Pure; coordinates rounded; text escaped.
 */
import { scaleLinear } from "d3-scale";
import { formatNumber, formatP, TEST_NAMES, type LagTable } from "../core";
import { lagColumns, lagFrame } from "./evidenceChart";
import { PALETTE } from "./palette";
import { element, figure, px, svgRoot, textElement } from "./svg";

export interface JointRibbonOptions {
  /** The same width as the evidence chart above it, so the cells sit under their lags. */
  readonly width?: number;
  readonly idPrefix?: string;
}

/** −log10 p at which a cell reaches full strength: a display choice, not a statistical threshold. */
const FULL_STRENGTH = 6;

/** Fill opacity of a cell whose p is below alpha: 0.25 at alpha, 1 at full strength. */
export function ribbonStrength(p: number, alpha: number): number {
  const start = -Math.log10(alpha);
  const end = Math.max(FULL_STRENGTH, 2 * start);
  return scaleLinear().domain([start, end]).range([0.25, 1]).clamp(true)(-Math.log10(p));
}

export function jointRibbonSvg(table: LagTable, options: JointRibbonOptions = {}): string {
  const width = options.width ?? 320;
  const id = options.idPrefix ?? "echolot-ribbon";
  const height = 46;
  const frame = lagFrame(width);
  const x = lagColumns(table.maxLag, frame);
  const cellTop = 16;
  const cellHeight = 14;
  const testName = TEST_NAMES[table.testKind];
  const parts: string[] = [];
  parts.push(
    textElement(
      "title",
      { id: `${id}-title` },
      `${testName} p-value of lags 1 to k, k = 1..${table.maxLag}`,
    ),
  );
  const below = table.rows.filter((r) => r.jointP < table.alpha).map((r) => r.lag);
  parts.push(
    textElement(
      "desc",
      { id: `${id}-desc` },
      `Joint test ribbon: one cell per k. ${below.length === 0 ? "No k" : `k = ${below.join(", ")}`} ${below.length === 1 ? "has" : "have"} p below alpha ${figure(table.alpha, 3)}. At the chosen K = ${table.maxLag}: p = ${formatP(table.joint.p)}.`,
    ),
  );
  parts.push(
    textElement(
      "text",
      { class: "caption", x: px(frame.left), y: 10, "font-size": 9, fill: PALETTE.muted },
      `joint test (${testName}) of lags 1…k`,
    ),
  );

  for (const row of table.rows) {
    const p = row.jointP;
    const state = Number.isNaN(p) ? "undefined" : p < table.alpha ? "below" : "above";
    const chosen = row.lag === table.maxLag;
    const fill = state === "below" ? PALETTE.structure : PALETTE.outerCorridor;
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
          "fill-opacity": state === "below" ? figure(ribbonStrength(p, table.alpha), 3) : undefined,
          stroke: chosen ? PALETTE.ink : "#FFFFFF",
          "stroke-width": chosen ? 1.5 : 0.5,
          "data-k": row.lag,
          "data-p": figure(p),
        },
        textElement("title", {}, tip),
      ),
    );
  }
  parts.push(
    textElement(
      "text",
      {
        class: "caption",
        x: px(frame.right),
        y: px(cellTop + cellHeight + 12),
        "text-anchor": "end",
        "font-size": 9,
        fill: PALETTE.ink,
      },
      `K = ${table.maxLag}: p = ${formatP(table.joint.p)}`,
    ),
  );
  return svgRoot("joint-ribbon", width, height, id, parts.join(""));
}

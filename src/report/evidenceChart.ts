/**
 * The evidence chart as an SVG string: lags 1..K along the bottom, each lag's standardised value
 * as a diamond, between two nested flat corridors — the inner one at ±z_{1−α/2} (one lag on its
 * own) and the outer one at the verdict's calibrated level for all K lags together (the core's
 * outerLevel). Diamond colours say which
 * corridor holds each lag; the seasonal lags m and 2m sit in tinted, tagged columns; values beyond
 * the pin limit (±6, or just past the outer corridor if that is wider) sit at the edge under an
 * arrowhead. No stems, no bars from zero, no dashed lines: the two corridors carry the message.
 *
 * The chart says what it shows: a caption on top names the values, the band kind and the joint
 * test with its p and that p's reference; the key at the bottom gives the corridor levels and the y-scale rule.
 * One y-scale rule for every tab and every series: z runs over ±6 (the pin limit), so switching
 * tabs or items never rescales what the eye compares. All text is 11 px or larger.
 *
 * Pure: a function from a lag table to a string. Coordinates are rounded to 0.1 px and every text
 * and attribute is escaped, so equal input gives byte-equal output.
 */
import { scaleBand, scaleLinear } from "d3-scale";
import { referencedPPhrase, seasonalLags, seriesName, type LagTable } from "../core";
import {
  jointTestName,
  lagPoints,
  viewBandWords,
  VIEW_QUANTITIES,
  type ChartView,
} from "./lagViews";
import { PALETTE, ZONE_COLOURS, ZONE_WORDS } from "./palette";
import { element, figure, px, signed, svgRoot, textElement } from "./svg";

/** Standardised values beyond this are pinned to the edge (DESIGN.md). */
export const PIN_LIMIT = 6;

/** The size of every text in the charts: 11 px, the smallest we allow. */
export const CHART_TEXT_PX = 11;

export interface EvidenceChartOptions {
  /** Which values to draw; default "squares" for a squares table, else "correlation". */
  readonly view?: ChartView;
  readonly width?: number;
  readonly height?: number;
  /** Prefix of the element ids (title, description), unique within the page. */
  readonly idPrefix?: string;
}

/** The pixel frame of the plot, shared with the joint-test ribbon so its cells line up. */
export interface LagFrame {
  readonly width: number;
  readonly left: number;
  readonly right: number;
}

const MARGIN = { top: 62, right: 10, bottom: 62, left: 34 };

export function lagFrame(width: number): LagFrame {
  return { width, left: MARGIN.left, right: width - MARGIN.right };
}

/** x positions of the lag columns (d3 band scale over 1..K, no padding: columns touch). */
export function lagColumns(maxLag: number, frame: LagFrame) {
  const lags = Array.from({ length: maxLag }, (_, i) => i + 1);
  return scaleBand<number>().domain(lags).range([frame.left, frame.right]).padding(0);
}

/**
 * The half-height of the y domain, the same on every tab: ±6, unless the outer corridor itself
 * reaches that far (a very small alpha), then a little beyond it.
 */
export function zLimit(outerLevel: number): number {
  return Math.max(PIN_LIMIT, outerLevel * 1.1);
}

/** The y-scale rule in words, for the chart's key and its description. */
function scaleRule(limit: number): string {
  return `z scale ±${figure(limit, 3)} on every tab; beyond it: pinned`;
}

/** Lag ticks: every lag up to 12 lags, otherwise whole-number ticks from d3. */
function lagTicks(maxLag: number): number[] {
  if (maxLag <= 12) return Array.from({ length: maxLag }, (_, i) => i + 1);
  return scaleLinear()
    .domain([1, maxLag])
    .ticks(Math.min(8, Math.floor(maxLag / 2)))
    .filter((t) => Number.isInteger(t) && t >= 1);
}

function defaultView(table: LagTable): ChartView {
  return table.subject === "squares" ? "squares" : "correlation";
}

const CAPTION_QUANTITIES: Readonly<Record<ChartView, string>> = {
  correlation: "Autocorrelation",
  partial: "Partial autocorrelation",
  squares: "Squared deviations",
};

/**
 * The chart's caption, three lines short enough for the pane's narrowest chart (260 px): what is
 * drawn against which bands; the joint test of the same values; its p as the verdict reads it,
 * with the reference it comes from (permutation, χ², Monte Carlo). The ribbon under the chart
 * shows the test lag by lag; its degrees of freedom are in the ribbon's cell titles.
 */
export function chartCaption(table: LagTable, view: ChartView = defaultView(table)): string[] {
  return [
    `${CAPTION_QUANTITIES[view]}, ${viewBandWords(table, view)}`,
    `Joint test ${jointTestName(table)} over lags 1–${table.maxLag}:`,
    referencedPPhrase(table.levels.jointP),
  ];
}

/** One sentence per fact, for the chart's <desc> and the pane's aria description. */
export function chartDescription(table: LagTable, view: ChartView = defaultView(table)): string {
  const points = lagPoints(table, view);
  const count = (zone: string) => points.filter((p) => p.zone === zone).map((p) => p.lag);
  const between = count("between");
  const beyond = count("beyond");
  const pin = zLimit(table.outerLevel);
  const pinned = points.filter((p) => Math.abs(p.z) > pin).map((p) => p.lag);
  const list = (lags: number[]) => (lags.length === 0 ? "none" : lags.join(", "));
  const name = seriesName(table.label, "prose");
  const parts = [
    `Evidence chart of the ${VIEW_QUANTITIES[view]} of ${name} at lags 1 to ${table.maxLag}, as standardised values z against ${viewBandWords(table, view)}.`,
    `One-lag corridor ±${figure(table.innerLevel, 3)}; all-lags corridor ±${figure(table.outerLevel, 3)} for ${table.maxLag} lags together.`,
    `Lags between the corridors: ${list(between)}.`,
    `Lags beyond the all-lags corridor: ${list(beyond)}.`,
    `${chartCaption(table, view).slice(1).join(" ")}.`,
  ];
  const seasonal = seasonalLags(table.season, table.maxLag);
  if (seasonal.length > 0) parts.push(`Seasonal lags marked: ${seasonal.join(", ")}.`);
  if (pinned.length > 0)
    parts.push(`Beyond ±${figure(pin, 3)} and pinned to the edge: ${list(pinned)}.`);
  parts.push(`The z scale is ±${figure(pin, 3)} on every tab.`);
  return parts.join(" ");
}

function diamond(x: number, y: number, size: number): string {
  return `M${px(x)},${px(y - size)}L${px(x + size)},${px(y)}L${px(x)},${px(y + size)}L${px(x - size)},${px(y)}Z`;
}

/** An arrowhead pointing away from the plot, its base just beyond the pinned diamond. */
function arrowhead(x: number, y: number, size: number, up: boolean): string {
  const dir = up ? -1 : 1;
  const base = y + dir * (size + 1.5);
  const tip = base + dir * 5;
  return `M${px(x - 3.5)},${px(base)}L${px(x + 3.5)},${px(base)}L${px(x)},${px(tip)}Z`;
}

/** A line of chart text in the common size. */
function chartText(
  className: string,
  x: number,
  y: number,
  fill: string,
  text: string,
  anchor?: "middle" | "end",
): string {
  return textElement(
    "text",
    {
      class: className,
      x: px(x),
      y: px(y),
      "text-anchor": anchor,
      "font-size": CHART_TEXT_PX,
      fill,
    },
    text,
  );
}

export function evidenceChartSvg(table: LagTable, options: EvidenceChartOptions = {}): string {
  const view = options.view ?? defaultView(table);
  const width = options.width ?? 320;
  const height = options.height ?? 274;
  const id = options.idPrefix ?? "echolot-evidence";
  const points = lagPoints(table, view);
  const K = table.maxLag;
  const frame = lagFrame(width);
  const top = MARGIN.top;
  const bottom = height - MARGIN.bottom;
  const limit = zLimit(table.outerLevel);
  const x = lagColumns(K, frame);
  const y = scaleLinear().domain([-limit, limit]).range([bottom, top]);
  const columnWidth = x.bandwidth();
  const centre = (lag: number) => (x(lag) ?? frame.left) + columnWidth / 2;
  const size = Math.max(2.5, Math.min(5.5, columnWidth * 0.36));

  const parts: string[] = [];
  const title = `${VIEW_QUANTITIES[view]} by lag, standardised`;
  parts.push(textElement("title", { id: `${id}-title` }, title));
  parts.push(textElement("desc", { id: `${id}-desc` }, chartDescription(table, view)));

  // The caption: what is drawn, against which bands, and the joint test with its p.
  chartCaption(table, view).forEach((line, i) => {
    parts.push(chartText("caption", 4, 13 + i * 15, PALETTE.ink, line));
  });

  // Corridors: light fills, the outer one first, the inner one on top of it (nested, flat).
  const plotWidth = frame.right - frame.left;
  const band = (level: number) => ({
    x: px(frame.left),
    y: px(y(level)),
    width: px(plotWidth),
    height: px(y(-level) - y(level)),
  });
  const corridorTitle = (name: "inner" | "outer", level: number) =>
    textElement(
      "title",
      {},
      name === "outer"
        ? `all-lags corridor ±${figure(level, 3)}: holds for all ${K} lags together (the verdict's level)`
        : `one-lag corridor ±${figure(level, 3)}: one lag on its own at alpha ${figure(table.alpha, 3)}`,
    );
  const levels = { outer: table.outerLevel, inner: table.innerLevel } as const;
  const fills = { outer: PALETTE.outerCorridor, inner: PALETTE.innerCorridor } as const;
  const edges = { outer: PALETTE.outerEdge, inner: PALETTE.innerEdge } as const;
  for (const name of ["outer", "inner"] as const) {
    parts.push(
      element(
        "rect",
        {
          class: `corridor ${name}`,
          ...band(levels[name]),
          fill: fills[name],
          "data-level": figure(levels[name], 10),
        },
        corridorTitle(name, levels[name]),
      ),
    );
  }

  // Seasonal columns over the fills, with Okabe–Ito blue edges and a tag above the plot.
  const seasonal = seasonalLags(table.season, K);
  seasonal.forEach((lag, i) => {
    const tag = i === 0 ? "m" : "2m";
    parts.push(
      element(
        "rect",
        {
          class: "season",
          x: px(x(lag) ?? 0),
          y: px(top),
          width: px(columnWidth),
          height: px(bottom - top),
          fill: PALETTE.seasonalTint,
          "fill-opacity": "0.75",
          stroke: PALETTE.seasonalEdge,
          "stroke-width": 1,
          "data-lag": lag,
        },
        textElement("title", {}, `seasonal lag ${lag} (${tag}, season ${table.season})`),
      ),
    );
  });
  seasonal.forEach((lag, i) => {
    parts.push(
      textElement(
        "text",
        {
          class: "season-tag",
          x: px(centre(lag)),
          y: px(top - 4),
          "text-anchor": "middle",
          "font-size": CHART_TEXT_PX,
          fill: PALETTE.seasonalEdge,
          "data-lag": lag,
        },
        i === 0 ? "m" : "2m",
      ),
    );
  });

  // The corridors' edges, solid, over the tint: they carry the corridors' contrast.
  for (const name of ["outer", "inner"] as const) {
    parts.push(
      element("rect", {
        class: `corridor-edge ${name}`,
        ...band(levels[name]),
        fill: "none",
        stroke: edges[name],
        "stroke-width": 1,
      }),
    );
  }

  // y ticks (d3) as labels with short tick marks; no grid, no zero line.
  const yTicks = y.ticks(5);
  const yFormat = y.tickFormat(5);
  for (const t of yTicks) {
    parts.push(
      element("line", {
        class: "tick",
        x1: px(frame.left - 4),
        x2: px(frame.left),
        y1: px(y(t)),
        y2: px(y(t)),
        stroke: PALETTE.muted,
        "stroke-width": 1,
      }),
    );
    parts.push(chartText("tick-label", frame.left - 6, y(t) + 4, PALETTE.ink, yFormat(t), "end"));
  }
  parts.push(chartText("axis-title", 4, top - 4, PALETTE.muted, "z"));

  // x ticks.
  for (const t of lagTicks(K)) {
    parts.push(chartText("tick-label", centre(t), bottom + 15, PALETTE.ink, String(t), "middle"));
  }
  parts.push(chartText("axis-title", frame.right, bottom + 29, PALETTE.muted, "lag", "end"));

  // The diamonds, one per lag with a defined value.
  for (const p of points) {
    if (p.zone === "none") continue;
    const pinned = Math.abs(p.z) > limit;
    const shownZ = pinned ? Math.sign(p.z) * limit : p.z;
    const cx = centre(p.lag);
    const cy = y(shownZ);
    const label = `lag ${p.lag}: ${VIEW_QUANTITIES[view]} ${signed(p.value)}, z = ${signed(p.z)}, ${ZONE_WORDS[p.zone]}${pinned ? `; beyond ±${figure(limit, 3)}, pinned to the edge` : ""}`;
    parts.push(
      element(
        "path",
        {
          class: `lag ${p.zone}${pinned ? " pinned" : ""}`,
          d: diamond(cx, cy, size),
          fill: ZONE_COLOURS[p.zone],
          stroke: PALETTE.page,
          "stroke-width": 0.8,
          "data-lag": p.lag,
          "data-z": figure(p.z),
        },
        textElement("title", {}, label),
      ),
    );
    if (pinned) {
      parts.push(
        element("path", {
          class: "arrowhead",
          d: arrowhead(cx, cy, size, p.z > 0),
          fill: ZONE_COLOURS[p.zone],
          "data-lag": p.lag,
        }),
      );
    }
  }

  // The key, under the axis: the numbers behind the two corridors, and the y-scale rule.
  parts.push(
    chartText(
      "key",
      4,
      height - 18,
      PALETTE.muted,
      `corridors: one lag ±${figure(table.innerLevel, 3)} · all ${K} lags ±${figure(table.outerLevel, 3)}`,
    ),
  );
  parts.push(chartText("key scale-rule", 4, height - 4, PALETTE.muted, scaleRule(limit)));

  return svgRoot(`evidence-chart view-${view}`, width, height, id, parts.join(""), {
    "data-inner": figure(table.innerLevel, 10),
    "data-outer": figure(table.outerLevel, 10),
    "data-z-limit": figure(limit, 10),
  });
}

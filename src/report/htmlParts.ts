/**
 * HTML fragments shared by the pane and the standalone HTML report: the verdict badge (word,
 * shape and colour together), the figures table that repeats each chart as text, and the
 * explanation. Every text is escaped; colours come from the palette as SVG presentation
 * attributes, so the fragments need no inline style (the pane's CSP forbids it).
 */
import {
  formatNumber,
  formatP,
  rankedRows,
  type BatchCheck,
  type LagTable,
  type VerdictWord,
} from "../core";
import { escapeMarkup } from "./escape";
import type { Explanation } from "./explain";
import { jointTestName, lagPoints, VIEW_QUANTITIES, type ChartView } from "./lagViews";
import { PALETTE, ZONE_COLOURS, ZONE_SHORT, type Zone } from "./palette";
import { sideFindings, type SideChecks } from "./sideChecks";
import { element, figure, signed, textElement } from "./svg";
import { BADGES } from "./verdictBadge";

/** The badge's shape drawn in its colour: ● clear, ▲ watch, ■ structure, ◌ short. */
function badgeShape(word: VerdictWord): string {
  const { colour } = BADGES[word];
  switch (word) {
    case "clear":
      return element("circle", { cx: 7, cy: 7, r: 6, fill: colour });
    case "watch":
      return element("path", { d: "M7,0.8L13.4,12.6L0.6,12.6Z", fill: colour });
    case "structure":
      return element("rect", { x: 1, y: 1, width: 12, height: 12, fill: colour });
    case "short":
      return element("circle", {
        cx: 7,
        cy: 7,
        r: 5.5,
        fill: "none",
        stroke: colour,
        "stroke-width": 1.6,
        "stroke-dasharray": "2 1.6",
      });
  }
}

/** The verdict badge: shape and word, or the headline's title ("clear, biased") beside the shape. */
export function badgeHtml(word: VerdictWord, title: string = word): string {
  const badge = BADGES[word];
  const shape = element(
    "svg",
    { class: "badge-shape", width: 14, height: 14, viewBox: "0 0 14 14", "aria-hidden": "true" },
    badgeShape(word),
  );
  return element(
    "span",
    { class: `badge badge-${word}`, "data-word": word, title: `verdict: ${badge.shape} ${title}` },
    `${shape}${textElement("span", { class: "badge-word" }, title)}`,
  );
}

function pHtmlCell(p: number): string {
  return textElement("td", {}, Number.isNaN(p) ? "—" : formatP(p));
}

/**
 * The chart's figures as a table: the text alternative that sits under each chart. Per lag only:
 * the joint test over lags 1..k has its own table (`jointSpanTableHtml`).
 */
export function figuresTableHtml(table: LagTable, view: ChartView): string {
  const points = lagPoints(table, view);
  const withTests = view !== "partial";
  const headers = [
    "lag",
    view === "partial" ? "partial" : "r",
    "z",
    "corridor",
    ...(withTests ? ["p (this lag)", `p (Šidák, ${table.maxLag} lags)`] : []),
  ];
  const head = element(
    "tr",
    {},
    headers.map((h) => textElement("th", { scope: "col" }, h)).join(""),
  );
  const body = points
    .map((p, i) => {
      const row = table.rows[i];
      const cells = [
        textElement("th", { scope: "row" }, String(p.lag)),
        textElement("td", {}, signed(p.value, 4)),
        textElement("td", {}, signed(p.z, 3)),
        textElement("td", { class: `zone-${p.zone}` }, ZONE_SHORT[p.zone]),
        ...(withTests && row !== undefined ? [pHtmlCell(row.pLag), pHtmlCell(row.pSidak)] : []),
      ];
      return element("tr", {}, cells.join(""));
    })
    .join("");
  const caption = `${VIEW_QUANTITIES[view]}, lags 1–${table.maxLag}; corridors ±${figure(table.innerLevel, 3)} (one lag) and ±${figure(table.outerLevel, 3)} (all lags)`;
  return element(
    "table",
    { class: "figures" },
    `${textElement("caption", {}, caption)}<thead>${head}</thead><tbody>${body}</tbody>`,
  );
}

/** The joint test by lag span as a table: the ribbon's figures, one row per k. */
export function jointSpanTableHtml(table: LagTable): string {
  const head = element(
    "tr",
    {},
    ["lags", "Q", "df", "p"].map((h) => textElement("th", { scope: "col" }, h)).join(""),
  );
  const body = table.rows
    .map((row) =>
      element(
        "tr",
        { class: row.lag === table.maxLag ? "chosen" : undefined },
        [
          textElement("th", { scope: "row" }, `1–${row.lag}`),
          textElement("td", {}, Number.isNaN(row.jointP) ? "—" : formatNumber(row.jointQ, 4)),
          textElement("td", {}, Number.isNaN(row.jointP) ? "—" : String(row.jointDf)),
          pHtmlCell(row.jointP),
        ].join(""),
      ),
    )
    .join("");
  const caption = `Joint test by lag span: ${jointTestName(table)} over lags 1..k; the verdict reads k = ${table.maxLag}`;
  return element(
    "table",
    { class: "figures spans" },
    `${textElement("caption", {}, caption)}<thead>${head}</thead><tbody>${body}</tbody>`,
  );
}

/** The side checks as a table: each check, whether it flags, and its finding in words. */
export function sideChecksHtml(checks: SideChecks): string {
  const rows = sideFindings(checks)
    .map(({ name, finding }) => {
      const flag = typeof finding === "string" ? "not computed" : finding.flagged ? "flag" : "ok";
      const text = typeof finding === "string" ? finding : finding.text;
      return element(
        "tr",
        { class: `side-${flag === "flag" ? "flag" : "ok"}` },
        [
          textElement("th", { scope: "row" }, name),
          textElement("td", { class: "side-word" }, flag),
          textElement("td", { class: "side-text" }, text),
        ].join(""),
      );
    })
    .join("");
  return element(
    "table",
    { class: "side-checks" },
    `${textElement("caption", {}, `Side checks at alpha ${formatNumber(checks.alpha, 3)}`)}<tbody>${rows}</tbody>`,
  );
}

/** The explanation as paragraphs, each led by its heading. */
export function explanationHtml(explanation: Explanation): string {
  return element(
    "div",
    { class: "explanation" },
    explanation.items
      .map((item) =>
        element(
          "p",
          { class: `explain-${item.topic}` },
          `${textElement("strong", {}, item.heading)} ${escapeMarkup(item.text)}`,
        ),
      )
      .join(""),
  );
}

const LEGEND_WORDS: Readonly<Record<Zone, string>> = {
  inside: "inside the one-lag corridor",
  between: "between the corridors",
  beyond: "beyond the all-lags corridor",
};

function swatch(inner: string): string {
  return element(
    "svg",
    { width: 12, height: 12, viewBox: "0 0 12 12", "aria-hidden": "true" },
    inner,
  );
}

/** The chart's key in words and swatches (the chart itself also names each diamond's zone). */
export function zoneLegendHtml(table: LagTable): string {
  const zones = (["inside", "between", "beyond"] as const).map((zone) =>
    element(
      "span",
      {},
      swatch(element("path", { d: "M6,1L11,6L6,11L1,6Z", fill: ZONE_COLOURS[zone] })) +
        escapeMarkup(LEGEND_WORDS[zone]),
    ),
  );
  if (table.season !== null) {
    zones.push(
      element(
        "span",
        {},
        swatch(
          element("rect", {
            x: 1,
            y: 0,
            width: 10,
            height: 12,
            fill: PALETTE.seasonalTint,
            stroke: PALETTE.seasonalEdge,
          }),
        ) + escapeMarkup(`seasonal lags m = ${table.season}, 2m = ${2 * table.season}`),
      ),
    );
  }
  return zones.join("");
}

/**
 * The batch view: one row per series in the core's ranked order (batchRanking.ts), each with its
 * headline across the batch (batchHeadline.ts).
 */
export function batchTableHtml(batch: BatchCheck): string {
  const order = rankedRows(batch);
  const head = element(
    "tr",
    {},
    ["series", "n", "p", "q-value", "verdict"]
      .map((h) => textElement("th", { scope: "col" }, h))
      .join(""),
  );
  const body = order
    .map((row) => {
      const { headline } = row;
      const verdict =
        headline === null
          ? textElement("td", { title: row.reason }, "not analysed")
          : element(
              "td",
              { title: headline.finding, "data-word": headline.word },
              escapeMarkup(`${BADGES[headline.word].shape} ${headline.title}`),
            );
      return element(
        "tr",
        { class: row.kept || headline?.biased === true ? "flagged" : undefined },
        [
          textElement("th", { scope: "row" }, row.label),
          textElement("td", {}, String(row.n)),
          pHtmlCell(row.p),
          pHtmlCell(row.qValue),
          verdict,
        ].join(""),
      );
    })
    .join("");
  const caption = `${batch.analysed} series analysed: ${batch.flaggedRaw} with p below ${formatNumber(batch.alpha, 3)} on their own, ${batch.flaggedFdr} still flagged after the Benjamini–Hochberg false-discovery correction (q-value at most ${formatNumber(batch.alpha, 3)}).`;
  return element(
    "table",
    { class: "figures batch" },
    `${textElement("caption", {}, caption)}<thead>${head}</thead><tbody>${body}</tbody>`,
  );
}

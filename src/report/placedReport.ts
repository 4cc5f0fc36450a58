/**
 * What "Place live report" and "Place snapshot" write on a new sheet, as a plan the pane's host
 * glue carries out cell by cell: the title, source and settings, the verdict, the joint test and
 * the lag table — as ECHOLOT formulas that reference the source range (live) or as values
 * (snapshot) — beside a small block that feeds a native chart in our palette: the two corridors
 * as stacked areas and the standardised values as diamonds in three series (inside, between,
 * beyond), so the chart keeps its colours when the data change.
 *
 * Pure: no Office types. Rows and columns are 0-based offsets from A1 of the new sheet.
 */
import { formatP, seriesName, TEST_NAMES, type LagTable } from "../core";
import { cellAddress, columnLetters, rangeAddress } from "./a1Address";
import { explainVerdict, type Explanation } from "./explain";
import { LAG_TABLE_Z_COLUMN, lagTableHeader, lagTableValues } from "./lagTableHeader";
import { PALETTE } from "./palette";
import { SCREENING_CAUTION } from "./verdictBadge";

export type PlanCellContent = { readonly formula: string } | { readonly value: string | number };

export interface PlanCell {
  readonly row: number;
  readonly column: number;
  readonly content: PlanCellContent;
}

export type PlanSeriesKind = "corridor-base" | "outer" | "inner" | "inside" | "between" | "beyond";

export interface PlanChartSeries {
  readonly kind: PlanSeriesKind;
  readonly name: string;
  /** Values, an A1 range on the report sheet. */
  readonly values: string;
  /** Fill (areas) or marker colour (diamonds); undefined for the invisible base. */
  readonly colour: string | undefined;
  readonly type: "area" | "diamonds";
}

export interface PlanChart {
  readonly title: string;
  /** The lag column, an A1 range on the report sheet. */
  readonly categories: string;
  /** The corridor block (header row included) the chart is created from. */
  readonly corridorSource: string;
  readonly series: readonly PlanChartSeries[];
  /** Top-left and bottom-right cells of the chart's position. */
  readonly from: string;
  readonly to: string;
}

export interface ReportPlan {
  readonly kind: "live" | "snapshot";
  /** The sheet name to start from; the host makes it unique. */
  readonly sheetName: string;
  /** Rows × columns from A1 that must be empty before anything is written. */
  readonly extent: { readonly rows: number; readonly columns: number };
  readonly cells: readonly PlanCell[];
  readonly chart: PlanChart;
}

/** The source of a live report: the range the pane read, as an absolute sheet-qualified address. */
export interface ReportSource {
  /** For example `'Forecast errors'!$B$1:$B$105`. */
  readonly reference: string;
}

const ZONE_ORDER = ["inside", "between", "beyond"] as const;

/**
 * The helper block's columns from column I on, left to right, and the chart series each feeds:
 * the invisible base, the stacked corridors, then the diamonds of the three zones in ZONE_ORDER.
 */
const HELPER_SERIES: readonly Omit<PlanChartSeries, "values">[] = [
  { kind: "corridor-base", name: "corridor base", colour: undefined, type: "area" },
  { kind: "outer", name: "all-lags corridor, lower", colour: PALETTE.outerCorridor, type: "area" },
  { kind: "inner", name: "one-lag corridor", colour: PALETTE.innerCorridor, type: "area" },
  { kind: "outer", name: "all-lags corridor, upper", colour: PALETTE.outerCorridor, type: "area" },
  { kind: "inside", name: "inside", colour: PALETTE.inside, type: "diamonds" },
  { kind: "between", name: "between corridors", colour: PALETTE.watch, type: "diamonds" },
  { kind: "beyond", name: "beyond all-lags corridor", colour: PALETTE.structure, type: "diamonds" },
];

const TABLE_ROW = 8; // row 9: the spilled lag table's header
const HELPER_COLUMN = 8; // column I
const LEVEL_COLUMN = 16; // column Q (labels) and R (values)

/** Characters a sheet name may not hold, and its length limit (31). */
const SHEET_NAME_FORBIDDEN = /[:\\/?*[\]]/g;
const SHEET_NAME_LIMIT = 31;

/** A sheet name for the report, unique (case-insensitively) among `existing`. */
export function uniqueSheetName(label: string, existing: readonly string[]): string {
  const cleaned = label.replace(SHEET_NAME_FORBIDDEN, " ").replace(/\s+/g, " ").trim();
  const base = cleaned === "" ? "Echolot report" : `Echolot ${cleaned}`.replace(/^'+|'+$/g, "");
  const taken = new Set(existing.map((name) => name.toLowerCase()));
  for (let i = 1; ; i++) {
    const suffix = i === 1 ? "" : ` (${i})`;
    // Cut to the length limit; a name may not end with an apostrophe either.
    const cut = base.slice(0, SHEET_NAME_LIMIT - suffix.length).replace(/[\s']+$/, "");
    const name = `${cut}${suffix}`;
    if (!taken.has(name.toLowerCase())) return name;
  }
}

/**
 * `=ECHOLOT.NAME(series,arg,…)`: numbers as written, keywords quoted, an omitted argument left
 * empty between commas (the host passes it as null) and trailing omitted ones dropped.
 */
export function echolotFormula(
  name: string,
  series: string,
  args: readonly (string | number | null)[],
): string {
  const list = args.map((a) => (a === null ? "" : typeof a === "number" ? String(a) : `"${a}"`));
  while (list.length > 0 && list[list.length - 1] === "") list.pop();
  return `=ECHOLOT.${name}(${[series, ...list].join(",")})`;
}

export interface LiveFormulas {
  readonly noiseCheck: string;
  readonly lagTable: string;
  readonly portmanteau: string;
}

/** The three formulas of a live report, as written on the sheet. K is always explicit. */
export function liveReportFormulas(table: LagTable, source: ReportSource): LiveFormulas {
  const series = source.reference;
  const { maxLag, alpha, season, fittedParams, bandKind, testKind } = table;
  return {
    // Season 0 means none: the formula never relies on an empty argument between commas.
    noiseCheck: echolotFormula("SERIESNOISECHECK", series, [
      maxLag,
      season ?? 0,
      fittedParams,
      alpha,
    ]),
    lagTable: echolotFormula("SERIESLAGTABLE", series, [maxLag, alpha, bandKind, season]),
    portmanteau: echolotFormula("SERIESPORTMANTEAU", series, [maxLag, fittedParams, testKind]),
  };
}

function settingsText(table: LagTable): string {
  return [
    `maxLag ${table.maxLag}`,
    `alpha ${table.alpha}`,
    `bandKind ${table.bandKind}`,
    `testKind ${table.testKind}`,
    `season ${table.season ?? "none"}`,
    `fittedParams ${table.fittedParams}`,
  ].join(", ");
}

function numberOrEmpty(x: number): number | string {
  return Number.isFinite(x) ? x : "";
}

export function liveReportPlan(table: LagTable, source: ReportSource): ReportPlan {
  return buildPlan(table, "live", source);
}

export function snapshotReportPlan(table: LagTable, explanation?: Explanation): ReportPlan {
  return buildPlan(table, "snapshot", undefined, explanation ?? explainVerdict(table));
}

function buildPlan(
  table: LagTable,
  kind: "live" | "snapshot",
  source: ReportSource | undefined,
  explanation?: Explanation,
): ReportPlan {
  const K = table.maxLag;
  const cells: PlanCell[] = [];
  const put = (row: number, column: number, content: PlanCellContent) =>
    cells.push({ row, column, content });
  const text = (row: number, column: number, value: string | number) => put(row, column, { value });
  const name = seriesName(table.label, "cell");

  text(0, 0, kind === "live" ? `Echolot live report: ${name}` : `Echolot snapshot: ${name}`);
  text(1, 0, "Source");
  text(1, 1, source?.reference ?? `values at the time of placing (${table.n} values)`);
  text(2, 0, "Settings");
  text(2, 1, settingsText(table));
  if (kind === "live") {
    text(3, 0, "Note");
    text(
      3,
      1,
      "The verdict formula judges with noise bands and Ljung–Box; the lag table uses the band kind above. These cells recompute when the source changes.",
    );
  }
  text(4, 0, "Verdict");
  text(5, 0, "Joint test");
  text(5, 1, "Q");
  text(5, 2, "df");
  text(5, 3, "p");
  text(6, 0, `${TEST_NAMES[table.testKind]}, lags 1–${K}`);

  if (kind === "live" && source !== undefined) {
    const formulas = liveReportFormulas(table, source);
    put(4, 1, { formula: formulas.noiseCheck });
    put(6, 1, { formula: formulas.portmanteau });
    put(TABLE_ROW, 0, { formula: formulas.lagTable });
  } else {
    text(4, 1, table.verdict.word);
    text(4, 2, table.verdict.reason);
    text(6, 1, numberOrEmpty(table.joint.q));
    text(6, 2, table.joint.df);
    text(6, 3, numberOrEmpty(table.joint.p));
    lagTableHeader(table).forEach((h, c) => text(TABLE_ROW, c, h));
    table.rows.forEach((r, i) => {
      lagTableValues(r).forEach((v, c) =>
        text(TABLE_ROW + 1 + i, c, typeof v === "number" ? numberOrEmpty(v) : v),
      );
    });
  }

  // The corridor levels, and the block the chart draws from.
  const innerCell = cellAddress(TABLE_ROW, LEVEL_COLUMN + 1, true);
  const outerCell = cellAddress(TABLE_ROW + 1, LEVEL_COLUMN + 1, true);
  text(TABLE_ROW, LEVEL_COLUMN, "one-lag level");
  text(TABLE_ROW, LEVEL_COLUMN + 1, table.innerLevel);
  text(TABLE_ROW + 1, LEVEL_COLUMN, `all-lags level (${K} lags)`);
  text(TABLE_ROW + 1, LEVEL_COLUMN + 1, table.outerLevel);

  HELPER_SERIES.forEach((h, i) => text(TABLE_ROW, HELPER_COLUMN + i, h.name));
  const gap = table.outerLevel - table.innerLevel;
  table.rows.forEach((r, i) => {
    const row = TABLE_ROW + 1 + i;
    text(row, HELPER_COLUMN, -table.outerLevel);
    text(row, HELPER_COLUMN + 1, gap);
    text(row, HELPER_COLUMN + 2, 2 * table.innerLevel);
    text(row, HELPER_COLUMN + 3, gap);
    if (kind === "live") {
      const z = `$${columnLetters(LAG_TABLE_Z_COLUMN)}${row + 1}`; // the spilled table's z
      const guard = (test: string) => ({
        formula: `=IF(ISNUMBER(${z}),IF(${test},${z},NA()),NA())`,
      });
      put(row, HELPER_COLUMN + 4, guard(`ABS(${z})<=${innerCell}`));
      put(row, HELPER_COLUMN + 5, guard(`AND(ABS(${z})>${innerCell},ABS(${z})<=${outerCell})`));
      put(row, HELPER_COLUMN + 6, guard(`ABS(${z})>${outerCell}`));
    } else {
      // An infinite z has no place in a chart's cell: it is left out like a lag with no pairs.
      const zone = Number.isFinite(r.z) ? r.zone : "none";
      ZONE_ORDER.forEach((z, j) => text(row, HELPER_COLUMN + 4 + j, zone === z ? r.z : ""));
    }
  });

  const firstDataRow = TABLE_ROW + 1;
  const column = (c: number) => rangeAddress(firstDataRow, c, K, 1);
  const series: PlanChartSeries[] = HELPER_SERIES.map((h, i) => ({
    kind: h.kind,
    name: h.name,
    values: column(HELPER_COLUMN + i),
    colour: h.colour,
    type: h.type,
  }));

  const chartTop = firstDataRow + K + 1;
  const chartRows = 18;
  const chart: PlanChart = {
    title: `Evidence: z by lag${kind === "live" ? " (live)" : ""}`,
    categories: column(0),
    corridorSource: rangeAddress(TABLE_ROW, HELPER_COLUMN, K + 1, 4),
    series,
    from: cellAddress(chartTop, 0),
    to: cellAddress(chartTop + chartRows, 6),
  };

  let row = chartTop + chartRows + 2;
  if (explanation !== undefined) {
    text(row++, 0, "Explanation");
    for (const item of explanation.items) {
      if (item.topic === "screening") continue;
      text(row, 0, item.heading);
      text(row++, 1, item.text);
    }
  }
  text(row++, 0, SCREENING_CAUTION);
  if (kind === "snapshot") {
    text(
      row++,
      0,
      `Joint p at K = ${K}: ${formatP(table.joint.p)}. Values only: this sheet does not recompute.`,
    );
  }

  return {
    kind,
    sheetName: table.label,
    extent: { rows: row, columns: LEVEL_COLUMN + 2 },
    cells,
    chart,
  };
}

/**
 * The cells of one portable report block (see portablePlan.ts for what they compute and why):
 * the header, the verdict and its reason, the figures list, the lag table, the chart's helper
 * columns and one row of helper formulas per data cell. Echolot's own figures are recorded
 * under the keys the cells carry, so a test can compare what a spreadsheet computes.
 */
import {
  pairCounts,
  seriesName,
  TEST_NAMES,
  type LagRow,
  type LagTable,
  type Series,
} from "../core";
import { absoluteCell, absoluteColumn, textLiteral } from "./portableFormulas";
import { reasonFormula, standardErrorFormula, termFormula } from "./portableLagFormulas";
import {
  COL,
  addInPermutes,
  PERMUTATION_NOTE,
  FIGURE_LABELS,
  FIGURE_ROWS,
  HELP,
  HELP_HEADERS,
  PIN,
  PORTABLE_FORMATS,
  PORTABLE_TEST_KINDS,
  ROW,
  TABLE_HEADERS,
  type FigureRow,
} from "./portableLayout";
import type {
  Figure,
  PortableCell,
  PortableOptions,
  PortableSource,
  PortableStyle,
} from "./portableTypes";
import type { PlanCellContent } from "./placedReport";
import { SCREENING_CAUTION } from "./verdictBadge";

/** The core's zone of a lag, or "" where the sheet's z is not a number (no pairs, or infinite). */
function zoneCell(row: LagRow): string {
  return Number.isFinite(row.z) ? row.zone : "";
}

/**
 * The sheet's verdict formula, evaluated on Echolot's figures: short, then structure (the χ² p
 * below the written joint level, or a lag beyond the all-lags corridor), then watch, else clear.
 */
function sheetVerdict(f: (name: FigureRow) => Figure | undefined): string {
  const num = (name: FigureRow) => f(name) as number;
  if (num("n") < 20 || num("maxLag") > num("n") / 4) return "short";
  const p = f("p");
  if ((typeof p === "number" && p < num("jointLevel")) || num("outerCount") > 0) {
    return "structure";
  }
  const excess = num("crossings") > 0 && num("chance") < num("alpha");
  return f("lagOne") === "yes" || f("seasonal") === "yes" || excess ? "watch" : "clear";
}

function finiteOr(x: number): Figure {
  return Number.isFinite(x) ? x : "";
}

/** The cells of one report block; Echolot's figures go into `figures` under the block's keys. */
export function portableBlock(
  table: LagTable,
  series: Series,
  source: PortableSource,
  options: PortableOptions,
  figures: Map<string, Figure>,
): PortableCell[] {
  if (table.subject !== "series" || table.testKind === "squares") {
    throw new Error(
      `a portable report computes the ${PORTABLE_TEST_KINDS.join(", ")} tests; the squares' test needs the add-in`,
    );
  }
  const origin = options.origin ?? { row: 0, column: 0 };
  const key = (name: string) => `${options.key ?? ""}${name}`;
  const K = table.maxLag;
  const L = source.rows;
  const cells: PortableCell[] = [];
  const put = (
    row: number,
    column: number,
    content: PlanCellContent,
    extra: Omit<PortableCell, "row" | "column" | "content"> = {},
  ) => cells.push({ row: origin.row + row, column: origin.column + column, content, ...extra });
  const text = (row: number, column: number, value: string, style?: PortableStyle) =>
    put(row, column, { value }, style === undefined ? {} : { style });
  const cell = (row: number, column: number) =>
    absoluteCell(origin.row + row, origin.column + column);

  // Where things are.
  const figureRow = (name: FigureRow) => ROW.figures + FIGURE_ROWS.indexOf(name);
  const fig = (name: FigureRow) => cell(figureRow(name), 1);
  const tableTop = ROW.figures + FIGURE_ROWS.length + 2;
  const firstLagRow = tableTop + 1;
  const lagColumn = (c: number) => absoluteColumn(origin.row + firstLagRow, origin.column + c, K);
  const lagCell = (k: number, c: number) => cell(firstLagRow + k - 1, c);
  const helpColumn = (c: number) => absoluteColumn(origin.row + firstLagRow, origin.column + c, L);
  const src = absoluteColumn(source.firstRow, source.column, L, source.sheet);
  const srcCell = (i: number) => absoluteCell(source.firstRow + i, source.column, source.sheet);
  const name = seriesName(table.label, "cell");

  // The header: what it is.
  text(ROW.title, 0, `Echolot portable report: ${name}`, "title");
  text(
    ROW.computes,
    0,
    `Lag correlations of ${src} over the pairs where both values exist (a blank, #N/A or text cell is a gap), their bands, the ${TEST_NAMES[table.testKind]} joint test over ${K} lags with its χ² p, the two corridors, the count of crossings against chance, and the verdict.`,
    "note",
  );
  text(
    ROW.live,
    0,
    `Written in the spreadsheet's own functions: it recomputes when the data change, with or without the Echolot add-in, in Excel, LibreOffice Calc or Google Sheets. ${options.roomToGrow === true ? "The data range runs past the last value: values added below it are included." : "It reads exactly the cells of the data range: to cover more rows, place a new report."}`,
    "note",
  );
  text(ROW.caution, 0, SCREENING_CAUTION, "note");
  text(ROW.placed, 0, `Placed on ${options.placedOn} by Echolot.`, "note");

  // The figures list.
  FIGURE_ROWS.forEach((f) => text(figureRow(f), 0, FIGURE_LABELS[f]));
  const figure = (
    f: FigureRow,
    content: PlanCellContent,
    expected: Figure | undefined,
    format?: string,
  ) => {
    const extra: { figure?: string; format?: string } = {};
    if (expected !== undefined) {
      extra.figure = key(f);
      figures.set(key(f), expected);
    }
    if (format !== undefined) extra.format = format;
    put(figureRow(f), 1, content, extra);
  };
  const n = fig("n");
  const inner = fig("innerLevel");
  const outer = fig("outerLevel");
  const alpha = fig("alpha");
  const tested = fig("tested");
  const crossings = fig("crossings");
  figure("source", { value: src }, undefined);
  figure("n", { formula: `=COUNT(${src})` }, table.n, PORTABLE_FORMATS.count);
  const where = helpColumn(HELP.where);
  figure(
    "gaps",
    { formula: `=IF(${n}=0,0,MAX(${where})-MIN(${where})+1-${n})` },
    table.gaps,
    PORTABLE_FORMATS.count,
  );
  figure("mean", { formula: `=SUM(${helpColumn(HELP.value)})/${n}` }, table.mean);
  figure("c0", { formula: `=SUMSQ(${helpColumn(HELP.deviation)})` }, table.variance * table.n);
  figure("maxLag", { value: K }, K);
  figure("alpha", { value: table.alpha }, table.alpha);
  figure("season", { value: table.season ?? "none" }, undefined);
  figure("fittedParams", { value: table.fittedParams }, undefined);
  figure("bandKind", { value: table.bandKind }, undefined);
  figure("testKind", { value: TEST_NAMES[table.testKind] }, undefined);
  figure("innerLevel", { value: table.innerLevel }, table.innerLevel, PORTABLE_FORMATS.fixed);
  figure("outerLevel", { value: table.outerLevel }, table.outerLevel, PORTABLE_FORMATS.fixed);
  figure("jointLevel", { value: table.jointLevel }, table.jointLevel, PORTABLE_FORMATS.fixed);
  const lastLag = firstLagRow + K - 1;
  figure(
    "Q",
    { formula: `=${cell(lastLag, COL.jointQ)}` },
    table.joint.q,
    PORTABLE_FORMATS.statistic,
  );
  figure(
    "df",
    { formula: `=${cell(lastLag, COL.jointDf)}` },
    table.joint.df,
    PORTABLE_FORMATS.count,
  );
  figure(
    "p",
    { formula: `=${cell(lastLag, COL.jointP)}` },
    finiteOr(table.joint.p),
    PORTABLE_FORMATS.p,
  );
  const note = table.falseAlarm;
  figure("tested", { formula: `=COUNT(${lagColumn(COL.z)})` }, note.tested, PORTABLE_FORMATS.count);
  figure("expected", { formula: `=${tested}*${alpha}` }, note.expected, PORTABLE_FORMATS.fixed);
  const zones = lagColumn(COL.zone);
  figure(
    "crossings",
    { formula: `=COUNTIF(${zones},"between")+COUNTIF(${zones},"beyond")` },
    note.crossings,
    PORTABLE_FORMATS.count,
  );
  figure(
    "outerCount",
    { formula: `=COUNTIF(${zones},"beyond")` },
    table.rows.filter((row) => row.outer).length,
    PORTABLE_FORMATS.count,
  );
  figure(
    "chance",
    {
      formula: `=IF(${crossings}=0,1,SUMIF(${lagColumn(COL.lag)},">="&${crossings},${lagColumn(COL.pmf)}))`,
    },
    note.chance,
    PORTABLE_FORMATS.p,
  );
  const crosses = (k: number) =>
    `OR(${lagCell(k, COL.zone)}="between",${lagCell(k, COL.zone)}="beyond")`;
  // Lag 1 and the seasonal lags as the sheet judges them: beyond the one-lag corridor.
  const crossesInner = (k: number) => table.rows[k - 1]?.crossesBand === true;
  figure("lagOne", { formula: `=IF(${crosses(1)},"yes","no")` }, crossesInner(1) ? "yes" : "no");
  const seasonal =
    table.season === null ? [] : [table.season, 2 * table.season].filter((m) => m <= K);
  figure(
    "seasonal",
    seasonal.length === 0
      ? { value: "not tested" }
      : { formula: `=IF(OR(${seasonal.map(crosses).join(",")}),"yes","no")` },
    seasonal.length === 0 ? "not tested" : seasonal.some(crossesInner) ? "yes" : "no",
  );

  // The verdict: the add-in's rules (verdict.ts) at the levels written above, on the χ² p.
  const p = fig("p");
  const verdictCell = cell(ROW.verdict, 1);
  text(ROW.verdict, 0, "Verdict", "heading");
  put(
    ROW.verdict,
    1,
    {
      formula: `=IF(OR(${n}<20,${K}>${n}/4),"short",IF(OR(${p}<${fig("jointLevel")},${fig("outerCount")}>0),"structure",IF(OR(${fig("lagOne")}="yes",${fig("seasonal")}="yes",AND(${crossings}>0,${fig("chance")}<${alpha})),"watch","clear")))`,
    },
    { style: "verdict", figure: key("verdict") },
  );
  figures.set(
    key("verdict"),
    sheetVerdict((name) => figures.get(key(name))),
  );
  figures.set(key("addInVerdict"), table.verdict.word);
  put(ROW.verdict, 2, { formula: reasonFormula(table, verdictCell, fig) });
  put(
    ROW.exact,
    1,
    {
      formula: `=IF(${addInPermutes(n, fig("maxLag"), fig("fittedParams"), alpha)},${textLiteral(PERMUTATION_NOTE)},${textLiteral("For a series this long (n·K > 250,000), with fitted parameters or at α below 0.001 the add-in too reads the joint p from χ².")})`,
    },
    { style: "note" },
  );

  // The lag table.
  (Object.keys(COL) as (keyof typeof COL)[]).forEach((c) =>
    text(tableTop, COL[c], TABLE_HEADERS[c], "heading"),
  );
  const pairs = pairCounts(series, K);
  const c0 = fig("c0");
  const lagSum = (helper: number, k: string) => {
    const h = helpColumn(helper);
    const [first, last] = h.split(":") as [string, string];
    const from = `INDEX(${first}:${last},`;
    return `SUMPRODUCT(${from}1+${k}):${from}${L}),${from}1):${from}${L}-${k}))`;
  };
  table.rows.forEach((row, i) => {
    const k = row.lag;
    const r = firstLagRow + i;
    const at = (c: number) => cell(r, c);
    const lag = at(COL.lag);
    const expect = (
      c: keyof typeof COL,
      content: PlanCellContent,
      value: Figure,
      format?: string,
    ) => {
      figures.set(key(`${c}.${k}`), value);
      put(r, COL[c], content, {
        figure: key(`${c}.${k}`),
        ...(format === undefined ? {} : { format }),
      });
    };
    put(r, COL.lag, { value: k }, { format: PORTABLE_FORMATS.count });
    expect(
      "pairs",
      { formula: `=${lagSum(HELP.present, lag)}` },
      pairs[k] as number,
      PORTABLE_FORMATS.count,
    );
    expect(
      "r",
      { formula: `=IF(${at(COL.pairs)}>0,${lagSum(HELP.deviation, lag)}/${c0},"")` },
      finiteOr(row.correlation),
      PORTABLE_FORMATS.fixed,
    );
    put(
      r,
      COL.robustVar,
      { formula: `=${lagSum(HELP.square, lag)}/${c0}^2` },
      { format: PORTABLE_FORMATS.fixed },
    );
    const earlier = i === 0 ? undefined : `${cell(firstLagRow, COL.r)}:${cell(r - 1, COL.r)}`;
    expect(
      "se",
      { formula: `=${standardErrorFormula(table, earlier, n, at)}` },
      row.standardError,
      PORTABLE_FORMATS.fixed,
    );
    expect("band", { formula: `=${inner}*${at(COL.se)}` }, row.band, PORTABLE_FORMATS.fixed);
    const z = at(COL.z);
    expect(
      "z",
      { formula: `=IF(ISNUMBER(${at(COL.r)}),${at(COL.r)}/${at(COL.se)},"")` },
      finiteOr(row.z),
      PORTABLE_FORMATS.fixed,
    );
    expect(
      "pLag",
      { formula: `=IF(ISNUMBER(${z}),2*NORM.S.DIST(-ABS(${z}),TRUE),"")` },
      finiteOr(row.pLag),
      PORTABLE_FORMATS.p,
    );
    expect(
      "zone",
      {
        formula: `=IF(ISNUMBER(${z}),IF(ABS(${z})>${outer},"beyond",IF(ABS(${z})>${inner},"between","inside")),"")`,
      },
      zoneCell(row),
    );
    put(
      r,
      COL.term,
      { formula: `=${termFormula(table, n, at)}` },
      { format: PORTABLE_FORMATS.statistic },
    );
    const upTo = (c: number) => `${cell(firstLagRow, c)}:${at(c)}`;
    expect(
      "jointQ",
      { formula: `=SUM(${upTo(COL.term)})` },
      row.jointQ,
      PORTABLE_FORMATS.statistic,
    );
    expect(
      "jointDf",
      { formula: `=COUNT(${upTo(COL.r)})-${fig("fittedParams")}` },
      row.jointDf,
      PORTABLE_FORMATS.count,
    );
    expect(
      "jointP",
      {
        formula: `=IF(${at(COL.jointDf)}>0,CHISQ.DIST.RT(${at(COL.jointQ)},${at(COL.jointDf)}),"")`,
      },
      finiteOr(row.jointP),
      PORTABLE_FORMATS.p,
    );
    put(
      r,
      COL.pmf,
      {
        formula: `=IF(${lag}<=${tested},BINOM.DIST(${lag},${tested},${alpha},FALSE),0)`,
      },
      { format: PORTABLE_FORMATS.p },
    );
    // The corridors as stacked areas: an invisible base up to −outer, then the bands on it.
    put(r, COL.base, { formula: `=-${outer}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.outerLower, { formula: `=${outer}-${inner}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.inner, { formula: `=2*${inner}` }, { format: PORTABLE_FORMATS.fixed });
    put(r, COL.outerUpper, { formula: `=${outer}-${inner}` }, { format: PORTABLE_FORMATS.fixed });
    for (const zone of ["inside", "between", "beyond"] as const) {
      put(
        r,
        COL[zone],
        {
          formula: `=IF(${at(COL.zone)}="${zone}",MAX(-${PIN},MIN(${PIN},${z})),NA())`,
        },
        { format: PORTABLE_FORMATS.fixed },
      );
    }
  });

  // One helper row per data cell.
  (Object.keys(HELP) as (keyof typeof HELP)[]).forEach((c) =>
    text(tableTop, HELP[c], HELP_HEADERS[c], "heading"),
  );
  const mean = fig("mean");
  for (let i = 0; i < L; i++) {
    const r = firstLagRow + i;
    const value = srcCell(i);
    const present = cell(r, HELP.present);
    put(r, HELP.position, { value: i + 1 });
    put(r, HELP.present, { formula: `=IF(ISNUMBER(${value}),1,0)` });
    put(r, HELP.value, { formula: `=IF(${present}=1,${value},0)` });
    put(r, HELP.deviation, { formula: `=IF(${present}=1,${value}-${mean},0)` });
    put(r, HELP.square, { formula: `=${cell(r, HELP.deviation)}^2` });
    put(r, HELP.where, { formula: `=IF(${present}=1,${i + 1},"")` });
  }
  return cells;
}

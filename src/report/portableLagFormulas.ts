/**
 * The formulas of a portable report that depend on the options: the standard error of the band
 * kind (bands.ts), the joint test's term of each lag (portmanteau.ts), and the verdict's reason
 * sentence in the sheet's own text functions.
 */
import { TEST_NAMES, type LagTable } from "../core";
import { COL, type FigureRow } from "./portableLayout";
import { textLiteral } from "./portableFormulas";

/** se_k of the band kind (bands.ts): 1/√n, Bartlett's √((1 + 2Σ_{j<k} r_j²)/n), or robust √v̂_k. */
export function standardErrorFormula(
  table: LagTable,
  earlier: string | undefined,
  n: string,
  at: (c: number) => string,
): string {
  switch (table.bandKind) {
    case "noise":
      return `1/SQRT(${n})`;
    case "bartlett":
      // SUMSQ skips the blank text of a lag without pairs, as the core skips its NaN.
      return earlier === undefined ? `SQRT(1/${n})` : `SQRT((1+2*SUMSQ(${earlier}))/${n})`;
    case "robust":
      return `SQRT(${at(COL.robustVar)})`;
  }
}

/** The joint test's term of lag k (portmanteau.ts); a lag without pairs adds nothing. */
export function termFormula(table: LagTable, n: string, at: (c: number) => string): string {
  const r = at(COL.r);
  const k = at(COL.lag);
  const v = at(COL.robustVar);
  switch (table.testKind) {
    case "ljung-box":
      return `IF(ISNUMBER(${r}),${n}*(${n}+2)*${r}^2/(${n}-${k}),0)`;
    case "box-pierce":
      return `IF(ISNUMBER(${r}),${n}*${r}^2,0)`;
    case "robust":
      return `IF(ISNUMBER(${r}),IF(${v}>0,${r}^2/${v},0),0)`;
    case "squares":
      throw new Error("the squares' test is not portable");
  }
}

/** One sentence that says what the verdict rests on, in the sheet's own text functions. */
export function reasonFormula(
  table: LagTable,
  verdict: string,
  fig: (name: FigureRow) => string,
): string {
  const p = fig("p");
  const joint = `${textLiteral(`${TEST_NAMES[table.testKind]} over ${table.maxLag} lags: Q = `)}&TEXT(${fig("Q")},"0.00")&", df "&${fig("df")}&IF(${p}<0.0001,", p < 0.0001",", p = "&TEXT(${p},"0.0000"))`;
  const note = `${fig("tested")}&" lags tested at "&TEXT(${fig("alpha")},"0.0%")&": about "&TEXT(${fig("expected")},"0.0")&" would cross the one-lag band by chance even for pure noise; "&${fig("crossings")}&" did, "&${fig("outerCount")}&" of them beyond the all-lags corridor."`;
  const short = textLiteral(
    "Not judged: a verdict needs at least 20 values and at most n/4 lags; the figures are shown for reference. ",
  );
  return `=IF(${verdict}="short",${short},"")&${joint}&". "&${note}`;
}

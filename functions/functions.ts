/**
 * The ECHOLOT cell functions. Each one is thin: read the cells and arguments (arguments.ts), call
 * the core's lag analysis, shape the result for the sheet (shape.ts), and let `cellFunction` turn
 * a refusal into #VALUE! or #N/A with the core's message. No arithmetic happens here.
 *
 * The JSDoc below is the function wizard's text and, through the metadata plugin, functions.json:
 * `@customfunction ID` names the function in the ECHOLOT namespace; series parameters are
 * `any[][]` so that a blank cell arrives as "" or null rather than 0.
 */
/* eslint-disable @typescript-eslint/no-explicit-any -- the host hands over untyped cells */
import {
  lagTable,
  parseBandKind,
  parseTestKind,
  requireValues,
  resolveLagCount,
  type LagTable,
} from "../src/core";
import { optionalKeyword, optionalNumber, readSeries } from "./arguments";
import { cellFunction } from "./cellFunction";
import { column, row } from "./shape";

/**
 * Autocovariance at lags 0 to maxLag (divide-by-n); spills a column, lag 0 (the variance) first.
 * @customfunction SERIESLAGCOV
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: autocovariance at lags 0, 1, …, maxLag.
 */
export function seriesLagCov(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(analyse(series, { maxLag }).autocovariance));
}

/**
 * Autocorrelation at lags 1 to maxLag; spills a column of maxLag numbers.
 * @customfunction SERIESLAGCORR
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: autocorrelation at lags 1, 2, …, maxLag.
 */
export function seriesLagCorr(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(analyse(series, { maxLag }).rows.map((r) => r.correlation)));
}

/**
 * Partial autocorrelation at lags 1 to maxLag (Durbin–Levinson); spills a column.
 * @customfunction SERIESPARTIALCORR
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: partial autocorrelation at lags 1, 2, …, maxLag.
 */
export function seriesPartialCorr(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(analyse(series, { maxLag }).rows.map((r) => r.partial)));
}

/**
 * Significance band half-width for the autocorrelation at lags 1 to maxLag; spills a column.
 * @customfunction SERIESBAND
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @param [alpha] Significance level, between 0 and 1. Default: 0.05.
 * @param [bandKind] "noise" (default, ±z/√n), "bartlett" (grows with the earlier lags) or "robust" (for volatility clustering).
 * @returns A column: band half-width at lags 1, 2, …, maxLag.
 */
export function seriesBand(
  series: any[][],
  maxLag?: number,
  alpha?: number,
  bandKind?: string,
): any[][] {
  return cellFunction(() =>
    column(analyse(series, { maxLag, alpha, bandKind }).rows.map((r) => r.band)),
  );
}

/**
 * Lag table: autocorrelation, partial, z and three p-values per lag; spills a header and one row per lag.
 * @customfunction SERIESLAGTABLE
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5), or min(2·season, n/5).
 * @param [alpha] Significance level, between 0 and 1. Default: 0.05.
 * @param [bandKind] "noise" (default), "bartlett" or "robust": the standard error behind z.
 * @param [season] Periods in one cycle, a whole number from 2 (12 for monthly data); sets the default maxLag.
 * @returns Header, then per lag: lag, autocorrelation, partial, z, p of this lag, p corrected for all lags (Šidák), Ljung–Box p of lags 1 to this one.
 */
export function seriesLagTable(
  series: any[][],
  maxLag?: number,
  alpha?: number,
  bandKind?: string,
  season?: number,
): any[][] {
  return cellFunction(() => {
    const table = analyse(series, { maxLag, alpha, bandKind, season });
    const header = [
      "lag",
      "autocorrelation",
      "partial autocorrelation",
      "z",
      "p (this lag)",
      `p (Šidák, ${table.maxLag} lags)`,
      "p (Ljung–Box to lag)",
    ];
    const body = table.rows.flatMap((r) =>
      row(r.lag, r.correlation, r.partial, r.z, r.pLag, r.pSidak, r.jointP),
    );
    return [header, ...body];
  });
}

/**
 * Joint (portmanteau) test that the autocorrelations at lags 1 to lags are all zero; spills Q, df, p.
 * @customfunction SERIESPORTMANTEAU
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [lags] Number of lags tested, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @param [fittedParams] ARMA parameters fitted to get these residuals, from 0 (default); df = lags − fittedParams.
 * @param [testKind] "ljung-box" (default), "box-pierce", "robust" (for volatility clustering) or "squares" (McLeod–Li, on squared deviations).
 * @returns One row: Q statistic, degrees of freedom, p-value.
 */
export function seriesPortmanteau(
  series: any[][],
  lags?: number,
  fittedParams?: number,
  testKind?: string,
): any[][] {
  return cellFunction(() => {
    const parsed = readSeries(series);
    const lagCount = optionalNumber("lags", lags);
    if (lagCount !== null) {
      requireValues(parsed, 3, "a portmanteau test");
      resolveLagCount("lags", lagCount, parsed.count);
    }
    const table = lagTable(parsed, {
      maxLag: lagCount,
      fittedParams: optionalNumber("fittedParams", fittedParams),
      testKind: parseTestKind(optionalKeyword(testKind)),
    });
    return row(table.joint.q, table.joint.df, table.joint.p);
  });
}

/**
 * Is the series white noise? Spills a verdict (clear, watch, structure, short) and its reason; a screen, not a decision.
 * @customfunction SERIESNOISECHECK
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Lags tested, a whole number from 1 to n − 1. Default: min(10, n/5), or min(2·season, n/5).
 * @param [season] Periods in one cycle, a whole number from 2; lags season and 2·season are watched.
 * @param [fittedParams] ARMA parameters fitted to get these residuals, from 0 (default).
 * @param [alpha] Significance level, between 0 and 1. Default: 0.05.
 * @returns One row: verdict word, reason sentence.
 */
export function seriesNoiseCheck(
  series: any[][],
  maxLag?: number,
  season?: number,
  fittedParams?: number,
  alpha?: number,
): any[][] {
  return cellFunction(() => {
    const { verdict } = analyse(series, { maxLag, season, fittedParams, alpha });
    return row(verdict.word, verdict.reason);
  });
}

/** The arguments the lag analysis takes, as the host passed them. */
interface CellArguments {
  readonly maxLag?: unknown;
  readonly alpha?: unknown;
  readonly season?: unknown;
  readonly fittedParams?: unknown;
  readonly bandKind?: unknown;
}

/** Reads the series and arguments and runs the core's lag analysis. */
function analyse(series: unknown, args: CellArguments): LagTable {
  return lagTable(readSeries(series), {
    maxLag: optionalNumber("maxLag", args.maxLag),
    alpha: optionalNumber("alpha", args.alpha),
    season: optionalNumber("season", args.season),
    fittedParams: optionalNumber("fittedParams", args.fittedParams),
    bandKind: parseBandKind(optionalKeyword(args.bandKind)),
  });
}

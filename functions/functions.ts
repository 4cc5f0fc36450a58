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
  pReferenceLabel,
  batchCheck,
  biasCheck,
  blockColumns,
  crossCorrelation,
  forecastAudit,
  invalid,
  lagFigures,
  lagTable,
  noiseCheck,
  normalityCheck,
  parseBandKind,
  parseTestKind,
  placeOnCells,
  rollingCheck,
  runsCheck,
  volatilityCheck,
  type BatchRow,
  type BlockColumn,
  type LagOptions,
  type LagFigures,
  type LagTable,
} from "../src/core";
import {
  optionalKeyword,
  optionalNumber,
  optionalSeason,
  readSeries,
  requiredNumber,
  type ArgumentNames,
} from "./arguments";
import { lagTableHeader, lagTableValues } from "../src/report/lagTableHeader";
import { cellFunction } from "./cellFunction";
import { column, numberCell, row, type Cell } from "./shape";

/**
 * Autocovariance at lags 0 to maxLag (divide-by-n); spills a column, lag 0 (the variance) first.
 * @customfunction SERIESLAGCOV
 * @helpurl https://localhost:3000/help/serieslagcov.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: autocovariance at lags 0, 1, …, maxLag.
 */
export function seriesLagCov(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(figures(series, { maxLag }).autocovariance));
}

/**
 * Autocorrelation at lags 1 to maxLag; spills a column of maxLag numbers.
 * @customfunction SERIESLAGCORR
 * @helpurl https://localhost:3000/help/serieslagcorr.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: autocorrelation at lags 1, 2, …, maxLag.
 */
export function seriesLagCorr(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(Array.from(figures(series, { maxLag }).correlation)));
}

/**
 * Partial autocorrelation at lags 1 to maxLag (Durbin–Levinson); spills a column.
 * @customfunction SERIESPARTIALCORR
 * @helpurl https://localhost:3000/help/seriespartialcorr.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns A column: partial autocorrelation at lags 1, 2, …, maxLag.
 */
export function seriesPartialCorr(series: any[][], maxLag?: number): any[][] {
  return cellFunction(() => column(Array.from(figures(series, { maxLag }).partial)));
}

/**
 * Significance band half-width for the autocorrelation at lags 1 to maxLag; spills a column.
 * @customfunction SERIESBAND
 * @helpurl https://localhost:3000/help/seriesband.html
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
  return cellFunction(() => column(Array.from(figures(series, { maxLag, alpha, bandKind }).band)));
}

/**
 * Lag table: autocorrelation, partial, z and three p-values per lag; spills a header and one row per lag.
 * @customfunction SERIESLAGTABLE
 * @helpurl https://localhost:3000/help/serieslagtable.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Highest lag, a whole number from 1 to n − 1. Default: min(10, n/5), or min(2·season, n/5).
 * @param [alpha] Significance level, between 0 and 1. Default: 0.05.
 * @param [bandKind] "noise" (default), "bartlett" or "robust": the standard error behind z.
 * @param [season] Periods in one cycle, a whole number from 2 (12 for monthly data); sets the default maxLag.
 * @returns Header, then per lag: lag, autocorrelation, partial, z, corridor (inside, between or beyond), p of this lag, p for all lags together (Šidák).
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
    const header = lagTableHeader(table);
    const body = table.rows.flatMap((r) => row(...lagTableValues(r)));
    return [header, ...body];
  });
}

/** SERIESPORTMANTEAU's `lags` is the core's maxLag; its other arguments have the core's names. */
const PORTMANTEAU_ARGUMENTS: ArgumentNames = { maxLag: "lags" };

/**
 * Joint (portmanteau) test that the autocorrelations at lags 1 to lags are all zero; spills Q, df, p.
 * @customfunction SERIESPORTMANTEAU
 * @helpurl https://localhost:3000/help/seriesportmanteau.html
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
    const { joint } = noiseCheck(readSeries(series), {
      maxLag: optionalNumber("maxLag", lags),
      fittedParams: optionalNumber("fittedParams", fittedParams),
      testKind: parseTestKind(optionalKeyword(testKind)),
    });
    return row(joint.q, joint.df, joint.p);
  }, PORTMANTEAU_ARGUMENTS);
}

/**
 * Is the series white noise? Spills a verdict (clear, watch, structure, short) and its reason; a screen, not a decision.
 * @customfunction SERIESNOISECHECK
 * @helpurl https://localhost:3000/help/seriesnoisecheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [maxLag] Lags tested, a whole number from 1 to n − 1. Default: min(10, n/5), or min(2·season, n/5).
 * @param [season] Periods in one cycle, a whole number from 2; lags season and 2·season are watched. 0 or omitted: none.
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
    const { verdict } = noiseCheck(
      readSeries(series),
      lagOptions({ maxLag, season, fittedParams, alpha }),
    );
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

/** The core's lag options from the arguments as the host passed them. */
function lagOptions(args: CellArguments): LagOptions {
  return {
    maxLag: optionalNumber("maxLag", args.maxLag),
    alpha: optionalNumber("alpha", args.alpha),
    season: optionalSeason(args.season),
    fittedParams: optionalNumber("fittedParams", args.fittedParams),
    bandKind: parseBandKind(optionalKeyword(args.bandKind)),
  };
}

/** Reads the series and arguments and computes the per-lag figures (no verdict). */
function figures(series: unknown, args: CellArguments): LagFigures {
  return lagFigures(readSeries(series), lagOptions(args));
}

/** Reads the series and arguments and runs the core's lag analysis. */
function analyse(series: unknown, args: CellArguments): LagTable {
  return lagTable(readSeries(series), lagOptions(args));
}

/**
 * Volatility clustering: Engle's LM test that the squared deviations depend on their last lags; spills LM, df, p.
 * @customfunction SERIESVOLCHECK
 * @helpurl https://localhost:3000/help/seriesvolcheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [lags] Lagged squares in the regression, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns One row: LM statistic (rows used × R²), degrees of freedom, p-value.
 */
export function seriesVolCheck(series: any[][], lags?: number): any[][] {
  return cellFunction(() => {
    const check = volatilityCheck(readSeries(series), { lags: optionalNumber("lags", lags) });
    return row(check.lm, check.df, check.p);
  });
}

/**
 * Bias: is the mean zero? Mean with a Newey–West (HAC) standard error; spills mean, se, t, p.
 * @customfunction SERIESBIASCHECK
 * @helpurl https://localhost:3000/help/seriesbiascheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param [hacLags] Lags the standard error allows for, a whole number from 0 to n − 1. Default: 4(n/100)^(2/9), rounded down.
 * @returns One row: mean, HAC standard error, t statistic, two-sided p-value (fixed-b reference).
 */
export function seriesBiasCheck(series: any[][], hacLags?: number): any[][] {
  return cellFunction(() => {
    const check = biasCheck(readSeries(series), { hacLags: optionalNumber("hacLags", hacLags) });
    return row(check.mean, check.se, check.t, check.p);
  });
}

/**
 * Forecast audit of h-step-ahead errors: bias, dependence beyond lag horizon − 1, verdict; spills a two-column table.
 * @customfunction SERIESFORECASTAUDIT
 * @helpurl https://localhost:3000/help/seriesforecastaudit.html
 * @param errors One row or column of forecast errors; blanks and #N/A are gaps, a text first cell is the label.
 * @param [horizon] Periods ahead the forecasts were made, a whole number from 1 (lags below it are expected and not counted). Default: 1.
 * @param [season] Periods in one cycle, a whole number from 2; lags season and 2·season are watched. 0 or omitted: none.
 * @param [alpha] Significance level, between 0 and 1. Default: 0.05.
 * @returns Rows of name and value: bias mean, standard error, t, p; dependence lags, Q, df, p; verdict and reason.
 */
export function seriesForecastAudit(
  errors: any[][],
  horizon?: number,
  season?: number,
  alpha?: number,
): any[][] {
  return cellFunction(() => {
    const audit = forecastAudit(readSeries(errors, "errors"), {
      horizon: optionalNumber("horizon", horizon) ?? 1,
      season: optionalSeason(season),
      alpha: optionalNumber("alpha", alpha),
    });
    const { bias, dependenceTest: test, levels } = audit;
    return [
      ["bias: mean error", numberCell(bias.mean)],
      [`bias: se (long-run variance, lags 0–${bias.horizon - 1})`, numberCell(bias.se)],
      ["bias: corrected t", numberCell(bias.tCorrected)],
      [`bias: p (t, ${bias.df} df)`, numberCell(bias.p)],
      ["dependence: lags tested", `${test.firstLag}–${test.maxLag}`],
      ["dependence: Q", numberCell(test.q)],
      ["dependence: df", test.df],
      [`dependence: p (${pReferenceLabel(levels.jointP)})`, numberCell(levels.jointP.p)],
      ["verdict", audit.verdict.word],
      ["reason", audit.verdict.reason],
    ];
  });
}

/**
 * Noise check of every column of a block, with Benjamini–Hochberg q-values across them; spills a header and one row per column.
 * @customfunction SERIESBATCHCHECK
 * @helpurl https://localhost:3000/help/seriesbatchcheck.html
 * @param block A block with one series per column (at least 2); a text first row holds the labels; blanks and #N/A are gaps.
 * @param [maxLag] Lags tested, a whole number from 1 to n − 1. Default: min(10, n/5), or min(2·season, n/5).
 * @param [season] Periods in one cycle, a whole number from 2; lags season and 2·season are watched. 0 or omitted: none.
 * @param [fittedParams] ARMA parameters fitted to get these residuals, from 0 (default).
 * @param [alpha] Significance level, for the verdicts and the false-discovery rate, between 0 and 1. Default: 0.05.
 * @returns Header, then per column: label, n, Q, df, p, q-value, verdict (structure only when kept after the false-discovery step; biased when the bias check is kept).
 */
export function seriesBatchCheck(
  block: any[][],
  maxLag?: number,
  season?: number,
  fittedParams?: number,
  alpha?: number,
): any[][] {
  return cellFunction(() => {
    const columns = readBlock(block);
    const read = columns.flatMap((c) => (c.series === undefined ? [] : [c.series]));
    // With fewer than two readable columns there is no batch: the first column's own refusal
    // says what to fix.
    const refused = columns.find((c) => c.refusal !== undefined);
    if (read.length < 2 && refused !== undefined) throw refused.refusal;
    const batch = batchCheck(read, {
      maxLag: optionalNumber("maxLag", maxLag),
      season: optionalSeason(season),
      fittedParams: optionalNumber("fittedParams", fittedParams),
      alpha: optionalNumber("alpha", alpha),
    });
    const header: Cell[] = ["label", "n", "Q", "df", "p", "q-value", "verdict"];
    // The batch rows come in the order of the columns read; a column that could not be read
    // takes its place between them, with its reason in the verdict cell.
    let next = 0;
    const body = columns.flatMap((c) => {
      if (c.series === undefined) {
        return row(c.label, "", "", "", "", "", `not analysed: ${c.refusal?.message ?? ""}`);
      }
      const r = batch.rows[next++] as BatchRow;
      // The word across the batch: structure only when kept by the false-discovery step.
      return row(
        r.label,
        r.n,
        r.q,
        r.df,
        r.p,
        r.qValue,
        r.headline?.title ?? `not analysed: ${r.reason}`,
      );
    });
    return [header, ...body];
  });
}

/**
 * Cross-correlation of two aligned series at lags −maxLag to maxLag, with the noise band; spills a header and 2·maxLag + 1 rows.
 * @customfunction SERIESCROSSCORR
 * @helpurl https://localhost:3000/help/seriescrosscorr.html
 * @param x One row or column of numbers; blanks and #N/A are gaps (of the pair), a text first cell is the label.
 * @param y A range of the same size as x, row by row the same periods.
 * @param [maxLag] Highest lag each way, a whole number from 1 to n − 1. Default: min(10, n/5).
 * @returns Header, then per lag: lag (positive when x leads y), cross-correlation, band half-width.
 */
export function seriesCrossCorr(x: any[][], y: any[][], maxLag?: number): any[][] {
  return cellFunction(() => {
    const result = crossCorrelation(readSeries(x, "x"), readSeries(y, "y"), {
      maxLag: optionalNumber("maxLag", maxLag),
    });
    const header: Cell[] = ["lag", "cross-correlation", "band"];
    return [header, ...result.rows.flatMap((r) => row(r.lag, r.correlation, r.band))];
  });
}

/**
 * Rolling check: Ljung–Box p of the window ending at each row, so a change shows where it starts; spills beside the input.
 * @customfunction SERIESROLLCHECK
 * @helpurl https://localhost:3000/help/seriesrollcheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @param window Rows per window, a whole number from 3 to the length of the series.
 * @param [lags] Lags tested in each window, a whole number from 1 to window − 1. Default: min(10, window/5).
 * @param [step] Report every step rows, a whole number from 1. Default: 1.
 * @returns Aligned with the input, row for row down to its last value: the joint-test p of the window ending there; empty before the first full window.
 */
export function seriesRollCheck(
  series: any[][],
  window: number,
  lags?: number,
  step?: number,
): any[][] {
  return cellFunction(() => {
    const parsed = readSeries(series);
    const result = rollingCheck(parsed, {
      window: requiredNumber(
        "window",
        window,
        "the rows per window, a whole number from 3 to the length of the series",
      ),
      lags: optionalNumber("lags", lags),
      step: optionalNumber("step", step),
    });
    // Row for row with the input, ending at its last value: a whole-column reference must not
    // spill a million rows (it would meet #SPILL! anywhere below row 1).
    const placed = placeOnCells(result.p, parsed).subarray(
      0,
      (parsed.start ?? 0) + parsed.values.length,
    );
    const isRow = series.length === 1 && (series[0]?.length ?? 0) > 1;
    return isRow ? [Array.from(placed, numberCell)] : column(placed);
  });
}

/**
 * Runs about the median (Wald–Wolfowitz): too few runs means drift, too many alternation; spills runs, expected runs, p.
 * @customfunction SERIESRUNSCHECK
 * @helpurl https://localhost:3000/help/seriesrunscheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @returns One row: runs, expected runs, two-sided p-value.
 */
export function seriesRunsCheck(series: any[][]): any[][] {
  return cellFunction(() => {
    const check = runsCheck(readSeries(series));
    return row(check.runs, check.expected, check.p);
  });
}

/**
 * Normality by Jarque–Bera (skewness and kurtosis); spills the statistic and p.
 * @customfunction SERIESNORMALCHECK
 * @helpurl https://localhost:3000/help/seriesnormalcheck.html
 * @param series One row or column of numbers; blanks and #N/A are gaps, a text first cell is the label.
 * @returns One row: Jarque–Bera statistic, p-value.
 */
export function seriesNormalCheck(series: any[][]): any[][] {
  return cellFunction(() => {
    const check = normalityCheck(readSeries(series));
    return row(check.jb, check.p);
  });
}

/** A block's columns, each read by the intake rules; a column that cannot be read keeps its place. */
function readBlock(block: unknown): BlockColumn[] {
  if (!Array.isArray(block) || !block.every((r) => Array.isArray(r))) {
    invalid("block must be a range of cells with one series per column, such as B1:F241");
  }
  return blockColumns(block as readonly (readonly unknown[])[]);
}

/**
 * Every function by its id, on the page's global scope for the task pane: the pane runs in the
 * same page (the shared runtime) and, when a selected cell shows an error, recomputes the
 * function's message from the same arguments, since some hosts hide custom error messages.
 * A global rather than an import: importing this file into the pane's bundle would register every
 * function a second time.
 */
Object.assign(globalThis, {
  echolotCellFunctions: {
    SERIESLAGCOV: seriesLagCov,
    SERIESLAGCORR: seriesLagCorr,
    SERIESPARTIALCORR: seriesPartialCorr,
    SERIESBAND: seriesBand,
    SERIESLAGTABLE: seriesLagTable,
    SERIESPORTMANTEAU: seriesPortmanteau,
    SERIESNOISECHECK: seriesNoiseCheck,
    SERIESVOLCHECK: seriesVolCheck,
    SERIESBIASCHECK: seriesBiasCheck,
    SERIESFORECASTAUDIT: seriesForecastAudit,
    SERIESBATCHCHECK: seriesBatchCheck,
    SERIESCROSSCORR: seriesCrossCorr,
    SERIESROLLCHECK: seriesRollCheck,
    SERIESRUNSCHECK: seriesRunsCheck,
    SERIESNORMALCHECK: seriesNormalCheck,
  },
});

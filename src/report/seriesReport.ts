/**
 * Everything the pane and the HTML report show about one series, computed by the core and worded
 * here: the headline (core/headline.ts), the lag table of the reading it uses (robust when the
 * volatility check fired) beside the plain one, the squared-deviations table (the third chart view), the side checks
 * (volatility, bias, runs, normality), and the explanation that draws on them. No arithmetic of
 * its own.
 */
import {
  headlineOf,
  needsRobustReading,
  resultOrReason,
  robustOptions,
  lagTable,
  type Headline,
  type BiasCheck,
  type LagOptions,
  type LagTable,
  type Series,
  type VolatilityCheck,
} from "../core";
import { biasFinding, volatilityFinding } from "./checkFindings";
import { explainVerdict, type Explanation } from "./explain";
import { sideChecks, type SideChecks } from "./sideChecks";

export interface SeriesReport {
  readonly series: Series;
  /** The lag table of the reading the headline uses: the robust one when volatility switched it. */
  readonly table: LagTable;
  /** The lag table with the caller's options (the same object as `table` unless switched). */
  readonly plain: LagTable;
  /** The one headline (core/headline.ts): word, reading, bias, volatility, findings. */
  readonly headline: Headline;
  /** The squared deviations' lag table, or why it cannot be computed. */
  readonly squares: LagTable | string;
  readonly volatility: VolatilityCheck | undefined;
  readonly bias: BiasCheck | undefined;
  /** All four side checks, each a result or the reason it could not be made. */
  readonly side: SideChecks;
  readonly explanation: Explanation;
}

/** Throws the core's EcholotError when the options or the series are refused. */
export function seriesReport(series: Series, options: LagOptions): SeriesReport {
  const plain = lagTable(series, options);
  // The squares view uses the plain noise band: the McLeod–Li reference.
  const squares = resultOrReason(() =>
    lagTable(series, { ...options, testKind: "squares", bandKind: "noise", fittedParams: 0 }),
  );
  const side = sideChecks(series, plain);
  const volatilityResult = typeof side.volatility === "string" ? undefined : side.volatility;
  const biasResult = typeof side.bias === "string" ? undefined : side.bias;
  const robust = needsRobustReading(plain, side.volatility)
    ? lagTable(series, robustOptions(options))
    : null;
  const table = robust ?? plain;
  const headline = headlineOf(plain, robust, side.volatility, side.bias);
  const explanation = explainVerdict(table, {
    headline,
    ...(typeof squares === "string" ? {} : { squares }),
    ...(volatilityResult === undefined ? {} : { volatility: volatilityFinding(volatilityResult) }),
    ...(biasResult === undefined ? {} : { bias: biasFinding(biasResult) }),
  });
  return {
    series,
    table,
    plain,
    headline,
    squares,
    volatility: volatilityResult,
    bias: biasResult,
    side,
    explanation,
  };
}

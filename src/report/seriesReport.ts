/**
 * Everything the pane and the HTML report show about one series, computed by the core and worded
 * here: the lag table, the squared-deviations table (the third chart view), the side checks
 * (volatility, bias, runs, normality), and the explanation that draws on them. No arithmetic of
 * its own.
 */
import {
  resultOrReason,
  lagTable,
  type BiasCheck,
  type LagOptions,
  type LagTable,
  type Series,
  type VolatilityCheck,
} from "../core";
import { biasFinding, volatilityFinding } from "./checkLines";
import { explainVerdict, type Explanation } from "./explain";
import { sideChecks, type SideChecks } from "./sideChecksText";

export interface SeriesReport {
  readonly series: Series;
  readonly table: LagTable;
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
  const table = lagTable(series, options);
  // The squares view uses the plain noise band: the McLeod–Li reference.
  const squares = resultOrReason(() =>
    lagTable(series, { ...options, testKind: "squares", bandKind: "noise", fittedParams: 0 }),
  );
  const side = sideChecks(series, table);
  const volatilityResult = typeof side.volatility === "string" ? undefined : side.volatility;
  const biasResult = typeof side.bias === "string" ? undefined : side.bias;
  const explanation = explainVerdict(table, {
    ...(typeof squares === "string" ? {} : { squares }),
    ...(volatilityResult === undefined ? {} : { volatility: volatilityFinding(volatilityResult) }),
    ...(biasResult === undefined ? {} : { bias: biasFinding(biasResult) }),
  });
  return {
    series,
    table,
    squares,
    volatility: volatilityResult,
    bias: biasResult,
    side,
    explanation,
  };
}

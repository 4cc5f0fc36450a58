/**
 * The side-check section of one series: volatility, bias, runs and normality, run at the lag
 * table's alpha, each with its finding (checkFindings.ts) or the reason it could not be made, in
 * reading order; and that section as text lines for the terminal (`echolot check`).
 */
import {
  biasCheck,
  normalityCheck,
  resultOrReason,
  runsCheck,
  volatilityCheck,
  type BiasCheck,
  type LagTable,
  type NormalityCheck,
  type RunsCheck,
  type Series,
  type VolatilityCheck,
} from "../core";
import {
  biasFinding,
  normalityFinding,
  runsFinding,
  volatilityFinding,
  type CheckFinding,
} from "./checkFindings";

/** Each check's result, or the message saying why the data cannot support it. */
export interface SideChecks {
  readonly alpha: number;
  readonly volatility: VolatilityCheck | string;
  readonly bias: BiasCheck | string;
  readonly runs: RunsCheck | string;
  readonly normality: NormalityCheck | string;
}

/**
 * The four side checks of a series, at the lag table's alpha and (for volatility) its K, one
 * after the other; `beforeEach` runs before each (the CLI releases a long series' garbage there).
 */
export function sideChecks(
  series: Series,
  table: LagTable,
  beforeEach: () => void = () => undefined,
): SideChecks {
  const step = <T>(compute: () => T): T | string => {
    beforeEach();
    return resultOrReason(compute);
  };
  return {
    alpha: table.alpha,
    volatility: step(() => volatilityCheck(series, { lags: table.maxLag, alpha: table.alpha })),
    bias: step(() => biasCheck(series, { alpha: table.alpha })),
    runs: step(() => runsCheck(series, { alpha: table.alpha })),
    normality: step(() => normalityCheck(series, { alpha: table.alpha })),
  };
}

/** Each side check's name and its finding (or why it was not computed), in reading order. */
export function sideFindings(
  checks: SideChecks,
): { name: string; finding: CheckFinding | string }[] {
  const found = <T>(value: T | string, word: (v: T) => CheckFinding) =>
    typeof value === "string" ? value : word(value);
  return [
    { name: "volatility", finding: found(checks.volatility, volatilityFinding) },
    { name: "bias", finding: found(checks.bias, biasFinding) },
    { name: "runs", finding: found(checks.runs, runsFinding) },
    { name: "normality", finding: found(checks.normality, normalityFinding) },
  ];
}

function line(name: string, finding: CheckFinding | string): string {
  if (typeof finding === "string") return `  ${name.padEnd(11)} not computed: ${finding}`;
  return `  ${name.padEnd(11)} ${finding.flagged ? "flag" : "ok  "}  ${finding.text}`;
}

export function sideChecksText(checks: SideChecks): string {
  return [
    `side checks (alpha ${checks.alpha}):`,
    ...sideFindings(checks).map(({ name, finding }) => line(name, finding)),
  ].join("\n");
}

/**
 * The side checks of one series as text lines for the terminal (`echolot check`): volatility,
 * bias, runs and normality, one finding each, or the reason a check could not be made.
 */
import type { BiasCheck, NormalityCheck, RunsCheck, VolatilityCheck } from "../core";
import { biasFinding, normalityFinding, runsFinding, volatilityFinding } from "./checkLines";

/** Each check's result, or the message saying why the data cannot support it. */
export interface SideChecks {
  readonly alpha: number;
  readonly volatility: VolatilityCheck | string;
  readonly bias: BiasCheck | string;
  readonly runs: RunsCheck | string;
  readonly normality: NormalityCheck | string;
}

function line(name: string, finding: { flagged: boolean; text: string } | string): string {
  if (typeof finding === "string") return `  ${name.padEnd(11)} not computed: ${finding}`;
  return `  ${name.padEnd(11)} ${finding.flagged ? "flag" : "ok  "}  ${finding.text}`;
}

export function sideChecksText(checks: SideChecks): string {
  const { alpha } = checks;
  const found = <T>(value: T | string, word: (v: T) => { flagged: boolean; text: string }) =>
    typeof value === "string" ? value : word(value);
  return [
    `side checks (alpha ${alpha}):`,
    line("volatility", found(checks.volatility, volatilityFinding)),
    line("bias", found(checks.bias, biasFinding)),
    line(
      "runs",
      found(checks.runs, (r) => runsFinding(r, alpha)),
    ),
    line(
      "normality",
      found(checks.normality, (r) => normalityFinding(r, alpha)),
    ),
  ].join("\n");
}

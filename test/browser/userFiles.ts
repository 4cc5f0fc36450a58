/**
 * The two users' files the browser tests walk, seeded so every run sees the same numbers
 * (invented scenarios, invented labels; src/sim draws them).
 *
 * - The demand planner's block: src/sim/plannerItems.ts (150 items × 104 weeks: 125 sound, 12
 *   AR(1) φ 0.4, 8 with a 13-week cycle, 5 biased), written as the CSV a planner would export.
 * - The finance analyst's residuals: 500 daily return-model residuals with GARCH(1,1)-like
 *   volatility clustering and no linear dependence.
 */
import { garch11 } from "../../src/sim/processes";
import { PLANNER_WEEKS, plannerItems, type PlannerItem } from "../../src/sim/plannerItems";
import { seededRandom } from "../../src/sim/random";

export { plannerItems };

/** The planner's file as CSV: a week column, then one column per item. */
export function plannerCsv(items: readonly PlannerItem[] = plannerItems()): string {
  const lines = [["week", ...items.map((item) => item.label)].join(",")];
  for (let week = 0; week < PLANNER_WEEKS; week++) {
    const cells = items.map((item) => String(Math.round((item.errors[week] as number) * 10) / 10));
    lines.push([String(week + 1), ...cells].join(","));
  }
  return `${lines.join("\n")}\n`;
}

/** The analyst's 500 residuals, to six decimals as a workbook would show them. */
export function analystResiduals(seed = 20261203): Float64Array {
  return garch11(seededRandom(seed), 500, 0.02, 0.2, 0.78).map(
    (r) => Math.round(r * 0.6 * 1e6) / 1e6,
  );
}

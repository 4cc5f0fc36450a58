/**
 * The demand planner's invented file for the CLI tests: the 150 items × 104 weeks of the
 * project's seeded planner generator (src/sim/plannerItems.ts) as one wide CSV, a week column
 * then one column per item.
 */
import { plannerItems, PLANNER_WEEKS, type PlannerKind } from "../../src/sim/plannerItems";

export interface PlannerFile {
  readonly csv: string;
  /** Each item's label and how it was made, in column order. */
  readonly items: readonly { readonly label: string; readonly kind: PlannerKind }[];
}

export function plannerFile(): PlannerFile {
  const items = plannerItems();
  const lines = [["week", ...items.map((item) => item.label)].join(",")];
  const first = Date.UTC(2025, 0, 6);
  for (let t = 0; t < PLANNER_WEEKS; t++) {
    const week = new Date(first + t * 7 * 86_400_000).toISOString().slice(0, 10);
    lines.push([week, ...items.map((item) => (item.errors[t] as number).toFixed(2))].join(","));
  }
  return { csv: `${lines.join("\n")}\n`, items: items.map(({ label, kind }) => ({ label, kind })) };
}

/**
 * The two users' files the browser tests walk, made by a seeded generator so every run sees the
 * same numbers (invented scenarios, invented labels; src/sim draws them).
 *
 * - The demand planner's block: 150 items × 104 weeks of forecast errors, one column per item, in
 *   a shuffled file order: 125 items of pure noise, 12 whose errors are AR(1) with φ = 0.4 (the
 *   forecast under-reacts), 8 that keep an unforecast 13-week cycle, 5 biased (mean error 0.8 σ,
 *   otherwise noise).
 * - The finance analyst's residuals: 500 daily return-model residuals with GARCH(1,1)-like
 *   volatility clustering and no linear dependence.
 */
import { ar1, garch11, whiteNoise } from "../../src/sim/processes";
import { seededRandom, type Random } from "../../src/sim/random";

export type PlannerKind = "noise" | "ar1" | "cycle" | "biased";

export const PLANNER_WEEKS = 104;
const COUNTS: readonly (readonly [PlannerKind, number])[] = [
  ["noise", 125],
  ["ar1", 12],
  ["cycle", 8],
  ["biased", 5],
];

/** Invented item names: a word and a number, like "Wrenfield 042". */
const WORDS = [
  "Wrenfield",
  "Alder Cove",
  "Marrow Lane",
  "Quillstone",
  "Bracken",
  "Duskmere",
  "Fallow Gate",
  "Ivybank",
  "Tansy Row",
  "Gorsehill",
];

export interface PlannerItem {
  readonly label: string;
  readonly kind: PlannerKind;
  readonly errors: Float64Array;
}

function itemErrors(kind: PlannerKind, random: Random): Float64Array {
  if (kind === "ar1") return ar1(random, PLANNER_WEEKS, 0.4);
  const base = whiteNoise(random, PLANNER_WEEKS);
  if (kind === "cycle") {
    const phase = random.uniform() * 2 * Math.PI;
    return base.map((e, week) => e + 1.2 * Math.sin((2 * Math.PI * week) / 13 + phase));
  }
  if (kind === "biased") return base.map((e) => e + 0.8);
  return base;
}

/** The 150 items in file order (shuffled, so the file order is not the ranked order). */
export function plannerItems(seed = 20261202): PlannerItem[] {
  const random = seededRandom(seed);
  const kinds = COUNTS.flatMap(([kind, count]) => Array.from({ length: count }, () => kind));
  for (let i = kinds.length - 1; i > 0; i--) {
    const j = Math.floor(random.uniform() * (i + 1));
    [kinds[i], kinds[j]] = [kinds[j] as PlannerKind, kinds[i] as PlannerKind];
  }
  return kinds.map((kind, i) => {
    const scale = 5 + Math.round(random.uniform() * 20);
    const errors = itemErrors(kind, random).map((e) => Math.round(e * scale * 10) / 10);
    const word = WORDS[i % WORDS.length] as string;
    return { label: `${word} ${String(i + 1).padStart(3, "0")}`, kind, errors };
  });
}

/** The planner's file as CSV: a week column, then one column per item. */
export function plannerCsv(items: readonly PlannerItem[] = plannerItems()): string {
  const lines = [["week", ...items.map((item) => item.label)].join(",")];
  for (let week = 0; week < PLANNER_WEEKS; week++) {
    lines.push([String(week + 1), ...items.map((item) => String(item.errors[week]))].join(","));
  }
  return `${lines.join("\n")}\n`;
}

/** The analyst's 500 residuals, one a line under a label, as written with a decimal point. */
export function analystResiduals(seed = 20261203): Float64Array {
  return garch11(seededRandom(seed), 500, 0.02, 0.2, 0.78).map(
    (r) => Math.round(r * 0.6 * 1e6) / 1e6,
  );
}

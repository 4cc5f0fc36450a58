/**
 * A demand planner's file, invented for the CLI tests: 150 items × 104 weeks of forecast errors in
 * one wide CSV (a week column, then one column per item), from the project's seeded generators.
 * 125 items are noise, 12 under-react (AR(1) φ 0.4), 8 keep a 13-week cycle and 5 are biased
 * (mean error 0.6 sd); which item is which is shuffled by the seed and returned with the text.
 */
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom, type Random } from "../../src/sim/random";

export type ItemKind = "noise" | "ar1" | "cycle" | "biased";

export interface PlannerFile {
  readonly csv: string;
  /** Each item's label and how it was made, in column order. */
  readonly items: readonly { readonly label: string; readonly kind: ItemKind }[];
}

const WEEKS = 104;
const SD = 10;

function errors(random: Random, kind: ItemKind): Float64Array {
  if (kind === "ar1") return ar1(random, WEEKS, 0.4);
  const x = whiteNoise(random, WEEKS);
  for (let t = 0; t < WEEKS; t++) {
    if (kind === "cycle") x[t] = (x[t] as number) + Math.sin((2 * Math.PI * t) / 13);
    if (kind === "biased") x[t] = (x[t] as number) + 0.6;
  }
  return x;
}

export function plannerFile(seed = 14): PlannerFile {
  const random = seededRandom(seed);
  const kinds: ItemKind[] = [
    ...Array<ItemKind>(125).fill("noise"),
    ...Array<ItemKind>(12).fill("ar1"),
    ...Array<ItemKind>(8).fill("cycle"),
    ...Array<ItemKind>(5).fill("biased"),
  ];
  for (let i = kinds.length - 1; i > 0; i--) {
    const j = Math.floor(random.uniform() * (i + 1));
    [kinds[i], kinds[j]] = [kinds[j] as ItemKind, kinds[i] as ItemKind];
  }
  const items = kinds.map((kind, i) => ({ label: `item-${String(i + 1).padStart(3, "0")}`, kind }));
  const columns = kinds.map((kind) => errors(random, kind));
  const lines = [["week", ...items.map((item) => item.label)].join(",")];
  const first = Date.UTC(2025, 0, 6);
  for (let t = 0; t < WEEKS; t++) {
    const week = new Date(first + t * 7 * 86_400_000).toISOString().slice(0, 10);
    lines.push([week, ...columns.map((c) => ((c[t] as number) * SD).toFixed(2))].join(","));
  }
  return { csv: `${lines.join("\n")}\n`, items };
}

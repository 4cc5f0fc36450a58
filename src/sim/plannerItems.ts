/**
 * The demand planner's test case (invented): 150 items × 104 weeks of forecast errors, as a
 * planning team would audit them. 125 items are sound (white noise, sd 10), 12 under-react
 * (AR(1) with φ 0.4), 8 keep a 13-week promotion cycle (a sine of amplitude 8 on noise), and 5
 * run high (mean 6.4). The kinds are interleaved in a fixed, seeded order so that no view can
 * find them by position. Seeded: the same items every run.
 */
import { ar1, whiteNoise } from "./processes";
import { seededRandom } from "./random";

export type PlannerKind = "sound" | "under-react" | "cycle" | "biased";

export interface PlannerItem {
  readonly label: string;
  readonly kind: PlannerKind;
  readonly errors: Float64Array;
}

export const PLANNER_WEEKS = 104;
export const PLANNER_COUNTS: Readonly<Record<PlannerKind, number>> = {
  sound: 125,
  "under-react": 12,
  cycle: 8,
  biased: 5,
};

const SD = 10;

export function plannerItems(seed = 2026): PlannerItem[] {
  const random = seededRandom(seed);
  const kinds: PlannerKind[] = [];
  for (const kind of Object.keys(PLANNER_COUNTS) as PlannerKind[]) {
    for (let i = 0; i < PLANNER_COUNTS[kind]; i++) kinds.push(kind);
  }
  // Fisher–Yates with the seeded uniforms: a fixed order that mixes the kinds.
  for (let i = kinds.length - 1; i > 0; i--) {
    const j = Math.floor(random.uniform() * (i + 1));
    [kinds[i], kinds[j]] = [kinds[j] as PlannerKind, kinds[i] as PlannerKind];
  }
  return kinds.map((kind, index) => ({
    label: `item ${String(index + 1).padStart(3, "0")}`,
    kind,
    errors: itemErrors(random, kind),
  }));
}

function itemErrors(random: ReturnType<typeof seededRandom>, kind: PlannerKind): Float64Array {
  const n = PLANNER_WEEKS;
  if (kind === "under-react") {
    // AR(1) scaled to the same marginal sd as the sound items.
    const x = ar1(random, n, 0.4);
    const scale = SD * Math.sqrt(1 - 0.4 * 0.4);
    for (let t = 0; t < n; t++) x[t] = (x[t] as number) * scale;
    return x;
  }
  const x = whiteNoise(random, n, SD);
  if (kind === "cycle") {
    const phase = 2 * Math.PI * random.uniform();
    for (let t = 0; t < n; t++)
      x[t] = (x[t] as number) + 8 * Math.sin((2 * Math.PI * t) / 13 + phase);
  }
  if (kind === "biased") for (let t = 0; t < n; t++) x[t] = (x[t] as number) + 6.4;
  return x;
}

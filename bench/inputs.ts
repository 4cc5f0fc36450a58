/**
 * Seeded inputs for the bench. The figures stand in for a long column of daily model residuals
 * (a small offset plus noise with weak lag-1 dependence) and for an item block of weekly
 * forecast errors (mostly clean, some with leftover lag-1 dependence). Invented data.
 */
import type { Series } from "../src/core";
import { ar1, whiteNoise } from "../src/sim/processes";
import { seededRandom } from "../src/sim/random";

/** A gap-free series of n values, built in place (no intermediate copies). */
export function residualSeries(n: number, seed = 20_240_601): Series {
  const values = ar1(seededRandom(seed), n, 0.05);
  for (let t = 0; t < n; t++) values[t] = 0.02 + 1.3 * (values[t] as number);
  return { values, present: new Uint8Array(n).fill(1), label: "residuals", count: n, gaps: 0 };
}

/**
 * A one-column range as the host hands it to a cell function: n rows of one cell each, numbers
 * with about 1% blank cells ("") inside, never at the ends.
 */
export function residualCells(n: number, seed = 20_240_602): unknown[][] {
  const random = seededRandom(seed);
  const noise = whiteNoise(random, n);
  const rows: unknown[][] = new Array<unknown[]>(n);
  for (let t = 0; t < n; t++) {
    const gap = t > 0 && t < n - 1 && random.uniform() < 0.01;
    rows[t] = [gap ? "" : 0.02 + (noise[t] as number)];
  }
  return rows;
}

/** `count` series of `length` values: every fifth has lag-1 dependence φ = 0.3. */
export function itemBlock(count: number, length: number, seed = 20_240_603): Series[] {
  const random = seededRandom(seed);
  const block: Series[] = [];
  for (let i = 0; i < count; i++) {
    const values = i % 5 === 4 ? ar1(random, length, 0.3) : whiteNoise(random, length);
    block.push({
      values,
      present: new Uint8Array(length).fill(1),
      label: `item ${i + 1}`,
      count: length,
      gaps: 0,
    });
  }
  return block;
}

/**
 * Assertions for seeded simulations: the share, its replication count and its 95% Wilson interval
 * (Wilson 1927, JASA 22:209–212) all go into the failure message.
 */
import { expect } from "vitest";
import { wilsonInterval } from "../../src/sim/calibration";

export function describeShare(share: number, replications: number): string {
  const [low, high] = wilsonInterval(share, replications);
  return `${(100 * share).toFixed(2)}% of ${replications} (95% interval ${(100 * low).toFixed(2)}–${(100 * high).toFixed(2)}%)`;
}

export function expectShareWithin(
  share: number,
  replications: number,
  low: number,
  high: number,
  what: string,
): void {
  const message = `${what}: ${describeShare(share, replications)}, limit [${100 * low}%, ${100 * high}%]`;
  expect(share >= low && share <= high, message).toBe(true);
}

// Timeouts of the simulation tests: an hour each. A seeded simulation is a bounded loop that
// cannot hang, so its timeout only has to outlast a busy machine: the batch's 200 replications of
// 200 series took 107 s on a 2-core machine at load average 8 with the files run one at a time,
// and 936 s at load average 13–19 with both workers busy (it then failed a 900 s timeout).

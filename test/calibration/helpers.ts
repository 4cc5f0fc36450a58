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

// Timeouts of the simulation tests: 20 minutes each, about ten times what the slowest took on a
// 2-core machine at load average 8 with the files run one at a time (the batch's 200 replications
// of 200 series, 107 s). Seen since: 278 s with both workers busy at a higher load, and the n 1000
// cells 420 s each at load average 13–19.

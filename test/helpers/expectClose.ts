/**
 * Numeric assertions that state their tolerance and, on failure, print the input, the expected
 * value, the actual value, the difference and the tolerance.
 */
import { expect } from "vitest";

export type Tolerance = { readonly rel: number } | { readonly abs: number };

function describeTolerance(tolerance: Tolerance): string {
  return "rel" in tolerance ? `relative ${tolerance.rel}` : `absolute ${tolerance.abs}`;
}

/** Whether |actual − expected| is within the tolerance (relative to |expected|, or absolute). */
export function isClose(actual: number, expected: number, tolerance: Tolerance): boolean {
  const difference = Math.abs(actual - expected);
  const limit = "rel" in tolerance ? tolerance.rel * Math.abs(expected) : tolerance.abs;
  return Number.isFinite(actual) && difference <= limit;
}

/** Asserts |actual − expected| ≤ tolerance; `label` names the input and the quantity. */
export function expectClose(
  actual: number,
  expected: number,
  tolerance: Tolerance,
  label: string,
): void {
  const difference = actual - expected;
  const relative = expected === 0 ? NaN : Math.abs(difference / expected);
  const message =
    `${label}: expected ${expected}, got ${actual}, difference ${difference}` +
    ` (relative ${relative.toPrecision(3)}), tolerance ${describeTolerance(tolerance)}`;
  expect(isClose(actual, expected, tolerance), message).toBe(true);
}

/** Asserts lo ≤ actual ≤ hi, printing the input and the interval on failure. */
export function expectWithin(actual: number, lo: number, hi: number, label: string): void {
  const message = `${label}: got ${actual}, allowed interval [${lo}, ${hi}]`;
  expect(actual >= lo && actual <= hi, message).toBe(true);
}

/** Asserts actual ≥ bound, printing the input, the bound and the shortfall on failure. */
export function expectAtLeast(actual: number, bound: number, label: string): void {
  const message = `${label}: got ${actual}, required at least ${bound} (short by ${bound - actual})`;
  expect(actual >= bound, message).toBe(true);
}

/** Asserts actual ≤ bound, printing the input, the bound and the excess on failure. */
export function expectAtMost(actual: number, bound: number, label: string): void {
  const message = `${label}: got ${actual}, allowed at most ${bound} (over by ${actual - bound})`;
  expect(actual <= bound, message).toBe(true);
}

/**
 * A refused whole-number argument carries its parameter: the core's name for it and the range it
 * allows, beside the message (which says the same in words), so each edge can spell the name its
 * users typed without reading the text. One check serves every whole-number argument.
 */
import { describe, expect, it } from "vitest";
import {
  biasCheck,
  EcholotError,
  forecastAudit,
  lagTable,
  requireWholeNumber,
  rollingCheck,
  seriesFromNumbers,
  type RefusedParameter,
} from "../../src/core";

const series = seriesFromNumbers(Array.from({ length: 40 }, (_, t) => Math.sin(t * 1.3) + t / 7));

/** The EcholotError `call` throws. */
function refusal(call: () => unknown): EcholotError {
  try {
    call();
  } catch (error) {
    if (error instanceof EcholotError) return error;
    throw error;
  }
  throw new Error("no refusal");
}

describe("requireWholeNumber(name, value, low, high, describe)", () => {
  it("returns a whole number in range and refuses NaN, ±Infinity, fractions and non-numbers", () => {
    expect(requireWholeNumber("k", 3, 1, 5, () => "")).toBe(3);
    expect(requireWholeNumber("k", 1, 1, 1, () => "")).toBe(1);
    for (const bad of [0, 6, 2.5, NaN, Infinity, -Infinity, null, undefined, "3"]) {
      const error = refusal(() => requireWholeNumber("k", bad, 1, 5, () => `k: ${bad}`));
      expect(error.kind, String(bad)).toBe("invalid");
      expect(error.message).toBe(`k: ${bad}`);
      expect(error.parameter).toEqual({ name: "k", low: 1, high: 5 });
    }
  });
});

describe("the core's whole-number arguments refuse with their parameter and range (n = 40)", () => {
  const cases: readonly [string, () => unknown, RefusedParameter][] = [
    [
      "lagTable maxLag 40",
      () => lagTable(series, { maxLag: 40 }),
      { name: "maxLag", low: 1, high: 39 },
    ],
    [
      "lagTable season 1",
      () => lagTable(series, { season: 1 }),
      { name: "season", low: 2, high: 39 },
    ],
    [
      "lagTable fittedParams 5 of 5 lags",
      () => lagTable(series, { maxLag: 5, fittedParams: 5 }),
      { name: "fittedParams", low: 0, high: 4 },
    ],
    [
      "biasCheck hacLags 2.5",
      () => biasCheck(series, { hacLags: 2.5 }),
      { name: "hacLags", low: 0, high: 39 },
    ],
    [
      "forecastAudit horizon 0",
      () => forecastAudit(series, { horizon: 0 }),
      { name: "horizon", low: 1, high: 39 },
    ],
    [
      "forecastAudit maxLag 2 at horizon 3",
      () => forecastAudit(series, { horizon: 3, maxLag: 2 }),
      { name: "maxLag", low: 3, high: 39 },
    ],
    [
      "rollingCheck window 2",
      () => rollingCheck(series, { window: 2 }),
      { name: "window", low: 3, high: 40 },
    ],
    [
      "rollingCheck lags 10 in a window of 10",
      () => rollingCheck(series, { window: 10, lags: 10 }),
      { name: "lags", low: 1, high: 9 },
    ],
    [
      "rollingCheck step 0",
      () => rollingCheck(series, { window: 10, step: 0 }),
      { name: "step", low: 1, high: 40 },
    ],
  ];
  for (const [what, call, parameter] of cases) {
    it(`${what}: invalid, with ${parameter.name} from ${parameter.low} to ${parameter.high}`, () => {
      const error = refusal(call);
      expect(error.kind).toBe("invalid");
      expect(error.parameter).toEqual(parameter);
      expect(error.message).toMatch(new RegExp(`^${parameter.name} must be a whole number from `));
    });
  }
});

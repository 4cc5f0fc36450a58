/**
 * A refused argument carries its parameter: the core's name for it and what it allows (a range of
 * whole numbers, an open range, a list of words), beside the message (which says the same in
 * words and starts with the name), so each edge can spell the name its users typed without
 * reading the text. One check serves every whole-number argument.
 */
import { describe, expect, it } from "vitest";
import {
  auditBatch,
  batchCheck,
  batchOfResults,
  biasCheck,
  EcholotError,
  forecastAudit,
  lagTable,
  parseBandKind,
  parseTestKind,
  requireWholeNumber,
  rollingCheck,
  seriesFromNumbers,
  seriesResult,
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
    expect(requireWholeNumber("step", 3, 1, 5, () => "")).toBe(3);
    expect(requireWholeNumber("step", 1, 1, 1, () => "")).toBe(1);
    for (const bad of [0, 6, 2.5, NaN, Infinity, -Infinity, null, undefined, "3"]) {
      const error = refusal(() => requireWholeNumber("step", bad, 1, 5, () => `step is ${bad}`));
      expect(error.kind, String(bad)).toBe("invalid");
      expect(error.message).toBe(`step is ${bad}`);
      expect(error.parameter).toEqual({ name: "step", allows: "whole", low: 1, high: 5 });
    }
  });
});

describe("EcholotError's parameter and messageNaming(spelling)", () => {
  it("names the refused argument as an edge spells it, and only at the start", () => {
    const error = new EcholotError(
      "invalid",
      "maxLag must be a whole number from 1 to 9 (maxLag 12 given)",
      { name: "maxLag", allows: "whole", low: 1, high: 9 },
    );
    expect(error.messageNaming("--lags")).toBe(
      "--lags must be a whole number from 1 to 9 (maxLag 12 given)",
    );
    expect(error.messageNaming("Max lag")).toMatch(/^Max lag must be /);
  });

  it("leaves a message about no argument as it is", () => {
    expect(new EcholotError("short", "too few values").messageNaming("--lags")).toBe(
      "too few values",
    );
  });

  it("refuses to build a parameter's refusal whose message does not start with its name", () => {
    expect(
      () => new EcholotError("invalid", "the lags are wrong", { name: "maxLag", allows: "number" }),
    ).toThrow(/a refusal of maxLag must start with its name/);
  });
});

describe("the core's whole-number arguments refuse with their parameter and range (n = 40)", () => {
  type Whole = Extract<RefusedParameter, { allows: "whole" }>;
  const whole = (name: Whole["name"], low: number, high: number): Whole => ({
    name,
    allows: "whole",
    low,
    high,
  });
  const cases: readonly [string, () => unknown, Whole][] = [
    ["lagTable maxLag 40", () => lagTable(series, { maxLag: 40 }), whole("maxLag", 1, 39)],
    ["lagTable season 1", () => lagTable(series, { season: 1 }), whole("season", 2, 39)],
    [
      "lagTable fittedParams 5 of 5 lags",
      () => lagTable(series, { maxLag: 5, fittedParams: 5 }),
      whole("fittedParams", 0, 4),
    ],
    ["biasCheck hacLags 2.5", () => biasCheck(series, { hacLags: 2.5 }), whole("hacLags", 0, 39)],
    [
      "forecastAudit horizon 0",
      () => forecastAudit(series, { horizon: 0 }),
      whole("horizon", 1, 39),
    ],
    [
      "forecastAudit maxLag 2 at horizon 3",
      () => forecastAudit(series, { horizon: 3, maxLag: 2 }),
      whole("maxLag", 3, 39),
    ],
    ["rollingCheck window 2", () => rollingCheck(series, { window: 2 }), whole("window", 3, 40)],
    [
      "rollingCheck lags 10 in a window of 10",
      () => rollingCheck(series, { window: 10, lags: 10 }),
      whole("lags", 1, 9),
    ],
    [
      "rollingCheck step 0",
      () => rollingCheck(series, { window: 10, step: 0 }),
      whole("step", 1, 40),
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

describe("the other option refusals carry their parameter too", () => {
  it("alpha: a number strictly between 0 and 1", () => {
    for (const alpha of [0, 1, 1.5, NaN]) {
      const error = refusal(() => lagTable(series, { alpha }));
      expect(error.kind).toBe("invalid");
      expect(error.parameter).toEqual({ name: "alpha", allows: "between", low: 0, high: 1 });
      expect(error.message).toMatch(/^alpha must be a number between 0 and 1, such as 0.05 /);
    }
  });

  it("bandKind and testKind: one of their words, whether text or not", () => {
    for (const given of ["wide", 2]) {
      const band = refusal(() => parseBandKind(given));
      expect(band.parameter).toEqual({
        name: "bandKind",
        allows: "word",
        words: ["noise", "bartlett", "robust"],
      });
      expect(band.message).toMatch(/^bandKind must be one of "noise", "bartlett" or "robust" /);
      const test = refusal(() => parseTestKind(given));
      expect(test.parameter).toEqual({
        name: "testKind",
        allows: "word",
        words: ["ljung-box", "box-pierce", "robust", "squares"],
      });
    }
    // The message quotes text as given and shows anything else as it is.
    expect(refusal(() => parseBandKind("wide")).message).toMatch(/\(got "wide"\)$/);
    expect(refusal(() => parseBandKind(2)).message).toMatch(/\(got 2\)$/);
  });

  it("fittedParams says how the degrees of freedom come about without naming itself twice", () => {
    const error = refusal(() => lagTable(series, { maxLag: 10, fittedParams: 10 }));
    expect(error.message).toBe(
      "fittedParams must be a whole number from 0 to 9: the test's degrees of freedom, 10 lags minus the fitted parameters, must be at least 1 (got 10)",
    );
  });
});

describe("a batch that refuses every series refuses with the first one's parameter", () => {
  const other = seriesFromNumbers(Array.from({ length: 30 }, (_, t) => Math.cos(t * 0.7)));

  it("batchCheck and batchOfResults (the CLI's per-series stage and merge) alike", () => {
    const direct = refusal(() => batchCheck([series, other], { maxLag: 45 }));
    const merged = refusal(() =>
      batchOfResults([series, other].map((s, i) => seriesResult(s, i, { maxLag: 45 }))),
    );
    for (const error of [direct, merged]) {
      expect(error.parameter).toEqual({ name: "maxLag", allows: "whole", low: 1, high: 39 });
      expect(error.message).toMatch(/^maxLag must be a whole number from 1 to 39/);
    }
  });

  it("auditBatch", () => {
    const error = refusal(() => auditBatch([series, other], { horizon: 45 }));
    expect(error.parameter).toEqual({ name: "horizon", allows: "whole", low: 1, high: 39 });
  });
});

describe("a rolling check of fewer than 3 rows", () => {
  it("is short of data (#N/A in a cell), as its siblings are", () => {
    const error = refusal(() => rollingCheck(seriesFromNumbers([1, 2]), { window: 3 }));
    expect(error.kind).toBe("short");
    expect(error.message).toBe(
      "a rolling check needs a series of at least 3 rows; this one spans 2",
    );
  });
});

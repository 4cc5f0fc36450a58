/**
 * Bad input for every side check: each case names the call, the EcholotError kind it must raise
 * (`invalid`: the user must fix something; `short`: too few values) and what the message must say
 * — the allowed range, the size, or what to do instead.
 */
import { describe, expect, it } from "vitest";
import {
  auditBatch,
  batchCheck,
  biasCheck,
  crossCorrelation,
  EcholotError,
  forecastAudit,
  normalityCheck,
  rollingCheck,
  runsCheck,
  seriesFromCells,
  seriesFromNumbers,
  seriesFromValues,
  volatilityCheck,
  type EcholotErrorKind,
} from "../../src/core";

/** 30 non-constant numbers. */
const thirty = seriesFromNumbers(
  Array.from({ length: 30 }, (_, t) => Math.sin(t) + t / 10),
  "thirty",
);
const constant = seriesFromNumbers(
  Array.from({ length: 30 }, () => 4),
  "flat",
);
/** ±1 alternating: every squared deviation is 1. */
const alternating = seriesFromNumbers(Array.from({ length: 30 }, (_, t) => (t % 2 === 0 ? 1 : -1)));
const column = (...cells: unknown[]): unknown[][] => cells.map((cell) => [cell]);

interface BadCase {
  readonly name: string;
  readonly call: () => unknown;
  readonly kind: EcholotErrorKind;
  readonly names: RegExp;
}

const cases: readonly BadCase[] = [
  // volatility
  {
    name: "volatilityCheck(lags 0)",
    call: () => volatilityCheck(thirty, { lags: 0 }),
    kind: "invalid",
    names: /lags must be a whole number from 1 to 29 \(the series has 30 values\)/,
  },
  {
    name: "volatilityCheck(lags 2.5)",
    call: () => volatilityCheck(thirty, { lags: 2.5 }),
    kind: "invalid",
    names: /lags must be a whole number/,
  },
  {
    name: "volatilityCheck(lags NaN)",
    call: () => volatilityCheck(thirty, { lags: NaN }),
    kind: "invalid",
    names: /lags must be a whole number/,
  },
  {
    name: "volatilityCheck(lags 20 of 30 values) has too few rows",
    call: () => volatilityCheck(thirty, { lags: 20 }),
    kind: "short",
    names: /needs at least 22 rows .* has 10: use fewer lags/,
  },
  {
    name: "volatilityCheck(two values)",
    call: () => volatilityCheck(seriesFromNumbers([1, 2])),
    kind: "short",
    names: /at least 3 values; the series has 2/,
  },
  {
    name: "volatilityCheck(constant squared deviations)",
    call: () => volatilityCheck(alternating, { lags: 2 }),
    kind: "invalid",
    names: /squared deviations .* (constant|do not vary)/,
  },
  {
    name: "volatilityCheck(alpha 1)",
    call: () => volatilityCheck(thirty, { alpha: 1 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1/,
  },
  // bias
  {
    name: "biasCheck(hacLags −1)",
    call: () => biasCheck(thirty, { hacLags: -1 }),
    kind: "invalid",
    names: /hacLags must be a whole number from 0 to 29/,
  },
  {
    name: "biasCheck(hacLags 30 of 30 values)",
    call: () => biasCheck(thirty, { hacLags: 30 }),
    kind: "invalid",
    names: /hacLags must be a whole number from 0 to 29\b.*got 30\)/,
  },
  {
    name: "biasCheck(hacLags 1.5)",
    call: () => biasCheck(thirty, { hacLags: 1.5 }),
    kind: "invalid",
    names: /hacLags must be a whole number/,
  },
  {
    name: "biasCheck(constant series)",
    call: () => biasCheck(constant),
    kind: "invalid",
    names: /"flat" is constant: its mean has no sampling error/,
  },
  {
    name: "biasCheck(two values)",
    call: () => biasCheck(seriesFromNumbers([1, 2])),
    kind: "short",
    names: /the bias check needs at least 3 values/,
  },
  // forecast audit
  {
    name: "forecastAudit(horizon 0)",
    call: () => forecastAudit(thirty, { horizon: 0 }),
    kind: "invalid",
    names: /horizon must be a whole number from 1 to 29, the number of periods ahead .* got 0/,
  },
  {
    name: "forecastAudit(horizon −2)",
    call: () => forecastAudit(thirty, { horizon: -2 }),
    kind: "invalid",
    names: /horizon must be a whole number from 1 to 29/,
  },
  {
    name: "forecastAudit(horizon 1.5)",
    call: () => forecastAudit(thirty, { horizon: 1.5 }),
    kind: "invalid",
    names: /horizon must be a whole number/,
  },
  {
    name: "forecastAudit(horizon NaN)",
    call: () => forecastAudit(thirty, { horizon: NaN }),
    kind: "invalid",
    names: /horizon must be a whole number.*got NaN/,
  },
  {
    name: "forecastAudit(horizon 30 of 30 values)",
    call: () => forecastAudit(thirty, { horizon: 30 }),
    kind: "invalid",
    names: /from 1 to 29/,
  },
  {
    name: "forecastAudit(maxLag below the horizon)",
    call: () => forecastAudit(thirty, { horizon: 4, maxLag: 3 }),
    kind: "invalid",
    names: /maxLag must be a whole number from the horizon 4 to 29/,
  },
  {
    name: "forecastAudit(season 1)",
    call: () => forecastAudit(thirty, { horizon: 1, season: 1 }),
    kind: "invalid",
    names: /season must be a whole number from 2/,
  },
  {
    name: "forecastAudit(alpha 0)",
    call: () => forecastAudit(thirty, { horizon: 1, alpha: 0 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1/,
  },
  {
    name: "forecastAudit(constant errors)",
    call: () => forecastAudit(constant, { horizon: 1 }),
    kind: "invalid",
    names: /constant/,
  },
  // batch
  {
    name: "batchCheck(one series)",
    call: () => batchCheck([thirty]),
    kind: "invalid",
    names: /at least 2 series \(one per column\); got 1: for a single series use the noise check/,
  },
  {
    name: "batchCheck(no series)",
    call: () => batchCheck([]),
    kind: "invalid",
    names: /at least 2 series .*got 0/,
  },
  {
    name: "batchCheck(every series constant) says why once",
    call: () => batchCheck([constant, constant]),
    kind: "invalid",
    names: /"flat" is constant/,
  },
  {
    name: "batchCheck(maxLag too large for every series)",
    call: () => batchCheck([thirty, thirty], { maxLag: 40 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "batchCheck(alpha 5)",
    call: () => batchCheck([thirty, thirty], { alpha: 5 }),
    kind: "invalid",
    names: /alpha must be a number between 0 and 1/,
  },
  {
    name: "auditBatch(every series constant)",
    call: () => auditBatch([constant, constant], { horizon: 1 }),
    kind: "invalid",
    names: /"flat" is constant/,
  },
  {
    name: "auditBatch(horizon 0)",
    call: () => auditBatch([thirty, thirty], { horizon: 0 }),
    kind: "invalid",
    names: /horizon must be a whole number/,
  },
  // cross-correlation
  {
    name: "crossCorrelation(30 rows against 29)",
    call: () =>
      crossCorrelation(
        thirty,
        seriesFromNumbers(Array.from({ length: 29 }, (_, t) => Math.cos(t))),
      ),
    kind: "invalid",
    names: /x \("thirty"\) covers 30 rows and y 29: give two ranges of the same size/,
  },
  {
    name: "crossCorrelation(ranges of different sizes, trailing gaps trimmed)",
    call: () =>
      crossCorrelation(
        seriesFromCells(column(1, 2, 3, 4, null)),
        seriesFromCells(column(1, 3, 2, 4)),
      ),
    kind: "invalid",
    names: /covers 5 rows and y 4/,
  },
  {
    name: "crossCorrelation(maxLag 30 of 30 pairs)",
    call: () => crossCorrelation(thirty, thirty, { maxLag: 30 }),
    kind: "invalid",
    names: /maxLag must be a whole number from 1 to 29/,
  },
  {
    name: "crossCorrelation(constant y)",
    call: () => crossCorrelation(thirty, constant),
    kind: "invalid",
    names: /y \("flat"\) is constant over the periods where both series have a value/,
  },
  {
    name: "crossCorrelation(two common periods)",
    call: () =>
      crossCorrelation(seriesFromValues([1, 2, null, 4]), seriesFromValues([null, 5, 6, 7])),
    kind: "short",
    names: /at least 3 periods where both series have a value; these have 2/,
  },
  // rolling
  {
    name: "rollingCheck(window larger than the series)",
    call: () => rollingCheck(thirty, { window: 31 }),
    kind: "invalid",
    names:
      /window must be a whole number from 3 to 30 \(rows per window, at most the 30 rows the series spans\) \(got 31\)/,
  },
  {
    name: "rollingCheck(window 2)",
    call: () => rollingCheck(thirty, { window: 2 }),
    kind: "invalid",
    names: /window must be a whole number from 3 to 30/,
  },
  {
    name: "rollingCheck(window 12.5)",
    call: () => rollingCheck(thirty, { window: 12.5 }),
    kind: "invalid",
    names: /window must be a whole number/,
  },
  {
    name: "rollingCheck(lags as many as the window)",
    call: () => rollingCheck(thirty, { window: 10, lags: 10 }),
    kind: "invalid",
    names: /lags must be a whole number from 1 to 9 \(fewer than the window of 10\)/,
  },
  {
    name: "rollingCheck(step 0)",
    call: () => rollingCheck(thirty, { window: 10, step: 0 }),
    kind: "invalid",
    names: /step must be a whole number from 1 to 30/,
  },
  {
    name: "rollingCheck(a series of 2 rows)",
    call: () => rollingCheck(seriesFromNumbers([1, 2]), { window: 2 }),
    // Too little data, as for every sibling check (#N/A in a cell), not a bad argument.
    kind: "short",
    names: /at least 3 rows; this one spans 2/,
  },
  // runs and normality
  {
    name: "runsCheck(constant series)",
    call: () => runsCheck(constant),
    kind: "invalid",
    names: /"flat" has values on only one side of its median 4/,
  },
  {
    name: "runsCheck(all but one equal to the median)",
    call: () => runsCheck(seriesFromNumbers([2, 2, 2, 5, 2])),
    kind: "invalid",
    names: /only one side of its median 2/,
  },
  {
    name: "runsCheck(two values)",
    call: () => runsCheck(seriesFromNumbers([1, 2])),
    kind: "short",
    names: /a runs test needs at least 3 values/,
  },
  {
    name: "normalityCheck(constant series)",
    call: () => normalityCheck(constant),
    kind: "invalid",
    names: /"flat" is constant: its skewness and kurtosis are undefined/,
  },
  {
    name: "normalityCheck(two values)",
    call: () => normalityCheck(seriesFromNumbers([1, 2])),
    kind: "short",
    names: /Jarque–Bera test needs at least 3 values/,
  },
];

describe("side checks refuse bad input with a message that says what to do", () => {
  for (const c of cases) {
    it(`${c.name} is ${c.kind}`, () => {
      let caught: unknown;
      try {
        c.call();
      } catch (error) {
        caught = error;
      }
      expect(caught, `${c.name} must throw`).toBeInstanceOf(EcholotError);
      const error = caught as EcholotError;
      expect(error.kind, `${c.name}: kind (message: ${error.message})`).toBe(c.kind);
      expect(error.message, `${c.name}: message`).toMatch(c.names);
    });
  }

  it("batchCheck(one constant series among others) keeps its row with the reason and leaves it out of the BH family", () => {
    const batch = batchCheck([thirty, constant, thirty]);
    const row = batch.rows[1];
    expect(row?.verdict).toBeNull();
    expect(row?.reason).toMatch(/"flat" is constant/);
    expect(Number.isNaN(row?.qValue ?? 0)).toBe(true);
    expect(batch.analysed).toBe(2);
  });
});

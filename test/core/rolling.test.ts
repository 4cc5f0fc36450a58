/**
 * rollingCheck against recomputing every window from scratch with the lag table (the sliding sums
 * must give the same joint-test p to 1e-10), on seeded random data with gaps, plus where the NaNs
 * go and a fast-check property.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  isEcholotError,
  lagTable,
  rollingCheck,
  seriesFromValues,
  type Series,
} from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { expectClose } from "../helpers/expectClose";

/** p of the window ending at `end`, from scratch: the window's cells through the lag table. */
function fromScratch(
  cells: readonly (number | null)[],
  end: number,
  window: number,
  lags: number,
): number {
  const slice = cells.slice(end - window + 1, end + 1);
  try {
    return lagTable(seriesFromValues(slice), { maxLag: lags }).joint.p;
  } catch (error) {
    if (isEcholotError(error)) return NaN; // too few values or a constant window
    throw error;
  }
}

/** Seeded cells: a level that shifts, noise, and gaps at rate `gapRate`. */
function randomCells(seed: number, n: number, gapRate: number): (number | null)[] {
  const random = seededRandom(seed);
  const cells: (number | null)[] = [];
  for (let t = 0; t < n; t++) {
    const value = 1000 + (t > n / 2 ? 50 : 0) + 3 * random.normal() + 0.5 * Math.sin(t / 7);
    cells.push(t > 0 && t < n - 1 && random.uniform() < gapRate ? null : value);
  }
  return cells;
}

function compare(
  cells: readonly (number | null)[],
  series: Series,
  window: number,
  lags: number,
  step: number,
): number {
  const rolling = rollingCheck(series, { window, lags, step });
  let compared = 0;
  for (let end = 0; end < cells.length; end++) {
    const got = rolling.p[end] as number;
    const reported = end >= window - 1 && (end - (window - 1)) % step === 0;
    if (!reported) {
      expect(
        Number.isNaN(got),
        `position ${end} (window ${window}, step ${step}) must be NaN`,
      ).toBe(true);
      continue;
    }
    const expected = fromScratch(cells, end, window, lags);
    if (Number.isNaN(expected)) {
      expect(Number.isNaN(got), `window ending at ${end} cannot be tested, so NaN`).toBe(true);
      continue;
    }
    expectClose(
      got,
      expected,
      { abs: 1e-10 },
      `rolling p, window ${window} ending at ${end}, lags ${lags}, step ${step}`,
    );
    compared++;
  }
  return compared;
}

describe("rollingCheck(series, { window, lags, step })", () => {
  it("equals the lag table recomputed for each window, to 1e-10, on random data with 10% gaps", () => {
    const cells = randomCells(20261210, 600, 0.1);
    const series = seriesFromValues(cells);
    expect(series.values.length, "no leading or trailing gap was trimmed").toBe(600);
    let compared = 0;
    compared += compare(cells, series, 60, 6, 1);
    compared += compare(cells, series, 25, 4, 3);
    compared += compare(cells, series, 200, 10, 7);
    expect(compared, "windows compared").toBeGreaterThan(700);
  });

  it("equals the from-scratch p where windows have many gaps (some too sparse to test)", () => {
    const cells = randomCells(20261211, 300, 0.6);
    const compared = compare(cells, seriesFromValues(cells), 12, 5, 1);
    expect(compared, "windows compared").toBeGreaterThan(50);
  });

  it("gives NaN for a constant window and recovers after it", () => {
    const cells: number[] = [];
    const random = seededRandom(7);
    for (let t = 0; t < 120; t++) cells.push(t >= 40 && t < 80 ? 5 : random.normal());
    const rolling = rollingCheck(seriesFromValues(cells), { window: 30, lags: 3 });
    expect(Number.isNaN(rolling.p[75] as number), "window 46..75 is constant").toBe(true);
    for (const end of [35, 100, 119]) {
      expectClose(
        rolling.p[end] as number,
        fromScratch(cells, end, 30, 3),
        { abs: 1e-10 },
        `window ending at ${end}`,
      );
    }
  });

  it("defaults lags to min(10, ⌊window/5⌋) and step to 1", () => {
    const cells = randomCells(3, 100, 0);
    const rolling = rollingCheck(seriesFromValues(cells), { window: 40 });
    expect([rolling.lags, rolling.step]).toEqual([8, 1]);
    expect(Number.isNaN(rolling.p[38] as number)).toBe(true);
    expect(Number.isFinite(rolling.p[39] as number)).toBe(true);
  });

  it("does not mutate its input", () => {
    const series = seriesFromValues(randomCells(4, 80, 0.1));
    const before = Array.from(series.values);
    rollingCheck(series, { window: 20, lags: 3 });
    expect(Array.from(series.values)).toEqual(before);
  });

  it("property: every reported p matches the from-scratch p (fast-check, 150 cases)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.option(
            // Values to three decimals: sums of squares never underflow to denormals.
            fc.integer({ min: -1_000_000, max: 1_000_000 }).map((v) => v / 1000),
            { freq: 6 },
          ),
          {
            minLength: 12,
            maxLength: 80,
          },
        ),
        fc.integer({ min: 3, max: 30 }),
        fc.integer({ min: 1, max: 4 }),
        fc.integer({ min: 1, max: 5 }),
        (raw, windowWanted, lagsWanted, step) => {
          const cells = raw.map((v) => (v === null ? null : v));
          cells[0] = 1;
          cells[cells.length - 1] = 2;
          const series = seriesFromValues(cells);
          const window = Math.min(windowWanted, series.values.length);
          const lags = Math.min(lagsWanted, window - 1);
          const rolling = rollingCheck(series, { window, lags, step });
          for (let end = window - 1; end < cells.length; end += step) {
            const expected = fromScratch(cells, end, window, lags);
            const got = rolling.p[end] as number;
            if (Number.isNaN(expected)) continue;
            if (!(Math.abs(got - expected) <= 1e-9)) {
              throw new Error(
                `window ${window} ending at ${end}, lags ${lags}: expected ${expected}, got ${got}`,
              );
            }
          }
        },
      ),
      { numRuns: 150, seed: 20261212 },
    );
  });
});

/**
 * Extreme magnitudes: correlations, bands and tests are scale-free, so a series multiplied by
 * 1e150 or 1e-170 must give the same figures as the series itself (the core rescales deviations
 * by a power of two when their squares or fourth powers would overflow or underflow).
 * The reference is Series F itself (Box–Jenkins; NIST/SEMATECH e-Handbook §6.4.4.9), unscaled.
 */
import { describe, it } from "vitest";
import { lagTable, normalityCheck, seriesFromNumbers } from "../../src/core";
import { expectClose } from "../helpers/expectClose";
import { readSeriesF } from "../helpers/fixtures";

const seriesF = readSeriesF();

describe.each([1e150, 1e-170, 2.5e100, 3e-120])("lagTable(series × %s)", (factor) => {
  it("gives the unscaled correlations, robust bands, tests and a variance scaled by factor²", () => {
    for (const bandKind of ["noise", "robust"] as const) {
      const plain = lagTable(seriesFromNumbers(seriesF), {
        maxLag: 10,
        bandKind,
        testKind: "robust",
      });
      const scaled = lagTable(seriesFromNumbers(seriesF.map((x) => x * factor)), {
        maxLag: 10,
        bandKind,
        testKind: "robust",
      });
      plain.rows.forEach((row, i) => {
        const other = scaled.rows[i]!;
        expectClose(other.correlation, row.correlation, { rel: 1e-13 }, `r_${row.lag} ×${factor}`);
        expectClose(other.band, row.band, { rel: 1e-13 }, `${bandKind} band_${row.lag} ×${factor}`);
      });
      expectClose(scaled.joint.q, plain.joint.q, { rel: 1e-13 }, `robust Q* ×${factor}`);
      if (factor * factor * plain.variance < 1e300 && factor * factor > 1e-290) {
        expectClose(
          scaled.variance,
          plain.variance * factor * factor,
          { rel: 1e-13 },
          `variance ×${factor}`,
        );
      }
    }
  });

  it("keeps the squared-deviation (McLeod–Li) test and Jarque–Bera unchanged", () => {
    const plain = lagTable(seriesFromNumbers(seriesF), { maxLag: 5, testKind: "squares" });
    const scaled = lagTable(seriesFromNumbers(seriesF.map((x) => x * factor)), {
      maxLag: 5,
      testKind: "squares",
    });
    expectClose(scaled.joint.q, plain.joint.q, { rel: 1e-12 }, `McLeod–Li Q(5) ×${factor}`);
    const jb = normalityCheck(seriesFromNumbers(seriesF)).jb;
    const jbScaled = normalityCheck(seriesFromNumbers(seriesF.map((x) => x * factor))).jb;
    expectClose(jbScaled, jb, { rel: 1e-12 }, `Jarque–Bera ×${factor}`);
  });
});

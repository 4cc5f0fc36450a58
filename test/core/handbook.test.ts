/**
 * Values printed in the NIST/SEMATECH e-Handbook of Statistical Methods and other published
 * tables (see test/fixtures/README.md): Series F autocorrelations, LEW.DAT autocorrelations, the
 * chi-square critical values and standard normal quantiles.
 */
import { describe, expect, it } from "vitest";
import {
  chiSquareUpperTail,
  lagTable,
  normalQuantile,
  normalUpperTail,
  seriesFromNumbers,
} from "../../src/core";
import { Exact, exactAutocorrelations, exactOfDouble } from "../helpers/exact";
import { expectClose, expectWithin } from "../helpers/expectClose";
import { readSeriesF, readStrd, readTsv } from "../helpers/fixtures";

describe("Series F (Box–Jenkins), NIST/SEMATECH e-Handbook §6.4.4.9", () => {
  const seriesF = seriesFromNumbers(readSeriesF(), "yield");
  const table = lagTable(seriesF, { maxLag: 24 });

  it("seriesFromNumbers(series-f.csv) holds the 70 batch yields", () => {
    expect(seriesF.count).toBe(70);
    expect(seriesF.gaps).toBe(0);
  });

  it("lagTable(Series F) gives the printed r_1..r_12 and r_24 to 9 decimals", () => {
    // Source: NIST/SEMATECH e-Handbook §6.4.4.9 (page pmc449), printed to 9 decimals, so the
    // tolerance is half a unit in the 9th decimal.
    const printed: readonly (readonly [number, number])[] = [
      [1, -0.389878319],
      [2, 0.304394082],
      [3, -0.165554717],
      [4, 0.070719321],
      [5, -0.097039288],
      [6, -0.047057692],
      [7, 0.035373112],
      [8, -0.043458199],
      [9, -0.004796162],
      [10, 0.014393137],
      [11, 0.1099172],
      [12, -0.068778492],
      [24, -0.073114034],
    ];
    for (const [lag, value] of printed) {
      const row = table.rows[lag - 1];
      expectClose(row?.correlation ?? NaN, value, { abs: 5e-10 }, `Series F r_${lag}`);
    }
  });

  it("lagTable(Series F) gives the printed (n−1) variance 141.8238", () => {
    // Source: NIST/SEMATECH e-Handbook §6.4.4.9, printed to 4 decimals. The table's variance is
    // c0/n; the handbook's is c0/(n−1).
    const sampleVariance = (table.variance * table.n) / (table.n - 1);
    expectClose(sampleVariance, 141.8238, { abs: 5e-5 }, "Series F variance (n−1)");
  });
});

describe("LEW.DAT autocorrelations, NIST/SEMATECH e-Handbook §1.3.5.12", () => {
  const rows = readTsv("lew-acf-ehandbook.tsv");
  const lew = readStrd("Lew");
  const table = lagTable(seriesFromNumbers(lew, "LEW"), { maxLag: 49 });

  it("reads lags 0–49 from the printed table", () => {
    expect(rows.map((row) => Number(row.lag))).toEqual(Array.from({ length: 50 }, (_, k) => k));
  });

  it("lagTable(LEW) rounds to every printed 2-decimal r_k, lags 1–49", () => {
    // Source: NIST/SEMATECH e-Handbook §1.3.5.12 (eda35c.htm), printed to 2 decimals: the
    // computed value must round to the printed one (−0.0006 prints as 0.00).
    for (const row of rows.slice(1)) {
      const lag = Number(row.lag);
      const computed = table.rows[lag - 1]?.correlation ?? NaN;
      const rounded = computed.toFixed(2).replace(/^-(0\.0+)$/, "$1");
      expect(
        rounded,
        `LEW r_${lag}: computed ${computed} rounds to ${rounded}, printed ${row.printed_2dp}`,
      ).toBe(row.printed_2dp);
    }
  });

  it("lagTable(LEW) matches the exact r_k of the data to a relative 1e-12, lags 1–49", () => {
    // Reference: exact rational evaluation of the published definition (biased estimator) on
    // strd/Lew.dat, 20 significant digits (exact_r_k column). The integer data are exact doubles.
    const ours = exactAutocorrelations(Array.from(lew, exactOfDouble), 49);
    for (const row of rows.slice(1)) {
      const lag = Number(row.lag);
      const exact = new Exact(row.exact_r_k ?? "NaN");
      // The fixture's exact column and our own 60-digit evaluation agree to its 20 digits.
      const agreement = (ours[lag] as InstanceType<typeof Exact>).minus(exact).abs();
      expect(agreement.lte(exact.abs().times(1e-19)), `LEW exact r_${lag}`).toBe(true);
      const computed = table.rows[lag - 1]?.correlation ?? NaN;
      expectClose(computed, exact.toNumber(), { rel: 1e-12 }, `LEW r_${lag} vs exact`);
    }
  });
});

describe("chi-square critical values, NIST/SEMATECH e-Handbook §1.3.6.7.4", () => {
  const rows = readTsv("chisq-table.tsv");

  it("chiSquareUpperTail(critical, df) equals the table's upper-tail probability to 1e-12", () => {
    // Source: NIST/SEMATECH e-Handbook §1.3.6.7.4 table (df 1–40, upper tail 0.05 and 0.01),
    // evaluated at the 30-digit critical values of the fixture (which both printed columns
    // match when rounded). The 30 digits round to the nearest double before the call.
    expect(rows.length).toBeGreaterThanOrEqual(20);
    for (const row of rows) {
      const df = Number(row.df);
      const tail = Number(row.upper_tail_prob);
      const critical = Number(row.ours_30sig);
      expectClose(
        chiSquareUpperTail(critical, df),
        tail,
        { rel: 1e-12 },
        `χ² df ${df} at ${critical}`,
      );
    }
  });

  it("chiSquareUpperTail brackets the tail probability around each printed 3-decimal value", () => {
    // Source: NIST/SEMATECH e-Handbook §1.3.6.7.4, printed to 3 decimals: the true critical
    // value lies within half a unit of the printed one, so the upper tail at printed − 0.0005
    // is above the level and at printed + 0.0005 below it.
    for (const row of rows) {
      const df = Number(row.df);
      const tail = Number(row.upper_tail_prob);
      const printed = Number(row.printed_3dp);
      const below = chiSquareUpperTail(printed - 0.0005, df);
      const above = chiSquareUpperTail(printed + 0.0005, df);
      expectWithin(tail, above, below, `χ² df ${df}, printed ${printed}: tail bracket`);
    }
  });
});

describe("standard normal quantiles (OEIS A329280–A329286 and printed tables)", () => {
  const rows = readTsv("normal-quantiles.tsv");

  /**
   * The double nearest p differs from p by δp (up to 5.6e-17 here), which moves the quantile by
   * δp/φ(z) — up to 3e-14 at p = 0.9995, far more than a double's last digit. The reference is
   * therefore the quantile of the double actually passed: z(p) + δp/φ(z(p)) (first order; the
   * second-order term is below 1e-27).
   */
  function quantileOfDouble(p: string, z: number): number {
    const deltaP = exactOfDouble(Number(p)).minus(new Exact(p)).toNumber();
    const density = Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
    return z + deltaP / density;
  }

  it("normalQuantile(p) matches the 50-digit values to a relative 1e-15", () => {
    // Source per row in normal-quantiles.tsv (OEIS A329280–A329286, printed tables); the
    // printed digits agree with the 50-digit column. A double holds about 1.1e-16 relative.
    for (const row of rows) {
      const p = row.p ?? "";
      const reference = quantileOfDouble(p, Number(row.ours_50sig));
      expectClose(
        normalQuantile(Number(p)),
        reference,
        { rel: 1e-15 },
        `z_${p} (of the double ${Number(p)})`,
      );
    }
  });

  it("normalQuantile(p) agrees with every printed digit (one unit in the last printed place)", () => {
    // Source per row in normal-quantiles.tsv: printed values are truncated (OEIS) or rounded
    // (4-decimal tables), so they lie within one unit of their last printed decimal.
    for (const row of rows) {
      const p = row.p ?? "";
      const printed = row.printed ?? "";
      const decimals = printed.split(".")[1]?.length ?? 0;
      const z = Number(row.ours_50sig);
      // One unit in the last printed place, plus what the double nearest p moves the quantile.
      const unit = 10 ** -decimals + Math.abs(quantileOfDouble(p, z) - z) + 4e-16 * Math.abs(z);
      expectClose(
        normalQuantile(Number(p)),
        Number(printed),
        { abs: unit },
        `z_${p} printed ${printed}`,
      );
    }
  });

  it("normalUpperTail(z_p) returns 1 − p for each tabulated quantile", () => {
    // Source per row in normal-quantiles.tsv; the upper tail is computed directly (erfc).
    for (const row of rows) {
      const p = Number(row.p);
      const z = Number(row.ours_50sig);
      expectClose(
        normalUpperTail(z),
        new Exact(1).minus(row.p ?? "").toNumber(),
        { rel: 1e-13 },
        `Φᶜ(z_${p})`,
      );
    }
  });
});

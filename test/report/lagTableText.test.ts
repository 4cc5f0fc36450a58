import { describe, expect, it } from "vitest";
import { lagTable, referencedPPhrase } from "../../src/core";
import { jointSpanText, lagTableHeader, lagTableText, lagTableValues } from "../../src/report";
import { seriesF } from "./chartTree";

/** The table's rows: the lines that start with a lag number and a z. */
function rows(text: string): string[][] {
  return text
    .split("\n")
    .filter((l) => /^\s+\d+\s+-?\d+\.\d{2}\s/.test(l))
    .map((l) => l.trim().split(/\s+/));
}

describe("lagTableText(table)", () => {
  const table = lagTable(seriesF(), { maxLag: 10 });
  const text = lagTableText(table);

  it("leads each lag's row with z, its corridor, and its p alone and for all K lags", () => {
    expect(text).toContain("  lag       z  corridor   p one lag  p all lags   autocorr   partial");
    const found = rows(text);
    expect(found.map((r) => Number(r[0]))).toEqual(table.rows.map((r) => r.lag));
    // Series F: r_1 = −0.389878 (e-Handbook §6.4.4.9), z_1 = r_1·√70 = −3.26, beyond the
    // all-lags corridor (about ±2.6–2.8); r_2 = 0.304394, z = 2.55, between; r_3 = −0.165555,
    // z = −1.39, inside.
    expect(found[0]?.slice(0, 3)).toEqual(["1", "-3.26", "beyond"]);
    expect(found[1]?.slice(0, 3)).toEqual(["2", "2.55", "between"]);
    expect(found[2]?.slice(0, 3)).toEqual(["3", "-1.39", "inside"]);
    expect(found[0]?.slice(5)).toEqual(["-0.3899", "-0.3899"]);
  });

  it("keeps the joint test out of the rows: one line at the chosen K, then the verdict", () => {
    for (const row of rows(text)) expect(row).toHaveLength(7);
    expect(text).not.toMatch(/p\(joint\)|\bQ\b.*\bdf\b.*p\(/);
    expect(text).toContain("joint test Ljung–Box, lags 1–10: Q = 21.5915, df 10, χ² p = 0.017\n");
    expect(text).toContain(
      `  as the verdict reads it: ${referencedPPhrase(table.levels.jointP)}\n`,
    );
    expect(text).toContain(
      `corridors in z: one lag ±1.960, all 10 lags ±${table.outerLevel.toFixed(3)}`,
    );
    expect(text).toMatch(/verdict: ■ structure/);
  });
});

describe("jointSpanText(table)", () => {
  it("gives the joint test over lags 1..k, one row per k, the verdict's K marked", () => {
    const table = lagTable(seriesF(), { maxLag: 10 });
    const lines = jointSpanText(table).split("\n");
    expect(lines[0]).toBe(
      "joint test by lag span: Ljung–Box over lags 1..k (the verdict reads k = 10)",
    );
    expect(lines).toHaveLength(12);
    // Series F Ljung–Box p at k = 1, 5, 10: 0.000862, 0.000761, 0.017326, and Q at 10 = 21.59155
    // (METHODS.md, derived from the Series F data with the published formula); Q at 1 is
    // n(n+2)·r_1²/(n−1) = 70·72·0.389878²/69 = 11.10 from the printed r_1.
    expect(lines[2]?.trim().split(/\s+/)).toEqual(["1–1", "11.10", "1", "0.0009"]);
    expect(lines[6]?.trim().split(/\s+/)[3]).toBe("0.0008");
    expect(lines[11]?.trim().split(/\s+/)).toEqual([
      "1–10",
      "21.59",
      "10",
      "0.0173",
      "←",
      "verdict",
    ]);
  });

  it("shows a dash where fitted parameters leave no degrees of freedom", () => {
    const table = lagTable(seriesF(), { maxLag: 4, fittedParams: 2 });
    const lines = jointSpanText(table).split("\n");
    expect(lines[2]?.trim().split(/\s+/).slice(2)).toEqual(["—", "—"]);
  });
});

describe("lagTableHeader(table) and lagTableValues(row): SERIESLAGTABLE's columns", () => {
  it("name z, the corridor and the two p-values, with no joint test among them", () => {
    const table = lagTable(seriesF(), { maxLag: 10 });
    // The header itself is checked through the built function (test/functions/harness.test.ts).
    const header = lagTableHeader(table);
    expect(header.slice(3)).toEqual(["z", "corridor", "p (this lag)", "p (Šidák, 10 lags)"]);
    const first = table.rows[0];
    if (first === undefined) throw new Error("no lag 1");
    expect(lagTableValues(first)).toEqual([
      1,
      first.correlation,
      first.partial,
      first.z,
      "beyond",
      first.pLag,
      first.pSidak,
    ]);
  });
});

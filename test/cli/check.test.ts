import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import type { CheckJson } from "../../src/cli/json";
import { csvFile, ROOT, runCli } from "./run";

const SERIES_F = join(ROOT, "test", "fixtures", "series-f.csv");

function checkJson(args: readonly string[]): CheckJson {
  const result = runCli(["check", ...args, "--json"]);
  expect(result.stderr, `stderr of check ${args.join(" ")}`).toBe("");
  expect(result.status).toBe(0);
  return JSON.parse(result.stdout) as CheckJson;
}

function expectAbs(actual: number, expected: number, tolerance: number, what: string): void {
  const difference = Math.abs(actual - expected);
  expect(
    difference <= tolerance,
    `${what}: got ${actual}, expected ${expected}, difference ${difference}, tolerance ${tolerance}`,
  ).toBe(true);
}

describe("echolot check FILE --json", () => {
  // Printed: NIST/SEMATECH e-Handbook §6.4.4.9 (Series F autocorrelations to 9 decimals).
  const printed = [
    -0.389878319, 0.304394082, -0.165554717, 0.070719321, -0.097039288, -0.047057692, 0.035373112,
    -0.043458199, -0.004796162, 0.014393137, 0.1099172, -0.068778492,
  ];

  it("reproduces the printed Series F autocorrelations, lag 24 and variance", () => {
    const doc = checkJson([SERIES_F, "--lags", "24"]);
    expect(doc.n).toBe(70);
    expect(doc.gaps).toBe(0);
    expect(doc.lags).toHaveLength(24);
    printed.forEach((r, i) => expectAbs(doc.lags[i]!.corr, r, 5e-10, `r_${i + 1}`));
    expectAbs(doc.lags[23]!.corr, -0.073114034, 5e-10, "r_24");
    // Printed: the e-Handbook's (n−1) variance 141.8238; the JSON's variance is c0/n.
    expectAbs((doc.variance * 70) / 69, 141.8238, 5e-5, "variance (n−1)");
  });

  it("reports the derived Series F Ljung–Box Q(10) with its p", () => {
    // Derived from Series F with the published formula (METHODS.md): Q(10) = 21.59155, p 0.017326.
    const doc = checkJson([SERIES_F]);
    expect(doc.maxLag).toBe(10);
    expect(doc.joint.test).toBe("ljung-box");
    expect(doc.joint.df).toBe(10);
    expectAbs(doc.joint.q, 21.59155, 5e-5, "Q(10)");
    expectAbs(doc.joint.p, 0.017326, 5e-7, "p of Q(10)");
    expect(doc.lags[9]!.jointQ).toBe(doc.joint.q);
    expect(doc.verdict.word).toBe("structure");
  });

  it("has exactly the documented shape and types", () => {
    const doc = checkJson([SERIES_F, "--bands", "bartlett", "--alpha", "0.01"]);
    expect(typeof doc.label).toBe("string");
    expect(doc.label).toBe("yield");
    expect(doc.alpha).toBe(0.01);
    expect(doc.bandKind).toBe("bartlett");
    for (const key of ["n", "gaps", "maxLag", "mean", "variance"] as const) {
      expect(typeof doc[key], key).toBe("number");
    }
    for (const row of doc.lags) {
      expect(Object.keys(row)).toEqual(
        expect.arrayContaining(["lag", "corr", "partial", "band", "beyond", "jointQ", "jointP"]),
      );
      expect(typeof row.beyond).toBe("boolean");
      expect(row.beyond).toBe(Math.abs(row.corr) > row.band);
    }
    expect(Object.keys(doc.joint).sort()).toEqual(["df", "p", "pBound", "q", "reference", "test"]);
    expect(Object.keys(doc.falseAlarm)).toEqual(
      expect.arrayContaining(["tested", "expected", "beyond", "chance"]),
    );
    expect(["clear", "watch", "structure", "short"]).toContain(doc.verdict.word);
    expect(doc.verdict.reason).toMatch(/lags tested at 1%/);
  });

  it("prints numbers in shortest round-trip form (full precision)", () => {
    const result = runCli(["check", SERIES_F, "--json"]);
    const doc = JSON.parse(result.stdout) as CheckJson;
    const text = result.stdout;
    expect(text).toContain(String(doc.lags[0]!.corr));
    expect(String(doc.lags[0]!.corr).replace(/^-?0\./, "").length).toBeGreaterThanOrEqual(15);
  });

  it("keeps lags aligned across an interior gap (empty and NA cells)", () => {
    const file = csvFile(
      "gaps.csv",
      "when,value\n" +
        Array.from({ length: 40 }, (_, i) => {
          const v = i === 10 ? "" : i === 20 ? "NA" : String(Math.sin(i) * 3 + (i % 4));
          return `d${i},${v}`;
        }).join("\n"),
    );
    const doc = checkJson([file, "--column", "value", "--lags", "5"]);
    expect(doc.n).toBe(38);
    expect(doc.gaps).toBe(2);
  });

  it("picks a column by name or by number", () => {
    const file = csvFile(
      "two.csv",
      "a,b\n" + Array.from({ length: 30 }, (_, i) => `${i % 7},${(i * 7) % 11}`).join("\n"),
    );
    expect(checkJson([file, "--column", "b"]).label).toBe("b");
    expect(checkJson([file, "--column", "2"]).label).toBe("b");
    expect(checkJson([file]).label).toBe("a");
  });
});

describe("echolot check FILE (text)", () => {
  it("prints a readable lag table, the verdict and the screening caution", () => {
    const result = runCli(["check", SERIES_F]);
    expect(result.status).toBe(0);
    expect(result.stderr).toBe("");
    expect(result.stdout).toMatch(/yield: n = 70, gaps 0/);
    // One row per lag: lag, z, corridor, …
    const rows = result.stdout
      .split("\n")
      .filter((l) => /^\s+\d+\s+-?\d+\.\d{2}\s+(inside|between|beyond)\s/.test(l));
    expect(rows).toHaveLength(10);
    expect(result.stdout).toMatch(/verdict: ■ structure/);
    expect(result.stdout).toMatch(/statistical screen, not a decision/);
  });
});

describe("echolot demo", () => {
  it("prints a headline for every series of both scenarios, the blends ranked as a batch", () => {
    const result = runCli(["demo"]);
    expect(result.status).toBe(0);
    const header = readFileSync(
      join(ROOT, "demo", "ternpoint-roasters-forecast-errors.csv"),
      "utf8",
    )
      .split("\n")[0]!
      .split(",")
      .slice(1);
    expect(header).toHaveLength(24);
    for (const blend of header) expect(result.stdout).toContain(blend);
    expect(result.stdout).toMatch(/Larkvale/);
    // 24 ranked blends and the fund's three readings, each with its badge and p.
    expect(
      result.stdout.match(/^ {2}\S.*(●|▲|■|◌) (clear|watch|structure|short).* p = /gm)?.length,
    ).toBe(24 + 3);
    expect(result.stdout).toMatch(/headline: ● clear \(robust reading\)/);
    expect(result.stdout).toMatch(/Lantern Hill +■ structure, biased/);
  });
});

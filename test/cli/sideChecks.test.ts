/**
 * The side checks through the built CLI (build/echolot.cjs): `check --json` fields, `audit` and
 * `batch` documents and tables, their refusals, and the Ternpoint Roasters demo (invented data,
 * scripts/generate-demo.ts says which blends were made dependent or biased).
 */
import { describe, expect, it } from "vitest";
import type { CheckJson } from "../../src/cli/json";
import type { AuditDocumentJson, BatchDocumentJson } from "../../src/cli/jsonBatch";
import { runCli, csvFile } from "../cli/run";
import { expectClose } from "../helpers/expectClose";

const DEMO = "demo/ternpoint-roasters-forecast-errors.csv";
const SERIES_F = "test/fixtures/series-f.csv";
/** From scripts/generate-demo.ts: AR(1) φ 0.55 errors, and +0.6σ mean errors. */
const UNDER_REACTS = ["Copper Kettle", "Birch Parlour", "Greywell", "Wickerwork"];
const BIASED = ["Lantern Hill", "Kestrel Row"];

function json<T>(args: readonly string[]): T {
  const result = runCli(args);
  expect(result.status, `echolot ${args.join(" ")}: ${result.stderr}`).toBe(0);
  return JSON.parse(result.stdout) as T;
}

describe("echolot check --json: the side checks", () => {
  it("adds volatility, bias, runs and normality with the promised fields (Series F values derived in METHODS)", () => {
    const doc = json<CheckJson>(["check", SERIES_F, "--lags", "4", "--json"]);
    expect(Object.keys(doc.volatility ?? {})).toEqual(["lm", "df", "p", "mcleodLiQ", "mcleodLiP"]);
    expect(Object.keys(doc.bias ?? {})).toEqual(["mean", "se", "t", "p", "hacLags"]);
    expect(Object.keys(doc.runs ?? {})).toEqual(["runs", "expected", "z", "p"]);
    expect(Object.keys(doc.normality ?? {})).toEqual(["jb", "p"]);
    // Derived from series-f.csv: Engle LM q = 4, Newey–West L = 3, Jarque–Bera.
    expectClose(
      doc.volatility?.lm ?? NaN,
      5.6033,
      { abs: 5e-7 },
      "check --json volatility.lm (q 4)",
    );
    expectClose(doc.bias?.se ?? NaN, 1.127723, { abs: 5e-7 }, "check --json bias.se");
    expect(doc.bias?.hacLags).toBe(3);
    expectClose(doc.normality?.jb ?? NaN, 0.065419474, { abs: 5e-10 }, "check --json normality.jb");
  });

  it("writes null for a side check the data cannot support and says why", () => {
    const values = Array.from({ length: 40 }, (_, t) => (t % 2 === 0 ? 1 : -1));
    const file = csvFile("alternating.csv", `x\n${values.join("\n")}\n`);
    const doc = json<CheckJson>(["check", file, "--json"]);
    expect(doc.volatility).toBeNull();
    expect(doc.notComputed?.volatility).toMatch(/squared deviations/);
    expect(doc.bias).not.toBeNull();
  });
});

describe("echolot batch", () => {
  it("batch --json has one entry per numeric column and the raw and FDR counts", () => {
    const doc = json<BatchDocumentJson>(["batch", DEMO, "--json"]);
    expect(doc.series).toHaveLength(24);
    expect(Object.keys(doc.series[0] ?? {})).toEqual(
      expect.arrayContaining(["rank", "label", "n", "statistic", "df", "p", "qValue", "verdict"]),
    );
    expect(doc.series.find((s) => s.position === 1)?.label).toBe("Harbour Dawn");
    // Ranked (core/batchRanking.ts): the kept findings first, biased or under-reacting blends.
    expect([...UNDER_REACTS, ...BIASED]).toContain(doc.series[0]?.label);
    expect(doc.flaggedRaw).toBe(doc.series.filter((s) => s.p < 0.05).length);
    expect(doc.flaggedFdr).toBe(doc.series.filter((s) => s.qValue <= 0.05).length);
  });

  it("batch(demo) keeps exactly the under-reacting blends flagged under the FDR", () => {
    const doc = json<BatchDocumentJson>(["batch", DEMO, "--json"]);
    const kept = doc.series.filter((s) => s.qValue <= 0.05).map((s) => s.label);
    expect(kept.sort()).toEqual([...UNDER_REACTS].sort());
  });

  it("batch prints a ranked table, kept findings first, with the summary and the caution", () => {
    const result = runCli(["batch", DEMO]);
    expect(result.status).toBe(0);
    const rows = result.stdout.split("\n").filter((l) => /^\s*\d+ .*\s(●|▲|■|◌) /.test(l));
    expect(rows).toHaveLength(24);
    // Kept findings rank first: the two biased blends (kept bias), then the under-reacting ones.
    const labels = rows.map((l) => /^\s*\d+ (.+?)\s{2,}/.exec(l)?.[1]);
    expect(labels.slice(0, 6).sort()).toEqual([...BIASED, ...UNDER_REACTS].sort());
    expect(result.stdout).toMatch(/raw p < 0.05: \d+ of 24 series flagged/);
    expect(result.stdout).toMatch(/false-discovery rate 0.05: 4 kept \(Benjamini–Hochberg/);
    expect(result.stdout).toMatch(/statistical screen, not a decision/);
  });

  it("batch refuses a file with one numeric column", () => {
    const result = runCli(["batch", SERIES_F]);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe("");
    expect(result.stderr).toMatch(/at least 2 series/);
  });
});

describe("echolot audit", () => {
  it("audit(demo, horizon 1) calls every under-reacting and biased blend structure", () => {
    const doc = json<AuditDocumentJson>(["audit", DEMO, "--horizon", "1", "--json"]);
    expect(doc.series).toHaveLength(24);
    for (const label of [...UNDER_REACTS, ...BIASED]) {
      expect(doc.series.find((s) => s.label === label)?.verdict, label).toBe("structure");
    }
    for (const label of BIASED) {
      const entry = doc.series.find((s) => s.label === label);
      const biasP = entry !== undefined && "bias" in entry ? entry.bias.p : NaN;
      expect(biasP, `${label} bias p`).toBeLessThan(1e-6);
    }
  });

  it("audit --horizon 3 shows lags 1–2 as expected and tests from lag 3", () => {
    const result = runCli(["audit", SERIES_F, "--horizon", "3"]);
    expect(result.status).toBe(0);
    expect(result.stdout.replace(/\s+/g, " ")).toMatch(
      /lags 1–2 are expected to be non-zero, so they are not counted/,
    );
    expect(result.stdout).toMatch(/joint test of lags 3 to 12 /);
    expect(result.stdout).toMatch(/^\s+1 yield\s+70 /m);
    const reasons = runCli(["audit", SERIES_F, "--horizon", "3", "--reasons"]);
    expect(reasons.stdout.replace(/\s+/g, " ")).toMatch(
      /Lags 1–2 are expected to be non-zero for 3-step errors and are not counted; their autocorrelations: -?0\.\d+, -?0\.\d+\./,
    );
    const doc = json<AuditDocumentJson>(["audit", SERIES_F, "--horizon", "3", "--json"]);
    const first = doc.series[0];
    const audited = first !== undefined && "firstLag" in first ? first : undefined;
    expect(audited?.firstLag).toBe(3);
    expect(audited?.lags.filter((l) => !l.counted)).toHaveLength(2);
  });

  it.each([
    [["audit", SERIES_F], /needs --horizon H/],
    [["audit", SERIES_F, "--horizon", "0"], /--horizon must be a whole number from 1 to 69/],
    [["audit", SERIES_F, "--horizon", "two"], /--horizon must be a number/],
    [
      ["audit", SERIES_F, "--horizon", "1", "--bands", "robust"],
      /unknown option --bands for audit; audit takes: --horizon/,
    ],
    [["audit", "--horizon", "1"], /audit needs a CSV file/],
  ])("echolot %j is refused with exit 2 and a message", (args, message) => {
    const result = runCli(args);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe("");
    expect(result.stderr).toMatch(message);
  });
});

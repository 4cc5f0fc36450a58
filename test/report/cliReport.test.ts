import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { lagTable, seriesFromValues } from "../../src/core";
import { evidenceChartSvg, jointRibbonSvg } from "../../src/report";
import { csvFile, runCli } from "../cli/run";
import { seriesF } from "./chartTree";

const out = mkdtempSync(join(tmpdir(), "echolot-report-"));

describe("echolot report FILE.csv --out report.html", () => {
  it("writes a self-contained report holding the same chart and ribbon the pane draws", () => {
    const target = join(out, "series-f.html");
    const result = runCli(["report", "test/fixtures/series-f.csv", "--out", target]);
    expect(result.stderr).toBe("");
    expect(result.status).toBe(0);
    expect(result.stdout.trim()).toBe(`wrote ${target}: yield, ■ structure`);
    const html = readFileSync(target, "utf8");
    const table = lagTable(seriesF(), {});
    expect(html).toContain(
      evidenceChartSvg(table, {
        view: "correlation",
        width: 560,
        height: 240,
        idPrefix: "report-correlation",
      }),
    );
    expect(html).toContain(jointRibbonSvg(table, { width: 560, idPrefix: "report-ribbon" }));
    expect(html).not.toMatch(/<script|<link|<img|@import|url\(/i);
  });

  it("takes the options of check, and escapes a hostile column name", () => {
    const values = readFileSync("test/fixtures/series-f.csv", "utf8")
      .trim()
      .split(/\r?\n/)
      .slice(1);
    const file = csvFile("hostile.csv", `"<img src=x onerror=alert(1)>"\n${values.join("\n")}\n`);
    const target = join(out, "hostile.html");
    const result = runCli([
      "report",
      file,
      "--lags",
      "12",
      "--season",
      "6",
      "--bands",
      "bartlett",
      "--out",
      target,
    ]);
    expect(result.status, result.stderr).toBe(0);
    const html = readFileSync(target, "utf8");
    expect(html).not.toContain("<img");
    expect(html).toContain("&lt;img src=x onerror=alert(1)&gt;");
    expect(html).toContain("12 lags · alpha 0.05 · bartlett bands");
    const table = lagTable(
      seriesFromValues(values.map(Number), { label: "<img src=x onerror=alert(1)>" }),
      { maxLag: 12, season: 6, bandKind: "bartlett" },
    );
    expect(html).toContain(
      evidenceChartSvg(table, {
        view: "partial",
        width: 560,
        height: 240,
        idPrefix: "report-partial",
      }),
    );
  });

  it("refuses without --out, or with --json, saying what to do", () => {
    const missing = runCli(["report", "test/fixtures/series-f.csv"]);
    expect(missing.status).toBe(2);
    expect(missing.stdout).toBe("");
    expect(missing.stderr).toBe(
      "echolot: report needs --out FILE.html: where to write the report\n",
    );
    const json = runCli([
      "report",
      "test/fixtures/series-f.csv",
      "--json",
      "--out",
      join(out, "x.html"),
    ]);
    expect(json.status).toBe(2);
    expect(json.stderr).toContain("--json does not apply to report");
    const bad = runCli([
      "report",
      "test/fixtures/series-f.csv",
      "--lags",
      "99",
      "--out",
      join(out, "y.html"),
    ]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain("--lags must be a whole number from 1 to 69");
  });
});

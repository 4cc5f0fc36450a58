import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
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
    expect(result.stdout.trim().split("\n").at(-1)).toBe(
      `wrote ${target}: yield, ■ structure, biased`,
    );
    const html = readFileSync(target, "utf8");
    const table = lagTable(seriesF(), {});
    expect(html).toContain(
      evidenceChartSvg(table, { view: "correlation", width: 320, idPrefix: "report-correlation" }),
    );
    expect(html).toContain(
      jointRibbonSvg(table, { width: 320, idPrefix: "report-ribbon-correlation" }),
    );
    expect(html).not.toMatch(/<script|<link|<img|@import|url\(/i);
    // The date of making and the version in package.json, and the input by its file name only.
    const version = (JSON.parse(readFileSync("package.json", "utf8")) as { version: string })
      .version;
    expect(html).toMatch(
      new RegExp(
        `Made \\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d UTC by Echolot ${version.replace(/\./g, "\\.")} from series-f\\.csv, column “yield”\\.`,
      ),
    );
    expect(html).not.toContain("test/fixtures");
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
    expect(html).toContain("12 lags · alpha 0.05 · Bartlett bands");
    expect(html).not.toContain(dirname(file));
    const table = lagTable(
      seriesFromValues(values.map(Number), { label: "<img src=x onerror=alert(1)>" }),
      { maxLag: 12, season: 6, bandKind: "bartlett" },
    );
    expect(html).toContain(
      evidenceChartSvg(table, { view: "partial", width: 320, idPrefix: "report-partial" }),
    );
  });

  it("gives a batch report for a file with several columns of numbers, and one column's report with --column", () => {
    const rows = readFileSync("demo/ternpoint-roasters-forecast-errors.csv", "utf8")
      .trim()
      .split(/\r?\n/)
      .map((line) => line.split(",").slice(0, 5).join(","));
    const file = csvFile("four-blends.csv", `${rows.join("\n")}\n`);
    const target = join(out, "four.html");
    const result = runCli(["report", file, "--season", "13", "--out", target]);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout).toMatch(/^wrote .*four\.html: batch report of 4 columns, \d+ kept/m);
    const html = readFileSync(target, "utf8");
    expect(html).toContain("Which of these 4 series still carry a pattern");
    expect(html).toContain('<table class="figures batch">');
    expect(html.match(/<details class="item"/g)).toHaveLength(4);
    expect(html).toContain("from four-blends.csv.");
    expect(html).not.toContain(dirname(file));
    const one = join(out, "one.html");
    const single = runCli(["report", file, "--column", "Night Ferry", "--out", one]);
    expect(single.status, single.stderr).toBe(0);
    const page = readFileSync(one, "utf8");
    expect(page).toContain("<h1>Night Ferry</h1>");
    expect(page).not.toContain('<details class="item"');
  });

  it("names an unlabelled column by its place in the file, in the report and the line it prints", () => {
    // No header: column 1 counts the periods (left out as an id or time column), column 2 holds
    // the values; the series has no label, so both the report's source line and the printed
    // verdict name it "column 2", as the workbook command does. Semicolons, so "1,47" is not
    // read as a decimal comma.
    const values = readFileSync("test/fixtures/series-f.csv", "utf8")
      .trim()
      .split(/\r?\n/)
      .slice(1);
    const file = csvFile(
      "unlabelled.csv",
      `${values.map((value, i) => `${i + 1};${value}`).join("\n")}\n`,
    );
    for (const choice of [[], ["--column", "2"]]) {
      const target = join(out, `unlabelled${choice.length}.html`);
      const result = runCli(["report", file, "--no-header", ...choice, "--out", target]);
      expect(result.status, result.stderr).toBe(0);
      expect(result.stdout.trim().split("\n").at(-1)).toMatch(
        new RegExp(`^wrote ${target.replace(/[.\\/]/g, "\\$&")}: column 2, `),
      );
      expect(readFileSync(target, "utf8")).toContain("from unlabelled.csv, column “column 2”.");
    }
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
    expect(json.stderr).toContain("unknown option --json for report");
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

import { describe, expect, it } from "vitest";
import { batchCheck, lagTable, seriesFromNumbers, type Series } from "../../src/core";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";
import {
  batchReportHtml,
  reportDate,
  reportHtml,
  SCREENING_CAUTION,
  seriesReport,
  seriesReportHtml,
  ZONE_WORDS,
} from "../../src/report";
import { elements } from "./chartTree";
import { seriesF } from "./chartTree";

const MADE = new Date(Date.UTC(2026, 2, 14, 9, 5, 30));

/** The elements of an HTML report's body, read with the strict XML parser (void tags closed). */
function bodyElements(html: string) {
  const body = /<body>([\s\S]*)<\/body>/.exec(html)?.[1] ?? "";
  return elements(`<body>${body}</body>`);
}

describe("reportHtml(input)", () => {
  const series = seriesF("<img src=x onerror=alert(1)>");
  const html = reportHtml({
    table: lagTable(series, {}),
    squares: lagTable(series, { testKind: "squares" }),
    source: "f.csv, column “yield”",
    made: MADE,
    version: "9.8.7",
  });

  it("is self-contained: no script, no external resource, a CSP that allows nothing else", () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<[a-z][^>]*\s(src|href)=/i);
    expect(html.replace(/http:\/\/www\.w3\.org\/2000\/svg/g, "")).not.toMatch(/https?:\/\//);
    expect(html).toContain(`content="default-src 'none'; style-src 'unsafe-inline'"`);
  });

  it("opens with the question it answers, then the name, the date, the version and the file", () => {
    const first = bodyElements(html).find((e) => e.local === "p");
    expect(first?.attributes.class).toBe("question");
    expect(first?.text).toBe(
      "Is what is left in “<img src=x onerror=alert(1)>” noise, or does it still carry a pattern from one period to the next (lags 1–10)?",
    );
    expect(html).toContain(
      "Made 2026-03-14 09:05 UTC by Echolot 9.8.7 from f.csv, column “yield”.",
    );
    expect(reportDate(MADE)).toBe("2026-03-14 09:05 UTC");
  });

  it("holds the badge, three charts each with a diamond legend, two ribbons with keys, the explanation and the caution", () => {
    expect(html.match(/<svg[^>]*class="evidence-chart/g)).toHaveLength(3);
    // The correlation view and the squared deviations' view each carry their own joint test.
    expect(html.match(/<svg[^>]*class="joint-ribbon"/g)).toHaveLength(2);
    expect(html).toContain("Joint test Ljung–Box of lags 1…k");
    expect(html).toContain("Joint test McLeod–Li of lags 1…k");
    expect(html.match(/class="key"/g)?.length).toBeGreaterThanOrEqual(4);
    expect(html.match(/<p class="legend">/g)).toHaveLength(3);
    expect(html).toContain("between the corridors");
    expect(html).toContain('data-word="structure"');
    expect(html).toContain("would cross the band by chance");
    expect(html).toContain(SCREENING_CAUTION);
    expect(html.match(/<table class="figures">/g)).toHaveLength(3);
    expect(html.match(/<table class="figures spans">/g)).toHaveLength(2);
    expect(ZONE_WORDS.between).toContain("between the corridors");
  });

  it("escapes the label everywhere", () => {
    expect(html).not.toContain("<img");
    expect(html).toContain("<h1>&lt;img src=x onerror=alert(1)&gt;</h1>");
    expect(html).toContain("<title>Echolot report: &lt;img src=x onerror=alert(1)&gt;</title>");
  });

  it("is deterministic for the same input and date", () => {
    expect(
      reportHtml({
        table: lagTable(series, {}),
        squares: lagTable(series, { testKind: "squares" }),
        source: "f.csv, column “yield”",
        made: MADE,
        version: "9.8.7",
      }),
    ).toBe(html);
  });
});

describe("seriesReportHtml(report, meta)", () => {
  it("carries the four side checks, each with its finding", () => {
    const html = seriesReportHtml(seriesReport(seriesF(), {}), { made: MADE });
    const rows = bodyElements(html)
      .filter((e) => e.local === "table" && e.attributes.class === "side-checks")
      .flatMap((t) => t.children.flatMap((c) => c.children))
      .filter((e) => e.local === "tr");
    expect(rows.map((r) => r.children[0]?.text)).toEqual([
      "volatility",
      "bias",
      "runs",
      "normality",
    ]);
    // Series F has mean 51.1 (the yields are not centred): the bias check flags.
    expect(rows[1]?.children[1]?.text).toBe("flag");
  });
});

describe("batchReportHtml(batch, items, meta)", () => {
  const random = seededRandom(404);
  const columns: Series[] = [
    seriesFromNumbers(whiteNoise(random, 120), "Quiet Lane"),
    seriesFromNumbers(ar1(random, 120, 0.6), "Echo Hill"),
    seriesFromNumbers(new Array<number>(30).fill(4), "Flat Line"),
  ];
  const batch = batchCheck(columns, {});
  const items = columns.map((s) => {
    try {
      return seriesReport(s, {});
    } catch (error) {
      return { label: s.label, reason: (error as Error).message };
    }
  });
  const html = batchReportHtml(batch, items, {
    title: "blends.csv",
    settings: "3 columns of numbers",
    source: "blends.csv",
    made: MADE,
    version: "9.8.7",
  });

  it("opens with its question and ranks the series in the table and in the fold-outs alike", () => {
    const first = bodyElements(html).find((e) => e.local === "p");
    expect(first?.text).toBe(
      "Which of these 3 series still carry a pattern from one period to the next, and which should be looked at first?",
    );
    const summaries = bodyElements(html)
      .filter((e) => e.local === "summary" && /^\d+\. /.test(e.text))
      .map((e) => e.text.replace(/:.*/, ""));
    expect(summaries).toEqual(["1. Echo Hill", "2. Quiet Lane", "3. Flat Line"]);
    const ranked = bodyElements(html)
      .filter((e) => e.local === "th" && e.attributes.scope === "row")
      .map((e) => e.text)
      .slice(0, 3);
    expect(ranked).toEqual(["Echo Hill", "Quiet Lane", "Flat Line"]);
  });

  it("folds each analysed series' chart, ribbon and side checks under its rank, and says why one was not analysed", () => {
    const details = bodyElements(html).filter(
      (e) => e.local === "details" && e.attributes.class === "item",
    );
    expect(details).toHaveLength(3);
    expect(html.match(/<svg[^>]*class="evidence-chart/g)).toHaveLength(2);
    expect(html.match(/<table class="side-checks">/g)).toHaveLength(2);
    expect(details[2]?.children[0]?.text).toBe("3. Flat Line: not analysed");
    expect(details[2]?.children[1]?.text).toMatch(/constant|variance|same/);
    expect(html).toContain("Made 2026-03-14 09:05 UTC by Echolot 9.8.7 from blends.csv.");
  });
});
